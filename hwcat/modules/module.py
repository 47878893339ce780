"""Modules as quiver representations of a :class:`~hwcat.algebras.hub.basic.BasicAlgebra`.

A module ``M`` is a vector space ``M_v`` at each vertex and a matrix per arrow
(shape ``dim M_source x dim M_target``, acting on row vectors).  These are
right modules: ``P(i) = e_i A`` has at vertex ``j`` the paths from ``i`` to
``j`` modulo the relations.  All constructions work vertex by vertex.

Examples
--------
>>> from hwcat.io.spec import load_spec_text
>>> A = load_spec_text('''
... field = "QQ"
... [quiver]
... vertices = ["1", "2", "3"]
... arrows = ["a: 1 -> 2", "b: 2 -> 3"]
... ''')
>>> P = projective(A, 0)
>>> P.dims
(1, 1, 1)
>>> P.radical_layers()
[(1, 0, 0), (0, 1, 0), (0, 0, 1)]
>>> injective(A, 0).dims
(1, 0, 0)
"""

from __future__ import annotations

from collections.abc import Mapping, Sequence
from itertools import compress
from typing import Any

from hwcat.algebras.hub.basic import BasicAlgebra
from hwcat.algebras.hub.quiver import Path
from hwcat.algebras.hub.rep import (
    ArrowMaps,
    closure,
    generated_word_basis,
    path_matrix,
    quotient,
    restrict,
)
from hwcat.errors import InternalInconsistency
from hwcat.exact import Mat, complement, echelon, quotient_map
from hwcat.exact.sparse import (
    nonzero_count,
    rows_times,
    sparse_echelon,
    sparse_rows,
    sparse_transpose,
    to_mat,
)

__all__ = [
    "Module",
    "projective",
    "injective",
    "simple",
    "direct_sum",
    "regular_module",
    "is_homomorphism",
    "kernel_spaces",
    "image_spaces",
    "series_method",
]

SPARSE_ROWS_PER_ROW = 2
"""Largest average number of nonzero entries per row of a module's arrow matrices for which
its radical series is computed on sparse rows.  Path, monomial and commutativity-relation
algebras act on basis paths by single paths (one entry per row); there the sparse
route costs the entries, the dense one ``dim^3`` per layer (k[x]/(x^300): about 0.1 s
against minutes, ``benchmarks/bench_describe_scale.py``)."""

SPARSE_MIN_DIM = 24
"""Below this dimension the dense route is used (flint's small products are cheaper than
Python's loops over entries)."""


def series_method(M: Module, method: str = "auto") -> str:
    """``"sparse"`` or ``"dense"``: how the radical series of ``M`` is computed.

    ``method="auto"`` picks ``"sparse"`` when the arrows act by single entries
    (then the series is computed on sets of coordinates, whatever the size), or
    when ``M`` has dimension at least :data:`SPARSE_MIN_DIM` and its arrow
    matrices have at most :data:`SPARSE_ROWS_PER_ROW` nonzero entries per row on
    average.  Both routes give the same reduced echelon bases.
    """
    if method in ("sparse", "dense"):
        return method
    if method != "auto":
        raise InternalInconsistency(f"unknown series method {method!r}")
    if M.acts_by_single_entries():
        return "sparse"
    if M.dim < SPARSE_MIN_DIM:
        return "dense"
    rows = sum(m.nrows for _, m in M.maps.items())
    known = M._memo.get("sparse_maps")
    if known is not None:
        nonzero = sum(len(r) for rs in known.values() for r in rs)
    else:
        nonzero = sum(nonzero_count(m) for _, m in M.maps.items())
    return "sparse" if nonzero <= SPARSE_ROWS_PER_ROW * rows else "dense"


