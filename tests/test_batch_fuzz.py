"""The batch fuzz campaign in the suite: 2,000 generated malformed inputs, each through
``tauscope batch``'s own ``main`` in a forked child with a memory limit and an alarm
(tests/fuzz_batch_runner.py, categories in tests/fuzz_inputs.py).

Every input must end with exit 0, 2 or 3, at most one line on standard error, within
10 s and 1 GB more than the parent's address space, and leave every input file
unchanged (SHA-256 and modification time).  benchmarks/fuzz_batch.py runs more.
"""

from __future__ import annotations

import json
import os
import subprocess
import sys
from pathlib import Path

import pytest

from fuzz_inputs import MAKERS  # tests/ is on sys.path (rootdir-relative imports)

HERE = Path(__file__).resolve().parent
COUNT = 2000


@pytest.mark.skipif(not hasattr(os, "fork"), reason="the campaign forks its children")
def test_two_thousand_malformed_inputs_end_cleanly(tmp_path: Path) -> None:
    env = {**os.environ, "OPENBLAS_NUM_THREADS": "1", "OMP_NUM_THREADS": "1",
           "PYTHONPATH": os.pathsep.join([str(HERE.parent / "desktop"), str(HERE),
                                          os.environ.get("PYTHONPATH", "")])}
    done = subprocess.run(
        [sys.executable, str(HERE / "fuzz_batch_runner.py"), "--count", str(COUNT),
         "--seed", "16", "--folder", str(tmp_path)],
        capture_output=True, text=True, env=env, timeout=1800, check=False)
    assert done.returncode == 0, done.stderr[-3000:]
    summary = json.loads(done.stdout.strip().splitlines()[-1])
    assert summary["count"] == COUNT
    assert set(summary["categories"]) == {m.__name__ for m in MAKERS}
    assert summary["failure_count"] == 0, json.dumps(summary["failures"], indent=1)[:6000]
    assert set(summary["codes"]) <= {"0", "2", "3"}
    assert {"0", "2", "3"} <= set(summary["codes"])  # the campaign reaches every ending
