"""Certificates of quasi-heredity (or of its failure) for one order.

A certificate is one JSON object that :mod:`hwcat.verify` checks without the
rest of hwcat: the algebra as a multiplication table on a basis of paths with
a presentation by relations, a total order (a linear extension of the order
asked about, with that order's cover relations), and the evidence: the trace
ideals ``J_k = A e_{u_1..u_k} A`` of the heredity chain in reduced echelon
form, or the first failing heredity condition along the chain with a witness.
The format is in ``specs/FORMAT.md`` (section *Certificates*), the
mathematics in the docstring of :mod:`hwcat.verify`.

The verdict written here comes from the trace computations of
:mod:`hwcat.theory.traces`; it must agree with :func:`heredity_chain` (the
independent check over all linear extensions), else
:class:`~hwcat.errors.InternalInconsistency` is raised.
"""

from __future__ import annotations

import json
from dataclasses import dataclass
from typing import Any

from hwcat.algebras.hub.basic import BasicAlgebra
from hwcat.algebras.hub.quiver import parse_relation
from hwcat.algebras.reduction.presentation import loewy_length, presentation
from hwcat.errors import InternalInconsistency
from hwcat.exact import Mat, echelon
from hwcat.theory.highest_weight import heredity_chain, trace_cache
from hwcat.theory.orders import PartialOrder

__all__ = ["Certificate", "certify", "proposed_order", "FORMAT", "VERSION"]

FORMAT = "hwcat-certificate"
VERSION = 1


@dataclass(frozen=True)
class Certificate:
    """A certificate: ``data`` is the JSON object; ``order`` the order it is about."""

    data: dict[str, Any]
    order: PartialOrder
    order_source: str

    @property
    def quasi_hereditary(self) -> bool:
        return self.data["quasi_hereditary"]

    def to_dict(self) -> dict[str, Any]:
        return self.data


def proposed_order(A: BasicAlgebra) -> tuple[PartialOrder, str]:
    """The order to certify when none is given: a family's natural order, else the
    search's choice (see :func:`hwcat.theory.check.chosen_by_search`)."""
    from hwcat.theory.check import as_order, chosen_by_search

    if A.natural_order:
        return as_order(A, A.natural_order), "the family's natural order"
    order, source, summary = chosen_by_search(A)
    if not summary.quasi_hereditary_for_some_order:
        source = (
            "no order makes the algebra quasi-hereditary; best attempt of the search (its "
            "longest heredity chain, then the remaining vertices in spec order)"
        )
    return order, source


def _algebra_json(A: BasicAlgebra) -> tuple[dict[str, Any], dict[tuple[int, int, int], int]]:
    F, n = A.field, A.n
    gid: dict[tuple[int, int, int], int] = {}
    basis = []
    for s in range(n):
        for t in range(n):
            for k, w in enumerate(A.words[s][t]):
                gid[(s, t, k)] = len(basis)
                basis.append([s, t, list(w)])
    action = []
    for i, (s, t, _) in enumerate(basis):
        k = i - gid[(s, t, 0)]
        for a, arr in enumerate(A.arrows):
            if arr.source != t:
                continue
            row = A.action[s][a].raw_rows()[k]
            terms = [
                [gid[(s, arr.target, j)], F.to_int_or_str(c)] for j, c in enumerate(row) if c != 0
            ]
            if terms:
                action.append([i, a, terms])
    relations, vanish = _relations(A)
    names = [a.name for a in A.arrows]
    rel_json = []
    for rel in relations:
        terms = sorted(rel.items(), key=lambda pc: (len(pc[0]), [names[x] for x in pc[0]]))
        lead = terms[0][1]
        rel_json.append([[F.to_int_or_str(c / lead), list(p)] for p, c in terms])
    # sorted by their paths, without repeats (the checker's canonical form)
    rel_json = sorted(
        {json.dumps(r): r for r in rel_json}.values(),
        key=lambda r: ([(len(p), [names[x] for x in p]) for _, p in r], json.dumps(r)),
    )
    return {
        "vertices": list(A.vertices),
        "arrows": [[a.name, a.source, a.target] for a in A.arrows],
        "basis": basis,
        "right_action": action,
        "relations": rel_json,
        "vanish_from_length": vanish,
    }, gid


