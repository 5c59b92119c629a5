"""Response pad classes: the pad's diameter and the groove it sits in."""
from __future__ import annotations

from dataclasses import dataclass

__all__ = ["PadClass", "PAD_CLASSES", "lookup_pad_class"]


@dataclass(frozen=True)
class PadClass:
    """A pad class. The groove's outer diameter is the pad diameter plus ``squeeze_mm``."""

    name: str
    pad_diameter_mm: float
    groove_inner_diameter_mm: float
    groove_depth_mm: float
    squeeze_mm: float
    pad_density_g_cm3: float
    source: str

    @property
    def groove_outer_diameter_mm(self) -> float:
        return self.pad_diameter_mm + self.squeeze_mm


PAD_CLASSES: dict[str, PadClass] = {
    p.name: p
    for p in (
        PadClass("19 mm", 19.0, 14.0, 1.3, 0.2, 1.15, "common practice, no published source"),
        PadClass("21 mm", 21.0, 16.0, 1.4, 0.2, 1.15, "from memory; check the pad maker's drawing"),
        PadClass("26 mm", 26.0, 19.5, 1.5, 0.2, 1.15, "from memory; check the pad maker's drawing"),
    )
}
# pad density: moulded silicone about 1.1-1.2 g/cm^3 (from memory)


def lookup_pad_class(name: str) -> PadClass:
    """A pad class by name, e.g. "19 mm" (case-insensitive, spaces optional); KeyError if unknown."""
    key = name.strip().lower().replace(" ", "")
    for p in PAD_CLASSES.values():
        if p.name.lower().replace(" ", "") == key:
            return p
    raise KeyError(name)
