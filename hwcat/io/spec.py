"""Reading algebra spec files (TOML, format 1); see ``specs/FORMAT.md``.

Every problem with a spec raises a subclass of :class:`~hwcat.errors.HwcatError`
whose message starts with the file name and the key: ``"alg.toml: quiver.arrows[2]:
arrow 'c: 1 -> 5': '5' is not a vertex"``.
"""

from __future__ import annotations

import tomllib
from dataclasses import dataclass, field
from pathlib import Path as FilePath
from typing import Any

from hwcat.algebras.basic import BasicAlgebra
from hwcat.algebras.bound import bound_quiver_algebra
from hwcat.algebras.quiver import Quiver, parse_relation
from hwcat.errors import HwcatError, SpecError, SpecSyntaxError
from hwcat.exact import Field, parse_field

__all__ = ["Spec", "read_spec", "read_spec_text", "build_algebra", "load_spec", "load_spec_text"]

TOP_KEYS = {"name", "field", "order", "quiver", "multiplication", "matrices", "format"}
KINDS = ("quiver", "multiplication", "matrices")
QUIVER_KEYS = {"vertices", "arrows", "relations", "vanish_from_length"}


@dataclass(frozen=True)
class Spec:
    """A parsed spec file: the header keys and the raw table of its kind."""

    source: str
    name: str
    field: Field
    order: str | None
    kind: str
    table: dict[str, Any] = field(repr=False)


def _err(cls: type[HwcatError], source: str, key: str, msg: str) -> HwcatError:
    return cls(f"{source}: {key}: {msg}" if key else f"{source}: {msg}")


def read_spec_text(text: str, source: str = "<spec>") -> Spec:
    """Parse spec text (TOML) and check its header keys."""
    try:
        data = tomllib.loads(text)
    except tomllib.TOMLDecodeError as exc:
        raise SpecSyntaxError(f"{source}: not valid TOML: {exc}") from None
    unknown = sorted(set(data) - TOP_KEYS)
    if unknown:
        raise _err(
            SpecError, source, unknown[0], f"unknown key (allowed: {', '.join(sorted(TOP_KEYS))})"
        )
    if "format" in data and data["format"] != 1:
        raise _err(SpecError, source, "format", f"{data['format']!r}: only format 1 is known")
    if "field" not in data:
        raise _err(SpecError, source, "field", 'missing (e.g. field = "QQ" or field = "GF(101)")')
    try:
        F = parse_field(data["field"])
    except HwcatError as exc:
        raise type(exc)(f"{source}: field: {exc}") from None
    kinds = [k for k in KINDS if k in data]
    if not kinds:
        raise _err(
            SpecError,
            source,
            "quiver",
            "missing: a spec needs one of [quiver], [multiplication], [matrices]",
        )
    if len(kinds) > 1:
        raise _err(
            SpecError,
            source,
            kinds[1],
            f"a spec has exactly one of {', '.join(KINDS)}; found {', '.join(kinds)}",
        )
    kind = kinds[0]
    if not isinstance(data[kind], dict):
        raise _err(SpecError, source, kind, "must be a table")
    name = data.get("name", "")
    if not isinstance(name, str):
        raise _err(SpecError, source, "name", f"{name!r} is not a string")
    order = data.get("order")
    if order is not None and not isinstance(order, str):
        raise _err(SpecError, source, "order", f'{order!r} is not a string such as "2 > 1"')
    return Spec(source, name, F, order, kind, data[kind])


def read_spec(path: str | FilePath) -> Spec:
    """Read a spec file from disk."""
    p = FilePath(path)
    try:
        text = p.read_text(encoding="utf-8")
    except OSError as exc:
        raise SpecError(f"{p}: cannot read: {exc.strerror or exc}") from None
    return read_spec_text(text, str(p))


def _quiver_algebra(spec: Spec) -> BasicAlgebra:
    src, tab, F = spec.source, spec.table, spec.field
    unknown = sorted(set(tab) - QUIVER_KEYS)
    if unknown:
        raise _err(
            SpecError,
            src,
            f"quiver.{unknown[0]}",
            f"unknown key (allowed: {', '.join(sorted(QUIVER_KEYS))})",
        )
    for key in ("vertices", "arrows"):
        if key not in tab and key == "vertices":
            raise _err(SpecError, src, f"quiver.{key}", "missing")
        if key in tab and not isinstance(tab[key], list):
            raise _err(SpecError, src, f"quiver.{key}", "must be a list of strings")
    vertices = tab["vertices"]
    arrows = tab.get("arrows", [])
    for key, items in (("vertices", vertices), ("arrows", arrows)):
        for i, x in enumerate(items):
            if not isinstance(x, (str, int)) or isinstance(x, bool):
                raise _err(SpecError, src, f"quiver.{key}[{i}]", f"{x!r} is not a string")
    if not vertices:
        raise _err(SpecError, src, "quiver.vertices", "the quiver has no vertices")
    try:
        Q = Quiver.from_text(vertices, arrows)
    except HwcatError as exc:
        key = (
            "quiver.vertices"
            if "vertex" in str(exc) and "arrow" not in str(exc)
            else "quiver.arrows"
        )
        raise type(exc)(f"{src}: {key}: {exc}") from None
    rel_texts = tab.get("relations", [])
    if not isinstance(rel_texts, list):
        raise _err(SpecError, src, "quiver.relations", "must be a list of strings")
    rels = []
    for i, r in enumerate(rel_texts):
        try:
            rels.append(parse_relation(r, Q, F))
        except HwcatError as exc:
            raise type(exc)(f"{src}: quiver.relations[{i}]: {exc}") from None
    N = tab.get("vanish_from_length")
    if N is not None and (not isinstance(N, int) or isinstance(N, bool)):
        raise _err(SpecError, src, "quiver.vanish_from_length", f"{N!r} is not an integer")
    try:
        return bound_quiver_algebra(F, Q, rels, N, name=spec.name, relation_texts=rel_texts)
    except HwcatError as exc:
        key = (
            "quiver.vanish_from_length"
            if N is not None and "vanish_from_length =" in str(exc)
            else "quiver.relations"
        )
        raise type(exc)(f"{src}: {key}: {exc}") from None


_BUILDERS = {"quiver": _quiver_algebra}


def register_builder(kind: str, builder) -> None:
    """Register the function that turns a spec table of ``kind`` into a BasicAlgebra."""
    _BUILDERS[kind] = builder


def build_algebra(spec: Spec) -> BasicAlgebra:
    """The BasicAlgebra a spec describes."""
    if spec.kind not in _BUILDERS:
        raise _err(
            SpecError, spec.source, spec.kind, "this kind of spec is not supported by this version"
        )
    return _BUILDERS[spec.kind](spec)


def load_spec(path: str | FilePath) -> BasicAlgebra:
    """Read a spec file and build its algebra."""
    return build_algebra(read_spec(path))


def load_spec_text(text: str, source: str = "<spec>") -> BasicAlgebra:
    """Build the algebra of spec text.

    >>> A = load_spec_text('field = "GF(3)"\\n[quiver]\\nvertices = ["x"]\\narrows = ["t: x -> x"]\\nvanish_from_length = 3')
    >>> A.dim, A.field
    (3, GF(3))
    """
    return build_algebra(read_spec_text(text, source))
