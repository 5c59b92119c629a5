"""Quantities at the edge: the one pint registry, strict parsing and formatting.

Inside yodraft every length is a float in millimetres, every mass in grams and
every angle in radians. Text such as ``"0.25 in"`` is turned into those floats
here and nowhere else. Parsing is a strict pattern (a number, then a unit):
no expression of user text is ever evaluated.

>>> parse_quantity("0.25 in", "length")
6.35
>>> round(parse_quantity("22 deg", "angle"), 6)
0.383972
"""
from __future__ import annotations

import functools
import math
import re
from pathlib import Path
from typing import TYPE_CHECKING

from .errors import toml_shown

if TYPE_CHECKING:  # pragma: no cover
    import pint

__all__ = ["registry", "parse_quantity", "COMMON_UNITS", "written", "is_dimension", "in_inches", "unit_of", "KINDS", "DISPLAY_UNITS", "MM_PER_INCH",
           "SHEET_RESOLUTION_MM", "UnitError"]

MM_PER_INCH = 25.4  # exact by the international yard and pound agreement, 1959
#: the sheet writes sizes and tolerances to the whole µm, so no length a design gives may be finer than this
#: (``params.SMALLEST_OF``; the few written in µm excepted)
SHEET_RESOLUTION_MM = 0.001

#: the base unit each kind is converted to, and how a user would write one
KINDS: dict[str, tuple[str, str]] = {
    "length": ("millimeter", 'a length with a unit, e.g. "12.7 mm" or "0.5 in"'),
    "mass": ("gram", 'a mass with a unit, e.g. "66 g"'),
    "angle": ("radian", 'an angle with a unit, e.g. "15 deg"'),
    "torque": ("newton * millimeter", 'a torque with a unit, e.g. "0.02 N*mm"'),
    "density": ("gram / centimeter ** 3", 'a density with a unit, e.g. "2.70 g/cm^3"'),
    "speed": ("revolution / minute", 'a spin rate with a unit, e.g. "10000 rpm"'),
    "inertia": ("gram * millimeter ** 2", 'a moment of inertia with a unit, e.g. "30000 g*mm^2"'),
    "roughness": ("micrometer", 'a roughness with a unit, e.g. "0.8 um"'),
    "force": ("newton", 'a force with a unit, e.g. "500 N"'),
    "temperature": ("degree_Celsius", 'a temperature with a unit, e.g. "60 degC" or "140 degF"'),
    "temperature_difference": ("kelvin", 'a temperature difference in kelvin, e.g. "150 K"'),
}

#: how a value of each kind is shown to the user and written back into a design file:
#: (divisor from the base unit, unit text, suffix of a column or JSON key holding it)
DISPLAY_UNITS: dict[str, tuple[float, str, str]] = {
    "length": (1.0, "mm", "_mm"), "angle": (math.pi / 180, "deg", "_deg"), "mass": (1.0, "g", "_g"),
    "torque": (1.0, "N*mm", "_n_mm"), "density": (1.0, "g/cm^3", "_g_cm3"), "speed": (1.0, "rpm", "_rpm"),
    "inertia": (1.0, "g*mm^2", "_g_mm2"), "roughness": (1.0, "um", "_um"),
    "force": (1.0, "N", "_n"), "temperature": (1.0, "degC", "_c"), "temperature_difference": (1.0, "K", "_k"),
    "number": (1.0, "", "")}

#: the unit a summary or column key holds, read from its suffix; longest suffix first ("_g_mm2" before "_g")
SUFFIX_UNITS = (("_kg_m2_per_s", "kg·m²/s"), ("_m_s2", "m/s²"), ("_mm_s", "mm/s"), ("_g_mm2", "g·mm²"),
                ("_g_mm", "g·mm"), ("_g_cm3", "g/cm³"), ("_n_mm", "N·mm"), ("_rad_s", "rad/s"), ("_mm2", "mm²"),
                ("_mm3", "mm³"), ("_mm", "mm"), ("_um", "µm"), ("_deg", "°"), ("_rpm", "rpm"), ("_g", "g"),
                ("_j", "J"), ("_mj", "mJ"), ("_s", "s"), ("_pct", "%"), ("_mpa", "MPa"), ("_gpa", "GPa"),
                ("_k", "K"), ("_n", "N"))


def written(value: float, kind: str) -> str | float:
    """A value in base units as a design file writes it: ``"5.5 mm"``, ``"20 deg"``, or a plain number.

    >>> written(5.5, "length"), written(math.radians(20), "angle"), written(0.8, "number")
    ('5.5 mm', '20 deg', 0.8)
    """
    div, unit, _ = DISPLAY_UNITS[kind]
    return round(value, 12) if kind == "number" else f"{value / div:.12g} {unit}"


def is_dimension(value: object) -> bool:
    """Whether a feature's dimension is a size (mm, or radians for an angle): a number, whole (a catalog's
    M4 is 4 mm) or not, but not a truth value or a text.

    >>> is_dimension(4), is_dimension(6.35), is_dimension(True), is_dimension("M4x0.7")
    (True, True, False, False)
    """
    return isinstance(value, (int, float)) and not isinstance(value, bool)


