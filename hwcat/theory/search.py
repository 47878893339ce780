"""All quasi-hereditary orders: the subset search, counts of orders and of structures.

Method
------
The quotient ``A / A e_S A`` after removing a set ``S`` of maximal vertices
depends only on ``S``.  The search walks the lattice of such sets from the
empty set, adding one vertex ``u`` when ``A e_u A`` is a heredity ideal of the
current quotient (:meth:`~hwcat.theory.traces.TraceCache.step_failure`), so
each reachable set is visited once.  Quasi-hereditary total orders are the maximal
chains of this lattice (counted by dynamic programming), never enumerated.
A chain's standard modules are the ``P(u)`` modulo the trace of the set
removed before ``u``; two quasi-hereditary orders give the same quasi-hereditary
structure when these agree for every ``u`` (compared as quotients of ``P(u)``
through the exact echelon form of the trace).  Structures are counted by
carrying, for each reachable set, the distinct partial tuples of standard
modules reaching it; this is exact and its cost grows with the number of
structures, not with the number of orders.

Blocks are searched separately: orders of different blocks interleave freely
(a multinomial factor) and structures multiply.

References
----------
V. Dlab, C. M. Ringel, Quasi-hereditary algebras, Illinois J. Math. 33 (1989).
"""

from __future__ import annotations

from dataclasses import dataclass
from math import factorial
from typing import Any

from hwcat.algebras.hub.basic import BasicAlgebra
from hwcat.theory.highest_weight import costandard_module, trace_cache
from hwcat.theory.orders import PartialOrder, total_order
from hwcat.theory.traces import mask

__all__ = [
    "Structure",
    "OrdersResult",
    "quasi_hereditary_orders",
    "is_quasi_hereditary",
    "count_quasi_hereditary_extensions",
    "DEFAULT_LIST_LIMIT",
]

DEFAULT_LIST_LIMIT = 20


@dataclass(frozen=True)
class Structure:
    """One quasi-hereditary structure: its standard modules and essential order."""

    vertices: tuple[str, ...]
    standard_dimension_vectors: tuple[tuple[int, ...], ...]
    costandard_dimension_vectors: tuple[tuple[int, ...], ...]
    essential_order: PartialOrder
    representative: tuple[int, ...]  # a quasi-hereditary total order, highest first

    def to_dict(self) -> dict[str, Any]:
        v = self.vertices
        return {
            "standard_dimension_vectors": {
                v[i]: list(d) for i, d in enumerate(self.standard_dimension_vectors)
            },
            "costandard_dimension_vectors": {
                v[i]: list(d) for i, d in enumerate(self.costandard_dimension_vectors)
            },
            "essential_order": self.essential_order.covers_named(),
            "hasse_diagram": self.essential_order.covers_named(),
            "quasi_hereditary_total_orders": self.essential_order.count_linear_extensions(),
            # deprecated alias of the key above, kept for one release
            "adapted_total_orders": self.essential_order.count_linear_extensions(),
            "representative_order": [v[i] for i in self.representative],
        }


@dataclass(frozen=True)
class OrdersResult:
    """What ``hwcat orders`` reports."""

    name: str
    vertices: tuple[str, ...]
    quasi_hereditary: bool
    quasi_hereditary_total_orders: int
    structures: int
    structure_list: tuple[Structure, ...]
    listed_all: bool
    blocks: tuple[tuple[str, ...], ...]
    reachable_sets: int
    best_attempt: tuple[int, ...]

    def to_dict(self) -> dict[str, Any]:
        return {
            "name": self.name,
            "simples": list(self.vertices),
            "quasi_hereditary": self.quasi_hereditary,
            "quasi_hereditary_total_orders": self.quasi_hereditary_total_orders,
            # deprecated alias of the key above, kept for one release
            "adapted_total_orders": self.quasi_hereditary_total_orders,
            "structures": self.structures,
            "structure_list": [s.to_dict() for s in self.structure_list],
            "listed_all": self.listed_all,
            "blocks": [list(b) for b in self.blocks],
            "reachable_vertex_sets": self.reachable_sets,
            "longest_heredity_chain": [self.vertices[i] for i in self.best_attempt],
        }


