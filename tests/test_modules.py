"""Laws of modules over random bound quiver algebras (:mod:`hwcat.modules`).

Algebras come from :func:`hwcat.strategies.bound_quiver_specs` (QQ and prime
fields, including GF(2) and a large prime), modules from
:func:`hwcat.strategies.modules`.  Each law is a textbook fact about modules
over a finite-dimensional algebra, named beside its check; most are basic
facts "from memory" (Assem, Simson, Skowronski, *Elements of the
Representation Theory of Associative Algebras*, vol. 1, 2006, chapters on
representations of bound quivers and on the duality ``D = Hom_k(-, k)``).
Where a law is checked against a second computation, that computation is
independent of the one under test: the naive intertwiner system for Hom,
explicit matrix products for the intertwiner condition, and the graded
builder on the spec with vertices deleted for ``A / A e A``.
"""

from __future__ import annotations

from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from hwcat.algebras.hub.basic import BasicAlgebra
from hwcat.algebras.hub.quiver import Path, parse_relation
from hwcat.exact import Mat
from hwcat.modules import (
    Module,
    direct_sum,
    hom,
    hom_dimension,
    hom_dimension_naive,
    injective,
    projective,
    regular_module,
    simple,
)
from hwcat.strategies import algebra_from_spec, bound_quiver_specs, modules

SETTINGS = settings(max_examples=30, deadline=None, suppress_health_check=[HealthCheck.too_slow])
SPECS = bound_quiver_specs(max_vertices=4, max_arrows=5, max_relations=3)
ALGEBRAS = SPECS.map(algebra_from_spec)
# for the naive Hom system, whose size is quadratic in the modules
SMALL_ALGEBRAS = ALGEBRAS.filter(lambda A: A.dim <= 24)


def unit(A: BasicAlgebra, i: int) -> tuple[int, ...]:
    return tuple(int(v == i) for v in range(A.n))


def flatten(f: tuple[Mat, ...]) -> list:
    return [x for m in f for x in m.entries()]


def stack(A: BasicAlgebra, rows: list[list]) -> Mat:
    """The matrix with the given rows of field elements (no conversion)."""
    width = len(rows[0]) if rows else 0
    return Mat.from_flat(A.field, len(rows), width, [x for r in rows for x in r])


# -- dimensions -------------------------------------------------------------------------


@SETTINGS
@given(ALGEBRAS)
def test_dimension_of_the_algebra(A: BasicAlgebra) -> None:
    # common practice: A = sum of the e_i A (as a right module) = sum of D(A e_i), and
    # e_j A e_i = Hom_A(P(j), P(i))-sized blocks: C[i][j] = [P(j) : L(i)] = dim e_j A e_i
    C = A.cartan()
    Ps = [projective(A, i) for i in range(A.n)]
    Is = [injective(A, i) for i in range(A.n)]
    assert A.dim == sum(map(sum, C)) == sum(P.dim for P in Ps) == sum(I.dim for I in Is)
    assert regular_module(A).dim == A.dim
    for i in range(A.n):
        assert Ps[i].dims == tuple(C[j][i] for j in range(A.n))  # column i
        assert Is[i].dims == tuple(C[i][j] for j in range(A.n))  # row i


@SETTINGS
@given(ALGEBRAS)
def test_projective_top_and_injective_socle(A: BasicAlgebra) -> None:
    # ASS vol. 1 (memory): top P(i) = L(i) = soc I(i); soc P_A(i) = top of
    # D(P_A(i)) = I_{A^op}(i), and the socle series of I_A(i) is dual to the radical
    # series of P_{A^op}(i) (D turns radical layers into socle layers)
    op = A.opposite()
    for i in range(A.n):
        P, I = projective(A, i), injective(A, i)
        assert P.top() == unit(A, i) == I.socle()
        assert P.socle() == injective(op, i).top()
        assert P.dual().dims == injective(op, i).dims
        assert I.socle_layers() == projective(op, i).radical_layers()
        assert P.radical_layers() == injective(op, i).socle_layers()


@SETTINGS
@given(ALGEBRAS.flatmap(lambda A: st.tuples(st.just(A), modules(A, max_summands=3))))
def test_radical_and_socle_layers(data: tuple[BasicAlgebra, Module]) -> None:
    # common practice: the layers of a finite series add up to the dimension vector;
    # Loewy length = radical length = socle length (ASS vol. 1, memory)
    A, M = data
    for layers in (M.radical_layers(), M.socle_layers()):
        total = tuple(sum(layer[v] for layer in layers) for v in range(A.n))
        assert total == M.dims
        assert all(any(layer) for layer in layers)
    assert M.loewy_length() == len(M.socle_layers())
    assert M.top() == (M.radical_layers()[0] if M.dim else (0,) * A.n)
    assert M.socle() == (M.socle_layers()[0] if M.dim else (0,) * A.n)


# -- duality -------------------------------------------------------------------------------


