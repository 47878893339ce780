"""From any finite-dimensional algebra to its basic algebra and Gabriel quiver.

Input: a :class:`~hwcat.algebras.inputs.structure.StructureAlgebra` ``A`` (structure
constants, a matrix algebra, a built-in family).  Output: a
:class:`Reduction` holding the hub :class:`~hwcat.algebras.hub.basic.BasicAlgebra`
of ``A`` (the basic algebra ``e A e`` with its Gabriel quiver), one primitive
idempotent per simple module, and the Morita data ``dim L(i)``.

Method
------
*Radical* (:func:`hwcat.algebras.reduction.radical.radical`, re-exported here): trace form
in characteristic 0 or large ``p``, the chain of Ronyai and Cohen-Ivanyos-Wales
otherwise (see that module).

*Primitive idempotents* (:func:`reduce_algebra`, default method).  Fitting's
lemma: for an element ``z`` of a corner ``f A f`` with minimal polynomial
``prod g_k^(e_k)``, the Chinese remainder polynomials ``pi_k`` give orthogonal
idempotents ``pi_k(z)`` of ``A`` summing to ``f`` -- they are the idempotents
of ``A / rad A`` attached to the factors, already lifted to ``A``.  Corners are
split by seeded random elements ``z = f y f`` into a tree of orthogonal
idempotents: ``y`` dense (one fresh element per depth of the tree, so that it is
independent of ``f``) for large algebras over GF(p); sparse (a few basis
elements) in small corners and over QQ, where a component ``M_r(QQ)`` splits
only with rational eigenvalues.  When the unit is a sum of basis elements that
are orthogonal idempotents and every basis element lies in one Peirce block
(Schur algebras, algebras coming from quivers), the tree starts from those
idempotents and every matrix is restricted to a block.  In a group algebra (a
group table) ``y`` is supported on a few random group elements instead: right
multiplication by a group element permutes coordinates, so the Krylov chain of
``f y f`` needs only the matrix of ``f``; the trace ``tau`` (coefficient of the unit,
``tau(x y) = tau(y x)``) turns the rows ``e b_l`` of a right ideal and the form
``x -> col(e x)`` into products with that matrix (``tau(e b_l y) = (y e)_(inv l)``), so
no matrix of left multiplication is built.  A leaf is accepted when
its corner ``e A e`` (a small explicit algebra) is certified local with residue
field ``F``: directly, by a multiplicative residue map with nilpotent kernel, or by
its radical (the lifted-trace chain) having codimension 1.  Each
new simple ``L`` gives a linear form ``phi(x) = chi(e x e)`` (``chi`` the residue
map of the corner); ``dim L`` is the rank of ``(x, y) -> phi(x y)``, and
``dim L f`` (the multiplicity of ``L``'s projective in ``f A``) is read from a
section of ``L``, so a subtree is skipped once ``dim A f`` is explained by the
simples already found.  Completeness is the exact identity
``dim A = sum dim L(i) dim P(i)`` (and its left-module twin).  The method
``"quotient"`` follows the textbook route instead: radical, semisimple
quotient, its centre split by random central elements, each simple component
split into primitive idempotents, lifted to ``A`` by ``e -> 3e^2 - 2e^3``
orthogonally (:mod:`hwcat.algebras.reduction.radical`).

*Cost*.  Without block structure the work is dominated by passes over the
nonzero structure constants that build a dense ``dim A x dim A`` matrix of
right or left multiplication (one per dense random element, per explored node
and per simple found) and by a few ranks of such matrices; everything else
happens in the small corners and blocks.

*Basic algebra*.  With one idempotent ``e_s`` per simple, the blocks
``e_s A e_t`` get bases of the form ``e_s b e_t`` (``b`` basis elements), so a
product with such an element is a sparse product with ``b`` followed by the
projection ``e_t``.  The radical of ``e A e`` is the off-diagonal blocks plus
the radicals of the local corners; arrows are a basis of a complement of
``rad^2`` in ``rad`` block by block, and the projectives ``e_s A e`` as quiver
representations give the hub via ``from_cyclic_representations``.

References
----------
L. Ronyai, *Computing the structure of finite algebras*, J. Symbolic Comput. 9
(1990) 355-373.  A. M. Cohen, G. Ivanyos, D. B. Wales, *Finding the radical of
an algebra of linear transformations*, J. Pure Appl. Algebra 117/118 (1997)
177-193.

Examples
--------
>>> from hwcat.algebras.families.tables import symmetric_group_algebra
>>> from hwcat.algebras.inputs.structure import from_table
>>> A = from_table(symmetric_group_algebra(3, "GF(2)"))
>>> r = reduce_algebra(A)
>>> r.simple_dimensions, r.basic.cartan(), r.radical_dimension
((1, 2), ((2, 0), (0, 1)), 1)
"""

from __future__ import annotations

import random
import time
from collections.abc import Callable, Sequence
from dataclasses import dataclass, field
from typing import Any

from hwcat.algebras.hub.basic import BasicAlgebra
from hwcat.algebras.hub.quiver import Arrow, Quiver
from hwcat.algebras.inputs.structure import StructureAlgebra
from hwcat.algebras.reduction import sketch
from hwcat.algebras.reduction.kernels import (
    _krylov_columns,
    apply_transfer,
    as_row,
    chain_step,
    coords_solver,
    embed,
    krylov,
    minpoly,
    raw_rows,
    residue_matrix,
    restrict,
    small_radical,
    transfer,
)
from hwcat.algebras.reduction.radical import (
    LIFTED_TRACE_LIMIT,
    lift_idempotent,
    primitive_idempotents,
    trace_radical,
)
from hwcat.algebras.reduction.sketch import sketched_independent_rows, sketched_rank
from hwcat.errors import (
    HwcatError,
    InternalInconsistency,
    NotSplitError,
    ResourceLimitError,
    StructureConstantsError,
    WorkBudgetExceeded,
)
from hwcat.exact import Mat, PrimeField, echelon, select_independent_rows, splitting_field_hint
from hwcat.exact.bulk_rows import take_rows
from hwcat.exact.nmod_bulk import bulk_available, dot_mod, read_residues
from hwcat.exact.polys import (
    Poly,
    fitting_polynomials,
    matrix_from_ints,
    select_columns,
    sparse_matrix,
)
from hwcat.progress import task

CORNER_LIMIT = 400
"""Largest corner ``e A e`` that is certified local (as an explicit algebra)."""

__all__ = [
    "CORNER_LIMIT",
    "radical",
    "Reduction",
    "reduce_algebra",
    "reduction_of",
    "lift_idempotent",
    "primitive_idempotents",
    "semisimple_dimensions",
]


# ----------------------------------------------------------------------------------
# small helpers


# ----------------------------------------------------------------------------------
# simple modules (classes of primitive idempotents)


class _NotPrimitive(Exception):
    """Internal signal: the corner of a candidate leaf is not local.  ``parts``: when the
    signal comes with them, orthogonal idempotents (nonzero, at least two) summing to the
    leaf's idempotent, found on the way."""

    def __init__(self, parts: list[Any] | None = None) -> None:
        super().__init__()
        self.parts = parts


@dataclass
class _Class:
    e: list[Any]
    index: list[int] | None  # basis indices spanning A f (None: all)
    rows: list[int] | None  # basis indices spanning f A (None: all)
    RT: Mat | None  # transposed right multiplication by e on span(index) (None: rebuilt)
    L: Mat  # rows e*b_l (l in J) on span(rows)
    J: list[int]  # basis indices with e*b_l a basis of eA
    corner: list[int]  # basis indices with e*b_l*e a basis of eAe
    corner_rad: Mat  # radical of eAe, coordinates in that basis
    chi: list[Any]  # residue map on corner coordinates
    phi: list[Any]  # raw linear form x -> chi(e x e)
    U: Mat  # columns: x -> phi(x b_c) for n independent c
    sec: list[int]  # basis indices whose images form a basis of L
    n: int  # dim L
    dim_P: int
    dim_Ae: int
    corner_mult: Any = None
    rowterms: dict[int, list[tuple[int, int, Any]]] = field(default_factory=dict)
    urows: list[list[Any]] | None = None
    uarray: Any = None  # urows as an int64 array (vectorised ranks)
    # the corner e A e as a block of the basic algebra: its basis rows e b_l e (on
    # span(index)), their coordinate solver and the columns of R at its pivots times it
    corner_block: tuple[Mat, tuple[tuple[int, ...], Mat], Mat] | None = None


def _right_ideal_basis(A: StructureAlgebra, e: list[Any], rows) -> tuple[list[int], Mat]:
    """Basis elements ``b_l`` with ``e b_l`` a basis of ``eA`` (on span(rows)), and those rows."""
    L = A._action(e, rows, left=True)
    pos = sketched_independent_rows(L)
    rows_list = list(range(A.dim)) if rows is None else list(rows)
    return [rows_list[k] for k in pos], take_rows(L, pos)


def _group_inverses(A: StructureAlgebra) -> Any:
    """In a group algebra whose unit is a basis element: ``inv[l]`` with ``b_l b_inv[l] = 1``
    (an int64 array); else ``None``."""
    group = A._group_table()
    if group is None or not A._p:
        return None
    if "group_inverses" not in A._cache:
        import numpy as np

        nz = [i for i, v in enumerate(A._unit) if v]
        ok = len(nz) == 1 and int(A._unit[nz[0]]) % A._p == 1
        A._cache["group_inverses"] = (
            np.ascontiguousarray(group[1][:, nz[0]], dtype=np.int64) if ok else None
        )
    return A._cache["group_inverses"]


def _group_trace(A: StructureAlgebra) -> list[int] | None:
    """The trace form (raw) of a group algebra whose unit is a basis element: right
    multiplication by ``b_j`` fixes a basis element only for ``b_j = 1`` (cancellation),
    and then all ``dim A`` of them; ``None`` otherwise."""
    if _group_inverses(A) is None:
        return None
    tau = [0] * A.dim
    tau[next(i for i, v in enumerate(A._unit) if v)] = A.dim % A._p
    return tau


GROUP_TRACE_PAIRING = True
"""Switch for :func:`_group_right_ideal_basis` and :func:`_group_form_of_products` (tests
compare both routes)."""


