"""The enlarged detail of the bearing seat: a block of the clipped section with its own dimensions.

The block holds true 1:1 geometry (so its dimensions measure true sizes) and is
inserted on the sheet at the detail scale; model space stays the plain section.
"""
from __future__ import annotations

import shapely
from ezdxf.document import Drawing

from ..builder import Resolved
from ..geometry import Arc, Line
from .clip import clip_segments
from .dimensions import DIA, Annotator
from .locate import corner, on_face, on_radius
from .numbers import tolerance_text as deviations
from .section import HATCH_SPACING

__all__ = ["DETAIL_BLOCK", "detail_region", "detail_scale", "build_detail", "tolerance_text", "detail_lanes"]

DETAIL_BLOCK = "seat-detail"
SCALES = (20.0, 10.0, 5.0)  # ISO 5455 enlargements


def detail_region(resolved: Resolved) -> tuple[float, float, float, float]:
    """(z_min, r_min, z_max, r_max) around the post, seat face, vent groove, wall and pad groove."""
    v = resolved.values
    z0 = v["bearing_seat.post_face_z"] - 1.0
    z1 = max(v["vent_groove.bottom_z"], v["pad_groove.bottom_z"]) + 1.0
    r1 = v["pad_groove.inner_diameter"] / 2 + 0.5
    return (z0, 0.0, z1, r1)


def detail_scale(region: tuple[float, float, float, float], width: float, height: float) -> float:
    """The largest preferred enlargement (ISO 5455) at which ``region`` fits ``width`` × ``height`` mm."""
    w, h = region[2] - region[0], region[3] - region[1]
    for s in SCALES:
        if w * s <= width and h * s <= height:
            return s
    return SCALES[-1]


def tolerance_text(nominal_mm: float, tol_mm: float, inch: bool) -> str:
    """Dimension text for a toleranced diameter: measured nominal to the µm, deviations, inch in brackets."""
    return f"{DIA}<> " + deviations(nominal_mm, tol_mm, inch).replace("\n", "\\P")


def build_detail(doc: Drawing, resolved: Resolved, scale: float) -> tuple[float, float, float, float]:
    """Create the detail block; returns its region in model coordinates."""
    profile = resolved.profile
    assert profile is not None
    region = detail_region(resolved)
    block = doc.blocks.new(DETAIL_BLOCK)
    for seg in clip_segments(profile.segments, region):
        if isinstance(seg, Line):
            block.add_line(seg.start, seg.end, dxfattribs={"layer": "outline"})
        else:
            import math
            a0, a1 = seg.start_angle, seg.end_angle
            if seg.sweep < 0:
                a0, a1 = a1, a0
            block.add_arc(seg.center, seg.radius, math.degrees(a0), math.degrees(a1), dxfattribs={"layer": "outline"})
    cut = profile.polygon().intersection(shapely.box(*region))
    spacing = HATCH_SPACING / scale
    parts = getattr(cut, "geoms", [cut])
    for poly in parts:
        if poly.is_empty or poly.geom_type != "Polygon":
            continue
        hatch = block.add_hatch(dxfattribs={"layer": "hatch", "color": 256})
        hatch.set_pattern_fill("section-45", color=256, angle=0.0, scale=1.0, style=1, pattern_type=0,
                               definition=[[45.0, (0.0, 0.0), (-spacing * 0.7071067811865476,
                                                              spacing * 0.7071067811865476), []]])
        hatch.paths.add_polyline_path(list(poly.exterior.coords)[:-1], is_closed=True, flags=1)
    r_t = resolved["axle_bore.major_diameter"] / 2
    z0 = resolved["bearing_seat.post_face_z"]
    block.add_line((z0, r_t), (region[2], r_t), dxfattribs={"layer": "thread"})
    _dimension(block, resolved, scale)
    return region


def detail_lanes(resolved: Resolved, scale: float) -> list[float]:
    """z of the detail's diameter lines, post first: 6 mm on paper left of the region, then each
    lane clears the text of the one inside it (two-line toleranced texts need more room)."""
    k = 1.0 / scale
    x = detail_region(resolved)[0]
    out = []
    for step in (6.0, 14.0, 7.0):  # post (toleranced) → seat face → wall bore
        x -= step * k
        out.append(x)
    return out


def _dimension(block, resolved: Resolved, scale: float) -> None:  # type: ignore[no-untyped-def]
    profile = resolved.profile
    assert profile is not None
    v = resolved.values
    fit = resolved.seat_fit
    inch = bool(v["bearing.inch"])
    an = Annotator(block, scale)
    k = an.k
    lanes = [
        (("bearing_seat.post_diameter",), on_radius(profile, v["bearing_seat.post_diameter"] / 2, prefer="min"),
         tolerance_text(fit.post.nominal_mm, fit.post.tolerance_mm, inch), {"dimtp": fit.post.tolerance_mm,
                                                                             "dimtm": fit.post.tolerance_mm}),
        (("bearing_seat.seat_face_diameter", "vent_groove.inner_diameter"),
         on_radius(profile, v["bearing_seat.seat_face_diameter"] / 2, prefer="min"), DIA + "<>", {}),
        (("bearing_seat.wall_bore", "vent_groove.outer_diameter"),
         on_radius(profile, v["bearing_seat.wall_bore"] / 2, prefer="min"),
         tolerance_text(fit.wall.nominal_mm, fit.wall.tolerance_mm, inch), {"dimtp": fit.wall.tolerance_mm,
                                                                             "dimtm": fit.wall.tolerance_mm}),
    ]
    for (keys, at, text, extra), x in zip(lanes, detail_lanes(resolved, scale)):
        an.half_diameter(keys, at, x, text=text, extra={"dimdec": 3, **extra},
                         text_r=at[1] / 2 if extra else None)
    # groove depths inside their grooves
    seat_z = v["bearing_seat.seat_face_z"]
    face_r = v["bearing_seat.seat_face_diameter"] / 2
    vent0 = corner(profile, (seat_z, face_r))
    vent1 = corner(profile, (v["vent_groove.bottom_z"], face_r))
    mid_r = (face_r + v["bearing_seat.wall_bore"] / 2) / 2
    an.linear(("vent_groove.depth",), vent0, vent1, base=(seat_z, mid_r))
    wall_z = v["bearing_seat.wall_face_z"]
    # post length and wall offset, above the detail, from the seat face
    top = detail_region(resolved)[3]
    seat = on_face(profile, seat_z)
    post = on_face(profile, v["bearing_seat.post_face_z"])
    an.linear(("bearing_seat.post_length",), post, seat, base=(seat_z, top - 1.5 * 7.0 * k))
    wall = on_face(profile, wall_z, prefer="min")
    an.linear(("bearing_seat.wall_offset",), wall, (seat[0], seat[1]), base=(seat_z, top - 0.5 * 7.0 * k))
