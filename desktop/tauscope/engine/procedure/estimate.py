"""The estimate stage: every ADF and Φ test on every difference level, d = max … 0.

On each Δ^d y the lag order is chosen for each of the three specifications (the rule
of :mod:`tauscope.engine.regression.lagchoice`), τ is estimated on the longest sample
for that lag (Said & Dickey 1984; MacKinnon 2010 critical values) and Φ1, Φ2, Φ3 are
computed on the same sample and lags (Dickey & Fuller 1981).  The fast path estimates
each level for a whole batch of series of one length at once.  With exact critical
values every τ and Φ is judged against its null simulated at its own size.  The regressions
see the standardised series (:mod:`tauscope.engine.regression.scaling`); their numbers are
put back in the series' units (:mod:`tauscope.engine.procedure.units`).  When the
union of rejections decides, it is computed here too, for all series of one length at
once on the fast path (:mod:`tauscope.engine.procedure.union_estimate`).
"""

from __future__ import annotations

from dataclasses import replace
from functools import lru_cache

import numpy as np

from tauscope.engine.distributions.simulate import with_exact_values
from tauscope.engine.errors import UntestableSeries
from tauscope.engine.procedure.prepare import PreparedSeries
from tauscope.engine.procedure.stages import EstimateOptions, Estimates, Estimation
from tauscope.engine.regression.design import max_lag_cap, schwert_max_lag
from tauscope.engine.results import LevelTests


def max_lags_for(n: int, options: EstimateOptions) -> tuple[int, tuple[int, int] | None]:
    """The maximum lag order for a series of n values, and (wanted, used) if reduced."""
    return _max_lags(int(n), options.lag_rule, options.lags, options.max_lags)


@lru_cache(maxsize=1024)
def _max_lags(n: int, lag_rule: str, lags: int | None, max_lags: int | None) -> tuple[int, tuple[int, int] | None]:
    """:func:`max_lags_for`, kept per length and lag settings (asked per series and level)."""
    cap = max_lag_cap(n)
    if cap < 0:
        raise UntestableSeries(f"with {n} values there are too few observations for the regressions")
    if lag_rule == "fixed":
        assert lags is not None
        if lags > cap:
            raise UntestableSeries(
                f"a fixed lag order of {lags} is too large for {n} values (at most {cap})"
            )
        return lags, None
    wanted = max_lags if max_lags is not None else schwert_max_lag(n)
    if wanted > cap:
        return cap, (wanted, cap)
    return wanted, None


def estimate(prepared: PreparedSeries, options: EstimateOptions, estimation: Estimation) -> Estimates:
    """The tests on Δ^d y for d = max_difference … 0 (Dickey & Pantula 1987 order)."""
    x = prepared.standardised  # y / s (exact): the regressions' numbers are put back in units below
    levels: dict[int, LevelTests] = {}
    max_lags: dict[int, int] = {}
    reduced: tuple[int, int] | None = None
    for d in range(options.max_difference, -1, -1):
        xd = prepared.level(d)  # Δ^d y, its fixed seasonal means removed when allowed for
        if np.ptp(xd) == 0:
            raise UntestableSeries(
                f"its {'first' if d == 1 else 'second'} difference is constant, so the series is an exact "
                "deterministic path with nothing random to test"
            )
        max_lags[d], cut = max_lags_for(xd.shape[0], options)
        if d == 0:
            reduced = cut
        levels[d] = _judged(estimation.level_tests(xd, d, options, max_lags[d], prepared.scale), options)
    union = None
    if options.union:
        union = estimation.union(x, options, prepared.dummies_period)
        if union.problem is not None:
            raise UntestableSeries(union.problem)
    return Estimates(prepared, levels, max_lags, reduced, union)


def _judged(level: LevelTests, options: EstimateOptions) -> LevelTests:
    """With exact critical values, every τ and Φ is judged against its null simulated at
    its own regression size and lag order (:mod:`tauscope.engine.distributions.simulate`)."""
    if not options.exact:
        return level
    return replace(
        level,
        adf={k: with_exact_values(t, options.alpha) for k, t in level.adf.items()},
        phi={k: with_exact_values(t, options.alpha) for k, t in level.phi.items()},
    )
