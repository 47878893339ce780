"""The action of every basis element, from the action of a generating set.

A module of a structure-constant algebra ``A`` is often given by the matrices
of a few elements that generate ``A`` (``E, F, K`` for the small quantum group,
two transpositions for ``S_n``, the ``e_i`` for Temperley-Lieb).
:class:`BasisAction` extends such an action to every basis element by
multiplying (right modules: ``rho(x g) = rho(x) rho(g)``): the span of the
unit and the generators is closed under right multiplication by the
generators, each new element carried with its matrix and kept in reduced
echelon form; when the span is all of ``A`` every row is one basis element
with its matrix.  With a basis of group elements, PBW monomials or diagrams
almost every product is a multiple of one basis element and the echelon
form costs nothing.

:meth:`BasisAction.failure` checks that the result is a module, exactly: the
unit acts as the identity, every given generator keeps its matrix, and
``rho(b_i) rho(g) = rho(b_i g)`` for every basis element ``b_i`` and
generator ``g``.  These suffice (derived): by induction on the length of a
word ``w`` in the generators, ``rho(x) rho(w) = rho(x w)`` for every ``x``, and
the words span ``A``.

For a trusted construction of a large module (the spin chain) the matrices
are not stored: ``stored=False`` keeps only the tree of single products
``b_j = b_i g / c`` and :meth:`BasisAction.act` evaluates combinations by
walking it depth first, one matrix per level.

Examples
--------
>>> from hwcat.algebras.families.tables import cyclic_group_algebra
>>> from hwcat.algebras.inputs.structure import from_table
>>> from hwcat.exact import GF, Mat
>>> A = from_table(cyclic_group_algebra(3, "GF(2)"))
>>> g = Mat.from_rows(GF(2), [[0, 1, 0], [0, 0, 1], [1, 0, 0]])
>>> act = BasisAction(A, 3, {"g": g})
>>> act.failure() is None, act.matrix(2) == g @ g
(True, True)
"""

from __future__ import annotations

from collections import deque
from collections.abc import Mapping, Sequence
from typing import Any

from hwcat.algebras.inputs.structure import StructureAlgebra
from hwcat.errors import InternalInconsistency, ModuleFileError
from hwcat.exact import Mat

__all__ = ["BasisAction"]