@SETTINGS
@given(ALGEBRAS.flatmap(lambda A: st.tuples(st.just(A), modules(A, max_summands=3))))
def test_double_dual(data: tuple[BasicAlgebra, Module]) -> None:
    # common practice: D(D(M)) = M for finite-dimensional M, and D swaps top and
    # socle (the radical series of D M is dual to the socle series of M)
    A, M = data
    DM = M.dual()
    assert DM.algebra is A.opposite()
    DDM = DM.dual()
    assert DDM.algebra is A
    assert DDM.dims == M.dims and DDM.dimension_vector() == M.dimension_vector()
    assert DDM.key() == M.key()
    assert DM.top() == M.socle() and DM.socle() == M.top()
    assert DM.radical_layers() == M.socle_layers()


# -- homomorphisms ---------------------------------------------------------------------------


@SETTINGS
@given(ALGEBRAS.flatmap(lambda A: st.tuples(st.just(A), modules(A, max_summands=3))))
def test_hom_from_projectives_and_into_injectives(data: tuple[BasicAlgebra, Module]) -> None:
    # ASS vol. 1 (memory): Hom_A(P(i), M) = Hom_A(e_i A, M) = M e_i and
    # Hom_A(M, I(i)) = D(M e_i), both of dimension dim M_i
    A, M = data
    for i in range(A.n):
        assert hom_dimension(projective(A, i), M) == M.dims[i]
        assert hom_dimension(M, injective(A, i)) == M.dims[i]
        assert hom_dimension(simple(A, i), M) == M.socle()[i]
        assert hom_dimension(M, simple(A, i)) == M.top()[i]


@SETTINGS
@given(ALGEBRAS)
def test_hom_between_projectives(A: BasicAlgebra) -> None:
    # common practice: Hom_A(e_i A, e_j A) = e_j A e_i, of dimension C[i][j]
    C = A.cartan()
    for i in range(A.n):
        for j in range(A.n):
            assert hom_dimension(projective(A, i), projective(A, j)) == C[i][j]


def modules_pair(A: BasicAlgebra) -> st.SearchStrategy:
    return st.tuples(st.just(A), modules(A), modules(A))


@SETTINGS
@given(SMALL_ALGEBRAS.flatmap(modules_pair))
def test_hom_agrees_with_the_naive_system(data: tuple[BasicAlgebra, Module, Module]) -> None:
    # the independent computation: all intertwiners X_v with M_a X_t = X_s N_a
    A, M, N = data
    basis = hom(M, N)
    assert hom_dimension(M, N) == hom_dimension_naive(M, N) == len(basis)
    # additivity in each variable (common practice)
    S = direct_sum(M, N)
    assert hom_dimension(S, N) == hom_dimension(M, N) + hom_dimension(N, N)
    assert hom_dimension(M, S) == hom_dimension(M, M) + hom_dimension(M, N)


@SETTINGS
@given(ALGEBRAS.flatmap(modules_pair))
def test_hom_basis_consists_of_intertwiners(data: tuple[BasicAlgebra, Module, Module]) -> None:
    # definition of a module map: M_a f_t = f_s N_a for every arrow a: s -> t
    A, M, N = data
    basis = hom(M, N)
    for f in basis:
        assert len(f) == A.n
        for v in range(A.n):
            assert f[v].shape == (M.dims[v], N.dims[v])
        for i, a in enumerate(A.arrows):
            assert M.maps[i] @ f[a.target] == f[a.source] @ N.maps[i]
    if basis:  # linearly independent
        flat = stack(A, [flatten(f) for f in basis])
        assert flat.rank() == len(basis)


@SETTINGS
@given(ALGEBRAS.flatmap(lambda A: st.tuples(st.just(A), modules(A, max_summands=2))))
def test_endomorphisms_contain_the_identity(data: tuple[BasicAlgebra, Module]) -> None:
    # common practice: the identity is an endomorphism, so it lies in the span of End(M)
    A, M = data
    basis = hom(M, M)
    ident = flatten(tuple(Mat.identity(A.field, d) for d in M.dims))
    if M.dim == 0:
        assert basis == [] or all(not any(flatten(f)) for f in basis)
        return
    rows = [flatten(f) for f in basis]
    assert stack(A, rows + [ident]).rank() == stack(A, rows).rank()


# -- submodules and quotients --------------------------------------------------------------------


@SETTINGS
@given(st.data())
def test_submodule_and_quotient(data: st.DataObject) -> None:
    # common practice: dim U + dim M/U = dim M; U is closed under the arrows and the
    # projection M -> M/U is a module map
    A = data.draw(ALGEBRAS)
    M = data.draw(modules(A))
    v = data.draw(st.integers(0, A.n - 1))
    gens = {}
    if M.dims[v]:
        rows = data.draw(
            st.lists(
                st.lists(st.integers(-2, 2), min_size=M.dims[v], max_size=M.dims[v]), max_size=2
            )
        )
        if rows:
            gens[v] = Mat.from_rows(A.field, rows, M.dims[v])
    U = M.generated(gens)
    for i, a in enumerate(A.arrows):  # closed: U_s M_a lies in U_t
        img = U[a.source] @ M.maps[i]
        assert Mat.vstack(A.field, [U[a.target], img], M.dims[a.target]).rank() == U[a.target].nrows
    sub = M.submodule(U)
    Q, pis = M.quotient_with_projection(U)
    assert tuple(s + q for s, q in zip(sub.dims, Q.dims, strict=True)) == M.dims
    for i, a in enumerate(A.arrows):
        assert M.maps[i] @ pis[a.target] == pis[a.source] @ Q.maps[i]
    assert hom_dimension(sub, M) >= (1 if sub.dim else 0)


