"""Certificates (hwcat certify) and the independent checker (hwcat verify).

Outside facts used:
* V. Dlab, C. M. Ringel, Quasi-hereditary algebras, Illinois J. Math. 33 (1989):
  an algebra is hereditary iff it is quasi-hereditary for every order; the heredity-ideal criterion.
* T. Bruestle, L. Hille, C. M. Ringel, G. Roehrle, Algebr. Represent. Theory 2
  (1999): the Auslander algebra of k[T]/(T^n) is quasi-hereditary.
* Dlab and Ringel 1989 with C. M. Ringel, J. Pure Appl. Algebra 214 (2010):
  quasi-hereditary algebras have finite global dimension, so the group algebra
  of a p-group in characteristic p (self-injective, not semisimple; Maschke,
  common practice) is quasi-hereditary for no order.
The heredity-chain check of hwcat.theory is the independent computation the
checker must agree with; everything else is a round trip or a tampering test.
"""

import copy
import itertools
import json
import random
import re

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from hwcat.algebras.families.quivers import auslander_truncated_polynomial, linear_A
from hwcat.algebras.families.registry import family_algebra
from hwcat.cli import main
from hwcat.exact import GF, QQ, parse_field
from hwcat.io.spec import build_algebra, read_spec
from hwcat.strategies import algebra_from_spec, bound_quiver_algebras
from hwcat.theory.certificate import certify
from hwcat.theory.check import as_order
from hwcat.theory.highest_weight import heredity_chain
from hwcat.theory.orders import parse_order, total_order
from hwcat.verify import Malformed, verify_certificate

EXAMPLES = "specs/examples"


def _numbers(x, path=()):
    """Paths to every number in a JSON object (ints, and fractions written as strings)."""
    if isinstance(x, bool):
        return
    if isinstance(x, int) or (isinstance(x, str) and re.fullmatch(r"-?\d+/\d+", x)):
        yield path
    elif isinstance(x, list):
        for i, y in enumerate(x):
            yield from _numbers(y, path + (i,))
    elif isinstance(x, dict):
        for k, y in x.items():
            yield from _numbers(y, path + (k,))


def _get(d, path):
    for k in path:
        d = d[k]
    return d


def _set(d, path, v):
    for k in path[:-1]:
        d = d[k]
    d[path[-1]] = v


def _changed(x, rng):
    if isinstance(x, str):  # a fraction p/q: change the numerator, or write it non-canonically
        p, q = x.split("/")
        return rng.choice([f"{int(p) + 1}/{q}", f"{2 * int(p)}/{2 * int(q)}", f"{p}/{int(q) + 1}"])
    return x + rng.choice([-2, -1, 1, 2, 3])


def _rejects(cert):
    try:
        return not verify_certificate(cert).accepted
    except Malformed:
        return True


def _assert_tamper_evident(data, rng, count):
    """Changing any one number, or flipping the verdict, makes verification fail."""
    paths = list(_numbers(data))
    for path in rng.sample(paths, min(count, len(paths))):
        bad = copy.deepcopy(data)
        _set(bad, path, _changed(_get(data, path), rng))
        assert _rejects(bad), f"changing {path} went unnoticed"
    flipped = copy.deepcopy(data)
    flipped["quasi_hereditary"] = not data["quasi_hereditary"]
    assert _rejects(flipped)


@pytest.fixture(scope="module")
def schemas():
    jsonschema = pytest.importorskip("jsonschema")
    from hwcat.schemas import SCHEMAS, schema

    return {name: jsonschema.Draft202012Validator(schema(name)) for name in SCHEMAS}


# -- demo specs through the command line -----------------------------------------------------
DEMOS = [
    ("lantern.toml", [], 0),
    ("lantern.toml", ["--order", "top > left > right > base"], 1),
    ("kite.toml", [], 0),
    ("carousel.toml", [], 1),
]


