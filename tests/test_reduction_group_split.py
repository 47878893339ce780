"""The splitting search of a group algebra by sparse random elements agrees with the
general one (``reduction.GROUP_SPLIT`` on and off).

The two routes draw different random elements, so their idempotents differ; what must
agree is everything that does not depend on the choice: the simple and projective
dimensions, the Cartan matrix, the Gabriel quiver and the radical layers of every
projective of the basic algebra (all up to renaming the vertices), the radical.  Both
routes end with the exact identities ``dim A = sum dim L(i) dim P(i)`` (right and left).

Second, local corners certified directly (``reduction.FAST_LOCAL``): a multiplicative
residue map with a nilpotent kernel, against the radical by lifted traces.

Sources: the number of simple modules of the group algebra of S_n over GF(p) is the
number of p-regular partitions of n (from memory); a p-group over a field of characteristic p has
one simple module (from memory); the group algebra is symmetric, so its Cartan matrix is
symmetric (from memory).
"""

from __future__ import annotations

import itertools

import pytest
import sympy
from hypothesis import given, settings
from hypothesis import strategies as st
from test_reduction_fast_paths import _permutation_group_algebra  # sympy builds the group

import hwcat.algebras.families.tables as tables
from hwcat.algebras.inputs.structure import from_table
from hwcat.algebras.inputs.structure_input import from_basic_algebra
from hwcat.algebras.reduction import reduction
from hwcat.algebras.reduction.reduction import reduce_algebra
from hwcat.errors import NotSplitError
from hwcat.exact import GF, Mat
from hwcat.modules.module import projective
from hwcat.strategies import bound_quiver_algebras

pytest.importorskip("numpy")


def _invariants(r):
    """Per vertex: (dim L, dim P); and the matrices that must agree up to renaming."""
    B = r.basic
    m = B.n
    arrows = [[0] * m for _ in range(m)]
    for a in B.arrows:
        arrows[a.source][a.target] += 1
    layers = []
    for s in range(m):
        series = projective(B, s).radical_series()
        dims = [[X.nrows for X in layer] for layer in series]
        pairs = zip(dims, dims[1:], strict=False)
        layers.append(tuple(tuple(a - b for a, b in zip(u, v, strict=True)) for u, v in pairs))
    keys = list(zip(r.simple_dimensions, r.projective_dimensions, strict=True))
    return keys, B.cartan(), arrows, layers


def _assert_isomorphic_data(a, b):
    """Same simple/projective dimensions, Cartan matrix, Gabriel quiver and radical layers
    of the projectives, for some renaming of the vertices that keeps (dim L, dim P)."""
    assert a.simple_dimensions == b.simple_dimensions
    assert a.projective_dimensions == b.projective_dimensions
    assert a.radical_dimension == b.radical_dimension
    assert a.basic.dim == b.basic.dim
    keys, Ca, Qa, La = _invariants(a)
    keys_b, Cb, Qb, Lb = _invariants(b)
    assert keys == keys_b
    m = len(keys)
    groups = [[i for i in range(m) if keys[i] == k] for k in dict.fromkeys(keys)]
    for choice in itertools.product(*(itertools.permutations(g) for g in groups)):
        sigma = [0] * m  # vertex i of a is vertex sigma[i] of b
        for g, perm in zip(groups, choice, strict=True):
            for i, j in zip(g, perm, strict=True):
                sigma[i] = j
        if all(
            Ca[i][j] == Cb[sigma[i]][sigma[j]] and Qa[i][j] == Qb[sigma[i]][sigma[j]]
            for i in range(m)
            for j in range(m)
        ) and all(
            [[layer[sigma[v]] for v in range(m)] for layer in Lb[sigma[i]]]
            == [list(layer) for layer in La[i]]
            for i in range(m)
        ):
            return
    raise AssertionError("no renaming of the vertices matches the two reductions")


def _both(make):
    """The reduction with the sparse group route and with the general one."""
    old = reduction.GROUP_SPLIT
    try:
        reduction.GROUP_SPLIT = True
        try:
            fast = reduce_algebra(make())
        except NotSplitError:
            fast = "not split"
        reduction.GROUP_SPLIT = False
        try:
            plain = reduce_algebra(make())
        except NotSplitError:
            plain = "not split"
    finally:
        reduction.GROUP_SPLIT = old
    return fast, plain


