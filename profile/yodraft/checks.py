"""Named checks: each says which feature and parameter it judges, and whether it passed."""
from __future__ import annotations

import functools
import math
from itertools import chain, repeat
from operator import attrgetter, is_, itemgetter
from collections.abc import Iterable, Mapping, Sequence
from typing import TYPE_CHECKING, Any, NamedTuple


if TYPE_CHECKING:  # pragma: no cover
    import numpy as np

    from .geometry import Point, Profile

__all__ = ["Check", "check", "radial_order", "wall_checks", "loop_checks", "surface_walls", "thin_walls", "axis_wall",
           "crossing_free", "turning_checks", "datum_face_check", "LoopStack", "loop_stacks", "prime_areas_and_bounds",
           "reentrant_regions", "Reentrant"]


class Check(NamedTuple):
    """One rule applied to a design: ``feature.parameter`` is what to change when it fails.

    A NamedTuple rather than a dataclass: a sweep makes tens of thousands, and this is the cheapest to build.
    """

    name: str
    feature: str
    parameter: str
    ok: bool
    message: str

    def as_dict(self) -> dict[str, object]:
        return {"name": self.name, "feature": self.feature, "parameter": self.parameter, "ok": self.ok,
                "message": self.message}


def check(name: str, where: str, ok: bool, message: str) -> Check:
    """A Check for ``where`` = "feature.parameter".

    >>> check("gap below bearing width", "bearing_seat.wall_offset", True, "gap 4.363 mm").feature
    'bearing_seat'
    """
    feature, _, parameter = where.partition(".")
    return _new_check((name, feature, parameter, bool(ok), message))


#: ``Check(*fields)`` made without the constructor's Python call (a sweep makes tens of thousands)
_new_check = functools.partial(tuple.__new__, Check)


# ---------------------------------------------------------------- rules over the whole half

#: diameters that must grow from the axis outward, as (feature, parameter)
RADIAL_ORDER: tuple[tuple[str, str], ...] = (
    ("axle_bore", "major_diameter"),
    ("bearing_seat", "post_diameter"),
    ("bearing_seat", "seat_face_diameter"),
    ("bearing_seat", "wall_bore"),
    ("pad_groove", "inner_diameter"),
    ("pad_groove", "outer_diameter"),
    ("catch_zone", "start_diameter"),
    ("rim", "diameter"),
)
#: inner-side chunks whose distance to the cup is a wall, and the parameter that moves it
BACK_WALLS: tuple[tuple[str, str, str], ...] = (
    ("axle_bore", "bore", "rim.cup_depth"),
    ("vent_groove", "groove", "rim.cup_depth"),
    ("pad_groove", "groove", "rim.cup_depth"),
    ("catch_zone", "surface", "rim.thickness"),
)


def radial_order(values: Mapping[str, Any], messages: bool = True) -> list[Check]:
    """Each diameter must lie outside the one before it (post < vent groove < wall < pad groove < catch zone < rim).

    ``messages=False`` (a sweep, which reports only which checks fail) words only the failed checks.
    """
    out = []
    for name, inner, outer, feature, parameter in _RADIAL_PAIRS:
        inner_value, outer_value = values[inner], values[outer]
        ok = bool(outer_value > inner_value + 1e-9)
        out.append(_new_check((name, feature, parameter, ok,
                               f"Ø{outer_value:.3f} mm must exceed {inner} Ø{inner_value:.3f} mm" if messages or not ok
                               else "")))
    return out


#: each neighbouring pair of RADIAL_ORDER as (check name, inner key, outer key, outer feature, outer parameter)
_RADIAL_PAIRS = tuple((f"radial order: {fb}.{pb} outside {fa}.{pa}", f"{fa}.{pa}", f"{fb}.{pb}", fb, pb)
                      for (fa, pa), (fb, pb) in zip(RADIAL_ORDER, RADIAL_ORDER[1:]))


@functools.lru_cache(maxsize=1024)  # a sweep measures from the same unchanged surfaces again and again
def _polyline(points: tuple[Point, ...]) -> "shapely.Geometry":
    """A shapely line through ``points`` (a point when there is only one)."""
    import numpy as np  # imported where used: the quick commands never load it
    import shapely  # imported where used: the quick commands never load it
    return shapely.linestrings(np.asarray(points)) if len(points) > 1 else shapely.points(points[0])


def wall_checks(values: Mapping[str, Any], chunks: Mapping[str, Sequence[Point]], min_wall: float,
                back_walls: bool = True, messages: bool = True) -> list[Check]:
    """Least material between neighbouring surfaces, against the shop's thinnest wall.

    ``back_walls=False`` leaves out the walls measured to the rim's cup (a given outer shape has
    no such chunk; ``surface_walls`` measures it); ``messages=False`` words only the failed checks.
    """
    post_wall = (values["bearing_seat.post_diameter"] - values["axle_bore.major_diameter"]) / 2
    bearing_wall = (values["pad_groove.inner_diameter"] - values["bearing_seat.wall_bore"]) / 2
    post_ok, bearing_ok = post_wall >= min_wall - 1e-9, bearing_wall >= min_wall - 1e-9
    out = [
        check("wall between axle bore and post", "axle_bore.thread", post_ok,
              f"{post_wall:.3f} mm from thread major diameter to post, least {min_wall:.3f} mm"
              if messages or not post_ok else ""),
        check("bearing wall thickness", "pad_groove.inner_diameter", bearing_ok,
              f"{bearing_wall:.3f} mm between wall bore and pad groove, least {min_wall:.3f} mm"
              if messages or not bearing_ok else ""),
    ]
    if not back_walls:
        return out
    cup = _polyline(tuple(chunks["rim.outer"][:-1]))  # the cup surface, without the outer edge
    for feature, chunk, where, name in _BACK_WALL_CHECKS:
        wall = float(_polyline(tuple(chunks[chunk])).distance(cup))
        ok = wall >= min_wall - 1e-9
        out.append(check(name, where, ok, f"{wall:.3f} mm, least {min_wall:.3f} mm" if messages or not ok else ""))
    return out


