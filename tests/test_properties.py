"""Property tests: every numeric design parameter, within and beyond its bounds.

Whatever value a designer types, yodraft either refuses it with a message that
names a key (DesignInputError) or a check (a failed Check), or it accepts the
design, and then the half-profile is one simple counter-clockwise loop inside the
envelope whose DXF re-reads with no audit errors. The reference for "valid" is
outside the project: shapely's validity and simplicity tests and ezdxf's recover
mode and auditor.

The default run is small; set YODRAFT_FUZZ_EXAMPLES to search harder, e.g.
``YODRAFT_FUZZ_EXAMPLES=2000 pytest tests/test_properties.py``.
"""
from __future__ import annotations

import copy
import io
import json
import math
import os
import tomllib
from pathlib import Path
from typing import Any

import ezdxf.recover
import pytest
from hypothesis import HealthCheck, event, given, settings
from hypothesis import strategies as st

import yodraft
from yodraft.builder import build
from yodraft.design import SECTIONS, from_dict
from yodraft.drawing.outline import dxf_bytes, outline_document
from yodraft.errors import CheckFailure, DesignInputError
from yodraft.features import FEATURES
from yodraft.massprops import body_props
from yodraft.params import SMALLEST, ParamSpec
from yodraft.summary import summary

ROOT = Path(__file__).resolve().parents[1]
TEMPLATE = tomllib.loads((ROOT / "templates" / "string-trick.toml").read_text(encoding="utf-8"))
MINIMAL = tomllib.loads(yodraft.EXAMPLE)
EXAMPLES = int(os.environ.get("YODRAFT_FUZZ_EXAMPLES", "40"))
FUZZ = settings(max_examples=EXAMPLES, deadline=None, suppress_health_check=[HealthCheck.too_slow])

#: the base unit each kind's bounds are held in, as a user would type it
UNIT = {"length": "mm", "mass": "g", "angle": "rad", "torque": "N*mm", "density": "g/cm^3", "speed": "rpm",
        "roughness": "um", "force": "N", "temperature": "degC", "temperature_difference": "K"}


def numeric_specs() -> list[tuple[tuple[str, ...], ParamSpec]]:
    """(key path, spec) of every numeric parameter of a design file."""
    out = [((section, s.name), s) for section, specs in SECTIONS.items() for s in specs]
    out += [(("features", name, s.name), s) for name, module in FEATURES.items() for s in module.PARAMS]
    return [(path, s) for path, s in out if s.kind in UNIT or s.kind == "number"]


SPECS = numeric_specs()


def test_every_numeric_parameter_is_fuzzed() -> None:
    # the list is read from the specs themselves, so a new parameter is fuzzed without editing this file
    paths = {".".join(p) for p, _ in SPECS}
    assert {"envelope.diameter", "features.rim.thickness", "shop.coating_outward_share",
            "features.bearing_seat.wall_offset", "analysis.spin_rate"} <= paths
    assert len(SPECS) >= 40


def span(spec: ParamSpec) -> tuple[float, float]:
    lo = spec.lo if spec.lo is not None else -100.0
    hi = spec.hi if spec.hi is not None else 100.0
    width = max(hi - lo, 1.0)
    return lo - width, hi + width


@st.composite
def value_for(draw: st.DrawFn, spec: ParamSpec, inside: bool) -> Any:
    """A TOML value for ``spec``: inside its bounds, or anywhere (beyond, on the edge, non-finite)."""
    if inside:
        lo = spec.lo if spec.lo is not None else -100.0
        hi = spec.hi if spec.hi is not None else 100.0
        x = draw(st.floats(lo, hi, exclude_min=not spec.lo_closed))
        if 0 < abs(x) < spec.smallest:  # below what the reader takes as meaningful (see ParamSpec.smallest)
            x = math.copysign(spec.smallest, x)
    else:
        lo, hi = span(spec)
        edges = [e for e in (spec.lo, spec.hi) if e is not None]
        x = draw(st.one_of(
            st.floats(lo, hi),
            st.sampled_from(edges + [0.0, -0.0, math.nan, math.inf, -math.inf, 1e300, -1e300, 5e-324]),
            st.sampled_from(edges).map(lambda e: math.nextafter(e, math.inf)) if edges else st.just(1.0),
            st.sampled_from(edges).map(lambda e: math.nextafter(e, -math.inf)) if edges else st.just(-1.0),
        ))
    if spec.kind == "number":
        return x
    return f"{x!r} {UNIT[spec.kind]}"


