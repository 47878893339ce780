"""Malformed spec files: one line on standard error naming the file, the key and the text.

Every case runs through the command line (``hwcat describe FILE``): exit code 2,
nothing on standard output, exactly one line on standard error that names the
file, the key and the offending text, and no traceback.  The same file read
through the Python API raises the named subclass of
:class:`~hwcat.errors.HwcatError` (which is also a :class:`ValueError`).  A
few cases also run in a fresh interpreter, to see the real entry point.  The
expectations are the spec format's own rules (``specs/FORMAT.md``; the
arithmetic facts, e.g. that 12 is not a prime and 1/7 is not in GF(7), are
common practice).
"""

from __future__ import annotations

import os
import subprocess
import sys
from dataclasses import dataclass
from pathlib import Path

import pytest

from hwcat.cli import main
from hwcat.errors import (
    CoefficientError,
    FieldError,
    HwcatError,
    NotFiniteDimensional,
    QuiverError,
    RelationError,
    SpecError,
    SpecSyntaxError,
)
from hwcat.io.spec import load_spec

REPO = Path(__file__).resolve().parents[1]


@dataclass(frozen=True)
class Case:
    id: str
    text: str
    key: str  # the key the message must name ("" when there is none, e.g. a syntax error)
    snippets: tuple[str, ...]  # offending text and explanation the message must contain
    error: type[HwcatError]


def quiver(body: str, field: str = "QQ") -> str:
    return f'field = "{field}"\n[quiver]\n{body}\n'


SQUARE = (
    'vertices = ["1", "2", "3", "4"]\narrows = ["a: 1 -> 2", "b: 2 -> 4", "c: 1 -> 3", "d: 3 -> 4"]'
)

