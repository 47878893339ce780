"""SVG pictures, ``describe --svg``, the JSON Loewy diagrams and the HTML report.

The SVG files are parsed with the standard library's XML parser and the page
with its HTML parser (independent of the code that writes them).  Expected
diagrams are the hand-derived ones of ``tests/test_loewy.py`` (derived);
the Auslander algebra of k[x]/(x^3) is quasi-hereditary by T. Brüstle,
L. Hille, C. M. Ringel, G. Röhrle, Algebr. Represent. Theory 2 (1999) 295–312.
"""

from __future__ import annotations

import json
import xml.etree.ElementTree as ET
from html.parser import HTMLParser

import pytest
from test_loewy import AUSLANDER_3, ONE_SIDED, ZIGZAG

from hwcat.cli import main
from hwcat.io.html import display_label
from hwcat.io.spec import load_spec_text
from hwcat.io.svg import barycentre_order, crossings, hasse_svg, loewy_svg, quiver_svg, svg_text
from hwcat.modules import projective
from hwcat.modules.loewy import loewy_diagram

SVG = "{http://www.w3.org/2000/svg}"


def _spec(tmp_path, text, name="alg.toml"):
    p = tmp_path / name
    p.write_text(text, encoding="utf-8")
    return str(p)


def test_loewy_svg_parses_and_draws_every_node_and_edge():
    A = load_spec_text(AUSLANDER_3)
    d = loewy_diagram(projective(A, 2))
    root = ET.fromstring(svg_text(loewy_svg(d, "P(3)"), declaration=True).encode())
    assert (
        root.tag == SVG + "svg" and float(root.get("width")) > 0 and float(root.get("height")) > 0
    )
    assert len(root.findall(f".//{SVG}circle")) == len(d.nodes) == 6
    assert len(root.findall(f".//{SVG}line")) == len(d.edges) == 6
    labels = sorted(t.text for t in root.iter(SVG + "text"))
    assert labels == sorted(n.simple for n in d.nodes)
    # layers top to bottom: the top node is highest on the page
    circles = root.findall(f".//{SVG}circle")
    ys = [float(c.get("cy")) for c in circles]
    assert ys[0] == min(ys) and ys[-1] == max(ys)


def test_barycentre_removes_the_crossing_of_a_twisted_diamond():
    # layers [0], [1, 2], [3, 4] with 1-4 and 2-3: one crossing that reordering removes (derived)
    layers = [[0], [1, 2], [3, 4]]
    edges = [(0, 1), (0, 2), (1, 4), (2, 3)]
    assert crossings(layers, edges) == 1
    assert crossings(barycentre_order(layers, edges), edges) == 0


def test_quiver_and_hasse_pictures_parse():
    q = ET.fromstring(
        svg_text(quiver_svg(["p", "q"], [("a", 0, 1), ("b", 1, 0), ("x", 0, 0)], "quiver"))
    )
    assert len(q.findall(f".//{SVG}path")) == 4  # three arrows and one arrowhead
    assert {t.text for t in q.iter(SVG + "text")} == {"p", "q", "a", "b", "x"}
    h = ET.fromstring(svg_text(hasse_svg(["1", "2", "3"], [(0, 1), (1, 2)], "chain")))
    ys = {t.text: float(t.get("y")) for t in h.iter(SVG + "text")}
    assert ys["3"] < ys["2"] < ys["1"]  # the largest vertex on top


def test_describe_svg_writes_one_file_per_module(tmp_path, capsys):
    spec = _spec(tmp_path, ZIGZAG)
    out = tmp_path / "pics"
    assert main(["describe", spec, "--svg", str(out)]) == 0
    names = sorted(p.name for p in out.iterdir())
    assert names == sorted(["quiver.svg"] + [f"{k}_{v}.svg" for k in "PI" for v in "pqr"])
    for p in out.iterdir():
        root = ET.parse(p).getroot()
        assert root.tag == SVG + "svg"
    diamond = ET.parse(out / "P_q.svg").getroot()
    assert len(diamond.findall(f".//{SVG}line")) == 4
    assert "wrote 7 SVG files" in capsys.readouterr().err


def test_describe_and_check_json_carry_the_diagrams(tmp_path, capsys):
    spec = _spec(tmp_path, ONE_SIDED)
    assert main(["describe", spec, "--json"]) == 0
    d = json.loads(capsys.readouterr().out)
    pq = d["projectives"][1]
    assert [n["simple"] for n in pq["loewy_diagram"]["nodes"]] == ["q", "p", "r", "q"]
    assert [n["layer"] for n in pq["loewy_diagram"]["nodes"]] == [0, 1, 1, 2]
    assert pq["loewy_diagram"]["edges"] == [[0, 1], [0, 2], [1, 3]]  # derived
    assert pq["projective_injective"] is False
    spec = _spec(tmp_path, AUSLANDER_3, "aus.toml")
    assert main(["check", spec, "--order", "1 > 2 > 3", "--json"]) == 0
    v = json.loads(capsys.readouterr().out)
    for key in ("standard_modules", "costandard_modules", "tilting"):
        for m in v[key]:
            dg = m["loewy_diagram"]
            assert len(dg["nodes"]) == sum(m["dimension_vector"])
            assert all(
                dg["nodes"][j]["layer"] == dg["nodes"][i]["layer"] + 1 for i, j in dg["edges"]
            )
    # T(1) for the highest weight 1 is the projective-injective P(3) = I(3): a
    # projective-injective module has Delta- and nabla-filtrations, and P(3) is
    # indecomposable with [P(3) : L(1)] = 1 (derived from the diagrams)
    assert [t["projective_injective"] for t in v["tilting"]] == [True, False, False]
    assert v["tilting"][0]["dimension_vector"] == [1, 2, 3]


