"""Dense matrices over an :class:`~hwcat.exact.extension.ExtensionField`.

A :class:`BlockMatrix` ``M`` over ``K = F[t]/(f)`` (degree ``d``) is stored as
its ``d`` coefficient planes ``M = M_0 + M_1 t + ... + M_(d-1) t^(d-1)``, each a
flint matrix over the base field ``F``.  It offers the operations
:class:`~hwcat.exact.matrices.Mat` asks of its backend (the shape of flint's
``nmod_mat``/``fmpq_mat``) and does all of them with flint over ``F``:

* sum, negation, transpose: plane by plane;
* product: ``d^2`` products of planes, then ``t^m`` (``m >= d``) is reduced
  with the defining polynomial -- ``d^2`` times the base-field work;
* rank, reduced echelon form, inverse: on the block matrix ``[M]``
  (``rd x cd``, block ``(i, j)`` the matrix of ``v -> v M_ij``), built as
  ``sum_k (M_k (x) I_d)(I_c (x) [t^k])`` by products with 0/1 matrices; its
  echelon form holds the coefficient rows of the echelon form of ``M`` at the
  rows whose pivot is the first coordinate of a block (see
  :mod:`hwcat.exact.extension`) -- ``d^3`` times the base-field elimination.

Only reading or writing single entries converts to and from field elements.
"""

from __future__ import annotations

from typing import Any

from hwcat.errors import InternalInconsistency

__all__ = ["BlockMatrix"]


class BlockMatrix:
    """An ``r x c`` matrix over an extension field, stored as ``d`` planes over the base."""

    __slots__ = ("K", "r", "c", "P", "_e")

    def __init__(self, K: Any, r: int, c: int, entries: list | None = None, planes=None) -> None:
        self.K, self.r, self.c = K, r, c
        self._e = None
        base, d = K.base, K.degree
        if planes is not None:
            self.P = planes
        elif entries is None:
            self.P = [base._raw_matrix(r, c, []) for _ in range(d)]
        else:
            if len(entries) != r * c:
                raise InternalInconsistency(f"{len(entries)} entries for a {r} x {c} matrix")
            cols: list[list] = [[] for _ in range(d)]
            zero = 0
            for x in entries:
                if x:
                    cs = x.coeffs()
                    for k in range(d):
                        cols[k].append(cs[k])
                else:
                    for k in range(d):
                        cols[k].append(zero)
            self.P = [
                base._raw_matrix(r, c, cols[k]) if r and c else base._raw_matrix(r, c, [])
                for k in range(d)
            ]
            self._e = list(entries)

    def _new(self, r: int, c: int, planes: list) -> BlockMatrix:
        return BlockMatrix(self.K, r, c, planes=planes)

    # -- flint-like interface ------------------------------------------------
    def nrows(self) -> int:
        return self.r

    def ncols(self) -> int:
        return self.c

    def entries(self) -> list:
        if self._e is None:
            K = self.K
            if self.r == 0 or self.c == 0:
                self._e = []
            else:
                planes = [p.entries() for p in self.P]
                self._e = [K.from_coeffs(cs) for cs in zip(*planes, strict=True)]
        return list(self._e)

    def tolist(self) -> list[list]:
        e, c = self.entries(), self.c
        return [e[i * c : (i + 1) * c] for i in range(self.r)]

    def __getitem__(self, ij: tuple[int, int]) -> Any:
        i, j = ij
        if self._e is not None:
            return self._e[i * self.c + j]
        return self.K.from_coeffs([p[i, j] for p in self.P])

    def __setitem__(self, ij: tuple[int, int], v: Any) -> None:
        i, j = ij
        x = self.K(v)
        for p, a in zip(self.P, x.coeffs(), strict=True):
            p[i, j] = a
        if self._e is not None:
            self._e[i * self.c + j] = x

    def __eq__(self, other: object) -> bool:
        if not isinstance(other, BlockMatrix):
            return NotImplemented
        return (
            self.K is other.K
            and (self.r, self.c) == (other.r, other.c)
            and all(a == b for a, b in zip(self.P, other.P, strict=True))
        )

    def __hash__(self) -> int:  # pragma: no cover - mutable, never hashed
        raise TypeError("BlockMatrix is not hashable")

    def __add__(self, o: BlockMatrix) -> BlockMatrix:
        return self._new(self.r, self.c, [a + b for a, b in zip(self.P, o.P, strict=True)])

    def __sub__(self, o: BlockMatrix) -> BlockMatrix:
        return self._new(self.r, self.c, [a - b for a, b in zip(self.P, o.P, strict=True)])

    def __neg__(self) -> BlockMatrix:
        return self._new(self.r, self.c, [-a for a in self.P])

    def transpose(self) -> BlockMatrix:
        return self._new(self.c, self.r, [a.transpose() for a in self.P])

    def __mul__(self, o: Any) -> BlockMatrix:
        K = self.K
        if not isinstance(o, BlockMatrix):
            s = K(o)
            return self._new(
                self.r,
                self.c,
                self._reduce([[a * b for b in s.coeffs()] for a in self.P], self.r, self.c),
            )
        if self.c != o.r:
            raise InternalInconsistency(f"cannot multiply {self.r}x{self.c} by {o.r}x{o.c}")
        if self.r == 0 or o.c == 0 or self.c == 0:
            return BlockMatrix(K, self.r, o.c)
        return self._new(
            self.r, o.c, self._reduce([[a * b for b in o.P] for a in self.P], self.r, o.c)
        )

    def _reduce(self, table: list[list], r: int, c: int) -> list:
        """Planes of ``sum_(k, l) table[k][l] t^(k+l)`` reduced modulo the defining polynomial."""
        K = self.K
        d = K.degree
        acc: list = [None] * (2 * d - 1)
        for k, row in enumerate(table):
            for m, x in enumerate(row):
                acc[k + m] = x if acc[k + m] is None else acc[k + m] + x
        out = [acc[n] if acc[n] is not None else K.base._raw_matrix(r, c, []) for n in range(d)]
        for m in range(d, 2 * d - 1):
            if acc[m] is None:
                continue
            for n, a in enumerate(K._xpow_coeffs(m)):
                if a != 0:
                    out[n] = out[n] + acc[m] * a
        return out

    def rref(self) -> tuple[BlockMatrix, int]:
        d, c = self.K.degree, self.c
        if self.r == 0 or c == 0:
            return BlockMatrix(self.K, self.r, c), 0
        R, rank = self._blowup().rref()
        E = R.entries()
        w = c * d
        rows = []
        j = 0
        for i in range(rank):
            while E[i * w + j] == 0:
                j += 1
            if j % d == 0:
                rows.append(i)
            j += 1
        if len(rows) * d != rank:
            raise InternalInconsistency("echelon form over the extension: rank not a multiple of d")
        out = self._decode(R, rows, c, pad_to=self.r)
        return out, len(rows)

    def rank(self) -> int:
        if self.r == 0 or self.c == 0:
            return 0
        return self._blowup().rank() // self.K.degree

    def inv(self) -> BlockMatrix:
        if self.r != self.c:
            raise InternalInconsistency("inverse of a non-square matrix")
        try:
            B = self._blowup().inv()
        except ZeroDivisionError:
            raise ZeroDivisionError("matrix is singular") from None
        d = self.K.degree
        return self._decode(B, [i * d for i in range(self.r)], self.c)

    # -- the block matrix over the base ------------------------------------------
    def _blowup(self) -> Any:
        """``[M]``: ``rd x cd`` over the base, block ``(i, j)`` the matrix of ``v -> v M_ij``."""
        K = self.K
        d, r, c = K.degree, self.r, self.c
        base = K.base
        # M_k (x) I_d = sum_a S_r(a) M_k S_c(a)^T with S_n(a): n d x n, ((i, a), i) -> 1
        Sr = [_spread(base, r, d, a) for a in range(d)]
        ScT = [_spread(base, c, d, a).transpose() for a in range(d)]
        out = None
        zero = base._raw_matrix(r, c, [])
        for k, Mk in enumerate(self.P):
            if Mk == zero:
                continue
            big = None
            for a in range(d):
                term = Sr[a] * Mk * ScT[a]
                big = term if big is None else big + term
            term = big * K._diag_power(c, k)
            out = term if out is None else out + term
        if out is None:
            out = base._raw_matrix(r * d, c * d, [])
        return out

    def _decode(self, raw: Any, rows: list[int], ncols: int, pad_to: int = 0) -> BlockMatrix:
        """Rows ``rows`` of a base matrix of width ``ncols * d`` read as coefficient rows."""
        K = self.K
        base, d = K.base, K.degree
        n = len(rows)
        nr = max(n, pad_to)
        if n == 0 or ncols == 0:
            return BlockMatrix(K, nr, ncols)
        pick = base._raw_matrix(nr, raw.nrows(), [])
        for t, i in enumerate(rows):
            pick[t, i] = 1
        sel = pick * raw
        planes = [sel * _column_picker(base, ncols, d, k) for k in range(d)]
        return BlockMatrix(K, nr, ncols, planes=planes)


