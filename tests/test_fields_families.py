"""Built-in families over GF(p^k) and cyclotomic / quadratic number fields."""

from __future__ import annotations

import subprocess
import sys

import pytest

from hwcat import describe, quasi_hereditary_orders
from hwcat.algebras.families.registry import family_algebra
from hwcat.algebras.families.tables import check_associative, small_quantum_sl2
from hwcat.errors import CoefficientError, NotSplitError, SpecError
from hwcat.exact import Mat, parse_field

# -- cyclic group algebras --------------------------------------------------------------
# x^m - 1 splits into distinct linear factors over GF(q) iff m | q - 1, and over QQ(zeta_m)
# (common practice): then k[C_m] = k[x]/(x^m - 1) is a product of m copies of k, so it has
# m one-dimensional simples and is semisimple (basic algebra of dimension m, Cartan = I).


@pytest.mark.parametrize(
    "field, m",
    [
        ("GF(4)", 3),
        ("GF(8)", 7),
        ("GF(16)", 3),
        ("GF(16)", 5),
        ("GF(9)", 4),
        ("GF(9)", 8),
        ("QQ(zeta3)", 3),
        ("QQ(zeta4)", 4),
        ("QQ(zeta5)", 5),
        ("QQ(zeta8)", 8),
    ],
)
def test_cyclic_group_splits(field, m):
    A = family_algebra("cyclic-group", m=m, field=field)
    assert A.n == m and A.dim == m and A.morita == (1,) * m
    assert describe(A).cartan == tuple(tuple(int(i == j) for j in range(m)) for i in range(m))


@pytest.mark.parametrize(
    "field, m, hint",
    [
        ("GF(2)", 3, "over GF(4) it splits"),
        ("GF(8)", 3, "over GF(64) it splits"),
        ("GF(4)", 5, "over GF(16) it splits"),
        ("QQ", 3, "over QQ(zeta3) it splits"),
        ("QQ", 4, "over QQ(zeta4) it splits"),
        ("GF(2)", 7, "over GF(8) it splits"),
    ],
)
def test_cyclic_group_not_split_names_a_field(field, m, hint):
    # when m does not divide q - 1 the simple of dimension e (the order of q mod m on that
    # orbit) has End = GF(q^e) (Wedderburn: finite division rings are fields; common practice)
    with pytest.raises(NotSplitError) as exc:
        family_algebra("cyclic-group", m=m, field=field)
    assert hint in str(exc.value)


def test_cyclic_group_in_characteristic_dividing_m():
    # GF(4)[C_6] = GF(4)[C_3] (x) GF(4)[C_2]: 3 simples, each projective of dimension 2
    # (common practice: the p-part of the group gives the Loewy length)
    A = family_algebra("cyclic-group", m=6, field="GF(4)")
    assert A.n == 3 and A.dim == 6
    assert describe(A).cartan == ((2, 0, 0), (0, 2, 0), (0, 0, 2))


# -- the restricted quantum group at even roots of unity -------------------------------------
# Feigin, Gainutdinov, Semikhatov, Tipunin, Comm. Math. Phys. 265 (2006) (from memory):
# at q a primitive 2p-th root of unity, dimension 2p^3, 2p simples of dimensions 1..p (two of
# each), centre of dimension 3p - 1.  Projective covers: dimension 2p for the simples of
# dimension s < p; the two simples of dimension p are projective (dimension p) -- derived
# from the dimension count sum_L dim L * dim P(L) = 2p^3, which forbids 2p for all of them.


def _centre_dimension(T) -> int:
    F = T.field
    n = T.dim
    gens = [T.basis.index(g) for g in ("E", "F", "K")]
    rows = []
    for i in range(n):
        row = []
        for g in gens:
            xg, gx = T.products.get((i, g), {}), T.products.get((g, i), {})
            row.extend(xg.get(k, F.zero) - gx.get(k, F.zero) for k in range(n))
        rows.append(row)
    return n - Mat.from_rows(F, rows).rank()


