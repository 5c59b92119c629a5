"""yodraft report: Markdown that reads on its own and JSON that follows the check --json contract."""
from __future__ import annotations

import json
import re
from pathlib import Path

import pytest

from conftest import TEMPLATES, set_in
from yodraft.cli import main


@pytest.mark.parametrize("template", sorted(p.stem for p in TEMPLATES.glob("*.toml")))
def test_json_report_is_the_summary_plus_history(template: str, capsys: pytest.CaptureFixture[str]) -> None:
    path = str(TEMPLATES / f"{template}.toml")
    assert main(["check", path, "--json"]) == 0
    summary = json.loads(capsys.readouterr().out)
    assert main(["report", path, "--format", "json"]) == 0
    report = json.loads(capsys.readouterr().out)
    for key, value in summary.items():
        assert report[key] == value
    assert {"revisions", "inputs", "cautions"} <= set(report)
    assert report["revisions"] and all({"letter", "date", "note"} == set(r) for r in report["revisions"])
    assert report["inputs"]["design.name"] == summary["design"]["name"]


def test_markdown_report_sections(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    target = tmp_path / "ls56.md"
    assert main(["report", str(TEMPLATES / "string-trick.toml"), "-o", str(target)]) == 0
    text = target.read_text(encoding="utf-8")
    for heading in ("## Revisions", "## Inputs (as written)", "## Fit table", "## Resolved dimensions",
                    "## Mass budget", "## Spin metrics", "## Balance", "## Checks", "## Cautions"):
        assert heading in text
    assert "| A | 2026-11-20 | First issue for prototype |" in text
    assert "| features.rim.band_width | 8 mm |" in text
    # worst-case clearance of the post in the bearing bore, as a designer would add it up by hand:
    # smallest bore (nominal + lower deviation) minus largest post (nominal + tolerance)
    assert main(["check", str(TEMPLATES / "string-trick.toml"), "--json"]) == 0
    s = json.loads(capsys.readouterr().out)
    clearance = (s["bearing"]["bore_mm"] + s["bearing"]["bore_deviation_um"][1] / 1000
                 - s["bearing_seat"]["post_diameter_mm"] - s["bearing_seat"]["post_tolerance_mm"])
    assert f"{clearance * 1000:.1f} µm" in text
    assert f"| total_g | {s['mass']['total_g']:.6g} g |" in text
    assert "seat not masked" in text  # the template anodizes without masking the seat


def test_failed_check_report_exit_1_and_lists_it(tmp_path: Path, string_trick_text: str,
                                                 capsys: pytest.CaptureFixture[str]) -> None:
    path = tmp_path / "thin.toml"
    path.write_text(set_in(string_trick_text, "features.rim", "thickness", "1 mm"), encoding="utf-8")
    assert main(["report", str(path)]) == 1
    out = capsys.readouterr().out
    assert "**FAIL**" in out and "NOT ready" in out and "check failed:" in out


def test_report_to_missing_folder_exit_2(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    assert main(["report", str(TEMPLATES / "string-trick.toml"), "-o", str(tmp_path / "no" / "r.md")]) == 2
    assert "does not exist" in capsys.readouterr().err


@pytest.mark.parametrize(("thread", "major_mm"), [
    ("M4x0.7", 4.0),  # ISO 261: M4 coarse, d = 4 mm
    ("10-32 UNF", 0.190 * 25.4),  # ASME B1.1 (from memory): No. 10, 0.190 in major diameter; ISO 31-1: 1 in = 25.4 mm
])
def test_axle_major_diameter_is_a_length_whatever_the_thread(thread: str, major_mm: float, tmp_path: Path,
                                                             string_trick_text: str,
                                                             capsys: pytest.CaptureFixture[str]) -> None:
    """A metric thread's whole-number major diameter is named with its unit like an inch thread's, in the JSON, the
    report and the terminal."""
    path = tmp_path / "thread.toml"
    path.write_text(set_in(string_trick_text, "features.axle_bore", "thread", thread), encoding="utf-8")
    assert main(["check", str(path), "--json"]) == 0
    dims = json.loads(capsys.readouterr().out)["features"]["axle_bore"]["dimensions"]
    assert "major_diameter" not in dims
    assert dims["major_diameter_mm"] == pytest.approx(major_mm, abs=1e-6)
    assert main(["report", str(path)]) == 0
    assert f"| major_diameter_mm | {major_mm:.6g} mm |" in capsys.readouterr().out
    assert main(["check", str(path)]) == 0
    assert re.search(rf"major_diameter +{major_mm:.4f} mm\n", capsys.readouterr().out)


def test_a_design_of_name_and_envelope_alone_reads_without_python_words(tmp_path: Path,
                                                                       capsys: pytest.CaptureFixture[str]) -> None:
    """Everything else taken from its defaults: a value left for a later feature to settle (the rim band, which
    the catch zone gives) reads as "—" in the terminal, as in the report, never as Python's None."""
    path = tmp_path / "minimal.toml"
    path.write_text('[design]\nname = "minimal"\n\n[envelope]\ndiameter = "56 mm"\nwidth = "44 mm"\n', encoding="utf-8")
    assert main(["check", str(path)]) == 0
    text = capsys.readouterr().out
    assert re.search(r"band_width +—\n", text) and "None" not in text
    assert main(["report", str(path)]) == 0
    assert "None" not in capsys.readouterr().out
