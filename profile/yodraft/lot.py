"""A production lot before the first chip: every half drawn within its tolerances, then fits, gap, mass and balance.

Each half of the lot takes every toleranced dimension within its band: the
post and the wall bore within the machine tolerance, the wall offset and the
post length within the tolerances the gap tolerance gives them, every other
dimension within the design's ISO 2768-1 general tolerance class, the coating
thickness within its range and the density within the material's spread. Each half also meets a bearing whose
bore, outside diameter and width lie within its ISO 492 class, and its
surfaces sit off the axle axis within the drawing's circular runout. By
default every band is ±3σ of a normal spread about its middle; ``uniform``
spreads each evenly over its band instead.

The mass and Izz of a half follow from the exact model linearised about the
nominal design: each dimension's sensitivity is a central difference of two
real rebuilds (builder.build and the exact mass integrals), and the lot is
evaluated on that linear model as NumPy arrays (under the normal spread, the
dimensions that move only the mass and Izz are drawn as the one joint normal
effect they have on the linear model, and the two setups' offsets as one normal
unbalance on each axis). A sample of halves, drawn dimension by
dimension, is rebuilt exactly to measure how far the linear model is off
(``linearisation_error``); a sampled half whose drawn sizes the builder refuses
is counted as not rebuilt, with the first reason.
Fit clearances, the gap and the unbalance are linear in the drawn values and
are worked out exactly.

Assembly: the halves whose post takes the bearing and whose wall bore clears it
are sorted by mass and neighbours within ``pair_window`` are paired; each pair
is assembled with the bearing the lighter half met. A yo-yo is good when its
gap lies within nominal ± ``gap_tolerance`` and its static unbalance within the
permissible value of the design's ISO 21940-11 grade. The gap, mass and
unbalance distributions are those of a random assembly (halves 2k and 2k+1).
The halves are drawn in blocks, each from a random stream of its own, on every core. The same seed gives
the same lot, however many cores draw it.
"""
from __future__ import annotations

import math
import os
import threading
from collections.abc import Callable, Mapping, Sequence
from dataclasses import dataclass, field
from typing import Any

import numpy as np

from .analysis import analyse, part_props
from .balance import permissible_specific_unbalance_mm
from .builder import BuildMemo, Resolved, build, compose, judge_many, loop_chunks
from .design import Design, with_values
from .errors import YodraftError
from .features import FEATURES
from .massprops import combine_bodies
from .tails import percentiles
from .tolerances.bearings import bearing_deviation_um
from .tolerances.general import angle_tolerance_rad, general_tolerance_mm, radius_tolerance_mm

__all__ = ["Band", "LotResult", "lot_bands", "run_lot", "pair_by_mass", "lot_summary", "lot_text", "lot_csv", "lot_svg",
           "DISTRIBUTIONS",
           "DEFAULT_UNITS", "DEFAULT_SEED", "DEFAULT_PAIR_WINDOW_G", "DEFAULT_MASS_WINDOW_G", "MAX_UNITS"]

DISTRIBUTIONS = ("normal", "uniform")
DEFAULT_UNITS = 1000
MAX_UNITS = 10_000_000
DEFAULT_SEED = 1
#: halves are weighed and matched within this mass difference  # common practice, no published source
DEFAULT_PAIR_WINDOW_G = 0.1
#: an assembled yo-yo is on weight within this of the target  # common practice, no published source
DEFAULT_MASS_WINDOW_G = 1.0
#: ± share of the catalog density a bar of wrought alloy may differ by  # common practice, no published source
DENSITY_SPREAD = 0.005
#: halves rebuilt exactly to measure the linearisation error
EXACT_SAMPLE = 48
#: halves drawn per block (the draws depend on the block size, so it is fixed)
BLOCK = 1 << 15
#: halves worked out together within a block (a piece's arrays fit in a core's cache)
PIECE = 8192
#: feature keys that are assembled sizes: a half is dimensioned with half of each
_ASSEMBLED = {"rim.overall_width"}


@dataclass(frozen=True)
class Band:
    """One drawn quantity: design key, nominal, the band's middle offset from it and its ± half width, and its basis."""

    key: str
    nominal: float
    centre: float
    half: float
    basis: str


@dataclass(frozen=True, eq=False)
class LotResult:
    """A drawn lot: settings, the nominal figures, per-half and per-yo-yo arrays, and what was measured."""

    design_name: str
    units: int
    seed: int
    distribution: str
    pair_window_g: float
    mass_window_g: float
    target_mass_g: float
    target_is_nominal: bool
    gap_nominal_mm: float
    gap_tolerance_mm: float
    gap_tolerance_basis: str
    gap_rss_mm: tuple[float, float]
    permissible_unbalance_g_mm: float
    nominal_total_g: float
    bands: tuple[Band, ...]
    skipped: tuple[str, ...]
    half: Mapping[str, np.ndarray] = field(repr=False)
    random_pairs: Mapping[str, np.ndarray] = field(repr=False)
    pairs: tuple[np.ndarray, np.ndarray] = field(repr=False)
    pair_good: np.ndarray = field(repr=False)
    linearisation: Mapping[str, float] = field(default_factory=dict)
    #: the statistics of the halves' and the random pairs' distributions (``_distributions``), worked out while
    #: the halves were paired; empty when they are to be worked out from the arrays
    distributions: Mapping[str, Any] = field(default_factory=dict, repr=False)


