"""yodraft templates / new: every starter design listed with its first comment line; new never overwrites."""
from __future__ import annotations

import tomllib
from pathlib import Path

import pytest

from conftest import TEMPLATES
from yodraft.cli import main
from yodraft.templates import list_templates, template_dir


def _first_comment(path: Path) -> str:
    # the stated convention of templates/: the first line is "# <description>"
    first = path.read_text(encoding="utf-8").splitlines()[0]
    assert first.startswith("#")
    return first[1:].strip()


def test_template_dir_is_the_repository_folder() -> None:
    assert template_dir() == TEMPLATES


def test_a_regular_install_finds_the_copies_under_its_prefix(tmp_path: Path, monkeypatch: pytest.MonkeyPatch) -> None:
    # no checkout beside the package: the templates come from <prefix>/share/yodraft/templates
    import sys

    import yodraft.templates as templates

    installed = tmp_path / "share" / "yodraft" / "templates"
    installed.mkdir(parents=True)
    (installed / "string-trick.toml").write_bytes((TEMPLATES / "string-trick.toml").read_bytes())
    monkeypatch.setattr(templates, "__file__", str(tmp_path / "site" / "yodraft" / "templates.py"))
    monkeypatch.setattr(sys, "prefix", str(tmp_path))
    assert template_dir() == installed
    assert [t.name for t in list_templates()] == ["string-trick"]
    monkeypatch.setattr(sys, "prefix", str(tmp_path / "elsewhere"))
    assert template_dir() is None


def test_pyproject_installs_every_template() -> None:
    # the data-files entry of pyproject.toml is what puts the templates under the prefix
    data = tomllib.loads((TEMPLATES.parent / "pyproject.toml").read_text(encoding="utf-8"))
    assert data["tool"]["setuptools"]["data-files"] == {"share/yodraft/templates": ["templates/*.toml"]}


def test_templates_lists_every_file_with_its_description(capsys: pytest.CaptureFixture[str]) -> None:
    assert main(["templates"]) == 0
    out = capsys.readouterr().out.splitlines()
    files = sorted(TEMPLATES.glob("*.toml"))
    assert len(out) == len(files) >= 3
    for line, path in zip(out, files):
        name, description = line.split(None, 1)
        assert name == path.stem
        assert description == _first_comment(path)
    assert [t.name for t in list_templates()] == [p.stem for p in files]


def test_new_writes_a_design_that_checks(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    target = tmp_path / "mine.toml"
    assert main(["new", str(target), "--template", "string-trick", "--name", "my-ls56", "--date", "2027-01-05",
                 "--creator", "C. Turner"]) == 0
    data = tomllib.loads(target.read_text(encoding="utf-8"))
    source = tomllib.loads((TEMPLATES / "string-trick.toml").read_text(encoding="utf-8"))
    assert data["design"]["name"] == "my-ls56"
    # nothing personal of the demo company comes along: blank unless given, the date as asked
    assert (data["design"]["owner"], data["design"]["identification"], data["design"]["approver"]) == ("", "", "")
    assert data["design"]["creator"] == "C. Turner" and data["design"]["date"] == "2027-01-05"
    assert data["revisions"] == [{"letter": source["design"]["revision"], "date": "2027-01-05", "note": "First issue"}]
    for key in ("name", "owner", "identification", "creator", "approver", "date"):
        data["design"][key] = source["design"][key]
    data["revisions"] = source["revisions"]
    assert data == source  # the design itself is the template's
    capsys.readouterr()
    assert main(["check", str(target)]) == 0


def test_new_takes_its_own_title(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    target = tmp_path / "mine.toml"
    assert main(["new", str(target), "-t", "string-trick", "--name", "my-ls56", "--title", "My first {half}"]) == 0
    assert tomllib.loads(target.read_text(encoding="utf-8"))["design"]["title"] == "My first {half}"
    capsys.readouterr()
    assert main(["build", str(target), "-o", str(tmp_path / "out")]) == 0
    sheet = (tmp_path / "out" / "my-ls56-A.dxf").read_text(encoding="utf-8")
    assert "\nMy first {half}\n" in sheet  # the title block's text


def test_new_dates_today_by_default(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    import datetime

    target = tmp_path / "mine.toml"
    assert main(["new", str(target), "-t", "string-trick"]) == 0
    assert tomllib.loads(target.read_text(encoding="utf-8"))["design"]["date"] == datetime.date.today().isoformat()


def test_new_refuses_to_overwrite(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    target = tmp_path / "mine.toml"
    target.write_text("# my own notes\n", encoding="utf-8")
    assert main(["new", str(target), "-t", "string-trick"]) == 2
    err = capsys.readouterr().err
    assert "already exists" in err and len(err.strip().splitlines()) == 1
    assert target.read_text(encoding="utf-8") == "# my own notes\n"


@pytest.mark.parametrize("argv, words", [
    (["-t", "no-such-template"], "no template"),
    (["-t", "string-trick", "--name", "../bad name"], "cannot name a file"),
])
def test_new_bad_arguments_exit_2(tmp_path: Path, capsys: pytest.CaptureFixture[str], argv: list[str], words: str) -> None:
    target = tmp_path / "x.toml"
    assert main(["new", str(target), *argv]) == 2
    err = capsys.readouterr().err.strip()
    assert words in err and len(err.splitlines()) == 1
    assert not target.exists()
