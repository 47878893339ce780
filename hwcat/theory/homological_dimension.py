"""Isomorphisms and direct summands of modules; projective, injective and global dimension.

Public names are re-exported by :mod:`hwcat.theory.homological`.

Method
------
The projective dimension of ``M`` is the length of its minimal resolution
(:mod:`hwcat.theory.resolutions`).  It is infinite when some ``Omega^j(M)``
is isomorphic to a direct summand of ``Omega^k(M)`` with ``j < k``: were it
finite, ``pd Omega^j(M) <= pd Omega^k(M) = pd Omega^j(M) - (k - j)``.  Only
exhibited maps count: a pair ``f : Omega^j -> Omega^k``, ``g : Omega^k ->
Omega^j`` with ``g f`` invertible, checked exactly.  Seeded random elements
of the Hom spaces propose the pairs; a miss proves nothing.  When
``Omega^j(M)`` is simple the test is exact and needs no randomness:
``L(j)`` is a direct summand of ``X`` exactly when ``soc(X)_j`` is not
contained in ``rad(X)_j``.

For the global dimension (the largest projective dimension of a simple) two
more exact arguments are used.  If ``L(j)`` is a summand of ``Omega^k L(i)``
then ``pd L(i) >= k + pd L(j)``, so every simple from which a cycle of such
links (or a simple of infinite projective dimension) can be reached has
infinite projective dimension.  And if every simple had a finite resolution,
the classes of the simples in the Grothendieck group would be integer
combinations of those of the projectives, the columns of the Cartan matrix,
whose determinant would then be ``+-1``; so a determinant other than ``+-1``
proves the global dimension infinite (S. Eilenberg, *Algebras of
cohomologically finite dimension*, Comment. Math. Helv. 28 (1954); from
memory).  :func:`global_dimension` tests the determinant first and then
answers "infinite" without computing any resolution.

Work budget: every computation has two limits with documented defaults, both
keyword arguments (and options of ``hwcat check``): ``bound``, the number of
steps (default :func:`default_bound`), and ``max_syzygy_dimension``, the
largest syzygy or projective term built (default
:data:`DEFAULT_MAX_SYZYGY_DIMENSION`; syzygies can grow geometrically).  A
computation that reaches the bound first reports "at least bound + 1" (limit
``"bound"``); one that would build a syzygy or term of ``Omega^k`` larger than
``max_syzygy_dimension`` stops there with "at least k" (limit
``"max_syzygy_dimension"``).  So every call ends.  Repeats are sought through
Hom only in syzygies of dimension at most :data:`SPLIT_CHECK_LIMIT`, and only
when both Hom systems (unknowns: generator images; equations: one per arrow
and basis element) have at most ``4 * max_syzygy_dimension**2`` entries, so
that lowering the budget shortens every step (a repeat not sought can only
turn "infinite" into "at least k", never into a wrong answer).

Examples
--------
>>> from hwcat.io.spec import load_spec_text
>>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["1", "2", "3"]\\n'
...                    'arrows = ["a: 1 -> 2", "b: 2 -> 3"]\\nrelations = ["a*b"]')
>>> print(global_dimension(A))
2
"""

from __future__ import annotations

import random
from collections.abc import Callable, Sequence
from dataclasses import dataclass
from typing import TYPE_CHECKING, Any

from hwcat.algebras.hub.basic import BasicAlgebra
from hwcat.errors import InternalInconsistency, WorkBudgetExceeded
from hwcat.exact import Mat, contains, echelon
from hwcat.modules import Module, simple
from hwcat.modules.hom import _hom_system, homomorphism_from_images
from hwcat.modules.module import is_homomorphism
from hwcat.progress import task
from hwcat.theory.resolutions import (
    DEFAULT_MAX_SYZYGY_DIMENSION,
    _dual,
    _need_int,
    _Step,
    _steps,
)

if TYPE_CHECKING:
    import networkx as nx


__all__ = [
    "SyzygyRepeat",
    "SimpleSummand",
    "InfiniteDimensionWitness",
    "HomologicalDimension",
    "GlobalDimension",
    "find_isomorphism",
    "find_split_embedding",
    "simple_summands",
    "projective_dimension",
    "injective_dimension",
    "global_dimension",
    "default_bound",
    "DEFAULT_TRIES",
    "DEFAULT_MAX_SYZYGY_DIMENSION",
    "SPLIT_CHECK_LIMIT",
]

