"""The wild bootstrap strategy's cost per series, against the default strategy, same run.

    python benchmarks/bootstrap_cost.py [--series 200] [--length 240] [--rounds 2] [--seed 7]

The series are those of ``engine_vs_statsmodels.py`` (a fixed mix of I(0), I(1) and I(2),
monthly, ``--length`` observations).  Each round times the whole analysis
(``tauscope.engine.analyse_many``, default settings but the power simulation) with the
default strategy ("union": κ from the table) and with the wild bootstrap strategy
("bootstrap": B = 499 bootstrap series per series and difference level, each series' B
replicates batched through the vectorised DF-GLS), alternating the two so that both meet
the same load; it prints the best round of each in ms per series, their ratio, the time of
the bootstrap alone (``union_rows`` with and without it, per series), and how many verdicts
differ between the two strategies.  Nothing here is a pass/fail threshold.
"""

from __future__ import annotations

import argparse
import sys
import time
from pathlib import Path

import numpy as np

sys.path.insert(0, str(Path(__file__).resolve().parent))

from engine_vs_statsmodels import benchmark_series

from tauscope.engine import BOOTSTRAP_REPS, Settings, analyse_many
from tauscope.engine.procedure.union_estimate import union_rows


def _time(call: object) -> float:
    start = time.perf_counter()
    call()  # type: ignore[operator]
    return time.perf_counter() - start


def main(argv: list[str] | None = None) -> None:
    parser = argparse.ArgumentParser(description=__doc__.split("\n")[0])
    parser.add_argument("--series", type=int, default=200)
    parser.add_argument("--length", type=int, default=240)
    parser.add_argument("--rounds", type=int, default=2)
    parser.add_argument("--seed", type=int, default=7)
    args = parser.parse_args(argv)
    series = benchmark_series(args.series, args.length, args.seed)
    default, boot = Settings(power=False), Settings(power=False, strategy="bootstrap")
    analyse_many(series[:5], default)  # tables and caches loaded once, outside the timing
    analyse_many(series[:5], boot)
    times: dict[str, list[float]] = {"union": [], "bootstrap": []}
    results = {}
    for _ in range(args.rounds):
        for name, settings in (("union", default), ("bootstrap", boot)):
            start = time.perf_counter()
            results[name] = analyse_many(series, settings)
            times[name].append(time.perf_counter() - start)
    n = len(series)
    best = {k: min(v) / n * 1000.0 for k, v in times.items()}
    differ = sum(a.verdict.order != b.verdict.order for a, b in zip(results["union"], results["bootstrap"],
                                                                      strict=True))
    xs = np.vstack([s.to_numpy(dtype=float) for _, s in series])
    plain = _time(lambda: union_rows(xs, "maic", 0.05, 2, None, None)) / n * 1000.0
    with_boot = _time(lambda: union_rows(xs, "maic", 0.05, 2, None, None, bootstrap=True)) / n * 1000.0
    print(f"{n} series × {args.length}, B = {BOOTSTRAP_REPS}, best of {args.rounds} rounds")
    print(f"whole analysis, default strategy:   {best['union']:8.2f} ms per series")
    print(f"whole analysis, bootstrap strategy: {best['bootstrap']:8.2f} ms per series "
          f"(ratio {best['bootstrap'] / best['union']:.1f})")
    print(f"the union alone: {plain:.2f} ms per series without the bootstrap, {with_boot:.2f} with it")
    print(f"orders that differ between the two strategies: {differ} of {n}")


if __name__ == "__main__":
    main()
