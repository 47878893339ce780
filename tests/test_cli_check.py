"""The check and orders commands: exit codes, JSON keys, witnesses on a "no"."""

import json

import pytest

from hwcat.algebras.families.quivers import linear_A, spec_to_toml
from hwcat.cli import main

LANTERN = "specs/examples/lantern.toml"


def run(capsys, *args):
    code = main(list(args))
    out, err = capsys.readouterr()
    return code, out, err


def write(tmp_path, spec, name="a.toml"):
    p = tmp_path / name
    p.write_text(spec if isinstance(spec, str) else spec_to_toml(spec))
    return str(p)


def test_check_spec_order_json(capsys):
    code, out, _ = run(capsys, "check", LANTERN, "--json")
    d = json.loads(out)
    assert code == 0 and d["quasi_hereditary"] is True
    for key in ("order", "axioms", "decomposition_standard", "decomposition_costandard", "cartan"):
        assert key in d
    assert {a["name"] for a in d["axioms"]} >= {
        "standard-schurian",
        "projectives-standardly-filtered",
        "injectives-costandardly-filtered",
        "heredity-chain",
        "bgg-reciprocity",
        "cartan-factorisation",
    }
    assert all(isinstance(pair, list) and len(pair) == 2 for pair in d["order"])


def test_check_failing_order_exit_1_with_witness(capsys):
    code, out, _ = run(capsys, "check", LANTERN, "--order", "top > left > right > base", "--json")
    d = json.loads(out)
    assert code == 1 and d["quasi_hereditary"] is False
    failing = [a for a in d["axioms"] if not a["holds"]]
    assert failing and all(a["witness"] for a in failing)


def test_check_text_report(capsys):
    code, out, _ = run(capsys, "check", LANTERN, "--order", "top > left > right > base")
    assert code == 1 and "FAILS" in out and "kernel element" in out


def test_check_without_order_searches(tmp_path, capsys):
    spec = linear_A(3)
    code, out, _ = run(capsys, "check", write(tmp_path, spec), "--json")
    d = json.loads(out)
    assert code == 0 and d["quasi_hereditary"] and d["search"]["quasi_hereditary_total_orders"] == 6


def test_check_no_order_works(tmp_path, capsys):
    # k[x]/(x^3): not quasi-hereditary (self-injective, Dlab-Ringel 1989)
    spec = '[quiver]\nvertices = ["x"]\narrows = ["t: x -> x"]\nvanish_from_length = 3\n'
    p = write(tmp_path, 'field = "QQ"\n' + spec)
    code, out, _ = run(capsys, "check", p, "--json")
    d = json.loads(out)
    assert code == 1 and d["quasi_hereditary"] is False
    assert any(not a["holds"] and a["witness"] for a in d["axioms"])
    code, out, _ = run(capsys, "check", p)
    assert "NO order makes the algebra quasi-hereditary" in out


@pytest.mark.parametrize("order", ["top > nowhere", "top > left > top", "top >> left"])
def test_bad_order_exit_2(capsys, order):
    code, out, err = run(capsys, "check", LANTERN, "--order", order)
    assert code == 2 and out == "" and err.count("\n") == 1 and "--order" in err


def test_bad_order_in_spec(tmp_path, capsys):
    text = (
        open(LANTERN).read().replace('order = "left > top > right > base"', 'order = "left > left"')
    )
    code, _, err = run(capsys, "check", write(tmp_path, text))
    assert code == 2 and "order" in err and "a.toml" in err


def test_orders_json(tmp_path, capsys):
    code, out, _ = run(capsys, "orders", write(tmp_path, linear_A(4)), "--json", "--all")
    d = json.loads(out)
    assert code == 0
    assert (
        d["quasi_hereditary"] and d["quasi_hereditary_total_orders"] == 24 and d["structures"] == 14
    )
    assert len(d["structure_list"]) == 14
    s = d["structure_list"][0]
    assert "standard_dimension_vectors" in s and "essential_order" in s


def test_orders_text_limit(tmp_path, capsys):
    code, out, _ = run(capsys, "orders", write(tmp_path, linear_A(4)), "--limit", "2")
    assert code == 0 and "#2:" in out and "#3:" not in out and "--all" in out


def test_check_homological_keys(capsys):
    code, out, _ = run(capsys, "check", LANTERN, "--json")
    d = json.loads(out)
    assert isinstance(d["global_dimension"], int)
    assert len(d["tilting"]) == 4
    for t in d["tilting"]:
        assert {"dimension_vector", "standard_multiplicities", "costandard_multiplicities"} <= set(
            t
        )
    assert len(d["ringel_dual_cartan"]) == 4
    names = {a["name"] for a in d["axioms"]}
    assert {"ext-standard-costandard", "ext-quiver-standard"} <= names
    code, out, _ = run(capsys, "check", LANTERN, "--json", "--no-homological")
    assert json.loads(out)["tilting"] is None


