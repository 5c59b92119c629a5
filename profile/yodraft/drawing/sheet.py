"""The shop drawing: model-space section at 1:1 with its dimensions, and an A3 landscape sheet in paper space
(border, the section in a viewport, the enlarged seat detail, runout callouts, notes, revisions, title block)."""
from __future__ import annotations

import math

from ezdxf import bbox
from ezdxf.document import Drawing
from ezdxf.layouts import BaseLayout

from ..builder import Resolved
from . import layers
from .detail import DETAIL_BLOCK, build_detail, detail_lanes, detail_region, detail_scale
from .layers import TEXT_HEIGHT, TEXT_STYLE
from .mtext import escape
from .notes import SheetData, caution_lines, fit_lines, numbered, shop_lines
from .outline import new_document
from .section import dimension_section, draw_section, thread_lane_z
from .titleblock import TITLE_WIDTH, draw_revision_block, draw_title_block, title_cells
from .ttf_metrics import FontMetrics, font_of_file, mtext_extent, wrap

__all__ = ["sheet_document", "SheetData", "PAPER", "LAYOUT_NAME", "view_scale"]

PAPER = (420.0, 297.0)  # ISO 216 A3 landscape
FRAME = (20.0, 10.0, 410.0, 287.0)  # ISO 5457: 20 mm filing margin on the left, 10 mm elsewhere
LAYOUT_NAME = "sheet"
MAIN_BOX = (20.0, 60.0, 195.0, 287.0)  # where the main view and its dimensions go
RIGHT_X = 198.0  # left edge of the detail and of the note block
DETAIL_TOP = 283.0
DETAIL_FIT = (58.0, 122.0)  # paper room the seat region itself must fit at the detail scale (mm)
GAP = 4.0  # clear space between blocks on the sheet (mm)
PAD = 3.0  # clear space inside the detail frame (mm)
RUNOUT_H = 7.0  # height of a geometric tolerance frame (mm)
RUNOUT_W = (8.0, 16.0, 8.0)  # its compartments: symbol, value, datum
PREFERRED = (5.0, 4.0, 3.0, 2.5, 2.0, 1.0, 0.5)  # ISO 5455 scales


def view_scale(resolved: Resolved) -> float:
    """The largest preferred scale at which the full section and its dimension rows fit the main box."""
    z_min, _, z_max, r_max = resolved.profile.bounds()  # type: ignore[union-attr]
    w, h = MAIN_BOX[2] - MAIN_BOX[0], MAIN_BOX[3] - MAIN_BOX[1]
    for s in PREFERRED:
        if (z_max - z_min) * s + 95 <= w and 2 * r_max * s + 55 <= h:
            return s
    return PREFERRED[-1]


def _scale_text(s: float) -> str:
    return f"{s:g}:1" if s >= 1 else f"1:{1 / s:g}"


def sheet_document(resolved: Resolved, data: SheetData) -> Drawing:
    """The whole drawing: model space and the ``sheet`` paper-space layout."""
    d = resolved.design
    doc = new_document(d["design"]["date"], f"{d.name}-{d.revision}:sheet")
    layers.setup(doc)
    doc.header["$PSLTSCALE"] = 1  # line type patterns in paper millimetres in every viewport
    scale = view_scale(resolved)
    msp = doc.modelspace()
    draw_section(msp, resolved, scale)
    dimension_section(msp, resolved, scale)
    region = detail_region(resolved)
    dscale = detail_scale(region, *DETAIL_FIT)
    build_detail(doc, resolved, dscale)
    psp = doc.layouts.new(LAYOUT_NAME)
    psp.page_setup(size=PAPER, margins=(0, 0, 0, 0), units="mm")
    for e in list(psp.query("VIEWPORT")):
        if e.dxf.id != 1:
            psp.delete_entity(e)
    _frame(psp)
    centre, mcentre = _main_view(psp, resolved, scale)
    box, insert = _detail(psp, doc, region, dscale, centre, mcentre, scale)
    _runout(psp, resolved, data, centre, mcentre, scale, box, insert, dscale)
    cells = title_cells(resolved, data, f"{_scale_text(scale)}, detail C {_scale_text(dscale)}")
    draw_title_block(psp, (FRAME[2] - TITLE_WIDTH, FRAME[1]), cells)
    rev_x = box[2] + GAP
    rev_h = draw_revision_block(psp, (rev_x, FRAME[3]), FRAME[2] - rev_x, resolved)
    cautions_bottom = _cautions(psp, (rev_x, FRAME[3] - rev_h - GAP), FRAME[2] - rev_x)
    _notes(psp, resolved, data, min(box[1], cautions_bottom) - GAP)
    return doc


