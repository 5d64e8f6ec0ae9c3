"""Date labels into pandas periods, and the frequency of a column of dates.

Understood forms: "1995Q1", "1995-Q1", "1995 Q1", "Q1 1995", quarters in Roman numerals
"1995-I" to "1995-IV" (and "I-1995"), "1995M01", "1995-01",
"1995/01", "01/1995", "Jan 1995", "January 1995", "Jan-95", "1995 Jan", "1995W05",
ISO dates "1995-03-31", day-first or month-first dates "31/03/1995" (the order is
decided for the whole column), "31.03.1995", years "1995" (text or whole numbers),
datetime cells, and Excel date numbers (whole numbers that, read as days since
1899-12-30, give regularly spaced dates).

Day-level dates get the coarsest frequency under which no two dates share a
period: annual, quarterly, monthly, weekly, business-day (only weekdays) or daily.
"""

from __future__ import annotations

import datetime as dt
import functools
import itertools
import re
from collections import Counter
from collections.abc import Sequence
from dataclasses import dataclass

import numpy as np
import pandas as pd

from tauscope.data.cells import Cell

FREQUENCY_NAMES = {
    "A": "annual", "Q": "quarterly", "M": "monthly", "W": "weekly", "B": "business-day",
    "D": "daily",
}
# Business-day data keep daily periods (weekdays only): pandas deprecates Period[B].
PANDAS_FREQ = {"A": "Y", "Q": "Q", "M": "M", "B": "D", "D": "D"}

MONTHS = {
    name: number
    for number, names in enumerate(
        (
            ("jan", "january", "janv", "jän", "jaen", "ene", "gen"),
            ("feb", "february", "febr", "fév", "fev", "févr"),
            ("mar", "march", "mär", "märz", "mars", "maerz"),
            ("apr", "april", "avr", "abr", "apr."),
            ("may", "mai", "mayo", "mag"),
            ("jun", "june", "juni", "juin"),
            ("jul", "july", "juli", "juil"),
            ("aug", "august", "août", "ago"),
            ("sep", "sept", "september", "set"),
            ("oct", "october", "okt", "oktober", "octobre", "ott"),
            ("nov", "november", "novembre"),
            ("dec", "december", "dez", "dezember", "déc", "dic"),
        ),
        start=1,
    )
    for name in names
}
ROMAN_QUARTERS = {"I": 1, "II": 2, "III": 3, "IV": 4}
_MONTH_WORD = r"([A-Za-zäéû]{3,9})\.?"

_PATTERNS: tuple[tuple[str, re.Pattern[str]], ...] = (
    ("Y", re.compile(r"^(\d{4})$")),
    ("Q", re.compile(r"^(\d{4})\s*[-/:.\u2013 ]?\s*[Qq]\s?([1-4])$")),
    ("Qr", re.compile(r"^[Qq]\s?([1-4])\s*[-/:.\u2013 ]?\s*(\d{4})$")),
    ("QR", re.compile(r"^(\d{4})\s*[-/:.\u2013 ]?\s*(I|II|III|IV)$", re.IGNORECASE)),
    ("QRr", re.compile(r"^(I|II|III|IV)\s*[-/:.\u2013 ]\s*(\d{4})$", re.IGNORECASE)),
    ("M", re.compile(r"^(\d{4})\s*[-/ ]?\s*[Mm](\d{1,2})$")),
    ("M", re.compile(r"^(\d{4})[-/.](\d{1,2})$")),
    ("Mr", re.compile(r"^(\d{1,2})[-/.](\d{4})$")),
    ("W", re.compile(r"^(\d{4})\s*[-/ ]?\s*[Ww](\d{1,2})$")),
    ("Nm", re.compile(r"^" + _MONTH_WORD + r"[\s\-/.]*(\d{4}|\d{2})$")),
    ("mN", re.compile(r"^(\d{4})[\s\-/.]*" + _MONTH_WORD + r"$")),
    ("ISO", re.compile(r"^(\d{4})-(\d{1,2})-(\d{1,2})(?:[ T]00:00(?::00)?)?$")),
    ("ISO", re.compile(r"^(\d{4})/(\d{1,2})/(\d{1,2})$")),
    ("S", re.compile(r"^(\d{1,2})[/.\-](\d{1,2})[/.\-](\d{4})$")),
)

# A parsed label: ("Y", year) ("Q", year, q) ("M", year, m) ("W", year, w)
# ("D", year, month, day) ("S", a, b, year) for a/b/year with unknown order.
Label = tuple[str, int, int, int]

EXCEL_EPOCH = dt.date(1899, 12, 30)
SERIAL_RANGE = (10_000, 80_000)  # 1927 to 2119


def _year(text: str) -> int:
    year = int(text)
    if len(text) == 2:  # two-digit years as the C library reads them: 69-99 → 1900s
        year += 1900 if year >= 69 else 2000
    return year


