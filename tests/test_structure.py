"""Tests of structure-constant and matrix algebras (:mod:`hwcat.algebras.inputs.structure`,
:mod:`hwcat.algebras.inputs.structure_input`)
and of the ``[multiplication]`` and ``[matrices]`` spec kinds.

References used below:

* associativity of path algebras and of bound quiver algebras: I. Assem,
  D. Simson, A. Skowronski, *Elements of the Representation Theory of
  Associative Algebras* 1, LMS Student Texts 65 (2006) (from memory);
* matrix products and spans are recomputed with sympy (The SymPy Development
  Team, *SymPy: computer algebra in Python*) as an independent reference.
"""

from __future__ import annotations

import itertools
from fractions import Fraction

import pytest
import sympy
from hypothesis import given, settings
from hypothesis import strategies as st

from hwcat.algebras.families.tables import cyclic_group_algebra, symmetric_group_algebra
from hwcat.algebras.inputs.structure import EXACT_ASSOCIATIVITY_LIMIT, StructureAlgebra, from_table
from hwcat.algebras.inputs.structure_input import (
    from_basic_algebra,
    matrix_algebra,
    parse_products,
    structure_algebra,
)
from hwcat.cli import main
from hwcat.errors import CoefficientError, HwcatError, SpecError, StructureConstantsError
from hwcat.exact import GF, QQ, Mat
from hwcat.io.spec import load_spec_text
from hwcat.strategies import bound_quiver_algebras

DUAL = {("e", "e"): "e", ("e", "x"): "x", ("x", "e"): "x"}  # k[x]/(x^2), derived


def test_products_parse_and_multiply():
    A = structure_algebra(GF(5), ["e", "x"], DUAL, unit="e")
    assert A.dim == 2 and A.element_text(A.unit) == "e"
    x = A.element("2*e + 3*x")
    # (2 + 3x)^2 = 4 + 12x = 4 + 2x in GF(5)[x]/(x^2) (derived by hand)
    assert A.element_text(A.product(x, x)) == "4*e + 2*x"
    assert A.associativity.method == "exact"


def test_unit_is_found_or_refused():
    A = structure_algebra(QQ, ["e", "x"], DUAL)
    assert A.element_text(A.unit) == "e"
    with pytest.raises(StructureConstantsError, match="no identity"):
        structure_algebra(QQ, ["x"], {("x", "x"): 0})
    with pytest.raises(StructureConstantsError, match="not an identity"):
        structure_algebra(QQ, ["e", "x"], DUAL, unit="x")
    # a unit that is a sum of basis idempotents is found too
    B = structure_algebra(QQ, ["e1", "e2"], {("e1", "e1"): "e1", ("e2", "e2"): "e2"})
    assert B.element_text(B.unit) == "e1 + e2"


def test_unit_products_are_implied():
    # the table of the spec-format example: e*e, e*y, y*e are not listed
    A = structure_algebra(
        GF(7), ["e", "x", "y"], {("x", "x"): "y", ("x", "y"): 0, ("e", "x"): "x"}, unit="e"
    )
    assert A.element_text(A.product(A.element("e"), A.element("y"))) == "y"


@pytest.mark.parametrize(
    "rules, message",
    [
        (["x*z = x"], "'z' is not a basis element"),
        (["x*x = x", "x*x = 0"], "already given by rule"),
        (["x = x"], "product of two basis elements"),
        (["x*x = 2"], "bare number"),
        (["x*x = x = x"], "not of the form"),
    ],
)
def test_product_rule_errors(rules, message):
    with pytest.raises(StructureConstantsError, match=message):
        parse_products(rules, ["e", "x"], QQ)


def test_coefficient_errors():
    with pytest.raises(CoefficientError):
        parse_products(["x*x = 1/7*x"], ["e", "x"], GF(7))


def _nonassociative(n: int) -> StructureAlgebra:
    """The monoid algebra of ({0..n-1}, max) with b_1 b_1 = 2 b_1 (derived):
    (b_1 b_1) b_2 = 2 b_2 but b_1 (b_1 b_2) = b_2."""
    table = {(i, j): {max(i, j): 1} for i in range(n) for j in range(n)}
    table[(1, 1)] = {1: 2}
    return table


def test_associativity_exact_names_a_triple():
    with pytest.raises(StructureConstantsError, match=r"not associative: \("):
        StructureAlgebra(QQ, [f"b{i}" for i in range(5)], _nonassociative(5), [1, 0, 0, 0, 0])


def test_associativity_sampled_beyond_the_limit_and_exact_flag():
    n = EXACT_ASSOCIATIVITY_LIMIT + 5
    names = [f"b{i}" for i in range(n)]
    unit = [1] + [0] * (n - 1)
    good = {(i, j): {max(i, j): 1} for i in range(n) for j in range(n)}
    A = StructureAlgebra(GF(3), names, good, unit)
    assert A.associativity.method == "sampled"
    # stated failure probability: (1 - (2/3)^3)^t <= 10^-6 (Schwartz-Zippel style bound, derived)
    assert A.associativity.failure_bound == (1 - Fraction(2, 3) ** 3) ** A.associativity.trials
    assert A.associativity.failure_bound <= Fraction(1, 10**6)
    assert "random triples" in A.associativity.text()
    with pytest.raises(StructureConstantsError, match="not associative"):
        StructureAlgebra(GF(3), names, _nonassociative(n), unit)
    with pytest.raises(StructureConstantsError, match=r"not associative: \("):
        StructureAlgebra(GF(3), names, _nonassociative(n), unit, associativity="exact")


def test_family_tables_are_associative_exactly():
    for T in (symmetric_group_algebra(3, "GF(2)"), cyclic_group_algebra(5, "QQ")):
        A = from_table(T, associativity="exact")
        assert A.associativity.method == "exact"


