"""The methods paragraph says what this run actually did and cites it in full."""

from __future__ import annotations

import dataclasses

import numpy as np
import pytest

from tauscope.engine import Settings, analyse_series
from tauscope.report import Finding, RunRecord
from tauscope.report.methods import CAUTION, methods_for
from test_report_support import make_run


def _with(settings: Settings) -> RunRecord:
    return dataclasses.replace(make_run(), settings=settings)


def test_default_run_states_sequence_rule_sources_level_and_caution() -> None:
    run = make_run()
    methods = methods_for(run)
    text = methods.text
    assert "Dolado, Jenkinson & Sosvilla-Rivero (1990)" in text
    assert "highest difference down (Dickey & Pantula 1987)" in text
    assert "second difference" in text  # max_difference = 2 by default
    assert "Akaike information criterion" in text
    assert "Schwert’s (1989) rule" in text
    bounds = sorted({f.result.max_lags for f in run.findings if f.result.max_lags is not None})
    assert f"between {bounds[0]} and {bounds[-1]}" in text or f"(here {bounds[0]} " in text
    assert "MacKinnon’s (2010)" in text and "MacKinnon 1994, 1996" in text
    assert "Dickey & Fuller (1981" in text
    assert "Kwiatkowski" in text
    assert "the 5% significance level" in text
    assert methods.paragraphs[-1] == CAUTION
    refs = " ".join(methods.references)
    for author_year in ("Dickey, D.A. & Fuller, W.A. (1979)", "Dickey, D.A. & Fuller, W.A. (1981)",
                        "Said, S.E. & Dickey, D.A. (1984)", "MacKinnon, J.G. (1996)",
                        "MacKinnon, J.G. (2010)", "Ng, S. & Perron, P. (1995)",
                        "Dolado, J.J., Jenkinson, T. & Sosvilla-Rivero, S. (1990)",
                        "Kwiatkowski, D., Phillips, P.C.B., Schmidt, P. & Shin, Y. (1992)",
                        "Schwert, G.W. (1989)"):
        assert author_year in refs
    # The default since issue 13: MAIC lags and the size-controlled strategy, described and cited.
    assert "Ng, S. & Perron, P. (2001)" in refs
    assert "union of rejections" in text
    for author_year in ("Harvey, D.I., Leybourne, S.J. & Taylor, A.M.R. (2007)",
                        "Harvey, D.I., Leybourne, S.J. & Taylor, A.M.R. (2009)",
                        "Harvey, D.I., Leybourne, S.J. & Taylor, A.M.R. (2012)",
                        # the union's OLS components: MSB with Ng & Perron's (2001) s²_AR
                        "Perron, P. & Ng, S. (1996)", "Stock, J.H. (1999)"):
        assert author_year in refs
    assert "MSB statistic" in text and "fewer than 100" in text
    assert list(methods.references) == sorted(methods.references)


def test_maic_cites_ng_perron_2001() -> None:
    methods = methods_for(_with(Settings(lag_rule="maic")))
    assert "modified Akaike information criterion (MAIC) of Ng & Perron (2001)" in methods.text
    assert any(r.startswith("Ng, S. & Perron, P. (2001)") for r in methods.references)


def test_fixed_lags_and_user_bound_are_stated_without_schwert() -> None:
    fixed = methods_for(_with(Settings(lag_rule="fixed", lags=3)))
    classic = methods_for(_with(Settings(lag_rule="aic", strategy="classic")))
    assert "union of rejections" not in classic.text
    assert not any(r.startswith(("Ng, S. & Perron, P. (2001)", "Harvey")) for r in classic.references)
    assert "fixed at 3" in fixed.text
    # No lag rule to cite with fixed lags; Ng & Perron (2001) stays cited by the default
    # strategy for the MSB components' long-run variance (since the M-statistics study).
    assert not any(r.startswith("Ng, S. & Perron, P. (1995)") for r in fixed.references)
    assert "MAIC" not in fixed.text
    assert not any(r.startswith("Schwert") for r in fixed.references)
    bounded = methods_for(_with(Settings(lag_rule="bic", max_lags=4)))
    assert "maximum lag order of 4" in bounded.text
    assert "Schwarz-Bayes" in bounded.text
    assert "Schwert" not in bounded.text


