"""The production lot: shares against the analytic normal model, spreads against RSS, pairing, determinism."""
from __future__ import annotations

import json
import math
import subprocess
import sys
from pathlib import Path

import numpy as np
import pytest

import yodraft
from yodraft.cli import main
from yodraft.lot import _chunk_moment, lot_bands, lot_summary, pair_by_mass, run_lot
from yodraft.massprops import body_props
from yodraft.summary import summary

ROOT = Path(__file__).resolve().parents[1]
TEMPLATE = ROOT / "templates" / "string-trick.toml"


def _design(text: str, name: str = "lot.toml") -> yodraft.Design:
    return yodraft.design.loads(text, name)


@pytest.fixture(scope="module")
def tight_seat() -> yodraft.Design:
    """The starter design with the coating off and the post and wall bore pinned near the bearing's middle sizes,
    so a tenth or so of random pairs will not slide together."""
    text = TEMPLATE.read_text(encoding="utf-8")
    text = text.replace('coating = "anodize type II"', 'coating = "none"')
    text = text.replace('[features.bearing_seat]\n',
                        '[features.bearing_seat]\npost_diameter = "6.346 mm"\nwall_bore = "12.700 mm"\n')
    return _design(text)


def _binomial_tolerance(p: float, n: int) -> float:
    return 4 * math.sqrt(p * (1 - p) / n)  # four binomial standard errors


def test_no_slide_share_agrees_with_the_check_probability(tight_seat: yodraft.Design) -> None:
    resolved = yodraft.build(tight_seat)
    seat = summary(resolved)["bearing_seat"]
    p_post, p_wall = seat["post_p_no_slide"], seat["wall_p_no_slide"]
    assert 0.05 < p_post < 0.3 and 0.05 < p_wall < 0.3  # the test means something
    # the same normal model written out: P(clearance < 0) = Φ(−mean / σ), σ = RSS of the ±3σ bands / 3
    bore_mid, race_half, machine = 6.35 - 0.002, 0.002, 0.0002 * 25.4  # ISO 492 P4 bore 0/−4 µm; 0.0002 in lathe
    sigma = math.hypot(race_half, machine) / 3
    assert p_post == pytest.approx(0.5 * math.erfc((bore_mid - 6.346) / sigma / math.sqrt(2)), rel=1e-9)
    n = 200_000
    lot = lot_summary(run_lot(tight_seat, units=n, seed=7, exact_sample=4))
    assert abs(lot["no_slide_post_share"] - p_post) <= _binomial_tolerance(p_post, n)
    assert abs(lot["no_slide_wall_share"] - p_wall) <= _binomial_tolerance(p_wall, n)
    either = 1 - (1 - p_post) * (1 - p_wall)  # independent: post and wall bore meet different races
    assert abs(lot["no_slide_share"] - either) <= _binomial_tolerance(either, n)


def test_uniform_draws_stay_inside_the_worst_case_limits(tight_seat: yodraft.Design) -> None:
    seat = summary(yodraft.build(tight_seat))["bearing_seat"]
    half = run_lot(tight_seat, units=20_000, seed=3, distribution="uniform", exact_sample=4).half
    clearance = half["post_clearance_mm"]
    assert seat["clearance_min_mm"] - 1e-12 <= clearance.min() and clearance.max() <= seat["clearance_max_mm"] + 1e-12
    # evenly spread: the extremes come within a few per cent of the worst-case ends
    span = seat["clearance_max_mm"] - seat["clearance_min_mm"]
    assert clearance.min() < seat["clearance_min_mm"] + 0.05 * span


