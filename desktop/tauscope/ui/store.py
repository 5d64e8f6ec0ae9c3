"""What the window remembers between sessions (QSettings, INI format).

Everything goes through :func:`app_settings`, so tests can point
``QSettings.setPath(IniFormat, UserScope, tmp)`` at a temporary folder and
never touch the user's own settings.
"""

from __future__ import annotations

import json
from pathlib import Path

from PySide6.QtCore import QSettings

from tauscope.engine import Settings

ORGANISATION = "Tauscope"
APPLICATION = "Tauscope"
MAX_RECENT = 8

KEY_SETTINGS = "analysis/settings"
KEY_RECENT = "files/recent"
KEY_GEOMETRY = "window/geometry"
KEY_STATE = "window/state"
KEY_SPLITTERS = "window/panels"  # ("window/splitters" held the earlier layout's)
KEY_COLUMNS = "window/columns"  # the header states of the series and findings trees
KEY_FIRST_RUN = "window/first_run_done"
KEY_APPEARANCE = "window/appearance"
KEY_LAST_STUDY = "studies/last"
KEY_STUDY_FOLDER = "studies/folder"


def app_settings() -> QSettings:
    return QSettings(QSettings.Format.IniFormat, QSettings.Scope.UserScope, ORGANISATION, APPLICATION)


def data_folder() -> Path:
    """Where Tauscope keeps its own files (the autosave of a study never saved): the
    folder of the settings file, created when missing."""
    folder = Path(app_settings().fileName()).parent
    folder.mkdir(parents=True, exist_ok=True)
    return folder


def load_settings() -> Settings:
    """The remembered testing settings; the defaults when none or unreadable."""
    raw = app_settings().value(KEY_SETTINGS, "")
    if not raw:
        return Settings()
    try:
        data = json.loads(str(raw))
        return Settings.from_dict(data) if isinstance(data, dict) else Settings()
    except (ValueError, TypeError):
        return Settings()


def save_settings(settings: Settings) -> None:
    store = app_settings()
    store.setValue(KEY_SETTINGS, json.dumps(settings.to_dict()))
    store.sync()


def recent_files() -> list[str]:
    value = app_settings().value(KEY_RECENT, [])
    if isinstance(value, str):
        return [value] if value else []
    if not isinstance(value, list | tuple):
        return []
    return [str(v) for v in value][:MAX_RECENT]


def add_recent_file(path: Path | str) -> list[str]:
    text = str(Path(path).resolve())
    files = [text] + [f for f in recent_files() if f != text]
    files = files[:MAX_RECENT]
    store = app_settings()
    store.setValue(KEY_RECENT, files)
    store.sync()
    return files


def clear_recent_files() -> None:
    store = app_settings()
    store.setValue(KEY_RECENT, [])
    store.sync()


def get_bool(key: str, default: bool = False) -> bool:
    value = app_settings().value(key, default)
    if isinstance(value, str):
        return value.lower() in ("true", "1", "yes")
    return bool(value)


def set_value(key: str, value: object) -> None:
    store = app_settings()
    store.setValue(key, value)
    store.sync()


def get_value(key: str) -> object:
    return app_settings().value(key)
