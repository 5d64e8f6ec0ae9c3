"""One sheet's grid of cells into series: find the dates, the header and the data block.

The grid is read as a table "as downloaded": title and note rows above, a header row
(possibly two, e.g. a merged group label over sub-labels), a block of rows that each
start with a date, and footnotes below.  When a row holds more dates than any of the
first columns, the sheet is transposed (series down, dates across) and read the same way.
"""

from __future__ import annotations

import datetime as dt
import math
from collections.abc import Sequence
from dataclasses import dataclass

import numpy as np
import pandas as pd

from tauscope.data.cells import POINT, Cell, NumberFormat, printable
from tauscope.data.dates import (
    FREQUENCY_NAMES,
    axis_score,
    build_axis,
    date_mask,
    weekdays_between,
)
from tauscope.data.grid import DATE, EMPTY, NUMBER, TEXT, classify_grid
from tauscope.data.model import SeriesData, SheetData, Source, period_label

Grid = list[list[Cell]] | np.ndarray  # rows of cells, or a 2-D object array of them
ORIENTATION_ROWS = 60  # rows searched for dates across (transposed layout)
DATE_COLUMN_CANDIDATES = 3


@dataclass(frozen=True)
class Place:
    """How grid positions map back to the file: rows/columns swapped when transposed."""

    transposed: bool
    letters: bool  # spreadsheet column letters (Excel) or numbers (text files)

    def row(self, i: int, j: int) -> int:
        return (j if self.transposed else i) + 1

    def line(self, j: int) -> str:
        """The file's name for grid column ``j``: "column C" (or "row 3" when transposed)."""
        if self.transposed:
            return f"row {j + 1}"
        return f"column {_letters(j + 1)}" if self.letters else f"column {j + 1}"


def _letters(n: int) -> str:
    out = ""
    while n:
        n, rest = divmod(n - 1, 26)
        out = chr(65 + rest) + out
    return out


def header_text(cell: Cell) -> str:
    if cell is None:
        return ""
    if isinstance(cell, float) and cell.is_integer():
        return str(int(cell))
    if isinstance(cell, dt.datetime) and cell.time() == dt.time(0):
        return cell.date().isoformat()
    if isinstance(cell, dt.date):
        return cell.isoformat()
    return printable(str(cell))


def _rectangle(rows: Sequence[Sequence[Cell]]) -> list[list[Cell]]:
    grid = [list(r) for r in rows]
    while grid and all(c is None or (isinstance(c, str) and not c.strip()) for c in grid[-1]):
        grid.pop()
    width = max((len(r) for r in grid), default=0)
    for r in grid:
        r.extend([None] * (width - len(r)))
    return grid


def _longest_run(mask: Sequence[bool]) -> tuple[int, int] | None:
    best: tuple[int, int] | None = None
    start: int | None = None
    for i, flag in enumerate([*mask, False]):
        if flag and start is None:
            start = i
        elif not flag and start is not None:
            if best is None or i - start > best[1] - best[0]:
                best = (start, i)
            start = None
    return best


def build_sheet(
    rows: Sequence[Sequence[Cell]],
    *,
    file: str,
    sheet: str,
    numbers: NumberFormat = POINT,
    letters: bool = True,
    arrays: tuple[np.ndarray, np.ndarray, np.ndarray] | None = None,
) -> SheetData:
    """Read one sheet's cells (``rows`` top to bottom) into a :class:`SheetData`.

    ``arrays``: the cells already laid out and classified (cells, kinds, numbers as
    arrays, :mod:`tauscope.data.text_table`); ``rows`` is then ignored."""
    grid: Grid
    if arrays is None:
        grid = _rectangle(rows)
        if not grid or not grid[0]:
            return SheetData(sheet, (), ("The sheet is empty.",))
        codes, nums = classify_grid(grid, numbers)
    else:
        grid, codes, nums = arrays
        if not grid.size:
            return SheetData(sheet, (), ("The sheet is empty.",))
    transposed, date_line = _orientation(grid, codes, nums)
    if transposed:
        grid = grid.T if isinstance(grid, np.ndarray) else [
            list(col) for col in zip(*grid, strict=True)]
        codes, nums = codes.T.copy(), nums.T.copy()
    return _Reader(grid, codes, nums, Place(transposed, letters), file, sheet, date_line).read()


