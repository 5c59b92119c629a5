"""Catch zone: the conical inner face that leads the string into the gap, from its start to the rim.

It leaves the wall face at ``start_diameter`` and meets the outer diameter where
the rim's band begins. Give the rim band width or the angle and the other follows;
give both and they are checked against each other.
"""
from __future__ import annotations

import math
from collections.abc import Mapping
from typing import Any

from ..checks import check
from ..params import ParamSpec
from .base import Context, FeatureResult, V, pick

NAME = "catch_zone"
PARAMS = (
    ParamSpec("start_diameter", "length", "diameter where the catch zone leaves the wall face; default pad groove + 2 × land",
              None, 1.0, 150.0),
    ParamSpec("land", "length", "radial width of the flat face between pad groove and catch zone", 1.5, 0.0, 20.0, lo_closed=True),
    ParamSpec("angle", "angle", "angle of the catch zone from the gap plane; default follows from the rim band width",
              None, 0.0, math.radians(80)),
    ParamSpec("edge_radius", "length", "radius where the catch zone meets the outer diameter", 1.0, 0.0, 20.0, lo_closed=True),
)
DEFAULT_RIM_WIDTH = 8.0  # mm, when neither the rim width nor the angle is given  # common practice, no published source
ANGLE_AGREEMENT = math.radians(0.05)


def resolve(ctx: Context, p: Mapping[str, Any]) -> FeatureResult:
    derived: set[str] = set()
    start = pick(p, "start_diameter", ctx["pad_groove.outer_diameter"] + 2 * p["land"], derived)
    R = ctx["rim.diameter"] / 2
    face_z, wall_z = ctx["rim.face_z"], ctx["bearing_seat.wall_face_z"]
    run = R - start / 2
    given_width = ctx["rim.band_width"]
    checks = []
    if p["angle"] is not None and given_width is None:
        angle = p["angle"]
        end_z = wall_z + run * math.tan(angle)
        rim_width = face_z - end_z
    else:
        rim_width = DEFAULT_RIM_WIDTH if given_width is None else given_width
        end_z = face_z - rim_width
        angle = math.atan2(end_z - wall_z, run) if run > 0 else math.pi / 2
        derived.add("angle")
        if p["angle"] is not None:
            checks.append(check("catch zone angle agrees with rim band width", f"{NAME}.angle",
                                abs(angle - p["angle"]) <= ANGLE_AGREEMENT,
                                f"angle given {math.degrees(p['angle']):.2f}°, rim.band_width {rim_width:.3f} mm gives "
                                f"{math.degrees(angle):.2f}° (pin one of them)"))
    checks += [
        check("catch zone opens outward", f"{NAME}.angle", 0 < angle < math.radians(80),
              f"angle {math.degrees(angle):.2f}° (between 0° and 80° from the gap plane)"),
        check("rim band has width", "rim.band_width", rim_width > 0, f"rim band {rim_width:.3f} mm"),
    ]
    dims = {"start_diameter": start, "land": p["land"], "angle": angle, "end_z": end_z, "rim_width": rim_width,
            "edge_radius": p["edge_radius"]}
    chunks = {"surface": (V(end_z, R, p["edge_radius"], f"{NAME}.edge_radius"), V(wall_z, start / 2))}
    return FeatureResult(NAME, dims, frozenset(derived), chunks, tuple(checks))