DEFAULT_TRIES = 8
"""Random combinations tried per Hom pair before giving up (a miss is never a verdict)."""

SPLIT_CHECK_LIMIT = 400
"""Repeats of a syzygy as a summand of a later one are sought by Hom only up to this dimension."""

_RANGE = 1 << 16  # random integer coefficients over QQ lie in [-_RANGE, _RANGE]


def default_bound(A: BasicAlgebra) -> int:
    """The default bound ``2n + 2`` (``n`` simples) for dimension computations.

    It exceeds ``2n - 2``, the largest global dimension of a quasi-hereditary
    algebra with ``n`` simples (Ringel, J. Pure Appl. Algebra 214 (2010)), so
    such algebras always get an exact number.
    """
    return 2 * A.n + 2


# -- isomorphisms and direct summands ------------------------------------------------------------------


class _RandomHoms:
    """Seeded random elements of ``Hom(M, N)``, drawn in the space of generator images.

    The solution space is found once; each draw is one random combination of
    its basis turned into a homomorphism, so no Hom basis is materialised.
    """

    def __init__(self, M: Module, N: Module, rng: random.Random) -> None:
        Z, _, _ = _hom_system(M, N)
        self.M, self.N, self.rng = M, N, rng
        self.K = Z.left_kernel() if Z.ncols else Mat.identity(M.field, Z.nrows)

    def __bool__(self) -> bool:
        return self.K.nrows > 0

    def draw(self) -> tuple[Mat, ...]:
        F, r = self.M.field, self.K.nrows
        if F.characteristic == 0:
            c = [F(self.rng.randint(-_RANGE, _RANGE)) for _ in range(r)]
        elif getattr(F, "degree", 1) > 1:  # GF(p^k): uniform over the whole field
            p, d = F.characteristic, F.degree
            c = [F.from_coeffs([self.rng.randrange(p) for _ in range(d)]) for _ in range(r)]
        else:
            c = [F(self.rng.randrange(F.characteristic)) for _ in range(r)]
        u = Mat.from_flat(F, 1, r, c) @ self.K
        f = homomorphism_from_images(self.M, self.N, u)
        if not is_homomorphism(self.M, self.N, f):
            raise InternalInconsistency("a solution of the Hom system is not a homomorphism")
        return f


def _invertible(maps: Sequence[Mat]) -> bool:
    return all(m.nrows == m.ncols and m.rank() == m.nrows for m in maps)


def _isomorphism(M: Module, N: Module, rng: random.Random, tries: int) -> tuple[Mat, ...] | None:
    if M.dims != N.dims:
        return None
    if M.dim == 0:
        return tuple(Mat.zeros(M.field, 0, 0) for _ in M.dims)
    homs = _RandomHoms(M, N, rng)
    if homs:
        for _ in range(tries):
            f = homs.draw()
            if _invertible(f):
                return f
    return None


def find_isomorphism(
    M: Module, N: Module, *, seed: int = 0, tries: int = DEFAULT_TRIES
) -> tuple[Mat, ...] | None:
    """An isomorphism ``M -> N`` (matrices per vertex), or ``None`` if none was found.

    Random (seeded) elements of ``Hom(M, N)`` are tried; one is returned only
    after it has been checked to be a bijective homomorphism, so a returned
    map is always an isomorphism.  ``None`` proves nothing when the dimension
    vectors agree (it is likely, not certain, that ``M`` and ``N`` are not
    isomorphic).
    """
    _need_int(tries, "tries", 1)
    return _isomorphism(M, N, random.Random(seed), tries)


def _socle_top(Z: Module, inv: dict[Any, tuple]) -> tuple:
    """The dimension vectors of the socle and the top of ``Z``, kept in ``inv``."""
    key = ("socle and top", id(Z))
    if key not in inv:
        inv[key] = (Z, Z.socle(), Z.top())
    return inv[key][1:]


