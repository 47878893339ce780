"""The Jacobson radical, the semisimple quotient, and lifting idempotents.

Method
------
In characteristic 0, and in characteristic ``p > d`` (``d`` the dimension of a
faithful representation: the natural one of a matrix algebra, else the
regular one), the radical is the kernel of the trace form ``(x, y) -> Tr(xy)``.
For smaller ``p`` the trace form can be degenerate on the semisimple part (a
simple whose multiplicity in the representation is divisible by ``p``); there
the chain of ideals of Ronyai and of Cohen, Ivanyos and Wales is used:
``I_0`` = kernel of the trace form, and ``I_i = {x in I_(i-1) : g_i(x y) = 0 for
all y}`` with ``g_i(x) = Tr(L^(p^i)) / p^i mod p`` for an integer lift ``L`` of
the matrix of ``x``; ``g_i`` is linear on ``I_(i-1)`` and ``I_l = rad A`` for
``p^l <= d < p^(l+1)``.  (Sketch: with ``m_j`` the multiplicity of the simple
``S_j`` in the representation, ``g_i(x) = sum over v_p(m_j) = i of (m_j / p^i)
tr_j(x)`` on ``I_(i-1)``, so ``I_i`` is the set of ``x`` acting as zero on every
``S_j`` with ``v_p(m_j) <= i``.)  In the regular representation ``x`` in
``I_(i-1)`` acts as zero on ``A / I_(i-1)``, so the matrices are restricted to
the ideal.  The cost is ``dim(I) d^3 log(p^l)``: fine for small algebras; large
ones are better served by :func:`hwcat.algebras.reduction.reduction.reduce_algebra`,
from which :func:`hwcat.algebras.reduction.reduction.radical` (``method="reduction"``)
reads the radical off the simples.

The *quotient route* (:func:`primitive_idempotents`) splits the semisimple
quotient ``A / rad A``: its centre by random central elements (minimal
polynomials factored over the field), each simple component by Fitting
idempotents of random elements of corners until every corner is the field;
the idempotents are then lifted to ``A`` by :func:`lift_idempotent`
(``e -> 3e^2 - 2e^3``), each orthogonally to those before.

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
>>> A = from_table(symmetric_group_algebra(3, "GF(3)"))
>>> trace_radical(A).nrows           # lifted-trace chain; the trace form alone gives 6
4
"""

from __future__ import annotations

import random
from collections.abc import Sequence
from typing import Any

from hwcat.algebras.inputs.structure import StructureAlgebra
from hwcat.algebras.reduction.kernels import as_row, coords_solver, krylov, minpoly, raw_rows
from hwcat.errors import InternalInconsistency, NotSplitError, StructureConstantsError
from hwcat.exact import Mat, echelon
from hwcat.exact.polys import (
    fitting_polynomials,
    lifted_power_trace,
    select_columns,
)

__all__ = [
    "trace_radical",
    "lift_idempotent",
    "primitive_idempotents",
    "LIFTED_TRACE_LIMIT",
]

LIFTED_TRACE_LIMIT = 400
"""Largest representation dimension for which ``radical(method="auto")`` runs the
lifted-trace chain; beyond it the radical is read off the reduction."""


# ----------------------------------------------------------------------------------
# the radical


def _natural_matrix(A: StructureAlgebra, raw: Sequence[Any]) -> Mat:
    mats = A.natural
    F = A.field
    N = mats[0].nrows
    acc = Mat.zeros(F, N, N)
    for c, M in zip(raw, mats, strict=True):
        if c:
            acc = acc + M.scale(F(c))
    return acc


def _trace_kernel(A: StructureAlgebra, use_natural: bool) -> Mat:
    F, n = A.field, A.dim
    if use_natural:
        mats = A.natural
        N = mats[0].nrows
        V = Mat.vstack(F, [Mat.from_flat(F, 1, N * N, M.entries()) for M in mats], N * N)
        W = Mat.vstack(
            F, [Mat.from_flat(F, 1, N * N, M.transpose().entries()) for M in mats], N * N
        )
        G = V @ W.transpose()
    else:
        G = A.gram(A.trace_functional())
    return echelon(G.left_kernel()) if n else G


