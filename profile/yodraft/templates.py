"""Starter designs: list them and write a new design file from one.

The templates are the ``*.toml`` files of the project's ``templates/`` folder,
beside the ``profile/`` source root (an editable install, as the README sets
up, finds them there; a regular install copies them under the environment's
``share/yodraft/templates``). Each template's first comment line is its one-line description.
"""
from __future__ import annotations

import datetime
import os
import sys
from collections.abc import Mapping
from dataclasses import dataclass
from pathlib import Path

from .errors import DesignInputError

__all__ = ["Template", "template_dir", "list_templates", "find_template", "new_design", "INSTALLED_TEMPLATES"]

#: where a regular (not editable) install puts the templates, below the environment's prefix
INSTALLED_TEMPLATES = Path("share") / "yodraft" / "templates"


@dataclass(frozen=True)
class Template:
    """One starter design: its name (the file stem), file and one-line description."""

    name: str
    path: Path
    description: str


def template_dir() -> Path | None:
    """The folder holding the starter designs, or None when none can be found.

    The project's ``templates/`` beside ``profile/`` (a checkout or an editable
    install), else the copy a regular install puts under ``<prefix>/share/yodraft/templates``.
    """
    for folder in (Path(__file__).resolve().parents[2] / "templates", Path(sys.prefix) / INSTALLED_TEMPLATES):
        if folder.is_dir():
            return folder
    return None


def _description(text: str) -> str:
    for line in text.splitlines():
        stripped = line.strip()
        if stripped.startswith("#"):
            return stripped.lstrip("#").strip()
        if stripped:
            break
    return ""


def list_templates(folder: Path | None = None) -> list[Template]:
    """Every starter design, sorted by name."""
    folder = template_dir() if folder is None else folder
    if folder is None:
        return []
    return [Template(p.stem, p, _description(p.read_text(encoding="utf-8"))) for p in sorted(folder.glob("*.toml"))]


def find_template(name: str, folder: Path | None = None) -> Template:
    """The template called ``name`` (with or without ``.toml``); DesignInputError naming the choices if none."""
    stem = name[:-5] if name.endswith(".toml") else name
    templates = list_templates(folder)
    for t in templates:
        if t.name == stem:
            return t
    names = ", ".join(t.name for t in templates) or "none found"
    raise DesignInputError("new", "--template", f"no template {name!r}", f"one of {names}")


#: the title-block fields a new design gets blank unless given: who owns, drew and approved it, and its number
PERSONAL = ("owner", "creator", "approver", "identification")


def new_design(path: Path, template: str, name: str | None = None, folder: Path | None = None, *,
               date: str | None = None, people: Mapping[str, str] | None = None, title: str | None = None) -> Path:
    """Write a new design file at ``path`` from a template, refusing to overwrite anything.

    ``name`` replaces the template's ``design.name`` (so output files do not clash), ``title`` its title. Nothing
    personal of the demo company is copied: owner, creator, approver and identification are blank
    unless ``people`` gives them, the date of issue is ``date`` (default today) and the revision
    history starts afresh with one entry for the template's revision on that date.
    The result is read back before it is written, so a bad value is reported, not saved.
    """
    from .design import NAME_PATTERN, loads
    from .tomledit import add_revision, drop_revisions, set_key

    path = Path(path)
    text = find_template(template, folder).path.read_text(encoding="utf-8")
    if name is not None and not NAME_PATTERN.match(name):
        raise DesignInputError("new", "--name", f"{name[:40]!r} cannot name a file",
                               "letters, digits, '.', '_' or '-', starting with a letter or digit")
    date = date if date is not None else datetime.date.today().isoformat()
    revision = loads(text, str(path)).revision
    if name is not None:
        text = set_key(text, "design", "name", name)
    if title is not None:
        text = set_key(text, "design", "title", title)
    for key in PERSONAL:
        text = set_key(text, "design", key, (people or {}).get(key) or "")
    text = set_key(text, "design", "date", date)
    text = add_revision(drop_revisions(text), revision, date, "First issue")
    design = loads(text, str(path))  # a bad --date, --owner … is reported here, naming its key
    if name is not None and design.name != name:
        raise DesignInputError(str(path), "design.name", "the template's first name line is not design.name", "")
    _write_new(path, text)
    return path


def _write_new(path: Path, text: str) -> None:
    """Write ``text`` to a file that must not exist yet; a failed write leaves no file behind."""
    from .output import write_files

    if path.exists() or path.is_symlink():
        raise DesignInputError(str(path), "", "already exists; not overwritten", "a new file name")
    try:
        fd = os.open(path, os.O_WRONLY | os.O_CREAT | os.O_EXCL, 0o666)  # claim the name: no race with another `new`
    except FileExistsError:
        raise DesignInputError(str(path), "", "already exists; not overwritten", "a new file name") from None
    except OSError as exc:
        raise DesignInputError(str(path), "", f"cannot be written ({exc.strerror})", "a writable path") from None
    os.close(fd)
    try:
        write_files({path: text.encode("utf-8")})  # staged and renamed over the claimed empty file
    except BaseException:
        os.unlink(path)  # a full disk must not leave an empty file that blocks the retry
        raise
