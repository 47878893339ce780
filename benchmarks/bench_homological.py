"""Benchmark: minimal resolutions, Ext and the global dimension.

For algebras of growing dimension and number of simples (Auslander algebras of
k[x]/(x^n), linear A_n with rad^2 = 0 and rad^3 = 0, cyclic Nakayama algebras
with rad^2 = 0, zigzag algebras, local algebras whose syzygies grow) prints
the time and peak resident memory of

* the minimal projective resolutions of all simples up to length 2n (total
  dimension of the terms computed);
* the global dimension (with its case);
* the table dim Ext^1(I(i), P(j)) over all pairs, by the Hom complex of the
  minimal resolution, and beside it a naive baseline: the long exact sequence
  0 -> Hom(M, N) -> Hom(P_0, N) -> Hom(Omega M, N) -> Ext^1(M, N) -> 0 with
  every Hom dimension from the full intertwiner system
  (``hom_dimension_naive``); both tables are compared and their time ratio
  printed.

    python benchmarks/bench_homological.py            # full run
    python benchmarks/bench_homological.py --quick    # small sizes only
"""

from __future__ import annotations

import argparse
import sys
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))
sys.path.insert(0, str(Path(__file__).resolve().parent))

from _common import measure, table

from hwcat.algebras.families.quivers import (
    auslander_truncated_polynomial,
    linear_A,
    spec_to_toml,
    zigzag_A,
)
from hwcat.io.spec import load_spec_text
from hwcat.modules import hom_dimension_naive, injective, projective, simple
from hwcat.theory.homological import ext_dimensions, global_dimension, projective_resolution


def family(spec):
    return load_spec_text(spec_to_toml(spec))


def cyclic_nakayama(n: int):
    arrows = ", ".join(f'"a{i}: {i} -> {i % n + 1}"' for i in range(1, n + 1))
    vertices = ", ".join(f'"{i}"' for i in range(1, n + 1))
    return load_spec_text(
        f'field = "QQ"\n[quiver]\nvertices = [{vertices}]\narrows = [{arrows}]\n'
        "vanish_from_length = 2"
    )


def local_exterior(k: int):
    """k loops x_i with x_i x_j = -x_j x_i and x_i^2 = 0 (syzygies grow with the degree)."""
    arrows = ", ".join(f'"x{i}: o -> o"' for i in range(1, k + 1))
    rels = [f"x{i}*x{i}" for i in range(1, k + 1)]
    rels += [f"x{i}*x{j} + x{j}*x{i}" for i in range(1, k + 1) for j in range(i + 1, k + 1)]
    rel_text = ", ".join(f'"{r}"' for r in rels)
    return load_spec_text(
        f'field = "QQ"\n[quiver]\nvertices = ["o"]\narrows = [{arrows}]\nrelations = [{rel_text}]'
    )


def resolutions(A):
    total = 0
    for i in range(A.n):
        R = projective_resolution(simple(A, i), 2 * A.n)
        total += sum(c.cover.dim for c in R.covers)
    return total


def gldim(A):
    return str(global_dimension(A))


def ext_table(A):
    return [
        [ext_dimensions(injective(A, i), projective(A, j), 1)[1] for j in range(A.n)]
        for i in range(A.n)
    ]


def ext_table_naive(A):
    out = []
    for i in range(A.n):
        M = injective(A, i)
        R = projective_resolution(M, 1)
        P0, Om = R.covers[0].cover, R.syzygy(1)
        row = []
        for j in range(A.n):
            N = projective(A, j)
            row.append(
                hom_dimension_naive(Om, N) - hom_dimension_naive(P0, N) + hom_dimension_naive(M, N)
            )
        out.append(row)
    return out


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--quick", action="store_true")
    ap.add_argument("--no-baseline", action="store_true", help="skip the naive Ext baseline")
    args = ap.parse_args()
    cases = [
        (f"Auslander k[x]/x^{n}", lambda n=n: family(auslander_truncated_polynomial(n)))
        for n in (3, 5, 7, 9)
    ]
    cases += [
        (f"linear A_{n}, rad^2=0", lambda n=n: family(linear_A(n, vanish_from_length=2)))
        for n in (5, 10, 20)
    ]
    cases += [
        (f"linear A_{n}, rad^3=0", lambda n=n: family(linear_A(n, vanish_from_length=3)))
        for n in (6, 12, 18)
    ]
    cases += [(f"cyclic Nakayama {n}, rad^2=0", lambda n=n: cyclic_nakayama(n)) for n in (4, 8, 16)]
    cases += [(f"zigzag A_{n}", lambda n=n: family(zigzag_A(n))) for n in (3, 5, 8)]
    cases += [(f"exterior algebra, {k} loops", lambda k=k: local_exterior(k)) for k in (2, 3)]
    if args.quick:
        cases = [cases[i] for i in (0, 1, 4, 7, 10, 13, 16)]
    rows = []
    for label, make in cases:
        A = make()
        tot, tr, mr = measure(lambda A=A: resolutions(A))
        g, tg, mg = measure(lambda A=A: gldim(A))
        ext, te, me = measure(lambda A=A: ext_table(A))
        row = [
            label,
            A.n,
            A.dim,
            tot,
            f"{tr:.2f}",
            f"{mr:.0f}",
            g,
            f"{tg:.2f}",
            f"{mg:.0f}",
            f"{te:.2f}",
        ]
        if args.no_baseline:
            row += ["-", "-"]
        else:
            naive, tn, _ = measure(lambda A=A: ext_table_naive(A))
            if naive != ext:
                raise SystemExit(f"{label}: Ext^1 tables disagree: {ext} vs {naive}")
            row += [f"{tn:.2f}", f"{tn / te:.1f}x" if te > 0 else "-"]
        rows.append(row)
    print(
        table(
            rows,
            [
                "algebra",
                "simples",
                "dim A",
                "dim P_*",
                "res s",
                "RSS MiB",
                "gl.dim",
                "gl s",
                "RSS MiB",
                "Ext^1 s",
                "naive s",
                "ratio",
            ],
        )
    )


if __name__ == "__main__":
    main()
