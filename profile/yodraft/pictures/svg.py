"""A tiny SVG writer for the pictures: page millimetres, fixed number formatting, exact arcs.

One user unit is one millimetre of page, y pointing down. A :class:`View` places the
(z, r) half-plane of a profile on the page at a drawing scale, so lines and arcs of a
profile become SVG path lines and arcs (nothing is flattened). Output is byte-for-byte
deterministic: every number goes through :func:`num`, ids are given by the caller.

>>> page = Page(40, 20)
>>> page.add(line(0, 0, 10, 10, stroke="#000", width=0.25))
>>> page.text(5, 15, "Ø56 & <b>", size=3)
>>> b"&amp; &lt;b&gt;" in page.render()
True
"""
from __future__ import annotations

import math
from collections.abc import Iterable, Sequence
from dataclasses import dataclass, field
from html import escape as _html_escape
from typing import NamedTuple

from ..geometry import Arc, Line, Segment

__all__ = ["num", "View", "Page", "path_d", "segments_d", "line", "rect", "circle", "path", "polyline",
           "hatch_pattern", "text_width", "FONT"]

FONT = "DejaVu Sans, Verdana, sans-serif"
#: average advance of a character per font size, for laying out labels (close for DejaVu Sans digits and letters)
CHAR_WIDTH = 0.58


def num(v: float) -> str:
    """A coordinate: at most 3 decimals, no trailing zeros, never "-0".

    >>> num(1.23456), num(2.0), num(-0.0001)
    ('1.235', '2', '0')
    """
    s = f"{v:.3f}".rstrip("0").rstrip(".")
    return "0" if s in ("-0", "", "-") else s


def text_width(text: str, size: float) -> float:
    """Estimated width of ``text`` set at font ``size`` (mm); the same on every machine."""
    return len(text) * CHAR_WIDTH * size


class View(NamedTuple):
    """Where the (z, r) plane lands on the page: page = (x0 + kz·s·z, y0 − kr·s·r).

    ``kz = -1`` draws the mirror about the gap plane (the other half), ``kr = -1`` the mirror
    about the spin axis.
    """

    x0: float
    y0: float
    scale: float
    kz: int = 1
    kr: int = 1

    def __call__(self, z: float, r: float) -> tuple[float, float]:
        return self.x0 + self.kz * self.scale * z, self.y0 - self.kr * self.scale * r

    def flipped(self, kz: int = 1, kr: int = 1) -> "View":
        return View(self.x0, self.y0, self.scale, self.kz * kz, self.kr * kr)

    @property
    def keeps_turn(self) -> bool:
        """Whether a counter-clockwise arc of the model stays positive in SVG's y-down angles."""
        return -self.kz * self.kr > 0


def _pt(p: tuple[float, float]) -> str:
    return f"{num(p[0])} {num(p[1])}"


def _arc_d(seg: Arc, view: View) -> str:
    """The arc as SVG arc commands; an arc over a half turn is split so no flag is ambiguous."""
    pieces = 2 if abs(seg.sweep) > math.pi - 1e-9 else 1
    out = []
    sweep_flag = 1 if (seg.sweep > 0) == view.keeps_turn else 0
    rad = num(seg.radius * view.scale)
    for k in range(1, pieces + 1):
        end = view(*seg.point_at(seg.start_angle + seg.sweep * k / pieces))
        out.append(f"A {rad} {rad} 0 0 {sweep_flag} {_pt(end)}")
    return " ".join(out)


def segments_d(segments: Iterable[Segment], view: View, close: bool = False) -> str:
    """Path data through segments in order; a new subpath starts wherever one does not meet the last."""
    out: list[str] = []
    last: tuple[float, float] | None = None
    for seg in segments:
        start = view(*seg.start)
        if last is None or math.dist(last, start) > 1e-6:
            if out and close:
                out.append("Z")
            out.append(f"M {_pt(start)}")
        if isinstance(seg, Line):
            out.append(f"L {_pt(view(*seg.end))}")
        else:
            out.append(_arc_d(seg, view))
        last = view(*seg.end)
    if out and close:
        out.append("Z")
    return " ".join(out)


def path_d(points: Sequence[tuple[float, float]], close: bool = False) -> str:
    """Path data through page points."""
    if not points:
        return ""
    d = f"M {_pt(points[0])} " + " ".join(f"L {_pt(p)}" for p in points[1:])
    return d.strip() + (" Z" if close else "")


