"""The silhouette of a solid of revolution seen from the side: the largest radius at each axial station.

The outline is exact: it is made of pieces of the loops' own lines and arcs. A simple
loop's segments never cross, so the highest segment over an interval can change only
at the axial station of some segment's end (or of an arc's extreme in z); between
those stations one segment stays on top.

>>> from yodraft.geometry import Profile
>>> step = Profile.from_points([(0, 0), (4, 0), (4, 1), (2, 1), (2, 3), (0, 3)])
>>> [(s.start, s.end) for s in outline_chains([step.segments])[0]]  # doctest: +NORMALIZE_WHITESPACE
[((0.0, 0.0), (0.0, 3.0)), ((0.0, 3.0), (2.0, 3.0)), ((2.0, 3.0), (2.0, 1.0)), ((2.0, 1.0), (4.0, 1.0)),
 ((4.0, 1.0), (4.0, 0.0))]
"""
from __future__ import annotations

import math
from collections.abc import Iterable, Sequence
from typing import NamedTuple

from ..geometry import Arc, Line, Segment

__all__ = ["outline_chains", "outline_runs", "creases"]

_EPS = 1e-9


class _Piece(NamedTuple):
    """Part of a segment over which z only grows or only falls: ``z_lo`` to ``z_hi``."""

    owner: int
    source: int
    seg: Segment
    z_lo: float
    z_hi: float

    def r_at(self, z: float) -> float:
        s = self.seg
        if isinstance(s, Line):
            (z0, r0), (z1, r1) = s.start, s.end
            return r0 + (r1 - r0) * (z - z0) / (z1 - z0)
        zc, rc = s.center
        mid = s.start_angle + s.sweep / 2
        root = math.sqrt(max(0.0, s.radius ** 2 - (z - zc) ** 2))
        return rc + root if math.sin(mid) > 0 else rc - root

    def between(self, za: float, zb: float) -> Segment:
        """The part of the piece from station ``za`` to ``zb`` (za < zb), running toward +z."""
        s = self.seg
        if isinstance(s, Line):
            return Line((za, self.r_at(za)), (zb, self.r_at(zb)))
        zc, rc = s.center
        a0 = math.atan2(self.r_at(za) - rc, za - zc)
        a1 = math.atan2(self.r_at(zb) - rc, zb - zc)
        sweep = math.remainder(a1 - a0, 2 * math.pi)
        if abs(sweep) < 1e-12:  # a sliver of arc too short to turn: its chord is the same to the page
            return Line((za, self.r_at(za)), (zb, self.r_at(zb)))
        return Arc(s.center, s.radius, a0, sweep)


def _pieces(owner: int, index: int, seg: Segment) -> list[_Piece]:
    if isinstance(seg, Line):
        z0, z1 = seg.start[0], seg.end[0]
        return [] if abs(z1 - z0) < _EPS else [_Piece(owner, index, seg, min(z0, z1), max(z0, z1))]
    # split the arc where z passes an extreme (angle a multiple of pi)
    lo, hi = sorted((seg.start_angle, seg.end_angle))
    cuts = [lo] + [k * math.pi for k in range(math.ceil(lo / math.pi), math.floor(hi / math.pi) + 1)
                   if lo + _EPS < k * math.pi < hi - _EPS] + [hi]
    out = []
    for a, b in zip(cuts, cuts[1:]):
        part = Arc(seg.center, seg.radius, a, b - a)
        z0, z1 = part.start[0], part.end[0]
        if abs(z1 - z0) > _EPS:
            out.append(_Piece(owner, index, part, min(z0, z1), max(z0, z1)))
    return out


def outline_chains(loops: Iterable[Sequence[Segment]]) -> list[list[Segment]]:
    """The upper outline (r ≥ 0) of the loops together, as chains from the axis round to the axis.

    Each chain runs toward +z: up from the axis, along the largest radius, down to the axis;
    a stretch of z with no material ends one chain and starts the next.
    """
    chains = []
    for run in outline_runs(loops, split_owners=False):
        chains.append(run[1])
    return chains


def outline_runs(loops: Iterable[Sequence[Segment]], split_owners: bool = True) -> list[tuple[int, list[Segment]]]:
    """The upper outline split where another loop becomes the outermost: (loop index, chain) pairs.

    Seen from the side, the outermost surface at each station hides everything inside
    it, so each run is the visible region of one loop (a part). Every chain starts and
    ends on the axis; with ``split_owners=False`` a run spans loops (owner of its first piece).
    """
    loops = list(loops)
    pieces = [p for owner, loop in enumerate(loops) for i, seg in enumerate(loop) for p in _pieces(owner, i, seg)]
    if not pieces:
        return []
    stations = sorted({round(z, 9) for p in pieces for z in (p.z_lo, p.z_hi)})
    runs: list[tuple[int, list[Segment]]] = []
    current: list[Segment] = []
    owner = -1
    last: _Piece | None = None
    last_end: tuple[float, float] | None = None

    def close() -> None:
        nonlocal current, last_end, last
        if current and last_end is not None:
            if last_end[1] > _EPS:
                current.append(Line(last_end, (last_end[0], 0.0)))
            runs.append((owner, current))
        current, last_end, last = [], None, None

    for za, zb in zip(stations, stations[1:]):
        mid = (za + zb) / 2
        covering = [p for p in pieces if p.z_lo <= za + 1e-7 and p.z_hi >= zb - 1e-7]
        if not covering:
            close()
            continue
        top = max(covering, key=lambda p: (p.r_at(mid), -p.owner, -p.source))
        if split_owners and last is not None and top.owner != owner:
            close()
        part = top.between(max(za, top.z_lo), min(zb, top.z_hi))
        if last_end is None:
            owner = top.owner
            if part.start[1] > _EPS:
                current.append(Line((part.start[0], 0.0), part.start))
        elif math.dist(last_end, part.start) > 1e-7:
            current.append(Line(last_end, part.start))
        elif last is not None and (top.owner, top.source) == (last.owner, last.source) and current \
                and type(current[-1]) is type(part):
            part = _joined(current.pop(), part)
        current.append(part)
        last_end, last = part.end, top
    close()
    return runs


def _joined(a: Segment, b: Segment) -> Segment:
    """Two consecutive pieces of one segment as one."""
    if isinstance(a, Line):
        return Line(a.start, b.end)
    assert isinstance(b, Arc)
    return Arc(a.center, a.radius, a.start_angle, a.sweep + b.sweep)


def _direction(seg: Segment, at_end: bool) -> tuple[float, float]:
    if isinstance(seg, Line):
        dz, dr = seg.end[0] - seg.start[0], seg.end[1] - seg.start[1]
        n = math.hypot(dz, dr)
        return dz / n, dr / n
    a = seg.end_angle if at_end else seg.start_angle
    sign = 1.0 if seg.sweep > 0 else -1.0
    return -math.sin(a) * sign, math.cos(a) * sign


def creases(chain: Sequence[Segment], min_angle: float = math.radians(2)) -> list[tuple[float, float]]:
    """(z, r) of each sharp corner along a chain's top: a circular edge, seen from the side as a line."""
    out = []
    for a, b in zip(chain, chain[1:]):
        if a.end[1] <= _EPS or abs(a.start[0] - a.end[0]) < _EPS and abs(b.start[0] - b.end[0]) < _EPS:
            continue
        u, v = _direction(a, True), _direction(b, False)
        if math.acos(max(-1.0, min(1.0, u[0] * v[0] + u[1] * v[1]))) > min_angle:
            out.append(a.end)
    return out
