"""Loewy diagrams (:mod:`hwcat.modules.loewy`) and projective-injective modules.

Sources:

* radical layers, representations of bound quivers: I. Assem, D. Simson,
  A. Skowroński, *Elements of the Representation Theory of Associative
  Algebras* 1, LMS Student Texts 65 (2006) (from memory);
* the Auslander algebra of k[x]/(x^3) and its presentation (quiver
  1 <-> 2 <-> 3, the 2-cycle at 1 zero, the two 2-cycles at 2 equal): from
  memory; it is quasi-hereditary (T. Brüstle, L. Hille, C. M. Ringel,
  G. Röhrle, Algebr. Represent. Theory 2 (1999) 295–312);
* graph isomorphism is decided by networkx (an independent reference), so
  the tests compare drawings up to the order of the nodes.

Every expected diagram below was drawn by hand from the paths of the
projective modules (derived).
"""

from __future__ import annotations

import random

import networkx as nx
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from hwcat.exact import QQ, Mat
from hwcat.io.spec import load_spec_text
from hwcat.modules import Module, direct_sum, injective, projective
from hwcat.modules.loewy import (
    LoewyDiagram,
    is_indecomposable_projective_injective,
    loewy_diagram,
)
from hwcat.strategies import bound_quiver_algebras, modules

TRUNCATED_4 = """
name = "k[x]/(x^4)"
field = "QQ"
[quiver]
vertices = ["1"]
arrows = ["x: 1 -> 1"]
vanish_from_length = 4
"""

ZIGZAG = """
name = "zigzag of type A3"
field = "QQ"
[quiver]
vertices = ["p", "q", "r"]
arrows = ["a: p -> q", "b: q -> p", "c: q -> r", "d: r -> q"]
relations = ["a*c", "d*b", "b*a - c*d"]
"""

# same quiver; the 2-cycle through r at q is zero, so only p reaches the bottom of P(q)
ONE_SIDED = """
name = "one-sided"
field = "QQ"
[quiver]
vertices = ["p", "q", "r"]
arrows = ["a: p -> q", "b: q -> p", "c: q -> r", "d: r -> q"]
relations = ["a*c", "d*b", "c*d", "a*b*a", "b*a*b", "d*c*d"]
"""

AUSLANDER_3 = """
name = "Auslander algebra of k[x]/(x^3)"
field = "QQ"
order = "1 > 2 > 3"
[quiver]
vertices = ["1", "2", "3"]
arrows = ["a: 1 -> 2", "b: 2 -> 1", "c: 2 -> 3", "d: 3 -> 2"]
relations = ["a*b", "b*a - c*d"]
"""


def graph(d: LoewyDiagram) -> nx.DiGraph:
    g = nx.DiGraph()
    for i, n in enumerate(d.nodes):
        g.add_node(i, layer=n.layer, simple=n.simple)
    g.add_edges_from(d.edges)
    return g


def drawn(nodes: list[tuple[int, str]], edges: list[tuple[int, int]]) -> nx.DiGraph:
    """A hand-drawn diagram: nodes as (layer, simple), edges as index pairs."""
    g = nx.DiGraph()
    for i, (k, s) in enumerate(nodes):
        g.add_node(i, layer=k, simple=s)
    g.add_edges_from(edges)
    return g


def same(d: LoewyDiagram, expected: nx.DiGraph) -> bool:
    return nx.is_isomorphic(graph(d), expected, node_match=lambda x, y: x == y)


def test_truncated_polynomial_ring_is_a_chain():
    # k[x]/(x^4): basis 1, x, x^2, x^3, one per layer, each x-multiple the next (derived)
    A = load_spec_text(TRUNCATED_4)
    d = loewy_diagram(projective(A, 0))
    assert len(d.nodes) == 4 and len(d.edges) == 3 and d.multiplicity_free
    assert same(d, drawn([(0, "1"), (1, "1"), (2, "1"), (3, "1")], [(0, 1), (1, 2), (2, 3)]))
    assert d.edge_arrows == (("x",), ("x",), ("x",))


def test_zigzag_middle_projective_is_a_diamond():
    # P(q) = span(e_q, b, c, b*a = c*d): q on top, p and r, q at the bottom,
    # reached from p by a and from r by d (derived)
    A = load_spec_text(ZIGZAG)
    d = loewy_diagram(projective(A, 1))
    diamond = drawn([(0, "q"), (1, "p"), (1, "r"), (2, "q")], [(0, 1), (0, 2), (1, 3), (2, 3)])
    assert len(d.edges) == 4 and same(d, diamond)
    # the outer projectives are chains p | q | p and r | q | r (derived)
    assert same(
        loewy_diagram(projective(A, 0)), drawn([(0, "p"), (1, "q"), (2, "p")], [(0, 1), (1, 2)])
    )
    assert same(
        loewy_diagram(projective(A, 2)), drawn([(0, "r"), (1, "q"), (2, "r")], [(0, 1), (1, 2)])
    )


def test_same_layers_but_one_middle_factor_misses_the_bottom():
    A = load_spec_text(ONE_SIDED)
    Z = load_spec_text(ZIGZAG)
    P, Q = projective(A, 1), projective(Z, 1)
    assert P.radical_layers() == Q.radical_layers()  # q | p r | q in both
    d = loewy_diagram(P)
    # c*d = 0: the factor r (spanned by c) is not mapped onto the bottom (derived)
    one_sided = drawn([(0, "q"), (1, "p"), (1, "r"), (2, "q")], [(0, 1), (0, 2), (1, 3)])
    assert len(d.edges) == 3 and same(d, one_sided)
    assert not same(d, graph(loewy_diagram(Q)))


