"""Body materials: density and the thread engagement a tapped hole needs in it."""
from __future__ import annotations

from dataclasses import dataclass

__all__ = ["Material", "MATERIALS", "lookup_material"]


@dataclass(frozen=True)
class Material:
    """A body material. ``engagement_factor`` × thread diameter is the least full-thread depth."""

    name: str
    density_g_cm3: float
    engagement_factor: float
    source: str


MATERIALS: dict[str, Material] = {
    m.name: m
    for m in (
        Material("6061-T6", 2.70, 1.5, "ASM Handbook Vol. 2, wrought aluminium 6061 (from memory)"),
        Material("7075-T6", 2.81, 1.5, "ASM Handbook Vol. 2, wrought aluminium 7075 (from memory)"),
        Material("7068-T6511", 2.85, 1.5, "aluminium producer's 7068 extrusion datasheet (from memory)"),
        Material("Ti-6Al-4V", 4.43, 1.0, "ASM Materials Properties Handbook: Titanium Alloys (from memory)"),
        Material("304", 8.00, 1.0, "ASM Handbook Vol. 1, austenitic stainless 304 (from memory)"),
        Material("C36000", 8.50, 1.0, "Copper Development Association data for free-cutting brass C36000 (from memory)"),
        Material("POM", 1.41, 2.0, "typical acetal homopolymer datasheet (from memory)"),
        Material("PC", 1.20, 2.0, "typical polycarbonate datasheet (from memory)"),
    )
}
# engagement factors: 1.5 x D in aluminium (common practice, no published source); 1.0 x D in
# steels, titanium and brass and 2.0 x D in plastics (common practice, no published source)


def lookup_material(name: str) -> Material:
    """A material by name (case-insensitive); KeyError if unknown."""
    for key, m in MATERIALS.items():
        if key.lower() == name.strip().lower():
            return m
    raise KeyError(name)
