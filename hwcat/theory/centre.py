"""The centre ``Z(A)`` of an algebra, with a basis in the user's own terms.

Method
------
``Z(A)`` is the kernel of ``x -> (x b - b x)_b``.  The candidates start as
all of ``A``; commutators with a few seeded random elements (dense
``dim A x dim A`` matrices of left and right multiplication) cut them down
quickly, then every basis element is imposed exactly on the few candidates
left, one product at a time.  The result is exact; the random elements only
decide how fast the candidates shrink.

For a quiver algebra the basis is written in paths (through
:func:`~hwcat.algebras.inputs.structure_input.from_basic_algebra`); for a
``[multiplication]`` spec in basis names; for a ``[matrices]`` spec in words
in the generators.  ``dim Z(A)`` is a Morita invariant, so a basic algebra
and the algebra it was reduced from give the same number.

Examples
--------
>>> from hwcat.algebras.families.tables import symmetric_group_algebra
>>> from hwcat.algebras.inputs.structure import from_table
>>> Z = centre(from_table(symmetric_group_algebra(3, "GF(3)")))
>>> Z.dimension          # three conjugacy classes
3
"""

from __future__ import annotations

import random
import sys
from dataclasses import dataclass, field
from typing import TYPE_CHECKING, Any

from hwcat.algebras.hub.basic import BasicAlgebra, combination_text
from hwcat.exact import Mat, echelon
from hwcat.exact.sparse import sparse_rows

if TYPE_CHECKING:  # the table code (and numpy) only when a table's centre is asked for
    from hwcat.algebras.inputs.structure import StructureAlgebra

__all__ = ["Centre", "centre", "algebra_centre", "hub_centre", "PATH_TERMS", "USER_TERMS_LIMIT"]

_RANDOM_ROUNDS = 3


@dataclass(frozen=True)
class Centre:
    """A basis of ``Z(A)``: coordinates in the basis of ``algebra``, their texts, and
    what the texts are written in (``terms``).

    For :func:`hub_centre` ``algebra`` is ``None`` and the coordinates are in the
    basis of paths of the hub, block by block in the order of
    :func:`~hwcat.algebras.inputs.structure_input.from_basic_algebra`.
    """

    algebra: StructureAlgebra | None = field(repr=False)
    basis: tuple[tuple[Any, ...], ...] = field(repr=False)
    texts: tuple[str, ...]
    terms: str = "basis names"

    @property
    def dimension(self) -> int:
        return len(self.basis)

    def to_dict(self) -> dict[str, Any]:
        return {
            "centre_dimension": self.dimension,
            "centre_basis": list(self.texts),
            "centre_terms": self.terms,
        }


def _commutator_matrix(A: StructureAlgebra, y: list[Any]) -> Mat:
    """The matrix of ``x -> x y - y x`` (rows: basis elements ``x``)."""
    return A.right_action(y) - A.left_action(y)


def centre(A: StructureAlgebra, *, seed: int = 0, generators: list[int] | None = None) -> Centre:
    """The centre of a structure-constant algebra (see the module notes).

    ``generators``: indices of basis elements that generate ``A`` as an algebra
    (for a path basis: the trivial paths and the arrows); the exact step then
    imposes ``x b = b x`` only for them, which suffices since an element that
    commutes with generators commutes with everything (common practice).
    """
    F = A.field
    n = A.dim
    K = Mat.identity(F, n)
    rng = random.Random(seed)
    bound = min(F.characteristic - 1, 50) if F.characteristic else 50
    if n > 1:
        for _ in range(_RANDOM_ROUNDS):
            y = [F(rng.randint(0, bound)) for _ in range(n)]
            C = K @ _commutator_matrix(A, y)
            L = C.left_kernel()
            K = echelon(L @ K) if L.nrows else Mat.zeros(F, 0, n)
            if K.nrows <= 1:
                break
    # exact: impose x b = b x for every basis element b on the remaining candidates
    if K.nrows:
        cand = [A.vec(A.raw(r)) for r in K.raw_rows()]
        js = list(range(n)) if generators is None else list(generators)
        L = A.commutators_with_basis(cand, js).left_kernel()
        K = echelon(L @ K) if L.nrows else Mat.zeros(F, 0, n)
    basis = tuple(tuple(A.vec(A.raw(r))) for r in K.raw_rows())
    return Centre(A, basis, tuple(A.element_text(list(b)) for b in basis))


def algebra_centre(B: BasicAlgebra, *, seed: int = 0) -> Centre:
    """``Z`` of the algebra behind a hub: the user's algebra when the hub came from a
    reduction (table, matrices, family), else the quiver algebra in paths."""

    def compute() -> Centre:
        # a hub made by a reduction exists only once the reduction code is loaded;
        # a quiver algebra's describe need not load it (and the table code with it)
        red = sys.modules.get("hwcat.algebras.reduction.reduction")
        r = red.reduction_of(B) if red is not None else None
        if r is not None and r.algebra.dim <= USER_TERMS_LIMIT:
            Z = centre(r.algebra, seed=seed)
            return Centre(Z.algebra, Z.basis, Z.texts, OWN_TERMS)
        # Z is a Morita invariant: the basic algebra gives the same dimension
        Z = hub_centre(B)
        if r is None:
            return Centre(Z.algebra, Z.basis, Z.texts, PATH_TERMS)
        large = (
            f"{PATH_TERMS}, not in the input algebra's own terms: it has dimension "
            f"{r.algebra.dim} > {USER_TERMS_LIMIT} (Z(A) and Z(eAe) are isomorphic)"
        )
        return Centre(Z.algebra, Z.basis, Z.texts, large)

    return B.cached(("centre", seed), compute)


