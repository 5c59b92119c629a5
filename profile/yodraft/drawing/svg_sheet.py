"""A small SVG writer for a paper-space sheet: true-scale lines, arcs, fills, hatching and real text.

One SVG user unit is 1 mm of paper, y points down from the top edge of the sheet. Block references
and dimensions are expanded with ezdxf's ``virtual_entities``; model space is drawn through each
paper-space viewport (view centre and view height give the scale) and clipped to its rectangle.
Line widths come from the lineweights (paper widths, also for model space seen through a viewport),
dash patterns from the line types, and text is set as SVG text in the text style's font family.
Output is deterministic: fixed number formatting, entities in file order.
"""
from __future__ import annotations

import html
import math
from dataclasses import dataclass
from typing import Iterable, Iterator

from ezdxf import path as ezpath
from ezdxf.document import Drawing
from ezdxf.entities import DXFGraphic
from ezdxf.math import Matrix44, Vec3
from ezdxf.tools.text import MTextContext, MTextParser, TokenType

from .ttf_metrics import LINE_SPACING, FontMetrics, font_of_file

__all__ = ["sheet_svg"]

DEFAULT_LINEWEIGHT = 25  # 1/100 mm, used for "default" (-3) lineweights
_CURVES = frozenset({"LINE", "LWPOLYLINE", "POLYLINE", "ARC", "CIRCLE", "ELLIPSE", "SPLINE"})


def _num(v: float) -> str:
    """Fixed 3-decimal formatting without trailing zeros (deterministic, compact).

    >>> _num(1.23456), _num(2.0), _num(-0.0001)
    ('1.235', '2', '0')
    """
    s = f"{v:.3f}".rstrip("0").rstrip(".")
    return "0" if s in ("-0", "") else s


@dataclass(frozen=True)
class _Inherit:
    """What entities inside a block reference take from it: layer (for layer 0), lineweight and
    line type (for BYBLOCK), and the scale from the entity's own units to paper millimetres."""

    layer: str | None
    lineweight: int
    linetype: str
    scale: float


@dataclass(frozen=True)
class _Run:
    text: str
    cap: float
    underline: bool
    overline: bool
    strike: bool