#: the (feature, chunk) pairs whose points ``wall_checks`` reads: the rim's cup and the back walls' chunks
WALL_CHUNKS = (("rim", "outer"),) + tuple((feature, chunk) for feature, chunk, _ in BACK_WALLS)
#: BACK_WALLS as (feature, its chunk's key, parameter, check name)
_BACK_WALL_CHECKS = tuple((feature, f"{feature}.{chunk}", where, f"wall between {feature.replace('_', ' ')} and cup")
                          for feature, chunk, where in BACK_WALLS)


#: the checks a half must pass before its mass can be integrated (one simple loop, none of it below the axis,
#: an axle of positive length, and every part's seat cut into the body: a part with no seat would overlap it)
ANALYSIS_PREREQUISITES = frozenset({"closed simple loop", "above the spin axis", "axle reaches both halves",
                                    "ring seat on the body"})

#: chord error of the flattened loop whose topology is checked: far below any wall the rules allow
LOOP_CHECK_TOLERANCE = 0.02


def loop_checks(profile: "Profile | None", envelope: Mapping[str, Any], misfits: Sequence[str],
                uncrossed: bool | None = None, messages: bool = True) -> list[Check]:
    """The loop is one simple counter-clockwise polygon, inside the envelope box, with every radius fitting.

    ``uncrossed`` is whether the flattened loop is a simple ring, when already found (``crossing_free``);
    ``messages=False`` words only the failed checks.
    """
    if profile is None:
        return [check("closed simple loop", "profile.loop", False, "the corners do not make a loop")]
    if uncrossed is None:
        uncrossed = crossing_free([profile])[0]
    simple = uncrossed and profile.signed_area() > 0  # a simple ring bounds a valid polygon
    z_min, r_min, z_max, r_max = profile.bounds()
    in_diameter, in_width = 2 * r_max <= envelope["diameter"] + 1e-9, 2 * z_max <= envelope["width"] + 1e-9
    clear, above = z_min >= -1e-9, r_min >= -1e-9
    out = [
        check("closed simple loop", "profile.loop", simple,
              "the half-profile is one simple loop" if simple else "the half-profile crosses itself"),
        check("inside the envelope diameter", "rim.diameter", in_diameter,
              f"outer diameter {2 * r_max:.3f} mm, envelope {envelope['diameter']:.3f} mm" if messages or not in_diameter
              else ""),
        check("inside the envelope width", "rim.overall_width", in_width,
              f"overall width {2 * z_max:.3f} mm, envelope {envelope['width']:.3f} mm" if messages or not in_width
              else ""),
        check("clear of the gap plane", "bearing_seat.spacing", clear,
              f"nearest face at z = {z_min:.3f} mm" if messages or not clear else ""),
        check("above the spin axis", "profile.loop", above,
              f"lowest point at r = {r_min:.3f} mm" if messages or not above else ""),
    ]
    out += [check("radius fits its edges", owner, False, f"{owner} is too large for the edges it joins")
            for owner in misfits]
    return out


# ---------------------------------------------------------------- rules over any outer shape

#: how near (mm) a loop's point must lie to the outer face's plane to be on datum face B (the sheet finds its faces with it)
DATUM_TOL = 1e-6


def datum_face_check(profile: "Profile", face_z: float, where: str, messages: bool = True) -> Check:
    """Datum face B: the outer face is faced first and every axial size is measured from it, so the loop must
    reach the plane z = ``face_z`` and nothing may stand beyond it (a sketch's arc across the face, or the
    corner radii at both its ends, can leave no face there)."""
    starts = profile.segment_ends[0]  # in a closed loop every segment's end is the next one's start
    reached = any(abs(z - face_z) < DATUM_TOL for z, _ in starts)
    z_max = profile.bounds()[2]
    ok = reached and z_max <= face_z + DATUM_TOL
    if ok:
        message = f"the loop reaches the outer face at z = {face_z:.3f} mm" if messages else ""
    elif z_max > face_z + DATUM_TOL:
        message = (f"the loop stands out to z = {z_max:.3f} mm, beyond the outer face at z = {face_z:.3f} mm: "
                   f"datum face B is faced first and would cut it")
    else:
        message = (f"nothing of the loop lies on the outer face at z = {face_z:.3f} mm (the loop reaches "
                   f"z = {z_max:.3f} mm): datum face B needs a face there; give it a straight stretch or smaller "
                   f"corner radii")
    return check("outer face for datum B", where, ok, message)


#: how far (degrees) the line across a wall may lean from each surface's normal and still
#: count as the two surfaces facing each other across metal (a 90° corner's fillet leans 45°)
FACING_DEG = 30.0
_COS_FACING = math.cos(math.radians(FACING_DEG))
_TAN_FACING = math.tan(math.radians(FACING_DEG))
ON_AXIS = 1e-9


