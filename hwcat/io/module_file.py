"""Modules the user holds: module files, named modules, natural modules, the spin chain.

A module file (TOML, see ``specs/FORMAT.md``) gives the action of an algebra
described by a spec:

* ``[quiver]`` specs: ``[dimensions]`` (vertex -> dimension; missing vertices
  have dimension 0) and ``[matrices]`` (arrow -> ``dim source x dim target``
  matrix; missing arrows act by zero).  Every relation and
  ``vanish_from_length`` is checked.
* ``[matrices]`` specs: ``dimension`` and one square matrix per generator.
  Every relation of the algebra the spec's matrices generate is checked
  (``w*g = sum c_k w_k`` for each basis word ``w`` and generator ``g``).
* ``[multiplication]`` specs: ``dimension`` and one square matrix per basis
  element; every product and the unit are checked.

Matrices are lists of rows or sparse tables ``{size = [r, c], entries =
[[i, j, "v"], ...]}`` (indices from 0).  Any problem raises a
:class:`~hwcat.errors.ModuleFileError` naming the file, the key and the text.
"""

from __future__ import annotations

import re
from pathlib import Path as FilePath
from typing import Any

from hwcat.algebras.hub.basic import BasicAlgebra
from hwcat.errors import (
    HwcatError,
    InternalInconsistency,
    ModuleFileError,
    ResourceLimitError,
    SpecError,
)
from hwcat.exact import Mat, parse_field
from hwcat.io.spec import Spec, _matrix_value, build_structure, is_format_1, load_toml
from hwcat.limits import check_matrix, check_power_of_two, size_text
from hwcat.modules import Module, injective, projective, regular_module, simple
from hwcat.modules.action import ActionModule, from_representation

__all__ = [
    "spec_generators",
    "natural_module",
    "read_module_file",
    "named_module",
    "spin_chain_module",
    "spin_chain_identifiable",
    "attach_spin_chain",
    "attach_algebra",
    "algebra_module",
    "structure_of",
    "MODULE_NAMES",
]

FILE_KEYS = {"format", "name", "field", "dimension", "dimensions", "matrices"}

MODULE_NAMES = (
    "P(x) or projective(x); I(x) or injective(x); L(x) or simple(x); "
    "Delta(x) or standard(x); nabla(x) or costandard(x); T(x) or tilting(x); regular"
)

_NAMED = re.compile(r"^\s*([A-Za-z\u0394\u2207]+)\s*\(\s*(.+?)\s*\)\s*$")
_KINDS = {
    "P": "P", "projective": "P",
    "I": "I", "injective": "I",
    "L": "L", "simple": "L", "S": "L",
    "Delta": "Delta", "standard": "Delta", "\u0394": "Delta",
    "nabla": "nabla", "costandard": "nabla", "\u2207": "nabla",
    "T": "T", "tilting": "T",
}  # fmt: skip


def _err(source: str, key: str, msg: str) -> ModuleFileError:
    return ModuleFileError(f"{source}: {key}: {msg}" if key else f"{source}: {msg}")


def spec_generators(spec: Spec) -> dict[str, Mat]:
    """The generating matrices of a ``[matrices]`` spec (without building the algebra)."""
    gens = spec.table.get("generators")
    if spec.kind != "matrices" or not isinstance(gens, dict) or not gens:
        raise SpecError(f"{spec.source}: matrices.generators: missing: a table of named matrices")
    out = {
        str(k): _matrix_value(spec.source, f"matrices.generators.{k}", spec.field, v)
        for k, v in gens.items()
    }
    sizes = {m.shape for m in out.values()}
    if len(sizes) != 1 or any(r != c for r, c in sizes):
        raise SpecError(
            f"{spec.source}: matrices.generators: the matrices must be square of one size "
            f"(found {', '.join(f'{r}x{c}' for r, c in sorted(sizes))})"
        )
    return out


def natural_module(spec: Spec) -> ActionModule:
    """The space the generating matrices of a ``[matrices]`` spec act on (row vectors)."""
    gens = spec_generators(spec)
    n = next(iter(gens.values())).nrows
    return ActionModule(spec.field, n, gens, name=f"natural module of {spec.name or spec.source}")


