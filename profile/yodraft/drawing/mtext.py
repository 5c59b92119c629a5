"""Escaping user text for MTEXT, so a name with a backslash or brace prints as typed."""
from __future__ import annotations

__all__ = ["escape"]


def escape(text: str) -> str:
    r"""``text`` with MTEXT's control characters escaped and line breaks as paragraph breaks.

    >>> escape(r"a\b {c}")
    'a\\\\b \\{c\\}'
    >>> escape("two\nlines")
    'two\\Plines'
    """
    out = text.replace("\\", "\\\\").replace("{", "\\{").replace("}", "\\}")
    out = out.replace("\r\n", "\n").replace("\r", "\n")
    return out.replace("\n", "\\P")
