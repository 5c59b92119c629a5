"""The DXF backend: the composed sheet as an R2013 drawing.

Model space holds the main view at 1:1 (x = z, y = r) with its hatching and dimensions; the seat
detail is a block of true 1:1 geometry inserted at its scale; the paper-space layout ``sheet`` is the
only layout and shows the main view through a viewport. Each dimension is a real DIMENSION entity
(measured points, dimension line, text location, measurement, YODRAFT xdata naming its keys) whose
block holds exactly the lines, arrowheads and texts the layout placed. Texts are single-line TEXT
entities in the sheet's font, with DXF's %-codes kept literal.
"""
from __future__ import annotations

import math

from ezdxf.document import Drawing
from ezdxf.layouts import BaseLayout
from ezdxf.math import Vec2

from ..builder import Resolved
from . import layers
from .layers import APPID, DIMSTYLE, TEXT_STYLE
from .outline import model_extents, new_document
from .sheetdata import Circle, Dimension, Fill, Hatch, Item, Sheet, Stroke, Text, View

__all__ = ["sheet_document", "LAYOUT_NAME", "DETAIL_BLOCK", "dxf_text"]

LAYOUT_NAME = "sheet"
DETAIL_BLOCK = "seat-detail"


def dxf_text(text: str) -> str:
    """``text`` for a DXF TEXT entity: every % written as DXF's literal-percent code, so ``%%c``
    stays ``%%c`` and does not turn into a symbol, and a caret kept from starting a control code.

    >>> dxf_text("50%% off %%c"), dxf_text("g/cm^3")
    ('50%%%%%% off %%%%%%c', 'g/cm^ 3')
    """
    return text.replace("%", "%%%").replace("^", "^ ")


class _Target:
    """Where a view's items go and how paper coordinates map there."""

    def __init__(self, layout: BaseLayout, view: View | None, block_scale: float = 1.0) -> None:
        self.layout = layout
        self.view = view

    def p(self, q) -> tuple[float, float]:  # type: ignore[no-untyped-def]
        return self.view.to_model(q) if self.view is not None else (q[0], q[1])

    def length(self, x: float) -> float:
        return x / self.view.scale if self.view is not None else x


def _attribs(item, target: _Target) -> dict:  # type: ignore[no-untyped-def]
    out = {"layer": item.layer}
    weight = getattr(item, "weight", None)
    if weight is not None:
        out["lineweight"] = int(round(weight * 100))
    lt = getattr(item, "linetype", None)
    if lt is not None:
        out["linetype"] = lt
    if target.view is not None and lt is None and layers.layer(item.layer).linetype != "CONTINUOUS":
        pass
    return out


def _write(item: Item, t: _Target, doc: Drawing) -> None:
    lay = t.layout
    if isinstance(item, Stroke):
        pts = [t.p(q) for q in item.points]
        at = _attribs(item, t)
        if len(pts) == 2 and not item.bulges and not item.closed:
            lay.add_line(pts[0], pts[1], dxfattribs=at)
        else:
            bulges = list(item.bulges) + [0.0] * (len(pts) - len(item.bulges))
            lay.add_lwpolyline([(x, y, 0.0, 0.0, b) for (x, y), b in zip(pts, bulges)], format="xyseb",
                               close=item.closed, dxfattribs=at)
        if t.view is not None and item.layer == "centre" and item.linetype is None:
            pass
    elif isinstance(item, Circle):
        lay.add_circle(t.p(item.center), t.length(item.radius), dxfattribs=_attribs(item, t))
    elif isinstance(item, Fill):
        pts = [t.p(q) for q in item.points]
        if len(pts) == 3:
            pts.append(pts[2])
        lay.add_solid([pts[0], pts[1], pts[3], pts[2]], dxfattribs={"layer": item.layer})
    elif isinstance(item, Text):
        at = t.p(item.at)
        e = lay.add_text(dxf_text(item.text), height=t.length(item.height), rotation=item.rotation,
                         dxfattribs={"layer": item.layer, "style": TEXT_STYLE})
        e.dxf.insert = at
    elif isinstance(item, Hatch):
        _hatch(item, t)
    elif isinstance(item, Dimension):
        _dimension(item, t, doc)


