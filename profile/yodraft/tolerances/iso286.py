"""ISO 286 limits and fits for sizes up to 120 mm: IT grades, fundamental deviations, fit codes.

Values come from the tables of ISO 286-1 (standard tolerance grades IT1–IT12,
fundamental deviations, Δ values) as transcribed here, not from the IT formula.
Size steps are "over a, up to and including b"; the first step is 0 (excl.) to 3.

Supported tolerance classes
---------------------------
Holes: E F G H JS (grades 1–12); K M N (grades 3–8, with Δ); K M (grades 9–12, without Δ); N (grades 9–11);
P (grades 3–7 with Δ, 8–12 without); N9–N11 only over 1 mm. Shafts: e f g h js k m n p, and the
interference letters r s u (grades 1–12; u is the force fit's shaft, as in H7/u6).
Anything else (other letters, K/M/N/P below grade 3, N above 11, the grades IT01 and IT0,
sizes over 120 mm) raises :class:`FitCodeError` naming what is not supported. A grade is
written as the standard writes it ("7", "01"): "007" or "H07" is not read as IT7.

JS/js are taken as exactly ± IT/2 (half-micrometre values are kept, not rounded).

>>> hole_limits("H", 7, 6.0)
Limits(upper_um=12.0, lower_um=0.0)
>>> shaft_limits("g", 6, 6.0)
Limits(upper_um=-4.0, lower_um=-12.0)
>>> f = parse_fit("Ø6 H7/g6")
>>> (f.clearance_min_um, f.clearance_max_um)
(4.0, 24.0)
"""
from __future__ import annotations

import math
import re
from dataclasses import dataclass

from ..units import MM_PER_INCH

__all__ = [
    "SIZE_STEPS",
    "MAX_SIZE_MM",
    "FitCodeError",
    "Limits",
    "Fit",
    "size_step",
    "it_um",
    "delta_um",
    "hole_limits",
    "shaft_limits",
    "parse_fit",
    "fit_summary",
    "fit_kind",
    "hole_basis_split",
]

#: size steps (over, up to and including), mm  # ISO 286-1, Table 1
SIZE_STEPS: tuple[tuple[float, float], ...] = (
    (0.0, 3.0), (3.0, 6.0), (6.0, 10.0), (10.0, 18.0),
    (18.0, 30.0), (30.0, 50.0), (50.0, 80.0), (80.0, 120.0),
)
MAX_SIZE_MM = SIZE_STEPS[-1][1]

#: standard tolerance grades, µm, one value per size step above  # ISO 286-1, Table 1
_IT: dict[int, tuple[float, ...]] = {
    1: (0.8, 1.0, 1.0, 1.2, 1.5, 1.5, 2.0, 2.5),
    2: (1.2, 1.5, 1.5, 2.0, 2.5, 2.5, 3.0, 4.0),
    3: (2.0, 2.5, 2.5, 3.0, 4.0, 4.0, 5.0, 6.0),
    4: (3.0, 4.0, 4.0, 5.0, 6.0, 7.0, 8.0, 10.0),
    5: (4.0, 5.0, 6.0, 8.0, 9.0, 11.0, 13.0, 15.0),
    6: (6.0, 8.0, 9.0, 11.0, 13.0, 16.0, 19.0, 22.0),
    7: (10.0, 12.0, 15.0, 18.0, 21.0, 25.0, 30.0, 35.0),
    8: (14.0, 18.0, 22.0, 27.0, 33.0, 39.0, 46.0, 54.0),
    9: (25.0, 30.0, 36.0, 43.0, 52.0, 62.0, 74.0, 87.0),
    10: (40.0, 48.0, 58.0, 70.0, 84.0, 100.0, 120.0, 140.0),
    11: (60.0, 75.0, 90.0, 110.0, 130.0, 160.0, 190.0, 220.0),
    12: (100.0, 120.0, 150.0, 180.0, 210.0, 250.0, 300.0, 350.0),
}
GRADES = tuple(_IT)

