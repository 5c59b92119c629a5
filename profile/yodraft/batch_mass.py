"""The sweep's mass and spin figures of many variants at once, bit-for-bit those of ``analysis.mass_and_spin``.

A sweep weighs thousands of variants of one design. Their body loops are laid
side by side: the k-th line (or arc) of every loop is one numpy column, and the
section integrals are summed column after column in the loop's own order, each
step one array operation over all the variants. The arithmetic is the scalar
code's own (``massprops._sloped_terms``, ``_turned_terms``, ``_moments``,
``_arc_terms``, ``_cut_point``, ``_arc_piece``, ``turned_body``, written for
floats and arrays alike); +, −, ×, ÷ round the same in numpy as in Python, and
every sine, cosine and arcsine is Python's ``math`` function taken element by
element, so each figure is the very float the scalar path gives. A branch of the
scalar code is a mask here; a term it skips adds nothing.

A half of more than one part (a ring), a variant the integrals reject and a batch
of fewer than ``MIN_BATCH`` variants go the scalar way.
"""
from __future__ import annotations

import math
from itertools import chain, compress, repeat
from operator import attrgetter, is_, not_
from typing import TYPE_CHECKING, Any, Sequence

from .analysis import mass_and_spin, small_part_inputs, small_parts_from
from .geometry import Arc
from .massprops import (_R_TOL, _arc_piece, _arc_terms, _cut_point, _moments, _sloped_terms, _turned_terms,
                        check_clip, density_g_mm3, part_sums, turned_body)
from .spin import check_spin_inputs, parts_izz_outside

if TYPE_CHECKING:  # pragma: no cover
    import numpy as np

    from .builder import Resolved

__all__ = ["mass_outputs", "MASS_KEYS", "MIN_BATCH"]

#: the sweep's mass and spin outputs, in its column order
MASS_KEYS = ("mass.half_g", "mass.total_g", "mass.izz_g_mm2", "mass.ixx_g_mm2", "spin.rim_share")
#: below this many variants the arrays cost more than they save (measured: even at about 16–20, half the
#: scalar cost per variant at 32, within a fifth of the least from about 128)
MIN_BATCH = 24
#: variants weighed in one set of arrays (measured: about the fastest per variant; 512 or 4096 cost more)
CHUNK = 2048

_TWO_PI = 2 * math.pi  # the scalar code's ``2 * math.pi``, the same float


def mass_outputs(resolved: Sequence["Resolved"]) -> list[dict[str, float]]:
    """Each variant's ``MASS_KEYS`` (half and assembled mass, assembled Izz and Ixx, rim share of Izz), valued
    exactly as ``mass_and_spin`` values them. Every variant must be one that can be analysed (``can_analyse``: the
    caller asks, as the sweep does; it is not asked again here).

    >>> from yodraft import EXAMPLE, build, loads
    >>> from yodraft.analysis import mass_and_spin
    >>> r = build(loads(EXAMPLE))
    >>> mass_outputs([r])[0]["mass.total_g"] == mass_and_spin(r).assembly.total_g
    True
    """
    out: list[dict[str, float] | None] = [None] * len(resolved)
    single = [n for n, r in enumerate(resolved) if len(r.parts) == 1]
    # loops stacked together for the checks are weighed together, from their stacked ends; the rest as one batch
    by_stack: dict[int, list[int]] = {}
    for n in single:
        stacked = resolved[n].parts[0].profile.__dict__.get("_stacked")
        by_stack.setdefault(id(stacked[0]) if stacked is not None else 0, []).append(n)
    batches = [ns for ns in by_stack.values() if len(ns) >= MIN_BATCH]
    rest = [n for ns in by_stack.values() if len(ns) < MIN_BATCH for n in ns]
    if len(rest) >= MIN_BATCH:
        batches.append(sorted(rest))
    for batch in batches:
        for k in range(0, len(batch), CHUNK):
            chunk = batch[k:k + CHUNK]
            for n, figures in zip(chunk, _batch([resolved[n] for n in chunk])):
                out[n] = figures
    for n, figures in enumerate(out):
        if figures is None:
            out[n] = _one(resolved[n])
    return out  # type: ignore[return-value]


