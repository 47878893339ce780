"""Quivers, paths and relations (as text and as data).

A path is a tuple of arrow indices read left to right: ``(a, b)`` walks ``a``
and then ``b`` (written ``a*b``).  A relation is a dict ``{path: coefficient}``
whose paths share their start and end vertex.
"""

from __future__ import annotations

import re
from dataclasses import dataclass
from typing import TYPE_CHECKING, Any

from hwcat.errors import CoefficientError, QuiverError, RelationError
from hwcat.exact import Field, coefficient_prefix, split_factors, split_signed_terms

if TYPE_CHECKING:
    import networkx as nx


__all__ = ["Arrow", "Quiver", "Path", "parse_arrow", "parse_relation", "format_path"]

Path = tuple[int, ...]

_NAME = r"[A-Za-z_][A-Za-z0-9_']*|\d+"
_NAME_RE = re.compile(rf"^(?:{_NAME})$")
_ARROW_RE = re.compile(rf"^\s*({_NAME})\s*:\s*({_NAME})\s*->\s*({_NAME})\s*$")
_NUMBER_RE = re.compile(r"^\d+(?:/\d+)?$")


@dataclass(frozen=True)
class Arrow:
    """An arrow ``name: source -> target`` (source and target are vertex indices)."""

    name: str
    source: int
    target: int


@dataclass(frozen=True)
class Quiver:
    """A finite quiver: named vertices and named arrows between them.

    >>> Q = Quiver.from_text(["1", "2"], ["a: 1 -> 2"])
    >>> Q.arrows[0]
    Arrow(name='a', source=0, target=1)
    """

    vertices: tuple[str, ...]
    arrows: tuple[Arrow, ...]

    @classmethod
    def from_text(cls, vertices: list, arrows: list) -> Quiver:
        names: list[str] = []
        seen: set[str] = set()
        if not vertices:
            raise QuiverError("the quiver has no vertices")
        for v in vertices:
            v = str(v).strip()
            if not _NAME_RE.match(v):
                raise QuiverError(f"vertex name {v!r} is not an identifier or an integer")
            if v in seen:
                raise QuiverError(f"vertex {v!r} is listed twice")
            seen.add(v)
            names.append(v)
        index = {v: i for i, v in enumerate(names)}
        arrs: list[Arrow] = []
        anames: set[str] = set()
        for pos, text in enumerate(arrows):
            try:
                name, s, t = parse_arrow(str(text))
            except QuiverError as exc:
                raise QuiverError(str(exc), arrow=pos) from None
            if name in anames:
                raise QuiverError(f"arrow {name!r} is listed twice", arrow=pos)
            for end in (s, t):
                if end not in index:
                    raise QuiverError(f"arrow {text!r}: {end!r} is not a vertex", arrow=pos)
            anames.add(name)
            arrs.append(Arrow(name, index[s], index[t]))
        return cls(tuple(names), tuple(arrs))

    @property
    def arrow_index(self) -> dict[str, int]:
        return {a.name: i for i, a in enumerate(self.arrows)}

    def graph(self) -> nx.MultiDiGraph:
        """The quiver as a networkx multigraph on vertex indices."""
        import networkx as nx

        G = nx.MultiDiGraph()
        G.add_nodes_from(range(len(self.vertices)))
        for i, a in enumerate(self.arrows):
            G.add_edge(a.source, a.target, key=i)
        return G

    def strongly_connected_components(self) -> list[frozenset[int]]:
        """The strongly connected components of the quiver (vertex indices).

        Tarjan's algorithm with an explicit stack, so no recursion depth depends
        on the quiver (common practice); kept here rather than importing a graph
        library on the path of every build.
        """
        n = len(self.vertices)
        succ: list[list[int]] = [[] for _ in range(n)]
        for a in self.arrows:
            succ[a.source].append(a.target)
        index = [-1] * n
        low = [0] * n
        on_stack = [False] * n
        stack: list[int] = []
        comps: list[frozenset[int]] = []
        counter = 0
        for root in range(n):
            if index[root] >= 0:
                continue
            work = [(root, 0)]
            while work:
                v, i = work[-1]
                if i == 0:
                    index[v] = low[v] = counter
                    counter += 1
                    stack.append(v)
                    on_stack[v] = True
                if i < len(succ[v]):
                    work[-1] = (v, i + 1)
                    w = succ[v][i]
                    if index[w] < 0:
                        work.append((w, 0))
                    elif on_stack[w]:
                        low[v] = min(low[v], index[w])
                    continue
                work.pop()
                if work:
                    u = work[-1][0]
                    low[u] = min(low[u], low[v])
                if low[v] == index[v]:
                    comp = []
                    while True:
                        w = stack.pop()
                        on_stack[w] = False
                        comp.append(w)
                        if w == v:
                            break
                    comps.append(frozenset(comp))
        return comps

    def is_acyclic(self) -> bool:
        """Whether the quiver has no oriented cycle (no loop, every strongly connected
        component a single vertex).

        >>> Quiver.from_text(["1", "2"], ["a: 1 -> 2"]).is_acyclic()
        True
        >>> Quiver.from_text(["1", "2"], ["a: 1 -> 2", "b: 2 -> 1"]).is_acyclic()
        False
        """
        if any(a.source == a.target for a in self.arrows):
            return False
        return all(len(c) == 1 for c in self.strongly_connected_components())

    def path_source(self, p: Path) -> int:
        return self.arrows[p[0]].source

    def path_target(self, p: Path) -> int:
        return self.arrows[p[-1]].target


