"""Lamé's thick-walled cylinders for a press fit of two materials, against a textbook worked example,
the single-material closed form, Hooke's law at the interface and hand arithmetic."""
from __future__ import annotations

import math

import pytest

from yodraft.pressfit import (Member, assembly_delta_t_k, bore_change_mm, contact_pressure, fit_stresses, holding_force_n,
                              holding_torque_n_mm, thermal_change_mm, von_mises)

STEEL_E = 207e3  # MPa, the steel modulus the textbook example uses


def test_textbook_shrink_fit_of_two_steel_tubes() -> None:
    # Shigley's Mechanical Engineering Design (Budynas & Nisbett), 9th ed., Example 3-14 (from memory):
    # steel tubes of nominal diameters 40, 45 and 50 mm, diametral interference 0.062 mm, E = 207 GPa.
    # Answers: p = 15.8 MPa; hoop stress −134.8 MPa at the inner tube's outside, 150.5 MPa at the outer tube's
    # bore; −150.6 MPa at the inner tube's bore and 134.7 MPa at the outer tube's outside.
    inner = Member(40.0, 45.0, STEEL_E, 0.3, 12e-6, 400.0)
    outer = Member(45.0, 50.0, STEEL_E, 0.3, 12e-6, 400.0)
    p = contact_pressure(0.062, inner, outer)
    s = fit_stresses(p, inner, outer)
    assert p == pytest.approx(15.8, rel=0.005)
    assert s.inner_interface.hoop_mpa == pytest.approx(-134.8, rel=0.005)
    assert s.outer_interface.hoop_mpa == pytest.approx(150.5, rel=0.005)
    assert s.inner_bore.hoop_mpa == pytest.approx(-150.6, rel=0.005)
    assert s.outer_outside.hoop_mpa == pytest.approx(134.7, rel=0.005)
    assert s.inner_interface.radial_mpa == s.outer_interface.radial_mpa == -p  # equilibrium at the interface


@pytest.mark.parametrize("ri, R, ro", [(0.0, 10.0, 20.0), (20.0, 22.5, 25.0), (10.0, 25.0, 28.0), (24.5, 26.0, 35.0)])
def test_equal_materials_match_the_single_material_closed_form(ri: float, R: float, ro: float) -> None:
    # same E and ν: p = E δ / (2 R³) · (ro² − R²)(R² − ri²) / (ro² − ri²), δ radial
    # (Shigley's Mechanical Engineering Design, sec. 3-16, eq. 3-57)
    E, delta_radial = 200e3, 0.02
    closed = E * delta_radial / (2 * R**3) * (ro**2 - R**2) * (R**2 - ri**2) / (ro**2 - ri**2)
    p = contact_pressure(2 * delta_radial, Member(2 * ri, 2 * R, E, 0.29, 1e-5, 1.0),
                         Member(2 * R, 2 * ro, E, 0.29, 1e-5, 1.0))
    assert p == pytest.approx(closed, rel=1e-12)


def test_two_materials_close_the_gap_by_hookes_law() -> None:
    # the outer member's bore grows and the inner member's outside shrinks by the radial displacements
    # u = R/E (σ_t − ν σ_r) (plane stress, Hooke's law); together they take up the interference
    ring = Member(47.0, 51.0, 97e3, 0.31, 20.5e-6, 310.0)  # brass ring inside
    body = Member(51.0, 56.0, 68.9e3, 0.33, 23.6e-6, 276.0)  # aluminium rim outside
    delta = 0.060
    p = contact_pressure(delta, ring, body)
    s = fit_stresses(p, ring, body)
    R = 25.5
    u_out = R / body.e_mpa * (s.outer_interface.hoop_mpa - body.poisson * s.outer_interface.radial_mpa)
    u_in = R / ring.e_mpa * (s.inner_interface.hoop_mpa - ring.poisson * s.inner_interface.radial_mpa)
    assert u_out - u_in == pytest.approx(delta / 2, rel=1e-12)


def test_lame_stresses_are_one_field_per_member() -> None:
    # σ_t + σ_r is the same at both surfaces of a Lamé cylinder (2A in σ = A ± B/r²)
    inner, outer = Member(20.0, 30.0, 110e3, 0.34, 9e-6, 800.0), Member(30.0, 44.0, 70e3, 0.33, 23e-6, 270.0)
    s = fit_stresses(40.0, inner, outer)
    assert s.inner_bore.hoop_mpa + s.inner_bore.radial_mpa == pytest.approx(
        s.inner_interface.hoop_mpa + s.inner_interface.radial_mpa, rel=1e-12)
    assert s.outer_outside.hoop_mpa + s.outer_outside.radial_mpa == pytest.approx(
        s.outer_interface.hoop_mpa + s.outer_interface.radial_mpa, rel=1e-12)


