"""The sheet a turner reads without a call: every corner of the half located by a dimension chain from datum
face B or the axis, no closed chain, a tolerance on every dimension that sets the gap; and the same for a
ring's own sheet, its corners located from its outer face (flush with face B) and the axis.

This test reads the built DXF with ezdxf alone: the half's corners come from the outline polyline in model space
(a fillet stands for the sharp corner it rounds, where its two neighbouring lines or arcs meet, the point
ISO 129-1 dimensions to), and the dimensions from the DIMENSION entities (their definition points, their
YODRAFT xdata keys, their text). Nothing of yodraft's own geometry is used to judge the drawing.

Rules checked (ISO 129-1 dimensioning; common practice for turned parts, no published source for the rest):
- every axial position of a corner is tied to datum face B (the outer face, the largest z) and every radius to
  the axis by non-auxiliary linear dimensions, each one once: an undetermined corner fails, and so does a
  dimension that closes a loop of dimensions that are not auxiliary (shown in parentheses);
- angles are never needed (every one is auxiliary or follows from the dimensions; a trigonometric chain fails
  because the corners it would locate stay undetermined);
- every arc of the outline has its radius dimensioned (or shares a dimension marked "n×"), or the sheet carries
  an "unspecified radii" note;
- every dimension tagged with a key that sets the gap, and the ring's fit diameter, carries its own tolerance;
- no outline runs along the axis (the half and its mirror draw one section, not two outlines on the axis).
"""
from __future__ import annotations

import math
import re
from pathlib import Path

import ezdxf
import pytest

from conftest import ROOT, TEMPLATES
from yodraft.cli import main

EPS = 1e-5
VALID = ROOT / "tests" / "corpus" / "valid"
DESIGNS = sorted(TEMPLATES.glob("*.toml")) + sorted(VALID.glob("*.toml"))
#: keys whose dimensions set the gap between the two bearing walls (the axial stack)
GAP_KEYS = ("bearing_seat.wall_offset", "bearing_seat.post_length")
#: keys whose dimensions carry their own tolerance: the gap's stack and the ring's press fit (on both sheets)
TOLERANCED_KEYS = GAP_KEYS + ("ring.diameter",)
APPID = "YODRAFT"


# ----------------------------------------------------------------------------- reading the DXF

def _arc_centre(p: tuple[float, float], q: tuple[float, float], bulge: float) -> tuple[tuple[float, float], float]:
    """Centre and radius of the arc from p to q with ``bulge`` = tan(sweep / 4) (DXF LWPOLYLINE)."""
    chord = math.dist(p, q)
    sweep = 4 * math.atan(bulge)
    radius = chord / (2 * math.sin(abs(sweep) / 2))
    mx, my = (p[0] + q[0]) / 2, (p[1] + q[1]) / 2
    # distance from the chord's middle to the centre, towards the left of p→q for a positive bulge
    h = radius * math.cos(abs(sweep) / 2)
    ux, uy = (q[0] - p[0]) / chord, (q[1] - p[1]) / chord
    side = 1.0 if (bulge > 0) == (abs(sweep) < math.pi) else -1.0
    return (mx - side * uy * h, my + side * ux * h), radius


def _segments(poly) -> list[dict]:  # type: ignore[no-untyped-def]
    """The pieces of one polyline (closing piece included when it is closed)."""
    pts = [(x, y, b) for x, y, _, _, b in poly.get_points("xyseb")]
    out = []
    count = len(pts) if poly.closed else len(pts) - 1
    for i in range(count):
        x, y, b = pts[i]
        nx, ny, _ = pts[(i + 1) % len(pts)]
        if math.dist((x, y), (nx, ny)) < 1e-12:
            continue
        seg = {"start": (x, y), "end": (nx, ny), "bulge": b}
        if abs(b) > 1e-12:
            seg["centre"], seg["radius"] = _arc_centre((x, y), (nx, ny), b)
        out.append(seg)
    return out


