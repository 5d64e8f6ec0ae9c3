"""The Reading panel: the engine's plain-language notes for one series,
verdict first and cautions after.  The window writes no statistics of its own."""

from __future__ import annotations

import html
from typing import TYPE_CHECKING

from PySide6.QtCore import QUrl, Signal
from PySide6.QtWidgets import QTextBrowser, QVBoxLayout, QWidget

from tauscope.engine import SeriesResult

if TYPE_CHECKING:
    from tauscope.data import SeriesData


def _e(text: str) -> str:
    return html.escape(text, quote=False)


def reading_html(series: SeriesData | None, result: SeriesResult | None) -> str:
    """The note as HTML: heading, verdict, then cautions as a list, then a guide link."""
    if series is None and result is None:
        return ("<p>Pick a series in the Series panel, then press <b>F5</b> to analyse the "
                "selected series. The plain-language reading of the result appears here.</p>")
    name = result.name if result is not None else (series.name if series is not None else "")
    parts = [f"<h3 style='margin-bottom:2px'>{_e(name)}</h3>"]
    if result is None:
        assert series is not None
        parts.append(f"<p>{series.nobs} observations, {_e(series.span[0])} to "
                     f"{_e(series.span[1])}{', ' + _e(series.frequency) if series.frequency else ''}."
                     " Not analysed yet: press <b>F5</b>.</p>")
        notes = list(series.notes)
        if notes:
            parts.append("<p><b>From reading the file</b></p><ul>"
                         + "".join(f"<li>{_e(n)}</li>" for n in notes) + "</ul>")
        return "".join(parts)
    if result.error is not None:
        parts.append(f"<p><b>Not tested.</b> {_e(result.error)}</p>")
        return "".join(parts)
    parts.append(f"<p style='margin-top:2px'><b>{_e(result.verdict.label)}</b></p>")
    notes = list(result.notes)
    if notes:
        parts.append(f"<p>{_e(notes[0])}</p>")
    if len(notes) > 1:
        parts.append("<p style='margin-bottom:0'><b>What to keep in mind</b></p><ul>"
                     + "".join(f"<li>{_e(n)}</li>" for n in notes[1:]) + "</ul>")
    parts.append("<p><a href='guide:verdicts'>How to read a verdict</a> · "
                 "<a href='guide:sequence'>How the testing sequence works</a></p>")
    return "".join(parts)


class ReadingPanel(QWidget):
    guide_requested = Signal(str)

    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.browser = QTextBrowser(self)
        self.browser.setOpenLinks(False)
        self.browser.setAccessibleName("Reading")
        self.browser.setAccessibleDescription("Plain-language reading of the selected series")
        self.browser.anchorClicked.connect(self._link)
        layout = QVBoxLayout(self)
        layout.setContentsMargins(0, 0, 0, 0)
        layout.addWidget(self.browser)
        self.setFocusProxy(self.browser)
        self.display(None, None)

    def display(self, series: SeriesData | None, result: SeriesResult | None) -> None:
        self.browser.setHtml(reading_html(series, result))

    def text(self) -> str:
        return self.browser.toPlainText()

    def _link(self, url: QUrl) -> None:
        if url.scheme() == "guide":
            self.guide_requested.emit(url.path())
