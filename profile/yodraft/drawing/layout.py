"""Placing dimensions on paper: every text's extent is known, every line on the sheet is an obstacle.

For each ``DimensionRequest`` the layout tries positions in order of preference (nearest lane on the
requested side, text centred, then shifted along the line, then outside the extension lines, then
further lanes or the other side) and keeps the first where no text overlaps another text or touches a
line (outline, hatching, centre line, another dimension's lines, frames) and the dimension's own lines
cross no text already placed; parallel extension lines stay at least 0.7 mm apart. Texts read along
their dimension lines (ISO 129-1 method 1: from the bottom or from the right); radius and angle texts
stand horizontal on a leader shoulder or beside the arc.
"""
from __future__ import annotations

import bisect
import itertools
import math
from dataclasses import dataclass, field
from typing import Callable, Iterable, NamedTuple

from .lettering import PITCH, Lettering
from .requests import DimensionRequest, measure, text_lines
from .sheetdata import P, Dimension, Fill, Item, Stroke, Text, View, box_of, segments_of, text_box

__all__ = ["Obstacles", "Placer", "TEXT_HEIGHT", "CLEAR", "ARROW", "EXT_MIN_GAP", "inflate", "boxes_overlap",
           "segment_hits_box"]

TEXT_HEIGHT = 3.5  # ISO 3098-1 nominal size
CLEAR = 0.6  # clear paper round every text (mm)
ARROW = 3.0  # arrowhead length (mm), filled, 30° included angle
ARROW_HALF = 0.8
GAP = 0.7  # text baseline above its dimension line, over the descender
EXT_OVER = 2.0  # extension line beyond the dimension line (ISO 129-1: about 2 mm)
EXT_MIN_GAP = 0.7  # ISO 128-2: parallel lines at least 0.7 mm apart
FIRST = 8.0  # outline to the first dimension line
DIMLINE_GAP = 5.0  # parallel dimension lines side by side at least this far apart
#: how far (mm) an angle's value stands outside its arc (negative: inside it): beside it first, farther off only
#: when no arc radius leaves room beside it
ANGLE_TEXT_NEAR, ANGLE_TEXT_FAR = (1.0, 3.0, -1.5), (6.0, 10.0, 15.0, -4.0)
CELL = 10.0  # side of the grid squares that lines and text boxes are filed in (mm; measured best of 3.5–15)

Box = tuple[float, float, float, float]
Seg = tuple[tuple[float, float], tuple[float, float]]


def inflate(b: Box, d: float) -> Box:
    return (b[0] - d, b[1] - d, b[2] + d, b[3] + d)


def boxes_overlap(a: Box, b: Box) -> bool:
    return a[0] < b[2] and b[0] < a[2] and a[1] < b[3] and b[1] < a[3]


def segment_hits_box(a: tuple[float, float], b: tuple[float, float], box: Box) -> bool:
    """Whether the segment a–b has a point inside or on ``box`` (Liang–Barsky)."""
    x0, y0 = a
    dx, dy = b[0] - x0, b[1] - y0
    t0, t1 = 0.0, 1.0
    for p, q in ((-dx, x0 - box[0]), (dx, box[2] - x0), (-dy, y0 - box[1]), (dy, box[3] - y0)):
        if abs(p) < 1e-15:
            if q < 0:
                return False
            continue
        t = q / p
        if p < 0:
            if t > t1:
                return False
            t0 = max(t0, t)
        else:
            if t < t0:
                return False
            t1 = min(t1, t)
    return t0 <= t1


def _cross(a, b, c, d) -> bool:  # type: ignore[no-untyped-def]
    """Whether segments a–b and c–d cross at a point inside both (not at an end)."""
    def orient(p, q, r):  # type: ignore[no-untyped-def]
        return (q[0] - p[0]) * (r[1] - p[1]) - (q[1] - p[1]) * (r[0] - p[0])
    d1, d2 = orient(c, d, a), orient(c, d, b)
    d3, d4 = orient(a, b, c), orient(a, b, d)
    eps = 1e-9
    return ((d1 > eps and d2 < -eps) or (d1 < -eps and d2 > eps)) and ((d3 > eps and d4 < -eps) or (d3 < -eps and d4 > eps))