def _inward_normal(seg: Any, p: Point) -> tuple[float, float]:
    """The unit normal at ``p`` pointing into the metal (the loop is counter-clockwise: metal on the left)."""
    if hasattr(seg, "center"):
        dz, dr = p[0] - seg.center[0], p[1] - seg.center[1]
        length = math.hypot(dz, dr) or 1.0
        # a counter-clockwise arc has its metal towards the centre, a clockwise one away from it
        sign = -1.0 if seg.sweep > 0 else 1.0
        return (sign * dz / length, sign * dr / length)
    (z0, r0), (z1, r1) = seg.start, seg.end
    length = math.hypot(z1 - z0, r1 - r0) or 1.0
    return (-(r1 - r0) / length, (z1 - z0) / length)


def _on_axis(seg: Any) -> bool:
    return not hasattr(seg, "center") and abs(seg.start[1]) < ON_AXIS and abs(seg.end[1]) < ON_AXIS


def _faces(segs: Sequence[Any], i: int, p: Point, u: tuple[float, float]) -> bool:
    """Whether the direction ``u`` leaves segment ``i`` at ``p`` into the metal, square to it within
    FACING_DEG, or (at a corner where the metal turns more than half a turn) between its two normals."""
    seg = segs[i]
    n = _inward_normal(seg, p)
    if n[0] * u[0] + n[1] * u[1] >= _COS_FACING:
        return True
    for end, other in ((seg.start, segs[i - 1]), (seg.end, segs[(i + 1) % len(segs)])):
        if math.dist(p, end) < 1e-6:
            m = _inward_normal(other, end)
            a, b = (m, n) if end == seg.start else (n, m)  # a then b round the corner in loop order
            reflex = a[0] * b[1] - a[1] * b[0] < 0  # the normals turn clockwise: the metal wraps the corner
            if reflex and (a[0] * u[1] - a[1] * u[0]) <= 1e-9 and (u[0] * b[1] - u[1] * b[0]) <= 1e-9:
                return True
    return False


@functools.lru_cache(maxsize=64)  # a sweep's loops keep their number of surfaces
def _pairs(n: int) -> tuple["np.ndarray", "np.ndarray"]:
    """Every pair (i, j) of a loop's ``n`` surfaces that are not neighbours, in row order (i < j)."""
    import numpy as np  # imported where used: the quick commands never load it
    i, j = np.triu_indices(n, 2)
    keep = ~((i == 0) & (j == n - 1))
    return i[keep], j[keep]


def _ends(profile: "Profile") -> tuple["np.ndarray", "np.ndarray", list[int], "np.ndarray"]:
    """The surfaces' start and end points as (n, 2) arrays, which of them are arcs, and which are
    off the spin axis (``_off_axis``)."""
    starts, ends = profile.end_points
    arcs = [i for i, s in enumerate(profile.segments) if hasattr(s, "center")]
    return starts, ends, arcs, _off_axis(starts, ends, arcs)


def _off_axis(starts: "np.ndarray", ends: "np.ndarray", arcs: Sequence[int]) -> "np.ndarray":
    """Which surfaces, their ends given as (..., n, 2) arrays, are off the spin axis (what ``_on_axis``
    leaves; an arc always is)."""
    import numpy as np  # imported where used: the quick commands never load it
    off = (np.abs(starts[..., 1]) >= ON_AXIS) | (np.abs(ends[..., 1]) >= ON_AXIS)
    off[..., arcs] = True
    return off


def _box_corners(profiles: Sequence["Profile"], starts: "np.ndarray", ends: "np.ndarray",
                 arcs: Sequence[int]) -> tuple["np.ndarray", "np.ndarray"]:
    """Each surface's box as its low and high corners, (B, n, 2) arrays: a line's two ends, an arc's extent
    and end; for B loops of one run of lines and arcs (``arcs`` the arcs' places), their ends given as
    (B, n, 2) arrays."""
    import numpy as np  # imported where used: the quick commands never load it
    lo, hi = np.minimum(starts, ends), np.maximum(starts, ends)
    if arcs:
        ext = np.fromiter(chain.from_iterable(p.segments[i].extent for p in profiles for i in arcs), float,
                          4 * len(profiles) * len(arcs)).reshape(len(profiles), len(arcs), 4)
        tip = ends[:, arcs]
        lo[:, arcs], hi[:, arcs] = np.minimum(ext[..., :2], tip), np.maximum(ext[..., 2:], tip)
    return lo, hi


#: how far (mm) below a pair's box distance its true distance may fall by rounding
_BOX_SLACK = 1e-9


