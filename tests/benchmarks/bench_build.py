"""Prints how long `yodraft build` of a template takes against a script that only imports ezdxf, pint and
shapely and saves an empty DXF (target: ratio ≤ 1.5). A printed ratio, not a test."""
from __future__ import annotations

import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parents[2]
TEMPLATE = ROOT / "templates" / "string-trick.toml"
BASELINE = (
    "import ezdxf, pint, shapely, sys\n"
    "doc = ezdxf.new('R2013', units=ezdxf.units.MM)\n"
    "doc.saveas(sys.argv[1])\n"
)


def _time(cmd: list[str], runs: int) -> float:
    times = []
    for _ in range(runs):
        start = time.perf_counter()
        subprocess.run(cmd, check=True, capture_output=True, env={"PYTHONPATH": str(ROOT / "profile"), "PATH": ""})
        times.append(time.perf_counter() - start)
    return statistics.median(times)


def main(runs: int = 5) -> None:
    with tempfile.TemporaryDirectory() as tmp:
        base = _time([sys.executable, "-c", BASELINE, str(Path(tmp) / "empty.dxf")], runs)
        build = _time([sys.executable, "-m", "yodraft", "build", str(TEMPLATE), "-o", tmp], runs)
    print(f"baseline (import ezdxf, pint, shapely; save empty DXF): {base:.3f} s")
    print(f"yodraft build {TEMPLATE.name}: {build:.3f} s")
    print(f"ratio: {build / base:.2f} (target <= 1.5)")


if __name__ == "__main__":
    main()
