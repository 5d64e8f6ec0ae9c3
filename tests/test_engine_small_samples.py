"""Short samples: Φ critical values below the published table, simulated at the
regression's own size; DF-GLS critical values at the series' own length.

Sources:
* Dickey & Fuller (1981), Econometrica 49(4), Tables IV-VI (from memory): the simulation
  must reproduce them at n = 25, 50, 100.  n is the length of the series, so the
  regression has n − 1 observations.  Tolerance ±0.08 at 5% and 10%, ±0.15 at 1% (the
  remembered entries; the Monte Carlo error at 200,000 replications is about 0.01 at
  5%, 0.03 at 1%).
* Size: the share of an independent simulation of the null (another seed) that a 5%
  test rejects, which must be near 5%, while the n = 25 row reused gives 6.4-8%.
* DF-GLS: Elliott, Rothenberg & Stock (1996): the limits (Dickey-Fuller without
  deterministic terms via statsmodels' MacKinnon 2010 values; ERS Table 1, T = ∞, from
  memory); the size of the 5% test at T = 30 and 50 measured on an independent
  simulation of the engine's own procedure (checked path by path against ``dfgls``).
"""

from __future__ import annotations

import itertools

import numpy as np
import pytest
from statsmodels.tsa.adfvalues import mackinnoncrit

from tauscope.engine.distributions.critical import PHI_TABLES, phi_critical_value
from tauscope.engine.distributions.dfgls_values import surface_critical_values, surface_p_value
from tauscope.engine.distributions.small_sample import simulated_phi_draws, small_sample_phi_values
from tauscope.engine.unitroot.dfgls import dfgls, dfgls_test
from tauscope.engine.unitroot.dfgls_null import default_max_lags, procedure_draws

SEED = 20261202

# Dickey & Fuller (1981), Tables IV-VI (from memory): n -> (10%, 5%, 1%).
DF1981 = {
    "phi1": {25: (4.12, 5.18, 7.88), 50: (3.94, 4.86, 7.06), 100: (3.86, 4.71, 6.70)},
    "phi2": {25: (4.67, 5.68, 8.21), 50: (4.31, 5.13, 7.02), 100: (4.16, 4.88, 6.50)},
    "phi3": {25: (5.91, 7.24, 10.61), 50: (5.61, 6.73, 9.31), 100: (5.47, 6.49, 8.73)},
}


@pytest.mark.parametrize("n", [25, 50, 100])
def test_simulation_reproduces_dickey_fuller_1981(n: int) -> None:
    for name, rows in DF1981.items():
        simulated = small_sample_phi_values(name, n - 1, reps=200_000, seed=SEED)
        ten, five, one = rows[n]  # Dickey & Fuller (1981), from memory
        assert simulated["10%"] == pytest.approx(ten, abs=0.08), (name, n)
        assert simulated["5%"] == pytest.approx(five, abs=0.08), (name, n)
        assert simulated["1%"] == pytest.approx(one, abs=0.15), (name, n)


@pytest.mark.parametrize("name", ["phi1", "phi2", "phi3"])
def test_below_the_table_the_values_are_simulated_and_grow_as_n_falls(name: str) -> None:
    for alpha, level in ((0.01, "1%"), (0.05, "5%"), (0.10, "10%")):
        values = [phi_critical_value(name, n, alpha) for n in range(12, 25)]
        assert all(a > b for a, b in itertools.pairwise(values)), (name, level)
        assert values[0] == small_sample_phi_values(name, 12)[level]
        # The table's n = 25 row is what was used before; n = 12 needs far more.
        row = PHI_TABLES[name][0][{0.10: 0, 0.05: 1, 0.01: 3}[alpha]]
        assert values[0] > row + 0.3
    assert phi_critical_value(name, 25, 0.05) == PHI_TABLES[name][0][1]


@pytest.mark.parametrize("nobs", [12, 15])
def test_a_five_percent_phi_test_has_five_percent_size_at_short_lengths(nobs: int) -> None:
    # An independent draw of the null (another seed): the simulated value holds the size,
    # the n = 25 row reused rejects more often (6.4-8% here).
    draws = simulated_phi_draws(nobs, 100_000, seed=SEED + nobs)
    for name in ("phi1", "phi2", "phi3"):
        size = float(np.mean(draws[name] > phi_critical_value(name, nobs, 0.05)))
        old = float(np.mean(draws[name] > PHI_TABLES[name][0][1]))
        assert 0.043 <= size <= 0.057, (name, size)
        assert old > size + 0.01, (name, old, size)


# DF-GLS (Elliott, Rothenberg & Stock 1996) with the lag chosen by MAIC (Ng & Perron 2001).

