"""The union's pre-simulated table against direct simulation and against its generator.

References: the table is checked against the same simulators run here (Harvey, Leybourne &
Taylor 2009, 2012 for the union's null and κ; 2007 for the trend test's null), at lengths
off its grid with modest replications and a tolerance of four combined Monte Carlo standard
errors (batch means; binomial for the power), so a table that drifted from its simulator,
or an interpolation error larger than the simulation error, fails.  Its large-T end must be
``union.ASYMPTOTIC`` (T = 2,000, 200,000 replications, the same seed).
"""

from __future__ import annotations

import numpy as np
import pytest
from scipy.stats import norm

from tauscope.engine.unitroot import union_table as table
from tauscope.engine.unitroot import union_tables_make as make
from tauscope.engine.unitroot.trend_robust import trend_critical_value
from tauscope.engine.unitroot.union import (
    ASYMPTOTIC,
    ASYMPTOTIC_LENGTH,
    ASYMPTOTIC_REPS,
    COMPONENTS,
    constants_from_draws,
    max_lags_schwert,
    union_constants,
    union_level,
    union_null,
    union_power,
)
from tauscope.engine.unitroot.union_lookup import bracket, lookup, table_constants


def test_generator_and_table_agree_on_the_keys() -> None:
    assert table.GRID == make.GRID
    assert table.SEED == make.DEFAULT_SEED
    for name in ("NULL", "TREND", "POWER"):
        entries = getattr(table, name)
        assert tuple(entries) == make.GRID
        for length in make.GRID:
            assert tuple(entries[length]) == make.ALPHAS
    assert {t: make.null_reps(t) for t in make.GRID} == table.NULL_REPS
    assert (table.TREND_REPS, table.POWER_REPS, table.POWER_PHI) == (make.TREND_REPS, make.POWER_REPS,
                                                                     make.POWER_PHI)
    assert make.null_reps(ASYMPTOTIC_LENGTH) == ASYMPTOTIC_REPS


def test_generator_reproduces_the_table_at_the_shortest_length() -> None:
    """Rerun the generator's whole job at T = 10 (cheap): the same numbers to the digits written."""
    length, null, trend, power, _ = make.grid_entry(10)
    for alpha in make.ALPHAS:
        written = table.NULL[length][alpha]
        np.testing.assert_allclose(null[alpha][0], written[0], atol=6e-6)
        np.testing.assert_allclose(null[alpha][1:], written[1:], atol=6e-6)
        np.testing.assert_allclose(trend[alpha], table.TREND[length][alpha], atol=6e-6)
        np.testing.assert_allclose(power[alpha], table.POWER[length][alpha], atol=6e-6)


@pytest.mark.parametrize("kind", ["two", "four"])
def test_the_table_ends_at_the_asymptotic_constants(kind: str) -> None:
    for alpha, (cvs, kappa) in ASYMPTOTIC[kind].items():
        for length in (ASYMPTOTIC_LENGTH, 5_000, 100_000):
            c = union_constants(length, alpha, kind)
            np.testing.assert_allclose(c.critical_values, cvs, atol=6e-5)
            assert c.kappa == pytest.approx(kappa, abs=6e-5)
            assert c.length == length


def test_interpolation_is_linear_in_one_over_t_between_grid_points() -> None:
    lo, hi, w = bracket(87) or (0, 0, 0.0)
    assert (lo, hi) == (75, 99)  # 99: the last length of the short-sample rule
    assert w == pytest.approx((1 / 87 - 1 / 75) / (1 / 99 - 1 / 75))
    assert bracket(99) == (99, 100, 0.0)  # no length lies between the two rules' grid points
    at_grid = table_constants(100, 0.05, "four")
    assert at_grid is not None
    assert at_grid[1] == pytest.approx(table.NULL[100][0.05][1], abs=1e-12)
    assert bracket(9) is None and lookup("trend", 9, 0.05) is None
    assert table_constants(100, 0.025, "four") is None  # α the table does not hold


