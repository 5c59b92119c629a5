"""The dimension chain: each turned surface located once, from datum face B or the axis, with no closed loop.

A half's corners (a fillet stands for the sharp corner it rounds, the point ISO 129-1 dimensions to: where
its two straight edges meet, or the sketch's corner where an edge is an arc) have an axial position z and a
radius r. A flat face makes its corners share one z, a cylinder its corners one r. Each linear dimension ties two z (axial) or two r (radial), a diameter
ties an r to the axis. Walking the requests in order of importance, a dimension that ties two values
already tied closes a loop: it is kept for the reader as an auxiliary dimension, in parentheses and
without a tolerance (ISO 129-1),. An angle never locates a corner here: it is auxiliary. What stays
unlocated after all requests is what the sheet still lacks.

>>> from yodraft.geometry import Line, Profile
>>> box = Profile((Line((0.0, 0.0), (4.0, 0.0)), Line((4.0, 0.0), (4.0, 2.0)), Line((4.0, 2.0), (0.0, 2.0)),
...                Line((0.0, 2.0), (0.0, 0.0))))
>>> chain = Chain(box, face_b=4.0)
>>> chain.tie("axial", (0.0, 2.0), (4.0, 2.0)), chain.tie("axial", (0.0, 0.0), (4.0, 0.0))
(True, False)
>>> sorted(chain.unlocated())
[(0.0, 2.0), (4.0, 2.0)]
>>> chain.tie("diameter", (4.0, 2.0)), chain.unlocated()
(True, [])
"""
from __future__ import annotations

import math
from dataclasses import replace

from typing import Any

from ..geometry import Arc, Line, Point, Profile
from .locate import intersection

__all__ = ["Chain", "corners_of", "settle"]

EPS = 1e-6


def _tangent(seg: Line | Arc, at_start: bool) -> tuple[float, float]:
    if isinstance(seg, Line):
        (x1, y1), (x2, y2) = seg.start, seg.end
        d = math.dist(seg.start, seg.end)
        return ((x2 - x1) / d, (y2 - y1) / d)
    a = seg.start_angle if at_start else seg.start_angle + seg.sweep
    s = 1.0 if seg.sweep > 0 else -1.0
    return (-s * math.sin(a), s * math.cos(a))


def _smooth(a: Line | Arc, b: Line | Arc) -> bool:
    """Whether ``a`` runs into ``b`` without a kink (tangent where they meet)."""
    return math.dist(_tangent(a, False), _tangent(b, True)) < 1e-6


def _fillet_corners(segs: tuple[Line | Arc, ...], rounded: tuple[tuple[Point, float], ...]) -> dict[int, Point]:
    """The sharp corner each fillet next to an arc edge stands for: the rounded corner (point, radius) of that
    radius whose point is nearest the arc's centre, where that arc is also the arc of that radius nearest the
    point (a sketch's corner radius where a curved edge meets another edge)."""
    out: dict[int, Point] = {}
    n = len(segs)
    for i, s in enumerate(segs):
        a, b = segs[i - 1], segs[(i + 1) % n]
        if not isinstance(s, Arc) or not (_smooth(a, s) and _smooth(s, b)):
            continue
        same = [(p, r) for p, r in rounded if abs(r - s.radius) < 1e-9]
        if not same:
            continue
        p = min((p for p, _ in same), key=lambda q: math.dist(q, s.center))
        arcs = [k for k, t in enumerate(segs) if isinstance(t, Arc) and abs(t.radius - s.radius) < 1e-9]
        if min(arcs, key=lambda k: math.dist(segs[k].center, p)) == i:  # type: ignore[union-attr]
            out[i] = p
    return out


def corners_of(profile: Profile,
               rounded: tuple[tuple[Point, float], ...] = ()) -> tuple[list[Point], list[tuple[Point, Point]]]:
    """The loop's corners in order and the edges between them. A fillet stands for the sharp corner it
    rounds: between two lines, the point they meet at; next to an arc edge, the corner among ``rounded``
    (point, radius) it was made from, when given."""
    segs = profile.segments
    n = len(segs)
    points: list[Point] = []
    sharp: dict[int, Point] = {}
    for i, s in enumerate(segs):
        a, b = segs[i - 1], segs[(i + 1) % n]
        if isinstance(s, Arc) and isinstance(a, Line) and isinstance(b, Line) and _smooth(a, s) and _smooth(s, b):
            p = intersection(a, b)
            if p is not None:
                sharp[i] = p
    if rounded:
        sharp = {**_fillet_corners(segs, rounded), **sharp}
    for i, s in enumerate(segs):
        if i in sharp:
            points.append(sharp[i])
        elif (i - 1) % n not in sharp:
            points.append(s.start)
    edges = [(points[k], points[(k + 1) % len(points)]) for k in range(len(points))]
    return points, edges


