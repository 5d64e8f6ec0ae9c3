"""Zivot-Andrews unit-root test with one break chosen from the data (Zivot, E. &
Andrews, D.W.K. 1992, "Further Evidence on the Great Crash, the Oil-Price Shock,
and the Unit-Root Hypothesis", Journal of Business & Economic Statistics 10(3),
251-270).

For every candidate break position TB (the last observation of the old
regime) the regression

    Δy_t = μ + θ·DU_t + β·t + δ·DT_t + α·y_{t−1} + Σ_{j=1..p} c_j Δy_{t−j} + e_t,
    DU_t = 1(t > TB),   DT_t = (t − TB)·1(t > TB),

is fitted with θ only (model "c", a shift in the intercept), δ only ("t", a
change in the trend's slope) or both ("ct"), and the statistic is the smallest
t ratio of α̂ over TB; TB at the minimum is the estimated break.  Candidates run
from ⌊trim·T⌋ to T − ⌊trim·T⌋ − 1 (0-based positions; trim 0.15 by default).
One lag order p is used for every candidate, chosen on the ADF regression with
constant and trend without a break (the approximation of Baum 2004, the same
one statsmodels' ``zivot_andrews`` uses).

Critical values and p-values: the simulated quantiles (100,000 replications,
2,000 observations) published with statsmodels' ``zivot_andrews``, copied
below and interpolated linearly as there.  All candidate breaks are solved as
one batch (numpy), not one regression at a time.
"""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from tauscope.engine.errors import UntestableSeries
from tauscope.engine.regression.scaling import centred
from tauscope.engine.results import TestResult

MODELS = ("c", "t", "ct")
MODEL_LABELS = {
    "c": "a one-time shift in the level",
    "t": "a one-time change in the slope of the trend",
    "ct": "a one-time shift in the level and the slope of the trend",
}
_CHUNK_VALUES = 500_000

# Simulated distribution of the Zivot-Andrews statistic: (percentile, quantile),
# as published with statsmodels (BSD licence), statsmodels.tsa.stattools.zivot_andrews.
ZA_QUANTILES: dict[str, tuple[tuple[float, float], ...]] = {
    "c": (
        (0.001, -6.78442), (0.1, -5.83192), (0.2, -5.68139), (0.3, -5.58461), (0.4, -5.51308),
        (0.5, -5.45043), (0.6, -5.39924), (0.7, -5.36023), (0.8, -5.33219), (0.9, -5.30294),
        (1, -5.27644), (2.5, -5.03340), (5, -4.81067), (7.5, -4.67636), (10, -4.56618),
        (12.5, -4.48130), (15, -4.40507), (17.5, -4.33947), (20, -4.28155), (22.5, -4.22683),
        (25, -4.17830), (27.5, -4.13101), (30, -4.08586), (32.5, -4.04455), (35, -4.00380),
        (37.5, -3.96144), (40, -3.92078), (42.5, -3.88178), (45, -3.84503), (47.5, -3.80549),
        (50, -3.77031), (52.5, -3.73209), (55, -3.69600), (57.5, -3.65985), (60, -3.62126),
        (65, -3.54580), (70, -3.46848), (75, -3.38533), (80, -3.29112), (85, -3.17832),
        (90, -3.04165), (92.5, -2.95146), (95, -2.83179), (96, -2.76465), (97, -2.68624),
        (98, -2.57884), (99, -2.40044), (99.9, -1.88932),
    ),
    "t": (
        (0.001, -83.90940), (0.1, -13.88370), (0.2, -9.13205), (0.3, -6.32564),
        (0.4, -5.60803), (0.5, -5.38794), (0.6, -5.26585), (0.7, -5.18734), (0.8, -5.12756),
        (0.9, -5.07984), (1, -5.03421), (2.5, -4.65634), (5, -4.40580), (7.5, -4.25214),
        (10, -4.13678), (12.5, -4.03765), (15, -3.95185), (17.5, -3.87945), (20, -3.81295),
        (22.5, -3.75273), (25, -3.69836), (27.5, -3.64785), (30, -3.59819), (32.5, -3.55146),
        (35, -3.50522), (37.5, -3.45987), (40, -3.41672), (42.5, -3.37465), (45, -3.33394),
        (47.5, -3.29393), (50, -3.25316), (52.5, -3.21244), (55, -3.17124), (57.5, -3.13211),
        (60, -3.09204), (65, -3.01135), (70, -2.92897), (75, -2.83614), (80, -2.73893),
        (85, -2.62840), (90, -2.49611), (92.5, -2.41337), (95, -2.30820), (96, -2.25797),
        (97, -2.19648), (98, -2.11320), (99, -1.99138), (99.9, -1.67466),
    ),
    "ct": (
        (0.001, -38.17800), (0.1, -6.43107), (0.2, -6.07279), (0.3, -5.95496), (0.4, -5.86254),
        (0.5, -5.77081), (0.6, -5.72541), (0.7, -5.68406), (0.8, -5.65163), (0.9, -5.60419),
        (1, -5.57556), (2.5, -5.29704), (5, -5.07332), (7.5, -4.93003), (10, -4.82668),
        (12.5, -4.73711), (15, -4.66020), (17.5, -4.58970), (20, -4.52855), (22.5, -4.47100),
        (25, -4.42011), (27.5, -4.37387), (30, -4.32705), (32.5, -4.28126), (35, -4.23793),
        (37.5, -4.19822), (40, -4.15800), (42.5, -4.11946), (45, -4.08064), (47.5, -4.04286),
        (50, -4.00489), (52.5, -3.96837), (55, -3.93200), (57.5, -3.89496), (60, -3.85577),
        (65, -3.77795), (70, -3.69794), (75, -3.61852), (80, -3.52485), (85, -3.41665),
        (90, -3.28527), (92.5, -3.19724), (95, -3.08769), (96, -3.03088), (97, -2.96091),
        (98, -2.85581), (99, -2.71015), (99.9, -2.28767),
    ),
}


