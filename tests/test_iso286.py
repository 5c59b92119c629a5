"""ISO 286 limits and fits against the ISO 286-1 / ISO 286-2 tables."""
from __future__ import annotations

import json

import pytest
from hypothesis import assume, given
from hypothesis import strategies as st

from yodraft.tolerances.iso286 import (
    SIZE_STEPS,
    Fit,
    FitCodeError,
    Limits,
    delta_um,
    fit_summary,
    hole_basis_split,
    hole_limits,
    it_um,
    parse_fit,
    shaft_limits,
    size_step,
)


# --- size steps -----------------------------------------------------------------------------

@pytest.mark.parametrize(
    ("size", "step"),
    [
        (0.5, (0.0, 3.0)),     # ISO 286-1 Table 1: first step "up to 3" incl.
        (3.0, (0.0, 3.0)),     # ISO 286-1: "over 0 up to and including 3"
        (3.0001, (3.0, 6.0)),  # ISO 286-1: over 3
        (6.0, (3.0, 6.0)),     # ISO 286-1: 6 mm belongs to the 3–6 step
        (10.0, (6.0, 10.0)),   # ISO 286-1: 10 mm belongs to the 6–10 step
        (10.5, (10.0, 18.0)),  # ISO 286-1
        (120.0, (80.0, 120.0)),  # ISO 286-1
    ],
)
def test_size_step_boundaries(size: float, step: tuple[float, float]) -> None:
    assert size_step(size) == step


@pytest.mark.parametrize("size", [0.0, -1.0, 120.01, 200.0])
def test_size_step_out_of_range(size: float) -> None:
    with pytest.raises(FitCodeError):
        size_step(size)


# --- IT grades ------------------------------------------------------------------------------

@pytest.mark.parametrize(
    ("grade", "size", "um"),
    [
        (6, 6.0, 8.0),     # ISO 286-1 Table 1, IT6 3–6 mm
        (7, 8.0, 15.0),    # ISO 286-1 Table 1, IT7 6–10 mm
        (7, 10.0, 15.0),   # ISO 286-1 Table 1, IT7 6–10 mm (upper bound inclusive)
        (1, 2.0, 0.8),     # ISO 286-1 Table 1, IT1 up to 3 mm
        (5, 25.0, 9.0),    # ISO 286-1 Table 1, IT5 18–30 mm
        (8, 12.0, 27.0),   # ISO 286-1 Table 1, IT8 10–18 mm
        (9, 40.0, 62.0),   # ISO 286-1 Table 1, IT9 30–50 mm
        (11, 60.0, 190.0),  # ISO 286-1 Table 1, IT11 50–80 mm
        (12, 100.0, 350.0),  # ISO 286-1 Table 1, IT12 80–120 mm
    ],
)
def test_it_table(grade: int, size: float, um: float) -> None:
    assert it_um(grade, size) == um


def test_it_grows_with_grade_and_size() -> None:
    # ISO 286-1: every IT grade is wider than the one below, and no narrower in a larger step
    for low, high in SIZE_STEPS:
        values = [it_um(g, high) for g in range(1, 13)]
        assert values == sorted(values) and len(set(values)) == len(values)
    for g in range(1, 13):
        per_step = [it_um(g, high) for _low, high in SIZE_STEPS]
        assert per_step == sorted(per_step)


def test_delta_is_difference_of_grades() -> None:
    # ISO 286-1, 3.3.2: Δ = ITn − IT(n−1); the Δ table is 0 up to 3 mm
    for _low, high in SIZE_STEPS:
        for grade in range(3, 9):
            expected = 0.0 if high <= 3 else it_um(grade, high) - it_um(grade - 1, high)
            assert delta_um(grade, high) == pytest.approx(expected)


@pytest.mark.parametrize("grade", [0, 13, 19])
def test_grade_out_of_range(grade: int) -> None:
    with pytest.raises(FitCodeError):
        it_um(grade, 6.0)


