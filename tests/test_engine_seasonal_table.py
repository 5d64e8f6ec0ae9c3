"""The shipped seasonal unit-root null table (seasonal/table_grid.py, seasonal/null.py).

Its cells are the direct simulation's quantiles; here: the published tables at lag 0
(Beaulieu & Miron 1993 at n = 240, monthly; HEGY 1990 Table 1b, F_π3π4 with seasonal dummies,
quarterly, interpolated between grid lengths where n is off the grid), the reading between
lengths, where the table answers and where it leaves the request to the simulation, and the
one-series and batched tests reading the same numbers.
"""

from __future__ import annotations

import importlib
import itertools
import math

import numpy as np
import pytest

from tauscope.engine.distributions.exact_grid import PROBABILITIES, quantile_at
from tauscope.engine.seasonal.critical import DEFAULT_REPS, critical_values
from tauscope.engine.seasonal.null import seasonal_null
from tauscope.engine.seasonal.roots import seasonal_unit_roots
from tauscope.engine.seasonal.roots_many import seasonal_unit_roots_many
from tauscope.engine.seasonal.table_grid import (
    LENGTHS,
    seasonal_quantiles,
    table_lags,
    table_reps,
)
from test_engine_seasonal_critical import BM_F_240, BM_F_OFFSET, BM_T_240, HEGY_1B, PUBLISHED_REPS

T_SIZES = (0.01, 0.025, 0.05, 0.10)
F_SIZES = (0.10, 0.05, 0.025, 0.01)


def _tolerance(quantiles: np.ndarray, prob: float) -> float:
    """As tests/test_engine_seasonal_critical.py's ``_check``: 0.05, or four standard errors of
    the difference from a published value when that is wider; each side's SE of the
    prob-quantile is √(p(1 − p)/R) · dq/dp (R: the table's replications, and
    ``PUBLISHED_REPS``), dq/dp from the stored quantiles around it."""
    i = PROBABILITIES.index(round(prob, 4))
    slope = float(np.gradient(quantiles, np.array(PROBABILITIES))[i])
    spread = math.sqrt(prob * (1.0 - prob)) * slope
    se, se_published = spread / math.sqrt(table_reps()), spread / math.sqrt(PUBLISHED_REPS)
    return max(0.05, 4.0 * math.hypot(se, se_published))


def _read(period: int, n: int) -> dict[str, np.ndarray]:
    read = seasonal_quantiles(period, "dummies", n, 0)
    if read is None:
        pytest.skip(f"the table does not cover S = {period}, n = {n}")
    return read


@pytest.mark.parametrize("stat", ["t_pi1", "t_pi2"])
def test_beaulieu_miron_t_at_240(stat: str) -> None:
    read = _read(12, 240)
    for size, value in zip(T_SIZES, BM_T_240[(stat, "dummies")], strict=True):
        ours = quantile_at(read[stat], size)
        assert abs(ours - value) <= _tolerance(read[stat], size), (stat, size, ours, value)


@pytest.mark.parametrize("pair", ["F_pi3_pi4", "F_pi5_pi6", "F_pi7_pi8", "F_pi9_pi10",
                                  "F_pi11_pi12"])
def test_beaulieu_miron_f_at_240(pair: str) -> None:
    read = _read(12, 240)
    for size, value in zip(F_SIZES, BM_F_240["dummies"], strict=True):
        ours = quantile_at(read[pair], 1.0 - size) + BM_F_OFFSET["dummies"]
        assert abs(ours - value) <= _tolerance(read[pair], 1.0 - size), (pair, size, ours, value)


@pytest.mark.parametrize("n", [48, 100, 136, 200])
def test_hegy_table_1b_f_pi3_pi4_with_dummies(n: int) -> None:
    read = _read(4, n)
    for size, value in zip(F_SIZES, HEGY_1B["dummies"][n], strict=True):
        ours = quantile_at(read["F_pi3_pi4"], 1.0 - size)
        assert abs(ours - value) <= _tolerance(read["F_pi3_pi4"], 1.0 - size), (n, size, ours, value)


