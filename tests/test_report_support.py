"""Shared material for the report tests: one small run on simulated data with a fixed seed.

Not a test module by itself (no tests here); the report tests import it.
The series are built to cover the verdicts the writers must show: an I(1)
series with drift, a stationary one, an I(2) one, one whose name looks like a
spreadsheet formula, and one too short to test.
"""

from __future__ import annotations

import functools

import numpy as np
import pandas as pd

from tauscope.engine import SeriesResult, Settings, analyse_series
from tauscope.report import Finding, RunRecord, SourceFile

SEED = 3
N = 140
FORMULA_NAME = '=HYPERLINK("http://example.invalid","x")'
SOURCE = "/data/macro quarterly.xlsx"
SOURCE_SHA = "0123456789abcdef" * 4


def simulated_series() -> dict[str, pd.Series]:
    rng = np.random.default_rng(SEED)
    index = pd.period_range("1985Q1", periods=N, freq="Q")
    shocks = rng.normal(size=(4, N + 30))
    ar = np.convolve(shocks[1], 0.6 ** np.arange(30), "valid")[:N]
    return {
        "Real output & <prices>": pd.Series(np.cumsum(0.5 + shocks[0][:N]), index=index),
        "Unemployment rate": pd.Series(6.0 + ar, index=index),
        FORMULA_NAME: pd.Series(np.cumsum(np.cumsum(shocks[2][:N])), index=index),
        "-3 too short": pd.Series([1.0, 2.0, 4.0], index=index[:3]),
    }


def run_settings(alpha: float = 0.05, exact: bool = False,
                 checks: tuple[str, ...] = ("kpss",), strategy: str = "union") -> Settings:
    return Settings(alpha=alpha, critical_values="exact" if exact else "mackinnon",
                    confirm=checks, strategy=strategy)


@functools.lru_cache(maxsize=4)
def results(alpha: float = 0.05, exact: bool = False, checks: tuple[str, ...] = ("kpss",),
            strategy: str = "union") -> tuple[SeriesResult, ...]:
    settings = run_settings(alpha, exact, checks, strategy)
    return tuple(analyse_series(v, settings, name) for name, v in simulated_series().items())


def make_run(alpha: float = 0.05, exact: bool = False,
             checks: tuple[str, ...] = ("kpss",), strategy: str = "union") -> RunRecord:
    """The run on the simulated series; ``exact``: critical values simulated at each
    regression's size; ``checks``: the cross-check tests; ``strategy``: the deciding one."""
    findings = tuple(
        Finding(r, file=SOURCE, sheet="Quarterly", column=r.name, frequency="quarterly",
                key=f"macro quarterly.xlsx|Quarterly|{r.name}|")
        for r in results(alpha, exact, checks, strategy)
    )
    return RunRecord(run_settings(alpha, exact, checks, strategy), (SourceFile(SOURCE, SOURCE_SHA),),
                     findings)
