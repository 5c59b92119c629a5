"""Rim ring: a ring of a second (usually denser) material pressed into a seat turned into the rim,
to carry mass out to the rim.

The seat is a step on the outer diameter at the outer face, a counterbore of the cup wall at the
cup lip, or an annular groove in the outer face; the ring fills it flush with the face. The ring is
held by an interference fit, given by ISO 286 hole/shaft classes at the interface diameter (the
hole is the outer member's bore: the body's seat bore, or the ring's bore on the outer diameter) or
by explicit limits. The fit is worked out by Lamé's thick-walled cylinder equations for two
materials (see yodraft.pressfit): contact pressure, stresses against each material's yield, the
force and torque it holds, the interference left at the hottest and coldest service temperature,
and the temperature difference that assembles it.
"""
from __future__ import annotations

import math
from collections.abc import Mapping
from dataclasses import dataclass
from typing import Any

from ..catalog.finishes import FINISHES, check_finish
from ..catalog.materials import MATERIALS, Material, lookup_material
from ..checks import Check, check
from ..errors import DesignInputError
from ..params import SMALLEST, ParamSpec, check_name
from ..pressfit import (REFERENCE_TEMPERATURE_C, FitStresses, Member, assembly_delta_t_k, bore_change_mm,
                        contact_pressure, fit_stresses, holding_force_n, holding_torque_n_mm, thermal_change_mm)
from ..tolerances.general import general_tolerance_mm
from ..tolerances.iso286 import Fit, FitCodeError, Limits, hole_basis_split, parse_fit
from .base import Context, FeatureResult, PartOutline, SeatCut, V, pick

NAME = "ring"
SEATS = ("none", "outer diameter", "cup wall", "face")
PARAMS = (
    ParamSpec("seat", "text", "where the ring sits: a step on the outer diameter, a counterbore of the cup wall, "
              "a groove in the outer face, or none", "none", choices=SEATS),
    ParamSpec("material", "text", "ring material from the catalog", "304", max_length=40),
    ParamSpec("coating", "text", "finish of the ring (it must suit the ring material; the body's finish does not "
              "cover a ring pressed in after it)", "none", choices=tuple(FINISHES)),
    ParamSpec("coating_thickness", "length", "thickness of the ring's finish", 0.0, 0.0, 0.1, lo_closed=True,
              least=SMALLEST),
    ParamSpec("diameter", "length", "interface diameter, the fit's nominal size; default from the seat, the rim "
              "and the ring thickness", None, 5.0, 120.0),
    ParamSpec("thickness", "length", "radial thickness of the ring", 2.0, 0.0, 30.0),
    ParamSpec("width", "length", "axial length of the ring, the depth of its seat", 3.0, 0.0, 60.0),
    ParamSpec("edge_radius", "length", "radius of the ring's exposed edge at the face; default the rim's radius there "
              "(the cup lip's for a cup-wall seat, the outer edge's on the outer diameter)", None, 0.0, 20.0, lo_closed=True),
    # a free groove wall a tenth clear of the ring  # common practice, no published source
    ParamSpec("groove_clearance", "length", "radial clearance between the ring's bore and the groove's inner wall "
              "(face seat)", 0.1, 0.0, 5.0, lo_closed=True),
    ParamSpec("fit", "text", 'ISO 286 hole/shaft classes of the fit at the interface diameter, e.g. "H7/s6"',
              "H7/s6", max_length=12),
    ParamSpec("interference_min", "length", "explicit least diametral interference (with interference_max, "
              "instead of the fit classes)", None, -1.0, 1.0),
    ParamSpec("interference_max", "length", "explicit greatest diametral interference", None, -1.0, 1.0),
    ParamSpec("mask_seat", "bool", "mask the ring seat from the body's coating (else the coating's growth adds "
              "to the interference)", True),
    # dry steel on aluminium, degreased press fit: 0.1 to 0.2  # common practice, no published source
    ParamSpec("friction", "number", "coefficient of friction at the interface (default 0.15, a common dry value)",
              0.15, 0.0, 1.0),
    ParamSpec("safety_factor", "number", "least yield strength over von Mises stress wanted in body and ring",
              1.5, 0.0, 10.0),  # common practice, no published source
    # a ring of about 15 g stopped at about 2000 g on a hard floor  # common practice, no published source
    ParamSpec("hold_force", "force", "axial force the fit must hold at its least interference", 300.0, 0.0, 1e6,
              lo_closed=True),
    ParamSpec("hold_torque", "torque", "torque the fit must hold at its least interference", 3000.0, 0.0, 1e8,
              lo_closed=True),  # common practice, no published source
    # a hot car or a sunny pocket, and a winter's day outdoors  # common practice, no published source
    ParamSpec("hot", "temperature", "hottest service temperature", 60.0, -100.0, 300.0),
    ParamSpec("cold", "temperature", "coldest service temperature", -20.0, -200.0, 100.0),
    ParamSpec("assembly", "text", "how the ring goes in: heat the outer member (the body; the ring on the outer "
              "diameter) or cool the inner one", "heat", choices=("heat", "cool")),
    ParamSpec("assembly_clearance", "length", "diametral clearance wanted while assembling hot or cold",
              0.02, 0.0, 1.0, lo_closed=True),  # common practice, no published source
    # heating 6061-T6 much above 150 °C over-ages it; liquid nitrogen cools by about 215 K  # from memory
    ParamSpec("max_delta_t", "temperature_difference", "largest temperature difference the shop may use to assemble",
              150.0, 0.0, 400.0),
)


