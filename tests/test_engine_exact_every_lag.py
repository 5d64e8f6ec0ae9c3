"""Every lag order from one batch of random walks gives, to rounding, the statistics the
direct simulation computes one lag order at a time (the same regressions: Dickey & Fuller
1979, 1981; partialling out by Frisch-Waugh-Lovell)."""

from __future__ import annotations

import numpy as np
import pytest

from tauscope.engine.distributions.batched import df_statistics
from tauscope.engine.distributions.every_lag import STATISTICS, every_lag_statistics


@pytest.mark.parametrize("length", [12, 60, 241])
def test_every_lag_equals_one_lag_at_a_time(length: int) -> None:
    shocks = np.random.default_rng(length).standard_normal((300, length))
    top = min(9, (length - 5) // 2)
    lags = [0, 1, 2, top] if top > 2 else [0, 1]
    every = every_lag_statistics(shocks, lags)
    assert sorted(every) == sorted(lags)
    for p in lags:
        direct = df_statistics(shocks, p)
        for name in STATISTICS:
            assert np.allclose(every[p][name], direct[name], rtol=1e-9, atol=1e-9), (p, name)


def test_one_length_gives_each_lag_the_quantiles_of_its_own_stream() -> None:
    # the per-length cache draws the stream streamed_quantiles draws at nobs = L − p, so the
    # quantiles (and their batch-means errors) are the same numbers
    from tauscope.engine.distributions.exact import length_nulls, streamed_quantiles
    from tauscope.engine.distributions.simulate import null_distribution

    nulls = length_nulls(61, 3, 20_000, 4242, 5_000)
    for p in range(4):
        direct = streamed_quantiles(61 - p, p, 20_000, 4242)
        for name, quantiles in direct.items():
            for level, value in quantiles.values.items():
                assert nulls[p].quantiles[name].values[level] == pytest.approx(value, abs=1e-10)
                assert nulls[p].quantiles[name].standard_errors[level] == pytest.approx(
                    quantiles.standard_errors[level], abs=1e-10)
        kept = null_distribution("trend", 61 - p, 5_000, 4242, p)
        assert np.allclose(nulls[p].kept["tau_trend"], kept, rtol=0, atol=1e-10)
