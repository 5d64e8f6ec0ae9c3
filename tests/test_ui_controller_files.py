"""The files controller on its own (no main window): workbooks read in the background,
studies handed on, bad files as one message, drag-and-drop, transformed copies and gaps."""

from __future__ import annotations

import pytest

pytest.importorskip("pytestqt")

from tauscope.data import read_workbook
from tauscope.data.notes import reader_notes
from ui_parts import build_parts, files_controller, open_and_wait


@pytest.fixture
def parts(qtbot, qt_settings_dir):  # type: ignore[no-untyped-def]
    return build_parts(qtbot)


def test_a_workbook_is_read_and_its_first_series_shown(parts, qtbot, small_workbook):  # type: ignore[no-untyped-def]
    files = files_controller(parts)
    open_and_wait(qtbot, files, small_workbook)
    expected = read_workbook(small_workbook).series()
    shown = parts.series_panel.model.all_series()
    assert [s.name for s in shown] == [s.name for s in expected]
    assert parts.status.text().startswith(f"Opened small.xlsx: {len(expected)} series — ")
    assert "Read 1 sheet (cached values only)." in parts.status.text()  # the reader's notes
    assert parts.status.toolTip() == reader_notes(read_workbook(small_workbook))
    assert parts.session.modified
    assert parts.current.key == expected[0].key
    from tauscope.ui import store

    assert store.recent_files()[0] == str(small_workbook.resolve())


def test_an_opened_workbook_is_kept_out_of_full_garbage_collections(
        parts, qtbot, small_workbook):  # type: ignore[no-untyped-def]
    """Its series stay while it is open: frozen (``gc.freeze``), a full collection does not
    walk them again from the window's thread."""
    import gc

    files = files_controller(parts)
    open_and_wait(qtbot, files, small_workbook)
    shown = parts.series_panel.model.all_series()
    assert shown and all(gc.is_tracked(s) for s in shown)
    collected = {id(o) for o in gc.get_objects()}  # the generations a collection walks
    assert not any(id(s) in collected for s in shown)
    assert not any(id(s.values) in collected for s in shown)


def test_choose_files_opens_what_the_dialog_answers(parts, qtbot, small_workbook):  # type: ignore[no-untyped-def]
    files = files_controller(parts)
    asked: list[str] = []
    parts.prompts.ask_open_paths = lambda title, _start, _filters: asked.append(title) or [
        str(small_workbook)]
    files.choose_files()
    qtbot.waitUntil(lambda: files.loader.pending == 0, timeout=30_000)
    assert asked == ["Open workbooks"]
    assert parts.series_panel.model.workbook_paths() == [str(small_workbook.resolve())]


def test_a_study_file_is_handed_on_not_read(parts, tmp_path):  # type: ignore[no-untyped-def]
    files = files_controller(parts)
    study = tmp_path / "mine.tauscope"
    requested: list[str] = []
    files.study_requested.connect(requested.append)
    files.open_files([study])
    assert requested == [str(study.resolve())]
    assert files.loader.pending == 0


def test_an_unreadable_file_is_one_message_naming_it(parts, qtbot, tmp_path):  # type: ignore[no-untyped-def]
    files = files_controller(parts)
    broken = tmp_path / "broken.xlsx"
    broken.write_bytes(b"this is not a workbook")
    files.open_files([broken])
    qtbot.waitUntil(lambda: files.loader.pending == 0, timeout=30_000)
    assert parts.prompts.message_box is not None
    assert "broken.xlsx" in parts.prompts.message_box.text()
    assert parts.status.text() == parts.prompts.message_box.text()
    assert parts.prompts.problem_dialog is None
    assert parts.series_panel.model.workbook_paths() == []
    assert broken.read_bytes() == b"this is not a workbook"  # input never written
    parts.prompts.message_box.close()