#: The face seat's two free diameters carry one-sided limits (µm) away from each other on the sheets, so the
#: groove's inner wall never stands over the ring's bore, which the press shrinks; a tenth is an easy band
#: for a turned diameter  # common practice, no published source
BORE_LIMITS = Limits(100.0, 0.0)  # the ring's bore, on the ring's sheet
GROOVE_WALL_LIMITS = Limits(0.0, -100.0)  # the groove's inner wall, on the half's sheet


#: The ring is turned wider than its seat is deep and faced flush with the face after pressing: its width's
#: lower deviation is the seat depth's general tolerance (so it never sits below the face), its band this
#: much  # common practice, no published source
FACING_BAND_MM = 0.1


def width_limits(general: str, depth_mm: float) -> Limits:
    """Deviations (µm) of the ring's width as turned, from the seat's depth under the general tolerance
    ``general`` (ISO 2768-1): it stands 0 to ``2 t + FACING_BAND_MM`` proud of the face once pressed home."""
    lower = 1000 * (general_tolerance_mm(general, depth_mm) or 0.0)
    return Limits(lower + 1000 * FACING_BAND_MM, lower)


@dataclass(frozen=True)
class RingFit:
    """The ring's press fit, worked out: geometry, interference, pressure, stresses, hold and assembly."""

    seat: str
    material: Material
    body_material: Material
    fit: Fit | None
    fit_text: str
    limits: Fit
    interface_mm: float
    ring_diameters_mm: tuple[float, float]
    body_diameters_mm: tuple[float, float]
    ring_is_inner: bool
    length_mm: float
    interference_um: tuple[float, float]
    coating_growth_um: float
    interference_hot_um: tuple[float, float]
    interference_cold_um: tuple[float, float]
    contact_pressure_mpa: tuple[float, float]
    worst: FitStresses
    bore_change_um: float
    body_von_mises_mpa: float
    ring_von_mises_mpa: float
    hoop_stress_body_mpa: float
    hoop_stress_ring_mpa: float
    safety_factor_body: float
    safety_factor_ring: float
    least_pressure_mpa: float
    friction: float
    hold_force_n: float
    hold_torque_n_mm: float
    assembly: str
    assembly_delta_t_k: float
    hot_c: float
    cold_c: float

    @property
    def safety_factor(self) -> float:
        return min(self.safety_factor_body, self.safety_factor_ring)

    @property
    def seat_limits(self) -> Limits:
        """Deviations (µm) of the body's fit surface from the interface diameter, as turned."""
        return self.limits.hole if self.ring_is_inner else self.limits.shaft  # type: ignore[return-value]

    @property
    def ring_limits(self) -> Limits:
        """Deviations (µm) of the ring's fit surface from the interface diameter, as turned."""
        return self.limits.shaft if self.ring_is_inner else self.limits.hole  # type: ignore[return-value]

    def heated_or_cooled(self) -> str:
        """Which part is heated or cooled to assemble."""
        inner, outer = ("ring", "body") if self.ring_is_inner else ("body", "ring")
        return f"heat the {outer}" if self.assembly == "heat" else f"cool the {inner}"


