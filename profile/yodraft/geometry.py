"""Exact profile geometry: lines, circular arcs and the closed loop they make.

Points are ``(z, r)`` tuples in millimetres: z along the spin axis from the gap
plane outward, r from the spin axis. A Profile is one closed, counter-clockwise
loop; flattening (for shapely and previews) is the only approximation.

>>> square = Profile.from_points([(0, 1), (1, 1), (1, 2), (0, 2)])
>>> round(square.signed_area(), 12)
1.0
"""
from __future__ import annotations

import functools
import math
from itertools import chain, compress, repeat
from operator import attrgetter, lt
from dataclasses import dataclass, field
from typing import TYPE_CHECKING, NamedTuple, Union

if TYPE_CHECKING:  # pragma: no cover
    import numpy as np
    import shapely


__all__ = ["Point", "Line", "Arc", "Segment", "Profile", "FilletVertex", "fillet_loop", "arc_through", "GeometryError"]

Point = tuple[float, float]
CLOSE_TOL_MM = 1e-6  # ends closer than this meet


class GeometryError(ValueError):
    """Geometry that cannot be composed (an open loop, a fillet that does not fit)."""


_new_tuple = tuple.__new__
_START, _END = attrgetter("start"), attrgetter("end")  # a segment's ends, read in C
_dist = math.dist  # distance between two points (the same sum as math.hypot of the differences)


class Line(NamedTuple):
    """A straight segment from ``start`` to ``end`` (a NamedTuple: a sweep makes one per edge per variant)."""

    start: Point
    end: Point

    @property
    def length(self) -> float:
        return _dist(self.start, self.end)

    def points(self, tol: float = 0.01) -> list[Point]:
        """Start point only; the next segment supplies the end."""
        return [self.start]

    def reversed(self) -> "Line":
        return Line(self.end, self.start)

    def mirrored(self) -> "Line":
        """Mirror about the spin axis (r → −r)."""
        return Line((self.start[0], -self.start[1]), (self.end[0], -self.end[1]))


@dataclass(frozen=True)
class Arc:
    """A circular arc: centre, radius, start angle and signed sweep (radians, + is CCW)."""

    center: Point
    radius: float
    start_angle: float
    sweep: float
    #: the end points, worked out once from the fields above
    start: Point = field(init=False, repr=False, compare=False)
    end: Point = field(init=False, repr=False, compare=False)
    #: the sine and cosine of the start and end angles, (sin θ0, cos θ0, sin θ1, cos θ1), that the end points
    #: were worked out from (the mass integrals read them again)
    trig: tuple[float, float, float, float] = field(init=False, repr=False, compare=False)

    def __post_init__(self) -> None:
        if not (self.radius > 0 and math.isfinite(self.radius)):
            raise GeometryError(f"arc radius must be positive, got {self.radius}")
        if not (0 < abs(self.sweep) <= 2 * math.pi):
            raise GeometryError(f"arc sweep must be in (0, 2π], got {self.sweep}")
        t0, t1 = self.start_angle, self.end_angle
        trig = (math.sin(t0), math.cos(t0), math.sin(t1), math.cos(t1))
        (zc, rc), a = self.center, self.radius
        object.__setattr__(self, "start", (zc + a * trig[1], rc + a * trig[0]))  # point_at(t0)
        object.__setattr__(self, "end", (zc + a * trig[3], rc + a * trig[2]))  # point_at(t1)
        object.__setattr__(self, "trig", trig)

    def point_at(self, angle: float) -> Point:
        return (self.center[0] + self.radius * math.cos(angle), self.center[1] + self.radius * math.sin(angle))

    @property
    def end_angle(self) -> float:
        return self.start_angle + self.sweep

    @property
    def length(self) -> float:
        return self.radius * abs(self.sweep)

    @property
    def bulge(self) -> float:
        """DXF polyline bulge of this arc: tan(sweep / 4), positive for CCW."""
        return math.tan(self.sweep / 4)

    def points(self, tol: float = 0.01) -> list[Point]:
        """Start point and interior points with chord error at most ``tol``."""
        return list(self.flattened(tol))

    def flattened(self, tol: float) -> tuple[Point, ...]:
        """What ``points(tol)`` gives, kept on the arc for the last ``tol`` asked (a sweep reuses unchanged arcs)."""
        kept = self.__dict__.get("_flattened")
        if kept is not None and kept[0] == tol:
            return kept[1]
        step = 2 * math.acos(max(-1.0, 1 - tol / self.radius)) if tol < self.radius else math.pi / 2
        n = max(2, math.ceil(abs(self.sweep) / max(step, 1e-6)))
        (zc, rc), a, t0, sweep = self.center, self.radius, self.start_angle, self.sweep
        cos, sin = math.cos, math.sin
        pts = tuple((zc + a * cos(t), rc + a * sin(t)) for t in [t0 + sweep * i / n for i in range(n)])
        self.__dict__["_flattened"] = (tol, pts)  # a cache, not a field: equality and hashing ignore it
        return pts

    @functools.cached_property
    def extent(self) -> tuple[float, float, float, float]:
        """(z_min, r_min, z_max, r_max) of the start point and every quarter-turn direction the arc passes.

        The end is the next segment's start, so a loop's bounds are exact from these.
        """
        zs, rs = [self.start[0]], [self.start[1]]
        lo, hi = sorted((self.start_angle, self.end_angle))
        k = math.ceil(lo / (math.pi / 2))
        while k * math.pi / 2 < hi:
            z, r = self.point_at(k * math.pi / 2)
            zs.append(z)
            rs.append(r)
            k += 1
        return min(zs), min(rs), max(zs), max(rs)

    def reversed(self) -> "Arc":
        return Arc(self.center, self.radius, self.end_angle, -self.sweep)

    def mirrored(self) -> "Arc":
        return Arc((self.center[0], -self.center[1]), self.radius, -self.start_angle, -self.sweep)


