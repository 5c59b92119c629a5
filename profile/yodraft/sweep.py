"""Sweeps: a grid over one or two design parameters, each variant resolved and checked (no drawings).

A variant is the base design with the varied keys replaced; failed variants are
kept with the checks that failed. The outputs (gap, clearances, mass, Izz, rim
share) carry the names and values of the ``check --json`` summary, worked out
without the rest of it. Large grids are split into chunks run across processes,
each keeping a BuildMemo so the features a varied key does not reach are
resolved once. A chunk's variants are composed one by one, then judged and
weighed together: whether each loop crosses itself and whether a wall is too
thin are answered for all its loops at once, and so are the mass figures
(``batch_mass``), each exactly what building the variant alone gives. Each
variant's CSV line is written where it ran, so a parallel sweep's CSV is only
joined at the end.

>>> from yodraft import loads, EXAMPLE
>>> axis = parse_vary("rim.band_width=6mm:8mm:3", loads(EXAMPLE))
>>> axis.key, [round(v, 3) for v in axis.values()]
('features.rim.band_width', [6.0, 7.0, 8.0])
"""
from __future__ import annotations

import gc
import math
import os
import re
import sys
from collections.abc import Callable, Mapping, Sequence
from concurrent.futures import ProcessPoolExecutor
from dataclasses import dataclass, field
from typing import TYPE_CHECKING, Any

from .builder import BuildMemo, compose, judge_many
from .design import with_values
from .errors import DesignInputError, YodraftError
from .units import DISPLAY_UNITS

if TYPE_CHECKING:  # pragma: no cover
    from .builder import Resolved
    from .design import Design
    from .params import ParamSpec

__all__ = ["Axis", "Variant", "SweepResult", "parse_vary", "sweep", "run_variant", "run_variants", "csv_text",
           "OUTPUT_KEYS", "MAX_VARIANTS"]

MAX_VARIANTS = 100_000
#: summary keys a sweep reports when present, in column order
OUTPUT_KEYS = ("profile.gap_mm", "profile.outer_diameter_mm", "profile.width_mm", "bearing_seat.clearance_min_mm",
               "bearing_seat.clearance_max_mm", "mass.half_g", "mass.total_g", "mass.izz_g_mm2", "mass.ixx_g_mm2",
               "spin.rim_share")
_VARY = re.compile(r"^\s*([A-Za-z0-9_.\[\]]+)\s*=\s*([^:]+):([^:]+):\s*([^:]*?)\s*$")


@dataclass(frozen=True)
class Axis:
    """One varied parameter: design key path, kind, and ``count`` values from ``start`` to ``stop`` (base units)."""

    key: str
    kind: str
    start: float
    stop: float
    count: int
    #: the key's spec: a grid value it would refuse as too fine (``ParamSpec.too_fine``) is no design a file
    #: can hold, and its variant fails as an input
    spec: "ParamSpec | None" = field(default=None, compare=False, repr=False)

    def values(self) -> list[float]:
        """The grid values, evenly spaced, both ends included."""
        step = (self.stop - self.start) / (self.count - 1)
        return [self.start + i * step for i in range(self.count - 1)] + [self.stop]

    @property
    def unit(self) -> str:
        return DISPLAY_UNITS[self.kind][1]

    @property
    def column(self) -> str:
        """CSV column name: the key with its unit suffix, e.g. ``features.rim.band_width_mm``."""
        return self.key + DISPLAY_UNITS[self.kind][2]

    def shown(self, value: float) -> float:
        """A base-unit value in the unit of the column (degrees for angles)."""
        return value / DISPLAY_UNITS[self.kind][0]


@dataclass(frozen=True)
class Variant:
    """One grid point: the varied values (column units), whether every check passed, which failed, the outputs."""

    index: int
    inputs: tuple[float, ...]
    ok: bool
    failed: tuple[str, ...]
    outputs: Mapping[str, float | None]
    #: its CSV line with a column for every OUTPUT_KEYS entry (``csv_text``), written where the variant was run
    line: str = field(default="", compare=False, repr=False)


