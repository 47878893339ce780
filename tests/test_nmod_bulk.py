"""One-piece copies of matrices over GF(p) (:mod:`hwcat.exact.nmod_bulk`) and the matrix
operations that use them, against entry-by-entry construction and against sympy.

Reference: the reduced row echelon form over GF(p) is recomputed with sympy's
``DomainMatrix`` over ``GF(p)`` (The SymPy Development Team, *SymPy: computer
algebra in Python*); row and column selection and stacking are compared with
list operations on the entries.
"""

from __future__ import annotations

from array import array

import flint
from hypothesis import given, settings
from hypothesis import strategies as st
from sympy import GF as SGF
from sympy.polys.matrices import DomainMatrix

from hwcat.exact import GF, Mat
from hwcat.exact.nmod_bulk import bulk_available, nmod_mat_from_residues, read_residues


def _rows(M: Mat) -> list[list[int]]:
    return [[int(x) for x in r] for r in M.raw_rows()]


@st.composite
def _matrices(draw, min_entries=1024):
    p = draw(st.sampled_from([2, 3, 5, 10007, 2**61 - 1]))
    r = draw(st.integers(16, 70))
    c = draw(st.integers(-(-min_entries // r), 80))
    rank_cap = draw(st.integers(0, min(r, c)))
    seed = draw(st.integers(0, 2**30))
    # a random matrix of rank at most rank_cap: a product of two random factors
    k = max(rank_cap, 1)
    Mr = flint.nmod_mat(r, k, [(seed * 7 + i * i) % p for i in range(r * k)], p)
    Mc = flint.nmod_mat(k, c, [(seed + 3 * i * i + i) % p for i in range(c * k)], p)
    M = Mr * Mc if rank_cap else flint.nmod_mat(r, c, p)
    return GF(p), Mat(GF(p), M)


def test_the_bulk_path_is_used_on_this_build():
    assert bulk_available()


@settings(max_examples=30, deadline=None)
@given(_matrices())
def test_read_and_write_round_trip(FM):
    F, M = FM
    buf = read_residues(M._m)
    assert list(buf) == [int(x) for x in M._m.entries()]
    N = nmod_mat_from_residues(M.nrows, M.ncols, buf, F.p)
    assert N == M._m
    flat = [x for r in _rows(M) for x in r]
    assert Mat.from_flat(F, M.nrows, M.ncols, flat)._m == M._m


@settings(max_examples=30, deadline=None)
@given(_matrices(), st.data())
def test_rref_rows_cols_and_stacking_agree(FM, data):
    F, M = FM
    R, piv = M.rref()
    ref = DomainMatrix([[SGF(F.p)(x) for x in r] for r in _rows(M)], M.shape, SGF(F.p))
    Rs, pivs = ref.rref()
    ref_rows = [[int(x) % F.p for x in r] for r in Rs.to_list()][: len(pivs)]
    assert tuple(piv) == tuple(pivs)
    assert _rows(R) == ref_rows
    rows = _rows(M)
    idx = data.draw(st.lists(st.integers(0, M.nrows - 1), max_size=M.nrows))
    assert _rows(M.take_rows(idx)) == [rows[i] for i in idx]
    jdx = data.draw(st.lists(st.integers(0, M.ncols - 1), min_size=1, max_size=M.ncols))
    assert _rows(M.take_cols(jdx)) == [[r[j] for j in jdx] for r in rows]
    small = Mat.from_rows(F, [[1] * M.ncols])
    assert _rows(Mat.vstack(F, [M, small, M])) == rows + [[1] * M.ncols] + rows


def test_a_wrong_buffer_size_is_refused():
    import pytest

    with pytest.raises(ValueError):
        nmod_mat_from_residues(2, 2, array("q", [1, 2, 3]), 5)


@settings(max_examples=25, deadline=None)
@given(
    st.sampled_from([2, 3, 7, 2**31 - 1]),
    st.integers(1, 40),
    st.integers(1, 40),
    st.integers(0, 2**30),
)
def test_gathered_matrices_equal_the_lists_and_reuse_the_given_memory(p, r, c, seed):
    """``values[index]`` gathered into flint (fresh, or into a matrix given up for it)
    against the same entries placed one by one (derived)."""
    import numpy as np

    from hwcat.exact.polys import matrix_by_gather

    rng = np.random.default_rng(seed)
    values = rng.integers(0, p, size=50, dtype=np.int64)
    index = rng.integers(0, 50, size=(r, c)).astype(np.int16)
    want = Mat.from_flat(GF(p), r, c, [int(values[i]) for i in index.ravel()])
    assert matrix_by_gather(GF(p), values, index) == want
    old = Mat.from_flat(GF(p), r, c, [1] * (r * c))
    got = matrix_by_gather(GF(p), values, index, out=old)
    assert got == want
    if bulk_available():
        assert got._m is old._m  # written in place
    # a matrix of another shape is not written into
    other = Mat.from_flat(GF(p), r + 1, c, [1] * ((r + 1) * c))
    assert matrix_by_gather(GF(p), values, index, out=other) == want
    assert other == Mat.from_flat(GF(p), r + 1, c, [1] * ((r + 1) * c))
