"""The dialog for the testing choices; each option has a one-line explanation."""

from __future__ import annotations

from PySide6.QtWidgets import (
    QCheckBox,
    QComboBox,
    QDialog,
    QDialogButtonBox,
    QFormLayout,
    QGroupBox,
    QHBoxLayout,
    QLabel,
    QSpinBox,
    QVBoxLayout,
    QWidget,
)

from tauscope.engine import (
    BREAK_CHECK_LABELS,
    BREAK_CHECK_MODES,
    LAG_RULE_LABELS,
    LAG_RULES,
    SEASONAL_LABELS,
    SEASONAL_MODES,
    STRATEGIES,
    STRATEGY_LABELS,
    Settings,
)

ALPHAS = ((0.01, "1%"), (0.05, "5%"), (0.10, "10%"))
CRITICAL_SOURCES = (("mackinnon", "Published tables (MacKinnon 1996, 2010)"),
                    ("exact", "Exact: simulated at this sample size"))
BREAK_MODELS = (("c", "a shift in the level"), ("t", "a change in the slope"),
                ("ct", "a shift in the level and the slope"))
CROSS_CHECKS = ("kpss", "pp", "dfgls", "za")
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
        self.strategy = QComboBox(self)
        for name in STRATEGIES:
            self.strategy.addItem(STRATEGY_LABELS[name], name)
        self.strategy.setAccessibleName("How the verdict is decided")
        self.seasonal = QComboBox(self)
        for mode in SEASONAL_MODES:
            self.seasonal.addItem(SEASONAL_LABELS[mode], mode)
        self.seasonal.setAccessibleName("Allow for seasonal means")
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
        self.pp = QCheckBox("Phillips-Perron", self)
        self.pp.setAccessibleName("Phillips-Perron cross-check")
        self.dfgls = QCheckBox("DF-GLS", self)
        self.dfgls.setAccessibleName("DF-GLS cross-check")
        self.za = QCheckBox("Zivot-Andrews (one break)", self)
        self.za.setAccessibleName("Zivot-Andrews cross-check")
        self.break_model = QComboBox(self)
        for model, words in BREAK_MODELS:
            self.break_model.addItem(words, model)
        self.break_model.setAccessibleName("Kind of break")
        self.break_check = QComboBox(self)
        for mode in BREAK_CHECK_MODES:
            self.break_check.addItem(BREAK_CHECK_LABELS[mode], mode)
        self.break_check.setAccessibleName("Break check")
        self.critical_values = QComboBox(self)
        for source, words in CRITICAL_SOURCES:
            self.critical_values.addItem(words, source)
        self.critical_values.setAccessibleName("Critical values")
        self.power = QCheckBox("Report the power of the deciding test", self)
        self.power.setAccessibleName("Power")

        form = QFormLayout()
        form.addRow("&Verdict decided by", self.strategy)
        form.addRow("", _explain("Size-controlled: calls a unit root stationary no more often than the "
                                 "significance level over the whole decision; the robust choice keeps "
                                 "that when the size of the shocks changes, and is slower. The classic "
                                 "sequence is always shown too."))
        form.addRow("Significance &level", self.alpha)
        form.addRow("", _explain("How strong the evidence must be before a test rejects its null "
                                 "hypothesis; 5% is the usual choice."))
        form.addRow("&Seasonal means", self.seasonal)
        form.addRow("", _explain("Quarterly and monthly series: allow for each season's own average "
                                 "in the tests (seasonal dummies), and test for seasonal unit roots. "
                                 "Never: leave the seasons alone."))
        form.addRow("Lag &rule", self.lag_rule)
        form.addRow("", _explain("How the number of lagged differences in the ADF regression is "
                                 "chosen; too few lags distort τ, too many cost power. The "
                                 "size-controlled tests always use the modified AIC, built for them, "
                                 "unless the order is fixed."))
        form.addRow("&Fixed lag order", self.fixed_lags)
        form.addRow("", _explain("Used only with the fixed lag rule."))
        form.addRow("Largest lag &order", self.max_lags)
        form.addRow("", _explain("The rule searches from 0 up to this; automatic uses "
                                 "Schwert (1989): 12·(T/100)^¼."))
        form.addRow("Highest &difference", self.max_difference)
        form.addRow("", _explain("Tests start at this difference and move down (Dickey & Pantula "
                                 "1987); 2 allows an I(2) verdict."))
        more = QFormLayout()
        more.addRow("&Cross-checks", self.kpss)
        more.addRow("", _explain("A test that starts from stationarity, to confirm or question "
                                 "the ADF verdict."))
        more.addRow("", self.pp)
        more.addRow("", _explain("Corrects for autocorrelated errors instead of adding lags "
                                 "(Phillips & Perron 1988)."))
        more.addRow("", self.dfgls)
        more.addRow("", _explain("Removes the mean or trend by GLS first: more power near a unit "
                                 "root (Elliott, Rothenberg & Stock 1996)."))
        more.addRow("", self.za)
        more.addRow("Kind of &break", self.break_model)
        more.addRow("", _explain("Allows one break at a date chosen from the data (Zivot & "
                                 "Andrews 1992); a missed break looks like a unit root."))
        more.addRow("Break chec&k", self.break_check)
        more.addRow("", _explain("When a jump, a KPSS conflict or a swing of τ points to a break, test "
                                 "for a level shift that is allowed under both hypotheses and give the "
                                 "verdict under it (Lee & Strazicich 2013). Off: no break check."))
        more.addRow("Critical &values", self.critical_values)
        more.addRow("", _explain("Exact critical values: slower; simulated at your sample size."))
        more.addRow("&Power", self.power)
        more.addRow("", _explain("How often the test would reject if the series were stationary "
                                 "but persistent (AR coefficient 0.90 and 0.95); simulated."))
        buttons = QDialogButtonBox(
            QDialogButtonBox.StandardButton.Ok | QDialogButtonBox.StandardButton.Cancel
            | QDialogButtonBox.StandardButton.RestoreDefaults, self)
        buttons.accepted.connect(self.accept)
        buttons.rejected.connect(self.reject)
        restore = buttons.button(QDialogButtonBox.StandardButton.RestoreDefaults)
        restore.setText("Restore &defaults")
        restore.clicked.connect(lambda: self.load(Settings()))
        sequence_box = QGroupBox("The Dickey-Fuller sequence", self)
        sequence_box.setLayout(form)
        evidence_box = QGroupBox("More evidence", self)
        evidence_box.setLayout(more)
        columns = QHBoxLayout()  # two columns: the dialog fits a 1280×800 screen
        columns.addWidget(sequence_box, 1)
        columns.addWidget(evidence_box, 1)
        layout = QVBoxLayout(self)
        layout.addLayout(columns)
        layout.addWidget(buttons)
        self.lag_rule.currentIndexChanged.connect(self._rule_changed)
        self.za.toggled.connect(self.break_model.setEnabled)
        self.load(settings)
        self.setMinimumWidth(900)

    def _rule_changed(self) -> None:
        fixed = self.lag_rule.currentData() == "fixed"
        self.fixed_lags.setEnabled(fixed)
        self.max_lags.setEnabled(not fixed)

    def load(self, settings: Settings) -> None:
        self.alpha.setCurrentIndex(
            min(range(len(ALPHAS)), key=lambda i: abs(ALPHAS[i][0] - settings.alpha)))
        self.lag_rule.setCurrentIndex(LAG_RULES.index(settings.lag_rule))
        self.strategy.setCurrentIndex(STRATEGIES.index(settings.strategy))
        self.seasonal.setCurrentIndex(SEASONAL_MODES.index(settings.seasonal))
        self.fixed_lags.setValue(settings.lags if settings.lags is not None else 4)
        self.max_lags.setValue(settings.max_lags if settings.max_lags is not None else AUTOMATIC)
        self.max_difference.setValue(settings.max_difference)
        for name, box in self._checks().items():
            box.setChecked(name in settings.confirm)
        self.break_model.setCurrentIndex(
            [v for v, _ in BREAK_MODELS].index(settings.break_model))
        self.break_model.setEnabled("za" in settings.confirm)
        self.critical_values.setCurrentIndex(
            [v for v, _ in CRITICAL_SOURCES].index(settings.critical_values))
        self.power.setChecked(settings.power)
        self.break_check.setCurrentIndex(BREAK_CHECK_MODES.index(settings.break_check))
        self._rule_changed()

    def _checks(self) -> dict[str, QCheckBox]:
        return {"kpss": self.kpss, "pp": self.pp, "dfgls": self.dfgls, "za": self.za}

    def settings(self) -> Settings:
        rule = str(self.lag_rule.currentData())
        max_lags = self.max_lags.value()
        return Settings(
            lag_rule=rule,
            lags=self.fixed_lags.value() if rule == "fixed" else None,
            max_lags=None if max_lags == AUTOMATIC else max_lags,
            alpha=float(self.alpha.currentData()),
            max_difference=self.max_difference.value(),
            confirm=tuple(name for name, box in self._checks().items() if box.isChecked()),
            critical_values=str(self.critical_values.currentData()),
            break_model=str(self.break_model.currentData()),
            power=self.power.isChecked(),
            strategy=str(self.strategy.currentData()),
            seasonal=str(self.seasonal.currentData()),
            break_check=str(self.break_check.currentData()),
        )
