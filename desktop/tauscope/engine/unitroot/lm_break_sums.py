"""The cross products of the minimum LM break regression for every candidate break at once,
from sums over the sample instead of one product of each candidate's design.

The regression of :mod:`tauscope.engine.unitroot.lm_break` (Lee & Strazicich 2013) for a
candidate break TB = P, on rows r = k … N − 1 of Δy (N = T − 1) less the impulse's row r = P:

    Δy_r on [1, S̃_r, ΔS̃_{r−1}, …, ΔS̃_{r−k}],
    S̃_τ = x_τ − a τ − b 1(τ > P),   ΔS̃_ρ = Δx_ρ − a (ρ ≠ P),   ΔS̃_P = 0,

with a = (Σ Δx − Δx_P)/(T − 2) and b = Δx_P − a.  Every candidate's design differs from
the others only through (a, b, P), so each cross product is a sum that does not depend on
the candidate, less a candidate's tail sum (r > P, one reversed cumulative sum for all
candidates) and less the few rows where the zeroed ΔS̃_P enters.  With a₀ the mean of
Δx, the sums are taken of u_τ = x_τ − a₀τ and v_ρ = Δx_ρ − a₀ and δ = a − a₀, so that a
steep trend is not carried through the sums and cancelled afterwards.

This costs O(T k² + C k²) for C candidates instead of O(C T k²) for the products of C
designs; tests/test_engine_lm_break_sums.py checks it against those products.
"""

from __future__ import annotations

import numpy as np


def detrending(x: np.ndarray, positions: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """(δ̃_t, δ̃_D) = (a, b) for every candidate: the slope and the jump from the differences."""
    dx = np.diff(x)
    jump = dx[positions]
    slope = (dx.sum() - jump) / (x.shape[0] - 2)
    return slope, jump - slope


def _after(values: np.ndarray, start: np.ndarray) -> np.ndarray:
    """Σ_{q ≥ start} values_q for every start (start = len: 0); values (..., n)."""
    tail = np.cumsum(values[..., ::-1], axis=-1)[..., ::-1]
    padded = np.concatenate([tail, np.zeros((*values.shape[:-1], 1))], axis=-1)
    return np.asarray(padded[..., start])


def candidate_moments(x: np.ndarray, positions: np.ndarray, k: int
                      ) -> tuple[np.ndarray, np.ndarray, np.ndarray]:
    """(X'X (C, m, m), X'y (C, m), y'y (C,)) of the break regression with ``k`` lags for
    every candidate TB in ``positions`` (0-based, the last observation of the old regime),
    m = 2 + k, the impulse's row left out."""
    x = np.asarray(x, dtype=float)
    dx = np.diff(x)
    length = x.shape[0]
    big_n = length - 1
    n = big_n - k
    m = 2 + k
    p = np.asarray(positions)
    c = p.shape[0]
    a0 = dx.sum() / big_n
    times = np.arange(length, dtype=float)
    u = x - a0 * times
    v = dx - a0
    a, b = detrending(x, p)
    delta = a - a0

    rows = times[k:big_n]
    u_rows, d_rows = u[k:big_n], dx[k:big_n]
    lag_rows = np.array([v[k - i:big_n - i] for i in range(1, k + 1)]).reshape(k, n)  # v_{r−i}
    start = np.maximum(p + 1, k) - k  # the first row after the break, as an index into rows
    count_after = (n - start).astype(float)
    u_after, r_after, d_after = _after(u_rows, start), _after(rows, start), _after(d_rows, start)
    lags_after = _after(lag_rows, start).T  # (C, k)

    sum_u, sum_r = u_rows.sum(), rows.sum()
    sum_lags = lag_rows.sum(axis=1)  # (k,)
    e_p = v[p] - delta  # ΔS̃ at the break before it is zeroed
    i = np.arange(1, k + 1)
    # the row r = P + i holds the zeroed ΔS̃_P in lag column i
    holds = (p[:, None] + i[None, :] >= k) & (p[:, None] + i[None, :] <= big_n - 1)  # (C, k)
    at = np.minimum(p[:, None] + i[None, :], length - 1)
    s_at = u[at] - delta[:, None] * at - b[:, None]  # S̃_{P+i} (after the break)
    dx_at = dx[np.minimum(at, big_n - 1)]

    gram = np.empty((c, m, m))
    cross = np.empty((c, m))
    gram[:, 0, 0] = n
    g01 = sum_u - delta * sum_r - b * count_after
    gram[:, 0, 1] = gram[:, 1, 0] = g01
    gram[:, 1, 1] = (u_rows @ u_rows - 2.0 * delta * (rows @ u_rows) - 2.0 * b * u_after
                     + delta ** 2 * (rows @ rows) + 2.0 * delta * b * r_after + b ** 2 * count_after)
    if k:
        g0 = sum_lags[None, :] - delta[:, None] * n - holds * e_p[:, None]
        g1 = ((lag_rows @ u_rows)[None, :] - delta[:, None] * (lag_rows @ rows)[None, :]
              - b[:, None] * lags_after - delta[:, None] * g01[:, None] - holds * s_at * e_p[:, None])
        gram[:, 0, 2:] = gram[:, 2:, 0] = g0
        gram[:, 1, 2:] = gram[:, 2:, 1] = g1
        # lag block: Σ (v_{r−i} − δ)(v_{r−j} − δ) less the rows where ΔS̃_P was zeroed
        base = ((lag_rows @ lag_rows.T)[None, :, :]
                - delta[:, None, None] * (sum_lags[None, :, None] + sum_lags[None, None, :])
                + (delta ** 2 * n)[:, None, None])
        other = np.clip(p[:, None, None] + i[None, :, None] - i[None, None, :], 0, big_n - 1)
        one_side = holds[:, :, None] * e_p[:, None, None] * (v[other] - delta[:, None, None])
        fix = one_side + one_side.transpose(0, 2, 1)
        diagonal = np.arange(k)
        fix[:, diagonal, diagonal] = holds * e_p[:, None] ** 2  # one row, counted once
        gram[:, 2:, 2:] = base - fix
        cross[:, 2:] = ((lag_rows @ d_rows)[None, :] - delta[:, None] * d_rows.sum()
                        - holds * e_p[:, None] * dx_at)
    cross[:, 0] = d_rows.sum()
    cross[:, 1] = u_rows @ d_rows - delta * (rows @ d_rows) - b * d_after
    yy = np.full(c, float(d_rows @ d_rows))

    # The impulse's row r = P leaves the fit: take its products out again.
    inside = np.flatnonzero(p >= k)
    q = p[inside]
    dropped = np.empty((inside.size, m))
    dropped[:, 0] = 1.0
    dropped[:, 1] = u[q] - delta[inside] * q  # S̃_P: the old regime
    for lag in range(1, k + 1):
        dropped[:, 1 + lag] = v[q - lag] - delta[inside]
    y_dropped = dx[q]
    gram[inside] -= dropped[:, :, None] * dropped[:, None, :]
    cross[inside] -= dropped * y_dropped[:, None]
    yy[inside] -= y_dropped * y_dropped
    return gram, cross, yy
