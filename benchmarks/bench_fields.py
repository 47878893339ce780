"""Benchmark: the same computations over a prime field and over an extension.

For each pair (GF(p), GF(p^2)) and (QQ, QQ(zeta8)) the same work runs over both
fields in one run and the slowdown factor (extension time / base time) is
printed beside the degree squared, the target bound:

* ``rref``: reduced echelon form of a random n x n matrix of rank n - 2 with
  entries in the prime field (the base run is flint's own elimination);
* ``quiver``: describe + all quasi-hereditary orders of the Auslander algebra of
  k[x]/(x^n) (a [quiver] spec; only the field name differs);
* ``table``: reduction of the Temperley-Lieb algebra TL_n(1) (a multiplication
  table in the diagram basis; split over every field).

    python benchmarks/bench_fields.py            # full run
    python benchmarks/bench_fields.py --quick    # small sizes only
"""

from __future__ import annotations

import argparse
import random
import sys
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))
sys.path.insert(0, str(Path(__file__).resolve().parent))

from _common import measure, table  # noqa: E402

from hwcat.algebras.families.quivers import auslander_truncated_polynomial, spec_to_toml  # noqa: E402
from hwcat.algebras.families.registry import family_algebra  # noqa: E402
from hwcat.exact import Mat, parse_field  # noqa: E402
from hwcat.io.spec import build_algebra, read_spec_text  # noqa: E402
from hwcat.theory.search import quasi_hereditary_orders  # noqa: E402
from hwcat.theory.structure import describe  # noqa: E402

PAIRS = [("GF(5)", "GF(25)"), ("QQ", "QQ(zeta8)")]


def rref_case(field: str, n: int) -> int:
    F = parse_field(field)
    rng = random.Random(n)
    A = Mat.from_rows(F, [[rng.randint(-3, 3) for _ in range(n - 2)] for _ in range(n)])
    B = Mat.from_rows(F, [[rng.randint(-3, 3) for _ in range(n)] for _ in range(n - 2)])
    M = A @ B
    return M.rref()[0].nrows + M.left_kernel().nrows


def quiver_case(field: str, n: int) -> int:
    A = build_algebra(read_spec_text(spec_to_toml(auslander_truncated_polynomial(n, field))))
    d = describe(A)
    return d.dimension + quasi_hereditary_orders(A, list_limit=0).structures


def table_case(field: str, n: int) -> tuple:
    return family_algebra("temperley-lieb", n=n, delta="1", field=field).morita


CASES = {
    "rref": (rref_case, [20, 40, 80], [20, 40]),
    "quiver": (quiver_case, [3, 4, 5], [3, 4]),
    "table": (table_case, [4, 5, 6], [4, 5]),
}


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--quick", action="store_true")
    args = ap.parse_args()
    rows = []
    for base, ext in PAIRS:
        d = parse_field(ext).degree
        for name, (fn, full, quick) in CASES.items():
            for n in quick if args.quick else full:
                r0, t0, m0 = measure(lambda fn=fn, n=n, base=base: fn(base, n))
                r1, t1, m1 = measure(lambda fn=fn, n=n, ext=ext: fn(ext, n))
                if r0 != r1:
                    raise SystemExit(f"{name} n={n}: {base} gave {r0}, {ext} gave {r1}")
                rows.append(
                    [
                        name,
                        n,
                        base,
                        f"{t0:.3f}",
                        ext,
                        f"{t1:.3f}",
                        f"{t1 / max(t0, 1e-6):.1f}",
                        d * d,
                        f"{m0:.0f}/{m1:.0f}",
                    ]
                )
    print(table(rows, ["case", "n", "base", "s", "extension", "s", "slowdown", "d^2", "peak MiB"]))


if __name__ == "__main__":
    main()
