"""The overlay: two designs' half-profiles laid over each other to scale, with what changed called out.

Design A is drawn as a narrow solid line, design B as a wide dashed one, so the two
stay apart in grey print too; material B adds is hatched one way, material it takes
away the other. Each feature whose inputs or resolved dimensions changed gets a
callout at the corner that moved most (or the corner whose radius changed). A legend
names both designs and revisions and gives the main derived deltas: assembled mass,
Izz, rim share and gap.
"""
from __future__ import annotations

import math
from collections.abc import Mapping
from typing import TYPE_CHECKING, Any

import shapely

from ..geometry import Point
from .assembly import OUTLINE, drawing_scale
from .svg import Page, View, circle, hatch_pattern, line, path, path_d, segments_d, text_width

if TYPE_CHECKING:  # pragma: no cover
    from ..builder import Resolved
    from ..diff import DesignDiff

__all__ = ["overlay_svg", "feature_changes", "STYLE_A", "STYLE_B"]

#: (colour, width mm, dash pattern) of each design's outline: apart by width and dash as well as colour
STYLE_A = ("#1f3b57", 0.3, None)
STYLE_B = ("#c0392b", 0.7, (2.4, 1.2))
ADDED, REMOVED = "#7cc47a", "#e9877f"
_CHAIN = (6.0, 1.5, 0.6, 1.5)


def feature_changes(d: "DesignDiff") -> dict[str, list[str]]:
    """Per feature, the lines that say what changed: inputs as written first, else resolved dimensions."""
    inputs: dict[str, list[str]] = {}
    derived: dict[str, list[str]] = {}
    for c in d.inputs:
        parts = c.key.split(".")
        if parts[0] == "features" and len(parts) == 3:
            inputs.setdefault(parts[1], []).append(f"{parts[2]} {_text(c.old)} → {_text(c.new)}")
    for c in d.derived:
        parts = c.key.split(".")
        if parts[0] == "features" and len(parts) == 4 and parts[2] == "dimensions":
            if isinstance(c.old, (int, float)) and isinstance(c.new, (int, float)):
                derived.setdefault(parts[1], []).append(f"{parts[3]} {c.old:.4g} → {c.new:.4g}")
            else:
                derived.setdefault(parts[1], []).append(f"{parts[3]} {_text(c.old)} → {_text(c.new)}")
    out = {name: lines for name, lines in inputs.items()}
    for name, lines in derived.items():
        if name not in out:
            out[name] = lines
    return out


def _text(value: Any) -> str:
    return "(none)" if value is None else str(value)


def _other_inputs(d: "DesignDiff") -> list[str]:
    return [f"{c.key} {_text(c.old)} → {_text(c.new)}" for c in d.inputs
            if not c.key.startswith("features.") and c.key not in ("revisions", "design.revision")]


