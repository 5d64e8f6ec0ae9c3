"""LaTeX findings: a booktabs table ready for ``\\input`` (needs ``\\usepackage{booktabs}``).

One row per series: the τ that settled each difference, with significance
markers and, in parentheses, the deterministic terms and the lag order; the
KPSS statistic on each difference tested; the order of integration and the
deterministic terms.  A notes block under the table gives the lag rule, the
critical-value sources (MacKinnon 2010 for τ; Dickey & Fuller 1981 for Φ;
Kwiatkowski et al. 1992 for KPSS) and the significance level.
"""

from __future__ import annotations

import re
from pathlib import Path

from tauscope.engine import SeriesResult
from tauscope.engine import formatting as fmt
from tauscope.report.atomic import write_text_atomic
from tauscope.report.deciding import union_steps
from tauscope.report.methods import left_out_note
from tauscope.report.run import Charts, RunRecord
from tauscope.report.tables import (
    NORMAL_NOTE,
    SPEC_CODES,
    deciding_tau,
    deterministic_words,
    kpss_tests,
    lag_rule_label,
    marker,
    normal_step,
    tau_marker,
)
from tauscope.report.text_safety import tex_text

_SPECIALS = {
    "\\": r"\textbackslash{}",
    "&": r"\&",
    "%": r"\%",
    "$": r"\$",
    "#": r"\#",
    "_": r"\_",
    "{": r"\{",
    "}": r"\}",
    "~": r"\textasciitilde{}",
    "^": r"\textasciicircum{}",
    "<": r"\textless{}",
    ">": r"\textgreater{}",
    "|": r"\textbar{}",
    "τ": r"$\tau$",
    "Φ": r"$\Phi$",
    "Δ": r"$\Delta$",
    "γ": r"$\gamma$",
    "β": r"$\beta$",
    "η": r"$\eta$",
    "μ": r"$\mu$",
    "Σ": r"$\Sigma$",
    "−": "$-$",
    "–": "--",
    "—": "---",
    "“": "``",
    "”": "''",
    "‘": "`",
    "’": "'",
    "²": r"$^{2}$",
    "·": r"$\cdot$",
    "×": r"$\times$",
    "≤": r"$\leq$",
    "≥": r"$\geq$",
    "…": r"\ldots{}",
    "\u00a0": "~",
    "†": r"$^{\dagger}$",
}


_HEADS = {0: "levels", 1: r"$\Delta y$", 2: r"$\Delta^{2} y$"}
SERIES_WIDTH = "3.2cm"
"""The series column wraps at this width; with it the table of three τ and three KPSS
columns fits ``\textwidth`` of an 11 pt article with 2.5 cm margins on A4 (455 pt)."""
COLUMN_SEP = "5pt"
TYPE_SIZE = "small"
"""The table's type size (the notes are a size smaller), set inside the file's own group."""
_BREAK_AFTER = set("/,.-_)]:;")


def escape(text: str) -> str:
    """Text safe in a LaTeX document: specials escaped, common Unicode symbols as commands.

    Neighbouring symbols become one math group ($\\Delta$$^{2}$ would open display math).
    """
    escaped = "".join(_SPECIALS.get(ch, ch) for ch in tex_text(text))
    return re.sub(r"(?<!\\)\$\$", "", escaped)


def breakable(text: str) -> str:
    """A name that may wrap in a narrow column: escaped, with a permitted line break after
    punctuation (long file-like names, formulas) and hyphenation allowed from the first word."""
    parts = []
    for ch in text:
        parts.append(escape(ch))
        if ch in _BREAK_AFTER:
            parts.append(r"\allowbreak{}")
    return r"\hspace{0pt}" + "".join(parts)


def _number(value: float, mark: str = "") -> str:
    text = f"{value:.2f}" if abs(value) < 100 else f"{value:.1f}"
    mark = mark.replace("†", r"\dagger")
    sup = f"^{{{mark}}}" if mark else ""
    return f"${text}{sup}$"


def _small(text: str) -> str:
    return f"{{\\footnotesize {text}}}" if text else ""


def _stack(top: str, bottom: str, align: str) -> str:
    """Two lines in one cell (a nested tabular aligned at its top line): a statistic over its
    terms and lags, a first observation over the last."""
    if not bottom:
        return top
    return f"\\begin{{tabular}}[t]{{@{{}}{align}@{{}}}}{top}\\\\ {bottom}\\end{{tabular}}"


def _order(result: SeriesResult) -> tuple[str, str]:
    """The order (first line) and the deterministic terms in words (second line)."""
    if not result.ok:
        return "not tested", ""
    order = result.verdict.order
    terms = deterministic_words(result)
    return ("unresolved" if order is None else f"I({order})",
            escape(terms) if terms and terms != "none" else "")


def _series_cell(name: str, result: SeriesResult) -> str:
    """The name, then in small type the sample (first to last observation used) and T, the
    number of observations; a series that could not be tested shows its name only."""
    cell = r"\raggedright " + breakable(name)
    if result.ok and result.span is not None:
        span = breakable(f"{result.span[0]}–{result.span[1]}")
        cell += f"\\par{{\\footnotesize {span}\\par $T = {result.nobs}$}}"
    return cell


