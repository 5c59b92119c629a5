"""Mass properties, spin metrics and balance of a resolved design: one half, the small parts, the assembly."""
from __future__ import annotations

from dataclasses import dataclass
from operator import itemgetter
from typing import NamedTuple

from .balance import BalanceResult, balance
from .builder import Resolved
from .massprops import (AssemblyProps, BodyProps, PointPart, SectionIntegrals, assemble, body_props,
                        clipped_section_integrals, combine_bodies, cylinder_part, mirrored_part, ring_mass_g,
                        ring_part, weighted_integrals)
from .spin import SpinMetrics, spin_metrics

__all__ = ["Analysis", "MassAndSpin", "SmallPartInputs", "analyse", "mass_and_spin", "part_props", "small_parts",
           "small_part_inputs", "small_parts_from", "AXLE_DENSITY_G_CM3"]

AXLE_DENSITY_G_CM3 = 7.85  # carbon steel set screw, from memory
PITCH_DIAMETER_FACTOR = 0.649519  # d2 = d − 0.649519 P (ISO 724)


@dataclass(frozen=True)
class Analysis:
    """What the design weighs and how it spins, before any metal is cut.

    ``half`` sums the half's parts; ``parts`` gives each part (body first) on its own.
    """

    half: BodyProps
    assembly: AssemblyProps
    spin: SpinMetrics
    balance: BalanceResult
    axle_length_mm: float
    parts: tuple[tuple[str, str, BodyProps], ...] = ()


class SmallPartInputs(NamedTuple):
    """Everything the small parts are made from (a sweep's variants often share them: hashable)."""

    silicone: bool  # a recess filled flush with silicone instead of a response pad
    pad_density: float
    pad_mass: float | None
    axle_mass: float | None
    bearing_mass: float
    bore: float
    od: float
    width: float
    pad_inner_d: float
    pad_outer_d: float
    thickness: float
    bottom_z: float
    spacing: float
    thread_depth: float
    pitch: float
    major_d: float


#: the resolved values behind SmallPartInputs from ``bearing_mass`` on, in its order
_SMALL_PART_VALUES = itemgetter("bearing.mass", "bearing.bore", "bearing.od", "bearing.width",
                                "pad_groove.inner_diameter", "pad_groove.pad_diameter", "pad_groove.pad_thickness",
                                "pad_groove.bottom_z", "bearing_seat.spacing", "axle_bore.thread_depth",
                                "axle_bore.pitch", "axle_bore.major_diameter")


def small_part_inputs(resolved: Resolved) -> SmallPartInputs:
    """What ``small_parts`` reads of ``resolved``."""
    v = resolved.values
    spec = resolved.design["parts"]
    pad = resolved.features["pad_groove"].extra["pad"]
    silicone = pad is None  # a recess filled flush with silicone: its own volume, sitting in the recess
    return SmallPartInputs._make((silicone, v["pad_groove.silicone_density"] if silicone else pad.pad_density_g_cm3,
                                  spec["pad_mass"], spec["axle_mass"]) + _SMALL_PART_VALUES(v))


def small_parts(resolved: Resolved) -> tuple[tuple[PointPart, ...], float]:
    """The bearing, the axle and the two response pads (or silicone fills) placed where they sit, and the axle length."""
    return small_parts_from(small_part_inputs(resolved))


def small_parts_from(i: SmallPartInputs) -> tuple[tuple[PointPart, ...], float]:
    """The small parts (bearing, axle, two pads) and the axle length made from ``i``.

    The axle spans the post spacing and runs into each half's thread short of the
    full-thread depth by one pitch (common practice, no published source).
    """
    bearing_part = ring_part("bearing", i.bearing_mass, i.bore / 2, i.od / 2, i.width, 0.0)
    r_out = i.pad_outer_d / 2
    r_in = min(i.pad_inner_d / 2, r_out)  # a groove wider than its pad fails its own check; weigh an empty ring till then
    pad_mass = i.pad_mass
    if pad_mass is None:
        pad_mass = ring_mass_g(i.pad_density, r_in, r_out, i.thickness)
    # the pad (or the silicone) sits on the groove's bottom and stands toward the gap by its thickness
    pad_part = ring_part("silicone" if i.silicone else "response pad", pad_mass, r_in, r_out, i.thickness,
                         i.bottom_z - i.thickness / 2)
    axle_length = i.spacing + 2 * (i.thread_depth - i.pitch)
    axle_r = (i.major_d - PITCH_DIAMETER_FACTOR * i.pitch) / 2
    axle_mass = i.axle_mass
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
    #: the rim band's section integrals, turned with ``rim_density_g_cm3`` (1 when density-weighted over parts)
    rim_integrals: SectionIntegrals
    rim_density_g_cm3: float
    axle_length_mm: float
    parts: tuple[tuple[str, str, BodyProps], ...] = ()


def part_props(resolved: Resolved) -> tuple[tuple[str, str, BodyProps], ...]:
    """(name, material, mass properties) of each part of one half, the body first."""
    return tuple((p.name, p.material, body_props(p.profile, p.density_g_cm3)) for p in resolved.parts)


def mass_and_spin(resolved: Resolved) -> MassAndSpin:
    """Mass, inertia and spin metrics of ``resolved`` (its profile must exist and pass the loop checks).

    The half is the sum of its parts, each turned from its own loop with its own density.
    """
    profile = resolved.profile
    if profile is None or not resolved.can_analyse:
        raise ValueError("the design has no valid closed profile to analyse (see its loop and axle checks)")
    v = resolved.values
    a = resolved.design["analysis"]
    each = part_props(resolved)
    half = combine_bodies([props for _, _, props in each])
    small, axle_length = small_parts(resolved)
    assembly = assemble(half, small)
    r_cut = a["rim_radius_ratio"] * profile.bounds()[3]
    rim, density = _rim_integrals(resolved, r_cut)
    spin = spin_metrics(profile, density, assembly, string_radius_mm=v["bearing.od"] / 2, rpm=a["spin_rate"],
                        drag_torque_n_mm=a["drag_torque"], rim_radius_fraction=a["rim_radius_ratio"], rim_integrals=rim)
    return MassAndSpin(half, assembly, spin, rim, density, axle_length, each)


def _rim_integrals(resolved: Resolved, r_cut: float) -> tuple[SectionIntegrals, float]:
    """The rim band's section integrals and the density to turn them with: the body's own for a body
    alone, else density-weighted over the parts (turned with 1 g/cm³)."""
    if len(resolved.parts) == 1:
        body = resolved.parts[0]
        return clipped_section_integrals(body.profile, r_cut), body.density_g_cm3
    pairs = [(clipped_section_integrals(p.profile, r_cut), p.density_g_cm3) for p in resolved.parts]
    return weighted_integrals(pairs), 1.0


def analyse(resolved: Resolved) -> Analysis:
    """Mass, inertia, spin metrics and balance of ``resolved`` (its profile must exist)."""
    m = mass_and_spin(resolved)
    a = resolved.design["analysis"]
    bal = balance(resolved.profile, m.rim_density_g_cm3, grade_mm_s=a["balance_grade"],
                  rpm=a["spin_rate"], rim_radius_fraction=a["rim_radius_ratio"], half=m.half,
                  rim_integrals=m.rim_integrals)
    return Analysis(m.half, m.assembly, m.spin, bal, m.axle_length_mm, m.parts)
