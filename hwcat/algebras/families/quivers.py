"""Built-in bound quiver algebras, as specs in hwcat's spec format 1.

Each function returns a plain ``dict`` shaped like a parsed spec file::

    {"name": ..., "field": "QQ",
     "quiver": {"vertices": [...], "arrows": ["a1: 1 -> 2", ...],
                "relations": [...], "vanish_from_length": N}}

(``relations`` and ``vanish_from_length`` only when present).  Paths are read
left to right: ``a*b`` walks ``a``, then ``b``.  :func:`spec_to_toml` writes
such a dict as TOML text.

Examples
--------
>>> spec = linear_A(3, vanish_from_length=2)
>>> spec["quiver"]["arrows"]
['a1: 1 -> 2', 'a2: 2 -> 3']
>>> print(spec_to_toml(spec), end="")
name = "linear A_3, paths of length >= 2 vanish"
field = "QQ"
<BLANKLINE>
[quiver]
vertices = ["1", "2", "3"]
arrows = ["a1: 1 -> 2", "a2: 2 -> 3"]
vanish_from_length = 2
"""

from __future__ import annotations

import re
from typing import Any

from hwcat.algebras.hub.quiver import Quiver
from hwcat.algebras.inputs.spec_text import spec_to_toml
from hwcat.errors import SpecError
from hwcat.exact.fields import Field, parse_field
from hwcat.limits import check_vertices

__all__ = [
    "linear_A",
    "alternating_A",
    "auslander_truncated_polynomial",
    "zigzag_A",
    "disjoint_union",
    "spec_to_toml",
]


# -- argument checks ---------------------------------------------------------


def _field_name(field: Field | str) -> str:
    if isinstance(field, Field):
        return field.name
    return parse_field(field).name


def _check_int(value: Any, what: str, minimum: int) -> int:
    if isinstance(value, bool) or not isinstance(value, int):
        raise SpecError(f"{what} must be an integer, got {value!r}")
    if value < minimum:
        raise SpecError(f"{what} must be at least {minimum}, got {value}")
    if what == "n":
        check_vertices(value)
    return value


def _spec(
    name: str,
    field: Field | str,
    n: int,
    arrows: list[str],
    relations: list[str] | None = None,
    vanish: int | None = None,
) -> dict:
    quiver: dict[str, Any] = {"vertices": [str(i) for i in range(1, n + 1)], "arrows": arrows}
    if relations:
        quiver["relations"] = relations
    if vanish is not None:
        quiver["vanish_from_length"] = vanish
    return {"name": name, "field": _field_name(field), "quiver": quiver}


def _vanish_suffix(vanish: int | None) -> str:
    return "" if vanish is None else f", paths of length >= {vanish} vanish"


# -- families ------------------------------------------------------------------


def linear_A(n: int, vanish_from_length: int | None = None, field: Field | str = "QQ") -> dict:
    """The linearly oriented quiver ``1 -> 2 -> ... -> n``, optionally truncated.

    Parameters
    ----------
    n : int
        The number of vertices, ``n >= 1``.
    vanish_from_length : int, optional
        If given (``>= 2``), every path of this length or longer is zero,
        which gives a Nakayama algebra; otherwise the algebra is the path
        algebra (hereditary).
    field : Field or str
        ``"QQ"`` or ``"GF(p)"``.

    Returns
    -------
    dict
        A spec with vertices ``"1".."n"`` and arrows ``a_i: i -> i+1`` named
        ``"a1", "a2", ...``.

    References
    ----------
    I. Assem, D. Simson, A. Skowronski, *Elements of the Representation
    Theory of Associative Algebras*, vol. 1, LMS Student Texts 65 (2006)
    (path algebras, bound quivers, Nakayama algebras).

    Examples
    --------
    >>> linear_A(2)["quiver"]
    {'vertices': ['1', '2'], 'arrows': ['a1: 1 -> 2']}
    """
    n = _check_int(n, "n", 1)
    if vanish_from_length is not None:
        _check_int(vanish_from_length, "vanish_from_length", 2)
    arrows = [f"a{i}: {i} -> {i + 1}" for i in range(1, n)]
    return _spec(
        f"linear A_{n}{_vanish_suffix(vanish_from_length)}",
        field,
        n,
        arrows,
        vanish=vanish_from_length,
    )