def validate(p: Mapping[str, Any], source: str, path: str) -> None:
    """The ring's material and finish are catalog names that suit each other; the fit is readable."""
    check_name(p["material"], lookup_material, list(MATERIALS), source, f"{path}.material", "material")
    check_finish(p["coating"], p["material"], source, f"{path}.coating")
    if p["interference_min"] is None and p["interference_max"] is None:
        try:
            fit = parse_fit(f"10 {p['fit']}")
        except FitCodeError as exc:
            raise DesignInputError(source, f"{path}.fit", exc.problem, exc.expected or 'hole/shaft classes like "H7/s6"') from None
        if fit.hole is None or fit.shaft is None:
            raise DesignInputError(source, f"{path}.fit", f"{p['fit']!r} names one part only",
                                   'hole/shaft classes like "H7/s6"')


def _member(d_in: float, d_out: float, m: Material) -> Member:
    return Member(d_in, d_out, m.e_gpa * 1000.0, m.poisson, m.alpha_per_k, m.yield_mpa)


def resolve(ctx: Context, p: Mapping[str, Any]) -> FeatureResult:
    if p["seat"] == "none":
        return FeatureResult(NAME, {"seat": "none"}, frozenset(), {})
    derived: set[str] = set()
    seat, t, length = p["seat"], p["thickness"], p["width"]
    D, cup_d, face_z = ctx["rim.diameter"], ctx["rim.cup_diameter"], ctx["rim.face_z"]
    if seat == "cup wall":
        d = pick(p, "diameter", cup_d + 2 * t, derived)
        edge = pick(p, "edge_radius", ctx["rim.lip_radius"], derived)
    elif seat == "outer diameter":
        d = pick(p, "diameter", D - 2 * t, derived)
        edge = pick(p, "edge_radius", ctx["rim.edge_radius"], derived)
    else:
        d = pick(p, "diameter", cup_d + (D - cup_d) / 2 + t, derived)  # the ring centred in the rim
        edge = pick(p, "edge_radius", 0.0, derived)  # both its edges run flush into the face
    ring_is_inner = seat != "outer diameter"
    ring_d = (d - 2 * t, d) if ring_is_inner else (d, d + 2 * t)
    body_d = (d, D) if ring_is_inner else (cup_d, d)
    z0 = face_z - length
    checks: list[Check] = [check("service temperatures in order", f"{NAME}.cold", p["cold"] < p["hot"],
                                 f"coldest {p['cold']:g} °C, hottest {p['hot']:g} °C")]
    lo, hi = p["interference_min"], p["interference_max"]
    if (lo is None) != (hi is None):
        checks.append(check("ring interference limits given together", f"{NAME}.interference_max", False,
                            "give interference_min and interference_max together, or neither (the fit classes)"))
    elif lo is not None:
        checks.append(check("ring interference limits in order", f"{NAME}.interference_max", lo <= hi,
                            f"least {lo * 1000:.1f} µm, greatest {hi * 1000:.1f} µm"))
    if seat == "cup wall":
        checks += [check("ring seat inside the rim", f"{NAME}.diameter", cup_d < d < D,
                         f"seat Ø{d:.3f} mm between cup Ø{cup_d:.3f} and rim Ø{D:.3f} mm"),
                   check("ring seat above the cup floor", f"{NAME}.width", length < ctx["rim.cup_depth"],
                         f"seat {length:.3f} mm deep in a {ctx['rim.cup_depth']:.3f} mm cup")]
        cut = SeatCut((face_z, cup_d / 2), (V(z0, cup_d / 2), V(z0, d / 2), V(face_z, d / 2)), "corner",
                      f"{NAME}.seat", ((z0, d / 2),), f"{NAME}.diameter")
        ring = (V(z0, ring_d[0]), V(face_z, ring_d[0], edge, f"{NAME}.edge_radius"),
                V(face_z, ring_d[1]), V(z0, ring_d[1]))
    elif seat == "outer diameter":
        band = ctx["catch_zone.rim_width"]
        checks += [check("ring flush with the outer diameter", f"{NAME}.diameter", ring_d[1] <= D + 1e-9,
                         f"ring Ø{ring_d[1]:.3f} mm on a Ø{D:.3f} mm rim"),
                   check("ring seat outside the cup", f"{NAME}.thickness", cup_d < d,
                         f"seat Ø{d:.3f} mm over cup Ø{cup_d:.3f} mm"),
                   check("ring within the rim band", f"{NAME}.width", length < band,
                         f"ring {length:.3f} mm wide on a {band:.3f} mm band")]
        cut = SeatCut((face_z, D / 2), (V(face_z, d / 2), V(z0, d / 2), V(z0, D / 2)), "corner",
                      f"{NAME}.seat", ((z0, d / 2),), f"{NAME}.thickness")
        ring = (V(z0, ring_d[0]), V(face_z, ring_d[0]),
                V(face_z, ring_d[1], edge, f"{NAME}.edge_radius"), V(z0, ring_d[1]))
    else:
        g = ring_d[0] - 2 * p["groove_clearance"]  # the groove's inner wall, clear of the ring's bore
        checks.append(check("ring groove in the face", f"{NAME}.diameter", cup_d < g and d < D,
                            f"groove Ø{g:.3f} to Ø{d:.3f} mm between cup Ø{cup_d:.3f} and rim Ø{D:.3f} mm"))
        cut = SeatCut((face_z, g / 2), (V(face_z, g / 2), V(z0, g / 2), V(z0, d / 2), V(face_z, d / 2)), "edge",
                      f"{NAME}.seat", ((z0, g / 2), (z0, d / 2)), f"{NAME}.width")
        ring = (V(z0, ring_d[0]), V(face_z, ring_d[0]), V(face_z, ring_d[1]), V(z0, ring_d[1]))
    ring = tuple(V(c.point[0], c.point[1] / 2, c.radius, c.owner) for c in ring)  # diameters to radii
    material = lookup_material(p["material"])
    dims: dict[str, Any] = {"seat": seat, "material": material.name, "diameter": d, "thickness": t, "width": length,
                            "ring_inner_diameter": ring_d[0], "ring_outer_diameter": ring_d[1],
                            "body_inner_diameter": body_d[0], "body_outer_diameter": body_d[1], "seat_z": z0,
                            "edge_radius": edge}
    if seat == "face":
        dims["groove_inner_diameter"] = ring_d[0] - 2 * p["groove_clearance"]
    geometry_ok = all(c.ok for c in checks) and 0 <= ring_d[0] and 0 <= body_d[0]
    extra: dict[str, Any] = {}
    if geometry_ok:
        body = lookup_material(ctx["material.name"])
        ring_fit, fit_checks = _press_fit(ctx, p, seat, material, body, d, ring_d, body_d, ring_is_inner)
        checks += fit_checks
        extra["press_fit"] = ring_fit
        if seat == "face":
            checks.append(_groove_wall_check(ring_fit, dims["groove_inner_diameter"]))
    outline = PartOutline(NAME, material.name, material.density_g_cm3, ring, p["coating"])
    return FeatureResult(NAME, dims, frozenset(derived), {}, tuple(checks), extra, (outline,), (cut,))