#: shaft upper deviation es (µm) for e f g h, per size step  # ISO 286-1, Table 2
_SHAFT_ES: dict[str, tuple[float, ...]] = {
    "e": (-14.0, -20.0, -25.0, -32.0, -40.0, -50.0, -60.0, -72.0),
    "f": (-6.0, -10.0, -13.0, -16.0, -20.0, -25.0, -30.0, -36.0),
    "g": (-2.0, -4.0, -5.0, -6.0, -7.0, -9.0, -10.0, -12.0),
    "h": (0.0,) * 8,
}
#: shaft lower deviation ei (µm) for m n p (all grades) and k (grades 4–7)  # ISO 286-1, Table 2
_SHAFT_EI: dict[str, tuple[float, ...]] = {
    "k": (0.0, 1.0, 1.0, 1.0, 2.0, 2.0, 2.0, 3.0),
    "m": (2.0, 4.0, 6.0, 7.0, 8.0, 9.0, 11.0, 13.0),
    "n": (4.0, 8.0, 10.0, 12.0, 15.0, 17.0, 20.0, 23.0),
    "p": (6.0, 12.0, 15.0, 18.0, 22.0, 26.0, 32.0, 37.0),
}
#: Δ (µm) for holes K M N (grades ≤ 8) and P (grades ≤ 7), grades 3..8  # ISO 286-1, Table 3
_DELTA: dict[int, tuple[float, ...]] = {
    3: (0.0, 1.0, 1.0, 1.0, 1.5, 1.5, 2.0, 2.0),
    4: (0.0, 1.5, 1.5, 2.0, 2.0, 3.0, 3.0, 4.0),
    5: (0.0, 1.0, 2.0, 3.0, 3.0, 4.0, 5.0, 5.0),
    6: (0.0, 3.0, 3.0, 3.0, 4.0, 5.0, 6.0, 7.0),
    7: (0.0, 4.0, 6.0, 7.0, 8.0, 9.0, 11.0, 13.0),
    8: (0.0, 6.0, 7.0, 9.0, 12.0, 14.0, 16.0, 19.0),
}

#: shaft lower deviation ei (µm) for the interference letters r, s and u (all grades), whose table splits the
#: size steps further: each letter's (steps' upper ends in mm, values); r and s split the steps above 50 mm
#: (over 0, 3, 6, 10, 18, 30, 50, 65, 80, 100 up to 120), u also those from 18 to 50 mm (at 24 and 40)  # ISO 286-1, Table 2
_R_S_STEPS = (3.0, 6.0, 10.0, 18.0, 30.0, 50.0, 65.0, 80.0, 100.0, 120.0)
_U_STEPS = (3.0, 6.0, 10.0, 18.0, 24.0, 30.0, 40.0, 50.0, 65.0, 80.0, 100.0, 120.0)
_SHAFT_EI_FINE: dict[str, tuple[tuple[float, ...], tuple[float, ...]]] = {
    "r": (_R_S_STEPS, (10.0, 15.0, 19.0, 23.0, 28.0, 34.0, 41.0, 43.0, 51.0, 54.0)),
    "s": (_R_S_STEPS, (14.0, 19.0, 23.0, 28.0, 35.0, 43.0, 53.0, 59.0, 71.0, 79.0)),
    "u": (_U_STEPS, (18.0, 23.0, 28.0, 33.0, 41.0, 48.0, 60.0, 70.0, 87.0, 102.0, 124.0, 144.0)),
}

_HOLE_LETTERS = ("E", "F", "G", "H", "JS", "K", "M", "N", "P")
_SHAFT_LETTERS = ("e", "f", "g", "h", "js", "k", "m", "n", "p", "r", "s", "u")


class FitCodeError(ValueError):
    """A fit code or tolerance class that is not understood or not supported (one line)."""

    def __init__(self, problem: str, expected: str = "") -> None:
        self.problem = problem
        self.expected = expected
        super().__init__(problem, expected)

    def __str__(self) -> str:
        text = f"{self.problem} (expected {self.expected})" if self.expected else self.problem
        return " ".join(text.split())


@dataclass(frozen=True)
class Limits:
    """Upper and lower deviation of one tolerance class from the nominal size, µm."""

    upper_um: float
    lower_um: float

    def __post_init__(self) -> None:
        if self.upper_um < self.lower_um:
            raise ValueError(f"upper deviation {self.upper_um} µm is below lower {self.lower_um} µm")

    @property
    def band_um(self) -> float:
        """Width of the tolerance band, µm."""
        return self.upper_um - self.lower_um


def _round(um: float) -> float:
    # keeps table arithmetic like 0.8 + 12 free of binary noise in reports
    return round(um, 6) + 0.0


