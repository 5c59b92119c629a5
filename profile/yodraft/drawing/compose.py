"""Composing the shop drawing once, as data on paper (``sheetdata.Sheet``): the section at an ISO 5455
scale with its dimensions, the enlarged seat detail, datum and runout callouts, notes, cautions,
revisions and the title block, on A3 (or A2 when the view needs it).

The blocks are stacked by their measured extents, so nothing overlaps: the main view on the left, the
detail and the revision block across the top right, cautions and notes under them, the title block in
the lower right corner (ISO 5457 frame, ISO 7200 title block).
"""
from __future__ import annotations

import math
from collections.abc import Sequence
from dataclasses import dataclass, replace
from typing import NamedTuple

import shapely

from ..builder import Resolved
from ..geometry import Arc, Line, Point, Profile
from .clip import clip_segments
from .layout import CLEAR, EXT_MIN_GAP, TEXT_HEIGHT, Box, Obstacles, Placer, boxes_overlap, inflate, segment_hits_box
from .lettering import PITCH, Lettering, lettering
from .notes import SheetData, caution_lines, fit_lines, numbered, sheet_number, shop_lines
from .numbers import size_text
from .requests import (DATUM_A_KEY, DimensionRequest, crowd_region, datum_face_z, detail_region, detail_requests,
                       enlargeable, section_requests, text_lines)
from .sheetdata import (Circle, Dimension, Fill, Hatch, Item, Sheet, Stroke, Text, View, segments_of, text_box,
                        translate)

__all__ = ["compose", "PAPERS", "SCALES", "DETAIL_SCALES", "scale_text", "HATCH_SPACING", "SheetTooSmall", "left_off_line"]

PAPERS = {"A3": (420.0, 297.0), "A2": (594.0, 420.0)}  # ISO 216, landscape
SCALES = (5.0, 2.0, 1.0, 0.5, 0.2)  # ISO 5455 preferred scales
DETAIL_SCALES = (20.0, 10.0, 5.0, 2.0)  # ISO 5455 enlargements
#: the enlarged detail of a section too crowded for some of its sizes: its letter (A and B are the datums, C the
#: seat's detail, D the ring's) and its view's name, which is also its DXF block's
CROWD_LETTER, CROWD_VIEW = "E", "detail-e"
HATCH_SPACING = 3.0  # mm on paper (ISO 128-50: at least 0.7 mm) (from memory)
GAP = 5.0  # clear paper between blocks
PAD = 4.0  # clear paper inside the detail frame
TITLE_WIDTH = 180.0  # ISO 7200 largest width
ROW = 14.0  # title block row: label over up to three lines of value
LABEL_HEIGHT = 2.5  # ISO 3098-1 nominal size of the field labels
VALUE_SIZES = (3.5, 2.5, 1.8)  # ISO 3098-1 sizes a value may shrink to
REV_COLUMNS = (0.0, 12.0, 40.0)  # letter, date, what changed
RUNOUT_W = (8.0, 16.0, 8.0)  # compartments of a tolerance frame: symbol, value (at least), datum
RUNOUT_H = 7.0
RUNOUT_TEXT = 3.5  # the frame's value and datum letter, as tall as the sizes' text
RUNOUT_MARGIN = 2.0  # clear space each side of a long value in its compartment


class SheetTooSmall(Exception):
    """The blocks do not fit this paper at this scale (the composer then tries the next choice)."""


def scale_text(s: float) -> str:
    """ISO 5455 notation: ``2:1``, ``1:1``, ``1:2``.

    >>> scale_text(2.0), scale_text(1.0), scale_text(0.2)
    ('2:1', '1:1', '1:5')
    """
    return f"{s:g}:1" if s >= 1 else f"1:{1 / s:g}"


def frame_of(paper: tuple[float, float]) -> tuple[float, float, float, float]:
    """ISO 5457: 20 mm filing margin on the left, 10 mm elsewhere."""
    return (20.0, 10.0, paper[0] - 10.0, paper[1] - 10.0)


# ------------------------------------------------------------------ small helpers
def _text(font: Lettering, s: str, at: tuple[float, float], h: float = TEXT_HEIGHT, align: str = "left",
          rotation: float = 0.0, layer: str = "text", view: str = "paper") -> Text:
    """A text whose baseline's left end, centre or right end is at ``at``."""
    w = font.width(s, h)
    x = at[0] - {"left": 0.0, "center": w / 2, "right": w}[align]
    return Text(s, (x, at[1]), h, w, rotation, layer, view, font.descender)


def wrap(font: Lettering, text: str, h: float, width: float) -> list[str]:
    """``text`` broken into lines at most ``width`` wide at cap height ``h`` (words first, then characters)."""
    lines: list[str] = []
    for paragraph in text.split("\n"):
        line = ""
        for word in paragraph.split(" "):
            trial = f"{line} {word}" if line else word
            if font.width(trial, h) <= width:
                line = trial
                continue
            if line:
                lines.append(line)
            line = ""
            for ch in word:  # a word longer than the line breaks between characters
                if line and font.width(line + ch, h) > width:
                    lines.append(line)
                    line = ch
                else:
                    line += ch
        lines.append(line)
    return lines


def _rect(x0: float, y0: float, x1: float, y1: float, layer: str, view: str = "paper",
          weight: float | None = None) -> Stroke:
    return Stroke(((x0, y0), (x1, y0), (x1, y1), (x0, y1)), layer, view, closed=True, weight=weight)


def _bbox(items: list[Item]) -> tuple[float, float, float, float]:
    xs: list[float] = []
    ys: list[float] = []
    for it in items:
        for a, b in segments_of(it):
            xs += [a[0], b[0]]
            ys += [a[1], b[1]]
        if isinstance(it, (Text, Dimension)):
            for t in ([it] if isinstance(it, Text) else [s for s in it.items if isinstance(s, Text)]):
                b = text_box(t)
                xs += [b[0], b[2]]
                ys += [b[1], b[3]]
    return (min(xs), min(ys), max(xs), max(ys))


def _profile_stroke(profile: Profile, view: View, layer: str = "outline") -> Stroke:
    pts = tuple(view.to_paper(s.start) for s in profile.segments)
    bulges = tuple(s.bulge if isinstance(s, Arc) else 0.0 for s in profile.segments)
    return Stroke(pts, layer, view.name, closed=True, bulges=bulges)


def _section_strokes(profile: Profile, view: View) -> list[Stroke]:
    """The section's outline: the half's loop and its mirror's, joined into one closed loop where they
    share an edge on the axis (there the section is solid metal and only the centre line runs, ISO 128-3).
    A half that never, or more than once, runs along the axis keeps its two loops (open at the axis)."""
    def runs(loop: Profile) -> list[list]:  # type: ignore[type-arg]
        segs = list(loop.segments)
        axial = [isinstance(x, Line) and abs(x.start[1]) < 1e-9 and abs(x.end[1]) < 1e-9 for x in segs]
        if not any(axial):
            return [segs]
        k = axial.index(True)
        segs, axial = segs[k:] + segs[:k], axial[k:] + axial[:k]
        out, run = [], []  # type: ignore[var-annotated]
        for seg, on in zip(segs, axial):
            if on and run:
                out.append(run)
                run = []
            elif not on:
                run.append(seg)
        if run:
            out.append(run)
        return out

    def stroke(pieces: list, closed: bool) -> Stroke:  # type: ignore[type-arg]
        pts = tuple(view.to_paper(x.start) for x in pieces) + (() if closed else (view.to_paper(pieces[-1].end),))
        return Stroke(pts, "outline", view.name, closed=closed,
                      bulges=tuple(x.bulge if isinstance(x, Arc) else 0.0 for x in pieces))

    upper, lower = runs(profile), runs(profile.mirrored())
    one_gap = len(upper) == 1 and len(lower) == 1 and any(
        isinstance(x, Line) and abs(x.start[1]) < 1e-9 and abs(x.end[1]) < 1e-9 for x in profile.segments)
    if one_gap:
        a, b = upper[0], lower[0]
        if math.dist(b[0].start, a[-1].end) > 1e-9:  # run the mirror back from where the half ends
            b = [_reversed(x) for x in reversed(b)]
        return [stroke(a + b, closed=True)]
    return [stroke(run, closed=False) for run in upper + lower]