class _Levels:
    """Values (axial positions or radii) joined by dimensions: a union-find with one located root."""

    def __init__(self, root: float) -> None:
        self.values: list[float] = [root]
        self.parent: list[int] = [0]

    def node(self, value: float) -> int:
        for i, v in enumerate(self.values):
            if abs(v - value) < EPS:
                return i
        self.values.append(value)
        self.parent.append(len(self.parent))
        return len(self.values) - 1

    def find(self, i: int) -> int:
        while self.parent[i] != i:
            self.parent[i] = self.parent[self.parent[i]]
            i = self.parent[i]
        return i

    def join(self, a: float, b: float) -> bool:
        ra, rb = self.find(self.node(a)), self.find(self.node(b))
        if ra == rb:
            return False
        self.parent[ra] = rb
        return True

    def located(self, value: float) -> bool:
        return self.find(self.node(value)) == self.find(0)


class Chain:
    """The half's axial positions (rooted at datum face B) and radii (rooted at the axis), as dimensions tie them."""

    def __init__(self, profile: Profile, face_b: float, rounded: tuple[tuple[Point, float], ...] = ()) -> None:
        self.corners, edges = corners_of(profile, rounded)
        self.edges = edges
        self.z = _Levels(face_b)
        self.r = _Levels(0.0)
        for a, b in edges:
            if abs(a[0] - b[0]) < EPS:
                self.z.join(a[0], b[0])
            if abs(a[1] - b[1]) < EPS:
                self.r.join(abs(a[1]), abs(b[1]))

    def tie(self, kind: str, p: Point, q: Point | None = None) -> bool:
        """Tie two values (``axial``, ``radial``) or a radius to the axis (``diameter``); False if already tied."""
        if kind == "axial":
            assert q is not None
            return self.z.join(p[0], q[0])
        if kind == "radial":
            assert q is not None
            return self.r.join(abs(p[1]), abs(q[1]))
        return self.r.join(abs(p[1]), 0.0)

    def unlocated(self) -> list[Point]:
        """Corners whose axial position or radius no dimension chain reaches.

        A drill's point (a corner on the axis at the end of a slant edge from a located corner) is the
        drill's own form, its angle stated with the drill: it needs no dimension of its own.
        """
        def located(c: Point) -> bool:
            return self.z.located(c[0]) and self.r.located(abs(c[1]))
        out = [c for c in self.corners if not located(c)]
        for a, b in self.edges:
            for tip, other in ((a, b), (b, a)):
                slant = abs(a[0] - b[0]) > EPS and abs(a[1] - b[1]) > EPS
                if tip in out and slant and abs(tip[1]) < EPS and located(other):
                    out.remove(tip)
        return out


def settle(requests: list[Any], profile: Profile, face_b: float,
           rounded: tuple[tuple[Point, float], ...] = ()) -> tuple[list[Any], Chain]:
    """The dimension requests (``requests.DimensionRequest``) with every one that would close a loop (and every angle) made auxiliary, in the given
    order of importance; and the chain they leave."""
    chain = Chain(profile, face_b, rounded)
    out = []
    direct: set[tuple[float, float]] = set()
    for req in requests:
        if req.kind == "radius":
            out.append(req)
        elif req.kind == "angle" or req.auxiliary:
            out.append(replace(req, auxiliary=True, tolerance=""))
        else:
            kind = req.direction if req.kind == "linear" else "diameter"
            pair = _pair(kind, req.points)
            if chain.tie(kind, *req.points):
                direct.add(pair)
                out.append(req)
            elif pair not in direct:  # the very same two surfaces as a dimension already given: nothing new
                out.append(replace(req, auxiliary=True, tolerance=""))
    return out, chain


def _pair(kind: str, points: tuple[Point, ...]) -> tuple[float, float]:
    """The two values a dimension ties (rounded), the same for any dimension between the same two surfaces."""
    if kind == "axial":
        a, b = points[0][0], points[1][0]
    elif kind == "radial":
        a, b = abs(points[0][1]), abs(points[1][1])
    else:
        a, b = abs(points[0][1]), 0.0
    return (round(min(a, b), 6), round(max(a, b), 6))
