"""The runs controller on its own (no main window): a run gives the engine's results, its
progress and status line, stops when asked, and an unexpected failure opens the problem
dialog while the other series finish."""

from __future__ import annotations

import pytest

pytest.importorskip("pytestqt")

from tauscope.data import read_workbook
from tauscope.engine import Settings, analyse_series
from ui_parts import build_parts, runs_controller


@pytest.fixture
def parts(qtbot, qt_settings_dir):  # type: ignore[no-untyped-def]
    return build_parts(qtbot, Settings(alpha=0.10))


@pytest.fixture
def series(small_workbook):  # type: ignore[no-untyped-def]
    """The four simulated series of the small workbook (the untestable two left out)."""
    return read_workbook(small_workbook).series()[:4]


def run_and_wait(qtbot, runs, chosen, quiet=False):  # type: ignore[no-untyped-def]
    states: list[bool] = []
    runs.running_changed.connect(states.append)
    assert runs.run_series(chosen, quiet=quiet)
    qtbot.waitUntil(lambda: not runs.is_running(), timeout=60_000)
    return states


def test_a_run_shows_the_engines_results(parts, qtbot, series):  # type: ignore[no-untyped-def]
    runs = runs_controller(parts)
    ended: list[bool] = []
    runs.ended.connect(lambda: ended.append(True))
    states = run_and_wait(qtbot, runs, series)
    assert states == [True, False]
    assert runs.last_run == (False, len(series))
    results = parts.findings_panel.model.results()
    assert list(results) == [s.key for s in series]
    for s in series:  # the engine on the same data, with the session's settings
        expected = analyse_series(s.testable_values(), Settings(alpha=0.10), s.name)
        shown = results[s.key]
        assert shown.verdict == expected.verdict
        assert [st.statistic for st in shown.steps] == pytest.approx(
            [st.statistic for st in expected.steps])
    assert parts.status.text() == f"Done: {len(series)} series analysed."
    assert parts.progress.isHidden() and parts.progress.maximum() == len(series)
    assert parts.session.modified and ended == [True]


def test_a_quiet_run_is_not_a_change_and_nothing_to_run_says_so(parts, qtbot, series):  # type: ignore[no-untyped-def]
    runs = runs_controller(parts)
    run_and_wait(qtbot, runs, series[:1], quiet=True)
    assert not parts.session.modified
    assert not runs.run_series([])
    assert parts.status.text() == "Open a workbook first (Ctrl+O), or the demo workbook."


def test_the_current_series_is_redrawn_when_its_result_comes(parts, qtbot, small_workbook):  # type: ignore[no-untyped-def]
    runs = runs_controller(parts)
    parts.series_panel.model.add_workbook(read_workbook(small_workbook))
    series = parts.series_panel.model.all_series()
    assert parts.series_panel.select_key(series[1].key)
    assert parts.current.key == series[1].key
    run_and_wait(qtbot, runs, series[:2])
    result = parts.findings_panel.model.result_for_key(series[1].key)
    assert result.verdict.label in parts.reading_panel.text()
    assert parts.chart_panel._result is result


def test_stop_keeps_the_finished_results(parts, qtbot, series, monkeypatch):  # type: ignore[no-untyped-def]
    import time

    import tauscope.ui.worker as worker

    real = worker.iter_analyse

    def slow(pairs, settings, should_stop):  # type: ignore[no-untyped-def]
        for result in real(pairs, settings, should_stop):
            time.sleep(0.2)
            yield result

    monkeypatch.setattr(worker, "iter_analyse", slow)
    runs = runs_controller(parts)
    assert runs.run_series(series)
    qtbot.waitUntil(lambda: parts.findings_panel.model.rowCount() >= 1, timeout=30_000)
    runs.stop_run()
    assert parts.status.text() == "Stopping after the series in hand…"
    qtbot.waitUntil(lambda: not runs.is_running(), timeout=10_000)
    stopped, received = runs.last_run
    assert stopped and 1 <= received < len(series)
    assert parts.findings_panel.model.rowCount() == received
    assert parts.status.text().startswith(f"Stopped: {received} of {len(series)} series")


def test_an_unexpected_failure_opens_the_problem_dialog(parts, qtbot, series, monkeypatch):  # type: ignore[no-untyped-def]
    import tauscope.ui.worker as worker

    real = worker.iter_analyse

    def failing(pairs, settings, should_stop):  # type: ignore[no-untyped-def]
        for number, result in enumerate(real(pairs, settings, should_stop)):
            if number == 0:
                raise RuntimeError("simulated failure inside the engine")
            yield result

    monkeypatch.setattr(worker, "iter_analyse", failing)
    runs = runs_controller(parts)
    run_and_wait(qtbot, runs, series)
    dialog = parts.prompts.problem_dialog
    assert dialog is not None and dialog.isVisible()
    assert "RuntimeError: simulated failure" in dialog.details.toPlainText()
    results = parts.findings_panel.model.results()
    assert len(results) == len(series)
    assert "simulated failure" in results[series[0].key].error
    assert "1 could not be tested" in parts.status.text()
    dialog.close()


def test_a_closing_window_gets_no_dialog_and_no_autosave(parts, qtbot, series, monkeypatch):  # type: ignore[no-untyped-def]
    runs = runs_controller(parts)
    ended: list[bool] = []
    runs.ended.connect(lambda: ended.append(True))
    assert runs.run_series(series[:2])
    parts.session.closing = True
    runs.stop_and_wait(30_000)
    qtbot.waitUntil(lambda: runs.last_run is not None, timeout=30_000)
    assert ended == [] and not parts.session.modified


def test_the_status_line_counts_only_the_series_of_that_run(parts, qtbot, small_workbook):  # type: ignore[no-untyped-def]
    """A run of one good series after a run with untestable ones says nothing about them."""
    everything = read_workbook(small_workbook).series()
    untestable = [s for s in everything if s.name in ("flat", "with a gap")]
    runs = runs_controller(parts)
    run_and_wait(qtbot, runs, everything)
    assert parts.status.text() == (f"Done: {len(everything)} series analysed. "
                                   f"{len(untestable)} could not be tested (see Findings).")
    run_and_wait(qtbot, runs, everything[:1])
    assert parts.status.text() == "Done: 1 series analysed."
    run_and_wait(qtbot, runs, untestable[:1])
    assert parts.status.text() == "Done: 1 series analysed. 1 could not be tested (see Findings)."
