"""Hostile inputs: every one ends with exit code 2 and one specific line on standard error.

Each row of the table is a command line (with the files it needs), the message
fragment the one line must contain, and why that is the right answer.  Every row
runs through the command line entry point ``hwcat.cli.main([...])``: exit code 2,
exactly one line on standard error, no traceback, and no row may run without
end (the resource limits and the work budget stop them; see ``README.md``,
resource limits).  A few rows also run in a fresh interpreter.

The expectations are the rules of ``specs/FORMAT.md`` and of the command line's
help; the mathematical facts are named beside the rows: 4 is not a prime, 1/7 is
not in GF(7) (common practice); a free loop or two loops with one quadratic
relation give an infinite-dimensional algebra (common practice; the second by
the Golod-Shafarevich inequality, from memory); Catalan(100000) and 40! exceed any
machine (common practice).
"""

from __future__ import annotations

import subprocess
import sys
from dataclasses import dataclass, field
from pathlib import Path

import pytest

from hwcat.cli import main

REPO = Path(__file__).resolve().parents[1]

QUIVER_A2 = 'field = "QQ"\n[quiver]\nvertices = ["1", "2"]\narrows = ["a: 1 -> 2"]\n'
TWO_LOOPS = '[quiver]\nvertices = ["1"]\narrows = ["x0: 1 -> 1", "x1: 1 -> 1"]\n'
MULT_HEAD = 'field = "QQ"\n[multiplication]\n'


@dataclass(frozen=True)
class Case:
    label: str
    argv: tuple[str, ...]  # "{spec}" stands for the spec file written from `text`
    fragment: str
    text: str | bytes | None = None
    files: dict[str, str] = field(default_factory=dict)


def spec(label: str, text: str | bytes, fragment: str, *extra: str, command="describe") -> Case:
    return Case(label, (command, "{spec}", *extra), fragment, text)


