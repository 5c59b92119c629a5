"""The SVG backend: the composed sheet at true scale (1 SVG unit = 1 mm of paper, y down from the top).

Lines keep their exact arcs, widths and dash patterns (paper mm, from the layers), section lining is
drawn as the same cut lines the layout avoided, and every text is real SVG text in the sheet's font
at the position and size the layout measured. Output is deterministic: fixed number formatting, items
in composition order.
"""
from __future__ import annotations

import html
import math

from . import layers
from .lettering import FONT_FAMILY, lettering
from .sheetdata import Circle, Dimension, Fill, Hatch, Item, Sheet, Stroke, Text

__all__ = ["sheet_svg", "num", "dash_array", "line_width"]


def num(v: float) -> str:
    """Fixed 3-decimal formatting without trailing zeros (deterministic, compact).

    >>> num(1.23456), num(2.0), num(-0.0001)
    ('1.235', '2', '0')
    """
    s = f"{v:.3f}".rstrip("0").rstrip(".")
    return "0" if s in ("-0", "") else s


def line_width(item: Stroke | Circle) -> float:
    """Paper width (mm) of a line: its own, else its layer's (ISO 128-2 line group)."""
    if item.weight is not None:
        return item.weight
    return layers.layer(item.layer).lineweight / 100.0


def dash_array(item: Stroke) -> list[float]:
    """Dash, gap, dash … in paper mm from the line type (empty: continuous); a dot is a zero dash."""
    name = item.linetype or layers.layer(item.layer).linetype
    pattern = layers.LINETYPES.get(name)
    if not pattern:
        return []
    out: list[float] = []
    for x in pattern:
        is_dash = x >= 0
        if out and (len(out) % 2 == 1) == is_dash:
            out[-1] += abs(x)
        else:
            if not out and not is_dash:
                out.append(0.0)
            out.append(abs(x))
    if len(out) % 2:
        out.append(0.0)
    return out


class _Writer:
    def __init__(self, sheet: Sheet) -> None:
        self.sheet = sheet
        self.h = sheet.paper[1]
        self.out: list[str] = []
        self.font = lettering()

    def xy(self, p) -> str:  # type: ignore[no-untyped-def]
        return f"{num(p[0])} {num(self.h - p[1])}"

    def stroke_attrs(self, item: Stroke | Circle) -> str:
        attrs = f' stroke-width="{num(line_width(item))}"'
        if isinstance(item, Stroke):
            dash = dash_array(item)
            if dash:
                attrs += f' stroke-dasharray="{",".join(num(d) for d in dash)}"'
        return attrs

    def path(self, item: Stroke) -> str:
        pts = item.points
        n = len(pts)
        parts = ["M" + self.xy(pts[0])]
        last = n if item.closed else n - 1
        for i in range(last):
            a, b = pts[i], pts[(i + 1) % n]
            bulge = item.bulges[i] if i < len(item.bulges) else 0.0
            if abs(bulge) > 1e-12:
                sweep = 4 * math.atan(bulge)
                r = math.dist(a, b) / (2 * math.sin(abs(sweep) / 2))
                large = 1 if abs(sweep) > math.pi else 0
                flag = 0 if sweep > 0 else 1  # y flips: counter-clockwise on paper is clockwise in SVG
                parts.append(f"A{num(r)} {num(r)} 0 {large} {flag} {self.xy(b)}")
            elif i == n - 1 and item.closed:
                parts.append("Z")
                break
            else:
                parts.append("L" + self.xy(b))
        if item.closed and parts[-1] != "Z":
            parts.append("Z")
        return "".join(parts)

    def item(self, it: Item) -> None:
        if isinstance(it, Stroke):
            self.out.append(f'<path d="{self.path(it)}"{self.stroke_attrs(it)}/>')
        elif isinstance(it, Circle):
            c = it.center
            self.out.append(f'<circle cx="{num(c[0])}" cy="{num(self.h - c[1])}" r="{num(it.radius)}"'
                            f'{self.stroke_attrs(it)}/>')
        elif isinstance(it, Fill):
            d = "M" + "L".join(self.xy(p) for p in it.points) + "Z"
            self.out.append(f'<path d="{d}" fill="#000" stroke="none"/>')
        elif isinstance(it, Hatch):
            d = "".join("M" + self.xy(a) + "L" + self.xy(b) for a, b in it.lines)
            width = layers.layer(it.layer).lineweight / 100.0
            if d:
                self.out.append(f'<path d="{d}" stroke-width="{num(width)}"/>')
        elif isinstance(it, Text):
            self.text(it)
        elif isinstance(it, Dimension):
            for sub in it.items:
                self.item(sub)

    def text(self, t: Text) -> None:
        x, y = num(t.at[0]), num(self.h - t.at[1])
        transform = f"translate({x} {y})"
        if abs(t.rotation) > 1e-9:
            transform += f" rotate({num(-t.rotation)})"
        size = t.height * self.font.metrics.em_per_cap
        body = html.escape(t.text, quote=False)
        self.out.append(f'<text transform="{transform}" font-size="{num(size)}">{body}</text>')

    def page(self) -> bytes:
        for it in self.sheet.items:
            self.item(it)
        w, h = num(self.sheet.paper[0]), num(self.sheet.paper[1])
        head = ("<?xml version=\"1.0\" encoding=\"utf-8\"?>\n"
                f'<svg xmlns="http://www.w3.org/2000/svg" width="{w}mm" height="{h}mm" viewBox="0 0 {w} {h}">'
                f'<rect x="0" y="0" width="{w}" height="{h}" fill="#fff"/>'
                f'<g fill="none" stroke="#000" stroke-linecap="round" stroke-linejoin="round">'
                f'<g font-family="{FONT_FAMILY}, Bitstream Vera Sans, sans-serif" fill="#000" stroke="none" '
                f'xml:space="preserve">')
        texts = [s for s in self.out if s.startswith("<text")]
        rest = [s for s in self.out if not s.startswith("<text")]
        return (head + "".join(texts) + "</g>" + "".join(rest) + "</g></svg>\n").encode("utf-8")


def sheet_svg(sheet: Sheet) -> bytes:
    """The sheet as SVG, 1 mm of paper = 1 SVG unit, black on white."""
    return _Writer(sheet).page()
