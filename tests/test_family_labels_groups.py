"""The simples of the group-algebra families carry the labels of the trade: p-regular
partitions (heads of Specht modules) for the symmetric groups, the generator's eigenvalue
for the cyclic groups.  The Specht modules here are built independently of
``hwcat.algebras.families.specht`` (sympy's permutation groups, spans of polytabloid
orbits)."""

import itertools
import math

import pytest
from sympy.combinatorics import Permutation, PermutationGroup
from sympy.utilities.iterables import partitions as sympy_partitions

import hwcat
from hwcat.algebras.families.specht import partition_label, specht_module
from hwcat.exact import Mat, parse_field
from hwcat.modules.action import ActionModule
from hwcat.theory.module_report import analyse_module


def _labelled(A) -> dict[str, int]:
    return dict(zip(A.vertices, A.morita, strict=True))


def _partitions(n: int) -> list[tuple[int, ...]]:
    # sympy's generator of partitions (as multiplicity dictionaries)
    return [
        tuple(sorted((k for k, m in d.items() for _ in range(m)), reverse=True))
        for d in sympy_partitions(n)
    ]


def _p_regular(lam, p) -> bool:
    return p == 0 or all(lam.count(x) < p for x in lam)


@pytest.mark.parametrize(
    ("n", "field", "expected"),
    [
        # dimensions of the simple modules D^lam from the decomposition matrices of small
        # symmetric groups (from memory)
        (3, "GF(2)", {"D3": 1, "D2_1": 2}),
        (3, "GF(3)", {"D3": 1, "D2_1": 1}),
        (4, "GF(2)", {"D4": 1, "D3_1": 2}),
        (4, "GF(3)", {"D4": 1, "D3_1": 3, "D2_2": 1, "D2_1_1": 3}),
        (5, "GF(2)", {"D5": 1, "D4_1": 4, "D3_2": 4}),
        (5, "GF(3)", {"D5": 1, "D4_1": 4, "D3_2": 1, "D3_1_1": 6, "D2_2_1": 4}),
        (5, "GF(5)", {"D5": 1, "D4_1": 3, "D3_2": 5, "D3_1_1": 3, "D2_2_1": 5, "D2_1_1_1": 1}),
        # three pairs of simples of equal dimension, told apart by class ranks
        (
            6,
            "GF(3)",
            {"D6": 1, "D5_1": 4, "D4_2": 9, "D4_1_1": 6, "D3_3": 1, "D3_2_1": 4, "D2_2_1_1": 9},
        ),
    ],
)
def test_symmetric_group_simples_are_p_regular_partitions(n, field, expected):
    A = hwcat.load(family="symmetric-group", n=n, field=field)
    assert _labelled(A) == expected
    # group algebras are self-injective, not quasi-hereditary unless semisimple: no natural
    # order (common practice)
    assert A.natural_order is None


@pytest.mark.parametrize(
    ("n", "field", "p"),
    [(2, "GF(2)", 2), (4, "GF(2)", 2), (5, "GF(3)", 3), (5, "GF(2)", 2), (6, "GF(5)", 5)],
)
def test_number_of_simples_is_the_number_of_p_regular_classes(n, field, p):
    # #simples of k S_n = #p-regular partitions = #conjugacy classes of elements of order
    # prime to p (common practice); the classes counted from sympy's group
    A = hwcat.load(family="symmetric-group", n=n, field=field)
    regular = [lam for lam in _partitions(n) if _p_regular(lam, p)]
    assert set(A.vertices) == {partition_label(lam) for lam in regular}
    G = PermutationGroup(Permutation(0, 1, size=n), Permutation(list(range(1, n)) + [0]))
    classes = {tuple(sorted(g.cycle_structure.items())) for g in G.elements if g.order() % p}
    assert len(A.vertices) == len(regular) == len(classes)


def _hook_dimension(lam) -> int:
    # the hook length formula (from memory)
    conj = [sum(1 for x in lam if x > c) for c in range(lam[0])]
    hooks = math.prod(lam[i] - c + conj[c] - i - 1 for i in range(len(lam)) for c in range(lam[i]))
    return math.factorial(sum(lam)) // hooks


