"""The extra evidence in the window: the settings dialog offers PP, DF-GLS, Zivot-Andrews,
exact critical values and power; the Findings tree shows their rows with the engine's
numbers (the engine is the reference); the expanding-window chart draws the engine's τ."""

from __future__ import annotations

import numpy as np
import pytest

pytest.importorskip("pytestqt")

from tauscope.engine import Settings
from tauscope.engine import formatting as fmt


def test_settings_dialog_offers_the_extra_tests_with_explanations(main_window):  # type: ignore[no-untyped-def]
    from PySide6.QtWidgets import QLabel

    from tauscope.ui.settings_dialog import SettingsDialog

    chosen = Settings(confirm=("kpss", "pp", "dfgls", "za"), critical_values="exact",
                      break_model="c", power=False)
    dialog = SettingsDialog(chosen)
    assert dialog.settings() == chosen
    assert dialog.break_model.isEnabled()
    dialog.za.setChecked(False)
    assert not dialog.break_model.isEnabled()
    assert dialog.settings().confirm == ("kpss", "pp", "dfgls")
    dialog.load(Settings())
    assert dialog.settings() == Settings()
    texts = " ".join(label.text() for label in dialog.findChildren(QLabel))
    assert "slower; simulated at your sample size" in texts
    for citation in ("Phillips & Perron 1988", "Elliott, Rothenberg & Stock 1996",
                     "Zivot & Andrews 1992"):
        assert citation in texts
    dialog.deleteLater()


def test_findings_show_pp_dfgls_and_za_rows_equal_to_the_result(
        main_window, open_in_window, run_in_window, small_workbook):  # type: ignore[no-untyped-def]
    from PySide6.QtCore import Qt

    from tauscope.ui import findings_model as fm
    from tauscope.ui.qtcompat import item_value
    from tauscope.ui.roles import KIND_ROLE

    window = main_window
    # The classic strategy: under the size-controlled default the DF-GLS rows are the union's
    # components (one per spec and difference), and the extra DF-GLS is not repeated.
    window.apply_settings(Settings(confirm=("kpss", "pp", "dfgls", "za"), power=False, strategy="classic"))
    assert "PP, DF-GLS, ZA" in window.settings_label.text()
    open_in_window(window, small_workbook)
    series = window.series_panel.model.all_series()[:2]
    run_in_window(window, series)
    model = window.findings_panel.model
    model.populate_all()
    shown = 0
    for s in series:
        result = model.result_for_key(s.key)
        assert result is not None and result.error is None
        parent = model.index(model.row_for_key(s.key), 0)
        rows = {}
        for r in range(model.rowCount(parent)):
            kind = item_value(model.index(r, 0, parent), KIND_ROLE)
            rows.setdefault(kind, []).append(
                [str(item_value(model.index(r, c, parent), Qt.ItemDataRole.DisplayRole, ""))
                 for c in range(model.columnCount())])
        for name, symbol in (("pp", "Zτ"), ("dfgls", "τ-GLS"), ("za", "ZA")):
            tests = [t for t in result.tests if t.test == name]
            assert len(tests) == 1, name  # the engine ran it once, on the settled difference
            assert len(rows[name]) == 1
            row, test = rows[name][0], tests[0]
            assert row[fm.STATISTIC] == f"{symbol} = {fmt.stat(test.statistic)}"
            assert row[fm.CRITICAL] == fmt.stat(test.critical_value)
            assert row[fm.DECISION] == ("rejected" if test.reject else "not rejected")
            assert row[fm.NOBS] == str(test.nobs)
            shown += 1
        info = result.evidence.break_info
        assert info is not None
        assert info.first_new_label in rows["za"][0][fm.VERDICT]  # the break as a date
    assert shown == 6


def test_expanding_window_chart_draws_the_engines_recursive_tau(
        main_window, open_in_window, run_in_window, small_workbook, qtbot):  # type: ignore[no-untyped-def]
    window = main_window
    open_in_window(window, small_workbook)
    series = window.series_panel.model.all_series()[0]
    run_in_window(window, [series])
    assert window.select_series(series.key)
    chart = window.chart_panel
    chart.tabs.setCurrentIndex(chart.RECURSIVE)
    page = chart.recursive_page
    assert page.has_plot()
    recursive = window.findings_panel.model.result_for_key(series.key).evidence.recursive
    curves = page._shown[0].listDataItems()
    tau_curve = next(c for c in curves if c.name() == "τ up to this date")
    assert np.allclose(tau_curve.getOriginalDataset()[1], recursive.statistics, equal_nan=True)
    critical = next(c for c in curves if c.name().endswith("critical value"))
    assert np.allclose(critical.getOriginalDataset()[1], recursive.critical_values)
