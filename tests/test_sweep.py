"""yodraft sweep: a grid of variants, failed ones kept, CSV and SVG; bad --vary is one line and exit 2."""
from __future__ import annotations

import csv
import io
import xml.etree.ElementTree as ET
from pathlib import Path

import pytest

from conftest import TEMPLATES, set_in
from yodraft import build, load, loads, summary
from yodraft.cli import main
from yodraft.design import with_values
from yodraft.sweep import parse_vary, sweep

DESIGN = str(TEMPLATES / "string-trick.toml")


@pytest.mark.parametrize("vary, words", [
    ("rim.band_width=6mm:3mm:0", "count 0 is out of range"),
    ("rim.band_width=6mm:3mm:1", "count 1 is out of range"),
    ("rim.band_width=6mm:3mm:x", "is not a whole number"),
    ("rim.widht=6mm:3mm:4", "is not a design key"),
    ("features.nothing.width=6mm:3mm:4", "is not a design key"),
    ("rim.band_width=6g:3g:4", "is not a unit of length"),
    ("rim.band_width=6:3:4", "as a number followed by a unit"),
    ("rim.band_width=6mm:3mm", "cannot be read"),
    ("design.name=1mm:2mm:3", "cannot be swept"),
    ("rim.band_width=6mm:6mm:3", "START equals STOP"),
    ("shape.points[0].radius=1mm:2mm:3", "is past the 0 tables the design has"),  # a preset shape: no points
    ("shape.point[0].radius=1mm:2mm:3", "is not a design key"),
])
def test_bad_vary_one_line_exit_2(capsys: pytest.CaptureFixture[str], vary: str, words: str) -> None:
    assert main(["sweep", DESIGN, "--vary", vary]) == 2
    err = capsys.readouterr().err.strip()
    assert words in err and len(err.splitlines()) == 1


