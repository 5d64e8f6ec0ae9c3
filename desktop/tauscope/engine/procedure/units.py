"""Results of regressions run on the standardised series (y / s, s a power of two:
:mod:`tauscope.engine.regression.scaling`) put back into the series' own units.

With z = y/s the ADF regression Δz_t = a0 + a2·t + γ z_{t−1} + Σ β_i Δz_{t−i} + e_t is
the regression of y divided by s, so

* a0, a2 and their standard errors are multiplied by s; γ, the β_i and every t ratio
  (τ among them), the Φ statistics and the lag choice are unchanged;
* σ̂² and the RSS are multiplied by s²;
* the information criteria −2 ln L + c·k (ln L = −N/2 (ln 2π + ln(RSS/N) + 1)) grow by
  N ln s², MAIC (ln σ̂² + …) by ln s², the t ratios of the general-to-specific rule not at all.

s is a power of two, so every product is exact; only the criteria's sums round.

The frozen results are copied and their few fields set directly (``dataclasses.replace``
re-runs the constructor with every field, a noticeable share of the fast path's time).
"""

from __future__ import annotations

import math
from typing import TypeVar

from tauscope.engine.regression.design import DETERMINISTIC_TERMS
from tauscope.engine.results import Coefficient, LevelTests, Regression, TestResult

_T = TypeVar("_T")


def regression_in_units(regression: Regression, scale: float) -> Regression:
    """The same regression as if fitted to y itself (see the module docstring)."""
    if scale == 1.0:
        return regression
    terms = DETERMINISTIC_TERMS[regression.spec]
    coefficients = tuple(
        Coefficient(c.name, c.estimate * scale, c.std_error * scale, c.t_value) if c.name in terms else c
        for c in regression.coefficients
    )
    log_s2 = 2.0 * math.log(scale)
    if regression.lag_rule in ("aic", "bic", "hqc"):
        common = regression.nobs + regression.lags - regression.max_lags
        criteria = tuple(v + common * log_s2 for v in regression.lag_criteria)
    elif regression.lag_rule == "maic":
        criteria = tuple(v + log_s2 for v in regression.lag_criteria)
    else:
        criteria = regression.lag_criteria
    # The design and response stay those the statistics were computed from (standardised).
    return _with(regression, coefficients=coefficients, sigma2=regression.sigma2 * scale * scale,
                 rss=regression.rss * scale * scale, lag_criteria=criteria)


def _with(obj: _T, **changes: object) -> _T:
    """A shallow copy of a frozen dataclass with ``changes`` set."""
    out = object.__new__(type(obj))
    fields = out.__dict__
    fields.update(obj.__dict__)
    fields.update(changes)
    return out


def _test_in_units(test: TestResult, regressions: dict[int, Regression]) -> TestResult:
    if test.regression is None:
        return test
    return _with(test, regression=regressions[id(test.regression)])


def level_in_units(level: LevelTests, scale: float) -> LevelTests:
    """Every regression of one difference level back in the series' units (the Φ tests
    share their ADF test's regression, and keep sharing it)."""
    if scale == 1.0:
        return level
    regressions: dict[int, Regression] = {}
    for test in [*level.adf.values(), *level.phi.values()]:
        if test.regression is not None and id(test.regression) not in regressions:
            regressions[id(test.regression)] = regression_in_units(test.regression, scale)
    return _with(
        level,
        adf={k: _test_in_units(t, regressions) for k, t in level.adf.items()},
        phi={k: _test_in_units(t, regressions) for k, t in level.phi.items()},
    )