def _group_right_ideal_basis(A: StructureAlgebra, e: list[Any], RT: Mat):
    """:func:`_right_ideal_basis` in a group algebra, without the matrix of ``x -> e x``.

    The sketch ``L Y`` of the rows ``e b_l`` (``Y`` uniformly random, ``w`` columns) is read
    off ``R_e^T Z`` for a uniformly random ``Z`` through the trace ``tau`` (coefficient of
    the unit, ``tau(x y) = tau(y x)``): with ``y_j`` the ``j``-th column of ``Z``,
    ``tau(e b_l y_j) = tau(b_l (y_j e)) = (y_j e)_(inv l)`` (``b_(inv l) = b_l^-1``), which
    is ``(L Y)[l, j]`` for ``Y[k, j] = y_j[inv k]`` -- a row permutation of ``Z``, so
    uniform as well.  The rows are then chosen as in
    :func:`~hwcat.algebras.reduction.sketch.sketched_independent_rows` (the same greedy
    choice when the rank is kept; the same closing checks catch an unlucky draw), and
    ``e b_l = e[left[l]]`` is a gather.  ``None`` when that route does not apply."""
    inv = _group_inverses(A)
    n = A.dim
    if not GROUP_TRACE_PAIRING or inv is None or not sketch.USE_SKETCH or n < sketch.MIN_SIZE:
        return None
    import numpy as np

    F = A.field
    w = sketch.START_WIDTH
    while 3 * w <= n:
        S = RT @ sketch.draw_kept(_kept_draws(A), F, n, w, w)  # column j: y_j e
        Sv = np.frombuffer(read_residues(S._m), dtype=np.int64).reshape(n, w)
        pos = select_independent_rows(residue_matrix(F, n, w, np.ascontiguousarray(Sv[inv])))
        if len(pos) + sketch.margin(F) <= w:
            ev = np.fromiter(map(int, e), dtype=np.int64, count=n) % A._p
            rows = ev[A._group_table()[2][pos]]
            return list(pos), residue_matrix(F, len(pos), n, np.ascontiguousarray(rows).ravel())
        w *= 2
    return None


def _group_form_of_products(A: StructureAlgebra, e: list[Any], RT: Mat, col: list[Any]):
    """``phi_j = col(e b_j)`` in a group algebra (``RT`` the transpose of right
    multiplication by ``e``): with ``y[k] = col[inv k]``, ``col(e b_j) = tau(e b_j y) =
    tau(b_j (y e)) = (y e)_(inv j)`` (see :func:`_group_right_ideal_basis`), one product
    with ``RT``.  ``None`` when that route does not apply."""
    inv = _group_inverses(A)
    if not GROUP_TRACE_PAIRING or inv is None:
        return None
    import numpy as np

    n, p = A.dim, A._p
    cv = np.fromiter(map(int, col), dtype=np.int64, count=n) % p
    ye = RT @ residue_matrix(A.field, n, 1, np.ascontiguousarray(cv[inv]))
    out = np.frombuffer(read_residues(ye._m), dtype=np.int64)[inv]
    return out.tolist()


THIN_PAD = 12
"""Products of a large square matrix with fewer than this many columns are padded with
zero columns up to it: flint's product then takes another algorithm, several times faster
at these sizes (measured on GF(3) at 720 x 720: 10 columns 3.3 ms, 12 columns 0.4 ms)."""


def _times_transposed(X: Mat, MT: Mat) -> Mat:
    """``X @ M`` given ``MT`` (the transpose of a large square ``M``) and the few rows ``X``:
    as ``(MT @ X^T)^T``, with ``X`` padded by zero rows up to :data:`THIN_PAD`."""
    k = X.nrows
    if k == 0 or k == 1 or k >= THIN_PAD or MT.nrows < 64 or not isinstance(X.field, PrimeField):
        return (MT @ X.transpose()).transpose()
    padded = Mat.vstack(X.field, [X, Mat.zeros(X.field, THIN_PAD - k, X.ncols)], X.ncols)
    return take_rows((MT @ padded.transpose()).transpose(), range(k))


def _corner_data(A: StructureAlgebra, e: list[Any], RT: Mat, index, rows) -> tuple:
    """Basis of eA (as e*b_l), of eAe (as e*b_l*e) and the corner's structure constants
    (``RT``: the transpose of right multiplication by ``e`` on span(index))."""
    F = A.field
    fast = _group_right_ideal_basis(A, e, RT) if index is None and rows is None else None
    J, Lr = fast if fast is not None else _right_ideal_basis(A, e, rows)
    W = _times_transposed(apply_transfer(Lr, transfer(A, rows, index)), RT)  # Lr R
    C_pos = select_independent_rows(W)
    if len(C_pos) > CORNER_LIMIT:
        raise NotSplitError(
            f"could not certify a primitive idempotent: its corner e A e has dimension "
            f"{len(C_pos)} > {CORNER_LIMIT} (the endomorphism ring of an indecomposable "
            "projective is that large, as for a large local algebra); the corner is certified "
            "as an explicit algebra, which is too costly at this size"
        )
    corner = [J[k] for k in C_pos]
    Cb = take_rows(W, C_pos)
    piv, T = coords_solver(Cb)
    Rp = take_rows(RT, piv).transpose()  # columns piv of R
    c = len(corner)
    mult = []  # mult[l][a] = coordinates of c_a * c_l
    stacked = _np_embedded(A, Cb, index) if A._vectorised() else None
    cvecs = [embed(A, r, index) for r in raw_rows(A, Cb)] if stacked is None else []
    for b in corner:
        if stacked is not None:  # the products with b of all the c_a at once
            prod = A._times_basis_rows(stacked, b)
            if index is not None:
                prod = prod[:, list(index)]
            P = residue_matrix(F, c, prod.shape[1], _np_contiguous(prod).ravel())
        else:
            rowsb = [restrict(A._times_basis_raw(v, b), index) for v in cvecs]
            P = Mat.from_flat(F, c, len(rowsb[0]), [x for r in rowsb for x in r])
        mult.append(P @ Rp @ T)
    return Lr, J, corner, Cb, piv, T, mult, Rp


FAST_LOCAL = True
"""Switch for :func:`_local_certificate` (tests compare both routes)."""

FAST_LOCAL_LIMIT = 96
"""Largest corner certified local by :func:`_local_certificate` (about ``c^4`` work)."""


def _local_certificate(F: Any, mult: list[Mat], ecoords: Mat) -> tuple[Mat, list] | None:
    """The radical and residue map of a corner ``C`` (basis ``c_l``, ``mult[l]`` the right
    multiplication by ``c_l``, ``ecoords`` its unit) when ``C`` is local with residue field
    ``F``, certified directly; ``None`` when the certificate does not come out.

    A guess of the residue map: ``chi(c_l)`` is the single root of the minimal polynomial
    of ``c_l`` (two coprime factors give an idempotent other than ``0`` and ``e``, so ``C``
    is not local: ``_NotPrimitive``; a single factor of higher degree: ``None``).
    Certificate: ``chi(e) = 1`` and
    ``chi(c_a c_l) = chi(c_a) chi(c_l)`` for all ``a, l`` make ``N = ker chi`` a two-sided
    ideal of codimension 1, and ``N^k = 0`` (the chain ``N^(k+1) = N^k N``, spanned by
    ``v (c_l - chi(c_l) e)``) makes it nilpotent, so ``N`` is the radical and ``C / N = F``
    (common practice).  About ``c^4`` operations, against the lifted traces of the
    general radical."""
    c = len(mult)
    if not isinstance(F, PrimeField) or c > FAST_LOCAL_LIMIT or c == 0:
        return None
    chi = []
    for M in mult:
        K, co = krylov(ecoords, M)
        facs = minpoly(F, K.nrows, co).factor()
        if len(facs) > 1:  # Fitting's lemma: c_l gives an idempotent other than 0, e
            raise _NotPrimitive(_fitting_parts(F, K, facs))
        if facs[0][0].degree != 1:
            return None
        g = facs[0][0].coeffs()  # g = g0 + g1 x
        chi.append(-g[0] / g[1])
    col = Mat.from_flat(F, c, 1, chi)
    if (ecoords @ col).entries() != [F.one]:
        return None
    for l, M in enumerate(mult):  # (mult[l] chi)_a = chi(c_a c_l)
        if (M @ col).entries() != [x * chi[l] for x in chi]:
            return None
    N = echelon(Mat.from_flat(F, 1, c, chi).transpose().left_kernel())
    shifted = [M - Mat.identity(F, c).scale(chi[l]) for l, M in enumerate(mult)]
    V = N
    for _ in range(c + 1):
        if V.nrows == 0:
            return N, chi
        W = echelon(Mat.vstack(F, [V @ S for S in shifted], c))
        if W.nrows >= V.nrows:
            return None  # N^(k+1) = N^k: not nilpotent
        V = W
    return None


def _fitting_parts(F: Any, K: Mat, facs: list[tuple[Poly, int]]) -> list[Mat]:
    """From the Krylov sequence ``K`` of the unit ``e`` of a corner under an element ``z``
    (rows ``e z^a``, coordinates) whose minimal polynomial has the coprime factors
    ``facs``: the Fitting idempotents ``pi_k(z)`` (orthogonal, nonzero, summing to ``e``),
    as rows of coordinates (see :meth:`_Search._children`)."""
    d = K.nrows
    parts = []
    for pi in fitting_polynomials(facs):
        co = pi.coeffs() + [F.zero] * (d - pi.degree - 1)
        parts.append(Mat.from_flat(F, 1, d, co[:d]) @ K)
    return parts


def _local_data(A: StructureAlgebra, corner_mult: list[Mat], ecoords: Mat) -> tuple[Mat, list]:
    """The radical of the corner and, when it has codimension 1, the residue map chi."""
    F = A.field
    c = len(corner_mult)
    if FAST_LOCAL:
        fast = _local_certificate(F, corner_mult, ecoords)
        if fast is not None:
            return fast
    rad = small_radical(F, corner_mult)
    if rad.nrows != c - 1:
        return rad, []
    M = Mat.vstack(F, [rad, ecoords], c)
    rhs = Mat.from_flat(F, 1, c, [F.zero] * (c - 1) + [F.one])
    chi = M.inverse() @ rhs.transpose()
    return rad, chi.entries()