def _frame(psp: BaseLayout) -> None:
    x0, y0, x1, y1 = FRAME
    psp.add_lwpolyline([(x0, y0), (x1, y0), (x1, y1), (x0, y1)], close=True, dxfattribs={"layer": "frame", "lineweight": 70})
    w, h = PAPER
    for x in (w / 2,):  # centring marks (ISO 5457)
        psp.add_line((x, 0), (x, y0), dxfattribs={"layer": "frame"})
        psp.add_line((x, y1), (x, h), dxfattribs={"layer": "frame"})
    for y in (h / 2,):
        psp.add_line((0, y), (x0, y), dxfattribs={"layer": "frame"})
        psp.add_line((x1, y), (w, y), dxfattribs={"layer": "frame"})


def _main_view(psp: BaseLayout, resolved: Resolved, scale: float) -> tuple[tuple[float, float], tuple[float, float]]:
    z_min, _, z_max, r_max = resolved.profile.bounds()  # type: ignore[union-attr]
    x0, y0, x1, y1 = MAIN_BOX
    w, h = x1 - x0, y1 - y0
    centre = ((x0 + x1) / 2, (y0 + y1) / 2)
    # shift the model so the dimension lanes on both sides get room (more lanes on the outer side)
    mcentre = ((z_min + z_max) / 2 + 8.0 / scale, 0.0)
    vp = psp.add_viewport(center=centre, size=(w, h), view_center_point=mcentre, view_height=h / scale,
                          dxfattribs={"layer": "viewport"})
    vp.dxf.flags = vp.dxf.flags | 16384  # locked display
    _label(psp, (centre[0], y0 - 8.0), f"SECTION ({_scale_text(scale)}), datum face B = outer face")
    return centre, mcentre


def to_paper(p: tuple[float, float], centre: tuple[float, float], mcentre: tuple[float, float],
             scale: float) -> tuple[float, float]:
    """Where model point ``p`` lands on the sheet through the main viewport."""
    return (centre[0] + (p[0] - mcentre[0]) * scale, centre[1] + (p[1] - mcentre[1]) * scale)


def _label(psp: BaseLayout, at: tuple[float, float], text: str, height: float = TEXT_HEIGHT) -> None:
    mt = psp.add_mtext(escape(text), dxfattribs={"layer": "text", "style": TEXT_STYLE, "char_height": height,
                                                  "attachment_point": 8})
    mt.dxf.insert = at


def _detail(psp: BaseLayout, doc: Drawing, region, dscale: float, centre, mcentre,  # type: ignore[no-untyped-def]
            scale: float) -> tuple[tuple[float, float, float, float], tuple[float, float]]:
    """Insert the detail block in a frame sized to its contents (dimensions included) under the
    sheet's top edge, label below; returns the frame (x0, y0, x1, y1) and the insertion point."""
    bx0, by0, bx1, by1 = _extents(doc, doc.blocks.get(DETAIL_BLOCK))
    # room above the wall bore for the seat's runout frame (see _runout)
    top = max(by1 * dscale, _seat_frame_y(region, dscale) + RUNOUT_H)
    label = TEXT_HEIGHT + 2 * PAD
    x0 = RIGHT_X
    x1 = x0 + PAD + (bx1 - bx0) * dscale + PAD
    y1 = DETAIL_TOP
    y0 = y1 - PAD - (top - by0 * dscale) - label
    insert = (x0 + PAD - bx0 * dscale, y0 + label - by0 * dscale)
    psp.add_blockref(DETAIL_BLOCK, insert, dxfattribs={"xscale": dscale, "yscale": dscale, "layer": "detail"})
    psp.add_lwpolyline([(x0, y0), (x1, y0), (x1, y1), (x0, y1)], close=True, dxfattribs={"layer": "detail"})
    _label(psp, ((x0 + x1) / 2, y0 + PAD + TEXT_HEIGHT), f"DETAIL C ({_scale_text(dscale)})")
    # the axis as a paper-space centre line over the insert, so its dashes are paper millimetres
    psp.add_line((insert[0] + region[0] * dscale, insert[1]), (insert[0] + region[2] * dscale, insert[1]),
                 dxfattribs={"layer": "centre"})
    # mark the detail's region on the main view (ISO 128-3 style: narrow frame and letter)
    a = to_paper((region[0], region[1]), centre, mcentre, scale)
    b = to_paper((region[2], region[3]), centre, mcentre, scale)
    psp.add_lwpolyline([a, (b[0], a[1]), b, (a[0], b[1])], close=True, dxfattribs={"layer": "detail"})
    # the letter left of the frame, between it and the nearest diameter line, in open paper
    mt = psp.add_mtext("C", dxfattribs={"layer": "text", "style": TEXT_STYLE, "char_height": TEXT_HEIGHT,
                                        "attachment_point": 6})
    mt.dxf.insert = (a[0] - 1.5, a[1] + 0.45 * (b[1] - a[1]))
    return (x0, y0, x1, y1), insert


