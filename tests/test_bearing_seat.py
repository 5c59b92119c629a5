"""The bearing seat feature: gap, post length and the worst-case post of the trade example."""
from __future__ import annotations

import pytest

import yodraft
from yodraft.tomledit import set_key

IN = 25.4  # exact, international yard and pound agreement (1959)


def build_text(text: str) -> yodraft.Resolved:
    return yodraft.build(yodraft.loads(text, "t.toml"))


def test_size_c_gap_and_post_length(string_trick_text: str) -> None:
    r = build_text(string_trick_text)
    assert r.ok, [c.message for c in r.failed]
    # size C = R188: width 3/16 in  # common practice, no published source
    assert r["bearing.width"] == pytest.approx(0.1875 * IN, abs=1e-12)
    # gap = bearing width − 2 × 0.2 mm offset = 4.3625 mm  # common practice, no published source
    assert r["bearing_seat.gap"] == pytest.approx(4.3625, abs=1e-9)
    # post length = (4.7625 − 1) / 2 = 1.88125 mm  # common practice, no published source
    assert r["bearing_seat.post_length"] == pytest.approx(1.88125, abs=1e-9)


def test_worst_case_post_from_trade_example(string_trick_text: str) -> None:
    text = set_key(string_trick_text, "bearing", "bore_tolerance", "0.0001 in")
    text = set_key(text, "shop", "coating", "none")
    r = build_text(text)
    # bore 0.25 in −0.0001, lathe ±0.0002 in, clearance 0.0005 in → post 0.2492 ± 0.0002 in
    # common practice, no published source
    assert r["bearing_seat.post_diameter"] / IN == pytest.approx(0.2492, abs=1e-9)
    assert r["bearing_seat.post_tolerance"] / IN == pytest.approx(0.0002, abs=1e-12)
