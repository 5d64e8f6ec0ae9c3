"""The dialog for the testing choices; each option has a one-line explanation."""

from __future__ import annotations

from PySide6.QtWidgets import (
    QCheckBox,
    QComboBox,
    QDialog,
    QDialogButtonBox,
    QFormLayout,
    QLabel,
    QSpinBox,
    QVBoxLayout,
    QWidget,
)

from tauscope.engine import LAG_RULE_LABELS, LAG_RULES, Settings

ALPHAS = ((0.01, "1%"), (0.05, "5%"), (0.10, "10%"))
AUTOMATIC = -1


def _explain(text: str) -> QLabel:
    label = QLabel(text)
    label.setWordWrap(True)
    label.setEnabled(False)  # drawn in the palette's muted text colour
    return label


class SettingsDialog(QDialog):
    """Edits a Settings; ``settings()`` returns the choice when accepted."""

    def __init__(self, settings: Settings, parent: QWidget | None = None) -> None:
        super().__init__(parent)
        self.setWindowTitle("Testing settings")
        self.setAccessibleName("Testing settings")
        self.alpha = QComboBox(self)
        for value, label in ALPHAS:
            self.alpha.addItem(label, value)
        self.alpha.setAccessibleName("Significance level")
        self.lag_rule = QComboBox(self)
        for rule in LAG_RULES:
            self.lag_rule.addItem(LAG_RULE_LABELS[rule], rule)
        self.lag_rule.setAccessibleName("Lag rule")
        self.fixed_lags = QSpinBox(self)
        self.fixed_lags.setRange(0, 60)
        self.fixed_lags.setAccessibleName("Fixed lag order")
        self.max_lags = QSpinBox(self)
        self.max_lags.setRange(AUTOMATIC, 60)
        self.max_lags.setSpecialValueText("automatic (Schwert's rule)")
        self.max_lags.setAccessibleName("Largest lag order")
        self.max_difference = QSpinBox(self)
        self.max_difference.setRange(0, 2)
        self.max_difference.setAccessibleName("Highest difference")
        self.kpss = QCheckBox("KPSS (stationarity as the null)", self)
        self.kpss.setAccessibleName("KPSS cross-check")

        form = QFormLayout()
        form.addRow("Significance &level", self.alpha)
        form.addRow("", _explain("How strong the evidence must be before a test rejects its null "
                                 "hypothesis; 5% is the usual choice."))
        form.addRow("Lag &rule", self.lag_rule)
        form.addRow("", _explain("How the number of lagged differences in the ADF regression is "
                                 "chosen; too few lags distort τ, too many cost power."))
        form.addRow("&Fixed lag order", self.fixed_lags)
        form.addRow("", _explain("Used only with the fixed lag rule."))
        form.addRow("Largest lag &order", self.max_lags)
        form.addRow("", _explain("The rule searches from 0 up to this; automatic uses "
                                 "Schwert (1989): 12·(T/100)^¼."))
        form.addRow("Highest &difference", self.max_difference)
        form.addRow("", _explain("Tests start at this difference and move down (Dickey & Pantula "
                                 "1987); 2 allows an I(2) verdict."))
        form.addRow("&Cross-check", self.kpss)
        form.addRow("", _explain("A test that starts from stationarity, to confirm or question "
                                 "the ADF verdict."))
        buttons = QDialogButtonBox(
            QDialogButtonBox.StandardButton.Ok | QDialogButtonBox.StandardButton.Cancel
            | QDialogButtonBox.StandardButton.RestoreDefaults, self)
        buttons.accepted.connect(self.accept)
        buttons.rejected.connect(self.reject)
        restore = buttons.button(QDialogButtonBox.StandardButton.RestoreDefaults)
        restore.setText("Restore &defaults")
        restore.clicked.connect(lambda: self.load(Settings()))
        layout = QVBoxLayout(self)
        layout.addLayout(form)
        layout.addWidget(buttons)
        self.lag_rule.currentIndexChanged.connect(self._rule_changed)
        self.load(settings)
        self.setMinimumWidth(520)

    def _rule_changed(self) -> None:
        fixed = self.lag_rule.currentData() == "fixed"
        self.fixed_lags.setEnabled(fixed)
        self.max_lags.setEnabled(not fixed)

    def load(self, settings: Settings) -> None:
        self.alpha.setCurrentIndex(
            min(range(len(ALPHAS)), key=lambda i: abs(ALPHAS[i][0] - settings.alpha)))
        self.lag_rule.setCurrentIndex(LAG_RULES.index(settings.lag_rule))
        self.fixed_lags.setValue(settings.lags if settings.lags is not None else 4)
        self.max_lags.setValue(settings.max_lags if settings.max_lags is not None else AUTOMATIC)
        self.max_difference.setValue(settings.max_difference)
        self.kpss.setChecked("kpss" in settings.confirm)
        self._rule_changed()

    def settings(self) -> Settings:
        rule = str(self.lag_rule.currentData())
        max_lags = self.max_lags.value()
        return Settings(
            lag_rule=rule,
            lags=self.fixed_lags.value() if rule == "fixed" else None,
            max_lags=None if max_lags == AUTOMATIC else max_lags,
            alpha=float(self.alpha.currentData()),
            max_difference=self.max_difference.value(),
            confirm=("kpss",) if self.kpss.isChecked() else (),
        )