def _relations(A: BasicAlgebra) -> tuple[list[dict], int | None]:
    """Relations generating the kernel of ``kQ -> A`` together with the paths of length ``L``.

    The spec's own relations when ``A`` was given by a quiver with relations
    (``L`` = the Loewy length: paths that long vanish in ``A`` anyway, and the
    spec's ``vanish_from_length`` is at least ``L``), else the minimal relations
    of :func:`~hwcat.algebras.reduction.presentation.presentation` (whose cost
    grows with the number of paths).  In a relation with several terms, terms
    whose path is zero in ``A`` become relations of their own, so that every
    coefficient written is seen by the checker.
    """
    if A.relations is None:
        P = presentation(A, check=False)
        return list(P.relations), P.vanish_from_length
    L = loewy_length(A)
    out: list[dict] = []
    for text in A.relations:
        rel = {p: c for p, c in parse_relation(text, A.quiver, A.field).items() if c != 0}
        zero = [p for p in rel if _is_zero_path(A, p)]
        live = {p: c for p, c in rel.items() if p not in zero}
        if live:
            out.append(live)
        for p in zero:  # a minimal zero subpath generates p; drop it if paths that long vanish
            q = _minimal_zero_subpath(A, p)
            if len(q) < L:
                out.append({q: A.field.one})
    return out, (L if A.arrows else None)


def _minimal_zero_subpath(A: BasicAlgebra, p: tuple[int, ...]) -> tuple[int, ...]:
    for length in range(2, len(p) + 1):
        for i in range(len(p) - length + 1):
            if _is_zero_path(A, p[i : i + length]):
                return p[i : i + length]
    raise InternalInconsistency(f"path {p} is not zero")


def _is_zero_path(A: BasicAlgebra, p: tuple[int, ...]) -> bool:
    s = A.arrows[p[0]].source
    v = Mat.unit_rows(A.field, A.block_dim(s, s), [0])
    for a in p:
        v = v @ A.action[s][a]
    return v.is_zero()


def _rows(A: BasicAlgebra, M: Mat) -> list[list[Any]]:
    return [[A.field.to_int_or_str(x) for x in r] for r in echelon(M).raw_rows()]


def _greedy(K: Mat, d: int, ids: list[int]) -> list[int]:
    """Indices (from ``ids``) of the unit vectors independent modulo the row space of ``K``."""
    out, r = [], K.rank()
    cur = K
    for k in range(d):
        nxt = Mat.vstack(K.field, [cur, Mat.unit_rows(K.field, d, [k])], d)
        if nxt.rank() > r:
            out.append(ids[k])
            cur, r = nxt, r + 1
    return out


def _kernel_witness(A, tc, S: int, u: int, s: int, gid) -> dict[str, Any]:
    F = A.field
    Ks, Ku = tc.kernel(S, s), tc.kernel(S, u)
    xs = _greedy(Ks[u], A.block_dim(s, u), [gid[(s, u, k)] for k in range(A.block_dim(s, u))])
    xk = [i - gid[(s, u, 0)] for i in xs]
    for t in range(A.n):
        if not A.block_dim(u, t) or not xs:
            continue
        ys = _greedy(Ku[t], A.block_dim(u, t), [gid[(u, t, k)] for k in range(A.block_dim(u, t))])
        if not ys:
            continue
        M = A.multiplication_block(s, u, t)  # row j * dim(s,u) + i = x_i * y_j
        du = A.block_dim(s, u)
        yk = [j - gid[(u, t, 0)] for j in ys]
        prods = M.take_rows([j * du + i for i in xk for j in yk])
        K = Mat.vstack(F, [prods, Ks[t]], A.block_dim(s, t)).left_kernel()
        if not K.nrows:
            continue
        K = echelon(K.take_cols(range(prods.nrows)))
        if not K.nrows:
            continue
        c = K.raw_rows()[0]
        m = len(ys)
        terms = [
            [i, j, F.to_int_or_str(c[i * m + j])]
            for i in range(len(xs))
            for j in range(m)
            if c[i * m + j] != 0
        ]
        return {"row": s, "target": t, "left": xs, "right": ys, "coefficients": terms}
    raise InternalInconsistency("the dimension count failed but no kernel element was found")