def least_wall(profile: "Profile") -> tuple[float, Point, Point] | None:
    """The thinnest metal between two surfaces of the loop that face each other across it:
    (thickness in mm, the point on each surface), or None when no two surfaces face each other.

    Surfaces meeting at a corner do not face each other there; a pair counts where the line of
    least distance between them runs through the metal, square to both (within FACING_DEG).
    Pairs are judged from the closest up; the distance between two surfaces is measured only when
    the gap between their boxes says it could be the next closest.
    """
    import numpy as np  # imported where used: the quick commands never load it
    import shapely  # imported where used: the quick commands never load it
    segs = profile.segments
    tol = LOOP_CHECK_TOLERANCE
    starts, ends, arcs, keep = _ends(profile)
    i_all, j_all = _pairs(len(segs))
    use = keep[i_all] & keep[j_all]
    i_use, j_use = i_all[use], j_all[use]
    if not len(i_use):
        return None
    lo, hi = _box_corners([profile], starts[None], ends[None], arcs)
    box = np.concatenate((lo[0], hi[0]), axis=1)  # (z_min, r_min, z_max, r_max) of each surface
    box_i, box_j = box[i_use], box[j_use]
    gap = np.maximum(np.maximum(box_j[:, :2] - box_i[:, 2:], box_i[:, :2] - box_j[:, 2:]), 0.0)  # along z and r
    floor = np.hypot(gap[:, 0], gap[:, 1]) - _BOX_SLACK  # no pair is closer
    by_floor = np.argsort(floor, kind="stable")
    lines: dict[int, Any] = {}

    def line(i: int) -> Any:
        if i not in lines:
            s = segs[i]
            lines[i] = (_polyline(tuple(s.flattened(tol)) + (s.end,)) if hasattr(s, "center")
                        else _polyline((s.start, s.end)))
        return lines[i]

    dist: dict[int, float] = {}  # pair (its place in row order) → distance, for the pairs measured so far
    measured = 0  # the first ``measured`` pairs of by_floor are measured
    judged: set[int] = set()
    poly = None

    def measure(upto: float) -> None:
        """Measure every pair whose box gap is at most ``upto``, at least the next few."""
        nonlocal measured
        stop = max(int(np.searchsorted(floor[by_floor], upto, side="right")), min(measured + 8, len(by_floor)))
        new = by_floor[measured:stop].tolist()
        found = shapely.distance([line(i) for i in i_use[new].tolist()], [line(j) for j in j_use[new].tolist()])
        dist.update(zip(new, found.tolist()))
        measured = stop

    measure(-math.inf)
    while True:
        nearest = min(((d, k) for k, d in dist.items() if k not in judged), default=None)
        unmeasured = float(floor[by_floor[measured]]) if measured < len(by_floor) else math.inf
        if nearest is None and measured == len(by_floor):
            return None
        if nearest is None or nearest[0] > unmeasured:
            measure(-math.inf if nearest is None else nearest[0])  # a pair not yet measured may be closer
            continue
        d, k = nearest
        judged.add(k)
        if d < 1e-9:
            continue  # touching surfaces: the loop check judges those
        i, j = int(i_use[k]), int(j_use[k])
        pq = shapely.shortest_line(line(i), line(j))
        (pz, pr), (qz, qr) = pq.coords
        u = ((qz - pz) / d, (qr - pr) / d)
        if poly is None:
            poly = profile.polygon(tol)
        if not shapely.contains_xy(poly, (pz + qz) / 2, (pr + qr) / 2):
            continue  # across air, not metal
        if _faces(segs, i, (pz, pr), u) and _faces(segs, j, (qz, qr), (-u[0], -u[1])):
            return d, (pz, pr), (qz, qr)


@functools.lru_cache(maxsize=64)  # a sweep's loops keep their number of surfaces
def _pair_mask(n: int) -> "np.ndarray":
    """(n, n): True for the pairs (i, j) of ``_pairs(n)``."""
    import numpy as np  # imported where used: the quick commands never load it
    mask = np.zeros((n, n), dtype=bool)
    mask[_pairs(n)] = True
    return mask


class LoopStack(NamedTuple):
    """Loops of one run of lines and arcs, stacked: their places in the list asked about (``members``), the number
    of surfaces ``n``, the arcs' places in the run, and every surface's start and end as (B, n, 2) arrays."""

    members: list[int]
    n: int
    arcs: list[int]
    starts: "np.ndarray"
    ends: "np.ndarray"


def loop_stacks(profiles: Sequence["Profile"]) -> list[LoopStack]:
    """The loops grouped by their run of lines and arcs and stacked (``LoopStack``), read from the segments once
    for every batched verdict of a sweep's chunk."""
    import numpy as np  # imported where used: the quick commands never load it
    groups: dict[tuple[type, ...], list[int]] = {}
    for b, p in enumerate(profiles):
        groups.setdefault(tuple(map(type, p.segments)), []).append(b)  # the run of lines and arcs
    out = []
    for kinds, members in groups.items():
        n = len(kinds)
        arcs = [i for i, s in enumerate(profiles[members[0]].segments) if hasattr(s, "center")]
        kept = [profiles[b].segment_ends for b in members]
        count = 2 * n * len(members)
        starts = np.fromiter(chain.from_iterable(chain.from_iterable(map(itemgetter(0), kept))), float, count).reshape(-1, n, 2)
        ends = np.fromiter(chain.from_iterable(chain.from_iterable(map(itemgetter(1), kept))), float, count).reshape(-1, n, 2)
        starts.flags.writeable = ends.flags.writeable = False  # shared by the checks and the batched mass
        stack = LoopStack(members, n, arcs, starts, ends)
        for row, b in enumerate(members):  # where the batched mass finds the loop's ends again
            profiles[b].__dict__["_stacked"] = (stack, row)
        out.append(stack)
    return out


