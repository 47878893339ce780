"""Property tests of the exact layer :mod:`hwcat.exact` (fields, matrices, subspaces).

Every matrix result is compared with an independent general-purpose reference:
sympy (The SymPy Development Team, *SymPy: computer algebra in Python*).

* Over ``QQ`` the reference is ``sympy.Matrix`` with ``Rational`` entries, and
  sympy's dense domain matrix ``DDM`` over sympy's ``QQ``.
* Over ``GF(p)`` the reference is sympy's ``DDM`` over sympy's ``GF(p)``.  ``DDM``
  runs sympy's own pure-Python Gauss-Jordan elimination (``ddm_irref``), not
  the flint matrix routines that hwcat calls, so the two computations share
  nothing but the arithmetic of single field elements.
* Shapes and contents of assembled matrices (stacking, extraction, block
  diagonals, transposes) are compared with ``sympy.Matrix.vstack``,
  ``hstack``, ``extract``, ``sympy.diag`` and ``.T``.

The linear-algebra facts used to judge results that are not unique (kernels,
solutions, complements, intersections) are textbook ones, from memory:
rank-nullity, ``dim U + dim W = dim(U + W) + dim(U ∩ W)``, and the uniqueness
of the reduced row echelon form.

Fields: QQ, GF(2), GF(3), GF(101), GF(2^61 - 1) and GF(2^63 - 25), the largest
prime below 2^63 (primality checked against ``sympy.isprime``).  Random shapes
include the empty ones ``0 x n``, ``n x 0`` and ``0 x 0``, and these are also
checked explicitly.
"""

from __future__ import annotations

from fractions import Fraction
from functools import cache

import pytest
import sympy
from hypothesis import given, settings
from hypothesis import strategies as st
from sympy.polys.matrices.ddm import DDM

from hwcat.errors import CoefficientError, FieldError, HwcatError, InternalInconsistency
from hwcat.exact import (
    GF,
    QQ,
    Field,
    Mat,
    complement,
    contains,
    echelon,
    intersection,
    parse_field,
    quotient_map,
    select_independent_rows,
    subspace_sum,
)

MERSENNE_61 = 2305843009213693951  # 2^61 - 1
BIG_PRIME = 2**63 - 25  # largest prime below 2^63
FIELDS: list[Field] = [QQ, GF(2), GF(3), GF(101), GF(MERSENNE_61), GF(BIG_PRIME)]
SMALL = settings(max_examples=40, deadline=None)
MEDIUM = settings(max_examples=60, deadline=None)
MAXDIM = 5

Rows = list[list]

# -- canonical python values and the sympy reference -------------------------------------------


def _canon(F: Field, x: object) -> Fraction | int:
    """A python value for a field element: ``Fraction`` over QQ, ``0 <= int < p`` over GF(p)."""
    if F.characteristic == 0:
        return Fraction(str(x))
    return int(str(x)) % F.characteristic


def rows_of(M: Mat) -> Rows:
    return [[_canon(M.field, x) for x in r] for r in M.tolist()]


def mk(F: Field, rows: Rows, ncols: int) -> Mat:
    return Mat.from_rows(F, rows, ncols)


def py_mul(F: Field, a: Rows, b: Rows, ncols: int) -> Rows:
    """Plain python product, used only to build test inputs of low rank."""
    p = F.characteristic
    out = []
    for r in a:
        row = []
        for j in range(ncols):
            s = sum((r[k] * b[k][j] for k in range(len(r))), Fraction(0) if p == 0 else 0)
            row.append(s if p == 0 else s % p)
        out.append(row)
    return out


def transpose_rows(rows: Rows, ncols: int) -> Rows:
    return [[r[j] for r in rows] for j in range(ncols)]


def identity_rows(n: int) -> Rows:
    return [[int(i == j) for j in range(n)] for i in range(n)]


def _from_sympy_number(p: int, x: sympy.Rational) -> Fraction | int:
    return Fraction(int(x.p), int(x.q)) if p == 0 else int(x) % p


@cache
def _sympy_domain(p: int):
    return sympy.QQ if p == 0 else sympy.GF(p)


