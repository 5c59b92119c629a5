"""Atomic, safe output: a killed build leaves the previous drawing intact, and names stay in the output folder.

The reference for "atomic" is POSIX rename(2) as used by os.replace: the name
points at the old file or the new one, never at a half-written one.
"""
from __future__ import annotations

import os
import signal
import stat
import subprocess
import sys
import time
from pathlib import Path

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from yodraft.cli import main
from yodraft.errors import DesignInputError
from yodraft.output import output_path, prepare_directory, safe_stem, write_atomic

ROOT = Path(__file__).resolve().parents[1]
TEMPLATE = ROOT / "templates" / "string-trick.toml"
OLD = b"previous drawing\n" * 1000
SIZE = 16 * 1024 * 1024  # large enough that a write takes a while

# The child writes through write_atomic. "halfway": the file object writes half the data,
# says so and hangs (a slow disk); "replace": the data is complete and the child hangs just
# before the rename; "loop": it rewrites the file forever with two alternating contents.
CHILD = r"""
import os, sys, time
from pathlib import Path
from yodraft.output import write_atomic

path, mode, size = Path(sys.argv[1]), sys.argv[2], int(sys.argv[3])
versions = [b"A" * size, b"B" * size]
if mode == "halfway":
    real_fdopen = os.fdopen

    class Hanging:
        def __init__(self, handle): self.handle = handle
        def __enter__(self): return self
        def __exit__(self, *exc): self.handle.close()
        def write(self, data):
            self.handle.write(data[: len(data) // 2]); self.handle.flush()
            print("half", flush=True); time.sleep(120)
        def flush(self): self.handle.flush()
        def fileno(self): return self.handle.fileno()

    os.fdopen = lambda fd, mode: Hanging(real_fdopen(fd, mode))
elif mode == "replace":
    real_replace = os.replace

    def hanging_replace(src, dst):
        print("replace", flush=True); time.sleep(120)

    os.replace = hanging_replace
print("start", flush=True)
i = 0
while True:
    write_atomic(path, versions[i % 2])
    i += 1
    if mode != "loop":
        break
"""


def run_child(target: Path, mode: str, wait_for: str, delay: float = 0.0) -> None:
    env = dict(os.environ, PYTHONPATH=str(ROOT / "profile"))
    child = subprocess.Popen([sys.executable, "-c", CHILD, str(target), mode, str(SIZE)], stdout=subprocess.PIPE,
                             env=env, text=True)
    try:
        assert child.stdout is not None
        while True:
            line = child.stdout.readline()
            assert line, "the child ended before it was killed"
            if line.strip() == wait_for:
                break
        time.sleep(delay)
    finally:
        child.send_signal(signal.SIGKILL)
        child.wait(timeout=30)
    assert child.returncode == -signal.SIGKILL


@pytest.mark.parametrize("mode, wait_for", [("halfway", "half"), ("replace", "replace")])
def test_a_killed_write_leaves_the_previous_file(tmp_path: Path, mode: str, wait_for: str) -> None:
    target = tmp_path / "larchmere-ls56-A.dxf"
    target.write_bytes(OLD)
    run_child(target, mode, wait_for)
    assert target.read_bytes() == OLD
    # the half-written temporary file is hidden and never under the final name
    others = [p.name for p in tmp_path.iterdir() if p != target]
    assert all(name.startswith(".larchmere-ls56-A.dxf.") and name.endswith(".part") for name in others), others
    if mode == "halfway":
        assert others, "the child should have been killed mid-write"


@pytest.mark.parametrize("delay", [0.0, 0.05, 0.2, 0.45])
def test_killing_a_rewrite_loop_never_leaves_a_partial_file(tmp_path: Path, delay: float) -> None:
    target = tmp_path / "larchmere-ls56-A.dxf"
    target.write_bytes(OLD)
    run_child(target, "loop", "start", delay)
    data = target.read_bytes()
    assert data == OLD or data in (b"A" * SIZE, b"B" * SIZE), f"partial file of {len(data)} bytes"


def test_write_atomic_replaces_and_leaves_no_temporary(tmp_path: Path) -> None:
    target = tmp_path / "a.dxf"
    write_atomic(target, b"one")
    write_atomic(target, b"two")
    assert target.read_bytes() == b"two"
    assert [p.name for p in tmp_path.iterdir()] == ["a.dxf"]


def test_written_files_are_readable_like_any_other_file(tmp_path: Path) -> None:
    # POSIX open(2): a new file gets 0666 less the umask; mkstemp's private 0600 must not leak out
    old = os.umask(0o022)
    try:
        write_atomic(tmp_path / "new.dxf", b"x")
        kept = tmp_path / "kept.dxf"
        kept.write_bytes(b"old")
        kept.chmod(0o640)
        write_atomic(kept, b"new")
    finally:
        os.umask(old)
    assert stat.S_IMODE((tmp_path / "new.dxf").stat().st_mode) == 0o644
    assert stat.S_IMODE(kept.stat().st_mode) == 0o640


