"""Watch a design file: rebuild its outputs each time it is saved.

The file is polled (size, mtime and a content hash; no extra dependency). When a
check fails nothing is written, so the last good outputs stay; the event lists
the failing checks and what changed since the last good build. Outputs that this
watch session wrote itself may be rewritten under the same revision; a drawing
that was on disk before the session is protected by the revision guard as in
``yodraft build``.
"""
from __future__ import annotations

import hashlib
import time
from collections.abc import Callable, Iterator
from dataclasses import dataclass
from pathlib import Path
from typing import TYPE_CHECKING

from .errors import YodraftError

if TYPE_CHECKING:  # pragma: no cover
    from .builder import Resolved
    from .diff import DesignDiff

__all__ = ["WatchEvent", "watch"]


@dataclass(frozen=True)
class WatchEvent:
    """One rebuild: ``kind`` is "built", "failed" (a check failed) or "error" (bad input, refused overwrite)."""

    kind: str
    written: tuple[Path, ...] = ()
    failed: tuple[str, ...] = ()
    message: str = ""
    changes: "DesignDiff | None" = None


def _digest(path: Path) -> str | None:
    try:
        return hashlib.sha256(path.read_bytes()).hexdigest()
    except OSError:
        return None  # mid-save or moved away: try again next poll


def watch(design_path: Path, out_dir: Path, *, interval: float = 0.25, max_builds: int | None = None,
          timeout: float | None = None, force: bool = False,
          sleep: Callable[[float], None] = time.sleep) -> Iterator[WatchEvent]:
    """Build now, then again after every save; yields one WatchEvent per build.

    Stops after ``max_builds`` builds or ``timeout`` seconds (None: never).
    """
    from . import revision
    from .diff import diff
    from .output import safe_stem
    from .release import build_outputs

    design_path, out_dir = Path(design_path), Path(out_dir)
    deadline = None if timeout is None else time.monotonic() + timeout
    builds = 0
    seen: str | None = None
    last_good: Resolved | None = None
    session_fingerprints: set[str] = set()
    while True:
        digest = _digest(design_path)
        if digest is not None and digest != seen:
            seen = digest
            builds += 1
            event, resolved = _build_once(design_path, out_dir, force, session_fingerprints, build_outputs,
                                          revision, safe_stem)
            if resolved is not None and event.kind == "failed" and last_good is not None:
                event = WatchEvent(event.kind, event.written, event.failed, event.message, diff(last_good, resolved))
            if event.kind == "built":
                if last_good is not None:
                    event = WatchEvent(event.kind, event.written, (), event.message, diff(last_good, resolved))
                last_good = resolved
            yield event
            if max_builds is not None and builds >= max_builds:
                return
        if deadline is not None and time.monotonic() >= deadline:
            return
        sleep(interval)


def _build_once(design_path, out_dir, force, session, build_outputs, revision, safe_stem):
    """One build; outputs whose record this session wrote count as its own and may be replaced."""
    from .design import load

    try:
        design = load(design_path)
        stem = safe_stem(design.name, design.revision)
        rec = revision.read_record(out_dir, stem)
        own = rec is not None and rec.get("part_sha256") in session
        written, resolved = build_outputs(design_path, out_dir, force=force or own)
    except YodraftError as exc:
        return WatchEvent("error", message=str(exc)), None
    if not resolved.ok:
        failed = tuple(f"{c.name} [{c.feature}.{c.parameter}]: {c.message}" for c in resolved.failed)
        return WatchEvent("failed", failed=failed), resolved
    session.add(revision.part_fingerprint(resolved))
    return WatchEvent("built", written=tuple(written)), resolved