Segment = Union[Line, Arc]


@dataclass(frozen=True)
class Profile:
    """One closed loop of lines and arcs in the (z, r) half-plane.

    ``segment_ends`` are every segment's start points and end points, two lists in loop order, kept from the
    check that the loop closes (the batched checks stack them). ``checks.loop_stacks`` also leaves on the loop
    the stack and row it put the loop in (``_stacked``), where the batched mass finds its ends again.
    """

    segments: tuple[Segment, ...]
    segment_ends: tuple[list[Point], list[Point]] = field(init=False, repr=False, compare=False)

    def __post_init__(self) -> None:
        if len(self.segments) < 2:
            raise GeometryError("a profile needs at least two segments")
        segs = self.segments
        starts, ends = list(map(_START, segs)), list(map(_END, segs))
        following = starts[1:] + starts[:1]  # the start of the segment after each
        if max(map(_dist, ends, following)) > CLOSE_TOL_MM:
            end, start = next((a, b) for a, b in zip(ends, following) if _dist(a, b) > CLOSE_TOL_MM)
            raise GeometryError(f"loop is open between {end} and {start}")
        self.__dict__["segment_ends"] = (starts, ends)  # not a field (equality ignores it): see the class docstring

    @classmethod
    def from_points(cls, points: list[Point]) -> "Profile":
        """A polygon profile through ``points`` (closed automatically)."""
        pts = [(float(z), float(r)) for z, r in points]
        return cls(tuple(Line(a, b) for a, b in zip(pts, pts[1:] + pts[:1])))

    def flatten(self, tol: float = 0.01) -> list[Point]:
        """Polygon vertices approximating the loop within ``tol`` mm (not closed)."""
        out: list[Point] = []
        for seg in self.segments:
            if isinstance(seg, Line):
                out.append(seg.start)  # what Line.points gives, without the call
            else:
                out.extend(seg.flattened(tol))
        return out

    def flat_array(self, tol: float = 0.01) -> "np.ndarray":
        """``flatten(tol)`` as a read-only (n, 2) array, kept for the last ``tol`` asked (the loop checks
        ask three times about the same loop)."""
        kept = self.__dict__.get("_flat_array")
        if kept is not None and kept[0] == tol:
            return kept[1]
        import numpy as np  # imported where used: the quick commands never load it
        points = self.flatten(tol)
        flat = np.fromiter(chain.from_iterable(points), float, 2 * len(points)).reshape(-1, 2)
        flat.flags.writeable = False
        self.__dict__["_flat_array"] = (tol, flat)  # a cache, not a field: equality and hashing ignore it
        return flat

    @functools.cached_property
    def end_points(self) -> tuple["np.ndarray", "np.ndarray"]:
        """Every segment's start and end point as two read-only (n, 2) arrays, in loop order."""
        import numpy as np  # imported where used: the quick commands never load it
        n = len(self.segments)
        starts = np.fromiter(chain.from_iterable(s.start for s in self.segments), float, 2 * n).reshape(-1, 2)
        # an arc's end may stray a rounding from the next segment's start
        ends = np.fromiter(chain.from_iterable(s.end for s in self.segments), float, 2 * n).reshape(-1, 2)
        starts.flags.writeable = ends.flags.writeable = False
        return starts, ends

    def polygon(self, tol: float = 0.005) -> "shapely.Polygon":
        """A shapely polygon of the flattened loop."""
        import shapely  # imported where used: the quick commands never load it
        return shapely.polygons(self.flat_array(tol))

    def signed_area(self) -> float:
        """Exact signed area (positive for a counter-clockwise loop), by Green's theorem."""
        return self._signed_area

    @functools.cached_property
    def _signed_area(self) -> float:
        total = 0.0
        for seg in self.segments:
            (z0, r0), (z1, r1) = seg.start, seg.end
            total += 0.5 * (z0 * r1 - z1 * r0)
            if isinstance(seg, Arc):
                # the circular segment between chord and arc
                total += 0.5 * seg.radius**2 * (seg.sweep - math.sin(seg.sweep))
        return total

    @functools.cached_property
    def _bounds(self) -> tuple[float, float, float, float]:
        zs: list[float] = []
        rs: list[float] = []
        for seg in self.segments:
            if isinstance(seg, Arc):
                z_lo, r_lo, z_hi, r_hi = seg.extent
                zs += (z_lo, z_hi)
                rs += (r_lo, r_hi)
            else:
                zs.append(seg.start[0])
                rs.append(seg.start[1])
        return min(zs), min(rs), max(zs), max(rs)

    def bounds(self) -> tuple[float, float, float, float]:
        """Exact (z_min, r_min, z_max, r_max), arcs included."""
        return self._bounds

    def mirrored(self) -> "Profile":
        """The mirror image about the spin axis, reversed so it is again counter-clockwise."""
        return Profile(tuple(s.mirrored().reversed() for s in reversed(self.segments)))

    def translated(self, dz: float) -> "Profile":
        """The loop moved ``dz`` along the axis."""
        moved: list[Segment] = []
        for s in self.segments:
            if isinstance(s, Line):
                moved.append(Line((s.start[0] + dz, s.start[1]), (s.end[0] + dz, s.end[1])))
            else:
                moved.append(Arc((s.center[0] + dz, s.center[1]), s.radius, s.start_angle, s.sweep))
        return Profile(tuple(moved))