def _press_fit(ctx: Context, p: Mapping[str, Any], seat: str, material: Material, body: Material, d: float,
               ring_d: tuple[float, float], body_d: tuple[float, float],
               ring_is_inner: bool) -> tuple[RingFit, list[Check]]:
    shop = ctx.shop
    if p["interference_min"] is not None and p["interference_max"] is not None:
        # the explicit limits become the two parts' deviations on the hole basis, so the sheets carry them
        fit, fit_text = None, "explicit"
        limits = hole_basis_split(d, 1000 * p["interference_min"], 1000 * p["interference_max"])
    else:
        fit = limits = parse_fit(f"{d:.6g} {p['fit']}")
        fit_text = fit.code
    lo_um, hi_um = -limits.clearance_max_um, -limits.clearance_min_um  # type: ignore[operator]
    # a coating on either face of the fit stands proud of the turned size and adds to the interference
    growth = 0.0
    if shop["coating"] != "none" and not p["mask_seat"]:
        growth += 2 * shop["coating_thickness"] * shop["coating_outward_share"]
    if p["coating"] != "none":
        growth += 2 * p["coating_thickness"] * shop["coating_outward_share"]
    lo_um, hi_um = lo_um + 1000 * growth, hi_um + 1000 * growth
    ring_m, body_m = _member(*ring_d, material), _member(*body_d, body)
    inner, outer = (ring_m, body_m) if ring_is_inner else (body_m, ring_m)
    hot = 1000 * thermal_change_mm(d, inner, outer, p["hot"])
    cold = 1000 * thermal_change_mm(d, inner, outer, p["cold"])
    least = min(lo_um, lo_um + hot, lo_um + cold)
    most = max(hi_um, hi_um + hot, hi_um + cold)
    pressure = (contact_pressure(lo_um / 1000, inner, outer), contact_pressure(hi_um / 1000, inner, outer))
    worst = fit_stresses(max(0.0, contact_pressure(most / 1000, inner, outer)), inner, outer)
    ring_s, body_s = (worst.inner_max(), worst.outer_max()) if ring_is_inner else (worst.outer_max(), worst.inner_max())
    ring_hoop = (worst.inner_bore, worst.inner_interface) if ring_is_inner else (worst.outer_interface, worst.outer_outside)
    body_hoop = (worst.outer_interface, worst.outer_outside) if ring_is_inner else (worst.inner_bore, worst.inner_interface)
    sf_body = body.yield_mpa / body_s.von_mises_mpa if body_s.von_mises_mpa > 0 else float("inf")
    sf_ring = material.yield_mpa / ring_s.von_mises_mpa if ring_s.von_mises_mpa > 0 else float("inf")
    least_p = max(0.0, contact_pressure(least / 1000, inner, outer))
    force = holding_force_n(least_p, p["friction"], d, p["width"])
    torque = holding_torque_n_mm(least_p, p["friction"], d, p["width"])
    heated = outer if p["assembly"] == "heat" else inner
    delta_t = assembly_delta_t_k(max(hi_um, 0.0) / 1000, p["assembly_clearance"], d, heated)
    result = RingFit(
        seat=seat, material=material, body_material=body, fit=fit, fit_text=fit_text, limits=limits, interface_mm=d,
        ring_diameters_mm=ring_d, body_diameters_mm=body_d, ring_is_inner=ring_is_inner, length_mm=p["width"],
        interference_um=(lo_um, hi_um), coating_growth_um=1000 * growth,
        interference_hot_um=(lo_um + hot, hi_um + hot), interference_cold_um=(lo_um + cold, hi_um + cold),
        contact_pressure_mpa=pressure, worst=worst,
        bore_change_um=1000 * bore_change_mm(worst.pressure_mpa, ring_m) if ring_is_inner else 0.0,
        body_von_mises_mpa=body_s.von_mises_mpa,
        ring_von_mises_mpa=ring_s.von_mises_mpa,
        hoop_stress_body_mpa=max((s.hoop_mpa for s in body_hoop), key=abs),
        hoop_stress_ring_mpa=max((s.hoop_mpa for s in ring_hoop), key=abs),
        safety_factor_body=sf_body, safety_factor_ring=sf_ring, least_pressure_mpa=least_p, friction=p["friction"],
        hold_force_n=force, hold_torque_n_mm=torque, assembly=p["assembly"], assembly_delta_t_k=delta_t,
        hot_c=p["hot"], cold_c=p["cold"])
    sf = p["safety_factor"]
    # the fit holds worst at its least interference, at whichever temperature of the range takes most of it
    at_c = {lo_um: REFERENCE_TEMPERATURE_C, lo_um + hot: p["hot"], lo_um + cold: p["cold"]}[least]
    at_least = f"{least_p:.1f} MPa (the least interference, {least:.1f} µm at {at_c:g} °C)"
    checks = [
        check("ring fit is an interference fit", f"{NAME}.fit", lo_um > 0,
              f"interference {lo_um:.1f} to {hi_um:.1f} µm at {REFERENCE_TEMPERATURE_C:g} °C"),
        check("ring holds when hot", f"{NAME}.fit", lo_um + hot > 0,
              f"least interference {lo_um + hot:.1f} µm at {p['hot']:g} °C"),
        check("ring holds when cold", f"{NAME}.fit", lo_um + cold > 0,
              f"least interference {lo_um + cold:.1f} µm at {p['cold']:g} °C"),
        check("ring seat stress in the body", f"{NAME}.fit", sf_body >= sf,
              f"{body.name} yield {body.yield_mpa:g} MPa over von Mises {body_s.von_mises_mpa:.1f} MPa = {sf_body:.2f}, "
              f"least {sf:g}"),
        check("ring stress", f"{NAME}.thickness", sf_ring >= sf,
              f"{material.name} yield {material.yield_mpa:g} MPa over von Mises {ring_s.von_mises_mpa:.1f} MPa = "
              f"{sf_ring:.2f}, least {sf:g}"),
        check("ring holds the axial force", f"{NAME}.width", force >= p["hold_force"],
              f"{force:.0f} N at μ {p['friction']:g} and {at_least}, least {p['hold_force']:g} N"),
        check("ring holds the torque", f"{NAME}.width", torque >= p["hold_torque"],
              f"{torque / 1000:.2f} N·m at μ {p['friction']:g} and {at_least}, least {p['hold_torque'] / 1000:g} N·m"),
        check("ring assembly temperature difference", f"{NAME}.assembly_clearance", delta_t <= p["max_delta_t"],
              f"{result.heated_or_cooled()} by {delta_t:.0f} K to clear {p['assembly_clearance'] * 1000:.0f} µm, "
              f"at most {p['max_delta_t']:g} K"),
    ]
    return result, checks


