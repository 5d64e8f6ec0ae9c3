"""The methods paragraph: what was done, with which rule, bounds, sources and level.

The text is built from the settings and the results actually produced, so it
never claims a choice the run did not make.  Plain Unicode text; each writer
escapes it for its own format.
"""

from __future__ import annotations

from dataclasses import dataclass

from tauscope import engine
from tauscope.engine import formatting as fmt
from tauscope.engine.settings import UNION_STRATEGIES
from tauscope.engine.unitroot.union_components import SHORT_LENGTH, SHORT_MIN_LAG
from tauscope.report.run import RunRecord

REFERENCES = {
    "df1979": "Dickey, D.A. & Fuller, W.A. (1979), “Distribution of the Estimators for "
    "Autoregressive Time Series with a Unit Root”, Journal of the American Statistical "
    "Association 74(366), 427–431.",
    "df1981": "Dickey, D.A. & Fuller, W.A. (1981), “Likelihood Ratio Statistics for "
    "Autoregressive Time Series with a Unit Root”, Econometrica 49(4), 1057–1072.",
    "ers1996": "Elliott, G., Rothenberg, T.J. & Stock, J.H. (1996), “Efficient Tests for an "
    "Autoregressive Unit Root”, Econometrica 64(4), 813–836.",
    "dp1987": "Dickey, D.A. & Pantula, S.G. (1987), “Determining the Order of Differencing in "
    "Autoregressive Processes”, Journal of Business & Economic Statistics 5(4), 455–461.",
    "djs1990": "Dolado, J.J., Jenkinson, T. & Sosvilla-Rivero, S. (1990), “Cointegration and "
    "Unit Roots”, Journal of Economic Surveys 4(3), 249–273.",
    "hfo2004": "Hobijn, B., Franses, P.H. & Ooms, M. (2004), “Generalizations of the KPSS-test "
    "for Stationarity”, Statistica Neerlandica 58(4), 483–502.",
    "kpss1992": "Kwiatkowski, D., Phillips, P.C.B., Schmidt, P. & Shin, Y. (1992), “Testing the "
    "Null Hypothesis of Stationarity against the Alternative of a Unit Root: How Sure Are We "
    "that Economic Time Series Have a Unit Root?”, Journal of Econometrics 54(1–3), 159–178.",
    "mk1994": "MacKinnon, J.G. (1994), “Approximate Asymptotic Distribution Functions for "
    "Unit-Root and Cointegration Tests”, Journal of Business & Economic Statistics 12(2), "
    "167–176.",
    "mk1996": "MacKinnon, J.G. (1996), “Numerical Distribution Functions for Unit Root and "
    "Cointegration Tests”, Journal of Applied Econometrics 11(6), 601–618.",
    "mk2010": "MacKinnon, J.G. (2010), “Critical Values for Cointegration Tests”, Queen’s "
    "Economics Department Working Paper No. 1227, Queen’s University, Kingston, Ontario.",
    "nw1994": "Newey, W.K. & West, K.D. (1994), “Automatic Lag Selection in Covariance Matrix "
    "Estimation”, Review of Economic Studies 61(4), 631–653.",
    "np1995": "Ng, S. & Perron, P. (1995), “Unit Root Tests in ARMA Models with Data-Dependent "
    "Methods for the Selection of the Truncation Lag”, Journal of the American Statistical "
    "Association 90(429), 268–281.",
    "np2001": "Ng, S. & Perron, P. (2001), “Lag Length Selection and the Construction of Unit "
    "Root Tests with Good Size and Power”, Econometrica 69(6), 1519–1554.",
    "pn1996": "Perron, P. & Ng, S. (1996), “Useful Modifications to Some Unit Root Tests with "
    "Dependent Errors and Their Local Asymptotic Properties”, Review of Economic Studies 63(3), "
    "435–463.",
    "stock1999": "Stock, J.H. (1999), “A Class of Tests for Integration and Cointegration”, in "
    "R.F. Engle & H. White (eds), Cointegration, Causality and Forecasting: A Festschrift in "
    "Honour of Clive W.J. Granger, Oxford University Press, 135–167.",
    "pp1988": "Phillips, P.C.B. & Perron, P. (1988), “Testing for a Unit Root in Time Series "
    "Regression”, Biometrika 75(2), 335–346.",
    "sd1984": "Said, S.E. & Dickey, D.A. (1984), “Testing for Unit Roots in "
    "Autoregressive-Moving Average Models of Unknown Order”, Biometrika 71(3), 599–607.",
    "schwert1989": "Schwert, G.W. (1989), “Tests for Unit Roots: A Monte Carlo Investigation”, "
    "Journal of Business & Economic Statistics 7(2), 147–159.",
    "za1992": "Zivot, E. & Andrews, D.W.K. (1992), “Further Evidence on the Great Crash, the "
    "Oil-Price Shock, and the Unit-Root Hypothesis”, Journal of Business & Economic Statistics "
    "10(3), 251–270.",
    "ls2013": "Lee, J. & Strazicich, M.C. (2013), “Minimum LM Unit Root Test with One "
    "Structural Break”, Economics Bulletin 33(4), 2483–2492.",
    "akaike1974": "Akaike, H. (1974), “A New Look at the Statistical Model Identification”, "
    "IEEE Transactions on Automatic Control 19(6), 716–723.",
    "hlt2007": "Harvey, D.I., Leybourne, S.J. & Taylor, A.M.R. (2007), “A Simple, Robust and "
    "Powerful Test of the Trend Hypothesis”, Journal of Econometrics 141(2), 1302–1330.",
    "hlt2009": "Harvey, D.I., Leybourne, S.J. & Taylor, A.M.R. (2009), “Unit Root Testing in "
    "Practice: Dealing with Uncertainty over the Trend and Initial Condition”, Econometric "
    "Theory 25(3), 587–636.",
    "hlt2012": "Harvey, D.I., Leybourne, S.J. & Taylor, A.M.R. (2012), “Testing for Unit Roots in "
    "the Presence of Uncertainty over Both the Trend and Initial Condition”, Journal of "
    "Econometrics 169(2), 188–195.",
    "pq2007": "Perron, P. & Qu, Z. (2007), “A Simple Modification to Improve the Finite Sample "
    "Properties of Ng and Perron’s Unit Root Tests”, Economics Letters 94(1), 12–19.",
    "ct2008": "Cavaliere, G. & Taylor, A.M.R. (2008), “Bootstrap Unit Root Tests for Time Series with "
    "Nonstationary Volatility”, Econometric Theory 24(1), 43–71.",
    "st2012": "Smeekes, S. & Taylor, A.M.R. (2012), “Bootstrap Union Tests for Unit Roots in the "
    "Presence of Nonstationary Volatility”, Econometric Theory 28(2), 422–456.",
    "df2008": "Davidson, R. & Flachaire, E. (2008), “The Wild Bootstrap, Tamed at Last”, Journal of "
    "Econometrics 146(1), 162–169.",
    "sac2004": "Sansó, A., Aragó, V. & Carrion-i-Silvestre, J.L. (2004), “Testing for Changes in the "
    "Unconditional Variance of Financial Time Series”, Revista de Economía Financiera 4, 32–53.",
    "dbm1986": "Dickey, D.A., Bell, W.R. & Miller, R.B. (1986), “Unit Roots in Time Series "
    "Models: Tests and Implications”, The American Statistician 40(1), 12–26.",
    "hegy1990": "Hylleberg, S., Engle, R.F., Granger, C.W.J. & Yoo, B.S. (1990), “Seasonal "
    "Integration and Cointegration”, Journal of Econometrics 44(1–2), 215–238.",
    "bm1993": "Beaulieu, J.J. & Miron, J.A. (1993), “Seasonal Unit Roots in Aggregate U.S. "
    "Data”, Journal of Econometrics 55(1–2), 305–328.",
    "west1988": "West, K.D. (1988), “Asymptotic Normality, When Regressors Have a Unit Root”, "
    "Econometrica 56(6), 1397–1417.",
}

