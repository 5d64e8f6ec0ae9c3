"""τ, nobs·γ̂ and Φ1, Φ2, Φ3 for every lag order at once, from one batch of random walks.

The random walks of L shocks are the same for every lag order p (y_0 = 0, y_t = y_{t−1} + e_t);
only the regression sample t = p + 1 … L (nobs = L − p) and the lagged differences change.
Every cross product the ADF regressions need is a window sum of a few product sequences,

    Σ_{t=p+1..L} Δy_{t−i} Δy_{t−j} = C_k(L − i) − C_k(p − i),  C_k(m) = Σ_{s≤m} e_s e_{s+k},
    k = i − j ≥ 0, and likewise Σ y_{t−1} Δy_{t−i}, Σ y_{t−1}², Σ t^a Δy_{t−i}, Σ t^a y_{t−1},

so one pass of cumulative sums (O((p_max + 4)·L) per path) serves every p.  For each p the
Gram matrix of [Δy_{t−1} … Δy_{t−p}, 1, t, y_{t−1}, Δy_t] is reduced by p steps of a
Cholesky elimination vectorised over the paths; the 4 × 4 Schur complement left is the Gram
of [1, t, y_{t−1}, Δy_t] with the lagged differences partialled out (Frisch-Waugh-Lovell),
from which the three specs follow by partialling out 1, then t:

    τ = s_zy / √(s_zz · RSS/df),  RSS = s_yy − s_zy²/s_zz,  nobs·γ̂ = nobs · s_zy/s_zz,

and the Φ statistics (Dickey & Fuller 1981) from the restricted sums of squares as in
:func:`tauscope.engine.distributions.batched.df_statistics`, which gives the same numbers
(to rounding) one lag order at a time.
"""

from __future__ import annotations

from collections.abc import Sequence

import numpy as np

STATISTICS = ("tau_none", "tau_constant", "tau_trend", "rho_none", "rho_constant", "rho_trend",
              "phi1", "phi2", "phi3")


class _Ends:
    """Partial sums C(m) = Σ_{s ≤ m} v_s of a product sequence v_s = a_s·b_s (s = 1 … n) at the
    positions a window sum needs: m ≤ head (the first lags) and m ≥ n − head (the last)."""

    def __init__(self, a: np.ndarray, b: np.ndarray, head: int) -> None:
        self.n = a.shape[1]
        k = min(head + 1, self.n)
        self.head = np.zeros((a.shape[0], k + 1))
        np.cumsum(a[:, :k] * b[:, :k], axis=1, out=self.head[:, 1:])
        self.total = np.einsum("rn,rn->r", a, b)
        self.suffix = np.cumsum(a[:, self.n - k:][:, ::-1] * b[:, self.n - k:][:, ::-1], axis=1)

    def at(self, m: int) -> np.ndarray:
        if m == self.n:
            return self.total
        if m < self.head.shape[1]:
            return self.head[:, m]
        return self.total - self.suffix[:, self.n - m - 1]

    def window(self, stop: int, start: int) -> np.ndarray:
        """Σ v_s over s = start + 1 … stop."""
        return self.at(stop) - self.at(start)


def _trailing_gram(gram: np.ndarray) -> np.ndarray:
    """The Gram of the last four columns with every earlier column partialled out
    (Frisch-Waugh-Lovell): M M' with M the trailing 4 × 4 block of the Cholesky factor."""
    factor = np.linalg.cholesky(gram)[:, -4:, -4:]
    return np.matmul(factor, factor.transpose(0, 2, 1))


def _schur(gram: np.ndarray, steps: int) -> np.ndarray:
    """The trailing block of ``gram`` (r, m, m) after ``steps`` Cholesky elimination steps:
    the Gram of the last m − steps columns with the first ``steps`` partialled out."""
    block = gram
    for _ in range(steps):
        pivot = block[:, 0, 0]
        row = block[:, 0, 1:]
        block = block[:, 1:, 1:] - row[:, :, None] * (row / pivot[:, None])[:, None, :]
    return block


