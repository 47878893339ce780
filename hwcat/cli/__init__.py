"""The ``hwcat`` command line.

Each command lives in a module of this package with a ``register(sub)``
function that adds its subparser; this module only builds the parser from
them and turns errors into exit codes.

Long commands show progress on standard error when it is a terminal (never
with ``--json`` and never in pipes).

Exit codes: 0 success (or a mathematical "yes"), 1 a mathematical "no"
(e.g. not quasi-hereditary), 2 bad input.
"""

from __future__ import annotations

import argparse
import importlib
import sys
from collections.abc import Sequence

from hwcat.errors import HwcatError, InternalInconsistency

__all__ = ["main", "build_parser", "show_progress", "COMMAND_MODULES"]

COMMAND_MODULES = ("core",)
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
    from hwcat import progress

    if show_progress(sys.stderr, args):
        progress.enable(sys.stderr)  # bars appear for steps longer than a second
    try:
        return args.func(args)
    except InternalInconsistency:
        raise
    except HwcatError as exc:
        print(f"hwcat: error: {exc}", file=sys.stderr)
        return 2
    except BrokenPipeError:  # output piped into a pager or head
        return 0
    finally:
        progress.disable()


def show_progress(stream, args: argparse.Namespace) -> bool:
    """Progress is shown on a terminal only, and never with ``--json``."""
    isatty = getattr(stream, "isatty", None)
    return bool(isatty and isatty()) and not getattr(args, "json", False)


if __name__ == "__main__":  # pragma: no cover
    sys.exit(main())
