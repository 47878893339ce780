"""The commands that read one algebra: describe, check, orders, presentation,
ringel-dual, family."""

from __future__ import annotations

import argparse
import sys

from hwcat.cli import positive_int
from hwcat.cli.common import (
    add_algebra_source,
    load_algebra,
    order_argument,
    with_order_context,
    write_text,
)

# the mathematics (and python-flint) is imported inside the commands, so that
# the parser and ``--help`` start quickly

__all__ = ["register"]


def _load(args: argparse.Namespace):
    return load_algebra(args)


def _cmd_describe(args: argparse.Namespace) -> int:
    from hwcat.io.render import render_structure, write_json
    from hwcat.theory.structure import describe

    _, A = _load(args)
    report = describe(A)
    if args.svg:
        from hwcat.cli.report import write_structure_svgs

        write_structure_svgs(report, args.svg)
    if args.json:
        write_json(report, sys.stdout)
    else:
        print(render_structure(report))
    return 0


def _budget(args: argparse.Namespace) -> dict:
    """The work budget of the homological part, from the command line."""
    return {"bound": args.homological_bound, "max_syzygy_dimension": args.max_syzygy_dimension}


def _cmd_check(args: argparse.Namespace) -> int:
    from hwcat.io.render import render_verdict, to_json
    from hwcat.theory.check import as_order, check

    spec, A = _load(args)
    text, source = order_argument(spec, args.order)
    order = None if text is None else with_order_context(spec, source, lambda: as_order(A, text))
    verdict = check(
        A, order, order_source=source, homological=not args.no_homological, **_budget(args)
    )
    print(to_json(verdict) if args.json else render_verdict(verdict))
    return 0 if verdict.quasi_hereditary else 1


def _cmd_orders(args: argparse.Namespace) -> int:
    from hwcat.io.render import render_orders, to_json
    from hwcat.theory.search import quasi_hereditary_orders

    _, A = _load(args)
    r = quasi_hereditary_orders(A, list_limit=None if args.all else args.limit)
    print(to_json(r) if args.json else render_orders(r))
    return 0 if r.quasi_hereditary else 1


def _notes(A) -> list[str]:
    """Lines about how an algebra given by a table or matrices was reduced."""
    from hwcat.algebras.reduction.reduction import reduction_of

    r = reduction_of(A)
    if r is None:
        from hwcat.algebras.families.tl_module import module_reduction_of

        m = module_reduction_of(A)
        if m is None:
            return []
        dims = ", ".join(
            f"L({v}): {d}" for v, d in zip(m.basic.vertices, m.simple_dimensions, strict=True)
        )
        return [
            f"reduced through the spin chain over {m.chain_field} (no table) from an algebra "
            f"of dimension {m.dimension}; radical dimension {m.radical_dimension}; "
            f"simple dimensions {dims}",
        ]
    B = r.algebra
    dims = ", ".join(
        f"L({v}): {d}" for v, d in zip(r.basic.vertices, r.simple_dimensions, strict=True)
    )
    return [
        f"reduced from an algebra of dimension {B.dim} ({B.associativity.text()}); "
        f"radical dimension {r.radical_dimension}; simple dimensions {dims}",
    ]


def _cmd_presentation(args: argparse.Namespace) -> int:
    from hwcat.algebras.reduction.presentation import presentation_toml

    spec, A = _load(args)
    text = presentation_toml(A, name=spec.name or None)
    for line in _notes(A):
        print(f"# {line}", file=sys.stderr)
    if args.output:
        write_text(args.output, text)
        print(f"wrote {args.output}", file=sys.stderr)
    else:
        print(text, end="")
    return 0


def _cmd_family(args: argparse.Namespace) -> int:
    from hwcat.algebras.families.registry import (
        FAMILIES,
        family_algebra,
        family_reduction_record,
    )
    from hwcat.algebras.reduction.presentation import presentation_toml
    from hwcat.errors import SpecError
    from hwcat.io.render import render_structure, to_json
    from hwcat.io.spec import family_parameters
    from hwcat.theory.structure import describe

    if args.list or not args.name:
        for f in FAMILIES.values():
            print(f"{f.usage()}\n    {f.summary}\n    source: {f.source}")
        return 0
    if args.name not in FAMILIES:
        raise SpecError(f"unknown family {args.name!r} (known: {', '.join(FAMILIES)})")
    params = family_parameters(args.name, args.params, where=f"family {args.name}")
    seed = params.pop("seed", None)
    if seed is not None and args.seed is not None:
        raise SpecError(f"family {args.name}: seed given twice (--seed and seed=)")
    A = family_algebra(args.name, seed=seed if seed is not None else args.seed or 0, **params)
    if args.write_quiver:
        text = presentation_toml(A, name=A.name or args.name)
        write_text(args.write_quiver, text)
        print(f"wrote {args.write_quiver}", file=sys.stderr)
    report = describe(A)
    if args.json:
        red = family_reduction_record(A)
        if red is None:
            print(to_json(report))
        else:
            from hwcat.io.render import json_text

            print(json_text({**report.to_dict(), "reduction": red.to_dict()}))
    else:
        print(render_structure(report))
        for line in _notes(A):
            print(f"  {line}")
    return 0


