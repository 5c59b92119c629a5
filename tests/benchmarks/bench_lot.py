"""Benchmark: a lot of 1,000,000 halves against one `yodraft check` of the same design.

Target (production-lot issue): the lot takes at most 3 × one check. Both are
timed as whole processes (start-up included), alternating check, lot, check,
lot … so both see the same machine; the ratio of the best runs and the median
ratio of neighbouring pairs are printed, not asserted.

    PYTHONPATH=profile python tests/benchmarks/bench_lot.py [--runs N] [--units N]
"""
from __future__ import annotations

import argparse
import os
import sys
from pathlib import Path

sys.path.insert(0, str(Path(__file__).parent))
from floor import timed  # noqa: E402

ROOT = Path(__file__).resolve().parents[2]
DESIGN = ROOT / "templates" / "string-trick.toml"


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--runs", type=int, default=5)
    parser.add_argument("--units", type=int, default=1_000_000)
    args = parser.parse_args()
    pairs = [(timed(["check", str(DESIGN)]), timed(["lot", str(DESIGN), "--units", str(args.units), "--json"]))
             for _ in range(args.runs)]
    check = min(c for c, _ in pairs)
    lot = min(s for _, s in pairs)
    pair_ratios = sorted(s / c for c, s in pairs)
    print(f"cores: {os.cpu_count()}, load average: {os.getloadavg()[0]:.2f}")
    print(f"one check:                 {check:.3f} s")
    print(f"lot of {args.units} halves: {lot:.3f} s")
    print(f"ratio lot / check:         {lot / check:.2f} (target <= 3)")
    print(f"pair ratios:               median {pair_ratios[len(pair_ratios) // 2]:.2f}, "
          f"range {pair_ratios[0]:.2f}-{pair_ratios[-1]:.2f}")


if __name__ == "__main__":
    main()
