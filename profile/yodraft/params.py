"""Self-validating parameter specs and the reader that applies them to a TOML table.

Every section of a design file (``[envelope]``, ``[shop]``, ``[features.rim]`` …) is
described by a tuple of ParamSpec. Reading a table checks every key against its
spec and reports the first problem as a DesignInputError naming the key path.
"""
from __future__ import annotations

import difflib
import math
import re
from collections.abc import Callable, Mapping, Sequence
from dataclasses import dataclass
from typing import Any

from .errors import DesignInputError, toml_shown
from .units import DISPLAY_UNITS, KINDS, SHEET_RESOLUTION_MM, UnitError, parse_quantity, written

__all__ = ["ParamSpec", "read_table", "current_names", "check_unknown", "check_name", "DISPLAY_UNITS"]

_QUANTITY_KINDS = set(KINDS)
_OTHER_KINDS = {"text", "bool", "number"}
_CONTROL = re.compile(r"[\x00-\x1f\x7f]")
#: the smallest non-zero magnitude any quantity may have, in its base unit (mm, g, rad, N*mm, ...)
SMALLEST = 1e-9
#: a kind's smallest non-zero magnitude where it is coarser: a length is drawn and written on the sheet to the
#: whole µm, so a non-zero one below that would be written as 0 (a spec written in µm sets ``least``)
SMALLEST_OF = {"length": SHEET_RESOLUTION_MM}


@dataclass(frozen=True)
class ParamSpec:
    """One key of a design-file table: its kind, bounds (in base units), default and meaning.

    ``default=None`` means the value is optional: derived by the builder when absent.
    Bounds: ``lo < value`` (or ``lo <= value`` when ``lo_closed``) and ``value <= hi``.
    """

    name: str
    kind: str
    doc: str
    default: Any = None
    lo: float | None = None
    hi: float | None = None
    lo_closed: bool = False
    choices: tuple[str, ...] = ()
    max_length: int = 120
    #: the key's earlier name, still read as this one (a file may give one of the two, not both)
    former: str = ""
    #: the smallest non-zero magnitude (base units); None: the kind's (``SMALLEST_OF``, else ``SMALLEST``)
    least: float | None = None

    def __post_init__(self) -> None:
        if self.kind not in _QUANTITY_KINDS | _OTHER_KINDS:
            raise ValueError(f"unknown parameter kind {self.kind!r}")
        if self.lo is not None and self.hi is not None and self.lo > self.hi:
            raise ValueError(f"{self.name}: lo above hi")

    @property
    def smallest(self) -> float:
        """The smallest non-zero magnitude a value may have (base units)."""
        return self.least if self.least is not None else SMALLEST_OF.get(self.kind, SMALLEST)

    def too_fine(self, value: float, rounding: bool = False) -> bool:
        """Whether ``value`` is non-zero and finer than ``smallest``; ``rounding`` lets a computed value (a grid's)
        lie a rounding off zero or short of the least."""
        if rounding:
            return self.smallest * 1e-6 < abs(value) < self.smallest * (1 - 1e-9)
        return 0 < abs(value) < self.smallest

    def check_fine(self, value: float, file: str, key: str, raw: Any, rounding: bool = False) -> None:
        """Refuse a ``too_fine`` value: one line naming the key and the least the sheet writes."""
        if self.too_fine(value, rounding):
            div, unit, _ = DISPLAY_UNITS.get(self.kind, (1.0, "", ""))
            raise DesignInputError(file, key, f"{raw!r} is finer than the sheet writes sizes: to "
                                   f"{_shown(self.smallest / div, up=True)} {unit}", self.expected())

    def expected(self) -> str:
        """What a valid value looks like, in words."""
        if self.kind in _QUANTITY_KINDS:
            text = KINDS[self.kind][1]
        elif self.kind == "number":
            text = "a plain number"
        elif self.kind == "bool":
            text = "true or false"
        elif self.choices:
            text = "one of " + ", ".join(repr(c) for c in self.choices)
        else:
            text = f"a text of at most {self.max_length} characters"
        if self.lo is not None or self.hi is not None:
            div, unit, _ = DISPLAY_UNITS.get(self.kind, (1.0, "", ""))
            parts = []
            least = f"{_shown(self.smallest / div, up=True)} {unit}".rstrip()
            coarse = self.smallest > SMALLEST  # a kind whose small non-zero values are refused (a length)
            if self.lo is not None and coarse and self.lo_closed and self.lo == 0:
                parts.append(f"0 or at least {least}")
            elif self.lo is not None and coarse and 0 <= self.lo < self.smallest:
                parts.append(f"at least {least}")
            elif self.lo is not None:
                parts.append(f"{'at least' if self.lo_closed else 'above'} {_shown(self.lo / div, up=True)} {unit}".rstrip())
            if self.hi is not None:
                parts.append(f"at most {_shown(self.hi / div, up=False)} {unit}".rstrip())
            text += ", " + " and ".join(parts)
            if self.lo is not None and coarse and self.lo < 0:
                text += f", 0 or at least {least} from 0"
        return text

    def written(self, value: float) -> Any:
        """``value`` (base units) as the design file writes it, e.g. ``"5.5 mm"``."""
        return written(value, self.kind)

    def read(self, raw: Any, file: str, key: str) -> Any:
        """Validate ``raw`` (a TOML value) and return it in base units."""
        if self.kind in _QUANTITY_KINDS:
            try:
                value = parse_quantity(raw, self.kind)
            except UnitError as exc:
                raise DesignInputError(file, key, str(exc), self.expected()) from None
            self._check_bounds(value, file, key, raw)
            return value
        if self.kind == "number":
            if isinstance(raw, bool) or not isinstance(raw, (int, float)) or not math.isfinite(raw):
                raise DesignInputError(file, key, f"got {toml_shown(raw)}", self.expected())
            self._check_bounds(float(raw), file, key, raw)
            return float(raw)
        if self.kind == "bool":
            if not isinstance(raw, bool):
                raise DesignInputError(file, key, f"got {toml_shown(raw)}", self.expected())
            return raw
        if not isinstance(raw, str):
            raise DesignInputError(file, key, f"got {toml_shown(raw)}", self.expected())
        if _CONTROL.search(raw):
            raise DesignInputError(file, key, "contains a control character", self.expected())
        if len(raw) > self.max_length:
            raise DesignInputError(file, key, f"is {len(raw)} characters long", self.expected())
        if self.choices:
            match = [c for c in self.choices if c.lower() == raw.strip().lower()]
            if not match:
                raise DesignInputError(file, key, f"unknown value {raw[:40]!r}{_suggest(raw, self.choices)}", self.expected())
            return match[0]
        return raw.strip()

    def _check_bounds(self, value: float, file: str, key: str, raw: Any) -> None:
        if 0 < abs(value) < SMALLEST:
            # nothing on a yo-yo is measured below a nanometre, a microgram or a nano-radian; such a value
            # is a slip (or a subnormal float) and would overflow whatever divides by it
            raise DesignInputError(file, key, f"{raw!r} is too small to mean anything (below {SMALLEST:g} of the base unit)",
                                   self.expected())
        self.check_fine(value, file, key, raw)
        low_bad = self.lo is not None and (value < self.lo if self.lo_closed else value <= self.lo)
        high_bad = self.hi is not None and value > self.hi
        if low_bad or high_bad:
            raise DesignInputError(file, key, f"{raw!r} is out of range", self.expected())


