"""Reduction of structure-constant algebras to their basic algebra: time, memory, ratio.

For each case, in a fresh process (so that the peak memory belongs to that case
alone): the dimension, the number of nonzero structure constants, the time to
build the family's table and convert it, the time of the reduction (split into
its phases: dense random elements, Krylov sequences, matrices of tree nodes,
certification of the simples, assembly of the basic algebra), and -- measured
in the same process -- the baseline: one dense rank of a random
``dim A x dim A`` matrix over the same field (the median of three runs when
one takes under 5 s).  The
ratio is reduction time / baseline time (the goal is at most 20).  Peak memory is the peak resident set
size of the case's process (``resource.getrusage``; it includes flint's
matrices, which ``tracemalloc`` does not see).

A second, naive baseline -- the radical by the lifted-trace chain on the
regular representation -- is run for the small cases only (``naive rad s``).

Cases named ``... spin`` reduce ``TL_n(delta)`` through the spin chain
(:mod:`hwcat.algebras.families.tl_module`): no table is built (``table`` and
``convert`` are 0, ``nonzero`` is ``-``), and the baseline is still one dense rank of a
``Catalan(n) x Catalan(n)`` matrix over the field, measured in the same process (at
``n = 10``: 16796 x 16796, about 2.3 GB and a few minutes, so TL_10 is behind
``--large``; ``--spin`` runs the spin-chain cases only, TL_10 included).  For these
cases ``peak MiB`` also shows, in parentheses, the peak before the baseline ran: the
reduction's own.

Spin-chain cases where ``q`` (``q + 1/q = delta``) is not in ``GF(p)``: the chain over
``GF(p^2)`` restricted to ``GF(p)`` (sectors of twice the dimension).  ``python
benchmarks/bench_reduction.py --case "TL_8(0) GF(3) spin" ...`` (the twelve cases below,
one run each, in one invocation for n = 8, 9 and one for n = 10), on the shared two-core
machine; ratio = reduction / one dense rank of a ``Catalan(n) x Catalan(n)`` matrix over
the same field, same process; peak = the reduction's own (the dense rank's ``16796 x
16796`` matrix takes the process to about 6.6 GB at n = 10)::

    case            dim    reduce s   dense rank s   ratio   peak MiB   simples   rad
    TL_8(0) GF(3)   1430     0.54         0.11        4.9        78        4     1028
    TL_8(0) GF(7)   1430     0.49         0.17        2.8        62        4     1001
    TL_8(1) GF(2)   1430     0.57         0.43        1.3        61        5      481
    TL_8(1) GF(5)   1430     0.41         0.16        2.5        59        5      426
    TL_9(0) GF(3)   4862     1.9          5.6         0.34       92        5      787
    TL_9(0) GF(7)   4862     4.3          5.2         0.83       67        5        0
    TL_9(1) GF(2)   4862     5.5         13.4         0.41      252        5     2482
    TL_9(1) GF(5)   4862     2.4          4.7         0.50       89        5     2401
    TL_10(0) GF(3) 16796    22.9        159           0.14      728        5    12721
    TL_10(0) GF(7) 16796    24.7        215           0.12      347        5    11934
    TL_10(1) GF(2) 16796    79.9        543           0.15      751        6     7396
    TL_10(1) GF(5) 16796    14.0        197           0.07      225        6     5776

At n = 8 the ratios are above those with ``q`` in ``GF(p)`` (1.1 to 1.7) but far below 20;
from n = 9 on the reduction is below one dense rank.  TL_10(1) over GF(2) spends 50 s in
the closures ``e A``, ``A e`` (rows four times as wide as over a field holding ``q``).
The whole command ``/usr/bin/time -v hwcat check --family temperley-lieb n=10 delta=0
field="GF(3)"`` (reduction, then every axiom): 27 s elapsed, 730 MiB peak resident
(exit code 1: not quasi-hereditary, the cell form of ``t = 0`` vanishing at ``delta = 0``);
``n=10 delta=1 field="GF(2)"``: 105 s elapsed (54 s user, a busy machine), 790 MiB
(exit code 0).

Run ``python benchmarks/bench_reduction.py`` (``--quick`` for small cases only,
``--large`` to add TL_9, TL_10, S(2, 30), S_7; ``--case NAME`` for one case;
``--profile`` prints the largest items of a cProfile run of each reduction;
``--repeat N`` takes the median of N reductions against the median of at least N
ranks; ``--general`` runs group algebras by the general splitting search).

Group algebras of the symmetric groups (ratio = reduction / one dense rank of a
``dim A x dim A`` matrix, same process; peak resident memory of the case's process).
"Before": the general splitting search (dense random elements, the radical of every
corner by lifted traces); "after": random elements supported on a few group elements,
local corners certified directly, the cheap lower bound for deferred nodes.  Measured
on a shared two-core machine with other jobs running: the rank of a 720 x 720 matrix
over GF(3) took 13 to 31 ms from run to run, so the S_6 ratios scatter; the ranges are
over runs, with ``--repeat 5`` for S_5 and S_6 and one run for S_7 (``--large``)::

    case       dim   before: ratio   peak MiB   after: ratio   peak MiB
    S_5 GF(2)   120     59 - 71          50        76 - 101        50
    S_5 GF(3)   120    121 - 178         49       144 - 230        50
    S_6 GF(2)   720     12 - 23         123         9 - 14         91
    S_6 GF(3)   720     25 - 52         135        18 - 25        103
    S_7 GF(2)  5040      5.1 (89 s)    1531         3.7 (84 s)   1247
    S_7 GF(3)  5040     14 - 23 (61 - 132 s)  1480   9.9 (60 s)   1247

Then, on the same route, the work of a group algebra moved off full ``dim A x dim A``
matrices: right ideals ``e A`` and the forms ``x -> col(e x)`` through the trace pairing
(no matrix of left multiplication), the sparse random element applied by one gather, the
lower bound of ``dim A f`` read on a few coordinates, the trace form and the table's
index arrays built whole, the blocks ``e_s A e_t`` of one ``t`` in a single product and
thin products padded to 12 columns (flint's faster product).  Ratio in elapsed time and
in processor time (``cpu ratio``, with the reduction's processor seconds), two runs each
of ``python benchmarks/bench_reduction.py --repeat 5 --case "S_6 GF(3)" --case "S_6
GF(2)" --case "S_5 GF(3)" --case "S_5 GF(2)"`` before and after, and one run of
``--case "S_7 GF(3)" --case "S_7 GF(2)"`` after (before: the table above)::

    case       dim   before: ratio   cpu ratio (s)             after: ratio   cpu ratio (s)
    S_5 GF(2)   120     87 - 102      87 - 94 (0.04)              68 - 97      68 - 93 (0.04)
    S_5 GF(3)   120    157 - 168     157 - 161 (0.04)            194 - 251    194 - 249 (0.03-0.06)
    S_6 GF(2)   720    9.7 - 10.6    9.6 - 10.7 (0.54 - 0.62)   6.9 - 9.4    6.9 - 9.6 (0.46 - 0.47)
    S_6 GF(3)   720     24 - 29       24 - 29 (0.46 - 0.48)      16 - 22      16 - 22 (0.30 - 0.35)
    S_7 GF(2)  5040      3.7 (84 s)                             2.5 (35 s)   2.5 (34 s)
    S_7 GF(3)  5040      9.9 (60 s)                             6.1 (20 s)   6.0 (20 s)

Peak memory after: 200 - 260 MiB for S_6 (the same before, in these runs), 1100 MiB for
S_7.  S_6 over GF(3) in processor time, seven seeds after a warm-up run in one process:
0.21 - 0.25 s against a 13 - 16 ms rank in quiet moments (ratios 14 - 20), 0.26 - 0.32 s when
the machine is busier.  S_5 stays far above 20: its rank takes under a millisecond, the
reduction some 30 ms of fixed costs.

Then S_6 over GF(3), where most of the time went to memory: every fresh 4 MB page range
of a ``720 x 720`` matrix (node matrices, index arrays, temporaries) cost 2 to 20 ms of
page faults on this machine, and most products with such a matrix are bound by reading
it.  Changes: node and class matrices gathered straight into flint, into the memory of
matrices no longer in use (``_Spare``), a few rows at a time; the group table's arrays
built without whole-size temporaries; the Krylov dependency from the pivot columns of the
sequence instead of an ``n x (d + 1)`` elimination; a corner found not local splits its
node with its own element, so two single-factor elements (not four) precede a
certificate over GF(3); the blocks of a simple projective read off its corner; block
sketches of ``margin(p) + 8`` columns from one product and one kept draw.  CPU time of
the reduction (``cpu ratio``), ``--repeat 5 --case "S_6 GF(3)" --case "S_6 GF(2)"``,
before and after side by side in the same minutes, with two other jobs on the two cores
(the rank of a 720 x 720 matrix over GF(3) took 13 to 20 ms)::

    case       dim   before: cpu ratio (s)           after: cpu ratio (s)
    S_6 GF(3)   720     17.6 - 21.3 (0.29)          11.6 - 13.9 (0.15 - 0.17)
    S_6 GF(2)   720      9.1 - 9.2 (0.42 - 0.43)     7.0 - 7.7 (0.35 - 0.36)

Over the afternoon, after: S_6 GF(3) 9.3 - 13.9 in quieter runs (0.15 - 0.19 s against a
13 - 20 ms rank), up to 17 when both cores were taken by other jobs (CPU time then
grows for this memory-bound work more than for the rank); before, 16.9 - 17.7 (0.34 -
0.36 s) in a quiet run.  S_6 GF(2) 6.3 - 9.6 after.  S_7, two runs each after: GF(3)
3.6 - 4.1 (12.7 - 13.2 s, before 6.1 with 20 s), GF(2) 2.7 - 2.8 (37 s; before, in the
same hour, 2.9 with 37 s).  Peak memory of S_6 after: 105 - 127 MiB (before 190 - 214).
"""

