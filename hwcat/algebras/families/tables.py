"""Built-in algebras given by a multiplication table on a named basis.

Each function returns a :class:`MultiplicationTable`: a basis of named
elements and the products of basis elements, stored sparsely.  The tables are
plain data; turning them into an algebra object is done elsewhere.

Families
--------
- :func:`temperley_lieb` -- the Temperley--Lieb algebra ``TL_n(delta)``, diagram basis;
- :func:`schur_algebra_2` -- the Schur algebra ``S(2, r)``, Green's basis;
- :func:`symmetric_group_algebra`, :func:`cyclic_group_algebra` -- group bases;
- :func:`small_quantum_sl2` -- the small quantum group ``u_q(sl_2)``, PBW basis.

:func:`check_associative` and :func:`check_unit` verify a table exactly.

Examples
--------
>>> from hwcat.exact import QQ
>>> T = temperley_lieb(3, 2, QQ)
>>> T.dim, T.basis[0]
(5, "(1,1')(2,2')(3,3')")
>>> check_associative(T) and check_unit(T)
True
"""

from __future__ import annotations

import gc
import itertools
import math
from array import array
from collections.abc import Iterable, Iterator, Mapping
from dataclasses import dataclass, field
from math import comb
from typing import Any

from hwcat.errors import (
    CoefficientError,
    InternalInconsistency,
    SpecError,
    StructureConstantsError,
)
from hwcat.exact.fields import QQ, Field, PrimeField, parse_field
from hwcat.limits import check_power_of_two, check_products, current_limits, limit_error

try:  # optional: large Temperley-Lieb tables are built with int64 arrays
    import numpy as _np
except ImportError:  # pragma: no cover - numpy is an optional extra
    _np = None

COLUMN_TABLE_MIN = 200
"""Temperley-Lieb and symmetric group tables of at least this dimension over GF(p)
(p < 2^31) are built column by column with numpy when it is installed (no dictionary
per product)."""

__all__ = [
    "MultiplicationTable",
    "temperley_lieb",
    "schur_algebra_2",
    "symmetric_group_algebra",
    "cyclic_group_algebra",
    "small_quantum_sl2",
    "check_associative",
    "check_unit",
]

Vector = dict[int, Any]


@dataclass(frozen=True)
class MultiplicationTable:
    """A finite-dimensional algebra given by structure constants on a named basis.

    Attributes
    ----------
    name : str
        A human-readable name such as ``"TL_3(2) over QQ"``.
    field : Field
        The field of the coefficients.
    basis : tuple of str
        The names of the basis elements; basis element ``i`` is ``basis[i]``.
    products : dict
        Sparse structure constants: ``products[(i, j)]`` is ``{k: c_k}`` with
        every ``c_k`` a nonzero field element, meaning
        ``basis[i] * basis[j] = sum_k c_k basis[k]``.  A missing pair means the
        product is zero.  The inner dictionaries may be shared between pairs,
        so treat the table as read-only.
    unit : dict
        The coordinates ``{k: c_k}`` of the identity element.
    """

    name: str
    field: Field
    basis: tuple[str, ...]
    products: Mapping[tuple[int, int], dict[int, Any]]
    unit: dict[int, Any]
    columns: Any = field(default=None, repr=False, compare=False)
    """Optional: the same constants by columns, ``columns[j] = (i's, k's, c's)`` (three
    int64 ``array("q")``, coefficients as residues mod p), for large tables over GF(p);
    ``products`` is then a view built from them on first use."""

    @property
    def dim(self) -> int:
        """The dimension of the algebra."""
        return len(self.basis)

    def index(self, name: str) -> int:
        """The position of the basis element called ``name``.

        >>> cyclic_group_algebra(3).index("g^2")
        2
        """
        try:
            return self.basis.index(name)
        except ValueError:
            raise SpecError(f"{self.name}: no basis element named {name!r}") from None

    def multiply(self, x: Vector, y: Vector) -> Vector:
        """The product of two sparse vectors ``{index: coefficient}``.

        >>> C = cyclic_group_algebra(3)
        >>> C.multiply({1: C.field(1)}, {2: C.field(1)})
        {0: 1}
        """
        zero = self.field.zero
        out: dict[int, Any] = {}
        P = self.products
        for i, xi in x.items():
            for j, yj in y.items():
                p = P.get((i, j))
                if not p:
                    continue
                c = xi * yj
                for k, v in p.items():
                    out[k] = out.get(k, zero) + c * v
        return {k: v for k, v in out.items() if v != 0}

    def to_dict(self) -> dict:
        """A JSON-ready form.

        Keys: ``name``, ``field`` (``"QQ"`` or ``"GF(p)"``), ``dimension``,
        ``basis`` (list of names), ``products`` (list of ``[i, j, terms]``
        sorted by ``(i, j)``, with ``terms`` a list of ``[k, coefficient]``),
        ``unit`` (list of ``[k, coefficient]``).  Coefficients are ints, or
        strings ``"p/q"`` for non-integral rationals.

        >>> cyclic_group_algebra(2).to_dict()["products"]
        [[0, 0, [[0, 1]]], [0, 1, [[1, 1]]], [1, 0, [[1, 1]]], [1, 1, [[0, 1]]]]
        """
        conv = self.field.to_int_or_str

        def terms(v: Vector) -> list:
            return [[k, conv(c)] for k, c in sorted(v.items())]

        return {
            "name": self.name,
            "field": self.field.name,
            "dimension": self.dim,
            "basis": list(self.basis),
            "products": [[i, j, terms(self.products[(i, j)])] for i, j in sorted(self.products)],
            "unit": terms(self.unit),
        }


