"""What a feature is given (the resolution context) and what it gives back."""
from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass, field
from typing import Any

from ..checks import Check
from ..geometry import FilletVertex, Point

__all__ = ["Context", "FeatureResult", "FeatureInputError", "PartOutline", "SeatCut", "V", "pick"]


def V(z: float, r: float, radius: float = 0.0, owner: str = "") -> FilletVertex:
    """A loop corner at (z, r), optionally rounded; ``owner`` names the radius parameter.

    A zero is always +0.0, so equal corners are equal keys for the fillet cache, sign of zero included.
    """
    # FilletVertex(point, radius, owner) made without the constructor's Python call (a sweep makes one per corner)
    return _new_tuple(FilletVertex, ((float(z) + 0.0, float(r) + 0.0), float(radius), owner, 0.0))


_new_tuple = tuple.__new__


@dataclass
class Context:
    """Everything a feature may read besides its own parameters: earlier values keyed "feature.param",
    and the shop's settings.

    Every value read is recorded in ``reads`` (and a read of the shop settings as
    ``shop_read``), so a result can be reused while those inputs stay the same.
    """

    values: Mapping[str, Any]
    shop_settings: Mapping[str, Any]
    reads: dict[str, Any] = field(default_factory=dict)
    shop_read: bool = False

    def __getitem__(self, key: str) -> Any:
        value = self.values[key]
        self.reads[key] = value
        return value

    @property
    def shop(self) -> Mapping[str, Any]:
        self.shop_read = True
        return self.shop_settings


@dataclass(frozen=True)
class PartOutline:
    """A part a feature adds to the half (a pressed-in ring): its own closed counter-clockwise loop
    of corners, its material and its finish."""

    name: str
    material: str
    density_g_cm3: float
    corners: tuple[FilletVertex, ...]
    coating: str = "none"


@dataclass(frozen=True)
class SeatCut:
    """A seat turned into the body for a part: ``corners`` take the place of the body's loop corner at
    ``at`` (``mode="corner"``), or go into the body's straight edge through ``at`` (``mode="edge"``).

    ``where`` ("feature.param") is named when the body has no such corner or edge; ``bottom`` are the
    seat's deepest corners, whose distance to the rest of the body is the wall behind the seat, named
    ``wall_where`` when thinner than the shop's least wall.
    """

    at: Point
    corners: tuple[FilletVertex, ...]
    mode: str
    where: str
    bottom: tuple[Point, ...]
    wall_where: str

    def __post_init__(self) -> None:
        if self.mode not in ("corner", "edge"):
            raise ValueError(f"seat mode {self.mode!r} is not 'corner' or 'edge'")


@dataclass(frozen=True)
class FeatureResult:
    """A resolved feature: its dimensions (mm, rad), which were derived, its loop corners and checks;
    and any parts it adds to the half with the seats they sit in."""

    name: str
    dims: Mapping[str, Any]
    derived: frozenset[str]
    chunks: Mapping[str, tuple[FilletVertex, ...]]
    checks: tuple[Check, ...] = ()
    extra: Mapping[str, Any] = field(default_factory=dict)
    parts: tuple[PartOutline, ...] = ()
    seats: tuple[SeatCut, ...] = ()


def pick(params: Mapping[str, Any], key: str, derived_value: Any, derived: set[str]) -> Any:
    """The given value of ``key`` or, when absent, ``derived_value`` (recording that it was derived)."""
    if params.get(key) is not None:
        return params[key]
    derived.add(key)
    return derived_value


class FeatureInputError(ValueError):
    """Bad input a feature finds only once it knows its context (a sketch point off the wall face).

    ``key`` is the path inside the feature's table; the builder adds the file and the feature.
    """

    def __init__(self, key: str, problem: str, expected: str = "") -> None:
        self.key, self.problem, self.expected = key, problem, expected
        super().__init__(key, problem, expected)
