"""Linear tolerance stack-up: a chain of toleranced lengths summed to one assembly length.

Each link is a nominal length with its (upper, lower) deviations and a sense
(+1 opens the result, −1 closes it). Worst case adds every deviation at its
unfavourable end; the statistical (RSS) estimate takes each link's band as
±3σ of a normal spread about its mid value and adds the half-bands as a root sum
of squares (textbook tolerance stack-up).

>>> s = stack((Link("bore depth", 40.0, 0.1, -0.1), Link("spacer", 25.0, 0.05, -0.05, -1)))
>>> round(s.nominal_mm, 6), round(s.worst_min_mm, 6), round(s.worst_max_mm, 6)
(15.0, 14.85, 15.15)
"""
from __future__ import annotations

import math
from dataclasses import dataclass

__all__ = ["Link", "Stack", "stack"]


@dataclass(frozen=True)
class Link:
    """One toleranced length of a chain, mm: nominal, deviations (upper ≥ lower) and sense (+1 or −1)."""

    name: str
    nominal_mm: float
    upper_mm: float
    lower_mm: float
    sense: float = 1.0

    def __post_init__(self) -> None:
        if not all(math.isfinite(x) for x in (self.nominal_mm, self.upper_mm, self.lower_mm)):
            raise ValueError(f"link {self.name!r}: values must be finite")
        if self.upper_mm < self.lower_mm:
            raise ValueError(f"link {self.name!r}: upper deviation below lower")
        if self.sense not in (1.0, -1.0):
            raise ValueError(f"link {self.name!r}: sense must be +1 or -1")

    @property
    def half_band_mm(self) -> float:
        """Half the width of the link's tolerance band."""
        return (self.upper_mm - self.lower_mm) / 2


@dataclass(frozen=True)
class Stack:
    """The assembly length of a chain: nominal, worst-case limits and the ±3σ statistical (RSS) limits."""

    links: tuple[Link, ...]
    nominal_mm: float
    worst_min_mm: float
    worst_max_mm: float
    rss_min_mm: float
    rss_max_mm: float

    @property
    def worst_mm(self) -> tuple[float, float]:
        return (self.worst_min_mm, self.worst_max_mm)

    @property
    def rss_mm(self) -> tuple[float, float]:
        return (self.rss_min_mm, self.rss_max_mm)


def stack(links: tuple[Link, ...]) -> Stack:
    """Worst case (sum of the deviations) and RSS (root sum of the half-bands' squares) of a chain."""
    nominal = sum(link.sense * link.nominal_mm for link in links)
    low = sum(min(link.sense * link.upper_mm, link.sense * link.lower_mm) for link in links)
    high = sum(max(link.sense * link.upper_mm, link.sense * link.lower_mm) for link in links)
    mean = nominal + sum(link.sense * (link.upper_mm + link.lower_mm) / 2 for link in links)
    spread = math.sqrt(sum(link.half_band_mm ** 2 for link in links))
    return Stack(tuple(links), nominal, nominal + low, nominal + high, mean - spread, mean + spread)