def _summand_possible(X: Module, Y: Module, inv: dict[Any, tuple]) -> bool:
    """Necessary conditions for ``X`` to be a direct summand of ``Y`` (layer by layer)."""

    def invariants(Z: Module) -> tuple:
        if id(Z) not in inv:
            inv[id(Z)] = (Z, Z.socle(), tuple(Z.radical_layers()))
        return inv[id(Z)][1:]

    def cheap(Z: Module) -> tuple:
        return _socle_top(Z, inv)

    def support(Z: Module) -> list[tuple[int, int]]:
        key = ("support", id(Z))
        if key not in inv:
            inv[key] = (Z, [(v, d) for v, d in enumerate(Z.dims) if d])
        return inv[key][1]

    if X.dim == 0 or X.dim > Y.dim:
        return False
    ydims = Y.dims
    if any(d > ydims[v] for v, d in support(X)):
        return False
    (sx, tx), (sy, ty) = cheap(X), cheap(Y)  # socle and top first: one pass each
    if any(a > b for a, b in zip(sx, sy, strict=True)) or any(
        a > b for a, b in zip(tx, ty, strict=True)
    ):
        return False
    (sx, lx), (sy, ly) = invariants(X), invariants(Y)
    if len(lx) > len(ly) or any(a > b for a, b in zip(sx, sy, strict=True)):
        return False
    return all(a <= b for u, w in zip(lx, ly, strict=False) for a, b in zip(u, w, strict=True))


def _split_embedding(
    X: Module, Y: Module, rng: random.Random, tries: int
) -> tuple[tuple[Mat, ...], tuple[Mat, ...]] | None:
    if X.dims == Y.dims:
        f = _isomorphism(X, Y, rng, tries)
        return None if f is None else (f, tuple(m.inverse() for m in f))
    into = _RandomHoms(X, Y, rng)
    if not into:
        return None
    back = _RandomHoms(Y, X, rng)
    if not back:
        return None
    for _ in range(tries):
        f, g = into.draw(), back.draw()
        if _invertible([a @ b for a, b in zip(f, g, strict=True)]):
            return f, g
    return None


def find_split_embedding(
    X: Module, Y: Module, *, seed: int = 0, tries: int = DEFAULT_TRIES
) -> tuple[tuple[Mat, ...], tuple[Mat, ...]] | None:
    """Maps ``f : X -> Y`` and ``g : Y -> X`` with ``g f`` invertible, or ``None``.

    Such a pair exists exactly when ``X`` is isomorphic to a direct summand of
    ``Y``.  Returned pairs are checked exactly; ``None`` proves nothing
    unless a necessary condition failed (dimension vectors, tops and socles
    of ``X`` at most those of ``Y``, nonzero Hom in both directions).
    """
    _need_int(tries, "tries", 1)
    if X.dim == 0:
        return tuple(Mat.zeros(X.field, 0, d) for d in Y.dims), tuple(
            Mat.zeros(X.field, d, 0) for d in Y.dims
        )
    if not _summand_possible(X, Y, {}):
        return None
    return _split_embedding(X, Y, random.Random(seed), tries)


def _simple_split(S: Module, X: Module) -> tuple[tuple[Mat, ...], tuple[Mat, ...]] | None:
    """For the simple ``S = L(j)``: an embedding into ``X`` and a retraction, or ``None`` (exact)."""
    F = X.field
    j = S.dims.index(1)
    vec = simple_summands(X).get(j)
    if vec is None:
        return None
    rad = X.radical_spaces()[j]
    # a functional on X_j vanishing on rad(X)_j with value 1 on vec
    target = Mat.from_flat(F, 1, rad.nrows + 1, [F.zero] * rad.nrows + [F.one])
    phi = Mat.vstack(F, [rad, vec], X.dims[j]).transpose().solve_left(target)
    if phi is None:  # pragma: no cover - vec lies outside rad(X)_j
        raise InternalInconsistency("a socle vector outside the radical has no retraction")
    f = tuple(vec if v == j else Mat.zeros(F, S.dims[v], X.dims[v]) for v in range(len(X.dims)))
    g = tuple(
        phi.transpose() if v == j else Mat.zeros(F, X.dims[v], S.dims[v])
        for v in range(len(X.dims))
    )
    if not (is_homomorphism(S, X, f) and is_homomorphism(X, S, g)):
        raise InternalInconsistency("the split embedding of a simple summand is not a homomorphism")
    return f, g