def _spread(base: Any, n: int, d: int, a: int) -> Any:
    """``n d x n`` 0/1 matrix sending row ``i`` to row ``i d + a``."""
    S = base._raw_matrix(n * d, n, [])
    for i in range(n):
        S[i * d + a, i] = 1
    return S


def _column_picker(base: Any, n: int, d: int, k: int) -> Any:
    """``n d x n`` 0/1 matrix keeping the columns ``j d + k``."""
    S = base._raw_matrix(n * d, n, [])
    for j in range(n):
        S[j * d + k, j] = 1
    return S


def restrict_scalars(M: Any) -> Any:
    """``[M]`` over the base field, for a :class:`~hwcat.exact.matrices.Mat` ``M`` over an
    extension of degree ``d``: the matrix of the same map on ``K^r = F^(rd)`` (basis
    ``t^a e_i`` at index ``i d + a``)."""
    from hwcat.exact.matrices import Mat

    K = M.field
    return Mat(K.base, M._m._blowup())


def rows_over_extension(K: Any, M: Any) -> Any:
    """Rows of a base-field ``Mat`` of width ``c d`` read as vectors of ``K^c``."""
    from hwcat.exact.matrices import Mat

    d = K.degree
    if M.ncols % d:
        raise InternalInconsistency("rows_over_extension: width is not a multiple of the degree")
    c = M.ncols // d
    if M.nrows == 0:
        return Mat.zeros(K, 0, c)
    planes = [M._m * _column_picker(K.base, c, d, k) for k in range(d)]
    return Mat(K, BlockMatrix(K, M.nrows, c, planes=planes))
