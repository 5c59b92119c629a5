"""Numbers a metric shop reads: sizes and tolerances to whole µm (three decimals at most), inch in brackets.

A symmetric zone stays symmetric: the basic size is rounded to the µm and the ± cut
down to the µm, when the rounding moves the size by no more than a twentieth of the
tolerance (common practice, no published source). Otherwise the zone is rounded inward
(upper limit down, lower limit up to the µm) and written with its two deviations.

>>> limits_um(6.31806, 0.01524)
(6.318, 0.015, -0.015)
>>> tolerance_text(6.31806, 0.01524, inch=True)
'±0.015\\n[0.24874 ±0.00060 in]'
>>> tolerance_text(19.61875, 0.2), size_text(19.61875)
('±0.2', '19.619')
>>> limits_um(1.0004, 0.001)
(1.0, 0.001, 0.0)
"""
from __future__ import annotations

import math

from ..units import MM_PER_INCH as IN

__all__ = ["limits_um", "tolerance_text", "size_text", "deviation_text"]


def _um(x: float) -> int:
    return round(x * 1000)


def limits_um(nominal_mm: float, tol_mm: float) -> tuple[float, float, float]:
    """(basic size, upper deviation, lower deviation) in mm, each to the µm, the zone rounded inward."""
    basic = _um(nominal_mm)
    shift = abs(basic / 1000 - nominal_mm)
    if shift <= tol_mm / 20:
        t = math.floor(tol_mm * 1000 + 1e-6)
        return basic / 1000, t / 1000, -t / 1000
    upper = math.floor((nominal_mm + tol_mm) * 1000 + 1e-6) - basic
    lower = math.ceil((nominal_mm - tol_mm) * 1000 - 1e-6) - basic
    return basic / 1000, upper / 1000, lower / 1000


def size_text(value_mm: float) -> str:
    """A size to the µm, trailing zeros dropped."""
    s = f"{value_mm:.3f}".rstrip("0").rstrip(".")
    return "0" if s in ("-0", "") else s


def deviation_text(upper_mm: float, lower_mm: float) -> str:
    """``±0.015`` for a symmetric zone, else ``+0.015/-0.012`` (0 written without a sign)."""
    def one(x: float) -> str:
        return "0" if abs(x) < 5e-7 else f"{x:+.3f}".rstrip("0").rstrip(".")
    if abs(upper_mm + lower_mm) < 5e-7:
        return f"±{size_text(upper_mm)}"
    return f"{one(upper_mm)}/{one(lower_mm)}"


def tolerance_text(nominal_mm: float, tol_mm: float, inch: bool = False) -> str:
    """The tolerance written after a size (``±0.015``), with the inch size and ± on a second line for inch work."""
    _, upper, lower = limits_um(nominal_mm, tol_mm)
    text = deviation_text(upper, lower)
    if inch:
        text += f"\n[{nominal_mm / IN:.5f} ±{tol_mm / IN:.5f} in]"
    return text
