"""Sweep plots that answer a question: the chosen outputs against the varied keys, with the design's target.

A one-key sweep gives one panel per output: the curve (filled dots pass every check,
hollow ones fail one), the target as a dashed line where the design has one, and
where the curve crosses it. A two-key sweep gives one heat map per output with
contour lines at the tick values and the target contour drawn wide. Outputs that do
not change across the sweep are left out with a note saying their value.

>>> parse_y("mass, izz, profile.gap_mm")
['mass.total_g', 'mass.izz_g_mm2', 'profile.gap_mm']
"""
from __future__ import annotations

import math
from collections.abc import Mapping, Sequence
from typing import TYPE_CHECKING

from ..diff import unit_of
from ..errors import DesignInputError
from .svg import Page, circle, line, num, path, path_d, polyline, rect, text_width

if TYPE_CHECKING:  # pragma: no cover
    from ..design import Design
    from ..sweep import SweepResult

__all__ = ["sweep_svg", "parse_y", "design_targets", "DEFAULT_Y", "ALIASES", "LABELS"]

DEFAULT_Y = ("mass.total_g", "mass.izz_g_mm2")
#: short names for the outputs (the names solve's --target takes, and a few more)
ALIASES = {"mass": "mass.total_g", "izz": "mass.izz_g_mm2", "gap": "profile.gap_mm", "rim_share": "spin.rim_share",
           "ixx": "mass.ixx_g_mm2", "half_mass": "mass.half_g", "diameter": "profile.outer_diameter_mm",
           "width": "profile.width_mm", "clearance_min": "bearing_seat.clearance_min_mm",
           "clearance_max": "bearing_seat.clearance_max_mm"}
#: what an output is called on an axis
LABELS = {"profile.gap_mm": "gap", "profile.outer_diameter_mm": "outer diameter", "profile.width_mm": "overall width",
          "bearing_seat.clearance_min_mm": "post clearance, least", "bearing_seat.clearance_max_mm": "post clearance, most",
          "mass.half_g": "mass of one half", "mass.total_g": "assembled mass", "mass.izz_g_mm2": "Izz, assembled",
          "mass.ixx_g_mm2": "Ixx, assembled", "spin.rim_share": "rim share of Izz"}
#: the envelope target each output is aimed at
TARGET_KEYS = {"mass.total_g": "target_mass", "mass.izz_g_mm2": "target_izz", "profile.gap_mm": "target_gap"}
_INK = "#222"
_GRID = "#d6d6d6"
_LINE = "#1f5fa8"
_TARGET = "#b03a2e"
#: heat-map colours from low to high, lightness falling all the way (reads in grey print); our own choice
_RAMP = ((0.0, (255, 247, 222)), (0.25, (246, 200, 110)), (0.5, (226, 128, 62)), (0.75, (160, 52, 48)),
         (1.0, (58, 20, 52)))


def parse_y(text: str) -> list[str]:
    """The outputs named in ``--y`` (comma-separated short names or CSV columns), in order, once each."""
    from ..sweep import OUTPUT_KEYS

    keys: list[str] = []
    for raw in text.split(","):
        name = raw.strip()
        key = ALIASES.get(name, name)
        if key not in OUTPUT_KEYS:
            raise DesignInputError("--y", name[:60] or "(empty)", "is not a sweep output",
                                   "comma-separated names from " + ", ".join(ALIASES) + " or CSV columns such as "
                                   "mass.total_g")
        if key not in keys:
            keys.append(key)
    return keys


def design_targets(design: "Design") -> dict[str, float]:
    """The outputs the design aims at, from its envelope (target_mass, target_izz, target_gap)."""
    envelope = design["envelope"]
    return {key: envelope[name] for key, name in TARGET_KEYS.items() if envelope.get(name) is not None}


def _unit(key: str) -> str:
    return unit_of(key)


def _axis_label(key: str) -> str:
    unit = _unit(key)
    return LABELS.get(key, key) + (f", {unit}" if unit else "")