@pytest.mark.parametrize(("alpha", "words"), [(0.01, "1%"), (0.10, "10%")])
def test_level_actually_used(alpha: float, words: str) -> None:
    assert f"the {words} significance level" in methods_for(_with(Settings(alpha=alpha))).text


def test_without_confirmation_test_kpss_is_not_claimed() -> None:
    settings = Settings(confirm=(), max_difference=0)
    rng = np.random.default_rng(11)
    result = analyse_series(np.cumsum(rng.normal(size=80)), settings, "walk")
    methods = methods_for(RunRecord(settings, (), (Finding(result),)))
    assert "KPSS" not in methods.text
    assert not any(r.startswith("Kwiatkowski") for r in methods.references)
    assert "Dickey & Pantula" not in methods.text  # only the levels were tested


def test_break_test_is_described_only_when_it_ran() -> None:
    """The minimum LM break test (Lee & Strazicich 2013) enters the methods text, with its lag
    rule, only for a run where a series had a break suspected and the test ran."""
    rng = np.random.default_rng(5)
    u = np.zeros(300)
    e = rng.normal(size=300)
    for t in range(1, 300):
        u[t] = 0.5 * u[t - 1] + e[t]
    shifted = analyse_series(3.0 + 6.0 * (np.arange(200) >= 100) + u[100:], name="shifted")
    plain = analyse_series(u[100:], name="plain")
    assert shifted.breaks is not None and shifted.breaks.test is not None
    assert plain.breaks is None or plain.breaks.test is None
    settings = Settings()
    both = methods_for(RunRecord(settings, (), (Finding(shifted), Finding(plain))))
    assert "Lee & Strazicich 2013" in both.text and "for shifted," in both.text
    assert "Akaike criterion" in both.text
    assert any(r.startswith("Lee, J. & Strazicich, M.C. (2013)") for r in both.references)
    alone = methods_for(RunRecord(settings, (), (Finding(plain),)))
    assert "Strazicich" not in alone.text
    assert not any(r.startswith("Lee, J.") for r in alone.references)


def test_break_check_turned_off_is_stated() -> None:
    plain = analyse_series(np.random.default_rng(7).normal(size=120), Settings(break_check="off"),
                           name="plain")
    off = methods_for(RunRecord(Settings(break_check="off"), (), (Finding(plain),)))
    assert "break check was turned off" in off.text
    assert "turned off" not in methods_for(RunRecord(Settings(), (), (Finding(plain),))).text


def test_bootstrap_strategy_is_described_and_cited() -> None:
    """The wild bootstrap strategy: its paper (Smeekes & Taylor 2012, Econometric Theory 28),
    the earlier one (Cavaliere & Taylor 2008, Econometric Theory 24), the multipliers and B."""
    methods = methods_for(_with(Settings(strategy="bootstrap")))
    text = methods.text
    assert "wild bootstrap of Smeekes & Taylor (2012)" in text and "over 499 bootstrap series" in text
    assert "Rademacher" in text and "recoloured" in text
    refs = " ".join(methods.references)
    assert "Econometric Theory 28(2)" in refs and "Econometric Theory 24(1)" in refs
    assert "Sansó, A., Aragó, V. & Carrion-i-Silvestre, J.L. (2004)" in refs
    assert "wild bootstrap" not in methods_for(_with(Settings())).text


def test_variance_change_test_is_stated_under_every_strategy_once() -> None:
    """κ2 (Sansó, Aragó & Carrion-i-Silvestre 2004) runs whatever the strategy, so the methods
    say so, once, under the classic sequence as under the union, and cite it."""
    for strategy in ("classic", "union", "bootstrap"):
        methods = methods_for(_with(Settings(strategy=strategy)))
        assert methods.text.count("κ2 statistic of Sansó, Aragó & Carrion-i-Silvestre (2004)") == 1, strategy
        assert any(r.startswith("Sansó, A., Aragó, V. & Carrion-i-Silvestre, J.L. (2004)")
                   for r in methods.references), strategy
