"""General tolerances for sizes without an individual tolerance (ISO 2768-1).

Permissible deviations ± in mm per size step (over, up to and including) for the
classes f (fine), m (medium), c (coarse): linear sizes (table 1), external radii and
chamfer heights (table 2), and angles by the length of their shorter leg (table 3). Sizes under 0.5 mm are not covered by
the standard: such a size must carry its own tolerance.

>>> general_tolerance_mm("ISO 2768-m", 20.0)
0.2
>>> general_tolerance_mm("ISO 2768-f", 0.2) is None
True
"""
from __future__ import annotations

import math

__all__ = ["STEPS", "general_tolerance_mm", "radius_tolerance_mm", "angle_tolerance_rad"]

#: size steps, mm (the first includes 0.5 mm)  # ISO 2768-1, table 1 (from memory)
STEPS: tuple[tuple[float, float], ...] = ((0.5, 3.0), (3.0, 6.0), (6.0, 30.0), (30.0, 120.0), (120.0, 400.0))
# ± mm per step  # ISO 2768-1, table 1, linear dimensions (from memory)
_TABLE: dict[str, tuple[float, ...]] = {
    "f": (0.05, 0.05, 0.1, 0.15, 0.2),
    "m": (0.1, 0.1, 0.2, 0.3, 0.5),
    "c": (0.2, 0.3, 0.5, 0.8, 1.2),
}


def general_tolerance_mm(general: str, size_mm: float) -> float | None:
    """The ± of an ISO 2768-1 class ("ISO 2768-m" or "m") for a linear size; None outside the steps."""
    cls = general.strip()[-1].lower()
    if cls not in _TABLE:
        raise KeyError(general)
    size = abs(size_mm)
    for i, (low, high) in enumerate(STEPS):
        if (low < size or (i == 0 and size == low)) and size <= high:
            return _TABLE[cls][i]
    return None


# ± mm for external radii and chamfer heights: (up to and including mm, f, m, c)  # ISO 2768-1, table 2 (from memory)
_RADII: tuple[tuple[float, tuple[float, float, float]], ...] = (
    (3.0, (0.2, 0.2, 0.4)), (6.0, (0.5, 0.5, 1.0)), (float("inf"), (1.0, 1.0, 2.0)))
# ± arc minutes for angles by the shorter leg: (up to and including mm, f, m, c)  # ISO 2768-1, table 3 (from memory)
_ANGLES: tuple[tuple[float, tuple[float, float, float]], ...] = (
    (10.0, (60.0, 60.0, 90.0)), (50.0, (30.0, 30.0, 60.0)), (120.0, (20.0, 20.0, 30.0)),
    (400.0, (10.0, 10.0, 15.0)), (float("inf"), (5.0, 5.0, 10.0)))


def _column(general: str) -> int:
    cls = general.strip()[-1].lower()
    if cls not in _TABLE:
        raise KeyError(general)
    return "fmc".index(cls)


def radius_tolerance_mm(general: str, radius_mm: float) -> float | None:
    """The ± of an ISO 2768-1 class for an external radius or chamfer height; None under 0.5 mm.

    >>> radius_tolerance_mm("ISO 2768-m", 2.0)
    0.2
    """
    if not radius_mm >= 0.5:
        return None
    return next(row[_column(general)] for upper, row in _RADII if radius_mm <= upper)


def angle_tolerance_rad(general: str, shorter_leg_mm: float) -> float:
    """The ± of an ISO 2768-1 class for an angle, in radians, by the length of its shorter leg (mm).

    >>> round(math.degrees(angle_tolerance_rad("ISO 2768-m", 14.0)), 4)
    0.5
    """
    leg = max(shorter_leg_mm, 0.0)
    return math.radians(next(row[_column(general)] for upper, row in _ANGLES if leg <= upper) / 60.0)
