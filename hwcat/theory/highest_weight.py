"""Standard and costandard modules, filtrations, heredity chains: the axioms for one order.

Definitions (for a partial order ``<=`` on the simples; Dlab and Ringel, *The
module theoretical approach to quasi-hereditary algebras*, LMS Lecture Note
Ser. 168, 1992):

* ``Delta(L)`` is the largest quotient of ``P(L)`` with composition factors
  ``<= L``: ``P(L)`` modulo the trace of the vertices not ``<= L``.
* ``nabla(L)`` is the largest submodule of ``I(L)`` with factors ``<= L``,
  computed as ``D`` of the standard module of the opposite algebra.
* The proper standard module is the largest quotient of ``P(L)`` with ``L``
  once (on top) and otherwise factors ``< L``; dually proper costandard.

A module has a ``Delta``-filtration exactly when its trace filtration along a
linear extension (highest first) has, at each vertex ``lam``, a trace of
``P(lam)`` isomorphic to ``Delta(lam)^m`` with ``m`` the multiplicity of
``lam`` in the top of that trace; this is tested by comparing dimension
vectors, which suffices because the trace is a quotient of ``Delta(lam)^m``.
"""

from __future__ import annotations

from dataclasses import dataclass, field
from typing import Any

from hwcat.algebras.hub.basic import BasicAlgebra
from hwcat.errors import InternalInconsistency, OrderError
from hwcat.exact import Mat, quotient_map
from hwcat.modules import Module, projective
from hwcat.theory.orders import PartialOrder
from hwcat.theory.traces import TraceCache, mask

__all__ = [
    "standard_module",
    "costandard_module",
    "proper_standard_module",
    "proper_costandard_module",
    "FiltrationResult",
    "standard_filtration",
    "costandard_filtration",
    "heredity_chain",
    "HeredityResult",
    "trace_cache",
]


def trace_cache(A: BasicAlgebra) -> TraceCache:
    """The algebra's (shared) cache of traces of vertex sets."""
    return A.cached("traces", lambda: TraceCache(A))


def _check_order(A: BasicAlgebra, order: PartialOrder) -> None:
    if tuple(order.vertices) != tuple(A.vertices):
        raise OrderError("the order is on other vertices than the algebra's")


def _opposite_order(op: BasicAlgebra, order: PartialOrder) -> PartialOrder:
    """The same order on the opposite algebra's vertices, one object per order and algebra.

    Shared so that its linear extension is computed once (the costandard
    filtrations of all tilting modules read it).
    """
    return op.cached(
        ("order:same-relations", order.less), lambda: PartialOrder(op.vertices, order.less)
    )


def _not_below(order: PartialOrder, L: int) -> int:
    below = order.below(L)
    return mask(v for v in range(order.n) if v not in below)


def standard_module(A: BasicAlgebra, L: str | int, order: PartialOrder) -> Module:
    """``Delta(L)``: ``P(L)`` modulo the trace of the vertices not ``<= L``.

    >>> from hwcat.io.spec import load_spec_text
    >>> from hwcat.theory.orders import parse_order
    >>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["1", "2"]\\narrows = ["a: 1 -> 2"]')
    >>> standard_module(A, 0, parse_order("1 > 2", A.vertices)).dims
    (1, 1)
    >>> standard_module(A, 0, parse_order("2 > 1", A.vertices)).dims
    (1, 0)
    """
    L = A.vertex_index(L)
    _check_order(A, order)

    def build() -> Module:
        K = trace_cache(A).kernel(_not_below(order, L), L)
        return projective(A, L).quotient(K, f"Delta({A.vertices[L]})")

    return A.cached(("standard", L, order.less), build)


def costandard_module(A: BasicAlgebra, L: str | int, order: PartialOrder) -> Module:
    """``nabla(L)``: the largest submodule of ``I(L)`` with factors ``<= L`` (= D Delta_op(L))."""
    L = A.vertex_index(L)
    _check_order(A, order)
    op = A.opposite()
    M = standard_module(op, L, _opposite_order(op, order)).dual()
    M.name = f"nabla({A.vertices[L]})"
    return M


def proper_standard_module(A: BasicAlgebra, L: str | int, order: PartialOrder) -> Module:
    """The largest quotient of ``P(L)`` with ``L`` once on top and other factors ``< L``."""
    L = A.vertex_index(L)
    D = standard_module(A, L, order)
    R = D.radical_spaces()[L]
    if R.nrows == 0:
        return D
    return D.quotient(D.generated({L: R}), f"proper Delta({A.vertices[L]})")


def proper_costandard_module(A: BasicAlgebra, L: str | int, order: PartialOrder) -> Module:
    """Dual notion of :func:`proper_standard_module` (a submodule of ``I(L)``)."""
    L = A.vertex_index(L)
    op = A.opposite()
    M = proper_standard_module(op, L, _opposite_order(op, order)).dual()
    M.name = f"proper nabla({A.vertices[L]})"
    return M


