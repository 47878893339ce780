"""The campaign commands: fuzz (claims on random algebras) and survey (a family over a grid).

Both need the optional extra ``cluster`` (Dask); without it they exit 2 with
a line saying how to install it.
"""

from __future__ import annotations

import argparse
import sys

from hwcat.errors import CampaignError
from hwcat.io.render import to_json

__all__ = ["register"]


def _show_progress(args: argparse.Namespace) -> bool:
    """Bars on a terminal only, never with ``--json`` (as for every command)."""
    from hwcat.cli import show_progress

    return show_progress(sys.stderr, args)


def _cmd_fuzz(args: argparse.Namespace) -> int:
    from hwcat.campaigns.cluster import require_dask

    require_dask()
    from hwcat.campaigns.fuzzing import fuzz

    report = fuzz(
        args.claim,
        examples=args.examples,
        max_vertices=args.max_vertices,
        field=args.field,
        kinds=args.kind or ["general"],
        seed=args.seed,
        workers=args.workers,
        scheduler=args.scheduler,
        timeout=None if args.timeout == 0 else args.timeout,
        out=args.out,
        shrink=not args.no_shrink,
        progress=_show_progress(args),
    )
    if args.json:
        print(to_json(report))
    print(report.summary(), file=sys.stderr)
    return report.exit_code


def _grid(items: list[str]) -> dict[str, str]:
    grid: dict[str, str] = {}
    for it in items:
        if "=" not in it:
            raise CampaignError(f"survey parameter {it!r}: expected key=values, e.g. n=2..6")
        k, v = it.split("=", 1)
        k = k.strip()
        if k in grid:
            raise CampaignError(f"survey parameter {k!r} given twice")
        grid[k] = v.strip()
    return grid


def _cmd_survey(args: argparse.Namespace) -> int:
    from hwcat.campaigns.cluster import require_dask

    require_dask()
    from hwcat.campaigns.surveys import survey, write_csv

    table = survey(
        args.family,
        _grid(args.params),
        workers=args.workers,
        scheduler=args.scheduler,
        timeout=None if args.timeout == 0 else args.timeout,
        progress=_show_progress(args),
    )
    write_csv(table, args.output)
    if args.json:
        print(to_json(table))
    print(f"{table.summary()}; wrote {args.output}", file=sys.stderr)
    return 0


def _where(p: argparse.ArgumentParser) -> None:
    g = p.add_mutually_exclusive_group()
    g.add_argument(
        "--workers",
        type=int,
        default=None,
        metavar="W",
        help="worker processes of a new local cluster (default 2)",
    )
    g.add_argument(
        "--scheduler",
        metavar="ADDRESS",
        default=None,
        help="address of a running Dask scheduler, e.g. tcp://host:8786",
    )


def register(sub) -> None:
    p = sub.add_parser(
        "fuzz",
        help="test a claim on random algebras in parallel (needs hwcat[cluster])",
        description="Test a claim -- a function in FILE.py taking a BasicAlgebra and returning "
        "True/False or raising AssertionError -- on random algebras; shrink the first "
        "counterexample and write it to DIR as a spec file with a JSON record. Exit 0: no "
        "counterexample, every example evaluated; 1: counterexample found; 2: bad input; "
        "3: no counterexample, but some examples were lost (not evaluated).",
    )
    p.add_argument("claim", metavar="FILE.py:FUNCTION")
    p.add_argument("--examples", type=int, default=200, help="how many algebras (default 200)")
    p.add_argument(
        "--max-vertices", type=int, default=3, help="at most this many simples (default 3)"
    )
    p.add_argument(
        "--field",
        default=None,
        help="QQ or GF(p); default: drawn from QQ, GF(2), GF(3), GF(101), GF(2^61-1)",
    )
    p.add_argument(
        "--kind",
        action="append",
        metavar="KIND",
        help="general, acyclic, nakayama, commutative (repeat or comma-separate; default general)",
    )
    p.add_argument("--seed", type=int, default=0, help="campaign seed (default 0)")
    _where(p)
    p.add_argument(
        "--timeout",
        type=float,
        default=10.0,
        help="seconds per example before it counts as a timeout (default 10; 0: none)",
    )
    p.add_argument("--no-shrink", action="store_true", help="write the counterexample as drawn")
    p.add_argument(
        "--out",
        required=True,
        metavar="DIR",
        help="directory for counterexample.toml/.json and campaign.json",
    )
    p.add_argument("--json", action="store_true", help="print the campaign report as JSON")
    p.set_defaults(func=_cmd_fuzz)

    s = sub.add_parser(
        "survey",
        help="a built-in family over a grid of parameters, as a CSV table (needs hwcat[cluster])",
        description="Evaluate every member of a family (see 'hwcat family --list') over a grid: "
        "key=a..b (integers), key=x,y,z or key=x;y (lists). One CSV row per member: dimension, "
        "simples, quasi-hereditary, structures, global dimension; a member that fails or runs "
        "past --timeout gets a row saying so.",
    )
    s.add_argument("family")
    s.add_argument("params", nargs="*", metavar="key=values")
    _where(s)
    s.add_argument(
        "--timeout", type=float, default=120.0, help="seconds per member (default 120; 0: none)"
    )
    s.add_argument("-o", "--output", required=True, metavar="TABLE.csv")
    s.add_argument("--json", action="store_true", help="also print the table as JSON")
    s.set_defaults(func=_cmd_survey)
