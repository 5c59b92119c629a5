"""The axial tolerance stack: the textbook arithmetic, and the gap and seat depth of a half."""
from __future__ import annotations

import math

import pytest

import yodraft
from conftest import TEMPLATES, set_in
from yodraft.features.bearing_seat import allocate_offset_tolerance
from yodraft.tolerances.bearings import bearing_deviation_um
from yodraft.tolerances.general import general_tolerance_mm
from yodraft.tolerances.stack import Link, stack


def test_worked_example_worst_case_and_rss() -> None:
    # metricmech.com, "Tolerance stack-up: a worked example using worst-case and RSS": housing bore depth
    # 40.00 ±0.10, spacer 25.00 ±0.05, retaining ring 2.00 ±0.03, shoulder 10.00 ±0.05; gap = A − B − C − D
    s = stack((Link("A", 40.0, 0.10, -0.10), Link("B", 25.0, 0.05, -0.05, -1.0),
               Link("C", 2.0, 0.03, -0.03, -1.0), Link("D", 10.0, 0.05, -0.05, -1.0)))
    assert s.nominal_mm == pytest.approx(3.00)            # nominal gap 3.00 mm (the example)
    assert s.worst_mm == pytest.approx((2.77, 3.23))      # worst case = sum of the tolerances, ±0.23
    # RSS = root sum of squares of the tolerances: √(0.1² + 0.05² + 0.03² + 0.05²) = √0.0159
    assert s.rss_mm == pytest.approx((3.0 - math.sqrt(0.0159), 3.0 + math.sqrt(0.0159)))


def test_one_sided_band_is_centred_for_rss() -> None:
    # a 0/−0.04 band has its mean at −0.02 and a half-band of 0.02  # textbook tolerance stack-up
    s = stack((Link("ring width", 4.0, 0.0, -0.04), Link("offset", 0.2, 0.01, -0.01, -1.0)))
    assert s.worst_mm == pytest.approx((3.75, 3.81))
    assert s.rss_mm == pytest.approx((3.78 - math.hypot(0.02, 0.01), 3.78 + math.hypot(0.02, 0.01)))


def test_link_validates_itself() -> None:
    with pytest.raises(ValueError):
        Link("bad", 1.0, -0.1, 0.1)
    with pytest.raises(ValueError):
        Link("bad", 1.0, 0.1, -0.1, 2.0)


@pytest.mark.parametrize(("cls", "size", "tol"), [
    ("ISO 2768-m", 19.6, 0.2),     # ISO 2768-1 table 1, m, over 6 up to 30 mm
    ("ISO 2768-f", 2.0, 0.05),     # ISO 2768-1 table 1, f, 0.5 up to 3 mm
    ("ISO 2768-c", 40.0, 0.8),     # ISO 2768-1 table 1, c, over 30 up to 120 mm
    ("ISO 2768-m", 6.0, 0.1),      # ISO 2768-1 table 1, m, over 3 up to 6 mm (6 mm belongs to this step)
    ("ISO 2768-m", 0.5, 0.1),      # ISO 2768-1 table 1, m, the first step includes 0.5 mm
])
def test_general_tolerance(cls: str, size: float, tol: float) -> None:
    assert general_tolerance_mm(cls, size) == tol


def test_general_tolerance_does_not_cover_small_sizes() -> None:
    assert general_tolerance_mm("ISO 2768-m", 0.2) is None  # ISO 2768-1 starts at 0.5 mm


def test_bearing_width_band() -> None:
    assert bearing_deviation_um("ABEC 7", "width", 6.35) == (0.0, -40.0)   # ISO 492 class 4 ΔBs, d 2.5–10 mm (from memory)
    assert bearing_deviation_um("Normal", "width", 8.0) == (0.0, -120.0)  # ISO 492 Normal ΔBs, d 2.5–10 mm (from memory)


def test_offset_tolerance_is_half_the_gap_tolerance() -> None:
    # two halves' wall offsets set the gap; worst case they add: 2 × t = T  # textbook tolerance stack-up
    assert allocate_offset_tolerance(0.05) == 0.025
    assert allocate_offset_tolerance(0.0333) == 0.016   # rounded down to a whole µm


def test_gap_stack_of_the_string_trick_template() -> None:
    r = yodraft.build(yodraft.load(TEMPLATES / "string-trick.toml"))
    v = r.values
    width, offset = 0.1875 * 25.4, 0.2            # R188: 3/16 in wide (ABMA inch series); wall offset of the design
    band = 0.040                                  # ISO 492 class 4 (ABEC 7) ΔBs 0/−40 µm (from memory)
    gap = r.features["bearing_seat"].extra["gap_stack"]
    # gap = B − o − o; worst case = sum of the tolerances (0.04 + 0.025 + 0.025), RSS = root sum of squares of half-bands
    assert gap.worst_mm == pytest.approx((width - band - 2 * (offset + 0.025), width - 2 * (offset - 0.025)))
    mean = width - band / 2 - 2 * offset
    spread = math.sqrt((band / 2) ** 2 + 2 * 0.025 ** 2)
    assert gap.rss_mm == pytest.approx((mean - spread, mean + spread))
    assert v["bearing_seat.post_length_tolerance"] == 0.025
    # the seat face stands 22 − 3/32 in below the outer face, ±0.2 mm (ISO 2768-m, 6–30 mm)
    assert v["axial.seat_depth"] == pytest.approx(22.0 - width / 2)
    assert v["axial.seat_depth_tolerance"] == 0.2
    assert v["axial.width_stack"].worst_mm == pytest.approx((44.0 - band - 0.4, 44.0 + 0.4))
    data = yodraft.summary(r)["bearing_seat"]
    assert data["gap_worst_mm"] == pytest.approx(list(gap.worst_mm))
    assert data["gap_tolerance_mm"] == 0.05


def test_an_explicit_offset_tolerance_too_wide_for_the_gap_fails(string_trick_text: str) -> None:
    text = set_in(string_trick_text, "features.bearing_seat", "wall_offset_tolerance", "0.03 mm")
    r = yodraft.build(yodraft.loads(text))
    assert [c.name for c in r.failed] == ["gap held to its tolerance"]


def test_posts_that_could_meet_fail(string_trick_text: str) -> None:
    # spacing 0.05 mm: two posts each 0.025 mm too long at their limit meet on the narrowest bearing
    text = set_in(string_trick_text, "features.bearing_seat", "spacing", "0.05 mm")
    r = yodraft.build(yodraft.loads(text))
    assert "posts stay apart" in [c.name for c in r.failed]


def test_the_thickest_coating_fails_the_fit_check(string_trick_text: str) -> None:
    # the template's post (finished, at the mid growth), given explicitly: it slides with a 0.0002–0.001 in coating;
    # with a 0.003 in thick end its finished ± grows by half the extra scatter, 0.001 in, and it presses the bearing
    base = yodraft.build(yodraft.loads(string_trick_text))
    post = f'{base["bearing_seat.post_diameter"]:.5f} mm'
    text = set_in(string_trick_text, "features.bearing_seat", "post_diameter", post)
    assert yodraft.build(yodraft.loads(text)).ok
    thick = set_in(text, "shop", "coating_thickness_max", "0.003 in")
    failed = [c for c in yodraft.build(yodraft.loads(thick)).failed]
    assert [c.name for c in failed] == ["post slides into the bearing"] and "thickest coating" in failed[0].message