class Ref:
    """The sympy reference for one field (see the module docstring)."""

    def __init__(self, F: Field) -> None:
        self.p = F.characteristic
        self.K = _sympy_domain(self.p)

    def ddm(self, rows: Rows, ncols: int) -> DDM:
        K = self.K
        if self.p == 0:
            data = [[K(x.numerator, x.denominator) for x in r] for r in rows]
        else:
            data = [[K(int(x)) for x in r] for r in rows]
        return DDM(data, (len(rows), ncols), K)

    def back(self, d: DDM) -> Rows:
        return [[_from_sympy_number(self.p, self.K.to_sympy(x)) for x in r] for r in d.to_list()]

    def rref(self, rows: Rows, ncols: int) -> tuple[Rows, tuple[int, ...]]:
        R, piv = self.ddm(rows, ncols).rref()
        return self.back(R)[: len(piv)], tuple(piv)

    def rank(self, rows: Rows, ncols: int) -> int:
        return len(self.rref(rows, ncols)[1])

    def nullspace(self, rows: Rows, ncols: int) -> Rows:
        """Rows ``x`` with ``A x^T = 0`` (a basis)."""
        N, _ = self.ddm(rows, ncols).nullspace()
        return self.back(N)

    def matmul(self, a: Rows, acols: int, b: Rows, bcols: int) -> Rows:
        return self.back(self.ddm(a, acols).matmul(self.ddm(b, bcols)))

    def inv(self, rows: Rows) -> Rows:
        return self.back(self.ddm(rows, len(rows)).inv())

    def same_rowspace(self, a: Rows, b: Rows, ncols: int) -> bool:
        return self.rref(a, ncols) == self.rref(b, ncols)


def to_sympy(F: Field, rows: Rows, ncols: int) -> sympy.Matrix:
    if F.characteristic == 0:
        flat = [sympy.Rational(x.numerator, x.denominator) for r in rows for x in r]
    else:
        flat = [sympy.Integer(x) for r in rows for x in r]
    return sympy.Matrix(len(rows), ncols, flat)


def from_sympy(F: Field, S: sympy.Matrix) -> Rows:
    return [[_from_sympy_number(F.characteristic, x) for x in S.row(i)] for i in range(S.rows)]


# -- strategies --------------------------------------------------------------------------------

fields = st.sampled_from(FIELDS)
dims = st.integers(0, MAXDIM)


def entries(F: Field) -> st.SearchStrategy:
    p = F.characteristic
    if p == 0:
        return st.one_of(
            st.just(Fraction(0)),
            st.integers(-3, 3).map(Fraction),
            st.fractions(min_value=-9, max_value=9, max_denominator=6),
        )
    # negative and oversized integers exercise the reduction mod p on input
    return st.one_of(st.just(0), st.integers(-3, 3), st.integers(0, p - 1), st.integers(-p, 2 * p))


@st.composite
def raw_rows(draw, F: Field, nrows: int, ncols: int) -> Rows:
    """Random rows; half of the time a product through a narrow middle (low rank)."""
    e = entries(F)
    if nrows and ncols and draw(st.booleans()):
        k = draw(st.integers(0, min(nrows, ncols)))
        a = [[_canon(F, draw(e)) for _ in range(k)] for _ in range(nrows)]
        b = [[_canon(F, draw(e)) for _ in range(ncols)] for _ in range(k)]
        return py_mul(F, a, b, ncols)
    return [[draw(e) for _ in range(ncols)] for _ in range(nrows)]


@st.composite
def matrix_in(draw, F: Field, nrows: int | None = None, ncols: int | None = None) -> Mat:
    r = draw(dims) if nrows is None else nrows
    c = draw(dims) if ncols is None else ncols
    return mk(F, draw(raw_rows(F, r, c)), c)


@st.composite
def matrices(draw) -> Mat:
    return draw(matrix_in(draw(fields)))


EMPTY_SHAPES = [(0, 0), (0, 3), (3, 0)]


# -- rank and reduced echelon form -------------------------------------------------------------


@MEDIUM
@given(matrices())
def test_rank_matches_sympy(A: Mat) -> None:
    """Reference: sympy (DDM rank and sympy.Matrix.rank)."""
    F, c = A.field, A.ncols
    rows = rows_of(A)
    expected = Ref(F).rank(rows, c)
    assert A.rank() == expected
    if F is QQ:  # second reference: the high-level sympy.Matrix
        assert to_sympy(F, rows, c).rank() == expected


@MEDIUM
@given(matrices())
def test_rref_matches_sympy(A: Mat) -> None:
    """Reference: sympy (DDM.rref; sympy.Matrix.rref over QQ)."""
    F, c = A.field, A.ncols
    rows = rows_of(A)
    R, piv = A.rref()
    want_rows, want_piv = Ref(F).rref(rows, c)
    assert R.field is F
    assert R.shape == (len(want_piv), c)
    assert rows_of(R) == want_rows
    assert piv == want_piv
    assert rows_of(echelon(A)) == want_rows
    if F is QQ:
        S, spiv = to_sympy(F, rows, c).rref()
        assert tuple(spiv) == piv
        assert from_sympy(F, S)[: len(spiv)] == rows_of(R)


def test_rref_worked_example() -> None:
    # derived by hand: [[2, 4, 0], [1, 2, 1]] -> [[1, 2, 0], [0, 0, 1]] over QQ and GF(3)
    for F in (QQ, GF(3)):
        R, piv = mk(F, [[2, 4, 0], [1, 2, 1]], 3).rref()
        assert rows_of(R) == [[1, 2, 0], [0, 0, 1]]
        assert piv == (0, 2)
    # over GF(2) the first row vanishes: [[0, 0, 0], [1, 0, 1]]
    R, piv = mk(GF(2), [[2, 4, 0], [1, 2, 1]], 3).rref()
    assert rows_of(R) == [[1, 0, 1]] and piv == (0,)


