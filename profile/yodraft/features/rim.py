"""Rim and cup: the outer band that carries most of the spin inertia, and the recess behind it.

The outer face stands at half the overall width; the cup is turned into it,
leaving a rim ``thickness`` wide at the outer diameter and an optional hub on the axis.
"""
from __future__ import annotations

import math
from collections.abc import Mapping
from typing import Any

from ..checks import check
from ..params import ParamSpec
from .base import Context, FeatureResult, V, pick

NAME = "rim"
PARAMS = (
    ParamSpec("diameter", "length", "outer diameter; default the envelope diameter", None, 10.0, 150.0),
    ParamSpec("overall_width", "length", "assembled overall width; default the envelope width", None, 5.0, 150.0),
    ParamSpec("band_width", "length", "axial length of the outer-diameter band; default 8 mm unless the catch-zone angle is given",
              None, 0.0, 60.0, former="width"),
    ParamSpec("thickness", "length", "radial thickness of the rim at the outer face (outer diameter to cup wall)", 4.0, 0.0, 60.0),
    ParamSpec("cup_depth", "length", "depth of the cup below the outer face; default leaves 2 mm behind the axle bore",
              None, 0.0, 60.0, lo_closed=True),
    ParamSpec("floor_angle", "angle", "cone angle of the cup floor from the gap plane, so the floor follows the catch zone (0: flat)",
              0.0, 0.0, 1.4, lo_closed=True),
    ParamSpec("floor_diameter", "length", "diameter where the coned cup floor turns flat; default the pad groove's outer diameter",
              None, 0.0, 150.0, lo_closed=True),
    ParamSpec("hub_diameter", "length", "diameter of the hub in the cup (0: no hub)", 0.0, 0.0, 100.0, lo_closed=True),
    ParamSpec("hub_height", "length", "height of the hub above the cup floor", 0.0, 0.0, 60.0, lo_closed=True),
    ParamSpec("edge_radius", "length", "radius of the outer edge (outer diameter to outer face)", 1.5, 0.0, 20.0, lo_closed=True),
    ParamSpec("lip_radius", "length", "radius of the cup lip (outer face to cup wall)", 0.5, 0.0, 20.0, lo_closed=True),
    ParamSpec("cup_radius", "length", "radius where the cup wall meets the cup floor", 1.0, 0.0, 20.0, lo_closed=True),
)
BACK_WALL = 2.0  # default material left behind the axle bore's drill point, mm  # common practice, no published source


def resolve(ctx: Context, p: Mapping[str, Any]) -> FeatureResult:
    derived: set[str] = set()
    diameter = pick(p, "diameter", ctx["envelope.diameter"], derived)
    overall = pick(p, "overall_width", ctx["envelope.width"], derived)
    face_z = overall / 2
    cup_depth = pick(p, "cup_depth", max(0.0, face_z - ctx["axle_bore.tip_z"] - BACK_WALL), derived)
    R = diameter / 2
    cup_r = R - p["thickness"]
    floor_z = face_z - cup_depth
    flat_r = pick(p, "floor_diameter", ctx["pad_groove.outer_diameter"], derived) / 2
    flat_z = floor_z - max(0.0, cup_r - flat_r) * math.tan(p["floor_angle"])
    hub_r, hub_h = p["hub_diameter"] / 2, p["hub_height"]
    dims = {"diameter": diameter, "overall_width": overall, "face_z": face_z, "band_width": p["band_width"],
            "thickness": p["thickness"], "cup_diameter": 2 * cup_r, "cup_depth": cup_depth, "floor_z": floor_z,
            "floor_angle": p["floor_angle"], "floor_diameter": 2 * flat_r, "flat_z": flat_z,
            "hub_diameter": 2 * hub_r, "hub_height": hub_h, "hub_face_z": flat_z + hub_h, "edge_radius": p["edge_radius"],
            "lip_radius": p["lip_radius"], "cup_radius": p["cup_radius"]}
    checks = (
        check("cup inside the rim", f"{NAME}.thickness", 0 < cup_r < R, f"cup Ø{2 * cup_r:.2f} mm in a Ø{diameter:.2f} mm rim"),
        check("hub inside the cup", f"{NAME}.hub_diameter", hub_r < cup_r, f"hub Ø{2 * hub_r:.2f} mm, cup Ø{2 * cup_r:.2f} mm"),
        check("hub given whole", f"{NAME}.hub_height", (hub_r > 0) == (hub_h > 0),
              f"hub Ø{2 * hub_r:.2f} mm, {hub_h:.2f} mm high: give both a diameter and a height, or neither"),
        check("hub below the outer face", f"{NAME}.hub_height", flat_z + hub_h <= face_z + 1e-9,
              f"hub top at z = {flat_z + hub_h:.2f} mm, outer face at z = {face_z:.2f} mm"),
        check("flat floor inside the cup", f"{NAME}.floor_diameter", hub_r <= flat_r <= cup_r,
              f"flat floor to Ø{2 * flat_r:.2f} mm between hub Ø{2 * hub_r:.2f} and cup Ø{2 * cup_r:.2f} mm"),
    )
    if hub_r > 0 and hub_h > 0:  # a boss solid to the axis is as thick as its diameter, which the wall checks miss
        least = ctx.shop["min_wall"]
        checks += (check("hub as thick as the least wall", f"{NAME}.hub_diameter", 2 * hub_r >= least - 1e-9,
                         f"hub Ø{2 * hub_r:.3f} mm, least wall {least:.3f} mm"),)
    corners = [V(flat_z, flat_r),
               V(floor_z, cup_r, p["cup_radius"], f"{NAME}.cup_radius"),
               V(face_z, cup_r, p["lip_radius"], f"{NAME}.lip_radius"),
               V(face_z, R, p["edge_radius"], f"{NAME}.edge_radius")]
    if hub_r > 0 and hub_h > 0:
        top = flat_z + hub_h
        corners = [V(top, 0.0), V(top, hub_r), V(flat_z, hub_r, p["cup_radius"], f"{NAME}.cup_radius")] + corners
    else:
        corners = [V(flat_z, 0.0)] + corners
    return FeatureResult(NAME, dims, frozenset(derived), {"outer": tuple(corners)}, checks)