class Module:
    """A finite-dimensional right module over a basic algebra, as a representation.

    Parameters
    ----------
    algebra : BasicAlgebra
    dims : sequence of int
        Dimension at each vertex (in the algebra's vertex order).
    maps : sequence of Mat
        One matrix per arrow, ``dims[source] x dims[target]``.
    name : str, optional
    """

    def __init__(
        self, algebra: BasicAlgebra, dims: Sequence[int], maps: Sequence[Mat], name: str = ""
    ) -> None:
        self.algebra = algebra
        # the hub's dimension tuples are taken as they are (no copy per module)
        self.dims = dims if type(dims) is tuple else tuple(map(int, dims))
        if len(self.dims) != algebra.n:
            raise InternalInconsistency("module data do not match the algebra")
        # only the maps between nonzero spaces are stored (shapes checked there)
        self.maps = ArrowMaps(algebra.field, self.dims, algebra.arrows, maps)
        self.name = name
        self._memo: dict[Any, Any] = {}

    # -- basic data ------------------------------------------------------------------
    @property
    def field(self):
        return self.algebra.field

    @property
    def dim(self) -> int:
        d = self._memo.get("dim")
        if d is None:
            d = self._memo["dim"] = sum(self.dims)
        return d

    def dimension_vector(self) -> tuple[int, ...]:
        """Composition multiplicities ``[M : L(i)]`` (the algebra is split basic)."""
        return self.dims

    def is_zero(self) -> bool:
        return self.dim == 0

    def __repr__(self) -> str:
        label = f"{self.name} " if self.name else ""
        return f"Module({label}dims={self.dims})"

    def path_matrix(self, path: Path, start: int) -> Mat:
        """The linear map ``M_start -> M_end`` by which ``path`` acts."""
        memo = self._memo.setdefault(("paths", start), {})
        return path_matrix(self.field, self.dims, self.maps, self.algebra.arrows, path, start, memo)

    def full(self) -> list[Mat]:
        """The whole module as subspaces (identity bases)."""
        return [Mat.identity(self.field, d) for d in self.dims]

    def zero_spaces(self) -> list[Mat]:
        return [Mat.zeros(self.field, 0, d) for d in self.dims]

    # -- submodules and quotients ----------------------------------------------------------
    def generated(self, gens: Mapping[int, Mat]) -> list[Mat]:
        """Echelon bases per vertex of the submodule generated by ``gens`` (vertex -> rows)."""
        return closure(self.field, self.dims, self.maps, self.algebra.arrows, dict(gens))

    def submodule(self, spaces: Sequence[Mat], name: str = "", method: str = "support") -> Module:
        """The submodule with the given echelon bases (which must be closed under arrows).

        Only the arrows stored in :attr:`maps` (those between nonzero spaces
        of ``M``) are visited, so the cost follows the support, not the
        quiver.  The reference path over every arrow is
        :func:`hwcat.algebras.hub.rep.restrict` (``method="reference"``).
        """
        dims = [s.nrows for s in spaces]
        if method == "reference":
            maps = restrict(self.field, self.maps, self.algebra.arrows, spaces)
            return Module(self.algebra, dims, maps, name)
        if method != "support":
            raise ValueError(f"unknown method {method!r}")
        arrows = self.algebra.arrows
        pivots: dict[int, tuple[int, ...]] = {}
        out = {}
        for i, m in self.maps.items():
            a = arrows[i]
            t = a.target
            if dims[a.source] and dims[t]:
                piv = pivots.get(t)
                if piv is None:
                    piv = pivots[t] = spaces[t].echelon_pivots()
                out[i] = (spaces[a.source] @ m).take_cols(piv)
        return Module(self.algebra, dims, out, name)

    def _quotient_on_support(
        self, spaces: Sequence[Mat]
    ) -> tuple[list[int], dict[int, Mat], dict[int, Mat]]:
        """``(dims, maps, projections)`` of ``M / N``, projections only where ``N`` is nonzero.

        Where ``N_v = 0`` the projection is the identity and is left out; the
        arrow matrices are the ones :func:`hwcat.algebras.hub.rep.quotient`
        makes (the identity factors dropped), so results agree entry for entry.
        """
        dims = list(self.dims)
        pis: dict[int, Mat] = {}
        secs: dict[int, Mat] = {}
        for v in self.support:
            s = spaces[v]
            if s.nrows:
                pi, sec, _ = quotient_map(s, dims[v])
                pis[v], secs[v] = pi, sec
                dims[v] = pi.ncols
        arrows = self.algebra.arrows
        qmaps = {}
        for i, m in self.maps.items():
            a = arrows[i]
            if dims[a.source] and dims[a.target]:
                sec = secs.get(a.source)
                pi = pis.get(a.target)
                if sec is not None:
                    m = sec @ m
                if pi is not None:
                    m = m @ pi
                qmaps[i] = m
        return dims, qmaps, pis

    def quotient(self, spaces: Sequence[Mat], name: str = "", method: str = "support") -> Module:
        """``M / N`` for the submodule ``N`` given by bases per vertex.

        ``method="support"`` (default) projects only at the vertices where
        ``N`` is nonzero; ``"reference"`` takes every vertex
        (:func:`hwcat.algebras.hub.rep.quotient`).
        """
        if method == "reference":
            dims, maps, _ = quotient(self.field, self.dims, self.maps, self.algebra.arrows, spaces)
            return Module(self.algebra, dims, maps, name)
        if method != "support":
            raise ValueError(f"unknown method {method!r}")
        qdims, qmaps, _ = self._quotient_on_support(spaces)
        return Module(self.algebra, tuple(qdims), qmaps, name)

    def quotient_with_projection(self, spaces: Sequence[Mat]) -> tuple[Module, list[Mat]]:
        qdims, qmaps, pis = self._quotient_on_support(spaces)
        F = self.field
        full = [pis[v] if v in pis else Mat.identity(F, d) for v, d in enumerate(self.dims)]
        return Module(self.algebra, tuple(qdims), qmaps), full

    def trace_of_vertices(self, vertices) -> list[Mat]:
        """The submodule ``M e A`` generated by the spaces at ``vertices``."""
        return self.generated(
            {v: Mat.identity(self.field, self.dims[v]) for v in vertices if self.dims[v]}
        )

    # -- radical and socle -------------------------------------------------------------
    def _radical_on_support(self) -> dict[int, Mat]:
        """``rad M`` at the vertices some stored arrow reaches (elsewhere it is zero)."""
        F = self.field
        imgs: dict[int, list[Mat]] = {}
        arrows = self.algebra.arrows
        for i, m in self.maps.items():
            imgs.setdefault(arrows[i].target, []).append(m)
        return {v: echelon(Mat.vstack(F, ms, self.dims[v])) for v, ms in imgs.items()}

    def radical_spaces(self) -> list[Mat]:
        """``rad M`` per vertex: the sum of the images of the arrows."""
        F = self.field
        rad = self._radical_on_support()
        return [rad[v] if v in rad else Mat.zeros(F, 0, d) for v, d in enumerate(self.dims)]

    def radical(self) -> Module:
        return self.submodule(self.radical_spaces())

    def top(self) -> tuple[int, ...]:
        """Dimension vector of ``M / rad M``."""
        return tuple(d - r.nrows for d, r in zip(self.dims, self.radical_spaces(), strict=True))

    def socle_spaces(self) -> list[Mat]:
        """``soc M`` per vertex: vectors killed by every arrow."""
        F = self.field
        outs: list[list[Mat]] = [[] for _ in self.dims]
        arrows = self.algebra.arrows
        for i, m in self.maps.items():
            outs[arrows[i].source].append(m)
        res = []
        for v, d in enumerate(self.dims):
            if not outs[v] or d == 0:
                res.append(Mat.identity(F, d))
            else:
                res.append(echelon(Mat.hstack(F, outs[v], d).left_kernel()))
        return res

    def socle(self) -> tuple[int, ...]:
        return tuple(s.nrows for s in self.socle_spaces())

    @property
    def support(self) -> tuple[int, ...]:
        """The vertices ``v`` with ``M_v`` nonzero."""
        sup = self._memo.get("support")
        if sup is None:
            sup = self._memo["support"] = tuple(compress(range(len(self.dims)), self.dims))
        return sup

    def uses_sparse_rows(self) -> bool:
        """Whether the series are computed on sparse rows (see :func:`series_method`)."""
        if "sparse" not in self._memo:
            self._memo["sparse"] = series_method(self) == "sparse"
        return self._memo["sparse"]

    def radical_series_on_support(self, method: str = "auto") -> list[dict[int, Mat]]:
        """``rad^k M`` for k = 0, 1, ..., ending at 0, as ``{vertex: echelon basis}``.

        Only the vertices where ``rad^k M`` is nonzero appear, so a module
        supported on a few vertices of a large quiver costs what its support
        costs.  The bases are the reduced echelon bases of :meth:`radical_series`.

        Notes
        -----
        With ``S`` a set of vectors spanning ``M`` modulo ``rad M`` (the minimal
        generators), ``rad^k M = S J^k`` (``J`` the radical of the algebra), the
        submodule generated by ``V_k = span(S * paths of length k)``; hence
        ``V_(k+1) = V_k * arrows`` and ``rad^k M = V_k + V_(k+1) + ...``.  Each
        ``V_k`` is about the size of the k-th layer, so the work is about
        ``dim M`` products of a vector by an arrow, where the direct recursion
        ``rad^(k+1) M = rad^k M * arrows`` makes ``sum_k dim rad^k M``.
        ``method``: ``"sparse"``, ``"dense"`` or ``"auto"`` (:func:`series_method`);
        an explicit method is computed afresh (for tests and benchmarks).
        """
        if method != "auto":
            if series_method(self, method) == "sparse":
                return self._rows_to_mats(self._radical_series_sparse())
            return self._radical_series_dense()
        if "radical_series_support" not in self._memo:
            if self.uses_sparse_rows():
                series = self._rows_to_mats(self.radical_series_rows())
            else:
                series = self._radical_series_dense()
            self._memo["radical_series_support"] = series
        return self._memo["radical_series_support"]

    def radical_series_rows(self) -> list[dict[int, list[dict[int, Any]]]]:
        """:meth:`radical_series_on_support` as sparse rows (see :mod:`hwcat.exact.sparse`).

        Sparse modules keep only this form (``k[x]/(x^N)`` would otherwise hold
        ``N^3 / 2`` dense entries); the matrices are made on demand.
        """
        if "radical_series_rows" not in self._memo:
            if self.uses_sparse_rows():
                rows = self._radical_series_sparse()
            else:
                rows = [
                    {v: sparse_rows(B) for v, B in layer.items()}
                    for layer in self.radical_series_on_support()
                ]
            self._memo["radical_series_rows"] = rows
        return self._memo["radical_series_rows"]

    def _rows_to_mats(self, rows: list[dict[int, list[dict[int, Any]]]]) -> list[dict[int, Mat]]:
        F = self.field
        return [{v: to_mat(F, r, self.dims[v]) for v, r in layer.items()} for layer in rows]

    def _radical_series_dense(self) -> list[dict[int, Mat]]:
        F = self.field
        maps = self.maps.items()
        full = {v: Mat.identity(F, self.dims[v]) for v in self.support}
        # V_0: unit vectors spanning a complement of rad M
        rad1 = self._dense_images(full, maps)
        cur = {}
        for v in self.support:
            C = complement(rad1[v], self.dims[v]) if v in rad1 else full[v]
            if C.nrows:
                cur[v] = C
        levels = []
        while cur:
            levels.append(cur)
            cur = self._dense_images(cur, maps)
        series: list[dict[int, Mat]] = [{}]
        for V in reversed(levels):
            below = series[-1]
            nxt = {}
            for v in sorted(set(V) | set(below)):
                parts = [m for m in (V.get(v), below.get(v)) if m is not None]
                nxt[v] = (
                    parts[0]
                    if len(parts) == 1 and v not in V
                    else echelon(Mat.vstack(F, parts, self.dims[v]))
                )
            series.append(nxt)
        series.reverse()
        series[0] = full
        return series

    def _dense_images(self, cur: dict[int, Mat], maps) -> dict[int, Mat]:
        """Echelon bases of ``sum_a cur * a`` per vertex (nonzero ones only)."""
        F = self.field
        arrows = self.algebra.arrows
        imgs: dict[int, list[Mat]] = {}
        for i, m in maps:
            a = arrows[i]
            B = cur.get(a.source)
            if B is not None:
                imgs.setdefault(a.target, []).append(B @ m)
        out = {}
        for t in sorted(imgs):
            E = echelon(Mat.vstack(F, imgs[t], self.dims[t]))
            if E.nrows:
                out[t] = E
        return out

    def sparse_maps(self) -> dict[int, list[dict[int, Any]]]:
        """The stored arrow matrices as sparse rows (cached)."""
        if "sparse_maps" not in self._memo:
            self._memo["sparse_maps"] = {i: sparse_rows(m) for i, m in self.maps.items()}
        return self._memo["sparse_maps"]

    def _sparse_images(self, cur: dict[int, list]) -> dict[int, list]:
        F = self.field
        arrows = self.algebra.arrows
        imgs: dict[int, list] = {}
        for i, S in self.sparse_maps().items():
            a = arrows[i]
            B = cur.get(a.source)
            if B:
                imgs.setdefault(a.target, []).extend(rows_times(B, S))
        out = {}
        for t in sorted(imgs):
            rows, _ = sparse_echelon(F, imgs[t])
            if rows:
                out[t] = rows
        return out

    def acts_by_single_entries(self) -> bool:
        """Whether every row of every arrow matrix has at most one nonzero entry.

        Then the arrows send unit vectors to multiples of unit vectors, every
        space of the radical series is spanned by unit vectors, and the series
        is a matter of sets of coordinates (:meth:`_radical_series_sets`).
        """
        if "single_entries" not in self._memo:
            self._memo["single_entries"] = all(
                len(r) <= 1 for rows in self.sparse_maps().values() for r in rows
            )
        return self._memo["single_entries"]

    def column_maps(self) -> dict[int, list[int]]:
        """For a module acting by single entries: arrow -> the column of each row (-1: zero row)."""
        if "column_maps" not in self._memo:
            self._memo["column_maps"] = {
                i: [next(iter(r)) if r else -1 for r in rows]
                for i, rows in self.sparse_maps().items()
            }
        return self._memo["column_maps"]

    def _set_images(self, cur: dict[int, set[int]]) -> dict[int, set[int]]:
        arrows = self.algebra.arrows
        out: dict[int, set[int]] = {}
        for i, cols in self.column_maps().items():
            B = cur.get(arrows[i].source)
            if B:
                img = {cols[j] for j in B}
                img.discard(-1)
                if img:
                    out.setdefault(arrows[i].target, set()).update(img)
        return out

    def series_levels(self) -> tuple[int, dict[int, dict[int, int]]]:
        """For a module acting by single entries: the Loewy length and each coordinate's level.

        The level of the unit vector ``e_c`` at ``v`` is the largest ``k`` with
        ``e_c`` in ``V_k`` (see :meth:`radical_series_on_support`), so
        ``rad^k M`` at ``v`` is spanned by the ``e_c`` of level at least ``k`` and
        the k-th radical layer by those of level ``k``: memory in proportion to
        ``dim M`` (a series of bases would hold ``sum_k dim rad^k M`` vectors).
        """
        if "series_levels" not in self._memo:
            full = {v: set(range(self.dims[v])) for v in self.support}
            rad1 = self._set_images(full)
            cur = {v: full[v] - rad1.get(v, set()) for v in self.support}
            cur = {v: c for v, c in cur.items() if c}
            level: dict[int, dict[int, int]] = {v: {} for v in self.support}
            k = 0
            while cur:
                for v, cs in cur.items():
                    lv = level[v]
                    for c in cs:
                        lv[c] = k
                cur = self._set_images(cur)
                k += 1
            self._memo["series_levels"] = (k, level)
        return self._memo["series_levels"]

    def _radical_series_sets(self) -> list[dict[int, list[dict[int, Any]]]]:
        one = self.field.one
        length, level = self.series_levels()
        out = []
        for k in range(length + 1):
            rows = {}
            for v in sorted(level):
                cs = sorted(c for c, j in level[v].items() if j >= k)
                if cs:
                    rows[v] = [{c: one} for c in cs]
            out.append(rows)
        return out

    def _radical_series_sparse(self) -> list[dict[int, list[dict[int, Any]]]]:
        if self.acts_by_single_entries():
            return self._radical_series_sets()
        one = self.field.one
        full = {v: [{j: one} for j in range(self.dims[v])] for v in self.support}
        rad1 = self._sparse_images(full)
        cur = {}
        for v in self.support:
            piv = {min(r) for r in rad1.get(v, ())}
            C = [{j: one} for j in range(self.dims[v]) if j not in piv]
            if C:
                cur[v] = C
        levels = []
        while cur:
            levels.append(cur)
            cur = self._sparse_images(cur)
        series: list[dict[int, list]] = [{}]
        pivots: dict[int, tuple[int, ...]] = {}  # pivots of series[-1] by vertex
        for V in reversed(levels):
            below = series[-1]
            nxt = dict(below)
            for v, rows in V.items():
                nxt[v], pivots[v] = sparse_echelon(
                    self.field, rows, below.get(v, ()), pivots.get(v, ())
                )
            series.append(dict(sorted(nxt.items())))
        series.reverse()
        series[0] = full
        return series

    def radical_series(self) -> list[list[Mat]]:
        """``rad^k M`` for k = 0, 1, ... (echelon bases in ``M``'s coordinates), ending at 0."""
        if "radical_series" in self._memo:
            return self._memo["radical_series"]
        F = self.field
        series = [
            [layer.get(v) or Mat.zeros(F, 0, d) for v, d in enumerate(self.dims)]
            for layer in self.radical_series_on_support()
        ]
        self._memo["radical_series"] = series
        return series

    def radical_layers(self) -> list[tuple[int, ...]]:
        """Dimension vectors of ``rad^k M / rad^(k+1) M``, k = 0, 1, ..."""
        if "radical_layers" in self._memo:
            return list(self._memo["radical_layers"])
        n = len(self.dims)
        if self.uses_sparse_rows() and self.acts_by_single_entries():
            length, level = self.series_levels()
            counts = [[0] * n for _ in range(length)]
            for v, lv in level.items():
                for k in lv.values():
                    counts[k][v] += 1
            out = [tuple(c) for c in counts]
            self._memo["radical_layers"] = tuple(out)
            return out
        if self.uses_sparse_rows():
            ser = [{v: len(r) for v, r in layer.items()} for layer in self.radical_series_rows()]
        else:
            ser = [
                {v: B.nrows for v, B in layer.items()} for layer in self.radical_series_on_support()
            ]
        out = []
        for k in range(len(ser) - 1):
            vec = [0] * n
            below = ser[k + 1]
            for v, d in ser[k].items():
                vec[v] = d - below.get(v, 0)
            out.append(tuple(vec))
        self._memo["radical_layers"] = tuple(out)
        return out

    def socle_layers(self) -> list[tuple[int, ...]]:
        """Dimension vectors of ``soc^(k+1) M / soc^k M``, k = 0, 1, ... (bottom first).

        These are the radical layers of the dual module ``D M`` (over the opposite algebra).
        """
        if "socle_layers" not in self._memo:
            self._memo["socle_layers"] = tuple(self.dual().radical_layers())
        return list(self._memo["socle_layers"])

    def loewy_length(self) -> int:
        return len(self.radical_layers())

    # -- duality and sums -------------------------------------------------------------------
    def dual(self) -> Module:
        """``D M = Hom_k(M, k)``, a module over the opposite algebra."""
        op = self.algebra.opposite()
        D = Module(
            op,
            self.dims,
            {i: m.transpose() for i, m in self.maps.items()},
            f"D({self.name})" if self.name else "",
        )
        known = self._memo.get("sparse_maps")
        if known is not None:
            arrows = self.algebra.arrows
            D._memo["sparse_maps"] = {
                i: sparse_transpose(rows, self.dims[arrows[i].target]) for i, rows in known.items()
            }
        return D

    # -- presentation data ----------------------------------------------------------------------
    def generators(self) -> list[tuple[int, Mat]]:
        """A minimal set of generators: unit vectors spanning a complement of ``rad M``."""
        if "generators" in self._memo:
            return self._memo["generators"]
        gens = []
        rad = self._radical_on_support()
        for v in self.support:  # no generators where M is zero
            R = rad.get(v)
            d = self.dims[v]
            C = complement(R, d) if R is not None else Mat.identity(self.field, d)
            gens.extend((v, row) for row in C.split_rows())
        self._memo["generators"] = gens
        return gens

    def word_basis(self) -> tuple[list[list[tuple[int, Path]]], list[Mat]]:
        """A basis of elements ``g * w`` (generator, path), prefix closed; cached."""
        if "word_basis" not in self._memo:
            self._memo["word_basis"] = generated_word_basis(
                self.field, self.dims, self.maps, self.algebra.arrows, self.generators()
            )
        return self._memo["word_basis"]

    def key(self) -> tuple:
        """Exact fingerprint of the data (for equality of modules given in the same basis)."""
        return (self.dims, tuple(m.key() for m in self.maps))


