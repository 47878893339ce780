"""Fields GF(p^k), QQ(zetaN) and QQ[r]/(f): parsing, printing, and linear algebra
checked against sympy's general-purpose implementation (its finite extensions
``GF(p)[x]/(f)`` and its algebraic fields ``QQ<a>``) on random matrices."""

from __future__ import annotations

import random

import pytest
import sympy
from sympy import Poly, symbols
from sympy.polys.agca.extensions import FiniteExtension
from sympy.polys.matrices import DomainMatrix

from hwcat.errors import CoefficientError, FieldError, HwcatError
from hwcat.exact import GF, Mat, parse_field

X = symbols("x")

FIELDS = ["GF(4)", "GF(8)", "GF(9)", "GF(25, w)", "QQ(zeta8)", "QQ[r]/(r^2 - 2)", "QQ(zeta3)"]


def _sympy_field(K):
    """sympy's version of ``K`` with the same defining polynomial and generator."""
    coeffs = [int(c) if K.is_finite else sympy.Rational(str(c)) for c in K.modulus.coeffs()]
    f = sum(c * X**k for k, c in enumerate(coeffs))
    if K.is_finite:
        return FiniteExtension(Poly(f, X, modulus=K.characteristic))
    root = sympy.CRootOf(Poly(f, X), 0)
    return sympy.QQ.algebraic_field(root)


def _to_sympy(S, K, x):
    cs = x.coeffs()
    if K.is_finite:
        g = S.generator
        return sum((S.convert(int(c)) * g**k for k, c in enumerate(cs)), S.zero)
    return S([sympy.QQ(str(c)) for c in reversed(cs)])


def _from_sympy(S, K, y):
    if K.is_finite:
        cs = [int(c) for c in reversed(y.rep.to_list())] if hasattr(y.rep, "to_list") else None
        if cs is None:  # pragma: no cover - older sympy
            cs = [int(c) for c in reversed(Poly(y.rep.as_expr(), X).all_coeffs())]
        return K.from_coeffs([c % K.characteristic for c in cs])
    cs = [sympy.Rational(c) for c in reversed(y.to_list())]
    return K.from_coeffs([K.base.parse(str(c)) for c in cs])


def _random_elt(rng, K):
    if rng.random() < 0.3:
        return K.zero
    if K.is_finite:
        return K.from_coeffs([rng.randrange(K.characteristic) for _ in range(K.degree)])
    return K.from_coeffs(
        [K.base.parse(f"{rng.randint(-3, 3)}/{rng.randint(1, 2)}") for _ in range(K.degree)]
    )


def _random_mat(rng, K, r, c, rank=None):
    if rank is None or r == 0 or c == 0:
        return Mat.from_flat(K, r, c, [_random_elt(rng, K) for _ in range(r * c)])
    A = _random_mat(rng, K, r, rank)
    B = _random_mat(rng, K, rank, c)
    return A @ B


def _dm(S, K, M):
    rows = [[_to_sympy(S, K, x) for x in row] for row in M.raw_rows()]
    return DomainMatrix(rows, M.shape, S)


SHAPES = [(0, 0), (0, 3), (3, 0), (1, 1), (2, 3), (3, 2), (4, 4), (3, 5), (5, 4)]


@pytest.mark.parametrize("name", FIELDS)
def test_linear_algebra_against_sympy(name):
    K = parse_field(name)
    S = _sympy_field(K)
    rng = random.Random(name)
    for r, c in SHAPES:
        for _ in range(2):
            M = _random_mat(rng, K, r, c, rank=rng.randint(0, min(r, c)) if r and c else None)
            D = _dm(S, K, M)
            # rank and reduced echelon form (sympy gives an r x c form with zero rows at the end)
            DR, dpiv = D.rref(method="GJ") if r and c else (None, ())
            rk = len(dpiv)
            assert M.rank() == rk
            R, piv = M.rref()
            if r and c:
                assert piv == tuple(dpiv)
                want = [[_from_sympy(S, K, DR[i, j].element) for j in range(c)] for i in range(rk)]
                assert R.raw_rows() == want
            else:
                assert R.shape == (0, c) and piv == ()
            # nullspace: x M^T = 0 has exactly c - rank solutions, and they are killed
            Kr = M.right_kernel()
            assert Kr.shape == (c - rk, c)
            if r and Kr.nrows:
                assert (M @ Kr.transpose()).is_zero()
                assert Kr.rank() == c - rk
            if r and c and c - rk:
                # the kernel read off sympy's echelon form spans the same space as ours
                Rs = [[_from_sympy(S, K, DR[i, j].element) for j in range(c)] for i in range(rk)]
                free = [j for j in range(c) if j not in dpiv]
                theirs = []
                for f in free:
                    v = [K.zero] * c
                    v[f] = K.one
                    for i, p in enumerate(dpiv):
                        v[p] = -Rs[i][f]
                    theirs.append(v)
                assert Mat.vstack(K, [Kr, Mat.from_rows(K, theirs)]).rank() == c - rk
            # solve x M = b for b in the row space (solvable) and a random b
            if r:
                x0 = _random_mat(rng, K, 1, r)
                b = x0 @ M
                x = M.solve_left(b)
                assert x is not None and x @ M == b
                b2 = _random_mat(rng, K, 1, c)
                x2 = M.solve_left(b2)
                solvable = Mat.vstack(K, [M, b2]).rank() == rk
                assert (x2 is not None) == solvable
                if x2 is not None:
                    assert x2 @ M == b2
            # inverse of a square matrix of full rank, against sympy
            if r == c and r and rk == r:
                Mi = M.inverse()
                assert M @ Mi == Mat.identity(K, r)
                Di = D.hstack(DomainMatrix.eye(r, S)).rref(method="GJ")[0]
                assert Mi.raw_rows() == [
                    [_from_sympy(S, K, Di[i, r + j].element) for j in range(c)] for i in range(r)
                ]


