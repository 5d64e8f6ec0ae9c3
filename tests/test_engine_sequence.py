"""The decision path of the testing sequence (Dolado, Jenkinson & Sosvilla-Rivero 1990)
and the order of integration from the highest difference down (Dickey & Pantula 1987),
checked on simulated series whose truth is known (fixed seeds)."""

from __future__ import annotations

import json

import numpy as np
import pytest

from tauscope.engine import Settings, analyse_series
from tauscope.engine.distributions.critical import normal_lower


def _ar1(rng: np.random.Generator, n: int, phi: float) -> np.ndarray:
    y = np.zeros(n)
    e = rng.standard_normal(n)
    for t in range(1, n):
        y[t] = phi * y[t - 1] + e[t]
    return y


def test_trend_stationary_path_stops_after_trend_t() -> None:
    rng = np.random.default_rng(7)
    x = 2.0 + 0.1 * np.arange(200) + _ar1(rng, 200, 0.3)
    result = analyse_series(x, Settings(max_difference=0, strategy="classic", lag_rule="aic"))
    names = [(s.statistic_name, s.spec, s.decision) for s in result.steps]
    assert names == [("tau", "trend", "reject"), ("z", "trend", "reject")]
    assert result.verdict.order == 0
    assert result.verdict.deterministic == "trend"
    assert result.verdict.unit_root is False


def test_random_walk_with_drift_path_ends_with_normal_test() -> None:
    rng = np.random.default_rng(8)
    x = np.cumsum(1.0 + rng.standard_normal(200))
    result = analyse_series(x, Settings(max_difference=1, strategy="classic", lag_rule="aic"))
    levels = [s for s in result.steps if s.difference == 0]
    assert [s.statistic_name for s in levels] == ["tau", "phi3", "tau", "phi1", "z"]
    last = levels[-1]
    assert last.critical_value == pytest.approx(normal_lower(0.05))
    assert last.decision == "do not reject"
    assert result.verdict.order == 1
    assert result.verdict.deterministic == "constant"
    assert result.verdict.label == "I(1) \u2014 unit root with drift"
    # The first difference was tested before the levels (highest difference first).
    assert result.steps[0].difference == 1


def test_i2_stops_at_first_difference() -> None:
    rng = np.random.default_rng(9)
    x = np.cumsum(np.cumsum(rng.standard_normal(200)))
    result = analyse_series(x)
    assert result.steps[0].difference == 2
    assert result.verdict.order == 2
    assert all(s.difference in (1, 2) for s in result.steps)
    # Levels ADF for all three specs is always present.
    assert {t.spec for t in result.tests if t.test == "adf" and t.difference == 0} == {
        "trend",
        "constant",
        "none",
    }


def test_unresolved_when_max_difference_is_zero_and_unit_root_not_rejected() -> None:
    rng = np.random.default_rng(10)
    x = np.cumsum(rng.standard_normal(150))
    result = analyse_series(x, Settings(max_difference=0))
    assert result.verdict.order is None
    assert result.verdict.unit_root is True
    assert "unresolved" in result.verdict.text


def test_to_dict_contract_keys_and_json() -> None:
    rng = np.random.default_rng(11)
    result = analyse_series(np.cumsum(rng.standard_normal(120)), name="real output")
    d = json.loads(json.dumps(result.to_dict()))
    assert {"name", "nobs", "error", "verdict", "steps", "tests", "notes"} <= set(d)
    assert set(d["verdict"]) >= {"order", "deterministic", "unit_root", "agreement", "text"}
    step_keys = {
        "difference",
        "spec",
        "hypothesis",
        "statistic_name",
        "statistic",
        "critical_value",
        "p_value",
        "decision",
        "text",
    }
    assert all(step_keys | {"strategy"} <= set(s) for s in d["steps"])
    test_keys = {
        "test",
        "spec",
        "difference",
        "statistic",
        "p_value",
        "lags",
        "nobs",
        "critical_values",
        "reject",
    }
    assert all(test_keys <= set(t) for t in d["tests"])
    assert all(set(t["critical_values"]) >= {"1%", "5%", "10%"} for t in d["tests"])
    assert d["verdict"]["agreement"] in ("confirmed", "conflict", "inconclusive")
    assert d["verdict"]["strategy"] == "union"  # the default (DESIGN §3)
    assert set(d["classic"]) >= {"order", "deterministic", "text"}
    for s in d["steps"]:
        assert s["decision"] in ("reject", "do not reject")
        assert s["strategy"] in ("union", "classic")
        names = ("tau", "phi1", "phi2", "phi3", "z") if s["strategy"] == "classic" else (
            "dfgls", "msb", "union", "trend")
        assert s["statistic_name"] in names
        if s["test_index"] is not None:
            assert d["tests"][s["test_index"]]["difference"] == s["difference"]
        else:  # only the union's own steps have no single test behind them
            assert s["strategy"] == "union" and s["statistic_name"] in ("msb", "union", "trend")
    # The union's steps come first, then the classic path, each in its own order.
    kinds = [s["strategy"] for s in d["steps"]]
    assert kinds == sorted(kinds, key=lambda k: k != "union")


