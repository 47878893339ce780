"""Progress of long computations, shown on standard error by the command line.

The mathematics announces its steps through :func:`task`; nothing is shown
unless a front end called :func:`enable` (the command line does so when
standard error is a terminal and ``--json`` is not given).  Without it a step
costs one attribute lookup, so library users and pipes see nothing.

>>> with task("projective resolutions", total=3) as step:
...     for _ in range(3):
...         step()
"""

from __future__ import annotations

import sys
from collections.abc import Callable, Iterator
from contextlib import contextmanager
from typing import Any, TextIO

__all__ = ["task", "enable", "disable", "enabled"]

_stream: TextIO | None = None
_delay = 1.0


def enable(stream: TextIO | None = None, *, delay: float = 1.0) -> None:
    """Show progress bars on ``stream`` (default standard error) for steps longer than ``delay`` s."""
    global _stream, _delay
    _stream = stream if stream is not None else sys.stderr
    _delay = delay


def disable() -> None:
    """Stop showing progress."""
    global _stream
    _stream = None


def enabled() -> bool:
    return _stream is not None


def _nothing(n: int = 1) -> None:
    return None


class _Silent:
    """The context of a step while nothing is shown: entering gives a function doing nothing."""

    __slots__ = ()

    def __enter__(self) -> Callable[[int], Any]:
        return _nothing

    def __exit__(self, *exc: object) -> None:
        return None


_SILENT = _Silent()


def task(description: str, total: int | None = None) -> Any:
    """A named step of work with ``total`` parts; the context gives ``advance(n=1)``.

    While progress is not shown this returns one shared context that does
    nothing (no generator is made: small searches announce steps often).
    """
    if _stream is None:
        return _SILENT
    return _shown(description, total)


@contextmanager
def _shown(description: str, total: int | None) -> Iterator[Callable[[int], Any]]:
    from tqdm import tqdm  # only when progress is shown

    bar = tqdm(
        total=total,
        desc=description,
        file=_stream,
        leave=False,
        delay=_delay,
        dynamic_ncols=True,
    )
    try:
        yield bar.update
    finally:
        bar.close()
