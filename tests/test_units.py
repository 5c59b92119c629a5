"""Units at the edge: the common-unit table gives pint's own answers, and pint reads everything else."""
from __future__ import annotations

import math
import random

import pytest

from yodraft.units import COMMON_UNITS, KINDS, UnitError, parse_quantity, registry

ROWS = [(kind, unit) for kind, units in COMMON_UNITS.items() for unit in units]


def _through_pint(number: float, unit: str, kind: str) -> float:
    ureg = registry()
    return float(ureg.Quantity(number, ureg.parse_units(unit)).to(KINDS[kind][0]).magnitude)


@pytest.mark.parametrize(("kind", "unit"), ROWS)
def test_every_common_unit_is_pints_answer(kind: str, unit: str) -> None:
    """Each table row converts exactly as pint does with our units.txt (the reference), for many numbers."""
    rng = random.Random(7)
    numbers = [0.0, 1.0, -2.5, 0.1, 12.7, 1e-6, 3e5] + [rng.uniform(-1000, 1000) for _ in range(200)]
    for x in numbers:
        assert parse_quantity(f"{x!r} {unit}", kind) == _through_pint(x, unit, kind), (x, unit)


def test_table_agrees_with_published_definitions() -> None:
    assert COMMON_UNITS["length"]["in"] == 25.4  # international yard and pound agreement, 1959: 1 in = 25.4 mm
    assert COMMON_UNITS["mass"]["lb"] == 453.59237  # same agreement: 1 lb = 0.45359237 kg
    assert COMMON_UNITS["angle"]["deg"] == math.pi / 180  # SI Brochure, 9th ed., table 8: 1° = (π/180) rad
    assert COMMON_UNITS["speed"]["Hz"] == 60.0  # as a spin rate, 1 rev/s = 60 rev/min


@pytest.mark.parametrize(("text", "kind", "value"), [
    ("10 N * mm", "torque", 10.0), ("2.7 g / cm^3", "density", 2.7), ("0.8 µm", "roughness", 0.8),
    ("0.8 μm", "roughness", 0.8), ("90 °", "angle", math.pi / 2),
])
def test_spaces_and_symbols_reach_the_table(text: str, kind: str, value: float) -> None:
    assert parse_quantity(text, kind) == pytest.approx(value, rel=1e-15)


@pytest.mark.parametrize(("text", "kind", "value"), [
    ("140 degF", "temperature", 60.0),  # (140 − 32) × 5/9 °C, definition of the Fahrenheit scale
    ("333.15 K", "temperature", 60.0),  # 0 °C = 273.15 K (SI Brochure, 9th ed.)
    ("1 ft", "length", 304.8),  # 12 in
    ("1 kg/m^3", "density", 0.001),
])
def test_units_off_the_table_go_through_pint(text: str, kind: str, value: float) -> None:
    assert parse_quantity(text, kind) == pytest.approx(value, rel=1e-12)


@pytest.mark.parametrize(("text", "kind", "words"), [
    ("5 g", "length", "not a unit of length"), ("1e308 kg", "mass", "not a finite number"),
    ("20 degC", "temperature_difference", "temperature scale"), ("0.5 mm/mm", "angle", "not a unit of angle"),
])
def test_wrong_units_still_refused(text: str, kind: str, words: str) -> None:
    with pytest.raises(UnitError, match=words):
        parse_quantity(text, kind)
