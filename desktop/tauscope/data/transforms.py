"""Transformations that make a new series with a readable name.

- "log": natural log ln(y_t); refused when any value is zero or negative.
- "diff": first difference Δy_t = y_t − y_{t−1}.
- "logdiff": growth in % as 100·(ln y_t − ln y_{t−1}), a close approximation of the
  percentage change for small changes.
- "sdiff": seasonal difference y_t − y_{t−s} with s = 4 (quarterly) or 12 (monthly).
"""

from __future__ import annotations

from pathlib import Path

import numpy as np
import pandas as pd

from tauscope.data.errors import DataError
from tauscope.data.model import SeriesData, period_label

TRANSFORMS: dict[str, str] = {
    "log": "Natural log",
    "diff": "First difference",
    "logdiff": "Growth in % (log difference × 100)",
    "sdiff": "Seasonal difference",
}
SEASONAL_LAGS = {"quarterly": 4, "monthly": 12}


def _error(series: SeriesData, reason: str) -> DataError:
    return DataError(reason, file=Path(series.source.file).name, sheet=series.source.sheet)


def _log(series: SeriesData) -> pd.Series:
    values = series.values
    bad = values[values <= 0]
    if len(bad):
        raise _error(series, f"“{series.name}” cannot be logged: it has a value of "
                             f"{bad.iloc[0]:g} at {period_label(bad.index[0])} (a log needs "
                             "values above zero)")
    return pd.Series(np.log(values.to_numpy(dtype=float)), index=values.index)


def make_transform(series: SeriesData, key: str) -> SeriesData:
    """A new series: ``key`` applied to ``series``; DataError with a sentence if impossible."""
    if key not in TRANSFORMS:
        raise _error(series, f"there is no transformation called '{key}' "
                             f"(known: {', '.join(TRANSFORMS)})")
    name = series.name
    if key == "log":
        values, label = _log(series), f"log({name})"
    elif key == "diff":
        values, label = series.values.diff(), f"Δ({name})"
    elif key == "logdiff":
        values, label = _log(series).diff() * 100.0, f"growth % ({name})"
    else:
        lag = SEASONAL_LAGS.get(series.frequency or "")
        if lag is None:
            raise _error(series, f"“{name}” has no seasonal difference: that needs quarterly or "
                                 f"monthly data, and this series is "
                                 f"{series.frequency or 'without regular dates'}")
        values, label = series.values.diff(lag), f"Δ{lag}({name})"
    made = SeriesData.build(
        label, values, series.frequency, series.source,
        notes=(f"{TRANSFORMS[key]} of “{name}”.",),
        transform=key, parent=name, filled=series.filled, chain=(*series.chain, key),
        column_key=series.column_key,
    )
    if made.nobs == 0:
        raise _error(series, f"“{name}” is too short for the {TRANSFORMS[key].lower()}")
    return made