def _fmt(v: float) -> str:
    return f"{v:.6g}"


def _ticks(lo: float, hi: float, n: int = 5) -> list[float]:
    """Round tick values covering lo..hi (steps of 1, 2, 2.5 or 5 times a power of ten)."""
    if hi <= lo:
        return [lo]
    raw = (hi - lo) / n
    mag = 10 ** math.floor(math.log10(raw))
    step = next(m * mag for m in (1, 2, 2.5, 5, 10) if m * mag >= raw)
    first = math.ceil(lo / step - 1e-9) * step
    return [round(first + i * step, 12) for i in range(int((hi - first) / step + 1e-9) + 1)]


def _flat(values: Sequence[float]) -> bool:
    lo, hi = min(values), max(values)
    return hi - lo <= 1e-9 * max(1.0, abs(hi))


def _colour(t: float) -> str:
    t = min(1.0, max(0.0, t))
    for (t0, c0), (t1, c1) in zip(_RAMP, _RAMP[1:]):
        if t <= t1:
            f = (t - t0) / (t1 - t0)
            return "#" + "".join(f"{round(a + (b - a) * f):02x}" for a, b in zip(c0, c1))
    return "#%02x%02x%02x" % _RAMP[-1][1]


def sweep_svg(result: "SweepResult", keys: Sequence[str] | None = None,
              targets: Mapping[str, float] | None = None) -> bytes:
    """The plot of ``keys`` (default assembled mass and Izz) over the sweep, as SVG bytes."""
    targets = targets or {}
    wanted = list(keys or DEFAULT_Y)
    shown, notes = [], []
    for key in wanted:
        values = [v.outputs[key] for v in result.variants if v.outputs.get(key) is not None]
        if not values:
            notes.append(f"{key}: no variant has a value (no closed loop to weigh)")
        elif _flat(values):
            unit = _unit(key)
            notes.append(f"{key} = {_fmt(values[0])}{' ' + unit if unit else ''} in every variant")
        else:
            shown.append(key)
    two = len(result.axes) == 2
    axes_text = " × ".join(f"{a.key} ({a.count} values)" for a in result.axes)
    panel_w, panel_h = (112.0, 84.0) if two else (160.0, 72.0)
    left, top, gap = 26.0, 38.0, 30.0
    width = max(left + panel_w + (52 if two else 20), 16 + text_width(axes_text, 3.0))
    height = top + max(1, len(shown)) * (panel_h + gap) + 6 * len(notes) + 8
    page = Page(width, height, title=f"{result.design_name}: sweep")
    page.text(8, 10, f"{result.design_name}: sweep", size=4.0, weight="bold")
    page.text(8, 16, axes_text, size=3.0)
    marks = "× marks a variant with a failed check" if two else "hollow dot: a check failed"
    if two and any(v.outputs.get(k) is None for v in result.variants for k in shown):
        marks += "; grey: no value"
    page.text(8, 21.5, f"{result.passed} of {len(result.variants)} variants pass every check; {marks}", size=3.0,
              fill="#444")
    if targets and any(k in targets for k in shown):
        page.text(8, 27, "dashed red: the design's target (envelope.target_*)" if not two else
                  "wide black line: the design's target contour (envelope.target_*)", size=3.0, fill="#444")
    for p, key in enumerate(shown):
        y0 = top + p * (panel_h + gap)
        if two:
            _heat_map(page, result, key, targets.get(key), left, y0, panel_w, panel_h)
        else:
            _curve(page, result, key, targets.get(key), left, y0, panel_w, panel_h)
    ny = top + max(1, len(shown)) * (panel_h + gap) - 8
    if not shown:
        page.text(left, top + 20, "nothing to plot: every chosen output is flat or missing", size=3.4)
    for k, note in enumerate(notes):
        page.text(8, ny + 6 * k, ("left out: " if k == 0 else "          ") + note, size=3.0, fill="#444")
    return page.render()


