"""gather_evidence: the extra tests on their own, computed (cross-check stage) and read
(read stage) in one call, for callers outside the pipeline."""

from __future__ import annotations

from collections.abc import Sequence
from typing import Any

import numpy as np
import pandas as pd

from tauscope.engine.procedure.cross_check import extra_evidence
from tauscope.engine.procedure.read import read_evidence
from tauscope.engine.results import Evidence, TestResult


def gather_evidence(
    x: np.ndarray,
    index: pd.Index | None = None,
    *,
    order: int | None,
    alpha: float = 0.05,
    kpss: Sequence[TestResult] = (),
    kpss_status: str | None = None,
    **options: Any,
) -> Evidence:
    """Run the extra tests the user turned on and say what they add.

    ``options`` are the keyword arguments of
    :func:`tauscope.engine.procedure.cross_check.extra_evidence` (``deterministic``,
    ``tests``, ``deciding_adf``, the lag choice, ``power``, ``recursive``, …), passed on
    unchanged; ``kpss`` (KPSS results already computed) and ``kpss_status`` (their
    agreement) are weighed by the reading with the extra tests.
    """
    extra = extra_evidence(x, index, order=order, alpha=alpha, **options)
    return read_evidence(extra, order, kpss, kpss_status, alpha)