def attach_algebra(M: ActionModule, spec_kind: str, B: BasicAlgebra) -> None:
    """Let ``M`` act by the basis of the algebra behind ``B`` (for identification).

    ``[matrices]`` specs: each basis word is evaluated.  Tables (``[multiplication]``
    specs and families): the action of the generators that are basis elements is
    extended to the whole basis by multiplying and checked
    (:class:`~hwcat.modules.basis_action.BasisAction`); a failure here means ``M``
    is not a module of that algebra (e.g. a tensor product through a coproduct
    that does not fit it)."""
    from hwcat.algebras.reduction.reduction import reduction_of
    from hwcat.theory.module_report import extend_to_basis

    if spec_kind != "matrices":
        # tables: the generators' action extended to the whole basis, checked
        extend_to_basis(M, B)
        return
    red = reduction_of(B)
    if red is None or M.representation is not None or M.basis_action is not None:
        return
    if M.combination_action is not None:
        return
    A = red.algebra
    cache: dict[int, Mat] = {}

    def act(i: int) -> Mat:
        if i not in cache:
            cache[i] = M.element(A.basis[i])
        return cache[i]

    M.basis_action = act


# -- module files ----------------------------------------------------------------------------------


def _read_toml(path: str) -> dict[str, Any]:
    p = FilePath(path)
    try:
        text = p.read_text(encoding="utf-8")
    except OSError as exc:
        raise ModuleFileError(f"{p}: cannot read: {exc.strerror or exc}") from None
    except UnicodeDecodeError:
        raise ModuleFileError(f"{p}: not UTF-8 text") from None
    return load_toml(text, str(p), ModuleFileError)


def _matrix(src: str, key: str, F, value: Any, shape: tuple[int, int]) -> Mat:
    try:
        if isinstance(value, list) and (shape[0] == 0 or shape[1] == 0) and not value:
            return Mat.zeros(F, *shape)
        M = _matrix_value(src, key, F, value)
    except HwcatError as exc:
        raise ModuleFileError(str(exc)) from None
    if M.shape != shape:
        raise _err(
            src, key, f"a {M.nrows} x {M.ncols} matrix where {shape[0]} x {shape[1]} is needed"
        )
    return M


def read_module_file(path: str, spec: Spec, B: BasicAlgebra | None = None) -> ActionModule:
    """Read and check a module file for ``spec`` (``B``: its algebra, for quiver specs)."""
    src = str(path)
    data = _read_toml(path)
    unknown = sorted(set(data) - FILE_KEYS)
    if unknown:
        raise _err(src, unknown[0], f"unknown key (allowed: {', '.join(sorted(FILE_KEYS))})")
    if "format" in data and not is_format_1(data["format"]):
        raise _err(src, "format", f"{data['format']!r}: only format 1 is known")
    F = spec.field
    if "field" in data:
        try:
            G = parse_field(data["field"])
        except HwcatError as exc:
            raise _err(src, "field", str(exc)) from None
        if G is not F:
            raise _err(src, "field", f"{G} but the spec {spec.source} is over {F}")
    mats = data.get("matrices")
    if not isinstance(mats, dict):
        raise _err(src, "matrices", "missing: a table of named matrices")
    name = data.get("name", FilePath(path).stem)
    qspec = _quiver_spec(spec)
    if qspec is not None:
        if B is None:
            raise ModuleFileError(f"{src}: the quiver algebra is needed")
        return _quiver_module(src, data, mats, qspec, B, str(name))
    if (
        "dimension" not in data
        or isinstance(data["dimension"], bool)
        or not isinstance(data["dimension"], int)
        or data["dimension"] < 1
    ):
        raise _err(src, "dimension", f"{data.get('dimension')!r}: a positive integer is needed")
    n = data["dimension"]
    _check_size(src, "dimension", n)
    given = {str(k): _matrix(src, f"matrices.{k}", F, v, (n, n)) for k, v in mats.items()}
    if spec.kind == "matrices":
        return _matrices_module(src, given, spec, n, str(name))
    return _multiplication_module(src, given, structure_of(spec, B), n, str(name))


def _check_size(src: str, key: str, n: int) -> None:
    """Refuse a module of dimension ``n`` whose action (``n x n`` matrices) exceeds the limits."""
    try:
        check_matrix(n, n, f"each matrix of a module of dimension {size_text(n)}")
    except ResourceLimitError as exc:
        raise ResourceLimitError(f"{src}: {key}: {exc}") from None


