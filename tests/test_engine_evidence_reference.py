"""Phillips-Perron, DF-GLS and Zivot-Andrews against reference libraries on the same data.

References (test-only): arch's ``PhillipsPerron`` and ``DFGLS`` (arch.unitroot),
statsmodels' ``zivot_andrews`` and ``kpss``.  Data: statsmodels' macrodata
dataset (log real GDP, inflation) and a simulated random walk with a fixed seed.

Conventions, documented where they matter:
* PP bandwidth: ours is chosen from the data by default (Newey & West 1994 in
  the form of Hobijn, Franses & Ooms 1998, the rule statsmodels' ``kpss`` uses
  for "auto"); arch's default is the fixed rule ⌈12 (n/100)^{1/4}⌉, so arch is
  given our bandwidth explicitly.  The bandwidth rule itself is checked
  against statsmodels' ``kpss`` on the same residuals.
* DF-GLS lag choice: arch has AIC and BIC on the OLS-detrended series (Perron &
  Qu 2007), as we do, but no MAIC; MAIC is checked by giving arch our lag.
* Zivot-Andrews model "t": statsmodels puts the kink of its trend-break term
  one observation before the break position it reports, so its statistic at
  reported position TB is ours at TB − 1, over a candidate range shifted by
  one; models "c" and "ct" use the same break terms up to terms already in
  the regression, so they match directly.
"""

from __future__ import annotations

import warnings
from typing import Any

import numpy as np
import pytest
import statsmodels.api as sm
from arch.unitroot import DFGLS as ArchDFGLS
from arch.unitroot import PhillipsPerron as ArchPP
from statsmodels.tools.sm_exceptions import InterpolationWarning
from statsmodels.tsa.stattools import kpss
from statsmodels.tsa.stattools import zivot_andrews as sm_zivot_andrews

from tauscope.engine.distributions.dfgls_values import surface_critical_values
from tauscope.engine.regression.lagchoice import choose_lag, detrend
from tauscope.engine.unitroot.dfgls import dfgls, dfgls_test, lag_criteria
from tauscope.engine.unitroot.phillips_perron import newey_west_bandwidth, phillips_perron, pp_test
from tauscope.engine.unitroot.zivot_andrews import (
    break_profile,
    za_critical_values,
    za_p_value,
    za_test,
    zivot_andrews,
)

TOL = 1e-6
ARCH_TREND: dict[str, Any] = {"none": "n", "constant": "c", "trend": "ct"}  # arch's trend codes


def _macro() -> dict[str, np.ndarray]:
    data = sm.datasets.macrodata.load_pandas().data  # statsmodels' macrodata dataset
    walk = np.cumsum(np.random.default_rng(20261201).standard_normal(180))
    return {
        "log real GDP": np.log(data["realgdp"].to_numpy()),
        "inflation": data["infl"].to_numpy(),
        "random walk": walk,
    }


SERIES = _macro()


@pytest.mark.parametrize("name", list(SERIES))
@pytest.mark.parametrize("spec", ["none", "constant", "trend"])
def test_phillips_perron_matches_arch(name: str, spec: str) -> None:
    x = SERIES[name]
    ours = phillips_perron(x, spec)
    # arch PhillipsPerron with the same bandwidth (see module docstring).
    tau = ArchPP(x, lags=ours.bandwidth, trend=ARCH_TREND[spec], test_type="tau")
    rho = ArchPP(x, lags=ours.bandwidth, trend=ARCH_TREND[spec], test_type="rho")
    assert ours.z_tau == pytest.approx(tau.stat, abs=TOL)
    assert ours.z_alpha == pytest.approx(rho.stat, abs=TOL)
    assert ours.nobs == tau.nobs


@pytest.mark.parametrize("bandwidth", [0, 3, 15])
def test_phillips_perron_fixed_bandwidth_matches_arch(bandwidth: int) -> None:
    x = SERIES["inflation"]
    ours = phillips_perron(x, "constant", bandwidth)
    assert ours.bandwidth == bandwidth
    assert ours.z_tau == pytest.approx(ArchPP(x, lags=bandwidth, trend="c").stat, abs=TOL)


@pytest.mark.parametrize("name", list(SERIES))
@pytest.mark.parametrize("regression", ["c", "ct"])
def test_automatic_bandwidth_matches_statsmodels_kpss(name: str, regression: str) -> None:
    x = SERIES[name]
    t = np.arange(1.0, x.shape[0] + 1.0)
    z = np.ones((x.shape[0], 1)) if regression == "c" else np.column_stack([np.ones_like(t), t])
    resid = x - z @ np.linalg.lstsq(z, x, rcond=None)[0]
    with warnings.catch_warnings():
        warnings.simplefilter("ignore", InterpolationWarning)
        lags = kpss(x, regression=regression, nlags="auto", result_object=True).lags  # statsmodels (HFO 1998)
    assert newey_west_bandwidth(resid) == lags


def test_pp_test_result_fields() -> None:
    x = SERIES["log real GDP"]
    result, details = pp_test(x, "trend", 0.05)
    assert result.test == "pp" and result.lags == details.bandwidth
    assert result.reject == (result.statistic < result.critical_values["5%"])
    assert 0.0 < (result.p_value or 0.0) < 1.0


@pytest.mark.parametrize("name", list(SERIES))
@pytest.mark.parametrize("spec", ["constant", "trend"])
@pytest.mark.parametrize("lags", [0, 2, 5])
def test_dfgls_fixed_lags_matches_arch(name: str, spec: str, lags: int) -> None:
    x = SERIES[name]
    ours = dfgls(x, spec, lags=lags)
    reference = ArchDFGLS(x, lags=lags, trend=ARCH_TREND[spec])  # arch DFGLS
    assert ours.statistic == pytest.approx(reference.stat, abs=TOL)
    assert ours.nobs == reference.nobs


