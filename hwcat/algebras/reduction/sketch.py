"""Ranks and independent rows of large matrices over GF(p) through thin random products.

The right ideals ``e A`` of the primitive idempotents of a large algebra are
small (for ``TL_9``, of dimension 4862, they have dimension below a few
hundred), but the matrices whose ranks give their dimensions are
``dim A x dim A``.  For ``M`` of rank ``r`` and a uniformly random
``X`` with ``w`` columns, ``M X`` has rank ``r`` with probability at least
``1 - q^(r - w) / (q - 1)`` (write ``M = C B`` with ``B`` of full row rank;
``B X`` is a uniform ``r x w`` matrix; common practice).  A rank of ``M X``
at most ``w - MARGIN`` is accepted; otherwise ``w`` grows, and beyond a third
of the size the exact elimination runs instead.

What is certain whatever the random matrix: ``rank(M X) <= rank(M)``, and rows
independent in ``M X`` are independent in ``M``.  When the rank is preserved the
greedy choice of independent rows is the same for ``M X`` as for ``M`` (a row
in the span of earlier rows of ``M X`` but not of ``M`` would give a nonzero
vector of the row space killed by ``X``), so the results do not depend on the
random matrix.  An unlucky draw can only make a dimension too small; the
reduction's closing identities ``dim A = sum dim L(i) dim P(i)`` (for right and
left projectives) then fail, they never pass with a wrong value.  The reduction
counts the draws (:data:`DRAWS`) and, when its checks fail after some draw, runs
once more with the thin products switched off (:func:`disabled`): the answer is
always exact, only its time is random (Las Vegas).

>>> from hwcat.exact import GF, Mat
>>> F = GF(2)
>>> M = Mat.from_flat(F, 300, 300, [(i * j) % 2 for i in range(300) for j in range(300)])
>>> sketched_rank(M), M.rank()
(1, 1)
>>> sketched_independent_rows(M) == select_independent_rows(M)
True
"""

from __future__ import annotations

import random
from collections.abc import Iterator
from contextlib import contextmanager
from typing import Any

from hwcat.exact import Mat, PrimeField, select_independent_rows
from hwcat.exact.polys import matrix_from_ints, matrix_from_residues

try:  # optional: random residues in one call
    import numpy as _np
except ImportError:  # pragma: no cover - numpy is an optional extra
    _np = None

__all__ = [
    "DRAWS",
    "MARGIN",
    "margin",
    "USE_SKETCH",
    "disabled",
    "draw",
    "draw_kept",
    "random_matrix",
    "sketched_independent_rows",
    "sketched_rank",
]

MARGIN = 24
"""Columns beyond the rank found: an unlucky draw has probability below ``2^-24``."""


def margin(F: Any) -> int:
    """The smallest ``m`` with ``q^m >= 2^MARGIN`` (``q`` the order of the field ``F``):
    a draw with ``m`` columns beyond the rank found is as safe over ``F`` as one with
    :data:`MARGIN` columns over GF(2) (``q^-m / (q - 1)``, see the module notes); 24
    over GF(2), 16 over GF(3), 11 over GF(5)."""
    q = F.characteristic ** getattr(F, "degree", 1)
    m = 1
    while q**m < 2**MARGIN:
        m += 1
    return m


START_WIDTH = 64
USE_SKETCH = True
"""Switch for the thin random products (tests compare both paths)."""
MIN_SIZE = 256
"""Matrices with fewer rows or columns are eliminated directly."""
DRAWS = 0
"""Number of random matrices drawn so far (the reduction reruns without sketches when its
closing checks fail after a draw)."""


@contextmanager
def disabled() -> Iterator[None]:
    """Switch the thin random products off inside the block (plain elimination)."""
    global USE_SKETCH
    old = USE_SKETCH
    USE_SKETCH = False
    try:
        yield
    finally:
        USE_SKETCH = old


def draw(F: Any, nrows: int, ncols: int, seed: int) -> Mat:
    """:func:`random_matrix`, counted in :data:`DRAWS`."""
    global DRAWS
    DRAWS += 1
    return random_matrix(F, nrows, ncols, seed)


def draw_kept(kept: dict, F: Any, nrows: int, ncols: int, seed: int) -> Mat:
    """:func:`draw`, kept in ``kept`` (a dictionary owned by the caller, e.g. an algebra's
    cache) for the next call with the same arguments: the result of a sketch does not
    depend on the draw (see the module notes), so one draw may serve many products.
    Counted in :data:`DRAWS` at every call."""
    global DRAWS
    DRAWS += 1
    key = (F, nrows, ncols, seed)
    if key not in kept:
        kept[key] = random_matrix(F, nrows, ncols, seed)
    return kept[key]


def random_matrix(F: Any, nrows: int, ncols: int, seed: int) -> Mat:
    """A uniformly random ``nrows x ncols`` matrix over the prime field ``F`` (seeded)."""
    p = F.p
    if _np is not None and p < 2**62:
        vals = _np.random.default_rng(seed).integers(0, p, size=nrows * ncols, dtype=_np.int64)
        return matrix_from_residues(F, nrows, ncols, vals)
    rng = random.Random(seed)
    return matrix_from_ints(F, nrows, ncols, [rng.randrange(p) for _ in range(nrows * ncols)])


def _usable(M: Mat) -> bool:
    return USE_SKETCH and isinstance(M.field, PrimeField) and min(M.nrows, M.ncols) >= MIN_SIZE


def sketched_rank(M: Mat, seed: int = 0, hint: int = 0) -> int:
    """``rank(M)``, through ``M X`` for thin random ``X`` when the rank is small
    (``hint``: a guess of the rank, to start with a wide enough ``X``)."""
    if _usable(M):
        n = M.ncols
        w = max(START_WIDTH, hint + 2 * MARGIN)
        while 3 * w <= min(M.nrows, n):
            r = (M @ draw(M.field, n, w, seed + w)).rank()
            if r + MARGIN <= w:
                return r
            w *= 2
    return M.rank()


def sketched_independent_rows(M: Mat, seed: int = 0) -> list[int]:
    """:func:`~hwcat.exact.select_independent_rows` of ``M`` (the same greedy choice),
    through ``M X`` for thin random ``X`` when the rank is small."""
    if _usable(M):
        n = M.ncols
        w = START_WIDTH
        while 3 * w <= min(M.nrows, n):
            pos = select_independent_rows(M @ draw(M.field, n, w, seed + w))
            if len(pos) + MARGIN <= w:
                return pos
            w *= 2
    return select_independent_rows(M)
