"""Tilting modules and the Ringel dual of a quasi-hereditary algebra.

Method
------
``T(L)`` is built by Ringel's construction: start with ``Delta(L)`` and, for
the vertices ``mu`` below ``L`` from the highest down, replace the module
``M`` by its universal extension by ``Delta(mu)``,

    0 -> M -> E -> Delta(mu)^d -> 0,    d = dim Ext^1(Delta(mu), M),

so that ``Ext^1(Delta(mu), E) = 0``.  ``Ext^1(Delta(mu), M)`` is computed
from a projective cover ``0 -> K -> P -> Delta(mu) -> 0`` as
``Hom(K, M)`` modulo the restrictions of ``Hom(P, M)``; a basis ``xi_1..xi_d``
of it gives ``E`` as the pushout ``(M + P^d) / {(sum xi_i(k_i), -k)}``.
Each result is verified: it has a standard and a costandard filtration,
``[T(L) : L(L)] = 1``, and its endomorphism ring is local (the endomorphisms
vanishing at ``L`` form a nilpotent ideal).

The Ringel dual ``R(A) = End_A(T)`` for ``T`` the sum of the ``T(L)``, with the
product of composition (``f g = f o g``, first ``g``), is built as a
:class:`~hwcat.algebras.hub.basic.BasicAlgebra`: its vertex ``L`` is ``T(L)``
and ``e_L R e_M = Hom(T(M), T(L))``.  hwcat's modules are right modules, and
``Hom_A(T, X)`` is a right ``End_A(T)``-module by composition, so
``Hom_A(T, -)`` carries the modules with a costandard filtration onto those
of ``R`` with a standard filtration, ``T(L)`` to ``P_R(L)`` and ``nabla(L)``
to ``Delta_R(L)``; hence ``[Delta_R(L) : L(M)] = (T(M) : Delta(L))``.  (In
the convention of left modules the same algebra is written ``End_A(T)^op``.)
:func:`endomorphism_algebra` builds ``End(T)^op`` (``e_L R e_M = Hom(T(L),
T(M))``, product "first f, then g"), whose radical is everything except the
scalars at the vertices and whose arrows are a basis of the radical modulo
its square; the Ringel dual is its opposite.

References
----------
C. M. Ringel, The category of modules with good filtrations over a
quasi-hereditary algebra has almost split sequences, Math. Z. 208 (1991).
"""

from __future__ import annotations

import copy
import re
from dataclasses import dataclass
from typing import Any

from hwcat.algebras.hub.basic import BasicAlgebra
from hwcat.algebras.hub.quiver import Arrow, Quiver
from hwcat.errors import HwcatError, InternalInconsistency, OrderError
from hwcat.exact import Mat, assemble, echelon, select_independent_rows
from hwcat.modules import Module, direct_sum, hom
from hwcat.modules.hom import hom_images, homomorphisms_from_images
from hwcat.progress import task
from hwcat.theory.highest_weight import (
    costandard_filtration,
    heredity_chain,
    standard_filtration,
    standard_module,
)
from hwcat.theory.homological import projective_cover
from hwcat.theory.orders import PartialOrder
from hwcat.theory.resolutions import _map_kernels

__all__ = [
    "universal_extension",
    "TiltingModule",
    "tilting_module",
    "tilting_modules",
    "endomorphism_algebra",
    "ringel_dual",
    "is_local_endomorphism_ring",
]


def _flat(f: tuple[Mat, ...]) -> list:
    out: list = []
    for m in f:
        out.extend(m.entries())
    return out


def _flat_matrix(F, homs: list[tuple[Mat, ...]], size: int) -> Mat:
    return Mat.from_flat(F, len(homs), size, [x for f in homs for x in _flat(f)])


def _unflat(F, row: list, shapes: list[tuple[int, int]]) -> tuple[Mat, ...]:
    out, o = [], 0
    for r, c in shapes:
        out.append(Mat.from_flat(F, r, c, row[o : o + r * c]))
        o += r * c
    return tuple(out)