@pytest.mark.parametrize(
    "p, q, field",
    [
        (2, "2", "GF(5)"),
        (2, "zeta4", "QQ(zeta4)"),
        (2, "z^2", "GF(9)"),
        (3, "3", "GF(7)"),
        pytest.param(3, "zeta6", "QQ(zeta6)", marks=pytest.mark.slow),
    ],
)
def test_restricted_quantum_sl2(p, q, field):
    T = small_quantum_sl2(2 * p, q, field)
    assert T.dim == 2 * p**3
    assert check_associative(T)
    assert _centre_dimension(T) == 3 * p - 1
    A = family_algebra("small-quantum-sl2", ell=2 * p, q=q, field=field)
    assert sorted(A.morita) == sorted(list(range(1, p + 1)) * 2)
    d = describe(A)
    C = d.cartan
    for j, s in enumerate(A.morita):
        dim_P = sum(C[i][j] * A.morita[i] for i in range(A.n))
        assert dim_P == (2 * p if s < p else p)
        # Loewy structure of the projective cover of a simple of dimension s < p: the simple
        # on top and in the socle, two copies of a simple of dimension p - s in the middle
        # (same source, from memory)
        layers = d.projectives[j].radical_layers
        if s < p:
            assert len(layers) == 3 and layers[0] == layers[2] == tuple(
                int(i == j) for i in range(A.n)
            )
            mid = [(i, x) for i, x in enumerate(layers[1]) if x]
            assert len(mid) == 1 and mid[0][1] == 2 and A.morita[mid[0][0]] == p - s
        else:
            assert len(layers) == 1


def test_quantum_group_order_checked():
    with pytest.raises(SpecError, match="order"):
        small_quantum_sl2(4, "zeta8", "QQ(zeta8)")  # zeta8 has order 8, not 4
    with pytest.raises(CoefficientError):
        small_quantum_sl2(4, "zeta5", "QQ(zeta4)")


# -- Temperley-Lieb at loop weight sqrt(2) ------------------------------------------------------
# delta = sqrt(2) = q + 1/q with q a primitive 8th root of unity.  For n = 4 the cells have
# 0, 2, 4 through-strands (dimensions 2, 3, 1).  Derived by hand: the Gram matrix of the cell
# with 0 through-strands is [[d^2, d], [d, d^2]] with determinant d^4 - d^2 = 2 != 0, so that
# cell is simple and projective and stays alone; the cell with 2 through-strands has a Gram
# matrix of rank 2 and links with the cell with 4 (one-dimensional).  So: three simples of
# dimensions 1, 2, 2; one block {L_4, L_2} and one block {L_0}; quasi-hereditary.


@pytest.mark.parametrize(
    "delta, field", [("r", "QQ[r]/(r^2 - 2)"), ("zeta8 - zeta8^3", "QQ(zeta8)")]
)
def test_temperley_lieb_at_sqrt2(delta, field):
    A = family_algebra("temperley-lieb", n=4, delta=delta, field=field)
    assert sorted(A.morita) == [1, 2, 2]
    C = describe(A).cartan
    one = A.morita.index(1)
    linked = [j for j in range(3) if j != one and C[one][j]]
    alone = [j for j in range(3) if j != one and not C[one][j]]
    assert len(linked) == 1 and len(alone) == 1
    assert A.morita[linked[0]] == 2 and C[alone[0]] == tuple(int(k == alone[0]) for k in range(3))
    r = quasi_hereditary_orders(A, list_limit=0)
    assert r.quasi_hereditary and len(r.blocks) == 2


def test_family_parameters_outside_the_field():
    with pytest.raises(CoefficientError):
        family_algebra("temperley-lieb", n=3, delta="s", field="QQ[r]/(r^2 - 2)")
    with pytest.raises(CoefficientError):
        family_algebra("temperley-lieb", n=3, delta="1/2", field="GF(4)")


def test_cli_family_parameter_in_extension_field():
    def family(delta):
        argv = ["family", "temperley-lieb", "n=4", f"delta={delta}", "field=QQ[r]/(r^2 - 2)"]
        return subprocess.run(
            [sys.executable, "-m", "hwcat", *argv], capture_output=True, text=True
        )

    res = family("r")
    assert res.returncode == 0, res.stderr
    assert "QQ[r]/(r^2 - 2)" in res.stdout
    res = family("s")
    assert res.returncode == 2 and len(res.stderr.strip().splitlines()) == 1
    assert "'s'" in res.stderr and "delta" in res.stderr


def test_field_names_are_canonical():
    assert parse_field("GF(2^2)") is parse_field("GF(4)")
    assert parse_field("QQ[r]/(r^2-2)") is parse_field("QQ[r]/(r^2 - 2)")


def test_radical_over_gf4_by_both_routes():
    # GF(4)[C_6] = GF(4)[C_3] (x) GF(4)[x]/(x^2): radical of dimension 6 - 3 = 3 (common
    # practice); the quotient route and the lifted traces (refused off prime fields) agree
    from hwcat.algebras.families.tables import cyclic_group_algebra
    from hwcat.algebras.inputs.structure import from_table
    from hwcat.algebras.reduction.reduction import radical, reduce_algebra
    from hwcat.errors import StructureConstantsError

    A = from_table(cyclic_group_algebra(6, "GF(4)"))
    assert radical(A).nrows == 3
    assert reduce_algebra(A, method="quotient").basic.n == 3
    with pytest.raises(StructureConstantsError, match="prime field"):
        radical(A, "lifted-trace")
