"""Tensor products through coproducts (group algebras, the small quantum group) and module
actions extended from a generating set to the whole basis."""

from __future__ import annotations

import pytest

from hwcat.algebras.families.coproducts import family_coproduct, quantum_sl2_coproduct
from hwcat.algebras.families.registry import family_reduction
from hwcat.algebras.families.tables import small_quantum_sl2
from hwcat.algebras.inputs.structure import from_table
from hwcat.errors import ModuleFileError, StructureConstantsError
from hwcat.exact import Mat, parse_field
from hwcat.io.module_file import algebra_module, attach_algebra
from hwcat.modules.action import ActionModule, tensor_product
from hwcat.modules.basis_action import BasisAction
from hwcat.theory.decompose import decompose
from hwcat.theory.module_report import analyse_module

# (ell, q, field): q of multiplicative order exactly ell
CASES = [(3, 2, "GF(7)"), (4, 2, "GF(5)")]


def regular(ell, q, field):
    """u_q(sl_2) acting on itself by right multiplication (faithful)."""
    A = from_table(small_quantum_sl2(ell, q, field))
    gens = {x: A.right_action(A.basis_vector(A.basis.index(x))) for x in "EFK"}
    return A, ActionModule(A.field, A.dim, gens, name="regular")


def relations_hold(X: ActionModule, ell: int, q) -> list[str]:
    """The defining relations of the family (tables.small_quantum_sl2, the family's
    presentation), each checked on the matrices of ``X``; returns the failing ones."""
    F = X.field
    q = F(q)
    E, Fm, K = (X.element(g) for g in "EFK")
    one = Mat.identity(F, X.dim)
    Ki = K.inverse()
    N = ell if ell % 2 else ell // 2

    def power(Y, k):
        out = one
        for _ in range(k):
            out = out @ Y
        return out

    zero = Mat.zeros(F, X.dim, X.dim)
    checks = {
        "E^N = 0": power(E, N) == zero,
        "F^N = 0": power(Fm, N) == zero,
        "K^ell = 1": power(K, ell) == one,
        "K E = q^2 E K": K @ E == (E @ K).scale(q * q),
        "K F = q^-2 F K": K @ Fm == (Fm @ K).scale(F.one / (q * q)),
        "EF - FE = (K - K^-1)/(q - q^-1)": (E @ Fm - Fm @ E).scale(q - F.one / q) == K - Ki,
    }
    return [k for k, ok in checks.items() if not ok]


@pytest.mark.parametrize("ell, q, field", CASES)
def test_coproduct_respects_the_relations(ell, q, field):
    # the regular representation is faithful, and so is regular (x) regular for u (x) u
    # (common practice); the relations are those of the family's presentation
    A, R = regular(ell, q, field)
    assert relations_hold(R, ell, q) == []
    T = tensor_product(R, R, coproduct=quantum_sl2_coproduct())
    assert T.dim == A.dim**2
    assert relations_hold(T, ell, q) == []


def test_a_wrong_coproduct_breaks_a_relation():
    # the check above can fail: Delta(E) = E (x) 1 + 1 (x) E does not respect KE = q^2 EK
    from hwcat.algebras.families.coproducts import Coproduct

    _, R = regular(4, 2, "GF(5)")
    bad = Coproduct(
        "wrong",
        {
            "E": ((1, "E", "1"), (1, "1", "E")),
            "F": ((1, "F", "1"), (1, "K^-1", "F")),
            "K": ((1, "K", "K"),),
        },
        "wrong",
    )
    assert relations_hold(tensor_product(R, R, coproduct=bad), 4, 2) != []


def two_dimensional(field, q) -> ActionModule:
    """The two-dimensional simple: K = diag(q, 1/q), E and F the two matrix units
    (relations checked in the test below)."""
    F = parse_field(field)
    q = F(q)
    return ActionModule(
        F,
        2,
        {
            "E": Mat.from_rows(F, [[0, 1], [0, 0]]),
            "F": Mat.from_rows(F, [[0, 0], [1, 0]]),
            "K": Mat.from_rows(F, [[q, 0], [0, F.one / q]]),
        },
        name="X2",
    )


def reduced(ell, q, field):
    return family_reduction("small-quantum-sl2", ell=ell, q=str(q), field=field)


def identified(M: ActionModule, red):
    attach_algebra(M, "family", red.basic)
    return analyse_module(M, red.basic)