class _Parallels:
    """Axis-parallel lines kept sorted by where they stand (x of a vertical line, y of a horizontal one), so
    the lines near a new one are found by bisection instead of by walking them all. A line that is a point
    stands in both lists (it pairs with a line of either way)."""

    def __init__(self) -> None:
        # per way: the sorted positions and, in the same order, (position, span low, span high)
        self._at: dict[bool, list[float]] = {True: [], False: []}
        self._lines: dict[bool, list[tuple[float, float, float]]] = {True: [], False: []}

    def add(self, s: Seg) -> None:
        (c, d) = s
        if abs(c[0] - d[0]) < 1e-9:
            self._insert(True, c[0], c[1], d[1])
        if abs(c[1] - d[1]) < 1e-9:
            self._insert(False, c[1], c[0], d[0])

    def _insert(self, vertical: bool, at: float, s0: float, s1: float) -> None:
        k = bisect.bisect_right(self._at[vertical], at)
        self._at[vertical].insert(k, at)
        self._lines[vertical].insert(k, (at, s0, s1) if s0 <= s1 else (at, s1, s0))

    def close(self, a: tuple[float, float], b: tuple[float, float], above: float, below: float,
              slack: float = 0.0) -> bool:
        """Whether a line running the same way as ab (vertical when ab's ends share x, else horizontal when
        they share y) stands more than ``above`` and less than ``below`` from it, the two spans along that
        way overlapping (or within ``slack`` of each other)."""
        if abs(a[0] - b[0]) < 1e-9:
            vertical, at = True, a[0]
            s0, s1 = (a[1], b[1]) if a[1] <= b[1] else (b[1], a[1])
        elif abs(a[1] - b[1]) < 1e-9:
            vertical, at = False, a[1]
            s0, s1 = (a[0], b[0]) if a[0] <= b[0] else (b[0], a[0])
        else:
            return False
        keys = self._at[vertical]
        lines = self._lines[vertical]
        margin = below + 1e-6  # wider than the test, so no line the exact test takes is missed
        for k in range(bisect.bisect_left(keys, at - margin), bisect.bisect_right(keys, at + margin)):
            c_at, lo, hi = lines[k]
            gap = abs(at - c_at)
            if above < gap < below and s0 < hi + slack and lo < s1 + slack:
                return True
        return False


@dataclass
class Obstacles:
    """Lines and text boxes already on the sheet, kept for quick look-ups: lines and texts in a coarse grid of
    ``CELL`` mm squares, extension and dimension lines sorted by where they stand (``_Parallels``). Every
    look-up first narrows the candidates, then runs the same exact test on each."""

    segs: list[Seg] = field(default_factory=list)
    grid: dict[tuple[int, int], list[int]] = field(default_factory=dict)
    boxes: list[Box] = field(default_factory=list)
    outline: list[Seg] = field(default_factory=list)  # the section's outline: add with add_outline
    outline_boxes: list[Box] = field(default_factory=list)  # each outline segment's extent
    box_grid: dict[tuple[int, int], list[int]] = field(default_factory=dict)
    ext: _Parallels = field(default_factory=_Parallels)  # extension lines and leaders
    dimlines: _Parallels = field(default_factory=_Parallels)
    #: least gap between parallel extension lines (ISO 128-2); 0 waives it, a last resort (``compose.SPACING_WAIVED``)
    ext_min_gap: float = EXT_MIN_GAP

    def add_box(self, box: Box) -> None:
        i = len(self.boxes)
        self.boxes.append(box)
        for key in _cells(inflate(box, 0.3)):
            self.box_grid.setdefault(key, []).append(i)

    def _near_boxes(self, box: Box) -> Iterable[int]:
        """Indexes of the text boxes that may touch ``box`` (every box within 0.3 mm of it among them; a box
        may come more than once)."""
        x0, x1 = int(math.floor(box[0] / CELL)), int(math.floor(box[2] / CELL))
        y0, y1 = int(math.floor(box[1] / CELL)), int(math.floor(box[3] / CELL))
        if (x1 - x0 + 1) * (y1 - y0 + 1) > 8:  # a long line: walking the boxes is quicker
            return range(len(self.boxes))
        grid = self.box_grid
        return [i for gx in range(x0, x1 + 1) for gy in range(y0, y1 + 1) for i in grid.get((gx, gy), ())]

    def add_segments(self, segs: Iterable[Seg]) -> None:
        grid = self.grid
        for s in segs:
            i = len(self.segs)
            self.segs.append(s)
            (x0, y0), (x1, y1) = s if s[0][0] <= s[1][0] else (s[1], s[0])
            # the squares the segment runs through, column by column (a slanted line, such as section
            # lining, passes through few of the squares its extent covers); a hair wider, never narrower
            slope = (y1 - y0) / (x1 - x0) if x1 - x0 > 1e-12 else None
            for gx in range(int(math.floor(x0 / CELL)), int(math.floor(x1 / CELL)) + 1):
                if slope is None:
                    ya, yb = y0, y1
                else:
                    xa, xb = max(x0, gx * CELL), min(x1, (gx + 1) * CELL)
                    ya, yb = y0 + slope * (xa - x0), y0 + slope * (xb - x0)
                lo, hi = (ya, yb) if ya <= yb else (yb, ya)
                for gy in range(int(math.floor((lo - 1e-6) / CELL)), int(math.floor((hi + 1e-6) / CELL)) + 1):
                    grid.setdefault((gx, gy), []).append(i)

    def add_item(self, item: Item) -> None:
        self.add_segments(segments_of(item))
        for t in _texts(item):
            self.add_box(text_box(t))

    def add_ext(self, segs: Iterable[Seg]) -> None:
        for s in segs:
            self.ext.add(s)

    def add_dimlines(self, segs: Iterable[Seg]) -> None:
        for s in segs:
            self.dimlines.add(s)

    def line_hits(self, box: Box) -> bool:
        x0, y0, x1, y1 = box
        segs = self.segs
        grid = self.grid
        for gx in range(int(math.floor(x0 / CELL)), int(math.floor(x1 / CELL)) + 1):
            for gy in range(int(math.floor(y0 / CELL)), int(math.floor(y1 / CELL)) + 1):
                for i in grid.get((gx, gy), ()):
                    a, b = segs[i]
                    # quick reject on the segment's own extent, then the exact test
                    if (a[0] < x0 and b[0] < x0) or (a[0] > x1 and b[0] > x1) or \
                            (a[1] < y0 and b[1] < y0) or (a[1] > y1 and b[1] > y1):
                        continue
                    if segment_hits_box(a, b, box):
                        return True
        return False

    def text_hits(self, box: Box) -> bool:
        x0, y0, x1, y1 = box
        boxes = self.boxes
        for i in self._near_boxes(box):
            b = boxes[i]
            if b[0] < x1 and x0 < b[2] and b[1] < y1 and y0 < b[3]:
                return True
        return False

    def crosses_text(self, segs: Iterable[Seg]) -> bool:
        boxes = self.boxes
        for a, b in segs:
            sx0, sx1 = (a[0], b[0]) if a[0] <= b[0] else (b[0], a[0])
            sy0, sy1 = (a[1], b[1]) if a[1] <= b[1] else (b[1], a[1])
            for i in self._near_boxes((sx0, sy0, sx1, sy1)):
                box = boxes[i]
                if box[0] - 0.2 > sx1 or box[2] + 0.2 < sx0 or box[1] - 0.2 > sy1 or box[3] + 0.2 < sy0:
                    continue
                if segment_hits_box(a, b, inflate(box, 0.2)):
                    return True
        return False

    def dimline_too_close(self, segs: Iterable[Seg]) -> bool:
        """Whether a new dimension line runs on or beside another one (closer than a text's depth)."""
        segs = list(segs)
        if any(self.dimlines.close(a, b, -1.0, DIMLINE_GAP, slack=1.0) for a, b in segs):
            return True
        return self.ext_too_close(segs)

    def add_outline(self, segs: Iterable[Seg]) -> None:
        for c, d in segs:
            self.outline.append((c, d))
            self.outline_boxes.append((min(c[0], d[0]), min(c[1], d[1]), max(c[0], d[0]), max(c[1], d[1])))

    def crosses_outline(self, a, b) -> bool:  # type: ignore[no-untyped-def]
        """Whether a–b crosses an outline segment at a point inside both (segments whose extents stand
        apart are passed over: they cannot cross)."""
        x0, x1 = (a[0], b[0]) if a[0] <= b[0] else (b[0], a[0])
        y0, y1 = (a[1], b[1]) if a[1] <= b[1] else (b[1], a[1])
        x0, y0, x1, y1 = x0 - 1e-6, y0 - 1e-6, x1 + 1e-6, y1 + 1e-6
        for (c, d), box in zip(self.outline, self.outline_boxes):
            if box[0] > x1 or box[2] < x0 or box[1] > y1 or box[3] < y0:
                continue
            if _cross(a, b, c, d):
                return True
        return False

    def ext_too_close(self, segs: Iterable[Seg]) -> bool:
        """Whether a new extension line runs parallel to an existing one closer than 0.7 mm (a line on the
        very same place, a shared extension line, is fine)."""
        gap = self.ext_min_gap
        return gap > 1e-6 and any(self.ext.close(a, b, 1e-6, gap) or self.dimlines.close(a, b, 1e-6, gap)
                                  for a, b in segs)


