"""What the sheet dimensions, as plain data: one ``DimensionRequest`` per dimension, in model coordinates.

This module decides WHICH dimensions the sheet carries and what their texts say; the layout
(``drawing/layout.py``) decides WHERE they go (lanes, text positions, flips) and never the reverse.
Every point comes from the drawn profile (``locate``), so each dimension measures the geometry.

>>> r = DimensionRequest(("rim.band_width",), "linear", ((10.0, 28.0), (18.0, 28.0)), direction="axial")
>>> measure(r), label(r, "8")
(8.0, '8')
>>> label(DimensionRequest(("rim.diameter",), "diameter", ((18.0, 28.0),), auxiliary=True), "56")
'(Ø56)'
"""
from __future__ import annotations

import math
from dataclasses import dataclass, replace
from typing import Any

from ..builder import Resolved
from ..geometry import Arc, Point, Profile, arc_through
from .locate import LocateError, Outline, on_face, on_radius, outline_of
from .locate import corner as _vertex_or_corner
from .numbers import size_text, tolerance_text

__all__ = ["DimensionRequest", "KINDS", "VIEWS", "SIDES", "measure", "label", "format_value", "text_lines",
           "section_requests", "detail_requests", "sheet_requests", "radius_request", "unspecified_radii", "shape_requests", "detail_region", "crowd_region", "enlargeable", "DATUM_A_KEY", "datum_face_z", "thread_callout", "DIA", "seat_fit"]

DIA = "Ø"
DATUM_A_KEY = "bearing_seat.post_diameter"  # the dimension whose feature is datum A: the bearing seat's axis
KINDS = ("linear", "diameter", "radius", "angle")
VIEWS = ("main", "detail")
SIDES = ("", "above", "below", "left", "right")


@dataclass(frozen=True)
class DimensionRequest:
    """One dimension the sheet must show.

    keys        feature.parameter keys it shows (the DXF DIMENSION carries them as YODRAFT xdata)
    kind        ``linear`` (``points`` = p1, p2; ``direction`` ``axial`` measures Δz, ``radial`` Δr),
                ``diameter`` (``points`` = (p,), a point of the upper outline at radius r: shows 2r as a
                half-shown diameter from the axis, ISO 129-1), ``radius`` (``points`` = (centre, a point
                of the arc), optionally followed by the arc's two ends) or ``angle`` (``points`` = (vertex, p1, p2), counter-clockwise from p1 to p2)
    view        ``main`` (the section) or ``detail`` (the seat enlargement)
    text        the value's text: ``<>`` is the measured value; empty means the kind's prefix (Ø, R) + ``<>``
    tolerance   written after the value, e.g. ``±0.005`` or ``+0.05/0``; a second line may follow ``\\n``
    auxiliary   shown in parentheses, not toleranced, for information only (ISO 129-1 auxiliary dimension)
    side        where the layout tries first: ``above``/``below`` (axial) or ``left``/``right`` (radial and
                diameters; left is the gap side), empty for the kind's default; the layout may move it
    lower       draw it on the mirrored (lower) half of the section
    decimals    most decimals of the measured value (trailing zeros dropped)
    """

    keys: tuple[str, ...]
    kind: str
    points: tuple[Point, ...]
    view: str = "main"
    direction: str = ""
    text: str = ""
    tolerance: str = ""
    auxiliary: bool = False
    side: str = ""
    lower: bool = False
    decimals: int = 2

    def __post_init__(self) -> None:
        need = {"linear": (2,), "diameter": (1,), "radius": (2, 4), "angle": (3,)}
        if self.kind not in KINDS or len(self.points) not in need[self.kind]:
            raise ValueError(f"dimension {self.keys}: kind {self.kind!r} with {len(self.points)} points")
        if self.view not in VIEWS or self.side not in SIDES:
            raise ValueError(f"dimension {self.keys}: view {self.view!r}, side {self.side!r}")
        if self.kind == "linear" and self.direction not in ("axial", "radial"):
            raise ValueError(f"dimension {self.keys}: a linear dimension is axial or radial")


