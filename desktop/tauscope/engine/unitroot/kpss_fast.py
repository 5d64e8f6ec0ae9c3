"""The KPSS statistic in numpy, the same numbers as :mod:`tauscope.engine.unitroot.kpss`
(statsmodels' ``kpss``) without its per-call overhead.

Kwiatkowski, D., Phillips, P.C.B., Schmidt, P. & Shin, Y. (1992), "Testing the Null
Hypothesis of Stationarity against the Alternative of a Unit Root", Journal of
Econometrics 54, 159-178:

* e_t: residuals of y on a constant (level null, η_μ) or on [1, t], t = 1…T (trend
  null, η_τ);
* η = T⁻² Σ_t S_t² / s²(l), S_t = Σ_{i≤t} e_i (eq. 11);
* s²(l) = T⁻¹ Σ e_t² + 2 T⁻¹ Σ_{s=1..l} (1 − s/(l+1)) Σ_{t>s} e_t e_{t−s}, the
  Bartlett-kernel long-run variance (eq. 10);
* l by the automatic bandwidth of Hobijn, B., Franses, P.H. & Ooms, M. (1998/2004),
  "Generalizations of the KPSS-test for Stationarity", Statistica Neerlandica 58:
  n = ⌊T^{2/9}⌋ autocovariances, ŝ = Σ_j j·ω̂_j / Σ_j ω̂_j
  (ω̂_0 = T⁻¹ Σ e², ω̂_j = 2 T⁻¹ Σ e_t e_{t−j}),
  l = ⌊1.1447 (ŝ²)^{1/3} T^{1/3}⌋, computed in the same order of operations as
  statsmodels so the integer bandwidth is the same.

The p-value is interpolated in KPSS Table 1 and bounded outside 0.01-0.10, as
stationarity.py does.  Anything degenerate (a zero long-run variance, a value that
is not finite) goes to the statsmodels version, so errors read the same.
"""

from __future__ import annotations

from functools import lru_cache

import numpy as np

from tauscope.engine.regression.scaling import centred
from tauscope.engine.results import TestResult
from tauscope.engine.unitroot.kpss import kpss_test

# KPSS (1992) Table 1, upper tail: 10%, 5%, 2.5%, 1%.
_CRITICAL = {
    "constant": (0.347, 0.463, 0.574, 0.739),
    "trend": (0.119, 0.146, 0.176, 0.216),
}
_P_LEVELS = (0.10, 0.05, 0.025, 0.01)
_LEVEL = {0.01: "1%", 0.05: "5%", 0.10: "10%"}
_LARGEST = 1e100  # beyond this, squares and cumulated sums could overflow: statsmodels' own way


@lru_cache(maxsize=64)
def _centred_time(nobs: int) -> np.ndarray:
    """t − t̄ for t = 1 … T, once per length (read-only)."""
    t = np.arange(1, nobs + 1, dtype=float)
    out = t - t.mean()
    out.setflags(write=False)
    return out


def kpss_fast(x: np.ndarray, spec: str, difference: int, alpha: float) -> TestResult:
    """Same result as :func:`tauscope.engine.unitroot.kpss.kpss_test`: the batch's steps
    (:func:`_kpss_rows`) on this series alone, or statsmodels' version where they decline."""
    x = centred(np.asarray(x, dtype=float), spec)  # as kpss_test: the level only moves the mean
    found = _kpss_rows(x[None, :], spec, difference, alpha)[0]
    return kpss_test(x, spec, difference, alpha) if found is None else found


def _result(statistic: float, p: float, lags: int, nobs: int, spec: str, difference: int,
            alpha: float) -> TestResult:
    table = _CRITICAL["trend" if spec == "trend" else "constant"]
    critical_values = {"10%": table[0], "5%": table[1], "1%": table[3]}
    level = next(v for a, v in _LEVEL.items() if abs(a - alpha) < 1e-12)
    return TestResult(
        test="kpss",
        spec=spec,
        difference=difference,
        statistic=statistic,
        p_value=p,
        lags=lags,
        nobs=nobs,
        critical_values=critical_values,
        reject=bool(statistic > critical_values[level]),
        critical_value=critical_values[level],
        p_value_bound="below" if p <= 0.01 else "above" if p >= 0.10 else None,
        lag_rule="Hobijn-Franses-Ooms automatic bandwidth",
    )


def kpss_many(xs: np.ndarray, spec: str, difference: int, alpha: float) -> list[TestResult]:
    """:func:`kpss_fast` for every row of ``xs`` (series of one length), the steps taken
    for all rows at once (:func:`_kpss_rows`); a row whose statistic is degenerate or could
    overflow goes to statsmodels' version."""
    xs = np.asarray(xs, dtype=float)
    return [kpss_test(centred(x, spec), spec, difference, alpha) if found is None else found
            for x, found in zip(xs, _kpss_rows(xs, spec, difference, alpha), strict=True)]