def _half_loop(polys: list) -> list[dict]:  # type: ignore[type-arg]
    """The upper half's closed loop: the pieces of the outline polylines that lie in the upper half, joined
    end to start, the gaps between them closed along the axis (where the half and its mirror meet the
    section is solid, and one outline runs round both)."""
    runs: list[list[dict]] = []
    for poly in polys:
        segs = _segments(poly)
        up = [min(s["start"][1], s["end"][1]) > -EPS and max(s["start"][1], s["end"][1]) > EPS for s in segs]
        if all(up):
            runs.append(segs)
            continue
        if not any(up):
            continue
        k = up.index(False)
        segs, up = segs[k:] + segs[:k], up[k:] + up[:k]
        run: list[dict] = []
        for seg, u in zip(segs, up):
            if u:
                run.append(seg)
            elif run:
                runs.append(run)
                run = []
        if run:
            runs.append(run)
    if len(runs) == 1 and math.dist(runs[0][0]["start"], runs[0][-1]["end"]) < EPS:
        return runs[0]
    loop: list[dict] = []
    rest = list(runs)
    run = rest.pop(0)
    while True:
        loop += run
        end = run[-1]["end"]
        if not rest:
            break
        run = min(rest, key=lambda r: math.dist(r[0]["start"], end))
        rest.remove(run)
        if math.dist(run[0]["start"], end) > EPS:
            loop.append({"start": end, "end": run[0]["start"], "bulge": 0.0})
    if math.dist(loop[-1]["end"], loop[0]["start"]) > EPS:
        loop.append({"start": loop[-1]["end"], "end": loop[0]["start"], "bulge": 0.0})
    return loop


def _direction(seg: dict, at_start: bool) -> tuple[float, float]:
    """Unit tangent of a segment at its start or end, in the direction of travel."""
    if "centre" not in seg:
        (x1, y1), (x2, y2) = seg["start"], seg["end"]
        d = math.dist(seg["start"], seg["end"])
        return ((x2 - x1) / d, (y2 - y1) / d)
    cx, cy = seg["centre"]
    px, py = seg["start"] if at_start else seg["end"]
    rx, ry = (px - cx) / seg["radius"], (py - cy) / seg["radius"]
    return (-ry, rx) if seg["bulge"] > 0 else (ry, -rx)


def _meet(a: dict, b: dict) -> tuple[float, float] | None:
    (x1, y1), (x2, y2) = a["start"], a["end"]
    (x3, y3), (x4, y4) = b["start"], b["end"]
    den = (x1 - x2) * (y3 - y4) - (y1 - y2) * (x3 - x4)
    if abs(den) < 1e-12:
        return None
    t = ((x1 - x3) * (y3 - y4) - (y1 - y3) * (x3 - x4)) / den
    return (x1 + t * (x2 - x1), y1 + t * (y2 - y1))


def _crossings(a: dict, b: dict) -> list[tuple[float, float]]:
    """Where the curves two pieces lie on (a line's infinite line, an arc's full circle) cross."""
    if "centre" not in a and "centre" not in b:
        p = _meet(a, b)
        return [] if p is None else [p]
    if "centre" not in a:
        a, b = b, a
    (cx, cy), r = a["centre"], a["radius"]
    if "centre" not in b:  # circle and line: p + t·u with |p + t·u − c| = r
        (px, py), (qx, qy) = b["start"], b["end"]
        d = math.dist((px, py), (qx, qy))
        ux, uy = (qx - px) / d, (qy - py) / d
        fx, fy = px - cx, py - cy
        half = fx * ux + fy * uy
        disc = half * half - (fx * fx + fy * fy - r * r)
        if disc < -1e-9:
            return []
        root = math.sqrt(max(disc, 0.0))
        return [(px + t * ux, py + t * uy) for t in (-half - root, -half + root)]
    (ex, ey), q = b["centre"], b["radius"]  # two circles
    d = math.dist((cx, cy), (ex, ey))
    if d < 1e-12 or d > r + q + 1e-9 or d < abs(r - q) - 1e-9:
        return []
    along = (d * d + r * r - q * q) / (2 * d)
    h = math.sqrt(max(r * r - along * along, 0.0))
    mx, my = cx + along * (ex - cx) / d, cy + along * (ey - cy) / d
    return [(mx - h * (ey - cy) / d, my + h * (ex - cx) / d), (mx + h * (ey - cy) / d, my - h * (ex - cx) / d)]