@st.composite
def designs(draw: st.DrawFn, inside: bool = False) -> tuple[dict[str, Any], list[str]]:
    """A parsed design file (template or minimal) with one to four numeric parameters changed."""
    raw = copy.deepcopy(draw(st.sampled_from([TEMPLATE, MINIMAL])))
    chosen = draw(st.lists(st.sampled_from(SPECS), min_size=1, max_size=4, unique_by=lambda ps: ps[0]))
    keys = []
    for path, spec in chosen:
        table = raw
        for part in path[:-1]:
            table = table.setdefault(part, {})
        table[path[-1]] = draw(value_for(spec, inside))
        keys.append(".".join(path))
    return raw, keys


def assert_valid_accepted(resolved: yodraft.Resolved) -> None:
    profile = resolved.profile
    assert profile is not None
    poly = profile.polygon()
    assert poly.is_valid and poly.exterior.is_simple, "the loop crosses itself"
    assert profile.signed_area() > 0, "the loop is not counter-clockwise"
    z_min, r_min, z_max, r_max = profile.bounds()
    env = resolved.design["envelope"]
    assert z_min >= -1e-9 and r_min >= -1e-9
    assert 2 * r_max <= env["diameter"] + 1e-6 and 2 * z_max <= env["width"] + 1e-6
    data = dxf_bytes(outline_document(resolved))
    doc, auditor = ezdxf.recover.read(io.BytesIO(data))
    assert not auditor.has_errors, [e.message for e in auditor.errors]
    assert len(doc.modelspace().query("LWPOLYLINE")) == 2
    density = resolved["material.density_g_cm3"]
    half = body_props(profile, density)
    # Pappus: volume = 2π × section area × centroid radius, so a positive area gives a positive mass
    assert half.mass_g > 0 and math.isclose(half.mass_g, density * half.volume_mm3 / 1000, rel_tol=1e-12)
    mass = summary(resolved)["mass"]
    # small parts may all be given as 0 g, so the assembly weighs at least the two halves
    assert mass["total_g"] >= 2 * mass["half_g"] > 0 and mass["izz_g_mm2"] > 0


def judge(raw: dict[str, Any], keys: list[str]) -> str:
    """Load, build and check one fuzzed design; return "refused", "failed" or "accepted"."""
    try:
        resolved = build(from_dict(raw, "fuzz.toml"))
    except DesignInputError as exc:
        text = str(exc)
        assert exc.key, text
        assert "\n" not in text and text.startswith("fuzz.toml: ")
        return "refused"
    # what `yodraft check --json` prints, for any design that reads: strict JSON, no NaN or infinity
    json.dumps(summary(resolved), allow_nan=False)
    if resolved.ok:
        assert_valid_accepted(resolved)
        return "accepted"
    failed = resolved.failed
    assert failed and all(c.name and c.feature and c.parameter for c in failed)
    text = str(CheckFailure("fuzz.toml", failed))
    assert "\n" not in text and failed[0].name in text
    return "failed"


@FUZZ
@given(designs())
def test_any_value_is_refused_by_key_failed_by_check_or_drawn(case: tuple[dict[str, Any], list[str]]) -> None:
    raw, keys = case
    event(judge(raw, keys))


@FUZZ
@given(designs(inside=True))
def test_values_inside_their_bounds_always_load(case: tuple[dict[str, Any], list[str]]) -> None:
    raw, keys = case
    from_dict(raw, "fuzz.toml")  # no DesignInputError: the bounds the reference states are the bounds enforced
    event(judge(raw, keys))


@FUZZ
@given(st.sampled_from(SPECS), st.data())
def test_one_value_beyond_its_bounds_is_refused_at_its_key(spec_path: tuple[tuple[str, ...], ParamSpec],
                                                           data: st.DataObject) -> None:
    path, spec = spec_path
    lo, hi = span(spec)
    beyond = []
    if spec.lo is not None:
        beyond.append(st.floats(lo, spec.lo, exclude_max=spec.lo_closed))
    if spec.hi is not None:
        beyond.append(st.floats(spec.hi, hi, exclude_min=True))
    beyond.append(st.sampled_from([math.nan, math.inf, -math.inf]))
    x = data.draw(st.one_of(beyond))
    raw = copy.deepcopy(TEMPLATE)
    table = raw
    for part in path[:-1]:
        table = table.setdefault(part, {})
    table[path[-1]] = x if spec.kind == "number" else f"{x!r} {UNIT[spec.kind]}"
    with pytest.raises(DesignInputError) as info:
        from_dict(raw, "fuzz.toml")
    assert info.value.key == ".".join(path)


