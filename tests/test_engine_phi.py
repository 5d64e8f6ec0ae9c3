"""Φ1, Φ2, Φ3 (Dickey & Fuller 1981) against an independent restricted/unrestricted
computation with statsmodels OLS (statsmodels.regression.linear_model.OLS,
statsmodels.tsa.tsatools.lagmat) on statsmodels' macrodata."""

from __future__ import annotations

import numpy as np
import pytest
from statsmodels.datasets import macrodata
from statsmodels.regression.linear_model import OLS
from statsmodels.tsa.tsatools import lagmat

from tauscope.engine import Settings, analyse_series


def _independent_phi(x: np.ndarray, lags: int, name: str) -> float:
    dx = np.diff(x)
    lagged = (
        lagmat(dx[:, None], lags, trim="both", original="sep")[0]
        if lags
        else np.empty((dx.size, 0))
    )
    y = dx[lags:]
    n = y.size
    ylag = x[lags:-1]
    const = np.ones(n)
    trend = np.arange(n, dtype=float)  # any origin: F is invariant to it
    if name == "phi1":
        unrestricted = np.column_stack([const, ylag, lagged])
        restricted = lagged
        q = 2
    elif name == "phi2":
        unrestricted = np.column_stack([const, trend, ylag, lagged])
        restricted = lagged
        q = 3
    else:
        unrestricted = np.column_stack([const, trend, ylag, lagged])
        restricted = np.column_stack([const, lagged])
        q = 2
    fit_u = OLS(y, unrestricted).fit()
    rss_r = float(y @ y) if restricted.shape[1] == 0 else OLS(y, restricted).fit().ssr
    return ((rss_r - fit_u.ssr) / q) / (fit_u.ssr / fit_u.df_resid)


@pytest.mark.parametrize("column", ["realgdp", "infl", "tbilrate"])
@pytest.mark.parametrize("rule", ["aic", "fixed"])
def test_phi_statistics_equal_independent_ols(column: str, rule: str) -> None:
    data = macrodata.load_pandas().data[column].to_numpy()
    x = np.log(data) if column == "realgdp" else data
    result = analyse_series(
        x, Settings(lag_rule=rule, lags=2 if rule == "fixed" else None, max_difference=0)
    )
    for name in ("phi1", "phi2", "phi3"):
        ours = result.find(name, difference=0)
        assert ours is not None
        expected = _independent_phi(x, ours.lags, name)
        assert ours.statistic == pytest.approx(expected, rel=1e-10, abs=1e-8)
        assert ours.p_value is None