def corners_and_edges(segs: list[dict]) -> tuple[list[tuple[float, float]], list[tuple[int, int, str]], list[dict]]:
    """The half's corners, the straight edges between corners (``axial``: constant r, ``radial``: constant z,
    ``slant``), and the arcs. A fillet (an arc tangent to both its neighbours, of smaller radius than a
    neighbour that is an arc) stands for the sharp corner it rounds: where its neighbours' lines or circles
    meet, the crossing nearest the fillet."""
    n = len(segs)
    fillet = [False] * n
    for i, s in enumerate(segs):
        if "centre" in s:
            a, b = segs[i - 1], segs[(i + 1) % n]
            ta, tb = _direction(a, False), _direction(s, True)
            tc, td = _direction(s, False), _direction(b, True)
            smaller = all(s["radius"] < x["radius"] for x in (a, b) if "centre" in x)
            fillet[i] = smaller and math.dist(ta, tb) < 1e-6 and math.dist(tc, td) < 1e-6
    corners: list[tuple[float, float]] = []
    edges: list[tuple[int, int, str]] = []
    # walk the loop; every non-fillet segment end is a corner, a fillet's two ends merge into the sharp corner
    points: list[tuple[float, float]] = []
    for i, s in enumerate(segs):
        if fillet[i]:
            mid = ((s["start"][0] + s["end"][0]) / 2, (s["start"][1] + s["end"][1]) / 2)
            found = _crossings(segs[i - 1], segs[(i + 1) % n])
            if found:
                points.append(min(found, key=lambda p: math.dist(p, mid)))
                continue
            fillet[i] = False  # neighbours that never meet: the fillet's ends stay corners
        if not fillet[i - 1]:
            points.append(s["start"])
    # the edges between consecutive corners (lines, or arcs that are not fillets)
    for p in points:
        if all(math.dist(p, c) > EPS for c in corners):
            corners.append(p)
    index = {i: min(range(len(corners)), key=lambda j: math.dist(corners[j], p)) for i, p in enumerate(points)}
    for k in range(len(points)):
        a, b = corners[index[k]], corners[index[(k + 1) % len(points)]]
        kind = "radial" if abs(a[0] - b[0]) < EPS else "axial" if abs(a[1] - b[1]) < EPS else "slant"
        edges.append((index[k], index[(k + 1) % len(points)], kind))
    arcs = [s for s in segs if "centre" in s]
    return corners, edges, arcs


def _tags(dim) -> list[str]:  # type: ignore[no-untyped-def]
    if not dim.has_xdata(APPID):
        return []
    return [v for c, v in dim.get_xdata(APPID) if c == 1000]


def _text(dim) -> str:  # type: ignore[no-untyped-def]
    block = dim.get_geometry_block()
    rendered = " ".join(t.plain_text() for t in block.query("MTEXT")) if block is not None else ""
    return rendered or dim.dxf.get("text", "")


def read_sheet(path: Path) -> dict:
    """The half's outline, its dimensions and the sheet's words, read from the DXF alone."""
    doc = ezdxf.readfile(path)
    msp = doc.modelspace()
    loops = [e for e in msp.query("LWPOLYLINE") if e.dxf.layer == "outline"]
    outline_segs = [_segments(p) for p in loops]
    upper = _half_loop(loops)
    dims = list(msp.query("DIMENSION"))
    for block in doc.blocks:
        if not block.name.startswith("*"):
            dims += list(block.query("DIMENSION"))
    words = " ".join(e.plain_text() for layout in doc.layouts for e in layout.query("MTEXT"))
    words += " " + " ".join(e.dxf.text for layout in doc.layouts for e in layout.query("TEXT"))
    lines = [((e.dxf.start.x, e.dxf.start.y), (e.dxf.end.x, e.dxf.end.y)) for e in msp.query("LINE")
             if e.dxf.layer == "outline"]
    return {"segments": upper, "all_outline": outline_segs, "dims": dims, "words": words, "lines": lines}


# ----------------------------------------------------------------------------- the chain

