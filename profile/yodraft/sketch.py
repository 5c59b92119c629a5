"""A sketched outer shape: an ordered chain of points in (z, r), from the catch zone's start on the
wall face round the rim to the end of the cup on the spin axis.

Each point may be placed from an anchor the builder knows (the wall face, the outer face, the
pad groove, the outer diameter), so a revision of that feature moves the point with it. The
segment that reaches a point is a line, an arc of a given radius (bulging out of the metal,
convex, or into it, concave) or an arc tangent to the segment before. A point may carry a
corner radius, tangent to both segments it joins (lines or arcs).

The chain is turned into loop corners (``FilletVertex``) in the loop's counter-clockwise order,
which runs the other way: from the axis at the back to the wall face.

>>> anchors = Anchors(wall_face_z=2.0, outer_face_z=20.0, outer_radius=28.0, pad_groove_radius=9.6, inner_depth=8.0)
>>> pts = [{"z": 0.0, "z_from": "wall face", "r": 12.0, "r_from": "axis", "radius": 0.0, "arc": "line", "arc_radius": None},
...        {"z": 12.0, "z_from": "gap plane", "r": 0.0, "r_from": "outer diameter", "radius": 1.0, "arc": "line", "arc_radius": None},
...        {"z": 0.0, "z_from": "outer face", "r": 0.0, "r_from": "outer diameter", "radius": 0.0, "arc": "line", "arc_radius": None},
...        {"z": 0.0, "z_from": "outer face", "r": 0.0, "r_from": "axis", "radius": 0.0, "arc": "line", "arc_radius": None}]
>>> [v.point for v in chain_vertices(pts, anchors)]
[(20.0, 0.0), (20.0, 28.0), (12.0, 28.0), (2.0, 12.0)]
"""
from __future__ import annotations

import math
from collections.abc import Mapping, Sequence
from dataclasses import dataclass
from typing import Any


from .features.base import FeatureInputError, V
from .geometry import FilletVertex, Point, arc_through
from .params import ParamSpec

__all__ = ["Anchors", "POINT_PARAMS", "Z_ANCHORS", "R_ANCHORS", "ARC_KINDS", "chain_vertices", "absolute_points"]

Z_ANCHORS = ("gap plane", "wall face", "outer face")
R_ANCHORS = ("axis", "pad groove", "outer diameter")
ARC_KINDS = ("line", "convex", "concave", "tangent")
ON_TOL = 1e-6  # mm: a point this close to the wall face or the axis is on it

POINT_PARAMS = (
    ParamSpec("z", "length", "axial position of the point, measured from z_from (toward the outer face is +)",
              0.0, -150.0, 150.0, lo_closed=True),
    ParamSpec("z_from", "text", "what z is measured from", "gap plane", choices=Z_ANCHORS),
    ParamSpec("r", "length", "radius of the point, measured from r_from (outward is +, so below the outer diameter is −)",
              0.0, -150.0, 150.0, lo_closed=True),
    ParamSpec("r_from", "text", "what r is measured from ('pad groove': its outer diameter)", "axis", choices=R_ANCHORS),
    ParamSpec("radius", "length", "corner radius at this point, tangent to the two segments it joins (0: sharp)", 0.0, 0.0, 50.0,
              lo_closed=True),
    ParamSpec("arc", "text", "the segment that reaches this point from the one before: a line, an arc of arc_radius "
              "bulging out of the metal (convex) or into it (concave), or an arc tangent to the segment before",
              "line", choices=ARC_KINDS),
    ParamSpec("arc_radius", "length", "radius of a convex or concave arc", None, 0.0, 500.0),
)


@dataclass(frozen=True)
class Anchors:
    """Where the features the sketch may be placed from stand (mm); ``inner_depth`` is the deepest z
    of the bearing wall's own features (pad groove, seat, axle bore)."""

    wall_face_z: float
    outer_face_z: float
    outer_radius: float
    pad_groove_radius: float
    inner_depth: float

    def z(self, name: str) -> float:
        return {"gap plane": 0.0, "wall face": self.wall_face_z, "outer face": self.outer_face_z}[name]

    def r(self, name: str) -> float:
        return {"axis": 0.0, "pad groove": self.pad_groove_radius, "outer diameter": self.outer_radius}[name]


def absolute_points(points: Sequence[Mapping[str, Any]], anchors: Anchors) -> list[Point]:
    """Each point's (z, r) in mm from the gap plane and the spin axis."""
    return [(anchors.z(p["z_from"]) + p["z"] + 0.0, anchors.r(p["r_from"]) + p["r"] + 0.0) for p in points]


def _fail(i: int, key: str, problem: str, expected: str) -> FeatureInputError:
    return FeatureInputError(f"points[{i}].{key}" if key else f"points[{i}]", problem, expected)


def _rotate(u: Point, angle: float) -> Point:
    c, s = math.cos(angle), math.sin(angle)
    return (u[0] * c - u[1] * s, u[0] * s + u[1] * c)


