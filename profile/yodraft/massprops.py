"""Mass properties of a turned half, exact over the lines and arcs of its profile.

A half is the solid made by turning its (z, r) profile once about the spin axis
(z). Every section integral is a boundary integral by Green's theorem,

    ∬ r^n z^m dA = −1/(n+1) ∮ r^(n+1) z^m dz,

taken exactly over each segment in closed form: on a line the integrands are
polynomials in the line's parameter, on an arc polynomials in the sine and cosine
of its angle. Nothing is flattened.

Clipping at a radius (the rim band, everything with r ≥ r_cut) uses the same
sums with r^(n+1) replaced by max(0, r^(n+1) − r_cut^(n+1)): that function is
continuous, so Green's theorem still holds and the closing line along
r = r_cut contributes nothing.

Units: mm, g, g·mm²; densities in g/cm³ at the call (1 g/cm³ = 1e-3 g/mm³).

>>> from yodraft.geometry import Profile
>>> sleeve = Profile.from_points([(0, 4), (10, 4), (10, 6), (0, 6)])
>>> p = body_props(sleeve, 1.0)
>>> round(p.volume_mm3 / (3.141592653589793 * (6**2 - 4**2) * 10), 12)
1.0
"""
from __future__ import annotations

import functools
import math
from dataclasses import dataclass
from typing import NamedTuple, Sequence

from .geometry import Arc, Profile

__all__ = [
    "SectionIntegrals",
    "BodyProps",
    "PointPart",
    "BudgetLine",
    "AssemblyProps",
    "section_integrals",
    "clipped_section_integrals",
    "check_clip",
    "density_g_mm3",
    "body_props",
    "combine_bodies",
    "weighted_integrals",
    "props_from_integrals",
    "ring_part",
    "cylinder_part",
    "mirrored_part",
    "ring_mass_g",
    "turned_body",
    "part_sums",
    "assemble",
]

G_PER_MM3_PER_G_CM3 = 1e-3  # 1 cm³ = 1000 mm³ (SI definition of the centimetre)

_R_TOL = 1e-9  # mm: how far below the spin axis a point may stray by rounding


@dataclass(frozen=True)
class SectionIntegrals:
    """Raw integrals over the section (mm powers) and the turned surface.

    ``a`` = ∫dA, ``r1`` = ∫r dA, ``z1`` = ∫z dA, ``rz`` = ∫r z dA,
    ``r3`` = ∫r³ dA, ``rz2`` = ∫r z² dA, ``surface`` = 2π ∫ r ds over the loop.
    """

    a: float
    r1: float
    z1: float
    rz: float
    r3: float
    rz2: float
    surface: float


@dataclass(frozen=True)
class BodyProps:
    """One turned body: volume, surface, mass and inertia.

    ``ixx_g_mm2`` is about a transverse axis through z = 0 (the gap plane, the
    assembled centre); ``ixx_cg_g_mm2`` is about the parallel axis through the
    body's own mass centre.
    """

    area_mm2: float
    volume_mm3: float
    surface_mm2: float
    density_g_cm3: float
    mass_g: float
    z_centroid_mm: float
    izz_g_mm2: float
    ixx_g_mm2: float
    ixx_cg_g_mm2: float


@dataclass(frozen=True)
class PointPart:
    """A small part of the assembly (bearing, pad, axle) with its own inertia.

    ``izz_g_mm2`` is about the spin axis, ``ixx_own_g_mm2`` about its own
    transverse centroidal axis, ``z_mm`` where its mass centre sits on the axis.
    ``r_in_mm``/``r_out_mm`` (optional) describe a uniform ring, used when a
    share of inertia outside a radius is wanted.
    """

    name: str
    mass_g: float
    izz_g_mm2: float
    ixx_own_g_mm2: float
    z_mm: float
    r_in_mm: float | None = None
    r_out_mm: float | None = None

    def __post_init__(self) -> None:
        for label, v in (("mass", self.mass_g), ("izz", self.izz_g_mm2), ("ixx", self.ixx_own_g_mm2)):
            if not (math.isfinite(v) and v >= 0):
                raise ValueError(f"part {self.name!r}: {label} must be a finite value ≥ 0, got {v}")
        if not math.isfinite(self.z_mm):
            raise ValueError(f"part {self.name!r}: z must be finite, got {self.z_mm}")

    @property
    def ixx_g_mm2(self) -> float:
        """Transverse inertia about z = 0 (parallel-axis theorem)."""
        return self.ixx_own_g_mm2 + self.mass_g * self.z_mm**2


