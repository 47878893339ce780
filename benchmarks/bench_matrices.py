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
import timeit
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))
sys.path.insert(0, str(Path(__file__).resolve().parent))

from _common import table

from hwcat.exact import GF, QQ, Mat

# -- the same jobs written directly on flint's matrices ---------------------------------------

_RANGES = [tuple(range(k)) for k in range(65)]


def selection(raw_type, k: int, n: int, *modulus) -> object:
    """The first ``k`` rows of the ``n x n`` identity (built once, outside the timings)."""
    S = raw_type(k, n, *modulus)
    for i in range(k):
        S[i, i] = 1
    return S


def raw_pivots(R, rank: int, c: int) -> tuple[int, ...]:
    if rank == c or (rank and R[rank - 1, rank - 1]):
        return _RANGES[rank]
    piv = []
    j = 0
    for i in range(rank):
        while not R[i, j]:
            j += 1
        piv.append(j)
        j += 1
    return tuple(piv)


def raw_echelon(m, select):
    """Nonzero rows and pivots of the reduced echelon form, on flint's matrix ``m``."""
    R, rank = m.rref()
    r, c = m.nrows(), m.ncols()
    piv = raw_pivots(R, rank, c)
    return (R if rank == r else select * R), piv


def raw_kernel_mod_p(m, select):
    """The kernel rows over GF(p): flint's nullspace, transposed, its first nullity rows."""
    X, nullity = m.nullspace()
    if nullity < m.ncols():
        return select * X.transpose()
    return X.transpose()


def raw_kernel_rational(m, pieces):
    """The kernel rows over QQ (flint has no rational kernel): the echelon form ``R``, its
    pivots, then ``E_F - (E_F R^T) Q`` with the 0/1 matrices ``E_F`` (unit rows of the free
    columns) and ``Q`` (row ``i`` to the unit row of pivot ``i``) built outside the timings."""
    R, rank = m.rref()
    E, Q = pieces[raw_pivots(R, rank, m.ncols())]
    return E - (E * R.transpose()) * Q


def kernel_pieces(m) -> dict:
    R, rank = m.rref()
    r, c = m.nrows(), m.ncols()
    piv = raw_pivots(R, rank, c)
    free = [j for j in range(c) if j not in piv]
    E, Q = type(m)(len(free), c), type(m)(r, c)
    for k, f in enumerate(free):
        E[k, f] = 1
    for i, p in enumerate(piv):
        Q[i, p] = 1
    return {piv: (E, Q)}


def raw_solve_left(m, b):
    """``X`` with ``X m = b`` for a square invertible ``m``: flint solves ``m^T X^T = b^T``."""
    return m.transpose().solve(b.transpose()).transpose()


_new = object.__new__


class Shell:
    """The least a Python wrapper can do: one slot, no checks, a new object per result.

    Timing it beside flint shows the interpreter's share (calling a Python method or
    operator and creating an object), which no wrapper can avoid."""

    __slots__ = ("_m",)

    def __init__(self, raw) -> None:
        self._m = raw

    def __matmul__(self, other):
        out = _new(Shell)
        out._m = self._m * other._m
        return out

    def __add__(self, other):
        out = _new(Shell)
        out._m = self._m + other._m
        return out

    def __eq__(self, other):
        return self._m == other._m

    __hash__ = None

    def transpose(self):
        out = _new(Shell)
        out._m = self._m.transpose()
        return out

    def rank(self) -> int:
        return self._m.rank()

    def inverse(self):
        out = _new(Shell)
        out._m = self._m.inv()
        return out


# -- timing ------------------------------------------------------------------------------------


def best_times(stmts: list[str], env: dict, rounds: int) -> list[float]:
    """Best time per call (us) of each statement; the statements take turns in every round."""
    timers = [timeit.Timer(s, globals=env) for s in stmts]
    count = 1
    while (t := timers[0].timeit(count)) < 1e-4:
        count *= 4
    count = max(1, int(count * 5e-4 / t))  # about 0.5 ms per timing of the wrapped call
    best = [float("inf")] * len(timers)
    for _ in range(rounds):
        for i, t in enumerate(timers):
            best[i] = min(best[i], t.timeit(count))
    return [b / count * 1e6 for b in best]


def random_rows(rng: random.Random, n: int, rank: int) -> list[list[int]]:
    """An ``n x n`` integer matrix of rank ``rank`` over QQ (a product through ``rank`` columns)."""
    left = [[rng.randint(-9, 9) for _ in range(rank)] for _ in range(n)]
    right = [[rng.randint(-9, 9) for _ in range(n)] for _ in range(rank)]
    return [
        [sum(left[i][k] * right[k][j] for k in range(rank)) for j in range(n)] for i in range(n)
    ]


