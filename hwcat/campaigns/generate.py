"""Deterministic generation of random algebra specs for a fuzz campaign.

The driver draws every example here, from the campaign seed, with the
Hypothesis strategies of :mod:`hwcat.strategies`; workers only ever receive
the spec text.  Examples come in chunks of :data:`CHUNK` specs; chunk ``c``
is drawn by one Hypothesis run seeded with ``(seed, c)``, so example ``i`` is
the same whatever the number of workers and however the work is split.

Kinds of algebras (``kinds``; each example picks one kind uniformly):

``general``
    :func:`hwcat.strategies.bound_quiver_specs`: a random quiver on 1 to
    ``max_vertices`` vertices with up to ``2 * max_vertices`` arrows (loops,
    multiple arrows and oriented cycles allowed), up to 3 distinct random relations
    (zero relations, or combinations with random nonzero coefficients of up to
    4 parallel paths of length 2 to 3), and, in about half the examples,
    ``vanish_from_length``; cycles are otherwise cut by zero relations.
``acyclic``
    the same with a quiver without oriented cycles.
``nakayama``
    :func:`hwcat.strategies.linear_nakayama_specs`: ``1 -> 2 -> ... -> n``
    with random zero relations.
``commutative``
    an acyclic quiver (as for ``acyclic``) whose relations are up to 3
    commutativity relations ``p - q`` between parallel paths of the same
    length, 2 or 3.

The field is ``field`` when given, else drawn from
:data:`hwcat.strategies.DEFAULT_FIELDS`.  Within a chunk Hypothesis starts
from its simplest example (one vertex, no arrow) and does not repeat an
example; chunks are independent, and a chunk of a small space (Nakayama
algebras on at most 3 vertices over one field: 10 algebras) ends when the
space is exhausted, so a campaign may run fewer examples than asked.
"""

from __future__ import annotations

import warnings
from collections.abc import Sequence
from typing import Any

from hwcat.errors import CampaignError

__all__ = ["KINDS", "CHUNK", "spec_chunk", "check_kinds"]

KINDS = ("general", "acyclic", "nakayama", "commutative")
CHUNK = 50
"""Examples per Hypothesis run (fixed, so that example ``i`` does not depend on workers)."""

_MAX_PARALLEL = 12  # cap on the parallel paths listed per (source, target)


def check_kinds(kinds: Sequence[str]) -> tuple[str, ...]:
    """Validate kind names (comma-separated lists are split)."""
    out: list[str] = []
    for k in kinds:
        for part in str(k).split(","):
            part = part.strip()
            if not part:
                continue
            if part not in KINDS:
                raise CampaignError(f"--kind {part!r}: unknown kind (known: {', '.join(KINDS)})")
            if part not in out:
                out.append(part)
    if not out:
        raise CampaignError("--kind: no kind given")
    return tuple(out)


def _strategies():
    from hypothesis import strategies as st

    from hwcat import strategies as hs

    return st, hs


def _commutative_specs(max_vertices: int, field):
    st, hs = _strategies()

    @st.composite
    def build(draw):
        Q = draw(hs.quivers(1, max_vertices, 2 * max_vertices, acyclic=True))
        F = draw(field)
        parallel: dict[tuple[int, int, int], list[tuple[int, ...]]] = {}
        layer = [(i,) for i in range(len(Q.arrows))]
        for _ in range(2):
            nxt = []
            for p in layer:
                for i, a in enumerate(Q.arrows):
                    if a.source == Q.arrows[p[-1]].target:
                        q = p + (i,)
                        key = (Q.path_source(q), Q.path_target(q), len(q))
                        group = parallel.setdefault(key, [])
                        if len(group) < _MAX_PARALLEL:
                            group.append(q)
                            nxt.append(q)
            layer = nxt
        pairs = sorted(k for k, v in parallel.items() if len(v) >= 2)
        relations: list[str] = []
        if pairs:
            for _ in range(draw(st.integers(0, 3))):
                paths = parallel[draw(st.sampled_from(pairs))]
                i, j = draw(
                    st.lists(st.integers(0, len(paths) - 1), min_size=2, max_size=2, unique=True)
                )
                text = " - ".join("*".join(Q.arrows[k].name for k in paths[m]) for m in (i, j))
                if text not in relations:
                    relations.append(text)
        quiver: dict[str, Any] = {
            "vertices": list(Q.vertices),
            "arrows": [
                f"{a.name}: {Q.vertices[a.source]} -> {Q.vertices[a.target]}" for a in Q.arrows
            ],
        }
        if relations:
            quiver["relations"] = relations
        return {"name": "random commutative quiver algebra", "field": F.name, "quiver": quiver}

    return build()


def kind_strategy(kind: str, max_vertices: int, field: str | None):
    """The Hypothesis strategy of spec dicts for one kind."""
    st, hs = _strategies()
    from hwcat.exact import parse_field

    fld = hs.fields() if field is None else st.just(parse_field(field))
    if kind == "general":
        return hs.bound_quiver_specs(1, max_vertices, 2 * max_vertices, field=fld)
    if kind == "acyclic":
        return hs.bound_quiver_specs(1, max_vertices, 2 * max_vertices, field=fld, acyclic=True)
    if kind == "nakayama":
        return hs.linear_nakayama_specs(1, max_vertices, field=fld)
    if kind == "commutative":
        return _commutative_specs(max_vertices, fld)
    raise CampaignError(f"unknown kind {kind!r}")


def spec_chunk(
    seed: int, chunk: int, kinds: Sequence[str], max_vertices: int, field: str | None
) -> list[tuple[str, dict]]:
    """The specs of chunk ``chunk`` (``CHUNK`` of them or fewer): ``(kind, spec dict)`` pairs.

    >>> a = spec_chunk(1, 0, ["general"], 3, "QQ")
    >>> a == spec_chunk(1, 0, ["general"], 3, "QQ") and len(a) == CHUNK
    True
    >>> len(spec_chunk(1, 0, ["nakayama"], 3, "QQ"))     # a small space is exhausted early
    10
    >>> a[0][1]["quiver"]["vertices"]        # Hypothesis starts with its simplest example
    ['1']
    """
    from hypothesis import HealthCheck, Phase, given, settings
    from hypothesis import seed as hseed
    from hypothesis import strategies as st
    from hypothesis.errors import HypothesisDeprecationWarning

    strategies = [st.tuples(st.just(k), kind_strategy(k, max_vertices, field)) for k in kinds]
    drawn: list[tuple[str, dict]] = []

    @hseed(seed * 1_000_003 + chunk)
    @settings(
        max_examples=CHUNK,
        database=None,
        derandomize=False,
        deadline=None,
        phases=[Phase.generate],
        suppress_health_check=list(HealthCheck),
        print_blob=False,
    )
    @given(st.one_of(strategies))
    def collect(example):
        drawn.append(example)

    with warnings.catch_warnings():
        # other threads of a Dask worker use the random module while we draw
        warnings.simplefilter("ignore", HypothesisDeprecationWarning)
        collect()
    return drawn[:CHUNK]
