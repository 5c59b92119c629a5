"""Finding the dimensioned points on the profile itself, so every dimension measures the drawn geometry."""
from __future__ import annotations

import math

from ..geometry import Arc, Line, Point, Profile

__all__ = ["LocateError", "on_radius", "on_face", "corner", "sharp_corner", "arc_at", "TOL"]

TOL = 1e-6


class LocateError(LookupError):
    """The profile has no edge where the resolved design says a feature is (a drawing bug)."""


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


def sharp_corner(profile: Profile, near: Point) -> Point:
    """The intersection of the two edges tangent to the fillet arc nearest ``near`` (the dimensioned corner)."""
    segs = profile.segments
    n = len(segs)
    best = None
    for i, s in enumerate(segs):
        if not isinstance(s, Arc):
            continue
        a, b = segs[i - 1], segs[(i + 1) % n]
        if not (isinstance(a, Line) and isinstance(b, Line)):
            continue
        p = _intersect(a, b)
        if p is not None and (best is None or math.dist(p, near) < math.dist(best, near)):
            best = p
    if best is None or math.dist(best, near) > 1e-4:
        raise LocateError(f"no corner at {near}")
    return best


def arc_at(profile: Profile, center: Point | None = None, radius: float | None = None,
           near: Point | None = None) -> Arc:
    """The fillet arc of ``radius`` whose sharp corner is nearest ``near``."""
    arcs = [s for s in profile.segments if isinstance(s, Arc) and (radius is None or abs(s.radius - radius) < TOL)]
    if not arcs:
        raise LocateError(f"no arc of radius {radius}")
    ref = near or center or (0.0, 0.0)
    return min(arcs, key=lambda a: math.dist(a.point_at(a.start_angle + a.sweep / 2), ref))


def _intersect(a: Line, b: Line) -> Point | None:
    (x1, y1), (x2, y2) = a.start, a.end
    (x3, y3), (x4, y4) = b.start, b.end
    den = (x1 - x2) * (y3 - y4) - (y1 - y2) * (x3 - x4)
    if abs(den) < 1e-12:
        return None
    t = ((x1 - x3) * (y3 - y4) - (y1 - y3) * (x3 - x4)) / den
    return (x1 + t * (x2 - x1), y1 + t * (y2 - y1))
