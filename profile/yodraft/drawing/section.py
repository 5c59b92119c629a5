"""Model space: the section of one half at 1:1 (x = z, y = r), its mirror, hatching, axis, thread and dimensions."""
from __future__ import annotations

import math

from ezdxf.layouts import BaseLayout

from ..builder import Resolved
from ..geometry import Arc, Profile
from .dimensions import DIA, Annotator
from .layers import TEXT_HEIGHT
from .locate import corner, on_face, on_radius
from .outline import add_loop

__all__ = ["draw_section", "add_hatch", "dimension_section", "HATCH_SPACING", "datum_face_z", "thread_callout",
           "thread_lane_z", "LEFT_LANES"]

HATCH_SPACING = 3.0  # mm on paper, ISO 128-50 (at least 0.7 mm) (from memory)
LANE = 7.0  # mm on paper between stacked dimension lines
FIRST = 9.0  # mm on paper from the outline to the first dimension line
LEFT_LANES = 3  # diameters on the gap side of the upper half; the thread takes the next lane


def thread_lane_z(resolved: Resolved, scale: float) -> float:
    """z of the thread's diameter line: its own lane outside the gap-side diameters, so no two
    diameter lines run on one line across the axis."""
    z_min = resolved.profile.bounds()[0]  # type: ignore[union-attr]
    return z_min - (FIRST + LANE * LEFT_LANES) / scale


def datum_face_z(resolved: Resolved) -> float:
    """z of datum face B, the outer (back) face: faced first, every axial position is measured from it."""
    return float(resolved["shape.face_z"])


def add_hatch(layout: BaseLayout, profile: Profile, scale: float, layer: str = "hatch") -> None:
    """Hatch the loop at 45° with exact arc edges, spaced ``HATCH_SPACING`` on paper."""
    hatch = layout.add_hatch(dxfattribs={"layer": layer, "color": 256})
    spacing = HATCH_SPACING / scale
    hatch.set_pattern_fill("section-45", color=256, angle=0.0, scale=1.0, style=1, pattern_type=0,
                           definition=[[45.0, (0.0, 0.0), (-spacing * math.sqrt(0.5), spacing * math.sqrt(0.5)), []]])
    points = []
    for seg in profile.segments:
        bulge = seg.bulge if isinstance(seg, Arc) else 0.0
        points.append((seg.start[0], seg.start[1], bulge))
    hatch.paths.add_polyline_path(points, is_closed=True, flags=1)


def thread_callout(resolved: Resolved) -> str:
    """The thread designation as ISO 965-1 writes it, e.g. ``M4×0.7-6H``."""
    d = resolved.features["axle_bore"].dims
    return f"{str(d['thread']).replace('x', '×')}-{d['tolerance_class']}"


def draw_section(layout: BaseLayout, resolved: Resolved, scale: float) -> None:
    """The loop and its mirror on ``outline``, hatched, the axis, and the tapped thread (ISO 6410-1)."""
    profile = resolved.profile
    assert profile is not None
    add_loop(layout, profile, "outline")
    add_loop(layout, profile.mirrored(), "outline")
    add_hatch(layout, profile, scale)
    add_hatch(layout, profile.mirrored(), scale)
    z_min, _, z_max, _ = profile.bounds()
    over = 4.0 / scale
    layout.add_line((z_min - over, 0.0), (z_max + over, 0.0),
                    dxfattribs={"layer": "centre"})
    v = resolved.values
    z0 = v["bearing_seat.post_face_z"]
    r = v["axle_bore.major_diameter"] / 2
    end = z0 + v["axle_bore.thread_depth"]
    for sign in (1.0, -1.0):
        layout.add_line((z0, sign * r), (end, sign * r), dxfattribs={"layer": "thread"})
    # thread limit: a wide line across to the major diameter
    layout.add_line((end, -r), (end, r), dxfattribs={"layer": "thread", "lineweight": 50})