def simple_summands(X: Module) -> dict[int, Mat]:
    """For each ``j`` with ``L(j)`` a direct summand of ``X``: a vector spanning one such summand.

    ``L(j)`` is a summand exactly when ``soc(X)_j`` is not contained in
    ``rad(X)_j``; the vector is a socle vector outside the radical (exact, no
    randomness).
    """
    key = "homological:simple-summands"
    if key not in X._memo:
        X._memo[key] = _simple_summands(X)
    return dict(X._memo[key])


def _simple_summands(X: Module) -> dict[int, Mat]:
    F = X.field
    arrows = X.algebra.arrows
    outs: dict[int, list[Mat]] = {}
    imgs: dict[int, list[Mat]] = {}
    for i, m in X.maps.items():  # only the maps between nonzero spaces
        outs.setdefault(arrows[i].source, []).append(m)
        imgs.setdefault(arrows[i].target, []).append(m)
    out = {}
    for j, d in enumerate(X.dims):
        if d == 0:
            continue
        # soc(X)_j and rad(X)_j, as X.socle_spaces()[j] and X.radical_spaces()[j]
        soc = echelon(Mat.hstack(F, outs[j], d).left_kernel()) if j in outs else Mat.identity(F, d)
        rad = echelon(Mat.vstack(F, imgs[j], d)) if j in imgs else Mat.zeros(F, 0, d)
        if soc.nrows and not contains(rad, soc):
            for r in range(soc.nrows):
                v = soc.take_rows([r])
                if not contains(rad, v):
                    out[j] = v
                    break
    return out


# -- dimensions --------------------------------------------------------------------------------------------


def _element_texts(A: BasicAlgebra, summands: Sequence[int], t: int, row: Mat) -> tuple[str, ...]:
    """A vector of a sum of projectives at vertex ``t``, one ``"P(v): paths"`` text per nonzero part."""
    e, o, parts = row.entries(), 0, []
    for v in summands:
        seg = e[o : o + A.block_dim(v, t)]
        o += len(seg)
        if any(x != 0 for x in seg):
            parts.append(f"P({A.vertices[v]}): {A.element_text(v, t, seg)}")
    return tuple(parts)


def _basis_texts(A: BasicAlgebra, step: _Step) -> tuple[tuple[tuple[str, ...], ...], ...]:
    """The basis of ``Omega^(i+1)`` per vertex, as elements of ``P_i``."""
    return tuple(
        tuple(_element_texts(A, step.cover.summands, t, K.take_rows([r])) for r in range(K.nrows))
        for t, K in enumerate(step.kernel)
    )


def _mat_lists(f: Sequence[Mat]) -> list[list[list[str]]]:
    return [m.tolist() for m in f]


@dataclass(frozen=True)
class SyzygyRepeat:
    """``Omega^first(X)`` is isomorphic to a direct summand of ``Omega^second(X)``, ``first < second``.

    ``embedding`` and ``retraction`` (matrices per vertex, in the bases of the
    two syzygies) compose to an automorphism of ``Omega^first(X)``; when
    ``isomorphic`` the embedding is an isomorphism.  The bases are given as
    elements of the projective terms (``None`` for ``Omega^0(X) = X``).
    """

    module: str
    first: int
    second: int
    isomorphic: bool
    dimension_vector: tuple[int, ...]
    embedding: tuple[Mat, ...]
    retraction: tuple[Mat, ...]
    first_basis: tuple | None
    second_basis: tuple

    def to_dict(self) -> dict[str, Any]:
        return {
            "module": self.module,
            "first": self.first,
            "second": self.second,
            "isomorphic": self.isomorphic,
            "dimension_vector": list(self.dimension_vector),
            "embedding": _mat_lists(self.embedding),
            "retraction": _mat_lists(self.retraction),
            "first_basis": self.first_basis,
            "second_basis": self.second_basis,
        }