# --- deviations -----------------------------------------------------------------------------

@pytest.mark.parametrize(
    ("letter", "grade", "size", "upper", "lower"),
    [
        ("g", 6, 6.0, -4.0, -12.0),    # ISO 286-2, g6 3–6 mm
        ("h", 6, 12.0, 0.0, -11.0),    # ISO 286-2, h6 10–18 mm
        ("k", 6, 8.0, 10.0, 1.0),      # ISO 286-2, k6 6–10 mm
        ("p", 6, 8.0, 24.0, 15.0),     # ISO 286-2, p6 6–10 mm
        ("m", 6, 8.0, 15.0, 6.0),      # ISO 286-2, m6 6–10 mm
        ("n", 6, 8.0, 19.0, 10.0),     # ISO 286-2, n6 6–10 mm
        ("f", 7, 8.0, -13.0, -28.0),   # ISO 286-2, f7 6–10 mm
        ("e", 8, 10.0, -25.0, -47.0),  # ISO 286-2, e8 6–10 mm
        ("k", 6, 2.0, 6.0, 0.0),       # ISO 286-2, k6 up to 3 mm
        ("k", 6, 20.0, 15.0, 2.0),     # ISO 286-2, k6 18–30 mm
        ("k", 8, 8.0, 22.0, 0.0),      # ISO 286-1 Table 2: k above IT7 has ei = 0
        ("js", 6, 8.0, 4.5, -4.5),     # ISO 286-1: js = ± IT/2
        ("u", 6, 25.0, 61.0, 48.0),    # ISO 286-2, u6 24–30 mm (from memory; the preferred fit 25 H7/u6: 0.027–0.061)
        ("u", 6, 20.0, 54.0, 41.0),    # ISO 286-2, u6 18–24 mm (from memory)
        ("u", 6, 24.0, 54.0, 41.0),    # the 18–24 mm step includes 24 mm (ISO 286-1: "over … up to and including")
        ("u", 6, 40.0, 76.0, 60.0),    # ISO 286-2, u6 30–40 mm (from memory; the preferred fit 40 H7/u6)
        ("u", 6, 60.0, 106.0, 87.0),   # ISO 286-2, u6 50–65 mm (from memory; the preferred fit 60 H7/u6)
        ("u", 6, 120.0, 166.0, 144.0),  # ISO 286-2, u6 100–120 mm (from memory; the preferred fit 120 H7/u6)
        ("u", 6, 6.0, 31.0, 23.0),     # ISO 286-2, u6 3–6 mm (from memory; the preferred fit 6 H7/u6)
        ("s", 6, 50.0, 59.0, 43.0),    # ISO 286-2, s6 30–50 mm (the preferred fit 50 H7/s6)
    ],
)
def test_shaft_limits(letter: str, grade: int, size: float, upper: float, lower: float) -> None:
    assert shaft_limits(letter, grade, size) == Limits(upper, lower)


