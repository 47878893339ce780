"""Renderers: results to text and JSON.  Renderers never compute mathematics."""

from __future__ import annotations

import json
from collections.abc import Iterator, Sequence
from itertools import compress
from typing import Any

from hwcat.errors import InternalInconsistency

__all__ = [
    "json_text",
    "to_json",
    "write_json",
    "layer_text",
    "matrix_text",
    "render_structure",
    "render_verdict",
    "render_orders",
    "search_line",
]


def _json_chunks(obj: Any, level: int = 0) -> Iterator[str]:
    """JSON text of ``obj`` in pieces: containers indented by two spaces per level,
    lists of scalars (dimension vectors, matrix rows) on one line.

    The same JSON value as ``json.dumps(obj)``; only the whitespace differs from
    ``indent=2``, which puts every number on its own line (the report of linear
    A_1000 took 241 MB that way).  Lists of scalars go through the encoder
    written in C.
    """
    if isinstance(obj, dict):
        if not obj:
            yield "{}"
            return
        inner = "\n" + "  " * (level + 1)
        first = True
        for k, v in obj.items():
            yield ("{" if first else ",") + inner + _dumps(_key(k)) + ": "
            first = False
            yield from _json_chunks(v, level + 1)
        yield "\n" + "  " * level + "}"
    elif isinstance(obj, (list, tuple)):
        if _SCALARS.issuperset(map(type, obj)):
            yield _dumps(obj)
            return
        inner = "\n" + "  " * (level + 1)
        first = True
        for v in obj:
            yield ("[" if first else ",") + inner
            first = False
            yield from _json_chunks(v, level + 1)
        yield "\n" + "  " * level + "]"
    else:
        yield _dumps(obj)


_dumps = json.JSONEncoder().encode
_SCALARS = frozenset((int, str, bool, type(None)))


def _key(k: Any) -> str:
    """A dictionary key as ``json.dumps`` writes it (and refuses what it refuses)."""
    if isinstance(k, str):
        return k
    if k is True or k is False or k is None or isinstance(k, float):
        return _dumps(k)
    if isinstance(k, int):
        return int.__repr__(k)
    raise TypeError(f"keys must be str, int, float, bool or None, not {type(k).__name__}")


def json_text(value: Any) -> str:
    """JSON text of a plain value (dicts, lists, scalars) in the layout of :func:`_json_chunks`."""
    from hwcat.exact.fields import long_int_text  # not at import: the parser needs no flint

    with long_int_text():  # exact numbers may have more than 4300 digits
        return "".join(_json_chunks(value))


def to_json(result: Any) -> str:
    """One JSON object for a result with ``to_dict()`` (layout of :func:`_json_chunks`)."""
    return json_text(result.to_dict())


def write_json(result: Any, stream: Any) -> None:
    """:func:`to_json` written to ``stream`` piece by piece, then a newline.

    The same text; the whole of it is never held (the report of linear A_1000
    has sixteen million numbers in its dimension vectors).
    """
    from hwcat.exact.fields import long_int_text  # not at import: the parser needs no flint

    buf: list[str] = []
    with long_int_text():  # exact numbers may have more than 4300 digits
        for chunk in _json_chunks(result.to_dict()):
            buf.append(chunk)
            if len(buf) >= 1 << 14:
                stream.write("".join(buf))
                buf.clear()
    buf.append("\n")
    stream.write("".join(buf))


def layer_text(vertices: Sequence[str], dims: Sequence[int]) -> str:
    """``(0, 2, 1)`` over vertices ``1, 2, 3`` -> ``"2^2 3"``."""
    if len(vertices) != len(dims):
        raise InternalInconsistency(f"{len(dims)} dimensions for {len(vertices)} vertices")
    parts = []
    for i in compress(range(len(dims)), dims):  # the nonzero entries only
        d = dims[i]
        if d == 1:
            parts.append(vertices[i])
        elif d > 1:
            parts.append(f"{vertices[i]}^{d}")
    return " ".join(parts) if parts else "0"