def _step_index(size_mm: float) -> int:
    if not size_mm > 0:
        raise FitCodeError(f"size {size_mm!r} mm is not positive", "a nominal size over 0 mm")
    for i, (_low, high) in enumerate(SIZE_STEPS):
        if size_mm <= high:
            return i
    raise FitCodeError(f"size {size_mm:g} mm is beyond the ISO 286 table held here",
                       f"a nominal size up to {MAX_SIZE_MM:g} mm")


def size_step(size_mm: float) -> tuple[float, float]:
    """The ISO 286 size step (over, up to and including) that holds ``size_mm``.

    >>> size_step(6.0), size_step(6.001), size_step(3.0)
    ((3.0, 6.0), (6.0, 10.0), (0.0, 3.0))
    """
    return SIZE_STEPS[_step_index(size_mm)]


def _check_grade(grade: int) -> None:
    if isinstance(grade, bool) or not isinstance(grade, int) or grade not in _IT:
        raise FitCodeError(f"tolerance grade IT{grade} is out of range",
                           f"a grade from IT{GRADES[0]} to IT{GRADES[-1]}")


def it_um(grade: int, size_mm: float) -> float:
    """Standard tolerance ITgrade in µm for a nominal size.

    >>> it_um(6, 6.0), it_um(7, 10.0)
    (8.0, 15.0)
    """
    _check_grade(grade)
    return _IT[grade][_step_index(size_mm)]


def delta_um(grade: int, size_mm: float) -> float:
    """The Δ value (µm) added to holes K, M, N up to grade 8 and P up to grade 7."""
    _check_grade(grade)
    if grade not in _DELTA:
        raise FitCodeError(f"no Δ value for grade IT{grade}", "a grade from IT3 to IT8")
    return _DELTA[grade][_step_index(size_mm)]


def shaft_limits(letter: str, grade: int, size_mm: float) -> Limits:
    """Limits (es, ei) of the shaft tolerance class ``letter``+``grade`` at ``size_mm``.

    >>> shaft_limits("k", 6, 8.0)
    Limits(upper_um=10.0, lower_um=1.0)
    """
    if letter not in _SHAFT_LETTERS:
        raise FitCodeError(f"shaft letter {letter!r} is not supported",
                           "one of " + " ".join(_SHAFT_LETTERS))
    it = it_um(grade, size_mm)
    i = _step_index(size_mm)
    if letter == "js":
        return Limits(_round(it / 2), _round(-it / 2))
    if letter in _SHAFT_ES:
        es = _SHAFT_ES[letter][i]
        return Limits(_round(es), _round(es - it))
    if letter in _SHAFT_EI_FINE:
        tops, values = _SHAFT_EI_FINE[letter]
        ei = values[next(j for j, top in enumerate(tops) if size_mm <= top)]
        return Limits(_round(ei + it), _round(ei))
    if letter == "k" and not 4 <= grade <= 7:
        ei = 0.0  # k above IT7 and up to IT3 sits on the zero line  # ISO 286-1, Table 2
    else:
        ei = _SHAFT_EI[letter][i]
    return Limits(_round(ei + it), _round(ei))


def hole_limits(letter: str, grade: int, size_mm: float) -> Limits:
    """Limits (ES, EI) of the hole tolerance class ``letter``+``grade`` at ``size_mm``.

    >>> hole_limits("K", 7, 8.0)
    Limits(upper_um=5.0, lower_um=-10.0)
    """
    if letter not in _HOLE_LETTERS:
        raise FitCodeError(f"hole letter {letter!r} is not supported",
                           "one of " + " ".join(_HOLE_LETTERS))
    it = it_um(grade, size_mm)
    i = _step_index(size_mm)
    low = letter.lower()
    if letter == "JS":
        return Limits(_round(it / 2), _round(-it / 2))
    if low in _SHAFT_ES:
        ei = -_SHAFT_ES[low][i]  # EI = −es of the matching shaft letter
        return Limits(_round(ei + it), _round(ei))
    if letter in ("K", "M", "N") and 3 <= grade <= 8:
        es = -_SHAFT_EI[low][i] + delta_um(grade, size_mm)
    elif letter == "P" and 3 <= grade <= 7:
        es = -_SHAFT_EI[low][i] + delta_um(grade, size_mm)
    elif letter == "P" and grade >= 8:
        es = -_SHAFT_EI[low][i]
    elif letter == "K" and grade >= 9:
        es = 0.0  # K above IT8 sits on the zero line  # ISO 286-1, Table 3 (from memory)
    elif letter == "M" and grade >= 9:
        es = -_SHAFT_EI["m"][i]  # M above IT8: ES = −m, no Δ  # ISO 286-1, Table 3
    elif letter == "N" and 9 <= grade <= 11:
        if size_mm <= 1.0:  # ISO 286-1, Table 3 footnote: N above IT8 not for sizes up to 1 mm
            raise FitCodeError(f"hole class N{grade} is not used for sizes up to 1 mm",
                               "N with a grade from 3 to 8 at this size")
        es = -4.0 if i == 0 else 0.0  # ISO 286-1, Table 3, N above IT8
    else:
        supported = {"K": "3 to 12", "M": "3 to 12", "N": "3 to 11", "P": "3 to 12"}[letter]
        raise FitCodeError(f"hole class {letter}{grade} is not supported here",
                           f"{letter} with a grade from {supported}")
    return Limits(_round(es), _round(es - it))


