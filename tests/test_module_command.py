"""The ``hwcat module`` command: module files, named modules, bad input, JSON keys."""

from __future__ import annotations

import json
from pathlib import Path

import pytest

from hwcat.cli import main
from hwcat.io.spec import load_spec_text
from hwcat.modules import projective
from hwcat.modules.action import from_representation
from hwcat.theory.decompose import decompose

EXAMPLES = Path(__file__).resolve().parent.parent / "specs" / "examples"

QUIVER = """
field = "QQ"
[quiver]
vertices = ["1", "2", "3"]
arrows = ["a: 1 -> 2", "b: 2 -> 3"]
relations = ["a*b"]
"""

GROUP = """
field = "GF(3)"
[multiplication]
basis = ["e", "g", "h"]
unit = "e"
products = ["g*g = h", "g*h = e", "h*g = e", "h*h = g", "e*g = g", "g*e = g", "e*h = h", "h*e = h", "e*e = e"]
"""

MATRICES = """
field = "GF(5)"
[matrices.generators]
u = [[1, 1, 0], [0, 1, 1], [0, 0, 1]]
"""


def write(tmp_path: Path, name: str, text: str) -> str:
    p = tmp_path / name
    p.write_text(text, encoding="utf-8")
    return str(p)


def run_json(capsys, argv) -> dict:
    assert main(argv + ["--json"]) == 0
    return json.loads(capsys.readouterr().out)


def run_error(capsys, argv) -> str:
    assert main(argv) == 2
    err = capsys.readouterr().err.strip()
    assert "\n" not in err
    return err


def test_demo_has_a_diamond_and_a_jordan_block_of_size_two(capsys):
    d = run_json(
        capsys, ["module", str(EXAMPLES / "plaquette.toml"), "--element", "X", "--element", "X + Y"]
    )
    assert d["dimension"] == 5 and d["endomorphism_dimension"] == 7
    dims = sorted(s["dimension"] for s in d["summands"])
    assert dims == [1, 4] == sorted(s["dimension"] for s in d["summands"])
    diamond = next(s for s in d["summands"] if s["dimension"] == 4)
    assert [sum(layer) for layer in diamond["radical_layers"]] == [1, 2, 1]
    names = {x["name"] for x in diamond["identified_as"]}
    assert {"P(1)", "I(1)", "projective-injective"} <= names
    assert {"degree": 1, "size": 2, "eigenvalue": 0} in d["jordan_types"]["X"]
    assert sorted(b["size"] for b in d["jordan_types"]["X + Y"]) == [1, 1, 3]
    assert d["centre"]["dimension"] == 4
    assert any(x["summands"] for x in d["centre"]["non_semisimple_on_summands"])


def test_module_file_for_a_quiver_spec(tmp_path, capsys):
    spec = write(tmp_path, "q.toml", QUIVER)
    mod = write(
        tmp_path,
        "m.toml",
        "[dimensions]\n1 = 1\n2 = 1\n3 = 1\n[matrices]\na = [[1]]\nb = [[0]]\n",
    )
    d = run_json(capsys, ["module", spec, "--module", mod, "--element", "a + e_1"])
    assert sorted(s["dimension"] for s in d["summands"]) == [1, 2]
    assert d["composition_factors"] == {"1": 1, "2": 1, "3": 1}
    assert sum(s["dimension"] for s in d["summands"]) == d["dimension"]


def test_violated_relation_is_named(tmp_path, capsys):
    spec = write(tmp_path, "q.toml", QUIVER)
    mod = write(
        tmp_path, "m.toml", "[dimensions]\n1 = 1\n2 = 1\n3 = 1\n[matrices]\na = [[1]]\nb = [[2]]\n"
    )
    err = run_error(capsys, ["module", spec, "--module", mod])
    assert "m.toml" in err and "'a*b'" in err


