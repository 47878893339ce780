"""Modules given by the action of named elements (the user's operators).

An :class:`ActionModule` is a vector space ``k^n`` (row vectors) with one
matrix for each of a few named elements of an algebra: the generating
matrices of a ``[matrices]`` spec acting on their natural module, a module
file's matrices, the arrows and vertex idempotents of a quiver
representation, or the Temperley-Lieb generators on a spin chain.  Nothing
here needs a basis of the algebra: decomposition, endomorphisms and Jordan
types (:mod:`hwcat.theory.decompose`) work from these matrices only.

Row-vector convention: ``v`` goes to ``v @ G``, so the word ``a*b`` acts by
``G_a @ G_b`` (paths read left to right, right modules).

Examples
--------
>>> from hwcat.exact import GF, Mat
>>> J = Mat.from_rows(GF(3), [[1, 1], [0, 1]])
>>> M = ActionModule(GF(3), 2, {"g": J})
>>> T = tensor_product(M, M)
>>> T.dim, T.generator("g").tolist()[0]
(4, ['1', '1', '1', '1'])
"""

from __future__ import annotations

from collections.abc import Callable, Mapping, Sequence
from typing import TYPE_CHECKING, Any

from hwcat.algebras.inputs.structure_input import matrix_expression

if TYPE_CHECKING:
    from hwcat.algebras.families.coproducts import Coproduct
from hwcat.errors import (
    FieldError,
    InternalInconsistency,
    ModuleFileError,
    StructureConstantsError,
)
from hwcat.exact import Field, Mat, echelon
from hwcat.modules.module import Module

__all__ = ["ActionModule", "from_representation", "tensor_product", "kronecker"]


class ActionModule:
    """A module ``k^dim`` given by the matrices of named elements.

    Parameters
    ----------
    field : Field
    dim : int
    generators : mapping of str to Mat
        ``dim x dim`` matrices of elements that generate the acting algebra
        (with the identity).  End, summands and Jordan types use these only.
    letters : mapping of str to Mat, optional
        Every name allowed in element expressions (default: the generators).
    name : str
    basis_action : callable, optional
        ``i -> Mat``: the action of the ``i``-th basis element of the spec's
        algebra (used to identify summands and for the centre).
    representation : Module, optional
        The same module as a quiver representation of a basic algebra, with
        ``k^dim`` the vertex spaces concatenated in vertex order.
    sparse : mapping, optional
        The nonzero entries ``{(i, j): value}`` of some generators, when known
        (spares a pass over every entry of large matrices).
    combination_action : callable, optional
        ``[x, ...] -> [Mat, ...]``: the action of combinations of basis elements
        at once (e.g. :meth:`~hwcat.modules.basis_action.BasisAction.act`); by
        default the sum of ``basis_action``.
    """

    def __init__(
        self,
        field: Field,
        dim: int,
        generators: Mapping[str, Mat],
        *,
        letters: Mapping[str, Mat] | None = None,
        name: str = "",
        basis_action: Callable[[int], Mat] | None = None,
        representation: Module | None = None,
        sparse: Mapping[str, Mapping[tuple[int, int], Any]] | None = None,
        combination_action: Callable[[Sequence[Sequence[Any]]], list[Mat]] | None = None,
    ) -> None:
        self.field = field
        self.dim = int(dim)
        self.generators = dict(generators)
        self.letters = dict(letters) if letters is not None else dict(generators)
        self.name = name
        self.basis_action = basis_action
        self.representation = representation
        self.sparse = dict(sparse) if sparse else {}
        self.combination_action = combination_action
        self._memo: dict[Any, Any] = {}
        for g, G in list(self.generators.items()) + list(self.letters.items()):
            if G.field is not field:
                raise FieldError(f"{g}: a matrix over {G.field}, the module is over {field}")
            if G.shape != (self.dim, self.dim):
                raise ModuleFileError(
                    f"{g}: a {G.nrows} x {G.ncols} matrix on a module of dimension {dim}"
                )

    @classmethod
    def from_matrices(
        cls, field: Field | str, generators: Mapping[str, Any], *, name: str = ""
    ) -> ActionModule:
        """A module from matrices given as lists of rows, sympy or python-flint matrices
        (anything with ``tolist()``) or :class:`~hwcat.exact.Mat`; entries must be exact.

        >>> M = ActionModule.from_matrices("GF(5)", {"g": [[1, 1], [0, 1]]})
        >>> M.dim, M.field
        (2, GF(5))
        """
        from hwcat.exact import parse_field

        F = parse_field(field) if isinstance(field, str) else field
        mats: dict[str, Mat] = {}
        for g, X in generators.items():
            if isinstance(X, Mat):
                mats[g] = X
                continue
            rows = X.tolist() if hasattr(X, "tolist") else X
            try:
                mats[g] = Mat.from_rows(F, [[F.parse(str(x)) for x in r] for r in rows])
            except (TypeError, ValueError) as exc:
                raise ModuleFileError(f"generator {g!r}: {exc}") from None
        if not mats:
            raise ModuleFileError("no generating matrices given")
        n = next(iter(mats.values())).nrows
        return cls(F, n, mats, name=name)

    def __repr__(self) -> str:
        label = f"{self.name} " if self.name else ""
        return f"ActionModule({label}dim={self.dim}, generators={list(self.generators)})"

    def generator(self, name: str) -> Mat:
        return self.generators[name]

    def generator_list(self) -> list[Mat]:
        return list(self.generators.values())

    def element(self, text: str) -> Mat:
        """The matrix of a noncommutative polynomial in the letters (``1`` the identity).

        >>> from hwcat.exact import QQ
        >>> M = ActionModule(QQ, 2, {"E": Mat.from_rows(QQ, [[0, 1], [0, 0]])})
        >>> M.element("2*E + 1").tolist()
        [['1', '2'], ['0', '1']]
        """
        if self.dim == 0:
            return Mat.zeros(self.field, 0, 0)
        if not self.letters:
            letters = {"1": Mat.identity(self.field, self.dim)}
        else:
            letters = self.letters
        return matrix_expression(text, self.field, letters)

    def act(self, xs: Sequence[Sequence[Any]]) -> list[Mat]:
        """The matrices of combinations ``xs`` of the basis of the acting algebra (needs
        ``combination_action`` or ``basis_action``)."""
        if self.combination_action is not None:
            return self.combination_action(xs)
        if self.basis_action is None:
            raise InternalInconsistency(
                f"{self.name or 'a module'}: no action of the algebra's basis"
            )
        out = []
        for x in xs:
            X = Mat.zeros(self.field, self.dim, self.dim)
            for i, c in enumerate(x):
                if c != 0:
                    X = X + self.basis_action(i).scale(c)
            out.append(X)
        return out

    def restrict_matrix(self, basis: Mat, pivots: Sequence[int], X: Mat) -> Mat:
        """``X`` restricted to the invariant subspace with reduced echelon ``basis``."""
        if basis.nrows == 0:
            return Mat.zeros(self.field, 0, 0)
        from hwcat.exact.polys import select_columns

        return select_columns(basis @ X, list(pivots))

    def submodule(self, basis: Mat, name: str = "") -> ActionModule:
        """The submodule spanned by the rows of ``basis`` (closed under every letter)."""
        R, piv = echelon(basis), None
        piv = R.echelon_pivots() if R.nrows else ()
        gens = {g: self.restrict_matrix(R, piv, G) for g, G in self.generators.items()}
        sub = ActionModule(self.field, R.nrows, gens, name=name)
        sub.letters = _LazyLetters(self, R, piv, gens)
        return sub


