"""The hub: a split basic algebra with a vertex-graded basis of paths.

Every input (a quiver with relations, structure constants, matrices, a built-in
family) is converted into a :class:`BasicAlgebra`, and every analysis works on
it.  The data are

* the Gabriel quiver (vertices = primitive idempotents, one per simple;
  arrows = a basis of the radical modulo its square);
* for each pair of vertices ``(s, t)`` a basis of ``e_s A e_t`` made of paths
  from ``s`` to ``t`` (tuples of arrow indices, read left to right), closed
  under taking prefixes; the trivial path ``()`` is the first basis element of
  ``e_s A e_s``;
* for each vertex ``s`` and arrow ``a`` the matrix of right multiplication by
  ``a`` on ``e_s A``, from ``e_s A e_source(a)`` to ``e_s A e_target(a)``;
  only the nonzero ones are stored (:meth:`BasicAlgebra.action_matrix` gives
  any of them, :meth:`BasicAlgebra.action_support` the arrows stored at ``s``).

So ``e_s A`` is the indecomposable projective right module ``P(s)`` as a
representation of the quiver, and the product of two basis elements
``x * w`` (``w`` a basis path) is ``x`` acted on by the arrows of ``w`` in turn.
Everything is stored block by block: no dense ``dim A x dim A`` matrix.

Analyses keep per-algebra results (projective modules, traces, standard
modules, ...) through :meth:`BasicAlgebra.cached`, never through private
attributes.
"""

from __future__ import annotations

import copy
from collections.abc import Callable, Iterable, Sequence
from itertools import compress
from typing import Any

from hwcat.algebras.hub.quiver import Arrow, Path, Quiver, format_path
from hwcat.algebras.hub.rep import ArrowMaps, closure, cyclic_word_basis, quotient
from hwcat.errors import InternalInconsistency, VertexError
from hwcat.exact import Field, Mat
from hwcat.exact.sparse import row_times, sparse_rows, to_mat

__all__ = ["BasicAlgebra"]


class _ActionRow(Sequence):
    """``action[s]``: one matrix per arrow, the zero ones made on demand (not stored)."""

    __slots__ = ("_A", "_s")

    def __init__(self, A: BasicAlgebra, s: int) -> None:
        self._A, self._s = A, s

    def __len__(self) -> int:
        return len(self._A.quiver.arrows)

    def __getitem__(self, i):  # type: ignore[override]
        if isinstance(i, slice):
            return tuple(self[k] for k in range(*i.indices(len(self))))
        return self._A.action_matrix(self._s, i)


def combination_text(terms: Iterable[tuple[Any, str]]) -> str:
    """``[(2, "a"), (-1, "b*c")]`` -> ``"2*a - b*c"`` (nonzero coefficients; ``"0"`` if none)."""
    parts = []
    for c, p in terms:
        cs = str(c)
        if cs == "1":
            parts.append(f"+ {p}")
        elif cs == "-1":
            parts.append(f"- {p}")
        elif cs.startswith("-"):
            parts.append(f"- {cs[1:]}*{p}")
        else:
            parts.append(f"+ {cs}*{p}")
    if not parts:
        return "0"
    text = " ".join(parts)
    return text[2:] if text.startswith("+ ") else "-" + text[2:]


