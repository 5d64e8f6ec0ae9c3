"""The fast path of the analysis: batches of series of one length, estimated with
:mod:`tauscope.engine.regression.nested`, turned into the same result objects as the reference
path (:mod:`tauscope.engine.reference`; the tests check equality to 1e-8).

:class:`SeriesBatch` computes each difference level for all its series at the first
request; :class:`FastEstimation` is one series' view of it and implements the
estimation seam of :mod:`tauscope.engine.procedure.stages`.  Where the fast path cannot
promise the reference's numbers (a nearly collinear design, a nearly perfect fit, a
value that is not finite) it raises :class:`NeedsReference` and the series is
analysed by the reference path, so even the messages for untestable series are the
reference's own.
"""

from __future__ import annotations

from functools import lru_cache

import numpy as np

from tauscope.engine.distributions import tables as fast_tables
from tauscope.engine.procedure.fast_results import LevelBatch, adf_result, phi_result
from tauscope.engine.procedure.seasonal_roots import SeasonalBatch
from tauscope.engine.procedure.stages import EstimateOptions
from tauscope.engine.procedure.union_estimate import UnionRow, union_rows
from tauscope.engine.regression.design import DETERMINISTIC_TERMS, SPECS
from tauscope.engine.regression.nested import (
    PHI_NAMES,
    PHI_SPEC,
    Y_LAG,
    BlockFits,
    Estimates,
    LagChoices,
    block_fits,
    column_norms,
    column_share,
    criterion_values,
    detrended,
    fixed_lag_choices,
    full_design,
    lag_choices,
    longest_sample,
    maic_values,
    profile_tau,
    r_factor,
    restricted_rss,
    spec_order,
)
from tauscope.engine.results import (
    LagPoint,
    LevelTests,
    RecursiveStatistic,
    TestResult,
)
from tauscope.engine.seasonal.means import remove_seasonal_means
from tauscope.engine.seasonal.results import SeasonalRootsResult
from tauscope.engine.unitroot.kpss_fast import KpssBatch
from tauscope.engine.unitroot.recursive import recursive_tau_many

# Below this share of its length, a column is too close to the span of the earlier
# ones for a promise of 1e-8 agreement: the reference path takes the series.
MIN_COLUMN_SHARE = 1e-6
# A residual sum of squares below this share of y'y is a (nearly) perfect fit.
MIN_RSS_SHARE = 1e-10


class NeedsReference(Exception):
    """The fast path declines this series; the reference path takes it."""


def _sanitise(a: np.ndarray, declined: np.ndarray) -> np.ndarray:
    """Identity factors for declined series, so batched inverses cannot fail."""
    if declined.any():
        a = a.copy()
        a[declined] = np.eye(a.shape[1])
    return a


def level_batch(xs: np.ndarray, difference: int, options: EstimateOptions, max_lags: int) -> LevelBatch:
    """Lag choice, ADF estimates and Φ restricted fits on Δ^d y for a batch (B, T_d)."""
    with np.errstate(all="ignore"):
        return _level_batch(xs, difference, options, max_lags)


