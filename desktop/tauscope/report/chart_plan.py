"""Each series' chart for the reports as plain data: strokes and labels placed on a fixed box.

A :class:`ChartPlan` is built once per series, without Qt, from what the engine returned:
the Fitted path view (the series and the deterministic path its verdict implies, with a key
below) or, when the verdict implies no path or the series could not be tested, the Data view
(the series and, below it, its first difference with a dotted zero line), the two views the
window's Chart panel shows.  Every mark is already placed in layout units on a box of
:data:`CHART_SIZE` (the HTML report's chart width), so each format only draws it: SVG in
the .html (:mod:`.chart_svg`), PDF paths in the .pdf (:mod:`.pdf_direct`; QPainter vectors,
``tauscope.ui.chart_paint``, when the report goes through Qt) and DrawingML shapes in the
.xlsx (:mod:`.xlsx_chart`).

Axis ticks are "nice" numbers, 1, 2 or 5 times a power of ten, about five per axis
(Heckbert, 1990, "Nice numbers for graph labels", Graphics Gems); dated series have ticks on
whole years (every 1, 2, 5, 10, ... years) or, under three years, on months.  Numbers are
written as they are, never scaled by a power of ten.  Text widths are estimated from the
font size (0.62 em a character, digits in common sans-serif faces), enough to reserve
room for the tick labels.
"""

from __future__ import annotations

import math
import threading
from dataclasses import dataclass

import numpy as np
import pandas as pd

CHART_SIZE = (620.0, 300.0)
PAPER = "#ffffff"
TEXT = "#1a1a1a"
LINE = "#1f4e99"
ACCENT = "#b35900"
GRID = "#e3e3e3"
TITLE_SIZE, TICK_SIZE, KEY_SIZE = 15.0, 12.0, 12.0
CHAR_EM = 0.62
MONTHS = ("Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec")


@dataclass(frozen=True)
class Stroke:
    """A line through ``points`` (k × 2, layout units, y down); ``dash``: "", "dash" or "dot"."""

    points: np.ndarray
    color: str
    width: float
    dash: str = ""


@dataclass(frozen=True)
class Label:
    """Text whose baseline starts (``anchor`` "start"), centres ("middle") or ends ("end") at
    (``x``, ``y``)."""

    x: float
    y: float
    text: str
    size: float
    anchor: str = "middle"
    color: str = TEXT


@dataclass(frozen=True)
class ChartPlan:
    """One chart: its series' name, box size, strokes (drawn in order) and labels."""

    name: str
    width: float
    height: float
    strokes: tuple[Stroke, ...]
    labels: tuple[Label, ...]
    background: str = PAPER

    def same_as(self, other: ChartPlan) -> bool:
        """The same drawing, mark by mark."""
        return (self.name, self.width, self.height, self.labels, self.background) == (
            other.name, other.width, other.height, other.labels, other.background) and len(
            self.strokes) == len(other.strokes) and all(
            (a.color, a.width, a.dash) == (b.color, b.width, b.dash)
            and np.array_equal(a.points, b.points) for a, b in zip(self.strokes, other.strokes,
                                                                    strict=True))


def text_width(text: str, size: float) -> float:
    return len(text) * size * CHAR_EM


def nice_step(span: float, count: int = 5) -> float:
    """1, 2 or 5 times a power of ten, near ``span / count`` (Heckbert 1990)."""
    raw = span / max(count, 1)
    power = 10.0 ** math.floor(math.log10(raw))
    for factor in (1.0, 2.0, 5.0, 10.0):
        if raw <= factor * power * 1.2:
            return factor * power
    return 10.0 * power


def number_ticks(low: float, high: float, count: int = 5) -> list[tuple[float, str]]:
    """Ticks on multiples of a nice step inside [low, high], written with the step's decimals."""
    step = nice_step(high - low, count)
    decimals = max(0, -math.floor(math.log10(step) + 1e-9))
    first = math.ceil(low / step - 1e-9)
    ticks = []
    for k in range(first, math.floor(high / step + 1e-9) + 1):
        value = k * step
        text = f"{value:.{decimals}f}"
        ticks.append((value, "0" if float(text) == 0 else text))
    return ticks


_DATED_X: dict[tuple[str, bytes], tuple[np.ndarray, bool]] = {}
_DATED_X_KEPT = 64  # indexes; of at most _DATED_X_LONGEST dates each (20 MB in all at most)
_DATED_X_LONGEST = 20_000
_DATED_X_LOCK = threading.Lock()


