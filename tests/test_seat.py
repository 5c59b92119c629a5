"""Bearing-seat stack-up: worst case and RSS."""
from __future__ import annotations

import math

import pytest
from hypothesis import given
from hypothesis import strategies as st

from yodraft.tolerances.seat import SeatInputs, coating_growth_mm, size_seat
from yodraft.units import parse_quantity

IN = parse_quantity("1 in", "length")


def test_inch_is_exact() -> None:
    assert IN == 25.4  # 1959 international yard and pound agreement: 1 in = 25.4 mm exactly


def _size_c(**extra: float) -> SeatInputs:
    # size C bearing, bore tolerance 0.0001 in, lathe ±0.0002 in, clearance 0.0005 in
    # (common practice, no published source)
    values: dict[str, object] = {
        "bearing_bore_mm": 0.25 * IN,
        "bearing_od_mm": 0.5 * IN,
        "bore_deviation_um": (0.0, -2.54),
        "od_deviation_um": (0.0, -2.54),
        "machine_tolerance_mm": 0.0002 * IN,
        "fit_clearance_mm": 0.0005 * IN,
    }
    return SeatInputs(**{**values, **extra})  # type: ignore[arg-type]


def test_post_worst_case_size_c() -> None:
    post = size_seat(_size_c()).post
    # post 0.2492 ± 0.0002 in (common practice, no published source)
    assert post.nominal_mm / IN == pytest.approx(0.2492, abs=1e-9)
    assert post.tolerance_mm / IN == pytest.approx(0.0002, abs=1e-9)
    assert post.max_mm / IN == pytest.approx(0.2494, abs=1e-9)
    assert post.min_mm / IN == pytest.approx(0.2490, abs=1e-9)
    # worst case: least clearance is the asked clearance; most = bore max − post min = 0.0010 in
    assert post.clearance_min_mm / IN == pytest.approx(0.0005, abs=1e-9)
    assert post.clearance_max_mm / IN == pytest.approx(0.0010, abs=1e-9)
    assert post.precoat_mm == post.nominal_mm and post.derived


def test_wall_worst_case_size_c() -> None:
    wall = size_seat(_size_c()).wall
    # wall min = OD max + clearance = 0.5005 in; nominal = 0.5007 in (worst-case rule)
    assert wall.min_mm / IN == pytest.approx(0.5005, abs=1e-9)
    assert wall.nominal_mm / IN == pytest.approx(0.5007, abs=1e-9)
    assert wall.clearance_min_mm / IN == pytest.approx(0.0005, abs=1e-9)
    assert wall.clearance_max_mm / IN == pytest.approx(0.0010, abs=1e-9)


def test_type_ii_coating_keeps_clearance() -> None:
    # Type II anodise 0.0004 in thick building half outward grows a diameter by 0.0004 in
    # (2 × thickness × share; common practice, no published source)
    growth = coating_growth_mm(0.0004 * IN, 0.5)
    assert growth / IN == pytest.approx(0.0004, abs=1e-12)
    bare, coated = size_seat(_size_c()), size_seat(_size_c(coating_growth_mm=growth))
    assert coated.post.nominal_mm == pytest.approx(bare.post.nominal_mm)  # finished size unchanged
    assert coated.post.precoat_mm / IN == pytest.approx(0.2488, abs=1e-9)  # turned under by the growth
    assert coated.wall.precoat_mm == pytest.approx(coated.wall.nominal_mm + growth)  # bore turned over
    assert coated.post.clearance_min_mm == pytest.approx(bare.post.clearance_min_mm)


def test_coating_growth_rejects_nonsense() -> None:
    with pytest.raises(ValueError):
        coating_growth_mm(0.01, 1.5)
    with pytest.raises(ValueError):
        coating_growth_mm(-0.01, 0.5)


def test_explicit_post_is_checked_not_derived() -> None:
    # a post turned to the bearing's nominal bore cannot slide on at the worst case
    fit = size_seat(_size_c(post_diameter_mm=0.25 * IN))
    assert not fit.post.derived and fit.wall.derived
    assert fit.post.nominal_mm == 0.25 * IN
    # bore min 0.2499 − post max 0.2502 = −0.0003 in; bore max 0.2500 − post min 0.2498 = +0.0002 in
    assert fit.post.clearance_min_mm / IN == pytest.approx(-0.0003, abs=1e-9)
    assert fit.post.clearance_max_mm / IN == pytest.approx(0.0002, abs=1e-9)
    # mean clearance −0.00005 in < 0, so more than half of random pairs will not slide (normal model)
    assert 0.5 < fit.post.p_no_slide < 1.0


