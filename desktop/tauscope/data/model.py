"""The series model: what a workbook turns into (see data-api contract).

A :class:`SeriesData` holds float64 values on a ``PeriodIndex`` (dates understood)
or a ``RangeIndex`` 1..n (observation numbers), with leading and trailing missing
values trimmed and interior gaps kept as NaN and listed in ``gaps``.
"""

from __future__ import annotations

import dataclasses
from dataclasses import dataclass, field
from functools import cached_property
from pathlib import Path

import numpy as np
import pandas as pd

from tauscope.data.errors import DataError


@dataclass(frozen=True)
class Source:
    """Where a series came from: file path, sheet, header text as in the file, first data row."""

    file: str
    sheet: str
    column: str
    first_row: int | None = None


@dataclass(frozen=True)
class Gap:
    """An interior run of missing values: first and last missing label and how many."""

    start: str
    end: str
    count: int


def period_label(value: object) -> str:
    """How a date is shown: "1995Q1", "1995-01", "1995", "1995-03-31"; weeks by their last day."""
    if isinstance(value, pd.Period):
        if value.freqstr.startswith("W"):
            return f"{value.end_time:%Y-%m-%d}"
        return str(value)
    return str(value)


def find_gaps(values: pd.Series) -> tuple[Gap, ...]:
    """Interior runs of NaN (``values`` must already be trimmed)."""
    return _gaps_of(values.to_numpy(dtype=float), values.index)


def _gaps_of(array: np.ndarray, index: pd.Index,
             labels: list[str] | None = None) -> tuple[Gap, ...]:
    missing = np.isnan(array)
    if not missing.any():
        return ()
    edges = np.diff(np.concatenate(([0], missing.astype(np.int8), [0])))
    starts, ends = np.flatnonzero(edges == 1), np.flatnonzero(edges == -1) - 1
    if labels is not None:
        firsts, lasts = [labels[k] for k in starts], [labels[k] for k in ends]
    else:
        firsts = [period_label(v) for v in index[starts]]
        lasts = [period_label(v) for v in index[ends]]
    return tuple(Gap(a, b, int(n)) for a, b, n in zip(firsts, lasts, ends - starts + 1,
                                                       strict=True))


def trim(values: pd.Series) -> pd.Series:
    """Drop leading and trailing NaN; keep interior NaN."""
    present = np.flatnonzero(~np.isnan(values.to_numpy(dtype=float)))
    if present.size == 0:
        return values.iloc[0:0]
    return values.iloc[int(present[0]) : int(present[-1]) + 1]