PATH_TERMS = "paths of the basic algebra"
OWN_TERMS = "the input algebra's own terms (basis names or words in the generators)"

USER_TERMS_LIMIT = 400
"""Largest dimension of a reduced input algebra whose centre is computed in its own
basis (dense ``dim x dim`` multiplication matrices); beyond it the basis is written in
the paths of the basic algebra."""


SPARSE_CENTRE_ENTRIES_PER_EQUATION = 4
"""Largest average number of nonzero entries per equation for which :func:`hub_centre`
solves on sparse rows; denser systems go to one dense kernel (exact elimination on
sparse rows fills in on generic relations)."""


def hub_centre(B: BasicAlgebra, *, method: str = "auto") -> Centre:
    """The centre of a basic algebra, block by block in the hub.

    A central element commutes with the idempotents, so it lies in the sum of
    the blocks ``e_s A e_s``; it commutes with everything when it commutes with
    the arrows (they and the idempotents generate), and for an arrow
    ``a: s -> t`` that is ``z_s a = a z_t`` in ``e_s A e_t`` (common practice).
    The unknowns are the coordinates of the ``z_s``; right multiplication by
    ``a`` is the hub's action, left multiplication is
    :meth:`~hwcat.algebras.hub.basic.BasicAlgebra.left_actions`.  No
    ``dim A x dim A`` matrix is formed.  ``method``: ``"sparse"`` (elimination
    on sparse rows), ``"dense"`` (one dense kernel) or ``"auto"`` (sparse when
    the equations have at most :data:`SPARSE_CENTRE_ENTRIES_PER_EQUATION`
    entries on average).  The basis is the reduced echelon basis in the
    coordinates of :func:`~hwcat.algebras.inputs.structure_input.from_basic_algebra`,
    the same as :func:`centre` of that structure-constant algebra.

    >>> from hwcat.io.spec import load_spec_text
    >>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["1"]\\n'
    ...                    'arrows = ["x: 1 -> 1"]\\nvanish_from_length = 3')
    >>> hub_centre(A).texts             # commutative: Z = A
    ('e_1', 'x', 'x*x')
    """
    from hwcat.exact.sparse import sparse_echelon, to_mat

    F, n = B.field, B.n
    # unknowns: the diagonal blocks in vertex order; offsets in the full path basis
    var0: list[int] = []
    full0: list[int] = []
    nvar = 0
    before = 0
    for s in range(n):
        var0.append(nvar)
        nvar += B.block_dim(s, s)
        full0.append(before + sum(map(len, B.words[s][:s])))
        before += sum(map(len, B.words[s]))
    left = B.left_actions()
    equations: list[dict[int, Any]] = []
    for i, a in enumerate(B.arrows):
        s, t = a.source, a.target
        eqs: list[dict[int, Any]] = [{} for _ in range(B.block_dim(s, t))]
        for r, row in enumerate(B.sparse_action(s, i)):  # z_s a, rows: basis of e_s A e_s
            for c, x in row.items():
                eqs[c][var0[s] + r] = x
        L = left[i].get(t)
        if L is not None:
            for r, row in enumerate(sparse_rows(L)):
                for c, x in row.items():
                    y = eqs[c].get(var0[t] + r)
                    y = -x if y is None else y - x
                    if y == 0:
                        eqs[c].pop(var0[t] + r, None)
                    else:
                        eqs[c][var0[t] + r] = y
        equations.extend(e for e in eqs if e)
    if method == "auto":
        entries = sum(len(e) for e in equations)
        dense = entries > SPARSE_CENTRE_ENTRIES_PER_EQUATION * max(len(equations), 1)
        method = "dense" if dense else "sparse"
    if method == "sparse":
        R, piv = sparse_echelon(F, equations)
        pivset = set(piv)
        kernel = []
        for f in range(nvar):
            if f in pivset:
                continue
            v = {f: F.one}
            for row, p in zip(R, piv, strict=True):
                x = row.get(f)
                if x is not None:
                    v[p] = -x
            kernel.append(v)
        basis_rows, _ = sparse_echelon(F, kernel)
    elif method == "dense":
        E = to_mat(F, equations, nvar).transpose()  # unknowns x equations
        K = E.left_kernel() if E.ncols else Mat.identity(F, nvar)
        basis_rows = sparse_rows(echelon(K)) if K.nrows else []
    else:
        raise ValueError(f"unknown method {method!r}")
    # back to the full path basis
    where: list[tuple[int, int, int]] = []  # unknown -> (vertex, word index, full index)
    for s in range(n):
        for k in range(B.block_dim(s, s)):
            where.append((s, k, full0[s] + k))
    dim = B.dim
    basis = []
    texts = []
    for row in basis_rows:
        vec = [F.zero] * dim
        terms = []
        for j in sorted(row):
            s, k, full = where[j]
            vec[full] = row[j]
            terms.append((row[j], B.path_text(B.words[s][s][k], s)))
        texts.append(combination_text(terms))
        basis.append(tuple(vec))
    return Centre(None, tuple(basis), tuple(texts))