def _quiver_spec(spec: Spec) -> Spec | None:
    """``spec`` itself for a ``[quiver]`` spec, the family's quiver spec for a quiver
    family, else ``None``."""
    if spec.kind == "quiver":
        return spec
    if spec.kind != "family":
        return None
    from hwcat.algebras.families.registry import FAMILIES, family_spec

    tab = {k: v for k, v in spec.table.items() if k not in ("name", "seed")}
    fam = FAMILIES.get(str(spec.table.get("name")))
    if fam is None or fam.kind != "quiver":
        return None
    if "field" in fam.parameters:
        tab["field"] = spec.field.name
    q = family_spec(fam.name, **tab)["quiver"]
    return Spec(spec.source, spec.name, spec.field, spec.order, "quiver", dict(q))


def structure_of(spec: Spec, B: BasicAlgebra | None = None):
    """The structure-constant algebra of a ``[multiplication]`` spec or a table family
    (for a family: the one ``B`` was reduced from)."""
    if spec.kind == "family":
        from hwcat.algebras.reduction.reduction import reduction_of

        red = reduction_of(B) if B is not None else None
        if red is None:
            raise ModuleFileError(f"{spec.source}: the family's algebra is needed")
        return red.algebra
    A, _, _ = build_structure(spec)
    return A


def _quiver_module(
    src: str, data: dict, mats: dict, spec: Spec, B: BasicAlgebra, name: str
) -> ActionModule:
    F = spec.field
    dtab = data.get("dimensions", {})
    if not isinstance(dtab, dict):
        raise _err(src, "dimensions", "must be a table vertex = dimension")
    dims = [0] * B.n
    for k, v in dtab.items():
        if str(k) not in B.vertices:
            raise _err(
                src, f"dimensions.{k}", f"{k!r} is not a vertex (vertices: {', '.join(B.vertices)})"
            )
        if isinstance(v, bool) or not isinstance(v, int) or v < 0:
            raise _err(src, f"dimensions.{k}", f"{v!r} is not a dimension")
        dims[B.vertices.index(str(k))] = v
    _check_size(src, "dimensions", sum(dims))
    names = [a.name for a in B.arrows]
    for k in mats:
        if str(k) not in names:
            raise _err(src, f"matrices.{k}", f"{k!r} is not an arrow (arrows: {', '.join(names)})")
    maps = []
    for a in B.arrows:
        shape = (dims[a.source], dims[a.target])
        if a.name in mats:
            maps.append(_matrix(src, f"matrices.{a.name}", F, mats[a.name], shape))
        else:
            maps.append(Mat.zeros(F, *shape))
    R = Module(B, dims, maps, name)
    M = from_representation(R, name)
    for i, rel in enumerate(spec.table.get("relations", [])):
        if not M.element(rel) == Mat.zeros(F, M.dim, M.dim):
            raise _err(
                src, "matrices", f"the relation {rel!r} (quiver.relations[{i}]) does not hold"
            )
    N = spec.table.get("vanish_from_length")
    if N is not None and M.dim:
        S = Mat.identity(F, M.dim)
        arrows = [M.generators[a.name] for a in B.arrows]
        for _ in range(N):
            parts = [S @ X for X in arrows]
            from hwcat.exact import echelon

            S = echelon(Mat.vstack(F, parts, M.dim)) if parts else Mat.zeros(F, 0, M.dim)
            if S.nrows == 0:
                break
        if S.nrows:
            raise _err(
                src,
                "matrices",
                f"paths of length {N} do not act by zero (quiver.vanish_from_length = {N})",
            )
    return M


def _matrices_module(
    src: str, given: dict[str, Mat], spec: Spec, n: int, name: str
) -> ActionModule:
    from hwcat.algebras.inputs.structure_input import matrix_coordinates

    gens = spec_generators(spec)
    for k in given:
        if k not in gens:
            raise _err(
                src,
                f"matrices.{k}",
                f"{k!r} is not a generator of the spec (generators: {', '.join(gens)})",
            )
    missing = [g for g in gens if g not in given]
    if missing:
        raise _err(src, "matrices", f"no matrix for the generator {missing[0]!r}")
    M = ActionModule(spec.field, n, {g: given[g] for g in gens}, name=name)
    A, _, _ = build_structure(spec)
    words = list(A.basis)
    index = {w: i for i, w in enumerate(words)}
    W = [M.element(w) for w in words]
    for i, w in enumerate(words):
        for g in gens:
            prod = g if w == "1" else f"{w}*{g}"
            if prod in index:
                continue
            c = matrix_coordinates(A, A.natural[i] @ gens[g])
            rhs = Mat.zeros(spec.field, n, n)
            for k, x in enumerate(c):
                if x != 0:
                    rhs = rhs + W[k].scale(x)
            if not (W[i] @ given[g] == rhs):
                text = A.element_text(list(c)) or "0"
                raise _err(
                    src,
                    "matrices",
                    f"the relation {prod} = {text} of the spec's algebra does not hold",
                )
    return M