class FilletVertex(NamedTuple):
    """A loop corner, optionally rounded with ``radius``; ``owner`` names the feature.parameter of the radius.

    ``sweep`` (radians, + counter-clockwise) makes the edge from this corner to the next a circular
    arc of that signed sweep instead of a line; a corner next to such an arc is not rounded.
    A NamedTuple rather than a dataclass: a sweep makes one per corner per variant.
    """

    point: Point
    radius: float = 0.0
    owner: str = ""
    sweep: float = 0.0


def arc_through(start: Point, end: Point, sweep: float) -> Arc:
    """The circular arc from ``start`` to ``end`` turning through the signed ``sweep`` (radians, + CCW).

    >>> a = arc_through((1.0, 0.0), (0.0, 1.0), math.pi / 2)
    >>> round(a.radius, 12), [round(c, 12) + 0.0 for c in a.center]
    (1.0, [0.0, 0.0])
    """
    half_chord = _dist(start, end) / 2
    if half_chord <= 0 or not (0 < abs(sweep) < 2 * math.pi):
        raise GeometryError("an arc needs two distinct ends and a sweep below a full turn")
    mz, mr = (start[0] + end[0]) / 2, (start[1] + end[1]) / 2
    nz, nr = -(end[1] - start[1]) / (2 * half_chord), (end[0] - start[0]) / (2 * half_chord)  # left normal of the chord
    off = half_chord / math.tan(sweep / 2)
    center = (mz + nz * off + 0.0, mr + nr * off + 0.0)
    radius = half_chord / abs(math.sin(sweep / 2))
    return Arc(center, radius, math.atan2(start[1] - center[1], start[0] - center[0]), sweep)


