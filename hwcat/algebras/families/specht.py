"""Specht modules of the symmetric groups over a prime field, and the heads of them.

For a partition ``lam`` of ``n`` the permutation module ``M^lam`` has the
``lam``-tabloids (tableaux up to permuting each row) as a basis, and ``S_n``
permutes them.  The polytabloid of a tableau ``t`` is
``e_t = sum sgn(s) {s t}`` over the permutations ``s`` that keep every column
of ``t``; the Specht module ``S^lam`` is their span, with the polytabloids of
the standard tableaux as a basis over any field.  The form on ``M^lam`` that
makes the tabloids orthonormal is ``S_n``-invariant, and for ``p``-regular
``lam`` (no part repeated ``p`` or more times) ``D^lam = S^lam / (S^lam ∩
S^lam⊥)`` is simple, nonzero, and the ``D^lam`` are the simple modules of
``GF(p) S_n``, each once (James's labelling, from memory).  In characteristic
0 every partition counts as regular and ``D^lam = S^lam``.

Nothing here needs coordinates on ``D^lam``: for ``x`` in the group algebra,
the rank of ``x`` on ``D^lam`` is the rank of the pairing matrix
``(<x b_i, b_j>)`` over a basis ``b`` of ``S^lam`` (the image ``x S^lam``
lies in ``S^lam``, and ``S^lam ∩ S^lam⊥`` is the radical of the form on it),
and ``dim D^lam`` is the rank of the Gram matrix.  For a group element ``g``
of order prime to ``p`` and an irreducible factor ``f`` of ``x^m - 1``
(``m`` the order of ``g``), ``g`` acts semisimply, so ``f`` divides its
characteristic polynomial on ``D^lam`` exactly ``(dim D^lam - rank f(g)) /
deg f`` times: these ranks give the characteristic polynomials of the
``p``-regular elements, hence the Brauer character, which tells the simple
modules apart (from memory).

Examples
--------
>>> S = specht_module((2, 1), 2)             # S^(2,1) over GF(2): simple of dimension 2
>>> S.dimension, S.head_dimension
(2, 2)
>>> specht_module((3, 1), 3).head_dimension   # D^(3,1) of S_4 over GF(3)
3
>>> [partition_label(lam) for lam in partitions(4) if is_regular(lam, 2)]
['D4', 'D3_1']
"""

from __future__ import annotations

import itertools
import math
from collections.abc import Sequence
from dataclasses import dataclass, field

from hwcat.errors import InternalInconsistency
from hwcat.exact import GF, QQ, Field, Mat

__all__ = [
    "Perm",
    "SpechtModule",
    "partitions",
    "is_regular",
    "partition_label",
    "cycle_type_representative",
    "cycle_notation",
    "permutation_power",
    "standard_tableaux",
    "specht_module",
]

Perm = tuple[int, ...]
"""A permutation of ``0..n-1`` in one-line notation: ``g[x]`` is the image of ``x``."""


def partitions(n: int) -> list[tuple[int, ...]]:
    """The partitions of ``n``, largest first part first (reverse lexicographic order).

    >>> partitions(4)
    [(4,), (3, 1), (2, 2), (2, 1, 1), (1, 1, 1, 1)]
    """
    out: list[tuple[int, ...]] = []

    def rec(rest: int, top: int, prefix: tuple[int, ...]) -> None:
        if rest == 0:
            out.append(prefix)
            return
        for part in range(min(rest, top), 0, -1):
            rec(rest - part, part, prefix + (part,))

    rec(n, n, ())
    return out


def is_regular(lam: Sequence[int], p: int) -> bool:
    """Whether no part of ``lam`` is repeated ``p`` or more times (always, for ``p = 0``).

    >>> is_regular((2, 2), 2), is_regular((2, 2), 3), is_regular((1, 1, 1), 0)
    (False, True, True)
    """
    if p == 0:
        return True
    return all(lam.count(part) < p for part in set(lam))


