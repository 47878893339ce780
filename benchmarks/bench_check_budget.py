"""Benchmark: ``check`` with the homological part always ends, and quickly.

Draws random bound quiver algebras of dimension at most 60 with
:mod:`hwcat.strategies` (derandomised, so every run sees the same algebras),
among them the shape that used to run for minutes (2 vertices, 3 arrows, one
relation, ``vanish_from_length = 4``, over QQ and GF(101)), and runs the full
check (Ext axioms, global dimension, tilting modules and Ringel dual when
quasi-hereditary) for a random total order.  Prints the slowest cases and
the distribution of times.

Baseline in the same run: the slowest cases again with the work budget
effectively off (``max_syzygy_dimension`` = 10^9, the Cartan determinant not
used first), stopped after ``--cap`` seconds.

    python benchmarks/bench_check_budget.py            # 300 algebras
    python benchmarks/bench_check_budget.py --quick    # 60 algebras

``--command N`` instead runs the whole ``hwcat check`` command (order
search included) as a separate process on ``N`` random algebras of
dimension at most 60 with 2 to 6 vertices, relations and
``vanish_from_length`` 3 to 5, over QQ and GF(101), each stopped after
``--cap`` seconds (dimensions from ``--min-dim``, default 20), and prints the CPU time of each run above ``--slow``
seconds with its spec written to ``--keep DIR`` (the bound of issue 14:
any such algebra is checked in seconds).  Baseline in the same run: the
time to build the algebra alone (same process start-up).

    python benchmarks/bench_check_budget.py --command 40 --cap 60 --keep /tmp/slow

Measured with that command on a shared 2-core machine (one run): 40 algebras
of dimension 20 to 59 (median 30), 80 runs of the command, all within 1.04 s
CPU (90% within 0.46 s); none above 5 s, every exit code 0 or 1.
"""

from __future__ import annotations

import argparse
import os
import random
import resource
import signal
import subprocess
import sys
import time
import warnings
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))
sys.path.insert(0, str(Path(__file__).resolve().parent))

from _common import table
from hypothesis import HealthCheck, given, settings
from hypothesis import strategies as st

from hwcat.algebras.inputs.spec_text import spec_to_toml
from hwcat.errors import HwcatError
from hwcat.exact import GF, QQ
from hwcat.strategies import algebra_from_spec, bound_quiver_specs
from hwcat.theory import homological_dimension
from hwcat.theory.orders import total_order
from hwcat.theory.verdict import check_order


class _Timeout(Exception):
    pass


def _alarm(*_args):
    raise _Timeout


def draw_specs(count: int) -> list[dict]:
    fields = (QQ, GF(101))
    shape = st.one_of(
        *[
            bound_quiver_specs(2, 2, 3, field=F, max_relations=1, vanish_from_length=True)
            for F in fields
        ]
    ).map(_vanish_from_4)
    general = st.one_of(
        *[bound_quiver_specs(1, 4, 6, field=F, max_relations=2, max_path_length=4) for F in fields]
    )
    specs: list[dict] = []

    @settings(
        max_examples=count,
        database=None,
        derandomize=True,
        deadline=None,
        suppress_health_check=list(HealthCheck),
    )
    @given(st.one_of(shape, general))
    def collect(spec):
        if spec not in specs:
            specs.append(spec)

    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        collect()
    return specs


def draw_command_specs(count: int) -> list[dict]:
    """Specs with 2 to 6 vertices, relations and ``vanish_from_length`` 3 to 5 (derandomised)."""

    def vanish(pair: tuple[dict, int]) -> dict:
        spec, k = pair
        spec["quiver"]["vanish_from_length"] = k
        return spec

    drawn = st.tuples(
        st.one_of(
            *[
                bound_quiver_specs(
                    2, 6, 8, field=F, max_relations=3, max_path_length=4, vanish_from_length=True
                )
                for F in (QQ, GF(101))
            ]
        ),
        st.integers(3, 5),
    ).map(vanish)
    specs: list[dict] = []

    @settings(
        max_examples=count,
        database=None,
        derandomize=True,
        deadline=None,
        suppress_health_check=list(HealthCheck),
    )
    @given(drawn)
    def collect(spec):
        if spec not in specs:
            specs.append(spec)

    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        collect()
    return specs


def run_command(args: list[str], cap: float) -> tuple[float | None, int | None]:
    """(CPU seconds, exit code) of ``python -m hwcat args``; ``(None, None)`` past ``cap``."""
    root = str(Path(__file__).resolve().parents[1])
    env = dict(os.environ, PYTHONPATH=root)
    before = resource.getrusage(resource.RUSAGE_CHILDREN)
    try:
        p = subprocess.run(
            [sys.executable, *args],
            env=env,
            stdout=subprocess.DEVNULL,
            stderr=subprocess.DEVNULL,
            timeout=cap,
            check=False,
        )
    except subprocess.TimeoutExpired:
        return None, None
    after = resource.getrusage(resource.RUSAGE_CHILDREN)
    return (after.ru_utime - before.ru_utime) + (after.ru_stime - before.ru_stime), p.returncode


