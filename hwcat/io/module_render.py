"""Text rendering of the ``hwcat module`` report (no mathematics here)."""

from __future__ import annotations

from typing import Any

from hwcat.theory.module_report import ModuleReport

__all__ = ["render_module_report"]


def _layers(layers, simples) -> str:
    out = []
    for layer in layers:
        parts = [f"{m}x{simples[i]}" if m > 1 else simples[i] for i, m in enumerate(layer) if m]
        out.append(" + ".join(parts) or "0")
    return " | ".join(out)


def _blocks(blocks: list[dict[str, Any]]) -> str:
    if not blocks:
        return "(none)"
    counts: dict[str, int] = {}
    for b in blocks:
        if b["degree"] == 1:
            key = f"J{b['size']}({b['eigenvalue']})"
        else:
            key = f"J{b['size']}[{b['factor']}]"
        counts[key] = counts.get(key, 0) + 1
    return " + ".join(f"{n}x{k}" if n > 1 else k for k, n in counts.items())


def render_module_report(r: ModuleReport) -> str:
    d = r.to_dict()
    lines = [f"module {r.name or '(unnamed)'} over {r.field}: dimension {r.dimension}"]
    lines.append(f"  dim End(M) = {r.endomorphism_dimension}")
    simples = d.get("simples")
    if simples is not None:
        cf = ", ".join(f"[M:L({k})] = {v}" for k, v in d["composition_factors"].items())
        lines.append(f"  composition factors: {cf}")
        lines.append(f"  radical layers (top first):   {_layers(d['radical_layers'], simples)}")
        lines.append(f"  socle layers (socle first):   {_layers(d['socle_layers'], simples)}")
        lines.append(
            f"  Loewy length {d['loewy_length']}"
            + (f"; order {d['order']}" if d.get("order") else "")
        )
    lines.append(f"  {len(r.summands)} indecomposable summand(s):")
    for s in d["summands"]:
        head = f"    #{s['index']}: dimension {s['dimension']}, class {s['isomorphism_class']}, dim End {s['endomorphism_dimension']}"
        lines.append(head)
        if "composition_factors" in s:
            lines.append(f"        radical layers: {_layers(s['radical_layers'], simples)}")
        for ident in s["identified_as"]:
            lines.append(f"        is {ident['name']}  ({ident['test']})")
        for e, blocks in s["jordan_types"].items():
            lines.append(f"        Jordan type of {e}: {_blocks(blocks)}")
    for e, blocks in d["jordan_types"].items():
        lines.append(f"  Jordan type of {e} on M: {_blocks(blocks)}")
    if "centre" in d:
        c = d["centre"]
        lines.append(f"  centre Z(A): dimension {c['dimension']}; basis in {c['terms']}")
        for b in c["basis"]:
            lines.append(f"    {b}")
        for x in c["non_semisimple_on_summands"]:
            lines.append(
                f"    {x['element']} acts non-semisimply on summand(s) {', '.join('#' + str(i) for i in x['summands'])}"
            )
    for n in r.notes:
        lines.append(f"  note: {n}")
    return "\n".join(lines)
