"""Univariate polynomials over the exact fields, and matrix helpers built on them.

:class:`Poly` wraps flint's ``fmpq_poly`` (over QQ) or ``nmod_poly`` (over
GF(p)) together with its :class:`~hwcat.exact.fields.Field`, so that the
layers above factor minimal polynomials and build idempotents (Chinese
remainder polynomials) without touching python-flint.

The module also holds the few matrix helpers that need flint directly:
:func:`sparse_matrix` (assembly from a dictionary of entries),
:func:`select_columns`, and :func:`lifted_power_trace`, the trace of a
``p^i``-th power of an integer lift taken modulo ``p^(i+1)``.

Examples
--------
>>> from hwcat.exact import GF, QQ
>>> f = Poly.from_coeffs(GF(7), [1, 0, 1])          # x^2 + 1
>>> [(str(g), e) for g, e in f.factor()]            # irreducible mod 7
[('x^2 + 1', 1)]
>>> [(str(g), e) for g, e in Poly.from_coeffs(GF(5), [1, 0, 1]).factor()]
[('x + 2', 1), ('x + 3', 1)]
>>> facs = Poly.from_coeffs(QQ, [-1, 0, 1]).factor()     # x^2 - 1
>>> [(str(g), str(pi)) for (g, _), pi in zip(facs, fitting_polynomials(facs))]
[('x + (-1)', '1/2*x + 1/2'), ('x + 1', '(-1/2)*x + 1/2')]
"""

from __future__ import annotations

from array import array
from collections.abc import Iterable, Mapping, Sequence
from typing import Any

import flint

from hwcat.errors import InternalInconsistency
from hwcat.exact.fields import Field, PrimeField
from hwcat.exact.matrices import Mat
from hwcat.exact.nmod_bulk import bulk_available, nmod_mat_from_residues, nmod_mat_gather

_BULK_MIN = 4096

__all__ = [
    "Poly",
    "fitting_polynomials",
    "matrix_from_ints",
    "matrix_from_residues",
    "matrix_by_gather",
    "sparse_matrix",
    "select_columns",
    "select_rows",
    "lifted_power_trace",
    "charpoly",
    "minpoly",
    "evaluate",
    "fast_rref",
    "fast_left_kernel",
]