@pytest.mark.parametrize(
    ("n", "field", "simples"),
    [(4, "GF(2)", 2), (4, "GF(3)", 4), (5, "GF(2)", 3), (5, "GF(3)", 5), (5, "GF(5)", 6)],
)
def test_symmetric_groups_agree_with_the_general_split(n, field, simples):
    make = lambda: from_table(tables.symmetric_group_algebra(n, field))  # noqa: E731
    assert make()._group_table() is not None
    fast, plain = _both(make)
    _assert_isomorphic_data(fast, plain)
    assert len(fast.simple_dimensions) == simples  # p-regular partitions of n
    C = fast.basic.cartan()
    assert all(C[i][j] == C[j][i] for i in range(len(C)) for j in range(len(C)))
    assert fast.radical().nrows == plain.radical().nrows == fast.radical_dimension


@settings(max_examples=15, deadline=None)
@given(
    st.lists(st.permutations(range(5)), min_size=1, max_size=2),
    st.sampled_from([GF(2), GF(3), GF(5), GF(7)]),
    st.integers(0, 2**16),
)
def test_random_permutation_groups_agree_with_the_general_split(gens, F, seed):
    make = lambda: _permutation_group_algebra([tuple(g) for g in gens], F)  # noqa: E731
    A = make()
    fast, plain = _both(make)
    if isinstance(fast, str) or isinstance(plain, str):
        # e.g. C_3 over GF(2): its two-dimensional simple needs GF(4) (from memory)
        assert fast == plain
        return
    _assert_isomorphic_data(fast, plain)
    if A._group_table() is not None:
        assert fast.method == plain.method == "split"
    # another seed of the sparse route gives the same data
    old = reduction.GROUP_SPLIT
    try:
        reduction.GROUP_SPLIT = True
        other = reduce_algebra(make(), seed=seed)
    finally:
        reduction.GROUP_SPLIT = old
    _assert_isomorphic_data(fast, other)


def test_a_p_group_has_one_simple_on_the_sparse_route():
    fast, plain = _both(lambda: from_table(tables.cyclic_group_algebra(16, "GF(2)")))
    assert fast.simple_dimensions == plain.simple_dimensions == (1,)
    assert fast.projective_dimensions == (16,)


# -- local corners certified directly (reduction.FAST_LOCAL) -------------------------


def _exactly_equal(a, b):
    assert a.simple_dimensions == b.simple_dimensions
    assert a.projective_dimensions == b.projective_dimensions
    assert a.idempotents == b.idempotents
    assert a.basic.cartan() == b.basic.cartan()
    assert a.basic.quiver.arrows == b.basic.quiver.arrows
    assert [[M.tolist() for M in ms] for ms in a.basic.action] == [
        [M.tolist() for M in ms] for ms in b.basic.action
    ]


def _with_fast_local(flag, fn):
    old = reduction.FAST_LOCAL
    try:
        reduction.FAST_LOCAL = flag
        return fn()
    finally:
        reduction.FAST_LOCAL = old


@settings(max_examples=20, deadline=None)
@given(bound_quiver_algebras(max_vertices=4, field=st.sampled_from([GF(2), GF(3), GF(7)])))
def test_local_certificate_gives_the_same_reduction(B):
    """Local corners of random algebras: the direct certificate and the radical by lifted
    traces give the same radical and residue map, hence the same reduction."""
    A = from_basic_algebra(B)
    fast = _with_fast_local(True, lambda: reduce_algebra(A))
    plain = _with_fast_local(False, lambda: reduce_algebra(A))
    _exactly_equal(fast, plain)


@pytest.mark.parametrize(("n", "field"), [(4, "GF(2)"), (4, "GF(3)"), (5, "GF(2)")])
def test_local_certificate_in_group_algebras(n, field):
    """Group algebras: corners that are not local are recognised the same way."""
    make = lambda: from_table(tables.symmetric_group_algebra(n, field))  # noqa: E731
    for split in (True, False):
        old = reduction.GROUP_SPLIT
        try:
            reduction.GROUP_SPLIT = split
            fast = _with_fast_local(True, lambda: reduce_algebra(make()))  # noqa: B023
            plain = _with_fast_local(False, lambda: reduce_algebra(make()))  # noqa: B023
        finally:
            reduction.GROUP_SPLIT = old
        _exactly_equal(fast, plain)


