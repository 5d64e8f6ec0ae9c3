"""Lean ADF work against a statsmodels ``adfuller`` loop and against the arithmetic floor.

    python benchmarks/lean_adf.py [--series 1000] [--length 240] [--reference 100] [--repeats 3]

The lean work is the estimate stage of the classic sequence with AIC lag choice:
every ADF regression (no terms, constant, constant and trend; the lag chosen by AIC
up to Schwert's maximum) and the Φ1, Φ2, Φ3 tests on the second difference, the first
difference and the levels, with their result objects (what ``analyse_many`` computes
before the decision), for ``--series`` series of the ``engine_vs_statsmodels`` mix.
It is timed three ways in one run, BLAS on one thread:

- the engine: ``prepare`` and ``estimate`` with the fast path's ``SeriesBatch``, in chunks
  of ``analyse_many``'s size (``many.CHUNK``) as it does (and, for the record, the arrays alone:
  ``SeriesBatch.level`` for d = 2, 1, 0 without the result objects);
- the reference: ``statsmodels.tsa.stattools.adfuller`` with ``autolag="AIC"`` and the
  same maximum lag, for the three regressions on the three differences, one series at a
  time, on the first ``--reference`` series (per series, so the ratio is per series);
- the floor: one batched Householder QR (``numpy.linalg.qr``, R only) of the full
  design of every series on every difference, (T − 1 − d) × (p + 4), the factorisation
  every lag order's fit is read from.

The four take turns, ``--repeats`` rounds; it prints the best CPU time per series of each (and
the best wall time), what the result objects and bookkeeping add to the arrays, and the two
ratios issue 15 asks for, in CPU time: adfuller loop / engine (target at least 100) and
engine / floor (target at most 5).  Nothing here
is a pass/fail threshold.
"""

from __future__ import annotations

import argparse
import os
import sys
import time
import warnings
from collections.abc import Callable
from pathlib import Path

import numpy as np

sys.path.insert(0, str(Path(__file__).resolve().parent))

from engine_vs_statsmodels import benchmark_series
from statsmodels.tsa.stattools import adfuller

from tauscope.engine import Settings
from tauscope.engine.blas_threads import single_blas_thread
from tauscope.engine.procedure.estimate import estimate, max_lags_for
from tauscope.engine.procedure.fast_path import SeriesBatch
from tauscope.engine.procedure.many import CHUNK
from tauscope.engine.procedure.prepare import prepare
from tauscope.engine.procedure.stages import plan_for
from tauscope.engine.regression.nested import full_design

DIFFERENCES = (2, 1, 0)


def engine_work(values: list[np.ndarray], settings: Settings) -> int:
    """The estimate stage for every series, chunk by chunk; returns the tests made."""
    plan = plan_for(settings)
    made = 0
    for first in range(0, len(values), CHUNK):
        prepared = [prepare(v) for v in values[first:first + CHUNK]]
        batch = SeriesBatch([p.standardised for p in prepared], plan.estimate)
        for slot, item in enumerate(prepared):
            estimates = estimate(item, plan.estimate, batch.estimation(slot))
            made += sum(len(level.adf) + len(level.phi) for level in estimates.levels.values())
    return made


def arrays_only(values: list[np.ndarray], settings: Settings) -> None:
    """The same regressions without any result object: ``SeriesBatch.level`` per difference."""
    plan = plan_for(settings)
    for first in range(0, len(values), CHUNK):
        chunk = [prepare(v).standardised for v in values[first:first + CHUNK]]
        batch = SeriesBatch(chunk, plan.estimate)
        for d in DIFFERENCES:
            batch.level(d, max_lags_for(chunk[0].shape[0] - d, plan.estimate)[0])


def adfuller_work(values: list[np.ndarray], settings: Settings) -> None:
    """The three regressions on the three differences by ``adfuller``, AIC, same maximum lag."""
    plan = plan_for(settings)
    for x in values:
        for d in DIFFERENCES:
            xd = np.diff(x, n=d) if d else x
            p = max_lags_for(xd.shape[0], plan.estimate)[0]
            for regression in ("n", "c", "ct"):
                adfuller(xd, maxlag=p, regression=regression, autolag="AIC")


