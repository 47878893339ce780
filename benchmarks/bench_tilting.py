"""Benchmark: tilting modules T(L), the Ringel dual, and the double dual.

For quasi-hereditary algebras of growing size (Auslander algebras of
k[x]/(x^n), linear A_n with rad^3 = 0, and the lantern demo), prints the time
and peak resident memory of building all T(L) (with their verification) and of
building R(A) = End(T)^op, and checks that R(R(A)) has A's Cartan matrix.

    python benchmarks/bench_tilting.py [--quick]
"""

from __future__ import annotations

import argparse
import sys
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))
sys.path.insert(0, str(Path(__file__).resolve().parent))

from _common import measure, table

from hwcat.algebras.families.quivers import auslander_truncated_polynomial, linear_A, spec_to_toml
from hwcat.io.spec import build_algebra, read_spec_text
from hwcat.theory.search import quasi_hereditary_orders
from hwcat.theory.tilting import ringel_dual, tilting_modules


def run(spec):
    A = build_algebra(read_spec_text(spec_to_toml(spec)))
    P = quasi_hereditary_orders(A, list_limit=1).structure_list[0].essential_order
    return A, P


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--quick", action="store_true")
    args = ap.parse_args()
    cases = [(f"Auslander k[x]/x^{n}", auslander_truncated_polynomial(n)) for n in (3, 4, 5, 6, 8)]
    cases += [(f"linear A_{n}, rad^3=0", linear_A(n, vanish_from_length=3)) for n in (6, 10, 14)]
    if args.quick:
        cases = cases[:2] + cases[5:6]
    rows = []
    for label, spec in cases:
        A, P = run(spec)

        def tilt():
            Ts = tilting_modules(A, P)
            return sum(t.module.dim for t in Ts)

        def dual():
            R, Q = ringel_dual(A, P)
            RR, _ = ringel_dual(R, Q)
            return R.dim, RR.cartan() == A.cartan()

        tdim, tt, tm = measure(tilt)
        (rdim, ok), tr, rm = measure(dual)
        rows.append(
            [label, A.n, A.dim, tdim, f"{tt:.2f}", f"{tm:.0f}", rdim, f"{tr:.2f}", f"{rm:.0f}", ok]
        )
    print(
        table(
            rows,
            [
                "algebra",
                "simples",
                "dim A",
                "dim T",
                "T(L) s",
                "RSS MiB",
                "dim R(A)",
                "R and R(R) s",
                "RSS MiB",
                "R(R(A)) ~ A",
            ],
        )
    )


if __name__ == "__main__":
    main()
