"""What several commands share: how an algebra is named on the command line, and writing files.

Nothing here imports the mathematics at module level, so that building the
parser stays fast.  Every command that reads one algebra takes either a spec file (``SPEC``) or a
built-in family (``--family NAME KEY=VALUE ...``), through
:func:`add_algebra_source` and :func:`load_algebra`.
"""

from __future__ import annotations

import argparse

from hwcat.errors import OrderError, SpecError

__all__ = [
    "add_algebra_source",
    "load_algebra",
    "order_argument",
    "with_order_context",
    "write_text",
]


def add_algebra_source(p: argparse.ArgumentParser) -> None:
    """Add ``SPEC`` and ``--family NAME KEY=VALUE ...`` (exactly one of them) to a parser."""
    p.add_argument(
        "spec", nargs="?", help="algebra spec file (TOML, see specs/FORMAT.md), or use --family"
    )
    p.add_argument(
        "--family",
        nargs="+",
        metavar="NAME_OR_KEY=VALUE",
        help="a built-in family instead of a spec file: NAME then parameters, "
        "e.g. --family temperley-lieb n=6 delta=0 field=GF(3) (see hwcat family --list)",
    )


def load_algebra(args: argparse.Namespace):
    """The spec (a :class:`~hwcat.io.spec.Spec`) and its algebra, from ``SPEC`` or ``--family``."""
    from hwcat.io.spec import build_algebra, family_source, read_spec

    if (args.spec is None) == (args.family is None):
        raise SpecError("give exactly one of a spec file or --family NAME KEY=VALUE ...")
    spec = read_spec(args.spec) if args.spec is not None else family_source(args.family)
    return spec, build_algebra(spec)


def write_text(path: str, text: str) -> None:
    """Write ``text`` to ``path``; a failure is a one-line user error."""
    try:
        with open(path, "w", encoding="utf-8") as fh:
            fh.write(text)
    except OSError as exc:
        raise SpecError(f"{path}: cannot write: {exc.strerror or exc}") from None


def order_argument(spec, text_arg):
    """The order text and where it came from: ``--order``, else the spec's ``order``."""
    if text_arg is not None:
        return text_arg, "command line"
    return spec.order, "spec file"


def with_order_context(spec, source: str, fn):
    """Run ``fn``; an :class:`OrderError` gets the option or the spec key in front."""
    try:
        return fn()
    except OrderError as exc:
        where = "--order" if source == "command line" else f"{spec.source}: order"
        raise OrderError(f"{where}: {exc}") from None
