"""The composed sheet as plain data: what is drawn where, in paper millimetres (x right, y up from the
sheet's lower-left corner). Composed once (``compose``), written by each backend (DXF, SVG, PDF).
The items and views are NamedTuples (the layout makes and tests them by the thousand); the sheet a dataclass.

Every item names its ``layer`` (line type and width come from it, ``layers.LAYERS``) and its ``view``:
``paper`` for the sheet itself, or the name of a view (``main``, ``detail``) whose model geometry it shows;
the DXF backend maps a view's items back to model coordinates, the others draw them as they are.
"""
from __future__ import annotations

import math
from dataclasses import dataclass, field
from typing import NamedTuple, Union

from .requests import DimensionRequest

__all__ = ["Stroke", "Circle", "Fill", "Text", "Hatch", "Dimension", "View", "Sheet", "Item", "segments_of",
           "translate", "text_box", "box_of", "flatten", "DESCENDER"]

P = tuple[float, float]
DESCENDER = 0.2853  # a text's depth below its baseline per cap height, unless it says otherwise


class Stroke(NamedTuple):
    """An open or closed line through ``points``; ``bulges[i]`` makes the piece after point i an arc
    (tan of a quarter of its sweep, DXF convention). ``weight`` (mm) and ``linetype`` override the layer's."""

    points: tuple[P, ...]
    layer: str
    view: str = "paper"
    closed: bool = False
    bulges: tuple[float, ...] = ()
    weight: float | None = None
    linetype: str | None = None


class Circle(NamedTuple):
    center: P
    radius: float
    layer: str
    view: str = "paper"
    weight: float | None = None


class Fill(NamedTuple):
    """A filled polygon (arrowheads, datum triangles)."""

    points: tuple[P, ...]
    layer: str
    view: str = "paper"


class Text(NamedTuple):
    """One line of text: ``at`` is the left end of its baseline, ``height`` the cap height (mm),
    ``rotation`` in degrees counter-clockwise, ``width`` the room the layout kept for it (mm)."""

    text: str
    at: P
    height: float
    width: float
    rotation: float = 0.0
    layer: str = "text"
    view: str = "paper"
    descender: float = DESCENDER


class Hatch(NamedTuple):
    """Section lining: ``loops`` (closed strokes) filled with lines at ``angle`` degrees, ``spacing``
    apart on paper, one of them through ``origin``; ``lines`` are those lines cut to the loops."""

    loops: tuple[Stroke, ...]
    angle: float
    spacing: float
    origin: P
    lines: tuple[tuple[P, P], ...]
    layer: str = "hatch"
    view: str = "paper"


class Dimension(NamedTuple):
    """A placed dimension: the request it answers, where its line runs (``base``: a point on the
    dimension line, or the arc's point for a radius/angle), where its text sits, and what it draws."""

    request: DimensionRequest
    items: tuple["Item", ...]
    base: P
    text_at: P
    text: str
    view: str = "main"
    lower: bool = False  # drawn on the mirrored half


Item = Union[Stroke, Circle, Fill, Text, Hatch, Dimension]


class View(NamedTuple):
    """How a view maps model (z, r) to paper: ``paper = origin + scale · (z, r)``; ``box`` is its
    (x0, y0, x1, y1) on paper (a viewport in the DXF)."""

    name: str
    scale: float
    origin: P
    box: tuple[float, float, float, float]

    def to_paper(self, p: P) -> P:
        return (self.origin[0] + self.scale * p[0], self.origin[1] + self.scale * p[1])

    def to_model(self, p: P) -> P:
        return ((p[0] - self.origin[0]) / self.scale, (p[1] - self.origin[1]) / self.scale)


@dataclass(frozen=True)
class Sheet:
    """One sheet: paper size (mm), the frame, every item, the views, the scales' texts."""

    paper: P
    frame: tuple[float, float, float, float]
    items: tuple[Item, ...]
    views: tuple[View, ...]
    name: str = "sheet"
    notes: dict = field(default_factory=dict)

    def view(self, name: str) -> View:
        return next(v for v in self.views if v.name == name)