class BudgetLine(NamedTuple):
    """One line of the mass budget."""

    name: str
    count: int
    mass_each_g: float
    mass_total_g: float


@dataclass(frozen=True)
class AssemblyProps:
    """The assembled yo-yo: two mirrored halves plus the small parts."""

    half: BodyProps
    parts: tuple[PointPart, ...]
    total_g: float
    izz_g_mm2: float
    ixx_g_mm2: float
    z_centroid_mm: float

    @functools.cached_property
    def budget(self) -> tuple[BudgetLine, ...]:
        """The mass budget: the two halves, then each kind of part (parts with the same name counted together)."""
        lines = [BudgetLine("half", 2, self.half.mass_g, 2 * self.half.mass_g)]
        seen: dict[str, list[PointPart]] = {}
        for p in self.parts:
            seen.setdefault(p.name, []).append(p)
        for name, group in seen.items():
            m = sum(p.mass_g for p in group)
            lines.append(BudgetLine(name, len(group), m / len(group), m))
        return tuple(lines)


# --------------------------------------------------------------------- section integrals


def _arc_r_min(rc: float, a: float, t0: float, dt: float) -> float:
    """Least radius reached by an arc: its lowest point if the sweep passes it, else an end."""
    lo, hi = (t0, t0 + dt) if dt > 0 else (t0 + dt, t0)
    bottom = -math.pi / 2 + 2 * math.pi * math.ceil((lo + math.pi / 2) / (2 * math.pi))
    if bottom <= hi:
        return rc - a
    return rc + a * min(math.sin(lo), math.sin(hi))


LineRow = tuple[float, float, float, float]  # (z0, r0, z1, r1)
ArcRow = tuple[float, float, float, float, float]  # (zc, rc, a, θ0, Δθ)


def _split(profile: Profile) -> tuple[list[LineRow], list[ArcRow], float]:
    """Line rows (z0, r0, z1, r1), arc rows (zc, rc, a, θ0, Δθ) and the least radius of the loop."""
    lines: list[LineRow] = []
    arcs: list[ArcRow] = []
    r_min = math.inf
    for s in profile.segments:
        if isinstance(s, Arc):
            zc, rc = s.center
            arcs.append((zc, rc, s.radius, s.start_angle, s.sweep))
            r_arc = _arc_r_min(rc, s.radius, s.start_angle, s.sweep)
            if r_arc < r_min:
                r_min = r_arc
        else:
            (z0, r0), (z1, r1) = s.start, s.end
            lines.append((z0, r0, z1, r1))
            if r0 < r_min:
                r_min = r0
            if r1 < r_min:
                r_min = r1
    return lines, arcs, r_min


def _turned_terms(za, zb, r, c, c2, c4):  # floats or numpy arrays alike
    """The six area sums' terms (a, r1, z1, rz, r3, rz2) of a turned diameter from za to zb at radius r.

    Each −∫ G_k dz is −Δz times a constant G_k; ``c2``, ``c4`` are c², c⁴. Plain arithmetic only, so the
    same code serves one line (floats) and a batch of loops (numpy arrays), to the bit.
    """
    dz = za - zb  # the minus sign of −∮ G dz folded in
    z_sum = za + zb
    zz_mean = (za * za + za * zb + zb * zb) / 3
    g0, g1 = r - c, 0.5 * (r * r - c2)
    return (dz * g0, dz * g1, dz * g0 * 0.5 * z_sum, dz * g1 * 0.5 * z_sum, dz * 0.25 * (r * r * r * r - c4),
            dz * g1 * zz_mean)


