"""Dense matrices over an :class:`~hwcat.exact.extension.ExtensionField`.

:class:`BlockMatrix` offers the small set of matrix operations that
:class:`~hwcat.exact.matrices.Mat` asks of its backend (the same shape of
interface as flint's ``nmod_mat`` and ``fmpq_mat``), and computes each of them
over the base field (see :mod:`hwcat.exact.extension`):

* product ``A B``: the coefficient matrix of ``A`` (``r x cd``, row ``i`` the
  coefficients of row ``i``) times the block matrix ``[B]`` (``cd x c'd``) is
  the coefficient matrix of ``A B`` -- ``d^2`` times the base-field work;
* rank, reduced echelon form, inverse: from the block matrix ``[M]``
  (``rd x cd``) over the base field -- ``d^3`` times the base-field work for
  elimination, done by flint.

Entry-wise operations (sum, scaling, transpose) stay in Python.
"""

from __future__ import annotations

from typing import Any

from hwcat.errors import InternalInconsistency

__all__ = ["BlockMatrix"]


class BlockMatrix:
    """An ``r x c`` matrix over an extension field, stored as a flat list of elements."""

    __slots__ = ("K", "r", "c", "e")

    def __init__(self, K: Any, r: int, c: int, entries: list | None = None) -> None:
        self.K, self.r, self.c = K, r, c
        if entries is None:
            z = K.zero
            entries = [z] * (r * c)
        elif len(entries) != r * c:
            raise InternalInconsistency(f"{len(entries)} entries for a {r} x {c} matrix")
        self.e = entries

    # -- flint-like interface ------------------------------------------------
    def nrows(self) -> int:
        return self.r

    def ncols(self) -> int:
        return self.c

    def entries(self) -> list:
        return list(self.e)

    def tolist(self) -> list[list]:
        c = self.c
        return [self.e[i * c : (i + 1) * c] for i in range(self.r)]

    def __getitem__(self, ij: tuple[int, int]) -> Any:
        i, j = ij
        return self.e[i * self.c + j]

    def __setitem__(self, ij: tuple[int, int], v: Any) -> None:
        i, j = ij
        self.e[i * self.c + j] = self.K(v)

    def __eq__(self, other: object) -> bool:
        if not isinstance(other, BlockMatrix):
            return NotImplemented
        return (self.K is other.K and (self.r, self.c) == (other.r, other.c)
                and all(x == y for x, y in zip(self.e, other.e, strict=True)))

    def __hash__(self) -> int:  # pragma: no cover - mutable, never hashed
        raise TypeError("BlockMatrix is not hashable")

    def __add__(self, o: BlockMatrix) -> BlockMatrix:
        return BlockMatrix(self.K, self.r, self.c, [x + y for x, y in zip(self.e, o.e, strict=True)])

    def __sub__(self, o: BlockMatrix) -> BlockMatrix:
        return BlockMatrix(self.K, self.r, self.c, [x - y for x, y in zip(self.e, o.e, strict=True)])

    def __neg__(self) -> BlockMatrix:
        return BlockMatrix(self.K, self.r, self.c, [-x for x in self.e])

    def transpose(self) -> BlockMatrix:
        r, c, e = self.r, self.c, self.e
        return BlockMatrix(self.K, c, r, [e[i * c + j] for j in range(c) for i in range(r)])

    def __mul__(self, o: Any) -> BlockMatrix:
        if not isinstance(o, BlockMatrix):
            s = self.K(o)
            return BlockMatrix(self.K, self.r, self.c, [x * s for x in self.e])
        if self.c != o.r:
            raise InternalInconsistency(f"cannot multiply {self.r}x{self.c} by {o.r}x{o.c}")
        if self.r == 0 or o.c == 0 or self.c == 0:
            return BlockMatrix(self.K, self.r, o.c)
        prod = self._coef() * o._blowup()
        return _decode(self.K, prod, self.r, o.c, range(self.r))

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
        out = _decode(self.K, R, len(rows), c, rows)
        return _pad(out, self.r), len(rows)

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
        return _decode(self.K, B, self.r, self.c, [i * d for i in range(self.r)])

    # -- base-field forms -----------------------------------------------------
    def _coef(self) -> Any:
        """``r x cd`` matrix over the base: row ``i`` lists the coefficients of row ``i``."""
        K = self.K
        flat: list = []
        for x in self.e:
            flat.extend(x.coeffs())
        return K.base._raw_matrix(self.r, self.c * K.degree, flat)

    def _blowup(self) -> Any:
        """``rd x cd`` block matrix over the base (block ``(i, j)`` is ``[M_ij]``)."""
        K = self.K
        d, r, c = K.degree, self.r, self.c
        w = c * d
        M = K.base._raw_matrix(r * d, w, [])
        for i in range(r):
            for j in range(c):
                x = self.e[i * c + j]
                if not x:
                    continue
                for k, row in enumerate(K.multiplication_matrix(x)):
                    for m, v in enumerate(row):
                        if v != 0:
                            M[i * d + k, j * d + m] = v
        return M


def _decode(K: Any, raw: Any, nrows: int, ncols: int, rows: Any) -> BlockMatrix:
    """Elements from coefficient rows ``rows`` of a base-field matrix of width ``ncols * d``."""
    d = K.degree
    E = raw.entries()
    w = ncols * d
    out = []
    for i in rows:
        base = i * w
        for j in range(ncols):
            out.append(K.from_coeffs(E[base + j * d : base + (j + 1) * d]))
    return BlockMatrix(K, nrows, ncols, out)


def _pad(M: BlockMatrix, nrows: int) -> BlockMatrix:
    """``M`` followed by zero rows up to ``nrows`` rows (flint's rref keeps the shape)."""
    extra = nrows - M.r
    if extra <= 0:
        return M
    return BlockMatrix(M.K, nrows, M.c, M.e + [M.K.zero] * (extra * M.c))