def test_dfgls_procedure_simulation_equals_the_engine_path_by_path() -> None:
    for spec, length in (("constant", 30), ("trend", 45)):
        draws = procedure_draws(spec, length, 15, 5)
        shocks = np.random.default_rng(5).standard_normal((15, length))
        for row in range(15):
            ours = dfgls(np.cumsum(shocks[row]), spec, "maic", default_max_lags(length)).statistic
            assert draws[row] == pytest.approx(ours, abs=1e-9)


@pytest.mark.parametrize("length", [30, 50])
def test_dfgls_with_a_constant_has_its_nominal_size(length: int) -> None:
    # 40,000 random walks drawn apart from the surface's own simulation (another seed):
    # the 5% test must reject 4%-6.5% of them (Monte Carlo s.e. 0.0011); the asymptotic
    # −1.95 used before rejects about 9% (T = 30) and 7.5% (T = 50).
    draws = procedure_draws("constant", length, 40_000, SEED + length)
    critical = dfgls_test(np.cumsum(np.random.default_rng(1).standard_normal(length)),
                          "constant", 0.05, max_lags=default_max_lags(length))[0].critical_values
    size = float(np.mean(draws < critical["5%"]))
    assert 0.04 <= size <= 0.065, size
    assert abs(float(np.mean(draws < critical["1%"])) - 0.01) < 0.004
    assert abs(float(np.mean(draws < critical["10%"])) - 0.10) < 0.012
    assert float(np.mean(draws < -1.95)) > 0.07  # what the asymptotic value did


@pytest.mark.parametrize("length", [20, 40])
def test_dfgls_trend_case_below_fifty_has_its_own_values(length: int) -> None:
    draws = procedure_draws("trend", length, 20_000, SEED + length)
    critical = surface_critical_values("trend", length)
    assert abs(float(np.mean(draws < critical["5%"])) - 0.05) < 0.01
    assert critical["5%"] < surface_critical_values("trend", 50)["5%"]  # no longer the T = 50 row


def test_dfgls_surfaces_approach_the_published_limits() -> None:
    # ERS (1996): the constant case has the Dickey-Fuller law without deterministic terms
    # (MacKinnon 2010 via statsmodels, asymptotic: −2.566, −1.941, −1.617).  With the lag
    # chosen by MAIC the 1% value converges slowly (−2.51 at T = 1000), 5% and 10% are there.
    limit = mackinnoncrit(N=1, regression="n", nobs=np.inf)
    values = surface_critical_values("constant", 1000)
    assert values["5%"] == pytest.approx(float(limit[1]), abs=0.02)
    assert values["10%"] == pytest.approx(float(limit[2]), abs=0.02)
    assert values["1%"] == pytest.approx(float(limit[0]), abs=0.07)
    # Trend case, ERS Table 1 (from memory), T = ∞: −3.48, −2.89, −2.57; the procedure's
    # values at T = 1000 sit between the T = 100 ones and those limits.
    for level, value in zip(("1%", "5%", "10%"), (-3.48, -2.89, -2.57), strict=True):
        assert surface_critical_values("trend", 100)[level] < surface_critical_values("trend", 1000)[level]
        assert value - 0.01 < surface_critical_values("trend", 1000)[level] < value + 0.15


@pytest.mark.parametrize(("spec", "length"), [("constant", 75), ("trend", 75), ("constant", 400)])
def test_dfgls_surfaces_match_a_fresh_simulation_off_the_grid(spec: str, length: int) -> None:
    # A length the surfaces were not fitted at, another seed: within 0.03 at 5% and 10%
    # (Monte Carlo s.e. about 0.006-0.01 here) and 0.05 at 1%.
    draws = procedure_draws(spec, length, 40_000 if length < 200 else 15_000, SEED + 7 * length)
    values = surface_critical_values(spec, length)
    simulated = {level: float(np.quantile(draws, a)) for level, a in (("1%", 0.01), ("5%", 0.05), ("10%", 0.10))}
    assert values["5%"] == pytest.approx(simulated["5%"], abs=0.03)
    assert values["10%"] == pytest.approx(simulated["10%"], abs=0.03)
    assert values["1%"] == pytest.approx(simulated["1%"], abs=0.05)


def test_dfgls_p_value_agrees_with_the_critical_values() -> None:
    for spec in ("constant", "trend"):
        critical = surface_critical_values(spec, 60)
        for level, alpha in (("1%", 0.01), ("5%", 0.05), ("10%", 0.10)):
            p_value, bound = surface_p_value(critical[level], spec, 60)
            assert bound is None and p_value == pytest.approx(alpha, abs=1e-12)
        assert surface_p_value(-10.0, spec, 60) == (0.01, "below")