def _sloped_terms(za, ra, zb, rb, c, c2, c4):  # floats or numpy arrays alike
    """The six area sums' terms (a, r1, z1, rz, r3, rz2) of a line with za ≠ zb and ra ≠ rb.

    Along it r and z are linear in the parameter t, so each −∫ G_k dz is −Δz times the mean of a
    polynomial in t, written out from its end values. Plain arithmetic, as ``_turned_terms``.
    """
    dz = za - zb
    z_sum = za + zb
    zz_mean = (za * za + za * zb + zb * zb) / 3
    raa, rab, rbb = ra * ra, ra * rb, rb * rb
    rr_mean = (raa + rab + rbb) / 3
    zaa, zab, zbb = za * za, za * zb, zb * zb
    return (dz * (0.5 * (ra + rb) - c),
            dz * 0.5 * (rr_mean - c2),
            dz * ((ra * (2 * za + zb) + rb * (za + 2 * zb)) / 6 - 0.5 * c * z_sum),
            dz * 0.5 * ((za * (3 * raa + 2 * rab + rbb) + zb * (raa + 2 * rab + 3 * rbb)) / 12 - 0.5 * c2 * z_sum),
            dz * 0.25 * (((raa + rbb) * 3 * rr_mean - rab * rab) / 5 - c4),
            dz * 0.5 * ((raa * (6 * zaa + 3 * zab + zbb) + rab * (3 * zaa + 4 * zab + 3 * zbb)
                         + rbb * (zaa + 3 * zab + 6 * zbb)) / 30 - c2 * zz_mean))


def _line_sums(lines: Sequence[LineRow], c: float) -> list[float]:
    """The seven sums (a, r1, z1, rz, r3, rz2, ∫r ds) over straight pieces, in closed form.

    A face (constant z) adds only to the surface; a turned diameter (constant r) has constant G_k
    (``_turned_terms``); any other line is ``_sloped_terms``.
    """
    a = r1 = z1 = rz = r3 = rz2 = rds = 0.0
    c2 = c * c
    c4 = c2 * c2
    for za, ra, zb, rb in lines:
        if za == zb:
            rds += abs(rb - ra) * 0.5 * (ra + rb)
            continue
        if ra == rb:
            ta, tr1, tz1, trz, tr3, trz2 = _turned_terms(za, zb, ra, c, c2, c4)
            rds += abs(za - zb) * ra
        else:
            ta, tr1, tz1, trz, tr3, trz2 = _sloped_terms(za, ra, zb, rb, c, c2, c4)
            rds += math.hypot(zb - za, rb - ra) * 0.5 * (ra + rb)
        a += ta
        r1 += tr1
        z1 += tz1
        rz += trz
        r3 += tr3
        rz2 += trz2
    return [a, r1, z1, rz, r3, rz2, rds]


def _sine_moments(t0: float, dt: float) -> tuple[float, ...]:
    """P1 … P5 and Q1 … Q3 with Pp = ∫ sinᵖθ dθ, Qp = ∫ sinᵖθ cosθ dθ from θ0 to θ0 + Δθ (``_moments``)."""
    t1 = t0 + dt
    return _moments(math.sin(t0), math.cos(t0), math.sin(t1), math.cos(t1), dt)


def _moments(s0, c0, s1, c1, dt):  # floats or numpy arrays alike
    """P1 … P5 and Q1 … Q3 from the sine and cosine at both ends of a sweep Δθ.

    By the usual reduction formulas, Pp = ((p − 1) Pp−2 − [sinᵖ⁻¹θ cosθ]) / p
    and Qp = [sinᵖ⁺¹θ] / (p + 1), with [f] = f(θ0 + Δθ) − f(θ0).
    """
    s0_2, s1_2 = s0 * s0, s1 * s1
    s0_3, s1_3 = s0_2 * s0, s1_2 * s1
    s0_4, s1_4 = s0_2 * s0_2, s1_2 * s1_2
    p1 = c0 - c1
    p2 = (s0 * c0 - s1 * c1 + dt) / 2
    p3 = (s0_2 * c0 - s1_2 * c1 + 2 * p1) / 3
    p4 = (s0_3 * c0 - s1_3 * c1 + 3 * p2) / 4
    p5 = (s0_4 * c0 - s1_4 * c1 + 4 * p3) / 5
    return p1, p2, p3, p4, p5, (s1_2 - s0_2) / 2, (s1_3 - s0_3) / 3, (s1_4 - s0_4) / 4


