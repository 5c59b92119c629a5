"""Histograms of a lot as SVG: one panel per quantity, each with its limits marked (our own small writer).

Every number is written with a fixed format, so the same lot gives the same file byte for byte.
"""
from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass, field
from xml.sax.saxutils import escape

import numpy as np

from .pictures.svg import FONT, text_width
from .tails import percentiles

__all__ = ["Panel", "histogram_svg", "BINS"]

BINS = 60
_WIDTH, _PANEL_H, _LEFT, _RIGHT, _TOP, _GAP = 720, 150, 70, 30, 50, 62


@dataclass(frozen=True, eq=False)
class Panel:
    """One histogram: its title, the values, and the limits to mark as (value, label)."""

    title: str
    values: np.ndarray = field(repr=False)
    limits: Sequence[tuple[float, str]] = ()


def _ticks(lo: float, hi: float, n: int = 6) -> list[float]:
    """Round tick values covering ``lo`` to ``hi``.

    >>> _ticks(0.0, 1.0, 4)
    [0.0, 0.25, 0.5, 0.75, 1.0]
    """
    if not hi > lo:
        return [lo]
    raw = (hi - lo) / n
    mag = 10 ** math.floor(math.log10(raw))
    step = next(m * mag for m in (1, 2, 2.5, 5, 10) if m * mag >= raw)
    first = math.ceil(lo / step - 1e-9) * step
    return [round(first + i * step, 12) for i in range(int((hi - first) / step + 1e-9) + 1)]


def _limit(x: float) -> str:
    """A limit's value as its label writes it: to 4 decimals at most, without trailing zeros.

    >>> _limit(0.467324), _limit(4.3125), _limit(77.0), _limit(0.0)
    ('0.4673', '4.3125', '77', '0')
    """
    text = f"{x:.4f}".rstrip("0").rstrip(".")
    return "0" if text in ("-0", "") else text


def _range(values: np.ndarray, limits: Sequence[tuple[float, str]]) -> tuple[float, float]:
    """The x range: the values' 0.1 to 99.9 percentiles widened to show every limit."""
    lo, hi = percentiles(values, [0.1, 99.9]) if len(values) else (0.0, 1.0)
    for x, _ in limits:
        lo, hi = min(lo, x), max(hi, x)
    if hi - lo < 1e-12 * max(1.0, abs(hi)):
        lo, hi = lo - max(abs(lo) * 0.01, 1e-6), hi + max(abs(hi) * 0.01, 1e-6)
    pad = 0.04 * (hi - lo)
    return lo - pad, hi + pad


def histogram_svg(title: str, panels: Sequence[Panel]) -> str:
    """The panels stacked in one SVG; bars in blue (every bin holding a unit at least a hairline high), limits as
    red lines labelled at the top."""
    height = _TOP + len(panels) * (_PANEL_H + _GAP)
    pw = _WIDTH - _LEFT - _RIGHT
    # the title set smaller when it would run past the page's right edge
    title_size = min(13.0, 13.0 * (_WIDTH - _LEFT - 10) / max(text_width(title, 13.0), 1.0))
    out = [f'<svg xmlns="http://www.w3.org/2000/svg" width="{_WIDTH}" height="{height}" '
           f'viewBox="0 0 {_WIDTH} {height}" font-family="{escape(FONT)}" font-size="11">',
           f'<rect width="{_WIDTH}" height="{height}" fill="white"/>',
           f'<text x="{_LEFT}" y="22" font-size="{title_size:.3g}">{escape(title)}</text>',
           f'<text x="{_LEFT}" y="38">share of units per bin; red lines: limits</text>']
    for p, panel in enumerate(panels):
        y0 = _TOP + p * (_PANEL_H + _GAP) + 14
        lo, hi = _range(panel.values, panel.limits)
        counts, edges = np.histogram(np.clip(panel.values, lo, hi), bins=BINS, range=(lo, hi))
        share = counts / max(1, len(panel.values))
        top = float(share.max()) or 1.0

        def sx(x: float) -> float:
            return _LEFT + (x - lo) / (hi - lo) * pw

        out.append(f'<rect x="{_LEFT}" y="{y0}" width="{pw}" height="{_PANEL_H}" fill="none" stroke="#444"/>')
        out.append(f'<text x="{_LEFT}" y="{y0 - 5}" font-size="12">{escape(panel.title)}</text>')
        for t in _ticks(lo, hi):
            out.append(f'<line x1="{sx(t):.2f}" y1="{y0 + _PANEL_H}" x2="{sx(t):.2f}" y2="{y0 + _PANEL_H + 4}" '
                       'stroke="#444"/>')
            out.append(f'<text x="{sx(t):.2f}" y="{y0 + _PANEL_H + 16}" text-anchor="middle">{t:.6g}</text>')
        out.append(f'<text x="{_LEFT - 6}" y="{y0 + 10}" text-anchor="end">{100 * top:.3g} %</text>')
        out.append(f'<text x="{_LEFT - 6}" y="{y0 + _PANEL_H}" text-anchor="end">0</text>')
        for c, (a, b) in zip(share.tolist(), zip(edges[:-1].tolist(), edges[1:].tolist())):
            if c <= 0:
                continue
            bar = max(c / top * (_PANEL_H - 4), 0.5)  # a bin with any unit in it stays visible (the tails)
            out.append(f'<rect x="{sx(a):.2f}" y="{y0 + _PANEL_H - bar:.2f}" width="{max(sx(b) - sx(a) - 0.5, 0.5):.2f}" '
                       f'height="{bar:.2f}" fill="#1f5fa8"/>')
        for i, (x, label) in enumerate(panel.limits):
            out.append(f'<line x1="{sx(x):.2f}" y1="{y0}" x2="{sx(x):.2f}" y2="{y0 + _PANEL_H}" stroke="#c8102e" '
                       'stroke-width="1.5"/>')
            right = sx(x) > _LEFT + pw / 2  # label on the side of the line with room
            anchor = ' text-anchor="end"' if right else ""
            # on a white halo, so a label over the bars stays legible
            out.append(f'<text x="{sx(x) + (-3 if right else 3):.2f}" y="{y0 + 12 + 12 * (i % 3)}" fill="#c8102e"'
                       f' stroke="white" stroke-width="3" paint-order="stroke"{anchor}>{escape(label)} {_limit(x)}</text>')
    out.append("</svg>")
    return "\n".join(out) + "\n"
