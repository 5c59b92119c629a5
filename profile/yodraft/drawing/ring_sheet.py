"""The ring's own shop drawing, composed as data like the half's sheet (``compose``) and written by the
same backends: the ring's section at an ISO 5455 scale with its two diameters (the fit diameter with its
limit deviations, the same fit the body's seat carries on the half's sheet), an enlarged detail of its
cross-section with its width and edge radius, the press-fit and assembly notes, cautions, revisions and a
title block. Every corner is located once from the ring's outer face (flush with datum face B of the
half) and the axis (``chain.settle``); what carries no tolerance of its own is held by the general
tolerance note."""
from __future__ import annotations

from dataclasses import replace

from ..builder import Resolved
from ..catalog.finishes import callout
from ..features.ring import BORE_LIMITS, width_limits
from ..geometry import Arc, Profile
from ..tolerances.iso286 import Limits
from .chain import settle
from .compose import (DETAIL_SCALES, GAP, PAD, PAPERS, PART_HATCH, TITLE_WIDTH, _bbox, _frame, _Group, _hatch,
                      _obstacles, _paragraphs, _place_text, _profile_stroke, _rect, _revision_block, _solid_test,
                      _text, _title_block, frame_of, left_off_line, scale_text)
from .layout import TEXT_HEIGHT, Placer
from .lettering import Lettering, lettering
from .locate import corner, on_radius
from .notes import SheetData, caution_lines, material_line, sheet_number
from .numbers import size_text
from .requests import DimensionRequest, radius_request
from .sheetdata import Item, Sheet, Stroke, View

__all__ = ["compose_ring", "deviations", "ring_fit_text", "seat_fit_text", "ring_note_lines", "ring_requests", "RING_SCALES",
           "DETAIL_LETTER"]

RING_SCALES = (5.0, 2.0, 1.0, 0.5)  # ISO 5455
DETAIL_LETTER = "D"  # the half's sheet uses A, B (datums) and C (the seat detail)
_ROOM = 30.0  # paper mm kept round a view for its dimensions
_EDGE = 2.0  # paper mm between the frame and the section's widest text


def deviations(lim: Limits) -> str:
    """Upper and lower deviation in mm, both to the same places as ISO 129-1 writes them (a zero one
    without sign or places).

    >>> deviations(Limits(80.0, 68.0)), deviations(Limits(18.0, 0.0)), deviations(Limits(-10.0, -29.0))
    ('+0.080/+0.068', '+0.018/0', '-0.010/-0.029')
    """
    def one(um: float) -> str:
        return "0" if abs(um) < 0.5 else f"{um / 1000:+.3f}"
    return f"{one(lim.upper_um)}/{one(lim.lower_um)}"


def _limits(code: str | None, lim: Limits) -> str:
    """Limit deviations in mm (ISO 286-1), after the class code when the fit has one: ``s6 (+0.072/+0.053)``."""
    return f"{code} ({deviations(lim)})" if code else deviations(lim)


def ring_fit_text(fit) -> str:  # type: ignore[no-untyped-def]
    """The tolerance written on the ring's fit diameter: its ISO 286 class and limit deviations, or the
    deviations the design's interference limits give it (``iso286.hole_basis_split``)."""
    codes = (None, None) if fit.fit is None else (fit.fit.hole_code, fit.fit.shaft_code)
    return _limits(codes[1] if fit.ring_is_inner else codes[0], fit.ring_limits)


def seat_fit_text(fit) -> str:  # type: ignore[no-untyped-def]
    """The tolerance written on the body's ring seat diameter (the other half of the same fit)."""
    codes = (None, None) if fit.fit is None else (fit.fit.hole_code, fit.fit.shaft_code)
    return _limits(codes[0] if fit.ring_is_inner else codes[1], fit.seat_limits)


def _sized(fit, lim: Limits) -> str:  # type: ignore[no-untyped-def]
    return f"Ø{size_text(fit.interface_mm)} {deviations(lim)}"


