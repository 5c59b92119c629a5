"""Benchmark: a sweep's mass and spin figures per variant, one variant at a time against all at once.

Run: PYTHONPATH=profile python tests/benchmarks/bench_batch_mass.py [VARIANTS]
Builds VARIANTS (default 20,000) variants of templates/string-trick.toml once (rim band width × rim
thickness), then times only the mass part: ``analysis.mass_and_spin`` for each against
``batch_mass.mass_outputs`` over them all, alternating, and prints µs per variant (range over the rounds),
the ratio, and the ratio to the 15 µs-per-variant target of the batched way (≥ 1 meets it).
"""
from __future__ import annotations

import math
import sys
import time
from pathlib import Path

from yodraft import load
from yodraft.analysis import mass_and_spin
from yodraft.batch_mass import mass_outputs
from yodraft.builder import BuildMemo, build
from yodraft.design import with_values

TEMPLATE = Path(__file__).resolve().parents[2] / "templates" / "string-trick.toml"
TARGET_US = 15.0
ROUNDS = 3


def main() -> None:
    count = int(sys.argv[1]) if len(sys.argv) > 1 else 20_000
    base = load(TEMPLATE)
    memo = BuildMemo()
    side = math.ceil(math.sqrt(count))
    start = time.perf_counter()
    resolved = []
    for n in range(count):
        i, j = divmod(n, side)
        design = with_values(base, [("features.rim.band_width", 5.0 + 4.0 * i / side),
                                    ("features.rim.thickness", 2.5 + 2.0 * j / side)])
        r = build(design, memo, verdict_only=True)
        if r.can_analyse:
            resolved.append(r)
    print(f"{len(resolved)} analysable variants of {TEMPLATE.name} built in {time.perf_counter() - start:.1f} s")
    scalar_us, batch_us = [], []
    for _ in range(ROUNDS):  # alternating: the machine is shared and noisy
        t = time.perf_counter()
        for r in resolved:
            mass_and_spin(r)
        scalar_us.append((time.perf_counter() - t) / len(resolved) * 1e6)
        t = time.perf_counter()
        mass_outputs(resolved)
        batch_us.append((time.perf_counter() - t) / len(resolved) * 1e6)
    s, b = min(scalar_us), min(batch_us)
    print(f"scalar  {s:6.1f} – {max(scalar_us):6.1f} µs per variant")
    print(f"batched {b:6.1f} – {max(batch_us):6.1f} µs per variant")
    print(f"ratio scalar / batched (best rounds): {s / b:.1f}")
    print(f"ratio to the {TARGET_US:.0f} µs target: {TARGET_US / b:.2f}")


if __name__ == "__main__":
    main()