def _reversed(seg: Line | Arc) -> Line | Arc:
    """The same edge walked the other way."""
    if isinstance(seg, Line):
        return Line(seg.end, seg.start)
    return Arc(seg.center, seg.radius, seg.start_angle + seg.sweep, -seg.sweep)


def _hatch_lines(polys: list[shapely.Polygon], origin: tuple[float, float], spacing: float,
                 angle: float = 45.0) -> list[tuple[tuple[float, float], tuple[float, float]]]:
    """Section lines at ``angle`` ``spacing`` apart, one through ``origin``, cut to the polygons (paper)."""
    out = []
    a = math.radians(angle)
    ux, uy = math.cos(a), math.sin(a)
    nx, ny = -uy, ux
    for poly in polys:
        x0, y0, x1, y1 = poly.bounds
        corners = [(x0, y0), (x1, y0), (x1, y1), (x0, y1)]
        rel = [((cx - origin[0]) * nx + (cy - origin[1]) * ny) / spacing for cx, cy in corners]
        along = [(cx - origin[0]) * ux + (cy - origin[1]) * uy for cx, cy in corners]
        lo, hi = min(along) - 1, max(along) + 1
        lines = []
        for k in range(math.floor(min(rel)), math.ceil(max(rel)) + 1):
            ox, oy = origin[0] + nx * k * spacing, origin[1] + ny * k * spacing
            lines.append(((ox + ux * lo, oy + uy * lo), (ox + ux * hi, oy + uy * hi)))
        cut = shapely.MultiLineString(lines).intersection(poly)
        for g in getattr(cut, "geoms", [cut]):
            if g.geom_type == "LineString" and g.length > 1e-6:
                c = list(g.coords)
                out.append(((c[0][0], c[0][1]), (c[-1][0], c[-1][1])))
            elif g.geom_type == "MultiLineString":
                for h in g.geoms:
                    c = list(h.coords)
                    out.append(((c[0][0], c[0][1]), (c[-1][0], c[-1][1])))
    return sorted(out)


#: section lining of each further part of a half (a ring): adjacent parts differ in direction and
#: spacing (ISO 128-50)
PART_HATCH = (135.0, HATCH_SPACING / 2)


def _hatch(polys_model: list[shapely.Polygon], view: View, loops: tuple[Stroke, ...], angle: float = 45.0,
           spacing: float = HATCH_SPACING) -> Hatch:
    s = view.scale
    paper = [shapely.transform(p, lambda c: c * s + [view.origin[0], view.origin[1]]) for p in polys_model]
    lines = _hatch_lines(paper, view.origin, spacing, angle)
    return Hatch(loops, angle, spacing, view.origin, tuple(lines), "hatch", view.name)


def part_items(resolved: Resolved, view: View) -> list[Item]:
    """Each further part of the half (a ring) in the section: its outline and mirror, hatched in its own way."""
    out: list[Item] = []
    for part in resolved.parts[1:]:
        up, low = _profile_stroke(part.profile, view), _profile_stroke(part.profile.mirrored(), view)
        out += [up, low, _hatch([part.profile.polygon(), part.profile.mirrored().polygon()], view, (up, low),
                                *PART_HATCH)]
    return out


# ------------------------------------------------------------------ the main view
@dataclass
class _Group:
    """Items of one block of the sheet, in local paper coordinates, and their extent."""

    items: list[Item]
    box: tuple[float, float, float, float]

    def moved(self, dx: float, dy: float) -> "_Group":
        b = self.box
        return _Group([translate(i, dx, dy) for i in self.items], (b[0] + dx, b[1] + dy, b[2] + dx, b[3] + dy))


def _solid_test(profile: Profile, view: View, others: tuple[Profile, ...] = ()):  # type: ignore[no-untyped-def]
    both = shapely.union_all([p.polygon() for q in (profile,) + others for p in (q, q.mirrored())])
    shapely.prepare(both)

    def solid(p: tuple[float, float]) -> bool:
        z, r = view.to_model(p)
        return bool(shapely.contains_xy(both, z, r))
    return solid


def _obstacles(items: list[Item], outline: list[Item]) -> Obstacles:
    ob = Obstacles()
    for it in items:
        ob.add_item(it)
    for it in outline:
        ob.add_outline(segments_of(it))
    return ob


#: how much a view may give up to fit: everything drawn; an auxiliary dimension left out (it follows from
#: the others); and, a last resort better than a size left off, ISO 128-2's 0.7 mm between parallel extension
#: lines waived for a size that finds no room otherwise, its lanes sought half as far out again; and, when no
#: paper at full size or larger takes every size, the sizes that find no room left off at full size or larger
#: and named in a note (a reduction is for a part too big for the paper, not for a crowded one)
ALL, WITHOUT_AUXILIARY, SPACING_WAIVED, SIZES_LEFT_OFF = 0, 1, 2, 3


