"""Projective covers, minimal projective resolutions, injective coresolutions and Ext.

Public names are re-exported by :mod:`hwcat.theory.homological`.

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

Work budget
-----------
Syzygies can grow geometrically (over a local algebra with two loops their
dimension roughly doubles at each step), so every computation here takes
``max_syzygy_dimension`` (default :data:`DEFAULT_MAX_SYZYGY_DIMENSION`): no
syzygy and no projective term larger than that is built.  Reaching it raises
:class:`~hwcat.errors.WorkBudgetExceeded` naming the degree; the dimension
functions of :mod:`hwcat.theory.homological_dimension` turn it into the answer
"at least k".  Pass a larger value (``hwcat check --max-syzygy-dimension``) to
go further.

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
"""

from __future__ import annotations

import dataclasses
from collections.abc import Sequence
from dataclasses import dataclass
from typing import Any

from hwcat.algebras.hub.basic import BasicAlgebra
from hwcat.errors import HwcatError, InternalInconsistency, WorkBudgetExceeded
from hwcat.exact import Mat, echelon
from hwcat.modules import Module, direct_sum, projective, simple

__all__ = [
    "ProjectiveCover",
    "ProjectiveResolution",
    "InjectiveCoresolution",
    "projective_cover",
    "projective_presentation",
    "projective_resolution",
    "syzygy",
    "injective_coresolution",
    "ext_dimension",
    "ext_dimensions",
    "DEFAULT_MAX_SYZYGY_DIMENSION",
    "max_syzygy_dimension_or_default",
]

DEFAULT_MAX_SYZYGY_DIMENSION = 600
"""Largest syzygy or projective term built by default (the work budget).

Chosen so that a step of a resolution at this size takes well under a second
over QQ and GF(p) on one core (``benchmarks/bench_homological.py``, budget
section): ``hwcat check`` on algebras of dimension up to 60 stays within
seconds even when syzygies grow geometrically.
"""

_STEPS = "homological:steps"
_DUAL = "homological:dual"


def _need_int(value: Any, what: str, minimum: int) -> int:
    if isinstance(value, bool) or not isinstance(value, int) or value < minimum:
        raise HwcatError(f"{what} = {value!r}: expected an integer >= {minimum}")
    return value


def max_syzygy_dimension_or_default(value: int | None) -> int:
    """``value`` checked (an integer >= 1), or the default budget when ``None``."""
    if value is None:
        return DEFAULT_MAX_SYZYGY_DIMENSION
    return _need_int(value, "max_syzygy_dimension", 1)


def _over_budget(name: str, degree: int, what: str, size: int, limit: int) -> WorkBudgetExceeded:
    return WorkBudgetExceeded(
        f"{what} of {name or 'the module'} at degree {degree} has dimension {size} > "
        f"max_syzygy_dimension = {limit} (raise it with max_syzygy_dimension=... or "
        "hwcat check --max-syzygy-dimension)",
        degree=degree,
        size=size,
        limit=limit,
    )


def _check_budget(X: Module, degree: int, limit: int, name: str) -> None:
    """Refuse to cover ``X = Omega^degree`` when ``X`` or its cover exceeds ``limit``."""
    if X.dim > limit:
        raise _over_budget(name, degree, "the syzygy", X.dim, limit)
    A = X.algebra
    size = sum(sum(A.projective_dims(v)) for v, _ in X.generators())
    if size > limit:
        raise _over_budget(name, degree, "the projective term", size, limit)


def _budgeted_cover(X: Module, degree: int, limit: int, name: str) -> ProjectiveCover:
    """The cover of ``X = Omega^degree``, refused when ``X`` or the cover exceeds ``limit``."""
    _check_budget(X, degree, limit, name)
    return projective_cover(X)


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


def _map_kernels(f: Sequence[Mat]) -> list[Mat]:
    """Echelon bases, per vertex, of the kernel of the maps ``f[v]`` (as ``kernel_spaces``).

    Only the blocks between two nonzero spaces are solved: the kernel is
    everything when the target space is zero and nothing when the source is.
    """
    out = []
    whole: dict[int, Mat] = {}  # one identity per size (most vertices: the empty 0 x 0)
    for m in f:
        r, c = m.shape
        if r == 0 or c == 0:
            ident = whole.get(r)
            if ident is None:
                ident = whole[r] = Mat.identity(m.field, r)
            out.append(ident)
        else:
            out.append(echelon(m.left_kernel()))
    return out


_SHARED_DEPTH = 64  # nested shared tails (each costs a few stack frames)


def _shared_simple(A: BasicAlgebra, j: int) -> Module:
    """The simple module ``L(j)`` whose resolution is shared by every resolution reaching it."""
    return A.cached(("homological:shared-simple", j), lambda: simple(A, j))


def _syzygy_of(S: Module, m: int) -> Module:
    """``Omega^m(S)`` among the steps already made (following shared tails)."""
    while m:
        own = S._memo.get(_STEPS, [])
        if m <= len(own):
            return own[m - 1].syzygy
        if not own or own[-1].syzygy.dim != 1:
            raise InternalInconsistency("a syzygy that was never built")
        X = own[-1].syzygy
        m -= len(own)
        S = _shared_simple(S.algebra, X.dims.index(1))
    return S


