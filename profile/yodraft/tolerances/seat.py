"""Bearing-seat sizing from the tolerance stack: worst case and statistical (RSS).

The post is the turned diameter the bearing's inner ring slides onto; the wall
(bore) is the recess its outer ring sits in. Sizes are finished sizes (after any
coating); ``precoat_mm`` is what the machinist turns, ± the machine tolerance,
before the coating goes on. A coating's thickness scatters between a thin and a
thick end, so the finished size carries the machine tolerance plus half the
growth's scatter, and the thick end is the one that can make a seat interfere.

Worst-case rule (derived sizes)
    post turned = bearing bore min − fit clearance − machine tolerance − thickest growth;
    wall turned = bearing OD max + fit clearance + machine tolerance + thickest growth;
    the finished nominal is the turned size plus (post) or minus (wall) the mid growth.

Statistical rule (checks only; it never moves the sizes): each machine tolerance
is taken as ±3σ of a normal spread about the nominal, each bearing deviation band
and the coating's growth band as ±3σ about its mid value; the clearance spread is
their root sum of squares.

>>> fit = size_seat(SeatInputs(6.35, 12.7, (0.0, -2.54), (0.0, -2.54), 0.00508, 0.0127))
>>> round(fit.post.nominal_mm / 25.4, 5), round(fit.post.clearance_min_mm / 25.4, 5)
(0.2492, 0.0005)
"""
from __future__ import annotations

import math
from dataclasses import dataclass

__all__ = ["SeatInputs", "DiameterFit", "SeatFit", "size_seat", "coating_growth_mm"]


def coating_growth_mm(thickness_mm: float, outward_share: float) -> float:
    """Diametral growth of a turned diameter from a coating of ``thickness_mm``.

    ``outward_share`` is the share of the coating that builds up above the
    original surface (the rest converts the base metal inward); a hard anodise
    builds roughly half outward (common practice, no published source).

    >>> coating_growth_mm(0.01, 0.5)
    0.01
    """
    if not (math.isfinite(thickness_mm) and thickness_mm >= 0):
        raise ValueError(f"coating thickness {thickness_mm!r} mm is not a length ≥ 0")
    if not (0.0 <= outward_share <= 1.0):
        raise ValueError(f"coating outward share {outward_share!r} is not between 0 and 1")
    return 2.0 * thickness_mm * outward_share


@dataclass(frozen=True)
class SeatInputs:
    """Everything that stacks up at the bearing seat, all diameters in mm.

    Deviations are (upper, lower) in µm from the bearing's precision class;
    ``machine_tolerance_mm`` is the ± the machinist holds on a diameter;
    ``fit_clearance_mm`` the least clearance wanted (negative asks for a press fit);
    ``coating_growth_mm`` the diametral growth of a coated surface at the coating's thin end,
    ``coating_growth_max_mm`` at its thick end (None: no scatter).
    An explicit ``post_diameter_mm`` / ``wall_bore_mm`` (finished, at the mid growth) is checked, not derived.
    """

    bearing_bore_mm: float
    bearing_od_mm: float
    bore_deviation_um: tuple[float, float]
    od_deviation_um: tuple[float, float]
    machine_tolerance_mm: float
    fit_clearance_mm: float
    coating_growth_mm: float = 0.0
    post_diameter_mm: float | None = None
    wall_bore_mm: float | None = None
    coating_growth_max_mm: float | None = None

    @property
    def growth_band_mm(self) -> tuple[float, float]:
        """(thin end, thick end) of the diametral growth."""
        high = self.coating_growth_mm if self.coating_growth_max_mm is None else self.coating_growth_max_mm
        return (self.coating_growth_mm, high)

    def __post_init__(self) -> None:
        for name in ("bearing_bore_mm", "bearing_od_mm"):
            value = getattr(self, name)
            if not (math.isfinite(value) and value > 0):
                raise ValueError(f"{name} {value!r} is not a diameter > 0")
        if not self.bearing_od_mm > self.bearing_bore_mm:
            raise ValueError("bearing OD is not larger than its bore")
        for name in ("bore_deviation_um", "od_deviation_um"):
            upper, lower = getattr(self, name)
            if not upper >= lower:
                raise ValueError(f"{name} {(upper, lower)!r} is not (upper, lower) with upper ≥ lower")
        if not (math.isfinite(self.machine_tolerance_mm) and self.machine_tolerance_mm >= 0):
            raise ValueError(f"machine tolerance {self.machine_tolerance_mm!r} mm is not a ± ≥ 0")
        if not (math.isfinite(self.fit_clearance_mm) and math.isfinite(self.coating_growth_mm)):
            raise ValueError("fit clearance and coating growth must be finite")
        low, high = self.growth_band_mm
        if not (math.isfinite(high) and high >= low):
            raise ValueError(f"coating growth band {(low, high)!r} is not (thin, thick) with thick ≥ thin")