_RULE_SENTENCES = {
    "aic": "the Akaike information criterion (AIC)",
    "bic": "the Schwarz-Bayes information criterion (BIC)",
    "hqc": "the Hannan-Quinn criterion (HQC)",
}

CAUTION = (
    "A unit-root test is an aid to judgement, not proof: these tests have little power against "
    "a stationary series with a root close to one over a short span, a break in level or trend "
    "can look like a unit root, and the data definitions and any breaks in the source series "
    "matter as much as the statistics."
)


@dataclass(frozen=True)
class Methods:
    """``paragraphs`` of plain text and the full ``references`` they cite, alphabetical."""

    paragraphs: tuple[str, ...]
    references: tuple[str, ...]

    @property
    def text(self) -> str:
        return "\n\n".join(self.paragraphs)


def _lag_sentence(run: RunRecord, cited: set[str]) -> str:
    settings = run.settings
    tested = [f.result for f in run.findings if f.result.ok]
    if settings.lag_rule == "fixed":
        return (f"The number of lagged differences was fixed at {settings.lags} in every "
                "regression (Said & Dickey 1984).")
    cited.add("np1995")
    if settings.lag_rule == "tsig":
        rule = ("a general-to-specific search that starts from the maximum and drops the last "
                "lagged difference while its t statistic is below 1.645 in absolute value "
                "(10% two-sided; Ng & Perron 1995)")
    elif settings.lag_rule == "maic":
        cited.add("np2001")
        rule = ("the modified Akaike information criterion (MAIC) of Ng & Perron (2001), "
                "compared on a common sample (Ng & Perron 1995)")
    else:
        rule = (f"{_RULE_SENTENCES[settings.lag_rule]}, compared across lag orders on a common "
                "sample (Ng & Perron 1995)")
    bounds = sorted({r.max_lags for r in tested if r.max_lags is not None})
    if settings.max_lags is None:
        cited.add("schwert1989")
        bound = ("with the maximum lag order set by Schwert’s (1989) rule, "
                 "floor(12 (T/100)^(1/4)) for T observations")
    else:
        bound = f"with a maximum lag order of {settings.max_lags}"
    if len(bounds) == 1:
        bound += f" (here {bounds[0]} on the levels)"
    elif bounds:
        bound += f" (here between {bounds[0]} and {bounds[-1]} on the levels, by series length)"
    if settings.max_lags is not None and any(b < settings.max_lags for b in bounds):
        bound += "; it was lowered where a series was too short for it"
    return (f"The number of lagged differences p, which absorbs serial correlation in the errors "
            f"(Said & Dickey 1984), was chosen by {rule}, {bound}. The chosen regression was then "
            "re-estimated on the longest sample its lag order allows.")


