"""The seasonal unit-root test of many series of one length and period at once.

The same test as :func:`tauscope.engine.seasonal.roots.seasonal_unit_roots` (HEGY 1990
for quarters, Beaulieu & Miron 1993 for months), each step batched over the rows: the
scaling by the spread of Δ_S y, the lag search (every lag order's RSS from one QR of
the nested designs per row, the QRs stacked: Golub & Van Loan 2013, §5.3), the chosen
regression (the rows of one lag order fitted by one stacked QR, ``design.fit``), and
the critical values and sorted null draws looked up once per (length, lag order), the
p-values interpolated for a whole column at a time.  Each row's numbers depend on that
row alone; tests/test_engine_seasonal_roots.py checks them against the series tested
one by one (1e-8).  A row the batch cannot promise that for (a gap, no change from year
to year, an exact or failed fit, a lag rule other than AIC or BIC) is tested one by one,
so it gets the per-series result or error sentence.
"""

from __future__ import annotations

from functools import lru_cache

import numpy as np

from tauscope.engine.seasonal.critical import (
    DEFAULT_REPS,
    DEFAULT_SEED,
    default_max_lags,
    minimum_length,
)
from tauscope.engine.seasonal.design import (
    build,
    deterministic_columns,
    n_deterministic,
    statistics_for,
)
from tauscope.engine.seasonal.null import SeasonalNull, seasonal_null
from tauscope.engine.seasonal.results import SeasonalRootsResult
from tauscope.engine.seasonal.roots import (
    RootsKey,
    check_options,
    roots_result,
    seasonal_unit_roots,
)

Outcome = SeasonalRootsResult | ValueError | ArithmeticError
_BATCHED_RULES = ("aic", "bic")


def seasonal_unit_roots_many(
    rows: np.ndarray,
    period: int,
    deterministic: str = "dummies",
    lag_rule: str = "aic",
    max_lags: int | None = None,
    alpha: float = 0.05,
    reps: int = DEFAULT_REPS,
    seed: int = DEFAULT_SEED,
) -> list[Outcome]:
    """``seasonal_unit_roots(row, period, deterministic, lag_rule, None, max_lags, alpha,
    reps, seed)`` for every row of ``rows`` (B, n): its result, or the error it raises."""
    values = np.atleast_2d(np.asarray(rows, dtype=float))
    count, n = values.shape
    out: list[Outcome | None] = [None] * count
    try:
        check_options(period, deterministic, alpha, lag_rule, n)
    except ValueError as exc:
        return [exc] * count
    p_max = default_max_lags(n, period, deterministic) if max_lags is None else int(max_lags)
    batched = (lag_rule in _BATCHED_RULES and p_max >= 0
               and n >= minimum_length(period, deterministic, p_max))
    if batched and count:
        key = RootsKey(period, deterministic, lag_rule, p_max, n, alpha, reps, seed)
        try:
            with np.errstate(all="ignore"):
                _batch(values, period, deterministic, lag_rule, p_max, key, out)
        except (ValueError, ArithmeticError):
            out = [None] * count  # every row one by one
    for i in range(count):
        if out[i] is None:
            try:
                out[i] = seasonal_unit_roots(values[i], period, deterministic, lag_rule, None,
                                             max_lags, alpha, reps, seed)
            except (ValueError, ArithmeticError) as exc:
                out[i] = exc
    return [item for item in out if item is not None]


def _batch(values: np.ndarray, period: int, deterministic: str, rule: str, p_max: int,
           key: RootsKey, out: list[Outcome | None]) -> None:
    """Fill ``out`` for the rows the batch can test (the others stay None)."""
    n = values.shape[1]
    finite = np.isfinite(values).all(axis=1)
    spread = np.std(values[:, period:] - values[:, :-period], axis=1)
    usable = finite & np.isfinite(spread) & (spread != 0.0)
    rows = np.flatnonzero(usable)
    if rows.size == 0:
        return
    y = values[rows] / spread[rows, None]
    # seasonal_unit_roots scales twice (its lag search and its fit clean the scaled series
    # again, dividing by a spread of 1 up to rounding): so do the rows here
    y = y / np.std(y[:, period:] - y[:, :-period], axis=1)[:, None]
    chosen = choose_lags_many(y, period, deterministic, rule, p_max)
    stats = statistics_for(period)
    for lag in np.unique(chosen):
        members = np.flatnonzero(chosen == lag)
        found, fine = _statistics(y[members], period, deterministic, int(lag))
        null = _null(period, deterministic, n, int(lag), key.reps, key.seed)
        columns = [null.p_values(i, found[:, i], stat.kind) for i, stat in enumerate(stats)]
        p_rows = list(zip(*(p for p, _ in columns), strict=True))  # each member's, stats order
        bound_rows = list(zip(*(b for _, b in columns), strict=True))
        values = found.tolist()  # plain floats, as float(v) gives them
        origin = rows[members].tolist()
        lag_order = int(lag)
        for j in np.flatnonzero(fine).tolist():  # the others are tested one by one
            out[origin[j]] = roots_result(key, lag_order, values[j], null, p_rows[j],
                                          bound_rows[j])