@pytest.mark.parametrize(("n", "field"), [(3, "QQ"), (4, "QQ"), (4, "GF(5)"), (5, "GF(7)")])
def test_semisimple_symmetric_group_has_every_partition(n, field):
    # p = 0 or p > n: k S_n is semisimple (Maschke's theorem, common practice), every
    # partition labels a simple, of the dimension the hook length formula gives; every
    # total order is quasi-hereditary
    A = hwcat.load(family="symmetric-group", n=n, field=field)
    assert _labelled(A) == {partition_label(lam): _hook_dimension(lam) for lam in _partitions(n)}
    r = hwcat.quasi_hereditary_orders(A)
    assert r.quasi_hereditary_total_orders == math.factorial(len(A.vertices))
    assert hwcat.check(A, homological=False).quasi_hereditary


@pytest.mark.parametrize(("n", "field"), [(3, "GF(2)"), (4, "GF(3)"), (5, "GF(2)")])
def test_non_semisimple_symmetric_group_is_not_quasi_hereditary(n, field):
    # a non-semisimple self-injective algebra is quasi-hereditary for no order: a
    # quasi-hereditary algebra has finite global dimension, a non-semisimple
    # self-injective algebra infinite (common practice)
    A = hwcat.load(family="symmetric-group", n=n, field=field)
    assert not hwcat.check(A, homological=False).quasi_hereditary


# -- Specht modules built here, their heads found by hwcat's module analysis --------------------


def _specht_action(lam, n, F):
    """S^lam as a right module (row vectors, v.g = g^-1 v) of the group algebra in its basis
    order (permutations in lexicographic order of one-line notation): the span of the orbit
    of the polytabloid of the tableau filled row by row."""
    rows, start = [], 0
    for part in lam:
        rows.append(list(range(start, start + part)))
        start += part
    columns = [[r[c] for r in rows if len(r) > c] for c in range(lam[0])]
    # the column stabiliser as a sympy group, with signs
    gens = [Permutation(col[0], col[k], size=n) for col in columns for k in range(1, len(col))]
    C = PermutationGroup(gens) if gens else PermutationGroup(Permutation(list(range(n))))
    row_of = {x: i for i, r in enumerate(rows) for x in r}

    def tabloid(perm):  # {perm t}: entry perm(x) sits in the row of x
        out = [0] * n
        for x in range(n):
            out[perm(x)] = row_of[x]
        return tuple(out)

    poly = {}
    for s in C.elements:
        key = tabloid(s)
        poly[key] = poly.get(key, 0) + s.signature()
    tabloids = sorted(
        {
            tuple(t)
            for t in set(
                itertools.permutations([i for i, part in enumerate(lam) for _ in range(part)])
            )
        }
    )
    index = {t: i for i, t in enumerate(tabloids)}
    perms = list(itertools.permutations(range(n)))

    def act(vec, g):  # left action of g on tabloids: the entry x moves to g(x)
        out = [0] * len(tabloids)
        for t, c in enumerate(vec):
            if c:
                new = [0] * n
                for x, r in enumerate(tabloids[t]):
                    new[g[x]] = r
                out[index[tuple(new)]] += c
        return out

    e = [0] * len(tabloids)
    for t, c in poly.items():
        e[index[t]] += c
    orbit = Mat.from_rows(F, [act(e, g) for g in perms], len(tabloids))
    R, piv = orbit.rref()
    basis = [[R[i, j] for j in range(len(tabloids))] for i in range(len(piv))]

    def inverse(g):
        inv = [0] * n
        for x, y in enumerate(g):
            inv[y] = x
        return tuple(inv)

    mats = []
    for g in perms:
        images = [act(b, inverse(g)) for b in basis]
        mats.append(Mat.from_rows(F, [[row[j] for j in piv] for row in images], len(piv)))
    return ActionModule(
        F,
        len(piv),
        {  # a transposition and an n-cycle generate S_n
            "s": mats[perms.index((1, 0, *range(2, n)))],
            "c": mats[perms.index((*range(1, n), 0))],
        },
        basis_action=lambda i: mats[i],
        name=f"S^{lam}",
    )