@pytest.mark.parametrize("spec, extra, code", DEMOS)
def test_demo_round_trip(tmp_path, capsys, schemas, spec, extra, code):
    out = tmp_path / "cert.json"
    assert main(["certify", f"{EXAMPLES}/{spec}", *extra, "-o", str(out)]) == code
    data = json.loads(out.read_text())
    schemas["certificate"].validate(data)
    assert data["quasi_hereditary"] is (code == 0)
    capsys.readouterr()
    assert main(["verify", str(out), "--json"]) == 0
    v = json.loads(capsys.readouterr().out)
    schemas["verify"].validate(v)
    assert v == {"accepted": True, "quasi_hereditary": code == 0, "reason": v["reason"]}
    # the verdict agrees with hwcat check (exit codes: 0 yes, 1 no)
    assert main(["check", f"{EXAMPLES}/{spec}", *extra, "--no-homological"]) == code
    _assert_tamper_evident(data, random.Random(spec + str(extra)), 60)


def test_carousel_certificate_says_no_order_works(tmp_path, capsys):
    out = tmp_path / "c.json"
    assert main(["certify", f"{EXAMPLES}/carousel.toml", "-o", str(out)]) == 1
    assert "no order makes the algebra quasi-hereditary" in json.loads(out.read_text())["note"]


def test_verify_exit_codes(tmp_path, capsys):
    out = tmp_path / "cert.json"
    main(["certify", f"{EXAMPLES}/kite.toml", "-o", str(out)])
    data = json.loads(out.read_text())
    data["quasi_hereditary"] = False
    bad = tmp_path / "flipped.json"
    bad.write_text(json.dumps(data))
    capsys.readouterr()
    assert main(["verify", str(bad)]) == 1
    line = capsys.readouterr().out.strip()
    assert line.startswith("REJECTED: ") and "\n" not in line
    for text in ["not json", "[]", '{"format": "hwcat-certificate", "version": 7}']:
        bad.write_text(text)
        assert main(["verify", str(bad)]) == 2
    assert main(["verify", str(tmp_path / "missing.json")]) == 2


def test_every_number_of_a_small_certificate(tmp_path):
    """Exhaustive: every number of the kite's certificate, changed, is noticed."""
    spec = read_spec(f"{EXAMPLES}/kite.toml")
    A = build_algebra(spec)
    data = certify(A, parse_order(spec.order, A.vertices)).data
    rng = random.Random(1)
    for path in _numbers(data):
        bad = copy.deepcopy(data)
        _set(bad, path, _changed(_get(data, path), rng))
        assert _rejects(bad), f"changing {path} went unnoticed"


def test_non_canonical_coefficients_rejected():
    A = build_algebra(read_spec(f"{EXAMPLES}/carousel.toml"))  # over GF(5)
    data = certify(A, total_order(A.vertices, [0, 1, 2])).data
    assert verify_certificate(data).accepted
    entry = data["algebra"]["right_action"][0][2][0]
    for c in [entry[1] + 5, -entry[1], 0, str(entry[1]), float(entry[1]), True]:
        bad = copy.deepcopy(data)
        bad["algebra"]["right_action"][0][2][0][1] = c
        v = verify_certificate(bad)
        assert not v.accepted
    kite = build_algebra(read_spec(f"{EXAMPLES}/kite.toml"))  # over QQ, with 3/2
    data = certify(kite).data
    text = json.dumps(data)
    assert '"3/2"' in text
    for c in ['"6/4"', '"3/2 "', '"+3/2"', '"1.5"']:
        assert _rejects(json.loads(text.replace('"3/2"', c, 1)))


# -- outside facts --------------------------------------------------------------------------
def test_hereditary_every_order_certified():
    """Dlab-Ringel 1989: a hereditary algebra is quasi-hereditary for every order."""
    A = algebra_from_spec(linear_A(4))
    for perm in itertools.permutations(range(4)):
        data = certify(A, total_order(A.vertices, perm)).data
        v = verify_certificate(data)
        assert v.accepted and v.quasi_hereditary