def _main_view(resolved: Resolved, scale: float, font: Lettering, data: SheetData,
               waive_spacing: bool = False, crowd: "_Crowd | None" = None) -> tuple[_Group, View, list, bool]:
    """The section with its dimensions, datums and runout; the requests that found no room (with
    ``waive_spacing``, only functional ones: the auxiliary ones are left out, see ``SPACING_WAIVED``); and
    whether the outer diameter's runout frame found room.
    ``crowd``: the region of the enlarged detail E, marked on the view, and the sizes it shows instead."""
    profile = resolved.profile
    assert profile is not None
    v = resolved.values
    z_min, _, z_max, R = profile.bounds()
    view = View("main", scale, (0.0, 0.0), (-400.0, -400.0, 400.0, 400.0))
    upper, lower = _profile_stroke(profile, view), _profile_stroke(profile.mirrored(), view)
    hatch = _hatch([profile.polygon(), profile.mirrored().polygon()], view, (upper, lower))
    section = _section_strokes(profile, view)
    over = 4.0
    axis = Stroke((view.to_paper((z_min, 0.0)), view.to_paper((z_max, 0.0))), "centre", "main")
    axis = Stroke(((axis.points[0][0] - over, 0.0), (axis.points[1][0] + over, 0.0)), "centre", "main")
    z0 = v["bearing_seat.post_face_z"]
    r_t = v["axle_bore.major_diameter"] / 2
    end = z0 + v["axle_bore.thread_depth"]
    thread = [Stroke((view.to_paper((z0, s * r_t)), view.to_paper((end, s * r_t))), "thread", "main") for s in (1, -1)]
    thread.append(Stroke((view.to_paper((end, -r_t)), view.to_paper((end, r_t))), "thread", "main", weight=0.5))
    items: list[Item] = section + [hatch, axis] + thread + part_items(resolved, view)
    # the detail's region marked on the view (ISO 128-3: narrow frame and its letter)
    region = detail_region(resolved)
    a, b = view.to_paper(region[:2]), view.to_paper(region[2:])
    marker = _rect(a[0], a[1], b[0], b[1], "detail")
    items.append(marker)
    if crowd is not None:
        ea, eb = view.to_paper(crowd.region[:2]), view.to_paper(crowd.region[2:])
        items.append(_rect(ea[0], ea[1], eb[0], eb[1], "detail"))
    bbox = (view.to_paper((z_min, -R))[0], view.to_paper((z_min, -R))[1], view.to_paper((z_max, R))[0],
            view.to_paper((z_max, R))[1])
    solid = _solid_test(profile, view, tuple(p.profile for p in resolved.parts[1:]))
    requests = section_requests(resolved)
    if crowd is not None:
        requests = [r for r in requests if r not in crowd.shown]
    outline = section + [i for i in part_items(resolved, view) if isinstance(i, Stroke)]
    ob = _obstacles(items, outline)
    placer = Placer(view, font, ob, solid, bbox)
    dims = placer.place(requests)
    if any(not r.auxiliary for r in placer.failed):
        # a functional size found no room: placed again with the auxiliary dimensions last (an early one can
        # take the only lane a functional size has)
        ob = _obstacles(items, outline)
        placer = Placer(view, font, ob, solid, bbox)
        dims = placer.place(requests, auxiliary_last=True)
    if waive_spacing:
        waived = [r for r in placer.failed if not r.auxiliary]
        placer.failed.clear()
        ob.ext_min_gap, placer.limit = 0.0, 1.5 * placer.limit  # and lanes sought farther out
        dims += placer.place(waived)
        ob.ext_min_gap = EXT_MIN_GAP
    items += dims
    # the detail letter beside its frame, in open paper
    letter = _place_text(font, ob, "C", [(a[0] - 1.5, (a[1] + b[1]) / 2, "right"), (a[0] - 1.5, b[1] + 1.0, "right"),
                                         ((a[0] + b[0]) / 2, b[1] + 1.5, "center"), (b[0] + 1.5, b[1] + 1.0, "left"),
                                         (a[0] - 1.5, b[1] + 4.0, "right"), (a[0] - 5.0, b[1] + 6.0, "right")]
                          + _around(a, b))
    items.append(letter)
    ob.add_item(letter)
    if crowd is not None:
        letter = _place_text(font, ob, CROWD_LETTER, _around(ea, eb))
        items.append(letter)
        ob.add_item(letter)
    # datum A on the dimension line of the datum feature; datum B on the outer face itself
    items += _datum(font, ob, [d for d in dims if DATUM_A_KEY in d.request.keys], "A")
    items += _datum_face(font, ob, view, profile, datum_face_z(resolved), "B")
    # runout of the rim's outer diameter, on the upper half's outline or else the lower half's (the same surface)
    z_od = v["catch_zone.end_z"] + 0.25 * (v["rim.face_z"] - v["catch_zone.end_z"])
    runout: list[Item] = []
    for target, up in _runout_targets(profile, z_od, R):
        runout = _runout(font, ob, view.to_paper(target), data.runout_mm, up=up)
        if runout:
            break
    items += runout
    return _Group(items, _bbox(items)), view, placer.failed, bool(runout)


def _runout_targets(profile: Profile, z_od: float, R: float) -> list[tuple[Point, bool]]:
    """Where the outer diameter's runout frame may point, (z, r) and whether the frame stands above: a quarter
    along the rim band, then along every stretch of the outline at the outer diameter, in the upper half and
    then the same in the lower half."""
    bands = [seg for seg in profile.segments if isinstance(seg, Line) and abs(seg.start[1] - R) < 1e-9
             and abs(seg.end[1] - R) < 1e-9]
    along = [(seg.start[0] + t * (seg.end[0] - seg.start[0]), R) for seg in bands for t in (0.5, 0.25, 0.75)]
    upper = [(z_od, R)] + along
    return [(p, True) for p in upper] + [((z, -r), False) for z, r in upper]


def _around(a: tuple[float, float], b: tuple[float, float]) -> list[tuple[float, float, str]]:
    """Spots (x, y, align) for a frame's letter round the frame from corner ``a`` to ``b``, farther out each ring."""
    mid_x, mid_y = (a[0] + b[0]) / 2, (a[1] + b[1]) / 2
    out = []
    for d in (1.5, 3.0, 5.0, 8.0, 12.0):
        out += [(a[0] - d, b[1] + d, "right"), (mid_x, b[1] + d, "center"), (b[0] + d, b[1] + d, "left"),
                (b[0] + d, mid_y, "left"), (b[0] + d, a[1] - d - TEXT_HEIGHT, "left"),
                (mid_x, a[1] - d - TEXT_HEIGHT, "center"), (a[0] - d, a[1] - d - TEXT_HEIGHT, "right"),
                (a[0] - d, mid_y, "right")]
    return out


def _place_text(font: Lettering, ob: Obstacles, s: str, spots, h: float = TEXT_HEIGHT) -> Text:  # type: ignore[no-untyped-def]
    """The first of ``spots`` (x, y, align) where ``s`` touches nothing (else the first)."""
    first = None
    for x, y, align in spots:
        t = _text(font, s, (x, y), h, align)
        first = first or t
        box = inflate(text_box(t), CLEAR)
        if not ob.line_hits(box) and not ob.text_hits(box):
            return t
    assert first is not None
    return first


def _datum_face(font: Lettering, ob: Obstacles, view: View, profile: Profile, z: float, letter: str) -> list[Item]:
    """ISO 5459 datum feature indicator on a flat face at ``z`` (upper half): the filled triangle's base on
    the face's outline, a leader out beyond the face (+z), the framed letter at its end."""
    faces = [x for x in profile.segments if isinstance(x, Line) and abs(x.start[0] - z) < 1e-9 and abs(x.end[0] - z) < 1e-9]
    if not faces:
        return []
    face = max(faces, key=lambda x: abs(x.end[1] - x.start[1]))
    r0, r1 = sorted((face.start[1], face.end[1]))
    s, size = 3.0, 7.0
    for share in (0.5, 0.3, 0.7, 0.15, 0.85):
        x, y = view.to_paper((z, r0 + share * (r1 - r0)))
        for reach in (4.0, 7.0, 10.0, 14.0):
            for rise in (0.0, 6.0, -6.0, 10.0, -10.0):
                apex = (x + s * 0.87, y)
                tri = Fill(((x, y - s / 2), (x, y + s / 2), apex), "dimension")
                knee = (apex[0] + reach, y)
                end = (knee[0], y + rise)
                parts: list[Item] = [tri, Stroke((apex, knee), "dimension")]
                if rise:
                    parts.append(Stroke((knee, end), "dimension"))
                    cx, cy = end[0], end[1] + (size / 2 if rise > 0 else -size / 2)
                else:
                    cx, cy = knee[0] + size / 2, y
                box = (cx - size / 2, cy - size / 2, cx + size / 2, cy + size / 2)
                parts += [_rect(*box, "dimension"), _text(font, letter, (cx, cy - TEXT_HEIGHT / 2), align="center")]
                if _place_if_free(ob, parts, box):
                    return parts
    return []


