"""Ordinary least squares, the reference way (statsmodels OLS).

Every regression of the analysis goes through :func:`fit`, so the numbers are
those of a well-tested library; the faster nested path checks itself against
this one in the tests.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

import numpy as np
from statsmodels.regression.linear_model import OLS

from tauscope.engine.errors import UntestableSeries


@dataclass(frozen=True)
class OLSFit:
    """Estimates of y = Xb + e.  ``aic``/``bic``/``hqc`` follow statsmodels:
    −2 ln L + c·k with k the number of regressors and ln L the Gaussian
    log-likelihood at σ̂² = RSS/n."""

    params: np.ndarray
    bse: np.ndarray
    ssr: float
    nobs: int
    df_resid: int
    cov: np.ndarray | None = None  # σ̂² (X'X)⁻¹

    def uncentred(self, constant: int, gamma: int, centre: float) -> tuple[np.ndarray, np.ndarray]:
        """(params, bse) of the same regression with y(t−1) measured from 0 instead of
        ``centre``: a0 = a0* − centre·γ̂, Var a0 = Var a0* + centre² Var γ̂ − 2 centre
        Cov(a0*, γ̂); every other coefficient is unchanged."""
        params, bse = self.params.copy(), self.bse.copy()
        if centre == 0.0:
            return params, bse
        assert self.cov is not None
        cov = self.cov
        params[constant] = params[constant] - centre * params[gamma]
        variance = (cov[constant, constant] + centre * centre * cov[gamma, gamma]
                    - 2.0 * centre * cov[constant, gamma])
        bse[constant] = math.sqrt(max(float(variance), 0.0))
        return params, bse

    @property
    def k(self) -> int:
        return int(self.params.shape[0])

    @property
    def tvalues(self) -> np.ndarray:
        return self.params / self.bse

    @property
    def sigma2(self) -> float:
        return self.ssr / self.df_resid

    @property
    def llf(self) -> float:
        n = self.nobs
        return -n / 2.0 * (math.log(2.0 * math.pi) + math.log(self.ssr / n) + 1.0)

    def criterion(self, name: str) -> float:
        """Information criterion ``"aic"``, ``"bic"`` or ``"hqc"`` (smaller is better)."""
        penalty = {
            "aic": 2.0,
            "bic": math.log(self.nobs),
            "hqc": 2.0 * math.log(math.log(self.nobs)),
        }[name]
        return -2.0 * self.llf + penalty * self.k


def fit(y: np.ndarray, x: np.ndarray) -> OLSFit:
    """Fit by statsmodels OLS; refuse rank-deficient designs and perfect fits."""
    nobs, k = x.shape
    if nobs <= k:
        raise UntestableSeries(
            f"too few observations ({nobs}) for a regression with {k} terms"
        )
    if np.linalg.matrix_rank(x) < k:
        raise UntestableSeries(
            "the regression terms are linearly dependent: over much of the sample the series "
            "does not move at random (it stays constant, changes in only a few observations or "
            "repeats an exact pattern), so the test cannot be computed"
        )
    result = OLS(y, x).fit()
    ssr = float(result.ssr)
    if not (ssr > 1e-20 * max(1.0, float(np.dot(y, y)))):
        raise UntestableSeries(
            "the regression fits the series exactly, so there is no randomness left to test"
        )
    return OLSFit(
        params=np.asarray(result.params, dtype=float),
        bse=np.asarray(result.bse, dtype=float),
        ssr=ssr,
        nobs=int(nobs),
        df_resid=int(nobs - k),
        cov=np.asarray(result.cov_params(), dtype=float),
    )