@dataclass
class _BlockSearch:
    count: int
    sigs: dict[tuple[int, ...], tuple[int, ...]]  # signature -> representative path
    deltas: dict[int, tuple[int, ...]]  # delta id -> dimension vector
    best: tuple[int, ...]
    reachable: int


def _search_block(
    A: BasicAlgebra, upper: PartialOrder | None = None, track: bool = True
) -> _BlockSearch:
    """Subset search on one algebra; with ``upper``, only steps allowed by that partial order.

    ``track`` carries the standard-module signatures (for structures) and the best attempt.
    """
    tc = trace_cache(A)
    n = A.n
    full = (1 << n) - 1
    above = [0] * n
    if upper is not None:
        above = [mask(b for (a, b) in upper.less if a == v) for v in range(n)]
    intern: dict[tuple, int] = {}
    deltas: dict[int, tuple[int, ...]] = {}
    level: dict[int, tuple[int, dict]] = {0: (1, {(-1,) * n: ()})}
    reachable = 1
    best: tuple[int, ...] = ()
    for _ in range(n):
        nxt: dict[int, list] = {}
        for S, (cnt, sigs) in level.items():
            for u in range(n):
                if S >> u & 1 or above[u] & ~S:
                    continue
                if tc.step_failure(S, u) is not None:
                    continue
                T = S | (1 << u)
                entry = nxt.get(T)
                if entry is None:
                    entry = nxt[T] = [0, {}]
                entry[0] += cnt
                if track:
                    key = (u, tc.kernel_key(S, u))
                    did = intern.get(key)
                    if did is None:
                        did = intern[key] = len(intern)
                        deltas[did] = tc.qdims(S, u)
                    esig = entry[1]
                    for sig, path in sigs.items():
                        sig2 = sig[:u] + (did,) + sig[u + 1 :]
                        if sig2 not in esig:
                            esig[sig2] = path + (u,)
        if not nxt:
            break
        reachable += len(nxt)
        level = {T: (e[0], e[1]) for T, e in nxt.items()}
        if track:
            first = next(iter(level.values()))[1]
            best = next(iter(first.values())) if first else best
    if full in level:
        cnt, sigs = level[full]
        return _BlockSearch(cnt, sigs, deltas, best, reachable)
    return _BlockSearch(0, {}, deltas, best, reachable)


def count_quasi_hereditary_extensions(A: BasicAlgebra, order: PartialOrder) -> int:
    """Number of linear extensions of ``order`` for which the algebra is quasi-hereditary (heredity chains)."""
    return _search_block(A, order, track=False).count


def _structure(A: BasicAlgebra, sig: tuple[int, ...], path: tuple[int, ...], deltas) -> Structure:
    n = A.n
    sdims = tuple(deltas[sig[v]] for v in range(n))
    rep = total_order(A.vertices, path)
    cdims = tuple(costandard_module(A, L, rep).dims for L in range(n))
    pairs = {
        (mu, L) for L in range(n) for mu in range(n) if mu != L and (sdims[L][mu] or cdims[L][mu])
    }
    ess = PartialOrder.from_relations(A.vertices, sorted(pairs))
    return Structure(A.vertices, sdims, cdims, ess, path)