# -- A / A e A and the opposite algebra -------------------------------------------------------------


def spec_without(spec: dict, removed: set[str]) -> dict:
    """The spec of kQ/(I + A e A): delete the vertices, their arrows and the terms through them."""
    from hwcat.algebras.hub.quiver import Quiver
    from hwcat.exact import parse_field

    F = parse_field(spec["field"])
    tab = spec["quiver"]
    Q = Quiver.from_text(tab["vertices"], tab.get("arrows", []))
    gone = {
        i for i, a in enumerate(Q.arrows) if {Q.vertices[a.source], Q.vertices[a.target]} & removed
    }
    relations = []
    for text in tab.get("relations", []):
        terms = [(p, c) for p, c in parse_relation(text, Q, F).items() if not set(p) & gone]
        if terms:
            relations.append(
                " + ".join(
                    f"{F.to_str(c)}*{'*'.join(Q.arrows[i].name for i in p)}" for p, c in terms
                )
            )
    quiver = {
        "vertices": [v for v in tab["vertices"] if v not in removed],
        "arrows": [
            f"{a.name}: {Q.vertices[a.source]} -> {Q.vertices[a.target]}"
            for i, a in enumerate(Q.arrows)
            if i not in gone
        ],
    }
    if relations:
        quiver["relations"] = relations
    if "vanish_from_length" in tab:
        quiver["vanish_from_length"] = tab["vanish_from_length"]
    return {"field": spec["field"], "quiver": quiver}


@SETTINGS
@given(st.data())
def test_quotient_by_vertices(data: st.DataObject) -> None:
    # ASS vol. 1 (memory): kQ/I modulo the ideal generated by e = sum of e_s (s in S) is
    # the bound quiver algebra on Q without S; and e_t (A/AeA) = e_t A / e_t A e A, the
    # quotient of P(t) by its trace of the vertices S
    spec = data.draw(SPECS)
    A = algebra_from_spec(spec)
    S = data.draw(st.sets(st.integers(0, A.n - 1), max_size=A.n - 1))
    keep = [v for v in range(A.n) if v not in S]
    B = A.quotient_by_vertices(S)
    assert B.vertices == tuple(A.vertices[v] for v in keep)
    # (a) quotients of the projectives by their traces
    traces = []
    for t in keep:
        P = projective(A, t)
        top = P.quotient(P.trace_of_vertices(S))
        traces.append([top.dims[v] for v in keep])
    assert B.cartan() == tuple(
        tuple(traces[j][i] for j in range(len(keep))) for i in range(len(keep))
    )
    # (b) the graded builder on the spec with the vertices deleted
    R = algebra_from_spec(spec_without(spec, {A.vertices[v] for v in S}))
    assert B.cartan() == R.cartan()
    assert B.dim == R.dim


def reversed_relation(rel: dict[Path, object]) -> dict[Path, object]:
    return {tuple(reversed(p)): c for p, c in rel.items()}


def holds(A: BasicAlgebra, rel: dict) -> bool:
    p0 = next(iter(rel))
    s, t = A.arrows[p0[0]].source, A.arrows[p0[-1]].target
    total = Mat.zeros(A.field, 1, A.block_dim(s, t))
    for path, c in rel.items():
        v = Mat.unit_rows(A.field, A.block_dim(s, s), [0])
        for i in path:
            v = v @ A.action[s][i]
        total = total + v.scale(c)
    return total.is_zero()


@SETTINGS
@given(SPECS)
def test_opposite_algebra(spec: dict) -> None:
    # common practice: (A^op)^op = A; the Cartan matrix of A^op is the transpose; the
    # opposite of kQ/I is kQ^op/I^op with every path reversed.  An algebra generated by
    # the arrows in which the relations hold and whose blocks have the right dimensions
    # is that bound quiver algebra.
    A = algebra_from_spec(spec)
    op = A.opposite()
    assert op.opposite() is A
    C = A.cartan()
    assert op.cartan() == tuple(zip(*C, strict=True))
    assert op.dim == A.dim
    for a, b in zip(A.arrows, op.arrows, strict=True):
        assert (a.name, a.source, a.target) == (b.name, b.target, b.source)
    rels = [parse_relation(r, A.quiver, A.field) for r in spec["quiver"].get("relations", [])]
    N = spec["quiver"].get("vanish_from_length")
    for r in rels:
        assert holds(op, reversed_relation(r))
    # a fresh copy of A^op (no cached link back) gives A again
    fresh = BasicAlgebra(op.field, op.quiver, op.words, op.action)
    back = fresh.opposite()
    assert back is not A
    assert back.cartan() == C and back.vertices == A.vertices
    for r in rels:
        assert holds(back, r)
    if N is not None:
        assert all(len(w) < N for row in back.words for block in row for w in block)