from __future__ import annotations

import argparse
import cProfile
import json
import pstats
import random
import resource
import subprocess
import sys
import time
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))

from hwcat.algebras.families import tables as ft  # noqa: E402
from hwcat.algebras.inputs.structure import from_table  # noqa: E402
from hwcat.algebras.reduction import reduction  # noqa: E402
from hwcat.algebras.reduction.reduction import radical, reduce_algebra  # noqa: E402
from hwcat.exact.polys import matrix_from_ints  # noqa: E402

CASES_QUICK = {
    "S(2,10) GF(2)": lambda: ft.schur_algebra_2(10, "GF(2)"),
    "S(2,10) GF(3)": lambda: ft.schur_algebra_2(10, "GF(3)"),
    "TL_6(0) QQ": lambda: ft.temperley_lieb(6, 0, "QQ"),
    "TL_7(1) GF(3)": lambda: ft.temperley_lieb(7, 1, "GF(3)"),
    "S_5 GF(2)": lambda: ft.symmetric_group_algebra(5, "GF(2)"),
    "u_q ell=5 GF(11)": lambda: ft.small_quantum_sl2(5, 3, "GF(11)"),
}
CASES_FULL = {
    **CASES_QUICK,
    "S(2,15) GF(3)": lambda: ft.schur_algebra_2(15, "GF(3)"),
    "S(2,21) GF(2)": lambda: ft.schur_algebra_2(21, "GF(2)"),
    "S(2,21) GF(3)": lambda: ft.schur_algebra_2(21, "GF(3)"),
    "S(2,21) GF(10007)": lambda: ft.schur_algebra_2(21, "GF(10007)"),
    "TL_8(0) GF(3)": lambda: ft.temperley_lieb(8, 0, "GF(3)"),
    "TL_8(0) GF(5)": lambda: ft.temperley_lieb(8, 0, "GF(5)"),
    "TL_8(1) GF(3)": lambda: ft.temperley_lieb(8, 1, "GF(3)"),
    "TL_8(2) GF(10007)": lambda: ft.temperley_lieb(8, 2, "GF(10007)"),
    "S_5 GF(3)": lambda: ft.symmetric_group_algebra(5, "GF(3)"),
    "S_6 GF(2)": lambda: ft.symmetric_group_algebra(6, "GF(2)"),
    "S_6 GF(3)": lambda: ft.symmetric_group_algebra(6, "GF(3)"),
    "C_64 GF(2)": lambda: ft.cyclic_group_algebra(64, "GF(2)"),
}
CASES_LARGE = {
    **CASES_FULL,
    "S(2,30) GF(2)": lambda: ft.schur_algebra_2(30, "GF(2)"),
    "S(2,30) GF(3)": lambda: ft.schur_algebra_2(30, "GF(3)"),
    "TL_9(0) GF(5)": lambda: ft.temperley_lieb(9, 0, "GF(5)"),
    "TL_9(1) GF(5)": lambda: ft.temperley_lieb(9, 1, "GF(5)"),
    "TL_10(0) GF(3)": lambda: ft.temperley_lieb(10, 0, "GF(3)"),
    "TL_10(1) GF(5)": lambda: ft.temperley_lieb(10, 1, "GF(5)"),
    "S_7 GF(2)": lambda: ft.symmetric_group_algebra(7, "GF(2)"),
    "S_7 GF(3)": lambda: ft.symmetric_group_algebra(7, "GF(3)"),
}
SPIN_QUICK = {
    "TL_8(0) GF(5) spin": (8, 0, "GF(5)"),
    "TL_8(0) GF(2) spin": (8, 0, "GF(2)"),
    "TL_8(1) GF(3) spin": (8, 1, "GF(3)"),
    "TL_8(1) GF(7) spin": (8, 1, "GF(7)"),
    "TL_9(0) GF(5) spin": (9, 0, "GF(5)"),
    "TL_9(0) GF(2) spin": (9, 0, "GF(2)"),
    "TL_9(1) GF(3) spin": (9, 1, "GF(3)"),
    "TL_9(1) GF(7) spin": (9, 1, "GF(7)"),
    # q only in GF(p^2): the chain over GF(p^2) restricted to GF(p)
    "TL_8(0) GF(3) spin": (8, 0, "GF(3)"),
    "TL_8(0) GF(7) spin": (8, 0, "GF(7)"),
    "TL_8(1) GF(2) spin": (8, 1, "GF(2)"),
    "TL_8(1) GF(5) spin": (8, 1, "GF(5)"),
    "TL_9(0) GF(3) spin": (9, 0, "GF(3)"),
    "TL_9(0) GF(7) spin": (9, 0, "GF(7)"),
    "TL_9(1) GF(2) spin": (9, 1, "GF(2)"),
    "TL_9(1) GF(5) spin": (9, 1, "GF(5)"),
}
SPIN_LARGE = {
    **SPIN_QUICK,
    "TL_10(0) GF(5) spin": (10, 0, "GF(5)"),
    "TL_10(0) GF(2) spin": (10, 0, "GF(2)"),
    "TL_10(1) GF(3) spin": (10, 1, "GF(3)"),
    "TL_10(1) GF(7) spin": (10, 1, "GF(7)"),
    "TL_10(0) GF(3) spin": (10, 0, "GF(3)"),
    "TL_10(0) GF(7) spin": (10, 0, "GF(7)"),
    "TL_10(1) GF(2) spin": (10, 1, "GF(2)"),
    "TL_10(1) GF(5) spin": (10, 1, "GF(5)"),
}
SPIN_FULL = {k: v for k, v in SPIN_QUICK.items() if k.startswith("TL_8")}
ALL_CASES = {**CASES_LARGE, **SPIN_LARGE}
BASELINE_LIMIT = 130