def _hatch(item: Hatch, t: _Target) -> None:
    """One HATCH per closed loop (or per polygon of the detail), the pattern in the target's units so it
    shows ``spacing`` apart on paper."""
    spacing = t.length(item.spacing)
    base = t.p(item.origin)
    loops = item.loops
    hatch = t.layout.add_hatch(dxfattribs={"layer": item.layer, "color": 256})
    c, s = math.cos(math.radians(item.angle)), math.sin(math.radians(item.angle))
    hatch.set_pattern_fill("section-45", color=256, angle=0.0, scale=1.0, style=1, pattern_type=0,
                           definition=[[item.angle, base, (-s * spacing, c * spacing), []]])
    for loop in loops:
        pts = [t.p(q) for q in loop.points]
        bulges = list(loop.bulges) + [0.0] * (len(pts) - len(loop.bulges))
        hatch.paths.add_polyline_path([(x, y, b) for (x, y), b in zip(pts, bulges)], is_closed=True, flags=1)


def _dimension(dim: Dimension, t: _Target, doc: Drawing) -> None:
    """A DIMENSION entity with the placed graphics as its block."""
    req = dim.request
    lay = t.layout
    sign = -1.0 if dim.lower else 1.0
    pts = [(p[0], sign * p[1]) for p in req.points] if dim.lower else list(req.points)
    override = {"dimscale": t.length(1.0)}
    text = dim.text.replace(" / ", "\\P")
    base = t.p(dim.base)
    at = t.p(dim.text_at)
    if req.kind == "linear":
        d = lay.add_linear_dim(base=base, p1=pts[0], p2=pts[1], angle=0 if req.direction == "axial" else 90,
                               text=text, dimstyle=DIMSTYLE, override=override, dxfattribs={"layer": "dimension"})
    elif req.kind == "diameter":
        z, r = req.points[0]
        far, near = (z, sign * abs(r)), (z, -sign * abs(r))
        override.update({"dimse1": 1, "dimsd1": 1, "dimsah": 1, "dimblk1": "NONE"})
        d = lay.add_linear_dim(base=base, p1=near, p2=far, angle=90, text=text, dimstyle=DIMSTYLE,
                               override=override, dxfattribs={"layer": "dimension"})
    elif req.kind == "radius":
        c, m = pts[:2]
        # the measured point is where the leader's arrow touches the arc (its first stroke starts there), not the
        # direction of its knee (``base``), which may lie on the centre or past it: a concave arc's leader runs
        # toward the centre, and the radius would turn the wrong way or divide by zero
        tip = t.p(dim.items[0].points[0])
        d = lay.add_radius_dim(center=c, radius=math.dist(c, m),
                               angle=math.degrees(math.atan2(tip[1] - c[1], tip[0] - c[0])), text=text,
                               dimstyle=DIMSTYLE, override=override, dxfattribs={"layer": "dimension"})
    else:
        o, p1, p2 = pts
        if dim.lower:  # mirrored, it turns clockwise from edge to plane: measured counter-clockwise from the plane
            p1, p2 = p2, p1
        d = lay.add_angular_dim_3p(base=base, center=o, p1=p1, p2=p2, text=text, dimstyle=DIMSTYLE,
                                   override=override, dxfattribs={"layer": "dimension"})
    entity = d.dimension
    d.set_location(at, leader=False)
    d.commit()
    block = doc.blocks.new_anonymous_block(type_char="D")
    entity.dxf.geometry = block.name
    entity.dxf.text_midpoint = Vec2(at)
    from .requests import measure

    value = measure(req)
    entity.dxf.actual_measurement = value if req.kind != "angle" else math.radians(value)
    inner = _Target(block, t.view)
    for item in dim.items:
        _write(item, inner, doc)
    entity.set_xdata(APPID, [(1000, key) for key in req.keys])


