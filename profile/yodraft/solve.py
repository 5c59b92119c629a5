"""Solving for a target: move one numeric parameter until the design hits a mass, an Izz or a gap.

A bracketing root finder (expand from the current value until the target is
crossed, then the Illinois variant of regula falsi) keeps every trial inside
the parameter's own bounds, so each trial is a design the builder accepts.
"""
from __future__ import annotations

from collections.abc import Callable, Mapping
from dataclasses import dataclass
from typing import Any

from .analysis import analyse
from .builder import Resolved, build
from .design import Design, array_table, find_param, loads, with_values
from .errors import DesignInputError
from .params import SMALLEST, ParamSpec
from .tomledit import add_revision, set_key
from .units import DISPLAY_UNITS, UnitError, parse_quantity

__all__ = ["TARGETS", "SolveResult", "solve", "find_spec", "quantity_text", "parse_target", "solved_text"]

#: what can be aimed at: name -> (kind of the target value, how to read it off a resolved design, tolerance)
TARGETS: dict[str, tuple[str, Callable[[Resolved], float], float]] = {
    "mass": ("mass", lambda r: analyse(r).assembly.total_g, 0.001),
    "izz": ("inertia", lambda r: analyse(r).assembly.izz_g_mm2, 0.5),
    "gap": ("length", lambda r: r["bearing_seat.gap"], 1e-5),
}
TARGET_UNITS = {"mass": "g", "izz": "g*mm^2", "gap": "mm"}


@dataclass(frozen=True)
class SolveResult:
    """The answer: the value found (base units), what the design then measures, and how it got there."""

    key: str
    target: str
    spec: ParamSpec
    value: float
    achieved: float
    goal: float
    evaluations: int
    resolved: Resolved
    design: Design


def find_spec(key: str, source: str) -> tuple[list[str], ParamSpec]:
    """The TOML path and spec of a numeric design key such as "features.rim.band_width" (or "rim.band_width")."""
    found = find_param(key)
    if found is None or found[1].kind in ("text", "bool"):
        raise DesignInputError(source, key, "is not a numeric design parameter",
                               "a key path such as features.rim.band_width or features.rim.thickness")
    return found


def quantity_text(value: float, spec: ParamSpec) -> Any:
    """``value`` (base units) as a design-file value: a quantity string, or a plain number."""
    return spec.written(value)


def _shown(value: float, spec: ParamSpec) -> str:
    """``value`` (base units) for a message: to 4 decimals of its display unit, trailing zeros dropped (9.1867 mm)."""
    div, unit, _ = DISPLAY_UNITS[spec.kind]
    number = f"{value / div:.4f}".rstrip("0").rstrip(".")
    return f"{number} {unit}".strip()


def _current(design: Design, parts: list[str], spec: ParamSpec) -> float | None:
    section: Mapping[str, Any] = design.features[parts[1]] if parts[0] == "features" else design[parts[0]]
    if len(parts) == 4:  # a table of a feature's array, e.g. features.shape.points[2]
        point = array_table(design, parts)[parts[-1]]
        return point if isinstance(point, float) else None  # a point's size is given, or not there to move
    value = section[parts[-1]]
    if value is None:
        resolved = build(design)
        value = resolved.values.get(f"{parts[1]}.{parts[-1]}" if parts[0] == "features" else ".".join(parts))
    return value if isinstance(value, float) else None


