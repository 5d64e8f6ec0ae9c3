"""gather_evidence: the extra tests, the break date, the recursive statistic and the
plain reading of agreement and disagreement.

Data: simulated series with known truth (fixed seeds) and statsmodels'
macrodata dataset; the reference for every statistic is the module checked in
test_engine_evidence_reference.py (arch / statsmodels), and the engine's own
ADF regression (statsmodels OLS) for the recursive statistic.
"""

from __future__ import annotations

import json

import numpy as np
import pandas as pd
import pytest
from statsmodels.tsa.adfvalues import mackinnoncrit

from tauscope.engine.distributions.critical import tau_critical_value
from tauscope.engine.distributions.power import PowerResult
from tauscope.engine.procedure.cross_check import alternative_spec, settled_difference
from tauscope.engine.procedure.evidence import gather_evidence
from tauscope.engine.reading.evidence import combined_agreement, power_sentence, reading
from tauscope.engine.results import TestResult
from tauscope.engine.unitroot.adf import estimate
from tauscope.engine.unitroot.phillips_perron import phillips_perron
from tauscope.engine.unitroot.recursive import recursive_tau, recursive_tau_many
from tauscope.engine.unitroot.zivot_andrews import zivot_andrews


def _ar1(n: int, phi: float, seed: int) -> np.ndarray:
    rng = np.random.default_rng(seed)
    y = np.zeros(n)
    for t in range(1, n):
        y[t] = phi * y[t - 1] + rng.standard_normal()
    return y


def _level_shift_series() -> pd.Series:
    """Stationary AR(1) noise around a trend whose level jumps by 6 after March 2004."""
    n = 200
    values = 0.02 * np.arange(n) + np.where(np.arange(n) > 110, 6.0, 0.0) + _ar1(n, 0.5, 11)
    return pd.Series(values, index=pd.period_range("1995-01", periods=n, freq="M"))


def _test(name: str, reject: bool, difference: int = 0) -> TestResult:
    return TestResult(name, "trend", difference, -3.0 if reject else -1.0, 0.01 if reject else 0.5, 2, 100,
                      {"1%": -4.0, "5%": -3.4, "10%": -3.1}, reject, -3.4)


def _adf(spec: str, lags: int, nobs: int, reject: bool, difference: int = 0) -> TestResult:
    return TestResult("adf", spec, difference, -1.0, 0.5, lags, nobs, {}, reject, -2.9)


def test_level_shift_break_is_found_and_dated() -> None:
    series = _level_shift_series()
    evidence = gather_evidence(series.to_numpy(), series.index, order=1, deterministic="constant",
                               tests=("pp", "dfgls", "za"), break_model="c", lag_rule="aic",
                               deciding_adf=_adf("trend", 1, 198, False))
    assert [t.test for t in evidence.tests] == ["pp", "dfgls", "za"]
    za = evidence.find("za")
    assert za is not None and za.reject
    info = evidence.break_info
    assert info is not None
    assert info.position in range(109, 113)  # planted: last old value at position 110 (2004-03)
    assert info.first_new_label == str(series.index[info.position + 1])
    assert info.first_new_label in (evidence.reading or "")
    assert "Zivot-Andrews test rejects a unit root" in (evidence.reading or "")
    # p-values beyond the simulated tables read "below 0.001", never a rounded "below 0.00".
    assert za.p_value is not None and za.p_value < 0.001 and za.p_value_bound is None
    assert any("p below 0.001" in note for note in evidence.notes)
    assert not any("below 0.00;" in note for note in evidence.notes)
    assert evidence.spec == "trend" and evidence.difference == 0


def test_random_walk_agrees_and_reports_power() -> None:
    x = np.cumsum(np.random.default_rng(5).standard_normal(150))
    evidence = gather_evidence(x, order=1, deterministic="none", deciding_adf=_adf("none", 0, 149, False),
                               kpss_status="confirmed", reps=2_000)
    assert all(not t.reject for t in evidence.tests if t.test in ("pp", "dfgls"))
    assert evidence.agreement == "confirmed"
    assert "agree with the ADF test" in (evidence.reading or "")
    power = evidence.power
    assert power is not None and power.nobs == 149 and power.spec == "none"
    sentence = next(n for n in evidence.notes if n.startswith("How often"))
    assert f"{power.rate(0.95):.0%}" in sentence and "0.95" in sentence
    json.dumps(evidence.to_dict())
    json.dumps([t.to_dict() for t in evidence.tests])


