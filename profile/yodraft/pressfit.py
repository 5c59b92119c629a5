"""Press and shrink fits of two thick-walled cylinders of different materials (Lamé).

The inner member (the shaft of the fit) has diameters ``d_i`` < ``d``, the outer member (the hole)
``d`` < ``d_o``; ``d`` is the interface. For a diametral interference δ the contact pressure is
(Shigley's Mechanical Engineering Design, sec. 3-16 "Press and Shrink Fits", eq. 3-56, written
with diameters, since δ/R = δ_d/d)

    p = δ / ( d/E_o · ((d_o² + d²)/(d_o² − d²) + ν_o) + d/E_i · ((d² + d_i²)/(d² − d_i²) − ν_i) )

and the stresses follow from Lamé's thick-walled cylinder equations (ibid., eqs. 3-58, 3-59):
hoop stress at the interface +p (d_o² + d²)/(d_o² − d²) in the outer member and
−p (d² + d_i²)/(d² − d_i²) in the inner; radial stress −p at the interface and 0 at the free
surfaces; hoop stress 2 p d²/(d_o² − d²) at the outer member's outside and −2 p d²/(d² − d_i²) at
the inner member's bore (−p throughout a solid inner member). The ends are free (σ_z = 0), so the
von Mises stress is √(σ_t² − σ_t σ_r + σ_r²).

The pressure shrinks the inner member's bore: there σ_r = 0 and σ_z = 0, so Hooke's law gives the
radial displacement u = a σ_t / E, and on the diameter Δd_i = −2 p d² d_i / (E_i (d² − d_i²))
(Lamé's thick cylinder under external pressure, e.g. Roark's Formulas for Stress and Strain, the
thick-walled cylinder table, Δa = −2 q b² a / (E (b² − a²))).

The fit holds an axial force F = μ p π d L and a torque T = F d / 2 (ibid., sec. 3-16). A
temperature T changes the diametral interference by d (α_i − α_o)(T − T_ref); heating the outer
member by ΔT = (δ_max + c) / (α_o d), or cooling the inner member by (δ_max + c) / (α_i d), opens a
diametral clearance c for assembly.

Units: mm, MPa, N, N·mm, K; E in MPa inside this module.

>>> steel = Member(40.0, 45.0, 207e3, 0.3, 12e-6, 400.0)
>>> tube = Member(45.0, 50.0, 207e3, 0.3, 12e-6, 400.0)
>>> round(contact_pressure(0.062, steel, tube), 2)
15.8
"""
from __future__ import annotations

import math
from dataclasses import dataclass

__all__ = ["Member", "SurfaceStress", "FitStresses", "contact_pressure", "fit_stresses", "von_mises",
           "thermal_change_mm", "assembly_delta_t_k", "bore_change_mm", "holding_force_n", "holding_torque_n_mm", "REFERENCE_TEMPERATURE_C"]

#: sizes and fits are stated at 20 °C  # ISO 1, standard reference temperature for geometrical product specification
REFERENCE_TEMPERATURE_C = 20.0


@dataclass(frozen=True)
class Member:
    """One cylinder of the fit: inner and outer diameter (mm; inner 0 for a solid one), Young's
    modulus (MPa), Poisson's ratio, expansion coefficient (1/K) and yield strength (MPa)."""

    inner_mm: float
    outer_mm: float
    e_mpa: float
    poisson: float
    alpha_per_k: float
    yield_mpa: float

    def __post_init__(self) -> None:
        if not (0 <= self.inner_mm < self.outer_mm and math.isfinite(self.outer_mm)):
            raise ValueError(f"member diameters {self.inner_mm}, {self.outer_mm} mm: need 0 ≤ inner < outer")
        if not (self.e_mpa > 0 and 0 <= self.poisson < 0.5):
            raise ValueError("member needs E > 0 and 0 ≤ ν < 0.5")


@dataclass(frozen=True)
class SurfaceStress:
    """Hoop and radial stress (MPa, tension +) at one surface, and their von Mises stress."""

    hoop_mpa: float
    radial_mpa: float

    @property
    def von_mises_mpa(self) -> float:
        return von_mises(self.hoop_mpa, self.radial_mpa)


@dataclass(frozen=True)
class FitStresses:
    """Stresses of both members at both of their surfaces for one contact pressure."""

    pressure_mpa: float
    inner_bore: SurfaceStress
    inner_interface: SurfaceStress
    outer_interface: SurfaceStress
    outer_outside: SurfaceStress

    def inner_max(self) -> SurfaceStress:
        """The inner member's surface of greater von Mises stress."""
        return max((self.inner_bore, self.inner_interface), key=lambda s: s.von_mises_mpa)

    def outer_max(self) -> SurfaceStress:
        """The outer member's surface of greater von Mises stress."""
        return max((self.outer_interface, self.outer_outside), key=lambda s: s.von_mises_mpa)