@pytest.mark.parametrize(
    "text, needle",
    [
        ("[dimensions]\n1 = 1\n2 = 1\n[matrices]\nc = [[1]]\n", "matrices.c"),
        ("[dimensions]\n1 = 2\n2 = 1\n[matrices]\na = [[1]]\n", "1 x 1 matrix where 2 x 1"),
        ("[dimensions]\n7 = 1\n[matrices]\n", "dimensions.7"),
        ('field = "GF(5)"\n[dimensions]\n1 = 1\n[matrices]\n', "field"),
        ("not toml [", "not valid TOML"),
    ],
)
def test_bad_quiver_module_files(tmp_path, capsys, text, needle):
    spec = write(tmp_path, "q.toml", QUIVER)
    mod = write(tmp_path, "bad.toml", text)
    err = run_error(capsys, ["module", spec, "--module", mod])
    assert "bad.toml" in err and needle in err


def test_matrices_module_file_checks_the_algebra_relations(tmp_path, capsys):
    spec = write(tmp_path, "u.toml", MATRICES)
    # (u - 1)^3 = 0 holds for a 2 x 2 unipotent block, but (u - 1)^2 = 0 is not required
    ok = write(tmp_path, "ok.toml", "dimension = 2\n[matrices]\nu = [[1, 1], [0, 1]]\n")
    d = run_json(capsys, ["module", spec, "--module", ok, "--element", "u - 1"])
    assert d["jordan_types"]["u - 1"] == [{"degree": 1, "size": 2, "eigenvalue": 0}]
    bad = write(tmp_path, "bad.toml", "dimension = 2\n[matrices]\nu = [[2, 0], [0, 1]]\n")
    err = run_error(capsys, ["module", spec, "--module", bad])
    assert "bad.toml" in err and "relation u*u*u" in err
    wrong = write(tmp_path, "w.toml", "dimension = 2\n[matrices]\nv = [[1, 0], [0, 1]]\n")
    assert "matrices.v" in run_error(capsys, ["module", spec, "--module", wrong])
    size = write(tmp_path, "s.toml", "dimension = 3\n[matrices]\nu = [[1, 0], [0, 1]]\n")
    assert "2 x 2 matrix where 3 x 3" in run_error(capsys, ["module", spec, "--module", size])


def test_multiplication_module_file(tmp_path, capsys):
    spec = write(tmp_path, "c3.toml", GROUP)
    # the regular representation of C_3 over GF(3): indecomposable (common practice:
    # kC_p in characteristic p is local, so its regular module is indecomposable)
    reg = write(
        tmp_path,
        "r.toml",
        "dimension = 3\n[matrices]\ne = [[1,0,0],[0,1,0],[0,0,1]]\n"
        "g = [[0,1,0],[0,0,1],[1,0,0]]\nh = [[0,0,1],[1,0,0],[0,1,0]]\n",
    )
    d = run_json(capsys, ["module", spec, "--module", reg, "--element", "g - e"])
    assert [s["dimension"] for s in d["summands"]] == [3]
    assert d["endomorphism_dimension"] == 3
    assert d["jordan_types"]["g - e"] == [{"degree": 1, "size": 3, "eigenvalue": 0}]
    bad = write(
        tmp_path,
        "b.toml",
        "dimension = 1\n[matrices]\ne = [[1]]\ng = [[1]]\nh = [[2]]\n",
    )
    err = run_error(capsys, ["module", spec, "--module", bad])
    assert "b.toml" in err and "product" in err


def test_unknown_names_in_elements(capsys):
    err = run_error(capsys, ["module", str(EXAMPLES / "plaquette.toml"), "--element", "X + Z"])
    assert "--element 'X + Z'" in err and "'Z'" in err


def test_unknown_module_name(tmp_path, capsys):
    spec = write(tmp_path, "q.toml", QUIVER)
    assert "'9' is not a vertex" in run_error(capsys, ["module", spec, "--module", "P(9)"])
    assert "not a module name" in run_error(capsys, ["module", spec, "--module", "Q(1)"])


def test_sparse_matrix_errors_name_the_entry(tmp_path, capsys):
    spec = write(
        tmp_path,
        "sp.toml",
        'field = "QQ"\n[matrices.generators]\nx = { size = [2, 2], entries = [[0, 5, 1]] }\n',
    )
    err = run_error(capsys, ["module", spec])
    assert "matrices.generators.x.entries[0]" in err and "column 5" in err