def trace_radical(A: StructureAlgebra, method: str = "auto") -> Mat:
    """The Jacobson radical of ``A`` by trace forms: basis rows in reduced echelon form.

    Parameters
    ----------
    method : {"auto", "trace", "lifted-trace"}
        ``"trace"``: kernel of the trace form (correct in characteristic 0 and
        ``p > d``, ``d`` the dimension of the representation used; refused
        otherwise).  ``"lifted-trace"``: the chain of Ronyai and Cohen-Ivanyos-
        Wales (any prime; cost grows like ``dim(I) d^3 log(p^l)``).
        ``"auto"`` picks the trace form where it is correct, else the chain.
        :func:`hwcat.algebras.reduction.reduction.radical` adds the method that
        reads the radical off the simple modules.

    Examples
    --------
    >>> from hwcat.algebras.families.tables import cyclic_group_algebra
    >>> from hwcat.algebras.inputs.structure import from_table
    >>> trace_radical(from_table(cyclic_group_algebra(4, "GF(2)"))).nrows   # (g - 1) F[g]
    3
    """
    F = A.field
    use_natural = A.natural is not None
    d = A.natural[0].nrows if use_natural else A.dim
    p = F.characteristic
    trace_ok = p == 0 or p > d
    prime = getattr(F, "degree", 1) == 1  # the lifted traces need integer lifts: GF(p) only
    if method == "auto":
        method = "trace" if trace_ok else "lifted-trace"
    if method == "lifted-trace" and not prime and not trace_ok:
        raise StructureConstantsError(
            f"radical: method 'lifted-trace' needs a prime field, not {F}; use 'reduction'"
        )
    if method == "trace":
        if not trace_ok:
            raise StructureConstantsError(
                f"the trace form does not detect the radical in characteristic {p} <= {d}; "
                "use method='lifted-trace' or 'reduction'"
            )
        return _trace_kernel(A, use_natural)
    if method != "lifted-trace":
        raise StructureConstantsError(f"radical: unknown method {method!r}")
    I = _trace_kernel(A, use_natural)
    if p == 0:
        return I
    i = 1
    while p**i <= d and I.nrows:
        I = _lifted_step(A, I, i, use_natural)
        i += 1
    return I