def sheet_document(sheet: Sheet, resolved: Resolved) -> Drawing:
    """The drawing of ``sheet``: model space, the detail block and the ``sheet`` layout."""
    d = resolved.design
    doc = new_document(d["design"]["date"], f"{d.name}-{d.revision}:{sheet.name}")
    layers.setup(doc)
    doc.header["$PSLTSCALE"] = 1  # line type patterns in paper millimetres in every viewport
    msp = doc.modelspace()
    main = sheet.view("main")
    # each enlarged detail a block of model geometry, inserted on the sheet at its scale: the seat's (the
    # ring's sheet names its own) under DETAIL_BLOCK, any other under its view's name
    details = [(v, sheet.notes.get("detail_block", DETAIL_BLOCK) if v.name == "detail" else v.name)
               for v in sheet.views if v.name != "main"]
    blocks = {view.name: doc.blocks.new(name) for view, name in details}
    # the one paper layout: ezdxf's default "Layout1" renamed, set up as the sheet
    psp = doc.layouts.get("Layout1")
    doc.layouts.rename("Layout1", LAYOUT_NAME)
    psp = doc.paperspace(LAYOUT_NAME)
    psp.page_setup(size=sheet.paper, margins=(0, 0, 0, 0), units="mm")
    for e in list(psp.query("VIEWPORT")):
        if e.dxf.id != 1:
            psp.delete_entity(e)
    targets = {"main": _Target(msp, main), "paper": _Target(psp, None)}
    for view, _ in details:
        targets[view.name] = _Target(blocks[view.name], view)
    for item in sheet.items:
        view = getattr(item, "view", "paper")
        target = targets[view]
        if view == "main" and isinstance(item, Stroke) and item.layer == "centre":
            # a centre line is drawn on paper over the view, so its dashes are paper millimetres
            target = targets["paper"]
        _write(item, target, doc)
    x0, y0, x1, y1 = main.box
    centre = ((x0 + x1) / 2, (y0 + y1) / 2)
    vp = psp.add_viewport(center=centre, size=(x1 - x0, y1 - y0), view_center_point=main.to_model(centre),
                          view_height=(y1 - y0) / main.scale, dxfattribs={"layer": "viewport"})
    vp.dxf.flags = vp.dxf.flags | 16384  # locked display
    for view, name in details:
        psp.add_blockref(name, view.origin, dxfattribs={"xscale": view.scale, "yscale": view.scale, "layer": "detail"})
    _extents(doc, sheet)
    return doc


def _extents(doc: Drawing, sheet: Sheet) -> None:
    """Finite extents and zoom variables: model space's from the main view, paper space's the sheet."""
    main = sheet.view("main")
    lo = main.to_model(main.box[:2])
    hi = main.to_model(main.box[2:])
    model_extents(doc, (lo[0], lo[1]), (hi[0], hi[1]))
    doc.header["$TILEMODE"] = 0  # open on the sheet
    try:
        doc.set_modelspace_vport(height=hi[1] - lo[1], center=((lo[0] + hi[0]) / 2, (lo[1] + hi[1]) / 2))
    except Exception:  # pragma: no cover - older ezdxf
        pass
    layout = doc.layouts.get(LAYOUT_NAME)
    layout.dxf_layout.dxf.extmin = (0.0, 0.0, 0.0)
    layout.dxf_layout.dxf.extmax = (sheet.paper[0], sheet.paper[1], 0.0)
    layout.dxf_layout.dxf.limmin = (0.0, 0.0)
    layout.dxf_layout.dxf.limmax = sheet.paper
    doc.layouts.set_active_layout(LAYOUT_NAME)
