"""SVG pictures: Loewy diagrams, the Gabriel quiver and Hasse diagrams of orders.

Renderers only: the diagrams (nodes, edges, cover relations) are computed in
the modules and theory layers; this module places them on the page and writes
SVG with :mod:`xml.etree.ElementTree`.

Layout
------
Loewy and Hasse diagrams are drawn in layers, top to bottom.  The order of the
nodes inside each layer is chosen by the barycentre heuristic (Sugiyama,
Tagawa, Toda 1981, from memory): sweeps down and up the layers sort each layer
by the mean position of its neighbours in the layer just visited, and the
ordering with the fewest crossings between adjacent layers is kept.  The quiver
is an arc diagram: vertices on a line in spec order, arrows to the right as
arcs above it, arrows to the left as arcs below it, loops as small loops above.

Examples
--------
>>> from hwcat.io.spec import load_spec_text
>>> from hwcat.modules import projective
>>> from hwcat.modules.loewy import loewy_diagram
>>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["1", "2"]\\narrows = ["a: 1 -> 2"]')
>>> text = svg_text(loewy_svg(loewy_diagram(projective(A, 0)), "P(1)"))
>>> text.startswith("<svg") and text.count("<circle") == 2 and text.count("<line") == 1
True
"""

from __future__ import annotations

import xml.etree.ElementTree as ET
from collections.abc import Sequence

__all__ = [
    "loewy_svg",
    "quiver_svg",
    "hasse_svg",
    "svg_text",
    "barycentre_order",
    "crossings",
    "file_names",
]

SVG_NS = "http://www.w3.org/2000/svg"

# light fills, one per simple (cycled); dark text reads on all of them
PALETTE = (
    "#cfe3f7",
    "#f9d6c4",
    "#d4edc9",
    "#ead5f2",
    "#fbefb8",
    "#c9ece8",
    "#f4cfe0",
    "#e0e0e0",
)
STROKE = "#333333"
FONT = "system-ui, -apple-system, 'Segoe UI', Roboto, 'Helvetica Neue', Arial, sans-serif"

LAYER_GAP = 58
MARGIN = 16
NODE_H = 26


def _num(x: float) -> str:
    """Coordinates as short decimal text (layout only; no mathematics)."""
    return f"{x:.1f}".rstrip("0").rstrip(".")


def _root(width: float, height: float, title: str, css_class: str) -> ET.Element:
    svg = ET.Element(
        "svg",
        {
            "xmlns": SVG_NS,
            "class": css_class,
            "width": _num(width),
            "height": _num(height),
            "viewBox": f"0 0 {_num(width)} {_num(height)}",
            "role": "img",
            "aria-label": title,
            "font-family": FONT,
            "font-size": "13",
        },
    )
    ET.SubElement(svg, "title").text = title
    return svg


def svg_text(svg: ET.Element, declaration: bool = False) -> str:
    """The SVG element as text (with an XML declaration for a standalone file)."""
    body = ET.tostring(svg, encoding="unicode")
    return ('<?xml version="1.0" encoding="UTF-8"?>\n' + body + "\n") if declaration else body


# -- layered layout ------------------------------------------------------------------


def crossings(order: Sequence[Sequence[int]], edges: Sequence[tuple[int, int]]) -> int:
    """Number of crossing pairs among edges joining adjacent layers of a layered drawing.

    >>> crossings([[0, 1], [2, 3]], [(0, 3), (1, 2)])
    1
    >>> crossings([[0, 1], [3, 2]], [(0, 3), (1, 2)])
    0
    """
    where = {}
    for k, layer in enumerate(order):
        for i, v in enumerate(layer):
            where[v] = (k, i)
    by_layer: dict[int, list[tuple[int, int]]] = {}
    for u, w in edges:
        (ku, iu), (kw, iw) = where[u], where[w]
        if kw == ku + 1:
            by_layer.setdefault(ku, []).append((iu, iw))
    total = 0
    for segs in by_layer.values():
        for a in range(len(segs)):
            for b in range(a + 1, len(segs)):
                (p1, q1), (p2, q2) = segs[a], segs[b]
                if (p1 - p2) * (q1 - q2) < 0:
                    total += 1
    return total


