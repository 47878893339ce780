"""Matrices over an exact field and the subspace algebra built on them.

:class:`Mat` wraps a python-flint matrix (``fmpq_mat`` over QQ, ``nmod_mat``
over GF(p)) together with its :class:`~hwcat.exact.fields.Field`.  It hides
flint's return shapes: :meth:`Mat.rref` returns the nonzero rows and the pivots
as a tuple, kernels come back as exactly ``nullity`` basis rows.

Conventions
-----------
hwcat uses **row vectors**: a linear map ``V -> W`` is a matrix of shape
``dim V x dim W`` acting by ``v -> v @ A``.  This matches paths read left to
right: the path ``a*b`` acts by ``A_a @ A_b``.  A subspace is stored as a
matrix whose rows are a basis; :func:`echelon` gives the canonical form.

Examples
--------
>>> from hwcat.exact import QQ, Mat
>>> A = Mat.from_rows(QQ, [[1, 2], [2, 4]])
>>> A.rank()
1
>>> A.left_kernel().tolist()
[['-2', '1']]
"""

from __future__ import annotations

from array import array
from collections.abc import Iterable, Sequence
from typing import Any

from hwcat.errors import InternalInconsistency
from hwcat.exact.blockmat import BlockMatrix
from hwcat.exact.fields import Field, PrimeField, RationalField
from hwcat.exact.nmod_bulk import nmod_mat_from_residues, read_residues

_BULK_MIN = 1024  # matrices over GF(p) with this many entries are moved in one piece

__all__ = [
    "Mat",
    "echelon",
    "subspace_sum",
    "intersection",
    "complement",
    "contains",
    "quotient_map",
    "select_independent_rows",
    "assemble",
]


_EMPTY: dict[tuple, Mat] = {}  # shared 0 x n and n x 0 matrices

_new = object.__new__


