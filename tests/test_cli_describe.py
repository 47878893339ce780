"""``hwcat describe SPEC`` and ``hwcat describe SPEC --json``.

The JSON object must carry at least ``dimension`` (an int), ``simples`` (the
vertex names in spec order) and ``cartan`` (rows, ``C[i][j] = [P(j) : L(i)]``).
Values for the bundled example and the hand-made specs were derived by hand
from their normal paths ("derived"); random specs are compared with the
Python API and with the identities dim A = sum of the Cartan entries,
``P(j)`` = column ``j``, ``I(i)`` = row ``i`` (common practice).
"""

from __future__ import annotations

import contextlib
import io
import json
import os
import subprocess
import sys
import tempfile
from pathlib import Path

import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from hwcat.algebras.families.quivers import spec_to_toml
from hwcat.cli import main
from hwcat.modules import injective, projective
from hwcat.strategies import algebra_from_spec, bound_quiver_specs

REPO = Path(__file__).resolve().parents[1]
LANTERN = REPO / "specs" / "examples" / "lantern.toml"


def describe_json(path: Path, capsys: pytest.CaptureFixture) -> dict:
    code = main(["describe", str(path), "--json"])
    out, err = capsys.readouterr()
    assert code == 0 and err == ""
    return json.loads(out)


def write(tmp: Path, name: str, text: str) -> Path:
    path = tmp / name
    path.write_text(text, encoding="utf-8")
    return path


def test_lantern_json(capsys: pytest.CaptureFixture) -> None:
    # derived by hand from the relations u*x = v*y, z*u = 0, x*z = 0:
    # P(base) = e, u, v, u*x;  P(left) = e, x;  P(right) = e, y, y*z, y*z*v;
    # P(top) = e, z, z*v -- so dimension 13 and columns P(j) of the Cartan matrix
    data = describe_json(LANTERN, capsys)
    assert isinstance(data["dimension"], int) and data["dimension"] == 13
    assert data["simples"] == ["base", "left", "right", "top"]
    assert data["cartan"] == [[1, 0, 1, 1], [1, 1, 0, 0], [1, 0, 2, 1], [1, 1, 1, 1]]
    assert [p["dimension"] for p in data["projectives"]] == [4, 2, 4, 3]
    assert data["projectives"][2]["radical_layers"] == [
        [0, 0, 1, 0],
        [0, 0, 0, 1],
        [1, 0, 0, 0],
        [0, 0, 1, 0],
    ]
    assert data["field"] == "QQ" and data["name"] == "lantern"


def test_simples_follow_the_spec_order(tmp_path: Path, capsys: pytest.CaptureFixture) -> None:
    # derived: the path algebra of c -> a -> b, vertices listed as c, a, b;
    # P(c) = e, x, x*y (at c, a, b), P(a) = e, y, P(b) = e
    path = write(
        tmp_path,
        "chain.toml",
        'field = "GF(2)"\n[quiver]\nvertices = ["c", "a", "b"]\narrows = ["x: c -> a", "y: a -> b"]\n',
    )
    data = describe_json(path, capsys)
    assert data["simples"] == ["c", "a", "b"]
    assert data["dimension"] == 6
    # C[i][j] = [P(j) : L(i)]: column j is the dimension vector of P(j)
    assert data["cartan"] == [[1, 0, 0], [1, 1, 0], [1, 1, 1]]


def test_cartan_convention_on_the_commutative_square(
    tmp_path: Path, capsys: pytest.CaptureFixture
) -> None:
    # derived: 1 -a-> 2 -b-> 4, 1 -c-> 3 -d-> 4, a*b = c*d; P(1) has every simple once,
    # so column 1 is all ones, while L(1) occurs only in P(1): row 1 is (1, 0, 0, 0)
    path = write(
        tmp_path,
        "square.toml",
        'field = "QQ"\n[quiver]\nvertices = ["1", "2", "3", "4"]\n'
        'arrows = ["a: 1 -> 2", "b: 2 -> 4", "c: 1 -> 3", "d: 3 -> 4"]\n'
        'relations = ["a*b - c*d"]\n',
    )
    data = describe_json(path, capsys)
    assert data["dimension"] == 9
    assert data["cartan"] == [[1, 0, 0, 0], [1, 1, 0, 0], [1, 0, 1, 0], [1, 1, 1, 1]]
    assert data["cartan_convention"] == "cartan[i][j] = [P(j) : L(i)]"


def test_text_report(capsys: pytest.CaptureFixture) -> None:
    code = main(["describe", str(LANTERN)])
    out, err = capsys.readouterr()
    assert code == 0 and err == ""
    assert "C[i][j] = [P(j) : L(i)]" in out  # the convention is stated on screen
    assert "dimension 13" in out and "4 simple modules" in out
    assert "u: base -> left" in out  # the Gabriel quiver
    for v in ("base", "left", "right", "top"):
        assert f"P({v})" in out and f"I({v})" in out and f"L({v})" in out
    # radical layers of P(right), top first: right | top | base | right (derived above)
    assert "right | top | base | right" in out


