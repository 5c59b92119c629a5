"""The shop drawing: re-read with ezdxf's recover, every dimension measured from the geometry, blocks, determinism."""
from __future__ import annotations

import io
import math
from pathlib import Path

import ezdxf
import pytest
import shapely
from ezdxf import recover

from yodraft.builder import build
from yodraft.design import load
from yodraft.drawing.detail import DETAIL_BLOCK
from yodraft.drawing.dimensions import tags_of
from yodraft.drawing.drawing import render_files, sheet_data
from yodraft.drawing.mtext import escape
from yodraft.drawing.notes import SheetData

TEMPLATE = Path(__file__).resolve().parents[1] / "templates" / "string-trick.toml"
STEM = "larchmere-ls56-A"


@pytest.fixture(scope="module")
def resolved():
    return build(load(TEMPLATE))


@pytest.fixture(scope="module")
def files(resolved):
    return render_files(resolved, STEM)


def _read(data: bytes):
    doc, auditor = recover.read(io.BytesIO(data))
    return doc, auditor


def _dims(doc):
    out = {}
    layouts = [doc.modelspace(), doc.blocks.get(DETAIL_BLOCK)]
    for layout in layouts:
        for dim in layout.query("DIMENSION"):
            for key in tags_of(dim):
                out.setdefault(key, []).append(dim)
    return out


def _expected(r) -> dict[str, float]:
    """Model values each dimension must measure (mm, angles in degrees)."""
    v = r.values
    zb = v["rim.face_z"]
    return {
        "rim.diameter": v["rim.diameter"], "rim.cup_diameter": v["rim.cup_diameter"],
        "rim.hub_diameter": v["rim.hub_diameter"], "rim.floor_diameter": v["rim.floor_diameter"],
        "rim.width": v["rim.width"], "rim.cup_depth": v["rim.cup_depth"], "rim.hub_height": v["rim.hub_height"],
        "rim.floor_angle": math.degrees(v["rim.floor_angle"]),
        "catch_zone.start_diameter": v["catch_zone.start_diameter"],
        "catch_zone.angle": math.degrees(v["catch_zone.angle"]),
        "pad_groove.inner_diameter": v["pad_groove.inner_diameter"],
        "pad_groove.outer_diameter": v["pad_groove.outer_diameter"], "pad_groove.depth": v["pad_groove.depth"],
        "bearing_seat.wall_bore": v["bearing_seat.wall_bore"],
        "bearing_seat.wall_outside_diameter": v["pad_groove.inner_diameter"],
        "bearing_seat.seat_face_diameter": v["bearing_seat.seat_face_diameter"],
        "bearing_seat.post_diameter": v["bearing_seat.post_diameter"],
        "bearing_seat.seat_face_z": zb - v["bearing_seat.seat_face_z"],
        "bearing_seat.wall_face_z": zb - v["bearing_seat.wall_face_z"],
        "bearing_seat.post_face_z": zb - v["bearing_seat.post_face_z"],
        "profile.half_width": zb - v["bearing_seat.post_face_z"],
        "bearing_seat.post_length": v["bearing_seat.post_length"],
        "bearing_seat.wall_offset": v["bearing_seat.wall_offset"],
        "vent_groove.depth": v["vent_groove.depth"],
        "axle_bore.major_diameter": v["axle_bore.major_diameter"],
        "axle_bore.thread_depth": v["axle_bore.thread_depth"],
        "rim.edge_radius": v["rim.edge_radius"], "rim.lip_radius": v["rim.lip_radius"],
        "rim.cup_radius": v["rim.cup_radius"], "catch_zone.edge_radius": v["catch_zone.edge_radius"],
    }


def test_sheet_recovers_without_audit_errors(files):
    doc, auditor = _read(files[f"{STEM}.dxf"])
    assert not auditor.has_errors, [str(e.message) for e in auditor.errors]
    assert doc.dxfversion == "AC1027"  # R2013
    assert doc.header["$INSUNITS"] == 4  # millimetres, DXF reference


def test_every_listed_dimension_measures_the_model(files, resolved):
    doc, _ = _read(files[f"{STEM}.dxf"])
    dims = _dims(doc)
    for key, value in _expected(resolved).items():
        assert key in dims, f"no dimension for {key}"
        for dim in dims[key]:
            assert dim.get_geometry_block() is not None, f"{key} is not rendered"
            # the angular measurement is in degrees, the linear ones in mm
            assert dim.get_measurement() == pytest.approx(value, abs=1e-6), key