def flatten(points: tuple[P, ...], bulges: tuple[float, ...], closed: bool, step_deg: float = 6.0) -> list[P]:
    """The polyline with each bulged piece replaced by chords of at most ``step_deg``."""
    n = len(points)
    out: list[P] = [points[0]] if n else []
    last = n if closed else n - 1
    for i in range(last):
        a, b = points[i], points[(i + 1) % n]
        bulge = bulges[i] if i < len(bulges) else 0.0
        if abs(bulge) > 1e-12:
            sweep = 4 * math.atan(bulge)
            chord = math.dist(a, b)
            r = chord / (2 * math.sin(abs(sweep) / 2))
            mx, my = (a[0] + b[0]) / 2, (a[1] + b[1]) / 2
            ux, uy = (b[0] - a[0]) / chord, (b[1] - a[1]) / chord
            h = r * math.cos(sweep / 2) * (1 if sweep > 0 else -1)
            cx, cy = mx - uy * h, my + ux * h
            a0 = math.atan2(a[1] - cy, a[0] - cx)
            steps = max(2, int(math.ceil(abs(math.degrees(sweep)) / step_deg)))
            for k in range(1, steps):
                t = a0 + sweep * k / steps
                out.append((cx + r * math.cos(t), cy + r * math.sin(t)))
        out.append(b)
    return out


def segments_of(item: Item) -> list[tuple[P, P]]:
    """The straight pieces an item draws on paper (arcs as chords), for collision tests."""
    if isinstance(item, Stroke):
        pts = flatten(item.points, item.bulges, item.closed)
        return list(zip(pts, pts[1:]))
    if isinstance(item, Circle):
        c, r = item.center, item.radius
        pts = [(c[0] + r * math.cos(t * math.pi / 18), c[1] + r * math.sin(t * math.pi / 18)) for t in range(37)]
        return list(zip(pts, pts[1:]))
    if isinstance(item, Fill):
        pts = list(item.points) + [item.points[0]]
        return list(zip(pts, pts[1:]))
    if isinstance(item, Hatch):
        out = list(item.lines)
        for loop in item.loops:
            out += segments_of(loop)
        return out
    if isinstance(item, Dimension):
        return [s for sub in item.items for s in segments_of(sub)]
    return []


def text_box(t: Text, width: float | None = None) -> tuple[float, float, float, float]:
    """(x0, y0, x1, y1) of a text on paper (texts are set at 0° or 90°): baseline-left at ``at``,
    from the descender to the cap height."""
    return box_of(t.at, t.height, t.width if width is None else width, t.rotation, t.descender)


def box_of(at: P, height: float, width: float, rotation: float = 0.0,
           descender: float = DESCENDER) -> tuple[float, float, float, float]:
    """``text_box`` of a text not yet made: its baseline's left end, cap height, width, rotation, descender."""
    w = width
    lo, hi = -descender * height, height
    x, y = at
    if abs(rotation % 180) < 1e-9:
        if abs(rotation % 360) < 1e-9:
            return (x, y + lo, x + w, y + hi)
        return (x - w, y - hi, x, y - lo)
    if abs((rotation - 90) % 360) < 1e-9:
        return (x - hi, y, x - lo, y + w)
    if abs((rotation - 270) % 360) < 1e-9:
        return (x + lo, y - w, x + hi, y)
    raise ValueError(f"text at {rotation}°: only 0/90/180/270 are laid out")


def _shift(p: P, dx: float, dy: float) -> P:
    return (p[0] + dx, p[1] + dy)


def translate(item: Item, dx: float, dy: float) -> Item:
    """The item moved by (dx, dy) on paper."""
    if isinstance(item, (Stroke, Fill)):
        return item._replace(points=tuple(_shift(p, dx, dy) for p in item.points))
    if isinstance(item, Circle):
        return item._replace(center=_shift(item.center, dx, dy))
    if isinstance(item, Text):
        return item._replace(at=_shift(item.at, dx, dy))
    if isinstance(item, Hatch):
        return item._replace(loops=tuple(translate(s, dx, dy) for s in item.loops),  # type: ignore[misc]
                       origin=_shift(item.origin, dx, dy),
                       lines=tuple((_shift(a, dx, dy), _shift(b, dx, dy)) for a, b in item.lines))
    if isinstance(item, Dimension):
        return item._replace(items=tuple(translate(s, dx, dy) for s in item.items),
                       base=_shift(item.base, dx, dy), text_at=_shift(item.text_at, dx, dy))
    raise TypeError(item)
