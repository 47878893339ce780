"""Making a counterexample smaller: quotients and deletions of a quiver spec.

Every move takes a format-1 quiver spec dict to a smaller one:

* keep a single vertex (the quotient by all the other vertices);
* delete one vertex (the quotient ``A/AeA``: its arrows go, and every term of
  a relation whose path passes through it is dropped);
* delete one arrow (the quotient by the arrow: relation terms through it are
  dropped);
* delete one relation, or one term of a relation (a larger algebra, which
  may be infinite dimensional: such a candidate simply does not build);
* lower ``vanish_from_length`` by one, or remove it.

Each move lowers the key ``(vertices, arrows, relation terms, relations,
vanish_from_length)`` in lexicographic order, so the greedy descent of
:func:`hwcat.campaigns.fuzzing.fuzz` (take the first candidate, in the order
listed by :func:`candidates`, on which the claim still fails; repeat) ends.
Since some moves (deleting a relation or a relation term, removing
``vanish_from_length``) may enlarge the algebra, the descent also requires that the
algebra's dimension does not grow
(:func:`hwcat.campaigns.fuzzing.shrink_accepts`): the shrunk algebra is never
of larger dimension than the one drawn.
Vertex and arrow names are kept, so the result reads against the original.
"""

from __future__ import annotations

import copy
from typing import Any

from hwcat.algebras.hub.quiver import Quiver, format_path, parse_relation
from hwcat.exact import parse_field

__all__ = ["candidates", "size_key"]


def _terms(spec: dict) -> tuple[Quiver, Any, list[list[tuple[Any, tuple[int, ...]]]]]:
    F = parse_field(spec["field"])
    tab = spec["quiver"]
    Q = Quiver.from_text(tab["vertices"], tab.get("arrows", []))
    rels = [sorted(parse_relation(r, Q, F).items()) for r in tab.get("relations", [])]
    return Q, F, [[(c, p) for p, c in r] for r in rels]


def _text(Q: Quiver, F: Any, terms: list[tuple[Any, tuple[int, ...]]]) -> str:
    parts = []
    for k, (c, p) in enumerate(terms):
        coeff = F.to_str(c)
        neg = coeff.startswith("-")
        mag = coeff[1:] if neg else coeff
        body = format_path(Q, p) if mag == "1" else f"{mag}*{format_path(Q, p)}"
        if k == 0:
            parts.append(f"-{body}" if neg else body)
        else:
            parts.append(f"- {body}" if neg else f"+ {body}")
    return " ".join(parts)


def size_key(spec: dict) -> tuple[int, int, int, int, int]:
    """``(vertices, arrows, relation terms, relations, vanish_from_length or 0)``."""
    _, _, rels = _terms(spec)
    tab = spec["quiver"]
    return (
        len(tab["vertices"]),
        len(tab.get("arrows", [])),
        sum(len(r) for r in rels),
        len(rels),
        tab.get("vanish_from_length") or 0,
    )


def _rebuild(
    spec: dict,
    Q: Quiver,
    F: Any,
    rels: list[list[tuple[Any, tuple[int, ...]]]],
    keep_vertices: set[int],
    keep_arrows: set[int],
) -> dict:
    """The spec on the kept vertices and arrows; relation terms through deleted arrows dropped."""
    out = copy.deepcopy(spec)
    tab = out["quiver"]
    arrows = [i for i in range(len(Q.arrows)) if i in keep_arrows]
    tab["vertices"] = [v for i, v in enumerate(Q.vertices) if i in keep_vertices]
    tab["arrows"] = [spec["quiver"]["arrows"][i] for i in arrows]
    texts = []
    for r in rels:
        kept = [(c, p) for c, p in r if all(i in keep_arrows for i in p)]
        if kept:
            text = _text(Q, F, kept)
            if text not in texts:
                texts.append(text)
    if texts:
        tab["relations"] = texts
    else:
        tab.pop("relations", None)
    if not tab["arrows"]:
        tab.pop("vanish_from_length", None)
    return out


def candidates(spec: dict) -> list[dict]:
    """The smaller specs to try, most drastic first (see the module notes).

    >>> spec = {"field": "QQ", "quiver": {"vertices": ["1", "2"],
    ...         "arrows": ["x: 1 -> 1", "a: 1 -> 2"], "relations": ["x*x", "x*a"]}}
    >>> [c["quiver"] for c in candidates(spec)][:2]
    [{'vertices': ['1'], 'arrows': ['x: 1 -> 1'], 'relations': ['x*x']}, {'vertices': ['2'], 'arrows': []}]
    """
    Q, F, rels = _terms(spec)
    tab = spec["quiver"]
    n, m = len(Q.vertices), len(Q.arrows)
    every_arrow = set(range(m))
    out: list[dict] = []

    def arrows_within(vs: set[int]) -> set[int]:
        return {i for i, a in enumerate(Q.arrows) if a.source in vs and a.target in vs}

    if n > 1:
        for v in range(n):
            out.append(_rebuild(spec, Q, F, rels, {v}, arrows_within({v})))
        for v in range(n):
            rest = set(range(n)) - {v}
            if len(rest) > 1:
                out.append(_rebuild(spec, Q, F, rels, rest, arrows_within(rest)))
    for i in range(m):
        out.append(_rebuild(spec, Q, F, rels, set(range(n)), every_arrow - {i}))
    for j in range(len(rels)):
        fewer = rels[:j] + rels[j + 1 :]
        out.append(_rebuild(spec, Q, F, fewer, set(range(n)), every_arrow))
    for j, r in enumerate(rels):
        if len(r) > 1:
            for k in range(len(r)):
                changed = rels[:j] + [r[:k] + r[k + 1 :]] + rels[j + 1 :]
                out.append(_rebuild(spec, Q, F, changed, set(range(n)), every_arrow))
    vanish = tab.get("vanish_from_length")
    if vanish is not None:
        if vanish > 2:
            lower = copy.deepcopy(spec)
            lower["quiver"]["vanish_from_length"] = vanish - 1
            out.append(lower)
        gone = copy.deepcopy(spec)
        del gone["quiver"]["vanish_from_length"]
        out.append(gone)
    key = size_key(spec)
    seen: set[str] = set()
    result = []
    for c in out:
        text = repr(c)
        if text not in seen and size_key(c) < key:
            seen.add(text)
            result.append(c)
    return result