def _anchor(a: "Resolved", b: "Resolved", feature: str, keys: list[str]) -> Point:
    """Where a feature's callout points: the corner whose radius changed, else the one that moved most."""
    corners_b = [v for chunk in b.features[feature].chunks.values() for v in chunk]
    corners_a = [v for chunk in a.features[feature].chunks.values() for v in chunk] if feature in a.features else []
    named = [v for v in corners_b if v.owner and v.owner.split(".")[-1] in keys]
    if named:
        return named[0].point
    if not corners_b:
        return (0.0, 0.0)
    if len(corners_a) == len(corners_b):
        # corners on the spin axis are left out: a leader along the axis line reads as part of it
        pairs = [ab for ab in zip(corners_a, corners_b) if ab[1].point[1] > 1e-6] or list(zip(corners_a, corners_b))
        return max(pairs, key=lambda ab: math.dist(ab[0].point, ab[1].point))[1].point
    return corners_b[len(corners_b) // 2].point


def _on_profile(resolved: "Resolved", point: Point) -> Point:
    """The nearest point of the drawn loop (a sharp corner of a rounded edge lies off it)."""
    assert resolved.profile is not None
    boundary = resolved.profile.polygon(0.002).exterior
    p = shapely.Point(point)
    near = boundary.interpolate(boundary.project(p))
    return (near.x, near.y)


def _figures(resolved: "Resolved") -> dict[str, float | None]:
    from ..analysis import mass_and_spin

    out: dict[str, float | None] = {"mass": None, "izz": None, "rim": None, "gap": resolved.values["bearing_seat.gap"]}
    if resolved.can_analyse:
        m = mass_and_spin(resolved)
        out.update(mass=m.assembly.total_g, izz=m.assembly.izz_g_mm2, rim=m.spin.rim_share)
    return out


def _region_d(geom: Any, view: View) -> str:
    """Path data of shapely polygons (the change regions are shading, so flattened loops are fine)."""
    polys = [g for g in getattr(geom, "geoms", [geom]) if isinstance(g, shapely.Polygon) and g.area > 1e-3]
    out = []
    for poly in polys:
        for ring in [poly.exterior, *poly.interiors]:
            out.append(path_d([view(x, y) for x, y in ring.coords[:-1]], close=True))
    return " ".join(out)


def _loops(resolved: "Resolved") -> list[tuple]:
    assert resolved.profile is not None
    return [tuple(p.profile.segments) for p in resolved.parts] or [tuple(resolved.profile.segments)]


def _label(d: Mapping[str, Any]) -> str:
    return f"{d['name']} rev {d['revision']}"


def overlay_svg(a: "Resolved", b: "Resolved", d: "DesignDiff") -> bytes:
    """Both half-profiles over each other, A solid and narrow, B dashed and wide, changes called out."""
    assert a.profile is not None and b.profile is not None
    za0, _, za1, ra = a.profile.bounds()
    zb0, _, zb1, rb = b.profile.bounds()
    z_hi, r_hi = max(za1, zb1), max(ra, rb)
    s = drawing_scale(2 * r_hi, z_hi, room=(300.0, 150.0))
    margin, head = 14.0, 30.0
    x0, y0 = margin + 8, head + 8 + r_hi * s
    view = View(x0, y0, s)
    callout_x = x0 + z_hi * s + 16
    changes = feature_changes(d)
    label_w = max([text_width(f"{name}: {'; '.join(lines[:2])}", 2.8) for name, lines in changes.items()] + [60.0])
    page_w = max(callout_x + label_w + margin, 200.0)
    legend_y = y0 + 14
    others = _other_inputs(d)
    page_h = legend_y + 48 + (4 if others else 0) + margin
    page = Page(page_w, page_h, title=f"{_label(d.a)} against {_label(d.b)}")
    page.defs.append(hatch_pattern("added", 1.2, 45, "#2f7d32", 0.25, background="#d7efd4"))
    page.defs.append(hatch_pattern("removed", 1.2, -45, "#b03a2e", 0.25, background="#f8dcd8"))
    page.text(margin, 13, f"{_label(d.a)} (A) against {_label(d.b)} (B): half-profiles overlaid", size=4.2,
              weight="bold")
    scale_text = f"{s:g}:1" if s >= 1 else f"1:{1 / s:g}"
    page.text(margin, 19, f"scale {scale_text}; z along the spin axis from the gap plane, r from the axis", size=3.0,
              fill="#444")
    # material added and taken away
    pa, pb = a.profile.polygon(0.002), b.profile.polygon(0.002)
    added, removed = _region_d(pb.difference(pa), view), _region_d(pa.difference(pb), view)
    if added:
        page.add(path(added, fill="url(#added)"))
    if removed:
        page.add(path(removed, fill="url(#removed)"))
    # the axis and the gap plane
    page.add(line(x0 - 4, y0, x0 + z_hi * s + 6, y0, stroke=OUTLINE, width=0.18, dash=_CHAIN))
    page.add(line(x0, y0 + 4, x0, y0 - r_hi * s - 6, stroke=OUTLINE, width=0.18, dash=_CHAIN))
    page.text(x0 + z_hi * s + 6, y0 + 4, "spin axis", size=2.6, anchor="end", fill="#444")
    page.text(x0 + 1.5, y0 - r_hi * s - 3, "gap plane", size=2.6, fill="#444")
    for resolved, (colour, width, dash) in ((a, STYLE_A), (b, STYLE_B)):
        for loop in _loops(resolved):
            page.add(path(segments_d(loop, view, close=True), stroke=colour, width=width, dash=dash))
    # callouts, top to bottom in the order of their anchors so no two leaders cross
    anchors = []
    for name, lines in changes.items():
        if name not in b.features:
            continue
        keys = [ln.split(" ", 1)[0] for ln in lines]
        anchors.append((_on_profile(b, _anchor(a, b, name, keys)), name, lines))
    anchors.sort(key=lambda item: (-item[0][1], item[0][0]))
    y_next = head + 8
    for (z, r), name, lines in anchors:
        ax, ay = view(z, r)
        ly = max(y_next, ay)
        y_next = ly + 4.2 * min(len(lines), 2) + 4
        page.add(line(callout_x - 2, ly - 1, ax, ay, stroke="#333", width=0.2))
        page.add(circle(ax, ay, 0.7, fill="#333"))
        page.text(callout_x, ly, f"{name}:", size=2.8, weight="bold")
        for k, text in enumerate(lines[:2]):
            page.text(callout_x + text_width(f"{name}: ", 2.8), ly + 4.2 * k, text, size=2.8)
        if len(lines) > 2:
            page.text(callout_x, ly + 8.4, f"… and {len(lines) - 2} more", size=2.6, fill="#555")
            y_next += 4.2
    if not changes:
        page.text(callout_x, head + 8, "no feature changed", size=2.8)
    _legend(page, margin, legend_y, a, b, d, others)
    return page.render()


def _legend(page: Page, x: float, y: float, a: "Resolved", b: "Resolved", d: "DesignDiff",
            others: list[str]) -> None:
    for k, (head, (colour, width, dash)) in enumerate(((d.a, STYLE_A), (d.b, STYLE_B))):
        yy = y + 5.5 * k
        page.add(line(x, yy - 1, x + 14, yy - 1, stroke=colour, width=width, dash=dash))
        letter = "AB"[k]
        page.text(x + 17, yy, f"{letter}: {_label(head)} ({head['source']})", size=3.0)
    yy = y + 11
    for k, (fill, text) in enumerate((("url(#added)", "material B adds"), ("url(#removed)", "material B takes away"))):
        xx = x + 62 * k
        page.add(f'<rect x="{xx}" y="{yy - 3.2:.3f}" width="8" height="4" fill="{fill}" stroke="#333" '
                 'stroke-width="0.15"/>')
        page.text(xx + 10, yy, text, size=3.0)
    fa, fb = _figures(a), _figures(b)
    rows = (("assembled mass", "mass", "g", "{:.2f}"), ("Izz", "izz", "g·mm²", "{:.0f}"),
            ("rim share", "rim", "", "{:.3f}"), ("gap", "gap", "mm", "{:.3f}"))
    yy = y + 18
    page.text(x, yy, "derived", size=3.0, weight="bold")
    for col, head in ((40, "A"), (70, "B"), (100, "B − A")):
        page.text(x + col + 24, yy, head, size=3.0, weight="bold", anchor="end")
    for k, (label, key, unit, fmt) in enumerate(rows):
        ry = yy + 5 * (k + 1)
        va, vb = fa[key], fb[key]
        page.text(x, ry, f"{label}{', ' + unit if unit else ''}", size=3.0)
        page.text(x + 64, ry, "—" if va is None else fmt.format(va), size=3.0, anchor="end")
        page.text(x + 94, ry, "—" if vb is None else fmt.format(vb), size=3.0, anchor="end")
        if va is None or vb is None:
            delta = "—"
        elif fmt.format(abs(vb - va)) == fmt.format(0.0):
            delta = "same"
        else:
            delta = ("+" if vb > va else "−") + fmt.format(abs(vb - va))
        page.text(x + 124, ry, delta, size=3.0, anchor="end")
    if others:
        oy = yy + 5 * (len(rows) + 1) + 2
        page.text(x, oy, "other inputs changed: " + "; ".join(others[:4]) + (" …" if len(others) > 4 else ""),
                  size=2.8, fill="#333")
