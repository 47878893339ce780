"""Quasi-heredity of the built-in families, decided on the reduced basic algebras.

Sources:

* S. Koenig, C. C. Xi, *When is a cellular algebra quasi-hereditary?*, Math.
  Ann. 315 (1999) 281-293 (memory): TL_n(delta) (cellular) is quasi-hereditary
  iff #simples = #cell modules; so TL_n(delta) with delta != 0 is, TL_n(0) with n
  even is not (its cell module without through strands has the zero form);
  TL_n(0) with n odd is semisimple (derived), hence quasi-hereditary.
* J. A. Green, *Polynomial Representations of GL_n*, LNM 830 (1980): Schur
  algebras are quasi-hereditary.
* A self-injective algebra that is not semisimple is never quasi-hereditary
  (a quasi-hereditary algebra has finite global dimension; common practice).
  Group algebras with p dividing |G| (Maschke, common practice) and the small
  quantum group (a Hopf algebra, from memory) are such.
* T. Bruestle, L. Hille, C. M. Ringel, G. Roehrle, Algebr. Represent. Theory 2
  (1999): the Auslander algebra of k[T]/(T^n) is quasi-hereditary.
"""

from __future__ import annotations

import pytest

from hwcat.algebras.families.registry import family_algebra

try:
    from hwcat.theory.highest_weight import is_quasi_hereditary
except ImportError:  # the check may live in the search module
    is_quasi_hereditary = pytest.importorskip("hwcat.theory.search").is_quasi_hereditary


@pytest.mark.parametrize(
    "n, delta, field",
    [(3, "1", "QQ"), (4, "1", "QQ"), (4, "2", "GF(3)"), (5, "1", "GF(3)"), (6, "-1", "GF(5)")],
)
def test_temperley_lieb_nonzero_delta_is_quasi_hereditary(n, delta, field):
    assert is_quasi_hereditary(family_algebra("temperley-lieb", n=n, delta=delta, field=field))


@pytest.mark.parametrize("n", [2, 4, 6])
def test_temperley_lieb_zero_even_is_not(n):
    assert not is_quasi_hereditary(family_algebra("temperley-lieb", n=n, delta="0", field="QQ"))


@pytest.mark.parametrize("n", [3, 5])
def test_temperley_lieb_zero_odd_is_semisimple_hence_qh(n):
    assert is_quasi_hereditary(family_algebra("temperley-lieb", n=n, delta="0", field="QQ"))


@pytest.mark.parametrize("r, p", [(2, 2), (3, 3), (4, 2), (5, 3), (6, 2), (6, 5)])
def test_schur_algebras_are_quasi_hereditary(r, p):
    assert is_quasi_hereditary(family_algebra("schur", r=r, field=f"GF({p})"))


@pytest.mark.parametrize(
    "family, params",
    [
        ("symmetric-group", {"n": 3, "field": "GF(2)"}),
        ("symmetric-group", {"n": 3, "field": "GF(3)"}),
        ("symmetric-group", {"n": 4, "field": "GF(2)"}),
        ("cyclic-group", {"m": 4, "field": "GF(2)"}),
        ("small-quantum-sl2", {"ell": 3, "q": "2", "field": "GF(7)"}),
    ],
)
def test_self_injective_non_semisimple_families_are_not(family, params):
    assert not is_quasi_hereditary(family_algebra(family, **params))


def test_semisimple_group_algebra_is_quasi_hereditary():
    assert is_quasi_hereditary(family_algebra("symmetric-group", n=3, field="GF(5)"))


@pytest.mark.parametrize("n", [2, 3, 4])
def test_auslander_algebra_is_quasi_hereditary(n):
    assert is_quasi_hereditary(family_algebra("auslander", n=n))


def test_cross_input_verdicts_agree():
    """A quiver algebra converted to structure constants and reduced back has the same
    verdict and the same number of quasi-hereditary orders (the search counts them; derived)."""
    from hypothesis import given, settings

    from hwcat.algebras.inputs.structure_input import from_basic_algebra
    from hwcat.algebras.reduction.reduction import reduce_algebra
    from hwcat.strategies import bound_quiver_algebras

    search = pytest.importorskip("hwcat.theory.search")

    @settings(max_examples=15, deadline=None)
    @given(bound_quiver_algebras(max_vertices=3))
    def check(B):
        C = reduce_algebra(from_basic_algebra(B)).basic
        assert is_quasi_hereditary(C) == is_quasi_hereditary(B)
        rb, rc = search.quasi_hereditary_orders(B), search.quasi_hereditary_orders(C)
        assert (rb.quasi_hereditary_total_orders, rb.structures) == (
            rc.quasi_hereditary_total_orders,
            rc.structures,
        )

    check()
