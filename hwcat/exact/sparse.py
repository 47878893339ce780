"""Sparse rows: vectors as ``{column: nonzero entry}`` and the few operations on them.

Path algebras, monomial algebras and most algebras given by commutativity
relations act on their basis paths by single paths: the matrices of the arrows
have one nonzero entry per row at most, and so do the echelon bases of their
radical and socle series.  Dense matrices make such computations cost
``dim^3`` per step where the data are of size ``dim``; these kernels cost what
the nonzero entries cost.  Entries are the field's own scalars (flint's
``fmpq`` or ``nmod``, or the extension field's elements), so everything stays
exact; :func:`to_mat` and :func:`sparse_rows` move between the two forms.

Examples
--------
>>> from hwcat.exact import QQ, Mat
>>> M = Mat.from_rows(QQ, [[0, 2, 0], [0, 4, 1]])
>>> rows, pivots = sparse_echelon(QQ, sparse_rows(M))
>>> pivots, to_mat(QQ, rows, 3) == Mat.from_rows(QQ, [[0, 1, 0], [0, 0, 1]])
((1, 2), True)
"""

from __future__ import annotations

from collections.abc import Iterable, Sequence
from typing import Any

from hwcat.exact.fields import Field, PrimeField, RationalField
from hwcat.exact.matrices import Mat

__all__ = [
    "SparseRow",
    "axpy",
    "sparse_rows",
    "sparse_transpose",
    "to_mat",
    "row_times",
    "rows_times",
    "sparse_echelon",
    "nonzero_count",
]

SparseRow = dict[int, Any]
"""A row vector as ``{column: nonzero entry}``."""


def sparse_rows(M: Mat) -> list[SparseRow]:
    """The rows of ``M`` as sparse rows (one pass over the entries)."""
    r, c = M.shape
    if r == 0:
        return []
    if c == 0:
        return [{} for _ in range(r)]
    e = M.entries()
    out = []
    for i in range(r):
        base = i * c
        out.append({j: x for j, x in enumerate(e[base : base + c]) if x})
    return out


def sparse_transpose(rows: Sequence[SparseRow], ncols: int) -> list[SparseRow]:
    """The transpose of the ``len(rows) x ncols`` matrix given by sparse rows."""
    out: list[SparseRow] = [{} for _ in range(ncols)]
    for i, row in enumerate(rows):
        for j, x in row.items():
            out[j][i] = x
    return out


def nonzero_count(M: Mat) -> int:
    """The number of nonzero entries of ``M``."""
    if M.nrows == 0 or M.ncols == 0:
        return 0
    return sum(1 for x in M.entries() if x)


def to_mat(field: Field, rows: Sequence[SparseRow], ncols: int) -> Mat:
    """The dense matrix with the given sparse rows (entries set one by one)."""
    nrows = len(rows)
    if nrows == 0 or ncols == 0:
        return Mat.zeros(field, nrows, ncols)
    if isinstance(field, (RationalField, PrimeField)):
        raw = field._raw_matrix(nrows, ncols, [])
        for i, row in enumerate(rows):
            for j, x in row.items():
                raw[i, j] = x
        return Mat(field, raw)
    flat = [field.zero] * (nrows * ncols)
    for i, row in enumerate(rows):
        for j, x in row.items():
            flat[i * ncols + j] = x
    return Mat.from_flat(field, nrows, ncols, flat)


def row_times(v: SparseRow, S: Sequence[SparseRow]) -> SparseRow:
    """``v @ S`` for a sparse row ``v`` and a matrix ``S`` given by sparse rows."""
    out: SparseRow = {}
    for i, x in v.items():
        for j, y in S[i].items():
            z = out.get(j)
            z = x * y if z is None else z + x * y
            if z == 0:
                out.pop(j, None)
            else:
                out[j] = z
    return out


def rows_times(rows: Iterable[SparseRow], S: Sequence[SparseRow]) -> list[SparseRow]:
    """``[v @ S for v in rows]``."""
    return [row_times(v, S) for v in rows]


def sparse_echelon(
    field: Field,
    rows: Iterable[SparseRow],
    start: Sequence[SparseRow] = (),
    start_pivots: Sequence[int] | None = None,
) -> tuple[list[SparseRow], tuple[int, ...]]:
    """Reduced row echelon basis of the span of ``start`` and ``rows``.

    ``start`` must already be in reduced echelon form (e.g. an earlier result),
    sorted by pivot, with its pivots in ``start_pivots`` when known.  Returns
    the rows sorted by pivot and the pivots; the same rows as the dense
    :func:`~hwcat.exact.echelon` (the reduced echelon form of a row space is
    unique).
    """
    one = field.one
    rows = [r for r in rows if r]
    if start_pivots is None:
        start_pivots = [min(r) for r in start]
    if all(len(r) == 1 for r in rows):
        # rows acting by single paths: the span is spanned by unit vectors
        if all(len(r) == 1 for r in start):
            cols = set(start_pivots)
            cols.update(c for r in rows for c in r)
            if len(cols) == len(start_pivots):
                return list(start), tuple(start_pivots)
            order = sorted(cols)
            return [{c: one} for c in order], tuple(order)
    # forward elimination: rows with distinct pivots, leading entry one; rows of
    # ``start`` and rows left unchanged are shared, never modified (copy on write)
    piv: dict[int, SparseRow] = dict(zip(start_pivots, start, strict=True))
    fresh: set[int] = set()  # pivots whose row is our own copy
    for r in rows:
        if not r:
            continue
        own = False
        while True:
            hits = [c for c in r if c in piv]
            if not hits:
                break
            c = min(hits)
            if not own:
                r, own = dict(r), True
            axpy(r, -r[c], piv[c])
        if not r:
            continue
        p = min(r)
        lead = r[p]
        if lead != one:
            inv = one / lead
            r = {j: x * inv for j, x in r.items()}
            own = True
        piv[p] = r
        if own:
            fresh.add(p)
    # back substitution, last pivot first: each row loses the later pivot columns
    old = set(start_pivots)  # reduced among themselves: only new pivots matter
    new = set(piv) - old
    if not new:
        return list(start), tuple(start_pivots)
    order = sorted(piv)
    for p in reversed(order):
        r = piv[p]
        if p in old and new.isdisjoint(r):
            continue
        hits = sorted(c for c in r if c != p and c in piv)
        if not hits:
            continue
        if p not in fresh:
            r = dict(r)
        for c in hits:
            x = r.get(c)
            if x is not None:
                axpy(r, -x, piv[c])
        piv[p] = r
    return [piv[p] for p in order], tuple(order)


def axpy(y: SparseRow, a: Any, x: SparseRow) -> None:
    """``y += a * x`` in place."""
    for j, xj in x.items():
        z = y.get(j)
        z = a * xj if z is None else z + a * xj
        if z:
            y[j] = z
        else:
            y.pop(j, None)