def ring_note_lines(fit, body_sheet: str = "", edge_radius_mm: float = 0.0) -> list[str]:  # type: ignore[no-untyped-def]
    """The press-fit figures as notes: both sizes of the fit, interference over temperature, pressure,
    stresses, hold, and how it is assembled (the temperature difference the check reports). Facing the
    proud ring flush cuts into the radius of its face edge, so that radius is turned after facing."""
    lo, hi = fit.interference_um
    code = "" if fit.fit is None else " " + fit.fit_text.split(" ", 1)[1]
    where = f" ({body_sheet})" if body_sheet else ""
    growth = f", {fit.coating_growth_um:.1f} µm of it coating growth" if fit.coating_growth_um else ""
    return [
        f"Fit{code}: ring {_sized(fit, fit.ring_limits)} in the {fit.body_material.name} body's seat "
        f"{_sized(fit, fit.seat_limits)}{where}, seat in the {fit.seat}",
        f"   interference {lo / 1000:.3f}…{hi / 1000:.3f} at 20 °C{growth}, {fit.interference_hot_um[0] / 1000:.3f}…"
        f"{fit.interference_hot_um[1] / 1000:.3f} at {fit.hot_c:g} °C, {fit.interference_cold_um[0] / 1000:.3f}…"
        f"{fit.interference_cold_um[1] / 1000:.3f} at {fit.cold_c:g} °C",
        f"   contact pressure {fit.contact_pressure_mpa[0]:.1f}…{fit.contact_pressure_mpa[1]:.1f} MPa; hoop stress "
        f"body {fit.hoop_stress_body_mpa:.0f} MPa, ring {fit.hoop_stress_ring_mpa:.0f} MPa; yield over von Mises "
        f"at least {fit.safety_factor:.2f} (Lamé)",
        f"   holds {fit.hold_force_n:.0f} N axially and {fit.hold_torque_n_mm / 1000:.1f} N·m (friction {fit.friction:g})",
        f"Assembly: {fit.heated_or_cooled()} by ΔT {fit.assembly_delta_t_k:.0f} K, press home against the seat "
        "bottom; fit surfaces clean and dry; then face the ring flush with the face"
        + (f" and turn its R{size_text(edge_radius_mm)} edge" if edge_radius_mm > 0 else ""),
    ] + ([f"Outside Ø{size_text(fit.ring_diameters_mm[1])} is the rim diameter: finish-turned with the body after "
          f"pressing{where}; leave stock on it here"] if fit.seat == "outer diameter" else [])


def ring_requests(profile: Profile, fit, general: str = "") -> list[DimensionRequest]:  # type: ignore[no-untyped-def]
    """The ring's dimensions, settled into one chain from its outer face and the axis: the fit diameter
    with its limits and the other diameter (the section), the width from the outer face with its facing
    stock over the seat's depth under the general tolerance ``general`` (``ring.width_limits``), and each
    edge radius (the detail); the radial thickness follows from the diameters (auxiliary)."""
    z0, _, z1, _ = profile.bounds()
    r_in, r_out = fit.ring_diameters_mm[0] / 2, fit.ring_diameters_mm[1] / 2
    fit_r = fit.interface_mm / 2
    other_r = r_in if abs(fit_r - r_out) < 1e-9 else r_out
    wanted = [
        DimensionRequest(("ring.diameter",), "diameter", (on_radius(profile, fit_r),), decimals=3,
                         side="right", tolerance=ring_fit_text(fit)),
        DimensionRequest(("ring.ring_inner_diameter" if other_r == r_in else "ring.ring_outer_diameter",),
                         "diameter", (on_radius(profile, other_r, prefer="min"),), side="left", decimals=3,
                         tolerance=deviations(BORE_LIMITS) if fit.seat == "face" else ""),
        DimensionRequest(("ring.width",), "linear", (corner(profile, (z0, fit_r)), corner(profile, (z1, fit_r))),
                         view="detail", direction="axial", side="above",
                         tolerance=deviations(width_limits(general, fit.length_mm)) if general else ""),
        DimensionRequest(("ring.thickness",), "linear", (corner(profile, (z1, r_in)), corner(profile, (z1, r_out))),
                         view="detail", direction="radial", side="right"),
    ]
    for arc in (s for s in profile.segments if isinstance(s, Arc)):
        wanted.append(radius_request(("ring.edge_radius",), arc, view="detail"))
    settled, chain = settle(wanted, profile, z1)
    for c in chain.unlocated():  # nothing is left today; a new ring outline gets its positions all the same
        if not chain.z.located(c[0]):
            chain.tie("axial", c, (z1, c[1]))
            settled.append(DimensionRequest(("ring.position",), "linear", (c, (z1, c[1])), view="detail",
                                            direction="axial", side="below"))
        if not chain.r.located(abs(c[1])):
            chain.tie("diameter", c)
            settled.append(DimensionRequest(("ring.position",), "diameter", (c,), side="left"))
    return settled


