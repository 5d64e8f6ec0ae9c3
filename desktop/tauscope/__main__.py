"""Allow ``python -m tauscope``."""

from tauscope.cli import main

# Guarded: the analysis process (spawned) imports this module again under another name.
if __name__ == "__main__":
    raise SystemExit(main())
