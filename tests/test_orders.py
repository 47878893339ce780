"""Partial orders: parsing, closure, Hasse diagram and linear extensions.

Linear-extension counts are compared with a brute force over permutations
(itertools), an independent reference; the Hasse diagram with networkx's
transitive reduction computed from scratch.
"""

import itertools
import math

import networkx as nx
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from hwcat.errors import OrderError
from hwcat.theory.orders import PartialOrder, parse_order, total_order

V = ["1", "2", "3", "4"]


def test_chain():
    P = parse_order("4 > 2 > 3 > 1", V)
    assert P.is_total
    assert P.first_extension() == (3, 1, 2, 0)
    assert P.lt(0, 3) and P.lt(2, 1) and not P.lt(1, 2)
    assert P.chain_text() == "4 > 2 > 3 > 1"


def test_covers_and_mixture():
    P = parse_order("1 < 2, 1 < 3", ["1", "2", "3"])
    assert P.covers_named() == [["1", "2"], ["1", "3"]]
    assert not P.is_total
    Q = parse_order("4 > 2 > 1, 3 < 4, 1 < 3", V)
    assert Q.lt(0, 3) and Q.lt(0, 2) and Q.lt(2, 3)
    assert ["1", "3"] in Q.covers_named() and ["1", "2"] in Q.covers_named()


def test_incomparable_allowed():
    P = parse_order("2 > 1", V)
    assert P.count_linear_extensions() == 12  # 4!/2


@pytest.mark.parametrize(
    "text, fragment",
    [
        ("1 > 2 > 1", "cycle"),
        ("1 > 2, 2 > 3, 3 > 1", "cycle"),
        ("1 > 5", "not a vertex"),
        ("1 >", "form"),
        ("1 > > 2", "expected a vertex"),
        ("1 2", "expected < or >"),
        ("1 > 2,, 3 > 4", "empty part"),
        ("", "empty"),
        ("1 = 2", "cannot read"),
        ("1 > 1", "itself"),
    ],
)
def test_bad_orders(text, fragment):
    with pytest.raises(OrderError, match=fragment):
        parse_order(text, V)


@st.composite
def random_orders(draw):
    n = draw(st.integers(1, 7))
    pairs = draw(st.lists(st.tuples(st.integers(0, n - 1), st.integers(0, n - 1)), max_size=9))
    perm = draw(st.permutations(range(n)))
    rank = {v: i for i, v in enumerate(perm)}
    # orient every pair by a hidden total order, so the relation is acyclic
    rel = [(a, b) if rank[a] < rank[b] else (b, a) for a, b in pairs if a != b]
    return PartialOrder.from_relations([str(i) for i in range(n)], rel)


@settings(max_examples=60, deadline=None)
@given(random_orders())
def test_linear_extensions_brute_force(P):
    brute = [
        p
        for p in itertools.permutations(range(P.n))
        if all(p.index(b) < p.index(a) for a, b in P.less)  # highest first
    ]
    assert P.count_linear_extensions() == len(brute)
    assert sorted(P.linear_extensions()) == sorted(brute)


def test_linear_extensions_of_a_wide_order():
    # 20 disjoint chains of two: (40)! / 2^20 shuffles (common practice); counted piece by
    # piece, where upper sets of the whole order would number 3^20
    V = [str(i) for i in range(40)]
    P = PartialOrder.from_relations(V, [(2 * i, 2 * i + 1) for i in range(20)])
    assert P.count_linear_extensions() == math.factorial(40) // 2**20
    Q = parse_order("0 < 1, 1 < 2, 0 < 3, 4 < 5", V[:7])  # pieces of 4, 2 and 1 vertices
    assert Q.count_linear_extensions() == math.comb(7, 4) * math.comb(3, 2) * 3


@st.composite
def random_forests(draw):
    # each vertex gets at most one parent among the earlier ones, above or below it
    n = draw(st.integers(1, 7))
    parents = [draw(st.integers(-1, v - 1)) for v in range(n)]
    up = draw(st.booleans())
    rel = [(v, p) if up else (p, v) for v, p in enumerate(parents) if p >= 0]
    return PartialOrder.from_relations([str(i) for i in range(n)], rel)


@settings(max_examples=60, deadline=None)
@given(random_forests())
def test_linear_extensions_of_forests_brute_force(P):
    brute = sum(
        all(p.index(b) < p.index(a) for a, b in P.less) for p in itertools.permutations(range(P.n))
    )
    assert P.count_linear_extensions() == brute


def test_linear_extensions_of_a_star():
    # one vertex below 30 incomparable ones: 30! extensions (derived)
    V = [str(i) for i in range(31)]
    assert PartialOrder.from_relations(
        V, [(0, b) for b in range(1, 31)]
    ).count_linear_extensions() == math.factorial(30)


@settings(max_examples=60, deadline=None)
@given(random_orders())
def test_hasse_diagram(P):
    G = nx.DiGraph()
    G.add_nodes_from(range(P.n))
    G.add_edges_from(P.less)
    # independent: a < b is a cover iff no c with a < c < b
    covers = sorted(
        (a, b)
        for a, b in P.less
        if not any((a, c) in P.less and (c, b) in P.less for c in range(P.n))
    )
    assert P.covers() == covers
    assert P.covers() == sorted(P.hasse.edges())  # networkx's transitive reduction
    # the closure of the covers is the order again
    assert PartialOrder.from_relations(P.vertices, covers).less == P.less
    assert nx.is_directed_acyclic_graph(G)


def test_total_order_roundtrip():
    P = total_order(V, [2, 0, 3, 1])
    assert P.is_total and P.first_extension() == (2, 0, 3, 1)
    assert parse_order(P.chain_text(), V) == P


PAIRS = st.integers(1, 7).flatmap(
    lambda n: st.tuples(
        st.just(n),
        st.lists(st.tuples(st.integers(0, n - 1), st.integers(0, n - 1)), max_size=10),
    )
)


@settings(max_examples=60, deadline=None)
@given(PAIRS)
def test_first_extension_matches_networkx(data):
    # reference: networkx's lexicographical topological sort of "b before a" for a < b
    n, pairs = data
    pairs = [(a, b) for a, b in pairs if a < b]  # acyclic: a < b only for a smaller index
    order = PartialOrder.from_relations([str(v) for v in range(n)], pairs)
    G = order.graph().reverse()
    assert order.first_extension() == tuple(nx.lexicographical_topological_sort(G))


@settings(max_examples=60, deadline=None)
@given(random_orders())
def test_closure_along_a_given_linear_extension(P):
    # from_upper_masks with a linear extension (highest first) skips the topological sort;
    # the closure must be the same order (derived check against Kahn's algorithm)
    up = [0] * P.n
    for a, b in P.covers():
        up[a] |= 1 << b
    assert PartialOrder.from_upper_masks(P.vertices, up) == P
    assert PartialOrder.from_upper_masks(P.vertices, up, P.first_extension()) == P
