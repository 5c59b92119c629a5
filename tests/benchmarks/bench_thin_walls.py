"""Benchmark: the batched thin-wall verdict of a sweep's chunks against ``least_wall`` loop by loop.

A 2,000-variant sweep of string-trick (rim band width × rim thickness, one worker) is run with
``checks.thin_walls`` recording what each chunk asks; those chunks are then answered again, in the
sweep's order (so what carries over from chunk to chunk does so as in a sweep), by ``thin_walls`` and
by ``least_wall`` on each loop. The verdicts must agree; the time per variant of each and their ratio
are printed (best of alternating runs, and the range), not asserted.

    PYTHONPATH=profile python tests/benchmarks/bench_thin_walls.py [--runs N] [--design NAME]
"""
from __future__ import annotations

import argparse
import os
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parents[2]
VARY = ["--vary", "features.rim.band_width=6mm:10mm:40", "--vary", "features.rim.thickness=2.5mm:5mm:50"]


first: list[float] = []  # seconds of each chunk's call within the sweep


def _record(design: Path) -> list[tuple[list, list[float]]]:
    """The (loops, limits) of every chunk a one-worker sweep of ``design`` hands to ``thin_walls``."""
    from yodraft import checks, cli
    asked: list[tuple[list, list[float]]] = []
    plain = checks.thin_walls

    def recording(profiles, below):
        asked.append((list(profiles), list(below)))
        t = time.perf_counter()
        out = plain(profiles, below)
        first.append(time.perf_counter() - t)
        return out

    checks.thin_walls = recording
    try:
        with tempfile.TemporaryDirectory() as tmp:
            cli.main(["sweep", str(design), *VARY, "--jobs", "1", "--csv", str(Path(tmp) / "s.csv")])
    finally:
        checks.thin_walls = plain
    return asked


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--runs", type=int, default=5)
    parser.add_argument("--design", default="string-trick")
    args = parser.parse_args()
    from yodraft.checks import least_wall, thin_walls
    asked = _record(ROOT / "templates" / f"{args.design}.toml")
    variants = sum(len(p) for p, _ in asked)
    batch, plain = [], []
    for _ in range(args.runs):
        t = time.perf_counter()
        got = [v for profiles, below in asked for v in thin_walls(profiles, below)]
        batch.append(time.perf_counter() - t)
        t = time.perf_counter()
        want = []
        for profiles, below in asked:
            for p, limit in zip(profiles, below):
                wall = least_wall(p)
                want.append(wall is not None and wall[0] < limit)
        plain.append(time.perf_counter() - t)
        assert got == want, "thin_walls disagrees with least_wall"
    print(f"cores: {os.cpu_count()}, load average: {os.getloadavg()[0]:.2f}")
    print(f"{args.design}: {variants} variants in {len(asked)} chunks, {sum(want)} too thin")
    print(f"  thin_walls: {min(batch) / variants * 1e6:.1f} µs per variant (range "
          f"{min(batch) / variants * 1e6:.1f}-{max(batch) / variants * 1e6:.1f})")
    print(f"  thin_walls within the sweep (first call per chunk): {sum(first) / variants * 1e6:.1f} µs per variant")
    print(f"  least_wall: {min(plain) / variants * 1e6:.1f} µs per variant (range "
          f"{min(plain) / variants * 1e6:.1f}-{max(plain) / variants * 1e6:.1f})")
    print(f"  ratio least_wall / thin_walls: {min(plain) / min(batch):.1f}")


if __name__ == "__main__":
    main()