@pytest.mark.parametrize("name", ["P(1)", "projective(2)", "P(3)"])
def test_projective_by_name_is_indecomposable_with_the_right_top(tmp_path, capsys, name):
    # P(i) is indecomposable with top L(i) (Assem-Simson-Skowronski, vol. 1; memory)
    spec = write(tmp_path, "q.toml", QUIVER)
    d = run_json(capsys, ["module", spec, "--module", name])
    v = name[name.index("(") + 1 : -1]
    assert len(d["summands"]) == 1
    s = d["summands"][0]
    top = s["radical_layers"][0]
    assert top == [1 if x == v else 0 for x in d["simples"]]
    assert any(x["name"] == f"P({v})" for x in s["identified_as"])


def test_named_standard_and_tilting_modules(tmp_path, capsys):
    spec = write(tmp_path, "q.toml", QUIVER)
    d = run_json(capsys, ["module", spec, "--module", "tilting(1)", "--order", "3 > 2 > 1"])
    assert any(x["name"] == "T(1)" for x in d["summands"][0]["identified_as"])
    d = run_json(capsys, ["module", spec, "--module", "standard(2)", "--order", "3 > 2 > 1"])
    assert any(x["name"] == "Delta(2)" for x in d["summands"][0]["identified_as"])


def test_regular_module_sums_to_dimension_and_isomorphic_summands_agree():
    A = load_spec_text(QUIVER)
    from hwcat.modules import direct_sum

    M = from_representation(direct_sum(projective(A, 0), projective(A, 1), projective(A, 0)))
    D = decompose(M)
    assert sum(s.dimension for s in D.summands) == M.dim
    assert sorted(s.isomorphism_class for s in D.summands).count(0) == 2


def test_spin_chain_from_the_family(capsys):
    d = run_json(
        capsys,
        [
            "module",
            "--family",
            "temperley-lieb",
            "n=4",
            "delta=0",
            "field=GF(5)",
            "--element",
            "e1 + e2 + e3",
        ],
    )
    # quantum Schur-Weyl duality (Jimbo 1986; Martin 1991; from memory): 1 + 9 + 25
    assert d["endomorphism_dimension"] == 35
    assert sum(s["dimension"] for s in d["summands"]) == 16
    assert any(b["size"] >= 2 for b in d["jordan_types"]["e1 + e2 + e3"])
    # isomorphic summands have the same composition factors (common practice)
    by_class: dict[int, list] = {}
    for s in d["summands"]:
        by_class.setdefault(s["isomorphism_class"], []).append(s["composition_factors"])
    assert all(all(cf == cfs[0] for cf in cfs) for cfs in by_class.values())
    assert any(len(cfs) > 1 for cfs in by_class.values())
    # the whole module's composition factors add up over the summands
    total: dict[str, int] = {}
    for s in d["summands"]:
        for k, v in s["composition_factors"].items():
            total[k] = total.get(k, 0) + v
    assert total == d["composition_factors"]


def test_describe_reports_the_centre(tmp_path, capsys):
    spec = write(tmp_path, "c3.toml", GROUP)
    assert main(["describe", spec, "--json"]) == 0
    d = json.loads(capsys.readouterr().out)
    assert d["centre_dimension"] == 3  # commutative: Z = A (common practice)


@pytest.mark.parametrize("n, field", [(3, "GF(2)"), (3, "GF(3)"), (4, "GF(2)")])
def test_family_reports_the_centre(capsys, n, field):
    # dim Z(kS_n) = number of conjugacy classes = partitions of n (common practice)
    partitions = {3: 3, 4: 5}[n]
    assert main(["family", "symmetric-group", f"n={n}", f"field={field}", "--json"]) == 0
    d = json.loads(capsys.readouterr().out)
    assert d["centre_dimension"] == partitions == len(d["centre_basis"])


