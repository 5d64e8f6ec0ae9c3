"""Input the engine refuses with a sentence instead of a misleading verdict."""

from __future__ import annotations

import warnings

import numpy as np
import pytest

from tauscope.engine import analyse_series


def _walk(n: int = 80) -> np.ndarray:
    return np.cumsum(np.random.default_rng(11).normal(size=n))


def test_complex_values_are_refused_not_cut_to_their_real_part() -> None:
    result = analyse_series(_walk() + 1j * _walk(), name="z")
    assert result.error is not None and "complex numbers" in result.error
    assert result.verdict.order is None and result.tests == ()


@pytest.mark.parametrize("scale", [1e306, -1e307, 1e200])
def test_values_near_the_float_limit_are_tested_without_warnings(scale: float) -> None:
    """The regressions run on the series divided by a power of two (engine/regression/scaling.py),
    so magnitudes up to the float limit are tested as at unit scale (tests/test_engine_scale.py
    checks the numbers), with no overflow warning and no false "linearly dependent" sentence."""
    with warnings.catch_warnings():
        warnings.simplefilter("error")  # no numpy overflow warning may escape
        result = analyse_series(_walk() * scale, name="huge")
        unit = analyse_series(_walk(), name="huge")
    assert result.error is None and result.verdict.order == unit.verdict.order
    assert not any("linearly dependent" in note for note in result.notes)


def test_large_but_ordinary_values_are_still_tested() -> None:
    result = analyse_series(_walk() * 1e12 + 5e13, name="output in units")
    assert result.error is None and result.verdict.order is not None