class Levels:
    """Axial positions (z) or radii (r) as nodes of a graph whose edges are dimensions (union-find)."""

    def __init__(self, roots: list[float]) -> None:
        self.values: list[float] = []
        self.parent: list[int] = []
        for r in roots:
            self.node(r)
        self.roots = [self.node(r) for r in roots]

    def node(self, value: float) -> int:
        for i, v in enumerate(self.values):
            if abs(v - value) < EPS:
                return i
        self.values.append(value)
        self.parent.append(len(self.parent))
        return len(self.values) - 1

    def find(self, i: int) -> int:
        while self.parent[i] != i:
            self.parent[i] = self.parent[self.parent[i]]
            i = self.parent[i]
        return i

    def join(self, a: int, b: int) -> bool:
        """Join two levels; False when they were joined already (the edge closes a loop)."""
        ra, rb = self.find(a), self.find(b)
        if ra == rb:
            return False
        self.parent[ra] = rb
        return True

    def known(self, value: float) -> bool:
        i = self.node(value)
        return any(self.find(i) == self.find(r) for r in self.roots)


def analyse(sheet: dict) -> dict:
    """Undetermined corners, closed chains, untoleranced gap dimensions, unsized arcs, outline on the axis."""
    corners, edges, arcs = corners_and_edges(sheet["segments"])
    face_b = max(c[0] for c in corners)
    z = Levels([face_b])
    r = Levels([0.0])
    # the outline's own straight edges: a face (constant z) is one axial position, a cylinder one radius
    for a, b, kind in edges:
        if kind == "radial":
            z.join(z.node(corners[a][0]), z.node(corners[b][0]))
        elif kind == "axial":
            r.join(r.node(abs(corners[a][1])), r.node(abs(corners[b][1])))
    closed: list[str] = []
    untoleranced: list[str] = []
    radius_dims: list[tuple[tuple[float, float], float, str]] = []
    stray: list[str] = []
    for dim in sheet["dims"]:
        keys = _tags(dim)
        text = _text(dim)
        auxiliary = text.strip().startswith("(")
        if any(k in TOLERANCED_KEYS for k in keys) and not re.search(r"±|[+-]\d*\.?\d+\s*/\s*[+-]?\d", text):
            untoleranced.append(",".join(keys))
        kind = dim.dimtype & 7
        if kind == 4:  # radius: centre and a point on the arc
            c = (dim.dxf.defpoint.x, dim.dxf.defpoint.y)
            p = (dim.dxf.defpoint4.x, dim.dxf.defpoint4.y)
            radius_dims.append((c, math.dist(c, p), text))
            continue
        if kind != 0 or auxiliary:
            continue  # angles locate nothing here (they may be given, as auxiliary information)
        p2, p3 = dim.dxf.defpoint2, dim.dxf.defpoint3
        angle = round(dim.dxf.get("angle", 0.0)) % 180
        # what it measures is a corner's position (z) or radius: a fillet's tangent point follows from its
        # corner and radius and is no size of its own
        measured = [p2.x, p3.x] if angle == 0 else [abs(p2.y), abs(p3.y)]
        thread = re.match(r"\s*(M\d|\d+-\d+\s*UN)", text)  # a thread's major diameter is drawn thin, not outline
        values = [c[0] if angle == 0 else abs(c[1]) for c in corners]
        if not thread and not all(any(abs(m - x) < 1e-4 for x in values) for m in measured):
            stray.append(",".join(keys) or text)
        if angle == 0:
            joined = z.join(z.node(p2.x), z.node(p3.x))
        elif abs(p2.y + p3.y) < EPS and abs(p2.x - p3.x) < EPS:  # a (half-shown) diameter: 2r across the axis
            joined = r.join(r.node(abs(p2.y)), r.node(0.0))
            depth = re.search(r"↧\s*(\d+(?:\.\d+)?)", text)
            if depth:  # a hole's depth written with its diameter (ISO 129-1 depth symbol), from the face it starts at
                ends = [p2.x + float(depth.group(1)), p2.x - float(depth.group(1))]
                end = next((e for e in ends if any(abs(c[0] - e) < 1e-3 for c in corners)), ends[0])
                z.join(z.node(p2.x), z.node(next((c[0] for c in corners if abs(c[0] - end) < 1e-3), end)))
        else:
            joined = r.join(r.node(abs(p2.y)), r.node(abs(p3.y)))
        if not joined:
            closed.append(",".join(keys) or text)
    undetermined = [c for c in corners if not (z.known(c[0]) and r.known(abs(c[1])))]
    # the drill's point is the tool's own form (its angle stated on the sheet): a corner on the axis reached
    # by a slant edge from a corner that is located
    drill = []
    for a, b, kind in edges:
        for tip, other in ((a, b), (b, a)):
            if kind == "slant" and abs(corners[tip][1]) < EPS and corners[other] not in undetermined:
                drill.append(corners[tip])
    if "118°" in sheet["words"]:
        undetermined = [c for c in undetermined if c not in drill]
    unsized = []
    general_radii = re.search(r"unspecified radii", sheet["words"], re.IGNORECASE) is not None
    for arc in arcs:
        # on the half drawn or its mirror image (the section shows both halves of the turned surface)
        mirror = (arc["centre"][0], -arc["centre"][1])
        own = [t for c, rad, t in radius_dims if min(math.dist(c, arc["centre"]), math.dist(c, mirror)) < 1e-4
               and abs(rad - arc["radius"]) < 1e-4]
        shared = [t for c, rad, t in radius_dims if abs(rad - arc["radius"]) < 1e-4 and re.match(r"\(?\d+×", t)]
        if not (own or shared or general_radii):
            unsized.append((round(arc["centre"][0], 3), round(arc["centre"][1], 3), round(arc["radius"], 3)))
    on_axis = [s for segs in sheet["all_outline"] for s in segs
               if "centre" not in s and abs(s["start"][1]) < EPS and abs(s["end"][1]) < EPS]
    on_axis += [ln for ln in sheet["lines"] if abs(ln[0][1]) < EPS and abs(ln[1][1]) < EPS]
    return {"corners": corners, "undetermined": undetermined, "closed": closed, "untoleranced": untoleranced,
            "unsized": unsized, "on_axis": on_axis, "face_b": face_b, "stray": stray}


