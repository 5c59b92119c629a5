"""Escaping user text for MTEXT, so a name with a backslash or brace prints as typed."""
from __future__ import annotations

__all__ = ["escape"]


def escape(text: str) -> str:
    r"""``text`` with MTEXT's control characters escaped and line breaks as paragraph breaks.

    >>> escape(r"a\b {c}")
    'a\\\\b \\{c\\}'
    >>> escape("two\nlines")
    'two\\Plines'
    >>> escape("g/cm^3")
    'g/cm^ 3'
    """
    out = text.replace("\\", "\\\\").replace("{", "\\{").replace("}", "\\}")
    out = out.replace("^", "^ ")  # "^J" would be a caret-coded control character; "^ " is a literal caret
    out = out.replace("\r\n", "\n").replace("\r", "\n")
    return out.replace("\n", "\\P")