def measure(req: DimensionRequest) -> float:
    """The value the dimension shows: mm, or degrees for an angle."""
    p = req.points
    if req.kind == "linear":
        i = 0 if req.direction == "axial" else 1
        return abs(p[1][i] - p[0][i])
    if req.kind == "diameter":
        return 2.0 * abs(p[0][1])
    if req.kind == "radius":
        return math.dist(p[0], p[1])
    a1 = math.atan2(p[1][1] - p[0][1], p[1][0] - p[0][0])
    a2 = math.atan2(p[2][1] - p[0][1], p[2][0] - p[0][0])
    return math.degrees((a2 - a1) % (2 * math.pi))


#: the most places a size is written to: the whole µm (a length below it is refused at input)
FINEST_DECIMALS = 3


def format_value(value: float, decimals: int) -> str:
    """``value`` to at most ``decimals`` places, trailing zeros dropped (ISO 129-1 writes 8, not 8.00); a small
    value keeps its meaning: more places, up to the µm, where ``decimals`` would write it more than a tenth off
    (a 0.004 mm radius is R0.004, not R0).

    >>> format_value(8.0, 2), format_value(1.875, 2), format_value(0.5, 3), format_value(0.004, 2)
    ('8', '1.88', '0.5', '0.004')
    """
    while decimals < FINEST_DECIMALS and abs(round(value, decimals) - value) > 0.1 * abs(value):
        decimals += 1
    s = f"{value:.{decimals}f}"
    if "." in s:
        s = s.rstrip("0").rstrip(".")
    return "0" if s in ("-0", "") else s


def label(req: DimensionRequest, value: str) -> str:
    """The first line of the dimension's text with ``value`` filled in (tolerance's first line included)."""
    if req.text:
        body = req.text.replace("<>", value)
    else:
        body = {"diameter": DIA, "radius": "R"}.get(req.kind, "") + value + ("°" if req.kind == "angle" else "")
    tol = req.tolerance.split("\n")[0]
    body = f"{body} {tol}" if tol else body
    return f"({body})" if req.auxiliary else body


def text_lines(req: DimensionRequest) -> list[str]:
    """The dimension's text as drawn: the measured value with its first tolerance line, then any further
    tolerance lines (in parentheses for an auxiliary dimension)."""
    first = label(req, format_value(measure(req), req.decimals))
    rest = req.tolerance.split("\n")[1:]
    return [first] + [f"({r})" if req.auxiliary else r for r in rest]


def corner(profile: Profile, point: Point) -> Point:
    """The loop's vertex at ``point``, or the theoretical sharp corner of the fillet there; where two
    fillets meet with no straight edge between them (a face used up by its edge radii) the corner is
    ``point`` itself, the intersection of the two faces the design gives."""
    try:
        return _vertex_or_corner(profile, point)
    except LocateError:
        return point


def seat_fit(resolved: Resolved):  # type: ignore[no-untyped-def]
    """The bearing seat's fit (post and wall bore limits) as the builder worked it out."""
    fit = getattr(resolved, "seat_fit", None)
    return fit if fit is not None else resolved.features["bearing_seat"].extra["seat_fit"]


def datum_face_z(resolved: Resolved) -> float:
    """z of datum face B, the outer (back) face: faced first, every axial position is measured from it."""
    return float(resolved["shape.face_z"])


def thread_callout(resolved: Resolved) -> str:
    """The thread designation as ISO 965-1 writes it, e.g. ``M4×0.7-6H``."""
    d = resolved.features["axle_bore"].dims
    return f"{str(d['thread']).replace('x', '×')}-{d['tolerance_class']}"


def detail_region(resolved: Resolved) -> tuple[float, float, float, float]:
    """(z_min, r_min, z_max, r_max) of the seat detail: post, seat face, vent groove, wall and pad groove."""
    v = resolved.values
    z0 = v["bearing_seat.post_face_z"] - 1.0
    z1 = max(v["vent_groove.bottom_z"], v["pad_groove.bottom_z"]) + 1.0
    r1 = v["pad_groove.inner_diameter"] / 2 + 0.5
    return (z0, 0.0, z1, r1)


def enlargeable(req: DimensionRequest) -> bool:
    """Whether an enlarged detail of part of the section can show the size: a linear size or a radius (a
    diameter is shown from the axis, an angle from its vertex, which such a detail need not hold)."""
    return req.kind in ("linear", "radius")


