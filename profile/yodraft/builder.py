"""The builder: resolves the features in order, composes the loop and runs every check."""
from __future__ import annotations

import functools
import math
import operator
from itertools import chain, filterfalse, repeat
from collections.abc import Callable, Mapping, Sequence
from dataclasses import dataclass
from types import MappingProxyType, ModuleType
from typing import Any, NamedTuple

from .catalog.bearings import BEARINGS, LETTER_SIZES, lookup_bearing
from .catalog.materials import MATERIALS, lookup_material
from .checks import (ANALYSIS_PREREQUISITES, WALL_CHUNKS, Check, datum_face_check, loop_checks, radial_order,
                     surface_walls, turning_checks, wall_checks)
from .design import Design
from .errors import DesignInputError, YodraftError
from .features import FEATURES, LOOP_ORDER, OUTER_CHUNKS
from .features.base import Context, FeatureInputError, FeatureResult, SeatCut
from .geometry import GeometryError, Profile, fillet_loop
from .params import check_unknown
from .parts import BODY, Part, cut_seats, feature_parts, seat_checks
from .tolerances.bearings import PRECISION_CLASSES, bearing_deviation_um
from .tolerances.general import general_tolerance_mm
from .tolerances.stack import Link, Stack, stack
from .tolerances.seat import SeatFit

__all__ = ["Resolved", "BuildMemo", "Composed", "build", "compose", "judge", "judge_many", "resolve_bearing", "resolve_material", "loop_chunks"]

#: a check's verdict and name, a feature result's checks, a corner's point, read in C
_OK, _NAME, _CHECKS = operator.attrgetter("ok"), operator.attrgetter("name"), operator.attrgetter("checks")
_POINT = operator.attrgetter("point")


@dataclass(frozen=True)
class Resolved:
    """A design resolved: every feature's dimensions, the half-profile and every check.

    ``profile`` is the body's loop; ``parts`` are the half's parts, the body first and then
    any a feature adds (a ring), each with its own loop and material (empty when the body has no loop).
    """

    design: Design
    values: Mapping[str, Any]
    features: Mapping[str, FeatureResult]
    profile: Profile | None
    checks: tuple[Check, ...]
    parts: tuple[Part, ...] = ()

    @property
    def seat_fit(self) -> SeatFit:
        """The bearing seat's two fits (post in the bore, outer race in the wall bore) as the stack sized them."""
        fit: SeatFit = self.features["bearing_seat"].extra["seat_fit"]
        return fit

    @property
    def ok(self) -> bool:
        return not self.failed

    @property
    def can_analyse(self) -> bool:
        """Whether the half's mass can be integrated: its loop exists and passes the prerequisite checks."""
        return self.profile is not None and ANALYSIS_PREREQUISITES.isdisjoint(map(_NAME, self.failed))

    @functools.cached_property
    def failed(self) -> tuple[Check, ...]:
        """The checks that failed (worked out once: the checks never change)."""
        return tuple(filterfalse(_OK, self.checks))

    def __getitem__(self, key: str) -> Any:
        return self.values[key]


def resolve_bearing(design: Design) -> dict[str, Any]:
    """The chosen bearing's nominal sizes, mass and precision-class deviations, keyed "bearing.*"."""
    b = design["bearing"]
    explicit = [k for k in ("bore", "od", "width") if b[k] is not None]
    if explicit and len(explicit) < 3:
        missing = next(k for k in ("bore", "od", "width") if b[k] is None)
        raise DesignInputError(design.source, f"bearing.{missing}", "is missing",
                               "bore, od and width together, or a size alone")
    if explicit:
        # a bearing given by its sizes is an inch bearing when all three are written in inches (its sizes on the
        # sheet then carry their inch values, as a catalog inch bearing's do)
        inch = _sizes_in_inches(design)
        designation, bore, od, width, mass = "custom", b["bore"], b["od"], b["width"], 0.0
        chamfer = 0.0  # unknown: the post/seat-face corner is drawn for a sharp-edged ring
        if not bore < od:
            raise DesignInputError(design.source, "bearing.od", "is not larger than the bore", "od above bore")
    else:
        try:
            row = lookup_bearing(b["size"])
        except KeyError:
            check_unknown({b["size"]: None}, list(LETTER_SIZES) + list(BEARINGS), design.source, "bearing.size", "bearing")
            raise
        designation, bore, od, width, mass, inch = row.designation, row.bore_mm, row.od_mm, row.width_mm, row.mass_g, row.inch
        chamfer = row.chamfer_mm
    if b["mass"] is not None:
        mass = b["mass"]
    try:
        bore_dev = bearing_deviation_um(b["precision"], "bore", bore)
        od_dev = bearing_deviation_um(b["precision"], "od", od)
        width_dev = bearing_deviation_um(b["precision"], "width", bore)
    except KeyError:
        check_unknown({b["precision"]: None}, list(PRECISION_CLASSES), design.source, "bearing.precision", "precision class")
        raise
    if b["bore_tolerance"] is not None:
        bore_dev = (0.0, -1000.0 * b["bore_tolerance"])
    if b["od_tolerance"] is not None:
        od_dev = (0.0, -1000.0 * b["od_tolerance"])
    if b["width_tolerance"] is not None:
        width_dev = (0.0, -1000.0 * b["width_tolerance"])
    return {"bearing.designation": designation, "bearing.bore": bore, "bearing.od": od, "bearing.width": width,
            "bearing.mass": mass, "bearing.inch": inch, "bearing.precision": b["precision"],
            "bearing.bore_deviation_um": bore_dev, "bearing.od_deviation_um": od_dev,
            "bearing.width_deviation_um": width_dev, "bearing.chamfer": chamfer}


