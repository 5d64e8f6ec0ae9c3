"""The DF-GLS table read off its grid against direct simulation, and a tick-every-box run's
DF-GLS results before (simulated per key) and after (read from the table).

    python benchmarks/dfgls_table_check.py [--lengths 30 42 …] [--reps 1000000] [--every-box 500]

Part 1 (``--lengths``): for each series length T between the table's grid lengths, every lag
the table holds there is simulated directly (``--reps`` random walks, seed 20261202, all lags
and both specs from the same walks: ``unitroot/dfgls_lags.py``, which gives the numbers of
``dfgls_null_distribution`` to rounding) and compared with the table's value at 1/5/10%: the
difference and z against the direct value's batch-means SE, and the table's p-value at the
direct 1/5/10/50% quantiles.  Also the table at lag 0 against arch's DF-GLS critical values
(an independent simulation's response surface; regression nobs = T − 1).

Part 2 (``--every-box N``, 0 to skip; ``--before FILE`` keeps the simulated run's results):
``N`` series of the benchmark mix (500 × 240 is issue 15's run) through ``analyse_many`` with
every_box.py's settings, once with DF-GLS's fixed-lag null simulated at each (spec, length, lag)
key from 10⁶ walks with the default seed (the code before the table; the walks drawn once per
length) and once reading the table; prints the largest difference of each field that differs
(list positions dropped) and every other entry of the results that differs.
Nothing here is a pass/fail threshold.
"""

from __future__ import annotations

import argparse
import json
import math
import os
import re
import sys
import time
from pathlib import Path
from typing import Any

import numpy as np
from arch.unitroot.unitroot import mackinnoncrit as arch_mackinnoncrit

sys.path.insert(0, str(Path(__file__).resolve().parent))

from engine_vs_statsmodels import benchmark_series
from every_box import SETTINGS, clear_caches
from results_unchanged import _plain, _restore

from tauscope.engine import analyse_many
from tauscope.engine.compare import differences
from tauscope.engine.distributions.dfgls_grid import (
    DFGLS_LENGTHS,
    DFGLS_SPECS,
    dfgls_quantiles,
    dfgls_table_lags,
)
from tauscope.engine.distributions.dfgls_table_make import null_draws
from tauscope.engine.distributions.exact_grid import distribution_at, quantile_at
from tauscope.engine.distributions.simulate import DEFAULT_SEED
from tauscope.engine.unitroot import dfgls as dfgls_module

CHECK_SEED = 20261202
LEVELS = (0.01, 0.05, 0.10)
BATCHES = 10


def direct(length: int, lags: tuple[int, ...], reps: int, seed: int) -> dict[str, dict[int, np.ndarray]]:
    """spec → lag → ``reps`` DF-GLS draws at length T, rows in order from default_rng(seed)."""
    draws = null_draws(length, lags, reps, seed)
    return {s: {p: draws[(p, s)] for p in lags} for s in DFGLS_SPECS}


def _bracketed_lags(length: int) -> tuple[int, ...]:
    above = next(g for g in DFGLS_LENGTHS if g >= length)
    below = max(g for g in DFGLS_LENGTHS if g <= length)
    held = (p for p in dfgls_table_lags(above) if p in dfgls_table_lags(below))
    return tuple(p for p in held if dfgls_quantiles("trend", length, p) is not None)  # others: simulated


def check_length(length: int, reps: int) -> tuple[float, float]:
    """Print the comparison at ``length``; (largest |difference| at 1%, at 5%)."""
    lags = _bracketed_lags(length)
    start = time.process_time()
    draws = direct(length, lags, reps, CHECK_SEED)
    seconds = time.process_time() - start
    worst = {0.01: (0.0, 0.0), 0.05: (0.0, 0.0), 0.10: (0.0, 0.0)}
    p_worst = 0.0
    for spec in DFGLS_SPECS:
        for p in lags:
            table = dfgls_quantiles(spec, length, p)
            assert table is not None
            values = draws[spec][p]
            for a in LEVELS:
                value = float(np.quantile(values, a))
                parts = [float(np.quantile(part, a)) for part in np.array_split(values, BATCHES)]
                se = float(np.std(parts, ddof=1) / math.sqrt(BATCHES))
                diff = quantile_at(table, a) - value
                if abs(diff) > abs(worst[a][0]):
                    worst[a] = (diff, diff / se)
            for a in (*LEVELS, 0.5):
                share, _ = distribution_at(table, float(np.quantile(values, a)))
                p_worst = max(p_worst, abs(share - a))
    print(f"T = {length:3d} (lags {lags[0]}…{lags[-1]}, direct {seconds:.0f} s CPU): largest table − direct "
          + ", ".join(f"{round(100 * a)}%: {d:+.4f} (z {z:+.1f})" for a, (d, z) in worst.items())
          + f"; p-values within {p_worst:.4f} of the direct shares", flush=True)
    return abs(worst[0.01][0]), abs(worst[0.05][0])


