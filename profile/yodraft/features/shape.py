"""Outer shape: the surfaces from the catch zone's start on the wall face, round the rim, to the cup.

``kind = "cone"`` (the default) is the family the rim and catch-zone features draw themselves:
a straight cone catch zone, a square band rim, a coned or flat cup with an optional hub. The other
presets reuse those features' sizes and change one thing each:

- ``arc``: the catch zone is an arc of ``catch_radius`` (convex or concave) instead of a cone;
- ``stepped``: the rim band steps down to ``step_diameter`` for ``step_width`` at the outer face (both of the
  step's outer edges take ``step_radius``);
- ``undercut``: a weight groove ``undercut_depth`` deep is turned into the cup wall;
- ``flat``: the outer face runs flat to the axis, with no cup and no hub.

``kind = "sketch"`` takes the shape from the ``[[features.shape.points]]`` chain instead (see
``yodraft.sketch``); the rim's and catch zone's own sizes then only serve as anchors (outer face,
outer diameter) and their own checks are not run.
"""
from __future__ import annotations

import math
from collections.abc import Mapping
from typing import Any

from ..checks import check
from ..geometry import FilletVertex
from ..params import ParamSpec
from ..sketch import POINT_PARAMS, Anchors, chain_vertices
from .base import Context, FeatureInputError, FeatureResult, V, pick

NAME = "shape"
KINDS = ("cone", "arc", "stepped", "undercut", "flat", "sketch")
PARAMS = (
    ParamSpec("kind", "text", "outer shape: a preset (cone, arc, stepped, undercut, flat) or 'sketch' for the "
              "[[features.shape.points]] chain", "cone", choices=KINDS),
    ParamSpec("catch_radius", "length", "arc preset: radius of the catch-zone arc; default 1.5 × its chord", None, 0.0, 500.0),
    ParamSpec("catch_arc", "text", "arc preset: the catch zone bulges out of the metal (convex) or into it (concave)",
              "convex", choices=("convex", "concave")),
    ParamSpec("step_diameter", "length", "stepped preset: diameter of the band at the outer face; default halfway between the cup and the outer diameter",
              None, 1.0, 150.0),
    ParamSpec("step_width", "length", "stepped preset: axial length of the smaller band; default half the rim band", None, 0.0, 60.0),
    ParamSpec("step_radius", "length", "stepped preset: radius of the step's two outer edges (at the outer face and at the shoulder)",
              0.5, 0.0, 20.0, lo_closed=True),
    ParamSpec("undercut_depth", "length", "undercut preset: radial depth of the weight groove into the cup wall", 1.5, 0.0, 30.0),
    ParamSpec("undercut_width", "length", "undercut preset: axial width of the weight groove", 3.0, 0.0, 60.0),
    ParamSpec("undercut_offset", "length", "undercut preset: height of the groove's lower side above the cup floor",
              1.0, 0.0, 60.0, lo_closed=True),
)
#: arrays of tables this feature reads besides its keys
TABLES = {"points": POINT_PARAMS}
CATCH_RADIUS_SHARE = 1.5  # default arc radius over its chord  # common practice, no published source


def _cup(ctx: Context) -> list[FilletVertex]:
    """The cup as the rim draws it: hub or floor centre on the axis, floor, cup wall, lip (loop order)."""
    flat_z, flat_r = ctx["rim.flat_z"], ctx["rim.floor_diameter"] / 2
    floor_z, cup_r, face_z = ctx["rim.floor_z"], ctx["rim.cup_diameter"] / 2, ctx["rim.face_z"]
    hub_r, hub_h = ctx["rim.hub_diameter"] / 2, ctx["rim.hub_height"]
    out = []
    if hub_r > 0 and hub_h > 0:
        out += [V(flat_z + hub_h, 0.0), V(flat_z + hub_h, hub_r), V(flat_z, hub_r, ctx["rim.cup_radius"], "rim.cup_radius")]
    else:
        out.append(V(flat_z, 0.0))
    return out + [V(flat_z, flat_r), V(floor_z, cup_r, ctx["rim.cup_radius"], "rim.cup_radius")]


def _lip_and_edge(ctx: Context) -> list[FilletVertex]:
    face_z, cup_r, R = ctx["rim.face_z"], ctx["rim.cup_diameter"] / 2, ctx["rim.diameter"] / 2
    return [V(face_z, cup_r, ctx["rim.lip_radius"], "rim.lip_radius"), V(face_z, R, ctx["rim.edge_radius"], "rim.edge_radius")]


def _cone(ctx: Context) -> list[FilletVertex]:
    """The straight catch zone, from the rim band's start to the wall face."""
    return [V(ctx["catch_zone.end_z"], ctx["rim.diameter"] / 2, ctx["catch_zone.edge_radius"], "catch_zone.edge_radius"),
            V(ctx["bearing_seat.wall_face_z"], ctx["catch_zone.start_diameter"] / 2)]


