"""Allow ``python -m tauscope``."""

from tauscope.cli import main

raise SystemExit(main())