# -- kernels -----------------------------------------------------------------------------------


@MEDIUM
@given(matrices())
def test_right_kernel(A: Mat) -> None:
    """Reference: sympy DDM.nullspace; rank-nullity (from memory)."""
    F, (r, c) = A.field, A.shape
    ref, rows = Ref(F), rows_of(A)
    K = A.right_kernel()
    nullity = c - ref.rank(rows, c)
    assert K.field is F and K.shape == (nullity, c)
    k = rows_of(K)
    # every row x satisfies A x^T = 0
    assert ref.matmul(rows, c, transpose_rows(k, c), nullity) == [[0] * nullity for _ in range(r)]
    assert ref.rank(k, c) == nullity  # independent
    assert ref.same_rowspace(k, ref.nullspace(rows, c), c)


@MEDIUM
@given(matrices())
def test_left_kernel(A: Mat) -> None:
    """Reference: sympy DDM.nullspace of the transpose; rank-nullity (from memory)."""
    F, (r, c) = A.field, A.shape
    ref, rows = Ref(F), rows_of(A)
    K = A.left_kernel()
    nullity = r - ref.rank(rows, c)
    assert K.field is F and K.shape == (nullity, r)
    k = rows_of(K)
    assert ref.matmul(k, r, rows, c) == [[0] * c for _ in range(nullity)]  # x @ A = 0
    assert ref.rank(k, r) == nullity
    assert ref.same_rowspace(k, ref.nullspace(transpose_rows(rows, c), r), r)


@st.composite
def medium_matrices(draw) -> Mat:
    """Up to 14 x 14, often of low rank: the small-matrix fast paths (pivot shortcut,
    rows kept by a cached selection product, flint's nullspace over GF(p))."""
    F = draw(fields)
    r, c = draw(st.integers(1, 14)), draw(st.integers(1, 14))
    return mk(F, draw(raw_rows(F, r, c)), c)


def canonical_kernel(F: Field, rows: Rows, ncols: int) -> Rows:
    """The kernel basis read off sympy's reduced echelon form: one row per free column f,
    1 at f, -R[i, f] at the pivot of row i (the form documented in ``Mat.right_kernel``)."""
    R, piv = Ref(F).rref(rows, ncols)
    p = F.characteristic
    out = []
    for f in (j for j in range(ncols) if j not in piv):
        row: list = [0] * ncols
        row[f] = 1
        for i, q in enumerate(piv):
            x = -R[i][f]
            row[q] = x if p == 0 else x % p
        out.append([Fraction(x) for x in row] if p == 0 else row)
    return out


@MEDIUM
@given(medium_matrices())
def test_small_paths_match_sympy(A: Mat) -> None:
    """Reference: sympy DDM.rref, and sympy.Matrix.nullspace over QQ (same normal form)."""
    F, c = A.field, A.ncols
    rows = rows_of(A)
    want_rows, want_piv = Ref(F).rref(rows, c)
    for _ in range(2):  # twice: cached selection matrices must come back unchanged
        R, piv = A.rref()
        assert (rows_of(R), piv) == (want_rows, want_piv)
        assert A.rank() == len(want_piv)
        K = A.right_kernel()
        assert K.shape == (c - len(want_piv), c)
        assert rows_of(K) == canonical_kernel(F, rows, c)
    if F is QQ:
        basis = to_sympy(F, rows, c).nullspace()
        assert rows_of(K) == [from_sympy(F, v.T)[0] for v in basis]


def test_kernel_worked_example() -> None:
    # derived: [[1, 2], [2, 4]] has left kernel spanned by (-2, 1), right kernel by (-2, 1)
    A = mk(QQ, [[1, 2], [2, 4]], 2)
    assert rows_of(A.left_kernel()) == [[-2, 1]]
    assert rows_of(A.right_kernel()) == [[-2, 1]]


# -- solving, inverses, products ---------------------------------------------------------------


@st.composite
def solve_cases(draw):
    F = draw(fields)
    n, m, k = draw(dims), draw(dims), draw(dims)
    A = draw(raw_rows(F, n, m))
    A = [[_canon(F, x) for x in r] for r in A]
    if draw(st.booleans()):  # B = X0 @ A, always solvable
        X0 = [[_canon(F, draw(entries(F))) for _ in range(n)] for _ in range(k)]
        B = py_mul(F, X0, A, m)
    else:
        B = [[_canon(F, x) for x in r] for r in draw(raw_rows(F, k, m))]
    return F, mk(F, A, m), mk(F, B, m)


