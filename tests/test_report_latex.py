"""LaTeX table: escaping, significance markers, notes, structure; compiles when TeX is installed."""

from __future__ import annotations

import re
import shutil
import subprocess
from pathlib import Path

import pytest

from tauscope.report import export
from tauscope.report.latex_export import escape, run_to_latex
from tauscope.report.tables import deciding_tau, marker
from test_report_support import make_run


def _body_rows(tex: str) -> list[str]:
    body = tex.split("\\midrule", 1)[1].split("\\bottomrule", 1)[0]
    return [r.strip() for r in body.split("\\\\") if r.strip() and r.strip() != "\\addlinespace"]


def _cells(row: str) -> list[str]:
    return re.split(r"(?<!\\)&", row.replace("\\addlinespace", ""))


def test_structure_is_a_complete_booktabs_tabular() -> None:
    tex = run_to_latex(make_run())
    for token in ("\\begin{tabular}", "\\toprule", "\\midrule", "\\bottomrule", "\\end{tabular}"):
        assert tex.count(token) == 1, token
    assert tex.index("\\toprule") < tex.index("\\midrule") < tex.index("\\bottomrule")
    spec = re.search(r"\\begin\{tabular\}\{((?:[^{}]|\{\})*)\}", tex)
    assert spec is not None
    n_columns = len(re.findall(r"[lrc]", spec.group(1).replace("@{}", "")))
    header = tex.split("\\toprule", 1)[1].split("\\midrule", 1)[0].strip().removesuffix("\\\\")
    assert len(_cells(header)) == n_columns
    for row in _body_rows(tex):
        assert len(_cells(row)) == n_columns, row


def test_cells_carry_the_engine_tau_with_its_marker() -> None:
    run = make_run()
    tex = run_to_latex(run)
    first = run.findings[0].result
    test = deciding_tau(first, 0)
    assert test is not None
    mark = marker(test)
    number = f"{test.statistic:.2f}"
    expected = f"${number}^{{{mark}}}$" if mark else f"${number}$"
    assert expected in tex
    assert f"({ {'trend': 'ct', 'constant': 'c', 'none': 'n'}[test.spec]}, {test.lags})" in tex


def test_notes_state_lag_rule_sources_and_level() -> None:
    tex = run_to_latex(make_run(alpha=0.10))
    notes = tex.split("\\parbox", 1)[1]
    assert "Akaike information criterion" in notes
    assert "MacKinnon (2010)" in notes
    assert "Dickey \\& Fuller (1981)" in notes
    assert "10\\% level" in notes
    assert "$^{***}$" in notes


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


@pytest.mark.skipif(shutil.which("pdflatex") is None, reason="pdflatex is not installed")
def test_compiles_with_pdflatex(tmp_path: Path) -> None:
    export(tmp_path / "findings.tex", make_run())
    (tmp_path / "paper.tex").write_text(
        "\\documentclass{article}\n\\usepackage[T1]{fontenc}\n\\usepackage{booktabs}\n"
        "\\begin{document}\n\\begin{table}\\centering\\small\n\\input{findings.tex}\n"
        "\\end{table}\n\\end{document}\n", encoding="utf-8")
    done = subprocess.run(
        ["pdflatex", "-interaction=nonstopmode", "-halt-on-error", "paper.tex"],
        cwd=tmp_path, capture_output=True, text=True, timeout=120, check=False)
    assert done.returncode == 0, done.stdout[-2000:]
    assert (tmp_path / "paper.pdf").stat().st_size > 0
    log = (tmp_path / "paper.log").read_text(encoding="latin-1")
    assert "Missing $ inserted" not in log and "Undefined control sequence" not in log
