"""Checks of a multiplication table: exact associativity and the identity, time and memory.

Each case is the algebra of upper-triangular m x m matrices (dimension
m(m+1)/2) written in a random basis (a random invertible change of basis with
entries in -2..2), so that the table is dense: every product has about
``dim`` terms, and over QQ the constants have large denominators.  For each
case: the time of the exact associativity check by matrix products (the method
``auto`` uses for dense tables), the time of the term-by-term check over all
basis triples (the naive baseline, run in the same process on the same table;
``--quick`` skips it beyond dimension 21), their ratio, the time to solve for
the identity, and the peak memory of the whole construction (forked child).

Run ``python benchmarks/bench_table_checks.py`` (``--quick`` for small cases).
"""

from __future__ import annotations

import argparse
import random
import sys
import time
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))
sys.path.insert(0, str(Path(__file__).resolve().parent))

from _common import measure, table  # noqa: E402

from hwcat.algebras.inputs.structure import StructureAlgebra  # noqa: E402
from hwcat.exact import GF, QQ, Mat  # noqa: E402


def dense_table(m: int, F, seed: int = 1):
    """Upper-triangular m x m matrices in a random basis: (dimension, products)."""
    rng = random.Random(seed)
    units = [(a, b) for a in range(m) for b in range(a, m)]
    n = len(units)
    idx = {u: i for i, u in enumerate(units)}
    while True:
        P = Mat.from_rows(F, [[rng.randint(-2, 2) for _ in range(n)] for _ in range(n)])
        if P.rank() == n:
            break
    Pi = P.inverse()
    Pr = P.raw_rows()
    prods = {}
    for i in range(n):
        for j in range(n):
            v = [F.zero] * n
            for a, (x, y) in enumerate(units):
                if Pr[i][a] == 0:
                    continue
                for b, (z, w) in enumerate(units):
                    if Pr[j][b] != 0 and y == z:
                        v[idx[(x, w)]] += Pr[i][a] * Pr[j][b]
            row = (Mat.from_flat(F, 1, n, v) @ Pi).entries()
            d = {k: c for k, c in enumerate(row) if c != 0}
            if d:
                prods[(i, j)] = d
    return n, prods


def case(m: int, field_name: str, baseline: bool):
    F = QQ if field_name == "QQ" else GF(int(field_name[3:-1]))
    n, prods = dense_table(m, F)
    names = [f"f{i}" for i in range(n)]
    A = StructureAlgebra(F, names, prods, None, associativity="skip")  # finds the identity
    t0 = time.perf_counter()
    A._establish_unit(None, 0)
    t_unit = time.perf_counter() - t0
    t0 = time.perf_counter()
    A._associativity_by_matrices()
    t_mat = time.perf_counter() - t0
    t_terms = None
    if baseline:
        t0 = time.perf_counter()
        A._associativity_by_terms()
        t_terms = time.perf_counter() - t0
    return n, A.nnz, t_mat, t_terms, t_unit


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--quick", action="store_true")
    args = ap.parse_args()
    sizes = [3, 4, 5, 6] if args.quick else [3, 4, 5, 6, 7, 8]
    rows = []
    for field_name in ("GF(101)", "QQ"):
        for m in sizes:
            baseline = not args.quick or m <= 6
            (n, nnz, t_mat, t_terms, t_unit), dt, peak = measure(
                lambda m=m, f=field_name, b=baseline: case(m, f, b)
            )
            ratio = f"{t_terms / t_mat:.1f}x" if t_terms else "-"
            rows.append(
                [
                    field_name,
                    n,
                    nnz,
                    f"{t_mat:.2f}",
                    f"{t_terms:.2f}" if t_terms else "-",
                    ratio,
                    f"{t_unit:.2f}",
                    f"{peak:.0f}",
                ]
            )
            print(rows[-1], flush=True)
    print(
        table(
            rows,
            [
                "field",
                "dim",
                "nonzero",
                "matrices s",
                "terms s (naive)",
                "ratio",
                "identity s",
                "peak MiB",
            ],
        )
    )


if __name__ == "__main__":
    main()