@MEDIUM
@given(solve_cases())
def test_solve_left(case) -> None:
    """Reference: sympy DDM ranks and products."""
    F, A, B = case
    (n, m), k = A.shape, B.nrows
    ref = Ref(F)
    a, b = rows_of(A), rows_of(B)
    solvable = ref.rank(a, m) == ref.rank(a + b, m)  # rank test, common practice
    X = A.solve_left(B)
    assert (X is not None) == solvable
    if X is not None:
        assert X.field is F and X.shape == (k, n)
        assert ref.matmul(rows_of(X), n, a, m) == b


def test_solve_left_unsolvable_example() -> None:
    # derived: (0, 1) is not in the row space of [[1, 0]]
    for F in FIELDS:
        assert mk(F, [[1, 0]], 2).solve_left(mk(F, [[0, 1]], 2)) is None
        # a 0 x 2 system: only the zero row is reachable
        assert mk(F, [], 2).solve_left(mk(F, [[0, 1]], 2)) is None
        X = mk(F, [], 2).solve_left(mk(F, [[0, 0]], 2))
        assert X is not None and X.shape == (1, 0)


@MEDIUM
@given(fields.flatmap(lambda F: dims.flatmap(lambda n: matrix_in(F, n, n))))
def test_inverse(A: Mat) -> None:
    """Reference: sympy DDM.inv."""
    F, n = A.field, A.nrows
    ref, rows = Ref(F), rows_of(A)
    if ref.rank(rows, n) == n:
        Inv = A.inverse()
        assert Inv.field is F and Inv.shape == (n, n)
        assert rows_of(Inv) == ref.inv(rows)
        assert rows_of(A @ Inv) == identity_rows(n)
        assert rows_of(Inv @ A) == identity_rows(n)
    else:
        with pytest.raises((ZeroDivisionError, HwcatError)):
            A.inverse()


@st.composite
def product_cases(draw):
    F = draw(fields)
    n, k, m = draw(dims), draw(dims), draw(dims)
    return draw(matrix_in(F, n, k)), draw(matrix_in(F, k, m))


@MEDIUM
@given(product_cases())
def test_matmul(case) -> None:
    """Reference: sympy DDM.matmul."""
    A, B = case
    F = A.field
    (n, k), m = A.shape, B.ncols
    P = A @ B
    assert P.field is F and P.shape == (n, m)
    assert rows_of(P) == Ref(F).matmul(rows_of(A), k, rows_of(B), m)


@MEDIUM
@given(matrices())
def test_transpose(A: Mat) -> None:
    """Reference: sympy.Matrix.T."""
    F, (r, c) = A.field, A.shape
    T = A.transpose()
    assert T.shape == (c, r) and A.T == T
    assert rows_of(T) == from_sympy(F, to_sympy(F, rows_of(A), c).T)
    assert T.transpose() == A


# -- assembly ----------------------------------------------------------------------------------


@st.composite
def same_cols(draw, max_count: int = 3, rows: bool = False):
    """``(F, d, mats)``: matrices sharing ``d`` columns (``d`` rows when ``rows``)."""
    F, d = draw(fields), draw(dims)
    shape = {"nrows": d} if rows else {"ncols": d}
    return F, d, draw(st.lists(matrix_in(F, **shape), max_size=max_count))


@MEDIUM
@given(same_cols())
def test_vstack(case) -> None:
    """Reference: sympy.Matrix.vstack."""
    F, c, mats = case
    V = Mat.vstack(F, mats, c)
    assert V.shape == (sum(m.nrows for m in mats), c)
    if mats:
        S = sympy.Matrix.vstack(*[to_sympy(F, rows_of(m), c) for m in mats])
        assert rows_of(V) == from_sympy(F, S)
        assert Mat.vstack(F, mats) == V
    else:
        assert V.is_zero()


@MEDIUM
@given(same_cols(rows=True))
def test_hstack(case) -> None:
    """Reference: sympy.Matrix.hstack."""
    F, r, mats = case
    H = Mat.hstack(F, mats, r)
    assert H.shape == (r, sum(m.ncols for m in mats))
    if mats:
        S = sympy.Matrix.hstack(*[to_sympy(F, rows_of(m), m.ncols) for m in mats])
        assert rows_of(H) == from_sympy(F, S)
        assert Mat.hstack(F, mats) == H


@st.composite
def extraction_cases(draw):
    A = draw(matrices())
    r, c = A.shape
    ri = draw(st.lists(st.integers(0, r - 1), max_size=6)) if r else []
    ci = draw(st.lists(st.integers(0, c - 1), max_size=6)) if c else []
    return A, ri, ci


