"""The axle bore feature: the thread catalog's tap drill and minor diameter."""
from __future__ import annotations

import pytest


def test_thread_minor_diameter_and_tap_drill() -> None:
    from yodraft.catalog.threads import lookup_thread

    m4 = lookup_thread("M4x0.7")
    assert m4.tap_drill_mm == pytest.approx(3.3)  # ISO 2306 tap drill for M4
    assert m4.minor_mm == pytest.approx(3.242, abs=5e-4)  # ISO 724 basic minor diameter D1