def test_ringel_dual_command_roundtrip(tmp_path, capsys):
    # Ringel 1991: R(R(A)) is Morita equivalent to A; the written specs reproduce A's Cartan matrix
    r1, r2 = str(tmp_path / "r1.toml"), str(tmp_path / "r2.toml")
    assert run(capsys, "ringel-dual", LANTERN, "-o", r1)[0] == 0
    code, out, _ = run(capsys, "check", r1, "--json", "--no-homological")
    assert code == 0 and json.loads(out)["quasi_hereditary"]  # qh for the opposite order
    assert run(capsys, "ringel-dual", r1, "-o", r2)[0] == 0
    cartan = lambda p: json.loads(run(capsys, "describe", p, "--json")[1])["cartan"]  # noqa: E731
    assert cartan(r2) == cartan(LANTERN)
    assert run(capsys, "ringel-dual", "specs/examples/carousel.toml")[0] == 1


# Two loops at vertex 2 and an arrow 1 -> 2, paths of length 4 and more vanish: the
# syzygies of the simples grow geometrically (derived), det(Cartan) = 15 (sympy below).
GROWING = """field = "QQ"
[quiver]
vertices = ["1", "2"]
arrows = ["a1: 2 -> 2", "a2: 1 -> 2", "a3: 2 -> 2"]
vanish_from_length = 4
"""


def test_check_cartan_determinant_decides_global_dimension(tmp_path, capsys):
    import sympy

    from hwcat.io.spec import load_spec_text

    assert sympy.Matrix(load_spec_text(GROWING).cartan()).det() == 15
    # Eilenberg (Comment. Math. Helv. 28, 1954; from memory): det(C) != +-1 => infinite
    code, out, _ = run(capsys, "check", write(tmp_path, GROWING), "--order", "1 > 2", "--json")
    d = json.loads(out)
    assert code == 1 and d["global_dimension"] == "infinite"
    assert d["global_dimension_detail"]["witness"]["reason"] == "cartan_determinant"
    code, out, _ = run(capsys, "check", write(tmp_path, GROWING), "--order", "1 > 2")
    assert "det Cartan = 15" in out


def test_check_work_budget_leaves_ext_axioms_undecided(tmp_path, capsys):
    # for 2 > 1, Delta(1) = L(1) has projective terms of dimension 8, 15, 120, 240 (derived)
    path = write(tmp_path, GROWING)
    code, out, _ = run(
        capsys, "check", path, "--order", "2 > 1", "--json", "--max-syzygy-dimension", "100"
    )
    d = json.loads(out)
    ext = {a["name"]: a for a in d["axioms"]}["ext-standard-costandard"]
    assert code == 1 and ext["holds"] is None and ext["witness"]["undecided"]
    assert "max_syzygy_dimension = 100" in ext["witness"]["undecided"][0]["text"]
    # with the default budget the same axiom is decided
    code, out, _ = run(capsys, "check", path, "--order", "2 > 1", "--json")
    ext = {a["name"]: a for a in json.loads(out)["axioms"]}["ext-standard-costandard"]
    assert ext["holds"] in (True, False)
    code, out, _ = run(capsys, "check", path, "--order", "2 > 1", "--max-syzygy-dimension", "100")
    assert "[undecided] ext-standard-costandard" in out


@pytest.mark.parametrize("value", ["0", "x"])
def test_check_bad_budget_exit_2(tmp_path, capsys, value):
    assert main(["check", write(tmp_path, GROWING), "--max-syzygy-dimension", value]) == 2
    assert "--max-syzygy-dimension" in capsys.readouterr().err


def test_check_homological_bound_option(tmp_path, capsys):
    # linear A_5 with rad^2 = 0: global dimension 4 (derived: Omega L(i) = L(i+1))
    path = write(tmp_path, linear_A(5, vanish_from_length=2))
    code, out, _ = run(capsys, "check", path, "--order", "1 < 2 < 3 < 4 < 5", "--json")
    assert json.loads(out)["global_dimension"] == 4
    code, out, _ = run(
        capsys, "check", path, "--order", "1 < 2 < 3 < 4 < 5", "--json", "--homological-bound", "2"
    )
    assert json.loads(out)["global_dimension"] == {"at_least": 3}