def test_auslander_algebra_certified():
    """Bruestle-Hille-Ringel-Roehrle 1999: the Auslander algebra of k[T]/(T^n) is quasi-hereditary."""
    A = algebra_from_spec(auslander_truncated_polynomial(3, field=GF(3)))
    data = certify(A).data
    v = verify_certificate(json.loads(json.dumps(data)))
    assert v.accepted and v.quasi_hereditary


def test_group_algebra_of_p_group_certified_negative():
    """Ringel 2010 + Maschke: k[C_4] over GF(2) is quasi-hereditary for no order."""
    A = family_algebra("cyclic-group", m="4", field="GF(2)")
    data = certify(A).data
    assert data["quasi_hereditary"] is False
    assert data["evidence"]["failure"]["condition"] == "corner"
    v = verify_certificate(data)
    assert v.accepted and v.quasi_hereditary is False


# -- extension fields -----------------------------------------------------------------------
# (field, generator): a cyclotomic field, GF(9) and GF(8) with their generators named, GF(9)
# given by a polynomial of one's own, and a number field.
EXTENSION_FIELDS = [
    ("QQ(zeta8)", "zeta8"),
    ("GF(9, w)", "w"),
    ("GF(8, h)", "h"),
    ("GF(3)[w]/(w^2 + 1)", "w"),
    ("QQ[r]/(r^2 - 2)", "r"),
]
# Specs of our own with the generator g in a relation (derived verdicts, also checked against
# hwcat check below): the kite (quasi-hereditary for its partial order); a bypass s -> v -> u
# beside s => m -> u, whose trace ideal of v has the row [1, g + 1] (quasi-hereditary); a fork
# s => u -> t, whose kernel element a (x) c + g b (x) c breaks the first step (not
# quasi-hereditary); the lantern for an order it fails.
BYPASS = """name = "bypass"
field = "{field}"
order = "v > s > m > u"
[quiver]
vertices = ["s", "m", "v", "u"]
arrows = ["a: s -> m", "b: s -> m", "c: m -> u", "x: s -> v", "y: v -> u"]
relations = ["x*y - a*c - ({g} + 1)*b*c"]
"""
FORK = """name = "fork"
field = "{field}"
order = "u > s > t"
[quiver]
vertices = ["s", "u", "t"]
arrows = ["a: s -> u", "b: s -> u", "c: u -> t"]
relations = ["a*c + {g}*b*c"]
"""


def _over(name, field, g):
    """The spec text of ``name`` (an example file, or BYPASS / FORK) over ``field``."""
    if name in ("bypass", "fork"):
        return (BYPASS if name == "bypass" else FORK).format(field=field, g=g)
    text = open(f"{EXAMPLES}/{name}.toml", encoding="utf-8").read()
    old = {"kite": "p*q + 3/2*s*t", "lantern": "u*x - v*y"}[name]
    new = {"kite": f"p*q + {g}*s*t", "lantern": f"u*x - {g}*v*y"}[name]
    assert old in text and 'field = "QQ"' in text
    return text.replace(old, new).replace('field = "QQ"', f'field = "{field}"')


def _coefficient_paths(data):
    """Paths to every coefficient of a certificate (table, relations, ideals, witness)."""
    alg, ev = data["algebra"], data["evidence"]
    for e, entry in enumerate(alg["right_action"]):
        for k in range(len(entry[2])):
            yield ("algebra", "right_action", e, 2, k, 1)
    for r, rel in enumerate(alg["relations"]):
        for k in range(len(rel)):
            yield ("algebra", "relations", r, k, 0)
    for k, step in enumerate(ev.get("steps", [])):
        for b, block in enumerate(step["ideal"]):
            for i, row in enumerate(block[2]):
                for j in range(len(row)):
                    yield ("evidence", "steps", k, "ideal", b, 2, i, j)
    for k in range(len(ev.get("failure", {}).get("coefficients", []))):
        yield ("evidence", "failure", "coefficients", k, 2)


EXTENSION_CASES = [
    ("kite", [], 0),
    ("bypass", [], 0),
    ("fork", [], 1),
    ("lantern", ["--order", "top > left > right > base"], 1),
]