def von_mises(hoop_mpa: float, radial_mpa: float) -> float:
    """Von Mises stress of a plane (biaxial) stress state: √(σ₁² − σ₁σ₂ + σ₂²).

    >>> von_mises(100.0, 0.0), round(von_mises(100.0, -100.0), 6)
    (100.0, 173.205081)
    """
    return math.sqrt(hoop_mpa * hoop_mpa - hoop_mpa * radial_mpa + radial_mpa * radial_mpa)


def _check_pair(inner: Member, outer: Member) -> float:
    if abs(inner.outer_mm - outer.inner_mm) > 1e-6:
        raise ValueError(f"members do not meet: inner outside Ø{inner.outer_mm} mm, outer bore Ø{outer.inner_mm} mm")
    return outer.inner_mm


def contact_pressure(interference_mm: float, inner: Member, outer: Member) -> float:
    """Contact pressure (MPa) of a diametral interference between ``inner`` and ``outer`` (eq. 3-56)."""
    d = _check_pair(inner, outer)
    do2, d2, di2 = outer.outer_mm**2, d * d, inner.inner_mm**2
    compliance = d / outer.e_mpa * ((do2 + d2) / (do2 - d2) + outer.poisson) \
        + d / inner.e_mpa * ((d2 + di2) / (d2 - di2) - inner.poisson)
    return interference_mm / compliance


def fit_stresses(pressure_mpa: float, inner: Member, outer: Member) -> FitStresses:
    """Hoop and radial stresses at the four surfaces for a contact pressure (Lamé, free ends)."""
    d = _check_pair(inner, outer)
    p, do2, d2, di2 = pressure_mpa, outer.outer_mm**2, d * d, inner.inner_mm**2
    return FitStresses(
        pressure_mpa=p,
        inner_bore=SurfaceStress(-2 * p * d2 / (d2 - di2), 0.0) if di2 > 0 else SurfaceStress(-p, -p),
        inner_interface=SurfaceStress(-p * (d2 + di2) / (d2 - di2), -p),
        outer_interface=SurfaceStress(p * (do2 + d2) / (do2 - d2), -p),
        outer_outside=SurfaceStress(2 * p * d2 / (do2 - d2), 0.0),
    )


def bore_change_mm(pressure_mpa: float, inner: Member) -> float:
    """Change of the inner member's bore diameter (mm, a shrink is negative) under a contact pressure at
    its outside (Lamé, free ends); 0 for a solid member, which has no bore."""
    if inner.inner_mm <= 0:
        return 0.0
    d2, di = inner.outer_mm**2, inner.inner_mm
    return -2 * pressure_mpa * d2 * di / (inner.e_mpa * (d2 - di * di))


def thermal_change_mm(interface_mm: float, inner: Member, outer: Member, temperature_c: float) -> float:
    """Change of the diametral interference (mm) at ``temperature_c`` from the reference temperature:
    each member grows freely by α d ΔT, the inner one widening the interference, the outer one easing it.

    >>> round(thermal_change_mm(50.0, Member(30, 50, 193e3, 0.29, 17.3e-6, 215), Member(50, 56, 68.9e3, 0.33, 23.6e-6, 276), 60.0) * 1000, 3)
    -12.6
    """
    return interface_mm * (inner.alpha_per_k - outer.alpha_per_k) * (temperature_c - REFERENCE_TEMPERATURE_C)


def assembly_delta_t_k(interference_max_mm: float, clearance_mm: float, interface_mm: float, member: Member) -> float:
    """Temperature difference (K) that opens ``clearance_mm`` over the largest interference by heating
    the outer member or cooling the inner one (``member`` is the one heated or cooled)."""
    return (interference_max_mm + clearance_mm) / (member.alpha_per_k * interface_mm)


def holding_force_n(pressure_mpa: float, friction: float, interface_mm: float, length_mm: float) -> float:
    """Axial force (N) the fit holds before it slides: F = μ p π d L."""
    return friction * pressure_mpa * math.pi * interface_mm * length_mm


def holding_torque_n_mm(pressure_mpa: float, friction: float, interface_mm: float, length_mm: float) -> float:
    """Torque (N·mm) the fit holds before it slips: T = F d / 2."""
    return holding_force_n(pressure_mpa, friction, interface_mm, length_mm) * interface_mm / 2