class _Background:
    """``fn(item)`` for every item, on up to ``workers`` threads taking the next item in turn, while the caller's
    thread goes on (NumPy lets go of the interpreter while it fills or sorts an array); ``join()`` waits for them
    and raises the first error one of them met."""

    def __init__(self, fn: Callable[[Any], Any], items: Sequence[Any], workers: int) -> None:
        self._items = iter(list(enumerate(items)))
        self._lock = threading.Lock()
        self.results: list[Any] = [None] * len(items)
        self._errors: list[BaseException] = []
        self._fn = fn
        self._threads = [threading.Thread(target=self._work, daemon=True) for _ in range(max(1, min(workers, len(items))))]
        for t in self._threads:
            t.start()

    def _work(self) -> None:
        while not self._errors:
            with self._lock:
                item = next(self._items, None)
            if item is None:
                return
            try:
                self.results[item[0]] = self._fn(item[1])
            except BaseException as exc:  # raised again by join, in the caller's thread
                self._errors.append(exc)

    def join(self) -> list[Any]:
        for t in self._threads:
            t.join()
        if self._errors:
            raise self._errors[0]
        return self.results


def _gap_tolerance(resolved: Resolved) -> tuple[float, str]:
    """The ± on the gap the design asks for (``features.bearing_seat.gap_tolerance``) and where it comes from."""
    given = resolved.design.is_given("features.bearing_seat.gap_tolerance")
    return resolved["bearing_seat.gap_tolerance"], ("features.bearing_seat.gap_tolerance" if given else
                                                    "features.bearing_seat.gap_tolerance (default)")


def _coating_band(resolved: Resolved) -> tuple[float, float, str]:
    """(middle offset from ``shop.coating_thickness``, ±, basis) of the coating thickness in mm.

    The range runs from ``coating_thickness`` (its thin end) to ``coating_thickness_max``; the finished seat
    sizes are those at the middle of the range. Without a range the thickness does not scatter.
    """
    shop = resolved.design["shop"]
    t0, thick = shop["coating_thickness"], shop["coating_thickness_max"]
    if thick is None or not thick > t0:
        return 0.0, 0.0, "shop.coating_thickness (no range given)"
    return (thick - t0) / 2, (thick - t0) / 2, "shop.coating_thickness to shop.coating_thickness_max"


def _free_angle(resolved: Resolved) -> bool:
    """Whether the catch-zone angle (not the rim band width) is the drawn dimension."""
    return resolved.design.features["catch_zone"]["angle"] is not None and resolved.design.features["rim"]["band_width"] is None


#: the bearing seat's own sizes, each drawn within its band in every lot even where its nominal is 0
_SEAT_LINKS = ("bearing_seat.post_diameter", "bearing_seat.wall_bore", "bearing_seat.wall_offset",
               "bearing_seat.spacing")


def _dimension_bands(resolved: Resolved) -> tuple[list[Band], list[str]]:
    """Every length and angle of every feature, pinned at its resolved value, with its tolerance band."""
    v = resolved.values
    cls = resolved.design["shop"]["general_tolerance"]
    machine = resolved.design["shop"]["machine_tolerance"]
    gap_tol, gap_basis = _gap_tolerance(resolved)
    free_angle = _free_angle(resolved)
    bands: list[Band] = []
    skipped: list[str] = []
    for name, module in FEATURES.items():
        dims = resolved.features[name].dims
        for spec in module.PARAMS:
            if spec.kind not in ("length", "angle") or spec.name.endswith("tolerance"):
                continue
            short = f"{name}.{spec.name}"
            key = f"features.{short}"
            value = dims.get(spec.name)
            if short == "rim.band_width" and not free_angle:
                value = v["catch_zone.rim_width"]
            if short == "catch_zone.land" or (short == "catch_zone.angle" and not free_angle) or (
                    short == "rim.band_width" and free_angle):
                continue  # follows from a dimension drawn instead (start diameter, rim band or angle)
            if not isinstance(value, float) or (value == 0.0 and short not in _SEAT_LINKS):
                continue  # absent (no hub, no radius); a seat link of 0 (a wall face flush with the seat face) is a size
            if short in ("bearing_seat.post_diameter", "bearing_seat.wall_bore"):
                bands.append(Band(key, value, 0.0, machine, "shop.machine_tolerance"))
            elif short == "bearing_seat.wall_offset":
                bands.append(Band(key, value, 0.0, v["bearing_seat.wall_offset_tolerance"],
                                  "features.bearing_seat.wall_offset_tolerance"))
            elif short == "bearing_seat.spacing":  # the half is dimensioned by its post length
                bands.append(Band(key, value, 0.0, 2 * v["bearing_seat.post_length_tolerance"],
                                  "twice features.bearing_seat.post_length_tolerance"))
            elif spec.kind == "angle":
                if short == "catch_zone.angle":
                    run = v["rim.diameter"] / 2 - v["catch_zone.start_diameter"] / 2
                else:
                    run = v["rim.cup_diameter"] / 2 - v["rim.floor_diameter"] / 2
                leg = max(run, 1e-3) / max(math.cos(value), 1e-3)
                bands.append(Band(key, value, 0.0, angle_tolerance_rad(cls, leg), f"{cls} angles"))
            else:
                size = value / 2 if short in _ASSEMBLED else value
                radius = spec.name.endswith("radius")
                tol = radius_tolerance_mm(cls, size) if radius else general_tolerance_mm(cls, size)
                if tol is None:  # ISO 2768-1 covers 0.5 mm and up
                    skipped.append(key)
                    continue
                bands.append(Band(key, value, 0.0, tol * (2 if short in _ASSEMBLED else 1),
                                  f"{cls} {'radii' if radius else 'linear sizes'}"))
    for i, point in enumerate(resolved.design.features.get("shape", {}).get("points") or ()):
        for name in ("z", "r", "radius", "arc_radius"):  # a sketch's own sizes, each from its anchor
            value = point.get(name)
            if not isinstance(value, float) or value == 0.0:
                continue  # on its anchor, or no radius
            key = f"features.shape.points[{i}].{name}"
            radius = name != "z" and name != "r"
            tol = radius_tolerance_mm(cls, value) if radius else general_tolerance_mm(cls, abs(value))
            if tol is None:
                skipped.append(key)
                continue
            bands.append(Band(key, value, 0.0, tol, f"{cls} {'radii' if radius else 'linear sizes'}"))
    return bands, skipped