CASES = [
    # -- files -------------------------------------------------------------------------------
    Case("missing file", ("describe", "{dir}/no-such-file.toml"), "cannot read"),
    Case("directory", ("describe", "{dir}"), "cannot read"),
    spec("binary, not UTF-8", b"\xff\xfe\x00\x01binary", "not UTF-8"),
    spec("binary with NUL bytes", b"field = \x00\x00\n", "not valid TOML"),
    spec("empty file", "", "field: missing"),
    spec("not TOML", "field = = 3\n", "not valid TOML"),
    # -- header ------------------------------------------------------------------------------
    spec("field missing", '[quiver]\nvertices = ["1"]\n', "field: missing"),
    spec("field not a prime power", 'field = "GF(6)"\n' + TWO_LOOPS, "6 is not a prime power"),
    spec("unknown field", 'field = "RR"\n' + TWO_LOOPS, "RR"),
    spec("field is a number", "field = 3\n" + TWO_LOOPS, "field"),
    spec("field is a float", "field = 2.5\n" + TWO_LOOPS, "field"),
    spec("no algebra table", 'field = "QQ"\n', "[quiver]"),
    spec("two kinds", QUIVER_A2 + "[multiplication]\nbasis = ['e']\n", "exactly one of"),
    spec("unknown key", 'colour = "red"\n' + QUIVER_A2, "colour: unknown key"),
    spec("unknown format", "format = 2\n" + QUIVER_A2, "only format 1"),
    spec("name not a string", "name = 5\n" + QUIVER_A2, "is not a string"),
    spec("order not a string", "order = 3\n" + QUIVER_A2, "order"),
    # -- quivers -----------------------------------------------------------------------------
    spec("vertices missing", 'field = "QQ"\n[quiver]\narrows = []\n', "vertices: missing"),
    spec("no vertices", 'field = "QQ"\n[quiver]\nvertices = []\n', "no vertices"),
    spec("vertex named twice", 'field = "QQ"\n[quiver]\nvertices = ["1", "1"]\n', "'1'"),
    spec("vertex a float", 'field = "QQ"\n[quiver]\nvertices = [1.5]\n', "1.5"),
    spec(
        "arrow to an unknown vertex",
        'field = "QQ"\n[quiver]\nvertices = ["1"]\narrows = ["a: 1 -> 5"]\n',
        "'5'",
    ),
    spec(
        "malformed arrow",
        'field = "QQ"\n[quiver]\nvertices = ["1", "2"]\narrows = ["a 1 2"]\n',
        "a 1 2",
    ),
    spec("relation with an unknown arrow", QUIVER_A2 + 'relations = ["a*z"]\n', "z"),
    spec("relation of length one", QUIVER_A2 + 'relations = ["a"]\n', "relations[0]"),
    spec(
        "float coefficient in a relation",
        'field = "QQ"\n[quiver]\nvertices = ["1", "2", "3"]\n'
        'arrows = ["a: 1 -> 2", "b: 2 -> 3", "c: 1 -> 2", "d: 2 -> 3"]\n'
        'relations = ["0.5*a*b - c*d"]\n',
        "0.5",
    ),
    spec(
        "1/7 in GF(7)",
        'field = "GF(7)"\n' + TWO_LOOPS + 'relations = ["1/7*x0*x1"]\nvanish_from_length = 3\n',
        "1/7",
    ),
    spec(
        "mixed lengths without a bound",
        'field = "QQ"\n' + TWO_LOOPS + 'relations = ["x0*x1 - x0*x0*x0"]\n',
        "vanish_from_length",
    ),
    spec("vanish_from_length = 1", QUIVER_A2 + "vanish_from_length = 1\n", "at least 2"),
    spec("vanish_from_length = -3", QUIVER_A2 + "vanish_from_length = -3\n", "at least 2"),
    spec("vanish_from_length a float", QUIVER_A2 + "vanish_from_length = 2.5\n", "2.5"),
    spec("vanish_from_length a string", QUIVER_A2 + 'vanish_from_length = "3"\n', "'3'"),
    # -- sizes and infinite dimension --------------------------------------------------------
    spec(
        "a free loop",
        'field = "QQ"\n[quiver]\nvertices = ["1"]\narrows = ["x: 1 -> 1"]\n',
        "infinite dimensional",
    ),
    spec(
        "two loops, one quadratic relation over QQ",
        'field = "QQ"\n' + TWO_LOOPS + 'relations = ["1000003*x0*x0 + 7*x0*x1 + 2*x1*x1"]\n',
        "Golod-Shafarevich",
    ),
    spec(
        "two loops, one relation over GF(2^61 - 1)",
        'field = "GF(2305843009213693951)"\n' + TWO_LOOPS + 'relations = ["x0*x1 - 3*x1*x0"]\n',
        "infinite dimensional",
    ),
    spec(
        "two loops, vanish_from_length = 100000",
        'field = "QQ"\n' + TWO_LOOPS + "vanish_from_length = 100000\n",
        "above the limit max_dim",
    ),
    spec(
        "one loop, vanish_from_length = 10^9",
        'field = "QQ"\n[quiver]\nvertices = ["1"]\narrows = ["x: 1 -> 1"]\n'
        "vanish_from_length = 1000000000\n",
        "--max-dim",
    ),
    spec(
        "3000 vertices",
        'field = "QQ"\n[quiver]\nvertices = [' + ", ".join(f'"v{i}"' for i in range(3000)) + "]\n",
        "max_vertices",
    ),
    # -- multiplication tables ---------------------------------------------------------------
    spec("basis element named 1", MULT_HEAD + 'basis = ["1", "x"]\n', "basis[0]"),
    spec("basis element named 2/3", MULT_HEAD + 'basis = ["e", "2/3"]\n', "basis[1]"),
    spec("empty basis", MULT_HEAD + "basis = []\n", "basis is empty"),
    spec("basis not a list", MULT_HEAD + 'basis = "e"\n', "list of strings"),
    spec(
        "product of an unknown element",
        MULT_HEAD + 'basis = ["e"]\nproducts = ["e*f = e"]\n',
        "'f' is not a basis element",
    ),
    spec(
        "float coefficient in a product",
        MULT_HEAD + 'basis = ["e", "x"]\nunit = "e"\nproducts = ["x*x = 0.5*x"]\n',
        "0.5",
    ),
    spec(
        "not associative",
        MULT_HEAD + 'basis = ["e", "x", "y"]\nunit = "e"\nproducts = ["x*x = y", "x*y = e"]\n',
        "not associative",
    ),
    spec("no identity", MULT_HEAD + 'basis = ["x"]\nproducts = []\n', "no identity"),
    spec(
        "wrong unit",
        MULT_HEAD + 'basis = ["a", "b"]\nunit = "a + b"\nproducts = ["a*a = a"]\n',
        "(a + b) * b",
    ),
    spec(
        "seed a float",
        MULT_HEAD + 'basis = ["e"]\nunit = "e"\nseed = 1.5\n',
        "seed: 1.5 is not an integer",
    ),
    # -- matrices ----------------------------------------------------------------------------
    spec(
        "matrix not square",
        'field = "QQ"\n[matrices]\ngenerators = { E = [[0, 1, 0], [0, 0, 0]] }\n',
        "not square",
    ),
    spec(
        "float matrix entry",
        'field = "QQ"\n[matrices]\ngenerators = { E = [[0, 1.5], [0, 0]] }\n',
        "1.5",
    ),
    spec(
        "ragged matrix",
        'field = "QQ"\n[matrices]\ngenerators = { E = [[0, 1], [0]] }\n',
        "row 1 has 1 entries",
    ),
    # -- options -----------------------------------------------------------------------------
    spec("empty order", QUIVER_A2, "empty", "--order", "", command="check"),
    spec("order names an unknown vertex", QUIVER_A2, "'9'", "--order", "9 > 1", command="check"),
    spec("empty order in the spec", 'order = ""\n' + QUIVER_A2, "empty", command="check"),
    spec(
        "spec order names an unknown vertex",
        'order = "3 > 1"\n' + QUIVER_A2,
        "'3'",
        command="check",
    ),
    spec("cyclic order", QUIVER_A2, "cycle", "--order", "1 > 2, 2 > 1", command="check"),
    spec("--limit -1", QUIVER_A2, "--limit", "--limit", "-1", command="orders"),
    spec("--limit 0", QUIVER_A2, "positive", "--limit", "0", command="orders"),
    spec("--limit 2.5", QUIVER_A2, "not an integer", "--limit", "2.5", command="orders"),
    spec("--max-dim 0", QUIVER_A2, "positive", "--max-dim", "0"),
    Case("unknown command", ("frobnicate",), "invalid choice"),
    # -- families ----------------------------------------------------------------------------
    Case("unknown family", ("family", "no-such-family", "n=3"), "unknown family"),
    Case("negative family size", ("family", "temperley-lieb", "n=-1"), "n must be at least 0"),
    Case("zero cyclic group", ("family", "cyclic-group", "m=0"), "m must be at least 1"),
    Case("family parameter missing", ("family", "temperley-lieb"), "n is required"),
    Case("family parameter not an integer", ("family", "schur", "r=x"), "'x'"),
    Case("family parameter a float", ("family", "schur", "r=2.5"), "'2.5'"),
    Case("family parameter not key=value", ("family", "schur", "r"), "key=value"),
    Case(
        "family loop parameter a float",
        ("family", "temperley-lieb", "n=3", "delta=0.5"),
        "'0.5' is not a coefficient",
    ),
    Case(
        "tensor product over a quiver family",
        (
            "module",
            "--family",
            "linear-a",
            "n=2",
            "--module",
            "regular",
            "--tensor",
            "regular",
            "--coproduct",
            "group",
        ),
        "given by a quiver",
    ),
    Case(
        "--coproduct without --tensor",
        (
            "module",
            "--family",
            "symmetric-group",
            "n=3",
            "--module",
            "regular",
            "--coproduct",
            "group",
        ),
        "--coproduct: give the second factor with --tensor",
    ),
    Case("unknown family parameter", ("family", "schur", "r=2", "s=3"), "unknown parameter"),
    # a parameter given twice is refused, as survey refuses it (README, hwcat survey)
    Case(
        "family parameter twice",
        ("family", "temperley-lieb", "n=4", "n=5"),
        "family temperley-lieb: parameter 'n' given twice",
    ),
    Case(
        "--family parameter twice",
        ("describe", "--family", "linear-a", "n=3", "n=4"),
        "--family: parameter 'n' given twice",
    ),
    # the family is named first; name= must not replace it (specs/FORMAT.md, families)
    Case(
        "--family name=",
        ("describe", "--family", "linear-a", "n=3", "name=temperley-lieb"),
        "--family: unknown parameter 'name'",
    ),
    Case(
        "family family=",
        ("family", "linear-a", "n=3", "family=x"),
        "unknown parameter 'family'",
    ),
    Case(
        "family max_dim= as a parameter",
        ("family", "linear-a", "n=3", "max_dim=1"),
        "unknown parameter 'max_dim'",
    ),
    Case("family seed not an integer", ("family", "linear-a", "n=3", "seed=x"), "seed = 'x'"),
    Case(
        "family seed twice",
        ("family", "linear-a", "n=3", "seed=1", "--seed", "2"),
        "seed given twice",
    ),
    Case(
        "family over GF(10)", ("family", "schur", "r=2", "field=GF(10)"), "10 is not a prime power"
    ),
    Case("Temperley-Lieb n = 100000", ("family", "temperley-lieb", "n=100000"), "max_dim"),
    Case("symmetric group n = 40", ("family", "symmetric-group", "n=40"), "max_dim"),
    Case("symmetric group n = 8", ("family", "symmetric-group", "n=8"), "max_products"),
    Case("zigzag with 10^6 vertices", ("family", "zigzag-a", "n=1000000"), "max_vertices"),
    Case(
        "quantum group q of the wrong order",
        ("family", "small-quantum-sl2", "ell=4"),
        "root of unity of order exactly 4",
    ),
    # -- output ------------------------------------------------------------------------------
    Case(
        "write into a directory",
        ("presentation", "{spec}", "-o", "{dir}"),
        "cannot write",
        QUIVER_A2,
    ),
]