def test_rss_values_by_hand() -> None:
    post = size_seat(_size_c()).post
    # mean clearance = bore mid − post nominal = 0.24995 − 0.2492 = 0.00075 in;
    # 3σ = hypot(0.00005, 0.0002) in (root sum of squares, textbook tolerance stack)
    spread = math.hypot(0.00005, 0.0002)
    assert post.rss_min_mm / IN == pytest.approx(0.00075 - spread, abs=1e-9)
    assert post.rss_max_mm / IN == pytest.approx(0.00075 + spread, abs=1e-9)
    # P(clearance < 0) = Φ(−mean/σ) (standard normal, textbook)
    z = 0.00075 / (spread / 3)
    assert post.p_no_slide == pytest.approx(0.5 * math.erfc(z / math.sqrt(2)), rel=1e-9)
    assert post.p_no_slide < 1e-6


def test_inputs_are_validated() -> None:
    with pytest.raises(ValueError):
        _size_c(machine_tolerance_mm=-0.01)
    with pytest.raises(ValueError):
        SeatInputs(6.35, 12.7, (-5.0, 0.0), (0.0, -5.0), 0.005, 0.01)


@given(
    bore=st.floats(1.0, 20.0),
    od_extra=st.floats(1.0, 20.0),
    bore_lower=st.floats(-10.0, 0.0),
    od_lower=st.floats(-10.0, 0.0),
    tol=st.floats(0.0, 0.05),
    clearance=st.floats(-0.02, 0.05),
    growth=st.floats(0.0, 0.05),
    post_offset=st.one_of(st.none(), st.floats(-0.1, 0.1)),
)
def test_stack_is_consistent(bore: float, od_extra: float, bore_lower: float, od_lower: float, tol: float,
                             clearance: float, growth: float, post_offset: float | None) -> None:
    inputs = SeatInputs(bore, bore + od_extra, (0.0, bore_lower), (0.0, od_lower), tol, clearance, growth,
                        None if post_offset is None else bore + post_offset)
    fit = size_seat(inputs)
    eps = 1e-9
    for d in (fit.post, fit.wall):
        assert d.clearance_max_mm >= d.clearance_min_mm - eps
        # the statistical range lies inside the worst-case range
        assert d.clearance_min_mm - eps <= d.rss_min_mm <= d.rss_max_mm <= d.clearance_max_mm + eps
        assert 0.0 <= d.p_no_slide <= 1.0
        # worst range width = bearing band + 2 × machine tolerance
        assert d.max_mm - d.min_mm == pytest.approx(2 * tol)
    if post_offset is None:
        assert fit.post.clearance_min_mm == pytest.approx(clearance, abs=1e-9)
    assert fit.wall.clearance_min_mm == pytest.approx(clearance, abs=1e-9)
    assert fit.post.precoat_mm == pytest.approx(fit.post.nominal_mm - growth)


def test_coating_scatter_widens_the_finished_size() -> None:
    # Type II anodise 0.0002–0.001 in thick (the thickness range of a Type II coating, from memory), half outward:
    # the diameter grows 0.0002 to 0.001 in (2 × thickness × share; common practice, no published source)
    thin, thick = coating_growth_mm(0.0002 * IN, 0.5), coating_growth_mm(0.001 * IN, 0.5)
    fit = size_seat(_size_c(coating_growth_mm=thin, coating_growth_max_mm=thick))
    post = fit.post
    # finished ± = machine 0.0002 + half the growth scatter 0.0004 = 0.0006 in; turned ± stays 0.0002 in
    assert post.tolerance_mm / IN == pytest.approx(0.0006, abs=1e-9)
    assert post.turn_tolerance_mm / IN == pytest.approx(0.0002, abs=1e-9)
    # the thickest coating on the largest turned post still leaves the wanted 0.0005 in to the smallest bore
    assert post.clearance_min_mm / IN == pytest.approx(0.0005, abs=1e-9)
    assert (post.precoat_mm + post.turn_tolerance_mm + thick) / IN == pytest.approx(0.2499 - 0.0005, abs=1e-9)
    assert fit.wall.clearance_min_mm / IN == pytest.approx(0.0005, abs=1e-9)


def test_the_thick_end_can_make_an_explicit_post_interfere() -> None:
    # post 0.2493 in finished at the mid growth: with no scatter it slides (bore min 0.2499 − 0.2495 = +0.0004 in)
    thin, thick = coating_growth_mm(0.0002 * IN, 0.5), coating_growth_mm(0.001 * IN, 0.5)
    plain = size_seat(_size_c(post_diameter_mm=0.2493 * IN))
    assert plain.post.clearance_min_mm / IN == pytest.approx(0.0004, abs=1e-9)
    # post 0.2495 in with the 0.0002–0.001 in growth: finished ±0.0006 in, so up to 0.2501 in against bore min 0.2499
    scattered = size_seat(_size_c(post_diameter_mm=0.2495 * IN, coating_growth_mm=thin, coating_growth_max_mm=thick))
    assert scattered.post.clearance_min_mm / IN == pytest.approx(-0.0002, abs=1e-9)


def test_thick_end_below_thin_end_is_refused() -> None:
    with pytest.raises(ValueError):
        _size_c(coating_growth_mm=0.02, coating_growth_max_mm=0.01)