def prime_areas_and_bounds(profiles: Sequence["Profile"], stacks: Sequence[LoopStack]) -> None:
    """Work out every loop's signed area and bounds at once and keep them on the loop, where
    ``Profile.signed_area`` and ``Profile.bounds`` find them: the same floats, bit for bit, as each loop's own
    (the area summed surface by surface in the loop's order, each arc's sine Python's ``math.sin``)."""
    import numpy as np  # imported where used: the quick commands never load it
    for members, n, arcs, starts, ends in stacks:
        loops = [profiles[b] for b in members]
        z0, r0, z1, r1 = starts[..., 0], starts[..., 1], ends[..., 0], ends[..., 1]
        chord = 0.5 * (z0 * r1 - z1 * r0)  # (B, n): Green's theorem over each surface's chord
        bow = {}  # arc place → (B,): the circular segment between an arc's chord and the arc
        if arcs:
            fields = np.fromiter(chain.from_iterable(map(attrgetter("radius", "sweep"),
                                                         (p.segments[i] for p in loops for i in arcs))),
                                 float, 2 * len(loops) * len(arcs)).reshape(len(loops), len(arcs), 2)
            radius, sweep = fields[..., 0], fields[..., 1]
            sines = np.fromiter(map(math.sin, sweep.ravel().tolist()), float, sweep.size).reshape(sweep.shape)
            terms = 0.5 * radius**2 * (sweep - sines)
            bow = {i: terms[:, k] for k, i in enumerate(arcs)}
        total = np.zeros(len(loops))
        for i in range(n):
            total = total + chord[:, i]
            if i in bow:
                total = total + bow[i]
        # a line's start (its end is the next surface's start), an arc's extent
        zs_lo, rs_lo, zs_hi, rs_hi = z0.copy(), r0.copy(), z0.copy(), r0.copy()
        if arcs:
            ext = np.fromiter(chain.from_iterable(p.segments[i].extent for p in loops for i in arcs), float,
                              4 * len(loops) * len(arcs)).reshape(len(loops), len(arcs), 4)
            zs_lo[:, arcs], rs_lo[:, arcs], zs_hi[:, arcs], rs_hi[:, arcs] = ext[..., 0], ext[..., 1], ext[..., 2], ext[..., 3]
        bounds = np.stack((zs_lo.min(axis=1), rs_lo.min(axis=1), zs_hi.max(axis=1), rs_hi.max(axis=1)), axis=1)
        for p, area, box in zip(loops, total.tolist(), bounds.tolist()):
            p.__dict__["_signed_area"] = area  # where the cached properties keep them
            p.__dict__["_bounds"] = tuple(box)


def axis_wall(profile: "Profile", below: float = math.inf) -> tuple[float, Point] | None:
    """The thinnest metal across the spin axis, below ``below`` mm: (thickness, the point), or None.

    A surface facing the axis square (within FACING_DEG) with metal all the way down to it is one side of
    a solid turned round the axis, 2·r across; the other side is its mirror image, which the loop does not
    hold, so the pairs of surfaces ``least_wall`` measures miss it (a pin or a hub on the axis).
    """
    import shapely  # imported where used: the quick commands never load it
    best: tuple[float, Point] | None = None
    poly = None
    for seg in profile.segments:
        arc = hasattr(seg, "center")
        low = seg.extent[1] if arc else min(seg.start[1], seg.end[1])
        if 2 * low >= below or (best is not None and 2 * low >= best[0]) or _on_axis(seg):
            continue
        (z0, r0), (z1, r1) = seg.start, seg.end
        if not arc and abs(r1 - r0) > _TAN_FACING * abs(z1 - z0) + 1e-12:
            continue  # a line too steep to face the axis
        points = [seg.start, seg.end]
        if arc:  # the lowest point of an arc facing the axis is an end, its bottom or where it stops facing
            lo_t, hi_t = sorted((seg.start_angle, seg.end_angle))
            for deg in (-120.0, -90.0, -60.0, 60.0, 120.0):
                t = math.radians(deg)
                t += 2 * math.pi * math.ceil((lo_t - t) / (2 * math.pi))
                if t <= hi_t:
                    points.append(seg.point_at(t))
        for p in points:
            if not (0 < 2 * p[1] < below and (best is None or 2 * p[1] < best[0])):
                continue
            if _inward_normal(seg, p)[1] > -_COS_FACING + 1e-12:
                continue  # the metal does not lie toward the axis, square below it
            if poly is None:
                poly = profile.polygon(LOOP_CHECK_TOLERANCE)
            # metal all the way down to the axis (from just inside the surface: an arc's flattened chords
            # may stand a tolerance off it), not a bore or a groove in between
            inset = min(2 * LOOP_CHECK_TOLERANCE, p[1] / 2)
            if shapely.covers(poly, shapely.linestrings([(p[0], p[1] - inset), (p[0], 0.0)])):
                best = (2 * p[1], p)
    return best


def thin_walls(profiles: Sequence["Profile"], below: Sequence[float],
               stacks: Sequence[LoopStack] | None = None) -> list[bool]:
    """For each loop, whether two of its surfaces face each other across metal closer than its ``below`` mm,
    or it is thinner than that across the axis: whether ``least_wall`` or ``axis_wall`` would find a wall
    under that, answered for many loops at once (a sweep's).

    Loops of the same run of lines and arcs are stacked, and only the pairs of surfaces whose boxes lie
    closer than ``below`` are measured; which pair is the thinnest does not matter, only whether any is.
    Only loops with a surface off the axis lower than half ``below`` are asked about the axis.
    ``stacks`` are the loops' ``loop_stacks`` when already made.
    """
    stacks = stacks if stacks is not None else loop_stacks(profiles)
    axial: list[int] = []  # the loops with a surface off the axis lower than half their below
    thin = _thin_pairs(profiles, below, stacks, axial)
    for b in axial:
        if not thin[b] and axis_wall(profiles[b], below[b]) is not None:
            thin[b] = True
    return thin