class _NoRoom(Exception):
    """The views do not fit the left half of the sheet at these scales."""


def _section(part, scale: float, font: Lettering, requests: list[DimensionRequest],  # type: ignore[no-untyped-def]
             region: tuple[float, float, float, float]) -> tuple[_Group, View, list]:
    """The ring's section (both halves about the axis) with its diameters and the detail's marker."""
    profile = part.profile
    z0, _, z1, r1 = profile.bounds()
    view = View("main", scale, (0.0, 0.0), (-400.0, -400.0, 400.0, 400.0))
    up, low = _profile_stroke(profile, view), _profile_stroke(profile.mirrored(), view)
    hatch = _hatch([profile.polygon(), profile.mirrored().polygon()], view, (up, low), *PART_HATCH)
    a, b = view.to_paper((z0, 0.0)), view.to_paper((z1, 0.0))
    axis = Stroke(((a[0] - 4.0, a[1]), (b[0] + 4.0, b[1])), "centre", "main")
    m0, m1 = view.to_paper(region[:2]), view.to_paper(region[2:])
    marker = _rect(m0[0], m0[1], m1[0], m1[1], "detail")
    items: list[Item] = [up, low, hatch, axis, marker]
    ob = _obstacles(items, [up, low])
    bbox = (view.to_paper((z0, -r1))[0], view.to_paper((z0, -r1))[1], view.to_paper((z1, r1))[0],
            view.to_paper((z1, r1))[1])
    placer = Placer(view, font, ob, _solid_test(profile, view), bbox)
    items += placer.place([r for r in requests if r.view == "main"])
    letter = _place_text(font, ob, DETAIL_LETTER, [
        ((m0[0] + m1[0]) / 2, m1[1] + 1.5, "center"), (m1[0] + 1.5, m1[1] + 1.0, "left"),
        (m0[0] - 1.5, m1[1] + 1.0, "right"), ((m0[0] + m1[0]) / 2, m1[1] + 5.0, "center"),
        (m1[0] + 5.0, m1[1] + 5.0, "left"), (m0[0] - 5.0, m1[1] + 5.0, "right")])
    items.append(letter)
    return _Group(items, _bbox(items)), view, placer.failed


def _detail(part, scale: float, font: Lettering, requests: list[DimensionRequest],  # type: ignore[no-untyped-def]
            region: tuple[float, float, float, float]) -> tuple[_Group, View, list]:
    """The ring's cross-section enlarged, with its width, edge radius and (auxiliary) thickness."""
    profile = part.profile
    centre = ((region[0] + region[2]) / 2, (region[1] + region[3]) / 2)  # on paper at (0, 0): inside the box
    view = View("detail", scale, (-scale * centre[0], -scale * centre[1]), (-400.0, -400.0, 400.0, 400.0))
    up = _profile_stroke(profile, view)
    hatch = _hatch([profile.polygon()], view, (up,), *PART_HATCH)
    items: list[Item] = [up, hatch]
    ob = _obstacles(items, [up])
    a, b = view.to_paper(region[:2]), view.to_paper(region[2:])
    placer = Placer(view, font, ob, _solid_test(profile, view), (a[0], a[1], b[0], b[1]), mirrored=False)
    items += placer.place([r for r in requests if r.view == "detail"])
    return _Group(items, _bbox(items)), view, placer.failed


