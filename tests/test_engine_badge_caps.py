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
        seasonal=SimpleNamespace(roots=SimpleNamespace(seasonal_roots=("twice a year",))), variance=None))
    none_found = cast(CrossCheck, SimpleNamespace(
        seasonal=SimpleNamespace(roots=SimpleNamespace(seasonal_roots=())), variance=None))
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
    # the classic sequence tests it too (the levels' ADF trend lag), and says what to do
    classic = analyse_series(x, Settings(strategy="classic"))
    assert classic.to_dict()["variance"]["found"] is True
    assert classic.verdict.agreement != "confirmed"
    assert any("size of the shocks changes" in note and "--strategy bootstrap" in note
               for note in classic.notes)
    plain = analyse_series(np.cumsum(np.random.default_rng(6).standard_normal(300)), Settings())
    assert plain.to_dict()["variance"] is not None


def test_a_variance_change_caps_the_classic_badge() -> None:
    """Under the classic sequence a κ2 change found turns "confirmed" into "inconclusive",
    as the union's grade withholds it; with a seasonal root both reasons are named."""
    changed = SimpleNamespace(found=True)
    steady = SimpleNamespace(found=False)
    no_roots = SimpleNamespace(roots=SimpleNamespace(seasonal_roots=()))
    roots = SimpleNamespace(roots=SimpleNamespace(seasonal_roots=("twice a year",)))
    status, notes = _classic_capped("confirmed", cast(CrossCheck, SimpleNamespace(
        seasonal=no_roots, variance=changed)))
    assert status == "inconclusive" and "size of the shocks changes" in notes[0]
    assert _classic_capped("confirmed", cast(CrossCheck, SimpleNamespace(
        seasonal=no_roots, variance=steady))) == ("confirmed", [])
    status, notes = _classic_capped("confirmed", cast(CrossCheck, SimpleNamespace(
        seasonal=roots, variance=changed)))
    assert "twice a year" in notes[0] and "size of the shocks changes" in notes[0]


def test_classic_variance_is_the_same_alone_and_in_a_batch() -> None:
    """The fast path (analyse_many) and one series alone give the classic κ2 the same bits."""
    from tauscope.engine import analyse_many

    rng = np.random.default_rng(8)
    series = [(f"s{i}", np.cumsum(rng.standard_normal(200) * (1.0 + (np.arange(200) > 100) * i)))
              for i in range(4)]
    settings = Settings(strategy="classic")
    batch = analyse_many(series, settings)
    for (name, values), found in zip(series, batch, strict=True):
        alone = analyse_series(values, settings, name)
        assert found.to_dict()["variance"] == alone.to_dict()["variance"]
        assert found.to_dict()["variance"] is not None