class _LazyLetters(dict):
    """Letters of a submodule, restricted from the parent only when used."""

    def __init__(self, parent: ActionModule, basis: Mat, piv: Sequence[int], known: dict) -> None:
        super().__init__()
        self._parent, self._basis, self._piv = parent, basis, tuple(piv)
        for k in parent.letters:
            super().__setitem__(k, None)
        self._known = dict(known)

    def __getitem__(self, key: str) -> Mat:
        if key not in self._known:
            X = self._parent.letters[key]
            self._known[key] = self._parent.restrict_matrix(self._basis, self._piv, X)
        return self._known[key]

    def items(self):  # type: ignore[override]
        return [(k, self[k]) for k in self.keys()]

    def values(self):  # type: ignore[override]
        return [self[k] for k in self.keys()]


def from_representation(M: Module, name: str = "") -> ActionModule:
    """A quiver representation as an :class:`ActionModule`.

    The space is the direct sum of the vertex spaces (vertex order); the
    generators are the vertex idempotents ``e_<vertex>`` and the arrows, each
    a block matrix; paths such as ``a*b`` are words in them.
    """
    A = M.algebra
    F = A.field
    n = M.dim
    offs, o = [], 0
    for d in M.dims:
        offs.append(o)
        o += d
    from hwcat.exact.polys import sparse_matrix

    gens: dict[str, Mat] = {}
    for v in range(A.n):
        gens[f"e_{A.vertices[v]}"] = sparse_matrix(
            F, n, n, {(offs[v] + i, offs[v] + i): 1 for i in range(M.dims[v])}
        )
    for a, X in zip(A.arrows, M.maps, strict=True):
        ents = {}
        for i, row in enumerate(X.raw_rows()):
            for j, x in enumerate(row):
                if x != 0:
                    ents[(offs[a.source] + i, offs[a.target] + j)] = x
        gens[a.name] = sparse_matrix(F, n, n, ents)
    return ActionModule(F, n, gens, name=name or M.name, representation=M)


