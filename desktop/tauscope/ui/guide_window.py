"""The guide window: the built-in guide in a browser that jumps to a section."""

from __future__ import annotations

from PySide6.QtWidgets import QDialog, QTextBrowser, QVBoxLayout, QWidget

from tauscope.ui.guide_text import ANCHORS, guide_html


class GuideWindow(QDialog):
    def __init__(self, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.setWindowTitle("Tauscope guide")
        self.browser = QTextBrowser(self)
        self.browser.setOpenExternalLinks(False)
        self.browser.setAccessibleName("Guide")
        self.browser.setHtml(guide_html())
        layout = QVBoxLayout(self)
        layout.addWidget(self.browser)
        self.resize(760, 640)

    def show_section(self, anchor: str) -> None:
        """Open the guide at a section (the top when the anchor is unknown)."""
        if anchor in ANCHORS:
            self.browser.scrollToAnchor(anchor)
        else:
            self.browser.verticalScrollBar().setValue(0)
        self.show()
        self.raise_()
        self.activateWindow()
