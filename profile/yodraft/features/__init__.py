"""The named features of a half, in the order the builder resolves them.

Each module has NAME, PARAMS (ParamSpec tuple) and ``resolve(ctx, params) -> FeatureResult``.
Features do not import each other; they read earlier results from the context.
"""
from __future__ import annotations

from types import ModuleType

from . import axle_bore, bearing_seat, catch_zone, pad_groove, rim, ring, shape, vent_groove

__all__ = ["FEATURES", "LOOP_ORDER", "OUTER_CHUNKS"]

#: resolution order (each feature may read what the earlier ones published)
FEATURES: dict[str, ModuleType] = {
    m.NAME: m for m in (bearing_seat, vent_groove, axle_bore, pad_groove, rim, catch_zone, shape, ring)
}

#: the order the features' corner chunks follow round the counter-clockwise loop,
#: starting on the spin axis at the back of the hub
LOOP_ORDER: tuple[tuple[str, str], ...] = (
    ("shape", "outer"),
    ("rim", "outer"),
    ("catch_zone", "surface"),
    ("pad_groove", "groove"),
    ("bearing_seat", "wall"),
    ("vent_groove", "groove"),
    ("bearing_seat", "post"),
    ("axle_bore", "bore"),
)

#: the chunks a given outer shape (any shape kind but "cone") replaces
OUTER_CHUNKS: frozenset[tuple[str, str]] = frozenset({("rim", "outer"), ("catch_zone", "surface")})