@dataclass(frozen=True)
class FiltrationResult:
    """Whether a module has a standard (or costandard) filtration.

    ``multiplicities[mu]`` is ``(M : Delta(mu))`` when the filtration exists.
    ``obstruction`` describes the first failing step of the trace filtration:
    the step, the vertex ``lam``, the multiplicity ``m`` of ``lam`` left, the
    dimension vector of the trace of ``P(lam)`` found and the one ``m *
    Delta(lam)`` would need.
    """

    module: str
    kind: str
    exists: bool
    multiplicities: tuple[int, ...] | None
    extension: tuple[int, ...]
    obstruction: dict[str, Any] | None = None

    def to_dict(self, vertices=None) -> dict[str, Any]:
        name = (lambda v: vertices[v]) if vertices else (lambda v: v)
        d: dict[str, Any] = {"module": self.module, "kind": self.kind, "exists": self.exists}
        if self.multiplicities is not None:
            d["multiplicities"] = list(self.multiplicities)
        if self.obstruction is not None:
            ob = dict(self.obstruction)
            if "vertex" in ob:
                ob["vertex"] = name(ob["vertex"])
            d["obstruction"] = ob
        return d


def standard_filtration(
    M: Module, order: PartialOrder, *, kind: str = "standard"
) -> FiltrationResult:
    """Decide whether ``M`` has a ``Delta``-filtration; multiplicities or the obstruction.

    The trace filtration is taken along the first linear extension of the
    order (highest first).
    """
    A = M.algebra
    _check_order(A, order)
    ext = order.first_extension()
    mult = [0] * A.n
    cur = M
    for step, lam in enumerate(ext):
        if cur.dims[lam] == 0:
            continue
        U = cur.trace_of_vertices([lam])
        m = cur.submodule(U).top()[lam]  # number of generators of the trace
        found = tuple(u.nrows for u in U)
        D = standard_module(A, lam, order)
        want = tuple(m * d for d in D.dims)
        if found != want:
            return FiltrationResult(
                M.name,
                kind,
                False,
                None,
                ext,
                {
                    "step": step + 1,
                    "vertex": lam,
                    "multiplicity": m,
                    "trace_dimension_vector": list(found),
                    "expected_dimension_vector": list(want),
                    "reason": (
                        f"the trace of P({A.vertices[lam]}) in what is left is not "
                        f"{m} cop{'y' if m == 1 else 'ies'} of {kind} module {A.vertices[lam]}"
                    ),
                },
            )
        mult[lam] = m
        cur = cur.quotient(U)
    if cur.dim:
        raise InternalInconsistency("trace filtration left a nonzero module")
    return FiltrationResult(M.name, kind, True, tuple(mult), ext)


def costandard_filtration(M: Module, order: PartialOrder) -> FiltrationResult:
    """Decide whether ``M`` has a ``nabla``-filtration (via ``D M`` over the opposite)."""
    D = M.dual()
    op = D.algebra
    res = standard_filtration(D, _opposite_order(op, order), kind="costandard")
    return FiltrationResult(
        M.name, "costandard", res.exists, res.multiplicities, res.extension, res.obstruction
    )


@dataclass(frozen=True)
class HeredityResult:
    """The heredity-chain verdict for an order.

    For a partial order every chain of upper sets is tested (each linear
    extension gives one chain of idempotent ideals); ``failure`` holds the
    first failing step with its witness.
    """

    holds: bool
    steps_checked: int
    failure: dict[str, Any] | None = None
    chain: tuple[int, ...] = field(default=())


def _multiplication_kernel_witness(
    A: BasicAlgebra, tc: TraceCache, S: int, u: int, s: int
) -> dict[str, Any]:
    """An explicit nonzero element of the kernel of B e_u (x) e_u B -> B (row s)."""
    F = A.field
    xs = tc.kept_words(S, s, u)  # basis of e_s B e_u (paths of P(s) surviving)
    Ps = projective(A, s)
    Ks = tc.kernel(S, s)
    widx = A.word_index(s, u)
    for t in range(A.n):
        ys = tc.kept_words(S, u, t)
        if not ys or not xs:
            continue
        pi, _, _ = quotient_map(Ks[t], Ps.dims[t])
        X = Mat.unit_rows(F, Ps.dims[u], [widx[x] for x in xs])
        rows = []
        labels = []
        for y in ys:
            img = (X @ Ps.path_matrix(y, u)) @ pi
            for i in range(len(xs)):
                rows.append(img.take_rows([i]))
                labels.append((xs[i], y))
        Mt = Mat.vstack(F, rows, pi.ncols)
        K = Mt.left_kernel()
        if K.nrows:
            coeffs = K.take_rows([0]).entries()
            terms = []
            for c, (x, y) in zip(coeffs, labels, strict=True):
                if c != 0:
                    terms.append(
                        {
                            "coefficient": str(c),
                            "left": A.path_text(x, s),
                            "right": A.path_text(y, u),
                        }
                    )
            text = " + ".join(
                f"{_paren(tm['coefficient'])}*({tm['left']} (x) {tm['right']})" for tm in terms
            )
            return {
                "target_vertex": A.vertices[t],
                "kernel_element": terms,
                "text": text.replace("+ -", "- "),
            }
    raise InternalInconsistency("dimension count found a kernel that linear algebra did not")


