"""The simples of the table families carry the labels of the trade, and the natural
orders are quasi-hereditary where the literature says so."""

from math import comb

import pytest

import hwcat
from hwcat.algebras.families.labels import through_strands


def _cell_dimension(n: int, t: int) -> int:
    # dimension of the Temperley-Lieb cell module with t through strands:
    # binomial(n, (n-t)/2) - binomial(n, (n-t)/2 - 1) (common practice)
    k = (n - t) // 2
    return comb(n, k) - (comb(n, k - 1) if k else 0)


def _labelled(A) -> dict[str, int]:
    return dict(zip(A.vertices, A.morita, strict=True))


@pytest.mark.parametrize("n", [2, 3, 4, 5, 6])
def test_temperley_lieb_generic_labels_are_through_strands(n):
    # generic loop weight (delta = 3 over QQ is not q + 1/q for a root of unity q):
    # TL_n is semisimple and its simples are the cell modules, one for each number
    # t <= n of through strands with t = n mod 2 (common practice)
    A = hwcat.load(family="temperley-lieb", n=n, delta=3, field="QQ")
    assert _labelled(A) == {str(t): _cell_dimension(n, t) for t in range(n % 2, n + 1, 2)}
    assert A.natural_order == " > ".join(str(t) for t in range(n % 2, n + 1, 2))


@pytest.mark.parametrize(
    ("n", "delta", "field"),
    [
        (4, 1, "QQ"),
        (5, 0, "GF(3)"),
        (6, 0, "GF(5)"),
        (6, 2, "GF(3)"),
        (4, 0, "QQ"),
        (6, 1, "GF(2)"),
    ],
)
def test_temperley_lieb_labels_at_roots_of_unity(n, delta, field):
    # Koenig-Xi (Math. Ann. 315, 1999): the simples are labelled by the cells whose
    # bilinear form is nonzero; for TL_n(delta) every cell's form is nonzero except
    # the one with no through strands when delta = 0 and n is even (from memory).
    # The cell with n through strands is one-dimensional (the identity diagram only).
    A = hwcat.load(family="temperley-lieb", n=n, delta=delta, field=field)
    expected = {str(t) for t in range(n % 2, n + 1, 2)}
    if delta == 0 and n % 2 == 0:
        expected.discard("0")
    assert set(A.vertices) == expected
    assert _labelled(A)[str(n)] == 1
    # quasi-hereditary exactly when there are as many simples as cells (Koenig-Xi),
    # and then for the natural (cell) order
    qh = len(A.vertices) == len(range(n % 2, n + 1, 2))
    assert hwcat.quasi_hereditary_orders(A).quasi_hereditary == qh
    assert hwcat.check(A, homological=False).quasi_hereditary == qh
    assert hwcat.check(A, homological=False).order_source == "the family's natural order"


def _steinberg_dimension(a: int, b: int, p: int) -> int:
    # Steinberg's tensor product theorem for GL_2 (from memory): L(a, b) = det^b (x)
    # L(a - b), and dim L(m) = prod (m_i + 1) over the base-p digits m_i of m
    # (p = 0: dim L(m) = m + 1, Weyl's dimension formula)
    m = a - b
    if p == 0:
        return m + 1
    d = 1
    while m:
        d *= m % p + 1
        m //= p
    return d


@pytest.mark.parametrize(
    ("r", "field", "p"), [(3, "QQ", 0), (4, "GF(2)", 2), (5, "GF(3)", 3), (6, "GF(2)", 2)]
)
def test_schur_algebra_labels_are_dominant_weights(r, field, p):
    # S(2, r): one simple L(a, b) for each two-part partition (a, b) of r (Green 1980),
    # of the dimension Steinberg's theorem gives; quasi-hereditary for the dominance
    # order (Green 1980, from memory)
    A = hwcat.load(family="schur", r=r, field=field)
    expected = {f"w{r - b}_{b}": _steinberg_dimension(r - b, b, p) for b in range(r // 2 + 1)}
    assert _labelled(A) == expected
    assert A.natural_order == " > ".join(f"w{r - b}_{b}" for b in range(r // 2 + 1))
    assert hwcat.check(A, homological=False).quasi_hereditary


def test_small_quantum_group_labels_are_highest_weights():
    # u_q(sl_2) at an odd root of unity of order ell has one simple of each dimension
    # 1..ell (from memory); it is labelled by its highest weight dim - 1
    A = hwcat.load(family="small-quantum-sl2", ell=3, q=2, field="GF(7)")
    assert _labelled(A) == {"0": 1, "1": 2, "2": 3}
    assert A.natural_order is None


def test_through_strands_of_named_diagrams():
    # the diagram (1,2)(1',2')(3,3') has one through strand; the identity of TL_2 two (derived)
    assert through_strands("(1,2)(1',2')(3,3')") == 1
    assert through_strands("(1,1')(2,2')") == 2
    assert through_strands("(1,2)(1',2')") == 0


def test_labels_in_the_describe_report():
    A = hwcat.load(family="temperley-lieb", n=3, delta=1, field="QQ")
    r = hwcat.describe(A).to_dict()
    assert r["natural_order"] == "1 > 3" and set(r["simples"]) == {"1", "3"}


@pytest.mark.parametrize(("ell", "q", "field"), [(4, 2, "GF(5)"), (6, 3, "GF(7)")])
def test_restricted_quantum_group_labels_follow_the_projective_structure(ell, q, field):
    # restricted u_q(sl_2) at q a primitive 2p-th root of unity: simples X^+_s, X^-_s for
    # s = 1..p; X^+-_p are projective, and for s < p the projective cover of X^+-_s has
    # radical layers X^+-_s | 2 X^-+_(p-s) | X^+-_s (Feigin, Gainutdinov, Semikhatov,
    # Tipunin 2006, from memory): the sign flips in the middle layer
    p = ell // 2
    A = hwcat.load(family="small-quantum-sl2", ell=ell, q=q, field=field)
    assert _labelled(A) == {f"{sign}_{s}": s for sign in ("plus", "minus") for s in range(1, p + 1)}
    for sign, other in (("plus", "minus"), ("minus", "plus")):
        assert hwcat.projective(A, f"{sign}_{p}").dims == tuple(
            int(v == f"{sign}_{p}") for v in A.vertices
        )
        for s in range(1, p):
            layers = hwcat.projective(A, f"{sign}_{s}").radical_layers()
            named = [{A.vertices[v]: k for v, k in enumerate(layer) if k} for layer in layers]
            assert named == [{f"{sign}_{s}": 1}, {f"{other}_{p - s}": 2}, {f"{sign}_{s}": 1}]


def test_named_modules_of_a_labelled_family(tmp_path, capsys):
    # TL_4(1) over QQ: the simple L(2) (dimension 3) is alone in its block, so P(2) is a
    # one-dimensional representation of the basic algebra; P(0) has layers 0 | 4 and is
    # Delta(0) for the natural order (derived from the cell structure above)
    import json

    from hwcat.cli import main

    spec = tmp_path / "tl.toml"
    spec.write_text('field = "QQ"\n[family]\nname = "temperley-lieb"\nn = 4\ndelta = "1"\n')
    assert main(["module", str(spec), "--module", "P(2)", "--json"]) == 0
    data = json.loads(capsys.readouterr().out)
    assert [s["dimension"] for s in data["summands"]] == [1]
    assert main(["module", str(spec), "--module", "P(0)"]) == 0
    out = capsys.readouterr().out
    assert "radical layers: 0 | 4" in out and "is Delta(0)" in out
