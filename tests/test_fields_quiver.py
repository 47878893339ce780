"""Bound quiver algebras over GF(p^k) and number fields, end to end.

A bound quiver algebra is split basic over any field, so the same quiver and
relations (with coefficients in the prime field) give the same Cartan matrix,
verdicts and counts over an extension: the path-algebra dimensions and
ranks are unchanged by extending scalars (common practice: the rank of a
matrix does not change under field extension).
"""

from __future__ import annotations

import copy
import subprocess
import sys

import pytest
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from hwcat import check_order, describe, load_spec_text, quasi_hereditary_orders, total_order
from hwcat.errors import CoefficientError, HwcatError, RelationError
from hwcat.exact import GF, QQ
from hwcat.strategies import algebra_from_spec, bound_quiver_specs

PAIRS = [
    (GF(2), "GF(4)"),
    (GF(2), "GF(8)"),
    (GF(3), "GF(9)"),
    (QQ, "QQ(zeta8)"),
    (QQ, "QQ[r]/(r^2 - 2)"),
]


def _summary(A):
    d = describe(A)
    r = quasi_hereditary_orders(A, list_limit=0)
    v = check_order(A, total_order(A.vertices, range(A.n)), homological=False)
    return (
        d.dimension,
        d.cartan,
        tuple(p.radical_layers for p in d.projectives),
        r.quasi_hereditary,
        r.quasi_hereditary_total_orders,
        r.structures,
        v.quasi_hereditary,
    )


@pytest.mark.parametrize("base, ext", PAIRS)
@settings(max_examples=6, deadline=None, suppress_health_check=list(HealthCheck))
@given(data=st.data())
def test_same_algebra_over_an_extension(base, ext, data):
    spec = data.draw(bound_quiver_specs(max_vertices=3, max_arrows=4, field=base))
    A = algebra_from_spec(spec)
    spec2 = copy.deepcopy(spec)
    spec2["field"] = ext
    B = algebra_from_spec(spec2)
    assert str(B.field) == ext.replace(" ", "") or B.field.name == ext
    assert _summary(A) == _summary(B)


KITE = """
field = "{field}"
[quiver]
vertices = ["1", "2", "3", "4"]
arrows = ["a: 1 -> 2", "b: 2 -> 4", "c: 1 -> 3", "d: 3 -> 4", "e: 4 -> 1"]
relations = ["{rel}", "e*a", "e*c", "b*e", "d*e"]
"""


@pytest.mark.parametrize(
    "field, rel",
    [
        ("GF(4)", "z*a*b + (z + 1)*c*d"),
        ("GF(8)", "z^5*a*b - (z^2 + z)*c*d"),
        ("GF(9, w)", "w*a*b + 1/w*c*d"),
        ("QQ(zeta8)", "zeta8*a*b + (zeta8^2 - 1)*c*d"),
        ("QQ[r]/(r^2 - 2)", "r*a*b - (r + 1)/3*c*d"),
    ],
)
def test_generator_coefficients(field, rel):
    # rescaling the arrow a by a nonzero scalar turns lambda*a*b + mu*c*d into
    # mu*(a*b + c*d): the same algebra as over the prime field (derived)
    A = load_spec_text(KITE.format(field=field, rel=rel))
    base = (
        "GF(2)"
        if field.startswith("GF(4)") or field.startswith("GF(8)")
        else "GF(3)"
        if field.startswith("GF(9")
        else "QQ"
    )
    B = load_spec_text(KITE.format(field=base, rel="a*b + c*d"))
    assert A.field.name.startswith(field.split(",")[0].split("[")[0].rstrip(")"))
    assert _summary(A) == _summary(B)


def test_relation_printing_round_trip():
    from hwcat.algebras.reduction.presentation import presentation_toml

    A = load_spec_text(KITE.format(field="GF(4)", rel="z*a*b + (z + 1)*c*d"))
    text = presentation_toml(A)
    assert 'field = "GF(4)"' in text
    B = load_spec_text(text)
    assert _summary(A) == _summary(B)


@pytest.mark.parametrize(
    "field, rel, err, fragment",
    [
        ("GF(4)", "w*a*b + c*d", RelationError, "'w' is not an arrow"),
        ("QQ[r]/(r^2 - 2)", "(r + s)*a*b + c*d", CoefficientError, "unknown name 's'"),
        ("GF(4)", "1/2*a*b + c*d", CoefficientError, "division by zero"),
        ("QQ(zeta4)", "(zeta4^2 + 1)^-1*a*b + c*d", CoefficientError, "division by zero"),
    ],
)
def test_bad_coefficients(field, rel, err, fragment):
    with pytest.raises(err) as exc:
        load_spec_text(KITE.format(field=field, rel=rel), source="k.toml")
    assert fragment in str(exc.value)


def test_generator_named_like_an_arrow():
    text = KITE.format(field="GF(4)", rel="a*b + c*d").replace('"e: 4 -> 1"', '"z: 4 -> 1"')
    text = text.replace("e*a", "z*a").replace("e*c", "z*c").replace("b*e", "b*z")
    text = text.replace("d*e", "d*z")
    with pytest.raises(HwcatError, match="rename the generator"):
        load_spec_text(text)


@pytest.mark.parametrize(
    "field, fragment",
    [
        ("GF(12)", "12 is not a prime power"),
        ("QQ[r]/(r^2 - 9)", "factor r - 3"),
        ("QQ[r]/(3*r^2 - 1)", "not monic"),
    ],
)
def test_cli_bad_field_exit_2(tmp_path, field, fragment):
    p = tmp_path / "bad.toml"
    p.write_text(KITE.format(field=field, rel="a*b + c*d"))
    res = subprocess.run(
        [sys.executable, "-m", "hwcat", "describe", str(p)], capture_output=True, text=True
    )
    assert res.returncode == 2
    lines = res.stderr.strip().splitlines()
    assert len(lines) == 1 and "bad.toml" in lines[0] and "field" in lines[0]
    assert fragment in lines[0]


def test_cli_over_cyclotomic_field(tmp_path):
    p = tmp_path / "k.toml"
    p.write_text(KITE.format(field="QQ(zeta8)", rel="zeta8*a*b + c*d"))
    for cmd in ("describe", "check", "orders"):
        res = subprocess.run(
            [sys.executable, "-m", "hwcat", cmd, "--json", str(p)], capture_output=True, text=True
        )
        assert res.returncode in (0, 1), res.stderr
        assert "Traceback" not in res.stderr


@pytest.mark.parametrize("field", ["GF(4)", "GF(9)", "QQ(zeta3)", "QQ[r]/(r^2 - 2)"])
@settings(max_examples=5, deadline=None, suppress_health_check=list(HealthCheck))
@given(data=st.data())
def test_random_specs_with_generator_coefficients(field, data):
    # coefficients anywhere in the field; check_order compares the module-theoretic
    # verdict with the heredity chain and raises on disagreement (two computations)
    from hwcat.exact import parse_field

    spec = data.draw(bound_quiver_specs(max_vertices=3, max_arrows=4, field=parse_field(field)))
    A = algebra_from_spec(spec)
    r = quasi_hereditary_orders(A, list_limit=0)
    v = check_order(A, total_order(A.vertices, range(A.n)), homological=False)
    assert r.quasi_hereditary_total_orders >= int(v.quasi_hereditary)