def layers_text(vertices: Sequence[str], layers: Sequence[Sequence[int]]) -> str:
    return " | ".join(layer_text(vertices, layer) for layer in layers) or "0"


def matrix_text(
    rows: Sequence[Sequence[Any]],
    row_labels: Sequence[str],
    col_labels: Sequence[str],
    indent: str = "  ",
) -> str:
    # two passes over the rows (widths, then lines) so that no table of cells is held:
    # a Cartan matrix with a thousand vertices has a million of them
    w0 = max([len(x) for x in row_labels] + [0])
    widths = [len(c) for c in col_labels]
    for r in rows:
        lens = [len(str(x)) for x in r]
        if len(lens) != len(widths):
            raise InternalInconsistency(
                f"a row of {len(lens)} entries under {len(widths)} column labels"
            )
        widths = list(map(max, widths, lens))
    lines = [
        indent
        + " " * w0
        + "  "
        + " ".join(c.rjust(w) for c, w in zip(col_labels, widths, strict=True))
    ]
    for lab, r in zip(row_labels, rows, strict=True):
        lines.append(
            indent
            + lab.rjust(w0)
            + "  "
            + " ".join(str(c).rjust(w) for c, w in zip(r, widths, strict=True))
        )
    return "\n".join(lines)


def _pi_mark(m) -> str:
    """`` [projective-injective]`` for a module summary marked so, else empty."""
    return "  [projective-injective]" if getattr(m, "projective_injective", None) else ""


def _socle_text(vertices: Sequence[str], m) -> str:
    """Socle layers written top first, so they line up with the radical layers."""
    return layers_text(vertices, list(reversed(m.socle_layers)))


def _module_lines(vertices: Sequence[str], mods) -> list[str]:
    lines = []
    for m in mods:
        lines.append(
            f"  {m.label:<8} dim {m.dimension:<4} Loewy length {m.loewy_length:<3} "
            f"radical layers (top first): {layers_text(vertices, m.radical_layers)}{_pi_mark(m)}"
        )
        if m.socle_layers:
            lines.append(
                f"  {'':<8} {'':<8} {'':<16} socle layers (top first):   {_socle_text(vertices, m)}"
            )
    return lines


def render_structure(r) -> str:
    """Text form of a :class:`~hwcat.theory.structure.StructureReport`."""
    v = r.simples
    title = f"Structure of {r.name}" if r.name else "Structure of the algebra"
    lines = [
        title,
        f"  field {r.field}; dimension {r.dimension}; {len(v)} simple "
        f"{_plural(len(v), 'module')}; Loewy length {r.loewy_length}; {len(r.blocks)} "
        f"{_plural(len(r.blocks), 'block')}",
    ]
    if any(m != 1 for m in r.morita):
        lines.append(
            "  simple dimensions (multiplicity of P(i) in the algebra): "
            + ", ".join(f"L({x}): {m}" for x, m in zip(v, r.morita, strict=True))
        )
    if r.natural_order:
        lines.append(f"  natural highest-weight order of the family: {r.natural_order}")
    lines.append("Gabriel quiver:")
    if r.arrows:
        lines.append("  " + ", ".join(f"{n}: {s} -> {t}" for n, s, t in r.arrows))
    else:
        lines.append("  no arrows")
    lines.append("Cartan matrix, C[i][j] = [P(j) : L(i)] (row L(i), column P(j)):")
    lines.append(matrix_text(r.cartan, [f"L({x})" for x in v], [f"P({x})" for x in v]))
    if any(m.projective_injective for m in r.projectives):
        lines.append(
            "Projective-injective: "
            + ", ".join(m.label for m in r.projectives if m.projective_injective)
        )
    lines.append("Indecomposable projectives P(i) = e_i A:")
    lines.extend(_module_lines(v, r.projectives))
    lines.append("Indecomposable injectives I(i) = D(A e_i):")
    lines.extend(_module_lines(v, r.injectives))
    if getattr(r, "centre_dimension", None) is not None:
        terms = getattr(r, "centre_terms", "")
        lines.append(
            f"Centre Z(A): dimension {r.centre_dimension}"
            + (f"; basis in {terms}" if terms else "")
        )
        lines.extend(f"  {b}" for b in r.centre_basis)
    return "\n".join(lines)


