"""The SVG preview: well-formed XML at the sheet's true size, every DXF text present as real text at the same
place and size, the same line widths and dash lengths on paper, deterministic; rendered to PNG when a
rasteriser is installed, the text regions are compared with the DXF's text boxes."""
from __future__ import annotations

import io
import re
import shutil
import subprocess
import tomllib
import xml.etree.ElementTree as ET
from pathlib import Path

import ezdxf
import pytest

from yodraft.builder import build
from yodraft.design import load
from yodraft.drawing.drawing import render_files
from yodraft.drawing.sheetdata import Stroke
from yodraft.drawing.svg_sheet import dash_array

ROOT = Path(__file__).resolve().parents[1]
TEMPLATES = ("string-trick", "undersized", "wide-heavy")
SVG = "{http://www.w3.org/2000/svg}"
_NUMBER = re.compile(r"-?\d+(?:\.\d+)?")


def _texts(root: ET.Element) -> list[str]:
    return ["".join(t.itertext()) for t in root.iter(f"{SVG}text")]


@pytest.fixture(scope="module", params=TEMPLATES)
def sheet(request):
    resolved = build(load(ROOT / "templates" / f"{request.param}.toml"))
    files = render_files(resolved, "x")
    doc = ezdxf.read(io.StringIO(files["x.dxf"].decode("utf-8")))
    return request.param, doc, files["x.svg"], ET.fromstring(files["x.svg"])


def test_viewbox_in_millimetres(sheet):
    _, doc, _, root = sheet
    w, h = doc.header["$PEXTMAX"][0], doc.header["$PEXTMAX"][1]
    assert (w, h) in {(420.0, 297.0), (594.0, 420.0)}  # ISO 216 A3 or A2 landscape, 1 SVG unit = 1 mm
    assert root.get("viewBox") == f"0 0 {w:g} {h:g}"
    assert (root.get("width"), root.get("height")) == (f"{w:g}mm", f"{h:g}mm")


def test_title_block_values_are_real_text(sheet):
    """The values a machinist reads off the title block, straight from the design file."""
    name, _, _, root = sheet
    design = tomllib.loads((ROOT / "templates" / f"{name}.toml").read_text(encoding="utf-8"))["design"]
    texts = _texts(root)
    for key in ("title", "identification", "owner", "revision", "material", "creator", "approver", "date"):
        assert design[key] in texts, key
    assert "ISO 2768-m" in texts  # general tolerance class m, ISO 2768-1


def test_every_dxf_text_is_in_the_svg(sheet):
    _, doc, _, root = sheet
    texts = set(_texts(root))
    sources = list(doc.paperspace("sheet").query("TEXT"))
    for layout in (doc.modelspace(), doc.blocks.get("seat-detail")):
        for dim in layout.query("DIMENSION"):
            sources.extend(dim.get_geometry_block().query("TEXT"))
    assert len(sources) > 60
    for e in sources:
        assert e.plain_text() in texts, e.plain_text()


def test_texts_sit_where_the_dxf_puts_them(sheet):
    """Each paper-space TEXT's baseline start and size equal the SVG text's (y flipped: SVG 1.1, 7.3)."""
    _, doc, _, root = sheet
    h = doc.header["$PEXTMAX"][1]
    svg: dict[str, list[tuple[float, float]]] = {}
    for t in root.iter(f"{SVG}text"):
        x, y = (float(v) for v in re.match(r"translate\(([-\d.]+) ([-\d.]+)\)", t.get("transform")).groups())
        svg.setdefault("".join(t.itertext()), []).append((x, h - y))
    for e in doc.paperspace("sheet").query("TEXT"):
        spots = svg.get(e.plain_text(), [])
        assert any(abs(x - e.dxf.insert.x) < 2e-3 and abs(y - e.dxf.insert.y) < 2e-3 for x, y in spots), e.plain_text()


def test_geometry_lies_on_the_page(sheet):
    _, doc, _, root = sheet
    w, h = doc.header["$PEXTMAX"][0], doc.header["$PEXTMAX"][1]
    paths = [p for p in root.iter(f"{SVG}path") if "A" not in p.get("d")]
    assert len(paths) > 50
    for p in paths:
        values = [float(v) for v in _NUMBER.findall(p.get("d"))]
        xs, ys = values[0::2], values[1::2]
        assert all(-1e-6 <= x <= w + 1e-6 for x in xs)
        assert all(-1e-6 <= y <= h + 1e-6 for y in ys)


def test_outline_and_narrow_widths(sheet):
    """ISO 128-2 line group 0.5: wide 0.5 mm, narrow 0.25 mm on paper (also for the views at their scales)."""
    _, _, _, root = sheet
    widths = {p.get("stroke-width") for p in root.iter(f"{SVG}path") if p.get("stroke-width")}
    assert {"0.5", "0.25"} <= widths


def test_dash_lengths_are_the_dxf_line_type_on_paper(sheet):
    """The centre lines' dashes in the SVG are the DXF line type's pattern in paper millimetres
    ($PSLTSCALE = 1; the centre lines are drawn in paper space)."""
    _, doc, _, root = sheet
    pattern = [t.value for t in doc.linetypes.get("long-dash-dot").pattern_tags.tags if t.code == 49]
    dashes = {p.get("stroke-dasharray") for p in root.iter(f"{SVG}path") if p.get("stroke-dasharray")}
    assert ",".join(f"{abs(x):g}" for x in pattern) in dashes
    assert doc.header["$PSLTSCALE"] == 1
    assert doc.paperspace("sheet").query("LINE[layer=='centre']")


