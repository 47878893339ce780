"""Characteristic and minimal polynomials over extension fields (no flint routine there).

Checks: the Hessenberg route agrees with flint's characteristic polynomial over QQ
and GF(p) (the reference); over GF(4) and GF(9) the Cayley-Hamilton theorem holds
and the minimal polynomial is the least annihilating divisor of the characteristic
polynomial (common practice); matrices with entries in the prime field have the
characteristic polynomial they have over that field (common practice).  The module
command over GF(4): the regular module of the cyclic group of order 3 is the sum of
three one-dimensional simples, since x^3 - 1 splits into distinct linear factors
over GF(4) (3 divides 4 - 1; sources.md, common practice).
"""

from __future__ import annotations

import json

from hypothesis import given, settings
from hypothesis import strategies as st

from hwcat.cli import main
from hwcat.exact import GF, QQ, Mat, parse_field
from hwcat.exact.polys import charpoly, evaluate, hessenberg_charpoly, minpoly

small = st.integers(1, 6).flatmap(
    lambda n: st.tuples(st.just(n), st.lists(st.integers(-3, 3), min_size=n * n, max_size=n * n))
)


@settings(max_examples=60, deadline=None)
@given(small, st.sampled_from(["QQ", "GF(2)", "GF(7)"]))
def test_hessenberg_agrees_with_flint(case, name):
    n, vals = case
    F = QQ if name == "QQ" else GF(int(name[3:-1]))
    M = Mat.from_flat(F, n, n, [F(v) for v in vals])
    coeffs = hessenberg_charpoly(F, M.tolist())
    assert [F(c) for c in charpoly(M).coeffs()] == [F(c) for c in coeffs]


@settings(max_examples=40, deadline=None)
@given(small, st.sampled_from(["GF(4)", "GF(9)"]), st.data())
def test_cayley_hamilton_and_minimal_polynomial_over_extensions(case, name, data):
    n, _ = case
    F = parse_field(name)
    z, p = F("z"), F.characteristic  # GF(p^2) = GF(p)[z]: every element is a + b z
    elems = [F(a) + F(b) * z for a in range(p) for b in range(p)]
    rows = [[data.draw(st.sampled_from(elems)) for _ in range(n)] for _ in range(n)]
    M = Mat.from_rows(F, rows, n)
    chi, mu = charpoly(M), minpoly(M)
    assert chi.degree == n
    assert evaluate(chi, M).is_zero()
    assert evaluate(mu, M).is_zero()
    assert (chi % mu).degree < 0  # mu divides chi
    for f, _ in mu.factor():  # no proper divisor annihilates
        assert not evaluate(mu // f, M).is_zero()


def test_prime_field_entries_keep_their_polynomial():
    F4, F2 = parse_field("GF(4)"), GF(2)
    rows = [[1, 1, 0], [0, 1, 1], [1, 0, 1]]
    over4 = charpoly(Mat.from_rows(F4, [[F4(x) for x in r] for r in rows], 3))
    over2 = charpoly(Mat.from_rows(F2, [[F2(x) for x in r] for r in rows], 3))
    assert [str(c) for c in over4.coeffs()] == [str(c) for c in over2.coeffs()]


def test_module_of_the_cyclic_group_over_gf4(capsys):
    rc = main(
        [
            "module",
            "--family",
            "cyclic-group",
            "m=3",
            "field=GF(4)",
            "--module",
            "regular",
            "--json",
        ]
    )
    out = json.loads(capsys.readouterr().out)
    assert rc == 0
    assert [s["dimension"] for s in out["summands"]] == [1, 1, 1]
    assert len({s["isomorphism_class"] for s in out["summands"]}) == 3
