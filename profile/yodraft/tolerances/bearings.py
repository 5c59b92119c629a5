"""Rolling-bearing precision classes: bore and outside-diameter mean deviations.

ISO 492 tolerance classes Normal, P6, P5, P4, P2 for radial bearings, with the
ABEC 1/3/5/7/9 equivalents of ABMA Std 20. The deviations are those of the
mean bore diameter (Δdmp), the mean outside diameter (ΔDmp) and the inner ring
width (ΔBs, which sets the distance between the two seat faces), upper then
lower, in µm, for the small size steps a yo-yo bearing falls in:
bore 0.6–2.5, 2.5–10, 10–18 mm; outside diameter 2.5–6, 6–18, 18–30 mm
(each step "over … up to and including"; the first bore step includes 0.6 mm).

Miniature and instrument bearings (the inch R series, many metric MR sizes)
are sometimes made to the ABMA Std 12 classes instead (ABEC 3P, 5P, 7P, 5T,
7T, …), whose limits differ somewhat; those classes are not held here and
:func:`normalise_precision` rejects them with a KeyError.

>>> bearing_deviation_um("ABEC 7", "bore", 6.35)
(0.0, -4.0)
>>> bearing_deviation_um("P5", "od", 12.7)
(0.0, -5.0)
"""
from __future__ import annotations

__all__ = ["PRECISION_CLASSES", "ISO_CLASSES", "BORE_STEPS", "OD_STEPS",
           "normalise_precision", "bearing_deviation_um"]

#: size steps (over, up to and including), mm  # ISO 492, radial bearings
BORE_STEPS: tuple[tuple[float, float], ...] = ((0.6, 2.5), (2.5, 10.0), (10.0, 18.0))
OD_STEPS: tuple[tuple[float, float], ...] = ((2.5, 6.0), (6.0, 18.0), (18.0, 30.0))

# (upper, lower) µm per step above  # ISO 492, inner ring Δdmp and outer ring ΔDmp (from memory)
_BORE: dict[str, tuple[tuple[float, float], ...]] = {
    "Normal": ((0.0, -8.0), (0.0, -8.0), (0.0, -8.0)),
    "P6": ((0.0, -7.0), (0.0, -7.0), (0.0, -7.0)),
    "P5": ((0.0, -5.0), (0.0, -5.0), (0.0, -5.0)),
    "P4": ((0.0, -4.0), (0.0, -4.0), (0.0, -4.0)),
    "P2": ((0.0, -2.5), (0.0, -2.5), (0.0, -2.5)),
}
_OD: dict[str, tuple[tuple[float, float], ...]] = {
    "Normal": ((0.0, -8.0), (0.0, -8.0), (0.0, -9.0)),
    "P6": ((0.0, -7.0), (0.0, -7.0), (0.0, -8.0)),
    "P5": ((0.0, -5.0), (0.0, -5.0), (0.0, -6.0)),
    "P4": ((0.0, -4.0), (0.0, -4.0), (0.0, -5.0)),
    "P2": ((0.0, -2.5), (0.0, -2.5), (0.0, -4.0)),
}
# (upper, lower) µm per bore step  # ISO 492, inner ring width deviation ΔBs (from memory)
_WIDTH: dict[str, tuple[tuple[float, float], ...]] = {
    "Normal": ((0.0, -40.0), (0.0, -120.0), (0.0, -120.0)),
    "P6": ((0.0, -40.0), (0.0, -120.0), (0.0, -120.0)),
    "P5": ((0.0, -40.0), (0.0, -40.0), (0.0, -80.0)),
    "P4": ((0.0, -40.0), (0.0, -40.0), (0.0, -80.0)),
    "P2": ((0.0, -40.0), (0.0, -40.0), (0.0, -80.0)),
}
ISO_CLASSES: tuple[str, ...] = tuple(_BORE)
_ABEC = {"ABEC 1": "Normal", "ABEC 3": "P6", "ABEC 5": "P5", "ABEC 7": "P4", "ABEC 9": "P2"}  # ABMA Std 20
_ALIASES = {"P0": "Normal", "PN": "Normal", "NORMAL": "Normal", "P6": "P6", "P5": "P5", "P4": "P4", "P2": "P2"}
PRECISION_CLASSES: tuple[str, ...] = ISO_CLASSES + tuple(_ABEC)


def normalise_precision(text: str) -> str:
    """The ISO 492 class name for ``text``; KeyError if unknown.

    >>> normalise_precision("ABEC 7"), normalise_precision("p4"), normalise_precision("abec-1")
    ('P4', 'P4', 'Normal')
    """
    if not isinstance(text, str):
        raise KeyError(text)
    key = " ".join(text.upper().replace("-", " ").replace("ABEC", "ABEC ").split())
    if key in _ALIASES:
        return _ALIASES[key]
    if key in _ABEC:
        return _ABEC[key]
    raise KeyError(text)


def _step(steps: tuple[tuple[float, float], ...], size_mm: float, kind: str) -> int:
    low0 = steps[0][0]
    for i, (low, high) in enumerate(steps):
        if (low < size_mm or (i == 0 and size_mm == low0)) and size_mm <= high:
            return i
    raise ValueError(f"bearing {kind} {size_mm:g} mm is outside the ISO 492 steps held here "
                     f"(expected {low0:g} to {steps[-1][1]:g} mm)")


def bearing_deviation_um(precision: str, kind: str, size_mm: float) -> tuple[float, float]:
    """(upper, lower) deviation in µm of the bearing ``kind``: "bore" or "od" (mean diameters),
    or "width" (inner ring width, looked up by the bore ``size_mm``).

    KeyError for an unknown precision class, ValueError for an unknown kind or a
    size outside the held steps.
    """
    name = normalise_precision(precision)
    if kind == "bore":
        return _BORE[name][_step(BORE_STEPS, size_mm, kind)]
    if kind == "od":
        return _OD[name][_step(OD_STEPS, size_mm, "outside diameter")]
    if kind == "width":
        return _WIDTH[name][_step(BORE_STEPS, size_mm, "bore")]
    raise ValueError(f"bearing deviation kind {kind!r} is unknown (expected 'bore', 'od' or 'width')")