def _place_if_free(ob: Obstacles, parts: list[Item], box: Box) -> bool:
    """Put a datum callout (``parts``, its frame ``box``) on the sheet when it touches nothing there."""
    # the frame's box first: the cheapest test, and the one that fails most
    if not ob.line_hits(inflate(box, 0.3)) and not ob.text_hits(inflate(box, CLEAR)) and _free(ob, parts):
        for p in parts:
            ob.add_item(p)
        ob.add_box(box)
        return True
    return False


def _free(ob: Obstacles, items: list[Item], within: tuple[float, float, float, float] | None = None) -> bool:
    """Whether ``items`` (a callout) touch nothing on the sheet: their texts clear of lines and texts,
    their lines clear of texts."""
    segs = [s for it in items for s in segments_of(it)]
    if ob.crosses_text(segs):
        return False
    for it in items:
        if isinstance(it, Text):
            box = inflate(text_box(it), CLEAR)
            if ob.line_hits(box) or ob.text_hits(box):
                return False
            if within is not None and not (box[0] >= within[0] and box[1] >= within[1]
                                           and box[2] <= within[2] and box[3] <= within[3]):
                return False
    # a callout's frame may not enclose or cross another text
    return True


def _datum(font: Lettering, ob: Obstacles, dims: list[Dimension], letter: str) -> list[Item]:
    """ISO 5459 datum feature indicator in line with a diameter's dimension line: filled triangle at its
    arrow, a short line, the framed letter."""
    if not dims:
        return []
    dim = dims[0]
    line = next(i for i in dim.items if isinstance(i, Stroke))
    (x, y0), (_, y1) = line.points
    s = 3.0
    size = 7.0
    # in line with the dimension line, beyond either of its ends (the arrow's end first)
    arrow = next(i for i in dim.items if isinstance(i, Fill))
    ends = sorted((y0, y1), key=lambda y: abs(y - arrow.points[0][1]))
    for end_y in ends:
        outward = 1.0 if end_y >= (y0 + y1) / 2 else -1.0
        for reach in (4.0, 7.0, 10.0, 14.0, 19.0):
            for side in (-1.0, 1.0, 0.0):
                base = (x, end_y)
                apex = (x, base[1] + outward * s * 0.87)
                tri = Fill(((x - s / 2, base[1]), (x + s / 2, base[1]), apex), "dimension")
                knee = (x, apex[1] + outward * reach)
                parts: list[Item] = [tri, Stroke((apex, knee), "dimension")]
                if side:
                    end = (x + side * 5.0, knee[1])
                    parts.append(Stroke((knee, end), "dimension"))
                    cx = end[0] + side * size / 2
                    cy = knee[1]
                else:
                    cx, cy = x, knee[1] + outward * size / 2
                frame = _rect(cx - size / 2, cy - size / 2, cx + size / 2, cy + size / 2, "dimension")
                t = _text(font, letter, (cx, cy - TEXT_HEIGHT / 2), align="center")
                parts += [frame, t]
                box = (cx - size / 2, cy - size / 2, cx + size / 2, cy + size / 2)
                if _place_if_free(ob, parts, box):
                    return parts
    return []


ARROW_LEN = 0.0  # the triangle sits on the arrow's tip


def _runout(font: Lettering, ob: Obstacles, target: tuple[float, float], value: float, up: bool,
            within: tuple[float, float, float, float] | None = None) -> list[Item]:
    """A circular-runout tolerance frame (ISO 1101: symbol | value | A) with a leader to ``target``."""
    width = sum(_runout_widths(font, value))
    sign = 1.0 if up else -1.0
    for dy in (12.0, 16.0, 20.0, 25.0, 30.0, 36.0, 44.0, 8.0):
        for dx in (-40.0, -30.0, -50.0, -20.0, -60.0, 10.0, 20.0, -70.0, -80.0):
            x = target[0] + dx
            y = target[1] + sign * dy
            box = (x, y, x + width, y + RUNOUT_H)
            if within is not None and not (box[0] >= within[0] and box[1] >= within[1] and box[2] <= within[2]
                                           and box[3] <= within[3]):
                continue
            # the frame's box first, before the frame is drawn: the cheapest test, and the one that fails most
            if ob.line_hits(inflate(box, 0.3)) or ob.text_hits(inflate(box, CLEAR)):
                continue
            parts = _runout_frame(font, (x, y), target, value)
            leader = [s for p in parts[-3:-1] for s in segments_of(p)]
            if _free(ob, parts) and not any(ob.crosses_outline(a, b) for a, b in leader[:-1]):
                for p in parts:
                    ob.add_item(p)
                ob.add_box(box)
                return parts
    return []


def _runout_widths(font: Lettering, value: float) -> tuple[float, float, float]:
    """The frame's compartments: the value's widened to hold a long value (a loose grade at a slow spin)."""
    symbol, least, datum = RUNOUT_W
    return symbol, max(least, font.width(f"{value:.3f}", RUNOUT_TEXT) + 2 * RUNOUT_MARGIN), datum


def _runout_frame(font: Lettering, at: tuple[float, float], target: tuple[float, float], value: float) -> list[Item]:
    x, y = at
    h = RUNOUT_H
    xs = [x]
    for w in _runout_widths(font, value):
        xs.append(xs[-1] + w)
    parts: list[Item] = [_rect(xs[0], y, xs[-1], y + h, "dimension")]
    parts += [Stroke(((xi, y), (xi, y + h)), "dimension") for xi in xs[1:-1]]
    cx, cy = xs[0] + 4.0, y + 3.5
    a, b = (cx - 2.0, cy - 2.0), (cx + 2.0, cy + 2.0)
    parts.append(Stroke((a, b), "dimension"))
    ang = math.radians(45)
    left = (b[0] - 1.6 * math.cos(ang - 0.4), b[1] - 1.6 * math.sin(ang - 0.4))
    right = (b[0] - 1.6 * math.cos(ang + 0.4), b[1] - 1.6 * math.sin(ang + 0.4))
    parts.append(Fill((b, left, right), "dimension"))
    for s, cxi in ((f"{value:.3f}", (xs[1] + xs[2]) / 2), ("A", (xs[2] + xs[3]) / 2)):
        parts.append(_text(font, s, (cxi, y + h / 2 - TEXT_HEIGHT / 2), RUNOUT_TEXT, align="center"))
    mid = y + h / 2
    start = (xs[-1], mid) if target[0] > xs[-1] else (xs[0], mid)
    if xs[0] <= target[0] <= xs[-1]:
        start = (target[0], y if target[1] < y else y + h)
        knee = start
    else:
        knee = (target[0], mid)
    parts.append(Stroke((start, knee), "dimension"))
    parts.append(Stroke((knee, target), "dimension"))
    d = 1.0 if knee[1] > target[1] else -1.0
    parts.append(Fill((target, (target[0] - 0.8, target[1] + d * 3.0), (target[0] + 0.8, target[1] + d * 3.0)),
                      "dimension"))
    return parts


