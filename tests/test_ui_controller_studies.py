"""The studies controller with the files and runs controllers, without the main window:
save and reopen to the same numbers, a missing workbook located, a damaged study one
message, and the autosave written, offered back and discarded."""

from __future__ import annotations

import shutil

import pytest

pytest.importorskip("pytestqt")

from tauscope.engine import Settings
from tauscope.report.study import autosave_path, json_clean
from ui_parts import build_parts, files_controller, open_and_wait, runs_controller


def studies_controller(parts):  # type: ignore[no-untyped-def]
    from tauscope.ui.controllers.studies import StudiesController

    files, runs = files_controller(parts), runs_controller(parts)
    return StudiesController(parts.series_panel, parts.findings_panel, parts.session,
                             parts.prompts, parts.status, files, runs, parts.host)


def findings(parts) -> dict[str, dict]:  # type: ignore[no-untyped-def]
    return {k: json_clean(r.to_dict()) for k, r in parts.findings_panel.model.results().items()}


@pytest.fixture
def saved(qtbot, qt_settings_dir, small_workbook, tmp_path):  # type: ignore[no-untyped-def]
    """A study of two analysed series (one with its gap cut), saved through the dialog."""
    folder = tmp_path / "project"
    folder.mkdir()
    shutil.copy(small_workbook, folder / "data.xlsx")
    parts = build_parts(qtbot, Settings(lag_rule="bic"))
    studies = studies_controller(parts)
    open_and_wait(qtbot, studies.files, folder / "data.xlsx")
    model = parts.series_panel.model
    gappy = next(s for s in model.all_series() if s.name == "with a gap")
    studies.files.mend_gaps(gappy.key, "cut")
    chosen = [model.all_series()[0], model.series_for_key(gappy.key)]
    assert studies.runs.run_series(chosen)
    qtbot.waitUntil(lambda: not studies.runs.is_running(), timeout=60_000)
    titles: list[str] = []
    parts.prompts.ask_save_path = lambda title, _start, _f: titles.append(title) or str(
        folder / "mine")
    assert studies.save_study()
    assert titles == ["Save study as"]
    target = folder / "mine.tauscope"
    assert parts.session.study_path == target.resolve() and not parts.session.modified
    return parts, studies, target


def test_save_and_reopen_gives_the_same_numbers(saved, qtbot):  # type: ignore[no-untyped-def]
    parts, studies, target = saved
    before = findings(parts)
    studies.files.close_all()
    parts.session.set_settings(Settings())
    assert studies.open_study(target)
    qtbot.waitUntil(lambda: not studies.runs.is_running(), timeout=60_000)
    assert findings(parts) == before
    assert parts.session.settings == Settings(lag_rule="bic")
    assert list(parts.session.gap_handling.values()) == ["longest"]
    assert parts.prompts.message_box is None and not parts.session.modified
    assert parts.status.text().startswith("Done: 2 series")


def test_a_moved_workbook_is_located(saved, qtbot, tmp_path):  # type: ignore[no-untyped-def]
    parts, studies, target = saved
    before = findings(parts)
    elsewhere = tmp_path / "elsewhere"
    elsewhere.mkdir()
    shutil.move(target.parent / "data.xlsx", elsewhere / "data.xlsx")
    asked: list[str] = []
    parts.prompts.ask_open_path = lambda title, _s, _f: asked.append(title) or str(
        elsewhere / "data.xlsx")
    assert studies.open_study(target)
    qtbot.waitUntil(lambda: not studies.runs.is_running(), timeout=60_000)
    assert asked == ["Where is data.xlsx now?"]
    assert findings(parts) == before


def test_a_damaged_study_is_one_message_and_nothing_changes(saved):  # type: ignore[no-untyped-def]
    parts, studies, target = saved
    before = findings(parts)
    text = target.read_text(encoding="utf-8")
    cut = target.with_name("cut.tauscope")
    cut.write_text(text[: len(text) // 3], encoding="utf-8")
    assert not studies.open_study(cut)
    message = parts.prompts.message_box.text()
    assert "cut.tauscope" in message and "cut short" in message
    assert findings(parts) == before and parts.session.study_path == target.resolve()
    parts.prompts.message_box.close()


def test_autosave_is_written_offered_back_and_discarded(saved, qtbot):  # type: ignore[no-untyped-def]
    from tauscope.ui import store

    parts, studies, target = saved
    assert studies.autosave(wait=True) is None  # nothing unsaved, nothing written
    parts.session.set_settings(Settings(alpha=0.01))
    parts.session.set_modified(True)
    written = studies.autosave(wait=True)
    assert written == autosave_path(target.resolve(), store.data_folder())
    assert written.is_file()
    second = build_parts(qtbot)
    again = studies_controller(second)
    questions: list[str] = []
    second.prompts.ask_yes_no = lambda title, _text: questions.append(title) or True
    assert again.offer_recovery()
    qtbot.waitUntil(lambda: not again.runs.is_running(), timeout=60_000)
    assert questions == ["Recover unsaved work?"]
    assert second.session.settings == Settings(alpha=0.01) and second.session.modified
    assert set(findings(second)) == set(findings(parts))
    again.close()  # a clean close: nothing to recover next time
    assert not written.exists()
    third = studies_controller(build_parts(qtbot))
    assert not third.offer_recovery()


def test_the_autosave_after_a_run_comes_in_a_turn_of_its_own(
        qtbot, qt_settings_dir, small_workbook):  # type: ignore[no-untyped-def]
    """A run that changes the study asks for an autosave, written a moment after the run's
    end (not in the same turn of the event loop as the run's last results and its end)."""
    from tauscope.ui import store

    parts = build_parts(qtbot)
    studies = studies_controller(parts)
    open_and_wait(qtbot, studies.files, small_workbook)
    ended: list[bool] = []
    studies.runs.ended.connect(lambda: ended.append(studies.autosave_running()))
    target = autosave_path(None, store.data_folder())
    assert studies.runs.run_series(parts.series_panel.model.all_series()[:2])
    qtbot.waitUntil(lambda: not studies.runs.is_running(), timeout=60_000)
    assert ended == [True] and parts.session.modified  # due at the end, not yet written
    qtbot.waitUntil(lambda: not studies.autosave_running(), timeout=10_000)
    assert target.is_file()


def test_the_study_is_made_and_written_off_the_windows_thread(saved, monkeypatch):  # type: ignore[no-untyped-def]
    """Saving makes the findings' JSON in a helper thread (seconds with a thousand findings),
    the window's event loop running meanwhile; the file is whole when save returns."""
    import threading

    import tauscope.report.study as study_module

    parts, studies, target = saved
    threads: list[str] = []
    original = study_module.save_study

    def recording(path, study):  # type: ignore[no-untyped-def]
        threads.append(threading.current_thread().name)
        return original(path, study)

    monkeypatch.setattr(study_module, "save_study", recording)
    parts.session.set_modified(True)
    assert studies.save_study()
    assert threads and threads[0] != threading.main_thread().name
    assert target.is_file() and not parts.session.modified
    assert parts.status.text().startswith("Saved the study")