def _arc_terms(zc, rc, a, moments, c, c2):  # floats or numpy arrays alike
    """The six area sums' terms (a, r1, z1, rz, r3, rz2) of one arc, from its ``_moments``.

    On an arc r = rc + a sinθ, z = zc + a cosθ and dz = −a sinθ dθ, so each
    −∫ G_k dz = ∫ G_k a sinθ dθ is a polynomial in sinθ and cosθ, integrated
    term by term (∫ sinᵖθ cos²θ dθ = Pp − Pp+2).
    """
    p1, p2, p3, p4, p5, q1, q2, q3 = moments
    rc2, aa = rc * rc, a * a
    # G0 = r − c and G1 = (r² − c²)/2 in powers of sinθ, each times one more sinθ from dz
    g0_p = (rc - c) * p1 + a * p2
    g0_q = (rc - c) * q1 + a * q2
    e0, e1, e2 = 0.5 * (rc2 - c2), rc * a, 0.5 * aa
    g1_p = e0 * p1 + e1 * p2 + e2 * p3
    g1_q = e0 * q1 + e1 * q2 + e2 * q3
    g1_cc = e0 * (p1 - p3) + e1 * (p2 - p4) + e2 * (p3 - p5)
    # G4 = (r⁴ − c⁴)/4
    g4_p = (0.25 * (rc2 * rc2 - c2 * c2) * p1 + rc2 * rc * a * p2 + 1.5 * rc2 * aa * p3
            + rc * aa * a * p4 + 0.25 * aa * aa * p5)
    return (a * g0_p, a * g1_p, a * (zc * g0_p + a * g0_q), a * (zc * g1_p + a * g1_q), a * g4_p,
            a * (zc * zc * g1_p + 2 * zc * a * g1_q + aa * g1_cc))


def _arc_sums(arcs: Sequence[ArcRow], c: float) -> list[float]:
    """The seven sums (a, r1, z1, rz, r3, rz2, ∫r ds) over arcs, in closed form (``_arc_terms``).

    The moments are differences of end values, so on a very short arc the error
    is about one rounding of the arc's largest term rather than of its (small) result.
    """
    area = r1 = z1 = rz = r3 = rz2 = rds = 0.0
    c2 = c * c
    for zc, rc, a, t0, dt in arcs:
        moments = _sine_moments(t0, dt)
        ta, tr1, tz1, trz, tr3, trz2 = _arc_terms(zc, rc, a, moments, c, c2)
        area += ta
        r1 += tr1
        z1 += tz1
        rz += trz
        r3 += tr3
        rz2 += trz2
        rds += math.copysign(a, dt) * (rc * dt + a * moments[0])
    return [area, r1, z1, rz, r3, rz2, rds]


def _sums(lines: Sequence[LineRow], arcs: Sequence[ArcRow], r_cut: float) -> SectionIntegrals:
    """The Green's-theorem sums over line and arc pieces that lie wholly at r ≥ r_cut."""
    a, r1, z1, rz, r3, rz2, rds = (x + y for x, y in zip(_line_sums(lines, r_cut), _arc_sums(arcs, r_cut)))
    return SectionIntegrals(a, r1, z1, rz, r3, rz2, 2 * math.pi * rds)


def section_integrals(profile: Profile) -> SectionIntegrals:
    """Exact section integrals of a counter-clockwise profile with r ≥ 0.

    >>> from yodraft.geometry import Profile
    >>> s = section_integrals(Profile.from_points([(0, 0), (2, 0), (2, 3), (0, 3)]))
    >>> round(s.a, 12), round(s.r1, 12), round(s.z1, 12)
    (6.0, 9.0, 6.0)
    """
    lines, arcs, r_min = _split(profile)
    if r_min < -_R_TOL:
        raise ValueError("profile reaches below the spin axis (r < 0); a turned section needs r ≥ 0")
    out = _sums(lines, arcs, 0.0)
    if not out.a > 0:
        raise ValueError(f"profile must be a counter-clockwise loop with positive area, got {out.a:.6g} mm²")
    return out


