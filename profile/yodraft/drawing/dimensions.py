"""Rendered DIMENSION entities measured between points of the drawn geometry, tagged with what they show.

``Annotator`` writes into one layout (model space or a detail block) whose
contents appear at ``scale`` on paper, so text is 3.5 mm and arrows 3 mm there.
Each dimension carries xdata naming the feature.parameter it shows (our own
application id), which the tests use to find it.
"""
from __future__ import annotations

import math
from dataclasses import dataclass

from ezdxf.layouts import BaseLayout

from ..geometry import Point
from .layers import APPID, DIMSTYLE, TEXT_HEIGHT, ARROW_SIZE

__all__ = ["Annotator", "DIA", "tags_of"]

DIA = "Ø"
LAYER = "dimension"


def tags_of(dim) -> list[str]:  # type: ignore[no-untyped-def]
    """The feature.parameter keys a dimension entity is tagged with."""
    if not dim.has_xdata(APPID):
        return []
    return [value for code, value in dim.get_xdata(APPID) if code == 1000]


@dataclass(frozen=True)
class Annotator:
    """Adds dimensions to ``layout`` for a view drawn at ``scale`` (paper mm per model mm)."""

    layout: BaseLayout
    scale: float

    @property
    def k(self) -> float:
        """Model millimetres per paper millimetre."""
        return 1.0 / self.scale

    def _finish(self, dim, keys: tuple[str, ...]):  # type: ignore[no-untyped-def]
        dim.render()
        dim.dimension.set_xdata(APPID, [(1000, key) for key in keys])
        return dim.dimension

    def _override(self, extra: dict | None = None) -> dict:
        base = {"dimscale": self.k}
        base.update(extra or {})
        return base

    def half_diameter(self, keys: tuple[str, ...], at: Point, x_line: float, text_r: float | None = None,
                      text: str = DIA + "<>", extra: dict | None = None, lower: bool = False):  # type: ignore[no-untyped-def]
        """ISO 129-1 half-shown diameter: one arrowhead at the feature, the line running to the axis,
        the full diameter (measured from the mirror point to the point) with the Ø prefix.

        ``at`` is (z, r) on the upper outline; with ``lower`` the dimension is drawn on the mirror half.
        The text sits beside the line, centred at ``text_r`` (default just inside the arrow).
        """
        z, r = at
        sign = -1.0 if lower else 1.0
        p_near, p_far = (z, -sign * r), (z, sign * r)
        length = self.text_length(text.split("\\P")[0], 4.0) * self.k
        if text_r is None:
            text_r = sign * (r - (ARROW_SIZE + 1.5) * self.k - length / 2)
        side = -1.0 if x_line <= z else 1.0
        lines = text.count("\\P") + 1
        gap = (1.0 + TEXT_HEIGHT * (0.5 + 1.05 * (lines - 1))) * self.k
        loc = (x_line - gap if not lower else x_line + gap, text_r)
        dim = self.layout.add_linear_dim(
            base=(x_line, 0.0), p1=p_near, p2=p_far, angle=90, text=text, dimstyle=DIMSTYLE,
            override=self._override({"dimse1": 1, "dimsd1": 1, "dimsah": 1, "dimblk1": "NONE", **(extra or {})}),
            dxfattribs={"layer": LAYER})
        dim.set_location(loc, leader=False)
        del side
        return self._finish(dim, keys)

    def linear(self, keys: tuple[str, ...], p1: Point, p2: Point, base: Point, angle: float = 0.0,
               text: str = "<>", text_at: Point | None = None, extra: dict | None = None):  # type: ignore[no-untyped-def]
        """A linear dimension between two points of the geometry (angle 0: axial, 90: radial)."""
        dim = self.layout.add_linear_dim(base=base, p1=p1, p2=p2, angle=angle, text=text, dimstyle=DIMSTYLE,
                                         override=self._override(extra), dxfattribs={"layer": LAYER})
        if text_at is not None:
            dim.set_location(text_at, leader=False)
        return self._finish(dim, keys)

    def angle(self, keys: tuple[str, ...], center: Point, p1: Point, p2: Point, radius: float,
              text_at: Point | None = None):  # type: ignore[no-untyped-def]
        """An angular dimension from ``p1`` to ``p2`` (counter-clockwise) about ``center``."""
        a1 = math.atan2(p1[1] - center[1], p1[0] - center[0])
        a2 = math.atan2(p2[1] - center[1], p2[0] - center[0])
        mid = a1 + ((a2 - a1) % (2 * math.pi)) / 2
        base = (center[0] + radius * math.cos(mid), center[1] + radius * math.sin(mid))
        dim = self.layout.add_angular_dim_3p(base=base, center=center, p1=p1, p2=p2, dimstyle=DIMSTYLE,
                                             override=self._override({"dimexe": 2.0}), dxfattribs={"layer": LAYER})
        if text_at is not None:
            dim.set_location(text_at, leader=False)
        return self._finish(dim, keys)

    def radius(self, keys: tuple[str, ...], center: Point, r: float, angle_deg: float, text_at: Point):  # type: ignore[no-untyped-def]
        """A radius dimension ``R…`` of a fillet, its text outside at ``text_at``."""
        dim = self.layout.add_radius_dim(center=center, radius=r, angle=angle_deg, location=text_at, text="<>",
                                         dimstyle=DIMSTYLE, override=self._override({"dimtmove": 1}),
                                         dxfattribs={"layer": LAYER})
        return self._finish(dim, keys)

    def text_length(self, text: str, digits: float) -> float:
        """Rough paper length of dimension text (mm): 0.6 × height per character."""
        n = len(text.replace("<>", "")) + digits
        return 0.62 * TEXT_HEIGHT * n