@functools.lru_cache(maxsize=1 << 16)
def parse_label(cell: Cell) -> Label | None:
    """The date a single cell stands for, without column context (remembered: the layout
    reads the same date column several times)."""
    if isinstance(cell, dt.datetime):
        return ("D", cell.year, cell.month, cell.day)
    if isinstance(cell, dt.date):
        return ("D", cell.year, cell.month, cell.day)
    if isinstance(cell, bool) or cell is None:
        return None
    if isinstance(cell, int | float):
        if float(cell).is_integer() and 1000 <= cell <= 2999:
            return ("Y", int(cell), 0, 0)
        return None
    if not isinstance(cell, str) or len(cell) > 40:
        return None
    text = cell.strip()
    for kind, pattern in _PATTERNS:
        match = pattern.match(text)
        if match:
            label = _from_match(kind, match.groups())
            if label is not None:
                return label
    return None


def _from_match(kind: str, g: Sequence[str]) -> Label | None:
    if kind == "Y":
        year = int(g[0])
        return ("Y", year, 0, 0) if 1000 <= year <= 2999 else None
    if kind == "Q":
        return ("Q", int(g[0]), int(g[1]), 0)
    if kind == "Qr":
        return ("Q", int(g[1]), int(g[0]), 0)
    if kind in ("QR", "QRr"):
        digits, numeral = (g[0], g[1]) if kind == "QR" else (g[1], g[0])
        return ("Q", int(digits), ROMAN_QUARTERS[numeral.upper()], 0)
    if kind in ("M", "Mr"):
        year, month = (int(g[0]), int(g[1])) if kind == "M" else (int(g[1]), int(g[0]))
        return ("M", year, month, 0) if 1 <= month <= 12 else None
    if kind == "W":
        week = int(g[1])
        return ("W", int(g[0]), week, 0) if 1 <= week <= 53 else None
    if kind in ("Nm", "mN"):
        word, year_text = (g[0], g[1]) if kind == "Nm" else (g[1], g[0])
        number = MONTHS.get(word.casefold())
        return ("M", _year(year_text), number, 0) if number else None
    if kind == "ISO":
        return _valid_day(int(g[0]), int(g[1]), int(g[2]))
    if kind == "S":
        return ("S", int(g[0]), int(g[1]), int(g[2]))
    return None


def _valid_day(year: int, month: int, day: int) -> Label | None:
    try:
        dt.date(year, month, day)
    except ValueError:
        return None
    return ("D", year, month, day)


@dataclass(frozen=True)
class Axis:
    """The dates of one row or column: a period (or None) per position, and the frequency.

    ``kind`` is "A", "Q", "M", "W", "B" or "D" when the dates are regular, "irregular"
    when they were understood but are not regularly spaced, or None without dates.
    """

    periods: tuple[pd.Period | None, ...]
    kind: str | None
    count: int

    @property
    def frequency(self) -> str | None:
        return FREQUENCY_NAMES.get(self.kind or "")


NO_AXIS = Axis((), None, 0)


def read_axis(cells: Sequence[Cell]) -> tuple[list[Label | None], str | None]:
    """Per-cell labels of the most common kind in ``cells`` (others None), and that kind."""
    labels = [parse_label(c) for c in cells]
    kinds = Counter(label[0] if label[0] != "S" else "D" for label in labels if label)
    serials = _excel_serials(cells)
    if serials is not None and len(serials) > sum(kinds.values()):
        return serials, "D"
    if not kinds:
        return [None] * len(cells), None
    kind = kinds.most_common(1)[0][0]
    if kind == "Y" and not _increasing_years(labels):
        return [None] * len(cells), None
    chosen: list[Label | None] = []
    day_first = _day_first(labels)
    for label in labels:
        if label is None:
            chosen.append(None)
        elif label[0] == "S":
            a, b, year = label[1], label[2], label[3]
            chosen.append(_valid_day(year, b, a) if day_first else _valid_day(year, a, b))
        else:
            chosen.append(label if label[0] == kind else None)
    return chosen, kind


def _increasing_years(labels: Sequence[Label | None]) -> bool:
    """Whole numbers count as years only in a run of 3+ values that run one way: every
    step the same direction, or (from 5 years on) at least four steps in five, so that a
    repeated or misplaced year still marks the column as dates (the reader then says
    where the order breaks) instead of making it a series."""
    years = [label[1] for label in labels if label and label[0] == "Y"]
    if len(years) < 3 and len(years) != sum(1 for label in labels if label):
        return False
    if len(years) < 2:
        return len(years) == 1
    steps = [b - a for a, b in itertools.pairwise(years)]
    if all(s > 0 for s in steps) or all(s < 0 for s in steps):
        return True
    if len(years) < 5:
        return False
    rising = sum(1 for s in steps if s > 0)
    falling = sum(1 for s in steps if s < 0)
    return max(rising, falling) >= 0.8 * len(steps) and min(rising, falling) <= 1