class _Writer:
    def __init__(self, doc: Drawing, paper: tuple[float, float]) -> None:
        self.doc = doc
        self.width, self.height = paper
        self.out: list[str] = []
        self.defs: list[str] = []
        self._ids = 0
        self._layers = {layer.dxf.name.lower(): layer for layer in doc.layers}
        self._fonts: dict[str, FontMetrics] = {}
        self._ltscale = float(doc.header.get("$LTSCALE", 1.0)) or 1.0

    # ---------------------------------------------------------------- attributes
    def _new_id(self, prefix: str) -> str:
        self._ids += 1
        return f"{prefix}{self._ids}"

    def _layer_name(self, e: DXFGraphic, inh: _Inherit) -> str:
        name = e.dxf.get("layer", "0")
        return inh.layer if (name == "0" and inh.layer is not None) else name

    def _visible(self, layer_name: str) -> bool:
        layer = self._layers.get(layer_name.lower())
        if layer is None:
            return True
        if layer.is_off() or layer.is_frozen() or not layer.dxf.get("plot", 1):
            return False
        return layer_name.lower() != "defpoints"

    def _lineweight(self, e: DXFGraphic, layer_name: str, inh: _Inherit) -> float:
        lw = e.dxf.get("lineweight", -1)
        if lw == -1:
            layer = self._layers.get(layer_name.lower())
            lw = layer.dxf.get("lineweight", -3) if layer is not None else -3
        elif lw == -2:
            lw = inh.lineweight
        if lw < 0:
            lw = DEFAULT_LINEWEIGHT
        return lw / 100.0

    def _linetype(self, e: DXFGraphic, layer_name: str, inh: _Inherit) -> str:
        lt = e.dxf.get("linetype", "BYLAYER")
        if lt.upper() == "BYLAYER":
            layer = self._layers.get(layer_name.lower())
            lt = layer.dxf.get("linetype", "CONTINUOUS") if layer is not None else "CONTINUOUS"
        elif lt.upper() == "BYBLOCK":
            lt = inh.linetype
        return lt

    def _dasharray(self, e: DXFGraphic, linetype: str, inh: _Inherit) -> str:
        """SVG dash array in paper mm: pattern × global and entity line type scale × scale to paper."""
        if linetype.upper() in ("CONTINUOUS", "BYLAYER", "BYBLOCK"):
            return ""
        try:
            ltype = self.doc.linetypes.get(linetype)
        except Exception:
            return ""
        if ltype is None:
            return ""
        tags = ltype.pattern_tags.tags if ltype.pattern_tags else []
        items = [float(t.value) for t in tags if t.code == 49]
        if not items:
            return ""
        factor = self._ltscale * float(e.dxf.get("ltscale", 1.0)) * inh.scale
        dashes: list[float] = []
        for item in items:
            length = abs(item) * factor
            is_dash = item >= 0
            # SVG alternates dash, gap: merge equal kinds, keep a dot as a zero-length dash
            if dashes and (len(dashes) % 2 == 1) == is_dash:
                dashes[-1] += length
            else:
                dashes.append(length)
        if len(dashes) % 2:
            dashes.append(0.0)
        return ",".join(_num(d) for d in dashes)

    def _stroke(self, e: DXFGraphic, layer_name: str, inh: _Inherit) -> str:
        attrs = f' stroke-width="{_num(self._lineweight(e, layer_name, inh))}"'
        dash = self._dasharray(e, self._linetype(e, layer_name, inh), inh)
        if dash:
            attrs += f' stroke-dasharray="{dash}"'
        return attrs

    def _font(self, style_name: str) -> FontMetrics:
        font = self._fonts.get(style_name)
        if font is None:
            style = self.doc.styles.get(style_name) if self.doc.styles.has_entry(style_name) else None
            font = font_of_file(style.dxf.get("font", "") if style is not None else "")
            self._fonts[style_name] = font
        return font

    # ---------------------------------------------------------------- geometry
    def _xy(self, x: float, y: float) -> str:
        return f"{_num(x)} {_num(self.height - y)}"

    def _path_d(self, paths: Iterable[ezpath.Path], m: Matrix44) -> str:
        parts: list[str] = []
        for p in paths:
            p = p.transform(m)
            for sub in p.sub_paths():
                start = sub.start
                parts.append("M" + self._xy(start.x, start.y))
                for cmd in sub.commands():
                    t = cmd.type
                    if t == ezpath.Command.LINE_TO:
                        parts.append("L" + self._xy(cmd.end.x, cmd.end.y))
                    elif t == ezpath.Command.CURVE4_TO:
                        parts.append("C" + self._xy(cmd.ctrl1.x, cmd.ctrl1.y) + " "
                                     + self._xy(cmd.ctrl2.x, cmd.ctrl2.y) + " " + self._xy(cmd.end.x, cmd.end.y))
                    elif t == ezpath.Command.CURVE3_TO:
                        parts.append("Q" + self._xy(cmd.ctrl.x, cmd.ctrl.y) + " " + self._xy(cmd.end.x, cmd.end.y))
                    elif t == ezpath.Command.MOVE_TO:
                        parts.append("M" + self._xy(cmd.end.x, cmd.end.y))
                if sub.is_closed:
                    parts.append("Z")
        return "".join(parts)

    def _curve(self, e: DXFGraphic, m: Matrix44, layer: str, inh: _Inherit) -> None:
        d = self._path_d([ezpath.make_path(e)], m)
        if d:
            self.out.append(f'<path d="{d}"{self._stroke(e, layer, inh)}/>')

    def _solid(self, e: DXFGraphic, m: Matrix44) -> None:
        pts = [m.transform(v) for v in e.vertices()]
        d = "M" + "L".join(self._xy(p.x, p.y) for p in pts) + "Z"
        self.out.append(f'<path d="{d}" fill="#000" stroke="none"/>')

    def _hatch(self, e: DXFGraphic, m: Matrix44, layer: str, inh: _Inherit) -> None:
        boundary = [p.transform(m) for p in ezpath.from_hatch(e)]
        d = self._path_d(boundary, Matrix44())
        if not d:
            return
        if e.dxf.get("solid_fill", 0):
            self.out.append(f'<path d="{d}" fill="#000" fill-rule="evenodd" stroke="none"/>')
            return
        if e.pattern is None or not e.pattern.lines:
            return
        clip = self._new_id("h")
        self.defs.append(f'<clipPath id="{clip}"><path d="{d}" clip-rule="evenodd"/></clipPath>')
        box = ezpath.bbox(boundary)
        corners = [Vec3(box.extmin.x, box.extmin.y), Vec3(box.extmax.x, box.extmin.y),
                   Vec3(box.extmax.x, box.extmax.y), Vec3(box.extmin.x, box.extmax.y)]
        ocs = e.ocs()
        parts: list[str] = []
        dash_attr = ""
        for line in e.pattern.lines:
            angle = math.radians(line.angle)
            base = m.transform(ocs.to_wcs(Vec3(line.base_point)))
            direction = m.transform_direction(ocs.to_wcs(Vec3(math.cos(angle), math.sin(angle)))).normalize()
            offset = m.transform_direction(ocs.to_wcs(Vec3(line.offset)))
            normal = Vec3(-direction.y, direction.x)
            spacing = offset.dot(normal)
            if abs(spacing) < 1e-6:
                continue
            rel = [(c - base).dot(normal) / spacing for c in corners]
            for k in range(math.floor(min(rel)), math.ceil(max(rel)) + 1):
                origin = base + offset * k
                along = [(c - origin).dot(direction) for c in corners]
                a = origin + direction * min(along)
                b = origin + direction * max(along)
                parts.append("M" + self._xy(a.x, a.y) + "L" + self._xy(b.x, b.y))
            if line.dash_length_items and not dash_attr:
                scale = offset.magnitude / max(Vec3(line.offset).magnitude, 1e-12)
                dashes = [abs(x) * scale for x in line.dash_length_items]
                if len(dashes) % 2:
                    dashes.append(0.0)
                dash_attr = f' stroke-dasharray="{",".join(_num(x) for x in dashes)}"'
        if parts:
            width = _num(self._lineweight(e, layer, inh))
            self.out.append(f'<path d="{"".join(parts)}" clip-path="url(#{clip})" stroke-width="{width}"'
                            f'{dash_attr}/>')

    # ---------------------------------------------------------------- text
    def _text_element(self, x: float, y: float, angle_deg: float, anchor: str, family: str,
                      lines: list[tuple[float, list[_Run]]], em_per_cap: float) -> None:
        """Lines of runs at local baselines ``(dy, runs)`` (dy downward, mm), rotated about (x, y)."""
        sx, sy = _num(x), _num(self.height - y)
        transform = f"translate({sx} {sy})"
        if abs(angle_deg) > 1e-9:
            transform += f" rotate({_num(-angle_deg)})"
        spans: list[str] = []
        for dy, runs in lines:
            first = True
            for run in runs:
                deco = " ".join(n for n, on in (("underline", run.underline), ("overline", run.overline),
                                                  ("line-through", run.strike)) if on)
                attrs = f' font-size="{_num(run.cap * em_per_cap)}"'
                if first:
                    attrs = f' x="0" y="{_num(dy)}"' + attrs
                    first = False
                if deco:
                    attrs += f' text-decoration="{deco}"'
                spans.append(f"<tspan{attrs}>{html.escape(run.text, quote=False)}</tspan>")
        if spans:
            self.out.append(f'<text transform="{transform}" text-anchor="{anchor}" font-family="{_attr(family)}, sans-serif" '
                            'fill="#000" stroke="none" '
                            f'xml:space="preserve">{"".join(spans)}</text>')

    def _mtext(self, e: DXFGraphic, m: Matrix44) -> None:
        font = self._font(e.dxf.get("style", "Standard"))
        ctx = MTextContext()
        ctx.cap_height = float(e.dxf.get("char_height", 2.5))
        wrap_width = float(e.dxf.get("width", 0.0) or 0.0)
        paragraphs: list[list[_Run]] = [[]]
        lines: list[list[_Run]] = []

        def width_of(runs: list[_Run]) -> float:
            return sum(font.width(r.text) * r.cap for r in runs)

        def add(text: str, c: MTextContext, is_word: bool) -> None:
            line = paragraphs[-1]
            if (is_word and wrap_width > 0 and any(r.text.strip() for r in line)
                    and width_of(line) + font.width(text) * c.cap_height > wrap_width + 1e-9):
                while line and not line[-1].text.strip():
                    line.pop()
                lines.append(line)
                paragraphs[-1] = line = []
            line.append(_Run(text, c.cap_height, c.underline, c.overline, c.strike_through))

        for token in MTextParser(e.text, ctx):
            t = token.type
            c = token.ctx
            if t == TokenType.WORD:
                add(token.data, c, True)
            elif t in (TokenType.SPACE, TokenType.NBSP):
                add(" ", c, False)
            elif t == TokenType.TABULATOR:
                add("    ", c, False)
            elif t == TokenType.STACK:
                upper, lower, kind = token.data
                add(f"{upper}/{lower}" if kind != "^" else f"{upper} {lower}".strip(), c, True)
            elif t in (TokenType.NEW_PARAGRAPH, TokenType.NEW_COLUMN, TokenType.WRAP_AT_DIMLINE):
                lines.append(paragraphs[-1])
                paragraphs[-1] = []
        lines.append(paragraphs[-1])
        lines = [_merge(line) for line in lines]
        caps = [max((r.cap for r in line), default=ctx.cap_height) for line in lines]
        spacing = float(e.dxf.get("line_spacing_factor", 1.0) or 1.0)
        baselines: list[float] = []
        y = 0.0
        for i, cap in enumerate(caps):
            y += cap if i == 0 else LINE_SPACING * spacing * cap
            baselines.append(y)
        total = baselines[-1] if baselines else 0.0
        attach = int(e.dxf.get("attachment_point", 1))
        # middle: halfway between the top of the first line's lower case and the last baseline;
        # bottom: the box includes the descenders of the last line
        middle = (caps[0] * (1.0 - font.x_height) + total) / 2.0
        vshift = {0: 0.0, 1: middle, 2: total + font.descender * caps[-1]}[(attach - 1) // 3]
        anchor = ("start", "middle", "end")[(attach - 1) % 3]
        scale = m.transform_direction(Vec3(1, 0, 0)).magnitude
        insert = m.transform(Vec3(e.dxf.insert))
        direction = m.transform_direction(Vec3.from_deg_angle(e.get_rotation()))
        placed = [(scale * (b - vshift), [_Run(r.text, r.cap * scale, r.underline, r.overline, r.strike)
                                          for r in line]) for b, line in zip(baselines, lines) if line]
        self._text_element(insert.x, insert.y, direction.angle_deg, anchor, font.family, placed,
                           font.em_per_cap)

    def _text(self, e: DXFGraphic, m: Matrix44) -> None:
        font = self._font(e.dxf.get("style", "Standard"))
        text = e.plain_text()
        if not text:
            return
        halign = int(e.dxf.get("halign", 0))
        valign = int(e.dxf.get("valign", 0))
        cap = float(e.dxf.get("height", 2.5))
        point = e.dxf.insert if (halign == 0 and valign == 0) or not e.dxf.hasattr("align_point") \
            else e.dxf.align_point
        if halign in (3, 5) and e.dxf.hasattr("align_point"):  # aligned / fit: centre between the two points
            point = (Vec3(e.dxf.insert) + Vec3(e.dxf.align_point)) * 0.5
            halign = 1
        elif halign == 4:  # middle
            halign, valign = 1, 2
        anchor = ("start", "middle", "end")[min(halign, 2)]
        dy = {0: 0.0, 1: -0.3 * cap, 2: cap / 2.0, 3: cap}[valign]
        scale = m.transform_direction(Vec3(1, 0, 0)).magnitude
        insert = m.transform(Vec3(point))
        direction = m.transform_direction(Vec3.from_deg_angle(float(e.dxf.get("rotation", 0.0))))
        run = _Run(text, cap * scale, False, False, False)
        self._text_element(insert.x, insert.y, direction.angle_deg, anchor, font.family,
                           [(dy * scale, [run])], font.em_per_cap)

    # ---------------------------------------------------------------- traversal
    def entities(self, entities: Iterable[DXFGraphic], m: Matrix44, inh: _Inherit, depth: int = 0) -> None:
        for e in entities:
            kind = e.dxftype()
            layer = self._layer_name(e, inh)
            if not self._visible(layer) or e.dxf.get("invisible", 0):
                continue
            if kind in _CURVES:
                self._curve(e, m, layer, inh)
            elif kind in ("SOLID", "TRACE"):
                self._solid(e, m)
            elif kind == "HATCH":
                self._hatch(e, m, layer, inh)
            elif kind == "MTEXT":
                self._mtext(e, m)
            elif kind == "TEXT":
                self._text(e, m)
            elif kind in ("INSERT", "DIMENSION") and depth < 16:
                lw = e.dxf.get("lineweight", -1)
                lw = inh.lineweight if lw == -2 else (self._layer_lineweight(layer) if lw == -1 else lw)
                scale = inh.scale
                if kind == "INSERT":
                    scale *= abs(float(e.dxf.get("xscale", 1.0)))
                child = _Inherit(layer, lw, self._linetype(e, layer, inh), scale)
                self.entities(_virtual(e), m, child, depth + 1)

    def _layer_lineweight(self, layer_name: str) -> int:
        layer = self._layers.get(layer_name.lower())
        return layer.dxf.get("lineweight", -3) if layer is not None else -3

    def viewport(self, vp: DXFGraphic) -> None:
        cx, cy = vp.dxf.center.x, vp.dxf.center.y
        w, h = vp.dxf.width, vp.dxf.height
        view_h = vp.dxf.view_height
        if w <= 0 or h <= 0 or view_h <= 0:
            return
        scale = h / view_h
        vc = vp.dxf.view_center_point
        m = Matrix44.translate(-vc.x, -vc.y, 0) @ Matrix44.scale(scale) @ Matrix44.translate(cx, cy, 0)
        twist = float(vp.dxf.get("view_twist_angle", 0.0))
        if twist:
            m = (Matrix44.translate(-vc.x, -vc.y, 0) @ Matrix44.z_rotate(math.radians(twist))
                 @ Matrix44.scale(scale) @ Matrix44.translate(cx, cy, 0))
        clip = self._new_id("v")
        x0, y0 = cx - w / 2.0, cy + h / 2.0
        self.defs.append(f'<clipPath id="{clip}"><rect x="{_num(x0)}" y="{_num(self.height - y0)}" '
                         f'width="{_num(w)}" height="{_num(h)}"/></clipPath>')
        frozen = {name.lower() for name in vp.frozen_layers}
        msp = [e for e in self.doc.modelspace() if e.dxf.get("layer", "0").lower() not in frozen]
        self.out.append(f'<g clip-path="url(#{clip})">')
        self.entities(msp, m, _Inherit(None, DEFAULT_LINEWEIGHT, "CONTINUOUS", 1.0 * scale))
        self.out.append("</g>")

    def page(self, layout_name: str) -> bytes:
        psp = self.doc.paperspace(layout_name)
        base = _Inherit(None, DEFAULT_LINEWEIGHT, "CONTINUOUS", 1.0)
        for e in psp:
            if e.dxftype() == "VIEWPORT":
                # the first viewport is the sheet itself; the frame of the others is not drawn
                if e.is_visible and e.dxf.id > 1:
                    self.viewport(e)
            else:
                self.entities([e], Matrix44(), base)
        w, h = _num(self.width), _num(self.height)
        head = ("<?xml version=\"1.0\" encoding=\"utf-8\"?>\n"
                f'<svg xmlns="http://www.w3.org/2000/svg" width="{w}mm" height="{h}mm" viewBox="0 0 {w} {h}">'
                f'<defs>{"".join(self.defs)}</defs>'
                f'<rect x="0" y="0" width="{w}" height="{h}" fill="#fff"/>'
                '<g fill="none" stroke="#000" stroke-linecap="round" stroke-linejoin="round">')
        return (head + "".join(self.out) + "</g></svg>\n").encode("utf-8")


def _attr(value: str) -> str:
    """``value`` escaped for a double-quoted XML attribute."""
    return html.escape(value, quote=False).replace('"', "&quot;")


def _merge(line: list[_Run]) -> list[_Run]:
    """Adjacent runs with the same size and decoration joined into one."""
    merged: list[_Run] = []
    for run in line:
        if merged and (merged[-1].cap, merged[-1].underline, merged[-1].overline, merged[-1].strike) == (
                run.cap, run.underline, run.overline, run.strike):
            merged[-1] = _Run(merged[-1].text + run.text, run.cap, run.underline, run.overline, run.strike)
        else:
            merged.append(run)
    return merged


def _virtual(e: DXFGraphic) -> Iterator[DXFGraphic]:
    try:
        yield from e.virtual_entities()
    except Exception:  # a reference to a missing or broken block draws nothing, as in a viewer
        return


def sheet_svg(doc: Drawing, layout_name: str, paper: tuple[float, float]) -> bytes:
    """The paper-space layout ``layout_name`` as SVG, 1 mm of paper = 1 SVG unit, black on white."""
    return _Writer(doc, paper).page(layout_name)
