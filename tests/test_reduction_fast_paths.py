"""The faster paths of the reduction at scale agree exactly with the former ones.

* thin random products for ranks and independent rows (``reduction/sketch.py``)
  against the plain elimination, on random matrices of low rank and inside whole
  reductions of family algebras and random structure-constant algebras (simples,
  projectives, Cartan matrices, idempotents, basic algebras unchanged);
* the column-built tables of the symmetric groups and the Schur algebras against
  the dictionary-built ones (same products), and the dimensions of the families
  against their formulas;
* section rows read from the table, the trace form by arrays, products of many rows
  with a basis element, rows read alone from flint's entries, against the plain loops;
* the reduction announces its progress only when progress is enabled.

Sources: dim TL_n = Catalan(n) (from memory); dim S(2, r) = binomial(r + 3, 3)
(J. A. Green, *Polynomial Representations of GL_n*, LNM 830, 1980); the number of
simple modules of the group algebra of S_n over GF(p) is the number of p-regular
partitions of n (from memory); TL_n(delta) is cellular with cell modules indexed by
``n - 2k`` through strands and is quasi-hereditary iff it has as many simples as
cell modules, which holds for delta != 0 (S. Konig, C. C. Xi, *When is a cellular
algebra quasi-hereditary?*, Math. Ann. 315 (1999), from memory; the count for
delta != 0 from memory).
"""

from __future__ import annotations

import io
import math
import random

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

import hwcat.algebras.families.tables as tables
import hwcat.algebras.inputs.structure as structure
from hwcat import progress
from hwcat.algebras.inputs.structure import from_table
from hwcat.algebras.inputs.structure_input import from_basic_algebra
from hwcat.algebras.reduction import reduction, sketch
from hwcat.algebras.reduction.reduction import reduce_algebra
from hwcat.exact import GF, Mat, select_independent_rows
from hwcat.exact.bulk_rows import take_rows
from hwcat.strategies import bound_quiver_algebras

pytest.importorskip("numpy")


def _low_rank(F, n, m, r, rng):
    """A random ``n x m`` matrix of rank at most ``r`` (a product of two thin ones)."""
    p = F.p
    X = Mat.from_flat(F, n, r, [rng.randrange(p) for _ in range(n * r)])
    Y = Mat.from_flat(F, r, m, [rng.randrange(p) for _ in range(r * m)])
    return X @ Y


@settings(max_examples=30, deadline=None)
@given(
    st.sampled_from([GF(2), GF(3), GF(101)]),
    st.integers(200, 280),
    st.integers(200, 280),
    st.integers(0, 45),
    st.integers(0, 2**16),
)
def test_sketched_rank_and_rows_equal_the_elimination(F, n, m, r, seed):
    rng = random.Random(seed)
    M = _low_rank(F, n, m, r, rng)
    # a few copies of earlier rows, so that the greedy choice matters
    extra = [rng.randrange(n) for _ in range(5)]
    M = Mat.vstack(F, [M, take_rows(M, extra)], m)
    old = (sketch.MIN_SIZE, sketch.START_WIDTH)
    try:
        sketch.MIN_SIZE = 0
        rank, rows = sketch.sketched_rank(M, seed), sketch.sketched_independent_rows(M, seed)
    finally:
        sketch.MIN_SIZE, sketch.START_WIDTH = old
    assert rank == M.rank()
    assert rows == select_independent_rows(M)


def test_sketched_rank_checked_with_sympy():
    """The rank of a 300 x 300 matrix of rank 7 over GF(2) (sympy's rank over GF(2))."""
    sympy = pytest.importorskip("sympy")
    from sympy.polys.matrices import DomainMatrix

    F = GF(2)
    M = _low_rank(F, 300, 300, 7, random.Random(5))
    D = DomainMatrix(
        [[sympy.GF(2)(int(x)) for x in row] for row in M.raw_rows()], (300, 300), sympy.GF(2)
    )
    assert sketch.sketched_rank(M) == D.rank() == M.rank()