@MEDIUM
@given(extraction_cases())
def test_take_rows_and_cols(case) -> None:
    """Reference: sympy.Matrix.extract and .row."""
    A, ri, ci = case
    F, (r, c) = A.field, A.shape
    S = to_sympy(F, rows_of(A), c)
    R, C = A.take_rows(ri), A.take_cols(ci)
    assert R.shape == (len(ri), c) and C.shape == (r, len(ci))
    assert rows_of(R) == from_sympy(F, S.extract(ri, list(range(c))))
    assert rows_of(C) == from_sympy(F, S.extract(list(range(r)), ci))
    for i in ri:
        assert rows_of(A.row(i)) == from_sympy(F, S.row(i))


@st.composite
def block_cases(draw):
    F = draw(fields)
    return F, draw(st.lists(matrix_in(F), max_size=3))


@MEDIUM
@given(block_cases())
def test_block_diag(case) -> None:
    """Reference: sympy.diag."""
    F, mats = case
    D = Mat.block_diag(F, mats)
    assert D.field is F
    assert D.shape == (sum(m.nrows for m in mats), sum(m.ncols for m in mats))
    S = sympy.diag(*[to_sympy(F, rows_of(m), m.ncols) for m in mats])
    assert S.shape == D.shape
    assert rows_of(D) == from_sympy(F, S)


@pytest.mark.parametrize("shape", EMPTY_SHAPES, ids=str)
@pytest.mark.parametrize("F", FIELDS, ids=str)
def test_empty_shapes(F: Field, shape: tuple[int, int]) -> None:
    # derived from rank-nullity (from memory); ranks from the sympy reference
    r, c = shape
    ref = Ref(F)
    A = Mat.zeros(F, r, c)
    assert A.shape == shape and A.is_zero()
    assert A.rank() == 0 == ref.rank([[0] * c for _ in range(r)], c)
    R, piv = A.rref()
    assert R.shape == (0, c) and piv == ()
    for K, d in ((A.right_kernel(), c), (A.left_kernel(), r)):  # the whole space
        assert K.shape == (d, d) and ref.rank(rows_of(K), d) == d
    assert A.transpose().shape == (c, r)
    assert (A @ Mat.zeros(F, c, 2)).shape == (r, 2)
    assert (Mat.zeros(F, 2, r) @ A).shape == (2, c)
    X = A.solve_left(Mat.zeros(F, 2, c))
    assert X is not None and X.shape == (2, r)
    assert A.take_rows([]).shape == (0, c) and A.take_cols([]).shape == (r, 0)
    assert Mat.vstack(F, [A, A]).shape == (2 * r, c)
    assert Mat.hstack(F, [A, A]).shape == (r, 2 * c)
    assert Mat.block_diag(F, [A, A]).shape == (2 * r, 2 * c)
    assert Mat.block_diag(F, []).shape == (0, 0)
    assert Mat.vstack(F, [], c).shape == (0, c) and Mat.hstack(F, [], r).shape == (r, 0)
    # subspaces of k^c given by r zero rows
    assert intersection(A, A).shape == (0, c)
    C = complement(A)
    assert C.shape == (c, c) and ref.rank(rows_of(C), c) == c
    assert contains(A, Mat.zeros(F, 1, c)) and contains(A, Mat.zeros(F, 0, c))
    pi, sec, kept = quotient_map(A)
    assert pi.shape == sec.shape == (c, c) and kept == tuple(range(c))
    assert ref.rank(rows_of(pi), c) == c and rows_of(sec @ pi) == identity_rows(c)
    assert select_independent_rows(A) == []
    assert subspace_sum(F, c, []).shape == (0, c)
    I0 = Mat.identity(F, 0)
    assert I0.inverse() == I0 and I0.shape == (0, 0)


# -- misuse inside the library: shapes and fields checked by the operations ---------------------


@pytest.mark.parametrize("F", FIELDS)
def test_mismatched_shapes_and_fields_raise(F: Field) -> None:
    # derived: the shapes below admit no sum, difference, product, inverse or solution
    A, B = Mat.zeros(F, 2, 3), Mat.zeros(F, 3, 2)
    msgs = [
        (lambda: A + B, "cannot add (2, 3) and (3, 2)"),
        (lambda: A - B, "cannot subtract (2, 3) and (3, 2)"),
        (lambda: A @ A, "cannot multiply (2, 3) by (2, 3)"),
        (lambda: A.inverse(), "inverse of a non-square matrix"),
        (lambda: Mat.identity(F, 2).solve_left(A), "solve_left: column counts differ"),
        (lambda: A.solve_left(B), "solve_left: column counts differ"),
    ]
    for op, msg in msgs:
        with pytest.raises(
            InternalInconsistency, match=msg.replace("(", r"\(").replace(")", r"\)")
        ):
            op()
    G = QQ if F is not QQ else GF(3)
    ops = (lambda x, y: x + y, lambda x, y: x - y, lambda x, y: x @ y, lambda x, y: x.solve_left(y))
    for op in ops:
        with pytest.raises(InternalInconsistency, match="mixed"):
            op(Mat.identity(F, 2), Mat.identity(G, 2))
    assert Mat.zeros(F, 2, 3) != Mat.zeros(F, 3, 2) and Mat.zeros(F, 2, 3) == A