@dataclass(frozen=True)
class Fit:
    """A nominal size with a hole class, a shaft class, or both; clearances in µm.

    Clearance = hole − shaft; negative means interference. With one part only
    the clearances are None.
    """

    size_mm: float
    hole: Limits | None
    shaft: Limits | None
    hole_code: str | None
    shaft_code: str | None
    clearance_min_um: float | None
    clearance_max_um: float | None

    @property
    def code(self) -> str:
        """The normalised code, size in mm: ``"6 H7/g6"``."""
        parts = "/".join(c for c in (self.hole_code, self.shaft_code) if c)
        return f"{self.size_mm:.10g} {parts}"


_EXPECTED_CODE = 'a code like "6 H7/g6", "0.25in h6" or "Ø12 H7"'
_CODE = re.compile(
    r"^\s*[Øø⌀]?\s*(?P<num>(?:\d+(?:\.\d*)?|\.\d+))\s*(?P<unit>mm|in|inch|\")?\s*"
    r"(?P<first>[A-Za-z]+\d+)\s*(?:/\s*(?P<second>[A-Za-z]+\d+))?\s*$"
)
_CLASS = re.compile(r"^([A-Za-z]+)(\d+)$")


def _split_class(text: str) -> tuple[str, int]:
    match = _CLASS.match(text)
    if not match:  # pragma: no cover - the code pattern already guarantees the shape
        raise FitCodeError(f"cannot read tolerance class {text!r}", "a letter and a grade, e.g. H7")
    letter, digits = match.group(1), match.group(2)
    if digits in ("01", "0"):
        raise FitCodeError(f"tolerance grade IT{digits} of {text!r} is not held here",
                           f"a grade from IT{GRADES[0]} to IT{GRADES[-1]}")
    if digits.startswith("0"):
        raise FitCodeError(f"cannot read tolerance grade {digits!r} of {text!r}", "a grade such as 7 or 11, e.g. H7")
    grade = int(digits)
    if letter not in _HOLE_LETTERS and letter not in _SHAFT_LETTERS:
        raise FitCodeError(f"tolerance class {text!r} has an unknown or unsupported letter {letter!r}",
                           "holes " + " ".join(_HOLE_LETTERS) + ", shafts " + " ".join(_SHAFT_LETTERS))
    _check_grade(grade)
    return letter, grade


