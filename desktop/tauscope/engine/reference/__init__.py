"""The reference path: one statsmodels regression per model (``path="reference"``).

The fast path must give its numbers to 1e-8 (tests/test_engine_fast_path.py), and takes
over any series the fast path declines."""