@dataclass(frozen=True)
class SimpleSummand:
    """``L(target)`` is a direct summand of ``Omega^degree(L(source))``, spanned by ``vector``.

    ``vector`` lies in the socle and outside the radical of the syzygy; it is
    written as an element of the projective term ``P_(degree-1)``.
    """

    source: str
    degree: int
    target: str
    vector: tuple[str, ...]

    def to_dict(self) -> dict[str, Any]:
        return {
            "source": self.source,
            "degree": self.degree,
            "target": self.target,
            "vector": list(self.vector),
        }


@dataclass(frozen=True)
class InfiniteDimensionWitness:
    """Why a projective dimension is infinite.

    ``links`` is a chain of simple summands ``L(i_0) -> L(i_1) -> ...``.  Either
    the chain closes a cycle (its last target is the source of one of its
    links), or it ends at a module whose syzygies repeat (``repeat``); with no
    links, ``repeat`` concerns the module itself.  For a global dimension with
    neither, ``cartan_determinant`` is the determinant of the Cartan matrix,
    which is not ``+-1``.
    """

    links: tuple[SimpleSummand, ...] = ()
    repeat: SyzygyRepeat | None = None
    cartan_determinant: int | None = None

    @property
    def reason(self) -> str:
        """``"syzygy_repeat"``, ``"simple_summand_cycle"`` or ``"cartan_determinant"``."""
        if self.repeat is not None:
            return "syzygy_repeat"
        return "simple_summand_cycle" if self.links else "cartan_determinant"

    def to_dict(self) -> dict[str, Any]:
        return {
            "reason": self.reason,
            "simple_summand_links": [x.to_dict() for x in self.links],
            "syzygy_repeat": None if self.repeat is None else self.repeat.to_dict(),
            "cartan_determinant": self.cartan_determinant,
        }


@dataclass(frozen=True)
class HomologicalDimension:
    """A projective or injective dimension.

    ``case`` is ``"finite"`` (``value`` is the dimension; ``-1`` for the zero
    module, whose resolution is empty), ``"infinite"`` (``value`` is ``None``,
    ``witness`` says why) or ``"at_least"`` (a limit was reached first;
    ``value`` is a lower bound and ``limit`` says which: ``"bound"`` or
    ``"max_syzygy_dimension"``).
    """

    case: str
    value: int | None
    witness: InfiniteDimensionWitness | None = None
    limit: str | None = None

    def json_value(self) -> int | str | dict[str, int]:
        """``int``, ``"infinite"`` or ``{"at_least": k}``."""
        if self.case == "finite":
            return self.value
        if self.case == "infinite":
            return "infinite"
        return {"at_least": self.value}

    def to_dict(self) -> dict[str, Any]:
        return {
            "case": self.case,
            "value": self.json_value(),
            "limit": self.limit,
            "witness": None if self.witness is None else self.witness.to_dict(),
        }

    def __str__(self) -> str:
        if self.case == "finite":
            return str(self.value)
        return "infinite" if self.case == "infinite" else f"at least {self.value}"


def _finite(d: int) -> HomologicalDimension:
    return HomologicalDimension("finite", d)


@dataclass(frozen=True)
class _Limits:
    bound: int
    max_dim: int
    tries: int
    split_limit: int = SPLIT_CHECK_LIMIT

    @property
    def hom_entries(self) -> int:
        """Largest Hom system (unknowns times equations) solved in the search for repeats."""
        return 4 * self.max_dim**2


def _hom_entries(M: Module, top: Sequence[int], N: Module) -> int:
    """Size of the linear system of ``Hom(M, N)`` (``top``: that of ``M``): unknowns (the
    images of the generators) times equations (each basis element of ``M`` along each
    arrow, into ``N``)."""
    unknowns = sum(t * d for t, d in zip(top, N.dims, strict=True))
    equations = sum(M.dims[a.source] * N.dims[a.target] for a in M.algebra.arrows)
    return unknowns * equations


def _limits(A: BasicAlgebra, bound: int | None, max_dim: int | None, tries: int) -> _Limits:
    b = default_bound(A) if bound is None else _need_int(bound, "bound", 0)
    m = (
        DEFAULT_MAX_SYZYGY_DIMENSION
        if max_dim is None
        else _need_int(max_dim, "max_syzygy_dimension", 1)
    )
    return _Limits(b, m, _need_int(tries, "tries", 1))


