"""Hexagon socket set screws: the standard lengths per thread size.

The axle of a yo-yo is bought as a set screw that runs into both halves' threads.
A metric thread is bought with flat point per ISO 4026, each size in the lengths of
the standard series between its shortest and longest; an inch thread (UNC, UNF) as
a hexagon socket set screw per ASME B18.3, in the fractional-inch lengths stocked.
Lengths are nominal, mm.
"""
from __future__ import annotations

from fractions import Fraction

__all__ = ["STANDARD", "INCH_STANDARD", "LENGTH_SERIES", "RANGES", "INCH_LENGTHS", "INCH_RANGES", "standard_lengths",
           "standard_of", "inch_length"]

STANDARD = "ISO 4026"
INCH_STANDARD = "ASME B18.3"
#: the inch, mm: exactly 25.4 by definition (held as a fraction, so 3/16 in is 4.7625 mm to the last digit)
_INCH = Fraction(254, 10)
#: nominal lengths of the series, mm  # ISO 4026, table of lengths (from memory)
LENGTH_SERIES: tuple[float, ...] = (2.0, 2.5, 3.0, 4.0, 5.0, 6.0, 8.0, 10.0, 12.0, 16.0, 20.0, 25.0, 30.0, 35.0,
                                    40.0, 45.0, 50.0, 55.0, 60.0)
#: (shortest, longest) length made for each metric thread, mm  # ISO 4026, table 1 (from memory)
RANGES: dict[str, tuple[float, float]] = {
    "M3x0.5": (3.0, 16.0),
    "M4x0.7": (4.0, 20.0),
    "M5x0.8": (5.0, 25.0),
}
#: fractional-inch lengths stocked for small inch set screws: sixteenths to 1/2 in, then eighths to 1 in
#: (common practice, no published source; ASME B18.3 sets the screw's form and length tolerance, not a series)
INCH_LENGTHS: tuple[Fraction, ...] = tuple(Fraction(n, 16) for n in (2, 3, 4, 5, 6, 7, 8)) + tuple(
    Fraction(n, 8) for n in (5, 6, 7, 8))
#: (shortest, longest) stocked length for each inch thread, in  # common practice, no published source
INCH_RANGES: dict[str, tuple[Fraction, Fraction]] = {
    "8-32 UNC": (Fraction(1, 8), Fraction(1)),
    "10-32 UNF": (Fraction(1, 8), Fraction(1)),
}


def standard_of(thread: str) -> str:
    """The standard a set screw of this thread is bought to: ISO 4026 for a metric thread, ASME B18.3 for an inch one.

    >>> standard_of("M4x0.7"), standard_of("10-32 UNF")
    ('ISO 4026', 'ASME B18.3')
    """
    return INCH_STANDARD if thread in INCH_RANGES else STANDARD


def standard_lengths(thread: str) -> tuple[float, ...]:
    """The lengths a set screw of this thread is bought in (mm); empty for a thread neither table covers.

    >>> standard_lengths("M4x0.7")
    (4.0, 5.0, 6.0, 8.0, 10.0, 12.0, 16.0, 20.0)
    >>> standard_lengths("10-32 UNF")[:3]
    (3.175, 4.7625, 6.35)
    """
    if thread in INCH_RANGES:
        low, high = INCH_RANGES[thread]
        return tuple(float(x * _INCH) for x in INCH_LENGTHS if low <= x <= high)
    if thread not in RANGES:
        return ()
    low_mm, high_mm = RANGES[thread]
    return tuple(x for x in LENGTH_SERIES if low_mm <= x <= high_mm)


def inch_length(length_mm: float) -> str:
    """A stocked inch length as it is ordered, e.g. 15.875 mm → "5/8 in"; 25.4 mm → "1 in".

    >>> inch_length(15.875), inch_length(25.4)
    ('5/8 in', '1 in')
    """
    fraction = min(INCH_LENGTHS, key=lambda x: abs(float(x * _INCH) - length_mm))
    return f"{fraction} in"
