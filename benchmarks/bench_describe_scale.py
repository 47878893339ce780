"""Benchmark: ``describe`` at scale, with the build of the algebra as the baseline.

For each case one forked process builds the algebra from its spec text (the
baseline), then runs what ``hwcat describe`` runs: the structure report
(projectives and injectives with radical and socle layers and Loewy diagrams,
the opposite algebra, the centre) and its text rendering.  Printed side by side:
the build time, the opposite algebra's time, the time of the layers of every
``P(i)`` and ``I(i)`` (radical and socle layers, Loewy length, Loewy diagrams),
the whole ``describe`` with rendering, the ratio of ``describe`` to the build,
and the peak resident memory of the process (interpreter and libraries
included).

Cases (issue targets in brackets):

- linear A_1000 with vanish_from_length 4, dimension 3,994 [describe < 5 s, < 300 MiB];
- the Auslander algebra of k[x]/(x^30), dimension 9,455 [describe < 5 s];
- k[x]/(x^N), one vertex and one loop, N = 100 and 300 [well under a second at N = 300];
- three loops at one vertex, every path of length 7 zero, dimension 1,093 [opposite and
  layers no slower than the build].

    python benchmarks/bench_describe_scale.py            # all cases
    python benchmarks/bench_describe_scale.py --quick    # smaller sizes
"""

from __future__ import annotations

import argparse
import sys
import time
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))
sys.path.insert(0, str(Path(__file__).resolve().parent))

from _common import measure, table  # noqa: E402
from bench_build import _spec as spec_text  # noqa: E402
from bench_build import auslander, linear  # noqa: E402

from hwcat.io.render import render_structure  # noqa: E402
from hwcat.io.spec import load_spec_text  # noqa: E402
from hwcat.modules import injective, projective  # noqa: E402
from hwcat.theory.structure import describe, summarise_module  # noqa: E402


def truncated_polynomial(N: int) -> str:
    return spec_text(["1"], ["x: 1 -> 1"], vanish=N)


def loops(k: int, L: int) -> str:
    names = "xyzuvw"[:k]
    return spec_text(["1"], [f"{c}: 1 -> 1" for c in names], vanish=L)


def run_case(text: str) -> tuple[int, float, float, float, float]:
    """(dimension, build, opposite, layers of all P and I, describe with rendering) seconds."""
    t0 = time.perf_counter()
    A = load_spec_text(text)
    build = time.perf_counter() - t0
    t0 = time.perf_counter()
    A.opposite()
    opp = time.perf_counter() - t0
    t0 = time.perf_counter()
    for s in range(A.n):
        for M in (projective(A, s), injective(A, s)):
            summarise_module(M)
    layers = time.perf_counter() - t0
    # describe on a fresh copy of the algebra (nothing cached), then the text
    B = load_spec_text(text)
    t0 = time.perf_counter()
    render_structure(describe(B))
    whole = time.perf_counter() - t0
    return A.dim, build, opp, layers, whole


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--quick", action="store_true")
    args = ap.parse_args()
    if args.quick:
        cases = [
            ("linear A_200, vanish 4", linear(200, 4)[0]),
            ("Auslander k[x]/x^12", auslander(12)[0]),
            ("k[x]/(x^100)", truncated_polynomial(100)),
            ("3 loops, vanish 5", loops(3, 5)),
        ]
    else:
        cases = [
            ("linear A_1000, vanish 4", linear(1000, 4)[0]),
            ("Auslander k[x]/x^30", auslander(30)[0]),
            ("k[x]/(x^100)", truncated_polynomial(100)),
            ("k[x]/(x^300)", truncated_polynomial(300)),
            ("3 loops, vanish 7", loops(3, 7)),
        ]
    rows = []
    for label, text in cases:
        (dim, build, opp, layers, whole), _, peak = measure(lambda text=text: run_case(text))
        rows.append(
            [
                label,
                dim,
                f"{build:.2f}",
                f"{opp:.2f}",
                f"{layers:.2f}",
                f"{whole:.2f}",
                f"{whole / build:.1f}",
                f"{opp / build:.2f}",
                f"{peak:.0f}",
            ]
        )
        print(rows[-1], flush=True)
    print(
        table(
            rows,
            [
                "algebra",
                "dim",
                "build s",
                "opposite s",
                "P,I layers s",
                "describe s",
                "describe/build",
                "opposite/build",
                "peak MiB",
            ],
        )
    )


if __name__ == "__main__":
    main()