def test_gap_spread_agrees_with_its_rss() -> None:
    design = yodraft.load(TEMPLATE)
    lot = lot_summary(run_lot(design, units=400_000, seed=11, exact_sample=4))
    check = summary(yodraft.build(design))
    rss_min, rss_max = check["bearing_seat"]["gap_rss_mm"]  # the check's RSS range, ±3σ
    sigma = (rss_max - rss_min) / 6
    assert lot["gap_mm"]["sd"] == pytest.approx(sigma, rel=0.01)
    assert lot["gap_mm"]["mean"] == pytest.approx((rss_min + rss_max) / 2, abs=4 * sigma / math.sqrt(200_000))
    # the same written out: gap = bearing width − two wall offsets, each band ±3σ
    width_half = 0.040 / 2  # ISO 492 P4 inner-ring width 0/−40 µm (2.5–10 mm bore)
    offset_half = 0.025  # each wall offset takes half of the ±0.05 mm gap tolerance
    assert sigma == pytest.approx(math.sqrt(width_half**2 + 2 * offset_half**2) / 3, rel=1e-9)
    # share outside nominal ± tolerance of a normal gap: Φ(a) + 1 − Φ(b)
    mean = 4.7625 - width_half - 0.4
    lo, hi = 4.3625 - 0.05, 4.3625 + 0.05
    out = 0.5 * math.erfc((mean - lo) / sigma / math.sqrt(2)) + 0.5 * math.erfc((hi - mean) / sigma / math.sqrt(2))
    assert abs(lot["gap_out_share"] - out) <= _binomial_tolerance(out, 200_000)


def test_a_wall_face_flush_with_the_seat_face_is_still_drawn_within_its_band() -> None:
    # a wall offset of 0 is a size (the wall face flush with the seat face), not an absent one: the gap
    # keeps both offsets' ±0.025 mm bands beside the bearing's width band
    text = TEMPLATE.read_text(encoding="utf-8").replace('wall_offset = "0.2 mm"', 'wall_offset = "0 mm"')
    design = _design(text)
    lot = lot_summary(run_lot(design, units=200_000, seed=5, exact_sample=0))
    width_half = 0.040 / 2  # ISO 492 P4 inner-ring width 0/−40 µm (2.5–10 mm bore)
    offset_half = 0.025  # each wall offset takes half of the ±0.05 mm gap tolerance
    sigma = math.sqrt(width_half**2 + 2 * offset_half**2) / 3
    assert lot["gap_mm"]["sd"] == pytest.approx(sigma, rel=0.02)
    assert lot["gap_mm"]["mean"] == pytest.approx(4.7625 - width_half, abs=4 * sigma / math.sqrt(200_000))


def test_mass_spread_agrees_with_the_linear_model_rss() -> None:
    design = yodraft.load(TEMPLATE)
    result = run_lot(design, units=200_000, seed=5, exact_sample=8)
    resolved = yodraft.build(design)
    nominal = yodraft.analyse(resolved).half
    half = lot_summary(result)["half_mass_g"]
    assert half["mean"] == pytest.approx(nominal.mass_g, rel=2e-3)
    # independent inputs: sd² = Σ (∂m/∂x · σ)², the density's share included
    from yodraft.lot import _pinned, _sensitivities

    dims, other, _ = lot_bands(resolved)
    sens = _sensitivities(design, dims)
    density = next(b for b in other if b.key == "design.density")
    rss = math.sqrt(sum((s * b.half / 3) ** 2 for s, b in zip(sens[0], dims))
                    + (nominal.mass_g * density.half / density.nominal / 3) ** 2)
    assert half["sd"] == pytest.approx(rss, rel=0.01)
    assert _pinned(design, {}).features == design.features


def test_linear_model_is_close_to_exact_rebuilds() -> None:
    lin = run_lot(yodraft.load(TEMPLATE), units=1000, seed=2, exact_sample=32).linearisation
    assert lin["sample"] == 32 and lin["not_rebuilt"] == 0
    assert 0 < lin["mass_max_relative"] < 5e-3 and 0 < lin["izz_max_relative"] < 5e-3


def test_offset_moments_add_up_to_the_volume() -> None:
    # Green's theorem: π ∮ r² n_r ds over the whole loop is the volume (a whole half moved sideways by e moves
    # its mass centre by e); the chunks' sharp outlines miss only the fillets
    resolved = yodraft.build(yodraft.load(TEMPLATE))
    from yodraft.builder import loop_chunks

    total = sum(_chunk_moment(resolved, f, c) for f, c in loop_chunks(resolved.features))
    volume = body_props(resolved.profile, 1.0).volume_mm3
    assert total == pytest.approx(volume, rel=0.02)


