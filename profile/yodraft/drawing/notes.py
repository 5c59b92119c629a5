"""The words on the sheet: fits with limits, coating, edges, finish, runout basis and cautions."""
from __future__ import annotations

from dataclasses import dataclass

from ..builder import Resolved
from ..units import MM_PER_INCH as IN

__all__ = ["SheetData", "fit_lines", "shop_lines", "caution_lines", "IN"]


@dataclass(frozen=True)
class SheetData:
    """Values the sheet shows that come from the analysis, not from the resolved design.

    ``half_mass_g``: computed mass of one half body; ``runout_mm``: circular runout
    of rim and bearing seat relative to datum A (axle axis), from the balance grade;
    ``balance_grade``: the ISO 21940-11 grade G it came from.
    """

    half_mass_g: float
    runout_mm: float
    balance_grade: float
    spin_rate_rpm: float


def _mm_in(value_mm: float, digits_mm: int = 5, digits_in: int = 5) -> str:
    return f"{value_mm:.{digits_mm}f} mm [{value_mm / IN:.{digits_in}f} in]"


def fit_lines(resolved: Resolved) -> list[str]:
    """Each seat fit: limits in mm and inch, worst-case and statistical clearance."""
    fit = resolved.seat_fit
    v = resolved.values
    out = []
    for label, f, race in (("Post", fit.post, "bearing bore"), ("Wall bore", fit.wall, "bearing OD")):
        out.append(f"{label} Ø max {_mm_in(f.max_mm)}, min {_mm_in(f.min_mm)}")
        out.append(f"   clearance to {race} {f.clearance_min_mm * 1000:.1f}…{f.clearance_max_mm * 1000:.1f} µm "
                   f"worst case, {f.rss_min_mm * 1000:.1f}…{f.rss_max_mm * 1000:.1f} µm RSS")
    gap = resolved.features["bearing_seat"].extra["gap_stack"]
    out.append(f"Gap {v['bearing_seat.gap']:.3f} ±{v['bearing_seat.gap_tolerance']:.3f} from the halves (wall offset "
               f"±{v['bearing_seat.wall_offset_tolerance']:.3f}, post length ±{v['bearing_seat.post_length_tolerance']:.3f} "
               f"from the seat face); with bearing width: {gap.worst_min_mm:.3f}…{gap.worst_max_mm:.3f} worst case, "
               f"{gap.rss_min_mm:.3f}…{gap.rss_max_mm:.3f} RSS")
    out.append(f"Bearing {v['bearing.designation']} {v['bearing.precision']}: bore Ø{v['bearing.bore']:.4f}, "
               f"OD Ø{v['bearing.od']:.4f}, width {v['bearing.width']:.4f} mm")
    return out


def shop_lines(resolved: Resolved, data: SheetData) -> list[str]:
    """Coating, edge breaks, seat finish, thread and runout basis."""
    shop = resolved.design["shop"]
    fit = resolved.seat_fit
    out = []
    if shop["coating"] == "none":
        out.append("Finish: none. Seat sizes are finished sizes.")
    elif shop["mask_seat"]:
        out.append(f"Finish: {shop['coating']}, {shop['coating_thickness'] * 1000:.1f} µm. MASK post, seat face and "
                   "wall bore; seat sizes are finished sizes.")
    else:
        out.append(f"Finish: {shop['coating']}, {shop['coating_thickness'] * 1000:.1f} µm. Sizes shown are AFTER coating.")
        out.append(f"   Turn before coating: post Ø{fit.post.precoat_mm:.5f} ±{fit.post.tolerance_mm:.5f}, "
                   f"wall bore Ø{fit.wall.precoat_mm:.5f} ±{fit.wall.tolerance_mm:.5f}")
    brk = shop["break_edges"]
    out.append(f"Unmarked edges ISO 13715: external -{brk:g}, internal +{brk:g} (break, no sharp edges)")
    out.append(f"Bearing seat (post, seat face, wall bore) Ra {shop['seat_roughness']:g} µm; elsewhere Ra 3.2 µm")
    out.append(f"Runout {data.runout_mm:.3f} mm to datum A: balance grade G{data.balance_grade:g} "
               f"(ISO 21940-11) at {data.spin_rate_rpm:g} rpm for a {data.half_mass_g:.1f} g half")
    if resolved.profile is not None:
        from ..checks import reentrant_regions

        for region in reentrant_regions(resolved.profile):
            out.append(f"Undercut: {region.describe()}")
    out.append(f"General tolerance {shop['general_tolerance']}. Dimensions in mm.")
    return out


def caution_lines() -> list[str]:
    """The cautions every sheet carries."""
    return [
        "Prototype and verify fit, gap and balance before a production run.",
        "Sold to children: meet small-parts and toy-safety rules of the market.",
        "Follow shop safety practice; local codes and qualified practice take precedence.",
    ]
