"""The test for a change in the shocks' variance (engine/unitroot/variance_change.py):
κ2 of Sansó, Aragó & Carrion-i-Silvestre (2004), the cumulative sum of squares test of
Inclán & Tiao (1994) made robust to non-normal and dependent squares."""

from __future__ import annotations

import math

import numpy as np
import pytest
from scipy.special import kolmogorov

from tauscope.engine.unitroot.variance_change import critical_value, kappa2, variance_change

# Inclán & Tiao (1994), JASA 89, Table 1, asymptotic critical values of sup |W*(r)|, the
# Brownian bridge (from memory; the same numbers as Kolmogorov's distribution, checked below
# against scipy.special.kolmogorov, an independent implementation of its survival function).
INCLAN_TIAO_ASYMPTOTIC = {0.10: 1.224, 0.05: 1.358, 0.01: 1.628}


@pytest.mark.parametrize("alpha, value", sorted(INCLAN_TIAO_ASYMPTOTIC.items()))
def test_critical_values_are_the_published_ones(alpha: float, value: float) -> None:
    assert critical_value(alpha) == pytest.approx(value, abs=0.001)
    assert float(kolmogorov(critical_value(alpha))) == pytest.approx(alpha, abs=1e-9)  # scipy.special


def test_kappa2_without_bandwidth_is_inclan_tiao_rescaled() -> None:
    """With m = 0, κ2 = IT · √(2σ̂⁴ / ω̂₄), IT = √(T/2) max_k |C_k / C_T − k/T| (Inclán &
    Tiao 1994, eq. (3) and Theorem 1), ω̂₄ = mean of (e² − σ̂²)² (Sansó et al. 2004)."""
    e = np.random.default_rng(7).standard_t(5, 300)
    t = e.size
    c = np.cumsum(e ** 2)
    inclan_tiao = math.sqrt(t / 2.0) * np.max(np.abs(c / c[-1] - np.arange(1, t + 1) / t))
    sigma2 = c[-1] / t
    omega = np.mean((e ** 2 - sigma2) ** 2)
    statistic, k = kappa2(e, bandwidth=0)
    assert statistic == pytest.approx(inclan_tiao * math.sqrt(2.0 * sigma2 ** 2 / omega), rel=1e-12)
    assert k == int(np.argmax(np.abs(c / c[-1] - np.arange(1, t + 1) / t)))


def test_simulated_null_quantile_is_near_the_asymptotic_value() -> None:
    """Our own simulation: 2,000 Gaussian white noises of 1,000 values, 95% quantile of κ2
    within 0.08 of 1.358 (the finite-sample test is known to be a little conservative,
    Sansó et al. 2004; simulation standard error about 0.02)."""
    rng = np.random.default_rng(20_041_001)
    draws = np.array([kappa2(rng.standard_normal(1000))[0] for _ in range(2000)])
    assert abs(float(np.quantile(draws, 0.95)) - INCLAN_TIAO_ASYMPTOTIC[0.05]) < 0.08


def _walks(rng: np.random.Generator, reps: int, length: int, scale: float) -> np.ndarray:
    sd = np.where(np.arange(length) >= length // 2, scale, 1.0)
    return np.cumsum(sd * rng.standard_normal((reps, length)), axis=1)


def test_size_and_power_on_random_walks() -> None:
    """Fires at most 6% of the time on random walks with a constant variance (5% test,
    200 series, T = 200), at least 90% when the variance triples at mid-sample, dating
    the change within 15 periods of it in most cases."""
    rng = np.random.default_rng(14)
    flat = [variance_change(y, 1) for y in _walks(rng, 200, 200, 1.0)]
    assert np.mean([v is not None and v.found for v in flat]) <= 0.06
    broken = [variance_change(y, 1) for y in _walks(rng, 200, 200, math.sqrt(3.0))]
    found = [v for v in broken if v is not None and v.found]
    assert len(found) >= 180
    assert np.mean([abs(v.position - 100) <= 15 for v in found]) >= 0.7


def test_a_series_too_short_or_constant_gives_none() -> None:
    assert variance_change(np.arange(8.0), 0) is None
    assert variance_change(np.ones(50), 0) is None
