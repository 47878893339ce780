"""Homological algebra: projective covers, minimal resolutions, Ext and dimensions.

Method
------
*Projective cover.*  Take minimal generators ``g_1, ..., g_r`` of ``M`` (unit
vectors spanning a complement of ``rad M`` at each vertex, see
:meth:`~hwcat.modules.module.Module.generators`) and let ``P_0`` be the direct
sum of the ``P(v_k)``, ``v_k`` the vertex of ``g_k``; the basis path ``w`` of
the summand ``P(v_k) = e_{v_k} A`` goes to ``g_k * w``.  The generators are a
basis of the top, so the kernel ``Omega(M)`` lies in ``rad P_0`` and the cover
is minimal.  Covering the syzygies in turn gives the minimal projective
resolution ``... -> P_1 -> P_0 -> M -> 0``; the multiplicity of ``P(j)`` in
``P_i`` is the dimension at ``j`` of the top of ``Omega^i(M)``.

*Ext.*  ``Ext^i(M, N)`` is the homology of ``Hom(P_*, N)``.  Since
``Hom(P(v), N) = N_v`` (the image of ``e_v``), ``Hom(P_i, N)`` is the direct
sum of the ``N_v`` over the summands of ``P_i``, and the differential sends
the images ``u_k`` of the generators of ``P_{i-1}`` to the images
``sum_w c_w u_k * w`` of the generators of ``P_i``, where ``sum_w c_w w`` is
the ``k``-th component of the differential on a generator: matrices built from
the path matrices of ``N``; no Hom system is solved.

*Injective coresolutions* are the duals of the minimal projective
resolutions of ``D M`` over the opposite algebra.

*Dimensions.*  The projective dimension is the length of the minimal
resolution.  It is infinite when some ``Omega^j(M)`` is isomorphic to a direct
summand of ``Omega^k(M)`` with ``j < k``: were it finite, ``pd Omega^j(M) <=
pd Omega^k(M) = pd Omega^j(M) - (k - j)``.  Only exhibited maps count: a pair
``f : Omega^j -> Omega^k``, ``g : Omega^k -> Omega^j`` with ``g f``
invertible, checked exactly; seeded random combinations of Hom bases propose
the pairs.  For the global dimension (the maximum over the simples) a second
exact test is used: ``L(j)`` is a direct summand of ``X`` exactly when
``soc(X)_j`` is not contained in ``rad(X)_j``.  If ``L(j)`` is a summand of
``Omega^k L(i)`` then ``pd L(i) >= k + pd L(j)``, so every simple from which a
cycle of such links (or a simple of infinite projective dimension) can be
reached has infinite projective dimension.  Last, if every simple had a
finite resolution, the classes of the simples in the Grothendieck group would
be integer combinations of those of the projectives, the columns of the
Cartan matrix, whose determinant would then be ``+-1``; so a determinant other
than ``+-1`` proves the global dimension infinite (Eilenberg's observation).
Otherwise a computation that reaches the user's bound first reports "at least
bound + 1".

References
----------
I. Assem, D. Simson, A. Skowronski, *Elements of the Representation Theory of
Associative Algebras*, vol. 1, LMS Student Texts 65 (2006) (projective covers,
minimal resolutions, Ext over bound quiver algebras).

Examples
--------
>>> from hwcat.io.spec import load_spec_text
>>> from hwcat.modules import simple
>>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["1", "2", "3"]\\n'
...                    'arrows = ["a: 1 -> 2", "b: 2 -> 3"]\\nrelations = ["a*b"]')
>>> projective_resolution(simple(A, 0), 5).multiplicities()
((1, 0, 0), (0, 1, 0), (0, 0, 1))
>>> ext_dimensions(simple(A, 0), simple(A, 2), 3)
(0, 0, 1, 0)
>>> print(global_dimension(A))
2
"""

from __future__ import annotations

import random
from collections.abc import Callable, Sequence
from dataclasses import dataclass
from typing import Any

import networkx as nx

from hwcat.algebras.basic import BasicAlgebra
from hwcat.errors import HwcatError, InternalInconsistency
from hwcat.exact import Mat, contains
from hwcat.modules import Module, direct_sum, projective, simple
from hwcat.modules.hom import _hom_system, homomorphism_from_images
from hwcat.modules.module import is_homomorphism, kernel_spaces