@pytest.mark.parametrize("field, g", EXTENSION_FIELDS)
@pytest.mark.parametrize("name, extra, code", EXTENSION_CASES)
def test_extension_field_round_trip(tmp_path, capsys, field, g, name, extra, code):
    spec, out = tmp_path / f"{name}.toml", tmp_path / "cert.json"
    spec.write_text(_over(name, field, g), encoding="utf-8")
    assert main(["certify", str(spec), *extra, "-o", str(out)]) == code
    data = json.loads(out.read_text())
    assert data["field"] == field
    if name != "lantern":  # the generator shows in the coefficients written
        assert any(g in str(_get(data, p)) for p in _coefficient_paths(data))
    capsys.readouterr()
    assert main(["verify", str(out)]) == 0
    assert capsys.readouterr().out.startswith("ACCEPTED: ")
    assert main(["check", str(spec), *extra, "--no-homological"]) == code


def _one_line_rejection(data):
    v = verify_certificate(data)
    assert not v.accepted and v.reason and "\n" not in v.reason
    return v.reason


# Coefficients each certificate below writes, and other ways to write something in their place:
# the same element written otherwise (not canonical), or text that is no element (outside the
# field, or malformed).
REWRITES = {
    "QQ(zeta8)": {
        "zeta8^3": {
            "same": ["-zeta8^7", "zeta8^3 + zeta8^4 + 1", "zeta8^3 + 0", "1*zeta8^3", "(zeta8^3)"],
            "not_element": [
                "zeta16^6",
                "i",
                "zeta8^3 + s",
                "zeta8^3 +",
                "zeta8^1.5",
                "zeta8^3 ",
                "",
            ],
        },
        "zeta8 + 1": {
            "same": ["1 + zeta8", "zeta8^1 + 1", "zeta8 + 2/2", "zeta8 - -1", "zeta8+1"],
            "not_element": ["zeta8 + 1/0", "zeta8 + 1.0"],
        },
    },
    "GF(9, w)": {  # w^2 = -w - 2 = 2*w + 1
        "2*w + 2": {
            "same": ["w^2 + 1", "-w - 1", "2*w + 5", "2*w - 1", "1/2*w + 2", "2*w^1 + 2"],
            "not_element": ["1/3*w + 2", "2*z + 2", "2*w + 2 + i", "2w + 2"],
        },
        "w + 1": {"same": ["1 + w", "w + 4", "w^2 + 2*w"], "not_element": ["w + 1/3"]},
    },
    "QQ[r]/(r^2 - 2)": {
        "-1/2*r": {
            "same": ["-2/4*r", "-r/2", "-1/2*r^1", "-1/2*r + 0", "1/r^-1/-2", "-1/4*r^3"],
            "not_element": ["-1/2*s", "-1/2*sqrt2", "-1/2*r + 1/0", "-0.5*r"],
        },
        "r + 1": {"same": ["1 + r", "r^2 + r - 1", "r + 1/1"], "not_element": ["r + r_"]},
    },
}


@pytest.mark.parametrize("field", sorted(REWRITES))
def test_extension_coefficients_canonical(field):
    from hwcat.io.spec import load_spec_text

    F = parse_field(field)
    g = F.gen_name
    for name, order in [("fork", "u > s > t"), ("bypass", "v > s > m > u")]:
        A = load_spec_text(_over(name, field, g))
        data = json.loads(json.dumps(certify(A, as_order(A, order)).data))
        assert verify_certificate(data).accepted
        seen = set()
        for path in _coefficient_paths(data):
            good = _get(data, path)
            if good not in REWRITES[field]:
                continue
            seen.add(good)
            for kind, texts in REWRITES[field][good].items():
                for text in texts:
                    if kind == "same":  # a value-preserving rewrite: F reads it as the same element
                        assert F.parse(text) == F.parse(good), text
                    bad = copy.deepcopy(data)
                    _set(bad, path, text)
                    reason = _one_line_rejection(bad)
                    if path[0] == "algebra" or path[1] == "steps":
                        assert f"{text!r} is not a canonical coefficient of {field}" in reason
        assert seen, f"{name} over {field} writes none of {sorted(REWRITES[field])}"
    # unreduced powers are named as such
    bad = copy.deepcopy(data)
    path = next(p for p in _coefficient_paths(data) if isinstance(_get(data, p), str))
    _set(bad, path, f"{_get(data, path)} + {F.modulus_text()}")
    assert "an unreduced power" in _one_line_rejection(bad)


