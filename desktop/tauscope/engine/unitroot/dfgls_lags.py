"""The DF-GLS t ratio under the null for every fixed lag order at once, from one batch of walks.

Elliott, Rothenberg & Stock (1996): ỹ is the GLS-detrended random walk of T values (ᾱ = 1 + c̄/T,
as :func:`tauscope.engine.unitroot.dfgls.gls_detrend`); with p lags the statistic is the t ratio
of γ̂ in Δỹ_t = γ ỹ_{t−1} + Σ_{i=1..p} β_i Δỹ_{t−i} + e_t on its longest sample (n = T − 1 − p
observations, df = n − p − 1), as :func:`tauscope.engine.unitroot.dfgls.dfgls_null_distribution`
computes it one lag at a time.  The detrended walk does not depend on p, only the sample and the
lagged differences do, so every cross product is a window sum of a few product sequences
(d_s = Δỹ, l_s = ỹ_{t−1} aligned with d_s, N = T − 1):

    Σ_{j=p..N−1} d_{j−a} d_{j−b} = Σ_{s=p−b..N−1−b} d_s d_{s+b−a},   Σ_j l_j d_{j−a},   Σ_j l_j²,

and one pass of partial sums serves every p (the walks are held in columns, so every sum runs
over contiguous rows).  For each p the Gram matrix of [Δỹ_{t−1} … Δỹ_{t−p}, ỹ_{t−1}, Δỹ_t] is
reduced by p steps of a Cholesky elimination vectorised over the walks; the 2 × 2 block left is
the Gram of [ỹ_{t−1}, Δỹ_t] with the lagged differences partialled out (Frisch-Waugh-Lovell):

    t = s_zy / √(s_zz · RSS/df),   RSS = s_yy − s_zy²/s_zz.
"""

from __future__ import annotations

from collections.abc import Sequence

import numpy as np

from tauscope.engine.unitroot.dfgls_null import gls_detrended

SPECS = ("constant", "trend")


def every_lag_dfgls(shocks: np.ndarray, lags: Sequence[int], specs: Sequence[str] = SPECS
                    ) -> dict[str, dict[int, np.ndarray]]:
    """spec → lag → the DF-GLS t ratio of each random walk y_t = e_1 + … + e_t (rows of
    ``shocks`` (r, T), y_1 = e_1), for each fixed lag order in ``lags`` (T ≥ p + 8)."""
    length = shocks.shape[1]
    top = max(lags)
    if length < top + 8:
        raise ValueError(f"length {length} is too short for {top} lags")
    paths = np.cumsum(np.ascontiguousarray(shocks.T), axis=0)  # (T, r): walks last throughout
    out: dict[str, dict[int, np.ndarray]] = {}
    for spec in specs:
        gls = _gls_detrended(paths, spec)
        d = gls[1:] - gls[:-1]
        n_all = d.shape[0]
        level = gls[:n_all]  # ỹ_{t−1}, aligned with d
        products = [_Sums(d[: n_all - k], d[k:], top) for k in range(top + 1)]
        crosses = [_Sums(level[a:], d[: n_all - a], top) for a in range(top + 1)]
        squares = _Sums(level, level, top)
        out[spec] = {p: _t_ratios(products, crosses, squares, n_all, p) for p in lags}
    return out


class _Sums:
    """Partial sums C(m) = Σ_{s ≤ m} a_s b_s (s = 1 … n, rows of (n, r) arrays) where a window
    sum needs them: m ≤ head + 1 (the first lags) and m ≥ n − head − 1 (the last)."""

    def __init__(self, a: np.ndarray, b: np.ndarray, head: int) -> None:
        product = a * b
        self.n = product.shape[0]
        k = min(head + 2, self.n)
        self.total = product.sum(axis=0)
        self.head = np.zeros((k + 1, product.shape[1]))
        np.cumsum(product[:k], axis=0, out=self.head[1:])
        self.tail = np.cumsum(product[self.n - k:][::-1], axis=0)  # tail[j] = Σ of the last j + 1

    def at(self, m: int) -> np.ndarray:
        if m < self.head.shape[0]:
            return np.asarray(self.head[m])
        return np.asarray(self.total - self.tail[self.n - m - 1]) if m < self.n else self.total

    def window(self, stop: int, start: int) -> np.ndarray:
        """Σ a_s b_s over s = start + 1 … stop."""
        return np.asarray(self.at(stop) - self.at(start))


def _gls_detrended(paths: np.ndarray, spec: str) -> np.ndarray:
    """ERS (1996) GLS detrending of each column of ``paths`` (T, r): the null simulator's
    row-wise detrending, :func:`tauscope.engine.unitroot.dfgls_null.gls_detrended`, on the
    transpose."""
    return np.ascontiguousarray(gls_detrended(paths.T, spec).T)


def _t_ratios(products: list[_Sums], crosses: list[_Sums], squares: _Sums, n_all: int, p: int
              ) -> np.ndarray:
    m = p + 2
    z = p  # ỹ_{t−1}; the response Δỹ_t is the last column (lag 0)
    index = [*((c, c + 1) for c in range(p)), (m - 1, 0)]  # (column, lag): Δỹ_{t−1} … Δỹ_{t−p}, Δỹ_t
    gram = np.empty((m, m, squares.total.shape[0]))  # upper triangle filled and used
    for u, (a, i) in enumerate(index):
        for b, j in index[u:]:
            hi, lo = max(i, j), min(i, j)
            gram[min(a, b), max(a, b)] = products[hi - lo].window(n_all - hi, p - hi)
        gram[min(a, z), max(a, z)] = crosses[i].window(n_all - i, p - i)
    gram[z, z] = squares.window(n_all, p)
    for k in range(p):  # Cholesky elimination of the lagged differences, in place
        row = gram[k, k + 1:]
        scaled = row / gram[k, k]
        for i in range(k + 1, m):
            gram[i, i:] -= scaled[i - k - 1] * row[i - k - 1:]
    s_zz, s_zy, s_yy = gram[z, z], gram[z, z + 1], gram[z + 1, z + 1]
    df = n_all - p - (p + 1)
    return np.asarray(s_zy / np.sqrt((s_yy - s_zy * s_zy / s_zz) / df * s_zz))