def _critical_sentence(run: RunRecord, a: str) -> str:
    """Where the critical values and p-values came from: the published tables, or nulls
    simulated at each regression's own size (``Settings.critical_values == "exact"``)."""
    if run.simulated_critical_values:
        return (
            " Critical values and p-values of τ and of Φ1, Φ2 and Φ3 were simulated for this run: "
            "for each regression, its statistic's null distribution under a driftless Gaussian "
            "random walk was drawn at the regression's own number of observations and lag order "
            "(with a fixed seed, so the same data give the same values), instead of the published "
            "tables; a regression too short to simulate kept the published values (MacKinnon "
            "2010 for τ; Dickey & Fuller 1981, Tables IV–VI, for Φ). "
            f"Every test in the sequence used the {a} significance level."
        )
    return (
        " Critical values of τ are MacKinnon’s (2010) finite-sample response surfaces and its "
        "p-values MacKinnon’s approximate distribution functions (MacKinnon 1994, 1996); critical "
        "values of Φ1, Φ2 and Φ3 are from Dickey & Fuller (1981, Tables IV–VI), interpolated in "
        f"the sample size. Every test in the sequence used the {a} significance level."
    )


def _cross_checks(run: RunRecord, a: str, cited: set[str]) -> list[str]:
    """A paragraph on KPSS and one on the other checks, each naming only what ran (read from
    the tests and the evidence in the findings)."""
    ran = set(run.tests_run)
    simulated = run.simulated_critical_values
    out: list[str] = []
    more: list[str] = []
    if "kpss" in ran:
        cited.update({"kpss1992", "hfo2004"})
        out.append(
            "As a cross-check, the verdict was confronted with the KPSS test (Kwiatkowski, "
            "Phillips, Schmidt & Shin 1992), whose null hypothesis is stationarity, with the "
            "automatic bandwidth of Hobijn, Franses & Ooms (2004) and the Bartlett kernel, at "
            f"the same {a} level; a verdict is “confirmed” when both kinds of test point the "
            "same way."
        )
    where = ("on the difference where the verdict was settled, with the deterministic terms "
             "of the stationary alternative it competes with")
    if "pp" in ran:
        cited.update({"pp1988", "nw1994"})
        source = ("simulated at the same sample size" if simulated
                  else "MacKinnon’s (2010) values for τ")
        more.append(
            f"The Phillips-Perron Zτ test (Phillips & Perron 1988) ran {where}; it corrects for "
            "serial correlation with a Bartlett long-run variance (bandwidth by the Newey & West "
            f"1994 rule) instead of lagged differences; critical values: {source}."
        )
    if "dfgls" in ran:
        cited.add("ers1996")
        source = ("simulated at the same sample size" if simulated
                  else "MacKinnon (2010) without deterministic terms for a mean, Elliott, "
                  "Rothenberg & Stock (1996, Table 1) for a trend")
        more.append(
            f"The DF-GLS test (Elliott, Rothenberg & Stock 1996) ran {where}, after GLS "
            f"detrending; critical values: {source}."
        )
    if "za" in ran:
        cited.add("za1992")
        more.append(
            f"The Zivot-Andrews test (Zivot & Andrews 1992), which lets one break at a date "
            f"chosen from the data enter the alternative, ran {where}; its critical values are "
            "simulated quantiles for a long series (100,000 replications of 2,000 observations)."
        )
    tested = [f.name for f in run.findings
              if f.result.breaks is not None and f.result.breaks.test is not None]
    if tested:
        cited.update({"ls2013", "akaike1974"})
        which = ("for every series" if len(tested) == len(run.findings)
                 else "for " + ", ".join(tested))
        more.append(
            "A break in level was looked for (an unusually large one-period change, the verdict "
            "and KPSS at odds, or a large swing of τ over an expanding window); where one was "
            f"suspected, {which}, the minimum LM test with one level shift allowed under both "
            "hypotheses (Lee & Strazicich 2013) ran on the levels (without their fixed seasonal "
            "means where the unit-root tests removed them), its lag order chosen by the "
            "Akaike criterion (Akaike 1974, at most 8), its critical values simulated at the series’ own length."
        )
    if getattr(run.settings, "break_check", "automatic") == "off":
        more.append("The break check was turned off in the settings: no series was checked for a "
                    "break in level, and no verdict was given under one.")
    powers = [f.result.evidence.power for f in run.findings
              if f.result.evidence is not None and f.result.evidence.power is not None]
    if powers:
        coefficients = sorted({float(c) for p in powers for c in p.coefficients})
        listed = " and ".join(f"{c:.2f}" for c in coefficients)
        more.append(
            "The power of the deciding τ at each series’ own length was simulated against "
            f"stationary AR(1) processes with coefficient {listed}, with the critical value the "
            "sequence used."
        )
    if more:
        out.append(" ".join(more))
    return out


