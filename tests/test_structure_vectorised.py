"""The vectorised passes over a structure-constant table agree exactly with the plain ones.

Over GF(p) the matrices of left and right multiplication (whole algebra, and
restricted to Peirce blocks), the Gram matrices of linear forms and the full
reduction to the basic algebra are computed twice -- with the int64 array path
and with the plain Python path -- on random bound quiver algebras (as
structure-constant tables) and on family tables, and compared entry by entry.
The plain path is itself checked against matrix products recomputed from the
table (``x * b_j`` row by row); associativity of the algebras: I. Assem,
D. Simson, A. Skowronski, *Elements of the Representation Theory of
Associative Algebras* 1, LMS Student Texts 65 (2006) (from memory).
"""

from __future__ import annotations

import random

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

import hwcat.algebras.inputs.structure as structure
from hwcat.algebras.families.tables import schur_algebra_2, temperley_lieb
from hwcat.algebras.inputs.structure import from_table
from hwcat.algebras.inputs.structure_input import from_basic_algebra
from hwcat.algebras.reduction.reduction import reduce_algebra
from hwcat.exact import GF
from hwcat.strategies import bound_quiver_algebras

pytest.importorskip("numpy")


def _both(fn):
    """``fn()`` with the plain path and with the vectorised path (at every size)."""
    old, old_min = structure.USE_VECTOR, structure.GRAM_VECTOR_MIN
    structure.GRAM_VECTOR_MIN = 0
    try:
        structure.USE_VECTOR = False
        plain = fn()
        structure.USE_VECTOR = True
        fast = fn()
    finally:
        structure.USE_VECTOR, structure.GRAM_VECTOR_MIN = old, old_min
    return plain, fast


def _random_raw(A, rng, density):
    return [rng.randrange(A._p) if rng.random() < density else 0 for _ in range(A.dim)]


def _compare_actions(A, rng):
    assert A._vectorised() or not structure.USE_VECTOR
    peirce = A.peirce_idempotents()
    for density in (1.0, 0.5):
        y = _random_raw(A, rng, density)
        for left in (False, True):
            plain, fast = _both(lambda: A._action(y, None, left))  # noqa: B023
            assert plain.tolist() == fast.tolist()
        if peirce is not None:
            # restricted to the Peirce block A e_s (right) or e_s A (left): y in e_s A e_s
            s = peirce[rng.randrange(len(peirce))]
            core = {i for i in range(A.dim) if A.peirce_block(i) == (s, s)}
            ys = [c if i in core else 0 for i, c in enumerate(y)]
            for left in (False, True):
                side = 0 if left else 1
                index = [i for i in range(A.dim) if A.peirce_block(i)[side] == s]
                plain, fast = _both(lambda: A._action(ys, index, left))  # noqa: B023
                assert plain.tolist() == fast.tolist()
                if not left:
                    T = A._right_action_transposed(ys, index)
                    assert T.tolist() == plain.transpose().tolist()
        # the plain matrix is right: row i of R_y is b_i * y
        R = A._action(y, None, False)
        for i in rng.sample(range(A.dim), min(4, A.dim)):
            e = [0] * A.dim
            e[i] = 1
            assert [int(v) for v in R.raw_rows()[i]] == A._product_raw(e, y)
        phi = _random_raw(A, rng, 1.0)
        plain, fast = _both(lambda: A.gram(A.vec(phi)))  # noqa: B023
        assert plain.tolist() == fast.tolist()
        rows = rng.sample(range(A.dim), rng.randint(1, A.dim))
        col = _random_raw(A, rng, 0.7)
        R = A._action(y, None, False)
        assert A._right_action_transposed(y, None).tolist() == R.transpose().tolist()
        for u in (A._unit, _random_raw(A, rng, 0.3)):
            plain, fast = _both(lambda: A._unit_defect(u))  # noqa: B023
            assert plain == fast
        for js in (None, rows):
            plain, fast = _both(lambda: A._form_of_products(y, col, js))  # noqa: B023
            assert plain == fast
        plain, fast = _both(lambda: A.gram(A.vec(phi), rows=rows))  # noqa: B023
        assert plain.tolist() == fast.tolist()


def _row_terms(A, vector):
    old = structure.USE_VECTOR
    try:
        structure.USE_VECTOR = vector
        A._cache.pop("rows", None)
        return [tuple(list(x) for x in t) for t in A._row_terms()]
    finally:
        structure.USE_VECTOR = old
        A._cache.pop("rows", None)


def _compare_row_terms(A):
    assert _row_terms(A, False) == _row_terms(A, True)


@settings(max_examples=25, deadline=None)
@given(
    bound_quiver_algebras(max_vertices=4, field=st.sampled_from([GF(2), GF(3), GF(101)])),
    st.integers(0, 2**16),
)
def test_vectorised_actions_agree_on_random_quiver_algebras(B, seed):
    A = from_basic_algebra(B)
    _compare_actions(A, random.Random(seed))
    _compare_row_terms(A)


