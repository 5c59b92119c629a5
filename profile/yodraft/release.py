"""Issuing a drawing: check the design, render its files, guard the revision, write them all as one step."""
from __future__ import annotations

from pathlib import Path
from typing import TYPE_CHECKING

from . import revision
from .output import clean_stale_parts, directory_lock, output_path, prepare_directory, safe_stem, write_files

if TYPE_CHECKING:  # pragma: no cover
    from .builder import Resolved

__all__ = ["build_outputs"]


def build_outputs(design_path: Path, directory: Path, force: bool = False) -> tuple[list[Path], "Resolved"]:
    """Load, resolve and check a design; when every check passes, write its drawings into ``directory``.

    Every file is rendered in memory first, then all are written as one atomic step under the folder's
    lock, so a failed check, a bad input, a failed write or a second build at the same time leaves the
    folder consistent. A drawing of the same revision that shows another part is not overwritten unless
    ``force`` (see yodraft.revision).
    """
    from .builder import build
    from .design import load
    from .drawing.drawing import render_files
    from .pictures.assembly import assembly_svg

    resolved = build(load(design_path))
    if not resolved.ok:
        return [], resolved
    stem = safe_stem(resolved.design.name, resolved.design.revision)
    files = render_files(resolved, stem)
    files[f"{stem}-assembly.svg"] = assembly_svg(resolved)
    directory = prepare_directory(directory)
    with directory_lock(directory):
        files.update(revision.guard(directory, stem, resolved, force))
        targets = {output_path(directory, name): data for name, data in files.items()}
        clean_stale_parts(list(targets))
        write_files(targets)
    return list(targets), resolved
