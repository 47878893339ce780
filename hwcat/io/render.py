"""Renderers: results to text and JSON.  Renderers never compute mathematics."""

from __future__ import annotations

import json
from collections.abc import Sequence
from typing import Any

__all__ = ["to_json", "layer_text", "matrix_text", "render_structure"]


def to_json(result: Any) -> str:
    """One JSON object for a result with ``to_dict()``."""
    return json.dumps(result.to_dict(), indent=2, sort_keys=False)


def layer_text(vertices: Sequence[str], dims: Sequence[int]) -> str:
    """``(0, 2, 1)`` over vertices ``1, 2, 3`` -> ``"2^2 3"``."""
    parts = []
    for v, d in zip(vertices, dims, strict=True):
        if d == 1:
            parts.append(v)
        elif d > 1:
            parts.append(f"{v}^{d}")
    return " ".join(parts) if parts else "0"


def layers_text(vertices: Sequence[str], layers: Sequence[Sequence[int]]) -> str:
    return " | ".join(layer_text(vertices, layer) for layer in layers) or "0"


def matrix_text(
    rows: Sequence[Sequence[Any]],
    row_labels: Sequence[str],
    col_labels: Sequence[str],
    indent: str = "  ",
) -> str:
    cells = [[str(x) for x in r] for r in rows]
    w0 = max([len(x) for x in row_labels] + [0])
    widths = [
        max([len(col_labels[j])] + [len(cells[i][j]) for i in range(len(cells))])
        for j in range(len(col_labels))
    ]
    lines = [
        indent
        + " " * w0
        + "  "
        + " ".join(c.rjust(w) for c, w in zip(col_labels, widths, strict=True))
    ]
    for lab, r in zip(row_labels, cells, strict=True):
        lines.append(
            indent
            + lab.rjust(w0)
            + "  "
            + " ".join(c.rjust(w) for c, w in zip(r, widths, strict=True))
        )
    return "\n".join(lines)


def _module_lines(vertices: Sequence[str], mods) -> list[str]:
    lines = []
    for m in mods:
        lines.append(
            f"  {m.label:<8} dim {m.dimension:<4} Loewy length {m.loewy_length:<3} "
            f"radical layers (top first): {layers_text(vertices, m.radical_layers)}"
        )
    return lines


def render_structure(r) -> str:
    """Text form of a :class:`~hwcat.theory.structure.StructureReport`."""
    v = r.simples
    title = f"Structure of {r.name}" if r.name else "Structure of the algebra"
    lines = [
        title,
        f"  field {r.field}; dimension {r.dimension}; {len(v)} simple modules; "
        f"Loewy length {r.loewy_length}; {len(r.blocks)} block(s)",
    ]
    if any(m != 1 for m in r.morita):
        lines.append(
            "  simple dimensions (multiplicity of P(i) in the algebra): "
            + ", ".join(f"L({x}): {m}" for x, m in zip(v, r.morita, strict=True))
        )
    lines.append("Gabriel quiver:")
    if r.arrows:
        lines.append("  " + ", ".join(f"{n}: {s} -> {t}" for n, s, t in r.arrows))
    else:
        lines.append("  no arrows")
    lines.append("Cartan matrix, C[i][j] = [P(j) : L(i)] (row L(i), column P(j)):")
    lines.append(matrix_text(r.cartan, [f"L({x})" for x in v], [f"P({x})" for x in v]))
    lines.append("Indecomposable projectives P(i) = e_i A:")
    lines.extend(_module_lines(v, r.projectives))
    lines.append("Indecomposable injectives I(i) = D(A e_i):")
    lines.extend(_module_lines(v, r.injectives))
    return "\n".join(lines)
