"""The parts of one half: the body and any parts pressed into it (rings), each its own closed loop
of exact lines and arcs with its own material.

A feature that adds a part gives its outline and the seat it sits in; the seat is cut into the
body's corners before the body's loop is rounded, so the body and the part meet on a shared edge
and their masses add up exactly.

>>> from yodraft.features.base import V
>>> square = [V(0, 0), V(4, 0), V(4, 4), V(0, 4)]
>>> cut, failed = cut_seats(square, [SeatCut((4, 4), (V(4, 3), V(3, 3), V(3, 4)), "corner", "ring.width", (), "")])
>>> [v.point for v in cut], failed
([(0.0, 0.0), (4.0, 0.0), (4.0, 3.0), (3.0, 3.0), (3.0, 4.0), (0.0, 4.0)], [])
"""
from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass


from .checks import Check, check
from .features.base import FeatureResult, PartOutline, SeatCut
from .geometry import FilletVertex, GeometryError, Line, Point, Profile, fillet_loop

__all__ = ["Part", "BODY", "cut_seats", "seat_checks", "feature_parts"]

BODY = "body"
_ON = 1e-9  # mm: a point this close to a corner or an edge is on it
_WALL_TOL = 0.005  # mm: chord error of the flattened loop the seat wall is measured on


@dataclass(frozen=True)
class Part:
    """One part of a half: its name, material (catalog name), density, finish and closed loop."""

    name: str
    material: str
    density_g_cm3: float
    profile: Profile
    coating: str = "none"


def _on_edge(a: Point, b: Point, p: Point) -> bool:
    """Whether ``p`` lies strictly inside the straight edge a→b."""
    length = math.dist(a, b)
    if length <= _ON:
        return False
    cross = (b[0] - a[0]) * (p[1] - a[1]) - (b[1] - a[1]) * (p[0] - a[0])
    along = ((p[0] - a[0]) * (b[0] - a[0]) + (p[1] - a[1]) * (b[1] - a[1])) / length
    return abs(cross) / length <= _ON and _ON < along < length - _ON


def cut_seats(vertices: Sequence[FilletVertex], seats: Sequence[SeatCut]) -> tuple[list[FilletVertex], list[Check]]:
    """The body's loop corners with every seat cut in, and a failed check for each seat with no place to go."""
    out = list(vertices)
    failed: list[Check] = []
    for seat in seats:
        points = [v.point for v in out]
        if seat.mode == "corner":
            hit = next((i for i, p in enumerate(points) if math.dist(p, seat.at) <= _ON), None)
            if hit is not None:
                out[hit:hit + 1] = seat.corners
                continue
            message = f"the body has no corner at z = {seat.at[0]:.3f}, r = {seat.at[1]:.3f} mm for the seat"
        else:
            # the seat's mouth, from ``at`` to its last corner, must lie on the one edge it is cut into
            n, mouth = len(points), seat.corners[-1].point
            edges = [i for i in range(n) if _on_edge(points[i], points[(i + 1) % n], seat.at)]
            hit = next((i for i in edges if _on_edge(points[i], points[(i + 1) % n], mouth)
                        and math.dist(points[i], seat.at) < math.dist(points[i], mouth)), None)
            if hit is not None:
                out[hit + 1:hit + 1] = seat.corners
                continue
            if edges:
                end = points[(edges[0] + 1) % n]
                message = (f"the seat's mouth from z = {seat.at[0]:.3f}, r = {seat.at[1]:.3f} to z = {mouth[0]:.3f}, "
                           f"r = {mouth[1]:.3f} mm runs off the straight edge it starts on, which ends at "
                           f"z = {end[0]:.3f}, r = {end[1]:.3f} mm")
            else:
                message = (f"the body has no straight edge through z = {seat.at[0]:.3f}, r = {seat.at[1]:.3f} mm "
                           f"for the seat")
        failed.append(check("ring seat on the body", seat.where, False, message))
    return out, failed


def seat_checks(body: Profile, seats: Sequence[SeatCut], min_wall: float) -> list[Check]:
    """The wall behind each seat: from its deepest corners to the body's surfaces that do not touch the seat.

    Surfaces that touch the seat (its own faces, and the faces it opens into) are left out: the part
    fills the seat, so what holds it is the material beyond them.
    """
    import numpy as np  # imported where used: the quick commands never load it
    import shapely  # imported where used: the quick commands never load it
    out: list[Check] = []
    for seat in seats:
        if not seat.bottom:
            continue
        seat_points = [v.point for v in seat.corners] + [seat.at]
        others = []
        for seg in body.segments:
            if any(math.dist(end, p) <= 1e-6 for end in (seg.start, seg.end) for p in seat_points):
                continue
            pts = [seg.start, seg.end] if isinstance(seg, Line) else list(seg.flattened(_WALL_TOL)) + [seg.end]
            others.append(shapely.linestrings(np.asarray(pts, dtype=float)))
        if not others:
            continue
        rest = shapely.union_all(others)
        wall = min(float(shapely.points(p).distance(rest)) for p in seat.bottom)
        out.append(check("wall behind the ring seat", seat.wall_where, wall >= min_wall - 1e-9,
                         f"{wall:.3f} mm from the seat's bottom corner to the body surface, least {min_wall:.3f} mm"))
    return out


def feature_parts(results: Sequence[FeatureResult]) -> tuple[tuple[Part, ...], list[Check]]:
    """The parts the features add, their loops rounded, and a failed check for each radius that does not fit."""
    parts: list[Part] = []
    failed: list[Check] = []
    for result in results:
        for outline in result.parts:
            parts_profile, misfits = _outline_profile(outline)
            if parts_profile is None:
                failed.append(check(f"{outline.name} outline", f"{result.name}.thickness", False,
                                    f"the {outline.name}'s corners do not make a loop"))
                continue
            failed += [check("radius fits its edges", owner, False, f"{owner} is too large for the edges it joins")
                       for owner in misfits]
            parts.append(Part(outline.name, outline.material, outline.density_g_cm3, parts_profile, outline.coating))
    return tuple(parts), failed


def _outline_profile(outline: PartOutline) -> tuple[Profile | None, list[str]]:
    try:
        profile, misfits = fillet_loop(list(outline.corners))
    except GeometryError:
        return None, []
    return (profile, misfits) if profile.signed_area() > 0 else (None, [])