def left_out_note(run: RunRecord) -> str | None:
    """The visible note on findings kept out of the report (made with other settings)."""
    if not run.left_out:
        return None
    count = len(run.left_out)
    return (f"Not in this report ({count} series analysed with other settings than the ones "
            "stated here): " + "; ".join(item.reason for item in run.left_out) + ".")


def tests_words(run: RunRecord) -> str:
    """The tests that ran, as a reader names them: "ADF τ, Φ1, Φ3, KPSS"."""
    names = {"adf": "ADF τ", "phi1": "Φ1", "phi2": "Φ2", "phi3": "Φ3", "kpss": "KPSS",
             "pp": "Phillips-Perron", "dfgls": "DF-GLS", "za": "Zivot-Andrews"}
    return ", ".join(names.get(t, t) for t in run.tests_run) or "none"


def critical_words(run: RunRecord) -> str:
    """The source of critical values in a few words (for the "About this run" block)."""
    if run.simulated_critical_values:
        return "simulated at each regression's own size and lag order"
    return "published tables (MacKinnon 2010; Dickey & Fuller 1981)"


# The union's parts, said the same way whichever critical value judges it.
_COMPONENTS = ("the Dickey-Fuller t statistic on the GLS-detrended series (Elliott, Rothenberg & Stock "
               "1996) and the MSB statistic (Stock 1999; Perron & Ng 1996) on the OLS-detrended series, "
               "with the autoregressive estimate of the long-run variance of Ng & Perron (2001), each "
               "with a constant and with a trend")