def _frame(page: Page, x0: float, y0: float, w: float, h: float, xs: tuple[float, float], ys: tuple[float, float],
           x_label: str, y_label: str, grid: bool = True) -> None:
    """Axes box, ticks with values, grid lines and labels (with units)."""
    (x_lo, x_hi), (y_lo, y_hi) = xs, ys

    def sx(x: float) -> float:
        return x0 + (x - x_lo) / ((x_hi - x_lo) or 1.0) * w

    def sy(y: float) -> float:
        return y0 + h - (y - y_lo) / ((y_hi - y_lo) or 1.0) * h

    for t in _ticks(min(y_lo, y_hi), max(y_lo, y_hi)):
        if grid:
            page.add(line(x0, sy(t), x0 + w, sy(t), stroke=_GRID, width=0.15))
        page.add(line(x0 - 1.2, sy(t), x0, sy(t), stroke=_INK, width=0.2))
        page.text(x0 - 2, sy(t) + 1.1, _fmt(t), size=2.8, anchor="end")
    for t in _ticks(min(x_lo, x_hi), max(x_lo, x_hi)):
        if grid:
            page.add(line(sx(t), y0, sx(t), y0 + h, stroke=_GRID, width=0.15))
        page.add(line(sx(t), y0 + h, sx(t), y0 + h + 1.2, stroke=_INK, width=0.2))
        page.text(sx(t), y0 + h + 4.5, _fmt(t), size=2.8, anchor="middle")
    page.add(rect(x0, y0, w, h, stroke=_INK, width=0.25))
    page.text(x0 + w / 2, y0 + h + 10, x_label, size=3.2, anchor="middle")
    page.text(x0, y0 - 2.5, y_label, size=3.2, weight="bold")


def _curve(page: Page, result: "SweepResult", key: str, target: float | None, x0: float, y0: float, w: float,
           h: float) -> None:
    ax = result.axes[0]
    pts = [(v.inputs[0], v.outputs[key], v.ok) for v in result.variants if v.outputs.get(key) is not None]
    xs = [v.inputs[0] for v in result.variants]
    x_lo, x_hi = min(xs), max(xs)
    ys = [y for _, y, _ in pts] + ([target] if target is not None else [])
    y_lo, y_hi = min(ys), max(ys)
    pad = (y_hi - y_lo) * 0.06
    y_lo, y_hi = y_lo - pad, y_hi + pad

    def sx(x: float) -> float:
        return x0 + (x - x_lo) / ((x_hi - x_lo) or 1.0) * w

    def sy(y: float) -> float:
        return y0 + h - (y - y_lo) / (y_hi - y_lo) * h

    _frame(page, x0, y0, w, h, (x_lo, x_hi), (y_lo, y_hi), f"{ax.key}" + (f", {ax.unit}" if ax.unit else ""),
           _axis_label(key))
    if target is not None:
        page.add(line(x0, sy(target), x0 + w, sy(target), stroke=_TARGET, width=0.45, dash=(2.0, 1.2)))
        crossings = [x1 + (target - y1) * (x2 - x1) / (y2 - y1)
                     for (x1, y1, _), (x2, y2, _) in zip(pts, pts[1:]) if (y1 - target) * (y2 - target) < 0]
        crossings += [x for x, y, _ in pts if y == target]
        unit = _unit(key)
        label = f"target {_fmt(target)} {unit}".rstrip()
        if crossings:
            label += " at " + ", ".join(f"{_fmt(round(c, 4))}" for c in crossings[:3]) + (f" {ax.unit}" if ax.unit else "")
        for c in crossings:
            page.add(line(sx(c), sy(target), sx(c), y0 + h, stroke=_TARGET, width=0.25, dash=(0.8, 0.8)))
        if not crossings:
            label += ": not reached in this range"
        ty = sy(target) - 1.5 if sy(target) > y0 + 6 else sy(target) + 4
        page.text(x0 + w - 1.5, ty, label, size=2.8, anchor="end", fill=_TARGET)
    if len(pts) > 1:
        page.add(polyline([(sx(x), sy(y)) for x, y, _ in pts], stroke=_LINE, width=0.45))
    if len(pts) <= 200:
        for x, y, ok in pts:
            page.add(circle(sx(x), sy(y), 0.9, fill=_LINE if ok else "#fff", stroke=_LINE, width=0.3))


