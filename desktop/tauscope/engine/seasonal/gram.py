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
which makes 100,000-replication tables at monthly lengths practical; and the
running sums at the widest window serve every narrower one, so one pass over a
batch gives the cross products of every lag order (``RunningSums``).  The
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


class RunningSums:
    """The running sums of a batch ``y`` (R, n) that every lag order p ≤ ``max_lags``
    of the seasonal regression needs: built once, read for each p by :meth:`gram`.

    Each lag order's sample is its own longest one (rows t = S + p … n − 1), so its
    cross products are other differences of the same running sums: a simulation of
    every lag order at one length pays for the sums once."""

    def __init__(self, y: np.ndarray, period: int, deterministic: str, max_lags: int) -> None:
        y = np.atleast_2d(np.asarray(y, dtype=float))
        self.reps, self.n = y.shape
        self.period, self.deterministic = period, deterministic
        n = self.n
        # products[h][:, u] = Σ_{s=h}^{h+u−1} y_s y_{s−h}
        self._products = [_prefix(y[:, h:] * y[:, : n - h]) for h in range(period + max_lags + 1)]
        self._level = _prefix(y)
        self._running: np.ndarray | None = None
        self._weighted: np.ndarray | None = None
        if deterministic in ("dummies", "dummies_trend"):
            years = -(-n // period)
            padded = np.zeros((self.reps, years * period))
            padded[:, :n] = y
            # running[:, j, r] = Σ_{j' < j} y_{j'S + r}: one running sum per season
            self._running = np.concatenate(
                [np.zeros((self.reps, 1, period)),
                 padded.reshape(self.reps, years, period).cumsum(axis=1)], axis=1)
        if deterministic in ("trend", "dummies_trend"):
            self._weighted = _prefix(y * np.arange(n, dtype=float))

    def window_gram(self, lags: int) -> np.ndarray:
        """W'W (R, L, L) with W[t, i] = y_{t−i}, t = S + p … n − 1, L = S + p + 1."""
        n, first, width = self.n, self.period + lags, self.period + lags + 1
        out = np.empty((self.reps, width, width))
        for h in range(width):
            sums = self._products[h]
            i = np.arange(width - h)
            # Σ_{t=first}^{n−1} y_{t−i} y_{t−i−h} = Σ_{s=first−i}^{n−1−i} y_s y_{s−h}
            block = sums[:, n - i - h] - sums[:, first - i - h]
            out[:, i, i + h] = block
            out[:, i + h, i] = block
        return out

    def det_cross(self, lags: int) -> np.ndarray:
        """D'W (R, d, L) for the deterministic columns of ``deterministic_columns``."""
        n, period, first = self.n, self.period, self.period + lags
        width = first + 1
        i = np.arange(width)
        hi, lo = n - i, first - i  # t − i runs over u = lo … hi − 1
        level = self._level
        rows: list[np.ndarray] = []
        if self.deterministic in ("constant", "trend"):
            rows.append(level[:, hi] - level[:, lo])
        if self._running is not None:
            running = self._running

            def season_sum(r: np.ndarray, upto: np.ndarray) -> np.ndarray:
                """Σ_{v < upto, v ≡ r} y_v for paired vectors r, upto (→ (R, len))."""
                count = (upto - r + period - 1) // period  # v = r, r + S, … below upto
                return running[:, count, r]

            for s in range(period):
                r = (s - i) % period  # t ≡ s  ⇔  u = t − i ≡ s − i
                rows.append(season_sum(r, hi) - season_sum(r, lo))
        if self._weighted is not None:
            m = n - first
            t_mean = (first + n - 1) / 2.0
            # Σ_t t·y_{t−i} = Σ_u (u + i) y_u
            total_t = (self._weighted[:, hi] - self._weighted[:, lo]) + i * (level[:, hi] - level[:, lo])
            rows.append((total_t - t_mean * (level[:, hi] - level[:, lo])) / m)
        if not rows:
            return np.zeros((self.reps, 0, width))
        return np.stack(rows, axis=1)

    def gram(self, lags: int, columns: list[int] | None = None) -> np.ndarray:
        """A'M_D A (R, k + 1, k + 1) for A = [π regressors, lags, Δ_S y_t] (or those
        columns in the order ``columns``) on each series' longest sample.

        With T the window-to-column map, C = D'W and L L' = D'D (one Cholesky factor
        for the whole batch): A'M_D A = T'W'WT − E'E, E = L⁻¹CT."""
        reps, period = self.reps, self.period
        t = transform(period, lags)
        if columns is not None:
            t = t[:, columns]
        width = t.shape[0]
        ww_t = (self.window_gram(lags).reshape(reps * width, width) @ t).reshape(reps, width, -1)
        # T'W'WT = (W'WT)'T, W'W being symmetric: two products over the whole batch
        gram = (np.swapaxes(ww_t, 1, 2).reshape(-1, width) @ t).reshape(reps, t.shape[1], -1)
        det = deterministic_columns(self.deterministic, np.arange(period + lags, self.n), period)
        if det.shape[1]:
            whiten = np.linalg.inv(np.linalg.cholesky(det.T @ det))  # L⁻¹, d × d
            d = det.shape[1]
            ct = (self.det_cross(lags).reshape(reps * d, width) @ t).reshape(reps, d, -1)
            e_t = np.swapaxes(ct, 1, 2) @ whiten.T  # (E')  (R, k + 1, d)
            gram -= e_t @ np.swapaxes(e_t, 1, 2)
        return gram


def regression_gram(y: np.ndarray, period: int, lags: int, deterministic: str) -> np.ndarray:
    """A'M_D A (R, k + 1, k + 1) for A = [π regressors, lags, Δ_S y_t] on the
    longest sample of each series in the batch ``y`` (R, n)."""
    return RunningSums(y, period, deterministic, lags).gram(lags)
