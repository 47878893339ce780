"""The evaluating process behind each campaign worker: ``python -m hwcat.campaigns.child``.

A worker keeps one such process and talks to it in JSON lines (one request
on standard input, one answer on standard output).  Before any claim runs,
the process moves its request and answer channels to private file
descriptors and points descriptors 0 and 1 at ``/dev/null`` and standard
error: whatever a claim writes to standard output (``print``, a subprocess it
starts, a C library) or reads from standard input cannot mix with the
protocol.  Each answer repeats the request's ``seq`` number, so the worker
can check that an answer belongs to its request.  The worker can kill it
when an example runs past the time limit and start a fresh one, which is how
a slow example becomes a timeout instead of stalling the campaign; a crash of
this process (a claim that exits or segfaults) is reported the same way.

Requests (``op``):

* ``define``: ``key``, ``source``, ``filename``, ``function`` -- compile a
  claim file and remember its function under ``key``;
* ``claim``: ``key``, ``spec`` (spec text) -- build the algebra and call the
  claim; the answer's ``status`` is ``holds``, ``fails`` (returned ``False``
  or raised ``AssertionError``), ``error`` (raised anything else) or
  ``invalid`` (the spec text does not give an algebra); with ``dimension``
  (of the algebra) whenever it was built;
* ``survey``: ``family``, ``params`` -- the row of one family member (see
  :func:`survey_row`).

Every request may carry ``limits`` (``max_dim``, ``max_vertices``,
``max_products``: see :mod:`hwcat.limits`), the limits in force for it.

Answers are plain data; nothing here is pickled.
"""

from __future__ import annotations

import json
import os
import sys
import threading
import time
import traceback
from typing import Any

__all__ = ["survey_row", "evaluate_claim", "main"]

_CLAIMS: dict[str, Any] = {}


def _define(req: dict) -> dict:
    directory = os.path.dirname(os.path.abspath(req["filename"]))
    if directory not in sys.path:
        sys.path.insert(0, directory)
    namespace: dict[str, Any] = {"__name__": "hwcat_claim", "__file__": req["filename"]}
    code = compile(req["source"], req["filename"], "exec")
    exec(code, namespace)  # the user's claim file: running it is the point
    fn = namespace.get(req["function"])
    if not callable(fn):
        return {
            "status": "error",
            "exception": "NameError",
            "message": f"{req['filename']} defines no function {req['function']!r}",
        }
    _CLAIMS[req["key"]] = fn
    return {"status": "ok"}


def _short(value: Any) -> str:
    text = repr(value)
    return text if len(text) <= 200 else text[:197] + "..."


def evaluate_claim(fn, spec_text: str) -> dict:
    """Build the algebra of ``spec_text`` and call ``fn`` on it; the answer as plain data."""
    from hwcat.errors import HwcatError
    from hwcat.io.spec import load_spec_text

    try:
        A = load_spec_text(spec_text, "<example>")
    except HwcatError as exc:
        return {"status": "invalid", "exception": type(exc).__name__, "message": str(exc)}
    try:
        value = fn(A)
    except AssertionError as exc:
        return {
            "status": "fails",
            "exception": type(exc).__name__,
            "message": str(exc),
            "traceback": traceback.format_exc(limit=-4),
            "dimension": A.dim,
        }
    except Exception as exc:  # noqa: BLE001 -- any other error is reported, not raised
        return {
            "status": "error",
            "exception": type(exc).__name__,
            "message": str(exc),
            "traceback": traceback.format_exc(limit=-4),
            "dimension": A.dim,
        }
    if value is False:
        return {"status": "fails", "returned": "False", "dimension": A.dim}
    return {"status": "holds", "returned": _short(value), "dimension": A.dim}


def survey_row(family: str, params: dict, seed: int = 0) -> dict:
    """Dimension, simples, quasi-heredity, structures and global dimension of one member.

    >>> r = survey_row("linear-a", {"n": "3"})
    >>> r["dimension"], r["simples"], r["quasi_hereditary"], r["structures"], r["global_dimension"]
    (6, 3, True, 5, '1')
    """
    from hwcat.algebras.families.registry import family_algebra
    from hwcat.theory.homological import global_dimension
    from hwcat.theory.search import quasi_hereditary_orders

    A = family_algebra(family, seed=seed, **params)
    r = quasi_hereditary_orders(A, list_limit=0)
    g = global_dimension(A)
    gv = g.json_value()
    text = f">= {gv['at_least']}" if isinstance(gv, dict) else str(gv)
    return {
        "dimension": A.dim,
        "simples": A.n,
        "quasi_hereditary": r.quasi_hereditary,
        "structures": r.structures,
        "global_dimension": text,
    }


def _handle(req: dict) -> dict:
    from hwcat.limits import resource_limits

    with resource_limits(**(req.get("limits") or {})):
        return _dispatch(req)


def _dispatch(req: dict) -> dict:
    op = req.get("op")
    if op == "define":
        return _define(req)
    if op == "claim":
        return evaluate_claim(_CLAIMS[req["key"]], req["spec"])
    if op == "survey":
        try:
            return {
                "status": "ok",
                "row": survey_row(req["family"], req["params"], req.get("seed", 0)),
            }
        except Exception as exc:  # noqa: BLE001 -- a failing member gets a row saying so
            return {"status": "error", "exception": type(exc).__name__, "message": str(exc)}
    if op == "ping":
        return {"status": "ok", "pid": os.getpid()}
    return {"status": "error", "exception": "ValueError", "message": f"unknown op {op!r}"}


def _watch_parent(parent: int) -> None:
    """Exit when the worker that started us has gone (no orphan keeps computing)."""
    while True:
        time.sleep(0.5)
        if os.getppid() != parent:
            os._exit(3)


def _private_channels() -> tuple[Any, Any]:
    """The request and answer streams, on descriptors of their own.

    Descriptor 0 then reads ``/dev/null`` and descriptor 1 writes to standard
    error, for this process and every process it starts; ``sys.stdout`` is
    standard error too.  So nothing a claim does to its standard streams
    reaches the worker's answer stream.
    """
    sys.stdout.flush()
    requests = os.fdopen(os.dup(0), "r", encoding="utf-8")
    answers = os.fdopen(os.dup(1), "w", encoding="utf-8")
    null = os.open(os.devnull, os.O_RDONLY)
    os.dup2(null, 0)
    os.close(null)
    os.dup2(2, 1)
    sys.stdin = open(os.devnull, encoding="utf-8")  # noqa: SIM115 -- for the process's life
    sys.stdout = sys.stderr
    return requests, answers


def main() -> None:
    import hwcat.io.spec  # noqa: F401 -- imported before the first request is timed
    import hwcat.limits  # noqa: F401
    import hwcat.theory.homological  # noqa: F401
    import hwcat.theory.search  # noqa: F401

    threading.Thread(target=_watch_parent, args=(os.getppid(),), daemon=True).start()
    requests, out = _private_channels()  # a claim that prints must not break the protocol
    for line in requests:
        if not line.strip():
            continue
        start = time.perf_counter()
        seq = None
        try:
            req = json.loads(line)
            seq = req.get("seq")
            answer = _handle(req)
        except Exception as exc:  # noqa: BLE001
            answer = {"status": "error", "exception": type(exc).__name__, "message": str(exc)}
        answer["seq"] = seq
        answer["seconds"] = round(time.perf_counter() - start, 6)
        try:
            out.write(json.dumps(answer) + "\n")
            out.flush()
        except BrokenPipeError:
            break


if __name__ == "__main__":  # pragma: no cover
    main()