def _scan(
    M: Module,
    lim: _Limits,
    rng: random.Random,
    on_syzygy: Callable[[int, Module, _Step], HomologicalDimension | None] | None = None,
) -> HomologicalDimension:
    """Walk ``Omega^1(M), ..., Omega^(bound+1)(M)`` looking for the end or a repeat."""
    if M.dim == 0:
        return _finite(-1)
    A = M.algebra
    inv: dict[Any, tuple] = {}
    for k in range(1, lim.bound + 2):
        try:
            steps = _steps(M, k, lim.max_dim)
        except WorkBudgetExceeded as exc:
            return HomologicalDimension("at_least", exc.degree, limit="max_syzygy_dimension")
        X = steps[k - 1].syzygy
        if X.dim == 0:
            return _finite(k - 1)
        if on_syzygy is not None:
            found = on_syzygy(k, X, steps[k - 1])
            if found is not None:
                return found
        if X.dim > lim.max_dim:
            return HomologicalDimension("at_least", k, limit="max_syzygy_dimension")
        for j in range(k):
            Y = M if j == 0 else steps[j - 1].syzygy
            if Y.dim == 1:  # a simple: decided exactly by the socle and the radical
                if X.dims[Y.dims.index(1)] == 0:
                    continue
                pair = _simple_split(Y, X)
            elif not _summand_possible(Y, X, inv):
                continue
            elif (
                X.dim <= lim.split_limit
                and max(
                    _hom_entries(Y, _socle_top(Y, inv)[1], X),
                    _hom_entries(X, _socle_top(X, inv)[1], Y),
                )
                <= lim.hom_entries
            ):
                pair = _split_embedding(Y, X, rng, lim.tries)
            else:
                continue
            if pair is not None:
                rep = SyzygyRepeat(
                    M.name,
                    j,
                    k,
                    Y.dims == X.dims,
                    Y.dims,
                    pair[0],
                    pair[1],
                    None if j == 0 else _basis_texts(A, steps[j - 1]),
                    _basis_texts(A, steps[k - 1]),
                )
                return HomologicalDimension("infinite", None, InfiniteDimensionWitness((), rep))
    return HomologicalDimension("at_least", lim.bound + 1, limit="bound")


def projective_dimension(
    M: Module,
    *,
    bound: int | None = None,
    max_syzygy_dimension: int | None = None,
    seed: int = 0,
    tries: int = DEFAULT_TRIES,
) -> HomologicalDimension:
    """The projective dimension of ``M``.

    Exact up to ``bound`` (default :func:`default_bound`): the value when it is
    at most ``bound``, ``"infinite"`` when a syzygy is shown to repeat as a
    direct summand of a later one, else ``"at_least"``: ``bound + 1``, or
    ``k`` when ``Omega^k(M)`` (nonzero) is larger than
    ``max_syzygy_dimension`` (default :data:`DEFAULT_MAX_SYZYGY_DIMENSION`)
    and the computation stops there.

    >>> from hwcat.io.spec import load_spec_text
    >>> from hwcat.modules import simple
    >>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["x"]\\narrows = ["t: x -> x"]\\n'
    ...                    'vanish_from_length = 3')
    >>> d = projective_dimension(simple(A, 0))
    >>> d.case, d.witness.repeat.first, d.witness.repeat.second
    ('infinite', 0, 2)
    """
    lim = _limits(M.algebra, bound, max_syzygy_dimension, tries)
    return _scan(M, lim, random.Random(seed))


def injective_dimension(
    M: Module,
    *,
    bound: int | None = None,
    max_syzygy_dimension: int | None = None,
    seed: int = 0,
    tries: int = DEFAULT_TRIES,
) -> HomologicalDimension:
    """The injective dimension of ``M``: the projective dimension of ``D M`` over the opposite algebra.

    Same arguments as :func:`projective_dimension`.  A witness of infinite
    dimension speaks of the syzygies of ``D M``, the duals of the cosyzygies
    of ``M``.
    """
    return projective_dimension(
        _dual(M), bound=bound, max_syzygy_dimension=max_syzygy_dimension, seed=seed, tries=tries
    )


