"""Hexagon socket set screws with flat point (ISO 4026): the standard lengths per thread size.

The axle of a yo-yo is bought as a set screw that runs into both halves' threads.
Lengths are nominal, mm; each thread size is made in the lengths of the standard
series between its shortest and longest.
"""
from __future__ import annotations

__all__ = ["STANDARD", "LENGTH_SERIES", "RANGES", "standard_lengths"]

STANDARD = "ISO 4026"
#: nominal lengths of the series, mm  # ISO 4026, table of lengths (from memory)
LENGTH_SERIES: tuple[float, ...] = (2.0, 2.5, 3.0, 4.0, 5.0, 6.0, 8.0, 10.0, 12.0, 16.0, 20.0, 25.0, 30.0, 35.0,
                                    40.0, 45.0, 50.0, 55.0, 60.0)
#: (shortest, longest) length made for each metric thread, mm  # ISO 4026, table 1 (from memory)
RANGES: dict[str, tuple[float, float]] = {
    "M3x0.5": (3.0, 16.0),
    "M4x0.7": (4.0, 20.0),
    "M5x0.8": (5.0, 25.0),
}


def standard_lengths(thread: str) -> tuple[float, ...]:
    """The ISO 4026 lengths of a thread size (mm); empty for a thread the standard does not cover (inch threads).

    >>> standard_lengths("M4x0.7")
    (4.0, 5.0, 6.0, 8.0, 10.0, 12.0, 16.0, 20.0)
    """
    if thread not in RANGES:
        return ()
    low, high = RANGES[thread]
    return tuple(x for x in LENGTH_SERIES if low <= x <= high)