_ORDER_TERMS = (
    f" On the levels of a series of fewer than {SHORT_LENGTH} values the lag order was at least "
    f"{SHORT_MIN_LAG} and the critical values were simulated with the lag choice included (a rule of "
    "this program, set on its own simulations). The order was found from the highest difference down, "
    "and the deterministic terms by the trend test of Harvey, Leybourne & Taylor (2007), valid with or "
    "without a unit root. The sequence above was computed as well and is reported beside it.")
_VOLATILITY = (" A change in the size of the shocks was tested with the κ2 statistic of Sansó, Aragó & "
               "Carrion-i-Silvestre (2004) on the residuals of the Dickey-Fuller regression with a trend; "
               "where it was found, the verdict is not graded as confirmed.")


def _lags_order_terms(run: RunRecord) -> str:
    """The union's lag order (MAIC whatever the sequence's rule, a fixed order excepted), the
    short-sample rule, the order and the terms."""
    if getattr(run.settings, "lag_rule", "maic") == "fixed":
        lags = "the lag order fixed as the settings asked."
    else:
        lags = ("the lag order by the modified AIC of Ng & Perron (2001), built for these statistics, "
                "whatever rule the settings name for the sequence, chosen on the OLS-detrended series "
                "(Perron & Qu 2007).")
    return lags + _ORDER_TERMS


def _union_paragraph(run: RunRecord, a: str, cited: set[str]) -> list[str]:
    """The size-controlled strategy, when it decided the verdicts."""
    strategy = getattr(run.settings, "strategy", "classic")
    if strategy not in UNION_STRATEGIES:
        return []
    cited.update({"hlt2007", "hlt2009", "hlt2012", "ers1996", "pq2007", "sac2004", "np2001", "pn1996",
                   "stock1999"})
    if strategy == "bootstrap":
        cited.update({"ct2008", "st2012", "df2008"})
        return [
            "The verdict was decided by the union of rejections over the deterministic terms (Harvey, "
            "Leybourne & Taylor 2009, 2012), with its critical value from the wild bootstrap of Smeekes & "
            "Taylor (2012) (after Cavaliere & Taylor 2008), which stays valid when the variance of the "
            "shocks changes over the sample: " + _COMPONENTS + ", the "
            "largest ratio of each to its own critical value compared with the "
            f"{100 * (1 - run.settings.alpha):.0f}% quantile of the same ratio over {engine.BOOTSTRAP_REPS} "
            "bootstrap series. These were built under the unit-root null from the residuals of an "
            "autoregression of the differenced series (lag order the larger of the union's two), each "
            "multiplied by a random sign (Rademacher weights, Davidson & Flachaire 2008) and recoloured "
            "with the fitted lag polynomial, with a seed taken from the series' own values; " + _lags_order_terms(run)
            + _VOLATILITY
        ]
    return [
        "The verdict was decided by the union of rejections over the deterministic terms (Harvey, "
        "Leybourne & Taylor 2009, 2012): " + _COMPONENTS + ", each "
        "compared with its own critical value scaled by a constant simulated at the series' length, "
        f"so that the whole decision on each difference has size {a}; " + _lags_order_terms(run) + _VOLATILITY
    ]