def dimension_section(layout: BaseLayout, resolved: Resolved, scale: float) -> None:
    """Every main-view dimension; the bearing-seat ones live in the enlarged detail."""
    profile = resolved.profile
    assert profile is not None
    v = resolved.values
    an = Annotator(layout, scale)
    k = an.k
    z_min, _, z_max, R = profile.bounds()
    cone = v["shape.kind"] == "cone"
    start_r = v["shape.start_diameter"] / 2
    # diameters on the outer side, stacked outward by size
    right = [] if not cone else [
        (("rim.hub_diameter",), on_radius(profile, v["rim.hub_diameter"] / 2)),
        (("rim.floor_diameter",), corner(profile, (v["rim.flat_z"], v["rim.floor_diameter"] / 2))),
        (("rim.cup_diameter",), corner(profile, (v["rim.face_z"], v["rim.cup_diameter"] / 2))),
        (("rim.diameter",), on_radius(profile, v["rim.diameter"] / 2)),
    ]
    for i, (keys, at) in enumerate(right):
        an.half_diameter(keys, at, z_max + (FIRST + LANE * i) * k)
    # diameters on the gap side that the detail does not carry
    wall_z = v["bearing_seat.wall_face_z"]
    left = [
        (("pad_groove.inner_diameter", "bearing_seat.wall_outside_diameter"),
         on_radius(profile, v["pad_groove.inner_diameter"] / 2, prefer="min")),
        (("pad_groove.outer_diameter",), on_radius(profile, v["pad_groove.outer_diameter"] / 2, prefer="min")),
        (("catch_zone.start_diameter",), corner(profile, (wall_z, start_r))),
    ]
    if not cone:
        left = left[:-1]
    for i, (keys, at) in enumerate(left):
        an.half_diameter(keys, at, z_min - (FIRST + LANE * i) * k)
    pad_r0, pad_r1 = v["pad_groove.inner_diameter"] / 2, v["pad_groove.outer_diameter"] / 2
    pad0 = corner(profile, (wall_z, pad_r0))
    pad1 = corner(profile, (v["pad_groove.bottom_z"], pad_r0))
    # the groove is narrower than its text: the text goes out left of the wall face, in open paper
    # between the groove's two diameter extension lines
    mid_r = (pad_r0 + pad_r1) / 2
    an.linear(("pad_groove.depth",), pad0, pad1, base=(wall_z, mid_r), extra={"dimtad": 0},
              text_at=(wall_z - (FIRST / 2 + 1.0) * k, mid_r))
    # the thread on the mirror half, where no other diameter runs
    r_t = v["axle_bore.major_diameter"] / 2
    z0 = v["bearing_seat.post_face_z"]
    an.half_diameter(("axle_bore.major_diameter",), (z0, r_t), thread_lane_z(resolved, scale),
                     text="M<>" + thread_callout(resolved)[len(f"M{v['axle_bore.major_diameter']:g}"):],
                     lower=True, text_r=-(r_t + (3.0 + 14.0) * k))
    end = z0 + v["axle_bore.thread_depth"]
    # inside the tap drill, hugging its wall so the text stays clear of the axis; the text sits right
    # of the seat detail's marker frame, whose lower edge runs along the axis
    line_r = -0.5 * v["axle_bore.tap_drill"] + 0.3 * k
    from .detail import detail_region

    text_z = max((z0 + end) / 2, detail_region(resolved)[2] + 4.0 * k)
    an.linear(("axle_bore.thread_depth",), (z0, -r_t), (end, -r_t), base=(z0, line_r),
              text="<>", text_at=(text_z, line_r + (0.6 + TEXT_HEIGHT / 2) * k))
    # axial positions from datum face B (the outer face), stacked below the mirror half
    zb = datum_face_z(resolved)
    b = on_face(profile, zb)
    b_low = (b[0], -b[1])
    rows = [
        (("bearing_seat.seat_face_z",), on_face(profile, v["bearing_seat.seat_face_z"], prefer="min")),
        (("bearing_seat.wall_face_z",), corner(profile, (wall_z, start_r))),
        (("bearing_seat.post_face_z", "profile.half_width"), on_face(profile, v["bearing_seat.post_face_z"], prefer="min")),
    ]
    for i, (keys, p) in enumerate(rows):
        low = (p[0], -p[1])
        # an internal face (the seat face) is seen through the section: its extension line starts
        # where the projection leaves the material, so it never runs over hatching
        inside = _material_below(profile, low)
        extra = {"dimexo": inside * scale + 1.0} if inside > 0 else None
        an.linear(keys, low, b_low, base=(zb, -R - (FIRST + LANE * i) * k), extra=extra)
    if not cone:
        _dimension_shape(an, resolved, len(left), len(rows))
        return
    # rim band and cup above the upper half
    band0 = corner(profile, (v["catch_zone.end_z"], R))
    band1 = corner(profile, (v["rim.face_z"], R))
    an.linear(("rim.width",), band0, band1, base=(zb, R + FIRST * k))
    cup0 = corner(profile, (v["rim.floor_z"], v["rim.cup_diameter"] / 2))
    cup1 = corner(profile, (v["rim.face_z"], v["rim.cup_diameter"] / 2))
    an.linear(("rim.cup_depth",), cup0, cup1, base=(zb, cup0[1] - 4.5 * LANE * k))
    hub = on_radius(profile, v["rim.hub_diameter"] / 2)
    floor = corner(profile, (v["rim.flat_z"], v["rim.floor_diameter"] / 2))
    an.linear(("rim.hub_height",), (floor[0], floor[1]), (hub[0], hub[1]),
              base=(hub[0], hub[1] + 1.6 * LANE * k))
    # catch-zone angle from the gap plane, at the catch zone's start
    start = corner(profile, (v["bearing_seat.wall_face_z"], v["catch_zone.start_diameter"] / 2))
    tip = corner(profile, (v["catch_zone.end_z"], R))
    up = (start[0], start[1] + 10.0)
    an.angle(("catch_zone.angle",), start, tip, up, radius=0.55 * math.dist(start, tip))
    # cup floor cone from the gap plane: measured at the cup's corner, between the floor and the
    # plane through that corner, so the arc lies in the open cup and not over the hatched wall
    fl0 = floor
    fl1 = cup0
    rad = 0.45 * math.dist(fl0, fl1)
    an.angle(("rim.floor_angle",), fl1, fl0, (fl1[0], fl1[1] - rad), radius=rad)
    # edge radii, the text outward along each corner's bisector
    for key in ("rim.edge_radius", "rim.lip_radius", "catch_zone.edge_radius", "rim.cup_radius"):
        arc = _arc_for(profile, v[key], key, resolved)
        ang = math.degrees(arc.start_angle + arc.sweep / 2)
        out = arc.radius + 10.0 * k
        at = (arc.center[0] + out * math.cos(math.radians(ang)), arc.center[1] + out * math.sin(math.radians(ang)))
        an.radius((key,), arc.center, arc.radius, ang, at)


