"""Benchmark: writing and checking certificates.

For the Auslander algebras of k[T]/(T^n) (quasi-hereditary; Bruestle, Hille,
Ringel, Roehrle 1999) of growing dimension, prints the time and peak memory of
``certify`` and of the independent check ``verify_certificate``, and the size
of the certificate.  The checker's associativity test uses only the triples
(x, y, arrow); the naive baseline checks (x*y)*z = x*(y*z) for all basis
triples (vectorised over x, as the checker is), on the same algebra in the
same run; the ratio is printed.

    python benchmarks/bench_certificates.py            # full run
    python benchmarks/bench_certificates.py --quick    # small sizes only
"""

from __future__ import annotations

import argparse
import json
import sys
import time
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))
sys.path.insert(0, str(Path(__file__).resolve().parent))

from _common import measure, table  # noqa: E402

from hwcat.algebras.families.quivers import auslander_truncated_polynomial  # noqa: E402
from hwcat.exact import GF, Mat, parse_field  # noqa: E402
from hwcat.strategies import algebra_from_spec  # noqa: E402
from hwcat.theory.certificate import certify  # noqa: E402
from hwcat.verify import _Algebra, verify_certificate  # noqa: E402


def cert(n):
    return certify(algebra_from_spec(auslander_truncated_polynomial(n, field=GF(101)))).data


def naive_associativity(alg: _Algebra) -> None:
    """(x*y)*z = x*(y*z) for all composable basis triples (x ranging as matrix rows)."""
    F = alg.F
    for s in range(alg.n):
        pm = {}
        for i in sorted(range(len(alg.basis)), key=lambda i: len(alg.basis[i][2])):
            u, t, p = alg.basis[i]
            pm[i] = (
                Mat.identity(F, alg.dim(s, u))
                if not p
                else pm[alg.index[(u, p[:-1])]] @ alg.act[s][p[-1]]
            )
        for y, (u, v, _) in enumerate(alg.basis):
            for z, (v2, t, pz) in enumerate(alg.basis):
                if v2 != v or not alg.dim(s, u):
                    continue
                yz = alg.push(u, Mat.unit_rows(F, alg.dim(u, v), [alg.pos[y]]), pz)
                rhs = Mat.zeros(F, alg.dim(s, u), alg.dim(s, t))
                for k, c in zip(alg.blocks[u][t], yz.entries(), strict=True):
                    if c != 0:
                        rhs = rhs + pm[k].scale(c)
                assert pm[y] @ pm[z] == rhs


def run(n, naive):
    data = cert(n)
    size = len(json.dumps(data))
    t0 = time.perf_counter()
    v = verify_certificate(data)
    tv = time.perf_counter() - t0
    assert v.accepted and v.quasi_hereditary
    alg = _Algebra(parse_field(data["field"]), data["algebra"])
    t0 = time.perf_counter()
    alg._check_associative()
    ta = time.perf_counter() - t0
    tn = None
    if naive:
        t0 = time.perf_counter()
        naive_associativity(alg)
        tn = time.perf_counter() - t0
    return len(alg.basis), size, tv, ta, tn


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--quick", action="store_true")
    args = ap.parse_args()
    sizes = [3, 4, 5] if args.quick else [3, 4, 5, 6, 7, 8, 9]
    rows = []
    for n in sizes:
        _, tc, mc = measure(lambda n=n: cert(n) and None)
        (dim, size, tv, ta, tn), t_all, mv = measure(lambda n=n: run(n, n <= 6))
        ratio = f"{tn / ta:.1f}x" if tn else "-"
        rows.append(
            [
                n,
                dim,
                f"{size / 1024:.0f} KiB",
                f"{tc:.2f}",
                f"{mc:.0f}",
                f"{tv:.2f}",
                f"{mv:.0f}",
                f"{ta:.3f}",
                f"{tn:.3f}" if tn else "-",
                ratio,
            ]
        )
        print(
            table(
                rows,
                [
                    "n",
                    "dim",
                    "certificate",
                    "certify s",
                    "MiB",
                    "verify s",
                    "MiB",
                    "assoc s",
                    "naive assoc s",
                    "naive/ours",
                ],
            ),
            flush=True,
        )
        print()


if __name__ == "__main__":
    main()
