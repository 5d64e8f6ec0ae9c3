"""The current series: the one the chart and the reading show, followed from the Series
and the Findings panels."""

from __future__ import annotations

from tauscope.ui.charts.panel import ChartPanel
from tauscope.ui.findings_panel import FindingsPanel
from tauscope.ui.reading_panel import ReadingPanel
from tauscope.ui.series_panel import SeriesPanel


class CurrentSeries:
    """Keeps the chart and the reading on one series key ("" for none)."""

    def __init__(self, series_panel: SeriesPanel, findings_panel: FindingsPanel,
                 chart_panel: ChartPanel, reading_panel: ReadingPanel) -> None:
        self.series_panel = series_panel
        self.findings_panel = findings_panel
        self.chart_panel = chart_panel
        self.reading_panel = reading_panel
        self.key = ""

    def show(self, key: str) -> None:
        """Show this series (and its result, if any) in the chart and the reading."""
        self.key = key
        series = self.series_panel.model.series_for_key(key) if key else None
        result = self.findings_panel.model.result_for_key(key) if key else None
        if series is None and result is None:
            self.chart_panel.show_nothing()
            self.reading_panel.display(None, None)
            return
        self.chart_panel.display(series, result)
        self.reading_panel.display(series, result)

    def follow_series_panel(self, key: str) -> None:
        """The Series panel's current row changed: show it, and find it in the Findings."""
        if key:
            self.show(key)
            self.findings_panel.select_key(key)

    def follow_findings_panel(self, key: str) -> None:
        if key and key != self.key:
            self.show(key)
