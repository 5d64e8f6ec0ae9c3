"""plain(): the fast path's way of building a frozen result without its generated __init__."""

from __future__ import annotations

import pytest

from tauscope.engine.procedure.fast_results import plain
from tauscope.engine.results import Coefficient, TestResult


def test_plain_builds_the_same_object_as_the_constructor() -> None:
    values = {"test": "adf", "spec": "trend", "difference": 1, "statistic": -3.5, "p_value": 0.04,
              "lags": 2, "nobs": 200, "critical_values": {"5%": -3.43}, "reject": True,
              "critical_value": -3.43, "p_value_bound": None, "lag_rule": "aic", "regression": None}
    built = plain(TestResult, values)
    made = TestResult(**values)
    assert built == made
    assert built.to_dict() == made.to_dict()
    assert repr(built) == repr(made)
    with pytest.raises(AttributeError):
        built.statistic = 0.0  # type: ignore[misc]  # still frozen


def test_plain_refuses_a_missing_or_unknown_field() -> None:
    with pytest.raises(TypeError):
        plain(Coefficient, {"name": "x", "estimate": 1.0, "std_error": 1.0})
    with pytest.raises(TypeError):
        plain(Coefficient, {"name": "x", "estimate": 1.0, "std_error": 1.0, "t_value": 1.0, "extra": 0})
