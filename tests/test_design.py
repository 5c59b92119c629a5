"""Reading design files: units at the edge, one-line errors naming the key."""
from __future__ import annotations

import math

import pytest

import yodraft
from yodraft.errors import DesignInputError
from yodraft.units import parse_quantity


def test_inch_is_exactly_25_4_mm() -> None:
    assert parse_quantity("1 in", "length") == 25.4  # international yard and pound agreement, 1959


def test_angles_are_radians_inside() -> None:
    assert parse_quantity("180 deg", "angle") == pytest.approx(math.pi, rel=1e-15)  # definition of the degree


@pytest.mark.parametrize(("text", "key", "words"), [
    ('[design]\nname="a"\n[envelope]\ndiameter=56\nwidth="44 mm"', "envelope.diameter", "bare number"),
    ('[design]\nname="a"\n[envelope]\ndiameter="56 g"\nwidth="44 mm"', "envelope.diameter", "not a unit of length"),
    ('[design]\nname="a"\n[envelope]\ndiameter="56 mm"\nwidht="44 mm"', "envelope.widht", "did you mean 'width'"),
    ('[design]\nname="a"\n[envelope]\ndiameter="56 mm"\nwidth="44 mm"\n[rims]', "rims", "unknown section"),
    ('[design]\nname="a"\n[envelope]\ndiameter="-5 mm"\nwidth="44 mm"', "envelope.diameter", "out of range"),
    ('[design]\nname="a"\n[envelope]\ndiameter="56 mm"', "envelope.width", "missing"),
    ('[design]\nname="a"\n[envelope]\ndiameter="56 mm"\nwidth="44 mm"\n[features.rims]', "features.rims",
     "did you mean 'rim'"),
])
def test_bad_input_names_key(text: str, key: str, words: str) -> None:
    with pytest.raises(DesignInputError) as info:
        yodraft.loads(text, "bad.toml")
    message = str(info.value)
    assert message.startswith(f"bad.toml: {key}: ")
    assert words in message
    assert "\n" not in message


def test_broken_toml_is_one_line() -> None:
    with pytest.raises(DesignInputError) as info:
        yodraft.loads("[design\nname=", "b.toml")
    assert "not valid TOML" in str(info.value) and "\n" not in str(info.value)


def test_unknown_bearing_suggests() -> None:
    text = yodraft.EXAMPLE + '[bearing]\nsize = "R188Z"\n'
    with pytest.raises(DesignInputError) as info:
        yodraft.build(yodraft.loads(text, "b.toml"))
    assert "bearing.size" in str(info.value) and "did you mean" in str(info.value)


def test_given_keys_are_recorded() -> None:
    d = yodraft.loads(yodraft.EXAMPLE + '[features.rim]\nband_width = "7 mm"\n')
    assert d.is_given("features.rim.band_width") and not d.is_given("features.rim.thickness")
    assert d.features["rim"]["band_width"] == 7.0


def test_rim_band_width_read_under_its_earlier_name() -> None:
    """`features.rim.width` was the band's name before `band_width`: still read as it, never both at once."""
    old = yodraft.loads(yodraft.EXAMPLE + '[features.rim]\nwidth = "7 mm"\n')
    new = yodraft.loads(yodraft.EXAMPLE + '[features.rim]\nband_width = "7 mm"\n')
    assert old.features == new.features and old.is_given("features.rim.band_width")
    assert old.raw["features"]["rim"] == {"band_width": "7 mm"}
    with pytest.raises(DesignInputError, match=r"features\.rim\.width: is the earlier name of band_width"):
        yodraft.loads(yodraft.EXAMPLE + '[features.rim]\nwidth = "7 mm"\nband_width = "7 mm"\n')