def test_an_output_name_taken_by_a_folder_is_one_line_and_keeps_the_folder(tmp_path: Path,
                                                                            capsys: pytest.CaptureFixture[str]) -> None:
    out = tmp_path / "out"
    (out / "larchmere-ls56-A.dxf").mkdir(parents=True)
    code = main(["build", str(TEMPLATE), "-o", str(out), "--force"])
    err = capsys.readouterr().err
    assert code == 2 and len(err.splitlines()) == 1 and "larchmere-ls56-A.dxf" in err, err
    assert (out / "larchmere-ls56-A.dxf").is_dir()
    assert [p.name for p in out.iterdir()] == ["larchmere-ls56-A.dxf"]


def test_a_symlink_under_the_output_name_is_replaced_not_followed(tmp_path: Path) -> None:
    outside = tmp_path / "outside.dxf"
    outside.write_bytes(OLD)
    out = tmp_path / "out"
    out.mkdir()
    (out / "larchmere-ls56-A.dxf").symlink_to(outside)
    assert main(["build", str(TEMPLATE), "-o", str(out), "--force"]) == 0
    assert outside.read_bytes() == OLD, "the build wrote through a link to outside the output folder"
    written = out / "larchmere-ls56-A.dxf"
    assert not written.is_symlink() and written.read_bytes().startswith(b"  0\nSECTION")


def test_prepare_directory_refuses_what_cannot_hold_files(tmp_path: Path) -> None:
    (tmp_path / "file").write_bytes(b"x")
    for bad in (tmp_path / "file", tmp_path / "file" / "sub", Path("/proc/yodraft-test")):
        with pytest.raises(DesignInputError):
            prepare_directory(bad)
    assert prepare_directory(tmp_path / "new" / "deeper").is_dir()


# ------------------------------------------------------------------ names stay inside the output folder

@settings(max_examples=300, deadline=None)
@given(st.text(max_size=300), st.text(max_size=20))
def test_any_name_gives_a_plain_file_name_inside_the_folder(name: str, revision: str) -> None:
    stem = safe_stem(name, revision)
    assert stem and stem not in (".", "..") and stem[0] not in ".-"
    assert all(c.isascii() and (c.isalnum() or c in "._-") for c in stem), stem
    assert len(f"{stem}.sheet.dxf".encode()) <= 255  # NAME_MAX on common file systems
    folder = Path("/tmp/yodraft-out")
    assert output_path(folder, f"{stem}.dxf").parent == folder.resolve()


@pytest.mark.parametrize("name, revision", [("x" * 300, "A"), ("ø" * 200, "B" * 300), ("-rf", "A"), ("", ""),
                                            ("...", "..."), ("-", "-")])
def test_long_or_odd_names_still_make_a_writable_file(name: str, revision: str, tmp_path: Path) -> None:
    stem = safe_stem(name, revision)
    assert stem[0] not in ".-"
    write_atomic(output_path(tmp_path, f"{stem}.sheet.dxf"), b"x")
    assert [p.name for p in tmp_path.iterdir()] == [f"{stem}.sheet.dxf"]


@pytest.mark.parametrize("bad", ["../x.dxf", "a/b.dxf", "/etc/passwd", "..", ".", "", "a/../../b"])
def test_output_path_refuses_names_that_leave_the_folder(bad: str, tmp_path: Path) -> None:
    with pytest.raises(ValueError):
        output_path(tmp_path, bad)


@pytest.mark.parametrize("name", ["../../etc/larchmere", "a/b", "a\\b", "..", "x\x00y", "larch\\Pmere", "{\\fArial;x}"])
def test_a_design_name_with_path_parts_never_escapes(name: str) -> None:
    stem = safe_stem(name, "A")
    assert "/" not in stem and "\\" not in stem and "\x00" not in stem and not stem.startswith(".")


def test_a_write_that_fails_on_one_file_changes_none(tmp_path: Path) -> None:
    # regression: files were renamed one by one, so a folder standing under the preview's name left the
    # sheet already replaced; now every file is staged first and none is renamed unless all were staged
    from yodraft.cli import main as cli_main

    template = Path(__file__).resolve().parents[1] / "templates" / "string-trick.toml"
    out = tmp_path / "out"
    assert cli_main(["build", str(template), "-o", str(out)]) == 0
    sheet = out / "larchmere-ls56-A.dxf"
    sheet.write_bytes(b"old sheet")
    (out / "larchmere-ls56-A.svg").unlink()
    (out / "larchmere-ls56-A.svg").mkdir()
    assert cli_main(["build", str(template), "-o", str(out), "--force"]) == 2
    assert sheet.read_bytes() == b"old sheet"
    assert not [p for p in out.iterdir() if p.name.endswith(".part")]
