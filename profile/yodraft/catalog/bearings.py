"""Ball bearings a yo-yo takes: nominal bore, outside diameter, width, mass.

Trade letter sizes map to a standard bearing: size C is the inch-series R188
(shielded R188ZZ; the open R188 is narrower).

>>> lookup_bearing("C").designation
'R188ZZ'
>>> lookup_bearing("r188").width_mm
3.175
>>> lookup_bearing("mr126").od_mm
12.0
"""
from __future__ import annotations

from dataclasses import dataclass

from ..units import MM_PER_INCH as IN

__all__ = ["BearingRow", "BEARINGS", "LETTER_SIZES", "lookup_bearing"]


@dataclass(frozen=True)
class BearingRow:
    """One catalogued bearing (sizes in mm, mass in g).

    ``chamfer_mm`` is the inner ring's smallest bore chamfer (r_s min): a passing (fillet)
    in the post/seat-face corner must stay below it or the ring will not sit on its face.
    """

    designation: str
    bore_mm: float
    od_mm: float
    width_mm: float
    mass_g: float
    inch: bool
    source: str
    chamfer_mm: float = 0.0


_MASS = "mass from memory, in line with about 60 % of a solid steel ring of the same size (weigh yours)"
_CHAMFER = "; inner ring chamfer r_s min {} (from memory)"
_MINIATURE = "maker's miniature series (MR designation; not an ISO 15 dimension series), {} (from memory); "

BEARINGS: dict[str, BearingRow] = {
    row.designation: row
    for row in (
        BearingRow("R188ZZ", 0.25 * IN, 0.5 * IN, 0.1875 * IN, 2.1, True,
                   "ABMA inch instrument series R188 shielded, 1/4 x 1/2 x 3/16 in (common practice); " + _MASS
                   + _CHAMFER.format("0.003 in"), 0.003 * IN),
        BearingRow("R188", 0.25 * IN, 0.5 * IN, 0.125 * IN, 1.4, True,
                   "ABMA inch instrument series R188 open, 1/4 x 1/2 x 1/8 in (from memory); " + _MASS
                   + _CHAMFER.format("0.003 in"), 0.003 * IN),
        BearingRow("MR105ZZ", 5.0, 10.0, 4.0, 1.2, False, _MINIATURE.format("5 x 10 x 4 mm shielded") + _MASS
                   + _CHAMFER.format("0.15 mm"), 0.15),
        BearingRow("MR126ZZ", 6.0, 12.0, 4.0, 1.7, False, _MINIATURE.format("6 x 12 x 4 mm shielded") + _MASS
                   + _CHAMFER.format("0.15 mm"), 0.15),
        BearingRow("MR128ZZ", 8.0, 12.0, 3.5, 1.1, False, _MINIATURE.format("8 x 12 x 3.5 mm shielded") + _MASS
                   + _CHAMFER.format("0.1 mm"), 0.1),
        BearingRow("MR148ZZ", 8.0, 14.0, 4.0, 2.0, False, _MINIATURE.format("8 x 14 x 4 mm shielded") + _MASS
                   + _CHAMFER.format("0.15 mm"), 0.15),
        BearingRow("695ZZ", 5.0, 13.0, 4.0, 2.3, False,
                   "ISO 15 dimension series 19 (69 series), 5 x 13 x 4 mm (from memory); " + _MASS
                   + _CHAMFER.format("0.2 mm"), 0.2),
        BearingRow("696ZZ", 6.0, 15.0, 5.0, 3.8, False,
                   "ISO 15 dimension series 19 (69 series), 6 x 15 x 5 mm (from memory); " + _MASS
                   + _CHAMFER.format("0.2 mm"), 0.2),
        BearingRow("688ZZ", 8.0, 16.0, 5.0, 3.1, False,
                   "68 series, 8 x 16 mm; shielded width 5 mm (the open 688 of ISO 15 dimension series 18 is 4 mm "
                   "wide) (from memory); " + _MASS + _CHAMFER.format("0.2 mm"), 0.2),
        BearingRow("698ZZ", 8.0, 19.0, 6.0, 7.2, False,
                   "ISO 15 dimension series 19 (69 series), 8 x 19 x 6 mm (from memory); " + _MASS
                   + _CHAMFER.format("0.3 mm"), 0.3),
        BearingRow("608ZZ", 8.0, 22.0, 7.0, 12.0, False,
                   "ISO 15 dimension series 10 (60 series), 8 x 22 x 7 mm (from memory); " + _MASS
                   + _CHAMFER.format("0.3 mm"), 0.3),
    )
}

#: trade letter sizes  # common practice, no published source
LETTER_SIZES: dict[str, str] = {"C": "R188ZZ"}


def lookup_bearing(name: str) -> BearingRow:
    """A bearing by trade letter size or designation (case-insensitive); KeyError if unknown.

    An exact designation wins; otherwise a name without the shield suffix ("MR105")
    finds the shielded row.
    """
    key = name.strip().upper()
    key = LETTER_SIZES.get(key, key)
    for designation, row in BEARINGS.items():
        if designation.upper() == key:
            return row
    for designation, row in BEARINGS.items():
        if designation.upper().removesuffix("ZZ") == key:
            return row
    raise KeyError(name)