def _heat_map(page: Page, result: "SweepResult", key: str, target: float | None, x0: float, y0: float, w: float,
              h: float) -> None:
    ax, ay = result.axes
    nx, ny = ax.count, ay.count
    grid: list[list[float | None]] = [[None] * ny for _ in range(nx)]
    failed: list[tuple[int, int]] = []
    # both axes drawn rising, whichever way the sweep ran
    flip_x, flip_y = ax.stop < ax.start, ay.stop < ay.start
    for v in result.variants:
        i, j = divmod(v.index, ny)
        i, j = (nx - 1 - i if flip_x else i), (ny - 1 - j if flip_y else j)
        grid[i][j] = v.outputs.get(key)
        if not v.ok:
            failed.append((i, j))
    values = [x for col in grid for x in col if x is not None]
    lo, hi = min(values), max(values)
    xv, yv = sorted(ax.shown(x) for x in ax.values()), sorted(ay.shown(y) for y in ay.values())
    # each cell spans half way to its neighbours; the frame spans the outer cells' edges
    def edges(vals: list[float]) -> list[float]:
        mids = [(a + b) / 2 for a, b in zip(vals, vals[1:])]
        return [vals[0] - (mids[0] - vals[0])] + mids + [vals[-1] + (vals[-1] - mids[-1])]

    ex, ey = edges(xv), edges(yv)

    def sx(x: float) -> float:
        return x0 + (x - ex[0]) / (ex[-1] - ex[0]) * w

    def sy(y: float) -> float:
        return y0 + h - (y - ey[0]) / (ey[-1] - ey[0]) * h

    for i in range(nx):
        for j in range(ny):
            value = grid[i][j]
            fill = "#bdbdbd" if value is None else _colour((value - lo) / (hi - lo))
            xa, xb = sorted((sx(ex[i]), sx(ex[i + 1])))
            ya, yb = sorted((sy(ey[j]), sy(ey[j + 1])))
            page.add(rect(xa, ya, xb - xa + 0.02, yb - ya + 0.02, fill=fill))
    levels = [t for t in _ticks(lo, hi, 6) if lo < t < hi and t != target]
    labels = []
    for level in levels:
        pieces = _contour_pieces(grid, xv, yv, level)
        if pieces:
            d = " ".join(path_d([(sx(x), sy(y)) for x, y in piece]) for piece in pieces)
            page.add(path(d, stroke="#ffffff", width=0.5))
            page.add(path(d, stroke=_INK, width=0.2))
            top = min((p for piece in pieces for p in piece), key=lambda p: (sy(p[1]), sx(p[0])))
            labels.append((sx(top[0]), sy(top[1]), _fmt(level)))
    if target is not None and lo < target < hi:
        d = _contour_d(grid, xv, yv, target, sx, sy)
        if d:
            page.add(path(d, stroke="#ffffff", width=1.4))
            page.add(path(d, stroke="#000", width=0.8))
    if len(failed) <= 2500:
        for i, j in failed:
            cx, cy, k = sx(xv[i]), sy(yv[j]), 0.7
            page.add(path(f"M {cx - k:.3f} {cy - k:.3f} L {cx + k:.3f} {cy + k:.3f} M {cx - k:.3f} {cy + k:.3f} "
                          f"L {cx + k:.3f} {cy - k:.3f}", stroke=_INK, width=0.22))
    for x, y, text in labels:  # each contour's value where it comes nearest the top of the map
        tw = len(text) * 0.58 * 2.3
        bx = min(max(x - tw / 2 - 0.6, x0), x0 + w - tw - 1.2)
        by = max(y, y0 + 0.4)
        page.add(rect(bx, by, tw + 1.2, 3.2, fill="#fff"))
        page.text(bx + 0.6, by + 2.5, text, size=2.3)
    _frame(page, x0, y0, w, h, (ex[0], ex[-1]), (ey[0], ey[-1]), f"{ax.key}" + (f", {ax.unit}" if ax.unit else ""),
           _axis_label(key), grid=False)
    page.text(x0 - 15, y0 + h / 2, ay.key + (f", {ay.unit}" if ay.unit else ""), size=3.2, anchor="middle",
              rotate=-90)
    _colour_bar(page, x0 + w + 6, y0, h, lo, hi, key, target)