def dense_rank_seconds(field, n: int, repeat: int = 3) -> float:
    """Time of one rank of a random dense ``n x n`` matrix over ``field`` (building excluded;
    the median of ``repeat`` runs, since the machine is shared, unless one run takes over 5 s)."""
    return dense_rank_times(field, n, repeat)[0]


def dense_rank_times(field, n: int, repeat: int = 3) -> tuple[float, float]:
    """:func:`dense_rank_seconds` in elapsed and in processor time (medians of the same runs)."""
    rng = random.Random(1)
    p = field.characteristic
    if p:
        vals = [rng.randrange(p) for _ in range(n * n)]
    else:
        vals = [field(rng.randint(-9, 9)) for _ in range(n * n)]
    M = matrix_from_ints(field, n, n, vals)
    del vals
    times: list[float] = []
    cpu: list[float] = []
    while len(times) < repeat:
        t0, c0 = time.perf_counter(), time.process_time()
        M.rank()
        times.append(time.perf_counter() - t0)
        cpu.append(time.process_time() - c0)
        if times[0] > 5:  # long enough to be measured once
            break
    return sorted(times)[len(times) // 2], sorted(cpu)[len(cpu) // 2]


def run_case(name: str, profile: bool = False, repeat: int = 1) -> dict:
    """One case, in this process; returns the figures as a dictionary (with ``profile``,
    the reduction runs under cProfile and the largest items are printed to stderr; with
    ``repeat``, the median of that many reductions, each of a freshly converted table,
    against the median of at least as many ranks)."""
    if name in SPIN_LARGE:
        return run_spin_case(name, profile)
    make = CASES_LARGE[name]
    times = []
    cpu = []
    for _ in range(repeat):
        t0 = time.perf_counter()
        table = make()
        t_table = time.perf_counter() - t0
        t0 = time.perf_counter()
        A = from_table(table)
        t_conv = time.perf_counter() - t0
        del table
        prof = cProfile.Profile() if profile else None
        t0, c0 = time.perf_counter(), time.process_time()
        if prof is not None:
            prof.enable()
        r = reduce_algebra(A)
        if prof is not None:
            prof.disable()
        times.append(time.perf_counter() - t0)
        cpu.append(time.process_time() - c0)
        if prof is not None:
            pstats.Stats(prof, stream=sys.stderr).sort_stats("tottime").print_stats(15)
    t_red = sorted(times)[len(times) // 2]
    c_red = sorted(cpu)[len(cpu) // 2]
    t_rank, c_rank = dense_rank_times(A.field, A.dim, repeat=max(3, repeat))
    naive = None
    if A.dim <= BASELINE_LIMIT and A.field.characteristic:
        t0 = time.perf_counter()
        rad = radical(A, "lifted-trace")
        naive = time.perf_counter() - t0
        assert rad.nrows == r.radical_dimension
    peak = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024  # KiB on Linux
    return {
        "case": name,
        "dim": A.dim,
        "nonzero": A.nnz,
        "table": t_table,
        "convert": t_conv,
        "reduce": t_red,
        "rank": t_rank,
        "ratio": t_red / t_rank if t_rank > 0 else float("inf"),
        "reduce_cpu": c_red,
        "ratio_cpu": c_red / c_rank if c_rank > 0 else float("inf"),
        "peak_mib": peak,
        "naive": naive,
        "simples": len(r.simple_dimensions),
        "rad": r.radical_dimension,
        "basic": r.basic.dim,
        "phases": {k: v for k, v in r.timings.items() if k != "search" and v >= 0.05},
    }


def run_spin_case(name: str, profile: bool = False) -> dict:
    """A ``... spin`` case: ``TL_n(delta)`` through the spin chain, no table."""
    from hwcat.algebras.families.tl_module import reduce_temperley_lieb
    from hwcat.exact import parse_field

    n, delta, field = SPIN_LARGE[name]
    prof = cProfile.Profile() if profile else None
    t0 = time.perf_counter()
    if prof is not None:
        prof.enable()
    r = reduce_temperley_lieb(n, delta, field)
    if prof is not None:
        prof.disable()
    t_red = time.perf_counter() - t0
    if prof is not None:
        pstats.Stats(prof, stream=sys.stderr).sort_stats("tottime").print_stats(15)
    peak_red = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024
    t_rank = dense_rank_seconds(parse_field(field), r.dimension)
    peak = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024
    return {
        "case": name,
        "dim": r.dimension,
        "nonzero": "-",
        "table": 0.0,
        "convert": 0.0,
        "reduce": t_red,
        "rank": t_rank,
        "ratio": t_red / t_rank if t_rank > 0 else float("inf"),
        "peak_mib": peak,
        "peak_reduce_mib": peak_red,
        "naive": None,
        "simples": len(r.simple_dimensions),
        "rad": r.radical_dimension,
        "basic": r.basic.dim,
        "phases": {k: v for k, v in r.timings.items() if k != "search" and v >= 0.05},
    }


def row(d: dict) -> list[str]:
    phases = ", ".join(f"{k} {v:.1f}" for k, v in d["phases"].items())
    return [
        d["case"],
        str(d["dim"]),
        str(d["nonzero"]),
        f"{d['table']:.2f}",
        f"{d['convert']:.2f}",
        f"{d['reduce']:.2f}",
        f"{d['rank']:.3f}",
        f"{d['ratio']:.1f}" if d["ratio"] >= 0.95 else f"{d['ratio']:.3f}",
        f"{d['ratio_cpu']:.1f} ({d['reduce_cpu']:.2f})" if "ratio_cpu" in d else "-",
        f"{d['peak_mib']:.0f}"
        + (f" ({d['peak_reduce_mib']:.0f})" if "peak_reduce_mib" in d else ""),
        "-" if d["naive"] is None else f"{d['naive']:.2f}",
        str(d["simples"]),
        str(d["rad"]),
        str(d["basic"]),
        phases,
    ]


HEADER = [
    "case",
    "dim",
    "nonzero",
    "table s",
    "convert s",
    "reduce s",
    "dense rank s",
    "ratio",
    "cpu ratio (s)",
    "peak MiB",
    "naive rad s",
    "simples",
    "rad",
    "basic",
    "phases (s)",
]


def main() -> None:
    ap = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    size = ap.add_mutually_exclusive_group()
    size.add_argument("--quick", action="store_true", help="small cases only")
    size.add_argument("--large", action="store_true", help="add TL_9, TL_10, S(2,30), S_7")
    size.add_argument("--case", action="append", help="run only this case (repeatable)")
    size.add_argument(
        "--spin", action="store_true", help="only TL_8, TL_9, TL_10 through the spin chain"
    )
    ap.add_argument(
        "--profile", action="store_true", help="profile the reduction of each case (cProfile)"
    )
    ap.add_argument(
        "--repeat",
        type=int,
        default=1,
        help="median of this many reductions per case (and of at least as many ranks)",
    )
    ap.add_argument(
        "--general",
        action="store_true",
        help="group algebras by the general splitting search (dense random elements)",
    )
    ap.add_argument("--json", action="store_true", help=argparse.SUPPRESS)  # child process
    args = ap.parse_args()
    if args.general:
        reduction.GROUP_SPLIT = False
    if args.json:
        print(json.dumps(run_case(args.case[0], args.profile, args.repeat)))
        return
    if args.case:
        names = args.case
    elif args.spin:
        names = list(SPIN_LARGE)
    elif args.quick:
        names = list(CASES_QUICK)
    elif args.large:
        names = list(CASES_LARGE) + list(SPIN_LARGE)
    else:
        names = list(CASES_FULL) + list(SPIN_FULL)
    for name in names:
        if name not in ALL_CASES:
            ap.error(f"unknown case {name!r}; known: {', '.join(ALL_CASES)}")
    print("  ".join(HEADER), flush=True)
    rows = []
    for name in names:
        out = subprocess.run(
            [sys.executable, __file__, "--json", "--case", name]
            + (["--profile"] if args.profile else [])
            + (["--general"] if args.general else [])
            + ["--repeat", str(args.repeat)],
            capture_output=True,
            text=True,
        )
        if args.profile:
            print(out.stderr, file=sys.stderr, flush=True)
        if out.returncode:
            print(f"{name}: failed: {out.stderr.strip().splitlines()[-1:]}", flush=True)
            continue
        rows.append(row(json.loads(out.stdout)))
        print("  ".join(rows[-1]), flush=True)
    widths = [max(len(r[i]) for r in rows + [HEADER]) for i in range(len(HEADER))]
    print()
    for r in [HEADER] + rows:
        print("  ".join(c.rjust(w) if i else c.ljust(w) for i, (c, w) in enumerate(zip(r, widths))))


if __name__ == "__main__":
    main()
