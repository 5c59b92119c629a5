"""What changed between two designs: the inputs, then every derived value and check that followed.

Works on the ``check --json`` summary, flattened to dotted keys, so every key a
later module adds to the summary (mass, spin, balance …) is compared too.
Numbers are compared with a small tolerance; units are read from the key's suffix.

>>> flatten({"profile": {"gap_mm": 4.3625}, "bearing": {"od_deviation_um": [0.0, -4.0]}})
{'profile.gap_mm': 4.3625, 'bearing.od_deviation_um[0]': 0.0, 'bearing.od_deviation_um[1]': -4.0}
>>> unit_of("mass.izz_g_mm2")
'g·mm²'
"""
from __future__ import annotations

import math
from collections.abc import Mapping
from dataclasses import dataclass
from typing import TYPE_CHECKING, Any

from .units import unit_of

if TYPE_CHECKING:  # pragma: no cover
    from .builder import Resolved
    from .design import Design

__all__ = ["Change", "CheckChange", "DesignDiff", "flatten", "unit_of", "input_values", "compare_inputs",
           "compare_summaries", "compare_checks", "diff", "diff_text", "REL_TOL", "ABS_TOL"]

REL_TOL = 1e-9
ABS_TOL = 1e-9  # mm, g …: far below anything a lathe or a scale resolves
#: summary keys that say where a design came from, not what it is
IGNORED = ("design.source",)
@dataclass(frozen=True)
class Change:
    """One changed value: ``delta`` is new − old when both are numbers."""

    key: str
    old: Any
    new: Any
    delta: float | None = None
    unit: str = ""

    def as_dict(self) -> dict[str, Any]:
        return {"key": self.key, "old": self.old, "new": self.new, "delta": self.delta, "unit": self.unit}


@dataclass(frozen=True)
class CheckChange:
    """A check that appeared, disappeared or changed between pass and fail (None: not run)."""

    name: str
    feature: str
    parameter: str
    old: bool | None
    new: bool | None
    message: str

    def as_dict(self) -> dict[str, Any]:
        return {"name": self.name, "feature": self.feature, "parameter": self.parameter, "old_ok": self.old,
                "new_ok": self.new, "message": self.message}


@dataclass(frozen=True)
class DesignDiff:
    """Inputs that changed, derived values that changed, and checks whose outcome changed."""

    a: Mapping[str, Any]
    b: Mapping[str, Any]
    inputs: tuple[Change, ...]
    derived: tuple[Change, ...]
    checks: tuple[CheckChange, ...]

    @property
    def same(self) -> bool:
        return not (self.inputs or self.derived or self.checks)

    def as_dict(self) -> dict[str, Any]:
        return {"a": dict(self.a), "b": dict(self.b), "same": self.same,
                "inputs": [c.as_dict() for c in self.inputs], "derived": [c.as_dict() for c in self.derived],
                "checks": [c.as_dict() for c in self.checks]}


def flatten(tree: Mapping[str, Any], prefix: str = "") -> dict[str, Any]:
    """Nested dicts to dotted keys; short lists of numbers to ``key[i]``; lists of tables to
    ``key[label].field`` (label: the table's "part" or "name", else its index); other lists kept whole."""
    out: dict[str, Any] = {}
    for key, value in tree.items():
        path = f"{prefix}.{key}" if prefix else str(key)
        if isinstance(value, Mapping):
            out.update(flatten(value, path))
        elif isinstance(value, (list, tuple)) and value and all(_number(v) for v in value) and len(value) <= 4:
            for i, v in enumerate(value):
                out[f"{path}[{i}]"] = v
        elif isinstance(value, (list, tuple)) and value and all(isinstance(v, Mapping) for v in value) \
                and key != "checks":
            for i, v in enumerate(value):
                label = next((f for f in ("part", "name") if isinstance(v.get(f), str)), None)
                rest = {k: x for k, x in v.items() if k != label}
                out.update(flatten(rest, f"{path}[{v[label] if label else i}]"))
        else:
            out[path] = value
    return out


def _number(v: Any) -> bool:
    return isinstance(v, (int, float)) and not isinstance(v, bool)


def _same(a: Any, b: Any) -> bool:
    if _number(a) and _number(b):
        if math.isnan(a) and math.isnan(b):
            return True
        return math.isclose(a, b, rel_tol=REL_TOL, abs_tol=ABS_TOL)
    return a == b


def _change(key: str, old: Any, new: Any) -> Change:
    delta = new - old if _number(old) and _number(new) else None
    return Change(key, old, new, delta, unit_of(key))


def input_values(design: "Design") -> dict[str, Any]:
    """Every input as read (mm, g, rad), keyed by its design-file path, plus the revision history."""
    out: dict[str, Any] = {}
    for section, values in design.sections.items():
        out.update({f"{section}.{k}": v for k, v in values.items()})
    for feature, values in design.features.items():
        out.update({f"features.{feature}.{k}": v for k, v in values.items()})
    out["revisions"] = [f"{r.letter} {r.date} {r.note}".strip() for r in design.revisions]
    return out


