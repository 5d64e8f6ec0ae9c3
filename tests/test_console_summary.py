"""The console summary of ``tauscope batch`` names the numbers that decided each verdict."""

from __future__ import annotations

import numpy as np
import pandas as pd

from tauscope.commands.console_summary import deciding_steps, summary_table
from tauscope.engine import Settings, analyse_series
from tauscope.report import Finding
from tauscope.report.deciding import UNION_NOTE, union_steps


def _walk() -> pd.Series:
    rng = np.random.default_rng(11)
    index = pd.period_range("2001-01", periods=160, freq="M")
    return pd.Series(np.cumsum(rng.standard_normal(160)), index=index)


def test_default_strategy_shows_the_union_m_of_each_difference() -> None:
    result = analyse_series(_walk(), Settings(power=False), "walk")
    union = union_steps(result)
    assert sorted(union) == [0, 1, 2]  # every difference from the second down was tested
    text = deciding_steps(result)
    for d, step in union.items():
        label = ("levels", "Δ", "Δ²")[d]
        sign = ">" if step.decision == "reject" else "≤"
        assert f"{label} M {step.statistic:.2f} {sign} {step.critical_value:.2f}" in text
    assert "τ" not in text  # the classic τ did not decide
    table = summary_table([Finding(result)])
    assert table.splitlines()[0].endswith("Steps that decided")
    assert UNION_NOTE in table


def test_classic_strategy_shows_its_tau_path() -> None:
    result = analyse_series(_walk(), Settings(power=False, strategy="classic"), "walk")
    assert union_steps(result) == {}
    text = deciding_steps(result)
    taus = [s for s in result.steps if s.statistic_name == "tau"]
    assert text.count(" τ ") == len(taus) > 0
    assert f"{taus[-1].statistic:.2f}".replace("-", "−") in text
    assert "Union M" not in summary_table([Finding(result)])
