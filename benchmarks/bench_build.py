"""Benchmark: building bound quiver algebras and their projectives and injectives.

For families of growing size (up to dimension above 10,000) prints the time
of building the algebra from its spec text, of building every ``P(i)`` with
its radical layers, of building every ``I(i)`` (this includes the opposite
algebra) with its socle layers, and the peak resident memory of the whole
case (each case runs in its own forked process; the figure includes the
interpreter and the imported libraries).  On the small cases a naive baseline
computes the dimension by listing every path shorter than the Loewy length
and dividing by the span of all ``p * r * q``; its time and the ratio to the
build are printed beside it (measured in the same run).

Families
--------
- ``auslander n``: the Auslander algebra of ``k[x]/(x^n)``, dimension n(n+1)(2n+1)/6;
- ``linear n/L``: the linear quiver on n vertices with ``vanish_from_length = L``;
- ``grid m``: the m x m commutative grid (arrows right and down, every square
  commutes), dimension (m(m+1)/2)^2;
- ``loops k/L``: k loops at one vertex with ``vanish_from_length = L`` (one
  dense block: the worst case for block-wise storage).

    python benchmarks/bench_build.py            # full run
    python benchmarks/bench_build.py --quick    # small sizes only
"""

from __future__ import annotations

import argparse
import sys
import time
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))
sys.path.insert(0, str(Path(__file__).resolve().parent))

from _common import measure, table  # noqa: E402

from hwcat.algebras.hub.quiver import Quiver, parse_relation  # noqa: E402
from hwcat.exact import Mat, parse_field  # noqa: E402
from hwcat.io.spec import load_spec_text, read_spec_text  # noqa: E402
from hwcat.modules import injective, projective  # noqa: E402

# -- the families, as spec text ------------------------------------------------------


def _spec(vertices, arrows, relations=(), vanish=None, field="QQ") -> str:
    def q(xs):
        return "[" + ", ".join(f'"{x}"' for x in xs) + "]"

    lines = [f'field = "{field}"', "[quiver]", f"vertices = {q(vertices)}", f"arrows = {q(arrows)}"]
    if relations:
        lines.append(f"relations = {q(relations)}")
    if vanish is not None:
        lines.append(f"vanish_from_length = {vanish}")
    return "\n".join(lines) + "\n"


def auslander(n: int) -> tuple[str, int]:
    arrows = [f"a{i}: {i} -> {i + 1}" for i in range(1, n)]
    arrows += [f"b{i}: {i + 1} -> {i}" for i in range(1, n)]
    rels = ["a1*b1"] if n >= 2 else []
    rels += [f"b{i - 1}*a{i - 1} - a{i}*b{i}" for i in range(2, n)]
    return _spec([str(i) for i in range(1, n + 1)], arrows, rels), 2 * n


def linear(n: int, L: int) -> tuple[str, int]:
    arrows = [f"a{i}: {i} -> {i + 1}" for i in range(1, n)]
    return _spec([str(i) for i in range(1, n + 1)], arrows, vanish=L), L


def grid(m: int) -> tuple[str, int]:
    vertices = [f"v{i}_{j}" for i in range(m) for j in range(m)]
    arrows, rels = [], []
    for i in range(m):
        for j in range(m):
            if j + 1 < m:
                arrows.append(f"r{i}_{j}: v{i}_{j} -> v{i}_{j + 1}")
            if i + 1 < m:
                arrows.append(f"d{i}_{j}: v{i}_{j} -> v{i + 1}_{j}")
            if i + 1 < m and j + 1 < m:
                rels.append(f"r{i}_{j}*d{i}_{j + 1} - d{i}_{j}*r{i + 1}_{j}")
    return _spec(vertices, arrows, rels), 2 * m - 1


def loops(k: int, L: int) -> tuple[str, int]:
    return _spec(["1"], [f"x{i}: 1 -> 1" for i in range(k)], vanish=L), L


FAMILIES = {"auslander": auslander, "linear": linear, "grid": grid, "loops": loops}

FULL = [
    ("auslander", (5,)),
    ("auslander", (10,)),
    ("auslander", (20,)),
    ("auslander", (25,)),
    ("auslander", (31,)),
    ("linear", (100, 4)),
    ("linear", (250, 4)),
    ("linear", (500, 4)),
    ("linear", (1000, 4)),
    ("linear", (200, 60)),
    ("grid", (4,)),
    ("grid", (8,)),
    ("grid", (12,)),
    ("grid", (14,)),
    ("loops", (2, 7)),
    ("loops", (2, 8)),
    ("loops", (2, 9)),
    ("loops", (3, 6)),
]
QUICK = [
    ("auslander", (5,)),
    ("auslander", (10,)),
    ("linear", (100, 4)),
    ("grid", (4,)),
    ("grid", (6,)),
    ("loops", (2, 6)),
]
BASELINE_PATHS = 4000  # the naive baseline runs when at most this many paths are listed


