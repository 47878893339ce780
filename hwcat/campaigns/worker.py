"""The functions Dask runs on the workers.  Arguments and results are plain data.

Each worker thread keeps one evaluating process (:mod:`hwcat.campaigns.child`)
and sends it one example at a time; when an example runs past the time limit
the process is killed and replaced, and the example is reported as a timeout.
An answer that cannot be read (not JSON, or not the answer to the request
just sent) is never passed on: the process is killed and replaced, and the
example is reported as crashed, so a later request never reads a stale answer.
"""

from __future__ import annotations

import hashlib
import json
import os
import select
import subprocess
import sys
import threading
import time

from hwcat.limits import current_limits

__all__ = ["Evaluator", "fuzz_chunk", "evaluate_specs", "survey_member", "close_evaluators"]

_STOP_INTERVAL = 0.25
_LOCAL = threading.local()
_ALL: list[Evaluator] = []
_ALL_LOCK = threading.Lock()


class Evaluator:
    """One evaluating process, restarted after a timeout or a crash."""

    def __init__(self) -> None:
        self.command = [sys.executable, "-m", "hwcat.campaigns.child"]
        self.proc: subprocess.Popen | None = None
        self.defined: set[str] = set()
        self._buffer = b""
        self._ready = False
        self._seq = 0

    def warm(self) -> None:
        """Start the process without waiting for it (it imports while we draw examples)."""
        if self.proc is None or self.proc.poll() is not None:
            self.stop()
            self.proc = subprocess.Popen(
                self.command,
                stdin=subprocess.PIPE,
                stdout=subprocess.PIPE,
                stderr=subprocess.DEVNULL,
            )
            self.defined = set()
            self._buffer = b""
            self._ready = False

    def _ensure(self) -> bool:
        """A running process that has finished its imports (so that they do not count
        against the first time limit)."""
        self.warm()
        if not self._ready:
            self._ready = True
            if self.request({"op": "ping"}, None).get("status") != "ok":
                self.stop()
        return self.proc is not None

    def stop(self) -> None:
        self._buffer = b""
        self._ready = False
        self.defined = set()
        if self.proc is not None:
            if self.proc.poll() is None:
                self.proc.kill()
            self.proc.wait()
            for stream in (self.proc.stdin, self.proc.stdout):
                try:
                    stream.close()
                except OSError:
                    pass
            self.proc = None

    def _readline(self, deadline: float | None) -> bytes | None:
        """One answer line, or None on timeout; b"" when the process ended."""
        fd = self.proc.stdout.fileno()
        while b"\n" not in self._buffer:
            wait = None if deadline is None else max(0.0, deadline - time.monotonic())
            ready, _, _ = select.select([fd], [], [], wait)
            if not ready:
                return None
            chunk = os.read(fd, 65536)
            if not chunk:
                return b""
            self._buffer += chunk
        line, self._buffer = self._buffer.split(b"\n", 1)
        return line

    def request(self, req: dict, timeout: float | None) -> dict:
        """Send one request; ``{"status": "timeout"}`` or ``{"status": "crashed"}`` on trouble.

        The request carries the resource limits in force here
        (:func:`hwcat.limits.current_limits`) unless it names its own.
        """
        if not self._ensure():
            return {"status": "crashed", "message": "the evaluating process did not start"}
        self._seq += 1
        seq = self._seq
        req = {"limits": current_limits().to_dict(), **req, "seq": seq}
        start = time.monotonic()
        try:
            self.proc.stdin.write((json.dumps(req) + "\n").encode())
            self.proc.stdin.flush()
        except BrokenPipeError:
            self.stop()
            return {"status": "crashed", "message": "the evaluating process ended"}
        try:
            line = self._readline(None if timeout is None else start + timeout)
        except (AttributeError, OSError, ValueError):  # stopped from another thread
            self.stop()
            return {"status": "crashed", "message": "the evaluating process was stopped"}
        if line is None:
            self.stop()
            return {"status": "timeout", "seconds": round(time.monotonic() - start, 3)}
        if not line:
            code = self.proc.wait()
            self.stop()
            return {"status": "crashed", "message": f"the evaluating process ended (code {code})"}
        try:
            answer = json.loads(line)
        except ValueError:
            answer = None
        if not isinstance(answer, dict) or answer.get("seq") != seq or "status" not in answer:
            self.stop()  # the stream is out of step: start afresh, never read on
            return {
                "status": "crashed",
                "message": "the evaluating process gave an answer that cannot be read "
                f"({_short_bytes(line)}); it was restarted",
            }
        del answer["seq"]
        return answer

    def claim(self, claim: dict, spec_text: str, timeout: float | None) -> dict:
        key = claim["key"]
        if key not in self.defined or self.proc is None or self.proc.poll() is not None:
            answer = self.request({"op": "define", **claim}, None)
            if answer.get("status") != "ok":
                return answer
            self.defined.add(key)
        return self.request({"op": "claim", "key": key, "spec": spec_text}, timeout)


def _short_bytes(line: bytes) -> str:
    text = repr(line)
    return text if len(text) <= 80 else text[:77] + "..."