def x_values(index: pd.Index) -> tuple[np.ndarray, bool]:
    """Decimal years for dated series, else the index's numbers (or 1, 2, ...).

    A dated index's decimal years (read-only) are kept by its dates: the series of one
    sheet share their dates, and pandas' conversion costs more than the rest of a chart."""
    if not isinstance(index, (pd.PeriodIndex, pd.DatetimeIndex)) or len(index) > _DATED_X_LONGEST:
        return _x_values(index)
    key = (str(index.dtype), index.asi8.tobytes())
    found = _DATED_X.get(key)
    if found is None:
        found = _x_values(index)
        found[0].setflags(write=False)
        with _DATED_X_LOCK:
            if len(_DATED_X) >= _DATED_X_KEPT:
                _DATED_X.pop(next(iter(_DATED_X)))
            _DATED_X[key] = found
    return found


def _x_values(index: pd.Index) -> tuple[np.ndarray, bool]:
    stamps = None
    if isinstance(index, pd.PeriodIndex):
        stamps = index.to_timestamp(how="start")
    elif isinstance(index, pd.DatetimeIndex):
        stamps = index.tz_localize(None) if index.tz is not None else index
    if stamps is not None:
        year = stamps.year.to_numpy(dtype=float)
        days = np.where(stamps.is_leap_year, 366.0, 365.0)
        return year + (stamps.day_of_year.to_numpy(dtype=float) - 1.0) / days, True
    try:
        return np.asarray(index, dtype=float), False
    except (TypeError, ValueError):
        return np.arange(1, len(index) + 1, dtype=float), False


def date_ticks(low: float, high: float) -> list[tuple[float, str]]:
    """Whole years (every 1, 2, 5, 10, ... years, at most eight ticks), or months when the
    span is under three years."""
    if high - low >= 3:
        step = next(s for s in (1, 2, 5, 10, 20, 25, 50, 100, 200, 500, 1000, 10_000)
                    if (high - low) / s <= 8)
        return [(float(y), str(y)) for y in range(math.ceil(low / step) * step,
                                                   math.floor(high) + 1, step)]
    months_span = (high - low) * 12
    step = next((s for s in (1, 2, 3, 6, 12) if months_span / s <= 8), 12)
    ticks = []
    month = math.ceil(low * 12 - 1e-6)
    month = month + (-month) % step
    while month <= high * 12 + 1e-6:
        year, m = divmod(month, 12)
        ticks.append((month / 12, f"{MONTHS[m]} {year}"))
        month += step
    return ticks


def _range(values: list[np.ndarray]) -> tuple[float, float]:
    finite = np.concatenate([v[np.isfinite(v)] for v in values])
    if finite.size == 0:
        return 0.0, 1.0
    low, high = float(finite.min()), float(finite.max())
    if high - low <= 1e-12 * max(1.0, abs(high)):
        half = max(abs(high) * 0.05, 0.5)
        return low - half, high + half
    pad = 0.03 * (high - low)
    return low - pad, high + pad


def _runs(x: np.ndarray, y: np.ndarray) -> list[np.ndarray]:
    """The stretches of finite points, each as a k × 2 array (a gap breaks the line)."""
    good = np.isfinite(x) & np.isfinite(y)
    edges = np.flatnonzero(np.diff(np.concatenate(([0], good.view(np.int8), [0]))))
    points = np.column_stack((x, y))
    return [points[a:b] for a, b in zip(edges[::2], edges[1::2], strict=True) if b - a >= 2]


@dataclass(frozen=True)
class Curve:
    x: np.ndarray
    y: np.ndarray
    color: str
    width: float
    dash: str = ""


def _y_axis(curves: list[Curve], zero_line: bool) -> tuple[float, float, list[tuple[float, str]]]:
    low, high = _range([c.y for c in curves] + ([np.zeros(1)] if zero_line else []))
    return low, high, number_ticks(low, high)


def left_room(curves: list[Curve], zero_line: bool = False) -> float:
    """The room left of a plot for its widest tick label."""
    ticks = _y_axis(curves, zero_line)[2]
    return 10 + max((text_width(t, TICK_SIZE) for _v, t in ticks), default=0.0)