def against_arch() -> None:
    """The table at lag 0 against arch's DF-GLS response surface (nobs = T − 1)."""
    print("table at lag 0 against arch's DF-GLS critical values (1%, 5%, 10%):")
    for spec, code in (("constant", "c"), ("trend", "ct")):
        for length in (25, 50, 100, 200, 250):
            table = dfgls_quantiles(spec, length, 0)
            assert table is not None
            arch = arch_mackinnoncrit(regression=code, nobs=length - 1, dist_type="dfgls")
            ours = [quantile_at(table, a) for a in LEVELS]
            print(f"  {spec:8s} T = {length:3d}: table " + " ".join(f"{v:+.3f}" for v in ours)
                  + "  arch " + " ".join(f"{float(v):+.3f}" for v in arch)
                  + "  largest gap " + f"{max(abs(a - float(b)) for a, b in zip(ours, arch, strict=True)):.3f}")


def _dicts(results: list[Any]) -> dict[str, Any]:
    """to_dict() of each result, with the cross-checks' own results added (``to_dict`` keeps
    only their reading; the notes say their numbers rounded)."""
    out = {}
    for result in results:
        data = result.to_dict()
        evidence = getattr(result, "evidence", None)
        data["cross_checks"] = [t.to_dict() for t in evidence.tests] if evidence is not None else []
        out[result.name] = data
    return out


def every_box(count: int, saved: Path | None) -> None:
    series = benchmark_series(count, 240, 7)
    clear_caches()
    start = time.process_time()
    after = _restore(json.loads(json.dumps(_plain(_dicts(analyse_many(series, SETTINGS))))))
    print(f"\ntick-every-box run on {count} × 240 reading the table: {time.process_time() - start:.1f} s CPU")
    if saved is not None and saved.exists():
        before = _restore(json.loads(saved.read_text()))
        print(f"the same run simulating each key's null: read from {saved}")
    else:
        before = _simulated_run(series)
        if saved is not None:
            saved.write_text(json.dumps(_plain(before)))
    _compare(before, after)


def _simulated_run(series: list[Any]) -> dict[str, Any]:
    walks: dict[int, dict[str, dict[int, np.ndarray]]] = {}

    def simulated(spec: str, length: int, reps: int, seed: int, lags: int) -> np.ndarray:
        assert reps == 1_000_000 and seed == DEFAULT_SEED
        if length not in walks:
            walks[length] = direct(length, tuple(range(max(16, lags) + 1)), reps, seed)
        return walks[length][spec][lags]

    original = (dfgls_module.dfgls_quantiles, dfgls_module.dfgls_null_distribution)
    dfgls_module.dfgls_quantiles = lambda spec, length, lags: None  # type: ignore[assignment]
    dfgls_module.dfgls_null_distribution = simulated  # type: ignore[assignment]
    try:
        clear_caches()
        start = time.process_time()
        before = _restore(json.loads(json.dumps(_plain(_dicts(analyse_many(series, SETTINGS))))))
        print(f"the same run simulating each key's null (walks drawn once per length): "
              f"{time.process_time() - start:.1f} s CPU; lengths simulated {sorted(walks)}")
    finally:
        dfgls_module.dfgls_quantiles, dfgls_module.dfgls_null_distribution = original
    return before  # type: ignore[no-any-return]


def _compare(before: dict[str, Any], after: dict[str, Any]) -> None:
    largest: dict[str, float] = {}
    other = []
    for name in before:
        for diff, _, path in differences(before[name], after[name]):
            if diff is None:
                other.append(f"{name}: {path}")
            elif diff > 0.0:
                key = re.sub(r"\[\d+\]", "[]", path)
                largest[key] = max(largest.get(key, 0.0), diff)
    print("numbers that differ, largest difference by field (list positions dropped):")
    for key, value in sorted(largest.items(), key=lambda kv: -kv[1])[:12]:
        print(f"  {value:.4f}  {key}")
    print(f"other entries that differ: {len(other)}, by field:")
    kinds: dict[str, int] = {}
    for line in other:
        kind = re.sub(r"\[\d+\]", "[]", line.split(": ", 1)[1])
        kinds[kind] = kinds.get(kind, 0) + 1
    for kind, count in sorted(kinds.items(), key=lambda kv: -kv[1]):
        print(f"  {count:4d}  {kind}")
    for line in other[:8]:
        print(f"  e.g. {line}")


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__,
                                     formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--lengths", type=int, nargs="*", default=[27, 32, 37, 45, 62, 90, 135, 200, 240])
    parser.add_argument("--reps", type=int, default=1_000_000)
    parser.add_argument("--every-box", type=int, default=0)
    parser.add_argument("--before", type=Path, help="JSON of the simulated run: read if it exists, else written")
    args = parser.parse_args()
    print(f"{os.cpu_count()} cores, load average {os.getloadavg()[0]:.2f} at the start")
    against_arch()
    for length in args.lengths:
        check_length(length, args.reps)
    if args.every_box:
        every_box(args.every_box, args.before)


if __name__ == "__main__":
    main()
