"""Benchmark: the matrix wrapper ``Mat`` against bare python-flint on small matrices.

Times, through :class:`hwcat.exact.Mat` and directly on the flint objects in
the same run, on square matrices of size 2 to 20 over QQ and GF(101):

* ``product``: ``A @ B`` against flint's product;
* ``rref`` (full rank) and ``rref half`` (rank n/2, zero rows to drop):
  ``Mat.rref()`` (nonzero rows + pivot tuple) against flint's ``rref()``
  (the full matrix and the rank, no pivots);
* ``rank``;
* ``kernel`` of a rank-n/2 matrix: ``Mat.right_kernel()`` (exactly nullity
  rows) against flint's ``nullspace()`` over GF(p) (an n x n matrix whose
  first nullity columns are the basis); flint has no kernel of a rational
  matrix, so over QQ the baseline is its ``rref()``, the only flint call the
  kernel needs;
* ``transpose``.

Each figure is the best of five timings of a loop; the ratio column is
wrapper time / flint time from the same run.

    python benchmarks/bench_matrices.py            # sizes 2, 4, 8, 12, 20
    python benchmarks/bench_matrices.py --quick    # sizes 2, 8, 20

Figures (2-core machine shared with other work, load about 4; ratios from one run each).
Before the small-matrix paths (``--quick``): rref 6-28x flint at 2 x 2 to 8 x 8 and 3.5x
at 20 x 20 over GF(101); rank-deficient rref 5-82x; kernels 3-103x (GF(101) 20 x 20:
463 us against 6 us).  After (full run): products, full-rank rref, rank and transpose
within 1.0-1.5x from 8 x 8 up (2.2x for GF(101) rref at 8 x 8); rank-deficient rref
1.3-1.8x over QQ and 2.0-5.9x over GF(101) (a pivot scan reads entries one by one);
kernels 1.6-5.5x over QQ (Python loops over rational entries; flint has no rational
kernel) and 2.1-4.1x over GF(101).  At 2 x 2 and 4 x 4 every wrapped call pays about
0.3-1.5 us of interpreter work against flint calls of 0.1-0.4 us, so ratios there stay
at 2-9x.
"""

from __future__ import annotations

import argparse
import random
import sys
import time
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))
sys.path.insert(0, str(Path(__file__).resolve().parent))

from _common import table

from hwcat.exact import GF, QQ, Mat


def per_call(fn, count: int) -> float:
    best = float("inf")
    for _ in range(5):
        t0 = time.perf_counter()
        for _ in range(count):
            fn()
        best = min(best, time.perf_counter() - t0)
    return best / count * 1e6


def random_rows(rng: random.Random, n: int, rank: int) -> list[list[int]]:
    """An ``n x n`` integer matrix of rank ``rank`` over QQ (a product through ``rank`` columns)."""
    left = [[rng.randint(-9, 9) for _ in range(rank)] for _ in range(n)]
    right = [[rng.randint(-9, 9) for _ in range(n)] for _ in range(rank)]
    return [
        [sum(left[i][k] * right[k][j] for k in range(rank)) for j in range(n)] for i in range(n)
    ]


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--quick", action="store_true")
    args = ap.parse_args()
    sizes = (2, 8, 20) if args.quick else (2, 4, 8, 12, 20)
    rng = random.Random(0)
    rows = []
    worst = 0.0
    for F in (QQ, GF(101)):
        for n in sizes:
            a = Mat.from_rows(F, [[rng.randint(-9, 9) for _ in range(n)] for _ in range(n)])
            b = Mat.from_rows(F, [[rng.randint(-9, 9) for _ in range(n)] for _ in range(n)])
            h = Mat.from_rows(F, random_rows(rng, n, n // 2))
            assert a.rank() == n and h.rank() == n // 2, "choose another seed"
            ra, rb, rh = a._m, b._m, h._m
            count = max(200, 20000 // (n * n // 4 + 1))
            raw_kernel = (lambda rh=rh: rh.rref()) if F is QQ else (lambda rh=rh: rh.nullspace())
            for op, wrapped, bare in (
                ("product", lambda a=a, b=b: a @ b, lambda ra=ra, rb=rb: ra * rb),
                ("rref", lambda a=a: a.rref(), lambda ra=ra: ra.rref()),
                ("rref half", lambda h=h: h.rref(), lambda rh=rh: rh.rref()),
                ("rank", lambda a=a: a.rank(), lambda ra=ra: ra.rank()),
                ("kernel", lambda h=h: h.right_kernel(), raw_kernel),
                ("transpose", lambda a=a: a.transpose(), lambda ra=ra: ra.transpose()),
            ):
                tw, tb = per_call(wrapped, count), per_call(bare, count)
                worst = max(worst, tw / tb) if n >= 4 else worst
                rows.append([F.name, f"{n}x{n}", op, f"{tw:.2f}", f"{tb:.2f}", f"{tw / tb:.1f}x"])
    print(table(rows, ["field", "size", "operation", "Mat us", "flint us", "ratio"]))
    print(f"largest ratio from 4 x 4 up: {worst:.1f}x")


if __name__ == "__main__":
    main()