def alternating_A(n: int, vanish_from_length: int | None = None, field: Field | str = "QQ") -> dict:
    """The quiver of type ``A_n`` with alternating orientation ``1 -> 2 <- 3 -> 4 <- ...``.

    Arrow ``a_i`` joins ``i`` and ``i+1``: ``a_i: i -> i+1`` for odd ``i`` and
    ``a_i: i+1 -> i`` for even ``i``.  No path of length 2 exists, so
    ``vanish_from_length`` (accepted for symmetry with :func:`linear_A`,
    ``>= 2``) does not change the algebra, which is the hereditary path algebra.

    References
    ----------
    I. Assem, D. Simson, A. Skowronski, *Elements of the Representation
    Theory of Associative Algebras*, vol. 1, LMS Student Texts 65 (2006).

    Examples
    --------
    >>> alternating_A(4)["quiver"]["arrows"]
    ['a1: 1 -> 2', 'a2: 3 -> 2', 'a3: 3 -> 4']
    """
    n = _check_int(n, "n", 1)
    if vanish_from_length is not None:
        _check_int(vanish_from_length, "vanish_from_length", 2)
    arrows = [f"a{i}: {i} -> {i + 1}" if i % 2 else f"a{i}: {i + 1} -> {i}" for i in range(1, n)]
    return _spec(
        f"alternating A_{n}{_vanish_suffix(vanish_from_length)}",
        field,
        n,
        arrows,
        vanish=vanish_from_length,
    )


def auslander_truncated_polynomial(n: int, field: Field | str = "QQ") -> dict:
    """The Auslander algebra of ``k[x]/(x^n)``.

    Parameters
    ----------
    n : int
        ``n >= 1``; vertex ``i`` stands for the indecomposable module ``k[x]/(x^i)``.
    field : Field or str
        ``"QQ"`` or ``"GF(p)"``.

    Returns
    -------
    dict
        The quiver ``1 <-> 2 <-> ... <-> n`` with arrows ``a_i: i -> i+1`` and
        ``b_i: i+1 -> i`` (named ``"a1", "b1", ...``) and the mesh relations
        ``a1*b1`` (the 2-cycle at vertex 1 is zero) and
        ``b{i-1}*a{i-1} - a{i}*b{i}`` for ``i = 2..n-1`` (the two 2-cycles at
        an interior vertex agree).  For ``n = 1`` the algebra is ``k``.

    References
    ----------
    T. Bruestle, L. Hille, C. M. Ringel, G. Roehrle, Algebr. Represent.
    Theory 2 (1999) 295--312 (the Auslander algebra of ``k[T]/(T^n)``).

    Examples
    --------
    >>> auslander_truncated_polynomial(3)["quiver"]["relations"]
    ['a1*b1', 'b1*a1 - a2*b2']
    """
    n = _check_int(n, "n", 1)
    arrows = [f"a{i}: {i} -> {i + 1}" for i in range(1, n)]
    arrows += [f"b{i}: {i + 1} -> {i}" for i in range(1, n)]
    relations = ["a1*b1"] if n >= 2 else []
    relations += [f"b{i - 1}*a{i - 1} - a{i}*b{i}" for i in range(2, n)]
    return _spec(f"Auslander algebra of k[x]/(x^{n})", field, n, arrows, relations)


