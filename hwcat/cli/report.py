"""``hwcat report``: one self-contained HTML page about an algebra; and the SVG
files of ``hwcat describe --svg DIR``."""

from __future__ import annotations

import argparse
import sys

from hwcat.cli.common import (
    add_algebra_source,
    load_algebra,
    order_argument,
    with_order_context,
    write_text,
)
from hwcat.errors import SpecError

__all__ = ["register"]


def _cmd_report(args: argparse.Namespace) -> int:
    from hwcat import __version__
    from hwcat.io.html import render_report_html
    from hwcat.io.render import search_line
    from hwcat.theory.check import as_order, check
    from hwcat.theory.search import quasi_hereditary_orders
    from hwcat.theory.structure import describe

    spec, A = load_algebra(args)
    structure = describe(A)
    orders = quasi_hereditary_orders(A, list_limit=20)
    text, source = order_argument(spec, args.order)
    order = None if text is None else with_order_context(spec, source, lambda: as_order(A, text))
    verdict = check(A, order, order_source=source)
    note = "" if verdict.search is None else search_line(verdict.search)
    page = render_report_html(structure, verdict, orders, search_note=note, version=__version__)
    write_text(args.output, page)
    print(f"wrote {args.output}", file=sys.stderr)
    return 0


def write_structure_svgs(report, directory: str) -> None:
    """One SVG file per module of ``report`` plus ``quiver.svg``; names are listed on stderr."""
    from pathlib import Path

    from hwcat.io.svg import file_names, loewy_svg, quiver_svg, svg_text

    out = Path(directory)
    try:
        out.mkdir(parents=True, exist_ok=True)
        mods = list(report.projectives) + list(report.injectives)
        idx = {v: i for i, v in enumerate(report.simples)}
        pictures = [
            (
                "quiver.svg",
                quiver_svg(
                    report.simples,
                    [(n, idx[s], idx[t]) for n, s, t in report.arrows],
                    f"Gabriel quiver of {report.name or 'the algebra'}",
                ),
            )
        ]
        names = file_names([m.label for m in mods])
        pictures += [
            (f, loewy_svg(m.loewy_diagram, m.label)) for f, m in zip(names, mods, strict=True)
        ]
        for fname, svg in pictures:
            (out / fname).write_text(svg_text(svg, declaration=True), encoding="utf-8")
    except OSError as exc:
        raise SpecError(f"{directory}: cannot write pictures: {exc.strerror or exc}") from None
    print(f"wrote {len(pictures)} SVG files to {directory}", file=sys.stderr)


def register(sub: argparse._SubParsersAction) -> None:
    """Add the ``report`` command."""
    r = sub.add_parser(
        "report",
        help="one self-contained HTML page: matrices, axioms, orders and Loewy diagrams",
    )
    add_algebra_source(r)
    r.add_argument(
        "--order",
        help="the order to check (default: the spec's, else the first structure found)",
    )
    r.add_argument("-o", "--output", required=True, metavar="FILE.html", help="the page to write")
    r.set_defaults(func=_cmd_report)
