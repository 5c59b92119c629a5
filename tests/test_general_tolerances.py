"""ISO 2768-1 general tolerances for radii and angles (the linear sizes are tested in test_stack.py)."""
from __future__ import annotations

import math

import pytest

from yodraft.tolerances.general import angle_tolerance_rad, radius_tolerance_mm


@pytest.mark.parametrize(("cls", "radius", "expected"), [
    ("ISO 2768-m", 0.8, 0.2),   # ISO 2768-1 Table 2, 0.5 up to 3 mm, f and m
    ("ISO 2768-c", 2.0, 0.4),   # Table 2, 0.5 up to 3 mm, c
    ("ISO 2768-m", 4.0, 0.5),   # Table 2, over 3 up to 6 mm
    ("ISO 2768-c", 10.0, 2.0),  # Table 2, over 6 mm
])
def test_radii(cls: str, radius: float, expected: float) -> None:
    assert radius_tolerance_mm(cls, radius) == expected


def test_a_radius_below_half_a_millimetre_has_none() -> None:
    assert radius_tolerance_mm("ISO 2768-m", 0.3) is None  # ISO 2768-1 starts at 0.5 mm


@pytest.mark.parametrize(("cls", "leg", "minutes"), [
    ("ISO 2768-m", 8.0, 60),     # ISO 2768-1 Table 3, shorter leg up to 10 mm: ±1°
    ("ISO 2768-c", 8.0, 90),     # Table 3, up to 10 mm, c: ±1°30'
    ("ISO 2768-f", 14.0, 30),    # Table 3, over 10 up to 50 mm: ±0°30'
    ("ISO 2768-m", 80.0, 20),    # Table 3, over 50 up to 120 mm: ±0°20'
    ("ISO 2768-c", 500.0, 10),   # Table 3, over 400 mm, c: ±0°10'
])
def test_angles(cls: str, leg: float, minutes: float) -> None:
    assert angle_tolerance_rad(cls, leg) == pytest.approx(math.radians(minutes / 60))