# -- argument checks ---------------------------------------------------------


class _ColumnProducts(Mapping):
    """``{(i, j): {k: c}}`` as a read-only view of column arrays (built on first use)."""

    def __init__(self, F: Field, columns: list) -> None:
        self._F = F
        self._columns = columns
        self._dict: dict | None = None

    def _materialise(self) -> dict:
        if self._dict is None:
            F = self._F
            out: dict[tuple[int, int], dict[int, Any]] = {}
            for j, (is_, ks, cs) in enumerate(self._columns):
                for i, k, c in zip(is_, ks, cs, strict=True):
                    out.setdefault((i, j), {})[k] = F(int(c))
            self._dict = out
        return self._dict

    def __getitem__(self, key: tuple[int, int]) -> dict[int, Any]:
        return self._materialise()[key]

    def __iter__(self) -> Iterator[tuple[int, int]]:
        return iter(self._materialise())

    def __len__(self) -> int:
        return len(self._materialise())


def _as_field(field: Field | str) -> Field:
    if isinstance(field, Field):
        return field
    return parse_field(field)


def _check_int(value: Any, what: str, minimum: int) -> int:
    if isinstance(value, bool) or not isinstance(value, int):
        raise SpecError(f"{what} must be an integer, got {value!r}")
    if value < minimum:
        raise SpecError(f"{what} must be at least {minimum}, got {value}")
    return value


# -- Temperley-Lieb ------------------------------------------------------------


def _half_diagrams(n: int) -> list[tuple[int, ...]]:
    """Noncrossing partial matchings of ``0..n-1`` whose free points lie outside all arcs.

    Entry ``h[x]`` is the partner of ``x``, or ``-1`` if ``x`` is free (a
    through strand leaves from it).
    """
    out: list[tuple[int, ...]] = []
    cur = [0] * n
    # depth-first search with an explicit stack (no recursion: its depth would be n);
    # a frame is (position, open arcs); the three choices at a position are tried in
    # the order free point, open an arc, close the innermost arc
    frames: list[tuple[int, tuple[int, ...], tuple[int, ...]]] = [(0, (), ())]
    while frames:
        pos, stack, assigned = frames.pop()
        if pos == n:
            if not stack:
                h = list(cur)
                for x, y in zip(assigned[::2], assigned[1::2], strict=True):
                    h[x] = y
                out.append(tuple(h))
            continue
        nxt = []
        if not stack:
            nxt.append((pos + 1, stack, assigned + (pos, -1)))
        if len(stack) < n - pos - 1:
            nxt.append((pos + 1, stack + (pos,), assigned))
        if stack:
            o = stack[-1]
            nxt.append((pos + 1, stack[:-1], assigned + (o, pos, pos, o)))
        frames.extend(reversed(nxt))
    return out


def _free(h: tuple[int, ...]) -> list[int]:
    return [x for x, y in enumerate(h) if y == -1]


def _middle(B: tuple[int, ...], T: tuple[int, ...]) -> tuple[int, list, list]:
    """Stack the bottom half ``B`` of one diagram on the top half ``T`` of the next.

    Returns the number of closed loops, the pairs of free points of ``B``
    joined to each other (as positions in the list of free points), and the
    same for ``T``.  The remaining free points are joined in order (planarity).
    """
    n = len(B)
    upi = {x: k for k, x in enumerate(_free(B))}
    downi = {x: k for k, x in enumerate(_free(T))}
    seen = [False] * n
    up_pairs, down_pairs = [], []
    # walks starting at a free point of B: alternate T-arc, B-arc
    for x in upi:
        if seen[x]:
            continue
        seen[x] = True
        y = x
        while True:
            if T[y] == -1:
                break  # a through strand
            z = T[y]
            seen[z] = True
            if B[z] == -1:
                up_pairs.append((upi[x], upi[z]))
                break
            y = B[z]
            seen[y] = True
    # walks starting at a free point of T not reached yet end at a free point of T
    for x in downi:
        if seen[x]:
            continue
        seen[x] = True
        y = x
        while True:
            z = B[y]
            seen[z] = True
            if T[z] == -1:
                down_pairs.append((downi[x], downi[z]))
                break
            y = T[z]
            seen[y] = True
    loops = 0
    for x in range(n):
        if seen[x]:
            continue
        loops += 1
        y = x
        while not seen[y]:
            seen[y] = True
            z = B[y]
            seen[z] = True
            y = T[z]
    return loops, up_pairs, down_pairs


