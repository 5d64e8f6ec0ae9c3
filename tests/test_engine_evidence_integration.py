"""analyse_series with the extra evidence turned on (issue 6 integration).

These tests wait for the Settings fields of the integration (``critical_values``,
``break_model``, ``power``) and are skipped until they exist.  Data: statsmodels'
macrodata dataset (log real GDP with its quarterly dates) and simulated series with
known truth; the statistics themselves are checked against arch / statsmodels in
test_engine_evidence_reference.py.
"""

from __future__ import annotations

import json
from dataclasses import fields

import numpy as np
import pandas as pd
import pytest
import statsmodels.api as sm

from tauscope.engine import Settings, analyse_series
from tauscope.engine.unitroot.phillips_perron import phillips_perron

INTEGRATED = "critical_values" in {f.name for f in fields(Settings)}
pytestmark = pytest.mark.skipif(not INTEGRATED, reason="issue-6 Settings fields not integrated yet")

ALL = ("kpss", "pp", "dfgls", "za")


def _gdp() -> pd.Series:
    data = sm.datasets.macrodata.load_pandas().data  # statsmodels' macrodata dataset
    index = pd.period_range("1959Q1", periods=len(data), freq="Q")
    return pd.Series(np.log(data["realgdp"].to_numpy()), index=index)


def test_extra_tests_join_the_tests_and_notes() -> None:
    result = analyse_series(_gdp(), Settings(confirm=ALL), name="log real GDP")
    names = [t.test for t in result.tests]
    for name in ("pp", "dfgls", "za", "kpss"):
        assert name in names
    d = result.to_dict()
    json.dumps(d)
    evidence = d["evidence"]
    assert evidence["break"]["first_new_label"].startswith(("19", "20"))  # a quarter of the sample
    pp = result.find("pp")
    assert pp is not None
    x = result.values.to_numpy() if result.values is not None else np.empty(0)
    assert pp.statistic == pytest.approx(phillips_perron(np.diff(x, n=pp.difference) if pp.difference else x,
                                                         pp.spec).z_tau, abs=1e-12)
    assert any(note.startswith("Phillips-Perron (") for note in result.notes)
    assert result.verdict.agreement in ("confirmed", "conflict", "inconclusive")


def test_default_settings_add_only_the_power_sentence_for_a_unit_root() -> None:
    walk = np.cumsum(np.random.default_rng(12).standard_normal(160))
    result = analyse_series(walk, Settings(), name="walk")
    assert [t.test for t in result.tests if t.test in ("pp", "za")] == []
    assert result.evidence is not None and result.evidence.tests == ()
    # The only DF-GLS entries are the size-controlled strategy's components, one per spec and
    # difference it looked at.
    dfgls = [(t.spec, t.difference) for t in result.tests if t.test == "dfgls"]
    assert len(dfgls) == len(set(dfgls)) and {s for s, _ in dfgls} == {"constant", "trend"}
    assert result.verdict.unit_root  # a random walk of 160 values (seed 12)
    # Under the default the power describes the classic sequence's ADF, not the verdict's test,
    # and the sentence says so.
    power_notes = [note for note in result.notes if note.startswith("How often")]
    assert len(power_notes) == 1
    assert power_notes[0].startswith("How often the last ADF test of the classic sequence")
    assert "not from this ADF test" in power_notes[0]
    power = result.to_dict()["evidence"]["power"]
    assert power is not None and 0.0 <= power["power"]["0.95"] <= power["power"]["0.90"] <= 1.0
    classic = analyse_series(walk, Settings(strategy="classic"), name="walk")
    assert classic.verdict.unit_root
    classic_power = [note for note in classic.notes if note.startswith("How often")]
    assert len(classic_power) == 1 and classic_power[0].startswith("How often the deciding ADF test")
    assert "not from this ADF test" not in classic_power[0]


def test_exact_critical_values_change_only_the_yardstick() -> None:
    walk = np.cumsum(np.random.default_rng(13).standard_normal(120))
    table = analyse_series(walk, Settings(power=False), name="walk")
    exact = analyse_series(walk, Settings(power=False, critical_values="exact"), name="walk")
    for a, b in zip(table.tests, exact.tests, strict=True):
        assert a.test == b.test and a.statistic == pytest.approx(b.statistic, abs=1e-12)
        if a.test == "adf":
            assert b.critical_values["5%"] == pytest.approx(a.critical_values["5%"], abs=0.1)


def test_settings_refuse_unknown_choices() -> None:
    with pytest.raises(ValueError):
        Settings(critical_values="bootstrap")
    with pytest.raises(ValueError):
        Settings(break_model="x")
    with pytest.raises(ValueError):
        Settings(confirm=("kpss", "adf"))
    assert Settings.from_dict(Settings(confirm=ALL, critical_values="exact").to_dict()) == Settings(
        confirm=ALL, critical_values="exact"
    )
