"""The fast routes of ``describe`` against the slow ones, on random algebras.

Every route added for large algebras is compared with an independent
computation of the same object:

* the radical series on sparse rows against the dense series (the reduced
  echelon basis of a subspace is unique, so the bases must agree exactly;
  common practice);
* the Loewy diagram on sparse rows against the dense one (the same documented
  choices, so the same diagram; derived);
* the opposite algebra with reversed paths as its basis against the products of
  the algebra itself: ``x^op * y^op = (y x)^op`` (definition of the opposite
  algebra, common practice), and its Cartan matrix is the transpose;
* the centre computed block by block in the hub against the centre of the same
  algebra written as structure constants (dense commutators, the former route).
"""

from __future__ import annotations

from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from hwcat.algebras.inputs.structure_input import from_basic_algebra
from hwcat.exact import Mat
from hwcat.exact.sparse import sparse_echelon, sparse_rows, to_mat
from hwcat.modules import injective, projective
from hwcat.modules.loewy import loewy_diagram
from hwcat.strategies import bound_quiver_algebras, modules
from hwcat.theory.centre import centre, hub_centre

FAST = settings(max_examples=40, deadline=None, suppress_health_check=[HealthCheck.too_slow])


def _naive_radical_series(M) -> list[dict[int, Mat]]:
    """``rad^(k+1) M = sum_a rad^k M * a``, the definition, one vertex at a time."""
    F = M.field
    series = [{v: Mat.identity(F, d) for v, d in enumerate(M.dims) if d}]
    while series[-1]:
        imgs: dict[int, list[Mat]] = {}
        for i, a in enumerate(M.algebra.arrows):
            B = series[-1].get(a.source)
            if B is not None and M.dims[a.target]:
                imgs.setdefault(a.target, []).append(B @ M.maps[i])
        nxt = {}
        for t, ms in imgs.items():
            E = Mat.vstack(F, ms, M.dims[t]).rref()[0]
            if E.nrows:
                nxt[t] = E
        series.append(nxt)
    return series


def _series_equal(M) -> None:
    naive = _naive_radical_series(M)
    for method in ("dense", "sparse"):
        got = M.radical_series_on_support(method=method)
        assert len(got) == len(naive)
        for a, b in zip(naive, got, strict=True):
            assert a.keys() == b.keys()
            for v in a:
                assert a[v] == b[v]


@FAST
@given(bound_quiver_algebras(max_vertices=4, max_arrows=5).flatmap(lambda A: modules(A)))
def test_sparse_radical_series_equals_dense(M):
    _series_equal(M)
    _series_equal(M.dual())


@FAST
@given(bound_quiver_algebras(max_vertices=4, max_arrows=5).flatmap(lambda A: modules(A)))
def test_sparse_loewy_diagram_equals_dense(M):
    dense = loewy_diagram(M, method="dense")
    assert loewy_diagram(M, method="sparse") == dense
    if M.acts_by_single_entries():
        assert loewy_diagram(M, method="sets") == dense
    assert loewy_diagram(M) == dense


@FAST
@given(bound_quiver_algebras(max_vertices=4, max_arrows=5), st.data())
def test_sparse_echelon_equals_dense_echelon(A, data):
    P = projective(A, data.draw(st.integers(0, A.n - 1)))
    for i, m in P.maps.items():
        rows, piv = sparse_echelon(A.field, sparse_rows(m))
        R, dpiv = m.rref()
        assert piv == dpiv
        assert to_mat(A.field, rows, m.ncols) == R
        del i


@FAST
@given(bound_quiver_algebras(max_vertices=4, max_arrows=5))
def test_opposite_multiplies_in_reverse(A):
    op = A.opposite()
    assert op.cartan() == tuple(zip(*A.cartan(), strict=True))
    assert op.opposite() is A
    for u in range(A.n):
        for v in range(A.n):
            assert sorted(op.words[u][v]) == sorted(w[::-1] for w in A.words[v][u]) or (
                not A.is_suffix_closed()
            )
    if not A.is_suffix_closed():
        return
    # x^op y^op = (y x)^op with x in e_v A e_u, y in e_w A e_v: same coordinates
    for u in range(A.n):
        for v in range(A.n):
            for w in range(A.n):
                duv, dwv = A.block_dim(v, u), A.block_dim(w, v)
                if not duv or not dwv or not A.block_dim(w, u):
                    continue
                left = op.multiplication_block(u, v, w).raw_rows()  # x^op * y^op
                right = A.multiplication_block(w, v, u).raw_rows()  # y * x
                # compare as combinations of paths: op's basis paths are the reversed ones
                xs_op, ys_op, zs_op = op.words[u][v], op.words[v][w], op.words[u][w]
                xs, ys, zs = A.words[v][u], A.words[w][v], A.words[w][u]
                for i, x in enumerate(xs_op):
                    for j, y in enumerate(ys_op):
                        got = {zs_op[k][::-1]: c for k, c in enumerate(left[j * duv + i]) if c}
                        i2, j2 = xs.index(x[::-1]), ys.index(y[::-1])
                        want = {zs[k]: c for k, c in enumerate(right[i2 * dwv + j2]) if c}
                        assert got == want


@FAST
@given(bound_quiver_algebras(max_vertices=4, max_arrows=5))
def test_injectives_layers_by_both_routes(A):
    for s in range(A.n):
        I = injective(A, s)
        _series_equal(I)
        assert I.socle_layers() == I.dual().radical_layers()


@FAST
@given(bound_quiver_algebras(max_vertices=4, max_arrows=5))
def test_hub_centre_equals_structure_constant_centre(A):
    S = from_basic_algebra(A)
    gens = [j for j, name in enumerate(S.basis) if "*" not in name]
    old = centre(S, generators=gens)
    new = hub_centre(A)
    assert new.basis == old.basis
    assert new.texts == old.texts


def test_to_mat_and_sparse_rows_round_trip():
    from hwcat.exact import QQ

    M = Mat.from_rows(QQ, [[0, 1, 0], [2, 0, 0], [0, 0, 0]])
    assert to_mat(QQ, sparse_rows(M), 3) == M


@FAST
@given(bound_quiver_algebras(max_vertices=4, max_arrows=5))
def test_shared_sparse_rows_are_the_maps(A):
    # projectives and injectives take the hub's sparse rows (and the opposite's,
    # transposed) instead of reading their matrices again: they must be the matrices
    import hwcat.modules.module as module

    saved = module.SPARSE_MIN_DIM
    module.SPARSE_MIN_DIM = 0
    try:
        A = A.with_vertex_names(A.vertices)  # a copy with nothing cached
        for s in range(A.n):
            for M in (projective(A, s), injective(A, s)):
                for X in (M, M.dual()):
                    rows = X.sparse_maps()
                    assert rows.keys() == set(X.maps.support)
                    for i, r in rows.items():
                        assert to_mat(A.field, r, X.maps[i].ncols) == X.maps[i]
    finally:
        module.SPARSE_MIN_DIM = saved
