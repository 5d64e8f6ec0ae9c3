"""Running, stopping and failing: the analysis worker as the window drives it."""

from __future__ import annotations

import threading
from pathlib import Path

import pytest

pytest.importorskip("pytestqt")

from conftest import simulated_series, write_workbook
from tauscope.engine import analyse_series


@pytest.fixture
def long_workbook(tmp_path: Path) -> Path:
    return write_workbook(tmp_path / "long.xlsx", simulated_series(80, 200, seed=5))


HELD_AFTER = 3  # results the held-back engine delivers before it waits for a stop


@pytest.fixture
def slow_engine(monkeypatch):  # type: ignore[no-untyped-def]
    """The real engine, held back after three series until the run is asked to stop, so the
    run outlasts the test's clicks however busy the machine is (no timing involved).  The
    engine runs here, in the worker thread, one series at a time, so the first results wait
    for three series' work only: not for the start of the analysis process and its first
    chunk (most of the 30 s allowed, on a busy machine; that process has tests of its own in
    test_ui_engine_process.py)."""
    import tauscope.ui.worker as worker
    from tauscope.engine.procedure.many import iter_analyse as real

    def held(pairs, settings, should_stop):  # type: ignore[no-untyped-def]
        for number, pair in enumerate(pairs):
            if should_stop():
                return
            yield from real([pair], settings, should_stop)
            if number + 1 >= HELD_AFTER:
                gate = threading.Event()
                while not should_stop() and not gate.wait(0.005):
                    pass

    monkeypatch.setattr(worker, "iter_analyse", held)


def test_stop_ends_the_run_promptly_and_keeps_finished_results(
        main_window, open_in_window, qtbot, long_workbook, slow_engine):  # type: ignore[no-untyped-def]
    open_in_window(main_window, long_workbook)
    total = len(main_window.series_panel.model.all_series())
    # the engine's result on the first series, computed first: the one-off work of a
    # process's first analysis (the power simulation's draws, a few seconds on a busy
    # machine) is then done before the run, not inside the wait for its first results
    series = main_window.series_panel.model.all_series()[0]
    expected = analyse_series(series.testable_values(), main_window.settings, series.name)
    assert main_window.run_series(main_window.series_panel.model.all_series())
    model = main_window.findings_panel.model
    qtbot.waitUntil(lambda: model.rowCount() >= HELD_AFTER, timeout=30_000)
    main_window.stop_action.trigger()
    qtbot.waitUntil(lambda: not main_window.runner.is_running(), timeout=3_000)
    stopped, received = main_window.last_run
    assert stopped is True
    assert HELD_AFTER <= received < total
    assert model.rowCount() == received
    assert "Stopped" in main_window.status_label.text()
    # a kept result is the engine's result on the same data
    kept = model.result_for_key(series.key)
    assert kept.verdict == expected.verdict
    assert [s.statistic for s in kept.steps] == pytest.approx([s.statistic for s in expected.steps])
    assert main_window.run_action.isEnabled() and not main_window.stop_action.isEnabled()


def test_the_engine_runs_off_the_window_thread(main_window, open_in_window, run_in_window,
                                               small_workbook, monkeypatch):  # type: ignore[no-untyped-def]
    import tauscope.ui.worker as worker

    threads: set[int] = set()
    real = worker.iter_analyse

    def spy(*args, **kwargs):  # type: ignore[no-untyped-def]
        threads.add(threading.get_ident())
        yield from real(*args, **kwargs)

    monkeypatch.setattr(worker, "iter_analyse", spy)
    open_in_window(main_window, small_workbook)
    run_in_window(main_window, main_window.series_panel.model.all_series())
    assert threads and threading.main_thread().ident not in threads


def test_the_run_ends_in_a_tick_after_the_one_that_shows_its_last_results(
        main_window, open_in_window, run_in_window, small_workbook):  # type: ignore[no-untyped-def]
    """Showing results and ending the run (progress bar hidden, status line, the current
    series shown again) each cost the window's thread: not both in one turn of its loop."""
    runner = main_window.runner
    ticks = [0]
    runner._timer.timeout.connect(lambda: ticks.__setitem__(0, ticks[0] + 1))  # after each drain
    shown: list[int] = []
    ended: list[int] = []
    runner.result_ready.connect(lambda _key, _result: shown.append(ticks[0]))
    runner.finished.connect(lambda _stopped, _received: ended.append(ticks[0]))
    open_in_window(main_window, small_workbook)
    run_in_window(main_window, main_window.series_panel.model.all_series())
    assert len(shown) == len(main_window.series_panel.model.all_series()) and len(ended) == 1
    assert ended[0] > shown[-1]


def test_an_unexpected_failure_marks_one_series_shows_details_and_the_rest_finish(
        main_window, open_in_window, run_in_window, small_workbook, monkeypatch, qtbot):  # type: ignore[no-untyped-def]
    import tauscope.ui.worker as worker

    real = worker.iter_analyse

    def failing(pairs, settings, should_stop):  # type: ignore[no-untyped-def]
        for number, result in enumerate(real(pairs, settings, should_stop)):
            if number == 1:
                raise RuntimeError("simulated failure inside the engine")
            yield result

    monkeypatch.setattr(worker, "iter_analyse", failing)
    open_in_window(main_window, small_workbook)
    all_series = main_window.series_panel.model.all_series()
    run_in_window(main_window, all_series)
    results = main_window.findings_panel.model.results()
    assert len(results) == len(all_series)
    second = results[all_series[1].key]
    assert second.error is not None and "unexpected problem" in second.error
    assert "simulated failure" in second.error
    others = [results[s.key] for s in all_series if s.key != all_series[1].key]
    expected = {s.name: analyse_series(s.testable_values(), main_window.settings, s.name)
                for s in all_series[2:4]}
    for r in others:
        if r.name in expected:
            assert r.verdict == expected[r.name].verdict
    dialog = main_window.problem_dialog
    assert dialog is not None and dialog.isVisible()
    assert "RuntimeError: simulated failure" in dialog.details.toPlainText()
    dialog.copy_details()
    from PySide6.QtGui import QGuiApplication

    assert "simulated failure" in QGuiApplication.clipboard().text()
    dialog.close()
    monkeypatch.setattr(worker, "iter_analyse", real)
    run_in_window(main_window, all_series[:2])  # the window keeps working
    assert main_window.findings_panel.model.result_for_key(all_series[1].key).error is None


def test_quitting_during_a_run_exits_cleanly(main_window, open_in_window, qtbot, long_workbook,
                                            slow_engine):  # type: ignore[no-untyped-def]
    open_in_window(main_window, long_workbook)
    assert main_window.run_series(main_window.series_panel.model.all_series())
    qtbot.waitUntil(lambda: main_window.findings_panel.model.rowCount() >= 1, timeout=30_000)
    assert main_window.close()
    assert not main_window.runner.is_running()
    assert not main_window.isVisible()
    from PySide6.QtCore import QCoreApplication

    QCoreApplication.sendPostedEvents()  # queued signals from the ended worker are harmless
    QCoreApplication.processEvents()