def barycentre_order(
    layers: Sequence[Sequence[int]], edges: Sequence[tuple[int, int]], sweeps: int = 4
) -> list[list[int]]:
    """Orders of the nodes in each layer that reduce crossings (barycentre heuristic).

    ``layers`` lists node ids per layer, top first; ``edges`` are pairs of node
    ids.  Deterministic: ties keep the current order.

    >>> barycentre_order([[0, 1], [2, 3]], [(0, 3), (1, 2)])
    [[0, 1], [3, 2]]
    """
    order = [list(layer) for layer in layers]
    nbrs: dict[int, set[int]] = {v: set() for layer in layers for v in layer}
    for u, w in edges:
        nbrs[u].add(w)
        nbrs[w].add(u)

    def pos_map() -> dict[int, int]:
        return {v: i for layer in order for i, v in enumerate(layer)}

    def resort(k: int, ref: int) -> None:
        pos = pos_map()
        ref_set = set(order[ref])

        def key(iv: tuple[int, int]) -> tuple[float, int]:
            i, v = iv
            ns = [pos[x] for x in nbrs[v] if x in ref_set]
            return (sum(ns) / len(ns) if ns else float(i), i)

        order[k] = [v for _, v in sorted(enumerate(order[k]), key=key)]

    best = [list(x) for x in order]
    best_c = crossings(best, edges)
    for _ in range(sweeps):
        if best_c == 0:
            break
        for k in range(1, len(order)):
            resort(k, k - 1)
        for k in range(len(order) - 2, -1, -1):
            resort(k, k + 1)
        c = crossings(order, edges)
        if c < best_c:
            best, best_c = [list(x) for x in order], c
    return best


def _label_width(text: str) -> float:
    return max(NODE_H, 8.0 * len(text) + 14)


def _layered_svg(
    labels: Sequence[str],
    colours: Sequence[int],
    layers: Sequence[Sequence[int]],
    edges: Sequence[tuple[int, int]],
    title: str,
    css_class: str,
    edge_titles: Sequence[str] | None = None,
) -> ET.Element:
    order = barycentre_order(layers, edges)
    slot = max([_label_width(x) for x in labels] + [NODE_H]) + 18
    widest = max([len(layer) for layer in order] + [1])
    width = 2 * MARGIN + widest * slot
    height = 2 * MARGIN + NODE_H + LAYER_GAP * max(len(order) - 1, 0)
    pos: dict[int, tuple[float, float]] = {}
    for k, layer in enumerate(order):
        x0 = (width - len(layer) * slot) / 2 + slot / 2
        for i, v in enumerate(layer):
            pos[v] = (x0 + i * slot, MARGIN + NODE_H / 2 + k * LAYER_GAP)
    svg = _root(width, height, title, css_class)
    g_edges = ET.SubElement(svg, "g", {"class": "edges", "stroke": STROKE, "stroke-width": "1.6"})
    for e, (u, w) in enumerate(edges):
        (x1, y1), (x2, y2) = pos[u], pos[w]
        line = ET.SubElement(
            g_edges,
            "line",
            {
                "x1": _num(x1),
                "y1": _num(y1 + NODE_H / 2),
                "x2": _num(x2),
                "y2": _num(y2 - NODE_H / 2),
            },
        )
        if edge_titles is not None and edge_titles[e]:
            ET.SubElement(line, "title").text = edge_titles[e]
    g_nodes = ET.SubElement(svg, "g", {"class": "nodes"})
    for v in sorted(pos):
        x, y = pos[v]
        g = ET.SubElement(g_nodes, "g", {"class": "node"})
        fill = PALETTE[colours[v] % len(PALETTE)]
        w = _label_width(labels[v])
        if w <= NODE_H:
            ET.SubElement(
                g,
                "circle",
                {
                    "cx": _num(x),
                    "cy": _num(y),
                    "r": _num(NODE_H / 2),
                    "fill": fill,
                    "stroke": STROKE,
                },
            )
        else:
            ET.SubElement(
                g,
                "rect",
                {
                    "x": _num(x - w / 2),
                    "y": _num(y - NODE_H / 2),
                    "width": _num(w),
                    "height": _num(NODE_H),
                    "rx": _num(NODE_H / 2),
                    "fill": fill,
                    "stroke": STROKE,
                },
            )
        t = ET.SubElement(
            g,
            "text",
            {"x": _num(x), "y": _num(y), "text-anchor": "middle", "dominant-baseline": "central"},
        )
        t.text = labels[v]
    return svg


