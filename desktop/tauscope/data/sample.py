"""Choosing a series' sample (``START:END``) and how gaps inside it are handled.

One rule for the window and ``tauscope batch``: a series with missing values inside its
sample is not tested as it stands (``"refuse"``, the default); the user chooses to test
its longest stretch without gaps (``"longest"``) or to fill the gaps by straight lines
between their neighbours (``"fill"``).  Whatever is done is said in the series' notes,
and the sample used (first and last label, number of observations) travels with it.

A sample is written ``START:END`` with either side optional ("1990Q1:2007Q4",
"1990:", ":2007-12"), in the labels the series shows (``period_label``), in a coarser
period (a year for quarterly data: "1990" starts at 1990Q1 and ends at 1990Q4), or as
observation numbers for series without dates.
"""

from __future__ import annotations

import dataclasses
from pathlib import Path

import numpy as np
import pandas as pd

from tauscope.data.errors import DataError
from tauscope.data.model import SeriesData, find_gaps, period_label

GAP_RULES = ("refuse", "longest", "fill")


def parse_sample(text: str) -> tuple[str | None, str | None]:
    """``"START:END"`` into its two labels (None for an open side); ValueError otherwise."""
    if text.count(":") != 1:
        raise ValueError(f"'{text}' is not START:END (for example 1990Q1:2007Q4 or 1990:)")
    start, end = (part.strip() or None for part in text.split(":"))
    if start is None and end is None:
        raise ValueError("the sample names neither a start nor an end")
    return start, end


def _position(series: SeriesData, label: str, last: bool) -> int:
    index = series.values.index
    wanted = label.strip().casefold()
    for k, value in enumerate(index):
        if period_label(value).casefold() == wanted:
            return k
    position: int | None = None
    if isinstance(index, pd.PeriodIndex):
        try:
            period = pd.Period(label.strip())
            moment = period.end_time if last else period.start_time
            target = pd.Period(moment, freq=index.freqstr)
        except (ValueError, TypeError, OverflowError):
            target = None
        if target is not None:
            ordinals = index.asi8
            k = int(np.searchsorted(ordinals, target.ordinal, side="right" if last else "left"))
            position = k - 1 if last else k
    elif label.strip().isdigit():
        number = int(label.strip())
        position = int(np.searchsorted(np.asarray(index), number, side="right" if last else "left"))
        position = position - 1 if last else position
    if position is None or not 0 <= position < len(index):
        first, final = series.span
        raise DataError(f"“{series.name}” has no observation at '{label}' (its data run from "
                        f"{first} to {final})", file=Path(series.source.file).name,
                        sheet=series.source.sheet)
    return position


def cut_sample(series: SeriesData, start: str | None, end: str | None) -> SeriesData:
    """The series restricted to ``start``..``end`` (labels, both included), with a note."""
    if start is None and end is None:
        return series
    a = _position(series, start, last=False) if start is not None else 0
    b = _position(series, end, last=True) if end is not None else len(series.values) - 1
    if b < a:
        raise DataError(f"the sample {start or ''}:{end or ''} of “{series.name}” ends before "
                        "it starts", file=Path(series.source.file).name, sheet=series.source.sheet)
    part = series.values.iloc[a : b + 1]
    present = np.flatnonzero(~np.isnan(part.to_numpy(dtype=float)))
    if present.size == 0:
        raise DataError(f"“{series.name}” has no values between {start or 'its start'} and "
                        f"{end or 'its end'}", file=Path(series.source.file).name,
                        sheet=series.source.sheet)
    part = part.iloc[int(present[0]) : int(present[-1]) + 1]
    note = (f"Sample chosen for “{series.name}”: {period_label(part.index[0])} to "
            f"{period_label(part.index[-1])} ({int(part.notna().sum())} observations).")
    return dataclasses.replace(series, values=part, gaps=find_gaps(part),
                               notes=(*series.notes, note))


def apply_gap_rule(series: SeriesData, rule: str) -> SeriesData:
    """``"longest"``: the longest stretch without gaps; ``"fill"``: gaps filled by straight
    lines; ``"refuse"``: unchanged (a series with gaps then cannot be tested and
    :meth:`SeriesData.testable_values` says how to go on)."""
    if rule not in GAP_RULES:
        raise ValueError(f"the gap rule is one of {', '.join(GAP_RULES)}, not '{rule}'")
    if not series.gaps or rule == "refuse":
        return series
    return series.longest_stretch() if rule == "longest" else series.interpolated()
