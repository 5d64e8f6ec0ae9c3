"""The fast path's result objects, built field by field into ``__dict__``
(:func:`tauscope.engine.procedure.fast_results._frozen`), are the objects the dataclasses'
own constructors give."""

from __future__ import annotations

import dataclasses

import numpy as np

from tauscope.engine.procedure.fast_path import level_batch
from tauscope.engine.procedure.fast_results import _FIELDS, adf_result
from tauscope.engine.procedure.stages import plan_for
from tauscope.engine.results import Coefficient, Regression, TestResult
from tauscope.engine.settings import Settings


def _rebuilt(obj: object) -> object:
    """The same values through the class's own __init__."""
    return type(obj)(**{f.name: getattr(obj, f.name) for f in dataclasses.fields(obj)})  # type: ignore[arg-type]


def test_adf_results_equal_those_the_constructors_build() -> None:
    rng = np.random.default_rng(4)
    xs = np.cumsum(rng.standard_normal((6, 120)), axis=1)
    options = plan_for(Settings()).estimate
    level = level_batch(xs, 0, options, 8)
    for i in range(xs.shape[0]):
        for spec in ("trend", "constant", "none"):
            for scale in (1.0, 4.0):
                result = adf_result(level, spec, i, 0.05, scale)
                assert result.regression is not None
                for obj in (result, result.regression, *result.regression.coefficients):
                    assert set(vars(obj)) == _FIELDS[type(obj)]
                    again = _rebuilt(obj)
                    assert again == obj and repr(again) == repr(obj)
                assert hash(result.regression.coefficients[0]) == hash(_rebuilt(result.regression.coefficients[0]))
                assert result.to_dict() == _rebuilt(result).to_dict()  # type: ignore[attr-defined]
                assert dataclasses.replace(result, reject=not result.reject).reject is not result.reject


def test_every_result_class_is_covered() -> None:
    assert set(_FIELDS) == {Coefficient, Regression, TestResult}