def test_toleranced_diameters_show_the_fit_limits(files, resolved):
    doc, _ = _read(files[f"{STEM}.dxf"])
    dims = _dims(doc)
    fit = resolved.seat_fit
    for key, f in (("bearing_seat.post_diameter", fit.post), ("bearing_seat.wall_bore", fit.wall)):
        dim = dims[key][0]
        text = " ".join(t.plain_text() for t in dim.get_geometry_block().query("MTEXT"))
        nominal = float(text.split("Ø")[1].split()[0])
        tol = float(text.split("±")[1].split()[0])
        # limits to the µm (three decimals), the zone never wider than the fit allows, less by under a µm
        # (rounded inward; common practice, no published source)
        assert f.max_mm - 0.001 <= nominal + tol <= f.max_mm + 5e-4
        assert f.min_mm - 5e-4 <= nominal - tol <= f.min_mm + 0.001
        assert len(text.split("Ø")[1].split()[0].split(".")[1]) <= 3 and len(text.split("±")[1].split()[0].split(".")[1]) <= 3
        assert f"[{f.nominal_mm / 25.4:.5f}" in text  # inch bearing: inch value in brackets
        assert dim.dimstyle_override if hasattr(dim, "dimstyle_override") else True


def test_hatch_area_equals_section_area(files, resolved):
    doc, _ = _read(files[f"{STEM}.dxf"])
    area = 0.0
    for hatch in doc.modelspace().query("HATCH"):
        for p in hatch.paths:
            path = ezdxf.path.from_hatch_boundary_path(p)
            area += shapely.Polygon([(q.x, q.y) for q in path.flattening(0.001)]).area
    expected = 2 * resolved.profile.signed_area()
    assert area == pytest.approx(expected, rel=1e-3)


def test_outline_is_the_loop_and_its_mirror(files, resolved):
    doc, _ = _read(files[f"{STEM}.dxf"])
    loops = doc.modelspace().query("LWPOLYLINE[layer=='outline']")
    assert len(loops) == 2
    areas = sorted(ezdxf.path.make_path(e).has_curves and shapely.Polygon(
        [(q.x, q.y) for q in ezdxf.path.make_path(e).flattening(0.001)]).area for e in loops)
    assert areas[0] == pytest.approx(resolved.profile.signed_area(), rel=1e-4)


def _block_texts(doc) -> str:
    psp = doc.paperspace("sheet")
    return "\n".join(t.plain_text() for t in psp.query("MTEXT"))


def test_title_and_note_blocks(files, resolved):
    from yodraft.drawing.numbers import deviation_text, limits_um, size_text

    doc, _ = _read(files[f"{STEM}.dxf"])
    text = _block_texts(doc)
    data = sheet_data(resolved)
    for needle in ("LS-56 string-trick yo-yo, one half", "LTC-0056", "Larchmere Turning Co.", "6061-T6",
                   f"{data.half_mass_g:.1f} g", "ISO 2768-m", "Date of issue", "2026-11-20", "Approved by",
                   "Document type", "Identification number", "ISO 13715", "Ra 0.8", f"{data.runout_mm:.3f}",
                   "First issue for prototype", "Prototype and verify", "toy-safety"):
        assert needle in text, needle
    fit = resolved.seat_fit
    basic, upper, lower = limits_um(fit.post.nominal_mm, fit.post.tolerance_mm)
    assert f"Ø{size_text(basic)} {deviation_text(upper, lower)}" in text and f"{fit.post.nominal_mm / 25.4:.5f}" in text
    assert f"Ø{size_text(fit.post.precoat_mm)} ±" in text  # coated, not masked: pre-coat sizes
    assert "EN AW-6061-T6" in text  # EN 573-3 designation of 6061 beside the trade name


def test_mass_and_runout_come_from_the_data_given(resolved):
    files = render_files(resolved, STEM, SheetData(half_mass_g=12.345, runout_mm=0.034, balance_grade=2.5,
                                                   spin_rate_rpm=9000))
    doc, _ = _read(files[f"{STEM}.dxf"])
    text = _block_texts(doc)
    assert "12.3 g" in text and "0.034" in text and "G2.5" in text


