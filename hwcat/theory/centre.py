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
from dataclasses import dataclass, field
from typing import Any

from hwcat.algebras.hub.basic import BasicAlgebra
from hwcat.algebras.inputs.structure import StructureAlgebra
from hwcat.exact import Mat, echelon

__all__ = ["Centre", "centre", "algebra_centre", "PATH_TERMS", "USER_TERMS_LIMIT"]

_RANDOM_ROUNDS = 3


@dataclass(frozen=True)
class Centre:
    """A basis of ``Z(A)``: coordinates in the basis of ``algebra``, their texts, and
    what the texts are written in (``terms``)."""

    algebra: StructureAlgebra = field(repr=False)
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


def centre(
    A: StructureAlgebra, *, seed: int = 0, generators: list[int] | None = None
) -> Centre:
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
    from hwcat.algebras.inputs.structure_input import from_basic_algebra
    from hwcat.algebras.reduction.reduction import reduction_of

    def compute() -> Centre:
        r = reduction_of(B)
        if r is not None and r.algebra.dim <= USER_TERMS_LIMIT:
            Z = centre(r.algebra, seed=seed)
            return Centre(Z.algebra, Z.basis, Z.texts, OWN_TERMS)
        # Z is a Morita invariant: the basic algebra gives the same dimension
        A = from_basic_algebra(B)
        # the trivial paths and the arrows generate the path basis
        gens = [j for j, name in enumerate(A.basis) if "*" not in name]
        Z = centre(A, seed=seed, generators=gens)
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
