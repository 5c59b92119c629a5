"""The assembly picture: the whole yo-yo to scale, a full section through the spin axis beside its side elevation.

The section shows both halves hatched (exact lines and arcs of the resolved loop and
its mirror images), the bearing (simplified: rings hatched, balls whole), the axle
(not sectioned lengthwise, thread root as a thin line) and the response pads, each
part in its material's colour. The side elevation is the silhouette seen square to
the spin axis, with a line at every sharp circular edge. A caption gives the overall
diameter, width, gap, mass and Izz of the assembly.
"""
from __future__ import annotations

import math
from collections.abc import Sequence
from typing import NamedTuple

from ..analysis import MassAndSpin, mass_and_spin, small_parts
from ..builder import Resolved
from ..catalog.materials import lookup_material
from ..geometry import Arc, Line, Segment
from ..parts import BODY
from .silhouette import creases, outline_runs
from .svg import Page, View, circle, hatch_pattern, line, num, path, rect, segments_d, text_width

__all__ = ["assembly_svg", "material_colour", "material_label", "PartSection", "part_sections", "drawing_scale"]

OUTLINE = "#1b1f24"
WIDE, NARROW = 0.5, 0.18  # line widths on the page, mm (ISO 128-20 wide and narrow lines)
CHAIN = (6.0, 1.5, 0.6, 1.5)  # long dash, dot: centre lines
STEEL = "#aab1b8"
SILICONE = "#e59a5c"
#: fill colours of our own choosing, by material family (the first matching word wins)
_COLOURS: tuple[tuple[tuple[str, ...], str], ...] = (
    (("6061", "7075", "7068", "aluminium", "aluminum"), "#d3dde6"),
    (("ti-", "titanium"), "#d4cbe0"),
    (("304", "316", "stainless"), "#c3c8cc"),
    (("c36000", "brass", "bronze"), "#e8cf86"),
    (("tungsten", "w-"), "#8c9299"),
    (("steel", "52100"), STEEL),
    (("pom", "acetal", "delrin"), "#f1eee2"),
    (("pc", "polycarbonate"), "#cfe6ef"),
    (("silicone",), SILICONE),
)


#: by the catalog's material family first
_FAMILY_COLOURS = {"aluminium alloy": "#d3dde6", "titanium alloy": "#d4cbe0", "stainless steel": "#c3c8cc",
                   "copper alloy": "#e8cf86", "tungsten alloy": "#8c9299", "polymer": "#f1eee2"}


def _family(name: str) -> str | None:
    try:
        return lookup_material(name).family
    except KeyError:
        return None


def material_label(name: str) -> str:
    """A material as the legend names it: the catalog name with its family, e.g. "C36000 (copper alloy)"."""
    family = _family(name)
    return f"{name} ({family})" if family else name


def material_colour(name: str) -> str:
    """The fill colour a part of this material gets in the pictures."""
    family = _family(name)
    if family in _FAMILY_COLOURS:
        return _FAMILY_COLOURS[family]
    low = name.lower()
    for words, colour in _COLOURS:
        if any(low == w or low.startswith(w) or f" {w}" in f" {low}" for w in words):
            return colour
    return "#d9d9d9"


class PartSection(NamedTuple):
    """One part's section in the (z, r ≥ 0) half-plane: closed loops, its colour and how it is shown."""

    name: str
    material: str
    loops: tuple[tuple[Segment, ...], ...]
    colour: str
    hatched: bool = True


def _box(z0: float, z1: float, r0: float, r1: float) -> tuple[Segment, ...]:
    pts = [(z0, r0), (z1, r0), (z1, r1), (z0, r1)]
    return tuple(Line(a, b) for a, b in zip(pts, pts[1:] + pts[:1]))


def _mirror_z(seg: Segment) -> Segment:
    """The segment on the other half (z → −z), reversed so a loop stays counter-clockwise."""
    if isinstance(seg, Line):
        return Line((-seg.end[0], seg.end[1]), (-seg.start[0], seg.start[1]))
    return Arc((-seg.center[0], seg.center[1]), seg.radius, math.pi - seg.end_angle, seg.sweep)


