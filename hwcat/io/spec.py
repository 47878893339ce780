"""Reading algebra spec files (TOML, format 1); see ``specs/FORMAT.md``.

Every problem with a spec raises a subclass of :class:`~hwcat.errors.HwcatError`
whose message starts with the file name and the key: ``"alg.toml: quiver.arrows[2]:
arrow 'c: 1 -> 5': '5' is not a vertex"``.
"""

from __future__ import annotations

import sys
import tomllib
from collections.abc import Sequence
from dataclasses import dataclass, field
from pathlib import Path as FilePath
from typing import Any

from hwcat.algebras.hub.basic import BasicAlgebra
from hwcat.algebras.hub.quiver import Quiver, parse_relation
from hwcat.algebras.inputs.bound import bound_quiver_algebra
from hwcat.errors import (
    HwcatError,
    QuiverError,
    ResourceLimitError,
    SpecError,
    SpecSyntaxError,
    StructureConstantsError,
)
from hwcat.exact import Field, parse_field
from hwcat.limits import check_matrix, resource_limits

__all__ = [
    "Spec",
    "read_spec",
    "read_spec_text",
    "build_algebra",
    "build_structure",
    "build_reduction",
    "load",
    "load_spec",
    "load_spec_text",
    "family_source",
    "family_parameters",
]

TOP_KEYS = {"name", "field", "order", "quiver", "multiplication", "matrices", "family", "format"}
KINDS = ("quiver", "multiplication", "matrices", "family")
QUIVER_KEYS = {"vertices", "arrows", "relations", "vanish_from_length"}
MULTIPLICATION_KEYS = {"basis", "products", "unit", "idempotents", "associativity", "seed"}
MATRICES_KEYS = {"generators", "idempotents", "seed"}


@dataclass(frozen=True)
class Spec:
    """A parsed spec file: the header keys and the raw table of its kind."""

    source: str
    name: str
    field: Field
    order: str | None
    kind: str
    table: dict[str, Any] = field(repr=False)


def is_format_1(value: Any) -> bool:
    """Whether a file's ``format`` key is the integer 1 (not ``true``, not ``1.0``)."""
    return type(value) is int and value == 1


def _err(cls: type[HwcatError], source: str, key: str, msg: str) -> HwcatError:
    return cls(f"{source}: {key}: {msg}" if key else f"{source}: {msg}")


def load_toml(text: str, source: str, error: type[HwcatError] = SpecSyntaxError) -> dict[str, Any]:
    """``tomllib.loads(text)``, every failure raised as ``error`` naming ``source``.

    Besides malformed TOML this is an integer literal of more than 4300 digits,
    which Python's conversion from text refuses; coefficients written as strings
    (``"123...9"``, ``"123...9*a*b"``) have no such bound.
    """
    try:
        return tomllib.loads(text)
    except tomllib.TOMLDecodeError as exc:
        raise error(f"{source}: not valid TOML: {exc}") from None
    except ValueError:  # int(text) beyond sys.get_int_max_str_digits()
        raise error(
            f"{source}: an integer literal has more than {sys.get_int_max_str_digits()} "
            'digits; write it as a string ("123...")'
        ) from None


def read_spec_text(text: str, source: str = "<spec>") -> Spec:
    """Parse spec text (TOML) and check its header keys."""
    data = load_toml(text, source)
    unknown = sorted(set(data) - TOP_KEYS)
    if unknown:
        raise _err(
            SpecError, source, unknown[0], f"unknown key (allowed: {', '.join(sorted(TOP_KEYS))})"
        )
    if "format" in data and not is_format_1(data["format"]):
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
            "missing: a spec needs one of [quiver], [multiplication], [matrices], [family]",
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
    except UnicodeDecodeError as exc:
        raise SpecSyntaxError(
            f"{p}: not UTF-8 text: byte {exc.object[exc.start]:#04x} at offset {exc.start}"
        ) from None
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
        Quiver.from_text(vertices, [])
    except HwcatError as exc:
        raise type(exc)(f"{src}: quiver.vertices: {exc}") from None
    try:
        Q = Quiver.from_text(vertices, arrows)
    except QuiverError as exc:
        key = "quiver.arrows" if exc.arrow is None else f"quiver.arrows[{exc.arrow}]"
        raise QuiverError(f"{src}: {key}: {exc}", arrow=exc.arrow) from None
    except HwcatError as exc:
        raise type(exc)(f"{src}: quiver.arrows: {exc}") from None
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
            else "quiver"
            if isinstance(exc, ResourceLimitError)
            else "quiver.relations"
        )
        raise type(exc)(f"{src}: {key}: {exc}") from None


