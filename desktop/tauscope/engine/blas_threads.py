"""One BLAS thread while many small regressions run.

The fast path's linear algebra is thousands of small factorisations (a few hundred rows,
at most a few dozen columns).  OpenBLAS splits each across its thread pool, which costs
more in waking and synchronising threads than it saves on matrices this size, and on a
busy machine a thread that waits for a core stalls the whole call.  While
:func:`single_blas_thread` is active the BLAS libraries loaded in the process run on one
thread (``threadpoolctl``); the previous setting comes back when the last user leaves.
``benchmarks/blas_threads.py`` measures the analysis both ways in one run.

The limit is process-wide (a BLAS library has one thread setting), so nested and
concurrent users are counted and only the first sets it and the last restores it.
Without ``threadpoolctl`` nothing changes.
"""

from __future__ import annotations

import threading
from collections.abc import Iterator
from contextlib import contextmanager
from typing import Any

PIN = True  # False: leave BLAS's own thread count (for measuring both settings)

_lock = threading.Lock()
_users = 0
_limiter: Any = None


@contextmanager
def single_blas_thread() -> Iterator[None]:
    """BLAS on one thread inside the block (when :data:`PIN` is set and threadpoolctl is
    installed); nested and concurrent blocks share one limit."""
    global _users, _limiter
    with _lock:
        if _users == 0 and PIN:
            _limiter = _limit_to_one()
        _users += 1
    try:
        yield
    finally:
        with _lock:
            _users -= 1
            if _users == 0 and _limiter is not None:
                _limiter.restore_original_limits()
                _limiter = None


def _limit_to_one() -> Any:
    try:
        from threadpoolctl import threadpool_limits
    except ImportError:  # an install without it runs as before
        return None
    return threadpool_limits(limits=1, user_api="blas")