def part_sections(resolved: Resolved) -> list[PartSection]:
    """Every part of the assembly as sections in drawing order: each half's parts (body, rings), then the pads."""
    v = resolved.values
    assert resolved.profile is not None
    half_parts = [(p.name, p.material, tuple(p.profile.segments)) for p in resolved.parts] or \
        [(BODY, v["material.name"], tuple(resolved.profile.segments))]
    out = []
    for name, material, loop in half_parts:
        other = tuple(_mirror_z(s) for s in reversed(loop))
        kind = "half" if name == BODY else name
        out.append(PartSection(kind, material, (loop, other), material_colour(material)))
    parts, axle_length = small_parts(resolved)
    thickness = v["pad_groove.pad_thickness"]
    for part in parts:
        if part.name in ("response pad", "silicone"):
            loop = _box(part.z_mm - thickness / 2, part.z_mm + thickness / 2, part.r_in_mm, part.r_out_mm)
            name = "response recess fill" if part.name == "silicone" else part.name
            out.append(PartSection(name, "silicone", (loop,), SILICONE, hatched=False))
    return out


def drawing_scale(diameter: float, width: float, room: tuple[float, float] = (130.0, 110.0)) -> float:
    """The largest of the ISO 5455 scales 5:1, 2:1, 1:1, 1:2 at which the assembly fits ``room`` (mm)."""
    for s in (5.0, 2.0, 1.0, 0.5):
        if diameter * s <= room[0] and width * s <= room[1]:
            return s
    return 0.2


def _scale_text(s: float) -> str:
    return f"{s:g}:1" if s >= 1 else f"1:{1 / s:g}"


def _draw_loops(page: Page, loops: Sequence[Sequence[Segment]], views: Sequence[View], fill: str,
                outline: bool = True, width: float = WIDE) -> None:
    """Loops drawn through each view (quadrants): filled, then outlined except along the spin axis."""
    d = " ".join(segments_d(loop, v, close=True) for loop in loops for v in views)
    page.add(path(d, fill=fill, extra='fill-rule="nonzero"'))
    if outline:
        visible = [[s for s in loop if not _on_axis(s)] for loop in loops]
        page.add(path(" ".join(segments_d(segs, v) for segs in visible for v in views), stroke=OUTLINE, width=width))


def _on_axis(seg: Segment) -> bool:
    return isinstance(seg, Line) and abs(seg.start[1]) < 1e-9 and abs(seg.end[1]) < 1e-9


def _bearing(page: Page, resolved: Resolved, view: View) -> tuple[Segment, ...]:
    """The bearing in section, simplified (ISO 8826-1 style detail): rings hatched, balls whole; its outline box."""
    v = resolved.values
    r_in, r_out, w = v["bearing.bore"] / 2, v["bearing.od"] / 2, v["bearing.width"]
    section = r_out - r_in
    ball = 0.5 * section
    ring = (section - ball) / 2 + 0.1 * ball
    quads = [view.flipped(kr=k) for k in (1, -1)]
    rings = (_box(-w / 2, w / 2, r_in, r_in + ring), _box(-w / 2, w / 2, r_out - ring, r_out))
    _draw_loops(page, rings, quads, STEEL, width=NARROW * 1.6)
    _draw_loops(page, rings, quads, "url(#hatch-steel)", outline=False)
    shield = _box(-w / 2 + 0.08 * w, -w / 2 + 0.14 * w, r_in + ring, r_out - ring)
    shields = (shield, tuple(_mirror_z(s) for s in reversed(shield)))
    _draw_loops(page, shields, quads, STEEL, width=NARROW)
    for q in quads:
        x, y = q(0.0, (r_in + r_out) / 2)
        page.add(circle(x, y, ball / 2 * view.scale, fill="#e3e7ea", stroke=OUTLINE, width=NARROW * 1.6))
    return _box(-w / 2, w / 2, 0.0, r_out)


