"""LaTeX table: escaping, significance markers, notes, structure, sample and observations per
series, the steps judged against the normal; compiles and fits the page when TeX is installed."""

from __future__ import annotations

import re
import shutil
import subprocess
from pathlib import Path

import pytest

from tauscope.report import export
from tauscope.report.latex_export import escape, run_to_latex
from tauscope.report.tables import deciding_tau, marker, normal_step
from test_report_support import make_run


def _body_rows(tex: str) -> list[str]:
    """The table's rows, one per series (each written on one line ending in a row break)."""
    body = tex.split("\\midrule", 1)[1].split("\\bottomrule", 1)[0]
    return [line.strip().removesuffix("\\\\").strip() for line in body.strip().splitlines()
            if line.strip() != "\\addlinespace"]


def _cells(row: str) -> list[str]:
    return re.split(r"(?<!\\)&", row.replace("\\addlinespace", ""))


def test_structure_is_a_complete_booktabs_tabular() -> None:
    tex = run_to_latex(make_run())
    outer = _flatten(tex)  # two-line cells are tabulars of their own
    for token in ("\\begin{tabular}", "\\toprule", "\\midrule", "\\bottomrule", "\\end{tabular}"):
        assert outer.count(token) == 1, token
    assert tex.count("\\begin{tabular}") == tex.count("\\end{tabular}")
    assert tex.index("\\toprule") < tex.index("\\midrule") < tex.index("\\bottomrule")
    spec = re.search(r"\\begin\{tabular\}\{((?:[^{}]|\{[^{}]*\})*)\}", tex)
    assert spec is not None
    n_columns = len(re.findall(r"[lrcp]", re.sub(r"\{[^{}]*\}", "", spec.group(1))))
    head = tex.split("\\toprule", 1)[1].split("\\midrule", 1)[0].strip().splitlines()
    groups, rules, names = head
    group_cells = _cells(groups.strip().removesuffix("\\\\"))
    spans = [int(m.group(1)) if (m := re.search(r"\\multicolumn\{(\d+)\}", c)) else 1
             for c in group_cells]
    assert sum(spans) == n_columns
    assert rules.count("\\cmidrule") == sum(1 for n in spans if n > 1)
    assert len(_cells(names.strip().removesuffix("\\\\"))) == n_columns
    for row in _body_rows(tex):
        assert len(_cells(_flatten(row))) == n_columns, row


def _flatten(row: str) -> str:
    """A row with each nested two-line cell (a tabular inside the cell) taken out."""
    return re.sub(r"\\begin\{tabular\}\[t\].*?\\end\{tabular\}", "X", row)


def test_each_series_shows_its_sample_and_observations() -> None:
    run = make_run()
    tex = run_to_latex(run)
    rows = _body_rows(tex)
    assert len(rows) == len(run.findings)
    for finding, row in zip(run.findings, rows, strict=True):
        result = finding.result
        first = _cells(_flatten(row))[0]
        if result.ok:
            assert result.span is not None
            start, end = (escape(label) for label in result.span)
            assert start in first and end in first, first
            assert f"$T = {result.nobs}$" in first
        else:
            assert "$T =" not in first
    assert "number of observations" in tex.split("\\parbox", 1)[1]


def test_a_tau_judged_against_the_normal_is_marked() -> None:
    # Real output (a random walk with drift): Φ1 finds the drift, so τ on the levels is
    # compared with the standard normal (West 1988) -- the sequence in DESIGN §4.
    run = make_run()
    result = run.findings[0].result
    step = normal_step(result, 0)
    assert step is not None and step.statistic_name == "z"
    test = deciding_tau(result, 0)
    assert test is not None
    tex = run_to_latex(run)
    row = _body_rows(tex)[0]
    assert re.search(rf"\${test.statistic:.2f}\^{{\*{{0,3}}\\dagger}}\$", row), row
    # stars by the normal's critical values: 5% one-sided -1.645 (standard normal table)
    if test.statistic < -1.645:
        assert "**" in row.split("dagger")[0][-8:]
    assert "\\dagger" in tex.split("\\parbox", 1)[1]
    others = [d for f in run.findings for d in range(3) if normal_step(f.result, d) is None
              and deciding_tau(f.result, d) is not None]
    assert others  # the other τ cells carry no dagger
    assert tex.count("\\dagger") == 1 + sum(
        normal_step(f.result, d) is not None for f in run.findings for d in range(3))


