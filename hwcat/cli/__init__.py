"""The ``hwcat`` command line.

Each command lives in a module of this package with a ``register(sub)``
function that adds its subparser; this module only builds the parser from
them and turns errors into exit codes.

Exit codes: 0 success (or a mathematical "yes"), 1 a mathematical "no"
(e.g. not quasi-hereditary), 2 bad input.
"""

from __future__ import annotations

import argparse
import importlib
import sys
from collections.abc import Sequence

from hwcat.errors import HwcatError, InternalInconsistency

__all__ = ["main", "build_parser", "COMMAND_MODULES"]

COMMAND_MODULES = ("core", "module")
"""Modules of :mod:`hwcat.cli` whose ``register`` adds commands, in help order."""


def build_parser() -> argparse.ArgumentParser:
    p = argparse.ArgumentParser(
        prog="hwcat",
        description="Exact highest-weight-category checks for finite-dimensional algebras.",
    )
    sub = p.add_subparsers(dest="command", required=True)
    for name in COMMAND_MODULES:
        importlib.import_module(f"hwcat.cli.{name}").register(sub)
    return p


def main(argv: Sequence[str] | None = None) -> int:
    parser = build_parser()
    args = parser.parse_args(argv)
    try:
        return args.func(args)
    except InternalInconsistency:
        raise
    except HwcatError as exc:
        print(f"hwcat: error: {exc}", file=sys.stderr)
        return 2
    except BrokenPipeError:  # output piped into a pager or head
        return 0


if __name__ == "__main__":  # pragma: no cover
    sys.exit(main())
