"""Benchmark: fuzz campaign throughput on 1 and 2 Dask workers, and the speed-up.

The claim is Ringel's bound (quasi-hereditary with n simples => global
dimension <= 2n - 2; tests/data/claims.py), on random algebras of all four
kinds with at most 3 vertices.  For each worker count a local cluster is
started, warmed up with a short campaign (other seed: imports, evaluating
processes), then timed on the campaign itself.  The naive baseline is the
same examples drawn and checked one after the other in this process, with no
cluster, no evaluating process and no time limit.

    python benchmarks/bench_campaigns.py            # 400 examples
    python benchmarks/bench_campaigns.py --quick    # 100 examples
    python benchmarks/bench_campaigns.py --max-vertices 4 --examples 300   # costlier examples
"""

from __future__ import annotations

import argparse
import logging
import os
import sys
import time
from pathlib import Path

sys.path.insert(0, str(Path(__file__).resolve().parents[1]))
sys.path.insert(0, str(Path(__file__).resolve().parent))

from _common import table

from hwcat.algebras.families.quivers import spec_to_toml
from hwcat.campaigns import fuzz
from hwcat.campaigns.generate import CHUNK, spec_chunk
from hwcat.io.spec import load_spec_text

ROOT = Path(__file__).resolve().parents[1]
CLAIM = f"{ROOT / 'tests' / 'data' / 'claims.py'}:ringel_global_dimension_bound"
KINDS = ["general", "acyclic", "nakayama", "commutative"]


def serial(examples: int, seed: int, max_vertices: int) -> tuple[float, int]:
    sys.path.insert(0, str(ROOT / "tests" / "data"))
    from claims import ringel_global_dimension_bound

    start = time.perf_counter()
    n = 0
    for c in range(-(-examples // CHUNK)):
        for _, spec in spec_chunk(seed, c, KINDS, max_vertices, None)[: examples - c * CHUNK]:
            assert ringel_global_dimension_bound(load_spec_text(spec_to_toml(spec)))
            n += 1
    return time.perf_counter() - start, n


def on_cluster(workers: int, examples: int, seed: int, max_vertices: int) -> tuple[float, int, str]:
    import distributed

    cluster = distributed.LocalCluster(
        n_workers=workers,
        threads_per_worker=1,
        processes=True,
        dashboard_address=None,
        silence_logs=logging.CRITICAL,
    )
    client = distributed.Client(cluster)
    try:
        kw = {"kinds": KINDS, "max_vertices": max_vertices, "timeout": 60, "client": client}
        fuzz(CLAIM, examples=2 * CHUNK * workers, seed=seed + 1, **kw)
        report = fuzz(CLAIM, examples=examples, seed=seed, **kw)
    finally:
        from hwcat.campaigns.worker import close_evaluators

        client.run(close_evaluators)
        client.close()
        cluster.close()
    assert not report.found
    return report.seconds, report.examples_run, report.digest


def main() -> None:
    ap = argparse.ArgumentParser()
    ap.add_argument("--quick", action="store_true")
    ap.add_argument("--examples", type=int, default=None)
    ap.add_argument("--max-vertices", type=int, default=3)
    args = ap.parse_args()
    examples = args.examples or (100 if args.quick else 400)
    seed = 11
    rows = []
    t0, n0 = serial(examples, seed, args.max_vertices)
    rows.append(["serial (naive, in process)", n0, f"{t0:.2f}", f"{n0 / t0:.1f}", "-"])
    per_worker = {}
    digests = set()
    for w in (1, 2):
        t, n, digest = on_cluster(w, examples, seed, args.max_vertices)
        digests.add(digest)
        per_worker[w] = n / t
        rows.append(
            [f"dask, {w} worker(s)", n, f"{t:.2f}", f"{n / t:.1f}", f"{(n / t) / (n0 / t0):.2f}"]
        )
    print(
        f"fuzz campaign, claim {CLAIM.rsplit(':', 1)[1]}, kinds {','.join(KINDS)}, "
        f"max {args.max_vertices} vertices, seed {seed}"
    )
    print(table(rows, ["run", "examples", "seconds", "examples/s", "ratio to serial"]))
    print(f"speed-up 2 workers / 1 worker: {per_worker[2] / per_worker[1]:.2f}")
    print(
        f"machine: {os.cpu_count()} cores, load average {os.getloadavg()[0]:.1f} "
        "(the speed-up needs idle cores)"
    )
    print(f"same examples on 1 and 2 workers: {len(digests) == 1}")


if __name__ == "__main__":
    main()
