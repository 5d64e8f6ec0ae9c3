"""Words and number formats the window shows (numbers through tauscope.engine.formatting)."""

from __future__ import annotations

from tauscope.engine import formatting as fmt
from tauscope.engine.reading.words import decision_word

STATISTIC_SYMBOLS = {"tau": "τ", "phi1": "Φ1", "phi2": "Φ2", "phi3": "Φ3", "z": "z", "kpss": "KPSS",
                     "adf": "τ", "pp": "Zτ", "dfgls": "τ-GLS", "za": "ZA", "union": "M",
                     "trend": "z_λ", "msb": "MSB"}

STATISTIC_TIPS = {
    "tau": "τ (tau) is the t ratio on y(t−1) in the ADF regression. Strongly negative values are "
           "evidence against a unit root. It is compared with Dickey-Fuller critical values, "
           "not with the ordinary t table.",
    "phi1": "Φ1 is an F test of “no constant and a unit root” together. A large value says the "
            "constant (a drift) belongs in the regression.",
    "phi2": "Φ2 is an F test of “no constant, no trend and a unit root” together. A large value "
            "says some deterministic term belongs in the regression.",
    "phi3": "Φ3 is an F test of “no trend and a unit root” together. A large value says the "
            "trend belongs in the regression.",
    "z": "Once a trend or a drift is known to belong, the unit-root t ratio follows the "
         "standard normal, so it is compared with normal critical values (West 1988).",
    "kpss": "KPSS takes stationarity as its starting point (the null). Rejecting it points to a "
            "unit root, the opposite direction from the ADF test, so the two cross-check each other.",
    "pp": "Phillips-Perron Zτ (Phillips & Perron 1988): the Dickey-Fuller t ratio corrected for "
          "autocorrelated errors with a long-run variance estimate instead of lagged differences; "
          "same critical values as τ.",
    "dfgls": "DF-GLS (Elliott, Rothenberg & Stock 1996): the mean or trend is removed by GLS "
             "before the Dickey-Fuller regression, which gives the test more power near a unit "
             "root.",
    "msb": "MSB (Stock 1999; Perron & Ng 1996; Ng & Perron 2001): the spread of the demeaned "
           "or detrended series measured against its long-run variance. Small values are "
           "evidence against a unit root. One of the four parts of the size-controlled test.",
    "za": "Zivot-Andrews (Zivot & Andrews 1992): a unit-root test that allows one break in the "
          "level and/or the trend at the date where the evidence against a unit root is "
          "strongest.",
}

EXTRA_TEST_NAMES = {"kpss": "KPSS", "pp": "Phillips-Perron", "dfgls": "DF-GLS",
                    "za": "Zivot-Andrews"}
OUT_OF_DATE = "(settings changed — run again)"

GUIDE_ANCHORS = {"tau": "tau", "adf": "tau", "phi1": "phi", "phi2": "phi", "phi3": "phi",
                 "z": "z", "kpss": "kpss", "pp": "pp", "dfgls": "dfgls", "za": "za",
                 "union": "strategy", "trend": "strategy", "msb": "strategy"}

DIFFERENCE_NAMES = {0: "Levels", 1: "First difference", 2: "Second difference"}
DIFFERENCE_SHORT = {0: "Levels", 1: "1st diff.", 2: "2nd diff."}
SPEC_NAMES = {"trend": "constant and trend", "constant": "constant only",
              "none": "no constant or trend"}
SPEC_SHORT = {"trend": "trend", "constant": "constant", "none": "no terms", "union": "all terms"}
LAG_RULE_SHORT = {"aic": "AIC", "bic": "BIC", "hqc": "HQC", "tsig": "t-sig", "maic": "MAIC",
                  "fixed": "fixed"}
GUIDE_HINT = "\nPress F1 for the guide's section on this."


def decision_text(decision: str) -> str:
    """The engine's decision in the window's words (never "accept")."""
    return decision_word(decision)


def statistic_text(statistic_name: str, value: float | None) -> str:
    return f"{STATISTIC_SYMBOLS.get(statistic_name, statistic_name)} = {fmt.stat(value)}"


def lag_text(lags: int, rule: str) -> str:
    """The lag order (or bandwidth) and, in a word, the rule that chose it, e.g. "4 (AIC)",
    "6 (auto)" for an automatic bandwidth; the cell's tooltip names the rule in full."""
    if not rule:
        return str(lags)
    short = LAG_RULE_SHORT.get(rule) or LAG_RULE_SHORT.get(rule.lower())
    if short is None:
        words = rule.lower()
        short = "auto" if "automatic" in words else "fixed" if "fixed" in words else ""
    return f"{lags} ({short})" if short else str(lags)


def where_text(difference: int, spec: str) -> str:
    """Short words for where a step ran, e.g. "1st diff. · trend" (the regression with constant
    and trend); the step's tooltip has the full sentence."""
    return f"{DIFFERENCE_SHORT.get(difference, f'Difference {difference}')} · {SPEC_SHORT.get(spec, spec)}"