@pytest.mark.parametrize("ell, q, field", [(3, 2, "GF(7)"), (4, 2, "GF(5)"), (6, 3, "GF(7)")])
def test_two_dimensional_simple_squared(ell, q, field):
    X = two_dimensional(field, q)
    assert relations_hold(X, ell, q) == []
    T = tensor_product(X, X, coproduct="quantum-sl2")
    assert T.dim == 4  # dimensions multiply
    red = reduced(ell, q, field)
    r = identified(T, red)
    dims = sorted(s.dimension for s in r.summands)
    if ell == 4:
        # restricted form, p = 2: X(2) is projective and X(2) (x) X(2) = P(1), the
        # indecomposable projective cover of a one-dimensional simple, of dimension
        # 2p = 4 (Feigin, Gainutdinov, Semikhatov, Tipunin 2006, from memory)
        assert dims == [4]
        assert any(n.startswith("P(") for n, _ in r.summands[0].identified_as)
        assert r.summands[0].layers.loewy_length == 3
    else:
        # X(2) (x) X(2) = X(1) + X(3) (Clebsch-Gordan below the root of unity; for
        # p = 3 the three-dimensional simple is the projective X(p); FGST 2006 and the
        # Steinberg module for odd ell = 3, from memory)
        assert dims == [1, 3]
        assert all(
            any(n.startswith("L(") for n, _ in s.identified_as) or s.dimension > 1
            for s in r.summands
        )
        three = next(s for s in r.summands if s.dimension == 3)
        assert three.layers.loewy_length == 1  # simple
        assert any(n.startswith("P(") for n, _ in three.identified_as)


@pytest.mark.parametrize("ell, q, field", [(3, 2, "GF(7)"), (4, 2, "GF(5)")])
def test_projective_tensor_anything_is_projective(ell, q, field):
    # P (x) M is projective for a finite-dimensional Hopf algebra (from memory)
    red = reduced(ell, q, field)
    X = two_dimensional(field, q)
    for v in red.basic.vertices:
        P = algebra_module(f"P({v})", red)
        for T in (
            tensor_product(P, X, coproduct="quantum-sl2"),
            tensor_product(X, P, coproduct="quantum-sl2"),
        ):
            assert T.dim == 2 * P.dim
            r = identified(T, red)
            assert sum(s.dimension for s in r.summands) == T.dim
            for s in r.summands:
                assert any(n.startswith("P(") for n, _ in s.identified_as), s.identified_as


def test_non_projective_tensor_can_be_non_projective():
    # the check above can fail: the trivial module (one-dimensional, K = 1) is not
    # projective for ell = 4, and trivial (x) trivial is trivial (the counit)
    red = reduced(4, 2, "GF(5)")
    F = parse_field("GF(5)")
    triv = ActionModule(
        F, 1, {"E": Mat.zeros(F, 1, 1), "F": Mat.zeros(F, 1, 1), "K": Mat.identity(F, 1)}
    )
    r = identified(tensor_product(triv, triv, coproduct="quantum-sl2"), red)
    assert not any(n.startswith("P(") for n, _ in r.summands[0].identified_as)


def test_group_tensor_needs_group_like_generators():
    # the tensor product of two modules of C_3 over GF(3) through g -> g (x) g: the
    # regular module tensored with anything is free (common practice), here 3 copies of it
    from hwcat.algebras.families.registry import family_reduction as fr

    red = fr("cyclic-group", m=3, field="GF(3)")
    R = algebra_module("regular", red)
    triv = ActionModule(red.algebra.field, 1, {"g": Mat.identity(red.algebra.field, 1)})
    T = tensor_product(R, triv, coproduct=family_coproduct("cyclic-group", {}))
    D = decompose(T)
    assert sorted(s.dimension for s in D.summands) == [3]
    with pytest.raises(StructureConstantsError):
        tensor_product(
            R, ActionModule(red.algebra.field, 1, {"h": Mat.identity(red.algebra.field, 1)})
        )


def test_generating_set_extends_to_the_basis():
    # the regular module from E, F, K only: the extension must give right multiplication
    # by every PBW monomial, i.e. the regular representation (common practice)
    A, R = regular(4, 2, "GF(5)")
    act = BasisAction(A, A.dim, R.generators)
    assert act.failure() is None
    for i in range(A.dim):
        assert act.matrix(i) == A.right_action(A.basis_vector(i))
    with pytest.raises(ModuleFileError, match="do not generate"):
        BasisAction(A, A.dim, {"K": R.generators["K"]})


