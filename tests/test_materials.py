"""Catalogued densities against published handbook and datasheet values, within 1 %."""
from __future__ import annotations

import pytest

import yodraft
from yodraft.analysis import analyse
from yodraft.catalog.materials import MATERIALS, lookup_material
from yodraft.tomledit import set_key

PUBLISHED = {  # g/cm³
    "6061-T6": 2.70,      # ASM Handbook Vol. 2, aluminium 6061 (from memory)
    "7075-T6": 2.81,      # ASM Handbook Vol. 2, aluminium 7075 (from memory)
    "7068-T6511": 2.85,   # producer's 7068 datasheet (from memory)
    "Ti-6Al-4V": 4.43,    # ASM Materials Properties Handbook: Titanium Alloys (from memory)
    "304": 8.00,          # ASM Handbook Vol. 1, 304 stainless (from memory)
    "C36000": 8.50,       # Copper Development Association, C36000 (from memory)
    "POM": 1.41,          # acetal homopolymer datasheets (from memory)
    "PC": 1.20,           # polycarbonate datasheets (from memory)
    "W90": 17.0,          # ASTM B777 Class 1, 16.85–17.25 g/cm³ (from memory)
}

#: (E GPa, ν, α 1e-6/K, yield MPa), each within 5 %
ELASTIC = {
    "6061-T6": (68.9, 0.33, 23.6, 276),     # ASM Handbook Vol. 2, 6061-T6 (from memory)
    "7075-T6": (71.7, 0.33, 23.6, 503),     # ASM Handbook Vol. 2, 7075-T6 (from memory)
    "Ti-6Al-4V": (113.8, 0.342, 8.6, 880),  # ASM Titanium Alloys handbook, annealed (from memory)
    "304": (193, 0.29, 17.3, 215),          # ASM Handbook Vol. 1, annealed 304 (from memory)
    "C36000": (97, 0.31, 20.5, 310),        # Copper Development Association, half-hard rod (from memory)
    "W90": (310, 0.28, 4.6, 517),           # ASTM B777 Class 1 minimum yield 75 ksi (from memory)
}


@pytest.mark.parametrize("name", sorted(PUBLISHED))
def test_density_within_one_percent(name: str) -> None:
    assert lookup_material(name).density_g_cm3 == pytest.approx(PUBLISHED[name], rel=0.01)
    assert MATERIALS[name].source


def test_mass_scales_with_density(string_trick_text: str) -> None:
    # both uncoated: a coating's thickness scatter moves the seat's drawn (mid) size
    bare = set_key(string_trick_text, "shop", "coating", "none")
    aluminium = analyse(yodraft.build(yodraft.loads(bare))).half
    brass_text = set_key(bare, "design", "material", "C36000")
    brass = analyse(yodraft.build(yodraft.loads(brass_text))).half
    # same volume, so m = ρ V  (definition of density)
    assert brass.mass_g / aluminium.mass_g == pytest.approx(8.50 / 2.70, rel=1e-12)


def test_density_override(string_trick_text: str) -> None:
    text = set_key(string_trick_text, "design", "density", "2.5 g/cm^3")
    resolved = yodraft.build(yodraft.loads(text))
    assert resolved["material.density_g_cm3"] == 2.5


@pytest.mark.parametrize("name", sorted(ELASTIC))
def test_elastic_and_thermal_properties(name: str) -> None:
    e, nu, alpha, yield_mpa = ELASTIC[name]
    m = lookup_material(name)
    assert (m.e_gpa, m.poisson, m.alpha_per_k * 1e6, m.yield_mpa) == pytest.approx((e, nu, alpha, yield_mpa), rel=0.05)
    assert m.properties_source


def test_every_material_has_a_family_and_sources() -> None:
    for m in MATERIALS.values():
        assert m.source and m.properties_source
        # an isotropic solid has -1 < ν < 0.5 (theory of elasticity); metals and polymers lie in 0.25–0.4
        assert 0.25 <= m.poisson <= 0.4
