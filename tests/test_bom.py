"""Bill of materials and stock: the ISO 4026 axle length, the bar a half is turned from, totals with scrap."""
from __future__ import annotations

import json
import math
from pathlib import Path

import pytest

import yodraft
from yodraft.bom import bill_of_materials, bom_data, choose_set_screw
from yodraft.catalog.bar_stock import BAR_DIAMETERS_MM, next_bar_diameter
from yodraft.catalog.setscrews import inch_length, standard_lengths, standard_of
from yodraft.cli import main
from yodraft.report import report_data, report_markdown

ROOT = Path(__file__).resolve().parents[1]
TEMPLATE = ROOT / "templates" / "string-trick.toml"


def test_iso_4026_lengths() -> None:
    # ISO 4026 (from memory): M4 set screws from 4 to 20 mm in the series 4, 5, 6, 8, 10, 12, 16, 20;
    # M3 from 3 to 16 mm; M5 from 5 to 25 mm
    assert standard_lengths("M4x0.7") == (4.0, 5.0, 6.0, 8.0, 10.0, 12.0, 16.0, 20.0)
    assert standard_lengths("M3x0.5") == (3.0, 4.0, 5.0, 6.0, 8.0, 10.0, 12.0, 16.0)
    assert standard_lengths("M5x0.8") == (5.0, 6.0, 8.0, 10.0, 12.0, 16.0, 20.0, 25.0)
    assert standard_lengths("M6x1") == ()  # a thread the table does not hold


@pytest.mark.parametrize(("depth", "wanted", "expected"), [
    (8.0, 15.6, 16.0),   # fits 13 to 17 mm: of the ISO 4026 M4 lengths only 16 lies there
    (10.0, 19.6, 20.0),  # fits 13 to 21 mm: 16 and 20; 20 is nearer the wanted length
    (10.0, 17.0, 16.0),  # the same window, 16 nearer
    (6.0, 11.6, None),   # fits 13 to 13 mm: 12 is too short to engage, 16 runs past the thread
])
def test_axle_length_engages_both_threads(depth: float, wanted: float, expected: float | None) -> None:
    # spacing 1 mm; engagement 1.5 × 4 mm in aluminium (common practice, no published source)
    screw = choose_set_screw("M4x0.7", 1.0, depth, 6.0, wanted)
    assert screw.length_mm == expected
    if expected is not None:
        assert expected in standard_lengths("M4x0.7")
        engaged = (expected - 1.0) / 2
        assert 6.0 <= engaged <= depth


def test_bar_stock_for_the_starter_design() -> None:
    resolved = yodraft.build(yodraft.load(TEMPLATE))
    bom = bill_of_materials(resolved, 100, lot_halves=2000)
    s = bom.stock
    assert next_bar_diameter(56.0 + 2.0) == 60.0 and s.bar_diameter_mm == 60.0  # Ø56 outer + 2 mm turning allowance
    z_min, _, z_max, _ = resolved.profile.bounds()
    assert s.length_mm == pytest.approx(z_max - z_min + 1.0 + 3.0)  # facing 1 mm, parting 3 mm
    # a cylinder of 2.70 g/cm³: m = π/4 · D² · L · ρ
    assert s.mass_g == pytest.approx(math.pi / 4 * 6.0**2 * (s.length_mm / 10) * 2.70, rel=1e-12)
    assert s.kept_g < s.mass_g
    assert bom.axle.length_mm == 16.0  # M4 thread 8 mm deep, posts 1 mm apart
    assert bom.halves == math.ceil(100 / bom.good_per_half - 1e-9) and bom.halves >= 200


def test_shop_allowances_override(string_trick_text: str) -> None:
    from conftest import set_in

    text = set_in(string_trick_text, "shop", "stock_turning_allowance", "6 mm")
    text = set_in(text, "shop", "stock_parting_allowance", "4 mm")
    resolved = yodraft.build(yodraft.design.loads(text, "x.toml"))
    s = bill_of_materials(resolved, 10, lot_halves=200).stock
    assert s.bar_diameter_mm == 63.0 and 63.0 in BAR_DIAMETERS_MM  # 56 + 6 = 62 → next stocked 63
    z_min, _, z_max, _ = resolved.profile.bounds()
    assert s.length_mm == pytest.approx(z_max - z_min + 1.0 + 4.0)


def test_bom_json_contract(capsys: pytest.CaptureFixture[str]) -> None:
    assert main(["bom", str(TEMPLATE), "--units", "50", "--json"]) == 0
    data = json.loads(capsys.readouterr().out)
    assert data["units"] == 50
    names = {i["name"]: i for i in data["items"]}
    assert {"half", "bearing", "response pad", "axle", "bar stock"} <= set(names)
    assert names["bearing"]["quantity"] == 50 and names["response pad"]["quantity"] == 100
    assert "ISO 4026 M4x0.7 × 16" in names["axle"]["description"]
    assert set(data["stock"]) >= {"bar_diameter_mm", "length_mm", "mass_g"}
    assert data["totals"]["halves"] == names["half"]["quantity"] >= 100


def test_report_carries_the_bill() -> None:
    data = report_data(yodraft.build(yodraft.load(TEMPLATE)))
    assert data["bom"] == bom_data(bill_of_materials(yodraft.build(yodraft.load(TEMPLATE))))
    text = report_markdown(data)
    assert "## Bill of materials and stock" in text and "ISO 4026 M4x0.7 × 16" in text