def _axle(page: Page, resolved: Resolved, length: float, view: View) -> None:
    """The axle, not sectioned lengthwise (ISO 128-44): outline at the major diameter, thread root thin."""
    v = resolved.values
    r_major, r_minor = v["axle_bore.major_diameter"] / 2, v["axle_bore.minor_diameter"] / 2
    x0, y0 = view(-length / 2, r_major)
    x1, y1 = view(length / 2, -r_major)
    page.add(rect(x0, y0, x1 - x0, y1 - y0, fill=STEEL, stroke=OUTLINE, width=WIDE))
    for k in (1, -1):
        a, b = view(-length / 2, k * r_minor), view(length / 2, k * r_minor)
        page.add(line(a[0], a[1], b[0], b[1], stroke=OUTLINE, width=NARROW))


def _centre_lines(page: Page, view: View, z_half: float, r_max: float) -> None:
    over = 4.0
    a, b = view(-z_half, 0.0), view(z_half, 0.0)
    page.add(line(a[0] - over, a[1], b[0] + over, b[1], stroke=OUTLINE, width=NARROW, dash=CHAIN))
    a, b = view(0.0, r_max), view(0.0, -r_max)
    page.add(line(a[0], a[1] - over, b[0], b[1] + over, stroke=OUTLINE, width=NARROW, dash=CHAIN))


def _section(page: Page, resolved: Resolved, sections: list[PartSection], axle_length: float, view: View) -> None:
    quads = [view.flipped(kr=k) for k in (1, -1)]
    for part in sections:  # small unhatched parts (pads, silicone) get a narrower outline, so thin ones still show
        _draw_loops(page, part.loops, quads, part.colour, width=WIDE if part.hatched else NARROW * 1.6)
        if part.hatched:  # adjacent parts hatched at opposite angles (ISO 128-50)
            hatch = "url(#hatch-body)" if part.name == "half" else "url(#hatch-part)"
            _draw_loops(page, part.loops, quads, hatch, outline=False)
    _bearing(page, resolved, view)
    _axle(page, resolved, axle_length, view)


def _elevation(page: Page, resolved: Resolved, sections: list[PartSection], view: View) -> None:
    """The side elevation: at each station the outermost part hides the rest (the bearing shows in the gap)."""
    v = resolved.values
    w, r_out = v["bearing.width"], v["bearing.od"] / 2
    pieces = [(loop, p.colour) for p in sections if p.hatched for loop in p.loops]
    pieces.append((_box(-w / 2, w / 2, 0.0, r_out), STEEL))
    r_top = max(v["profile.outer_diameter"] / 2, r_out)
    shades: dict[str, str] = {}
    for _, colour in pieces:  # light from above: a round body reads as round
        if colour not in shades:
            shades[colour] = f"shade{len(shades) + 1}"
            top, bottom = view(0.0, r_top)[1], view(0.0, -r_top)[1]
            page.defs.append(f'<linearGradient id="{shades[colour]}" gradientUnits="userSpaceOnUse" x1="0" '
                             f'y1="{num(top)}" x2="0" y2="{num(bottom)}"><stop offset="0" stop-color="{colour}"/>'
                             f'<stop offset="0.3" stop-color="#ffffff"/><stop offset="0.55" stop-color="{colour}"/>'
                             f'<stop offset="1" stop-color="#7c848c"/></linearGradient>')
    for owner, chain in outline_runs([loop for loop, _ in pieces]):
        closed = chain + [s.mirrored().reversed() for s in reversed(chain)]
        page.add(path(segments_d(closed, view, close=True), fill=f"url(#{shades[pieces[owner][1]]})", stroke=OUTLINE,
                      width=WIDE))
        for z, r in creases(chain):
            a, b = view(z, r), view(z, -r)
            page.add(line(a[0], a[1], b[0], b[1], stroke=OUTLINE, width=NARROW * 1.6))


