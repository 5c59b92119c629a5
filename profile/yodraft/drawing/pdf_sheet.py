"""The PDF backend: the composed sheet as one vector page of its paper size, the font embedded.

Written with ReportLab (BSD licence) in its invariant mode, so the same sheet gives the same bytes.
Lines, arcs (as fine chords), fills and section lining are vector paths in paper millimetres; texts
are set in the sheet's TrueType font, embedded as a subset, at the layout's positions.
"""
from __future__ import annotations

import hashlib
import io
import re

from . import layers
from .lettering import lettering
from .sheetdata import Circle, Dimension, Fill, Hatch, Item, Sheet, Stroke, Text, flatten
from .svg_sheet import dash_array, line_width

__all__ = ["sheet_pdf"]

MM = 72.0 / 25.4  # PDF points per millimetre
FONT_NAME = "SheetSans"


def _register() -> str:
    """The sheet's font registered with ReportLab (the TrueType file, embedded when used); else Helvetica."""
    from reportlab.pdfbase import pdfmetrics
    from reportlab.pdfbase.ttfonts import TTFont

    font = lettering()
    if font.path is None:
        return "Helvetica"
    if FONT_NAME not in pdfmetrics.getRegisteredFontNames():
        pdfmetrics.registerFont(TTFont(FONT_NAME, str(font.path)))
    return FONT_NAME


def sheet_pdf(sheet: Sheet, title: str = "", author: str = "", date: str = "2000-01-01") -> bytes:
    """One page the size of the sheet, drawn at 1:1; its creation date is ``date`` (the design's)."""
    from reportlab.pdfgen import canvas

    name = _register()
    em_per_cap = lettering().metrics.em_per_cap
    buf = io.BytesIO()
    c = canvas.Canvas(buf, pagesize=(sheet.paper[0] * MM, sheet.paper[1] * MM), invariant=1, pageCompression=1)
    c.setTitle(title)
    c.setAuthor(author)
    c.setCreator("yodraft")
    c.scale(MM, MM)
    c.setLineCap(1)
    c.setLineJoin(1)

    def stroke(item: Stroke) -> None:
        c.setLineWidth(line_width(item))
        dash = dash_array(item)
        c.setDash(dash if dash else [], 0)
        pts = flatten(item.points, item.bulges, item.closed, step_deg=2.0)
        p = c.beginPath()
        p.moveTo(*pts[0])
        for q in pts[1:]:
            p.lineTo(*q)
        if item.closed:
            p.close()
        c.drawPath(p, stroke=1, fill=0)

    def draw(it: Item) -> None:
        if isinstance(it, Stroke):
            stroke(it)
        elif isinstance(it, Circle):
            c.setLineWidth(line_width(it))
            c.setDash([], 0)
            c.circle(it.center[0], it.center[1], it.radius, stroke=1, fill=0)
        elif isinstance(it, Fill):
            p = c.beginPath()
            p.moveTo(*it.points[0])
            for q in it.points[1:]:
                p.lineTo(*q)
            p.close()
            c.drawPath(p, stroke=0, fill=1)
        elif isinstance(it, Hatch):
            c.setLineWidth(layers.layer(it.layer).lineweight / 100.0)
            c.setDash([], 0)
            p = c.beginPath()
            for a, b in it.lines:
                p.moveTo(*a)
                p.lineTo(*b)
            c.drawPath(p, stroke=1, fill=0)
        elif isinstance(it, Text):
            c.saveState()
            c.translate(*it.at)
            if it.rotation:
                c.rotate(it.rotation)
            c.setFont(name, it.height * em_per_cap)
            c.drawString(0, 0, it.text)
            c.restoreState()
        elif isinstance(it, Dimension):
            for sub in it.items:
                draw(sub)

    for it in sheet.items:
        draw(it)
    c.showPage()
    c.save()
    # the stamp ReportLab wrote (fixed in invariant mode, or SOURCE_DATE_EPOCH's) becomes the design's date,
    # same length, so the cross-reference offsets stay right
    stamp = "D:" + date.replace("-", "")[:8].ljust(8, "0") + "000000+00'00'"
    data = re.sub(rb"D:\d{14}[+-]\d\d'\d\d'", stamp.encode("ascii"), buf.getvalue())
    # and the file identifier a digest of the page itself, not of the moment of writing
    ident = re.compile(rb"/ID \n\[<[0-9a-f]{32}><[0-9a-f]{32}>\]")
    digest = hashlib.md5(ident.sub(b"", data), usedforsecurity=False).hexdigest().encode("ascii")
    return ident.sub(b"/ID \n[<" + digest + b"><" + digest + b">]", data)
