"""Bearing seat: the post that carries the inner race, the seat face it sits on, and the bearing wall.

The seat face stands half a bearing width from the gap plane; the two posts'
faces stand ``spacing`` apart; the bearing wall's face stands ``wall_offset``
ahead of the seat face, so gap = bearing width − 2 × wall_offset.
"""
from __future__ import annotations

import math
from collections.abc import Mapping
from typing import Any

from ..checks import check
from ..params import ParamSpec
from ..tolerances.seat import SeatInputs, size_seat
from .base import Context, FeatureResult, V, pick

NAME = "bearing_seat"
PARAMS = (
    ParamSpec("post_diameter", "length", "finished post diameter; derived from the tolerance stack when absent", None, 0.5, 40.0),
    ParamSpec("wall_bore", "length", "finished bore of the bearing wall; derived from the stack when absent", None, 1.0, 60.0),
    ParamSpec("seat_face_diameter", "length", "outer diameter of the face the inner race sits on", None, 0.5, 60.0),
    ParamSpec("spacing", "length", "distance between the two halves' post faces", 1.0, 0.0, 10.0, lo_closed=True),
    ParamSpec("wall_offset", "length", "how far the bearing wall's face stands ahead of the seat face", 0.2, -5.0, 5.0),
)
#: the seat face reaches this share of the way from bore to outside diameter  # common practice, no published source
SEAT_FACE_SHARE = 0.3


def coating_growth(shop: Mapping[str, Any]) -> float:
    """Diametral growth of a coated seat surface in mm (0 when uncoated or masked)."""
    if shop["coating"] == "none" or shop["mask_seat"]:
        return 0.0
    return 2.0 * shop["coating_thickness"] * shop["coating_outward_share"]


def resolve(ctx: Context, p: Mapping[str, Any]) -> FeatureResult:
    bore, od, width = ctx["bearing.bore"], ctx["bearing.od"], ctx["bearing.width"]
    shop = ctx.shop
    derived: set[str] = set()
    seat = size_seat(SeatInputs(
        bearing_bore_mm=bore, bearing_od_mm=od,
        bore_deviation_um=ctx["bearing.bore_deviation_um"], od_deviation_um=ctx["bearing.od_deviation_um"],
        machine_tolerance_mm=shop["machine_tolerance"], fit_clearance_mm=shop["fit_clearance"],
        coating_growth_mm=coating_growth(shop),
        post_diameter_mm=p["post_diameter"], wall_bore_mm=p["wall_bore"],
    ))
    if p["post_diameter"] is None:
        derived.add("post_diameter")
    if p["wall_bore"] is None:
        derived.add("wall_bore")
    face = pick(p, "seat_face_diameter", math.floor((bore + SEAT_FACE_SHARE * (od - bore)) * 10 + 1e-9) / 10, derived)
    spacing, offset = p["spacing"], p["wall_offset"]
    seat_z = width / 2
    wall_z = seat_z - offset
    post_z = spacing / 2
    gap = 2 * wall_z
    post_d, wall_d = seat.post.nominal_mm, seat.wall.nominal_mm
    dims = {
        "post_diameter": post_d, "post_tolerance": seat.post.tolerance_mm, "post_precoat_diameter": seat.post.precoat_mm,
        "wall_bore": wall_d, "wall_tolerance": seat.wall.tolerance_mm, "wall_precoat_bore": seat.wall.precoat_mm,
        "seat_face_diameter": face, "spacing": spacing, "wall_offset": offset,
        "seat_face_z": seat_z, "wall_face_z": wall_z, "post_face_z": post_z,
        "gap": gap, "post_length": seat_z - post_z,
        "clearance_min": seat.post.clearance_min_mm, "clearance_max": seat.post.clearance_max_mm,
        "wall_clearance_min": seat.wall.clearance_min_mm, "wall_clearance_max": seat.wall.clearance_max_mm,
    }
    checks = (
        check("gap above zero", f"{NAME}.wall_offset", gap > 0, f"gap {gap:.4f} mm"),
        check("gap below bearing width", f"{NAME}.wall_offset", gap < width,
              f"gap {gap:.4f} mm against bearing width {width:.4f} mm (the wall face must stand ahead of the seat face)"),
        check("post shorter than the seat", f"{NAME}.spacing", post_z < seat_z,
              f"post length {seat_z - post_z:.4f} mm (spacing must be below the bearing width)"),
        check("post slides into the bearing", f"{NAME}.post_diameter", seat.post.clearance_min_mm >= -1e-9,
              f"worst-case clearance {seat.post.clearance_min_mm * 1000:.1f} µm (a negative value presses the bearing)"),
        check("outer race clears the wall", f"{NAME}.wall_bore", seat.wall.clearance_min_mm >= -1e-9,
              f"worst-case clearance {seat.wall.clearance_min_mm * 1000:.1f} µm"),
        check("seat face carries the inner race", f"{NAME}.seat_face_diameter", post_d < face < od,
              f"seat face Ø{face:.3f} mm must lie between the post Ø{post_d:.3f} mm and the bearing OD Ø{od:.3f} mm"),
    )
    chunks = {
        "wall": (V(wall_z, wall_d / 2),),
        "post": (V(seat_z, face / 2), V(seat_z, post_d / 2), V(post_z, post_d / 2)),
    }
    return FeatureResult(NAME, dims, frozenset(derived), chunks, checks, {"seat_fit": seat})
