"""The HTML report: one self-contained page with tables and inline SVG pictures.

A renderer only: it lays out a :class:`~hwcat.theory.structure.StructureReport`,
an :class:`~hwcat.theory.verdict.OrderVerdict` and an
:class:`~hwcat.theory.search.OrdersResult` through the Jinja2 template
``templates/report.html.j2`` shipped with the package.  The page loads
nothing: no scripts, no fonts, no images other than its inline SVG.
"""

from __future__ import annotations

import json
from collections.abc import Sequence
from typing import Any

from jinja2 import Environment, PackageLoader, StrictUndefined
from markupsafe import Markup

from hwcat.io.render import layer_text, layers_text
from hwcat.io.svg import hasse_svg, loewy_svg, quiver_svg, svg_text

__all__ = ["render_report_html", "display_label", "GROUP_TITLES"]

GROUP_TITLES = (
    "Projective modules P(i)",
    "Injective modules I(i)",
    "Standard modules Δ(i)",
    "Costandard modules ∇(i)",
    "Tilting modules T(i)",
)


def display_label(label: str) -> str:
    """Module labels with Greek letters: ``Delta(1)`` -> ``Δ(1)``, ``nabla(1)`` -> ``∇(1)``.

    >>> display_label("Delta(a)"), display_label("nabla(a)"), display_label("P(a)")
    ('Δ(a)', '∇(a)', 'P(a)')
    """
    return label.replace("Delta(", "Δ(").replace("nabla(", "∇(")


def _environment() -> Environment:
    env = Environment(
        loader=PackageLoader("hwcat.io", "templates"),
        autoescape=True,
        undefined=StrictUndefined,
        trim_blocks=True,
        lstrip_blocks=True,
    )
    return env


def _svg(elem) -> Markup:
    # ElementTree escapes every text and attribute, so the markup is safe to inline
    return Markup(svg_text(elem))


def _module_card(vertices: Sequence[str], m) -> dict[str, Any]:
    label = display_label(m.label)
    return {
        "label": label,
        "dimension": m.dimension,
        "dimension_vector": layer_text(vertices, m.dimension_vector),
        "radical_layers": layers_text(vertices, m.radical_layers),
        "socle_layers": layers_text(vertices, list(reversed(m.socle_layers))),
        "projective_injective": bool(m.projective_injective),
        "multiplicity_free": m.loewy_diagram is None or m.loewy_diagram.multiplicity_free,
        "svg": _svg(loewy_svg(m.loewy_diagram, label)) if m.loewy_diagram is not None else None,
    }


def _matrix(rows, row_labels, col_labels) -> dict[str, Any]:
    return {"rows": [list(r) for r in rows], "row_labels": row_labels, "col_labels": col_labels}


def _witness_lines(w: Any, limit: int = 6) -> list[str]:
    if w is None:
        return []
    items = w if isinstance(w, list) else [w]
    out = [
        str(it["text"]) if isinstance(it, dict) and "text" in it else json.dumps(it)
        for it in items[:limit]
    ]
    if len(items) > limit:
        out.append(f"... and {len(items) - limit} more (all in the data below)")
    return out


def _gd_text(gd) -> str | None:
    if gd is None:
        return None
    v = gd.json_value()
    if isinstance(v, dict):
        return f"at least {v.get('at_least')}"
    return str(v)


def render_report_html(
    structure, verdict, orders, *, search_note: str = "", version: str = ""
) -> str:
    """The report page as text (UTF-8 HTML5)."""
    vs = structure.simples
    idx = {v: i for i, v in enumerate(vs)}
    name = structure.name or "the algebra"
    quiver = _svg(
        quiver_svg(
            vs, [(n, idx[s], idx[t]) for n, s, t in structure.arrows], f"Gabriel quiver of {name}"
        )
    )
    groups = [
        (GROUP_TITLES[0], structure.projectives),
        (GROUP_TITLES[1], structure.injectives),
        (GROUP_TITLES[2], verdict.standards),
        (GROUP_TITLES[3], verdict.costandards),
        (GROUP_TITLES[4], verdict.tilting_summaries or ()),
    ]
    module_groups = [
        {"title": t, "modules": [_module_card(vs, m) for m in mods]} for t, mods in groups if mods
    ]
    L = [f"L({x})" for x in vs]
    axioms = [
        {
            "name": a.name,
            "holds": a.holds,
            "summary": a.summary,
            "witness_lines": _witness_lines(a.witness),
            "witness_json": None if a.witness is None else json.dumps(a.witness, indent=2),
        }
        for a in verdict.axioms
    ]
    by_name = {a["name"]: a for a in axioms}
    order = verdict.order
    structures = []
    for k, s in enumerate(orders.structure_list, 1):
        d = s.to_dict()
        structures.append(
            {
                "number": k,
                "covers": ", ".join(f"{a} < {b}" for a, b in d["essential_order"])
                or "no relations",
                "total_orders": d["quasi_hereditary_total_orders"],
                "representative": " > ".join(d["representative_order"]),
                "standards": [
                    f"Δ({vs[i]}) = {layer_text(vs, dv)}"
                    for i, dv in enumerate(s.standard_dimension_vectors)
                ],
                "svg": _svg(
                    hasse_svg(vs, s.essential_order.covers(), f"Essential order of structure {k}")
                ),
            }
        )
    context = {
        "name": name,
        "version": version,
        "structure": structure,
        "blocks": [", ".join(b) for b in structure.blocks],
        "quiver_svg": quiver,
        "cartan": _matrix(structure.cartan, L, [f"P({x})" for x in vs]),
        "decomposition_standard": _matrix(
            verdict.decomposition_standard, L, [f"Δ({x})" for x in vs]
        ),
        "decomposition_costandard": _matrix(
            verdict.decomposition_costandard, L, [f"∇({x})" for x in vs]
        ),
        "verdict": verdict,
        "order_text": order.chain_text() if order is not None else "none",
        "order_svg": None
        if order is None
        else _svg(hasse_svg(vs, order.covers(), "Hasse diagram of the order checked")),
        "search_note": search_note,
        "axioms": axioms,
        "factorisation": by_name.get("cartan-factorisation"),
        "reciprocity": by_name.get("bgg-reciprocity"),
        "global_dimension": _gd_text(verdict.global_dimension),
        "orders": orders,
        "structures": structures,
        "best_chain": " > ".join(vs[i] for i in orders.best_attempt) or "(none)",
        "module_groups": module_groups,
        "tilting_cartan": None
        if verdict.ringel_dual_cartan is None
        else _matrix(verdict.ringel_dual_cartan, [f"T({x})" for x in vs], [f"T({x})" for x in vs]),
    }
    return _environment().get_template("report.html.j2").render(**context)