def _cover_kernel(X: Module) -> tuple[Any, list[Mat], Module]:
    """The projective cover ``P -> X``, the kernel's bases inside ``P`` and the kernel ``K``.

    Kept with ``X`` (standard modules are kept by the algebra, so each
    ``Delta(mu)`` is presented once for all the tilting modules).
    """
    key = "tilting:cover-kernel"
    if key not in X._memo:
        cov = projective_cover(X)
        Kspaces = _map_kernels(cov.projection)
        X._memo[key] = (cov, Kspaces, cov.cover.submodule(Kspaces))
    return X._memo[key]


def _restrictions(
    cov: Any, K: Module, Kspaces: list[Mat], M: Module, offsets: list[int], total: int
) -> Mat:
    """``Hom(P, M)`` restricted to ``K``, in the generator coordinates of ``Hom(K, M)``.

    ``P`` is free on the tops ``e_j`` of its summands (at vertices ``v_j``): a
    homomorphism is any choice of images ``m_j`` in ``M_{v_j}`` and sends the
    basis path ``e_j p`` of ``P`` to ``m_j p``.  A generator ``x`` of ``K``
    (a vector of ``P_t``) therefore goes to ``sum_j sum_p x_(j,p) m_j p``:
    one block ``sum_p x_(j,p) [p on M]`` per summand ``j`` and generator.
    Rows: the images ``m_j`` running over unit vectors, summand by summand.
    """
    A = M.algebra
    F = M.field
    blocks = []
    row0 = 0
    for j, vj in enumerate(cov.summands):
        dj = M.dims[vj]
        for t_index, (t, x) in enumerate(K.generators()):
            dt = M.dims[t]
            if dj == 0 or dt == 0:
                continue
            xp = (x @ Kspaces[t]).entries()  # the generator as a vector of P_t
            off = cov.offsets(t)[j]
            acc = None
            for k, p in enumerate(A.words[vj][t]):
                c = xp[off + k]
                if c != 0:
                    term = M.path_matrix(p, vj).scale(c)
                    acc = term if acc is None else acc + term
            if acc is not None:
                blocks.append((row0, offsets[t_index], acc))
        row0 += dj
    return assemble(F, row0, total, blocks)