def test_only_the_chosen_tests_run() -> None:
    x = _ar1(120, 0.5, 3)
    evidence = gather_evidence(x, order=0, deterministic="constant", tests=("pp",), power=False,
                               recursive=False)
    assert [t.test for t in evidence.tests] == ["pp"]
    assert evidence.break_info is None and evidence.power is None and evidence.recursive is None
    with pytest.raises(ValueError):
        gather_evidence(x, order=0, deterministic="constant", tests=("adf",))


def test_pp_in_evidence_is_the_pp_module_on_the_tested_difference() -> None:
    x = np.cumsum(np.cumsum(np.random.default_rng(8).standard_normal(160)))
    evidence = gather_evidence(x, order=2, deterministic="none", tests=("pp", "za"), power=False,
                               recursive=False, break_model="ct", lag_rule="fixed", lags=1)
    assert settled_difference(2) == 1 and evidence.difference == 1
    pp = evidence.find("pp")
    assert pp is not None and pp.difference == 1
    assert pp.statistic == pytest.approx(phillips_perron(np.diff(x), "constant").z_tau, abs=1e-12)
    info = evidence.break_info
    assert info is not None
    # A position in the first difference is one later in the levels.
    assert info.position == zivot_andrews(np.diff(x), "ct", 1).position + 1


def test_exact_critical_values_are_simulated_at_the_sample_size() -> None:
    x = _ar1(100, 0.7, 4)
    # Lag 0 for DF-GLS, so both sets of values describe the same regression.
    table = gather_evidence(x, order=0, deterministic="constant", tests=("pp", "dfgls"), power=False,
                            lag_rule="fixed", lags=0)
    exact = gather_evidence(x, order=0, deterministic="constant", tests=("pp", "dfgls"), power=False,
                            lag_rule="fixed", lags=0, critical_values="exact")
    pp_table, pp_exact = table.find("pp"), exact.find("pp")
    assert pp_table is not None and pp_exact is not None
    assert pp_table.statistic == pp_exact.statistic
    # Zτ's null law at lag 0 is τ's: the simulated values sit near MacKinnon (2010) at this size.
    for level in ("1%", "5%", "10%"):
        assert pp_exact.critical_values[level] == pytest.approx(pp_table.critical_values[level], abs=0.08)
    gls_table, gls_exact = table.find("dfgls"), exact.find("dfgls")
    assert gls_table is not None and gls_exact is not None
    assert gls_table.statistic == gls_exact.statistic
    # With the lag order fixed, both now describe the null at this length and lag (the
    # default from 50,000 draws, "exact" from 10^6), so they agree within Monte Carlo error;
    # in small samples they lie left of the Dickey-Fuller no-constant values they converge
    # to (Cheung & Lai 1995, from memory; MacKinnon 2010 via statsmodels at this size).
    assert gls_exact.critical_values["5%"] == pytest.approx(gls_table.critical_values["5%"], abs=0.02)
    assert gls_exact.critical_values["5%"] < float(mackinnoncrit(N=1, regression="n", nobs=99)[1])


def test_recursive_tau_equals_the_engine_on_each_window() -> None:
    rng = np.random.default_rng(9)
    x = np.cumsum(rng.standard_normal(90)) + 0.05 * np.arange(90)
    for spec, lags in (("trend", 2), ("constant", 0), ("none", 1)):
        path = recursive_tau(x, spec, lags)
        assert path.ends[-1] == 89 and path.nobs[-1] == 89 - lags
        for end, value, critical in list(zip(path.ends, path.statistics, path.critical_values, strict=True))[::7]:
            regression = estimate(x[: end + 1], spec, lags)
            assert value == pytest.approx(regression.tau, abs=1e-8)
            # MacKinnon (2010) via statsmodels' mackinnoncrit, through the engine's critical.py
            assert critical == pytest.approx(tau_critical_value(spec, regression.nobs, 0.05), abs=1e-12)


