"""Mass properties checked against textbook solids, Pappus's theorems and shapely."""
from __future__ import annotations

import math

import pytest
import shapely
from hypothesis import given, settings
from hypothesis import strategies as st

from yodraft.geometry import Arc, FilletVertex, Profile, fillet_loop
from yodraft.massprops import (
    assemble,
    body_props,
    clipped_section_integrals,
    cylinder_part,
    mirrored_part,
    ring_mass_g,
    ring_part,
    section_integrals,
)

PI = math.pi


def rect(z0: float, z1: float, r0: float, r1: float) -> Profile:
    return Profile.from_points([(z0, r0), (z1, r0), (z1, r1), (z0, r1)])


def circle(zc: float, rc: float, a: float, pieces: int = 2) -> Profile:
    step = 2 * PI / pieces
    return Profile(tuple(Arc((zc, rc), a, 0.3 + k * step, step) for k in range(pieces)))


def yoyo_half() -> Profile:
    """An invented half: bore, pad groove in the gap face, catch wall, rim, cup and hub, rounded corners."""
    pts = [
        ((1.5, 4.0), 0.0), ((12.0, 4.0), 0.5), ((12.0, 19.0), 2.0), ((21.0, 24.0), 1.0),
        ((21.0, 28.0), 1.5), ((16.0, 28.0), 3.0), ((4.0, 14.0), 1.0), ((1.5, 13.0), 0.3),
        ((1.5, 11.0), 0.0), ((2.5, 11.0), 0.0), ((2.5, 9.0), 0.0), ((1.5, 9.0), 0.0),
    ]
    profile, misfits = fillet_loop([FilletVertex(p, r, f"corner{i}") for i, (p, r) in enumerate(pts)])
    assert not misfits
    return profile


def rel(a: float, b: float) -> float:
    return abs(a - b) / abs(b)


# ------------------------------------------------------------------ against shapely (flattened loop)


def test_area_and_centroid_match_shapely_on_flattened_loop():
    prof = yoyo_half()
    assert any(isinstance(s, Arc) for s in prof.segments)
    s = section_integrals(prof)
    poly: shapely.Polygon = prof.polygon(tol=0.0005)
    # shapely's polygon area and centroid; 1e-4 covers the chord error of the flattening
    assert rel(s.a, poly.area) < 1e-4
    assert rel(s.z1 / s.a, poly.centroid.x) < 1e-4
    assert rel(s.r1 / s.a, poly.centroid.y) < 1e-4
    assert rel(s.a, prof.signed_area()) < 1e-12  # geometry's own exact area


def test_volume_is_pappus_of_shapely_centroid():
    # Pappus's second centroid theorem: V = 2π r̄ A
    prof = yoyo_half()
    poly = prof.polygon(tol=0.0005)
    p = body_props(prof, 2.70)
    assert rel(p.volume_mm3, 2 * PI * poly.centroid.y * poly.area) < 1e-4


# ------------------------------------------------------------------ textbook solids


def test_hollow_cylinder_from_rectangle():
    r1, r2, length, rho = 4.0, 11.0, 6.0, 2.70
    p = body_props(rect(2.0, 2.0 + length, r1, r2), rho)
    area = (r2 - r1) * length
    assert rel(p.area_mm2, area) < 1e-12
    # Pappus: V = 2π ȳ A with ȳ the section centroid radius
    assert rel(p.volume_mm3, 2 * PI * (r1 + r2) / 2 * area) < 1e-12
    m = rho * 1e-3 * PI * (r2**2 - r1**2) * length
    assert rel(p.mass_g, m) < 1e-12
    # hollow cylinder: Izz = ½ m (r1² + r2²), Ixx about its own centre = m/12 (3(r1² + r2²) + L²)
    # (standard table of moments of inertia, e.g. Beer & Johnston, Vector Mechanics for Engineers)
    assert rel(p.izz_g_mm2, 0.5 * m * (r1**2 + r2**2)) < 1e-12
    assert rel(p.ixx_cg_g_mm2, m / 12 * (3 * (r1**2 + r2**2) + length**2)) < 1e-12
    assert rel(p.z_centroid_mm, 2.0 + length / 2) < 1e-12
    # Pappus's first theorem, face by face: two cylinders and two annular faces
    surface = 2 * PI * (r1 + r2) * length + 2 * PI * (r2**2 - r1**2)
    assert rel(p.surface_mm2, surface) < 1e-12