def universal_extension(M: Module, X: Module, *, method: str = "images") -> tuple[Module, int]:
    """The universal extension ``0 -> M -> E -> X^d -> 0``; returns ``(E, d)``.

    ``d = dim Ext^1(X, M)``; ``M`` is the submodule of ``E`` on the first
    coordinates at each vertex.

    ``Ext^1(X, M)`` is ``Hom(K, M)`` modulo the restrictions of ``Hom(P, M)``
    for the projective cover ``0 -> K -> P -> X -> 0``.  ``method="images"``
    (default) works in generator coordinates: ``Hom(K, M)`` as images of the
    generators of ``K``, the restrictions read off the paths of ``P`` (no
    system for ``Hom(P, M)``), and only the ``d`` chosen classes are turned
    into matrices; nothing is done when ``M`` vanishes at every generator of
    ``K``.  ``method="flat"`` (the reference path, for tests) computes both
    Hom spaces as matrices and compares them flattened.
    """
    if method not in ("images", "flat"):
        raise HwcatError(f"method = {method!r}: expected 'images' or 'flat'")
    F = M.field
    A = M.algebra
    cov, Kspaces, K = _cover_kernel(X)
    P = cov.cover
    if method == "flat":
        shapesKM = [(K.dims[v], M.dims[v]) for v in range(A.n)]
        size = sum(r * c for r, c in shapesKM)
        HK = hom(K, M)
        if not HK or size == 0:
            return M, 0
        restr = [tuple(Kspaces[v] @ f[v] for v in range(A.n)) for f in hom(P, M)]
        HKm = _flat_matrix(F, HK, size)
        R = _flat_matrix(F, restr, size) if restr else None
        keep = select_independent_rows(HKm, echelon(R) if R is not None and R.nrows else None)
        xis = [HK[i] for i in keep]
    else:
        gens = K.generators()
        offsets, total = [], 0
        for t, _ in gens:
            offsets.append(total)
            total += M.dims[t]
        if total == 0:  # every homomorphism K -> M kills the generators
            return M, 0
        HK = hom_images(K, M)
        if HK.nrows == 0:
            return M, 0
        R = _restrictions(cov, K, Kspaces, M, offsets, total)
        Rb = echelon(R) if R.nrows else None
        if Rb is not None and Rb.nrows == HK.nrows:  # the restrictions fill Hom(K, M)
            return M, 0
        keep = select_independent_rows(HK, Rb if Rb is not None and Rb.nrows else None)
        xis = homomorphisms_from_images(K, M, HK.take_rows(keep)) if keep else []
    d = len(xis)
    if d == 0:
        return M, 0
    Y = direct_sum(M, *([P] * d))
    W = []
    for v in range(A.n):
        rows = []
        k = Kspaces[v]
        if k.nrows == 0:
            W.append(Mat.zeros(F, 0, Y.dims[v]))
            continue
        for i, xi in enumerate(xis):
            blocks = [xi[v]]
            for j in range(d):
                blocks.append(-k if j == i else Mat.zeros(F, k.nrows, P.dims[v]))
            rows.append(Mat.hstack(F, blocks, k.nrows))
        W.append(echelon(Mat.vstack(F, rows, Y.dims[v])))
    E = Y.quotient(W)
    if E.dim != M.dim + d * X.dim:
        raise InternalInconsistency("universal extension has the wrong dimension")
    return E, d


def is_local_endomorphism_ring(M: Module, vertex: int, *, method: str = "images") -> bool:
    """For ``M`` with ``[M : L(vertex)] = 1``: whether ``End(M)`` is local.

    The scalar by which an endomorphism acts on the line ``M_vertex`` is an
    algebra map ``End(M) -> k``; ``End(M)`` is local exactly when its kernel
    ``I`` is nilpotent.  ``method="images"`` (default) follows the images
    ``M ⊇ I M ⊇ I(I M) ⊇ ...`` (``I^k M`` is spanned by the images of the
    basis of ``I`` on ``I^(k-1) M``): ``I`` is nilpotent exactly when this
    chain reaches zero, and it is not when the chain stops at a nonzero
    submodule.  ``method="powers"`` (the reference path, for tests) computes
    the ideals ``I, I^2, ...`` themselves from all products.
    """
    if method not in ("images", "powers"):
        raise HwcatError(f"method = {method!r}: expected 'images' or 'powers'")
    if M.dims[vertex] != 1:
        raise InternalInconsistency("is_local_endomorphism_ring needs multiplicity one")
    F = M.field
    n = M.algebra.n
    shapes = [(M.dims[v], M.dims[v]) for v in range(n)]
    size = sum(r * c for r, c in shapes)
    E = hom(M, M)
    # a basis of the kernel of f -> f[vertex] (scalars); I as spanned by combinations
    scal = Mat.from_flat(F, len(E), 1, [f[vertex].entries()[0] for f in E])
    K = scal.left_kernel()
    Em = _flat_matrix(F, E, size)
    Ibasis = echelon(K @ Em) if K.nrows else Mat.zeros(F, 0, size)
    I = [_unflat(F, Ibasis.take_rows([r]).entries(), shapes) for r in range(Ibasis.nrows)]
    if method == "images":
        support = [v for v in range(n) if M.dims[v]]
        cur = {v: Mat.identity(F, M.dims[v]) for v in support}
        dim = M.dim
        while I:
            nxt = {}
            for v, U in cur.items():
                if U.nrows == 0:
                    continue
                img = echelon(Mat.vstack(F, [U @ f[v] for f in I], M.dims[v]))
                if img.nrows:
                    nxt[v] = img
            new = sum(U.nrows for U in nxt.values())
            if new == 0:
                return True
            if new >= dim:
                return False
            cur, dim = nxt, new
        return True
    power = I
    dims_seen = []
    while power:
        prods = [tuple(x[v] @ y[v] for v in range(n)) for x in power for y in I]
        Pm = echelon(_flat_matrix(F, prods, size)) if prods else Mat.zeros(F, 0, size)
        if Pm.nrows == 0:
            return True
        if dims_seen and Pm.nrows >= dims_seen[-1]:
            return False
        dims_seen.append(Pm.nrows)
        power = [_unflat(F, Pm.take_rows([r]).entries(), shapes) for r in range(Pm.nrows)]
    return True


