"""Numbers a metric shop reads: µm limits, the hole callout, edges and the material's standard name."""
from __future__ import annotations

import math

import pytest

import yodraft
from conftest import TEMPLATES
from yodraft.drawing.notes import seat_corner_passing_mm, thread_designation
from yodraft.drawing.numbers import deviation_text, limits_um, size_text, tolerance_text
from yodraft.summary import back_wall_mm


def test_symmetric_zone_to_the_um() -> None:
    # Ø6.31806 ±0.01524 (0.0006 in): basic 6.318 (rounding moves it 0.06 µm), ± cut down to 0.015
    assert limits_um(6.31806, 0.01524) == (6.318, 0.015, -0.015)
    assert tolerance_text(6.31806, 0.01524, inch=True) == "±0.015\n[0.24874 ±0.00060 in]"


def test_zone_rounded_inward_when_the_basic_moves_much() -> None:
    # 1.0004 ±0.001: rounding to 1.000 moves it 0.4 µm (> 1/20 of 1 µm), so the limits 1.0014 and 0.9994 are
    # cut inward to 1.001 and 1.000
    assert limits_um(1.0004, 0.001) == (1.0, 0.001, 0.0)
    assert deviation_text(0.001, 0.0) == "+0.001/0"


def test_sizes_have_at_most_three_decimals() -> None:
    assert size_text(19.61875) == "19.619" and size_text(8.0) == "8" and size_text(0.2) == "0.2"


@pytest.fixture(scope="module")
def resolved() -> yodraft.Resolved:
    return yodraft.build(yodraft.load(TEMPLATES / "string-trick.toml"))


def test_hole_callout(resolved: yodraft.Resolved) -> None:
    assert thread_designation(resolved) == "M4×0.7-6H ↧8"  # ISO 965-1 class 6H; full thread 8 mm (the design)
    d = resolved.features["axle_bore"].dims
    assert d["tap_drill"] == pytest.approx(3.3)  # ISO 2306: tap drill for M4×0.7 is D − P = 3.3 mm
    # the drill point: a 118° twist drill (from memory) of Ø3.3 ends 1.65 / tan 59° beyond the full diameter
    v = resolved.values
    tip = v["bearing_seat.post_face_z"] + d["drill_depth"] + 1.65 / math.tan(math.radians(59))
    hub_face = v["rim.flat_z"] + v["rim.hub_height"]
    assert back_wall_mm(resolved) == pytest.approx(hub_face - tip)
    assert back_wall_mm(resolved) >= resolved.design["shop"]["min_wall"]
    data = yodraft.summary(resolved)["axle_bore"]
    assert data["back_wall_mm"] == pytest.approx(hub_face - tip) and data["tap_drill_mm"] == pytest.approx(3.3)


def test_seat_corner_passing_stays_under_the_ring_chamfer(resolved: yodraft.Resolved) -> None:
    # R188: inner ring chamfer r_s min 0.003 in = 0.0762 mm (from memory); half of it, to 0.01 mm, is 0.03
    assert resolved["bearing.chamfer"] == pytest.approx(0.0762)
    assert seat_corner_passing_mm(resolved) == pytest.approx(0.03)


def test_material_standard_designation(resolved: yodraft.Resolved) -> None:
    # EN 573-3: wrought 6061 is EN AW-6061; temper T6 per EN 515
    assert resolved["material.designation"] == "EN AW-6061-T6"
    assert "EN 573-3" in resolved["material.designation_source"]
