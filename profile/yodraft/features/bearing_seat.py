"""Bearing seat: the post that carries the inner race, the seat face it sits on, and the bearing wall.

The seat face stands half a bearing width from the gap plane; the two posts'
faces stand ``spacing`` apart; the bearing wall's face stands ``wall_offset``
ahead of the seat face, so gap = bearing width − 2 × wall_offset.

The gap is held to ± ``gap_tolerance`` by what the shop turns: the two seat
faces clamp the inner race, so the gap is the inner ring's width less each half's
wall offset, and the two wall offsets share the gap tolerance equally (worst
case). The bearing's own width band (its class's ΔBs) comes on top: the stack's
worst case and RSS include it, so the report shows the gap a bought bearing gives.
The post length gets the wall offset's tolerance (turned from the same seat face
in the same setup), and the posts must stay apart at its limits.
"""
from __future__ import annotations

import math
from collections.abc import Mapping
from typing import Any

from ..checks import check
from ..params import ParamSpec
from ..tolerances.seat import SeatInputs, coating_growth_mm, size_seat
from ..tolerances.stack import Link, stack
from .base import Context, FeatureResult, V, pick

NAME = "bearing_seat"
PARAMS = (
    ParamSpec("post_diameter", "length", "finished post diameter; derived from the tolerance stack when absent", None, 0.5, 40.0),
    ParamSpec("wall_bore", "length", "finished bore of the bearing wall; derived from the stack when absent", None, 1.0, 60.0),
    ParamSpec("seat_face_diameter", "length", "outer diameter of the face the inner race sits on", None, 0.5, 60.0),
    ParamSpec("spacing", "length", "distance between the two halves' post faces", 1.0, 0.0, 10.0, lo_closed=True),
    ParamSpec("wall_offset", "length", "how far the bearing wall's face stands ahead of the seat face", 0.2, -5.0, 5.0),
    # common practice, no published source: a gap held to about ±0.05 mm plays alike from half to half
    ParamSpec("gap_tolerance", "length", "± the turned halves may add to the gap (worst case; the bearing's width band comes on top)",
              0.05, 0.0, 2.0),
    ParamSpec("wall_offset_tolerance", "length", "± on the wall offset; derived from gap_tolerance when absent",
              None, 0.0, 1.0),
    ParamSpec("post_length_tolerance", "length", "± on the post length; default the wall offset's", None, 0.0, 1.0),
)
#: the seat face reaches this share of the way from bore to outside diameter  # common practice, no published source
SEAT_FACE_SHARE = 0.3


def allocate_offset_tolerance(gap_tolerance_mm: float) -> float:
    """± on each half's wall offset that holds the gap to ± ``gap_tolerance_mm`` worst case.

    The gap takes both halves' wall offsets, so their worst case adds: t = T / 2,
    rounded down to a whole µm.

    >>> allocate_offset_tolerance(0.05)
    0.025
    """
    return math.floor(gap_tolerance_mm / 2 * 1000 + 1e-6) / 1000


def coating_growth(shop: Mapping[str, Any]) -> tuple[float, float]:
    """Diametral growth of a coated seat surface in mm at the coating's thin and thick ends (0 when uncoated or masked)."""
    if shop["coating"] == "none" or shop["mask_seat"]:
        return (0.0, 0.0)
    thin = shop["coating_thickness"]
    thick = shop["coating_thickness_max"] if shop["coating_thickness_max"] is not None else thin
    thick = max(thick, thin)  # an upside-down range fails its own check; the seat is sized for the thin end
    share = shop["coating_outward_share"]
    return (coating_growth_mm(thin, share), coating_growth_mm(thick, share))


