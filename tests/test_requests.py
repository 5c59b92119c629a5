"""The dimension requests: each measures the drawn profile and equals the value the design resolved to;
the labels follow ISO 129-1 (Ø, R prefixes; auxiliary dimensions in parentheses)."""
from __future__ import annotations

import math
from pathlib import Path

import pytest

from yodraft.builder import build
from yodraft.design import load
from yodraft.drawing.requests import (DimensionRequest, detail_requests, format_value, label, measure,
                                      section_requests)

TEMPLATES = sorted((Path(__file__).resolve().parents[1] / "templates").glob("*.toml"))


#: the keys only the cone family's own outer shape carries
CONE_ONLY = ("rim.", "catch_zone.")


def _expected(r) -> dict[str, float]:
    """What each key's dimension must read (mm; angles in degrees)."""
    v = r.values
    zb = v["shape.face_z"]
    out = _common(r, zb)
    if v["shape.kind"] == "cone":
        return out
    out = {k: x for k, x in out.items() if not k.startswith(CONE_ONLY)}
    # a given shape: every point's diameter and its axial position from datum face B (the wall face and
    # datum B themselves aside), every corner radius
    n = sum(1 for k in v if k.startswith("shape.point_") and k.endswith("_z"))
    for i in range(n):
        z, d = v[f"shape.point_{i}_z"], v[f"shape.point_{i}_diameter"]
        if d > 0 and abs(d - v["pad_groove.outer_diameter"]) > 1e-9:  # that diameter is dimensioned once, on the groove
            out[f"shape.point_{i}_diameter"] = d
        if abs(z - zb) > 1e-9 and abs(z - v["bearing_seat.wall_face_z"]) > 1e-9:
            out[f"shape.point_{i}_z"] = zb - z
    for c in r.features["shape"].chunks["outer"]:
        if c.radius > 0:
            out[c.owner] = c.radius
    if v["shape.kind"] == "sketch":  # every arc of the chain shows the radius the design gave it
        for i, point in enumerate(r.design.features["shape"]["points"]):
            if point["arc"] in ("convex", "concave"):
                out[f"shape.points[{i}].arc_radius"] = point["arc_radius"]
    elif v["shape.kind"] == "arc":
        out["shape.catch_radius"] = v["shape.catch_radius"]
    return out


def _common(r, zb: float) -> dict[str, float]:
    v = r.values
    return {
        "rim.diameter": v["rim.diameter"], "rim.cup_diameter": v["rim.cup_diameter"],
        "rim.hub_diameter": v["rim.hub_diameter"], "rim.band_width": v["rim.band_width"], "rim.hub_height": v["rim.hub_height"],
        # the cup floor and the hub face from datum face B
        "rim.flat_z": zb - v["rim.flat_z"], "rim.hub_face_z": zb - v["rim.hub_face_z"],
        "rim.floor_angle": math.degrees(v["rim.floor_angle"]),
        "catch_zone.start_diameter": v["catch_zone.start_diameter"],
        "catch_zone.angle": math.degrees(v["catch_zone.angle"]),
        "pad_groove.inner_diameter": v["pad_groove.inner_diameter"],
        "pad_groove.outer_diameter": v["pad_groove.outer_diameter"], "pad_groove.depth": v["pad_groove.depth"],
        "bearing_seat.wall_bore": v["bearing_seat.wall_bore"],
        "bearing_seat.seat_face_diameter": v["bearing_seat.seat_face_diameter"],
        "bearing_seat.post_diameter": v["bearing_seat.post_diameter"],
        "bearing_seat.seat_face_z": zb - v["bearing_seat.seat_face_z"],
        "bearing_seat.post_face_z": zb - v["bearing_seat.post_face_z"],
        "bearing_seat.post_length": v["bearing_seat.post_length"],
        "bearing_seat.wall_offset": v["bearing_seat.wall_offset"],
        "vent_groove.depth": v["vent_groove.depth"],
        "axle_bore.major_diameter": v["axle_bore.major_diameter"],
        "axle_bore.tap_drill": v["axle_bore.tap_drill"],
        "rim.edge_radius": v["rim.edge_radius"], "rim.lip_radius": v["rim.lip_radius"],
        "rim.cup_radius": v["rim.cup_radius"], "catch_zone.edge_radius": v["catch_zone.edge_radius"],
    }


@pytest.mark.parametrize("path", TEMPLATES, ids=lambda p: p.stem)
def test_every_request_measures_what_the_design_resolved(path):
    r = build(load(path))
    requests = section_requests(r) + detail_requests(r)
    shown = {key: req for req in requests for key in req.keys}
    for key, value in _expected(r).items():
        assert key in shown, f"no dimension for {key}"
        assert measure(shown[key]) == pytest.approx(value, abs=1e-6), key
    # a surface shown twice (the cup floor in the band's end plane, the flat floor at the pad groove's
    # diameter) is dimensioned once
    v = r.values
    if v["shape.kind"] == "cone":
        assert ("rim.cup_depth" in shown) == (abs(v["rim.floor_z"] - v["catch_zone.end_z"]) > 1e-6)
        assert ("rim.floor_diameter" in shown) == (abs(v["rim.floor_diameter"] - v["pad_groove.outer_diameter"]) > 1e-6)
    # the hole's depths are written with their diameters, with the depth symbol (ISO 129-1)
    assert shown["axle_bore.thread_depth"].text.endswith(f"↧{v['axle_bore.thread_depth']:g}")
    assert shown["axle_bore.drill_depth"].text.endswith(f"↧{v['axle_bore.drill_depth']:g}")


def test_angle_is_counter_clockwise_from_p1_to_p2():
    # a right angle: from the +z axis to the +r axis, counter-clockwise (plane geometry)
    req = DimensionRequest(("x.angle",), "angle", ((0.0, 0.0), (1.0, 0.0), (0.0, 1.0)))
    assert measure(req) == pytest.approx(90.0)


def test_labels_follow_iso_129():
    # ISO 129-1: Ø before a diameter, R before a radius, an auxiliary dimension in parentheses, no trailing zeros
    dia = DimensionRequest(("a.d",), "diameter", ((0.0, 5.0),), tolerance="±0.01")
    assert label(dia, format_value(measure(dia), 2)) == "Ø10 ±0.01"
    rad = DimensionRequest(("a.r",), "radius", ((0.0, 0.0), (0.0, 1.5)), auxiliary=True)
    assert label(rad, format_value(measure(rad), 2)) == "(R1.5)"


def test_a_request_refuses_a_wrong_number_of_points():
    with pytest.raises(ValueError):
        DimensionRequest(("a.d",), "diameter", ((0.0, 1.0), (2.0, 1.0)))
    with pytest.raises(ValueError):
        DimensionRequest(("a.l",), "linear", ((0.0, 1.0), (2.0, 1.0)))  # no direction


@pytest.mark.parametrize("path", TEMPLATES, ids=lambda p: p.stem)
def test_a_radius_carries_its_whole_arc(path):
    # a radius's leader leaves its arc radially (ISO 129-1): each request carries the arc's middle and both
    # its ends, all at the radius it shows from its centre, so the layout may try along the whole arc when
    # the middle has no room
    r = build(load(path))
    radii = [q for q in section_requests(r) + detail_requests(r) if q.kind == "radius"]
    assert radii
    for req in radii:
        assert len(req.points) == 4, req.keys
        centre, *on_arc = req.points
        for p in on_arc:
            assert math.dist(centre, p) == pytest.approx(measure(req), abs=1e-9), req.keys