# -- homomorphisms given as matrices ----------------------------------------------------------


def _check_map(M: Module, N: Module, f: Sequence[Mat]) -> None:
    if M.algebra is not N.algebra:
        raise InternalInconsistency("a map between modules over different algebras")
    if len(f) != len(M.dims) or any(
        f[v].shape != (M.dims[v], N.dims[v]) for v in range(len(M.dims))
    ):
        raise InternalInconsistency(
            f"a map {M.dims} -> {N.dims} needs one matrix dim M_v x dim N_v per vertex"
        )


def is_homomorphism(M: Module, N: Module, f: Sequence[Mat]) -> bool:
    """Whether the matrices ``f[v] : M_v -> N_v`` commute with every arrow.

    The condition is ``M_a @ f[t] == f[s] @ N_a`` for each arrow ``a: s -> t``
    (row vectors: a vector ``x`` of ``M_s`` goes to ``x @ f[s]``).

    >>> from hwcat.io.spec import load_spec_text
    >>> from hwcat.exact import Mat
    >>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["1", "2"]\\narrows = ["a: 1 -> 2"]')
    >>> P, S = projective(A, 0), simple(A, 0)
    >>> top = [Mat.identity(A.field, 1), Mat.zeros(A.field, 1, 0)]
    >>> is_homomorphism(P, S, top), is_homomorphism(S, P, [Mat.identity(A.field, 1), Mat.zeros(A.field, 0, 1)])
    (True, False)
    """
    _check_map(M, N, f)
    for i, a in enumerate(M.algebra.arrows):
        if M.maps[i] @ f[a.target] != f[a.source] @ N.maps[i]:
            return False
    return True


