"""Benchmark: `yodraft solve` against one `yodraft check` of the same design, each a fresh process,
and mass properties of a template's own profile in evaluations per second.

Run: python tests/benchmarks/bench_solve.py   (with yodraft installed or PYTHONPATH=profile)
Targets: solve ≤ 2 × check (ratio printed); body_props ≥ 5,000 evaluations/s.
"""
from __future__ import annotations

import os
import shutil
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parents[2]
TEMPLATE = ROOT / "templates" / "string-trick.toml"


def _run(args: list[str]) -> float:
    env = dict(os.environ, PYTHONPATH=str(ROOT / "profile"))
    start = time.perf_counter()
    subprocess.run([sys.executable, "-m", "yodraft", *args], check=True, env=env, stdout=subprocess.DEVNULL)
    return time.perf_counter() - start


def main(repeats: int = 5) -> None:
    checks, solves = [], []
    with tempfile.TemporaryDirectory() as tmp:
        for i in range(repeats):
            checks.append(_run(["check", str(TEMPLATE)]))
            source = Path(tmp) / f"d{i}.toml"
            shutil.copy(TEMPLATE, source)
            solves.append(_run(["solve", str(source), "--target", "mass=66g", "--vary", "features.rim.thickness"]))
    check, solve = statistics.median(checks), statistics.median(solves)
    print(f"check {check * 1000:.0f} ms, solve {solve * 1000:.0f} ms (medians of {repeats})")
    print(f"solve / check = {solve / check:.2f}  (target ≤ 2.00)")

    sys.path.insert(0, str(ROOT / "profile"))
    import yodraft
    from yodraft.massprops import body_props

    profile = yodraft.build(yodraft.load(TEMPLATE)).profile
    n, start = 0, time.perf_counter()
    while time.perf_counter() - start < 1.0:
        body_props(profile, 2.70)
        n += 1
    rate = n / (time.perf_counter() - start)
    print(f"body_props on the template: {rate:,.0f} evaluations/s; ratio to 5,000/s target = {rate / 5000:.2f}")


if __name__ == "__main__":
    main()
