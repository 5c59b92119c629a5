"""The SVG preview of the sheet at true scale (ezdxf's drawing add-on, no extra dependency)."""
from __future__ import annotations

import random

from ezdxf.addons.drawing import Frontend, RenderContext, layout, svg
from ezdxf.addons.drawing.config import BackgroundPolicy, ColorPolicy, Configuration, LineweightPolicy
from ezdxf.document import Drawing
from ezdxf.math import BoundingBox2d

__all__ = ["svg_bytes"]


def svg_bytes(doc: Drawing, layout_name: str, paper: tuple[float, float]) -> bytes:
    """The paper-space layout ``layout_name`` as SVG, 1 mm of paper = 1 mm of SVG, black on white."""
    psp = doc.paperspace(layout_name)
    backend = svg.SVGBackend()
    config = Configuration(background_policy=BackgroundPolicy.WHITE, color_policy=ColorPolicy.BLACK,
                           lineweight_policy=LineweightPolicy.ABSOLUTE)
    # the hatch renderer nudges pattern origins by a random amount; a fixed seed keeps the
    # preview byte-identical between builds, and the caller's random state is put back
    state = random.getstate()
    try:
        random.seed(0)
        Frontend(RenderContext(doc), backend, config=config).draw_layout(psp, finalize=True)
    finally:
        random.setstate(state)
    page = layout.Page(paper[0], paper[1], layout.Units.mm, margins=layout.Margins.all(0))
    settings = layout.Settings(fit_page=False, scale=1.0)
    text = backend.get_string(page, settings=settings, render_box=BoundingBox2d([(0, 0), paper]))
    return text.encode("utf-8")