@pytest.mark.parametrize("field, g", EXTENSION_FIELDS)
def test_extension_certificates_tamper_evident(field, g):
    """Over an extension field: integers in the prime field, integers written as text, another
    field name, and a changed coefficient are all noticed."""
    from hwcat.io.spec import load_spec_text

    p = parse_field(field).characteristic
    rng = random.Random(field)
    for name in ("kite", "bypass", "fork"):
        data = json.loads(json.dumps(certify(load_spec_text(_over(name, field, g))).data))
        assert verify_certificate(data).accepted
        _assert_tamper_evident(data, rng, 30)
        for path in _coefficient_paths(data):
            c = _get(data, path)
            bad = copy.deepcopy(data)
            if isinstance(c, int):
                others = [str(c), c + p] if p else [str(c), float(c), c + 1]
            else:
                others = [f"{c} + 1" if "+ 1" not in c else c.replace(" + 1", ""), True, None]
            for other in others:
                _set(bad, path, other)
                assert _rejects(bad), f"{path}: {other!r} for {c!r} went unnoticed"
    renamed = copy.deepcopy(data)
    other = {"QQ(zeta8)": "QQ( zeta8 )", "GF(9, w)": "GF(3^2, w)", "GF(8, h)": "GF(2^3,h)"}
    renamed["field"] = other.get(field, field.replace(" ", ""))
    assert "is not written as hwcat names it" in _one_line_rejection(renamed)


# -- random algebras ------------------------------------------------------------------------
@settings(max_examples=30, deadline=None)
@given(
    bound_quiver_algebras(
        max_vertices=3,
        max_arrows=4,
        field=st.sampled_from([GF(2), GF(3), QQ, parse_field("GF(4)"), parse_field("QQ(zeta3)")]),
    ),
    st.randoms(use_true_random=False),
)
def test_random_algebras(A, rng):
    perm = list(range(A.n))
    rng.shuffle(perm)
    order = total_order(A.vertices, perm)
    data = json.loads(json.dumps(certify(A, order).data))
    v = verify_certificate(data)
    assert v.accepted, v.reason
    # agrees with the independent heredity-chain computation
    assert v.quasi_hereditary == heredity_chain(A, order).holds
    _assert_tamper_evident(data, rng, 6)
    if v.quasi_hereditary and A.n > 1:
        # a certificate presented for another order is rejected
        other = copy.deepcopy(data)
        chain = other["order"]["chain"]
        i = rng.randrange(A.n - 1)
        chain[i], chain[i + 1] = chain[i + 1], chain[i]
        assert _rejects(other)
    paths = list(_coefficient_paths(data))
    for path in rng.sample(paths, min(3, len(paths))):
        bad = copy.deepcopy(data)
        c = _get(data, path)
        _set(bad, path, f"({c})" if isinstance(c, str) else str(c))  # the same value, not canonical
        assert _rejects(bad), f"{path}: {c!r} written otherwise went unnoticed"


@settings(max_examples=15)
@given(bound_quiver_algebras(min_vertices=2, max_vertices=4, max_arrows=5, acyclic=True))
def test_random_partial_orders_match_check(A):
    """The search's essential order (partial): the verdict agrees with the heredity-chain check."""
    cert = certify(A)
    v = verify_certificate(cert.data)
    assert v.accepted
    assert v.quasi_hereditary == heredity_chain(A, cert.order).holds


