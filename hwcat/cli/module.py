"""The ``module`` command: decompose a module the user holds."""

from __future__ import annotations

import argparse
import json
import sys
from pathlib import Path

from hwcat.cli.common import parse_assignments
from hwcat.errors import HwcatError, ModuleFileError, OrderError, SpecError

__all__ = ["register"]

SIMPLES_LIMIT = 64
"""Largest spin chain (dimension) for which the algebra it generates is built to find
the simples; beyond it only the generators are used."""


def _family_module(args):
    from hwcat.io.module_file import spin_chain_module

    if args.family != "temperley-lieb":
        raise SpecError(
            f"--family {args.family!r}: only temperley-lieb has a built-in module (spin-chain)"
        )
    if args.module not in (None, "spin-chain", "spin_chain"):
        raise ModuleFileError(
            f"--module {args.module!r}: the temperley-lieb family offers spin-chain"
        )
    p = parse_assignments(args.target)
    unknown = sorted(set(p) - {"n", "delta", "field"})
    if unknown:
        raise SpecError(f"family parameter {unknown[0]!r}: temperley-lieb takes n, delta, field")
    try:
        n = int(p.get("n", ""))
    except ValueError:
        raise SpecError(f"family parameter n={p.get('n')!r}: an integer is needed") from None
    return spin_chain_module(n, p.get("delta", "0"), p.get("field", "QQ"))


def _cmd_module(args: argparse.Namespace) -> int:
    from hwcat.io.module_file import attach_algebra, named_module, natural_module, read_module_file
    from hwcat.io.module_render import render_module_report
    from hwcat.io.spec import build_algebra, read_spec
    from hwcat.theory.module_report import analyse_module
    from hwcat.theory.orders import parse_order

    identify = not args.no_simples
    B = None
    order = None
    if args.family:
        M = _family_module(args)
        kind = "family"
        if identify and M.dim > SIMPLES_LIMIT:
            identify = False
            print(
                f"hwcat: note: a chain of dimension {M.dim} > {SIMPLES_LIMIT}: simples, layers and "
                "identification skipped (they need the algebra the chain generates); "
                "decomposition, End and Jordan types follow",
                file=sys.stderr,
            )
        if identify:
            from hwcat.algebras.inputs.structure_input import matrix_algebra
            from hwcat.algebras.reduction.reduction import reduce_algebra

            A = matrix_algebra(M.field, M.generators, name=M.name)
            B = reduce_algebra(A).basic
            attach_algebra(M, "matrices", B)
    else:
        if len(args.target) != 1:
            raise SpecError("hwcat module: give one spec file (or --family NAME key=value ...)")
        spec = read_spec(args.target[0])
        kind = spec.kind
        needs_B = (
            identify or spec.kind == "quiver" or (args.module and not Path(args.module).exists())
        )
        if needs_B:
            B = build_algebra(spec)
        text = args.order or spec.order
        if text and B is not None:
            try:
                order = parse_order(text, B.vertices)
            except OrderError as exc:
                where = "--order" if args.order else f"{spec.source}: order"
                raise OrderError(f"{where}: {exc}") from None
        if args.module is None:
            if spec.kind != "matrices":
                raise ModuleFileError(
                    f"{spec.source}: only a [matrices] spec has a natural module; give --module FILE or a name"
                )
            M = natural_module(spec)
        elif Path(args.module).exists():
            M = read_module_file(args.module, spec, B)
        else:
            if order is None and B is not None:
                from hwcat.theory.search import quasi_hereditary_orders

                r = quasi_hereditary_orders(B, list_limit=1)
                order = r.structure_list[0].essential_order if r.quasi_hereditary else None
            M = named_module(args.module, B, order)
        if B is not None:
            attach_algebra(M, kind, B)
    for e in args.element:
        try:
            M.element(e)
        except HwcatError as exc:
            raise ModuleFileError(f"--element {e!r}: {exc}") from None
    report = analyse_module(
        M, B, elements=args.element, order=order, identify=identify, seed=args.seed
    )
    if args.json:
        print(json.dumps(report.to_dict(), indent=2))
    else:
        print(render_module_report(report))
    return 0


def register(sub: argparse._SubParsersAction) -> None:
    """Add the ``module`` command."""
    m = sub.add_parser(
        "module",
        help="decompose a module into indecomposables: what each summand is, Jordan types, centre",
    )
    m.add_argument(
        "target",
        nargs="*",
        help="the algebra spec file (or, with --family, the family's parameters key=value)",
    )
    m.add_argument(
        "--module",
        help="a module file (TOML, see specs/FORMAT.md) or a name: P(x), I(x), L(x), "
        "standard(x) or Delta(x), costandard(x) or nabla(x), tilting(x) or T(x), regular; "
        "with --family temperley-lieb: spin-chain (default: the natural module of a [matrices] spec)",
    )
    m.add_argument(
        "--family", help="a built-in family instead of a spec (temperley-lieb: its spin chain)"
    )
    m.add_argument(
        "--element",
        action="append",
        default=[],
        metavar="EXPR",
        help="an element (noncommutative polynomial in generators, basis names or paths; 1 is "
        "the identity) whose Jordan type to report; repeatable",
    )
    m.add_argument("--order", help="the order for Delta, nabla, T (default: spec, else essential)")
    m.add_argument(
        "--no-simples",
        action="store_true",
        help="only decompose (End, summands, Jordan types): skip simples, layers, identification, centre",
    )
    m.add_argument("--seed", type=int, default=0, help="seed of the randomised steps")
    m.add_argument("--json", action="store_true", help="print one JSON object")
    m.set_defaults(func=_cmd_module)
