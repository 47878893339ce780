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