CASES = [
    Case(
        "toml-syntax",
        'field = "QQ"\n[quiver\nvertices = ["1"]\n',
        "",
        ("not valid TOML", "line 2"),
        SpecSyntaxError,
    ),
    Case("missing-field", '[quiver]\nvertices = ["1"]\n', "field", ("missing",), SpecError),
    Case("missing-quiver", 'field = "QQ"\n', "quiver", ("missing",), SpecError),
    Case(
        "missing-vertices",
        'field = "QQ"\n[quiver]\narrows = []\n',
        "quiver.vertices",
        ("missing",),
        SpecError,
    ),
    Case(
        "unknown-field",
        quiver('vertices = ["1"]', "RR"),
        "field",
        ("'RR'", "unknown field"),
        FieldError,
    ),
    Case(
        "field-not-a-string",
        'field = 7\n[quiver]\nvertices = ["1"]\n',
        "field",
        ("7",),
        FieldError,
    ),
    Case(
        "non-prime",
        quiver('vertices = ["1"]', "GF(12)"),
        "field",
        ("GF(12)", "not a prime"),
        FieldError,
    ),
    Case(
        "prime-too-large",
        quiver('vertices = ["1"]', "GF(9223372036854775837)"),  # 2^63 + 29, a prime
        "field",
        ("9223372036854775837", "2^63"),
        FieldError,
    ),
    Case(
        "duplicate-vertex",
        quiver('vertices = ["1", "2", "1"]'),
        "quiver.vertices",
        ("'1'", "twice"),
        QuiverError,
    ),
    Case(
        "duplicate-vertex-named-arrow",  # the key must not be guessed from the wording
        quiver('vertices = ["arrow", "arrow"]'),
        "quiver.vertices",
        ("'arrow'", "twice"),
        QuiverError,
    ),
    Case(
        "bad-vertex-name",
        quiver('vertices = ["a b"]'),
        "quiver.vertices",
        ("'a b'",),
        QuiverError,
    ),
    Case(
        "duplicate-arrow",
        quiver('vertices = ["1", "2"]\narrows = ["a: 1 -> 2", "a: 2 -> 1"]'),
        "quiver.arrows[1]",
        ("'a'", "twice"),
        QuiverError,
    ),
    Case(
        "unknown-endpoint",
        quiver('vertices = ["1", "2"]\narrows = ["a: 1 -> 2", "c: 1 -> 5"]'),
        "quiver.arrows[1]",
        ("c: 1 -> 5", "'5' is not a vertex"),
        QuiverError,
    ),
    Case(
        "malformed-arrow",
        quiver('vertices = ["1", "2"]\narrows = ["a 1 -> 2"]'),
        "quiver.arrows[0]",
        ("a 1 -> 2",),
        QuiverError,
    ),
    Case(
        "relation-unknown-arrow",
        quiver(
            'vertices = ["1", "2", "3"]\narrows = ["a: 1 -> 2", "b: 2 -> 3"]\nrelations = ["a*q"]'
        ),
        "quiver.relations[0]",
        ("a*q", "'q' is not an arrow"),
        RelationError,
    ),
    Case(
        "relation-does-not-compose",
        quiver(
            'vertices = ["1", "2", "3"]\narrows = ["a: 1 -> 2", "b: 2 -> 3"]\nrelations = ["b*a"]'
        ),
        "quiver.relations[0]",
        ("b*a", "does not compose"),
        RelationError,
    ),
    Case(
        "relation-mismatched-ends",
        quiver(
            'vertices = ["1", "2", "3", "4"]\n'
            'arrows = ["a: 1 -> 2", "b: 2 -> 3", "c: 1 -> 4", "d: 4 -> 4"]\n'
            'relations = ["a*b - c*d"]'
        ),
        "quiver.relations[0]",
        ("a*b - c*d", "do not share start and end"),
        RelationError,
    ),
    Case(
        "relation-single-arrow",
        quiver(
            'vertices = ["1", "2", "3"]\narrows = ["a: 1 -> 2", "b: 2 -> 3", "c: 1 -> 3"]\n'
            'relations = ["a*b - c"]'
        ),
        "quiver.relations[0]",
        ("a*b - c", "'c'", "single arrow", "square of the arrow ideal"),
        RelationError,
    ),
    Case(
        "relation-vertex-term",
        quiver(
            'vertices = ["v"]\narrows = ["x: v -> v"]\nrelations = ["x*x - v"]\nvanish_from_length = 4'
        ),
        "quiver.relations[0]",
        ("x*x - v", "'v'", "trivial path", "square of the arrow ideal"),
        RelationError,
    ),
    Case(
        "relation-idempotent-term",
        quiver(
            'vertices = ["1"]\narrows = ["x: 1 -> 1"]\nrelations = ["x*x - e_1"]\nvanish_from_length = 4'
        ),
        "quiver.relations[0]",
        ("x*x - e_1", "'e_1'", "trivial path"),
        RelationError,
    ),
    Case(
        "relation-scalar-term",
        quiver(
            'vertices = ["1"]\narrows = ["x: 1 -> 1"]\nrelations = ["x*x - 2"]\nvanish_from_length = 4'
        ),
        "quiver.relations[0]",
        ("x*x - 2", "'2'", "scalar"),
        RelationError,
    ),
    Case(
        "coefficient-not-in-field",
        quiver(SQUARE + '\nrelations = ["a*b - c*d", "a*b - 1/7*c*d"]', "GF(7)"),
        "quiver.relations[1]",
        ("a*b - 1/7*c*d", "'1/7'", "GF(7)"),
        CoefficientError,
    ),
    Case(
        "coefficient-denominator-zero",
        quiver(SQUARE + '\nrelations = ["1/0*a*b - c*d"]'),
        "quiver.relations[0]",
        ("'1/0'", "denominator 0"),
        CoefficientError,
    ),
    Case(
        "relation-is-zero",
        quiver(SQUARE + '\nrelations = ["a*b + a*b"]', "GF(2)"),
        "quiver.relations[0]",
        ("a*b + a*b", "is zero"),
        RelationError,
    ),
    Case(
        "relation-not-a-string",
        quiver(SQUARE + "\nrelations = [3]"),
        "quiver.relations[0]",
        ("3", "not a string"),
        RelationError,
    ),
    Case(
        "relation-trailing-sign",
        quiver(SQUARE + '\nrelations = ["a*b -"]'),
        "quiver.relations[0]",
        ("a*b -", "ends with a sign"),
        RelationError,
    ),
    Case(
        "mixed-lengths-without-bound",
        quiver('vertices = ["1"]\narrows = ["x: 1 -> 1"]\nrelations = ["x*x - x*x*x"]'),
        "quiver.relations",
        ("x*x - x*x*x", "vanish_from_length"),
        RelationError,
    ),
    Case(
        "empty-quiver",
        quiver("vertices = []"),
        "quiver.vertices",
        ("no vertices",),
        SpecError,
    ),
    Case(
        "infinite-dimension",
        quiver('vertices = ["1", "2"]\narrows = ["a: 1 -> 2", "b: 2 -> 1"]'),
        "quiver.relations",
        ("infinite dimensional", "cycle '", "vanish_from_length"),
        NotFiniteDimensional,
    ),
    Case(
        "infinite-dimension-loop",
        quiver('vertices = ["1"]\narrows = ["x: 1 -> 1", "y: 1 -> 1"]\nrelations = ["x*x", "y*x"]'),
        "quiver.relations",
        ("cycle 'y'", "vanish_from_length"),
        NotFiniteDimensional,
    ),
    Case(
        "unknown-top-level-key",
        'field = "QQ"\ncolour = "red"\n[quiver]\nvertices = ["1"]\n',
        "colour",
        ("unknown key",),
        SpecError,
    ),
    Case(  # FORMAT.md: the format version is the integer 1; a TOML boolean is not
        "format-true",
        'field = "QQ"\nformat = true\n[quiver]\nvertices = ["1"]\n',
        "format",
        ("True", "only format 1"),
        SpecError,
    ),
    Case(
        "format-float",
        'field = "QQ"\nformat = 1.0\n[quiver]\nvertices = ["1"]\n',
        "format",
        ("1.0", "only format 1"),
        SpecError,
    ),
    Case(  # a [family] table holds the family's parameters and seed, nothing else
        "family-resource-limit-key",
        'field = "QQ"\n[family]\nname = "linear-a"\nn = 3\nmax_dim = 1\n',
        "family.max_dim",
        ("unknown parameter", "allowed: name, seed, n"),
        SpecError,
    ),
    Case(
        "family-family-key",
        'field = "QQ"\n[family]\nname = "linear-a"\nn = 3\nfamily = "x"\n',
        "family.family",
        ("unknown parameter",),
        SpecError,
    ),
    Case(
        "unknown-quiver-key",
        quiver('vertices = ["1"]\nedges = []'),
        "quiver.edges",
        ("unknown key",),
        SpecError,
    ),
    Case(
        "vertices-not-a-list",
        quiver('vertices = "1 2"'),
        "quiver.vertices",
        ("list",),
        SpecError,
    ),
    Case(
        "vertex-not-a-string",
        quiver("vertices = [1.5]"),
        "quiver.vertices[0]",
        ("1.5",),
        SpecError,
    ),
    Case(
        "bound-too-small",
        quiver('vertices = ["1"]\narrows = ["x: 1 -> 1"]\nvanish_from_length = 1'),
        "quiver.vanish_from_length",
        ("vanish_from_length = 1", "at least 2"),
        RelationError,
    ),
    Case(
        "bound-not-an-integer",
        quiver('vertices = ["1"]\narrows = ["x: 1 -> 1"]\nvanish_from_length = "3"'),
        "quiver.vanish_from_length",
        ("'3'", "not an integer"),
        SpecError,
    ),
    Case(
        "quiver-not-a-table",
        'field = "QQ"\nquiver = 3\n',
        "quiver",
        ("table",),
        SpecError,
    ),
    Case(
        "unknown-format",
        'format = 2\nfield = "QQ"\n[quiver]\nvertices = ["1"]\n',
        "format",
        ("2", "format 1"),
        SpecError,
    ),
]