def _lifted_step(A: StructureAlgebra, I: Mat, i: int, use_natural: bool) -> Mat:
    """``I_i`` from ``I_(i-1)`` (rows of ``I``, an ideal containing the radical)."""
    F = A.field
    p = F.p
    piv, T = coords_solver(I)
    g = []
    for row in raw_rows(A, I):
        if use_natural:
            X = _natural_matrix(A, row)
        else:  # right multiplication restricted to the ideal (it is zero on A / I)
            X = select_columns(I @ A._action(row, None, left=False), piv) @ T
        t = lifted_power_trace(X, i)
        if t % p**i:
            raise InternalInconsistency(f"lifted trace {t} not divisible by {p}^{i} on I_{i - 1}")
        g.append(F(t // p**i))
    gcol = Mat.from_flat(F, len(g), 1, g)
    # psi(x) = coords_I(x) . g, extended to A through the pivot coordinates
    psi = (select_columns(Mat.identity(F, A.dim), piv) @ (T @ gcol)).entries()
    H = I @ A.gram(psi)
    K = H.left_kernel()
    if K.nrows == 0:
        return Mat.zeros(F, 0, A.dim)
    return echelon(K @ I)


def lift_idempotent(
    A: StructureAlgebra,
    x: Sequence[Any],
    orthogonal_to: Sequence[Any] | None = None,
    *,
    max_steps: int = 64,
) -> list[Any]:
    """Lift an idempotent modulo the radical to an idempotent of ``A``.

    ``x`` is idempotent modulo ``rad A``; ``orthogonal_to`` an idempotent ``E``
    of ``A`` with ``x E`` and ``E x`` in the radical.  Replaces ``x`` by
    ``(1 - E) x (1 - E)`` and iterates ``y -> 3y^2 - 2y^3`` (each step squares
    the defect ``y^2 - y``) until ``y^2 = y``; the result is orthogonal to ``E``.

    >>> from hwcat.algebras.families.tables import cyclic_group_algebra
    >>> from hwcat.algebras.inputs.structure import from_table
    >>> A = from_table(cyclic_group_algebra(2, "GF(2)"))   # F[g]/(g+1)^2, local
    >>> A.element_text(lift_idempotent(A, A.element("g")))  # g = 1 mod rad
    '1'
    """
    y = A.raw(x)
    if orthogonal_to is not None:
        E = A.raw(orthogonal_to)
        c = [u - e for u, e in zip(A._unit, E, strict=True)]
        y = A._product_raw(A._product_raw(c, y), c)
    for _ in range(max_steps):
        y2 = A._product_raw(y, y)
        if y2 == y:
            return A.vec(y)
        y3 = A._product_raw(y2, y)
        y = [3 * a - 2 * b for a, b in zip(y2, y3, strict=True)]
        if A._p:
            y = [v % A._p for v in y]
    raise StructureConstantsError(
        "lift_idempotent: the element is not idempotent modulo the radical"
    )


def _quotient(A: StructureAlgebra, rad: Mat) -> tuple[StructureAlgebra, list[int]]:
    """``A / rad`` as a structure algebra on the basis elements outside the pivots of ``rad``."""
    F, n = A.field, A.dim
    R, piv = rad.rref() if rad.nrows else (None, ())
    pset = set(piv)
    kept = [i for i in range(n) if i not in pset]
    Rrows = raw_rows(A, R) if R is not None else []
    p = A._p

    def proj(v: list[Any]) -> list[Any]:
        """Coordinates on the kept basis elements of the class of ``v`` modulo ``rad``."""
        v = list(v)
        for row, pv in zip(Rrows, piv, strict=True):
            c = v[pv]
            if c:
                v = [a - c * b for a, b in zip(v, row, strict=True)]
        return [F(v[k]) for k in kept]

    table: dict[tuple[int, int], dict[int, Any]] = {}
    kpos = {i: a for a, i in enumerate(kept)}
    for (i, j), terms in A._pairs().items():
        if i not in kpos or j not in kpos:
            continue
        v = [A._zero_raw()] * n
        for k, c in terms.items():
            v[k] = c
        out = {a: c for a, c in enumerate(proj(v)) if c != 0}
        if out:
            table[(kpos[i], kpos[j])] = out
    del p
    Sq = StructureAlgebra(
        F,
        [A.basis[i] for i in kept],
        table,
        proj(A._unit),
        name="quotient",
        associativity="construction",
    )
    return Sq, kept


def _combination(S: StructureAlgebra, vecs: list[list[Any]], rng: random.Random) -> list[Any]:
    """A random linear combination of raw vectors."""
    out = [S._zero_raw()] * S.dim
    for v in vecs:
        if S._p:
            c = rng.randrange(1, 1000)
        elif S._char:  # GF(p^k): uniform over the whole field
            c = S.field.from_coeffs([rng.randrange(S._char) for _ in range(S.field.degree)])
        else:
            c = S.field(rng.randint(-9, 9))
        out = [a + c * b for a, b in zip(out, v, strict=True)]
    return [x % S._p for x in out] if S._p else out


def _split_semisimple(S: StructureAlgebra, rng: random.Random) -> list[list[Any]]:
    """A complete set of primitive orthogonal idempotents of a semisimple split algebra.

    The centre is split first (random central elements, minimal polynomials
    factored over the field), then each component ``E S`` (dimension ``n^2``)
    by Fitting idempotents of random elements of corners until every corner is
    one-dimensional.
    """
    F, n = S.field, S.dim
    # centre: x with x b_j = b_j x for all j
    blocks = [
        S._action(S.raw(S.basis_vector(j)), None, left=False) - S.left_action(S.basis_vector(j))
        for j in range(n)
    ]
    Z = echelon(Mat.hstack(F, blocks).left_kernel())
    zrows = raw_rows(S, Z)
    central = [list(S._unit)]
    while True:  # split central idempotents until each piece has a one-dimensional centre
        changed = False
        out = []
        for E in central:
            ZE = [S._product_raw(z, E) for z in zrows]
            dimZE = Mat.vstack(F, [as_row(S, v) for v in ZE], n).rank()
            if dimZE == 1:
                out.append(E)
                continue
            for _ in range(12):
                z = _combination(S, ZE, rng)
                K, c = krylov(as_row(S, E), S._action(z, None, left=False))
                facs = minpoly(F, K.nrows, c).factor()
                if len(facs) > 1:
                    for pi in fitting_polynomials(facs):
                        co = pi.coeffs() + [F.zero] * (K.nrows - pi.degree - 1)
                        out.append(
                            S.raw((Mat.from_flat(F, 1, K.nrows, co[: K.nrows]) @ K).entries())
                        )
                    changed = True
                    break
            else:
                raise NotSplitError(
                    f"a simple component of the semisimple quotient has a centre of dimension "
                    f"{dimZE} over {F} that does not split: the algebra is not split over this "
                    "field. Remedy: another prime p, or supply idempotents"
                )
        central = out
        if not changed:
            break
    prim = []
    for E in central:
        stack = [E]
        while stack:
            f = stack.pop()
            Lf, Rf = S.left_action(S.vec(f)), S._action(f, None, left=False)
            corner = echelon(Lf @ Rf)
            if corner.nrows == 1:
                prim.append(f)
                continue
            crow = raw_rows(S, corner)
            for _ in range(24):
                y = _combination(S, crow, rng)
                K, c = krylov(as_row(S, f), S._action(y, None, left=False))
                facs = minpoly(F, K.nrows, c).factor()
                if len(facs) > 1:
                    for pi in fitting_polynomials(facs):
                        co = pi.coeffs() + [F.zero] * (K.nrows - pi.degree - 1)
                        stack.append(
                            S.raw((Mat.from_flat(F, 1, K.nrows, co[: K.nrows]) @ K).entries())
                        )
                    break
            else:
                raise NotSplitError(
                    f"no splitting element found in a corner of dimension {corner.nrows} of a simple "
                    f"component over {F}. Remedy: another prime p, or supply idempotents"
                )
    return prim


def primitive_idempotents(
    A: StructureAlgebra, *, seed: int = 0, rad: Mat | None = None
) -> list[list[Any]]:
    """A complete set of primitive orthogonal idempotents by the quotient route.

    Radical (:func:`radical`), semisimple quotient, its centre split by random
    central elements, each component split into primitive idempotents, each
    lifted to ``A`` with :func:`lift_idempotent`, orthogonally to those before.
    Returned as raw coordinate lists.
    """
    rng = random.Random(seed)
    if rad is None:
        rad = trace_radical(A)
    S, kept = _quotient(A, rad)
    prim = _split_semisimple(S, rng)
    out: list[list[Any]] = []
    acc = None
    for k, f in enumerate(prim):
        x = [A._zero_raw()] * A.dim
        for a, i in enumerate(kept):
            x[i] = f[a]
        if k == len(prim) - 1 and acc is not None:
            y = A.raw([u - e for u, e in zip(A._unit, acc, strict=True)])
        else:
            y = A.raw(lift_idempotent(A, A.vec(x), None if acc is None else A.vec(acc)))
        out.append(y)
        acc = y if acc is None else [a + b for a, b in zip(acc, y, strict=True)]
        if A._p:
            acc = [v % A._p for v in acc]
    return out
