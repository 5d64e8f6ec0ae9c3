"""The Chart panel and its views, one module per chart on a shared base."""
