"""The default analysis with BLAS pinned to one thread against BLAS's own thread count.

    python benchmarks/blas_threads.py [--series 500] [--lengths 240 500] [--repeats 3]

For each length, analyses ``--series`` series of the benchmark mix
(``engine_vs_statsmodels.benchmark_series``; default settings but the power simulation,
as that benchmark) with ``analyse_many``, alternating the two settings of
:data:`tauscope.engine.blas_threads.PIN` ``--repeats`` times, and prints the best wall
and CPU time of each and their ratio (above 1: pinning is faster).  Both settings run in
the same process, back to back, so they meet the same load.  Nothing here is a pass/fail
threshold.
"""

from __future__ import annotations

import argparse
import os
import sys
import time
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parent))

from engine_vs_statsmodels import benchmark_series

import tauscope.engine.blas_threads as blas_threads
from tauscope.engine import Settings, analyse_many


def timed(series: list, settings: Settings, pin: bool) -> tuple[float, float]:
    blas_threads.PIN = pin
    wall, cpu = time.perf_counter(), time.process_time()
    analyse_many(series, settings)
    return time.perf_counter() - wall, time.process_time() - cpu


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__,
                                     formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--series", type=int, default=500)
    parser.add_argument("--lengths", type=int, nargs="+", default=[240, 500])
    parser.add_argument("--repeats", type=int, default=3)
    args = parser.parse_args()
    settings = Settings(power=False)
    print(f"{os.cpu_count()} cores, load average {os.getloadavg()[0]:.2f} at the start")
    for length in args.lengths:
        series = benchmark_series(args.series, length, 7)
        analyse_many(series[:5], settings)
        best: dict[bool, tuple[float, float]] = {}
        for _ in range(args.repeats):
            for pin in (True, False):
                wall, cpu = timed(series, settings, pin)
                old = best.get(pin, (float("inf"), float("inf")))
                best[pin] = (min(old[0], wall), min(old[1], cpu))
        (pin_wall, pin_cpu), (own_wall, own_cpu) = best[True], best[False]
        print(f"{args.series} series of length {length}, best of {args.repeats}:")
        print(f"  BLAS on one thread:      {pin_wall:7.3f} s wall, {pin_cpu:7.3f} s CPU")
        print(f"  BLAS's own thread count: {own_wall:7.3f} s wall, {own_cpu:7.3f} s CPU")
        print(f"  ratio own / one thread:  {own_wall / pin_wall:7.2f}x wall, {own_cpu / pin_cpu:.2f}x CPU")
    blas_threads.PIN = True
    print(f"load average {os.getloadavg()[0]:.2f} at the end")


if __name__ == "__main__":
    main()