def _colour_bar(page: Page, x: float, y0: float, h: float, lo: float, hi: float, key: str,
                target: float | None) -> None:
    gid = f"ramp{len(page.defs) + 1}"
    stops = "".join(f'<stop offset="{num(t)}" stop-color="{_colour(t)}"/>' for t, _ in _RAMP)
    page.defs.append(f'<linearGradient id="{gid}" x1="0" y1="1" x2="0" y2="0">{stops}</linearGradient>')
    page.add(rect(x, y0, 5, h, fill=f"url(#{gid})"))
    page.add(rect(x, y0, 5, h, stroke=_INK, width=0.2))
    for t in _ticks(lo, hi, 6):
        if lo <= t <= hi:
            yy = y0 + h * (1 - (t - lo) / (hi - lo))
            page.add(line(x + 5, yy, x + 6.2, yy, stroke=_INK, width=0.2))
            page.text(x + 7, yy + 1.0, _fmt(t), size=2.6)
    if target is not None:
        if lo <= target <= hi:
            yy = y0 + h * (1 - (target - lo) / (hi - lo))
            page.add(line(x - 1, yy, x + 6, yy, stroke="#000", width=0.8))
            page.text(x, y0 + h + 9, f"target {_fmt(target)} {_unit(key)}".rstrip(), size=2.8, weight="bold")
        else:
            page.text(x, y0 + h + 9, f"target {_fmt(target)} {_unit(key)}: outside".rstrip(), size=2.8)
    unit = _unit(key)
    if unit:
        page.text(x, y0 - 2.5, unit, size=2.8)


def _contour_d(grid: list[list[float | None]], xv: list[float], yv: list[float], level: float, sx, sy) -> str:
    """Path data of the contour at ``level``, through the page transforms ``sx``, ``sy``."""
    return " ".join(path_d([(sx(x), sy(y)) for x, y in piece]) for piece in _contour_pieces(grid, xv, yv, level))


def _contour_pieces(grid: list[list[float | None]], xv: list[float], yv: list[float],
                    level: float) -> list[list[tuple[float, float]]]:
    """Marching squares over the grid nodes: straight pieces where the output crosses ``level``."""
    pieces: list[list[tuple[float, float]]] = []
    for i in range(len(xv) - 1):
        for j in range(len(yv) - 1):
            corners = [(i, j), (i + 1, j), (i + 1, j + 1), (i, j + 1)]
            vals = [grid[a][b] for a, b in corners]
            if any(v is None for v in vals):
                continue
            points = []
            for k in range(4):
                (a1, b1), (a2, b2) = corners[k], corners[(k + 1) % 4]
                v1, v2 = vals[k], vals[(k + 1) % 4]
                if (v1 - level) * (v2 - level) < 0 or (v1 == level and v2 != level):
                    f = (level - v1) / (v2 - v1)
                    points.append((xv[a1] + f * (xv[a2] - xv[a1]), yv[b1] + f * (yv[b2] - yv[b1])))
            if len(points) == 2:
                pieces.append(points)
            elif len(points) == 4:  # a saddle: pair the crossings by the cell's mean value
                centre = sum(vals) / 4
                if (centre - level) * (vals[0] - level) > 0:
                    pieces += [[points[0], points[3]], [points[1], points[2]]]
                else:
                    pieces += [[points[0], points[1]], [points[2], points[3]]]
    return pieces
