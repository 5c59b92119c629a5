"""The SVG preview of the sheet at true scale: our own writer (real text, exact lines and arcs)."""
from __future__ import annotations

from ezdxf.document import Drawing

from .svg_sheet import sheet_svg

__all__ = ["svg_bytes"]


def svg_bytes(doc: Drawing, layout_name: str, paper: tuple[float, float]) -> bytes:
    """The paper-space layout ``layout_name`` as SVG, 1 mm of paper = 1 mm of SVG, black on white."""
    return sheet_svg(doc, layout_name, paper)