def kronecker(A: Mat, B: Mat) -> Mat:
    """The Kronecker product ``A (x) B`` (basis ``e_i (x) f_j`` in lexicographic order)."""
    F = A.field
    ra, ca = A.shape
    rb, cb = B.shape
    ea, eb = A.raw_rows(), B.raw_rows()
    flat: list = []
    for i in range(ra):
        for k in range(rb):
            rowb = eb[k]
            for j in range(ca):
                a = ea[i][j]
                if a == 0:
                    flat.extend([F.zero] * cb)
                else:
                    flat.extend(a * x for x in rowb)
    return Mat.from_flat(F, ra * rb, ca * cb, flat)


def tensor_product(
    M: ActionModule, N: ActionModule, *, coproduct: str | Coproduct = "group"
) -> ActionModule:
    """``M (x) N`` through a coproduct given on generators.

    ``coproduct`` is ``"group"`` (each generator ``g`` acts by ``g (x) g``; the
    generators of one module must be group elements acting on the other too),
    ``"quantum-sl2"``
    (the small quantum group on ``E, F, K``, see
    :mod:`hwcat.algebras.families.coproducts`) or a
    :class:`~hwcat.algebras.families.coproducts.Coproduct`.  A generator ``x``
    with ``Delta(x) = sum c * u (x) v`` acts by ``sum c * kron(u on M, v on N)``;
    the words ``u``, ``v`` are evaluated with each module's letters (``x^-1``: the
    inverse matrix).

    >>> from hwcat.exact import GF
    >>> q = GF(5)(2)                       # order 4: the restricted form, p = 2
    >>> X = ActionModule.from_matrices("GF(5)", {"E": [[0, 1], [0, 0]],
    ...     "F": [[0, 0], [1, 0]], "K": [[2, 0], [0, 3]]})
    >>> T = tensor_product(X, X, coproduct="quantum-sl2")
    >>> T.dim, sorted(T.generators)
    (4, ['E', 'F', 'K'])
    """
    from hwcat.algebras.families.coproducts import Coproduct, coproduct_by_name

    if M.field is not N.field:
        raise StructureConstantsError(f"tensor product of modules over {M.field} and {N.field}")
    if isinstance(coproduct, str):
        named = coproduct_by_name(coproduct)
        if named is None:
            raise StructureConstantsError(
                f"coproduct {coproduct!r}: 'group' (g -> g (x) g) or 'quantum-sl2' are known"
            )
        coproduct = named
    if not isinstance(coproduct, Coproduct):
        raise StructureConstantsError(f"coproduct {coproduct!r}: not a Coproduct")
    if coproduct.kind == "group":
        # the shorter list of generators, each acting on both modules
        small, other = (M, N) if len(M.generators) <= len(N.generators) else (N, M)
        names = list(small.generators)
        if any(g not in other.letters for g in names):
            raise StructureConstantsError(
                f"tensor product: generators {sorted(M.generators)} and "
                f"{sorted(N.generators)} differ"
            )
    else:
        names = list(coproduct.terms)
        for X in (M, N):
            missing = [x for x in names if x not in X.letters]
            if missing:
                raise StructureConstantsError(
                    f"tensor product: {X.name or 'a module'} has no action of {missing[0]!r} "
                    f"(needed: {', '.join(names)})"
                )
    F = M.field
    gens: dict[str, Mat] = {}
    for x in names:
        acc = None
        for c, u, v in coproduct.generator_terms(x):
            term = kronecker(_word(M, u), _word(N, v))
            if F(c) != F.one:
                term = term.scale(F(c))
            acc = term if acc is None else acc + term
        gens[x] = acc  # type: ignore[assignment]
    return ActionModule(F, M.dim * N.dim, gens, name=f"{M.name or 'M'} (x) {N.name or 'N'}")


def _word(X: ActionModule, word: str) -> Mat:
    """The matrix of a word ``"u*v*w^-1"`` in the letters of ``X`` (``"1"`` the identity;
    a factor ``x^-1`` is the inverse matrix of ``x``)."""
    out = Mat.identity(X.field, X.dim)
    for f in word.split("*"):
        f = f.strip()
        if f == "1":
            continue
        inverse = f.endswith("^-1")
        name = f[:-3] if inverse else f
        if name not in X.letters:
            raise StructureConstantsError(f"tensor product: {name!r} does not act on the module")
        G = X.letters[name]
        if inverse:
            if G.rank() < X.dim:
                raise StructureConstantsError(f"tensor product: {name!r} does not act invertibly")
            G = G.inverse()
        out = out @ G
    return out