def crowd_region(requests: list[DimensionRequest]) -> tuple[float, float, float, float] | None:
    """(z_min, r_min, z_max, r_max) of an enlarged detail round the sizes a crowded section has no room for:
    the points each measures (a radius's arc, not its centre) with a margin; ``None`` when none is
    ``enlargeable``.

    >>> crowd_region([DimensionRequest(("k",), "radius", ((0.0, 0.0), (10.0, 20.0), (9.0, 21.0), (11.0, 19.0)))])
    (7.0, 17.0, 13.0, 23.0)
    """
    points = [p for r in requests if enlargeable(r) for p in (r.points if r.kind == "linear" else r.points[1:])]
    if not points:
        return None
    z0, z1 = min(p[0] for p in points), max(p[0] for p in points)
    r0, r1 = min(p[1] for p in points), max(p[1] for p in points)
    margin = max(2.0, 0.5 * max(z1 - z0, r1 - r0))  # room for the corners round them: the detail's context
    return (z0 - margin, r0 - margin, z1 + margin, r1 + margin)


def _tolerance(tol_mm: float, nominal_mm: float, inch: bool) -> str:
    return tolerance_text(nominal_mm, tol_mm, inch)


def section_requests(resolved: Resolved) -> list[DimensionRequest]:
    """The dimensions of the main view (the seat's own sizes are on the detail), the chain settled."""
    return [r for r in sheet_requests(resolved) if r.view == "main"]


def detail_requests(resolved: Resolved) -> list[DimensionRequest]:
    """The dimensions of the seat detail: the fitted diameters, the seat face, and the gap's chain from it."""
    return [r for r in sheet_requests(resolved) if r.view == "detail"]


def sheet_requests(resolved: Resolved) -> list[DimensionRequest]:
    """Every dimension of the sheet in order of importance, settled into one chain (``chain.settle``):
    the seat and the gap's chain first (from the seat face, their functional face), then the seat face
    from datum face B, then what locates the rest from B and the axis. A dimension that would close a
    loop stays as an auxiliary one; whatever corner no dimension locates gets its position from B or its
    diameter, and every arc its radius (``n×`` where one value serves several)."""
    from .chain import settle

    profile = resolved.profile
    assert profile is not None
    # a length of zero (a hub standing up to datum face B) is no dimension
    wanted = [r for r in _seat_requests(resolved) + ring_seat_requests(resolved) + _main_requests(resolved)
              if r.kind != "linear" or measure(r) > 1e-9]
    settled, chain = settle(wanted, profile, datum_face_z(resolved), rounded_corners(resolved))
    # the tap drill's depth, written with its diameter (Ø3.3 ↧10.1), locates the drill's end from the post face
    v = resolved.values
    r_d = v["axle_bore.tap_drill"] / 2
    chain.tie("axial", (v["bearing_seat.post_face_z"], r_d), (v["axle_bore.bottom_z"], r_d))
    settled += _complete(resolved, chain)
    return _radii(resolved, settled)


def rounded_corners(resolved: Resolved) -> tuple[tuple[Point, float], ...]:
    """Every corner of the half's loop that carries a radius, as (sharp corner, radius): the point a fillet
    stands for on the sheet."""
    from ..builder import loop_chunks

    results = resolved.features
    return tuple((v.point, v.radius) for feature, chunk in loop_chunks(results) for v in results[feature].chunks[chunk]
                 if v.radius > 0)


def ring_seat_requests(resolved: Resolved) -> list[DimensionRequest]:
    """The ring seat in the body (when the half has a ring): its fit diameter, toleranced as the fit
    gives it (the body's ISO 286 class and limits, or the interference), and its depth from the face."""
    fit = resolved.features["ring"].extra.get("press_fit") if "ring" in resolved.features else None
    if fit is None or len(resolved.parts) < 2:
        return []
    from ..features.ring import GROOVE_WALL_LIMITS
    from .ring_sheet import deviations, seat_fit_text

    v = resolved.values
    d, z0, face = fit.interface_mm, v["ring.seat_z"], v["rim.face_z"]
    out = [DimensionRequest(("ring.diameter",), "diameter", ((face, d / 2),), side="right", decimals=3,
                            tolerance=seat_fit_text(fit)),
           DimensionRequest(("ring.width",), "linear", ((z0, d / 2), (face, d / 2)), direction="axial",
                            side="above")]
    if fit.seat == "face":  # the groove's inner wall stands clear of the ring's bore, which the press shrinks
        g = v["ring.groove_inner_diameter"]
        out.append(DimensionRequest(("ring.groove_inner_diameter",), "diameter", ((face, g / 2),), side="left",
                                    decimals=3, tolerance=deviations(GROOVE_WALL_LIMITS)))
    return out


