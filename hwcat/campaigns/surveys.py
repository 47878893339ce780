"""Surveys: every member of a built-in family over a grid of parameters, in parallel.

``grid`` maps each parameter of the family (see ``hwcat family --list``) to
its values: a list, or text -- ``"2..6"`` (integers, both ends included),
``"0,1,2"`` or ``"QQ;GF(2)"`` (a list; use ``;`` when a value contains a
comma) or a single value.  The members are the Cartesian product, the first
key varying slowest.  Each member is one Dask task, evaluated by the
worker's evaluating process (:mod:`hwcat.campaigns.child`) with a time limit:
a member that runs past it is killed and gets a row with status
``timeout``; a member whose construction or analysis fails gets a row with
status ``error`` and the message; the others go on.  The resource limits in
force when the survey starts (``--max-dim`` etc., or
:func:`hwcat.limits.resource_limits`) apply to every member: a member beyond
them gets an ``error`` row naming the limit.

Columns: the parameters, then ``status`` (``ok``, ``error``, ``timeout``,
``lost``), ``dimension`` (of the basic algebra), ``simples``,
``quasi_hereditary`` (for some order), ``structures`` (quasi-hereditary
structures), ``global_dimension`` (a number, ``infinite`` or ``>= k`` when a
limit was reached), ``seconds``, ``message``.
"""

from __future__ import annotations

import csv
import io
import itertools
import math
import os
import re
import sys
import time
from collections.abc import Mapping, Sequence
from dataclasses import dataclass
from typing import Any

from hwcat.campaigns.cluster import open_client
from hwcat.errors import CampaignError, HwcatError
from hwcat.exact.fields import int_from_text
from hwcat.limits import size_text

__all__ = ["SurveyTable", "survey", "parse_grid", "RESULT_COLUMNS", "MAX_MEMBERS"]

RESULT_COLUMNS = (
    "status",
    "dimension",
    "simples",
    "quasi_hereditary",
    "structures",
    "global_dimension",
    "seconds",
    "message",
)
_RANGE = re.compile(r"^\s*(-?\d+)\s*\.\.\s*(-?\d+)\s*$")

MAX_MEMBERS = 100_000
"""The most members a survey grid may have (each is one task and one row); a larger
grid is refused before any member is made."""


def _values(key: str, value: Any) -> Sequence[Any]:
    if isinstance(value, str):
        m = _RANGE.match(value)
        if m:
            lo, hi = int_from_text(m.group(1)), int_from_text(m.group(2))
            if lo > hi:
                raise CampaignError(f"{key}={value}: empty range")
            return range(lo, hi + 1)  # not listed: its length is checked first
        sep = ";" if ";" in value else ","
        if sep == "," and "(" in value:  # GF(p) has no comma, but keep GF(2),GF(3) whole
            parts = re.findall(r"[^,()]+(?:\([^)]*\))?", value)
        else:
            parts = value.split(sep)
        out = [p.strip() for p in parts if p.strip()]
        if not out:
            raise CampaignError(f"{key}={value!r}: no values")
        return out
    if isinstance(value, Sequence):
        if not value:
            raise CampaignError(f"{key}: no values")
        return list(value)
    return [value]


def parse_grid(family: str, grid: Mapping[str, Any]) -> list[dict[str, Any]]:
    """The members of the grid, as parameter dicts, each checked against the family.

    >>> parse_grid("temperley-lieb", {"n": "2..3", "delta": "0,1"})
    [{'n': 2, 'delta': 0}, {'n': 2, 'delta': 1}, {'n': 3, 'delta': 0}, {'n': 3, 'delta': 1}]
    >>> parse_grid("schur", {"r": "2", "field": "GF(2),GF(3)"})
    [{'r': 2, 'field': 'GF(2)'}, {'r': 2, 'field': 'GF(3)'}]
    """
    from hwcat.algebras.families.registry import parse_parameters

    keys = list(grid)
    axes = [_values(k, grid[k]) for k in keys]
    counts = [a.stop - a.start if isinstance(a, range) else len(a) for a in axes]  # no len():
    size = math.prod(counts)  # a range may be longer than a C integer
    if size > MAX_MEMBERS:
        shape = f" ({' x '.join(size_text(c) for c in counts)})" if len(counts) > 1 else ""
        raise CampaignError(
            f"the grid has {size_text(size)} members{shape}, more than the "
            f"{MAX_MEMBERS} a survey runs; split it into smaller surveys"
        )
    members = []
    for combo in itertools.product(*axes):
        params = {}
        for k, v in zip(keys, combo, strict=True):
            params[k] = int_from_text(v) if isinstance(v, str) and re.fullmatch(r"-?\d+", v) else v
        try:
            parse_parameters(family, params)
        except HwcatError as exc:
            raise CampaignError(str(exc)) from None
        members.append(params)
    return members