@pytest.mark.parametrize(
    ("letter", "grade", "size", "upper", "lower"),
    [
        ("H", 7, 6.0, 12.0, 0.0),     # ISO 286-2, H7 3–6 mm
        ("H", 7, 12.0, 18.0, 0.0),    # ISO 286-2, H7 10–18 mm
        ("F", 7, 12.0, 34.0, 16.0),   # ISO 286-2, F7 10–18 mm
        ("G", 7, 12.0, 24.0, 6.0),    # ISO 286-2, G7 10–18 mm
        ("E", 8, 8.0, 47.0, 25.0),    # ISO 286-2, E8 6–10 mm
        ("K", 7, 8.0, 5.0, -10.0),    # ISO 286-2, K7 6–10 mm (with Δ)
        ("K", 6, 8.0, 2.0, -7.0),     # ISO 286-2, K6 6–10 mm (with Δ)
        ("M", 7, 8.0, 0.0, -15.0),    # ISO 286-2, M7 6–10 mm (with Δ)
        ("N", 7, 8.0, -4.0, -19.0),   # ISO 286-2, N7 6–10 mm (with Δ)
        ("P", 7, 8.0, -9.0, -24.0),   # ISO 286-2, P7 6–10 mm (with Δ)
        ("P", 7, 5.0, -8.0, -20.0),   # ISO 286-2, P7 3–6 mm (with Δ)
        ("K", 7, 2.0, 0.0, -10.0),    # ISO 286-2, K7 up to 3 mm (Δ = 0)
        ("N", 7, 2.0, -4.0, -14.0),   # ISO 286-2, N7 up to 3 mm
        ("N", 9, 5.0, 0.0, -30.0),    # ISO 286-2, N9 3–6 mm (keyway width tables)
        ("N", 9, 2.0, -4.0, -29.0),   # ISO 286-2, N9 up to 3 mm
        ("JS", 9, 6.0, 15.0, -15.0),  # ISO 286-2, JS9 3–6 mm (keyway width tables)
    ],
)
def test_hole_limits(letter: str, grade: int, size: float, upper: float, lower: float) -> None:
    assert hole_limits(letter, grade, size) == Limits(upper, lower)


@pytest.mark.parametrize("letter", ["E", "F", "G", "H"])
def test_holes_a_to_h_mirror_shafts(letter: str) -> None:
    # ISO 286-1: for A–H, EI = −es of the shaft with the same letter
    for _low, high in SIZE_STEPS:
        for grade in (5, 7, 9):
            assert hole_limits(letter, grade, high).lower_um == -shaft_limits(letter.lower(), grade, high).upper_um


@pytest.mark.parametrize(("letter", "grade"), [("K", 2), ("M", 2), ("N", 12), ("P", 1)])
def test_unsupported_hole_classes_say_so(letter: str, grade: int) -> None:
    with pytest.raises(FitCodeError, match="not supported"):
        hole_limits(letter, grade, 8.0)


def test_n9_not_for_tiny_sizes() -> None:
    # ISO 286-1, Table 3 footnote: N above IT8 is not used for sizes up to 1 mm
    with pytest.raises(FitCodeError, match="up to 1 mm"):
        hole_limits("N", 9, 0.8)


# --- fit codes ------------------------------------------------------------------------------

def test_h7_g6_at_6mm() -> None:
    fit = parse_fit("6 H7/g6")
    assert fit.hole == Limits(12.0, 0.0)    # ISO 286-2, H7 3–6 mm
    assert fit.shaft == Limits(-4.0, -12.0)  # ISO 286-2, g6 3–6 mm
    assert (fit.clearance_min_um, fit.clearance_max_um) == (4.0, 24.0)  # ISO 286-2, H7/g6 at 6 mm
    assert (fit.hole_code, fit.shaft_code, fit.size_mm) == ("H7", "g6", 6.0)


def test_h7_h6_at_12mm() -> None:
    fit = parse_fit("12 H7/h6")
    assert fit.hole == Limits(18.0, 0.0)    # ISO 286-2, H7 10–18 mm
    assert fit.shaft == Limits(0.0, -11.0)  # ISO 286-2, h6 10–18 mm
    assert (fit.clearance_min_um, fit.clearance_max_um) == (0.0, 29.0)  # ISO 286-2, H7/h6 at 12 mm


@pytest.mark.parametrize("code", ["Ø6 H7/g6", "ø6H7/g6", "6mm H7/g6", "6 mm H7 / g6", "  6 H7/g6 "])
def test_code_spellings(code: str) -> None:
    assert parse_fit(code) == parse_fit("6 H7/g6")


