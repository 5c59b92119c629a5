"""Plain-text views of a resolved design for the terminal."""
from __future__ import annotations

import math

from .builder import Resolved
from .catalog.finishes import seat_turned_finished
from .units import MM_PER_INCH, is_dimension

__all__ = ["check_text", "mass_lines", "failed_lines", "fit_text", "ring_lines"]


def _fmt(key: str, value: object) -> str:
    if value is None:  # not given, and left for a later feature to settle (as the report writes it)
        return "—"
    if is_dimension(value) and key.endswith("angle"):
        return f"{math.degrees(value):.2f}°"
    if is_dimension(value):
        return f"{value:.4f} mm"
    return str(value)


def failed_lines(resolved: Resolved) -> list[str]:
    """One line per failed check: feature.parameter, the check's name and why."""
    return [f"FAILED {c.feature}.{c.parameter}: {c.name}: {c.message}" for c in resolved.failed]


def mass_lines(resolved: Resolved) -> list[str]:
    """The predicted mass and spin inertia, or why they cannot be worked out."""
    if not resolved.can_analyse:
        return ["mass: not worked out (the half does not close into a valid profile; see the failed checks)", ""]
    from .analysis import mass_and_spin

    m = mass_and_spin(resolved)
    target = resolved.design["envelope"]["target_mass"]
    aim = f" (target {target:.1f} g, {m.assembly.total_g - target:+.1f} g)" if target else ""
    return [f"mass: assembled {m.assembly.total_g:.2f} g{aim}, one half {m.half.mass_g:.2f} g; "
            f"Izz {m.assembly.izz_g_mm2:.0f} g·mm², Ixx {m.assembly.ixx_g_mm2:.0f} g·mm²; "
            f"rim share {m.spin.rim_share:.1%}", ""]


def ring_lines(resolved: Resolved) -> list[str]:
    """The press-fit ring's figures (when the half has one): the two fit sizes, interference over the service
    temperatures, contact pressure, safety factor, hold and the assembly temperature difference."""
    fit = resolved.features["ring"].extra.get("press_fit") if "ring" in resolved.features else None
    if fit is None:
        return []
    def dev(lim) -> str:  # type: ignore[no-untyped-def]
        return "/".join("0" if abs(x) < 1e-9 else f"{x:+g}" for x in (lim.upper_um, lim.lower_um)) + " µm"
    lo, hi = fit.interference_um
    sf = f"{fit.safety_factor:.2f}" if math.isfinite(fit.safety_factor) else "no stress"
    return [f"ring {fit.material.name} in the {fit.seat} of the {fit.body_material.name} body, fit "
            f"{fit.fit_text if fit.fit is not None else 'explicit limits'} at Ø{fit.interface_mm:.3f}: ring "
            f"{dev(fit.ring_limits)}, seat {dev(fit.seat_limits)}",
            f"  interference {lo:.1f} to {hi:.1f} µm at 20 °C, {fit.interference_hot_um[0]:.1f} to "
            f"{fit.interference_hot_um[1]:.1f} µm at {fit.hot_c:g} °C, {fit.interference_cold_um[0]:.1f} to "
            f"{fit.interference_cold_um[1]:.1f} µm at {fit.cold_c:g} °C; contact pressure "
            f"{fit.contact_pressure_mpa[0]:.1f} to {fit.contact_pressure_mpa[1]:.1f} MPa",
            f"  safety factor {sf} (yield over von Mises, Lamé); holds {fit.hold_force_n:.0f} N and "
            f"{fit.hold_torque_n_mm / 1000:.2f} N·m; assembly: {fit.heated_or_cooled()} by ΔT "
            f"{fit.assembly_delta_t_k:.0f} K"]