@functools.lru_cache(maxsize=4096)  # a sweep or a watch rebuilds the same corners again and again
def _fillet(prev: Point, here: Point, nxt: Point, radius: float) -> tuple[float, Point, Point, Arc] | None:
    """The fillet of ``radius`` tangent to both edges at corner ``here``: its tangent length, tangent points and arc.

    None when the edges are straight on or fold back (nothing to round).
    """
    l1, l2 = _dist(prev, here), _dist(nxt, here)
    u1 = ((prev[0] - here[0]) / l1, (prev[1] - here[1]) / l1)
    u2 = ((nxt[0] - here[0]) / l2, (nxt[1] - here[1]) / l2)
    cos_full = max(-1.0, min(1.0, u1[0] * u2[0] + u1[1] * u2[1]))
    half = math.acos(cos_full) / 2
    if half < 1e-6 or half > math.pi / 2 - 1e-6:
        return None
    t = radius / math.tan(half)
    bis = (u1[0] + u2[0], u1[1] + u2[1])
    bl = math.hypot(*bis)
    center = (here[0] + bis[0] / bl * radius / math.sin(half), here[1] + bis[1] / bl * radius / math.sin(half))
    t1 = (here[0] + u1[0] * t, here[1] + u1[1] * t)
    t2 = (here[0] + u2[0] * t, here[1] + u2[1] * t)
    turn = (here[0] - prev[0]) * (nxt[1] - here[1]) - (here[1] - prev[1]) * (nxt[0] - here[0])
    sweep = (math.pi - 2 * half) * (1 if turn > 0 else -1)
    a0 = math.atan2(t1[1] - center[1], t1[0] - center[0])
    return t, t1, t2, Arc(center, radius, a0, sweep)


def _tangent(arc: Arc | None, a: Point, b: Point, at_end: bool) -> Point:
    """Unit direction of travel along an edge (a line from ``a`` to ``b``, or ``arc``) at its end or start."""
    if arc is None:
        length = _dist(a, b)
        return ((b[0] - a[0]) / length, (b[1] - a[1]) / length)
    angle = arc.end_angle if at_end else arc.start_angle
    sign = 1.0 if arc.sweep > 0 else -1.0
    return (-sign * math.sin(angle), sign * math.cos(angle))


def _offset_hits(here: Point, t_in: Point, t_out: Point, arc_in: Arc | None, arc_out: Arc | None, side: float,
                 radius: float) -> list[Point]:
    """Where the two edges' curves, each moved ``radius`` toward the inside of the turn, cross."""
    curves = []
    for arc, t in ((arc_in, t_in), (arc_out, t_out)):
        if arc is None:
            normal = (-t[1] * side, t[0] * side)
            curves.append(("line", (here[0] + radius * normal[0], here[1] + radius * normal[1]), t))
        else:
            toward_centre = (side > 0) == (arc.sweep > 0)
            r = arc.radius - radius if toward_centre else arc.radius + radius
            if r <= 1e-12:
                return []
            curves.append(("circle", arc.center, r))
    (k1, a1, b1), (k2, a2, b2) = curves
    if k1 == "line" and k2 == "line":
        return []
    if k1 == "line" or k2 == "line":
        (_, p0, t), (_, c, r) = ((k1, a1, b1), (k2, a2, b2)) if k1 == "line" else ((k2, a2, b2), (k1, a1, b1))
        fz, fr = p0[0] - c[0], p0[1] - c[1]
        half_b = fz * t[0] + fr * t[1]
        disc = half_b * half_b - (fz * fz + fr * fr - r * r)
        if disc < 0:
            return []
        root = math.sqrt(disc)
        return [(p0[0] + lam * t[0], p0[1] + lam * t[1]) for lam in (-half_b - root, -half_b + root)]
    (c1, r1), (c2, r2) = (a1, b1), (a2, b2)
    d = _dist(c1, c2)
    if d < 1e-12 or d > r1 + r2 or d < abs(r1 - r2):
        return []
    along = (d * d + r1 * r1 - r2 * r2) / (2 * d)
    h = math.sqrt(max(0.0, r1 * r1 - along * along))
    ez, er = (c2[0] - c1[0]) / d, (c2[1] - c1[1]) / d
    mz, mr = c1[0] + along * ez, c1[1] + along * er
    return [(mz - h * er, mr + h * ez), (mz + h * er, mr - h * ez)]