def _race_band(key: str, nominal: float, deviation_um: tuple[float, float], basis: str) -> Band:
    upper, lower = deviation_um
    return Band(key, nominal, (upper + lower) / 2000, (upper - lower) / 2000, basis)


def lot_bands(resolved: Resolved) -> tuple[tuple[Band, ...], tuple[Band, ...], tuple[str, ...]]:
    """(the dimensions of the half, the other drawn quantities, keys left undrawn) of a resolved design."""
    dims, skipped = _dimension_bands(resolved)
    v = resolved.values
    precision = v["bearing.precision"]
    c_mid, c_half, c_basis = _coating_band(resolved)
    other = (
        _race_band("bearing.bore", v["bearing.bore"], v["bearing.bore_deviation_um"], f"bearing class {precision}"),
        _race_band("bearing.od", v["bearing.od"], v["bearing.od_deviation_um"], f"bearing class {precision}"),
        _race_band("bearing.width", v["bearing.width"], bearing_deviation_um(precision, "width", v["bearing.bore"]),
                   f"bearing class {precision} (ISO 492 width)"),
        Band("shop.coating_thickness", resolved.design["shop"]["coating_thickness"], c_mid, c_half, c_basis),
        Band("design.density", v["material.density_g_cm3"], 0.0, DENSITY_SPREAD * v["material.density_g_cm3"],
             f"±{DENSITY_SPREAD:.1%} of the density, common practice"),
    )
    return tuple(dims), other, tuple(skipped)


def _pinned(design: Design, values: Mapping[str, float]) -> Design:
    """The design with each key set to a value (mm, rad): ``features.<feature>.<param>`` keys, and the sizes of
    a sketch's points as ``features.shape.points[i].<size>``."""
    return with_values(design, [(key, float(value)) for key, value in values.items()])


def _unit_props(design: Design, memo: BuildMemo | None = None) -> tuple[float, float] | None:
    """(mass, Izz) of one half (every part with its catalog density), or None when it cannot be integrated."""
    return _units_props([design], memo)[0]


def _units_props(designs: Sequence[Design], memo: BuildMemo | None = None,
                 refusals: list[str] | None = None) -> list[tuple[float, float] | None]:
    """``_unit_props`` of many halves, their loops judged together (``builder.judge_many``).

    Built verdict-only: the mass needs the loop and the checks it rests on, not the least wall's size or the
    re-entrant regions. A half whose drawn sizes the builder refuses (a sketch point that a bore at the edge
    of its band reaches past) cannot be integrated either: it is None, like a half whose loop fails, and the
    builder's reason is added to ``refusals``."""
    memo = memo if memo is not None else BuildMemo()
    composed: list[Any] = []
    for d in designs:
        try:
            composed.append(compose(d, memo))
        except (YodraftError, ValueError) as exc:
            composed.append(exc)
    out: list[tuple[float, float] | None] = []
    for resolved in judge_many(composed):
        if isinstance(resolved, Exception) and refusals is not None:
            refusals.append(str(resolved))
        if isinstance(resolved, Exception) or not resolved.can_analyse:
            out.append(None)
            continue
        props = combine_bodies([props for _, _, props in part_props(resolved)])
        out.append((props.mass_g, props.izz_g_mm2))
    return out


def _sensitivities(design: Design, dims: Sequence[Band]) -> np.ndarray:
    """d(mass, Izz)/d(dimension) by central differences of real rebuilds, shape (2, len(dims))."""
    base = {b.key: b.nominal for b in dims}
    out = np.zeros((2, len(dims)))
    memo = BuildMemo()  # the features a dimension does not reach are resolved once
    # every dimension's first pair of rebuilds at once; a smaller step only where one of them fails
    first = iter(_units_props([_pinned(design, {**base, b.key: b.nominal + h}) for b in dims for h in (b.half, -b.half)],
                              memo))
    nominal = None
    for k, b in enumerate(dims):
        for step, h in enumerate((b.half, b.half / 8, b.half / 64)):
            if step == 0:
                plus, minus = next(first), next(first)
            else:
                plus = _unit_props(_pinned(design, {**base, b.key: b.nominal + h}), memo)
                minus = _unit_props(_pinned(design, {**base, b.key: b.nominal - h}), memo)
            if plus is not None and minus is not None:
                out[:, k] = (np.asarray(plus) - np.asarray(minus)) / (2 * h)
                break
            if plus is not None or minus is not None:  # a design at the edge of a rule: a one-sided difference
                if nominal is None:
                    nominal = _unit_props(_pinned(design, base), memo)
                if nominal is not None:
                    side, sign = (plus, 1.0) if plus is not None else (minus, -1.0)
                    out[:, k] = sign * (np.asarray(side) - np.asarray(nominal)) / h
                    break
        else:
            raise ValueError(f"{b.key} ± {b.half:g} breaks the half-profile; the lot cannot be drawn")
    return out