# ------------------------------------------------------------------ the detail
def _detail(resolved: Resolved, scale: float, font: Lettering, data: SheetData) -> tuple[_Group, View, list]:
    profile = resolved.profile
    assert profile is not None
    v = resolved.values
    region = detail_region(resolved)
    view = View("detail", scale, (0.0, 0.0), (-400.0, -400.0, 400.0, 400.0))
    items, outline = _clipped(profile, region, view)
    r_t = v["axle_bore.major_diameter"] / 2
    z0 = v["bearing_seat.post_face_z"]
    items.append(Stroke((view.to_paper((z0, r_t)), view.to_paper((region[2], r_t))), "thread", "detail"))
    items.append(Stroke((view.to_paper((region[0], 0.0)), view.to_paper((region[2], 0.0))), "centre", "detail"))
    ob = _obstacles(items, outline)
    a, b = view.to_paper(region[:2]), view.to_paper(region[2:])
    placer = Placer(view, font, ob, _solid_test(profile, view), (a[0], a[1], b[0], b[1]), mirrored=False)
    dims = placer.place(detail_requests(resolved))
    items += dims
    items += _datum(font, ob, [d for d in dims if DATUM_A_KEY in d.request.keys], "A")
    # runout of the seat: on the post's surface, between the post face and the wall face
    z_post, z_wall = v["bearing_seat.post_face_z"], v["bearing_seat.wall_face_z"]
    target = view.to_paper((z_post + 0.5 * (min(z_wall, v["bearing_seat.seat_face_z"]) - z_post),
                            v["bearing_seat.post_diameter"] / 2))
    items += _runout(font, ob, target, data.runout_mm, up=True)
    return _Group(items, _bbox(items)), view, placer.failed


def _clipped(profile: Profile, region: tuple[float, float, float, float], view: View,
             hatch: tuple[float, ...] = ()) -> tuple[list[Item], list[Item]]:
    """A loop's outline inside ``region`` and its hatch (``hatch``: angle and spacing, else the body's), drawn
    in ``view``: (the items, the outline's strokes)."""
    outline: list[Item] = []
    for seg in clip_segments(profile.segments, region):
        if isinstance(seg, Line):
            st = Stroke((view.to_paper(seg.start), view.to_paper(seg.end)), "outline", view.name)
        else:
            st = Stroke((view.to_paper(seg.start), view.to_paper(seg.end)), "outline", view.name, bulges=(seg.bulge,))
        outline.append(st)
    cut = profile.polygon().intersection(shapely.box(*region))
    polys = [p for p in getattr(cut, "geoms", [cut]) if p.geom_type == "Polygon" and not p.is_empty]
    loops = tuple(Stroke(tuple(view.to_paper(c) for c in list(p.exterior.coords)[:-1]), "hatch", view.name, closed=True)
                  for p in polys)
    return outline + ([_hatch(polys, view, loops, *hatch)] if polys else []), outline


class _Crowd(NamedTuple):
    """The enlarged detail E of a section too crowded for some of its sizes: its region (z_min, r_min, z_max,
    r_max) and the sizes it shows in place of the section."""

    region: tuple[float, float, float, float]
    shown: tuple[DimensionRequest, ...]


def _crowd_detail(resolved: Resolved, crowd: _Crowd, scale: float, font: Lettering) -> tuple[_Group, View, list]:
    """Detail E: the crowded region enlarged, every part in it hatched as in the section, and its sizes."""
    profile = resolved.profile
    assert profile is not None
    region = crowd.region
    view = View(CROWD_VIEW, scale, (0.0, 0.0), (-400.0, -400.0, 400.0, 400.0))
    items, outline = _clipped(profile, region, view)
    for part in resolved.parts[1:]:
        more, more_outline = _clipped(part.profile, region, view, PART_HATCH)
        items += more
        outline += more_outline
    ob = _obstacles(items, outline)
    a, b = view.to_paper(region[:2]), view.to_paper(region[2:])
    placer = Placer(view, font, ob, _solid_test(profile, view, tuple(p.profile for p in resolved.parts[1:])),
                    (a[0], a[1], b[0], b[1]), mirrored=False)
    items += placer.place([replace(r, lower=False) for r in crowd.shown])
    return _Group(items, _bbox(items)), view, placer.failed


# ------------------------------------------------------------------ blocks of text
def _title_block(font: Lettering, resolved: Resolved, data: SheetData, scales: str,
                 origin: tuple[float, float], overrides: dict[str, tuple[str, str]] | None = None) -> list[Item]:
    """The ISO 7200 title block; ``overrides`` maps a field's label to (label, value) for another part's sheet."""
    d = resolved.design["design"]
    shop = resolved.design["shop"]
    cells = [
        ("Title", d["title"] or resolved.design.name, 0, 120, 3),
        ("Identification number", d["identification"] or resolved.design.name, 120, 60, 3),
        ("Legal owner", d["owner"], 0, 60, 2),
        ("Document type", "Detail drawing", 60, 45, 2),
        ("Revision", resolved.design.revision, 105, 25, 2),
        ("Sheet", sheet_number(resolved), 130, 20, 2),
        ("Units", "mm", 150, 30, 2),
        ("Created by", d["creator"], 0, 40, 1),
        ("Approved by", d["approver"], 40, 40, 1),
        ("Date of issue", d["date"], 80, 35, 1),
        ("Material", resolved["material.name"], 115, 65, 1),
        ("Mass (one half)", f"{data.half_mass_g:.1f} g", 0, 40, 0),
        ("Scale", scales, 40, 50, 0),
        ("General tolerance", shop["general_tolerance"], 90, 50, 0),
        ("Projection", "", 140, 40, 0),
    ]
    if overrides:
        cells = [(*overrides.get(label, (label, value)), cx, cw, row) for label, value, cx, cw, row in cells]
    x0, y0 = origin
    rows = 4
    items: list[Item] = [_rect(x0, y0, x0 + TITLE_WIDTH, y0 + rows * ROW, "frame")]
    for r in range(1, rows):
        items.append(Stroke(((x0, y0 + r * ROW), (x0 + TITLE_WIDTH, y0 + r * ROW)), "frame", weight=0.25))
    for label, value, cx, cw, row in cells:
        left, bottom = x0 + cx, y0 + row * ROW
        if cx > 0:
            items.append(Stroke(((left, bottom), (left, bottom + ROW)), "frame", weight=0.25))
        items.append(_text(font, label, (left + 1.2, bottom + ROW - 1.0 - LABEL_HEIGHT), LABEL_HEIGHT))
        if value:
            items += fit_cell(font, value, left + 1.2, bottom + 1.0, cw - 2.4,
                              ROW - 1.0 - LABEL_HEIGHT * (1 + font.descender) - 0.7 - 1.0)
        if label == "Projection":
            items += _projection_symbol((left + cw / 2, bottom + 4.6), 3.2)
    return items


def fit_cell(font: Lettering, value: str, x: float, y: float, width: float, height: float) -> list[Text]:
    """``value`` in a cell (x, y = lower-left of its room): one line at 3.5 mm, or wrapped and shrunk
    through the ISO 3098-1 sizes until it fits ``width`` × ``height``; the smallest size's lines are
    cut to the room if even they do not fit (the design reader's limits keep that from happening)."""
    for h in VALUE_SIZES:
        lines = wrap(font, value, h, width)
        need = h * (1 + font.descender) + (len(lines) - 1) * h * PITCH
        if need <= height + 1e-9:
            break
    top = y + height - h  # first baseline: its cap top at the top of the room
    if len(lines) == 1:
        top = y + h * font.descender  # one line sits on the cell's foot
    out = []
    for i, line in enumerate(lines):
        baseline = top - i * h * PITCH
        if baseline - h * font.descender < y - 1e-9:
            break
        out.append(_text(font, line, (x, baseline), h))
    return out