def _legend(page: Page, x: float, y: float, rows: list[tuple[str, str, str | None]]) -> None:
    for i, (label, colour, hatch) in enumerate(rows):
        yy = y + i * 6.5
        page.add(rect(x, yy - 3.6, 8, 4.6, fill=colour, stroke=OUTLINE, width=NARROW))
        if hatch:
            page.add(rect(x, yy - 3.6, 8, 4.6, fill=hatch))
        page.text(x + 10.5, yy, label, size=3.0)


def assembly_svg(resolved: Resolved, mass: MassAndSpin | None = None) -> bytes:
    """The assembly picture of a resolved design whose loop can be weighed, as SVG bytes."""
    m = mass or mass_and_spin(resolved)
    v = resolved.values
    d = resolved.design
    diameter, width, gap = v["profile.outer_diameter"], v["profile.width"], v["profile.gap"]
    s = drawing_scale(diameter, width)
    _, axle_length = small_parts(resolved)
    sections = part_sections(resolved)
    margin, head, label_h = 14.0, 24.0, 9.0
    vw, vh = width * s, diameter * s
    left_cx = margin + 6 + vw / 2
    right_cx = left_cx + vw + 30
    legend_x = right_cx + vw / 2 + 16
    page_w = legend_x + 72
    axis_y = head + label_h + vh / 2
    page_h = axis_y + vh / 2 + 34
    page = Page(page_w, page_h, title=f"{d.name} rev {d.revision}: assembly")
    page.defs.append(hatch_pattern("hatch-body", 1.6, 45, OUTLINE, NARROW * 0.9))
    page.defs.append(hatch_pattern("hatch-part", 1.2, -45, OUTLINE, NARROW * 0.9))
    page.defs.append(hatch_pattern("hatch-steel", 0.8, -45, OUTLINE, NARROW * 0.8))
    title = f"{d.name} rev {d.revision}" + (f" — {d['design']['title']}" if d["design"]["title"] else "")
    page.text(margin, 13, title, size=4.2, weight="bold")
    page.text(margin, 19, f"assembled yo-yo, scale {_scale_text(s)} (one SVG unit is 1 mm of page)", size=3.0,
              fill="#444")
    sec_view = View(left_cx, axis_y, s)
    elev_view = View(right_cx, axis_y, s)
    page.text(left_cx, head + 4, "full section through the spin axis", size=3.2, anchor="middle", weight="bold")
    page.text(right_cx, head + 4, "side elevation", size=3.2, anchor="middle", weight="bold")
    _section(page, resolved, sections, axle_length, sec_view)
    _elevation(page, resolved, sections, elev_view)
    for view in (sec_view, elev_view):
        _centre_lines(page, view, width / 2, diameter / 2)
    body = v["material.name"]
    rows: list[tuple[str, str, str | None]] = [
        (f"half body, {material_label(body)}", material_colour(body), "url(#hatch-body)"),
        (f"bearing {v['bearing.designation']}, steel", STEEL, None), (f"axle {v['axle_bore.thread']}, steel", STEEL, None)]
    seen = {r[0] for r in rows}
    for p in sections[1:]:
        label = f"{p.name}, {material_label(p.material)}"
        if p.name != "half" and label not in seen:
            rows.append((label, p.colour, "url(#hatch-part)" if p.hatched else None))
            seen.add(label)
    _legend(page, legend_x, head + label_h + 4, rows)
    page.width = max(page.width, legend_x + 10.5 + max(text_width(r[0], 3.0) for r in rows) + 8)
    cy = axis_y + vh / 2 + 14
    page.text(margin, cy, f"overall Ø{diameter:.2f} mm × {width:.2f} mm wide · gap {gap:.2f} mm", size=3.6)
    page.text(margin, cy + 6, f"mass {m.assembly.total_g:.2f} g · Izz {m.assembly.izz_g_mm2:,.0f} g·mm² "
              f"(assembled, about the spin axis)".replace(",", " "), size=3.6)
    page.text(margin, cy + 12, "pictures do not replace the shop drawing: dimensions and tolerances are on the sheet",
              size=2.6, fill="#555")
    return page.render()
