"""Application set-up: style, high DPI, and the light or dark palette."""

from __future__ import annotations

from PySide6.QtCore import QEvent, Qt
from PySide6.QtGui import QColor, QGuiApplication, QPalette
from PySide6.QtWidgets import QApplication, QWidget

APPEARANCES = ("system", "light", "dark")


def prepare_application(argv: list[str]) -> QApplication:
    """The QApplication (created once), with names used by QSettings and a clean style."""
    existing = QApplication.instance()
    if isinstance(existing, QApplication):
        app = existing
    else:
        QGuiApplication.setHighDpiScaleFactorRoundingPolicy(
            Qt.HighDpiScaleFactorRoundingPolicy.PassThrough)
        app = QApplication(["tauscope", *argv])
    app.setOrganizationName("Tauscope")
    app.setApplicationName("Tauscope")
    app.setApplicationDisplayName("Tauscope")
    app.setStyle("Fusion")
    return app


def dark_palette() -> QPalette:
    palette = QPalette()
    roles = QPalette.ColorRole
    colors = {
        roles.Window: "#2b2d31", roles.WindowText: "#e6e6e6", roles.Base: "#1f2023",
        roles.AlternateBase: "#27292d", roles.ToolTipBase: "#3a3c41", roles.ToolTipText: "#f0f0f0",
        roles.Text: "#e6e6e6", roles.Button: "#34363b", roles.ButtonText: "#e6e6e6",
        roles.BrightText: "#ffffff", roles.Highlight: "#3d6fb6", roles.HighlightedText: "#ffffff",
        roles.Link: "#8ab4f8", roles.PlaceholderText: "#9a9a9a", roles.Mid: "#45474d",
        roles.Dark: "#18191b", roles.Light: "#4a4c52",
    }
    for role, color in colors.items():
        palette.setColor(role, QColor(color))
    for role in (roles.Text, roles.WindowText, roles.ButtonText):
        palette.setColor(QPalette.ColorGroup.Disabled, role, QColor("#8a8a8a"))
    return palette


def apply_appearance(app: QApplication, appearance: str) -> None:
    """"system" follows the platform's colour scheme; "light" and "dark" force one."""
    hints = app.styleHints()
    if appearance == "dark":
        app.setPalette(dark_palette())
    elif appearance == "light":
        app.setPalette(app.style().standardPalette())
    else:
        scheme = hints.colorScheme()
        app.setPalette(dark_palette() if scheme == Qt.ColorScheme.Dark
                       else app.style().standardPalette())


def dispose(widget: QWidget) -> None:
    """Delete a top-level window now, while the application still exists.

    Leaving it to interpreter shutdown lets Python and Qt tear objects down in an
    order that can crash on exit; deleting it explicitly avoids that.
    """
    import gc

    widget.close()
    widget.deleteLater()
    QApplication.sendPostedEvents(None, int(QEvent.Type.DeferredDelete))
    QApplication.processEvents()
    gc.collect()
    release_offscreen_clipboard()


def release_offscreen_clipboard() -> None:
    """On the offscreen platform (tests, snapshots) a clipboard still holding rich data
    crashes the process when Qt shuts down; nobody can paste from it there, so empty it.
    On real desktops the clipboard is left alone so a copied table survives the window."""
    if QGuiApplication.platformName() == "offscreen":
        QGuiApplication.clipboard().clear()