def _projection_symbol(center: tuple[float, float], h: float) -> list[Item]:
    """The first-angle projection symbol (ISO 128-30): truncated cone seen from the side, its end view on the right."""
    cx, cy = center
    d_big, d_small, length = h, h / 2, 1.2 * h
    x_cone = cx - 0.9 * h
    pts = ((x_cone - length / 2, cy - d_small / 2), (x_cone + length / 2, cy - d_big / 2),
           (x_cone + length / 2, cy + d_big / 2), (x_cone - length / 2, cy + d_small / 2))
    x_end = cx + 1.0 * h
    return [Stroke(pts, "frame", closed=True, weight=0.25), Circle((x_end, cy), d_big / 2, "frame", weight=0.25),
            Circle((x_end, cy), d_small / 2, "frame", weight=0.25),
            Stroke(((x_cone - length / 2 - 1.0, cy), (x_end + d_big / 2 + 1.0, cy)), "centre", weight=0.18,
                   linetype="long-dash-dot-small")]


def _revision_block(font: Lettering, resolved: Resolved, top_left: tuple[float, float], width: float) -> list[Item]:
    """Rows (letter, date, what changed) under a header; a long note wraps and its row grows."""
    x0, y_top = top_left
    rows = list(resolved.design.revisions)
    cols = REV_COLUMNS
    h = TEXT_HEIGHT
    items: list[Item] = []
    for i, name in enumerate(("Rev.", "Date", "Description")):
        items.append(_text(font, name, (x0 + cols[i] + 1.2, y_top - 2.0 - LABEL_HEIGHT), LABEL_HEIGHT))
    y = y_top - 2.0 - LABEL_HEIGHT - 2.0 - LABEL_HEIGHT * font.descender
    items.append(Stroke(((x0, y), (x0 + width, y)), "frame", weight=0.25))
    for rev in rows or [None]:
        if rev is None:
            y -= 8.0
            items.append(Stroke(((x0, y), (x0 + width, y)), "frame", weight=0.25))
            continue
        cells = [(rev.letter, cols[0], cols[1] - cols[0]), (rev.date, cols[1], cols[2] - cols[1]),
                 (rev.note, cols[2], width - cols[2])]
        texts: list[Text] = []
        depth = 0.0
        for value, cx, cw in cells:
            size = h
            lines = wrap(font, value, size, cw - 2.4)
            if len(lines) > 1 and cx == cols[2]:
                size = 2.5
                lines = wrap(font, value, size, cw - 2.4)
            if cx < cols[2] and font.width(value, size) > cw - 2.4:
                size = 2.5
                lines = wrap(font, value, size, cw - 2.4)
            for j, line in enumerate(lines):
                texts.append(_text(font, line, (x0 + cx + 1.2, y - 1.5 - size - j * size * PITCH), size))
            depth = max(depth, 1.5 + size * (1 + font.descender) + (len(lines) - 1) * size * PITCH + 1.5)
        items += texts
        y -= depth
        items.append(Stroke(((x0, y), (x0 + width, y)), "frame", weight=0.25))
    items.append(_rect(x0, y, x0 + width, y_top, "frame"))
    for c in cols[1:]:
        items.append(Stroke(((x0 + c, y_top), (x0 + c, y)), "frame", weight=0.25))
    return items


def _paragraphs(font: Lettering, heading: str, lines: list[str], top_left: tuple[float, float],
                width: float) -> tuple[list[Item], float]:
    """A heading and wrapped lines (continuations indented); returns the items and the foot's y."""
    items, foot, rest = _flow(font, heading, lines, [(top_left[0], top_left[1], width, -1e9)])
    return items, foot


def _flow(font: Lettering, heading: str, lines: list[str],
          columns: list[tuple[float, float, float, float]]) -> tuple[list[Item], float, list[str]]:
    """A heading and its lines set down column after column, each (x, top, width, bottom); a line that
    would pass a column's bottom goes to the top of the next. Returns the items, the last foot and the
    lines that found no room."""
    h = TEXT_HEIGHT
    items: list[Item] = []
    todo = list(lines)
    col = 0
    x, y, width, bottom = columns[0]
    y -= h
    items.append(_text(font, heading, (x, y)))
    foot = y - h * font.descender
    while todo:
        line = todo[0]
        indent = 4.0 if line.startswith("   ") else 0.0
        parts = wrap(font, line.strip(), h, width - indent - 4.0)
        need = len(parts) * h * PITCH + h * font.descender
        if y - need < bottom:
            col += 1
            if col >= len(columns):
                return items, foot, todo
            x, y, width, bottom = columns[col]
            y += h * (PITCH - 1.0)  # the first line's cap at the column's top
            continue
        for j, part in enumerate(parts):
            y -= h * PITCH
            items.append(_text(font, part, (x + indent + (4.0 if j else 0.0), y)))
        foot = y - h * font.descender
        todo.pop(0)
    return items, foot, []


# ------------------------------------------------------------------ the sheet
def _fit_main(group: _Group, frame, left: float) -> tuple[float, float]:  # type: ignore[no-untyped-def]
    """Shift that puts the main view's extent at the left of the frame, centred in height."""
    b = group.box
    dx = left - b[0]
    free_h = (frame[3] - GAP) - (frame[1] + GAP + 8.0)
    dy = frame[1] + GAP + 8.0 + (free_h - (b[3] - b[1])) / 2 - b[1]
    return dx, dy


def _choices(resolved: Resolved) -> list[tuple[str, float]]:
    # A3 at the largest scale that fits; A2 only where it keeps a scale A3 would have to reduce below 2:1, or
    # where a step too small to dimension at 2:1 (its extension lines closer than ISO 128-2 allows) needs 5:1
    out = [("A3", 5.0), ("A3", 2.0), ("A2", 2.0), ("A2", 5.0), ("A3", 1.0), ("A2", 1.0)]
    out += [(paper, s) for s in SCALES if s < 1.0 for paper in ("A3", "A2")]
    return out


def compose(resolved: Resolved, data: SheetData) -> Sheet:
    """The sheet: the largest ISO 5455 scale at which every block fits, on A3 if it can, else A2."""
    font = lettering()
    last: SheetTooSmall | None = None
    views: dict = {}  # a view at a scale is the same on either paper: composed once
    # a view gives up as little as it can (``ALL`` … ``SPACING_WAIVED``), and at full size or larger before it
    # is reduced (a reduction is for a part too big for the paper, not for a crowded one)
    choices = _choices(resolved)
    full = [c for c in choices if c[1] >= 1.0]
    reduced = [c for c in choices if c[1] < 1.0]
    for group in (full, reduced):
        # an auxiliary dimension is left out before a larger paper is taken; the spacing is waived last
        tries = [(c, level) for c in group for level in (ALL, WITHOUT_AUXILIARY)] + [(c, SPACING_WAIVED) for c in group]
        for (paper, scale), level in tries:
            try:
                return _compose(resolved, data, font, paper, scale, views=views, level=level)
            except SheetTooSmall as exc:
                last = exc
        # a crowded part (reduced only when too big for the paper): at the group's first choice whose blocks
        # fit, the sizes with no room named in a note; better, at that scale or a larger one of the group, all
        # of them (else some) drawn on an enlarged detail of their region
        named = None
        for paper, scale in group:
            try:
                named = _compose(resolved, data, font, paper, scale, views=views, level=SIZES_LEFT_OFF)
                break
            except SheetTooSmall as exc:
                last = exc
        if named is not None:
            for complete in (True, False):
                for paper, scale in (c for c in group if c[1] >= named.notes["scale"]):
                    try:
                        return _compose(resolved, data, font, paper, scale, views=views, level=SIZES_LEFT_OFF,
                                        enlarge=True, complete=complete)
                    except SheetTooSmall as exc:
                        last = exc
            return named
    assert last is not None
    return _compose(resolved, data, font, "A2", SCALES[-1], force=True, views=views, level=SIZES_LEFT_OFF)


