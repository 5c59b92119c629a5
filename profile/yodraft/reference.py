"""The design-file reference: every section and key with what it takes, its default and what it means."""
from __future__ import annotations

from collections.abc import Iterator

from .design import REQUIRED, REVISION_SPECS, SECTIONS
from .features import FEATURES
from .params import DISPLAY_UNITS, ParamSpec

__all__ = ["reference_rows", "reference_markdown"]



def _default(spec: ParamSpec, table: str) -> str:
    if spec.default is None:
        if spec.name in REQUIRED.get(table, ()) or table == "[revisions]" and spec.name in ("letter", "date"):
            return "required"
        return "derived" if table.startswith("features.") else "optional"
    if spec.kind in DISPLAY_UNITS and spec.kind != "number":
        div, unit, _ = DISPLAY_UNITS[spec.kind]
        return f'"{spec.default / div:.6g} {unit}"'
    if spec.kind == "bool":
        return "true" if spec.default else "false"
    if spec.kind == "text":
        return f'"{spec.default}"'
    return f"{spec.default:g}"


def reference_rows() -> Iterator[tuple[str, str, str, str, str]]:
    """(table, key, expected, default, meaning) for every key a design file may hold."""
    for section, specs in SECTIONS.items():
        for s in specs:
            yield section, s.name, s.expected(), _default(s, section), s.doc
    for s in REVISION_SPECS:
        yield "[revisions]", s.name, s.expected(), _default(s, "[revisions]"), s.doc
    for name, module in FEATURES.items():
        for s in module.PARAMS:
            yield f"features.{name}", s.name, s.expected(), _default(s, f"features.{name}"), s.doc


def reference_markdown() -> str:
    """The reference as Markdown tables, one per table of the design file."""
    out: list[str] = []
    current = None
    for table, key, expected, default, doc in reference_rows():
        if table != current:
            out += ["", f"`[{table}]`" if not table.startswith("[") else f"`[{table}]` (array of tables)", "",
                    "| key | takes | default | meaning |", "| --- | --- | --- | --- |"]
            current = table
        out.append(f"| `{key}` | {expected.replace('|', '/')} | {default} | {doc} |")
    return "\n".join(out).strip() + "\n"