# -- [multiplication] and [matrices]: reduced to the basic algebra -------------------


def _check_keys(src: str, kind: str, tab: dict, allowed: set[str]) -> None:
    unknown = sorted(set(tab) - allowed)
    if unknown:
        raise _err(
            SpecError,
            src,
            f"{kind}.{unknown[0]}",
            f"unknown key (allowed: {', '.join(sorted(allowed))})",
        )


def _string_list(src: str, key: str, value: Any) -> list[str]:
    if not isinstance(value, list):
        raise _err(SpecError, src, key, "must be a list of strings")
    for i, x in enumerate(value):
        if not isinstance(x, str):
            raise _err(SpecError, src, f"{key}[{i}]", f"{x!r} is not a string")
    return value


def _seed(src: str, kind: str, tab: dict) -> int:
    seed = tab.get("seed", 0)
    if not isinstance(seed, int) or isinstance(seed, bool):
        raise _err(SpecError, src, f"{kind}.seed", f"{seed!r} is not an integer")
    return seed


def _multiplication_structure(spec: Spec):
    from hwcat.algebras.inputs.structure import StructureAlgebra
    from hwcat.algebras.inputs.structure_input import (
        add_unit_products,
        parse_combination,
        parse_products,
    )

    src, tab, F = spec.source, spec.table, spec.field
    _check_keys(src, "multiplication", tab, MULTIPLICATION_KEYS)
    if "basis" not in tab:
        raise _err(SpecError, src, "multiplication.basis", "missing (a list of names)")
    basis = _string_list(src, "multiplication.basis", tab["basis"])
    if not basis:
        raise _err(SpecError, src, "multiplication.basis", "the basis is empty")
    seen: set[str] = set()
    for i, b in enumerate(basis):
        if not b.strip() or any(ch in b for ch in "*+-= "):
            raise _err(SpecError, src, f"multiplication.basis[{i}]", f"{b!r} is not a valid name")
        if all(ch.isdigit() or ch == "/" for ch in b):
            raise _err(
                SpecError,
                src,
                f"multiplication.basis[{i}]",
                f"{b!r} is a number, which would read as a coefficient in -1*{b}; "
                "a name must contain a letter",
            )
        if b in seen:
            raise _err(
                StructureConstantsError, src, f"multiplication.basis[{i}]", f"{b!r} is listed twice"
            )
        seen.add(b)
    rules = _string_list(src, "multiplication.products", tab.get("products", []))
    try:
        products = parse_products(rules, basis, F)
    except HwcatError as exc:
        raise type(exc)(f"{src}: multiplication.products{exc}") from None
    unit = None
    if "unit" in tab:
        if not isinstance(tab["unit"], str):
            raise _err(SpecError, src, "multiplication.unit", 'must be a string such as "e"')
        try:
            unit = parse_combination(tab["unit"], field=F, basis=basis)
        except HwcatError as exc:
            raise type(exc)(f"{src}: multiplication.unit: {exc}") from None
        products = add_unit_products(products, unit, len(basis))
    mode = tab.get("associativity", "auto")
    if mode not in ("auto", "exact", "sampled", "skip"):
        raise _err(
            SpecError,
            src,
            "multiplication.associativity",
            f"{mode!r}: expected auto, exact, sampled or skip",
        )
    seed = _seed(src, "multiplication", tab)
    try:
        A = StructureAlgebra(
            F, basis, products, unit, name=spec.name, associativity=mode, seed=seed
        )
    except HwcatError as exc:
        text = str(exc)
        key = (
            "multiplication.unit"
            if ("unit" in text or "identity" in text)
            else "multiplication.products"
        )
        raise type(exc)(f"{src}: {key}: {text}") from None
    ids = None
    if "idempotents" in tab:
        texts = _string_list(src, "multiplication.idempotents", tab["idempotents"])
        ids = []
        for i, t in enumerate(texts):
            try:
                ids.append(parse_combination(t, A))
            except HwcatError as exc:
                raise type(exc)(f"{src}: multiplication.idempotents[{i}]: {exc}") from None
    return A, ids, seed