def _argv(case: Case, tmp_path: Path) -> list[str]:
    path = tmp_path / "spec.toml"
    if case.text is not None:
        if isinstance(case.text, bytes):
            path.write_bytes(case.text)
        else:
            path.write_text(case.text, encoding="utf-8")
    return [a.replace("{spec}", str(path)).replace("{dir}", str(tmp_path)) for a in case.argv]


def test_the_table_is_large_enough() -> None:
    assert len(CASES) >= 40
    assert len({c.label for c in CASES}) == len(CASES)


@pytest.mark.parametrize("case", CASES, ids=[c.label for c in CASES])
def test_hostile_input(case: Case, tmp_path: Path, capsys) -> None:
    rc = main(_argv(case, tmp_path))
    out, err = capsys.readouterr()
    assert rc == 2, (rc, err)
    assert out == ""
    lines = err.strip().splitlines()
    assert len(lines) == 1, err
    assert "Traceback" not in err
    assert case.fragment in lines[0], lines[0]


SUBPROCESS = [
    "binary, not UTF-8",
    "two loops, one quadratic relation over QQ",
    "--limit -1",
    "Temperley-Lieb n = 100000",
]


@pytest.mark.parametrize("label", SUBPROCESS)
def test_hostile_input_in_a_fresh_interpreter(label: str, tmp_path: Path) -> None:
    case = next(c for c in CASES if c.label == label)
    proc = subprocess.run(
        [sys.executable, "-m", "hwcat", *_argv(case, tmp_path)],
        capture_output=True,
        text=True,
        cwd=REPO,
        timeout=120,
    )
    assert proc.returncode == 2, proc.stderr
    assert proc.stdout == ""
    assert len(proc.stderr.strip().splitlines()) == 1, proc.stderr
    assert case.fragment in proc.stderr


def test_counts_in_messages_agree_in_number(tmp_path: Path, capsys) -> None:
    # "1 simple module", "1 block": the singular for one (common practice of English)
    path = tmp_path / "k.toml"
    path.write_text('field = "QQ"\n[quiver]\nvertices = ["1"]\n', encoding="utf-8")
    assert main(["describe", str(path)]) == 0
    out = capsys.readouterr().out
    assert "1 simple module;" in out and "1 block" in out and "block(s)" not in out
    assert main(["check", str(path)]) == 0
    out = capsys.readouterr().out
    assert "1 quasi-hereditary total order in 1 structure;" in out, out


def test_family_option_errors_name_the_family_once(capsys) -> None:
    # `--family NAME ...` is its own source: the line names it once, then the parameter
    rc = main(["describe", "--family", "temperley-lieb", "n=3", "delta=x"])
    err = capsys.readouterr().err.strip()
    assert rc == 2
    assert err.count("temperley-lieb") == 1, err
    assert "delta = 'x'" in err