@dataclass(frozen=True)
class GlobalDimension:
    """The global dimension of an algebra: the maximum projective dimension of the simples.

    ``case`` is ``"finite"``, ``"infinite"`` (some simple has infinite
    projective dimension: ``witness_simple`` and ``witness`` say which and why)
    or ``"at_least"`` (no infinite dimension was proved and some simple
    reached a limit; ``value`` is the largest lower bound found).
    ``projective_dimensions`` is empty when the Cartan determinant decided
    (no resolution was computed).
    """

    case: str
    value: int | None
    bound: int
    simples: tuple[str, ...]
    projective_dimensions: tuple[HomologicalDimension, ...]
    witness_simple: str | None = None
    witness: InfiniteDimensionWitness | None = None

    def json_value(self) -> int | str | dict[str, int]:
        """``int``, ``"infinite"`` or ``{"at_least": k}``."""
        return HomologicalDimension(self.case, self.value).json_value()

    def to_dict(self) -> dict[str, Any]:
        return {
            "case": self.case,
            "global_dimension": self.json_value(),
            "bound": self.bound,
            "projective_dimensions": [
                {"simple": s, "case": d.case, "value": d.json_value(), "limit": d.limit}
                for s, d in zip(self.simples, self.projective_dimensions, strict=False)
            ],
            "witness_simple": self.witness_simple,
            "witness": None if self.witness is None else self.witness.to_dict(),
        }

    def __str__(self) -> str:
        return str(HomologicalDimension(self.case, self.value))


def global_dimension(
    A: BasicAlgebra,
    *,
    bound: int | None = None,
    max_syzygy_dimension: int | None = None,
    seed: int = 0,
    tries: int = DEFAULT_TRIES,
) -> GlobalDimension:
    """The global dimension of ``A``: the largest projective dimension of a simple.

    A Cartan determinant other than ``+-1`` answers "infinite" at once
    (Eilenberg; witness reason ``"cartan_determinant"``).  Otherwise the
    simples are treated as in :func:`projective_dimension` (same arguments,
    same work budget), and the links between them are used as in the module
    notes.  The case ``"at_least"`` gives the largest lower bound found.

    >>> from hwcat.io.spec import load_spec_text
    >>> A = load_spec_text('field = "GF(2)"\\n[quiver]\\nvertices = ["1", "2", "3"]\\n'
    ...                    'arrows = ["a: 1 -> 2", "b: 2 -> 3", "c: 3 -> 1"]\\nvanish_from_length = 2')
    >>> g = global_dimension(A)
    >>> g.json_value(), g.witness.reason, g.witness.cartan_determinant
    ('infinite', 'cartan_determinant', 2)
    >>> B = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["1", "2"]\\n'
    ...                    'arrows = ["a: 1 -> 2", "b: 2 -> 1"]\\nrelations = ["a*b"]\\n'
    ...                    'vanish_from_length = 3')
    >>> g = global_dimension(B)
    >>> g.case, g.value
    ('finite', 2)
    """
    lim = _limits(A, bound, max_syzygy_dimension, tries)
    b = lim.bound
    det = _determinant(A.cartan())
    if abs(det) != 1:  # Eilenberg: infinite, decided before any resolution
        w = InfiniteDimensionWitness(cartan_determinant=det)
        return GlobalDimension("infinite", None, b, tuple(A.vertices), (), None, w)
    rng = random.Random(seed)
    names = A.vertices
    links: dict[tuple[int, int], SimpleSummand] = {}
    dims: list[HomologicalDimension] = []
    with task("global dimension: simples", total=A.n) as advance:
        for i in range(A.n):

            def on_syzygy(
                k: int, X: Module, step: _Step, i: int = i
            ) -> HomologicalDimension | None:
                for j, vec in simple_summands(X).items():
                    text = _element_texts(A, step.cover.summands, j, vec @ step.kernel[j])
                    link = links.setdefault((i, j), SimpleSummand(names[i], k, names[j], text))
                    if j == i:
                        return HomologicalDimension(
                            "infinite", None, InfiniteDimensionWitness((link,))
                        )
                    if j < i and dims[j].case == "infinite":
                        w = dims[j].witness
                        return HomologicalDimension(
                            "infinite", None, InfiniteDimensionWitness((link,) + w.links, w.repeat)
                        )
                return None

            dims.append(_scan(simple(A, i), lim, rng, on_syzygy))
            advance(1)
    dims = _close_links(A, dims, links)
    simples = tuple(names)
    bad = [i for i, d in enumerate(dims) if d.case == "infinite"]
    if bad:
        i = min(bad, key=lambda v: (len(dims[v].witness.links), v))
        return GlobalDimension("infinite", None, b, simples, tuple(dims), names[i], dims[i].witness)
    if all(d.case == "finite" for d in dims):
        if abs(det) != 1:
            raise InternalInconsistency(f"finite global dimension but det(Cartan) = {det}")
        return GlobalDimension("finite", max(d.value for d in dims), b, simples, tuple(dims))
    if abs(det) != 1:
        w = InfiniteDimensionWitness(cartan_determinant=det)
        return GlobalDimension("infinite", None, b, simples, tuple(dims), None, w)
    low = max(d.value for d in dims)
    return GlobalDimension("at_least", low, b, simples, tuple(dims))


