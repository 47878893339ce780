"""The faster paths of ``hwcat check``'s homological section against reference paths.

Each faster path is compared with a slower computation of the same fact on
random small algebras (common practice: two computations must agree):

* Hom as images of generators, all matrices in one product per vertex,
  against the full intertwiner system (``hom_dimension_naive``) and the
  one-row conversion;
* universal extensions in generator coordinates against the flattened
  reference path and against ``dim Ext^1`` from a minimal resolution
  (``Ext^1(X, M) = Hom(Omega X, M)`` modulo restrictions: standard, from memory);
* locality of ``End(M)`` by the chain of images against the powers of the
  ideal; a direct sum of two nonzero modules never has a local endomorphism
  ring (from memory);
* tilting modules against Ringel's construction run with the reference paths;
* resolutions that continue through a simple syzygy with the simple's shared
  resolution against covers taken one by one from scratch.
"""

from __future__ import annotations

from hypothesis import HealthCheck, assume, given, settings
from hypothesis import strategies as st

from hwcat.errors import WorkBudgetExceeded
from hwcat.exact import Mat, complement, echelon
from hwcat.modules import direct_sum, hom, hom_dimension_naive, simple
from hwcat.modules.hom import hom_images, homomorphism_from_images, homomorphisms_from_images
from hwcat.modules.module import is_homomorphism, kernel_spaces
from hwcat.strategies import algebra_from_spec, bound_quiver_algebras, bound_quiver_specs, modules
from hwcat.theory.highest_weight import (
    costandard_filtration,
    standard_filtration,
    standard_module,
)
from hwcat.theory.homological import ext_dimension, global_dimension, projective_cover
from hwcat.theory.orders import total_order
from hwcat.theory.resolutions import _STEPS, _shared_simple, _steps
from hwcat.theory.search import quasi_hereditary_orders
from hwcat.theory.tilting import is_local_endomorphism_ring, tilting_modules, universal_extension

FAST = settings(max_examples=40, deadline=None, suppress_health_check=[HealthCheck.too_slow])
SMALL = bound_quiver_algebras(max_vertices=4, max_arrows=5, max_relations=2).filter(
    lambda A: A.dim <= 24
)


def _flat(f):
    return [x for m in f for x in m.entries()]


@FAST
@given(st.data())
def test_hom_images_against_the_naive_system(data):
    A = data.draw(SMALL)
    M = data.draw(modules(A))
    N = data.draw(modules(A))
    U = hom_images(M, N)
    H = homomorphisms_from_images(M, N, U)
    assert len(H) == hom_dimension_naive(M, N)
    assert hom(M, N) == H or [_flat(f) for f in hom(M, N)] == [_flat(f) for f in H]
    for r, f in enumerate(H):
        assert is_homomorphism(M, N, f)
        assert f == homomorphism_from_images(M, N, U.take_rows([r]))
    if H:  # a basis: the flattened maps are independent
        size = sum(M.dims[v] * N.dims[v] for v in range(A.n))
        F = A.field
        flat = Mat.from_flat(F, len(H), size, [x for f in H for x in _flat(f)])
        assert flat.rank() == len(H)


@FAST
@given(st.data())
def test_universal_extension_paths_agree(data):
    A = data.draw(SMALL)
    M = data.draw(modules(A))
    X = data.draw(modules(A, max_summands=1))
    assume(X.dim > 0)
    E, d = universal_extension(M, X)
    E2, d2 = universal_extension(M, X, method="flat")
    assert d == d2 == ext_dimension(X, M, 1)
    assert E.dims == E2.dims == tuple(m + d * x for m, x in zip(M.dims, X.dims, strict=True))


@FAST
@given(st.data())
def test_locality_paths_agree(data):
    A = data.draw(SMALL)
    M = data.draw(modules(A, max_summands=1))
    ones = [v for v in range(A.n) if M.dims[v] == 1]
    assume(ones)
    v = ones[0]
    assert is_local_endomorphism_ring(M, v) == is_local_endomorphism_ring(M, v, method="powers")
    # a nonzero module without L(v) beside M: the sum is decomposable
    others = [w for w in range(A.n) if M.dims[w] == 0]
    if others:
        S = direct_sum(M, simple(A, others[0]))
        assert not is_local_endomorphism_ring(S, v)
        assert not is_local_endomorphism_ring(S, v, method="powers")


def _reference_tilting(A, L, order):
    """Ringel's construction with the reference paths (flattened Ext, powers of the ideal)."""
    M = standard_module(A, L, order)
    ext = order.first_extension()
    for mu in ext[ext.index(L) + 1 :]:
        M, _ = universal_extension(M, standard_module(A, mu, order), method="flat")
    assert is_local_endomorphism_ring(M, L, method="powers")
    return M


