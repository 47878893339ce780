"""Benchmark: ``hwcat check`` with the full homological section at scale.

For Auslander algebras of k[x]/(x^n) and linear A_n with rad^3 = 0 (both
quasi-hereditary), times the whole ``hwcat check`` command (search for an
order, axioms, Ext conditions, global dimension, tilting modules, Ringel
dual) in a forked child, then prints the growth exponent between consecutive
sizes (log time ratio / log size ratio).

Baseline in the same run: the Ringel dual's endomorphism algebra (the former
hot spot) built by the reference path ``method="pairs"`` (every composite of
radical maps flattened at every vertex) beside the default generator path,
on the same tilting modules; the ratio is printed.

    python benchmarks/bench_check_scale.py            # up to x^16 and A_100
    python benchmarks/bench_check_scale.py --quick
"""

from __future__ import annotations

import argparse
import contextlib
import io
import math
import sys
import tempfile
import time
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))
sys.path.insert(0, str(Path(__file__).resolve().parent))

from _common import measure, table

from hwcat.algebras.families.quivers import auslander_truncated_polynomial, linear_A, spec_to_toml
from hwcat.cli import main as cli_main
from hwcat.io.spec import load_spec_text
from hwcat.theory.search import quasi_hereditary_orders
from hwcat.theory.tilting import endomorphism_algebra, tilting_modules


def check_command(text: str) -> int:
    with tempfile.NamedTemporaryFile("w", suffix=".toml", delete=False) as f:
        f.write(text)
    with contextlib.redirect_stdout(io.StringIO()):
        return cli_main(["check", f.name])


def endo(text: str, method: str) -> tuple[float, int]:
    A = load_spec_text(text)
    P = quasi_hereditary_orders(A, list_limit=1).structure_list[0].essential_order
    Ts = [T.module for T in tilting_modules(A, P)]
    t0 = time.perf_counter()
    R = endomorphism_algebra(Ts, A.vertices, list(range(A.n)), method=method)
    return time.perf_counter() - t0, R.dim


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--quick", action="store_true")
    ap.add_argument("--no-baseline", action="store_true")
    args = ap.parse_args()
    aus = (4, 8, 12) if args.quick else (4, 8, 12, 16)
    lin = (25, 50) if args.quick else (25, 50, 100)
    families = [
        ("Auslander k[x]/x^{}", [(n, spec_to_toml(auslander_truncated_polynomial(n))) for n in aus]),
        ("linear A_{}, rad^3=0", [(n, spec_to_toml(linear_A(n, vanish_from_length=3))) for n in lin]),
    ]
    rows = []
    for label, cases in families:
        prev = None
        for n, text in cases:
            code, t, mem = measure(lambda text=text: check_command(text))
            dim = load_spec_text(text).dim
            growth = "-" if prev is None else f"{math.log(t / prev[1]) / math.log(n / prev[0]):.1f}"
            prev = (n, t)
            row = [label.format(n), dim, code, f"{t:.2f}", f"{mem:.0f}", growth]
            if args.no_baseline or n > (12 if "Auslander" in label else 50):
                row += ["-", "-", "-"]
            else:
                (tg, _), _, _ = measure(lambda text=text: endo(text, "generators"))
                (tp, _), _, _ = measure(lambda text=text: endo(text, "pairs"))
                row += [f"{tg:.2f}", f"{tp:.2f}", f"{tp / tg:.1f}x"]
            rows.append(row)
    print(
        table(
            rows,
            ["algebra", "dim A", "exit", "check s", "RSS MiB", "growth exp.", "End gen s", "End pairs s", "ratio"],
        )
    )


if __name__ == "__main__":
    main()
