"""The vectorised machinery of the simulated Dickey-Fuller nulls: random shocks in chunks,
random walks, batched least squares from cross products (deterministic terms partialled
out by Frisch-Waugh-Lovell), and τ, nobs·γ̂ and Φ1, Φ2, Φ3 for a batch of paths.

Under the null the series is a driftless Gaussian random walk, y_t = y_{t−1} + e_t,
y_0 = 0, and the ADF regression Δy_t = a0 + a2·t + γ·y_{t−1} + Σ_{i=1..p} β_i Δy_{t−i} + e_t
is fitted on nobs = L − p observations for L shocks.  Used by
:mod:`tauscope.engine.distributions.simulate` (which re-exports these names) and the
other simulations of the engine.
"""

from __future__ import annotations

from collections.abc import Iterator, Sequence
from dataclasses import dataclass

import numpy as np

from tauscope.engine.regression.design import SPECS

_CHUNK_VALUES = 400_000  # floats per chunk of simulated shocks (about 3 MB, cache-friendly)


def shock_chunks(length: int, reps: int, seed: int, width: int = 1) -> Iterator[np.ndarray]:
    """Standard normal shocks e_1 … e_length for ``reps`` replications, in chunks of rows.

    ``width`` (regressors per replication) shrinks the chunks so the batched
    design stays near a fixed memory budget.  The stream does not depend on
    the chunk size (rows are drawn in order from one generator)."""
    rng = np.random.default_rng(seed)
    chunk = max(1, _CHUNK_VALUES // max(length * width, 1))
    done = 0
    while done < reps:
        size = min(chunk, reps - done)
        yield rng.standard_normal((size, length))
        done += size


def deterministic_terms(spec: str, nobs: int) -> np.ndarray:
    """Columns of the deterministic part on the regression sample: [], [1] or [1, t]."""
    t = np.arange(1.0, nobs + 1.0)
    if spec == "none":
        return np.empty((nobs, 0))
    if spec == "constant":
        return np.ones((nobs, 1))
    return np.column_stack([np.ones(nobs), t])


@dataclass(frozen=True)
class CrossProducts:
    """Per-replication moments of the regression: Z'Z (r, m, m), Z'y (r, m), y'y (r,),
    with Z = [y_{t−1}, Δy_{t−1}, …, Δy_{t−p}] and y = Δy_t, after partialling
    out fixed deterministic columns (Frisch-Waugh-Lovell):
    Z̃'Z̃ = Z'Z − (Z'Q)(Q'Z), Z̃'ỹ = Z'y − (Z'Q)(Q'y), ỹ'ỹ = y'y − |Q'y|², Q an
    orthonormal basis of the deterministic columns."""

    zz: np.ndarray
    zy: np.ndarray
    yy: np.ndarray

    def partialled(self, columns: Sequence[np.ndarray], y: np.ndarray, terms: np.ndarray) -> CrossProducts:
        """The moments after partialling out ``terms`` from the regressors ``columns``
        (each (r, n)) and the response ``y``."""
        if terms.shape[1] == 0:
            return self
        q, _ = np.linalg.qr(terms)
        zq = np.stack([column @ q for column in columns], axis=1)  # (r, m, d)
        yq = y @ q  # (r, d)
        return CrossProducts(
            self.zz - np.matmul(zq, zq.transpose(0, 2, 1)),
            self.zy - np.einsum("rmd,rd->rm", zq, yq),
            self.yy - np.einsum("rd,rd->r", yq, yq),
        )

    def subset(self, columns: slice) -> CrossProducts:
        return CrossProducts(self.zz[:, columns, columns], self.zy[:, columns], self.yy)


def solve_moments(moments: CrossProducts) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """Least squares from cross products: (β̂ (r, m), RSS (r,), diag (Z'Z)^{-1} (r, m)).

    RSS = y'y − β̂'Z'y; these regressions fit far from perfectly, so the
    subtraction loses no meaningful precision."""
    m = moments.zy.shape[1]
    if m == 0:
        empty = np.empty((moments.yy.shape[0], 0))
        return empty, moments.yy, empty
    if m == 1:
        inverse_diag = 1.0 / moments.zz[:, :, 0]
        beta = moments.zy * inverse_diag
    else:
        inverse = np.linalg.inv(moments.zz)
        beta = np.einsum("rml,rl->rm", inverse, moments.zy)
        inverse_diag = np.einsum("rmm->rm", inverse)
    rss = moments.yy - np.einsum("rm,rm->r", beta, moments.zy)
    return beta, rss, inverse_diag


def batched_ols(response: np.ndarray, columns: Sequence[np.ndarray]) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """Batched least squares of ``response`` (r, n) on the regressors ``columns`` (each
    (r, n)): (β̂ (r, m), RSS (r,), diag (X'X)^{-1} (r, m))."""
    return solve_moments(raw_moments(columns, response))


_STACKED_ROWS = 32  # up to this many rows raw_moments stacks the columns (measured faster there)


def _unit_stride(a: np.ndarray) -> bool:
    """Float64 with consecutive elements along each row (einsum's contiguous loop)."""
    return a.dtype == np.float64 and a.ndim == 2 and (a.shape[1] <= 1 or a.strides[1] == a.itemsize)


def raw_moments(columns: Sequence[np.ndarray], y: np.ndarray) -> CrossProducts:
    """Z'Z, Z'y and y'y per replication from regressor columns given as (r, n) arrays
    (views into the simulated paths: the lagged columns are never copied).

    Up to :data:`_STACKED_ROWS` rows (the lag groups of a batch of series) the columns
    are stacked and every product comes from one einsum call: the same sum-of-products
    loop over each contiguous row, so the same bits as one call per pair, without the
    per-call cost that dominates for few rows."""
    m = len(columns)
    reps = y.shape[0]
    if reps <= _STACKED_ROWS and all(_unit_stride(a) for a in (*columns, y)):
        z = np.stack([*columns, y], axis=1)
        full = np.einsum("rin,rjn->rij", z, z)
        return CrossProducts(np.ascontiguousarray(full[:, :m, :m]), np.ascontiguousarray(full[:, :m, m]),
                             np.ascontiguousarray(full[:, m, m]))
    zz = np.empty((reps, m, m))
    zy = np.empty((reps, m))
    for a, first in enumerate(columns):
        zy[:, a] = np.einsum("rn,rn->r", first, y)
        for b in range(a, m):
            zz[:, a, b] = zz[:, b, a] = np.einsum("rn,rn->r", first, columns[b])
    return CrossProducts(zz, zy, np.einsum("rn,rn->r", y, y))


def regression_parts(levels: np.ndarray, lags: int) -> tuple[np.ndarray, list[np.ndarray]]:
    """Response Δy_t and regressors [y_{t−1}, Δy_{t−1}, …, Δy_{t−p}] (views, each (r, n))
    on the regression sample, for paths ``levels`` = (y_0, y_1, …, y_L) in rows;
    nobs = L − p."""
    dy = np.diff(levels, axis=1)  # position i holds Δy_{i+1}
    length = dy.shape[1]
    columns = [levels[:, lags:length]] + [dy[:, lags - i:length - i] for i in range(1, lags + 1)]
    return dy[:, lags:], columns


def random_walks(shocks: np.ndarray) -> np.ndarray:
    """Paths (y_0 = 0, y_1, …, y_L) with y_t = y_{t−1} + e_t."""
    levels = np.zeros((shocks.shape[0], shocks.shape[1] + 1))
    np.cumsum(shocks, axis=1, out=levels[:, 1:])
    return levels


def tau_statistics(levels: np.ndarray, lags: int, spec: str) -> np.ndarray:
    """τ of the ADF regression ``spec`` for each path in ``levels`` (rows y_0 … y_L)."""
    response, regressors = regression_parts(levels, lags)
    terms = deterministic_terms(spec, response.shape[1])
    moments = raw_moments(regressors, response).partialled(regressors, response, terms)
    beta, rss, inv_diag = solve_moments(moments)
    df = response.shape[1] - terms.shape[1] - len(regressors)
    return np.asarray(beta[:, 0] / np.sqrt(rss / df * inv_diag[:, 0]))


def df_statistics(shocks: np.ndarray, lags: int) -> dict[str, np.ndarray]:
    """τ, nobs·γ̂ for every spec and Φ1, Φ2, Φ3 for each simulated random walk
    (one row of shocks each).

    The regression sample is every Δy_t with p lags available, so nobs = L − p
    for L shocks after y_0 = 0.
    """
    response, regressors = regression_parts(random_walks(shocks), lags)
    nobs = response.shape[1]
    raw = raw_moments(regressors, response)
    out: dict[str, np.ndarray] = {}
    rss: dict[str, np.ndarray] = {}
    partialled: dict[str, CrossProducts] = {}
    for spec in SPECS:
        terms = deterministic_terms(spec, nobs)
        partialled[spec] = raw.partialled(regressors, response, terms)
        beta, rss_u, inv_diag = solve_moments(partialled[spec])
        df = nobs - terms.shape[1] - len(regressors)
        out[f"tau_{spec}"] = beta[:, 0] / np.sqrt(rss_u / df * inv_diag[:, 0])
        out[f"rho_{spec}"] = nobs * beta[:, 0]
        rss[spec] = rss_u
    # Restricted models: only the lagged differences (Φ1, Φ2), and a constant with them (Φ3).
    rss_lags = solve_moments(raw.subset(slice(1, None)))[1]
    rss_lags_c = solve_moments(partialled["constant"].subset(slice(1, None)))[1]
    df_c, df_t = nobs - 2 - lags, nobs - 3 - lags
    out["phi1"] = ((rss_lags - rss["constant"]) / 2.0) / (rss["constant"] / df_c)
    out["phi2"] = ((rss_lags - rss["trend"]) / 3.0) / (rss["trend"] / df_t)
    out["phi3"] = ((rss_lags_c - rss["trend"]) / 2.0) / (rss["trend"] / df_t)
    return out