# -- generating sets, families with the common argument shape, tensor products -----------------

X2 = """name = "X2"
dimension = 2
[matrices]
E = [[0, 1], [0, 0]]
F = [[0, 0], [1, 0]]
K = [[2, 0], [0, 3]]
"""

UQ4 = ["--family", "small-quantum-sl2", "ell=4", "q=2", "field=GF(5)"]


def test_generating_set_module_file_for_a_group(tmp_path, capsys):
    spec = write(tmp_path, "c3.toml", GROUP)
    # g alone generates C_3: the regular representation from g only (common practice)
    reg = write(tmp_path, "g.toml", "dimension = 3\n[matrices]\ng = [[0,1,0],[0,0,1],[1,0,0]]\n")
    d = run_json(capsys, ["module", spec, "--module", reg, "--element", "h - e"])
    assert [s["dimension"] for s in d["summands"]] == [3]
    assert d["jordan_types"]["h - e"] == [{"degree": 1, "size": 3, "eigenvalue": 0}]
    # g must have order 3: a matrix of order 2 breaks the product g*h = e
    bad = write(tmp_path, "b.toml", "dimension = 2\n[matrices]\ng = [[0,1],[1,0]]\n")
    err = run_error(capsys, ["module", spec, "--module", bad])
    assert "b.toml" in err and "matrices" in err and "does not hold" in err


def test_generating_set_for_the_small_quantum_group(tmp_path, capsys):
    f = write(tmp_path, "x2.toml", X2)
    d = run_json(capsys, ["module", *UQ4, "--module", f, "--element", "F*E"])
    # the two-dimensional simple of the restricted form at p = 2 is projective (FGST 2006,
    # from memory): one summand, identified as a projective
    assert [s["dimension"] for s in d["summands"]] == [2]
    assert any(i["name"].startswith("P(") for i in d["summands"][0]["identified_as"])
    # K = diag(2, 2) violates K E = q^2 E K (q = 2): named with the file and the key
    bad = write(tmp_path, "bad.toml", X2.replace("[[2, 0], [0, 3]]", "[[2, 0], [0, 2]]"))
    err = run_error(capsys, ["module", *UQ4, "--module", bad])
    assert "bad.toml" in err and "matrices" in err and "does not hold" in err
    # E, F alone do not generate (no K): said so, with the file
    nok = write(tmp_path, "nok.toml", X2.split("K =")[0])
    err = run_error(capsys, ["module", *UQ4, "--module", nok])
    assert "nok.toml" in err and "do not generate" in err


def test_tensor_product_on_the_command_line(tmp_path, capsys):
    f = write(tmp_path, "x2.toml", X2)
    d = run_json(capsys, ["module", *UQ4, "--module", f, "--tensor", f])
    # X(2) (x) X(2) = P(1) of dimension 2p = 4 at p = 2 (FGST 2006, from memory)
    assert d["dimension"] == 4
    assert [s["dimension"] for s in d["summands"]] == [4]
    assert any(i["name"].startswith("P(") for i in d["summands"][0]["identified_as"])
    # projective (x) anything is projective (from memory): P(x) (x) X(2) for every vertex
    for v in d["simples"]:
        t = run_json(capsys, ["module", *UQ4, "--module", f"P({v})", "--tensor", f])
        assert all(
            any(i["name"].startswith("P(") for i in s["identified_as"]) for s in t["summands"]
        )
    # no coproduct for a quiver spec; an unknown factor name
    spec = write(tmp_path, "q.toml", QUIVER)
    assert "--tensor" in run_error(capsys, ["module", spec, "--module", "P(1)", "--tensor", "P(1)"])
    assert "tensor factor" in run_error(capsys, ["module", *UQ4, "--module", f, "--tensor", "I(1)"])