@pytest.mark.parametrize("length", [33, 87, 173])
def test_table_constants_match_direct_simulation_off_the_grid(length: int) -> None:
    draws = union_null(length, 40_000, seed=2024, components=COMPONENTS["four"])
    batches = np.array_split(draws, 20)
    for kind, columns in (("four", 4), ("two", 2)):
        for alpha in (0.01, 0.05, 0.10):
            cvs, kappa = constants_from_draws(draws[:, :columns], alpha)
            kappas = [constants_from_draws(b[:, :columns], alpha)[1] for b in batches]
            se = float(np.std(kappas, ddof=1) / np.sqrt(len(kappas)))
            tabled = union_constants(length, alpha, kind)
            assert tabled.kappa == pytest.approx(kappa, abs=4 * se)
            cv_se = [float(np.std([np.quantile(b[:, j], alpha) for b in batches], ddof=1) / np.sqrt(20))
                     for j in range(columns)]
            for j in range(columns):
                assert tabled.critical_values[j] == pytest.approx(cvs[j], abs=4 * cv_se[j] + 1e-3)


def test_table_trend_critical_value_matches_direct_simulation_off_the_grid() -> None:
    length = 133
    walk, noise = make.trend_null_z(length, 4_000)
    for alpha in (0.05, 0.10):
        direct = [float(np.nanquantile(z, 1.0 - alpha)) for z in (walk, noise)]
        ses = [float(np.std([np.nanquantile(b, 1.0 - alpha) for b in np.array_split(z, 20)], ddof=1)
                     / np.sqrt(20)) for z in (walk, noise)]
        tabled = lookup("trend", length, alpha)
        assert tabled is not None
        for j in range(2):
            assert tabled[j] == pytest.approx(direct[j], abs=4 * ses[j])
        cv = trend_critical_value(length, alpha, "maic", max_lags_schwert(length, None, 6.0))
        assert cv == pytest.approx(max(float(tabled[0]), float(tabled[1]), norm.ppf(1 - alpha / 2)))


def test_trend_critical_value_simulates_outside_the_table() -> None:
    """Another lag maximum, or a length below the grid, is simulated as before."""
    direct = trend_critical_value(150, 0.05, "maic", 3, source="simulate")
    assert trend_critical_value(150, 0.05, "maic", 3) == direct
    assert trend_critical_value(8, 0.05, "maic", 1) == trend_critical_value(8, 0.05, "maic", 1, source="simulate")


def test_table_power_matches_direct_simulation_off_the_grid() -> None:
    length = 173
    for components in ("four", "two"):
        direct = union_power(length, 0.95, "maic", 0.05, components=components, source="simulate")
        tabled = union_power(length, 0.95, "maic", 0.05, components=components)
        for d, t in zip(direct, tabled, strict=True):
            se = np.sqrt(max(d * (1 - d), 0.01) / 2_000)
            assert t == pytest.approx(d, abs=4 * se)
    # another alternative is simulated, with the table's constants
    assert union_power(60, 0.5, "maic", 0.05) == union_power(60, 0.5, "maic", 0.05, source="table")


def test_simulate_keeps_the_direct_path() -> None:
    """``critical="simulate"`` reaches the direct simulation at the series' length (20,000
    replications); the default reads the table, which agrees within simulation error."""
    xs = np.cumsum(np.random.default_rng(3).standard_normal((5, 30)), axis=1)
    direct = union_level(xs, 0, "maic", 4, 0.05, critical="simulate").constants
    assert direct.reps == 20_000
    cvs, kappa = constants_from_draws(union_null(30, 20_000, components=COMPONENTS["four"], lagged=True), 0.05)
    assert direct.critical_values == cvs and direct.kappa == kappa
    tabled = union_level(xs, 0, "maic", 4, 0.05).constants
    assert tabled.reps == table.NULL_REPS[30]
    # within 4 SEs of the 20,000-draw κ: the table's batch-means SE scaled to 20,000 draws (at
    # T = 30 with the short-sample rule's 3 lags MSB's null has a long tail: SE about 0.018)
    se = table.NULL[30][0.05][3] * np.sqrt(table.NULL_REPS[30] / 20_000)
    assert tabled.kappa == pytest.approx(kappa, abs=max(0.02, 4 * se))
