"""A larger batch fuzz campaign than the suite's: the same inputs and checks, more of them.

    python benchmarks/fuzz_batch.py [--count 20000] [--seed 1]

Runs tests/fuzz_batch_runner.py (which imports Tauscope once and forks a child per input,
with a memory limit and an alarm) in a temporary folder and prints its summary: how many
inputs, the exit codes, seconds per category, the slowest input and every failure.
Nothing here is a pass/fail threshold; the suite's tests/test_batch_fuzz.py is.
"""

from __future__ import annotations

import argparse
import json
import os
import subprocess
import sys
import tempfile
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--count", type=int, default=20_000)
    parser.add_argument("--seed", type=int, default=1)
    args = parser.parse_args()
    env = {**os.environ, "OPENBLAS_NUM_THREADS": "1", "OMP_NUM_THREADS": "1",
           "PYTHONPATH": os.pathsep.join([str(ROOT / "desktop"), str(ROOT / "tests")])}
    with tempfile.TemporaryDirectory() as folder:
        done = subprocess.run(
            [sys.executable, str(ROOT / "tests" / "fuzz_batch_runner.py"), "--count",
             str(args.count), "--seed", str(args.seed), "--folder", folder],
            capture_output=True, text=True, env=env, check=False)
    if done.returncode != 0:
        print(done.stderr)
        raise SystemExit(done.returncode)
    summary = json.loads(done.stdout.strip().splitlines()[-1])
    print(json.dumps(summary, indent=1))


if __name__ == "__main__":
    main()