def _extend_by_simple(M: Module, steps: list[_Step], S: Module, count: int, limit: int) -> None:
    """Append to the steps of ``M`` (ending at a syzygy equal to ``S``) the steps of ``S``.

    A refusal of the budget is raised as ``M``'s own, at ``M``'s degree.
    """
    k = len(steps)
    try:
        tail = _steps(S, count - k, limit)
    except WorkBudgetExceeded as exc:
        # the steps of S made before (perhaps under a larger budget) are checked
        # against M's budget in order, then the step S refused, at M's degrees
        for m in range(exc.degree + 1):
            _check_budget(_syzygy_of(S, m), k + m, limit, M.name)
        raise InternalInconsistency(
            "a shared resolution refused a step that the budget allows"
        ) from exc
    for m, step in enumerate(tail):
        # the steps of S may have been made under a larger budget: M's budget decides
        _check_budget(S if m == 0 else tail[m - 1].syzygy, k + m, limit, M.name)
        if m == 0:  # the first step covers M's own syzygy (equal to S as a representation)
            cover = dataclasses.replace(step.cover, module=steps[-1].syzygy)
            step = _Step(cover, step.kernel, step.syzygy)
        steps.append(step)


def _steps(M: Module, count: int, limit: int | None = None) -> list[_Step]:
    """The first ``count`` steps of the minimal resolution (fewer if it ends), cached on ``M``.

    Raises :class:`~hwcat.errors.WorkBudgetExceeded` before building a
    syzygy or term larger than ``limit`` (default: the default budget).
    """
    limit = max_syzygy_dimension_or_default(limit)
    steps: list[_Step] = M._memo.setdefault(_STEPS, [])
    while len(steps) < count:
        X = M if not steps else steps[-1].syzygy
        if X.dim == 0:
            break
        if X.dim == 1 and steps:
            # a simple syzygy L(j) (arrows act by zero on a line): from here on the
            # resolution is that of L(j), computed once per algebra and shared
            # (not when S waits for such a tail itself further up, i.e. a cycle of
            # simples, which goes on by hand; nor beyond _SHARED_DEPTH nested tails)
            busy = M.algebra.cached(("homological:extending",), set)
            S = _shared_simple(M.algebra, X.dims.index(1))
            if S is not M and id(S) not in busy and len(busy) < _SHARED_DEPTH:
                busy.add(id(M))
                try:
                    _extend_by_simple(M, steps, S, count, limit)
                finally:
                    busy.discard(id(M))
                break
        c = _budgeted_cover(X, len(steps), limit, M.name)
        K = _map_kernels(c.projection)
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


def projective_resolution(
    M: Module, length: int, *, max_syzygy_dimension: int | None = None
) -> ProjectiveResolution:
    """The minimal projective resolution of ``M`` up to the term ``P_length``.

    Fewer terms come back when the resolution ends earlier (see
    :attr:`ProjectiveResolution.complete`).  The steps are cached on ``M``.
    Raises :class:`~hwcat.errors.WorkBudgetExceeded` when a syzygy or term
    would exceed ``max_syzygy_dimension`` (default
    :data:`DEFAULT_MAX_SYZYGY_DIMENSION`).
    """
    _need_int(length, "length", 0)
    steps = _steps(M, length + 1, max_syzygy_dimension)
    return ProjectiveResolution(
        M,
        tuple(s.cover for s in steps),
        tuple(s.kernel for s in steps),
        tuple(s.syzygy for s in steps),
    )


def projective_presentation(
    M: Module, *, max_syzygy_dimension: int | None = None
) -> ProjectiveResolution:
    """The minimal projective presentation ``P_1 -> P_0 -> M -> 0`` (the resolution up to ``P_1``)."""
    return projective_resolution(M, 1, max_syzygy_dimension=max_syzygy_dimension)


def syzygy(M: Module, i: int = 1, *, max_syzygy_dimension: int | None = None) -> Module:
    """``Omega^i(M)``, the ``i``-th syzygy in the minimal resolution (``Omega^0(M) = M``)."""
    _need_int(i, "i", 0)
    if i == 0:
        return M
    steps = _steps(M, i, max_syzygy_dimension)
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


def injective_coresolution(
    M: Module, length: int, *, max_syzygy_dimension: int | None = None
) -> InjectiveCoresolution:
    """The minimal injective coresolution of ``M`` up to the term ``I^length``.

    >>> from hwcat.io.spec import load_spec_text
    >>> from hwcat.modules import simple
    >>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["1", "2"]\\narrows = ["a: 1 -> 2"]')
    >>> injective_coresolution(simple(A, 1), 3).multiplicities()
    ((0, 1), (1, 0))
    """
    R = projective_resolution(_dual(M), length, max_syzygy_dimension=max_syzygy_dimension)
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


def _hom_differential(R: ProjectiveResolution | _ExtData, i: int, N: Module) -> Mat:
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


@dataclass(frozen=True, eq=False)
class _ExtData:
    covers: tuple[ProjectiveCover, ...]  # P_0 .. P_(degree+1)
    inclusions: tuple[tuple[Mat, ...], ...]  # Omega^1 in P_0 .. Omega^(degree+1) in P_degree


def ext_dimensions(
    M: Module, N: Module, degree: int, *, max_syzygy_dimension: int | None = None
) -> tuple[int, ...]:
    """``(dim Ext^0(M, N), ..., dim Ext^degree(M, N))`` from the minimal resolution of ``M``.

    ``Ext^0`` is ``Hom``.  The resolution of ``M`` is cached on ``M``, so
    many calls with the same ``M`` share it.  Only the terms ``P_0, ...,
    P_(degree+1)`` are built (the syzygy after the last term is not needed);
    :class:`~hwcat.errors.WorkBudgetExceeded` is raised when one of them or
    a syzygy would exceed ``max_syzygy_dimension``.

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
    limit = max_syzygy_dimension_or_default(max_syzygy_dimension)
    steps = _steps(M, degree + 1, limit)
    covers = [s.cover for s in steps]
    if len(steps) == degree + 1 and steps[-1].syzygy.dim:
        covers.append(_budgeted_cover(steps[-1].syzygy, degree + 1, limit, M.name))
    R = _ExtData(tuple(covers), tuple(s.kernel for s in steps))
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
