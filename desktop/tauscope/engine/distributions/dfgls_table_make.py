"""Writes :mod:`tauscope.engine.distributions.dfgls_table`: quantiles of the DF-GLS t ratio
(constant and trend) under the null on a grid of series lengths and fixed lag orders, each cell
from 10⁶ simulated random walks, so that a run's "exact" DF-GLS values are read, not simulated.

Run by hand, one process, politely (lengths already in the table are kept)::

    nice -n 5 python -m tauscope.engine.distributions.dfgls_table_make [--lengths 250 160 …]

Each length T draws its walks from ``numpy.random.default_rng(SEED)`` rows in order (the
stream of :func:`~tauscope.engine.distributions.batched.shock_chunks`), so a cell (T, p) holds
the quantiles of :func:`tauscope.engine.unitroot.dfgls.dfgls_null_distribution` at (T, p) with
the same seed and replications, to rounding; every lag and both specs come from the same walks
(:func:`~tauscope.engine.unitroot.dfgls_lags.every_lag_dfgls`).  The batch-means standard error
of each 1% quantile (10 batches) is printed and written beside the table (``SE_1``).
"""

from __future__ import annotations

import argparse
import math
import time
from pathlib import Path

import numpy as np

from tauscope.engine.distributions.dfgls_grid import DFGLS_LENGTHS, DFGLS_SPECS, dfgls_table_lags
from tauscope.engine.distributions.exact_grid import PROBABILITIES, decode
from tauscope.engine.distributions.exact_table_make import encode
from tauscope.engine.unitroot.dfgls_lags import every_lag_dfgls

SEED = 19790601  # simulate.DEFAULT_SEED, the direct simulation's
REPS = 1_000_000
BATCHES = 10
CHUNK_ROWS = 2_000  # walks per pass: the window sums stay in cache
OUTPUT = Path(__file__).with_name("dfgls_table.py")

Cells = dict[tuple[int, int], dict[str, np.ndarray]]
Errors = dict[tuple[int, int], dict[str, float]]


def null_draws(length: int, lags: tuple[int, ...], reps: int, seed: int,
               dtype: type = np.float64) -> dict[tuple[int, str], np.ndarray]:
    """(p, spec) → ``reps`` DF-GLS statistics of fixed lag p on random walks of length T,
    rows in order from default_rng(seed) (the same walks whatever the lags asked for)."""
    rng = np.random.default_rng(seed)
    draws: dict[tuple[int, str], np.ndarray] = {(p, s): np.empty(reps, dtype=dtype) for p in lags
                                                 for s in DFGLS_SPECS}
    done = 0
    while done < reps:
        size = min(CHUNK_ROWS, reps - done)
        statistics = every_lag_dfgls(rng.standard_normal((size, length)), lags)
        for (p, spec), values in draws.items():
            values[done:done + size] = statistics[spec][p]
        done += size
    return draws


def simulate_length(length: int, reps: int = REPS, seed: int = SEED,
                    lags: tuple[int, ...] | None = None) -> tuple[Cells, Errors]:
    """((T, p) → spec → quantiles at :data:`PROBABILITIES`, (T, p) → spec → SE of the 1%
    quantile) at series length ``length`` for ``lags`` (default :func:`dfgls_table_lags`)."""
    lags = dfgls_table_lags(length) if lags is None else lags
    draws = null_draws(length, lags, reps, seed, np.float32)
    cells: Cells = {}
    errors: Errors = {}
    for (p, spec), values in draws.items():
        wide = values.astype(float)
        cells.setdefault((length, p), {})[spec] = np.quantile(wide, PROBABILITIES)
        parts = [float(np.quantile(part, 0.01)) for part in np.array_split(wide, BATCHES)]
        errors.setdefault((length, p), {})[spec] = float(np.std(parts, ddof=1) / math.sqrt(BATCHES))
    return cells, errors


def _existing() -> tuple[Cells, Errors]:
    if not OUTPUT.exists():
        return {}, {}
    from tauscope.engine.distributions import dfgls_table

    on_grid = [key for key in dfgls_table.CELLS if key[0] in DFGLS_LENGTHS and key[1] in dfgls_table_lags(key[0])]
    cells = decode(dfgls_table.CELLS, dfgls_table.DATA, DFGLS_SPECS)
    errors = {key: dict(zip(DFGLS_SPECS, value, strict=True)) for key, value in dfgls_table.SE_1.items()}
    return {key: cells[key] for key in on_grid}, {key: errors[key] for key in on_grid}  # cells off the grid dropped


def write(cells: Cells, errors: Errors) -> None:
    keys = sorted(cells)
    data = encode(cells, DFGLS_SPECS)
    lines = [data[i:i + 96] for i in range(0, len(data), 96)]
    entries = [f"{key}: ({', '.join(f'{errors[key][s]:.4f}' for s in DFGLS_SPECS)})," for key in keys]
    se = "\n".join("    " + " ".join(entries[i:i + 4]) for i in range(0, len(entries), 4))
    cell_lines = "".join("    " + " ".join(f"{k!r}," for k in keys[i:i + 8]) + "\n"
                         for i in range(0, len(keys), 8))
    text = (
        '"""Written by ``python -m tauscope.engine.distributions.dfgls_table_make`` (do not edit).\n\n'
        f"Quantiles of the DF-GLS t ratio (constant, trend) from {REPS:,} random walks per (length, lag)\n"
        f"cell, seed {SEED}; decoded by :func:`tauscope.engine.distributions.exact_grid.decode`.  SE_1:\n"
        "batch-means standard errors of the 1% quantile (constant, trend).\n"
        '"""\n\n'
        f"REPS = {REPS}\n"
        "CELLS = (\n" + cell_lines + ")\n"
        "DATA = (\n" + "".join(f'    "{line}"\n' for line in lines) + ")\n"
        "SE_1 = {\n" + se + "\n}\n"
    )
    OUTPUT.write_text(text, encoding="utf-8")


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__,
                                     formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--lengths", type=int, nargs="+", default=list(DFGLS_LENGTHS))
    args = parser.parse_args()
    cells, errors = _existing()
    for length in args.lengths:
        if length not in DFGLS_LENGTHS:
            raise SystemExit(f"{length} is not on the grid {DFGLS_LENGTHS}")
        missing = tuple(p for p in dfgls_table_lags(length) if (length, p) not in cells)
        if not missing:
            continue
        start = time.perf_counter()
        new_cells, new_errors = simulate_length(length, lags=missing)
        cells.update(new_cells)
        errors.update(new_errors)
        write(cells, errors)
        worst = max(max(v.values()) for v in new_errors.values())
        print(f"T = {length}: lags {missing}, {time.perf_counter() - start:.0f} s, "
              f"largest 1% SE {worst:.4f}", flush=True)


if __name__ == "__main__":
    main()