def _level_batch(xs: np.ndarray, difference: int, options: EstimateOptions, p: int) -> LevelBatch:
    batch, n = xs.shape
    k = p + 3
    nobs = n - 1 - p
    if nobs <= k:
        raise NeedsReference
    centres = xs.mean(axis=1)
    design = full_design(xs, p, centres)
    rows = design[:, p:, :]
    a_trend = r_factor(rows)
    y_sq = np.einsum("bi,bi->b", rows[:, :, k], rows[:, :, k])
    declined = ~np.isfinite(a_trend).all(axis=(1, 2))
    declined |= a_trend[:, k, k] ** 2 < MIN_RSS_SHARE * np.maximum(1.0, y_sq)
    # Without a constant y(t−1) enters as it is: X = X_c + m·1·e_y' gives R = R_c + m·R_c[:, 0]e_y'.
    a_level = a_trend.copy()
    a_level[:, :, Y_LAG] += centres[:, None] * a_trend[:, :, 0]
    norms = {id(a_trend): column_norms(a_trend), id(a_level): column_norms(a_level)}
    common: dict[str, np.ndarray] = {}
    first_rows: dict[str, np.ndarray] = {}
    for spec in SPECS:
        order = [*spec_order(spec, p), k]
        source, rows_in = (a_level, _uncentred_rows(design[:, :p, :], centres)) if spec == "none" \
            else (a_trend, design[:, :p, :])
        first_rows[spec] = rows_in[:, :, order]
        common[spec] = a_trend if spec == "trend" else r_factor(source[:, :, order])
        used = order[:len(DETERMINISTIC_TERMS[spec]) + 1 + p]
        declined |= column_share(common[spec], norms[id(source)][:, used]) < MIN_COLUMN_SHARE
    common = {spec: _sanitise(a, declined) for spec, a in common.items()}

    rule = options.lag_rule
    choices: dict[str, LagChoices] = {}
    for spec in SPECS:
        if rule == "fixed":
            choices[spec] = fixed_lag_choices(batch, int(options.lags if options.lags is not None else 0), p)
            continue
        fits = block_fits(common[spec], len(DETERMINISTIC_TERMS[spec]), p, nobs)
        if rule == "maic":
            values, maic_declined = _maic(xs, spec, p, fits, rows[:, :, Y_LAG] + centres[:, None], a_trend)
            declined |= maic_declined
        elif rule in ("aic", "bic", "hqc"):
            values = criterion_values(fits, rule, nobs)
        else:
            values = fits.last_t[:, 1:]
        declined |= ~np.isfinite(values).all(axis=1)
        choices[spec] = lag_choices(rule, fits, values, p)

    estimates: dict[str, Estimates] = {}
    for spec in SPECS:
        est = longest_sample(common[spec], first_rows[spec],
                             len(DETERMINISTIC_TERMS[spec]), choices[spec].lags, n - 1, centres)
        declined |= ~(np.isfinite(est.params).all(axis=1) & np.isfinite(est.bse).all(axis=1))
        estimates[spec] = est
    phi = {name: restricted_rss(estimates[PHI_SPEC[name]], name) for name in PHI_NAMES}
    for values in phi.values():
        declined |= ~np.isfinite(values)
    return LevelBatch(difference, p, n, design[:, :p, :].copy(), common, choices, estimates, phi,
                      declined, centres)


def _uncentred_rows(rows: np.ndarray, centres: np.ndarray) -> np.ndarray:
    """Design rows (B, M, K+1) with y(t−1) back to its own level."""
    out = rows.copy()
    out[:, :, Y_LAG] += centres[:, None]
    return out