def test_solid_inner_member_is_at_uniform_pressure() -> None:
    # a solid shaft in a press fit: σ_t = σ_r = −p throughout (Shigley, sec. 3-16)
    s = fit_stresses(30.0, Member(0.0, 20.0, 200e3, 0.3, 1e-5, 1.0), Member(20.0, 40.0, 200e3, 0.3, 1e-5, 1.0))
    assert (s.inner_bore.hoop_mpa, s.inner_bore.radial_mpa) == (-30.0, -30.0)
    assert s.inner_interface.hoop_mpa == pytest.approx(-30.0, rel=1e-12)


def test_von_mises_of_plane_stress() -> None:
    # σ' = √(σ₁² − σ₁σ₂ + σ₂²) (Shigley, sec. 5-5); equal and opposite stresses give √3 σ
    assert von_mises(100.0, -100.0) == pytest.approx(100.0 * math.sqrt(3), rel=1e-15)
    assert von_mises(80.0, 80.0) == pytest.approx(80.0, rel=1e-15)


def test_thermal_change_by_hand() -> None:
    # hand arithmetic: a 304 ring (17.3e-6/K) inside 6061 (23.6e-6/K) at Ø50 mm, 20 → 60 °C:
    # Δδ = 50 mm × (17.3 − 23.6)e-6/K × 40 K = −0.0126 mm; at −20 °C the same size the other way
    ring, body = Member(46, 50, 193e3, 0.29, 17.3e-6, 215), Member(50, 56, 68.9e3, 0.33, 23.6e-6, 276)
    assert thermal_change_mm(50.0, ring, body, 60.0) == pytest.approx(-0.0126, rel=1e-12)
    assert thermal_change_mm(50.0, ring, body, -20.0) == pytest.approx(+0.0126, rel=1e-12)
    assert thermal_change_mm(50.0, ring, body, 20.0) == 0.0


def test_assembly_temperature_by_hand() -> None:
    # hand arithmetic: heat a 6061 body (23.6e-6/K) to open Ø50 by 0.075 + 0.020 mm: 0.095 / (23.6e-6 × 50) = 80.5 K
    body = Member(50, 56, 68.9e3, 0.33, 23.6e-6, 276)
    assert assembly_delta_t_k(0.075, 0.020, 50.0, body) == pytest.approx(0.095 / (23.6e-6 * 50.0), rel=1e-12)
    assert assembly_delta_t_k(0.075, 0.020, 50.0, body) == pytest.approx(80.5, abs=0.05)


def test_holding_force_and_torque_by_hand() -> None:
    # F = μ p π d L and T = F d / 2 (Shigley, sec. 3-16): 0.15 × 10 MPa × π × 50 mm × 4 mm = 942.5 N
    assert holding_force_n(10.0, 0.15, 50.0, 4.0) == pytest.approx(942.4778, rel=1e-6)
    assert holding_torque_n_mm(10.0, 0.15, 50.0, 4.0) == pytest.approx(942.4778 * 25.0, rel=1e-6)


def test_members_must_meet() -> None:
    with pytest.raises(ValueError):
        contact_pressure(0.05, Member(40, 45, 1e5, 0.3, 1e-5, 1), Member(46, 50, 1e5, 0.3, 1e-5, 1))


def test_bore_of_a_thick_ring_under_external_pressure_by_hand() -> None:
    # Lamé's thick-walled cylinder under uniform external pressure q, inner radius a, outer b, free ends:
    # the bore moves Δa = −2 q b² a / (E (b² − a²)) (Roark's Formulas for Stress and Strain, thick-walled
    # cylinder table, uniform external pressure; from memory). Hand arithmetic for a = 25, b = 27 mm,
    # q = 3 MPa, E = 100 GPa: Δa = −2·3·729·25 / (100000·104) = −0.0105144 mm, so Δd = −0.0210288 mm
    ring = Member(50.0, 54.0, 100e3, 0.3, 20e-6, 300.0)
    assert bore_change_mm(3.0, ring) == pytest.approx(-2 * 3 * 729 * 25 / (100000 * 104) * 2, rel=1e-12)
    assert bore_change_mm(3.0, ring) == pytest.approx(-0.0210288, abs=1e-7)
    # and it is Hooke's law at the free bore (σ_r = σ_z = 0): Δd = d_i σ_t / E with Lamé's hoop stress there
    hoop = fit_stresses(3.0, ring, Member(54.0, 56.0, 70e3, 0.33, 23e-6, 276.0)).inner_bore.hoop_mpa
    assert bore_change_mm(3.0, ring) == pytest.approx(50.0 * hoop / 100e3, rel=1e-12)
    assert bore_change_mm(3.0, Member(0.0, 54.0, 100e3, 0.3, 20e-6, 300.0)) == 0.0  # a solid member has no bore
