"""The ``hwcat`` command line.

Each command lives in a module of this package with a ``register(sub)``
function that adds its subparser; this module only builds the parser from
them and turns errors into exit codes.

Long commands show progress on standard error when it is a terminal (never
with ``--json`` and never in pipes).

Exit codes: 0 success (or a mathematical "yes"), 1 a mathematical "no"
(e.g. not quasi-hereditary), 2 bad input; ``fuzz`` also 3 (no counterexample,
but some examples were lost, so the campaign is incomplete).
"""

from __future__ import annotations

import argparse
import importlib
import sys
from collections.abc import Sequence

from hwcat.errors import HwcatError, InternalInconsistency
from hwcat.limits import DEFAULT_LIMITS, resource_limits

__all__ = ["main", "build_parser", "positive_int", "show_progress", "COMMAND_MODULES"]

COMMAND_MODULES = ("core", "module", "report", "certificates", "campaigns")
"""Modules of :mod:`hwcat.cli` whose ``register`` adds commands, in help order."""


class _Parser(argparse.ArgumentParser):
    """An argument parser whose errors are one line and exit code 2."""

    def error(self, message: str):  # type: ignore[override]
        print(f"{self.prog}: error: {message} (see {self.prog} --help)", file=sys.stderr)
        raise SystemExit(2)


def positive_int(text: str) -> int:
    """An argparse type: a positive integer (``--limit 0`` and ``--limit -1`` are refused)."""
    try:
        value = int(text)
    except ValueError:
        raise argparse.ArgumentTypeError(f"{text!r} is not an integer") from None
    if value < 1:
        raise argparse.ArgumentTypeError(f"{text!r}: must be a positive integer")
    return value


def _add_limit_options(p: argparse.ArgumentParser, default) -> None:
    g = p.add_argument_group("resource limits (see README: resource limits)")
    g.add_argument(
        "--max-dim",
        type=positive_int,
        metavar="N",
        default=default,
        help=f"largest dimension of an algebra or of a space built on the way "
        f"(default {DEFAULT_LIMITS.max_dim})",
    )
    g.add_argument(
        "--max-quiver-vertices",
        type=positive_int,
        metavar="N",
        default=default,
        help=f"largest number of vertices of a quiver (default {DEFAULT_LIMITS.max_vertices})",
    )
    g.add_argument(
        "--max-products",
        type=positive_int,
        metavar="N",
        default=default,
        help=f"largest number of products b_i*b_j of a multiplication table "
        f"(default {DEFAULT_LIMITS.max_products})",
    )


def build_parser() -> argparse.ArgumentParser:
    p = _Parser(
        prog="hwcat",
        description="Exact highest-weight-category checks for finite-dimensional algebras.",
    )
    _add_limit_options(p, None)
    sub = p.add_subparsers(dest="command", required=True)
    for name in COMMAND_MODULES:
        importlib.import_module(f"hwcat.cli.{name}").register(sub)
    for cmd in sub.choices.values():  # the limits may also follow the command
        _add_limit_options(cmd, argparse.SUPPRESS)
    return p


def main(argv: Sequence[str] | None = None) -> int:
    parser = build_parser()
    try:
        args = parser.parse_args(argv)
    except SystemExit as exc:  # --help, or a bad option (one line already printed)
        return exc.code if isinstance(exc.code, int) else 0
    from hwcat import progress

    if show_progress(sys.stderr, args):
        progress.enable(sys.stderr)  # bars appear for steps longer than a second
    try:
        with resource_limits(
            max_dim=args.max_dim,
            max_vertices=args.max_quiver_vertices,
            max_products=args.max_products,
        ):
            return args.func(args)
    except InternalInconsistency:
        raise
    except HwcatError as exc:
        print(f"hwcat: error: {exc}", file=sys.stderr)
        return 2
    except BrokenPipeError:  # output piped into a pager or head
        return 0
    except MemoryError:
        print(
            "hwcat: error: out of memory; the input is too large for this machine (the limits "
            "--max-dim, --max-products and --max-quiver-vertices refuse such work unless raised)",
            file=sys.stderr,
        )
        return 2
    except KeyboardInterrupt:
        print("hwcat: interrupted", file=sys.stderr)
        return 130
    finally:
        progress.disable()


def show_progress(stream, args: argparse.Namespace) -> bool:
    """Progress is shown on a terminal only, and never with ``--json``."""
    isatty = getattr(stream, "isatty", None)
    return bool(isatty and isatty()) and not getattr(args, "json", False)


if __name__ == "__main__":  # pragma: no cover
    sys.exit(main())
