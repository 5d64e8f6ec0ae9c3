"""gather_evidence: the extra tests on their own, computed (cross-check stage) and read
(read stage) in one call, for callers outside the pipeline."""

from __future__ import annotations

from collections.abc import Sequence

import numpy as np
import pandas as pd

from tauscope.engine.distributions.simulate import DEFAULT_REPS, DEFAULT_SEED, EXACT_REPS
from tauscope.engine.procedure.cross_check import extra_evidence
from tauscope.engine.procedure.read import read_evidence
from tauscope.engine.procedure.stages import EXTRA_TESTS
from tauscope.engine.results import Evidence, TestResult


def gather_evidence(
    x: np.ndarray,
    index: pd.Index | None = None,
    *,
    order: int | None,
    deterministic: str | None,
    alpha: float = 0.05,
    tests: Sequence[str] = EXTRA_TESTS,
    deciding_adf: TestResult | None = None,
    kpss: Sequence[TestResult] = (),
    kpss_status: str | None = None,
    lag_rule: str = "aic",
    lags: int | None = None,
    max_lags: int | None = None,
    za_lags: int | None = None,
    break_model: str = "ct",
    critical_values: str = "mackinnon",
    power: bool = True,
    recursive: bool = True,
    reps: int = DEFAULT_REPS,
    exact_reps: int = EXACT_REPS,
    seed: int = DEFAULT_SEED,
) -> Evidence:
    """Run the extra tests the user turned on and say what they add.

    The arguments are those of :func:`tauscope.engine.procedure.cross_check.extra_evidence`,
    plus ``kpss`` (KPSS results already computed) and ``kpss_status`` (their agreement),
    which the reading weighs with the extra tests.
    """
    extra = extra_evidence(
        x, index, order=order, deterministic=deterministic, alpha=alpha, tests=tests,
        deciding_adf=deciding_adf, lag_rule=lag_rule, lags=lags, max_lags=max_lags,
        za_lags=za_lags, break_model=break_model, critical_values=critical_values, power=power,
        recursive=recursive, reps=reps, exact_reps=exact_reps, seed=seed,
    )
    return read_evidence(extra, order, kpss, kpss_status, alpha)
