"""The self-test's check of the analysis process: a few series analysed in the child
process the window uses (``ui.engine_process``) must give what this process gives.

In a frozen bundle this is the only check that the child can be started at all: the
bundle's executable must answer ``multiprocessing``'s start of a child (``freeze_support``
in its entry point) instead of starting another program.  Nothing here imports Qt.
"""

from __future__ import annotations

import threading
from typing import TYPE_CHECKING

from tauscope.engine.compare import first_difference

if TYPE_CHECKING:
    import numpy as np

    from tauscope.engine import SeriesResult, Settings

ANSWER_S = 180.0  # the longest wait for the child's results (it loads the statistics first)
TOLERANCE = 1e-8  # the child analyses the series as one batch, this process one by one;
# batches agree to this (the fast path's promise, benchmarks/engine_vs_statsmodels.py)


def process_problems(pairs: list[tuple[str, np.ndarray]], here: list[SeriesResult],
                     settings: Settings, answer_s: float = ANSWER_S,
                     engine_name: str | None = None) -> list[str]:
    """Problems found when ``pairs`` are analysed in the analysis process and compared with
    ``here`` (the same series analysed in this process): none when every verdict, step and
    statistic agrees to :data:`TOLERANCE`.  ``engine_name``: the function the child runs
    (``"module:function"``; the engine's own unless a test gives a stand-in)."""
    from tauscope.ui.engine_process import ENGINE, EngineProcess

    engine = EngineProcess(engine_name or ENGINE)
    found: list[SeriesResult] = []
    failure: list[BaseException] = []

    def run() -> None:
        try:
            found.extend(engine.iter_analyse(pairs, settings))
        except BaseException as exc:  # reported below as one line
            failure.append(exc)

    worker = threading.Thread(target=run, name="tauscope-self-test-process", daemon=True)
    try:
        worker.start()
        worker.join(answer_s)
        if worker.is_alive():
            return [f"the analysis process gave no answer within {answer_s:.0f} s"]
        if failure:
            exc = failure[0]
            return [f"the analysis process failed: {type(exc).__name__}: {exc}"]
    finally:
        engine.shutdown()
    if len(found) != len(pairs):
        return [f"the analysis process returned {len(found)} results for {len(pairs)} series"]
    problems: list[str] = []
    for (name, _), mine, theirs in zip(pairs, here, found, strict=True):
        difference = first_difference(mine.to_dict(), theirs.to_dict(), TOLERANCE)
        if difference is not None:
            problems.append(f"{name}: the analysis process differs at {difference}")
    return problems