def write(tmp_path: Path, case: Case) -> Path:
    path = tmp_path / f"{case.id}.toml"
    path.write_text(case.text, encoding="utf-8")
    return path


def check_message(line: str, path: Path, case: Case) -> None:
    assert line.startswith("hwcat: error: ")
    assert str(path) in line
    if case.key:
        assert f": {case.key}: " in line, line
    for snippet in case.snippets:
        assert snippet in line, (snippet, line)


@pytest.mark.parametrize("case", CASES, ids=[c.id for c in CASES])
def test_cli_reports_one_line(case: Case, tmp_path: Path, capsys: pytest.CaptureFixture) -> None:
    path = write(tmp_path, case)
    code = main(["describe", str(path)])
    out, err = capsys.readouterr()
    assert code == 2
    assert out == ""
    lines = err.splitlines()
    assert len(lines) == 1, err
    check_message(lines[0], path, case)
    assert "Traceback" not in err


@pytest.mark.parametrize("case", CASES, ids=[c.id for c in CASES])
def test_python_api_raises_the_named_error(case: Case, tmp_path: Path) -> None:
    path = write(tmp_path, case)
    with pytest.raises(case.error) as info:
        load_spec(path)
    assert isinstance(info.value, HwcatError) and isinstance(info.value, ValueError)
    assert "\n" not in str(info.value)


