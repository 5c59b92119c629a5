"""Balance of a turned half by ISO 21940-11 quality grades, and the runout that grade allows.

A grade G (mm/s) sets the permissible specific unbalance e_per = G / Ω at the
service spin rate Ω (rad/s); the permissible residual unbalance of a body of
mass m is U_per = m · e_per. A half turned with its surfaces offset by e from
the axle axis has its mass centre offset by e and shows a total indicator
reading (circular runout) of 2e, so a runout t causes U = m · t / 2, and the
runout that keeps within the grade is 2 · e_per.

>>> round(permissible_specific_unbalance_mm(6.3, 10_000) * 1000, 3)  # µm
6.016
"""
from __future__ import annotations

import math
from dataclasses import dataclass

from .geometry import Profile
from .massprops import BodyProps, SectionIntegrals, body_props, clipped_section_integrals, props_from_integrals
from .spin import rpm_to_rad_s

__all__ = ["BalanceResult", "balance", "permissible_specific_unbalance_mm", "floor_to_step"]


def permissible_specific_unbalance_mm(grade_mm_s: float, rpm: float) -> float:
    """e_per = G / Ω in mm, for grade G in mm/s and spin rate in rpm (ISO 21940-11)."""
    if not (grade_mm_s > 0 and math.isfinite(grade_mm_s)):
        raise ValueError(f"balance grade must be > 0 mm/s, got {grade_mm_s}")
    if not (rpm > 0 and math.isfinite(rpm)):
        raise ValueError(f"spin rate must be > 0 rpm, got {rpm}")
    return grade_mm_s / rpm_to_rad_s(rpm)


def floor_to_step(value_mm: float, step_mm: float) -> float:
    """``value_mm`` rounded down to a whole number of ``step_mm`` (a drawing-friendly tolerance).

    >>> floor_to_step(0.012033, 0.001)
    0.012
    """
    if not step_mm > 0:
        raise ValueError(f"step must be > 0 mm, got {step_mm}")
    n = math.floor(value_mm / step_mm + 1e-9)  # 1e-9: 0.012 / 0.001 must not become 11.999…
    decimals = max(0, -math.floor(math.log10(step_mm)) + 3)
    return round(n * step_mm, decimals)


@dataclass(frozen=True)
class BalanceResult:
    """What a balance grade means for one half at the reference spin rate.

    ``runout_tolerance_mm`` is the circular runout (TIR) of rim and bearing seat
    to the axle axis that keeps the half inside the grade, rounded down to
    ``runout_step_mm``. The ``*_from_runout_*`` fields give the unbalance a
    runout of ``runout_mm`` causes: for the whole half displaced, and for the
    rim band alone (the material at r ≥ ``rim_cut_radius_mm``).
    """

    grade_mm_s: float
    rpm: float
    omega_rad_s: float
    half_mass_g: float
    permissible_specific_unbalance_um: float
    permissible_unbalance_g_mm: float
    runout_step_mm: float
    runout_tolerance_mm: float
    runout_mm: float
    unbalance_from_runout_g_mm: float
    rim_cut_radius_mm: float
    rim_band_mass_g: float
    rim_unbalance_from_runout_g_mm: float
    within_grade: bool


def balance(
    profile: Profile,
    density_g_cm3: float,
    *,
    grade_mm_s: float = 6.3,
    rpm: float = 10_000.0,
    runout_mm: float | None = None,
    rim_radius_fraction: float = 0.8,
    runout_step_mm: float = 0.001,
    half: BodyProps | None = None,
    rim_integrals: SectionIntegrals | None = None,
) -> BalanceResult:
    """Balance figures of one half turned from ``profile``.

    ``runout_mm`` defaults to the runout tolerance the grade allows;
    ``within_grade`` says whether that runout keeps the half's unbalance at or
    below the permissible residual unbalance. ``half`` and ``rim_integrals`` may
    pass in what the caller has already integrated.
    """
    if runout_mm is not None and not (runout_mm >= 0 and math.isfinite(runout_mm)):
        raise ValueError(f"runout must be ≥ 0 mm, got {runout_mm}")
    if not (0 <= rim_radius_fraction < 1):
        raise ValueError(f"rim radius fraction must be in [0, 1), got {rim_radius_fraction}")
    e_per = permissible_specific_unbalance_mm(grade_mm_s, rpm)
    half = half if half is not None else body_props(profile, density_g_cm3)
    tol = floor_to_step(2 * e_per, runout_step_mm)
    t = tol if runout_mm is None else runout_mm
    r_cut = rim_radius_fraction * profile.bounds()[3]
    if rim_integrals is None:
        rim_integrals = clipped_section_integrals(profile, r_cut)
    rim_mass = props_from_integrals(rim_integrals, density_g_cm3).mass_g
    u_per = half.mass_g * e_per
    u_runout = half.mass_g * t / 2
    return BalanceResult(
        grade_mm_s=grade_mm_s,
        rpm=rpm,
        omega_rad_s=rpm_to_rad_s(rpm),
        half_mass_g=half.mass_g,
        permissible_specific_unbalance_um=e_per * 1000,
        permissible_unbalance_g_mm=u_per,
        runout_step_mm=runout_step_mm,
        runout_tolerance_mm=tol,
        runout_mm=t,
        unbalance_from_runout_g_mm=u_runout,
        rim_cut_radius_mm=r_cut,
        rim_band_mass_g=rim_mass,
        rim_unbalance_from_runout_g_mm=rim_mass * t / 2,
        within_grade=u_runout <= u_per * (1 + 1e-12),
    )
