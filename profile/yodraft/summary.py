"""The check summary: one JSON-ready dict with the keys of the `check --json` contract."""
from __future__ import annotations

import math
from typing import Any

from .builder import Resolved

__all__ = ["summary", "resolved_dimensions"]


def resolved_dimensions(resolved: Resolved) -> dict[str, dict[str, Any]]:
    """Every feature's resolved dimensions (mm; angles in degrees), with which were derived."""
    out: dict[str, dict[str, Any]] = {}
    for name, feature in resolved.features.items():
        rows = {}
        for key, value in feature.dims.items():
            if isinstance(value, float) and key.endswith("angle"):
                rows[key + "_deg"] = round(math.degrees(value), 6)
            elif isinstance(value, float):
                rows[key + "_mm"] = round(value, 6)
            else:
                rows[key] = value
        out[name] = {"dimensions": rows, "derived": sorted(feature.derived)}
    return out


def summary(resolved: Resolved) -> dict[str, Any]:
    """The `yodraft check --json` object (see the README for every key)."""
    v = resolved.values
    d = resolved.design
    fit = resolved.features["bearing_seat"].extra["seat_fit"]
    return {
        "ok": resolved.ok,
        "design": {"name": d.name, "revision": d.revision, "title": d["design"]["title"], "source": d.source},
        "envelope": {"diameter_mm": v["envelope.diameter"], "width_mm": v["envelope.width"],
                     "target_mass_g": v["envelope.target_mass"]},
        "profile": {"outer_diameter_mm": v.get("profile.outer_diameter"), "width_mm": v.get("profile.width"),
                    "gap_mm": v["bearing_seat.gap"], "post_length_mm": v["bearing_seat.post_length"]},
        "bearing": {"designation": v["bearing.designation"], "bore_mm": v["bearing.bore"], "od_mm": v["bearing.od"],
                    "width_mm": v["bearing.width"], "precision": v["bearing.precision"],
                    "bore_deviation_um": list(v["bearing.bore_deviation_um"]),
                    "od_deviation_um": list(v["bearing.od_deviation_um"])},
        "bearing_seat": {
            "post_diameter_mm": fit.post.nominal_mm, "post_tolerance_mm": fit.post.tolerance_mm,
            "post_precoat_diameter_mm": fit.post.precoat_mm,
            "wall_bore_mm": fit.wall.nominal_mm, "wall_tolerance_mm": fit.wall.tolerance_mm,
            "wall_precoat_bore_mm": fit.wall.precoat_mm,
            "clearance_min_mm": fit.post.clearance_min_mm, "clearance_max_mm": fit.post.clearance_max_mm,
            "wall_clearance_min_mm": fit.wall.clearance_min_mm, "wall_clearance_max_mm": fit.wall.clearance_max_mm,
        },
        "material": {"name": v["material.name"], "density_g_cm3": v["material.density_g_cm3"]},
        "features": resolved_dimensions(resolved),
        "checks": [c.as_dict() for c in resolved.checks],
    }
