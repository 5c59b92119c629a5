"""Layers, line types, the text style and the dimension style of the sheet.

Line types and widths follow ISO 128-2: visible outlines continuous wide, centre
lines long-dashed dotted narrow, hatching, dimensions and thin lines continuous
narrow; wide : narrow = 2 : 1 (0.5 mm : 0.25 mm).
"""
from __future__ import annotations

from typing import NamedTuple

from ezdxf.document import Drawing

from .lettering import FONT_FILE

__all__ = ["Layer", "LAYERS", "WIDE", "NARROW", "TEXT_HEIGHT", "ARROW_SIZE", "TEXT_STYLE", "DIMSTYLE",
           "APPID", "setup", "LINETYPES", "layer"]

WIDE = 50  # 1/100 mm, ISO 128-2 line group 0.5
NARROW = 25
TEXT_HEIGHT = 3.5  # mm on paper, ISO 3098-1 nominal size
ARROW_SIZE = 3.0  # mm on paper
TEXT_STYLE = "iso-lettering"
DIMSTYLE = "iso-section"
LONG_DASH_DOT = "long-dash-dot"
APPID = "YODRAFT"  # tags each dimension with the feature.parameter it shows


class Layer(NamedTuple):
    """One layer: its name, what goes on it, its ISO 128-2 line type and width (1/100 mm)."""

    name: str
    purpose: str
    linetype: str
    lineweight: int
    color: int


LAYERS: tuple[Layer, ...] = (
    Layer("outline", "visible outline of the section (the loop and its mirror)", "CONTINUOUS", WIDE, 7),
    Layer("centre", "spin axis, centre lines", LONG_DASH_DOT, NARROW, 1),
    Layer("hatch", "section hatching at 45°", "CONTINUOUS", NARROW, 8),
    Layer("thread", "tapped thread: major diameter narrow, thread limit wide", "CONTINUOUS", NARROW, 3),
    Layer("dimension", "dimensions, leaders, runout callouts", "CONTINUOUS", NARROW, 5),
    Layer("text", "title block, notes, revision block text", "CONTINUOUS", NARROW, 7),
    Layer("frame", "border, title block and note block lines", "CONTINUOUS", WIDE, 7),
    Layer("detail", "detail frames and their labels", "CONTINUOUS", NARROW, 6),
    Layer("viewport", "paper-space viewport boundary (not plotted)", "CONTINUOUS", NARROW, 8),
)


#: line type patterns in paper mm: dash (+), gap (−), dot (0)
LINETYPES = {
    # ISO 128-2 type 04 for d = 0.25 mm: long dash 24d, gap 3d, dot ≤ 0.5d, gap 3d (from memory)
    LONG_DASH_DOT: (12.0, -1.5, 0.0, -1.5),
    "long-dash-dot-small": (1.8, -0.45, 0.0, -0.45),  # the projection symbol's axis
}


def setup(doc: Drawing) -> None:
    """Add the line type, layers, text style, dimension style and our xdata application id."""
    # ISO 128-2 type 04 for d = 0.5 mm: long dash 24d, gap 3d, dot ≤ 0.5d, gap 3d (from memory)
    for name, pattern in LINETYPES.items():
        doc.linetypes.add(name, pattern=[sum(abs(x) for x in pattern), *pattern],
                          description="long dash, dot (ISO 128-2 type 04)")
    for layer in LAYERS:
        entry = doc.layers.add(layer.name, color=layer.color, linetype=layer.linetype, lineweight=layer.lineweight)
        entry.description = layer.purpose
        if layer.name == "viewport":
            entry.dxf.plot = 0
    # a sans commonly installed (see lettering.py); the layout measures every text in it
    doc.styles.add(TEXT_STYLE, font=FONT_FILE)
    doc.appids.add(APPID)
    style = doc.dimstyles.add(DIMSTYLE)
    attribs = {
        "dimtxsty": TEXT_STYLE, "dimtxt": TEXT_HEIGHT, "dimasz": ARROW_SIZE,
        "dimexe": 2.0, "dimexo": 0.0, "dimgap": 1.0, "dimtad": 1, "dimtih": 0, "dimtoh": 0,
        "dimdec": 2, "dimzin": 8, "dimdsep": ord("."), "dimadec": 1, "dimazin": 2,
        "dimlwd": NARROW, "dimlwe": NARROW, "dimclrd": 256, "dimclre": 256, "dimclrt": 256,
        "dimtfac": 1.0, "dimtdec": 5, "dimtzin": 0, "dimatfit": 3, "dimtix": 0, "dimlunit": 2, "dimaunit": 0,
        "dimscale": 1.0,
    }
    for key, value in attribs.items():
        style.dxf.set(key, value)


def layer(name: str) -> Layer:
    """The layer called ``name``."""
    return next(entry for entry in LAYERS if entry.name == name)
