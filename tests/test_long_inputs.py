"""Long numbers and oversized inputs: a named error or a correct answer, never a traceback.

Python refuses to convert integers of more than 4300 digits from or to text
(its default limit); hwcat reads long coefficients itself, writes long numbers
in its JSON output, and refuses integer literals beyond the limit in TOML with
the spec's own error.  Fields are bounded before anything is computed from
their size (``specs/FORMAT.md``, fields).  Mathematical facts used: phi(p) =
p - 1 for a prime p (common practice); 2^63 has 19 digits (common practice); 2^63 - 25 is
a prime (from memory).
"""

from __future__ import annotations

from pathlib import Path

import pytest

from hwcat.cli import main
from hwcat.errors import (
    CoefficientError,
    FieldError,
    ModuleFileError,
    NotFiniteDimensional,
    ResourceLimitError,
    SpecSyntaxError,
)
from hwcat.exact import QQ, parse_field
from hwcat.io.spec import load_spec_text

LONG = "7" * 5000  # more digits than Python converts from text by default
A3_TWO_PATHS = (
    'field = "QQ"\n[quiver]\nvertices = ["1", "2", "3"]\n'
    'arrows = ["a: 1 -> 2", "b: 2 -> 3", "c: 1 -> 2", "d: 2 -> 3"]\n'
)


def _one_error_line(capsys, argv: list[str], fragment: str) -> None:
    rc = main(argv)
    out, err = capsys.readouterr()
    assert rc == 2, err
    assert out == "" and "Traceback" not in err
    lines = err.strip().splitlines()
    assert len(lines) == 1 and fragment in lines[0], err


def test_long_integer_literal_in_toml_is_a_spec_error(tmp_path: Path, capsys) -> None:
    text = f'field = "QQ"\nseed = {LONG}\n[multiplication]\nbasis = ["e"]\nunit = "e"\n'
    with pytest.raises(SpecSyntaxError, match="more than 4300 digits"):
        load_spec_text(text, "long.toml")
    path = tmp_path / "long.toml"
    path.write_text(text, encoding="utf-8")
    _one_error_line(capsys, ["describe", str(path)], "long.toml: an integer literal")


def test_long_integer_in_a_module_file_is_a_module_file_error(tmp_path: Path, capsys) -> None:
    spec = tmp_path / "a2.toml"
    spec.write_text('field = "QQ"\n[quiver]\nvertices = ["1", "2"]\narrows = ["a: 1 -> 2"]\n')
    mod = tmp_path / "m.toml"
    mod.write_text(f"[dimensions]\n1 = {LONG}\n", encoding="utf-8")
    _one_error_line(capsys, ["module", str(spec), "--module", str(mod)], "integer literal")
    from hwcat.io.module_file import _read_toml

    with pytest.raises(ModuleFileError):
        _read_toml(str(mod))


def test_long_coefficients_are_read_exactly() -> None:
    x = QQ.parse(f"-{LONG}/3")
    assert x * 3 == -QQ.parse(LONG)
    with pytest.raises(CoefficientError):
        QQ.parse(f"{LONG}/0")


def test_long_output_numbers_are_written_and_verified(tmp_path: Path, capsys) -> None:
    # a relation with a 3000-digit coefficient over its reciprocal: the certificate holds
    # numbers of about 6000 digits
    c, d = "7" * 3000, "3" * 2999 + "1"
    spec = tmp_path / "long.toml"
    spec.write_text(A3_TWO_PATHS + f'relations = ["{c}*a*b - 1/{d}*c*d"]\n', encoding="utf-8")
    cert = tmp_path / "c.json"
    assert main(["certify", str(spec), "-o", str(cert)]) == 0
    assert main(["describe", str(spec), "--json"]) == 0
    capsys.readouterr()
    assert main(["verify", str(cert)]) == 0
    assert capsys.readouterr().out.startswith("ACCEPTED")


@pytest.mark.parametrize(
    ("text", "fragment"),
    [
        ('{"version": ' + LONG + "}", "format: missing"),
        ('{"format": "hwcat-certificate", "version": ' + LONG + "}", "a longer integer"),
        ("[" * 100000 + "]" * 100000, "nested too deeply"),
    ],
    ids=["long version", "long version with format", "deep nesting"],
)
def test_hostile_certificates_are_one_line(tmp_path: Path, capsys, text: str, fragment) -> None:
    from hwcat.verify import FORMAT

    path = tmp_path / "c.json"
    path.write_text(text.replace("hwcat-certificate", FORMAT), encoding="utf-8")
    _one_error_line(capsys, ["verify", str(path)], fragment)


@pytest.mark.parametrize(
    ("name", "fragment"),
    [
        (f"GF({LONG})", "below 2^63"),
        ("GF(1" + "0" * 3998 + "7)", "below 2^63"),  # refused before it is factored
        ("GF(2^99999999999)", "below 2^63"),  # refused before 2^k is computed
        ("GF(3^40)", "below 2^63"),
        ("GF(4^2)", "4 is not a prime"),
        ("QQ(zeta10000019)", "degree"),
        ("QQ(zeta18446744073709551615)", "degree"),
        ("QQ(zeta18446744073709551616)", "degree"),
        ("QQ(zeta1009)", "phi(1009) = 1008"),  # 1009 is a prime
        ("QQ[r]/(r^1001 - 2)", "exponent above 1000"),
        ("QQ[r]/(r^99999999999 - 2)", "exponent above 1000"),
    ],
)
def test_field_sizes_are_bounded_first(name: str, fragment: str) -> None:
    with pytest.raises(FieldError) as info:
        parse_field(name)
    assert fragment in str(info.value)