__all__ = [
    "ProjectiveCover",
    "ProjectiveResolution",
    "InjectiveCoresolution",
    "SyzygyRepeat",
    "SimpleSummand",
    "InfiniteDimensionWitness",
    "HomologicalDimension",
    "GlobalDimension",
    "projective_cover",
    "projective_presentation",
    "projective_resolution",
    "syzygy",
    "injective_coresolution",
    "ext_dimension",
    "ext_dimensions",
    "find_isomorphism",
    "find_split_embedding",
    "simple_summands",
    "projective_dimension",
    "injective_dimension",
    "global_dimension",
    "default_bound",
]

DEFAULT_TRIES = 8
"""Random combinations tried per Hom pair before giving up (a miss is never a verdict)."""

_RANGE = 1 << 16  # random integer coefficients over QQ lie in [-_RANGE, _RANGE]
_STEPS = "homological:steps"
_DUAL = "homological:dual"


def _need_int(value: Any, what: str, minimum: int) -> int:
    if isinstance(value, bool) or not isinstance(value, int) or value < minimum:
        raise HwcatError(f"{what} = {value!r}: expected an integer >= {minimum}")
    return value


def default_bound(A: BasicAlgebra) -> int:
    """The default bound ``2n + 2`` (``n`` simples) for dimension computations.

    It exceeds ``2n - 2``, the largest global dimension of a quasi-hereditary
    algebra with ``n`` simples (Ringel, J. Pure Appl. Algebra 214 (2010)), so
    such algebras always get an exact number.
    """
    return 2 * A.n + 2


# -- projective covers ----------------------------------------------------------------------


@dataclass(frozen=True, eq=False)
class ProjectiveCover:
    """A minimal projective cover ``P -> M``.

    Attributes
    ----------
    module : Module
        ``M``.
    cover : Module
        ``P``, the direct sum of the ``P(v)`` for ``v`` in ``summands``; at each
        vertex ``t`` its basis is the concatenation of the path bases of
        ``e_v A e_t``.
    summands : tuple of int
        The vertex of each indecomposable summand, in order.
    generators : tuple of Mat
        The image in ``M_v`` (a row vector) of the idempotent of each summand.
    projection : tuple of Mat
        The map ``P -> M``, one matrix ``dim P_t x dim M_t`` per vertex.
    """

    module: Module
    cover: Module
    summands: tuple[int, ...]
    generators: tuple[Mat, ...]
    projection: tuple[Mat, ...]

    def multiplicities(self) -> tuple[int, ...]:
        """The number of summands ``P(j)``, for each vertex ``j``."""
        return tuple(self.summands.count(j) for j in range(self.module.algebra.n))

    def offsets(self, vertex: int) -> tuple[int, ...]:
        """Where each summand's block starts in the basis of ``cover`` at ``vertex``."""
        A = self.module.algebra
        out, o = [], 0
        for v in self.summands:
            out.append(o)
            o += A.block_dim(v, vertex)
        return tuple(out)


def _zero_module(A: BasicAlgebra) -> Module:
    F = A.field
    return Module(A, [0] * A.n, [Mat.zeros(F, 0, 0) for _ in A.arrows], "0")


def _projective_sum(A: BasicAlgebra, summands: Sequence[int]) -> Module:
    if not summands:
        return _zero_module(A)
    if len(summands) == 1:
        return projective(A, summands[0])
    return direct_sum(*(projective(A, v) for v in summands))