@dataclass(frozen=True)
class SurveyTable:
    """One row per member: the parameters, then :data:`RESULT_COLUMNS`."""

    family: str
    columns: tuple[str, ...]
    rows: tuple[dict[str, Any], ...]
    workers: int
    seconds: float

    def to_dict(self) -> dict[str, Any]:
        return {
            "family": self.family,
            "columns": list(self.columns),
            "rows": [dict(r) for r in self.rows],
            "workers": self.workers,
            "seconds": round(self.seconds, 3),
        }

    def to_csv(self) -> str:
        buf = io.StringIO()
        w = csv.DictWriter(buf, fieldnames=list(self.columns), lineterminator="\n")
        w.writeheader()
        for r in self.rows:
            w.writerow({k: "" if r.get(k) is None else r.get(k) for k in self.columns})
        return buf.getvalue()

    def counts(self) -> dict[str, int]:
        out: dict[str, int] = {}
        for r in self.rows:
            out[r["status"]] = out.get(r["status"], 0) + 1
        return out

    def summary(self) -> str:
        c = self.counts()
        parts = ", ".join(f"{n} {s}" for s, n in sorted(c.items()))
        qh = sum(1 for r in self.rows if r.get("quasi_hereditary") is True)
        return (
            f"survey {self.family}: {len(self.rows)} members ({parts}); {qh} "
            f"quasi-hereditary; {self.seconds:.1f} s on {self.workers} worker(s)"
        )


def survey(
    family: str,
    grid: Mapping[str, Any],
    *,
    workers: int | None = None,
    scheduler: str | None = None,
    timeout: float | None = 120.0,
    progress: bool = False,
    client: Any = None,
) -> SurveyTable:
    """Evaluate ``family`` at every point of ``grid`` (see the module notes).

    Raises
    ------
    CampaignError
        Unknown family or parameter, malformed values.
    MissingExtra
        Dask is not installed.
    """
    from hwcat.algebras.families.registry import FAMILIES

    if family not in FAMILIES:
        raise CampaignError(f"unknown family {family!r} (known: {', '.join(FAMILIES)})")
    members = parse_grid(family, grid)
    if timeout is not None and not timeout > 0:
        raise CampaignError(f"--timeout {timeout!r}: must be positive")
    if client is not None:
        return _run(client, family, list(grid), members, timeout, progress)
    with open_client(workers, scheduler) as c:
        return _run(c, family, list(grid), members, timeout, progress)


def _run(client, family, keys, members, timeout, progress) -> SurveyTable:
    import distributed

    from hwcat.campaigns.cluster import WorkerWatch
    from hwcat.campaigns.worker import survey_member
    from hwcat.limits import current_limits

    start = time.perf_counter()
    limits = current_limits().to_dict()  # those in force here: the workers apply them
    watch = WorkerWatch(client)
    run_id = f"hwcat-survey-{family}-{time.time_ns()}"
    futs = [
        client.submit(
            survey_member,
            family,
            {k: str(v) for k, v in m.items()},
            timeout,
            limits,
            pure=False,
            priority=-i,
            key=f"{run_id}-{i}",
        )
        for i, m in enumerate(members)
    ]
    bar = None
    if progress:
        try:
            from tqdm import tqdm

            bar = tqdm(total=len(futs), unit="member", file=sys.stderr, desc=family, leave=False)
        except ImportError:
            bar = None
    answers: dict[int, dict] = {}
    index = {f.key: i for i, f in enumerate(futs)}
    try:
        for fut in distributed.as_completed(futs):
            i = index[fut.key]
            if fut.exception() is not None:
                answers[i] = {
                    "status": "lost",
                    "message": f"the task failed ({type(fut.exception()).__name__}: "
                    f"{fut.exception()})",
                }
            else:
                answers[i] = fut.result()
            if bar is not None:
                bar.update(1)
    finally:
        if bar is not None:
            bar.close()
    watch.poll()
    rows = []
    for i, m in enumerate(members):
        a = answers[i]
        row: dict[str, Any] = dict(m)
        row.update(dict.fromkeys(RESULT_COLUMNS))
        row["seconds"] = a.get("seconds")
        if a["status"] == "ok":
            row.update(a["row"])
            row["status"] = "ok"
        elif a["status"] == "timeout":
            row["status"] = "timeout"
            row["message"] = f"ran past the time limit of {timeout} s"
        else:
            row["status"] = "error" if a["status"] in ("error", "crashed") else a["status"]
            exc = a.get("exception")
            row["message"] = f"{exc}: {a.get('message')}" if exc else a.get("message")
        rows.append(row)
    return SurveyTable(
        family,
        tuple(keys) + RESULT_COLUMNS,
        tuple(rows),
        watch.worker_count(),
        time.perf_counter() - start,
    )


def write_csv(table: SurveyTable, path: str | os.PathLike) -> None:
    """Write the table as CSV (one header line, one line per member)."""
    try:
        with open(path, "w", encoding="utf-8", newline="") as fh:
            fh.write(table.to_csv())
    except OSError as exc:
        raise CampaignError(f"-o {path}: cannot write: {exc.strerror or exc}") from None
