"""Response pad groove: the recess in the bearing wall's face that holds the response pad — or, with
``response = "silicone"``, a shallow recess filled flush with silicone instead.

A pad stands proud of the wall face by its own thickness less the groove's depth (below it when
negative); the pads of the two halves then stand the gap less twice that apart.
"""
from __future__ import annotations

from collections.abc import Mapping
from typing import Any

from ..catalog.pads import PAD_CLASSES, SILICONE_RECESS, lookup_pad_class
from ..checks import check
from ..params import ParamSpec
from .base import Context, FeatureResult, V, pick

NAME = "pad_groove"
PARAMS = (
    ParamSpec("pad_class", "text", "pad class from the catalog; default the smallest that clears the bearing wall",
              None, choices=tuple(PAD_CLASSES)),
    ParamSpec("inner_diameter", "length", "groove inner diameter; default from the pad class", None, 1.0, 120.0),
    ParamSpec("outer_diameter", "length", "groove outer diameter; default pad diameter + squeeze", None, 1.0, 120.0),
    ParamSpec("depth", "length", "groove depth below the wall face; adjust this first if a pad sits badly", None, 0.0, 10.0),
    ParamSpec("response", "text", "what gives the response: a pad in the groove, or silicone filled flush in a recess",
              "pad", choices=("pad", "silicone")),
    ParamSpec("pad_thickness", "length", "thickness of the pad as moulded; default from the pad class", None, 0.0, 10.0),
    ParamSpec("max_below", "length", "farthest a pad may stand below the wall face", 0.2, 0.0, 5.0, lo_closed=True),
    ParamSpec("max_proud", "length", "farthest a pad may stand proud of the wall face; default a quarter of the gap, "
              "so the pads leave half the gap to the string", None, 0.0, 5.0, lo_closed=True),
    ParamSpec("recess_width", "length", "silicone recess: radial width; default from common practice", None, 0.0, 20.0),
)
SHARE_OF_GAP = 0.25  # default max_proud over the gap  # common practice, no published source


def resolve(ctx: Context, p: Mapping[str, Any]) -> FeatureResult:
    if p["response"] == "silicone":
        return _recess(ctx, p)
    derived: set[str] = set()
    least_id = ctx["bearing_seat.wall_bore"] + 2 * ctx.shop["min_wall"]
    if p["pad_class"] is None:
        fitting = [c for c in PAD_CLASSES.values() if c.groove_inner_diameter_mm >= least_id]
        pad = min(fitting, key=lambda c: c.pad_diameter_mm) if fitting else max(
            PAD_CLASSES.values(), key=lambda c: c.pad_diameter_mm)
        derived.add("pad_class")
    else:
        pad = lookup_pad_class(p["pad_class"])
    inner = pick(p, "inner_diameter", pad.groove_inner_diameter_mm, derived)
    outer = pick(p, "outer_diameter", pad.groove_outer_diameter_mm, derived)
    depth = pick(p, "depth", pad.groove_depth_mm, derived)
    thickness = pick(p, "pad_thickness", pad.pad_thickness_mm, derived)
    face_z = ctx["bearing_seat.wall_face_z"]
    bottom_z = face_z + depth
    gap = ctx["bearing_seat.gap"]
    proud = thickness - depth
    max_proud = pick(p, "max_proud", SHARE_OF_GAP * gap, derived)
    dims = {"pad_class": pad.name, "pad_diameter": pad.pad_diameter_mm, "inner_diameter": inner,
            "outer_diameter": outer, "depth": depth, "bottom_z": bottom_z, "face_z": face_z, "response": "pad",
            "pad_thickness": thickness, "proud": proud, "pad_gap": gap - 2 * proud, "max_below": p["max_below"],
            "max_proud": max_proud}
    checks = (
        check("pad fits the groove", f"{NAME}.outer_diameter", outer >= pad.pad_diameter_mm,
              f"groove Ø{inner:.2f}–Ø{outer:.2f} mm for a Ø{pad.pad_diameter_mm:g} mm pad"),
        check("pad bridges the groove's inner diameter", f"{NAME}.inner_diameter", inner < pad.pad_diameter_mm,
              f"groove inner Ø{inner:.2f} mm must lie inside the Ø{pad.pad_diameter_mm:g} mm pad, or the pad has "
              "nothing to sit on"),
        check("pad not sunk below the wall face", f"{NAME}.depth", proud >= -p["max_below"] - 1e-9,
              f"pad {thickness:.3f} mm thick in a {depth:.3f} mm groove stands {_proud_words(proud)}; "
              f"at most {p['max_below']:.3f} mm below"),
        check("pad proud within the gap", f"{NAME}.depth", proud <= max_proud + 1e-9,
              f"pad stands {_proud_words(proud)}, at most {max_proud:.3f} mm proud; pads {gap - 2 * proud:.3f} mm "
              f"apart across a {gap:.3f} mm gap"),
    )
    chunks = {"groove": (V(face_z, outer / 2), V(bottom_z, outer / 2), V(bottom_z, inner / 2), V(face_z, inner / 2))}
    return FeatureResult(NAME, dims, frozenset(derived), chunks, checks, {"pad": pad})


def _proud_words(proud: float) -> str:
    if abs(proud) < 1e-9:
        return "flush with the wall face"
    return f"{abs(proud):.3f} mm {'proud of' if proud > 0 else 'below'} the wall face"


def _recess(ctx: Context, p: Mapping[str, Any]) -> FeatureResult:
    """A silicone response recess: an annular recess in the wall face, filled flush."""
    derived: set[str] = set()
    rec = SILICONE_RECESS
    inner = pick(p, "inner_diameter", ctx["bearing_seat.wall_bore"] + 2 * max(rec.wall_mm, ctx.shop["min_wall"]), derived)
    width = pick(p, "recess_width", rec.width_mm, derived)
    outer = pick(p, "outer_diameter", inner + 2 * width, derived)
    depth = pick(p, "depth", rec.depth_mm, derived)
    face_z = ctx["bearing_seat.wall_face_z"]
    bottom_z = face_z + depth
    dims = {"pad_class": "", "pad_diameter": outer, "inner_diameter": inner, "outer_diameter": outer, "depth": depth,
            "bottom_z": bottom_z, "face_z": face_z, "response": "silicone", "recess_width": (outer - inner) / 2,
            "pad_thickness": depth, "proud": 0.0, "pad_gap": ctx["bearing_seat.gap"],
            "silicone_density": rec.density_g_cm3}
    checks = (
        check("recess has width", f"{NAME}.outer_diameter", outer > inner,
              f"recess Ø{inner:.2f}–Ø{outer:.2f} mm"),
    )
    chunks = {"groove": (V(face_z, outer / 2), V(bottom_z, outer / 2), V(bottom_z, inner / 2), V(face_z, inner / 2))}
    return FeatureResult(NAME, dims, frozenset(derived), chunks, checks, {"pad": None})