def choose_lags_many(y: np.ndarray, period: int, deterministic: str, rule: str,
                     p_max: int) -> np.ndarray:
    """AIC or BIC lag order of every row of ``y`` (scaled series, B × n): ``choose_lags``
    with the QRs of the nested designs stacked."""
    if p_max == 0:
        return np.zeros(y.shape[0], dtype=int)
    first = period + p_max
    m = y.shape[1] - first
    dependent, regressors, lag_block = build(y, period, p_max, first)
    qd = _deterministic_basis(deterministic, period, first, y.shape[1])
    augmented = np.concatenate([regressors, lag_block, dependent[:, :, None]], axis=2)
    if qd.shape[1]:
        augmented = augmented - qd @ (qd.T @ augmented)
    r = np.asarray(np.linalg.qr(augmented, mode="r"))
    tail = r[:, period:, -1] ** 2
    rss = np.cumsum(tail[:, ::-1], axis=1)[:, ::-1]  # (B, p_max + 1)
    penalty = 2.0 if rule == "aic" else float(np.log(m))
    best = np.zeros(y.shape[0], dtype=int)
    best_ic = np.full(y.shape[0], np.inf)
    for p in range(p_max + 1):
        k = n_deterministic(deterministic, period) + period + p
        ic = np.log(rss[:, p] / m) + penalty * k / m
        better = ic < best_ic - 1e-12
        best[better], best_ic[better] = p, ic[better]
    return best


def _statistics(y: np.ndarray, period: int, deterministic: str,
                lags: int) -> tuple[np.ndarray, np.ndarray]:
    """(statistics (B, k), rows whose fit the batch may keep): ``seasonal_statistics``
    over the rows, which sends an exact fit or a non-finite statistic back one by one."""
    n = y.shape[1]
    dependent, regressors, lag_block = build(y, period, lags, period + lags)
    qd = _deterministic_basis(deterministic, period, period + lags, n)
    stats = statistics_for(period)
    try:
        coef, cov, rss = _fit_rows(dependent[:, :, None], np.concatenate([regressors, lag_block], axis=2), qd)
    except np.linalg.LinAlgError:
        return np.full((y.shape[0], len(stats)), np.nan), np.zeros(y.shape[0], bool)
    s2 = rss / (dependent.shape[1] - qd.shape[1] - coef.shape[1])
    found = np.empty((y.shape[0], len(stats)))
    f_groups: dict[int, list[int]] = {}
    for i, stat in enumerate(stats):
        if stat.kind == "t":
            j = stat.columns[0]
            found[:, i] = coef[:, j] / np.sqrt(s2 * cov[:, j, j])
        else:
            f_groups.setdefault(len(stat.columns), []).append(i)
    for size, members in f_groups.items():
        # b_B'V_BB⁻¹b_B / (q s²), as design.statistics: the statistics of one size solved in
        # one call (LAPACK solves each matrix on its own, so the same numbers as one by one)
        cols = np.array([stats[i].columns for i in members])  # (F, q)
        b = coef[:, cols]  # (B, F, q)
        blocks = cov[:, cols[:, :, None], cols[:, None, :]]  # (B, F, q, q)
        solved = np.linalg.solve(blocks, b[..., None])[..., 0]
        # numpy's own row sums, not a BLAS dot: its result can depend on the alignment
        quad = np.sum(b * solved, axis=2)
        found[:, members] = quad / (size * s2[:, None])
    fine = (rss > 1e-20 * (n - period - lags)) & np.isfinite(found).all(axis=1)
    return found, fine


def _fit_rows(y: np.ndarray, x: np.ndarray, qd: np.ndarray) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """``design.fit`` with every product taken matrix by matrix over the stack (y: B × m × 1),
    so that a row gets the same bits alone as in a batch of any size: (coef, (X'X)⁻¹, RSS).
    ``qd``: an orthonormal basis of the deterministic columns (:func:`_deterministic_basis`)."""
    if qd.shape[1]:
        y = y - qd @ (qd.T @ y)
        x = x - qd @ (qd.T @ x)
    q, r = np.linalg.qr(x)
    qy = np.swapaxes(q, 1, 2) @ y
    r_inv = np.linalg.inv(r)
    resid = y - q @ qy
    rss = (np.swapaxes(resid, 1, 2) @ resid)[:, 0, 0]
    return (r_inv @ qy)[:, :, 0], r_inv @ np.swapaxes(r_inv, 1, 2), rss


@lru_cache(maxsize=64)
def _deterministic_basis(deterministic: str, period: int, first: int, n: int) -> np.ndarray:
    """Q of the QR of the deterministic columns on rows first … n − 1 (m × d; d = 0: none),
    once per (terms, period, first row, length): every batch of that shape projects them out."""
    det = deterministic_columns(deterministic, np.arange(first, n), period)
    qd = np.linalg.qr(det)[0] if det.shape[1] else det
    qd.setflags(write=False)
    return qd


@lru_cache(maxsize=64)
def _null(period: int, deterministic: str, n: int, lags: int, reps: int, seed: int) -> SeasonalNull:
    """``seasonal_null``, once per request (it is frozen; its draws are cached where simulated)."""
    return seasonal_null(period, deterministic, n, lags, reps, seed)
