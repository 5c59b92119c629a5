"""Response pads and the silicone recess: the pad's own volume gives its mass, how far it stands proud of the
wall face, the pads' distance across the gap, and the recess's silicone in the assembly."""
from __future__ import annotations

import math

import pytest

import yodraft
from conftest import set_in
from yodraft.catalog.pads import PAD_CLASSES, SILICONE_RECESS


def _build(text: str):
    return yodraft.build(yodraft.loads(text))


def _pad_mass(summary: dict) -> float:
    return next(line["each_g"] for line in summary["mass"]["budget"] if line["part"] == "response pad")


def test_pad_mass_is_its_own_volume_not_the_groove_depth(string_trick_text: str) -> None:
    # hollow cylinder V = π/4 (D² − d²) t (any handbook); the 19 mm class: pad Ø19, inner Ø14, t from the catalog
    pad = PAD_CLASSES["19 mm"]
    volume = math.pi / 4 * (19.0**2 - 14.0**2) * pad.pad_thickness_mm
    shallow = yodraft.summary(_build(string_trick_text))
    deeper = yodraft.summary(_build(set_in(string_trick_text, "features.pad_groove", "depth", "1.6 mm")))
    assert _pad_mass(shallow) == pytest.approx(pad.pad_density_g_cm3 * volume / 1000, rel=1e-12)
    assert _pad_mass(deeper) == pytest.approx(_pad_mass(shallow), rel=1e-12)  # a deeper groove recesses the pad
    assert shallow["pads"]["proud_mm"] == pytest.approx(pad.pad_thickness_mm - pad.groove_depth_mm, abs=1e-12)
    assert deeper["pads"]["proud_mm"] == pytest.approx(pad.pad_thickness_mm - 1.6, abs=1e-12)


def test_pad_to_pad_distance_is_the_gap_less_both_pads(string_trick_text: str) -> None:
    s = yodraft.summary(_build(string_trick_text))
    assert s["pads"]["pad_to_pad_mm"] == pytest.approx(s["profile"]["gap_mm"] - 2 * s["pads"]["proud_mm"], abs=1e-12)


def test_a_sunk_pad_fails_and_names_the_depth(string_trick_text: str) -> None:
    # 1.5 mm pad in a 2 mm groove: 0.5 mm below the face, more than the 0.2 mm allowed
    r = _build(set_in(string_trick_text, "features.pad_groove", "depth", "2 mm"))
    failed = {(c.name, c.feature, c.parameter) for c in r.failed}
    assert ("pad not sunk below the wall face", "pad_groove", "depth") in failed
    ok = _build(set_in(set_in(string_trick_text, "features.pad_groove", "depth", "2 mm"),
                       "features.pad_groove", "max_below", "0.6 mm"))
    assert not any(c.name == "pad not sunk below the wall face" for c in ok.failed)


def test_a_pad_too_proud_for_the_gap_fails(string_trick_text: str) -> None:
    # a 3 mm pad in a 1.3 mm groove stands 1.7 mm proud: more than a quarter of the 4.3625 mm gap
    r = _build(set_in(string_trick_text, "features.pad_groove", "pad_thickness", "3 mm"))
    assert [c.name for c in r.failed] == ["pad proud within the gap"]


def test_silicone_recess_from_common_practice(string_trick_text: str) -> None:
    text = string_trick_text.replace('pad_class = "19 mm"', 'response = "silicone"')
    r = _build(text)
    assert r.ok, r.failed
    s = yodraft.summary(r)
    rec = s["recess"]
    assert "pads" not in s
    wall_bore = s["bearing_seat"]["wall_bore_mm"]
    assert rec["inner_diameter_mm"] == pytest.approx(wall_bore + 2 * SILICONE_RECESS.wall_mm)
    assert rec["width_mm"] == pytest.approx(SILICONE_RECESS.width_mm)
    assert rec["depth_mm"] == pytest.approx(SILICONE_RECESS.depth_mm)
    # the silicone fills the recess: V = π/4 (D² − d²) h
    volume = math.pi / 4 * (rec["outer_diameter_mm"] ** 2 - rec["inner_diameter_mm"] ** 2) * rec["depth_mm"]
    budget = {line["part"]: line for line in s["mass"]["budget"]}
    assert budget["silicone"]["count"] == 2
    assert budget["silicone"]["each_g"] == pytest.approx(SILICONE_RECESS.density_g_cm3 * volume / 1000, rel=1e-12)
    assert "response pad" not in budget


def test_silicone_recess_is_on_the_sheet(string_trick_text: str) -> None:
    from yodraft.drawing.requests import section_requests

    r = _build(string_trick_text.replace('pad_class = "19 mm"', 'response = "silicone"'))
    keys = {k for req in section_requests(r) for k in req.keys}
    assert {"pad_groove.inner_diameter", "pad_groove.outer_diameter", "pad_groove.depth"} <= keys
    from yodraft.drawing.notes import SheetData, shop_lines

    lines = shop_lines(r, SheetData(30.0, 0.02, 6.3, 10000.0))
    assert any("fill flush with silicone" in line for line in lines)
