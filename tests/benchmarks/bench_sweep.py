"""Benchmark: sweeps (no drawings) against one `yodraft check` of the same design.

Targets: a 2,000-variant sweep takes at most 3 × one check (issue 6), a 100,000-variant sweep at
most 30 × one check (issue 15). Both are timed as whole processes (start-up included). The runs
alternate check, sweep, check, sweep … so both see the same machine (a shared machine's speed
drifts from minute to minute); the ratio of the best runs and the median ratio of neighbouring
pairs are printed, not asserted. ``--large-runs 0`` leaves out the 100,000-variant sweep.

    PYTHONPATH=profile python tests/benchmarks/bench_sweep.py [--runs N] [--large-runs N] [--jobs N]
"""
from __future__ import annotations

import argparse
import os
import resource
import sys
import tempfile
from pathlib import Path

sys.path.insert(0, str(Path(__file__).parent))
from floor import timed  # noqa: E402

ROOT = Path(__file__).resolve().parents[2]
DESIGN = ROOT / "templates" / "string-trick.toml"
# 40 × 50 = 2,000 variants over rim width and rim thickness, some of which fail a check
VARY = ["--vary", "features.rim.band_width=6mm:10mm:40", "--vary", "features.rim.thickness=2.5mm:5mm:50"]
# 250 × 400 = 100,000 variants over the same ranges
VARY_LARGE = ["--vary", "features.rim.band_width=6mm:10mm:250", "--vary", "features.rim.thickness=2.5mm:5mm:400"]


def _cpu_timed(argv: list[str], cpu: list[float]) -> float:
    """``timed(argv)``, adding the CPU seconds the command's processes used (user and system) to ``cpu``."""
    before = resource.getrusage(resource.RUSAGE_CHILDREN)
    elapsed = timed(argv)
    after = resource.getrusage(resource.RUSAGE_CHILDREN)
    cpu.append(after.ru_utime - before.ru_utime + after.ru_stime - before.ru_stime)
    return elapsed


def _compare(label: str, vary: list[str], runs: int, jobs: list[str], target: float) -> None:
    """Time ``runs`` pairs of (check, sweep) and print the sweep's time per variant and its ratio to a check."""
    with tempfile.TemporaryDirectory() as tmp:
        csv = str(Path(tmp) / "sweep.csv")
        pairs, cpu = [], []
        for _ in range(runs):
            pairs.append((timed(["check", str(DESIGN)]), _cpu_timed(["sweep", str(DESIGN), *vary, "--csv", csv, *jobs], cpu)))
        with open(csv, encoding="utf-8") as rows_file:
            rows = sum(1 for _ in rows_file) - 1
    check = min(c for c, _ in pairs)
    sweep = min(s for _, s in pairs)
    pair_ratios = sorted(s / c for c, s in pairs)
    print(f"{label}")
    print(f"  one check:               {check:.3f} s")
    print(f"  sweep of {rows} variants: {sweep:.3f} s ({(sweep - check) / rows * 1e6:.0f} µs per variant beyond "
          f"start-up, wall clock on {os.cpu_count()} cores)")
    print(f"  CPU per variant:         {min(cpu) / rows * 1e6:.0f} µs (all processes, start-up included; load from others "
          f"inflates it less than the wall clock)")
    print(f"  ratio sweep / check:     {sweep / check:.2f} (target <= {target:g})")
    print(f"  pair ratios:             median {pair_ratios[len(pair_ratios) // 2]:.2f}, "
          f"range {pair_ratios[0]:.2f}-{pair_ratios[-1]:.2f}")


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--runs", type=int, default=5, help="pairs for the 2,000-variant sweep")
    parser.add_argument("--large-runs", type=int, default=2, help="pairs for the 100,000-variant sweep (0: none)")
    parser.add_argument("--jobs", type=int, default=None, help="sweep worker processes (default: one per core)")
    args = parser.parse_args()
    jobs = ["--jobs", str(args.jobs)] if args.jobs else []
    print(f"cores: {os.cpu_count()}, load average: {os.getloadavg()[0]:.2f}")
    _compare("2,000 variants (issue 6)", VARY, args.runs, jobs, 3)
    if args.large_runs:
        _compare("100,000 variants (issue 15)", VARY_LARGE, args.large_runs, jobs, 30)
    print(f"load average after: {os.getloadavg()[0]:.2f}")


if __name__ == "__main__":
    main()
