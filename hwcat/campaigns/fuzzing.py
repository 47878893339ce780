"""Fuzz campaigns: test a claim about algebras on many random algebras, in parallel.

A *claim* is a plain Python function in a file, taking a
:class:`~hwcat.BasicAlgebra` and returning ``True`` (holds) or ``False``
(fails), or raising ``AssertionError`` (fails).  Any other return value,
``None`` included, counts as holding, so ``assert``-style claims work.  Any
other exception is an error: on the first example it makes the campaign
stop as bad input (the claim is broken); later it is counted and reported,
never taken for a counterexample.  Note that
:class:`~hwcat.errors.InternalInconsistency` (two computations in hwcat
disagreeing) is an ``AssertionError``, so a campaign also finds hwcat's own
inconsistencies.

How a campaign runs (:func:`fuzz`):

1. The examples are cut into chunks of :data:`hwcat.campaigns.generate.CHUNK`;
   one Dask task per chunk draws its specs from ``(seed, chunk)`` (see
   :mod:`hwcat.campaigns.generate`) and sends each spec, as text, to its
   worker's evaluating process, with a time limit per example.  A slow
   example is a *timeout*, not a counterexample.
2. The counterexample is the failing example with the smallest index, so the
   outcome does not depend on which worker finished first: the same seed
   gives the same counterexample for any number of workers (timeouts aside,
   which depend on the machine).
3. It is then shrunk (:mod:`hwcat.campaigns.shrink`): the candidates of each
   round are evaluated in parallel and the first one on which the claim still
   fails, and whose algebra is of dimension at most the current one, is kept
   (:func:`shrink_accepts`), until there is none; so the shrunk algebra is
   never of larger dimension than the one drawn.
4. ``DIR/counterexample.toml`` (the shrunk spec; every hwcat command reads
   it), ``DIR/original.toml`` (as drawn) and ``DIR/counterexample.json`` (the
   record) are written; ``DIR/campaign.json`` holds the whole report.

A worker that dies (killed, out of memory) is noticed and reported; Dask
reschedules its tasks on the other workers, so its examples are retried.
Every example the campaign needs is accounted for: an example whose task
failed for good, or that a task did not return, is counted as ``lost``, and a
campaign with lost examples and no counterexample is *incomplete* (exit
code 3, not 0).  The resource limits in force when the campaign starts
(:func:`hwcat.limits.resource_limits`, ``--max-dim`` etc.) apply to every
example on the workers.
"""

from __future__ import annotations

import hashlib
import json
import os
import sys
import time
import tomllib
from dataclasses import dataclass, field
from pathlib import Path
from typing import Any

from hwcat.campaigns.cluster import WorkerWatch, open_client
from hwcat.campaigns.generate import CHUNK, check_kinds
from hwcat.errors import CampaignError

__all__ = ["FuzzReport", "fuzz", "load_claim"]

STATUSES = ("holds", "fails", "timeout", "error", "invalid", "crashed", "lost")