def solve(design: Design, target: str, goal: float, key: str, max_evaluations: int = 120) -> SolveResult:
    """Find the value of ``key`` within its bounds at which ``target`` (mass, izz or gap) equals ``goal``.

    Raises DesignInputError when the key or target is unknown, and ValueError
    (with the closest value reached and why) when no value in the bounds gets there.
    """
    if target not in TARGETS:
        raise DesignInputError(design.source, "--target", f"unknown target {target!r}", "mass, izz or gap")
    _, measure, tol = TARGETS[target]
    parts, spec = find_spec(key, design.source)
    lo = spec.lo if spec.lo is not None else -1e6
    hi = spec.hi if spec.hi is not None else 1e6
    lo_closed = spec.lo_closed
    if spec.smallest > SMALLEST and 0 <= lo < spec.smallest:
        lo, lo_closed = spec.smallest, True  # a length a file holds is 0 or at least the sheet's least size
    x0 = _current(design, parts, spec)
    if x0 is None:
        raise DesignInputError(design.source, key, "has no value to start from", "give it a value in the design file")
    count = 0
    best: tuple[float, float, float] | None = None  # (|error|, x, measured)

    def f(x: float) -> float | None:
        nonlocal count, best
        count += 1
        if spec.too_fine(x):  # finer than the file may hold (below the sheet's least size)
            return None
        try:
            candidate = with_values(design, [(".".join(parts), x)])
            resolved = build(candidate)
            if resolved.profile is None:
                return None
            got = measure(resolved)
        except (DesignInputError, ValueError):
            return None
        if best is None or abs(got - goal) < best[0]:
            best = (abs(got - goal), x, got)
        return got - goal

    e0 = f(x0)
    if e0 is None:
        raise ValueError(f"{key} = {x0:g} gives no valid profile to start from")
    a, fa = x0, e0
    b, fb = a, fa
    if abs(fa) > tol:
        # try both directions, growing the step until the sign changes or the bounds stop us
        step = max(abs(x0) * 0.05, 0.05)
        found = False
        stops: list[str] = []
        for direction in (1.0, -1.0):
            x_prev, f_prev, h = x0, e0, step
            edge = hi if direction > 0 else lo
            near_edge = False  # once a trial fails to close, creep up on the last closing value
            while True:
                x = min(hi, max(lo + 1e-9 if not lo_closed else lo, x_prev + direction * h))
                if x == x_prev:
                    stops.append(f"its bound {_shown(edge, spec)}")
                    break
                if count >= max_evaluations:
                    stops.append(f"{max_evaluations} trials")
                    break
                fx = f(x)
                if fx is None:
                    near_edge, h = True, h / 2
                    if h < 1e-6:
                        stops.append(f"{_shown(x_prev, spec)}, beyond which the half no longer closes "
                                     "into a valid profile")
                        break
                    continue
                if fx == 0 or (fx > 0) != (f_prev > 0):
                    a, fa, b, fb, found = x_prev, f_prev, x, fx, True
                    break
                x_prev, f_prev, h = x, fx, h if near_edge else h * 2
            if found:
                break
        if not found:
            assert best is not None
            unit = TARGET_UNITS[target]
            raise ValueError(f"no value of {key} reaches {target} {goal:g} {unit}: the closest is {best[2]:.4f} {unit} at "
                             f"{_shown(best[1], spec)}; searching up stopped at {stops[0]}, "
                             f"down at {stops[1]}")
        side = 0
        while abs(fb) > tol and count < max_evaluations and abs(b - a) > 1e-12:
            x = b - fb * (b - a) / (fb - fa)
            fx = f(x)
            if fx is None:
                x = (a + b) / 2
                fx = f(x)
                if fx is None:
                    break
            if (fx > 0) == (fb > 0):
                b, fb = x, fx
                if side == -1:
                    fa /= 2
                side = -1
            else:
                a, fa = b, fb
                b, fb = x, fx
                if side == 1:
                    fa /= 2
                side = 1
        if abs(fb) > tol:
            raise ValueError(f"{key}: could not close on {target} {goal:g} within {max_evaluations} trials")
    solved = with_values(design, [(".".join(parts), b)])
    resolved = build(solved)
    return SolveResult(".".join(parts), target, spec, b, measure(resolved), goal, count, resolved, solved)


def parse_target(text: str, source: str) -> tuple[str, float]:
    """``"mass=66g"`` → ("mass", 66.0): a target name and its value in base units."""
    name, _, value = text.partition("=")
    if name not in TARGETS or not value:
        raise DesignInputError(source, "--target", f"cannot read {text!r}",
                               "mass=<mass>, izz=<g*mm^2> or gap=<length>, e.g. mass=66g")
    try:
        return name, parse_quantity(value, TARGETS[name][0])
    except UnitError as exc:
        raise DesignInputError(source, "--target", str(exc), f"a {name} with a unit") from None


def solved_text(source_text: str, result: SolveResult, goal_text: str, revision: str, date: str, out: str) -> str:
    """The design file's text with the solved value set (comments kept), the next revision and a
    history line saying what was solved; it must read back as a design."""
    value_text = quantity_text(result.value, result.spec)
    table, _, key = result.key.rpartition(".")
    try:
        text = set_key(source_text, table, key, value_text, f"solved for {result.target} {goal_text}",
                       result.spec.former)
    except KeyError:  # an array written inline, not as one [[table]] a point
        array = table.rpartition("[")[0]
        raise DesignInputError(out, result.key, f"cannot be written back: {array} is not written as [[{array}]] tables",
                               f"one [[{array}]] table a point") from None
    text = set_key(text, "design", "revision", revision)
    text = add_revision(text, revision, date, f"{result.key} solved to {value_text} for {result.target} {goal_text}")
    loads(text, out)
    return text
