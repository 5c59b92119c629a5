"""The commands end to end: exit codes, the JSON contract, the DXF and nothing written on error."""
from __future__ import annotations

import json
from pathlib import Path

import ezdxf
import pytest
from ezdxf import recover

from conftest import TEMPLATES
from yodraft.cli import main

REQUIRED = """ok design.name design.revision envelope.diameter_mm envelope.width_mm profile.outer_diameter_mm
profile.width_mm profile.gap_mm profile.post_length_mm bearing.bore_mm bearing.od_mm bearing.width_mm
bearing.bore_deviation_um bearing.od_deviation_um bearing_seat.post_diameter_mm bearing_seat.post_tolerance_mm
bearing_seat.wall_bore_mm bearing_seat.clearance_min_mm bearing_seat.clearance_max_mm material.name
material.density_g_cm3 mass.half_g mass.half_izz_g_mm2 mass.total_g mass.izz_g_mm2 mass.ixx_g_mm2 checks""".split()


def run(capsys: pytest.CaptureFixture[str], *argv: str) -> tuple[int, str, str]:
    code = main(list(argv))
    out, err = capsys.readouterr()
    return code, out, err


def test_check_json_contract(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "check", str(TEMPLATES / "string-trick.toml"), "--json")
    assert code == 0
    data = json.loads(out)
    for key in REQUIRED:
        node = data
        for part in key.split("."):
            node = node[part]
    assert data["ok"] is True
    assert {"name", "feature", "parameter", "ok", "message"} <= set(data["checks"][0])
    assert len(data["bearing"]["bore_deviation_um"]) == 2


def test_check_text_shows_fit_table(capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "check", str(TEMPLATES / "string-trick.toml"))
    assert code == 0 and "bearing seat fit" in out and "post" in out and "RSS" in out


