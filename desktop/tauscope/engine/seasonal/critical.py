"""Simulated null distributions of the seasonal unit-root statistics at the
series' own length (for seasonal dummies at the default replications a test reads the
shipped table instead, ``null.seasonal_null``; the table's cells are this simulation's
quantiles at 200,000 replications, ``table_make``).

Under the null every seasonal and the long-run unit root is present: the series
is a seasonal random walk

    y_t = y_{t−S} + e_t,   e_t ~ N(0, 1),   y_{1−S} = … = y_0 = 0,

as in the Monte Carlo designs of Hylleberg, Engle, Granger & Yoo (1990,
Tables 1a and 1b: quarterly, n = 48, 100, 136, 200) and Beaulieu & Miron
(1993, Tables: monthly, n = 240, 480).  With seasonal dummies in the regression
(what the engine uses) the statistics do not depend on where the walk starts:
any start values are a fixed seasonal pattern, which the dummies take out exactly.
Without them they do, and the published tables are matched by walks that start
long before the sample (``presample``, measured in
tests/test_engine_seasonal_critical.py and benchmarks/hegy_table_conventions.py).
``n`` is the length of the series; the
regression of ``seasonal_design`` with ``lags`` lagged Δ_S y is fitted on its
longest sample, n − S − lags rows.  The statistics do not depend on the error
variance.

The replications are drawn in chunks from one generator (the stream does not
depend on the chunk size); the cross products of each chunk's regressions come
from running sums (``gram``) and are solved as a batch by one Cholesky
factor each (``gram_stats``), so a key (period, deterministic, n, lags,
reps, seed) always gives the same numbers.  The running sums of a chunk serve every
lag order at its length, so the first look-up at a length simulates every lag order
the default lag search can choose there in one pass (``pass_lags``; a lag order's
draws do not depend on the others simulated with it).  Sorted draws (for p-values)
are cached for the 64 most recent keys, critical values for 256, and the draws of
:func:`simulate` for 32, so a series costs a look-up once its length is simulated.
Cost measured here (2 shared cores, BLAS on one thread, 20,000 replications): every
lag order 0 … 14 of a monthly series of 240 in 7 s CPU (one order at a time, before,
about 3.4 s each).

Critical values are empirical quantiles: the lower tail of t_π1 and t_π2 and
the upper tail of the F statistics.  p-values interpolate the empirical
distribution function between order statistics; a statistic beyond every draw
gets no p-value, only the bound "below 1/reps" (see ``p_value``).
"""

from __future__ import annotations

from collections.abc import Iterator, Sequence
from functools import lru_cache

import numpy as np

from tauscope.engine.blas_threads import single_blas_thread
from tauscope.engine.seasonal.design import (
    check_deterministic,
    check_period,
    n_deterministic,
    statistics_for,
)
from tauscope.engine.seasonal.gram import RunningSums
from tauscope.engine.seasonal.gram_stats import columns_lags_first, statistics_lags_first

DEFAULT_SEED = 19900401
DEFAULT_REPS = 20_000
LEVELS = {"1%": 0.01, "5%": 0.05, "10%": 0.10}
_CHUNK_VALUES = 1_500_000  # floats of regressors per chunk (about 12 MB)


def minimum_length(period: int, deterministic: str, lags: int) -> int:
    """Shortest series the regression can use: at least 10 residual degrees of
    freedom after the deterministic terms, S π's and the lags."""
    return 2 * period + 2 * lags + n_deterministic(deterministic, period) + 10


def _check(period: int, deterministic: str, n: int, lags: int, reps: int) -> None:
    check_period(period)
    check_deterministic(deterministic)
    if lags < 0:
        raise ValueError("lags must be 0 or more")
    if n < minimum_length(period, deterministic, lags):
        raise ValueError(
            f"a series of {n} observations is too short for the seasonal regression with "
            f"{lags} lags (at least {minimum_length(period, deterministic, lags)} needed)"
        )
    if reps < 100:
        raise ValueError("reps must be at least 100")