def _without_sketch(fn, monkeypatch):
    monkeypatch.setattr(sketch, "USE_SKETCH", False)
    try:
        return fn()
    finally:
        monkeypatch.setattr(sketch, "USE_SKETCH", True)


def _same_reduction(a, b):
    assert a.simple_dimensions == b.simple_dimensions
    assert a.projective_dimensions == b.projective_dimensions
    assert a.basic.cartan() == b.basic.cartan()
    assert a.idempotents == b.idempotents
    assert a.basic.dim == b.basic.dim
    assert a.basic.quiver.arrows == b.basic.quiver.arrows


def _p_regular_partitions(n, p):
    def parts(n, top):
        if n == 0:
            yield ()
            return
        for k in range(min(n, top), 0, -1):
            for rest in parts(n - k, k):
                yield (k, *rest)

    return sum(1 for lam in parts(n, n) if all(lam.count(k) < p for k in set(lam)))


@pytest.mark.parametrize(
    ("make", "simples"),
    [
        (lambda: tables.temperley_lieb(7, 0, "GF(3)"), None),
        (
            lambda: tables.temperley_lieb(7, 1, "GF(2)"),
            4,
        ),  # cell modules 7, 5, 3, 1 through strands
        (lambda: tables.symmetric_group_algebra(5, "GF(2)"), _p_regular_partitions(5, 2)),
        (lambda: tables.symmetric_group_algebra(5, "GF(3)"), _p_regular_partitions(5, 3)),
        (
            lambda: tables.schur_algebra_2(10, "GF(3)"),
            6,
        ),  # dominant weights of S(2, 10): 11 // 2 + 1
    ],
    ids=["TL7(0)", "TL7(1)", "S5-GF2", "S5-GF3", "S(2,10)"],
)
def test_reduction_of_families_unchanged_by_the_sketches(make, simples, monkeypatch):
    monkeypatch.setattr(sketch, "MIN_SIZE", 64)
    monkeypatch.setattr(sketch, "START_WIDTH", 8)
    A = from_table(make())
    drawn = []
    real = sketch.random_matrix
    monkeypatch.setattr(sketch, "random_matrix", lambda *a: drawn.append(a) or real(*a))
    fast = reduce_algebra(A)
    # the thin products were used (Schur algebras work in small Peirce blocks instead)
    assert drawn or A.peirce_idempotents() is not None
    plain = _without_sketch(lambda: reduce_algebra(A), monkeypatch)
    _same_reduction(fast, plain)
    if simples is not None:
        assert len(fast.simple_dimensions) == simples
    assert (
        sum(n * p for n, p in zip(fast.simple_dimensions, fast.projective_dimensions, strict=True))
        == A.dim
    )


@settings(max_examples=15, deadline=None)
@given(bound_quiver_algebras(max_vertices=4, field=st.sampled_from([GF(2), GF(3), GF(7)])))
def test_reduction_of_random_algebras_unchanged_by_the_sketches(B):
    """Sketches at every size (tiny thresholds) on random structure-constant algebras."""
    A = from_basic_algebra(B)
    old = (sketch.MIN_SIZE, sketch.START_WIDTH)
    try:
        sketch.MIN_SIZE, sketch.START_WIDTH = 0, 1
        fast = reduce_algebra(A)
        sketch.USE_SKETCH = False
        plain = reduce_algebra(A)
    finally:
        sketch.USE_SKETCH = True
        sketch.MIN_SIZE, sketch.START_WIDTH = old
    _same_reduction(fast, plain)
    # B is basic: it is its own basic algebra (one-dimensional simples, the same Cartan
    # matrix up to the order of the vertices; common practice)
    assert fast.simple_dimensions == (1,) * B.n
    C, D = fast.basic.cartan(), B.cartan()
    assert sorted(C[i][i] for i in range(B.n)) == sorted(D[i][i] for i in range(B.n))
    assert sorted(x for r in C for x in r) == sorted(x for r in D for x in r)