def test_group_tensor_on_the_command_line(tmp_path, capsys):
    # the permutation module of S_3 on 3 points, given by the transpositions (1,2) and
    # (2,3) only; End of a permutation module has the dimension of the number of orbits
    # of G on X x X (common practice), and X (x) X through g -> g (x) g is the
    # permutation module on X x X
    import itertools

    s3 = ["--family", "symmetric-group", "n=3", "field=GF(5)"]
    text = (
        "dimension = 3\n[matrices]\n"
        '"(1,2)" = [[0, 1, 0], [1, 0, 0], [0, 0, 1]]\n'
        '"(2,3)" = [[1, 0, 0], [0, 0, 1], [0, 1, 0]]\n'
    )
    f = write(tmp_path, "perm.toml", text)
    one = run_json(capsys, ["module", *s3, "--module", f])
    assert one["endomorphism_dimension"] == 2
    two = run_json(capsys, ["module", *s3, "--module", f, "--tensor", f])
    assert two["dimension"] == 9
    perms = list(itertools.permutations(range(3)))
    pts = list(itertools.product(range(3), repeat=2))
    orbits = {
        min(((p[a], p[b]), (p[c], p[d])) for p in perms)
        for (a, b), (c, d) in itertools.product(pts, repeat=2)
    }
    assert two["endomorphism_dimension"] == len(orbits)


def test_spin_chain_summands_are_named_by_the_family_simples(capsys):
    # generic loop weight (q = 2 over GF(10007), delta = 5/2): the chain is semisimple
    # over TL_6 and the simple with t through strands, of dimension
    # C(6, (6-t)/2) - C(6, (6-t)/2 - 1), occurs t + 1 times (quantum Schur-Weyl duality,
    # Jimbo 1986, Martin 1991; from memory); the labels are the family's
    from math import comb

    d = run_json(
        capsys, ["module", "--family", "temperley-lieb", "n=6", "delta=5/2", "field=GF(10007)"]
    )
    assert sorted(d["simples"]) == ["0", "2", "4", "6"]
    for t in (0, 2, 4, 6):
        k = (6 - t) // 2
        dim = comb(6, k) - (comb(6, k - 1) if k else 0)
        mine = [s for s in d["summands"] if s["composition_factors"] == {str(t): 1}]
        assert len(mine) == t + 1 and all(s["dimension"] == dim for s in mine)
        assert all(any(i["name"] == f"L({t})" for i in s["identified_as"]) for s in mine)
    assert d["centre"]["terms"].startswith("the input algebra's own terms")


def test_spin_chain_identification_limit():
    from hwcat.io.module_file import spin_chain_identifiable

    assert spin_chain_identifiable(8)[0]  # TL_8: 1430 diagrams
    ok, why = spin_chain_identifiable(9)
    assert not ok and "4862" in why


def test_family_modules_by_name_and_file(tmp_path, capsys):
    # a quiver family: P(2) of the zigzag algebra of type A_3 is projective-injective with
    # radical layers 2 | 1 + 3 | 2 (zigzag algebras are symmetric, Loewy length 3 for
    # n >= 2: from memory, as in the family's summary)
    d = run_json(capsys, ["module", "--family", "zigzag-a", "n=3", "--module", "P(2)"])
    s = d["summands"]
    assert len(s) == 1 and any(i["name"] == "projective-injective" for i in s[0]["identified_as"])
    assert s[0]["loewy_length"] == 3
    # a module file for a quiver family: the simple at vertex 1 given by its dimensions
    f = write(tmp_path, "s1.toml", "[dimensions]\n1 = 1\n[matrices]\n")
    d = run_json(capsys, ["module", "--family", "zigzag-a", "n=3", "--module", f])
    assert [i["name"] for i in d["summands"][0]["identified_as"]][0] == "L(1)"
    # unknown parameters and a missing family name are one-line errors
    assert "unknown" in run_error(
        capsys, ["module", "--family", "zigzag-a", "n=3", "m=2", "--module", "P(1)"]
    )
    assert "exactly one" in run_error(capsys, ["module"])


