"""Benchmark: decomposing the Temperley-Lieb spin chain from its generators.

For the chain ``(k^2)^(x)n`` with the quantum-group-symmetric generators over
GF(10007) (q = 2, loop weight 5/2) and at a root of unity (GF(5), q = 2, loop
weight 0), prints the time (wall clock and the process's CPU time, which is the fair
figure on a shared machine) and peak memory of the decomposition into
indecomposables with ``dim End`` and the Jordan type of the sum of the
generators, and checks ``dim End`` against quantum Schur-Weyl duality
(sum over t <= n, t = n mod 2, of (t + 1)^2).  On small chains a naive
baseline (``End`` as the solution space of ``X G = G X`` in all ``dim^2``
unknowns, one dense system) runs beside it for a ratio.

    python benchmarks/bench_module.py [--quick] [--max-n N]

One run on the shared 2-core machine (load average about 9, so wall clock is
roughly three times the CPU time): n = 10 (dim 1024) in 7.5 s CPU / 23 s wall
at q = 2 over GF(10007) and 13 s CPU / 27 s wall at loop weight 0 over GF(5)
(dim End = 286 both, the sum of the generators with a Jordan block of size 10
at loop weight 0); n = 12 (dim 4096) in 323 s CPU / 1065 s wall, 1.4 GiB, dim
End = 455; the naive dense commutant on n = 5 is about 200 times slower.
"""

from __future__ import annotations

import argparse
import sys
import time
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))
sys.path.insert(0, str(Path(__file__).resolve().parent))

from _common import measure, table

from hwcat.io.module_file import spin_chain_module
from hwcat.modules.action import ActionModule
from hwcat.theory.decompose import decompose, endomorphism_dimension_naive, jordan_type


def expected(n: int) -> int:
    return sum((t + 1) ** 2 for t in range(n % 2, n + 1, 2))


def fast(n: int, delta: str, field: str):
    c0 = time.process_time()
    M = spin_chain_module(n, delta, field)
    D = decompose(M)
    H = " + ".join(f"e{i}" for i in range(1, n))
    # the Jordan type on M is the union over the summands (each is H-invariant); the
    # element is evaluated on each summand from its own restricted generators
    blocks = []
    for s in D.summands:
        blocks.extend(jordan_type(s.module.element(H)))
    biggest = max(b.size for b in blocks)
    return D.endomorphism_dimension, len(D.summands), biggest, time.process_time() - c0


def naive(n: int, delta: str, field: str):
    c0 = time.process_time()
    M = spin_chain_module(n, delta, field)
    e = endomorphism_dimension_naive(ActionModule(M.field, M.dim, M.generators))
    return e, time.process_time() - c0


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--quick", action="store_true")
    ap.add_argument("--max-n", type=int, default=12)
    args = ap.parse_args()
    top = 8 if args.quick else args.max_n
    rows = []
    for delta, field in (("5/2", "GF(10007)"), ("0", "GF(5)")):
        for n in [k for k in (4, 5, 6, 8, 10, 12) if k <= top]:
            (end, k, big, cpu), t, mem = measure(lambda n=n: fast(n, delta, field))
            if end != expected(n):
                raise SystemExit(f"n={n}: dim End = {end}, expected {expected(n)}")
            base = ratio = "-"
            if n <= 5:
                (e2, cpu2), t2, _ = measure(lambda n=n: naive(n, delta, field))
                if e2 != end:
                    raise SystemExit(f"n={n}: naive dim End = {e2}, fast {end}")
                base, ratio = f"{cpu2:.2f}", f"{cpu2 / cpu:.1f}x"
            rows.append(
                [f"{field} delta={delta}", n, 2**n, end, k, big]
                + [f"{t:.2f}", f"{cpu:.2f}", f"{mem:.0f}", base, ratio]
            )
            print(table(rows[-1:], HEADER), flush=True)
    print()
    print(table(rows, HEADER))


HEADER = ["chain", "n", "dim", "dim End", "summands", "max Jordan", "wall s", "cpu s"]
HEADER += ["peak MiB", "naive cpu s", "naive/fast cpu"]


if __name__ == "__main__":
    main()