def heredity_chain(A: BasicAlgebra, order: PartialOrder) -> HeredityResult:
    """Whether the idempotent ideals of the upper sets form heredity chains.

    Computed independently of the module-theoretic axioms: only traces of
    vertex sets in projectives and dimension counts are used.  For each upper
    set ``S`` reached and each maximal remaining vertex ``u``, in ``B = A / A
    e_S A``: ``e_u B e_u`` is the field, ``B e_u (x) e_u B -> B e_u B`` is
    bijective, and ``P(u)`` modulo the trace of ``S`` is the order's standard
    module (else the chain's standard modules are not those of the order).
    """
    _check_order(A, order)
    return A.cached(("heredity_chain", order.less), lambda: _heredity_chain(A, order))


def _heredity_chain(A: BasicAlgebra, order: PartialOrder) -> HeredityResult:
    tc = trace_cache(A)
    n = A.n
    above = [mask(b for (a, b) in order.less if a == v) for v in range(n)]
    seen = {0}
    frontier = [0]
    steps = 0
    while frontier:
        nxt = []
        for S in frontier:
            for u in range(n):
                if S >> u & 1 or above[u] & ~S:
                    continue
                steps += 1
                fail = tc.step_failure(S, u)
                if fail is None:
                    # the chain's standard module must be the order's
                    have = tc.qdims(S, u)
                    want = tc.qdims(_not_below(order, u), u)
                    if have != want:
                        fail = {
                            "kind": "standard-module",
                            "vertex": u,
                            "chain_dimension_vector": list(have),
                            "order_dimension_vector": list(want),
                        }
                if fail is not None:
                    return HeredityResult(False, steps, _describe_failure(A, tc, S, fail), ())
                T = S | (1 << u)
                if T not in seen:
                    seen.add(T)
                    nxt.append(T)
        frontier = nxt
    return HeredityResult(True, steps, None, order.first_extension())


def _describe_failure(
    A: BasicAlgebra, tc: TraceCache, S: int, fail: dict[str, Any]
) -> dict[str, Any]:
    u = fail["vertex"]
    peeled = [A.vertices[v] for v in range(A.n) if S >> v & 1]
    out: dict[str, Any] = {
        "step": len(peeled) + 1,
        "already_removed": peeled,
        "vertex": A.vertices[u],
        "kind": fail["kind"],
    }
    if fail["kind"] == "corner":
        words = tc.kept_words(S, u, u)
        extra = [A.path_text(w, u) for w in words if w]
        out.update(
            {
                "corner_dimension": fail["dimension"],
                "reason": f"e B e has dimension {fail['dimension']}, not 1",
                "element_beyond_field": extra[0] if extra else None,
                "text": f"at step {len(peeled) + 1} (vertex {A.vertices[u]}): e B e has dimension "
                f"{fail['dimension']}, not 1; {extra[0] if extra else 'an element'} lies in e B e beyond the field",
            }
        )
    elif fail["kind"] == "multiplication":
        s = fail["row"]
        w = _multiplication_kernel_witness(A, tc, S, u, s)
        out.update(
            {
                "source_vertex": A.vertices[s],
                "tensor_dimension": fail["tensor_dimension"],
                "image_dimension": fail["image_dimension"],
                "reason": (
                    f"e_{A.vertices[s]} B e (x) e B has dimension {fail['tensor_dimension']} but its "
                    f"image e_{A.vertices[s]} B e B has dimension {fail['image_dimension']}"
                ),
                "kernel_element": w,
                "text": f"at step {len(peeled) + 1} (vertex {A.vertices[u]}): e_{A.vertices[s]} B e (x) e B "
                f"has dimension {fail['tensor_dimension']} but e_{A.vertices[s]} B e B only "
                f"{fail['image_dimension']}; kernel element {w['text']}",
            }
        )
    else:
        out.update(
            {
                "chain_dimension_vector": fail["chain_dimension_vector"],
                "order_dimension_vector": fail["order_dimension_vector"],
                "reason": "the chain's standard module differs from the order's (a vertex above is incomparable)",
                "text": f"at step {len(peeled) + 1} (vertex {A.vertices[u]}): P({A.vertices[u]}) modulo the trace of "
                f"the vertices removed has dimension vector {tuple(fail['chain_dimension_vector'])}, the order's "
                f"standard module {tuple(fail['order_dimension_vector'])}",
            }
        )
    return out


def _paren(text: str) -> str:
    """A coefficient with several terms (over an extension field) in parentheses."""
    return f"({text})" if " " in text else text
