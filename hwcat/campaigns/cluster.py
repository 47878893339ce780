"""Connecting to Dask: a local cluster of worker processes, or an existing scheduler.

Dask is the optional extra ``cluster`` (``pip install 'hwcat[cluster]'``);
this is the only module that imports it, and only when a campaign starts.
"""

from __future__ import annotations

import contextlib
import logging
from collections.abc import Iterator
from typing import Any

from hwcat.errors import CampaignError, MissingExtra

__all__ = ["require_dask", "open_client", "WorkerWatch", "INSTALL_HINT"]

INSTALL_HINT = "pip install 'hwcat[cluster]'"


def require_dask() -> Any:
    """Import :mod:`distributed` or raise :class:`MissingExtra` saying how to install it."""
    try:
        import distributed
    except ImportError:
        raise MissingExtra(
            f"campaigns need Dask's distributed scheduler, which is not installed: {INSTALL_HINT}"
        ) from None
    return distributed


@contextlib.contextmanager
def open_client(workers: int | None = None, scheduler: str | None = None) -> Iterator[Any]:
    """A Dask client: on a new local cluster of ``workers`` processes, or at ``scheduler``.

    The local cluster has one thread per worker process (the mathematics is
    pure Python and holds the interpreter lock), no dashboard, and is closed on
    exit, taking its worker processes and their evaluating processes with it.
    """
    distributed = require_dask()
    if scheduler is not None and workers is not None:
        raise CampaignError("give either --workers or --scheduler, not both")
    if scheduler is not None:
        try:
            client = distributed.Client(scheduler, timeout=10)
        except (OSError, TimeoutError) as exc:
            raise CampaignError(f"--scheduler {scheduler}: cannot connect: {exc}") from None
        try:
            yield client
        finally:
            from hwcat.campaigns.worker import close_evaluators

            with contextlib.suppress(Exception):
                client.run(close_evaluators)
            client.close()
        return
    n = 2 if workers is None else workers
    if isinstance(n, bool) or not isinstance(n, int) or n < 1:
        raise CampaignError(f"--workers {n!r}: must be a positive integer")
    cluster = distributed.LocalCluster(
        n_workers=n,
        threads_per_worker=1,
        processes=True,
        dashboard_address=None,
        silence_logs=logging.CRITICAL,
    )
    client = distributed.Client(cluster)
    try:
        yield client
    finally:
        from hwcat.campaigns.worker import close_evaluators

        with contextlib.suppress(Exception):
            client.run(close_evaluators)
        client.close()
        cluster.close()


class WorkerWatch:
    """Notices workers that leave the scheduler while a campaign runs (a lost worker).

    The scheduler reschedules the tasks of a lost worker by itself; this only
    records which workers went away, so that the report can say so.
    """

    def __init__(self, client: Any) -> None:
        self.client = client
        self.seen: set[str] = set(self._current())
        self.lost: list[str] = []

    def _current(self) -> list[str]:
        try:
            return list(self.client.scheduler_info(n_workers=-1)["workers"])
        except TypeError:  # older Dask without n_workers
            return list(self.client.scheduler_info()["workers"])

    def poll(self) -> list[str]:
        now = set(self._current())
        gone = sorted(self.seen - now)
        self.lost += [w for w in gone if w not in self.lost]
        self.seen = now
        return gone

    def worker_count(self) -> int:
        return len(self._current())
