"""Turning what the caller passes into a clean float array, or one sentence on why not."""

from __future__ import annotations

from dataclasses import dataclass
from functools import cached_property
from typing import Any

import numpy as np
import pandas as pd

from tauscope.engine.errors import UntestableSeries
from tauscope.engine.reading.notes import find_jump
from tauscope.engine.regression.scaling import power_of_two_scale, scaled
from tauscope.engine.results_seasonal import SeasonalMeans
from tauscope.engine.seasonal.means import remove_seasonal_means

MIN_OBSERVATIONS = 12

PERIODS_PER_YEAR = {"Y": 1.0, "A": 1.0, "Q": 4.0, "M": 12.0, "W": 52.0, "D": 365.0, "B": 261.0}


@dataclass(frozen=True)
class PreparedSeries:
    values: np.ndarray
    index: pd.Index | None
    leading_trimmed: int
    trailing_trimmed: int
    seasonal: SeasonalMeans | None = None  # set by procedure/seasonal_means.py

    @cached_property
    def scale(self) -> float:
        """The power of two the regressions divide the values by (the regression.scaling module)."""
        return power_of_two_scale(self.values)

    @cached_property
    def standardised(self) -> np.ndarray:
        """values / scale: exact, with changes of order 1, safe from overflow."""
        return scaled(self.values, self.scale)

    @property
    def dummies_period(self) -> int | None:
        """S when the unit-root tests allow for fixed seasonal means, else None."""
        return self.seasonal.period if self.seasonal is not None and self.seasonal.used else None

    def level(self, difference: int) -> np.ndarray:
        """Δ^d of the standardised series, with its fixed seasonal means removed when the
        tests allow for them (:mod:`tauscope.engine.seasonal.means`, at each difference).
        Computed once per difference (the estimate and the cross-check ask for the same
        ones) and held read-only, since every caller gets the same array."""
        found = self._levels.get(difference)
        if found is None:
            x = self.standardised
            found = np.diff(x, n=difference) if difference else x
            period = self.dummies_period
            if period is not None:
                found = np.asarray(remove_seasonal_means(found, period))
            if found is not x:
                found.setflags(write=False)
            self._levels[difference] = found
        return found

    @cached_property
    def _levels(self) -> dict[int, np.ndarray]:
        return {}

    @cached_property
    def jump(self) -> int | None:
        """The jump detector's position on the standardised series
        (:func:`tauscope.engine.reading.notes.find_jump`), asked by the break check and
        the reading alike."""
        return find_jump(self.standardised)

    def label(self, position: int) -> str:
        """A readable name for observation ``position`` (0-based, after trimming)."""
        if self.index is not None and 0 <= position < len(self.index):
            return str(self.index[position])
        return f"observation {position + 1}"

    @cached_property
    def periods_per_year(self) -> float | None:
        """Observations per year from the index's frequency (None without one); found once."""
        if self.index is None:
            return None
        code: str | None = None
        if isinstance(self.index, pd.PeriodIndex):
            code = self.index.freqstr
        elif isinstance(self.index, pd.DatetimeIndex) and len(self.index) >= 3:
            code = self.index.freqstr or pd.infer_freq(self.index)
        if not code:
            return None
        base = code.split("-")[0].lstrip("0123456789").upper()
        for key in ("QE", "QS", "ME", "MS", "YE", "YS", "BQ", "BM"):
            if base.startswith(key):
                base = key[0] if key[0] != "B" else key[1]
                break
        return PERIODS_PER_YEAR.get(base[:1]) if base else None


def prepare(values: Any) -> PreparedSeries:
    """Validate and trim; raise :class:`UntestableSeries` with one sentence."""
    index: pd.Index | None = None
    if isinstance(values, pd.Series):
        index = values.index
        if not isinstance(index, pd.PeriodIndex | pd.DatetimeIndex):
            index = None
        raw = values.to_numpy()
    else:
        raw = values
    if np.iscomplexobj(raw):  # a cast to float would silently drop the imaginary parts
        raise UntestableSeries("it contains complex numbers; only real numbers can be tested")
    try:
        x = np.asarray(raw, dtype=float)
    except (TypeError, ValueError):
        raise UntestableSeries("it contains values that are not numbers") from None
    if x.ndim != 1:
        x = np.squeeze(x)
        if x.ndim != 1:
            raise UntestableSeries("it is not a single column of numbers")
    if x.size == 0:
        raise UntestableSeries("it has no observations")
    if np.isinf(x).any():
        where = int(np.flatnonzero(np.isinf(x))[0])
        raise UntestableSeries(f"it contains an infinite value (observation {where + 1})")
    present = np.flatnonzero(~np.isnan(x))
    if present.size == 0:
        raise UntestableSeries("every value is missing")
    start, stop = int(present[0]), int(present[-1]) + 1
    trimmed = x[start:stop]
    if index is not None:
        index = index[start:stop]
    prepared = PreparedSeries(trimmed, index, start, x.size - stop)
    gaps = np.flatnonzero(np.isnan(trimmed))
    if gaps.size:
        raise UntestableSeries(
            f"it has {gaps.size} missing value{'s' if gaps.size > 1 else ''} inside the sample "
            f"(first at {prepared.label(int(gaps[0]))}); fill the gap or test a gap-free stretch"
        )
    if trimmed.size < MIN_OBSERVATIONS:
        raise UntestableSeries(
            f"it has only {trimmed.size} observations; at least {MIN_OBSERVATIONS} are needed"
        )
    if trimmed.min() == trimmed.max():  # np.ptp would overflow near ±1e308
        raise UntestableSeries("it is constant, so there is nothing to test")
    return prepared
