"""The result objects of the fast path: one series' ADF and Φ tests from a batch's arrays
(:class:`LevelBatch`), the same objects the reference path builds
(:mod:`tauscope.engine.reference`)."""

from __future__ import annotations

import math
from dataclasses import dataclass, field
from functools import lru_cache, partial

import numpy as np

from tauscope.engine.distributions import tables as fast_tables
from tauscope.engine.regression.design import DETERMINISTIC_TERMS, column_names
from tauscope.engine.regression.nested import Estimates, LagChoices
from tauscope.engine.results import Coefficient, TestResult
from tauscope.engine.results_build import new_regression, new_test_result
from tauscope.engine.unitroot import phi as joint


@dataclass
class LevelBatch:
    """Everything the sequence needs on Δ^d y for a batch of series of one length."""

    difference: int
    max_lags: int
    n: int
    first_rows: np.ndarray  # (B, p, K+1): the rows before the common sample (full design)
    common: dict[str, np.ndarray]
    choices: dict[str, LagChoices]
    estimates: dict[str, Estimates]
    phi: dict[str, np.ndarray]
    declined: np.ndarray  # (B,) bool: the reference path must take these
    centres: np.ndarray  # (B,): y(t−1) is measured from these in the specs with a constant
    # Each spec's numbers as Python lists, made for every series at the first request.
    rows: dict[str, SpecRows] = field(default_factory=dict, repr=False)

    phi_rows: dict[str, list[float]] = field(default_factory=dict, repr=False)

    def spec_rows(self, spec: str) -> SpecRows:
        found = self.rows.get(spec)
        if found is None:
            found = self.rows[spec] = SpecRows.of(self.estimates[spec], self.choices[spec], spec)
        return found

    def phi_statistics(self, name: str) -> list[float]:
        """Φ ``name`` of every series, F = ((RSS_r − RSS_u)/q) / (RSS_u/(n − k)) (the formula
        of :func:`joint.f_statistic`, elementwise: the same IEEE operations as one by one)."""
        found = self.phi_rows.get(name)
        if found is None:
            est = self.estimates[joint.PHI_SPEC[name]]
            q = len(joint.RESTRICTED_OUT[name])
            with np.errstate(all="ignore"):
                statistic = ((self.phi[name] - est.rss) / q) / (est.rss / (est.nobs - est.used))
            found = self.phi_rows[name] = statistic.tolist()
        return found


@dataclass(frozen=True)
class SpecRows:
    """One spec's estimates for every series of a batch, made once, not row by row: the t
    ratios params/bse and τ's MacKinnon (1994) p-value computed elementwise in numpy (the
    same IEEE operations as one by one), the per-series numbers as Python lists, made by one
    ``tolist`` per array (a row's leading entries are the very numbers its coefficients hold;
    the rest live as long as the chunk's batch)."""

    nobs: list[int]
    rss: list[float]
    params: list[list[float]]
    bse: list[list[float]]
    t: list[list[float]]
    p_value: list[float]
    zero_se: list[bool]  # a coefficient's standard error is 0: its t ratio divides by zero
    lags: list[int]  # the chosen lag
    criteria: list[list[float]]  # the lag criteria, by lag

    @classmethod
    def of(cls, est: Estimates, choices: LagChoices, spec: str) -> SpecRows:
        terms = len(DETERMINISTIC_TERMS[spec])
        with np.errstate(all="ignore"):
            t = est.params / est.bse
        inside = np.arange(est.bse.shape[1])[None, :] < est.used[:, None]
        zero = ((est.bse == 0.0) & inside).any(axis=1)
        return cls(est.nobs.tolist(), est.rss.tolist(), est.params.tolist(), est.bse.tolist(), t.tolist(),
                   fast_tables.tau_p_values(t[:, terms], spec).tolist(), zero.tolist(),
                   choices.lags.tolist(), choices.criteria.tolist())


_column_names = lru_cache(maxsize=512)(column_names)
# Coefficient(*row) without the named tuple's own __new__ in Python: about 0.1 µs each less.
_new_coefficient = partial(tuple.__new__, Coefficient)
_NO_DESIGN = np.empty((0, 0))
_NO_RESPONSE = np.empty(0)
_NO_DESIGN.flags.writeable = False
_NO_RESPONSE.flags.writeable = False


def _criteria_in_units(choices: LagChoices, row: list[float], lag: int, nobs: int,
                       scale: float) -> tuple[float, ...]:
    """The lag criteria in the series' units, as :func:`regression_in_units` shifts them."""
    if scale == 1.0:
        return tuple(row)
    log_s2 = 2.0 * math.log(scale)
    if choices.rule in ("aic", "bic", "hqc"):
        shift = (nobs + lag - choices.max_lags) * log_s2
        return tuple([v + shift for v in row])  # one IEEE addition each, as in numpy
    if choices.rule == "maic":
        return tuple([v + log_s2 for v in row])
    return tuple(row)


def adf_result(level: LevelBatch, spec: str, i: int, alpha: float, scale: float) -> TestResult:
    """One series' ADF test on Δ^d y, its regression in the series' units (``scale``: the
    standardising power of two, :mod:`tauscope.engine.procedure.units`): the same numbers
    as :func:`regression_in_units` gives for the standardised regression, without
    building it first.  The coefficients in units: the deterministic terms' estimates and
    standard errors × ``scale`` (exact, a power of two), every t ratio as fitted."""
    rows = level.spec_rows(spec)
    if rows.zero_se[i]:
        raise ZeroDivisionError("a coefficient's standard error is zero")
    choices = level.choices[spec]
    lags = rows.lags[i]
    nobs = rows.nobs[i]
    rss = rows.rss[i]
    names = _column_names(spec, lags)
    used = len(names)
    params, bse, t = rows.params[i][:used], rows.bse[i][:used], rows.t[i][:used]
    terms = len(DETERMINISTIC_TERMS[spec])
    if scale != 1.0 and terms:
        params = [v * scale for v in params[:terms]] + params[terms:]
        bse = [v * scale for v in bse[:terms]] + bse[terms:]
    coefficients = tuple(map(_new_coefficient, zip(names, params, bse, t, strict=True)))
    sigma2 = rss / (nobs - used)
    # new_regression and new_test_result: the constructors' objects, faster (results_build).
    regression = new_regression(
        spec, level.difference, lags, choices.rule, choices.max_lags, nobs, lags + 1, coefficients,
        sigma2 if scale == 1.0 else sigma2 * scale * scale,
        rss if scale == 1.0 else rss * scale * scale,
        _criteria_in_units(choices, rows.criteria[i], lags, nobs, scale),
        _NO_DESIGN,  # the design and response are not kept: the results of many series would
        _NO_RESPONSE,  # hold every design
    )
    tau = t[terms]
    critical_values = fast_tables.tau_critical_values(spec, nobs)
    critical = critical_values[fast_tables.level_label(alpha)]
    return new_test_result("adf", spec, level.difference, tau, rows.p_value[i], lags, nobs,
                           critical_values, bool(tau < critical), critical, None, choices.rule,
                           regression)


def phi_result(level: LevelBatch, adf: TestResult, name: str, i: int, alpha: float) -> TestResult:
    """Φ from the batch's restricted and unrestricted RSS of the standardised series
    (:meth:`LevelBatch.phi_statistics`; F does not depend on the scale); its regression is
    the ADF test's, in the series' units."""
    regression = adf.regression
    assert regression is not None
    if level.spec_rows(regression.spec).rss[i] == 0.0:
        raise ZeroDivisionError("the unrestricted regression fits perfectly")
    return joint.phi_result(regression, name, level.phi_statistics(name)[i], alpha)