def test_inch_size_and_single_parts() -> None:
    shaft_only = parse_fit("0.25in h6")
    assert shaft_only.size_mm == pytest.approx(6.35)  # 1 in = 25.4 mm exactly (1959 agreement)
    assert shaft_only.shaft == Limits(0.0, -9.0)      # ISO 286-2, h6 6–10 mm
    assert shaft_only.hole is None and shaft_only.clearance_min_um is None
    hole_only = parse_fit("6 H7")
    assert hole_only.hole == Limits(12.0, 0.0) and hole_only.shaft is None  # ISO 286-2, H7 3–6 mm
    assert hole_only.clearance_max_um is None


def test_fit_summary_shape_and_kinds() -> None:
    summary = fit_summary(parse_fit("6 H7/g6"))
    assert set(summary) == {"code", "size_mm", "hole", "shaft", "clearance_min_um", "clearance_max_um", "kind"}
    assert set(summary["hole"]) == {"code", "upper_um", "lower_um", "max_mm", "min_mm"}
    assert summary["hole"]["max_mm"] == pytest.approx(6.012)  # ISO 286-2, H7 3–6 mm: +12 µm
    assert summary["shaft"]["min_mm"] == pytest.approx(5.988)  # ISO 286-2, g6 3–6 mm: −12 µm
    assert summary["kind"] == "clearance"
    json.dumps(summary)  # plain JSON types only
    # ISO 286-1 / 286-2 preferred fits: H7/k6 transition, H7/p6 interference at 8 mm
    assert fit_summary(parse_fit("8 H7/k6"))["kind"] == "transition"
    assert fit_summary(parse_fit("8 H7/p6"))["kind"] == "interference"
    single = fit_summary(parse_fit("6 H7"))
    assert single["shaft"] is None and single["kind"] is None


@pytest.mark.parametrize(
    ("code", "fragment"),
    [
        ("6 Q7/g6", "letter 'Q'"),
        ("200 H7/g6", "up to 120 mm"),
        ("6 H19", "IT19"),
        ("6 g6/H7", "hole class"),
        ("H7/g6", "cannot read"),
        ("6 H7/g6/f7", "cannot read"),
        ("6 H7/H7", "hole class"),
        ("6 K2", "not supported"),
        ("6 H01", "IT01"),  # ISO 286-1 writes the two finest grades IT01 and IT0; neither is IT1
        ("6 H0", "IT0"),
        ("6 H007", "cannot read tolerance grade"),
        ("6 h07", "cannot read tolerance grade"),
        ("", "cannot read"),
    ],
)
def test_bad_codes(code: str, fragment: str) -> None:
    with pytest.raises(FitCodeError, match=fragment) as info:
        parse_fit(code)
    assert "\n" not in str(info.value) and "expected" in str(info.value)
    assert isinstance(info.value, ValueError)


HOLES = [("E", g) for g in range(1, 13)] + [("F", g) for g in range(1, 13)] + [("G", g) for g in range(1, 13)] \
    + [("H", g) for g in range(1, 13)] + [("JS", g) for g in range(1, 13)] \
    + [(l, g) for l in ("K", "M", "N") for g in range(3, 9)] + [("N", g) for g in range(9, 12)] \
    + [(l, g) for l in ("K", "M") for g in range(9, 13)] \
    + [("P", g) for g in range(3, 13)]
SHAFTS = [(l, g) for l in ("e", "f", "g", "h", "js", "k", "m", "n", "p", "r", "s", "u") for g in range(1, 13)]