def _multiplication_module(src: str, given: dict[str, Mat], A, n: int, name: str) -> ActionModule:
    """A module of a structure-constant algebra from the matrices of some basis
    elements that generate it (or of all of them); checked exactly (see
    :mod:`hwcat.modules.basis_action`)."""
    from hwcat.modules.basis_action import BasisAction

    for k in given:
        if k not in A.basis:
            raise _err(src, f"matrices.{k}", f"{k!r} is not a basis element of the algebra")
    try:
        act = BasisAction(A, n, given)
    except ModuleFileError as exc:
        raise _err(src, "matrices", str(exc)) from None
    bad = act.failure()
    if bad is not None:
        raise _err(src, "matrices", bad)
    M = ActionModule(A.field, n, dict(given), name=name, combination_action=act.act)
    M.letters = _BasisLetters(A.basis, act)  # after the checks of the constructor
    M.basis_action = act.matrix
    return M


class _BasisLetters(dict):
    """Every basis name as a letter, its matrix looked up when used."""

    def __init__(self, names, act) -> None:
        super().__init__((b, None) for b in names)
        self._act = act
        self._index = {b: i for i, b in enumerate(names)}

    def __getitem__(self, key: str) -> Mat:
        return self._act.matrix(self._index[key])

    def items(self):  # type: ignore[override]
        return [(k, self[k]) for k in self.keys()]

    def values(self):  # type: ignore[override]
        return [self[k] for k in self.keys()]


def algebra_module(text: str, red) -> ActionModule:
    """``regular`` or ``P(x)`` (``= e_x A``) as modules of the input algebra of a
    reduction ``red`` (not of its basic algebra): the factors a tensor product needs."""
    from hwcat.modules.basis_action import BasisAction

    A = red.algebra
    t = text.strip()
    m = _NAMED.match(t)
    if t == "regular":
        basis, label = Mat.identity(A.field, A.dim), "regular"
    elif m and _KINDS.get(m.group(1)) == "P":
        v = m.group(2)
        if v not in red.basic.vertices:
            raise ModuleFileError(
                f"{text!r}: {v!r} is not a vertex (vertices: {', '.join(red.basic.vertices)})"
            )
        e = list(red.idempotents[red.basic.vertices.index(v)])
        from hwcat.exact import echelon

        basis, label = echelon(A.left_action(e)), f"P({v})"
    else:
        raise ModuleFileError(
            f"{text!r}: a tensor factor must be a module of the algebra itself: "
            "a module file, regular or P(x)"
        )
    whole = ActionModule(
        A.field, A.dim, {b: A.right_action(A.basis_vector(i)) for i, b in enumerate(A.basis)}
    )
    M = whole.submodule(basis, name=label) if basis.nrows < A.dim else whole
    M.name = label
    act = BasisAction(A, M.dim, M.generators)
    M.basis_action = act.matrix
    M.combination_action = act.act
    return M


# -- named modules ---------------------------------------------------------------------------------


