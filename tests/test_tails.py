"""The lot's percentiles against NumPy's own ``np.percentile`` (method ``linear``, Hyndman & Fan definition 7),
the general-purpose reference: the same float, bit for bit, whichever way each value is found."""
from __future__ import annotations

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from yodraft import tails
from yodraft.tails import percentiles

QS = [0, 0.1, 1, 25, 50, 99, 99.9, 100]


def _reference(x: np.ndarray, qs: list[float]) -> list[float]:
    return [float(v) for v in np.percentile(x, qs)]  # NumPy's default, method="linear"


@pytest.mark.parametrize("n", [1, 2, 3, 10, 999, 20_000, 20_001, 100_003, 1_000_000])
@pytest.mark.parametrize("kind", ["normal", "few values", "constant", "sorted", "reversed", "skewed"])
def test_equals_numpy(n: int, kind: str) -> None:
    rng = np.random.default_rng(n)
    x = {"normal": lambda: rng.normal(31.0, 0.05, n), "few values": lambda: rng.integers(0, 5, n).astype(float),
         "constant": lambda: np.full(n, 2.5), "sorted": lambda: np.sort(rng.normal(size=n)),
         "reversed": lambda: np.sort(rng.normal(size=n))[::-1].copy(),
         "skewed": lambda: rng.exponential(size=n) ** 3}[kind]()
    before = x.copy()
    assert percentiles(x, QS) == _reference(x, QS)
    assert np.array_equal(x, before)  # the sample is left as it was


@settings(max_examples=60, deadline=None)
@given(st.lists(st.floats(-1e6, 1e6, allow_nan=False), min_size=1, max_size=300),
       st.lists(st.floats(0, 100), min_size=1, max_size=5))
def test_equals_numpy_any_sample(values: list[float], qs: list[float]) -> None:
    x = np.array(values)
    assert percentiles(x, qs) == _reference(x, qs)


def test_a_missed_bracket_falls_back_to_the_whole_sample(monkeypatch: pytest.MonkeyPatch) -> None:
    # a thinned copy that is no guide at all (every bracket misses) still gives NumPy's values
    x = np.random.default_rng(9).normal(size=50_000)
    monkeypatch.setattr(tails, "_thinned", lambda x: np.sort(x[::10]) + 100.0)
    assert percentiles(x, [1, 99]) == _reference(x, [1, 99])


def test_an_empty_sample_is_refused() -> None:
    with pytest.raises(ValueError):
        percentiles(np.zeros(0), [50])


@pytest.mark.parametrize("q", [-1, 100.5])
def test_a_percentile_outside_0_to_100_is_refused(q: float) -> None:
    with pytest.raises(ValueError):
        percentiles(np.arange(5.0), [q])  # as np.percentile refuses it
    with pytest.raises(ValueError):
        np.percentile(np.arange(5.0), [q])
