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