def kernel_spaces(M: Module, N: Module, f: Sequence[Mat]) -> list[Mat]:
    """Echelon bases, per vertex, of the kernel of ``f : M -> N``.

    For a homomorphism the result is a submodule: pass it to
    :meth:`Module.submodule`.  The rows are vectors of ``M_v``, so the matrix
    at ``v`` is also the inclusion of the kernel into ``M`` at ``v``.

    >>> from hwcat.io.spec import load_spec_text
    >>> from hwcat.exact import Mat
    >>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["1", "2"]\\narrows = ["a: 1 -> 2"]')
    >>> P, S = projective(A, 0), simple(A, 0)
    >>> K = kernel_spaces(P, S, [Mat.identity(A.field, 1), Mat.zeros(A.field, 1, 0)])
    >>> P.submodule(K).dims
    (0, 1)
    """
    _check_map(M, N, f)
    return [echelon(m.left_kernel()) for m in f]


def image_spaces(M: Module, N: Module, f: Sequence[Mat]) -> list[Mat]:
    """Echelon bases, per vertex, of the image of ``f : M -> N`` (vectors of ``N_v``)."""
    _check_map(M, N, f)
    return [echelon(m) for m in f]


def projective(A: BasicAlgebra, s: str | int) -> Module:
    """The indecomposable projective ``P(s) = e_s A``."""
    s = A.vertex_index(s)

    def build() -> Module:
        dims, maps = A.projective_rep(s)
        P = Module(A, dims, maps, f"P({A.vertices[s]})")
        if P.dim >= SPARSE_MIN_DIM:
            # the hub keeps its action as sparse rows: share them (read once per algebra)
            P._memo["sparse_maps"] = {i: A.sparse_action(s, i) for i in P.maps.support}
        return P

    return A.cached(("module:projective", s), build)