def _maic(xs: np.ndarray, spec: str, p: int, fits: BlockFits, y_lag: np.ndarray,
          a_trend: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """MAIC on the OLS-detrended series (Perron & Qu 2007) with the no-deterministic design.

    With x̃_t = x_t − m − β0 − β1 t (β the OLS fit of the centred series on [1, t], t = 1…T;
    β1 = 0 for "constant"), the design [x̃(t−1), Δx̃(t−1…p), Δx̃(t)] on the common sample is
    the full design X (centred, :func:`full_design`) times a (K+1)×(p+2) matrix T:
    x̃(t−1) = y(t−1) − β0·1 − β1·trend and Δx̃ = Δx − β1·1.  With X = QR (``a_trend``) its R
    factor is that of R·T (Q is orthonormal), so a factorisation of p + 4 rows replaces one
    of T − 1 − p rows; the column norms of the declined check are those of R·T too."""
    batch = xs.shape[0]
    nobs = xs.shape[1] - 1 - p
    declined = np.zeros(batch, dtype=bool)
    if spec == "none":
        none_fits = fits
        lag_column = y_lag
    else:
        centred = xs - xs.mean(axis=1)[:, None]
        lag_column = detrended(centred, spec)[:, p:-1]
        beta = centred @ _trend_projection(xs.shape[1], spec)
        k = p + 3
        moved = a_trend[:, :, [*range(Y_LAG, Y_LAG + 1 + p), k]]  # a copy: adjusted in place
        moved[:, :, 0] -= beta[:, 0, None] * a_trend[:, :, 0]
        if spec == "trend":
            moved[:, :, 0] -= beta[:, 1, None] * a_trend[:, :, 1]
            moved[:, :, 1:] -= beta[:, 1, None, None] * a_trend[:, :, 0, None]
        a = r_factor(moved)
        declined |= ~np.isfinite(a).all(axis=(1, 2))
        declined |= column_share(a, column_norms(moved[:, :, :p + 1])) < MIN_COLUMN_SHARE
        none_fits = block_fits(_sanitise(a, declined), 0, p, nobs)
    lag_sum_sq = np.einsum("bi,bi->b", lag_column, lag_column)
    return maic_values(none_fits, lag_sum_sq, nobs), declined


@lru_cache(maxsize=64)
def _trend_projection(length: int, spec: str) -> np.ndarray:
    """pinv([1] or [1, t])ᵀ, t = 1…length: series (B, T) @ this = the OLS coefficients (B, 1 or 2)."""
    columns = [np.ones(length)]
    if spec == "trend":
        columns.append(np.arange(1, length + 1, dtype=float))
    projection = np.linalg.pinv(np.column_stack(columns)).T
    projection.setflags(write=False)
    return projection


@lru_cache(maxsize=256)
def _profile_critical_values(spec: str, nobs_by_lag: tuple[int, ...]) -> tuple[float, ...]:
    """The 5% critical value of τ at each lag's sample size (the same for every series of
    a batch)."""
    return tuple(fast_tables.tau_critical_value(spec, nobs, 0.05) for nobs in nobs_by_lag)


class FastEstimation:
    """One series' view of a batch: the estimation seam of :mod:`tauscope.engine.procedure.stages`.

    ``level_tests`` asks the batch (which computes a difference level for all its
    series at the first request); ``lag_profile`` and ``kpss`` work on this series.
    """

    def __init__(self, batch: SeriesBatch, index: int) -> None:
        self._batch = batch
        self._index = index

    def level_tests(self, x: np.ndarray, difference: int, options: EstimateOptions,
                    max_lags: int, scale: float) -> LevelTests:
        level = self._batch.level(difference, max_lags)
        i = self._index
        if level.declined[i]:
            raise NeedsReference
        adf = {spec: adf_result(level, spec, i, options.alpha, scale) for spec in SPECS}
        phi = {name: phi_result(level, adf[PHI_SPEC[name]], name, i, options.alpha)
               for name in PHI_NAMES}
        return LevelTests(difference, adf, phi)

    def lag_profile(self, x: np.ndarray, spec: str, difference: int,
                    max_lags: int) -> tuple[LagPoint, ...]:
        """τ for every lag 0…max on its longest sample, with the 5% critical value."""
        tau, nobs_by_lag = self._batch.profile(self._index, spec, difference, max_lags)
        if not np.isfinite(tau).all():
            raise NeedsReference
        critical = _profile_critical_values(spec, tuple(nobs_by_lag.tolist()))
        return tuple([LagPoint(lag, statistic, value, statistic < value)
                      for lag, (statistic, value) in enumerate(zip(tau.tolist(), critical, strict=True))])

    def kpss(self, x: np.ndarray, spec: str, difference: int, alpha: float) -> TestResult:
        return self._batch.kpss_tests.result(self._index, x, spec, difference, alpha)

    def union(self, x: np.ndarray, options: EstimateOptions, period: int | None = None) -> UnionRow:
        if period != self._batch.period:
            raise NeedsReference
        return self._batch.union_row(self._index)

    def recursive(self, x: np.ndarray, spec: str, lags: int, difference: int,
                  alpha: float) -> RecursiveStatistic:
        return self._batch.recursive(self._index, spec, lags, difference, alpha)

    def seasonal_roots(self, x: np.ndarray, period: int, alpha: float) -> SeasonalRootsResult:
        return self._batch.seasonal.result(self._index, period, alpha)


class SeriesBatch:
    """Series of one length analysed together; each difference level is computed for
    the whole batch when a series first asks for it."""

    def __init__(self, values: list[np.ndarray], options: EstimateOptions,
                 period: int | None = None) -> None:
        self._levels_in = np.vstack(values)
        self.period = period  # S when every series' fixed seasonal means are removed first
        self._options = options
        self._levels: dict[tuple[int, int], LevelBatch] = {}
        self._profiles: dict[tuple[int, str, int, int], tuple[np.ndarray, np.ndarray]] = {}
        self._union: list[UnionRow] | None = None
        self._recursive: dict[tuple[int, str, int, int, float], RecursiveStatistic] = {}
        self.seasonal = SeasonalBatch(self._levels_in)  # the seasonal unit-root tests, batched
        self.kpss_tests = KpssBatch()  # the cross-check's KPSS tests, batched when asked ahead

    def __len__(self) -> int:
        return int(self._levels_in.shape[0])

    def estimation(self, index: int) -> FastEstimation:
        return FastEstimation(self, index)

    def level(self, difference: int, max_lags: int) -> LevelBatch:
        key = (difference, max_lags)
        if key not in self._levels:
            xs = np.diff(self._levels_in, n=difference, axis=1) if difference else self._levels_in
            if self.period is not None:
                xs = remove_seasonal_means(xs, self.period)
            self._levels[key] = level_batch(xs, difference, self._options, max_lags)
        return self._levels[key]

    def union_row(self, index: int) -> UnionRow:
        """The union of rejections for one series, computed for the whole batch at the
        first request (row by row, so the same numbers as one series alone)."""
        if self._union is None:
            o = self._options
            self._union = union_rows(self._levels_in, o.lag_rule, o.alpha, o.max_difference,
                                     o.max_lags, o.lags if o.lag_rule == "fixed" else None, o.bootstrap,
                                     self.period)
        return self._union[index]

    def prefetch_recursive(self, requests: list[tuple[int, str, int, int]], alpha: float) -> None:
        """Compute τ on expanding windows for (index, spec, lag order, difference) together,
        one batched call per (spec, lag order, difference); each row's numbers are those
        it gets alone (:func:`recursive_tau_many`)."""
        groups: dict[tuple[str, int, int], set[int]] = {}
        for index, spec, lags, difference in requests:
            groups.setdefault((spec, lags, difference), set()).add(index)
        for (spec, lags, difference), indices in groups.items():
            rows = sorted(indices)
            xs = np.diff(self._levels_in[rows], n=difference, axis=1)
            if self.period is not None:  # as PreparedSeries.level(d) gives it on either path
                xs = remove_seasonal_means(xs, self.period)
            for index, found in zip(rows, recursive_tau_many(xs, spec, lags, alpha), strict=True):
                self._recursive[(index, spec, lags, difference, alpha)] = found

    def recursive(self, index: int, spec: str, lags: int, difference: int,
                  alpha: float) -> RecursiveStatistic:
        """τ on expanding windows of one series' Δ^d y (prefetched, or computed alone)."""
        key = (index, spec, lags, difference, alpha)
        if key not in self._recursive:
            self.prefetch_recursive([(index, spec, lags, difference)], alpha)
        return self._recursive[key]

    def prefetch_profiles(self, requests: list[tuple[int, str, int, int]]) -> None:
        """Compute the lag profiles (index, spec, difference, maximum lag) together, one
        factorisation call per (spec, difference)."""
        groups: dict[tuple[str, int, int], list[int]] = {}
        for index, spec, difference, max_lags in requests:
            groups.setdefault((spec, difference, max_lags), []).append(index)
        for (spec, difference, max_lags), indices in groups.items():
            tau, nobs = self._profile_rows(indices, spec, difference, max_lags)
            for row, index in enumerate(indices):
                self._profiles[(index, spec, difference, max_lags)] = (tau[row], nobs)

    def profile(self, index: int, spec: str, difference: int,
                max_lags: int) -> tuple[np.ndarray, np.ndarray]:
        """τ by lag on each lag's longest sample, and those sample sizes, for one series."""
        cached = self._profiles.pop((index, spec, difference, max_lags), None)
        if cached is not None:
            return cached
        tau, nobs = self._profile_rows([index], spec, difference, max_lags)
        return tau[0], nobs

    def _profile_rows(self, indices: list[int], spec: str, difference: int,
                      max_lags: int) -> tuple[np.ndarray, np.ndarray]:
        # Only asked after level_tests accepted these series, so their factors are
        # well conditioned.
        level = self.level(difference, max_lags)
        order = [*spec_order(spec, max_lags), max_lags + 3]
        first = level.first_rows[indices]
        if spec == "none":
            first = _uncentred_rows(first, level.centres[indices])
        return profile_tau(level.common[spec][indices], first[:, :, order],
                           len(DETERMINISTIC_TERMS[spec]), level.n - 1)