def cases(F, n: int, rng: random.Random) -> tuple[dict, list[tuple[str, str, str, str | None]]]:
    a = Mat.from_rows(F, [[rng.randint(-9, 9) for _ in range(n)] for _ in range(n)])
    b = Mat.from_rows(F, [[rng.randint(-9, 9) for _ in range(n)] for _ in range(n)])
    h = Mat.from_rows(F, random_rows(rng, n, n // 2))
    assert a.rank() == n and h.rank() == n // 2, "choose another seed"
    a2 = Mat.from_rows(F, a.tolist())  # equal to a, another object: == reads every entry
    ra, rb, rh, ra2 = a._m, b._m, h._m, a2._m
    raw_type, modulus = type(ra), (() if F is QQ else (F.p,))
    env = dict(
        globals(),
        a=a,
        b=b,
        h=h,
        a2=a2,
        ra=ra,
        rb=rb,
        rh=rh,
        ra2=ra2,
        sa=Shell(ra),
        sb=Shell(rb),
        sa2=Shell(ra2),
        S_half=selection(raw_type, n // 2, n, *modulus),
        S_null=selection(raw_type, n - n // 2, n, *modulus),
        pieces=kernel_pieces(rh) if F is QQ else None,
    )
    kernel_primitive = "rh.rref()" if F is QQ else "rh.nullspace()"
    kernel_job = "raw_kernel_rational(rh, pieces)" if F is QQ else "raw_kernel_mod_p(rh, S_null)"
    ops = [  # (operation, through Mat, flint's primitive, same job on flint's matrices, Shell)
        ("product", "a @ b", "ra * rb", None, "sa @ sb"),
        ("sum", "a + b", "ra + rb", None, "sa + sb"),
        ("equality", "a == a2", "ra == ra2", None, "sa == sa2"),
        ("transpose", "a.transpose()", "ra.transpose()", None, "sa.transpose()"),
        ("rank", "a.rank()", "ra.rank()", None, "sa.rank()"),
        ("inverse", "a.inverse()", "ra.inv()", None, "sa.inverse()"),
        ("solve", "a.solve_left(b)", "ra.solve(rb)", "raw_solve_left(ra, rb)", None),
        ("rref", "a.rref()", "ra.rref()", "raw_echelon(ra, None)", None),
        ("rref half", "h.rref()", "rh.rref()", "raw_echelon(rh, S_half)", None),
        ("kernel", "h.right_kernel()", kernel_primitive, kernel_job, None),
    ]
    return env, ops


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--quick", action="store_true")
    ap.add_argument("--rounds", type=int, default=31)
    args = ap.parse_args()
    sizes = (2, 8, 20) if args.quick else (2, 4, 8, 12, 20)
    rng = random.Random(0)
    rows = []
    worst: dict[bool, tuple[float, str]] = {True: (0.0, ""), False: (0.0, "")}
    for F in (QQ, GF(101)):
        for n in sizes:
            env, ops = cases(F, n, rng)
            for op, wrapped, primitive, job, shell in ops:
                extra = [x for x in (job, shell) if x]
                ts = best_times([wrapped, primitive, *extra], env, args.rounds)
                tw, tp = ts[0], ts[1]
                tj = ts[2] if job else tp
                tshell = ts[-1] if shell else None
                ratio = tw / tj
                small = n <= 4
                if ratio > worst[small][0]:
                    worst[small] = (ratio, f"{F} {n}x{n} {op}")
                rows.append(
                    [
                        F.name,
                        f"{n}x{n}",
                        op,
                        f"{tw:.2f}",
                        f"{tp:.2f}",
                        f"{tj:.2f}" if job else "=",
                        f"{tshell:.2f}" if tshell else "",
                        f"{ratio:.1f}x",
                        f"{tw / tp:.1f}x",
                    ]
                )
    print(
        table(
            rows,
            [
                "field",
                "size",
                "operation",
                "Mat us",
                "flint us",
                "same job us",
                "shell us",
                "ratio",
                "vs primitive",
            ],
        )
    )
    for small, label in ((True, "2 x 2 and 4 x 4"), (False, "8 x 8 up")):
        print(
            f"largest ratio (Mat / same job in flint), {label}: "
            f"{worst[small][0]:.1f}x ({worst[small][1]})"
        )


if __name__ == "__main__":
    main()