def _foot(arc: Arc | None, a: Point, b: Point, centre: Point) -> Point:
    """Where the fillet round ``centre`` touches the edge (a line from ``a`` to ``b``, or ``arc``)."""
    if arc is None:
        length = _dist(a, b)
        t = ((b[0] - a[0]) / length, (b[1] - a[1]) / length)
        lam = (centre[0] - a[0]) * t[0] + (centre[1] - a[1]) * t[1]
        return (a[0] + lam * t[0], a[1] + lam * t[1])
    d = _dist(centre, arc.center)
    return (arc.center[0] + arc.radius * (centre[0] - arc.center[0]) / d,
            arc.center[1] + arc.radius * (centre[1] - arc.center[1]) / d)


def _taken(arc: Arc | None, a: Point, b: Point, foot: Point, from_end: bool) -> float | None:
    """How much of the edge (length of a line, angle of an arc) lies between ``foot`` and the corner; None when
    the foot falls off the edge."""
    if arc is None:
        length = _dist(a, b)
        t = ((b[0] - a[0]) / length, (b[1] - a[1]) / length)
        lam = (foot[0] - a[0]) * t[0] + (foot[1] - a[1]) * t[1]
        taken = length - lam if from_end else lam
        return taken if -1e-9 <= taken <= length + 1e-9 else None
    sign = 1.0 if arc.sweep > 0 else -1.0
    angle = math.atan2(foot[1] - arc.center[1], foot[0] - arc.center[0])
    corner = arc.end_angle if from_end else arc.start_angle
    taken = ((corner - angle) * sign if from_end else (angle - corner) * sign) % (2 * math.pi)
    return taken if taken <= abs(arc.sweep) + 1e-9 else None


def _fillet_next_to_arc(prev: Point, here: Point, nxt: Point, arc_in: Arc | None, arc_out: Arc | None,
                        radius: float) -> tuple[float, float, Point, Point, Arc] | None | bool:
    """The fillet of ``radius`` at corner ``here`` where one edge or both are arcs: how much of each edge it
    takes, its tangent points and its arc; None when the edges already meet tangent (nothing to round),
    False when no fillet of that radius touches both edges."""
    t_in = _tangent(arc_in, prev, here, True)
    t_out = _tangent(arc_out, here, nxt, False)
    turn = t_in[0] * t_out[1] - t_in[1] * t_out[0]
    if abs(turn) < 1e-9 and t_in[0] * t_out[0] + t_in[1] * t_out[1] > 0:
        return None
    side = 1.0 if turn > 0 else -1.0
    hits = _offset_hits(here, t_in, t_out, arc_in, arc_out, side, radius)
    if not hits:
        return False
    centre = min(hits, key=lambda q: _dist(q, here))
    f_in, f_out = _foot(arc_in, prev, here, centre), _foot(arc_out, here, nxt, centre)
    took_in, took_out = _taken(arc_in, prev, here, f_in, True), _taken(arc_out, here, nxt, f_out, False)
    if took_in is None or took_out is None:
        return False
    a0 = math.atan2(f_in[1] - centre[1], f_in[0] - centre[0])
    a1 = math.atan2(f_out[1] - centre[1], f_out[0] - centre[0])
    sweep = ((a1 - a0) * side) % (2 * math.pi) * side
    if abs(sweep) < 1e-12:
        return None
    return took_in, took_out, f_in, f_out, Arc(centre, radius, a0, sweep)


_sweep, _radius, _point = attrgetter("sweep"), attrgetter("radius"), attrgetter("point")  # a corner's, read in C


def _straight_loop(vertices: list[FilletVertex], pts: list[Point], edge: list[float]) -> tuple[Profile, list[str]] | None:
    """``fillet_loop`` of a loop of straight edges whose every fillet fits its edges (a sweep's usual loop), in
    fewer passes; None when a fillet does not fit, which the general pass sorts out."""
    n = len(pts)
    starts, ends = pts[:], pts[1:] + pts[:1]  # edge i runs from corner i to corner i + 1, until a fillet trims it
    arc_after: list[Arc | None] = [None] * n  # the fillet at the end of edge i
    trim = [0.0] * n  # how much of each of its two edges the fillet at corner i takes
    rounded = []
    radii = list(map(_radius, vertices))
    for i in compress(range(n), map(lt, repeat(0.0), radii)):  # the corners with a radius above 0
        plan = _fillet(pts[i - 1], pts[i], ends[i], radii[i])
        if plan is not None:
            trim[i], ends[i - 1], starts[i], arc_after[i - 1] = plan
            rounded.append(i)
    for i in rounded:  # the fillets at both ends of an edge must fit on it together
        if trim[i - 1] + trim[i] > edge[i - 1] + 1e-9 or trim[i] + trim[(i + 1) % n] > edge[i] + 1e-9:
            return None
    segments: list[Segment] = []
    add = segments.append
    # Line(start, end) for every edge, made without the constructor's call
    for line, length, arc in zip(map(_new_tuple, repeat(Line, n), zip(starts, ends)), map(_dist, starts, ends), arc_after):
        if length > 1e-9:
            add(line)
        if arc is not None:
            add(arc)
    return Profile(tuple(segments)), []