def _cut_point(z0, r0, z1, r1, r_cut):  # floats or numpy arrays alike
    """Where the line (z0, r0)–(z1, r1) crosses r = r_cut."""
    t = (r_cut - r0) / (r1 - r0)
    return z0 + (z1 - z0) * t, r0 + (r1 - r0) * t


def _arc_piece(t0, dt, fa, fb):  # floats or numpy arrays alike
    """Middle angle, start angle and sweep of the piece between sweep fractions fa and fb of the arc (θ0, Δθ)."""
    return t0 + dt * (fa + fb) / 2, t0 + dt * fa, dt * (fb - fa)


def _clip_pieces(profile: Profile, r_cut: float) -> tuple[list[LineRow], list[ArcRow]]:
    """The loop cut at every crossing of r = r_cut, keeping the pieces that lie at r ≥ r_cut."""
    lines: list[LineRow] = []
    arcs: list[ArcRow] = []
    for s in profile.segments:
        if not isinstance(s, Arc):
            (z0, r0), (z1, r1) = s.start, s.end
            if (r0 - r_cut) * (r1 - r_cut) < 0:
                z_cut, r_at = _cut_point(z0, r0, z1, r1, r_cut)
                lines.append((z_cut, r_at, z1, r1) if r1 > r_cut else (z0, r0, z_cut, r_at))
            elif (r0 + r1) / 2 > r_cut:
                lines.append((z0, r0, z1, r1))
        else:
            zc, rc = s.center
            if rc + s.radius <= r_cut:
                continue  # the whole circle lies at or below the cut: no piece of the arc is kept
            cuts = [0.0, 1.0]
            q = (r_cut - rc) / s.radius
            if -1 < q < 1:
                base = math.asin(q)
                for root in (base, math.pi - base):
                    # every angle of that root inside the sweep, as a fraction of the sweep
                    lo, hi = sorted((s.start_angle, s.end_angle))
                    k = math.ceil((lo - root) / (2 * math.pi))
                    ang = root + 2 * math.pi * k
                    while ang < hi:
                        f = (ang - s.start_angle) / s.sweep
                        if 0 < f < 1:
                            cuts.append(f)
                        ang += 2 * math.pi
            cuts.sort()
            for fa, fb in zip(cuts, cuts[1:]):
                if fb - fa <= 0:
                    continue
                mid, t0, dt = _arc_piece(s.start_angle, s.sweep, fa, fb)
                if rc + s.radius * math.sin(mid) > r_cut:
                    arcs.append((zc, rc, s.radius, t0, dt))
    return lines, arcs


def check_clip(profile: Profile, r_cut: float) -> None:
    """Raise ValueError unless ``profile`` is a counter-clockwise loop at r ≥ 0 and ``r_cut`` a radius ≥ 0."""
    if not (math.isfinite(r_cut) and r_cut >= 0):
        raise ValueError(f"cut radius must be a finite value ≥ 0, got {r_cut}")
    if profile.bounds()[1] < -_R_TOL or not profile.signed_area() > 0:
        raise ValueError("the profile must be a counter-clockwise loop at r ≥ 0")


def clipped_section_integrals(profile: Profile, r_cut: float) -> SectionIntegrals:
    """Exact section integrals of the part of the profile at r ≥ ``r_cut`` (the rim band).

    ``surface`` counts only the loop's own turned surface above the cut, not the
    cut itself. Returns all zeros when nothing lies above the cut.

    >>> from yodraft.geometry import Profile
    >>> s = clipped_section_integrals(Profile.from_points([(0, 0), (2, 0), (2, 3), (0, 3)]), 1.0)
    >>> round(s.a, 12)
    4.0
    """
    check_clip(profile, r_cut)
    lines, arcs = _clip_pieces(profile, r_cut)
    if not len(lines) and not len(arcs):
        return SectionIntegrals(0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0)
    return _sums(lines, arcs, r_cut)