def zigzag_A(n: int, field: Field | str = "QQ") -> dict:
    """The zigzag algebra of type ``A_n``.

    Parameters
    ----------
    n : int
        ``n >= 1``.
    field : Field or str
        ``"QQ"`` or ``"GF(p)"``.

    Returns
    -------
    dict
        The double quiver of ``A_n`` (arrows ``a_i: i -> i+1``,
        ``b_i: i+1 -> i``) with relations: every path of length 2 that is not
        a 2-cycle is zero (``a{i}*a{i+1}``, ``b{i+1}*b{i}``), and the two
        2-cycles at an interior vertex agree (``b{i-1}*a{i-1} - a{i}*b{i}``).
        The spec also says ``vanish_from_length = 3``: for ``n >= 3`` this
        follows from the relations, for ``n = 2`` it is needed.

    Notes
    -----
    For ``n >= 2`` this is a symmetric algebra of Loewy length 3 and dimension
    ``4n - 2`` (from memory).  For ``n = 1`` the double quiver has no arrows
    and the function returns the one-vertex algebra ``k``; some authors use
    ``k[x]/(x^2)`` instead.

    Examples
    --------
    >>> zigzag_A(3)["quiver"]["relations"]
    ['a1*a2', 'b2*b1', 'b1*a1 - a2*b2']
    """
    n = _check_int(n, "n", 1)
    arrows = [f"a{i}: {i} -> {i + 1}" for i in range(1, n)]
    arrows += [f"b{i}: {i + 1} -> {i}" for i in range(1, n)]
    relations = [f"a{i}*a{i + 1}" for i in range(1, n - 1)]
    relations += [f"b{i + 1}*b{i}" for i in range(1, n - 1)]
    relations += [f"b{i - 1}*a{i - 1} - a{i}*b{i}" for i in range(2, n)]
    return _spec(
        f"zigzag algebra of type A_{n}", field, n, arrows, relations, vanish=3 if n >= 2 else None
    )


# -- constructions on specs ------------------------------------------------------------

_IDENT = re.compile(r"[A-Za-z_][A-Za-z0-9_']*")


def disjoint_union(specs: list[dict]) -> dict:
    """One spec holding the bound quivers of ``specs`` side by side: the product algebra.

    Vertex ``v`` of the ``c``-th spec (counted from 0) becomes ``v{c}_{v}``
    and arrow ``a`` becomes ``b{c}_{a}``, also inside the relations, so that
    names never clash.  The algebra of the union is the direct product of the
    algebras, one block per spec when each is connected (common practice).

    Parameters
    ----------
    specs : list of dict
        Specs shaped like those of this module, all over the same field and
        with the same ``vanish_from_length`` (or none); arrows as text
        ``"name: source -> target"``.

    Returns
    -------
    dict
        A spec named after its parts.

    Examples
    --------
    >>> u = disjoint_union([linear_A(2), linear_A(1)])
    >>> u["quiver"]
    {'vertices': ['v0_1', 'v0_2', 'v1_1'], 'arrows': ['b0_a1: v0_1 -> v0_2']}
    >>> disjoint_union([auslander_truncated_polynomial(2)] * 2)["quiver"]["relations"]
    ['b0_a1*b0_b1', 'b1_a1*b1_b1']
    """
    if not specs:
        raise SpecError("a disjoint union needs at least one spec")
    fields = {_field_name(s["field"]) for s in specs}
    if len(fields) > 1:
        raise SpecError(f"a disjoint union needs one field, got {', '.join(sorted(fields))}")
    vanish = {s["quiver"].get("vanish_from_length") for s in specs}
    if len(vanish) > 1:
        raise SpecError("a disjoint union needs the same vanish_from_length in every spec")
    vertices: list[str] = []
    arrows: list[str] = []
    relations: list[str] = []
    for c, spec in enumerate(specs):
        q = spec["quiver"]
        Q = Quiver.from_text(q["vertices"], q.get("arrows", []))  # checks the names
        vertices += [f"v{c}_{v}" for v in Q.vertices]
        names = {a.name: f"b{c}_{a.name}" for a in Q.arrows}
        if q.get("relations") and any(a.isdigit() for a in names):
            raise SpecError("a disjoint union renames arrows in relations: name arrows by letters")
        arrows += [
            f"{names[a.name]}: v{c}_{Q.vertices[a.source]} -> v{c}_{Q.vertices[a.target]}"
            for a in Q.arrows
        ]
        relations += [
            _IDENT.sub(lambda m, nm=names: nm.get(m[0], m[0]), r) for r in q.get("relations", [])
        ]
    quiver: dict[str, Any] = {"vertices": vertices, "arrows": arrows}
    if relations:
        quiver["relations"] = relations
    (v,) = vanish
    if v is not None:
        quiver["vanish_from_length"] = v
    name = " x ".join(str(s.get("name", "algebra")) for s in specs)
    return {"name": name, "field": fields.pop(), "quiver": quiver}
