"""The words on the sheet: fits with limits, coating, edges, finish, runout basis and cautions."""
from __future__ import annotations

from dataclasses import dataclass

import math

from ..builder import Resolved
from ..catalog.finishes import callout, seat_turned_finished
from ..summary import back_wall_mm
from ..tolerances.seat import DiameterFit
from ..units import MM_PER_INCH as IN
from .numbers import deviation_text, limits_um, size_text

__all__ = ["SheetData", "fit_lines", "shop_lines", "material_line", "caution_lines", "numbered", "sheet_number", "seat_corner_passing_mm",
           "thread_designation", "IN"]


def sheet_number(resolved: Resolved, part: str = "") -> str:
    """The sheet ``part`` (a ring's name; the half's when empty) is in the half's drawing: the half is sheet 1,
    then one sheet for each further part, e.g. ``"2/2"``."""
    names = [p.name for p in resolved.parts[1:]]
    return f"{names.index(part) + 2 if part else 1}/{len(names) + 1}"


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


def _limits(f: DiameterFit, inch: bool) -> str:
    """A finished diameter to the µm: basic size, deviations and its two limits (inch in brackets)."""
    basic, upper, lower = limits_um(f.nominal_mm, f.tolerance_mm)
    text = f"Ø{size_text(basic)} {deviation_text(upper, lower)}"
    if inch:
        text += f" [{f.nominal_mm / IN:.5f} ±{f.tolerance_mm / IN:.5f} in]"
    return text


def seat_corner_passing_mm(resolved: Resolved) -> float:
    """The most passing (a fillet left in the corner) the post/seat-face corner may carry: half the
    inner ring's smallest chamfer, to 0.01 mm, and 0 for a ring of unknown chamfer."""
    return math.floor(resolved["bearing.chamfer"] / 2 * 100 + 1e-9) / 100


def thread_designation(resolved: Resolved) -> str:
    """The axle thread with its tolerance class and full-thread depth, e.g. ``M4×0.7-6H ↧8``."""
    d = resolved.features["axle_bore"].dims
    return f"{str(d['thread']).replace('x', '×')}-{d['tolerance_class']} ↧{size_text(d['thread_depth'])}"


def numbered(groups: list[tuple[str, list[str]]]) -> list[tuple[str, list[str]]]:
    """The note groups with every note numbered on through the groups ("1. …"), so a shop can cite "note 4";
    a line starting with spaces continues the note above it.

    >>> numbered([("Fits", ["Post", "   clearance"]), ("Shop", ["Finish"])])
    [('Fits', ['1. Post', '   clearance']), ('Shop', ['2. Finish'])]
    """
    n = 0
    out = []
    for title, lines in groups:
        body = []
        for line in lines:
            if line.startswith(" "):
                body.append(line)
            else:
                n += 1
                body.append(f"{n}. {line}")
        out.append((title, body))
    return out


def fit_lines(resolved: Resolved) -> list[str]:
    """Each seat fit to the µm (inch in brackets for an inch bearing) with its clearance; the bearing; the gap."""
    fit = resolved.seat_fit
    v = resolved.values
    inch = bool(v["bearing.inch"])
    out = []
    for label, f in (("Post", fit.post), ("Wall bore", fit.wall)):
        out.append(f"{label} {_limits(f, inch)}: clearance {f.clearance_min_mm * 1000:.1f}…"
                   f"{f.clearance_max_mm * 1000:.1f} µm (RSS {f.rss_min_mm * 1000:.1f}…{f.rss_max_mm * 1000:.1f})")
    dims = f"{size_text(v['bearing.bore'])} × {size_text(v['bearing.od'])} × {size_text(v['bearing.width'])}"
    if inch:
        dims += f" [{v['bearing.bore'] / IN:.4f} × {v['bearing.od'] / IN:.4f} × {v['bearing.width'] / IN:.4f} in]"
    out.append(f"Bearing {v['bearing.designation']} {v['bearing.precision']}, {dims}")
    gap = resolved.features["bearing_seat"].extra["gap_stack"]
    out.append(f"Gap {size_text(v['bearing_seat.gap'])} ±{size_text(v['bearing_seat.gap_tolerance'])} from the halves; "
               f"with bearing width {size_text(gap.worst_min_mm)}…{size_text(gap.worst_max_mm)} "
               f"(RSS {size_text(gap.rss_min_mm)}…{size_text(gap.rss_max_mm)})")
    ring = resolved.features["ring"].extra.get("press_fit") if "ring" in resolved.features else None
    if ring is not None and len(resolved.parts) > 1:
        lo, hi = ring.interference_um
        sheet = sheet_number(resolved, resolved.parts[1].name)
        out.append(f"Ring: see sheet {sheet}; interference {lo / 1000:.3f}…{hi / 1000:.3f}, "
                   f"{ring.heated_or_cooled()} by ΔT {ring.assembly_delta_t_k:.0f} K; faced flush with the face "
                   "after pressing" + (f", then its R{size_text(v['ring.edge_radius'])} edge turned"
                                       if v["ring.edge_radius"] > 0 else ""))
        if ring.seat == "outer diameter":  # the ring's outside is the rim: one cut over both parts makes it true
            out.append(f"Rim Ø{size_text(ring.ring_diameters_mm[1])} finish-turned over ring and body after the "
                       "ring is pressed")
    return out


