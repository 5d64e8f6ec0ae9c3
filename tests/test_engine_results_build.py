"""The fast builders of results_build give the objects the constructors give: every field set,
equal, frozen, and the same after a pickle round trip."""

from __future__ import annotations

import dataclasses
import pickle

import numpy as np
import pytest

from tauscope.engine.results import Coefficient, Regression, TestResult
from tauscope.engine.results_build import new_regression, new_test_result


def _regression_values() -> dict[str, object]:
    return {"spec": "trend", "difference": 1, "lags": 2, "lag_rule": "aic", "max_lags": 9,
            "nobs": 120, "first_observation": 3,
            "coefficients": (Coefficient("constant", 0.1, 0.2, 0.5),), "sigma2": 1.5, "rss": 170.0,
            "lag_criteria": (1.0, 2.0, 3.0), "design": np.ones((2, 2)), "response": np.ones(2)}


def _test_values(regression: Regression) -> dict[str, object]:
    return {"test": "adf", "spec": "trend", "difference": 1, "statistic": -2.5, "p_value": 0.3,
            "lags": 2, "nobs": 120, "critical_values": {"5%": -3.4}, "reject": False,
            "critical_value": -3.4, "p_value_bound": "above", "lag_rule": "aic",
            "regression": regression}


def test_builders_set_every_field_in_declaration_order() -> None:
    values = _regression_values()
    assert list(values) == [f.name for f in dataclasses.fields(Regression)]
    built = new_regression(*values.values())  # type: ignore[arg-type]
    assert built == Regression(**values)  # type: ignore[arg-type]
    assert list(vars(built)) == list(values)
    tests = _test_values(built)
    assert list(tests) == [f.name for f in dataclasses.fields(TestResult)]
    made = new_test_result(*tests.values())  # type: ignore[arg-type]
    expected = TestResult(**tests)  # type: ignore[arg-type]
    assert made == expected and vars(made) == vars(expected)
    assert made.to_dict() == expected.to_dict()


def test_built_objects_stay_frozen_and_pickle() -> None:
    built = new_regression(*_regression_values().values())  # type: ignore[arg-type]
    made = new_test_result(*_test_values(built).values())  # type: ignore[arg-type]
    with pytest.raises(dataclasses.FrozenInstanceError):
        made.statistic = 0.0  # type: ignore[misc]
    with pytest.raises(dataclasses.FrozenInstanceError):
        built.rss = 0.0  # type: ignore[misc]
    again = pickle.loads(pickle.dumps(made))
    assert again == made and again.regression == built
    assert dataclasses.replace(made, statistic=-1.0).statistic == -1.0