@dataclass(frozen=True)
class SweepResult:
    """A finished sweep: its axes and every variant in grid order (first axis slowest)."""

    design_name: str
    axes: tuple[Axis, ...]
    variants: tuple[Variant, ...]

    @property
    def passed(self) -> int:
        return sum(v.ok for v in self.variants)

    @property
    def output_keys(self) -> list[str]:
        return list(dict.fromkeys(k for v in self.variants for k in v.outputs))  # in order of first appearance


def parse_vary(text: str, design: "Design") -> Axis:
    """Read ``KEY=START:STOP:COUNT`` (e.g. ``features.rim.band_width=6mm:3mm:4``) against the design's key specs."""
    where = "--vary"
    m = _VARY.match(text)
    if not m:
        raise DesignInputError(where, text[:60], "cannot be read", "KEY=START:STOP:COUNT, e.g. features.rim.band_width=6mm:3mm:4")
    key, start_text, stop_text, count_text = m.groups()
    from .design import find_param

    found = find_param(key)
    if found is None:
        raise DesignInputError(where, key, "is not a design key",
                               "a key path such as features.rim.band_width or shop.fit_clearance")
    parts, spec = found
    if len(parts) == 4:  # a table of a feature's array (a sketch's point): the design must have it
        from .design import array_table

        array_table(design, parts)
    # the column keeps the name the user wrote (a key's earlier name too); with_values finds its current path
    full = ".".join(parts[:-1] + [key.rpartition(".")[2]])
    if spec.kind not in DISPLAY_UNITS:
        raise DesignInputError(where, full, f"is a {spec.kind} setting and cannot be swept",
                               "a quantity with units or a plain number")
    values = []
    for raw in (start_text.strip(), stop_text.strip()):
        if spec.kind == "number":
            try:
                raw_value: Any = float(raw)
            except ValueError:
                raise DesignInputError(where, full, f"got {raw[:40]!r}", spec.expected()) from None
        else:
            raw_value = raw
        values.append(spec.read(raw_value, where, full))
    if not re.fullmatch(r"\d+", count_text):
        raise DesignInputError(where, full, f"count {count_text[:20]!r} is not a whole number", "a COUNT of at least 2")
    count = int(count_text)
    if count < 2 or count > MAX_VARIANTS:
        raise DesignInputError(where, full, f"count {count} is out of range", f"a COUNT from 2 to {MAX_VARIANTS}")
    if values[0] == values[1]:
        raise DesignInputError(where, full, "START equals STOP", "two different end values")
    return Axis(full, spec.kind, values[0], values[1], count, spec)


def _sizes(resolved: "Resolved") -> dict[str, float | None]:
    """A variant's gap, diameter, width and bearing-seat clearances, as in its ``check --json`` summary."""
    v = resolved.values
    post = resolved.seat_fit.post
    out = {"profile.gap_mm": v["bearing_seat.gap"], "profile.outer_diameter_mm": v.get("profile.outer_diameter"),
           "profile.width_mm": v.get("profile.width"), "bearing_seat.clearance_min_mm": post.clearance_min_mm,
           "bearing_seat.clearance_max_mm": post.clearance_max_mm}
    return {k: (None if x is None else float(x)) for k, x in out.items()}


def _outputs(resolved: "Resolved") -> dict[str, float | None]:
    """A variant's OUTPUT_KEYS, valued as in its ``check --json`` summary (mass keys only when it can be weighed),
    one variant at a time: the reference ``_outputs_many`` must equal."""
    from .analysis import mass_and_spin
    from .batch_mass import MASS_KEYS

    out = _sizes(resolved)
    if resolved.can_analyse:
        m = mass_and_spin(resolved)
        figures = (m.half.mass_g, m.assembly.total_g, m.assembly.izz_g_mm2, m.assembly.ixx_g_mm2, m.spin.rim_share)
        out.update(zip(MASS_KEYS, map(float, figures)))
    return out


