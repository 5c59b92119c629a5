"""Exact lines, arcs and loops: areas, bounds, fillets, mirroring, immutability."""
from __future__ import annotations

import math

import pytest
import shapely
from hypothesis import given
from hypothesis import strategies as st

from yodraft.geometry import Arc, FilletVertex, GeometryError, Line, Profile, fillet_loop
from yodraft.testing import assert_profiles_close


def circle(center: tuple[float, float], radius: float) -> Profile:
    """A full circle as two counter-clockwise half arcs."""
    first = Arc(center, radius, -math.pi / 2, math.pi)
    return Profile((first, Arc(center, radius, math.pi / 2, math.pi)))


def test_circle_area_is_pi_r_squared() -> None:
    # area of a circle A = π r² (Euclid XII.2)
    assert circle((5.0, 10.0), 3.0).signed_area() == pytest.approx(math.pi * 9.0, rel=1e-15)


def test_bounds_of_an_arc_include_its_extreme_point() -> None:
    assert circle((5.0, 10.0), 3.0).bounds() == pytest.approx((2.0, 7.0, 8.0, 13.0), abs=1e-12)


def test_filleted_square_area() -> None:
    # each rounded corner removes r² − π r²/4 from the square (plane geometry)
    r = 2.0
    loop, misfits = fillet_loop([FilletVertex((0, 0), r), FilletVertex((10, 0), r), FilletVertex((10, 10), r),
                                 FilletVertex((0, 10), r)])
    assert not misfits
    assert loop.signed_area() == pytest.approx(100 - 4 * (r * r - math.pi * r * r / 4), rel=1e-14)
    # shapely, a general-purpose geometry library, agrees on the flattened loop
    # (chords 0.0005 mm inside the arcs cut about 2/3 × sagitta × arc length, 4e-5 of the area)
    assert loop.polygon(0.0005).area == pytest.approx(loop.signed_area(), rel=1e-4)


def test_a_radius_too_large_for_its_edges_is_named() -> None:
    _, misfits = fillet_loop([FilletVertex((0, 0)), FilletVertex((4, 0), 5.0, "rim.edge_radius"),
                              FilletVertex((4, 4)), FilletVertex((0, 4))])
    assert misfits == ["rim.edge_radius"]


def test_open_loop_is_refused() -> None:
    with pytest.raises(GeometryError):
        Profile((Line((0, 0), (1, 0)), Line((1, 0), (1, 1)), Line((1, 1), (0, 2))))


def test_mirror_is_counter_clockwise_with_equal_area() -> None:
    loop, _ = fillet_loop([FilletVertex((0, 1)), FilletVertex((6, 1), 1.0), FilletVertex((6, 5), 1.0),
                           FilletVertex((0, 5))])
    mirror = loop.mirrored()
    assert mirror.signed_area() == pytest.approx(loop.signed_area(), rel=1e-14)
    assert mirror.bounds() == pytest.approx((0.0, -5.0, 6.0, -1.0), abs=1e-12)
    assert_profiles_close(mirror.mirrored(), loop, 1e-12)


def test_bulge_is_tan_quarter_sweep() -> None:
    # DXF reference: a polyline bulge is tan(θ/4); a half circle has bulge 1
    assert Arc((0, 0), 1.0, 0.0, math.pi).bulge == pytest.approx(1.0, rel=1e-15)


def test_segments_and_profiles_are_immutable() -> None:
    line = Line((0, 0), (1, 0))
    arc = Arc((0, 0), 1.0, 0.0, 1.0)
    square = Profile.from_points([(0, 0), (1, 0), (1, 1), (0, 1)])
    for obj, field in ((line, "start"), (arc, "radius"), (square, "segments")):
        with pytest.raises(AttributeError):  # a frozen dataclass's FrozenInstanceError is one too
            setattr(obj, field, None)


@given(st.floats(1, 50), st.floats(1, 50), st.floats(0.01, 0.49))
def test_fillets_keep_the_loop_simple(w: float, h: float, share: float) -> None:
    r = share * min(w, h)
    loop, misfits = fillet_loop([FilletVertex((0, 0), r), FilletVertex((w, 0), r), FilletVertex((w, h), r),
                                 FilletVertex((0, h), r)])
    assert not misfits
    poly = loop.polygon(0.001)
    assert poly.is_valid and isinstance(poly, shapely.Polygon)
    assert loop.signed_area() == pytest.approx(w * h - 4 * r * r * (1 - math.pi / 4), rel=1e-12)


def test_assert_profiles_close_sees_a_moved_corner() -> None:
    a = Profile.from_points([(0, 0), (1, 0), (1, 1), (0, 1)])
    b = Profile.from_points([(0, 0), (1, 0), (1, 1.001), (0, 1)])
    with pytest.raises(AssertionError):
        assert_profiles_close(a, b, 1e-6)