def test_grid_cells_are_read_as_stored_and_between_them_in_one_over_df() -> None:
    period = 12
    grid = LENGTHS[period]
    for short, long in itertools.pairwise(grid):
        low, high = seasonal_quantiles(period, "dummies", short, 0), seasonal_quantiles(
            period, "dummies", long, 0)
        if low is None or high is None:
            continue
        mid = seasonal_quantiles(period, "dummies", (short + long) // 2, 0)
        assert mid is not None
        for name in low:
            lo, hi = np.minimum(low[name], high[name]), np.maximum(low[name], high[name])
            assert np.all(mid[name] >= lo - 1e-12) and np.all(mid[name] <= hi + 1e-12)
        return
    pytest.skip("no two neighbouring monthly lengths in the table")


def test_requests_the_table_does_not_hold_are_left_to_the_simulation() -> None:
    assert seasonal_quantiles(12, "dummies_trend", 240, 0) is None  # another design
    assert seasonal_quantiles(12, "dummies", LENGTHS[12][-1] + 1, 0) is None  # beyond the grid
    assert seasonal_quantiles(12, "dummies", LENGTHS[12][0] - 1, 0) is None  # below it
    too_many = max(table_lags(12, LENGTHS[12][0])) + 1
    between = (LENGTHS[12][0] + LENGTHS[12][1]) // 2
    assert seasonal_quantiles(12, "dummies", between, too_many) is None  # the short cell lacks it
    off_default = seasonal_null(4, "dummies", 100, 0, reps=2_000, seed=3)
    assert not off_default.tabulated and off_default.reps == 2_000
    assert off_default.critical_values == critical_values(4, "dummies", 100, 0, 2_000, 3)


def test_read_p_values_and_critical_values_agree() -> None:
    null = seasonal_null(12, "dummies", 240, 2)
    if not null.tabulated:
        pytest.skip("the table does not cover S = 12, n = 240")
    assert null.reps == table_reps(12, 240) and null.reps != DEFAULT_REPS
    crit = null.critical_values["t_pi1"]["5%"]
    p, bound = null.p_values(0, np.array([crit, crit - 10.0, crit + 10.0, np.nan]), "t")
    assert p[0] == pytest.approx(0.05, abs=1e-9)
    assert (p[1], bound[1]) == (0.001, "below")
    assert p[2] == 1.0 and bound[2] is None
    assert p[3] is None and bound[3] is None
    f_crit = null.critical_values["F_all"]["1%"]
    p, bound = null.p_values(8, np.array([f_crit, f_crit + 100.0]), "F")
    assert p[0] == pytest.approx(0.01, abs=1e-9)
    assert (p[1], bound[1]) == (0.001, "below")


def test_one_series_and_the_batch_read_the_same_numbers() -> None:
    rng = np.random.default_rng(11)
    rows = np.cumsum(rng.standard_normal((6, 240)), axis=1)
    batch = seasonal_unit_roots_many(rows, 12)
    for row, found in zip(rows, batch, strict=True):
        alone = seasonal_unit_roots(row, 12)
        assert not isinstance(found, Exception)
        assert found.reps == alone.reps
        for a, b in zip(alone.tests, found.tests, strict=True):
            assert a.critical_values == b.critical_values
            assert a.p_value_bound == b.p_value_bound
            assert (a.p_value is None) == (b.p_value is None)
            if a.p_value is not None and b.p_value is not None:
                assert abs(a.p_value - b.p_value) < 1e-8


def test_replications_are_those_of_the_cells_read() -> None:
    """Each generated module states its replications; a value read between two grid lengths
    counts the fewer of the two cells' (it is no more precise than its less precise cell)."""
    from tauscope.engine.seasonal import table_grid

    for name, (period, lengths) in table_grid.PARTS.items():
        module = importlib.import_module(f"tauscope.engine.seasonal.{name}")
        for length in lengths:
            assert table_grid.table_reps(period, length) == (module.REPS if module.CELLS else 0)
    for period, grid in table_grid.LENGTHS.items():
        for short, long in itertools.pairwise(grid):
            between = table_grid.table_reps(period, (short + long) // 2)
            assert between == min(table_grid.table_reps(period, short),
                                  table_grid.table_reps(period, long))
        assert table_grid.table_reps(period, grid[-1] + 1) == 0  # beyond the grid
    generated = [table_grid.table_reps(period, n) for period, grid in table_grid.LENGTHS.items()
                 for n in grid if table_grid.table_reps(period, n)]
    assert table_grid.table_reps() == min(generated)
