"""The rules over any outer shape: the quick searches give exactly what the plain definitions give.

``least_wall`` measures only the pairs of surfaces that could be the closest, and ``reentrant_regions``
works on arrays; each is compared here with the definition written out straight (every pair measured,
every sample point walked one by one) on every template, the valid corpus and grids of variants that
pass and fail.
"""
from __future__ import annotations

from functools import lru_cache

import numpy as np
import pytest
import shapely

import yodraft
from conftest import ROOT, TEMPLATES
from yodraft.builder import build
from yodraft.checks import (LOOP_CHECK_TOLERANCE, Reentrant, _faces,
                            _inward_normal, _on_axis, _sample, hidden_regions, least_wall, reentrant_regions, thin_walls,
                            crossing_free)
from yodraft.design import with_values
from yodraft.geometry import Profile

DESIGNS = sorted(TEMPLATES.glob("*.toml")) + sorted((ROOT / "tests" / "corpus" / "valid").glob("*.toml"))
#: (design, key, values): grids that reach thin walls, crossing loops and deep undercuts
GRIDS = [
    ("string-trick.toml", "features.rim.band_width", np.linspace(2.0, 12.0, 9)),
    ("string-trick.toml", "features.rim.thickness", np.linspace(0.8, 6.0, 9)),
    ("string-trick.toml", "features.bearing_seat.spacing", np.linspace(0.5, 8.0, 7)),
    ("undercut-rim.toml", "features.rim.band_width", np.linspace(3.0, 12.0, 7)),
    ("arc-organic.toml", "features.rim.thickness", np.linspace(0.8, 6.0, 7)),
    ("sketched.toml", "features.bearing_seat.spacing", np.linspace(0.5, 6.0, 7)),
    ("bimetal-ring.toml", "features.rim.thickness", np.linspace(1.0, 8.0, 7)),
]


@lru_cache(maxsize=None)
def _loops() -> tuple[tuple[str, Profile], ...]:
    out = [(path.name, build(yodraft.load(path)).profile) for path in DESIGNS]
    for name, key, values in GRIDS:
        base = yodraft.load(TEMPLATES / name)
        for v in values:
            try:
                profile = build(with_values(base, [(key, float(v))])).profile
            except ValueError:
                continue
            out.append((f"{name} {key}={v:.3f}", profile))
    return tuple((name, p) for name, p in out if p is not None)


def _least_wall_by_definition(profile: Profile) -> tuple[float, tuple[float, float], tuple[float, float]] | None:
    """Every pair of surfaces that are not neighbours measured, judged from the closest up."""
    segs = profile.segments
    n = len(segs)
    tol = LOOP_CHECK_TOLERANCE
    lines = [shapely.linestrings(np.asarray(tuple(s.flattened(tol)) + (s.end,))) if hasattr(s, "center")
             else shapely.linestrings(np.asarray((s.start, s.end))) for s in segs]
    pairs = [(i, j) for i in range(n) for j in range(i + 2, n)
             if not (i == 0 and j == n - 1) and not _on_axis(segs[i]) and not _on_axis(segs[j])]
    dist = [float(shapely.distance(lines[i], lines[j])) for i, j in pairs]
    poly = profile.polygon(tol)
    for k in sorted(range(len(pairs)), key=lambda k: dist[k]):
        (i, j), d = pairs[k], dist[k]
        if d < 1e-9:
            continue
        (pz, pr), (qz, qr) = shapely.shortest_line(lines[i], lines[j]).coords
        u = ((qz - pz) / d, (qr - pr) / d)
        if not poly.contains(shapely.points((pz + qz) / 2, (pr + qr) / 2)):
            continue
        if _faces(segs, i, (pz, pr), u) and _faces(segs, j, (qz, qr), (-u[0], -u[1])):
            return d, (pz, pr), (qz, qr)
    return None


def _reentrant_by_definition(profile: Profile) -> tuple[Reentrant, ...]:
    """Each sample point walked one by one: a straight ray out along +r and both ways along z, each blocked
    when it crosses an edge of the flattened loop."""
    segs = profile.segments
    flat = profile.flatten(LOOP_CHECK_TOLERANCE)
    edges = list(zip(flat, flat[1:] + flat[:1]))

    def crossings(start: tuple[float, float], along: int) -> list[float]:
        across = 1 - along
        out = []
        for a, b in edges:
            if min(a[across], b[across]) <= start[across] < max(a[across], b[across]):
                share = (start[across] - a[across]) / (b[across] - a[across])
                out.append(a[along] + share * (b[along] - a[along]))
        return out

    hidden = []
    for i, seg in enumerate(segs):
        if _on_axis(seg):
            continue
        for t in (0.15, 0.5, 0.85):
            p = _sample(seg, t)
            n = _inward_normal(seg, p)
            s = (p[0] - 0.05 * n[0], p[1] - 0.05 * n[1])
            radial = any(h > s[1] for h in crossings(s, 1))
            axial = crossings(s, 0)
            if radial and any(h < s[0] for h in axial) and any(h > s[0] for h in axial):
                hidden.append(i)
    return hidden_regions(segs, hidden)