def test_auslander_algebra_of_truncated_polynomial_ring():
    A = load_spec_text(AUSLANDER_3)
    # dimension = sum of dim Hom(k[x]/(x^i), k[x]/(x^j)) = sum min(i, j) = 14 (derived)
    assert A.dim == 14
    d1, d2, d3 = (loewy_diagram(projective(A, s)) for s in range(3))
    # P(1) = e_1, a, a*c: a chain 1 | 2 | 3 (derived)
    assert same(d1, drawn([(0, "1"), (1, "2"), (2, "3")], [(0, 1), (1, 2)]))
    # P(2) = e_2, b, c, b*a = c*d, b*a*c: a diamond with a tail (derived)
    assert same(
        d2,
        drawn(
            [(0, "2"), (1, "1"), (1, "3"), (2, "2"), (3, "3")],
            [(0, 1), (0, 2), (1, 3), (2, 3), (3, 4)],
        ),
    )
    # P(3) = e_3, d, d*b, d*c, d*b*a = d*c*d, d*c*d*c: a diamond between two tails (derived)
    assert same(
        d3,
        drawn(
            [(0, "3"), (1, "2"), (2, "1"), (2, "3"), (3, "2"), (4, "3")],
            [(0, 1), (1, 2), (1, 3), (2, 4), (3, 4), (4, 5)],
        ),
    )
    # only P(3) (the projective-injective generator-cogenerator's summand) is injective (derived)
    assert [is_indecomposable_projective_injective(projective(A, s)) for s in range(3)] == [
        False,
        False,
        True,
    ]


def test_zigzag_projectives_are_injective():
    # the zigzag algebra is self-injective: every P(i) is some I(j) (derived from the
    # diagrams above: each P(i) has simple socle L(i) and the dimension of I(i))
    A = load_spec_text(ZIGZAG)
    assert all(is_indecomposable_projective_injective(projective(A, s)) for s in range(3))
    B = load_spec_text(ONE_SIDED)
    assert not is_indecomposable_projective_injective(injective(B, 1))  # top q + r


def _base_changed(M: Module, seed: int) -> Module:
    """The same module written in random bases (row vectors: maps S_s A_a S_t^-1)."""
    rng = random.Random(seed)
    F = M.field
    S = []
    for d in M.dims:
        while True:
            m = Mat.from_rows(F, [[rng.randint(-3, 3) for _ in range(d)] for _ in range(d)], d)
            if m.rank() == d:
                break
        S.append(m)
    maps = [
        S[a.source] @ m @ S[a.target].inverse()
        for m, a in zip(M.maps, M.algebra.arrows, strict=True)
    ]
    return Module(M.algebra, M.dims, maps, M.name)


def test_multiplicity_free_diagrams_do_not_depend_on_the_basis():
    for text in (ZIGZAG, ONE_SIDED, AUSLANDER_3):
        A = load_spec_text(text)
        for s in range(A.n):
            for M in (projective(A, s), injective(A, s)):
                d = loewy_diagram(M)
                assert d.multiplicity_free
                for seed in range(3):
                    assert same(loewy_diagram(_base_changed(M, seed)), graph(d)), (M.name, seed)


def test_repeated_simples_get_a_sparse_basis():
    # two copies of the diamond P(q): the chosen basis gives two disjoint diamonds
    # (8 edges), also after a random change of basis mixing the copies (derived)
    A = load_spec_text(ZIGZAG)
    M = direct_sum(projective(A, 1), projective(A, 1))
    diamonds = nx.disjoint_union(
        graph(loewy_diagram(projective(A, 1))), graph(loewy_diagram(projective(A, 1)))
    )
    for N in (M, _base_changed(M, 1), _base_changed(M, 2)):
        d = loewy_diagram(N)
        assert not d.multiplicity_free
        assert len(d.edges) == 8 and same(d, diamonds)
    # k[x]/(x^4) twice: two chains of 4
    T = load_spec_text(TRUNCATED_4)
    d = loewy_diagram(_base_changed(direct_sum(projective(T, 0), projective(T, 0)), 5))
    assert len(d.edges) == 6 and nx.number_weakly_connected_components(graph(d)) == 2


def _check_invariants(M: Module) -> None:
    d = loewy_diagram(M)
    A = M.algebra
    layers = M.radical_layers()
    # nodes count the composition factors of each radical layer
    counts = [[0] * A.n for _ in layers]
    for n in d.nodes:
        counts[n.layer][n.vertex] += 1
    assert [tuple(c) for c in counts] == layers
    assert sum(1 for _ in d.nodes) == M.dim
    by_name = {a.name: a for a in A.arrows}
    has_parent = set()
    for (u, w), names in zip(d.edges, d.edge_arrows, strict=True):
        nu, nw = d.nodes[u], d.nodes[w]
        assert nw.layer == nu.layer + 1 and names
        for x in names:
            assert (by_name[x].source, by_name[x].target) == (nu.vertex, nw.vertex)
        has_parent.add(w)
    # every factor below the top is reached from the layer above (rad^(k+1) = rad^k * arrows)
    assert has_parent == {i for i, n in enumerate(d.nodes) if n.layer > 0}
    assert d.to_dict()["nodes"][0]["layer"] == 0 if d.nodes else True


@settings(max_examples=25, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(st.data())
def test_diagram_invariants_on_random_modules(data):
    A = data.draw(bound_quiver_algebras(max_vertices=3, max_arrows=4, field=QQ))
    M = data.draw(modules(A, max_summands=2))
    _check_invariants(M)
