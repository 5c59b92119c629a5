"""Balance figures checked against the ISO 21940-11 definition G = e_per · Ω."""
from __future__ import annotations

import math

import pytest

from yodraft.balance import balance, floor_to_step, permissible_specific_unbalance_mm
from yodraft.geometry import Profile
from yodraft.massprops import body_props

PI = math.pi


def rect(z0: float, z1: float, r0: float, r1: float) -> Profile:
    return Profile.from_points([(z0, r0), (z1, r0), (z1, r1), (z0, r1)])


def rel(a: float, b: float) -> float:
    return abs(a - b) / abs(b)


@pytest.mark.parametrize(
    ("grade", "rpm", "e_um"),
    [
        (6.3, 10_000, 6.3 / (10_000 * 2 * PI / 60) * 1000),  # ISO 21940-11: e_per = G / Ω → 6.016 µm
        (2.5, 3_000, 2.5 / (3_000 * 2 * PI / 60) * 1000),  # ISO 21940-11: → 7.958 µm
        (1.0, 60_000, 1.0 / (60_000 * 2 * PI / 60) * 1000),  # ISO 21940-11: → 0.159 µm
    ],
)
def test_specific_unbalance_is_grade_over_angular_speed(grade, rpm, e_um):
    assert rel(permissible_specific_unbalance_mm(grade, rpm) * 1000, e_um) < 1e-12


def test_grade_63_at_10000_rpm_rounded():
    # G 6.3 at 10,000 rpm: 6.3 mm/s / 1047.2 rad/s = 6.016 µm (ISO 21940-11 definition, hand computed)
    assert round(permissible_specific_unbalance_mm(6.3, 10_000) * 1000, 3) == 6.016


def test_balance_of_a_half():
    prof = rect(1.5, 20.0, 4.0, 28.0)
    rho = 2.70
    res = balance(prof, rho, grade_mm_s=6.3, rpm=10_000)
    m = body_props(prof, rho).mass_g
    e = 6.3 / (10_000 * 2 * PI / 60)  # mm, ISO 21940-11
    assert rel(res.half_mass_g, m) < 1e-12
    assert rel(res.permissible_specific_unbalance_um, e * 1000) < 1e-12
    assert rel(res.permissible_unbalance_g_mm, m * e) < 1e-12  # U_per = m e_per (ISO 21940-11)
    # runout (TIR) of an eccentric turned surface is 2e; 2 × 6.016 µm = 12.03 µm → 0.012 mm
    assert res.runout_tolerance_mm == 0.012
    assert res.runout_mm == 0.012
    assert rel(res.unbalance_from_runout_g_mm, m * 0.012 / 2) < 1e-12
    assert res.within_grade


def test_rim_band_unbalance_from_runout():
    prof = rect(1.5, 20.0, 4.0, 28.0)
    rho = 2.70
    res = balance(prof, rho, runout_mm=0.05, rim_radius_fraction=0.8)
    # rim band: hollow cylinder from 0.8 × 28 = 22.4 to 28 mm, V = π (r2² − r1²) L
    band = rho * 1e-3 * PI * (28.0**2 - 22.4**2) * 18.5
    assert rel(res.rim_cut_radius_mm, 22.4) < 1e-12
    assert rel(res.rim_band_mass_g, band) < 1e-12
    assert rel(res.rim_unbalance_from_runout_g_mm, band * 0.05 / 2) < 1e-12
    assert not res.within_grade  # 0.05 mm TIR is four times what G 6.3 allows at 10,000 rpm


def test_floor_to_step():
    assert floor_to_step(0.012033, 0.001) == 0.012
    assert floor_to_step(0.012, 0.001) == 0.012  # exact multiples stay
    assert floor_to_step(0.0129, 0.002) == 0.012
    with pytest.raises(ValueError):
        floor_to_step(0.01, 0.0)


@pytest.mark.parametrize("kw", [{"grade_mm_s": 0.0}, {"rpm": 0.0}, {"runout_mm": -0.01}, {"rim_radius_fraction": 1.0}])
def test_bad_arguments_are_refused(kw):
    with pytest.raises(ValueError):
        balance(rect(0.0, 1.0, 1.0, 2.0), 2.70, **kw)
