"""Benchmark: labelling the simples of the group-algebra families.

For each case prints the time of the reduction to the basic algebra alone (the
baseline) and of the labelling on top of it (Specht modules and their heads,
the ranks of a few class sums on the simples), the ratio labelling / reduction,
and the peak resident memory of the whole case (forked child, interpreter
included).  Both are measured in the same process, one after the other.

Usage::

    .venv/bin/python benchmarks/bench_labels.py            # S_4..S_6, C_m
    .venv/bin/python benchmarks/bench_labels.py --large    # also S_6 over QQ, S_7 over GF(2) (minutes, GBs)
"""

from __future__ import annotations

import argparse
import sys
import time
from pathlib import Path

sys.path.insert(0, str(Path(__file__).parent))

from _common import measure, table  # noqa: E402

CASES = [
    ("symmetric-group", {"n": 4, "field": "GF(2)"}),
    ("symmetric-group", {"n": 5, "field": "GF(2)"}),
    ("symmetric-group", {"n": 5, "field": "GF(5)"}),
    ("symmetric-group", {"n": 6, "field": "GF(2)"}),
    ("symmetric-group", {"n": 6, "field": "GF(3)"}),
    ("symmetric-group", {"n": 5, "field": "QQ"}),
    ("cyclic-group", {"m": 60, "field": "GF(61)"}),
]
LARGE = [  # minutes each, the reduction dominating
    ("symmetric-group", {"n": 6, "field": "QQ"}),
    ("symmetric-group", {"n": 7, "field": "GF(2)"}),
]


def _case(family: str, params: dict) -> tuple[float, float, int]:
    from hwcat.algebras.families.labels import label_simples
    from hwcat.algebras.families.registry import family_structure, parse_parameters
    from hwcat.algebras.reduction.reduction import reduce_algebra

    A = family_structure(family, **params)
    t0 = time.perf_counter()
    red = reduce_algebra(A, seed=0)
    t1 = time.perf_counter()
    label_simples(family, red, parse_parameters(family, params))
    t2 = time.perf_counter()
    return t1 - t0, t2 - t1, red.basic.n


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--large", action="store_true", help="also S_6 over QQ and S_7 over GF(2)")
    args = ap.parse_args()
    rows = []
    for family, params in CASES + (LARGE if args.large else []):
        (reduce_s, label_s, simples), _, peak = measure(lambda f=family, p=params: _case(f, p))
        name = family + " " + " ".join(f"{k}={v}" for k, v in params.items())
        rows.append(
            [
                name,
                simples,
                f"{reduce_s:.2f}",
                f"{label_s:.3f}",
                f"{label_s / reduce_s:.3f}",
                f"{peak:.0f}",
            ]
        )
    print(table(rows, ["case", "simples", "reduce s", "label s", "label/reduce", "peak MiB"]))


if __name__ == "__main__":
    main()
