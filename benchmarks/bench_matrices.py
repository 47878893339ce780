"""Benchmark: the matrix wrapper ``Mat`` against bare python-flint on small matrices.

Times the product, the reduced echelon form and the transpose of 2 x 2, 4 x 4
and 8 x 8 matrices over QQ and GF(101) through :class:`hwcat.exact.Mat` and
directly on the flint objects in the same run, and prints the ratios.

    python benchmarks/bench_matrices.py
"""

from __future__ import annotations

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
    for _ in range(3):
        t0 = time.perf_counter()
        for _ in range(count):
            fn()
        best = min(best, time.perf_counter() - t0)
    return best / count * 1e6


def main() -> None:
    rng = random.Random(0)
    rows = []
    for F in (QQ, GF(101)):
        for n in (2, 4, 8):
            a = Mat.from_rows(F, [[rng.randint(-9, 9) for _ in range(n)] for _ in range(n)])
            b = Mat.from_rows(F, [[rng.randint(-9, 9) for _ in range(n)] for _ in range(n)])
            ra, rb = a._m, b._m
            count = 20000
            for op, wrapped, bare in (
                ("product", lambda a=a, b=b: a @ b, lambda ra=ra, rb=rb: ra * rb),
                ("rref", lambda a=a: a.rref(), lambda ra=ra: ra.rref()),
                ("transpose", lambda a=a: a.transpose(), lambda ra=ra: ra.transpose()),
            ):
                tw, tb = per_call(wrapped, count), per_call(bare, count)
                rows.append([F.name, f"{n}x{n}", op, f"{tw:.2f}", f"{tb:.2f}", f"{tw / tb:.1f}x"])
    print(table(rows, ["field", "size", "operation", "Mat us", "flint us", "ratio"]))


if __name__ == "__main__":
    main()
