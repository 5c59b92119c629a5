"""Ball bearings a yo-yo takes: nominal bore, outside diameter, width, mass.

Trade letter sizes map to a standard bearing: size C is the inch-series R188.
"""
from __future__ import annotations

from dataclasses import dataclass

__all__ = ["BearingRow", "BEARINGS", "LETTER_SIZES", "lookup_bearing"]

IN = 25.4


@dataclass(frozen=True)
class BearingRow:
    """One catalogued bearing (sizes in mm, mass in g)."""

    designation: str
    bore_mm: float
    od_mm: float
    width_mm: float
    mass_g: float
    inch: bool
    source: str


BEARINGS: dict[str, BearingRow] = {
    row.designation: row
    for row in (
        BearingRow("R188ZZ", 0.25 * IN, 0.5 * IN, 0.1875 * IN, 1.1, True,
                   "ABMA inch instrument series R188 shielded, 1/4 x 1/2 x 3/16 in (common practice); mass from memory"),
        BearingRow("MR105ZZ", 5.0, 10.0, 4.0, 1.2, False,
                   "ISO 15 miniature metric 5 x 10 x 4 mm (from memory); mass from memory"),
        BearingRow("688ZZ", 8.0, 16.0, 5.0, 3.1, False,
                   "ISO 15 dimension series 18, 8 x 16 x 5 mm (from memory); mass from memory"),
        BearingRow("608ZZ", 8.0, 22.0, 7.0, 12.0, False,
                   "ISO 15 dimension series 02, 8 x 22 x 7 mm (from memory); mass from memory"),
    )
}

#: trade letter sizes  # common practice, no published source
LETTER_SIZES: dict[str, str] = {"C": "R188ZZ"}


def lookup_bearing(name: str) -> BearingRow:
    """A bearing by trade letter size or designation (case-insensitive); KeyError if unknown."""
    key = name.strip().upper()
    key = LETTER_SIZES.get(key, key)
    for designation, row in BEARINGS.items():
        if designation.upper() == key or designation.upper().removesuffix("ZZ") == key:
            return row
    raise KeyError(name)