def quasi_hereditary_orders(
    A: BasicAlgebra, *, list_limit: int | None = DEFAULT_LIST_LIMIT
) -> OrdersResult:
    """Decide quasi-heredity over all orders; count quasi-hereditary total orders and structures.

    Parameters
    ----------
    A : BasicAlgebra
    list_limit : int or None
        How many structures to list (``None``: all of them).

    Examples
    --------
    The path algebra of a linearly oriented A_3 is hereditary: it is quasi-hereditary
    for all 3! orders, and it has Catalan(3) = 5 quasi-hereditary structures
    (Flores, Kimura, Rognerud, arXiv:2004.04726).

    >>> from hwcat.io.spec import load_spec_text
    >>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["1", "2", "3"]\\narrows = ["a: 1 -> 2", "b: 2 -> 3"]')
    >>> r = quasi_hereditary_orders(A)
    >>> r.quasi_hereditary, r.quasi_hereditary_total_orders, r.structures
    (True, 6, 5)
    """
    comps = A.components()
    n = A.n
    per_block = []
    for comp in comps:
        B = A if len(comps) == 1 else A.full_subalgebra(comp)
        per_block.append((comp, B, _search_block(B)))
    qh = all(b.count > 0 for _, _, b in per_block)
    total = 0
    nstruct = 0
    structs: list[Structure] = []
    listed_all = True
    if qh:
        total = factorial(n)
        for comp, _, b in per_block:
            total = total // factorial(len(comp)) * b.count
        nstruct = 1
        for _, _, b in per_block:
            nstruct *= len(b.sigs)
        # list: product over blocks, capped
        cap = list_limit if list_limit is not None else nstruct
        combos: list[list[tuple[list[int], dict]]] = [[]]
        for comp, B, b in per_block:
            items = list(b.sigs.items())
            new = []
            for prefix in combos:
                for sig, path in items:
                    new.append(prefix + [(comp, (B, sig, path, b.deltas))])
                    if len(new) >= cap:
                        break
                if len(new) >= cap:
                    break
            combos = new
        listed_all = len(combos) >= nstruct
        for combo in combos[:cap]:
            structs.append(_combine(A, combo))
    best: list[int] = []
    for comp, _, b in per_block:
        if b.count:
            best.extend(comp[i] for i in next(iter(b.sigs.values())))
    for comp, _, b in per_block:
        if not b.count:
            best.extend(comp[i] for i in b.best)
    return OrdersResult(
        name=A.name,
        vertices=A.vertices,
        quasi_hereditary=qh,
        quasi_hereditary_total_orders=total,
        structures=nstruct,
        structure_list=tuple(structs),
        listed_all=listed_all,
        blocks=tuple(tuple(A.vertices[v] for v in c) for c in comps),
        reachable_sets=sum(b.reachable for _, _, b in per_block),
        best_attempt=tuple(best),
    )


def _combine(A: BasicAlgebra, combo) -> Structure:
    """Glue the structures of the blocks into one structure of ``A``."""
    n = A.n
    sd: list[tuple[int, ...]] = [()] * n
    cd: list[tuple[int, ...]] = [()] * n
    pairs: list[tuple[int, int]] = []
    rep: list[int] = []
    for comp, (B, sig, path, deltas) in combo:
        s = _structure(B, sig, path, deltas)
        for i, v in enumerate(comp):
            full_s = [0] * n
            full_c = [0] * n
            for j, w in enumerate(comp):
                full_s[w] = s.standard_dimension_vectors[i][j]
                full_c[w] = s.costandard_dimension_vectors[i][j]
            sd[v] = tuple(full_s)
            cd[v] = tuple(full_c)
        pairs.extend((comp[a], comp[b]) for a, b in s.essential_order.less)
        rep.extend(comp[i] for i in path)
    ess = PartialOrder.from_relations(A.vertices, pairs)
    return Structure(A.vertices, tuple(sd), tuple(cd), ess, tuple(rep))


def is_quasi_hereditary(A: BasicAlgebra, order: PartialOrder | None = None) -> bool:
    """Whether ``A`` is quasi-hereditary (for ``order``, or for some order).

    >>> from hwcat.io.spec import load_spec_text
    >>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["x"]\\narrows = ["t: x -> x"]\\nvanish_from_length = 2')
    >>> is_quasi_hereditary(A)
    False
    """
    if order is not None:
        from hwcat.theory.highest_weight import heredity_chain

        return heredity_chain(A, order).holds
    for comp in A.components():
        B = A if len(comp) == A.n else A.full_subalgebra(comp)
        if _search_block(B, track=False).count == 0:
            return False
    return True


def adapted_orders(A: BasicAlgebra, *, list_limit: int | None = DEFAULT_LIST_LIMIT) -> OrdersResult:
    """Deprecated name of :func:`quasi_hereditary_orders`, kept for one release.

    In the literature an *adapted* order is a weaker notion (every total order
    is adapted), so the old name was misleading.
    """
    import warnings

    warnings.warn(
        "quasi_hereditary_orders is deprecated; use quasi_hereditary_orders",
        DeprecationWarning,
        stacklevel=2,
    )
    return quasi_hereditary_orders(A, list_limit=list_limit)