# --------------------------------------------------------------------- bodies


def density_g_mm3(density_g_cm3: float) -> float:
    """A density in g/cm³ as g/mm³; ValueError unless it is finite and > 0."""
    if not (math.isfinite(density_g_cm3) and density_g_cm3 > 0):
        raise ValueError(f"density must be a finite value > 0 g/cm³, got {density_g_cm3}")
    return density_g_cm3 * G_PER_MM3_PER_G_CM3


def turned_body(rho, r1, r3, rz2):  # floats or numpy arrays alike
    """(volume, mass, Izz, Ixx about z = 0) of a section with integrals ∫r dA, ∫r³ dA, ∫r z² dA turned with
    density ``rho`` (g/mm³): V = 2π ∫r dA, Izz = ρ 2π ∫r³ dA, Ixx = ρ π ∫(r³ + 2 r z²) dA."""
    volume = 2 * math.pi * r1
    return volume, rho * volume, rho * 2 * math.pi * r3, rho * math.pi * (r3 + 2 * rz2)


def props_from_integrals(s: SectionIntegrals, density_g_cm3: float) -> BodyProps:
    """Body properties of the section integrals ``s`` turned once about the spin axis.

    Izz = ρ 2π ∫r³ dA; Ixx about z = 0 is ½ Izz + ∫z² dm = ρ π ∫(r³ + 2 r z²) dA.
    """
    volume, mass, izz, ixx = turned_body(density_g_mm3(density_g_cm3), s.r1, s.r3, s.rz2)
    zc = s.rz / s.r1 if s.r1 > 0 else 0.0
    return BodyProps(
        area_mm2=s.a,
        volume_mm3=volume,
        surface_mm2=s.surface,
        density_g_cm3=density_g_cm3,
        mass_g=mass,
        z_centroid_mm=zc,
        izz_g_mm2=izz,
        ixx_g_mm2=ixx,
        ixx_cg_g_mm2=ixx - mass * zc * zc,
    )


def body_props(profile: Profile, density_g_cm3: float) -> BodyProps:
    """Volume, surface, mass and inertia of one half turned from ``profile``.

    >>> from yodraft.geometry import Profile
    >>> disc = Profile.from_points([(0, 0), (1, 0), (1, 10), (0, 10)])
    >>> p = body_props(disc, 1.0)
    >>> round(p.izz_g_mm2 / (0.5 * p.mass_g * 10**2), 12)
    1.0
    """
    return props_from_integrals(section_integrals(profile), density_g_cm3)


def combine_bodies(bodies: Sequence[BodyProps]) -> BodyProps:
    """The parts of one half (body and rings, each with its own density) taken as one body.

    Mass, volume, area, surface and inertias add; the density is the mean (mass over volume);
    the centroid is mass-weighted and the own transverse inertia follows by the parallel-axis theorem.

    >>> from yodraft.geometry import Profile
    >>> inner = body_props(Profile.from_points([(0, 0), (1, 0), (1, 5), (0, 5)]), 2.7)
    >>> outer = body_props(Profile.from_points([(0, 5), (1, 5), (1, 6), (0, 6)]), 8.0)
    >>> whole = combine_bodies([inner, outer])
    >>> round(whole.mass_g - inner.mass_g - outer.mass_g, 12), round(whole.izz_g_mm2 - inner.izz_g_mm2 - outer.izz_g_mm2, 9)
    (0.0, 0.0)
    """
    if len(bodies) == 1:
        return bodies[0]
    mass = sum(b.mass_g for b in bodies)
    volume = sum(b.volume_mm3 for b in bodies)
    zc = sum(b.mass_g * b.z_centroid_mm for b in bodies) / mass if mass > 0 else 0.0
    ixx = sum(b.ixx_g_mm2 for b in bodies)
    return BodyProps(
        area_mm2=sum(b.area_mm2 for b in bodies),
        volume_mm3=volume,
        surface_mm2=sum(b.surface_mm2 for b in bodies),
        density_g_cm3=mass / (volume * G_PER_MM3_PER_G_CM3) if volume > 0 else bodies[0].density_g_cm3,
        mass_g=mass,
        z_centroid_mm=zc,
        izz_g_mm2=sum(b.izz_g_mm2 for b in bodies),
        ixx_g_mm2=ixx,
        ixx_cg_g_mm2=ixx - mass * zc * zc,
    )