def test_pairing_matches_the_greedy_walk() -> None:
    rng = np.random.default_rng(0)
    for _ in range(20):
        mass = np.round(rng.normal(30, 0.3, 40), 3)
        eligible = rng.random(40) > 0.1
        a, b = pair_by_mass(mass, 0.05, eligible)
        assert np.all(mass[b] - mass[a] <= 0.05 + 1e-12) and np.all(mass[b] >= mass[a])
        assert len(set(a.tolist()) | set(b.tolist())) == 2 * len(a) and eligible[a].all() and eligible[b].all()
        # the textbook greedy walk over the sorted masses (optimal for a one-dimensional window)
        sorted_mass = sorted(mass[eligible].tolist())
        i = pairs = 0
        while i + 1 < len(sorted_mass):
            if sorted_mass[i + 1] - sorted_mass[i] <= 0.05:
                pairs, i = pairs + 1, i + 2
            else:
                i += 1
        assert len(a) == pairs


def _run(*argv: str) -> subprocess.CompletedProcess[str]:
    env = {"PYTHONPATH": str(ROOT / "profile"), "PATH": "/usr/bin:/bin"}
    return subprocess.run([sys.executable, "-m", "yodraft", *argv], capture_output=True, text=True, env=env)


def test_same_seed_same_bytes(tmp_path: Path) -> None:
    outs = []
    for k in range(2):
        csv, svg = tmp_path / f"lot{k}.csv", tmp_path / f"lot{k}.svg"
        done = _run("lot", str(TEMPLATE), "--units", "3000", "--seed", "42", "--json", "--csv", str(csv),
                    "--plot", str(svg))
        assert done.returncode == 0, done.stderr
        outs.append((done.stdout, csv.read_bytes(), svg.read_bytes()))
    assert outs[0] == outs[1]
    other = _run("lot", str(TEMPLATE), "--units", "3000", "--seed", "43", "--json")
    assert other.stdout != outs[0][0]
    data = json.loads(outs[0][0])
    assert outs[0][1].decode().count("\n") == 3001
    assert outs[0][2].startswith(b"<svg") and b"permissible" in outs[0][2]
    assert data["units"] == 3000 and data["seed"] == 42


def test_json_contract(capsys: pytest.CaptureFixture[str]) -> None:
    assert main(["lot", str(TEMPLATE), "--units", "500", "--json"]) == 0
    data = json.loads(capsys.readouterr().out)
    for key in ("units", "seed", "no_slide_share", "gap_out_share", "mass_in_window_share", "unbalance_over_share",
                "linearisation_error"):
        assert key in data
    assert set(data["mass_g"]) >= {"mean", "sd", "p01", "p99"}
    assert set(data["pairs"]) >= {"formed", "left"}
    assert set(data["unbalance_g_mm"]) >= {"mean", "p99", "permissible"}
    assert data["pairs"]["formed"] * 2 + data["pairs"]["left"] == 500
    assert 0 <= data["good_yoyos"] <= data["pairs"]["formed"]
    # the permissible unbalance is the assembled mass times e_per = G / Ω (ISO 21940-11)
    check = summary(yodraft.build(yodraft.load(TEMPLATE)))
    e_per = 6.3 / (10_000 * 2 * math.pi / 60)
    assert data["unbalance_g_mm"]["permissible"] == pytest.approx(check["mass"]["total_g"] * e_per, rel=1e-9)
    assert data["distribution"].startswith("normal")


