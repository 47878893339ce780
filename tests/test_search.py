"""All quasi-hereditary orders and quasi-hereditary structures, against published results.

Sources (see also /work/shared/sources.md):
* V. Dlab, C. M. Ringel, Quasi-hereditary algebras, Illinois J. Math. 33 (1989):
  an algebra is hereditary iff it is quasi-hereditary for every order.
* G. Flores, Y. Kimura, B. Rognerud, Combinatorics of quasi-hereditary
  structures, arXiv:2004.04726: linear A_n has Catalan(n) structures.
* K. Coulembier, arXiv:1903.02717: a simple-preserving duality allows at most
  one quasi-hereditary structure.
* T. Bruestle, L. Hille, C. M. Ringel, G. Roehrle, Algebr. Represent. Theory 2
  (1999): the Auslander algebra of k[T]/(T^n) is quasi-hereditary.
* Zhang, Zhong, arXiv:2405.02860: a non-hereditary Nakayama algebra has at most
  (2/3) n! quasi-hereditary total orders.
* Dlab and Ringel 1989; C. M. Ringel, J. Pure Appl. Algebra 214 (2010):
  quasi-hereditary algebras have finite global dimension, so self-injective
  non-semisimple algebras are never quasi-hereditary.
"""

import itertools
from math import comb, factorial

import pytest
from hypothesis import given, settings

from hwcat.algebras.families.quivers import (
    auslander_truncated_polynomial,
    disjoint_union,
    linear_A,
)
from hwcat.algebras.inputs.bound import bound_quiver_algebra
from hwcat.exact import GF, QQ
from hwcat.modules import projective
from hwcat.strategies import (
    algebra_from_spec,
    bound_quiver_algebras,
    linear_nakayama_algebras,
    quivers,
)
from hwcat.theory.highest_weight import costandard_module, standard_filtration, standard_module
from hwcat.theory.orders import total_order
from hwcat.theory.search import is_quasi_hereditary, quasi_hereditary_orders


def catalan(n):
    return comb(2 * n, n) // (n + 1)


def is_hereditary(A):
    """rad P(i) projective for every i (independent of the heredity search).

    rad P(i) is projective iff its projective cover is an isomorphism, i.e. iff
    dim rad P(i) = sum over its top of dim P(j) (common practice).
    """
    for i in range(A.n):
        R = projective(A, i).radical()
        top = R.top()
        if R.dim != sum(t * projective(A, j).dim for j, t in enumerate(top)):
            return False
    return True


def brute_force_quasi_hereditary_orders(A):
    """Quasi-hereditary total orders by the module-theoretic definition, over all n! permutations."""
    count = 0
    for perm in itertools.permutations(range(A.n)):
        P = total_order(A.vertices, perm)
        ok = True
        for L in range(A.n):
            if standard_module(A, L, P).dims[L] != 1:
                ok = False
                break
            r = standard_filtration(projective(A, L), P)
            if not r.exists or r.multiplicities[L] != 1:
                ok = False
                break
            if any(r.multiplicities[m] and not P.lt(L, m) for m in range(A.n) if m != L):
                ok = False
                break
        count += ok
    return count


@pytest.mark.parametrize("n", range(1, 8))
def test_linear_A_catalan(n):
    # Flores-Kimura-Rognerud: Catalan(n) structures; Dlab-Ringel: quasi-hereditary for all n! orders.
    A = algebra_from_spec(linear_A(n))
    r = quasi_hereditary_orders(A, list_limit=None)
    assert r.quasi_hereditary
    assert r.structures == catalan(n)
    assert r.quasi_hereditary_total_orders == factorial(n)
    assert len(r.structure_list) == catalan(n) and r.listed_all
    # the quasi-hereditary orders of a structure are the linear extensions of its essential order
    assert sum(s.essential_order.count_linear_extensions() for s in r.structure_list) == factorial(
        n
    )


@settings(max_examples=25, deadline=None)
@given(quivers(min_vertices=1, max_vertices=5, max_arrows=6, acyclic=True))
def test_path_algebras_quasi_hereditary_for_all_orders(Q):
    # Dlab-Ringel 1989: hereditary => it is quasi-hereditary for every total order.
    A = bound_quiver_algebra(QQ, Q)
    assert quasi_hereditary_orders(A, list_limit=0).quasi_hereditary_total_orders == factorial(A.n)


@settings(max_examples=40, deadline=None)
@given(bound_quiver_algebras(max_vertices=4, max_arrows=5))
def test_quasi_hereditary_for_all_orders_only_if_hereditary(A):
    # Dlab-Ringel 1989: quasi-hereditary for every order => hereditary (and conversely).
    r = quasi_hereditary_orders(A, list_limit=0)
    assert (r.quasi_hereditary_total_orders == factorial(A.n)) == is_hereditary(A)