def _shown(bound: float, up: bool) -> str:
    """A bound shown to six significant digits, rounded towards the allowed side, so that the value
    a message shows is itself accepted.

    >>> _shown(80.21409479, up=False), _shown(0.1234567, up=True), _shown(40.0, up=False)
    ('80.2140', '0.12346', '40')
    """
    text = f"{bound:.6g}"
    if "e" in text or float(text) == bound:
        return text
    digits = max(0, 6 - len(str(int(abs(bound)))))
    step = 10.0 ** -digits
    value = (math.ceil(bound / step) if up else math.floor(bound / step)) * step
    return f"{value:.{digits}f}"


def _suggest(word: str, options: Sequence[str]) -> str:
    """A "did you mean" only for a near miss — a typo, or a known name with something added or cut —
    never for a merely similar word.

    >>> _suggest("widht", ["width"]), _suggest("owner_name", ["owner"]), _suggest("response", ["revision"])
    ("; did you mean 'width'?", "; did you mean 'owner'?", '')
    """
    close = difflib.get_close_matches(word, list(options), n=1, cutoff=0.75)
    if not close:
        low = word.lower()
        close = [o for o in options if len(o) >= 4 and (low.startswith(o.lower()) or o.lower().startswith(low))][:1]
    return f"; did you mean {close[0]!r}?" if close else ""


def check_unknown(table: Mapping[str, Any], known: Sequence[str], file: str, path: str, what: str = "key") -> None:
    """Raise for the first key of ``table`` not in ``known``, suggesting the nearest valid one."""
    for key in table:
        if key not in known:
            full = f"{path}.{key}" if path else key
            raise DesignInputError(file, full, f"unknown {what}{_suggest(key, known)}",
                                   "one of " + ", ".join(known))


def check_name(value: str, lookup: Callable[[str], Any], options: Sequence[str], file: str, key: str,
               what: str) -> None:
    """Raise unless ``lookup(value)`` finds a catalog row, naming ``key`` and the nearest valid name.

    >>> check_name("6062-T6", {"6061-T6": 1}.__getitem__, ["6061-T6"], "a.toml", "design.material", "material")
    Traceback (most recent call last):
    ...
    yodraft.errors.DesignInputError: a.toml: design.material: unknown material '6062-T6'; did you mean '6061-T6'? (expected one of 6061-T6)
    """
    try:
        lookup(value)
    except (KeyError, ValueError):
        raise DesignInputError(file, key, f"unknown {what} {value[:40]!r}{_suggest(value, options)}",
                               "one of " + ", ".join(options)) from None


def current_names(table: Mapping[str, Any], specs: Sequence[ParamSpec], file: str, path: str) -> Mapping[str, Any]:
    """``table`` with each key written under its earlier name (``ParamSpec.former``) moved to its current name.

    >>> spec = ParamSpec("band_width", "length", "band", former="width")
    >>> current_names({"width": "6 mm"}, [spec], "a.toml", "features.rim")
    {'band_width': '6 mm'}
    """
    renames = {s.former: s.name for s in specs if s.former and s.former in table}
    if not renames:
        return table
    for former, name in renames.items():
        if name in table:
            raise DesignInputError(file, f"{path}.{former}", f"is the earlier name of {name}, which is also given",
                                   f"one of {former} and {name}")
    return {renames.get(k, k): v for k, v in table.items()}


def read_table(table: Any, specs: Sequence[ParamSpec], file: str, path: str) -> dict[str, Any]:
    """Read one design-file table against its specs; absent keys take their defaults.

    Returns a dict with every spec's name; optional keys left out are None.
    """
    if not isinstance(table, Mapping):
        raise DesignInputError(file, path, f"got {toml_shown(table)}", "a table of keys")
    check_unknown(table, [s.name for s in specs], file, path)
    out: dict[str, Any] = {}
    for spec in specs:
        key = f"{path}.{spec.name}" if path else spec.name
        out[spec.name] = spec.read(table[spec.name], file, key) if spec.name in table else spec.default
    return out
