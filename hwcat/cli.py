"""The ``hwcat`` command line.

Exit codes: 0 success (or a mathematical "yes"), 1 a mathematical "no"
(e.g. not quasi-hereditary), 2 bad input.
"""

from __future__ import annotations

import argparse
import sys
from collections.abc import Sequence

from hwcat.errors import HwcatError, InternalInconsistency
from hwcat.io.render import render_structure, to_json
from hwcat.io.spec import build_algebra, read_spec

__all__ = ["main"]


def _cmd_describe(args: argparse.Namespace) -> int:
    from hwcat.theory.structure import describe

    spec = read_spec(args.spec)
    report = describe(build_algebra(spec))
    print(to_json(report) if args.json else render_structure(report))
    return 0


def build_parser() -> argparse.ArgumentParser:
    p = argparse.ArgumentParser(
        prog="hwcat",
        description="Exact highest-weight-category checks for finite-dimensional algebras.",
    )
    sub = p.add_subparsers(dest="command", required=True)
    d = sub.add_parser(
        "describe", help="structure of an algebra: Cartan matrix, projectives, injectives"
    )
    d.add_argument("spec", help="algebra spec file (TOML, see specs/FORMAT.md)")
    d.add_argument("--json", action="store_true", help="print one JSON object")
    d.set_defaults(func=_cmd_describe)
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


if __name__ == "__main__":  # pragma: no cover
    sys.exit(main())