def _cells(box: Box) -> list[tuple[int, int]]:
    return [(gx, gy) for gx in range(int(math.floor(box[0] / CELL)), int(math.floor(box[2] / CELL)) + 1)
            for gy in range(int(math.floor(box[1] / CELL)), int(math.floor(box[3] / CELL)) + 1)]


def _texts(item: Item) -> list[Text]:
    if isinstance(item, Text):
        return [item]
    if isinstance(item, Dimension):
        return [t for t in item.items if isinstance(t, Text)]
    return []


# ------------------------------------------------------------------ building blocks in (u, v)
class _Frame(NamedTuple):
    """A dimension's own axes: u along its dimension line, v across (text on the +v side).
    Horizontal lines: (u, v) = (x, y); vertical lines: (u, v) = (y, −x), text left of the line."""

    vertical: bool

    def uv(self, p: tuple[float, float]) -> tuple[float, float]:
        return (p[1], -p[0]) if self.vertical else p

    def xy(self, u: float, v: float) -> tuple[float, float]:
        return (-v, u) if self.vertical else (u, v)

    @property
    def rotation(self) -> float:
        return 90.0 if self.vertical else 0.0


def _arrow(tip: tuple[float, float], toward: tuple[float, float], layer: str, view: str) -> Fill:
    """A filled arrowhead with its tip at ``tip``, its tail toward ``toward``."""
    dx, dy = toward[0] - tip[0], toward[1] - tip[1]
    n = math.hypot(dx, dy) or 1.0
    ux, uy = dx / n, dy / n
    bx, by = tip[0] + ux * ARROW, tip[1] + uy * ARROW
    return Fill((tip, (bx - uy * ARROW_HALF, by + ux * ARROW_HALF), (bx + uy * ARROW_HALF, by - ux * ARROW_HALF)),
                layer, view)