def test_cells_carry_the_engine_tau_with_its_marker() -> None:
    run = make_run()
    tex = run_to_latex(run)
    rows = _body_rows(tex)
    checked = 0
    for finding, row in zip(run.findings, rows, strict=True):
        for d in range(3):
            test = deciding_tau(finding.result, d)
            if test is None or normal_step(finding.result, d) is not None:
                continue  # a τ judged against the normal: its own test below
            mark = marker(test)  # by the test's own critical values (MacKinnon 2010 here)
            number = f"{test.statistic:.2f}"
            expected = f"${number}^{{{mark}}}$" if mark else f"${number}$"
            assert expected in row
            code = {"trend": "ct", "constant": "c", "none": "n"}[test.spec]
            assert f"({code}, {test.lags})" in row
            checked += 1
    assert checked >= 4


def test_notes_state_lag_rule_sources_and_level() -> None:
    tex = run_to_latex(make_run(alpha=0.10))
    notes = tex.split("\\parbox", 1)[1]
    assert "modified AIC (Ng & Perron 2001)".replace("&", "\\&") in notes  # the default lag rule
    assert "MacKinnon (2010)" in notes
    assert "Dickey \\& Fuller (1981)" in notes
    assert "10\\% level" in notes
    assert "$^{***}$" in notes
    # the default strategy decided: the note says the union did, not the classic τ shown
    assert "union of rejections" in notes and "not by $\\tau$" in notes


def test_notes_under_the_classic_strategy_do_not_name_the_union() -> None:
    tex = run_to_latex(make_run(strategy="classic"))
    assert "union of rejections" not in tex.split("\\parbox", 1)[1]


@pytest.mark.parametrize(("text", "expected"), [
    ("R&D_spend 50% #1 $", r"R\&D\_spend 50\% \#1 \$"),
    ("a{b}~c^d\\", r"a\{b\}\textasciitilde{}c\textasciicircum{}d\textbackslash{}"),
    ("Δ²y − τ", r"$\Delta^{2}$y $-$ $\tau$"),
    ("plain words", "plain words"),
])
def test_escape(text: str, expected: str) -> None:
    assert escape(text) == expected


def test_series_names_are_escaped_in_the_table() -> None:
    tex = run_to_latex(make_run())
    assert r"Real output \& \textless{}prices\textgreater{}" in tex
    assert "& <prices>" not in tex


PAPER = (
    "\\documentclass[11pt,a4paper]{article}\n\\usepackage[margin=2.5cm]{geometry}\n"
    "\\usepackage{booktabs}\n\\begin{document}\n\\begin{table}\\centering\n"
    "\\input{findings.tex}\n\\end{table}\n\\end{document}\n"
)


@pytest.mark.skipif(shutil.which("pdflatex") is None,
                    reason="pdflatex is not installed (Debian: texlive-latex-base and "
                           "texlive-latex-recommended; .ci/run installs them)")
@pytest.mark.parametrize("exact", [False, True])
def test_compiles_and_fits_the_text_width(tmp_path: Path, exact: bool) -> None:
    """A standard 11 pt article on A4 with 2.5 cm margins (text width 455 pt): the table and
    its notes compile without errors and without an overfull box."""
    run = make_run(exact=exact)  # with simulated critical values the notes differ
    written = export(tmp_path / "findings.tex", run)
    assert written.findings == run.findings
    (tmp_path / "paper.tex").write_text(PAPER, encoding="utf-8")
    done = subprocess.run(
        ["pdflatex", "-interaction=nonstopmode", "-halt-on-error", "paper.tex"],
        cwd=tmp_path, capture_output=True, text=True, timeout=120, check=False)
    assert done.returncode == 0, done.stdout[-2000:]
    assert (tmp_path / "paper.pdf").stat().st_size > 0
    log = (tmp_path / "paper.log").read_text(encoding="latin-1")
    assert "Missing $ inserted" not in log and "Undefined control sequence" not in log
    assert "Overfull \\hbox" not in log, log[log.find("Overfull"):][:400]
