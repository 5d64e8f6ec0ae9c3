"""The size-controlled strategy wired into the engine (issue 13): the union of rejections
(Harvey, Leybourne & Taylor 2009, 2012) decides by default, the classic sequence is shown
beside it, both paths and both entry points give the same numbers.

Outside reference: statsmodels' macrodata (log US real GDP, quarterly 1959-2009), which
issue 13 measured as "I(0), stationary around a mean" under the old default."""

from __future__ import annotations

import numpy as np
import pandas as pd
import pytest

from tauscope.engine import Settings, analyse_series
from tauscope.engine.procedure import union_estimate
from tauscope.engine.procedure.many import analyse_many
from tauscope.engine.unitroot import union as union_module


def _log_gdp() -> pd.Series:
    from statsmodels.datasets import macrodata

    y = np.log(macrodata.load_pandas().data["realgdp"].to_numpy())
    return pd.Series(y, index=pd.period_range("1959Q1", periods=y.shape[0], freq="Q"))


def test_log_real_gdp_is_i1_with_drift_and_the_classic_path_is_shown() -> None:
    result = analyse_series(_log_gdp(), name="log real GDP")
    d = result.to_dict()
    assert d["verdict"]["strategy"] == "union"
    assert (d["verdict"]["order"], d["verdict"]["deterministic"]) == (1, "constant")
    # The classic sequence is shown in full after the union's steps.
    classic_steps = [s for s in d["steps"] if s["strategy"] == "classic"]
    assert [s["statistic_name"] for s in classic_steps if s["difference"] == 0][:2] == ["tau", "phi3"]
    assert d["classic"] is not None and d["classic"]["order"] is not None
    if (d["classic"]["order"], d["classic"]["deterministic"]) != (1, "constant"):
        assert any(n.startswith(("The strategies disagree", "The two strategies agree on the order"))
                   for n in d["notes"])
        assert any("trust" in n for n in d["notes"])
    # The union's own path: the levels are not rejected, the first difference is.
    union_steps = [s for s in d["steps"] if s["statistic_name"] == "union"]
    assert [(s["difference"], s["decision"]) for s in union_steps] == [
        (2, "reject"), (1, "reject"), (0, "do not reject")]
    trend = [s for s in d["steps"] if s["statistic_name"] == "trend"]
    assert len(trend) == 1 and trend[0]["decision"] == "reject"  # a drift


def test_settings_strategy_is_validated_and_recorded() -> None:
    assert Settings().strategy == "union" and Settings().lag_rule == "maic"
    assert Settings(strategy="classic").to_dict()["strategy"] == "classic"
    assert Settings.from_dict(Settings(strategy="classic").to_dict()).strategy == "classic"
    with pytest.raises(ValueError, match="strategy"):
        Settings(strategy="vote")


def test_classic_strategy_has_no_union_steps_and_no_classic_block() -> None:
    walk = np.cumsum(np.random.default_rng(3).standard_normal(150))
    result = analyse_series(walk, Settings(strategy="classic"))
    assert result.verdict.strategy == "classic" and result.classic is None
    assert {s.strategy for s in result.steps} == {"classic"}
    assert not [t for t in result.tests if t.test == "dfgls"]


def _series() -> list[tuple[str, np.ndarray]]:
    rng = np.random.default_rng(20261202)
    out = []
    for i in range(5):
        e = rng.standard_normal(130)
        out.append((f"walk {i}", np.cumsum(0.2 * i + e)))
        y = np.empty(130)
        y[0] = e[0]
        for t in range(1, 130):
            y[t] = 0.6 * y[t - 1] + e[t]
        out.append((f"ar {i}", 3.0 + 0.02 * i * np.arange(130) + y))
    out.append(("short", np.cumsum(rng.standard_normal(90))))
    return out


def _same(a: object, b: object, where: str = "") -> None:
    """Equal trees; numbers to 1e-8 (batched sums differ in the last bits)."""
    if isinstance(a, dict):
        assert isinstance(b, dict) and set(a) == set(b), where
        for key in a:
            _same(a[key], b[key], f"{where}.{key}")
    elif isinstance(a, list):
        assert isinstance(b, list) and len(a) == len(b), where
        for i, (x, y) in enumerate(zip(a, b, strict=True)):
            _same(x, y, f"{where}[{i}]")
    elif isinstance(a, float) and not isinstance(b, bool):
        assert b == pytest.approx(a, abs=1e-8, nan_ok=True), where
    else:
        assert a == b, where


def test_analyse_many_equals_analyse_series_and_the_reference_path() -> None:
    series = _series()
    many = analyse_many(series)
    for (name, values), batched in zip(series, many, strict=True):
        alone = analyse_series(values, name=name)
        reference = analyse_series(values, name=name, path="reference")
        _same(batched.to_dict(), alone.to_dict())
        for other in (alone, reference):
            assert other.verdict == batched.verdict and other.classic == batched.classic
            for a, b in zip(batched.steps, other.steps, strict=True):
                assert (a.strategy, a.statistic_name, a.decision) == (b.strategy, b.statistic_name, b.decision)
                assert a.statistic == pytest.approx(b.statistic, abs=1e-8)


def test_a_statistic_that_is_not_a_number_is_an_error_not_a_silent_non_rejection(
        monkeypatch: pytest.MonkeyPatch) -> None:
    real = union_module.union_orders

    def broken(*args: object, **kwargs: object) -> union_module.UnionOrders:
        result = real(*args, **kwargs)  # type: ignore[arg-type]
        level = result.levels[0]
        nan = np.full_like(level.margin, np.nan)
        levels = dict(result.levels)
        levels[0] = union_module.UnionLevel(0, level.tau, level.lags, level.constants, nan,
                                            np.zeros_like(level.reject))
        order = union_module.orders_from_rejections({d: v.reject for d, v in levels.items()}, 2)
        return union_module.UnionOrders(order, result.deterministic, result.trend_z, levels)

    monkeypatch.setattr(union_estimate, "union_orders", broken)
    result = analyse_series(np.cumsum(np.random.default_rng(4).standard_normal(120)), name="walk")
    assert result.error is not None and "not a number" in result.error
    assert result.verdict.order is None
