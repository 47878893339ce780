"""Tests of the built-in families (:mod:`hwcat.algebras.families.registry`) against outside facts.

Sources (as in the issue and ``sources.md``):

* Temperley-Lieb: ``dim TL_n = Catalan(n)``; the cell module with ``t = n - 2k``
  through strands has dimension ``binomial(n, k) - binomial(n, k - 1)``
  (standard).  A cellular algebra is quasi-hereditary iff its number of simples
  equals its number of cell modules: S. Koenig, C. C. Xi, *When is a cellular
  algebra quasi-hereditary?*, Math. Ann. 315 (1999) 281-293 (memory); the
  counts of simples below are the ones that criterion predicts.
* Schur algebras: ``dim S(2, r) = binomial(r + 3, 3)`` (J. A. Green,
  *Polynomial Representations of GL_n*, LNM 830, 1980); ``S(n, r)`` is
  semisimple iff ``p = 0``, ``p > r`` or ``(p, n, r) = (2, 2, 3)`` (S. Doty,
  D. Nakano, *Semisimple Schur algebras*, Math. Proc. Cambridge Philos. Soc. 124
  (1998), memory); ``S(2, r)`` has ``floor(r/2) + 1`` simples (Green).  The
  dimensions of its simples follow Steinberg's tensor product theorem for
  ``SL_2``, ``dim L(a) = prod (a_i + 1)`` over the p-adic digits of ``a``
  (from memory).
* Group algebras: Maschke's theorem and self-injectivity (common practice); the
  simples of ``k S_n`` in characteristic ``p`` are indexed by the p-regular
  partitions (from memory).
* The small quantum group ``u_q(sl_2)``, ``q`` of odd order ``ell``: a Hopf
  algebra, hence self-injective; simples ``L(0), ..., L(ell - 1)`` of dimensions
  ``1..ell``; ``L(ell - 1)`` is projective; the projective cover of any other
  ``L(i)`` has Loewy layers ``L(i) | L(ell - 2 - i)^2 | L(i)`` (from memory).
* Zigzag algebras of type ``A_n``: symmetric of dimension ``4n - 2`` (from
  memory); Auslander algebra of ``k[x]/(x^n)`` has ``n`` simples and dimension
  ``n(n+1)(2n+1)/6`` (from memory).
"""

from __future__ import annotations

from math import comb

import pytest

from hwcat.algebras.families.registry import FAMILIES, family_algebra, family_reduction, family_spec
from hwcat.algebras.reduction.presentation import presentation_toml
from hwcat.cli import main
from hwcat.errors import FieldError, SpecError
from hwcat.io.spec import load, load_spec_text
from hwcat.modules import projective


def catalan(n: int) -> int:
    return comb(2 * n, n) // (n + 1)