def _one(resolved: "Resolved") -> dict[str, float]:
    """The scalar path: ``mass_and_spin`` itself."""
    m = mass_and_spin(resolved)
    return dict(zip(MASS_KEYS, (float(m.half.mass_g), float(m.assembly.total_g), float(m.assembly.izz_g_mm2),
                                float(m.assembly.ixx_g_mm2), float(m.spin.rim_share))))


def _each(fn: Any, x: "np.ndarray", where: "np.ndarray | None" = None) -> "np.ndarray":
    """``fn`` (a ``math`` function) of every element of ``x`` — or of those ``where`` is true, 0 elsewhere."""
    import numpy as np

    if where is None:
        return np.fromiter(map(fn, x.tolist()), float, len(x))
    out = np.zeros(len(x))
    idx = np.flatnonzero(where)
    if len(idx):
        out[idx] = np.fromiter(map(fn, x[idx].tolist()), float, len(idx))
    return out


def _one_stack(profiles: Sequence[Any]) -> "tuple[Any, list[int]] | None":
    """The one ``checks.LoopStack`` every loop of ``profiles`` was stacked in for the checks (``loop_stacks``)
    and each loop's row in it; None when they were not all stacked together."""
    placed = [p.__dict__.get("_stacked") for p in profiles]
    if not placed or placed[0] is None:
        return None
    stack = placed[0][0]
    if not all(s is not None and s[0] is stack for s in placed):
        return None
    return stack, [row for _, row in placed]


class _Columns:
    """The body loops of B variants side by side: the k-th line of every loop in row k of the line columns
    (z0, r0, z1, r1) and the k-th arc in row k of the arc columns, each of shape (k, B), zeros where a loop
    has fewer (a zero line is a face on the axis, a zero arc has no radius: neither adds to any sum)."""

    def __init__(self, profiles: Sequence[Any]) -> None:
        import numpy as np

        self.b = b = len(profiles)
        seg_lists = [p.segments for p in profiles]
        stacked = _one_stack(profiles)
        if stacked is not None:  # the loops' ends already stacked for the checks (a sweep's usual case)
            stack, rows = stacked
            arc_places = set(stack.arcs)
            places = [i for i in range(stack.n) if i not in arc_places]
            starts, ends = stack.starts[rows][:, places], stack.ends[rows][:, places]  # (B, lines, 2)
            self.z0, self.r0, self.z1, self.r1 = (np.ascontiguousarray(x.T) for x in (
                starts[..., 0], starts[..., 1], ends[..., 0], ends[..., 1]))
            arcs = [seg_list[i] for seg_list in seg_lists for i in stack.arcs]
            arc_variant = np.repeat(np.arange(b), len(stack.arcs))
        else:
            segs = list(chain.from_iterable(seg_lists))
            is_arc = list(map(is_, map(type, segs), repeat(Arc)))
            arcs = list(compress(segs, is_arc))
            variant = np.repeat(np.arange(b), np.fromiter(map(len, seg_lists), np.intp, b))
            arc_mask = np.array(is_arc, bool)
            lines = list(compress(segs, map(not_, is_arc)))
            line_ends = np.fromiter(chain.from_iterable(chain.from_iterable(lines)), float, 4 * len(lines))  # (start, end)
            self.z0, self.r0, self.z1, self.r1 = self._place(
                (line_ends[0::4], line_ends[1::4], line_ends[2::4], line_ends[3::4]), variant[~arc_mask], b)
            arc_variant = variant[arc_mask]
        centres = np.fromiter(chain.from_iterable(map(attrgetter("center"), arcs)), float, 2 * len(arcs))
        fields = np.fromiter(chain.from_iterable(map(attrgetter("radius", "start_angle", "sweep"), arcs)), float,
                             3 * len(arcs))
        trig = np.fromiter(chain.from_iterable(map(attrgetter("trig"), arcs)), float, 4 * len(arcs))  # Python's math
        self.zc, self.rc, self.a, self.t0, self.dt, self.s0, self.c0, self.s1, self.c1 = self._place(
            (centres[0::2], centres[1::2], fields[0::3], fields[1::3], fields[2::3],
             trig[0::4], trig[1::4], trig[2::4], trig[3::4]), arc_variant, b)
        self.t1 = self.t0 + self.dt  # Arc.end_angle

    @staticmethod
    def _place(fields: Sequence["np.ndarray"], variant: "np.ndarray", b: int) -> "np.ndarray":
        """Items (each field over them, each item of ``variant``, in loop order) as (fields, k, B): a variant's
        j-th item in row j, zeros where a variant has fewer (a zero arc has no radius and adds nothing)."""
        import numpy as np

        per = np.bincount(variant, minlength=b)
        k = int(per.max()) if len(per) else 0
        if k * b == len(variant):  # as many in every variant (a sweep's usual case): reshaped, not scattered
            return np.ascontiguousarray(np.stack(fields).reshape(len(fields), b, k).transpose(0, 2, 1))
        row = np.arange(len(variant)) - (np.cumsum(per) - per)[variant]
        out = np.zeros((len(fields), k, b))
        for field, column in zip(fields, out):
            column[row, variant] = field
        return out