def named_module(text: str, B: BasicAlgebra, order=None) -> ActionModule:
    """``P(x)``, ``I(x)``, ``L(x)``, ``Delta(x)``, ``nabla(x)``, ``T(x)`` (also spelled
    ``projective(x)``, ``standard(x)``, ``costandard(x)``, ``tilting(x)``, ...) or ``regular``."""
    from hwcat.theory.highest_weight import costandard_module, standard_module

    t = text.strip()
    if t == "regular":
        return from_representation(regular_module(B), "regular")
    m = _NAMED.match(t)
    if not m or m.group(1) not in _KINDS:
        raise ModuleFileError(
            f"--module {text!r}: not a file and not a module name ({MODULE_NAMES})"
        )
    kind, v = _KINDS[m.group(1)], m.group(2)
    if v not in B.vertices:
        raise ModuleFileError(
            f"--module {text!r}: {v!r} is not a vertex (vertices: {', '.join(B.vertices)})"
        )
    s = B.vertices.index(v)
    if kind == "P":
        R = projective(B, s)
    elif kind == "I":
        R = injective(B, s)
    elif kind == "L":
        R = simple(B, s)
    else:
        if order is None:
            raise ModuleFileError(
                f"--module {text!r}: needs an order (--order, the spec's order, or a quasi-hereditary structure)"
            )
        if kind == "Delta":
            R = standard_module(B, s, order)
        elif kind == "nabla":
            R = costandard_module(B, s, order)
        else:
            from hwcat.theory.tilting import tilting_module

            try:
                R = tilting_module(B, s, order).module
            except HwcatError as exc:
                raise ModuleFileError(f"--module {text!r}: {exc}") from None
    return from_representation(R, f"{kind}({v})")


def spin_chain_module(n: int, delta: Any, field: Any) -> ActionModule:
    """The Temperley-Lieb spin chain of length ``n`` for loop weight ``delta = q + 1/q``
    (``q`` chosen in the field), as the natural module of its generators."""
    from hwcat.algebras.families.spin_chain import loop_weight_root, spin_chain_entries
    from hwcat.exact.polys import sparse_matrix

    check_power_of_two(n, f"the spin chain of length {n} has dimension 2^{n}")
    F = parse_field(field) if isinstance(field, str) else field
    q = loop_weight_root(delta, F)
    ents = spin_chain_entries(n, q, F)
    N = 1 << n
    gens = {g: sparse_matrix(F, N, N, e) for g, e in ents.items()}
    return ActionModule(F, N, gens, name=f"spin chain n={n}, q={F.to_str(q)}", sparse=ents)


CHAIN_IDENTIFY_LIMIT = 1430
"""Largest ``dim TL_n = Catalan(n)`` (``n = 8``) for which ``hwcat module`` identifies the
spin chain's summands by the simples of the family's algebra: the reduction of
``TL_8`` and one pass over its 1430 diagrams (a product of two ``256 x 256``
matrices each) take about half a minute; ``TL_9`` (4862 diagrams on a chain of
dimension 512) would take several minutes."""

_STORE_ENTRIES = 4_000_000
"""Keep every diagram's matrix when ``dim TL_n * (2^n)^2`` is at most this."""


def spin_chain_identifiable(n: int) -> tuple[bool, str]:
    """Whether the summands of the chain of length ``n`` are identified (and why not)."""
    import math

    c = math.comb(2 * n, n) // (n + 1)
    if c <= CHAIN_IDENTIFY_LIMIT:
        return True, ""
    return False, (
        f"a chain of length {n}: TL_{n} has dimension {c} > {CHAIN_IDENTIFY_LIMIT}; simples, "
        "layers, identification and the centre are skipped (they need the family's "
        "reduction and every diagram's action); decomposition, End and Jordan types follow"
    )


def attach_spin_chain(M: ActionModule, n: int, B: BasicAlgebra) -> None:
    """Let the diagram basis of the ``temperley-lieb`` family (the algebra ``B`` was
    reduced from) act on the spin chain ``M``: each diagram is a product of generators
    ``e_i`` read off the table (a tree of single products, see
    :class:`~hwcat.modules.basis_action.BasisAction`)."""
    from hwcat.algebras.families.spin_chain import generator_diagrams
    from hwcat.algebras.reduction.reduction import reduction_of
    from hwcat.modules.basis_action import BasisAction

    red = reduction_of(B)
    if red is None:
        raise ModuleFileError(
            "the spin chain as a module needs the diagram basis of the Temperley-Lieb family: "
            "use route=table"
        )
    A = red.algebra
    elements = {g: A.basis_vector(A.basis.index(name)) for g, name in generator_diagrams(n).items()}
    stored = A.dim * M.dim * M.dim <= _STORE_ENTRIES
    act = BasisAction(A, M.dim, M.generators, elements=elements, stored=stored)
    M.combination_action = act.act
    if stored:
        # the chain is built here, not read: a failure is an internal inconsistency
        # (for example a loop weight that does not match the chain's q)
        why = act.failure()
        if why is not None:
            raise InternalInconsistency(f"the spin chain of length {n} is not a module: {why}")
        M.basis_action = act.matrix