def _thin_pairs(profiles: Sequence["Profile"], below: Sequence[float], stacks: Sequence[LoopStack],
                axial: list[int]) -> list[bool]:
    """``thin_walls`` of the pairs of surfaces alone; the loops to ask ``axis_wall`` about go in ``axial``."""
    import numpy as np  # imported where used: the quick commands never load it
    import shapely  # imported where used: the quick commands never load it
    tol = LOOP_CHECK_TOLERANCE
    near: list[tuple[int, int, int]] = []  # (loop, surface, surface) whose boxes lie closer than the loop's below
    for members, n, arcs, starts, ends in stacks:
        lo, hi = _box_corners([profiles[b] for b in members], starts, ends, arcs)
        keep = _off_axis(starts, ends, arcs)
        # surfaces i and j can be closer than the limit only where their boxes are, along z and along r
        # (the true distance is at least each); the few pairs left are measured
        limit = np.array([below[b] for b in members]) + _BOX_SLACK
        # a surface off the axis lower than half the limit, an arc or a line that can face the axis (within
        # FACING_DEG of it), may be one side of a solid thinner than the limit
        facing = np.abs(ends[..., 1] - starts[..., 1]) <= _TAN_FACING * np.abs(ends[..., 0] - starts[..., 0]) + 1e-12
        facing[:, arcs] = True
        low = (keep & facing & (lo[..., 1] < 0.5 * limit[:, None])).any(axis=1)
        axial += np.array(members)[low].tolist()
        # first the pairs whose boxes, each grown to hold that surface in every loop of the stack, are that
        # close (a sweep moves few surfaces), in row order: no other pair can be in any one loop
        u_lo, u_hi, widest = lo.min(axis=0), hi.max(axis=0), limit.max()
        ever = _pair_mask(n).copy()
        for axis in (0, 1):
            ever &= u_lo[None, :, axis] - u_hi[:, None, axis] < widest
            ever &= u_lo[:, None, axis] - u_hi[None, :, axis] < widest
        ci, cj = np.nonzero(ever)
        near_ij = keep[:, ci] & keep[:, cj]  # (loops, candidate pairs)
        for axis in (0, 1):
            low, high = lo[..., axis], hi[..., axis]
            near_ij &= low[:, cj] - high[:, ci] < limit[:, None]
            near_ij &= low[:, ci] - high[:, cj] < limit[:, None]
        at, pair = np.nonzero(near_ij)
        near += zip(np.array(members)[at].tolist(), ci[pair].tolist(), cj[pair].tolist())
    thin = [False] * len(profiles)
    if not near:
        return thin
    # every surface of a pair as a polyline (an arc flattened as least_wall flattens it), all made at once
    surfaces = sorted({(b, i) for b, i, _ in near} | {(b, j) for b, _, j in near})
    place = {key: n for n, key in enumerate(surfaces)}
    coords: list[Point] = []
    counts: list[int] = []
    for b, i in surfaces:
        s = profiles[b].segments[i]
        pts = tuple(s.flattened(tol)) + (s.end,) if hasattr(s, "center") else (s.start, s.end)
        coords += pts
        counts.append(len(pts))
    flat = np.fromiter(chain.from_iterable(coords), float, 2 * len(coords)).reshape(-1, 2)
    lines = shapely.linestrings(flat, indices=np.repeat(np.arange(len(counts)), counts))
    first = lines[[place[(b, i)] for b, i, _ in near]]
    second = lines[[place[(b, j)] for b, _, j in near]]
    dist = shapely.distance(first, second)
    close = np.flatnonzero((dist >= 1e-9) & (dist < np.array([below[b] for b, _, _ in near])))
    if not len(close):
        return thin
    ends_pq = shapely.get_coordinates(shapely.shortest_line(first[close], second[close])).reshape(-1, 2, 2)
    facing: list[tuple[int, float, float]] = []  # (loop, midpoint z, r) of each close pair facing across its wall
    for n, ((pz, pr), (qz, qr)) in zip(close.tolist(), ends_pq.tolist()):
        b, i, j = near[n]
        d = float(dist[n])
        u = ((qz - pz) / d, (qr - pr) / d)
        segs = profiles[b].segments
        if _faces(segs, i, (pz, pr), u) and _faces(segs, j, (qz, qr), (-u[0], -u[1])):
            facing.append((b, (pz + qz) / 2, (pr + qr) / 2))
    if not facing:
        return thin
    # across metal, not air: each midpoint inside its loop's polygon (``Profile.polygon``), all asked at once
    loops = sorted({b for b, _, _ in facing})
    flats = [profiles[b].flat_array(tol) for b in loops]
    polygons = shapely.polygons(shapely.linearrings(np.concatenate(flats),
                                                    indices=np.repeat(np.arange(len(flats)), [len(f) for f in flats])))
    place = {b: k for k, b in enumerate(loops)}
    inside = shapely.contains_xy(polygons[[place[b] for b, _, _ in facing]], [z for _, z, _ in facing],
                                 [r for _, _, r in facing])
    for (b, _, _), metal in zip(facing, inside.tolist()):
        thin[b] = thin[b] or metal
    return thin