def partition_label(lam: Sequence[int]) -> str:
    """The label ``D<lam_1>_<lam_2>_...`` of ``D^lam`` (``D0`` for the empty partition).

    >>> partition_label((3, 2, 1)), partition_label(()), partition_label((10, 2))
    ('D3_2_1', 'D0', 'D10_2')
    """
    return "D" + ("_".join(str(x) for x in lam) if lam else "0")


def cycle_type_representative(mu: Sequence[int]) -> Perm:
    """The permutation ``(1,...,mu_1)(mu_1+1,...)...`` of cycle type ``mu``.

    >>> cycle_type_representative((2, 1)), cycle_type_representative((3,))
    ((1, 0, 2), (1, 2, 0))
    """
    g = []
    start = 0
    for part in mu:
        g.extend(start + (k + 1) % part for k in range(part))
        start += part
    return tuple(g)


def cycle_notation(g: Perm) -> str:
    """``g`` in cycle notation on ``1..n``, fixed points left out (``"()"`` for the identity).

    >>> cycle_notation((1, 2, 0, 3)), cycle_notation((0, 1))
    ('(1,2,3)', '()')
    """
    seen = [False] * len(g)
    parts = []
    for x in range(len(g)):
        if seen[x] or g[x] == x:
            continue
        cycle = []
        y = x
        while not seen[y]:
            seen[y] = True
            cycle.append(str(y + 1))
            y = g[y]
        parts.append("(" + ",".join(cycle) + ")")
    return "".join(parts) or "()"


def permutation_power(g: Perm, k: int) -> Perm:
    """``g^k`` (``k >= 0``).

    >>> permutation_power((1, 2, 0), 2)
    (2, 0, 1)
    """
    out = tuple(range(len(g)))
    for _ in range(k):
        out = tuple(g[x] for x in out)
    return out


def standard_tableaux(lam: Sequence[int]) -> list[tuple[tuple[int, ...], ...]]:
    """The standard tableaux of shape ``lam`` (rows of entries ``0..n-1``, increasing along
    rows and down columns).

    >>> standard_tableaux((2, 1))
    [((0, 1), (2,)), ((0, 2), (1,))]
    """
    n = sum(lam)
    out = []

    def rec(x: int, rows: list[list[int]]) -> None:
        if x == n:
            out.append(tuple(tuple(r) for r in rows))
            return
        for i, r in enumerate(rows):
            # x may end row i if the row is not full and the cell above is filled
            if len(r) < lam[i] and (i == 0 or len(rows[i - 1]) > len(r)):
                r.append(x)
                rec(x + 1, rows)
                r.pop()

    rec(0, [[] for _ in lam])
    return out


def _polytabloid(t: tuple[tuple[int, ...], ...], n: int, p: int) -> dict[Perm, int]:
    """``e_t`` as a dictionary from tabloids (the row of each entry) to coefficients."""
    columns = [[row[c] for row in t if len(row) > c] for c in range(len(t[0]) if t else 0)]
    out: dict[Perm, int] = {}
    for arrangement in itertools.product(*(itertools.permutations(col) for col in columns)):
        row_of = [0] * n
        sign = 1
        for col, perm in zip(columns, arrangement, strict=True):
            # the entry perm[r] sits in row r; the sign of the permutation col -> perm
            for r, x in enumerate(perm):
                row_of[x] = r
            sign *= _sign([col.index(x) for x in perm])
        key = tuple(row_of)
        out[key] = out.get(key, 0) + sign
    if p:
        out = {k: v % p for k, v in out.items() if v % p}
    return out


def _sign(perm: Sequence[int]) -> int:
    seen = [False] * len(perm)
    sign = 1
    for x in range(len(perm)):
        if seen[x]:
            continue
        length = 0
        y = x
        while not seen[y]:
            seen[y] = True
            y = perm[y]
            length += 1
        if length % 2 == 0:
            sign = -sign
    return sign


