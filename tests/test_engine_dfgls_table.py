"""The DF-GLS null table (10⁶ random walks per length and fixed lag) and how it is read: the
every-lag simulation that writes it equals the direct one, the table is stored and read as the
τ table is, the engine takes it for an exact run, and it agrees with a fresh simulation under a
seed of its own within the simulation error (batch means) and with published values: Elliott,
Rothenberg & Stock (1996) Table 1 (from memory), the Dickey-Fuller no-constant values the
constant case converges to (Fuller 1976, from memory), and arch's DF-GLS response surface."""

from __future__ import annotations

import itertools
import math

import numpy as np
import pytest
from arch.unitroot.unitroot import mackinnoncrit as arch_mackinnoncrit

from tauscope.engine import formatting as fmt
from tauscope.engine.distributions import dfgls_table
from tauscope.engine.distributions.dfgls_grid import (
    DFGLS_LENGTHS,
    DFGLS_SPECS,
    MIN_DF,
    dfgls_quantiles,
    dfgls_table_lags,
)
from tauscope.engine.distributions.dfgls_table_make import simulate_length
from tauscope.engine.distributions.exact_grid import (
    PROBABILITIES,
    UNIT,
    decode,
    distribution_at,
    quantile_at,
)
from tauscope.engine.distributions.exact_table_make import encode
from tauscope.engine.distributions.simulate import DEFAULT_SEED, EXACT_REPS, lower_critical_values
from tauscope.engine.unitroot.dfgls import dfgls_null_distribution, dfgls_test, fixed_lag_values
from tauscope.engine.unitroot.dfgls_lags import every_lag_dfgls

CELLS = decode(dfgls_table.CELLS, dfgls_table.DATA, DFGLS_SPECS)
LEVELS = {"1%": 0.01, "5%": 0.05, "10%": 0.10}
# Elliott, Rothenberg & Stock (1996), Table 1, trend case, no lags (from memory): 1%, 5%, 10%
ERS_TREND = {50: (-3.77, -3.19, -2.89), 100: (-3.58, -3.03, -2.74), 200: (-3.46, -2.93, -2.64)}
# Fuller (1976) Table 8.5.2, τ without deterministic terms, n = 250 (from memory): 1%, 5%, 10%
DF_NONE_250 = (-2.58, -1.95, -1.62)


@pytest.mark.parametrize(("length", "lags"), [(25, (0, 3, 9)), (61, (0, 1, 7, 11))])
def test_every_lag_simulation_equals_the_direct_one(length: int, lags: tuple[int, ...]) -> None:
    reps = 3_000
    fast = every_lag_dfgls(np.random.default_rng(7).standard_normal((reps, length)), lags)
    for spec in DFGLS_SPECS:
        for p in lags:
            direct = dfgls_null_distribution(spec, length, reps, 7, p)
            assert np.max(np.abs(fast[spec][p] - direct)) < 1e-9, (spec, p)


def test_the_encoding_keeps_every_quantile_to_half_a_unit() -> None:
    cells, errors = simulate_length(25, reps=2_000, seed=5)
    back = decode(tuple(sorted(cells)), encode(cells, DFGLS_SPECS), DFGLS_SPECS)
    for key, values in cells.items():
        assert errors[key]["trend"] > 0.0
        for spec in DFGLS_SPECS:
            assert np.max(np.abs(back[key][spec] - values[spec])) <= UNIT / 2 + 1e-12


