"""General tolerances for linear sizes without an individual tolerance (ISO 2768-1).

Permissible deviations ± in mm per size step (over, up to and including) for the
classes f (fine), m (medium), c (coarse). Sizes under 0.5 mm are not covered by
the standard: such a size must carry its own tolerance.

>>> general_tolerance_mm("ISO 2768-m", 20.0)
0.2
>>> general_tolerance_mm("ISO 2768-f", 0.2) is None
True
"""
from __future__ import annotations

__all__ = ["STEPS", "general_tolerance_mm"]

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