def _content_columns(codes: np.ndarray) -> list[int]:
    return [int(j) for j in np.flatnonzero((codes != EMPTY).any(axis=0))]


def _could_hold_dates(codes: np.ndarray, nums: np.ndarray, to_beat: int) -> bool:
    """Whether a row has more than ``to_beat`` (and at least 3) cells that could be dates:
    text, date cells or whole numbers (years and spreadsheet day numbers); a row of
    fractional numbers is not worth reading label by label."""
    whole = (codes == NUMBER) & (nums == np.floor(nums)) & (nums >= 1000) & (nums <= 80_000)
    candidates = int(((codes == TEXT) | (codes == DATE) | whole).sum())
    return candidates >= max(3, to_beat + 1)


def _orientation(grid: Grid, codes: np.ndarray, nums: np.ndarray) -> tuple[bool, int]:
    """(transposed, index of the date column or row, -1 without dates)."""
    columns = _content_columns(codes)[:DATE_COLUMN_CANDIDATES]
    col_scores = [(axis_score([row[j] for row in grid])
                   if _could_hold_dates(codes[:, j], nums[:, j], 1) else 0, j) for j in columns]
    best_col = max(col_scores, default=(0, -1), key=lambda s: (s[0], -s[1]))
    rows = range(min(len(grid), ORIENTATION_ROWS))
    row_scores = [(axis_score(grid[i]) if _could_hold_dates(codes[i], nums[i], best_col[0])
                   else 0, i) for i in rows]
    best_row = max(row_scores, default=(0, -1), key=lambda s: (s[0], -s[1]))
    if best_row[0] > best_col[0] and best_row[0] >= 3:
        return True, best_row[1]
    if best_col[0] < 2 or _labelled_left_of(grid, codes, best_col[1]):
        return False, -1
    return False, best_col[1]


