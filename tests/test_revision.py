"""Revision safety: a build of the same revision with other geometry is refused unless forced."""
from __future__ import annotations

import json
from pathlib import Path

import pytest

from conftest import TEMPLATES, set_in
from yodraft import build, loads
from yodraft.cli import main
from yodraft.revision import geometry_fingerprint, inputs_fingerprint

STEM = "larchmere-ls56-A"


@pytest.fixture()
def design(tmp_path: Path, string_trick_text: str) -> Path:
    path = tmp_path / "ls56.toml"
    path.write_text(string_trick_text, encoding="utf-8")
    return path


def _build(capsys: pytest.CaptureFixture[str], design: Path, out: Path, *extra: str) -> tuple[int, str]:
    code = main(["build", str(design), "-o", str(out), *extra])
    return code, capsys.readouterr().err


def test_first_build_writes_a_record(design: Path, tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    out = tmp_path / "out"
    assert _build(capsys, design, out)[0] == 0
    record = json.loads((out / f"{STEM}.build.json").read_text(encoding="utf-8"))
    resolved = build(loads(design.read_text(encoding="utf-8")))
    assert record["geometry_sha256"] == geometry_fingerprint(resolved)
    assert record["inputs_sha256"] == inputs_fingerprint(resolved)
    assert record["revision"] == "A"
    assert record["revisions"] == [{"letter": "A", "date": "2026-11-20", "note": "First issue for prototype"}]


def test_rebuild_of_same_geometry_is_allowed(design: Path, tmp_path: Path, capsys: pytest.CaptureFixture[str],
                                             string_trick_text: str) -> None:
    out = tmp_path / "out"
    assert _build(capsys, design, out)[0] == 0
    # a new title and target mass change the title block and report, not the part
    text = set_in(set_in(string_trick_text, "design", "title", "LS-56, retitled"), "envelope", "target_mass", "70 g")
    design.write_text(text, encoding="utf-8")
    assert _build(capsys, design, out)[0] == 0


def test_changed_geometry_same_revision_is_refused(design: Path, tmp_path: Path, capsys: pytest.CaptureFixture[str],
                                                   string_trick_text: str) -> None:
    out = tmp_path / "out"
    assert _build(capsys, design, out)[0] == 0
    before = {p.name: p.read_bytes() for p in out.iterdir()}
    design.write_text(set_in(string_trick_text, "features.rim", "band_width", "7 mm"), encoding="utf-8")
    code, err = _build(capsys, design, out)
    assert code == 1
    assert len(err.strip().splitlines()) == 1
    assert "bump design.revision" in err and "--force" in err
    assert {p.name: p.read_bytes() for p in out.iterdir()} == before  # nothing touched
    assert _build(capsys, design, out, "--force")[0] == 0
    assert (out / f"{STEM}.dxf").read_bytes() != before[f"{STEM}.dxf"]


def test_bumped_revision_builds_beside_the_old_one(design: Path, tmp_path: Path, capsys: pytest.CaptureFixture[str],
                                                   string_trick_text: str) -> None:
    out = tmp_path / "out"
    assert _build(capsys, design, out)[0] == 0
    text = set_in(set_in(string_trick_text, "features.rim", "band_width", "7 mm"), "design", "revision", "B")
    design.write_text(text, encoding="utf-8")
    assert _build(capsys, design, out)[0] == 0
    assert (out / f"{STEM}.dxf").exists() and (out / "larchmere-ls56-B.dxf").exists()


def test_drawing_without_record_is_refused(design: Path, tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    out = tmp_path / "out"
    assert _build(capsys, design, out)[0] == 0
    (out / f"{STEM}.build.json").unlink()
    code, err = _build(capsys, design, out)
    assert code == 1 and "no build record" in err


def test_fingerprint_ignores_wording_and_units(string_trick_text: str) -> None:
    a = build(loads(string_trick_text))
    # 8 mm written as 0.8 cm: same part (pint converts; float noise is below the 1e-6 mm rounding)
    b = build(loads(set_in(string_trick_text, "features.rim", "band_width", "0.8 cm")))
    c = build(loads(set_in(string_trick_text, "features.rim", "band_width", "8.001 mm")))
    assert geometry_fingerprint(a) == geometry_fingerprint(b)
    assert geometry_fingerprint(a) != geometry_fingerprint(c)
    assert inputs_fingerprint(a) != inputs_fingerprint(b)


def test_every_template_fingerprints(tmp_path: Path) -> None:
    prints = {geometry_fingerprint(build(loads(p.read_text(encoding="utf-8")))) for p in TEMPLATES.glob("*.toml")}
    assert len(prints) == len(list(TEMPLATES.glob("*.toml")))  # different parts, different prints


@pytest.mark.parametrize(("table", "key", "value"), [
    ("design", "material", "7075-T6"),          # the title block's material and the mass
    ("shop", "seat_roughness", "0.4 um"),       # the seat's Ra note
    ("shop", "break_edges", "0.3 mm"),          # the ISO 13715 edge note
    ("analysis", "balance_grade", 2.5),         # the runout tolerance on the sheet (ISO 21940-11)
])
def test_a_changed_note_or_material_needs_a_new_revision(design: Path, tmp_path: Path, capsys: pytest.CaptureFixture[str],
                                                       string_trick_text: str, table: str, key: str,
                                                       value: object) -> None:
    from yodraft.tomledit import set_key

    out = tmp_path / "out"
    assert _build(capsys, design, out)[0] == 0
    before = {p.name: p.read_bytes() for p in out.iterdir()}
    design.write_text(set_key(string_trick_text, table, key, value), encoding="utf-8")
    code, err = _build(capsys, design, out)
    assert code == 1 and "bump design.revision" in err
    assert {p.name: p.read_bytes() for p in out.iterdir()} == before


def test_a_pipe_planted_as_the_record_does_not_hang_the_guard(design: Path, tmp_path: Path,
                                                              capsys: pytest.CaptureFixture[str]) -> None:
    import os

    out = tmp_path / "out"
    assert _build(capsys, design, out)[0] == 0
    (out / f"{STEM}.build.json").unlink()
    os.mkfifo(out / f"{STEM}.build.json")
    code, err = _build(capsys, design, out)
    assert code == 1 and "no build record" in err


def test_concurrent_builds_leave_a_drawing_and_record_of_one_build(tmp_path: Path, string_trick_text: str) -> None:
    """Two processes build different geometry under one name and revision into one folder: one wins, the other
    is refused, and the record on disk always describes the drawing on disk."""
    import hashlib
    import subprocess
    import sys

    out = tmp_path / "out"
    designs = []
    for i, width in enumerate(("7 mm", "9 mm")):
        path = tmp_path / f"d{i}.toml"
        path.write_text(set_in(string_trick_text, "features.rim", "band_width", width), encoding="utf-8")
        designs.append(path)
    runs = [subprocess.Popen([sys.executable, "-m", "yodraft", "build", str(p), "-o", str(out)],
                             stdout=subprocess.DEVNULL, stderr=subprocess.PIPE) for p in designs]
    codes = sorted(r.wait(timeout=120) for r in runs)
    assert codes == [0, 1]
    record = json.loads((out / f"{STEM}.build.json").read_text(encoding="utf-8"))
    winners = [p for p in designs
               if geometry_fingerprint(build(loads(p.read_text(encoding="utf-8")))) == record["geometry_sha256"]]
    assert len(winners) == 1
    fresh = tmp_path / "fresh"
    assert subprocess.run([sys.executable, "-m", "yodraft", "build", str(winners[0]), "-o", str(fresh)],
                          capture_output=True).returncode == 0
    digest = lambda p: hashlib.sha256(p.read_bytes()).hexdigest()  # noqa: E731
    assert digest(out / f"{STEM}.dxf") == digest(fresh / f"{STEM}.dxf")


def test_stale_part_files_of_a_killed_build_are_cleaned(design: Path, tmp_path: Path,
                                                       capsys: pytest.CaptureFixture[str]) -> None:
    out = tmp_path / "out"
    out.mkdir()
    stale = out / f".{STEM}.dxf.x1y2z3.part"
    stale.write_bytes(b"half a drawing")
    other = out / ".notes.txt.abc.part"  # not ours to clean
    other.write_bytes(b"x")
    assert _build(capsys, design, out)[0] == 0
    assert not stale.exists() and other.exists()
