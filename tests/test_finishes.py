"""Finish rules: which coating suits which material family."""
from __future__ import annotations

import pytest

import yodraft
from yodraft.catalog.finishes import FINISHES, finishes_for, suits
from yodraft.catalog.materials import MATERIALS
from yodraft.errors import DesignInputError
from yodraft.tomledit import set_key


def test_anodize_suits_aluminium_only() -> None:
    # MIL-A-8625 covers anodic coatings for aluminium and aluminium alloys only
    for name in ("anodize type II", "anodize type III"):
        assert FINISHES[name].families == ("aluminium alloy",)


def test_own_finishes_for_titanium_and_stainless() -> None:
    assert suits("titanium anodize", "titanium alloy")  # AMS 2488: titanium and titanium alloys
    assert suits("passivate", "stainless steel")  # ASTM A967: stainless steel parts
    assert not suits("passivate", "aluminium alloy")


def test_polymers_take_no_finish() -> None:
    assert finishes_for("polymer") == ["none"]


@pytest.mark.parametrize("material", ["Ti-6Al-4V", "POM"])
def test_anodize_on_titanium_or_acetal_is_refused(string_trick_text: str, material: str) -> None:
    text = set_key(string_trick_text, "design", "material", material)
    with pytest.raises(DesignInputError) as err:
        yodraft.loads(text, "t.toml")
    assert err.value.key == "shop.coating"
    assert material in str(err.value) and "anodize type II" in str(err.value)


def test_a_suiting_finish_builds(string_trick_text: str) -> None:
    text = set_key(set_key(string_trick_text, "design", "material", "Ti-6Al-4V"), "shop", "coating", "titanium anodize")
    assert yodraft.build(yodraft.loads(text)).parts[0].material == "Ti-6Al-4V"


def test_every_family_has_at_least_none() -> None:
    for m in MATERIALS.values():
        assert "none" in finishes_for(m.family)


def _finish_note(text: str) -> str:
    from yodraft.drawing.notes import SheetData, shop_lines

    resolved = yodraft.build(yodraft.loads(text))
    data = SheetData(30.0, 0.012, 6.3, 10000.0)
    (note,) = [line for line in shop_lines(resolved, data) if line.startswith("Finish:")]
    return note


def test_the_finish_note_names_the_specification_it_is_done_to(string_trick_text: str) -> None:
    # MIL-A-8625 (anodic coatings for aluminium and its alloys) is the specification type II anodize is done to
    assert _finish_note(string_trick_text).startswith("Finish: anodize type II per MIL-A-8625, 5.1…25.4 µm ")


def test_a_finish_that_builds_nothing_up_turns_the_seat_to_its_finished_sizes(string_trick_text: str) -> None:
    # ASTM A967 passivation removes free iron and leaves no coating to allow for
    text = set_key(set_key(string_trick_text, "design", "material", "304"), "shop", "coating", "passivate")
    text = set_key(set_key(text, "shop", "coating_thickness", "0 mm"), "shop", "coating_thickness_max", "0 mm")
    note = _finish_note(text)
    assert note == "Finish: passivate per ASTM A967, no build-up; seat sizes are finished sizes"
    from yodraft.textout import check_text

    out = check_text(yodraft.build(yodraft.loads(text)))
    assert "before coating" not in out and "bearing seat fit (finished sizes; no build-up)" in out
