"""Named checks: each says which feature and parameter it judges, and whether it passed."""
from __future__ import annotations

import functools
from itertools import chain
from collections.abc import Mapping, Sequence
from typing import TYPE_CHECKING, Any, NamedTuple

import numpy as np
import shapely

if TYPE_CHECKING:  # pragma: no cover
    from .geometry import Point, Profile

__all__ = ["Check", "check", "radial_order", "wall_checks", "loop_checks"]


class Check(NamedTuple):
    """One rule applied to a design: ``feature.parameter`` is what to change when it fails.

    A NamedTuple rather than a dataclass: a sweep makes tens of thousands, and this is the cheapest to build.
    """

    name: str
    feature: str
    parameter: str
    ok: bool
    message: str

    def as_dict(self) -> dict[str, object]:
        return {"name": self.name, "feature": self.feature, "parameter": self.parameter, "ok": self.ok,
                "message": self.message}


def check(name: str, where: str, ok: bool, message: str) -> Check:
    """A Check for ``where`` = "feature.parameter".

    >>> check("gap below bearing width", "bearing_seat.wall_offset", True, "gap 4.363 mm").feature
    'bearing_seat'
    """
    feature, _, parameter = where.partition(".")
    return Check(name, feature, parameter, bool(ok), message)


# ---------------------------------------------------------------- rules over the whole half

#: diameters that must grow from the axis outward, as (feature, parameter)
RADIAL_ORDER: tuple[tuple[str, str], ...] = (
    ("axle_bore", "major_diameter"),
    ("bearing_seat", "post_diameter"),
    ("bearing_seat", "seat_face_diameter"),
    ("bearing_seat", "wall_bore"),
    ("pad_groove", "inner_diameter"),
    ("pad_groove", "outer_diameter"),
    ("catch_zone", "start_diameter"),
    ("rim", "diameter"),
)
#: inner-side chunks whose distance to the cup is a wall, and the parameter that moves it
BACK_WALLS: tuple[tuple[str, str, str], ...] = (
    ("axle_bore", "bore", "rim.cup_depth"),
    ("vent_groove", "groove", "rim.cup_depth"),
    ("pad_groove", "groove", "rim.cup_depth"),
    ("catch_zone", "surface", "rim.thickness"),
)


def radial_order(values: Mapping[str, Any]) -> list[Check]:
    """Each diameter must lie outside the one before it (post < vent groove < wall < pad groove < catch zone < rim)."""
    out = []
    for name, inner, outer, feature, parameter in _RADIAL_PAIRS:
        inner_value, outer_value = values[inner], values[outer]
        out.append(Check(name, feature, parameter, bool(outer_value > inner_value + 1e-9),
                         f"Ø{outer_value:.3f} mm must exceed {inner} Ø{inner_value:.3f} mm"))
    return out


#: each neighbouring pair of RADIAL_ORDER as (check name, inner key, outer key, outer feature, outer parameter)
_RADIAL_PAIRS = tuple((f"radial order: {fb}.{pb} outside {fa}.{pa}", f"{fa}.{pa}", f"{fb}.{pb}", fb, pb)
                      for (fa, pa), (fb, pb) in zip(RADIAL_ORDER, RADIAL_ORDER[1:]))


@functools.lru_cache(maxsize=1024)  # a sweep measures from the same unchanged surfaces again and again
def _polyline(points: tuple[Point, ...]) -> shapely.Geometry:
    """A shapely line through ``points`` (a point when there is only one)."""
    return shapely.linestrings(np.asarray(points)) if len(points) > 1 else shapely.points(points[0])


def wall_checks(values: Mapping[str, Any], chunks: Mapping[str, Sequence[Point]], min_wall: float) -> list[Check]:
    """Least material between neighbouring surfaces, against the shop's thinnest wall."""
    post_wall = (values["bearing_seat.post_diameter"] - values["axle_bore.major_diameter"]) / 2
    bearing_wall = (values["pad_groove.inner_diameter"] - values["bearing_seat.wall_bore"]) / 2
    out = [
        check("wall between axle bore and post", "axle_bore.thread", post_wall >= min_wall - 1e-9,
              f"{post_wall:.3f} mm from thread major diameter to post, least {min_wall:.3f} mm"),
        check("bearing wall thickness", "pad_groove.inner_diameter", bearing_wall >= min_wall - 1e-9,
              f"{bearing_wall:.3f} mm between wall bore and pad groove, least {min_wall:.3f} mm"),
    ]
    cup = _polyline(tuple(chunks["rim.outer"][:-1]))  # the cup surface, without the outer edge
    for feature, chunk, where in BACK_WALLS:
        wall = float(_polyline(tuple(chunks[f"{feature}.{chunk}"])).distance(cup))
        out.append(check(f"wall between {feature.replace('_', ' ')} and cup", where, wall >= min_wall - 1e-9,
                         f"{wall:.3f} mm, least {min_wall:.3f} mm"))
    return out


#: the checks a half must pass before its mass can be integrated (one simple loop, none of it below the axis,
#: an axle of positive length)
ANALYSIS_PREREQUISITES = frozenset({"closed simple loop", "above the spin axis", "axle reaches both halves"})

#: chord error of the flattened loop whose topology is checked: far below any wall the rules allow
LOOP_CHECK_TOLERANCE = 0.02


def loop_checks(profile: "Profile | None", envelope: Mapping[str, Any], misfits: Sequence[str]) -> list[Check]:
    """The loop is one simple counter-clockwise polygon, inside the envelope box, with every radius fitting."""
    if profile is None:
        return [check("closed simple loop", "profile.loop", False, "the corners do not make a loop")]
    flat = profile.flatten(LOOP_CHECK_TOLERANCE)
    ring = shapely.linearrings(np.fromiter(chain.from_iterable(flat), float, 2 * len(flat)).reshape(-1, 2))
    simple = ring.is_simple and profile.signed_area() > 0  # a simple ring bounds a valid polygon
    z_min, r_min, z_max, r_max = profile.bounds()
    out = [
        check("closed simple loop", "profile.loop", simple,
              "the half-profile is one simple loop" if simple else "the half-profile crosses itself"),
        check("inside the envelope diameter", "rim.diameter", 2 * r_max <= envelope["diameter"] + 1e-9,
              f"outer diameter {2 * r_max:.3f} mm, envelope {envelope['diameter']:.3f} mm"),
        check("inside the envelope width", "rim.overall_width", 2 * z_max <= envelope["width"] + 1e-9,
              f"overall width {2 * z_max:.3f} mm, envelope {envelope['width']:.3f} mm"),
        check("clear of the gap plane", "bearing_seat.spacing", z_min >= -1e-9, f"nearest face at z = {z_min:.3f} mm"),
        check("above the spin axis", "profile.loop", r_min >= -1e-9, f"lowest point at r = {r_min:.3f} mm"),
    ]
    out += [check("radius fits its edges", owner, False, f"{owner} is too large for the edges it joins")
            for owner in misfits]
    return out
