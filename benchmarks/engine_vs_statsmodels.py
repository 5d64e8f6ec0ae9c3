"""The full analysis of many series: the fast path against the statsmodels reference, same run.

    python benchmarks/engine_vs_statsmodels.py [--series 500] [--length 240] [--seed 7]

For ``--series`` generated monthly series of ``--length`` observations (a fixed mix of
I(0), I(1) and I(2), with and without drift or trend; see :func:`benchmark_series`),
times the whole analysis with default settings but the power simulation (three
specifications, lag search up to Schwert's maximum, Φ1-Φ3, differences tested down
from 2, KPSS cross-check, recursive τ, notes; the power simulation is the same code on
both paths, so it would only dilute the comparison; likewise the seasonal unit-root
test's critical values, simulated once per process for each length and lag order, are
simulated by a first, separately timed pass before the timed runs):

- the fast path: ``tauscope.engine.analyse_many`` (nested QR, series batched);
- the reference path: ``analyse_series(..., path="reference")`` in a loop (one
  statsmodels OLS per regression, statsmodels' kpss and MacKinnon functions);

alternating the two block by block (``--block`` series each) so that both meet the
same load from other programs, and counting wall-clock and CPU time;

and prints both times, their ratio, and the largest absolute difference between the
two in any number of any result (walking both ``to_dict()``), plus the count of
entries that differ otherwise (verdicts, lags, texts; should be 0).  Then the peak
memory (tracemalloc) of the fast path for 100 and for all series: the working
memory above what the results themselves hold should stay flat, because only one
chunk of series is factorised at a time.  Nothing here is a pass/fail threshold.
"""

from __future__ import annotations

import argparse
import time
import tracemalloc
from typing import Any

import numpy as np
import pandas as pd

from tauscope.engine import Settings, analyse_many, analyse_series, iter_analyse
from tauscope.engine.compare import differences

KINDS = ("I(0)", "I(0) with trend", "I(1)", "I(1) with drift", "I(2)")


def benchmark_series(count: int = 500, length: int = 240, seed: int = 7
                     ) -> list[tuple[str, pd.Series]]:
    """``count`` monthly series (from 2000-01) cycling through :data:`KINDS`:

    * I(0): AR(1) with φ drawn in [0.3, 0.8], around a mean; or around a linear trend;
    * I(1): a random walk with AR(1) increments (φ in [0, 0.5]), with or without drift;
    * I(2): the cumulated sum of such a random walk.
    """
    rng = np.random.default_rng(seed)
    index = pd.period_range("2000-01", periods=length, freq="M")
    t = np.arange(length, dtype=float)
    out = []
    for i in range(count):
        kind = KINDS[i % len(KINDS)]
        e = rng.standard_normal(length)
        if kind.startswith("I(0)"):
            phi = rng.uniform(0.3, 0.8)
            x = np.empty(length)
            x[0] = e[0]
            for s in range(1, length):
                x[s] = phi * x[s - 1] + e[s]
            x = x + 10.0 + (0.05 * t if kind.endswith("trend") else 0.0)
        else:
            phi = rng.uniform(0.0, 0.5)
            u = np.empty(length)
            u[0] = e[0]
            for s in range(1, length):
                u[s] = phi * u[s - 1] + e[s]
            drift = 0.2 if kind.endswith("drift") else 0.0
            x = 100.0 + np.cumsum(drift + u)
            if kind == "I(2)":
                x = np.cumsum(x - 100.0) / 10.0
        out.append((f"{kind} #{i + 1}", pd.Series(x, index=index)))
    return out


def compare(fast: list[Any], reference: list[Any]) -> tuple[float, str, int]:
    """Largest absolute difference in any number, where, and the count of other differences."""
    largest, where, other = 0.0, "", 0
    for f, r in zip(fast, reference, strict=True):
        for diff, _, path in differences(f.to_dict(), r.to_dict()):
            if diff is None:
                other += 1
            elif diff > largest:
                largest, where = diff, f"{f.name}: {path}"
    return largest, where, other


