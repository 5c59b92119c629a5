"""Finding the dimensioned points on the profile itself, so every dimension measures the drawn geometry."""
from __future__ import annotations

import math

from ..checks import DATUM_TOL
from ..geometry import Arc, Line, Point, Profile

__all__ = ["LocateError", "Outline", "outline_of", "on_radius", "on_face", "corner", "sharp_corner", "arc_at", "intersection", "TOL"]

#: how near (mm) a point must lie to be on an edge: the datum-face check's own, so a loop it passes has a face B here
TOL = DATUM_TOL


class LocateError(LookupError):
    """The profile has no edge where the resolved design says a feature is (a drawing bug)."""


class Outline:
    """The drawn loops of a half's parts (the body, then any ring), searched together: a point
    dimensioned on the half may lie on whichever part carries that surface."""

    def __init__(self, loops: tuple[Profile, ...]) -> None:
        self.loops = loops
        self.segments = tuple(s for loop in loops for s in loop.segments)

    def bounds(self) -> tuple[float, float, float, float]:
        b = [loop.bounds() for loop in self.loops]
        return min(x[0] for x in b), min(x[1] for x in b), max(x[2] for x in b), max(x[3] for x in b)

    def polygon(self, tol: float = 0.005):  # type: ignore[no-untyped-def]
        import shapely

        return shapely.union_all([loop.polygon(tol) for loop in self.loops])


def outline_of(resolved) -> Outline:  # type: ignore[no-untyped-def]
    """The half's parts as drawn (the body's loop alone when it has no ring)."""
    loops = tuple(p.profile for p in resolved.parts) or (resolved.profile,)
    return Outline(loops)


def _lines(profile: Profile) -> list[Line]:
    return [s for s in profile.segments if isinstance(s, Line)]


def on_radius(profile: Profile, r: float, prefer: str = "max") -> Point:
    """An end of a cylindrical edge (a line at constant r) at radius ``r``: the end with the largest
    (``prefer="max"``) or smallest z."""
    ends = [p for s in _lines(profile) if abs(s.start[1] - r) < TOL and abs(s.end[1] - r) < TOL for p in (s.start, s.end)]
    ends += [p for s in profile.segments for p in (s.start, s.end) if abs(p[1] - r) < TOL]
    if not ends:
        raise LocateError(f"no edge at r = {r}")
    return (max if prefer == "max" else min)(ends, key=lambda p: (p[0], p[1]))


def on_face(profile: Profile, z: float, prefer: str = "max") -> Point:
    """An end of a flat face (a line at constant z) at ``z``: the end with the largest or smallest r."""
    ends = [p for s in profile.segments for p in (s.start, s.end) if abs(p[0] - z) < TOL]
    if not ends:
        raise LocateError(f"no face at z = {z}")
    return (max if prefer == "max" else min)(ends, key=lambda p: (p[1], p[0]))


def corner(profile: Profile, point: Point) -> Point:
    """``point`` itself if it is a vertex of the loop, else the theoretical sharp corner of a fillet there."""
    for s in profile.segments:
        for p in (s.start, s.end):
            if math.dist(p, point) < TOL:
                return p
    return sharp_corner(profile, point)


def sharp_corner(profile: Profile | Outline, near: Point) -> Point:
    """The intersection of the two edges tangent to the fillet arc nearest ``near`` (the dimensioned corner)."""
    if isinstance(profile, Outline):
        found = []
        for loop in profile.loops:
            try:
                found.append(sharp_corner(loop, near))
            except LocateError:
                pass
        if not found:
            raise LocateError(f"no corner at {near}")
        return min(found, key=lambda p: math.dist(p, near))
    segs = profile.segments
    n = len(segs)
    best = None
    for i, s in enumerate(segs):
        if not isinstance(s, Arc):
            continue
        a, b = segs[i - 1], segs[(i + 1) % n]
        if not (isinstance(a, Line) and isinstance(b, Line)):
            continue
        p = intersection(a, b)
        if p is not None and (best is None or math.dist(p, near) < math.dist(best, near)):
            best = p
    if best is None or math.dist(best, near) > 1e-4:
        # a fillet that takes the whole of an edge (a ring's edge radius as large as its thickness) has no line
        # left on that side: its sharp corner is where the tangents at the arc's own two ends meet
        tips = [_tangent_corner(s) for s in segs if isinstance(s, Arc)]
        best = min((p for p in tips if p is not None), key=lambda p: math.dist(p, near), default=None)
    if best is None or math.dist(best, near) > 1e-4:
        raise LocateError(f"no corner at {near}")
    return best


def _tangent_corner(arc: Arc) -> Point | None:
    """Where the tangents at the arc's two ends meet, on the bisector of its sweep; None for a half turn or more."""
    half = abs(arc.sweep) / 2
    if half >= math.pi / 2 - 1e-9:
        return None
    mid, out = arc.start_angle + arc.sweep / 2, arc.radius / math.cos(half)
    return (arc.center[0] + out * math.cos(mid), arc.center[1] + out * math.sin(mid))


def arc_at(profile: Profile, center: Point | None = None, radius: float | None = None,
           near: Point | None = None) -> Arc:
    """The fillet arc of ``radius`` whose sharp corner is nearest ``near``."""
    arcs = [s for s in profile.segments if isinstance(s, Arc) and (radius is None or abs(s.radius - radius) < TOL)]
    if not arcs:
        raise LocateError(f"no arc of radius {radius}")
    ref = near or center or (0.0, 0.0)
    return min(arcs, key=lambda a: math.dist(a.point_at(a.start_angle + a.sweep / 2), ref))


def intersection(a: Line, b: Line) -> Point | None:
    (x1, y1), (x2, y2) = a.start, a.end
    (x3, y3), (x4, y4) = b.start, b.end
    den = (x1 - x2) * (y3 - y4) - (y1 - y2) * (x3 - x4)
    if abs(den) < 1e-12:
        return None
    t = ((x1 - x3) * (y3 - y4) - (y1 - y3) * (x3 - x4)) / den
    return (x1 + t * (x2 - x1), y1 + t * (y2 - y1))