def _sparse_matrix_value(src: str, key: str, F, value: dict):
    """``{size = [r, c], entries = [[i, j, "v"], ...]}`` (indices from 0)."""
    from hwcat.exact.polys import sparse_matrix

    unknown = sorted(set(value) - {"size", "entries"})
    if unknown:
        raise _err(SpecError, src, f"{key}.{unknown[0]}", "unknown key (allowed: entries, size)")
    size = value.get("size")
    if (
        not isinstance(size, list)
        or len(size) != 2
        or not all(isinstance(x, int) and not isinstance(x, bool) and x > 0 for x in size)
    ):
        raise _err(SpecError, src, f"{key}.size", f"{size!r} is not [rows, columns] (positive)")
    r, c = size
    try:
        check_matrix(r, c, "the matrix")
    except ResourceLimitError as exc:
        raise ResourceLimitError(f"{src}: {key}.size: {exc}") from None
    ents = value.get("entries", [])
    if not isinstance(ents, list):
        raise _err(SpecError, src, f"{key}.entries", 'must be a list of [row, column, "value"]')
    out: dict[tuple[int, int], Any] = {}
    for k, e in enumerate(ents):
        where = f"{key}.entries[{k}]"
        if not isinstance(e, list) or len(e) != 3:
            raise _err(SpecError, src, where, f'{e!r} is not [row, column, "value"]')
        i, j, x = e
        for name, v, bound in (("row", i, r), ("column", j, c)):
            if isinstance(v, bool) or not isinstance(v, int) or not 0 <= v < bound:
                raise _err(
                    StructureConstantsError, src, where, f"{name} {v!r} outside 0..{bound - 1}"
                )
        if isinstance(x, bool) or not isinstance(x, (int, str)):
            raise _err(SpecError, src, where, f"{x!r} is not an integer or a string")
        if (i, j) in out:
            raise _err(StructureConstantsError, src, where, f"entry ({i}, {j}) is given twice")
        try:
            out[(i, j)] = F.parse(x)
        except HwcatError as exc:
            raise type(exc)(f"{src}: {where}: {exc}") from None
    return sparse_matrix(F, r, c, out)


def _matrix_value(src: str, key: str, F, value: Any):
    from hwcat.exact import Mat

    if isinstance(value, dict):
        return _sparse_matrix_value(src, key, F, value)
    if not isinstance(value, list) or not value or not all(isinstance(r, list) for r in value):
        raise _err(SpecError, src, key, "must be a non-empty list of rows (lists of entries)")
    width = len(value[0])
    rows = []
    for i, r in enumerate(value):
        if len(r) != width:
            raise _err(
                StructureConstantsError,
                src,
                key,
                f"row {i} has {len(r)} entries, row 0 has {width}",
            )
        row = []
        for j, x in enumerate(r):
            if isinstance(x, bool) or not isinstance(x, (int, str)):
                raise _err(
                    SpecError, src, f"{key}[{i}][{j}]", f"{x!r} is not an integer or a string"
                )
            try:
                row.append(F.parse(x))
            except HwcatError as exc:
                raise type(exc)(f"{src}: {key}[{i}][{j}]: {exc}") from None
        rows.append(row)
    return Mat.from_rows(F, rows, width)


def _matrices_structure(spec: Spec):
    from hwcat.algebras.inputs.structure_input import (
        matrix_algebra,
        matrix_coordinates,
        matrix_expression,
    )

    src, tab, F = spec.source, spec.table, spec.field
    _check_keys(src, "matrices", tab, MATRICES_KEYS)
    gens = tab.get("generators")
    if not isinstance(gens, dict) or not gens:
        raise _err(SpecError, src, "matrices.generators", "missing: a table of named matrices")
    mats = {}
    for name, value in gens.items():
        mats[str(name)] = _matrix_value(src, f"matrices.generators.{name}", F, value)
    try:
        A = matrix_algebra(F, mats, name=spec.name)
    except HwcatError as exc:
        raise type(exc)(f"{src}: matrices.generators: {exc}") from None
    seed = _seed(src, "matrices", tab)
    ids = None
    if "idempotents" in tab:
        texts = _string_list(src, "matrices.idempotents", tab["idempotents"])
        ids = []
        for i, t in enumerate(texts):
            try:
                ids.append(matrix_coordinates(A, matrix_expression(t, F, mats)))
            except HwcatError as exc:
                raise type(exc)(f"{src}: matrices.idempotents[{i}]: {exc}") from None
    return A, ids, seed


