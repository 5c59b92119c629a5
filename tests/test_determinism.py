"""Determinism: the same design gives the same bytes in every process, whatever the hash seed, clock or folder.

A machinist compares drawings by checksum; a file that changes with the time of
writing, a random GUID or the order of a set cannot be compared. The reference is
byte equality of independent runs.
"""
from __future__ import annotations

import hashlib
import os
import re
import subprocess
import sys
from pathlib import Path

import ezdxf.recover
import pytest

ROOT = Path(__file__).resolve().parents[1]
TEMPLATES = sorted((ROOT / "templates").glob("*.toml"))

# builds every starter design into argv[1] through the real command line, one process per run
CHILD = r"""
import os, sys
from pathlib import Path
from yodraft.cli import main
out = Path(sys.argv[1])
for design in sys.argv[2:]:
    code = main(["build", design, "-o", str(out / Path(design).stem)])
    assert code in (0, 1), code
"""


def build_all(out: Path, cwd: Path, **env: str) -> dict[str, str]:
    """{relative path: sha256} of every file the starter designs produce in a fresh process."""
    full = dict(os.environ, PYTHONPATH=str(ROOT / "profile"), **env)
    done = subprocess.run([sys.executable, "-c", CHILD, str(out), *map(str, TEMPLATES)], env=full, cwd=cwd,
                          capture_output=True, text=True, timeout=300)
    assert done.returncode == 0, done.stderr
    return {str(p.relative_to(out)): hashlib.sha256(p.read_bytes()).hexdigest()
            for p in sorted(out.rglob("*")) if p.is_file()}


RUNS = {
    "seed 0": dict(PYTHONHASHSEED="0", TZ="UTC"),
    "seed 0, other clock and locale": dict(PYTHONHASHSEED="0", TZ="Pacific/Chatham", LC_ALL="C",
                                           SOURCE_DATE_EPOCH="0"),
    "seed 4242": dict(PYTHONHASHSEED="4242", TZ="Asia/Kolkata"),
}


@pytest.fixture(scope="module")
def runs(tmp_path_factory: pytest.TempPathFactory) -> dict[str, tuple[Path, dict[str, str]]]:
    out = {}
    for label, env in RUNS.items():
        base = tmp_path_factory.mktemp("run")
        cwd = base / "elsewhere"
        cwd.mkdir()
        out[label] = (base / "out", build_all(base / "out", cwd, **env))
    return out


def test_builds_in_separate_processes_are_byte_identical(runs: dict[str, tuple[Path, dict[str, str]]]) -> None:
    first = runs["seed 0"][1]
    assert any(name.endswith(".dxf") for name in first) and any(name.endswith(".svg") for name in first)
    assert runs["seed 0, other clock and locale"][1] == first


def test_builds_with_another_hash_seed_are_byte_identical(runs: dict[str, tuple[Path, dict[str, str]]]) -> None:
    assert runs["seed 4242"][1] == runs["seed 0"][1]


def test_no_clock_host_or_folder_leaks_into_the_files(runs: dict[str, tuple[Path, dict[str, str]]]) -> None:
    import datetime
    import socket

    today = datetime.date.today()
    stamps = {today.isoformat(), today.strftime("%Y%m%d"), socket.gethostname()}
    out = runs["seed 0"][0]
    for path in sorted(out.rglob("*")):
        if not path.is_file():
            continue
        data = path.read_bytes()
        if path.suffix == ".pdf":  # compressed streams are binary (chance letter pairs); search the rest
            data = re.sub(rb"stream\r?\n.*?endstream", b"", data, flags=re.S)
        text = data.decode("utf-8", "replace")
        for stamp in stamps:
            assert stamp not in text, f"{path.name} contains {stamp!r}"
        assert str(out) not in text and str(out.parent) not in text, f"{path.name} names the build folder"


def test_every_drawing_re_reads_with_no_audit_errors(runs: dict[str, tuple[Path, dict[str, str]]]) -> None:
    # ezdxf's recover mode and auditor are the outside judge of a well-formed DXF
    dxfs = sorted(runs["seed 0"][0].rglob("*.dxf"))
    assert dxfs
    for path in dxfs:
        doc, auditor = ezdxf.recover.readfile(path)
        assert not auditor.has_errors, (path.name, [e.message for e in auditor.errors])
        header = doc.header
        assert re.fullmatch(r"\{[0-9A-F-]{36}\}", header["$FINGERPRINTGUID"])


def test_in_process_and_subprocess_builds_agree(runs: dict[str, tuple[Path, dict[str, str]]], tmp_path: Path) -> None:
    from yodraft.cli import main

    design = next(p for p in TEMPLATES if p.stem == "string-trick")
    assert main(["build", str(design), "-o", str(tmp_path)]) == 0
    here = {p.name: hashlib.sha256(p.read_bytes()).hexdigest() for p in tmp_path.iterdir()}
    seeded = "seed 0" if os.environ.get("PYTHONHASHSEED") == "0" else None
    there = {Path(k).name: v for k, v in runs["seed 0"][1].items() if k.startswith("string-trick/")}
    if seeded is None:  # this process has its own hash seed: compare what does not depend on it
        here = {k: v for k, v in here.items() if not k.endswith(".dxf")}
        there = {k: v for k, v in there.items() if not k.endswith(".dxf")}
    assert here == there