def test_sweep_keeps_failed_variants(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    out, plot = tmp_path / "s.csv", tmp_path / "s.svg"
    code = main(["sweep", DESIGN, "--vary", "features.rim.thickness=1mm:8mm:8", "--csv", str(out), "--plot", str(plot)])
    err = capsys.readouterr().err
    assert code == 0
    rows = list(csv.DictReader(io.StringIO(out.read_text(encoding="utf-8"))))
    assert [float(r["features.rim.thickness_mm"]) for r in rows] == pytest.approx([1, 2, 3, 4, 5, 6, 7, 8])
    failed = [r for r in rows if r["ok"] == "false"]
    assert failed and len(failed) < len(rows)
    assert all(r["failed"] for r in failed) and "[rim." in failed[0]["failed"]
    assert f"{len(rows) - len(failed)} of {len(rows)} variants pass" in err
    assert "[#" not in err  # no progress bar when stderr is not a terminal
    for key in ("profile.gap_mm", "mass.total_g", "mass.izz_g_mm2", "spin.rim_share"):
        assert key in rows[0]
    passing = [r for r in rows if r["ok"] == "true"]
    masses = [float(r["mass.total_g"]) for r in passing]
    assert masses == sorted(masses)  # a thicker rim adds metal
    assert len({r["profile.gap_mm"] for r in rows}) == 1  # the rim does not move the bearing seat
    svg = ET.fromstring(plot.read_text(encoding="utf-8"))
    ns = "{http://www.w3.org/2000/svg}"
    assert len(svg.findall(f"{ns}polyline")) == 2  # the default outputs: assembled mass and Izz


def test_variant_equals_the_edited_file(string_trick_text: str) -> None:
    # the sweep's variant must be the same design as writing the value into the file by hand
    design = loads(string_trick_text)
    result = sweep(design, [parse_vary("features.rim.band_width=6mm:9mm:4", design)], workers=1)
    third = result.variants[2]
    by_hand = summary(build(loads(set_in(string_trick_text, "features.rim", "band_width", "8 mm"))))
    assert third.inputs == (pytest.approx(8.0),)
    assert third.outputs["mass.total_g"] == pytest.approx(by_hand["mass"]["total_g"], rel=1e-12)
    assert third.outputs["mass.izz_g_mm2"] == pytest.approx(by_hand["mass"]["izz_g_mm2"], rel=1e-12)
    assert third.ok is by_hand["ok"]


def test_two_axes_across_processes_match_one_process() -> None:
    design = load(DESIGN)
    axes = [parse_vary("rim.band_width=6mm:10mm:9", design), parse_vary("features.rim.thickness=2mm:5mm:10", design)]
    serial = sweep(design, axes, workers=1)
    parallel = sweep(design, axes, workers=2)
    assert len(serial.variants) == 90
    assert serial.variants == parallel.variants
    assert serial.variants[10].inputs == (pytest.approx(6.5), pytest.approx(2.0))  # first axis slowest


def test_angle_axis_in_degrees() -> None:
    design = load(DESIGN)
    axis = parse_vary("features.rim.floor_angle=20deg:30deg:3", design)
    result = sweep(design, [axis], workers=1)
    assert axis.column == "features.rim.floor_angle_deg"
    assert [v.inputs[0] for v in result.variants] == pytest.approx([20.0, 25.0, 30.0])


@pytest.mark.parametrize("template", ["string-trick", "undersized", "wide-heavy"])
def test_outputs_carry_the_summary_values(template: str) -> None:
    # each output is named and valued as in `check --json`; a variant whose loop crosses itself has no mass keys
    from yodraft.sweep import OUTPUT_KEYS

    text = (TEMPLATES / f"{template}.toml").read_text(encoding="utf-8")
    design = loads(text)
    result = sweep(design, [parse_vary("features.rim.thickness=0.5mm:4mm:3", design)], workers=1)
    for variant, thickness in zip(result.variants, ("0.5 mm", "2.25 mm", "4 mm")):
        resolved = build(loads(set_in(text, "features.rim", "thickness", thickness)))
        data = summary(resolved, detail=False)
        expected = {key: data[key.split(".")[0]][key.split(".")[1]] for key in OUTPUT_KEYS
                    if key.split(".")[0] in data}
        assert variant.outputs == expected
        assert variant.ok is resolved.ok
        assert variant.failed == tuple(f"{c.name} [{c.feature}.{c.parameter}]" for c in resolved.failed)


def test_a_key_under_its_earlier_name_sweeps_the_same_and_keeps_its_column(string_trick_text: str) -> None:
    design = loads(string_trick_text)
    old, new = parse_vary("features.rim.width=6mm:9mm:4", design), parse_vary("rim.band_width=6mm:9mm:4", design)
    assert (old.column, new.column) == ("features.rim.width_mm", "features.rim.band_width_mm")
    ran = [sweep(design, [axis], workers=1).variants for axis in (old, new)]
    assert [v.outputs for v in ran[0]] == [v.outputs for v in ran[1]]


@pytest.mark.parametrize("template", ["string-trick", "arc-organic", "undercut-rim", "sketched", "bimetal-ring"])
def test_verdict_only_build_fails_the_same_checks(template: str) -> None:
    # a sweep's build leaves out what never fails (re-entrant regions) and cuts the least-wall search at the
    # shop's limit: every variant must pass and fail exactly the checks of the full build
    base = load(TEMPLATES / f"{template}.toml")
    thin = []
    for thickness in (0.6, 1.2, 2.5, 4.0, 6.0):
        for min_wall in (0.4, 0.8, 1.6, 3.0):
            design = with_values(base, [("features.rim.thickness", thickness), ("shop.min_wall", min_wall)])
            full, lean = build(design), build(design, verdict_only=True)
            assert lean.ok is full.ok
            assert [c[:4] for c in lean.failed] == [c[:4] for c in full.failed]
            # a failed check is worded as in the full build (only the least wall says less: it was not measured)
            assert [c.message for c in lean.failed if c.name != "least wall across metal"] == \
                [c.message for c in full.failed if c.name != "least wall across metal"]
            thin.append(any(c.name == "least wall across metal" for c in full.failed))
    assert any(thin) and not all(thin)  # the grid reaches both sides of the least wall


@pytest.mark.parametrize("template", ["string-trick", "arc-organic", "bimetal-ring"])
def test_a_chunk_of_variants_equals_each_built_alone(template: str) -> None:
    # a chunk judges its loops and weighs its halves all at once: every variant must carry exactly the
    # verdict and the figures (to the bit) of its own full build and the one-at-a-time outputs
    from yodraft.batch_mass import MIN_BATCH
    from yodraft.sweep import _outputs, run_variants

    base = load(TEMPLATES / f"{template}.toml")
    axes = [parse_vary("features.rim.thickness=0.8mm:6mm:12", base), parse_vary("shop.min_wall=0.4mm:1.6mm:5", base)]
    points = [(i * 5 + j, (u, v)) for i, u in enumerate(axes[0].values()) for j, v in enumerate(axes[1].values())]
    chunk = run_variants(base, axes, points)
    assert sum(v.ok for v in chunk) not in (0, len(chunk))
    assert sum("mass.half_g" in v.outputs for v in chunk) >= MIN_BATCH  # enough halves to be weighed at once
    for variant, (_, (u, v)) in zip(chunk, points):
        alone = build(with_values(base, [(axes[0].key, u), (axes[1].key, v)]))
        assert variant.ok is alone.ok
        assert variant.failed == tuple(f"{c.name} [{c.feature}.{c.parameter}]" for c in alone.failed)
        expected = _outputs(alone)
        assert variant.outputs.keys() == expected.keys()
        assert [float.hex(x) for x in variant.outputs.values() if x is not None] == \
            [float.hex(x) for x in expected.values() if x is not None]


def test_the_lines_written_by_the_workers_make_the_csv_written_afresh() -> None:
    """A variant's CSV line is written where it was run; joined, the lines must give the very CSV that writing every
    row afresh from the variants gives, quoting included (reference: Python's csv writer over the rows)."""
    from dataclasses import replace

    from yodraft.sweep import SweepResult, csv_text

    design = load(DESIGN)
    axes = [parse_vary("rim.band_width=2mm:12mm:12", design), parse_vary("rim.thickness=0.5mm:6mm:11", design)]
    for workers in (1, 2):
        result = sweep(design, axes, workers=workers)
        assert all(v.line for v in result.variants)
        afresh = SweepResult(result.design_name, result.axes, tuple(replace(v, line="") for v in result.variants))
        text = csv_text(result)
        assert text == csv_text(afresh)
        rows = list(csv.reader(io.StringIO(text)))
        assert len(rows) == 1 + 132 and {len(r) for r in rows} == {len(rows[0])}
        assert any(r[rows[0].index("failed")] for r in rows[1:])  # some variants fail, so the failed column is written


def test_a_grid_value_finer_than_the_file_holds_fails_as_an_input() -> None:
    # a design file takes a length of 0 or at least 0.001 mm (the sheet writes sizes to the µm; common
    # practice, no published source): the grid's ±0.0005 mm are no design, 0 and ±0.001 mm are
    base = load(TEMPLATES / "string-trick.toml")
    result = sweep(base, [parse_vary("features.bearing_seat.wall_offset=-0.0015mm:0.0015mm:7", base)], workers=1)
    fine = [v.inputs[0] for v in result.variants if v.failed and v.failed[0].startswith("input:")]
    assert fine == pytest.approx([-0.0005, 0.0005])
    assert all("features.bearing_seat.wall_offset" in v.failed[0] for v in result.variants if v.inputs[0] in fine)
    assert [v.ok for v in result.variants][-2:] == [True, True]  # 0.001 and 0.0015 mm build


SKETCHED = TEMPLATES / "sketched.toml"


def test_a_sketch_point_is_swept_as_the_edited_file() -> None:
    """A sketch point's size is a key like any other (``features.shape.points[2].radius``): each variant is the
    design with that value written in the point's own [[features.shape.points]] table."""
    from yodraft.tomledit import set_key

    text = SKETCHED.read_text(encoding="utf-8")
    design = loads(text)
    assert design.features["shape"]["points"][2]["radius"] == pytest.approx(2.0)  # the table varied below
    result = sweep(design, [parse_vary("shape.points[2].radius=1mm:3mm:3", design)], workers=1)
    assert [v.inputs for v in result.variants] == [(pytest.approx(1.0),), (pytest.approx(2.0),), (pytest.approx(3.0),)]
    for variant, value in zip(result.variants, ("1 mm", "2 mm", "3 mm")):
        by_hand = summary(build(loads(set_key(text, "features.shape.points[2]", "radius", value))))
        assert variant.ok is by_hand["ok"]
        assert variant.outputs["mass.total_g"] == pytest.approx(by_hand["mass"]["total_g"], rel=1e-12)
        assert variant.outputs["mass.izz_g_mm2"] == pytest.approx(by_hand["mass"]["izz_g_mm2"], rel=1e-12)
    masses = [v.outputs["mass.half_g"] for v in result.variants]
    assert masses == sorted(masses, reverse=True)  # a larger edge radius takes metal off the rim
    assert main(["sweep", str(SKETCHED), "--vary", "shape.points[40].radius=1mm:3mm:3"]) == 2
