"""Spin figures checked against rigid-body textbook results."""
from __future__ import annotations

import math

import pytest

from yodraft.geometry import Profile
from yodraft.massprops import assemble, body_props, cylinder_part, ring_part
from yodraft.spin import STANDARD_GRAVITY_M_S2, part_izz_outside, rpm_to_rad_s, spin_metrics

PI = math.pi
G = 9.80665  # standard acceleration of gravity, 3rd CGPM (1901)


def rect(z0: float, z1: float, r0: float, r1: float) -> Profile:
    return Profile.from_points([(z0, r0), (z1, r0), (z1, r1), (z0, r1)])


def metrics(profile: Profile, rho: float = 2.70, parts=(), **kw):
    return spin_metrics(profile, rho, assemble(body_props(profile, rho), list(parts)), **kw)


def rel(a: float, b: float) -> float:
    return abs(a - b) / abs(b)


def test_standard_gravity_value():
    assert STANDARD_GRAVITY_M_S2 == G


def test_rpm_conversion():
    # one revolution is 2π rad; a minute is 60 s
    assert rel(rpm_to_rad_s(60.0), 2 * PI) < 1e-15
    assert rel(rpm_to_rad_s(10_000.0), 1047.1975511965977) < 1e-12


def test_solid_disc_descends_at_two_thirds_g():
    # a uniform solid cylinder unwinding from a string at its own radius falls at a = 2g/3
    # (Halliday, Resnick & Walker, Fundamentals of Physics, rolling / yo-yo section)
    m = metrics(rect(0.0, 3.0, 0.0, 25.0), string_radius_mm=25.0)
    assert rel(m.descent_acceleration_m_s2, 2 * G / 3) < 1e-12


def test_thin_hoop_descends_at_half_g():
    # a thin hoop (all mass at the string radius) falls at a = g/2 (same textbook, hoop case)
    m = metrics(rect(0.0, 3.0, 24.99, 25.0), string_radius_mm=25.0)
    assert rel(m.descent_acceleration_m_s2, G / 2) < 1e-3


def test_radius_of_gyration_of_solid_disc():
    # k = sqrt(I/m) = R/√2 for a solid disc (standard table of moments of inertia)
    m = metrics(rect(0.0, 3.0, 0.0, 25.0), string_radius_mm=5.0)
    assert rel(m.radius_of_gyration_mm, 25.0 / math.sqrt(2)) < 1e-12


def test_stability_ratio_of_disc():
    # assembled pair = solid cylinder of length 2w: Izz = ½ m R², Ixx = m/12 (3R² + (2w)²)
    radius, w = 25.0, 3.0
    m = metrics(rect(0.0, w, 0.0, radius), string_radius_mm=5.0)
    expect = (0.5 * radius**2) / ((3 * radius**2 + (2 * w) ** 2) / 12)
    assert rel(m.stability_ratio, expect) < 1e-12
    assert m.stability_ratio > 1


def test_rim_share_of_solid_disc():
    # ∫ r³ dr from 0.8R to R over ∫ r³ dr from 0 to R: 1 − 0.8⁴ (Izz of a uniform disc ∝ ∫ r³ dr)
    m = metrics(rect(0.0, 3.0, 0.0, 25.0), string_radius_mm=5.0)
    assert rel(m.rim_cut_radius_mm, 20.0) < 1e-12
    assert rel(m.rim_share, 1 - 0.8**4) < 1e-12


def test_rim_share_counts_hub_parts_in_the_total_only():
    prof = rect(0.0, 3.0, 0.0, 25.0)
    bearing = ring_part("bearing", 4.0, 3.0, 6.0, 4.0, 0.0)
    m = metrics(prof, parts=[bearing], string_radius_mm=6.0)
    body = body_props(prof, 2.70)
    # solid disc share 1 − 0.8⁴ of each half; the bearing lies inside the cut
    expect = 2 * body.izz_g_mm2 * (1 - 0.8**4) / (2 * body.izz_g_mm2 + 0.5 * 4.0 * (9 + 36))
    assert rel(m.rim_share, expect) < 1e-12


def test_part_izz_outside_a_radius():
    ring = ring_part("weight ring", 3.0, 20.0, 26.0, 2.0, 5.0)
    assert part_izz_outside(ring, 10.0) == ring.izz_g_mm2
    assert part_izz_outside(ring, 30.0) == 0.0
    # uniform annulus: share of ∫ r³ dr above c = (r2⁴ − c⁴) / (r2⁴ − r1⁴)
    assert rel(part_izz_outside(ring, 23.0), ring.izz_g_mm2 * (26**4 - 23**4) / (26**4 - 20**4)) < 1e-12
    assert part_izz_outside(cylinder_part("axle", 1.0, 2.0, 10.0), 1.0) > 0
    from yodraft.massprops import PointPart

    assert part_izz_outside(PointPart("lump", 1.0, 5.0, 1.0, 0.0), 0.5) == 0.0


def test_energy_momentum_and_spin_down():
    prof = rect(1.0, 9.0, 4.0, 27.0)
    m = metrics(prof, string_radius_mm=6.35, rpm=10_000.0, drag_torque_n_mm=0.02)
    izz = m.izz_g_mm2 * 1e-3 * 1e-6  # g → kg, mm² → m²
    omega = 10_000 * 2 * PI / 60
    # L = I ω, E = ½ I ω², t = I ω₀ / τ with τ in N·m (rigid-body rotation, any mechanics text)
    assert rel(m.izz_kg_m2, izz) < 1e-12
    assert rel(m.angular_momentum_kg_m2_per_s, izz * omega) < 1e-12
    assert rel(m.kinetic_energy_j, 0.5 * izz * omega**2) < 1e-12
    assert rel(m.spin_down_s, izz * omega / 0.02e-3) < 1e-12
    assert metrics(prof, string_radius_mm=6.35).spin_down_s is None


@pytest.mark.parametrize(
    "kw",
    [
        {"string_radius_mm": 0.0},
        {"string_radius_mm": 5.0, "rpm": -1.0},
        {"string_radius_mm": 5.0, "drag_torque_n_mm": 0.0},
        {"string_radius_mm": 5.0, "rim_radius_fraction": 1.2},
    ],
)
def test_bad_arguments_are_refused(kw):
    with pytest.raises(ValueError):
        metrics(rect(0.0, 3.0, 0.0, 25.0), **kw)