def _seasonal_paragraph(run: RunRecord, a: str, cited: set[str]) -> list[str]:
    """Fixed seasonal means and seasonal unit roots, when quarterly or monthly series had them
    tested (the ``seasonal`` setting not "never")."""
    checked = [f.result.seasonal for f in run.findings if f.result.seasonal is not None]
    if not checked:
        return []
    used = sum(1 for c in checked if c.means is not None and c.means.used)
    cited.update({"dbm1986", "hegy1990", "bm1993"})
    mode = getattr(run.settings, "seasonal", "automatic")
    rule = ("allowed for in every quarterly and monthly series, as the settings asked"
            if mode == "always" else
            "allowed for where the F test of seasonal dummies in the Dickey-Fuller regression of "
            "the first difference (with a constant, y(t−1) and lagged differences chosen by AIC) "
            "rejected at 1%")
    return [
        f"Fixed seasonal means were {rule} ({used} of {len(checked)} series): each season's mean "
        "was removed from every difference before the unit-root tests, which gives the tests the "
        "limits they have with seasonal dummies in the regression (Dickey, Bell & Miller 1986); "
        "the constants of the size-controlled decision were simulated with the same removal at "
        "each series' length. Seasonal unit roots were tested with the HEGY test (Hylleberg, "
        "Engle, Granger & Yoo 1990) for quarterly series and the Beaulieu-Miron test (Beaulieu & "
        "Miron 1993) for monthly ones, with seasonal dummies, lagged seasonal differences chosen "
        f"by AIC and critical values simulated at each series' length, at {a}."
    ]


def methods_for(run: RunRecord) -> Methods:
    """The methods paragraph and reference list for this run, read from its record: the
    settings, the source of critical values, and the tests that ran."""
    settings = run.settings
    a = fmt.percent(settings.alpha)
    cited = {"df1979", "df1981", "sd1984", "djs1990", "west1988"}
    if not run.simulated_critical_values:
        cited.update({"mk1994", "mk1996"})
    cited.add("mk2010")
    if settings.max_difference > 0:
        cited.add("dp1987")
    n = len(run.findings)
    d = settings.max_difference
    highest = {0: "the levels only", 1: "the first difference", 2: "the second difference"}[d]
    first = (
        f"Each of the {n} series was tested for a unit root with the augmented Dickey-Fuller "
        "test (Dickey & Fuller 1979; Said & Dickey 1984), in the regression "
        "Δy(t) = a0 + a2·t + γ·y(t−1) + Σ βi·Δy(t−i) + e(t), with p lagged differences "
        "(i = 1, …, p); τ is the t statistic of γ. "
        "The deterministic terms were chosen by the testing sequence of Dolado, Jenkinson & "
        "Sosvilla-Rivero (1990): the regression with constant and trend first; if τ does not "
        "reject, the joint test Φ3 decides whether the trend belongs; then the regression with "
        "a constant only, with Φ1 for the drift; then the regression without deterministic "
        "terms. Where a trend or drift was found to belong, τ was compared with the standard "
        "normal (West 1988)."
    )
    if d > 0:
        first += (
            f" The order of integration was found from the highest difference down (Dickey & "
            f"Pantula 1987): testing started on {highest} and moved to the next lower "
            "difference only while the unit root was rejected."
        )
    if getattr(settings, "strategy", "classic") not in UNION_STRATEGIES:  # else in the union's
        cited.add("sac2004")
        first += _VOLATILITY
    second = _lag_sentence(run, cited) + _critical_sentence(run, a)
    paragraphs = [first, second, *_union_paragraph(run, a, cited), *_seasonal_paragraph(run, a, cited),
                  *_cross_checks(run, a, cited)]
    paragraphs.append(CAUTION)
    return Methods(tuple(paragraphs), tuple(sorted(REFERENCES[key] for key in cited)))
