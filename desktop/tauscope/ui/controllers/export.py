"""Export: the findings on screen written through ``tauscope.report.export`` (the writers
``tauscope batch`` uses), with each series' chart in Excel, the web page and the PDF (made by
:func:`tauscope.ui.report_charts.draw_charts`, as batch makes them), written in a helper
thread while the window keeps answering (:mod:`tauscope.ui.off_thread`); and copied to the
clipboard as a table."""

from __future__ import annotations

from pathlib import Path
from typing import TYPE_CHECKING

from PySide6.QtCore import QObject
from PySide6.QtWidgets import QApplication, QLabel, QLineEdit, QTextBrowser

from tauscope.report import CHART_FORMATS
from tauscope.ui.controllers.prompts import Prompts
from tauscope.ui.controllers.session import Session
from tauscope.ui.findings_export import EXPORT_FILTERS, build_run, export_filter
from tauscope.ui.findings_panel import FindingsPanel
from tauscope.ui.series_panel import SeriesPanel

if TYPE_CHECKING:
    from tauscope.report import RunRecord


class ExportController(QObject):
    """Findings out of the window: to a file, or to the clipboard."""

    def __init__(self, series_panel: SeriesPanel, findings_panel: FindingsPanel,
                 session: Session, prompts: Prompts, status: QLabel,
                 parent: QObject | None = None) -> None:
        super().__init__(parent)
        self.series_panel = series_panel
        self.findings_panel = findings_panel
        self.session = session
        self.prompts = prompts
        self.status = status
        self.busy = False  # an export is being written

    def findings_record(self, keys: list[str] | None = None) -> RunRecord:
        """The findings on screen (all, or those of ``keys`` in row order) as a run record."""
        model = self.series_panel.model
        run = build_run(self.findings_panel.model.results(), model.series_for_key,
                        model.workbooks(), self.session.settings)
        return run if keys is None else run.select(keys)

    def export_findings(self, target: str | Path | None = None) -> bool:
        """Write every finding to ``target`` (asking where when None); charts go into Excel,
        the web page and the PDF."""
        from tauscope.report import ExportError, export
        from tauscope.ui.export_process import Written, export_elsewhere
        from tauscope.ui.findings_export import suffix_for_filter
        from tauscope.ui.off_thread import wait_off_thread

        if self.busy:  # Ctrl+E again while an export is being written: one at a time
            return False

        results = self.findings_panel.model.results()
        if not results:
            self.prompts.tell("There are no findings to export yet: analyse some series first (F5).")
            return False
        if target is None:
            study_path = self.session.study_path
            start = str(study_path.with_suffix(".xlsx")) if study_path else "findings.xlsx"
            answer = self.prompts.ask_save_path("Export findings", start, export_filter())
            if not answer:
                return False
            target = answer
        path = Path(target)
        known = {suffix for _label, suffix in EXPORT_FILTERS}
        if path.suffix.lower() not in known:
            path = path.with_name(path.name + suffix_for_filter(""))
        run = self.findings_record()
        with_charts = path.suffix.lower() in CHART_FORMATS
        lookup = self.series_panel.model.series_for_key
        series = {f.key: lookup(f.key) for f in run.findings if f.key is not None}

        def write() -> Written:
            if with_charts:  # the long writers, in the export process (none: written here)
                values = {k: s.values for k, s in series.items() if s is not None}
                done = export_elsewhere(path, run, values, with_charts)
                if done is not None:
                    return done
            # imported here, off the window's thread: loading them takes a tenth of a second
            import tauscope.ui.pdf_report  # noqa: F401  (registers the ".pdf" writer)
            from tauscope.ui.report_charts import draw_charts, problems_text

            charts, problems = None, ""
            if with_charts:  # the same charts as tauscope batch's
                drawn = draw_charts(run, series.get)
                charts, problems = drawn.charts, problems_text(drawn)
            record = export(path, run, charts)
            return Written(len(record.findings), len(record.left_out), problems)

        # Charts and writing in a helper thread (which hands the formats with charts to the
        # export process); the window keeps answering meanwhile.
        self.status.setText(f"Exporting {_count(len(run.findings))} to {path.name}…")
        self.busy = True
        try:
            written = wait_off_thread(write)
        except ExportError as exc:
            self.status.setText("")
            self.prompts.tell(str(exc), title="The findings were not exported")
            return False
        finally:
            self.busy = False
        self.status.setText(f"Exported {_count(written.findings)} to {path.name}."
                            + _left_out_text(written.left_out)
                            + (f" Not drawn: {written.problems}." if written.problems else ""))
        return True

    def copy(self) -> None:
        """Edit → Copy: the text of a focused line or reading, else the selected findings."""
        focus = QApplication.focusWidget()
        if isinstance(focus, QLineEdit | QTextBrowser):
            focus.copy()
            return
        copied = self.findings_panel.copy_selection()
        if copied is not None:
            self.status.setText(f"Copied {_count(len(copied.findings))} as a table."
                                + _left_out_text(len(copied.left_out)))
        else:
            self.status.setText("Select rows in Findings to copy them.")


def _count(findings: int) -> str:
    return "1 finding" if findings == 1 else f"{findings} findings"


def _left_out_text(left_out: int) -> str:
    """What the status line adds when findings made with earlier settings were not written."""
    if not left_out:
        return ""
    return (f" {_count(left_out).capitalize()} made with earlier settings "
            f"{'was' if left_out == 1 else 'were'} left out: run again (F5) to include "
            f"{'it' if left_out == 1 else 'them'}.")
