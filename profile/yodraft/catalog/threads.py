"""Axle threads: major diameter, pitch, tap drill and the nut thread's basic minor diameter."""
from __future__ import annotations

from dataclasses import dataclass

from ..units import MM_PER_INCH as IN

__all__ = ["Thread", "THREADS", "lookup_thread"]


@dataclass(frozen=True)
class Thread:
    """An internal (tapped) thread for the axle. Lengths in mm."""

    name: str
    major_mm: float
    pitch_mm: float
    tap_drill_mm: float
    tolerance_class: str
    source: str
    #: the tap drill's number size where it is bought by one (an inch drill, e.g. "#21"); "" for a drill bought by its diameter
    drill_size: str = ""

    @property
    def metric(self) -> bool:
        """An ISO metric thread (designated "M<diameter>×<pitch>"), not an inch one."""
        return self.name.startswith("M")

    @property
    def minor_mm(self) -> float:
        """Basic minor diameter of the nut thread, D1 = D − 1.082532 P (ISO 724)."""
        return self.major_mm - 1.082532 * self.pitch_mm


def _metric(d: float, p: float) -> Thread:
    return Thread(f"M{d:g}x{p:g}", d, p, round(d - p, 2), "6H",
                  "ISO 261 coarse series; tap drill D - P as in ISO 2306; class 6H per ISO 965-1")


THREADS: dict[str, Thread] = {
    t.name: t
    for t in (
        _metric(3, 0.5),
        _metric(4, 0.7),
        _metric(5, 0.8),
        Thread("8-32 UNC", 0.164 * IN, IN / 32, 0.1360 * IN, "2B", "ASME B1.1 (from memory); tap drill #29 (from memory)",
               "#29"),
        Thread("10-32 UNF", 0.190 * IN, IN / 32, 0.1590 * IN, "2B", "ASME B1.1 (from memory); tap drill #21 (from memory)",
               "#21"),
    )
}


def lookup_thread(name: str) -> Thread:
    """A thread by name, e.g. "M4x0.7" or "M4×0.7" (case-insensitive); KeyError if unknown."""
    key = name.strip().lower().replace("×", "x").replace(" ", "")
    for t in THREADS.values():
        if t.name.lower().replace(" ", "") == key:
            return t
    raise KeyError(name)
