"""Cutting the exact profile to a rectangle, for the enlarged detail (lines and arcs stay exact)."""
from __future__ import annotations

import math

from ..geometry import Arc, Line, Point, Segment

__all__ = ["clip_segments"]

Rect = tuple[float, float, float, float]


def _inside(p: Point, rect: Rect, eps: float = 1e-9) -> bool:
    return rect[0] - eps <= p[0] <= rect[2] + eps and rect[1] - eps <= p[1] <= rect[3] + eps


def _clip_line(s: Line, rect: Rect) -> list[Segment]:
    (x0, y0), (x1, y1) = s.start, s.end
    dx, dy = x1 - x0, y1 - y0
    t0, t1 = 0.0, 1.0
    for p, q in ((-dx, x0 - rect[0]), (dx, rect[2] - x0), (-dy, y0 - rect[1]), (dy, rect[3] - y0)):
        if p == 0:
            if q < 0:
                return []
            continue
        t = q / p
        if p < 0:
            t0 = max(t0, t)
        else:
            t1 = min(t1, t)
    if t1 - t0 <= 1e-12:
        return []
    return [Line((x0 + t0 * dx, y0 + t0 * dy), (x0 + t1 * dx, y0 + t1 * dy))]


def _clip_arc(s: Arc, rect: Rect) -> list[Segment]:
    cx, cy = s.center
    cuts = [0.0, 1.0]
    for axis, value in ((0, rect[0]), (0, rect[2]), (1, rect[1]), (1, rect[3])):
        c = (cx, cy)[axis]
        d = (value - c) / s.radius
        if abs(d) > 1:
            continue
        base = math.acos(d) if axis == 0 else math.asin(d)
        candidates = (base, -base) if axis == 0 else (base, math.pi - base)
        for a in candidates:
            if s.sweep > 0:
                t = ((a - s.start_angle) % (2 * math.pi)) / s.sweep
            else:
                t = ((s.start_angle - a) % (2 * math.pi)) / -s.sweep
            if 0 < t < 1:
                cuts.append(t)
    cuts = sorted(set(cuts))
    out: list[Segment] = []
    for t0, t1 in zip(cuts, cuts[1:]):
        if t1 - t0 < 1e-9:
            continue
        mid = s.point_at(s.start_angle + s.sweep * (t0 + t1) / 2)
        if _inside(mid, rect):
            out.append(Arc(s.center, s.radius, s.start_angle + s.sweep * t0, s.sweep * (t1 - t0)))
    return out


def clip_segments(segments: tuple[Segment, ...], rect: Rect) -> list[Segment]:
    """The parts of ``segments`` inside ``rect`` = (x_min, y_min, x_max, y_max)."""
    out: list[Segment] = []
    for s in segments:
        out.extend(_clip_line(s, rect) if isinstance(s, Line) else _clip_arc(s, rect))
    return out