def _sizes_in_inches(design: Design) -> bool:
    """Whether the design file gives the bearing's bore, outside diameter and width all in inches."""
    from .units import in_inches

    written = design.raw.get("bearing", {})
    return all(in_inches(written.get(k)) for k in ("bore", "od", "width"))


def resolve_material(design: Design) -> dict[str, Any]:
    """The body material's name, density and thread-engagement factor, keyed "material.*"."""
    name = design["design"]["material"]
    try:
        m = lookup_material(name)
    except KeyError:
        check_unknown({name: None}, list(MATERIALS), design.source, "design.material", "material")
        raise
    density = design["design"]["density"] or m.density_g_cm3
    return {"material.name": m.name, "material.designation": m.designation,
            "material.designation_source": m.designation_source, "material.density_g_cm3": density,
            "material.engagement_factor": m.engagement_factor, "material.source": m.source}


def seat_depth_stack(values: Mapping[str, Any], general: str) -> tuple[float, float, Stack]:
    """The seat face's depth below the outer face (datum B), its ± and the assembled width's stack.

    The depth takes the general tolerance of its size (ISO 2768-1), written on the
    sheet as its own tolerance; the assembled width is the inner ring's width plus
    both halves' depths.
    """
    depth = values["rim.face_z"] - values["bearing_seat.seat_face_z"]
    tol = general_tolerance_mm(general, depth) or general_tolerance_mm(general, 0.5) or 0.0
    dev = values["bearing.width_deviation_um"]
    width = stack((Link("bearing width", values["bearing.width"], dev[0] / 1000, dev[1] / 1000),
                   Link("seat depth, this half", depth, tol, -tol), Link("seat depth, other half", depth, tol, -tol)))
    return depth, tol, width


def _same(a: Any, b: Any) -> bool:
    """Equal, down to the sign of every zero (so a reused result is exactly what a fresh build gives)."""
    if a is b:
        return True
    if type(a) is not type(b):
        return False
    if type(a) is float:
        return a == b and math.copysign(1.0, a) == math.copysign(1.0, b)
    if type(a) is tuple or type(a) is list:
        return len(a) == len(b) and all(map(_same, a, b))
    if type(a) is dict:
        return a.keys() == b.keys() and all(_same(x, b[k]) for k, x in a.items())
    return bool(a == b)


_MISSING = object()  # what a value not (or no longer) given reads as