def test_the_grids_reach_thin_walls_and_undercuts() -> None:
    walls = [least_wall(p) for _, p in _loops()]
    assert len(_loops()) > 50
    assert min(w[0] for w in walls if w) < 0.5 < max(w[0] for w in walls if w)
    assert any(reentrant_regions(p) for _, p in _loops())


def test_least_wall_is_the_closest_facing_pair_of_all() -> None:
    wrong = [name for name, p in _loops() if least_wall(p) != _least_wall_by_definition(p)]
    assert not wrong


def test_reentrant_regions_are_those_of_every_sample_walked() -> None:
    wrong = [name for name, p in _loops() if reentrant_regions(p) != _reentrant_by_definition(p)]
    assert not wrong


@pytest.mark.parametrize("below", [0.3, 0.5, 0.8, 1.5])
def test_thin_walls_give_the_closest_facing_pair_cut_at_the_limit(below: float) -> None:
    # a sweep asks only whether a wall is thinner than the shop's least, for all its loops at once: the answer
    # must be the full search's (every pair measured), cut at the limit, loop by loop and for all together
    loops = _loops()
    expected = [(full := _least_wall_by_definition(p)) is not None and full[0] < below for _, p in loops]
    assert thin_walls([p for _, p in loops], [below] * len(loops)) == expected
    assert [thin_walls([p], [below])[0] for _, p in loops] == expected
    assert any(expected) and not all(expected)


def test_thin_walls_with_a_limit_of_each_loop_its_own() -> None:
    # loops stacked together, each with its own least wall: the pairs first picked for the whole stack (at its
    # largest limit) must not hide a pair from any loop, nor lend one to a loop of a smaller limit
    loops = _loops()
    below = [(0.3, 1.5, 0.5, 0.8)[k % 4] for k in range(len(loops))]
    expected = [(full := _least_wall_by_definition(p)) is not None and full[0] < b for (_, p), b in zip(loops, below)]
    assert thin_walls([p for _, p in loops], below) == expected
    assert any(expected) and not all(expected)


def test_crossing_free_is_shapely_simplicity_of_each_ring() -> None:
    # the loops' rings made all at once must be judged as each ring made alone (shapely's is_simple)
    loops = [p for _, p in _loops()]
    crossed = build(with_values(yodraft.load(TEMPLATES / "string-trick.toml"), [("features.rim.thickness", 30.0)])).profile
    loops.append(crossed)
    alone = [bool(shapely.linearrings(p.flat_array(LOOP_CHECK_TOLERANCE)).is_simple) for p in loops]
    assert crossing_free(loops) == alone
    assert not alone[-1]


def test_crossing_free_of_stacked_loops_is_each_rings_own() -> None:
    # a sweep's chunk lays the rings of a stack out together (shared arcs once, the rest arc place by arc place);
    # the verdicts must be each ring's own (shapely's is_simple of its flattened loop), whether the stack could
    # be laid out together (thicknesses: the same number of points at every arc place) or not (edge radii:
    # an arc flattens to more points as it grows), crossed loops among them
    from yodraft.checks import _stack_rings, loop_stacks

    base = yodraft.load(TEMPLATES / "string-trick.toml")
    loops = [build(with_values(base, [("features.rim.thickness", t)])).profile for t in (3.0, 3.5, 4.0, 30.0, 4.5)]
    loops += [build(with_values(base, [("features.rim.edge_radius", e)])).profile for e in (0.5, 1.0, 2.5)]
    loops += [p for _, p in _loops()]
    alone = [bool(shapely.linearrings(Profile(p.segments).flat_array(LOOP_CHECK_TOLERANCE)).is_simple) for p in loops]
    stacks = loop_stacks(loops)
    laid = [_stack_rings([loops[b] for b in s.members], s, LOOP_CHECK_TOLERANCE) for s in stacks]
    assert any(x is not None and x.shape[0] >= 4 for x in laid) and any(x is None for x in laid)
    for s, x in zip(stacks, laid):  # a ring laid out with its stack is its loop's own flattening, to the bit
        for row, b in zip(x if x is not None else (), s.members):
            assert row.tobytes() == Profile(loops[b].segments).flat_array(LOOP_CHECK_TOLERANCE).tobytes()
    assert crossing_free(loops, stacks) == alone
    assert not alone[3] and any(alone)