def _joint_factor(effects: np.ndarray) -> np.ndarray:
    """F with F Fᵀ = effects effectsᵀ (2 × 2): two unit normals through F give the joint normal effect of many.

    >>> f = _joint_factor(np.array([[3.0, 4.0], [0.0, 0.0]]))
    >>> np.allclose(f @ f.T, [[25.0, 0.0], [0.0, 0.0]])
    True
    """
    values, vectors = np.linalg.eigh(effects @ effects.T)
    return vectors * np.sqrt(np.clip(values, 0.0, None))


def _chunk_moment(resolved: Resolved, feature: str, chunk: str) -> float:
    """π ∫ r² n_r ds over a chunk's sharp-cornered outline up to the next chunk (mm³): the first moment a unit
    sideways offset of those surfaces adds, per unit density (divided by 1000 in g·mm per mm)."""
    order = loop_chunks(resolved.features)
    i = order.index((feature, chunk))
    nxt = order[(i + 1) % len(order)]
    pts = [v.point for v in resolved.features[feature].chunks[chunk]] + [resolved.features[nxt[0]].chunks[nxt[1]][0].point]
    total = 0.0
    for (z0, r0), (z1, r1) in zip(pts, pts[1:]):
        total -= math.pi * (z1 - z0) * (r0 * r0 + r0 * r1 + r1 * r1) / 3
    return total


def _mass_order(mass: np.ndarray) -> np.ndarray:
    """``np.argsort(mass, kind="stable")``, in about a fifth of its time for a lot's positive masses: their bit patterns
    (in the order of the masses, for positive numbers), less the lightest's and cut to their top 32 bits of
    spread, are put in order by two stable radix sorts of 16 bits each (ties stay in index order), then the few
    neighbours that share a cut key are put in order by mass.

    >>> _mass_order(np.array([3.0, 1.0, 2.0, 1.0])).tolist()
    [1, 3, 2, 0]
    """
    mass = np.ascontiguousarray(mass, dtype=np.float64)
    n = len(mass)
    if n < 2 or not np.all(mass > 0) or not np.all(np.isfinite(mass)):
        return np.argsort(mass, kind="stable")
    bits = mass.view(np.int64)
    lightest = int(bits.min())
    shift = max(0, (int(bits.max()) - lightest).bit_length() - 32)
    key = ((bits - lightest) >> shift).astype(np.uint32)
    order = np.argsort(key.astype(np.uint16), kind="stable")  # the low 16 bits, then the high 16 (NumPy's radix sort)
    order = order[np.argsort((key >> 16).astype(np.uint16)[order], kind="stable")]
    high = key[order]
    tied = np.flatnonzero(high[1:] == high[:-1])  # neighbours the cut keys alone put in index order
    if tied.size:
        at = np.union1d(tied, tied + 1)  # positions of every shared group, each group contiguous
        members = order[at]
        order[at] = members[np.lexsort((members, mass[members], high[at]))]
    return order