@pytest.mark.parametrize("name", list(SERIES))
@pytest.mark.parametrize("spec", ["constant", "trend"])
@pytest.mark.parametrize(("rule", "max_lags"), [("aic", 12), ("bic", 8)])
def test_dfgls_lag_choice_matches_arch(name: str, spec: str, rule: Any, max_lags: int) -> None:
    x = SERIES[name]
    ours = dfgls(x, spec, rule, max_lags)
    reference = ArchDFGLS(x, trend=ARCH_TREND[spec], max_lags=max_lags, method=rule)  # arch DFGLS
    assert ours.lags == reference.lags
    assert ours.statistic == pytest.approx(reference.stat, abs=TOL)


@pytest.mark.parametrize("name", list(SERIES))
def test_dfgls_maic_statistic_matches_arch_at_the_chosen_lag(name: str) -> None:
    x = SERIES[name]
    ours = dfgls(x, "trend", "maic", 12)
    assert 0 <= ours.lags <= 12
    assert ours.statistic == pytest.approx(ArchDFGLS(x, lags=ours.lags, trend="ct").stat, abs=TOL)


def test_dfgls_constant_case_approaches_the_no_constant_dickey_fuller_values() -> None:
    # ERS (1996): the constant case has the Dickey-Fuller no-constant limit law, −1.94 at
    # 5% (MacKinnon 2010 "n" values via statsmodels; common practice).  The test now uses
    # finite-sample values at the series' own length (lag choice included), which for a
    # series of about 200 values lie within 0.03 of that limit.
    x = SERIES["inflation"]
    result, _ = dfgls_test(x, "constant", 0.05, max_lags=12)
    assert result.critical_values == surface_critical_values("constant", len(x))
    assert result.critical_values["5%"] == pytest.approx(-1.94, abs=0.03)
    assert result.test == "dfgls"


@pytest.mark.parametrize("name", list(SERIES))
@pytest.mark.parametrize("model", ["c", "ct"])
@pytest.mark.parametrize("lags", [1, 3])
def test_zivot_andrews_matches_statsmodels(name: str, model: str, lags: int) -> None:
    x = SERIES[name]
    stat, pvalue, crit, base_lags, position = sm_zivot_andrews(x, regression=model, maxlag=lags, autolag=None)
    ours = zivot_andrews(x, model, lags)
    assert base_lags == lags
    assert ours.statistic == pytest.approx(stat, abs=TOL)
    assert ours.position == position
    assert za_p_value(ours.statistic, model) == pytest.approx(pvalue, abs=1e-9)
    for level, value in za_critical_values(model).items():
        assert value == pytest.approx(crit[level], abs=1e-9)


@pytest.mark.parametrize("name", list(SERIES))
@pytest.mark.parametrize("lags", [1, 3])
def test_zivot_andrews_trend_break_matches_statsmodels_one_position_apart(name: str, lags: int) -> None:
    x = SERIES[name]
    stat, _, _, _, position = sm_zivot_andrews(x, regression="t", maxlag=lags, autolag=None)
    cut = int(0.15 * x.shape[0])
    shifted = np.arange(cut - 1, x.shape[0] - cut - 1)  # statsmodels' candidates, as our TB
    profile = break_profile(x, "t", lags, shifted)
    assert profile.min() == pytest.approx(stat, abs=TOL)
    assert shifted[int(np.argmin(profile))] == position - 1


@pytest.mark.parametrize("model", ["c", "ct"])
def test_zivot_andrews_with_aic_lag_matches_statsmodels_autolag(model: str) -> None:
    x = SERIES["log real GDP"]
    max_lags = 14  # statsmodels' default: int(12 (T/100)^{1/4}) for T = 203
    stat, _, _, base_lags, position = sm_zivot_andrews(x, regression=model, maxlag=max_lags, autolag="AIC")
    lag = choose_lag(x, "trend", "aic", max_lags).lag
    result, search = za_test(x, 0.05, model, lag)
    assert lag == base_lags
    assert result.statistic == pytest.approx(stat, abs=TOL)
    assert search.position == position


def test_zivot_andrews_finds_a_planted_level_shift() -> None:
    rng = np.random.default_rng(7)
    noise = np.zeros(160)
    for t in range(1, 160):
        noise[t] = 0.5 * noise[t - 1] + rng.standard_normal()
    x = 0.02 * np.arange(160) + np.where(np.arange(160) > 89, 6.0, 0.0) + noise
    result, search = za_test(x, 0.05, "c", 1)
    assert search.position in range(88, 92)  # true break: last old-regime value at position 89
    assert result.reject


@pytest.mark.parametrize("name", list(SERIES))
@pytest.mark.parametrize("spec", ["constant", "trend"])
@pytest.mark.parametrize("rule", ["maic", "aic", "bic", "hqc"])
def test_dfgls_lag_criteria_equal_the_engine_lag_rules(name: str, spec: str, rule: str) -> None:
    # Reference: the engine's lag rules (lagchoice.choose_lag, one statsmodels OLS per lag)
    # on the same OLS-detrended series, common sample of the largest lag (Ng & Perron 1995).
    detrended = detrend(SERIES[name], spec)
    reference = choose_lag(detrended, "none", rule, 10)
    ours = lag_criteria(detrended, rule, 10)
    np.testing.assert_allclose(ours, np.array(reference.criteria), rtol=0, atol=1e-9)
    assert int(np.argmin(ours)) == reference.lag
