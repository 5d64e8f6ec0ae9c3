"""The ``break_check`` setting (issue 14): "automatic" (the default) runs the break check
(procedure/breaks.py: the signs of a break, then the minimum LM test of Lee & Strazicich
2013); "off" runs neither, so no verdict is given under a break."""

from __future__ import annotations

import numpy as np
import pytest

from tauscope.engine import BREAK_CHECK_MODES, Settings, analyse_series


def _shifted(seed: int = 5) -> np.ndarray:
    """A stationary AR(0.5) of 200 whose mean shifts by 6 shock s.d. at mid-sample."""
    rng = np.random.default_rng(seed)
    u = np.zeros(300)
    e = rng.normal(size=300)
    for t in range(1, 300):
        u[t] = 0.5 * u[t - 1] + e[t]
    return 3.0 + 6.0 * (np.arange(200) >= 100) + u[100:]


def test_the_setting_and_its_records() -> None:
    assert BREAK_CHECK_MODES == ("automatic", "off")
    assert Settings().break_check == "automatic"
    assert Settings.from_dict({"alpha": 0.05}).break_check == "automatic"  # records from before
    assert Settings.from_dict(Settings(break_check="off").to_dict()).break_check == "off"
    with pytest.raises(ValueError, match="break_check"):
        Settings(break_check="never")


def test_off_runs_no_break_check_and_automatic_does() -> None:
    x = _shifted()
    automatic = analyse_series(x, Settings())
    off = analyse_series(x, Settings(break_check="off"))
    assert automatic.breaks is not None and automatic.breaks.test is not None  # it fires here
    assert automatic.to_dict()["breaks"] is not None
    assert off.breaks is None and off.to_dict()["breaks"] is None
    assert off.to_dict()["settings"]["break_check"] == "off"
    assert not any("Lee & Strazicich" in note for note in off.notes)
    # the tests of the order are the same; only the break check and what it adds differ
    for a, b in zip(automatic.tests, off.tests, strict=True):
        assert (a.test, a.spec, a.difference) == (b.test, b.spec, b.difference)
        assert a.statistic == b.statistic or not np.isfinite(a.statistic)
    assert "shift" in automatic.verdict.text and "shift" not in off.verdict.text


def test_fast_and_reference_paths_agree_with_the_check_off() -> None:
    x = _shifted(6)
    fast = analyse_series(x, Settings(break_check="off"))
    reference = analyse_series(x, Settings(break_check="off"), path="reference")
    assert fast.verdict.order == reference.verdict.order
    assert fast.verdict.agreement == reference.verdict.agreement
    assert fast.breaks is None and reference.breaks is None
