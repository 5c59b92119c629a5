"""A build that reuses unchanged features (BuildMemo) must equal a fresh build, whatever was changed."""
from __future__ import annotations

import pytest

from conftest import TEMPLATES, set_in
from yodraft import build, loads
from yodraft.builder import BuildMemo

#: one edit at a time, each reaching a different feature, the shop settings, the bearing or the material
EDITS = [
    ("features.rim", "band_width", "7 mm"),
    ("features.rim", "thickness", "4 mm"),
    ("features.pad_groove", "depth", "2 mm"),
    ("features.bearing_seat", "wall_offset", "0.3 mm"),
    ("features.vent_groove", "depth", "1.2 mm"),
    ("features.axle_bore", "thread_depth", "7 mm"),
    ("shop", "min_wall", "0.8 mm"),
    ("shop", "fit_clearance", "0.02 mm"),
    ("shop", "mask_seat", True),
    ("bearing", "size", "MR105ZZ"),
    ("bearing", "precision", "P4"),
    ("design", "material", "7075-T6"),
    ("envelope", "width", "40 mm"),
    ("features.catch_zone", "land", "2 mm"),
]


def _same(a, b) -> None:
    assert dict(a.values) == dict(b.values)
    assert a.checks == b.checks
    assert a.profile == b.profile
    assert dict(a.features) == dict(b.features)


@pytest.mark.parametrize("template", ["string-trick", "undersized", "wide-heavy"])
def test_memo_build_equals_fresh_build_after_each_edit(template: str) -> None:
    text = (TEMPLATES / f"{template}.toml").read_text(encoding="utf-8")
    memo = BuildMemo()
    _same(build(loads(text), memo), build(loads(text)))
    for table, key, value in EDITS:
        text = set_in(text, table, key, value)  # the edits accumulate, as a designer's saves do
        _same(build(loads(text), memo), build(loads(text)))


def test_memo_reuses_features_the_edit_does_not_reach(string_trick_text: str) -> None:
    memo = BuildMemo()
    first = build(loads(string_trick_text), memo)
    second = build(loads(set_in(string_trick_text, "features.rim", "band_width", "7 mm")), memo)
    for name in ("bearing_seat", "vent_groove", "axle_bore", "pad_groove"):
        assert second.features[name] is first.features[name]  # upstream of the rim: kept
    assert second.features["rim"] is not first.features["rim"]
    third = build(loads(set_in(string_trick_text, "shop", "fit_clearance", "0.02 mm")), memo)
    assert third.features["bearing_seat"] is not second.features["bearing_seat"]  # it reads the shop settings
    assert third.values["bearing_seat.post_diameter"] != second.values["bearing_seat.post_diameter"]


def test_memo_across_variants_of_one_design(string_trick_text: str) -> None:
    """Variants made from one design share its unchanged tables, so the memo reuses features by the identity of
    what they were resolved from; each must still equal a fresh build, whichever key moved last."""
    from yodraft.design import with_values

    base = loads(string_trick_text)
    memo = BuildMemo()
    steps = [[("features.rim.thickness", 3.5)], [("features.rim.thickness", 3.6)], [("features.pad_groove.depth", 1.1)],
             [("shop.min_wall", 0.9)], [("features.rim.thickness", 3.6)], [], [("features.bearing_seat.wall_offset", 0.3)],
             [("features.rim.band_width", 7.0), ("features.rim.thickness", 3.6)], []]
    for assignments in steps:
        variant = with_values(base, assignments)
        _same(build(variant, memo), build(variant))
