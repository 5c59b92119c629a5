"""Vent groove: the air-release groove between the seat face and the bearing wall."""
from __future__ import annotations

from collections.abc import Mapping
from typing import Any

from ..params import ParamSpec
from .base import Context, FeatureResult, V

NAME = "vent_groove"
PARAMS = (
    ParamSpec("depth", "length", "depth of the groove below the seat face", 1.5, 0.0, 20.0),
)


def resolve(ctx: Context, p: Mapping[str, Any]) -> FeatureResult:
    inner = ctx["bearing_seat.seat_face_diameter"]
    outer = ctx["bearing_seat.wall_bore"]
    bottom_z = ctx["bearing_seat.seat_face_z"] + p["depth"]
    dims = {"depth": p["depth"], "inner_diameter": inner, "outer_diameter": outer, "bottom_z": bottom_z,
            "width": (outer - inner) / 2}
    checks = ()  # its radial order is judged with the others in checks.radial_order
    chunks = {"groove": (V(bottom_z, outer / 2), V(bottom_z, inner / 2))}
    return FeatureResult(NAME, dims, frozenset(), chunks, checks)