def _spec_statistics(s: np.ndarray, nobs: int, lags: int) -> dict[str, np.ndarray]:
    """The statistics from the Schur complement ``s`` (r, 4, 4) over [1, t, z, y]."""
    out: dict[str, np.ndarray] = {}
    rss: dict[str, np.ndarray] = {}
    blocks = {"none": s[:, 2:, 2:]}
    constant = _schur(s, 1)  # [t, z, y] with 1 partialled out
    blocks["constant"] = constant[:, 1:, 1:]
    blocks["trend"] = _schur(constant, 1)
    for deterministic, (spec, block) in enumerate(blocks.items()):
        szz, szy, syy = block[:, 0, 0], block[:, 0, 1], block[:, 1, 1]
        beta = szy / szz
        rss_u = syy - szy * beta
        df = nobs - deterministic - 1 - lags
        out[f"tau_{spec}"] = beta / np.sqrt(rss_u / df / szz)
        out[f"rho_{spec}"] = nobs * beta
        rss[spec] = rss_u
    rss_lags = s[:, 3, 3]
    rss_lags_c = constant[:, 2, 2]
    df_c, df_t = nobs - 2 - lags, nobs - 3 - lags
    out["phi1"] = ((rss_lags - rss["constant"]) / 2.0) / (rss["constant"] / df_c)
    out["phi2"] = ((rss_lags - rss["trend"]) / 3.0) / (rss["trend"] / df_t)
    out["phi3"] = ((rss_lags_c - rss["trend"]) / 2.0) / (rss["trend"] / df_t)
    return out


def every_lag_statistics(shocks: np.ndarray, lags: Sequence[int]) -> dict[int, dict[str, np.ndarray]]:
    """Every statistic of :data:`STATISTICS` for each lag order in ``lags``, for the random
    walks of ``shocks`` (r, L) (rows e_1 … e_L); lag p uses nobs = L − p (p + 4 ≤ nobs)."""
    y = np.zeros((shocks.shape[0], shocks.shape[1] + 1))
    np.cumsum(shocks, axis=1, out=y[:, 1:])
    return every_lag_levels(y, lags, shocks)


def every_lag_levels(y: np.ndarray, lags: Sequence[int], changes: np.ndarray | None = None
                     ) -> dict[int, dict[str, np.ndarray]]:
    """:func:`every_lag_statistics` for any paths ``y`` (r, L + 1) (rows y_0 … y_L, e.g. the
    AR(1) alternatives of the power simulation); ``changes``: their differences, if at hand."""
    e = np.diff(y, axis=1) if changes is None else changes
    reps, length = e.shape
    top = max(lags)
    t = np.broadcast_to(np.arange(1.0, length + 1.0), e.shape)
    ones = np.ones_like(e)
    lagged = y[:, :-1]  # y_{t−1} for t = 1 … L
    e_sum, te_sum = _Ends(e, ones, top), _Ends(e, t, top)
    z_sum, tz_sum, zz_sum = _Ends(lagged, ones, top), _Ends(lagged, t, top), _Ends(lagged, lagged, top)
    products = [_Ends(e[:, : length - k], e[:, k:], top) for k in range(top + 1)]  # e_s e_{s+k}
    # Σ_{t ≤ m} y_{t−1} e_{t−i}: the sequence s = t − i, y_{s+i−1} e_s, with positions shifted by i
    level_products = [_Ends(lagged[:, i:], e[:, : length - i], top + 1) for i in range(top + 1)]
    out: dict[int, dict[str, np.ndarray]] = {}
    for p in lags:
        nobs = length - p
        m = p + 4
        gram = np.empty((m, m, reps))  # replications last while filling (contiguous writes)
        ts = np.arange(p + 1.0, length + 1.0)
        one, trend, z = p, p + 1, p + 2
        # lagged differences Δy_{t−i}, i = 1 … p, and the response Δy_t (i = 0)
        index = [(a, i) for a, i in enumerate([*range(1, p + 1), None, None, None, 0])
                 if i is not None]
        for u, (a, i) in enumerate(index):
            for b, j in index[u:]:
                hi, lo = max(i, j), min(i, j)
                gram[a, b] = gram[b, a] = products[hi - lo].window(length - hi, p - hi)
            gram[a, one] = gram[one, a] = e_sum.window(length - i, p - i)
            gram[a, trend] = gram[trend, a] = te_sum.window(length - i, p - i) + i * gram[a, one]
            gram[a, z] = gram[z, a] = level_products[i].window(length - i, p - i)
        gram[one, one] = nobs
        gram[one, trend] = gram[trend, one] = ts.sum()
        gram[trend, trend] = (ts * ts).sum()
        gram[one, z] = gram[z, one] = z_sum.window(length, p)
        gram[trend, z] = gram[z, trend] = tz_sum.window(length, p)
        gram[z, z] = zz_sum.window(length, p)
        out[p] = _spec_statistics(_trailing_gram(np.ascontiguousarray(gram.transpose(2, 0, 1))), nobs, p)
    return out
