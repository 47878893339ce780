"""``hwcat report``: one self-contained HTML page about an algebra; and the SVG
files of ``hwcat describe --svg DIR``."""

from __future__ import annotations

import argparse
import sys

from hwcat.errors import OrderError, SpecError
from hwcat.io.spec import build_algebra, read_spec

__all__ = ["register"]


def _checked_order(spec, A, text_arg):
    """The order to check, where it came from, a note, and the orders search result.

    The order is ``--order``, else the spec's ``order``, else the essential
    order of the first structure the search finds, else (not quasi-hereditary
    for any order) the search's longest heredity chain completed in spec order.
    """
    from hwcat.theory.orders import parse_order, total_order
    from hwcat.theory.search import quasi_hereditary_orders

    orders = quasi_hereditary_orders(A, list_limit=20)
    text, source = (text_arg, "command line") if text_arg else (spec.order, "spec file")
    if text:
        try:
            return parse_order(text, A.vertices), source, "", orders
        except OrderError as exc:
            where = "--order" if source == "command line" else f"{spec.source}: order"
            raise OrderError(f"{where}: {exc}") from None
    if orders.quasi_hereditary:
        return (
            orders.structure_list[0].essential_order,
            "found by search: essential order of a structure",
            "no order given; the axioms are checked for the essential order of the first structure found",
            orders,
        )
    chain = list(orders.best_attempt)
    rest = [v for v in range(A.n) if v not in chain]
    return (
        total_order(A.vertices, chain + rest),
        "best attempt of the search",
        "no order makes the algebra quasi-hereditary; the axioms are for the longest heredity "
        "chain found, completed in spec order",
        orders,
    )


def _cmd_report(args: argparse.Namespace) -> int:
    from hwcat import __version__
    from hwcat.io.html import render_report_html
    from hwcat.theory.structure import describe
    from hwcat.theory.verdict import check_order

    spec = read_spec(args.spec)
    A = build_algebra(spec)
    structure = describe(A)
    order, source, note, orders = _checked_order(spec, A, args.order)
    verdict = check_order(A, order, order_source=source)
    page = render_report_html(structure, verdict, orders, search_note=note, version=__version__)
    try:
        with open(args.output, "w", encoding="utf-8") as fh:
            fh.write(page)
    except OSError as exc:
        raise SpecError(f"{args.output}: cannot write: {exc.strerror or exc}") from None
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
    r.add_argument("spec", help="algebra spec file")
    r.add_argument(
        "--order",
        help="the order to check (default: the spec's, else the first structure found)",
    )
    r.add_argument("-o", "--output", required=True, metavar="FILE.html", help="the page to write")
    r.set_defaults(func=_cmd_report)