def test_areas_and_bounds_worked_out_at_once_are_each_loops_own_to_the_bit() -> None:
    """A sweep works out every loop's signed area and bounds at once; each must be, to the bit (``float.hex``),
    what the loop's own Green's-theorem sum and extent give (reference: ``Profile.signed_area`` and
    ``Profile.bounds`` of a fresh copy of the loop; a square's and a circle's as a sanity anchor)."""
    import math

    from yodraft.checks import loop_stacks, prime_areas_and_bounds
    from yodraft.geometry import Arc

    loops = [p for _, p in _loops()]
    circle = Profile((Arc((0.0, 3.0), 2.0, 0.0, math.pi), Arc((0.0, 3.0), 2.0, math.pi, math.pi)))
    square = Profile.from_points([(0, 1), (1, 1), (1, 2), (0, 2)])
    fresh = [Profile(p.segments) for p in loops + [circle, square]]
    primed = [Profile(p.segments) for p in loops + [circle, square]]
    prime_areas_and_bounds(primed, loop_stacks(primed))
    assert len({tuple(map(type, p.segments)) for p in primed}) > 3  # several runs of lines and arcs, stacked apart
    for a, b in zip(fresh, primed):
        assert "_signed_area" in b.__dict__ and "_bounds" in b.__dict__
        assert a.signed_area().hex() == b.signed_area().hex()
        assert [x.hex() for x in a.bounds()] == [x.hex() for x in b.bounds()]
    assert primed[-2].signed_area() == pytest.approx(math.pi * 4)  # a circle of radius 2: πr²
    assert primed[-1].signed_area() == 1.0 and primed[-1].bounds() == (0.0, 1.0, 1.0, 2.0)  # the unit square


def _sketched_with_a_pin(radius_mm: float) -> Profile:
    """The sketched template with its hub cut down to a pin of ``radius_mm`` on the axis, well clear of the
    axle bore (so no pair of surfaces is near it: only the metal across the axis is thin)."""
    text = (TEMPLATES / "sketched.toml").read_text(encoding="utf-8")
    for old, new in (('z = "-9 mm"\nr = "6 mm"\nradius = "1 mm"', f'z = "-6 mm"\nr = "{radius_mm} mm"'),
                     ('z = "-2 mm"\nr = "5 mm"', f'z = "-2 mm"\nr = "{radius_mm} mm"'),
                     ('z = "-8 mm"\nr_from = "outer diameter"\nr = "-5 mm"', 'z = "-5 mm"\nr_from = "outer diameter"\nr = "-5 mm"')):
        assert text.count(old) == 1, old
        text = text.replace(old, new)
    return build(yodraft.loads(text)).profile


def _axis_wall_by_definition(profile: Profile) -> float | None:
    """Every surface walked at 400 points: where its inward normal points at the axis within FACING_DEG and
    the metal reaches all the way down to the axis (no bore between), the solid turned round it is 2·r across."""
    import math

    poly = profile.polygon(LOOP_CHECK_TOLERANCE)
    least = None
    for seg in profile.segments:
        if _on_axis(seg):
            continue
        for t in np.linspace(0.0, 1.0, 401):
            p = _sample(seg, float(t))
            n = _inward_normal(seg, p)
            down = shapely.LineString([(p[0], p[1] - min(0.04, p[1] / 2)), (p[0], 0.0)])  # to the axis
            if n[1] <= -math.cos(math.radians(30.0)) and p[1] > 0 and poly.covers(down):
                least = 2 * p[1] if least is None else min(least, 2 * p[1])
    return least


def test_the_wall_across_the_axis_is_the_definition_walked() -> None:
    """``axis_wall`` (a few points a surface) against every surface walked finely, on every loop of the
    grids and on two pins; a pin of radius 0.2 mm is 0.4 mm across (plane geometry), and the batched
    ``thin_walls`` fails it against a 0.5 mm least wall as the full measure does."""
    from yodraft.checks import axis_wall

    pins = [_sketched_with_a_pin(0.2), _sketched_with_a_pin(1.5)]
    loops = [p for _, p in _loops()] + pins
    for p in loops:
        walked, found = _axis_wall_by_definition(p), axis_wall(p)
        assert (walked is None) == (found is None)
        if found is not None:  # the walk's steps along an arc may step past the exact least
            assert found[0] <= walked + 1e-9 and walked - found[0] < 0.01
    assert axis_wall(pins[0])[0] == pytest.approx(0.4, abs=1e-9)
    assert axis_wall(pins[1])[0] == pytest.approx(3.0, abs=1e-9)
    assert thin_walls(pins, [0.5, 0.5]) == [True, False]
