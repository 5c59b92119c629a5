"""Materials: density, the thread engagement a tapped hole needs, and the elastic and thermal
properties a press fit is worked out with (Young's modulus, Poisson's ratio, expansion, yield)."""
from __future__ import annotations

from dataclasses import dataclass

__all__ = ["Material", "MATERIALS", "FAMILIES", "lookup_material"]

#: the material families the finish rules (catalog.finishes) are written for
FAMILIES = ("aluminium alloy", "titanium alloy", "stainless steel", "copper alloy", "tungsten alloy", "polymer")


@dataclass(frozen=True)
class Material:
    """A body or ring material. ``engagement_factor`` × thread diameter is the least full-thread depth.

    ``e_gpa`` Young's modulus, ``poisson`` Poisson's ratio, ``alpha_per_k`` the linear thermal
    expansion coefficient near room temperature, ``yield_mpa`` the 0.2 % proof (yield) strength
    in tension; ``properties_source`` says where those four come from. ``designation`` is the
    material's standard designation (written on the sheet beside the trade name), with its source.
    """

    name: str
    family: str
    density_g_cm3: float
    engagement_factor: float
    source: str
    e_gpa: float
    poisson: float
    alpha_per_k: float
    yield_mpa: float
    properties_source: str
    designation: str = ""
    designation_source: str = ""

    def __post_init__(self) -> None:
        if self.family not in FAMILIES:
            raise ValueError(f"material {self.name!r}: unknown family {self.family!r}")
        if not (self.e_gpa > 0 and 0 < self.poisson < 0.5 and self.alpha_per_k > 0 and self.yield_mpa > 0):
            raise ValueError(f"material {self.name!r}: elastic and thermal properties out of range")


MATERIALS: dict[str, Material] = {
    m.name: m
    for m in (
        Material("6061-T6", "aluminium alloy", 2.70, 1.5, "ASM Handbook Vol. 2, wrought aluminium 6061 (from memory)",
                 68.9, 0.33, 23.6e-6, 276.0, "ASM Handbook Vol. 2, 6061-T6 typical properties (from memory)",
                 "EN AW-6061-T6", "EN 573-3 (alloy), EN 515 (temper) (from memory)"),
        Material("7075-T6", "aluminium alloy", 2.81, 1.5, "ASM Handbook Vol. 2, wrought aluminium 7075 (from memory)",
                 71.7, 0.33, 23.6e-6, 503.0, "ASM Handbook Vol. 2, 7075-T6 typical properties (from memory)",
                 "EN AW-7075-T6", "EN 573-3 (alloy), EN 515 (temper) (from memory)"),
        Material("7068-T6511", "aluminium alloy", 2.85, 1.5, "aluminium producer's 7068 extrusion datasheet (from memory)",
                 73.1, 0.32, 23.4e-6, 683.0, "aluminium producer's 7068-T6511 datasheet, typical values (from memory)",
                 "AA 7068-T6511", "Aluminum Association international alloy registration (from memory)"),
        Material("Ti-6Al-4V", "titanium alloy", 4.43, 1.0, "ASM Materials Properties Handbook: Titanium Alloys (from memory)",
                 113.8, 0.342, 8.6e-6, 880.0, "ASM Materials Properties Handbook: Titanium Alloys, annealed Ti-6Al-4V (from memory)",
                 "Ti-6Al-4V, ASTM B348 Grade 5", "ASTM B348 (from memory)"),
        Material("304", "stainless steel", 8.00, 1.0, "ASM Handbook Vol. 1, austenitic stainless 304 (from memory)",
                 193.0, 0.29, 17.3e-6, 215.0, "ASM Handbook Vol. 1, annealed 304; ASTM A276 minimum yield 205 MPa (from memory)",
                 "X5CrNi18-10 (1.4301)", "EN 10088-3 (from memory)"),
        Material("C36000", "copper alloy", 8.50, 1.0, "Copper Development Association data for free-cutting brass C36000 (from memory)",
                 97.0, 0.31, 20.5e-6, 310.0, "Copper Development Association, C36000 half-hard rod (from memory)",
                 "CuZn36Pb3 (CW603N)", "EN 12164; nearest European grade to UNS C36000 (from memory)"),
        Material("W90", "tungsten alloy", 17.0, 1.0, "ASTM B777 Class 1 tungsten heavy alloy, 16.85–17.25 g/cm³ (from memory)",
                 310.0, 0.28, 4.6e-6, 517.0, "ASTM B777 Class 1: minimum yield 75 ksi; modulus and expansion from makers' datasheets (from memory)",
                 "W-Ni-Fe 90 %, ASTM B777 Class 1", "ASTM B777 (from memory)"),
        Material("POM", "polymer", 1.41, 2.0, "acetal copolymer 1.41 g/cm3, homopolymer 1.42 g/cm3 (from memory)",
                 3.1, 0.35, 110e-6, 70.0, "typical acetal homopolymer datasheet, tensile yield at 23 °C (from memory)",
                 "POM", "ISO 1043-1 symbol (from memory)"),
        Material("PC", "polymer", 1.20, 2.0, "typical polycarbonate datasheet (from memory)",
                 2.35, 0.37, 68e-6, 62.0, "typical polycarbonate datasheet, tensile yield at 23 °C (from memory)",
                 "PC", "ISO 1043-1 symbol (from memory)"),
    )
}
# engagement factors: 1.5 x D in aluminium (common practice, no published source); 1.0 x D in
# steels, titanium, brass and tungsten alloy and 2.0 x D in plastics (common practice, no published source)


def lookup_material(name: str) -> Material:
    """A material by name (case-insensitive); KeyError if unknown."""
    for key, m in MATERIALS.items():
        if key.lower() == name.strip().lower():
            return m
    raise KeyError(name)
