"""The catch zone feature: its angle and the rim width, each derived from the other."""
from __future__ import annotations

import math

import pytest

import yodraft
from yodraft.tomledit import set_key

IN = 25.4  # exact, international yard and pound agreement (1959)


def build_text(text: str) -> yodraft.Resolved:
    return yodraft.build(yodraft.loads(text, "t.toml"))


def test_catch_zone_angle_follows_rim_width(string_trick_text: str) -> None:
    r = build_text(string_trick_text)
    run = r["rim.diameter"] / 2 - r["catch_zone.start_diameter"] / 2
    rise = r["catch_zone.end_z"] - r["bearing_seat.wall_face_z"]
    assert r["catch_zone.angle"] == pytest.approx(math.atan2(rise, run), rel=1e-12)
    assert r["catch_zone.end_z"] == pytest.approx(r["rim.face_z"] - 8.0, abs=1e-12)


def test_angle_alone_derives_the_rim_width(string_trick_text: str) -> None:
    text = string_trick_text.replace('band_width = "8 mm"\n', "", 1)
    text = set_key(text, "features.catch_zone", "angle", "30 deg")
    r = build_text(text)
    assert r["catch_zone.angle"] == pytest.approx(math.radians(30), abs=1e-12)
    assert r["catch_zone.rim_width"] == pytest.approx(
        r["rim.face_z"] - r["bearing_seat.wall_face_z"]
        - (r["rim.diameter"] - r["catch_zone.start_diameter"]) / 2 * math.tan(math.radians(30)), abs=1e-9)
