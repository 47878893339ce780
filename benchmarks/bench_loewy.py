"""Benchmark: Loewy diagrams of all projectives and injectives, against the layers alone.

For Auslander algebras of k[x]/(x^n) and linear A_n with rad^3 = 0, prints the
time and peak memory of the radical and socle layers of every P(i) and I(i)
(what ``describe`` computed before it drew diagrams: the baseline) and of their
Loewy diagrams (radical series included), with the ratio, and the time of the
diagrams drawn as SVG.

    python benchmarks/bench_loewy.py [--quick]
"""

from __future__ import annotations

import argparse
import sys
import time
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))
sys.path.insert(0, str(Path(__file__).resolve().parent))

from _common import measure, table

from hwcat.algebras.families.quivers import auslander_truncated_polynomial, linear_A, spec_to_toml
from hwcat.io.spec import build_algebra, read_spec_text
from hwcat.io.svg import loewy_svg, svg_text
from hwcat.modules import injective, projective
from hwcat.modules.loewy import loewy_diagram


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--quick", action="store_true")
    args = ap.parse_args()
    cases = [(f"Auslander k[x]/x^{n}", auslander_truncated_polynomial(n)) for n in (4, 8, 12)]
    cases += [(f"linear A_{n}, rad^3=0", linear_A(n, vanish_from_length=3)) for n in (10, 40)]
    if args.quick:
        cases = cases[:1] + cases[3:4]
    rows = []
    for label, spec in cases:
        text = spec_to_toml(spec)

        def timed(work):
            """Build the algebra and its P(i), I(i) untimed, then time ``work`` on them."""

            def run():
                A = build_algebra(read_spec_text(text))
                Ms = [projective(A, s) for s in range(A.n)] + [injective(A, s) for s in range(A.n)]
                t0 = time.perf_counter()
                out = work(Ms)
                return out, time.perf_counter() - t0, A.dim

            (out, dt, dim), _, peak = measure(run)
            return out, dt, dim, peak

        n_layers, tl, dim, ml = timed(
            lambda Ms: sum(len(M.radical_layers()) + len(M.socle_layers()) for M in Ms)
        )
        edges, td, _, md = timed(lambda Ms: sum(len(loewy_diagram(M).edges) for M in Ms))
        size, ts, _, ms = timed(
            lambda Ms: sum(len(svg_text(loewy_svg(loewy_diagram(M), M.name))) for M in Ms)
        )
        rows.append(
            [
                label,
                dim,
                f"{tl:.3f}",
                f"{td:.3f}",
                f"{td / tl:.2f}",
                edges,
                f"{ts:.3f}",
                size,
                f"{max(ml, md, ms):.0f}",
            ]
        )
    print(
        table(
            rows,
            [
                "algebra",
                "dim",
                "layers s (baseline)",
                "diagrams s",
                "ratio",
                "edges",
                "diagrams + svg s",
                "svg bytes",
                "peak MiB",
            ],
        )
    )
    print("times exclude building the algebra and its P(i), I(i); each column in a fresh process")


if __name__ == "__main__":
    main()
