"""The exact critical-value table (simulated once, 10⁶ random walks per length) and how it is
read: stored exactly, interpolated between its cells, used by the engine for the default
request, and in agreement with a fresh simulation under a seed of its own within the
simulation error (the batch-means standard errors of both; the quantile's error formula
sqrt(p(1 − p)/R)/f(q), e.g. Serfling 1980, §2.3).  MacKinnon (2010) via statsmodels'
``mackinnoncrit`` is the published check of the τ values."""

from __future__ import annotations

import math

import numpy as np
import pytest
from statsmodels.tsa.adfvalues import mackinnoncrit

from tauscope.engine.distributions import exact_table
from tauscope.engine.distributions.exact import length_nulls
from tauscope.engine.distributions.exact_grid import (
    LENGTH_GRID,
    PROBABILITIES,
    TABLE_STATISTICS,
    UNIT,
    decode,
    distribution_at,
    quantile_at,
    table_lags,
    table_quantiles,
)
from tauscope.engine.distributions.exact_table_make import encode, simulate_length
from tauscope.engine.distributions.simulate import (
    exact_critical_values,
    exact_p_value,
    exact_phi_critical_values,
    with_exact_values,
)
from tauscope.engine.results import TestResult

CELLS = decode(exact_table.CELLS, exact_table.DATA)
CODES = {"none": "n", "constant": "c", "trend": "ct"}


def test_the_encoding_keeps_every_quantile_to_half_a_unit() -> None:
    quantiles, _ = simulate_length(25, reps=2_000, seed=5)
    cells = {(25, p): values for p, values in quantiles.items()}
    back = decode(tuple(sorted(cells)), encode(cells))
    for key, values in cells.items():
        for name in TABLE_STATISTICS:
            assert np.max(np.abs(back[key][name] - values[name])) <= UNIT / 2 + 1e-12


def test_every_length_written_holds_its_lags_in_increasing_quantiles() -> None:
    lengths = sorted({length for length, _ in CELLS})
    assert lengths and set(lengths) <= set(LENGTH_GRID)
    for length in lengths:
        for p in table_lags(length):
            for name in TABLE_STATISTICS:
                values = CELLS[(length, p)][name]
                assert values.shape == (len(PROBABILITIES),)
                assert np.all(np.diff(values) >= 0), (length, p, name)


def test_a_grid_cell_is_read_as_stored_and_between_cells_lies_between() -> None:
    lengths = sorted({length for length, _ in CELLS})
    short, long = lengths[0], lengths[1]
    p = 2
    stored = CELLS[(short, p)]["tau_trend"]
    at_cell = table_quantiles("tau_trend", short - p, p)
    assert at_cell is not None and np.array_equal(at_cell, stored)
    nobs = (short + long) // 2 - p
    read = table_quantiles("tau_trend", nobs, p)
    low, high = CELLS[(short, p)]["tau_trend"], CELLS[(long, p)]["tau_trend"]
    assert read is not None
    assert np.all(read >= np.minimum(low, high) - 1e-12) and np.all(read <= np.maximum(low, high) + 1e-12)
    # every lag is read from its own cells, never between two lags
    seven = table_quantiles("tau_constant", nobs, 7)
    assert seven is not None
    w = (1.0 / nobs - 1.0 / (long - 7)) / (1.0 / (short - 7) - 1.0 / (long - 7))
    assert np.allclose(seven, w * CELLS[(short, 7)]["tau_constant"]
                       + (1.0 - w) * CELLS[(long, 7)]["tau_constant"], atol=1e-12)
    assert table_quantiles("tau_constant", 10_000, 2) is None  # off the grid: simulated instead


def test_p_values_read_back_the_stored_probabilities() -> None:
    values = CELLS[sorted(CELLS)[0]]["tau_constant"]
    for probability, quantile in zip(PROBABILITIES, values, strict=True):
        share, bound = distribution_at(values, float(quantile))
        assert bound is None
        assert share == pytest.approx(probability, abs=1e-9)
    assert distribution_at(values, float(values[0]) - 1.0) == (PROBABILITIES[0], "below")


@pytest.mark.parametrize("spec", ["none", "constant", "trend"])
def test_the_engine_reads_the_table_and_agrees_with_mackinnon(spec: str) -> None:
    length = max(length for length, _ in CELLS)
    nobs = length - 1
    values = exact_critical_values(spec, nobs, lags=1)
    stored = CELLS[(length, 1)][f"tau_{spec}"]
    assert values == {"1%": quantile_at(stored, 0.01), "5%": quantile_at(stored, 0.05),
                      "10%": quantile_at(stored, 0.10)}
    # the MacKinnon (2010) response surface at this size (no lag terms), within ±0.02
    published = mackinnoncrit(N=1, regression=CODES[spec], nobs=nobs)
    for level, value in zip(("1%", "5%", "10%"), published, strict=True):
        assert values[level] == pytest.approx(float(value), abs=0.02), (spec, level)
    assert exact_p_value(values["5%"], spec, nobs, lags=1) == pytest.approx(0.05, abs=1e-9)


def test_with_exact_values_takes_the_table_for_tau_and_phi() -> None:
    length = max(length for length, _ in CELLS)
    nobs, lags = length - 3, 3
    tau = TestResult("adf", "trend", 0, -3.6, 0.0, lags, nobs, {}, False, 0.0)
    judged = with_exact_values(tau, 0.05)
    stored = table_quantiles("tau_trend", nobs, lags)
    assert stored is not None
    assert judged.critical_values["5%"] == quantile_at(stored, 0.05)
    assert judged.reject == (judged.critical_values["5%"] > -3.6)
    phi = with_exact_values(TestResult("phi3", "trend", 0, 7.0, 0.0, lags, nobs, {}, False, 0.0), 0.05)
    assert phi.critical_values == exact_phi_critical_values("phi3", nobs, lags)
    assert phi.p_value is not None and 0.0 < phi.p_value < 1.0


def test_the_table_agrees_with_a_fresh_simulation_under_another_seed() -> None:
    length = max(length for length, _ in CELLS)
    direct = length_nulls(length, 2, 100_000, 20261202, 10)
    for p in range(3):
        for name in TABLE_STATISTICS:
            upper = name.startswith("phi")
            for level, a in {"1%": 0.01, "5%": 0.05, "10%": 0.10}.items():
                table = quantile_at(CELLS[(length, p)][name], 1.0 - a if upper else a)
                value = direct[p].quantiles[name].values[level]
                se = direct[p].quantiles[name].standard_errors[level]
                # the table's own error is √10 times smaller than the fresh 10⁵ draws'
                assert abs(table - value) <= 4.0 * math.sqrt(1.1) * se + UNIT, (p, name, level)
