"""Shared helpers for the benchmark scripts: timing and peak memory.

Each measurement runs in a forked child process so that its peak resident
memory (``ru_maxrss``) belongs to that case alone; the figure includes the
interpreter and the already-imported libraries (about 60-80 MiB).
"""

from __future__ import annotations

import multiprocessing as mp
import resource
import time
from collections.abc import Callable
from typing import Any


def _child(fn: Callable[[], Any], q) -> None:
    t0 = time.perf_counter()
    out = fn()
    dt = time.perf_counter() - t0
    peak = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024
    q.put((out, dt, peak))


def measure(fn: Callable[[], Any]) -> tuple[Any, float, float]:
    """Run ``fn`` in a forked child: (its picklable result, seconds, peak RSS in MiB)."""
    ctx = mp.get_context("fork")
    q = ctx.Queue()
    p = ctx.Process(target=_child, args=(fn, q))
    p.start()
    out = q.get()
    p.join()
    return out


def table(rows: list[list[Any]], header: list[str]) -> str:
    cells = [[str(c) for c in r] for r in [header] + rows]
    w = [max(len(r[i]) for r in cells) for i in range(len(header))]
    lines = ["  ".join(c.rjust(w[i]) for i, c in enumerate(r)) for r in cells]
    lines.insert(1, "  ".join("-" * x for x in w))
    return "\n".join(lines)