def _seat_requests(resolved: Resolved) -> list[DimensionRequest]:
    """The seat detail: post (datum A) and wall bore with their fits, the seat face, and from the seat face
    the wall offset and post length with the tolerances the gap allocates, and the vent groove depth."""
    profile = resolved.profile
    assert profile is not None
    v = resolved.values
    fit = seat_fit(resolved)
    inch = bool(v["bearing.inch"])
    out = [
        DimensionRequest(("bearing_seat.post_diameter",), "diameter",
                         (on_radius(profile, v["bearing_seat.post_diameter"] / 2, prefer="min"),), view="detail",
                         side="left", decimals=3, tolerance=_tolerance(fit.post.tolerance_mm, fit.post.nominal_mm, inch)),
        DimensionRequest(("bearing_seat.wall_bore", "vent_groove.outer_diameter"), "diameter",
                         (on_radius(profile, v["bearing_seat.wall_bore"] / 2, prefer="min"),), view="detail",
                         side="left", decimals=3, tolerance=_tolerance(fit.wall.tolerance_mm, fit.wall.nominal_mm, inch)),
        DimensionRequest(("bearing_seat.seat_face_diameter", "vent_groove.inner_diameter"), "diameter",
                         (on_radius(profile, v["bearing_seat.seat_face_diameter"] / 2, prefer="min"),),
                         view="detail", side="left", decimals=3),
    ]
    seat_z = v["bearing_seat.seat_face_z"]
    seat = on_face(profile, seat_z)
    post = on_face(profile, v["bearing_seat.post_face_z"])
    wall = on_face(profile, v["bearing_seat.wall_face_z"], prefer="min")
    out.append(DimensionRequest(("bearing_seat.wall_offset",), "linear", (wall, seat), view="detail",
                                direction="axial", side="above", decimals=3,
                                tolerance=f"±{size_text(v['bearing_seat.wall_offset_tolerance'])}"))
    out.append(DimensionRequest(("bearing_seat.post_length",), "linear", (post, seat), view="detail",
                                direction="axial", side="above", decimals=3,
                                tolerance=f"±{size_text(v['bearing_seat.post_length_tolerance'])}"))
    face_r = v["bearing_seat.seat_face_diameter"] / 2
    out.append(DimensionRequest(("vent_groove.depth",), "linear", (
        corner(profile, (seat_z, face_r)), corner(profile, (v["vent_groove.bottom_z"], face_r))),
        view="detail", direction="axial"))
    return out