@dataclass(frozen=True, eq=False)
class SeriesData:
    """One series as read (or derived by a transformation)."""

    name: str
    values: pd.Series
    frequency: str | None
    source: Source
    gaps: tuple[Gap, ...] = ()
    transform: str | None = None
    parent: str | None = None
    filled: bool = False
    notes: tuple[str, ...] = ()
    chain: tuple[str, ...] = field(default=(), repr=False)
    column_key: str = field(default="", repr=False)  # the unique name as read

    @classmethod
    def build(
        cls,
        name: str,
        values: pd.Series,
        frequency: str | None,
        source: Source,
        notes: tuple[str, ...] = (),
        **extra: object,
    ) -> SeriesData:
        """Trim, rename and list gaps; the one way series are made."""
        return cls.from_array(name, values.to_numpy(dtype=np.float64), values.index, frequency,
                              source, notes, None, **extra)

    @classmethod
    def from_array(
        cls,
        name: str,
        array: np.ndarray,
        index: pd.Index,
        frequency: str | None,
        source: Source,
        notes: tuple[str, ...] = (),
        labels: list[str] | None = None,
        **extra: object,
    ) -> SeriesData:
        """:meth:`build` from a float64 array and its index; ``labels``: the index's labels
        (``period_label``) when the caller has them, so a sheet of many series with many
        gaps labels its dates once."""
        present = np.flatnonzero(~np.isnan(array))
        start, stop = (int(present[0]), int(present[-1]) + 1) if present.size else (0, 0)
        if (start, stop) != (0, len(index)):
            index, array = index[start:stop], array[start:stop]
            labels = labels[start:stop] if labels is not None else None
        trimmed = pd.Series(array, index=index, name=name, dtype=np.float64, copy=False)
        extra.setdefault("column_key", name)
        gaps = _gaps_of(array, index, labels)
        return cls(name, trimmed, frequency, source, gaps, notes=notes,
                   **extra)  # type: ignore[arg-type]

    @property
    def nobs(self) -> int:
        return int(self.values.notna().sum())

    @property
    def span(self) -> tuple[str, str]:
        if len(self.values) == 0:
            return ("", "")
        return (period_label(self.values.index[0]), period_label(self.values.index[-1]))

    @cached_property
    def key(self) -> str:
        """Stable identity "file name|sheet|column|transform chain" (file name without folder).

        The column part is the series' name as read (unique in its sheet: a second "GDP"
        column is "GDP (2)"); the chain lists the transformations, e.g. "log,diff".
        Views of the same series (longest stretch, interpolated) share the key.  Made once
        per series (the fields it is made of are frozen): the window asks for it thousands
        of times when a run of many series starts.
        """
        return "|".join((Path(self.source.file).name, self.source.sheet,
                         self.column_key or self.source.column, ",".join(self.chain)))

    def label(self, position: int) -> str:
        return period_label(self.values.index[position])

    def longest_stretch(self) -> SeriesData:
        """The longest run without missing values (the most recent one on a tie)."""
        if not self.gaps:
            return self
        present = ~np.isnan(self.values.to_numpy(dtype=float))
        best_start, best_len, start = 0, 0, None
        for i, flag in enumerate([*present, False]):
            if flag and start is None:
                start = i
            elif not flag and start is not None:
                if i - start >= best_len:
                    best_start, best_len = start, i - start
                start = None
        part = self.values.iloc[best_start : best_start + best_len]
        note = (
            f"“{self.name}” has gaps, so only its longest stretch without missing values is used: "
            f"{period_label(part.index[0])} to {period_label(part.index[-1])} "
            f"({best_len} of {len(self.values)} observations)."
        )
        return dataclasses.replace(self, values=part, gaps=(), notes=(*self.notes, note))

    def interpolated(self) -> SeriesData:
        """Interior gaps filled by straight lines between the neighbouring values; ``filled``."""
        if not self.gaps:
            return self
        filled = self.values.copy()
        filled[:] = self.values.reset_index(drop=True).interpolate(
            method="linear", limit_area="inside").to_numpy()
        count = sum(g.count for g in self.gaps)
        note = (
            f"{count} missing value{'s' if count != 1 else ''} inside “{self.name}” "
            "were filled by linear interpolation; test results on filled data are less reliable."
        )
        return dataclasses.replace(self, values=filled, gaps=(), filled=True,
                                   notes=(*self.notes, note))

    def testable_values(self) -> pd.Series:
        """The values for the engine; DataError while interior gaps remain."""
        if self.gaps:
            count = sum(g.count for g in self.gaps)
            raise DataError(
                f"“{self.name}” has {count} missing value{'s' if count != 1 else ''} inside its "
                f"sample (first at {self.gaps[0].start}); test its longest stretch without gaps "
                "or fill the gaps",
                file=Path(self.source.file).name, sheet=self.source.sheet,
            )
        return self.values.copy()


@dataclass(frozen=True)
class SheetData:
    name: str
    series: tuple[SeriesData, ...]
    notes: tuple[str, ...] = ()


@dataclass(frozen=True)
class Workbook:
    path: Path
    sha256: str
    sheets: tuple[SheetData, ...]
    notes: tuple[str, ...] = ()

    def series(self) -> tuple[SeriesData, ...]:
        return tuple(s for sheet in self.sheets for s in sheet.series)

    def sheet(self, name: str) -> SheetData:
        for sheet in self.sheets:
            if sheet.name == name:
                return sheet
        for sheet in self.sheets:
            if sheet.name.casefold() == name.strip().casefold():
                return sheet
        names = ", ".join(s.name for s in self.sheets)
        raise DataError(f"has no sheet '{name}' (sheets: {names})", file=self.path.name)
