"""The SVG preview: well-formed XML at true A3 scale, every sheet text present as real text, deterministic,
geometry on the page; and the writer's DXF semantics checked on small hand-made documents."""
from __future__ import annotations

import re
import tomllib
import xml.etree.ElementTree as ET
from pathlib import Path

import ezdxf
import pytest

from yodraft.builder import build
from yodraft.design import load
from yodraft.drawing.drawing import render_files, sheet_data
from yodraft.drawing.sheet import LAYOUT_NAME, PAPER, sheet_document
from yodraft.drawing.svg_sheet import sheet_svg

ROOT = Path(__file__).resolve().parents[1]
TEMPLATES = ("string-trick", "undersized", "wide-heavy")
NS = {"svg": "http://www.w3.org/2000/svg"}
A3 = (420.0, 297.0)  # ISO 216 A3 landscape, mm
_NUMBER = re.compile(r"-?\d+(?:\.\d+)?")


def _texts(root: ET.Element) -> list[str]:
    """The text lines of the SVG: a tspan with an x position starts a line, others continue it."""
    lines: list[str] = []
    for text in root.iter("{http://www.w3.org/2000/svg}text"):
        for span in text:
            if span.get("x") is not None or not lines:
                lines.append("")
            lines[-1] += "".join(span.itertext())
    return lines


@pytest.fixture(scope="module", params=TEMPLATES)
def sheet(request):
    resolved = build(load(ROOT / "templates" / f"{request.param}.toml"))
    doc = sheet_document(resolved, sheet_data(resolved))
    svg = sheet_svg(doc, LAYOUT_NAME, PAPER)
    return request.param, doc, svg, ET.fromstring(svg)


def test_a3_viewbox_in_millimetres(sheet):
    _, _, _, root = sheet
    assert root.get("viewBox") == "0 0 420 297"  # ISO 216 A3, 1 SVG unit = 1 mm
    assert (root.get("width"), root.get("height")) == ("420mm", "297mm")


def test_title_block_values_are_real_text(sheet):
    """The values a machinist reads off the title block, straight from the design file."""
    name, _, _, root = sheet
    design = tomllib.loads((ROOT / "templates" / f"{name}.toml").read_text(encoding="utf-8"))["design"]
    texts = _texts(root)
    for key in ("title", "identification", "owner", "revision", "material", "creator", "approver", "date"):
        assert design[key] in texts, key
    assert "ISO 2768-m" in texts  # general tolerance class m, ISO 2768-1


def test_every_sheet_text_is_present(sheet):
    """Each MTEXT of the paper space (and of the dimensions seen through the viewport) appears as SVG text;
    wrapped notes at least word for word."""
    _, doc, _, root = sheet
    svg_text = " ".join(_texts(root))
    svg_words = set(svg_text.split())
    sources = list(doc.paperspace(LAYOUT_NAME).query("MTEXT TEXT"))
    for dim in doc.modelspace().query("DIMENSION"):
        sources.extend(dim.get_geometry_block().query("MTEXT"))
    assert sources
    for entity in sources:
        for line in entity.plain_text().splitlines():
            assert set(line.split()) <= svg_words, line


def test_geometry_lies_on_the_page(sheet):
    _, _, svg, root = sheet
    paths = list(root.iter("{http://www.w3.org/2000/svg}path"))
    assert len(paths) > 50
    for p in paths:
        values = [float(v) for v in _NUMBER.findall(p.get("d"))]
        xs, ys = values[0::2], values[1::2]
        assert all(-1e-6 <= x <= A3[0] + 1e-6 for x in xs)
        assert all(-1e-6 <= y <= A3[1] + 1e-6 for y in ys)


def test_outline_and_narrow_widths(sheet):
    """ISO 128-2 line group 0.5: wide 0.5 mm, narrow 0.25 mm on paper (also through the 3:1 viewport)."""
    _, _, _, root = sheet
    widths = {p.get("stroke-width") for p in root.iter("{http://www.w3.org/2000/svg}path") if p.get("stroke-width")}
    assert {"0.5", "0.25"} <= widths


def test_two_renders_are_byte_identical():
    resolved = build(load(ROOT / "templates" / "string-trick.toml"))
    first = render_files(resolved, "s")["s.svg"]
    again = render_files(build(load(ROOT / "templates" / "string-trick.toml")), "s")["s.svg"]
    assert first == again
    assert first.startswith(b"<?xml")


# ------------------------------------------------------------------ writer semantics on hand-made sheets

def _doc():
    doc = ezdxf.new("R2013", units=ezdxf.units.MM)
    doc.layers.add("wide", lineweight=50)
    doc.layers.add("narrow", lineweight=25)
    psp = doc.paperspace("Layout1")
    return doc, psp


def _render(doc) -> ET.Element:
    return ET.fromstring(sheet_svg(doc, "Layout1", A3))


def test_y_is_flipped_and_lineweight_from_layer():
    # DXF paper space has y up from the lower-left corner; SVG has y down from the top (SVG 1.1, 7.3)
    doc, psp = _doc()
    psp.add_line((10, 20), (30, 20), dxfattribs={"layer": "wide"})
    (path,) = _render(doc).iter("{http://www.w3.org/2000/svg}path")
    assert path.get("d") == "M10 277L30 277"
    assert path.get("stroke-width") == "0.5"