def _views(part, font: Lettering, requests: list[DimensionRequest], left: tuple[float, float, float, float],  # type: ignore[no-untyped-def]
           force: bool) -> tuple[list[Item], View, View, float, float, list[DimensionRequest]]:
    """The section and the framed detail side by side in ``left``, at the largest scales that fit and place
    every size; ``force``: at the largest that fit, the sizes that find no room returned (the last item) to
    be named in a note."""
    z0, r0, z1, r1 = part.profile.bounds()
    margin = 0.1 * max(z1 - z0, r1 - r0)
    region = (z0 - margin, r0 - margin, z1 + margin, r1 + margin)
    width, height = left[2] - left[0], left[3] - left[1]
    for scale in RING_SCALES:
        if 2 * r1 * scale > height - _ROOM - 2 * TEXT_HEIGHT:
            continue
        section, sview, failed = _section(part, scale, font, requests, region)
        if failed and not force:
            continue
        label_w = font.width(f"RING SECTION ({scale_text(scale)})", TEXT_HEIGHT)
        room_w = width - max(section.box[2] - section.box[0], label_w) - _EDGE - GAP - 2 * PAD  # the words start GAP beyond
        for dscale in DETAIL_SCALES:
            if dscale <= scale or (z1 - z0) * dscale > room_w or (r1 - r0) * dscale > height - _ROOM:
                continue
            detail, dview, dfailed = _detail(part, dscale, font, requests, region)
            dw = detail.box[2] - detail.box[0] + 2 * PAD
            dh = detail.box[3] - detail.box[1] + 3 * PAD + TEXT_HEIGHT
            if dw > room_w or dh > height - 2 * GAP or (dfailed and not force):
                continue
            return _arrange(font, left, section, sview, detail, dview, scale, dscale) + (_functional(failed + dfailed),)
    if not force:
        raise _NoRoom("no scale fits")
    # nothing fits the half sheet: the smallest scales, every size that finds no room named
    section, sview, failed = _section(part, RING_SCALES[-1], font, requests, region)
    detail, dview, dfailed = _detail(part, DETAIL_SCALES[-1], font, requests, region)
    return (_arrange(font, left, section, sview, detail, dview, RING_SCALES[-1], DETAIL_SCALES[-1])
            + (_functional(failed + dfailed),))


def _functional(failed: list[DimensionRequest]) -> list[DimensionRequest]:
    """The sizes with no room that the sheet must name: every one but an auxiliary (it follows from the others)."""
    return [r for r in failed if not r.auxiliary]


def _arrange(font: Lettering, left, section: _Group, sview: View, detail: _Group, dview: View,  # type: ignore[no-untyped-def]
             scale: float, dscale: float) -> tuple[list[Item], View, View, float, float]:
    """The section at the left, centred in height over its label; the detail framed to its right, at the top."""
    label = f"RING SECTION ({scale_text(scale)})"
    sb = section.box
    reach = max(0.0, (font.width(label, TEXT_HEIGHT) - (sb[2] - sb[0])) / 2)  # a label wider than the view
    dx = left[0] + _EDGE + reach - sb[0]
    dy = (left[1] + left[3]) / 2 + TEXT_HEIGHT - (sb[1] + sb[3]) / 2
    section = section.moved(dx, dy)
    sview = View("main", scale, (sview.origin[0] + dx, sview.origin[1] + dy),
                 (section.box[0] - 1.0, section.box[1] - 1.0, section.box[2] + 1.0, section.box[3] + 1.0))
    items = list(section.items)
    items.append(_text(font, label,
                       ((section.box[0] + section.box[2]) / 2, section.box[1] - GAP - TEXT_HEIGHT), align="center"))
    db = detail.box
    ddx = section.box[2] + 2 * GAP + PAD - db[0]
    ddy = left[3] - GAP - PAD - db[3]
    detail = detail.moved(ddx, ddy)
    dview = View("detail", dscale, (dview.origin[0] + ddx, dview.origin[1] + ddy), detail.box)
    db = detail.box
    dframe = (db[0] - PAD, db[1] - PAD - TEXT_HEIGHT - PAD, db[2] + PAD, db[3] + PAD)
    items += detail.items
    items.append(_rect(*dframe, "detail"))
    items.append(_text(font, f"DETAIL {DETAIL_LETTER} ({scale_text(dscale)})",
                       ((dframe[0] + dframe[2]) / 2, dframe[1] + PAD), align="center"))
    return items, sview, dview, scale, dscale