@dataclass(frozen=True)
class FuzzReport:
    """The outcome of a fuzz campaign (plain data).

    ``counterexample`` is None or a dict: ``index``, ``kind``, ``outcome``
    (what the claim returned or raised), ``spec`` (text as drawn),
    ``shrunk_spec`` (text after shrinking), ``shrink_steps``, and the paths
    written.  ``counts`` maps each status (``holds``, ``fails``, ``timeout``,
    ``error``, ``invalid``, ``crashed``, ``lost``) to a number of examples.
    """

    claim: str
    seed: int
    examples_requested: int
    examples_run: int
    settings: dict[str, Any]
    workers: int
    counts: dict[str, int]
    counterexample: dict[str, Any] | None
    problems: tuple[dict[str, Any], ...]
    lost_workers: tuple[str, ...]
    digest: str
    seconds: float
    files: dict[str, str] = field(default_factory=dict)

    @property
    def found(self) -> bool:
        return self.counterexample is not None

    @property
    def complete(self) -> bool:
        """Whether every example the campaign needed was evaluated (none ``lost``)."""
        return not self.counts.get("lost")

    @property
    def exit_code(self) -> int:
        """1: a counterexample; 0: none, every example evaluated; 3: none, but some
        examples were lost (not evaluated), so the campaign is incomplete."""
        if self.found:
            return 1
        return 0 if self.complete else 3

    def rate(self) -> float:
        return self.examples_run / self.seconds if self.seconds > 0 else 0.0

    def to_dict(self) -> dict[str, Any]:
        return {
            "claim": self.claim,
            "seed": self.seed,
            "examples_requested": self.examples_requested,
            "examples_run": self.examples_run,
            "settings": dict(self.settings),
            "workers": self.workers,
            "counts": dict(self.counts),
            "counterexample_found": self.found,
            "complete": self.complete,
            "counterexample": self.counterexample,
            "problems": list(self.problems),
            "lost_workers": list(self.lost_workers),
            "examples_digest": self.digest,
            "seconds": round(self.seconds, 3),
            "examples_per_second": round(self.rate(), 2),
            "files": dict(self.files),
        }

    def summary(self) -> str:
        c = self.counts
        extra = ", ".join(
            f"{c[s]} {s}" for s in ("timeout", "error", "crashed", "lost") if c.get(s)
        )
        tail = f" ({extra})" if extra else ""
        lost = (
            f"; {len(self.lost_workers)} worker(s) lost and their tasks retried"
            if (self.lost_workers)
            else ""
        )
        speed = f"{self.seconds:.1f} s, {self.rate():.1f} examples/s on {self.workers} worker(s)"
        if self.found:
            ce = self.counterexample
            return (
                f"fuzz {self.claim}: COUNTEREXAMPLE at example {ce['index']} (seed {self.seed}) "
                f"after {self.examples_run} examples{tail}; shrunk in {ce['shrink_steps']} "
                f"step(s) to {ce['shrunk_vertices']} vertex/vertices: "
                f"{self.files.get('spec', '(not written)')}; {speed}{lost}"
            )
        if not self.complete:
            return (
                f"fuzz {self.claim}: INCOMPLETE: no counterexample in {self.examples_run} "
                f"examples, but {c['lost']} example(s) were lost (not evaluated; see problems "
                f"in campaign.json) (seed {self.seed}){tail}; {speed}{lost}"
            )
        return (
            f"fuzz {self.claim}: no counterexample in {self.examples_run} examples "
            f"(seed {self.seed}){tail}; {speed}{lost}"
        )


# -- the claim ----------------------------------------------------------------------------


def load_claim(ref: str) -> dict[str, str]:
    """Check ``FILE.py:FUNCTION`` and return what the workers need: the file's text.

    The file is run once here, to check that it defines the function; the
    workers compile the same text, so they need not see the file.
    """
    if not isinstance(ref, str) or ":" not in ref:
        raise CampaignError(f"claim {ref!r}: expected FILE.py:FUNCTION")
    path, function = ref.rsplit(":", 1)
    if not function.isidentifier():
        raise CampaignError(f"claim {ref!r}: {function!r} is not a function name")
    try:
        source = Path(path).read_text(encoding="utf-8")
    except OSError as exc:
        raise CampaignError(f"{path}: cannot read the claim file: {exc.strerror or exc}") from None
    namespace: dict[str, Any] = {"__name__": "hwcat_claim", "__file__": path}
    directory = os.path.dirname(os.path.abspath(path))
    added = directory not in sys.path
    if added:
        sys.path.insert(0, directory)
    try:
        exec(compile(source, path, "exec"), namespace)  # the user's claim file
    except Exception as exc:  # noqa: BLE001 -- any failure of the file is bad input
        raise CampaignError(
            f"{path}: the claim file fails to load: {type(exc).__name__}: {exc}"
        ) from None
    finally:
        if added:
            sys.path.remove(directory)
    if not callable(namespace.get(function)):
        raise CampaignError(f"{path}: no function {function!r} in the claim file")
    key = hashlib.sha256(f"{path}\0{function}\0{source}".encode()).hexdigest()[:16]
    return {"key": key, "source": source, "filename": os.path.abspath(path), "function": function}


def _outcome(answer: dict) -> str:
    if answer["status"] == "fails" and "returned" in answer:
        return f"returned {answer['returned']}"
    if answer.get("exception"):
        msg = answer.get("message") or ""
        return f"raised {answer['exception']}" + (f": {msg}" if msg else "")
    return answer.get("message") or answer["status"]


# -- the campaign -------------------------------------------------------------------------