@pytest.mark.parametrize(("n", "field"), [(4, "GF(2)"), (5, "GF(3)"), (5, "GF(7)")])
def test_symmetric_group_by_columns_matches_the_dictionary_table(n, field, monkeypatch):
    plain = tables.symmetric_group_algebra(n, field)
    monkeypatch.setattr(tables, "COLUMN_TABLE_MIN", 0)
    cols = tables.symmetric_group_algebra(n, field)
    assert cols.columns is not None and plain.columns is None
    assert dict(cols.products) == plain.products
    assert cols.dim == math.factorial(n)  # |S_n| = n!


@pytest.mark.parametrize(("r", "field"), [(3, "GF(2)"), (6, "GF(3)"), (5, "GF(5)")])
def test_schur_by_columns_matches_the_dictionary_table(r, field, monkeypatch):
    plain = tables.schur_algebra_2(r, field)
    monkeypatch.setattr(tables, "COLUMN_TABLE_MIN", 0)
    cols = tables.schur_algebra_2(r, field)
    assert cols.columns is not None and plain.columns is None
    assert dict(cols.products) == plain.products
    assert cols.dim == math.comb(r + 3, 3)  # Green 1980
    assert tables.check_associative(cols) and tables.check_unit(cols)


@pytest.mark.parametrize("n", [7, 8])
def test_temperley_lieb_by_columns_has_catalan_dimension(n):
    T = tables.temperley_lieb(n, 1, "GF(5)")
    assert T.columns is not None
    assert T.dim == math.comb(2 * n, n) // (n + 1)  # Catalan(n), from memory
    # every product of two diagrams is a diagram (times delta^loops, delta = 1 here)
    assert from_table(T).nnz == T.dim**2


@pytest.mark.parametrize(
    "make",
    [
        lambda: tables.temperley_lieb(6, 1, "GF(3)"),
        lambda: tables.schur_algebra_2(5, "GF(2)"),
        lambda: tables.symmetric_group_algebra(4, "GF(3)"),
    ],
    ids=["TL6", "S(2,5)", "S4"],
)
def test_table_passes_agree_with_the_plain_loops(make, monkeypatch):
    monkeypatch.setattr(tables, "COLUMN_TABLE_MIN", 0)
    A = from_table(make())
    rng = random.Random(2)
    rows = rng.sample(range(A.dim), min(6, A.dim))
    got = A._row_terms_of(rows)
    full = A._row_terms()
    assert {i: tuple(list(x) for x in got[i]) for i in rows} == {
        i: tuple(list(x) for x in full[i]) for i in rows
    }
    A._cache.pop("trace", None)
    fast = A.trace_functional()
    monkeypatch.setattr(structure, "USE_VECTOR", False)
    A._cache.pop("trace", None)
    assert A.trace_functional() == fast
    monkeypatch.setattr(structure, "USE_VECTOR", True)
    import numpy as np

    X = [[rng.randrange(A._p) for _ in range(A.dim)] for _ in range(4)]
    for j in rng.sample(range(A.dim), 5):
        prod = A._times_basis_rows(np.asarray(X, dtype=np.int64), j)
        assert prod.tolist() == [A._times_basis_raw(x, j) for x in X]


@settings(max_examples=20, deadline=None)
@given(st.integers(1, 60), st.integers(1, 60), st.integers(0, 2**16))
def test_rows_read_alone_equal_the_matrix_rows(n, m, seed):
    F = GF(5)
    rng = random.Random(seed)
    M = Mat.from_flat(F, n, m, [rng.randrange(5) for _ in range(n * m)])
    idx = [rng.randrange(n) for _ in range(rng.randint(1, n))]
    assert take_rows(M, idx).tolist() == [M.tolist()[i] for i in idx]


def test_reduction_shows_progress_only_when_enabled():
    class Terminal(io.StringIO):
        def isatty(self):
            return True

    A = from_table(tables.temperley_lieb(5, 1, "GF(3)"))
    quiet = reduce_algebra(A)
    out = Terminal()
    progress.enable(out, delay=0)
    try:
        shown = reduce_algebra(A)
    finally:
        progress.disable()
    assert "simple modules" in out.getvalue() and "blocks of the basic algebra" in out.getvalue()
    _same_reduction(quiet, shown)