def cell_dims(n: int) -> list[int]:
    return sorted(comb(n, k) - (comb(n, k - 1) if k else 0) for k in range(n // 2 + 1))


@pytest.mark.parametrize("n", range(1, 8))
def test_temperley_lieb_dimension_is_catalan(n):
    from hwcat.algebras.families.registry import temperley_lieb

    assert temperley_lieb(n, 1, "GF(5)").dim == catalan(n)


@pytest.mark.parametrize("n", [2, 3, 4, 5, 6])
def test_generic_temperley_lieb_simples_are_the_cell_modules(n):
    """delta = 3 is not 2 cos(pi/m): TL_n(3) over QQ is semisimple, its simples are the cell modules."""
    r = family_reduction("temperley-lieb", n=n, delta="3", field="QQ")
    assert r.radical_dimension == 0
    assert sorted(r.simple_dimensions) == cell_dims(n)
    assert sum(d * d for d in cell_dims(n)) == catalan(n)


@pytest.mark.parametrize("n", [2, 4, 6])
def test_tl_zero_even_has_one_simple_fewer_than_cells(n):
    """TL_n(0), n even: the cell module without through strands has the zero form, so
    #simples = #cells - 1 (Koenig-Xi then says: not quasi-hereditary)."""
    r = family_reduction("temperley-lieb", n=n, delta="0", field="QQ")
    assert len(r.simple_dimensions) == n // 2  # cells: n // 2 + 1


@pytest.mark.parametrize("n", [3, 5, 7])
def test_tl_zero_odd_is_semisimple(n):
    """Derived: for n odd every cell form of TL_n(0) is nondegenerate (no cell without
    through strands), so TL_n(0) is semisimple with the cell modules as simples."""
    field = "QQ" if n < 7 else "GF(101)"
    r = family_reduction("temperley-lieb", n=n, delta="0", field=field)
    assert r.radical_dimension == 0 and sorted(r.simple_dimensions) == cell_dims(n)


@pytest.mark.parametrize(
    "n, delta, field", [(4, "1", "QQ"), (5, "1", "GF(3)"), (6, "2", "GF(3)"), (4, "-2", "GF(7)")]
)
def test_tl_nonzero_delta_has_as_many_simples_as_cells(n, delta, field):
    r = family_reduction("temperley-lieb", n=n, delta=delta, field=field)
    assert len(r.simple_dimensions) == n // 2 + 1


def steinberg_dim(a: int, p: int) -> int:
    d = 1
    while a:
        d *= a % p + 1
        a //= p
    return d


@pytest.mark.parametrize("p", [2, 3, 5, 7])
@pytest.mark.parametrize("r", [1, 2, 3, 4, 5, 6, 8])
def test_schur_algebra_2(p, r):
    red = family_reduction("schur", r=r, field=f"GF({p})")
    assert red.algebra.dim == comb(r + 3, 3)
    assert len(red.simple_dimensions) == r // 2 + 1
    semisimple = p > r or (p, r) == (2, 3)
    assert (red.radical_dimension == 0) == semisimple
    weights = [r - 2 * k for k in range(r // 2 + 1)]
    assert sorted(red.simple_dimensions) == sorted(steinberg_dim(a, p) for a in weights)


def test_schur_algebra_2_r10_in_several_characteristics():
    for p in (2, 3, 11):
        red = family_reduction("schur", r=10, field=f"GF({p})")
        assert len(red.simple_dimensions) == 6
        assert (red.radical_dimension == 0) == (p > 10)


def p_regular_partitions(n: int, p: int) -> int:
    def parts(m, largest):
        if m == 0:
            yield ()
            return
        for k in range(min(m, largest), 0, -1):
            for rest in parts(m - k, k):
                yield (k,) + rest

    return sum(1 for lam in parts(n, n) if all(lam.count(x) < p for x in set(lam)))


@pytest.mark.parametrize("n, p", [(3, 2), (3, 3), (4, 2), (4, 3), (5, 2), (5, 5), (4, 5)])
def test_symmetric_group_algebras(n, p):
    red = family_reduction("symmetric-group", n=n, field=f"GF({p})")
    assert len(red.simple_dimensions) == p_regular_partitions(n, p)
    order = 1
    for k in range(2, n + 1):
        order *= k
    assert (red.radical_dimension == 0) == (order % p != 0)


@pytest.mark.parametrize("m, p", [(4, 2), (6, 7), (3, 3), (6, 3)])
def test_cyclic_group_algebras(m, p):
    """F_p C_m with m = p^a m', p not dividing m': m' blocks when F_p has the m'-th roots of
    unity; each block is k[x]/(x^(p^a)) (common practice)."""
    red = family_reduction("cyclic-group", m=m, field=f"GF({p})")
    pa = 1
    while m % (pa * p) == 0:
        pa *= p
    assert red.simple_dimensions == (1,) * (m // pa)
    assert set(red.projective_dimensions) == {pa}


@pytest.mark.parametrize("ell, q, p", [(3, 2, 7), (5, 3, 11)])
def test_small_quantum_group_loewy_layers(ell, q, p):
    red = family_reduction("small-quantum-sl2", ell=ell, q=str(q), field=f"GF({p})")
    B = red.basic
    assert red.algebra.dim == ell**3
    assert sorted(red.simple_dimensions) == list(range(1, ell + 1))
    by_dim = {d: v for v, d in enumerate(red.simple_dimensions)}  # L(i) has dimension i + 1
    for i in range(ell):
        P = projective(B, by_dim[i + 1])
        layers = P.radical_layers()
        if i == ell - 1:
            assert len(layers) == 1  # the Steinberg module is projective
            continue
        other = by_dim[ell - 1 - i]
        assert len(layers) == 3
        assert layers[0][by_dim[i + 1]] == 1 and sum(layers[0]) == 1
        assert layers[1][other] == 2 and sum(layers[1]) == 2
        assert layers[2][by_dim[i + 1]] == 1 and sum(layers[2]) == 1


@pytest.mark.parametrize("n", [1, 2, 3, 4, 5])
def test_quiver_families(n):
    assert family_algebra("linear-a", n=n).dim == n * (n + 1) // 2  # path algebra of A_n
    assert family_algebra("linear-a", n=n, vanish_from_length=2).dim == 2 * n - 1
    assert family_algebra("alternating-a", n=n).dim == 2 * n - 1
    assert family_algebra("auslander", n=n).dim == n * (n + 1) * (2 * n + 1) // 6
    if n >= 2:
        assert family_algebra("zigzag-a", n=n).dim == 4 * n - 2


def test_family_spec_round_trips_through_the_presentation():
    B = family_algebra("auslander", n=3)
    B2 = load_spec_text(presentation_toml(B))
    assert B2.cartan() == B.cartan()
    assert family_spec("zigzag-a", n=3)["quiver"]["vanish_from_length"] == 3


def test_family_errors():
    with pytest.raises(SpecError, match="unknown family"):
        family_algebra("lie-algebra", n=2)
    with pytest.raises(SpecError, match="required"):
        family_algebra("schur")
    with pytest.raises(SpecError, match="unknown parameter"):
        family_algebra("schur", r=2, s=3)
    with pytest.raises(FieldError):
        family_algebra("schur", r=2, field="GF(4^0)")
    assert set(FAMILIES) >= {"temperley-lieb", "schur", "symmetric-group", "small-quantum-sl2"}


def test_cli_family_and_presentation(tmp_path, capsys):
    out = tmp_path / "tl.toml"
    assert main(["family", "temperley-lieb", "n=4", "delta=0", "--write-quiver", str(out)]) == 0
    text = capsys.readouterr().out
    assert "simple dimensions" in text and "reduced from an algebra of dimension 14" in text
    assert main(["describe", str(out)]) == 0
    assert main(["family", "--list"]) == 0
    assert main(["family", "schur", "r=oops"]) == 2
    spec = tmp_path / "m.toml"
    spec.write_text('field = "QQ"\n[matrices.generators]\nE = [[0, 1], [0, 0]]\n')
    assert main(["presentation", str(spec)]) == 0
    assert "[quiver]" in capsys.readouterr().out
    assert main(["family", "symmetric-group", "n=3", "field=GF(2)", "--json"]) == 0
    assert '"simple_dimensions": [' in capsys.readouterr().out


def test_cli_family_seed_as_a_parameter(capsys):
    # seed=N on the command line is an integer like a [family] table's seed (specs/FORMAT.md)
    assert main(["describe", "--family", "linear-a", "n=3", "seed=3"]) == 0
    capsys.readouterr()
    assert main(["family", "temperley-lieb", "n=4", "seed=3"]) == 0
    with_param = capsys.readouterr().out
    assert main(["family", "temperley-lieb", "n=4", "--seed", "3"]) == 0
    assert capsys.readouterr().out == with_param
    assert load(family="linear-a", n=3, seed=3).dim == 6


# -- disjoint unions of quiver specs ------------------------------------------------------


def test_disjoint_union_is_the_product_algebra():
    # the algebra of a disjoint union of connected bound quivers is the product of their
    # algebras: dimensions add, one block per part (networkx's weakly connected components
    # of the quiver), the Cartan matrix is block diagonal (common practice)
    import networkx as nx

    from hwcat.algebras.families.quivers import (
        auslander_truncated_polynomial,
        disjoint_union,
        linear_A,
        spec_to_toml,
        zigzag_A,
    )

    parts = [linear_A(3), auslander_truncated_polynomial(3), zigzag_A(3), linear_A(1)]
    parts = [{**p, "quiver": {**p["quiver"], "vanish_from_length": 4}} for p in parts]
    A = load_spec_text(spec_to_toml(disjoint_union(parts)))
    algebras = [load_spec_text(spec_to_toml(p)) for p in parts]
    assert A.dim == sum(B.dim for B in algebras)
    G = nx.MultiDiGraph()
    G.add_nodes_from(range(A.n))
    G.add_edges_from((a.source, a.target) for a in A.arrows)
    assert nx.number_weakly_connected_components(G) == len(parts)
    C = A.cartan()
    at = 0
    for B in algebras:
        assert tuple(row[at : at + B.n] for row in C[at : at + B.n]) == B.cartan()
        at += B.n
    assert sum(map(sum, C)) == sum(sum(map(sum, B.cartan())) for B in algebras)


def test_disjoint_union_refuses_mixed_parts():
    from hwcat.algebras.families.quivers import disjoint_union, linear_A

    with pytest.raises(SpecError, match="one field"):
        disjoint_union([linear_A(2), linear_A(2, field="GF(3)")])
    with pytest.raises(SpecError, match="vanish_from_length"):
        disjoint_union([linear_A(2), linear_A(3, vanish_from_length=2)])
    with pytest.raises(SpecError, match="at least one"):
        disjoint_union([])
