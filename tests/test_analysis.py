"""Mass of a template against the outline drawn in its DXF, and the assembly."""
from __future__ import annotations

import math
from pathlib import Path

import ezdxf
import pytest
import shapely

import yodraft
from conftest import TEMPLATES
from yodraft.analysis import analyse
from yodraft.cli import main


def test_mass_equals_pappus_on_the_drawn_outline(tmp_path: Path) -> None:
    assert main(["build", str(TEMPLATES / "string-trick.toml"), "-o", str(tmp_path)]) == 0
    doc = ezdxf.readfile(tmp_path / "larchmere-ls56-A.dxf")
    # the section's one outline runs round the half and its mirror; the half is what lies above the axis
    (outline,) = doc.modelspace().query("LWPOLYLINE[layer=='outline']")
    section = shapely.Polygon([(v.x, v.y) for v in ezdxf.path.make_path(outline).flattening(0.0005)])
    poly = section.intersection(shapely.box(-1e3, 0.0, 1e3, 1e3))
    resolved = yodraft.build(yodraft.load(TEMPLATES / "string-trick.toml"))
    density = resolved["material.density_g_cm3"] * 1e-3
    # Pappus's centroid theorem: V = 2π ȳ A, so m = 2π ρ ∫ r dA
    expected = 2 * math.pi * density * poly.area * poly.centroid.y
    assert analyse(resolved).half.mass_g == pytest.approx(expected, rel=1e-3)


def test_assembly_adds_the_small_parts() -> None:
    resolved = yodraft.build(yodraft.load(TEMPLATES / "string-trick.toml"))
    a = analyse(resolved)
    assert a.assembly.total_g == pytest.approx(sum(line.mass_total_g for line in a.assembly.budget), rel=1e-12)
    assert a.assembly.total_g > 2 * a.half.mass_g
    assert a.assembly.izz_g_mm2 > 2 * a.half.izz_g_mm2
