"""Shared fixtures: the templates and a helper to write a design file with one change."""
from __future__ import annotations

from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[1]
TEMPLATES = ROOT / "templates"


@pytest.fixture()
def string_trick_text() -> str:
    return (TEMPLATES / "string-trick.toml").read_text(encoding="utf-8")


def set_in(text: str, table: str, key: str, value: str) -> str:
    """The design text with ``key = value`` (value written as given) set in ``[table]``."""
    from yodraft.tomledit import set_key

    return set_key(text, table, key, value)