def test_local_certificate_rejects_a_split_corner():
    """A corner with two orthogonal idempotents (k x k) is not local; one that is a field
    extension (GF(4) over GF(2)) is left undecided for the general route."""
    F = GF(2)
    # k x k, basis (1, 0), (0, 1): right multiplication matrices
    e1 = Mat.from_flat(F, 2, 2, [1, 0, 0, 0])
    e2 = Mat.from_flat(F, 2, 2, [0, 0, 0, 1])
    one = Mat.from_flat(F, 1, 2, [1, 1])
    with pytest.raises(reduction._NotPrimitive):
        reduction._local_certificate(F, [e1, e2], one)
    # GF(4) = GF(2)[t]/(t^2 + t + 1), basis (1, t): x t in coordinates
    t = Mat.from_flat(F, 2, 2, [0, 1, 1, 1])
    assert (
        reduction._local_certificate(F, [Mat.identity(F, 2), t], Mat.from_flat(F, 1, 2, [1, 0]))
        is None
    )
    # k[x]/(x^2), basis (1, x): local with radical (x)
    x = Mat.from_flat(F, 2, 2, [0, 1, 0, 0])
    rad, chi = reduction._local_certificate(
        F, [Mat.identity(F, 2), x], Mat.from_flat(F, 1, 2, [1, 0])
    )
    assert rad == Mat.from_flat(F, 1, 2, [0, 1]) and chi == [F.one, F.zero]


@pytest.mark.parametrize("n, p, dims", [(4, 2147483647, [1, 1, 2, 3, 3]), (5, 536870909, None)])
def test_group_route_with_primes_near_two_to_the_31(n, p, dims):
    # sums of products of residues overflowed int64 for such primes; in characteristic
    # p > n the group algebra is semisimple (Maschke, common practice) with
    # dim A = sum dim L^2; the dimensions of the simples of S_4 (1, 1, 2, 3, 3, from
    # memory) are those of the characteristic-0 irreducibles
    assert sympy.isprime(p)
    A = from_table(tables.symmetric_group_algebra(n, f"GF({p})"))
    for seed in range(3):
        r = reduce_algebra(A, seed=seed)
        assert r.radical_dimension == 0
        assert sum(d * d for d in r.simple_dimensions) == A.dim
        if dims is not None:
            assert sorted(r.simple_dimensions) == dims


# -- the trace pairing of a group algebra (reduction.GROUP_TRACE_PAIRING) -------------


def _small_sketches(monkeypatch):
    """Thin products already at the sizes of these tests (the route runs from dimension 256)."""
    from hwcat.algebras.reduction import sketch

    monkeypatch.setattr(sketch, "MIN_SIZE", 0)
    monkeypatch.setattr(sketch, "START_WIDTH", 32)


@settings(max_examples=15, deadline=None)
@given(
    st.lists(st.permutations(range(5)), min_size=1, max_size=2),
    st.sampled_from([GF(2), GF(3), GF(5)]),
    st.integers(0, 2**16),
)
def test_trace_pairing_gives_the_rows_and_forms_of_the_general_route(gens, F, seed):
    """``e b_l`` and ``col(e b_l)`` through ``tau(x y) = tau(y x)`` against the matrix of
    left multiplication, for the reduction's idempotents and for random sparse elements
    (the identities hold for any element); derived."""
    import random

    from hwcat.algebras.reduction import sketch

    A = _permutation_group_algebra([tuple(g) for g in gens], F)
    if A._group_table() is None:
        return
    rng = random.Random(seed)
    p = F.p
    assert reduction._group_trace(A) == A.raw(A.trace_functional())
    elems = []
    try:
        elems += [A.raw(list(e)) for e in reduce_algebra(A, seed=seed).idempotents]
    except NotSplitError:
        pass
    for _ in range(3):
        y = [0] * A.dim
        for i in rng.sample(range(A.dim), min(A.dim, rng.randint(1, 3))):
            y[i] = rng.randrange(1, p)
        elems.append(y)
    old = (sketch.MIN_SIZE, sketch.START_WIDTH)
    try:
        sketch.MIN_SIZE, sketch.START_WIDTH = 0, 8
        for e in elems:
            RT = A._right_action_transposed(e, None)
            col = [rng.randrange(p) for _ in range(A.dim)]
            assert reduction._group_form_of_products(A, e, RT, col) == A._form_of_products(e, col)
            fast = reduction._group_right_ideal_basis(A, e, RT)
            with sketch.disabled():
                J, Lr = reduction._right_ideal_basis(A, e, None)
            if fast is not None:  # None: the rank is too large for a thin product here
                assert fast[0] == J
                assert fast[1] == Lr
    finally:
        sketch.MIN_SIZE, sketch.START_WIDTH = old