def _line_column(acc: list["np.ndarray"], za: "np.ndarray", ra: "np.ndarray", zb: "np.ndarray", rb: "np.ndarray",
                 c: Any, c2: Any, c4: Any, keep: "np.ndarray | None" = None) -> None:
    """Add one column of lines to the sums ``acc`` (a, r1, r3, rz2) as ``massprops._line_sums`` does: a face
    adds nothing to them, a turned diameter its ``_turned_terms``, any other line its ``_sloped_terms``;
    ``keep`` false leaves the line out."""
    import numpy as np

    face = za == zb
    if keep is not None:
        face |= ~keep
    turned = ~face & (ra == rb)
    sloped = ~face & ~turned
    if sloped.all():
        terms = _sloped_terms(za, ra, zb, rb, c, c2, c4)
    elif turned.all():
        terms = _turned_terms(za, zb, ra, c, c2, c4)
    elif face.all():
        return
    else:
        none = (0.0,) * 6
        t_sloped = _sloped_terms(za, ra, zb, rb, c, c2, c4) if sloped.any() else none
        t_turned = _turned_terms(za, zb, ra, c, c2, c4) if turned.any() else none
        terms = tuple(np.where(sloped, s, np.where(turned, t, 0.0)) for s, t in zip(t_sloped, t_turned))
    for k, i in enumerate((0, 1, 4, 5)):  # a, r1, r3, rz2 of (a, r1, z1, rz, r3, rz2)
        acc[k] += terms[i]


def _arc_column(acc: list["np.ndarray"], zc: "np.ndarray", rc: "np.ndarray", a: "np.ndarray",
                s0: "np.ndarray", c0: "np.ndarray", s1: "np.ndarray", c1: "np.ndarray", dt: "np.ndarray",
                c: Any, c2: Any, keep: "np.ndarray | None" = None) -> None:
    """Add one column of arcs (their end sines and cosines given) to the sums ``acc`` (a, r1, r3, rz2)."""
    import numpy as np

    terms = _arc_terms(zc, rc, a, _moments(s0, c0, s1, c1, dt), c, c2)
    for k, i in enumerate((0, 1, 4, 5)):
        acc[k] += terms[i] if keep is None else np.where(keep, terms[i], 0.0)


