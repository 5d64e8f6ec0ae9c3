"""One vocabulary: the cross-check and the step decisions read the same in the notes, the
command line's summary, the guide and the reports (the window's Findings column is checked
in test_ui_window.py).  The contract values in to_dict() stay as DESIGN §3 names them."""

from __future__ import annotations

import numpy as np
import pytest

from tauscope.engine import Settings, analyse_series
from tauscope.engine.reading.words import (
    CROSS_CHECK_WORDS,
    cross_check_meaning,
    cross_check_word,
    decision_word,
)
from tauscope.report.run import Finding


def _results() -> list:  # type: ignore[type-arg]
    """A random walk with drift and a stationary AR(1) (known truth), KPSS on."""
    rng = np.random.default_rng(5)
    walk = 50 + np.cumsum(0.3 + rng.normal(size=160))
    ar = np.zeros(160)
    for t in range(1, 160):
        ar[t] = 0.4 * ar[t - 1] + rng.normal()
    settings = Settings(lag_rule="aic")
    return [analyse_series(walk, settings, "walk"), analyse_series(ar, settings, "ar")]


def test_each_contract_value_has_its_own_plain_word() -> None:
    values = ("confirmed", "conflict", "inconclusive", None)
    words = [cross_check_word(v) for v in values]
    assert len(set(words)) == len(values)
    assert all(cross_check_meaning(v) for v in values)
    assert set(CROSS_CHECK_WORDS) == set(values)
    # the contract's own terms are not shown to users
    assert not {"confirmed", "conflict", "inconclusive", "in conflict"} & set(words)
    assert decision_word("reject") == "rejected"
    assert decision_word("do not reject") == "not rejected"


def test_the_notes_use_the_words_and_to_dict_keeps_the_contract() -> None:
    for result in _results():
        agreement = result.verdict.agreement
        assert agreement in ("confirmed", "conflict", "inconclusive")
        assert result.to_dict()["verdict"]["agreement"] == agreement
        notes = " ".join(result.notes)
        if result.verdict.order is not None:
            assert f"Cross-check {cross_check_word(agreement)}:" in notes
        for old in ("Cross-check confirmed", "Cross-check inconclusive", "Cross-check in conflict"):
            assert old not in notes


def test_the_command_line_summary_uses_the_words() -> None:
    from tauscope.commands.console_summary import summary_table

    results = _results()
    text = summary_table([Finding(r) for r in results])
    header, *rows = text.splitlines()
    assert "Cross-check" in header
    for row, result in zip(rows, results, strict=False):
        assert cross_check_word(result.verdict.agreement) in [c.strip() for c in row.split("  ")]
        assert result.verdict.agreement not in row.split()


def test_the_guide_explains_every_word() -> None:
    from tauscope.ui.guide_text import guide_html

    guide = guide_html()
    for value, word in CROSS_CHECK_WORDS.items():
        assert f"<b>{word}</b>: {cross_check_meaning(value)}" in guide


@pytest.mark.parametrize("builder", ["summary_table", "compact_table"])
def test_the_report_tables_use_the_words(builder: str) -> None:
    from tauscope.report import tables
    from tauscope.report.run import RunRecord

    results = _results()
    run = RunRecord(Settings(lag_rule="aic"), (), tuple(Finding(r) for r in results))
    table = getattr(tables, builder)(run)
    column = table.column("agreement")
    assert table.columns[column].header == "Cross-check"
    shown = [row[column] for row in table.rows]
    assert shown == [cross_check_word(r.verdict.agreement) for r in results]
