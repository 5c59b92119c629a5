"""Bearing-seat sizing from the tolerance stack (first version: worst case only)."""
from __future__ import annotations

from dataclasses import dataclass

__all__ = ["SeatInputs", "DiameterFit", "SeatFit", "size_seat"]


@dataclass(frozen=True)
class SeatInputs:
    """Everything that stacks up at the bearing seat, all diameters in mm."""

    bearing_bore_mm: float
    bearing_od_mm: float
    bore_deviation_um: tuple[float, float]
    od_deviation_um: tuple[float, float]
    machine_tolerance_mm: float
    fit_clearance_mm: float
    coating_growth_mm: float = 0.0
    post_diameter_mm: float | None = None
    wall_bore_mm: float | None = None


@dataclass(frozen=True)
class DiameterFit:
    """One turned diameter (post or wall bore) against its bearing race."""

    nominal_mm: float
    tolerance_mm: float
    precoat_mm: float
    clearance_min_mm: float
    clearance_max_mm: float
    derived: bool


@dataclass(frozen=True)
class SeatFit:
    post: DiameterFit
    wall: DiameterFit


def size_seat(s: SeatInputs) -> SeatFit:
    """Size the post and the wall bore with the worst-case clearance rule."""
    tol = s.machine_tolerance_mm
    bore_min = s.bearing_bore_mm + s.bore_deviation_um[1] / 1000
    bore_max = s.bearing_bore_mm + s.bore_deviation_um[0] / 1000
    od_min = s.bearing_od_mm + s.od_deviation_um[1] / 1000
    od_max = s.bearing_od_mm + s.od_deviation_um[0] / 1000
    post = s.post_diameter_mm if s.post_diameter_mm is not None else bore_min - s.fit_clearance_mm - tol
    wall = s.wall_bore_mm if s.wall_bore_mm is not None else od_max + s.fit_clearance_mm + tol
    return SeatFit(
        post=DiameterFit(post, tol, post - s.coating_growth_mm, bore_min - (post + tol), bore_max - (post - tol),
                         s.post_diameter_mm is None),
        wall=DiameterFit(wall, tol, wall + s.coating_growth_mm, (wall - tol) - od_max, (wall + tol) - od_min,
                         s.wall_bore_mm is None),
    )
