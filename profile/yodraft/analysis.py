"""Mass properties, spin metrics and balance of a resolved design: one half, the small parts, the assembly."""
from __future__ import annotations

import functools
from dataclasses import dataclass
from typing import Any

from .balance import BalanceResult, balance
from .builder import Resolved
from .massprops import (AssemblyProps, BodyProps, PointPart, SectionIntegrals, assemble, body_props,
                        clipped_section_integrals, cylinder_part, mirrored_part, ring_mass_g, ring_part)
from .spin import SpinMetrics, spin_metrics

__all__ = ["Analysis", "MassAndSpin", "analyse", "mass_and_spin", "AXLE_DENSITY_G_CM3"]

AXLE_DENSITY_G_CM3 = 7.85  # carbon steel set screw, from memory
PITCH_DIAMETER_FACTOR = 0.649519  # d2 = d − 0.649519 P (ISO 724)


@dataclass(frozen=True)
class Analysis:
    """What the design weighs and how it spins, before any metal is cut."""

    half: BodyProps
    assembly: AssemblyProps
    spin: SpinMetrics
    balance: BalanceResult
    axle_length_mm: float


def small_parts(resolved: Resolved) -> tuple[tuple[PointPart, ...], float]:
    """The bearing, the axle and the two response pads placed where they sit, and the axle length.

    The axle spans the post spacing and runs into each half's thread short of the
    full-thread depth by one pitch (common practice, no published source).
    """
    v = resolved.values
    spec = resolved.design["parts"]
    pad_density = resolved.features["pad_groove"].extra["pad"].pad_density_g_cm3
    return _placed_parts(
        (v["bearing.mass"], v["bearing.bore"], v["bearing.od"], v["bearing.width"]),
        (spec["pad_mass"], pad_density, v["pad_groove.inner_diameter"], v["pad_groove.pad_diameter"],
         v["pad_groove.depth"], v["pad_groove.face_z"]),
        (spec["axle_mass"], v["bearing_seat.spacing"], v["axle_bore.thread_depth"], v["axle_bore.pitch"],
         v["axle_bore.major_diameter"]),
    )


@functools.lru_cache(maxsize=256)  # a sweep of the outer shape places the same small parts every time
def _placed_parts(bearing: tuple[float, ...], pad: tuple[Any, ...],
                  axle: tuple[Any, ...]) -> tuple[tuple[PointPart, ...], float]:
    bearing_mass, bore, od, width = bearing
    pad_mass, pad_density, pad_inner_d, pad_outer_d, depth, face_z = pad
    axle_mass, spacing, thread_depth, pitch, major_d = axle
    bearing_part = ring_part("bearing", bearing_mass, bore / 2, od / 2, width, 0.0)
    r_in, r_out = pad_inner_d / 2, pad_outer_d / 2
    if pad_mass is None:
        pad_mass = ring_mass_g(pad_density, r_in, r_out, depth)
    pad_part = ring_part("response pad", pad_mass, r_in, r_out, depth, face_z + depth / 2)
    axle_length = spacing + 2 * (thread_depth - pitch)
    axle_r = (major_d - PITCH_DIAMETER_FACTOR * pitch) / 2
    if axle_mass is None:
        axle_mass = ring_mass_g(AXLE_DENSITY_G_CM3, 0.0, axle_r, axle_length)
    axle_part = cylinder_part("axle", axle_mass, axle_r, axle_length, 0.0)
    return (bearing_part, axle_part, pad_part, mirrored_part(pad_part)), axle_length


@dataclass(frozen=True)
class MassAndSpin:
    """The mass budget and spin figures of a design (everything but the balance)."""

    half: BodyProps
    assembly: AssemblyProps
    spin: SpinMetrics
    rim_integrals: SectionIntegrals
    axle_length_mm: float


def mass_and_spin(resolved: Resolved) -> MassAndSpin:
    """Mass, inertia and spin metrics of ``resolved`` (its profile must exist and pass the loop checks)."""
    profile = resolved.profile
    if profile is None or not resolved.can_analyse:
        raise ValueError("the design has no valid closed profile to analyse (see its loop and axle checks)")
    v = resolved.values
    a = resolved.design["analysis"]
    density = v["material.density_g_cm3"]
    half = body_props(profile, density)
    parts, axle_length = small_parts(resolved)
    assembly = assemble(half, parts)
    rim = clipped_section_integrals(profile, a["rim_radius_ratio"] * profile.bounds()[3])
    spin = spin_metrics(profile, density, assembly, string_radius_mm=v["bearing.od"] / 2, rpm=a["spin_rate"],
                        drag_torque_n_mm=a["drag_torque"], rim_radius_fraction=a["rim_radius_ratio"], rim_integrals=rim)
    return MassAndSpin(half, assembly, spin, rim, axle_length)


def analyse(resolved: Resolved) -> Analysis:
    """Mass, inertia, spin metrics and balance of ``resolved`` (its profile must exist)."""
    m = mass_and_spin(resolved)
    a = resolved.design["analysis"]
    bal = balance(resolved.profile, resolved.values["material.density_g_cm3"], grade_mm_s=a["balance_grade"],
                  rpm=a["spin_rate"], rim_radius_fraction=a["rim_radius_ratio"], half=m.half,
                  rim_integrals=m.rim_integrals)
    return Analysis(m.half, m.assembly, m.spin, bal, m.axle_length_mm)