def _written(design: "Design", key: str) -> Any:
    """The value as written in the file (e.g. "8 mm"), or "(default)" when the file leaves it out."""
    node: Any = design.raw
    for part in key.split("."):
        if not isinstance(node, Mapping) or part not in node:
            return "(default)"
        node = node[part]
    return node


def compare_inputs(a: "Design", b: "Design") -> list[Change]:
    """Inputs whose value differs (compared after unit conversion; shown as written)."""
    va, vb = input_values(a), input_values(b)
    out = []
    for key in va:
        if _same(va[key], vb[key]):
            continue
        if key == "revisions":
            out.append(Change(key, va[key], vb[key]))
        else:
            out.append(Change(key, _written(a, key), _written(b, key)))
    return out


def compare_summaries(a: Mapping[str, Any], b: Mapping[str, Any]) -> list[Change]:
    """Derived values (every summary key but the checks) that differ, in the order of ``a`` then new keys."""
    fa = {k: v for k, v in flatten(a).items() if k != "checks" and k not in IGNORED}
    fb = {k: v for k, v in flatten(b).items() if k != "checks" and k not in IGNORED}
    out = []
    for key in list(fa) + [k for k in fb if k not in fa]:
        old, new = fa.get(key), fb.get(key)
        if not _same(old, new):
            out.append(_change(key, old, new))
    return out


def compare_checks(a: Mapping[str, Any], b: Mapping[str, Any]) -> list[CheckChange]:
    """Checks whose outcome changed, appeared or disappeared, keyed by name and feature.parameter."""
    def index(s: Mapping[str, Any]) -> dict[tuple[str, str, str], Mapping[str, Any]]:
        return {(c["name"], c["feature"], c["parameter"]): c for c in s.get("checks", [])}

    ia, ib = index(a), index(b)
    out = []
    for key in list(ia) + [k for k in ib if k not in ia]:
        old, new = ia.get(key), ib.get(key)
        old_ok = None if old is None else bool(old["ok"])
        new_ok = None if new is None else bool(new["ok"])
        if old_ok != new_ok:
            out.append(CheckChange(*key, old_ok, new_ok, (new or old)["message"]))
    return out


def _head(resolved: "Resolved") -> dict[str, Any]:
    d = resolved.design
    return {"name": d.name, "revision": d.revision, "source": d.source, "ok": resolved.ok}


def diff(a: "Resolved", b: "Resolved") -> DesignDiff:
    """Everything that differs between two resolved designs."""
    from .summary import summary

    sa, sb = summary(a), summary(b)
    return DesignDiff(_head(a), _head(b), tuple(compare_inputs(a.design, b.design)),
                      tuple(compare_summaries(sa, sb)), tuple(compare_checks(sa, sb)))


def _show(value: Any, unit: str) -> str:
    if value is None:
        return "—"
    if _number(value):
        text = f"{value:.6g}" if unit != "µm" else f"{value:.3g}"
        return f"{text}{unit}" if unit == "°" else f"{text} {unit}".rstrip()
    if isinstance(value, list):
        return "; ".join(str(v) for v in value) or "(none)"
    return str(value)


def _signed(delta: float, unit: str) -> str:
    return f"{delta:+.6g}{unit}" if unit == "°" else f"{delta:+.6g} {unit}".rstrip()


def diff_text(d: DesignDiff, limit: int | None = None) -> str:
    """The diff as lines for a terminal: inputs, derived values (old → new, delta), checks."""
    lines = [f"{d.a['source']} (rev {d.a['revision']}) → {d.b['source']} (rev {d.b['revision']})"]
    if d.same:
        lines.append("no differences")
        return "\n".join(lines)
    if d.inputs:
        lines.append(f"inputs changed ({len(d.inputs)})")
        lines += [f"  {c.key}: {_show(c.old, '')} → {_show(c.new, '')}" for c in d.inputs]
    if d.derived:
        lines.append(f"derived values changed ({len(d.derived)})")
        shown = d.derived if limit is None else d.derived[:limit]
        for c in shown:
            tail = f"  ({_signed(c.delta, c.unit)})" if c.delta is not None else ""
            lines.append(f"  {c.key}: {_show(c.old, c.unit)} → {_show(c.new, c.unit)}{tail}")
        if len(shown) < len(d.derived):
            lines.append(f"  … and {len(d.derived) - len(shown)} more (yodraft diff shows all)")
    if d.checks:
        lines.append(f"checks changed ({len(d.checks)})")
        word = {None: "absent", True: "ok", False: "FAIL"}
        lines += [f"  {c.name} [{c.feature}.{c.parameter}]: {word[c.old]} → {word[c.new]}  {c.message}"
                  for c in d.checks]
    return "\n".join(lines)