def test_inch_set_screw_lengths() -> None:
    # stocked inch set-screw lengths 1/8 to 1/2 in by sixteenths, then to 1 in by eighths (common practice, no
    # published source); 1 in = 25.4 mm exactly (international inch, 1959)
    assert standard_lengths("10-32 UNF") == (3.175, 4.7625, 6.35, 7.9375, 9.525, 11.1125, 12.7, 15.875, 19.05,
                                             22.225, 25.4)
    assert standard_lengths("8-32 UNC") == standard_lengths("10-32 UNF")
    assert standard_of("10-32 UNF") == "ASME B18.3" and standard_of("M4x0.7") == "ISO 4026"
    assert [inch_length(x) for x in (3.175, 11.1125, 15.875, 25.4)] == ["1/8 in", "7/16 in", "5/8 in", "1 in"]


def test_an_inch_axle_thread_is_bought_by_the_inch(string_trick_text: str) -> None:
    text = string_trick_text.replace('thread = "M4x0.7"', 'thread = "10-32 UNF"')
    resolved = yodraft.build(yodraft.design.loads(text, "x.toml"))
    bom = bill_of_materials(resolved, 10, lot_halves=200)
    v = resolved.values
    # the screw reaches 1.5 × 0.190 in into each half (aluminium, common practice, no published source) and
    # no further than the full thread, across the post spacing
    least = v["bearing_seat.spacing"] + 2 * 1.5 * 0.190 * 25.4
    most = v["bearing_seat.spacing"] + 2 * v["axle_bore.thread_depth"]
    assert bom.axle.standard == "ASME B18.3" and least - 1e-9 <= bom.axle.length_mm <= most + 1e-9
    assert bom.axle.length_mm == 15.875  # 5/8 in: of the stocked lengths, only 5/8 in lies in the window here
    axle = next(i for i in bom.items if i.name == "axle")
    assert "ASME B18.3 10-32 UNF × 5/8 in (15.875 mm)" in axle.description


def test_a_ring_is_bought_as_tube_with_the_same_allowances() -> None:
    # the ring of the bimetal template: Ø55 tube (the next stocked size above its outside + 2 mm), bore at most
    # its own less 2 mm to the mm below, cut to its width + 1 + 3 mm; the mass bought is the tube's,
    # m = π/4 · (D² − d²) · L · ρ
    resolved = yodraft.build(yodraft.load(ROOT / "templates" / "bimetal-ring.toml"))
    bom = bill_of_materials(resolved, 100, lot_halves=2000)
    ring = resolved.parts[1]
    z_min, r_min, z_max, r_max = ring.profile.bounds()
    (name, s), = bom.part_stocks
    assert name == "ring" and s.material == ring.material == "C36000"
    assert s.bar_diameter_mm == next_bar_diameter(2 * r_max + 2.0) and s.bar_diameter_mm >= 2 * r_max + 2.0
    assert s.bore_mm == math.floor(2 * r_min - 2.0) and s.bore_mm <= 2 * r_min - 2.0
    assert s.length_mm == pytest.approx(z_max - z_min + 1.0 + 3.0)
    assert ring.density_g_cm3 == pytest.approx(8.50, abs=0.01)  # C36000 free-cutting brass, 8.50 g/cm³ (from memory)
    assert s.mass_g == pytest.approx(math.pi / 4 * (s.bar_diameter_mm**2 - s.bore_mm**2) * s.length_mm
                                     * ring.density_g_cm3 / 1000, rel=1e-12)
    assert 0 < s.kept_g < s.mass_g
    data = bom_data(bom)
    (entry,) = data["part_stock"]
    assert entry["part"] == "ring" and entry["tube_bore_mm"] == s.bore_mm
    assert entry["total_mass_g"] == pytest.approx(bom.halves * s.mass_g)
    line = next(i for i in data["items"] if i["name"] == "ring stock")
    assert line["quantity"] == bom.halves and f"Ø{s.bore_mm:g} mm bore" in line["description"]


def test_a_ring_with_a_small_bore_is_bought_as_bar() -> None:
    # a bore that leaves under 5 mm once the allowance is taken off is turned from solid bar
    from yodraft.bom import part_stock
    from yodraft.geometry import Profile
    from yodraft.parts import Part

    shop = {"stock_turning_allowance": 2.0, "stock_facing_allowance": 1.0, "stock_parting_allowance": 3.0}
    small = Part("ring", "C36000", 8.5, Profile.from_points([(0, 3), (4, 3), (4, 10), (0, 10)]))
    s = part_stock(small, shop, 1.0, tube=True)  # Ø6 bore − 2 mm = 4 mm: below 5 mm
    assert s.bore_mm is None and s.bar_diameter_mm == 25.0  # Ø20 + 2 → next stocked 25
    assert s.mass_g == pytest.approx(math.pi / 4 * 25.0**2 * 8.0 * 8.5 / 1000, rel=1e-12)


def test_a_half_above_every_stocked_bar_names_the_least_diameter_it_needs() -> None:
    # a Ø170 half (above the largest stocked Ø160 bar) with the 2 mm turning allowance needs a bar of Ø172 or more
    from yodraft.bom import _bar, part_stock
    from yodraft.geometry import Profile
    from yodraft.parts import Part

    shop = {"stock_turning_allowance": 2.0, "stock_facing_allowance": 1.0, "stock_parting_allowance": 3.0}
    wide = Part("body", "6061-T6", 2.7, Profile.from_points([(0, 0), (20, 0), (20, 85), (0, 85)]))
    s = part_stock(wide, shop, 1.0)
    assert s.bar_diameter_mm is None and s.mass_g is None and max(BAR_DIAMETERS_MM) < 172.0
    assert _bar(s) == "Ø172.0 mm or more (above the stocked sizes held)"