def resolve(ctx: Context, p: Mapping[str, Any]) -> FeatureResult:
    kind = p["kind"]
    derived: set[str] = set()
    dims: dict[str, Any] = {"kind": kind}
    checks = []
    corners: list[FilletVertex] = []
    if kind == "sketch":
        if not p["points"]:
            raise FeatureInputError("points", "is missing for kind = \"sketch\"",
                                    "[[features.shape.points]] tables from the wall face to the axis")
        depth = max(ctx["pad_groove.bottom_z"], ctx["vent_groove.bottom_z"], ctx["axle_bore.tip_z"])
        anchors = Anchors(ctx["bearing_seat.wall_face_z"], ctx["rim.face_z"], ctx["rim.diameter"] / 2,
                          ctx["pad_groove.outer_diameter"] / 2, depth)
        corners = chain_vertices(p["points"], anchors)
    elif p["points"]:
        raise FeatureInputError("points", f"are given but kind is {kind!r}", 'kind = "sketch" to use them')
    elif kind == "arc":
        start = (ctx["bearing_seat.wall_face_z"], ctx["catch_zone.start_diameter"] / 2)
        end = (ctx["catch_zone.end_z"], ctx["rim.diameter"] / 2)
        chord = math.dist(start, end)
        radius = pick(p, "catch_radius", CATCH_RADIUS_SHARE * chord, derived)
        fits = radius >= chord / 2
        checks.append(check("catch-zone arc spans its chord", f"{NAME}.catch_radius", fits,
                            f"arc R{radius:.3f} mm over a chord of {chord:.3f} mm (at least half the chord)"))
        turn = 2 * math.asin(min(1.0, chord / (2 * radius))) if fits else 0.0
        sweep = turn if p["catch_arc"] == "convex" else -turn  # the loop runs counter-clockwise: convex turns left
        dims.update(catch_radius=radius, catch_arc=p["catch_arc"])
        corners = _cup(ctx) + _lip_and_edge(ctx) + [FilletVertex(V(*end).point, 0.0, "", sweep + 0.0), V(*start)]
    elif kind == "stepped":
        R, face_z, band = ctx["rim.diameter"] / 2, ctx["rim.face_z"], ctx["catch_zone.rim_width"]
        cup_r = ctx["rim.cup_diameter"] / 2
        step_r = pick(p, "step_diameter", R + cup_r, derived) / 2  # default halfway between cup and outer diameter
        step_w = pick(p, "step_width", band / 2, derived)
        checks += [
            check("step between cup and outer diameter", f"{NAME}.step_diameter", cup_r < step_r < R,
                  f"step Ø{2 * step_r:.3f} mm between cup Ø{2 * cup_r:.3f} and outer Ø{2 * R:.3f} mm"),
            check("step within the rim band", f"{NAME}.step_width", step_w < band,
                  f"step {step_w:.3f} mm of a {band:.3f} mm rim band"),
        ]
        dims.update(step_diameter=2 * step_r, step_width=step_w, step_radius=p["step_radius"])
        lip = _lip_and_edge(ctx)[0]
        corners = _cup(ctx) + [lip, V(face_z, step_r, p["step_radius"], f"{NAME}.step_radius"),
                               V(face_z - step_w, step_r), V(face_z - step_w, R, p["step_radius"], f"{NAME}.step_radius")]
        corners += _cone(ctx)
    elif kind == "undercut":
        floor_z, face_z, cup_r = ctx["rim.floor_z"], ctx["rim.face_z"], ctx["rim.cup_diameter"] / 2
        z1 = floor_z + p["undercut_offset"]
        z2 = z1 + p["undercut_width"]
        r2 = cup_r + p["undercut_depth"]
        checks += [
            check("undercut within the cup wall", f"{NAME}.undercut_width", z2 < face_z,
                  f"undercut from z = {z1:.3f} to {z2:.3f} mm, outer face at z = {face_z:.3f} mm"),
            check("undercut inside the outer diameter", f"{NAME}.undercut_depth", r2 < ctx["rim.diameter"] / 2,
                  f"undercut to Ø{2 * r2:.3f} mm, outer Ø{ctx['rim.diameter']:.3f} mm"),
        ]
        dims.update(undercut_depth=p["undercut_depth"], undercut_width=p["undercut_width"],
                    undercut_offset=p["undercut_offset"], undercut_diameter=2 * r2, undercut_z=z1)
        corners = _cup(ctx) + [V(z1, cup_r), V(z1, r2), V(z2, r2), V(z2, cup_r)] + _lip_and_edge(ctx) + _cone(ctx)
    elif kind == "flat":
        face_z = ctx["rim.face_z"]
        corners = [V(face_z, 0.0), _lip_and_edge(ctx)[1]] + _cone(ctx)
    labels: list[tuple[str, str]] = []
    if kind == "cone":
        dims.update(start_diameter=ctx["catch_zone.start_diameter"], outer_diameter=ctx["rim.diameter"],
                    face_z=ctx["rim.face_z"])
    else:
        chain = [v.point for v in reversed(corners)]  # numbered from the wall face, as a sketch is written
        dims.update(start_diameter=2 * chain[0][1], outer_diameter=2 * max(r for _, r in chain),
                    face_z=max(z for z, _ in chain))
        for i, (z, r) in enumerate(chain):
            dims[f"point_{i}_z"] = z
            dims[f"point_{i}_diameter"] = 2 * r
        arc_key = f"{NAME}.catch_radius" if kind == "arc" else ""
        for k, v in enumerate(corners):  # loop order: corner k is chain point n - 1 - k
            i = len(corners) - 1 - k
            labels.append((f"{NAME}.point_{i}",
                           (f"{NAME}.points[{i}].arc_radius" if kind == "sketch" else arc_key) if v.sweep else ""))
    return FeatureResult(NAME, dims, frozenset(derived), {"outer": tuple(corners)}, tuple(checks),
                         {"labels": tuple(labels)})
