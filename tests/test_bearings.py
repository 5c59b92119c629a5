"""Bearing precision classes (ISO 492 / ABMA Std 20) and the bearing catalog."""
from __future__ import annotations

import pytest

from yodraft.catalog.bearings import BEARINGS, LETTER_SIZES, BearingRow, lookup_bearing
from yodraft.tolerances.bearings import PRECISION_CLASSES, bearing_deviation_um, normalise_precision

IN = 25.4  # 1 in = 25.4 mm exactly (1959 international yard and pound agreement)


@pytest.mark.parametrize(
    ("text", "iso"),
    [
        ("ABEC 7", "P4"),   # ABMA Std 20: ABEC 7 ~ ISO 492 class 4
        ("abec7", "P4"),    # ABMA Std 20
        ("ABEC-5", "P5"),   # ABMA Std 20: ABEC 5 ~ class 5
        ("ABEC 3", "P6"),   # ABMA Std 20: ABEC 3 ~ class 6
        ("ABEC 9", "P2"),   # ABMA Std 20: ABEC 9 ~ class 2
        ("ABEC 1", "Normal"),  # ABMA Std 20: ABEC 1 ~ Normal
        ("p4", "P4"),
        ("Normal", "Normal"),
        ("P0", "Normal"),   # ISO 492 Normal class, often written P0 (common practice, no published source)
    ],
)
def test_normalise_precision(text: str, iso: str) -> None:
    assert normalise_precision(text) == iso


@pytest.mark.parametrize("text", ["ABEC 11", "P3", "ABEC 7P", "fine", ""])
def test_unknown_precision(text: str) -> None:
    with pytest.raises(KeyError):
        normalise_precision(text)


def test_precision_classes_all_resolve() -> None:
    assert {normalise_precision(name) for name in PRECISION_CLASSES} == {"Normal", "P6", "P5", "P4", "P2"}


@pytest.mark.parametrize(
    ("precision", "kind", "size", "dev"),
    [
        ("P4", "bore", 6.35, (0.0, -4.0)),      # ISO 492, class 4 Δdmp, bore 2.5–10 mm
        ("Normal", "bore", 8.0, (0.0, -8.0)),   # ISO 492, Normal Δdmp, bore 2.5–10 mm
        ("Normal", "bore", 2.0, (0.0, -8.0)),   # ISO 492, Normal Δdmp, bore 0.6–2.5 mm
        ("P6", "bore", 12.0, (0.0, -7.0)),      # ISO 492, class 6 Δdmp, bore 10–18 mm
        ("P5", "od", 12.7, (0.0, -5.0)),        # ISO 492, class 5 ΔDmp, OD 6–18 mm
        ("P5", "od", 22.0, (0.0, -6.0)),        # ISO 492, class 5 ΔDmp, OD 18–30 mm
        ("Normal", "od", 22.0, (0.0, -9.0)),    # ISO 492, Normal ΔDmp, OD 18–30 mm
        ("ABEC 7", "od", 16.0, (0.0, -4.0)),    # ISO 492 class 4 ΔDmp OD 6–18 mm, ABEC 7 per ABMA Std 20
    ],
)
def test_deviation_values(precision: str, kind: str, size: float, dev: tuple[float, float]) -> None:
    assert bearing_deviation_um(precision, kind, size) == dev


def test_deviation_step_bounds_and_order() -> None:
    # ISO 492 steps are "over … up to and including": 10 mm is in 2.5–10, 18 mm OD in 6–18
    assert bearing_deviation_um("P5", "od", 18.0) == (0.0, -5.0)   # ISO 492, class 5 OD 6–18 mm
    assert bearing_deviation_um("P5", "od", 18.01) == (0.0, -6.0)  # ISO 492, class 5 OD 18–30 mm
    # tighter classes never allow a wider band (ISO 492 class order Normal > 6 > 5 > 4 > 2)
    for kind, size in (("bore", 1.0), ("bore", 6.0), ("bore", 15.0), ("od", 5.0), ("od", 12.0), ("od", 25.0)):
        bands = [-bearing_deviation_um(c, kind, size)[1] for c in ("Normal", "P6", "P5", "P4", "P2")]
        assert bands == sorted(bands, reverse=True)


@pytest.mark.parametrize(("kind", "size"), [("bore", 0.5), ("bore", 20.0), ("od", 2.0), ("od", 31.0), ("width", 20.0), ("length", 5.0)])
def test_deviation_out_of_range(kind: str, size: float) -> None:
    with pytest.raises(ValueError):
        bearing_deviation_um("P5", kind, size)


def test_size_c_is_r188zz() -> None:
    row = lookup_bearing("C")  # trade size C = R188 (common practice, no published source)
    assert row.designation == "R188ZZ" and row.inch
    # R188: 1/4 x 1/2 x 3/16 in shielded (common practice, no published source)
    assert (row.bore_mm, row.od_mm, row.width_mm) == pytest.approx((6.35, 12.7, 4.7625))
    assert lookup_bearing("c") is row and lookup_bearing(" r188zz ") is row
    # the open R188 is 1/8 in wide (from memory)
    assert lookup_bearing("R188").width_mm == pytest.approx(0.125 * IN)


@pytest.mark.parametrize(
    ("name", "size"),
    [
        ("MR105", (5.0, 10.0, 4.0)),   # ISO 15 miniature 5 x 10 x 4 (from memory)
        ("MR126ZZ", (6.0, 12.0, 4.0)),  # ISO 15 miniature 6 x 12 x 4 (from memory)
        ("688", (8.0, 16.0, 5.0)),     # ISO 15 series 18, 8 x 16 x 5 (from memory)
        ("608zz", (8.0, 22.0, 7.0)),   # ISO 15 series 02, 8 x 22 x 7 (from memory)
    ],
)
def test_metric_rows(name: str, size: tuple[float, float, float]) -> None:
    row = lookup_bearing(name)
    assert (row.bore_mm, row.od_mm, row.width_mm) == size and not row.inch


def test_catalog_rows_are_sane() -> None:
    for designation, row in BEARINGS.items():
        assert isinstance(row, BearingRow) and row.designation == designation
        assert 0 < row.bore_mm < row.od_mm and row.width_mm > 0 and row.mass_g > 0
        assert row.source  # every row names its source (project rule)
        # every catalogued bearing falls in the ISO 492 steps held here
        bearing_deviation_um("Normal", "bore", row.bore_mm)
        bearing_deviation_um("Normal", "od", row.od_mm)
    assert all(v in BEARINGS for v in LETTER_SIZES.values())
    with pytest.raises(KeyError):
        lookup_bearing("Z")