def _new_class(A: StructureAlgebra, e: list[Any], RT: Mat, index, rows) -> _Class:
    """The class of the primitive idempotent ``e`` (``RT``: the transpose of right
    multiplication by ``e`` on span(index)); ``_NotPrimitive`` if ``e A e`` is not local."""
    F = A.field
    Lr, J, corner, Cb, piv, T, mult, Rp = _corner_data(A, e, RT, index, rows)
    ecoords = select_columns(as_row(A, restrict(e, index)), piv) @ T
    try:
        rad, chi = _local_data(A, mult, ecoords)
    except _NotPrimitive as exc:
        if exc.parts:  # from coordinates in the corner to vectors of A
            exc.parts = [embed(A, (v @ Cb).entries(), index) for v in exc.parts]
        raise
    if rad.nrows != len(corner) - 1:
        _residue_check(A, mult, rad, random.Random(len(corner)))
    # phi(b_j) = chi(e b_j e): col is x -> chi(x e) on span(index), then one pass over b_j
    chicol = Mat.from_flat(F, len(chi), 1, chi)
    col = embed(A, (Rp @ (T @ chicol)).entries(), index)
    phi = _group_form_of_products(A, e, RT, col) if index is None and rows is None else None
    if phi is None:
        phi = A._form_of_products(e, col, rows)  # e b_j = 0 outside f A
    # G[a][c] = phi(b_a b_c) = chi(e b_a b_c e) vanishes unless b_c e != 0, i.e. c in index
    cols = None if index is None else list(index)
    G = A._gram_raw(phi, rows=J, cols=cols)
    _, cpiv = G.rref()
    n_simple = len(cpiv)
    if n_simple == 0:
        raise InternalInconsistency("a primitive idempotent with a zero simple module")
    U = A._gram_raw(phi, cols=[c for c in cpiv] if cols is None else [cols[c] for c in cpiv])
    sec = list(select_independent_rows(U))
    if A._group_table() is not None:
        # a group algebra is symmetric (A ~ D(A) as modules; from memory), so
        # dim A e = dim Hom_A(e A, A) = dim Hom_A(e A, D(A)) = dim D(e A) = dim e A
        dim_Ae = len(J)
    else:
        dim_Ae = _dim_left_ideal(A, e, RT, hint=len(J))
    rowterms = A._row_terms_of(sec)
    return _Class(
        e,
        index,
        rows,
        RT,
        Lr,
        J,
        corner,
        rad,
        chi,
        phi,
        U,
        sec,
        n_simple,
        len(J),
        dim_Ae,
        mult,
        rowterms,
        corner_block=(Cb, (piv, T), Rp @ T),
    )


def _residue_field_error(A, c: int, codim: int, mult, rad, minpoly: Poly | None = None) -> None:
    hint = splitting_field_hint(A.field, codim, minpoly.coeffs() if minpoly is not None else None)
    raise NotSplitError(
        f"a simple module of the algebra does not split over {A.field}: the corner e A e of an "
        f"indecomposable projective (dimension {c}) is local, but its residue algebra has "
        f"dimension {codim} over {A.field} (the endomorphism ring of the simple is a proper "
        f"extension of the field){hint}. Remedy: use a field containing the missing roots, "
        "or supply a complete set of primitive orthogonal idempotents in the spec"
    )


def _random_element(F: Any, rng: random.Random, nonzero: bool = False) -> Any:
    """A random element of a finite extension field (uniform on its coefficients)."""
    while True:
        x = F.from_coeffs([rng.randrange(F.characteristic) for _ in range(F.degree)])
        if x or not nonzero:
            return x


def _dim_left_ideal(A: StructureAlgebra, f: list[Any], R: Mat, hint: int = 0) -> int:
    """``dim A f`` (= trace of R when the characteristic exceeds the dimension; ``R`` the
    right multiplication by ``f`` or its transpose; ``hint`` a guess of the value)."""
    p = A._char
    if p == 0 or p > A.dim:
        t = sum((a * b for a, b in zip(A.raw(A.trace_functional()), f, strict=True)), A._zero_raw())
        return int(t) % p if p else int(t)
    return sketched_rank(R, hint=hint)


# ----------------------------------------------------------------------------------
# the splitting tree


@dataclass(eq=False)  # nodes are compared by identity (a node's family holds the node)
class _Node:
    f: list[Any]
    index: list[int] | None
    rows: list[int] | None
    core: list[int] | None
    root: bool = False
    R: Mat | None = None
    RT: Mat | None = None  # transpose of R, for the Krylov chains
    dim_Af: int | None = None
    attempts: int = 0
    depth: int = 0
    parent_dim: int | None = None  # dim A f of the parent (the sum over its children)
    # dim A f of the parent's children, shared by them (a list of numbers, not of the
    # nodes: a finished sibling and its dense matrices must not be kept alive)
    family: list[int | None] | None = None
    slot: int = 0  # this node's place in ``family``
    ranks: list[int] = field(default_factory=list)  # dim L f for the first simples found
    lower: int | None = None  # a lower bound of dim A f (group algebras) ...
    lower_width: int = 0  # ... from that many elements of A f
    lower_full: bool = False  # ... read on every coordinate (a deficient rank is then final)
    fv: Any = None  # f as an int64 array of residues (vectorised tables; made on demand)