def parse_arrow(text: str) -> tuple[str, str, str]:
    """Read ``"a: 1 -> 2"`` into ``("a", "1", "2")``."""
    m = _ARROW_RE.match(text)
    if not m:
        raise QuiverError(f'arrow {text!r} is not of the form "name: source -> target"')
    return m.group(1), m.group(2), m.group(3)


def format_path(quiver: Quiver, path: Path, vertex: int | None = None) -> str:
    """Text form of a path; the trivial path at a vertex is ``e_<vertex>``."""
    if not path:
        return f"e_{quiver.vertices[vertex]}" if vertex is not None else "e"
    return "*".join(quiver.arrows[i].name for i in path)


def _split_terms(text: str) -> list[tuple[int, str]]:
    terms, dangling = split_signed_terms(text)
    if dangling:
        raise RelationError(f"relation {text!r} ends with a sign")
    return terms


def parse_relation(text: str, quiver: Quiver, field: Field) -> dict[Path, Any]:
    """Parse ``"a*b - 2*c*d"`` into ``{(ia, ib): 1, (ic, id): -2}`` over ``field``.

    Checks that every arrow exists, that each path composes, that all paths
    share start and end, and that every term has length at least two (the
    relation lies in the square of the arrow ideal).

    >>> from hwcat.exact import QQ
    >>> Q = Quiver.from_text(["1", "2", "3", "4"],
    ...     ["a: 1 -> 2", "b: 2 -> 4", "c: 1 -> 3", "d: 3 -> 4"])
    >>> sorted((p, str(c)) for p, c in parse_relation("a*b - 1/2*c*d", Q, QQ).items())
    [((0, 1), '1'), ((2, 3), '-1/2')]
    """
    if not isinstance(text, str):
        raise RelationError(f"relation {text!r} is not a string")
    aidx = quiver.arrow_index
    vset = set(quiver.vertices)
    terms = _split_terms(text)
    if not terms:
        raise RelationError(f"relation {text!r} is empty")
    out: dict[Path, Any] = {}
    ends: tuple[int, int] | None = None
    gen = getattr(field, "gen_name", None)
    if gen is not None and gen in aidx:
        raise RelationError(
            f"relation {text!r}: {gen!r} names both an arrow and the generator of {field}; "
            f'rename the generator (e.g. field = "{field.name.split(",")[0].rstrip(")")}, w)")'
        )
    for sign, term in terms:
        factors = split_factors(term)
        if any(f == "" for f in factors):
            raise RelationError(f"relation {text!r}: term {term!r} is malformed")
        coef = field.one
        if _NUMBER_RE.match(factors[0]) and len(factors) > 1 and factors[0] in aidx:
            names = set(aidx) - {factors[0]}  # a number before other factors is a coefficient
        else:
            names = aidx
        n_before = len(factors)
        try:
            coef, factors = coefficient_prefix(field, factors, names)
        except CoefficientError as exc:
            raise CoefficientError(f"relation {text!r}: {exc}") from None
        if len(factors) < n_before:
            if not factors:
                raise RelationError(
                    f"relation {text!r}: term {term!r} is a scalar; relations must lie in the "
                    "square of the arrow ideal"
                )
        path = []
        for f in factors:
            if f not in aidx:
                if f in vset or (f.startswith("e_") and f[2:] in vset):
                    raise RelationError(
                        f"relation {text!r}: term {term!r} is a trivial path (vertex); relations "
                        "must lie in the square of the arrow ideal"
                    )
                hint = f" (the generator of {field} is {gen!r})" if gen is not None else ""
                raise RelationError(f"relation {text!r}: {f!r} is not an arrow{hint}")
            path.append(aidx[f])
        for x, y in zip(path, path[1:], strict=False):
            if quiver.arrows[x].target != quiver.arrows[y].source:
                raise RelationError(
                    f"relation {text!r}: path {term!r} does not compose: arrow "
                    f"{quiver.arrows[x].name!r} ends at {quiver.vertices[quiver.arrows[x].target]!r}"
                    f" but {quiver.arrows[y].name!r} starts at "
                    f"{quiver.vertices[quiver.arrows[y].source]!r}"
                )
        if len(path) < 2:
            raise RelationError(
                f"relation {text!r}: term {term!r} is a single arrow; relations must lie in the "
                "square of the arrow ideal (an arrow that equals a combination of longer paths "
                "is not an arrow of the Gabriel quiver: remove it from the quiver instead)"
            )
        p = tuple(path)
        e = (quiver.path_source(p), quiver.path_target(p))
        if ends is None:
            ends = e
        elif e != ends:
            raise RelationError(
                f"relation {text!r}: its paths do not share start and end vertex "
                f"({quiver.vertices[ends[0]]} -> {quiver.vertices[ends[1]]} and "
                f"{quiver.vertices[e[0]]} -> {quiver.vertices[e[1]]})"
            )
        c = coef if sign > 0 else -coef
        out[p] = out.get(p, field.zero) + c
    out = {p: c for p, c in out.items() if c != 0}
    if not out:
        raise RelationError(f"relation {text!r} is zero")
    return out
