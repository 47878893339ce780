"""What a small command loads: the graph and array libraries only when the work needs them.

Start-up time itself is measured in ``benchmarks/`` (never in timed tests); here the
test is which modules a fresh interpreter has loaded after the command.  The
quivers' strongly connected components (used on every build) are checked against
networkx, the reference graph library.
"""

from __future__ import annotations

import subprocess
import sys

import networkx as nx
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from hwcat.algebras.hub.quiver import Arrow, Quiver

ACYCLIC = 'field = "QQ"\n[quiver]\nvertices = ["1", "2", "3"]\narrows = ["a: 1 -> 2", "b: 2 -> 3"]\nrelations = ["a*b"]\n'


# paths of length 2 survive the relation, so the build looks for a cycle of surviving
# paths; the quiver has none, which is seen without a graph library
LONGER = (
    'field = "QQ"\n[quiver]\nvertices = ["1", "2", "3", "4"]\n'
    'arrows = ["a: 1 -> 2", "b: 2 -> 3", "c: 3 -> 4"]\nrelations = ["a*b"]\n'
)


# random quivers with up to 9 vertices and 20 arrows (loops and parallel arrows included)
QUIVERS = st.integers(1, 9).flatmap(
    lambda n: st.tuples(
        st.just(n),
        st.lists(st.tuples(st.integers(0, n - 1), st.integers(0, n - 1)), max_size=20),
    )
)


def _quiver(n: int, edges) -> Quiver:
    return Quiver(
        tuple(str(v) for v in range(n)),
        tuple(Arrow(f"a{i}", s, t) for i, (s, t) in enumerate(edges)),
    )


def _loaded_after(argv: list[str], tmp_path, text: str = ACYCLIC) -> set[str]:
    spec = tmp_path / "a3.toml"
    spec.write_text(text)
    code = (
        "import sys, io, contextlib\n"
        "from hwcat.cli import main\n"
        "with contextlib.redirect_stdout(io.StringIO()):\n"
        f"    main({[a.replace('SPEC', str(spec)) for a in argv]!r})\n"
        "print(' '.join(sorted(m.split('.')[0] for m in sys.modules)))\n"
    )
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    return set(out.stdout.split())


@pytest.mark.parametrize("text", [ACYCLIC, LONGER], ids=["A3", "A4"])
def test_describe_and_check_of_a_small_quiver_load_neither_networkx_nor_numpy(tmp_path, text):
    for argv in (["describe", "SPEC"], ["check", "SPEC"], ["orders", "SPEC"]):
        loaded = _loaded_after(argv, tmp_path, text)
        assert "networkx" not in loaded, argv
        assert "numpy" not in loaded, argv


@settings(max_examples=60, deadline=None)
@given(QUIVERS)
def test_cycles_of_quivers_agree_with_networkx(case):
    # reference: networkx.strongly_connected_components and is_directed_acyclic_graph
    # (common practice; a loop is a cycle)
    n, edges = case
    Q = _quiver(n, edges)
    G = nx.MultiDiGraph()
    G.add_nodes_from(range(n))
    G.add_edges_from(edges)
    assert sorted(map(sorted, Q.strongly_connected_components())) == sorted(
        map(sorted, nx.strongly_connected_components(G))
    )
    assert Q.is_acyclic() == nx.is_directed_acyclic_graph(G)
