"""The engine's own error type: one clear sentence about why a series cannot be tested."""


class UntestableSeries(Exception):
    """Raised inside the engine when a series cannot be tested; never escapes analyse_series."""
