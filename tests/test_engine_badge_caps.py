"""What keeps the badge below "confirmed" besides the grade's own checks (issue 14): a
seasonal unit root found (HEGY 1990 / Beaulieu & Miron 1993), whichever strategy decided,
and a change in the shocks' variance (κ2, Sansó, Aragó & Carrion 2004), which
``to_dict()["variance"]`` now carries as plain data."""

from __future__ import annotations

import json
from types import SimpleNamespace
from typing import cast

import numpy as np
import pandas as pd

from tauscope.engine import Settings, analyse_series
from tauscope.engine.procedure.read import _classic_capped
from tauscope.engine.procedure.stages import CrossCheck


def _quarterly_seasonal_walk(seed: int, n: int = 200) -> pd.Series:
    e = np.random.default_rng(seed).standard_normal(n)
    y = e.copy()
    for t in range(4, n):
        y[t] = y[t - 4] + e[t]
    return pd.Series(y, index=pd.period_range("1970Q1", periods=n, freq="Q"))


def _walk_whose_variance_triples(seed: int, n: int = 300) -> np.ndarray:
    e = np.random.default_rng(seed).standard_normal(n)
    e[n // 2:] *= np.sqrt(3.0)  # the variance triples at mid-sample
    return np.cumsum(e)


def test_a_seasonal_unit_root_keeps_the_union_from_confirmed() -> None:
    for seed in (1, 2, 3):
        result = analyse_series(_quarterly_seasonal_walk(seed), Settings())
        assert result.seasonal is not None and result.seasonal.roots is not None
        roots = result.seasonal.roots.seasonal_roots
        assert roots, seed  # the walk has a root at every seasonal frequency
        assert result.verdict.agreement != "confirmed"
        if result.verdict.agreement is not None:  # the grade's note names the reason
            assert any("seasonal unit root was found" in note for note in result.notes), seed


def test_a_seasonal_unit_root_caps_the_classic_badge_too() -> None:
    found = cast(CrossCheck, SimpleNamespace(
        seasonal=SimpleNamespace(roots=SimpleNamespace(seasonal_roots=("twice a year",)))))
    none_found = cast(CrossCheck, SimpleNamespace(
        seasonal=SimpleNamespace(roots=SimpleNamespace(seasonal_roots=()))))
    status, notes = _classic_capped("confirmed", found)
    assert status == "inconclusive" and "twice a year" in notes[0]
    assert _classic_capped("confirmed", none_found) == ("confirmed", [])
    assert _classic_capped("conflict", found) == ("conflict", [])
    result = analyse_series(_quarterly_seasonal_walk(4), Settings(strategy="classic"))
    assert result.verdict.agreement != "confirmed"


def test_the_variance_change_is_in_to_dict_and_caps_the_badge() -> None:
    x = _walk_whose_variance_triples(5)
    result = analyse_series(x, Settings())
    data = json.loads(json.dumps(result.to_dict()))  # plain data
    variance = data["variance"]
    assert variance is not None and variance["test"] == "kappa2"
    assert variance["found"] is True
    assert variance["statistic"] > variance["critical_value"]
    assert 0 <= variance["position"] < result.nobs
    assert variance["label"] == f"observation {variance['position'] + 1}"
    assert result.verdict.agreement != "confirmed"
    # the classic sequence computes no κ2: the field is None, not a stale value
    assert analyse_series(x, Settings(strategy="classic")).to_dict()["variance"] is None
    plain = analyse_series(np.cumsum(np.random.default_rng(6).standard_normal(300)), Settings())
    assert plain.to_dict()["variance"] is not None