# -- the three pictures ----------------------------------------------------------------


def loewy_svg(diagram, title: str) -> ET.Element:
    """The Loewy diagram of a module (a :class:`~hwcat.modules.loewy.LoewyDiagram`)."""
    nodes = diagram.nodes
    nlayers = 1 + max((n.layer for n in nodes), default=-1)
    layers: list[list[int]] = [[] for _ in range(nlayers)]
    for i, n in enumerate(nodes):
        layers[n.layer].append(i)
    return _layered_svg(
        [n.simple for n in nodes],
        [n.vertex for n in nodes],
        layers,
        list(diagram.edges),
        f"Loewy diagram of {title}",
        "loewy",
        ["arrows " + ", ".join(a) for a in diagram.edge_arrows],
    )


def hasse_svg(vertices: Sequence[str], covers: Sequence[tuple[int, int]], title: str) -> ET.Element:
    """The Hasse diagram of a partial order: larger vertices higher, one line per cover.

    ``covers`` holds pairs ``(smaller, larger)`` of vertex indices (the cover
    relations, from :meth:`~hwcat.theory.orders.PartialOrder.covers`).

    >>> svg = hasse_svg(["1", "2", "3"], [(0, 2), (1, 2)], "order")
    >>> svg_text(svg).count("<line")
    2
    """
    n = len(vertices)
    above: dict[int, list[int]] = {v: [] for v in range(n)}
    for a, b in covers:
        above[a].append(b)
    level: dict[int, int] = {}

    def depth(v: int) -> int:
        if v not in level:
            level[v] = 1 + max((depth(u) for u in above[v]), default=-1)
        return level[v]

    for v in range(n):
        depth(v)
    nlev = 1 + max(level.values(), default=-1)
    layers: list[list[int]] = [[] for _ in range(nlev)]
    for v in range(n):
        layers[level[v]].append(v)
    edges = [(b, a) for a, b in covers]  # drawn from the larger (upper) vertex down
    return _layered_svg(list(vertices), list(range(n)), layers, edges, title, "hasse")