def test_coproduct_option_for_a_multiplication_spec(tmp_path, capsys):
    spec = write(tmp_path, "c3.toml", GROUP)
    g = write(tmp_path, "g.toml", "dimension = 3\n[matrices]\ng = [[0,1,0],[0,0,1],[1,0,0]]\n")
    # the regular module of C_3 tensored with itself is free of rank 3 (common practice:
    # P (x) M is projective; over GF(3) the regular module is indecomposable)
    d = run_json(capsys, ["module", spec, "--module", g, "--tensor", g, "--coproduct", "group"])
    assert d["dimension"] == 9 and [s["dimension"] for s in d["summands"]] == [3, 3, 3]
    # a spec without a known coproduct, and --coproduct on a [matrices] spec
    assert "no known coproduct" in run_error(capsys, ["module", spec, "--module", g, "--tensor", g])
    m = write(tmp_path, "u.toml", MATRICES)
    one = write(tmp_path, "one.toml", "dimension = 1\n[matrices]\nu = [[1]]\n")
    err = run_error(capsys, ["module", m, "--module", one, "--tensor", one, "--coproduct", "group"])
    assert "[matrices]" in err


def test_named_modules_of_a_reduced_algebra_say_they_live_over_the_basic_algebra(capsys):
    # kS_4 over GF(3) (dimension 24) has a basic algebra of dimension 8 (derived):
    # its regular module is the basic algebra's, and the header says so
    from hwcat.cli import main

    rc = main(
        ["module", "--family", "symmetric-group", "n=4", "field=GF(3)", "--module", "regular"]
    )
    out = capsys.readouterr().out
    assert rc == 0
    assert out.splitlines()[0].startswith(
        "module regular of the basic algebra over GF(3): dimension 8"
    )


def test_an_empty_order_is_an_error(tmp_path, capsys):
    # specs/FORMAT.md: an empty order is bad input (exit 2), as for check and certify
    kite = str(EXAMPLES / "kite.toml")
    err = run_error(capsys, ["module", kite, "--module", "Delta(tail)", "--order", ""])
    assert err == "hwcat: error: --order: the order is empty"
    text = (EXAMPLES / "kite.toml").read_text(encoding="utf-8")
    spec = write(tmp_path, "k.toml", text.replace('order = "nose', 'order = "" # "nose'))
    err = run_error(capsys, ["module", spec, "--module", "Delta(tail)"])
    assert err == f"hwcat: error: {spec}: order: the order is empty"


@pytest.mark.parametrize("value", ["99", "true", "1.0"])
def test_module_file_format_must_be_1(tmp_path, capsys, value):
    spec = write(tmp_path, "c3.toml", GROUP)
    mod = write(tmp_path, "m.toml", f"format = {value}\ndimension = 1\n[matrices]\ng = [[1]]\n")
    err = run_error(capsys, ["module", spec, "--module", mod])
    assert f"m.toml: format: {value.replace('true', 'True')}: only format 1 is known" in err
    ok = write(tmp_path, "ok.toml", "format = 1\ndimension = 1\n[matrices]\ng = [[1]]\n")
    assert main(["module", spec, "--module", ok]) == 0


def test_module_file_without_matrices_for_a_table(tmp_path, capsys):
    spec = write(tmp_path, "c3.toml", GROUP)
    mod = write(tmp_path, "m.toml", "dimension = 1\n[matrices]\n")
    err = run_error(capsys, ["module", spec, "--module", mod])
    assert "m.toml: matrices: no matrices are given;" in err and "  " not in err


def test_module_text_names_the_end_its_layers_start_from(tmp_path, capsys):
    # P(1) of 1 -> 2 -> 3 with a*b = 0 is uniserial with top L(1) and socle L(2) (derived)
    spec = write(tmp_path, "q.toml", QUIVER)
    d = run_json(capsys, ["module", spec, "--module", "P(1)"])
    assert d["radical_layers"] == [[1, 0, 0], [0, 1, 0]]
    assert d["socle_layers"] == [[0, 1, 0], [1, 0, 0]]  # the JSON lists the socle first
    assert main(["module", spec, "--module", "P(1)"]) == 0
    out = capsys.readouterr().out
    assert "radical layers (top first):   1 | 2" in out
    assert "socle layers (socle first):   2 | 1" in out