def _join(h: tuple[int, ...], pairs: list) -> tuple[int, ...]:
    if not pairs:
        return h
    free = _free(h)
    out = list(h)
    for k1, k2 in pairs:
        x, y = free[k1], free[k2]
        out[x], out[y] = y, x
    return tuple(out)


def _tl_name(T: tuple[int, ...], B: tuple[int, ...]) -> str:
    n = len(T)
    pairs = [(x, y) for x, y in enumerate(T) if x < y]
    pairs += [(n + x, n + y) for x, y in enumerate(B) if x < y]
    pairs += [(x, n + y) for x, y in zip(_free(T), _free(B), strict=True)]
    pairs.sort()

    def label(p: int) -> str:
        return str(p + 1) if p < n else f"{p - n + 1}'"

    return "".join(f"({label(x)},{label(y)})" for x, y in pairs) or "()"


def temperley_lieb(n: int, delta: Any, field: Field | str = QQ) -> MultiplicationTable:
    """The Temperley--Lieb algebra ``TL_n(delta)`` in the diagram basis.

    Parameters
    ----------
    n : int
        The number of strands, ``n >= 0``.
    delta : int, Fraction, str or field element
        The loop parameter.
    field : Field or str
        ``QQ`` or ``GF(p)``.

    Returns
    -------
    MultiplicationTable
        Dimension ``Catalan(n)``; basis element 0 is the identity diagram.

    Notes
    -----
    A basis diagram is a planar perfect matching of ``n`` top points
    ``1..n`` and ``n`` bottom points ``1'..n'``; its name lists the pairs,
    e.g. ``"(1,2)(1',2')(3,3')"`` (``"()"`` for ``n = 0``).  The product
    ``D1 * D2`` puts ``D1`` above ``D2``, glues the bottom points of ``D1``
    to the top points of ``D2`` and multiplies by ``delta`` for each closed
    loop.  The generator ``e_i`` is the diagram with pairs ``(i,i+1)`` and
    ``(i',(i+1)')`` and vertical strands elsewhere.  Standard (from memory).

    Each diagram is split into a top and a bottom half (arcs plus free
    points); the gluing of one bottom half with one top half is computed once
    and reused for all diagrams with those halves.

    Examples
    --------
    >>> T = temperley_lieb(2, -1, "GF(5)")
    >>> T.basis
    ("(1,1')(2,2')", "(1,2)(1',2')")
    >>> T.products[(1, 1)]
    {1: 4}
    """
    n = _check_int(n, "n", 0)
    if n > 200:  # Catalan(n) > 2^n
        check_power_of_two(n, f"TL_{n} has dimension Catalan({n}), more than 2^{n}")
    check_products(math.comb(2 * n, n) // (n + 1), f"TL_{n}")
    F = _as_field(field)
    try:
        d = F(delta)
    except CoefficientError as exc:
        raise CoefficientError(f"delta = {delta!r}: {exc}") from None
    halves = _half_diagrams(n)
    nfree = [h.count(-1) for h in halves]
    pairs = [(T, B) for T in range(len(halves)) for B in range(len(halves)) if nfree[T] == nfree[B]]
    pairs.sort(key=lambda tb: (-nfree[tb[0]], halves[tb[0]], halves[tb[1]]))
    basis = tuple(_tl_name(halves[T], halves[B]) for T, B in pairs)
    dim = len(basis)
    name = f"TL_{n}({F.to_str(d)}) over {F.name}"
    blocks = _tl_blocks(halves, pairs, skip_loops=(d == 0))
    if _np is not None and dim >= COLUMN_TABLE_MIN and isinstance(F, PrimeField) and F.p < 2**31:
        columns = _tl_columns(blocks, pairs, len(halves), dim, int(d), F.p)
        return MultiplicationTable(
            name=name,
            field=F,
            basis=basis,
            products=_ColumnProducts(F, columns),
            unit={0: F.one},
            columns=columns,
        )
    gc_was_enabled = gc.isenabled()
    gc.disable()  # millions of small containers are made below; collection only slows it
    try:
        products = _tl_products(blocks, pairs, len(halves), dim, d)
    finally:
        if gc_was_enabled:
            gc.enable()
    return MultiplicationTable(name=name, field=F, basis=basis, products=products, unit={0: F.one})


def _tl_blocks(
    halves: list, pairs: list[tuple[int, int]], skip_loops: bool
) -> Iterator[tuple[int, list[tuple[int, int, list[int], list[int]]]]]:
    """The products of diagrams, grouped by the top half ``T2`` of the right factor.

    A diagram is a pair (top half, bottom half).  The product ``(T1, B1) * (T2, B2)``
    depends on ``B1`` and ``T2`` only through their gluing (:func:`_middle`): it is
    ``delta^loops`` times the diagram ``(T1 + up, B2 + down)``.  For each ``T2`` this
    yields ``(T2, [(B1, loops, tops, bottoms), ...])`` with ``tops[a]`` the new top half
    of the ``a``-th diagram with bottom ``B1`` and ``bottoms[b]`` the new bottom half of
    the ``b``-th diagram with top ``T2``: each block is a ``len(tops) x len(bottoms)``
    rectangle of products with the same coefficient.
    Blocks with loops are left out when ``skip_loops`` (``delta = 0``).  Joined halves
    are computed once per half and pattern of arcs.
    """
    H = len(halves)
    hid = {h: k for k, h in enumerate(halves)}
    by_bottom: list[list[int]] = [[] for _ in range(H)]  # B -> tops T of diagrams (T, B)
    by_top: list[list[int]] = [[] for _ in range(H)]  # T -> bottoms B of diagrams (T, B)
    for T, B in pairs:
        by_bottom[B].append(T)
        by_top[T].append(B)
    joined: dict[tuple[int, tuple], list[int]] = {}

    def join_all(hs: list[int], key: int, arcs: list) -> list[int]:
        k = (key, tuple(arcs))
        got = joined.get(k)
        if got is None:
            got = joined[k] = [hid[_join(halves[h], arcs)] for h in hs]
        return got

    for T2 in range(H):
        if not by_top[T2]:
            continue
        out = []
        bottoms = {}
        for B1 in range(H):
            if not by_bottom[B1]:
                continue
            loops, up, down = _middle(halves[B1], halves[T2])
            if skip_loops and loops:
                continue
            tops = join_all(by_bottom[B1], B1, up)
            bottoms[B1] = join_all(by_top[T2], H + T2, down)
            out.append((B1, loops, tops))
        yield T2, [(B1, loops, tops, bottoms[B1]) for B1, loops, tops in out]


def _tl_indices(pairs: list[tuple[int, int]], H: int) -> tuple[list, list, dict]:
    """Diagram indices by bottom half and by top half, and ``(top, bottom) -> index``."""
    by_bottom: list[list[int]] = [[] for _ in range(H)]
    by_top: list[list[int]] = [[] for _ in range(H)]
    index = {}
    for i, (T, B) in enumerate(pairs):
        by_bottom[B].append(i)
        by_top[T].append(i)
        index[(T, B)] = i
    return by_bottom, by_top, index


def _tl_columns(
    blocks: Iterator, pairs: list, H: int, dim: int, d: int, p: int
) -> list[tuple[array, array, array]]:
    """The table by columns (int64 arrays; ``d`` a residue mod ``p``) from :func:`_tl_blocks`.

    All diagrams with the same top half ``T2`` meet the same left factors with the
    same coefficients, so their columns share one array of left factors and one of
    coefficients; only the array of results differs.
    """
    np = _np
    by_bottom, by_top, index = _tl_indices(pairs, H)
    idx = np.full((H, H), -1, dtype=np.int64)
    for (T, B), i in index.items():
        idx[T, B] = i
    out: list[Any] = [None] * dim
    for T2, group in blocks:
        js = by_top[T2]
        if not group:
            empty = array("q")
            for j in js:
                out[j] = (empty, empty, empty)
            continue
        I = np.concatenate([np.asarray(by_bottom[B1], dtype=np.int64) for B1, _, _, _ in group])
        C = np.concatenate(
            [np.full(len(tops), pow(d, loops, p), dtype=np.int64) for _, loops, tops, _ in group]
        )
        # K[b, a]: the product of the a-th left factor with the b-th diagram of top T2
        K = np.concatenate(
            [
                idx[np.asarray(tops, dtype=np.int64)[None, :], np.asarray(bottoms)[:, None]]
                for _, _, tops, bottoms in group
            ],
            axis=1,
        )
        if int(K.min()) < 0:  # pragma: no cover - every glued pair of halves is a diagram
            raise StructureConstantsError("temperley_lieb: a product left the diagram basis")
        if not C.all():  # pragma: no cover - delta^loops vanishes only for delta = 0
            raise StructureConstantsError("temperley_lieb: a zero structure constant was kept")
        Ia, Ca = array("q", I.tobytes()), array("q", C.tobytes())
        for b, j in enumerate(js):
            out[j] = (Ia, array("q", K[b].tobytes()), Ca)
    return out


def _tl_products(
    blocks: Iterator, pairs: list, H: int, dim: int, d: Any
) -> dict[tuple[int, int], dict[int, Any]]:
    """The table as a dictionary of products from :func:`_tl_blocks` (one shared
    ``{k: delta^loops}`` per result and power)."""
    by_bottom, by_top, index = _tl_indices(pairs, H)
    shared: dict[int, list[dict[int, Any]]] = {}  # loops -> [{k: delta^loops}]
    products: dict[tuple[int, int], dict[int, Any]] = {}
    for T2, group in blocks:
        js = by_top[T2]
        for B1, loops, tops, bottoms in group:
            vals = shared.get(loops)
            if vals is None:
                c = d**loops
                vals = shared[loops] = [{k: c} for k in range(dim)] if c != 0 else []
            if not vals:
                continue
            for i, top in zip(by_bottom[B1], tops, strict=True):
                res = [vals[index[(top, b)]] for b in bottoms]
                products.update(zip([(i, j) for j in js], res, strict=True))
    return products


# -- Schur algebra S(2, r) -----------------------------------------------------


def schur_algebra_2(r: int, field: Field | str = QQ) -> MultiplicationTable:
    """The Schur algebra ``S(2, r)`` in Green's basis ``xi_{i,j}``.

    Parameters
    ----------
    r : int
        The degree, ``r >= 0``.
    field : Field or str
        ``QQ`` or ``GF(p)``.

    Returns
    -------
    MultiplicationTable
        Dimension ``binomial(r + 3, 3)``; the unit is the sum of the ``xi_{i,i}``.

    Notes
    -----
    The basis element ``xi_{i,j}`` is indexed by an ``S_r``-orbit of pairs
    ``(i, j)`` of multi-indices in ``I(2, r)``; the orbit is recorded by the
    2x2 matrix ``A`` with ``A[u][v] = #{t : i_t = u, j_t = v}``.  Its name is
    ``"xi(i;j)"`` for the representative with the pairs ``(i_t, j_t)`` sorted,
    e.g. ``"xi(112;121)"``.  Green's product rule: the coefficient of
    ``xi_{p,q}`` in ``xi_{i,j} xi_{k,l}`` is the number of ``s`` in ``I(2, r)``
    with ``(i, j) ~ (p, s)`` and ``(k, l) ~ (s, q)``.  Sorting the positions of
    ``(p, q)`` by ``(p_t, s_t, q_t)`` turns the count into a sum over 2x2x2
    arrays ``m`` with margins ``A`` and ``B`` of the products of binomials
    ``binom(c_uw, m_u1w)`` (derived from the rule).

    References
    ----------
    J. A. Green, *Polynomial Representations of GL_n*, Lecture Notes in
    Math. 830 (1980).

    Examples
    --------
    >>> S = schur_algebra_2(1)
    >>> S.dim, S.basis
    (4, ('xi(1;1)', 'xi(1;2)', 'xi(2;1)', 'xi(2;2)'))
    >>> S.products[(1, 2)]
    {0: 1}
    """
    r = _check_int(r, "r", 0)
    check_products(math.comb(r + 3, 3), f"S(2, {r})")
    F = _as_field(field)
    mats = sorted(
        (
            (a, b, c, r - a - b - c)
            for a in range(r + 1)
            for b in range(r + 1 - a)
            for c in range(r + 1 - a - b)
        ),
        reverse=True,
    )
    idx = {A: k for k, A in enumerate(mats)}

    def name(A: tuple[int, int, int, int]) -> str:
        a11, a12, a21, a22 = A
        i = "1" * (a11 + a12) + "2" * (a21 + a22)
        j = "1" * a11 + "2" * a12 + "1" * a21 + "2" * a22
        return f"xi({i};{j})"

    by_rowsum: dict[int, list[int]] = {}  # weight of the first multi-index -> basis
    for k, (b11, b12, _, _) in enumerate(mats):
        by_rowsum.setdefault(b11 + b12, []).append(k)
    binom = [[comb(c, k) for k in range(c + 1)] for c in range(r + 1)]
    p = F.p if isinstance(F, PrimeField) else 0
    by_columns = 0 < p < 2**31 and len(mats) >= COLUMN_TABLE_MIN
    products: dict[tuple[int, int], dict[int, Any]] = {}
    cols: list[tuple[list[int], list[int], list[int]]] = [([], [], []) for _ in mats]
    for ka, (a11, a12, a21, a22) in enumerate(mats):
        for kb in by_rowsum.get(a11 + a21, ()):
            b11, b12, b21, b22 = mats[kb]
            acc: dict[int, int] = {}
            for x in range(max(0, b11 - a21), min(a11, b11) + 1):
                m112, m211, m212 = a11 - x, b11 - x, a21 - b11 + x
                for y in range(max(0, b21 - a22), min(a12, b21) + 1):
                    m122, m221, m222 = a12 - y, b21 - y, a22 - b21 + y
                    c11, c12, c21, c22 = x + y, m112 + m122, m211 + m221, m212 + m222
                    coef = binom[c11][x] * binom[c12][m112] * binom[c21][m211] * binom[c22][m212]
                    k = idx[(c11, c12, c21, c22)]
                    acc[k] = acc.get(k, 0) + coef
            if by_columns:
                ci, ck, cc = cols[kb]
                for k, v in acc.items():
                    if v % p:
                        ci.append(ka)
                        ck.append(k)
                        cc.append(v % p)
                continue
            entry = {k: F(v) for k, v in acc.items()}
            entry = {k: v for k, v in entry.items() if v != 0}
            if entry:
                products[(ka, kb)] = entry
    unit = {idx[(a, 0, 0, r - a)]: F.one for a in range(r + 1)}
    columns = None
    if by_columns:
        columns = [(array("q", ci), array("q", ck), array("q", cc)) for ci, ck, cc in cols]
        products = _ColumnProducts(F, columns)
    return MultiplicationTable(
        name=f"S(2,{r}) over {F.name}",
        field=F,
        basis=tuple(name(A) for A in mats),
        products=products,
        unit=unit,
        columns=columns,
    )


# -- group algebras ------------------------------------------------------------


def symmetric_group_algebra(n: int, field: Field | str = QQ) -> MultiplicationTable:
    """The group algebra of the symmetric group ``S_n`` in the group basis.

    Parameters
    ----------
    n : int
        ``n >= 0`` (``S_0`` and ``S_1`` are trivial).
    field : Field or str
        ``QQ`` or ``GF(p)``.

    Notes
    -----
    Basis: the permutations of ``{1, ..., n}`` in lexicographic order of their
    one-line notation, named in cycle notation (``"()"`` is the identity,
    basis element 0).  The product is composition, ``(s * t)(x) = s(t(x))``:
    ``t`` is applied first.  Standard.

    Examples
    --------
    >>> S = symmetric_group_algebra(3)
    >>> S.basis
    ('()', '(2,3)', '(1,2)', '(1,2,3)', '(1,3,2)', '(1,3)')
    >>> S.basis[next(iter(S.products[(1, 2)]))]
    '(1,3,2)'
    """
    n = _check_int(n, "n", 0)
    if n > 30 and current_limits().max_dim < 10**32:  # refuse before computing n!
        raise limit_error(
            "max_dim", f"the group algebra of S_{n} has dimension {n}!, more than 10^32"
        )
    check_products(math.factorial(n), f"the group algebra of S_{n}")
    F = _as_field(field)
    perms = list(itertools.permutations(range(n)))
    one = F.one
    name = f"group algebra of S_{n} over {F.name}"
    from hwcat.algebras.families.specht import cycle_notation

    basis = tuple(cycle_notation(p) for p in perms)
    if _np is not None and len(perms) >= COLUMN_TABLE_MIN and isinstance(F, PrimeField):
        columns = _permutation_columns(perms)
        return MultiplicationTable(
            name=name,
            field=F,
            basis=basis,
            products=_ColumnProducts(F, columns),
            unit={0: one},
            columns=columns,
        )
    idx = {p: k for k, p in enumerate(perms)}
    products = {}
    for i, s in enumerate(perms):
        for j, t in enumerate(perms):
            products[(i, j)] = {idx[tuple(s[x] for x in t)]: one}
    return MultiplicationTable(name=name, field=F, basis=basis, products=products, unit={0: one})


def _permutation_columns(perms: list[tuple[int, ...]]) -> list[tuple[array, array, array]]:
    """The table of the group algebra of ``S_n`` by columns (int64 arrays).

    Column ``t`` holds ``s * t`` for every ``s``: the one-line notation of ``s * t`` is
    ``s`` read at the positions ``t``, and its index is found by reading the one-line
    notation as a number in base ``n`` (the lexicographic order of ``perms`` is the
    order of these numbers).  Every column shares the arrays of left factors and of
    coefficients (all ``1``).
    """
    np = _np
    N, n = len(perms), len(perms[0])
    P = np.asarray(perms, dtype=np.int64).reshape(N, n)
    weights = n ** np.arange(n - 1, -1, -1, dtype=np.int64)
    keys = P @ weights  # increasing: the order of perms is lexicographic
    if N > 1 and not bool(np.all(keys[1:] > keys[:-1])):
        raise InternalInconsistency("the permutations are not in lexicographic order")
    I = array("q", np.arange(N, dtype=np.int64).tobytes())
    C = array("q", np.ones(N, dtype=np.int64).tobytes())
    out = []
    for t in perms:
        # the index of each product by binary search among the n! keys (no n^n table)
        K = np.searchsorted(keys, P[:, list(t)] @ weights)
        out.append((I, array("q", K.astype(np.int64).tobytes()), C))
    return out


def cyclic_group_algebra(m: int, field: Field | str = QQ) -> MultiplicationTable:
    """The group algebra of the cyclic group of order ``m`` in the group basis.

    Basis ``1, g, g^2, ..., g^(m-1)`` with ``g^i g^j = g^((i+j) mod m)``.  Standard.

    >>> cyclic_group_algebra(4, "GF(2)").basis
    ('1', 'g', 'g^2', 'g^3')
    """
    m = _check_int(m, "m", 1)
    check_products(m, f"the group algebra of C_{m}")
    F = _as_field(field)
    one = F.one
    products = {(i, j): {(i + j) % m: one} for i in range(m) for j in range(m)}
    names = tuple("1" if k == 0 else "g" if k == 1 else f"g^{k}" for k in range(m))
    return MultiplicationTable(
        name=f"group algebra of C_{m} over {F.name}",
        field=F,
        basis=names,
        products=products,
        unit={0: one},
    )


# -- small quantum group -----------------------------------------------------------


def _multiplicative_order(q: Any, bound: int) -> int | None:
    """The least ``m`` in ``1..bound`` with ``q^m = 1``, else ``None``."""
    x = q
    for m in range(1, bound + 1):
        if x == 1:
            return m
        x = x * q
    return None


def _pbw_name(a: int, b: int, c: int) -> str:
    parts = [f"{s}^{e}" if e > 1 else s for s, e in (("F", a), ("K", b), ("E", c)) if e]
    return "*".join(parts) or "1"


def small_quantum_sl2(ell: int, q: Any, field: Field | str) -> MultiplicationTable:
    """The small quantum group ``u_q(sl_2)`` at a primitive ``ell``-th root of unity.

    Parameters
    ----------
    ell : int
        An odd integer ``>= 3``, or an even ``ell = 2p >= 4`` (the restricted
        form at a primitive ``2p``-th root of unity).
    q : int, str or field element
        An element of multiplicative order exactly ``ell`` in ``field``.
    field : Field or str
        ``GF(p)`` with ``ell`` dividing ``p - 1``, ``GF(q)`` with ``ell``
        dividing ``q - 1``, or ``QQ(zetaN)`` with ``ell`` dividing ``N``
        (``QQ`` has no such ``q``).

    Returns
    -------
    MultiplicationTable
        Dimension ``ell^3`` (odd ``ell``) or ``2 p^3`` (``ell = 2p``); basis
        element 0 is the identity.

    Raises
    ------
    SpecError
        If ``ell < 3``, or ``q`` does not have order ``ell``.

    Notes
    -----
    Presentation (standard, from memory; Lusztig's small quantum group):
    generators ``E, F, K`` with ``E^ell = F^ell = 0``, ``K^ell = 1``,
    ``K E = q^2 E K``, ``K F = q^-2 F K`` and
    ``E F - F E = (K - K^-1) / (q - q^-1)``.  For even ``ell = 2p`` the
    restricted form (from memory; Feigin, Gainutdinov, Semikhatov, Tipunin,
    Comm. Math. Phys. 265 (2006)): the same relations with ``E^p = F^p = 0``
    and ``K^(2p) = 1``.  Write ``N`` for the nilpotency order (``ell``, or
    ``p`` when ``ell = 2p``).  Basis: the PBW monomials ``F^a K^b E^c`` with
    ``0 <= a, c < N`` and ``0 <= b < ell``, named like ``"F^2*K*E"``
    (``"1"`` for the identity); element ``(a, b, c)`` has index
    ``(a * ell + b) * N + c``.

    Products are straightened with the commutation formulas, derived from the
    relations: ``E K^b = q^-2b K^b E``, ``K^b F^i = q^-2bi F^i K^b`` and
    ``E F^a = F^a E + F^(a-1) sum_{m<a} (q^-2m K - q^2m K^-1) / (q - q^-1)``.
    ``E^c F^d`` is expanded once for each ``c, d`` by applying the last rule
    ``c`` times; then ``(F^a K^b E^c)(F^d K^e E^f)`` is a rescaled sum of
    monomials.

    Examples
    --------
    >>> u = small_quantum_sl2(3, 2, "GF(7)")
    >>> u.dim, u.basis[:4]
    (27, ('1', 'E', 'E^2', 'K'))
    """
    ell = _check_int(ell, "ell", 3)
    N = ell if ell % 2 else ell // 2  # E^N = F^N = 0
    check_products(N * N * ell, f"u_q(sl_2) with ell = {ell}")
    F = _as_field(field)
    try:
        qq = F(q)
    except CoefficientError as exc:
        raise CoefficientError(f"q = {q!r}: {exc}") from None
    if qq == 0:
        raise SpecError(f"q = 0 is not a root of unity in {F.name}")
    order = _multiplicative_order(qq, ell)
    if order != ell:
        found = f"has multiplicative order {order}" if order else f"satisfies q^{ell} != 1"
        raise SpecError(
            f"q = {F.to_str(qq)} {found} in {F.name}; "
            f"it must be a root of unity of order exactly {ell}"
        )
    zero, one = F.zero, F.one
    qpow = [one]
    for _ in range(ell - 1):
        qpow.append(qpow[-1] * qq)

    def qp(e: int) -> Any:
        return qpow[e % ell]

    inv = one / (qq - qp(-1))
    # bracket[a] = (coefficient of K, coefficient of K^-1) in [E, F^a] F^-(a-1)
    bracket = [
        (
            sum((qp(-2 * m) for m in range(a)), zero) * inv,
            -sum((qp(2 * m) for m in range(a)), zero) * inv,
        )
        for a in range(N)
    ]

    def left_E(v: dict[tuple[int, int, int], Any]) -> dict[tuple[int, int, int], Any]:
        out: dict[tuple[int, int, int], Any] = {}

        def add(key: tuple[int, int, int], c: Any) -> None:
            out[key] = out.get(key, zero) + c

        for (a, b, c), w in v.items():
            if c + 1 < N:
                add((a, b, c + 1), w * qp(-2 * b))
            if a > 0:
                kp, km = bracket[a]
                add((a - 1, (b + 1) % ell, c), w * kp)
                add((a - 1, (b - 1) % ell, c), w * km)
        return {k: x for k, x in out.items() if x != 0}

    # EF[c][d] = E^c F^d as {(i, j, k): coefficient}
    EF = []
    for c in range(N):
        row = []
        for d in range(N):
            v = {(d, 0, 0): one}
            for _ in range(c):
                v = left_E(v)
            row.append(v)
        EF.append(row)

    def ix(a: int, b: int, c: int) -> int:
        return (a * ell + b) * N + c

    monomials = [(a, b, c) for a in range(N) for b in range(ell) for c in range(N)]
    products: dict[tuple[int, int], dict[int, Any]] = {}
    for a, b, c in monomials:
        for d, e, f in monomials:
            acc: dict[int, Any] = {}
            for (i, j, k), w in EF[c][d].items():
                if a + i >= N or k + f >= N:
                    continue
                key = ix(a + i, (b + j + e) % ell, k + f)
                acc[key] = acc.get(key, zero) + w * qp(-2 * (b * i + k * e))
            acc = {k: x for k, x in acc.items() if x != 0}
            if acc:
                products[(ix(a, b, c), ix(d, e, f))] = acc
    return MultiplicationTable(
        name=f"u_q(sl2), ell = {ell}, q = {F.to_str(qq)} over {F.name}",
        field=F,
        basis=tuple(_pbw_name(*m) for m in monomials),
        products=products,
        unit={0: one},
    )


# -- checks --------------------------------------------------------------------------


def _combine(coeffs: Vector, row: Any, zero: Any) -> Vector:
    """``sum_m coeffs[m] * row(m)`` for sparse vectors."""
    out: dict[int, Any] = {}
    for m, c in coeffs.items():
        for k, v in row(m).items():
            out[k] = out.get(k, zero) + c * v
    return {k: v for k, v in out.items() if v != 0}


def check_associative(table: MultiplicationTable, left: Iterable[int] | None = None) -> bool:
    """Check ``(x y) z = x (y z)`` exactly for basis elements.

    Parameters
    ----------
    table : MultiplicationTable
    left : iterable of int, optional
        Restrict ``x`` to these basis indices (default: all).  If every basis
        element is a left-normed product ``g1 (g2 (... (gk 1)))`` of elements
        of ``left`` in the table, checking these triples already proves
        associativity (induction on ``k``); establishing that is the caller's job.

    Returns
    -------
    bool
        ``True``.

    Raises
    ------
    StructureConstantsError
        Naming the first basis triple that violates associativity.

    Examples
    --------
    >>> check_associative(cyclic_group_algebra(3))
    True
    """
    P = table.products
    zero = table.field.zero
    n = table.dim
    empty: Vector = {}
    xs = range(n) if left is None else list(left)
    for x in xs:
        for y in range(n):
            xy = P.get((x, y), empty)
            for z in range(n):
                lhs = _combine(xy, lambda m, z=z: P.get((m, z), empty), zero)
                rhs = _combine(P.get((y, z), empty), lambda m, x=x: P.get((x, m), empty), zero)
                if lhs != rhs:
                    b = table.basis
                    raise StructureConstantsError(
                        f"{table.name}: ({b[x]} * {b[y]}) * {b[z]} != {b[x]} * ({b[y]} * {b[z]})"
                    )
    return True


def check_unit(table: MultiplicationTable) -> bool:
    """Check that ``table.unit`` is a two-sided identity on every basis element.

    Raises :class:`~hwcat.errors.StructureConstantsError` naming the first
    failure; returns ``True`` otherwise.

    >>> check_unit(symmetric_group_algebra(3, "GF(3)"))
    True
    """
    one = table.field.one
    for i in range(table.dim):
        e = {i: one}
        if table.multiply(table.unit, e) != e or table.multiply(e, table.unit) != e:
            raise StructureConstantsError(
                f"{table.name}: the unit is not an identity for {table.basis[i]}"
            )
    return True