def _determinant(rows: Sequence[Sequence[int]]) -> int:
    """Determinant of an integer matrix (fraction-free Gaussian elimination, Bareiss)."""
    m = [list(r) for r in rows]
    n, sign, prev = len(m), 1, 1
    for k in range(n - 1):
        if m[k][k] == 0:
            swap = next((r for r in range(k + 1, n) if m[r][k] != 0), None)
            if swap is None:
                return 0
            m[k], m[swap], sign = m[swap], m[k], -sign
        for i in range(k + 1, n):
            for j in range(k + 1, n):
                m[i][j] = (m[i][j] * m[k][k] - m[i][k] * m[k][j]) // prev
        prev = m[k][k]
    return sign * m[n - 1][n - 1] if n else 1


def _close_links(
    A: BasicAlgebra, dims: list[HomologicalDimension], links: dict[tuple[int, int], SimpleSummand]
) -> list[HomologicalDimension]:
    """Propagate infinity along the links; check them against the finite dimensions."""
    for (i, j), link in links.items():
        di, dj = dims[i], dims[j]
        if di.case == "finite" and not (dj.case == "finite" and dj.value <= di.value - link.degree):
            raise InternalInconsistency(
                f"L({A.vertices[j]}) is a summand of Omega^{link.degree}(L({A.vertices[i]})) "
                f"but pd L({A.vertices[i]}) = {di} and pd L({A.vertices[j]}) = {dj}"
            )
    if not links or all(d.case != "at_least" for d in dims):
        return list(dims)  # nothing to propagate
    import networkx as nx

    G = nx.DiGraph()
    G.add_nodes_from(range(A.n))
    G.add_edges_from(links)
    out = list(dims)
    for i in range(A.n):
        if out[i].case != "at_least":
            continue
        reach = nx.descendants(G, i) | {i}
        cyclic = [v for v in sorted(reach) if _on_cycle(G, v)]
        known = [v for v in sorted(reach) if v != i and out[v].case == "infinite"]
        if cyclic:
            v = cyclic[0]
            cycle = nx.find_cycle(G, source=v)
            path = nx.shortest_path(G, i, cycle[0][0])
            chain = list(zip(path, path[1:], strict=False)) + [(a, c) for a, c in cycle]
            out[i] = HomologicalDimension(
                "infinite", None, InfiniteDimensionWitness(tuple(links[e] for e in chain))
            )
        elif known:
            v = known[0]
            path = nx.shortest_path(G, i, v)
            w = out[v].witness
            chain = tuple(links[e] for e in zip(path, path[1:], strict=False))
            out[i] = HomologicalDimension(
                "infinite", None, InfiniteDimensionWitness(chain + w.links, w.repeat)
            )
    return out


def _on_cycle(G: nx.DiGraph, v: int) -> bool:
    import networkx as nx

    return G.has_edge(v, v) or any(nx.has_path(G, u, v) for u in G.successors(v))
