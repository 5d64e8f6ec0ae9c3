"""The break regression's cross products from sums (engine/unitroot/lm_break_sums.py) against
the products of each candidate's design written out from the definition (Lee & Strazicich
2013: S̃_τ = x_τ − a τ − b 1(τ > TB), ΔS̃ zero at the break, the impulse's row left out)."""

from __future__ import annotations

import numpy as np
import pytest
import statsmodels.api as sm

from tauscope.engine.unitroot.lm_break import candidate_positions, lm_profile
from tauscope.engine.unitroot.lm_break_sums import candidate_moments


def _design(x: np.ndarray, position: int, k: int) -> tuple[np.ndarray, np.ndarray]:
    """Rows r = k … T−2 of Δy but r = TB: [1, S̃_r, ΔS̃_{r−1} … ΔS̃_{r−k}] and Δy_r."""
    dx = np.diff(x)
    slope = (dx.sum() - dx[position]) / (x.shape[0] - 2)
    jump = dx[position] - slope
    t = np.arange(x.shape[0])
    s = x - slope * t - jump * (t > position)
    e = dx - slope
    e[position] = 0.0
    rows = [r for r in range(k, dx.shape[0]) if r != position]
    design = np.array([[1.0, s[r], *[e[r - i] for i in range(1, k + 1)]] for r in rows])
    return design, dx[rows]


def _series(kind: str, length: int, seed: int) -> np.ndarray:
    rng = np.random.default_rng(seed)
    e = rng.standard_normal(length)
    if kind == "steep drift":  # a drift of 25σ a period: the sums must not lose it
        return np.cumsum(25.0 + e)
    if kind == "shifted AR":
        x = np.empty(length)
        x[0] = e[0]
        for t in range(1, length):
            x[t] = 0.5 * x[t - 1] + e[t]
        return x + 6.0 * (np.arange(length) >= length // 2)
    return np.cumsum(e)


@pytest.mark.parametrize("kind", ["random walk", "steep drift", "shifted AR"])
@pytest.mark.parametrize("k", [0, 1, 4, 8])
def test_moments_equal_the_products_of_each_design(kind: str, k: int) -> None:
    x = _series(kind, 80, 3 + k)
    x = (x - x[0]) / np.std(np.diff(x))  # as lm_profile scales it
    positions = candidate_positions(x.shape[0])
    gram, cross, yy = candidate_moments(x, positions, k)
    for c, position in enumerate(positions.tolist()):
        design, y = _design(x, position, k)
        np.testing.assert_allclose(gram[c], design.T @ design, rtol=1e-11, atol=1e-9 * abs(design.T @ design).max())
        np.testing.assert_allclose(cross[c], design.T @ y, rtol=1e-11, atol=1e-9 * abs(design.T @ y).max())
        assert yy[c] == pytest.approx(float(y @ y), rel=1e-12)


@pytest.mark.parametrize("kind", ["random walk", "steep drift"])
def test_statistic_matches_statsmodels_with_many_lags(kind: str) -> None:
    """τ̃ at a fixed lag order against statsmodels' OLS t ratio on the design written out
    (the impulse as a column, as the paper has it)."""
    x = _series(kind, 120, 21)
    positions = candidate_positions(120)
    dx = np.diff(x)
    for k in (5, 8):
        ours, _ = lm_profile(x, positions, k, fixed=True)
        for i in (0, 40, len(positions) - 1):
            p = int(positions[i])
            slope = (dx.sum() - dx[p]) / (x.shape[0] - 2)
            t = np.arange(x.shape[0])
            s = x - slope * t - (dx[p] - slope) * (t > p)
            e = dx - slope
            e[p] = 0.0
            rows = range(k, dx.shape[0])
            design = np.array([[1.0, float(r == p), s[r], *[e[r - j] for j in range(1, k + 1)]] for r in rows])
            fit = sm.OLS(dx[k:], design).fit()
            assert abs(ours[i] - float(fit.tvalues[2])) < 1e-8