def run_to_latex(run: RunRecord) -> str:
    """The table: one row per series; the sample's first observation over its last, each τ over
    its deterministic terms and lag order, the order over the verdict's deterministic terms."""
    results = [f.result for f in run.findings]
    tau_diffs = sorted({d for r in results for d in range(3) if deciding_tau(r, d) is not None})
    kpss_diffs = sorted({d for r in results for d in kpss_tests(r)})
    n_tau, n_kpss = len(tau_diffs), len(kpss_diffs)
    groups = [" "]
    rules = []
    first = 2
    if n_tau:
        groups.append(f"& \\multicolumn{{{n_tau}}}{{c}}{{$\\tau$}} ")
        rules.append(f"\\cmidrule(lr){{{first}-{first + n_tau - 1}}}")
        first += n_tau
    if n_kpss:
        groups.append(f"& \\multicolumn{{{n_kpss}}}{{c}}{{KPSS}} ")
        rules.append(f"\\cmidrule(lr){{{first}-{first + n_kpss - 1}}}")
    groups.append(r"& \\")
    header = ["Series"]
    header += [_HEADS[d] for d in tau_diffs] + [_HEADS[d] for d in kpss_diffs] + ["Order"]
    spec = f"@{{}}p{{{SERIES_WIDTH}}}" + "r" * (n_tau + n_kpss) + "l@{}"
    lines = [
        f"% Tauscope {run.version}, {run.created}: order of integration of {len(results)} series.",
        "% Needs \\usepackage{booktabs} in the preamble; \\input this file inside a table float.",
        "\\begingroup",
        f"\\{TYPE_SIZE}",
        f"\\setlength{{\\tabcolsep}}{{{COLUMN_SEP}}}",
        f"\\begin{{tabular}}{{{spec}}}",
        "\\toprule",
        "".join(groups),
        "".join(rules),
        " & ".join(header) + r" \\",
        "\\midrule",
    ]
    for number, finding in enumerate(run.findings):
        result = finding.result
        order, terms = _order(result)
        cells = [_series_cell(finding.name, result)]
        for d in tau_diffs:
            test = deciding_tau(result, d)
            cells.append("--" if test is None else _stack(
                _number(test.statistic, tau_marker(result, d)),
                _small(f"({SPEC_CODES[test.spec]}, {test.lags})"), "r"))
        kpss = kpss_tests(result)
        for d in kpss_diffs:
            test = kpss.get(d)
            cells.append("--" if test is None else _number(test.statistic, marker(test)))
        cells.append(_stack(escape(order), _small(terms), "l"))
        if number:
            lines.append("\\addlinespace")
        lines.append(" & ".join(cells) + r" \\")
    lines += ["\\bottomrule", "\\end{tabular}"]
    lines += ["", "\\par\\smallskip", f"\\parbox{{\\linewidth}}{{\\footnotesize {_notes(run)}}}",
              "\\endgroup", ""]
    return "\n".join(lines)


def _critical_note(run: RunRecord) -> str:
    if run.simulated_critical_values:
        return ("Critical values and p-values of $\\tau$ and $\\Phi$: simulated for this run at "
                "each regression's own number of observations and lag order (published values "
                "where a regression was too short to simulate); KPSS")
    return ("Critical values: MacKinnon (2010) for $\\tau$, Dickey \\& Fuller (1981) for "
            "$\\Phi_1$, $\\Phi_3$; KPSS")


_UNION_DECIDED = (
    ", by the union of rejections of DF-GLS and MSB tests with a constant and with a trend "
    "(Harvey, Leybourne \\& Taylor 2009), not by $\\tau$: the union's statistic $M$ and its "
    "critical value on each difference are in the findings' summary. $\\tau$ is given for "
    "the record.")


def _notes(run: RunRecord) -> str:
    settings = run.settings
    a = fmt.percent(settings.alpha)
    bound = ("maximum by Schwert's (1989) rule" if settings.max_lags is None
             else f"at most {settings.max_lags}")
    lag = (f"lag order fixed at {settings.lags}" if settings.lag_rule == "fixed"
           else f"lag order chosen by the {lag_rule_label(settings)}, {bound}")
    normal = any(normal_step(f.result, d) is not None for f in run.findings for d in range(3))
    text = (
        "Notes: Under each series, the sample used (first and last observation) and $T$, the "
        "number of observations. "
        "$\\tau$ is the augmented Dickey-Fuller statistic of the regression the classic testing "
        "sequence (Dolado, Jenkinson \\& Sosvilla-Rivero 1990) settled on for each difference; "
        "below each $\\tau$, in parentheses, the deterministic "
        "terms (ct constant and trend, c constant, n none) and the "
        f"{escape(lag)}. "
        "$^{***}$, $^{**}$, $^{*}$: rejection at 1\\%, 5\\%, 10\\%. "
        + (escape(NORMAL_NOTE) + " " if normal else "")
        + _critical_note(run)
        + " (Kwiatkowski et al.\\ 1992, null of stationarity, critical values from their Table 1) "
        "rejects for large values. The order "
        f"of integration was decided at the {escape(a)} level, from the highest difference down "
        "(Dickey \\& Pantula 1987)"
        + (_UNION_DECIDED if any(union_steps(f.result) for f in run.findings) else ".")
    )
    left = left_out_note(run)
    if left is not None:
        text += " \\textbf{" + escape(left) + "}"
    return text


def write_latex(path: Path, run: RunRecord, charts: Charts | None = None) -> None:
    write_text_atomic(path, run_to_latex(run))