def _main_requests(resolved: Resolved) -> list[DimensionRequest]:
    """The main view's dimensions in order of importance: the seat face from datum face B, the gap side,
    the axle hole, the outer shape from B and the axis; then what follows from those (auxiliary once settled)."""
    profile = resolved.profile
    assert profile is not None
    v = resolved.values
    wall_z = v["bearing_seat.wall_face_z"]
    zb = datum_face_z(resolved)
    b = on_face(profile, zb)
    cone = v["shape.kind"] == "cone"
    z_post = v["bearing_seat.post_face_z"]
    out: list[DimensionRequest] = [
        DimensionRequest(("bearing_seat.seat_face_z",), "linear",
                         (on_face(profile, v["bearing_seat.seat_face_z"], prefer="min"), b), direction="axial",
                         side="below", lower=True, decimals=3,
                         tolerance=f"±{size_text(v['axial.seat_depth_tolerance'])}" if "axial.seat_depth_tolerance" in v else ""),
    ]
    # the gap side: pad groove (its depth from the wall face) and the catch zone's start
    pad_r0 = v["pad_groove.inner_diameter"] / 2
    for keys, at in (
        (("pad_groove.inner_diameter", "bearing_seat.wall_outside_diameter"),
         on_radius(profile, pad_r0, prefer="min")),
        (("pad_groove.outer_diameter",), on_radius(profile, v["pad_groove.outer_diameter"] / 2, prefer="min")),
    ):
        out.append(DimensionRequest(keys, "diameter", (at,), side="left"))
    out.append(DimensionRequest(("pad_groove.depth",), "linear", (
        corner(profile, (wall_z, pad_r0)), corner(profile, (v["pad_groove.bottom_z"], pad_r0))), direction="axial"))
    start_r = v["shape.start_diameter"] / 2
    if cone:
        out.append(DimensionRequest(("catch_zone.start_diameter",), "diameter", (corner(profile, (wall_z, start_r)),),
                                    side="left"))
    # the axle hole (ISO 6410-1 representation): the thread and the tap drill, each with its depth from the
    # post face written with the depth symbol, e.g. M4×0.7-6H ↧8 and Ø3.3 ↧10.1 (the drill's 118° point in the notes)
    r_t = v["axle_bore.major_diameter"] / 2
    r_d = v["axle_bore.tap_drill"] / 2
    thread = thread_callout(resolved)
    if resolved.features["axle_bore"].extra["thread"].metric:  # M<measured diameter>×pitch-class
        thread = "M<>" + thread[len(f"M{v['axle_bore.major_diameter']:g}"):]
    out.append(DimensionRequest(("axle_bore.major_diameter", "axle_bore.thread_depth"), "diameter", ((z_post, r_t),),
                                side="left", lower=True, text=f"{thread} ↧{size_text(v['axle_bore.thread_depth'])}"))
    out.append(DimensionRequest(("axle_bore.tap_drill", "axle_bore.drill_depth"), "diameter", ((z_post, r_d),),
                                side="left", text=f"Ø<> ↧{size_text(v['axle_bore.drill_depth'])}"))
    if cone:
        out += _rim_requests(resolved)
    else:
        out += shape_requests(resolved)
    # the post face from datum face B, which the seat chain already gives: the half's width, auxiliary once settled
    out.append(DimensionRequest(("bearing_seat.post_face_z", "profile.half_width"), "linear",
                                (on_face(profile, z_post, prefer="min"), b), direction="axial", side="below", lower=True))
    return out


def _rim_requests(resolved: Resolved) -> list[DimensionRequest]:
    """The cone family's rim and cup: diameters; the rim band, cup floor, flat floor and hub face from
    datum face B; then the hub height and the two cone angles, which follow (auxiliary once settled)."""
    profile = resolved.profile
    assert profile is not None
    v = resolved.values
    R = profile.bounds()[3]
    zb = datum_face_z(resolved)
    b = on_face(profile, zb)
    wall_z = v["bearing_seat.wall_face_z"]
    out: list[DimensionRequest] = []
    has_hub = v["rim.hub_diameter"] > 0 and v["rim.hub_height"] > 0
    for keys, at in (
        (("rim.diameter",), on_radius(profile, R)),
        (("rim.cup_diameter",), corner(profile, (v["rim.face_z"], v["rim.cup_diameter"] / 2))),
        (("rim.floor_diameter",), corner(profile, (v["rim.flat_z"], v["rim.floor_diameter"] / 2))),
    ) + ((("rim.hub_diameter",), on_radius(profile, v["rim.hub_diameter"] / 2)),) * has_hub:
        out.append(DimensionRequest(keys, "diameter", (at,), side="right"))
    band = corner(profile, (v["catch_zone.end_z"], R))
    out.append(DimensionRequest(("rim.band_width",), "linear", (band, corner(profile, (v["rim.face_z"], R))),
                                direction="axial", side="above"))
    cup0 = corner(profile, (v["rim.floor_z"], v["rim.cup_diameter"] / 2))
    cup1 = corner(profile, (v["rim.face_z"], v["rim.cup_diameter"] / 2))
    out.append(DimensionRequest(("rim.cup_depth",), "linear", (cup0, cup1), direction="axial"))
    floor = corner(profile, (v["rim.flat_z"], v["rim.floor_diameter"] / 2))
    out.append(DimensionRequest(("rim.flat_z",), "linear", (floor, b), direction="axial", side="below", lower=True))
    if has_hub:
        hub = on_radius(profile, v["rim.hub_diameter"] / 2)
        out.append(DimensionRequest(("rim.hub_face_z",), "linear", (hub, b), direction="axial",
                                    lower=True))
        out.append(DimensionRequest(("rim.hub_height",), "linear", (floor, hub), direction="axial"))
    start = corner(profile, (wall_z, v["catch_zone.start_diameter"] / 2))
    out.append(DimensionRequest(("catch_zone.angle",), "angle", (start, band, (start[0], start[1] + 10.0)),
                                decimals=1))
    if v["rim.floor_angle"] > 0 and math.dist(cup0, floor) > 1e-6:  # a flat floor has no cone to show
        out.append(DimensionRequest(("rim.floor_angle",), "angle", (cup0, floor, (cup0[0], cup0[1] - 10.0)),
                                    decimals=1))
    drawn = outline_of(resolved)  # a ring may carry the corner's radius (the cup lip)
    for key, near in (
        ("rim.edge_radius", (v["rim.face_z"], R)),
        ("rim.lip_radius", (v["rim.face_z"], v["rim.cup_diameter"] / 2)),
        ("catch_zone.edge_radius", (v["catch_zone.end_z"], R)),
        ("rim.cup_radius", (v["rim.floor_z"], v["rim.cup_diameter"] / 2)),
    ):
        arc = _arc_near(drawn, v[key], near)
        if arc is not None:
            out.append(radius_request((key,), arc, decimals=2))
    return out


