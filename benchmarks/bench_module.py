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

Tensor products over the small quantum group (restricted form at ell = 4, 6, 10):
the two-dimensional simple X2 squared, the largest indecomposable projective P
tensored with X2 and with itself; each is tensored and decomposed (timed),
then the whole report runs with every summand identified (timed separately;
it includes the centre of u_q and the family's reduction is built before the
clock starts).  The summands of P (x) X2 and P (x) P must all be projective.
A dense commutant on the modules of dimension <= 40 gives the naive ratio.
One run (``--max-n 10``, shared 2-core machine): P (x) P at ell = 6 (dim 36)
decomposed in 0.23 s CPU against 2.85 s for the dense commutant (12x); at
ell = 10 over GF(11) (u_q of dimension 250) P (x) P (dim 100, twelve projective
summands) decomposes in 1.2 s and the whole report with identification and the
centre takes 2.6 s CPU.  The same run: the chain n = 10 in 7.1 s CPU / 16 s wall
(q = 2 over GF(10007)) and 7.8 s CPU / 24 s wall (loop weight 0 over GF(5)).

    python benchmarks/bench_module.py [--quick] [--max-n N] [--tensor-only]

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


# -- tensor products over the small quantum group ------------------------------------------

TENSOR_CASES = [(4, 2, "GF(5)"), (6, 3, "GF(7)"), (10, 2, "GF(11)")]  # q of order ell


def _quantum_factors(ell: int, q: int, field: str):
    from hwcat.algebras.families.registry import family_reduction
    from hwcat.io.module_file import algebra_module

    red = family_reduction("small-quantum-sl2", ell=ell, q=str(q), field=field)
    X = ActionModule.from_matrices(
        field,
        {"E": [[0, 1], [0, 0]], "F": [[0, 0], [1, 0]], "K": [[q, 0], [0, f"1/{q}"]]},
        name="X2",
    )
    big = max(
        red.basic.vertices, key=lambda v: red.projective_dimensions[red.basic.vertices.index(v)]
    )
    return red, X, algebra_module(f"P({big})", red)


def _left_right(which: str, X, P):
    return {"X2 (x) X2": (X, X), "P (x) X2": (P, X), "P (x) P": (P, P)}[which]


def tensor_fast(ell: int, q: int, field: str, which: str):
    """Tensor and decompose (timed alone), then the whole report with every summand
    identified (timed alone); returns figures and the two CPU times."""
    from hwcat.modules.action import tensor_product
    from hwcat.theory.module_report import analyse_module

    red, X, P = _quantum_factors(ell, q, field)
    left, right = _left_right(which, X, P)
    c0 = time.process_time()
    T = tensor_product(left, right, coproduct="quantum-sl2")
    D = decompose(T)
    c1 = time.process_time()
    T = tensor_product(left, right, coproduct="quantum-sl2")
    r = analyse_module(T, red.basic)
    c2 = time.process_time()
    if r.endomorphism_dimension != D.endomorphism_dimension:
        raise SystemExit(f"ell={ell} {which}: two decompositions disagree")
    projective = all(any(n.startswith("P(") for n, _ in s.identified_as) for s in r.summands)
    dims = sorted(s.dimension for s in r.summands)
    return T.dim, dims, r.endomorphism_dimension, projective, c1 - c0, c2 - c1


def tensor_naive(ell: int, q: int, field: str, which: str):
    """The same tensor product's dim End as a dense commutant (dim^2 unknowns)."""
    from hwcat.modules.action import tensor_product

    _, X, P = _quantum_factors(ell, q, field)
    left, right = _left_right(which, X, P)
    c0 = time.process_time()
    T = tensor_product(left, right, coproduct="quantum-sl2")
    e = endomorphism_dimension_naive(ActionModule(T.field, T.dim, T.generators))
    return e, time.process_time() - c0


def tensor_rows(naive_limit: int) -> list[list]:
    rows = []
    for ell, q, field in TENSOR_CASES:
        for which in ("X2 (x) X2", "P (x) X2", "P (x) P"):
            (dim, dims, end, proj, cpu, cpu_all), t, mem = measure(
                lambda ell=ell, q=q, field=field, which=which: tensor_fast(ell, q, field, which)
            )
            if sum(dims) != dim:
                raise SystemExit(f"ell={ell} {which}: summands {dims} do not add up to {dim}")
            if which.startswith("P") and not proj:
                raise SystemExit(f"ell={ell}: a summand of {which} is not projective")
            base = ratio = "-"
            if dim <= naive_limit:
                (e2, cpu2), _, _ = measure(
                    lambda ell=ell, q=q, field=field, which=which: tensor_naive(
                        ell, q, field, which
                    )
                )
                if e2 != end:
                    raise SystemExit(f"ell={ell} {which}: naive dim End {e2}, fast {end}")
                base, ratio = f"{cpu2:.2f}", f"{cpu2 / max(cpu, 1e-9):.1f}x"
            rows.append(
                [f"u_q ell={ell} {field}", which, dim, "+".join(map(str, dims)), end, proj]
                + [f"{cpu:.2f}", f"{cpu_all:.2f}", f"{t:.2f}", f"{mem:.0f}", base, ratio]
            )
            print(table(rows[-1:], TENSOR_HEADER), flush=True)
    return rows


TENSOR_HEADER = ["algebra", "module", "dim", "summands", "dim End", "all P"]
TENSOR_HEADER += ["decompose cpu s", "report cpu s", "wall s (all)", "peak MiB"]
TENSOR_HEADER += ["naive cpu s", "naive/decompose cpu"]


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--quick", action="store_true")
    ap.add_argument("--max-n", type=int, default=12)
    ap.add_argument("--tensor-only", action="store_true", help="only the tensor products")
    args = ap.parse_args()
    top = 8 if args.quick else args.max_n
    trows = tensor_rows(naive_limit=40)
    print()
    print(table(trows, TENSOR_HEADER))
    print()
    if args.tensor_only:
        return
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
