"""The ``module`` command: decompose a module the user holds."""

from __future__ import annotations

import argparse
import sys
from pathlib import Path

from hwcat.cli.common import add_algebra_source, order_argument, with_order_context
from hwcat.errors import HwcatError, ModuleFileError, SpecError
from hwcat.io.render import to_json

__all__ = ["register"]


def _spin_chain(spec, identify: bool):
    """The Temperley-Lieb spin chain of ``--family temperley-lieb n=N delta=D field=F``, and
    the family's algebra when its summands are to be identified (see
    :func:`hwcat.io.module_file.spin_chain_identifiable`)."""
    from hwcat.algebras.families.registry import parse_parameters
    from hwcat.io.module_file import attach_spin_chain, spin_chain_identifiable, spin_chain_module
    from hwcat.io.spec import build_algebra

    params = {k: v for k, v in spec.table.items() if k not in ("name", "seed")}
    p = parse_parameters("temperley-lieb", params)
    if p["n"] is None:
        raise SpecError("--family temperley-lieb: parameter n is required")
    M = spin_chain_module(p["n"], p["delta"], spec.field)
    B = None
    if identify:
        ok, why = spin_chain_identifiable(p["n"])
        if ok:
            B = build_algebra(spec)
            attach_spin_chain(M, p["n"], B)
        else:
            print(f"hwcat: note: {why}", file=sys.stderr)
    return M, B


def _coproduct(spec, args: argparse.Namespace):
    from hwcat.algebras.families.coproducts import coproduct_by_name, family_coproduct

    if args.coproduct is not None:
        c = coproduct_by_name(args.coproduct)
    elif spec.kind == "family":
        c = family_coproduct(str(spec.table.get("name")), spec.table)
    else:
        c = None
    if c is None:
        raise SpecError(
            f"--tensor: {spec.source} has no known coproduct (families symmetric-group, "
            "cyclic-group, small-quantum-sl2; or --coproduct group|quantum-sl2 for a "
            "[multiplication] spec)"
        )
    if spec.kind == "family":
        from hwcat.algebras.families.registry import FAMILIES

        fam = FAMILIES[str(spec.table.get("name"))]
        if fam.kind != "table":
            raise SpecError(
                f"--tensor: family {fam.name} is given by a quiver; tensor products are "
                "for multiplication tables and table families"
            )
    if spec.kind not in ("family", "multiplication"):
        raise SpecError(
            f"--tensor: tensor products are for multiplication tables and table families, "
            f"not [{spec.kind}] specs"
        )
    return c


def _tensor_factor(text: str, spec, B):
    """A module of the input algebra: a module file, ``regular`` or ``P(x)``."""
    from hwcat.algebras.reduction.reduction import reduction_of
    from hwcat.io.module_file import algebra_module, read_module_file

    if Path(text).exists():
        return read_module_file(text, spec, B)
    red = reduction_of(B)
    if red is None:
        raise SpecError(f"--tensor: {spec.source} is not a multiplication table")
    try:
        return algebra_module(text, red)
    except ModuleFileError as exc:
        raise ModuleFileError(f"--tensor/--module: {exc}") from None


