"""The HTML report in a real browser: headless Chromium renders it.

Chromium (the Debian package ``chromium``) loads a test-only copy of the page
with a small inline script that writes the page's rendered text
(``document.body.innerText``) and the on-screen size of every SVG
(``getBoundingClientRect``) into the DOM; ``--dump-dom`` reads them back.
A second run takes a screenshot of the page itself.  The browser is an
outside reference for "the page renders"; the expected labels are those of the
hand-derived diagrams in ``tests/test_loewy.py`` (derived).  Skipped, with the
reason, only when no Chromium is installed (``.ci/run`` installs it).
"""

from __future__ import annotations

import html
import re
import shutil
import subprocess

import pytest
from test_loewy import AUSLANDER_3

from hwcat.cli import main

CHROMIUM = shutil.which("chromium") or shutil.which("chromium-browser")

pytestmark = pytest.mark.skipif(
    CHROMIUM is None, reason="headless browser test: no chromium on PATH (apt-get install chromium)"
)

MEASURE = """
<script>
(function () {
  var out = [];
  document.querySelectorAll("svg").forEach(function (s) {
    var r = s.getBoundingClientRect();
    out.push([s.getAttribute("aria-label"), r.width, r.height].join("|"));
  });
  var m = document.createElement("pre");
  m.id = "measured-svgs";
  m.textContent = out.join("\\n");
  var t = document.createElement("pre");
  t.id = "rendered-text";
  t.textContent = document.body.innerText;
  document.body.appendChild(m);
  document.body.appendChild(t);
})();
</script>
"""


def _chromium(tmp_path, *args: str) -> subprocess.CompletedProcess:
    cmd = [
        CHROMIUM,
        "--headless",
        "--no-sandbox",
        "--disable-gpu",
        "--disable-quic",
        "--no-first-run",
        "--disable-background-networking",
        "--disable-component-update",
        "--disable-sync",
        "--hide-scrollbars",
        f"--user-data-dir={tmp_path / 'profile'}",
        *args,
    ]
    return subprocess.run(cmd, capture_output=True, text=True, timeout=180, check=False)


def _pre(dom: str, ident: str) -> str:
    m = re.search(rf'<pre id="{ident}">(.*?)</pre>', dom, re.S)
    assert m, f"the script's output {ident!r} is missing from the dumped DOM"
    return html.unescape(m.group(1))


def test_report_renders_in_headless_chromium(tmp_path):
    spec = tmp_path / "auslander.toml"
    spec.write_text(AUSLANDER_3, encoding="utf-8")
    page = tmp_path / "report.html"
    assert main(["report", str(spec), "-o", str(page)]) == 0
    text = page.read_text(encoding="utf-8")
    probe = tmp_path / "probe.html"
    probe.write_text(text.replace("</body>", MEASURE + "</body>"), encoding="utf-8")

    run = _chromium(tmp_path, "--window-size=1000,1400", "--dump-dom", probe.as_uri())
    assert run.returncode == 0, run.stderr[-2000:]
    rendered = _pre(run.stdout, "rendered-text")
    assert "Auslander algebra of k[x]/(x^3)" in rendered
    for kind in ("P", "I", "Δ", "∇", "T"):
        for v in "123":
            assert f"{kind}({v})" in rendered, f"{kind}({v}) is not on the rendered page"
    sizes = [line.split("|") for line in _pre(run.stdout, "measured-svgs").splitlines()]
    # the quiver, the order checked, one structure and 15 Loewy diagrams
    assert len(sizes) == text.count("<svg") == 18
    for label, w, h in sizes:
        assert float(w) > 0 and float(h) > 0, f"{label} has no size on screen ({w} x {h})"
    loewy = {label for label, _, _ in sizes if label.startswith("Loewy diagram of ")}
    assert len(loewy) == 15

    shot = tmp_path / "report.png"
    run = _chromium(tmp_path, "--window-size=1000,1400", f"--screenshot={shot}", page.as_uri())
    assert run.returncode == 0, run.stderr[-2000:]
    data = shot.read_bytes()
    assert data[:8] == b"\x89PNG\r\n\x1a\n" and len(data) > 20_000