@dataclass(frozen=True)
class TiltingModule:
    """An indecomposable tilting module ``T(L)`` with its verified data."""

    vertex: int
    module: Module
    standard_multiplicities: tuple[int, ...]
    costandard_multiplicities: tuple[int, ...]
    extension_steps: tuple[tuple[int, int], ...]  # (mu, d) for each universal extension

    def to_dict(self, vertices) -> dict[str, Any]:
        return {
            "vertex": vertices[self.vertex],
            "dimension_vector": list(self.module.dims),
            "standard_multiplicities": list(self.standard_multiplicities),
            "costandard_multiplicities": list(self.costandard_multiplicities),
            "radical_layers": [list(x) for x in self.module.radical_layers()],
        }


def _require_qh(A: BasicAlgebra, order: PartialOrder) -> None:
    if not heredity_chain(A, order).holds:
        raise OrderError(f"the algebra is not quasi-hereditary for the order {order.chain_text()}")


def tilting_module(A: BasicAlgebra, L: str | int, order: PartialOrder) -> TiltingModule:
    """``T(L)`` by Ringel's construction, verified (see the module notes)."""
    L = A.vertex_index(L)
    return A.cached(("tilting", L, order.less), lambda: _tilting_module(A, L, order))


def _tilting_module(A: BasicAlgebra, L: int, order: PartialOrder) -> TiltingModule:
    _require_qh(A, order)
    M = standard_module(A, L, order)
    steps = []
    ext = order.first_extension()
    below = [mu for mu in ext[ext.index(L) + 1 :]]
    for mu in below:
        M, d = universal_extension(M, standard_module(A, mu, order))
        if d:
            steps.append((mu, d))
    if not steps:  # T(L) = Delta(L): a copy, not the cached standard module renamed
        M = copy.copy(M)
        M._memo = dict(M._memo)
    M.name = f"T({A.vertices[L]})"
    sf = standard_filtration(M, order)
    cf = costandard_filtration(M, order)
    if not (sf.exists and cf.exists):
        raise InternalInconsistency(f"T({A.vertices[L]}) lacks a standard or costandard filtration")
    if M.dims[L] != 1:
        raise InternalInconsistency(f"[T({A.vertices[L]}) : L({A.vertices[L]})] = {M.dims[L]}")
    if not is_local_endomorphism_ring(M, L):
        raise InternalInconsistency(f"T({A.vertices[L]}) is decomposable")
    return TiltingModule(L, M, sf.multiplicities, cf.multiplicities, tuple(steps))


def tilting_modules(A: BasicAlgebra, order: PartialOrder) -> list[TiltingModule]:
    """All ``T(L)``, in vertex order."""
    out = []
    with task("tilting modules", total=A.n) as step:
        for L in range(A.n):
            out.append(tilting_module(A, L, order))
            step(1)
    return out


_IDENT = re.compile(r"[^A-Za-z0-9_]")


def _arrow_name(a: str, b: str, k: int, taken: set[str]) -> str:
    base = f"f_{_IDENT.sub('_', a)}_{_IDENT.sub('_', b)}"
    name = base if k == 0 else f"{base}_{k}"
    while name in taken:
        name += "_"
    taken.add(name)
    return name