def _check_int(value: Any, what: str, minimum: int) -> int:
    if isinstance(value, bool) or not isinstance(value, int) or value < minimum:
        raise CampaignError(f"{what} {value!r}: must be an integer >= {minimum}")
    return value


def _progress(total: int, enabled: bool):
    if not enabled:
        return None
    try:
        from tqdm import tqdm
    except ImportError:
        return None
    return tqdm(total=total, unit="ex", file=sys.stderr, desc="fuzz", leave=False)


def fuzz(
    claim: str,
    *,
    examples: int = 200,
    max_vertices: int = 3,
    field: str | None = None,
    kinds: tuple[str, ...] | list[str] = ("general",),
    seed: int = 0,
    workers: int | None = None,
    scheduler: str | None = None,
    timeout: float | None = 10.0,
    out: str | os.PathLike | None = None,
    shrink: bool = True,
    progress: bool = False,
    client: Any = None,
) -> FuzzReport:
    """Run a fuzz campaign for ``claim`` (``"FILE.py:FUNCTION"``); see the module notes.

    Parameters
    ----------
    examples : int
        How many random algebras to draw.
    max_vertices, field, kinds
        What to draw (:mod:`hwcat.campaigns.generate`); ``field=None`` draws
        the field too.
    seed : int
        The campaign seed: the same seed gives the same examples.
    workers, scheduler
        A new local cluster with ``workers`` processes (default 2), or the
        address of an existing Dask scheduler.  ``client`` (a
        ``distributed.Client``) may be given instead of both.
    timeout : float or None
        Seconds allowed per example (and per shrinking candidate).
    out : path or None
        Directory for the counterexample files and ``campaign.json``.

    Raises
    ------
    CampaignError
        Bad input: the claim file or function, options, or a claim that raises
        something other than ``AssertionError`` on the first example.
    MissingExtra
        Dask is not installed.
    """
    info = load_claim(claim)
    _check_int(examples, "--examples", 1)
    _check_int(max_vertices, "--max-vertices", 1)
    _check_int(seed, "--seed", 0)
    kinds = check_kinds(kinds)
    if field is not None:
        from hwcat.exact import parse_field

        field = parse_field(field).name
    if timeout is not None and not timeout > 0:
        raise CampaignError(f"--timeout {timeout!r}: must be positive")
    from hwcat.limits import current_limits

    settings = {
        "seed": seed,
        "kinds": list(kinds),
        "max_vertices": max_vertices,
        "field": field,
        "examples": examples,
        "timeout": timeout,
        "limits": current_limits().to_dict(),  # those in force here: the workers apply them
    }
    if client is not None:
        return _run(client, claim, info, settings, out, shrink, progress)
    with open_client(workers, scheduler) as c:
        return _run(c, claim, info, settings, out, shrink, progress)