class BuildMemo:
    """What one build keeps for the next build of a closely related design (a sweep's variants, a watch's saves).

    A feature is resolved again only when its own parameters, an earlier value it
    read or (if it read them) the shop settings differ from last time; the bearing
    and the material likewise when their inputs differ. A build with a memo gives
    the same result as a fresh one.
    """

    def __init__(self) -> None:
        self._features: dict[str, tuple[Mapping[str, Any], dict[str, Any], Mapping[str, Any] | None,
                                        FeatureResult, dict[str, Any]]] = {}
        #: each feature's ``before`` when its kept result was last found good (see ``feature``)
        self._before: dict[str, tuple[Any, ...]] = {}
        self._sources: dict[str, tuple[Any, dict[str, Any]]] = {}

    def source(self, name: str, inputs: Any, resolve: Callable[[], dict[str, Any]]) -> dict[str, Any]:
        """The values ``resolve()`` gives, reused while ``inputs`` stay equal."""
        kept = self._sources.get(name)
        if kept is not None and _same(kept[0], inputs):
            return kept[1]
        values = resolve()
        self._sources[name] = (inputs, values)
        return values

    def feature(self, module: ModuleType, params: Mapping[str, Any], values: Mapping[str, Any],
                shop: Mapping[str, Any], before: tuple[Any, ...] = ()) -> tuple[FeatureResult, dict[str, Any]]:
        """A feature's result and the values it publishes ("feature.param"), resolved or reused.

        ``before`` are the objects ``values`` was made from (the bearing's, the material's and the envelope's
        values, then each earlier feature's published values): when they are the very objects they were when
        the kept result was last found good, every value it read is too, and it is reused without reading them.
        """
        name = module.NAME
        kept = self._features.get(name)
        if kept is not None:
            k_params, k_reads, k_shop, result, published = kept
            if ((k_params is params or _same(k_params, params))
                    and (k_shop is None or k_shop is shop or _same(k_shop, shop))):
                k_before = self._before[name]
                if before and len(k_before) == len(before) and all(map(operator.is_, k_before, before)):
                    return result, published
                # the same objects (an earlier feature reused too) first, at C speed; then equal values (a value
                # no longer given reads as _MISSING, which equals nothing)
                now = list(map(values.get, k_reads, repeat(_MISSING)))
                if all(map(operator.is_, now, k_reads.values())) or all(map(_same, now, k_reads.values())):
                    self._before[name] = before
                    return result, published
        ctx = Context(values, shop)
        result = module.resolve(ctx, params)
        published = dict(zip(_published_keys(name, tuple(result.dims)), result.dims.values()))
        self._features[name] = (params, ctx.reads, shop if ctx.shop_read else None, result, published)
        self._before[name] = before
        return result, published


@functools.lru_cache(maxsize=256)
def _published_keys(feature: str, dims: tuple[str, ...]) -> tuple[str, ...]:
    """The keys a feature's dimensions are published under ("feature.param"), made once for each set of dimensions."""
    return tuple(f"{feature}.{k}" for k in dims)


def loop_chunks(results: Mapping[str, FeatureResult]) -> list[tuple[str, str]]:
    """The (feature, chunk) pairs round the loop as built: a given outer shape stands in for the rim's and
    catch zone's chunks, and empty chunks are left out."""
    shaped = bool(results["shape"].chunks["outer"])
    return [(f, c) for f, c in LOOP_ORDER
            if results[f].chunks[c] and not (shaped and (f, c) in OUTER_CHUNKS)]


class Composed(NamedTuple):
    """A design's features resolved and its loop composed, before the checks over the whole loop."""

    design: Design
    values: dict[str, Any]
    results: dict[str, FeatureResult]
    profile: Profile | None
    misfits: list[str]
    seats: list[SeatCut]
    seat_failures: list[Check]


def compose(design: Design, memo: BuildMemo | None = None) -> Composed:
    """Resolve every feature of ``design`` in order and compose the half-profile from their corners."""
    memo = memo if memo is not None else BuildMemo()
    values: dict[str, Any] = {}
    bearing = memo.source("bearing", (design["bearing"], _sizes_in_inches(design)), lambda: resolve_bearing(design))
    material = memo.source("material", design["design"], lambda: resolve_material(design))
    envelope = design["envelope"]
    values.update(bearing)
    values.update(material)
    values.update({f"envelope.{k}": v for k, v in envelope.items()})
    before: tuple[Any, ...] = (bearing, material, envelope)  # what ``values`` is made from so far
    results: dict[str, FeatureResult] = {}
    readable = MappingProxyType(values)  # features read earlier values, never write them
    shop = design["shop"]
    for name, module in FEATURES.items():
        try:
            results[name], published = memo.feature(module, design.features[name], readable, shop, before)
        except FeatureInputError as exc:
            raise DesignInputError(design.source, f"features.{name}.{exc.key}", exc.problem, exc.expected) from None
        values.update(published)
        before += (published,)
    vertices = [v for feature, chunk in loop_chunks(results) for v in results[feature].chunks[chunk]]
    seats = [s for r in results.values() for s in r.seats]
    vertices, seat_failures = cut_seats(vertices, seats)
    try:
        profile, misfits = fillet_loop(vertices)
    except GeometryError:
        profile, misfits = None, []
    for owner in misfits:
        if owner.startswith("shape.points["):
            raise DesignInputError(design.source, f"features.{owner}", "does not fit the edges it joins",
                                   "a corner radius whose tangent points lie on the two segments it joins")
    return Composed(design, values, results, profile, misfits, seats, seat_failures)


