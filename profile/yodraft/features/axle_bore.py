"""Axle bore: the tapped hole on the axis that takes the axle, drilled from the post face."""
from __future__ import annotations

import math
from collections.abc import Mapping
from typing import Any

from ..catalog.threads import THREADS, lookup_thread
from ..checks import check
from ..params import ParamSpec
from .base import Context, FeatureResult, V, pick

NAME = "axle_bore"
PARAMS = (
    ParamSpec("thread", "text", "axle thread from the catalog", "M4x0.7", choices=tuple(THREADS)),
    ParamSpec("thread_depth", "length", "full-thread depth from the post face; default 2 × thread diameter, "
              "rounded up to 0.1 mm", None, 0.5, 60.0),
    ParamSpec("drill_depth", "length", "tap-drill depth (full diameter) from the post face; default thread depth + 3 pitches, "
              "rounded up to 0.1 mm",
              None, 0.5, 60.0),
)
DRILL_POINT_ANGLE = math.radians(118.0)  # common twist-drill point, from memory


def up_to_tenth(mm: float) -> float:
    """A derived depth as a print writes it: rounded up to 0.1 mm (one already on 0.1 mm stays as it is).

    >>> up_to_tenth(2 * 4.826), up_to_tenth(8.0 + 3 * 0.7)
    (9.7, 10.1)
    """
    tenths = mm * 10
    return mm if abs(tenths - round(tenths)) < 1e-6 else math.ceil(tenths) / 10


def resolve(ctx: Context, p: Mapping[str, Any]) -> FeatureResult:
    thread = lookup_thread(p["thread"])
    derived: set[str] = set()
    depth = pick(p, "thread_depth", up_to_tenth(2.0 * thread.major_mm), derived)
    drill = pick(p, "drill_depth", up_to_tenth(depth + 3 * thread.pitch_mm), derived)
    z0 = ctx["bearing_seat.post_face_z"]
    r = thread.tap_drill_mm / 2
    bottom_z = z0 + drill
    tip_z = bottom_z + r / math.tan(DRILL_POINT_ANGLE / 2)
    factor = ctx["material.engagement_factor"]
    need = factor * thread.major_mm
    dims = {"thread": thread.name, "major_diameter": thread.major_mm, "pitch": thread.pitch_mm,
            "minor_diameter": thread.minor_mm, "tap_drill": thread.tap_drill_mm, "tolerance_class": thread.tolerance_class,
            "thread_depth": depth, "drill_depth": drill, "bottom_z": bottom_z, "tip_z": tip_z}
    checks = (
        check("thread engagement", f"{NAME}.thread_depth", depth >= need - 1e-9,
              f"full thread {depth:.2f} mm, needs at least {need:.2f} mm ({factor:g} × Ø{thread.major_mm:g} in "
              f"{ctx['material.name']})"),
        check("axle reaches both halves", f"{NAME}.thread_depth", depth > thread.pitch_mm,
              f"full thread {depth:.2f} mm; the axle stops a pitch ({thread.pitch_mm:g} mm) short of it"),
        check("drill deeper than thread", f"{NAME}.drill_depth", drill >= depth + 2 * thread.pitch_mm - 1e-9,
              f"drill {drill:.2f} mm, thread {depth:.2f} mm (at least two pitches of run-out)"),
    )
    chunks = {"bore": (V(z0, r), V(bottom_z, r), V(tip_z, 0.0))}
    return FeatureResult(NAME, dims, frozenset(derived), chunks, checks, {"thread": thread})