def chain_vertices(points: Sequence[Mapping[str, Any]], anchors: Anchors, owner: str = "shape") -> list[FilletVertex]:
    """The loop corners of the sketched chain, in the loop's order (axis first, wall face last).

    Raises FeatureInputError naming the point for a broken chain: not closed (first point off the
    wall face, last off the axis), a repeated point, an arc radius shorter than half its chord, a
    point in the gap or inside the bearing wall, or a chain that crosses itself.
    """
    n = len(points)
    if n < 3:
        raise FeatureInputError("points", f"has {n} point(s)",
                                "at least three [[features.shape.points]]: on the wall face, round the rim, on the axis")
    pts = absolute_points(points, anchors)
    wall, start_r = anchors.wall_face_z, pts[0][1]
    if abs(pts[0][0] - wall) > ON_TOL:
        raise _fail(0, "z", f"the chain is not closed: its first point is at z = {pts[0][0]:.4f} mm, off the wall face "
                    f"at z = {wall:.4f} mm", 'the first point on the wall face: z_from = "wall face", z = "0 mm"')
    if start_r <= anchors.pad_groove_radius + ON_TOL:
        raise _fail(0, "r", f"the first point lies inside the bearing wall: r = {start_r:.4f} mm, pad groove outer "
                    f"radius {anchors.pad_groove_radius:.4f} mm", "the catch zone's start outside the pad groove")
    if abs(pts[-1][1]) > ON_TOL:
        raise _fail(n - 1, "r", f"the chain is not closed: its last point is at r = {pts[-1][1]:.4f} mm, off the spin axis",
                    'the last point on the axis: r_from = "axis", r = "0 mm"')
    for i, (z, r) in enumerate(pts):
        if r < -ON_TOL:
            raise _fail(i, "r", f"lies below the spin axis (r = {r:.4f} mm)", "r at or above the axis")
        if i > 0 and z < wall - ON_TOL:
            raise _fail(i, "z", f"lies in the gap, in front of the wall face (z = {z:.4f} mm, wall face {wall:.4f} mm)",
                        "every point at or behind the wall face")
        if i > 0 and r < start_r - ON_TOL and z < anchors.inner_depth - ON_TOL:
            raise _fail(i, "", f"lies inside the bearing wall at z = {z:.4f} mm, r = {r:.4f} mm (the seat, pad groove "
                        f"and axle bore reach z = {anchors.inner_depth:.4f} mm)",
                        "points inside the catch zone's start only behind the bearing wall's features")
        if i > 0 and math.dist(pts[i - 1], (z, r)) <= ON_TOL:
            raise _fail(i, "", "repeats the point before it", "each point apart from the one before")
    # signed sweeps in the chain's direction (+ counter-clockwise); metal lies on the chain's right
    sweeps = [0.0] * n
    starts: list[Point] = [(0.0, 1.0)] * n  # direction each segment leaves its first point
    ends: list[Point] = [(0.0, 1.0)] * n  # and arrives at its last (the land arrives at point 0 up the wall face)
    heading: Point = (0.0, 1.0)  # the chain arrives at its first point up the wall face
    for i in range(1, n):
        p, q = pts[i - 1], pts[i]
        length = math.dist(p, q)
        chord = ((q[0] - p[0]) / length, (q[1] - p[1]) / length)
        kind = points[i]["arc"]
        if kind == "line":
            sweep = 0.0
        elif kind == "tangent":
            sweep = 2 * math.atan2(heading[0] * chord[1] - heading[1] * chord[0], heading[0] * chord[0] + heading[1] * chord[1])
            if abs(sweep) < 1e-9:
                sweep = 0.0  # the chord runs straight on: a line
            elif abs(sweep) >= 2 * math.pi - 1e-6:
                raise _fail(i, "arc", "no tangent arc reaches this point (it lies straight behind the segment before)",
                            "a point ahead of the segment before")
        else:
            radius = points[i]["arc_radius"]
            if radius is None:
                raise _fail(i, "arc_radius", f"is missing for a {kind} arc", "the arc's radius, e.g. \"12 mm\"")
            if radius < length / 2 - 1e-9:
                raise _fail(i, "arc_radius", f"{radius:.4f} mm does not fit a chord of {length:.4f} mm",
                            f"at least half the chord, {length / 2:.4f} mm")
            turn = 2 * math.asin(min(1.0, length / (2 * radius)))
            sweep = -turn if kind == "convex" else turn  # convex bulges to the chain's left, away from the metal
        sweeps[i] = sweep
        starts[i] = _rotate(chord, -sweep / 2)
        heading = ends[i] = _rotate(chord, sweep / 2)
    _check_simple(pts, sweeps)
    # the loop runs the chain backwards: corner i carries the edge to corner i - 1, with its sweep reversed
    out = []
    for i in range(n - 1, -1, -1):
        radius = points[i]["radius"]
        if radius > 0 and i == n - 1:
            raise _fail(i, "radius", "a point on the spin axis cannot be rounded", "radius 0 on the axis")
        if radius > 0 and i + 1 < n:
            a, b = ends[i], starts[i + 1]
            if abs(a[0] * b[1] - a[1] * b[0]) < 1e-9 and a[0] * b[0] + a[1] * b[1] > 0:
                raise _fail(i, "radius", "rounds no corner: the segments meet tangent here", "radius 0 here")
        out.append(FilletVertex(V(*pts[i]).point, float(radius), f"{owner}.points[{i}].radius", -sweeps[i] + 0.0))
    return out


def _check_simple(pts: Sequence[Point], sweeps: Sequence[float]) -> None:
    """The chain's segments meet only at their shared points."""
    import shapely  # imported where used: the quick commands never load it
    pieces = []
    for i in range(1, len(pts)):
        if sweeps[i]:
            arc = arc_through(pts[i - 1], pts[i], sweeps[i])
            line = list(arc.flattened(0.002)) + [pts[i]]
        else:
            line = [pts[i - 1], pts[i]]
        pieces.append(shapely.LineString(line))
    for i in range(len(pieces)):
        for j in range(i + 1, len(pieces)):
            cut = pieces[i].intersection(pieces[j])
            if cut.is_empty:
                continue
            if j == i + 1 and cut.geom_type == "Point" and math.dist(cut.coords[0], pts[i + 1]) < 1e-6:
                continue  # neighbours share their point
            raise _fail(j + 1, "", f"the chain crosses itself: the segment to this point meets the segment to point {i + 1}",
                        "a chain that never crosses or touches itself")