# -- schemas of the --json outputs ------------------------------------------------------------
@pytest.mark.parametrize(
    "argv, name",
    [
        (["describe", f"{EXAMPLES}/lantern.toml"], "describe"),
        (["check", f"{EXAMPLES}/lantern.toml"], "check"),
        (["check", f"{EXAMPLES}/carousel.toml"], "check"),
        (["check", f"{EXAMPLES}/kite.toml", "--no-homological"], "check"),
        (["orders", f"{EXAMPLES}/kite.toml"], "orders"),
        (["orders", f"{EXAMPLES}/carousel.toml"], "orders"),
        (["family", "linear-a", "n=3"], "family"),
        (["family", "cyclic-group", "m=2", "field=GF(2)"], "family"),
        # the reduction record: table route, spin chain, restricted spin chain
        (["family", "temperley-lieb", "n=4", "delta=0", "field=GF(5)"], "family"),
        (
            ["family", "temperley-lieb", "n=4", "delta=1", "field=GF(7)", "route=spin-chain"],
            "family",
        ),
        (
            ["family", "temperley-lieb", "n=5", "delta=0", "field=GF(3)", "route=spin-chain"],
            "family",
        ),
    ],
)
def test_json_outputs_match_schemas(capsys, schemas, argv, name):
    main([*argv, "--json"])
    data = json.loads(capsys.readouterr().out)
    schemas[name].validate(data)
    if "temperley-lieb" in argv:
        assert "reduction" in data  # validated by the schema's reduction object


def test_check_json_with_an_undecided_ext_condition_matches_the_schema(capsys, schemas):
    # specs/FORMAT.md, hwcat check --json: holds is null for an Ext condition the work
    # budget left undecided; a budget of 1 leaves some of the kite's undecided (derived)
    argv = ["check", f"{EXAMPLES}/kite.toml", "--max-syzygy-dimension", "1", "--json"]
    assert main(argv) == 0
    data = json.loads(capsys.readouterr().out)
    assert None in [a["holds"] for a in data["axioms"]]
    schemas["check"].validate(data)


# one element of each kind of extension field, not in the prime field (specs/FORMAT.md, Fields)
# compound elements (sums, powers, fractions) for the relations of the schema checks below
COMPOUND_ELEMENTS = [
    ("QQ(zeta8)", "zeta8"),
    ("GF(9, w)", "w + 1"),
    ("GF(2^3, g)", "g^2 + g"),
    ("QQ[r]/(r^2 - 2)", "-1/2*r + 3"),
    ("GF(3)[w]/(w^2 + 1)", "2*w"),
]


def _spec_file(tmp_path, name, field, c):
    """The example ``name`` over ``field`` with the element ``c`` in a relation, as a file."""
    path = tmp_path / f"{name}.toml"
    path.write_text(_over(name, field, f"({c})"), encoding="utf-8")
    return str(path)


def _strings(x):
    if isinstance(x, str):
        yield x
    elif isinstance(x, (list, dict)):
        for y in x.values() if isinstance(x, dict) else x:
            yield from _strings(y)


@pytest.mark.parametrize("field, c", COMPOUND_ELEMENTS, ids=[f for f, _ in COMPOUND_ELEMENTS])
def test_outputs_over_extension_fields_match_schemas_and_verify(
    tmp_path, capsys, schemas, field, c
):
    kite = _spec_file(tmp_path, "kite", field, c)
    lantern = _spec_file(tmp_path, "lantern", field, c)
    for argv, name in [
        (["describe", kite], "describe"),
        (["check", kite, "--no-homological"], "check"),
        (["orders", lantern], "orders"),
        (["family", "zigzag-a", "n=3", f"field={field}"], "family"),
        (["describe", "--family", "zigzag-a", "n=3", f"field={field}"], "describe"),
    ]:
        assert main([*argv, "--json"]) in (0, 1)
        schemas[name].validate(json.loads(capsys.readouterr().out))
    for spec, extra, code in [
        (kite, [], 0),
        (lantern, ["--order", "top > left > right > base"], 1),
    ]:
        out = tmp_path / "cert.json"
        assert main(["certify", spec, *extra, "-o", str(out)]) == code
        data = json.loads(out.read_text())
        schemas["certificate"].validate(data)
        written = [x for x in _strings(data["algebra"]["right_action"]) if x not in ("0", "1")]
        assert written, "no coefficient outside the prime field was written"
        capsys.readouterr()
        assert main(["verify", str(out), "--json"]) == 0
        v = json.loads(capsys.readouterr().out)
        schemas["verify"].validate(v)
        assert v["accepted"] and v["quasi_hereditary"] is (code == 0)
    # a coefficient written another way than hwcat writes it is not canonical
    text = out.read_text()
    bad = json.loads(text.replace(json.dumps(written[0]), json.dumps(f"0 + {written[0]}"), 1))
    assert _rejects(bad)