def _witness_lines(w: Any, indent: str = "      ", limit: int = 4) -> list[str]:
    """Short readable lines of a witness: the ``text`` of each item (all data is in --json)."""
    if w is None:
        return []
    items = w if isinstance(w, list) else [w]
    lines = []
    for item in items[:limit]:
        if isinstance(item, dict) and "text" in item:
            lines.append(indent + str(item["text"]))
        else:
            lines.append(indent + json.dumps(item))
    if len(items) > limit:
        lines.append(indent + f"... and {len(items) - limit} more (see --json)")
    return lines


def _module_table(vertices, mods) -> list[str]:
    lines = []
    for m in mods:
        lines.append(
            f"  {m.label:<12} dimension vector {layer_text(vertices, m.dimension_vector):<16} "
            f"radical layers: {layers_text(vertices, m.radical_layers)}{_pi_mark(m)}"
        )
        if m.socle_layers:
            lines.append(f"  {'':<12} {'':<17}{'':<16} socle layers:   {_socle_text(vertices, m)}")
    return lines


def search_line(s) -> str:
    """One line on how the search chose the order (a :class:`SearchSummary`)."""
    if s.quasi_hereditary_for_some_order:
        return (
            f"no order given; the search found {s.quasi_hereditary_total_orders} quasi-hereditary "
            f"total {_plural(s.quasi_hereditary_total_orders, 'order')} in {s.structures} "
            f"{_plural(s.structures, 'structure')}; checking the first structure's essential order"
        )
    chain = s.longest_heredity_chain
    return (
        "no order given and NO order makes the algebra quasi-hereditary; the longest heredity "
        f"chain found has {len(chain)} {_plural(len(chain), 'step')}: "
        f"{' > '.join(chain) or '(none)'}; the axioms below are for that attempt completed in "
        "spec order"
    )


def _plural(k: int, word: str) -> str:
    return word if k == 1 else word + "s"


def render_verdict(v) -> str:
    """Text form of an :class:`~hwcat.theory.verdict.OrderVerdict`."""
    vs = v.vertices
    title = f"Highest-weight check of {v.name}" if v.name else "Highest-weight check"
    lines = [title]
    if v.order is not None:
        lines.append(f"  order ({v.order_source}): {v.order.chain_text()}")
    if v.note:
        lines.append(f"  {v.note}")
    if v.search is not None:
        lines.append(f"  {search_line(v.search)}")
    verdict = "quasi-hereditary" if v.quasi_hereditary else "NOT quasi-hereditary"
    lines.append(f"  verdict: {verdict} for this order")
    if not v.quasi_hereditary:
        lines.append(
            f"  standardly stratified: {'yes' if v.standardly_stratified else 'no'}; "
            f"properly stratified: {'yes' if v.properly_stratified else 'no'}"
        )
    lines.append("Axioms:")
    w = max(len(a.name) for a in v.axioms)
    for a in v.axioms:
        mark = "holds" if a.holds else "undecided" if a.holds is None else "FAILS"
        lines.append(f"  [{mark}] {a.name:<{w}}  {a.summary}")
        if a.holds is False:
            lines.extend(_witness_lines(a.witness))
    lines.append("Standard modules Delta(L):")
    lines.extend(_module_table(vs, v.standards))
    lines.append("Costandard modules nabla(L):")
    lines.extend(_module_table(vs, v.costandards))
    lines.append("Decomposition matrix D[i][j] = [Delta(j) : L(i)]:")
    lines.append(
        matrix_text(v.decomposition_standard, [f"L({x})" for x in vs], [f"D({x})" for x in vs])
    )
    if v.standard_equals_costandard:
        lines.append("E[i][j] = [nabla(j) : L(i)] equals D, so C = D * D^T is the form to expect.")
    else:
        lines.append("Decomposition matrix E[i][j] = [nabla(j) : L(i)] (differs from D):")
        lines.append(
            matrix_text(
                v.decomposition_costandard, [f"L({x})" for x in vs], [f"N({x})" for x in vs]
            )
        )
    lines.append("Cartan matrix C[i][j] = [P(j) : L(i)]:")
    lines.append(matrix_text(v.cartan, [f"L({x})" for x in vs], [f"P({x})" for x in vs]))
    if v.global_dimension is not None:
        lines.append(f"Global dimension: {v.global_dimension}{_gldim_reason(v.global_dimension)}")
    if v.tilting is not None:
        lines.append(
            "Indecomposable tilting modules T(L) (dimension vector; (T : Delta(mu)); (T : nabla(mu))):"
        )
        sums = v.tilting_summaries or (None,) * len(v.tilting)
        for t, m in zip(v.tilting, sums, strict=True):
            lines.append(
                f"  T({vs[t.vertex]}):  {layer_text(vs, t.module.dims)};  "
                f"Delta: {layer_text(vs, t.standard_multiplicities)};  nabla: {layer_text(vs, t.costandard_multiplicities)}"
                + _pi_mark(m)
            )
            if m is not None:
                lines.append(
                    f"      radical layers: {layers_text(vs, m.radical_layers)};  "
                    f"socle layers (top first): {_socle_text(vs, m)}"
                )
    if v.ringel_dual_cartan is not None:
        lines.append("Cartan matrix of the Ringel dual End(T) (vertex L = T(L)):")
        lines.append(
            matrix_text(v.ringel_dual_cartan, [f"T({x})" for x in vs], [f"T({x})" for x in vs])
        )
    return "\n".join(lines)


