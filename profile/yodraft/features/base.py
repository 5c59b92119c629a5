"""What a feature is given (the resolution context) and what it gives back."""
from __future__ import annotations

from collections.abc import Mapping
from dataclasses import dataclass, field
from typing import TYPE_CHECKING, Any

from ..checks import Check
from ..geometry import FilletVertex

if TYPE_CHECKING:  # pragma: no cover
    from ..design import Design

__all__ = ["Context", "FeatureResult", "V"]


def V(z: float, r: float, radius: float = 0.0, owner: str = "") -> FilletVertex:
    """A loop corner at (z, r), optionally rounded; ``owner`` names the radius parameter."""
    return FilletVertex((float(z), float(r)), float(radius), owner)


@dataclass(frozen=True)
class Context:
    """Everything resolved before a feature: the design and earlier values, keyed "feature.param"."""

    design: "Design"
    values: Mapping[str, Any]

    def __getitem__(self, key: str) -> Any:
        return self.values[key]

    @property
    def shop(self) -> Mapping[str, Any]:
        return self.design["shop"]


@dataclass(frozen=True)
class FeatureResult:
    """A resolved feature: its dimensions (mm, rad), which were derived, its loop corners and checks."""

    name: str
    dims: Mapping[str, Any]
    derived: frozenset[str]
    chunks: Mapping[str, tuple[FilletVertex, ...]]
    checks: tuple[Check, ...] = ()
    extra: Mapping[str, Any] = field(default_factory=dict)


def pick(params: Mapping[str, Any], key: str, derived_value: Any, derived: set[str]) -> Any:
    """The given value of ``key`` or, when absent, ``derived_value`` (recording that it was derived)."""
    if params.get(key) is not None:
        return params[key]
    derived.add(key)
    return derived_value
