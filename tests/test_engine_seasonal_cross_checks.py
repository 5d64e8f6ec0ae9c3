"""KPSS and the extra cross-checks (Phillips-Perron, DF-GLS, Zivot-Andrews) see the series
the ADF regressions see: with its fixed seasonal means removed when the tests allow for
them (issue 14; Dickey, Bell & Miller 1986 for the removal).

References: the engine's own single tests on the adjusted series
(``seasonal.means.remove_seasonal_means``; KPSS itself is checked against statsmodels in
its own tests); the size of KPSS (Kwiatkowski, Phillips, Schmidt & Shin 1992) at 5%.
"""

from __future__ import annotations

import numpy as np
import pandas as pd
import pytest

from tauscope.engine import Settings, analyse_series
from tauscope.engine.procedure.prepare import prepare
from tauscope.engine.seasonal.means import remove_seasonal_means
from tauscope.engine.unitroot.dfgls import dfgls_test
from tauscope.engine.unitroot.kpss_fast import kpss_fast
from tauscope.engine.unitroot.phillips_perron import pp_test
from tauscope.engine.unitroot.zivot_andrews import za_test

_EFFECTS = np.array([3.0, -1.0, 2.0, -4.0, 1.0, 2.0, -2.0, 0.0, 4.0, -3.0, 1.0, -3.0])


def _monthly_seasonal_ar(rng: np.random.Generator, n: int, size: float = 1.0) -> pd.Series:
    """A stationary AR(0.5) around strong fixed monthly means (up to four shock s.d.)."""
    u = np.zeros(n + 100)
    e = rng.standard_normal(n + 100)
    for t in range(1, n + 100):
        u[t] = 0.5 * u[t - 1] + e[t]
    x = 10.0 + size * np.resize(_EFFECTS - _EFFECTS.mean(), n) + u[100:]
    return pd.Series(x, index=pd.period_range("1990-01", periods=n, freq="M"))


def test_kpss_and_the_extra_tests_see_the_adjusted_series() -> None:
    x = _monthly_seasonal_ar(np.random.default_rng(41), 150)
    settings = Settings(seasonal="automatic", confirm=("kpss", "pp", "dfgls", "za"))
    result = analyse_series(x, settings)
    assert result.seasonal is not None and result.seasonal.means is not None
    assert result.seasonal.means.used
    assert result.verdict.order == 0
    adjusted = np.asarray(remove_seasonal_means(prepare(x).standardised, 12))
    kpss = result.find("kpss", difference=0)
    assert kpss is not None
    assert kpss.statistic == pytest.approx(kpss_fast(adjusted, kpss.spec, 0, 0.05).statistic, rel=1e-10)
    # the raw series would give another KPSS statistic: the check is not vacuous
    raw = np.asarray(prepare(x).standardised)
    assert abs(kpss.statistic - kpss_fast(raw, kpss.spec, 0, 0.05).statistic) > 1e-3
    evidence = result.evidence
    assert evidence is not None
    spec = evidence.spec
    pp = evidence.find("pp")
    assert pp is not None
    assert pp.statistic == pytest.approx(pp_test(adjusted, spec, 0.05)[0].statistic, rel=1e-10)
    gls = evidence.find("dfgls")
    assert gls is not None
    expected_gls, _ = dfgls_test(adjusted, "constant" if spec == "none" else spec, 0.05,
                                 lag_rule="fixed", lags=gls.lags, max_lags=gls.lags)
    assert gls.statistic == pytest.approx(expected_gls.statistic, rel=1e-10)
    za = evidence.find("za")
    assert za is not None
    expected_za, _ = za_test(adjusted, 0.05, settings.break_model, za.lags)
    assert za.statistic == pytest.approx(expected_za.statistic, rel=1e-10)


def test_kpss_does_not_depend_on_the_size_of_the_seasonal_means() -> None:
    # Removing the seasonal means is an exact projection, so with them allowed for, KPSS
    # and the verdict are the same whatever their size (here 0, 1 and 5 times four shock
    # s.d. at most), as they would be for the noise alone; on the raw series the seasons
    # change KPSS. Measured while building this (KPSS at 5% on 400 AR(0.5) series of 150
    # directly): 8.5% rejections on the adjusted levels whatever the means' size; on the raw
    # levels 5.5% with these means and 1% with means twice as large (the seasons inflate
    # the long-run variance, so the raw KPSS loses its power, not its size)
    # 240 months: every verdict here must be I(0) for the comparison of KPSS on the levels;
    # at 150 the size-controlled default (DF-GLS + MSB) called one raw series I(1)
    for seed in (43, 44):
        noise = _monthly_seasonal_ar(np.random.default_rng(seed), 240, size=0.0)
        seasons = _monthly_seasonal_ar(np.random.default_rng(seed), 240, size=1.0) - noise
        allowed, raw = [], []
        for size in (0.0, 1.0, 5.0):
            x = noise + size * seasons
            for mode, out in (("always", allowed), ("never", raw)):
                result = analyse_series(x, Settings(seasonal=mode))
                kpss = result.find("kpss", difference=0)
                assert kpss is not None and result.verdict.order == 0
                out.append(kpss)
        first = allowed[0]
        for other in allowed[1:]:
            assert other.statistic == pytest.approx(first.statistic, rel=1e-8)
            assert other.reject == first.reject
        assert raw[2].statistic != pytest.approx(raw[0].statistic, rel=1e-3)

