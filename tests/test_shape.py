"""Outer shapes: every kind checks and builds, its mass and Izz equal those of the drawn outline revolved
independently, a revision of the wall face moves the anchored sketch points, and the wall and turning rules
hold for any shape."""
from __future__ import annotations

import io
import json
import math
from pathlib import Path

import ezdxf
import numpy as np
import pytest

import yodraft
from conftest import TEMPLATES, set_in
from yodraft.checks import BACK_TURNING_TOOL, GROOVING_TOOL, least_wall, reentrant_regions
from yodraft.cli import main
from yodraft.design import loads
from yodraft.geometry import Profile
from yodraft.release import build_outputs

STRING_TRICK = (TEMPLATES / "string-trick.toml").read_text(encoding="utf-8")
SKETCHED = (TEMPLATES / "sketched.toml").read_text(encoding="utf-8")


def _preset(kind: str, **keys: str) -> str:
    text = STRING_TRICK.replace('name = "larchmere-ls56"', f'name = "hidden-{kind}"')
    text += f'\n[features.shape]\nkind = "{kind}"\n' + "".join(f'{k} = "{v}"\n' for k, v in keys.items())
    return text


def _tangent_sketch() -> str:
    """A sketch unlike the template's: a concave catch zone, a tangent arc into the rim band (rounded where it
    meets it), a flat cup without hub."""
    points = [
        dict(z_from="wall face", r="12 mm"),
        dict(z_from="wall face", z="6 mm", r_from="outer diameter", r="-6 mm", arc="concave", arc_radius="30 mm"),
        dict(z_from="outer face", z="-6 mm", r_from="outer diameter", arc="tangent", radius="1 mm"),
        dict(z_from="outer face", r_from="outer diameter", radius="1.5 mm"),
        dict(z_from="outer face", r_from="outer diameter", r="-3.5 mm", radius="0.5 mm"),
        dict(z_from="outer face", z="-8.5 mm", r_from="outer diameter", r="-3.5 mm", radius="1 mm"),
        dict(z_from="outer face", z="-8.5 mm"),
    ]
    head = SKETCHED[:SKETCHED.index("[[features.shape.points]]")].replace('"larchmere-sk54"', '"hidden-sketch"')
    return head + "".join("\n[[features.shape.points]]\n" + "".join(f'{k} = "{v}"\n' for k, v in p.items())
                          for p in points)


HIDDEN = {
    "cone": STRING_TRICK.replace('name = "larchmere-ls56"', 'name = "hidden-cone"'),
    "arc-convex": _preset("arc", catch_radius="30 mm"),
    "arc-concave": _preset("arc", catch_radius="45 mm", catch_arc="concave"),
    "stepped": _preset("stepped", step_diameter="55 mm", step_width="3 mm"),
    "undercut": _preset("undercut", undercut_depth="1.2 mm", undercut_width="2.5 mm"),
    "flat": _preset("flat"),
    "sketch": SKETCHED.replace('"larchmere-sk54"', '"hidden-sketch-a"'),
    "sketch-rounded-arc": SKETCHED.replace('"larchmere-sk54"', '"hidden-sketch-b"').replace(
        'arc_radius = "36 mm"', 'arc_radius = "36 mm"\nradius = "1.5 mm"'),
    "sketch-tangent": _tangent_sketch(),
}


def _revolved(dxf: bytes, density_g_cm3: float) -> tuple[float, float]:
    """Mass (g) and Izz (g·mm²) of the profile DXF's one closed LWPOLYLINE revolved about the x axis.

    Independent of yodraft's closed forms: the boundary integrals of Green's theorem,
    ∬ r dA = −∮ r²/2 dz and ∬ r³ dA = −∮ r⁴/4 dz, taken by 24-point Gauss–Legendre quadrature
    along each line and each arc rebuilt from its DXF bulge (bulge = tan(sweep / 4), DXF reference).
    """
    doc = ezdxf.read(io.StringIO(dxf.decode("utf-8")))
    (poly,) = doc.modelspace().query("LWPOLYLINE")
    assert poly.closed
    pts = [(x, y, b) for x, y, *_, b in poly.get_points("xyseb")]
    nodes, weights = np.polynomial.legendre.leggauss(24)
    t = (nodes + 1) / 2
    w = weights / 2
    first = second = 0.0
    for (z0, r0, bulge), (z1, r1, _) in zip(pts, pts[1:] + pts[:1]):
        if abs(bulge) < 1e-15:
            z, r = z0 + t * (z1 - z0), r0 + t * (r1 - r0)
            dz = np.full_like(t, z1 - z0)
        else:
            sweep = 4 * math.atan(bulge)
            chord = math.hypot(z1 - z0, r1 - r0)
            radius = chord / (2 * abs(math.sin(sweep / 2)))
            mz, mr = (z0 + z1) / 2, (r0 + r1) / 2
            off = chord / 2 / math.tan(sweep / 2)
            cz, cr = mz - (r1 - r0) / chord * off, mr + (z1 - z0) / chord * off
            a0 = math.atan2(r0 - cr, z0 - cz)
            angle = a0 + t * sweep
            z, r = cz + radius * np.cos(angle), cr + radius * np.sin(angle)
            dz = -radius * np.sin(angle) * sweep
        first += float(np.sum(w * (-r**2 / 2) * dz))
        second += float(np.sum(w * (-r**4 / 4) * dz))
    rho = density_g_cm3 / 1000.0  # g/mm³
    return rho * 2 * math.pi * first, rho * 2 * math.pi * second