def floor_work(values: list[np.ndarray], settings: Settings) -> None:
    """One batched QR (R only) of the full design per difference, every series at once."""
    plan = plan_for(settings)
    xs = np.vstack(values)
    for d in DIFFERENCES:
        xd = np.diff(xs, n=d, axis=1) if d else xs
        p = max_lags_for(xd.shape[1], plan.estimate)[0]
        np.linalg.qr(np.ascontiguousarray(full_design(xd, p)), mode="r")


def round_robin(repeats: int, works: dict[str, Callable[[], object]]) -> dict[str, tuple[float, float]]:
    """Each work ``repeats`` times, taking turns so that all meet the same load; the best CPU
    time (this process; BLAS runs on one thread) and the best wall time of each."""
    cpu: dict[str, list[float]] = {name: [] for name in works}
    wall: dict[str, list[float]] = {name: [] for name in works}
    for _ in range(repeats):
        for name, work in works.items():
            start, start_cpu = time.perf_counter(), time.process_time()
            work()
            cpu[name].append(time.process_time() - start_cpu)
            wall[name].append(time.perf_counter() - start)
    return {name: (min(cpu[name]), min(wall[name])) for name in works}


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__,
                                     formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--series", type=int, default=1000)
    parser.add_argument("--length", type=int, default=240)
    parser.add_argument("--reference", type=int, default=100,
                        help="series the adfuller loop runs on (its time is per series)")
    parser.add_argument("--repeats", type=int, default=3)
    args = parser.parse_args()
    settings = Settings(lag_rule="aic", strategy="classic", power=False)
    values = [s.to_numpy() for _, s in benchmark_series(args.series, args.length, 7)]
    reference = values[:args.reference]
    print(f"{os.cpu_count()} cores, load average {os.getloadavg()[0]:.2f} at the start")
    warnings.simplefilter("ignore")
    with single_blas_thread():
        tests = engine_work(values[:CHUNK], settings) // min(CHUNK, len(values))  # warm
        adfuller_work(reference[:2], settings)
        best = round_robin(args.repeats, {
            "engine": lambda: engine_work(values, settings),
            "arrays": lambda: arrays_only(values, settings),
            "statsmodels": lambda: adfuller_work(reference, settings),
            "floor": lambda: floor_work(values, settings),
        })
    per = {name: (cpu / len(reference if name == "statsmodels" else values),
                  wall / len(reference if name == "statsmodels" else values))
           for name, (cpu, wall) in best.items()}
    engine, arrays, statsmodels, floor = (per[k][0] for k in ("engine", "arrays", "statsmodels", "floor"))
    print(f"lean ADF work on {args.series} series of length {args.length} (3 specs, AIC lag search, "
          f"differences 2, 1, 0; {tests} ADF and Φ results per series), in chunks of {CHUNK}, "
          f"best of {args.repeats} taking turns, CPU time (wall time):")
    for name, text in (("engine", "engine (prepare + estimate, fast path):"),
                       ("arrays", "  of which the arrays alone:"),
                       ("statsmodels", f"statsmodels adfuller loop ({args.reference} series):"),
                       ("floor", "floor (batched QR of the full designs):")):
        print(f"  {text:42s} {1e3 * per[name][0]:8.3f} ms per series ({1e3 * per[name][1]:.3f})")
    print(f"  the result objects and bookkeeping:        {1e3 * (engine - arrays):8.3f} ms per series")
    print(f"  ratio adfuller loop / engine:              {statsmodels / engine:8.1f}x (target >= 100); "
          f"wall {per['statsmodels'][1] / per['engine'][1]:.1f}x")
    print(f"  ratio engine / floor:                      {engine / floor:8.1f}x (target <= 5); "
          f"arrays alone / floor {arrays / floor:.1f}x")
    print(f"load average {os.getloadavg()[0]:.2f} at the end")


if __name__ == "__main__":
    main()
