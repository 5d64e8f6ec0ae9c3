"""``tauscope`` and ``tauscope snapshot``, and where the bundled resources are found."""

from __future__ import annotations

import os
import subprocess
import sys
from pathlib import Path

import pytest

pytest.importorskip("pytestqt")

from tauscope import resources_path


def run_cli(*args: str, home: Path) -> subprocess.CompletedProcess[str]:
    env = {**os.environ, "QT_QPA_PLATFORM": "offscreen", "HOME": str(home),
           "XDG_CONFIG_HOME": str(home / ".config")}
    return subprocess.run([sys.executable, "-m", "tauscope", *args], capture_output=True,
                          text=True, env=env, timeout=300, check=False)


def test_snapshot_writes_a_picture_of_the_whole_window(small_workbook, tmp_path):  # type: ignore[no-untyped-def]
    from PySide6.QtGui import QImage

    out = tmp_path / "shot.png"
    done = run_cli("snapshot", str(small_workbook), "--out", str(out), home=tmp_path)
    assert done.returncode == 0, done.stderr
    assert "Fatal" not in done.stderr and "Traceback" not in done.stderr
    image = QImage(str(out))
    assert (image.width(), image.height()) == (1280, 800)
    assert not (tmp_path / ".config" / "Tauscope").exists()  # the user's settings are untouched


def test_snapshot_at_a_given_size_and_view(small_workbook, tmp_path):  # type: ignore[no-untyped-def]
    from PySide6.QtGui import QImage

    out = tmp_path / "wide.png"
    done = run_cli("snapshot", str(small_workbook), "--out", str(out), "--size", "1920x1080",
                   "--chart", "null", home=tmp_path)
    assert done.returncode == 0, done.stderr
    image = QImage(str(out))
    assert (image.width(), image.height()) == (1920, 1080)
    for wrong in ("1920", "10x10", "wide"):
        refused = run_cli("snapshot", "--out", str(tmp_path / "z.png"), "--size", wrong,
                          home=tmp_path)
        assert refused.returncode == 2 and "size" in refused.stderr
        assert "Traceback" not in refused.stderr


def test_snapshot_usage_and_unreadable_input(tmp_path):  # type: ignore[no-untyped-def]
    missing = run_cli("snapshot", str(tmp_path / "nope.xlsx"), "--out", str(tmp_path / "x.png"),
                      home=tmp_path)
    assert missing.returncode == 3 and "nope.xlsx" in missing.stderr
    assert "Traceback" not in missing.stderr
    no_out = run_cli("snapshot", home=tmp_path)
    assert no_out.returncode == 2 and "--out" in no_out.stderr
    broken = tmp_path / "broken.xlsx"
    broken.write_bytes(b"this is not a workbook")
    unreadable = run_cli("snapshot", str(broken), "--out", str(tmp_path / "y.png"), home=tmp_path)
    assert unreadable.returncode == 3 and "broken.xlsx" in unreadable.stderr
    assert "Traceback" not in unreadable.stderr


def test_demo_workbook_is_found_in_a_checkout_and_in_a_frozen_bundle(tmp_path, monkeypatch):  # type: ignore[no-untyped-def]
    checkout = Path(__file__).resolve().parents[1] / "resources" / "demo" / "harbourline_demo.xlsx"
    if checkout.is_file():
        assert resources_path.demo_workbook() == checkout
    bundled = tmp_path / "resources" / "demo" / "harbourline_demo.xlsx"
    bundled.parent.mkdir(parents=True)
    bundled.write_bytes(b"")
    monkeypatch.setattr(sys, "_MEIPASS", str(tmp_path), raising=False)
    assert resources_path.demo_workbook() == bundled
    assert resources_path.resource_path("demo", "no-such-file") is None


def test_first_run_opens_the_demo_later_runs_open_what_is_asked(qtbot, qt_settings_dir,
                                                                small_workbook):  # type: ignore[no-untyped-def]
    from tauscope.commands import window as command

    if resources_path.demo_workbook() is None:
        pytest.skip("the demo workbook is not in this checkout")
    _, first = command.build([])
    qtbot.addWidget(first)
    qtbot.waitUntil(lambda: first.loader.pending == 0, timeout=30_000)
    assert [Path(p).name for p in first.series_panel.model.workbook_paths()] == [
        "harbourline_demo.xlsx"]
    first.close()
    _, second = command.build([])
    qtbot.addWidget(second)
    qtbot.waitUntil(lambda: second.loader.pending == 0, timeout=30_000)
    assert second.series_panel.model.workbook_paths() == []
    second.close()
    _, third = command.build([str(small_workbook)])
    qtbot.addWidget(third)
    qtbot.waitUntil(lambda: third.loader.pending == 0, timeout=30_000)
    assert third.series_panel.model.workbook_paths() == [str(small_workbook.resolve())]
    third.close()


def test_the_window_command_starts_shows_and_quits_cleanly(tmp_path, small_workbook):  # type: ignore[no-untyped-def]
    import tauscope.commands.window as command

    env_home = tmp_path / "home"
    env_home.mkdir()
    env = {**os.environ, "QT_QPA_PLATFORM": "offscreen", "HOME": str(env_home),
           "XDG_CONFIG_HOME": str(env_home / ".config"), "TAUSCOPE_EXIT_AFTER_SHOW": "1"}
    done = subprocess.run([sys.executable, "-m", "tauscope", str(small_workbook)],
                          capture_output=True, text=True, env=env, timeout=300, check=False)
    assert done.returncode == 0, done.stderr
    assert command.SHOWN_MARKER in done.stdout
    assert "Traceback" not in done.stderr and "Fatal" not in done.stderr
