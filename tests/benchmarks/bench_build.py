"""Prints how long `yodraft build` of a template takes (sheet DXF, profile DXF, SVG, PDF, build record) against
the floor: a script that only starts Python, imports ezdxf, pint, shapely and numpy and saves an empty DXF
(target: ratio ≤ 1.3). Runs alternate so both see the same machine load. A printed ratio, not a test."""
from __future__ import annotations

import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

sys.path.insert(0, str(Path(__file__).parent))
from floor import ENV, FLOOR as BASELINE, TEMPLATE  # noqa: E402


def _time(cmd: list[str], runs: int) -> float:
    times = []
    for _ in range(runs):
        start = time.perf_counter()
        subprocess.run(cmd, check=True, capture_output=True, env=ENV)
        times.append(time.perf_counter() - start)
    return statistics.median(times)


def main(runs: int = 7) -> None:
    bases, builds = [], []
    with tempfile.TemporaryDirectory() as tmp:
        for i in range(runs):
            bases.append(_time([sys.executable, "-c", BASELINE, str(Path(tmp) / "empty.dxf")], 1))
            builds.append(_time([sys.executable, "-m", "yodraft", "build", str(TEMPLATE), "-o", tmp, "--force"], 1))
    base, build = statistics.median(bases), statistics.median(builds)
    pairs = statistics.median(b / a for a, b in zip(bases, builds))
    print(f"floor (start Python, import ezdxf, pint, shapely, numpy; save empty DXF): {base:.3f} s")
    print(f"yodraft build {TEMPLATE.name}: {build:.3f} s")
    print(f"ratio: {build / base:.2f} (median of pair ratios {pairs:.2f}; target <= 1.3)")


if __name__ == "__main__":
    main()
