"""Benchmark: body_props evaluations per second on a representative half (~30 lines, ~8 arcs).

Run: PYTHONPATH=profile python tests/benchmarks/bench_massprops.py
Prints the rate and its ratio to the 5,000 evaluations/s target (ratio ≥ 1 meets it).
"""
from __future__ import annotations

import time

from yodraft.geometry import FilletVertex, Line, Profile, fillet_loop
from yodraft.massprops import body_props, section_integrals

TARGET_PER_S = 5_000.0


def representative_half() -> Profile:
    """An invented half: bore, stepped gap face with a pad groove, catch wall, rim, cup, vent steps."""
    pts = [
        ((1.5, 4.0), 0.0), ((12.0, 4.0), 0.5), ((12.0, 12.0), 0.0), ((12.5, 12.0), 0.0),
        ((12.5, 14.0), 0.0), ((12.0, 14.0), 0.0), ((12.0, 19.0), 2.0), ((21.0, 24.0), 1.0),
        ((21.0, 28.0), 1.5), ((16.0, 28.0), 3.0), ((4.0, 14.0), 1.0), ((1.5, 13.0), 0.3),
        ((1.5, 11.0), 0.0), ((2.5, 11.0), 0.2), ((2.5, 9.0), 0.2), ((1.5, 9.0), 0.0),
    ]
    loop, misfits = fillet_loop([FilletVertex(p, r) for p, r in pts])
    assert not misfits
    # split the long straight edges so the loop carries about 30 lines, as a detailed design would
    segs = list(loop.segments)
    while sum(1 for s in segs if isinstance(s, Line)) < 30:
        i = max(range(len(segs)), key=lambda k: segs[k].length if isinstance(segs[k], Line) else 0.0)
        s = segs[i]
        mid = ((s.start[0] + s.end[0]) / 2, (s.start[1] + s.end[1]) / 2)
        segs[i : i + 1] = [Line(s.start, mid), Line(mid, s.end)]
    return Profile(tuple(segs))


def rate(fn, seconds: float = 1.0) -> float:
    n, start = 0, time.perf_counter()
    while True:
        for _ in range(100):
            fn()
        n += 100
        elapsed = time.perf_counter() - start
        if elapsed >= seconds:
            return n / elapsed


def main() -> None:
    half = representative_half()
    n_lines = sum(1 for s in half.segments if isinstance(s, Line))
    n_arcs = len(half.segments) - n_lines
    print(f"representative half: {n_lines} lines, {n_arcs} arcs")
    for name, fn in (
        ("section_integrals", lambda: section_integrals(half)),
        ("body_props", lambda: body_props(half, 2.70)),
    ):
        per_s = rate(fn)
        print(f"{name:18s} {per_s:10.0f} /s   ratio to {TARGET_PER_S:.0f}/s target: {per_s / TARGET_PER_S:.2f}")


if __name__ == "__main__":
    main()