def test_schemas_reject_wrong_outputs(schemas):
    import jsonschema

    with pytest.raises(jsonschema.ValidationError):
        schemas["orders"].validate({"name": "x"})
    with pytest.raises(jsonschema.ValidationError):
        schemas["certificate"].validate(
            {"format": "hwcat-certificate", "version": 1, "quasi_hereditary": "yes"}
        )


# -- hwcat.testing ----------------------------------------------------------------------------
def test_readme_collaborator_example_runs():
    """The ten-line test file shown in README.md passes as written."""
    text = open("README.md", encoding="utf-8").read()
    block = text.split("collaborator's `tests/test_our_algebra.py`:")[1]
    code = block.split("```python\n")[1].split("```")[0]
    assert len(code.strip().splitlines()) <= 12
    env: dict = {}
    exec(compile(code, "README.md", "exec"), env)
    env["test_highest_weight"]()


def test_testing_helpers_fail_with_witness():
    from hwcat.testing import assert_cartan, assert_not_quasi_hereditary, assert_quasi_hereditary

    lantern = f"{EXAMPLES}/lantern.toml"
    with pytest.raises(AssertionError, match="kernel element"):
        assert_quasi_hereditary(lantern, "top > left > right > base")
    with pytest.raises(AssertionError, match="not quasi-hereditary for any order"):
        assert_quasi_hereditary(f"{EXAMPLES}/carousel.toml")
    with pytest.raises(AssertionError, match=r"standard modules: Delta\(base\)"):
        assert_not_quasi_hereditary(lantern)
    with pytest.raises(AssertionError, match=r"\[P\(base\) : L\(base\)\] = 1, expected 2"):
        assert_cartan(lantern, [[2, 0, 1, 1], [1, 1, 0, 0], [1, 0, 2, 1], [1, 1, 1, 1]])
    # a hereditary algebra: quasi-hereditary for every order (Dlab-Ringel 1989)
    A = algebra_from_spec(linear_A(3))
    for perm in itertools.permutations(range(3)):
        assert_quasi_hereditary(A, total_order(A.vertices, perm))


@pytest.mark.parametrize(
    "text, qh",
    [
        ('field = "QQ"\n[quiver]\nvertices = ["1", "2"]\narrows = []', True),
        (
            'field = "GF(2)"\n[quiver]\nvertices = ["x"]\narrows = ["t: x -> x"]\nvanish_from_length = 3',
            False,
        ),
        (
            'field = "QQ"\n[quiver]\nvertices = ["1", "2"]\narrows = ["a: 1 -> 2", "b: 2 -> 1"]\nrelations = ["a*b*a", "b*a*b"]',
            False,
        ),
    ],
)
def test_small_cases(text, qh):
    """Semisimple: quasi-hereditary (common practice); k[t]/(t^3) and the cyclic Nakayama
    algebra with Kupisch series (3, 3) are self-injective, not semisimple: never (Ringel 2010)."""
    from hwcat.io.spec import load_spec_text

    data = certify(load_spec_text(text)).data
    v = verify_certificate(data)
    assert v.accepted and v.quasi_hereditary is qh
    _assert_tamper_evident(data, random.Random(0), 40)
