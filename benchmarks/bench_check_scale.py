"""Benchmark: ``hwcat check`` with the full homological section at scale.

For Auslander algebras of k[x]/(x^n) and linear A_n with rad^3 = 0 (both
quasi-hereditary), runs the whole ``hwcat check`` command (search for an
order, axioms, Ext conditions, global dimension, tilting modules, Ringel
dual) as a separate process and reports its CPU time (user + system) and
wall time, then the growth exponent of the CPU time between consecutive
sizes (log time ratio / log size ratio).  CPU time is the figure to read on
a shared machine: wall time grows with the load of other processes.

Baselines in the same run:

* the time to build the algebra alone (same process start-up, no check);
* with ``--baseline REV``: the same command run from the source of an
  earlier revision (``git archive REV hwcat`` unpacked into a temporary
  directory), e.g. the revision before the faster paths;
* the former code paths kept as reference methods, on the sizes up to
  x^8 and A_50: the tilting modules by Ringel's construction with the
  flattened Ext (``universal_extension(method="flat")``) and the powers of
  the ideal for locality (``method="powers"``), and the Ringel dual's
  endomorphism algebra by ``method="pairs"``, beside the default paths.

    python benchmarks/bench_check_scale.py                     # up to x^16 and A_100
    python benchmarks/bench_check_scale.py --quick
    python benchmarks/bench_check_scale.py --baseline 612ea2b  # the previous code, whole command

Measured with ``--baseline 612ea2b`` on a shared 2-core machine (CPU seconds
of the whole command, one run, after modules by support, the support-based
submodules, quotients and generators and the sparse Hom system): Auslander
k[x]/x^16 6.9 s against 25.3 s (3.7x), growth exponent 4.1 between x^12 and
x^16; linear A_100 with rad^3 = 0 2.3 s against 23.2 s (10.1x), exponent 1.5
between A_50 and A_100.  Against the merged modules-by-support code
(``--baseline a12a311``, another run): x^16 7.9 s against 8.9 s (1.1x),
A_100 2.7 s against 4.8 s (1.8x).
"""

from __future__ import annotations

import argparse
import math
import os
import resource
import subprocess
import sys
import tarfile
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT))
sys.path.insert(0, str(Path(__file__).resolve().parent))

from _common import measure, table

from hwcat.algebras.families.quivers import auslander_truncated_polynomial, linear_A, spec_to_toml
from hwcat.io.spec import load_spec_text
from hwcat.theory.highest_weight import (
    costandard_filtration,
    heredity_chain,
    standard_filtration,
    standard_module,
)
from hwcat.theory.search import quasi_hereditary_orders
from hwcat.theory.tilting import (
    endomorphism_algebra,
    is_local_endomorphism_ring,
    tilting_modules,
    universal_extension,
)

BUILD_ONLY = (
    "import sys; from hwcat.io.spec import load_spec_text; load_spec_text(open(sys.argv[1]).read())"
)


def run(source: Path, args: list[str], cwd: Path) -> tuple[float, float, int]:
    """(CPU seconds, wall seconds, exit code) of ``python args`` with ``source`` first on the path.

    Run from ``cwd`` (not the source tree, whose ``hwcat`` would come first).
    """
    env = dict(os.environ, PYTHONPATH=str(source))
    before = resource.getrusage(resource.RUSAGE_CHILDREN)
    t0 = time.perf_counter()
    p = subprocess.run(
        [sys.executable, *args], env=env, cwd=cwd, stdout=subprocess.DEVNULL, check=False
    )
    wall = time.perf_counter() - t0
    after = resource.getrusage(resource.RUSAGE_CHILDREN)
    cpu = (after.ru_utime - before.ru_utime) + (after.ru_stime - before.ru_stime)
    return cpu, wall, p.returncode


def unpack(rev: str, into: Path) -> Path:
    """The package ``hwcat`` of revision ``rev``, unpacked under ``into``."""
    data = subprocess.run(
        ["git", "-C", str(ROOT), "archive", rev, "hwcat"], capture_output=True, check=True
    ).stdout
    with tempfile.TemporaryFile() as f:
        f.write(data)
        f.seek(0)
        with tarfile.open(fileobj=f) as tar:
            tar.extractall(into, filter="data")
    return into


def _prepared(text: str):
    A = load_spec_text(text)
    return A, quasi_hereditary_orders(A, list_limit=1).structure_list[0].essential_order