def _style(stroke: str | None, width: float | None, fill: str | None, dash: Sequence[float] | None,
           extra: str = "") -> str:
    out = [f'fill="{fill or "none"}"']
    if stroke:
        out.append(f'stroke="{stroke}"')
        if width is not None:
            out.append(f'stroke-width="{num(width)}"')
        if dash:
            out.append(f'stroke-dasharray="{",".join(num(d) for d in dash)}"')
        out.append('stroke-linejoin="round"')
    return " ".join(out) + (f" {extra}" if extra else "")


def path(d: str, stroke: str | None = None, width: float | None = None, fill: str | None = None,
         dash: Sequence[float] | None = None, extra: str = "") -> str:
    return f'<path d="{d}" {_style(stroke, width, fill, dash, extra)}/>'


def line(x1: float, y1: float, x2: float, y2: float, stroke: str = "#000", width: float = 0.25,
         dash: Sequence[float] | None = None) -> str:
    return (f'<line x1="{num(x1)}" y1="{num(y1)}" x2="{num(x2)}" y2="{num(y2)}" '
            f'{_style(stroke, width, None, dash)}/>')


def polyline(points: Sequence[tuple[float, float]], stroke: str = "#000", width: float = 0.25,
             dash: Sequence[float] | None = None) -> str:
    pts = " ".join(f"{num(x)},{num(y)}" for x, y in points)
    return f'<polyline points="{pts}" {_style(stroke, width, None, dash)}/>'


def rect(x: float, y: float, w: float, h: float, fill: str | None = None, stroke: str | None = None,
         width: float | None = None, dash: Sequence[float] | None = None) -> str:
    return (f'<rect x="{num(x)}" y="{num(y)}" width="{num(w)}" height="{num(h)}" '
            f'{_style(stroke, width, fill, dash)}/>')


def circle(cx: float, cy: float, radius: float, fill: str | None = None, stroke: str | None = None,
           width: float | None = None) -> str:
    return f'<circle cx="{num(cx)}" cy="{num(cy)}" r="{num(radius)}" {_style(stroke, width, fill, None)}/>'


def hatch_pattern(pid: str, spacing: float, angle_deg: float, colour: str, width: float,
                  background: str | None = None) -> str:
    """A pattern of parallel lines ``spacing`` mm apart at ``angle_deg`` (section hatching, ISO 128-50 style)."""
    s = num(spacing)
    back = f'<rect width="{s}" height="{s}" fill="{background}"/>' if background else ""
    return (f'<pattern id="{pid}" patternUnits="userSpaceOnUse" width="{s}" height="{s}" '
            f'patternTransform="rotate({num(angle_deg)})">{back}'
            f'<line x1="0" y1="0" x2="0" y2="{s}" stroke="{colour}" stroke-width="{num(width)}"/></pattern>')


@dataclass
class Page:
    """An SVG page ``width`` × ``height`` mm, white, with elements in the order they are added."""

    width: float
    height: float
    title: str = ""
    defs: list[str] = field(default_factory=list)
    body: list[str] = field(default_factory=list)

    def add(self, element: str) -> None:
        self.body.append(element)

    def text(self, x: float, y: float, text: str, size: float = 3.0, anchor: str = "start", weight: str = "normal",
             fill: str = "#000", style: str = "", rotate: float = 0.0) -> None:
        """A line of text with its baseline at ``y``; ``anchor`` start, middle or end; ``rotate`` degrees about (x, y)."""
        attrs = f' font-weight="{weight}"' if weight != "normal" else ""
        attrs += f' transform="rotate({num(rotate)} {num(x)} {num(y)})"' if rotate else ""
        attrs += f' font-style="{style}"' if style else ""
        attrs += f' text-anchor="{anchor}"' if anchor != "start" else ""
        attrs += f' fill="{fill}"' if fill != "#000" else ""
        self.body.append(f'<text x="{num(x)}" y="{num(y)}" font-size="{num(size)}"{attrs}>{_html_escape(text, quote=False)}</text>')

    def render(self) -> bytes:
        w, h = num(self.width), num(self.height)
        head = [f'<svg xmlns="http://www.w3.org/2000/svg" width="{w}mm" height="{h}mm" viewBox="0 0 {w} {h}" '
                f'font-family="{_html_escape(FONT)}">']
        if self.title:
            head.append(f"<title>{_html_escape(self.title, quote=False)}</title>")
        if self.defs:
            head.append("<defs>" + "".join(self.defs) + "</defs>")
        head.append(f'<rect width="{w}" height="{h}" fill="#fff"/>')
        return ("\n".join(head + self.body + ["</svg>"]) + "\n").encode("utf-8")