def _row_sums(values: np.ndarray) -> np.ndarray:
    """Σ over each row with numpy's own (pairwise) sum along memory, not a BLAS product: a
    row's sum is then the same whatever the other rows, alone or in a batch."""
    return np.asarray(np.sum(values, axis=1))


def _kpss_rows(xs: np.ndarray, spec: str, difference: int, alpha: float) -> list[TestResult | None]:
    """η and the bandwidth of every row, in statsmodels' order of operations (so the integer
    bandwidth is the same); None for a row whose statistic is degenerate or could overflow
    (statsmodels' version then decides, so its errors read the same).  Each row's numbers
    depend on that row alone (a row alone gets the same bits)."""
    count, nobs = xs.shape
    if nobs < 3 or count == 0:
        return [None] * count
    with np.errstate(all="ignore"):
        x = xs - np.mean(xs, axis=1)[:, None]  # centred, as kpss_test
        ok = np.abs(x).max(axis=1) < _LARGEST
        resids = x - x.mean(axis=1)[:, None]
        if spec == "trend":
            t_centred = _centred_time(nobs)
            slope = _row_sums(resids * t_centred[None, :]) / np.dot(t_centred, t_centred)
            resids = resids - slope[:, None] * t_centred[None, :]
        squares = _row_sums(resids**2)
        ok &= squares > 0.0
        covlags = int(np.power(nobs, 2.0 / 9.0))
        products = [_row_sums(resids[:, i:] * resids[:, : nobs - i]) for i in range(1, covlags + 1)]
        # the bandwidth (_bandwidth), row by row in the same order of operations
        s0 = squares / nobs
        s1 = np.zeros(count)
        for i, raw in enumerate(products, start=1):
            product = raw / (nobs / 2.0)
            s0 = s0 + product
            s1 = s1 + i * product
        ok &= s0 != 0.0
        s_hat = s1 / np.where(s0 != 0.0, s0, 1.0)
        squared = s_hat * s_hat
        ok &= np.isfinite(squared)
        power = 1.0 / 3.0
        gamma_hat = 1.1447 * np.power(np.where(ok, squared, 0.0), power)
        bandwidth = np.floor(gamma_hat * np.power(nobs, power))
        lags = np.minimum(bandwidth, nobs - 1).astype(int)
        eta = _row_sums(np.cumsum(resids, axis=1) ** 2) / (nobs**2)
        # the long-run variance (_long_run_variance): Σ e² + 2 Σ_s (1 − s/(l+1)) γ_s, in order
        variance = squares
        for i in range(1, int(lags[ok].max(initial=0)) + 1):
            product = products[i - 1] if i <= covlags else _row_sums(resids[:, i:] * resids[:, : nobs - i])
            term = 2 * product * (1.0 - (i / (lags + 1.0)))
            variance = variance + np.where(i <= lags, term, 0.0)
        variance = variance / nobs
        ok &= (variance > 0.0) & np.isfinite(eta) & np.isfinite(variance)
        statistic = eta / np.where(ok, variance, 1.0)
    table = _CRITICAL["trend" if spec == "trend" else "constant"]
    p_values = np.interp(statistic, table, _P_LEVELS)
    return [_result(value, p, lag, nobs, spec, difference, alpha) if fine else None
            for fine, value, p, lag in zip(ok.tolist(), statistic.tolist(), p_values.tolist(),
                                           lags.tolist(), strict=True)]


class KpssBatch:
    """KPSS of a batch's series, asked for ahead (:meth:`prefetch`) and computed per (spec,
    difference, length) in one call (:func:`kpss_many`); a test not asked for ahead, or
    asked on other values, is computed alone, by the same steps."""

    def __init__(self) -> None:
        self._found: dict[tuple[int, str, int, float], tuple[np.ndarray, TestResult]] = {}

    def prefetch(self, requests: list[tuple[int, np.ndarray, str, int]], alpha: float) -> None:
        """``requests``: (index, Δ^d y as the test will be asked on, spec, d)."""
        groups: dict[tuple[str, int, int], list[tuple[int, np.ndarray]]] = {}
        for index, x, spec, difference in requests:
            groups.setdefault((spec, difference, x.shape[0]), []).append((index, x))
        for (spec, difference, _), members in groups.items():
            found = _kpss_rows(np.vstack([x for _, x in members]), spec, difference, alpha)
            for (index, x), result in zip(members, found, strict=True):
                if result is not None:  # the others are computed alone when asked
                    self._found[(index, spec, difference, alpha)] = (x, result)

    def result(self, index: int, x: np.ndarray, spec: str, difference: int, alpha: float) -> TestResult:
        """Row ``index``'s test on ``x`` (prefetched on the same values, or computed now
        as a batch of one: the same numbers)."""
        found = self._found.pop((index, spec, difference, alpha), None)
        if found is not None and (found[0] is x or np.array_equal(found[0], x)):
            return found[1]
        x = np.asarray(x, dtype=float)
        return kpss_many(x[None, :], spec, difference, alpha)[0] if x.ndim == 1 \
            else kpss_fast(x, spec, difference, alpha)