@given(
    size=st.floats(min_value=0.01, max_value=120.0, allow_nan=False),
    hole=st.sampled_from(HOLES),
    shaft=st.sampled_from(SHAFTS),
)
def test_every_fit_is_consistent(size: float, hole: tuple[str, int], shaft: tuple[str, int]) -> None:
    assume(not (hole[0] == "N" and hole[1] > 8 and size <= 1.0))  # ISO 286-1: not standardised
    code = f"{size!r} {hole[0]}{hole[1]}/{shaft[0]}{shaft[1]}"
    fit = parse_fit(code)
    assert isinstance(fit, Fit)
    assert fit.hole is not None and fit.shaft is not None
    assert fit.hole.upper_um >= fit.hole.lower_um and fit.shaft.upper_um >= fit.shaft.lower_um
    # band width is the IT grade (ISO 286-1 definition of a tolerance class)
    assert fit.hole.band_um == pytest.approx(it_um(hole[1], size))
    assert fit.shaft.band_um == pytest.approx(it_um(shaft[1], size))
    assert fit.clearance_min_um == pytest.approx(fit.hole.lower_um - fit.shaft.upper_um)
    assert fit.clearance_max_um == pytest.approx(fit.hole.upper_um - fit.shaft.lower_um)
    assert fit.clearance_max_um >= fit.clearance_min_um


def test_limits_are_frozen_and_validated() -> None:
    with pytest.raises(ValueError):
        Limits(-1.0, 1.0)
    limits = Limits(1.0, 0.0)
    with pytest.raises(AttributeError):
        limits.upper_um = 2.0  # type: ignore[misc]


@pytest.mark.parametrize(("code", "upper", "lower"), [
    ("8 K9", 0.0, -36.0),    # ISO 286-1 Table 3: K above IT8 on the zero line (from memory); IT9 6–10 mm = 36 µm
    ("8 M9", -6.0, -42.0),   # ISO 286-1 Table 3: M above IT8, ES = −m = −6 µm at 6–10 mm (m: ei +6, Table 2)
    ("20 M10", -8.0, -92.0),  # ISO 286-1: m ei +8 µm at 18–30 mm, IT10 = 84 µm
])
def test_k_and_m_above_it8(code: str, upper: float, lower: float) -> None:
    fit = parse_fit(code)
    assert (fit.hole.upper_um, fit.hole.lower_um) == (upper, lower)


# --- explicit interference limits on the hole basis -------------------------------------------

@pytest.mark.parametrize(
    ("size", "least", "greatest", "hole", "shaft"),
    [
        # 50–80 mm step: IT6 = 19, IT7 = 30 µm (ISO 286-1 Table 1); 30 µm band × 30/49 = 18.4 → 18
        (52.0, 50.0, 80.0, Limits(18.0, 0.0), Limits(80.0, 68.0)),
        # 18–30 mm step: IT6 = 13, IT7 = 21 µm (ISO 286-1 Table 1); 40 µm band × 21/34 = 24.7 → 24
        (20.0, 20.0, 60.0, Limits(24.0, 0.0), Limits(60.0, 44.0)),
        # limits off the µm are rounded inward: 51…79, a 28 µm band at 52 mm × 30/49 = 17.1 → 17
        (52.0, 50.4, 79.6, Limits(17.0, 0.0), Limits(79.0, 68.0)),
    ],
)
def test_hole_basis_split(size: float, least: float, greatest: float, hole: Limits, shaft: Limits) -> None:
    f = hole_basis_split(size, least, greatest)
    assert f.hole == hole and f.shaft == shaft
    assert f.hole.lower_um == 0.0  # hole-basis fit system (ISO 286-1): the hole's lower deviation is zero
    # interference = shaft − hole: least at the smallest shaft in the largest hole, greatest the other way
    assert -f.clearance_max_um == shaft.lower_um - hole.upper_um and -f.clearance_min_um == shaft.upper_um
    assert f.hole.band_um >= f.shaft.band_um  # the bore is the coarser part, as in H7/s6


@given(st.floats(1.0, 120.0), st.integers(0, 200), st.integers(0, 200))
def test_hole_basis_split_keeps_the_limits(size: float, a: int, b: int) -> None:
    lo, hi = min(a, b), max(a, b)
    f = hole_basis_split(size, float(lo), float(hi))
    assert (-f.clearance_max_um, -f.clearance_min_um) == (lo, hi)  # whole µm limits come back exactly