def run_cli(*args: str) -> subprocess.CompletedProcess:
    env = dict(os.environ)
    env["PYTHONPATH"] = str(REPO) + os.pathsep + env.get("PYTHONPATH", "")
    return subprocess.run(
        [sys.executable, "-m", "hwcat.cli", *args],
        capture_output=True,
        text=True,
        env=env,
        timeout=120,
    )


SUBPROCESS = [
    "toml-syntax",
    "coefficient-not-in-field",
    "infinite-dimension",
    "unknown-top-level-key",
]


@pytest.mark.parametrize("case_id", SUBPROCESS)
def test_real_process_exit_code_and_stderr(case_id: str, tmp_path: Path) -> None:
    case = next(c for c in CASES if c.id == case_id)
    path = write(tmp_path, case)
    proc = run_cli("describe", str(path))
    assert proc.returncode == 2
    assert proc.stdout == ""
    lines = proc.stderr.splitlines()
    assert len(lines) == 1, proc.stderr
    assert "Traceback" not in proc.stderr
    check_message(lines[0], path, case)


def test_unreadable_files(tmp_path: Path, capsys: pytest.CaptureFixture) -> None:
    # a missing file, a directory and a file that is not UTF-8 text: exit 2, one line
    bad = tmp_path / "latin1.toml"
    bad.write_bytes(b'field = "QQ"\nname = "caf\xe9"\n[quiver]\nvertices = ["1"]\n')
    folder = tmp_path / "folder.toml"
    folder.mkdir()
    for path, snippet in (
        (tmp_path / "absent.toml", "cannot read"),
        (folder, "cannot read"),
        (bad, "UTF-8"),
    ):
        code = main(["describe", str(path)])
        out, err = capsys.readouterr()
        assert code == 2 and out == ""
        assert len(err.splitlines()) == 1 and str(path) in err and snippet in err, err
        with pytest.raises(HwcatError):
            load_spec(path)


def test_valid_spec_still_succeeds(tmp_path: Path, capsys: pytest.CaptureFixture) -> None:
    # the control case: the same reader accepts a correct file (common practice)
    path = tmp_path / "square.toml"
    path.write_text(quiver(SQUARE + '\nrelations = ["a*b - c*d"]'), encoding="utf-8")
    assert main(["describe", str(path)]) == 0
    out, err = capsys.readouterr()
    assert err == "" and "dimension 9" in out
