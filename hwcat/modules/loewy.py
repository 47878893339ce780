"""Loewy diagrams: how the composition factors of a module are glued, layer by layer.

The radical layers of a module ``M`` are ``M_k = rad^k M / rad^(k+1) M``; each
splits by vertex, ``M_k = (+)_s M_k e_s``, and an arrow ``a: s -> t`` induces a
linear map ``M_k e_s -> M_(k+1) e_t`` (``x + rad^(k+1) M`` goes to
``x a + rad^(k+2) M``).  The Loewy diagram has one node per composition factor
in each layer (``dim M_k e_s`` nodes labelled ``s`` in layer ``k``) and an edge
from a node in layer ``k`` to a node in layer ``k + 1`` when some arrow maps
the first node's basis vector to an element whose coordinate at the second
node is nonzero.

When every layer is multiplicity free (each simple at most once per layer) the
basis vectors are determined up to scalars and the diagram does not depend on
any choice.  Otherwise a basis has to be chosen, and the diagram is one of
several valid drawings; the choice made here (see :func:`loewy_diagram`) keeps
it sparse: each basis vector below the top is the image of one node of the
layer above under one arrow, so that image contributes exactly one edge.

Examples
--------
A chain: ``k[x]/(x^3)`` as a module over itself.

>>> from hwcat.io.spec import load_spec_text
>>> from hwcat.modules import projective
>>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["1"]\\n'
...                    'arrows = ["x: 1 -> 1"]\\nvanish_from_length = 3')
>>> d = loewy_diagram(projective(A, 0))
>>> [(n.layer, n.simple) for n in d.nodes], d.edges
([(0, '1'), (1, '1'), (2, '1')], ((0, 1), (1, 2)))
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from hwcat.errors import InternalInconsistency
from hwcat.exact import Mat, complement, select_independent_rows
from hwcat.exact.sparse import axpy, row_times
from hwcat.modules.module import Module, injective, projective

__all__ = [
    "LoewyNode",
    "LoewyDiagram",
    "loewy_diagram",
    "is_indecomposable_projective_injective",
]


@dataclass(frozen=True)
class LoewyNode:
    """One composition factor in one radical layer: ``layer`` (0 = top) and its vertex."""

    layer: int
    vertex: int
    simple: str

    def to_dict(self) -> dict[str, Any]:
        return {"layer": self.layer, "simple": self.simple}


@dataclass(frozen=True)
class LoewyDiagram:
    """The Loewy diagram of a module (see the module notes for the definition).

    ``nodes`` are sorted by layer, then by vertex (spec order); ``edges`` are
    pairs ``(i, j)`` of node indices with ``nodes[j].layer == nodes[i].layer + 1``;
    ``edge_arrows[e]`` names the arrows that realise edge ``e``.
    ``multiplicity_free`` says whether every layer has each simple at most
    once, in which case the diagram is independent of all choices.
    """

    nodes: tuple[LoewyNode, ...]
    edges: tuple[tuple[int, int], ...]
    edge_arrows: tuple[tuple[str, ...], ...]
    multiplicity_free: bool

    @property
    def layers(self) -> int:
        """The number of layers (the Loewy length)."""
        return 1 + max((n.layer for n in self.nodes), default=-1)

    def to_dict(self) -> dict[str, Any]:
        return {
            "nodes": [n.to_dict() for n in self.nodes],
            "edges": [list(e) for e in self.edges],
            "edge_arrows": [list(a) for a in self.edge_arrows],
            "multiplicity_free": self.multiplicity_free,
        }


def loewy_diagram(module: Module, *, method: str = "auto") -> LoewyDiagram:
    """The Loewy diagram of ``module``: nodes per radical layer and vertex, edges by arrows.

    Notes
    -----
    Basis choice (it matters only when a simple occurs more than once in a
    layer).  Layer 0 at vertex ``s`` gets the unit vectors of ``M_s`` that span
    a complement of ``rad M`` (the module's minimal generators).  Layer
    ``k + 1`` at vertex ``t`` is spanned by the images of the layer-``k`` basis
    vectors under the arrows ending at ``t``; scanning the layer-``k`` nodes in
    order and, for each, the arrows in the quiver's order, each image that is
    independent (modulo ``rad^(k+2) M``) of the images kept before is kept, and
    the kept images are the basis.  A kept image has a single nonzero
    coordinate, so it adds exactly one edge; the edges of the other images are
    read from their coordinates in that basis.

    ``method``: ``"dense"`` (matrices), ``"sparse"`` (sparse rows, for
    modules whose arrows act by few entries per row, see
    :func:`~hwcat.modules.module.series_method`), ``"sets"`` (sets of
    coordinates, for modules whose arrows act by single entries) or
    ``"auto"`` (the module's own choice).  All give the same diagram.

    Examples
    --------
    The projective at the source of ``1 -> 2`` with two arrows (Kronecker
    quiver): one top, two factors below, both reached.

    >>> from hwcat.io.spec import load_spec_text
    >>> from hwcat.modules import projective
    >>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["1", "2"]\\n'
    ...                    'arrows = ["a: 1 -> 2", "b: 1 -> 2"]')
    >>> d = loewy_diagram(projective(A, 0))
    >>> d.edges, d.edge_arrows, d.multiplicity_free
    (((0, 1), (0, 2)), (('a',), ('b',)), False)
    """
    if method == "auto":
        method = "sparse" if module.uses_sparse_rows() else "dense"
        if method == "sparse" and module.acts_by_single_entries():
            method = "sets"
    if method == "sets":
        if not module.acts_by_single_entries():
            raise InternalInconsistency(
                "the coordinate-set route needs arrows acting by single entries"
            )
        return _loewy_diagram_sets(module)
    if method == "sparse":
        return _loewy_diagram_sparse(module)
    if method != "dense":
        raise InternalInconsistency(f"unknown Loewy diagram method {method!r}")
    A = module.algebra
    F = module.field
    dims = module.dims
    arrows = A.arrows
    ser = module.radical_series_on_support()
    nlayers = len(ser) - 1
    if nlayers == 0:  # the zero module
        return LoewyDiagram((), (), (), True)
    zero = {v: Mat.zeros(F, 0, dims[v]) for v in module.support}
    # reps[k][v]: rows of M_v representing the basis of layer k at v (support only)
    reps: list[dict[int, Mat]] = [
        {v: complement(ser[1].get(v, zero[v]), dims[v]) for v in module.support}
    ]
    # node index of the i-th basis vector of layer k at vertex v
    nodes: list[LoewyNode] = []
    index: dict[tuple[int, int, int], int] = {}

    def add_layer(k: int) -> None:
        for v in sorted(reps[k]):
            for i in range(reps[k][v].nrows):
                index[(k, v, i)] = len(nodes)
                nodes.append(LoewyNode(k, v, A.vertices[v]))

    add_layer(0)
    edge_arrows: dict[tuple[int, int], list[str]] = {}
    stored = module.maps.items()
    for k in range(nlayers - 1):
        nxt: dict[int, Mat] = {}
        # the arrows from a vertex with layer-k nodes, by target, in (source, arrow) order
        by_target: dict[int, list[int]] = {}
        for ai, _ in sorted(stored, key=lambda x: (arrows[x[0]].source, x[0])):
            B = reps[k].get(arrows[ai].source)
            if B is not None and B.nrows:
                by_target.setdefault(arrows[ai].target, []).append(ai)
        for t in sorted(ser[k + 1]):
            d = dims[t]
            R2 = ser[k + 2].get(t, zero[t])
            want = ser[k + 1][t].nrows - R2.nrows
            if want == 0:
                nxt[t] = zero[t]
                continue
            cands: list[tuple[int, str]] = []  # (source node, arrow name) per row
            rows: list[Mat] = []
            for ai in by_target.get(t, ()):
                a = arrows[ai]
                B = reps[k][a.source]
                rows.append(B @ module.maps[ai])
                for i in range(B.nrows):
                    cands.append((index[(k, a.source, i)], a.name))
            stack = Mat.vstack(F, rows, d)
            # order the candidate rows node by node (then arrow), as documented
            order = sorted(range(len(cands)), key=lambda r: (cands[r][0], r))
            stack = stack.take_rows(order)
            cands = [cands[r] for r in order]
            kept = select_independent_rows(stack, R2)
            if len(kept) != want:
                raise InternalInconsistency(
                    f"Loewy diagram: layer {k + 1} at {A.vertices[t]} has dimension {want} "
                    f"but the arrows from layer {k} span {len(kept)}"
                )
            basis = stack.take_rows(kept)
            nxt[t] = basis
            coords = Mat.vstack(F, [basis, R2], d).solve_left(stack)
            if coords is None:
                raise InternalInconsistency("Loewy diagram: an image lies outside the layer")
            _collect_edges(k, t, coords, cands, want, edge_arrows)
        reps.append(nxt)
        add_layer(k + 1)
    # node indices of the layer below were assigned after the edges were read
    free = all(r.nrows <= 1 for layer in reps for r in layer.values())
    return _diagram(nodes, edge_arrows, index, free)


def _loewy_diagram_sparse(module: Module) -> LoewyDiagram:
    """:func:`loewy_diagram` on sparse rows: the same choices, the same diagram.

    Each candidate image is reduced modulo the echelon basis of
    ``rad^(k+2) M`` (a canonical representative of its class in the layer)
    and then against the kept images, with the combination of kept images
    tracked: a candidate that reduces to zero has those coefficients as its
    coordinates, one that does not is kept.
    """
    F = module.field
    ser = module.radical_series_rows()
    nlayers = len(ser) - 1
    if nlayers == 0:
        return LoewyDiagram((), (), (), True)
    one = F.one
    smaps = module.sparse_maps()
    # layer 0: unit vectors off the pivots of rad M (the module's minimal generators)
    reps0: dict[int, list[dict[int, Any]]] = {}
    for v in module.support:
        piv = {min(r) for r in ser[1].get(v, ())}
        reps0[v] = [{j: one} for j in range(module.dims[v]) if j not in piv]

    def want(k: int, t: int) -> int:
        return len(ser[k + 1][t]) - len(ser[k + 2].get(t, ()))

    def choose(k: int, t: int, cands, edge) -> list[dict[int, Any]]:
        below = {min(r): r for r in ser[k + 2].get(t, ())}
        kept: list[dict[int, Any]] = []
        # echelon rows of the kept classes: pivot -> (vector, combination of kept)
        ech: dict[int, tuple[dict[int, Any], dict[int, Any]]] = {}
        for u, name, img in cands:
            v = _reduce(dict(img), below)
            combo: dict[int, Any] = {}
            while True:  # kept rows have entries from their pivot on: smallest first
                hits = [q for q in v if q in ech]
                if not hits:
                    break
                p = min(hits)
                x = v[p]
                vec, c = ech[p]
                axpy(v, -x, vec)
                axpy(combo, x, c)
            if v:
                j = len(kept)
                kept.append(img)
                coords = {j: one}
                c = {q: -y for q, y in combo.items()}
                c[j] = c.get(j, F.zero) + one
                p = min(v)
                inv = one / v[p]
                ech[p] = ({q: y * inv for q, y in v.items()}, {q: y * inv for q, y in c.items()})
            else:
                coords = combo
            for j, x in coords.items():
                if x != 0:
                    edge(u, name, j)
        return kept

    return _layered_diagram(
        module.algebra,
        nlayers,
        reps0,
        smaps,
        lambda k: sorted(ser[k + 1]),
        want,
        lambda ai, row: row_times(row, smaps[ai]),
        choose,
    )


def _loewy_diagram_sets(module: Module) -> LoewyDiagram:
    """:func:`loewy_diagram` for arrows acting by single entries: the same choices.

    Every basis vector chosen is a multiple of a unit vector and every space of
    the radical series is spanned by unit vectors, so an image is a multiple of
    the unit vector of one coordinate ``c`` (or zero); it is zero in the layer
    when ``c`` lies in ``rad^(k+2) M``, is kept when ``c`` is new, and otherwise
    is a nonzero multiple of the image kept for ``c``: one edge either way.
    """
    nlayers, level = module.series_levels()
    if nlayers == 0:
        return LoewyDiagram((), (), (), True)
    cmaps = module.column_maps()
    layers = module.radical_layers()
    highest = {v: max(lv.values()) for v, lv in level.items() if lv}
    # reps[k][v]: the coordinate of each basis vector of layer k at v
    reps0 = {v: [j for j in range(module.dims[v]) if level[v][j] == 0] for v in module.support}

    def choose(k: int, t: int, cands, edge) -> list[int]:
        lt = level[t]
        kept: list[int] = []
        where: dict[int, int] = {}  # coordinate -> kept index
        for u, name, c in cands:
            if c < 0 or lt[c] >= k + 2:  # zero, or in rad^(k+2) M
                continue
            j = where.get(c)
            if j is None:
                j = where[c] = len(kept)
                kept.append(c)
            edge(u, name, j)
        return kept

    return _layered_diagram(
        module.algebra,
        nlayers,
        reps0,
        cmaps,
        lambda k: sorted(v for v, top in highest.items() if top >= k + 1),
        lambda k, t: layers[k + 1][t],
        lambda ai, j: cmaps[ai][j],
        choose,
    )


def _layered_diagram(A, nlayers: int, reps0: dict, maps, targets, want, image, choose):
    """The walk down the radical layers shared by the sparse and the single-entry routes.

    ``reps0[v]``: the chosen basis vectors of the top at ``v``; ``maps``: the arrows
    acting (indices); ``targets(k)``: the vertices of layer ``k + 1``; ``want(k, t)``:
    its dimension at ``t``; ``image(ai, rep)``: a representative under arrow ``ai``;
    ``choose(k, t, cands, edge)``: the kept images among ``cands`` (``(node, arrow
    name, image)``, node by node), calling ``edge(node, arrow name, j)`` for each edge
    into the ``j``-th kept one.  Node indices of a layer are assigned after the edges
    into it were read.
    """
    arrows = A.arrows
    reps: list[dict[int, list[Any]]] = [reps0]
    nodes: list[LoewyNode] = []
    index: dict[tuple[int, int, int], int] = {}

    def add_layer(k: int) -> None:
        for v in sorted(reps[k]):
            for i in range(len(reps[k][v])):
                index[(k, v, i)] = len(nodes)
                nodes.append(LoewyNode(k, v, A.vertices[v]))

    add_layer(0)
    edge_arrows: dict[tuple[int, tuple[int, int, int]], list[str]] = {}
    stored = sorted(maps, key=lambda i: (arrows[i].source, i))
    for k in range(nlayers - 1):
        nxt: dict[int, list[Any]] = {}
        by_target: dict[int, list[int]] = {}
        for ai in stored:
            if reps[k].get(arrows[ai].source):
                by_target.setdefault(arrows[ai].target, []).append(ai)
        for t in targets(k):
            w = want(k, t)
            if w == 0:
                nxt[t] = []
                continue
            cands: list[tuple[int, str, Any]] = []
            for ai in by_target.get(t, ()):
                a = arrows[ai]
                for i, rep in enumerate(reps[k][a.source]):
                    cands.append((index[(k, a.source, i)], a.name, image(ai, rep)))
            cands.sort(key=lambda c: c[0])  # stable: node by node, then arrow

            def edge(u: int, name: str, j: int, k: int = k, t: int = t) -> None:
                names = edge_arrows.setdefault((u, (k + 1, t, j)), [])
                if name not in names:
                    names.append(name)

            kept = choose(k, t, cands, edge)
            if len(kept) != w:
                raise InternalInconsistency(
                    f"Loewy diagram: layer {k + 1} at {A.vertices[t]} has dimension {w} "
                    f"but the arrows from layer {k} span {len(kept)}"
                )
            nxt[t] = kept
        reps.append(nxt)
        add_layer(k + 1)
    free = all(len(r) <= 1 for layer in reps for r in layer.values())
    return _diagram(nodes, edge_arrows, index, free)


def _diagram(nodes, edge_arrows: dict, index: dict, free: bool) -> LoewyDiagram:
    """The diagram from its nodes and its edges keyed by node keys (each route's
    node indices of a layer are assigned after the edges into it were read)."""
    edges = sorted(edge_arrows)
    resolved = [(u, index[w]) for u, w in edges]
    order = sorted(range(len(edges)), key=lambda e: resolved[e])
    return LoewyDiagram(
        nodes=tuple(nodes),
        edges=tuple(resolved[e] for e in order),
        edge_arrows=tuple(tuple(edge_arrows[edges[e]]) for e in order),
        multiplicity_free=free,
    )


def _reduce(v: dict[int, Any], echelon_rows: dict[int, dict[int, Any]]) -> dict[int, Any]:
    """``v`` reduced modulo reduced echelon rows given by pivot (in place; returned)."""
    for p in [p for p in v if p in echelon_rows]:
        x = v.get(p)
        if x is not None:
            axpy(v, -x, echelon_rows[p])
    return v


def _collect_edges(k: int, t: int, coords: Mat, cands, want: int, edge_arrows) -> None:
    """Record the edges given by the coordinates of the candidate images.

    The target of an edge is the key ``(layer, vertex, basis index)`` (its node
    index is assigned once the layer is complete).
    """
    for r, (u, name) in enumerate(cands):
        for j in range(want):
            if coords[r, j] != 0:
                key = (u, (k + 1, t, j))
                names = edge_arrows.setdefault(key, [])
                if name not in names:
                    names.append(name)


def is_indecomposable_projective_injective(module: Module) -> bool:
    """Whether ``module`` is an indecomposable projective-injective module.

    Such a module has a simple top ``L(i)`` and a simple socle ``L(j)``; a
    module with simple top ``L(i)`` is a quotient of ``P(i)``, so it is ``P(i)``
    exactly when the dimensions agree, and dually a module with simple socle
    ``L(j)`` embeds in ``I(j)`` and is ``I(j)`` exactly when the dimensions
    agree.

    >>> from hwcat.io.spec import load_spec_text
    >>> from hwcat.modules import projective
    >>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["1", "2"]\\narrows = ["a: 1 -> 2"]')
    >>> [is_indecomposable_projective_injective(projective(A, s)) for s in range(2)]
    [True, False]
    """
    if module.is_zero():
        return False
    top, soc = module.radical_layers()[0], module.socle_layers()[0]
    if sum(top) != 1 or sum(soc) != 1:
        return False
    A = module.algebra
    i, j = top.index(1), soc.index(1)
    return module.dims == projective(A, i).dims == injective(A, j).dims
