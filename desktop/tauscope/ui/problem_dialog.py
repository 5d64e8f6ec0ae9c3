"""A dialog for something unexpected: a plain sentence, and details to copy."""

from __future__ import annotations

from PySide6.QtGui import QGuiApplication
from PySide6.QtWidgets import (
    QDialog,
    QDialogButtonBox,
    QLabel,
    QPlainTextEdit,
    QPushButton,
    QVBoxLayout,
    QWidget,
)


class ProblemDialog(QDialog):
    def __init__(self, summary: str, details: str, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.setWindowTitle("Something went wrong")
        self.summary = QLabel(summary, self)
        self.summary.setWordWrap(True)
        self.details = QPlainTextEdit(details, self)
        self.details.setReadOnly(True)
        self.details.setAccessibleName("Details of the problem")
        buttons = QDialogButtonBox(QDialogButtonBox.StandardButton.Close, self)
        copy = QPushButton("&Copy the details", self)
        buttons.addButton(copy, QDialogButtonBox.ButtonRole.ActionRole)
        copy.clicked.connect(self.copy_details)
        buttons.rejected.connect(self.reject)
        layout = QVBoxLayout(self)
        layout.addWidget(self.summary)
        layout.addWidget(self.details)
        layout.addWidget(buttons)
        self.resize(640, 360)

    def copy_details(self) -> None:
        QGuiApplication.clipboard().setText(f"{self.summary.text()}\n\n{self.details.toPlainText()}")
