"""A few rows of a large matrix, read without touching the others.

``Mat.take_rows`` over GF(p) reads the whole matrix in one piece before picking
rows; when a handful of rows of a ``dim A x dim A`` matrix is wanted, reading
only those rows (:func:`hwcat.exact.nmod_bulk.read_rows`) is far cheaper.

>>> from hwcat.exact import GF, Mat
>>> M = Mat.from_flat(GF(7), 3, 2, [1, 2, 3, 4, 5, 6])
>>> take_rows(M, [2, 0]).tolist()
[['5', '6'], ['1', '2']]
"""

from __future__ import annotations

from collections.abc import Sequence

from hwcat.exact.fields import PrimeField
from hwcat.exact.matrices import Mat
from hwcat.exact.nmod_bulk import nmod_mat_from_residues, read_rows

__all__ = ["take_rows"]


def take_rows(M: Mat, idx: Sequence[int]) -> Mat:
    """The rows ``idx`` of ``M`` (in that order)."""
    idx = list(idx)
    F = M.field
    if not idx or M.ncols == 0:
        return Mat.zeros(F, len(idx), M.ncols)
    if isinstance(F, PrimeField):
        buf = read_rows(M._m, idx)
        if buf is not None:
            out = nmod_mat_from_residues(len(idx), M.ncols, buf, F.p)
            if out is not None:
                return Mat(F, out)
    return M.take_rows(idx)
