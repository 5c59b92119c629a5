"""Bill of materials and stock: what to buy for N yo-yos, with the scrap a production lot expects.

Per yo-yo: two turned halves (and any parts pressed into them), one bearing, two
response pads and the axle, bought as a set screw (ISO 4026 for a metric thread,
ASME B18.3 for an inch one). The set screw is the standard length nearest the
axle the mass budget assumes among those that fit into both halves' full threads
and engage each by at least the material's thread engagement. Each half is turned from round bar: the next stocked diameter at or
above the outer diameter plus ``shop.stock_turning_allowance``, cut to the half's
length plus ``shop.stock_facing_allowance`` and ``shop.stock_parting_allowance``; a part pressed into it
(a ring) from tube of the next stocked diameter above its own, bored to its bore less the same allowance.
The halves to turn for N good yo-yos follow from a lot of the design
(:func:`yodraft.lot.run_lot`, fixed seed): N divided by the good yo-yos per half.
"""
from __future__ import annotations

import math
from collections.abc import Mapping
from dataclasses import dataclass
from typing import Any

from .analysis import analyse
from .builder import Resolved
from .catalog.bar_stock import next_bar_diameter
from .catalog.setscrews import INCH_STANDARD, inch_length, standard_lengths, standard_of
from .parts import Part

__all__ = ["BomItem", "SetScrew", "Stock", "Bom", "choose_set_screw", "bar_stock", "part_stock", "bill_of_materials",
           "bom_data", "bom_text", "LEAST_TUBE_BORE_MM", "DEFAULT_UNITS", "SCRAP_LOT_HALVES", "SCRAP_LOT_SEED"]

DEFAULT_UNITS = 100
#: the lot that sets the expected scrap: this many halves, this seed
SCRAP_LOT_HALVES = 10_000
SCRAP_LOT_SEED = 1


@dataclass(frozen=True)
class BomItem:
    """One line of the bill: what, how many for the whole order, and a description to buy it by."""

    name: str
    quantity: int
    description: str


@dataclass(frozen=True)
class SetScrew:
    """The axle as a set screw: thread, chosen length (None when no standard length fits) and why."""

    standard: str
    thread: str
    length_mm: float | None
    lengths_mm: tuple[float, ...]
    least_mm: float
    most_mm: float
    wanted_mm: float


@dataclass(frozen=True)
class Stock:
    """The bar one part is turned from: diameter, length, mass bought, mass kept in the finished part.

    ``bore_mm`` is, for a ring, the largest bore of a tube of that outside diameter it can be turned from
    (the mass bought is then the tube's); None for a part turned from solid bar.
    """

    material: str
    bar_diameter_mm: float | None
    length_mm: float
    mass_g: float | None
    kept_g: float
    bore_mm: float | None = None
    #: the least bar diameter the part needs: its outer diameter plus the turning allowance
    least_mm: float = 0.0


@dataclass(frozen=True)
class Bom:
    """The bill for ``units`` good yo-yos."""

    units: int
    items: tuple[BomItem, ...]
    stock: Stock
    axle: SetScrew
    #: the bar each part pressed into a half (a ring) is turned from, by part name, in the half's order
    part_stocks: tuple[tuple[str, Stock], ...]
    halves: int | None
    good_per_half: float
    lot_halves: int
    lot_seed: int


def choose_set_screw(thread: str, spacing_mm: float, thread_depth_mm: float, engagement_mm: float,
                     wanted_mm: float) -> SetScrew:
    """The set-screw length nearest ``wanted_mm`` that engages both halves' threads fully (``standard_lengths``).

    It must reach at least ``engagement_mm`` into each half's thread and no further than the full thread
    (``thread_depth_mm``), across the post spacing: spacing + 2 × engagement ≤ L ≤ spacing + 2 × thread depth.

    >>> choose_set_screw("M4x0.7", 1.0, 8.0, 6.0, 15.6).length_mm
    16.0
    """
    least, most = spacing_mm + 2 * engagement_mm, spacing_mm + 2 * thread_depth_mm
    lengths = standard_lengths(thread)
    fitting = [x for x in lengths if least - 1e-9 <= x <= most + 1e-9]
    length = min(fitting, key=lambda x: (abs(x - wanted_mm), x)) if fitting else None
    return SetScrew(standard_of(thread), thread, length, lengths, least, most, wanted_mm)


def bar_stock(resolved: Resolved, kept_g: float) -> Stock:
    """The bar a half's body is turned from, with the shop's allowances (``[shop]`` stock_* keys)."""
    return part_stock(resolved.parts[0], resolved.design["shop"], kept_g)


#: the least bore (mm) worth buying a ring's tube with; a smaller one is turned from solid bar  # common practice,
#: no published source
LEAST_TUBE_BORE_MM = 5.0