# ----------------------------------------------------------------------------- the tests

def test_reader_on_a_drawn_rectangle(tmp_path: Path) -> None:
    """The reader itself, on a DXF written here by hand: a 10 × 4 rectangle with a filleted corner, located by
    two axial and one radial dimension from the right face and the axis; an extra axial one closes a loop."""
    doc = ezdxf.new(units=ezdxf.units.MM)
    doc.appids.add(APPID)
    msp = doc.modelspace()
    # (0,0) → (10,0) → (10,4) with an R1 fillet at (10,4) → (0,4) → back; the fillet's bulge tan(90°/4)
    b = math.tan(math.radians(90) / 4)
    msp.add_lwpolyline([(0, 0, 0), (10, 0, 0), (10, 3, b), (9, 4, 0), (0, 4, 0)], format="xyb", close=True,
                       dxfattribs={"layer": "outline"})
    def dim(p1, p2, angle, keys, text="<>"):  # type: ignore[no-untyped-def]
        d = msp.add_linear_dim(base=(0, 6), p1=p1, p2=p2, angle=angle, text=text)
        d.render()
        d.dimension.set_xdata(APPID, [(1000, k) for k in keys])
    dim((0, 4), (10, 4), 0, ["a.length"])
    dim((10, -4), (10, 4), 90, ["a.diameter"], text="Ø<>")
    path = tmp_path / "r.dxf"
    doc.saveas(path)
    found = analyse(read_sheet(path))
    assert sorted(found["corners"]) == [(0, 0), (0, 4), (10, 0), (10, 4)]  # the fillet stands for (10, 4)
    assert found["undetermined"] == [] and found["closed"] == []
    assert found["unsized"] == [(9.0, 3.0, 1.0)]  # its R1 is neither dimensioned nor covered by a note
    assert len(found["on_axis"]) == 1  # the bottom edge runs along the axis
    dim((0, 0), (10, 0), 0, ["a.again"])
    doc.saveas(path)
    assert analyse(read_sheet(path))["closed"] == ["a.again"]