def fillet_loop(vertices: list[FilletVertex]) -> tuple[Profile, list[str]]:
    """Compose a closed loop through ``vertices``, rounding each corner that has a radius.

    The sharp corner stays the dimensioned (theoretical) point; the fillet is
    tangent to both edges. Returns the profile and the owners of radii that do
    not fit on their edges (those corners are left sharp).
    """
    pts = list(map(_point, vertices))
    edge = list(map(_dist, pts, pts[1:] + pts[:1]))  # edge i runs from corner i to corner i + 1
    if min(edge, default=0.0) <= 1e-9:
        # drop repeated points so every edge has a direction
        pts = [p for p, length in zip(pts, edge) if length > 1e-9]
        vertices = [v for v, length in zip(vertices, edge) if length > 1e-9]
        edge = list(map(_dist, pts, pts[1:] + pts[:1]))
    n = len(vertices)
    if n < 3:
        raise GeometryError("a loop needs at least three distinct corners")
    arc_edges = any(map(_sweep, vertices))
    if not arc_edges:
        straight = _straight_loop(vertices, pts, edge)
        if straight is not None:
            return straight
    if arc_edges:
        arcs = [arc_through(pts[i], pts[(i + 1) % n], v.sweep) if v.sweep else None for i, v in enumerate(vertices)]
        measure = [abs(a.sweep) if a is not None else edge[i] for i, a in enumerate(arcs)]  # angle along an arc edge
    else:
        arcs, measure = [None] * n, edge
    trim_in = [0.0] * n  # how much of edge i - 1 the fillet at corner i takes, at its end
    trim_out = [0.0] * n  # how much of edge i it takes, at its start
    plans: list[tuple[Point, Point, Arc] | None] = [None] * n
    misfits: list[str] = []
    for i, v in enumerate(vertices):
        if v.radius <= 0:
            continue
        if v.sweep or vertices[i - 1].sweep:
            general = _fillet_next_to_arc(pts[i - 1], pts[i], pts[(i + 1) % n], arcs[i - 1], arcs[i], v.radius)
            if general is False:
                misfits.append(v.owner or f"corner {i}")
            elif general is not None:
                trim_in[i], trim_out[i], plans[i] = general[0], general[1], general[2:]
            continue
        plan = _fillet(pts[i - 1], pts[i], pts[(i + 1) % n], v.radius)
        if plan is not None:
            trim_in[i] = trim_out[i] = plan[0]
            plans[i] = plan[1:]
    for i in range(n):
        j = (i + 1) % n
        if trim_out[i] + trim_in[j] > measure[i] + 1e-9:
            for k in (i, j):
                if plans[k] is not None:
                    misfits.append(vertices[k].owner or f"corner {k}")
                    plans[k] = None
                    trim_in[k] = trim_out[k] = 0.0
    segments: list[Segment] = []
    for i in range(n):
        j = (i + 1) % n
        start = plans[i][1] if plans[i] else pts[i]
        end = plans[j][0] if plans[j] else pts[j]
        arc = arcs[i]
        if arc is not None:
            sign = 1.0 if arc.sweep > 0 else -1.0
            left = abs(arc.sweep) - trim_out[i] - trim_in[j]
            if left > 1e-12:
                segments.append(Arc(arc.center, arc.radius, arc.start_angle + sign * trim_out[i], sign * left))
        elif _dist(start, end) > 1e-9:
            segments.append(Line(start, end))
        if plans[j]:
            segments.append(plans[j][2])
    return Profile(tuple(segments)), sorted(set(misfits))
