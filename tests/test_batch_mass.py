"""The batched mass figures equal the scalar path's, float for float, on every template and many variants.

The reference here is the project's own scalar path (``sweep._outputs``, i.e. ``analysis.mass_and_spin``),
which tests/test_massprops.py, tests/test_analysis.py and tests/test_spin.py check against handbook solids,
Pappus's theorems and shapely. Equality is exact: compared as ``float.hex``.
"""
from __future__ import annotations

import dataclasses
import random

import pytest

from conftest import TEMPLATES
from yodraft import build, load
from yodraft.analysis import mass_and_spin
from yodraft.batch_mass import MASS_KEYS, MIN_BATCH, _batch, mass_outputs
from yodraft.builder import BuildMemo
from yodraft.design import with_values
from yodraft.geometry import Profile
from yodraft.sweep import _outputs

TEMPLATE_FILES = sorted(TEMPLATES.glob("*.toml"))
#: keys and ranges varied (base units: mm, g/cm³, a plain share); the rim radius ratio moves the rim cut
#: across the loop's arcs, so arcs cut into pieces are among them
VARIED = (
    ("features.rim.band_width", 3.0, 12.0),
    ("features.rim.thickness", 1.0, 8.0),
    ("features.rim.edge_radius", 0.2, 4.0),
    ("design.density", 1.0, 9.0),
    ("analysis.rim_radius_ratio", 0.05, 0.98),
)


def variants(path, count: int, seed: int) -> list:
    """``count`` analysable variants of one template, one or two keys varied at random (some fail checks)."""
    rng = random.Random(seed)
    base = load(path)
    memo = BuildMemo()
    out = []
    while len(out) < count:
        picks = rng.sample(VARIED, rng.choice((1, 2)))
        design = with_values(base, [(key, rng.uniform(lo, hi)) for key, lo, hi in picks])
        try:
            resolved = build(design, memo)
        except ValueError:
            continue
        if resolved.can_analyse:
            out.append(resolved)
    return out


def hexes(figures: dict) -> dict:
    return {k: float(v).hex() for k, v in figures.items()}


def scalar(resolved) -> dict:
    """The reference: the sweep's own outputs, restricted to the mass and spin keys."""
    out = _outputs(resolved)
    return {k: out[k] for k in MASS_KEYS}


@pytest.fixture(scope="module")
def by_template() -> dict:
    return {path.stem: variants(path, 200, seed=n) for n, path in enumerate(TEMPLATE_FILES)}


@pytest.mark.parametrize("name", [p.stem for p in TEMPLATE_FILES])
def test_every_template_bit_for_bit(by_template: dict, name: str) -> None:
    rs = by_template[name]
    got = mass_outputs(rs)
    assert all(list(g) == list(MASS_KEYS) for g in got)
    assert [hexes(g) for g in got] == [hexes(scalar(r)) for r in rs]


def test_body_only_halves_take_the_batched_way(by_template: dict) -> None:
    # not vacuous: every body-only variant is answered by the arrays, none handed back to the scalar path
    every = [r for rs in by_template.values() for r in rs]
    assert any(not r.ok for r in every) and any(r.ok for r in every)  # variants that fail checks are weighed too
    for name, rs in by_template.items():
        single = [r for r in rs if len(r.parts) == 1]
        if name != "bimetal-ring":
            assert len(single) == len(rs)
            assert None not in _batch(single)


def test_mixed_structures_rings_and_one(by_template: dict) -> None:
    rng = random.Random(7)
    mixed = [r for rs in by_template.values() for r in rs[:30]]
    rng.shuffle(mixed)
    assert len({len(r.parts[0].profile.segments) for r in mixed}) > 3  # loops of different lengths side by side
    assert any(len(r.parts) > 1 for r in mixed)  # the bimetal ring's halves go the scalar way among them
    assert [hexes(g) for g in mass_outputs(mixed)] == [hexes(scalar(r)) for r in mixed]
    one = mixed[:1]
    assert [hexes(g) for g in mass_outputs(one)] == [hexes(scalar(one[0]))]
    just_enough = [r for r in mixed if len(r.parts) == 1][:MIN_BATCH]
    assert None not in _batch(just_enough)
    assert [hexes(g) for g in mass_outputs(just_enough)] == [hexes(scalar(r)) for r in just_enough]
    assert mass_outputs([]) == []


def test_a_loop_the_integrals_refuse_raises_as_the_scalar_path(by_template: dict) -> None:
    rs = list(by_template["string-trick"][:MIN_BATCH + 4])
    body = rs[3].parts[0]
    backwards = Profile(tuple(s.reversed() for s in reversed(body.profile.segments)))  # clockwise
    rs[3] = dataclasses.replace(rs[3], parts=(dataclasses.replace(body, profile=backwards),))
    with pytest.raises(ValueError) as scalar_error:
        mass_and_spin(rs[3])
    with pytest.raises(ValueError) as batch_error:
        mass_outputs(rs)
    assert str(batch_error.value) == str(scalar_error.value)


def test_loops_stacked_for_the_checks_weighed_from_their_stacks(by_template: dict) -> None:
    """Loops stacked by ``checks.loop_stacks`` (a sweep's chunk, judged together) are weighed from the stacked
    ends, each stack on its own: still the scalar path's floats, whatever the mix of loop runs."""
    from yodraft.batch_mass import _one_stack
    from yodraft.checks import loop_stacks

    rng = random.Random(11)
    mixed = [r for rs in by_template.values() for r in rs if len(r.parts) == 1]
    rng.shuffle(mixed)
    stacks = loop_stacks([r.parts[0].profile for r in mixed])
    assert len(stacks) > 3 and max(len(s.members) for s in stacks) >= MIN_BATCH  # some stacks are weighed alone
    big = next(s for s in stacks if len(s.members) >= MIN_BATCH)
    assert _one_stack([mixed[b].parts[0].profile for b in big.members]) is not None  # not vacuous
    assert [hexes(g) for g in mass_outputs(mixed)] == [hexes(scalar(r)) for r in mixed]