def _cmd_module(args: argparse.Namespace) -> int:
    from hwcat.io.module_file import attach_algebra, named_module, natural_module, read_module_file
    from hwcat.io.module_render import render_module_report
    from hwcat.io.spec import build_algebra, family_source, read_spec
    from hwcat.modules.action import tensor_product
    from hwcat.theory.module_report import analyse_module
    from hwcat.theory.orders import parse_order

    if (args.spec is None) == (args.family is None):
        raise SpecError(
            "hwcat module: give exactly one of a spec file or --family NAME KEY=VALUE ..."
        )
    spec = read_spec(args.spec) if args.spec is not None else family_source(args.family)
    family = str(spec.table.get("name")) if spec.kind == "family" else None
    if family == "temperley-lieb" and "route" not in spec.table:
        # modules of TL_n are read and identified through the diagram basis, which only
        # the table route's reduction carries
        import dataclasses

        spec = dataclasses.replace(spec, table={**spec.table, "route": "table"})
    identify = not args.no_simples
    order = None
    chain = family == "temperley-lieb" and args.module in (None, "spin-chain", "spin_chain")
    if args.tensor and chain:
        raise SpecError("--tensor: the Temperley-Lieb family has no coproduct")
    if chain:
        M, B = _spin_chain(spec, identify)
        identify = identify and B is not None
    else:
        if args.module in ("spin-chain", "spin_chain"):
            raise ModuleFileError(
                f"--module {args.module!r}: only --family temperley-lieb offers the spin chain"
            )
        named = args.module is not None and not Path(args.module).exists()
        needs_B = identify or spec.kind in ("quiver", "family") or named or bool(args.tensor)
        B = build_algebra(spec) if needs_B else None
        if args.coproduct is not None and not args.tensor:
            raise SpecError("--coproduct: give the second factor with --tensor")
        if args.tensor:
            coproduct = _coproduct(spec, args)
            if args.module is None:
                raise ModuleFileError("--tensor: give the first factor with --module")
            M = _tensor_factor(args.module, spec, B)
            for t in args.tensor:
                M = tensor_product(M, _tensor_factor(t, spec, B), coproduct=coproduct)
        elif args.module is None:
            if spec.kind != "matrices":
                raise ModuleFileError(
                    f"{spec.source}: only a [matrices] spec has a natural module "
                    "(and --family temperley-lieb its spin chain); give --module FILE or a name"
                )
            M = natural_module(spec)
        elif not named:
            M = read_module_file(args.module, spec, B)
        else:
            M = None
        text, source = order_argument(spec, args.order)
        if text is not None and B is not None:
            order = with_order_context(spec, source, lambda: parse_order(text, B.vertices))
        elif text is not None and not text.strip():  # no algebra to read it against
            with_order_context(spec, source, lambda: parse_order(text, ()))
        if M is None:
            if order is None and B is not None and not B.natural_order:
                from hwcat.theory.search import quasi_hereditary_orders

                r = quasi_hereditary_orders(B, list_limit=1)
                order = r.structure_list[0].essential_order if r.quasi_hereditary else None
            elif order is None and B is not None:
                from hwcat.theory.check import as_order

                order = as_order(B, B.natural_order)
            M = named_module(args.module, B, order)
            from hwcat.algebras.reduction.reduction import reduction_of

            if reduction_of(B) is not None:
                # named modules of a reduced algebra live over its basic algebra (Morita
                # equivalent); --tensor factors are the input algebra's own modules
                M.name = f"{M.name} of the basic algebra"
        if B is not None:
            attach_algebra(M, "family" if spec.kind == "family" else spec.kind, B)
    for e in args.element:
        try:
            M.element(e)
        except HwcatError as exc:
            raise ModuleFileError(f"--element {e!r}: {exc}") from None
    report = analyse_module(
        M, B, elements=args.element, order=order, identify=identify, seed=args.seed
    )
    if args.json:
        print(to_json(report))
    else:
        print(render_module_report(report))
    return 0


def register(sub: argparse._SubParsersAction) -> None:
    """Add the ``module`` command."""
    m = sub.add_parser(
        "module",
        help="decompose a module into indecomposables: what each summand is, Jordan types, centre",
    )
    add_algebra_source(m)
    m.add_argument(
        "--module",
        help="a module file (TOML, see specs/FORMAT.md) or a name: P(x), I(x), L(x), "
        "standard(x) or Delta(x), costandard(x) or nabla(x), tilting(x) or T(x), regular; "
        "with --family temperley-lieb: spin-chain (default: the natural module of a "
        "[matrices] spec, the spin chain of --family temperley-lieb)",
    )
    m.add_argument(
        "--tensor",
        action="append",
        default=[],
        metavar="FILE_OR_NAME",
        help="tensor the module (--module: a module file, regular or P(x)) with this one "
        "through the algebra's coproduct (group algebras: g -> g (x) g; small-quantum-sl2: "
        "E -> E(x)K + 1(x)E, F -> F(x)1 + K^-1(x)F, K -> K(x)K); repeatable",
    )
    m.add_argument(
        "--coproduct",
        choices=("group", "quantum-sl2"),
        help="the coproduct for --tensor on a [multiplication] spec (families know theirs)",
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