def _body_sums(cols: _Columns) -> tuple[list["np.ndarray"], "np.ndarray"]:
    """The body's section integrals (a, r1, r3, rz2), as ``section_integrals``, and each loop's least radius."""
    import numpy as np

    b = cols.b
    lines = [np.zeros(b) for _ in range(4)]
    r_min = np.full(b, math.inf)
    for j in range(len(cols.z0)):
        _line_column(lines, cols.z0[j], cols.r0[j], cols.z1[j], cols.r1[j], 0.0, 0.0, 0.0)
        r_min = np.minimum(r_min, np.minimum(cols.r0[j], cols.r1[j]))
    arcs = [np.zeros(b) for _ in range(4)]
    for j in range(len(cols.zc)):
        rc, a, t0, dt, t1 = cols.rc[j], cols.a[j], cols.t0[j], cols.dt[j], cols.t1[j]
        _arc_column(arcs, cols.zc[j], rc, a, cols.s0[j], cols.c0[j], cols.s1[j], cols.c1[j], dt, 0.0, 0.0)
        # massprops._arc_r_min: the lowest point if the sweep passes it, else the lower end
        lo, hi = np.minimum(t0, t1), np.maximum(t0, t1)
        bottom = -math.pi / 2 + _TWO_PI * np.ceil((lo + math.pi / 2) / _TWO_PI)
        r_arc = np.where(bottom <= hi, rc - a, rc + a * np.minimum(cols.s0[j], cols.s1[j]))
        r_min = np.minimum(r_min, r_arc)
    return [x + y for x, y in zip(lines, arcs)], r_min


def _rim_sums(cols: _Columns, c: "np.ndarray") -> list["np.ndarray"]:
    """The section integrals (a, r1, r3, rz2) of each loop's part at r ≥ ``c``, as ``clipped_section_integrals``
    (the pieces of ``massprops._clip_pieces``, each line's and arc's in their order)."""
    import numpy as np

    b = len(c)
    c2 = c * c
    c4 = c2 * c2
    lines = [np.zeros(b) for _ in range(4)]
    for j in range(len(cols.z0)):
        z0, r0, z1, r1 = cols.z0[j], cols.r0[j], cols.z1[j], cols.r1[j]
        cross = (r0 - c) * (r1 - c) < 0
        keep = cross | ((r0 + r1) / 2 > c)
        if not keep.any():
            continue
        if cross.any():
            with np.errstate(divide="ignore", invalid="ignore"):
                z_cut, r_at = _cut_point(z0, r0, z1, r1, c)
            up = cross & (r1 > c)  # the piece from the cut to the end, else from the start to the cut
            down = cross & ~up
            z0, r0 = np.where(up, z_cut, z0), np.where(up, r_at, r0)
            z1, r1 = np.where(down, z_cut, z1), np.where(down, r_at, r1)
        _line_column(lines, z0, r0, z1, r1, c, c2, c4, keep)
    arcs = [np.zeros(b) for _ in range(4)]
    for j in range(len(cols.zc)):
        zc, rc, a, t0, dt, t1 = cols.zc[j], cols.rc[j], cols.a[j], cols.t0[j], cols.dt[j], cols.t1[j]
        alive = rc + a > c  # else the whole circle lies at or below the cut
        if not alive.any():
            continue
        with np.errstate(divide="ignore", invalid="ignore"):
            q = (c - rc) / a
        crossing = alive & (-1 < q) & (q < 1)
        fractions = [np.zeros(b), np.ones(b)]
        if crossing.any():
            base = _each(math.asin, q, crossing)
            lo, hi = np.minimum(t0, t1), np.maximum(t0, t1)
            for root in (base, math.pi - base):
                # every angle of that root inside the sweep, as a fraction of the sweep
                ang = root + _TWO_PI * np.ceil((lo - root) / _TWO_PI)
                active = crossing & (ang < hi)
                while active.any():
                    with np.errstate(divide="ignore", invalid="ignore"):
                        f = (ang - t0) / dt
                    fractions.append(np.where(active & (0 < f) & (f < 1), f, 2.0))  # 2: no cut
                    ang = ang + _TWO_PI
                    active &= ang < hi
        cuts = np.sort(np.stack(fractions, axis=1), axis=1)
        for k in range(cuts.shape[1] - 1):
            fa, fb = cuts[:, k], cuts[:, k + 1]
            piece = alive & (fb <= 1.0) & (fb - fa > 0)
            if not piece.any():
                continue
            mid, p0, pdt = _arc_piece(t0, dt, fa, fb)
            piece &= rc + a * _each(math.sin, mid, piece) > c
            if not piece.any():
                continue
            p1 = p0 + pdt
            # a piece that is the whole arc keeps the arc's own end values (the same angles, to the bit)
            same0 = piece & (p0.view(np.int64) == t0.view(np.int64))
            same1 = piece & (p1.view(np.int64) == t1.view(np.int64))
            s0 = np.where(same0, cols.s0[j], _each(math.sin, p0, piece & ~same0))
            c0 = np.where(same0, cols.c0[j], _each(math.cos, p0, piece & ~same0))
            s1 = np.where(same1, cols.s1[j], _each(math.sin, p1, piece & ~same1))
            c1 = np.where(same1, cols.c1[j], _each(math.cos, p1, piece & ~same1))
            _arc_column(arcs, zc, rc, a, s0, c0, s1, c1, pdt, c, c2, piece)
    return [x + y for x, y in zip(lines, arcs)]