class BasisAction:
    """The action of the basis of ``A`` on ``k^dim`` fixed by generators.

    Parameters
    ----------
    algebra : StructureAlgebra
    dim : int
    generators : mapping of str to Mat
        Matrices of elements of ``A``; the keys are basis names, or any names
        when ``elements`` says which elements they are.
    elements : mapping of str to sequence, optional
        The coordinates of each generator in the basis of ``A`` (default: the
        basis element of that name).
    stored : bool
        Keep every basis element's matrix (needed by :meth:`failure` and
        :meth:`matrix`); otherwise only the tree of single products.
    """

    def __init__(
        self,
        algebra: StructureAlgebra,
        dim: int,
        generators: Mapping[str, Mat],
        *,
        elements: Mapping[str, Sequence[Any]] | None = None,
        stored: bool = True,
    ) -> None:
        A = algebra
        self.algebra = A
        self.field = F = A.field
        self.dim = dim
        self.generators = dict(generators)
        self.stored = stored
        self.elements: dict[str, dict[int, Any]] = {}
        for g in self.generators:
            if elements is not None and g in elements:
                v = elements[g]
            elif g in A.basis:
                v = A.basis_vector(A.basis.index(g))
            else:
                raise ModuleFileError(f"{g!r} is not a basis element of the algebra")
            self.elements[g] = {k: F(c) for k, c in enumerate(v) if c != 0}
        # right multiplication by each generator: b_i * g = sum_k c b_k, as {i: {k: c}}
        self._right: dict[str, dict[int, dict[int, Any]]] = {}
        for g, y in self.elements.items():
            out: dict[int, dict[int, Any]] = {}
            for j, yj in y.items():
                for i, k, c in A.column_terms(j):
                    t = out.setdefault(i, {})
                    t[k] = t.get(k, F.zero) + c * yj
            self._right[g] = {i: {k: c for k, c in t.items() if c != 0} for i, t in out.items()}
        self._known: dict[int, Mat] = {}
        self._tree: dict[int, tuple[int | None, str | None, Any]] = {}
        self._build()

    # -- construction -------------------------------------------------------------------------

    def _single(self, v: Mapping[int, Any]) -> tuple[int, Any] | None:
        return next(iter(v.items())) if len(v) == 1 else None

    def _build(self) -> None:
        if self.stored:
            self._build_stored()
        else:
            self._build_tree()
        A = self.algebra
        if len(self._tree) < A.dim:
            missing = next(b for k, b in enumerate(A.basis) if k not in self._tree)
            if not self.generators:
                raise ModuleFileError(
                    "no matrices are given; the given basis elements must generate the "
                    f"algebra (no action of {missing!r} follows)"
                )
            raise ModuleFileError(
                f"the generators {', '.join(self.generators)} do not generate the algebra "
                f"(no action of {missing!r} follows from them)"
            )

    def _build_tree(self) -> None:
        """Single products only: ``b_i g = c b_j`` puts ``b_j`` below ``b_i`` in the tree."""
        F = self.field
        queue: list[int] = []
        unit = {k: F(c) for k, c in enumerate(self.algebra.unit) if c != 0}
        roots: list[tuple[dict[int, Any], str | None]] = [(unit, None)]
        roots += [(self.elements[g], g) for g in self.generators]
        for v, g in roots:
            s = self._single(v)
            if s is not None and s[0] not in self._tree:
                self._tree[s[0]] = (None, g, s[1])
                queue.append(s[0])
        while queue:
            i = queue.pop()
            for g in self.generators:
                s = self._single(self._right[g].get(i, {}))
                if s is not None and s[0] not in self._tree:
                    self._tree[s[0]] = (i, g, s[1])
                    queue.append(s[0])

    def _build_stored(self) -> None:
        """The span of the unit and the generators, closed under right multiplication by
        the generators, kept in reduced echelon form with each row's matrix; a row
        with a single term ``c b_j`` gives the matrix of ``b_j``."""
        A, F, n = self.algebra, self.field, self.dim
        rows: dict[int, tuple[dict[int, Any], Mat]] = {}  # pivot -> (vector, matrix)
        unit = {k: F(c) for k, c in enumerate(A.unit) if c != 0}
        queue: deque[tuple[dict[int, Any], Mat]] = deque([(unit, Mat.identity(F, n))])
        queue.extend((dict(self.elements[g]), self.generators[g]) for g in self.generators)
        while queue:
            v, X = queue.popleft()
            for k in [k for k in v if k in rows]:  # reduced echelon form: one pass
                c = v.get(k)
                if c is None or c == 0:
                    continue
                rv, rX = rows[k]
                for t, x in rv.items():
                    y = v.get(t, F.zero) - c * x
                    if y == 0:
                        v.pop(t, None)
                    else:
                        v[t] = y
                X = X - rX.scale(c)
            if not v:
                continue  # in the span already: its consistency is checked by failure()
            p = min(v)
            inv = F.one / v[p]
            v = {t: x * inv for t, x in v.items()}
            X = X.scale(inv) if inv != F.one else X
            for q, (rv, rX) in list(rows.items()):  # clear p from the other rows
                c = rv.get(p)
                if c:
                    w = {t: rv.get(t, F.zero) - c * v.get(t, F.zero) for t in set(rv) | set(v)}
                    rows[q] = ({t: x for t, x in w.items() if x != 0}, rX - X.scale(c))
            rows[p] = (v, X)
            for g, G in self.generators.items():  # close under right multiplication
                w: dict[int, Any] = {}
                for i, x in v.items():
                    for k, c in self._right[g].get(i, {}).items():
                        w[k] = w.get(k, F.zero) + x * c
                w = {k: x for k, x in w.items() if x != 0}
                if w:
                    queue.append((w, X @ G))
        for p, (v, X) in rows.items():
            if len(v) == 1:  # with every index a pivot, every row is single
                self._known[p] = X
                self._tree[p] = (None, None, F.one)

    # -- use ----------------------------------------------------------------------------------

    def matrix(self, i: int) -> Mat:
        """The matrix of the ``i``-th basis element (stored mode)."""
        if not self.stored:
            return self.act([self.algebra.basis_vector(i)])[0]
        return self._known[i]

    def act(self, xs: Sequence[Sequence[Any]]) -> list[Mat]:
        """The matrices of the combinations ``xs`` (coordinates in the basis of ``A``)."""
        F, n = self.field, self.dim
        out = [Mat.zeros(F, n, n) for _ in xs]
        if self.stored:
            for a, x in enumerate(xs):
                for k, c in enumerate(x):
                    if c != 0:
                        out[a] = out[a] + self._known[k].scale(c)
            return out
        support = [{k: c for k, c in enumerate(x) if c != 0} for x in xs]
        children: dict[int | None, list[int]] = {}
        for j, (parent, _, _) in self._tree.items():
            children.setdefault(parent, []).append(j)
        identity = Mat.identity(F, n)
        stack: list[tuple[int, Mat]] = []
        for j in children.get(None, []):
            _, g, c = self._tree[j]
            X = identity if g is None else self.generators[g]
            stack.append((j, X.scale(F.one / c)))
        while stack:
            j, X = stack.pop()
            for a, sup in enumerate(support):
                if j in sup:
                    out[a] = out[a] + X.scale(sup[j])
            for child in children.get(j, []):
                _, g, c = self._tree[child]
                Y = X @ self.generators[g]  # type: ignore[index]
                stack.append((child, Y.scale(F.one / c) if c != 1 else Y))
        return out

    def failure(self) -> str | None:
        """``None`` when the matrices define a module, else the first failing identity."""
        if not self.stored:
            raise InternalInconsistency("the module axioms need the stored matrices")
        A, F, n = self.algebra, self.field, self.dim
        unit = self.act([A.unit])[0]
        if not unit == Mat.identity(F, n):
            return f"the unit {A.element_text(A.unit)} does not act as the identity"
        for g, G in self.generators.items():
            x = [F.zero] * A.dim
            for k, c in self.elements[g].items():
                x[k] = c
            if not self.act([x])[0] == G:
                return f"the matrix given for {g} is not the one its products force"
        for i in range(A.dim):
            Xi = self._known[i]
            for g, G in self.generators.items():
                v = self._right[g].get(i, {})
                rhs = Mat.zeros(F, n, n)
                for k, c in v.items():
                    rhs = rhs + self._known[k].scale(c)
                if not (Xi @ G == rhs):
                    x = [F.zero] * A.dim
                    for k, c in v.items():
                        x[k] = c
                    return (
                        f"the product {A.basis[i]}*{g} = {A.element_text(x) or '0'} does not hold"
                    )
        return None