def _extents(doc: Drawing, block) -> tuple[float, float, float, float]:  # type: ignore[no-untyped-def]
    """(x0, y0, x1, y1) of what a block shows on paper: its own entities and its dimensions' rendered
    lines, arrows and texts (texts measured with their font), without the definition points (a
    half-shown diameter's mirror point is not drawn)."""
    fonts: dict[str, FontMetrics] = {}
    shown, xs, ys = [], [], []
    for e in block:
        for g in (e.get_geometry_block() if e.dxftype() == "DIMENSION" else (e,)):
            if g.dxftype() == "MTEXT":
                style = g.dxf.get("style", "Standard")
                if style not in fonts:
                    fonts[style] = font_of_file(doc.styles.get(style).dxf.get("font", ""))
                width, height = mtext_extent(g.plain_text(split=True), g.dxf.char_height, fonts[style])
                a = math.radians(g.get_rotation())
                half = (width / 2 + 0.5 * g.dxf.char_height, height / 2)
                c = g.dxf.insert  # dimension texts are middle-centred
                for sx, sy in ((-1, -1), (1, -1), (1, 1), (-1, 1)):
                    u, w = sx * half[0], sy * half[1]
                    xs.append(c.x + u * math.cos(a) - w * math.sin(a))
                    ys.append(c.y + u * math.sin(a) + w * math.cos(a))
            elif g.dxftype() != "POINT":
                shown.append(g)
    ext = bbox.extents(shown)
    xs += [ext.extmin.x, ext.extmax.x]
    ys += [ext.extmin.y, ext.extmax.y]
    return min(xs), min(ys), max(xs), max(ys)


def _seat_frame_y(region, dscale: float) -> float:  # type: ignore[no-untyped-def]
    """Height of the seat runout frame's bottom above the detail's axis (paper mm): clear above the
    top of the seat region, where only the post length and wall offset dimensions run."""
    return region[3] * dscale + PAD


def _runout(psp: BaseLayout, resolved: Resolved, data: SheetData, centre, mcentre, scale: float,  # type: ignore[no-untyped-def]
            box, insert, dscale: float) -> None:
    """Datum A on the axle bore's axis and circular-runout frames for the rim and the seat."""
    v = resolved.values
    # datum A: on the thread's diameter dimension line, at its arrow (its axis is the datum)
    r_t = v["axle_bore.major_diameter"] / 2
    tip = to_paper((thread_lane_z(resolved, scale), -r_t), centre, mcentre, scale)
    _datum(psp, tip, "A")
    # runout of the rim: leader to the outer diameter's band, a quarter in from the catch zone so it
    # clears the band width's text in the middle
    R = v["rim.diameter"] / 2
    z_od = v["catch_zone.end_z"] + 0.25 * (v["rim.face_z"] - v["catch_zone.end_z"])
    od = to_paper((z_od, R), centre, mcentre, scale)
    _runout_frame(psp, (od[0] - 40.0, od[1] + 20.0), od, data.runout_mm)
    # runout of the seat, on the detail: the arrow lands on the post's surface line extended to the
    # left of the post face (ISO 1101 allows the extension line), between the part and the post's
    # diameter line, so the leader runs through open paper above the seat, clear of every dimension
    z_post = v["bearing_seat.post_face_z"]
    lane = detail_lanes(resolved, dscale)[0]
    z_arrow = z_post - 0.45 * (z_post - lane)
    target = (insert[0] + z_arrow * dscale, insert[1] + v["bearing_seat.post_diameter"] / 2 * dscale)
    y = insert[1] + _seat_frame_y(detail_region(resolved), dscale)
    width = sum(RUNOUT_W)
    x = max(box[0] + PAD, target[0] - 6.0 - width)
    _runout_frame(psp, (x, y), target, data.runout_mm)


def _datum(psp: BaseLayout, tip: tuple[float, float], letter: str) -> None:
    """ISO 5459 datum feature indicator: filled triangle on the feature, line, framed letter."""
    x, y = tip
    s = 3.0
    tri = psp.add_solid([(x - s / 2, y), (x + s / 2, y), (x, y - s * 0.87)], dxfattribs={"layer": "dimension"})
    del tri
    # the leader bends off to the left, away from the thread's text beside the line and the post face
    b = 7.0
    knee = (x, y - 6.0)
    psp.add_line((x, y - s * 0.87), knee, dxfattribs={"layer": "dimension"})
    psp.add_line(knee, (x - 5.0, knee[1]), dxfattribs={"layer": "dimension"})
    bx = x - 5.0 - b
    psp.add_lwpolyline([(bx, knee[1] - b / 2), (bx + b, knee[1] - b / 2), (bx + b, knee[1] + b / 2), (bx, knee[1] + b / 2)],
                       close=True, dxfattribs={"layer": "dimension"})
    mt = psp.add_mtext(letter, dxfattribs={"layer": "text", "style": TEXT_STYLE, "char_height": TEXT_HEIGHT,
                                           "attachment_point": 5})
    mt.dxf.insert = (bx + b / 2, knee[1])


