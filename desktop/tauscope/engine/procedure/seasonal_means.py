"""The seasonal setting applied to a prepared series: are fixed seasonal means tested
for, found, and allowed for in the unit-root tests?

For a quarterly or monthly series (its dates say so), ``"automatic"`` runs the F test
of :mod:`tauscope.engine.seasonal.means` and allows for the seasonal means when it
finds them at 1%; ``"always"`` allows for them whatever the test says (it is still run
and shown); ``"never"`` neither tests nor allows for them.  Series without quarterly or
monthly dates are left as they are.  The outcome is plain data on the prepared series
(``PreparedSeries.seasonal``), so every later stage reads the same decision.
"""

from __future__ import annotations

from dataclasses import replace

import numpy as np
import pandas as pd

from tauscope.engine.formatting import p_value as fmt_p
from tauscope.engine.formatting import stat
from tauscope.engine.procedure.prepare import PreparedSeries
from tauscope.engine.results_seasonal import SeasonalMeans
from tauscope.engine.seasonal.means import (
    FIND_LEVEL,
    PERIODS,
    SeasonalMeansFit,
    seasonal_means_tests,
)

SEASON_NAMES = {
    4: ("Q1", "Q2", "Q3", "Q4"),
    12: ("Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"),
}


def first_season(index: pd.Index | None, period: int) -> int:
    """The calendar season (0-based: first quarter, January) of the first value."""
    if index is None or len(index) == 0:
        return 0
    first = index[0]
    month = getattr(first, "month", None)
    if month is None:
        return 0
    return (int(month) - 1) // 3 if period == 4 else int(month) - 1


def seasonal_period(prepared: PreparedSeries, mode: str) -> int | None:
    """The period S whose seasonal means the setting tests for, or None (the setting is
    "never", or the series is neither quarterly nor monthly)."""
    ppy = prepared.periods_per_year
    period = int(ppy) if ppy is not None and int(ppy) in PERIODS else None
    return None if mode == "never" else period


def with_seasonal(prepared: PreparedSeries, mode: str) -> PreparedSeries:
    """The prepared series with its ``seasonal`` decision (unchanged for "never" or a
    series that is neither quarterly nor monthly)."""
    period = seasonal_period(prepared, mode)
    if period is None:
        return prepared
    start = first_season(prepared.index, period)
    # the batched test on one row: the same bits as the series gets in a batch (analyse_many)
    fit = seasonal_means_tests(prepared.standardised[None, :], period, start)[0]
    return _decided(prepared, mode, period, fit)


def with_seasonal_many(prepared: list[PreparedSeries | None], mode: str) -> list[PreparedSeries | None]:
    """:func:`with_seasonal` of every series (None stays None), the F tests of the series
    of one length, period and first season run together (``seasonal_means_tests``, the same
    numbers to rounding); a series whose test fails comes back None, as it would alone."""
    out = list(prepared)
    groups: dict[tuple[int, int, int], list[int]] = {}
    for i, item in enumerate(prepared):
        period = None if item is None else seasonal_period(item, mode)
        if item is not None and period is not None:
            start = first_season(item.index, period)
            groups.setdefault((item.standardised.shape[0], period, start), []).append(i)
    for (_, period, start), members in groups.items():
        rows = np.vstack([_standardised(prepared[i]) for i in members])
        try:
            fits = seasonal_means_tests(rows, period, start)
        except _FAILURES:
            for i in members:
                out[i] = _alone(prepared[i], mode)
            continue
        for i, fit in zip(members, fits, strict=True):
            out[i] = _decided(_prepared(prepared[i]), mode, period, fit)
    return out


_FAILURES = (np.linalg.LinAlgError, ValueError, ZeroDivisionError, FloatingPointError)


def _alone(item: PreparedSeries | None, mode: str) -> PreparedSeries | None:
    try:
        return with_seasonal(_prepared(item), mode)
    except _FAILURES:
        return None


def _prepared(item: PreparedSeries | None) -> PreparedSeries:
    assert item is not None
    return item


def _standardised(item: PreparedSeries | None) -> np.ndarray:
    return _prepared(item).standardised


def _decided(prepared: PreparedSeries, mode: str, period: int,
             fit: SeasonalMeansFit | None) -> PreparedSeries:
    """The prepared series with the decision the F test ``fit`` (None: too short) gives."""
    # the effects in the series' units, in calendar order from the first quarter or January
    # fit.effects are in calendar order already (the contrasts start at ``start``).
    effects = () if fit is None else tuple(float(v) * prepared.scale for v in fit.effects)
    found = fit is not None and fit.found
    used = mode == "always" or found
    means = SeasonalMeans(
        period=period, mode=mode,
        statistic=None if fit is None else fit.statistic,
        p_value=None if fit is None else fit.p_value,
        df=None if fit is None else (fit.df_num, fit.df_den),
        lags=None if fit is None else fit.lags,
        found=found, used=used, effects=effects, seasons=SEASON_NAMES[period],
        text=_sentence(period, mode, fit is not None, found, used,
                       None if fit is None else fit.statistic, None if fit is None else fit.p_value),
    )
    decided = replace(prepared, seasonal=means)
    for name in _KEPT:  # cached already and the same for the new one: kept
        if name in prepared.__dict__:
            decided.__dict__[name] = prepared.__dict__[name]
    return decided


# PreparedSeries' cached properties that depend on its values and dates alone, not on the
# seasonal decision (its levels do: they remove the seasonal means when these are used)
_KEPT = ("scale", "standardised", "jump", "periods_per_year")


def _sentence(period: int, mode: str, tested: bool, found: bool, used: bool,
              statistic: float | None, p_value: float | None) -> str:
    unit = "quarter" if period == 4 else "month"
    if not tested:
        head = "The series is too short to test for fixed seasonal means."
    elif found:
        head = (f"Fixed seasonal means found: each {unit} has its own average level "
                f"(F test of seasonal dummies, F = {stat(statistic)}, p-value {fmt_p(p_value)}).")
    else:
        head = (f"No fixed seasonal means found at {FIND_LEVEL:.0%} "
                f"(F test of seasonal dummies, F = {stat(statistic)}, p-value {fmt_p(p_value)}).")
    if used:
        why = ", as the settings ask" if mode == "always" and not found else ""
        tail = (f" The unit-root tests allow for fixed seasonal means{why}: each {unit}'s mean is "
                "removed before testing (seasonal dummies; Dickey, Bell & Miller 1986).")
    else:
        tail = ""
    return head + tail