def in_inches(text: object) -> bool:
    """Whether a length is written in inches in a design file.

    >>> in_inches("0.25 in"), in_inches(" 0.25inch "), in_inches("6.35 mm"), in_inches(6.35)
    (True, True, False, False)
    """
    match = _PATTERN.match(text) if isinstance(text, str) else None
    return match is not None and "".join(match.group(2).split()) in ("in", "inch")


def unit_of(key: str) -> str:
    """The unit a summary key holds, from its suffix ('' for a plain number); an index at the end is not
    part of the suffix, a row name inside the key is.

    >>> unit_of("mass.izz_g_mm2"), unit_of("bearing.od_deviation_um[1]"), unit_of("spin.rim_share")
    ('g·mm²', 'µm', '')
    >>> unit_of("mass.budget[half].each_g"), unit_of("mass.budget[half].count")
    ('g', '')
    """
    base = key[:key.rindex("[")] if key.endswith("]") else key
    for suffix, unit in SUFFIX_UNITS:
        if base.endswith(suffix):
            return unit
    return ""


# "nan" and "inf" are read as numbers only so that the message can say they are not finite
_NUMBER = r"[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?|[+-]?(?i:nan|inf(?:inity)?)"
# unit names joined by * or /, each with an optional one-digit power ("g/cm^3"): a huge power
# such as "km**400/m**399" would overflow the conversion, and no design quantity needs one
_FACTOR = r"[A-Za-zµμ°][A-Za-z0-9µμ°_]*(?:\s*(?:\*\*|\^)\s*[1-9])?"
_UNIT = rf"{_FACTOR}(?:\s*[*/]\s*{_FACTOR})*"
_PATTERN = re.compile(rf"^\s*({_NUMBER})\s*({_UNIT})\s*$")


class UnitError(ValueError):
    """A quantity text that is not a number followed by a unit of the right kind."""


#: the units design files mostly use, per kind: unit text (spaces removed) → factor to the kind's base unit, so
#: that reading a design of these alone does not import pint (about 0.1 s of every command's start). Every row is
#: pint's own answer from units.txt: tests/test_units.py converts through the registry and asserts equality.
#: Any other unit text goes to the registry; temperatures (offset scales) always do.
COMMON_UNITS: dict[str, dict[str, float]] = {
    "length": {"mm": 1.0, "cm": 10.0, "m": 1000.0, "um": 0.001, "in": 25.4, "inch": 25.4, "thou": 0.0254,
               "mil": 0.0254},
    "mass": {"g": 1.0, "kg": 1000.0, "mg": 0.001, "oz": 28.349523125, "lb": 453.59237},
    "angle": {"deg": math.pi / 180, "rad": 1.0},
    "torque": {"N*mm": 1.0, "N*m": 1000.0, "mN*m": 1.0},
    "density": {"g/cm**3": 1.0, "g/mm**3": 1000.0},
    "speed": {"rpm": 1.0, "rev/min": 1.0, "Hz": 60.0, "rev/s": 60.0},
    "inertia": {"g*mm**2": 1.0, "g*cm**2": 100.0, "kg*mm**2": 1000.0, "kg*m**2": 1e9},
    "roughness": {"um": 1.0},
    "force": {"N": 1.0, "kN": 1000.0},
    "temperature_difference": {"K": 1.0},
}


@functools.cache
def registry() -> "pint.UnitRegistry":
    """The one unit registry, from our own small definitions file (created once, on first use: the commands
    that read no quantity never import pint, nor the numpy pint loads)."""
    import pint

    return pint.UnitRegistry(str(Path(__file__).with_name("units.txt")))


def parse_quantity(text: object, kind: str) -> float:
    """Parse ``"<number> <unit>"`` and return it in the base unit of ``kind``.

    Raises UnitError with a short description of what was wrong.
    """
    base, expected = KINDS[kind]
    if not isinstance(text, str):
        raise UnitError(f"got {toml_shown(text)}")
    match = _PATTERN.match(text)
    if not match:
        raise UnitError(f"cannot read {text[:60]!r} as a number followed by a unit")
    number, unit = match.groups()
    if not math.isfinite(float(number)):
        raise UnitError(f"{text.strip()[:60]!r} is not a finite number")
    unit = unit.replace("^", "**").replace("μ", "u").replace("µ", "u").replace("°", "deg")
    factor = COMMON_UNITS.get(kind, {}).get("".join(unit.split()))
    if factor is not None:
        value = float(number) * factor
        if not math.isfinite(value):
            raise UnitError(f"{text[:60]!r} is not a finite number")
        return value
    ureg = registry()
    import pint

    try:
        units = ureg.parse_units(unit)
        quantity = ureg.Quantity(float(number), units)
        value = float(quantity.to(base).magnitude)
        offset = kind == "temperature_difference" and ureg.Quantity(0.0, units).to(base).magnitude != 0
    except (pint.UndefinedUnitError, pint.DimensionalityError, AttributeError, TypeError, ValueError, KeyError, SyntaxError,
            ArithmeticError):
        raise UnitError(f"{unit!r} is not a unit of {kind.replace('_', ' ')}") from None
    if offset:
        raise UnitError(f"{unit!r} is a temperature scale, not a difference (write the difference in K)")
    if not math.isfinite(value):
        raise UnitError(f"{text[:60]!r} is not a finite number")
    return value