def _outputs_many(resolved: Sequence["Resolved"]) -> list[dict[str, float | None]]:
    """``_outputs`` of many variants, the mass figures of those that can be weighed worked out all at once."""
    from .batch_mass import mass_outputs

    out = [_sizes(r) for r in resolved]
    weighed = [n for n, r in enumerate(resolved) if r.can_analyse]
    for n, figures in zip(weighed, mass_outputs([resolved[n] for n in weighed])):
        out[n].update(figures)
    return out


def run_variants(base: "Design", axes: Sequence[Axis], points: Sequence[tuple[int, tuple[float, ...]]],
                 memo: BuildMemo | None = None) -> list[Variant]:
    """Resolve and check the variants ``points`` (index, varied values); an input the builder rejects makes
    a failed variant, not an error.

    Each variant's features are resolved on its own (``memo`` carries those the varied keys do not reach
    over from the previous one); the checks over the whole loop (does it cross itself, is a wall too thin)
    are answered for all the variants' loops at once.
    """
    memo = memo if memo is not None else BuildMemo()
    keys = [a.key for a in axes]
    shown_inputs: list[tuple[float, ...]] = []
    composed: list[Any] = []  # each variant's Composed, or the input error that stopped it
    for index, values in points:
        shown_inputs.append(tuple(a.shown(v) for a, v in zip(axes, values)))
        try:
            for a, v in zip(axes, values):
                if a.spec is not None:
                    a.spec.check_fine(v, base.source, a.key, f"{a.shown(v):.6g} {a.unit}", rounding=True)
            composed.append(compose(with_values(base, list(zip(keys, values))), memo))
        except (YodraftError, ValueError) as exc:
            composed.append(exc)
    judged = [(index, shown, r) for (index, _), shown, r in zip(points, shown_inputs, judge_many(composed))]
    resolved = [r for _, _, r in judged if not isinstance(r, Exception)]
    outputs = iter(_outputs_many(resolved))
    out = []
    lines = _Lines()
    writer = _writer(lines)
    for index, shown, r in judged:
        if isinstance(r, Exception):
            ok, failed, values = False, (f"input: {r}",), {}
        else:
            ok, failed, values = r.ok, tuple(f"{f.name} [{f.feature}.{f.parameter}]" for f in r.failed), next(outputs)
        writer.writerow(_csv_row(index, shown, ok, failed, values, OUTPUT_KEYS))
        out.append(Variant(index, shown, ok, failed, values, lines[-1]))
    return out


def run_variant(base: "Design", axes: Sequence[Axis], index: int, values: Sequence[float],
                memo: BuildMemo | None = None) -> Variant:
    """Resolve and check one variant (as ``run_variants``)."""
    return run_variants(base, axes, [(index, tuple(values))], memo)[0]


def _run_chunk(base: "Design", axes: Sequence[Axis], points: Sequence[tuple[int, tuple[float, ...]]],
               memo: BuildMemo | None = None) -> list[Variant]:
    """One chunk of variants. A variant leaves no reference cycles behind, so the cycle collector is off
    meanwhile: it would only walk the chunk's results again and again (about a tenth of the time)."""
    enabled = gc.isenabled()
    gc.disable()
    try:
        return run_variants(base, axes, points, memo)
    finally:
        if enabled:
            gc.enable()


def _context():
    import multiprocessing

    # fork shares the already imported modules with the workers (no second start-up) where it is safe
    if sys.platform == "linux" and "fork" in multiprocessing.get_all_start_methods():
        return multiprocessing.get_context("fork")
    return None


