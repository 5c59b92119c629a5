"""Benchmark: a 2,000-variant sweep (no drawings) against one `yodraft check` of the same design.

Target (issue 6): the sweep takes at most 3 × one check. Both are timed as whole
processes (start-up included). The runs alternate check, sweep, check, sweep … so
both see the same machine (a shared machine's speed drifts from minute to minute);
the ratio of the best runs and the median ratio of neighbouring pairs are printed,
not asserted.

    PYTHONPATH=profile python tests/benchmarks/bench_sweep.py [--runs N] [--jobs N]
"""
from __future__ import annotations

import argparse
import os
import sys
import tempfile
from pathlib import Path

sys.path.insert(0, str(Path(__file__).parent))
from floor import timed  # noqa: E402

ROOT = Path(__file__).resolve().parents[2]
DESIGN = ROOT / "templates" / "string-trick.toml"
# 40 × 50 = 2,000 variants over rim width and rim thickness, some of which fail a check
VARY = ["--vary", "features.rim.band_width=6mm:10mm:40", "--vary", "features.rim.thickness=2.5mm:5mm:50"]


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--runs", type=int, default=5)
    parser.add_argument("--jobs", type=int, default=None, help="sweep worker processes (default: one per core)")
    args = parser.parse_args()
    jobs = ["--jobs", str(args.jobs)] if args.jobs else []
    with tempfile.TemporaryDirectory() as tmp:
        csv = str(Path(tmp) / "sweep.csv")
        pairs = [(timed(["check", str(DESIGN)]), timed(["sweep", str(DESIGN), *VARY, "--csv", csv, *jobs]))
                 for _ in range(args.runs)]
        rows = sum(1 for _ in open(csv, encoding="utf-8")) - 1
    check = min(c for c, _ in pairs)
    sweep = min(s for _, s in pairs)
    pair_ratios = sorted(s / c for c, s in pairs)
    print(f"cores: {os.cpu_count()}, load average: {os.getloadavg()[0]:.2f}")
    print(f"one check:               {check:.3f} s")
    print(f"sweep of {rows} variants: {sweep:.3f} s ({(sweep - check) / rows * 1000:.2f} ms per variant beyond start-up)")
    print(f"ratio sweep / check:     {sweep / check:.2f} (target <= 3)")
    print(f"pair ratios:             median {pair_ratios[len(pair_ratios) // 2]:.2f}, "
          f"range {pair_ratios[0]:.2f}-{pair_ratios[-1]:.2f}")


if __name__ == "__main__":
    main()