def _dimension_shape(an: Annotator, resolved: Resolved, left_lanes: int, rows: int) -> None:
    """A given outer shape's dimensions (``requests.shape_requests``): diameters stacked in lanes on
    the outer side (the catch zone's start on the gap side), axial positions from datum face B below
    the mirror half, radii outward along each arc's middle."""
    from .requests import shape_requests

    profile = resolved.profile
    assert profile is not None
    k = an.k
    z_min, _, z_max, R = profile.bounds()
    zb = datum_face_z(resolved)
    right = row = 0
    for req in shape_requests(resolved):
        if req.kind == "diameter" and req.side == "left":
            an.half_diameter(req.keys, req.points[0], z_min - (FIRST + LANE * left_lanes) * k)
        elif req.kind == "diameter":
            an.half_diameter(req.keys, req.points[0], z_max + (FIRST + LANE * right) * k)
            right += 1
        elif req.kind == "linear":
            low, b_low = [(p[0], -p[1]) for p in req.points]
            inside = _material_below(profile, low)
            extra = {"dimexo": inside * an.scale + 1.0} if inside > 0 else None
            an.linear(req.keys, low, b_low, base=(zb, -R - (FIRST + LANE * (rows + row)) * k), extra=extra)
            row += 1
        elif req.kind == "radius":
            centre, mid = req.points
            radius = math.dist(centre, mid)
            ang = math.atan2(mid[1] - centre[1], mid[0] - centre[0])
            out = radius + 10.0 * k
            an.radius(req.keys, centre, radius, math.degrees(ang),
                      (centre[0] + out * math.cos(ang), centre[1] + out * math.sin(ang)))


def _material_below(profile: Profile, p: tuple[float, float]) -> float:
    """How far (model mm) a projection from mirror-half point ``p`` straight away from the axis runs
    until it leaves the material for good (0 if it starts in the open)."""
    import shapely

    z, r = p[0], -p[1]
    ray = shapely.LineString([(z, r + 1e-6), (z, profile.bounds()[3] + 1.0)])
    cut = ray.intersection(profile.polygon())
    if cut.is_empty or cut.length < 1e-9:
        return 0.0
    return max(y for g in getattr(cut, "geoms", [cut]) for _, y in g.coords) - r


def _arc_for(profile: Profile, radius: float, key: str, resolved: Resolved) -> Arc:
    v = resolved.values
    near = {
        "rim.edge_radius": (v["rim.face_z"], v["rim.diameter"] / 2),
        "rim.lip_radius": (v["rim.face_z"], v["rim.cup_diameter"] / 2),
        "catch_zone.edge_radius": (v["catch_zone.end_z"], v["rim.diameter"] / 2),
        "rim.cup_radius": (v["rim.floor_z"], v["rim.cup_diameter"] / 2),
    }[key]
    arcs = [s for s in profile.segments if isinstance(s, Arc) and abs(s.radius - radius) < 1e-9]
    return min(arcs, key=lambda a: math.dist(a.center, near))