def seasonal_random_walks(
    period: int, n: int, reps: int, seed: int, presample: int = 0
) -> Iterator[np.ndarray]:
    """Chunks of (rows, n) seasonal random walks y_t = y_{t−S} + e_t from zero starts
    ``presample`` observations before the first one kept."""
    rng = np.random.default_rng(seed)
    years = -(-(n + presample) // period)
    width = n * (period + 4)  # the regressors each replication becomes
    chunk = max(1, _CHUNK_VALUES // width)
    done = 0
    while done < reps:
        size = min(chunk, reps - done)
        shocks = rng.standard_normal((size, years * period))
        walks = shocks.reshape(size, years, period).cumsum(axis=1).reshape(size, -1)
        yield walks[:, presample : presample + n]
        done += size


def simulate(
    period: int,
    deterministic: str,
    n: int,
    lags: int = 0,
    reps: int = DEFAULT_REPS,
    seed: int = DEFAULT_SEED,
    presample: int = 0,
) -> np.ndarray:
    """(reps, k) draws of the statistics of ``statistics_for(period)`` under the
    null, columns in that order; cached and read-only.  ``presample``: the walks
    start that many observations before the series (see the module's docstring)."""
    _check(period, deterministic, n, lags, reps)
    if presample < 0:
        raise ValueError("presample must be 0 or more")
    return _simulate(period, deterministic, int(n), int(lags), int(reps), int(seed), int(presample))


@lru_cache(maxsize=32)
def _simulate(
    period: int, deterministic: str, n: int, lags: int, reps: int, seed: int, presample: int = 0
) -> np.ndarray:
    return simulate_lags(period, deterministic, n, (lags,), reps, seed, presample)[lags]


def simulate_lags(
    period: int,
    deterministic: str,
    n: int,
    lags: Sequence[int],
    reps: int = DEFAULT_REPS,
    seed: int = DEFAULT_SEED,
    presample: int = 0,
) -> dict[int, np.ndarray]:
    """:func:`simulate` for every lag order in ``lags`` from one set of walks, read-only
    arrays by lag order.  The running sums of each chunk of walks are formed once for
    the largest order (``gram.RunningSums``) and serve every order; a lag order's draws
    do not depend on the other orders simulated with it (the same sums, the same
    arithmetic), so they equal :func:`simulate`'s."""
    wanted = sorted({int(p) for p in lags})
    if not wanted:
        return {}
    for p in wanted:
        _check(period, deterministic, n, p, reps)
    d = n_deterministic(deterministic, period)
    parts: dict[int, list[np.ndarray]] = {p: [] for p in wanted}
    with single_blas_thread():  # thousands of small products: one thread is faster
        for walks in seasonal_random_walks(period, n, reps, seed, presample):
            sums = RunningSums(walks, period, deterministic, wanted[-1])
            for p in wanted:
                gram = sums.gram(p, columns_lags_first(period, p))
                dof = n - 2 * period - 2 * p - d
                parts[p].append(statistics_lags_first(gram, period, p, dof))
    out = {}
    for p, chunks in parts.items():
        draws = np.concatenate(chunks, axis=0)
        draws.setflags(write=False)
        out[p] = draws
    return out


def default_max_lags(n: int, period: int, deterministic: str) -> int:
    """Schwert (1989): ⌊12 (n/100)^{1/4}⌋, cut to the largest p that leaves the
    regression at least 10 residual degrees of freedom."""
    schwert = int(np.floor(12.0 * (n / 100.0) ** 0.25))
    room = (n - minimum_length(period, deterministic, 0)) // 2
    return max(0, min(schwert, room))


def pass_lags(period: int, deterministic: str, n: int, lags: int) -> tuple[int, ...]:
    """The lag orders simulated together when one of them is first asked for at a
    length: 0 … max(``lags``, :func:`default_max_lags`), every order the default lag
    search can choose there (a run's series of one length ask for most of them)."""
    return tuple(range(max(lags, default_max_lags(n, period, deterministic)) + 1))


def quantiles(
    period: int,
    deterministic: str,
    n: int,
    lags: int = 0,
    sizes: tuple[float, ...] = (0.01, 0.05, 0.10),
    reps: int = DEFAULT_REPS,
    seed: int = DEFAULT_SEED,
) -> dict[str, dict[float, float]]:
    """Critical value of every statistic at each size: the ``size`` quantile of a
    t statistic (lower tail), the 1 − ``size`` quantile of an F (upper tail)."""
    ordered = sorted_draws(period, deterministic, n, lags, reps, seed)
    out: dict[str, dict[float, float]] = {}
    for i, stat in enumerate(statistics_for(period)):
        probs = [s if stat.kind == "t" else 1.0 - s for s in sizes]
        values = np.quantile(ordered[i], probs)  # the order statistics: sorted or not, the same
        out[stat.name] = {s: float(v) for s, v in zip(sizes, values, strict=True)}
    return out


def critical_values(
    period: int,
    deterministic: str,
    n: int,
    lags: int = 0,
    reps: int = DEFAULT_REPS,
    seed: int = DEFAULT_SEED,
) -> dict[str, dict[str, float]]:
    """{statistic name: {"1%": …, "5%": …, "10%": …}} at the series' length (a fresh
    copy of a table kept for the 256 most recent keys)."""
    _check(period, deterministic, n, lags, reps)
    table = _critical_table(period, deterministic, int(n), int(lags), int(reps), int(seed))
    return {name: dict(row) for name, row in table.items()}


@lru_cache(maxsize=256)
def _critical_table(
    period: int, deterministic: str, n: int, lags: int, reps: int, seed: int
) -> dict[str, dict[str, float]]:
    table = quantiles(period, deterministic, n, lags, tuple(LEVELS.values()), reps, seed)
    return {
        name: {label: row[size] for label, size in LEVELS.items()} for name, row in table.items()
    }


def sorted_draws(
    period: int,
    deterministic: str,
    n: int,
    lags: int = 0,
    reps: int = DEFAULT_REPS,
    seed: int = DEFAULT_SEED,
) -> np.ndarray:
    """The draws of :func:`simulate` as (k, reps), one row per statistic sorted
    ascending (for :func:`p_value_sorted`); cached and read-only like them."""
    _check(period, deterministic, n, lags, reps)
    return _sorted_draws(period, deterministic, int(n), int(lags), int(reps), int(seed))


@lru_cache(maxsize=64)
def _sorted_draws(
    period: int, deterministic: str, n: int, lags: int, reps: int, seed: int
) -> np.ndarray:
    lags_together = pass_lags(period, deterministic, n, lags)
    return _length_pass(period, deterministic, n, reps, seed, lags_together)[lags]


@lru_cache(maxsize=1)
def _length_pass(
    period: int, deterministic: str, n: int, reps: int, seed: int, lags: tuple[int, ...]
) -> dict[int, np.ndarray]:
    """Every lag order of ``lags`` at one length, simulated together, each statistic's
    draws sorted ascending (k, reps), read-only."""
    out = {}
    for p, draws in simulate_lags(period, deterministic, n, lags, reps, seed).items():
        ordered = np.sort(np.ascontiguousarray(draws.T), axis=1)
        ordered.setflags(write=False)
        out[p] = ordered
    return out


def p_value(draws: np.ndarray, statistic: float, kind: str) -> float | None:
    """Share of null draws at least as extreme as ``statistic``, interpolated
    between order statistics (plotting positions (i − ½)/R).

    t (lower tail): P(T ≤ t); F (upper tail): P(F ≥ f).  Returns None when the
    statistic is more extreme than every draw: the p-value is then below 1/R."""
    if not np.isfinite(statistic):
        return None
    return p_value_sorted(np.sort(np.asarray(draws, dtype=float)), statistic, kind)


def p_value_sorted(ordered: np.ndarray, statistic: float, kind: str) -> float | None:
    """:func:`p_value` given the draws already sorted (ascending)."""
    if not np.isfinite(statistic):
        return None
    positions = _plotting_positions(ordered.size)
    if kind == "t":
        if statistic < ordered[0]:
            return None
        return float(np.interp(statistic, ordered, positions, right=1.0))
    if statistic > ordered[-1]:
        return None
    return float(1.0 - np.interp(statistic, ordered, positions, left=0.0))


def p_values_sorted(ordered: np.ndarray, values: np.ndarray, kind: str) -> list[float | None]:
    """:func:`p_value_sorted` for many statistics at once (the same numbers: one
    ``np.interp`` over the column)."""
    values = np.asarray(values, dtype=float)
    positions = _plotting_positions(ordered.size)
    with np.errstate(invalid="ignore"):
        if kind == "t":
            shares = np.interp(values, ordered, positions, right=1.0)
            beyond = values < ordered[0]
        else:
            shares = 1.0 - np.interp(values, ordered, positions, left=0.0)
            beyond = values > ordered[-1]
    return [None if out or not np.isfinite(v) else float(p)
            for p, v, out in zip(shares, values, beyond, strict=True)]


@lru_cache(maxsize=8)
def _plotting_positions(reps: int) -> np.ndarray:
    """(i − ½)/R for i = 1 … R, read-only."""
    positions = (np.arange(1, reps + 1) - 0.5) / reps
    positions.setflags(write=False)
    return positions
