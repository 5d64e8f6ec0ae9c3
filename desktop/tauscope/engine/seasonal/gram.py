"""Cross products of the seasonal regression from running sums, for simulations.

Every column of the seasonal regression with p lags (the π regressors, the
lagged Δ_S y and the dependent Δ_S y_t) is a fixed combination of the window
w_t = [y_t, y_{t−1}, …, y_{t−L+1}], L = S + p + 1: A = W T.  So

    A'M_D A = T' (W'W − (D'W)'(D'D)⁻¹(D'W)) T,

and every entry of W'W and D'W over the rows t = a … n − 1 (a = S + p) is a
difference of two prefix sums:

    Σ_t y_{t−i} y_{t−j}  (j = i + h)  from the running sum of y_s y_{s−h};
    Σ_t y_{t−i}                         from the running sum of y;
    Σ_{t ≡ s (mod S)} y_{t−i}            from the running sum of y over one season;
    Σ_t t · y_{t−i}                      from the running sums of u·y_u and y_u.

This costs O(n·L) per replication instead of O(m·L²) for forming A and A'A,
which makes 100,000-replication tables at monthly lengths practical.  The
result is the Gram matrix of the regressors ``seasonal_design.build`` makes
explicitly (a test checks the two against each other).
"""

from __future__ import annotations

import numpy as np

from tauscope.engine.seasonal.design import coefficients, deterministic_columns


def transform(period: int, lags: int) -> np.ndarray:
    """T ((S + p + 1) × (S + p + 1)): window lags 0 … S + p → columns
    [π1 … πS, Δ_S y_{t−1} … Δ_S y_{t−p}, Δ_S y_t]."""
    width = period + lags + 1
    k = period + lags
    out = np.zeros((width, k + 1))
    out[1 : period + 1, :period] = coefficients(period).T
    for i in range(1, lags + 1):
        out[i, period + i - 1] = 1.0
        out[i + period, period + i - 1] = -1.0
    out[0, k] = 1.0
    out[period, k] = -1.0
    return out


def _prefix(values: np.ndarray) -> np.ndarray:
    """Running sums with a leading zero: out[:, u] = Σ_{v<u} values[:, v]."""
    out = np.zeros((values.shape[0], values.shape[1] + 1))
    np.cumsum(values, axis=1, out=out[:, 1:])
    return out


def _window_gram(y: np.ndarray, first: int, width: int) -> np.ndarray:
    """W'W (R, L, L) with W[t, i] = y_{t−i}, t = first … n − 1."""
    reps, n = y.shape
    out = np.empty((reps, width, width))
    for h in range(width):
        sums = _prefix(y[:, h:] * y[:, : n - h])  # sums[:, u] = Σ_{s=h}^{h+u−1} y_s y_{s−h}
        i = np.arange(width - h)
        # Σ_{t=first}^{n−1} y_{t−i} y_{t−i−h} = Σ_{s=first−i}^{n−1−i} y_s y_{s−h}
        block = sums[:, n - i - h] - sums[:, first - i - h]
        out[:, i, i + h] = block
        out[:, i + h, i] = block
    return out


def _det_cross(
    y: np.ndarray, first: int, width: int, period: int, deterministic: str
) -> np.ndarray:
    """D'W (R, d, L) for the deterministic columns of ``deterministic_columns``."""
    reps, n = y.shape
    i = np.arange(width)
    hi, lo = n - i, first - i  # t − i runs over u = lo … hi − 1
    rows: list[np.ndarray] = []
    level = _prefix(y)
    if deterministic in ("constant", "trend"):
        rows.append(level[:, hi] - level[:, lo])
    if deterministic in ("dummies", "dummies_trend"):
        years = -(-n // period)
        padded = np.zeros((reps, years * period))
        padded[:, :n] = y
        # running[:, j, r] = Σ_{j' ≤ j} y_{j'S + r}: one running sum per season
        running = np.concatenate(
            [np.zeros((reps, 1, period)), padded.reshape(reps, years, period).cumsum(axis=1)],
            axis=1,
        )

        def season_sum(r: np.ndarray, upto: np.ndarray) -> np.ndarray:
            """Σ_{v < upto, v ≡ r} y_v for paired vectors r, upto (→ (R, len))."""
            count = (upto - r + period - 1) // period  # how many v = r, r + S, … lie below upto
            return running[:, count, r]

        for s in range(period):
            r = (s - i) % period  # t ≡ s  ⇔  u = t − i ≡ s − i
            rows.append(season_sum(r, hi) - season_sum(r, lo))
    if deterministic in ("trend", "dummies_trend"):
        m = n - first
        t_mean = (first + n - 1) / 2.0
        weighted = _prefix(y * np.arange(n, dtype=float))
        # Σ_t t·y_{t−i} = Σ_u (u + i) y_u
        total_t = (weighted[:, hi] - weighted[:, lo]) + i * (level[:, hi] - level[:, lo])
        rows.append((total_t - t_mean * (level[:, hi] - level[:, lo])) / m)
    if not rows:
        return np.zeros((reps, 0, width))
    return np.stack(rows, axis=1)


def regression_gram(y: np.ndarray, period: int, lags: int, deterministic: str) -> np.ndarray:
    """A'M_D A (R, k + 1, k + 1) for A = [π regressors, lags, Δ_S y_t] on the
    longest sample of each series in the batch ``y`` (R, n)."""
    y = np.atleast_2d(np.asarray(y, dtype=float))
    n = y.shape[1]
    first = period + lags
    width = period + lags + 1
    gram = _window_gram(y, first, width)
    det = deterministic_columns(deterministic, np.arange(first, n), period)
    if det.shape[1]:
        cross = _det_cross(y, first, width, period, deterministic)
        solved = np.linalg.solve(det.T @ det, cross)  # (D'D)⁻¹ D'W, batched on the right
        gram = gram - np.swapaxes(cross, 1, 2) @ solved
    t = transform(period, lags)
    return t.T @ gram @ t