def _labelled_left_of(grid: Grid, codes: np.ndarray, column: int) -> bool:
    """True when a column left of ``column`` labels the same rows with distinct texts:
    those are the row labels (dates the reader could not understand), so the numbers in
    ``column`` are data that merely look like years, not the dates."""
    rows = [i for i, flag in enumerate(date_mask([row[column] for row in grid])) if flag]
    for left in range(column):
        texts = [grid[i][left] for i in rows if codes[i, left] == TEXT]
        if len(texts) >= max(2, len(rows) // 2) and len(set(texts)) >= 0.9 * len(texts):
            return True
    return False


class _Reader:
    def __init__(self, grid: Grid, codes: np.ndarray, nums: np.ndarray,
                 place: Place, file: str, sheet: str, date_col: int) -> None:
        self.grid, self.codes, self.nums, self.place = grid, codes, nums, place
        self.file, self.sheet, self.date_col = file, sheet, date_col
        self.notes: list[str] = []
        self.labels: list[str] | None = None  # the index's labels, made once for all series

    def read(self) -> SheetData:
        block = self._data_block()
        if block is None:
            return SheetData(self.sheet, (), ("No block of numbers was found in this sheet.",))
        r0, r1 = block
        width = len(self.grid[0])
        has_number = (self.codes[r0:r1] == NUMBER).any(axis=0)
        value_cols = [j for j in range(width) if j != self.date_col and has_number[j]]
        if not value_cols:
            return SheetData(self.sheet, (), ("This sheet has no column of numbers.",))
        raw_names = self._names(r0, value_cols)
        names = self._unique(raw_names)
        index, order, freq = self._index(r0, r1)
        series: list[SeriesData] = []
        for j, raw_name, name in zip(value_cols, raw_names, names, strict=True):
            made = self._series(j, raw_name, name, r0, r1, index, order, freq)
            if made is not None:
                series.append(made)
        self._note_skipped(r0, r1, value_cols)
        return SheetData(self.sheet, tuple(series), tuple(self.notes))

    # -- where the data are -------------------------------------------------------------------
    def _data_block(self) -> tuple[int, int] | None:
        if self.date_col >= 0:
            mask = date_mask([row[self.date_col] for row in self.grid])
        else:  # rows with numbers; text only in the first column (labels not understood)
            first = (_content_columns(self.codes) or [0])[0]
            text = self.codes == TEXT
            text[:, first] = False
            mask = list((self.codes == NUMBER).any(axis=1) & ~text.any(axis=1))
        return _longest_run(mask)

    def _upper_header(self, upper: int, lower: int, value_cols: list[int]) -> bool:
        """A second header row above the first: group labels over blank sub-labels, or a
        row filled across more than half the columns (names above units).  A title row
        that happens to split into two cells is neither."""
        filled = sum(1 for j in value_cols if self.codes[upper, j] != EMPTY)
        if filled == 0:
            return False
        lower_blank = any(self.codes[lower, j] == EMPTY for j in value_cols)
        return lower_blank or filled > len(value_cols) / 2

    def _unique(self, names: list[str]) -> list[str]:
        seen = {n.casefold() for n in names}
        counts: dict[str, int] = {}
        out: list[str] = []
        for name in names:
            key = name.casefold()
            counts[key] = counts.get(key, 0) + 1
            if counts[key] == 1:
                out.append(name)
                continue
            number = counts[key]
            unique = f"{name} ({number})"
            while unique.casefold() in seen:
                number += 1
                unique = f"{name} ({number})"
            seen.add(unique.casefold())
            out.append(unique)
            self.notes.append(f"More than one series is named “{name}”; this one is called “{unique}”.")
        return out

    def _names(self, r0: int, value_cols: list[int]) -> list[str]:
        """The header of each value column as in the file; blank headers get a place name."""
        header_rows: list[int] = []
        i = r0 - 1
        while i >= 0 and (self.codes[i] == EMPTY).all():
            i -= 1
        if i >= 0 and any(self.codes[i, j] != EMPTY for j in value_cols):
            header_rows.append(i)
            i -= 1
            if i >= 0 and self._upper_header(i, header_rows[0], value_cols):
                header_rows.insert(0, i)
                i -= 1
        titles = int((self.codes[: i + 1] != EMPTY).any(axis=1).sum()) if i >= 0 else 0
        if titles:
            self.notes.append(
                f"{titles} title or note row{'s' if titles > 1 else ''} above the header "
                f"{'were' if titles > 1 else 'was'} skipped."
            )
        upper: list[str] = []
        if len(header_rows) == 2:
            last = ""
            for j in value_cols:
                text = header_text(self.grid[header_rows[0]][j])
                last = text or last  # a label merged across columns covers those to its right
                upper.append(last)
        out: list[str] = []
        for n, j in enumerate(value_cols):
            lower = header_text(self.grid[header_rows[-1]][j]) if header_rows else ""
            top = upper[n] if upper else ""
            raw = f"{top} {lower}".strip() if top != lower else lower
            if not raw:
                raw = self.place.line(j).capitalize()
                self.notes.append(f"{raw} has no name; the series is called “{raw}”.")
            out.append(raw)
        return out

    # -- dates ----------------------------------------------------------------------------------
    def _index(self, r0: int, r1: int) -> tuple[pd.Index, np.ndarray, str | None]:
        """The index of the series, the block rows in index order (-1: inserted gap), frequency."""
        n = r1 - r0
        order = np.arange(r0, r1)
        if self.date_col < 0:
            label_col = (_content_columns(self.codes) or [0])[0]
            labels = self.codes[r0:r1, label_col] == TEXT
            where = (f"The labels in {self.place.line(label_col)} could not be read as dates"
                     if labels.sum() > n // 2 else "No dates were found")
            self.notes.append(f"{where}; observations are numbered 1 to {n}.")
            return pd.RangeIndex(1, n + 1), order, None
        axis = build_axis([self.grid[i][self.date_col] for i in range(r0, r1)])
        periods = list(axis.periods)
        where = self.place.line(self.date_col)
        if axis.kind in (None, "irregular") or any(p is None for p in periods):
            self.notes.append(
                f"The dates in {where} are not regularly spaced; observations are numbered "
                f"1 to {n} (they can still be tested by observation number)."
            )
            return pd.RangeIndex(1, n + 1), order, None
        ordinals = np.array([p.ordinal for p in periods if p is not None])
        steps = np.diff(ordinals)
        if n > 1 and (steps < 0).all():
            ordinals, order = ordinals[::-1], order[::-1]
            periods = periods[::-1]
            self.notes.append("The dates run from newest to oldest; the series are read oldest first.")
            steps = np.diff(ordinals)
        if (steps <= 0).any():
            bad = int(np.flatnonzero(steps <= 0)[0]) + 1
            self.notes.append(
                f"The dates in {where} are not in order or repeat (at row "
                f"{self.place.row(int(order[bad]), self.date_col)}); observations are numbered "
                f"1 to {n}."
            )
            return pd.RangeIndex(1, n + 1), np.arange(r0, r1), None
        freq = periods[0].freq if periods[0] is not None else None
        index = pd.PeriodIndex(periods, freq=freq)
        if axis.kind == "B":
            first, last = index[0].to_timestamp().date(), index[-1].to_timestamp().date()
            holidays = weekdays_between(first, last) - n
            if holidays > 0:
                many = holidays > 1
                self.notes.append(f"{holidays} weekday{'s' if many else ''} without data "
                                  f"(holidays) {'are' if many else 'is'} skipped.")
            return index, order, FREQUENCY_NAMES["B"]
        span = int(ordinals[-1] - ordinals[0]) + 1
        if span > n:
            full = pd.period_range(index[0], index[-1], freq=freq)
            position = {p: k for k, p in enumerate(index)}
            order = np.array([order[position[p]] if p in position else -1 for p in full])
            many = span - n > 1
            self.notes.append(
                f"{span - n} date{'s are' if many else ' is'} missing from {where}; "
                f"{'they are' if many else 'it is'} kept as {'gaps' if many else 'a gap'}."
            )
            index = full
        return index, order, FREQUENCY_NAMES.get(axis.kind or "")

    # -- one series -------------------------------------------------------------------------------
    def _series(self, j: int, raw_name: str, name: str, r0: int, r1: int, index: pd.Index,
                order: np.ndarray, freq: str | None) -> SeriesData | None:
        inserted = order < 0
        values = self.nums[np.where(inserted, 0, order), j]
        values[inserted] = math.nan
        column = self.codes[r0:r1, j]
        odd = [r0 + int(k) for k in np.flatnonzero((column == TEXT) | (column == DATE))]
        notes: list[str] = []
        if odd:
            first = odd[0]
            notes.append(
                f"{len(odd)} cell{'s' if len(odd) > 1 else ''} of “{name}” that "
                f"{'are' if len(odd) > 1 else 'is'} not a number "
                f"{'were' if len(odd) > 1 else 'was'} read as missing (first at row "
                f"{self.place.row(first, j)}: “{header_text(self.grid[first][j])[:30]}”)."
            )
        if not np.isfinite(values).any():
            self.notes.append(f"“{name}” has no values and was left out.")
            return None
        present = np.flatnonzero(np.isfinite(values))
        first_row = self.place.row(int(order[present[0]]), j)
        source = Source(self.file, self.sheet, raw_name, first_row)
        if self.labels is None or len(self.labels) != len(index):
            self.labels = [period_label(v) for v in index]
        return SeriesData.from_array(name, values, index, freq, source, tuple(notes),
                                     labels=self.labels)

    def _note_skipped(self, r0: int, r1: int, value_cols: list[int]) -> None:
        below = [r1 + int(k) for k in np.flatnonzero((self.codes[r1:] != EMPTY).any(axis=1))]
        if below:
            many = len(below) > 1
            if self.place.transposed:
                where = f"column{'s' if many else ''} right of the data"
            else:
                where = f"row{'s' if many else ''} below the data (from row {below[0] + 1})"
            self.notes.append(f"{len(below)} {where} {'were' if many else 'was'} skipped "
                              "(notes or sources).")
        content = (self.codes[r0:r1] != EMPTY).any(axis=0)
        chosen = set(value_cols)
        skipped = [j for j in range(len(self.grid[0]))
                   if j != self.date_col and j not in chosen and content[j]]
        for j in skipped:
            self.notes.append(f"{self.place.line(j).capitalize()} holds no numbers and was skipped.")


__all__ = ["build_sheet", "classify_grid"]
