"""Naive heredity-chain search over the reachable upper sets: the baseline of bench_orders.py.

It visits the same sets as hwcat's search (breadth first from the empty set,
adding a vertex ``u`` when ``A e_u A`` is a heredity ideal of the current
quotient ``B = A / A e_S A``) and applies the same dimension test, but
computes every trace it needs from scratch, by one closure along the arrows
in ``P(s)`` from the spaces at the removed vertices: nothing is cached between
sets.  Blocks are searched separately, as hwcat does.  It counts
quasi-hereditary total orders (dynamic programming over the sets); it does not
count structures.
"""

from __future__ import annotations

from math import factorial

from hwcat.algebras.hub.rep import closure
from hwcat.exact import Mat


def _trace_dims(A, T: int, s: int) -> list[int]:
    dims, maps = A.projective_rep(s)
    gens = {u: Mat.identity(A.field, dims[u]) for u in range(A.n) if T >> u & 1 and dims[u]}
    if not gens:
        return [0] * A.n
    return [k.nrows for k in closure(A.field, dims, maps, A.arrows, gens)]


def _block_orders(A) -> tuple[int, int]:
    n = A.n
    full = (1 << n) - 1
    pd = [A.projective_dims(s) for s in range(n)]
    level = {0: 1}
    reachable = 1
    for _ in range(n):
        nxt: dict[int, int] = {}
        for S, cnt in level.items():
            R = [s for s in range(n) if not S >> s & 1]
            q = {s: [d - k for d, k in zip(pd[s], _trace_dims(A, S, s))] for s in R}
            for u in R:
                if q[u][u] != 1:
                    continue
                T = S | (1 << u)
                eB = sum(q[u])
                ok = True
                for s in R:
                    if s == u or not q[s][u]:
                        continue
                    image = sum(q[s]) - (sum(pd[s]) - sum(_trace_dims(A, T, s)))
                    if image != q[s][u] * eB:
                        ok = False
                        break
                if ok:
                    nxt[T] = nxt.get(T, 0) + cnt
        if not nxt:
            return 0, reachable
        reachable += len(nxt)
        level = nxt
    return level[full], reachable


def naive_orders(A) -> tuple[int, int]:
    """``(number of quasi-hereditary total orders, reachable sets)``, the naive way."""
    total = factorial(A.n)
    reachable = 0
    for comp in A.components():
        B = A if len(comp) == A.n else A.full_subalgebra(comp)
        cnt, r = _block_orders(B)
        reachable += r
        total = total // factorial(len(comp)) * cnt
    return total, reachable
