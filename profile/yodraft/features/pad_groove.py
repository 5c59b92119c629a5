"""Response pad groove: the recess in the bearing wall's face that holds the response pad."""
from __future__ import annotations

from collections.abc import Mapping
from typing import Any

from ..catalog.pads import PAD_CLASSES, lookup_pad_class
from ..checks import check
from ..params import ParamSpec
from .base import Context, FeatureResult, V, pick

NAME = "pad_groove"
PARAMS = (
    ParamSpec("pad_class", "text", "pad class from the catalog; default the smallest that clears the bearing wall",
              None, choices=tuple(PAD_CLASSES)),
    ParamSpec("inner_diameter", "length", "groove inner diameter; default from the pad class", None, 1.0, 120.0),
    ParamSpec("outer_diameter", "length", "groove outer diameter; default pad diameter + squeeze", None, 1.0, 120.0),
    ParamSpec("depth", "length", "groove depth below the wall face; adjust this first if a pad sits badly", None, 0.0, 10.0),
)


def resolve(ctx: Context, p: Mapping[str, Any]) -> FeatureResult:
    derived: set[str] = set()
    least_id = ctx["bearing_seat.wall_bore"] + 2 * ctx.shop["min_wall"]
    if p["pad_class"] is None:
        fitting = [c for c in PAD_CLASSES.values() if c.groove_inner_diameter_mm >= least_id]
        pad = min(fitting, key=lambda c: c.pad_diameter_mm) if fitting else max(
            PAD_CLASSES.values(), key=lambda c: c.pad_diameter_mm)
        derived.add("pad_class")
    else:
        pad = lookup_pad_class(p["pad_class"])
    inner = pick(p, "inner_diameter", pad.groove_inner_diameter_mm, derived)
    outer = pick(p, "outer_diameter", pad.groove_outer_diameter_mm, derived)
    depth = pick(p, "depth", pad.groove_depth_mm, derived)
    face_z = ctx["bearing_seat.wall_face_z"]
    bottom_z = face_z + depth
    dims = {"pad_class": pad.name, "pad_diameter": pad.pad_diameter_mm, "inner_diameter": inner,
            "outer_diameter": outer, "depth": depth, "bottom_z": bottom_z, "face_z": face_z}
    checks = (
        check("pad fits the groove", f"{NAME}.outer_diameter", outer >= pad.pad_diameter_mm,
              f"groove Ø{inner:.2f}–Ø{outer:.2f} mm for a Ø{pad.pad_diameter_mm:g} mm pad"),
    )
    chunks = {"groove": (V(face_z, outer / 2), V(bottom_z, outer / 2), V(bottom_z, inner / 2), V(face_z, inner / 2))}
    return FeatureResult(NAME, dims, frozenset(derived), chunks, checks, {"pad": pad})