def part_stock(part: Part, shop: Mapping[str, Any], kept_g: float, tube: bool = False) -> Stock:
    """The stock one part (a half's body, a ring pressed into it) is turned from: round bar of the next stocked
    diameter at or above its outer diameter plus the turning allowance, its length plus the facing and parting
    allowances. ``tube``: a part with a bore (a ring) from tube of that outside diameter, whose bore is the part's
    less the same allowance, down to the whole millimetre."""
    z_min, r_min, z_max, r_max = part.profile.bounds()
    allowance = shop["stock_turning_allowance"]
    diameter = next_bar_diameter(2 * r_max + allowance)
    length = (z_max - z_min) + shop["stock_facing_allowance"] + shop["stock_parting_allowance"]
    bore = float(math.floor(2 * r_min - allowance + 1e-9)) if tube else 0.0
    bore_mm = bore if bore >= LEAST_TUBE_BORE_MM else None
    mass = (None if diameter is None else
            math.pi / 4 * (diameter**2 - (bore_mm or 0.0) ** 2) * length * part.density_g_cm3 / 1000)
    return Stock(part.material, diameter, length, mass, kept_g, bore_mm, 2 * r_max + allowance)


def bill_of_materials(resolved: Resolved, units: int = DEFAULT_UNITS, *, lot_halves: int = SCRAP_LOT_HALVES,
                      lot_seed: int = SCRAP_LOT_SEED) -> Bom:
    """The bill for ``units`` good yo-yos of ``resolved`` (its half must be analysable)."""
    from .lot import lot_summary, run_lot

    v = resolved.values
    a = analyse(resolved)
    body = next(props for name, _, props in a.parts) if a.parts else a.half
    stock = bar_stock(resolved, body.mass_g)
    shop = resolved.design["shop"]
    part_stocks = tuple((part.name, part_stock(part, shop, props.mass_g, tube=True))
                        for part, (_, _, props) in zip(resolved.parts[1:], a.parts[1:]))
    need = v["material.engagement_factor"] * v["axle_bore.major_diameter"]
    axle = choose_set_screw(v["axle_bore.thread"], v["bearing_seat.spacing"], v["axle_bore.thread_depth"], need,
                            a.axle_length_mm)
    lot = lot_summary(run_lot(resolved.design, units=lot_halves, seed=lot_seed, exact_sample=0, resolved=resolved))
    good_per_half = lot["good_yoyos_per_half"]
    halves = math.ceil(units / good_per_half - 1e-9) if good_per_half > 0 else None
    pad = resolved.features["pad_groove"].extra["pad"]
    shown = "—" if halves is None else str(halves)
    bar = _bar(stock)
    items = [
        BomItem("half", halves or 0,
                f"{stock.material} half turned from {bar} bar, {stock.length_mm:.1f} mm a half; {shown} halves for "
                f"{units} good yo-yos (a lot of {lot_halves} halves gives {good_per_half:.3f} good yo-yos a half)"),
    ]
    for part in resolved.parts[1:]:
        items.append(BomItem(part.name, halves or 0, f"{part.material} {part.name}, one in each half"))
    designation = v["bearing.designation"]
    size = resolved.design["bearing"]["size"]
    if size and size != designation and resolved.design["bearing"]["bore"] is None:
        designation = f"{designation}, size {size}"
    items += [
        BomItem("bearing", units, f"{designation} ({v['bearing.bore']:.3f} × {v['bearing.od']:.3f} × "
                                  f"{v['bearing.width']:.4f} mm), class {v['bearing.precision']}"),
        BomItem("response pad", 2 * units, f"{pad.name} pad class: Ø{pad.pad_diameter_mm:g} mm outside, "
                                           f"Ø{v['pad_groove.inner_diameter']:g} mm inside, "
                                           f"{v['pad_groove.pad_thickness']:g} mm thick") if pad is not None else
        BomItem("silicone", 2 * units, f"response silicone filled flush in the recess, "
                                       f"{v['pad_groove.silicone_density'] * _recess_volume_mm3(v) / 1000:.3f} g each"),
        BomItem("axle", units, _axle_text(axle)),
    ]
    if halves is not None:
        items.append(BomItem("bar stock", halves, _bar_line(stock, bar, halves, "")))
        for name, part_bar in part_stocks:
            items.append(BomItem(f"{name} stock", halves,
                                 _bar_line(part_bar, _bar(part_bar), halves, f" for the {name}s")))
    return Bom(units, tuple(items), stock, axle, part_stocks, halves, good_per_half, lot_halves, lot_seed)


def _bar(stock: Stock) -> str:
    """The bar's diameter as ordered, or the least it must be when that is above every stocked size."""
    if stock.bar_diameter_mm is not None:
        return f"Ø{stock.bar_diameter_mm:g} mm"
    return f"Ø{stock.least_mm:.1f} mm or more (above the stocked sizes held)"


def _bar_line(stock: Stock, bar: str, pieces: int, what: str) -> str:
    """A stock line: the bar (or tube), the pieces and their length, the total length and mass to order."""
    mass = "" if stock.mass_g is None else f", {pieces * stock.mass_g / 1000:.2f} kg"
    kind = (f"tube{what}, Ø{stock.bore_mm:g} mm bore or less (or {bar} round bar)" if stock.bore_mm is not None
            else f"round bar{what}")
    return (f"{bar} {stock.material} {kind}, {pieces} pieces of {stock.length_mm:.1f} mm: "
            f"{pieces * stock.length_mm / 1000:.2f} m{mass}")