@pytest.mark.parametrize("F", FIELDS)
def test_square_solve_left(F: Field) -> None:
    # derived: A = [[1, 1], [0, 1]] is invertible, so X @ A = B has the single solution
    # B @ A^(-1) = B @ [[1, -1], [0, 1]]; [[1, 1], [1, 1]] is singular (the echelon path)
    A = mk(F, [[1, 1], [0, 1]], 2)
    B = mk(F, [[3, 5], [0, 2], [1, 0]], 2)
    X = A.solve_left(B)
    assert X is not None and rows_of(X) == rows_of(mk(F, [[3, 2], [0, 2], [1, -1]], 2))
    assert A.solve_left(Mat.zeros(F, 0, 2)).shape == (0, 2)
    S = mk(F, [[1, 1], [1, 1]], 2)
    assert S.solve_left(mk(F, [[1, 0]], 2)) is None
    Y = S.solve_left(mk(F, [[3, 3]], 2))
    assert Y is not None and Y @ S == mk(F, [[3, 3]], 2)


def test_rational_kernel_pivots_not_leading() -> None:
    # derived: pivots at columns 1 and 3 of [[0, 1, 2, 0, 1/2], [0, 0, 0, 1, 3]]; free
    # columns 0, 2, 4 give the rows e_0, e_2 - 2 e_1, e_4 - 1/2 e_1 - 3 e_3
    A = Mat.from_rows(QQ, [[0, 1, 2, 0, "1/2"], [0, 0, 0, 1, 3], [0, 2, 4, 1, 4]])
    for _ in range(2):  # the 0/1 matrices are cached: a second call must agree
        K = A.right_kernel()
        assert rows_of(K) == [[1, 0, 0, 0, 0], [0, -2, 1, 0, 0], [0, Fraction(-1, 2), 0, -3, 1]]
        assert (A @ K.transpose()).is_zero()


# -- subspaces ---------------------------------------------------------------------------------


@st.composite
def subspace_pairs(draw):
    """Two subspaces of k^n sharing a random common part, so intersections are nontrivial."""
    F = draw(fields)
    n = draw(dims)
    common = draw(raw_rows(F, draw(st.integers(0, 3)), n))
    u = draw(raw_rows(F, draw(st.integers(0, 3)), n))
    w = draw(raw_rows(F, draw(st.integers(0, 3)), n))
    return F, n, mk(F, common + u, n), mk(F, w + common, n)


@MEDIUM
@given(same_cols(max_count=4))
def test_subspace_sum(case) -> None:
    """Reference: sympy DDM.rref of all the rows together."""
    F, n, spaces = case
    S = subspace_sum(F, n, spaces)
    everything = [row for m in spaces for row in rows_of(m)]
    assert S.shape[1] == n
    assert rows_of(S) == Ref(F).rref(everything, n)[0]


@MEDIUM
@given(subspace_pairs())
def test_intersection(case) -> None:
    """Reference: sympy DDM ranks; the dimension formula (from memory)."""
    F, n, U, W = case
    ref = Ref(F)
    u, w = rows_of(U), rows_of(W)
    I = intersection(U, W)
    i = rows_of(I)
    assert I.field is F and I.ncols == n
    # dim U + dim W = dim(U + W) + dim(U ∩ W)  (from memory, a textbook fact)
    assert ref.rank(u, n) + ref.rank(w, n) == ref.rank(u + w, n) + I.nrows
    assert ref.rank(i, n) == I.nrows  # a basis
    assert ref.rank(u + i, n) == ref.rank(u, n)  # lies in U
    assert ref.rank(w + i, n) == ref.rank(w, n)  # lies in W
    assert i == ref.rref(i, n)[0]  # returned in reduced echelon form
    assert intersection(W, U) == I  # canonical, hence symmetric


def test_intersection_doc_example() -> None:
    # derived: span(e1, e2) ∩ span(e2 + e3, e3) = span(e2)
    U = mk(QQ, [[1, 0, 0], [0, 1, 0]], 3)
    W = mk(QQ, [[0, 1, 1], [0, 0, 1]], 3)
    assert rows_of(intersection(U, W)) == [[0, 1, 0]]


@MEDIUM
@given(matrices())
def test_complement(U: Mat) -> None:
    """Reference: sympy DDM ranks."""
    F, n = U.field, U.ncols
    ref, u = Ref(F), rows_of(U)
    C = complement(U)
    c = rows_of(C)
    assert C.field is F and C.ncols == n
    assert ref.rank(u, n) + C.nrows == n  # dims add
    assert ref.rank(u + c, n) == n  # U + complement is everything
    for row in c:  # unit rows, as documented
        assert sorted(row) == [0] * (n - 1) + [1]
    assert complement(U, n) == C