def _detail_scale(resolved: Resolved, width: float, height: float) -> float:
    z0, r0, z1, r1 = detail_region(resolved)
    for s in DETAIL_SCALES:
        if (z1 - z0) * s <= width and (r1 - r0) * s <= height:
            return s
    return DETAIL_SCALES[-1]


def _compose(resolved: Resolved, data: SheetData, font: Lettering, paper_name: str, scale: float,
             force: bool = False, views: dict | None = None, level: int = ALL, enlarge: bool = False,
             complete: bool = False) -> Sheet:
    views = {} if views is None else views
    paper = PAPERS[paper_name]
    frame = frame_of(paper)
    profile = resolved.profile
    assert profile is not None
    z_min, _, z_max, R = profile.bounds()
    if not force and ((z_max - z_min) * scale > 0.45 * (frame[2] - frame[0]) or 2 * R * scale > frame[3] - frame[1] - 90):
        raise SheetTooSmall(f"{paper_name} {scale_text(scale)}")
    waive = level >= SPACING_WAIVED
    if ("main", scale, waive) not in views:
        views["main", scale, waive] = _main_view(resolved, scale, font, data, waive)
    main, mview, failed, runout = views["main", scale, waive]
    if level >= WITHOUT_AUXILIARY:  # the same view, its auxiliary dimensions that found no room left out
        failed = [r for r in failed if not r.auxiliary]
    if failed and not force and level < SIZES_LEFT_OFF:
        raise SheetTooSmall(f"{paper_name} {scale_text(scale)}: no room for {failed[0].keys}")
    crowd = None
    if enlarge and level >= SIZES_LEFT_OFF:  # the sizes with no room shown on detail E, its region marked
        region = crowd_region(failed)
        if region is not None:
            crowd = _Crowd(region, tuple(r for r in failed if enlargeable(r)))
            if ("main", scale, waive, crowd) not in views:
                views["main", scale, waive, crowd] = _main_view(resolved, scale, font, data, waive, crowd)
            main, mview, failed, runout = views["main", scale, waive, crowd]
            failed = [r for r in failed if not r.auxiliary]
    if enlarge and (crowd is None or (complete and failed)):  # no detail E here, or not one that is enough
        raise SheetTooSmall(f"{paper_name} {scale_text(scale)}: sizes left off")
    if not runout and not force and level < SIZES_LEFT_OFF:  # the outer diameter's runout frame found no room
        raise SheetTooSmall(f"{paper_name} {scale_text(scale)}: no room for the runout frame")
    unplaced = [] if runout else [f"Runout {data.runout_mm:.3f} to A of the outer diameter Ø{size_text(2 * R)}"]
    label = f"SECTION ({scale_text(scale)}), datum face B = outer face"
    reach = max(0.0, (font.width(label, TEXT_HEIGHT) - (main.box[2] - main.box[0])) / 2)  # a label wider than the view
    dx, dy = _fit_main(main, frame, frame[0] + GAP + reach)
    main = main.moved(dx, dy)
    label_y = main.box[1] - GAP - TEXT_HEIGHT
    mview = View("main", scale, (mview.origin[0] + dx, mview.origin[1] + dy),
                 (main.box[0] - 1.0, main.box[1] - 1.0, main.box[2] + 1.0, main.box[3] + 1.0))
    if label_y < frame[1] + 2.0 or main.box[3] > frame[3] - 2.0:
        if not force:
            raise SheetTooSmall(f"{paper_name} {scale_text(scale)}: main view too tall")
    right_x = main.box[2] + reach + GAP + 2.0  # clear of the view and of its label
    if frame[2] - right_x < TITLE_WIDTH and not force:
        raise SheetTooSmall(f"{paper_name} {scale_text(scale)}: no room right of the view")
    # the detail, framed, under the top edge
    largest = _detail_scale(resolved, 0.32 * (frame[2] - right_x), 0.45 * (frame[3] - frame[1]))
    # a smaller enlargement leaves the notes more room: tried before a larger sheet; a detail is an
    # enlargement of the view (ISO 128-3), never at the view's own scale
    scales = [s for s in DETAIL_SCALES if scale < s <= largest] or ([DETAIL_SCALES[-1]] if force else [])
    for i, dscale in enumerate(scales):
        try:
            return _right_side(resolved, data, font, paper_name, paper, frame, scale, dscale, main, mview, label_y,
                               right_x, views, force, failed if level >= SIZES_LEFT_OFF else [], crowd, complete,
                               unplaced)
        except SheetTooSmall:
            if i == len(scales) - 1:
                raise
    raise SheetTooSmall(paper_name)  # pragma: no cover - the loop returns or raises


