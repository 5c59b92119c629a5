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
}


@pytest.mark.parametrize("name", sorted(PUBLISHED))
def test_density_within_one_percent(name: str) -> None:
    assert lookup_material(name).density_g_cm3 == pytest.approx(PUBLISHED[name], rel=0.01)
    assert MATERIALS[name].source


def test_mass_scales_with_density(string_trick_text: str) -> None:
    aluminium = analyse(yodraft.build(yodraft.loads(string_trick_text))).half
    brass_text = set_key(string_trick_text, "design", "material", "C36000")
    brass = analyse(yodraft.build(yodraft.loads(brass_text))).half
    # same volume, so m = ρ V  (definition of density)
    assert brass.mass_g / aluminium.mass_g == pytest.approx(8.50 / 2.70, rel=1e-12)


def test_density_override(string_trick_text: str) -> None:
    text = set_key(string_trick_text, "design", "density", "2.5 g/cm^3")
    resolved = yodraft.build(yodraft.loads(text))
    assert resolved["material.density_g_cm3"] == 2.5
