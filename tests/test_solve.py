"""solve: move one parameter until the design hits a target mass, Izz or gap; the new revision is a new file."""
from __future__ import annotations

import re
from pathlib import Path

import pytest

import yodraft
from conftest import TEMPLATES
from yodraft.analysis import analyse
from yodraft.cli import main
from yodraft.solve import solve


def test_solve_reaches_66_g_and_passes(tmp_path: Path) -> None:
    design = yodraft.load(TEMPLATES / "string-trick.toml")
    result = solve(design, "mass", 66.0, "features.rim.thickness")
    assert result.resolved.ok
    assert analyse(result.resolved).assembly.total_g == pytest.approx(66.0, abs=0.01)


def test_solve_command_writes_a_new_file_that_checks(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    source = tmp_path / "st.toml"
    source.write_text((TEMPLATES / "string-trick.toml").read_text())
    before = source.read_bytes()
    assert main(["solve", str(source), "--target", "mass=66g", "--vary", "features.rim.band_width"]) == 0
    assert source.read_bytes() == before
    solved = tmp_path / "st-B.toml"
    design = yodraft.load(solved)
    assert design.revision == "B" and design.revisions[-1].letter == "B"
    resolved = yodraft.build(design)
    assert resolved.ok and analyse(resolved).assembly.total_g == pytest.approx(66.0, abs=0.01)
    # a second solve would overwrite the first: refused
    capsys.readouterr()
    assert main(["solve", str(source), "--target", "mass=66g", "--vary", "features.rim.band_width"]) == 2


def test_solve_of_a_key_under_its_earlier_name_rewrites_that_line(tmp_path: Path) -> None:
    """A file giving the rim band as `width` (its earlier name) is solved into `band_width` on the same line."""
    source = tmp_path / "st.toml"
    source.write_text((TEMPLATES / "string-trick.toml").read_text().replace('band_width = "8 mm"', 'width = "8 mm"'))
    assert main(["solve", str(source), "--target", "mass=66g", "--vary", "features.rim.width"]) == 0
    text = (tmp_path / "st-B.toml").read_text()
    rim = text.split("[features.rim]", 1)[1].split("\n[", 1)[0]
    assert rim.count("band_width = ") == 1 and "\nwidth = " not in rim
    assert yodraft.build(yodraft.load(tmp_path / "st-B.toml")).ok


def test_solve_out_of_reach_names_closest(capsys: pytest.CaptureFixture[str], tmp_path: Path) -> None:
    source = tmp_path / "st.toml"
    source.write_text((TEMPLATES / "string-trick.toml").read_text())
    assert main(["solve", str(source), "--target", "mass=500g", "--vary", "features.rim.thickness"]) == 1
    err = capsys.readouterr().err
    assert "closest" in err
    # the sizes it names are read by a designer: to 4 decimals of a mm, not a search's 12 digits
    sizes = re.findall(r"(\d+(?:\.\d+)?) mm", err)
    assert sizes and all(len(x.partition(".")[2]) <= 4 for x in sizes), err
    assert not (tmp_path / "st-B.toml").exists()


def test_solve_gap() -> None:
    design = yodraft.load(TEMPLATES / "string-trick.toml")
    result = solve(design, "gap", 4.0, "features.bearing_seat.wall_offset")
    # gap = bearing width − 2 × offset → offset = (4.7625 − 4.0) / 2  # common practice, no published source
    assert result.value == pytest.approx((4.7625 - 4.0) / 2, abs=1e-5)


def test_solve_to_a_design_that_breaks_a_check_writes_nothing(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    source = tmp_path / "st.toml"
    source.write_text((TEMPLATES / "string-trick.toml").read_text())
    # a 5 mm gap is wider than the 4.7625 mm bearing: the wall offset goes negative  # common practice
    code = main(["solve", str(source), "--target", "gap=5mm", "--vary", "features.bearing_seat.wall_offset"])
    out, err = capsys.readouterr()
    assert code == 1
    assert len(err.strip().splitlines()) == 1 and "bearing_seat.wall_offset" in err
    assert "FAILED bearing_seat.wall_offset" in out
    assert not (tmp_path / "st-B.toml").exists()


def test_solve_never_lands_finer_than_the_file_holds(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    # gap 4.7617 mm asks for a 0.0004 mm wall offset (gap = bearing width − 2 × offset, size C 4.7625 mm;
    # common practice, no published source): finer than a design file holds, so nothing is written
    source = tmp_path / "st.toml"
    source.write_text((TEMPLATES / "string-trick.toml").read_text())
    code = main(["solve", str(source), "--target", "gap=4.7617mm", "--vary", "features.bearing_seat.wall_offset"])
    _, err = capsys.readouterr()
    assert code == 1 and len(err.strip().splitlines()) == 1 and "bearing_seat.wall_offset" in err
    assert sorted(p.name for p in tmp_path.iterdir()) == ["st.toml"]


def test_solve_by_a_sketch_point_writes_that_point_back(tmp_path: Path) -> None:
    """A sketch point's size solved for mass lands in that point's own [[features.shape.points]] table."""
    from yodraft.design import with_values

    source = tmp_path / "sk.toml"
    source.write_text((TEMPLATES / "sketched.toml").read_text())
    design = yodraft.load(source)
    key = "features.shape.points[1].arc_radius"
    goal = analyse(yodraft.build(with_values(design, [(key, 40.0)]))).assembly.total_g  # reached at 40 mm
    assert main(["solve", str(source), "--target", f"mass={goal:.4f}g", "--vary", key, "--date", "2026-12-04"]) == 0
    solved = yodraft.load(tmp_path / "sk-B.toml")
    points, before = solved.features["shape"]["points"], design.features["shape"]["points"]
    assert points[1]["arc_radius"] == pytest.approx(40.0, abs=0.01)
    assert [p for k, p in enumerate(points) if k != 1] == [p for k, p in enumerate(before) if k != 1]
    assert analyse(yodraft.build(solved)).assembly.total_g == pytest.approx(goal, abs=0.01)


def test_solve_by_a_point_the_design_lacks_is_bad_input(capsys: pytest.CaptureFixture[str]) -> None:
    code = main(["solve", str(TEMPLATES / "sketched.toml"), "--target", "mass=66g",
                 "--vary", "features.shape.points[40].arc_radius"])
    err = capsys.readouterr().err.strip()
    assert code == 2 and len(err.splitlines()) == 1 and "features.shape.points[40]" in err
