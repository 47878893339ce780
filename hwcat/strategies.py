"""Hypothesis strategies for quivers, bound quiver algebras and their modules.

These strategies draw small random inputs for property tests: quivers, bound
quiver algebras ``kQ/I`` with random relations (always finite dimensional),
linear Nakayama algebras and modules over a given algebra.  hwcat uses them
for its own tests; they are public so that users can fuzz their own
conjectures about algebras with them.  Hypothesis is a test dependency, so
this module is not imported by ``import hwcat``.

Every algebra strategy has a ``..._specs`` twin that draws the spec dict
(shaped like a parsed spec file, see ``specs/FORMAT.md``) from which the
algebra is built, so a failing example can be written out with
:func:`hwcat.algebras.families.quivers.spec_to_toml` and replayed from the
command line.

Arguments follow one naming scheme: ``min_vertices``, ``max_vertices``,
``max_arrows``, ``field``, ``acyclic``, ``max_relations``,
``max_path_length``.  A ``field`` argument is a field (``QQ``, ``GF(p)``), a
strategy drawing fields, or ``None`` for :func:`fields`.

Examples
--------
>>> from hypothesis import given, settings
>>> from hwcat.strategies import bound_quiver_algebras
>>> @settings(max_examples=5, deadline=None)
... @given(bound_quiver_algebras(max_vertices=3))
... def test_cartan_sums_to_dimension(A):
...     assert sum(map(sum, A.cartan())) == A.dim
>>> test_cartan_sums_to_dimension()
"""

from __future__ import annotations

from collections.abc import Sequence
from typing import Any

import networkx as nx
from hypothesis import strategies as st
from hypothesis.errors import InvalidArgument

from hwcat.algebras.hub.basic import BasicAlgebra
from hwcat.algebras.hub.quiver import Arrow, Path, Quiver, format_path, parse_relation
from hwcat.algebras.inputs.bound import bound_quiver_algebra
from hwcat.exact import GF, QQ, Field, Mat, parse_field
from hwcat.modules import Module, direct_sum, injective, projective, simple

__all__ = [
    "DEFAULT_FIELDS",
    "fields",
    "field_elements",
    "quivers",
    "bound_quiver_specs",
    "bound_quiver_algebras",
    "linear_nakayama_specs",
    "linear_nakayama_algebras",
    "algebra_from_spec",
    "modules",
]

DEFAULT_FIELDS: tuple[Field, ...] = (QQ, GF(2), GF(3), GF(101), GF(2**61 - 1))
"""The fields :func:`fields` draws from: QQ, small primes (2 and 3) and large ones."""

_MAX_PATHS_PER_BLOCK = 40  # cap on the candidate paths listed per (start, end, length)
_MAX_SHORT_PATHS = 150
"""``vanish_from_length`` is drawn so that at most this many paths are shorter than it.

This keeps the algebras small: relations that mix path lengths are divided out
with dense linear algebra on each projective, whose cost grows with the cube
of its dimension.
"""


# -- argument checks -----------------------------------------------------------------


def _check_int(value: Any, name: str, minimum: int) -> int:
    if isinstance(value, bool) or not isinstance(value, int):
        raise InvalidArgument(f"{name}={value!r} must be an integer")
    if value < minimum:
        raise InvalidArgument(f"{name}={value!r} must be at least {minimum}")
    return value


def _check_range(min_vertices: int, max_vertices: int) -> None:
    _check_int(min_vertices, "min_vertices", 1)
    _check_int(max_vertices, "max_vertices", 1)
    if min_vertices > max_vertices:
        raise InvalidArgument(
            f"min_vertices={min_vertices} is larger than max_vertices={max_vertices}"
        )


def _field_strategy(field: Field | st.SearchStrategy | None) -> st.SearchStrategy:
    if field is None:
        return fields()
    if isinstance(field, Field):
        return st.just(field)
    if isinstance(field, st.SearchStrategy):
        return field
    raise InvalidArgument(f"field={field!r} must be a Field, a strategy of fields or None")


# -- fields and elements ----------------------------------------------------------------


def fields(choices: Sequence[Field] = DEFAULT_FIELDS) -> st.SearchStrategy[Field]:
    """Draw one of ``choices`` (by default :data:`DEFAULT_FIELDS`).

    >>> from hypothesis import find
    >>> find(fields(), lambda F: F.characteristic == 2)
    GF(2)
    """
    choices = tuple(choices)
    if not choices or not all(isinstance(F, Field) for F in choices):
        raise InvalidArgument(f"choices={choices!r} must be a nonempty sequence of fields")
    return st.sampled_from(choices)