def command_sweep(count: int, cap: float, slow: float, keep: Path, min_dim: int) -> None:
    keep.mkdir(parents=True, exist_ok=True)
    build = "import sys; from hwcat.io.spec import load_spec_text; load_spec_text(open(sys.argv[1]).read())"
    rows, times, dims, codes = [], [], [], {}
    rng = random.Random(0)
    for k, spec in enumerate(draw_command_specs(count * 12)):
        if len(times) >= 2 * count:
            break
        try:
            A = algebra_from_spec(spec)
        except HwcatError:
            continue
        if not min_dim <= A.dim <= 60:
            continue
        path = keep / f"check-{k}.toml"
        path.write_text(spec_to_toml(spec))
        build_cpu, _ = run_command(["-c", build, str(path)], cap)
        names = list(spec["quiver"]["vertices"])
        rng.shuffle(names)
        kept = False
        for order in (None, " > ".join(names)):  # the searched order, then a random total one
            extra = [] if order is None else ["--order", order]
            cpu, code = run_command(["-m", "hwcat", "check", str(path), *extra], cap)
            times.append(float("inf") if cpu is None else cpu)
            dims.append(A.dim)
            codes[code] = codes.get(code, 0) + 1
            if cpu is not None and cpu <= slow and code in (0, 1):
                continue
            kept = True
            q = spec["quiver"]
            rows.append(
                [
                    path.name,
                    order or "searched",
                    A.dim,
                    A.n,
                    len(q["arrows"]),
                    len(q.get("relations", [])),
                    q["vanish_from_length"],
                    A.field.name,
                    f"> {cap:.0f}" if cpu is None else f"{cpu:.2f}",
                    code,
                    f"{build_cpu:.2f}" if build_cpu is not None else "-",
                ]
            )
        if not kept:
            path.unlink()
    times.sort()
    dims.sort()
    print(f"{len(times) // 2} algebras of dimension <= 60, whole `hwcat check` (CPU s)")
    print("  (twice each: the searched order, a random total order):")
    print(f"  dimensions: median {dims[len(dims) // 2]}, largest {dims[-1]}; exit codes {codes}")
    for q in (0.5, 0.9, 1.0):
        print(f"  {int(q * 100)}% within {times[min(len(times) - 1, int(q * len(times)))]:.2f} s")
    if rows:
        print(
            table(
                rows,
                [
                    "spec",
                    "order",
                    "dim A",
                    "vertices",
                    "arrows",
                    "relations",
                    "vanish",
                    "field",
                    "check CPU s",
                    "exit",
                    "build CPU s",
                ],
            )
        )
    else:
        print(f"none above {slow:.1f} s")


def _vanish_from_4(spec: dict) -> dict:
    spec["quiver"]["vanish_from_length"] = 4
    return spec


def run_check(A, order, cap: float, **budget) -> float | None:
    signal.signal(signal.SIGALRM, _alarm)
    signal.setitimer(signal.ITIMER_REAL, cap)
    t0 = time.perf_counter()
    try:
        check_order(A, order, **budget)
    except _Timeout:
        return None
    finally:
        signal.setitimer(signal.ITIMER_REAL, 0)
    return time.perf_counter() - t0


def unbudgeted(A, order, cap: float) -> float | None:
    """The baseline: no size limit and no determinant shortcut."""
    old = homological_dimension._determinant
    homological_dimension._determinant = lambda rows: 1
    try:
        return run_check(A, order, cap, max_syzygy_dimension=10**9)
    finally:
        homological_dimension._determinant = old


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--quick", action="store_true")
    ap.add_argument("--cap", type=float, default=30.0, help="seconds before a run is stopped")
    ap.add_argument("--command", type=int, metavar="N", help="sweep `hwcat check` over N algebras")
    ap.add_argument("--slow", type=float, default=5.0, help="report command runs above this")
    ap.add_argument("--keep", type=Path, default=Path("benchmarks/slow-checks"))
    ap.add_argument("--min-dim", type=int, default=20, help="smallest dimension swept")
    args = ap.parse_args()
    if args.command:
        command_sweep(args.command, args.cap, args.slow, args.keep, args.min_dim)
        return
    specs = draw_specs(60 if args.quick else 300)
    rng = random.Random(0)
    timed = []
    for spec in specs:
        try:
            A = algebra_from_spec(spec)
        except HwcatError:
            continue
        if A.dim > 60:
            continue
        perm = list(range(A.n))
        rng.shuffle(perm)
        order = total_order(A.vertices, perm)
        t = run_check(A, order, args.cap)
        timed.append((t if t is not None else float("inf"), A, order, spec))
    timed.sort(key=lambda x: x[0])
    times = [t for t, *_ in timed]
    print(f"{len(timed)} algebras of dimension <= 60; check with the homological part:")
    for q in (0.5, 0.9, 0.99, 1.0):
        print(f"  {int(q * 100)}% within {times[min(len(times) - 1, int(q * len(times)))]:.2f} s")
    rows = []
    for t, A, order, spec in timed[-8:]:
        base = unbudgeted(A, order, args.cap)
        q = spec["quiver"]
        rows.append(
            [
                A.dim,
                A.field.name,
                len(q["arrows"]),
                q.get("vanish_from_length", "-"),
                f"{t:.2f}",
                f"> {args.cap:.0f}" if base is None else f"{base:.2f}",
                f"> {args.cap / t:.0f}x" if base is None else f"{base / t:.1f}x",
            ]
        )
    print(
        table(
            rows,
            ["dim A", "field", "arrows", "vanish", "check s", "unbudgeted s", "ratio"],
        )
    )


if __name__ == "__main__":
    main()