def test_dropping_files_opens_workbooks_only(parts, qtbot, small_workbook, tmp_path):  # type: ignore[no-untyped-def]
    from PySide6.QtCore import QMimeData, QPoint, QPointF, Qt, QUrl
    from PySide6.QtGui import QDragEnterEvent, QDropEvent
    from PySide6.QtWidgets import QApplication

    files = files_controller(parts)
    files.accept_drops_on(parts.host)
    assert parts.host.acceptDrops()
    other = tmp_path / "notes.docx"
    other.write_text("x")

    def mime(*paths):  # type: ignore[no-untyped-def]
        data = QMimeData()
        data.setUrls([QUrl.fromLocalFile(str(p)) for p in paths])
        return data

    copy, left = Qt.DropAction.CopyAction, Qt.MouseButton.LeftButton
    none = Qt.KeyboardModifier.NoModifier
    only_other = mime(other)  # (kept: an event does not own its data)
    refused = QDragEnterEvent(QPoint(5, 5), copy, only_other, left, none)
    QApplication.sendEvent(parts.host, refused)
    assert not refused.isAccepted()
    both = mime(small_workbook, other)
    accepted = QDragEnterEvent(QPoint(5, 5), copy, both, left, none)
    QApplication.sendEvent(parts.host, accepted)
    assert accepted.isAccepted()
    drop = QDropEvent(QPointF(5, 5), copy, both, left, none)
    QApplication.sendEvent(parts.host, drop)
    assert drop.isAccepted()
    qtbot.waitUntil(lambda: files.loader.pending == 0, timeout=30_000)
    assert parts.series_panel.model.workbook_paths() == [str(small_workbook.resolve())]


def test_transformed_copies_and_mended_gaps(parts, qtbot, small_workbook):  # type: ignore[no-untyped-def]
    import numpy as np

    files = files_controller(parts)
    open_and_wait(qtbot, files, small_workbook)
    model = parts.series_panel.model
    first = model.all_series()[0]
    files.add_transform(first.key, "log")
    logged = [s for s in model.all_series() if s.transform == "log"]
    assert len(logged) == 1
    assert np.allclose(logged[0].values, np.log(first.values))  # numpy is the reference
    assert parts.current.key == logged[0].key
    gappy = next(s for s in model.all_series() if s.name == "with a gap")
    files.mend_gaps(gappy.key, "cut")
    assert parts.session.gap_handling == {gappy.key: "longest"}
    mended = model.series_for_key(gappy.key)
    assert not mended.gaps and len(mended.values) < len(gappy.values)
    assert "cut to its longest stretch" in parts.status.text()
    files.close_all()
    assert model.all_series() == [] and parts.session.gap_handling == {}
    assert parts.current.key == ""


def test_the_recent_menu_lists_opened_workbooks(parts, qtbot, small_workbook):  # type: ignore[no-untyped-def]
    from PySide6.QtWidgets import QMenu

    files = files_controller(parts)
    menu = QMenu(parts.host)
    files.fill_recent_menu(menu)
    assert [a.text() for a in menu.actions()] == ["No recent workbooks"]
    open_and_wait(qtbot, files, small_workbook)
    files.fill_recent_menu(menu)
    texts = [a.text() for a in menu.actions()]
    assert texts[0] == "&1 small.xlsx" and texts[-1] == "Clear the list"


def test_the_edits_of_the_series_list_undo_and_redo(parts, qtbot, small_workbook):  # type: ignore[no-untyped-def]
    files = files_controller(parts)
    open_and_wait(qtbot, files, small_workbook)
    model = parts.series_panel.model
    read = [s.key for s in model.all_series()]
    first, gappy = model.all_series()[0], next(s for s in model.all_series() if s.name == "with a gap")
    files.add_transform(first.key, "log")
    logged = next(s for s in model.all_series() if s.transform == "log")
    files.add_transform(logged.key, "diff")  # a copy of the copy
    made = [s.key for s in model.all_series()]
    assert len(made) == len(read) + 2
    files.remove_transform(logged.key)  # takes the copy made from it along
    assert [s.key for s in model.all_series()] == read
    files.undo_stack.undo()
    assert [s.key for s in model.all_series()] == made  # both back, in their places
    files.undo_stack.undo()
    files.undo_stack.undo()
    assert [s.key for s in model.all_series()] == read
    files.undo_stack.redo()
    assert [s.key for s in model.all_series()] == [*read[:1], logged.key, *read[1:]]
    files.remove_transform(first.key)  # a series as read is not removed
    assert model.series_for_key(first.key) is first
    files.mend_gaps(gappy.key, "fill")
    assert parts.session.gap_handling == {gappy.key: "interpolate"}
    assert not model.series_for_key(gappy.key).gaps
    files.undo_stack.undo()
    assert parts.session.gap_handling == {} and model.series_for_key(gappy.key) is gappy
    files.undo_stack.redo()
    assert parts.session.gap_handling == {gappy.key: "interpolate"}
    files.close_all()
    assert not files.undo_stack.canUndo()