def test_every_grid_length_holds_its_lags_in_increasing_quantiles() -> None:
    assert dfgls_table.REPS == EXACT_REPS
    assert set(CELLS) == {(t, p) for t in DFGLS_LENGTHS for p in dfgls_table_lags(t)}
    for key, cell in CELLS.items():
        for spec in DFGLS_SPECS:
            assert cell[spec].shape == (len(PROBABILITIES),)
            assert np.all(np.diff(cell[spec]) >= 0), (key, spec)
    # every lag a default search (Schwert 1989, capped at T//2 − 3) reaches between two lengths
    for short, long in itertools.pairwise(DFGLS_LENGTHS):
        for length in range(short, long + 1):
            top = min(int(np.floor(12.0 * (length / 100.0) ** 0.25)), length // 2 - 3)
            short_df = short - 2 - 2 * top  # the shorter cell's residual degrees of freedom
            read = dfgls_quantiles("trend", length, top)
            assert (read is None) == (short < length < long and short_df < MIN_DF), length


def test_a_cell_is_read_as_stored_and_between_cells_lies_between() -> None:
    stored = CELLS[(160, 4)]["constant"]
    at_cell = dfgls_quantiles("constant", 160, 4)
    assert at_cell is not None and np.array_equal(at_cell, stored)
    read = dfgls_quantiles("trend", 200, 5)
    low, high = CELLS[(160, 5)]["trend"], CELLS[(250, 5)]["trend"]
    assert read is not None
    w = (1.0 / 188 - 1.0 / 238) / (1.0 / 148 - 1.0 / 238)  # linear in 1/df, df = T − 2 − 2p, at its own lag
    assert np.allclose(read, w * low + (1.0 - w) * high, atol=1e-12)
    assert dfgls_quantiles("trend", 300, 0) is None  # beyond the grid: simulated instead
    assert dfgls_quantiles("trend", 20, 0) is None
    assert dfgls_quantiles("constant", 200, 40) is None


def test_the_engine_reads_the_table_for_an_exact_run_only() -> None:
    x = np.cumsum(np.random.default_rng(3).standard_normal(240))
    exact, _ = dfgls_test(x, "trend", 0.05, lags=4, critical="exact", reps=EXACT_REPS)
    table = dfgls_quantiles("trend", 240, 4)
    assert table is not None
    assert exact.critical_values == {level: quantile_at(table, a) for level, a in LEVELS.items()}
    assert exact.p_value == pytest.approx(distribution_at(table, exact.statistic)[0], abs=1e-12)
    _, p_value, bound = fixed_lag_values(exact.critical_values["5%"], "trend", 240, 4, EXACT_REPS,
                                         DEFAULT_SEED)
    assert p_value == pytest.approx(0.05, abs=1e-9) and bound is None
    assert fixed_lag_values(-50.0, "trend", 240, 4, EXACT_REPS, DEFAULT_SEED)[1:] == (0.001, "below")
    far, _ = dfgls_test(np.random.default_rng(4).standard_normal(240), "trend", 0.05, lags=0, critical="exact",
                        reps=EXACT_REPS)
    assert (far.p_value, far.p_value_bound) == (0.001, "below")  # said "below 0.001", as the simulation did
    assert fmt.p_value(far.p_value, far.p_value_bound) == "below 0.001"
    # another seed or replication count is simulated, as before
    other, _, _ = fixed_lag_values(-3.0, "trend", 240, 4, 2_000, DEFAULT_SEED)
    assert other == lower_critical_values(dfgls_null_distribution("trend", 240, 2_000, DEFAULT_SEED, 4))


@pytest.mark.parametrize(("length", "lags"), [(25, (0, 8)), (32, (2, 9)), (160, (0, 15))])
def test_the_table_agrees_with_a_fresh_simulation(length: int, lags: tuple[int, ...]) -> None:
    reps, batches = 40_000, 10
    draws = every_lag_dfgls(np.random.default_rng(2026).standard_normal((reps, length)), lags)
    for spec in DFGLS_SPECS:
        for p in lags:
            table = dfgls_quantiles(spec, length, p)
            assert table is not None
            for a in LEVELS.values():
                parts = [np.quantile(part, a) for part in np.array_split(draws[spec][p], batches)]
                se = float(np.std(parts, ddof=1) / math.sqrt(batches))
                # the fresh draws' SE dominates (the table's, 10⁶ draws, is a quarter of it);
                # between grid lengths the interpolation adds at most about 0.01
                gap = abs(quantile_at(table, a) - float(np.quantile(draws[spec][p], a)))
                assert gap <= 4.0 * se + 0.01, (spec, p, a, gap, se)


@pytest.mark.parametrize("length", [50, 100, 200])
def test_the_trend_case_at_lag_0_reproduces_ers_and_arch(length: int) -> None:
    table = dfgls_quantiles("trend", length, 0)
    assert table is not None
    for value, a in zip(ERS_TREND[length], LEVELS.values(), strict=True):  # from memory
        assert quantile_at(table, a) == pytest.approx(value, abs=0.05)
    if length >= 100:  # arch's response surface (regression nobs = T − 1) drifts below T = 100
        arch = arch_mackinnoncrit(regression="ct", nobs=length - 1, dist_type="dfgls")
        for value, a in zip(arch, LEVELS.values(), strict=True):
            assert quantile_at(table, a) == pytest.approx(float(value), abs=0.03)


def test_the_constant_case_at_lag_0_approaches_the_dickey_fuller_no_constant_values() -> None:
    """ERS (1996): the constant case's limit law is Dickey-Fuller τ without deterministic terms;
    in finite samples it lies to the left and closes in as T grows."""
    gaps = []
    for length in DFGLS_LENGTHS:
        table = dfgls_quantiles("constant", length, 0)
        assert table is not None
        gaps.append([quantile_at(table, a) - v for a, v in zip(LEVELS.values(), DF_NONE_250, strict=True)])
    assert np.all(np.array(gaps) < 0.0) and np.all(np.diff(np.array(gaps), axis=0) > 0.0)
    assert np.max(np.abs(gaps[-1])) <= 0.09  # at T = 250 (Fuller's row from memory)
    for length in (100, 200, 250):
        table = dfgls_quantiles("constant", length, 0)
        assert table is not None
        arch = arch_mackinnoncrit(regression="c", nobs=length - 1, dist_type="dfgls")
        for value, a in zip(arch, LEVELS.values(), strict=True):
            assert quantile_at(table, a) == pytest.approx(float(value), abs=0.03)