def resolve(ctx: Context, p: Mapping[str, Any]) -> FeatureResult:
    bore, od, width = ctx["bearing.bore"], ctx["bearing.od"], ctx["bearing.width"]
    shop = ctx.shop
    derived: set[str] = set()
    growth = coating_growth(shop)
    seat = size_seat(SeatInputs(
        bearing_bore_mm=bore, bearing_od_mm=od,
        bore_deviation_um=ctx["bearing.bore_deviation_um"], od_deviation_um=ctx["bearing.od_deviation_um"],
        machine_tolerance_mm=shop["machine_tolerance"], fit_clearance_mm=shop["fit_clearance"],
        coating_growth_mm=growth[0], coating_growth_max_mm=growth[1],
        post_diameter_mm=p["post_diameter"], wall_bore_mm=p["wall_bore"],
    ))
    if p["post_diameter"] is None:
        derived.add("post_diameter")
    if p["wall_bore"] is None:
        derived.add("wall_bore")
    width_dev = ctx["bearing.width_deviation_um"]
    width_band = (width_dev[0] - width_dev[1]) / 1000
    offset_tol = pick(p, "wall_offset_tolerance", allocate_offset_tolerance(p["gap_tolerance"]), derived)
    post_tol = pick(p, "post_length_tolerance", offset_tol, derived)
    face = pick(p, "seat_face_diameter", math.floor((bore + SEAT_FACE_SHARE * (od - bore)) * 10 + 1e-9) / 10, derived)
    spacing, offset = p["spacing"], p["wall_offset"]
    seat_z = width / 2
    wall_z = seat_z - offset
    post_z = spacing / 2
    gap = 2 * wall_z
    post_d, wall_d = seat.post.nominal_mm, seat.wall.nominal_mm
    post_length = seat_z - post_z
    bearing = Link("bearing width", width, width_dev[0] / 1000, width_dev[1] / 1000)
    gap_stack = stack((bearing, Link("wall offset, this half", offset, offset_tol, -offset_tol, -1.0),
                       Link("wall offset, other half", offset, offset_tol, -offset_tol, -1.0)))
    spacing_stack = stack((bearing, Link("post length, this half", post_length, post_tol, -post_tol, -1.0),
                           Link("post length, other half", post_length, post_tol, -post_tol, -1.0)))
    turned_band = 2 * offset_tol  # what the two halves add to the gap, worst case
    dims = {
        "post_diameter": post_d, "post_tolerance": seat.post.tolerance_mm, "post_precoat_diameter": seat.post.precoat_mm,
        "wall_bore": wall_d, "wall_tolerance": seat.wall.tolerance_mm, "wall_precoat_bore": seat.wall.precoat_mm,
        "seat_face_diameter": face, "spacing": spacing, "wall_offset": offset,
        "seat_face_z": seat_z, "wall_face_z": wall_z, "post_face_z": post_z,
        "gap": gap, "post_length": post_length,
        "gap_tolerance": p["gap_tolerance"], "wall_offset_tolerance": offset_tol, "post_length_tolerance": post_tol,
        "gap_worst_min": gap_stack.worst_min_mm, "gap_worst_max": gap_stack.worst_max_mm,
        "gap_rss_min": gap_stack.rss_min_mm, "gap_rss_max": gap_stack.rss_max_mm,
        "spacing_worst_min": spacing_stack.worst_min_mm,
        "clearance_min": seat.post.clearance_min_mm, "clearance_max": seat.post.clearance_max_mm,
        "wall_clearance_min": seat.wall.clearance_min_mm, "wall_clearance_max": seat.wall.clearance_max_mm,
    }
    checks = (
        check("gap above zero", f"{NAME}.wall_offset", gap > 0, f"gap {gap:.4f} mm"),
        check("gap below bearing width", f"{NAME}.wall_offset", gap < width,
              f"gap {gap:.4f} mm against bearing width {width:.4f} mm (the wall face must stand ahead of the seat face)"),
        check("post shorter than the seat", f"{NAME}.spacing", post_z < seat_z,
              f"post length {seat_z - post_z:.4f} mm (spacing must be below the bearing width)"),
        check("gap held to its tolerance", f"{NAME}.wall_offset_tolerance", turned_band <= p["gap_tolerance"] + 1e-9,
              f"two wall offsets ±{offset_tol:.3f} mm add ±{turned_band:.3f} mm to the gap against ±{p['gap_tolerance']:.3f} mm; "
              f"with the bearing's {width_band * 1000:.0f} µm width band the gap is {gap_stack.worst_min_mm:.3f} "
              f"to {gap_stack.worst_max_mm:.3f} mm worst case"),
        check("wall offset tolerance holdable", f"{NAME}.wall_offset_tolerance",
              offset_tol >= shop["machine_tolerance"] - 1e-9,
              f"wall offset ±{offset_tol:.3f} mm; the lathe holds ±{shop['machine_tolerance']:.4f} mm"),
        check("posts stay apart", f"{NAME}.post_length_tolerance", spacing_stack.worst_min_mm > 0,
              f"post faces {spacing_stack.worst_min_mm:.3f} mm apart at the longest posts and narrowest bearing"),
        check("coating thickness range", "shop.coating_thickness_max",
              shop["coating_thickness_max"] is None or shop["coating_thickness_max"] >= shop["coating_thickness"],
              "the thick end must be at least coating_thickness"),
        check("post slides into the bearing", f"{NAME}.post_diameter", seat.post.clearance_min_mm >= -1e-9,
              f"worst-case clearance {seat.post.clearance_min_mm * 1000:.1f} µm (a negative value presses the bearing)"
              + (f", at the thickest coating (growth {growth[1] * 1000:.1f} µm)" if growth[1] > 0 else "")),
        check("outer race clears the wall", f"{NAME}.wall_bore", seat.wall.clearance_min_mm >= -1e-9,
              f"worst-case clearance {seat.wall.clearance_min_mm * 1000:.1f} µm"
              + (f", at the thickest coating (growth {growth[1] * 1000:.1f} µm)" if growth[1] > 0 else "")),
        check("seat face carries the inner race", f"{NAME}.seat_face_diameter", post_d < face < od,
              f"seat face Ø{face:.3f} mm must lie between the post Ø{post_d:.3f} mm and the bearing OD Ø{od:.3f} mm"),
    )
    chunks = {
        "wall": (V(wall_z, wall_d / 2),),
        "post": (V(seat_z, face / 2), V(seat_z, post_d / 2), V(post_z, post_d / 2)),
    }
    return FeatureResult(NAME, dims, frozenset(derived), chunks, checks, {"seat_fit": seat, "coating_growth": growth, "gap_stack": gap_stack, "spacing_stack": spacing_stack})