def weighted_integrals(pairs: Sequence[tuple[SectionIntegrals, float]]) -> SectionIntegrals:
    """Σ ρᵢ·Sᵢ over (integrals, density g/cm³) pairs: turned with density 1 g/cm³ it gives the parts'
    summed mass and inertias (each is linear in ρ·S). Volume and surface of the result are not lengths."""
    if len(pairs) == 1 and pairs[0][1] == 1.0:
        return pairs[0][0]
    fields = ("a", "r1", "z1", "rz", "r3", "rz2", "surface")
    return SectionIntegrals(*(sum(getattr(s, f) * rho for s, rho in pairs) for f in fields))


# --------------------------------------------------------------------- small parts and the assembly


def ring_mass_g(density_g_cm3: float, r_in: float, r_out: float, length: float) -> float:
    """Mass of a uniform ring (hollow cylinder) of the given density."""
    return density_g_cm3 * G_PER_MM3_PER_G_CM3 * math.pi * (r_out**2 - r_in**2) * length


def ring_part(name: str, mass_g: float, r_in: float, r_out: float, length: float, z_centre: float) -> PointPart:
    """A uniform ring (bearing, pad) treated as a hollow cylinder.

    Izz = ½ m (r1² + r2²); Ixx about its own centre = m/12 (3(r1² + r2²) + L²).

    >>> round(ring_part("pad", 1.2, 8.0, 10.0, 1.0, 3.0).izz_g_mm2, 9)
    98.4
    """
    if not (0 <= r_in <= r_out and length >= 0):
        raise ValueError(f"part {name!r}: need 0 ≤ r_in ≤ r_out and length ≥ 0, got {r_in}, {r_out}, {length}")
    s = r_in**2 + r_out**2
    return PointPart(name, mass_g, 0.5 * mass_g * s, mass_g / 12 * (3 * s + length**2), z_centre, r_in, r_out)


def cylinder_part(name: str, mass_g: float, radius: float, length: float, z_centre: float = 0.0) -> PointPart:
    """A solid cylinder (axle): Izz = ½ m R², Ixx own = m/12 (3R² + L²)."""
    return ring_part(name, mass_g, 0.0, radius, length, z_centre)


def mirrored_part(part: PointPart) -> PointPart:
    """The same part on the other half (z → −z), e.g. the second response pad."""
    return PointPart(part.name, part.mass_g, part.izz_g_mm2, part.ixx_own_g_mm2, -part.z_mm, part.r_in_mm, part.r_out_mm)


def part_sums(parts: Sequence[PointPart]) -> tuple[float, float, float]:
    """The small parts' summed mass, Izz and Ixx about z = 0, in their order (what ``assemble`` adds to the halves)."""
    return (sum(p.mass_g for p in parts), sum(p.izz_g_mm2 for p in parts), sum(p.ixx_g_mm2 for p in parts))


def assemble(half: BodyProps, parts: Sequence[PointPart]) -> AssemblyProps:
    """Two halves (``half`` on +z and its mirror on −z) plus the small parts.

    Every part's transverse inertia is moved to z = 0 by the parallel-axis
    theorem. Parts with the same name are counted together in the budget.
    """
    parts = tuple(parts)
    mass, izz, ixx = part_sums(parts)
    total = 2 * half.mass_g + mass
    izz = 2 * half.izz_g_mm2 + izz
    ixx = 2 * half.ixx_g_mm2 + ixx
    zc = sum(p.mass_g * p.z_mm for p in parts) / total if total > 0 else 0.0
    return AssemblyProps(half, parts, total, izz, ixx, zc)
