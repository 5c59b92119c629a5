"""yodraft watch: rebuild on save, keep the last good outputs when a check fails (bounded waits)."""
from __future__ import annotations

import os
import queue
import subprocess
import sys
import threading
import time
from pathlib import Path

import pytest

from conftest import ROOT, set_in
from yodraft.watch import watch

DXF = "larchmere-ls56-A.dxf"


def _save(path: Path, text: str) -> None:
    path.write_text(text, encoding="utf-8")
    os.utime(path, None)


def test_generator_rebuilds_and_keeps_last_good(tmp_path: Path, string_trick_text: str) -> None:
    design, out = tmp_path / "ls56.toml", tmp_path / "out"
    _save(design, string_trick_text)
    events = watch(design, out, interval=0.02, timeout=20)
    first = next(events)
    assert first.kind == "built" and (out / DXF).exists()
    good = (out / DXF).read_bytes()

    _save(design, set_in(string_trick_text, "features.rim", "thickness", "1 mm"))
    failed = next(events)
    assert failed.kind == "failed" and failed.failed
    assert (out / DXF).read_bytes() == good  # last good outputs kept
    assert [c.key for c in failed.changes.inputs] == ["features.rim.thickness"]
    assert any(c.key == "mass.total_g" for c in failed.changes.derived)

    _save(design, set_in(string_trick_text, "features.rim", "band_width", "7 mm"))
    rebuilt = next(events)
    # geometry changed under revision A, but the drawing was this session's own: rewritten
    assert rebuilt.kind == "built" and (out / DXF).read_bytes() != good
    assert [c.key for c in rebuilt.changes.inputs] == ["features.rim.band_width"]


def test_drawing_from_before_the_session_is_protected(tmp_path: Path, string_trick_text: str) -> None:
    design, out = tmp_path / "ls56.toml", tmp_path / "out"
    _save(design, string_trick_text)
    assert next(watch(design, out, timeout=5)).kind == "built"
    issued = (out / DXF).read_bytes()
    _save(design, set_in(string_trick_text, "features.rim", "band_width", "7 mm"))
    event = next(watch(design, out, timeout=5))  # a new session
    assert event.kind == "error" and "bump design.revision" in event.message
    assert (out / DXF).read_bytes() == issued


def test_bad_input_is_reported_and_watching_goes_on(tmp_path: Path, string_trick_text: str) -> None:
    design, out = tmp_path / "ls56.toml", tmp_path / "out"
    _save(design, "[design\nname = ")
    events = watch(design, out, interval=0.02, timeout=20)
    assert next(events).kind == "error"
    _save(design, string_trick_text)
    assert next(events).kind == "built"


def test_stops_at_timeout(tmp_path: Path, string_trick_text: str) -> None:
    design, out = tmp_path / "ls56.toml", tmp_path / "out"
    _save(design, string_trick_text)
    start = time.monotonic()
    assert [e.kind for e in watch(design, out, interval=0.02, timeout=0.3)] == ["built"]
    assert time.monotonic() - start < 10  # bounded, not a speed claim


def _wait_for(lines: "queue.Queue[str]", seen: list[str], words: str, timeout: float = 30) -> None:
    deadline = time.monotonic() + timeout
    while time.monotonic() < deadline:
        try:
            line = lines.get(timeout=0.1)
        except queue.Empty:
            continue
        seen.append(line)
        if words in line:
            return
    pytest.fail(f"no line with {words!r} within {timeout} s; got {seen}")


def test_cli_watch_end_to_end(tmp_path: Path, string_trick_text: str) -> None:
    design, out = tmp_path / "ls56.toml", tmp_path / "out"
    _save(design, string_trick_text)
    env = dict(os.environ, PYTHONPATH=str(ROOT / "profile"))
    proc = subprocess.Popen([sys.executable, "-m", "yodraft", "watch", str(design), "-o", str(out),
                             "--interval", "0.05", "--max-builds", "3", "--timeout", "60"],
                            stdout=subprocess.PIPE, stderr=subprocess.STDOUT, text=True, env=env)
    lines: queue.Queue[str] = queue.Queue()
    threading.Thread(target=lambda: [lines.put(l) for l in proc.stdout], daemon=True).start()
    seen: list[str] = []
    try:
        _wait_for(lines, seen, "built:")
        good = (out / DXF).read_bytes()
        _save(design, set_in(string_trick_text, "features.rim", "thickness", "1 mm"))
        _wait_for(lines, seen, "check failed; last good outputs kept")
        _wait_for(lines, seen, "changed since the last good build")
        _wait_for(lines, seen, "features.rim.thickness")
        assert (out / DXF).read_bytes() == good
        _save(design, set_in(string_trick_text, "features.rim", "band_width", "7 mm"))
        _wait_for(lines, seen, "built:")
        assert proc.wait(timeout=30) == 0  # stopped by --max-builds 3
    finally:
        if proc.poll() is None:
            proc.kill()
            proc.wait()
    assert any("FAILED" in line for line in seen)
    assert (out / DXF).read_bytes() != good
