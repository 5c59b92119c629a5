"""yodraft diff: changed inputs, then every downstream value with old, new and delta."""
from __future__ import annotations

import json
import math
from pathlib import Path

import pytest

from conftest import TEMPLATES, set_in
from yodraft import build, loads
from yodraft.cli import main
from yodraft.diff import diff, flatten, unit_of


def _files(tmp_path: Path, a: str, b: str) -> tuple[Path, Path]:
    pa, pb = tmp_path / "a.toml", tmp_path / "b.toml"
    pa.write_text(a, encoding="utf-8")
    pb.write_text(b, encoding="utf-8")
    return pa, pb


def test_deeper_pad_groove_changes_mass_not_gap(tmp_path: Path, string_trick_text: str,
                                                capsys: pytest.CaptureFixture[str]) -> None:
    deeper = set_in(string_trick_text, "features.pad_groove", "depth", "2 mm")
    pa, pb = _files(tmp_path, string_trick_text, deeper)
    assert main(["diff", str(pa), str(pb), "--json"]) == 0
    data = json.loads(capsys.readouterr().out)
    inputs = {c["key"]: c for c in data["inputs"]}
    assert list(inputs) == ["features.pad_groove.depth"]
    assert inputs["features.pad_groove.depth"]["new"] == "2 mm"
    derived = {c["key"]: c for c in data["derived"]}
    assert "profile.gap_mm" not in derived and "bearing_seat.post_diameter_mm" not in derived
    for key in ("mass.half_g", "mass.total_g", "mass.izz_g_mm2", "features.pad_groove.dimensions.depth_mm"):
        assert key in derived
    assert derived["mass.half_g"]["unit"] == "g" and derived["mass.izz_g_mm2"]["unit"] == "g·mm²"
    # a flat-bottomed annular groove cut deeper by Δd removes ρ·π(ro² − ri²)·Δd (volume of an annulus)
    old = build(loads(string_trick_text))
    dims = old.features["pad_groove"].dims
    ro, ri = dims["outer_diameter"] / 2, dims["inner_diameter"] / 2
    delta_d = 2.0 - dims["depth"]
    removed_g = old["material.density_g_cm3"] * math.pi * (ro**2 - ri**2) * delta_d / 1000
    assert derived["mass.half_g"]["delta"] == pytest.approx(-removed_g, rel=1e-6)
    assert derived["mass.half_g"]["delta"] == pytest.approx(derived["mass.half_g"]["new"] - derived["mass.half_g"]["old"])
    # the 1.5 mm pad now sits 0.5 mm below the wall face, deeper than the 0.2 mm allowed
    assert [(c["name"], c["old_ok"], c["new_ok"]) for c in data["checks"]] == [("pad not sunk below the wall face", True, False)]


def test_text_diff_reads_for_a_designer(tmp_path: Path, string_trick_text: str,
                                        capsys: pytest.CaptureFixture[str]) -> None:
    pa, pb = _files(tmp_path, string_trick_text, set_in(string_trick_text, "features.rim", "band_width", "7 mm"))
    assert main(["diff", str(pa), str(pb)]) == 0
    out = capsys.readouterr().out
    assert "features.rim.band_width: 8 mm → 7 mm" in out
    assert "features.rim.dimensions.band_width_mm: 8 mm → 7 mm  (-1 mm)" in out


def test_same_design_no_differences(capsys: pytest.CaptureFixture[str]) -> None:
    path = str(TEMPLATES / "string-trick.toml")
    assert main(["diff", path, path]) == 0
    assert "no differences" in capsys.readouterr().out


def test_unit_rewrite_is_not_a_change(string_trick_text: str) -> None:
    a = build(loads(string_trick_text))
    b = build(loads(set_in(string_trick_text, "features.rim", "band_width", "0.8 cm")))
    assert diff(a, b).same  # 0.8 cm is 8 mm; float noise sits inside the tolerance


def test_check_outcome_changes_are_listed(string_trick_text: str) -> None:
    a = build(loads(string_trick_text))
    b = build(loads(set_in(string_trick_text, "features.rim", "thickness", "1 mm")))
    d = diff(a, b)
    assert not b.ok
    changed = {(c.name, c.feature, c.parameter): (c.old, c.new) for c in d.checks}
    assert {(c.name, c.feature, c.parameter) for c in b.failed} <= set(changed)
    failed = {(c.name, c.feature, c.parameter) for c in b.failed}
    assert all(changed[k][0] in (True, None) and changed[k][1] is False for k in failed)


def test_two_templates(capsys: pytest.CaptureFixture[str]) -> None:
    assert main(["diff", str(TEMPLATES / "string-trick.toml"), str(TEMPLATES / "wide-heavy.toml"), "--json"]) == 0
    data = json.loads(capsys.readouterr().out)
    derived = {c["key"]: c for c in data["derived"]}
    assert derived["envelope.diameter_mm"]["old"] == 56.0 and derived["envelope.diameter_mm"]["new"] == 60.0
    assert derived["envelope.diameter_mm"]["delta"] == pytest.approx(4.0)


def test_missing_file_exit_2(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    assert main(["diff", str(TEMPLATES / "string-trick.toml"), str(tmp_path / "nope.toml")]) == 2
    assert "no such file" in capsys.readouterr().err


def test_flatten_and_units() -> None:
    flat = flatten({"mass": {"budget": [{"part": "half", "each_g": 31.0}], "izz_g_mm2": 1.0}, "checks": [{"name": "x"}]})
    assert flat == {"mass.budget[half].each_g": 31.0, "mass.izz_g_mm2": 1.0, "checks": [{"name": "x"}]}
    assert [unit_of(k) for k in ("a.gap_mm", "a.dev_um[0]", "a.angle_deg", "a.rim_share", "a.spin_down_s")] == \
        ["mm", "µm", "°", "", "s"]
