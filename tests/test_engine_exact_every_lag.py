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