@settings(max_examples=40, deadline=None)
@given(bound_quiver_algebras(max_vertices=4, max_arrows=5))
def test_search_equals_brute_force(A):
    # the subset search against all permutations with the module-theoretic axioms (derived check)
    r = quasi_hereditary_orders(A, list_limit=0)
    assert r.quasi_hereditary_total_orders == brute_force_quasi_hereditary_orders(A)
    assert r.quasi_hereditary == (r.quasi_hereditary_total_orders > 0) == is_quasi_hereditary(A)


@pytest.mark.parametrize("n", [2, 3, 4, 5])
def test_auslander_algebra_unique_structure(n):
    # BHRR 1999: quasi-hereditary; Coulembier: at most one structure (it has a duality).
    A = algebra_from_spec(auslander_truncated_polynomial(n))
    r = quasi_hereditary_orders(A)
    assert r.quasi_hereditary and r.structures == 1


@settings(max_examples=40, deadline=None)
@given(linear_nakayama_algebras(min_vertices=2, max_vertices=6))
def test_nakayama_two_thirds_bound(A):
    # Zhang-Zhong: non-hereditary Nakayama algebras have at most (2/3) n! quasi-hereditary orders.
    r = quasi_hereditary_orders(A, list_limit=0)
    if not is_hereditary(A):
        assert 3 * r.quasi_hereditary_total_orders <= 2 * factorial(A.n)
    else:
        assert r.quasi_hereditary_total_orders == factorial(A.n)


def _cyclic_rad_square_zero(n, field=QQ):
    vs = [str(i) for i in range(1, n + 1)]
    arrows = [f"a{i}: {i} -> {i % n + 1}" for i in range(1, n + 1)]
    return algebra_from_spec(
        {"field": field.name, "quiver": {"vertices": vs, "arrows": arrows, "vanish_from_length": 2}}
    )


@pytest.mark.parametrize("n", [2, 3, 5])
def test_truncated_polynomial_not_qh(n):
    # self-injective, not semisimple => not quasi-hereditary (Dlab-Ringel 1989; Ringel 2010)
    A = algebra_from_spec(
        {
            "field": "QQ",
            "quiver": {"vertices": ["x"], "arrows": ["t: x -> x"], "vanish_from_length": n},
        }
    )
    r = quasi_hereditary_orders(A)
    assert not r.quasi_hereditary and r.quasi_hereditary_total_orders == 0 and r.structures == 0


@pytest.mark.parametrize("n", [1, 2, 3, 4])
@pytest.mark.parametrize("field", [QQ, GF(2)])
def test_cyclic_nakayama_not_qh(n, field):
    # cyclic quiver with all paths of length 2 zero: self-injective, not qh (same sources)
    A = _cyclic_rad_square_zero(n, field)
    assert not is_quasi_hereditary(A)
    assert quasi_hereditary_orders(A).quasi_hereditary_total_orders == 0


def test_blocks_combine():
    # two copies of linear A_2 (derived): orders interleave, structures multiply
    spec = {
        "field": "QQ",
        "quiver": {"vertices": ["1", "2", "3", "4"], "arrows": ["a: 1 -> 2", "b: 3 -> 4"]},
    }
    r = quasi_hereditary_orders(algebra_from_spec(spec), list_limit=None)
    assert len(r.blocks) == 2
    assert r.quasi_hereditary_total_orders == factorial(4)  # hereditary (Dlab-Ringel)
    assert r.structures == catalan(2) ** 2
    assert len(r.structure_list) == 4


def test_many_blocks_stay_cheap():
    # 12 disjoint copies of k[x]/(x^2) and A_2: not qh; 12 copies of A_2 alone: counts exact (derived)
    vs, ar = [], []
    for k in range(12):
        vs += [f"u{k}", f"v{k}"]
        ar += [f"a{k}: u{k} -> v{k}"]
    A = algebra_from_spec({"field": "GF(5)", "quiver": {"vertices": vs, "arrows": ar}})
    r = quasi_hereditary_orders(A, list_limit=3)
    assert r.structures == 2**12
    assert r.quasi_hereditary_total_orders == factorial(24)
    assert len(r.structure_list) == 3 and not r.listed_all


