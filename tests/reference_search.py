"""Reference implementations of the order search, kept to check the faster paths against.

* :func:`reference_structures`: the former structure search, which carries,
  for every reachable set, the distinct partial tuples of standard modules
  (each compared exactly as a quotient of ``P(u)``) and so lists every
  structure; its cost grows with the number of structures.
* :func:`closure_trace`: the trace of a vertex set in ``P(s)`` computed from
  scratch by one closure along the arrows (no cache, no sums of vertex traces).
"""

from __future__ import annotations

from hwcat.algebras.hub.rep import closure
from hwcat.exact import Mat
from hwcat.theory.traces import TraceCache


def closure_trace(A, T: int, s: int) -> list[Mat]:
    """Echelon bases of ``e_s A e_T A`` by one closure from the spaces at the vertices of ``T``."""
    dims, maps = A.projective_rep(s)
    gens = {u: Mat.identity(A.field, dims[u]) for u in range(A.n) if T >> u & 1 and dims[u]}
    return closure(A.field, dims, maps, A.arrows, gens)


def reference_structures(A):
    """``(number of quasi-hereditary total orders, {signature: an order})`` for a connected ``A``.

    A signature is the tuple, over the vertices, of the exact trace removed
    from ``P(u)`` to get ``Delta(u)``; each order is listed highest first.
    """
    tc = TraceCache(A)
    n = A.n
    full = (1 << n) - 1
    level = {0: (1, {(None,) * n: ()})}
    for _ in range(n):
        nxt: dict[int, list] = {}
        for S, (cnt, sigs) in level.items():
            for u in range(n):
                if S >> u & 1 or tc.step_failure(S, u) is not None:
                    continue
                T = S | (1 << u)
                entry = nxt.setdefault(T, [0, {}])
                entry[0] += cnt
                key = tc.kernel_key(S, u)
                for sig, path in sigs.items():
                    sig2 = sig[:u] + (key,) + sig[u + 1 :]
                    if sig2 not in entry[1]:
                        entry[1][sig2] = path + (u,)
        if not nxt:
            return 0, {}
        level = {T: (e[0], e[1]) for T, e in nxt.items()}
    cnt, sigs = level[full]
    return cnt, sigs