def field_elements(field: Field, *, nonzero: bool = False) -> st.SearchStrategy[Any]:
    """Elements of ``field``: small fractions over QQ, any residue over GF(p), and over
    an extension field small coefficients of the powers of its generator.

    >>> from hypothesis import find
    >>> find(field_elements(QQ, nonzero=True), lambda x: x < 0)
    -1
    """
    d = getattr(field, "degree", 1)
    if d > 1:  # an extension field: independent coefficients of 1, t, ..., t^(d-1)
        p = field.characteristic
        coef = st.integers(0, p - 1) if p else st.integers(-3, 3)
        elts = st.lists(coef, min_size=d, max_size=d).map(field.from_coeffs)
        return elts.filter(bool) if nonzero else elts
    if field.characteristic == 0:
        nums = st.sampled_from((1, -1, 2, -2, 3, -3, 4, 5)) if nonzero else st.integers(-5, 5)
        return st.builds(lambda a, b: field.parse(f"{a}/{b}"), nums, st.integers(1, 4))
    p = field.characteristic
    low = 1 if nonzero else 0
    return st.integers(low, p - 1).map(field)


# -- quivers ---------------------------------------------------------------------------


def _has_cycle(n: int, arrows: Sequence[tuple[int, int]]) -> bool:
    G = nx.DiGraph()
    G.add_nodes_from(range(n))
    G.add_edges_from(arrows)
    return not nx.is_directed_acyclic_graph(G)


@st.composite
def _quiver_pairs(
    draw: st.DrawFn,
    min_vertices: int,
    max_vertices: int,
    max_arrows: int,
    acyclic: bool | None,
    loops: bool,
) -> tuple[int, list[tuple[int, int]]]:
    low = min_vertices
    if acyclic is False and not loops:
        low = max(low, 2)
    n = draw(st.integers(low, max_vertices))
    arrows: list[tuple[int, int]] = []
    if acyclic is False:
        k = draw(st.integers(1 if loops else 2, min(n, max_arrows)))
        cycle = draw(st.permutations(range(n)))[:k]
        arrows += [(cycle[i], cycle[(i + 1) % k]) for i in range(k)]
    if acyclic:
        rank = draw(st.permutations(range(n)))
        pairs = [(s, t) for s in range(n) for t in range(n) if rank[s] < rank[t]]
    else:
        pairs = [(s, t) for s in range(n) for t in range(n) if loops or s != t]
    room = max_arrows - len(arrows)
    if pairs and room > 0:
        arrows += draw(st.lists(st.sampled_from(pairs), max_size=room))
    return n, arrows


def _make_quiver(n: int, pairs: Sequence[tuple[int, int]]) -> Quiver:
    vertices = tuple(str(v + 1) for v in range(n))
    return Quiver(vertices, tuple(Arrow(f"a{i + 1}", s, t) for i, (s, t) in enumerate(pairs)))


def quivers(
    min_vertices: int = 1,
    max_vertices: int = 4,
    max_arrows: int = 6,
    *,
    acyclic: bool | None = None,
    loops: bool = True,
) -> st.SearchStrategy[Quiver]:
    """Random finite quivers with vertices ``"1", "2", ...`` and arrows ``"a1", "a2", ...``.

    Parameters
    ----------
    min_vertices, max_vertices : int
        Bounds on the number of vertices (at least 1).
    max_arrows : int
        Bound on the number of arrows; multiple arrows are allowed.
    acyclic : bool or None
        ``True``: no oriented cycle (arrows follow a random total order of the
        vertices); ``False``: at least one oriented cycle; ``None``: either.
    loops : bool
        Whether loops (arrows ``v -> v``) may occur.

    Examples
    --------
    >>> from hypothesis import find
    >>> Q = find(quivers(acyclic=False, loops=False), lambda Q: True)
    >>> len(Q.vertices) >= 2 and len(Q.arrows) >= 2
    True
    """
    _check_range(min_vertices, max_vertices)
    _check_int(max_arrows, "max_arrows", 0)
    if acyclic is False and max_arrows < (1 if loops else 2):
        raise InvalidArgument("acyclic=False needs room for a cycle: raise max_arrows")
    if acyclic is False and not loops and max_vertices < 2:
        raise InvalidArgument("acyclic=False with loops=False needs max_vertices >= 2")
    return _quiver_pairs(min_vertices, max_vertices, max_arrows, acyclic, loops).map(
        lambda data: _make_quiver(*data)
    )