def test_failing_design_exits_1_and_names_checks(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    text = (TEMPLATES / "string-trick.toml").read_text().replace('wall_offset = "0.2 mm"', 'wall_offset = "-0.1 mm"')
    design = tmp_path / "bad.toml"
    design.write_text(text)
    out_dir = tmp_path / "out"
    code, _, err = run(capsys, "build", str(design), "-o", str(out_dir))
    assert code == 1
    assert "bearing_seat.wall_offset" in err
    assert not out_dir.exists() or not any(out_dir.iterdir())


def test_check_ends_with_the_failed_lines_the_readme_shows(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    # the README's exit-code paragraph: "FAILED bearing_seat.wall_offset: gap below bearing width: ..." on stdout
    text = (TEMPLATES / "string-trick.toml").read_text().replace('wall_offset = "0.2 mm"', 'wall_offset = "-3 mm"')
    design = tmp_path / "bad.toml"
    design.write_text(text)
    code, out, err = run(capsys, "check", str(design))
    assert code == 1
    tail = out.rstrip().rpartition("\n\n")[2].splitlines()  # the last block of lines
    assert f"{len(tail)} check(s) failed" in err and all(line.startswith("FAILED ") for line in tail)
    assert any(line.startswith("FAILED bearing_seat.wall_offset: gap below bearing width: ") for line in tail)
    passing = run(capsys, "check", str(TEMPLATES / "string-trick.toml"))[1]
    assert "FAILED" not in passing


def test_bad_input_exits_2_with_one_line(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    design = tmp_path / "bad.toml"
    design.write_text('[design]\nname = "x"\n[envelope]\ndiameter = 56\nwidth = "44 mm"\n')
    code, out, err = run(capsys, "build", str(design), "-o", str(tmp_path / "out"))
    assert code == 2 and out == ""
    assert len(err.strip().splitlines()) == 1 and "envelope.diameter" in err
    assert not (tmp_path / "out").exists()


def test_missing_file_exits_2(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    code, _, err = run(capsys, "check", str(tmp_path / "nope.toml"))
    assert code == 2 and "no such file" in err


def test_build_writes_a_clean_dxf_inside_the_envelope(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    code, out, _ = run(capsys, "build", str(TEMPLATES / "string-trick.toml"), "-o", str(tmp_path))
    assert code == 0
    dxf = tmp_path / "larchmere-ls56-A.dxf"
    assert dxf.exists()
    doc, auditor = recover.readfile(dxf)
    assert not auditor.has_errors
    assert doc.header["$INSUNITS"] == ezdxf.units.MM
    outlines = [e for e in doc.modelspace() if e.dxf.layer == "outline" and e.dxftype() == "LWPOLYLINE"]
    assert outlines and all(e.closed for e in outlines)
    for e in outlines:
        for point in ezdxf.path.make_path(e).flattening(0.001):
            assert -1e-9 <= point.x <= 22.0 + 1e-9 and abs(point.y) <= 28.0 + 1e-9  # the template's envelope


@pytest.mark.parametrize(("code", "hole", "shaft", "clearance"), [
    ("6 H7/g6", (12, 0), (-4, -12), (4, 24)),      # ISO 286-2, 3–6 mm step
    ("12 H7/h6", (18, 0), (0, -11), (0, 29)),      # ISO 286-2, 10–18 mm step
])
def test_fit_json(capsys: pytest.CaptureFixture[str], code: str, hole, shaft, clearance) -> None:
    rc, out, _ = run(capsys, "fit", code, "--json")
    data = json.loads(out)
    assert rc == 0
    assert (data["hole"]["upper_um"], data["hole"]["lower_um"]) == pytest.approx(hole)
    assert (data["shaft"]["upper_um"], data["shaft"]["lower_um"]) == pytest.approx(shaft)
    assert (data["clearance_min_um"], data["clearance_max_um"]) == pytest.approx(clearance)


@pytest.mark.parametrize("code", ["6 Q7/g6", "200 H7/g6", "6 H19"])
def test_bad_fit_codes(capsys: pytest.CaptureFixture[str], code: str) -> None:
    rc, out, err = run(capsys, "fit", code)
    assert rc == 2 and out == "" and len(err.strip().splitlines()) == 1


def test_version_and_help(capsys: pytest.CaptureFixture[str]) -> None:
    with pytest.raises(SystemExit) as info:
        main(["--version"])
    assert info.value.code == 0 and "yodraft" in capsys.readouterr().out
    with pytest.raises(SystemExit) as info:
        main(["--help"])
    assert info.value.code == 0


def test_precision_class_and_coating_move_the_seat(tmp_path: Path) -> None:
    import yodraft
    from yodraft.tomledit import set_key

    text = (TEMPLATES / "string-trick.toml").read_text()
    base = yodraft.build(yodraft.loads(text))
    looser = yodraft.build(yodraft.loads(set_key(text, "bearing", "precision", "ABEC 1")))
    # a Normal-class bore can be 8 µm under size instead of 4 µm (ISO 492): the post must shrink by 4 µm
    assert base["bearing_seat.post_diameter"] - looser["bearing_seat.post_diameter"] == pytest.approx(0.004, abs=1e-9)
    thicker = yodraft.build(yodraft.loads(set_key(text, "shop", "coating_thickness_max", "0.0014 in")))
    # the largest finished post keeps the clearance; the pre-coat size shrinks by the extra growth at the thick end,
    # 0.0004 in (2 × 0.0004 in × half outward; common practice, no published source)
    def largest(r: yodraft.Resolved) -> float:
        return r["bearing_seat.post_diameter"] + r["bearing_seat.post_tolerance"]
    assert largest(thicker) == pytest.approx(largest(base), abs=1e-12)
    assert base["bearing_seat.post_precoat_diameter"] - thicker["bearing_seat.post_precoat_diameter"] == pytest.approx(
        0.0004 * 25.4, abs=1e-9)


@pytest.mark.parametrize("argv", [["--version"], ["fit", "6 H7/g6"], ["keys"], ["templates"], ["check", "{template}"]])
def test_quick_commands_load_only_what_they_need(argv: list[str]) -> None:
    """`check` of a design in common units loads neither ezdxf nor pint; `fit`, `keys`, `templates` and
    `--version` load neither numpy nor shapely."""
    import subprocess
    import sys

    from conftest import TEMPLATES

    args = [a.replace("{template}", str(TEMPLATES / "string-trick.toml")) for a in argv]
    probe = ("import sys\nfrom yodraft.cli import main\ntry:\n    main(sys.argv[1:])\nexcept SystemExit:\n    pass\n"
             "print(' '.join(m for m in ('ezdxf', 'numpy', 'shapely', 'pint') if m in sys.modules), file=sys.stderr)\n")
    run = subprocess.run([sys.executable, "-c", probe, *args], capture_output=True, text=True, timeout=120)
    loaded = set(run.stderr.strip().splitlines()[-1].split()) if run.stderr.strip() else set()
    assert not loaded & {"ezdxf", "pint"}, loaded
    if argv[0] != "check":
        assert not loaded & {"numpy", "shapely"}, loaded
