"""The ring's own shop drawing, composed as data like the half's sheet (``compose``) and written by the
same backends: its section at an ISO 5455 scale, hatched as in the half's section, with its diameters
(the fit diameter toleranced) and width; the press-fit notes, cautions, revisions and a title block."""
from __future__ import annotations

from dataclasses import replace

from ..builder import Resolved
from .compose import (GAP, PAPERS, PART_HATCH, TITLE_WIDTH, _bbox, _frame, _hatch, _obstacles, _paragraphs,
                      _profile_stroke, _revision_block, _solid_test, _text, _title_block, frame_of, scale_text)
from .layout import TEXT_HEIGHT, Placer
from .lettering import lettering
from .notes import SheetData, caution_lines
from .requests import DimensionRequest
from .sheetdata import Item, Sheet, Stroke, View

__all__ = ["compose_ring", "ring_fit_text", "seat_fit_text", "ring_note_lines", "RING_SCALES"]

RING_SCALES = (5.0, 2.0, 1.0, 0.5)  # ISO 5455


def _limits(code: str | None, lim) -> str:  # type: ignore[no-untyped-def]
    up, lo = lim.upper_um / 1000, lim.lower_um / 1000
    return f"{code} ({up:+.3f}/{lo:+.3f})".replace("+0.000", "0").replace("-0.000", "0")


def ring_fit_text(fit) -> str:  # type: ignore[no-untyped-def]
    """The tolerance written on the ring's fit diameter: its ISO 286 class and limits, or the interference."""
    if fit.fit is None:
        return f"fit to seat, interference {fit.interference_um[0] / 1000:.3f}…{fit.interference_um[1] / 1000:.3f}"
    f = fit.fit
    return _limits(f.shaft_code, f.shaft) if fit.ring_is_inner else _limits(f.hole_code, f.hole)


def seat_fit_text(fit) -> str:  # type: ignore[no-untyped-def]
    """The tolerance written on the body's ring seat diameter."""
    if fit.fit is None:
        return f"fit to ring, interference {fit.interference_um[0] / 1000:.3f}…{fit.interference_um[1] / 1000:.3f}"
    f = fit.fit
    return _limits(f.hole_code, f.hole) if fit.ring_is_inner else _limits(f.shaft_code, f.shaft)


def ring_note_lines(fit) -> list[str]:  # type: ignore[no-untyped-def]
    """The press-fit figures as notes: interference over temperature, pressure, stresses, hold, assembly."""
    lo, hi = fit.interference_um
    code = "" if fit.fit is None else " " + fit.fit_text.split(" ", 1)[1]
    return [
        f"{fit.material.name} ring in a {fit.body_material.name} body, seat in the {fit.seat}; fit Ø{fit.interface_mm:.3f}{code}",
        f"   interference {lo:.1f}…{hi:.1f} µm at 20 °C, {fit.interference_hot_um[0]:.1f}…{fit.interference_hot_um[1]:.1f} µm "
        f"at {fit.hot_c:g} °C, {fit.interference_cold_um[0]:.1f}…{fit.interference_cold_um[1]:.1f} µm at {fit.cold_c:g} °C",
        f"   contact pressure {fit.contact_pressure_mpa[0]:.1f}…{fit.contact_pressure_mpa[1]:.1f} MPa; hoop stress "
        f"body {fit.hoop_stress_body_mpa:.0f} MPa, ring {fit.hoop_stress_ring_mpa:.0f} MPa; yield over von Mises "
        f"at least {fit.safety_factor:.2f} (Lamé)",
        f"   holds {fit.hold_force_n:.0f} N axially and {fit.hold_torque_n_mm / 1000:.1f} N·m (friction {fit.friction:g})",
        f"Assembly: {fit.heated_or_cooled()} by {fit.assembly_delta_t_k:.0f} K, press home against the seat bottom; "
        "fit surfaces clean and dry",
    ]