# -- paths and relations -------------------------------------------------------------------


def _paths_by_block(Q: Quiver, max_length: int) -> dict[tuple[int, int, int], list[Path]]:
    """Paths of length 2..max_length, grouped by (start, end, length); capped per group."""
    out_arrows: dict[int, list[int]] = {}
    for i, a in enumerate(Q.arrows):
        out_arrows.setdefault(a.source, []).append(i)
    blocks: dict[tuple[int, int, int], list[Path]] = {}
    layer: list[Path] = [(i,) for i in range(len(Q.arrows))]
    for length in range(2, max_length + 1):
        nxt: list[Path] = []
        for p in layer:
            for i in out_arrows.get(Q.path_target(p), []):
                q = p + (i,)
                key = (Q.path_source(q), Q.path_target(q), length)
                group = blocks.setdefault(key, [])
                if len(group) < _MAX_PATHS_PER_BLOCK:
                    group.append(q)
                    nxt.append(q)
        layer = nxt
    return blocks


def _count_paths_below(Q: Quiver, length: int) -> int:
    """The number of paths of length below ``length`` (trivial paths included)."""
    layer = [1] * len(Q.vertices)
    total = 0
    for _ in range(length):
        total += sum(layer)
        nxt = [0] * len(Q.vertices)
        for a in Q.arrows:
            nxt[a.target] += layer[a.source]
        layer = nxt
    return total


def _relation_text(Q: Quiver, F: Field, terms: Sequence[tuple[Any, Path]]) -> str:
    parts = []
    for k, (c, p) in enumerate(terms):
        text = F.to_str(c)
        if getattr(F, "degree", 1) > 1 and " " in text:  # several terms: keep them together
            text = f"({text})"
        neg = text.startswith("-")
        mag = text[1:] if neg else text
        body = format_path(Q, p) if mag == "1" else f"{mag}*{format_path(Q, p)}"
        if k == 0:
            parts.append(f"-{body}" if neg else body)
        else:
            parts.append(f"- {body}" if neg else f"+ {body}")
    return " ".join(parts)


def _cut_relations(Q: Quiver, rank: Sequence[int]) -> list[Path]:
    """Zero relations ``b * f * b'`` (``b, b'`` backward arrows, ``f`` a forward path).

    An arrow is backward when it does not go up in ``rank``.  Every nonzero
    path then contains at most one backward arrow, so the algebra is finite
    dimensional.
    """
    forward = [i for i, a in enumerate(Q.arrows) if rank[a.source] < rank[a.target]]
    backward = [i for i, a in enumerate(Q.arrows) if rank[a.source] >= rank[a.target]]
    from_vertex: dict[int, list[Path]] = {}

    def forward_paths(v: int) -> list[Path]:
        if v not in from_vertex:
            paths: list[Path] = [()]
            for i in forward:
                if Q.arrows[i].source == v:
                    paths += [(i,) + p for p in forward_paths(Q.arrows[i].target)]
            from_vertex[v] = paths
        return from_vertex[v]

    rels = []
    for b in backward:
        for f in forward_paths(Q.arrows[b].target):
            end = Q.path_target((b,) + f)
            rels += [(b,) + f + (c,) for c in backward if Q.arrows[c].source == end]
    return rels


@st.composite
def _random_relations(
    draw: st.DrawFn,
    Q: Quiver,
    F: Field,
    max_relations: int,
    max_path_length: int,
    mixed: bool,
) -> list[str]:
    blocks = _paths_by_block(Q, max_path_length)
    if not blocks or max_relations == 0:
        return []
    keys = sorted(blocks)
    count = draw(st.integers(0, max_relations))
    texts = []
    for _ in range(count):
        s, t, length = draw(st.sampled_from(keys))
        if draw(st.booleans()):  # a zero relation (one path)
            texts.append(format_path(Q, draw(st.sampled_from(blocks[(s, t, length)]))))
            continue
        if mixed:
            candidates = [p for (s2, t2, _), ps in blocks.items() if (s2, t2) == (s, t) for p in ps]
        else:
            candidates = blocks[(s, t, length)]
        paths = draw(st.lists(st.sampled_from(candidates), min_size=1, max_size=4, unique=True))
        coeffs = [draw(field_elements(F, nonzero=True)) for _ in paths]
        texts.append(_relation_text(Q, F, list(zip(coeffs, paths, strict=True))))
    return texts