class Poly:
    """A polynomial over an exact field (coefficients listed from degree 0 up)."""

    __slots__ = ("field", "_p")

    def __init__(self, field: Field, raw: Any) -> None:
        self.field = field
        self._p = raw

    @classmethod
    def from_coeffs(cls, field: Field, coeffs: Sequence[Any]) -> Poly:
        """The polynomial ``sum coeffs[i] x^i`` (coefficients converted into ``field``)."""
        vals = [field(c) if not isinstance(c, int) else c for c in coeffs]
        if getattr(field, "degree", 1) > 1:  # an extension field
            from hwcat.exact.extpoly import ExtPoly

            return cls(field, ExtPoly(field, vals))
        if isinstance(field, PrimeField):
            return cls(field, flint.nmod_poly([int(field(c)) for c in vals], field.p))
        return cls(field, flint.fmpq_poly([field(c) for c in vals]))

    @classmethod
    def x(cls, field: Field) -> Poly:
        return cls.from_coeffs(field, [0, 1])

    @classmethod
    def constant(cls, field: Field, c: Any) -> Poly:
        return cls.from_coeffs(field, [c])

    def _wrap(self, raw: Any) -> Poly:
        return Poly(self.field, raw)

    def _check(self, other: Poly) -> None:
        if other.field is not self.field:
            raise InternalInconsistency(f"polynomials over {self.field} and {other.field} mixed")

    # -- data ------------------------------------------------------------------
    @property
    def degree(self) -> int:
        """The degree; ``-1`` for the zero polynomial."""
        return int(self._p.degree())

    def coeffs(self) -> list[Any]:
        """Coefficients as field elements, degree 0 first (empty for zero)."""
        if self.degree < 0:
            return []
        return [self.field(c) for c in self._p.coeffs()]

    def is_zero(self) -> bool:
        return self.degree < 0

    def leading(self) -> Any:
        return self.field(self._p.coeffs()[-1])

    def monic(self) -> Poly:
        if self.is_zero():
            return self
        return self._wrap(self._p * (self.field.one / self.leading()))

    def __eq__(self, other: object) -> bool:
        if not isinstance(other, Poly):
            return NotImplemented
        return self.field is other.field and self._p == other._p

    def __hash__(self) -> int:
        return hash((self.field.name, str(self._p)))

    def __repr__(self) -> str:
        return f"Poly({self.field}, {self._p})"

    def __str__(self) -> str:
        return str(self._p)

    # -- arithmetic --------------------------------------------------------------
    def __add__(self, other: Poly) -> Poly:
        self._check(other)
        return self._wrap(self._p + other._p)

    def __sub__(self, other: Poly) -> Poly:
        self._check(other)
        return self._wrap(self._p - other._p)

    def __mul__(self, other: Poly) -> Poly:
        self._check(other)
        return self._wrap(self._p * other._p)

    def __pow__(self, e: int) -> Poly:
        return self._wrap(self._p**e)

    def __mod__(self, other: Poly) -> Poly:
        self._check(other)
        return self._wrap(self._p % other._p)

    def __floordiv__(self, other: Poly) -> Poly:
        self._check(other)
        return self._wrap(self._p // other._p)

    def scale(self, c: Any) -> Poly:
        return self._wrap(self._p * self.field(c))

    def xgcd(self, other: Poly) -> tuple[Poly, Poly, Poly]:
        """``(g, s, t)`` with ``g = s*self + t*other`` the monic gcd."""
        self._check(other)
        g, s, t = self._p.xgcd(other._p)
        return self._wrap(g), self._wrap(s), self._wrap(t)

    def factor(self) -> list[tuple[Poly, int]]:
        """Monic irreducible factors with multiplicities, in flint's order."""
        if self.degree < 1:
            return []
        _, facs = self._p.factor()
        out = []
        for g, e in facs:
            w = self._wrap(g)
            out.append((w.monic(), int(e)))
        return out


def fitting_polynomials(factors: Sequence[tuple[Poly, int]]) -> list[Poly]:
    """The Chinese remainder idempotents of ``prod g_k^(e_k)``.

    For the factorisation ``mu = prod_k g_k^(e_k)`` into powers of distinct
    monic irreducibles, returns ``pi_k`` of degree below ``deg mu`` with
    ``pi_k = 1 mod g_k^(e_k)`` and ``pi_k = 0 mod g_l^(e_l)`` for ``l != k``.
    Evaluated at an element ``z`` with minimal polynomial ``mu`` they give the
    orthogonal idempotents projecting onto the generalised eigenspaces
    (Fitting's decomposition); they sum to 1.
    """
    if not factors:
        return []
    F = factors[0][0].field
    powers = [g**e for g, e in factors]
    mu = Poly.constant(F, 1)
    for q in powers:
        mu = mu * q
    out = []
    for q in powers:
        rest = mu // q
        g, s, t = q.xgcd(rest)
        if g.degree != 0:
            raise InternalInconsistency("fitting_polynomials: factors are not coprime")
        pi = (t * rest).scale(F.one / g.leading()) % mu
        out.append(pi)
    return out


# -- matrix helpers that need flint ------------------------------------------------


def matrix_from_residues(field: PrimeField, nrows: int, ncols: int, buf: Any) -> Mat:
    """A dense matrix over GF(p) from a writable buffer of int64 residues in ``[0, p)``
    (row-major: an ``array("q")`` or a numpy int64 array), copied in one piece."""
    p = field.p
    if nrows and ncols and nrows * ncols >= _BULK_MIN:
        M = nmod_mat_from_residues(nrows, ncols, buf, p)
        if M is not None:
            return Mat(field, M)
    vals = buf.tolist() if hasattr(buf, "tolist") else list(buf)
    return (
        Mat(field, flint.nmod_mat(nrows, ncols, vals, p))
        if nrows and ncols
        else Mat.zeros(field, nrows, ncols)
    )


def matrix_by_gather(field: PrimeField, values: Any, index: Any, out: Mat | None = None) -> Mat:
    """The matrix ``values[index]`` over GF(p) (numpy: ``values`` int64 residues in
    ``[0, p)``, ``index`` a two-dimensional array of positions), written into the entries
    of ``out`` when given (a matrix of that shape over ``field`` that the caller gives up:
    it must not be used again except through the result)."""
    r, c = index.shape
    if r and c and bulk_available():
        M = nmod_mat_gather(values, index, field.p, None if out is None else out._m)
        if M is not None:
            return Mat(field, M)
    return matrix_from_residues(field, r, c, values[index].ravel())


def matrix_from_ints(field: Field, nrows: int, ncols: int, values: Sequence[Any]) -> Mat:
    """A dense matrix from a flat row-major list: Python ints over GF(p) (reduced here),
    field elements over QQ.  Skips the per-entry conversion of ``Mat.from_flat``."""
    if nrows == 0 or ncols == 0:
        return Mat.zeros(field, nrows, ncols)
    if isinstance(field, PrimeField):
        p = field.p
        if nrows * ncols >= _BULK_MIN and p < 2**63 and bulk_available():
            # flint's list constructor converts entry by entry (about a microsecond each);
            # residues packed into an int64 array are copied in one piece
            return matrix_from_residues(field, nrows, ncols, array("q", [v % p for v in values]))
        return Mat(field, flint.nmod_mat(nrows, ncols, values, p))
    if getattr(field, "degree", 1) > 1:  # an extension field
        return Mat.from_flat(field, nrows, ncols, values)
    return Mat(field, flint.fmpq_mat(nrows, ncols, values))


def sparse_matrix(
    field: Field, nrows: int, ncols: int, entries: Mapping[tuple[int, int], Any] | Iterable
) -> Mat:
    """A matrix that is zero except for ``entries`` (``{(i, j): value}`` or pairs).

    Cheaper than a dense list when few entries are nonzero.
    """
    raw = field._raw_matrix(nrows, ncols, [])
    items = entries.items() if isinstance(entries, Mapping) else entries
    for (i, j), v in items:
        x = field(v) if not isinstance(v, int) else field._from_int(v)
        if x != 0:
            raw[i, j] = x
    return Mat(field, raw)


def select_columns(M: Mat, cols: Sequence[int]) -> Mat:
    """The columns ``cols`` of ``M`` (by one product with a 0/1 matrix)."""
    if not cols:
        return Mat.zeros(M.field, M.nrows, 0)
    S = sparse_matrix(M.field, M.ncols, len(cols), {(c, k): 1 for k, c in enumerate(cols)})
    return M @ S


def select_rows(M: Mat, rows: Sequence[int]) -> Mat:
    """The rows ``rows`` of ``M`` (by one product with a 0/1 matrix)."""
    if not rows:
        return Mat.zeros(M.field, 0, M.ncols)
    S = sparse_matrix(M.field, len(rows), M.nrows, {(k, r): 1 for k, r in enumerate(rows)})
    return S @ M


def lifted_power_trace(M: Mat, i: int) -> int:
    """``Tr(L^(p^i)) mod p^(i+1)`` for an integer lift ``L`` of a square matrix over GF(p).

    The value depends only on ``M`` (not on the lift): in the expansion of
    ``(L + pN)^(p^i)`` every word with ``k >= 1`` letters ``pN`` lies in a
    cyclic class of size divisible by ``p^(i - v)``, ``p^v | k``, so its trace
    contribution is divisible by ``p^(i+1)``.  Only matrix products are used
    modulo the prime power.

    >>> from hwcat.exact import GF
    >>> lifted_power_trace(Mat.identity(GF(2), 2), 1)   # Tr(I^2) = 2 mod 4
    2
    """
    F = M.field
    if not isinstance(F, PrimeField):
        raise InternalInconsistency("lifted_power_trace needs a prime field")
    n = M.nrows
    if n == 0:
        return 0
    p = F.p
    mod = p ** (i + 1)
    if mod >= 1 << 63:
        raise InternalInconsistency(f"lifted_power_trace: modulus {p}^{i + 1} is too large")
    X = flint.nmod_mat(n, n, [int(x) for x in M.entries()], mod)
    e = p**i
    R = None
    base = X
    while e:
        if e & 1:
            R = base if R is None else R * base
        e >>= 1
        if e:
            base = base * base
    ent = R.entries()
    return sum(int(ent[k * n + k]) for k in range(n)) % mod


# -- characteristic and minimal polynomials of matrices ----------------------------------


def charpoly(M: Mat) -> Poly:
    """The characteristic polynomial ``det(x - M)`` of a square matrix.

    >>> from hwcat.exact import QQ
    >>> str(charpoly(Mat.from_rows(QQ, [[1, 1], [0, 1]])))
    'x^2 + (-2)*x + 1'
    """
    if M.nrows != M.ncols:
        raise InternalInconsistency("charpoly of a non-square matrix")
    if M.nrows == 0:
        return Poly.constant(M.field, 1)
    if getattr(M.field, "degree", 1) > 1:  # extension fields: no flint charpoly
        return Poly.from_coeffs(M.field, hessenberg_charpoly(M.field, M.tolist()))
    return Poly(M.field, M._m.charpoly())


def hessenberg_charpoly(F: Field, rows: Sequence[Sequence[Any]]) -> list[Any]:
    """Coefficients (degree 0 up) of ``det(x - A)`` by reduction to Hessenberg form
    and the recurrence for its leading principal minors, ``O(n^3)`` field
    operations over any exact field (common practice)."""
    a = [[F(x) for x in r] for r in rows]
    n = len(a)
    zero = F.zero
    for m in range(1, n - 1):
        i = next((i for i in range(m, n) if a[i][m - 1] != zero), None)
        if i is None:
            continue
        if i != m:
            a[i], a[m] = a[m], a[i]
            for r in a:
                r[i], r[m] = r[m], r[i]
        t = a[m][m - 1]
        for i in range(m + 1, n):
            if a[i][m - 1] == zero:
                continue
            u = a[i][m - 1] / t
            ri, rm = a[i], a[m]
            for j in range(n):
                ri[j] = ri[j] - u * rm[j]
            for r in a:
                r[m] = r[m] + u * r[i]
    # p_k = (x - h_kk) p_{k-1} - sum_{i<k} h_ik (prod_{i<j<=k} h_{j,j-1}) p_{i-1}
    polys: list[list[Any]] = [[F.one]]
    for k in range(n):
        prev = polys[-1]
        cur = [zero] + prev  # x * p_{k-1}
        for d, c in enumerate(prev):
            cur[d] = cur[d] - a[k][k] * c
        t = F.one
        for i in range(k - 1, -1, -1):
            t = t * a[i + 1][i]
            if t == zero:
                break
            c = a[i][k] * t
            if c != zero:
                for d, x in enumerate(polys[i]):
                    cur[d] = cur[d] - c * x
        polys.append(cur)
    return polys[-1]


def minpoly(M: Mat) -> Poly:
    """The minimal polynomial (monic) of a square matrix.

    >>> from hwcat.exact import GF
    >>> str(minpoly(Mat.identity(GF(5), 3)))
    'x + 4'
    """
    if M.nrows != M.ncols:
        raise InternalInconsistency("minpoly of a non-square matrix")
    if M.nrows == 0:
        return Poly.constant(M.field, 1)
    if getattr(M.field, "degree", 1) > 1:
        # extension fields: for each irreducible factor f^e of the characteristic
        # polynomial the exponent in the minimal polynomial is the first k with
        # nullity f(M)^k = e deg f (common practice)
        out = Poly.constant(M.field, 1)
        n = M.nrows
        for f, e in charpoly(M).factor():
            F = evaluate(f, M)
            P = F
            k = 1
            while n - P.rank() < e * f.degree:
                P = P @ F
                k += 1
            out = out * f**k
        return out.monic()
    return Poly(M.field, M._m.minpoly()).monic()


def evaluate(f: Poly, M: Mat) -> Mat:
    """``f(M)`` for a square matrix ``M`` (Horner's rule)."""
    F = M.field
    n = M.nrows
    out = Mat.zeros(F, n, n)
    ident = Mat.identity(F, n)
    for c in reversed(f.coeffs()):
        out = out @ M + ident.scale(c)
    return out


def fast_rref(M: Mat) -> tuple[Mat, tuple[int, ...]]:
    """:meth:`Mat.rref` without converting every entry: pivots are found by element
    access along the echelon staircase, and rows are cut by one product."""
    r, c = M.shape
    if r == 0 or c == 0:
        return Mat.zeros(M.field, 0, c), ()
    R, rank = M._m.rref()
    pivots = []
    j = 0
    for i in range(rank):
        while R[i, j] == 0:
            j += 1
        pivots.append(j)
        j += 1
    out = Mat(M.field, R)
    if rank < r:
        out = select_rows(out, list(range(rank))) if rank else Mat.zeros(M.field, 0, c)
    return out, tuple(pivots)


def fast_left_kernel(M: Mat) -> Mat:
    """Rows spanning ``{x : x @ M = 0}`` (flint's nullspace over GF(p))."""
    F = M.field
    r, c = M.shape
    if not isinstance(F, PrimeField) or r == 0 or c == 0:
        return M.left_kernel()
    X, nullity = M._m.transpose().nullspace()
    if nullity == 0:
        return Mat.zeros(F, 0, r)
    return select_rows(Mat(F, X.transpose()), list(range(nullity)))