@pytest.mark.parametrize(("n", "field"), [(4, "GF(3)"), (5, "GF(2)"), (5, "GF(3)")])
def test_trace_pairing_gives_the_same_reduction(n, field, monkeypatch):
    """The same random elements, so exactly the same reduction with the trace pairing on
    and off (with thin products at this size, so that the route runs)."""
    _small_sketches(monkeypatch)
    make = lambda: from_table(tables.symmetric_group_algebra(n, field))  # noqa: E731
    monkeypatch.setattr(reduction, "GROUP_TRACE_PAIRING", True)
    fast = reduce_algebra(make())
    monkeypatch.setattr(reduction, "GROUP_TRACE_PAIRING", False)
    plain = reduce_algebra(make())
    _exactly_equal(fast, plain)


@pytest.mark.parametrize("k", [0, 1, 2, 5, 11, 12, 13])
def test_thin_products_padded_to_twelve_rows_are_exact(k):
    """``X @ M`` through the transpose of ``M``, with ``X`` padded by zero rows, against the
    plain product (derived)."""
    import random

    F = GF(3)
    rng = random.Random(k)
    n = 80
    M = Mat.from_flat(F, n, n, [rng.randrange(3) for _ in range(n * n)])
    X = Mat.from_flat(F, k, n, [rng.randrange(3) for _ in range(k * n)])
    out = reduction._times_transposed(X, M.transpose())
    assert out.nrows == k and out.ncols == n
    if k:
        assert out == X @ M


@pytest.mark.parametrize(("n", "field"), [(4, "GF(3)"), (5, "GF(2)")])
def test_matrices_built_in_spare_memory_give_the_same_reduction(n, field, monkeypatch):
    """Node matrices written into the memory of matrices no longer in use: exactly the
    same reduction as with fresh matrices (the same random elements); derived."""
    make = lambda: from_table(tables.symmetric_group_algebra(n, field))  # noqa: E731
    reused = reduce_algebra(make())
    monkeypatch.setattr(reduction._Spare, "LIMIT", 0)
    fresh = reduce_algebra(make())
    _exactly_equal(reused, fresh)


@pytest.mark.parametrize(("n", "field"), [(3, "GF(2)"), (4, "GF(3)"), (4, "GF(5)")])
def test_a_corner_that_is_not_local_comes_with_a_split(n, field):
    """Certifying the unit of a group algebra (its corner is the whole algebra, not local):
    the signal carries orthogonal idempotents, none zero, summing to the unit -- checked
    by the products of the algebra (derived)."""
    A = from_table(tables.symmetric_group_algebra(n, field))
    e = list(A._unit)
    with pytest.raises(reduction._NotPrimitive) as info:
        reduction._new_class(A, e, A._right_action_transposed(e, None), None, None)
    parts = info.value.parts
    assert parts is not None and len(parts) >= 2
    zero = [0] * A.dim
    for i, x in enumerate(parts):
        assert A.raw(x) != A.raw(zero)
        for j, y in enumerate(parts):
            assert A.raw(A.product(x, y)) == A.raw(x if i == j else zero)
    total = [sum(col) for col in zip(*parts, strict=True)]
    assert A.raw(total) == A._unit
    with pytest.raises(reduction._NotPrimitive) as info:  # the general check: no parts
        reduction.FAST_LOCAL = False
        try:
            reduction._new_class(A, e, A._right_action_transposed(e, None), None, None)
        finally:
            reduction.FAST_LOCAL = True
    assert not info.value.parts


@pytest.mark.parametrize(("n", "field"), [(4, "GF(3)"), (5, "GF(2)"), (5, "GF(3)")])
def test_simple_projectives_give_the_same_blocks(n, field, monkeypatch):
    """Blocks of a simple projective P(t) read off its corner (the others vanish in a
    symmetric algebra) against the blocks found by products with R_t: exactly the same
    basic algebra; derived.  S_4 and S_5 over GF(3) have simple projectives (blocks of
    defect zero, from memory)."""
    make = lambda: from_table(tables.symmetric_group_algebra(n, field))  # noqa: E731
    short = reduce_algebra(make())
    orig = reduction._new_class

    def without_corner_block(*args, **kwargs):
        cl = orig(*args, **kwargs)
        cl.corner_block = None
        return cl

    monkeypatch.setattr(reduction, "_new_class", without_corner_block)
    plain = reduce_algebra(make())
    _exactly_equal(short, plain)
    if field == "GF(3)":
        pairs = zip(short.projective_dimensions, short.simple_dimensions, strict=True)
        assert any(d == L for d, L in pairs)
