"""Rolling-bearing precision classes (ISO 492 / ABEC): bore and outside-diameter mean deviations.

First version: one size step per class. The fits work generalises it.
"""
from __future__ import annotations

__all__ = ["PRECISION_CLASSES", "normalise_precision", "bearing_deviation_um"]

# ISO 492 class -> (bore 2.5-10 mm, OD 6-18 mm), each (upper, lower) in µm  # from memory
_TABLE: dict[str, tuple[tuple[float, float], tuple[float, float]]] = {
    "Normal": ((0.0, -8.0), (0.0, -8.0)),
    "P6": ((0.0, -7.0), (0.0, -7.0)),
    "P5": ((0.0, -5.0), (0.0, -5.0)),
    "P4": ((0.0, -4.0), (0.0, -4.0)),
    "P2": ((0.0, -2.5), (0.0, -2.5)),
}
_ABEC = {"ABEC 1": "Normal", "ABEC 3": "P6", "ABEC 5": "P5", "ABEC 7": "P4", "ABEC 9": "P2"}  # ABMA Std 20
PRECISION_CLASSES = tuple(_TABLE) + tuple(_ABEC)


def normalise_precision(text: str) -> str:
    """The ISO 492 class name for ``text`` ("ABEC 7" -> "P4"); KeyError if unknown."""
    key = " ".join(text.upper().replace("ABEC", "ABEC ").split())
    for name in _TABLE:
        if name.upper() == key:
            return name
    return _ABEC[key]


def bearing_deviation_um(precision: str, kind: str, size_mm: float) -> tuple[float, float]:
    """(upper, lower) mean deviation in µm of the bearing ``kind`` ("bore" or "od")."""
    bore, od = _TABLE[normalise_precision(precision)]
    return bore if kind == "bore" else od