def parse_fit(code: str) -> Fit:
    """Read a fit code: size (bare = mm, or with mm/in) then hole class and/or shaft class.

    Upper-case letters are holes, lower-case are shafts; in a pair the hole comes first.

    >>> parse_fit("12 H7/h6").clearance_max_um
    29.0
    >>> parse_fit("0.25in h6").shaft
    Limits(upper_um=0.0, lower_um=-9.0)
    """
    if not isinstance(code, str):
        raise FitCodeError(f"fit code {code!r} is not text", _EXPECTED_CODE)
    match = _CODE.match(code)
    if not match:
        raise FitCodeError(f"cannot read fit code {code.strip()[:40]!r}", _EXPECTED_CODE)
    size = float(match["num"])
    if match["unit"] in ("in", "inch", '"'):
        size *= MM_PER_INCH
    first, second = match["first"], match["second"]
    letter1, grade1 = _split_class(first)
    hole = shaft = None
    hole_code = shaft_code = None
    if second is None:
        if letter1 in _HOLE_LETTERS:
            hole, hole_code = hole_limits(letter1, grade1, size), first
        else:
            shaft, shaft_code = shaft_limits(letter1, grade1, size), first
    else:
        letter2, grade2 = _split_class(second)
        if letter1 not in _HOLE_LETTERS or letter2 not in _SHAFT_LETTERS:
            raise FitCodeError(f"fit {first}/{second} is not hole/shaft",
                               "the hole class (upper case) first, then the shaft class (lower case), e.g. H7/g6")
        hole, hole_code = hole_limits(letter1, grade1, size), first
        shaft, shaft_code = shaft_limits(letter2, grade2, size), second
    cmin = cmax = None
    if hole is not None and shaft is not None:
        cmin = _round(hole.lower_um - shaft.upper_um)
        cmax = _round(hole.upper_um - shaft.lower_um)
    return Fit(size, hole, shaft, hole_code, shaft_code, cmin, cmax)


def hole_basis_split(size_mm: float, least_um: float, greatest_um: float) -> Fit:
    """An interference given by its limits (least and greatest diametral interference, µm) as the two
    parts' limit deviations, to whole µm, on the hole-basis system (ISO 286-1: the hole's lower
    deviation is zero). The hole takes the larger share of the band, IT7 : IT6 at the size (ISO 286-1,
    Table 1), as in the preferred fit H7/s6 where the hole is a grade coarser than the shaft (a bore is
    the harder size to hold); the shaft takes the rest, so hole and shaft together give exactly the
    interference limits (rounded inward to the µm when they are not whole µm). No class code: the
    deviations are the design's own.

    >>> f = hole_basis_split(52.0, 50.0, 80.0)
    >>> f.hole, f.shaft, (f.clearance_min_um, f.clearance_max_um)
    (Limits(upper_um=18.0, lower_um=0.0), Limits(upper_um=80.0, lower_um=68.0), (-80.0, -50.0))
    """
    lo, hi = math.ceil(least_um - 1e-6), math.floor(greatest_um + 1e-6)
    band = max(0, hi - lo)
    step = min(size_mm, MAX_SIZE_MM)
    share = it_um(7, step) / (it_um(6, step) + it_um(7, step))
    hole_band = math.floor(band * share + 1e-9)
    hole = Limits(float(hole_band), 0.0)
    shaft = Limits(float(max(hi, lo)), float(lo + hole_band))
    return Fit(size_mm, hole, shaft, None, None, _round(hole.lower_um - shaft.upper_um),
               _round(hole.upper_um - shaft.lower_um))


def fit_kind(fit: Fit) -> str | None:
    """"clearance", "transition" or "interference"; None for a single part."""
    if fit.clearance_min_um is None or fit.clearance_max_um is None:
        return None
    if fit.clearance_min_um >= 0:
        return "clearance"
    if fit.clearance_max_um <= 0:
        return "interference"
    return "transition"


def _part(size_mm: float, code: str | None, limits: Limits | None) -> dict[str, object] | None:
    if limits is None:
        return None
    return {
        "code": code,
        "upper_um": limits.upper_um,
        "lower_um": limits.lower_um,
        "max_mm": round(size_mm + limits.upper_um / 1000, 7),
        "min_mm": round(size_mm + limits.lower_um / 1000, 7),
    }


def fit_summary(fit: Fit) -> dict[str, object]:
    """The JSON object printed by ``yodraft fit CODE --json``.

    Keys: code (normalised, size in mm), size_mm, hole, shaft (each {code, upper_um, lower_um, max_mm, min_mm}
    or null), clearance_min_um, clearance_max_um (null for one part; negative =
    interference), kind ("clearance" | "transition" | "interference" | null).

    >>> s = fit_summary(parse_fit("6 H7/g6"))
    >>> s["hole"]["max_mm"], s["shaft"]["min_mm"], s["kind"]
    (6.012, 5.988, 'clearance')
    """
    return {
        "code": fit.code,
        "size_mm": fit.size_mm,
        "hole": _part(fit.size_mm, fit.hole_code, fit.hole),
        "shaft": _part(fit.size_mm, fit.shaft_code, fit.shaft),
        "clearance_min_um": fit.clearance_min_um,
        "clearance_max_um": fit.clearance_max_um,
        "kind": fit_kind(fit),
    }