def test_svg_names_a_common_font_with_fallbacks(sheet):
    _, doc, svg, _ = sheet
    assert b'font-family="DejaVu Sans, Bitstream Vera Sans, sans-serif"' in svg
    assert doc.styles.get("iso-lettering").dxf.font == "DejaVuSans.ttf"


def test_two_renders_are_byte_identical():
    resolved = build(load(ROOT / "templates" / "string-trick.toml"))
    first = render_files(resolved, "s")["s.svg"]
    again = render_files(build(load(ROOT / "templates" / "string-trick.toml")), "s")["s.svg"]
    assert first == again
    assert first.startswith(b"<?xml")


def test_dash_array_alternates_dash_and_gap():
    # SVG 1.1 stroke-dasharray alternates dash and gap; a zero-length dash with round caps draws the dot
    assert dash_array(Stroke(((0, 0), (1, 0)), "centre")) == [12.0, 1.5, 0.0, 1.5]
    assert dash_array(Stroke(((0, 0), (1, 0)), "outline")) == []


def _rasteriser() -> str | None:
    return shutil.which("resvg")


@pytest.mark.skipif(_rasteriser() is None, reason="no SVG rasteriser (resvg) installed")
def test_rendered_png_has_ink_in_the_dxf_text_boxes(tmp_path):
    """Rendered by an outside rasteriser, the ink of each title-block value lies inside the box ezdxf
    measures for the DXF text, and a ring just outside the box is clear."""
    Image = pytest.importorskip("PIL.Image")
    from ezdxf.tools.text_size import text_size

    files = render_files(build(load(ROOT / "templates" / "string-trick.toml")), "x")
    (tmp_path / "x.svg").write_bytes(files["x.svg"])
    found = subprocess.run(["fc-match", "-f", "%{file}", "DejaVu Sans"], capture_output=True, text=True).stdout
    px = 10  # pixels per mm
    doc = ezdxf.read(io.StringIO(files["x.dxf"].decode("utf-8")))
    w, h = doc.header["$PEXTMAX"][0], doc.header["$PEXTMAX"][1]
    subprocess.run([_rasteriser(), "--use-fonts-dir", str(Path(found).parent), "-w", str(int(w * px)),
                    str(tmp_path / "x.svg"), str(tmp_path / "x.png")], check=True, capture_output=True)
    img = Image.open(tmp_path / "x.png").convert("L")
    design = tomllib.loads((ROOT / "templates" / "string-trick.toml").read_text(encoding="utf-8"))["design"]

    def ink(a: float, b: float, c: float, d: float) -> int:
        box = (int(a * px), int((h - d) * px), int(c * px), int((h - b) * px))
        return sum(1 for v in img.crop(box).getdata() if v < 128)

    checked = 0
    for e in doc.paperspace("sheet").query("TEXT"):
        if e.plain_text() not in (design["title"], design["owner"], design["identification"], design["date"]):
            continue
        size = text_size(e)
        x0, y0 = e.dxf.insert.x, e.dxf.insert.y - (size.total_height - size.cap_height)
        x1, y1 = e.dxf.insert.x + size.width, e.dxf.insert.y + size.cap_height
        inside = ink(x0, y0, x1, y1)
        ring = ink(x0 - 0.6, y0 - 0.6, x1 + 0.6, y1 + 0.6) - ink(x0 - 0.1, y0 - 0.1, x1 + 0.1, y1 + 0.1)
        assert inside > 0.05 * (x1 - x0) * (y1 - y0) * px * px, e.plain_text()
        assert ring <= 0.01 * ((x1 - x0 + 1.2) * (y1 - y0 + 1.2) - (x1 - x0) * (y1 - y0)) * px * px, e.plain_text()
        checked += 1
    assert checked >= 4  # the date stands in the title block and in the revision row


def test_font_metrics_agree_with_fonttools():
    """Our table reader against fontTools' full parse (reference library) for the sheet's text font."""
    from fontTools.ttLib import TTFont

    from yodraft.drawing.lettering import lettering

    font = lettering()
    if font.path is None:
        pytest.skip("no TrueType file for the sheet's font")
    ours = font.metrics
    ttf = TTFont(str(font.path))
    cmap, hmtx, glyf = ttf.getBestCmap(), ttf["hmtx"], ttf["glyf"]
    cap = glyf[cmap[ord("A")]].yMax
    assert ours.em_per_cap == pytest.approx(ttf["head"].unitsPerEm / cap)
    assert ours.x_height == pytest.approx(glyf[cmap[ord("x")]].yMax / cap)
    assert ours.descender == pytest.approx(-glyf[cmap[ord("p")]].yMin / cap)
    for ch in "AZaz09 .,:;()[]-+/Ø±°µ…×":
        assert ours.advance(ch) == pytest.approx(hmtx[cmap[ord(ch)]][0] / cap), ch