def test_solid_cylinder_about_its_centre():
    radius, length, rho = 7.5, 4.0, 8.0
    p = body_props(rect(-length / 2, length / 2, 0.0, radius), rho)
    m = rho * 1e-3 * PI * radius**2 * length
    # solid cylinder: Izz = ½ m R², Ixx = m/12 (3R² + L²) (standard table of moments of inertia)
    assert rel(p.izz_g_mm2, 0.5 * m * radius**2) < 1e-12
    assert rel(p.ixx_g_mm2, m / 12 * (3 * radius**2 + length**2)) < 1e-12
    assert abs(p.z_centroid_mm) < 1e-12


@pytest.mark.parametrize("pieces", [2, 3, 5])
def test_torus_from_arcs_is_exact(pieces):
    # torus of tube radius a at centre radius R: V = 2π² R a², S = 4π² R a,
    # Izz = m (R² + ¾ a²), I about a diameter = m (½ R² + ⅝ a²)  (Tatum, Classical Mechanics §2.8)
    big, a, rho = 20.0, 3.0, 2.70
    p = body_props(circle(0.0, big, a, pieces), rho)
    v = 2 * PI**2 * big * a**2
    m = rho * 1e-3 * v
    assert rel(p.volume_mm3, v) < 1e-9
    assert rel(p.surface_mm2, 4 * PI**2 * big * a) < 1e-9
    assert rel(p.izz_g_mm2, m * (big**2 + 0.75 * a**2)) < 1e-9
    assert rel(p.ixx_g_mm2, m * (0.5 * big**2 + 0.625 * a**2)) < 1e-9
    assert rel(p.area_mm2, PI * a**2) < 1e-12


def test_torus_exact_where_flattening_is_not():
    # the flattened loop is off by much more than the arc integration: proof nothing is flattened
    prof = circle(5.0, 20.0, 3.0)
    exact = PI * 3.0**2  # area of a circle
    assert rel(section_integrals(prof).a, exact) < 1e-13
    assert rel(prof.polygon(tol=0.01).area, exact) > 1e-5


def test_thin_ring_transverse_inertia():
    # thin ring (hoop) of radius R: Izz = m R², I about a diameter = ½ m R² (standard table)
    big, a = 25.0, 0.01
    p = body_props(circle(0.0, big, a), 1.0)
    assert rel(p.izz_g_mm2, p.mass_g * big**2) < 1e-6
    assert rel(p.ixx_g_mm2, 0.5 * p.mass_g * big**2) < 1e-6


# ------------------------------------------------------------------ bad input


def test_clockwise_loop_is_refused():
    cw = Profile.from_points([(0, 1), (0, 2), (1, 2), (1, 1)])
    with pytest.raises(ValueError, match="counter-clockwise"):
        section_integrals(cw)


def test_profile_below_the_axis_is_refused():
    with pytest.raises(ValueError, match="r < 0"):
        section_integrals(rect(0, 1, -1, 2))
    with pytest.raises(ValueError, match="r < 0"):
        section_integrals(circle(0.0, 1.0, 2.0))


def test_bad_density_is_refused():
    with pytest.raises(ValueError, match="density"):
        body_props(rect(0, 1, 1, 2), 0.0)


# ------------------------------------------------------------------ clipping at a radius


def test_clip_of_hollow_cylinder_is_the_outer_ring():
    full = rect(0.0, 5.0, 4.0, 12.0)
    cut = clipped_section_integrals(full, 9.0)
    ring = section_integrals(rect(0.0, 5.0, 9.0, 12.0))
    for name in ("a", "r1", "z1", "rz", "r3", "rz2"):
        assert rel(getattr(cut, name), getattr(ring, name)) < 1e-12, name
    # only the loop's own surface above the cut: outer cylinder + two annular faces above r = 9
    assert rel(cut.surface, 2 * PI * 12 * 5 + 2 * PI * (12**2 - 9**2)) < 1e-12


def test_clip_of_torus_at_centre_radius_is_half_the_section():
    big, a = 20.0, 3.0
    cut = clipped_section_integrals(circle(0.0, big, a), big)
    # half disc above its diameter: area ½πa², centroid 4a/(3π) above (standard centroid table)
    assert rel(cut.a, 0.5 * PI * a**2) < 1e-12
    assert rel(cut.r1 / cut.a, big + 4 * a / (3 * PI)) < 1e-12