def _edges(fills: list[Fill]) -> list[Seg]:
    """The edges of filled shapes (arrowheads): as wide as they are drawn, not only the line they sit on."""
    return [(f.points[i - 1], f.points[i]) for f in fills for i in range(len(f.points))]


@dataclass
class Placer:
    """Places the dimension requests of one view, against the obstacles already on the sheet."""

    view: View
    font: Lettering
    obstacles: Obstacles
    solid: Callable[[tuple[float, float]], bool]  # whether a paper point lies in the section's material
    bbox: Box  # the drawn part on paper (both halves)
    limit: float = 60.0  # how far out (mm) lanes are searched
    mirrored: bool = True  # the view shows the mirror half below the axis (a detail of one half does not)
    placed: list[Dimension] = field(default_factory=list)
    failed: list[DimensionRequest] = field(default_factory=list)

    # ---------------------------------------------------------------- texts
    def _stack(self, lines: list[str]) -> list[tuple[str, float, float, float]]:
        """(line, its offset along the dimension line, across it, its width) of lines stacked away from the
        dimension line, each centred on the widest."""
        h = TEXT_HEIGHT
        widths = [self.font.width(s, h) for s in lines]
        wmax = max(widths)
        return [(s, (wmax - w) / 2, i * h * PITCH, w) for i, (s, w) in enumerate(zip(lines, widths))]

    def _text_places(self, lines: list[str], fr: _Frame, u0: float, v_base: float,
                     stack: list[tuple[str, float, float, float]] | None = None) -> list[tuple[str, P, float]]:
        """(line, left end of its baseline, width) of lines stacked away from the dimension line, the first
        at ``v_base``; left ends at u0 (each line centred on the widest). ``stack``: ``_stack(lines)``."""
        stack = self._stack(lines) if stack is None else stack
        return [(s, fr.xy(u0 + du, v_base + dv), w) for s, du, dv, w in stack]

    def _text_items(self, lines: list[str], fr: _Frame, u0: float, v_base: float, view: str,
                    places: list[tuple[str, P, float]] | None = None) -> list[Text]:
        """The texts of ``_text_places`` (or of ``places`` already worked out)."""
        places = self._text_places(lines, fr, u0, v_base) if places is None else places
        return [Text(s, at, TEXT_HEIGHT, w, fr.rotation, "dimension", view) for s, at, w in places]

    def _block(self, lines: list[str]) -> tuple[float, float]:
        """(length along the line, depth across it from the first baseline's descender) of a text block."""
        h = TEXT_HEIGHT
        w = max(self.font.width(s, h) for s in lines)
        return w, h * (1 + self.font.descender) + (len(lines) - 1) * h * PITCH

    def _ok(self, texts: list[Text], lines: list[Seg], ext: list[Seg], along: list[Seg],
            along_dim: list[Seg] = (), cleared: bool = False) -> bool:  # type: ignore[assignment]
        """Texts clear of every line and text (and of their own dimension's lines); the new lines cross
        no placed text; extension lines not too close; dimension lines do not cut the outline.
        ``cleared``: ``_clear`` already passed these texts (nothing was placed since)."""
        ob = self.obstacles
        boxes = [inflate(text_box(t), CLEAR) for t in texts]
        for b in boxes:
            if not cleared and (ob.line_hits(b) or ob.text_hits(b)):
                return False
            if any(segment_hits_box(a, c, b) for a, c in lines):
                return False
            if not cleared and not self._inside(b):
                return False
        if ob.crosses_text(lines):
            return False
        if ob.ext_too_close(ext) or ob.dimline_too_close(along_dim):
            return False
        return not any(ob.crosses_outline(a, b) for a, b in along)

    def _clear(self, texts: list[Text]) -> bool:
        return self._clear_boxes([text_box(t) for t in texts])

    def _clear_boxes(self, boxes: list[Box]) -> bool:
        """Whether texts with these boxes stand on the view, clear of every line and text."""
        for box in boxes:
            b = inflate(box, CLEAR)
            if not self._inside(b) or self.obstacles.line_hits(b) or self.obstacles.text_hits(b):
                return False
        return True

    def _inside(self, b: Box) -> bool:
        lo = self.view.box
        return b[0] >= lo[0] and b[1] >= lo[1] and b[2] <= lo[2] and b[3] <= lo[3]

    def _commit(self, dim: Dimension, ext: list[Seg], dimline: list[Seg] = ()) -> Dimension:  # type: ignore[assignment]
        self.obstacles.add_item(dim)
        self.obstacles.add_ext(ext)
        self.obstacles.add_dimlines(dimline)
        self.placed.append(dim)
        return dim

    # ---------------------------------------------------------------- linear and diameter
    @staticmethod
    def _extension_lines(fr: _Frame, p1, p2, c: float, half: bool) -> list[Seg]:  # type: ignore[no-untyped-def]
        """The extension lines of a linear dimension (or half-shown diameter) with its line at v = c."""
        ext: list[Seg] = []
        for (u, v) in (fr.uv(p1), fr.uv(p2)) if not half else (fr.uv(p2),):
            if abs(v - c) > 1e-9:
                sign = 1.0 if c > v else -1.0
                ext.append((fr.xy(u, v), fr.xy(u, c + sign * EXT_OVER)))
        return ext

    @staticmethod
    def _text_spots(fr: _Frame, p1, p2, half: bool, mode: int, w: float) -> list[float]:  # type: ignore[no-untyped-def]
        """Where along the line (u of its left end) a text ``w`` long may start, in order of preference:
        mode 0 between the arrows (a half-shown diameter: between the axis and its arrow), 1 beyond the
        upper end, 2 beyond the lower end. The same in every lane."""
        (u1, _), (u2, _) = fr.uv(p1), fr.uv(p2)
        lo, hi = (u1, u2) if u1 <= u2 else (u2, u1)
        span = hi - lo
        base_u: list[float] = []
        room = span - (2 * ARROW + 2.0 if not half else ARROW + 2.0)
        mid = (lo + hi) / 2 - w / 2
        shifts = [0.0, 2.0, 4.0, 7.0, 10.0]
        if half:
            if mode == 0:  # the text beside the line between the axis and the arrow
                a_lo = (u1 + 1.0) if u1 < u2 else (u2 + ARROW + 1.0)
                a_hi = (u2 - ARROW - 1.0 - w) if u1 < u2 else (u1 - 1.0 - w)
                if a_hi >= a_lo:
                    mid = (a_lo + a_hi) / 2
                    base_u += [mid] + [mid + s * k for k in range(1, 40) for s in (1, -1)
                                       if a_lo <= mid + s * k <= a_hi]
            # (an upper diameter's text may go under the axis, where only the few lower ones run; a lower
            # one's goes past its arrow, away from the upper half's lanes)
            elif mode == 1:
                base_u += [u1 - 4.0 - w - k for k in shifts] if u1 < u2 else [u2 - 1.5 - w - k for k in shifts]
            else:
                base_u += [u2 + 1.5 + k for k in shifts] if u1 < u2 else [u1 + 4.0 + k for k in shifts]
        else:
            if mode == 0 and room >= w:
                base_u += [mid] + [mid + s * k for k in range(1, int(room)) for s in (1, -1)
                                   if lo + ARROW + 1 <= mid + s * k <= hi - ARROW - 1 - w]
            elif mode == 1:
                base_u += [hi + ARROW + 1.5 + k for k in shifts]
            elif mode == 2:
                base_u += [lo - ARROW - 1.5 - w - k for k in shifts]
        return base_u

    def _linear_candidates(self, fr: _Frame, p1, p2, c: float, half: bool,  # type: ignore[no-untyped-def]
                           lines_txt: list[str], w: float, ext: list[Seg], spots: list[float]):
        """Every arrangement of a linear (or half-shown diameter) dimension with its line at v = c, its text
        ``lines_txt`` ``w`` long starting at one of ``spots``, and its extension lines ``ext`` (which do not
        depend on where the text goes), whose texts touch nothing on the sheet."""
        (u1, _), (u2, _) = fr.uv(p1), fr.uv(p2)
        layer, view = "dimension", self.view.name
        lo, hi = (u1, u2) if u1 <= u2 else (u2, u1)
        span = hi - lo
        inside = span >= 2 * ARROW + 1.0 or half
        v_base = c + GAP + self.font.descender * TEXT_HEIGHT
        stack = self._stack(lines_txt)
        for tu in spots:
            places = self._text_places(lines_txt, fr, tu, v_base, stack)
            # the cheap test first, before any text is made: most positions fail here
            if not self._clear_boxes([box_of(at, TEXT_HEIGHT, tw, fr.rotation) for _, at, tw in places]):
                continue
            texts = self._text_items(lines_txt, fr, tu, v_base, view, places)
            t_lo, t_hi = tu, tu + w
            # the dimension line: between the extension lines, out to the text when it stands outside
            if half:
                d_lo, d_hi = (u1 - 3.0, u2) if u1 < u2 else (u2, u1 + 3.0)
                d_lo, d_hi = min(d_lo, t_lo - 1.0), max(d_hi, t_hi + 1.0)
                arrows = [_arrow(fr.xy(u2, c), fr.xy(u2 + (-1 if u1 < u2 else 1), c), layer, view)]
            elif inside and t_lo >= lo and t_hi <= hi:
                d_lo, d_hi = lo, hi
                arrows = [_arrow(fr.xy(lo, c), fr.xy(hi, c), layer, view),
                          _arrow(fr.xy(hi, c), fr.xy(lo, c), layer, view)]
            else:
                # arrows from outside pointing in, the line carried out to the text
                d_lo = min(lo - ARROW - 2.0, t_lo - 1.0)
                d_hi = max(hi + ARROW + 2.0, t_hi + 1.0)
                if inside:
                    arrows = [_arrow(fr.xy(lo, c), fr.xy(hi, c), layer, view),
                              _arrow(fr.xy(hi, c), fr.xy(lo, c), layer, view)]
                else:
                    arrows = [_arrow(fr.xy(lo, c), fr.xy(lo - 1, c), layer, view),
                              _arrow(fr.xy(hi, c), fr.xy(hi + 1, c), layer, view)]
            dline = (fr.xy(d_lo, c), fr.xy(d_hi, c))
            lines = [dline] + ext
            yield texts, lines, ext, arrows, dline

    def _linear_ok(self, texts: list[Text], lines: list[Seg], dline: Seg, half: bool) -> bool:
        """``_ok`` for a linear dimension whose texts passed ``_clear`` in a lane whose extension lines
        passed (nothing placed since): its own lines clear of its texts, its dimension line crossing no
        text, clear of other dimension and extension lines, and (a full dimension's) not cutting the outline."""
        ob = self.obstacles
        for t in texts:
            b = inflate(text_box(t), CLEAR)
            if any(segment_hits_box(a, c, b) for a, c in lines):
                return False
        if ob.crosses_text([dline]) or ob.dimline_too_close([dline]):
            return False
        return half or not ob.crosses_outline(*dline)

    def linear(self, req: DimensionRequest) -> Dimension | None:
        """A linear dimension or a half-shown diameter."""
        v = self.view
        half = req.kind == "diameter"
        vertical = half or req.direction == "radial"
        fr = _Frame(vertical)
        lanes = list(self._lanes(req, vertical))
        lines_txt = text_lines(req)
        w, _ = self._block(lines_txt)
        ob = self.obstacles
        points = {}
        for lower in (False, True):
            if half:
                z, r = req.points[0]
                sign = -1.0 if lower else 1.0
                points[lower] = [v.to_paper((z, 0.0)), v.to_paper((z, sign * abs(r)))]
            else:
                points[lower] = [v.to_paper((p[0], -p[1] if lower else p[1])) for p in req.points]
        # what a lane allows, and where a mode puts the text along the line, do not depend on each other
        # (nothing is placed meanwhile): each lane is judged once (its extension lines kept, None when the
        # lane is out), each mode's text spots listed once per half
        lane_ext: dict[tuple[float, bool], list[Seg] | None] = {}
        spots = {(lower, mode): self._text_spots(fr, pts[0], pts[1], half, mode, w)
                 for lower, pts in points.items() for mode in (0, 1, 2)}
        for mode, (c, lower) in itertools.product((0, 1, 2), lanes):
            if not spots[lower, mode]:
                continue
            pts = points[lower]
            if (c, lower) not in lane_ext:
                # a lane on or beside another dimension line is out whatever the text does; so is one whose
                # extension lines stand too close to others or cross a text
                (u1, _), (u2, _) = fr.uv(pts[0]), fr.uv(pts[1])
                judged: list[Seg] | None = None
                if not ob.dimline_too_close([(fr.xy(min(u1, u2), c), fr.xy(max(u1, u2), c))]):
                    judged = self._extension_lines(fr, pts[0], pts[1], c, half)
                    if ob.ext_too_close(judged) or ob.crosses_text(judged):
                        judged = None
                lane_ext[c, lower] = judged
            lane = lane_ext[c, lower]
            if lane is None:
                continue
            for texts, lines, ext, arrows, dline in self._linear_candidates(fr, pts[0], pts[1], c, half, lines_txt,
                                                                            w, lane, spots[lower, mode]):
                if self._linear_ok(texts, lines, dline, half) and not ob.crosses_text(_edges(arrows)):
                    strokes = [Stroke(s, "dimension", v.name) for s in lines]
                    text = " / ".join(t.text for t in texts)
                    dim = Dimension(req, tuple(strokes + arrows + texts), dline[0], texts[0].at, text, v.name,
                                    lower)
                    return self._commit(dim, ext, [dline])
        self.failed.append(req)
        return None

    def _lanes(self, req: DimensionRequest, vertical: bool) -> Iterable[tuple[float, bool]]:
        """(v = c of the dimension line, on the lower half) to try, nearest first on the preferred side;
        an axial dimension above the part is measured on the upper half, below it on the lower."""
        x0, y0, x1, y1 = self.bbox
        side = req.side or ("right" if vertical else "")
        # outer edge of the part in v on each side (v = y for horizontal lines, −x for vertical)
        if vertical:
            edges = {"left": -x0, "right": -x1}  # left of the part is larger v
        else:
            edges = {"above": y1, "below": y0}
        opposite = {"left": "right", "right": "left", "above": "below", "below": "above"}
        if not side:  # near the points first (a local dimension: a groove, the cup)
            fr = _Frame(vertical)
            pts = [self.view.to_paper((p[0], -p[1] if req.lower else p[1])) for p in req.points]
            ref = sum(fr.uv(p)[1] for p in pts) / len(pts)
            for k in range(0, 60):
                for s in ((-1, 1) if k else (1,)):
                    yield ref + s * k * 0.5, req.lower
            sides = list(edges)
        else:
            sides = [side, opposite[side]]
        # a half-shown diameter whose half has no room (its extension line would run beside another's, two
        # nearly equal diameters) is shown on the other half of the section, the part's mirror image
        halves = (req.lower, not req.lower) if req.kind == "diameter" and self.mirrored else (req.lower,)
        for half in halves:
            for s in sides:
                base = edges[s]
                direction = 1.0 if s in ("left", "above") else -1.0
                # below the part: on the mirror half, where the view shows one (else from this half's points)
                lower = half if vertical else (s == "below" and self.mirrored)
                k = 0.0
                while k <= self.limit:
                    yield base + direction * (FIRST + k), lower
                    k += 1.0

    # ---------------------------------------------------------------- radius
    def radius(self, req: DimensionRequest) -> Dimension | None:
        """A radius: a leader from the arc with the value on its shoulder; on the section's other half (the
        part's mirror image) when its own half has no room."""
        return self._either_half(req, self._radius_on)

    def _either_half(self, req: DimensionRequest, place_on: Callable[..., Dimension | None],
                     tiers: tuple[tuple, ...] = ((),)) -> Dimension | None:  # type: ignore[type-arg]
        """``place_on(req, lower, *tier)`` on the request's own half, then on the mirror half where the view
        draws one, for each tier in turn (a better tier on either half before a worse one); the request is
        recorded as failed when none has room."""
        for tier in tiers:
            for lower in (req.lower, not req.lower) if self.mirrored else (req.lower,):
                dim = place_on(req, lower, *tier)
                if dim is not None:
                    return dim
        self.failed.append(req)
        return None

    def _radius_on(self, req: DimensionRequest, lower: bool) -> Dimension | None:
        v = self.view
        flip = (lambda p: (p[0], -p[1])) if lower else (lambda p: p)
        c = v.to_paper(flip(req.points[0]))
        r = math.dist(req.points[0], req.points[1]) * v.scale
        a_mid = math.atan2(flip(req.points[1])[1] - flip(req.points[0])[1], flip(req.points[1])[0] - flip(req.points[0])[0])
        sweep = 0.0
        if len(req.points) == 4:  # the arc's ends: the leader may leave anywhere along it, radially
            a0 = math.atan2(flip(req.points[2])[1] - flip(req.points[0])[1], flip(req.points[2])[0] - flip(req.points[0])[0])
            sweep = abs(((a_mid - a0 + math.pi) % (2 * math.pi)) - math.pi) * 2
        lines_txt = text_lines(req)
        w, _ = self._block(lines_txt)
        spots = []  # (point on the arc, leader direction): radial first (ISO 129-1), off-radial last
        for frac in (0.0, -0.2, 0.2, -0.35, 0.35, -0.45, 0.45):
            am = a_mid + frac * sweep
            m = (c[0] + r * math.cos(am), c[1] + r * math.sin(am))
            out = 1.0
            if self.solid((m[0] + 0.3 * math.cos(am), m[1] + 0.3 * math.sin(am))):  # concave: toward the centre
                out = -1.0
            spots.append((m, am if out > 0 else am + math.pi, 0))
        m0, base_angle, _ = spots[0]
        spots += [(m0, base_angle + math.radians(off), 1) for off in (15, -15, 30, -30, 45, -45, 60, -60)]
        for length, (m, a, _) in [(L, s) for s in spots for L in (6.0, 9.0, 12.0, 16.0, 21.0, 27.0, 34.0, 42.0,
                                                                   52.0, 64.0)]:
            if True:
                tip = m
                # the leader leaves the arc along the direction a
                knee = (tip[0] + length * math.cos(a), tip[1] + length * math.sin(a))
                for right in ((True, False) if math.cos(a) >= 0 else (False, True)):
                    end = (knee[0] + (w + 1.0 if right else -(w + 1.0)), knee[1])
                    t_u = knee[0] + 0.5 if right else end[0] + 0.5
                    texts = self._text_items(lines_txt, _Frame(False), t_u,
                                             knee[1] + GAP + self.font.descender * TEXT_HEIGHT, v.name)
                    leader = (tip, knee)
                    shoulder = (knee, end)
                    lines = [leader, shoulder]
                    # the leader must stay in the open: it may not cut the outline or run through material
                    mid = ((tip[0] + knee[0]) / 2, (tip[1] + knee[1]) / 2)
                    if self.solid(mid) or self.solid(knee):
                        continue
                    start = (tip[0] + 0.2 * math.cos(a), tip[1] + 0.2 * math.sin(a))
                    arrow = _arrow(tip, knee, "dimension", v.name)
                    # the arrowhead's edges, as wide as it is drawn, clear of every text as well as its leader
                    if self._ok(texts, lines + _edges([arrow]), [shoulder, leader], [(start, knee), shoulder]):
                        strokes = [Stroke(s, "dimension", v.name) for s in lines]
                        dim = Dimension(req, tuple(strokes + [arrow] + texts), knee, texts[0].at,
                                        " / ".join(t.text for t in texts), v.name, lower)
                        return self._commit(dim, [shoulder, leader])
        return None

    # ---------------------------------------------------------------- angle
    def angle(self, req: DimensionRequest) -> Dimension | None:
        """An angle between a part's edge and a plane: the arc across it with its value; on the section's
        other half (the part's mirror image, the angle turning the other way) when its own half has no room."""
        # the value beside its arc (ISO 129-1: next to its dimension line) on either half before it stands
        # farther off
        return self._either_half(req, self._angle_on, ((ANGLE_TEXT_NEAR,), (ANGLE_TEXT_FAR,)))

    def _angle_on(self, req: DimensionRequest, lower: bool, offsets: tuple[float, ...]) -> Dimension | None:
        v = self.view
        pts = [v.to_paper((p[0], -p[1]) if lower else p) for p in req.points]
        o, p1, p2 = pts
        a1 = math.atan2(p1[1] - o[1], p1[0] - o[0])
        a2 = math.atan2(p2[1] - o[1], p2[0] - o[0])
        # the angle runs counter-clockwise from the edge to the plane as given; its mirror image the other way
        a_start, sweep = (a2, (a1 - a2) % (2 * math.pi)) if lower else (a1, (a2 - a1) % (2 * math.pi))
        edge1 = math.dist(o, p1)  # the first ray is an edge of the part this long; the second is a plane
        lines_txt = text_lines(req)
        w, depth = self._block(lines_txt)
        h = TEXT_HEIGHT
        for rho in (0.55 * edge1, 0.7 * edge1, 0.4 * edge1, 0.85 * edge1, 14.0, 18.0, 22.0, 27.0, 33.0, 40.0, 10.0,
                    48.0, 56.0):
            if rho < 2 * ARROW + 2:
                continue
            steps = max(4, int(math.degrees(sweep) / 5))
            arc_pts = tuple((o[0] + rho * math.cos(a_start + sweep * k / steps),
                             o[1] + rho * math.sin(a_start + sweep * k / steps)) for k in range(steps + 1))
            arc_segs = list(zip(arc_pts, arc_pts[1:]))
            ext: list[Seg] = []
            for a, real in ((a1, edge1), (a2, 0.0)):
                if rho > real:
                    start = real + (0.0 if real > 0 else 1.0)
                    ext.append(((o[0] + start * math.cos(a), o[1] + start * math.sin(a)),
                                (o[0] + (rho + EXT_OVER) * math.cos(a), o[1] + (rho + EXT_OVER) * math.sin(a))))
            for frac in (0.5, 0.35, 0.65, 0.2, 0.8, 0.1, 0.9):
                am = a_start + sweep * frac
                for extra in offsets:
                    # the text's centre outside the arc, far enough that its box clears it
                    cx = o[0] + (rho + extra) * math.cos(am)
                    cy = o[1] + (rho + extra) * math.sin(am)
                    out = 1.0 if extra > 0 else -1.0  # the text outside the arc, or inside it
                    dx = out * (w / 2 + CLEAR + 0.3) * (1 if math.cos(am) >= 0 else -1) * (abs(math.cos(am)) > 0.2)
                    dy = out * (depth / 2 + CLEAR + 0.3) * (1 if math.sin(am) >= 0 else -1) * (abs(math.sin(am)) > 0.2)
                    cx, cy = cx + dx, cy + dy
                    baseline = cy - depth / 2 + self.font.descender * h
                    texts = self._text_items(lines_txt, _Frame(False), cx - w / 2, baseline, v.name)
                    lines = arc_segs + ext
                    arrows = [_arrow(arc_pts[0], arc_pts[1], "dimension", v.name),
                              _arrow(arc_pts[-1], arc_pts[-2], "dimension", v.name)]
                    if self._ok(texts, lines + _edges(arrows), ext, arc_segs):
                        bulge = math.tan(sweep / 4)
                        arc = Stroke((arc_pts[0], arc_pts[-1]), "dimension", v.name, bulges=(bulge,))
                        strokes = [arc] + [Stroke(s, "dimension", v.name) for s in ext]
                        dim = Dimension(req, tuple(strokes + arrows + texts), arc_pts[len(arc_pts) // 2],
                                        texts[0].at, " / ".join(t.text for t in texts), v.name, lower)
                        return self._commit(dim, ext)
        return None

    def place(self, requests: list[DimensionRequest], auxiliary_last: bool = False) -> list[Dimension]:
        """Place every request; nearest-to-the-part first on each side so lanes nest without crossings.
        ``auxiliary_last``: the auxiliary dimensions after all the others (they follow from them, and
        one placed early can take the only room a functional size has)."""
        def order(req: DimensionRequest) -> tuple:  # type: ignore[type-arg]
            last = auxiliary_last and req.auxiliary
            if req.kind == "diameter":
                return (last, 0, req.side, abs(req.points[0][1]))
            if req.kind == "linear":
                return (last, 2 if not req.side else 1, req.side, measure(req))
            return (last, 3 if req.kind == "radius" else 4, "", 0.0)
        out = []
        for req in sorted(requests, key=order):
            if req.kind in ("linear", "diameter"):
                dim = self.linear(req)
            elif req.kind == "radius":
                dim = self.radius(req)
            else:
                dim = self.angle(req)
            if dim is not None:
                out.append(dim)
        return out