@pytest.mark.parametrize(
    "table",
    [
        temperley_lieb(5, 0, "GF(3)"),
        temperley_lieb(5, 1, "GF(5)"),
        schur_algebra_2(6, "GF(2)"),
    ],
    ids=["TL5(0)", "TL5(1)", "S(2,6)"],
)
def test_vectorised_actions_agree_on_family_tables(table):
    A = from_table(table)
    _compare_actions(A, random.Random(7))
    _compare_row_terms(A)


@settings(max_examples=10, deadline=None)
@given(bound_quiver_algebras(max_vertices=3, field=st.sampled_from([GF(2), GF(5)])))
def test_reduction_unchanged_by_the_vectorised_path(B):
    """Same simples, projectives, Cartan matrix and idempotents with either path."""
    A = from_basic_algebra(B)
    plain, fast = _both(lambda: reduce_algebra(A))
    assert plain.simple_dimensions == fast.simple_dimensions
    assert plain.projective_dimensions == fast.projective_dimensions
    assert plain.basic.cartan() == fast.basic.cartan()
    assert plain.idempotents == fast.idempotents


def test_reduction_of_a_family_unchanged_by_the_vectorised_path():
    A = from_table(temperley_lieb(6, 0, "GF(3)"))
    plain, fast = _both(lambda: reduce_algebra(A))
    assert plain.basic.cartan() == fast.basic.cartan()
    assert plain.idempotents == fast.idempotents
    assert plain.simple_dimensions == fast.simple_dimensions == (1, 4, 5)  # derived


@pytest.mark.parametrize(
    ("n", "delta", "field"), [(5, 0, "GF(3)"), (6, 1, "GF(5)"), (5, 2, "GF(7)")]
)
def test_temperley_lieb_by_columns_matches_the_dictionary_table(n, delta, field, monkeypatch):
    """The column-built table has the same products as the dictionary-built one, and the
    same reduction (simples, Cartan matrix, idempotents)."""
    import hwcat.algebras.families.tables as tables

    plain_table = temperley_lieb(n, delta, field)
    monkeypatch.setattr(tables, "COLUMN_TABLE_MIN", 0)
    col_table = temperley_lieb(n, delta, field)
    assert col_table.columns is not None and plain_table.columns is None
    assert dict(col_table.products) == plain_table.products
    assert tables.check_associative(col_table)
    A, B = from_table(plain_table), from_table(col_table)
    assert A.nnz == B.nnz
    for j in range(A.dim):
        assert sorted(zip(*A._cols[j], strict=True)) == sorted(zip(*B._cols[j], strict=True))
    ra, rb = reduce_algebra(A), reduce_algebra(B)
    assert ra.basic.cartan() == rb.basic.cartan()
    assert ra.simple_dimensions == rb.simple_dimensions
    assert ra.idempotents == rb.idempotents


@settings(max_examples=20, deadline=None)
@given(st.integers(1, 40), st.integers(0, 2**16), st.sampled_from([GF(2), GF(7)]))
def test_chain_step_is_the_row_product(n, seed, F):
    """``chain_step([M, N])(v) == v @ M @ N`` (matrix products checked with sympy)."""
    import sympy

    from hwcat.algebras.reduction.kernels import chain_step
    from hwcat.exact import Mat

    rng = random.Random(seed)
    M, N = (Mat.from_flat(F, n, n, [rng.randrange(F.p) for _ in range(n * n)]) for _ in range(2))
    v = Mat.from_flat(F, 1, n, [rng.randrange(F.p) for _ in range(n)])
    got = [int(x) for x in chain_step([M, N])(v).entries()]
    S = [sympy.Matrix(X.nrows, X.ncols, [int(x) for x in X.entries()]) for X in (v, M, N)]
    want = [int(x) % F.p for x in S[0] * S[1] * S[2]]
    assert got == want


def test_reduction_unchanged_when_dense_matrices_are_rebuilt(monkeypatch):
    """Not keeping the dense matrices of large algebras (rebuilt from the table when
    needed again) gives the same reduction."""
    import hwcat.algebras.reduction.reduction as red

    A = from_table(temperley_lieb(6, 1, "GF(3)"))
    kept = reduce_algebra(A)
    monkeypatch.setattr(red, "KEEP_MATRICES_LIMIT", 0)
    rebuilt = reduce_algebra(A)
    assert kept.basic.cartan() == rebuilt.basic.cartan()
    assert kept.idempotents == rebuilt.idempotents
    assert kept.basic.dim == rebuilt.basic.dim


def test_rank_in_simple_agrees_with_the_plain_loop():
    """``dim L f`` for random ``f`` by the array path and by the plain loop."""
    import hwcat.algebras.reduction.reduction as red

    A = from_table(temperley_lieb(6, 0, "GF(3)"))
    r = reduce_algebra(A)
    rng = random.Random(3)
    for c in r._classes:
        for density in (1.0, 0.1):
            f = _random_raw(A, rng, density)
            plain, fast = _both(lambda: red._rank_in_simple(A, c, f))  # noqa: B023
            assert plain == fast