def test_batched_recursive_tau_equals_one_regression_per_window() -> None:
    """recursive_tau_many (one Cholesky factor per window, batched over series) against
    statsmodels OLS on each window (the engine's reference estimate), and against
    recursive_tau on rows whose early windows are fitted exactly (there: no τ, NaN)."""
    rng = np.random.default_rng(15)
    walks = np.cumsum(rng.standard_normal((5, 80)), axis=1)
    xs = np.vstack([walks, np.cumsum(walks, axis=1) / 10.0, walks + 0.3 * np.arange(80)])
    for spec, lags in (("trend", 2), ("constant", 1), ("none", 0)):
        paths = recursive_tau_many(xs, spec, lags, rows_per_call=4)
        for x, path in zip(xs, paths, strict=True):
            for end, value in list(zip(path.ends, path.statistics, strict=True))[::9]:
                assert value == pytest.approx(estimate(x[: end + 1], spec, lags).tau, abs=1e-8)
    # Exactly x_t − 1 = 0.5 (x_{t−1} − 1) for 40 periods, then a random walk: the first
    # windows are (all but) exact fits, which the factor leaves to the solves.
    decay = 1.0 + 0.5 ** np.arange(40.0)
    quiet = np.vstack([np.concatenate([decay, decay[-1] + np.cumsum(rng.standard_normal(40))])
                       for _ in range(2)])
    for path, x in zip(recursive_tau_many(quiet, "constant", 0), quiet, strict=True):
        alone = recursive_tau(x, "constant", 0)
        np.testing.assert_allclose(path.statistics, alone.statistics, rtol=1e-8, equal_nan=True)


def test_reading_when_adf_finds_a_unit_root_but_others_point_to_trend_stationarity() -> None:
    kpss = TestResult("kpss", "trend", 0, 0.08, 0.1, 4, 100, {}, False, 0.146, "above")
    text = reading(False, "trend", 0, 0.05, [_test("pp", False), _test("dfgls", True)], kpss, None)
    assert text is not None
    assert "does not reject a unit root" in text
    assert "DF-GLS and KPSS point to stationarity around a trend" in text
    assert "leans toward trend-stationarity" in text and "consider a break" in text


def test_reading_when_adf_rejects_but_others_do_not() -> None:
    text = reading(True, "constant", 0, 0.05, [_test("pp", False), _test("dfgls", False)], None, None)
    assert text is not None and "Phillips-Perron and DF-GLS do not" in text and "tentative" in text


@pytest.mark.parametrize(
    ("adf_stationary", "kpss_status", "rejects", "expected"),
    [
        (False, "confirmed", (False, False), "confirmed"),
        (False, "confirmed", (True, True), "inconclusive"),
        (False, "conflict", (True, True), "conflict"),
        (True, None, (True, True), "confirmed"),
        (True, "inconclusive", (True, True), "inconclusive"),
        (None, None, (True, False), "inconclusive"),
    ],
)
def test_combined_agreement(adf_stationary: bool | None, kpss_status: str | None,
                            rejects: tuple[bool, bool], expected: str) -> None:
    tests = [_test("pp", rejects[0]), _test("dfgls", rejects[1])]
    assert combined_agreement(adf_stationary, kpss_status, tests) == expected


@pytest.mark.parametrize(
    ("order", "deterministic", "spec"),
    [(0, "trend", "trend"), (0, "constant", "constant"), (0, "none", "none"), (1, "constant", "trend"),
     (1, "none", "constant"), (1, "trend", "trend"), (None, None, "trend")],
)
def test_alternative_spec(order: int | None, deterministic: str | None, spec: str) -> None:
    assert alternative_spec(order, deterministic) == spec


def test_untestable_extra_test_becomes_a_note_not_an_exception() -> None:
    x = np.r_[np.zeros(10), np.ones(10)] + 1e-3 * np.arange(20)
    evidence = gather_evidence(x, order=1, deterministic="none", tests=("pp", "dfgls", "za"), power=False,
                               recursive=False)
    assert len(evidence.problems) + len(evidence.tests) == 3
    for problem in evidence.problems:
        assert problem.startswith("The ") and "could not be computed" in problem


def test_power_sentence_says_how_informative_not_rejecting_is() -> None:
    weak = power_sentence(PowerResult("constant", 120, 2, 0.05, -2.89, (0.90, 0.95), (0.61, 0.24), 2_000))
    assert "against a coefficient of 0.95 it rejects only 24% of the time" in weak
    assert "against a coefficient of 0.90 it rejects 61% of the time" in weak
    assert "weak evidence" in weak and "constant only, 2 lags, 5%, 120 observations" in weak
    strong = power_sentence(PowerResult("trend", 600, 0, 0.05, -3.42, (0.90, 0.95), (1.0, 0.93), 2_000))
    assert "weak evidence" not in strong and "says more than usual" in strong
