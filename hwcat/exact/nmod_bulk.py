"""Moving the entries of a matrix over GF(p) in and out of flint in one piece.

flint's ``nmod_mat`` converts a Python list entry by entry (about a microsecond
per entry, several times the cost of a rank of the same matrix); its entries
are one row-major array of machine words.  The helpers here copy residues
between that array and a Python buffer (``array("q")``, a numpy int64 array)
with one memory copy.  The position of the array inside the flint object is
probed once, on a small matrix with known entries; every copy first checks the
shape, stride and modulus stored beside it.  If anything is not as expected,
the helpers answer ``None`` and the callers use flint's own conversions.

>>> import flint
>>> M = nmod_mat_from_residues(2, 3, array("q", [1, 2, 3, 4, 5, 6]), 7)
>>> M is None or M == flint.nmod_mat(2, 3, [1, 2, 3, 4, 5, 6], 7)
True
>>> r = read_residues(flint.nmod_mat(2, 2, [1, 0, 5, 6], 7))
>>> r is None or list(r) == [1, 0, 5, 6]
True
>>> r = read_rows(flint.nmod_mat(3, 2, [1, 2, 3, 4, 5, 6], 7), [2, 0])
>>> r is None or list(r) == [5, 6, 1, 2]
True
>>> power_trace(2, array("q", [1, 1, 0, 1]), 9, 3)   # Tr [[1, 3], [0, 1]] = 2
2
"""

from __future__ import annotations

import ctypes
from array import array
from typing import Any

import flint

__all__ = [
    "bulk_available",
    "nmod_mat_from_residues",
    "nmod_mat_gather",
    "power_trace",
    "read_residues",
    "read_rows",
]

_LAYOUT: list[int | None] = []  # [word offset of the entries pointer] or [None]


def _layout() -> int | None:
    """Word offset of ``(entries, r, c, stride, modulus)`` inside an ``nmod_mat`` object."""
    if not _LAYOUT:
        found = None
        try:
            probe = flint.nmod_mat(3, 5, list(range(100, 115)), 1009)
            size = type(probe).__basicsize__ // 8
            words = (ctypes.c_uint64 * size).from_address(id(probe))
            for off in range(2, size - 4):
                if tuple(words[off + 1 : off + 5]) == (3, 5, 5, 1009):
                    data = (ctypes.c_uint64 * 15).from_address(words[off])
                    if list(data) == list(range(100, 115)):
                        found = off
                    break
        except Exception:  # pragma: no cover - any surprise disables the bulk path
            found = None
        _LAYOUT.append(found)
    return _LAYOUT[0]


def bulk_available() -> bool:
    """Whether the one-piece copies are available for this flint build."""
    return _layout() is not None


def _entries_address(M: Any) -> int | None:
    off = _layout()
    if off is None:
        return None
    r, c = M.nrows(), M.ncols()
    words = (ctypes.c_uint64 * (off + 5)).from_address(id(M))
    if tuple(words[off + 1 : off + 5]) != (r, c, c, int(M.modulus())):
        return None
    return int(words[off])


def nmod_mat_from_residues(nrows: int, ncols: int, buf: Any, p: int) -> Any:
    """A flint ``nmod_mat`` holding ``buf`` (int64 residues in ``[0, p)``, row-major),
    or ``None`` when the one-piece copy is unavailable."""
    if nrows == 0 or ncols == 0:
        return None
    M = flint.nmod_mat(nrows, ncols, p)
    addr = _entries_address(M)
    if addr is None:
        return None
    mv = memoryview(buf).cast("B")
    if mv.nbytes != 8 * nrows * ncols:
        raise ValueError("nmod_mat_from_residues: buffer of the wrong size")
    if mv.readonly:
        src = ctypes.create_string_buffer(mv.tobytes(), mv.nbytes)
    else:
        src = (ctypes.c_char * mv.nbytes).from_buffer(mv)
    ctypes.memmove(addr, ctypes.addressof(src), mv.nbytes)
    return M


