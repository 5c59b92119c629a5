"""Round bar stock: the diameters a stockist holds, and the allowances a turned half takes from the bar.

Diameters are the metric round-bar sizes commonly stocked in wrought aluminium
alloys, titanium, stainless steel and brass (common practice, no published source:
standards such as EN 754-3 give tolerances for any size, not a list of sizes to stock).
"""
from __future__ import annotations

__all__ = ["BAR_DIAMETERS_MM", "next_bar_diameter"]

#: stocked round-bar diameters, mm  # common practice, no published source
BAR_DIAMETERS_MM: tuple[float, ...] = (10.0, 12.0, 16.0, 20.0, 25.0, 30.0, 35.0, 40.0, 45.0, 50.0, 55.0, 60.0, 63.0,
                                       65.0, 70.0, 75.0, 80.0, 90.0, 100.0, 110.0, 120.0, 130.0, 140.0, 150.0, 160.0)


def next_bar_diameter(least_mm: float) -> float | None:
    """The smallest stocked diameter at or above ``least_mm``; None above the largest.

    >>> next_bar_diameter(58.0)
    60.0
    """
    return next((d for d in BAR_DIAMETERS_MM if d >= least_mm - 1e-9), None)
