"""Run generated malformed inputs through ``tauscope batch`` in forked children.

    python tests/fuzz_batch_runner.py --count 2000 --seed 16 --folder DIR

Imports Tauscope once, then forks one child per input (a fresh interpreter would cost
about 1.5 s each).  Each child gets a memory limit (``resource.setrlimit``: the parent's
address space plus ``MEMORY_LIMIT``) and a ``TIME_LIMIT`` alarm, sends standard output
away and standard error to a file, and calls the batch command's own ``main``.  The
parent checks, per input: exit code 0, 2 or 3 (a signal, a traceback or another code
fails), at most one line on standard error, the time, and that every input file is
unchanged (SHA-256 and modification time).  Prints one JSON summary on stdout.
"""

from __future__ import annotations

import argparse
import hashlib
import json
import os
import resource
import signal
import sys
import tempfile
import time
import traceback
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parent))

from fuzz_inputs import MAKERS, generate
from tauscope.commands.batch import main as batch_main
from tauscope.report import csv_export, html_export, latex_export, xlsx_export  # noqa: F401

MEMORY_LIMIT = 1 << 30
TIME_LIMIT = 10
ALLOWED = (0, 2, 3)


def _virtual_size() -> int:
    for line in Path("/proc/self/status").read_text().splitlines():
        if line.startswith("VmSize:"):
            return int(line.split()[1]) * 1024
    return 0


def _fingerprint(path: Path) -> tuple[str, int] | None:
    try:
        if not path.is_file():
            return None
        return hashlib.sha256(path.read_bytes()).hexdigest(), path.stat().st_mtime_ns
    except OSError:
        return None


def _watched(args: list[str]) -> list[Path]:
    """The input and any existing file --out must not replace."""
    watched = [Path(args[0])]
    for i, arg in enumerate(args[:-1]):
        if arg == "--out" and ("--replace" not in args or Path(args[i + 1]) == watched[0]):
            watched.append(Path(args[i + 1]))
    return watched


def _child(args: list[str], err_path: str, limit: int) -> None:
    os.setsid()
    resource.setrlimit(resource.RLIMIT_AS, (limit, limit))
    signal.alarm(TIME_LIMIT)
    with open(os.devnull, "wb") as null, open(err_path, "wb") as err:
        os.dup2(null.fileno(), 1)
        os.dup2(err.fileno(), 2)
    code = 99
    try:
        code = batch_main(args)
    except SystemExit as exc:
        code = exc.code if isinstance(exc.code, int) else 98
    except BaseException:
        traceback.print_exc()
        code = 97
    finally:
        sys.stdout.flush()
        sys.stderr.flush()
        os._exit(code)


def run_one(args: list[str], limit: int) -> dict[str, object]:
    before = {str(p): _fingerprint(p) for p in _watched(args)}
    handle, err_path = tempfile.mkstemp(suffix=".err")
    os.close(handle)
    start = time.perf_counter()
    pid = os.fork()
    if pid == 0:
        _child(args, err_path, limit)
    _, status, usage = os.wait4(pid, 0)
    elapsed = time.perf_counter() - start
    err = Path(err_path).read_bytes().decode("utf-8", "replace")
    os.unlink(err_path)
    after = {path: _fingerprint(Path(path)) for path, seen in before.items()
             if seen is not None or path == args[0]}
    before = {path: seen for path, seen in before.items() if path in after}
    code = os.waitstatus_to_exitcode(status)
    problems = []
    if code not in ALLOWED:
        problems.append(f"exit {code}")
    if len(err.splitlines()) > 1:
        problems.append(f"{len(err.splitlines())} lines on stderr")
    if elapsed > TIME_LIMIT:
        problems.append(f"{elapsed:.1f} s")
    if before != after:
        problems.append("an input changed")
    return {"args": args, "code": code, "seconds": round(elapsed, 3), "stderr": err[:600],
            "max_rss_mb": usage.ru_maxrss // 1024, "problems": problems}


def main() -> int:
    parser = argparse.ArgumentParser()
    parser.add_argument("--count", type=int, default=2000)
    parser.add_argument("--seed", type=int, default=16)
    parser.add_argument("--folder", type=Path, required=True)
    options = parser.parse_args()
    options.folder.mkdir(parents=True, exist_ok=True)
    start = time.perf_counter()
    cases = generate(options.count, options.seed, options.folder)
    generated = time.perf_counter() - start
    limit = _virtual_size() + MEMORY_LIMIT
    results = [run_one(args, limit) for args in cases]
    seconds: dict[str, float] = {}
    for k, r in enumerate(results):
        name = MAKERS[k % len(MAKERS)].__name__
        seconds[name] = round(seconds.get(name, 0.0) + float(r["seconds"]), 1)  # type: ignore[arg-type]
    failures = [r for r in results if r["problems"]]
    codes: dict[str, int] = {}
    for r in results:
        codes[str(r["code"])] = codes.get(str(r["code"]), 0) + 1
    summary = {
        "count": len(results), "categories": sorted({m.__name__ for m in MAKERS}),
        "codes": codes, "seconds_by_category": seconds, "failures": failures[:25], "failure_count": len(failures),
        "slowest": max(r["seconds"] for r in results),  # type: ignore[type-var]
        "seconds_generating": round(generated, 1),
        "seconds_total": round(time.perf_counter() - start, 1),
    }
    print(json.dumps(summary))
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