@dataclass
class _Search:
    A: StructureAlgebra
    rng: random.Random
    classes: list[_Class] = field(default_factory=list)
    stats: dict[str, float] = field(default_factory=dict)
    max_attempts: int = 32
    advance: Callable[[int], Any] = lambda n=1: None  # progress: dimension explained

    def __post_init__(self) -> None:
        p = self.A._char
        self.trace_exact = p == 0 or p > self.A.dim
        self.tau = _group_trace(self.A) or self.A.raw(self.A.trace_functional())
        self.pool: list[tuple[list[Any], Mat]] = []
        self.pool_T: dict[int, Mat] = {}  # transposed matrices of the pool (small algebras)
        self.spare = _Spare()  # node matrices no longer in use (group algebras)
        self._gen: Any = None  # numpy generator (group algebras), seeded from rng when made

    def dense(self, k: int) -> tuple[list[Any], Mat]:
        """The ``k``-th dense random element and its right multiplication matrix.

        A corner ``f A f`` is split with ``f w f`` for a dense ``w`` independent of
        ``f``; since ``f`` is a polynomial in the elements used above it, each depth
        of the tree uses its own element (one pass over the table per element).
        """
        A = self.A
        while len(self.pool) <= k:
            t0 = time.perf_counter()
            if A._p:
                w = [self.rng.randrange(A._p) for _ in range(A.dim)]
            elif A._char:  # GF(p^k): dense over the whole field
                w = [_random_element(A.field, self.rng) for _ in range(A.dim)]
            else:
                w = [A.field(self.rng.randint(-3, 3)) for _ in range(A.dim)]
            keep = A.dim <= KEEP_MATRICES_LIMIT
            self.pool.append((w, A._action(w, None, left=False) if keep else None))
            self.tick("dense_elements", t0)
        w, Rw = self.pool[k]
        if Rw is None:
            t0 = time.perf_counter()
            Rw = A._action(w, None, left=False)
            self.tick("dense_elements", t0)
        return w, Rw

    def dense_vector(self, k: int) -> list[Any]:
        """The ``k``-th dense random element (the same as :meth:`dense`, without its matrix)."""
        A = self.A
        while len(self.pool) <= k:
            if A._p:
                w = [self.rng.randrange(A._p) for _ in range(A.dim)]
            else:
                w = [A.field(self.rng.randint(-3, 3)) for _ in range(A.dim)]
            self.pool.append((w, None))
        return self.pool[k][0]

    def covered(self) -> int:
        return sum(c.n * c.dim_P for c in self.classes)

    def tick(self, key: str, t0: float) -> None:
        self.stats[key] = self.stats.get(key, 0.0) + time.perf_counter() - t0

    def ensure_RT(self, node: _Node) -> Mat:
        """The transpose of right multiplication by the node's idempotent (kept on the node)."""
        if node.RT is None:
            t0 = time.perf_counter()
            if node.root and node.index is None and node.R is None:
                node.R = Mat.identity(self.A.field, self.A.dim)
            if node.R is not None:
                node.RT = node.R.transpose()
            else:
                node.RT = self.spare.right_transposed(self.A, node.f, node.index)
            self.tick("node_matrices", t0)
        return node.RT

    def drop_matrices(self, node: _Node) -> None:
        """The node is done with: in a group algebra its matrix (built by :meth:`ensure_RT`
        on the group route, held by the node alone) is kept for the next node."""
        if self._group_route() and not node.root and node.index is None and node.R is None:
            self.spare.give(node.RT)
        node.R = node.RT = None

    def ensure_R(self, node: _Node) -> Mat:
        if node.R is None and node.root and node.index is None:
            node.R = Mat.identity(self.A.field, self.A.dim)
        if node.R is None:
            t0 = time.perf_counter()
            node.R = self.A._action(node.f, node.index, left=False)
            self.tick("node_matrices", t0)
        return node.R

    def trace(self, f: list[Any]) -> Any:
        t = sum((a * b for a, b in zip(self.tau, f, strict=True) if b), self.A._zero_raw())
        return t % self.A._p if self.A._p else t

    def exact_dim(self, node: _Node, at_least: int = 0) -> int:
        """``dim A f`` (``at_least``: a known lower bound, so that a rank by thin products
        starts wide enough)."""
        if node.dim_Af is None and node.family is not None and node.parent_dim is not None:
            # f_1 + ... + f_r = f orthogonal: A f is the direct sum of the A f_i
            others = [d for i, d in enumerate(node.family) if i != node.slot]
            if all(d is not None for d in others):
                node.dim_Af = node.parent_dim - sum(others)
        if node.dim_Af is None:
            node.dim_Af = (
                int(self.trace(node.f))
                if self.trace_exact
                else sketched_rank(self.ensure_RT(node), hint=at_least)
            )
        if node.family is not None:
            node.family[node.slot] = node.dim_Af
        return node.dim_Af

    def known_ranks(self, f: list[Any]) -> list[int]:
        """``dim L f`` for the simples found so far (cheap: via their sections)."""
        return [_rank_in_simple(self.A, c, f) for c in self.classes]

    def node_ranks(self, node: _Node) -> list[int]:
        """:meth:`known_ranks` of the node's idempotent, kept on the node (only the simples
        found since the last call are added)."""
        done = node.ranks
        if len(done) < len(self.classes):
            fv = self.node_array(node) if self.A._vectorised() else None
            done.extend(_rank_in_simple(self.A, c, node.f, fv) for c in self.classes[len(done) :])
        return list(done)

    def gen(self) -> Any:
        """A numpy random generator for the whole search, seeded from ``rng`` when first
        asked for (making one per random element costs more than the element)."""
        if self._gen is None:
            import numpy as np

            self._gen = np.random.default_rng(self.rng.randrange(2**32))
        return self._gen

    def node_array(self, node: _Node) -> Any:
        """The node's idempotent as an int64 array of residues (kept on the node)."""
        if node.fv is None:
            import numpy as np

            node.fv = np.fromiter(map(int, node.f), dtype=np.int64, count=len(node.f))
            node.fv %= self.A._p
        return node.fv

    def screen(self, node: _Node, exact: bool = False) -> str:
        """``skip`` (no new simple in f), ``explore`` or ``defer`` (undecided cheaply; with
        ``exact`` the dimension of ``A f`` is computed instead of deferring)."""
        r = self.node_ranks(node)
        explained = sum(rj * c.dim_Ae for rj, c in zip(r, self.classes, strict=True))
        if self.trace_exact or node.dim_Af is not None or exact:
            unk = self.exact_dim(node, at_least=explained) - explained
            if unk < 0:
                raise InternalInconsistency("more of A f explained by known simples than exists")
            return "explore" if unk else "skip"
        if sum(r) == 0:
            return "explore"
        p = self.A._char
        return "explore" if (int(self.trace(node.f)) - explained) % p else "defer"

    def random_sparse(self, node: _Node) -> list[Any]:
        A, rng = self.A, self.rng
        core = list(range(A.dim)) if node.core is None else node.core
        grow = 2 ** min(node.attempts, 20)
        if A._p:
            top = min(len(core), 32 * grow)
            k = rng.randint(max(1, top // 2), top) if A._p < 5 else top
            coef = lambda: rng.randrange(1, A._p)  # noqa: E731
        elif A._char:  # GF(p^k): random nonzero scalars from the whole field
            top = min(len(core), 32 * grow)
            k = rng.randint(max(1, top // 2), top) if A._char < 5 else top
            coef = lambda: _random_element(A.field, rng, nonzero=True)  # noqa: E731
        else:
            # over QQ a component M_r(QQ) splits only with rational eigenvalues: single basis
            # elements (often of small rank in a corner) work best, larger sums now and then
            # a dense element separates different components (distinct minimal polynomials)
            k = (
                len(core)
                if node.attempts % 2
                else min(len(core), (1, 1, 2, 1, 3)[node.attempts % 5])
            )
            coef = lambda: A.field(rng.choice((-3, -2, -1, 1, 2, 3)))  # noqa: E731
        y = [A._zero_raw()] * A.dim
        for i in rng.sample(core, k):
            y[i] = coef()
        return y

    def split_attempt(self, node: _Node) -> list[Any] | tuple[Poly, int]:
        """Try one random element ``z = f y f``; children vectors, or the single factor."""
        A = self.A
        node.attempts += 1
        if GROUP_SPLIT and node.index is None and A._group_table() is not None:
            out = self._split_group(node)
            if out is not None:
                return out
        m = A.dim if node.index is None else len(node.index)
        if m >= 256 and A._vectorised():
            # Krylov chains by column products with the transposes, built as such
            t0 = time.perf_counter()
            if node.index is None and A.dim > 64:
                k = node.depth + node.attempts - 1
                w = self.dense_vector(k)
                Ty = self.pool_T.get(k)
                if Ty is None:
                    Ty = A._right_action_transposed(w, None)
                    kept = 8 * A.dim * A.dim * (len(self.pool_T) + 1)
                    if A.dim <= KEEP_MATRICES_LIMIT or kept <= POOL_BYTES:
                        self.pool_T[k] = Ty  # the first few serve every node of their depth
            else:
                Ty = A._right_action_transposed(self.random_sparse(node), node.index)
            mats = [Ty]
            if not node.root:
                if node.RT is None:  # kept while the node is being split
                    node.RT = A._right_action_transposed(node.f, node.index)
                mats.append(node.RT)
            self.tick("dense_elements", t0)
            t0 = time.perf_counter()
            v0 = as_row(A, restrict(node.f, node.index))
            K, c = krylov(v0, None, step=chain_step([], mats), limit=v0.ncols)
            self.tick("krylov", t0)
            return self._children(node, K, c)
        if node.index is None and A._p and A.dim > 64:
            _, Ry = self.dense(node.depth + node.attempts - 1)
        else:
            Ry = A._action(self.random_sparse(node), node.index, left=False)
        R = None if node.root else self.ensure_R(node)
        t0 = time.perf_counter()
        v0 = as_row(A, restrict(node.f, node.index))
        if v0.ncols >= 256:
            step = chain_step([Ry] if R is None else [Ry, R])
            K, c = krylov(v0, None, step=step, limit=v0.ncols)
        elif R is None:
            K, c = krylov(v0, Ry, limit=v0.ncols)
        else:
            K, c = krylov(v0, None, step=lambda v: (v @ Ry) @ R, limit=v0.ncols)
        self.tick("krylov", t0)
        return self._children(node, K, c)

    def _split_group(self, node: _Node) -> list[Any] | tuple[Poly, int] | None:
        """:meth:`split_attempt` in a group algebra: ``z = f y f`` with ``y`` supported on a
        few random group elements (up to ``GROUP_SUPPORT``, doubled on each further attempt
        at the same node up to eight times that, and at most half of the group).

        Right multiplication by a group element permutes the coordinates, so ``v -> v y``
        costs a few gathers and the Krylov chain ``f, f z, f z^2, ...`` (with
        ``f z^k = (f z^(k-1)) y f``) needs one dense matrix, that of ``f`` (none at the
        root), instead of one per random element.  ``None`` when the one-piece copies
        into flint are unavailable (the general route runs instead)."""
        import numpy as np

        A = self.A
        F, p, n = A.field, A._p, A.dim
        if not bulk_available():
            return None  # no one-piece copies: the general route
        first = self.node_array(node)
        left = A._group_table()[2]  # x b_j = x[left[j]]
        # at most half of the group (over GF(2) the sum of all elements is central), and a
        # random size (sums of the same length lie in one coset of a small subspace)
        top = max(1, min(n // 2, GROUP_SUPPORT << min(node.attempts - 1, 3)))
        gen = self.gen()
        js = gen.choice(n, size=self.rng.randint(max(1, top // 2), top), replace=False)
        coefs = gen.integers(1, p, size=len(js), dtype=np.int64)
        RT = None if node.root else self.ensure_RT(node)
        t0 = time.perf_counter()
        gathers = left[js]  # row t: the permutation of y's t-th group element

        def advance(x: Mat) -> Mat:
            v = np.frombuffer(read_residues(x._m), dtype=np.int64)
            w = dot_mod(coefs, v[gathers], p)  # partial sums below 2^63 for any p < 2^31
            col = residue_matrix(F, n, 1, w)
            return col if RT is None else RT @ col

        v0 = residue_matrix(F, 1, n, first)
        out = _krylov_columns(v0, v0, advance, n, fine=RT is not None)
        self.tick("krylov", t0)
        if out is None:
            return None
        return self._children(node, *out)

    def _children(self, node: _Node, K: Mat, c: list[Any]) -> list[Any] | tuple[Poly, int]:
        """From the Krylov sequence of ``z``: children vectors, or the single factor."""
        A = self.A
        F = A.field
        mu = minpoly(F, K.nrows, c)
        facs = mu.factor()
        if len(facs) == 1:
            return facs[0]
        kids = []
        for pi in fitting_polynomials(facs):
            co = pi.coeffs() + [F.zero] * (K.nrows - pi.degree - 1)
            v = Mat.from_flat(F, 1, K.nrows, co[: K.nrows]) @ K
            buf = read_residues(v._m) if A._p and isinstance(F, PrimeField) else None
            if buf is not None and node.index is None:
                kids.append(buf.tolist())  # residues in one piece
            else:
                kids.append(embed(A, v.entries(), node.index))
        return kids

    def explore(self, start: list[_Node], n_total: int) -> None:
        stack = list(reversed(start))
        deferred: list[_Node] = []
        while self.covered() < n_total:
            if stack:
                node = stack.pop()
                verdict = self.screen(node)
                if verdict == "defer":
                    deferred.append(node)
                    continue
            elif deferred:
                node, verdict = self._next_deferred(deferred)
            else:
                break
            if verdict == "skip":
                continue
            kids = self.process(node)
            if kids:
                scored = []
                for kid in kids:
                    known = sum(self.node_ranks(kid))
                    scored.append(
                        ((known > 0, int(self.trace(kid.f)) if self.trace_exact else 0), kid)
                    )
                scored.sort(key=lambda s: s[0])
                stack.extend(k for _, k in reversed(scored))

    def _group_route(self) -> bool:
        return GROUP_SPLIT and self.A._group_table() is not None

    def _next_deferred(self, deferred: list[_Node]) -> tuple[_Node, str]:
        """The next deferred node and its verdict.  In a group algebra, the only deferred
        node is explored at once, and a node whose ``A f`` is shown larger than the known
        simples explain by a cheap lower bound (:meth:`_group_lower_dim`) comes first;
        otherwise the last one, screened exactly."""
        if self._group_route():
            if len(deferred) == 1:
                # the frontier of the tree sums to 1; skipped nodes and certified leaves
                # meet no unknown simple, and one is unknown (dim A is not yet explained):
                # the only deferred node meets it
                return deferred.pop(), "explore"
            for i in range(len(deferred) - 1, -1, -1):
                node = deferred[i]
                r = self.node_ranks(node)
                explained = sum(rj * c.dim_Ae for rj, c in zip(r, self.classes, strict=True))
                if node.dim_Af is None and self._group_lower_dim(node, explained) > explained:
                    del deferred[i]
                    return node, "explore"
        node = deferred.pop()
        return node, self.screen(node, exact=True)

    def _group_lower_dim(self, node: _Node, explained: int) -> int:
        """A lower bound of ``dim A f`` in a group algebra: the rank of ``explained + 16``
        elements ``x f`` with ``x`` supported on eight random group elements (``x f`` costs
        eight permutations of ``f``), read on ``explained + 48`` random coordinates only
        (a submatrix: its rank is at most that of all the coordinates).  Elements of
        ``A f``, so never more than its dimension; usually equal to it or to their number."""
        import numpy as np

        A = self.A
        p, n = A._p, A.dim
        w = min(n, explained + 16)
        if node.lower is not None and (
            (node.lower_full and node.lower < node.lower_width) or node.lower_width >= w
        ):
            return node.lower
        t0 = time.perf_counter()
        gen = self.gen()
        right = A._group_table()[1]  # b_h f = f[right[h]]
        fv = self.node_array(node)
        m = min(n, w + 32)
        coords = np.sort(gen.choice(n, size=m, replace=False)) if m < n else np.arange(n)
        # the table on those coordinates once: each element is then a gather of whole rows
        right = right[:, coords] if m < n else right
        hs = gen.integers(0, n, size=(8, w))  # x_j = sum_t c_tj b_(hs[t, j])
        terms = fv[right[hs]]  # terms[t, j]: b_(hs[t, j]) f on the coordinates
        if p > 2:
            terms *= gen.integers(1, p, size=(8, w, 1), dtype=np.int64)  # below p^2 < 2^62
            if 8 * (p - 1) ** 2 >= 2**63:
                terms %= p  # then sums of eight stay below 2^63
        acc = terms.sum(axis=0) % p
        node.lower = residue_matrix(A.field, w, m, acc.ravel()).rank()
        node.lower_width = w
        node.lower_full = m == n
        self.tick("group_bounds", t0)
        return node.lower

    def process(self, node: _Node) -> list[_Node]:
        """Split ``node`` (returning its children) or certify it as a new simple."""
        hits = 0
        degrees: list[int] = []
        while True:
            if node.attempts >= (self.max_attempts if self.A._p else 3 * self.max_attempts):
                self._give_up(node, degrees)
            res = self.split_attempt(node)
            if isinstance(res, list):
                return self._split_into(node, res)
            g, _ = res
            degrees.append(g.degree)
            # z = lambda f + nilpotent with lambda != 0 is evidence that f A f is local;
            # a nilpotent z says nothing
            if g.degree == 1 and g.coeffs()[0] != 0:
                hits += 1
            # in a group algebra over a small field the sparse elements of _split_group
            # are cheap and a failed certification is not: more of them first
            few = GROUP_EVIDENCE.get(self.A._p, 0) if self._group_route() else 0
            if (hits >= (2 if self.A._p else 3) and len(degrees) >= few) or len(degrees) >= 8:
                t0 = time.perf_counter()
                try:
                    cl = _new_class(
                        self.A,
                        node.f,
                        self.ensure_RT(node),
                        node.index,
                        node.rows,
                    )
                except _NotPrimitive as exc:
                    if exc.parts:  # the corner's own element split it: its children
                        return self._split_into(node, exc.parts)
                    hits = 0
                    degrees = degrees[-2:]
                    continue
                finally:
                    self.tick("certify", t0)
                if sum(self.node_ranks(node)):
                    raise InternalInconsistency("a primitive idempotent of a known class was kept")
                if cl.index is None and (self.A.dim > KEEP_MATRICES_LIMIT or self._group_route()):
                    # rebuilt by _class_RT when the basic algebra is assembled (in a group
                    # algebra one gather into the memory of a matrix no longer in use)
                    cl.RT = None
                    self.drop_matrices(node)
                node.R = node.RT = None
                self.classes.append(cl)
                self.advance(cl.n * cl.dim_P)
                return []

    def _split_into(self, node: _Node, fs: list[list[Any]]) -> list[_Node]:
        """The children of ``node``: orthogonal idempotents ``fs`` summing to its own."""
        self.drop_matrices(node)
        d = node.depth + node.attempts
        dims: list[int | None] = [None] * len(fs)
        return [
            _Node(
                f,
                node.index,
                node.rows,
                node.core,
                depth=d,
                parent_dim=node.dim_Af,
                family=dims,
                slot=i,
            )
            for i, f in enumerate(fs)
        ]

    def _give_up(self, node: _Node, degrees: list[int]) -> None:
        A = self.A
        raise NotSplitError(
            f"no splitting element found: {node.attempts} random elements of a corner f A f "
            f"(dim A f = {self.exact_dim(node)}) had minimal polynomials with a single "
            f"irreducible factor (degrees {sorted(set(degrees)) or '?'}); the algebra may not "
            f"split over {A.field}. Remedy: use another field (for GF(p), a prime containing "
            "the needed roots of unity), or supply a complete set of primitive orthogonal "
            "idempotents in the spec"
        )


def _rank_in_simple(A: StructureAlgebra, c: _Class, f: list[Any], fv: Any = None) -> int:
    """``dim L f`` for the simple ``L`` of class ``c``: rank of ``(b_s f) U`` over the section
    (``fv``: optionally ``f`` as an int64 array of residues)."""
    F = A.field
    p = A._p
    if A._vectorised() and A.dim * (p - 1) ** 2 < 2**63:
        return _rank_in_simple_vectorised(A, c, f, fv)
    if c.urows is None:
        c.urows = raw_rows(A, c.U)
    width = c.n
    rows = []
    for s in c.sec:
        out: dict[int, Any] = {}
        js, ks, cs = c.rowterms[s]
        for j, k, coef in zip(js, ks, cs, strict=True):
            fj = f[j]
            if fj:
                out[k] = out.get(k, 0) + fj * coef
        acc = [A._zero_raw()] * width
        for k, v in out.items():
            if v:
                u = c.urows[k]
                for a in range(width):
                    if u[a]:
                        acc[a] += v * u[a]
        rows.append([x % p for x in acc] if p else acc)
    return matrix_from_ints(F, len(rows), width, [x for r in rows for x in r]).rank()


def _rank_in_simple_vectorised(A: StructureAlgebra, c: _Class, f: list[Any], fv: Any = None) -> int:
    """:func:`_rank_in_simple` with int64 arrays: ``(b_s f) U`` for the section rows at once
    (every product of residues and every sum of ``dim A`` of them stays below 2^63)."""
    import numpy as np

    p = A._p
    Ua = c.uarray
    if Ua is None:
        buf = read_residues(c.U._m) if isinstance(A.field, PrimeField) else None
        if buf is not None:
            Ua = np.frombuffer(buf, dtype=np.int64).reshape(A.dim, c.n)
        else:
            if c.urows is None:
                c.urows = raw_rows(A, c.U)
            Ua = np.asarray(c.urows, dtype=np.int64).reshape(A.dim, c.n)
        c.uarray = Ua
    if fv is None:
        fv = np.asarray([int(x) % p for x in f], dtype=np.int64)
    out = np.zeros((len(c.sec), A.dim), dtype=np.int64)
    group = A._group_table()
    if group is not None:  # b_s f = sum_j f_j b_(P[s, j]): one permutation of f per row
        out[np.arange(len(c.sec))[:, None], group[0][c.sec]] = fv[None, :]
        M = (out @ Ua) % p
        return matrix_from_ints(A.field, len(c.sec), c.n, M.ravel().tolist()).rank()
    for r, s in enumerate(c.sec):
        js, ks, cs = c.rowterms[s]
        if not len(js):
            continue
        ja = np.frombuffer(js, dtype=np.int64)
        vals = (fv[ja] * np.frombuffer(cs, dtype=np.int64)) % p
        nz = vals != 0
        if nz.any():
            np.add.at(out[r], np.frombuffer(ks, dtype=np.int64)[nz], vals[nz])
    out %= p
    M = (out @ Ua) % p
    return matrix_from_ints(A.field, len(c.sec), c.n, M.ravel().tolist()).rank()


def _roots(A: StructureAlgebra) -> list[_Node]:
    """The starting nodes: the whole algebra, or its Peirce corners for basis idempotents."""
    n = A.dim
    peirce = A.peirce_idempotents()
    if peirce is None:
        return [
            # R (the identity) is made only if asked for: the splits of the root never use it
            _Node(list(A._unit), None, None, None, root=True, dim_Af=n)
        ]
    nodes = []
    for s in peirce:
        index = [i for i in range(n) if A.peirce_block(i)[1] == s]
        rows = [i for i in range(n) if A.peirce_block(i)[0] == s]
        core = [i for i in range(n) if A.peirce_block(i) == (s, s)]
        f = [A._zero_raw()] * n
        f[s] = 1 if A._p else A.field.one
        R = Mat.identity(A.field, len(index))
        nodes.append(_Node(f, index, rows, core, root=True, R=R, dim_Af=len(index)))
    return nodes


def _residue_check(A: StructureAlgebra, mult: list[Mat], rad: Mat, rng: random.Random) -> None:
    """Raise NotSplitError when ``corner / rad`` is a proper field extension, else _NotPrimitive."""
    F = A.field
    c = len(mult)
    Q = Mat.identity(F, c)
    if rad.nrows:
        comp = [j for j in range(c) if j not in set(rad.rref()[1])]
        Q = Mat.vstack(F, [rad, Mat.unit_rows(F, c, comp)], c)
    d = c - rad.nrows
    Qi = Q.inverse()  # coordinates in the basis (rad, complement)

    def residue_minpoly(x: list[Any]) -> list[tuple[Poly, int]]:
        # right multiplication by x on the quotient corner / rad
        Rx = Mat.zeros(F, c, c)
        for l, xl in enumerate(x):
            if xl != 0:
                Rx = Rx + mult[l].scale(xl)
        Mq = (Q @ Rx @ Qi).take_rows(list(range(rad.nrows, c)))
        Mq = select_columns(Mq, list(range(rad.nrows, c)))
        K, co = krylov(Mat.unit_rows(F, d, [0]), Mq)
        return minpoly(F, K.nrows, co).factor()

    for _ in range(4):
        facs = residue_minpoly([F(rng.randrange(1, 97)) for _ in range(c)])
        if len(facs) == 1 and facs[0][1] == 1 and facs[0][0].degree == d:
            # a proper field extension: name it by the simplest primitive element at hand
            best = facs[0][0]
            if F.characteristic == 0 and c <= 16:
                for j in range(c):
                    g = residue_minpoly([F.one if k == j else F.zero for k in range(c)])
                    if len(g) == 1 and g[0][0].degree == d and _height(g[0][0]) < _height(best):
                        best = g[0][0]
            _residue_field_error(A, c, d, mult, rad, best)
        if len(facs) > 1:
            break
    raise _NotPrimitive()


def _height(g: Poly) -> int:
    """Size of a rational polynomial's coefficients (to pick a readable one)."""
    return sum(len(str(x)) for x in g.coeffs())


# ----------------------------------------------------------------------------------
# the basic algebra


@dataclass(frozen=True)
class Reduction:
    """The result of :func:`reduce_algebra`.

    Attributes
    ----------
    basic : BasicAlgebra
        The basic algebra ``e A e`` with its Gabriel quiver; ``basic.morita``
        holds ``dim L(i)``.
    idempotents : tuple of tuple
        One primitive idempotent per simple (coordinates in the basis of ``A``),
        in the vertex order of ``basic``.
    simple_dimensions, projective_dimensions : tuple of int
        ``dim L(i)`` and ``dim P(i) = dim e_i A``; ``dim A = sum`` of their products.
    radical_dimension : int
        ``dim A - sum dim L(i)^2``.
    """

    algebra: StructureAlgebra = field(repr=False)
    basic: BasicAlgebra
    idempotents: tuple[tuple[Any, ...], ...] = field(repr=False)
    simple_dimensions: tuple[int, ...]
    projective_dimensions: tuple[int, ...]
    radical_dimension: int
    method: str
    seed: int
    timings: dict[str, float] = field(default_factory=dict, repr=False, compare=False)
    _classes: tuple = field(default=(), repr=False, compare=False)

    def simple_action_rank(self, i: int, x: Sequence[Any]) -> int:
        """``dim L(i) x``: the rank of ``x`` (coordinates in the basis of the input
        algebra) acting on the simple module of vertex ``i`` of :attr:`basic`."""
        return _rank_in_simple(self.algebra, self._classes[i], self.algebra.raw(list(x)))

    def relabelled(self, names: Sequence[str], *, natural_order: str | None = None) -> Reduction:
        """The same reduction with the simples renamed (see ``BasicAlgebra.with_vertex_names``)."""
        import dataclasses

        B = self.basic.with_vertex_names(names, natural_order=natural_order)
        if self.basic.is_cached(ARROW_TERMS):  # the arrows do not change with the names
            B.cached(ARROW_TERMS, lambda: self.basic.cached(ARROW_TERMS, tuple))
        red = dataclasses.replace(self, basic=B)
        B.cached(REDUCTION, lambda: red)
        return red

    def idempotent_texts(self) -> list[str]:
        return [self.algebra.element_text(list(e)) for e in self.idempotents]

    def radical(self) -> Mat:
        """The radical of the input algebra: ``x`` with ``L(i) x = 0`` for every simple."""
        A = self.algebra
        F = A.field
        blocks = []
        for c in self._classes:
            # L(i) = A / K, K = {x : phi(x A) = 0}; x is radical iff b_s x lies in K for the
            # section elements b_s, i.e. (b_s x) @ U = 0
            for s in c.sec:
                js, ks, cs = c.rowterms[s]
                Lb = sparse_matrix(F, A.dim, A.dim, {})
                entries: dict[tuple[int, int], Any] = {}
                for j, k, coef in zip(js, ks, cs, strict=True):
                    entries[(j, k)] = entries.get((j, k), A._zero_raw()) + coef
                Lb = sparse_matrix(F, A.dim, A.dim, entries)  # row j: b_s * b_j
                blocks.append(Lb @ c.U)
        if not blocks:
            return Mat.identity(F, A.dim)
        M = Mat.hstack(F, blocks)
        return echelon(M.left_kernel())

    def to_dict(self) -> dict[str, Any]:
        A = self.algebra
        return {
            "name": A.name,
            "field": A.field.name,
            "dimension": A.dim,
            "basic_dimension": self.basic.dim,
            "simples": list(self.basic.vertices),
            "simple_dimensions": list(self.simple_dimensions),
            "projective_dimensions": list(self.projective_dimensions),
            "radical_dimension": self.radical_dimension,
            "idempotents": self.idempotent_texts(),
            "cartan": [list(r) for r in self.basic.cartan()],
            "method": self.method,
            "seed": self.seed,
            "associativity": A.associativity.to_dict(),
        }


KEEP_MATRICES_LIMIT = 2500
"""Above this dimension the dense ``dim A x dim A`` matrices of the search (random
elements, simples) are not kept but rebuilt from the table when needed again: one
vectorised pass over the table costs far less than the memory they would hold."""


POOL_BYTES = 1 << 29
"""Above ``KEEP_MATRICES_LIMIT`` the transposed matrices of the first dense random elements
are still kept while they take at most this many bytes: each serves every node of one
depth of the splitting tree."""


GROUP_SPLIT = True
"""Switch for :meth:`_Search._split_group` (sparse random elements of a group algebra;
tests compare both routes)."""

GROUP_SUPPORT = 16
"""Number of group elements in the first random element tried at a node of a group algebra."""

GROUP_EVIDENCE = {2: 4, 3: 2}
"""In a group algebra over GF(2) or GF(3): random elements of a corner with a single
factor in their minimal polynomial seen before the corner is certified local.  A corner
that is not local costs little more than a further element: its certificate stops at
the first basis element with two coprime factors, whose Fitting idempotents split the
node (:func:`_fitting_parts`).  On S_6 over GF(3), 2 instead of 4 took 9 % off the
reduction (ten seeds, the same process); over GF(2), where a corner ``F x F`` gives a
single factor more often (half the time against a third) and a certificate of S_7
costs seconds, 4 stay."""


class _Spare:
    """Dense ``dim A x dim A`` matrices whose owners are done with them, overwritten by the
    next matrix of a group algebra (:meth:`StructureAlgebra._right_action_transposed` with
    ``out``): writing memory already in use costs far less than touching fresh pages (on
    S_6, a 720 x 720 matrix in 0.5 ms instead of 2 to 7 ms).  Only matrices held by
    nobody else may be given."""

    LIMIT = 2

    def __init__(self) -> None:
        self.mats: list[Mat] = []

    def give(self, M: Mat | None) -> None:
        if M is not None and len(self.mats) < self.LIMIT:
            self.mats.append(M)

    def right_transposed(self, A: StructureAlgebra, e: list[Any], index) -> Mat:
        """``A._right_action_transposed(e, index)``, in the memory of a spare matrix."""
        out = None
        if index is None and self.mats and self.mats[-1].nrows == A.dim:
            out = self.mats.pop()
        return A._right_action_transposed(e, index, out=out)


def _class_RT(A: StructureAlgebra, c: _Class, spare: _Spare | None = None) -> Mat:
    """Transposed right multiplication by the class's idempotent (kept, or rebuilt, in the
    memory of a spare matrix if ``spare`` holds one)."""
    if c.RT is not None:
        return c.RT
    if spare is not None:
        return spare.right_transposed(A, c.e, c.index)
    return A._right_action_transposed(c.e, c.index)


BLOCK_START_WIDTH = 8
"""Columns of the first thin product for the blocks ``e_s A e_t`` beyond the margin of the
field (:func:`~hwcat.algebras.reduction.sketch.margin`; 32 columns over GF(2), 24 over
GF(3)): the blocks usually have dimension a few units; wider products follow when one
is not."""


def _block_sketch(A: StructureAlgebra, RtT: Mat, width: int, seed: int) -> Mat | None:
    """``R_t Y`` for a random ``Y`` with ``width`` columns (``RtT`` the transpose of
    ``R_t``), or ``None`` when the blocks are better found without it."""
    if not (sketch.USE_SKETCH and A._p) or 3 * width > RtT.nrows or RtT.nrows < sketch.MIN_SIZE:
        return None
    Yt = sketch.draw_kept(_kept_draws(A), A.field, width, RtT.nrows, seed)
    return (Yt @ RtT).transpose()


def _kept_draws(A: StructureAlgebra) -> dict:
    """Random matrices of the thin products kept with the algebra: the same draw serves
    every idempotent (a sketch's result does not depend on it; drawing costs about a
    tenth of the product)."""
    return A._cache.setdefault("sketch_draws", {})


def _block_bases(
    A: StructureAlgebra, classes: list[_Class], spare: _Spare | None = None
) -> tuple[dict, dict, dict, dict]:
    """For all ``s, t``: basis indices ``l`` with ``e_s b_l e_t`` a basis of ``e_s A e_t``,
    those elements (coordinates on span(index_t)), their coordinate solvers and the
    columns of ``R_t`` at the solvers' pivots (times the solver); ``spare``: memory for
    the matrices of right multiplication that are rebuilt."""
    gen: dict[tuple[int, int], list[int]] = {}
    basis: dict[tuple[int, int], Mat] = {}
    solver: dict[tuple[int, int], tuple[tuple[int, ...], Mat]] = {}
    colsR: dict[tuple[int, int], Mat] = {}
    with task("blocks of the basic algebra", total=len(classes)) as step:
        for t, ct in enumerate(classes):
            _find_blocks(A, classes, t, ct, gen, basis, solver, colsR, spare)
            step(1)
    # e_s A is the sum of the e_s A f over a complete set of primitive idempotents f, of
    # which dim L(t) are conjugate to e_t: every block was found in full
    for s, cs in enumerate(classes):
        if sum(ct.n * len(gen[(s, t)]) for t, ct in enumerate(classes)) != cs.dim_P:
            raise InternalInconsistency(
                f"the blocks e_s A e_t of vertex {s + 1} do not add up to dim e_s A = {cs.dim_P}"
            )
    return gen, basis, solver, colsR


def _find_blocks(
    A: StructureAlgebra,
    classes: list[_Class],
    t: int,
    ct: _Class,
    gen: dict,
    basis: dict,
    solver: dict,
    colsR: dict,
    spare: _Spare | None = None,
) -> None:
    """The blocks ``e_s A e_t`` for one ``t`` and every ``s`` (see :func:`_block_bases`)."""
    F = A.field
    if A._group_table() is not None and ct.dim_P == ct.n and ct.corner_block is not None:
        # P(t) = e_t A has the dimension of its top L(t): it is simple, and in a group
        # algebra (symmetric: socle of P(s) = top, from memory) e_s A e_t = Hom(P(t), P(s))
        # and e_t A e_s = Hom(P(s), L(t)) vanish for s != t; e_t A e_t = End L(t) is the
        # corner, found with the class (the sums checked in _block_bases cover all this)
        if len(ct.corner) != 1:
            raise InternalInconsistency("a simple projective with a corner of dimension > 1")
        for s in range(len(classes)):
            if s == t:
                B, solv, cols = ct.corner_block
                gen[(t, t)] = list(ct.corner)
                basis[(t, t)], solver[(t, t)], colsR[(t, t)] = B, solv, cols
            else:
                gen[(s, t)] = []
                basis[(s, t)] = Mat.zeros(F, 0, A.dim if ct.index is None else len(ct.index))
                solver[(s, t)] = ((), Mat.zeros(F, 0, 0))
        return
    # one right multiplication matrix alive at a time, transposed: flint multiplies a
    # square matrix by a thin one faster than a thin one by a square one
    RtT = _class_RT(A, ct, spare)
    # the blocks are usually far smaller than dim A e_t: sketches of growing width
    m = sketch.margin(F) if A._p else sketch.MARGIN
    width = BLOCK_START_WIDTH + m
    sk = _block_sketch(A, RtT, width, 1000)
    Ls_all = [apply_transfer(cs.L, transfer(A, cs.rows, ct.index)) for cs in classes]
    # the sketches of all Ls @ R_t from one product (Ls @ (R_t Y), rows of every s)
    sks = None
    if sk is not None:
        sks = _split_rows(Mat.vstack(F, Ls_all, RtT.nrows) @ sk, [L.nrows for L in Ls_all])
    chosen: list[tuple[list[int], Mat | None, Mat]] = []  # (pos, B or None, Ls) per s
    for s, Ls in enumerate(Ls_all):
        pos: list[int] | None = None
        while sk is not None and Ls.nrows:
            # rows of Ls @ R_t, found through R_t Y
            pos = select_independent_rows(sks[s] if sks is not None else Ls @ sk)
            if len(pos) + m <= width:
                break
            pos, sks = None, None
            width *= 4
            sk = _block_sketch(A, RtT, width, 1000 + width)
        if pos is None:
            X = _times_transposed(Ls, RtT)  # = Ls @ R_t
            pos = select_independent_rows(X) if X.nrows else []
            chosen.append((pos, X.take_rows(pos) if pos else Mat.zeros(F, 0, X.ncols), Ls))
        else:
            chosen.append((pos, None if pos else Mat.zeros(F, 0, RtT.nrows), Ls))
    # the rows e_s b_l e_t still wanted, for all s in one product with R_t (a product with
    # a few thin ones costs about as much as with one of their total width)
    wanted = [s for s, (_, B, _) in enumerate(chosen) if B is None]
    if wanted:
        stacked = Mat.vstack(F, [take_rows(chosen[s][2], chosen[s][0]) for s in wanted], RtT.nrows)
        together = _times_transposed(stacked, RtT)
        off = 0
        for s in wanted:
            k = len(chosen[s][0])
            chosen[s] = (chosen[s][0], take_rows(together, range(off, off + k)), chosen[s][2])
            off += k
    for s, cs in enumerate(classes):
        pos, B, _ = chosen[s]
        gen[(s, t)] = [cs.J[k] for k in pos]
        if s == t and gen[(s, t)] != cs.corner:
            raise InternalInconsistency("corner basis chosen twice differently")
        basis[(s, t)] = B
        solver[(s, t)] = coords_solver(B) if pos else ((), Mat.zeros(F, 0, 0))
        if pos:
            piv, T = solver[(s, t)]
            colsR[(s, t)] = take_rows(RtT, list(piv)).transpose() @ T  # columns piv of R_t
    if spare is not None and ct.RT is None:
        spare.give(RtT)  # rebuilt here and held by nobody else
    del RtT, sk


def _split_rows(M: Mat, sizes: list[int]) -> list[Mat]:
    """``M`` cut into consecutive row blocks of the given sizes."""
    out, off = [], 0
    for k in sizes:
        out.append(take_rows(M, range(off, off + k)))
        off += k
    return out


def _block_products(
    A: StructureAlgebra, classes: list[_Class], gen: dict, basis: dict, colsR: dict
) -> dict[tuple[int, int, int], list[Mat]]:
    """``mult[(s, u, t)][j]``: right multiplication by the ``j``-th basis element
    ``e_u b_l e_t`` of ``e_u A e_t``, from ``e_s A e_u`` to ``e_s A e_t`` (coordinates).

    ``x e_u b_l e_t = ((x b_l) restricted) e_t`` for ``x`` in ``e_s A e_u``; with the
    table passes vectorised, the products with ``b_l`` of the bases of all ``e_s A e_u``
    are formed at once as arrays."""
    F = A.field
    m = len(classes)
    dims = {k: v.nrows for k, v in basis.items()}
    mult: dict[tuple[int, int, int], list[Mat]] = {}
    vector = A._vectorised()
    for u in range(m):
        stacked = None
        if vector and any(dims[(s, u)] for s in range(m)):
            import numpy as np

            stacked = np.vstack(
                [_np_embedded(A, basis[(s, u)], classes[u].index) for s in range(m)]
            )
        for t in range(m):
            it = classes[t].index
            for l in gen[(u, t)]:
                prod = A._times_basis_rows(stacked, l) if stacked is not None else None
                off = 0
                for s in range(m):
                    key = (s, u, t)
                    mult.setdefault(key, [])
                    r = dims[(s, u)]
                    if not r:
                        mult[key].append(Mat.zeros(F, 0, dims[(s, t)]))
                        continue
                    if prod is not None:
                        block = prod[off : off + r]
                        if it is not None:
                            block = block[:, it]
                        P = residue_matrix(F, r, block.shape[1], block.ravel().copy())
                    else:
                        xs = [embed(A, x, classes[u].index) for x in raw_rows(A, basis[(s, u)])]
                        prods = [restrict(A._times_basis_raw(x, l), it) for x in xs]
                        P = Mat.from_flat(F, r, len(prods[0]), [v for row in prods for v in row])
                    off += r
                    mult[key].append(P @ colsR[(s, t)] if dims[(s, t)] else Mat.zeros(F, r, 0))
    return mult


def _np_rows(rows: list[list[int]]) -> Any:
    import numpy as np

    return np.asarray(rows, dtype=np.int64)


def _np_embedded(A: StructureAlgebra, M: Mat, index: Sequence[int] | None) -> Any:
    """The rows of ``M`` (coordinates on span(index)) as an int64 array of residues with
    ``dim A`` columns (vectorised tables: GF(p)); read in one piece where flint allows."""
    import numpy as np

    r, c = M.nrows, M.ncols
    buf = read_residues(M._m) if r and c and isinstance(M.field, PrimeField) else None
    if buf is None:
        X = _np_rows(raw_rows(A, M)).reshape(r, c)
    else:
        X = np.frombuffer(buf, dtype=np.int64).reshape(r, c)
    if index is None:
        return X
    out = np.zeros((r, A.dim), dtype=np.int64)
    out[:, np.asarray(index, dtype=np.int64)] = X
    return out


def _np_contiguous(X: Any) -> Any:
    import numpy as np

    return np.ascontiguousarray(X, dtype=np.int64)


def assemble_from_blocks(
    F: Any,
    dims: dict[tuple[int, int], int],
    mult: dict[tuple[int, int, int], list[Mat]],
    corner_rads: Sequence[Mat],
    starts: Sequence[Mat],
    name: str,
    morita: Sequence[int],
) -> tuple[BasicAlgebra, list[Arrow], list[Mat]]:
    """The hub of a basic algebra ``e A e`` given by its Peirce blocks.

    ``dims[(s, t)]`` is ``dim e_s A e_t``; ``mult[(s, u, t)][j]`` the matrix of right
    multiplication by the ``j``-th basis element of ``e_u A e_t``, from ``e_s A e_u`` to
    ``e_s A e_t`` (coordinates); ``corner_rads[s]`` the radical of the local corner
    ``e_s A e_s`` (rows of coordinates); ``starts[s]`` the coordinates of ``e_s``.  The
    radical is the off-diagonal blocks plus the corner radicals; the arrows ``s -> t`` a
    basis of a complement of ``rad^2`` in ``rad`` block by block; the projectives
    ``e_s A e`` as quiver representations give the hub.  Returns the hub, its arrows and
    each arrow's coordinates in its block.
    """
    m = len(corner_rads)
    rad: dict[tuple[int, int], Mat] = {}
    for s in range(m):
        for t in range(m):
            rad[(s, t)] = corner_rads[s] if s == t else Mat.identity(F, dims[(s, t)])
    rad2: dict[tuple[int, int], Mat] = {}
    for s in range(m):
        for t in range(m):
            parts = []
            for u in range(m):
                X, Y = rad[(s, u)], rad[(u, t)]
                if X.nrows == 0 or Y.nrows == 0:
                    continue
                for y in Y.raw_rows():
                    acc = Mat.zeros(F, X.nrows, dims[(s, t)])
                    for j, yj in enumerate(y):
                        if yj != 0:
                            acc = acc + (X @ mult[(s, u, t)][j]).scale(yj)
                    parts.append(acc)
            rad2[(s, t)] = (
                echelon(Mat.vstack(F, parts, dims[(s, t)]))
                if parts
                else Mat.zeros(F, 0, dims[(s, t)])
            )
    arrows: list[Arrow] = []
    arrow_coords: list[Mat] = []
    for s in range(m):
        for t in range(m):
            R1, R2 = rad[(s, t)], rad2[(s, t)]
            if R1.nrows == R2.nrows:
                continue
            for k in select_independent_rows(R1, R2 if R2.nrows else None):
                arrows.append(Arrow(f"a{len(arrows) + 1}", s, t))
                arrow_coords.append(R1.take_rows([k]))
    Q = Quiver(tuple(str(i + 1) for i in range(m)), tuple(arrows))
    reps = []
    for s in range(m):
        dvec = tuple(dims[(s, t)] for t in range(m))
        maps = []
        for a, co in zip(arrows, arrow_coords, strict=True):
            u, t = a.source, a.target
            M = Mat.zeros(F, dims[(s, u)], dims[(s, t)])
            for j, cj in enumerate(co.entries()):
                if cj != 0:
                    M = M + mult[(s, u, t)][j].scale(cj)
            maps.append(M)
        reps.append((dvec, tuple(maps)))
    B = BasicAlgebra.from_cyclic_representations(
        F, Q, reps, starts=list(starts), name=name, morita=list(morita)
    )
    return B, arrows, arrow_coords


def _assemble(
    A: StructureAlgebra, classes: list[_Class], name: str, spare: _Spare | None = None
) -> BasicAlgebra:
    F = A.field
    # bases of the blocks e_s A e_t, as e_s b_l e_t (coordinates on span(index_t))
    gen, basis, solver, colsR = _block_bases(A, classes, spare)
    dims = {k: v.nrows for k, v in basis.items()}
    mult = _block_products(A, classes, gen, basis, colsR)
    starts = []
    for s, c in enumerate(classes):
        piv, T = solver[(s, s)]
        starts.append(select_columns(as_row(A, restrict(c.e, c.index)), piv) @ T)
    B, arrows, arrow_coords = assemble_from_blocks(
        F, dims, mult, [c.corner_rad for c in classes], starts, name, [c.n for c in classes]
    )
    # each arrow u -> t as an element of A: sum_k coef_k * (e_u b_(l_k) e_t)
    terms = []
    for a, co in zip(arrows, arrow_coords, strict=True):
        ls = gen[(a.source, a.target)]
        terms.append(
            (a.source, a.target, tuple((ls[k], c) for k, c in enumerate(co.entries()) if c))
        )
    B.cached(ARROW_TERMS, lambda: tuple(terms))
    return B


ARROW_TERMS = ("reduction", "arrow_terms")
"""Cache key of a reduced hub: each arrow ``(u, t, ((l, coef), ...))`` meaning
``sum coef * e_u b_l e_t`` in the input algebra (``e`` the primitive idempotents)."""


REDUCTION = ("reduction", "table")
"""Cache key under which a reduced hub holds its :class:`Reduction` (the two refer to
each other and are freed together)."""


def reduction_of(B: BasicAlgebra) -> Reduction | None:
    """The :class:`Reduction` that produced the hub ``B``, if it came from one."""
    return B.cached(REDUCTION, lambda: None) if B.is_cached(REDUCTION) else None


def _order_classes(classes: list[_Class]) -> list[_Class]:
    return sorted(classes, key=lambda c: (c.n, c.dim_P))


def _finish(
    A: StructureAlgebra,
    classes: list[_Class],
    method: str,
    seed: int,
    timings: dict,
    spare: _Spare | None = None,
) -> Reduction:
    n = A.dim
    if sum(c.n * c.dim_P for c in classes) != n:
        raise InternalInconsistency(
            f"Morita count failed: sum dim L * dim P = {sum(c.n * c.dim_P for c in classes)} != {n}"
        )
    if sum(c.n * c.dim_Ae for c in classes) != n:
        raise InternalInconsistency("Morita count with left projectives failed")
    classes = _order_classes(classes)
    t0 = time.perf_counter()
    B = _assemble(A, classes, A.name, spare)
    timings["basic_algebra"] = time.perf_counter() - t0
    red = Reduction(
        algebra=A,
        basic=B,
        idempotents=tuple(tuple(A.vec(c.e)) for c in classes),
        simple_dimensions=tuple(c.n for c in classes),
        projective_dimensions=tuple(c.dim_P for c in classes),
        radical_dimension=n - sum(c.n**2 for c in classes),
        method=method,
        seed=seed,
        timings=timings,
        _classes=tuple(classes),
    )
    B.cached(REDUCTION, lambda: red)
    return red


def radical(A: StructureAlgebra, method: str = "auto", *, seed: int = 0) -> Mat:
    """The Jacobson radical of ``A``: its basis rows in reduced echelon form.

    Parameters
    ----------
    method : {"auto", "trace", "lifted-trace", "reduction"}
        ``"trace"`` and ``"lifted-trace"``: see
        :func:`~hwcat.algebras.reduction.radical.trace_radical`.
        ``"reduction"``: from the simple modules found by :func:`reduce_algebra`
        (``x`` is radical iff it kills every simple).  ``"auto"`` picks the
        trace form where it is correct, the lifted-trace chain up to dimension
        ``LIFTED_TRACE_LIMIT``, else the reduction; over ``GF(p)`` an algebra that
        is not split (the reduction raises :class:`NotSplitError`) falls back to
        the lifted-trace chain.

    Examples
    --------
    >>> from hwcat.algebras.families.tables import cyclic_group_algebra
    >>> from hwcat.algebras.inputs.structure import from_table
    >>> A = from_table(cyclic_group_algebra(4, "GF(2)"))
    >>> radical(A).nrows == radical(A, "reduction").nrows == 3     # (g - 1) F[g]
    True
    """
    if method == "reduction":
        return reduce_algebra(A, seed=seed).radical()
    if method == "auto":
        d = A.natural[0].nrows if A.natural is not None else A.dim
        p = A.field.characteristic
        prime = getattr(A.field, "degree", 1) == 1  # lifted traces need GF(p)
        if p and p <= d and (d > LIFTED_TRACE_LIMIT or not prime):
            try:
                return reduce_algebra(A, seed=seed).radical()
            except NotSplitError:
                # the radical needs no splitting: over GF(p) the lifted-trace chain
                # gives it at any dimension, only more slowly
                if not prime:
                    raise
                method = "lifted-trace"
    return trace_radical(A, method)


def reduce_algebra(
    A: StructureAlgebra,
    *,
    seed: int = 0,
    idempotents: Sequence[Sequence[Any]] | None = None,
    method: str = "split",
) -> Reduction:
    """Reduce ``A`` to its basic algebra (see the module notes for the method).

    Parameters
    ----------
    seed : int
        Seed of the random splitting elements (the result is reproducible).
    idempotents : sequence of vectors, optional
        A complete set of primitive orthogonal idempotents chosen by the user;
        checked exactly (idempotent, orthogonal, summing to 1, each corner local
        with residue field the ground field) and used instead of a search.
    method : {"split", "quotient"}
        ``"split"``: the splitting tree (fast, radical free).  ``"quotient"``:
        radical, semisimple quotient, centre, components, lifting.

    Raises
    ------
    NotSplitError
        When a simple module is not absolutely irreducible over the field, or no
        splitting element is found; the message names the corner and the remedy.

    Notes
    -----
    Ranks of large matrices go through thin random products
    (:mod:`~hwcat.algebras.reduction.sketch`); when a check fails after such a draw,
    the reduction runs once more without them, so the result never depends on the draw.
    """
    drawn = sketch.DRAWS
    try:
        return _reduce(A, seed, idempotents, method)
    except (ResourceLimitError, WorkBudgetExceeded):
        raise
    except (HwcatError, ArithmeticError, LookupError, ValueError):
        # an unlucky thin random product can only make a dimension too small, which the
        # closing checks catch (or which spoils a corner and fails a step further on):
        # once more by plain elimination, whose failures are the algebra's own
        if sketch.DRAWS == drawn:
            raise
    finally:
        # the draws serve the idempotents of one reduction; the result is kept, they
        # need not be (several MB for the larger group algebras)
        A._cache.pop("sketch_draws", None)
    with sketch.disabled():
        return _reduce(A, seed, idempotents, method)


def _reduce(
    A: StructureAlgebra,
    seed: int,
    idempotents: Sequence[Sequence[Any]] | None,
    method: str,
) -> Reduction:
    timings: dict[str, float] = {}
    t0 = time.perf_counter()
    if idempotents is not None:
        classes = _classes_from_idempotents(A, [A.raw(e) for e in idempotents])
        timings["idempotents"] = time.perf_counter() - t0
        return _finish(A, classes, "supplied idempotents", seed, timings)
    if method == "quotient":
        ids = primitive_idempotents(A, seed=seed, rad=radical(A, seed=seed))
        timings["idempotents"] = time.perf_counter() - t0
        t1 = time.perf_counter()
        classes = _classes_from_idempotents(A, ids)
        timings["classes"] = time.perf_counter() - t1
        return _finish(A, classes, "quotient", seed, timings)
    if method != "split":
        raise StructureConstantsError(f"reduce_algebra: unknown method {method!r}")
    S = _Search(A, random.Random(seed))
    with task("simple modules (dim A explained)", total=A.dim) as step:
        S.advance = step
        S.explore(_roots(A), A.dim)
    timings.update(S.stats)
    timings["search"] = time.perf_counter() - t0
    if S.covered() != A.dim:
        raise InternalInconsistency(
            f"the search ended with sum dim L * dim P = {S.covered()} < dim A = {A.dim}"
        )
    return _finish(A, S.classes, "split", seed, timings, S.spare)


# ----------------------------------------------------------------------------------
# supplied idempotents, lifting, and the quotient route


def _classes_from_idempotents(A: StructureAlgebra, ids: list[list[Any]]) -> list[_Class]:
    """Verify a complete set of primitive orthogonal idempotents and group it into classes."""
    F, n = A.field, A.dim
    if not ids:
        raise StructureConstantsError("no idempotents given")
    E = Mat.vstack(F, [as_row(A, e) for e in ids], n)
    total = [A._zero_raw()] * n
    Rs = []
    for j, e in enumerate(ids):
        R = A._action(e, None, left=False)
        Rs.append(R)
        col = (E @ R).raw_rows()  # row i: e_i * e_j
        for i, row in enumerate(col):
            want = e if i == j else [A._zero_raw()] * n
            if A.raw(row) != want:
                what = "is not an idempotent" if i == j else f"times idempotent [{j}] is not zero"
                raise StructureConstantsError(f"idempotent [{i}] {what}")
        total = [a + b for a, b in zip(total, e, strict=True)]
    if A.raw(total) != A._unit:
        raise StructureConstantsError("the idempotents do not sum to the unit")
    classes: list[_Class] = []
    for j, e in enumerate(ids):
        S = _Search(A, random.Random(0), classes)
        r = S.known_ranks(e)
        if sum(r) == 1 and _dim_left_ideal(A, e, Rs[j]) == sum(
            rj * c.dim_Ae for rj, c in zip(r, classes, strict=True)
        ):
            continue  # a further copy of a known simple
        known = sum(r)
        try:
            cl = _new_class(A, e, Rs[j].transpose(), None, None)
        except _NotPrimitive:
            raise StructureConstantsError(
                f"idempotent [{j}] is not primitive (its corner e A e is not local)"
            ) from None
        if known:
            raise StructureConstantsError(f"idempotent [{j}] is not primitive")
        classes.append(cl)
    return classes


def semisimple_dimensions(A: StructureAlgebra, *, seed: int = 0) -> list[int]:
    """``dim L`` for the simple modules, from the quotient route (sorted)."""
    r = reduce_algebra(A, seed=seed, method="quotient")
    return sorted(r.simple_dimensions)