@pytest.fixture(scope="module")
def sheets(tmp_path_factory: pytest.TempPathFactory) -> dict[str, dict]:
    out: dict[str, dict] = {}
    for design in DESIGNS:
        folder = tmp_path_factory.mktemp(design.stem)
        assert main(["build", str(design), "-o", str(folder)]) == 0, design.name
        (dxf,) = [p for p in folder.glob("*.dxf") if not p.name.endswith(("-profile.dxf", "-ring.dxf"))]  # the half's sheet
        out[design.name] = analyse(read_sheet(dxf))
    return out


@pytest.mark.parametrize("name", [d.name for d in DESIGNS])
def test_every_corner_is_located(sheets: dict[str, dict], name: str) -> None:
    found = sheets[name]
    assert found["undetermined"] == [], f"{name}: corners with no dimension chain to datum B and the axis"


@pytest.mark.parametrize("name", [d.name for d in DESIGNS])
def test_every_size_measures_a_corner(sheets: dict[str, dict], name: str) -> None:
    # a fillet's tangent points follow from the corner it rounds and its radius (ISO 129-1 dimensions to the
    # sharp corner): a size measured to one is a second, untoleranced location of that surface
    assert sheets[name]["stray"] == [], f"{name}: sizes that measure no corner of the outline"


@pytest.mark.parametrize("name", [d.name for d in DESIGNS])
def test_no_closed_chain(sheets: dict[str, dict], name: str) -> None:
    assert sheets[name]["closed"] == [], f"{name}: dimensions that close a loop (make them auxiliary)"


@pytest.mark.parametrize("name", [d.name for d in DESIGNS])
def test_gap_dimensions_carry_tolerances(sheets: dict[str, dict], name: str) -> None:
    assert sheets[name]["untoleranced"] == []


@pytest.mark.parametrize("name", [d.name for d in DESIGNS])
def test_every_radius_is_given(sheets: dict[str, dict], name: str) -> None:
    assert sheets[name]["unsized"] == []


@pytest.mark.parametrize("name", [d.name for d in DESIGNS])
def test_no_outline_on_the_axis(sheets: dict[str, dict], name: str) -> None:
    assert sheets[name]["on_axis"] == []


# ----------------------------------------------------------------------------- the ring's own sheet

def _ring_designs() -> list[tuple[str, str]]:
    """(name, design text) of every design with a ring, and the bimetal template on each of the three seats."""
    out = [(d.name, d.read_text(encoding="utf-8")) for d in DESIGNS
           if "[features.ring]" in d.read_text(encoding="utf-8") and 'seat = "none"' not in d.read_text(encoding="utf-8")]
    base = (TEMPLATES / "bimetal-ring.toml").read_text(encoding="utf-8")
    for seat in ("outer diameter", "face"):
        out.append((f"bimetal-ring on the {seat}",
                    base.replace('seat = "cup wall"', f'seat = "{seat}"\nhold_force = "100 N"')))
    return out


RING_DESIGNS = _ring_designs()


@pytest.fixture(scope="module")
def ring_sheets(tmp_path_factory: pytest.TempPathFactory) -> dict[str, dict]:
    out: dict[str, dict] = {}
    for name, text in RING_DESIGNS:
        folder = tmp_path_factory.mktemp("ring")
        design = folder / "design.toml"
        design.write_text(text, encoding="utf-8")
        assert main(["build", str(design), "-o", str(folder / "out")]) == 0, name
        (dxf,) = (folder / "out").glob("*-ring.dxf")
        out[name] = analyse(read_sheet(dxf))
    return out


def test_the_ring_designs_are_found() -> None:
    assert "bimetal-ring.toml" in [n for n, _ in RING_DESIGNS] and len(RING_DESIGNS) >= 3


@pytest.mark.parametrize("name", [n for n, _ in RING_DESIGNS])
def test_ring_sheet_chain(ring_sheets: dict[str, dict], name: str) -> None:
    found = ring_sheets[name]
    assert len(found["corners"]) == 4  # the ring's section: two faces, two cylinders
    assert found["undetermined"] == [], f"{name}: ring corners with no chain to its outer face and the axis"
    assert found["closed"] == [], f"{name}: dimensions that close a loop"
    assert found["untoleranced"] == [], f"{name}: the fit diameter without its limits"
    assert found["unsized"] == [], f"{name}: an edge radius neither dimensioned nor in a note"
    assert found["on_axis"] == []