def groove_wall_clearance_mm(fit: RingFit, groove_mm: float) -> float:
    """Least diametral clearance (mm) between a face-seat ring's bore and the groove's inner wall: the bore
    at its lower limit (``BORE_LIMITS``), shrunk by the pressure of the largest interference
    (``fit.bore_change_um``), over the wall at its upper limit (``GROOVE_WALL_LIMITS``)."""
    bore = fit.ring_diameters_mm[0] + (BORE_LIMITS.lower_um + fit.bore_change_um) / 1000
    return bore - (groove_mm + GROOVE_WALL_LIMITS.upper_um / 1000)


def _groove_wall_check(fit: RingFit, groove_mm: float) -> Check:
    least = groove_wall_clearance_mm(fit, groove_mm)
    return check("ring bore clears the groove's inner wall", f"{NAME}.groove_clearance", least > 0,
                 f"ring bore Ø{fit.ring_diameters_mm[0]:.3f} at least, shrunk {-fit.bore_change_um:.1f} µm when "
                 f"pressed, over the groove's inner wall Ø{groove_mm:.3f} at most: least clearance "
                 f"{least * 1000:.1f} µm on the diameter")


def _finite(x: float) -> float | None:
    return x if math.isfinite(x) else None  # no stress at all: JSON has no infinity