@st.composite
def containment_cases(draw):
    F = draw(fields)
    n = draw(dims)
    U = draw(matrix_in(F, ncols=n))
    k = draw(st.integers(0, 3))
    if draw(st.booleans()):  # combinations of rows of U: contained
        X = [[_canon(F, draw(entries(F))) for _ in range(U.nrows)] for _ in range(k)]
        v = py_mul(F, X, rows_of(U), n)
    else:
        v = draw(raw_rows(F, k, n))
    return U, mk(F, v, n)


@MEDIUM
@given(containment_cases())
def test_contains(case) -> None:
    """Reference: sympy DDM ranks."""
    U, v = case
    F, n = U.field, U.ncols
    ref, u = Ref(F), rows_of(U)
    assert contains(U, v) == (ref.rank(u + rows_of(v), n) == ref.rank(u, n))


@MEDIUM
@given(matrices())
def test_quotient_map(U: Mat) -> None:
    """Reference: sympy DDM rref, nullspace and products."""
    F, n = U.field, U.ncols
    ref, u = Ref(F), rows_of(U)
    rank = ref.rank(u, n)
    q = n - rank
    pi, sec, kept = quotient_map(U)
    assert pi.field is F and sec.field is F
    assert pi.shape == (n, q) and sec.shape == (q, n) and len(kept) == q
    pivots = ref.rref(u, n)[1]
    assert kept == tuple(j for j in range(n) if j not in pivots)
    p = rows_of(pi)
    assert ref.matmul(rows_of(sec), n, p, q) == identity_rows(q)  # section @ pi = 1
    assert ref.rank(p, q) == q  # onto
    # kernel of v -> v @ pi is exactly the row space of U
    ker = ref.nullspace(transpose_rows(p, q), n)
    assert ref.same_rowspace(ker, u, n)
    assert ref.matmul(u, n, p, q) == [[0] * q for _ in u]


@st.composite
def selection_cases(draw):
    F = draw(fields)
    n = draw(dims)
    A = draw(matrix_in(F, ncols=n))
    basis = draw(st.one_of(st.none(), matrix_in(F, ncols=n)))
    return A, basis


@MEDIUM
@given(selection_cases())
def test_select_independent_rows(case) -> None:
    """Reference: sympy DDM ranks (greedy rule as documented)."""
    A, basis = case
    F, n = A.field, A.ncols
    ref, a = Ref(F), rows_of(A)
    b = [] if basis is None else rows_of(basis)
    got = select_independent_rows(A, basis)
    # greedy: row i is kept iff it raises the rank of basis + rows before it
    want = [i for i in range(len(a)) if ref.rank(b + a[: i + 1], n) > ref.rank(b + a[:i], n)]
    assert got == want
    kept = [a[i] for i in got]
    assert ref.rank(b + kept, n) == ref.rank(b, n) + len(kept)  # independent
    assert ref.rank(b + kept, n) == ref.rank(b + a, n)  # spans with the basis


# -- fields ------------------------------------------------------------------------------------


def test_field_primes_are_primes() -> None:
    for p in (2, 3, 101, MERSENNE_61, BIG_PRIME):
        assert sympy.isprime(p)
    assert BIG_PRIME < 2**63 and sympy.nextprime(BIG_PRIME) >= 2**63


@pytest.mark.parametrize("F", FIELDS, ids=str)
def test_parse_integers_and_fractions(F: Field) -> None:
    p = F.characteristic
    for text, value in [("3", 3), ("-2", -2), ("+5", 5), (" 7 ", 7), ("0", 0)]:
        assert _canon(F, F.parse(text)) == _canon(F, value)
        assert F(text) == F.parse(text)
    for n in (0, 1, -1, 12, -(10**30)):
        assert _canon(F, F.parse(n)) == (Fraction(n) if p == 0 else n % p)
        assert F(n) == F.parse(n)
    if p == 0:
        assert _canon(F, F.parse("3/4")) == Fraction(3, 4)
        assert _canon(F, F.parse("-6/8")) == Fraction(-3, 4)
        assert F(Fraction(3, 4)) == F.parse("3/4")
    elif p != 2:  # in GF(2), 3/4 has a denominator divisible by p
        # 3/4 means 3 * 4^(-1); the inverse from python's pow (common practice)
        assert _canon(F, F.parse("3/4")) == 3 * pow(4, -1, p) % p
        assert F(Fraction(3, 4)) == F.parse("3/4")
    assert F.zero == F(0) and F.one == F(1)
    assert _canon(F, F.parse(F.to_str(F.parse("-2")))) == _canon(F, -2)