def _gldim_reason(g) -> str:
    """Why a global dimension is infinite or only bounded below (text after the value)."""
    if g.case == "infinite" and g.witness is not None:
        if g.witness.reason == "cartan_determinant":
            return f"  (det Cartan = {g.witness.cartan_determinant}, not +-1)"
        return f"  ({g.witness.reason.replace('_', ' ')}, simple {g.witness_simple})"
    if g.case == "at_least":
        limits = sorted({d.limit for d in g.projective_dimensions if d.limit})
        return f"  (work budget reached: {', '.join(limits)}; raise it to go further)"
    return ""


def render_orders(r) -> str:
    """Text form of an :class:`~hwcat.theory.search.OrdersResult`."""
    vs = r.vertices
    lines = [f"Quasi-hereditary orders of {r.name}" if r.name else "Quasi-hereditary orders"]
    lines.append(
        f"  blocks: {len(r.blocks)}; vertex sets reached by the heredity search: {r.reachable_sets}"
    )
    if not r.quasi_hereditary:
        lines.append(
            "  quasi-hereditary: no (it is not quasi-hereditary for any order of the simples)"
        )
        chain = " > ".join(vs[i] for i in r.best_attempt) or "(none)"
        lines.append(f"  longest heredity chain found: {chain}")
        return "\n".join(lines)
    lines.append("  quasi-hereditary: yes")
    lines.append(f"  quasi-hereditary total orders: {r.quasi_hereditary_total_orders}")
    lines.append(f"  quasi-hereditary structures: {r.structures}")
    shown = len(r.structure_list)
    lines.append(
        f"Structures ({'all' if r.listed_all else f'first {shown}; use --all for every one'}):"
    )
    for k, s in enumerate(r.structure_list, 1):
        ess = (
            ", ".join(f"{a} < {b}" for a, b in s.essential_order.covers_named()) or "(no relations)"
        )
        lines.append(f"  #{k}: essential order (Hasse diagram): {ess}")
        lines.append(
            f"      quasi-hereditary total orders in this structure: {s.essential_order.count_linear_extensions()}"
        )
        lines.append(
            "      standard modules: "
            + "; ".join(
                f"Delta({vs[i]}) = {layer_text(vs, d)}"
                for i, d in enumerate(s.standard_dimension_vectors)
            )
        )
    return "\n".join(lines)
