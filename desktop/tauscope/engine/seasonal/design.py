"""The seasonal unit-root regression: transformed regressors, deterministic terms,
and the t and F statistics computed for a whole batch of series at once.

Quarterly data (S = 4), Hylleberg, Engle, Granger & Yoo (1990), *Journal of
Econometrics* 44.  With the filters

    y1_t = (1 + L + L² + L³) y_t           (keeps the zero frequency)
    y2_t = −(1 − L + L² − L³) y_t          (keeps frequency π)
    y3_t = −(1 − L²) y_t                   (keeps the pair ±π/2)

the auxiliary regression is

    Δ4 y_t = μ_t + π1 y1_{t−1} + π2 y2_{t−1} + π3 y3_{t−2} + π4 y3_{t−1}
             + Σ_{i=1..p} φ_i Δ4 y_{t−i} + e_t.

Monthly data (S = 12), Beaulieu & Miron (1993), *Journal of Econometrics* 55,
the analogue with twelve filters y1 … y12 (coefficients in ``_MONTHLY`` below,
one row per regressor, written as the paper's polynomials in L applied at
t − 1) and Δ12 y_t on the left.

A unit root at a frequency means its π (both π's of a complex pair) is zero:
t_π1 and t_π2 are lower-tailed t statistics; each pair is tested with
F = b'V⁻¹b / (q s²) on its two coefficients (upper tail).  The joint F over
every seasonal frequency (π2 … πS) and over all frequencies (π1 … πS) follow
Ghysels, Lee & Noh (1994), *Journal of Econometrics* 62.

Every regressor of row t is a fixed linear combination of the lag window
[y_{t−1}, …, y_{t−S}], so a batch of series is turned into regressors with one
matrix product.  The deterministic part μ_t (none; constant; S seasonal
dummies; constant and trend; seasonal dummies and trend) is partialled out
with one fixed projection (Frisch-Waugh-Lovell), and the remaining S + p
columns are solved by a batched QR factorisation.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np

DETERMINISTIC = ("none", "constant", "dummies", "trend", "dummies_trend")
PERIODS = (4, 12)

_R3 = math.sqrt(3.0)
# Coefficient of y_{t−j}, j = 1 … 12 (columns), in regressor y_k at t − 1 (rows),
# Beaulieu & Miron (1993), their definitions of the twelve filters.
_MONTHLY = np.array(
    [
        [1] * 12,
        [-1, 1] * 6,
        [0, -1, 0, 1, 0, -1, 0, 1, 0, -1, 0, 1],
        [-1, 0, 1, 0, -1, 0, 1, 0, -1, 0, 1, 0],
        [-0.5 * c for c in (1, 1, -2, 1, 1, -2, 1, 1, -2, 1, 1, -2)],
        [0.5 * _R3 * c for c in (1, -1, 0, 1, -1, 0, 1, -1, 0, 1, -1, 0)],
        [0.5 * c for c in (1, -1, -2, -1, 1, 2, 1, -1, -2, -1, 1, 2)],
        [-0.5 * _R3 * c for c in (1, 1, 0, -1, -1, 0, 1, 1, 0, -1, -1, 0)],
        [-0.5 * c for c in (_R3, -1, 0, 1, -_R3, 2, -_R3, 1, 0, -1, _R3, -2)],
        [0.5 * c for c in (1, -_R3, 2, -_R3, 1, 0, -1, _R3, -2, _R3, -1, 0)],
        [0.5 * c for c in (_R3, 1, 0, -1, -_R3, -2, -_R3, -1, 0, 1, _R3, 2)],
        [-0.5 * c for c in (1, _R3, 2, _R3, 1, 0, -1, -_R3, -2, -_R3, -1, 0)],
    ]
)
# Quarterly, HEGY (1990): y1_{t−1}, y2_{t−1}, y3_{t−2}, y3_{t−1} on y_{t−1} … y_{t−4}.
_QUARTERLY = np.array(
    [
        [1.0, 1.0, 1.0, 1.0],
        [-1.0, 1.0, -1.0, 1.0],
        [0.0, -1.0, 0.0, 1.0],
        [-1.0, 0.0, 1.0, 0.0],
    ]
)


@dataclass(frozen=True)
class Statistic:
    """One statistic of the seasonal regression.

    ``columns`` are the π's it tests (0-based: 0 is π1); ``kind`` is ``"t"``
    (reject for small values) or ``"F"`` (reject for large values);
    ``cycles_per_year`` is k for the frequency 2πk/S (0: the long run; None
    for a joint test over several frequencies); ``words`` names it plainly."""

    name: str
    kind: str
    columns: tuple[int, ...]
    cycles_per_year: int | None
    words: str


_CYCLE_WORDS = {
    1: "once a year",
    2: "twice a year",
    3: "three times a year",
    4: "four times a year",
    5: "five times a year",
    6: "six times a year",
}


def statistics_for(period: int) -> tuple[Statistic, ...]:
    """The statistics reported for a period, in display order.

    Frequency of π_{2k+1}, π_{2k+2} in Beaulieu & Miron (1993): pair (π3, π4)
    is ±π/2 (3 cycles a year), (π5, π6) ±2π/3 (4), (π7, π8) ±π/3 (2),
    (π9, π10) ±5π/6 (5), (π11, π12) ±π/6 (1).  π2 is frequency π: S/2 cycles
    a year (twice a year for quarters, six times for months)."""
    check_period(period)
    half = period // 2
    stats = [
        Statistic("t_pi1", "t", (0,), 0, "long run"),
        Statistic("t_pi2", "t", (1,), half, _CYCLE_WORDS[half]),
    ]
    pair_cycles = {4: (1,), 12: (3, 4, 2, 5, 1)}[period]
    for i, cycles in enumerate(pair_cycles):
        a, b = 2 + 2 * i, 3 + 2 * i
        stats.append(Statistic(f"F_pi{a + 1}_pi{b + 1}", "F", (a, b), cycles, _CYCLE_WORDS[cycles]))
    stats.append(
        Statistic("F_seasonal", "F", tuple(range(1, period)), None, "every seasonal cycle")
    )
    stats.append(
        Statistic("F_all", "F", tuple(range(period)), None, "every cycle and the long run")
    )
    return tuple(stats)


def check_period(period: int) -> None:
    if period not in PERIODS:
        raise ValueError(
            f"seasonal unit roots are tested for quarterly (4) or monthly (12) series, "
            f"not a period of {period}"
        )


def check_deterministic(deterministic: str) -> None:
    if deterministic not in DETERMINISTIC:
        raise ValueError(
            f"deterministic must be one of {', '.join(DETERMINISTIC)}, not {deterministic!r}"
        )


def coefficients(period: int) -> np.ndarray:
    """Rows: regressors π1 … πS; columns: weights on y_{t−1} … y_{t−S}."""
    check_period(period)
    return (_QUARTERLY if period == 4 else _MONTHLY).copy()


def deterministic_columns(deterministic: str, rows: np.ndarray, period: int) -> np.ndarray:
    """μ_t for the regression rows ``rows`` (0-based time index).

    Seasonal dummies are one column per season (t mod S), which spans the same
    space as a constant plus S − 1 dummies whatever season the series starts
    in; the trend is centred and scaled (same span, better conditioning)."""
    check_deterministic(deterministic)
    m = rows.size
    cols: list[np.ndarray] = []
    if deterministic in ("constant", "trend"):
        cols.append(np.ones(m))
    if deterministic in ("dummies", "dummies_trend"):
        season = rows % period
        cols.extend((season == s).astype(float) for s in range(period))
    if deterministic in ("trend", "dummies_trend"):
        t = rows.astype(float)
        cols.append((t - t.mean()) / max(m, 1))
    if not cols:
        return np.empty((m, 0))
    return np.column_stack(cols)


def n_deterministic(deterministic: str, period: int) -> int:
    check_deterministic(deterministic)
    return {"none": 0, "constant": 1, "dummies": period, "trend": 2, "dummies_trend": period + 1}[
        deterministic
    ]


def build(
    series: np.ndarray, period: int, lags: int, first_row: int | None = None
) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """Dependent variable, seasonal regressors and lagged Δ_S y for a batch.

    ``series`` is (R, n); rows t = first_row … n − 1 (0-based), by default
    S + lags, the longest sample.  Returns Δ_S y_t (R, m), the π regressors
    (R, m, S) and Δ_S y_{t−1} … Δ_S y_{t−p} (R, m, p)."""
    y = np.atleast_2d(np.asarray(series, dtype=float))
    n = y.shape[1]
    start = period + lags if first_row is None else first_row
    if start < period + lags:
        raise ValueError("first_row leaves no room for the lags")
    rows = np.arange(start, n)
    windows = np.lib.stride_tricks.sliding_window_view(y, period, axis=1)
    lagged = windows[:, rows - period, ::-1]  # [y_{t−1}, …, y_{t−S}]
    # One product per series (a stack of m × S matrices), not one over all R·m rows: in a
    # single product a row's bits depend on where BLAS's blocking puts it, so a series would
    # not get the same regressors alone as in a batch on every processor.
    regressors = np.ascontiguousarray(lagged) @ coefficients(period).T
    dependent = y[:, rows] - y[:, rows - period]
    seasonal_diff = y[:, period:] - y[:, :-period]  # index t − S
    # Δ_S y_{t−i} for i = 1 … p, one gather: (R, m, p)
    lag_block = seasonal_diff[:, rows[:, None] - period - np.arange(1, lags + 1)[None, :]]
    return dependent, regressors, lag_block


@dataclass(frozen=True)
class BatchFit:
    """OLS of Δ_S y on [π regressors, lags] after partialling out μ_t, per series.

    ``coef`` (R, k), ``cov`` the unscaled (X'X)⁻¹ (R, k, k), ``rss`` (R,),
    ``dof`` = m − d − k (the same for every series)."""

    coef: np.ndarray
    cov: np.ndarray
    rss: np.ndarray
    dof: int


def fit(dependent: np.ndarray, regressors: np.ndarray, det: np.ndarray) -> BatchFit:
    """Batched OLS by QR: R̂ b = Q'y, (X'X)⁻¹ = R̂⁻¹R̂⁻ᵀ, RSS from the residuals.

    The deterministic columns ``det`` (m, d) are the same for every series and
    are projected out first (Frisch-Waugh-Lovell)."""
    y = dependent
    x = regressors
    if det.shape[1]:
        qd, _ = np.linalg.qr(det)
        y = y - (y @ qd) @ qd.T
        x = x - qd @ (qd.T @ x)
    q, r = np.linalg.qr(x)
    qy = np.einsum("rmk,rm->rk", q, y)
    r_inv = np.linalg.inv(r)
    coef = np.einsum("rij,rj->ri", r_inv, qy)
    resid = y - np.einsum("rmk,rk->rm", q, qy)
    rss = np.einsum("rm,rm->r", resid, resid)
    cov = r_inv @ np.swapaxes(r_inv, 1, 2)
    dof = y.shape[1] - det.shape[1] - x.shape[2]
    return BatchFit(coef=coef, cov=cov, rss=rss, dof=dof)


def fit_from_gram(gram: np.ndarray, m: int, d: int) -> BatchFit:
    """OLS from G = A'M_DA (R, k + 1, k + 1), the dependent variable last:
    b = G_xx⁻¹G_xy, (X'X)⁻¹ = G_xx⁻¹, RSS = G_yy − b'G_xy, dof = m − d − k."""
    k = gram.shape[1] - 1
    cov = np.linalg.inv(gram[:, :k, :k])
    xy = gram[:, :k, k]
    coef = np.einsum("rij,rj->ri", cov, xy)
    rss = gram[:, k, k] - np.einsum("ri,ri->r", coef, xy)
    return BatchFit(coef=coef, cov=cov, rss=rss, dof=m - d - k)


def statistics(result: BatchFit, stats: tuple[Statistic, ...]) -> np.ndarray:
    """(R, len(stats)) array: t = b/√(s² v_jj); F = b_B'(V_BB)⁻¹b_B / (q s²)."""
    s2 = result.rss / result.dof
    out = np.empty((result.coef.shape[0], len(stats)))
    for i, stat in enumerate(stats):
        cols = list(stat.columns)
        if stat.kind == "t":
            j = cols[0]
            out[:, i] = result.coef[:, j] / np.sqrt(s2 * result.cov[:, j, j])
        else:
            b = result.coef[:, cols]
            v = result.cov[:, cols][:, :, cols]
            quad = np.einsum("ri,ri->r", b, np.linalg.solve(v, b[:, :, None])[:, :, 0])
            out[:, i] = quad / (len(cols) * s2)
    return out
