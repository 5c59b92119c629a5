"""The pictures: valid SVG, exact arcs, a true silhouette, byte-identical runs, and a rasteriser's view of them."""
from __future__ import annotations

import math
import re
import shutil
import subprocess
import xml.etree.ElementTree as ET
from pathlib import Path

import pytest
import shapely

from conftest import TEMPLATES
from yodraft import analyse, build, load
from yodraft.cli import main
from yodraft.geometry import Arc, Line, Profile
from yodraft.pictures.assembly import assembly_svg, drawing_scale, material_colour
from yodraft.pictures.silhouette import outline_chains, outline_runs
from yodraft.pictures.svg import View, segments_d

SVG = "{http://www.w3.org/2000/svg}"
TEMPLATE_FILES = sorted(TEMPLATES.glob("*.toml"))


def parse(data: bytes) -> ET.Element:
    """The picture parsed by the standard library's XML parser; the root must be an SVG element."""
    root = ET.fromstring(data)
    assert root.tag == f"{SVG}svg"
    assert re.fullmatch(r"[\d.]+mm", root.get("width", "")) and root.get("viewBox")
    return root


def _texts(root: ET.Element) -> str:
    return " ".join("".join(t.itertext()) for t in root.iter(f"{SVG}text"))


def rasterise(svg: Path, tmp_path: Path) -> bytes:
    """PNG bytes from the resvg command line (the test is skipped where it is not installed)."""
    tool = shutil.which("resvg")
    if tool is None:
        pytest.skip("no SVG rasteriser (resvg) on PATH")
    png = tmp_path / (svg.stem + ".png")
    done = subprocess.run([tool, str(svg), str(png)], capture_output=True, text=True, timeout=120)
    assert done.returncode == 0, done.stderr
    data = png.read_bytes()
    assert data[:8] == b"\x89PNG\r\n\x1a\n" and len(data) > 2000
    return data


# ---------------------------------------------------------------- the SVG arc command
def _svg_arc_centre(p1: tuple[float, float], p2: tuple[float, float], r: float, large: int, sweep: int):
    """Centre of an SVG elliptical arc with rx = ry = r, no rotation (SVG 1.1, appendix F.6.5, steps 1–3)."""
    x1p, y1p = (p1[0] - p2[0]) / 2, (p1[1] - p2[1]) / 2
    root = math.sqrt(max(0.0, (r * r * r * r - r * r * y1p * y1p - r * r * x1p * x1p) / (r * r * y1p * y1p + r * r * x1p * x1p)))
    sign = -1.0 if large == sweep else 1.0
    cxp, cyp = sign * root * y1p, -sign * root * x1p
    return cxp + (p1[0] + p2[0]) / 2, cyp + (p1[1] + p2[1]) / 2


@pytest.mark.parametrize("kz,kr", [(1, 1), (-1, 1), (1, -1), (-1, -1)])
@pytest.mark.parametrize("start,sweep", [(0.3, 1.2), (2.0, -0.9), (-1.0, 2.9), (0.5, -3.5), (0.0, 2 * math.pi)])
def test_arc_lands_on_its_centre_in_every_mirror(kz: int, kr: int, start: float, sweep: float) -> None:
    arc = Arc((3.0, 7.0), 2.5, start, sweep)
    view = View(50.0, 60.0, 2.0, kz, kr)
    d = segments_d([arc], view)
    numbers = [float(x) for x in re.findall(r"-?[\d.]+", d)]
    x, y = numbers[:2]
    centre = view(*arc.center)
    for k in range(2, len(numbers), 7):
        rx, _, _, large, flag, x2, y2 = numbers[k:k + 7]
        assert rx == pytest.approx(5.0)
        cx, cy = _svg_arc_centre((x, y), (x2, y2), rx, int(large), int(flag))
        assert (cx, cy) == pytest.approx(centre, abs=2e-3)
        x, y = x2, y2
    assert (x, y) == pytest.approx(view(*arc.end), abs=1e-3)