def _day_first(labels: Sequence[Label | None]) -> bool:
    first_big = any(label and label[0] == "S" and label[1] > 12 for label in labels)
    second_big = any(label and label[0] == "S" and label[2] > 12 for label in labels)
    return first_big or not second_big


def _excel_serials(cells: Sequence[Cell]) -> list[Label | None] | None:
    numbers = [
        (i, float(c)) for i, c in enumerate(cells)
        if isinstance(c, int | float) and not isinstance(c, bool)
    ]
    if len(numbers) < 3:
        return None
    values = [v for _, v in numbers]
    if not all(SERIAL_RANGE[0] <= v <= SERIAL_RANGE[1] and v.is_integer() for v in values):
        return None
    steps = [b - a for a, b in itertools.pairwise(values)]
    if not (all(s > 0 for s in steps) or all(s < 0 for s in steps)):
        return None
    out: list[Label | None] = [None] * len(cells)
    for i, v in numbers:
        day = EXCEL_EPOCH + dt.timedelta(days=int(v))
        out[i] = ("D", day.year, day.month, day.day)
    if _day_frequency([dt.date(x[1], x[2], x[3]) for x in out if x]) is None:
        return None
    return out


def to_period(label: Label, kind: str) -> pd.Period:
    tag, a, b, c = label
    if tag == "Y":
        return pd.Period(year=a, freq="Y")
    if tag == "Q":
        return pd.Period(year=a, quarter=b, freq="Q")
    if tag == "M":
        return pd.Period(year=a, month=b, freq="M")
    if tag == "W":
        monday = dt.date.fromisocalendar(a, b, 1) if b <= 52 or _has_week_53(a) else None
        if monday is None:
            raise ValueError("no such week")
        return pd.Period(monday, freq="W-SUN")
    day = dt.date(a, b, c)
    return pd.Period(day, freq=_period_code(kind, [day]))


def _has_week_53(year: int) -> bool:
    return dt.date(year, 12, 28).isocalendar()[1] == 53


def _period_code(kind: str, days: Sequence[dt.date]) -> str:
    if kind == "W":
        weekdays = {d.weekday() for d in days}
        names = ("MON", "TUE", "WED", "THU", "FRI", "SAT", "SUN")
        return f"W-{names[weekdays.pop()]}" if len(weekdays) == 1 else "W-SUN"
    return PANDAS_FREQ[kind]


def _day_frequency(days: Sequence[dt.date]) -> str | None:
    """The coarsest of A, Q, M, W, B, D under which the days fall in distinct, nearly
    consecutive periods (at most a quarter of the periods in between missing)."""
    if len(days) < 2:
        return None
    ordered = sorted(days)
    if len(set(ordered)) != len(ordered):
        return None
    for kind in ("A", "Q", "M", "W", "B", "D"):
        if kind == "B":
            if any(d.weekday() >= 5 for d in ordered):
                continue
            span = weekdays_between(ordered[0], ordered[-1])
            return kind if span - len(ordered) <= max(1, len(ordered) // 4) else None
        code = _period_code(kind, ordered)
        ordinals = [pd.Period(d, freq=code).ordinal for d in ordered]
        if len(set(ordinals)) != len(ordinals):
            continue
        span = ordinals[-1] - ordinals[0] + 1
        if span - len(ordinals) <= max(1, len(ordinals) // 4):
            return kind
        return None
    return None


def date_mask(cells: Sequence[Cell]) -> list[bool]:
    """Which cells of this row or column read as dates of the column's main kind."""
    labels, _ = read_axis(cells)
    return [label is not None for label in labels]


def weekdays_between(first: dt.date, last: dt.date) -> int:
    """Monday-to-Friday days from ``first`` to ``last``, both included."""
    return int(np.busday_count(first, last + dt.timedelta(days=1)))


def build_axis(cells: Sequence[Cell]) -> Axis:
    """The periods of a block of date cells and their frequency ("irregular": periods None)."""
    labels, kind = read_axis(cells)
    if kind is None:
        return NO_AXIS
    count = sum(1 for label in labels if label)
    if kind == "D":
        days = [dt.date(x[1], x[2], x[3]) for x in labels if x]
        day_kind = _day_frequency(days)
        if day_kind is None:
            return Axis(tuple(None for _ in labels), "irregular", count)
        code = _period_code(day_kind, days)
        periods = tuple(
            pd.Period(dt.date(x[1], x[2], x[3]), freq=code) if x else None for x in labels
        )
        return Axis(periods, day_kind, count)
    out: list[pd.Period | None] = []
    for label in labels:
        try:
            out.append(to_period(label, kind) if label else None)
        except ValueError:
            out.append(None)
    return Axis(tuple(out), "A" if kind == "Y" else kind, count)


def axis_score(cells: Sequence[Cell]) -> int:
    """How many cells of this row or column read as dates of one kind."""
    return sum(date_mask(cells))