def projective_cover(M: Module) -> ProjectiveCover:
    """The minimal projective cover of ``M`` with its map onto ``M``.

    >>> from hwcat.io.spec import load_spec_text
    >>> from hwcat.modules import injective
    >>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["1", "2", "3"]\\n'
    ...                    'arrows = ["a: 1 -> 3", "b: 2 -> 3"]')
    >>> c = projective_cover(injective(A, 2))
    >>> c.summands, c.cover.dims
    ((0, 1), (1, 1, 2))
    """
    key = "homological:cover"
    if key in M._memo:
        return M._memo[key]
    A, F = M.algebra, M.field
    gens = M.generators()
    summands = tuple(v for v, _ in gens)
    blocks: list[list[Mat]] = [[] for _ in range(A.n)]
    for v, g in gens:
        images: dict[tuple[int, ...], Mat] = {(): g}
        for t in range(A.n):
            words = A.words[v][t]
            if words:
                rows = [_image(images, w, M) for w in words]
                blocks[t].append(Mat.vstack(F, rows, M.dims[t]))
    projection = tuple(
        Mat.vstack(F, blocks[t], M.dims[t]) if blocks[t] else Mat.zeros(F, 0, M.dims[t])
        for t in range(A.n)
    )
    cover = ProjectiveCover(
        M, _projective_sum(A, summands), summands, tuple(g for _, g in gens), projection
    )
    M._memo[key] = cover
    return cover


def _image(images: dict[tuple[int, ...], Mat], w: tuple[int, ...], M: Module) -> Mat:
    """``g * w`` from ``g * w[:-1]`` (the path bases are prefix closed)."""
    if w not in images:
        images[w] = _image(images, w[:-1], M) @ M.maps[w[-1]]
    return images[w]


# -- minimal projective resolutions -----------------------------------------------------------


@dataclass(frozen=True, eq=False)
class _Step:
    cover: ProjectiveCover  # P_i -> Omega^i
    kernel: tuple[Mat, ...]  # Omega^{i+1} inside P_i (echelon bases = inclusion)
    syzygy: Module  # Omega^{i+1}


def _steps(M: Module, count: int) -> list[_Step]:
    """The first ``count`` steps of the minimal resolution (fewer if it ends), cached on ``M``."""
    steps: list[_Step] = M._memo.setdefault(_STEPS, [])
    while len(steps) < count:
        X = M if not steps else steps[-1].syzygy
        if X.dim == 0:
            break
        c = projective_cover(X)
        K = kernel_spaces(c.cover, X, c.projection)
        label = f"Omega^{len(steps) + 1}({M.name})" if M.name else ""
        steps.append(_Step(c, tuple(K), c.cover.submodule(K, label)))
    return steps[:count]


@dataclass(frozen=True, eq=False)
class ProjectiveResolution:
    """The first terms ``P_m -> ... -> P_1 -> P_0 -> M -> 0`` of a minimal projective resolution.

    Attributes
    ----------
    module : Module
    covers : tuple of ProjectiveCover
        ``covers[i]`` is the cover ``P_i -> Omega^i(M)``.
    inclusions : tuple
        ``inclusions[i]`` is the inclusion ``Omega^(i+1)(M) -> P_i`` (per vertex).
    syzygies : tuple of Module
        ``Omega^1(M), ..., Omega^(m+1)(M)``.
    """

    module: Module
    covers: tuple[ProjectiveCover, ...]
    inclusions: tuple[tuple[Mat, ...], ...]
    syzygies: tuple[Module, ...]

    @property
    def terms(self) -> tuple[Module, ...]:
        """``P_0, ..., P_m``."""
        return tuple(c.cover for c in self.covers)

    @property
    def length(self) -> int:
        """``m``, the index of the last term (``-1`` for the zero module)."""
        return len(self.covers) - 1

    @property
    def complete(self) -> bool:
        """Whether ``Omega^(m+1)(M) = 0``, so the resolution ends with ``P_m``."""
        return not self.syzygies or self.syzygies[-1].dim == 0

    @property
    def augmentation(self) -> tuple[Mat, ...]:
        """The map ``P_0 -> M`` (empty for the zero module)."""
        return self.covers[0].projection if self.covers else ()

    def syzygy(self, i: int) -> Module:
        """``Omega^i(M)`` for ``0 <= i <= m + 1``."""
        return self.module if i == 0 else self.syzygies[i - 1]

    def differential(self, i: int) -> tuple[Mat, ...]:
        """The map ``P_i -> P_(i-1)`` for ``1 <= i <= m`` (per vertex)."""
        if not 1 <= i <= self.length:
            raise HwcatError(f"differential {i}: expected 1 <= i <= {self.length}")
        c, inc = self.covers[i], self.inclusions[i - 1]
        return tuple(c.projection[t] @ inc[t] for t in range(len(inc)))

    def multiplicities(self) -> tuple[tuple[int, ...], ...]:
        """``[i][j]`` = the multiplicity of ``P(j)`` in ``P_i``."""
        return tuple(c.multiplicities() for c in self.covers)

    def to_dict(self) -> dict[str, Any]:
        return {
            "module": self.module.name,
            "length": self.length,
            "complete": self.complete,
            "terms": [
                {
                    "degree": i,
                    "multiplicities": list(c.multiplicities()),
                    "dimension_vector": list(c.cover.dims),
                }
                for i, c in enumerate(self.covers)
            ],
            "syzygy_dimension_vectors": [list(S.dims) for S in self.syzygies],
        }