def template_with(changes: dict[tuple[str, ...], Any]) -> dict[str, Any]:
    """The parsed starter template with each key path set to a value as a design file writes it."""
    raw = copy.deepcopy(TEMPLATE)
    for path, value in changes.items():
        table = raw
        for part in path[:-1]:
            table = table.setdefault(part, {})
        table[path[-1]] = value
    return raw


def edge_cases() -> list[tuple[str, ParamSpec, float]]:
    """Each numeric parameter at the edges of its bounds, just inside: where off-by-one limits hide."""
    out = []
    for path, spec in SPECS:
        values = []
        if spec.hi is not None:
            values += [spec.hi, math.nextafter(spec.hi, -math.inf)]
        if spec.lo is not None:
            step = spec.smallest if spec.lo >= 0 else SMALLEST  # a length's least non-zero size on the sheet
            values.append(spec.lo if spec.lo_closed else max(math.nextafter(spec.lo, math.inf), spec.lo + step))
            if spec.lo_closed and spec.lo == 0 and spec.smallest > SMALLEST:
                values.append(spec.smallest)
        out += [(".".join(path), spec, v) for v in values]
    return out


#: the lengths the sheet and the report write in µm (a coating's thickness, the fit clearance and a bearing's
#: deviations), which may be finer than the 0.001 mm every other length is drawn to
WRITTEN_IN_UM = {"bearing.bore_tolerance", "bearing.od_tolerance", "bearing.width_tolerance", "shop.fit_clearance",
                 "shop.coating_thickness", "shop.coating_thickness_max", "features.ring.coating_thickness"}


@pytest.mark.parametrize("path, spec", [(p, s) for p, s in SPECS if s.kind == "length"], ids=lambda x: ".".join(x)
                         if isinstance(x, tuple) else "")
def test_a_length_finer_than_the_sheet_writes_is_refused_at_its_key(path: tuple[str, ...], spec: ParamSpec) -> None:
    """A non-zero length below 0.001 mm would be drawn and written as 0 (the sheet writes sizes to the whole µm:
    common practice, no published source); only the lengths the sheet writes in µm (coating, clearance and
    bearing deviations) take finer values."""
    key = ".".join(path)
    fine = key in WRITTEN_IN_UM
    for value in (0.0004, -0.0004):
        if not (spec.lo is None or value > spec.lo or (spec.lo_closed and value == spec.lo)):
            continue
        raw = template_with({path: f"{value!r} mm"})
        try:
            from_dict(raw, "fuzz.toml")
        except DesignInputError as exc:
            assert not fine, str(exc)
            assert exc.key == key and "finer than the sheet writes" in str(exc) and "0.001 mm" in str(exc), str(exc)
        else:
            assert fine, f"{key} = {value} mm was taken"


@pytest.mark.parametrize("key, spec, value", edge_cases(), ids=[f"{k}={v!r}" for k, _, v in edge_cases()])
def test_every_edge_of_every_bound_is_read_judged_and_built(key: str, spec: ParamSpec, value: float) -> None:
    raw = template_with({tuple(key.split(".")): value if spec.kind == "number" else f"{value!r} {UNIT[spec.kind]}"})
    judge(raw, [key])
    check_then_build(raw)  # and when its check passes, every file `build` writes is made


def test_the_template_is_accepted_and_drawn() -> None:
    # the property above must see accepted designs too, or it proves nothing about them
    assert judge(copy.deepcopy(TEMPLATE), []) == "accepted"
    assert judge(copy.deepcopy(MINIMAL), []) == "accepted"


TEMPLATE_TEXT = (ROOT / "templates" / "string-trick.toml").read_text(encoding="utf-8")


@st.composite
def mutated_template(draw: st.DrawFn) -> str:
    """The template with a few characters inserted, deleted or replaced, as a slip of the keyboard would."""
    text = TEMPLATE_TEXT
    for _ in range(draw(st.integers(1, 3))):
        at = draw(st.integers(0, len(text)))
        cut = draw(st.integers(0, 3))
        new = draw(st.text(st.sampled_from('0123456789.-+e "=[]#\\\n\tmingdeaxz_,{}\'') | st.characters(), max_size=3))
        text = text[:at] + new + text[at + cut:]
    return text