def test_viewport_maps_model_space_at_its_scale():
    # a viewport 100 mm high showing 50 model units: scale 2:1 about the view centre
    doc, psp = _doc()
    doc.modelspace().add_line((0, 0), (10, 0), dxfattribs={"layer": "narrow"})
    psp.add_viewport(center=(200, 150), size=(120, 100), view_center_point=(5, 0), view_height=50)
    root = _render(doc)
    d = [p.get("d") for p in root.iter("{http://www.w3.org/2000/svg}path")]
    assert "M190 147L210 147" in d  # x: 200 + (0 - 5)·2, y: 297 - 150
    clip = root.find(".//svg:clipPath/svg:rect", NS)
    assert (clip.get("x"), clip.get("y"), clip.get("width"), clip.get("height")) == ("140", "97", "120", "100")


def test_mtext_paragraphs_special_characters_and_escaping():
    # MTEXT \P is a paragraph break, %%c the diameter sign (DXF reference, MTEXT); XML needs &lt; &amp;
    doc, psp = _doc()
    psp.add_mtext(r"%%c6 H7\Pa < b & c", dxfattribs={"char_height": 3.5, "attachment_point": 1,
                                                     "insert": (50, 100), "layer": "narrow"})
    root = _render(doc)
    (text,) = root.iter("{http://www.w3.org/2000/svg}text")
    spans = list(text)
    assert ["".join(s.itertext()) for s in spans] == ["Ø6 H7", "a < b & c"]
    # top-left attachment: first baseline one cap height below the insert point, 5/3 line pitch
    ys = [float(s.get("y")) for s in spans]
    assert ys[0] == pytest.approx(3.5, abs=1e-3)
    assert ys[1] - ys[0] == pytest.approx(3.5 * 5 / 3, abs=2e-3)  # "3 on 5" line spacing


def test_long_dash_dot_line_type_is_dashed_on_paper():
    # ISO 128-2 type 04 long-dash dotted, pattern in paper mm (entity line type scale 1)
    doc, psp = _doc()
    doc.linetypes.add("ldd", pattern=[15.0, 12.0, -1.5, 0.0, -1.5])
    psp.add_line((10, 10), (100, 10), dxfattribs={"layer": "narrow", "linetype": "ldd"})
    (path,) = _render(doc).iter("{http://www.w3.org/2000/svg}path")
    assert path.get("stroke-dasharray") == "12,1.5,0,1.5"


def test_hatch_pattern_lines_are_clipped_to_the_boundary():
    doc, psp = _doc()
    hatch = psp.add_hatch(dxfattribs={"layer": "narrow"})
    hatch.paths.add_polyline_path([(0, 0), (10, 0), (10, 10), (0, 10)], is_closed=True)
    hatch.set_pattern_fill("ANSI31", scale=1.0)
    root = _render(doc)
    hatched = [p for p in root.iter("{http://www.w3.org/2000/svg}path") if p.get("clip-path")]
    assert len(hatched) == 1
    assert root.find(".//svg:clipPath/svg:path", NS) is not None


def test_font_metrics_agree_with_fonttools():
    """Our table reader against fontTools' full parse (reference library) for the sheet's text font."""
    from ezdxf.fonts import fonts

    from yodraft.drawing.ttf_metrics import from_tables

    face = fonts.get_font_face("DejaVuSans.ttf")
    if face.filename.lower() != "dejavusans.ttf":
        pytest.skip("DejaVu Sans is not installed")
    from fontTools.ttLib import TTFont

    shared = fonts.font_manager.get_ttf_font(face.filename)
    ours = from_tables(lambda tag: shared.reader[tag], face.family)
    ttf = TTFont(shared.reader.file.name)  # a private full parse: leave the shared font untouched
    cmap, hmtx, glyf = ttf.getBestCmap(), ttf["hmtx"], ttf["glyf"]
    cap = glyf[cmap[ord("A")]].yMax
    assert ours.em_per_cap == pytest.approx(ttf["head"].unitsPerEm / cap)
    assert ours.x_height == pytest.approx(glyf[cmap[ord("x")]].yMax / cap)
    assert ours.descender == pytest.approx(-glyf[cmap[ord("p")]].yMin / cap)
    for ch in "AZaz09 .,:;()[]-+/Ø±°µ…×":
        assert ours.advance(ch) == pytest.approx(hmtx[cmap[ord(ch)]][0] / cap), ch


def test_preview_unchanged_after_the_shared_font_was_parsed():
    """Regression: once ezdxf had parsed the font's glyph table, re-compiled tables no longer matched
    the stored 'loca' and the text came out a tenth of its size."""
    from ezdxf.fonts import fonts

    resolved = build(load(ROOT / "templates" / "string-trick.toml"))
    before = render_files(resolved, "s")["s.svg"]
    ttf = fonts.font_manager.get_ttf_font(fonts.get_font_face("DejaVuSans.ttf").filename)
    glyf = ttf["glyf"]
    for name in ttf.getGlyphOrder()[:64]:
        glyf[name]
    assert render_files(resolved, "s")["s.svg"] == before
