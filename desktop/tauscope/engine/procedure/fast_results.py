"""The result objects of the fast path: one series' ADF and Φ tests from a batch's arrays
(:class:`LevelBatch`), the same objects the reference path builds
(:mod:`tauscope.engine.reference`)."""

from __future__ import annotations

from dataclasses import dataclass
from functools import lru_cache

import numpy as np

from tauscope.engine.distributions import tables as fast_tables
from tauscope.engine.regression.design import DETERMINISTIC_TERMS, column_names
from tauscope.engine.regression.lagchoice import LagChoice
from tauscope.engine.regression.nested import Estimates
from tauscope.engine.results import Coefficient, Regression, TestResult
from tauscope.engine.unitroot import phi as joint


@dataclass
class LevelBatch:
    """Everything the sequence needs on Δ^d y for a batch of series of one length."""

    difference: int
    max_lags: int
    n: int
    first_rows: np.ndarray  # (B, p, K+1): the rows before the common sample (full design)
    common: dict[str, np.ndarray]
    choices: dict[str, list[LagChoice]]
    estimates: dict[str, Estimates]
    phi: dict[str, np.ndarray]
    declined: np.ndarray  # (B,) bool: the reference path must take these
    centres: np.ndarray  # (B,): y(t−1) is measured from these in the specs with a constant


_column_names = lru_cache(maxsize=512)(column_names)
_NO_DESIGN = np.empty((0, 0))
_NO_RESPONSE = np.empty(0)
_NO_DESIGN.flags.writeable = False
_NO_RESPONSE.flags.writeable = False


def _coefficients(spec: str, lags: int, params: list[float], bse: list[float]
                  ) -> tuple[Coefficient, ...]:
    names = _column_names(spec, lags)
    return tuple(
        Coefficient(name, params[j], bse[j], params[j] / bse[j]) for j, name in enumerate(names)
    )


def adf_result(level: LevelBatch, spec: str, i: int, alpha: float) -> TestResult:
    choice = level.choices[spec][i]
    est = level.estimates[spec]
    lags = choice.lag
    nobs = int(est.nobs[i])
    rss = float(est.rss[i])
    coefficients = _coefficients(spec, lags, est.params[i].tolist(), est.bse[i].tolist())
    regression = Regression(
        spec=spec,
        difference=level.difference,
        lags=lags,
        lag_rule=choice.rule,
        max_lags=choice.max_lags,
        nobs=nobs,
        first_observation=lags + 1,
        coefficients=coefficients,
        sigma2=rss / (nobs - len(coefficients)),
        rss=rss,
        lag_criteria=choice.criteria,
        design=_NO_DESIGN,  # not kept: the results of many series would hold every design
        response=_NO_RESPONSE,
    )
    tau = coefficients[len(DETERMINISTIC_TERMS[spec])].t_value
    critical = fast_tables.tau_critical_value(spec, nobs, alpha)
    return TestResult(
        test="adf",
        spec=spec,
        difference=level.difference,
        statistic=tau,
        p_value=fast_tables.tau_p_value(tau, spec),
        lags=lags,
        nobs=nobs,
        critical_values=fast_tables.tau_critical_values(spec, nobs),
        reject=bool(tau < critical),
        critical_value=critical,
        lag_rule=choice.rule,
        regression=regression,
    )


def phi_result(level: LevelBatch, adf: TestResult, name: str, i: int, alpha: float) -> TestResult:
    """Φ from the batch's restricted RSS, as :func:`joint.phi_test` computes it."""
    regression = adf.regression
    assert regression is not None
    return joint.phi_result(regression, name, joint.f_statistic(float(level.phi[name][i]), regression, name),
                            alpha)