def build_structure(spec: Spec):
    """The structure-constant algebra of a ``[multiplication]`` or ``[matrices]`` spec,
    with the idempotents it supplies (or ``None``) and its seed."""
    if spec.kind == "multiplication":
        return _multiplication_structure(spec)
    if spec.kind == "matrices":
        return _matrices_structure(spec)
    raise _err(SpecError, spec.source, spec.kind, "not a multiplication table or matrices")


def build_reduction(spec: Spec):
    """The :class:`~hwcat.algebras.reduction.reduction.Reduction` of a table or matrices spec."""
    from hwcat.algebras.reduction.reduction import reduce_algebra

    A, ids, seed = build_structure(spec)
    key = f"{spec.kind}.idempotents" if ids is not None else spec.kind
    try:
        return reduce_algebra(A, seed=seed, idempotents=ids)
    except HwcatError as exc:
        raise type(exc)(f"{spec.source}: {key}: {exc}") from None


def _reduced_algebra(spec: Spec) -> BasicAlgebra:
    return build_reduction(spec).basic


def _family_algebra(spec: Spec) -> BasicAlgebra:
    """A ``[family]`` table: ``name = "temperley-lieb"`` and the family's parameters."""
    from hwcat.algebras.families.registry import FAMILIES, family_algebra

    src, tab = spec.source, dict(spec.table)
    fam = tab.pop("name", None)
    if fam is None:
        raise _err(
            SpecError, src, "family.name", 'missing: the family\'s name, e.g. "temperley-lieb"'
        )
    if not isinstance(fam, str) or fam not in FAMILIES:
        raise _err(
            SpecError, src, "family.name", f"{fam!r}: unknown family (known: {', '.join(FAMILIES)})"
        )
    seed = _seed(src, "family", tab)
    tab.pop("seed", None)
    allowed = FAMILIES[fam].parameters
    for key, value in tab.items():
        if key not in allowed and key != "field":
            raise _err(
                SpecError,
                src,
                f"family.{key}",
                f"unknown parameter of {fam} (allowed: name, seed, {', '.join(allowed)})",
            )
        if isinstance(value, bool) or not isinstance(value, (int, str)):
            raise _err(SpecError, src, f"family.{key}", f"{value!r} is not an integer or a string")
        if key == "field":
            raise _err(SpecError, src, "family.field", "give the field at the top of the spec")
    if "field" in FAMILIES[fam].parameters:
        tab["field"] = spec.field.name
    try:
        A = family_algebra(fam, seed=seed, **tab)
    except HwcatError as exc:
        if str(exc).startswith(f"{src}:"):  # --family: the source is the family itself
            raise
        raise type(exc)(f"{src}: family: {exc}") from None
    if spec.name:
        A.name = spec.name
    return A


def family_parameters(
    family: str, items: Sequence[str], *, where: str, top_keys: Sequence[str] = ()
) -> dict[str, Any]:
    """Parameters ``key=value`` of a family named on the command line, as text.

    Each key at most once, and only the family's own parameters, ``seed`` (an
    integer, returned as one) and ``top_keys``; ``where`` starts every message.

    >>> family_parameters("linear-a", ["n=3", "seed=2"], where="--family")
    {'n': '3', 'seed': 2}
    >>> family_parameters("linear-a", ["n=3", "n=4"], where="--family")
    Traceback (most recent call last):
    ...
    hwcat.errors.SpecError: --family: parameter 'n' given twice
    """
    from hwcat.algebras.families.registry import FAMILIES

    allowed = list(dict.fromkeys([*FAMILIES[family].parameters, "seed", *top_keys]))
    out: dict[str, Any] = {}
    for it in items:
        if "=" not in it:
            raise SpecError(f"{where}: parameter {it!r}: expected key=value, e.g. n=4")
        k, v = (x.strip() for x in it.split("=", 1))
        if k in out:
            raise SpecError(f"{where}: parameter {k!r} given twice")
        if k not in allowed:
            raise SpecError(f"{where}: unknown parameter {k!r} (allowed: {', '.join(allowed)})")
        if k == "seed":
            try:
                v = int(v)
            except ValueError:
                raise SpecError(f"{where}: seed = {v!r} is not an integer") from None
        out[k] = v
    return out


