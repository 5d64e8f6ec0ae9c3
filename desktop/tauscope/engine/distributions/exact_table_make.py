"""Writes :mod:`tauscope.engine.distributions.exact_table`: quantiles of τ (three specs) and
Φ1, Φ2, Φ3 on a grid of series lengths and lag orders, each cell from 10⁶ simulated random
walks, so that exact critical values and p-values are read, not simulated, in a run.

Run by hand, one process, politely (it takes a while; lengths already in the table are kept)::

    nice -n 15 python -m tauscope.engine.distributions.exact_table_make [--lengths 250 160 …]

Each length L (shocks per path; the regression with p lags has nobs = L − p) draws its paths
from ``numpy.random.default_rng(DEFAULT_SEED)`` in order, the stream of
:func:`~tauscope.engine.distributions.batched.shock_chunks`, so a cell (L, p) holds the
quantiles :func:`~tauscope.engine.distributions.exact.streamed_quantiles` gives at
(nobs = L − p, p) with the same seed and replications.  Every lag order of one length comes
from the same paths (:func:`~tauscope.engine.distributions.every_lag.every_lag_statistics`).
The batch-means standard error of each τ's 1% quantile (10 batches) is printed as each
length finishes, and written beside the table (``SE_TAU_1``).
"""

from __future__ import annotations

import argparse
import base64
import lzma
import math
import time
from pathlib import Path

import numpy as np

from tauscope.engine.distributions.every_lag import every_lag_statistics
from tauscope.engine.distributions.exact_grid import (
    LENGTH_GRID,
    PROBABILITIES,
    TABLE_STATISTICS,
    UNIT,
    decode,
    table_lags,
)

SEED = 19790601  # simulate.DEFAULT_SEED (not imported: simulate imports the table)
REPS = 1_000_000
BATCHES = 10
CHUNK_VALUES = 2_000_000  # shocks drawn at once (rows × length)
OUTPUT = Path(__file__).with_name("exact_table.py")


def simulate_length(length: int, reps: int = REPS, seed: int = SEED, lags: tuple[int, ...] | None = None
                    ) -> tuple[dict[int, dict[str, np.ndarray]], dict[int, dict[str, float]]]:
    """(lag → statistic → quantiles at :data:`PROBABILITIES`, lag → τ spec → SE of the 1%
    quantile) at series length ``length`` for ``lags`` (default: those :func:`table_lags`
    lists); the stream is the same whichever lags are asked for."""
    lags = table_lags(length) if lags is None else lags
    rng = np.random.default_rng(seed)
    draws = {p: {name: np.empty(reps, dtype=np.float32) for name in TABLE_STATISTICS} for p in lags}
    chunk = max(1, CHUNK_VALUES // length)
    done = 0
    while done < reps:
        size = min(chunk, reps - done)
        statistics = every_lag_statistics(rng.standard_normal((size, length)), lags)
        for p in lags:
            for name in TABLE_STATISTICS:
                draws[p][name][done:done + size] = statistics[p][name]
        done += size
    quantiles: dict[int, dict[str, np.ndarray]] = {}
    errors: dict[int, dict[str, float]] = {}
    for p in lags:
        quantiles[p] = {name: np.quantile(draws[p][name].astype(float), PROBABILITIES)
                        for name in TABLE_STATISTICS}
        errors[p] = {}
        for name in ("tau_none", "tau_constant", "tau_trend"):
            parts = [float(np.quantile(part, 0.01)) for part in np.array_split(draws[p][name], BATCHES)]
            errors[p][name] = float(np.std(parts, ddof=1) / math.sqrt(BATCHES))
    return quantiles, errors


def encode(cells: dict[tuple[int, int], dict[str, np.ndarray]],
           names: tuple[str, ...] = TABLE_STATISTICS) -> str:
    """The quantiles in units of :data:`UNIT`, differenced along the probabilities (the first
    kept whole), as little-endian int32, lzma-compressed and base64-encoded; cells in sorted
    (length, lag) order, statistics in ``names`` order."""
    rows = []
    for key in sorted(cells):
        for name in names:
            units = np.rint(np.asarray(cells[key][name]) / UNIT).astype(np.int64)
            steps = np.diff(units, prepend=0)
            rows.append(steps)
    raw = np.concatenate(rows).astype("<i4").tobytes()
    return base64.b64encode(lzma.compress(raw, preset=9 | lzma.PRESET_EXTREME)).decode("ascii")


def _existing() -> tuple[dict[tuple[int, int], dict[str, np.ndarray]], dict[tuple[int, int], dict[str, float]]]:
    if not OUTPUT.exists():
        return {}, {}
    from tauscope.engine.distributions import exact_table

    cells = decode(exact_table.CELLS, exact_table.DATA)
    specs = ("tau_none", "tau_constant", "tau_trend")
    return cells, {key: dict(zip(specs, value, strict=True)) for key, value in exact_table.SE_TAU_1.items()}


def write(cells: dict[tuple[int, int], dict[str, np.ndarray]],
          errors: dict[tuple[int, int], dict[str, float]]) -> None:
    keys = sorted(cells)
    data = encode(cells)
    lines = [data[i:i + 112] for i in range(0, len(data), 112)]
    specs = ("tau_none", "tau_constant", "tau_trend")
    entries = [f"{key}: ({', '.join(f'{errors[key][n]:.4f}' for n in specs)})," for key in keys]
    se = "\n".join("    " + " ".join(entries[i:i + 3]) for i in range(0, len(entries), 3))
    text = (
        '"""Written by ``python -m tauscope.engine.distributions.exact_table_make`` (do not edit).\n\n'
        f"Quantiles of τ and Φ from {REPS:,} random walks per (length, lag) cell, seed {SEED}; decoded\n"
        "by :func:`tauscope.engine.distributions.exact_grid.decode`.  SE_TAU_1: batch-means standard\n"
        "errors of the 1% quantile of τ (none, constant, trend).\n"
        '"""\n\n'
        f"REPS = {REPS}\n"
        f"CELLS = {tuple(keys)!r}\n"
        "DATA = (\n" + "".join(f'    "{line}"\n' for line in lines) + ")\n"
        "SE_TAU_1 = {\n" + se + "\n}\n"
    )
    # keep the lines short: the cell list wrapped by hand
    text = text.replace(f"CELLS = {tuple(keys)!r}\n", "CELLS = (\n" + "".join(
        "    " + " ".join(f"{k!r}," for k in keys[i:i + 7]) + "\n" for i in range(0, len(keys), 7)) + ")\n")
    OUTPUT.write_text(text, encoding="utf-8")


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__,
                                     formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--lengths", type=int, nargs="+", default=list(LENGTH_GRID))
    parser.add_argument("--reps", type=int, default=REPS)
    args = parser.parse_args()
    cells, errors = _existing()
    for length in args.lengths:
        if length not in LENGTH_GRID:
            raise SystemExit(f"{length} is not on the grid {LENGTH_GRID}")
        missing = tuple(p for p in table_lags(length) if (length, p) not in cells)
        if not missing:
            continue
        start = time.perf_counter()
        quantiles, se = simulate_length(length, args.reps, lags=missing)
        for p in quantiles:
            cells[(length, p)] = quantiles[p]
            errors[(length, p)] = se[p]
        write(cells, errors)
        worst = max(max(v.values()) for v in se.values())
        print(f"L = {length}: lags {missing}, {time.perf_counter() - start:.0f} s, "
              f"largest 1% SE of τ {worst:.4f}", flush=True)


if __name__ == "__main__":
    main()