def compose_ring(resolved: Resolved, data: SheetData, name: str = "ring") -> Sheet:
    """The ring's sheet on A3: the largest scale at which its section and dimensions fit the left part."""
    from ..massprops import body_props

    font = lettering()
    d = resolved.design
    part = next(p for p in resolved.parts if p.name == name)
    fit = resolved.features["ring"].extra["press_fit"]
    paper = PAPERS["A3"]
    frame = frame_of(paper)
    z0, _, z1, r1 = part.profile.bounds()
    room_w, room_h = 0.5 * (frame[2] - frame[0]) - 80.0, frame[3] - frame[1] - 80.0
    scale = next((s for s in RING_SCALES if (z1 - z0) * s <= room_w and 2 * r1 * s <= room_h), RING_SCALES[-1])
    cx, cy = frame[0] + 0.25 * (frame[2] - frame[0]), (frame[1] + frame[3]) / 2 + 10.0
    origin = (cx - scale * (z0 + z1) / 2, cy)
    view = View("main", scale, origin, (frame[0], frame[1], frame[0] + 0.5 * (frame[2] - frame[0]), frame[3]))
    up, low = _profile_stroke(part.profile, view), _profile_stroke(part.profile.mirrored(), view)
    hatch = _hatch([part.profile.polygon(), part.profile.mirrored().polygon()], view, (up, low), *PART_HATCH)
    a, b = view.to_paper((z0, 0.0)), view.to_paper((z1, 0.0))
    axis = Stroke(((a[0] - 4.0, a[1]), (b[0] + 4.0, b[1])), "centre", "main")
    items: list[Item] = [up, low, hatch, axis]
    ob = _obstacles(items, [up, low])
    bbox = (view.to_paper((z0, -r1))[0], view.to_paper((z0, -r1))[1], view.to_paper((z1, r1))[0],
            view.to_paper((z1, r1))[1])
    placer = Placer(view, font, ob, _solid_test(part.profile, view), bbox)
    r_in, r_out = fit.ring_diameters_mm[0] / 2, fit.ring_diameters_mm[1] / 2
    fit_on_outside = abs(fit.interface_mm / 2 - r_out) < 1e-9
    requests = [
        DimensionRequest(("ring.ring_outer_diameter",), "diameter", ((z1, r_out),), side="right", decimals=3,
                         tolerance=ring_fit_text(fit) if fit_on_outside else ""),
        DimensionRequest(("ring.ring_inner_diameter",), "diameter", ((z0, r_in),), side="left", decimals=3,
                         tolerance="" if fit_on_outside else ring_fit_text(fit)),
        DimensionRequest(("ring.width",), "linear", ((z0, r_out), (z1, r_out)), direction="axial", side="above"),
    ]
    items += placer.place(requests)
    box = _bbox(items)
    items.append(_text(font, f"RING SECTION ({scale_text(scale)})", ((box[0] + box[2]) / 2, box[1] - GAP - TEXT_HEIGHT),
                       align="center"))
    right_x = frame[0] + 0.5 * (frame[2] - frame[0]) + GAP
    rev = _revision_block(font, resolved, (right_x, frame[3]), frame[2] - right_x)
    items += rev
    finish = part.coating
    notes = ring_note_lines(fit) + [
        f"Finish: {finish}. Unmarked edges ISO 13715 -{d['shop']['break_edges']:g}; fit surface Ra 0.8 µm",
        f"General tolerance {d['shop']['general_tolerance']}. Dimensions in mm."]
    note_items, foot = _paragraphs(font, "NOTES", notes, (right_x + 1.5, _bbox(rev)[1] - GAP), frame[2] - right_x - 3.0)
    items += note_items
    cautions = caution_lines() + ["Press and shrink fits store force: wear eye protection, support the body evenly on "
                                  "the press, and handle heated or cooled parts with gloves made for it."]
    caution_items, _ = _paragraphs(font, "CAUTIONS", cautions, (right_x + 1.5, foot - GAP), frame[2] - right_x - 3.0)
    items += caution_items
    mass = body_props(part.profile, part.density_g_cm3).mass_g
    overrides = {"Title": ("Title", f"{d['design']['title'] or d.name}: {name}"),
                 "Material": ("Material", part.material), "Mass (one half)": (f"Mass (one {name})", f"{mass:.2f} g")}
    items += _title_block(font, resolved, replace(data, half_mass_g=mass), scale_text(scale),
                          (frame[2] - TITLE_WIDTH, frame[1]), overrides)
    items += _frame(paper, frame)
    vb = _bbox([i for i in items if getattr(i, "view", "paper") == "main"])
    view = replace(view, box=(vb[0] - 1.0, vb[1] - 1.0, vb[2] + 1.0, vb[3] + 1.0))  # what the viewport shows
    return Sheet(paper, frame, tuple(items), (view,), name=f"{name}-sheet", notes={"paper": "A3", "scale": scale})