def test_profile_dxf_is_one_closed_loop_of_the_upper_half(files, resolved):
    doc, auditor = _read(files[f"{STEM}-profile.dxf"])
    assert not auditor.has_errors
    msp = doc.modelspace()
    assert len(msp) == 1
    (loop,) = msp.query("LWPOLYLINE")
    assert loop.closed
    zb = resolved["rim.face_z"]
    got = shapely.Polygon([(q.x + zb, q.y) for q in ezdxf.path.make_path(loop).flattening(0.0005)])
    want = resolved.profile.polygon(0.0005)
    assert got.symmetric_difference(want).area < 1e-4 * want.area
    assert max(q.x for q in ezdxf.path.make_path(loop).flattening(0.01)) == pytest.approx(0.0, abs=1e-9)
    assert min(q.y for q in ezdxf.path.make_path(loop).flattening(0.01)) == pytest.approx(0.0, abs=1e-9)


def _text_box(text) -> shapely.Polygon:
    """The rotated box of a dimension's middle-centred MTEXT, from ezdxf's own text-extent estimate."""
    from ezdxf.tools.text_size import estimate_mtext_extents

    width, height = estimate_mtext_extents(text)
    assert text.dxf.attachment_point == 5
    c = text.dxf.insert
    angle = math.radians(text.get_rotation())
    ux, uy = math.cos(angle), math.sin(angle)
    corners = [(sx * width / 2, sy * height / 2) for sx, sy in ((-1, -1), (1, -1), (1, 1), (-1, 1))]
    return shapely.Polygon([(c.x + a * ux - b * uy, c.y + a * uy + b * ux) for a, b in corners])


def test_dimension_text_does_not_overlap(files):
    doc, _ = _read(files[f"{STEM}.dxf"])
    for layout in (doc.modelspace(), doc.blocks.get(DETAIL_BLOCK)):
        boxes = [(tags_of(dim), _text_box(t)) for dim in layout.query("DIMENSION")
                 for t in dim.get_geometry_block().query("MTEXT")]
        assert len(boxes) > 5
        for i, (ka, a) in enumerate(boxes):
            for kb, b in boxes[i + 1:]:
                assert a.intersection(b).area < 1e-9, f"{ka} text overlaps {kb}"


def test_text_and_arrow_sizes_on_paper(files, resolved):
    """3.5 mm text and 3 mm arrows on paper: dimscale × size × view scale (ISO 3098-1 / ISO 129-1)."""
    from yodraft.drawing.detail import detail_region, detail_scale  # noqa: F401
    from yodraft.drawing.sheet import view_scale

    doc, _ = _read(files[f"{STEM}.dxf"])
    style = doc.dimstyles.get("iso-section")
    scale = view_scale(resolved)
    for dim in doc.modelspace().query("DIMENSION"):
        for t in dim.get_geometry_block().query("MTEXT"):
            assert t.dxf.char_height * scale == pytest.approx(3.5, rel=1e-6)
    assert style.dxf.dimtxt == 3.5 and 2.5 <= style.dxf.dimasz <= 3.5


def test_two_builds_give_identical_bytes(resolved, files):
    again = render_files(build(load(TEMPLATE)), STEM)
    for name in files:
        assert files[name] == again[name], name
    assert files[f"{STEM}.svg"].startswith(b"<?xml") and b"<path" in files[f"{STEM}.svg"]


def test_mtext_escape_round_trip():
    from ezdxf.tools.text import plain_mtext

    raw = r"A\B {x} ; ^"
    assert plain_mtext(escape(raw)) == raw