@st.composite
def _bound_quiver_specs(
    draw: st.DrawFn,
    min_vertices: int,
    max_vertices: int,
    max_arrows: int,
    field: st.SearchStrategy,
    acyclic: bool | None,
    loops: bool,
    max_relations: int,
    max_path_length: int,
    vanish_from_length: bool | None,
    finite: bool,
) -> dict:
    n, pairs = draw(_quiver_pairs(min_vertices, max_vertices, max_arrows, acyclic, loops))
    Q = _make_quiver(n, pairs)
    F = draw(field)
    cyclic = _has_cycle(n, pairs)
    use_bound = vanish_from_length
    if use_bound is None:
        use_bound = draw(st.booleans())
    relations: list[str] = []
    if cyclic and not use_bound and finite:
        rank = draw(st.permutations(range(n)))
        relations += [format_path(Q, p) for p in _cut_relations(Q, rank)]
    relations += draw(_random_relations(Q, F, max_relations, max_path_length, use_bound))
    relations = list(dict.fromkeys(relations))  # a relation drawn twice is written once
    quiver: dict[str, Any] = {
        "vertices": list(Q.vertices),
        "arrows": [f"{a.name}: {Q.vertices[a.source]} -> {Q.vertices[a.target]}" for a in Q.arrows],
    }
    if relations:
        quiver["relations"] = relations
    if use_bound:
        top = 2
        while top < max_path_length + 2 and _count_paths_below(Q, top + 1) <= _MAX_SHORT_PATHS:
            top += 1
        quiver["vanish_from_length"] = draw(st.integers(2, top))
    return {"name": "random bound quiver algebra", "field": F.name, "quiver": quiver}


def bound_quiver_specs(
    min_vertices: int = 1,
    max_vertices: int = 4,
    max_arrows: int = 6,
    *,
    field: Field | st.SearchStrategy | None = None,
    acyclic: bool | None = None,
    loops: bool = True,
    max_relations: int = 3,
    max_path_length: int = 3,
    vanish_from_length: bool | None = None,
    finite: bool = True,
) -> st.SearchStrategy[dict]:
    """Spec dicts of random bound quiver algebras, finite dimensional by default.

    The quiver is drawn by :func:`quivers`.  Up to ``max_relations`` random
    relations are added, each either a zero relation (one path) or a random
    combination, with nonzero coefficients, of parallel paths of length 2 to
    ``max_path_length``.  Finite dimension is guaranteed either by
    ``vanish_from_length`` (then a combination may mix path lengths) or, for
    a quiver with oriented cycles, by zero relations ``b*f*b'`` that allow at
    most one arrow going down in a random order of the vertices on each
    nonzero path.

    Parameters
    ----------
    vanish_from_length : bool or None
        ``True``: always give ``vanish_from_length`` (a random value from 2 to
        ``max_path_length + 2``, lowered when the quiver has many short paths);
        ``False``: never; ``None``: either.
    finite : bool
        ``False`` leaves out the zero relations that cut the cycles, so a spec
        without ``vanish_from_length`` may describe an infinite-dimensional
        algebra (building it then raises
        :class:`~hwcat.errors.NotFiniteDimensional`): for fuzzing that check.

    Returns
    -------
    SearchStrategy of dict
        ``{"name", "field", "quiver": {"vertices", "arrows", "relations",
        "vanish_from_length"}}`` (the last two only when present), the shape
        of a parsed spec file.

    Examples
    --------
    >>> from hypothesis import find
    >>> spec = find(bound_quiver_specs(acyclic=False, vanish_from_length=False),
    ...             lambda s: True)
    >>> "relations" in spec["quiver"]      # the cycles are cut by zero relations
    True
    """
    _check_range(min_vertices, max_vertices)
    _check_int(max_arrows, "max_arrows", 0)
    _check_int(max_relations, "max_relations", 0)
    _check_int(max_path_length, "max_path_length", 2)
    if acyclic is False and max_arrows < (1 if loops else 2):
        raise InvalidArgument("acyclic=False needs room for a cycle: raise max_arrows")
    if acyclic is False and not loops and max_vertices < 2:
        raise InvalidArgument("acyclic=False with loops=False needs max_vertices >= 2")
    if vanish_from_length not in (None, True, False):
        raise InvalidArgument(f"vanish_from_length={vanish_from_length!r} must be a bool or None")
    return _bound_quiver_specs(
        min_vertices,
        max_vertices,
        max_arrows,
        _field_strategy(field),
        acyclic,
        loops,
        max_relations,
        max_path_length,
        vanish_from_length,
        bool(finite),
    )