def _evaluator() -> Evaluator:
    ev = getattr(_LOCAL, "evaluator", None)
    if ev is None:
        ev = _LOCAL.evaluator = Evaluator()
        with _ALL_LOCK:
            _ALL.append(ev)
    return ev


def close_evaluators() -> int:
    """Stop every evaluating process of this worker; returns how many were running.

    The evaluators stay registered to their threads and start a fresh process
    when next asked.
    """
    with _ALL_LOCK:
        evs = list(_ALL)
    running = 0
    for ev in evs:
        running += ev.proc is not None
        ev.stop()
    return running


def _where() -> str:
    try:
        from distributed import get_worker

        return get_worker().address
    except (ImportError, ValueError):
        return f"pid {os.getpid()}"


def _limits(limits: dict | None):
    """The resource limits sent by the driver, in force for a block (default ones if None)."""
    from hwcat.limits import resource_limits

    return resource_limits(**(limits or {}))


def evaluate_specs(
    claim: dict, items: list[tuple[int, str]], timeout: float | None, limits: dict | None = None
) -> dict:
    """Evaluate the claim on ``(index, spec text)`` items; per item a plain answer.

    The batch stops at the first failure: later items are not needed.
    ``limits`` are the resource limits of the campaign (:meth:`hwcat.limits.Limits.to_dict`).
    """
    ev = _evaluator()
    results = []
    with _limits(limits):
        for index, text in items:
            answer = ev.claim(claim, text, timeout)
            answer["index"] = index
            results.append(answer)
            if answer["status"] == "fails":
                break
    return {"results": results, "worker": _where()}


_STOP_READ_FAILURES = 5
"""Reads of the stop variable that may fail in a row before a chunk gives up (the
campaign is over: its variable is gone); the driver counts what is left as lost."""


def _stop_check(stop: str | None, variable=None):
    """A function ``index -> bool``: has the driver found a failure at or before ``index``?

    A read of the variable that fails (a slow scheduler, a dropped connection)
    means "go on", and is tried again later; only after
    :data:`_STOP_READ_FAILURES` failures in a row does the chunk stop.  A chunk
    that stops early returns fewer results than it drew, and the driver
    reports the examples left as lost.  ``variable`` replaces the Dask
    variable (for tests).
    """
    if stop is None and variable is None:
        return lambda index: False
    if variable is None:
        from distributed import Variable

        variable = Variable(stop)
    state = {"asked": 0.0, "value": None, "failures": 0}

    def check(index: int) -> bool:
        if state["failures"] >= _STOP_READ_FAILURES:
            return True
        # ask the scheduler at most every _STOP_INTERVAL seconds (a round trip each)
        now = time.monotonic()
        if now - state["asked"] >= _STOP_INTERVAL:
            state["asked"] = now
            try:
                value = variable.get(timeout=2)
            except Exception:  # noqa: BLE001 -- unknown: go on, ask again later
                state["failures"] += 1
                if state["failures"] >= _STOP_READ_FAILURES:
                    return True
            else:
                state["failures"] = 0
                state["value"] = value
        value = state["value"]
        return isinstance(value, int) and value <= index

    return check


def fuzz_chunk(
    claim: dict, settings: dict, chunk: int, timeout: float | None, stop: str | None = None
) -> dict:
    """Draw chunk ``chunk`` of the campaign and evaluate the claim on it.

    ``stop`` names a Dask variable holding the smallest failing index found
    so far; examples after it are not needed, so the chunk stops there.

    Returns per example ``index``, ``kind``, ``status`` (and details); the
    spec text only for failures and errors; the SHA-256 of all the chunk's
    spec texts (to check determinism); and the worker's address.
    """
    from hwcat.algebras.families.quivers import spec_to_toml
    from hwcat.campaigns.generate import CHUNK, spec_chunk

    ev = _evaluator()
    ev.warm()
    limits = settings.get("limits")
    specs = spec_chunk(
        settings["seed"], chunk, settings["kinds"], settings["max_vertices"], settings["field"]
    )
    start = chunk * CHUNK
    specs = specs[: max(0, settings["examples"] - start)]
    digest = hashlib.sha256()
    results = []
    stopped = _stop_check(stop)
    for offset, (kind, spec) in enumerate(specs):
        text = spec_to_toml(spec)
        digest.update(text.encode())
        if stopped(start + offset):
            break
        with _limits(limits):
            answer = ev.claim(claim, text, timeout)
        answer["index"] = start + offset
        answer["kind"] = kind
        if answer["status"] != "holds":
            answer["spec"] = text
        results.append(answer)
        if answer["status"] == "fails":
            break
    return {
        "results": results,
        "digest": digest.hexdigest(),
        "drawn": len(specs),
        "worker": _where(),
    }


def survey_member(
    family: str, params: dict, timeout: float | None, limits: dict | None = None
) -> dict:
    """The survey row of one family member, or its error, or a timeout.

    ``limits`` are the resource limits of the survey (:meth:`hwcat.limits.Limits.to_dict`).
    """
    with _limits(limits):
        return _evaluator().request({"op": "survey", "family": family, "params": params}, timeout)