@settings(max_examples=30, deadline=None)
@given(bound_quiver_algebras(max_vertices=3, max_arrows=3))
def test_global_dimension_two_implies_qh(A):
    # Dlab-Ringel, Auslander algebras as quasi-hereditary algebras (1989, from memory):
    # global dimension <= 2 => quasi-hereditary; Ringel, JPAA 214 (2010): qh => gl.dim <= 2n - 2.
    from hwcat.theory.homological import global_dimension

    g = global_dimension(A)
    qh = is_quasi_hereditary(A)
    if g.case == "finite" and g.value <= 2:
        assert qh
    if qh:
        assert g.case == "finite" and g.value <= 2 * A.n - 2


# -- the faster paths against the former ones (derived checks) ------------------------------------

from reference_search import closure_trace, reference_structures  # noqa: E402

from hwcat.theory.highest_weight import trace_cache  # noqa: E402
from hwcat.theory.search import count_structures  # noqa: E402
from hwcat.theory.traces import TraceCache  # noqa: E402


def _classes_by_permutation(A):
    """Every quasi-hereditary permutation grouped by its standard modules (exact traces)."""
    tc = TraceCache(A)
    classes = {}
    for perm in itertools.permutations(range(A.n)):
        S, sig, ok = 0, [None] * A.n, True
        for u in perm:
            if tc.step_failure(S, u) is not None:
                ok = False
                break
            sig[u] = tc.kernel_key(S, u)
            S |= 1 << u
        if ok:
            classes.setdefault(tuple(sig), []).append(perm)
    return classes


@settings(max_examples=40, deadline=None)
@given(bound_quiver_algebras(max_vertices=5, max_arrows=6))
def test_traces_are_sums_of_vertex_traces(A):
    # the cached trace of a set equals one closure from scratch (common practice: the
    # submodule generated by the spaces at T is the sum of those generated at each vertex)
    tc = TraceCache(A)
    for T in range(1 << A.n):
        for s in range(A.n):
            want = closure_trace(A, T, s)
            have = tc.kernel(T, s)
            assert [k.key() for k in have] == [k.key() for k in want]


@settings(max_examples=60, deadline=None)
@given(bound_quiver_algebras(max_vertices=5, max_arrows=6))
def test_structure_count_against_former_search(A):
    # counting by the dynamic programme = distinct tuples of standard modules carried explicitly
    orders, sigs = reference_structures(A)
    r = quasi_hereditary_orders(A, list_limit=None)
    assert r.quasi_hereditary_total_orders == orders
    assert r.structures == len(sigs) == count_structures(A)
    assert len(r.structure_list) == len(sigs) and r.listed_all
    # each listed structure is a different one (standard modules compared exactly)
    listed = set()
    for s in r.structure_list:
        S, key = 0, [None] * A.n
        tc = TraceCache(A)
        for u in s.representative:
            assert tc.step_failure(S, u) is None
            key[u] = tc.kernel_key(S, u)
            S |= 1 << u
        listed.add(tuple(key))
        # dimension vectors from cached traces = the modules built the former way
        P = total_order(A.vertices, s.representative)
        for L in range(A.n):
            assert s.standard_dimension_vectors[L] == standard_module(A, L, P).dims
            assert s.costandard_dimension_vectors[L] == costandard_module(A, L, P).dims
    assert listed == set(sigs)


@settings(max_examples=40, deadline=None)
@given(bound_quiver_algebras(max_vertices=4, max_arrows=5))
def test_representatives_are_smallest_orders(A):
    # every structure is listed once, by its lexicographically smallest order; and its
    # orders are the linear extensions of the essential order (Flores-Kimura-Rognerud,
    # arXiv:2004.04726; derived check by brute force over all permutations)
    classes = _classes_by_permutation(A)
    r = quasi_hereditary_orders(A, list_limit=None)
    assert sorted(s.representative for s in r.structure_list) == sorted(
        min(c) for c in classes.values()
    )
    for s in r.structure_list:
        ext = sorted(s.essential_order.linear_extensions())
        (members,) = [c for c in classes.values() if min(c) == s.representative]
        assert ext == sorted(members)


@settings(max_examples=40, deadline=None)
@given(linear_nakayama_algebras(min_vertices=2, max_vertices=7))
def test_nakayama_structures_against_former_search(A):
    orders, sigs = reference_structures(A)
    r = quasi_hereditary_orders(A, list_limit=3)
    assert (r.quasi_hereditary_total_orders, r.structures) == (orders, len(sigs))
    assert len(r.structure_list) == min(3, len(sigs))


@pytest.mark.parametrize("n", range(1, 11))
def test_linear_A_catalan_counted(n):
    # Flores-Kimura-Rognerud: Catalan(n) structures, counted without listing
    A = algebra_from_spec(linear_A(n))
    assert count_structures(A) == catalan(n)
    r = quasi_hereditary_orders(A, list_limit=2)
    assert r.structures == catalan(n) and len(r.structure_list) == min(2, catalan(n))