def projective_resolution(M: Module, length: int) -> ProjectiveResolution:
    """The minimal projective resolution of ``M`` up to the term ``P_length``.

    Fewer terms come back when the resolution ends earlier (see
    :attr:`ProjectiveResolution.complete`).  The steps are cached on ``M``.
    """
    _need_int(length, "length", 0)
    steps = _steps(M, length + 1)
    return ProjectiveResolution(
        M,
        tuple(s.cover for s in steps),
        tuple(s.kernel for s in steps),
        tuple(s.syzygy for s in steps),
    )


def projective_presentation(M: Module) -> ProjectiveResolution:
    """The minimal projective presentation ``P_1 -> P_0 -> M -> 0`` (the resolution up to ``P_1``)."""
    return projective_resolution(M, 1)


def syzygy(M: Module, i: int = 1) -> Module:
    """``Omega^i(M)``, the ``i``-th syzygy in the minimal resolution (``Omega^0(M) = M``)."""
    _need_int(i, "i", 0)
    if i == 0:
        return M
    steps = _steps(M, i)
    return steps[i - 1].syzygy if len(steps) == i else _zero_module(M.algebra)


# -- injective coresolutions ----------------------------------------------------------------------


def _dual(M: Module) -> Module:
    """``D M`` over the opposite algebra, cached both ways (so resolutions are shared)."""
    if _DUAL not in M._memo:
        D = M.dual()
        D._memo[_DUAL] = M
        M._memo[_DUAL] = D
    return M._memo[_DUAL]


@dataclass(frozen=True, eq=False)
class InjectiveCoresolution:
    """The first terms ``0 -> M -> I^0 -> I^1 -> ... -> I^m`` of a minimal injective coresolution.

    Built as the dual of :attr:`dual_resolution`, the minimal projective
    resolution of ``D M`` over the opposite algebra: ``I^i = D(P_i)`` and the
    cosyzygy ``Omega^(-i)(M) = D(Omega^i(D M))``.

    Attributes
    ----------
    module : Module
    dual_resolution : ProjectiveResolution
    terms : tuple of Module
        ``I^0, ..., I^m``; ``I^i`` is a direct sum of ``I(j)``, ``j`` in ``summands[i]``.
    summands : tuple of tuple of int
    coaugmentation : tuple of Mat
        The embedding ``M -> I^0``.
    cosyzygies : tuple of Module
        ``Omega^(-1)(M), ..., Omega^(-(m+1))(M)``.
    """

    module: Module
    dual_resolution: ProjectiveResolution
    terms: tuple[Module, ...]
    summands: tuple[tuple[int, ...], ...]
    coaugmentation: tuple[Mat, ...]
    cosyzygies: tuple[Module, ...]

    @property
    def length(self) -> int:
        return len(self.terms) - 1

    @property
    def complete(self) -> bool:
        return self.dual_resolution.complete

    def differential(self, i: int) -> tuple[Mat, ...]:
        """The map ``I^(i-1) -> I^i`` for ``1 <= i <= m``."""
        return tuple(m.transpose() for m in self.dual_resolution.differential(i))

    def multiplicities(self) -> tuple[tuple[int, ...], ...]:
        """``[i][j]`` = the multiplicity of ``I(j)`` in ``I^i``."""
        return self.dual_resolution.multiplicities()

    def to_dict(self) -> dict[str, Any]:
        return {
            "module": self.module.name,
            "length": self.length,
            "complete": self.complete,
            "terms": [
                {"degree": i, "multiplicities": list(m), "dimension_vector": list(T.dims)}
                for i, (m, T) in enumerate(zip(self.multiplicities(), self.terms, strict=True))
            ],
            "cosyzygy_dimension_vectors": [list(S.dims) for S in self.cosyzygies],
        }


