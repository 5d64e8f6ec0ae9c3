"""Study files from the window: save, close, reopen and get the same numbers; a changed or
moved workbook is reported; a damaged study file is one clear message and nothing else is
lost; the autosave is offered back after an abnormal exit and removed after a clean one."""

from __future__ import annotations

import json
import shutil
from pathlib import Path

import pytest

pytest.importorskip("pytestqt")

from tauscope.engine import Settings
from tauscope.report.study import autosave_path, json_clean


def findings_dicts(window) -> dict[str, dict]:  # type: ignore[no-untyped-def]
    return {key: json_clean(result.to_dict())
            for key, result in window.findings_panel.model.results().items()}


def wait_for_run(window, qtbot) -> None:  # type: ignore[no-untyped-def]
    qtbot.waitUntil(lambda: not window.runner.is_running(), timeout=60_000)


@pytest.fixture
def study_folder(tmp_path, small_workbook):  # type: ignore[no-untyped-def]
    """A folder with a copy of the small workbook (so tests may change or move it)."""
    folder = tmp_path / "project"
    folder.mkdir()
    shutil.copy(small_workbook, folder / "data.xlsx")
    return folder


def analyse_and_save(window, open_in_window, run_in_window, folder):  # type: ignore[no-untyped-def]
    open_in_window(window, folder / "data.xlsx")
    all_series = window.series_panel.model.all_series()
    window.add_transform(all_series[0].key, "log")  # a series the user made is kept too
    derived = [s for s in window.series_panel.model.all_series() if s.transform == "log"]
    window.apply_settings(Settings(lag_rule="bic", alpha=0.10))
    run_in_window(window, [*all_series[:2], *derived])
    assert window.isWindowModified()
    target = folder / "my analysis.tauscope"
    window.ask_save_path = lambda *_args: str(folder / "my analysis")  # suffix added
    assert window.save_study()
    assert target.is_file()
    assert not window.isWindowModified()
    assert window.windowTitle().startswith("my analysis")
    return target


def test_save_close_reopen_gives_identical_numbers(main_window, open_in_window, run_in_window,
                                                   study_folder, qtbot):  # type: ignore[no-untyped-def]
    window = main_window
    target = analyse_and_save(window, open_in_window, run_in_window, study_folder)
    saved = findings_dicts(window)
    assert len(saved) == 3
    window.close_all()
    window.apply_settings(Settings())
    assert window.findings_panel.model.rowCount() == 0
    assert window.open_study(target)
    wait_for_run(window, qtbot)
    assert findings_dicts(window) == saved
    assert window.settings == Settings(lag_rule="bic", alpha=0.10)
    assert any(s.transform == "log" for s in window.series_panel.model.all_series())
    assert window.message_box is None  # nothing to warn about
    assert not window.isWindowModified()
    assert window.study_path == target.resolve()


def test_a_changed_workbook_is_reported(main_window, open_in_window, run_in_window,
                                        study_folder, qtbot):  # type: ignore[no-untyped-def]
    import openpyxl

    window = main_window
    target = analyse_and_save(window, open_in_window, run_in_window, study_folder)
    book = openpyxl.load_workbook(study_folder / "data.xlsx")
    book.active.cell(row=10, column=2).value = 1234.5
    book.save(study_folder / "data.xlsx")
    window.close_all()
    assert window.open_study(target)
    wait_for_run(window, qtbot)
    text = window.message_box.text()
    assert "data.xlsx has changed" in text and "SHA-256" in text
    window.message_box.close()


def test_a_moved_workbook_is_located_and_reported(main_window, open_in_window, run_in_window,
                                                  study_folder, tmp_path, qtbot):  # type: ignore[no-untyped-def]
    window = main_window
    target = analyse_and_save(window, open_in_window, run_in_window, study_folder)
    saved = findings_dicts(window)
    elsewhere = tmp_path / "elsewhere"
    elsewhere.mkdir()
    shutil.move(study_folder / "data.xlsx", elsewhere / "data.xlsx")
    asked: list[str] = []

    def locate(title: str, _start: str, _filters: str) -> str:
        asked.append(title)
        return str(elsewhere / "data.xlsx")

    window.ask_open_path = locate
    window.close_all()
    assert window.open_study(target)
    wait_for_run(window, qtbot)
    assert asked == ["Where is data.xlsx now?"]
    assert findings_dicts(window) == saved