def crossing_free(profiles: Sequence["Profile"], stacks: Sequence[LoopStack] | None = None) -> list[bool]:
    """For each loop, whether its flattened ring is simple (crosses and touches itself nowhere), for many
    loops at once. ``stacks`` (the loops' ``loop_stacks``) let the rings of a stack be laid out together."""
    import numpy as np  # imported where used: the quick commands never load it
    import shapely  # imported where used: the quick commands never load it
    blocks: list["np.ndarray"] = []  # (points, 2) of one or more rings
    counts: list[int] = []  # each ring's number of points, in the order of ``order``
    order: list[int] = []  # the loops, in the order their rings are laid out
    done = [False] * len(profiles)
    for stack in stacks or ():
        loops = [profiles[b] for b in stack.members]
        block = _stack_rings(loops, stack, LOOP_CHECK_TOLERANCE)
        if block is None:
            continue
        blocks.append(block.reshape(-1, 2))
        counts += [block.shape[1]] * len(loops)
        order += stack.members
        for b in stack.members:
            done[b] = True
    for b, p in enumerate(profiles):
        if not done[b]:
            flat = p.flat_array(LOOP_CHECK_TOLERANCE)
            blocks.append(flat)
            counts.append(len(flat))
            order.append(b)
    rings = shapely.linearrings(np.concatenate(blocks), indices=np.repeat(np.arange(len(counts)), counts))
    out = [False] * len(profiles)
    for b, simple in zip(order, shapely.is_simple(rings).tolist()):
        out[b] = simple
    return out


def _stack_rings(loops: Sequence["Profile"], stack: LoopStack, tol: float) -> "np.ndarray | None":
    """The flattened rings (``Profile.flatten``) of a stack's loops as one (B, points, 2) array: each line's start
    from the stack, each arc's flattened points (one array for an arc all the loops share); None when an arc
    place does not flatten to the same number of points in every loop."""
    import numpy as np  # imported where used: the quick commands never load it
    b = len(loops)
    pieces: list["np.ndarray"] = []
    line_from = 0  # the first surface of the run of lines not yet laid out
    for k in stack.arcs:
        if k > line_from:
            pieces.append(stack.starts[:, line_from:k])
        line_from = k + 1
        arcs = [p.segments[k] for p in loops]
        first = arcs[0]
        if all(map(is_, arcs, repeat(first))):
            flat = first.flattened(tol)
            pieces.append(np.broadcast_to(np.array(flat, float), (b, len(flat), 2)))
            continue
        flats = [a.flattened(tol) for a in arcs]
        m = len(flats[0])
        if any(len(f) != m for f in flats):
            return None
        pieces.append(np.fromiter(chain.from_iterable(chain.from_iterable(flats)), float, 2 * m * b).reshape(b, m, 2))
    if stack.n > line_from:
        pieces.append(stack.starts[:, line_from:])
    return np.concatenate(pieces, axis=1)


def surface_walls(profile: "Profile", min_wall: float, measure: bool = True, thin: bool | None = None) -> list[Check]:
    """Least wall everywhere: the thinnest metal between any two surfaces facing each other across it.

    ``measure=False`` only asks whether a wall is thinner than ``min_wall`` (the same pass or fail,
    without the thickness of a wall that passes); ``thin`` is that answer when already found (``thin_walls``).
    """
    if not measure:
        if thin is None:
            thin = thin_walls([profile], [min_wall - 1e-9])[0]
        return [check("least wall across metal", "shop.min_wall", not thin,
                      f"a wall below {min_wall:.3f} mm" if thin else f"no wall below {min_wall:.3f} mm")]
    found = least_wall(profile)
    across = axis_wall(profile, found[0] if found is not None else math.inf)
    if across is not None:  # thinner across the axis than between any two surfaces
        d, p = across
        return [check("least wall across metal", "shop.min_wall", d >= min_wall - 1e-9,
                      f"{d:.3f} mm across the axis at z = {p[0]:.3f} mm (a solid Ø{d:.3f} mm), least {min_wall:.3f} mm")]
    if found is None:
        return [check("least wall across metal", "shop.min_wall", True, "no two surfaces face each other across metal")]
    d, p, q = found
    return [check("least wall across metal", "shop.min_wall", d >= min_wall - 1e-9,
                  f"{d:.3f} mm between the surfaces at z = {p[0]:.3f}, r = {p[1]:.3f} mm and z = {q[0]:.3f}, "
                  f"r = {q[1]:.3f} mm, least {min_wall:.3f} mm")]


class Reentrant(NamedTuple):
    """A run of surfaces no plain turning tool reaches straight from the outside diameter or a face,
    with its extent (mm) and the tool it needs."""

    z_min: float
    z_max: float
    r_min: float
    r_max: float
    tool: str

    def describe(self) -> str:
        return (f"re-entrant region z {self.z_min:.2f}…{self.z_max:.2f} mm, Ø{2 * self.r_min:.2f}…Ø{2 * self.r_max:.2f} mm: "
                f"needs a {self.tool}")


GROOVING_TOOL = "grooving tool"
BACK_TURNING_TOOL = "back-turning tool"
_SAMPLES = (0.15, 0.5, 0.85)
_OFFSET = 0.05  # mm off the surface, well above the flattening error (LOOP_CHECK_TOLERANCE), where a ray starts