def _batch(resolved: Sequence["Resolved"]) -> list[dict[str, float] | None]:
    """The figures of single-part variants; None for a variant the scalar path must answer (it may raise)."""
    import numpy as np

    b = len(resolved)
    scalar = np.zeros(b, bool)  # variants left to mass_and_spin
    rho: list[float] = []
    r_cut: list[float] = []
    which: list[int] = []  # each variant's row of ``made``
    outside: list[float] = []  # the small parts' Izz outside the rim cut
    # a sweep's variants mostly share their small parts and analysis settings: each set is made once
    made: list[tuple[float, float, float]] = [(0.0, 0.0, 0.0)]  # the parts' mass, Izz, Ixx (row 0: none)
    rows: dict[Any, tuple[int, Any, dict[float, float]]] = {}
    densities: dict[float, float] = {}
    for n, r in enumerate(resolved):
        body = r.parts[0]
        a = r.design["analysis"]
        ratio = a["rim_radius_ratio"]
        cut = ratio * r.profile.bounds()[3]
        key = (small_part_inputs(r), a["spin_rate"], a["drag_torque"], ratio)
        row = rows.get(key)
        if row is None:
            try:
                check_spin_inputs(key[0].od / 2, key[1], key[2], ratio)
                parts = small_parts_from(key[0])[0]
                made.append(part_sums(parts))
                row = rows[key] = (len(made) - 1, parts, {})
            except ValueError:
                row = rows[key] = (0, None, {})
        index, parts, beyond = row
        density = densities.get(body.density_g_cm3)
        try:
            if parts is None:
                raise ValueError("the scalar path says why")
            if density is None:
                density = densities[body.density_g_cm3] = density_g_mm3(body.density_g_cm3)
            check_clip(body.profile, cut)
        except ValueError:
            scalar[n] = True
            index, density, cut, parts, beyond = 0, 1.0, 0.0, (), {}
        rho.append(density)
        r_cut.append(cut)
        which.append(index)
        out = beyond.get(cut)
        if out is None:
            out = beyond[cut] = parts_izz_outside(parts, cut)
        outside.append(out)
    sums = np.array(made)[which].T
    rho_a, r_cut_a = np.array(rho), np.array(r_cut)
    cols = _Columns([r.parts[0].profile for r in resolved])
    (area, r1, r3, rz2), r_min = _body_sums(cols)
    scalar |= (r_min < -_R_TOL) | ~(area > 0)  # section_integrals refuses these: the scalar path raises
    _, mass, izz, ixx = turned_body(rho_a, r1, r3, rz2)
    _, rim_r1, rim_r3, rim_rz2 = _rim_sums(cols, r_cut_a)
    rim_half = turned_body(rho_a, rim_r1, rim_r3, rim_rz2)[2]
    # massprops.assemble and spin.spin_metrics
    total = 2 * mass + sums[0]
    izz_total = 2 * izz + sums[1]
    ixx_total = 2 * ixx + sums[2]
    with np.errstate(divide="ignore", invalid="ignore"):
        rim_share = (2 * rim_half + np.array(outside)) / izz_total
    figures = zip(mass.tolist(), total.tolist(), izz_total.tolist(), ixx_total.tolist(), rim_share.tolist())
    return [None if s else dict(zip(MASS_KEYS, f)) for s, f in zip(scalar.tolist(), figures)]
