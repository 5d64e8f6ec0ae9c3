"""Python's cycle collector paused around work that allocates many short-lived objects."""

from __future__ import annotations

import gc
from collections.abc import Iterator
from contextlib import contextmanager


@contextmanager
def collector_paused() -> Iterator[None]:
    """Python's cycle collector off for the block (on again after, if it was on): around
    writing a file (``report.export``, batch's writers) and analysing a chunk or a whole run
    (``procedure/many.py``).

    Such work makes tens of thousands of short-lived objects (rows, cells, strings, result
    objects, Qt wrappers) and almost no reference cycles; each of those allocations counts
    towards the collector's next pass, and a pass walks every object alive: for a report of a
    few hundred series, a tenth of the PDF's time went on passes that found nothing to free."""
    was_on = gc.isenabled()
    gc.disable()
    try:
        yield
    finally:
        if was_on:
            gc.enable()