@dataclass(frozen=True)
class DiameterFit:
    """One turned diameter (post or wall bore) against its bearing race.

    ``nominal_mm`` ± ``tolerance_mm`` is the finished size (machine tolerance plus
    half the coating's scatter); ``precoat_mm`` ± ``turn_tolerance_mm`` the size
    turned before coating. Clearances are diametral, race minus post or wall minus
    race (negative = interference). ``clearance_*`` are worst case; ``rss_*`` the
    ±3σ statistical range; ``p_no_slide`` the chance a random part and bearing will
    not slide together (clearance < 0) under that normal model.
    """

    nominal_mm: float
    tolerance_mm: float
    precoat_mm: float
    clearance_min_mm: float
    clearance_max_mm: float
    derived: bool
    rss_min_mm: float
    rss_max_mm: float
    p_no_slide: float
    turn_tolerance_mm: float = 0.0

    @property
    def max_mm(self) -> float:
        """Largest finished diameter allowed."""
        return self.nominal_mm + self.tolerance_mm

    @property
    def min_mm(self) -> float:
        """Smallest finished diameter allowed."""
        return self.nominal_mm - self.tolerance_mm


@dataclass(frozen=True)
class SeatFit:
    """The post and the wall bore of one bearing seat."""

    post: DiameterFit
    wall: DiameterFit


def _p_negative(mean: float, sigma: float) -> float:
    """P(X < 0) for X normal with ``mean`` and ``sigma`` (a step when sigma is 0)."""
    if sigma == 0:
        return 1.0 if mean < 0 else 0.0
    return 0.5 * math.erfc(mean / (sigma * math.sqrt(2.0)))


def _fit(nominal: float, turn_tol: float, scatter: float, precoat: float, race_band: tuple[float, float],
         race_is_outside: bool, derived: bool) -> DiameterFit:
    """Clearance of a finished diameter ``nominal ± (turn_tol + scatter)`` against a race band (min, max), all mm.

    ``scatter`` is half the coating's growth band.
    """
    tol = turn_tol + scatter
    race_min, race_max = race_band
    if race_is_outside:  # the race surrounds the post: clearance = race − post
        worst_min, worst_max = race_min - (nominal + tol), race_max - (nominal - tol)
        mean = (race_min + race_max) / 2 - nominal
    else:  # the wall surrounds the race: clearance = wall − race
        worst_min, worst_max = (nominal - tol) - race_max, (nominal + tol) - race_min
        mean = nominal - (race_min + race_max) / 2
    half_race = (race_max - race_min) / 2
    spread = math.sqrt(half_race ** 2 + turn_tol ** 2 + scatter ** 2)  # 3σ of the clearance
    return DiameterFit(nominal, tol, precoat, worst_min, worst_max, derived,
                       mean - spread, mean + spread, _p_negative(mean, spread / 3.0), turn_tol)


def size_seat(s: SeatInputs) -> SeatFit:
    """Size (or check) the post and the wall bore: worst case sizes, RSS as a second opinion."""
    tol = s.machine_tolerance_mm
    bore = (s.bearing_bore_mm + s.bore_deviation_um[1] / 1000, s.bearing_bore_mm + s.bore_deviation_um[0] / 1000)
    od = (s.bearing_od_mm + s.od_deviation_um[1] / 1000, s.bearing_od_mm + s.od_deviation_um[0] / 1000)
    post_derived = s.post_diameter_mm is None
    wall_derived = s.wall_bore_mm is None
    low, high = s.growth_band_mm
    mid, scatter = (low + high) / 2, (high - low) / 2
    # a coating grows the post and shrinks the bore, so turn the post under and the bore over; a derived size
    # keeps the fit clearance at the thickest coating
    post = s.post_diameter_mm if s.post_diameter_mm is not None else bore[0] - s.fit_clearance_mm - tol - high + mid
    wall = s.wall_bore_mm if s.wall_bore_mm is not None else od[1] + s.fit_clearance_mm + tol + high - mid
    return SeatFit(
        post=_fit(post, tol, scatter, post - mid, bore, True, post_derived),
        wall=_fit(wall, tol, scatter, wall + mid, od, False, wall_derived),
    )