def test_json_through_a_real_process() -> None:
    env = dict(os.environ)
    env["PYTHONPATH"] = str(REPO) + os.pathsep + env.get("PYTHONPATH", "")
    proc = subprocess.run(
        [sys.executable, "-m", "hwcat.cli", "describe", str(LANTERN), "--json"],
        capture_output=True,
        text=True,
        env=env,
        timeout=120,
    )
    assert proc.returncode == 0 and proc.stderr == ""
    data = json.loads(proc.stdout)
    assert data["dimension"] == 13 and data["simples"] == ["base", "left", "right", "top"]


def test_the_package_does_not_need_hypothesis() -> None:
    # hypothesis is a test extra: importing hwcat and its command line must not load it
    env = dict(os.environ)
    env["PYTHONPATH"] = str(REPO) + os.pathsep + env.get("PYTHONPATH", "")
    code = "import sys, hwcat, hwcat.cli, hwcat.io.spec; assert 'hypothesis' not in sys.modules"
    proc = subprocess.run(
        [sys.executable, "-c", code], capture_output=True, text=True, env=env, timeout=120
    )
    assert proc.returncode == 0, proc.stderr


@settings(max_examples=15, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(bound_quiver_specs(max_vertices=4, max_arrows=5))
def test_random_specs_through_the_command_line(spec: dict) -> None:
    A = algebra_from_spec(spec)
    with tempfile.TemporaryDirectory() as tmp:
        path = write(Path(tmp), "random.toml", spec_to_toml(spec))
        buf_out, buf_err = io.StringIO(), io.StringIO()
        with contextlib.redirect_stdout(buf_out), contextlib.redirect_stderr(buf_err):
            code = main(["describe", str(path), "--json"])
    assert code == 0 and buf_err.getvalue() == ""
    data = json.loads(buf_out.getvalue())
    assert type(data["dimension"]) is int and data["dimension"] == A.dim
    assert data["simples"] == spec["quiver"]["vertices"]
    C = data["cartan"]
    assert C == [list(r) for r in A.cartan()]
    assert sum(map(sum, C)) == data["dimension"]
    n = len(C)
    for j, P in enumerate(data["projectives"]):
        assert P["dimension_vector"] == [C[i][j] for i in range(n)]
        assert list(projective(A, j).dims) == P["dimension_vector"]
    for i, inj in enumerate(data["injectives"]):
        assert inj["dimension_vector"] == C[i]
        assert list(injective(A, i).dims) == inj["dimension_vector"]
    assert data["loewy_length"] == max(p["loewy_length"] for p in data["projectives"])


# -- the JSON layout -------------------------------------------------------------------

_scalars = st.one_of(st.integers(), st.text(max_size=5), st.booleans(), st.none())
_values = st.recursive(
    _scalars,
    lambda inner: st.one_of(
        st.lists(inner, max_size=4),
        st.tuples(inner, inner),
        st.dictionaries(
            st.one_of(st.text(max_size=4), st.integers(), st.booleans()), inner, max_size=4
        ),
    ),
    max_leaves=25,
)


@settings(max_examples=300, deadline=None)
@given(_values)
def test_json_layout_is_the_same_value(obj) -> None:
    """The renderer's layout parses to what the standard library's encoder writes (common
    practice: ``json.loads(json.dumps(x))`` as the reference), and lists of scalars sit on
    one line."""
    from hwcat.io.render import _json_chunks

    text = "".join(_json_chunks(obj))
    assert json.loads(text) == json.loads(json.dumps(obj))
    if isinstance(obj, list) and not any(isinstance(x, (dict, list, tuple)) for x in obj):
        assert "\n" not in text


def test_describe_json_writes_vectors_on_one_line(capsys: pytest.CaptureFixture) -> None:
    """Dimension vectors are one line each (the report of linear A_1000 is 59 MB instead of
    241 MB); the value is unchanged."""
    main(["describe", str(LANTERN), "--json"])
    out = capsys.readouterr().out
    data = json.loads(out)
    assert f'"cartan": [\n    {json.dumps(data["cartan"][0])},' in out


def test_json_layout_keys_as_the_standard_encoder() -> None:
    """Keys are written as ``json.dumps`` writes them and refused where it refuses (common
    practice: the standard library as the reference)."""
    from hwcat.io.render import json_text

    value = {1.5: 1, float("inf"): 2, True: 3, None: 4, 7: 5}
    assert json.loads(json_text(value)) == json.loads(json.dumps(value))
    with pytest.raises(TypeError):
        json_text({(1, 2): 0})
    with pytest.raises(TypeError):
        json.dumps({(1, 2): 0})