def quiver_svg(
    vertices: Sequence[str], arrows: Sequence[tuple[str, int, int]], title: str, ident: str = "q"
) -> ET.Element:
    """The Gabriel quiver as an arc diagram; ``arrows`` holds ``(name, source, target)``.

    ``ident`` makes the ids inside the picture unique when several pictures
    share one page.

    >>> svg = quiver_svg(["1", "2"], [("a", 0, 1), ("b", 1, 0), ("x", 0, 0)], "quiver")
    >>> svg_text(svg).count("<path")
    4
    """
    n = len(vertices)
    slot = max([_label_width(x) for x in vertices] + [NODE_H]) + 40
    r = NODE_H / 2
    seen: dict[tuple[int, int], int] = {}
    shapes = []  # (kind, s, t, rank, name)
    up = down = 0.0
    for name, s, t in arrows:
        key = (min(s, t), max(s, t)) if s != t else (s, s)
        key = key + ((1,) if s < t else (-1,) if s > t else (0,))
        rank = seen.get(key, 0)
        seen[key] = rank + 1
        if s == t:
            h = 30 + 14 * rank
            up = max(up, h + 12)
        else:
            h = 26 + 22 * abs(s - t) + 16 * rank
            if s < t:
                up = max(up, h / 2 + 16)
            else:
                down = max(down, h / 2 + 16)
        shapes.append((s, t, h, name))
    width = 2 * MARGIN + n * slot
    y = MARGIN + r + up
    height = y + r + down + MARGIN
    svg = _root(width, height, title, "quiver")
    defs = ET.SubElement(svg, "defs")
    marker = ET.SubElement(
        defs,
        "marker",
        {
            "id": f"{ident}-head",
            "viewBox": "0 0 10 10",
            "refX": "9",
            "refY": "5",
            "markerWidth": "7",
            "markerHeight": "7",
            "orient": "auto-start-reverse",
        },
    )
    ET.SubElement(marker, "path", {"d": "M 0 0 L 10 5 L 0 10 z", "fill": STROKE})
    xs = [MARGIN + slot / 2 + i * slot for i in range(n)]
    g_arrows = ET.SubElement(
        svg, "g", {"class": "arrows", "fill": "none", "stroke": STROKE, "stroke-width": "1.5"}
    )
    g_labels = ET.SubElement(svg, "g", {"class": "arrow-labels", "text-anchor": "middle"})
    for s, t, h, name in shapes:
        if s == t:
            x = xs[s]
            d = (
                f"M {_num(x - 6)} {_num(y - r + 1)} C {_num(x - 22)} {_num(y - r - h)} "
                f"{_num(x + 22)} {_num(y - r - h)} {_num(x + 6)} {_num(y - r + 1)}"
            )
            lx, ly = x, y - r - 0.75 * h - 4
        else:
            sign = -1 if s < t else 1
            x1, x2 = xs[s], xs[t]
            y1 = y + sign * (r - 2)
            cx, cy = (x1 + x2) / 2, y + sign * h
            d = f"M {_num(x1)} {_num(y1)} Q {_num(cx)} {_num(cy)} {_num(x2)} {_num(y1)}"
            lx, ly = cx, y + sign * (r / 2 + h / 2) + (-4 if sign < 0 else 12)
        path = ET.SubElement(g_arrows, "path", {"d": d, "marker-end": f"url(#{ident}-head)"})
        ET.SubElement(path, "title").text = f"{name}: {vertices[s]} -> {vertices[t]}"
        lab = ET.SubElement(g_labels, "text", {"x": _num(lx), "y": _num(ly), "font-size": "12"})
        lab.text = name
    g_nodes = ET.SubElement(svg, "g", {"class": "nodes"})
    for i, v in enumerate(vertices):
        g = ET.SubElement(g_nodes, "g", {"class": "node"})
        w = _label_width(v)
        ET.SubElement(
            g,
            "rect",
            {
                "x": _num(xs[i] - w / 2),
                "y": _num(y - r),
                "width": _num(w),
                "height": _num(NODE_H),
                "rx": _num(r),
                "fill": PALETTE[i % len(PALETTE)],
                "stroke": STROKE,
            },
        )
        t = ET.SubElement(
            g,
            "text",
            {
                "x": _num(xs[i]),
                "y": _num(y),
                "text-anchor": "middle",
                "dominant-baseline": "central",
            },
        )
        t.text = v
    return svg


def file_names(labels: Sequence[str], suffix: str = ".svg") -> list[str]:
    """Stable file names for module labels: ``P(1)`` -> ``P_1.svg``.

    Characters other than letters, digits, ``.``, ``-`` and ``_`` become ``_``
    (a prime ``'`` becomes ``p``); a name that would repeat gets ``-2``,
    ``-3``, ... in the order given.

    >>> file_names(["P(1)", "I(a')", "P(1)"])
    ['P_1.svg', 'I_ap.svg', 'P_1-2.svg']
    """
    out, used = [], set()
    for label in labels:
        base = label.replace("'", "p").replace(")", "")
        base = "".join(c if c.isascii() and (c.isalnum() or c in "._-") else "_" for c in base)
        name, k = base, 1
        while name in used:
            k += 1
            name = f"{base}-{k}"
        used.add(name)
        out.append(name + suffix)
    return out