class _Shapes(dict):
    """``(i, j) -> [(dim T_i(v), dim T_j(v)) for every vertex v]``, made on first use."""

    def __init__(self, modules: list[Module]) -> None:
        super().__init__()
        self.modules = modules

    def __missing__(self, key: tuple[int, int]) -> list[tuple[int, int]]:
        di, dj = self.modules[key[0]].dims, self.modules[key[1]].dims
        out = self[key] = list(zip(di, dj, strict=True))
        return out


class _Sizes(dict):
    """``(i, j) -> sum_v dim T_i(v) dim T_j(v)`` (the length of a flattened map), on first use."""

    def __init__(self, modules: list[Module]) -> None:
        super().__init__()
        self.modules = modules
        self.support = [[(v, d) for v, d in enumerate(M.dims) if d] for M in modules]

    def __missing__(self, key: tuple[int, int]) -> int:
        dj = self.modules[key[1]].dims
        out = self[key] = sum(d * dj[v] for v, d in self.support[key[0]])
        return out


_CHUNK = 64  # composites added to the radical square's echelon form at a time


class _Unflattened(dict):
    """Rows of flattened homomorphisms, as tuples of matrices, made on first use per pair."""

    def __init__(self, F, rows: dict[tuple[int, int], Mat], shapes: dict) -> None:
        super().__init__()
        self.F, self.rows, self.shapes = F, rows, shapes

    def __missing__(self, key: tuple[int, int]) -> list[tuple[Mat, ...]]:
        m = self.rows[key]
        e, w = m.entries(), m.ncols
        out = [_unflat(self.F, e[r * w : (r + 1) * w], self.shapes[key]) for r in range(m.nrows)]
        self[key] = out
        return out


