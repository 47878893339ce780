"""Reduction of structure-constant algebras to their basic algebra: time and memory.

For each case: the dimension, the number of nonzero structure constants, the
time to convert the family's table, the time of the reduction (split into its
phases: dense random elements, Krylov sequences, matrices of tree nodes,
certification of the simples, assembly of the basic algebra), the peak memory
traced by ``tracemalloc`` during a second, traced run of the reduction (tracing
slows Python down several times, so times come from the untraced run), and the
result (number of simples, radical dimension, dimension of the basic algebra).  A naive
baseline -- the radical by the lifted-trace chain on the regular
representation, which is where the cost goes without the splitting tree -- is
run for the small cases only, for a ratio measured in the same run.

Run ``python benchmarks/bench_reduction.py`` (``--quick`` for small cases only).
"""

from __future__ import annotations

import argparse
import sys
import time
import tracemalloc
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))

from hwcat.algebras.families import tables as ft  # noqa: E402
from hwcat.algebras.inputs.structure import from_table  # noqa: E402
from hwcat.algebras.reduction.reduction import radical, reduce_algebra  # noqa: E402

CASES_QUICK = [
    ("S(2,10) GF(2)", lambda: ft.schur_algebra_2(10, "GF(2)")),
    ("S(2,10) GF(3)", lambda: ft.schur_algebra_2(10, "GF(3)")),
    ("TL_6(0) QQ", lambda: ft.temperley_lieb(6, 0, "QQ")),
    ("TL_7(1) GF(3)", lambda: ft.temperley_lieb(7, 1, "GF(3)")),
    ("S_5 GF(2)", lambda: ft.symmetric_group_algebra(5, "GF(2)")),
    ("u_q ell=5 GF(11)", lambda: ft.small_quantum_sl2(5, 3, "GF(11)")),
]
CASES_FULL = CASES_QUICK + [
    ("S(2,15) GF(3)", lambda: ft.schur_algebra_2(15, "GF(3)")),
    ("S(2,21) GF(2)", lambda: ft.schur_algebra_2(21, "GF(2)")),
    ("S(2,21) GF(3)", lambda: ft.schur_algebra_2(21, "GF(3)")),
    ("S(2,21) GF(10007)", lambda: ft.schur_algebra_2(21, "GF(10007)")),
    ("TL_8(0) GF(5)", lambda: ft.temperley_lieb(8, 0, "GF(5)")),
    ("TL_8(1) GF(3)", lambda: ft.temperley_lieb(8, 1, "GF(3)")),
    ("TL_8(2) GF(10007)", lambda: ft.temperley_lieb(8, 2, "GF(10007)")),
    ("S_6 GF(3)", lambda: ft.symmetric_group_algebra(6, "GF(3)")),
    ("C_64 GF(2)", lambda: ft.cyclic_group_algebra(64, "GF(2)")),
]
BASELINE_LIMIT = 130


def run(name, make, trace: bool) -> list[str]:
    table = make()
    t0 = time.perf_counter()
    A = from_table(table)
    t_conv = time.perf_counter() - t0
    t0 = time.perf_counter()
    r = reduce_algebra(A)
    t_red = time.perf_counter() - t0
    peak = float("nan")
    if trace:
        tracemalloc.start()
        reduce_algebra(A)
        _, peak = tracemalloc.get_traced_memory()
        tracemalloc.stop()
    phases = ", ".join(
        f"{k} {v:.1f}" for k, v in r.timings.items() if k not in ("search",) and v >= 0.05
    )
    base = "-"
    if A.dim <= BASELINE_LIMIT and A.field.characteristic:
        t0 = time.perf_counter()
        rad = radical(A, "lifted-trace")
        base = f"{time.perf_counter() - t0:.2f}"
        assert rad.nrows == r.radical_dimension
    return [
        name,
        str(A.dim),
        str(A.nnz),
        f"{t_conv:.2f}",
        f"{t_red:.2f}",
        f"{peak / 2**20:.0f}",
        base,
        str(len(r.simple_dimensions)),
        str(r.radical_dimension),
        str(r.basic.dim),
        phases,
    ]


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--quick", action="store_true", help="small cases only")
    ap.add_argument("--no-memory", action="store_true", help="skip the traced runs")
    args = ap.parse_args()
    header = [
        "case",
        "dim",
        "nonzero",
        "table s",
        "reduce s",
        "peak MiB",
        "naive rad s",
        "simples",
        "rad",
        "basic",
        "phases (s)",
    ]
    rows = []
    for name, make in CASES_QUICK if args.quick else CASES_FULL:
        rows.append(run(name, make, not args.no_memory))
        print("  ".join(rows[-1]), flush=True)
    widths = [max(len(r[i]) for r in rows + [header]) for i in range(len(header))]
    print()
    for r in [header] + rows:
        print("  ".join(c.rjust(w) if i else c.ljust(w) for i, (c, w) in enumerate(zip(r, widths))))


if __name__ == "__main__":
    main()