def injective_coresolution(M: Module, length: int) -> InjectiveCoresolution:
    """The minimal injective coresolution of ``M`` up to the term ``I^length``.

    >>> from hwcat.io.spec import load_spec_text
    >>> from hwcat.modules import simple
    >>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["1", "2"]\\narrows = ["a: 1 -> 2"]')
    >>> injective_coresolution(simple(A, 1), 3).multiplicities()
    ((0, 1), (1, 0))
    """
    R = projective_resolution(_dual(M), length)
    terms = tuple(_named_dual(c.cover, f"I^{i}") for i, c in enumerate(R.covers))
    coaug = tuple(m.transpose() for m in R.augmentation) if R.covers else ()
    return InjectiveCoresolution(
        M,
        R,
        terms,
        tuple(c.summands for c in R.covers),
        coaug,
        tuple(_dual(S) for S in R.syzygies),
    )


def _named_dual(P: Module, name: str) -> Module:
    D = P.dual()
    return Module(D.algebra, D.dims, D.maps, name)


# -- Ext --------------------------------------------------------------------------------------------


def _hom_differential(R: ProjectiveResolution, i: int, N: Module) -> Mat:
    """``Hom(P_(i-1), N) -> Hom(P_i, N)`` in the coordinates ``(u_k)``, ``u_k`` in ``N_(v_k)``.

    The block from summand ``k`` (vertex ``v``) of ``P_(i-1)`` to generator
    ``l`` (vertex ``w``) of ``P_i`` is ``sum_p c_(l,p) N_p`` over the paths
    ``p`` of ``e_v A e_w``; for all ``l`` at ``w`` at once this is one product
    ``C @ T`` with ``T`` the path matrices ``N_p`` flattened into rows.
    """
    A, F = N.algebra, N.field
    src, dst, inc = R.covers[i - 1], R.covers[i], R.inclusions[i - 1]
    row_off = [0]
    for v in src.summands:
        row_off.append(row_off[-1] + N.dims[v])
    col_off = [0]
    for w in dst.summands:
        col_off.append(col_off[-1] + N.dims[w])
    nrows, ncols = row_off[-1], col_off[-1]
    flat = [F.zero] * (nrows * ncols)
    for w in range(A.n):
        gens = [ell for ell, x in enumerate(dst.summands) if x == w]
        nw = N.dims[w]
        if not gens or nw == 0:
            continue
        # the differential on the generators at w, as vectors of P_(i-1) at w
        X = Mat.vstack(F, [dst.generators[ell] for ell in gens], inc[w].nrows) @ inc[w]
        offs = src.offsets(w)
        for k, v in enumerate(src.summands):
            nv, words = N.dims[v], A.words[v][w]
            if nv == 0 or not words:
                continue
            C = X.take_cols(range(offs[k], offs[k] + len(words)))
            if C.is_zero():
                continue
            T = Mat.from_flat(
                F, len(words), nv * nw, [x for p in words for x in N.path_matrix(p, v).entries()]
            )
            E = (C @ T).entries()
            for r, ell in enumerate(gens):
                base = r * nv * nw
                for a in range(nv):
                    start = (row_off[k] + a) * ncols + col_off[ell]
                    flat[start : start + nw] = E[base + a * nw : base + (a + 1) * nw]
    return Mat.from_flat(F, nrows, ncols, flat)