@pytest.mark.parametrize(
    "make",
    [
        lambda: tables.temperley_lieb(7, 1, "GF(2)"),
        lambda: tables.symmetric_group_algebra(5, "GF(3)"),
    ],
    ids=["TL7(1)", "S5-GF3"],
)
def test_unlucky_draws_fall_back_to_the_elimination(make, monkeypatch):
    """Every random matrix of rank 1 (a draw that loses the rank): the closing checks fail,
    the reduction runs again without sketches and equals the plain elimination."""
    import hwcat.algebras.reduction.reduction as red

    monkeypatch.setattr(sketch, "MIN_SIZE", 64)
    monkeypatch.setattr(sketch, "START_WIDTH", 8)
    A = from_table(make())
    plain = _without_sketch(lambda: reduce_algebra(A), monkeypatch)

    def rank_one(F, nrows, ncols, seed):
        rng = random.Random(seed)
        u = Mat.from_flat(F, nrows, 1, [rng.randrange(1, F.p) for _ in range(nrows)])
        return u @ Mat.from_flat(F, 1, ncols, [1] * ncols)

    monkeypatch.setattr(sketch, "random_matrix", rank_one)
    runs = []
    real = red._reduce
    monkeypatch.setattr(red, "_reduce", lambda *a: runs.append(sketch.USE_SKETCH) or real(*a))
    got = reduce_algebra(A)
    assert runs == [True, False]  # the first run failed its checks, the second used no sketch
    assert sketch.USE_SKETCH
    assert "sketch_draws" not in A._cache  # the unlucky draws are not kept
    _same_reduction(got, plain)
    # the unlucky run alone does fail (a check, or a step further on)
    with pytest.raises((AssertionError, ArithmeticError, LookupError, ValueError)):
        real(A, 0, None, "split")


# -- group tables by index arrays, the small radical by arrays, Krylov on columns ------


def _permutation_group_algebra(gens, F):
    """The group algebra over ``F`` of the permutation group generated by ``gens``, its
    elements listed by sympy (``PermutationGroup.elements``), products composed by sympy."""
    from sympy.combinatorics import Permutation, PermutationGroup

    G = PermutationGroup([Permutation(g) for g in gens])
    elems = sorted(G.elements, key=lambda g: g.array_form)
    where = {tuple(g.array_form): i for i, g in enumerate(elems)}
    products = {
        (i, j): {where[tuple((a * b).array_form)]: F.one}
        for i, a in enumerate(elems)
        for j, b in enumerate(elems)
    }
    unit = [F.zero] * len(elems)
    unit[where[tuple(range(len(gens[0])))]] = F.one
    basis = [f"g{i}" for i in range(len(elems))]
    return structure.StructureAlgebra(F, basis, products, unit, associativity="skip")