def test_decision_and_count_agree_on_a_shared_cache():
    # is_quasi_hereditary (depth first) and the full search use one cache and agree (derived)
    A = algebra_from_spec(auslander_truncated_polynomial(4))
    assert is_quasi_hereditary(A)
    assert trace_cache(A) is trace_cache(A)
    assert quasi_hereditary_orders(A, list_limit=0).structures == 1


@settings(max_examples=30, deadline=None)
@given(bound_quiver_algebras(max_vertices=6, max_arrows=4))
def test_blocks_by_bitmasks_match_networkx(A):
    # the search's own block split agrees with the hub's (networkx connected components)
    from hwcat.theory.search import _components

    assert _components(A) == A.components()


@settings(max_examples=40, deadline=None)
@given(bound_quiver_algebras(max_vertices=5, max_arrows=6))
def test_search_against_the_naive_upper_set_search(A):
    # benchmarks/naive_search.py: the same upper sets, every trace computed from scratch by a
    # closure along the arrows (the baseline of bench_orders.py; derived check).  The search
    # visits exactly the reachable sets, never more, and the decision agrees.
    import sys
    from pathlib import Path

    sys.path.insert(0, str(Path(__file__).resolve().parents[1] / "benchmarks"))
    from naive_search import naive_orders

    r = quasi_hereditary_orders(A, list_limit=3)
    orders, reachable = naive_orders(A)
    assert (r.quasi_hereditary_total_orders, r.reachable_sets) == (orders, reachable)
    assert r.quasi_hereditary == (orders > 0) == is_quasi_hereditary(A)
    assert len(r.structure_list) == min(3, r.structures)


# -- shortcuts of the search against the search without them (derived checks) ---------------------

import sys  # noqa: E402
from pathlib import Path  # noqa: E402

from hypothesis import strategies as st  # noqa: E402

import hwcat.theory.search as search_module  # noqa: E402
from hwcat.strategies import bound_quiver_specs  # noqa: E402

sys.path.insert(0, str(Path(__file__).resolve().parents[1] / "benchmarks"))
from naive_search import naive_orders  # noqa: E402


def _summary(r):
    return (
        r.quasi_hereditary,
        r.quasi_hereditary_total_orders,
        r.structures,
        r.reachable_sets,
        r.best_attempt,
        r.listed_all,
        [
            (
                s.representative,
                s.standard_dimension_vectors,
                s.costandard_dimension_vectors,
                s.relations,
            )
            for s in r.structure_list
        ],
    )


def _without_shortcuts(A, monkeypatch, list_limit=None):
    """The result with every block searched (no first-step test from dimensions, no reuse)."""
    with monkeypatch.context() as m:
        m.setattr(search_module, "_no_first_step", lambda A, comp: False)
        m.setattr(search_module, "_blocks", lambda A, comps: list(range(len(comps))))
        return quasi_hereditary_orders(A, list_limit=list_limit)


@settings(max_examples=60, deadline=None)
@given(bound_quiver_algebras(max_vertices=5, max_arrows=6))
def test_first_step_dimension_test_is_exact(A):
    # a block declared stuck has no vertex passing the full step test at the empty set
    tc = TraceCache(A)
    for comp in search_module._components(A):
        if search_module._no_first_step(A, comp):
            assert all(tc.step_failure(0, u) is not None for u in comp)
    # and the whole answer agrees with the naive heredity-chain search
    r = quasi_hereditary_orders(A)
    assert (r.quasi_hereditary_total_orders, r.reachable_sets) == naive_orders(A)


@settings(max_examples=40, deadline=None)
@given(
    st.lists(bound_quiver_specs(max_vertices=3, max_arrows=4), min_size=1, max_size=2),
    st.lists(st.integers(0, 1), min_size=2, max_size=4),
)
def test_equal_blocks_reused(specs, picks):
    # copies of random blocks (some equal, some not), against the search of every block
    vanish = {s["quiver"].get("vanish_from_length") for s in specs}
    same_field = len({s["field"] for s in specs}) == 1
    if len(vanish) > 1 or not same_field:  # not one spec: copies of the first
        specs = specs[:1]
    chosen = [specs[k % len(specs)] for k in picks]
    A = algebra_from_spec(disjoint_union(chosen))
    r = quasi_hereditary_orders(A, list_limit=None)
    with pytest.MonkeyPatch.context() as mp:
        want = _without_shortcuts(A, mp)
    assert _summary(r) == _summary(want)
    assert (r.quasi_hereditary_total_orders, r.reachable_sets) == naive_orders(A)
    if r.quasi_hereditary:
        s = r.structure_list[-1]
        P = total_order(A.vertices, s.representative)
        for L in range(A.n):
            assert s.standard_dimension_vectors[L] == standard_module(A, L, P).dims
            assert s.costandard_dimension_vectors[L] == costandard_module(A, L, P).dims


