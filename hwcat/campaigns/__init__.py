"""Campaigns: fuzzing claims on random algebras, and surveys of families, on Dask.

This room sits beside the stack: it uses hwcat's public layers and Dask's
distributed scheduler, which is the optional extra ``cluster``
(``pip install 'hwcat[cluster]'``).  ``import hwcat`` never imports it, and
this package imports Dask only when a campaign starts.

* :func:`fuzz` -- test a claim (``"FILE.py:FUNCTION"``) on random algebras,
  shrink the first counterexample and write it as a spec file;
  :mod:`hwcat.campaigns.fuzzing` describes the rules, and
  :mod:`hwcat.campaigns.generate` the distribution of the algebras.
* :func:`survey` -- one row per member of a built-in family over a parameter
  grid (:mod:`hwcat.campaigns.surveys`).

Workers receive spec text or family parameters and return plain data (JSON
shaped); each worker evaluates in a separate process that it kills when an
example runs past the time limit (:mod:`hwcat.campaigns.worker`).

Examples
--------
A notebook session (not run here: it starts worker processes)::

    from hwcat.campaigns import fuzz, survey
    report = fuzz("claims.py:ringel_bound", examples=500, workers=2)
    report.summary(), report.counts
    table = survey("temperley-lieb", {"n": "2..8", "delta": "0,1"}, workers=2)
    table.rows[0]
"""

from __future__ import annotations

from hwcat.campaigns.fuzzing import FuzzReport, fuzz, load_claim
from hwcat.campaigns.surveys import SurveyTable, parse_grid, survey, write_csv

__all__ = ["fuzz", "FuzzReport", "load_claim", "survey", "SurveyTable", "parse_grid", "write_csv"]