def ring_summary(fit: RingFit) -> dict[str, Any]:
    """The ``ring`` object of the check JSON (see the README)."""
    def props(m: Material) -> dict[str, Any]:
        return {"name": m.name, "e_gpa": m.e_gpa, "poisson": m.poisson, "alpha_per_k": m.alpha_per_k,
                "yield_mpa": m.yield_mpa, "density_g_cm3": m.density_g_cm3}

    return {
        "seat": fit.seat, "material": fit.material.name, "fit": fit.fit_text,
        "interface_diameter_mm": fit.interface_mm, "ring_diameters_mm": list(fit.ring_diameters_mm),
        "body_diameters_mm": list(fit.body_diameters_mm), "length_mm": fit.length_mm,
        "seat_deviation_um": [fit.seat_limits.upper_um, fit.seat_limits.lower_um],
        "ring_deviation_um": [fit.ring_limits.upper_um, fit.ring_limits.lower_um],
        "interference_um": list(fit.interference_um), "coating_growth_um": fit.coating_growth_um,
        "interference_hot_um": list(fit.interference_hot_um), "interference_cold_um": list(fit.interference_cold_um),
        "hot_c": fit.hot_c, "cold_c": fit.cold_c,
        "contact_pressure_mpa": list(fit.contact_pressure_mpa), "worst_pressure_mpa": fit.worst.pressure_mpa,
        "bore_change_um": fit.bore_change_um,
        "hoop_stress_body_mpa": fit.hoop_stress_body_mpa, "hoop_stress_ring_mpa": fit.hoop_stress_ring_mpa,
        "von_mises_body_mpa": fit.body_von_mises_mpa, "von_mises_ring_mpa": fit.ring_von_mises_mpa,
        "safety_factor": _finite(fit.safety_factor), "safety_factor_body": _finite(fit.safety_factor_body),
        "safety_factor_ring": _finite(fit.safety_factor_ring),
        "friction": fit.friction, "hold_force_n": fit.hold_force_n, "hold_torque_n_mm": fit.hold_torque_n_mm,
        "assembly": fit.heated_or_cooled(), "assembly_delta_t_k": fit.assembly_delta_t_k,
        "body_material": props(fit.body_material), "ring_material": props(fit.material),
    }