def check_text(resolved: Resolved) -> str:
    """Resolved dimensions, the bearing-seat fit and every check, for a terminal."""
    d, v = resolved.design, resolved.values
    lines = [f"{d.name} rev {d.revision}" + (f" — {d['design']['title']}" if d["design"]["title"] else ""),
             f"bearing {v['bearing.designation']} {v['bearing.bore']:.3f} × {v['bearing.od']:.3f} × "
             f"{v['bearing.width']:.4f} mm, {v['bearing.precision']}; material {v['material.name']} "
             f"({v['material.density_g_cm3']:.2f} g/cm³)", ""]
    fit = resolved.seat_fit
    why = seat_turned_finished(d["shop"])  # why the seat is turned to its finished sizes, if it is
    lines.append("bearing seat fit (finished sizes" + (f"; {why})" if why else ")"))
    for label, part in (("post", fit.post), ("wall bore", fit.wall)):
        precoat = "" if why else f"turn to Ø{part.precoat_mm:.4f} ± {part.turn_tolerance_mm:.4f} before coating  "
        lines.append(f"  {label:<10} Ø{part.nominal_mm:.4f} ± {part.tolerance_mm:.4f} mm "
                     f"[{part.nominal_mm / MM_PER_INCH:.4f} ± {part.tolerance_mm / MM_PER_INCH:.4f} in]  {precoat}"
                     f"clearance {part.clearance_min_mm * 1000:.1f} to {part.clearance_max_mm * 1000:.1f} µm worst case, "
                     f"{part.rss_min_mm * 1000:.1f} to {part.rss_max_mm * 1000:.1f} µm RSS, "
                     f"P(no slide) {part.p_no_slide:.2g}")
    gap = resolved.features["bearing_seat"].extra["gap_stack"]
    lines.append(f"gap {v['bearing_seat.gap']:.3f} mm, halves add ± {v['bearing_seat.gap_tolerance']:.3f} mm "
                 f"(wall offset {v['bearing_seat.wall_offset']:.3f} ± {v['bearing_seat.wall_offset_tolerance']:.3f} mm each; "
                 f"post length {v['bearing_seat.post_length']:.3f} ± {v['bearing_seat.post_length_tolerance']:.3f} mm); "
                 f"with the bearing width {v['bearing.width_deviation_um'][0]:+g}/{v['bearing.width_deviation_um'][1]:+g} µm: "
                 f"{gap.worst_min_mm:.3f} to {gap.worst_max_mm:.3f} mm worst case, "
                 f"{gap.rss_min_mm:.3f} to {gap.rss_max_mm:.3f} mm RSS")
    if "axial.seat_depth" in v:
        width = v["axial.width_stack"]
        lines.append(f"seat face {v['axial.seat_depth']:.3f} ± {v['axial.seat_depth_tolerance']:.3f} mm below outer face B; "
                     f"assembled width {width.worst_min_mm:.3f} to {width.worst_max_mm:.3f} mm worst case, "
                     f"{width.rss_min_mm:.3f} to {width.rss_max_mm:.3f} mm RSS")
    lines += ring_lines(resolved)
    lines.append("")
    lines += mass_lines(resolved)
    lines.append("resolved dimensions (* derived)")
    for name, feature in resolved.features.items():
        lines.append(f"  {name}")
        for key, value in feature.dims.items():
            mark = "*" if key in feature.derived else " "
            lines.append(f"    {mark} {key:<24} {_fmt(key, value)}")
    lines.append("")
    passed = sum(c.ok for c in resolved.checks)
    lines.append(f"checks: {passed} of {len(resolved.checks)} passed")
    for c in resolved.checks:
        lines.append(f"  {'ok  ' if c.ok else 'FAIL'} {c.name} [{c.feature}.{c.parameter}] {c.message}")
    return "\n".join(lines)


def fit_text(fit: dict) -> str:
    """An ISO 286 fit as a few lines: each part's deviations and limits, then the clearance range."""
    lines = [f"fit {fit['code']}"]
    for label in ("hole", "shaft"):
        part = fit[label]
        if part:
            lines.append(f"  {label:<5} {part['code']:<4} {part['upper_um']:+g} / {part['lower_um']:+g} µm   "
                         f"Ø{part['min_mm']:.4f} to Ø{part['max_mm']:.4f} mm "
                         f"[{part['min_mm'] / MM_PER_INCH:.5f} to {part['max_mm'] / MM_PER_INCH:.5f} in]")
    if fit["clearance_min_um"] is not None:
        lines.append(f"  clearance {fit['clearance_min_um']:+g} to {fit['clearance_max_um']:+g} µm ({fit['kind']} fit; "
                     "negative is interference)")
    return "\n".join(lines)