def _table_passes(A, rng):
    """The dense passes over the table for random arguments (exact matrices and lists)."""
    import numpy as np

    p, n = A._p, A.dim
    y = [rng.randrange(p) for _ in range(n)]
    sparse_y = [rng.randrange(p) if rng.random() < 0.1 else 0 for _ in range(n)]
    phi = [rng.randrange(p) for _ in range(n)]
    rows = rng.sample(range(n), max(1, n // 2))
    cols = rng.sample(range(n), max(1, n // 3))
    X = np.asarray([[rng.randrange(p) for _ in range(n)] for _ in range(3)], dtype=np.int64)
    j = rng.randrange(n)
    return (
        A._action(y, None, left=False).tolist(),
        A._action(y, None, left=True).tolist(),
        A._action_dense_vectorised(sparse_y, None, n, False).tolist(),
        A._action_dense_vectorised(sparse_y, None, n, True).tolist(),
        A._right_action_transposed(y, None).tolist(),
        A.gram(A.vec(phi), rows=rows, cols=cols).tolist(),
        A._form_of_products(y, phi),
        A._form_of_products(y, phi, rows),
        A._times_basis_rows(X, j).tolist(),
        {i: tuple(list(t) for t in v) for i, v in A._row_terms_of(rows[:3]).items()},
    )


@settings(max_examples=12, deadline=None)
@given(
    st.lists(st.permutations(range(5)), min_size=1, max_size=2),
    st.sampled_from([GF(2), GF(3), GF(5)]),
    st.integers(0, 2**16),
)
def test_group_tables_by_index_arrays_equal_the_table_passes(gens, F, seed):
    pytest.importorskip("sympy")
    A = _permutation_group_algebra(gens, F)
    assert A._group_table() is not None
    fast = _table_passes(A, random.Random(seed))
    old, old_split = structure.USE_GROUP_TABLE, reduction.GROUP_SPLIT
    try:
        reduction.GROUP_SPLIT = False  # the same random elements on both sides
        red_fast = _reduction_or_error(A)
        B = _permutation_group_algebra(gens, F)
        structure.USE_GROUP_TABLE = False
        assert B._group_table() is None
        plain = _table_passes(B, random.Random(seed))
        red_plain = _reduction_or_error(B)
    finally:
        structure.USE_GROUP_TABLE, reduction.GROUP_SPLIT = old, old_split
    assert fast == plain
    if isinstance(red_fast, str) or isinstance(red_plain, str):
        # e.g. C_3 over GF(2): its two-dimensional simple needs GF(4) (from memory)
        assert red_fast == red_plain
    else:
        _same_reduction(red_fast, red_plain)


def _reduction_or_error(A):
    from hwcat.errors import NotSplitError

    try:
        return reduce_algebra(A)
    except NotSplitError as exc:
        return str(exc)


@pytest.mark.parametrize(
    ("make", "simples"),
    [
        (lambda: tables.symmetric_group_algebra(4, "GF(2)"), _p_regular_partitions(4, 2)),
        (lambda: tables.symmetric_group_algebra(5, "GF(3)"), _p_regular_partitions(5, 3)),
        # a p-group over a field of characteristic p has one simple (from memory)
        (lambda: tables.cyclic_group_algebra(16, "GF(2)"), 1),
    ],
    ids=["S4-GF2", "S5-GF3", "C16-GF2"],
)
def test_group_families_unchanged_by_the_index_arrays(make, simples, monkeypatch):
    A = from_table(make())
    assert A._group_table() is not None
    monkeypatch.setattr(reduction, "GROUP_SPLIT", False)  # the same random elements
    fast = reduce_algebra(A)
    monkeypatch.setattr(structure, "USE_GROUP_TABLE", False)
    B = from_table(make())
    assert B._group_table() is None
    plain = reduce_algebra(B)
    _same_reduction(fast, plain)
    assert len(fast.simple_dimensions) == simples


def test_tables_that_are_not_group_tables_have_no_index_arrays():
    # every product of two Temperley-Lieb diagrams at delta = 1 is a diagram, but not a group
    T = from_table(tables.temperley_lieb(5, 1, "GF(3)"))
    assert T.nnz == T.dim**2 and T._group_table() is None
    assert from_table(tables.schur_algebra_2(4, "GF(2)"))._group_table() is None


@settings(max_examples=15, deadline=None)
@given(bound_quiver_algebras(max_vertices=4, field=st.sampled_from([GF(2), GF(3), GF(7)])))
def test_small_radical_by_arrays_equals_the_plain_chain(B):
    """The radical of an algebra from its right multiplication matrices, both ways, and
    against the lifted-trace radical of the structure-constant algebra."""
    A = from_basic_algebra(B)
    fast = _small_radical_both_ways(A)
    # B is basic with one-dimensional simples: rad has codimension n (common practice)
    assert fast.nrows == A.dim - B.n


@settings(max_examples=20, deadline=None)
@given(st.sampled_from([GF(2), GF(3), GF(101)]), st.integers(1, 40), st.integers(0, 2**16))
def test_krylov_on_columns_equals_the_row_chain(F, n, seed):
    from hwcat.algebras.reduction.kernels import chain_step, krylov

    rng = random.Random(seed)
    # low rank factors so that the sequences stop early as well as late
    M = _low_rank(F, n, n, rng.randint(1, n), rng)
    N = Mat.from_flat(F, n, n, [rng.randrange(F.p) for _ in range(n * n)])
    v0 = Mat.from_flat(F, 1, n, [rng.randrange(F.p) for _ in range(n)])
    K1, c1 = krylov(v0, None, step=chain_step([M, N]), limit=n)
    K2, c2 = krylov(v0, None, step=lambda v: (v @ M) @ N, limit=n)
    K3, c3 = krylov(v0, M @ N, limit=n)
    assert K1.tolist() == K2.tolist() == K3.tolist() and c1 == c2 == c3
    # the definition (common practice): rows v0 Z^a, independent, then v0 Z^d = c K
    Z = M @ N
    d = K1.nrows
    powers = [v0]
    for _ in range(d):
        powers.append(powers[-1] @ Z)
    assert K1.tolist() == Mat.vstack(F, powers[:d], n).tolist()
    assert K1.rank() == d
    assert (Mat.from_flat(F, 1, d, c1) @ K1).tolist() == powers[d].tolist()


@pytest.mark.parametrize(
    "make",
    [
        lambda: tables.cyclic_group_algebra(8, "GF(2)"),
        lambda: tables.cyclic_group_algebra(9, "GF(3)"),
        lambda: tables.cyclic_group_algebra(12, "GF(2)"),
        lambda: tables.cyclic_group_algebra(10, "GF(5)"),
    ],
    ids=["C8-GF2", "C9-GF3", "C12-GF2", "C10-GF5"],
)
def test_commutative_radical_by_frobenius_equals_the_chain(make):
    """Commutative algebras take the Frobenius route; the plain lifted-trace chain and the
    trace radical agree.  dim rad F[C_m] = m - (number of simples), and for m = p^a q with
    p not dividing q the group algebra over GF(p) is F[x]/(x^q - 1)^(p^a) (from memory)."""
    A = from_table(make())
    fast = _small_radical_both_ways(A)
    m, p = A.dim, A.field.p
    q = m
    while q % p == 0:
        q //= p
    # (x^q - 1)^(p^a): the radical is generated by x^q - 1 and has dimension m - q
    assert fast.nrows == m - q


def _small_radical_both_ways(A):
    """The radical by the small-radical kernel with its fast path, after checking it
    against the plain path and the lifted-trace radical of the whole algebra (derived)."""
    from hwcat.algebras.reduction import kernels
    from hwcat.algebras.reduction.radical import trace_radical
    from hwcat.exact import echelon

    mult = [A.right_action(A.basis_vector(l)) for l in range(A.dim)]
    fast = kernels.small_radical(A.field, mult)
    old = kernels.FAST_SMALL_RADICAL
    try:
        kernels.FAST_SMALL_RADICAL = False
        plain = kernels.small_radical(A.field, mult)
    finally:
        kernels.FAST_SMALL_RADICAL = old
    assert echelon(fast).tolist() == echelon(plain).tolist()
    assert echelon(fast).tolist() == echelon(trace_radical(A, "lifted-trace")).tolist()
    return fast


def test_draws_are_not_kept_after_a_reduction(monkeypatch):
    """The random matrices of the thin products serve one reduction; afterwards the algebra
    keeps its result, not the draws (they were megabytes for the larger group algebras).
    The reduction equals the one without sketches (common practice: the same answer)."""
    monkeypatch.setattr(sketch, "MIN_SIZE", 64)
    monkeypatch.setattr(sketch, "START_WIDTH", 8)
    A = from_table(tables.symmetric_group_algebra(5, "GF(3)"))
    drawn = sketch.DRAWS
    got = reduce_algebra(A)
    assert sketch.DRAWS > drawn  # sketches were used
    assert "sketch_draws" not in A._cache
    B = from_table(tables.symmetric_group_algebra(5, "GF(3)"))
    _same_reduction(got, _without_sketch(lambda: reduce_algebra(B), monkeypatch))