@FUZZ
@given(mutated_template())
def test_a_mistyped_file_is_refused_by_key_or_handled(text: str) -> None:
    try:
        design = yodraft.loads(text, "fuzz.toml")
    except DesignInputError as exc:
        assert "\n" not in str(exc) and str(exc).startswith("fuzz.toml: ")
        event("refused")
        return
    event(judge(dict(design.raw), []))


@pytest.mark.parametrize("changes", [
    {("envelope", "diameter"): "79.0 mm"},  # the template in a 79 mm envelope: the loop crosses itself
    {("features", "rim", "thickness"): "29.0 mm"},  # a rim thicker than its radius: the cup passes the axis
    # a short thread on posts that touch: the axle comes out shorter than nothing
    {("features", "bearing_seat", "spacing"): "0.0 mm", ("features", "axle_bore", "thread_depth"): "0.625 mm"},
], ids=["crossing-loop", "below-the-axis", "negative-axle"])
def test_check_json_survives_a_loop_that_mass_cannot_take(changes: dict[tuple[str, ...], str]) -> None:
    # both found by test_any_value_is_refused_by_key_failed_by_check_or_drawn
    raw = template_with(changes)
    resolved = build(from_dict(raw, "fuzz.toml"))
    assert not resolved.ok
    json.dumps(summary(resolved), allow_nan=False)


# ---------------------------------------------------------------- a passing check means a successful build

def issue_every_file(resolved: yodraft.Resolved) -> None:
    """Everything `yodraft build` writes for an accepted design — the real sheet (DXF, SVG, PDF), the CAM profile,
    the assembly picture — plus the report; any exception here is an internal error (exit 3) a designer would meet."""
    from yodraft.drawing.drawing import render_files
    from yodraft.pictures.assembly import assembly_svg
    from yodraft.report import report_data, report_markdown

    files = render_files(resolved, "fuzz-A")
    assert files["fuzz-A.dxf"] and files["fuzz-A.svg"] and files["fuzz-A.pdf"]
    doc, auditor = ezdxf.recover.read(io.BytesIO(files["fuzz-A.dxf"]))
    assert not auditor.has_errors, [e.message for e in auditor.errors]
    assert assembly_svg(resolved)
    data = report_data(resolved)
    json.dumps(data, allow_nan=False)
    assert report_markdown(data)


def check_then_build(raw: dict[str, Any]) -> str:
    """What `check` then `build` make of a design: refused, failed, or accepted and every file issued."""
    try:
        resolved = build(from_dict(raw, "fuzz.toml"))
    except DesignInputError:
        return "refused"
    json.dumps(summary(resolved), allow_nan=False)  # check --json never crashes either
    if not resolved.ok:
        return "failed"
    issue_every_file(resolved)
    return "accepted"


@FUZZ
@given(designs(inside=True))
def test_a_design_whose_check_passes_builds_every_file(case: tuple[dict[str, Any], list[str]]) -> None:
    raw, _ = case
    event(check_then_build(raw))


#: designs the reference allows that once passed `check` and then crashed the drawing (exit 3)
ONCE_CRASHED = {
    "sharp outer edge": {("features", "rim", "edge_radius"): "0 mm"},
    "sharp lip": {("features", "rim", "lip_radius"): "0 mm"},
    "sharp cup corner": {("features", "rim", "cup_radius"): "0 mm"},
    "sharp catch-zone edge": {("features", "catch_zone", "edge_radius"): "0 mm"},
    "every edge sharp": {("features", "rim", "edge_radius"): "0 mm", ("features", "rim", "lip_radius"): "0 mm",
                         ("features", "rim", "cup_radius"): "0 mm", ("features", "catch_zone", "edge_radius"): "0 mm"},
    "rim as thick as its two radii": {("features", "rim", "thickness"): "2.8 mm"},
    "floor diameter at the rim": {("features", "rim", "floor_diameter"): "49 mm"},
    "pad groove at the rim": {("features", "pad_groove", "outer_diameter"): "45 mm"},
    "small envelope": {("envelope", "diameter"): "40 mm", ("envelope", "width"): "30 mm"},
    "groove inner diameter between pad and groove": {("features", "pad_groove", "inner_diameter"): "19.1 mm"},
}


@pytest.mark.parametrize("changes", list(ONCE_CRASHED.values()), ids=list(ONCE_CRASHED))
def test_designs_that_once_crashed_the_build(changes: dict[tuple[str, ...], str]) -> None:
    check_then_build(template_with(changes))