def nmod_mat_gather(values: Any, index: Any, p: int, out: Any = None) -> Any:
    """A flint ``nmod_mat`` with entries ``values[index]`` (numpy: ``values`` int64 residues
    in ``[0, p)``, ``index`` a two-dimensional integer array of positions in ``values``),
    gathered straight into flint's entries; ``None`` when that is unavailable.

    ``out``: a flint ``nmod_mat`` of that shape and modulus that its owner gives up; its
    entries are overwritten and it is returned.  Memory already in use costs far less
    to write than fresh memory (whose pages are first touched here), and no numpy copy
    of the whole matrix is made on the way."""
    import numpy as np

    r, c = index.shape
    if r == 0 or c == 0:
        return None
    M = out if out is not None else flint.nmod_mat(r, c, p)
    addr = _entries_address(M)  # also checks the shape and the modulus of ``out``
    if addr is None or int(M.modulus()) != p or (M.nrows(), M.ncols()) != (r, c):
        return None
    view = np.ctypeslib.as_array((ctypes.c_int64 * (r * c)).from_address(addr)).reshape(r, c)
    # a few rows at a time: ``take`` first converts the positions to machine integers, and
    # a small temporary array is reused where one of the whole size would be fresh memory
    step = max(1, _GATHER_ENTRIES // c)
    for r0 in range(0, r, step):
        # positions are valid, so ``clip`` changes none (and avoids a buffered copy)
        np.take(values, index[r0 : r0 + step], out=view[r0 : r0 + step], mode="clip")
    return M


_GATHER_ENTRIES = 1 << 14
"""Entries gathered at a time by :func:`nmod_mat_gather` (a temporary array of 128 KB)."""


def read_residues(M: Any) -> array | None:
    """The entries of a flint ``nmod_mat`` as an ``array("q")`` (row-major), or ``None``."""
    r, c = M.nrows(), M.ncols()
    if r == 0 or c == 0:
        return array("q")
    addr = _entries_address(M)
    if addr is None:
        return None
    out = array("q")
    out.frombytes(memoryview((ctypes.c_char * (8 * r * c)).from_address(addr)))  # one copy
    return out


def read_rows(M: Any, rows: Any) -> array | None:
    """The rows ``rows`` of a flint ``nmod_mat`` as one ``array("q")`` (row-major), read
    without touching the other rows; ``None`` when the one-piece copy is unavailable."""
    r, c = M.nrows(), M.ncols()
    rows = list(rows)
    if r == 0 or c == 0 or not rows:
        return array("q")
    addr = _entries_address(M)
    if addr is None:
        return None
    if min(rows) < 0 or max(rows) >= r:
        raise IndexError("read_rows: row index out of range")
    out = array("q")
    width = 8 * c
    for i in rows:
        out.frombytes(memoryview((ctypes.c_char * width).from_address(addr + i * width)))
    return out


def power_trace(n: int, buf: Any, modulus: int, e: int) -> int | None:
    """``Tr(X^e) mod modulus`` for the ``n x n`` integer matrix ``X`` whose entries are
    ``buf`` (int64 in ``[0, modulus)``, row-major): one copy in, squarings, the diagonal
    read out; ``None`` when the one-piece copy is unavailable."""
    if n == 0:
        return 0
    X = nmod_mat_from_residues(n, n, buf, modulus)
    if X is None:
        return None
    R = None
    while e:
        if e & 1:
            R = X if R is None else R * X
        e >>= 1
        if e:
            X = X * X
    if R is None:
        return n % modulus
    ent = read_residues(R)
    if ent is None:
        return None
    return sum(ent[k * n + k] for k in range(n)) % modulus


def dot_mod(x: Any, M: Any, p: int) -> Any:
    """``x @ M mod p`` for numpy int64 arrays of residues mod ``p < 2^31``, in chunks of
    rows short enough that no partial sum reaches ``2^63`` (each product is below ``p^2``).

    >>> import numpy as np
    >>> p = 2**31 - 1
    >>> x = np.full(5, p - 1, dtype=np.int64); M = np.full((5, 2), p - 1, dtype=np.int64)
    >>> dot_mod(x, M, p).tolist() == [5 * (p - 1) ** 2 % p] * 2
    True
    """
    step = max(1, (2**63 - 1) // max(1, (p - 1) ** 2))
    if len(x) <= step:
        return (x @ M) % p
    out = None
    for i in range(0, len(x), step):
        part = (x[i : i + step] @ M[i : i + step]) % p
        out = part if out is None else (out + part) % p
    return out
