"""The SVG preview of the sheet at true scale (ezdxf's drawing add-on, no extra dependency)."""
from __future__ import annotations

from ezdxf.addons.drawing import Frontend, RenderContext, layout, svg
from ezdxf.addons.drawing.config import BackgroundPolicy, ColorPolicy, Configuration, LineweightPolicy
from ezdxf.document import Drawing

__all__ = ["svg_bytes"]


def svg_bytes(doc: Drawing, layout_name: str, paper: tuple[float, float]) -> bytes:
    """The paper-space layout ``layout_name`` as SVG, 1 mm of paper = 1 mm of SVG, black on white."""
    psp = doc.paperspace(layout_name)
    backend = svg.SVGBackend()
    config = Configuration(background_policy=BackgroundPolicy.WHITE, color_policy=ColorPolicy.BLACK,
                           lineweight_policy=LineweightPolicy.ABSOLUTE)
    Frontend(RenderContext(doc), backend, config=config).draw_layout(psp, finalize=True)
    page = layout.Page(paper[0], paper[1], layout.Units.mm, margins=layout.Margins.all(0))
    settings = layout.Settings(fit_page=False, scale=1.0)
    box = layout.BoundingBox2d([(0, 0), paper]) if hasattr(layout, "BoundingBox2d") else None
    from ezdxf.math import BoundingBox2d

    text = backend.get_string(page, settings=settings, render_box=BoundingBox2d([(0, 0), paper]))
    del box
    return text.encode("utf-8")
