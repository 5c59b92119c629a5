"""The floor the start-up benchmarks compare against: start Python, import ezdxf, pint, shapely and numpy, save an
empty DXF — what any tool built on these libraries pays before it does any work."""
from __future__ import annotations

from pathlib import Path

ROOT = Path(__file__).resolve().parents[2]
TEMPLATE = ROOT / "templates" / "string-trick.toml"
#: run as ``python -c FLOOR empty.dxf``
FLOOR = (
    "import ezdxf, pint, shapely, numpy, sys\n"
    "doc = ezdxf.new('R2013', units=ezdxf.units.MM)\n"
    "doc.saveas(sys.argv[1])\n"
)
#: what the timed commands run with: yodraft from the source tree, nothing from the caller's environment
ENV = {"PYTHONPATH": str(ROOT / "profile"), "PATH": ""}
