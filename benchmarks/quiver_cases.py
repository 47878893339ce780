"""Deterministic acyclic quivers for the order benchmarks (our own scenarios, fixed seeds)."""

from __future__ import annotations

import random


def acyclic_quiver(
    n: int, extra: int, seed: int, zero: int = 0, commuting: int = 0, sums: int = 0
) -> dict:
    """A connected acyclic quiver on ``n`` vertices: the path 1 -> 2 -> ... -> n plus
    ``extra`` arrows i -> j (i < j) drawn with ``seed``; ``zero`` relations ``a*b = 0``,
    ``commuting`` relations ``a*b - c*d`` between two paths of length 2 with the same ends,
    and ``sums`` relations ``a*b - c*d - e*f`` among three such paths (these make the
    arrows act on the basis paths by sums, not by single paths)."""
    rng = random.Random(seed)
    pairs = [(i, i + 1) for i in range(1, n)]
    while len(pairs) < n - 1 + extra:
        a, b = sorted(rng.sample(range(1, n + 1), 2))
        pairs.append((a, b))
    arrows = [f"a{k}: {a} -> {b}" for k, (a, b) in enumerate(pairs)]
    two = [(i, j) for i, p in enumerate(pairs) for j, q in enumerate(pairs) if p[1] == q[0]]
    rng.shuffle(two)
    rels: list[str] = []
    used: set[tuple[int, int]] = set()
    ends: dict[tuple[int, int], list[tuple[int, int]]] = {}
    for i, j in two:
        ends.setdefault((pairs[i][0], pairs[j][1]), []).append((i, j))
    for paths in ends.values():
        if sums and len(paths) >= 3 and sum(1 for r in rels if r.count("-") == 2) < sums:
            (i, j), (k, m), (x, y) = paths[:3]
            rels.append(f"a{i}*a{j} - a{k}*a{m} - a{x}*a{y}")
            used.update(paths[:3])
            continue
        if sum(1 for r in rels if r.count("-") == 1) >= commuting:
            continue
        if len(paths) >= 2:
            (i, j), (k, m) = paths[:2]
            rels.append(f"a{i}*a{j} - a{k}*a{m}")
            used.update(paths[:2])
    for i, j in two:
        if sum(1 for r in rels if "-" not in r) >= zero:
            break
        if (i, j) not in used:
            rels.append(f"a{i}*a{j}")
            used.add((i, j))
    quiver: dict = {"vertices": [str(i) for i in range(1, n + 1)], "arrows": arrows}
    if rels:
        quiver["relations"] = rels
    return {"name": f"acyclic quiver, {n} vertices", "field": "QQ", "quiver": quiver}


def cyclic_nakayama(n: int, vanish: int) -> dict:
    """The cyclic quiver on ``n`` vertices with paths of length ``vanish`` zero."""
    vs = [str(i) for i in range(1, n + 1)]
    arrows = [f"c{i}: {i} -> {i % n + 1}" for i in range(1, n + 1)]
    return {
        "name": f"cyclic Nakayama, {n} vertices",
        "field": "QQ",
        "quiver": {"vertices": vs, "arrows": arrows, "vanish_from_length": vanish},
    }
