"""Response pad classes: the pad's diameter and the groove it sits in."""
from __future__ import annotations

from dataclasses import dataclass

__all__ = ["PadClass", "PAD_CLASSES", "lookup_pad_class", "SILICONE_RECESS", "SiliconeRecess"]


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
    #: the pad's own thickness as moulded, and where that value comes from
    pad_thickness_mm: float = 0.0
    thickness_source: str = ""

    @property
    def groove_outer_diameter_mm(self) -> float:
        return self.pad_diameter_mm + self.squeeze_mm


PAD_CLASSES: dict[str, PadClass] = {
    p.name: p
    for p in (
        PadClass("19 mm", 19.0, 14.0, 1.3, 0.2, 1.15, "common practice, no published source",
                 1.5, "from memory; measure your pads"),
        PadClass("21 mm", 21.0, 16.0, 1.4, 0.2, 1.15, "from memory; check the pad maker's drawing",
                 1.6, "from memory; measure your pads"),
        PadClass("26 mm", 26.0, 19.5, 1.5, 0.2, 1.15, "from memory; check the pad maker's drawing",
                 1.7, "from memory; measure your pads"),
    )
}
# pad density: moulded silicone about 1.1-1.2 g/cm^3 (from memory)


@dataclass(frozen=True)
class SiliconeRecess:
    """A response recess filled flush with silicone instead of a pad: its usual sizes."""

    wall_mm: float  # metal left between the wall bore and the recess, radially
    width_mm: float  # radial width of the recess
    depth_mm: float
    density_g_cm3: float
    source: str


SILICONE_RECESS = SiliconeRecess(1.5, 3.0, 0.5, 1.1, "common practice, no published source; silicone density from memory")


def lookup_pad_class(name: str) -> PadClass:
    """A pad class by name, e.g. "19 mm" (case-insensitive, spaces optional); KeyError if unknown."""
    key = name.strip().lower().replace(" ", "")
    for p in PAD_CLASSES.values():
        if p.name.lower().replace(" ", "") == key:
            return p
    raise KeyError(name)
