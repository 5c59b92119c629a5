"""The README documents what the tool does: the generated reference and every JSON key."""
from __future__ import annotations

import re

import yodraft
from conftest import ROOT, TEMPLATES
from yodraft.reference import reference_markdown

README = (ROOT / "README.md").read_text(encoding="utf-8")


def test_reference_is_current() -> None:
    assert reference_markdown() in README


def _leaf_keys(node: object, prefix: str = "") -> set[str]:
    if isinstance(node, dict):
        out: set[str] = set()
        for key, value in node.items():
            out |= _leaf_keys(value, f"{prefix}.{key}" if prefix else key)
        return out
    return {prefix}


def test_every_json_key_is_documented() -> None:
    data = yodraft.summary(yodraft.build(yodraft.load(TEMPLATES / "string-trick.toml")))
    data.pop("features")  # documented as features.<feature>.dimensions
    documented = set(re.findall(r"`\.?([a-z_0-9.]+)(?:\[\])?[`(]", README))
    for key in _leaf_keys(data):
        section, _, leaf = key.rpartition(".")
        assert leaf in documented or key in documented, key


def test_two_setup_commands_come_first() -> None:
    blocks = re.findall(r"```\n(.*?)```", README, re.S)
    assert "build templates/" in blocks[0] and "pytest" in blocks[1]
    assert (ROOT / ".ci" / "run").read_text().count(blocks[1].strip()) == 1