def algebra_from_spec(spec: dict) -> BasicAlgebra:
    """Build the :class:`BasicAlgebra` of a spec dict with a ``quiver`` table.

    >>> algebra_from_spec({"field": "QQ", "quiver": {"vertices": ["1"], "arrows": ["x: 1 -> 1"],
    ...                    "vanish_from_length": 3}}).dim
    3
    """
    F = parse_field(spec["field"])
    tab = spec["quiver"]
    Q = Quiver.from_text(tab["vertices"], tab.get("arrows", []))
    texts = list(tab.get("relations", []))
    rels = [parse_relation(r, Q, F) for r in texts]
    return bound_quiver_algebra(
        F,
        Q,
        rels,
        tab.get("vanish_from_length"),
        name=spec.get("name", ""),
        relation_texts=texts,
    )


def bound_quiver_algebras(
    min_vertices: int = 1,
    max_vertices: int = 4,
    max_arrows: int = 6,
    *,
    field: Field | st.SearchStrategy | None = None,
    acyclic: bool | None = None,
    loops: bool = True,
    max_relations: int = 3,
    max_path_length: int = 3,
    vanish_from_length: bool | None = None,
) -> st.SearchStrategy[BasicAlgebra]:
    """Random finite-dimensional bound quiver algebras, as :class:`BasicAlgebra`.

    The algebras of :func:`bound_quiver_specs` (same arguments), built with
    :func:`hwcat.algebras.inputs.bound.bound_quiver_algebra`.

    Examples
    --------
    >>> from hypothesis import find
    >>> A = find(bound_quiver_algebras(field=GF(2), acyclic=False), lambda A: A.dim > 4)
    >>> A.field
    GF(2)
    """
    return bound_quiver_specs(
        min_vertices,
        max_vertices,
        max_arrows,
        field=field,
        acyclic=acyclic,
        loops=loops,
        max_relations=max_relations,
        max_path_length=max_path_length,
        vanish_from_length=vanish_from_length,
    ).map(algebra_from_spec)


# -- linear Nakayama algebras ------------------------------------------------------------------


@st.composite
def _linear_nakayama_specs(
    draw: st.DrawFn, min_vertices: int, max_vertices: int, field: st.SearchStrategy, bound: bool
) -> dict:
    n = draw(st.integers(min_vertices, max_vertices))
    F = draw(field)
    intervals = [(i, j) for i in range(1, n) for j in range(i + 1, n)]  # a_i * ... * a_j
    chosen = (
        draw(st.lists(st.sampled_from(intervals), unique=True, max_size=n)) if intervals else []
    )
    quiver: dict[str, Any] = {
        "vertices": [str(i) for i in range(1, n + 1)],
        "arrows": [f"a{i}: {i} -> {i + 1}" for i in range(1, n)],
    }
    if chosen:
        quiver["relations"] = ["*".join(f"a{k}" for k in range(i, j + 1)) for i, j in chosen]
    if bound and draw(st.booleans()):
        quiver["vanish_from_length"] = draw(st.integers(2, max(2, n)))
    return {"name": f"linear Nakayama algebra on A_{n}", "field": F.name, "quiver": quiver}


def linear_nakayama_specs(
    min_vertices: int = 1,
    max_vertices: int = 6,
    *,
    field: Field | st.SearchStrategy | None = None,
    vanish_from_length: bool = True,
) -> st.SearchStrategy[dict]:
    """Spec dicts of the quiver ``1 -> 2 -> ... -> n`` with random zero relations.

    Arrow ``a_i: i -> i+1``; each relation is a path ``a_i*a_(i+1)*...*a_j``
    of length at least 2.  With ``vanish_from_length=True`` some examples also
    carry a random ``vanish_from_length``.  The algebras are the connected
    Nakayama algebras with a linear quiver.

    >>> from hypothesis import find
    >>> spec = find(linear_nakayama_specs(min_vertices=3), lambda s: "relations" in s["quiver"])
    >>> spec["quiver"]["relations"]
    ['a1*a2']
    """
    _check_range(min_vertices, max_vertices)
    return _linear_nakayama_specs(
        min_vertices, max_vertices, _field_strategy(field), bool(vanish_from_length)
    )


