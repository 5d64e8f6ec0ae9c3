"""Each series' chart for the reports: one path for the window (File → Export findings) and
``tauscope batch --out``.

:func:`draw_charts` makes, for every finding a report will hold, the chart as plain data
(``tauscope.report.chart_plan.plan_chart``: the Fitted path view, or the Data view when the
verdict implies no deterministic path or the series could not be tested, in the light
colours of paper whatever the window's palette), which ``tauscope.report.export`` draws per
format: SVG in the .html, PDF paths in the .pdf (``tauscope.report.pdf_direct``, or
QPainter vectors, :mod:`tauscope.ui.chart_paint`, when the report goes through Qt),
DrawingML shapes in the .xlsx (``tauscope.report.xlsx_chart``).  No
widget is made and nothing is drawn until a format asks, so it costs well under a
millisecond a series and needs no display.

A chart that fails is left out with one sentence in :attr:`DrawnCharts.problems`; it never
stops the other charts or the reports.
"""

from __future__ import annotations

import time
from collections.abc import Callable
from dataclasses import dataclass
from typing import TYPE_CHECKING, Protocol

from tauscope.engine.collector import collector_paused
from tauscope.report.chart_plan import ChartPlan, plan_chart
from tauscope.report.run import RunRecord

if TYPE_CHECKING:
    import pandas as pd


class ChartSource(Protocol):
    """What a chart reads of a series (a ``tauscope.data.SeriesData``): its values."""

    @property
    def values(self) -> pd.Series: ...


SeriesLookup = Callable[[str], "ChartSource | None"]


@dataclass(frozen=True)
class DrawnCharts:
    """The charts of one report: a plan per series (keyed by ``Finding.key``, else by name: a
    ``tauscope.report.Charts`` mapping), the sentences on charts that could not be made, and
    the seconds making them took."""

    charts: dict[str, ChartPlan]
    problems: tuple[str, ...]
    seconds: float


def draw_charts(run: RunRecord, series_for_key: SeriesLookup | None = None) -> DrawnCharts:
    """The chart of every finding the report of ``run`` holds (``run.current()``), keyed by
    ``Finding.key`` (by name when it has none).

    ``series_for_key``: the series a finding was made from (for the Data view of a series
    that could not be tested); without it, the values the result carries.  A chart that
    fails is left out with one sentence naming the series; the others are made.
    """
    start = time.perf_counter()
    charts: dict[str, ChartPlan] = {}
    problems: list[str] = []
    with collector_paused():  # many short-lived objects, no cycles (as a writer, report.export)
        for finding in run.current().findings:
            series = (series_for_key(finding.key) if series_for_key is not None
                      and finding.key is not None else None)
            try:
                plan = plan_chart(finding.result, series.values if series is not None else None)
            except Exception as exc:  # one bad series never stops the others
                reason = f"{type(exc).__name__}: {exc}".replace("\n", " ")
                problems.append(f"{finding.name}: its chart could not be drawn ({reason})")
                continue
            if plan is not None:
                charts[finding.key if finding.key is not None else finding.name] = plan
    return DrawnCharts(charts, tuple(problems), time.perf_counter() - start)


def problems_text(drawn: DrawnCharts) -> str:
    """The problems as one line ("" when there are none): each chart left out, and that the
    reports were written without it."""
    if not drawn.problems:
        return ""
    return "; ".join(drawn.problems) + " (left out of the reports)"