class Mat:
    """An exact matrix over a field (row-vector convention).

    Create with :meth:`from_rows`, :meth:`zeros`, :meth:`identity` or
    :meth:`from_flat`; never pass flint objects in from above this layer.

    Notes
    -----
    The operations on small matrices cost little more than flint's own call
    (see ``benchmarks/bench_matrices.py``): inputs are checked where they
    enter (:meth:`from_rows`, mixing fields), results are built with
    :meth:`_wrap` or its inline form in the hot operators (no ``__init__``
    call), shape errors are left to flint and only translated, and shapes are
    read only where an answer depends on them.
    """

    __slots__ = ("field", "_m")

    def __init__(self, field: Field, raw: Any) -> None:
        self.field = field
        self._m = raw

    @staticmethod
    def _wrap(field: Field, raw: Any) -> Mat:
        """A ``Mat`` around the backend matrix ``raw`` over ``field`` (no checks, no copy)."""
        out = _new(Mat)
        out.field = field
        out._m = raw
        return out

    # -- construction ------------------------------------------------------
    @classmethod
    def from_flat(cls, field: Field, nrows: int, ncols: int, entries: Sequence) -> Mat:
        return cls(field, field._raw_matrix(nrows, ncols, list(entries)))

    @classmethod
    def from_rows(cls, field: Field, rows: Iterable[Sequence], ncols: int | None = None) -> Mat:
        rows = [list(r) for r in rows]
        if ncols is None:
            ncols = len(rows[0]) if rows else 0
        flat = []
        for r in rows:
            if len(r) != ncols:
                raise ValueError(f"row of length {len(r)} in a matrix with {ncols} columns")
            flat.extend(field(x) for x in r)
        return cls.from_flat(field, len(rows), ncols, flat)

    @classmethod
    def zeros(cls, field: Field, nrows: int, ncols: int) -> Mat:
        if nrows == 0 or ncols == 0:  # empty matrices have no entries to change: share them
            key = (field, nrows, ncols)
            m = _EMPTY.get(key)
            if m is None:
                m = _EMPTY[key] = cls(field, field._raw_matrix(nrows, ncols, []))
            return m
        return cls(field, field._raw_matrix(nrows, ncols, []))

    @classmethod
    def identity(cls, field: Field, n: int) -> Mat:
        if n == 0:
            return cls.zeros(field, 0, 0)
        m = field._raw_matrix(n, n, [])
        one = field.one
        for i in range(n):
            m[i, i] = one
        return cls(field, m)

    @classmethod
    def unit_rows(cls, field: Field, n: int, indices: Sequence[int]) -> Mat:
        """The rows ``indices`` of the ``n x n`` identity matrix."""
        m = field._raw_matrix(len(indices), n, [])
        one = field.one
        for r, i in enumerate(indices):
            m[r, i] = one
        return cls(field, m)

    # -- shape and access ----------------------------------------------------
    @property
    def nrows(self) -> int:
        return self._m.nrows()

    @property
    def ncols(self) -> int:
        return self._m.ncols()

    @property
    def shape(self) -> tuple[int, int]:
        return (self._m.nrows(), self._m.ncols())

    def __getitem__(self, ij: tuple[int, int]) -> Any:
        return self._m[ij]

    def entries(self) -> list:
        return self._m.entries()

    def tolist(self) -> list[list[str]]:
        """Entries as strings (exact), row by row."""
        return [[str(x) for x in row] for row in self._m.tolist()]

    def raw_rows(self) -> list[list]:
        return self._m.tolist()

    def row(self, i: int) -> Mat:
        n = self.ncols
        return Mat.from_flat(self.field, 1, n, [self._m[i, j] for j in range(n)])

    def is_zero(self) -> bool:
        r, c = self.shape
        return r == 0 or c == 0 or self._m == self.field._raw_matrix(r, c, [])

    def nonzero_rows(self) -> list[int]:
        n = self.ncols
        e = self._m.entries()
        return [i for i in range(self.nrows) if any(e[i * n + j] != 0 for j in range(n))]

    def __eq__(self, other: object) -> bool:
        if not isinstance(other, Mat):
            return NotImplemented
        # flint's == (and BlockMatrix's) answers False for matrices of different shapes
        return self.field is other.field and self._m == other._m

    def backend(self) -> Any:
        """The backend matrix, for equality tests in bulk (tuples of them compare without
        a Python call per matrix): matrices over one field are equal iff their backends
        are.  Read only; never mutate it."""
        return self._m

    def __hash__(self) -> int:  # matrices are mutable in flint; hash by content
        return hash((self.field.name, self.shape, tuple(str(x) for x in self._m.entries())))

    def key(self) -> tuple:
        """A hashable exact fingerprint of the matrix."""
        return (self.shape, tuple(str(x) for x in self._m.entries()))

    def __repr__(self) -> str:
        return f"Mat({self.field}, {self.tolist()})"

    # -- arithmetic ----------------------------------------------------------
    # The hot paths: one identity test of the fields, flint's operation (which checks
    # the shapes and handles empty matrices; its ValueError is translated) and the
    # result built in place of a call to Mat(...).
    def __matmul__(self, other: Mat) -> Mat:
        field = self.field
        if other.field is not field:
            raise InternalInconsistency(f"matrices over {field} and {other.field} mixed")
        try:
            raw = self._m * other._m
        except ValueError:
            raise InternalInconsistency(f"cannot multiply {self.shape} by {other.shape}") from None
        out = _new(Mat)
        out.field = field
        out._m = raw
        return out

    def __add__(self, other: Mat) -> Mat:
        field = self.field
        if other.field is not field:
            raise InternalInconsistency(f"matrices over {field} and {other.field} mixed")
        try:
            raw = self._m + other._m
        except ValueError:
            raise InternalInconsistency(f"cannot add {self.shape} and {other.shape}") from None
        out = _new(Mat)
        out.field = field
        out._m = raw
        return out

    def __sub__(self, other: Mat) -> Mat:
        field = self.field
        if other.field is not field:
            raise InternalInconsistency(f"matrices over {field} and {other.field} mixed")
        try:
            raw = self._m - other._m
        except ValueError:
            raise InternalInconsistency(f"cannot subtract {self.shape} and {other.shape}") from None
        out = _new(Mat)
        out.field = field
        out._m = raw
        return out

    def __neg__(self) -> Mat:
        out = _new(Mat)
        out.field = self.field
        out._m = -self._m
        return out

    def scale(self, c: Any) -> Mat:
        if self.nrows == 0 or self.ncols == 0:
            return self
        return Mat._wrap(self.field, self._m * self.field(c))

    def transpose(self) -> Mat:
        out = _new(Mat)
        out.field = self.field
        out._m = self._m.transpose()
        return out

    @property
    def T(self) -> Mat:
        return self.transpose()

    # -- one-piece access over GF(p) ----------------------------------------------
    def _residues(self) -> Any:
        """The entries as an ``array("q")`` (GF(p), large matrices), else ``None``."""
        if isinstance(self.field, PrimeField) and self.nrows * self.ncols >= _BULK_MIN:
            return read_residues(self._m)
        return None

    @classmethod
    def _from_residues(cls, field: Field, nrows: int, ncols: int, buf: Any) -> Mat:
        if nrows == 0 or ncols == 0:
            return cls.zeros(field, nrows, ncols)
        M = nmod_mat_from_residues(nrows, ncols, buf, field.p)
        if M is None:  # pragma: no cover - the layout was checked when buf was read
            return cls.from_flat(field, nrows, ncols, list(buf))
        return cls(field, M)

    # -- assembly --------------------------------------------------------------
    def take_rows(self, idx: Sequence[int]) -> Mat:
        n = self.ncols
        buf = self._residues()
        if buf is not None:
            out = array("q")
            for i in idx:
                out.extend(buf[i * n : (i + 1) * n])
            return Mat._from_residues(self.field, len(idx), n, out)
        m = self._m
        if 4 * len(idx) < m.nrows():  # a few rows: read them, not the whole matrix
            flat = [m[i, j] for i in idx for j in range(n)]
        else:
            e = m.entries()
            flat = [e[i * n + j] for i in idx for j in range(n)]
        return Mat.from_flat(self.field, len(idx), n, flat)

    def split_rows(self) -> list[Mat]:
        """The rows as ``1 x ncols`` matrices (one pass over the entries)."""
        n = self.ncols
        e = self._m.entries()
        return [Mat.from_flat(self.field, 1, n, e[i * n : (i + 1) * n]) for i in range(self.nrows)]

    def take_cols(self, idx: Sequence[int]) -> Mat:
        n = self.ncols
        buf = self._residues()
        if buf is not None:
            idx = list(idx)
            out = array("q", [buf[b + j] for b in range(0, self.nrows * n, n) for j in idx])
            return Mat._from_residues(self.field, self.nrows, len(idx), out)
        m = self._m
        if 4 * len(idx) < n:
            flat = [m[i, j] for i in range(m.nrows()) for j in idx]
        else:
            e = m.entries()
            flat = [e[i * n + j] for i in range(self.nrows) for j in idx]
        return Mat.from_flat(self.field, self.nrows, len(idx), flat)

    @staticmethod
    def vstack(field: Field, mats: Sequence[Mat], ncols: int | None = None) -> Mat:
        mats = [m for m in mats]
        if ncols is None:
            if not mats:
                raise InternalInconsistency("vstack of no matrices needs ncols")
            ncols = mats[0].ncols
        if isinstance(field, PrimeField) and sum(m.nrows for m in mats) * ncols >= _BULK_MIN:
            bufs = [m._residues() if m.nrows * m.ncols >= _BULK_MIN else None for m in mats]
            out = array("q")
            for m, b in zip(mats, bufs, strict=True):
                if m.ncols != ncols:
                    raise InternalInconsistency(f"vstack: {m.ncols} columns, expected {ncols}")
                if m.nrows:
                    out.extend(b if b is not None else array("q", map(int, m._m.entries())))
            if len(out) == 0 or len(out) % ncols == 0:
                return Mat._from_residues(field, len(out) // ncols if ncols else 0, ncols, out)
        flat: list = []
        nrows = 0
        for m in mats:
            if m.ncols != ncols:
                raise InternalInconsistency(f"vstack: {m.ncols} columns, expected {ncols}")
            if m.nrows:
                flat.extend(m._m.entries())
                nrows += m.nrows
        return Mat.from_flat(field, nrows, ncols, flat)

    @staticmethod
    def hstack(field: Field, mats: Sequence[Mat], nrows: int | None = None) -> Mat:
        mats = [m for m in mats]
        if nrows is None:
            if not mats:
                raise InternalInconsistency("hstack of no matrices needs nrows")
            nrows = mats[0].nrows
        if not mats:
            return Mat.zeros(field, nrows, 0)
        return Mat.vstack(field, [m.transpose() for m in mats], nrows).transpose()

    @staticmethod
    def block_diag(field: Field, mats: Sequence[Mat]) -> Mat:
        r = sum(m.nrows for m in mats)
        c = sum(m.ncols for m in mats)
        out = field._raw_matrix(r, c, [])
        i0 = j0 = 0
        for m in mats:
            e = m._m.entries()
            n = m.ncols
            for i in range(m.nrows):
                for j in range(n):
                    x = e[i * n + j]
                    if x != 0:
                        out[i0 + i, j0 + j] = x
            i0 += m.nrows
            j0 += m.ncols
        return Mat(field, out)

    # -- linear algebra ----------------------------------------------------------
    def rref(self) -> tuple[Mat, tuple[int, ...]]:
        """Reduced row echelon form: ``(R, pivots)`` with R holding only the nonzero rows."""
        m = self._m
        r, c = m.nrows(), m.ncols()
        if r * c < _BULK_MIN:  # the small path, inlined (flint's rref handles empty matrices)
            R, rank = m.rref()
            if not rank:
                return Mat.zeros(self.field, 0, c), ()
            if rank == c:  # row i's pivot is at least i: the pivots are the first c columns
                pivots = _RANGES[rank]  # rank <= min(r, c) < 32 here
            else:
                pivots = _pivots(R, rank, c)
            out = _new(Mat)
            out.field = field = self.field
            if rank == r:
                out._m = R
            else:
                S = _SELECT.get((field, rank, r))
                out._m = (S if S is not None else _selection(field, rank, r)) * R
            return out, pivots
        R, rank = m.rref()
        # the echelon form in one piece (None unless one-piece copies work for it)
        buf = read_residues(R) if isinstance(self.field, PrimeField) else None
        if buf is not None:
            pivots = []
            j = 0
            for i in range(rank):
                base = i * c
                while buf[base + j] == 0:
                    j += 1
                pivots.append(j)
                j += 1
            if rank == r:
                return Mat(self.field, R), tuple(pivots)
            return Mat._from_residues(self.field, rank, c, buf[: rank * c]), tuple(pivots)
        return _small_echelon(self.field, R, rank, r, c)

    def echelon_pivots(self) -> tuple[int, ...]:
        """Pivot columns of a matrix already in reduced echelon form (no elimination)."""
        c = self.ncols
        e = self._m.entries()
        piv = []
        j = 0
        for i in range(self.nrows):
            while j < c and e[i * c + j] == 0:
                j += 1
            if j == c:
                raise InternalInconsistency("echelon_pivots: a zero row")
            piv.append(j)
            j += 1
        return tuple(piv)

    def rank(self) -> int:
        return self._m.rank()  # flint answers 0 for empty matrices

    def right_kernel(self) -> Mat:
        """Rows forming a basis of ``{x : A x^T = 0}`` (exactly nullity rows).

        The basis is the one read off the reduced echelon form: one row per
        free (non-pivot) column ``f``, with 1 at ``f``, ``-R[i, f]`` at the
        pivot column of row ``i`` and 0 elsewhere, rows in increasing ``f``.
        """
        m = self._m
        r, c = m.nrows(), m.ncols()
        if c == 0:
            return Mat.zeros(self.field, 0, 0)
        if r == 0:
            return Mat.identity(self.field, c)
        field = self.field
        if r * c < _BULK_MIN:
            if isinstance(field, PrimeField):
                # flint's nullspace is this basis, as the first ``nullity`` columns
                X, nullity = m.nullspace()
                if not nullity:
                    return Mat.zeros(field, 0, c)
                X = X.transpose()
                if nullity < c:
                    S = _SELECT.get((field, nullity, c))
                    X = (S if S is not None else _selection(field, nullity, c)) * X
                out = _new(Mat)
                out.field = field
                out._m = X
                return out
            # the zero rows of flint's echelon form need not be dropped
            Rm, rank = m.rref()
            if rank == c:
                return Mat.zeros(field, 0, c)
            piv = _pivots(Rm, rank, c)
            if isinstance(field, RationalField):
                return Mat._wrap(field, _rational_kernel(field, Rm, piv, r, c))
        else:
            R, piv = self.rref()
            Rm = R._m
        if len(piv) == c:
            return Mat.zeros(self.field, 0, c)
        ps = set(piv)
        free = [j for j in range(c) if j not in ps]
        basis = self.field._raw_matrix(len(free), c, [])
        for k, f in enumerate(free):
            basis[k, f] = 1  # flint converts the integer (cheaper than a field element)
        for i, p in enumerate(piv):
            for k, f in enumerate(free):
                if f > p:  # entries left of a pivot are zero
                    x = Rm[i, f]
                    if x != 0:
                        basis[k, p] = -x
        return Mat(self.field, basis)

    def left_kernel(self) -> Mat:
        """Rows forming a basis of ``{x : x @ A = 0}``."""
        return self.transpose().right_kernel()

    def solve_left(self, b: Mat) -> Mat | None:
        """Some ``X`` with ``X @ self == b``, or ``None`` when there is none."""
        # X A = B  <=>  A^T X^T = B^T
        if b.field is not self.field:
            raise InternalInconsistency(f"matrices over {self.field} and {b.field} mixed")
        m, bm = self._m, b._m
        n = m.nrows()
        if n and n == m.ncols() and not isinstance(m, BlockMatrix):
            # a square system: flint's solver answers unless the matrix is singular, and
            # then the solution is unique (the one the echelon form below would give)
            try:
                X = m.transpose().solve(bm.transpose())
            except ZeroDivisionError:
                pass
            except ValueError:  # flint checks the shape of the right-hand side
                raise InternalInconsistency("solve_left: column counts differ") from None
            else:
                out = _new(Mat)
                out.field = self.field
                out._m = X.transpose()
                return out
        if bm.ncols() != m.ncols():
            raise InternalInconsistency("solve_left: column counts differ")
        nb = bm.nrows()
        if nb == 0:
            return Mat.zeros(self.field, 0, n)
        if n == 0:
            return Mat.zeros(self.field, nb, 0) if b.is_zero() else None
        aug = Mat.hstack(self.field, [self.transpose(), b.transpose()])
        R, piv = aug.rref()
        if any(p >= n for p in piv):
            return None
        X = self.field._raw_matrix(n, b.nrows, [])
        c = aug.ncols
        Re = R._m.entries()
        for i, p in enumerate(piv):
            for k in range(b.nrows):
                X[p, k] = Re[i * c + n + k]
        return Mat(self.field, X).transpose()

    def inverse(self) -> Mat:
        try:  # flint (and BlockMatrix) check squareness; a 0 x 0 matrix is its own inverse
            raw = self._m.inv()
        except ValueError:
            raise InternalInconsistency("inverse of a non-square matrix") from None
        out = _new(Mat)
        out.field = self.field
        out._m = raw
        return out


# -- small echelon forms ---------------------------------------------------------------


_KERNEL_PIECES: dict[tuple, tuple[Any, Any]] = {}  # (r, c, pivots) -> (E_F, Q) over QQ
_KERNEL_PIECES_MAX = 4096


def _rational_kernel(field: Field, R: Any, piv: tuple[int, ...], r: int, c: int) -> Any:
    """The kernel basis of :meth:`Mat.right_kernel` from flint's echelon form ``R`` over QQ.

    With ``Q`` the ``r x c`` matrix sending row ``i`` to the unit row of the
    pivot ``piv[i]``, row ``j`` of ``I - R^T Q`` is ``e_j - sum_i R[i, j] e_piv[i]``:
    zero at a pivot column and the basis row of a free column ``j``.  So the
    basis is ``E_F - (E_F R^T) Q`` with ``E_F`` the unit rows of the free
    columns -- three flint operations on matrices cached per shape and pivots,
    measured 1.6x (2 x 2) to 2.5x (12 x 12) faster than reading the entries of
    ``R`` into a list and building the basis from it (flint has no kernel over QQ).
    """
    key = (r, c, piv)
    pieces = _KERNEL_PIECES.get(key)
    if pieces is None:
        ps = set(piv)
        free = [j for j in range(c) if j not in ps]
        E = field._raw_matrix(len(free), c, [])
        for k, f in enumerate(free):
            E[k, f] = 1
        Q = field._raw_matrix(r, c, [])
        for i, p in enumerate(piv):
            Q[i, p] = 1
        pieces = (E, Q)
        if c <= _SELECT_MAX and len(_KERNEL_PIECES) < _KERNEL_PIECES_MAX:
            _KERNEL_PIECES[key] = pieces
    E, Q = pieces
    return E - (E * R.transpose()) * Q


_SELECT: dict[tuple, Any] = {}  # (field, k, n) -> the first k rows of the n x n identity (flint)
_SELECT_MAX = 64


def _selection(field: Field, k: int, n: int) -> Any:
    """The first ``k`` rows of the ``n x n`` identity as a flint matrix (cached; never mutated).

    Multiplying by it keeps the first ``k`` rows of a matrix inside flint: on
    matrices of a few hundred entries a product is several times cheaper than
    reading the rows out and building a new matrix from Python objects.
    """
    key = (field, k, n)
    S = _SELECT.get(key)
    if S is None:
        S = field._raw_matrix(k, n, [])
        for i in range(k):
            S[i, i] = 1
        if n <= _SELECT_MAX:
            _SELECT[key] = S
    return S


_RANGES = [tuple(range(k)) for k in range(_SELECT_MAX + 1)]


def _pivots(R: Any, rank: int, c: int) -> tuple[int, ...]:
    """The pivot columns of a flint reduced echelon form ``R`` of rank ``rank``."""
    # entries are tested by truth value (comparing with 0 converts the 0 first)
    if rank <= _SELECT_MAX and (rank == c or (rank and R[rank - 1, rank - 1])):
        # row i's pivot is at least i, so a nonzero at (rank-1, rank-1) pins them all
        return _RANGES[rank]
    piv = []
    j = 0
    for i in range(rank):
        while not R[i, j]:
            j += 1
        piv.append(j)
        j += 1
    return tuple(piv)


def _small_echelon(field: Field, R: Any, rank: int, r: int, c: int) -> tuple[Mat, tuple[int, ...]]:
    """``(nonzero rows, pivots)`` of flint's reduced echelon form ``R`` of rank ``rank``.

    The pivot of row ``i`` is its first nonzero entry; a row's entries left of
    its pivot are zero, so the scan reads at most ``rank + c`` entries.  When
    the pivots are the first ``rank`` columns (full column rank, or a nonzero
    entry at ``(rank - 1, rank - 1)``) one read suffices.
    """
    pivots = _pivots(R, rank, c)
    if rank == r:
        return Mat(field, R), pivots
    if not rank:
        return Mat.zeros(field, 0, c), pivots
    if r * c < _BULK_MIN:  # a product costs rank * r * c: only for small matrices
        return Mat(field, _selection(field, rank, r) * R), pivots
    return Mat(field, R).take_rows(range(rank)), pivots


# -- subspaces (row spaces) ------------------------------------------------------


def echelon(A: Mat) -> Mat:
    """Canonical basis (reduced echelon rows) of the row space of ``A``."""
    return A.rref()[0]


def subspace_sum(field: Field, n: int, spaces: Sequence[Mat]) -> Mat:
    """Echelon basis of the sum of row spaces (each with ``n`` columns)."""
    return echelon(Mat.vstack(field, list(spaces), n))


def intersection(U: Mat, W: Mat) -> Mat:
    """Echelon basis of the intersection of the row spaces of ``U`` and ``W``.

    >>> from hwcat.exact import QQ, Mat
    >>> U = Mat.from_rows(QQ, [[1, 0, 0], [0, 1, 0]])
    >>> W = Mat.from_rows(QQ, [[0, 1, 1], [0, 0, 1]])
    >>> intersection(U, W).tolist()
    [['0', '1', '0']]
    """
    F, n = U.field, U.ncols
    if U.nrows == 0 or W.nrows == 0:
        return Mat.zeros(F, 0, n)
    # x U = y W  <=> (x, -y) [U; W] = 0
    K = Mat.vstack(F, [U, W]).left_kernel()
    if K.nrows == 0:
        return Mat.zeros(F, 0, n)
    return echelon(K.take_cols(range(U.nrows)) @ U)


def complement(U: Mat, n: int | None = None) -> Mat:
    """Unit rows spanning a complement of the row space of ``U``."""
    n = U.ncols if n is None else n
    _, piv = U.rref()
    ps = set(piv)
    return Mat.unit_rows(U.field, n, [j for j in range(n) if j not in ps])


def contains(U: Mat, v: Mat) -> bool:
    """Whether every row of ``v`` lies in the row space of ``U``."""
    if v.nrows == 0:
        return True
    return Mat.vstack(U.field, [U, v], U.ncols).rank() == U.rank()


def quotient_map(U: Mat, n: int | None = None) -> tuple[Mat, Mat, tuple[int, ...]]:
    """Projection onto ``k^n / rowspace(U)``.

    Returns ``(pi, section, kept)``: ``pi`` is ``n x q`` (the projection in the
    basis of the kept coordinates), ``section`` is ``q x n`` (unit rows of the
    kept coordinates, with ``section @ pi`` the identity) and ``kept`` lists
    the coordinates that survive (the non-pivot columns of the echelon form).
    """
    F = U.field
    n = U.ncols if n is None else n
    R, piv = U.rref() if U.nrows else (Mat.zeros(F, 0, n), ())
    ps = set(piv)
    kept = tuple(j for j in range(n) if j not in ps)
    q = len(kept)
    pi = F._raw_matrix(n, q, [])
    one = F.one
    for k, j in enumerate(kept):
        pi[j, k] = one
    Re = R._m.entries()
    for i, p in enumerate(piv):
        for k, j in enumerate(kept):
            x = Re[i * n + j]
            if x != 0:
                pi[p, k] = -x
    return Mat(F, pi), Mat.unit_rows(F, n, kept), kept


def select_independent_rows(A: Mat, basis: Mat | None = None) -> list[int]:
    """Greedy choice of rows of ``A`` independent of each other and of ``basis``.

    Scans the rows in order and keeps each row not in the span of ``basis``
    and the rows kept before it.
    """
    F = A.field
    if A.nrows == 0:
        return []
    b = 0 if basis is None else basis.nrows
    stacked = A if basis is None or b == 0 else Mat.vstack(F, [basis, A])
    _, piv = stacked.transpose().rref()
    return [p - b for p in piv if p >= b]


def assemble(field: Field, nrows: int, ncols: int, blocks: Iterable[tuple[int, int, Mat]]) -> Mat:
    """A ``nrows x ncols`` matrix that is zero except for the given blocks.

    ``blocks`` holds ``(row offset, column offset, matrix)``; blocks must not overlap.
    """
    flat = [field.zero] * (nrows * ncols)
    for i0, j0, m in blocks:
        r, c = m.shape
        if r == 0 or c == 0:
            continue
        e = m._m.entries()
        for i in range(r):
            base = (i0 + i) * ncols + j0
            flat[base : base + c] = e[i * c : (i + 1) * c]
    return Mat.from_flat(field, nrows, ncols, flat)