@pytest.fixture(scope="module")
def built(tmp_path_factory: pytest.TempPathFactory) -> dict[str, tuple[dict, Path]]:
    out = {}
    for name, text in HIDDEN.items():
        folder = tmp_path_factory.mktemp(name)
        design = folder / f"{name}.toml"
        design.write_text(text, encoding="utf-8")
        paths, resolved = build_outputs(design, folder / "out")
        out[name] = (yodraft.summary(resolved), folder / "out")
    return out


@pytest.mark.parametrize("name", list(HIDDEN))
def test_every_shape_kind_checks_and_builds(built, name: str) -> None:
    data, folder = built[name]
    assert data["ok"], [c for c in data["checks"] if not c["ok"]]
    expected_kind = name.split("-")[0]
    assert data["shape"]["kind"] == expected_kind
    stem = f"{data['design']['name']}-{data['design']['revision']}"
    for suffix in (".dxf", "-profile.dxf", ".svg"):
        assert (folder / f"{stem}{suffix}").stat().st_size > 0


@pytest.mark.parametrize("name", list(HIDDEN))
def test_mass_and_izz_equal_the_drawn_outline_revolved(built, name: str) -> None:
    data, folder = built[name]
    stem = f"{data['design']['name']}-{data['design']['revision']}"
    mass, izz = _revolved((folder / f"{stem}-profile.dxf").read_bytes(), data["material"]["density_g_cm3"])
    assert data["mass"]["half_g"] == pytest.approx(mass, rel=1e-6)
    assert data["mass"]["half_izz_g_mm2"] == pytest.approx(izz, rel=1e-6)


def test_the_quadrature_is_exact_for_a_known_solid() -> None:
    # a hollow cylinder, r 5…10 mm, 4 mm long, density 1 g/cm³: m = ρπ(R²−r²)L, Izz = m(R²+r²)/2 (any handbook)
    profile = Profile.from_points([(0, 5), (4, 5), (4, 10), (0, 10)])
    doc = ezdxf.new()
    doc.modelspace().add_lwpolyline([(s.start[0], s.start[1], 0, 0, 0) for s in profile.segments], format="xyseb",
                                    close=True)
    stream = io.StringIO()
    doc.write(stream)
    mass, izz = _revolved(stream.getvalue().encode(), 1.0)
    m = 1e-3 * math.pi * (10**2 - 5**2) * 4
    assert mass == pytest.approx(m, rel=1e-12)
    assert izz == pytest.approx(m * (10**2 + 5**2) / 2, rel=1e-12)


def test_moving_the_wall_face_moves_every_point_anchored_to_it(tmp_path: Path, capsys) -> None:
    a = tmp_path / "a.toml"
    b = tmp_path / "b.toml"
    a.write_text(SKETCHED, encoding="utf-8")
    revised = set_in(set_in(SKETCHED, "features.bearing_seat", "wall_offset", "0.3 mm"), "design", "revision", "B")
    b.write_text(revised, encoding="utf-8")
    assert main(["diff", str(a), str(b), "--json"]) == 0
    changes = {c["key"]: c for c in json.loads(capsys.readouterr().out)["derived"]}
    moved = changes["features.bearing_seat.dimensions.wall_face_z_mm"]["delta"]
    assert moved == pytest.approx(-0.1)  # the wall face stands wall_offset ahead of the seat face
    raw = loads(SKETCHED).features["shape"]["points"]
    for i, point in enumerate(raw):
        key = f"features.shape.dimensions.point_{i}_z_mm"
        if point["z_from"] == "wall face":
            assert changes[key]["delta"] == pytest.approx(moved), key
        else:
            assert key not in changes, key
    assert main(["diff", str(a), str(b)]) == 0
    text = capsys.readouterr().out
    assert "point_0_z_mm" in text and "point_1_z_mm" in text