# ---------------------------------------------------------------- silhouette
def _shapely_top(polygon: shapely.Polygon, z: float) -> float:
    """Largest r of the polygon at station z, from shapely's intersection with a radial line."""
    cut = polygon.intersection(shapely.LineString([(z, -1.0), (z, 1000.0)]))
    return 0.0 if cut.is_empty else cut.bounds[3]


def _chain_top(chains: list[list], z: float) -> float:
    best = 0.0
    for chain in chains:
        pts = [p for s in chain for p in (s.points(0.001) if isinstance(s, Arc) else [s.start])] + [chain[-1].end]
        best = max(best, _shapely_top(shapely.Polygon(pts), z))
    return best


@pytest.mark.parametrize("template", TEMPLATE_FILES, ids=lambda p: p.stem)
def test_silhouette_is_the_largest_radius_at_every_station(template: Path) -> None:
    profile = build(load(template)).profile
    chains = outline_chains([profile.segments])
    reference = profile.polygon(0.001)
    z0, _, z1, _ = profile.bounds()
    for i in range(1, 160):
        z = z0 + (z1 - z0) * i / 160
        assert _chain_top(chains, z) == pytest.approx(_shapely_top(reference, z), abs=0.01), z


def test_outermost_part_hides_the_rest() -> None:
    """A washer inside a tall ring shows only where it stands out (textbook first-angle projection)."""
    tall = Profile.from_points([(0, 0), (2, 0), (2, 10), (0, 10)]).segments
    wide = Profile.from_points([(-3, 0), (5, 0), (5, 4), (-3, 4)]).segments
    runs = outline_runs([tall, wide])
    spans = [(owner, round(chain[0].start[0], 6), round(chain[-1].end[0], 6)) for owner, chain in runs]
    assert spans == [(1, -3.0, 0.0), (0, 0.0, 2.0), (1, 2.0, 5.0)]


def test_drawing_scale_is_a_standard_one() -> None:
    # ISO 5455: recommended scales 5:1, 2:1, 1:1, 1:2, 1:5
    assert drawing_scale(56, 44) == 2.0
    assert drawing_scale(20, 15) == 5.0
    assert drawing_scale(100, 60) == 1.0


# ---------------------------------------------------------------- assembly picture
def test_build_writes_the_assembly_picture(tmp_path: Path) -> None:
    assert main(["build", str(TEMPLATES / "string-trick.toml"), "-o", str(tmp_path)]) == 0
    picture = tmp_path / "larchmere-ls56-A-assembly.svg"
    root = parse(picture.read_bytes())
    resolved = build(load(TEMPLATES / "string-trick.toml"))
    a = analyse(resolved)
    text = _texts(root)
    # the caption carries the figures of the analysis, rounded as printed
    assert f"mass {a.assembly.total_g:.2f} g" in text
    assert f"{a.assembly.izz_g_mm2:,.0f}".replace(",", " ") in text
    assert "Ø56.00 mm" in text and "gap 4.36 mm" in text
    # the section's fill paths trace the profile's exact arcs: every fillet radius appears at drawing scale (2:1)
    d = " ".join(p.get("d", "") for p in root.iter(f"{SVG}path"))
    radii = {round(float(m), 3) for m in re.findall(r"A ([\d.]+) ", d)}
    for seg in resolved.profile.segments:
        if isinstance(seg, Arc):
            assert round(seg.radius * 2, 3) in radii
    assert resolved.values["bearing.designation"] in text


@pytest.mark.parametrize("template", TEMPLATE_FILES, ids=lambda p: p.stem)
def test_assembly_picture_is_byte_identical(template: Path) -> None:
    resolved = build(load(template))
    if not resolved.ok:
        pytest.skip("a design that fails its checks is not built")
    first = assembly_svg(resolved)
    assert assembly_svg(build(load(template))) == first
    parse(first)


def test_assembly_picture_renders(tmp_path: Path) -> None:
    svg = tmp_path / "a.svg"
    svg.write_bytes(assembly_svg(build(load(TEMPLATES / "string-trick.toml"))))
    rasterise(svg, tmp_path)


def test_material_colours_tell_parts_apart() -> None:
    names = ["6061-T6", "C36000", "304", "Ti-6Al-4V", "W90", "POM", "silicone", "steel"]
    assert len({material_colour(n) for n in names}) == len(names)