def injective(A: BasicAlgebra, s: str | int) -> Module:
    """The indecomposable injective ``I(s) = D(A e_s)``."""
    s = A.vertex_index(s)

    def build() -> Module:
        dims, maps = A.injective_rep(s)
        I = Module(A, dims, maps, f"I({A.vertices[s]})")
        if I.dim >= SPARSE_MIN_DIM:
            op = A.opposite()
            I._memo["sparse_maps"] = {
                i: sparse_transpose(op.sparse_action(s, i), dims[A.arrows[i].source])
                for i in I.maps.support
            }
        return I

    return A.cached(("module:injective", s), build)


def simple(A: BasicAlgebra, s: str | int) -> Module:
    """The simple module ``L(s)``."""
    s = A.vertex_index(s)
    dims = [1 if v == s else 0 for v in range(A.n)]
    maps = [Mat.zeros(A.field, dims[a.source], dims[a.target]) for a in A.arrows]
    return Module(A, dims, maps, f"L({A.vertices[s]})")


def direct_sum(*modules: Module) -> Module:
    """The direct sum (bases concatenated vertex by vertex)."""
    if not modules:
        raise InternalInconsistency("direct sum of no modules")
    A = modules[0].algebra
    F = A.field
    dims = [sum(M.dims[v] for M in modules) for v in range(A.n)]
    maps = [Mat.block_diag(F, [M.maps[i] for M in modules]) for i in range(len(A.arrows))]
    return Module(A, dims, maps)


def regular_module(A: BasicAlgebra) -> Module:
    """``A_A``, the direct sum of the ``P(s)``."""
    return direct_sum(*(projective(A, s) for s in range(A.n)))