def peak_memory(series: list[tuple[str, pd.Series]], settings: Settings) -> tuple[float, float]:
    """(peak MB while analysing, MB the finished results still hold) for the fast path."""
    tracemalloc.start()
    tracemalloc.reset_peak()
    base = tracemalloc.get_traced_memory()[0]
    results = list(iter_analyse(series, settings))
    held, peak = tracemalloc.get_traced_memory()
    tracemalloc.stop()
    assert len(results) == len(series)
    return (peak - base) / 1e6, (held - base) / 1e6


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__,
                                     formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--series", type=int, default=500)
    parser.add_argument("--length", type=int, default=240)
    parser.add_argument("--seed", type=int, default=7)
    parser.add_argument("--block", type=int, default=100,
                        help="series per block; the two paths alternate block by block")
    args = parser.parse_args()
    # The analysis the issue names: three specs, lag search, Φ, differences from 2, KPSS.
    # The power simulation (on by default) is left out: it costs the same on both paths.
    settings = Settings(power=False)
    series = benchmark_series(args.series, args.length, args.seed)
    analyse_series(series[0][1], settings, series[0][0], path="reference")
    # Imports and caches warm for both paths: a first pass of the fast path over every
    # series simulates, once per process, the seasonal unit-root test's critical values
    # for each (length, lag order) met (shared by both paths, so whichever path ran first
    # would pay for them); its time is printed apart.
    wall, cpu = time.perf_counter(), time.process_time()
    analyse_many(series, settings)
    cold_time, cold_cpu = time.perf_counter() - wall, time.process_time() - cpu

    # Alternate the two paths over blocks of series, so that both see the same machine
    # (other programs' load changes over a minute); wall-clock and CPU time both counted.
    fast: list[Any] = []
    reference: list[Any] = []
    fast_time = reference_time = fast_cpu = reference_cpu = 0.0
    for first in range(0, len(series), args.block):
        block = series[first:first + args.block]
        wall, cpu = time.perf_counter(), time.process_time()
        fast.extend(analyse_many(block, settings))
        fast_time += time.perf_counter() - wall
        fast_cpu += time.process_time() - cpu
        wall, cpu = time.perf_counter(), time.process_time()
        reference.extend(analyse_series(values, settings, name, path="reference")
                         for name, values in block)
        reference_time += time.perf_counter() - wall
        reference_cpu += time.process_time() - cpu
    largest, where, other = compare(fast, reference)

    print(f"full analysis of {args.series} series of length {args.length} "
          f"(3 specs, AIC lag search, Φ, differences from 2, KPSS, notes)")
    print(f"  fast path (analyse_many):            {fast_time:8.3f} s "
          f"({1e3 * fast_time / args.series:.2f} ms per series)")
    print(f"  reference path (statsmodels OLS):    {reference_time:8.3f} s "
          f"({1e3 * reference_time / args.series:.2f} ms per series)")
    print(f"  ratio reference / fast:              {reference_time / fast_time:8.1f}x "
          f"(CPU time: fast {fast_cpu:.3f} s, reference {reference_cpu:.3f} s, "
          f"ratio {reference_cpu / fast_cpu:.1f}x)")
    print(f"  first (cold) pass of the fast path:  {cold_time:8.3f} s (CPU {cold_cpu:.3f} s; "
          f"includes the one-off simulation of the seasonal critical values)")
    print(f"  largest absolute difference in any number: {largest:.3e} ({where})")
    print(f"  other entries that differ: {other}")
    for count in sorted({min(100, args.series), args.series}):
        peak, held = peak_memory(series[:count], settings)
        print(f"  peak memory, {count:4d} series: {peak:7.1f} MB, of which the results hold "
              f"{held:6.1f} MB; working memory {peak - held:5.1f} MB")


if __name__ == "__main__":
    main()