def test_clip_edges():
    prof = yoyo_half()
    full = section_integrals(prof)
    at_axis = clipped_section_integrals(prof, 0.0)
    for name in ("a", "r1", "z1", "rz", "r3", "rz2", "surface"):
        assert rel(getattr(at_axis, name), getattr(full, name)) < 1e-12, name
    assert clipped_section_integrals(prof, 100.0).a == 0.0
    with pytest.raises(ValueError):
        clipped_section_integrals(prof, -1.0)


@pytest.mark.parametrize("r_cut", [10.0, 15.5, 22.4, 27.0])
def test_clip_matches_shapely_clipping(r_cut):
    prof = yoyo_half()
    cut = clipped_section_integrals(prof, r_cut)
    poly = prof.polygon(tol=1e-5).intersection(shapely.box(-100, r_cut, 100, 100))
    # shapely clipping of the finely flattened loop, then our (exact for polygons) integrals of that polygon
    parts = [shapely.geometry.polygon.orient(g) for g in getattr(poly, "geoms", [poly])]
    polys = [section_integrals(Profile.from_points(list(g.exterior.coords)[:-1])) for g in parts]
    area = sum(g.area for g in parts)
    r1 = sum(s.r1 for s in polys)
    r3 = sum(s.r3 for s in polys)
    assert rel(cut.a, area) < 1e-4
    assert rel(cut.r1, r1) < 1e-4
    assert rel(cut.r3, r3) < 1e-4


# ------------------------------------------------------------------ small parts and the assembly


def test_ring_and_cylinder_parts():
    # hollow cylinder: Izz = ½ m (r1² + r2²), Ixx own = m/12 (3(r1² + r2²) + L²) (standard table)
    b = ring_part("bearing", 4.2, 3.175, 6.35, 4.7625, 0.0)
    s = 3.175**2 + 6.35**2
    assert rel(b.izz_g_mm2, 0.5 * 4.2 * s) < 1e-12
    assert rel(b.ixx_own_g_mm2, 4.2 / 12 * (3 * s + 4.7625**2)) < 1e-12
    axle = cylinder_part("axle", 1.1, 2.0, 10.0)
    assert rel(axle.izz_g_mm2, 0.5 * 1.1 * 4.0) < 1e-12
    pad = ring_part("pad", 0.5, 8.0, 10.0, 1.0, 3.0)
    # parallel-axis theorem: I about z = 0 = I own + m d²
    assert rel(pad.ixx_g_mm2, pad.ixx_own_g_mm2 + 0.5 * 9.0) < 1e-12
    assert mirrored_part(pad).z_mm == -3.0
    assert rel(ring_mass_g(1.0, 1.0, 2.0, 1.0), 1e-3 * PI * 3.0) < 1e-12
    with pytest.raises(ValueError):
        ring_part("bad", 1.0, 5.0, 4.0, 1.0, 0.0)
    with pytest.raises(ValueError):
        ring_part("bad", -1.0, 4.0, 5.0, 1.0, 0.0)


def test_two_halves_make_the_whole_cylinder():
    r1, r2, w, rho = 3.0, 20.0, 8.0, 2.70
    half = body_props(rect(0.0, w, r1, r2), rho)
    asm = assemble(half, [])
    m = rho * 1e-3 * PI * (r2**2 - r1**2) * 2 * w
    # the mirrored pair is one hollow cylinder of length 2w centred at z = 0 (standard table)
    assert rel(asm.total_g, m) < 1e-12
    assert rel(asm.izz_g_mm2, 0.5 * m * (r1**2 + r2**2)) < 1e-12
    assert rel(asm.ixx_g_mm2, m / 12 * (3 * (r1**2 + r2**2) + (2 * w) ** 2)) < 1e-12
    assert asm.z_centroid_mm == 0.0