def _outside(K: Mat, d: int, first: int) -> int | None:
    g = _greedy(K, d, list(range(first, first + d)))
    return g[0] if g else None


def _failure(A, tc, S: int, u: int, less, gid) -> dict[str, Any] | None:
    """The first failing condition at the step peeling ``u`` after ``S`` (the verifier's order)."""
    n = A.n
    if tc.qdim(S, u, u) != 1:
        return {
            "condition": "corner",
            "element": _outside(tc.kernel(S, u)[u], A.block_dim(u, u), gid[(u, u, 0)]),
        }
    f = tc.step_failure(S, u)
    if f is not None:
        return {"condition": "multiplication", **_kernel_witness(A, tc, S, u, f["row"], gid)}
    if less is not None:
        for cond, blk in (("standard", lambda v: (u, v)), ("costandard", lambda v: (v, u))):
            for v in range(n):
                if S >> v & 1 or v == u or (v, u) in less:
                    continue
                a, b = blk(v)
                if tc.qdim(S, a, b):
                    i = _outside(tc.kernel(S, a)[b], A.block_dim(a, b), gid[(a, b, 0)])
                    return {"condition": cond, "other": v, "element": i}
    return None


def certify(
    A: BasicAlgebra, order: PartialOrder | None = None, *, order_source: str = "given"
) -> Certificate:
    """A certificate that ``A`` is (or is not) quasi-hereditary for ``order``.

    Without ``order`` the search chooses one (see ``hwcat certify``).

    >>> from hwcat.io.spec import load_spec_text
    >>> from hwcat.theory.orders import parse_order
    >>> from hwcat.verify import verify_certificate
    >>> A = load_spec_text('field = "GF(3)"\\n[quiver]\\nvertices = ["1", "2"]\\narrows = ["a: 1 -> 2", "b: 2 -> 1"]\\nrelations = ["a*b"]')
    >>> c = certify(A, parse_order("1 > 2", A.vertices))
    >>> c.quasi_hereditary, verify_certificate(c.data).accepted
    (True, True)
    >>> c = certify(A, parse_order("2 > 1", A.vertices))
    >>> c.quasi_hereditary, c.data["evidence"]["failure"]["condition"]
    (False, 'corner')
    """
    if order is None:
        order, order_source = proposed_order(A)
    tc = trace_cache(A)
    chain = list(order.first_extension())
    less = None if order.is_total else order.less
    alg, gid = _algebra_json(A)
    steps: list[dict[str, Any]] = []
    failure = None
    S = 0
    for k, u in enumerate(chain):
        f = _failure(A, tc, S, u, less, gid)
        if f is not None:
            failure = {"step": k + 1, "vertex": u, **f}
            break
        S |= 1 << u
        ideal = []
        for s in range(A.n):
            K = tc.kernel(S, s)
            ideal.extend([s, t, _rows(A, K[t])] for t in range(A.n) if K[t].nrows)
        steps.append({"vertex": u, "ideal": ideal})
    qh = failure is None
    if qh != heredity_chain(A, order).holds:
        raise InternalInconsistency(
            f"the certificate's chain says {qh} but the heredity-chain check says otherwise "
            f"for {order.chain_text()}"
        )
    data = {
        "format": FORMAT,
        "version": VERSION,
        "quasi_hereditary": qh,
        "name": A.name,
        "field": A.field.name,
        "note": f"order: {order_source}",
        "algebra": alg,
        "order": {
            "chain": chain,
            "less": None if less is None else [list(p) for p in order.covers()],
        },
        "evidence": {"steps": steps} if qh else {"failure": failure},
    }
    return Certificate(data, order, order_source)
