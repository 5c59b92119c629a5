"""The title block (ISO 7200 fields plus material, mass, scale, units, projection, general tolerance)
and the revision block, drawn from lines and MTEXT."""
from __future__ import annotations


from dataclasses import dataclass

from ezdxf.layouts import BaseLayout

from ..builder import Resolved
from .mtext import escape
from .layers import TEXT_HEIGHT, TEXT_STYLE
from .notes import SheetData

__all__ = ["Cell", "title_cells", "draw_title_block", "draw_revision_block", "draw_projection_symbol",
           "LABEL_HEIGHT", "TITLE_WIDTH", "ROW"]

LABEL_HEIGHT = TEXT_HEIGHT  # every text on the sheet is ISO 3098-1 size 3.5
TITLE_WIDTH = 180.0  # ISO 7200 largest width
ROW = 12.0  # a 3.5 mm label over a 3.5 mm value with clear space between
REV_COLUMNS = (0.0, 12.0, 40.0)  # letter, date, description (mm from the block's left edge)


@dataclass(frozen=True)
class Cell:
    """One field of the title block: label, value, column start and width (mm), row from the bottom."""

    label: str
    value: str
    x: float
    width: float
    row: int


def title_cells(resolved: Resolved, data: SheetData, scale_text: str) -> list[Cell]:
    """The fields, laid out in four rows of a 180 mm block; each column is wide enough for its
    label and value at 3.5 mm."""
    d = resolved.design["design"]
    shop = resolved.design["shop"]
    return [
        Cell("Title", d["title"] or resolved.design.name, 0, 120, 3),
        Cell("Identification number", d["identification"] or resolved.design.name, 120, 60, 3),
        Cell("Legal owner", d["owner"], 0, 60, 2),
        Cell("Document type", "Detail drawing", 60, 45, 2),
        Cell("Revision", resolved.design.revision, 105, 25, 2),
        Cell("Sheet", "1/1", 130, 20, 2),
        Cell("Units", "mm", 150, 30, 2),
        Cell("Created by", d["creator"], 0, 40, 1),
        Cell("Approved by", d["approver"], 40, 40, 1),
        Cell("Date of issue", d["date"], 80, 35, 1),
        Cell("Material", resolved["material.name"], 115, 65, 1),
        Cell("Mass (one half)", f"{data.half_mass_g:.1f} g", 0, 40, 0),
        Cell("Scale", scale_text, 40, 50, 0),
        Cell("General tolerance", shop["general_tolerance"], 90, 50, 0),
        Cell("Projection", "", 140, 40, 0),
    ]


def _text(layout: BaseLayout, text: str, at: tuple[float, float], height: float, width: float | None = None,
          attach: int = 7) -> None:
    mt = layout.add_mtext(text, dxfattribs={"layer": "text", "style": TEXT_STYLE, "char_height": height,
                                            "attachment_point": attach})
    mt.dxf.insert = at
    if width is not None:
        mt.dxf.width = width


def draw_title_block(layout: BaseLayout, origin: tuple[float, float], cells: list[Cell]) -> None:
    """Draw the block with its lower-left corner at ``origin``."""
    x0, y0 = origin
    rows = 1 + max(c.row for c in cells)
    layout.add_lwpolyline([(x0, y0), (x0 + TITLE_WIDTH, y0), (x0 + TITLE_WIDTH, y0 + rows * ROW), (x0, y0 + rows * ROW)],
                          close=True, dxfattribs={"layer": "frame"})
    for r in range(1, rows):
        layout.add_line((x0, y0 + r * ROW), (x0 + TITLE_WIDTH, y0 + r * ROW), dxfattribs={"layer": "frame", "lineweight": 25})
    for c in cells:
        left, bottom = x0 + c.x, y0 + c.row * ROW
        if c.x > 0:
            layout.add_line((left, bottom), (left, bottom + ROW), dxfattribs={"layer": "frame", "lineweight": 25})
        _text(layout, escape(c.label), (left + 1.0, bottom + ROW - 0.8), LABEL_HEIGHT, attach=1)
        if c.value:
            _text(layout, escape(c.value), (left + 1.5, bottom + 1.5), TEXT_HEIGHT, attach=7)
        if c.label == "Projection":
            draw_projection_symbol(layout, (left + c.width / 2, bottom + 4.6), 3.2)


def draw_projection_symbol(layout: BaseLayout, center: tuple[float, float], h: float) -> None:
    """The first-angle projection symbol (ISO 128-30): truncated cone seen from the side, its end view on the right."""
    cx, cy = center
    d_big, d_small, length = h, h / 2, 1.2 * h
    x_cone = cx - 0.9 * h
    pts = [(x_cone - length / 2, cy - d_small / 2), (x_cone + length / 2, cy - d_big / 2),
           (x_cone + length / 2, cy + d_big / 2), (x_cone - length / 2, cy + d_small / 2)]
    layout.add_lwpolyline(pts, close=True, dxfattribs={"layer": "frame", "lineweight": 25})
    x_end = cx + 1.0 * h
    layout.add_circle((x_end, cy), d_big / 2, dxfattribs={"layer": "frame", "lineweight": 25})
    layout.add_circle((x_end, cy), d_small / 2, dxfattribs={"layer": "frame", "lineweight": 25})
    layout.add_line((x_cone - length / 2 - 1.0, cy), (x_end + d_big / 2 + 1.0, cy),
                    dxfattribs={"layer": "centre", "lineweight": 18, "ltscale": 0.15})


def draw_revision_block(layout: BaseLayout, top_left: tuple[float, float], width: float,
                        resolved: Resolved) -> float:
    """Revision rows (letter, date, what changed) under a header; returns the block height."""
    x0, y_top = top_left
    rows = list(resolved.design.revisions) or []
    cols = REV_COLUMNS
    height = ROW * (1 + max(1, len(rows)))
    layout.add_lwpolyline([(x0, y_top), (x0 + width, y_top), (x0 + width, y_top - height), (x0, y_top - height)],
                          close=True, dxfattribs={"layer": "frame"})
    for i, label in enumerate(("Rev.", "Date", "Description")):
        _text(layout, label, (x0 + cols[i] + 1.0, y_top - ROW + 3.0), LABEL_HEIGHT, attach=7)
    for c in cols[1:]:
        layout.add_line((x0 + c, y_top), (x0 + c, y_top - height), dxfattribs={"layer": "frame", "lineweight": 25})
    for j in range(1, 1 + max(1, len(rows))):
        layout.add_line((x0, y_top - j * ROW), (x0 + width, y_top - j * ROW), dxfattribs={"layer": "frame", "lineweight": 25})
    for j, rev in enumerate(rows):
        y = y_top - (j + 1) * ROW - 1.5  # top of the row's text: a long note wraps downward inside the row
        _text(layout, escape(rev.letter), (x0 + cols[0] + 1.5, y), TEXT_HEIGHT, attach=1)
        _text(layout, escape(rev.date), (x0 + cols[1] + 1.0, y), TEXT_HEIGHT, attach=1)
        _text(layout, escape(rev.note), (x0 + cols[2] + 1.0, y), TEXT_HEIGHT, width=width - cols[2] - 2, attach=1)
    return height