def _act(g: Perm, tabloid: Perm) -> Perm:
    """``g {t}``: the entry ``x`` of row ``r`` becomes the entry ``g(x)`` of row ``r``."""
    out = [0] * len(g)
    for x, r in enumerate(tabloid):
        out[g[x]] = r
    return tuple(out)


@dataclass(frozen=True)
class SpechtModule:
    """``S^lam`` over ``GF(p)`` (``p = 0``: over QQ) in the basis of standard polytabloids.

    Attributes
    ----------
    shape : tuple of int
    p : int
        the characteristic.
    basis : tuple of dict
        the standard polytabloids, tabloid (row of each entry) -> coefficient.
    dimension : int
        ``dim S^lam``, the number of standard tableaux.
    head_dimension : int
        ``dim D^lam``, the rank of the Gram matrix.
    """

    shape: tuple[int, ...]
    p: int
    basis: tuple[dict[Perm, int], ...] = field(repr=False)
    dimension: int
    head_dimension: int

    @property
    def field(self) -> Field:
        return GF(self.p) if self.p else QQ

    def head_rank(self, terms: Sequence[tuple[int, Perm]]) -> int:
        """The rank on ``D^lam`` of ``sum c g`` over the pairs ``(c, g)`` of ``terms``."""
        return _pairing_rank(self.basis, terms, self.p, self.field)


def _pairing_rank(
    basis: Sequence[dict[Perm, int]], terms: Sequence[tuple[int, Perm]], p: int, F: Field
) -> int:
    images = []
    for b in basis:
        w: dict[Perm, int] = {}
        for c, g in terms:
            for t, v in b.items():
                key = _act(g, t)
                w[key] = w.get(key, 0) + c * v
        images.append(w)
    k = len(basis)
    entries = []
    for w in images:
        for b in basis:
            s = sum(v * b[t] for t, v in w.items() if t in b)
            entries.append(s % p if p else s)
    return Mat.from_flat(F, k, k, entries).rank() if k else 0


def specht_module(lam: Sequence[int], p: int) -> SpechtModule:
    """``S^lam`` over ``GF(p)`` (``p = 0``: QQ), with ``dim D^lam`` (see the module notes).

    Raises :class:`~hwcat.errors.InternalInconsistency` if the standard polytabloids
    are dependent, or if ``D^lam = 0`` for a ``p``-regular ``lam``.
    """
    lam = tuple(lam)
    n = sum(lam)
    tableaux = standard_tableaux(lam)
    basis = tuple(_polytabloid(t, n, p) for t in tableaux)
    F = GF(p) if p else QQ
    identity = tuple(range(n))
    tabloids = sorted({t for b in basis for t in b})
    index = {t: i for i, t in enumerate(tabloids)}
    flat = [0] * (len(basis) * len(tabloids))
    for i, b in enumerate(basis):
        for t, v in b.items():
            flat[i * len(tabloids) + index[t]] = v
    if basis and Mat.from_flat(F, len(basis), len(tabloids), flat).rank() != len(basis):
        raise InternalInconsistency(f"the standard polytabloids of {lam} are dependent")
    head = _pairing_rank(basis, [(1, identity)], p, F)
    if head == 0 and is_regular(lam, p):
        raise InternalInconsistency(f"the Specht module of the {p}-regular {lam} has no head")
    if n and len(basis) != math.factorial(n) // _hook_product(lam):
        raise InternalInconsistency(f"{len(basis)} standard tableaux of shape {lam}")
    return SpechtModule(lam, p, basis, len(basis), head)


def _hook_product(lam: Sequence[int]) -> int:
    conj = [sum(1 for part in lam if part > c) for c in range(lam[0])] if lam else []
    prod = 1
    for i, part in enumerate(lam):
        for c in range(part):
            prod *= (part - c - 1) + (conj[c] - i - 1) + 1
    return prod
