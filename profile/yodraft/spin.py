"""How the assembled yo-yo spins: radius of gyration, rim-weight share, stability, descent and spin-down.

Inside, inertia is in g·mm²; physical results are reported in SI, with the unit
in each field name (1 g·mm² = 1e-9 kg·m²).

>>> from yodraft.geometry import Profile
>>> from yodraft.massprops import assemble, body_props
>>> disc = Profile.from_points([(0, 0), (5, 0), (5, 20), (0, 20)])
>>> m = spin_metrics(disc, 2.70, assemble(body_props(disc, 2.70), []), string_radius_mm=20.0)
>>> round(m.descent_acceleration_m_s2 / STANDARD_GRAVITY_M_S2, 12)  # solid disc on its rim: 2/3 g
0.666666666667
"""
from __future__ import annotations

import math
from dataclasses import dataclass
from typing import Sequence

from .geometry import Profile
from .massprops import AssemblyProps, PointPart, SectionIntegrals, clipped_section_integrals, props_from_integrals

__all__ = ["SpinMetrics", "spin_metrics", "part_izz_outside", "parts_izz_outside", "check_spin_inputs", "rpm_to_rad_s",
           "STANDARD_GRAVITY_M_S2", "KG_M2_PER_G_MM2"]

STANDARD_GRAVITY_M_S2 = 9.80665  # standard acceleration of gravity, 3rd CGPM (1901)
KG_M2_PER_G_MM2 = 1e-9  # 1 g = 1e-3 kg, 1 mm² = 1e-6 m²
N_M_PER_N_MM = 1e-3


def rpm_to_rad_s(rpm: float) -> float:
    """Spin rate in revolutions per minute as angular speed in rad/s.

    >>> round(rpm_to_rad_s(10_000), 3)
    1047.198
    """
    return rpm * 2 * math.pi / 60


@dataclass(frozen=True)
class SpinMetrics:
    """Spin figures of one assembled yo-yo at a reference spin rate.

    ``rim_share`` is the fraction of the assembled Izz carried at r ≥
    ``rim_cut_radius_mm``; ``stability_ratio`` is Izz / Ixx (above 1 the spin
    axis is the major axis); ``descent_acceleration_m_s2`` is the fall on the
    string wound at ``string_radius_mm``; ``spin_down_s`` is None without a
    drag torque.
    """

    rpm: float
    omega_rad_s: float
    mass_g: float
    izz_g_mm2: float
    izz_kg_m2: float
    ixx_g_mm2: float
    radius_of_gyration_mm: float
    outer_radius_mm: float
    rim_cut_radius_mm: float
    rim_izz_g_mm2: float
    rim_share: float
    stability_ratio: float
    string_radius_mm: float
    descent_acceleration_m_s2: float
    angular_momentum_kg_m2_per_s: float
    kinetic_energy_j: float
    drag_torque_n_mm: float | None
    spin_down_s: float | None


def part_izz_outside(part: PointPart, r_cut: float) -> float:
    """Izz of a small part carried at r ≥ ``r_cut`` (g·mm²).

    A part with ring radii is a uniform ring: the share of ∫r³ dr above the cut.
    A part without radii is taken as lying inside the cut (hub parts).

    >>> from yodraft.massprops import ring_part
    >>> round(part_izz_outside(ring_part("r", 1.0, 0.0, 10.0, 1.0, 0.0), 5.0), 9)
    46.875
    """
    if part.r_in_mm is None or part.r_out_mm is None:
        return 0.0
    r1, r2 = part.r_in_mm, part.r_out_mm
    if r_cut >= r2 or r2 <= r1:
        return part.izz_g_mm2 if r_cut <= r1 else 0.0
    lo = max(r1, r_cut)
    # uniform ring: Izz ∝ ∫ r³ dr = (r⁴)/4, mass ∝ (r²)/2
    return part.mass_g * (r2**4 - lo**4) / (2 * (r2**2 - r1**2))


def parts_izz_outside(parts: Sequence[PointPart], r_cut: float) -> float:
    """The small parts' summed Izz carried at r ≥ ``r_cut`` (g·mm²), in their order."""
    return sum(part_izz_outside(p, r_cut) for p in parts)


def check_spin_inputs(string_radius_mm: float, rpm: float, drag_torque_n_mm: float | None,
                      rim_radius_fraction: float) -> None:
    """Raise ValueError for a string radius, spin rate, drag torque or rim fraction ``spin_metrics`` cannot use."""
    if not (string_radius_mm > 0 and math.isfinite(string_radius_mm)):
        raise ValueError(f"string radius must be > 0 mm, got {string_radius_mm}")
    if not (rpm > 0 and math.isfinite(rpm)):
        raise ValueError(f"spin rate must be > 0 rpm, got {rpm}")
    if not (0 <= rim_radius_fraction < 1):
        raise ValueError(f"rim radius fraction must be in [0, 1), got {rim_radius_fraction}")
    if drag_torque_n_mm is not None and not (drag_torque_n_mm > 0 and math.isfinite(drag_torque_n_mm)):
        raise ValueError(f"drag torque must be > 0 N·mm, got {drag_torque_n_mm}")


def spin_metrics(
    profile: Profile,
    density_g_cm3: float,
    assembly: AssemblyProps,
    *,
    string_radius_mm: float,
    rpm: float = 10_000.0,
    drag_torque_n_mm: float | None = None,
    rim_radius_fraction: float = 0.8,
    rim_integrals: SectionIntegrals | None = None,
) -> SpinMetrics:
    """Spin figures of ``assembly``, whose halves are turned from ``profile``.

    ``string_radius_mm`` is where the string wraps: the bearing's outside radius.
    ``rim_integrals`` may pass in the profile's section integrals clipped at the
    rim radius when the caller already has them.
    The descent on the string is a = g / (1 + I / (m r²)); spin-down time is
    t = Izz ω₀ / τ for a steady bearing drag torque τ.
    """
    check_spin_inputs(string_radius_mm, rpm, drag_torque_n_mm, rim_radius_fraction)
    outer = profile.bounds()[3]
    r_cut = rim_radius_fraction * outer
    if rim_integrals is None:
        rim_integrals = clipped_section_integrals(profile, r_cut)
    rim_half = props_from_integrals(rim_integrals, density_g_cm3).izz_g_mm2
    rim_izz = 2 * rim_half + parts_izz_outside(assembly.parts, r_cut)
    izz, ixx, m = assembly.izz_g_mm2, assembly.ixx_g_mm2, assembly.total_g
    omega = rpm_to_rad_s(rpm)
    izz_si = izz * KG_M2_PER_G_MM2
    spin_down = None if drag_torque_n_mm is None else izz_si * omega / (drag_torque_n_mm * N_M_PER_N_MM)
    return SpinMetrics(
        rpm=rpm,
        omega_rad_s=omega,
        mass_g=m,
        izz_g_mm2=izz,
        izz_kg_m2=izz_si,
        ixx_g_mm2=ixx,
        radius_of_gyration_mm=math.sqrt(izz / m),
        outer_radius_mm=outer,
        rim_cut_radius_mm=r_cut,
        rim_izz_g_mm2=rim_izz,
        rim_share=rim_izz / izz,
        stability_ratio=izz / ixx,
        string_radius_mm=string_radius_mm,
        descent_acceleration_m_s2=STANDARD_GRAVITY_M_S2 / (1 + izz / (m * string_radius_mm**2)),
        angular_momentum_kg_m2_per_s=izz_si * omega,
        kinetic_energy_j=0.5 * izz_si * omega**2,
        drag_torque_n_mm=drag_torque_n_mm,
        spin_down_s=spin_down,
    )
