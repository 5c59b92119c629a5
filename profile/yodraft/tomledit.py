"""Small, comment-keeping edits to design-file text: set one key, bump the revision, add a history line."""
from __future__ import annotations

import json
import re
from typing import Any

__all__ = ["set_key", "bump_revision", "add_revision", "drop_revisions"]


def _value(value: Any) -> str:
    return "true" if value is True else "false" if value is False else json.dumps(value, ensure_ascii=False)


def _table_span(lines: list[str], table: str) -> tuple[int, int] | None:
    """The lines of ``[table]`` (header, end), or of the n-th ``[[array]]`` table for ``array[n]``; None if absent."""
    item = re.match(r"^(.+)\[(\d+)\]$", table)
    if item:
        header = re.compile(rf"^\s*\[\[\s*{re.escape(item.group(1))}\s*\]\]\s*(#.*)?$")
        place = int(item.group(2))
    else:
        header, place = re.compile(rf"^\s*\[\s*{re.escape(table)}\s*\]\s*(#.*)?$"), 0
    for i, line in enumerate(lines):
        if header.match(line):
            if place:
                place -= 1
                continue
            end = next((j for j in range(i + 1, len(lines)) if lines[j].lstrip().startswith("[")), len(lines))
            return i, end
    return None


def set_key(text: str, table: str, key: str, value: Any, comment: str = "", former: str = "") -> str:
    """``text`` with ``key`` in ``[table]`` set to ``value`` (added, with the table, if missing); a line that
    gives the key under its earlier name ``former`` is the one replaced. ``table`` may name the n-th table of an
    array, ``features.shape.points[1]``, which must be written as ``[[features.shape.points]]`` tables (KeyError
    if it is not there).

    >>> print(set_key('[design]\\nname = "a"  # x\\n', "design", "name", "b"))
    [design]
    name = "b"
    <BLANKLINE>
    >>> print(set_key('[[p]]\\nr = "1 mm"\\n\\n[[p]]\\nr = "2 mm"\\n', "p[1]", "r", "3 mm"), end="")
    [[p]]
    r = "1 mm"
    <BLANKLINE>
    [[p]]
    r = "3 mm"
    """
    lines = text.splitlines()
    new = f"{key} = {_value(value)}" + (f"  # {comment}" if comment else "")
    span = _table_span(lines, table)
    if span is None and table.endswith("]"):
        raise KeyError(table)
    if span is None:
        lines += ["", f"[{table}]", new]
    else:
        start, end = span
        names = "|".join(re.escape(k) for k in (key, former) if k)
        pattern = re.compile(rf"^\s*(?:{names})\s*=")
        hit = next((j for j in range(start + 1, end) if pattern.match(lines[j])), None)
        if hit is None:
            lines.insert(start + 1, new)
        else:
            lines[hit] = new
    return "\n".join(lines) + "\n"


def bump_revision(revision: str) -> str:
    """The next revision mark: A → B, Z → AA, 3 → 4, anything else gets a "1" more.

    >>> bump_revision("A"), bump_revision("Z"), bump_revision("9"), bump_revision("B2")
    ('B', 'AA', '10', 'B3')
    """
    if revision.isdigit():
        return str(int(revision) + 1)
    if revision.isalpha() and revision.isupper():
        chars = list(revision)
        i = len(chars) - 1
        while i >= 0 and chars[i] == "Z":
            chars[i] = "A"
            i -= 1
        if i < 0:
            return "A" + "".join(chars)
        chars[i] = chr(ord(chars[i]) + 1)
        return "".join(chars)
    match = re.match(r"^(.*?)(\d+)$", revision)
    if match:
        return match.group(1) + str(int(match.group(2)) + 1)
    return (revision + "1")[:8]


def add_revision(text: str, letter: str, date: str, note: str) -> str:
    """``text`` with a ``[[revisions]]`` line appended to the history."""
    return text.rstrip("\n") + (f"\n\n[[revisions]]\nletter = {_value(letter)}\ndate = {_value(date)}\n"
                                f"note = {_value(note)}\n")


def drop_revisions(text: str) -> str:
    r"""``text`` without its ``[[revisions]]`` history (each table up to the next table header).

    >>> drop_revisions('[design]\nname = "a"\n\n[[revisions]]\nletter = "A"\n\n[envelope]\n')
    '[design]\nname = "a"\n\n[envelope]\n'
    """
    out: list[str] = []
    skipping = False
    for line in text.splitlines():
        stripped = line.strip()
        if stripped.startswith("["):
            skipping = re.match(r"^\[\[\s*revisions\s*\]\]", stripped) is not None
        if not skipping:
            out.append(line)
    cleaned = "\n".join(out) + "\n"
    return re.sub(r"\n{3,}", "\n\n", cleaned)
