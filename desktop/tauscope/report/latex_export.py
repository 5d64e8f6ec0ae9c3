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
from tauscope.report.run import Charts, RunRecord
from tauscope.report.tables import (
    SPEC_CODES,
    deciding_tau,
    deterministic_words,
    kpss_tests,
    lag_rule_label,
    marker,
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
}


_HEADS = {0: "levels", 1: r"$\Delta y$", 2: r"$\Delta^{2} y$"}


def escape(text: str) -> str:
    """Text safe in a LaTeX document: specials escaped, common Unicode symbols as commands.

    Neighbouring symbols become one math group ($\\Delta$$^{2}$ would open display math).
    """
    escaped = "".join(_SPECIALS.get(ch, ch) for ch in tex_text(text))
    return re.sub(r"(?<!\\)\$\$", "", escaped)


def _number(value: float, mark: str = "") -> str:
    text = f"{value:.2f}" if abs(value) < 100 else f"{value:.1f}"
    sup = f"^{{{mark}}}" if mark else ""
    return f"${text}{sup}$"


def _order(run_order: int | None, ok: bool) -> str:
    if not ok:
        return "not tested"
    return "unresolved" if run_order is None else f"I({run_order})"


def _verdict(result: SeriesResult) -> str:
    order = _order(result.verdict.order, result.ok)
    terms = deterministic_words(result)
    return escape(f"{order}, {terms}" if terms and terms != "none" else order)


def run_to_latex(run: RunRecord) -> str:
    """The table: per series a row of statistics and, below it, the terms and lags of each τ."""
    results = [f.result for f in run.findings]
    tau_diffs = sorted({d for r in results for d in range(3) if deciding_tau(r, d) is not None})
    kpss_diffs = sorted({d for r in results for d in kpss_tests(r)})
    header = ["Series"]
    header += [f"$\\tau$, {_HEADS[d]}" for d in tau_diffs]
    header += [f"KPSS, {_HEADS[d]}" for d in kpss_diffs]
    header += ["Order"]
    spec = "@{}l" + "r" * (len(tau_diffs) + len(kpss_diffs)) + "l@{}"
    lines = [
        f"% Tauscope {run.version}, {run.created}: order of integration of {len(results)} series.",
        "% Needs \\usepackage{booktabs} in the preamble; \\input this file inside a table float.",
        f"\\begin{{tabular}}{{{spec}}}",
        "\\toprule",
        " & ".join(header) + r" \\",
        "\\midrule",
    ]
    for number, finding in enumerate(run.findings):
        result = finding.result
        cells = [escape(finding.name)]
        below = [""]
        for d in tau_diffs:
            test = deciding_tau(result, d)
            cells.append("--" if test is None else _number(test.statistic, marker(test)))
            below.append("" if test is None else
                         f"{{\\footnotesize ({SPEC_CODES[test.spec]}, {test.lags})}}")
        kpss = kpss_tests(result)
        for d in kpss_diffs:
            test = kpss.get(d)
            cells.append("--" if test is None else _number(test.statistic, marker(test)))
            below.append("")
        cells.append(_verdict(result))
        below.append("")
        if number:
            lines.append("\\addlinespace")
        lines.append(" & ".join(cells) + r" \\")
        if any(below):
            lines.append(" & ".join(below) + r" \\")
    lines += ["\\bottomrule", "\\end{tabular}"]
    lines += ["", "\\par\\smallskip", f"\\parbox{{\\linewidth}}{{\\footnotesize {_notes(run)}}}", ""]
    return "\n".join(lines)


def _notes(run: RunRecord) -> str:
    settings = run.settings
    a = fmt.percent(settings.alpha)
    bound = ("maximum by Schwert's (1989) rule" if settings.max_lags is None
             else f"at most {settings.max_lags}")
    lag = (f"lag order fixed at {settings.lags}" if settings.lag_rule == "fixed"
           else f"lag order chosen by the {lag_rule_label(settings)}, {bound}")
    text = (
        "Notes: $\\tau$ is the augmented Dickey-Fuller statistic of the regression the testing "
        "sequence (Dolado, Jenkinson \\& Sosvilla-Rivero 1990) settled on for each difference; "
        "below each $\\tau$, in parentheses, the deterministic "
        "terms (ct constant and trend, c constant, n none) and the "
        f"{escape(lag)}. "
        "$^{***}$, $^{**}$, $^{*}$: rejection at 1\\%, 5\\%, 10\\%. Critical values: "
        "MacKinnon (2010) for $\\tau$, Dickey \\& Fuller (1981) for $\\Phi_1$, $\\Phi_3$; KPSS "
        "(Kwiatkowski et al.\\ 1992, null of stationarity, critical values from their Table 1) "
        "rejects for large values. The order "
        f"of integration was decided at the {escape(a)} level, from the highest difference down "
        "(Dickey \\& Pantula 1987)."
    )
    return text


def write_latex(path: Path, run: RunRecord, charts: Charts | None = None) -> None:
    write_text_atomic(path, run_to_latex(run))
