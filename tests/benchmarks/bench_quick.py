"""Prints how long the quick commands take — `check`, `fit`, `keys`, `templates`, `--version` — against the floor:
a script that only starts Python, imports ezdxf, pint, shapely and numpy and saves an empty DXF (target for
`check`: ratio ≤ 0.5). Also lists which of ezdxf, numpy and shapely each command imported (none of them should
import ezdxf; `fit`, `keys`, `templates` and `--version` neither numpy nor shapely). Runs alternate so all see
the same machine load. Printed ratios, not a test.

    python tests/benchmarks/bench_quick.py [--runs N]
"""
from __future__ import annotations

import argparse
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

sys.path.insert(0, str(Path(__file__).parent))
from floor import ENV, FLOOR as BASELINE, TEMPLATE  # noqa: E402
COMMANDS = {
    "check": ["check", str(TEMPLATE)],
    "fit": ["fit", "6 H7/g6"],
    "keys": ["keys"],
    "templates": ["templates"],
    "--version": ["--version"],
}
#: runs the command in-process, then names the heavy modules it loaded
PROBE = ("import sys\nfrom yodraft.cli import main\ncode = main(sys.argv[1:])\n"
         "print('loaded:', ' '.join(m for m in ('ezdxf', 'numpy', 'shapely') if m in sys.modules), file=sys.stderr)\n")


def _once(cmd: list[str]) -> float:
    start = time.perf_counter()
    subprocess.run(cmd, capture_output=True, env=ENV)
    return time.perf_counter() - start


def main() -> None:
    parser = argparse.ArgumentParser()
    parser.add_argument("--runs", type=int, default=7)
    runs = parser.parse_args().runs
    times: dict[str, list[float]] = {"floor": [], **{name: [] for name in COMMANDS}}
    with tempfile.TemporaryDirectory() as tmp:
        for _ in range(runs):
            times["floor"].append(_once([sys.executable, "-c", BASELINE, str(Path(tmp) / "empty.dxf")]))
            for name, args in COMMANDS.items():
                times[name].append(_once([sys.executable, "-m", "yodraft", *args]))
    floor = statistics.median(times["floor"])
    print(f"floor (start Python, import ezdxf, pint, shapely, numpy; save empty DXF): {floor:.3f} s")
    for name, args in COMMANDS.items():
        t = statistics.median(times[name])
        pairs = statistics.median(c / f for f, c in zip(times["floor"], times[name]))
        probe = subprocess.run([sys.executable, "-c", PROBE, *args], capture_output=True, text=True, env=ENV)
        loaded = next((line for line in probe.stderr.splitlines() if line.startswith("loaded:")), "loaded: ?")
        target = "; target <= 0.5" if name == "check" else ""
        print(f"yodraft {name:<10} {t:.3f} s  ratio {t / floor:.2f} (median of pairs {pairs:.2f}{target})  {loaded}")


if __name__ == "__main__":
    main()