def _runout_frame(psp: BaseLayout, at: tuple[float, float], target: tuple[float, float], value: float) -> None:
    """A geometric tolerance frame: circular-runout symbol | value | A, with a leader to ``target``."""
    x, y = at
    h = RUNOUT_H
    widths = RUNOUT_W
    xs = [x]
    for w in widths:
        xs.append(xs[-1] + w)
    psp.add_lwpolyline([(xs[0], y), (xs[-1], y), (xs[-1], y + h), (xs[0], y + h)], close=True,
                       dxfattribs={"layer": "dimension"})
    for xi in xs[1:-1]:
        psp.add_line((xi, y), (xi, y + h), dxfattribs={"layer": "dimension"})
    # circular runout symbol (ISO 1101): one arrow at 45°
    cx, cy = xs[0] + 4.0, y + 3.5
    a, b = (cx - 2.0, cy - 2.0), (cx + 2.0, cy + 2.0)
    psp.add_line(a, b, dxfattribs={"layer": "dimension"})
    ang = math.radians(45)
    left = (b[0] - 1.6 * math.cos(ang - 0.4), b[1] - 1.6 * math.sin(ang - 0.4))
    right = (b[0] - 1.6 * math.cos(ang + 0.4), b[1] - 1.6 * math.sin(ang + 0.4))
    psp.add_solid([b, left, right], dxfattribs={"layer": "dimension"})
    for text, cxi in ((f"{value:.3f}", (xs[1] + xs[2]) / 2), ("A", (xs[2] + xs[3]) / 2)):
        mt = psp.add_mtext(text, dxfattribs={"layer": "text", "style": TEXT_STYLE, "char_height": TEXT_HEIGHT,
                                             "attachment_point": 5})
        mt.dxf.insert = (cxi, y + h / 2)
    start = (xs[-1], y + h / 2) if target[0] > xs[-1] else (xs[0], y + h / 2)
    psp.add_line(start, (target[0], start[1]), dxfattribs={"layer": "dimension"})
    psp.add_line((target[0], start[1]), target, dxfattribs={"layer": "dimension"})
    # arrowhead on the surface
    dy = 1.0 if start[1] > target[1] else -1.0
    psp.add_solid([target, (target[0] - 0.9, target[1] + dy * 3.0), (target[0] + 0.9, target[1] + dy * 3.0)],
                  dxfattribs={"layer": "dimension"})


def _notes(psp: BaseLayout, resolved: Resolved, data: SheetData, top: float) -> None:
    """The tolerance note block (fits, then shop notes), the full width right of the main view."""
    parts = ["{\\LNOTES}"]
    for title, lines in numbered([("Fits (finished sizes)", fit_lines(resolved)), ("Shop", shop_lines(resolved, data))]):
        parts += ["{\\L" + title + "}"] + [escape(s) for s in lines]
    mt = psp.add_mtext("\\P".join(parts), dxfattribs={"layer": "text", "style": TEXT_STYLE,
                                                      "char_height": TEXT_HEIGHT, "attachment_point": 1,
                                                      "width": FRAME[2] - RIGHT_X - 3.0})
    mt.dxf.insert = (RIGHT_X + 1.5, top)


def _cautions(psp: BaseLayout, top_left: tuple[float, float], width: float) -> float:
    """The cautions under the revision block; returns the y of their last line's foot."""
    parts = ["{\\LCAUTIONS}"] + [escape(s) for s in caution_lines()]
    mt = psp.add_mtext("\\P".join(parts), dxfattribs={"layer": "text", "style": TEXT_STYLE,
                                                      "char_height": TEXT_HEIGHT, "attachment_point": 1,
                                                      "width": width - 3.0})
    mt.dxf.insert = (top_left[0] + 1.5, top_left[1])
    font = font_of_file(psp.doc.styles.get(TEXT_STYLE).dxf.get("font", ""))
    lines = wrap(mt.plain_text(split=True), TEXT_HEIGHT, width - 3.0, font)
    return top_left[1] - mtext_extent(lines, TEXT_HEIGHT, font)[1]