@settings(max_examples=15, deadline=None)
@given(bound_quiver_algebras(max_vertices=3))
def test_quiver_algebras_as_tables_are_associative(B):
    """Bound quiver algebras are associative (ASS 2006, from memory): the exact check passes."""
    A = from_basic_algebra(B)
    assert A.dim == B.dim
    StructureAlgebra(A.field, A.basis, A.products_dict(), A.unit, associativity="exact")
    assert A.element_text(A.unit).count("e_") == B.n


def _sympy_span_dimension(mats, N):
    """Dimension of the unital algebra generated by ``mats``: words up to length N^2 (sympy)."""
    basis = [sympy.eye(N)]
    frontier = [sympy.eye(N)]
    while frontier:
        new = []
        for W in frontier:
            for G in mats:
                cand = W * G
                M = sympy.Matrix([list(b) for b in basis] + [list(cand)])
                if M.rank() > len(basis):
                    basis.append(cand)
                    new.append(cand)
        frontier = new
    return len(basis)


@settings(max_examples=12, deadline=None)
@given(
    st.integers(1, 3),
    st.lists(st.lists(st.integers(-2, 2), min_size=9, max_size=9), min_size=1, max_size=2),
)
def test_matrix_algebra_dimension_matches_sympy(N, entries):
    mats = [sympy.Matrix(N, N, e[: N * N]) for e in entries]
    gens = {
        f"G{i}": Mat.from_rows(QQ, [[int(v) for v in r] for r in m.tolist()])
        for i, m in enumerate(mats)
    }
    A = matrix_algebra(QQ, gens)
    assert A.dim == _sympy_span_dimension(mats, N)
    # structure constants reproduce the matrix products (checked with sympy)
    nat = [sympy.Matrix(M.tolist()).applyfunc(sympy.Rational) for M in A.natural]
    for i, j in itertools.product(range(A.dim), repeat=2):
        prod = A.product(A.basis_vector(i), A.basis_vector(j))
        lhs = sum((sympy.Rational(str(c)) * nat[k] for k, c in enumerate(prod)), sympy.zeros(N))
        assert lhs == nat[i] * nat[j]


def test_matrix_algebra_errors():
    E = Mat.from_rows(QQ, [[0, 1], [0, 0]])
    with pytest.raises(StructureConstantsError, match="not square"):
        matrix_algebra(QQ, {"M": Mat.from_rows(QQ, [[1, 2, 3], [4, 5, 6]])})
    with pytest.raises(StructureConstantsError, match="different sizes"):
        matrix_algebra(QQ, {"E": E, "I3": Mat.identity(QQ, 3)})


SPEC_MULT = """
name = "dual numbers"
field = "GF(7)"
[multiplication]
basis = ["e", "x", "y"]
unit = "e"
products = ["x*x = y", "x*y = 0", "e*x = x", "x*e = x"]
"""


def test_spec_multiplication_kind():
    B = load_spec_text(SPEC_MULT)
    # k[x]/(x^3): one simple, P of dimension 3 (derived)
    assert B.cartan() == ((3,),) and B.morita == (1,)


@pytest.mark.parametrize(
    "change, key",
    [
        (('"x*x = y"', '"x*z = y"'), "multiplication.products[0]"),
        (('"x*y = 0"', '"x*x = 0"'), "multiplication.products[1]"),
        (('unit = "e"', 'unit = "x"'), "multiplication.unit"),
        (('basis = ["e", "x", "y"]', 'basis = ["e", "x", "x"]'), "multiplication.basis[2]"),
        (('unit = "e"', 'unit = "e"\nfoo = 1'), "multiplication.foo"),
        (('"e*x = x"', '"e*x = 1/7*x"'), "multiplication.products[2]"),
    ],
)
def test_spec_multiplication_errors(change, key, tmp_path):
    text = SPEC_MULT.replace(*change)
    with pytest.raises(HwcatError) as info:
        load_spec_text(text, "alg.toml")
    assert str(info.value).startswith(f"alg.toml: {key}: ")
    f = tmp_path / "bad.toml"
    f.write_text(text)
    assert main(["describe", str(f)]) == 2


def test_spec_has_exactly_one_kind():
    with pytest.raises(SpecError, match="exactly one"):
        load_spec_text(SPEC_MULT + '\n[quiver]\nvertices = ["1"]\n', "alg.toml")


SPEC_MAT = """
field = "QQ"
[matrices.generators]
E = [[0, 1], [0, 0]]
K = [[1, 0], [0, "-1/2"]]
"""


def test_spec_matrices_kind():
    B = load_spec_text(SPEC_MAT)
    # upper triangular 2 x 2 matrices: the path algebra of 1 <- 2 (derived)
    assert sorted(map(sorted, B.cartan())) == [[0, 1], [1, 1]]
    assert B.dim == 3


@pytest.mark.parametrize(
    "change, key",
    [
        (('K = [[1, 0], [0, "-1/2"]]', "K = [[1, 0, 0], [0, 1, 0]]"), "matrices.generators"),
        (('K = [[1, 0], [0, "-1/2"]]', "K = [[1, 0], [0]]"), "matrices.generators.K"),
        (('K = [[1, 0], [0, "-1/2"]]', 'K = [[1, 0], [0, "a"]]'), "matrices.generators.K[1][1]"),
        (
            ('K = [[1, 0], [0, "-1/2"]]', "K = [[1, 0, 0], [0, 1, 0], [0, 0, 1]]"),
            "matrices.generators",
        ),
    ],
)
def test_spec_matrices_errors(change, key):
    with pytest.raises(HwcatError) as info:
        load_spec_text(SPEC_MAT.replace(*change), "m.toml")
    assert str(info.value).startswith(f"m.toml: {key}: ")
