"""The check summary: one JSON-ready dict with the keys of the `check --json` contract."""
from __future__ import annotations

import math
from typing import Any

from .analysis import analyse
from .builder import Resolved
from .features.ring import ring_summary
from .units import is_dimension

__all__ = ["summary", "resolved_dimensions", "back_wall_mm"]


def resolved_dimensions(resolved: Resolved) -> dict[str, dict[str, Any]]:
    """Every feature's resolved dimensions (mm; angles in degrees), with which were derived."""
    out: dict[str, dict[str, Any]] = {}
    for name, feature in resolved.features.items():
        rows = {}
        for key, value in feature.dims.items():
            if is_dimension(value) and key.endswith("angle"):
                rows[key + "_deg"] = round(math.degrees(value), 6)
            elif is_dimension(value):
                rows[key + "_mm"] = round(float(value), 6)
            else:
                rows[key] = value
        out[name] = {"dimensions": rows, "derived": sorted(feature.derived)}
    return out


def summary(resolved: Resolved, *, detail: bool = True) -> dict[str, Any]:
    """The `yodraft check --json` object (see the README for every key).

    ``detail=False`` leaves out the per-feature dimension tables and the check list
    (a sweep reads the failed checks off the resolved design itself).
    """
    v = resolved.values
    d = resolved.design
    fit = resolved.seat_fit
    return {
        "ok": resolved.ok,
        "design": {"name": d.name, "revision": d.revision, "title": d["design"]["title"], "source": d.source},
        "envelope": {"diameter_mm": v["envelope.diameter"], "width_mm": v["envelope.width"],
                     "target_mass_g": v["envelope.target_mass"],
                     "target_izz_g_mm2": v["envelope.target_izz"], "target_gap_mm": v["envelope.target_gap"]},
        "profile": {"outer_diameter_mm": v.get("profile.outer_diameter"), "width_mm": v.get("profile.width"),
                    "gap_mm": v["bearing_seat.gap"], "post_length_mm": v["bearing_seat.post_length"]},
        "bearing": {"designation": v["bearing.designation"], "bore_mm": v["bearing.bore"], "od_mm": v["bearing.od"],
                    "width_mm": v["bearing.width"], "precision": v["bearing.precision"],
                    "bore_deviation_um": list(v["bearing.bore_deviation_um"]),
                    "od_deviation_um": list(v["bearing.od_deviation_um"]),
                    "width_deviation_um": list(v["bearing.width_deviation_um"]), "chamfer_mm": v["bearing.chamfer"]},
        "bearing_seat": {
            "post_diameter_mm": fit.post.nominal_mm, "post_tolerance_mm": fit.post.tolerance_mm,
            "post_precoat_diameter_mm": fit.post.precoat_mm,
            "wall_bore_mm": fit.wall.nominal_mm, "wall_tolerance_mm": fit.wall.tolerance_mm,
            "wall_precoat_bore_mm": fit.wall.precoat_mm,
            "clearance_min_mm": fit.post.clearance_min_mm, "clearance_max_mm": fit.post.clearance_max_mm,
            "wall_clearance_min_mm": fit.wall.clearance_min_mm, "wall_clearance_max_mm": fit.wall.clearance_max_mm,
            "clearance_rss_min_mm": fit.post.rss_min_mm, "clearance_rss_max_mm": fit.post.rss_max_mm,
            "wall_clearance_rss_min_mm": fit.wall.rss_min_mm, "wall_clearance_rss_max_mm": fit.wall.rss_max_mm,
            "post_p_no_slide": fit.post.p_no_slide, "wall_p_no_slide": fit.wall.p_no_slide,
            "post_turn_tolerance_mm": fit.post.turn_tolerance_mm, "wall_turn_tolerance_mm": fit.wall.turn_tolerance_mm,
            "coating_growth_mm": fit.post.nominal_mm - fit.post.precoat_mm,
            "coating_growth_range_mm": list(resolved.features["bearing_seat"].extra["coating_growth"]),
            "masked": bool(d["shop"]["mask_seat"]),
            **_axial(resolved),
        },
        "material": {"name": v["material.name"], "designation": v["material.designation"],
                     "designation_source": v["material.designation_source"],
                     "density_g_cm3": v["material.density_g_cm3"]},
        "axle_bore": _hole(resolved),
        "shape": _shape_section(resolved),
        **_response_section(resolved),
        **_ring_section(resolved),
        **(_mass_sections(resolved) if resolved.can_analyse else {}),
        **({"features": resolved_dimensions(resolved),
            "checks": [c.as_dict() for c in resolved.checks]} if detail else {}),
    }


def back_wall_mm(resolved: Resolved) -> float:
    """Metal left on the axis between the tap drill's point and the hub face (or cup floor) behind it."""
    v = resolved.values
    behind = v["rim.flat_z"] + (v["rim.hub_height"] if v["rim.hub_diameter"] > 0 and v["rim.hub_height"] > 0 else 0.0)
    return behind - v["axle_bore.tip_z"]


def _hole(resolved: Resolved) -> dict[str, Any]:
    """The tapped axle hole as the shop makes it: thread, full-thread depth, tap drill and its depth, wall behind."""
    v = resolved.values
    return {"thread": f"{v['axle_bore.thread']}-{v['axle_bore.tolerance_class']}",
            "thread_depth_mm": v["axle_bore.thread_depth"], "tap_drill_mm": v["axle_bore.tap_drill"],
            "drill_depth_mm": v["axle_bore.drill_depth"], "drill_point_mm": v["axle_bore.tip_z"] - v["axle_bore.bottom_z"],
            "back_wall_mm": back_wall_mm(resolved), "min_wall_mm": resolved.design["shop"]["min_wall"]}