def _right_side(resolved: Resolved, data: SheetData, font: Lettering, paper_name: str, paper, frame,  # type: ignore[no-untyped-def]
                scale: float, dscale: float, main: "_Group", mview: View, label_y: float, right_x: float,
                views: dict, force: bool, left_off: Sequence[DimensionRequest] = (), crowd: "_Crowd | None" = None,
                complete: bool = False, unplaced: Sequence[str] = ()) -> Sheet:
    """The detail, revisions, cautions, notes and title block right of the main view; ``left_off`` are the
    section's sizes that found no room (``SIZES_LEFT_OFF``), named in a note with their values, as are any of
    the detail's; ``crowd``, the section's crowded region and the sizes detail E shows (``complete``: every
    one of them, and no size left off anywhere); ``unplaced``, the section's tolerance frames that found no room,
    named in the same note."""
    if ("detail", dscale) not in views:
        views["detail", dscale] = _detail(resolved, dscale, font, data)
    detail, dview, dfailed = views["detail", dscale]
    ddx = right_x + PAD - detail.box[0]
    ddy = frame[3] - GAP - PAD - detail.box[3]
    detail = detail.moved(ddx, ddy)
    dview = View("detail", dscale, (dview.origin[0] + ddx, dview.origin[1] + ddy), detail.box)
    db = detail.box
    dframe = (db[0] - PAD, db[1] - PAD - TEXT_HEIGHT - PAD, db[2] + PAD, db[3] + PAD)
    items: list[Item] = []
    items += main.items
    items += detail.items
    items.append(_rect(*dframe, "detail"))
    items.append(_text(font, f"DETAIL C ({scale_text(dscale)})", ((dframe[0] + dframe[2]) / 2, dframe[1] + PAD),
                       align="center"))
    items.append(_text(font, f"SECTION ({scale_text(scale)}), datum face B = outer face",
                       ((main.box[0] + main.box[2]) / 2, label_y), align="center"))
    # revisions and cautions right of the detail
    rev_x = dframe[2] + GAP
    if frame[2] - rev_x < 110.0 and not force:
        raise SheetTooSmall(f"{paper_name}: no room for the revision block")
    rev = _revision_block(font, resolved, (rev_x, frame[3]), frame[2] - rev_x)
    items += rev
    rev_bottom = _bbox(rev)[1]
    cautions, c_foot = _paragraphs(font, "CAUTIONS", caution_lines(), (rev_x + 1.5, rev_bottom - GAP + 1.0),
                                   frame[2] - rev_x - 3.0)
    items += cautions
    # notes under the cautions (or under the detail when that column is the wider room), the title
    # block in the corner
    title_top = frame[1] + 4 * ROW
    title_x = frame[2] - TITLE_WIDTH
    under_detail_bottom = frame[1] + GAP if dframe[2] <= title_x - GAP else title_top + GAP
    under_right = min(dframe[2], title_x - GAP if under_detail_bottom < title_top else frame[2])
    under_top = dframe[1] - GAP
    # detail E (when the section is crowded) framed under detail C with the notes under it, or under the
    # section's label left of the title block and of the notes: the first placing that leaves the notes room
    choices: list = [(None, [], [], None, under_top)]  # (scale, sizes with no room, items, view, notes' top)
    if crowd is not None:
        rooms = [(dframe[0], under_top, under_right, under_detail_bottom),
                 (frame[0] + GAP, label_y - GAP, min(title_x, dframe[0]) - GAP, frame[1] + GAP)]
        choices = []
        for escale, group, view, efailed, k in _crowd_choices(resolved, crowd, scale, font, views, rooms):
            if not (complete and efailed):
                eitems, eview, bottom = _crowd_framed(font, escale, group, view, rooms[k])
                choices.append((escale, efailed, eitems, eview, bottom - GAP if k == 0 else under_top))
        if complete and any(not r.auxiliary for r in dfailed):
            choices = []
        if not choices:
            raise SheetTooSmall(f"{paper_name}: no room for detail {CROWD_LETTER}")
    for n, (escale, efailed, eitems, eview, notes_top) in enumerate(choices):
        note_lines: list[str] = []
        sections = [("Fits (finished sizes)", fit_lines(resolved)), ("Shop", shop_lines(resolved, data))]
        left = list(left_off) + list(efailed) + [r for r in dfailed if not r.auxiliary]  # the details' too
        if left or unplaced:
            sections.append(("Not drawn for want of room",
                             [left_off_line(r, datum_face_z(resolved)) for r in left] + list(unplaced)))
        for heading, lines in numbered(sections):
            note_lines += [heading] + lines
        # the notes fill the room under the cautions, then go on under the detail (left of the title block
        # when the detail stands clear of it)
        columns = [(rev_x + 1.5, c_foot - GAP, frame[2] - rev_x - 3.0, title_top + GAP),
                   (dframe[0] + 1.5, notes_top, under_right - dframe[0] - 3.0, under_detail_bottom)]
        notes, n_foot, rest = _flow(font, "NOTES", note_lines, columns)
        if not rest or force:
            break
        if n == len(choices) - 1:
            raise SheetTooSmall(f"{paper_name}: the notes run into the title block")
    items += eitems + notes
    scales = f"{scale_text(scale)}, detail C {scale_text(dscale)}"
    views_drawn = (mview, dview)
    if escale is not None:
        scales += f", {CROWD_LETTER} {scale_text(escale)}"
        views_drawn += (eview,)
    items += _title_block(font, resolved, data, scales, (frame[2] - TITLE_WIDTH, frame[1]))
    items += _frame(paper, frame)
    return Sheet(paper, frame, tuple(items), views_drawn, notes={"paper": paper_name, "scale": scale,
                                                                 "detail_scale": dscale})


def _crowd_choices(resolved: Resolved, crowd: _Crowd, scale: float, font: Lettering, views: dict,
                   rooms: list[tuple[float, float, float, float]]) -> list[tuple[float, _Group, View, list, int]]:
    """Where and how large detail E can go, best first: each ISO 5455 enlargement whose frame fits one of
    ``rooms`` (x_left, y_top, x_right, y_bottom) and places some of its sizes, in order of the fewest sizes
    left off, then the largest scale, then the room's order: (scale, the detail, its view, the sizes with
    no room, the room's index)."""
    out = []
    for escale in (s for s in DETAIL_SCALES if s > scale):
        if ("crowd", crowd, escale) not in views:
            views["crowd", crowd, escale] = _crowd_detail(resolved, crowd, escale, font)
        group, view, failed = views["crowd", crowd, escale]
        if len(failed) == len(crowd.shown):
            continue
        b = group.box
        out += [(escale, group, view, failed, k) for k, r in enumerate(rooms)
                if b[2] - b[0] + 2 * PAD <= r[2] - r[0] and b[3] - b[1] + 3 * PAD + TEXT_HEIGHT <= r[1] - r[3]]
    return sorted(out, key=lambda c: (len(c[3]), -c[0], c[4]))


def _crowd_framed(font: Lettering, escale: float, group: _Group, view: View,
                  room: tuple) -> tuple[list[Item], View, float]:
    """Detail E framed at the top left of ``room`` with its label: (its items, its view, its frame's bottom)."""
    dx, dy = room[0] + PAD - group.box[0], room[1] - PAD - group.box[3]
    group = group.moved(dx, dy)
    view = View(CROWD_VIEW, escale, (view.origin[0] + dx, view.origin[1] + dy), group.box)
    b = group.box
    frame = (b[0] - PAD, b[1] - PAD - TEXT_HEIGHT - PAD, b[2] + PAD, b[3] + PAD)
    items = group.items + [_rect(*frame, "detail"),
                           _text(font, f"DETAIL {CROWD_LETTER} ({scale_text(escale)})",
                                 ((frame[0] + frame[2]) / 2, frame[1] + PAD), align="center")]
    return items, view, frame[1]


def left_off_line(req: DimensionRequest, face_z: float | None = None, face: str = "B") -> str:
    """A size the sheet has no room for, as its dimension would read, with the design keys it shows and, given
    the axial position ``face_z`` of the face the sheet measures from (``face``), where it is on the part.

    >>> left_off_line(DimensionRequest(("shape.points[6].arc_radius",), "radius", ((10.2, 0.0), (10.2, 22.6))), 21.0)
    'R22.6 (shape.points[6].arc_radius): the arc through 10.8 from B on Ø45.2'
    """
    line = f"{' '.join(text_lines(req))} ({', '.join(req.keys)})"
    if face_z is None:
        return line

    def at(p: tuple[float, float]) -> str:
        return f"{size_text(face_z - p[0])} from {face} on Ø{size_text(2 * abs(p[1]))}"
    if req.kind == "radius":
        return f"{line}: the arc through {at(req.points[1])}"
    if req.kind == "linear":
        return f"{line}: between {at(req.points[0])} and {at(req.points[1])}"
    if req.kind == "diameter":
        return f"{line}: {size_text(face_z - req.points[0][0])} from {face}"
    return f"{line}: at the corner {at(req.points[0])}"


def _frame(paper: tuple[float, float], frame) -> list[Item]:  # type: ignore[no-untyped-def]
    x0, y0, x1, y1 = frame
    w, h = paper
    return [_rect(x0, y0, x1, y1, "frame", weight=0.7),
            Stroke(((w / 2, 0.0), (w / 2, y0)), "frame"), Stroke(((w / 2, y1), (w / 2, h)), "frame"),
            Stroke(((0.0, h / 2), (x0, h / 2)), "frame"), Stroke(((x1, h / 2), (w, h / 2)), "frame")]


__all__ += ["wrap", "fit_cell", "frame_of", "boxes_overlap", "segment_hits_box"]
