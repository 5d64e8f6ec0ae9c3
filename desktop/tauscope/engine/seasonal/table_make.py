"""Writes the seasonal unit-root table (the modules of ``table_grid.PARTS``): quantiles of the
seasonal unit-root statistics (seasonal dummies in the regression) under the null on a grid of
series lengths and lag orders
(:mod:`~tauscope.engine.seasonal.table_grid`), so that a run's simulated values are read, not
simulated.

Run by hand, one process, politely; resumable (cells already in the table are kept, the table
is rewritten after every length).  Each module of ``PARTS`` states its own replications, so a
part can be generated again at more of them (remove its module first)::

    nice -n 5 python -m tauscope.engine.seasonal.table_make [--periods 12 4] [--reps 200000]

Each length's walks are :func:`tauscope.engine.seasonal.critical.simulate_lags` itself (its
seed, its stream, every lag from the same walks), so a cell (S, n, p) holds the quantiles of
the direct simulation at (S, n, p) with ``--reps`` replications, to rounding.  The batch-means
standard error (10 batches) of each statistic's 1% critical value is printed and written beside
the table (``SE_1``).
"""

from __future__ import annotations

import argparse
import math
import time
from pathlib import Path

import numpy as np

from tauscope.engine.distributions.exact_grid import PROBABILITIES
from tauscope.engine.distributions.exact_table_make import encode
from tauscope.engine.seasonal.critical import DEFAULT_SEED, simulate_lags
from tauscope.engine.seasonal.design import statistics_for
from tauscope.engine.seasonal.table_grid import (
    DETERMINISTIC,
    LENGTHS,
    PARTS,
    _table,
    names,
    part_of,
    table_errors,
    table_lags,
    table_reps,
)

REPS = 200_000
BATCHES = 10
FOLDER = Path(__file__).parent  # the modules of table_grid.PARTS are written here

Cells = dict[tuple[int, int], dict[str, np.ndarray]]
Errors = dict[tuple[int, int], tuple[float, ...]]


def simulate_length(period: int, length: int, lags: tuple[int, ...], reps: int = REPS
                    ) -> tuple[Cells, Errors]:
    """((n, p) → statistic → quantiles at :data:`PROBABILITIES`, (n, p) → SE of each
    statistic's 1% critical value) at one length, every lag of ``lags`` from the same walks."""
    draws = simulate_lags(period, DETERMINISTIC, length, lags, reps, DEFAULT_SEED)
    cells: Cells = {}
    errors: Errors = {}
    for p, values in draws.items():
        cells[(length, p)] = {stat.name: np.quantile(values[:, i], PROBABILITIES)
                              for i, stat in enumerate(statistics_for(period))}
        se = []
        for i, stat in enumerate(statistics_for(period)):
            level = 0.01 if stat.kind == "t" else 0.99
            parts = [float(np.quantile(part, level)) for part in np.array_split(values[:, i], BATCHES)]
            se.append(float(np.std(parts, ddof=1) / math.sqrt(BATCHES)))
        errors[(length, p)] = tuple(se)
    return cells, errors


def _existing() -> tuple[dict[int, Cells], dict[int, Errors], dict[str, int]]:
    """The cells, their SEs, and each generated part's replications (parts without cells
    left out)."""
    cells = {period: dict(_table(period)) for period in LENGTHS}
    errors = {period: table_errors(period) for period in LENGTHS}
    reps = {name: table_reps(period, lengths[0]) for name, (period, lengths) in PARTS.items()
            if any(key[0] in lengths for key in cells[period])}
    return cells, errors, reps


def _cells_text(keys: list[tuple[int, int]]) -> str:
    return "(\n" + "".join("    " + " ".join(f"{k!r}," for k in keys[i:i + 7]) + "\n"
                           for i in range(0, len(keys), 7)) + ")"


def write(cells: dict[int, Cells], errors: dict[int, Errors], reps_of: dict[str, int],
          default_reps: int) -> None:
    """One module per entry of ``table_grid.PARTS`` (its period's cells at its lengths), each
    stating its replications (``reps_of[name]``, else ``default_reps``)."""
    for name, (period, lengths) in PARTS.items():
        reps = reps_of.get(name, default_reps)
        keys = sorted(key for key in cells[period] if key[0] in lengths)
        data = encode({key: cells[period][key] for key in keys}, names(period)) if keys else ""
        lines = [data[i:i + 108] for i in range(0, len(data), 108)]
        entries = [f"{key}: ({', '.join(f'{v:.4f}' for v in errors[period][key])}),"
                   for key in keys]
        per_line = 2 if period == 4 else 1
        se = "".join("    " + " ".join(entries[i:i + per_line]) + "\n"
                     for i in range(0, len(entries), per_line))
        text = (
            '"""Written by ``python -m tauscope.engine.seasonal.table_make`` (do not edit).\n\n'
            f"Quantiles of the seasonal unit-root statistics (seasonal dummies), period {period},\n"
            f"lengths {', '.join(str(n) for n in lengths)}: {reps:,} seasonal random walks per\n"
            f"length, seed {DEFAULT_SEED}; decoded by\n"
            ":func:`tauscope.engine.distributions.exact_grid.decode` (statistics in the order of\n"
            "``design.statistics_for``).  SE_1: batch-means standard errors of each statistic's 1%\n"
            "critical value, same order.\n"
            '"""\n\n'
            f"REPS = {reps}\n"
            f"CELLS: tuple[tuple[int, int], ...] = {_cells_text(keys)}\n"
            "DATA = (\n" + "".join(f'    "{line}"\n' for line in lines) + ")\n"
            "SE_1: dict[tuple[int, int], tuple[float, ...]] = {\n" + se + "}\n"
        )
        FOLDER.joinpath(f"{name}.py").write_text(text, encoding="utf-8")


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__,
                                     formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--periods", type=int, nargs="+", default=[12, 4])
    parser.add_argument("--lengths", type=int, nargs="+", default=None,
                        help="only these grid lengths (default: the whole grid of each period)")
    parser.add_argument("--reps", type=int, default=REPS)
    args = parser.parse_args()
    cells, errors, reps_of = _existing()
    for period in args.periods:
        for length in args.lengths or LENGTHS[period]:
            if length not in LENGTHS[period]:
                continue
            missing = tuple(p for p in table_lags(period, length) if (length, p) not in cells[period])
            if not missing:
                continue
            part = part_of(period, length)
            if reps_of.setdefault(part, args.reps) != args.reps:
                raise SystemExit(f"{part} holds {reps_of[part]:,} replications a cell, not "
                                 f"{args.reps:,} (remove it to generate it again)")
            start = time.process_time()
            found, se = simulate_length(period, length, missing, args.reps)
            cells[period].update(found)
            errors[period].update(se)
            write(cells, errors, reps_of, args.reps)
            worst = max(max(v) for v in se.values())
            print(f"S = {period}, n = {length}: lags {missing[0]}…{missing[-1]}, "
                  f"{time.process_time() - start:.0f} s CPU, largest 1% SE {worst:.4f}", flush=True)


if __name__ == "__main__":
    main()