def _run(client, ref, info, settings, out, shrink, progress) -> FuzzReport:
    import distributed

    from hwcat.campaigns.worker import fuzz_chunk

    start = time.perf_counter()
    watch = WorkerWatch(client)
    nworkers = watch.worker_count()
    examples, timeout = settings["examples"], settings["timeout"]
    nchunks = -(-examples // CHUNK)
    run_id = f"hwcat-fuzz-{info['key']}-{settings['seed']}-{time.time_ns()}"
    stop = distributed.Variable(f"{run_id}-stop", client=client)
    stop.set(examples)
    futures = {
        client.submit(
            fuzz_chunk,
            info,
            settings,
            c,
            timeout,
            stop.name,
            pure=False,
            priority=-c,
            key=f"{run_id}-{c}",
        ): c
        for c in range(nchunks)
    }
    pending = set(futures)
    chunk_results: dict[int, dict] = {}
    lost_chunks: list[tuple[int, str]] = []
    first_fail: int | None = None
    bar = _progress(examples, progress)
    fails_seen = 0
    try:
        while pending:
            try:
                done = distributed.wait(
                    list(pending), timeout=0.5, return_when="FIRST_COMPLETED"
                ).done
            except TimeoutError:
                done = set()
            watch.poll()
            for fut in done:
                pending.discard(fut)
                c = futures[fut]
                if fut.status == "cancelled":
                    continue
                exc = fut.exception()
                if exc is not None:
                    lost_chunks.append((c, f"{type(exc).__name__}: {exc}"))
                    continue
                res = fut.result()
                chunk_results[c] = res
                results = res["results"]
                if c == 0 and results and results[0]["status"] in ("error", "crashed"):
                    a = results[0]
                    raise CampaignError(
                        f"claim {ref}: on the first example it "
                        f"{_outcome(a)}; a claim must return True/False or raise AssertionError"
                    )
                for a in results:
                    if a["status"] == "fails":
                        fails_seen += 1
                        if first_fail is None or a["index"] < first_fail:
                            first_fail = a["index"]
                            stop.set(first_fail)
                if bar is not None:
                    bar.update(len(results))
                    bar.set_postfix(
                        failures=fails_seen,
                        timeouts=sum(
                            r["status"] == "timeout"
                            for cr in chunk_results.values()
                            for r in cr["results"]
                        ),
                    )
            if first_fail is not None:
                for fut in list(pending):
                    if futures[fut] * CHUNK > first_fail:
                        fut.cancel()
                        pending.discard(fut)
    finally:
        if bar is not None:
            bar.close()
        for fut in pending:
            fut.cancel()
        stop.set(-1)  # chunks still running stop at their next example
        if sys.exc_info()[0] is not None:
            stop.delete()
    watch.poll()
    counts, problems, run, digest, fail_answer = _tally(
        chunk_results, lost_chunks, first_fail, examples
    )
    counterexample = None
    try:
        if fail_answer is not None:
            counterexample = _counterexample(
                client, info, fail_answer, timeout, shrink, settings["limits"]
            )
    finally:
        stop.delete()
    seconds = time.perf_counter() - start
    report = FuzzReport(
        claim=ref,
        seed=settings["seed"],
        examples_requested=examples,
        examples_run=run,
        settings=settings,
        workers=nworkers,
        counts=counts,
        counterexample=counterexample,
        problems=tuple(problems),
        lost_workers=tuple(watch.lost),
        digest=digest,
        seconds=seconds,
    )
    if out is not None:
        report = _write(report, Path(out))
    return report


def _lost(first: int, last: int, why: str, chunk: int) -> dict[str, Any]:
    return {
        "chunk": chunk,
        "status": "lost",
        "message": f"examples {first}..{last} were not evaluated: {why}",
    }


def _tally(
    chunk_results: dict[int, dict],
    lost_chunks: list[tuple[int, str]],
    first_fail: int | None,
    examples: int,
) -> tuple[dict[str, int], list[dict], int, str, dict | None]:
    """Counts, problems, examples run, digest and the failing answer, from the chunks.

    Every example the campaign needs (all of them, or those up to the first
    failure) is accounted for: evaluated, or counted as ``lost`` -- in a chunk
    whose task failed, or missing from a chunk that returned fewer results
    than it drew.
    """
    counts = dict.fromkeys(STATUSES, 0)
    problems: list[dict] = []
    lost_problems: list[dict] = []
    digest = hashlib.sha256()
    run = 0
    fail_answer = None
    last_needed = examples - 1 if first_fail is None else first_fail
    for c in sorted(chunk_results):
        res = chunk_results[c]
        if first_fail is not None and c * CHUNK > first_fail:
            continue  # not needed, and cut short at a moment that depends on timing
        digest.update(res["digest"].encode())
        seen: set[int] = set()
        for a in res["results"]:
            if first_fail is not None and a["index"] > first_fail:
                continue
            seen.add(a["index"])
            run += 1
            counts[a["status"]] += 1
            if a["index"] == first_fail:
                fail_answer = a
            elif a["status"] not in ("holds", "fails") and len(problems) < 50:
                problems.append(
                    {
                        k: a.get(k)
                        for k in ("index", "kind", "status", "exception", "message", "spec")
                        if k in a
                    }
                )
        wanted = range(c * CHUNK, min(c * CHUNK + res["drawn"], last_needed + 1))
        missing = [i for i in wanted if i not in seen]
        if missing:
            counts["lost"] += len(missing)
            lost_problems.append(
                _lost(
                    missing[0],
                    missing[-1],
                    f"{len(missing)} of them missing from the results of their task "
                    "(it stopped early)",
                    c,
                )
            )
    for c, why in lost_chunks:
        if c * CHUNK <= last_needed:
            n = min(CHUNK, last_needed + 1 - c * CHUNK)
            counts["lost"] += n
            lost_problems.append(
                _lost(c * CHUNK, c * CHUNK + n - 1, f"their task failed ({why})", c)
            )
    return counts, lost_problems + problems, run, digest.hexdigest(), fail_answer


def shrink_accepts(candidate_answer: dict, current_answer: dict) -> bool:
    """Whether shrinking moves to a candidate: the claim fails on it, and its algebra
    is of dimension at most that of the current one (the candidates are already
    smaller in :func:`hwcat.campaigns.shrink.size_key`), so the shrunk algebra is
    never larger than the one drawn.

    >>> shrink_accepts({"status": "fails", "dimension": 3}, {"dimension": 3})
    True
    >>> shrink_accepts({"status": "fails", "dimension": 5}, {"dimension": 3})
    False
    >>> shrink_accepts({"status": "holds", "dimension": 1}, {"dimension": 3})
    False
    """
    if candidate_answer.get("status") != "fails":
        return False
    dim, bound = candidate_answer.get("dimension"), current_answer.get("dimension")
    return isinstance(dim, int) and (bound is None or dim <= bound)


def _counterexample(client, info, answer, timeout, shrink, limits=None) -> dict[str, Any]:
    from hwcat.algebras.families.quivers import spec_to_toml
    from hwcat.campaigns.shrink import candidates
    from hwcat.campaigns.worker import evaluate_specs

    spec = tomllib.loads(answer["spec"])
    current, current_answer, steps = spec, answer, 0
    while shrink and steps < 200:
        cands = candidates(current)
        if not cands:
            break
        texts = [spec_to_toml(c) for c in cands]
        futs = [
            client.submit(evaluate_specs, info, [(i, t)], timeout, limits, pure=False)
            for i, t in enumerate(texts)
        ]
        picked = None
        for i, fut in enumerate(futs):
            try:
                res = fut.result()
            except Exception:  # noqa: BLE001 -- a lost candidate is just not taken
                continue
            a = res["results"][0]
            if shrink_accepts(a, current_answer):
                picked = (i, a)
                break
        for fut in futs:
            fut.cancel()
        if picked is None:
            break
        current, current_answer = cands[picked[0]], picked[1]
        steps += 1
    shrunk = dict(current)
    shrunk["name"] = f"counterexample (shrunk) to {info['function']}"
    return {
        "index": answer["index"],
        "kind": answer.get("kind"),
        "outcome": _outcome(answer),
        "outcome_after_shrinking": _outcome(current_answer),
        "spec": answer["spec"],
        "shrunk_spec": spec_to_toml(shrunk),
        "shrink_steps": steps,
        "original_vertices": len(spec["quiver"]["vertices"]),
        "shrunk_vertices": len(current["quiver"]["vertices"]),
        "original_dimension": answer.get("dimension"),
        "shrunk_dimension": current_answer.get("dimension"),
    }


def _write(report: FuzzReport, out: Path) -> FuzzReport:
    try:
        out.mkdir(parents=True, exist_ok=True)
        files: dict[str, str] = {}
        ce = report.counterexample
        if ce is not None:
            spec_path, orig_path = out / "counterexample.toml", out / "original.toml"
            spec_path.write_text(ce["shrunk_spec"], encoding="utf-8")
            orig_path.write_text(ce["spec"], encoding="utf-8")
            record = {
                "claim": report.claim,
                "seed": report.seed,
                "example_index": ce["index"],
                "kind": ce["kind"],
                "outcome": ce["outcome_after_shrinking"],
                "outcome_as_drawn": ce["outcome"],
                "spec": str(spec_path),
                "original_spec": str(orig_path),
                "shrink_steps": ce["shrink_steps"],
                "settings": report.settings,
            }
            rec_path = out / "counterexample.json"
            rec_path.write_text(json.dumps(record, indent=2) + "\n", encoding="utf-8")
            files = {
                "spec": str(spec_path),
                "original_spec": str(orig_path),
                "record": str(rec_path),
            }
        files["campaign"] = str(out / "campaign.json")
        final = FuzzReport(**{**report.__dict__, "files": files})
        (out / "campaign.json").write_text(
            json.dumps(final.to_dict(), indent=2) + "\n", encoding="utf-8"
        )
    except OSError as exc:
        raise CampaignError(f"--out {out}: cannot write: {exc.strerror or exc}") from None
    return final