@pytest.mark.parametrize(
    ("n", "field", "p"), [(4, "GF(2)", 2), (4, "GF(3)", 3), (5, "GF(2)", 2), (5, "GF(3)", 3)]
)
def test_each_label_is_the_head_of_its_specht_module(n, field, p):
    # James: for p-regular lam the Specht module S^lam has simple head D^lam (from memory);
    # the head is read off hwcat's radical layers of S^lam built above (derived)
    A = hwcat.load(family="symmetric-group", n=n, field=field)
    F = parse_field(field)
    for lam in _partitions(n):
        if not _p_regular(lam, p):
            continue
        report = analyse_module(_specht_action(lam, n, F), A)
        assert len(report.summands) == 1
        top = report.summands[0].layers.radical_layers[0]
        assert {A.vertices[v]: k for v, k in enumerate(top) if k} == {partition_label(lam): 1}
        assert report.summands[0].dimension == math.factorial(n) // math.prod(
            lam[i] - c + sum(1 for x in lam if x > c) - i - 1
            for i in range(len(lam))
            for c in range(lam[i])
        )


def test_specht_module_heads_match_the_algebra():
    # the library's own Specht construction agrees with the labelled algebra (derived)
    A = hwcat.load(family="symmetric-group", n=5, field="GF(3)")
    for v, d in _labelled(A).items():
        lam = tuple(int(x) for x in v[1:].split("_"))
        assert specht_module(lam, 3).head_dimension == d


# -- cyclic groups ---------------------------------------------------------------------------


@pytest.mark.parametrize(
    ("m", "field", "roots"),
    [
        # x^m - 1 splits into distinct linear factors over GF(q) iff m | q - 1 (common
        # practice); in characteristic p, k C_(p^a m') has the simples of k C_m'
        (6, "GF(7)", [1, 2, 3, 4, 5, 6]),
        (4, "GF(5)", [1, 2, 3, 4]),
        (4, "GF(2)", [1]),
        (6, "GF(3)", [1, 2]),
        (2, "QQ", [1, -1]),
        (1, "GF(3)", [1]),
    ],
)
def test_cyclic_group_simples_are_eigenvalues(m, field, roots):
    A = hwcat.load(family="cyclic-group", m=m, field=field)
    F = parse_field(field)
    names = {f"chi{c}" if c >= 0 else f"chim{-c}" for c in roots}
    assert set(A.vertices) == names and set(A.morita) == {1}
    assert A.natural_order is None
    # the one-dimensional module g -> c is the simple labelled chi<c> (derived)
    for c in roots:
        mats = [Mat.from_rows(F, [[F(c) ** k]], 1) for k in range(m)]
        M = ActionModule(
            F, 1, {"g": mats[min(1, m - 1)]}, basis_action=lambda i, mats=mats: mats[i]
        )
        report = analyse_module(M, A)
        factors = report.summands[0].layers.composition_factors
        assert factors == {f"chi{c}" if c >= 0 else f"chim{-c}": 1}


def test_cyclic_group_labels_over_an_extension_field():
    # GF(4) = GF(2)[z]/(z^2 + z + 1): the cube roots of unity are 1, z, z + 1 (common practice)
    A = hwcat.load(family="cyclic-group", m=3, field="GF(4)")
    assert set(A.vertices) == {"chi1", "chiz", "chizp1"}


def test_orders_name_the_partitions_on_the_command_line(capsys):
    import json

    from hwcat.cli import main

    # p > n: semisimple, every order is quasi-hereditary (Maschke's theorem, common practice)
    args = ["check", "--family", "symmetric-group", "n=3", "field=GF(5)", "--no-homological"]
    assert main([*args, "--order", "D1_1_1 > D2_1 > D3", "--json"]) == 0
    d = json.loads(capsys.readouterr().out)
    assert d["quasi_hereditary"] and set(d["simples"]) == {"D3", "D2_1", "D1_1_1"}
    # p <= n: self-injective and not semisimple, no order works (exit code 1)
    assert (
        main(["check", "--family", "symmetric-group", "n=3", "field=GF(3)", "--no-homological"])
        == 1
    )
    assert "NO order makes the algebra quasi-hereditary" in capsys.readouterr().out


def test_heads_that_cannot_be_told_apart_raise(monkeypatch):
    # S_5 over GF(2) has two simples of dimension 4 (D4_1, D3_2); if the heads built for
    # them were the same module, no invariant could tell them apart: the labeller must
    # raise rather than guess (derived)
    from hwcat.algebras.families import registry, specht
    from hwcat.errors import InternalInconsistency

    real = specht.specht_module
    monkeypatch.setattr(
        specht, "specht_module", lambda lam, p: real((4, 1) if lam == (3, 2) else lam, p)
    )
    with pytest.raises(InternalInconsistency, match="do not tell apart"):
        registry.family_reduction("symmetric-group", n=5, field="GF(2)")