def ext_dimensions(M: Module, N: Module, degree: int) -> tuple[int, ...]:
    """``(dim Ext^0(M, N), ..., dim Ext^degree(M, N))`` from the minimal resolution of ``M``.

    ``Ext^0`` is ``Hom``.  The resolution of ``M`` is cached on ``M``, so
    many calls with the same ``M`` share it.

    >>> from hwcat.io.spec import load_spec_text
    >>> from hwcat.modules import simple
    >>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["x"]\\narrows = ["t: x -> x"]\\n'
    ...                    'vanish_from_length = 3')
    >>> S = simple(A, 0)
    >>> ext_dimensions(S, S, 4)
    (1, 1, 1, 1, 1)
    """
    _need_int(degree, "degree", 0)
    if M.algebra is not N.algebra:
        raise InternalInconsistency("Ext between modules over different algebras")
    R = projective_resolution(M, degree + 1)
    homs = [sum(N.dims[v] for v in c.summands) for c in R.covers]
    ranks = [0] + [_hom_differential(R, i, N).rank() for i in range(1, len(R.covers))]
    out = []
    for i in range(degree + 1):
        if i >= len(R.covers):
            out.append(0)
            continue
        out.append(homs[i] - ranks[i] - (ranks[i + 1] if i + 1 < len(R.covers) else 0))
    return tuple(out)


def ext_dimension(M: Module, N: Module, i: int) -> int:
    """``dim Ext^i(M, N)``."""
    return ext_dimensions(M, N, i)[i]


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


def _summand_possible(X: Module, Y: Module, inv: dict[int, tuple]) -> bool:
    """Necessary conditions for ``X`` to be a direct summand of ``Y`` (layer by layer)."""

    def invariants(Z: Module) -> tuple:
        if id(Z) not in inv:
            inv[id(Z)] = (Z, Z.socle(), tuple(Z.radical_layers()))
        return inv[id(Z)][1:]

    if X.dim == 0 or any(a > b for a, b in zip(X.dims, Y.dims, strict=True)):
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
    out = {}
    for j, (soc, rad) in enumerate(zip(X.socle_spaces(), X.radical_spaces(), strict=True)):
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
    ``witness`` says why) or ``"at_least"`` (the bound was reached first;
    ``value`` is a lower bound).
    """

    case: str
    value: int | None
    witness: InfiniteDimensionWitness | None = None

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
            "witness": None if self.witness is None else self.witness.to_dict(),
        }

    def __str__(self) -> str:
        if self.case == "finite":
            return str(self.value)
        return "infinite" if self.case == "infinite" else f"at least {self.value}"


def _finite(d: int) -> HomologicalDimension:
    return HomologicalDimension("finite", d)


def _scan(
    M: Module,
    bound: int,
    rng: random.Random,
    tries: int,
    on_syzygy: Callable[[int, Module, _Step], HomologicalDimension | None] | None = None,
) -> HomologicalDimension:
    """Walk ``Omega^1(M), ..., Omega^(bound+1)(M)`` looking for the end or a repeat."""
    if M.dim == 0:
        return _finite(-1)
    A = M.algebra
    inv: dict[int, tuple] = {}
    for k in range(1, bound + 2):
        steps = _steps(M, k)
        X = steps[k - 1].syzygy
        if X.dim == 0:
            return _finite(k - 1)
        if on_syzygy is not None:
            found = on_syzygy(k, X, steps[k - 1])
            if found is not None:
                return found
        for j in range(k):
            Y = M if j == 0 else steps[j - 1].syzygy
            if not _summand_possible(Y, X, inv):
                continue
            if Y.dim == 1:  # a simple: decided exactly by the socle and the radical
                pair = _simple_split(Y, X)
            else:
                pair = _split_embedding(Y, X, rng, tries)
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
    return HomologicalDimension("at_least", bound + 1)


def projective_dimension(
    M: Module, *, bound: int | None = None, seed: int = 0, tries: int = DEFAULT_TRIES
) -> HomologicalDimension:
    """The projective dimension of ``M``.

    Exact up to ``bound`` (default :func:`default_bound`): the value when it is
    at most ``bound``, ``"infinite"`` when a syzygy is shown to repeat as a
    direct summand of a later one, else ``"at_least"`` ``bound + 1``.

    >>> from hwcat.io.spec import load_spec_text
    >>> from hwcat.modules import simple
    >>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["x"]\\narrows = ["t: x -> x"]\\n'
    ...                    'vanish_from_length = 3')
    >>> d = projective_dimension(simple(A, 0))
    >>> d.case, d.witness.repeat.first, d.witness.repeat.second
    ('infinite', 0, 2)
    """
    b = default_bound(M.algebra) if bound is None else _need_int(bound, "bound", 0)
    _need_int(tries, "tries", 1)
    return _scan(M, b, random.Random(seed), tries)


def injective_dimension(
    M: Module, *, bound: int | None = None, seed: int = 0, tries: int = DEFAULT_TRIES
) -> HomologicalDimension:
    """The injective dimension of ``M``: the projective dimension of ``D M`` over the opposite algebra.

    A witness of infinite dimension speaks of the syzygies of ``D M``, that
    is of the duals of the cosyzygies of ``M``.
    """
    return projective_dimension(_dual(M), bound=bound, seed=seed, tries=tries)


@dataclass(frozen=True)
class GlobalDimension:
    """The global dimension of an algebra: the maximum projective dimension of the simples.

    ``case`` is ``"finite"``, ``"infinite"`` (some simple has infinite
    projective dimension: ``witness_simple`` and ``witness`` say which and why)
    or ``"at_least"`` (no infinite dimension was proved and some simple
    reached the bound; ``value`` is then ``bound + 1``).
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
                {"simple": s, "case": d.case, "value": d.json_value()}
                for s, d in zip(self.simples, self.projective_dimensions, strict=True)
            ],
            "witness_simple": self.witness_simple,
            "witness": None if self.witness is None else self.witness.to_dict(),
        }

    def __str__(self) -> str:
        return str(HomologicalDimension(self.case, self.value))