def test_refuses_to_write_over_the_design(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    design = tmp_path / "d.toml"
    design.write_bytes(TEMPLATE.read_bytes())
    assert main(["lot", str(design), "--csv", str(tmp_path / "." / "d.toml")]) == 2
    assert "is one of the input files" in capsys.readouterr().err
    assert design.read_bytes() == TEMPLATE.read_bytes()


def test_a_sketched_shape_draws_its_own_sizes() -> None:
    design = yodraft.load(ROOT / "templates" / "sketched.toml")
    resolved = yodraft.build(design)
    dims, _, _ = lot_bands(resolved)
    keys = {b.key for b in dims}
    assert {"features.shape.points[1].arc_radius", "features.shape.points[4].z"} <= keys
    # every size pinned at its nominal rebuilds the same half
    from yodraft.lot import _pinned, _unit_props

    pinned = _unit_props(_pinned(design, {b.key: b.nominal for b in dims}))
    assert pinned[0] == pytest.approx(yodraft.analyse(resolved).half.mass_g, rel=1e-12)
    arc = next(b for b in dims if b.key == "features.shape.points[1].arc_radius")
    assert arc.half == 1.0  # ISO 2768-1 Table 2, radius over 6 mm, class m
    lot = lot_summary(run_lot(design, units=20_000, seed=4, exact_sample=16))
    assert lot["linearisation_error"]["mass_max_relative"] < 5e-3
    assert lot["half_mass_g"]["mean"] == pytest.approx(pinned[0], rel=2e-3)


def test_no_slide_share_with_a_coating_range_agrees_with_the_check() -> None:
    # the starter design is anodized with a thickness range: the check widens the fit's spread by the growth's
    # scatter (half its band, as ±3σ); the lot draws the thickness within that range
    text = TEMPLATE.read_text(encoding="utf-8").replace(
        '[features.bearing_seat]\n', '[features.bearing_seat]\npost_diameter = "6.344 mm"\nwall_bore = "12.702 mm"\n')
    design = _design(text)
    seat = summary(yodraft.build(design))["bearing_seat"]
    p_post, p_wall = seat["post_p_no_slide"], seat["wall_p_no_slide"]
    assert 0.05 < p_post < 0.3 and 0.05 < p_wall < 0.3
    n = 200_000
    lot = lot_summary(run_lot(design, units=n, seed=9, exact_sample=4))
    assert abs(lot["no_slide_post_share"] - p_post) <= _binomial_tolerance(p_post, n)
    assert abs(lot["no_slide_wall_share"] - p_wall) <= _binomial_tolerance(p_wall, n)
    coating = next(b for b in lot["bands"] if b["key"] == "shop.coating_thickness")
    assert coating["plus_minus"] == pytest.approx((0.001 - 0.0002) * 25.4 / 2)  # 0.0002–0.001 in, as written


@pytest.mark.parametrize("template", sorted(p.stem for p in (ROOT / "templates").glob("*.toml")))
def test_a_rebuilt_half_weighs_what_a_full_build_weighs(template: str) -> None:
    """The lot rebuilds halves verdict-only; each must weigh, to the bit, what the full build of the same design
    weighs (reference: ``combine_bodies`` over the full build's ``part_props``)."""
    from yodraft.analysis import part_props
    from yodraft.lot import _unit_props
    from yodraft.massprops import combine_bodies

    design = yodraft.load(ROOT / "templates" / f"{template}.toml")
    full = yodraft.build(design)
    if not full.can_analyse:
        assert _unit_props(design) is None
        return
    props = combine_bodies([p for _, _, p in part_props(full)])
    assert _unit_props(design) == (props.mass_g, props.izz_g_mm2)


def test_the_lot_is_the_same_on_one_core_or_many(monkeypatch: pytest.MonkeyPatch) -> None:
    """The lot's blocks are drawn on every core, each from a stream of its own: one core must give the very same
    lot (reference: the same run with the blocks drawn one after another)."""
    import os

    design = yodraft.load(TEMPLATE)
    many = lot_summary(run_lot(design, units=150_000, seed=5, exact_sample=4))
    monkeypatch.setattr(os, "cpu_count", lambda: 1)
    one = lot_summary(run_lot(design, units=150_000, seed=5, exact_sample=4))
    assert json.dumps(many, sort_keys=True) == json.dumps(one, sort_keys=True)


def test_a_half_the_builder_refuses_at_its_band_edges_is_not_rebuilt(tmp_path: Path,
                                                                     capsys: pytest.CaptureFixture[str]) -> None:
    """A design that passes its check must give a lot (and a bill and a report): here the sketch's floor point
    sits so near the bearing wall's features that, at the edges of the bands, the builder refuses some rebuilt
    halves (the point would lie inside the wall). Those halves are counted as not rebuilt, with the reason, and
    the sensitivities fall back to smaller steps."""
    text = (ROOT / "templates" / "sketched.toml").read_text(encoding="utf-8")
    assert text.count('z = "-9 mm"') == 1
    design_file = tmp_path / "near-wall.toml"
    design_file.write_text(text.replace('z = "-9 mm"', 'z = "-9.4 mm"'), encoding="utf-8")
    assert main(["check", str(design_file)]) == 0
    capsys.readouterr()
    assert main(["lot", str(design_file), "--units", "2000", "--json"]) == 0
    lin = json.loads(capsys.readouterr().out)["linearisation_error"]
    assert 0 < lin["not_rebuilt"] < lin["sample"]
    assert "features.shape.points[5]" in lin["first_refusal"] and "bearing wall" in lin["first_refusal"]
    assert lin["mass_max_relative"] < 5e-3
    assert main(["lot", str(design_file), "--units", "2000"]) == 0
    assert f"{lin['not_rebuilt']} of the {lin['sample']} sampled halves do not rebuild" in capsys.readouterr().out
    for command in ("bom", "report"):
        assert main([command, str(design_file)]) == 0


def test_the_lot_plot_shows_every_bin_that_holds_a_unit_and_fits_its_title() -> None:
    import re

    from yodraft.lot_plot import BINS, Panel, _range, histogram_svg
    from yodraft.pictures.svg import text_width

    # one unit far out in the tail: its bin holds a millionth of the lot and must still be drawn
    values = np.concatenate([np.random.default_rng(3).normal(0.0, 1.0, 1_000_000), [3.5]])
    title = "a lot title long enough to run past the right edge of the page at the usual size " * 2
    svg = histogram_svg(title, [Panel("x", values, ((0.0, "nominal"),))])
    heights = [float(h) for h in re.findall(r'<rect x="[^"]+" y="[^"]+" width="[^"]+" height="([^"]+)" fill="#1f5fa8"', svg)]
    lo, hi = _range(values, ((0.0, "nominal"),))
    counts, _ = np.histogram(np.clip(values, lo, hi), bins=BINS, range=(lo, hi))
    assert len(heights) == int((counts > 0).sum()) and min(heights) > 0
    size = float(re.search(r'<text x="70" y="22" font-size="([^"]+)"', svg).group(1))
    assert 70 + text_width(title, size) <= 720  # the page is 720 wide, the title starts at 70


def test_mass_order_is_numpys_stable_argsort() -> None:
    from yodraft.lot import _mass_order

    rng = np.random.default_rng(11)
    for n, decimals in ((2, None), (17, 1), (1000, None), (200_000, None), (200_000, 3), (200_000, 6)):
        mass = rng.normal(31.0, 0.5, n)
        if decimals is not None:  # exact ties, which the integer keys alone would order by index
            mass = np.round(mass, decimals)
        assert np.array_equal(_mass_order(mass), np.argsort(mass, kind="stable"))  # NumPy, the reference
    # masses across powers of two (their bit patterns change exponent), spread wide enough that the keys are cut
    # far, and spread so little that they are not cut at all
    for mass in (rng.uniform(10.0, 70.0, 300_000), rng.uniform(1e-3, 1e3, 300_000), 31.0 + rng.normal(0, 1e-12, 5000)):
        assert np.array_equal(_mass_order(mass), np.argsort(mass, kind="stable"))
    assert np.array_equal(_mass_order(np.array([2.0, -1.0, 0.0])), [1, 2, 0])  # not all positive: NumPy's own

