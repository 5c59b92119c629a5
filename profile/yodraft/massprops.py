"""Mass properties of a turned half, exact over the lines and arcs of its profile.

A half is the solid made by turning its (z, r) profile once about the spin axis
(z). Every section integral is a boundary integral by Green's theorem,

    ∬ r^n z^m dA = −1/(n+1) ∮ r^(n+1) z^m dz,

taken exactly over each segment: lines with a Gauss–Legendre rule that is exact
for their polynomial integrands, arcs in quarter-turn pieces with a 12-point rule
whose error on these trigonometric polynomials is below rounding. Nothing is flattened.

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

import math
from dataclasses import dataclass
from typing import NamedTuple, Sequence

import numpy as np

from .geometry import Arc, Line, Profile

__all__ = [
    "SectionIntegrals",
    "BodyProps",
    "PointPart",
    "BudgetLine",
    "AssemblyProps",
    "section_integrals",
    "clipped_section_integrals",
    "body_props",
    "props_from_integrals",
    "ring_part",
    "cylinder_part",
    "mirrored_part",
    "ring_mass_g",
    "assemble",
]

G_PER_MM3_PER_G_CM3 = 1e-3  # 1 cm³ = 1000 mm³ (SI definition of the centimetre)

# Gauss–Legendre nodes on [0, 1], computed once. Four points integrate a line's
# integrands (polynomials of degree ≤ 5 in the parameter) exactly. Arcs are taken in
# pieces of at most a quarter turn; 12 points on such a piece leave an error below
# 1e-16 relative for the degree-5 trigonometric polynomials met here (the
# Gauss–Legendre remainder h^(2n+1) (n!)^4 / ((2n+1) ((2n)!)^3) · 5^(2n)).
_LINE_X, _LINE_W = np.polynomial.legendre.leggauss(4)
_LINE_T = (_LINE_X + 1.0) / 2.0
_LINE_W = _LINE_W / 2.0
_ARC_PIECE = math.pi / 2
_ARC_X, _ARC_W = np.polynomial.legendre.leggauss(12)
_ARC_T = (_ARC_X + 1.0) / 2.0
_ARC_W = _ARC_W / 2.0

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
    budget: tuple[BudgetLine, ...]


# --------------------------------------------------------------------- section integrals


def _arc_r_min(rc: float, a: float, t0: float, dt: float) -> float:
    """Least radius reached by an arc: its lowest point if the sweep passes it, else an end."""
    lo, hi = (t0, t0 + dt) if dt > 0 else (t0 + dt, t0)
    bottom = -math.pi / 2 + 2 * math.pi * math.ceil((lo + math.pi / 2) / (2 * math.pi))
    if bottom <= hi:
        return rc - a
    return rc + a * min(math.sin(lo), math.sin(hi))


def _add_arc(rows: list[float], zc: float, rc: float, a: float, t0: float, dt: float) -> None:
    """Append an arc as rows of at most a quarter turn each."""
    pieces = math.ceil(abs(dt) / _ARC_PIECE - 1e-12)
    if pieces <= 1:
        rows += (zc, rc, a, t0, dt)
        return
    step = dt / pieces
    for k in range(pieces):
        rows += (zc, rc, a, t0 + k * step, step)


def _split(profile: Profile) -> tuple[np.ndarray, np.ndarray, float]:
    """Line rows (z0, r0, z1, r1), arc rows (zc, rc, a, θ0, Δθ) and the least radius of the loop."""
    lines: list[float] = []
    arcs: list[float] = []
    r_min = math.inf
    for s in profile.segments:
        if isinstance(s, Arc):
            zc, rc = s.center
            _add_arc(arcs, zc, rc, s.radius, s.start_angle, s.sweep)
            r_arc = _arc_r_min(rc, s.radius, s.start_angle, s.sweep)
            if r_arc < r_min:
                r_min = r_arc
        else:
            (z0, r0), (z1, r1) = s.start, s.end
            lines += (z0, r0, z1, r1)
            if r0 < r_min:
                r_min = r0
            if r1 < r_min:
                r_min = r1
    return np.array(lines, dtype=float).reshape(-1, 4), np.array(arcs, dtype=float).reshape(-1, 5), r_min


# endpoints (z0, r0, z1, r1) → line nodes [z at each t | r at each t], by one matrix product
_N = _LINE_T.size
_LINE_NODES = np.zeros((4, 2 * _N))
_LINE_NODES[0, :_N] = 1 - _LINE_T
_LINE_NODES[2, :_N] = _LINE_T
_LINE_NODES[1, _N:] = 1 - _LINE_T
_LINE_NODES[3, _N:] = _LINE_T
_LINE_Z = np.ascontiguousarray(_LINE_NODES[:, :_N])
_LINE_R = np.ascontiguousarray(_LINE_NODES[:, _N:])
_LINE_DELTA = np.array([[-1.0, 0.0], [0.0, -1.0], [1.0, 0.0], [0.0, 1.0]])  # → (dz, dr)


def _nodes(lines: np.ndarray, arcs: np.ndarray) -> tuple[np.ndarray, np.ndarray, np.ndarray, np.ndarray]:
    """Quadrature nodes z, r of every piece, with weights × dz/dt and × ds/dt, flattened.

    Written into preallocated rows (lines first, then arcs): at the sizes of a
    yo-yo profile the cost is the count of array operations, not their length.
    """
    nl, na = len(lines), len(arcs)
    split = nl * _N
    out = np.empty((4, split + na * _ARC_T.size))
    z, r, wdz, wds = out
    if nl:
        np.matmul(lines, _LINE_Z, out=z[:split].reshape(nl, _N))
        np.matmul(lines, _LINE_R, out=r[:split].reshape(nl, _N))
        d = lines @ _LINE_DELTA
        np.multiply(d[:, :1], _LINE_W, out=wdz[:split].reshape(nl, _N))
        np.multiply(np.hypot(d[:, :1], d[:, 1:]), _LINE_W, out=wds[:split].reshape(nl, _N))
    if na:
        shape = (na, _ARC_T.size)
        a = arcs[:, 2:3]
        dt = arcs[:, 4:5]
        th = arcs[:, 3:4] + dt * _ARC_T
        a_sin = a * np.sin(th)
        np.add(arcs[:, 1:2], a_sin, out=r[split:].reshape(shape))
        np.add(arcs[:, 0:1], a * np.cos(th), out=z[split:].reshape(shape))
        np.multiply(a_sin, -dt * _ARC_W, out=wdz[split:].reshape(shape))
        np.multiply(a * np.abs(dt), _ARC_W, out=wds[split:].reshape(shape))
    return z, r, wdz, wds


def _sums(lines: np.ndarray, arcs: np.ndarray, r_cut: float) -> SectionIntegrals:
    """The Green's-theorem sums over line and arc pieces that lie wholly at r ≥ r_cut.

    Row k of ``g`` is G_k with ∂G_k/∂r the k-th integrand, zero on r = r_cut;
    each section integral is −∮ G_k dz.
    """
    z, r, wdz, wds = _nodes(lines, arcs)
    c = r_cut
    r2 = r * r
    g = np.empty((6, r.size))
    if c:
        g[0] = r - c
        g[1] = 0.5 * (r2 - c * c)
        g[4] = 0.25 * (r2 * r2 - c**4)
    else:
        g[0] = r
        g[1] = 0.5 * r2
        g[4] = 0.25 * (r2 * r2)
    np.multiply(g[0], z, out=g[2])
    np.multiply(g[1], z, out=g[3])
    np.multiply(g[3], z, out=g[5])
    a, r1, z1, rz, r3, rz2 = (-(g @ wdz)).tolist()
    return SectionIntegrals(a, r1, z1, rz, r3, rz2, 2 * math.pi * float(r @ wds))


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


def _clip_pieces(profile: Profile, r_cut: float) -> tuple[np.ndarray, np.ndarray]:
    """The loop cut at every crossing of r = r_cut, keeping the pieces that lie at r ≥ r_cut."""
    lines: list[float] = []
    arcs: list[float] = []
    for s in profile.segments:
        if not isinstance(s, Arc):
            (z0, r0), (z1, r1) = s.start, s.end
            ts = [0.0, 1.0]
            if (r0 - r_cut) * (r1 - r_cut) < 0:
                ts.insert(1, (r_cut - r0) / (r1 - r0))
            for ta, tb in zip(ts, ts[1:]):
                pa = (z0 + (z1 - z0) * ta, r0 + (r1 - r0) * ta)
                pb = (z0 + (z1 - z0) * tb, r0 + (r1 - r0) * tb)
                if (pa[1] + pb[1]) / 2 > r_cut:
                    lines += (*pa, *pb)
        else:
            zc, rc = s.center
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
                mid = s.start_angle + s.sweep * (fa + fb) / 2
                if rc + s.radius * math.sin(mid) > r_cut:
                    _add_arc(arcs, zc, rc, s.radius, s.start_angle + s.sweep * fa, s.sweep * (fb - fa))
    return np.array(lines, dtype=float).reshape(-1, 4), np.array(arcs, dtype=float).reshape(-1, 5)


def clipped_section_integrals(profile: Profile, r_cut: float) -> SectionIntegrals:
    """Exact section integrals of the part of the profile at r ≥ ``r_cut`` (the rim band).

    ``surface`` counts only the loop's own turned surface above the cut, not the
    cut itself. Returns all zeros when nothing lies above the cut.

    >>> from yodraft.geometry import Profile
    >>> s = clipped_section_integrals(Profile.from_points([(0, 0), (2, 0), (2, 3), (0, 3)]), 1.0)
    >>> round(s.a, 12)
    4.0
    """
    if not (math.isfinite(r_cut) and r_cut >= 0):
        raise ValueError(f"cut radius must be a finite value ≥ 0, got {r_cut}")
    if profile.bounds()[1] < -_R_TOL or not profile.signed_area() > 0:
        raise ValueError("the profile must be a counter-clockwise loop at r ≥ 0")
    lines, arcs = _clip_pieces(profile, r_cut)
    if not len(lines) and not len(arcs):
        return SectionIntegrals(0.0, 0.0, 0.0, 0.0, 0.0, 0.0, 0.0)
    return _sums(lines, arcs, r_cut)


# --------------------------------------------------------------------- bodies


def props_from_integrals(s: SectionIntegrals, density_g_cm3: float) -> BodyProps:
    """Body properties of the section integrals ``s`` turned once about the spin axis.

    Izz = ρ 2π ∫r³ dA; Ixx about z = 0 is ½ Izz + ∫z² dm = ρ π ∫(r³ + 2 r z²) dA.
    """
    if not (math.isfinite(density_g_cm3) and density_g_cm3 > 0):
        raise ValueError(f"density must be a finite value > 0 g/cm³, got {density_g_cm3}")
    rho = density_g_cm3 * G_PER_MM3_PER_G_CM3
    volume = 2 * math.pi * s.r1
    mass = rho * volume
    zc = s.rz / s.r1 if s.r1 > 0 else 0.0
    izz = rho * 2 * math.pi * s.r3
    ixx = rho * math.pi * (s.r3 + 2 * s.rz2)
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


def assemble(half: BodyProps, parts: Sequence[PointPart]) -> AssemblyProps:
    """Two halves (``half`` on +z and its mirror on −z) plus the small parts.

    Every part's transverse inertia is moved to z = 0 by the parallel-axis
    theorem. Parts with the same name are counted together in the budget.
    """
    parts = tuple(parts)
    total = 2 * half.mass_g + sum(p.mass_g for p in parts)
    izz = 2 * half.izz_g_mm2 + sum(p.izz_g_mm2 for p in parts)
    ixx = 2 * half.ixx_g_mm2 + sum(p.ixx_g_mm2 for p in parts)
    zc = sum(p.mass_g * p.z_mm for p in parts) / total if total > 0 else 0.0
    budget = [BudgetLine("half", 2, half.mass_g, 2 * half.mass_g)]
    seen: dict[str, list[PointPart]] = {}
    for p in parts:
        seen.setdefault(p.name, []).append(p)
    for name, group in seen.items():
        m = sum(p.mass_g for p in group)
        budget.append(BudgetLine(name, len(group), m / len(group), m))
    return AssemblyProps(half, parts, total, izz, ixx, zc, tuple(budget))