def pair_by_mass(mass: np.ndarray, window: float, eligible: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Pair halves by mass: sort the eligible ones and pair neighbours at most ``window`` apart.

    Runs of neighbours each within the window pair off from their lightest end,
    which forms the most pairs there can be. Returns the indices of the lighter
    and the heavier half of each pair.

    >>> a, b = pair_by_mass(np.array([10.0, 10.05, 10.3, 10.32, 10.33]), 0.1, np.ones(5, bool))
    >>> a.tolist(), b.tolist()
    ([0, 2], [1, 3])
    """
    idx = np.flatnonzero(eligible)
    order = idx[_mass_order(mass[idx])] if len(idx) < len(mass) else _mass_order(mass)
    m = mass[order]
    if len(m) < 2:
        return np.zeros(0, np.int64), np.zeros(0, np.int64)
    linked = np.diff(m) <= window  # linked[i]: half i and i + 1 (in mass order) may pair
    start = np.empty(len(m), bool)
    start[0], start[1:] = True, ~linked  # a run starts where the step from the previous half is too big
    run_start = np.maximum.accumulate(np.where(start, np.arange(len(m)), 0))
    even = ((np.arange(len(m) - 1) - run_start[:-1]) & 1) == 0
    lead = np.flatnonzero(even & linked)  # the 1st, 3rd … half of a run pairs with the next one in it
    return order[lead], order[lead + 1]


def run_lot(design: Design, *, units: int = DEFAULT_UNITS, seed: int = DEFAULT_SEED, distribution: str = "normal",
            pair_window_g: float = DEFAULT_PAIR_WINDOW_G, mass_window_g: float = DEFAULT_MASS_WINDOW_G,
            exact_sample: int = EXACT_SAMPLE, resolved: Resolved | None = None) -> LotResult:
    """Draw a lot of ``units`` halves of ``design`` and assemble it (see the module text for the model)."""
    if distribution not in DISTRIBUTIONS:
        raise ValueError(f"distribution {distribution!r} is not one of {DISTRIBUTIONS}")
    if not 2 <= units <= MAX_UNITS:
        raise ValueError(f"units {units} is outside 2 to {MAX_UNITS}")
    resolved = resolved if resolved is not None else build(design)
    if not resolved.can_analyse:
        raise ValueError("the design has no valid closed profile to analyse (see its loop and axle checks)")
    v = resolved.values
    shop = design["shop"]
    nominal = analyse(resolved)
    dims, other, skipped = lot_bands(resolved)
    pinned = _pinned(design, {b.key: b.nominal for b in dims})
    unit0 = _unit_props(pinned)
    if unit0 is None:  # pragma: no cover - pinning every value at its resolved value rebuilds the same half
        raise ValueError("the design does not rebuild with its dimensions pinned")
    sens = _sensitivities(design, dims)
    rho0 = v["material.density_g_cm3"]
    # mass moved by a unit sideways offset of each setup's surfaces (g·mm per mm): the back of the half (rim
    # outer chunk: outer diameter, outer face, cup) and the gap side turned with the seat; the axle bore is datum A
    outer = ("shape", "outer") if resolved.features["shape"].chunks["outer"] else ("rim", "outer")
    w_rim = _chunk_moment(resolved, *outer) * rho0 / 1000
    w_axle = _chunk_moment(resolved, "axle_bore", "bore") * rho0 / 1000
    w_seat = unit0[0] - w_rim - w_axle
    e_max = nominal.balance.runout_tolerance_mm / 2  # circular runout (TIR) is twice the offset
    coated = shop["coating"] != "none" and not shop["mask_seat"]
    growth_per_mm = 2 * shop["coating_outward_share"] if coated else 0.0
    gap_tol, gap_basis = _gap_tolerance(resolved)
    e_per = permissible_specific_unbalance_mm(design["analysis"]["balance_grade"], design["analysis"]["spin_rate"])
    parts_g = nominal.assembly.total_g - 2 * nominal.half.mass_g
    parts_izz = nominal.assembly.izz_g_mm2 - 2 * nominal.half.izz_g_mm2

    n_dims = len(dims)
    centre = np.array([b.centre for b in dims + other])
    halfw = np.array([b.half for b in dims + other])
    scale = halfw / 3 if distribution == "normal" else halfw
    lin0 = np.asarray(unit0) + sens @ centre[:n_dims]
    seat = [next(k for k, b in enumerate(dims) if b.key == f"features.bearing_seat.{name}")
            for name in ("post_diameter", "wall_bore", "wall_offset")]
    rest = [k for k in range(n_dims) if k not in seat]
    # the seat's three dimensions are drawn one by one (the fits and the gap read them); the other dimensions
    # only move the mass and Izz, so under a normal spread their joint effect on the linear model is drawn
    # as the one two-dimensional normal it is (exactly the same distribution, 2 draws a half instead of many)
    joint = _joint_factor(sens[:, rest] * scale[rest]) if distribution == "normal" else None
    rows = seat + list(range(n_dims, n_dims + 5))  # post, wall, offset, bore, od, width, coating, density
    coat_mid = centre[n_dims + 3]
    # the static unbalance: each setup's offset (rim and seat) x and y; under a normal spread the two setups'
    # x (and y) add up to one normal of their combined spread (the same distribution, 2 draws a half, not 4)
    n_offsets = 2 if distribution == "normal" else 4
    n_draw = len(rows) + n_offsets + (2 if joint is not None else len(rest))
    w_both = math.hypot(w_rim, w_seat)
    post_nom = v["bearing_seat.post_diameter"]
    wall_nom = v["bearing_seat.wall_bore"]

    keys = ("mass_g", "izz_g_mm2", "post_clearance_mm", "wall_clearance_mm", "wall_offset_mm", "bearing_width_mm",
            "unbalance_x_g_mm", "unbalance_y_g_mm")
    half = {k: np.empty(units) for k in keys}

    def draw(start: int) -> None:
        """Halves ``start`` … ``start + BLOCK - 1``, from a stream of their own (the lot is the same however
        the blocks are shared out)."""
        rng = np.random.default_rng([seed, 2, start // BLOCK])
        n = min(BLOCK, units - start)
        z = rng.standard_normal((n_draw, n)) if distribution == "normal" else rng.random((n_draw, n)) * 2.0 - 1.0
        # worked out a piece at a time, so the piece's rows and every intermediate array stay in the core's cache
        for c in range(0, n, PIECE):
            zc = z[:, c:c + PIECE]
            post_d, wall_d, off_d, bore_d, od_d, width_d, coat_d, rho_d = (
                centre[rows, None] + scale[rows, None] * zc[:len(rows)])
            ex, others = zc[len(rows):len(rows) + n_offsets], zc[len(rows) + n_offsets:]
            seat_d = (post_d, wall_d, off_d)
            mass_u = lin0[0] + sum(sens[0, k] * d for k, d in zip(seat, seat_d))
            izz_u = lin0[1] + sum(sens[1, k] * d for k, d in zip(seat, seat_d))
            if joint is not None:
                mass_u += joint[0, 0] * others[0] + joint[0, 1] * others[1]
                izz_u += joint[1, 0] * others[0] + joint[1, 1] * others[1]
            else:
                for row, k in zip(others, rest):
                    mass_u += (sens[0, k] * scale[k]) * row
                    izz_u += (sens[1, k] * scale[k]) * row
            rho = 1.0 + rho_d / rho0  # the half's density against the catalog's
            growth = growth_per_mm * (coat_d - coat_mid)  # against the middle of the range the sizes are for
            s = slice(start + c, start + c + zc.shape[1])
            half["mass_g"][s] = rho * mass_u
            half["izz_g_mm2"][s] = rho * izz_u
            half["post_clearance_mm"][s] = (v["bearing.bore"] + bore_d) - (post_nom + post_d + growth)
            half["wall_clearance_mm"][s] = (wall_nom + wall_d - growth) - (v["bearing.od"] + od_d)
            half["wall_offset_mm"][s] = v["bearing_seat.wall_offset"] + off_d
            half["bearing_width_mm"][s] = v["bearing.width"] + width_d
            if distribution == "normal":  # each offset component ±3σ = the offset the runout allows
                half["unbalance_x_g_mm"][s] = rho * ((w_both * e_max / 3) * ex[0])
                half["unbalance_y_g_mm"][s] = rho * ((w_both * e_max / 3) * ex[1])
            else:  # evenly over the disc of the allowed offset
                radius = e_max * np.sqrt((ex[0::2] + 1) / 2)
                angle = math.pi * ex[1::2]
                offsets = np.empty_like(ex)
                offsets[0::2], offsets[1::2] = radius * np.cos(angle), radius * np.sin(angle)
                half["unbalance_x_g_mm"][s] = rho * (w_rim * offsets[0] + w_seat * offsets[2])
                half["unbalance_y_g_mm"][s] = rho * (w_rim * offsets[1] + w_seat * offsets[3])

    # the blocks are drawn on every core
    _Background(draw, range(0, units, BLOCK), min(4, os.cpu_count() or 1)).join()
    # a sample of halves drawn dimension by dimension from a stream of its own, rebuilt exactly
    sample_rng = np.random.default_rng([seed, 1])
    if distribution == "normal":
        sample_z = sample_rng.standard_normal((exact_sample, n_dims))
    else:
        sample_z = sample_rng.random((exact_sample, n_dims)) * 2.0 - 1.0
    sample_dev = centre[:n_dims] + scale[:n_dims] * sample_z

    slides = (half["post_clearance_mm"] >= 0) & (half["wall_clearance_mm"] >= 0)
    u_per = nominal.assembly.total_g * e_per

    def pair(_: Any) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
        """The pairs by mass, and whether each assembled yo-yo's gap and unbalance are within their limits."""
        pa, pb = pair_by_mass(half["mass_g"], pair_window_g, slides)
        formed_gap = (half["bearing_width_mm"] - half["wall_offset_mm"])[pa] - half["wall_offset_mm"][pb]
        formed_unbalance = np.hypot(half["unbalance_x_g_mm"][pa] + half["unbalance_x_g_mm"][pb],
                                    half["unbalance_y_g_mm"][pa] + half["unbalance_y_g_mm"][pb])
        return pa, pb, (np.abs(formed_gap - v["bearing_seat.gap"]) <= gap_tol) & (formed_unbalance <= u_per)

    # the halves are sorted by mass and paired on a thread of their own while this one rebuilds the exact
    # sample and assembles the random pairs
    pairing = _Background(pair, [None], 1)
    even = slice(0, units - 1, 2)  # halves 0, 2, 4 … with 1, 3, 5 …: a random assembly
    try:
        linear = _linearisation_error(design, dims, sample_dev, unit0, sens)
        random_pairs = _assembled(half, even, slice(1, units, 2), parts_g, parts_izz)
        distributions = _distributions(half, random_pairs)
    finally:
        (pa, pb, pair_good), = pairing.join()
    target = v["envelope.target_mass"]
    return LotResult(
        design_name=design.name, units=units, seed=seed, distribution=distribution, pair_window_g=pair_window_g,
        mass_window_g=mass_window_g, target_mass_g=nominal.assembly.total_g if target is None else target,
        target_is_nominal=target is None, gap_nominal_mm=v["bearing_seat.gap"], gap_tolerance_mm=gap_tol,
        gap_tolerance_basis=gap_basis, gap_rss_mm=resolved.features["bearing_seat"].extra["gap_stack"].rss_mm,
        permissible_unbalance_g_mm=u_per, nominal_total_g=nominal.assembly.total_g,
        bands=tuple(dims) + other, skipped=skipped, half={**half, "slides": slides}, random_pairs=random_pairs,
        pairs=(pa, pb), pair_good=pair_good, linearisation=linear, distributions=distributions)


def _assembled(half: Mapping[str, np.ndarray], a: np.ndarray | slice, b: np.ndarray | slice, parts_g: float,
               parts_izz: float) -> dict[str, np.ndarray]:
    """Yo-yos of halves ``a[i]`` and ``b[i]`` on the bearing half ``a[i]`` met: gap, mass, Izz, static unbalance."""
    return {
        "gap_mm": half["bearing_width_mm"][a] - half["wall_offset_mm"][a] - half["wall_offset_mm"][b],
        "mass_g": half["mass_g"][a] + half["mass_g"][b] + parts_g,
        "izz_g_mm2": half["izz_g_mm2"][a] + half["izz_g_mm2"][b] + parts_izz,
        "unbalance_g_mm": np.hypot(half["unbalance_x_g_mm"][a] + half["unbalance_x_g_mm"][b],
                                   half["unbalance_y_g_mm"][a] + half["unbalance_y_g_mm"][b]),
    }


def _linearisation_error(design: Design, dims: Sequence[Band], deviations: np.ndarray, unit0: tuple[float, float],
                         sens: np.ndarray) -> dict[str, float]:
    """Rebuild the first halves of the lot exactly; how far the linear model's mass and Izz are from them."""
    mass_err: list[float] = []
    izz_err: list[float] = []
    failed = 0
    memo = BuildMemo()  # the features no toleranced dimension reaches are resolved once
    refusals: list[str] = []
    rebuilt = _units_props([_pinned(design, {b.key: b.nominal + d for b, d in zip(dims, dev)}) for dev in deviations],
                           memo, refusals)
    for dev, exact in zip(deviations, rebuilt):
        if exact is None:
            failed += 1
            continue
        linear = np.asarray(unit0) + sens @ dev
        mass_err.append(abs(linear[0] - exact[0]) / exact[0])
        izz_err.append(abs(linear[1] - exact[1]) / exact[1])
    return {"sample": len(deviations), "not_rebuilt": failed, "first_refusal": refusals[0] if refusals else "",
            "mass_max_relative": max(mass_err, default=0.0), "izz_max_relative": max(izz_err, default=0.0),
            "mass_rms_relative": math.sqrt(sum(e * e for e in mass_err) / len(mass_err)) if mass_err else 0.0}


def _stats(x: np.ndarray) -> dict[str, float]:
    if len(x) == 0:
        return {"mean": None, "sd": None, "p01": None, "p99": None}  # type: ignore[dict-item]
    p01, p99 = percentiles(x, [1, 99])
    return {"mean": float(x.mean()), "sd": float(x.std(ddof=1)) if len(x) > 1 else 0.0, "p01": float(p01),
            "p99": float(p99)}


def _distributions(half: Mapping[str, np.ndarray], random_pairs: Mapping[str, np.ndarray]) -> dict[str, Any]:
    """Mean, sd, 1st and 99th percentile of each distribution the summary gives (the unbalance's mean and 99th
    percentile alone), keyed ``half.NAME`` and ``pairs.NAME`` by the arrays they are of."""
    out: dict[str, Any] = {f"half.{k}": _stats(half[k])
                           for k in ("post_clearance_mm", "wall_clearance_mm", "mass_g", "izz_g_mm2")}
    out.update({f"pairs.{k}": _stats(random_pairs[k]) for k in ("gap_mm", "mass_g", "izz_g_mm2")})
    u = random_pairs["unbalance_g_mm"]
    out["pairs.unbalance_g_mm"] = {"mean": float(u.mean()) if len(u) else None,
                                   "p99": percentiles(u, [99])[0] if len(u) else None}
    return out


def _share(mask: np.ndarray) -> float:
    return float(mask.mean()) if len(mask) else 0.0


def lot_summary(r: LotResult) -> dict[str, Any]:
    """The ``lot --json`` object (see the README for every key)."""
    h, rp = r.half, r.random_pairs
    # each summary gets its own copies (the result's statistics stay as they were worked out)
    d = {k: dict(v) for k, v in (r.distributions or _distributions(h, rp)).items()}
    post_bad = h["post_clearance_mm"] < 0
    wall_bad = h["wall_clearance_mm"] < 0
    gap_out = np.abs(rp["gap_mm"] - r.gap_nominal_mm) > r.gap_tolerance_mm
    good = int(r.pair_good.sum())
    return {
        "design": r.design_name,
        "units": r.units,
        "seed": r.seed,
        "distribution": r.distribution + (" (each band is ±3σ)" if r.distribution == "normal" else " (over each band)"),
        "no_slide_share": _share(post_bad | wall_bad),
        "no_slide_post_share": _share(post_bad),
        "no_slide_wall_share": _share(wall_bad),
        "post_clearance_um": {k: (None if x is None else x * 1000) for k, x in d["half.post_clearance_mm"].items()},
        "wall_clearance_um": {k: (None if x is None else x * 1000) for k, x in d["half.wall_clearance_mm"].items()},
        "gap_mm": {**d["pairs.gap_mm"], "nominal": r.gap_nominal_mm, "tolerance": r.gap_tolerance_mm,
                   "tolerance_basis": r.gap_tolerance_basis, "rss_min": r.gap_rss_mm[0], "rss_max": r.gap_rss_mm[1]},
        "gap_out_share": _share(gap_out),
        "half_mass_g": d["half.mass_g"],
        "half_izz_g_mm2": d["half.izz_g_mm2"],
        "mass_g": {**d["pairs.mass_g"], "nominal": r.nominal_total_g, "target": r.target_mass_g,
                   "target_is_nominal": r.target_is_nominal, "window": r.mass_window_g},
        "mass_in_window_share": _share(np.abs(rp["mass_g"] - r.target_mass_g) <= r.mass_window_g),
        "izz_g_mm2": d["pairs.izz_g_mm2"],
        "pair_window_g": r.pair_window_g,
        "pairs": {"formed": int(len(r.pairs[0])), "left": int(r.units - 2 * len(r.pairs[0])),
                  "rejected_halves": int((~h["slides"]).sum())},
        "paired_share": 2 * len(r.pairs[0]) / r.units,
        "unbalance_g_mm": {**d["pairs.unbalance_g_mm"], "permissible": r.permissible_unbalance_g_mm},
        "unbalance_over_share": _share(rp["unbalance_g_mm"] > r.permissible_unbalance_g_mm),
        "good_yoyos": good,
        "good_yoyos_per_half": good / r.units,
        "linearisation_error": dict(r.linearisation),
        "bands": [{"key": b.key, "nominal": b.nominal, "centre_offset": b.centre, "plus_minus": b.half,
                   "basis": b.basis} for b in r.bands],
        "not_drawn": list(r.skipped),
    }


def lot_text(data: Mapping[str, Any]) -> str:
    """The lot summary as terminal text."""
    def pct(x: float) -> str:
        return f"{100 * x:.3g} %"

    m, hm, g, u, p = data["mass_g"], data["half_mass_g"], data["gap_mm"], data["unbalance_g_mm"], data["pairs"]
    lin = data["linearisation_error"]
    target = "nominal" if m["target_is_nominal"] else "target"
    n_dims = sum(1 for b in data["bands"] if b["key"].startswith("features."))
    lines = [
        f"lot of {data['units']} halves of {data['design']}, seed {data['seed']}, {data['distribution']}",
        f"  drawn: {n_dims} dimensions within their tolerances, the bearing's bore, outside diameter and width "
        f"within its class, the coating thickness, the density, and each setup's runout"
        + (f"; left at nominal: {', '.join(data['not_drawn'])}" if data["not_drawn"] else ""),
        f"  bearing won't slide on the post or into the wall bore: {pct(data['no_slide_share'])} "
        f"(post {pct(data['no_slide_post_share'])}, wall bore {pct(data['no_slide_wall_share'])})",
        f"  gap {g['mean']:.4f} mm, sd {g['sd'] * 1000:.1f} µm; outside {g['nominal']:.4f} ± {g['tolerance']:.3f} mm: "
        f"{pct(data['gap_out_share'])}",
        f"  half mass {hm['mean']:.3f} g, sd {hm['sd']:.4f} g (p01 {hm['p01']:.3f}, p99 {hm['p99']:.3f})",
        f"  assembled mass {m['mean']:.3f} g, sd {m['sd']:.4f} g (p01 {m['p01']:.3f}, p99 {m['p99']:.3f}); "
        f"within {target} {m['target']:.2f} ± {m['window']:g} g: {pct(data['mass_in_window_share'])}",
        f"  halves paired within {data['pair_window_g']:g} g: {p['formed']} pairs, {p['left']} halves left "
        f"({p['rejected_halves']} rejected at the seat)",
        f"  static unbalance mean {u['mean']:.3f} g·mm, p99 {u['p99']:.3f} g·mm, permissible {u['permissible']:.3f} g·mm; "
        f"over: {pct(data['unbalance_over_share'])}",
        f"  good yo-yos: {data['good_yoyos']} from {data['units']} halves",
        _linearisation_line(lin),
    ]
    return "\n".join(lines) + "\n"


def _linearisation_line(lin: Mapping[str, Any]) -> str:
    """The lot's line on the linear model against the exactly rebuilt halves, and how many halves did not rebuild."""
    rebuilt, sample = lin["sample"] - lin["not_rebuilt"], lin["sample"]
    refused = (f"; {lin['not_rebuilt']} of the {sample} sampled halves do not rebuild"
               + (f" (the first: {lin['first_refusal']})" if lin["first_refusal"] else "")
               if lin["not_rebuilt"] else "")
    if not rebuilt:
        return f"  linear model not checked against exact rebuilds{refused}"
    return (f"  linear model against {rebuilt} exact rebuilds: mass within {lin['mass_max_relative']:.2e}, "
            f"Izz within {lin['izz_max_relative']:.2e} (relative){refused}")


def lot_csv(r: LotResult) -> str:
    """Every half of the lot, one row each: its mass, Izz, seat clearances, wall offset, bearing width, unbalance,
    whether it slides on its bearing, the pair it went into and whether that pair makes a good yo-yo."""
    h = r.half
    pair = np.full(r.units, -1, np.int64)
    good = np.zeros(r.units, bool)
    pa, pb = r.pairs
    pair[pa] = pair[pb] = np.arange(len(pa))
    good[pa] = good[pb] = r.pair_good
    unbalance = np.hypot(h["unbalance_x_g_mm"], h["unbalance_y_g_mm"])
    columns = (
        [f"{x:.5f}" for x in h["mass_g"].tolist()],
        [f"{x:.2f}" for x in h["izz_g_mm2"].tolist()],
        [f"{x * 1000:.3f}" for x in h["post_clearance_mm"].tolist()],
        [f"{x * 1000:.3f}" for x in h["wall_clearance_mm"].tolist()],
        [f"{x:.5f}" for x in h["wall_offset_mm"].tolist()],
        [f"{x:.5f}" for x in h["bearing_width_mm"].tolist()],
        [f"{x:.5f}" for x in unbalance.tolist()],
        [f"{x:.3f}" for x in (unbalance / h["mass_g"] * 1000).tolist()],
        ["true" if x else "false" for x in h["slides"].tolist()],
        ["" if x < 0 else str(x) for x in pair.tolist()],
        ["true" if x else "false" for x in good.tolist()],
    )
    header = ("unit,mass_g,izz_g_mm2,post_clearance_um,wall_clearance_um,wall_offset_mm,bearing_width_mm,"
              "unbalance_g_mm,eccentricity_um,slides,pair,pair_good")
    rows = (",".join(cells) for cells in zip(map(str, range(r.units)), *columns))
    return header + "\n" + "\n".join(rows) + "\n"


def lot_svg(r: LotResult, data: Mapping[str, Any]) -> str:
    """An SVG of the lot's distributions with their limits marked (see :mod:`yodraft.lot_plot`)."""
    from .lot_plot import Panel, histogram_svg

    h, rp = r.half, r.random_pairs
    m = data["mass_g"]
    panels = [
        Panel("post clearance, µm (bearing bore − post)", h["post_clearance_mm"] * 1000, ((0.0, "slides on"),)),
        Panel("wall clearance, µm (wall bore − bearing OD)", h["wall_clearance_mm"] * 1000, ((0.0, "clears"),)),
        Panel("gap, mm (random assembly)", rp["gap_mm"],
              ((r.gap_nominal_mm - r.gap_tolerance_mm, "−tol"), (r.gap_nominal_mm + r.gap_tolerance_mm, "+tol"))),
        Panel("half mass, g", h["mass_g"], ()),
        Panel("assembled mass, g (random assembly)", rp["mass_g"],
              ((m["target"] - m["window"], "−window"), (m["target"], "target" if not m["target_is_nominal"] else "nominal"),
               (m["target"] + m["window"], "+window"))),
        Panel("static unbalance, g·mm (random assembly)", rp["unbalance_g_mm"],
              ((r.permissible_unbalance_g_mm, "permissible"),)),
    ]
    title = (f"{r.design_name}: lot of {r.units} halves, seed {r.seed}, {data['distribution']}; "
             f"{data['good_yoyos']} good yo-yos")
    return histogram_svg(title, panels)