def _complete(resolved: Resolved, chain) -> list[DimensionRequest]:  # type: ignore[no-untyped-def]
    """A position from datum face B and a diameter for each corner the requests leave unlocated."""
    profile = resolved.profile
    assert profile is not None
    b = on_face(profile, datum_face_z(resolved))
    out = []
    for c in chain.unlocated():
        if not chain.z.located(c[0]):
            chain.tie("axial", c, b)
            out.append(DimensionRequest(("profile.position",), "linear", (c, b), direction="axial", side="below",
                                        lower=True))
        if not chain.r.located(abs(c[1])):
            chain.tie("diameter", c)
            out.append(DimensionRequest(("profile.diameter",), "diameter", (c,), side="right"))
    return out


def _radii(resolved: Resolved, requests: list[DimensionRequest]) -> list[DimensionRequest]:
    """The radius dimensions: one for the value the "unspecified radii" note gives (``unspecified_radii``), and
    one for every other arc, so the note names a single value and a turner never has to guess which unmarked
    corner takes which radius (ISO 129-1: each feature dimensioned once, the rest by a general note).

    The note's value is the one the most arcs share (the smaller on a tie); an arc no feature's radius
    dimensions gets a dimension of its own (``profile.radius``).
    """
    out = [r for r in requests if r.kind != "radius"]
    asked = [r for r in requests if r.kind == "radius"]
    arcs = [s for s in outline_of(resolved).segments if isinstance(s, Arc)]  # a ring's arcs too
    by_value: dict[float, list[Arc]] = {}
    for arc in arcs:
        by_value.setdefault(round(arc.radius, 6), []).append(arc)
    shared = [(len(group), value) for value, group in by_value.items() if len(group) > 1]
    noted = min(shared, key=lambda cv: (-cv[0], cv[1]))[1] if shared else None
    placed: list[DimensionRequest] = []  # in the order asked; the note's value once, carrying all its keys
    for req in asked:
        value = round(measure(req), 6)
        same = next((k for k, r in enumerate(placed) if round(measure(r), 6) == value
                     and (value == noted or math.dist(r.points[0], req.points[0]) <= 1e-6)), None)
        if same is None:
            placed.append(req)
        else:  # the note's value again, or one arc asked for twice: one dimension
            placed[same] = replace(placed[same], keys=tuple(dict.fromkeys(placed[same].keys + req.keys)))
    for value, group in by_value.items():
        for arc in group[:1] if value == noted else group:  # every arc of any other value carries its own
            if all(round(measure(r), 6) != value or (value != noted and math.dist(arc.center, r.points[0]) > 1e-6)
                   for r in placed):
                placed.append(radius_request(("profile.radius",), arc))
    return out + placed