def _mtext_box(text, m=None) -> shapely.Polygon:
    """The box a MTEXT's lines take, laid out by ezdxf with the style's font (ezdxf.tools.text_size),
    placed by its attachment point and rotation, then mapped to paper by ``m`` (a Matrix44)."""
    from ezdxf.math import Matrix44, Vec3
    from ezdxf.tools.text_size import mtext_size

    size = mtext_size(text)
    width = text.dxf.width if text.dxf.hasattr("width") and text.dxf.width > 0 else size.total_width
    height = size.total_height
    attach = text.dxf.attachment_point
    sx = (0.0, -0.5, -1.0)[(attach - 1) % 3]
    sy = (0.0, 0.5, 1.0)[(attach - 1) // 3]
    angle = math.radians(text.get_rotation())
    local = Matrix44.z_rotate(angle) @ Matrix44.translate(*text.dxf.insert)
    if m is not None:
        local = local @ m
    corners = [Vec3((sx + a) * width, (sy - b) * height) for a, b in ((0, 0), (1, 0), (1, 1), (0, 1))]
    return shapely.Polygon([(p.x, p.y) for p in local.transform_vertices(corners)])


def _sheet_texts(doc):
    """(what, box on paper, where it must lie) for every text the sheet shows: paper-space MTEXT, the
    main view's dimension texts through the viewport, the detail's dimension texts through its insert."""
    from ezdxf.math import Matrix44

    psp = doc.paperspace("sheet")
    frame = shapely.box(20.0, 10.0, 410.0, 287.0)  # ISO 5457 border of A3, see sheet.FRAME
    out = [(t.plain_text()[:30], _mtext_box(t), frame) for t in psp.query("MTEXT")]
    (vp,) = [v for v in psp.query("VIEWPORT") if v.dxf.id != 1]
    s = vp.dxf.height / vp.dxf.view_height
    c, mc = vp.dxf.center, vp.dxf.view_center_point
    to_paper = Matrix44.scale(s) @ Matrix44.translate(c.x - mc.x * s, c.y - mc.y * s, 0)
    view = shapely.box(c.x - vp.dxf.width / 2, c.y - vp.dxf.height / 2, c.x + vp.dxf.width / 2, c.y + vp.dxf.height / 2)
    for dim in doc.modelspace().query("DIMENSION"):
        for t in dim.get_geometry_block().query("MTEXT"):
            out.append((",".join(tags_of(dim)), _mtext_box(t, to_paper), view))
    (ins,) = psp.query(f"INSERT[name=='{DETAIL_BLOCK}']")
    frames = [e for e in psp.query("LWPOLYLINE[layer=='detail']")]
    detail_frame = max(frames, key=lambda e: shapely.Polygon([p[:2] for p in e.get_points("xy")]).area)
    detail_box = shapely.Polygon([p[:2] for p in detail_frame.get_points("xy")])
    for dim in doc.blocks.get(DETAIL_BLOCK).query("DIMENSION"):
        for t in dim.get_geometry_block().query("MTEXT"):
            out.append(("detail " + ",".join(tags_of(dim)), _mtext_box(t, ins.matrix44()), detail_box))
    return out


def _paper_lines(doc):
    """Every line the sheet draws in paper space (border, blocks, frames, leaders) as shapely lines."""
    psp = doc.paperspace("sheet")
    lines = []
    for e in psp.query("LINE LWPOLYLINE"):
        if e.dxftype() == "LINE":
            lines.append(shapely.LineString([(e.dxf.start.x, e.dxf.start.y), (e.dxf.end.x, e.dxf.end.y)]))
        else:
            pts = [p[:2] for p in e.get_points("xy")]
            lines.append(shapely.LineString(pts + ([pts[0]] if e.closed else [])))
    return lines


@pytest.mark.parametrize("template", ["string-trick", "undersized", "wide-heavy"])
def test_no_sheet_text_overlaps_text_or_lines_and_all_lies_inside(template):
    doc, _ = _read(render_files(build(load(TEMPLATE.parent / f"{template}.toml")), "x")["x.dxf"])
    texts = _sheet_texts(doc)
    assert len(texts) > 60
    for what, box, within in texts:
        assert within.contains(box), f"{what!r} sticks out of its border, viewport or detail frame"
    for i, (wa, a) in enumerate((w, b) for w, b, _ in texts):
        for wb, b, _ in texts[i + 1:]:
            assert a.intersection(b).area < 1e-9, f"text {wa!r} overlaps text {wb!r}"
    lines = _paper_lines(doc)
    for what, box, _ in texts:
        for line in lines:
            assert not box.intersects(line), f"text {what!r} touches a paper-space line"


def test_all_sheet_text_is_lettering_size(files):
    """ISO 3098-1 nominal size 3.5 mm for every text on paper (dimension texts through their view scale)."""
    doc, _ = _read(files[f"{STEM}.dxf"])
    psp = doc.paperspace("sheet")
    for t in psp.query("MTEXT"):
        assert t.dxf.char_height == pytest.approx(3.5), t.plain_text()[:30]
    (ins,) = psp.query(f"INSERT[name=='{DETAIL_BLOCK}']")
    for dim in doc.blocks.get(DETAIL_BLOCK).query("DIMENSION"):
        for t in dim.get_geometry_block().query("MTEXT"):
            assert t.dxf.char_height * ins.dxf.xscale == pytest.approx(3.5, rel=1e-6)