class BasicAlgebra:
    """A split basic algebra given by its quiver and right regular representation.

    Build one with :func:`hwcat.algebras.inputs.bound.bound_quiver_algebra` (or the
    spec loader); the constructor takes the raw data and checks it.

    Parameters
    ----------
    field : Field
    quiver : Quiver
        The Gabriel quiver.
    words : sequence
        ``words[s][t]`` is the tuple of basis paths of ``e_s A e_t``.
    action : sequence
        ``action[s][a]`` is right multiplication by arrow ``a`` on ``e_s A``.
    name : str
    morita : sequence of int, optional
        For an algebra that came from a non-basic algebra ``A``: the
        multiplicity of ``P(i)`` in ``A`` (the dimension of the simple
        ``L(i)``).  All ones for a basic input.
    """

    def __init__(
        self,
        field: Field,
        quiver: Quiver,
        words: Sequence[Sequence[Sequence[Path]]],
        action: Sequence[Sequence[Mat]],
        *,
        name: str = "",
        morita: Sequence[int] | None = None,
        relations: Sequence[str] | None = None,
    ) -> None:
        n = len(quiver.vertices)
        self.field = field
        self.quiver = quiver
        self.words: tuple[tuple[tuple[Path, ...], ...], ...] = tuple(
            tuple(map(tuple, words[s])) for s in range(n)
        )
        if any(len(row) != n for row in self.words):
            raise InternalInconsistency("words/action do not match the vertices")
        self._cache: dict[Any, Any] = {}
        self._check_action(action)
        self._action: tuple[dict[int, Mat], ...] = tuple(
            {
                i: m
                for i, m in (row.items() if isinstance(row, ArrowMaps) else enumerate(row))
                if m.nrows and m.ncols and not m.is_zero()
            }
            for row in action
        )
        self.name = name
        self.morita = tuple(morita) if morita is not None else (1,) * n
        self.relations = tuple(relations) if relations is not None else None
        self.natural_order: str | None = None  # a family's natural highest-weight order, as text
        self._check()

    # -- caching ----------------------------------------------------------------
    def cached(self, key: Any, compute: Callable[[], Any]) -> Any:
        """The value stored under ``key``, computing and storing ``compute()`` the first time.

        The per-algebra memory of every analysis (projectives, traces, standard
        modules, ...).  Keys are tuples whose first entry names the kind of
        value, e.g. ``("module:projective", s)``.

        >>> from hwcat.io.spec import load_spec_text
        >>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["1"]')
        >>> A.cached(("answer",), lambda: 42), A.cached(("answer",), lambda: 0)
        (42, 42)
        """
        try:
            return self._cache[key]
        except KeyError:
            value = self._cache[key] = compute()
            return value

    def is_cached(self, key: Any) -> bool:
        """Whether a value is stored under ``key``."""
        return key in self._cache

    # -- basic data ------------------------------------------------------------
    @property
    def action(self) -> tuple[Sequence[Mat], ...]:
        """``action[s][a]``: right multiplication by arrow ``a`` on ``e_s A`` (zeros made on demand)."""
        return tuple(_ActionRow(self, s) for s in range(self.n))

    def action_matrix(self, s: int, a: int) -> Mat:
        """Right multiplication by arrow ``a`` on ``e_s A``, ``e_s A e_source(a) -> e_s A e_target(a)``."""
        m = self._action[s].get(a)
        if m is not None:
            return m
        arrow = self.quiver.arrows[a]
        return Mat.zeros(
            self.field, self.block_dim(s, arrow.source), self.block_dim(s, arrow.target)
        )

    def action_support(self, s: int) -> tuple[int, ...]:
        """The arrows whose action on ``e_s A`` is nonzero (the only ones stored)."""
        return tuple(sorted(self._action[s]))

    @property
    def vertices(self) -> tuple[str, ...]:
        return self.quiver.vertices

    def with_vertex_names(
        self, names: Sequence[str], *, natural_order: str | None = None
    ) -> BasicAlgebra:
        """The same algebra with its vertices (simples) renamed; arrows and bases unchanged.

        Families use it to give the simples the labels of the trade.
        """
        names = [str(v) for v in names]
        if len(names) != self.n:
            raise InternalInconsistency(f"{len(names)} names for {self.n} vertices")
        Q = Quiver.from_text(names, [])
        new = copy.copy(self)
        new.quiver = Quiver(Q.vertices, self.quiver.arrows)
        new._cache = {}
        new.natural_order = natural_order
        return new

    def vertex_index(self, v: str | int) -> int:
        """The index of a vertex given by its name (a ``str``) or its 0-based index (an ``int``).

        Every public function that takes a vertex accepts either form.

        >>> from hwcat.algebras.hub.quiver import Quiver
        >>> from hwcat.algebras.inputs.bound import bound_quiver_algebra
        >>> from hwcat.exact import QQ
        >>> A = bound_quiver_algebra(QQ, Quiver.from_text(["top", "base"], ["a: top -> base"]), [])
        >>> A.vertex_index("base"), A.vertex_index(0)
        (1, 0)
        """
        if isinstance(v, str):
            try:
                return self.quiver.vertices.index(v)
            except ValueError:
                raise VertexError(
                    f"{v!r} is not a vertex (vertices: {', '.join(self.vertices)})"
                ) from None
        if isinstance(v, bool) or not isinstance(v, int) or not 0 <= v < self.n:
            raise VertexError(
                f"{v!r} is not a vertex name or an index 0..{self.n - 1} "
                f"(vertices: {', '.join(self.vertices)})"
            )
        return v

    @property
    def arrows(self) -> tuple[Arrow, ...]:
        return self.quiver.arrows

    @property
    def n(self) -> int:
        """Number of vertices (simple modules)."""
        return len(self.quiver.vertices)

    def block_dim(self, s: int, t: int) -> int:
        """``dim e_s A e_t``."""
        return len(self.words[s][t])

    def projective_dims(self, s: int) -> tuple[int, ...]:
        key = ("projective_dims", s)
        dims = self._cache.get(key)
        if dims is None:
            dims = self._cache[key] = tuple(map(len, self.words[s]))
        return dims

    @property
    def dim(self) -> int:
        d = self._cache.get("dim")
        if d is None:
            d = self._cache["dim"] = sum(sum(map(len, row)) for row in self.words)
        return d

    def cartan(self) -> tuple[tuple[int, ...], ...]:
        """The Cartan matrix ``C[i][j] = [P(j) : L(i)] = dim e_j A e_i`` (rows as tuples)."""
        return tuple(zip(*(self.projective_dims(j) for j in range(self.n)), strict=True))

    def word_index(self, s: int, t: int) -> dict[Path, int]:
        key = ("word_index", s, t)
        if key not in self._cache:
            self._cache[key] = {w: i for i, w in enumerate(self.words[s][t])}
        return self._cache[key]

    def projective_rep(self, s: int) -> tuple[tuple[int, ...], tuple[Mat, ...]]:
        """``P(s) = e_s A`` as ``(dims, maps)``."""
        dims = self.projective_dims(s)
        return dims, ArrowMaps(self.field, dims, self.arrows, dict(self._action[s]))

    def injective_rep(self, s: int) -> tuple[tuple[int, ...], tuple[Mat, ...]]:
        """``I(s) = D(A e_s)`` as ``(dims, maps)`` (dual of the opposite's projective)."""
        op = self.opposite()
        dims, maps = op.projective_rep(s)
        return dims, ArrowMaps(
            self.field, dims, self.arrows, {i: m.transpose() for i, m in maps.items()}
        )

    def path_text(self, path: Path, vertex: int | None = None) -> str:
        return format_path(self.quiver, path, vertex)

    def element_text(self, s: int, t: int, vec: Mat | Sequence[Any]) -> str:
        """A vector of ``e_s A e_t`` as a combination of basis paths."""
        entries = vec.entries() if isinstance(vec, Mat) else list(vec)
        return combination_text(
            (c, self.path_text(w, s))
            for c, w in zip(entries, self.words[s][t], strict=True)
            if c != 0
        )

    # -- consistency -------------------------------------------------------------
    def _check_action(self, action: Sequence[Sequence[Mat]]) -> None:
        if len(action) != self.n:
            raise InternalInconsistency("words/action do not match the vertices")
        for s, row in enumerate(action):
            if len(row) != len(self.arrows):
                raise InternalInconsistency("one action matrix per arrow is needed")
            if isinstance(row, ArrowMaps) and row.dims == self.projective_dims(s):
                continue  # shapes checked when it was made
            for i, a in enumerate(self.arrows):
                m = row[i]
                if m.shape != (self.block_dim(s, a.source), self.block_dim(s, a.target)):
                    raise InternalInconsistency(f"action of arrow {a.name} has shape {m.shape}")

    def _check(self) -> None:
        n = self.n
        if len(self.words) != n:
            raise InternalInconsistency("words/action do not match the vertices")
        for s in range(n):
            if not self.words[s][s] or self.words[s][s][0] != ():
                raise InternalInconsistency(f"e_{s} A e_{s} must start with the trivial path")
        for i, a in enumerate(self.arrows):
            if (i,) not in self.word_index(a.source, a.target):
                raise InternalInconsistency(f"arrow {a.name} is not a basis element")

    # -- structure -----------------------------------------------------------------
    def opposite(self) -> BasicAlgebra:
        """The opposite algebra (same vertices, arrows reversed, cached both ways).

        When the basis paths are closed under taking suffixes as well as
        prefixes (the normal paths of a bound quiver algebra are: every subpath
        of a normal path is normal), the reversed paths are a prefix-closed basis
        of the opposite and the left multiplications by the arrows are its
        action, with no change of basis.  Otherwise a basis of the opposite is
        chosen by :meth:`from_cyclic_representations`.
        """
        if "opposite" in self._cache:
            return self._cache["opposite"]
        F, n = self.field, self.n
        left = self.left_actions()
        opq = Quiver(self.vertices, tuple(Arrow(a.name, a.target, a.source) for a in self.arrows))
        name = f"{self.name} (opposite)" if self.name else "opposite"
        into = self.column_supports()
        by_end: list[dict[int, Mat]] = [{} for _ in range(n)]  # by_end[u][a]: left[a][u]
        for i, blocks in enumerate(left):
            for u, m in blocks.items():
                by_end[u][i] = m
        if self.is_suffix_closed():
            # blocks of the opposite: e_u A^op e_v has the reversed paths of e_v A e_u,
            # ordered by length, then as words (the order a breadth-first choice
            # of words would give them)
            words = []
            perm: dict[tuple[int, int], list[int]] = {}  # (v, u): old index -> new index
            for u in range(n):
                row: list[Any] = [()] * n
                for v in into[u]:
                    rev = [w[::-1] for w in self.words[v][u]]
                    order = sorted(range(len(rev)), key=lambda k, rev=rev: (len(rev[k]), rev[k]))
                    row[v] = tuple(rev[k] for k in order)
                    new = [0] * len(order)
                    for pos, k in enumerate(order):
                        new[k] = pos
                    perm[(v, u)] = new
                words.append(row)
            action = []
            shared: dict[tuple[int, int], list[dict[int, Any]]] = {}
            for u in range(n):
                dims = tuple(map(len, words[u]))
                maps = {}
                for i in by_end[u]:
                    a = self.arrows[i]  # a: s -> t, left multiplication e_t A e_u -> e_s A e_u
                    rows_in = self.left_action_rows(i, u)
                    prow, pcol = perm[(a.target, u)], perm[(a.source, u)]
                    rows: list[dict[int, Any]] = [{}] * len(rows_in)
                    for k, r in enumerate(rows_in):
                        rows[prow[k]] = {pcol[c]: x for c, x in r.items()}
                    shared[(u, i)] = rows
                    maps[i] = to_mat(F, rows, dims[a.source])
                action.append(ArrowMaps(F, dims, opq.arrows, maps))
            op = BasicAlgebra(F, opq, words, action, name=name, morita=self.morita)
            # the opposite's action is the left multiplication: share its sparse rows
            for (u, i), rows in shared.items():
                op._cache[("sparse_action", u, i)] = rows
        else:
            reps = []
            for u in range(n):
                dims = tuple(self.block_dim(t, u) for t in range(n))
                maps = ArrowMaps(F, dims, opq.arrows, by_end[u])
                reps.append((dims, maps))
            op = BasicAlgebra.from_cyclic_representations(
                F, opq, reps, name=name, morita=self.morita
            )
        op._cache["opposite"] = self
        self._cache["opposite"] = op
        return op

    def is_suffix_closed(self) -> bool:
        """Whether every basis path ``a*w`` of ``e_s A e_t`` has ``w`` in the basis of ``e_target(a) A e_t``."""
        arrows = self.arrows
        for s in range(self.n):
            for t in self.row_support(s):
                for w in self.words[s][t]:
                    if len(w) > 1 and w[1:] not in self.word_index(arrows[w[0]].target, t):
                        return False
        return True

    def row_support(self, s: int) -> tuple[int, ...]:
        """The vertices ``t`` with ``e_s A e_t`` nonzero (the support of ``P(s)``), cached."""
        key = ("row_support", s)
        sup = self._cache.get(key)
        if sup is None:
            sup = self._cache[key] = tuple(compress(range(self.n), self.words[s]))
        return sup

    def column_supports(self) -> tuple[tuple[int, ...], ...]:
        """For each vertex ``t`` the vertices ``s`` with ``e_s A e_t`` nonzero, cached."""

        def compute() -> tuple[tuple[int, ...], ...]:
            cols: list[list[int]] = [[] for _ in range(self.n)]
            for s in range(self.n):
                for t in self.row_support(s):
                    cols[t].append(s)
            return tuple(map(tuple, cols))

        return self.cached(("column_supports",), compute)

    def sparse_action(self, s: int, a: int) -> list[dict[int, Any]]:
        """:meth:`action_matrix` as sparse rows ``{column: entry}`` (cached; see :mod:`hwcat.exact.sparse`)."""
        key = ("sparse_action", s, a)
        rows = self._cache.get(key)
        if rows is None:
            m = self._action[s].get(a)
            if m is None:
                rows = [{} for _ in range(self.block_dim(s, self.arrows[a].source))]
            else:
                rows = sparse_rows(m)
            self._cache[key] = rows
        return rows

    def left_actions(self) -> tuple[dict[int, Mat], ...]:
        """Left multiplication by each arrow, block by block (cached).

        ``left_actions()[a][u]`` is ``w -> a*w`` from ``e_target(a) A e_u`` to
        ``e_source(a) A e_u`` (rows: the basis paths ``w``); only the nonzero
        blocks are kept.  ``a * (w' b) = (a * w') b`` is computed on sparse rows,
        shortest paths first, so the cost follows the nonzero entries.
        """

        def compute() -> tuple[dict[int, Mat], ...]:
            F = self.field
            out = []
            for i, a in enumerate(self.arrows):
                s, t = a.source, a.target
                unit = {self.word_index(s, t)[(i,)]: F.one}
                paths = sorted((w for u in self.row_support(t) for w in self.words[t][u]), key=len)
                memo: dict[Path, dict[int, Any]] = {(): unit}
                for w in paths:
                    if w:
                        memo[w] = row_times(memo[w[:-1]], self.sparse_action(s, w[-1]))
                blocks = {}
                for u in self.row_support(t):
                    rows = [memo[w] for w in self.words[t][u]]
                    if any(rows) and self.block_dim(s, u):
                        blocks[u] = to_mat(F, rows, self.block_dim(s, u))
                        self._cache[("left_action_rows", i, u)] = rows
                out.append(blocks)
            return tuple(out)

        return self.cached(("left_actions",), compute)

    def left_action_rows(self, a: int, u: int) -> list[dict[int, Any]]:
        """``left_actions()[a][u]`` as sparse rows (empty rows when the block is zero)."""
        self.left_actions()
        rows = self._cache.get(("left_action_rows", a, u))
        if rows is None:
            rows = [{} for _ in range(self.block_dim(self.arrows[a].target, u))]
        return rows

    def extend_path(self, u: int, memo: dict[Path, Mat], w: Path) -> Mat:
        """``x * w`` for the rows ``x = memo[()]`` of ``e_u A``, along the arrows of ``w``.

        ``memo`` maps paths to products already known (prefixes are reused).
        """
        # iterative (no recursion as deep as the path): the longest known prefix, then on
        k = len(w)
        while w[:k] not in memo:
            k -= 1
        v = memo[w[:k]]
        for j in range(k, len(w)):
            v = v @ self.action_matrix(u, w[j])
            memo[w[: j + 1]] = v
        return v

    @classmethod
    def from_cyclic_representations(
        cls,
        field: Field,
        quiver: Quiver,
        reps: Sequence[tuple[Sequence[int], Sequence[Mat]]],
        *,
        starts: Sequence[Mat] | None = None,
        name: str = "",
        morita: Sequence[int] | None = None,
    ) -> BasicAlgebra:
        """Build the hub from the indecomposable projectives given as representations.

        ``reps[s]`` is ``e_s A`` as a representation of ``quiver``; ``starts[s]``
        the row vector of the idempotent ``e_s`` in it (default: the first basis
        vector at ``s``).  A prefix-closed basis of paths is chosen by
        :func:`~hwcat.algebras.hub.rep.cyclic_word_basis` and the action rewritten in it.
        """
        words, action = [], []
        for s, (dims, maps) in enumerate(reps):
            start = starts[s] if starts is not None else Mat.unit_rows(field, dims[s], [0])
            ws, rows = cyclic_word_basis(field, dims, maps, quiver.arrows, s, start)
            maps = ArrowMaps(field, dims, quiver.arrows, maps)
            inv: dict[int, Mat] = {}

            def inverse(t: int, rows=rows, inv=inv) -> Mat:
                if t not in inv:
                    inv[t] = rows[t].inverse()
                return inv[t]

            act = {
                i: rows[quiver.arrows[i].source] @ m @ inverse(quiver.arrows[i].target)
                for i, m in maps.items()
            }
            words.append(ws)
            action.append(ArrowMaps(field, dims, quiver.arrows, act))
        return cls(field, quiver, words, action, name=name, morita=morita)

    def quotient_by_vertices(self, S: Iterable[int]) -> BasicAlgebra:
        """``A / A e A`` for ``e`` the sum of the idempotents of the vertices ``S``.

        The result has the remaining vertices (in the same order) and the arrows
        between them.
        """
        S = frozenset(S)
        keep = [v for v in range(self.n) if v not in S]
        newidx = {v: k for k, v in enumerate(keep)}
        F = self.field
        kept_arrows = [
            i for i, a in enumerate(self.arrows) if a.source in newidx and a.target in newidx
        ]
        quiver = self._sub_quiver(newidx, kept_arrows)
        reps, starts = [], []
        for s in keep:
            dims, maps = self.projective_rep(s)
            gens = {u: Mat.identity(F, dims[u]) for u in S if dims[u]}
            sub = closure(F, dims, maps, self.arrows, gens)
            qd, qm, pis = quotient(F, dims, maps, self.arrows, sub)
            reps.append((tuple(qd[v] for v in keep), tuple(qm[i] for i in kept_arrows)))
            starts.append(pis[s].take_rows([0]))
        return BasicAlgebra.from_cyclic_representations(
            F,
            quiver,
            reps,
            starts=starts,
            name=self.name,
            morita=tuple(self.morita[v] for v in keep),
        )

    def components(self) -> list[list[int]]:
        """The blocks: vertex sets of the connected components of the quiver."""
        parent = list(range(self.n))

        def root(v: int) -> int:
            while parent[v] != v:
                parent[v] = parent[parent[v]]
                v = parent[v]
            return v

        for a in self.arrows:
            parent[root(a.source)] = root(a.target)
        comps: dict[int, list[int]] = {}
        for v in range(self.n):
            comps.setdefault(root(v), []).append(v)
        return sorted(comps.values())

    def _sub_quiver(self, newidx: dict[int, int], arrows: Sequence[int]) -> Quiver:
        """The quiver on the vertices ``newidx`` (old index -> new, in the new order) with
        the ``arrows`` (old indices, each between kept vertices)."""
        old = self.arrows
        return Quiver(
            tuple(self.vertices[v] for v in newidx),
            tuple(Arrow(old[i].name, newidx[old[i].source], newidx[old[i].target]) for i in arrows),
        )

    def full_subalgebra(self, vertices: Sequence[int]) -> BasicAlgebra:
        """``e A e`` for a union of blocks (no path leaves ``vertices``)."""
        keep = list(vertices)
        newidx = {v: k for k, v in enumerate(keep)}
        arrows = [i for i, a in enumerate(self.arrows) if a.source in newidx]
        if any(self.arrows[i].target not in newidx for i in arrows):
            raise InternalInconsistency("full_subalgebra needs a union of blocks")
        remap = {i: k for k, i in enumerate(arrows)}
        quiver = self._sub_quiver(newidx, arrows)
        words = [
            [tuple(tuple(remap[x] for x in w) for w in self.words[s][t]) for t in keep]
            for s in keep
        ]
        action = [[self.action_matrix(s, i) for i in arrows] for s in keep]
        return BasicAlgebra(
            self.field,
            quiver,
            words,
            action,
            name=self.name,
            morita=[self.morita[v] for v in keep],
        )

    def multiplication_block(self, s: int, u: int, t: int) -> Mat:
        """Products ``x * y`` for ``x`` in ``e_s A e_u``, ``y`` in ``e_u A e_t``.

        Row ``j * dim(e_s A e_u) + i`` holds the coordinates of ``x_i * y_j`` in
        ``e_s A e_t`` (``x_i``, ``y_j`` the basis paths).
        """
        F = self.field
        du, dt = self.block_dim(s, u), self.block_dim(s, t)
        memo: dict[Path, Mat] = {(): Mat.identity(F, du)}
        blocks = [self.extend_path(s, memo, y) for y in self.words[u][t]]
        return Mat.vstack(F, blocks, dt)

    def to_dict(self) -> dict[str, Any]:
        return {
            "name": self.name,
            "field": self.field.name,
            "vertices": list(self.vertices),
            "arrows": [
                {
                    "name": a.name,
                    "source": self.vertices[a.source],
                    "target": self.vertices[a.target],
                }
                for a in self.arrows
            ],
            "dimension": self.dim,
            "cartan": [list(r) for r in self.cartan()],
        }

    def __repr__(self) -> str:
        return (
            f"BasicAlgebra({self.name!r}, field={self.field}, vertices={self.n}, "
            f"arrows={len(self.arrows)}, dimension={self.dim})"
        )