def test_centre_in_paths_acts_on_the_same_summands(monkeypatch):
    # above USER_TERMS_LIMIT the centre is written in paths of the basic algebra and acts
    # on the summands moved there; the summands on which some central element acts
    # non-semisimply do not depend on the basis of Z (commuting semisimple operators have
    # a semisimple sum over a perfect field: common practice)
    import hwcat.theory.centre as centre_module

    def run():
        red = reduced(4, 2, "GF(5)")
        X = two_dimensional("GF(5)", 2)
        r = identified(tensor_product(X, X, coproduct="quantum-sl2"), red)
        return r.centre, {i for _, ix in r.central_non_semisimple for i in ix}

    own, hit_own = run()
    monkeypatch.setattr(centre_module, "USER_TERMS_LIMIT", 10)
    paths, hit_paths = run()
    assert own.dimension == paths.dimension == 5  # 3p - 1 at p = 2 (FGST 2006, memory)
    assert own.terms.startswith("the input algebra's own terms")
    assert "16 > 10" in paths.terms and paths.terms.startswith("paths of the basic algebra")
    assert hit_own == hit_paths == {0}


def test_generating_set_extension_solves_when_single_products_do_not_suffice():
    # kS_3 over GF(5) in a random basis b'_i = sum_j P_ij sigma_j: products of basis
    # elements are combinations with several unknown terms, so the extension must solve
    # a linear system; the answer must be right multiplication in that basis (common
    # practice: the regular representation)
    import random

    from hwcat.algebras.families.tables import symmetric_group_algebra
    from hwcat.algebras.inputs.structure import StructureAlgebra

    G = from_table(symmetric_group_algebra(3, "GF(5)"))
    F = G.field
    rng = random.Random(3)
    while True:
        P = Mat.from_rows(F, [[rng.randrange(5) for _ in range(6)] for _ in range(6)])
        if P.rank() == 6:
            break
    Pi = P.inverse()
    rows = P.raw_rows()
    new = [list(r) for r in rows]
    products = {}
    for i in range(6):
        for j in range(6):
            xy = G.product(new[i], new[j])
            c = (Mat.from_rows(F, [xy]) @ Pi).entries()
            products[(i, j)] = {k: x for k, x in enumerate(c) if x != 0}
    names = [f"b{i}" for i in range(6)]
    A = StructureAlgebra(F, names, products, associativity="exact")
    R = {b: A.right_action(A.basis_vector(i)) for i, b in enumerate(names)}

    def generated(js):  # the dimension of the subalgebra generated, by plain products
        from hwcat.exact import echelon

        vecs = [A.unit] + [A.basis_vector(j) for j in js]
        for _ in range(6):
            vecs = [list(r) for r in echelon(Mat.from_rows(F, vecs)).raw_rows()]
            vecs += [A.product(x, A.basis_vector(j)) for x in vecs for j in js]
        return echelon(Mat.from_rows(F, vecs)).nrows

    assert generated([1, 2]) == 5  # these two do not generate (derived)
    with pytest.raises(ModuleFileError, match="do not generate"):
        BasisAction(A, 6, {"b1": R["b1"], "b2": R["b2"]})
    assert generated([0, 1]) == 6
    act = BasisAction(A, 6, {"b0": R["b0"], "b1": R["b1"]})
    assert act.failure() is None
    assert all(act.matrix(i) == R[b] for i, b in enumerate(names))
    # a wrong matrix for b1 (another element's) is caught
    bad = BasisAction(A, 6, {"b0": R["b0"], "b1": R["b4"]})
    assert bad.failure() is not None


@pytest.mark.parametrize("n, delta, field", [(4, "0", "GF(5)"), (5, "5/2", "GF(10007)")])
def test_spin_chain_is_a_module_of_the_family_table(n, delta, field):
    # every diagram of TL_n acts on the chain (through the e_i) so that all products of the
    # family's diagram table hold exactly (the chain is a TL_n(delta)-module: Jimbo 1986,
    # Martin 1991, from memory); the tree walk gives the same matrices as storing them
    import random

    from hwcat.algebras.families.registry import family_structure
    from hwcat.algebras.families.spin_chain import generator_diagrams
    from hwcat.io.module_file import spin_chain_module

    A = family_structure("temperley-lieb", n=n, delta=delta, field=field)
    M = spin_chain_module(n, delta, field)
    elements = {g: A.basis_vector(A.basis.index(d)) for g, d in generator_diagrams(n).items()}
    stored = BasisAction(A, M.dim, M.generators, elements=elements)
    assert stored.failure() is None
    tree = BasisAction(A, M.dim, M.generators, elements=elements, stored=False)
    rng = random.Random(1)
    xs = [[A.field(rng.randrange(7)) for _ in range(A.dim)] for _ in range(3)]
    assert tree.act(xs) == stored.act(xs)