@settings(max_examples=30, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(bound_quiver_algebras(max_vertices=4, max_arrows=5))
def test_tilting_modules_against_the_reference_construction(A):
    r = quasi_hereditary_orders(A, list_limit=1)
    assume(r.quasi_hereditary)
    P = total_order(A.vertices, r.structure_list[0].representative)
    for T in tilting_modules(A, P):
        R = _reference_tilting(A, T.vertex, P)
        assert T.module.dims == R.dims
        assert T.module.radical_layers() == R.radical_layers()
        assert T.standard_multiplicities == standard_filtration(R, P).multiplicities
        assert T.costandard_multiplicities == costandard_filtration(R, P).multiplicities


def _scratch_resolution(M, count):
    """Syzygy dimension vectors and cover summands, each cover taken from scratch."""
    out = []
    X = M
    for _ in range(count):
        if X.dim == 0:
            break
        c = projective_cover(X)
        K = kernel_spaces(c.cover, X, c.projection)
        X = c.cover.submodule([echelon(k) for k in K])
        out.append((c.summands, X.dims))
    return out


@FAST
@given(bound_quiver_algebras(max_vertices=4, max_arrows=5, max_relations=2))
def test_shared_simple_resolutions_against_scratch(A):
    for i in range(A.n):
        L = simple(A, i)
        try:
            steps = _steps(L, 6, 200)
        except WorkBudgetExceeded:  # syzygies can grow geometrically: compare what was built
            steps = L._memo[_STEPS]
        got = [(s.cover.summands, s.syzygy.dims) for s in steps]
        assert got == _scratch_resolution(simple(A, i), len(got))
        for k, s in enumerate(steps):  # each cover covers the syzygy before it
            assert s.cover.module is (L if k == 0 else steps[k - 1].syzygy)
    g = global_dimension(A, bound=6, max_syzygy_dimension=200)
    if g.case == "finite":  # every simple's resolution ends within the value, from scratch
        for i in range(A.n):
            res = _scratch_resolution(simple(A, i), g.value + 2)
            assert len(res) <= g.value + 1 and (not res or res[-1][1] == (0,) * A.n)


def _outcome(A, i, limit):
    try:
        return [(s.cover.summands, s.syzygy.dims) for s in _steps(simple(A, i), 6, limit)]
    except WorkBudgetExceeded as exc:
        return str(exc)


@FAST
@given(bound_quiver_specs(max_vertices=3, max_arrows=4, max_relations=2))
def test_shared_tails_obey_the_callers_budget(spec):
    # resolutions of the shared simples made first under a large budget must not let
    # a later resolution under a small budget go further than it would on its own
    A1, A2 = algebra_from_spec(spec), algebra_from_spec(spec)
    for j in range(A1.n):
        try:
            _steps(_shared_simple(A1, j), 6, 200)
        except WorkBudgetExceeded:
            pass
    for i in range(A1.n):
        assert _outcome(A1, i, 6) == _outcome(A2, i, 6)


@FAST
@given(st.data())
def test_submodules_and_quotients_on_the_support_against_every_vertex(data):
    """Submodule and quotient over the stored arrows agree entry for entry with the
    vertex-by-vertex reference (common practice: two computations must agree)."""
    A = data.draw(SMALL)
    M = data.draw(modules(A))
    vs = data.draw(st.lists(st.sampled_from(range(A.n)), max_size=A.n))
    for U in (M.trace_of_vertices(vs), M.radical_spaces(), M.zero_spaces(), M.full()):
        S, R = M.submodule(U), M.submodule(U, method="reference")
        Q, Qr = M.quotient(U), M.quotient(U, method="reference")
        for X, Y in ((S, R), (Q, Qr)):
            assert X.dims == Y.dims
            assert [(i, m.entries()) for i, m in X.maps.items()] == [
                (i, m.entries()) for i, m in Y.maps.items()
            ]
        Qp, pis = M.quotient_with_projection(U)
        assert Qp.dims == Q.dims and len(pis) == A.n
        for v in range(A.n):
            assert pis[v].shape == (M.dims[v], Q.dims[v])
            assert (U[v] @ pis[v]).is_zero()


@FAST
@given(st.data())
def test_generators_on_the_support_against_every_vertex(data):
    """Generators read over the support are the complements of ``rad M`` at every vertex
    (common practice: two computations must agree), and ``dim M`` is the sum of ``dims``."""
    A = data.draw(SMALL)
    M = data.draw(modules(A))
    expected = []
    for v, R in enumerate(M.radical_spaces()):
        expected.extend((v, row) for row in complement(R, M.dims[v]).split_rows())
    assert [(v, g.entries()) for v, g in M.generators()] == [(v, g.entries()) for v, g in expected]
    assert M.dim == sum(M.dims) and M.dim == sum(M.dims)  # computed, then kept
    for v, R in enumerate(M.radical_spaces()):
        imgs = [m for i, m in M.maps.items() if A.arrows[i].target == v]
        assert R.nrows == (Mat.vstack(A.field, imgs, M.dims[v]).rank() if imgs else 0)
