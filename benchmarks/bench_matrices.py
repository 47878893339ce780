"""Benchmark: the matrix wrapper ``Mat`` against bare python-flint on small matrices.

On square matrices of size 2 to 20 over QQ and GF(101), in one run, the
statements of each case take turns (31 rounds of about 0.5 ms each; the best
round is kept):

* ``Mat us``: the call through :class:`hwcat.exact.Mat`: ``A @ B``, ``A + B``,
  ``A == A2`` (equal, another object), ``transpose``, ``rank``, ``inverse``,
  ``solve_left`` (``X @ A = B``, A invertible), ``rref`` (full rank), ``rref``
  of a rank-n/2 matrix, ``right_kernel`` of the rank-n/2 matrix;
* ``flint us``: flint's own call on the same flint matrices (for ``solve``
  flint's ``A.solve(B)``, which solves ``A X = B``; for the kernel over QQ its
  ``rref()``, as flint has no rational kernel);
* ``same job us``, where ``Mat`` returns more than flint's call: the same
  result computed directly on flint's matrices by the same sequence of flint
  calls, with the same caches built outside the timings --

  - ``rref`` (nonzero rows and the pivot tuple): ``rref()``, the shape, the
    pivots (one entry read when they are the leading columns, else a scan),
    zero rows dropped by a product with the first rows of an identity;
  - ``kernel`` (exactly nullity rows, the echelon normal form): over GF(p)
    ``nullspace()``, transposed, its first nullity rows; over QQ the echelon
    form ``R``, its pivots and ``E_F - (E_F R^T) Q`` (0/1 matrices ``E_F``: unit
    rows of the free columns, ``Q``: row ``i`` to the unit row of pivot ``i``);
  - ``solve``: ``A^T.solve(B^T)^T``;

* ``shell us``: a one-slot Python class (``Shell`` below) that only calls
  flint and wraps the result: the interpreter's share (calling a Python method
  or operator, creating the result object) that any wrapper pays;
* ``ratio``: Mat / same job (flint's call where no job is listed);
  ``vs primitive``: Mat / flint's call.

    python benchmarks/bench_matrices.py            # sizes 2, 4, 8, 12, 20
    python benchmarks/bench_matrices.py --quick    # sizes 2, 8, 20

Figures: ratio Mat / same job, before -> after the thin paths of ``Mat``
(results built without ``__init__``, shape errors left to flint and
translated, shapes read only where an answer needs them, square systems by
flint's ``solve``, kernels over QQ by the three flint operations above); one
run of this script on each version, back to back, on a 2-core machine shared
with other work (``uptime`` load average 4.1 during both runs).

    QQ           2x2         4x4         8x8         12x12       20x20
    product      2.0 -> 2.0  1.5 -> 1.3  1.3 -> 1.1  0.9 -> 1.1  1.0 -> 1.0
    sum          9.7 -> 3.2  4.8 -> 2.1  2.3 -> 1.4  1.6 -> 1.2  1.2 -> 1.1
    equality    20.9 -> 4.3  6.2 -> 1.8  2.6 -> 1.3  1.8 -> 1.1  1.3 -> 1.1
    transpose    2.4 -> 1.5  1.7 -> 1.6  1.2 -> 1.5  1.2 -> 1.1  1.1 -> 1.1
    rank         1.1 -> 1.1  1.1 -> 1.0  1.0 -> 1.2  1.0 -> 1.0  1.0 -> 1.0
    inverse      3.7 -> 1.4  1.3 -> 1.1  1.1 -> 1.0  1.0 -> 1.0  1.0 -> 1.0
    solve       13.9 -> 1.4  8.6 -> 1.2  6.8 -> 1.0  5.7 -> 1.0  1.0 -> 1.0
    rref         1.7 -> 1.3  1.3 -> 1.1  1.0 -> 1.1  1.1 -> 1.0  1.0 -> 1.0
    rref half    1.6 -> 1.3  1.2 -> 1.1  1.1 -> 1.0  1.0 -> 1.0  1.0 -> 1.0
    kernel       2.4 -> 1.5  1.6 -> 1.2  1.4 -> 1.1  1.3 -> 1.0  1.1 -> 1.0

    GF(101)      2x2         4x4         8x8         12x12       20x20
    product      3.9 -> 3.5  2.5 -> 2.4  1.6 -> 1.6  1.4 -> 1.3  1.1 -> 1.2
    sum         10.3 -> 3.7  8.0 -> 3.0  6.2 -> 2.5  5.1 -> 2.4  2.0 -> 1.7
    equality    18.7 -> 3.5  9.9 -> 2.6  4.4 -> 1.5  2.2 -> 1.2  1.3 -> 1.1
    transpose    2.5 -> 2.1  2.6 -> 2.0  2.1 -> 1.7  1.8 -> 1.8  1.6 -> 1.3
    rank         1.2 -> 1.2  1.2 -> 1.2  1.1 -> 1.1  0.8 -> 1.0  1.1 -> 1.0
    inverse      2.4 -> 1.4  2.1 -> 1.3  1.3 -> 1.1  1.1 -> 1.1  1.1 -> 1.0
    solve       15.7 -> 1.6 17.5 -> 1.4 23.0 -> 1.2 23.9 -> 1.1 32.5 -> 1.0
    rref         1.8 -> 1.3  1.5 -> 1.3  1.4 -> 1.1  1.3 -> 1.1  1.2 -> 1.1
    rref half    1.6 -> 1.3  1.5 -> 1.3  1.3 -> 1.2  1.2 -> 1.1  1.0 -> 1.1
    kernel       1.7 -> 1.6  1.5 -> 1.5  1.3 -> 1.3  1.7 -> 1.2  1.1 -> 1.1

Still above 2x after: sums, products, equality and transposes where flint's
call takes 0.03-0.2 us (GF(101) up to 12 x 12; over QQ sums at 2 x 2 and
4 x 4, equality at 2 x 2).  There the shell costs as much as ``Mat`` (GF(101) 2 x 2: sum 0.06 us
in flint, 0.16 us in the shell, 0.21 us through ``Mat``; product 0.12, 0.37,
0.42; equality 0.03, 0.08, 0.11): a Python-level operator call and a new
object cost about 0.1-0.3 us, which is the floor for any wrapper written in
Python.  Against flint's bare call (``vs primitive``) ``rref`` of a rank-n/2
matrix and kernels stay at 3-12x at 2 x 2 (12x for the kernel over QQ): the
job (pivots, dropping zero rows, building the basis) is several flint calls.
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