def _order_for(spec, A, text_arg):
    """The order from the command line, else the spec, else the search's first structure."""
    from hwcat.theory.check import order_or_search

    text, source = order_argument(spec, text_arg)
    return with_order_context(spec, source, lambda: order_or_search(A, text))


def _cmd_ringel_dual(args: argparse.Namespace) -> int:
    from hwcat.algebras.families.quivers import spec_to_toml
    from hwcat.algebras.reduction.presentation import presentation_spec
    from hwcat.theory.highest_weight import heredity_chain
    from hwcat.theory.tilting import ringel_dual

    spec, A = _load(args)
    order = _order_for(spec, A, args.order)
    if order is None or not heredity_chain(A, order).holds:
        print(
            "hwcat: not quasi-hereditary for that order; the Ringel dual is not defined",
            file=sys.stderr,
        )
        return 1
    R, opp = ringel_dual(A, order)
    out = presentation_spec(R, name=R.name)
    out["order"] = ", ".join(f"{a} < {b}" for a, b in opp.covers_named()) or None
    if out["order"] is None:
        del out["order"]
    text = "# Ringel dual End(T) (composition of maps): vertex L is the tilting module T(L), arrow f_M_L a map T(M) -> T(L); the order is the opposite one\n"
    text += spec_to_toml(out)
    if args.output:
        write_text(args.output, text)
        print(f"wrote {args.output}", file=sys.stderr)
    else:
        print(text, end="")
    return 0


def register(sub: argparse._SubParsersAction) -> None:
    """Add this module's commands to the parser."""
    d = sub.add_parser(
        "describe", help="structure of an algebra: Cartan matrix, projectives, injectives"
    )
    add_algebra_source(d)
    d.add_argument("--json", action="store_true", help="print one JSON object")
    d.add_argument(
        "--svg",
        metavar="DIR",
        help="also write SVG pictures to DIR: quiver.svg and a Loewy diagram per module (P_1.svg, I_1.svg, ...)",
    )
    d.set_defaults(func=_cmd_describe)
    c = sub.add_parser("check", help="highest-weight axioms for an order (or for some order)")
    add_algebra_source(c)
    c.add_argument(
        "--order", help='partial order of the simples, e.g. "3 > 2 > 1" or "1 < 2, 1 < 3"'
    )
    c.add_argument("--json", action="store_true", help="print one JSON object")
    c.add_argument(
        "--no-homological",
        action="store_true",
        help="skip the Ext conditions, global dimension, tilting modules and Ringel dual",
    )
    c.add_argument(
        "--max-syzygy-dimension",
        type=positive_int,
        default=None,
        metavar="N",
        help="work budget: build no syzygy or projective term larger than N "
        "(default 600); beyond it the answer is 'at least k' or 'undecided'",
    )
    c.add_argument(
        "--homological-bound",
        type=positive_int,
        default=None,
        metavar="K",
        help="work budget: resolve at most K + 1 steps for projective dimensions "
        "(default 2n + 2, n simples; 2n - 1 for a quasi-hereditary order)",
    )
    c.set_defaults(func=_cmd_check)
    o = sub.add_parser("orders", help="all quasi-hereditary orders and quasi-hereditary structures")
    add_algebra_source(o)
    o.add_argument("--json", action="store_true", help="print one JSON object")
    o.add_argument("--all", action="store_true", help="list every structure")
    o.add_argument(
        "--limit", type=positive_int, default=20, help="how many structures to list (default 20)"
    )
    o.set_defaults(func=_cmd_orders)
    pr = sub.add_parser(
        "presentation",
        help="the quiver with relations of any spec, written as a [quiver] spec",
    )
    add_algebra_source(pr)
    pr.add_argument("-o", "--output", help="write the spec to this file instead of printing it")
    pr.set_defaults(func=_cmd_presentation)
    rd = sub.add_parser(
        "ringel-dual",
        help="the Ringel dual End(T) of a quasi-hereditary algebra, written as a [quiver] spec",
    )
    add_algebra_source(rd)
    rd.add_argument(
        "--order", help="the order (default: the spec's, else the first structure found)"
    )
    rd.add_argument("-o", "--output", help="write the spec to this file instead of printing it")
    rd.set_defaults(func=_cmd_ringel_dual)
    fa = sub.add_parser(
        "family",
        help="a built-in family: describe it, or write its quiver with relations for other commands",
    )
    fa.add_argument("name", nargs="?", help="family name (see --list)")
    fa.add_argument("params", nargs="*", help="parameters key=value, e.g. n=4 delta=0 field=QQ")
    fa.add_argument("--list", action="store_true", help="list the families and their parameters")
    fa.add_argument("--json", action="store_true", help="print one JSON object")
    fa.add_argument(
        "--seed", type=int, help="seed of the randomised reduction (default 0; also seed=N)"
    )
    fa.add_argument(
        "--write-quiver",
        metavar="FILE",
        help="also write the family's quiver with relations as a spec (for check, orders, ...)",
    )
    fa.set_defaults(func=_cmd_family)