def judge(composed: Composed, *, verdict_only: bool = False, uncrossed: bool | None = None,
          thin: bool | None = None) -> Resolved:
    """Run every check on a composed design and give it resolved.

    ``verdict_only`` (a sweep, which reports only which checks fail) leaves out the re-entrant regions,
    which are named but never fail, and the axial stack (``axial.*``), which no check reads, and asks of the
    least wall only whether it is below the shop's least; the radial-order, wall and loop checks word only those that fail.
    ``uncrossed`` (the flattened loop does not cross itself) and ``thin`` (a wall is below the shop's least)
    are those verdicts when already found for many loops at once (``checks.crossing_free``, ``checks.thin_walls``).
    """
    design, values, results, profile, misfits, seats, seat_failures = composed
    shaped = bool(results["shape"].chunks["outer"])  # a given outer shape replaces the rim's and catch zone's
    chunks = ({f"{feature}.{chunk}": list(map(_POINT, results[feature].chunks[chunk])) for feature, chunk in WALL_CHUNKS}
              if not shaped else {})  # the points wall_checks reads (none for a given outer shape)
    checks: list[Check] = list(chain.from_iterable(map(_CHECKS, results.values())))
    checks += radial_order(values, messages=not verdict_only)
    sketched = values["shape.kind"] == "sketch"
    if sketched:  # the rim's and catch zone's own sizes are only anchors of the sketch
        checks = [c for c in checks if c.feature not in ("rim", "catch_zone")]
    checks += wall_checks(values, chunks, design["shop"]["min_wall"], back_walls=not shaped, messages=not verdict_only)
    checks += loop_checks(profile, design["envelope"], misfits, uncrossed, messages=not verdict_only)
    checks += seat_failures
    parts: tuple[Part, ...] = ()
    if profile is not None:
        added, part_failures = feature_parts(tuple(results.values()))
        checks += part_failures + seat_checks(profile, seats, design["shop"]["min_wall"])
        checks += surface_walls(profile, design["shop"]["min_wall"], measure=not verdict_only, thin=thin)
        checks.append(datum_face_check(profile, values["shape.face_z"], "shape.points" if sketched else "rim.overall_width",
                                       messages=not verdict_only))
        if not verdict_only:
            checks += turning_checks(profile)
        parts = (Part(BODY, values["material.name"], values["material.density_g_cm3"], profile,
                      design["shop"]["coating"]),) + added
        z_min, _, z_max, r_max = profile.bounds()
        if not verdict_only:  # the sheet's and the summary's axial stack; no check reads it
            depth, depth_tol, width_stack = seat_depth_stack(values, design["shop"]["general_tolerance"])
            values.update({"axial.seat_depth": depth, "axial.seat_depth_tolerance": depth_tol,
                           "axial.width_stack": width_stack})
        values.update({"profile.outer_diameter": 2 * r_max, "profile.width": 2 * z_max,
                       "profile.gap": values["bearing_seat.gap"], "profile.post_length": values["bearing_seat.post_length"]})
    return Resolved(design, MappingProxyType(values), MappingProxyType(results), profile, tuple(checks), parts)


def judge_many(composed: Sequence["Composed | Exception"]) -> list["Resolved | Exception"]:
    """``judge(c, verdict_only=True)`` of many composed designs (a sweep's variants, a lot's rebuilt halves), the
    checks over each whole loop (does it cross itself, is a wall too thin) answered for all the loops at once.

    An item that is an input error, or whose checks raise one, stays (or becomes) that error.
    """
    from .checks import crossing_free, loop_stacks, prime_areas_and_bounds, thin_walls

    looped = [n for n, c in enumerate(composed) if not isinstance(c, Exception) and c.profile is not None]
    profiles = [composed[n].profile for n in looped]  # type: ignore[union-attr]
    stacks = loop_stacks(profiles)  # every loop's surfaces read once, for the verdicts below and its figures
    prime_areas_and_bounds(profiles, stacks)
    uncrossed = dict(zip(looped, crossing_free(profiles, stacks) if profiles else []))
    thin = dict(zip(looped, thin_walls(profiles, [composed[n].design["shop"]["min_wall"] - 1e-9  # type: ignore[union-attr]
                                                  for n in looped], stacks)))
    out: list[Resolved | Exception] = []
    for n, c in enumerate(composed):
        if not isinstance(c, Exception):
            try:
                c = judge(c, verdict_only=True, uncrossed=uncrossed.get(n), thin=thin.get(n))
            except (YodraftError, ValueError) as exc:
                c = exc
        out.append(c)
    return out


def build(design: Design, memo: BuildMemo | None = None, *, verdict_only: bool = False) -> Resolved:
    """Resolve every feature of ``design`` in order, compose the half-profile and check it.

    ``memo`` carries unchanged features over from the previous build made with it; ``verdict_only``
    as for ``judge``.
    """
    return judge(compose(design, memo), verdict_only=verdict_only)
