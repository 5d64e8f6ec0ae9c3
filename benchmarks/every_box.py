"""A tick-every-box run: every cross-check, simulated ("exact") critical values, power.

    python benchmarks/every_box.py [--series 500] [--length 240] [--top 25] [--no-profile | --only-profile]

Analyses ``--series`` series of the benchmark mix (``engine_vs_statsmodels.benchmark_series``)
with ``analyse_many`` and the settings that cost the most: confirmation by KPSS,
Phillips-Perron, DF-GLS and Zivot-Andrews, critical values simulated at each regression's
own size (``critical_values="exact"``) and the power simulation, every simulation cache
cleared first (a fresh process would start with them empty).  Prints the wall and CPU
time of the run; then, unless ``--no-profile``, the same run again under cProfile, CPU time (caches
cleared again) with the cumulative time of the costly parts (the exact τ and Φ values, read
from the table or simulated, DF-GLS's exact values, read from its table or simulated, the power simulation, the seasonal
unit-root check, Zivot-Andrews, the estimate stage) and the ``--top`` functions by own time.  Issue 15 asks
for 10 s or less on 500 × 240 here.  Nothing here is a pass/fail threshold.
"""

from __future__ import annotations

import argparse
import cProfile
import functools
import gc
import os
import pstats
import sys
import time
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parent))

from engine_vs_statsmodels import benchmark_series

from tauscope.engine import Settings, analyse_many

SETTINGS = Settings(confirm=("kpss", "pp", "dfgls", "za"), critical_values="exact", power=True)

# (label, module path fragment, function name): cumulative time printed for each
PARTS = (
    ("exact τ/Φ critical values (all)", "distributions/simulate.py", "null_critical_values"),
    ("exact τ/Φ p-values (all)", "distributions/simulate.py", "null_p_value"),
    ("  read from the table", "distributions/exact_grid.py", "table_quantiles"),
    ("  simulated per series length", "distributions/exact.py", "length_nulls"),
    ("  simulated one key at a time (old path)", "distributions/exact.py", "streamed_quantiles"),
    ("kept null draws (Phillips-Perron p-values)", "distributions/simulate.py", "_simulate"),
    ("DF-GLS exact values (all)", "unitroot/dfgls.py", "fixed_lag_values"),
    ("  read from the DF-GLS table", "distributions/dfgls_grid.py", "dfgls_quantiles"),
    ("  simulated (10⁶ per spec, length, lag)", "unitroot/dfgls.py", "dfgls_null_distribution"),
    ("power simulation", "distributions/power.py", "rejection_rates"),
    ("seasonal unit roots (HEGY / Beaulieu-Miron)", "seasonal/roots.py", "seasonal_unit_roots"),
    ("seasonal unit roots, batched", "seasonal/roots_many.py", "seasonal_unit_roots_many"),
    ("  null distributions (table or simulation)", "seasonal/null.py", "seasonal_null"),
    ("  simulated (every lag at a length)", "seasonal/critical.py", "simulate_lags"),
    ("Zivot-Andrews", "unitroot/zivot_andrews.py", "za_test"),
    ("Phillips-Perron", "unitroot/phillips_perron.py", "pp_test"),
    ("extra evidence (PP, DF-GLS, ZA, power, ...)", "procedure/cross_check.py", "extra_evidence"),
    ("estimate stage (ADF, Φ, union)", "procedure/estimate.py", "estimate"),
)


def clear_caches() -> None:
    """Empty every lru_cache in the engine's simulation modules (a fresh process's state)."""
    for name, module in list(sys.modules.items()):
        if not name.startswith("tauscope.engine"):
            continue
        for value in vars(module).values():
            if isinstance(value, functools._lru_cache_wrapper):
                value.cache_clear()
    gc.collect()


def timed(series: list, settings: Settings) -> tuple[float, float]:
    clear_caches()
    wall, cpu = time.perf_counter(), time.process_time()
    analyse_many(series, settings)
    return time.perf_counter() - wall, time.process_time() - cpu


def profile(series: list, settings: Settings, top: int) -> None:
    clear_caches()
    profiler = cProfile.Profile(time.process_time)  # CPU seconds: the machine is shared
    wall, cpu = time.perf_counter(), time.process_time()
    profiler.enable()
    analyse_many(series, settings)
    profiler.disable()
    wall, cpu = time.perf_counter() - wall, time.process_time() - cpu
    print(f"profiled tick-every-box run, {len(series)} series: {wall:.2f} s wall, {cpu:.2f} s CPU "
          f"(profiler overhead included)")
    stats = pstats.Stats(profiler)
    table = stats.stats  # type: ignore[attr-defined]
    total = max(entry[3] for entry in table.values())
    print(f"\nprofiled run: {total:.2f} s CPU (cumulative, profiler overhead included)")
    for label, path, function in PARTS:
        seconds = sum(entry[3] for (file, _, name), entry in table.items()
                      if name == function and file.replace(os.sep, "/").endswith(path))
        if seconds:
            print(f"  {label:50s} {seconds:7.2f} s  {100 * seconds / total:5.1f}%")
    print(f"\nthe {top} functions with the most own time:")
    stats.sort_stats("tottime").print_stats(top)


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__,
                                     formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--series", type=int, default=500)
    parser.add_argument("--length", type=int, default=240)
    parser.add_argument("--top", type=int, default=25)
    parser.add_argument("--no-profile", action="store_true")
    parser.add_argument("--only-profile", action="store_true", help="skip the unprofiled run")
    args = parser.parse_args()
    series = benchmark_series(args.series, args.length, 7)
    print(f"{os.cpu_count()} cores, load average {os.getloadavg()[0]:.2f} at the start")
    if not args.only_profile:
        wall, cpu = timed(series, SETTINGS)
        print(f"tick-every-box run, {args.series} × {args.length}: {wall:.2f} s wall, {cpu:.2f} s CPU "
              f"(issue 15 asks for 10 s or less)")
    if not args.no_profile:
        profile(series, SETTINGS, args.top)


if __name__ == "__main__":
    main()
