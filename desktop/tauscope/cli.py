"""Command line entry point.

tauscope [FILE ...]                 open the window
tauscope batch FILE [options]       headless analysis (tauscope.commands.batch)
tauscope snapshot [FILE] --out PNG  picture of the analysed window (tauscope.commands.snapshot)
tauscope self-test                  analyse the bundled demo data, check invariants
"""

from __future__ import annotations

import importlib
import sys

SUBCOMMANDS = {
    "batch": "tauscope.commands.batch",
    "snapshot": "tauscope.commands.snapshot",
    "self-test": "tauscope.commands.selftest",
}

USAGE = """usage: tauscope [FILE ...]
       tauscope batch FILE [--sheet NAME] [--series NAME] [--transform log|diff|logdiff|none]
                      [--lag-rule RULE] [--lags N] [--max-lags N] [--alpha A]
                      [--max-difference D] [--out FILE ...]
       tauscope snapshot [FILE] --out PNG
       tauscope self-test
       tauscope --version"""


def main(argv: list[str] | None = None) -> int:
    args = list(sys.argv[1:] if argv is None else argv)
    if args and args[0] in ("-h", "--help"):
        print(USAGE)
        return 0
    if args and args[0] == "--version":
        from tauscope import __version__

        print(f"tauscope {__version__}")
        return 0
    if args and args[0] in SUBCOMMANDS:
        module = importlib.import_module(SUBCOMMANDS[args[0]])
        return int(module.main(args[1:]))
    if args and args[0].startswith("-"):
        print(USAGE, file=sys.stderr)
        return 2
    module = importlib.import_module("tauscope.commands.window")
    return int(module.main(args))