def family_source(items: Sequence[str]) -> Spec:
    """A :class:`Spec` for a family named on the command line: ``["temperley-lieb", "n=4", ...]``.

    ``field=...`` and ``order=...`` among the items play the role of the spec's
    top-level keys; the field defaults to the family's default.
    """
    from hwcat.algebras.families.registry import FAMILIES

    if not items:
        raise SpecError("--family: give the family's name and parameters, e.g. temperley-lieb n=4")
    name, *rest = items
    if name not in FAMILIES:
        raise SpecError(f"--family: unknown family {name!r} (known: {', '.join(FAMILIES)})")
    table: dict[str, Any] = {
        "name": name,
        **family_parameters(name, rest, where="--family", top_keys=("field", "order")),
    }
    order = table.pop("order", None)
    field_text = table.pop("field", None)
    fam = FAMILIES[name]
    if field_text is None:
        field_text = fam.parameters["field"][1] if "field" in fam.parameters else "QQ"
    try:
        F = parse_field(field_text)
    except HwcatError as exc:
        raise type(exc)(f"--family: field: {exc}") from None
    return Spec(f"family {name}", "", F, order, "family", table)


_BUILDERS = {
    "quiver": _quiver_algebra,
    "multiplication": _reduced_algebra,
    "matrices": _reduced_algebra,
    "family": _family_algebra,
}


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


def load(
    path: str | FilePath | None = None,
    *,
    family: str | None = None,
    max_dim: int | None = None,
    max_vertices: int | None = None,
    max_products: int | None = None,
    **params: Any,
) -> BasicAlgebra:
    """The algebra of a spec file, or of a built-in family with its parameters.

    ``load("alg.toml")`` reads a spec file; ``load(family="temperley-lieb", n=4,
    delta=0, field="GF(3)")`` builds a family member (parameters as values or text).
    ``max_dim``, ``max_vertices`` and ``max_products`` set the resource limits of
    :mod:`hwcat.limits` for this build.

    >>> load(family="temperley-lieb", n=4, delta=0, field="GF(3)").n
    2
    """
    if (path is None) == (family is None):
        raise SpecError("load: give either a spec file or family=NAME, not both or neither")
    if path is not None and params:
        raise SpecError(f"load: parameters {sorted(params)} only go with family=NAME")
    with resource_limits(max_dim=max_dim, max_vertices=max_vertices, max_products=max_products):
        if path is not None:
            return build_algebra(read_spec(path))
        return build_algebra(family_source([family, *(f"{k}={v}" for k, v in params.items())]))


def load_spec(
    path: str | FilePath,
    *,
    max_dim: int | None = None,
    max_vertices: int | None = None,
    max_products: int | None = None,
) -> BasicAlgebra:
    """Read a spec file and build its algebra.

    ``max_dim``, ``max_vertices`` and ``max_products`` raise (or lower) the
    resource limits of :mod:`hwcat.limits` for this build.
    """
    with resource_limits(max_dim=max_dim, max_vertices=max_vertices, max_products=max_products):
        return build_algebra(read_spec(path))


def load_spec_text(
    text: str,
    source: str = "<spec>",
    *,
    max_dim: int | None = None,
    max_vertices: int | None = None,
    max_products: int | None = None,
) -> BasicAlgebra:
    """Build the algebra of spec text (limits as in :func:`load_spec`).

    >>> A = load_spec_text('field = "GF(3)"\\n[quiver]\\nvertices = ["x"]\\narrows = ["t: x -> x"]\\nvanish_from_length = 3')
    >>> A.dim, A.field
    (3, GF(3))
    >>> load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["x"]\\narrows = ["t: x -> x"]\\nvanish_from_length = 30', max_dim=20)
    Traceback (most recent call last):
        ...
    hwcat.errors.ResourceLimitError: <spec>: quiver: with every path of length 30 or more zero, the path algebra has dimension at least 21 (the paths of length up to 20), above the limit max_dim = 20; raise it with --max-dim N (Python: max_dim=N)
    """
    with resource_limits(max_dim=max_dim, max_vertices=max_vertices, max_products=max_products):
        return build_algebra(read_spec_text(text, source))
