"""The M statistics of Ng & Perron (2001) for many series of one length at once.

Ng, S. & Perron, P. (2001), "Lag Length Selection and the Construction of Unit Root
Tests with Good Size and Power", Econometrica 69(6), 1519-1554; the M tests themselves
are Stock's (1999) and Perron & Ng's (1996), "Useful Modifications to Some Unit Root
Tests with Dependent Errors and their Local Asymptotic Properties", Review of Economic
Studies 63.

On the detrended series ỹ_1 … ỹ_T (GLS with c̄ = −7 or −13.5, as DF-GLS; or OLS) and
with the autoregressive spectral density estimate at frequency zero

    s²_AR = σ̂²_k / (1 − Σ_{j≤k} b̂_j)²,

σ̂²_k = RSS/(T − 1 − k) and b̂_j from the ADF regression on the detrended series
Δỹ_t = b₀ ỹ_{t−1} + Σ_{j≤k} b_j Δỹ_{t−j} + e_t (the DF-GLS regression of
:mod:`tauscope.engine.unitroot.dfgls_many`, at the same lag order k):

    MZα = (T⁻¹ ỹ_T² − s²_AR) / (2 T⁻² Σ_{t=2}^{T} ỹ²_{t−1}),
    MSB = (T⁻² Σ_{t=2}^{T} ỹ²_{t−1} / s²_AR)^{1/2},
    MZt = MZα · MSB.

All three reject the unit root for small values.  They are the Phillips-Perron Z
statistics modified so that a large negative moving-average root in Δy distorts their
size far less than the ADF τ's (Perron & Ng 1996); with MAIC lags and GLS detrending they
keep DF-GLS's power (Ng & Perron 2001).  Pure functions; a row whose regression cannot be
solved gets NaN.
"""

from __future__ import annotations

import numpy as np

from tauscope.engine.distributions.simulate import raw_moments
from tauscope.engine.unitroot.dfgls_many import solve_rows

M_STATISTICS = ("mza", "msb", "mzt")


def _columns(levels: np.ndarray, lags: int) -> tuple[np.ndarray, list[np.ndarray]]:
    """Δỹ_t and [ỹ_{t−1}, Δỹ_{t−1}, …, Δỹ_{t−k}] on the longest sample for ``lags``."""
    dy = np.diff(levels, axis=1)
    end = dy.shape[1]
    columns = [levels[:, lags:end]] + [dy[:, lags - i:end - i] for i in range(1, lags + 1)]
    return dy[:, lags:], columns


def spectral_ar_many(detrended: np.ndarray, lags: np.ndarray) -> np.ndarray:
    """s²_AR = σ̂²_k / (1 − Σ b̂_j)² for every row, each at its own lag order k (NaN
    where the regression cannot be solved)."""
    out = np.full(detrended.shape[0], np.nan)
    length = detrended.shape[1]
    for lag in np.unique(lags):
        k = int(lag)
        rows = np.flatnonzero(lags == k)
        n = length - 1 - k
        if n - (k + 1) < 1:
            continue
        y, columns = _columns(detrended[rows], k)
        with np.errstate(divide="ignore", invalid="ignore"):
            beta, rss, _ = solve_rows(raw_moments(columns, y))
            out[rows] = (rss / n) / (1.0 - np.sum(beta[:, 1:], axis=1)) ** 2
    return out


def m_statistics_many(detrended: np.ndarray, lags: np.ndarray, initial: bool = False) -> dict[str, np.ndarray]:
    """MZα, MSB and MZt (keys "mza", "msb", "mzt") for every row of the detrended
    series, with each row's lag order for s²_AR.  ``initial=True`` uses
    T⁻¹(ỹ_T² − ỹ_1²) in MZα's numerator (the identity Σ ỹ_{t−1}Δỹ_t = (ỹ_T² − ỹ_1² −
    Σ Δỹ_t²)/2 behind MZα = Zα + (T/2)(α̂ − 1)², Perron & Ng 1996): needed on OLS-detrended
    series, whose first value is not near zero; GLS-detrended series start near zero and
    Ng & Perron (2001) leave the term out."""
    detrended = np.asarray(detrended, dtype=float)
    length = detrended.shape[1]
    s2 = spectral_ar_many(detrended, np.asarray(lags))
    lagged_ss = np.einsum("rn,rn->r", detrended[:, :-1], detrended[:, :-1]) / length**2
    end = detrended[:, -1] ** 2 - (detrended[:, 0] ** 2 if initial else 0.0)
    with np.errstate(divide="ignore", invalid="ignore"):
        mza = (end / length - s2) / (2.0 * lagged_ss)
        msb = np.sqrt(lagged_ss / s2)
    return {"mza": mza, "msb": msb, "mzt": mza * msb}