def _axial(resolved: Resolved) -> dict[str, Any]:
    """The axial stack: gap tolerance, its allocation, worst case and RSS; the seat depth from datum B."""
    v = resolved.values
    gap = resolved.features["bearing_seat"].extra["gap_stack"]
    out: dict[str, Any] = {
        "gap_tolerance_mm": v["bearing_seat.gap_tolerance"],
        "wall_offset_tolerance_mm": v["bearing_seat.wall_offset_tolerance"],
        "post_length_tolerance_mm": v["bearing_seat.post_length_tolerance"],
        "gap_worst_mm": list(gap.worst_mm), "gap_rss_mm": list(gap.rss_mm),
        "post_spacing_worst_min_mm": v["bearing_seat.spacing_worst_min"],
    }
    if "axial.seat_depth" in v:
        width = v["axial.width_stack"]
        out.update({"seat_depth_mm": v["axial.seat_depth"], "seat_depth_tolerance_mm": v["axial.seat_depth_tolerance"],
                    "width_worst_mm": list(width.worst_mm), "width_rss_mm": list(width.rss_mm)})
    return out


def _response_section(resolved: Resolved) -> dict[str, Any]:
    """``pads``: how far each pad stands proud of the wall face and the pads' distance across the gap;
    or ``recess`` when a silicone recess gives the response."""
    import math

    v = resolved.values
    volume = math.pi / 4 * (v["pad_groove.pad_diameter"] ** 2 - v["pad_groove.inner_diameter"] ** 2) * v["pad_groove.pad_thickness"]
    if v["pad_groove.response"] == "silicone":
        return {"recess": {"inner_diameter_mm": v["pad_groove.inner_diameter"], "outer_diameter_mm": v["pad_groove.outer_diameter"],
                           "width_mm": v["pad_groove.recess_width"], "depth_mm": v["pad_groove.depth"],
                           "silicone_density_g_cm3": v["pad_groove.silicone_density"],
                           "silicone_mass_g": v["pad_groove.silicone_density"] * volume / 1000}}
    pad = resolved.features["pad_groove"].extra["pad"]
    given = resolved.design["parts"]["pad_mass"]
    return {"pads": {"class": pad.name, "thickness_mm": v["pad_groove.pad_thickness"], "groove_depth_mm": v["pad_groove.depth"],
                     "proud_mm": v["pad_groove.proud"], "pad_to_pad_mm": v["pad_groove.pad_gap"],
                     "mass_g": given if given is not None else pad.pad_density_g_cm3 * volume / 1000}}


def _shape_section(resolved: Resolved) -> dict[str, Any]:
    """The outer shape's kind and the re-entrant regions that need a special tool."""
    from .checks import reentrant_regions

    regions = reentrant_regions(resolved.profile) if resolved.profile is not None else []
    return {"kind": resolved.values["shape.kind"],
            "reentrant": [{"z_min_mm": r.z_min, "z_max_mm": r.z_max, "diameter_min_mm": 2 * r.r_min,
                           "diameter_max_mm": 2 * r.r_max, "tool": r.tool} for r in regions]}


def _ring_section(resolved: Resolved) -> dict[str, Any]:
    fit = resolved.features["ring"].extra.get("press_fit") if "ring" in resolved.features else None
    return {} if fit is None else {"ring": ring_summary(fit)}


def _mass_sections(resolved: Resolved) -> dict[str, Any]:
    a = analyse(resolved)
    s, b = a.spin, a.balance
    return {
        "parts": [{"name": name, "material": material, "mass_g": props.mass_g, "izz_g_mm2": props.izz_g_mm2}
                  for name, material, props in a.parts],
        "mass": {
            "half_g": a.half.mass_g, "half_izz_g_mm2": a.half.izz_g_mm2, "half_ixx_g_mm2": a.half.ixx_g_mm2,
            "half_volume_mm3": a.half.volume_mm3, "half_surface_mm2": a.half.surface_mm2,
            "half_section_area_mm2": a.half.area_mm2, "half_z_centroid_mm": a.half.z_centroid_mm,
            "total_g": a.assembly.total_g, "izz_g_mm2": a.assembly.izz_g_mm2, "ixx_g_mm2": a.assembly.ixx_g_mm2,
            "target_g": resolved.values["envelope.target_mass"],
            "axle_length_mm": a.axle_length_mm,
            "budget": [{"part": line.name, "count": line.count, "each_g": line.mass_each_g, "total_g": line.mass_total_g}
                       for line in a.assembly.budget],
        },
        "spin": {
            "rpm": s.rpm, "radius_of_gyration_mm": s.radius_of_gyration_mm, "rim_cut_radius_mm": s.rim_cut_radius_mm,
            "rim_share": s.rim_share, "stability_ratio": s.stability_ratio,
            "descent_acceleration_m_s2": s.descent_acceleration_m_s2,
            "angular_momentum_kg_m2_per_s": s.angular_momentum_kg_m2_per_s, "kinetic_energy_j": s.kinetic_energy_j,
            "drag_torque_n_mm": s.drag_torque_n_mm, "spin_down_s": s.spin_down_s,
        },
        "balance": {
            "grade_mm_s": b.grade_mm_s, "rpm": b.rpm,
            "permissible_specific_unbalance_um": b.permissible_specific_unbalance_um,
            "permissible_unbalance_g_mm": b.permissible_unbalance_g_mm,
            "runout_tolerance_mm": b.runout_tolerance_mm,
            "unbalance_from_runout_g_mm": b.unbalance_from_runout_g_mm,
            "rim_band_mass_g": b.rim_band_mass_g, "rim_unbalance_from_runout_g_mm": b.rim_unbalance_from_runout_g_mm,
        },
    }