def test_assembly_sums_parts_and_budget():
    half = body_props(yoyo_half(), 2.70)
    pad = ring_part("pad", 0.4, 9.0, 11.0, 1.0, 2.0)
    parts = [
        ring_part("bearing", 4.2, 3.175, 6.35, 4.7625, 0.0),
        cylinder_part("axle", 1.1, 2.0, 10.0, 0.0),
        pad,
        mirrored_part(pad),
    ]
    asm = assemble(half, parts)
    assert rel(asm.total_g, 2 * half.mass_g + 4.2 + 1.1 + 0.8) < 1e-12
    assert rel(asm.izz_g_mm2, 2 * half.izz_g_mm2 + sum(p.izz_g_mm2 for p in parts)) < 1e-12
    pad_ixx = 0.4 / 12 * (3 * (81 + 121) + 1) + 0.4 * 4  # own + m d², d = 2 mm
    expect_ixx = 2 * half.ixx_g_mm2 + parts[0].ixx_own_g_mm2 + parts[1].ixx_own_g_mm2 + 2 * pad_ixx
    assert rel(asm.ixx_g_mm2, expect_ixx) < 1e-12
    assert abs(asm.z_centroid_mm) < 1e-12
    budget = {line.name: line for line in asm.budget}
    assert budget["half"].count == 2 and budget["pad"].count == 2 and budget["bearing"].count == 1
    assert rel(budget["pad"].mass_total_g, 0.8) < 1e-12
    assert rel(sum(line.mass_total_g for line in asm.budget), asm.total_g) < 1e-12


def test_results_are_frozen():
    p = body_props(rect(0, 1, 1, 2), 1.0)
    with pytest.raises(AttributeError):
        p.mass_g = 3.0  # type: ignore[misc]


# ------------------------------------------------------------------ properties


@st.composite
def filleted_rects(draw):
    z0 = draw(st.floats(0.0, 10.0))
    r0 = draw(st.floats(0.0, 20.0))
    w = draw(st.floats(0.5, 15.0))
    h = draw(st.floats(0.5, 15.0))
    lim = 0.49 * min(w, h)
    radii = [draw(st.floats(0.0, lim)) for _ in range(4)]
    corners = [(z0, r0), (z0 + w, r0), (z0 + w, r0 + h), (z0, r0 + h)]
    profile, misfits = fillet_loop([FilletVertex(c, rad) for c, rad in zip(corners, radii)])
    assert not misfits
    return profile, w, h, radii


@settings(max_examples=60, deadline=None)
@given(filleted_rects(), st.floats(-30.0, 30.0))
def test_parallel_axis_under_translation(shape, dz):
    profile, w, h, radii = shape
    a = body_props(profile, 2.70)
    b = body_props(profile.translated(dz), 2.70)
    assert a.mass_g > 0 and a.izz_g_mm2 >= 0 and a.ixx_cg_g_mm2 > 0
    # each rounded right-angle corner removes a square of side r less a quarter disc: r² (1 − π/4)
    assert rel(a.area_mm2, w * h - (1 - PI / 4) * sum(r * r for r in radii)) < 1e-9
    assert rel(b.mass_g, a.mass_g) < 1e-12
    assert b.izz_g_mm2 == pytest.approx(a.izz_g_mm2, rel=1e-9, abs=1e-12)
    assert b.z_centroid_mm == pytest.approx(a.z_centroid_mm + dz, rel=1e-9, abs=1e-9)
    # parallel-axis theorem: I about z = 0 = I about the mass centre + m z̄²
    expect = a.ixx_cg_g_mm2 + a.mass_g * (a.z_centroid_mm + dz) ** 2
    assert b.ixx_g_mm2 == pytest.approx(expect, rel=1e-9, abs=1e-9)


@pytest.mark.parametrize("pieces", [2, 3])
@pytest.mark.parametrize("d", [-2.5, -1.0, 0.7, 2.9])
def test_clip_of_circle_is_a_circular_segment(pieces, d):
    # circular segment beyond a chord at distance d from the centre: A = a² acos(d/a) − d √(a² − d²)
    # (standard mensuration formula)
    big, a = 20.0, 3.0
    cut = clipped_section_integrals(circle(4.0, big, a, pieces), big + d)
    expect = a**2 * math.acos(d / a) - d * math.sqrt(a**2 - d**2)
    assert rel(cut.a, expect) < 1e-12
    # its centroid lies 2 (a² − d²)^(3/2) / (3 A) from the centre (standard centroid table)
    assert rel(cut.r1 / cut.a - big, 2 * (a**2 - d**2) ** 1.5 / (3 * expect)) < 1e-9
