"""The curated public API (style guide: a short, explicit __all__)."""

import hwcat


def test_all_is_curated_and_importable():
    assert len(hwcat.__all__) == len(set(hwcat.__all__)) <= 60
    for name in hwcat.__all__:
        assert hasattr(hwcat, name), name


def test_import_does_not_pull_test_dependencies():
    import subprocess
    import sys

    code = "import sys, hwcat; print('hypothesis' in sys.modules, 'sympy' in sys.modules)"
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.strip() == "False False"


def test_the_readme_uses_only_the_curated_api():
    # every hwcat.<name> in the README's Python example is exported (issue: one coherent API)
    import re
    from pathlib import Path

    readme = (Path(__file__).resolve().parents[1] / "README.md").read_text(encoding="utf-8")
    blocks = re.findall(r"```python\n(.*?)```", readme, re.S)
    assert blocks
    used = {m for b in blocks for m in re.findall(r"\bhwcat\.([A-Za-z_]\w*)", b)}
    assert used and used <= set(hwcat.__all__) | {"strategies", "testing"}, used - set(
        hwcat.__all__
    )


def _keys(obj, out):
    if isinstance(obj, dict):
        for k, v in obj.items():
            out.add(k)
            _keys(v, out)
    elif isinstance(obj, list):
        for v in obj:
            _keys(v, out)
    return out


def test_every_json_key_is_documented():
    # every key of every --json output on the demo specs appears in specs/FORMAT.md
    import contextlib
    import io
    import json
    from pathlib import Path

    from hwcat.cli import main

    root = Path(__file__).resolve().parents[1]
    doc = (root / "specs" / "FORMAT.md").read_text(encoding="utf-8")
    runs = [
        [cmd, str(spec), "--json"]
        for spec in sorted((root / "specs" / "examples").glob("*.toml"))
        for cmd in ("describe", "check", "orders")
    ]
    runs.append(["family", "temperley-lieb", "n=4", "delta=0", "field=GF(3)", "--json"])
    runs.append(["check", "--family", "schur", "r=3", "field=GF(2)", "--json"])
    plaquette = str(root / "specs" / "examples" / "plaquette.toml")
    runs.append(["module", plaquette, "--element", "X+Y", "--json"])
    runs.append(
        [
            "module",
            "--family",
            "cyclic-group",
            "m=4",
            "field=GF(5)",
            "--module",
            "regular",
            "--tensor",
            "P(chi1)",
            "--element",
            "g",
            "--json",
        ]
    )
    runs.append(
        [
            "module",
            "--family",
            "temperley-lieb",
            "n=10",
            "delta=0",
            "field=GF(5)",
            "--element",
            "e1",
            "--json",
        ]
    )
    keys: set[str] = set()
    for argv in runs:
        buf = io.StringIO()
        with contextlib.redirect_stdout(buf):
            main(argv)
        data = json.loads(buf.getvalue())
        # dictionaries keyed by vertex names (dimension vectors per simple) are data, not keys
        keys |= _keys(data, set()) - set(data.get("simples") or []) - {"X+Y", "g", "e1"}
    missing = sorted(k for k in keys if f"`{k}`" not in doc)
    assert not missing, f"JSON keys not documented in specs/FORMAT.md: {missing}"


def test_docs_name_the_commands_that_take_json():
    # README and specs/FORMAT.md list the commands with --json and those with a schema;
    # the lists must be the parser's and hwcat.schemas' own
    import argparse
    import re
    from pathlib import Path

    from hwcat.cli import build_parser
    from hwcat.schemas import SCHEMAS

    sub = next(a for a in build_parser()._actions if isinstance(a, argparse._SubParsersAction))
    with_json = {
        name
        for name, p in sub.choices.items()
        if any("--json" in a.option_strings for a in p._actions)
    }
    root = Path(__file__).resolve().parents[1]
    for doc in ("README.md", "specs/FORMAT.md"):
        text = " ".join((root / doc).read_text(encoding="utf-8").split())
        m = re.search(r"((?:`[a-z-]+`[, and]*)+)take `--json`", text)
        assert m, doc
        assert set(re.findall(r"`([a-z-]+)`", m.group(1))) == with_json, doc
    text = " ".join((root / "specs/FORMAT.md").read_text(encoding="utf-8").split())
    m = re.search(r"The `--json` outputs of ((?:`[a-z-]+`[, and]*)+)and certificates", text)
    assert m and set(re.findall(r"`([a-z-]+)`", m.group(1))) == set(SCHEMAS) - {"certificate"}


def test_command_line_imports_lazily():
    # the parser needs neither the graph library nor the exact arithmetic backend
    import subprocess
    import sys

    code = (
        "import sys, hwcat.cli; hwcat.cli.build_parser(); "
        "print('networkx' in sys.modules, 'flint' in sys.modules)"
    )
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.strip() == "False False"