def test_a_pressed_in_ring_is_drawn_in_its_material_colour() -> None:
    import dataclasses

    from yodraft.parts import Part

    resolved = build(load(TEMPLATES / "string-trick.toml"))
    ring = Part("rim ring", "C36000", 8.5, Profile.from_points([(15, 25.0), (19.5, 25.0), (19.5, 27.0), (15, 27.0)]))
    root = parse(assembly_svg(dataclasses.replace(resolved, parts=resolved.parts + (ring,))))
    assert "rim ring, C36000 (copper alloy)" in _texts(root)
    brass = material_colour("C36000")
    filled = [p for p in root.iter(f"{SVG}path") if p.get("fill") == brass]
    # both halves' rings, each drawn above and below the axis: four rectangles of four lines
    assert filled and filled[0].get("d").count("M ") == 4


# ---------------------------------------------------------------- overlay
def _revised(tmp_path: Path) -> tuple[Path, Path]:
    """The template (A) and a revision B with a wider rim and a deeper cup."""
    from conftest import set_in

    a = tmp_path / "a.toml"
    a.write_text((TEMPLATES / "string-trick.toml").read_text(encoding="utf-8"), encoding="utf-8")
    text = set_in(a.read_text(encoding="utf-8"), "design", "revision", "B")
    text = set_in(text, "features.rim", "band_width", "9 mm")
    b = tmp_path / "b.toml"
    b.write_text(set_in(text, "features.rim", "cup_depth", "9 mm"), encoding="utf-8")
    return a, b