def _sample(seg: Any, t: float) -> Point:
    if hasattr(seg, "center"):
        return seg.point_at(seg.start_angle + t * seg.sweep)
    return (seg.start[0] + t * (seg.end[0] - seg.start[0]), seg.start[1] + t * (seg.end[1] - seg.start[1]))


def reentrant_regions(profile: "Profile") -> tuple[Reentrant, ...]:
    """Runs of surfaces a turning tool cannot reach by a straight path from the outside diameter
    (radially) or from either face (axially); see ``_reentrant_regions``. The check, the summary and the
    sheet's notes ask about the same loop, so the answer is kept for the last few loops."""
    return _reentrant_regions(profile)


@functools.lru_cache(maxsize=64)  # one build asks three times (check, summary, notes) about the same loop
def _reentrant_regions(profile: "Profile") -> tuple[Reentrant, ...]:
    """Runs of surfaces a turning tool cannot reach by a straight path from the outside diameter
    (radially) or from either face (axially).

    A region deeper radially than it is wide needs a grooving tool plunged into it; a wider one a
    back-turning tool that reaches in behind the shoulder.
    """
    import numpy as np  # imported where used: the quick commands never load it
    segs = profile.segments
    starts, ends, arcs, off_axis = _ends(profile)
    off_axis[arcs] = False
    lines = np.flatnonzero(off_axis).tolist()
    if not lines and not arcs:
        return ()
    # on a line: the sample points along it, stepped off by the offset against its (one) inward normal
    a, step = starts[lines], ends[lines] - starts[lines]
    length = np.array([math.hypot(dz, dr) or 1.0 for dz, dr in step.tolist()])
    normal = np.stack((-step[:, 1] / length, step[:, 0] / length), axis=1)
    t = np.array(_SAMPLES)[None, :, None]
    s_lines = (a[:, None, :] + t * step[:, None, :]) - _OFFSET * normal[:, None, :]
    # on an arc each sample point has its own normal
    s_arcs = []
    for i in arcs:
        for frac in _SAMPLES:
            p = _sample(segs[i], frac)
            n = _inward_normal(segs[i], p)
            s_arcs.append((p[0] - _OFFSET * n[0], p[1] - _OFFSET * n[1]))
    s = np.concatenate((s_lines.reshape(-1, 2), np.array(s_arcs).reshape(-1, 2)))
    owners = [i for i in lines for _ in _SAMPLES] + [i for i in arcs for _ in _SAMPLES]
    flat = profile.flat_array(LOOP_CHECK_TOLERANCE)
    a, b = flat, np.concatenate((flat[1:], flat[:1]))
    # straight rays: along -z and +z (toward either face), then out along +r; a ray is blocked when it
    # crosses an edge of the loop. Few points are shut in axially, so only theirs are cast radially.
    shut_in = np.arange(len(s))
    for along, across in ((0, 1), (1, 0)):
        q = s[shut_in]
        lo = np.minimum(a[:, across], b[:, across])
        hi = np.maximum(a[:, across], b[:, across])
        at = q[:, across]
        ray, edge = np.nonzero((lo <= at[:, None]) & (at[:, None] < hi))  # the edges each ray's line crosses
        share = (at[ray] - a[edge, across]) / (b[edge, across] - a[edge, across])
        hit = a[edge, along] + share * (b[edge, along] - a[edge, along])
        start = q[ray, along]
        beyond = np.bincount(ray[hit > start], minlength=len(q)) > 0
        if along == 0:  # axially, toward either face
            beyond &= np.bincount(ray[hit < start], minlength=len(q)) > 0
        shut_in = shut_in[beyond]
        if not len(shut_in):
            return ()
    return hidden_regions(segs, {owners[k] for k in shut_in.tolist()})


def hidden_regions(segs: Sequence[Any], hidden: Iterable[int]) -> tuple[Reentrant, ...]:
    """The re-entrant regions made of the hidden surfaces ``hidden`` (indices into the loop's ``segs``):
    consecutive ones round the loop make one region, reached by the tool its shape asks for."""
    runs: list[list[int]] = []
    for i in sorted(set(hidden)):
        if runs and i == runs[-1][-1] + 1:
            runs[-1].append(i)
        else:
            runs.append([i])
    if len(runs) > 1 and runs[0][0] == 0 and runs[-1][-1] == len(segs) - 1:
        runs[0] = runs.pop() + runs[0]
    out = []
    for run in runs:
        pts = [q for i in run for q in (segs[i].start, segs[i].end, _sample(segs[i], 0.5))]
        zs, rs = [q[0] for q in pts], [q[1] for q in pts]
        tool = GROOVING_TOOL if (max(rs) - min(rs)) >= (max(zs) - min(zs)) else BACK_TURNING_TOOL
        out.append(Reentrant(min(zs), max(zs), min(rs), max(rs), tool))
    return tuple(out)


def turning_checks(profile: "Profile") -> list[Check]:
    """Every surface reachable by a turning tool from the outside diameter or a face; each re-entrant
    region is allowed, and named with the tool it needs."""
    regions = reentrant_regions(profile)
    if not regions:
        return [check("turned from the outside diameter and faces", "shape.kind", True,
                      "every surface is reached straight from the outside diameter or a face")]
    return [check(f"re-entrant region needs a {r.tool}", "shape.kind", True, r.describe()) for r in regions]