def tilting_time(text: str, reference: bool) -> tuple[float, list]:
    """CPU seconds for all T(L) on a fresh algebra: the default path or the reference paths."""
    A, P = _prepared(text)
    t0 = time.process_time()
    if not reference:
        dims = [T.module.dims for T in tilting_modules(A, P)]
        return time.process_time() - t0, dims
    ext = P.first_extension()
    dims = []
    for L in range(A.n):  # the same steps and checks as tilting_module, reference methods
        assert heredity_chain(A, P).holds
        M = standard_module(A, L, P)
        for mu in ext[ext.index(L) + 1 :]:
            M, _ = universal_extension(M, standard_module(A, mu, P), method="flat")
        assert standard_filtration(M, P).exists and costandard_filtration(M, P).exists
        assert is_local_endomorphism_ring(M, L, method="powers")
        dims.append(M.dims)
    return time.process_time() - t0, dims


def end_time(text: str, method: str) -> tuple[float, tuple]:
    """CPU seconds for the Ringel dual's endomorphism algebra (tilting modules made first)."""
    A, P = _prepared(text)
    Ts = [T.module for T in tilting_modules(A, P)]
    t0 = time.process_time()
    R = endomorphism_algebra(Ts, A.vertices, list(range(A.n)), method=method)
    return time.process_time() - t0, tuple(map(tuple, R.cartan()))


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--quick", action="store_true")
    ap.add_argument("--baseline", metavar="REV", help="also run the command from revision REV")
    ap.add_argument("--no-reference", action="store_true", help="skip the reference code paths")
    args = ap.parse_args()
    aus = (4, 8, 12) if args.quick else (4, 8, 12, 16)
    lin = (25, 50) if args.quick else (25, 50, 100)
    families = [
        (
            "Auslander k[x]/x^{}",
            [(n, spec_to_toml(auslander_truncated_polynomial(n))) for n in aus],
        ),
        (
            "linear A_{}, rad^3=0",
            [(n, spec_to_toml(linear_A(n, vanish_from_length=3))) for n in lin],
        ),
    ]
    tmp = Path(tempfile.mkdtemp(prefix="bench-check-scale-"))
    base = unpack(args.baseline, tmp / "base") if args.baseline else None
    rows, ref_rows = [], []
    for label, cases in families:
        prev = None
        for n, text in cases:
            spec = tmp / f"case-{len(rows)}.toml"
            spec.write_text(text)
            build_cpu, _, _ = run(ROOT, ["-c", BUILD_ONLY, str(spec)], tmp)
            cpu, wall, code = run(ROOT, ["-m", "hwcat", "check", str(spec)], tmp)
            growth = (
                "-" if prev is None else f"{math.log(cpu / prev[1]) / math.log(n / prev[0]):.1f}"
            )
            prev = (n, cpu)
            row = [label.format(n), load_spec_text(text).dim, code, f"{cpu:.2f}", f"{wall:.2f}"]
            row += [growth, f"{build_cpu:.2f}", f"{cpu / build_cpu:.1f}"]
            if base is not None:
                bcpu, _, bcode = run(base, ["-m", "hwcat", "check", str(spec)], tmp)
                row += [
                    f"{bcpu:.2f}" + ("" if bcode == code else f" (exit {bcode})"),
                    f"{bcpu / cpu:.1f}x",
                ]
            rows.append(row)
            small = n <= (8 if "Auslander" in label else 50)
            if small and not args.no_reference:
                (tt, dt), _, _ = measure(lambda text=text: tilting_time(text, False))
                (ttr, dtr), _, _ = measure(lambda text=text: tilting_time(text, True))
                (te, ce), _, _ = measure(lambda text=text: end_time(text, "generators"))
                (ter, cer), _, _ = measure(lambda text=text: end_time(text, "pairs"))
                if dt != dtr or ce != cer:
                    raise SystemExit(f"{label.format(n)}: the reference paths disagree")
                ref_rows.append(
                    [label.format(n), f"{tt:.2f}", f"{ttr:.2f}", f"{ttr / tt:.1f}x"]
                    + [f"{te:.2f}", f"{ter:.2f}", f"{ter / te:.1f}x"]
                )
    header = ["algebra", "dim A", "exit", "check CPU s", "wall s", "growth exp. (CPU)"]
    header += ["build CPU s", "check/build"]
    if base is not None:
        header += [f"{args.baseline} CPU s", "speed-up"]
    print(table(rows, header))
    if ref_rows:
        print()
        print(
            table(
                ref_rows,
                ["algebra", "T(L) s", "T(L) ref s", "ratio", "End s", "End pairs s", "ratio"],
            )
        )


if __name__ == "__main__":
    main()