def test_diff_plot_overlays_both_profiles(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    a, b = _revised(tmp_path)
    plot = tmp_path / "o.svg"
    assert main(["diff", str(a), str(b), "--plot", str(plot)]) == 0
    assert str(plot) in capsys.readouterr().err
    root = parse(plot.read_bytes())
    text = _texts(root)
    assert "larchmere-ls56 rev A" in text and "larchmere-ls56 rev B" in text and "a.toml" in text
    # the two outlines differ in width and in dash, not only in colour (legible in grey print)
    outlines = [p for p in root.iter(f"{SVG}path") if p.get("stroke") and p.get("fill") == "none"]
    styles = {(p.get("stroke-width"), p.get("stroke-dasharray")) for p in outlines}
    assert len(styles) == 2 and len({w for w, _ in styles}) == 2 and {d is None for _, d in styles} == {True, False}
    # the changed feature is called out with what changed, as written in the files
    assert "rim:" in text and "width 8 mm → 9 mm" in text
    ma = analyse(build(load(a))).assembly.total_g
    mb = analyse(build(load(b))).assembly.total_g
    assert f"{ma:.2f}" in text and f"{mb:.2f}" in text and f"{abs(mb - ma):.2f}" in text
    again = tmp_path / "o2.svg"
    assert main(["diff", str(a), str(b), "--plot", str(again)]) == 0
    assert again.read_bytes() == plot.read_bytes()
    rasterise(plot, tmp_path)


def test_diff_plot_never_writes_over_an_input(tmp_path: Path) -> None:
    a, b = _revised(tmp_path)
    before = b.read_bytes()
    assert main(["diff", str(a), str(b), "--plot", str(b)]) == 2
    assert main(["diff", str(a), str(b), "--plot", str(tmp_path / "." / "a.toml")]) == 2
    assert b.read_bytes() == before


# ---------------------------------------------------------------- sweep plots
def _targeted(tmp_path: Path) -> Path:
    from conftest import set_in

    design = tmp_path / "t.toml"
    text = set_in((TEMPLATES / "string-trick.toml").read_text(encoding="utf-8"), "envelope", "target_izz",
                  "30000 g*mm^2")
    design.write_text(text, encoding="utf-8")
    return design


def test_one_key_sweep_plot_marks_where_the_target_is_met(tmp_path: Path) -> None:
    import csv
    import io

    import numpy as np

    plot, table = tmp_path / "s.svg", tmp_path / "s.csv"
    design = _targeted(tmp_path)
    assert main(["sweep", str(design), "--vary", "rim.thickness=3mm:4mm:6", "-o", str(table), "--plot", str(plot),
                 "--y", "mass,gap,izz"]) == 0
    root = parse(plot.read_bytes())
    text = _texts(root)
    assert "assembled mass, g" in text and "Izz, assembled, g·mm²" in text and "features.rim.thickness, mm" in text
    # the gap does not move with the rim: left out, with its value
    assert "left out: profile.gap_mm = 4.3625 mm in every variant" in text
    assert len(list(root.iter(f"{SVG}polyline"))) == 2
    rows = list(csv.DictReader(io.StringIO(table.read_text(encoding="utf-8"))))
    x = [float(r["features.rim.thickness_mm"]) for r in rows]
    for key, target in (("mass.total_g", 66.0), ("mass.izz_g_mm2", 30000.0)):
        y = [float(r[key]) for r in rows]
        crossing = float(np.interp(target, y, x))  # numpy's linear interpolation, the curve rising through the target
        assert f"at {round(crossing, 4):.6g} mm" in text
    dashed = [ln for ln in root.iter(f"{SVG}line") if ln.get("stroke") == "#b03a2e" and ln.get("stroke-dasharray")]
    assert len([ln for ln in dashed if ln.get("stroke-width") == "0.45"]) == 2  # one target line per panel
    rasterise(plot, tmp_path)


def test_two_key_sweep_plot_is_a_heat_map_with_the_target_contour(tmp_path: Path) -> None:
    plot = tmp_path / "s.svg"
    assert main(["sweep", str(TEMPLATES / "string-trick.toml"), "--vary", "rim.thickness=3mm:4mm:5",
                 "--vary", "rim.band_width=7mm:9mm:4", "-o", str(tmp_path / "s.csv"), "--plot", str(plot)]) == 0
    root = parse(plot.read_bytes())
    cells = [r for r in root.iter(f"{SVG}rect") if (r.get("fill") or "").startswith("#") and r.get("stroke") is None
             and r.get("fill") != "#fff"]
    assert len(cells) == 2 * 5 * 4  # one cell per variant in each of the two panels
    wide = [p for p in root.iter(f"{SVG}path") if p.get("stroke") == "#000" and p.get("stroke-width") == "0.8"]
    assert len(wide) == 1  # the template aims at 66 g and no Izz: one target contour
    assert "target 66 g" in _texts(root)
    again = tmp_path / "again.svg"
    assert main(["sweep", str(TEMPLATES / "string-trick.toml"), "--vary", "rim.thickness=3mm:4mm:5",
                 "--vary", "rim.band_width=7mm:9mm:4", "-o", str(tmp_path / "s.csv"), "--plot", str(again)]) == 0
    assert again.read_bytes() == plot.read_bytes()
    rasterise(plot, tmp_path)


def test_contours_of_a_plane_are_straight() -> None:
    """Marching squares reproduces a linear field exactly: the level c of f = x + 2y is the line x + 2y = c."""
    from yodraft.pictures.sweep_plot import _contour_d

    xs, ys = [0.0, 1.0, 2.0, 3.0], [0.0, 0.5, 1.0]
    grid = [[x + 2 * y for y in ys] for x in xs]
    d = _contour_d(grid, xs, ys, 2.3, lambda x: x, lambda y: y)
    points = [(float(a), float(b)) for a, b in re.findall(r"(-?[\d.]+) (-?[\d.]+)", d)]
    assert len(points) >= 4
    for x, y in points:
        assert x + 2 * y == pytest.approx(2.3, abs=2e-3)


def test_y_names_and_columns() -> None:
    from yodraft.errors import DesignInputError
    from yodraft.pictures.sweep_plot import parse_y

    assert parse_y("mass,izz,rim_share") == ["mass.total_g", "mass.izz_g_mm2", "spin.rim_share"]
    assert parse_y("spin.rim_share, mass") == ["spin.rim_share", "mass.total_g"]
    with pytest.raises(DesignInputError):
        parse_y("mass,,izz")


# ---------------------------------------------------------------- report with pictures
def _image_links(markdown: str) -> dict[str, str]:
    return dict(re.findall(r"!\[([^\]]+)\]\(([^)]+)\)", markdown))


def test_report_links_the_pictures_build_wrote(tmp_path: Path) -> None:
    a, b = _revised(tmp_path)
    out = tmp_path / "out"
    assert main(["build", str(b), "-o", str(out)]) == 0
    report = out / "b.md"
    assert main(["report", str(b), "-o", str(report), "--pictures", str(out), "--previous", str(a)]) == 0
    links = _image_links(report.read_text(encoding="utf-8"))
    assert set(links) == {"sheet preview", "assembly", "overlay with the previous revision"}
    for link in links.values():
        target = report.parent / link
        assert target.is_file() and parse(target.read_bytes()) is not None
    assert links["overlay with the previous revision"] == "larchmere-ls56-B-overlay-larchmere-ls56-A.svg"
    text = report.read_text(encoding="utf-8")
    assert "features.rim.band_width: 8 mm → 9 mm" in text and "rev A" in text
    # a report elsewhere links the same pictures by a path relative to itself
    elsewhere = tmp_path / "notes" / "b.md"
    elsewhere.parent.mkdir()
    assert main(["report", str(b), "-o", str(elsewhere), "--pictures", str(out)]) == 0
    links = _image_links(elsewhere.read_text(encoding="utf-8"))
    assert links == {"sheet preview": "../out/larchmere-ls56-B.svg", "assembly": "../out/larchmere-ls56-B-assembly.svg"}


def test_report_says_which_pictures_are_not_built_yet(tmp_path: Path, capsys: pytest.CaptureFixture[str]) -> None:
    assert main(["report", str(TEMPLATES / "string-trick.toml"), "--pictures", str(tmp_path), "--format", "json"]) == 0
    import json

    data = json.loads(capsys.readouterr().out)
    assert [p["kind"] for p in data["pictures"]] == ["sheet preview", "assembly"]
    assert not any(p["exists"] for p in data["pictures"])
    assert main(["report", str(TEMPLATES / "string-trick.toml"), "--pictures", str(tmp_path)]) == 0
    assert "is not there yet; `yodraft build` writes it" in capsys.readouterr().out


def test_report_with_a_bad_previous_writes_nothing(tmp_path: Path) -> None:
    a, b = _revised(tmp_path)
    out = tmp_path / "out"
    out.mkdir()
    broken = tmp_path / "broken.toml"
    broken.write_text("[design]\nname = 'x'\n[envelope]\ndiameter = '56'\n", encoding="utf-8")
    assert main(["report", str(b), "-o", str(out / "b.md"), "--pictures", str(out), "--previous", str(broken)]) == 2
    assert list(out.iterdir()) == []


def test_heat_map_rises_whichever_way_the_sweep_ran(tmp_path: Path) -> None:
    def cells(first: str, second: str) -> list[str]:
        plot = tmp_path / "h.svg"
        assert main(["sweep", str(TEMPLATES / "string-trick.toml"), "--vary", first, "--vary", second,
                     "-o", str(tmp_path / "h.csv"), "--plot", str(plot), "--y", "mass"]) == 0
        root = parse(plot.read_bytes())
        return [f"{r.get('x')},{r.get('y')},{r.get('fill')}" for r in root.iter(f"{SVG}rect") if r.get("stroke") is None]

    assert cells("rim.thickness=3mm:4mm:3", "catch_zone.land=1mm:2mm:2") == \
        cells("rim.thickness=4mm:3mm:3", "catch_zone.land=2mm:1mm:2")


def test_a_sliver_of_arc_between_two_stations_is_drawn_as_its_chord() -> None:
    """Regression: two stations closer than an arc can turn gave an arc of zero sweep (a GeometryError)."""
    from yodraft.pictures.silhouette import _Piece

    arc = Arc((0.0, 0.0), 5.0, math.pi / 2, -math.pi / 2)
    piece = _Piece(0, 0, arc, 0.0, 5.0)
    sliver = piece.between(2.0, 2.0 + 1e-13)
    assert isinstance(sliver, Line) and sliver.start[1] == pytest.approx(math.sqrt(21.0))