def test_notes_never_accept_the_null_and_carry_the_caution() -> None:
    rng = np.random.default_rng(12)
    result = analyse_series(np.cumsum(rng.standard_normal(40)), name="short walk")
    text = " ".join(result.notes + tuple(s.text for s in result.steps)).lower()
    assert "accept" not in text
    assert "aid to judgement" in text
    assert "only 40 observations" in text
    assert "not proof" in text


def test_lag_sensitivity_is_reported() -> None:
    rng = np.random.default_rng(13)
    result = analyse_series(5 + _ar1(rng, 160, 0.6))
    assert result.lag_profile
    assert [p.lag for p in result.lag_profile] == list(range(len(result.lag_profile)))
    assert any("lag order" in n for n in result.notes)


def test_level_shift_is_flagged_with_its_date() -> None:
    import pandas as pd

    rng = np.random.default_rng(14)
    x = 100 + _ar1(rng, 120, 0.4) * 2
    x[60:] -= 40
    series = pd.Series(x, index=pd.period_range("1990Q1", periods=120, freq="Q"))
    result = analyse_series(series, name="landings")
    assert any("2005Q1" in n and "Perron 1989" in n for n in result.notes)


@pytest.mark.filterwarnings("ignore:The test statistic is outside of the range:UserWarning")
def test_kpss_matches_statsmodels() -> None:
    """KPSS statistic against statsmodels.tsa.stattools.kpss (reference library; its p-value,
    not compared here, is past its look-up table for this series, which it warns about)."""
    from statsmodels.tsa.stattools import kpss

    rng = np.random.default_rng(15)
    x = 3 + _ar1(rng, 150, 0.5)
    result = analyse_series(x)
    test = result.find("kpss", difference=0)
    assert test is not None
    ref = kpss(
        x, regression="ct" if test.spec == "trend" else "c", nlags="auto", result_object=True
    )
    assert test.statistic == pytest.approx(ref.statistic, abs=1e-10)
    assert test.lags == ref.lags


def test_stationarity_from_the_drift_normal_step_is_flagged_as_weak() -> None:
    """statsmodels' macrodata, log real GDP, classic sequence with AIC lags (issue 13's
    figures): τ_τ and τ_μ do not reject, Φ1 finds a drift and τ_μ is then judged against the
    normal (West 1988), which rejects.  A drifting series is not stationary around a mean:
    the sequence's conclusion is trend-stationary, marked weak in the verdict, the step and
    the notes."""
    from statsmodels.datasets import macrodata

    x = np.log(macrodata.load_pandas().data["realgdp"].to_numpy())
    result = analyse_series(x, Settings(strategy="classic", lag_rule="aic"), name="log realgdp")
    levels = [s for s in result.steps if s.difference == 0]
    assert [s.statistic_name for s in levels] == ["tau", "phi3", "tau", "phi1", "z"]
    assert [s.decision for s in levels] == ["do not reject", "do not reject", "do not reject", "reject",
                                            "reject"]
    assert result.verdict.order == 0
    assert result.verdict.deterministic == "trend"
    assert "around a mean" not in result.verdict.text
    assert "trend-stationary" in result.verdict.label and "weak" in result.verdict.label
    assert "This conclusion is weak" in result.verdict.text
    assert "weak" in levels[-1].text
    assert any("read this verdict as weak" in n for n in result.notes)


def test_numbers_read_as_a_reader_would_copy_them() -> None:
    from tauscope.engine import formatting as fmt

    assert fmt.stat(-1.8) == "\u22121.80"
    assert fmt.stat(-1e-15) == "0.00"
    assert fmt.p_value(0.0312) == "0.031"
    assert fmt.p_value(0.0004) == "below 0.001"
    assert fmt.p_value(0.01, "below") == "below 0.01"
    assert fmt.p_value(0.10, "above") == "above 0.10"