def sweep(base: "Design", axes: Sequence[Axis], *, workers: int | None = None,
          progress: Callable[[int, int], None] | None = None) -> SweepResult:
    """Run every grid point of one or two axes; ``progress(done, total)`` is called as variants finish."""
    if not 1 <= len(axes) <= 2:
        raise DesignInputError("--vary", "", f"got {len(axes)} axes", "one or two --vary options")
    if len({a.key for a in axes}) != len(axes):
        raise DesignInputError("--vary", axes[0].key, "is varied twice", "two different keys")
    total = math.prod(a.count for a in axes)
    if total > MAX_VARIANTS:
        raise DesignInputError("--vary", "", f"{total} variants is too many", f"at most {MAX_VARIANTS}")
    grids = [a.values() for a in axes]
    if len(axes) == 1:
        points = [(i, (v,)) for i, v in enumerate(grids[0])]
    else:
        points = [(i * len(grids[1]) + j, (u, v)) for i, u in enumerate(grids[0]) for j, v in enumerate(grids[1])]
    # never more workers than the machine has cores, nor than chunks to give them
    workers = min(workers if workers is not None else 8, os.cpu_count() or 1)
    # four chunks a worker (none idles long at the end), each large enough for the batched checks to pay
    # and at most 2,048 variants, so a worker holds few at once
    size = min(2048, max(64, math.ceil(total / (workers * 4))))
    chunks = [points[k:k + size] for k in range(0, total, size)]
    workers = min(workers, len(chunks))
    done: list[Variant] = []
    if workers <= 1 or total < 64:
        memo = BuildMemo()
        for chunk in chunks:
            done.extend(_run_chunk(base, axes, chunk, memo))
            if progress:
                progress(len(done), total)
    else:
        # one variant run here first loads (numpy, shapely, the batched checks) and warms (the fillet and
        # surface caches) what every worker needs, once before the fork instead of in each worker after it
        run_variants(base, axes, points[:1])
        # objects that exist before the fork are frozen, so no worker's collector walks (and copies) them;
        # the variants coming back make no reference cycles, so the collector is off while they come
        gc.freeze()
        enabled = gc.isenabled()
        gc.disable()
        try:
            with ProcessPoolExecutor(max_workers=workers, mp_context=_context()) as pool:
                for result in pool.map(_run_chunk, [base] * len(chunks), [tuple(axes)] * len(chunks), chunks):
                    done.extend(result)
                    if progress:
                        progress(len(done), total)
        finally:
            gc.unfreeze()
            if enabled:
                gc.enable()
    done.sort(key=lambda v: v.index)
    return SweepResult(base.name, tuple(axes), tuple(done))


def _num(v: float | None) -> str:
    return "" if v is None else f"{v:.10g}"


class _Lines(list):
    """A file that keeps each line written to it (a CSV writer writes a row in one call)."""

    write = list.append


def _writer(file: Any) -> Any:
    import csv

    return csv.writer(file, lineterminator="\n")


def _csv_row(index: int, inputs: Sequence[float], ok: bool, failed: Sequence[str], outputs: Mapping[str, float | None],
             keys: Sequence[str]) -> list[Any]:
    """One variant's CSV row: index, inputs, ok, failed checks, then its value of each of ``keys``."""
    return ([index] + [_num(x) for x in inputs] + ["true" if ok else "false", "; ".join(failed)]
            + [_num(outputs.get(k)) for k in keys])


def csv_text(result: SweepResult) -> str:
    """The sweep as CSV: index, varied inputs, ok, failed checks (``;``-separated), then the outputs.

    When every output column is present (any variant weighed), each variant's line as its worker wrote it.
    """
    import io

    keys = result.output_keys
    out = io.StringIO()
    writer = _writer(out)
    writer.writerow(["index"] + [a.column for a in result.axes] + ["ok", "failed"] + keys)
    whole = tuple(keys) == OUTPUT_KEYS
    for v in result.variants:
        if whole and v.line:
            out.write(v.line)
        else:
            writer.writerow(_csv_row(v.index, v.inputs, v.ok, v.failed, v.outputs, keys))
    return out.getvalue()