def test_a_damaged_study_is_one_message_and_nothing_is_lost(main_window, open_in_window,
                                                            run_in_window, study_folder):  # type: ignore[no-untyped-def]
    window = main_window
    target = analyse_and_save(window, open_in_window, run_in_window, study_folder)
    before = findings_dicts(window)
    text = target.read_text(encoding="utf-8")
    cut = study_folder / "cut.tauscope"
    cut.write_text(text[: len(text) // 2], encoding="utf-8")
    assert not window.open_study(cut)
    assert "cut.tauscope" in window.message_box.text()
    assert "cut short" in window.message_box.text()
    window.message_box.close()
    broken = study_folder / "broken.tauscope"
    broken.write_text(json.dumps({"format": "something else"}), encoding="utf-8")
    assert not window.open_study(broken)
    assert "not a Tauscope study" in window.message_box.text()
    window.message_box.close()
    assert findings_dicts(window) == before  # the open study is untouched
    assert window.study_path == target.resolve()
    assert cut.read_text(encoding="utf-8") == text[: len(text) // 2]  # input never written


def test_autosave_is_offered_back_after_a_crash_and_removed_after_a_clean_close(
        main_window, open_in_window, run_in_window, study_folder, qt_settings_dir, qtbot):  # type: ignore[no-untyped-def]
    from tauscope.ui import store
    from tauscope.ui.main_window import MainWindow

    window = main_window
    target = analyse_and_save(window, open_in_window, run_in_window, study_folder)
    saved = findings_dicts(window)
    window.apply_settings(Settings(alpha=0.01))  # an unsaved change
    written = window.autosave(wait=True)
    assert written == autosave_path(target.resolve(), store.data_folder())
    assert written.is_file()
    assert not window.studies.autosave_running()  # the one due after its run is not needed
    # The first window "crashes": it autosaves no more (left running, its autosave could write
    # the file again after the second window's clean close removed it).
    window.studies.autosave_timer.stop()
    # a second window, as after a crash: the autosave is offered and restored
    second = MainWindow()
    qtbot.addWidget(second)
    questions: list[str] = []
    second.ask_yes_no = lambda title, _text: questions.append(title) or True
    assert second.offer_recovery()
    wait_for_run(second, qtbot)
    assert questions == ["Recover unsaved work?"]
    assert second.settings == Settings(alpha=0.01)
    assert second.isWindowModified()
    assert set(findings_dicts(second)) == set(saved)
    second.close()  # a clean close discards the autosave
    assert not written.exists()
    third = MainWindow()
    qtbot.addWidget(third)
    third.ask_yes_no = lambda *_args: pytest.fail("nothing should be offered")
    assert not third.offer_recovery()
    third.close()


def test_an_autosave_written_now_stops_the_one_due_after_a_run(
        main_window, open_in_window, run_in_window, study_folder):  # type: ignore[no-untyped-def]
    window = main_window
    analyse_and_save(window, open_in_window, run_in_window, study_folder)
    window.apply_settings(Settings(alpha=0.01))  # an unsaved change
    window.studies.autosave_soon()  # as at a run's end
    assert window.studies.autosave_running()
    assert window.autosave(wait=True) is not None
    assert not window.studies.autosave_running()


def test_closing_with_unsaved_changes_asks_save_discard_or_cancel(
        main_window, open_in_window, small_workbook, study_folder, qtbot):  # type: ignore[no-untyped-def]
    from tauscope.report.study import load_study

    window = main_window
    open_in_window(window, small_workbook)
    assert window.session.modified
    asked: list[str] = []
    window.ask_save_changes = lambda name: asked.append(name) or "cancel"
    assert not window.close()  # cancel: the window stays, with its changes
    assert asked == ["Untitled study"] and window.isVisible() and window.session.modified
    target = study_folder / "kept.tauscope"
    window.ask_save_path = lambda *_args: ""  # save, but the save dialog is cancelled
    window.ask_save_changes = lambda name: asked.append(name) or "save"
    assert not window.close() and window.isVisible()
    window.ask_save_path = lambda *_args: str(target)
    assert window.close()  # saved, then closed
    assert not window.isVisible()
    assert [Path(w.path).name for w in load_study(target).workbooks] == [small_workbook.name]


def test_closing_without_changes_or_after_discarding_asks_no_more(
        main_window, open_in_window, small_workbook, qtbot):  # type: ignore[no-untyped-def]
    window = main_window
    open_in_window(window, small_workbook)
    asked: list[str] = []
    window.ask_save_changes = lambda name: asked.append(name) or "discard"
    assert window.close() and asked == ["Untitled study"]
    window.show()
    window.session.closing = False
    window.set_modified(False)
    window.ask_save_changes = lambda _name: pytest.fail("nothing to save: no question")
    assert window.close()