def material_line(name: str, designation: str, source: str) -> str:
    """The material as ordered: its catalog name, its standard designation and that standard, each said once.

    >>> material_line("6061-T6", "EN AW-6061-T6", "EN 573-3 (alloy), EN 515 (temper) (from memory)")
    'Material 6061-T6 = EN AW-6061-T6 (EN 573-3)'
    >>> material_line("Ti-6Al-4V", "Ti-6Al-4V, ASTM B348 Grade 5", "ASTM B348 (from memory)")
    'Material Ti-6Al-4V, ASTM B348 Grade 5'
    """
    if not designation or designation == name:
        return f"Material {name}"
    standard = source.split(" (")[0].split(";")[0]
    named = designation if designation.startswith(name) else f"{name} = {designation}"
    return f"Material {named}" + ("" if standard in designation else f" ({standard})")


def shop_lines(resolved: Resolved, data: SheetData) -> list[str]:
    """Coating, edges, the axle hole, seat finish, runout basis and general tolerance."""
    shop = resolved.design["shop"]
    fit = resolved.seat_fit
    out = []
    if resolved["material.designation"] and resolved["material.designation"] != resolved["material.name"]:
        out.append(material_line(resolved["material.name"], resolved["material.designation"],
                                 resolved["material.designation_source"]))
    thin = shop["coating_thickness"]
    thick = shop["coating_thickness_max"] if shop["coating_thickness_max"] is not None else thin
    thickness = (f"{thin * 1000:.1f}…{thick * 1000:.1f} µm [{thin / IN:.4f}…{thick / IN:.4f} in]" if thick > thin
                 else f"{thin * 1000:.1f} µm")
    finish, why = callout(shop["coating"]), seat_turned_finished(shop)
    if why == "uncoated":
        out.append("Finish: none; seat sizes are finished sizes")
    elif why == "no build-up":  # passivation, blasting: the sizes are turned as drawn
        out.append(f"Finish: {finish}, no build-up; seat sizes are finished sizes")
    elif why == "seat masked":
        out.append(f"Finish: {finish}, {thickness}; MASK post, seat face and wall bore")
    else:
        out.append(f"Finish: {finish}, {thickness}; seat sizes AFTER coating: turn post "
                   f"Ø{size_text(fit.post.precoat_mm)} ±{size_text(fit.post.turn_tolerance_mm)}, wall bore "
                   f"Ø{size_text(fit.wall.precoat_mm)} ±{size_text(fit.wall.turn_tolerance_mm)}")
    brk = shop["break_edges"]
    passing = seat_corner_passing_mm(resolved)
    chamfer = resolved["bearing.chamfer"]
    why = f"bearing bore chamfer {size_text(chamfer)}" if chamfer > 0 else "bearing bore chamfer not known"
    out.append(f"Edges ISO 13715: external -{brk:g}, internal -{brk:g}; post/seat-face corner "
               f"+{passing:g}/-{brk:g} ({why})")
    d = resolved.features["axle_bore"].dims
    size = resolved.features["axle_bore"].extra["thread"].drill_size  # an inch drill is bought by its number
    drill = f"{size} (Ø{size_text(d['tap_drill'])})" if size else f"Ø{d['tap_drill']:g}"
    out.append(f"{thread_designation(resolved)}, tap drill {drill} ↧{size_text(d['drill_depth'])}, 118° point, from post face; "
               f"{back_wall_mm(resolved):.2f} left to hub face (min {shop['min_wall']:g})")
    out.append(f"Post, seat face and wall bore Ra {shop['seat_roughness']:g} µm; elsewhere Ra 3.2 µm")
    out.append(f"Runout {data.runout_mm:.3f} to A: G{data.balance_grade:g} (ISO 21940-11), "
               f"{data.spin_rate_rpm:g} rpm, {data.half_mass_g:.1f} g half")
    v = resolved.values
    if v["pad_groove.response"] == "silicone":
        out.append(f"Response recess Ø{v['pad_groove.inner_diameter']:.2f}–Ø{v['pad_groove.outer_diameter']:.2f} "
                   f"↧{v['pad_groove.depth']:g}: fill flush with silicone")
    else:
        proud = v["pad_groove.proud"]
        where = "flush with" if abs(proud) < 1e-9 else f"{abs(proud):.2f} {'proud of' if proud > 0 else 'below'}"
        out.append(f"Pads {v['pad_groove.pad_thickness']:g} thick stand {where} wall face, "
                   f"{v['pad_groove.pad_gap']:.2f} pad to pad")
    if resolved.profile is not None:
        from ..checks import reentrant_regions

        for region in reentrant_regions(resolved.profile):
            out.append(f"Undercut z {region.z_min:.2f}…{region.z_max:.2f}, Ø{2 * region.r_min:.2f}…Ø{2 * region.r_max:.2f}: "
                       f"{region.tool}")
    from .requests import unspecified_radii

    radii = unspecified_radii(resolved)
    general = f"General tolerance {shop['general_tolerance']}; dimensions in mm"
    if radii:
        general += "; unspecified radii " + ", ".join(f"R{size_text(x)}" for x in radii)
    out.append(general)
    return out


def caution_lines() -> list[str]:
    """The cautions every sheet carries."""
    return [
        "Prototype and verify fit, gap and balance before a production run.",
        "Sold to children: meet small-parts and toy-safety rules of the market.",
        "Follow shop safety practice; local codes and qualified practice take precedence.",
    ]
