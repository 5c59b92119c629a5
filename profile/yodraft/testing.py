"""Assertion helpers for tests of profiles: compare loops segment by segment within a tolerance."""
from __future__ import annotations

import math

from .geometry import Arc, Line, Profile

__all__ = ["assert_profiles_close"]


def _close(p: tuple[float, float], q: tuple[float, float], tol: float) -> bool:
    return math.hypot(p[0] - q[0], p[1] - q[1]) <= tol


def assert_profiles_close(a: Profile, b: Profile, tol: float = 1e-9) -> None:
    """Raise AssertionError unless ``a`` and ``b`` have the same segments, in order, within ``tol`` mm.

    Lines compare their ends; arcs also their centre, radius and sweep.

    >>> from yodraft.geometry import Profile
    >>> square = Profile.from_points([(0, 1), (1, 1), (1, 2), (0, 2)])
    >>> assert_profiles_close(square, square.translated(1e-12))
    """
    if len(a.segments) != len(b.segments):
        raise AssertionError(f"{len(a.segments)} segments against {len(b.segments)}")
    for i, (s, t) in enumerate(zip(a.segments, b.segments)):
        if type(s) is not type(t):
            raise AssertionError(f"segment {i}: {type(s).__name__} against {type(t).__name__}")
        if not (_close(s.start, t.start, tol) and _close(s.end, t.end, tol)):
            raise AssertionError(f"segment {i}: {s.start}→{s.end} against {t.start}→{t.end}")
        if isinstance(s, Arc) and isinstance(t, Arc):
            if not (_close(s.center, t.center, tol) and abs(s.radius - t.radius) <= tol
                    and abs(s.sweep - t.sweep) * max(s.radius, 1.0) <= tol):
                raise AssertionError(f"segment {i}: arc {s} against {t}")
        assert isinstance(s, (Line, Arc))