def test_text_output_shows_socle_layers_and_projective_injectives(tmp_path, capsys):
    spec = _spec(tmp_path, AUSLANDER_3)
    assert main(["describe", spec]) == 0
    out = capsys.readouterr().out
    assert "socle layers (top first)" in out
    assert "Projective-injective: P(3)" in out
    line = next(x for x in out.splitlines() if x.strip().startswith("P(3)"))
    assert "[projective-injective]" in line
    assert main(["check", spec, "--order", "1 > 2 > 3"]) == 0
    out = capsys.readouterr().out
    assert "socle layers" in out and "[projective-injective]" in out


class _Page(HTMLParser):
    """Collects the text, the inline SVG roots and any reference to another resource."""

    def __init__(self):
        super().__init__()
        self.text: list[str] = []
        self.svgs: list[dict[str, str]] = []
        self.external: list[str] = []
        self.stack: list[str] = []
        self.figures: list[list[str]] = []

    def handle_starttag(self, tag, attrs):
        a = dict(attrs)
        if tag == "svg":
            self.svgs.append(a)
        if tag == "figure":
            self.figures.append([])
        if tag in ("script", "link", "img", "iframe", "object", "embed"):
            self.external.append(tag)
        for k in ("src", "href"):
            if k in a and not (a[k] or "").startswith("#"):
                self.external.append(f"{tag} {k}={a[k]}")
        if tag == "svg" and self.figures:
            self.figures[-1].append(a.get("aria-label", ""))

    def handle_data(self, data):
        self.text.append(data)


def _report(tmp_path, text, *args):
    spec = _spec(tmp_path, text)
    out = tmp_path / "report.html"
    assert main(["report", spec, *args, "-o", str(out)]) == 0
    return out


def test_report_is_self_contained_and_pictures_every_module(tmp_path):
    out = _report(tmp_path, AUSLANDER_3, "--order", "1 > 2 > 3")
    html = out.read_text(encoding="utf-8")
    page = _Page()
    page.feed(html)
    page.close()
    assert page.external == []
    assert "@import" not in html and "url(http" not in html and "@font-face" not in html
    text = " ".join(page.text)
    assert "Auslander algebra of k[x]/(x^3)" in text
    labels = [f"{k}({v})" for k in ("P", "I", "Δ", "∇", "T") for v in "123"]
    pictured = {s.get("aria-label") for s in page.svgs}
    for lab in labels:
        assert lab in text
        assert f"Loewy diagram of {lab}" in pictured
    # quiver, the order checked, one structure, 15 modules
    assert len(page.svgs) == 1 + 1 + 1 + 15
    for word in ("C = D·Eᵀ", "BGG reciprocity", "standard-schurian", "heredity-chain"):
        assert word in text
    assert "quasi-hereditary" in text and "Global dimension" in text


def test_report_of_an_algebra_that_is_not_quasi_hereditary(tmp_path):
    # k[x]/(x^2): one simple, Delta = P has [Delta : L] = 2, so no order works (derived)
    text = 'name = "dual numbers"\nfield = "QQ"\n[quiver]\nvertices = ["1"]\narrows = ["x: 1 -> 1"]\nvanish_from_length = 2\n'
    out = _report(tmp_path, text)
    page = _Page()
    page.feed(out.read_text(encoding="utf-8"))
    body = " ".join(page.text)
    assert "not quasi-hereditary" in body and "fails" in body
    assert "T(1)" not in body  # no tilting modules without a quasi-hereditary order
    assert {f"Loewy diagram of {x}(1)" for x in ("P", "I", "Δ", "∇")} <= {
        s.get("aria-label") for s in page.svgs
    }


def test_report_errors_are_one_line(tmp_path, capsys):
    spec = _spec(tmp_path, ZIGZAG)
    assert main(["report", spec, "--order", "p > nowhere", "-o", str(tmp_path / "x.html")]) == 2
    err = capsys.readouterr().err
    assert err.startswith("hwcat: error: --order") and err.count("\n") == 1


@pytest.mark.parametrize("label", ["Delta(1)", "nabla(a')"])
def test_display_labels_use_greek_letters(label):
    assert display_label(label)[0] in "Δ∇"