@settings(max_examples=40, deadline=None)
@given(
    bound_quiver_specs(max_vertices=3, max_arrows=4),
    st.integers(2, 3),
    st.randoms(use_true_random=False),
)
def test_equal_blocks_with_interleaved_vertices(spec, copies, rnd):
    # copies of one block whose vertices are listed in a shuffled order, so that the
    # bijection between equal blocks is a shift or not; against every block searched
    # and the naive search (common practice: the same answer however vertices are listed)
    union = disjoint_union([spec] * copies)
    vs = list(union["quiver"]["vertices"])
    rnd.shuffle(vs)
    union["quiver"]["vertices"] = vs
    A = algebra_from_spec(union)
    r = quasi_hereditary_orders(A, list_limit=None)
    with pytest.MonkeyPatch.context() as mp:
        want = _without_shortcuts(A, mp)
    assert _summary(r) == _summary(want)
    assert (r.quasi_hereditary_total_orders, r.reachable_sets) == naive_orders(A)


@pytest.mark.parametrize("n", [4, 5, 7])
def test_cyclic_nakayama_stuck_at_start(n):
    # cyclic Nakayama, rad^3 = 0: self-injective, not qh (same sources); answered without traces
    vs = [str(i) for i in range(n)]
    ar = [f"a{i}: {i} -> {(i + 1) % n}" for i in range(n)]
    A = algebra_from_spec(
        {"field": "QQ", "quiver": {"vertices": vs, "arrows": ar, "vanish_from_length": 3}}
    )
    r = quasi_hereditary_orders(A)
    assert (r.quasi_hereditary, r.quasi_hereditary_total_orders, r.reachable_sets) == (False, 0, 1)
    assert "traces" not in A._cache  # no trace was needed (n > 3: a dimension fails)


def test_blocks_of_one_shape_told_apart(monkeypatch):
    # linear A_3 with and without a*b = 0: same sizes, different algebras (derived)
    free = {
        "field": "QQ",
        "quiver": {"vertices": ["1", "2", "3"], "arrows": ["a: 1 -> 2", "b: 2 -> 3"]},
    }
    zero = {"field": "QQ", "quiver": {**free["quiver"], "relations": ["a*b"]}}
    for specs in ([free, zero, free], [zero, free, zero, zero]):
        A = algebra_from_spec(disjoint_union(specs))
        r = quasi_hereditary_orders(A, list_limit=None)
        assert _summary(r) == _summary(_without_shortcuts(A, monkeypatch))
        assert (r.quasi_hereditary_total_orders, r.reachable_sets) == naive_orders(A)


def test_trace_of_a_large_set_needs_no_deep_recursion():
    # a star: vertex 0 with an arrow to each of 400 others, so P(0) meets every vertex;
    # the trace of all leaves, asked for with nothing cached, is built in a loop (the
    # recursion of an earlier version went one level per vertex).  Value: the trace of
    # the leaves in P(0) is the span of the arrows, so P(0) / trace = the top (derived)
    import inspect
    import sys

    m = 400
    vs = ["c"] + [f"x{i}" for i in range(m)]
    A = algebra_from_spec(
        {
            "field": "GF(3)",
            "quiver": {"vertices": vs, "arrows": [f"a{i}: c -> x{i}" for i in range(m)]},
        }
    )
    tc = TraceCache(A)
    leaves = ((1 << (m + 1)) - 1) & ~1
    depth = len(inspect.stack())
    old = sys.getrecursionlimit()
    sys.setrecursionlimit(depth + 60)
    try:
        q, _, total = tc.row(leaves, 0)
    finally:
        sys.setrecursionlimit(old)
    assert total == 1 and q[0] == 1


def test_deprecated_name_and_bad_list_limit():
    # the old name warns under its own name; a negative listing limit is refused (common practice)
    from hwcat.theory.search import adapted_orders

    A = algebra_from_spec(linear_A(2))
    with pytest.warns(DeprecationWarning, match="adapted_orders is deprecated"):
        r = adapted_orders(A)
    assert r.structures == 2  # Catalan(2) (Flores, Kimura, Rognerud, arXiv:2004.04726)
    with pytest.raises(ValueError, match="list_limit"):
        quasi_hereditary_orders(A, list_limit=-1)
