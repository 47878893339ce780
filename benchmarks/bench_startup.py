"""Start-up of the command line: whole commands on small inputs beside a bare interpreter.

Each command runs as a fresh process (``python -m hwcat ...``), best of ``--repeat``
runs, with bytecode caching on (an environment that forbids writing ``.pyc`` files
pays the compilation on every run).  The baseline in the same run is a bare
``python -c pass`` and ``python -c "import flint"`` (the arithmetic every command
needs).  Target (issue on performance): the command line's own start-up under
0.15 s; ``hwcat --help`` measures it, the small ``describe``/``check``/``orders``
show what a command on a three-vertex quiver adds.

    python benchmarks/bench_startup.py [--repeat 5]
"""

from __future__ import annotations

import argparse
import os
import subprocess
import sys
import tempfile
import time
from pathlib import Path

from _common import table

SPEC = (
    'field = "QQ"\n[quiver]\nvertices = ["1", "2", "3"]\n'
    'arrows = ["a: 1 -> 2", "b: 2 -> 3"]\nrelations = ["a*b"]\n'
)


def best(argv: list[str], repeat: int) -> float:
    env = dict(os.environ)
    env.pop("PYTHONDONTWRITEBYTECODE", None)
    subprocess.run(argv, capture_output=True, env=env, check=True)  # warm the caches
    times = []
    for _ in range(repeat):
        t0 = time.perf_counter()
        subprocess.run(argv, capture_output=True, env=env, check=True)
        times.append(time.perf_counter() - t0)
    return min(times)


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--repeat", type=int, default=5)
    args = ap.parse_args()
    with tempfile.TemporaryDirectory() as d:
        spec = str(Path(d) / "a3.toml")
        Path(spec).write_text(SPEC)
        py = sys.executable
        bare = best([py, "-c", "pass"], args.repeat)
        cases = [
            ("python -c pass (baseline)", [py, "-c", "pass"]),
            ("python -c 'import flint' (baseline)", [py, "-c", "import flint"]),
            ("hwcat --help", [py, "-m", "hwcat", "--help"]),
            ("hwcat describe (3 vertices)", [py, "-m", "hwcat", "describe", spec]),
            ("hwcat check (3 vertices)", [py, "-m", "hwcat", "check", spec]),
            ("hwcat orders (3 vertices)", [py, "-m", "hwcat", "orders", spec]),
        ]
        rows = []
        for label, argv in cases:
            t = bare if argv == [py, "-c", "pass"] else best(argv, args.repeat)
            rows.append([label, f"{t:.3f}", f"{t - bare:.3f}"])
    print(table(rows, ["command", "best s", "above bare python s"]))


if __name__ == "__main__":
    main()