def global_dimension(
    A: BasicAlgebra, *, bound: int | None = None, seed: int = 0, tries: int = DEFAULT_TRIES
) -> GlobalDimension:
    """The global dimension of ``A`` (see the module notes for the method).

    >>> from hwcat.io.spec import load_spec_text
    >>> A = load_spec_text('field = "GF(2)"\\n[quiver]\\nvertices = ["1", "2", "3"]\\n'
    ...                    'arrows = ["a: 1 -> 2", "b: 2 -> 3", "c: 3 -> 1"]\\nvanish_from_length = 2')
    >>> g = global_dimension(A)
    >>> g.json_value(), g.witness.reason, [(x.source, x.degree, x.target) for x in g.witness.links]
    ('infinite', 'simple_summand_cycle', [('1', 3, '1')])
    """
    b = default_bound(A) if bound is None else _need_int(bound, "bound", 0)
    _need_int(tries, "tries", 1)
    rng = random.Random(seed)
    names = A.vertices
    links: dict[tuple[int, int], SimpleSummand] = {}
    dims: list[HomologicalDimension] = []
    for i in range(A.n):

        def on_syzygy(k: int, X: Module, step: _Step, i: int = i) -> HomologicalDimension | None:
            for j, vec in simple_summands(X).items():
                text = _element_texts(A, step.cover.summands, j, vec @ step.kernel[j])
                link = links.setdefault((i, j), SimpleSummand(names[i], k, names[j], text))
                if j == i:
                    return HomologicalDimension("infinite", None, InfiniteDimensionWitness((link,)))
                if j < i and dims[j].case == "infinite":
                    w = dims[j].witness
                    return HomologicalDimension(
                        "infinite", None, InfiniteDimensionWitness((link,) + w.links, w.repeat)
                    )
            return None

        dims.append(_scan(simple(A, i), b, rng, tries, on_syzygy))
    dims = _close_links(A, dims, links)
    simples = tuple(names)
    bad = [i for i, d in enumerate(dims) if d.case == "infinite"]
    if bad:
        i = min(bad, key=lambda v: (len(dims[v].witness.links), v))
        return GlobalDimension("infinite", None, b, simples, tuple(dims), names[i], dims[i].witness)
    det = _determinant(A.cartan())
    if all(d.case == "finite" for d in dims):
        if abs(det) != 1:
            raise InternalInconsistency(f"finite global dimension but det(Cartan) = {det}")
        return GlobalDimension("finite", max(d.value for d in dims), b, simples, tuple(dims))
    if abs(det) != 1:
        w = InfiniteDimensionWitness(cartan_determinant=det)
        return GlobalDimension("infinite", None, b, simples, tuple(dims), None, w)
    return GlobalDimension("at_least", b + 1, b, simples, tuple(dims))


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
    return G.has_edge(v, v) or any(nx.has_path(G, u, v) for u in G.successors(v))
