"""Simulated power of the ADF test (simulation with known truth, fixed seeds).

* Under a random walk (coefficient 1) the rejection rate is the size: about 5%
  at the 5% MacKinnon (2010) critical value.  Band ±0.012: more than three
  binomial standard errors at 8,000 replications (sqrt(0.05·0.95/8000) = 0.0024)
  plus the error of the response surface itself.
* Power rises with the sample size and with the distance of the coefficient
  from one (common practice; Shiller & Perron 1985 on span).
"""

from __future__ import annotations

from itertools import pairwise

import numpy as np
import pytest

from tauscope.engine.distributions.power import ar1_paths, power_at, rejection_rate, rejection_rates
from tauscope.engine.distributions.simulate import shock_chunks, tau_statistics
from tauscope.engine.unitroot.adf import adf_test, estimate

REPS = 8_000
SEED = 4242


@pytest.mark.parametrize("spec", ["none", "constant", "trend"])
def test_power_against_a_random_walk_is_the_size(spec: str) -> None:
    assert rejection_rate(spec, 100, 1.0, 0.05, reps=REPS, seed=SEED) == pytest.approx(0.05, abs=0.012)


def test_size_holds_with_lags_and_at_one_percent() -> None:
    assert rejection_rate("constant", 150, 1.0, 0.05, lags=3, reps=REPS, seed=SEED) == pytest.approx(
        0.05, abs=0.015
    )
    assert rejection_rate("trend", 150, 1.0, 0.01, reps=REPS, seed=SEED) == pytest.approx(0.01, abs=0.006)


def test_power_rises_with_sample_size() -> None:
    rates = [rejection_rate("constant", n, 0.95, 0.05, reps=4_000, seed=SEED) for n in (50, 100, 200, 400)]
    assert all(later > earlier for earlier, later in pairwise(rates))
    assert rates[-1] > 0.8  # a long sample almost always rejects against 0.95


def test_power_rises_as_the_coefficient_moves_away_from_one() -> None:
    rates = [rejection_rate("trend", 120, c, 0.05, reps=4_000, seed=SEED) for c in (1.0, 0.97, 0.95, 0.90, 0.80)]
    assert all(later > earlier for earlier, later in pairwise(rates))


def test_power_result_reports_both_coefficients() -> None:
    result = power_at("constant", 100, 0.05, lags=1, reps=2_000, seed=SEED)
    assert result.coefficients == (0.90, 0.95)
    assert result.rate(0.90) > result.rate(0.95)
    assert result.to_dict()["power"]["0.95"] == result.rate(0.95)


def test_vectorised_tau_equals_the_engine_adf_on_ar1_paths() -> None:
    shocks = next(shock_chunks(82, 5, seed=7))
    paths = ar1_paths(shocks, 0.9, np.random.default_rng(1).standard_normal(5))
    taus = tau_statistics(paths, 2, "constant")
    for row in range(5):
        reference = adf_test(estimate(paths[row], "constant", 2), 0.05)
        assert taus[row] == pytest.approx(reference.statistic, abs=1e-9)
        assert reference.nobs == 80


def test_ar1_paths_follow_the_recursion_from_a_stationary_start() -> None:
    start = np.random.default_rng(2).standard_normal(3)
    shocks = np.random.default_rng(3).standard_normal((3, 20))
    paths = ar1_paths(shocks, 0.8, start)
    np.testing.assert_allclose(paths[:, 1:], 0.8 * paths[:, :-1] + shocks, atol=1e-12)
    np.testing.assert_allclose(paths[:, 0], start / np.sqrt(1 - 0.8**2))  # variance 1/(1 − φ²)
    assert np.all(ar1_paths(shocks, 1.0, start)[:, 0] == 0.0)


def test_rates_do_not_depend_on_the_other_coefficients_asked_for() -> None:
    together = rejection_rates("constant", 90, (0.9, 0.95), 0.05, reps=1_000, seed=3)
    assert together[1] == rejection_rate("constant", 90, 0.95, 0.05, reps=1_000, seed=3)