def test_least_wall_of_a_plain_web() -> None:
    # an L of plate 1.2 mm thick: the thinnest metal is the plate (plane geometry)
    profile = Profile.from_points([(0, 0), (10, 0), (10, 1.2), (1.2, 1.2), (1.2, 8), (0, 8)])
    d, p, q = least_wall(profile)
    assert d == pytest.approx(1.2, abs=1e-9)


def test_undercut_is_named_with_its_tool() -> None:
    undercut = yodraft.build(loads(HIDDEN["undercut"]))
    regions = reentrant_regions(undercut.profile)
    assert len(regions) == 1
    (region,) = regions
    v = undercut.values
    # the groove runs from the undercut's lower side to its upper side, out to its diameter
    assert region.z_min == pytest.approx(v["shape.undercut_z"], abs=1e-6)
    assert region.z_max == pytest.approx(v["shape.undercut_z"] + v["shape.undercut_width"], abs=1e-6)
    assert 2 * region.r_max == pytest.approx(v["shape.undercut_diameter"], abs=1e-6)
    assert region.tool == BACK_TURNING_TOOL  # 2.5 mm wide, 1.2 mm deep: wider than deep
    names = [c.name for c in undercut.checks if c.feature == "shape" and c.parameter == "kind"]
    assert names == [f"re-entrant region needs a {BACK_TURNING_TOOL}"]
    deep = yodraft.build(loads(_preset("undercut", undercut_depth="2 mm", undercut_width="1.5 mm")))
    assert [r.tool for r in reentrant_regions(deep.profile)] == [GROOVING_TOOL]


@pytest.mark.parametrize("name", ["cone", "arc-convex", "arc-concave", "stepped", "flat", "sketch-tangent",
                                  "sketch-rounded-arc"])
def test_shapes_without_undercut_are_turned_straight(name: str) -> None:
    assert reentrant_regions(yodraft.build(loads(HIDDEN[name])).profile) == ()


def test_a_thin_undercut_fails_the_wall_check() -> None:
    # a groove 4.5 mm into a 5 mm rim at the outer face leaves less than the shop's 0.5 mm
    text = _preset("undercut", undercut_depth="3.3 mm", undercut_width="3 mm")
    r = yodraft.build(loads(text))
    wall = next(c for c in r.checks if c.name == "least wall across metal")
    assert not wall.ok and (wall.feature, wall.parameter) == ("shop", "min_wall")


@pytest.mark.parametrize(("arc", "problem"), [
    ('arc = "concave"\narc_radius = "25 mm"\n', "nothing of the loop lies on the outer face"),  # a dished face
    ('arc = "convex"\narc_radius = "6 mm"\n', "stands out to z ="),  # a domed face, beyond the datum plane
])
def test_a_sketch_without_a_face_at_datum_b_fails_its_check(tmp_path: Path, arc: str, problem: str) -> None:
    """Datum face B is the outer face: faced first, every axial size measured from it. A datum is established
    from a real feature of the part (ISO 5459), so a sketch whose outer face is an arc, rounded at both ends,
    fails a check naming the sketch's points (it used to pass the check and stop the build with an internal
    error); the template, whose outer face is flat, passes it."""
    lip = 'r = "-4 mm"\nradius = "0.8 mm"\n'
    assert SKETCHED.count(lip) == 1
    text = SKETCHED.replace(lip, 'r = "-4 mm"\n' + arc + 'radius = "1.5 mm"\n')
    resolved = yodraft.build(loads(text, "dished.toml"))
    datum = [c for c in resolved.checks if c.name == "outer face for datum B"]
    assert len(datum) == 1 and not datum[0].ok and problem in datum[0].message
    assert (datum[0].feature, datum[0].parameter) == ("shape", "points")
    assert [c.name for c in resolved.failed] == ["outer face for datum B"]
    design = tmp_path / "dished.toml"
    design.write_text(text, encoding="utf-8")
    assert main(["build", str(design), "-o", str(tmp_path / "out")]) == 1
    assert not (tmp_path / "out").exists()
    template = yodraft.build(loads(SKETCHED, "sketched.toml"))
    assert next(c for c in template.checks if c.name == "outer face for datum B").ok