# -- one case ---------------------------------------------------------------------------


def run_case(text: str) -> dict:
    t0 = time.perf_counter()
    A = load_spec_text(text)
    t1 = time.perf_counter()
    for s in range(A.n):
        projective(A, s).radical_layers()
    t2 = time.perf_counter()
    for s in range(A.n):
        injective(A, s).socle_layers()
    t3 = time.perf_counter()
    return {"dim": A.dim, "n": A.n, "build": t1 - t0, "P": t2 - t1, "I": t3 - t2}


# -- the naive baseline -------------------------------------------------------------------


def count_paths(Q: Quiver, L: int) -> int:
    layer, total = [1] * len(Q.vertices), 0
    for _ in range(L):
        total += sum(layer)
        nxt = [0] * len(Q.vertices)
        for a in Q.arrows:
            nxt[a.target] += layer[a.source]
        layer = nxt
    return total


def naive_dimension(text: str, L: int) -> int:
    """dim kQ/(I + J^L) by listing all paths of length < L (equal to dim kQ/I when
    L is at least the Loewy length)."""
    spec = read_spec_text(text)
    F = parse_field(spec.field.name)
    tab = spec.table
    Q = Quiver.from_text(tab["vertices"], tab.get("arrows", []))
    rels = [parse_relation(r, Q, F) for r in tab.get("relations", [])]
    L = tab.get("vanish_from_length", L)
    paths: dict[tuple[int, int], list[tuple[int, ...]]] = {}
    layer = [((), v, v) for v in range(len(Q.vertices))]
    for length in range(L):
        for p, s, t in layer:
            paths.setdefault((s, t), []).append(p)
        if length + 1 < L:
            layer = [
                (p + (i,), s, a.target)
                for p, s, t in layer
                for i, a in enumerate(Q.arrows)
                if a.source == t
            ]
    dim = 0
    for (s, t), plist in paths.items():
        col = {p: k for k, p in enumerate(plist)}
        rows = []
        for r in rels:
            p0 = next(iter(r))
            rs, rt = Q.arrows[p0[0]].source, Q.arrows[p0[-1]].target
            shortest = min(len(p) for p in r)
            for pre in paths.get((s, rs), []):
                for post in paths.get((rt, t), []):
                    if len(pre) + shortest + len(post) >= L:
                        continue
                    row = [F.zero] * len(plist)
                    for path, c in r.items():
                        w = pre + path + post
                        if len(w) < L:
                            row[col[w]] += c
                    rows.append(row)
        rank = Mat.from_rows(F, rows, len(plist)).rank() if rows else 0
        dim += len(plist) - rank
    return dim


def run_baseline(text: str, L: int) -> tuple[int, float]:
    t0 = time.perf_counter()
    d = naive_dimension(text, L)
    return d, time.perf_counter() - t0


# -- main ------------------------------------------------------------------------------------


def main(argv: list[str] | None = None) -> int:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    ap.add_argument("--quick", action="store_true", help="small sizes only")
    args = ap.parse_args(argv)
    rows = []
    for family, params in QUICK if args.quick else FULL:
        text, L = FAMILIES[family](*params)
        res, total, peak = measure(lambda text=text: run_case(text))
        spec = read_spec_text(text)
        Q = Quiver.from_text(spec.table["vertices"], spec.table.get("arrows", []))
        L = spec.table.get("vanish_from_length", L)
        if count_paths(Q, L) <= BASELINE_PATHS:
            (naive_dim, naive_t), _, _ = measure(lambda text=text, L=L: run_baseline(text, L))
            if naive_dim != res["dim"]:
                raise SystemExit(f"{family} {params}: naive dimension {naive_dim} != {res['dim']}")
            naive = f"{naive_t:.3f}"
            ratio = f"{naive_t / res['build']:.2g}x" if res["build"] > 0 else "-"
        else:
            naive, ratio = "-", "-"
        rows.append(
            [
                f"{family} {'/'.join(map(str, params))}",
                res["n"],
                res["dim"],
                f"{res['build']:.3f}",
                f"{res['P']:.3f}",
                f"{res['I']:.3f}",
                f"{total:.3f}",
                f"{peak:.0f}",
                naive,
                ratio,
            ]
        )
        print(rows[-1], file=sys.stderr, flush=True)
    header = [
        "case",
        "vertices",
        "dim A",
        "build s",
        "all P(i) s",
        "all I(i) s",
        "total s",
        "peak MiB",
        "naive s",
        "naive/build",
    ]
    print(table(rows, header))
    return 0


if __name__ == "__main__":
    sys.exit(main())
