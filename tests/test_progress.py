"""Progress on standard error: shown on a terminal only, silent with --json and in pipes."""

from __future__ import annotations

import io
import json

from hwcat import progress
from hwcat.algebras.families.quivers import auslander_truncated_polynomial, spec_to_toml
from hwcat.cli import build_parser, main, show_progress
from hwcat.io.spec import load_spec_text
from hwcat.theory.structure import describe


class _Terminal(io.StringIO):
    def isatty(self) -> bool:
        return True


def test_progress_only_on_a_terminal_and_not_with_json():
    p = build_parser()
    assert show_progress(_Terminal(), p.parse_args(["describe", "x.toml"]))
    assert not show_progress(_Terminal(), p.parse_args(["describe", "x.toml", "--json"]))
    assert not show_progress(io.StringIO(), p.parse_args(["describe", "x.toml"]))


def test_bars_are_written_when_enabled_and_results_unchanged():
    A = load_spec_text(spec_to_toml(auslander_truncated_polynomial(3)))
    plain = describe(A).to_dict()
    out = _Terminal()
    progress.enable(out, delay=0)
    try:
        B = load_spec_text(spec_to_toml(auslander_truncated_polynomial(3)))
        shown = describe(B).to_dict()
    finally:
        progress.disable()
    assert "projective and injective modules" in out.getvalue()
    assert shown == plain and not progress.enabled()


def test_cli_in_a_pipe_writes_no_progress(tmp_path, capsys):
    path = tmp_path / "a.toml"
    path.write_text(spec_to_toml(auslander_truncated_polynomial(3)))
    assert main(["describe", str(path), "--json"]) == 0
    out, err = capsys.readouterr()
    assert json.loads(out) and err == "" and not progress.enabled()


def test_order_search_shows_progress_on_a_terminal_only():
    # results with and without bars are the same (Catalan(5) = 42 structures of linear A_5,
    # Flores-Kimura-Rognerud, arXiv:2004.04726)
    from hwcat.algebras.families.quivers import linear_A
    from hwcat.theory.search import count_structures, is_quasi_hereditary, quasi_hereditary_orders

    def run():
        A = load_spec_text(spec_to_toml(linear_A(5)))
        r = quasi_hereditary_orders(A, list_limit=None)
        B = load_spec_text(spec_to_toml(auslander_truncated_polynomial(3)))
        return r.to_dict(), count_structures(A), is_quasi_hereditary(B)

    plain = run()
    assert plain[1] == 42 and plain[0]["structures"] == 42
    out = _Terminal()
    progress.enable(out, delay=0)
    try:
        shown = run()
    finally:
        progress.disable()
    text = out.getvalue()
    assert "order search: vertex sets by size" in text
    assert "order search: listing structures" in text
    assert "order search: dead ends" in text
    assert shown == plain


def test_orders_command_in_a_pipe_or_json_writes_no_progress(tmp_path, capsys, monkeypatch):
    from hwcat.algebras.families.quivers import linear_A

    path = tmp_path / "a.toml"
    path.write_text(spec_to_toml(linear_A(5)))
    assert main(["orders", str(path)]) == 0  # stderr captured: not a terminal
    out, err = capsys.readouterr()
    assert "structures" in out and err == ""
    term = _Terminal()
    monkeypatch.setattr("sys.stderr", term)  # a terminal, but JSON asked for
    monkeypatch.setattr(progress, "enable", lambda *a, **k: term.write("enabled"))
    assert main(["orders", str(path), "--json"]) == 0
    assert json.loads(capsys.readouterr().out)["structures"] == 42
    assert term.getvalue() == "" and not progress.enabled()
    assert main(["orders", str(path)]) == 0  # the same terminal without --json: enabled
    assert term.getvalue() == "enabled"


def test_campaign_commands_follow_the_same_rule(monkeypatch):
    from hwcat.cli.campaigns import _show_progress

    p = build_parser()
    fuzz = ["fuzz", "claims.py:f", "--out", "d"]
    monkeypatch.setattr("sys.stderr", _Terminal())
    assert _show_progress(p.parse_args(fuzz))
    assert not _show_progress(p.parse_args([*fuzz, "--json"]))
    monkeypatch.setattr("sys.stderr", io.StringIO())  # a pipe
    assert not _show_progress(p.parse_args(fuzz))