def _direction(seg, at_end: bool):
    from yodraft.geometry import Arc as _Arc

    if isinstance(seg, _Arc):
        a = seg.end_angle if at_end else seg.start_angle
        s = 1.0 if seg.sweep > 0 else -1.0
        return (-s * math.sin(a), s * math.cos(a))
    (z0, r0), (z1, r1) = seg.start, seg.end
    length = math.hypot(z1 - z0, r1 - r0)
    return ((z1 - z0) / length, (r1 - r0) / length)


@pytest.mark.parametrize("sweep", [math.pi / 3, -math.pi / 3])
def test_a_fillet_next_to_an_arc_is_tangent_to_both(sweep: float) -> None:
    # a box whose top edge is an arc (convex or concave); every corner rounded. Tangency (plane geometry):
    # the fillet's centre lies its radius from the line and its radius ± the arc's radius from the arc's centre,
    # and the loop's direction does not jump where a fillet meets an edge
    from yodraft.geometry import Arc as _Arc, FilletVertex, fillet_loop

    corners = [FilletVertex((0.0, 0.0), 1.0, "a"), FilletVertex((10.0, 0.0), 1.0, "b"),
               FilletVertex((10.0, 8.0), 1.0, "c", sweep), FilletVertex((0.0, 8.0), 1.0, "d")]
    profile, misfits = fillet_loop(corners)
    assert misfits == []
    segs = profile.segments
    for a, b in zip(segs, segs[1:] + segs[:1]):
        assert math.dist(a.end, b.start) < 1e-9
        da, db = _direction(a, True), _direction(b, False)
        assert da[0] * db[0] + da[1] * db[1] == pytest.approx(1.0, abs=1e-9)
    big = [s for s in segs if isinstance(s, _Arc) and s.radius > 1.5]
    assert len(big) == 1 and abs(big[0].sweep) < abs(sweep)  # the top arc, trimmed by the two fillets
    for fillet in (s for s in segs if isinstance(s, _Arc) and abs(s.radius - 1.0) < 1e-12):
        d = math.dist(fillet.center, big[0].center)
        if abs(abs(d - big[0].radius) - 1.0) < 1e-9:
            continue  # touches the arc
        # otherwise it rounds one of the two lower corners, between lines
        assert min(abs(fillet.center[1]), abs(fillet.center[0]), abs(10 - fillet.center[0])) == pytest.approx(1.0)


def test_a_fillet_too_big_for_an_arc_edge_is_a_misfit() -> None:
    from yodraft.geometry import FilletVertex, fillet_loop

    corners = [FilletVertex((0.0, 0.0)), FilletVertex((10.0, 0.0)), FilletVertex((10.0, 8.0), 9.0, "c", math.pi / 3),
               FilletVertex((0.0, 8.0))]
    _, misfits = fillet_loop(corners)
    assert misfits == ["c"]


@given(st.floats(2.0, 20.0), st.floats(2.0, 20.0), st.floats(0.05, 0.7), st.floats(0.05, 0.7))
def test_the_straight_loop_pass_equals_the_general_pass(w: float, h: float, share_a: float, share_b: float) -> None:
    """A loop of straight edges takes a shorter pass; it must give what the general pass gives, fillets that
    overlap on an edge included (then the general pass leaves both corners sharp and names them).
    Reference: the general pass of ``fillet_loop`` (the same rule, corner by corner)."""
    import yodraft.geometry as geometry

    corners = [FilletVertex((0.0, 1.0), share_a * min(w, h), "a"), FilletVertex((w, 1.0), share_b * min(w, h), "b"),
               FilletVertex((w, 1.0 + h), share_a * min(w, h), "c"), FilletVertex((0.0, 1.0 + h))]
    fast = fillet_loop(corners)
    keep = geometry._straight_loop
    geometry._straight_loop = lambda *args: None
    try:
        general = fillet_loop(corners)
    finally:
        geometry._straight_loop = keep
    assert fast == general
    assert [type(s) for s in fast[0].segments] == [type(s) for s in general[0].segments]


def test_every_template_loop_is_the_same_by_either_pass() -> None:
    """Every template's body loop from the straight-loop pass equals the general pass's, segment by segment."""
    from pathlib import Path

    import yodraft.geometry as geometry
    from yodraft import build, load

    templates = sorted((Path(__file__).parents[1] / "templates").glob("*.toml"))
    assert templates
    for path in templates:
        fast = build(load(path)).profile
        keep = geometry._straight_loop
        geometry._straight_loop = lambda *args: None
        try:
            general = build(load(path)).profile
        finally:
            geometry._straight_loop = keep
        assert fast == general, path.name