class _GeneratorCoordinates:
    """Homomorphisms ``T_i -> T_j`` written by the images of the generators of ``T_i``.

    A homomorphism is determined by where it sends the minimal generators
    ``g`` of its source, so the row ``(g f)_g`` is a faithful coordinate
    vector, much shorter than the flattened matrices.  A composite ``x y``
    (first ``x : T_i -> T_k``, then ``y : T_k -> T_j``) has coordinates
    ``((g x) y)_g``: for each generator one product of the stacked images
    ``g x`` (all ``x`` at once) with the side by side ``y`` (all ``y`` at
    once), instead of one product per pair and vertex.
    """

    def __init__(self, modules: list[Module], shapes: dict) -> None:
        self.modules, self.shapes = modules, shapes
        self.F = modules[0].field
        self.gens = [M.generators() for M in modules]
        self._G: dict[tuple[int, int], Mat] = {}
        self._Y: dict[tuple, Any] = {}

    def offsets(self, i: int, j: int) -> tuple[list[int], int]:
        """Where the block of each generator of ``T_i`` starts; the total size."""
        dj = self.modules[j].dims
        out, o = [], 0
        for v, _ in self.gens[i]:
            out.append(o)
            o += dj[v]
        return out, o

    def matrix(self, i: int, j: int) -> Mat:
        """Flattened ``Hom(T_i, T_j)`` coordinates -> generator coordinates (a linear map)."""
        if (i, j) not in self._G:
            shapes = self.shapes[(i, j)]
            flat_off, o = [], 0
            for r, c in shapes:
                flat_off.append(o)
                o += r * c
            goff, size = self.offsets(i, j)
            cells = [self.F.zero] * (o * size)
            for t, (v, g) in enumerate(self.gens[i]):
                dv, dj = shapes[v]
                for r, x in enumerate(g.entries()):
                    if x != 0:
                        for c in range(dj):
                            cells[(flat_off[v] + r * dj + c) * size + goff[t] + c] = x
            self._G[(i, j)] = Mat.from_flat(self.F, o, size, cells)
        return self._G[(i, j)]

    def _unit_columns(self, i: int, j: int) -> list[int] | None:
        """When every generator of ``T_i`` is a unit vector ``e_r`` (the usual case), the
        flattened positions of the rows ``r`` it picks: generator coordinates are
        then just these columns.  ``None`` otherwise."""
        key = (i, j, "columns")
        if key not in self._Y:
            di, dj = self.modules[i].dims, self.modules[j].dims
            flat_off, o = {}, 0
            for v, d in enumerate(di):  # where the block of each vertex starts
                if d:
                    flat_off[v] = o
                    o += d * dj[v]
            cols: list[int] | None = []
            for v, g in self.gens[i]:
                e = g.entries()
                nz = [r for r, x in enumerate(e) if x != 0]
                if len(nz) != 1 or e[nz[0]] != 1:
                    cols = None
                    break
                cols.extend(flat_off[v] + nz[0] * dj[v] + c for c in range(dj[v]))
            self._Y[key] = cols
        return self._Y[key]

    def of(self, i: int, j: int, rows: Mat) -> Mat:
        """Rows of flattened homomorphisms ``T_i -> T_j`` in generator coordinates."""
        cols = self._unit_columns(i, j)
        if cols is not None:
            return rows.take_cols(cols)
        return rows @ self.matrix(i, j)

    def _side_by_side(self, k: int, j: int, v: int, ys: list[tuple[Mat, ...]]) -> Mat:
        key = (k, j, v)
        if key not in self._Y:
            dk = self.modules[k].dims[v]
            self._Y[key] = Mat.hstack(self.F, [y[v] for y in ys], dk)
        return self._Y[key]

    def basis_rows(self, i: int, j: int, flat: dict) -> Mat:
        """The (flattened, echelon) basis of ``Hom(T_i, T_j)`` in generator coordinates."""
        key = (i, j, "basis")
        if key not in self._Y:
            self._Y[key] = self.of(i, j, flat[(i, j)])
        return self._Y[key]

    def compose_with(self, s: int, k: int, j: int, flat: dict, h: tuple[Mat, ...]) -> Mat:
        """The matrix of ``g -> g h`` from the basis of ``Hom(T_s, T_k)`` to that of ``Hom(T_s, T_j)``.

        Row ``r``: the coordinates of ``g_r h`` (first ``g_r``, then ``h : T_k ->
        T_j``).  In generator coordinates ``g h`` has, for each generator ``e``
        of ``T_s``, the block ``(e g) h[v_e]``: one product per generator for
        all ``g`` at once; the coordinates solve one linear system against the
        basis of ``Hom(T_s, T_j)`` (they are unique: a basis).
        """
        if flat[(s, k)].nrows == 0 or flat[(s, j)].nrows == 0:
            return Mat.zeros(self.F, flat[(s, k)].nrows, flat[(s, j)].nrows)
        G = self.basis_rows(s, k, flat)
        B = self.basis_rows(s, j, flat)
        kof, _ = self.offsets(s, k)
        dk, dj = self.modules[k].dims, self.modules[j].dims
        blocks = []
        for t, (v, _) in enumerate(self.gens[s]):
            if dj[v] == 0:
                continue
            if dk[v] == 0:
                blocks.append(Mat.zeros(self.F, G.nrows, dj[v]))
                continue
            blocks.append(G.take_cols(range(kof[t], kof[t] + dk[v])) @ h[v])
        Z = Mat.hstack(self.F, blocks, G.nrows)
        C = B.solve_left(Z)
        if C is None:
            raise InternalInconsistency("a composite of homomorphisms left the Hom space")
        return C

    def radical_square(
        self, i: int, j: int, rad: dict, rad_homs: dict, whole: int | None = None
    ) -> Mat:
        """Echelon basis, in generator coordinates, of the span of the composites ``x y``.

        The composites through each middle summand ``k`` are added to the echelon
        form in turn; with ``whole`` (the dimension of the radical ``rad(i, j)``
        holding them all) the work stops as soon as the span is the whole
        radical: the span, hence its echelon basis, is then already final.
        """
        n = len(self.modules)
        goff, size = self.offsets(i, j)
        dj = self.modules[j].dims
        acc: Mat | None = None
        for k in range(n):
            X, ys = rad[(i, k)], rad_homs[(k, j)]
            if X.nrows == 0 or not ys:
                continue
            XG = self.of(i, k, X)  # rows: the images g x of every generator g
            kof, _ = self.offsets(i, k)
            blocks = []
            for t, (v, _) in enumerate(self.gens[i]):
                dk_v, dj_v = self.modules[k].dims[v], dj[v]
                if dk_v == 0 or dj_v == 0:
                    blocks.append(None)
                    continue
                U = XG.take_cols(range(kof[t], kof[t] + dk_v))
                blocks.append((U @ self._side_by_side(k, j, v, ys)).entries())
            ny = len(ys)
            step = max(1, _CHUNK // ny)  # a few composites at a time, then the echelon form
            for x0 in range(0, X.nrows, step):
                rows = []
                nrows = 0
                for x in range(x0, min(x0 + step, X.nrows)):
                    for y in range(ny):
                        for t, (v, _) in enumerate(self.gens[i]):
                            dj_v = dj[v]
                            e = blocks[t]
                            if e is None:
                                rows.extend([self.F.zero] * dj_v)
                            else:
                                base = x * ny * dj_v + y * dj_v
                                rows.extend(e[base : base + dj_v])
                        nrows += 1
                new = Mat.from_flat(self.F, nrows, size, rows)
                acc = echelon(new if acc is None else Mat.vstack(self.F, [acc, new], size))
                if whole is not None and acc.nrows >= whole:
                    return acc
        return Mat.zeros(self.F, 0, size) if acc is None else acc


def endomorphism_algebra(
    modules: list[Module],
    labels: tuple[str, ...],
    vertices: list[int],
    name: str = "",
    *,
    method: str = "generators",
) -> BasicAlgebra:
    """``End(T)^op`` for ``T`` the sum of ``modules`` (indecomposable, pairwise non-isomorphic).

    ``vertices[i]`` is a vertex where ``modules[i]`` has multiplicity one and
    which the endomorphisms of the other summands cannot reach isomorphically
    (for tilting modules: the highest weight).  The product is "first f, then g".

    The arrows are radical maps independent modulo the square of the radical.
    ``method="generators"`` (default) spans the square from the images of the
    generators of each source (see :class:`_GeneratorCoordinates`);
    ``method="pairs"`` flattens every composite ``x y`` at every vertex (the
    reference path, kept for tests; 689k small products for the Auslander
    algebra of ``k[x]/(x^12)``).
    """
    if method not in ("generators", "pairs"):
        raise HwcatError(f"method = {method!r}: expected 'generators' or 'pairs'")
    F = modules[0].field
    n = len(modules)
    N = modules[0].algebra.n
    shapes = _Shapes(modules)  # (i, j) -> the shapes (dim T_i(v), dim T_j(v)), made on use
    sizes = _Sizes(modules)  # (i, j) -> sum_v dim T_i(v) dim T_j(v), over the support of T_i
    flat: dict[tuple[int, int], Mat] = {}
    pivots: dict[tuple[int, int], tuple[int, ...]] = {}
    for i in range(n):
        for j in range(n):
            H = hom(modules[i], modules[j])
            Hm = echelon(_flat_matrix(F, H, sizes[(i, j)])) if H else Mat.zeros(F, 0, sizes[(i, j)])
            flat[(i, j)] = Hm
            pivots[(i, j)] = Hm.echelon_pivots()
    # the basis homomorphisms as matrices, made when asked for
    basis = _Unflattened(F, flat, shapes)

    def coords(i, j, f):
        row = _flat(f)
        return [row[p] for p in pivots[(i, j)]]

    # radical: all of Hom(i, j) for i != j; endomorphisms vanishing at vertices[i] for i == j
    rad: dict[tuple[int, int], Mat] = {}
    for i in range(n):
        for j in range(n):
            H = flat[(i, j)]
            if i != j or H.nrows == 0:
                rad[(i, j)] = H
                continue
            v = vertices[i]
            if modules[i].dims[v] != 1:
                raise InternalInconsistency("the vertex of a summand needs multiplicity one")
            # the scalar at v: the flattened column of the single entry at v
            at = sum(r * c for r, c in shapes[(i, i)][:v])
            scal = H.take_cols([at])
            K = scal.left_kernel()
            rad[(i, j)] = echelon(K @ H) if K.nrows else Mat.zeros(F, 0, H.ncols)
    rad_homs = _Unflattened(F, rad, shapes)
    arrows: list[Arrow] = []
    arrow_homs: list[tuple[Mat, ...]] = []
    taken: set[str] = set()
    gens = _GeneratorCoordinates(modules, shapes)
    for i in range(n):
        for j in range(n):
            R = rad[(i, j)]
            if R.nrows == 0:
                continue
            if method == "pairs":  # every composite, flattened (the reference path)
                prods = [
                    tuple(x[v] @ y[v] for v in range(N))
                    for k in range(n)
                    for x in rad_homs[(i, k)]
                    for y in rad_homs[(k, j)]
                ]
                R2 = echelon(_flat_matrix(F, prods, sizes[(i, j)])) if prods else Mat.zeros(F, 0, 1)
                keep = select_independent_rows(R, R2 if R2.nrows else None)
            else:
                R2 = gens.radical_square(i, j, rad, rad_homs, R.nrows)
                keep = select_independent_rows(gens.of(i, j, R), R2 if R2.nrows else None)
            for k, r in enumerate(keep):
                arrows.append(Arrow(_arrow_name(labels[i], labels[j], k, taken), i, j))
                arrow_homs.append(rad_homs[(i, j)][r])
    quiver = Quiver(tuple(labels), tuple(arrows))
    reps = []
    starts = []
    for s in range(n):
        dims = tuple(len(basis[(s, t)]) for t in range(n))
        maps = []
        for a, h in zip(arrows, arrow_homs, strict=True):
            if method == "pairs":
                rows = [
                    coords(s, a.target, tuple(g[v] @ h[v] for v in range(N)))
                    for g in basis[(s, a.source)]
                ]
                m = Mat.from_flat(F, dims[a.source], dims[a.target], [x for r in rows for x in r])
            else:
                m = gens.compose_with(s, a.source, a.target, flat, h)
            maps.append(m)
        reps.append((dims, tuple(maps)))
        ident = tuple(Mat.identity(F, modules[s].dims[v]) for v in range(N))
        starts.append(Mat.from_flat(F, 1, dims[s], coords(s, s, ident)))
    return BasicAlgebra.from_cyclic_representations(F, quiver, reps, starts=starts, name=name)


def ringel_dual(A: BasicAlgebra, order: PartialOrder) -> tuple[BasicAlgebra, PartialOrder]:
    """The Ringel dual ``R(A) = End_A(T)`` and its order (the opposite of ``order``).

    Its vertex ``L`` is ``T(L)`` (same names as ``A``) and ``e_L R e_M =
    Hom(T(M), T(L))``, so that ``Hom_A(T, -)`` takes right ``A``-modules to right
    ``R``-modules (see the module docstring).
    """
    Ts = tilting_modules(A, order)
    E = endomorphism_algebra([T.module for T in Ts], A.vertices, list(range(A.n)))
    R = E.opposite()
    R.name = f"Ringel dual of {A.name}" if A.name else "Ringel dual"
    opp = PartialOrder(R.vertices, frozenset((b, a) for a, b in order.less))
    return R, opp
