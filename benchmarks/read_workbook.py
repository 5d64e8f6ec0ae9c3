"""Reading speed of a large sheet: openpyxl against pandas' calamine engine, and our CSV
path against pandas.read_csv, same run.

    python benchmarks/read_workbook.py [--rows 5000] [--columns 500] [--csv-only]

Generates a sheet of ``rows`` monthly dates down the first column and ``columns`` series of
random numbers across (with a header row and some empty cells), then times

- openpyxl (read-only, cached values), as Tauscope reads it without calamine;
- pandas.read_excel(engine="calamine");
- python-calamine directly, as Tauscope reads it (tauscope.data.excel);
- the whole of tauscope.data.read_workbook (reading plus dates, header and series).

It checks that openpyxl and calamine give the same cells and prints each time and the
ratios openpyxl / calamine.

CSV: the same table written as a CSV file; ``pandas.read_csv`` (C parser) against our CSV
reader (``tauscope.data.text_table.read_text_table``: encoding, delimiter, decimal mark and
title rows detected by our rules, cells parsed by the C parser and classified) and against
the whole ``read_workbook`` (plus dates, header, gaps and 500 series objects).  Each is
timed best of three, and the ratios to ``read_csv`` are printed.  Nothing here is a
pass/fail threshold.
"""

from __future__ import annotations

import argparse
import datetime as dt
import math
import tempfile
import time
from collections.abc import Callable
from pathlib import Path
from typing import Any

import numpy as np
import openpyxl
import pandas as pd

from tauscope.data import read_workbook
from tauscope.data.dates import parse_label
from tauscope.data.excel import normalise, read_with_calamine, read_with_openpyxl
from tauscope.data.text_table import read_text_table


def make_sheet(path: Path, rows: int, columns: int) -> None:
    rng = np.random.default_rng(12345)
    book = openpyxl.Workbook(write_only=True)
    sheet = book.create_sheet("Data")
    sheet.append(["Month", *[f"Series {j + 1}" for j in range(columns)]])
    values = np.round(rng.normal(100.0, 15.0, size=(rows, columns)), 4)
    values[rng.random(size=values.shape) < 0.01] = np.nan
    month = dt.datetime(1901, 1, 1)  # Excel dates start in 1900
    for i in range(rows):
        stamp = dt.datetime(month.year + (month.month - 1 + i) // 12, (month.month - 1 + i) % 12 + 1, 1)
        sheet.append([stamp, *[None if math.isnan(v) else float(v) for v in values[i]]])
    book.save(path)


def timed(label: str, work: Callable[[], Any]) -> tuple[float, Any]:
    start = time.perf_counter()
    result = work()
    seconds = time.perf_counter() - start
    print(f"{label:<44} {seconds:8.2f} s")
    return seconds, result


def pandas_calamine(path: Path) -> list[list[Any]]:
    frame = pd.read_excel(path, engine="calamine", header=None, sheet_name=0)
    return [[normalise(None if isinstance(v, float) and math.isnan(v) else
                       (v.to_pydatetime() if isinstance(v, pd.Timestamp) else v)) for v in row]
            for row in frame.itertuples(index=False)]


def make_csv(path: Path, rows: int, columns: int) -> None:
    """The benchmark table as CSV: a header, monthly labels, numbers, 1% empty cells."""
    rng = np.random.default_rng(12345)
    values = np.round(rng.normal(100.0, 15.0, size=(rows, columns)), 4).astype(str)
    values[rng.random(size=values.shape) < 0.01] = ""
    lines = [",".join(["Month", *[f"Series {j + 1}" for j in range(columns)]])]
    for i in range(rows):
        lines.append(f"{1901 + i // 12}-{i % 12 + 1:02d}," + ",".join(values[i]))
    path.write_text("\n".join(lines) + "\n", encoding="utf-8")


def best_of(label: str, work: Callable[[], Any], repeats: int = 3) -> float:
    times = []
    for _ in range(repeats):
        parse_label.cache_clear()  # no label remembered from the previous repeat
        start = time.perf_counter()
        work()
        times.append(time.perf_counter() - start)
    print(f"{label:<44} {min(times):8.2f} s (best of {repeats})")
    return min(times)


def csv_benchmark(folder: Path, rows: int, columns: int) -> None:
    path = folder / "large.csv"
    make_csv(path, rows, columns)
    print(f"CSV file size {path.stat().st_size / 2**20:.1f} MB")
    pd.read_csv(path)  # load pandas' parser modules before timing
    t_pandas = best_of("pandas.read_csv (C parser)", lambda: pd.read_csv(path))
    t_table = best_of("tauscope CSV reader (read_text_table)",
                      lambda: read_text_table(path.read_bytes(), path.name))
    t_full = best_of("tauscope.data.read_workbook (everything)", lambda: read_workbook(path))
    print(f"ratio CSV reader / pandas.read_csv: {t_table / t_pandas:6.2f}")
    print(f"ratio read_workbook / pandas.read_csv: {t_full / t_pandas:6.2f}")


def canonical(rows: list[list[Any]]) -> list[list[Any]]:
    """Rows padded to one width (the engines differ only in trailing empty cells)."""
    width = max((len(r) for r in rows), default=0)
    return [list(r) + [None] * (width - len(r)) for r in rows]


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--rows", type=int, default=5000)
    parser.add_argument("--columns", type=int, default=500)
    parser.add_argument("--csv-only", action="store_true", help="only the CSV comparison")
    args = parser.parse_args()
    with tempfile.TemporaryDirectory() as folder:
        csv_benchmark(Path(folder), args.rows, args.columns)
        if args.csv_only:
            return
        path = Path(folder) / "large.xlsx"
        print(f"generating a {args.rows:,} × {args.columns:,} sheet ...")
        make_sheet(path, args.rows, args.columns)
        print(f"file size {path.stat().st_size / 2**20:.1f} MB")
        data = path.read_bytes()
        t_openpyxl, by_openpyxl = timed("openpyxl (read-only, cached values)",
                                        lambda: read_with_openpyxl(data))
        t_pandas, by_pandas = timed("pandas.read_excel(engine='calamine')",
                                    lambda: pandas_calamine(path))
        t_calamine, by_calamine = timed("python-calamine (as Tauscope reads)",
                                        lambda: read_with_calamine(data))
        t_full, workbook = timed("tauscope.data.read_workbook (everything)",
                                 lambda: read_workbook(path))
        reference = canonical(by_openpyxl[0][1])
        same = reference == canonical(by_calamine[0][1])
        same_pandas = reference == canonical(by_pandas)
        print(f"openpyxl and calamine give identical cells: {same}")
        print(f"openpyxl and pandas' calamine engine give identical cells: {same_pandas}")
        print(f"ratio openpyxl / pandas-calamine: {t_openpyxl / t_pandas:6.1f}")
        print(f"ratio openpyxl / python-calamine: {t_openpyxl / t_calamine:6.1f}")
        print(f"series read: {len(workbook.series())}, frequency "
              f"{workbook.series()[0].frequency}, full read / python-calamine: "
              f"{t_full / t_calamine:.1f}")


if __name__ == "__main__":
    main()
