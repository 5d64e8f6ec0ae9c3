"""Level ADF statistics against statsmodels' adfuller on statsmodels' macrodata.

Source: statsmodels.datasets.macrodata (US quarterly macro data 1959Q1-2009Q3,
an open dataset shipped with statsmodels); reference implementation:
statsmodels.tsa.stattools.adfuller.
"""

from __future__ import annotations

import numpy as np
import pytest
from statsmodels.datasets import macrodata
from statsmodels.tsa.stattools import adfuller

from tauscope.engine import Settings, analyse_series

SPEC_CODES = {"trend": "ct", "constant": "c", "none": "n"}


def _macro_series() -> dict[str, np.ndarray]:
    data = macrodata.load_pandas().data
    return {
        "log realgdp": np.log(data["realgdp"].to_numpy()),
        "infl": data["infl"].to_numpy(),
        "unemp": data["unemp"].to_numpy(),
        "tbilrate": data["tbilrate"].to_numpy(),
    }


MACRO = _macro_series()


@pytest.mark.parametrize("name", sorted(MACRO))
@pytest.mark.parametrize("rule", ["aic", "bic", "fixed"])
def test_level_adf_equals_statsmodels_adfuller(name: str, rule: str) -> None:
    x = MACRO[name]
    settings = Settings(lag_rule=rule, lags=3 if rule == "fixed" else None, max_difference=1)
    result = analyse_series(x, settings, name=name)
    assert result.error is None
    for spec, code in SPEC_CODES.items():
        ours = result.find("adf", spec, difference=0)
        assert ours is not None
        if rule == "fixed":
            ref = adfuller(x, maxlag=3, regression=code, autolag=None, result_object=True)
        else:
            # Same upper bound as ours (Schwert 1989: floor(12 (203/100)^(1/4)) = 14).
            assert result.max_lags == 14
            ref = adfuller(
                x, maxlag=result.max_lags, regression=code, autolag=rule.upper(), result_object=True
            )
        assert ours.lags == ref.lags
        assert ours.nobs == ref.nobs
        assert ours.statistic == pytest.approx(ref.statistic, abs=1e-8)
        assert ours.p_value == pytest.approx(ref.pvalue, abs=1e-8)
        for level in ("1%", "5%", "10%"):
            assert ours.critical_values[level] == pytest.approx(
                ref.critical_values[level], abs=1e-8
            )


def test_tsig_rule_matches_statsmodels_tstat_autolag() -> None:
    """General-to-specific (Ng & Perron 1995) at |t| >= 1.645: statsmodels' "t-stat" autolag
    uses the same stopping value on the same common sample."""
    x = MACRO["infl"]
    result = analyse_series(x, Settings(lag_rule="tsig", max_difference=0), name="infl")
    for spec, code in SPEC_CODES.items():
        ours = result.find("adf", spec)
        assert ours is not None
        ref = adfuller(
            x, maxlag=result.max_lags, regression=code, autolag="t-stat", result_object=True
        )
        assert ours.lags == ref.lags
        assert ours.statistic == pytest.approx(ref.statistic, abs=1e-8)


def test_levels_always_hold_all_three_specs() -> None:
    result = analyse_series(MACRO["log realgdp"], name="log realgdp")
    specs = {t.spec for t in result.tests if t.test == "adf" and t.difference == 0}
    assert specs == {"trend", "constant", "none"}
