"""Opening the window: ``tauscope [FILE ...]`` (the demo workbook on the very first run)."""

from __future__ import annotations

import os
import sys
from typing import TYPE_CHECKING

SHOWN_MARKER = "tauscope: window shown"  # printed when TAUSCOPE_EXIT_AFTER_SHOW=1 (start-up timing)

if TYPE_CHECKING:
    from PySide6.QtWidgets import QApplication

    from tauscope.ui.main_window import MainWindow


def build(argv: list[str]) -> tuple[QApplication, MainWindow]:
    """The application and its shown window, with FILEs (or, on the first run, the demo)
    being read in the background."""
    import tauscope.data  # noqa: F401
    from tauscope.resources_path import demo_workbook
    from tauscope.ui import store
    from tauscope.ui.appearance import apply_appearance, prepare_application
    from tauscope.ui.main_window import MainWindow

    app = prepare_application(argv)
    from tauscope.report.atomic import remove_stale_temporaries

    remove_stale_temporaries(store.data_folder())  # left by a write a crash cut off
    apply_appearance(app, str(store.get_value(store.KEY_APPEARANCE) or "system"))
    window = MainWindow()
    window.show()
    if argv:
        window.open_files(list(argv))
    elif not store.get_bool(store.KEY_FIRST_RUN) and demo_workbook() is not None:
        window.open_demo()
    store.set_value(store.KEY_FIRST_RUN, True)
    # After an abnormal exit, offer back the autosaved study once the window is up.
    from PySide6.QtCore import QTimer

    QTimer.singleShot(0, window.offer_recovery)
    if os.environ.get("TAUSCOPE_EXIT_AFTER_SHOW") != "1":
        # The statistics load in the background once the window is up (ui.worker).
        from tauscope.ui.worker import warm_up_engine

        QTimer.singleShot(0, warm_up_engine)
    return app, window


def main(argv: list[str]) -> int:
    from PySide6.QtCore import QTimer

    from tauscope.ui.appearance import dispose

    app, window = build(argv)
    if os.environ.get("TAUSCOPE_EXIT_AFTER_SHOW") == "1":

        def shown() -> None:
            print(SHOWN_MARKER, flush=True)
            window.prompts.ask_save_changes = lambda _name: "discard"  # a timing run: no question
            window.close()

        QTimer.singleShot(0, shown)
    code = int(app.exec())
    dispose(window)
    return code


if __name__ == "__main__":
    raise SystemExit(main(sys.argv[1:]))