def linear_nakayama_algebras(
    min_vertices: int = 1,
    max_vertices: int = 6,
    *,
    field: Field | st.SearchStrategy | None = None,
    vanish_from_length: bool = True,
) -> st.SearchStrategy[BasicAlgebra]:
    """The algebras of :func:`linear_nakayama_specs` (same arguments).

    >>> from hypothesis import find
    >>> find(linear_nakayama_algebras(min_vertices=4), lambda A: True).dim     # path algebra
    10
    """
    return linear_nakayama_specs(
        min_vertices, max_vertices, field=field, vanish_from_length=vanish_from_length
    ).map(algebra_from_spec)


# -- modules --------------------------------------------------------------------------------------


@st.composite
def _vectors_in(draw: st.DrawFn, M: Module, max_vectors: int) -> dict[int, Mat]:
    """Up to ``max_vectors`` random vectors, each at a random vertex where ``M`` is nonzero."""
    support = [v for v, d in enumerate(M.dims) if d]
    gens: dict[int, list[list[Any]]] = {}
    if not support:
        return {}
    for _ in range(draw(st.integers(1, max_vectors))):
        v = draw(st.sampled_from(support))
        vec = draw(st.lists(field_elements(M.field), min_size=M.dims[v], max_size=M.dims[v]))
        gens.setdefault(v, []).append(vec)
    return {v: Mat.from_rows(M.field, rows, M.dims[v]) for v, rows in gens.items()}


@st.composite
def _indecomposable_like(draw: st.DrawFn, A: BasicAlgebra, max_vectors: int) -> Module:
    kind = draw(st.sampled_from(("projective", "injective", "simple", "quotient", "submodule")))
    v = draw(st.integers(0, A.n - 1))
    if kind == "projective":
        return projective(A, v)
    if kind == "injective":
        return injective(A, v)
    if kind == "simple":
        return simple(A, v)
    if kind == "quotient":
        P = projective(A, v)
        U = P.generated(draw(_vectors_in(P, max_vectors)))
        return P.quotient(U, f"P({A.vertices[v]})/U")
    I = injective(A, v)
    U = I.generated(draw(_vectors_in(I, max_vectors)))
    return I.submodule(U, f"U < I({A.vertices[v]})")


def modules(
    algebra: BasicAlgebra, *, max_summands: int = 2, max_vectors: int = 2
) -> st.SearchStrategy[Module]:
    """Random modules over ``algebra``.

    Each summand is a projective ``P(i)``, an injective ``I(i)``, a simple
    ``L(i)``, a quotient of ``P(i)`` by the submodule generated by up to
    ``max_vectors`` random vectors, or the submodule of ``I(i)`` generated by
    such vectors; the module is the direct sum of 1 to ``max_summands``
    summands.  The zero module can occur (a quotient of ``P(i)`` by a
    generator of its top).

    To draw an algebra and then a module over it, use
    ``bound_quiver_algebras().flatmap(modules)`` or ``st.data()``.

    Examples
    --------
    >>> from hypothesis import find
    >>> from hwcat.modules import projective
    >>> A = algebra_from_spec({"field": "QQ", "quiver": {"vertices": ["1", "2"],
    ...                        "arrows": ["a: 1 -> 2"]}})
    >>> find(modules(A), lambda M: M.dims == (1, 1)).dims
    (1, 1)
    """
    if not isinstance(algebra, BasicAlgebra):
        raise InvalidArgument(f"algebra={algebra!r} must be a BasicAlgebra")
    if algebra.n == 0:
        raise InvalidArgument("the algebra has no vertices, so it has no nonzero modules")
    _check_int(max_summands, "max_summands", 1)
    _check_int(max_vectors, "max_vectors", 1)
    part = _indecomposable_like(algebra, max_vectors)
    return st.lists(part, min_size=1, max_size=max_summands).map(
        lambda ms: ms[0] if len(ms) == 1 else direct_sum(*ms)
    )