def _axle_text(axle: SetScrew) -> str:
    if axle.length_mm is not None:
        if axle.standard == INCH_STANDARD:  # ordered by its fractional-inch length
            return (f"set screw {axle.standard} {axle.thread} × {inch_length(axle.length_mm)} "
                    f"({axle.length_mm:.3f} mm), flat point")
        return f"set screw {axle.standard} {axle.thread} × {axle.length_mm:g}, flat point"
    need = f"needs {axle.least_mm:.1f} to {axle.most_mm:.1f} mm"
    if not axle.lengths_mm:
        return f"set screw {axle.thread}: a thread with no stocked set-screw lengths held; {need}"
    return f"set screw {axle.thread}: no {axle.standard} length fits; {need}"


def bom_data(bom: Bom) -> dict[str, Any]:
    """The ``bom --json`` object (see the README for every key)."""
    s = bom.stock
    halves = bom.halves
    return {
        "units": bom.units,
        "items": [{"name": i.name, "quantity": i.quantity, "description": i.description} for i in bom.items],
        "stock": _stock_data(s),
        "part_stock": [{"part": name, **_stock_data(p), "tube_bore_mm": p.bore_mm,
                        "total_length_mm": None if halves is None else halves * p.length_mm,
                        "total_mass_g": None if halves is None or p.mass_g is None else halves * p.mass_g}
                       for name, p in bom.part_stocks],
        "axle": {"standard": bom.axle.standard, "thread": bom.axle.thread, "length_mm": bom.axle.length_mm,
                 "standard_lengths_mm": list(bom.axle.lengths_mm), "least_mm": bom.axle.least_mm,
                 "most_mm": bom.axle.most_mm, "wanted_mm": bom.axle.wanted_mm},
        "lot": {"halves": bom.lot_halves, "seed": bom.lot_seed, "good_yoyos_per_half": bom.good_per_half,
                "scrap_share": 1 - 2 * bom.good_per_half},
        "totals": {"halves": halves,
                   "bar_length_mm": None if halves is None else halves * s.length_mm,
                   "bar_mass_g": None if halves is None or s.mass_g is None else halves * s.mass_g,
                   "kept_mass_g": 2 * bom.units * s.kept_g},
    }


def _stock_data(s: Stock) -> dict[str, Any]:
    """One part's bar as JSON: material, diameter, length, mass bought and kept in the finished part."""
    return {"material": s.material, "bar_diameter_mm": s.bar_diameter_mm, "length_mm": s.length_mm,
            "mass_g": s.mass_g, "kept_g": s.kept_g, "kept_share": None if not s.mass_g else s.kept_g / s.mass_g}


def bom_text(data: dict[str, Any]) -> str:
    """The bill as terminal text."""
    width = max(len(i["name"]) for i in data["items"])
    lines = [f"bill of materials for {data['units']} good yo-yos"]
    lines += [f"  {i['quantity']:>8}  {i['name']:<{width}}  {i['description']}" for i in data["items"]]
    s, t = data["stock"], data["totals"]
    for what, bar in [("half", s)] + [(p["part"], p) for p in data["part_stock"]]:
        if bar["mass_g"] is not None:
            kind = f"tube Ø{bar['bar_diameter_mm']:g}/Ø{bar['tube_bore_mm']:g}" if bar.get("tube_bore_mm") else \
                f"bar Ø{bar['bar_diameter_mm']:g}"
            lines.append(f"  stock per {what}: {bar['material']} {kind} × {bar['length_mm']:.1f} mm, "
                         f"{bar['mass_g']:.1f} g bought, {bar['kept_g']:.1f} g kept ({100 * bar['kept_share']:.0f} %)")
    if t["bar_mass_g"] is not None:
        lines.append(f"  to order: {t['halves']} halves' bar, {t['bar_length_mm'] / 1000:.2f} m, "
                     f"{t['bar_mass_g'] / 1000:.2f} kg; {t['kept_mass_g'] / 1000:.2f} kg in the finished halves")
    for p in data["part_stock"]:
        if p["total_mass_g"] is not None:
            lines.append(f"  to order for the {p['part']}s: {t['halves']} pieces, {p['total_length_mm'] / 1000:.2f} m, "
                         f"{p['total_mass_g'] / 1000:.2f} kg")
    lot = data["lot"]
    lines.append(f"  scrap from a lot of {lot['halves']} halves (seed {lot['seed']}): {100 * lot['scrap_share']:.1f} % "
                 "of halves turned do not end in a good yo-yo")
    return "\n".join(lines) + "\n"


def _recess_volume_mm3(v: Any) -> float:
    """Volume of one silicone response recess (an annulus of the recess's depth), mm³."""
    return math.pi / 4 * (v["pad_groove.outer_diameter"] ** 2 - v["pad_groove.inner_diameter"] ** 2) * v["pad_groove.depth"]