def radius_request(keys: tuple[str, ...], arc: Arc, **fields: Any) -> DimensionRequest:
    """A radius dimension of ``arc``: its centre, its middle and its two ends (where a leader may leave it);
    ``fields``, any other of the request's fields (``decimals``, ``view``)."""
    return DimensionRequest(keys, "radius", (arc.center, arc.point_at(arc.start_angle + arc.sweep / 2), arc.start,
                                             arc.end), **fields)


def unspecified_radii(resolved: Resolved) -> list[float]:
    """The radii of arcs drawn in the section (a ring's too) without a dimension of their own (another arc
    of that size carries it)."""
    if resolved.profile is None:
        return []
    dimensioned = [r.points[0] for r in sheet_requests(resolved) if r.kind == "radius"]
    return sorted({round(s.radius, 6) for s in outline_of(resolved).segments
                   if isinstance(s, Arc) and all(math.dist(s.center, c) > 1e-6 for c in dimensioned)})


def shape_requests(resolved: Resolved) -> list[DimensionRequest]:
    """A given outer shape's dimensions: every point's diameter and axial position from datum face B
    (points sharing one share its dimension), every corner radius and every arc's radius."""
    profile = resolved.profile
    assert profile is not None
    v = resolved.values
    shape = resolved.features["shape"]
    corners, labels = shape.chunks["outer"], shape.extra["labels"]
    drawn = outline_of(resolved)  # a ring may carry a corner's radius
    zb = datum_face_z(resolved)
    b = on_face(profile, zb)
    wall_z = v["bearing_seat.wall_face_z"]
    diameters: dict[float, tuple[list[str], Point]] = {}
    positions: dict[float, tuple[list[str], Point]] = {}
    out: list[DimensionRequest] = []
    for k, (c, (key, arc_key)) in enumerate(zip(corners, labels)):
        z, r = c.point
        at = c.point  # the sharp (theoretical) corner, which a fillet there rounds
        if r > 1e-9:
            keys, _ = diameters.setdefault(round(2 * r, 6), ([], at))
            keys.append(f"{key}_diameter")
        if abs(z - zb) > 1e-9 and abs(z - wall_z) > 1e-9:  # the wall face has its own position; B is the datum
            keys, _ = positions.setdefault(round(z, 6), ([], at))
            keys.append(f"{key}_z")
        if c.radius > 0:
            arc = _arc_near(drawn, c.radius, at)
            if arc is not None:
                out.append(radius_request((c.owner,), arc))
        if c.sweep and arc_key:
            whole = arc_through(c.point, corners[k + 1].point, c.sweep)  # fillets at its ends may trim it
            arc = next((s for s in profile.segments if isinstance(s, Arc) and abs(s.radius - whole.radius) < 1e-6
                        and math.dist(s.center, whole.center) < 1e-6), None)
            if arc is not None:  # None: the corner radii at its ends take the whole arc, and they are dimensioned
                out.append(radius_request((arc_key,), arc))
    start_d = round(v["shape.start_diameter"], 6)
    for d, (keys, at) in sorted(diameters.items()):
        first = d == start_d
        out.append(DimensionRequest(tuple(sorted(keys)) + (("shape.start_diameter",) if first else ()), "diameter", (at,),
                                    side="left" if first else "right"))
    for _, (keys, at) in sorted(positions.items(), reverse=True):
        out.append(DimensionRequest(tuple(sorted(keys)), "linear", (at, b), direction="axial", side="below", lower=True))
    return out


def _arc_near(profile: Profile | Outline, radius: float, near: Point) -> Arc | None:
    """The fillet arc of ``radius`` whose centre is nearest ``near``; None for a sharp edge (radius 0)."""
    if radius <= 0:
        return None
    arcs = [s for s in profile.segments if isinstance(s, Arc) and abs(s.radius - radius) < 1e-9]
    return min(arcs, key=lambda a: math.dist(a.center, near)) if arcs else None