@pytest.mark.parametrize("name", FIELDS)
def test_products_against_sympy(name):
    K = parse_field(name)
    S = _sympy_field(K)
    rng = random.Random(7)
    for a, b, c in [(0, 2, 3), (2, 0, 3), (2, 3, 0), (3, 3, 3), (2, 4, 1)]:
        A, B = _random_mat(rng, K, a, b), _random_mat(rng, K, b, c)
        P = A @ B
        if a and b and c:
            DP = _dm(S, K, A) * _dm(S, K, B)
            assert P.raw_rows() == [
                [_from_sympy(S, K, DP[i, j].element) for j in range(c)] for i in range(a)
            ]
        else:
            assert P.shape == (a, c) and P.is_zero()


@pytest.mark.parametrize("name", FIELDS)
def test_print_parse_round_trip(name):
    K = parse_field(name)
    rng = random.Random(3)
    for _ in range(30):
        x = _random_elt(rng, K)
        assert K.parse(str(x)) == x
        assert parse_field(K.name) is K
        if x:
            assert x * x.inverse() == K.one
            assert K.parse(f"({x}) / ({x})") == K.one


def test_default_polynomials_are_primitive():
    # sympy: irreducibility over GF(p); the order of z is q - 1 by listing its powers
    for p, k in [(2, 2), (2, 3), (2, 4), (3, 2), (3, 3), (5, 2), (7, 2)]:
        K = parse_field(f"GF({p}^{k})")
        q = p**k
        assert K.name == f"GF({q})"
        f = Poly([int(c) for c in reversed(K.modulus.coeffs())], X, modulus=p)
        assert f.is_irreducible
        z, x, seen = K.gen, K.one, set()
        for _ in range(q - 1):
            seen.add(str(x))
            x = x * z
        assert x == K.one and len(seen) == q - 1


def test_documented_moduli():
    # the defining polynomials quoted in specs/FORMAT.md and the exact layer
    assert parse_field("GF(4)").modulus_text() == "z^2 + z + 1"
    assert parse_field("GF(8)").modulus_text() == "z^3 + z + 1"
    assert parse_field("GF(9)").modulus_text() == "z^2 + z + 2"
    assert parse_field("GF(16)").modulus_text() == "z^4 + z + 1"


def test_cyclotomic_generator_is_a_primitive_root():
    for n in [3, 4, 5, 8, 12]:
        K = parse_field(f"QQ(zeta{n})")
        z = K.gen
        powers = [z**k for k in range(1, n + 1)]
        assert powers[-1] == K.one and all(w != K.one for w in powers[:-1])
        assert K.degree == sympy.totient(n)


@pytest.mark.parametrize(
    "text, fragment",
    [
        ("GF(6)", "not a prime power"),
        ("GF(1)", "not a prime power"),
        ("GF(4^2)", "4 is not a prime"),
        ("QQ[r]/(r^2 - 4)", "factor r - 2"),
        ("QQ[s]/(s^4 - 1)", "reducible"),
        ("QQ[r]/(2*r^2 - 1)", "not monic"),
        ("GF(2)[w]/(w^2 + 1)", "factor w + 1"),
        ("QQ[r]/(r^2 - t)", "unknown name 't'"),
        ("QQ(zeta1)", "use QQ"),
        ("GF(4)[w]/(w^2 + z)", "base of a quotient"),
    ],
)
def test_bad_fields(text, fragment):
    with pytest.raises(FieldError) as exc:
        parse_field(text)
    assert fragment in str(exc.value)


def test_bad_coefficients():
    K = parse_field("QQ[r]/(r^2 - 2)")
    for text in ["s + 1", "r +", "1/0", "(r", "r^r", "2.5"]:
        with pytest.raises(CoefficientError):
            K.parse(text)
    F = parse_field("GF(4)")
    with pytest.raises(CoefficientError, match="division by zero"):
        F.parse("1/2")
    with pytest.raises(HwcatError):
        F(parse_field("GF(8)").gen)
    assert F.parse("z^3") == F.one and F(GF(2).one) == F.one


def test_matrices_over_different_fields_differ():
    A = Mat.from_rows(parse_field("GF(4)"), [[1]])
    B = Mat.from_rows(parse_field("GF(8)"), [[1]])
    assert A != B
