"""Benchmark: the all-orders search and structure counting.

Prints, for algebras of growing size, the time and peak memory of deciding
quasi-heredity over all orders, of counting quasi-hereditary total orders and of
counting structures; and, on small cases, a naive baseline that checks every
permutation's heredity chain with sympy matrices, with the speed-up measured
in the same run.

    python benchmarks/bench_orders.py            # full run
    python benchmarks/bench_orders.py --quick    # small sizes only
"""

from __future__ import annotations

import argparse
import itertools
import sys
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))
sys.path.insert(0, str(Path(__file__).resolve().parent))

import sympy  # noqa: E402
from _common import measure, table  # noqa: E402

from hwcat.algebras.families.quivers import (  # noqa: E402
    auslander_truncated_polynomial,
    linear_A,
    spec_to_toml,  # noqa: E402
)
from hwcat.io.spec import build_algebra, read_spec_text  # noqa: E402
from hwcat.theory.search import is_quasi_hereditary, quasi_hereditary_orders  # noqa: E402


def algebra(spec):
    return build_algebra(read_spec_text(spec_to_toml(spec)))


def disjoint_copies(spec, k):
    """k disjoint copies of a quiver spec (a disconnected algebra)."""
    q = spec["quiver"]
    vs, ar, rel = [], [], []
    for c in range(k):
        ren = {v: f"{v}_{c}" for v in q["vertices"]}
        vs += [ren[v] for v in q["vertices"]]
        names = {}
        for a in q["arrows"]:
            name, rest = a.split(":")
            s, t = [x.strip() for x in rest.split("->")]
            names[name.strip()] = f"{name.strip()}_{c}"
            ar.append(f"{name.strip()}_{c}: {ren[s]} -> {ren[t]}")
        for r in q.get("relations", []):
            out = r
            for old in sorted(names, key=len, reverse=True):
                out = out.replace(old, names[old])
            rel.append(out)
    qq = {"vertices": vs, "arrows": ar}
    if rel:
        qq["relations"] = rel
    return {"field": spec["field"], "quiver": qq}


# -- naive baseline: every permutation, heredity chain with sympy matrices ----------------


def _sympy_closure(P, gens_rows_at, dims, arrows):
    """Subrepresentation generated (sympy Matrix row spaces), naive fixpoint."""
    sub = {v: gens_rows_at.get(v, sympy.zeros(0, dims[v])) for v in range(len(dims))}
    changed = True
    while changed:
        changed = False
        for i, a in enumerate(arrows):
            S = sub[a.source]
            if S.rows == 0 or dims[a.target] == 0:
                continue
            img = S * P[i]
            cur = sub[a.target]
            new = cur.col_join(img) if cur.rows else img
            r = new.rank()
            if r > (cur.rank() if cur.rows else 0):
                sub[a.target] = sympy.Matrix(new.rref()[0][:r, :])
                changed = True
    return sub


def baseline_count(A):
    dims = [A.projective_dims(s) for s in range(A.n)]
    mats = [
        [
            sympy.Matrix(m.raw_rows()) if m.nrows and m.ncols else sympy.zeros(m.nrows, m.ncols)
            for m in A.action[s]
        ]
        for s in range(A.n)
    ]

    def trace_dim(T, s):
        gens = {u: sympy.eye(dims[s][u]) for u in T if dims[s][u]}
        sub = _sympy_closure(mats[s], gens, dims[s], A.arrows)
        return [sub[v].rank() if sub[v].rows else 0 for v in range(A.n)]

    count = 0
    for perm in itertools.permutations(range(A.n)):
        ok = True
        for k, u in enumerate(perm):
            S = set(perm[:k])
            qd = {
                s: [d - t for d, t in zip(dims[s], trace_dim(S, s))]
                for s in range(A.n)
                if s not in S
            }
            if qd[u][u] != 1:
                ok = False
                break
            T = S | {u}
            eB = sum(qd[u])
            for s in qd:
                if s == u or qd[s][u] == 0:
                    continue
                after = sum(dims[s]) - sum(d - t for d, t in zip(dims[s], trace_dim(T, s)))
                before = sum(dims[s]) - sum(qd[s])
                if after - before != qd[s][u] * eB:
                    ok = False
                    break
            if not ok:
                break
        count += ok
    return count


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--quick", action="store_true")
    args = ap.parse_args()

    print("Baseline ratio (same run): naive permutations + sympy vs subset search")
    rows = []
    small = [
        ("linear A_4", linear_A(4)),
        ("linear A_5", linear_A(5)),
        ("Auslander k[x]/x^4", auslander_truncated_polynomial(4)),
    ]
    if not args.quick:
        small += [
            ("linear A_6", linear_A(6)),
            ("Auslander k[x]/x^5", auslander_truncated_polynomial(5)),
        ]
    for label, spec in small:
        A = algebra(spec)
        base, tb, _ = measure(lambda: baseline_count(A))
        count, ts, _ = measure(lambda: quasi_hereditary_orders(A, list_limit=0).quasi_hereditary_total_orders)
        assert base == count, (label, base, count)
        rows.append([label, A.n, A.dim, base, f"{tb:.3f}", f"{ts:.4f}", f"{tb / ts:.0f}x"])
    print(
        table(rows, ["algebra", "simples", "dim", "qh orders", "baseline s", "search s", "speed-up"])
    )
    print()
    print("Subset search at scale (decision; quasi-hereditary total orders; structures)")
    rows = []
    big = [
        ("linear A_10", linear_A(10), True),
        ("linear A_12", linear_A(12), True),
        ("linear A_14", linear_A(14), False),
        ("linear A_16, rad^3=0", linear_A(16, vanish_from_length=3), True),
        ("Auslander k[x]/x^10", auslander_truncated_polynomial(10), True),
        ("Auslander k[x]/x^14", auslander_truncated_polynomial(14), True),
        ("Auslander k[x]/x^25", auslander_truncated_polynomial(25), True),
        ("16 x Auslander k[x]/x^4", disjoint_copies(auslander_truncated_polynomial(4), 16), True),
    ]
    if args.quick:
        big = [b for b in big if "14" not in b[0] and "25" not in b[0] and "16" not in b[0]]
    for label, spec, structures in big:
        _, tb, _ = measure(lambda: algebra(spec).dim)
        A = algebra(spec)
        q, td, pd = measure(lambda: is_quasi_hereditary(A))
        if structures:
            (cnt, st), ta, pa = measure(
                lambda: (lambda r: (r.quasi_hereditary_total_orders, r.structures))(
                    quasi_hereditary_orders(A, list_limit=0)
                )
            )
        rows.append(
            [
                label,
                A.n,
                A.dim,
                f"{tb:.2f}",
                q,
                f"{td:.2f}",
                f"{pd:.0f}",
                cnt if structures else "-",
                st if structures else "-",
                f"{ta:.2f}" if structures else "-",
                f"{pa:.0f}" if structures else "-",
            ]
        )
    print(
        table(
            rows,
            [
                "algebra",
                "simples",
                "dim",
                "build s",
                "qh",
                "decide s",
                "RSS MiB",
                "quasi-hereditary orders",
                "structures",
                "count s",
                "RSS MiB",
            ],
        )
    )


if __name__ == "__main__":
    main()