@dataclass(frozen=True)
class BreakSearch:
    """The Zivot-Andrews statistic, where it was found and the whole profile."""

    model: str
    statistic: float
    position: int  # TB: last observation (0-based) of the old regime
    lags: int
    nobs: int
    positions: np.ndarray  # candidate TB values
    statistics: np.ndarray  # t ratio of α̂ at each candidate

    @property
    def first_new(self) -> int:
        """First observation (0-based) of the new regime."""
        return self.position + 1


def break_terms(model: str, t: np.ndarray, positions: np.ndarray) -> list[np.ndarray]:
    """Break regressors as (rows, candidates) matrices: [DU] ("c"), [DT] ("t") or both."""
    after = t[:, None] > positions[None, :]
    columns = []
    if model in ("c", "ct"):
        columns.append(after.astype(float))
    if model in ("t", "ct"):
        columns.append(np.where(after, t[:, None] - positions[None, :], 0.0))
    return columns


def break_profile(x: np.ndarray, model: str, lags: int, positions: np.ndarray) -> np.ndarray:
    """t ratio of α̂ for every candidate break position in ``positions``.

    By Frisch-Waugh-Lovell the fixed terms A = [1, t, Δy_{t−1}, …, Δy_{t−p}] are
    partialled out once (QR of A); each candidate then needs only the small
    regression of the residualised Δy on the residualised y_{t−1} and break
    terms, solved for all candidates at once from their cross products.
    """
    if model not in MODELS:
        raise ValueError(f"model must be one of {', '.join(MODELS)}, not {model!r}")
    x = np.asarray(x, dtype=float)
    dx = np.diff(x)
    rows = np.arange(lags, dx.shape[0])  # Δy index; t = row + 1 is the position in x
    t = (rows + 1).astype(float)
    fixed = np.column_stack([np.ones(rows.shape[0]), t] + [dx[rows - i] for i in range(1, lags + 1)])
    fixed = fixed / np.sqrt(np.sum(fixed * fixed, axis=0))  # t ratios ignore column scale
    q, _ = np.linalg.qr(fixed)
    n = rows.shape[0]
    k = fixed.shape[1] + 1 + (2 if model == "ct" else 1)
    if n <= k + 1:
        raise UntestableSeries(f"too few observations ({n}) for the break regression with {lags} lags")

    def residualise(values: np.ndarray) -> np.ndarray:
        return np.asarray(values - q @ (q.T @ values))

    level = x[rows]
    y_r = residualise(dx[rows] / np.sqrt(dx[rows] @ dx[rows]))
    x_r = residualise(level / np.sqrt(level @ level))
    out = np.empty(positions.shape[0])
    chunk = max(1, _CHUNK_VALUES // n)
    for start in range(0, positions.shape[0], chunk):
        block = positions[start:start + chunk]
        terms = []
        for column in break_terms(model, t, block):
            norms = np.sqrt(np.sum(column * column, axis=0))
            terms.append(residualise(column / np.where(norms > 0, norms, 1.0)))
        m = 1 + len(terms)
        gram = np.empty((block.shape[0], m, m))
        cross = np.empty((block.shape[0], m))
        gram[:, 0, 0] = x_r @ x_r
        cross[:, 0] = x_r @ y_r
        for i, term in enumerate(terms, start=1):
            gram[:, 0, i] = gram[:, i, 0] = x_r @ term
            cross[:, i] = y_r @ term
            for j, other in enumerate(terms[: i], start=1):
                gram[:, i, j] = gram[:, j, i] = np.einsum("nc,nc->c", term, other)
        inverse = np.linalg.inv(gram)
        beta = np.einsum("cml,cl->cm", inverse, cross)
        rss = float(y_r @ y_r) - np.einsum("cm,cm->c", beta, cross)
        variance = rss / (n - k) * inverse[:, 0, 0]
        with np.errstate(invalid="ignore", divide="ignore"):  # exact fits: NaN, refused below
            out[start:start + block.shape[0]] = np.where(
                variance > 0, beta[:, 0] / np.sqrt(np.abs(variance)), np.nan)
    return out


def candidate_positions(length: int, trim: float, lags: int) -> np.ndarray:
    """Break positions TB searched: ⌊trim·T⌋ … T − ⌊trim·T⌋ − 1, kept where the
    regression has at least two observations on each side of the break."""
    cut = int(length * trim)
    first = max(cut, lags + 2)
    last = min(length - cut - 1, length - 3)
    if last < first:
        raise UntestableSeries("the series is too short to search for a break")
    return np.arange(first, last + 1)


def zivot_andrews(x: np.ndarray, model: str = "ct", lags: int = 0, trim: float = 0.15) -> BreakSearch:
    """Search every candidate break and return the smallest t ratio of α̂."""
    if not 0.0 <= trim < 1.0 / 3.0:
        raise ValueError("trim must be in [0, 1/3)")
    x = centred(np.asarray(x, dtype=float), "constant")  # the level only moves the constant
    positions = candidate_positions(x.shape[0], trim, lags)
    statistics = break_profile(x, model, lags, positions)
    if not np.all(np.isfinite(statistics)):
        raise UntestableSeries("the break regressions could not be computed (terms linearly dependent)")
    best = int(np.argmin(statistics))
    return BreakSearch(model, float(statistics[best]), int(positions[best]), lags,
                       int(x.shape[0] - 1 - lags), positions, statistics)


def za_p_value(statistic: float, model: str) -> float:
    """Linear interpolation in the simulated quantiles (bounded by the table's ends)."""
    table = np.asarray(ZA_QUANTILES[model])
    return float(np.interp(statistic, table[:, 1], table[:, 0]) / 100.0)


def za_critical_values(model: str) -> dict[str, float]:
    table = np.asarray(ZA_QUANTILES[model])
    values = np.interp([1.0, 5.0, 10.0], table[:, 0], table[:, 1])
    return {"1%": float(values[0]), "5%": float(values[1]), "10%": float(values[2])}


def za_test(x: np.ndarray, alpha: float, model: str = "ct", lags: int = 0, trim: float = 0.15,
            difference: int = 0, lag_rule: str = "fixed") -> tuple[TestResult, BreakSearch]:
    """Zivot-Andrews as a :class:`TestResult` (test "za", spec "trend": the regression
    always holds a constant and a trend), with the break search behind it."""
    search = zivot_andrews(x, model, lags, trim)
    critical_values = za_critical_values(model)
    level = f"{round(alpha * 100):d}%"
    p = za_p_value(search.statistic, model)
    table = ZA_QUANTILES[model]
    # At the table's ends the p-value is only bounded; "below 0.001" already says so at the low end.
    bound = "above" if p >= table[-1][0] / 100.0 else None
    return TestResult(
        test="za",
        spec="trend",
        difference=difference,
        statistic=search.statistic,
        p_value=p,
        lags=lags,
        nobs=search.nobs,
        critical_values=critical_values,
        reject=bool(search.statistic < critical_values[level]),
        critical_value=critical_values[level],
        p_value_bound=bound,
        lag_rule=lag_rule,
    ), search