@SMALL
@given(fields, st.integers(-(10**20), 10**20), st.integers(1, 10**20))
def test_fraction_is_multiplication_by_inverse(F: Field, num: int, den: int) -> None:
    p = F.characteristic
    text = f"{num}/{den}"
    if p == 0:
        assert _canon(F, F.parse(text)) == Fraction(num, den)
        return
    if den % p == 0:
        with pytest.raises(CoefficientError, match=text):
            F.parse(text)
        return
    got = F.parse(text)
    assert _canon(F, got) == num * pow(den, -1, p) % p
    assert got == F(num) * F(den) ** -1
    assert got == F(Fraction(num, den))


@pytest.mark.parametrize("p", [2, 3, 101, MERSENNE_61, BIG_PRIME])
def test_denominator_divisible_by_p(p: int) -> None:
    F = GF(p)
    for den in (p, 2 * p, p * p):
        text = f"5/{den}"
        with pytest.raises(CoefficientError) as info:
            F.parse(text)
        assert text in str(info.value)  # names the coefficient
        with pytest.raises(CoefficientError):
            F(Fraction(1, den))
        with pytest.raises(CoefficientError):
            Mat.from_rows(F, [[1, text]], 2)
    # the same text is fine over QQ
    assert _canon(QQ, QQ.parse(f"5/{p}")) == Fraction(5, p)


@pytest.mark.parametrize("F", FIELDS, ids=str)
def test_inexact_and_malformed_coefficients_rejected(F: Field) -> None:
    for bad in (1.5, 2.0, 0.0, True, False):
        with pytest.raises(CoefficientError):
            F(bad)
        with pytest.raises(CoefficientError):
            F.parse(bad)  # type: ignore[arg-type]
        with pytest.raises(CoefficientError):
            Mat.from_rows(F, [[bad]], 1)
    for text in ("", "abc", "1.5", "1/", "/2", "1/0", "2/-3", "1e3", "3//4", "0x10"):
        with pytest.raises(CoefficientError):
            F.parse(text)
    with pytest.raises(CoefficientError):
        F(object())


@pytest.mark.parametrize(
    "p",
    [0, 1, -7, 4, 9, 91, 2**61, MERSENNE_61 * 3, 2**63 + 29, 2**64 + 13, 2**127 - 1]
    + [True, 7.0, "7", Fraction(7)],
    ids=repr,
)
def test_gf_rejects_nonprimes_large_and_non_integers(p) -> None:
    # 2^63 + 29, 2^64 + 13 and 2^127 - 1 are primes at or above the limit
    if isinstance(p, int) and p >= 2**63:
        assert sympy.isprime(p)
    with pytest.raises(FieldError):
        GF(p)


@SMALL
@given(st.integers(-50, 10**6))
def test_gf_accepts_exactly_the_primes(n: int) -> None:
    if sympy.isprime(n):
        assert GF(n).characteristic == n and GF(n) is GF(n)
    else:
        with pytest.raises(FieldError):
            GF(n)


def test_parse_field() -> None:
    assert parse_field("QQ") is QQ
    assert parse_field("GF(101)") is GF(101)
    assert parse_field(" GF( 7 ) ") is GF(7)
    assert parse_field(f"GF({BIG_PRIME})") is GF(BIG_PRIME)
    for F in FIELDS:
        assert parse_field(str(F)) is F


MALFORMED_FIELDS = [  # common practice: names that are not "QQ" or "GF(p)" with p a prime < 2^63
    *("", "   ", "GF", "GF()", "GF(7", "GF 7", "GF(x)", "GF(-7)", "GF(7.0)", "GF(6)"),
    *("GF(1)", "GF(7)(", "GF(2^61-1)", "QQ(2)", "RR", "ZZ", "QQQ", f"GF({2**63 + 29})"),
]


@pytest.mark.parametrize("text", [*MALFORMED_FIELDS, 7, None, QQ])
def test_parse_field_malformed(text: str) -> None:
    with pytest.raises(FieldError):
        parse_field(text)


def test_matrices_over_different_fields_never_equal() -> None:
    for F in FIELDS:
        for G in FIELDS:
            for shape in [(0, 0), (0, 2), (2, 0), (2, 2)]:
                same = Mat.zeros(F, *shape) == Mat.zeros(G, *shape)
                assert same == (F is G)
            assert (Mat.identity(F, 3) == Mat.identity(G, 3)) == (F is G)
        assert Mat.zeros(F, 0, 0) != Mat.zeros(F, 0, 1)


@SMALL
@given(
    st.sampled_from([(F, G) for F in FIELDS for G in FIELDS if F is not G]),
    st.integers(0, 3),
    st.integers(0, 3),
    st.data(),
)
def test_same_integers_over_two_fields_differ(pair, r: int, c: int, data) -> None:
    F, G = pair
    rows = data.draw(
        st.lists(st.lists(st.integers(0, 1), min_size=c, max_size=c), min_size=r, max_size=r)
    )
    A, B = mk(F, rows, c), mk(G, rows, c)
    assert A != B and not (A == B)
    assert A == mk(F, rows, c)  # but equal to itself rebuilt
