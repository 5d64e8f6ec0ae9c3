"""Check that a speed change changed no result: the demo workbook and simulated series.

    python benchmarks/results_unchanged.py --save before.json     # on the old code
    python benchmarks/results_unchanged.py --against before.json  # on the new code

Analyses every series of the demo workbook (``resources/demo/harbourline_demo.xlsx``)
and ``--series`` simulated ones (the mix of ``engine_vs_statsmodels.benchmark_series``,
with the default settings, power simulation included) through ``analyse_many``, and
one series in ten alone through ``analyse_series`` (the same numbers a batch gives).
``--save`` writes every ``to_dict()``; ``--against`` walks both trees and prints the
largest absolute difference in any number and the count of entries that differ
otherwise (verdicts, lags, texts), which must be 0.  Exits 1 when something other than
a number differs or a number differs by more than ``--tolerance`` (default 1e-10).
"""

from __future__ import annotations

import argparse
import json
import sys
from pathlib import Path
from typing import Any

import numpy as np

sys.path.insert(0, str(Path(__file__).resolve().parent))

from engine_vs_statsmodels import benchmark_series

from tauscope.data import read_workbook
from tauscope.engine import Settings, analyse_many, analyse_series
from tauscope.engine.compare import differences

DEMO = Path(__file__).resolve().parent.parent / "resources" / "demo" / "harbourline_demo.xlsx"


def _plain(value: Any) -> Any:
    """to_dict() trees as JSON: arrays to lists, numpy scalars to Python ones."""
    if isinstance(value, dict):
        return {str(k): _plain(v) for k, v in value.items()}
    if isinstance(value, list | tuple):
        return [_plain(v) for v in value]
    if isinstance(value, np.ndarray):
        return _plain(value.tolist())
    if isinstance(value, np.generic):
        return value.item()
    if isinstance(value, float) and not np.isfinite(value):
        return {"float": repr(value)}
    return value


def _restore(value: Any) -> Any:
    if isinstance(value, dict):
        if value.keys() == {"float"}:
            return float(value["float"])
        return {k: _restore(v) for k, v in value.items()}
    if isinstance(value, list):
        return [_restore(v) for v in value]
    return value


def results(count: int) -> dict[str, Any]:
    """name → to_dict() for the demo series and ``count`` simulated ones."""
    series = [(f"demo {s.name}", s.values) for s in read_workbook(DEMO).series()]
    series += benchmark_series(count, 240, 11)
    series += [(f"short {name}", values.iloc[:60]) for name, values in benchmark_series(20, 60, 13)]
    settings = Settings()
    out = {r.name: _plain(r.to_dict()) for r in analyse_many(series, settings)}
    for name, values in series[::10]:
        out[f"alone {name}"] = _plain(analyse_series(values, settings, name).to_dict())
    return out


def main() -> int:
    parser = argparse.ArgumentParser(description=__doc__,
                                     formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--series", type=int, default=200)
    parser.add_argument("--save", type=Path)
    parser.add_argument("--against", type=Path)
    parser.add_argument("--tolerance", type=float, default=1e-10)
    args = parser.parse_args()
    now = results(args.series)
    if args.save:
        args.save.write_text(json.dumps(now))
        print(f"{len(now)} results written to {args.save}")
    if args.against is None:
        return 0
    before = _restore(json.loads(args.against.read_text()))
    now = _restore(json.loads(json.dumps(now)))
    largest, where, other = 0.0, "", []
    if before.keys() != now.keys():
        other.append("the set of series")
    for name in before.keys() & now.keys():
        for diff, _, path in differences(before[name], now[name]):
            if diff is None:
                other.append(f"{name}: {path}")
            elif diff > largest:
                largest, where = diff, f"{name}: {path}"
    print(f"{len(now)} results compared with {args.against}")
    print(f"  largest absolute difference in any number: {largest:.3e} ({where})")
    print(f"  other entries that differ: {len(other)}")
    for line in other[:20]:
        print(f"    {line}")
    return 1 if other or largest > args.tolerance else 0


if __name__ == "__main__":
    sys.exit(main())
