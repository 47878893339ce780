"""The hub and modules store only the maps between nonzero spaces; the caching API.

The sparse storage is checked against the dense one (every matrix made
explicitly) on random algebras from :mod:`hwcat.strategies` (derived: both
describe the same representation).  Right multiplication is associative, so
acting by a basis path arrow by arrow gives the path's basis vector (common
practice).
"""

from __future__ import annotations

from hypothesis import HealthCheck, given, settings

from hwcat.algebras.hub.rep import ArrowMaps
from hwcat.exact import Mat
from hwcat.modules import Module, injective, projective
from hwcat.strategies import bound_quiver_algebras

FAST = settings(max_examples=40, deadline=None, suppress_health_check=[HealthCheck.too_slow])


@FAST
@given(bound_quiver_algebras(max_vertices=4, max_arrows=5))
def test_sparse_action_equals_dense(A):
    for s in range(A.n):
        dense = [A.action_matrix(s, i) for i in range(len(A.arrows))]
        stored = set(A.action_support(s))
        for i, m in enumerate(dense):
            a = A.arrows[i]
            assert m.shape == (A.block_dim(s, a.source), A.block_dim(s, a.target))
            assert (i in stored) == (not m.is_zero())
        # each basis path w = w' * a is reached by acting on w' with a
        index = {t: A.word_index(s, t) for t in range(A.n)}
        for t in range(A.n):
            for k, w in enumerate(A.words[s][t]):
                if not w:
                    continue
                a = A.arrows[w[-1]]
                prev = index[a.source][w[:-1]]
                row = Mat.unit_rows(A.field, A.block_dim(s, a.source), [prev]) @ dense[w[-1]]
                assert row == Mat.unit_rows(A.field, A.block_dim(s, t), [k])


@FAST
@given(bound_quiver_algebras(max_vertices=4, max_arrows=5))
def test_sparse_modules_equal_dense_modules(A):
    for s in range(A.n):
        for M in (projective(A, s), injective(A, s)):
            dense = Module(A, M.dims, [M.maps[i] for i in range(len(A.arrows))])
            assert isinstance(M.maps, ArrowMaps)
            assert dense.key() == M.key()
            assert dense.radical_layers() == M.radical_layers()
            assert dense.socle() == M.socle()
            assert [r.nrows for r in dense.radical_spaces()] == [
                r.nrows for r in M.radical_spaces()
            ]


def test_cached_computes_once():
    from hwcat.io.spec import load_spec_text

    A = load_spec_text('field = "QQ"\n[quiver]\nvertices = ["1", "2"]\narrows = ["a: 1 -> 2"]')
    calls = []
    assert A.cached(("x",), lambda: calls.append(1) or 7) == 7
    assert A.cached(("x",), lambda: calls.append(1) or 8) == 7
    assert calls == [1] and A.is_cached(("x",)) and not A.is_cached(("y",))
    assert projective(A, 0) is projective(A, 0)