def compose_ring(resolved: Resolved, data: SheetData, name: str = "ring", body_sheet: str = "") -> Sheet:
    """The ring's sheet on A3: its section and detail in the left half, the words in the right half.
    ``body_sheet`` names the half's sheet (by default its identification number and "sheet 1/N") in the fit note."""
    from ..massprops import body_props

    font = lettering()
    d = resolved.design
    part = next(p for p in resolved.parts if p.name == name)
    fit = resolved.features["ring"].extra["press_fit"]
    paper = PAPERS["A3"]
    frame = frame_of(paper)
    mid_x = frame[0] + 0.5 * (frame[2] - frame[0])
    requests = ring_requests(part.profile, fit, d["shop"]["general_tolerance"])
    try:
        items, sview, dview, scale, dscale, left_off = _views(part, font, requests, (frame[0], frame[1], mid_x, frame[3]),
                                                              False)
    except _NoRoom:
        items, sview, dview, scale, dscale, left_off = _views(part, font, requests, (frame[0], frame[1], mid_x, frame[3]),
                                                              True)
    right_x = mid_x + GAP
    rev = _revision_block(font, resolved, (right_x, frame[3]), frame[2] - right_x)
    items += rev
    body_sheet = body_sheet or f"{d['design']['identification'] or d.name} sheet {sheet_number(resolved)}"
    m = fit.material
    notes = [material_line(m.name, m.designation, m.designation_source),
             *ring_note_lines(fit, body_sheet, resolved.values["ring.edge_radius"]),
             f"Finish: {callout(part.coating)}. Edges ISO 13715 -{d['shop']['break_edges']:g} unless dimensioned; "
             f"fit surface Ra 0.8 µm",
             f"General tolerance {d['shop']['general_tolerance']} for sizes without their own. Dimensions in mm."]
    if left_off:  # a size with no room on the views is named with its value, never dropped unsaid
        face_z = part.profile.bounds()[2]  # the ring's outer face, flush with the half's face B
        notes += ["Not drawn for want of room: " + "; ".join(left_off_line(r, face_z, "the outer face") for r in left_off)]
    note_items, foot = _paragraphs(font, "NOTES", notes, (right_x + 1.5, _bbox(rev)[1] - GAP), frame[2] - right_x - 3.0)
    items += note_items
    cautions = caution_lines() + [
        "Press and shrink fits store force: wear eye protection, support the body evenly on the press, and handle "
        "heated or cooled parts with gloves made for it.",
        "The assembly ΔT and the fit figures are predictions from handbook values: heat, cool and press by the "
        "shop's qualified practice and the material makers' limits, which take precedence; press a trial ring first."]
    caution_items, _ = _paragraphs(font, "CAUTIONS", cautions, (right_x + 1.5, foot - GAP), frame[2] - right_x - 3.0)
    items += caution_items
    mass = body_props(part.profile, part.density_g_cm3).mass_g
    overrides = {"Title": ("Title", f"{d['design']['title'] or d.name}: {name}"),
                 "Material": ("Material", part.material),
                 "Sheet": ("Sheet", sheet_number(resolved, name)), "Mass (one half)": (f"Mass (one {name})", f"{mass:.2f} g")}
    items += _title_block(font, resolved, replace(data, half_mass_g=mass),
                          f"{scale_text(scale)}, detail {DETAIL_LETTER} {scale_text(dscale)}",
                          (frame[2] - TITLE_WIDTH, frame[1]), overrides)
    items += _frame(paper, frame)
    vb = _bbox([i for i in items if getattr(i, "view", "paper") == "main"])
    sview = sview._replace(box=(vb[0] - 1.0, vb[1] - 1.0, vb[2] + 1.0, vb[3] + 1.0))  # what the viewport shows
    return Sheet(paper, frame, tuple(items), (sview, dview), name=f"{name}-sheet",
                 notes={"paper": "A3", "scale": scale, "detail_scale": dscale, "detail_block": f"{name}-detail"})