def panel(top: float, bottom: float, title: str, curves: list[Curve], dated: bool,
          zero_line: bool = False, left: float | None = None,
          x_span: tuple[float, float] | None = None) -> tuple[list[Stroke], list[Label]]:
    """One plot from ``top`` to ``bottom`` of the box: its title above, grid, axes, ticks
    and labels, and its curves; ``left``: where the plot starts (plots stacked in one chart
    share it, and ``x_span``, so their x axes line up)."""
    width = CHART_SIZE[0]
    x_low, x_high = x_span if x_span is not None else _range([c.x for c in curves])
    y_low, y_high, y_ticks = _y_axis(curves, zero_line)
    x_ticks = (date_ticks if dated else number_ticks)(x_low, x_high)
    labels = [Label(width / 2, top + TITLE_SIZE + 3, title, TITLE_SIZE)]
    if left is None:
        left = left_room(curves, zero_line)
    right = width - 10 - text_width(x_ticks[-1][1], TICK_SIZE) / 2 if x_ticks else width - 10
    plot_top, plot_bottom = top + TITLE_SIZE + 13, bottom - TICK_SIZE - 8

    def sx(v: np.ndarray | float) -> np.ndarray:
        return left + (np.asarray(v, dtype=float) - x_low) / (x_high - x_low) * (right - left)

    def sy(v: np.ndarray | float) -> np.ndarray:
        return plot_bottom - (np.asarray(v, dtype=float) - y_low) / (y_high - y_low) * (
            plot_bottom - plot_top)

    strokes = []
    for value, text in x_ticks:
        x = float(sx(value))
        strokes.append(Stroke(np.array([[x, plot_top], [x, plot_bottom]]), GRID, 0.6))
        labels.append(Label(x, plot_bottom + TICK_SIZE + 4, text, TICK_SIZE))
    for value, text in y_ticks:
        y = float(sy(value))
        strokes.append(Stroke(np.array([[left, y], [right, y]]), GRID, 0.6))
        labels.append(Label(left - 5, y + TICK_SIZE * 0.36, text, TICK_SIZE, "end"))
    strokes.append(Stroke(np.array([[left, plot_top], [left, plot_bottom], [right, plot_bottom]]),
                          TEXT, 0.8))
    if zero_line:
        y = float(sy(0.0))
        strokes.append(Stroke(np.array([[left, y], [right, y]]), TEXT, 0.8, "dot"))
    for curve in curves:
        for run in _runs(sx(curve.x), sy(curve.y)):
            strokes.append(Stroke(np.round(run, 2), curve.color, curve.width, curve.dash))
    return strokes, labels


def key_row(y: float, entries: list[tuple[str, str, str]]) -> tuple[list[Stroke], list[Label]]:
    """A key centred on one line: a short line in each curve's colour and dash, its name."""
    sample, gap = 22.0, 16.0
    widths = [sample + 5 + text_width(name, KEY_SIZE) for name, _c, _d in entries]
    x = (CHART_SIZE[0] - sum(widths) - gap * (len(entries) - 1)) / 2
    strokes, labels = [], []
    for (name, color, dash), room in zip(entries, widths, strict=True):
        mid = y - KEY_SIZE * 0.36
        strokes.append(Stroke(np.array([[x, mid], [x + sample, mid]]), color, 2.0, dash))
        labels.append(Label(x + sample + 5, y, name, KEY_SIZE, "start"))
        x += room + gap
    return strokes, labels


def plan_chart(result: object, values: pd.Series | None = None) -> ChartPlan | None:
    """The report's chart of one result (a ``SeriesResult``): the Fitted path view when the
    verdict implies a deterministic path, else the Data view of ``values`` (the series it
    was made from; the result's own values when None); None when there is nothing to draw."""
    name = str(getattr(result, "name", ""))
    fitted = getattr(result, "fitted", None)
    own = getattr(result, "values", None)
    width, height = CHART_SIZE
    if getattr(result, "error", None) is None and fitted is not None and own is not None:
        x, dated = x_values(own.index)
        label = getattr(getattr(result, "verdict", None), "label", "")
        strokes, labels = panel(0, height - 34, f"{name}: {label}", [
            Curve(x, np.asarray(own, dtype=float), LINE, 1.3),
            Curve(x, np.asarray(fitted, dtype=float), ACCENT, 1.6, "dash")], dated)
        more, words = key_row(height - 10, [("series", LINE, ""),
                                            ("deterministic path", ACCENT, "dash")])
        return ChartPlan(name, width, height, (*strokes, *more), (*labels, *words))
    data = values if values is not None else own
    if data is None or len(data) < 2:
        return None
    x, dated = x_values(data.index)
    y = np.asarray(data, dtype=float)
    level, change = [Curve(x, y, LINE, 1.3)], [Curve(x[1:], np.diff(y), ACCENT, 1.1)]
    left = max(left_room(level), left_room(change, zero_line=True))
    span = _range([x])
    top_strokes, top_labels = panel(0, height / 2, name, level, dated, left=left, x_span=span)
    low_strokes, low_labels = panel(height / 2 + 4, height, "First difference", change, dated,
                                    zero_line=True, left=left, x_span=span)
    return ChartPlan(name, width, height, (*top_strokes, *low_strokes),
                     (*top_labels, *low_labels))