def test_fields_at_the_bounds_are_built() -> None:
    assert parse_field("GF(2^62)").order == 1 << 62
    # 2^63 - 25 is the largest prime below 2^63 (from memory)
    assert parse_field("GF(9223372036854775783)").characteristic == 9223372036854775783
    assert parse_field("QQ(zeta1111)").degree == 1000  # phi(11 * 101) = 10 * 100


# -- matrix sizes against the limits, before anything is allocated ----------------------------


@pytest.mark.parametrize(
    ("size", "fragment"),
    [(100_000_000, "max_dim"), (10**21, "about 10^21 rows"), (10_000, "max_products")],
)
def test_sparse_matrix_sizes_are_checked_first(size: int, fragment: str) -> None:
    text = (
        'field = "QQ"\n[matrices]\n'
        f"generators = {{ E = {{ size = [{size}, {size}], entries = [[0, 1, 1]] }} }}\n"
    )
    with pytest.raises(ResourceLimitError) as info:
        load_spec_text(text, "big.toml")
    assert "big.toml: matrices.generators.E.size" in str(info.value)
    assert fragment in str(info.value)


KITE = Path(__file__).resolve().parents[1] / "specs" / "examples" / "kite.toml"
PLAQUETTE = KITE.with_name("plaquette.toml")


@pytest.mark.parametrize(
    ("spec", "module", "fragment"),
    [
        (KITE, "[dimensions]\ntail = 1000000\n[matrices]\n", "dimensions: each matrix"),
        (KITE, "[dimensions]\ntail = 20000\n[matrices]\n", "max_products"),
        (PLAQUETTE, "dimension = 100000000\n[matrices]\n", "dimension: each matrix"),
    ],
    ids=["tail 10^6", "tail 20000", "dimension 10^8"],
)
def test_module_file_sizes_are_checked_first(tmp_path: Path, capsys, spec, module, fragment):
    mod = tmp_path / "m.toml"
    mod.write_text(module, encoding="utf-8")
    _one_error_line(capsys, ["module", str(spec), "--module", str(mod)], fragment)


# -- family sizes compared without computing them ---------------------------------------------


@pytest.mark.parametrize(
    "argv",
    [
        ["family", "temperley-lieb", "n=99999999999999999999"],
        ["family", "temperley-lieb", "n=99999999999999999999", "route=spin-chain", "field=GF(5)"],
        [
            "module",
            "--family",
            "temperley-lieb",
            "n=99999999999999999999",
            "delta=0",
            "field=GF(5)",
            "--module",
            "spin-chain",
        ],
    ],
    ids=["table", "spin-chain route", "spin-chain module"],
)
def test_huge_temperley_lieb_is_refused_at_once(capsys, argv: list[str]) -> None:
    # Catalan(n) > 2^n for n > 3 and the spin chain has dimension 2^n (common practice)
    _one_error_line(capsys, argv, "above the limit max_dim")


# -- a proof of infinite dimension ends the build before it starts ----------------------------


def _loops(k: int) -> str:
    arrows = ", ".join(f'"a{i}: 1 -> 1"' for i in range(k))
    relations = ", ".join(f'"a{i}*a{i}"' for i in range(k))
    return f'field = "QQ"\n[quiver]\nvertices = ["1"]\narrows = [{arrows}]\nrelations = [{relations}]\n'


def test_golod_shafarevich_proof_is_raised_before_building() -> None:
    # k loops with the k relations a_i^2: 1 - k t + k t^2 < 0 at t = 1/2 for k >= 5, so the
    # algebra is infinite dimensional (Golod-Shafarevich inequality, from memory)
    with pytest.raises(NotFiniteDimensional, match="Golod-Shafarevich"):
        load_spec_text(_loops(300), "loops.toml")


def test_dense_quotient_maps_respect_the_limits(monkeypatch) -> None:
    # without the proof, degree 2 of 100 loops has 100^2 paths and 100 relations: the dense
    # quotient map (10000 x 9900) is refused by the limit instead of being allocated
    from hwcat.algebras.inputs import bound

    monkeypatch.setattr(bound, "golod_shafarevich_witness", lambda *args: None)
    with pytest.raises(ResourceLimitError, match="quotient map of the paths of length 2"):
        load_spec_text(_loops(100), "loops.toml")


# -- survey grids ---------------------------------------------------------------------------


@pytest.mark.parametrize(
    ("values", "fragment"),
    [
        (["n=1..99999999999999"], "about 10^13 members"),
        ([f"n=1..{LONG}"], "about 10^4999 members"),
        (["n=1..1000", "field=" + ";".join(["QQ"] * 101)], "101000 members (1000 x 101)"),
    ],
    ids=["long range", "range of 5000 digits", "product"],
)
def test_oversized_survey_grid_is_refused_up_front(tmp_path: Path, capsys, values, fragment):
    pytest.importorskip("dask")
    out = tmp_path / "x.csv"
    _one_error_line(capsys, ["survey", "linear-a", *values, "-o", str(out)], fragment)
    assert not out.exists()


def test_size_text_of_long_numbers() -> None:
    from hwcat.limits import size_text

    # 10^k has k + 1 digits (common practice)
    assert [size_text(x) for x in (999_999_999_999, 10**12, 10**100 - 1, 10**5000)] == [
        "999999999999",
        "about 10^12",
        "about 10^99",
        "about 10^5000",
    ]
