"""Fuzz campaigns and family surveys (hwcat.campaigns, ``hwcat fuzz``, ``hwcat survey``).

The parts that need no cluster are tested directly; the rest share one local
Dask cluster of two worker processes per module (started and stopped by a
fixture, which also checks that no process is left behind).
"""

from __future__ import annotations

import json
import os
import sys
import time
import tomllib
from pathlib import Path

import pytest

import hwcat
from hwcat.campaigns.generate import CHUNK, check_kinds, spec_chunk
from hwcat.campaigns.shrink import candidates, size_key
from hwcat.campaigns.surveys import parse_grid
from hwcat.campaigns.worker import Evaluator
from hwcat.cli import main
from hwcat.errors import CampaignError

distributed = pytest.importorskip("distributed")
psutil = pytest.importorskip("psutil")

CLAIMS = Path(__file__).parent / "data" / "claims.py"
FALSE_CLAIM = f"{CLAIMS}:small_algebras_are_quasi_hereditary"
RINGEL = f"{CLAIMS}:ringel_global_dimension_bound"
ALL_KINDS = ["general", "acyclic", "nakayama", "commutative"]


# -- without a cluster ---------------------------------------------------------------------


def test_generation_is_deterministic_and_kinds_are_checked():
    from hwcat.algebras.families.quivers import spec_to_toml

    a = spec_chunk(7, 2, ALL_KINDS, 3, None)
    assert a == spec_chunk(7, 2, ALL_KINDS, 3, None)
    assert a != spec_chunk(8, 2, ALL_KINDS, 3, None)
    assert len(a) == CHUNK
    for kind, spec in a:
        assert kind in ALL_KINDS
        assert 1 <= len(spec["quiver"]["vertices"]) <= 3
        hwcat.load_spec_text(spec_to_toml(spec))
    assert check_kinds(["general,acyclic", "acyclic"]) == ("general", "acyclic")
    with pytest.raises(CampaignError, match="unknown kind"):
        check_kinds(["cyclic"])


def test_commutative_kind_draws_commutativity_relations():
    from hwcat.algebras.families.quivers import spec_to_toml

    specs = [s for c in range(2) for _, s in spec_chunk(3, c, ["commutative"], 4, "QQ")]
    rels = [r for s in specs for r in s["quiver"].get("relations", [])]
    assert rels, "derived: 100 draws on up to 4 vertices give some commutative square"
    for r in rels:
        left, right = r.split(" - ")
        assert left.count("*") == right.count("*") >= 1  # same length: a homogeneous relation
    for spec in specs:  # every draw is a valid spec
        hwcat.load_spec_text(spec_to_toml(spec))


def test_shrink_moves_are_quotients_and_lower_the_size():
    spec = {
        "field": "GF(3)",
        "quiver": {
            "vertices": ["1", "2", "3"],
            "arrows": ["a: 1 -> 2", "b: 2 -> 3", "c: 1 -> 3", "x: 3 -> 3"],
            "relations": ["x*x", "a*b*x + 2*c*x"],
            "vanish_from_length": 4,
        },
    }
    cands = candidates(spec)
    assert all(size_key(c) < size_key(spec) for c in cands)
    # keeping vertex 3 alone is the quotient by e1, e2: k[x]/(x^2)  (derived)
    only3 = cands[2]["quiver"]
    assert only3 == {
        "vertices": ["3"],
        "arrows": ["x: 3 -> 3"],
        "relations": ["x*x"],
        "vanish_from_length": 4,
    }
    # deleting arrow c drops the term 2*c*x and keeps a*b*x
    no_c = [c for c in cands if c["quiver"]["arrows"] == ["a: 1 -> 2", "b: 2 -> 3", "x: 3 -> 3"]]
    assert no_c[0]["quiver"]["relations"] == ["x*x", "a*b*x"]
    from hwcat.algebras.families.quivers import spec_to_toml

    for c in cands:  # quotients (bound kept) are valid specs; without the bound, a mixed
        if c["quiver"].get("vanish_from_length"):  # relation is rejected
            hwcat.load_spec_text(spec_to_toml(c))


def test_parse_grid():
    assert parse_grid("linear-a", {"n": "1..3"}) == [{"n": 1}, {"n": 2}, {"n": 3}]
    assert parse_grid("schur", {"r": [2, 3], "field": "GF(2);GF(3)"})[3] == {
        "r": 3,
        "field": "GF(3)",
    }
    with pytest.raises(CampaignError, match="unknown parameter"):
        parse_grid("linear-a", {"m": "2"})
    with pytest.raises(CampaignError, match="empty range"):
        parse_grid("linear-a", {"n": "3..1"})


def test_evaluator_kills_a_slow_example_and_goes_on():
    claim = hwcat.campaigns.load_claim(f"{CLAIMS}:sleeps_on_loops")
    loop = (
        'field = "QQ"\n[quiver]\nvertices = ["1"]\narrows = ["x: 1 -> 1"]\nvanish_from_length = 2\n'
    )
    plain = 'field = "QQ"\n[quiver]\nvertices = ["1", "2"]\narrows = ["a: 1 -> 2"]\n'
    ev = Evaluator()
    try:
        assert ev.claim(claim, plain, 5.0)["status"] == "holds"
        pid = ev.proc.pid
        start = time.monotonic()
        assert ev.claim(claim, loop, 0.5)["status"] == "timeout"
        assert time.monotonic() - start < 5
        assert not psutil.pid_exists(pid) or psutil.Process(pid).status() == psutil.STATUS_ZOMBIE
        assert ev.claim(claim, plain, 5.0)["status"] == "holds"  # a fresh process
        assert ev.proc.pid != pid
        bad = ev.claim(claim, 'field = "QQ"\n[quiver]\nvertices = []\n', 5.0)
        assert bad["status"] == "invalid"
    finally:
        ev.stop()


PLAIN = 'field = "QQ"\n[quiver]\nvertices = ["1", "2"]\narrows = ["a: 1 -> 2"]\n'
POINT = 'field = "QQ"\n[quiver]\nvertices = ["1"]\n'


def test_a_claim_writing_to_descriptor_1_does_not_mix_with_the_answers():
    # the claim writes to descriptor 1 (a subprocess, os.write, sys.__stdout__) and starts
    # a process that reads standard input: every answer still belongs to its example
    claim = hwcat.campaigns.load_claim(f"{CLAIMS}:writes_to_the_real_stdout")
    ev = Evaluator()
    try:
        first = ev.claim(claim, PLAIN, 30.0)
        assert first["status"] == "fails" and first["dimension"] == 3
        pid = ev.proc.pid
        for _ in range(3):
            assert ev.claim(claim, POINT, 30.0)["status"] == "holds"
            assert ev.claim(claim, PLAIN, 30.0)["status"] == "fails"
        assert ev.proc.pid == pid  # nothing went wrong: the same process throughout
    finally:
        ev.stop()


_OUT_OF_STEP = """
import json, sys
for line in sys.stdin:
    req = json.loads(line)
    if req["op"] == "ping":
        print(json.dumps({"status": "ok", "seq": req["seq"]}), flush=True)
    elif req["op"] == "junk":
        print("external tool says hi", flush=True)
    else:  # an answer that belongs to another request
        print(json.dumps({"status": "holds", "seq": req["seq"] - 1}), flush=True)
"""


def test_an_unreadable_answer_is_a_crash_and_the_process_is_replaced(monkeypatch):
    ev = Evaluator()
    monkeypatch.setattr(ev, "command", [sys.executable, "-c", _OUT_OF_STEP])
    try:
        for op in ("junk", "stale"):
            ev.warm()
            pid = ev.proc.pid
            answer = ev.request({"op": op}, 30.0)
            assert answer["status"] == "crashed" and "cannot be read" in answer["message"]
            assert ev.proc is None  # never read on from a stream out of step
            assert not psutil.pid_exists(pid) or psutil.Process(pid).status() == (
                psutil.STATUS_ZOMBIE
            )
        monkeypatch.setattr(ev, "command", Evaluator().command)
        claim = hwcat.campaigns.load_claim(RINGEL)
        assert ev.claim(claim, PLAIN, 30.0)["status"] == "holds"  # a fresh process
    finally:
        ev.stop()


def test_the_workers_apply_the_resource_limits_of_the_campaign():
    from hwcat.campaigns.worker import evaluate_specs, survey_member
    from hwcat.limits import resource_limits

    claim = hwcat.campaigns.load_claim(RINGEL)
    ev = Evaluator()
    try:
        with resource_limits(max_dim=2):
            a = ev.claim(claim, PLAIN, 30.0)  # the path algebra of 1 -> 2 has dimension 3
        assert a["status"] == "invalid" and "max_dim" in a["message"]
        assert ev.claim(claim, PLAIN, 30.0)["status"] == "holds"
    finally:
        ev.stop()
    # the functions the workers run take the limits the driver sends
    limits = {"max_dim": 5, "max_vertices": 2000, "max_products": 50_000_000}
    row = survey_member("linear-a", {"n": "5"}, 60.0, limits)
    assert row["status"] == "error" and "max_dim" in row["message"]
    assert survey_member("linear-a", {"n": "2"}, 60.0, limits)["row"]["dimension"] == 3
    res = evaluate_specs(claim, [(0, PLAIN)], 30.0, {**limits, "max_dim": 2})
    assert res["results"][0]["status"] == "invalid"
    from hwcat.campaigns.worker import close_evaluators

    close_evaluators()


class _Variable:
    """A stand-in for the Dask variable: its reads fail ``failures`` times, then give ``value``."""

    def __init__(self, failures, value):
        self.failures, self.value, self.reads = failures, value, 0

    def get(self, timeout=None):
        self.reads += 1
        if self.reads <= self.failures:
            raise TimeoutError("no answer from the scheduler")
        return self.value


def test_a_failed_read_of_the_stop_variable_means_go_on(monkeypatch):
    from hwcat.campaigns import worker

    monkeypatch.setattr(worker, "_STOP_INTERVAL", 0.0)  # ask at every example
    check = worker._stop_check(None, _Variable(2, 10))
    assert [check(i) for i in range(3)] == [False, False, False]  # two failed reads, then 10
    assert check(9) is False and check(10) is True
    gone = worker._stop_check(None, _Variable(10**6, None))  # a campaign that is over
    answers = [gone(i) for i in range(worker._STOP_READ_FAILURES + 1)]
    assert answers == [False] * (worker._STOP_READ_FAILURES - 1) + [True, True]


def _answers(indices, status="holds"):
    return [{"index": i, "kind": "general", "status": status} for i in indices]


def test_every_example_is_accounted_for_and_lost_ones_make_the_campaign_incomplete():
    from hwcat.campaigns.fuzzing import FuzzReport, _tally

    # chunk 0 complete, chunk 1 returned short (its task stopped early), chunk 2 failed
    chunks = {
        0: {"results": _answers(range(CHUNK)), "digest": "a", "drawn": CHUNK},
        1: {"results": _answers(range(CHUNK, CHUNK + 7)), "digest": "b", "drawn": CHUNK},
    }
    examples = 2 * CHUNK + 20
    counts, problems, run, _, fail = _tally(chunks, [(2, "KilledWorker: x")], None, examples)
    assert fail is None and run == CHUNK + 7 == counts["holds"]
    assert counts["lost"] == (CHUNK - 7) + 20
    assert run + counts["lost"] == examples  # every example: evaluated or lost
    assert [p["status"] for p in problems] == ["lost", "lost"]
    assert f"examples {CHUNK + 7}..{2 * CHUNK - 1} were not evaluated" in problems[0]["message"]
    report = FuzzReport(
        claim="c.py:f",
        seed=0,
        examples_requested=examples,
        examples_run=run,
        settings={},
        workers=1,
        counts=counts,
        counterexample=None,
        problems=tuple(problems),
        lost_workers=(),
        digest="",
        seconds=1.0,
    )
    assert report.exit_code == 3 and not report.complete
    assert "INCOMPLETE" in report.summary() and not report.to_dict()["complete"]
    # up to a failure, only the examples before it are needed
    chunks[1]["results"] = _answers(range(CHUNK, CHUNK + 5)) + _answers([CHUNK + 5], "fails")
    counts, problems, run, _, fail = _tally(chunks, [(2, "KilledWorker: x")], CHUNK + 5, examples)
    assert fail["index"] == CHUNK + 5 and counts["lost"] == 0 and not problems
    assert run == CHUNK + 6


class _SyncClient:
    """Runs each submitted function at once, in this process (for the shrinking loop)."""

    class _Done:
        def __init__(self, value):
            self.value = value

        def result(self):
            return self.value

        def cancel(self):
            pass

    def submit(self, fn, *args, pure=True):
        return self._Done(fn(*args))


def test_shrinking_never_gives_a_larger_algebra():
    from hwcat.campaigns.fuzzing import _counterexample
    from hwcat.campaigns.worker import close_evaluators

    # k[x]/(x^3) (dimension 3) fails; deleting the relation gives k[x]/(x^5), dimension 5,
    # on which the claim fails too: a larger algebra, which shrinking must not take (derived)
    drawn = (
        'field = "QQ"\n[quiver]\nvertices = ["1"]\narrows = ["x: 1 -> 1"]\n'
        'relations = ["x*x*x"]\nvanish_from_length = 5\n'
    )
    claim = hwcat.campaigns.load_claim(f"{CLAIMS}:fails_on_odd_dimension_with_a_loop")
    ev = Evaluator()
    try:
        answer = ev.claim(claim, drawn, 30.0)
        assert answer["status"] == "fails" and answer["dimension"] == 3
        answer.update(index=0, spec=drawn)
        ce = _counterexample(_SyncClient(), claim, answer, 30.0, True)
    finally:
        ev.stop()
        close_evaluators()
    assert ce["original_dimension"] == 3 and ce["shrunk_dimension"] <= 3
    A = hwcat.load_spec_text(ce["shrunk_spec"])
    assert A.dim <= 3 and A.dim % 2 == 1  # and the claim still fails on it
    assert ce["outcome_after_shrinking"] == "returned False"


def test_generated_relations_are_distinct():
    specs = [s for c in range(4) for _, s in spec_chunk(5, c, ALL_KINDS, 3, None)]
    for spec in specs:
        rels = spec["quiver"].get("relations", [])
        assert len(rels) == len(set(rels)), rels


def test_bad_claims_exit_2_before_any_cluster(tmp_path, capsys):
    out = str(tmp_path / "o")
    assert main(["fuzz", f"{tmp_path}/none.py:f", "--out", out]) == 2
    assert "cannot read the claim file" in capsys.readouterr().err
    assert main(["fuzz", f"{CLAIMS}:no_such_claim", "--out", out]) == 2
    assert "no function 'no_such_claim'" in capsys.readouterr().err
    assert main(["fuzz", str(CLAIMS), "--out", out]) == 2
    assert "FILE.py:FUNCTION" in capsys.readouterr().err
    assert main(["fuzz", FALSE_CLAIM, "--kind", "cyclic", "--out", out]) == 2
    assert main(["fuzz", FALSE_CLAIM, "--examples", "0", "--out", out]) == 2
    assert main(["survey", "linear-a", "m=2", "-o", str(tmp_path / "t.csv")]) == 2
    assert main(["survey", "no-such-family", "n=2", "-o", str(tmp_path / "t.csv")]) == 2


def test_without_dask_the_commands_say_how_to_install_it(monkeypatch, tmp_path, capsys):
    monkeypatch.setitem(sys.modules, "distributed", None)  # import distributed fails
    assert main(["fuzz", FALSE_CLAIM, "--out", str(tmp_path)]) == 2
    assert "pip install 'hwcat[cluster]'" in capsys.readouterr().err
    assert main(["survey", "linear-a", "n=2", "-o", str(tmp_path / "t.csv")]) == 2
    assert "pip install 'hwcat[cluster]'" in capsys.readouterr().err


def test_hwcat_does_not_import_dask():
    import subprocess

    code = (
        "import sys, hwcat, hwcat.cli; print('distributed' in sys.modules, 'dask' in sys.modules)"
    )
    out = subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, check=True)
    assert out.stdout.strip() == "False False"


# -- on a local cluster --------------------------------------------------------------------


def _descendants() -> list:
    """Live child processes, except multiprocessing's resource tracker (which lives as
    long as this process, by design of the standard library)."""
    out = []
    for p in psutil.Process().children(recursive=True):
        try:
            if p.status() != psutil.STATUS_ZOMBIE and "resource_tracker" not in " ".join(
                p.cmdline()
            ):
                out.append(p)
        except psutil.NoSuchProcess:
            pass
    return out


@pytest.fixture(scope="module")
def cluster():
    import logging

    before = {p.pid for p in _descendants()}
    lc = distributed.LocalCluster(
        n_workers=2,
        threads_per_worker=1,
        processes=True,
        dashboard_address=None,
        silence_logs=logging.CRITICAL,
    )
    client = distributed.Client(lc)
    yield client
    from hwcat.campaigns.worker import close_evaluators

    client.run(close_evaluators)
    client.close()
    lc.close()
    deadline = time.monotonic() + 20
    while time.monotonic() < deadline:
        stray = [p for p in _descendants() if p.pid not in before]
        if not stray:
            break
        time.sleep(0.25)
    assert not stray, f"processes left behind: {[p.cmdline() for p in stray]}"


def test_false_claim_is_refuted_and_shrunk_to_one_vertex(cluster, tmp_path):
    # A local algebra other than the field is not quasi-hereditary (Dlab, Ringel,
    # Illinois J. Math. 33 (1989)): so the claim fails on every algebra with a loop.
    report = hwcat.campaigns.fuzz(FALSE_CLAIM, examples=100, seed=0, client=cluster, out=tmp_path)
    assert report.found and report.exit_code == 1
    ce = report.counterexample
    spec = tomllib.loads(Path(report.files["spec"]).read_text())
    assert len(spec["quiver"]["vertices"]) == 1 == ce["shrunk_vertices"]
    A = hwcat.load_spec(report.files["spec"])
    assert A.n == 1 and A.dim >= 2 and not hwcat.is_quasi_hereditary(A)
    record = json.loads(Path(report.files["record"]).read_text())
    assert record["seed"] == 0 and record["claim"] == FALSE_CLAIM
    assert record["outcome"] == "returned False" and record["spec"] == report.files["spec"]
    assert record["example_index"] == ce["index"] == report.examples_run - 1
    # every hwcat command reads the file: check says "not quasi-hereditary" (exit 1)
    assert main(["check", report.files["spec"]]) == 1
    # same seed, same counterexample, through the command line and a second client
    out2 = tmp_path / "again"
    rc = main(
        [
            "fuzz",
            FALSE_CLAIM,
            "--examples",
            "100",
            "--scheduler",
            cluster.scheduler.address,
            "--out",
            str(out2),
        ]
    )
    assert rc == 1
    again = json.loads((out2 / "campaign.json").read_text())
    assert again["counterexample"]["index"] == ce["index"]
    assert again["counterexample"]["shrunk_spec"] == ce["shrunk_spec"]
    assert again["examples_digest"] == report.digest


def test_ringel_bound_survives(cluster):
    # C. M. Ringel, J. Pure Appl. Algebra 214 (2010): quasi-hereditary with n simples
    # implies global dimension at most 2n - 2.
    report = hwcat.campaigns.fuzz(RINGEL, examples=100, seed=1, kinds=ALL_KINDS, client=cluster)
    assert not report.found and report.exit_code == 0
    assert report.examples_run == 100
    assert report.counts["holds"] + report.counts["timeout"] == 100
    assert report.counts["holds"] >= 90
    assert report.counts["invalid"] == report.counts["error"] == 0


@pytest.mark.slow
def test_ringel_bound_survives_long(cluster):
    report = hwcat.campaigns.fuzz(
        RINGEL, examples=1000, seed=2, kinds=ALL_KINDS, max_vertices=4, client=cluster, timeout=30
    )
    assert not report.found
    assert report.counts["error"] == report.counts["crashed"] == report.counts["invalid"] == 0


def test_claim_raising_on_the_first_example_is_bad_input(cluster, capsys, tmp_path):
    rc = main(
        [
            "fuzz",
            f"{CLAIMS}:raises_type_error",
            "--scheduler",
            cluster.scheduler.address,
            "--examples",
            "10",
            "--out",
            str(tmp_path),
        ]
    )
    assert rc == 2
    assert "AttributeError" in capsys.readouterr().err


def test_survey_rows_errors_and_timeouts(cluster, tmp_path):
    # linear A_n: Catalan(n) quasi-hereditary structures (Flores, Kimura, Rognerud,
    # arXiv:2004.04726); path algebras are hereditary, global dimension 1 for n >= 2
    # (Assem, Simson, Skowronski 2006).  n = 0 is not an algebra: a row says so.
    table = hwcat.campaigns.survey("linear-a", {"n": "0..4"}, client=cluster, timeout=60)
    rows = {r["n"]: r for r in table.rows}
    assert rows[0]["status"] == "error" and "at least 1" in rows[0]["message"]
    assert [rows[n]["structures"] for n in (1, 2, 3, 4)] == [1, 2, 5, 14]
    assert [rows[n]["global_dimension"] for n in (1, 2, 3, 4)] == ["0", "1", "1", "1"]
    assert all(rows[n]["quasi_hereditary"] and rows[n]["simples"] == n for n in (1, 2, 3, 4))
    # TL_n(0) is quasi-hereditary iff n is odd (Koenig-Xi criterion for the cellular
    # algebra TL_n: the cell form of the empty... from memory); the big member times out.
    csv_path = tmp_path / "tl.csv"
    rc = main(
        [
            "survey",
            "temperley-lieb",
            "n=2,3,9",
            "delta=0",
            "--scheduler",
            cluster.scheduler.address,
            "--timeout",
            "3",
            "-o",
            str(csv_path),
        ]
    )
    assert rc == 0
    lines = csv_path.read_text().splitlines()
    assert lines[0].startswith("n,delta,status,dimension,simples,quasi_hereditary")
    by_n = {line.split(",")[0]: line.split(",") for line in lines[1:]}
    assert by_n["2"][2:6] == ["ok", "2", "1", "False"]
    assert by_n["3"][2] == "ok" and by_n["3"][5] == "True"
    assert by_n["9"][2] == "timeout"


def test_a_worker_that_dies_is_reported_and_its_examples_retried(cluster, tmp_path, monkeypatch):
    marker = tmp_path / "killed"
    # the workers read the environment when the claim runs in their evaluating process,
    # which inherits the worker's environment: set it on the workers
    cluster.run(os.environ.__setitem__, "HWCAT_TEST_MARKER", str(marker))
    from hwcat.campaigns.worker import close_evaluators

    cluster.run(close_evaluators)  # fresh evaluating processes see the variable
    report = hwcat.campaigns.fuzz(
        f"{CLAIMS}:kills_its_worker_once", examples=10, seed=3, client=cluster
    )
    assert marker.exists()
    assert len(report.lost_workers) == 1
    assert report.examples_run == 10 and report.counts["holds"] == 10
    assert not report.found
    assert "lost and their tasks retried" in report.summary()


def test_limits_given_on_the_command_line_reach_the_workers(cluster, tmp_path):
    # linear A_5 has dimension 15 and A_6 dimension 21 (n(n+1)/2 paths; derived): above 5
    csv_path = tmp_path / "a.csv"
    argv = ["linear-a", "n=5..6", "--scheduler", cluster.scheduler.address]
    assert main(["survey", *argv, "--max-dim", "5", "-o", str(csv_path)]) == 0
    rows = csv_path.read_text().splitlines()[1:]
    assert [r.split(",")[1] for r in rows] == ["error", "error"]
    assert all("max_dim = 5" in r for r in rows)
    assert main(["describe", "--family", "linear-a", "n=5", "--max-dim", "5"]) == 2


def test_a_counterexample_survives_a_claim_that_writes_to_descriptor_1(cluster, tmp_path):
    claim = tmp_path / "claim.py"
    claim.write_text(
        "import subprocess\n"
        "_done = []\n"
        "def small(A):\n"
        "    if A.dim == 5 and not _done:\n"
        "        _done.append(1)\n"
        "        subprocess.run(['echo', 'external tool says hi'])\n"
        "    return A.dim <= 12\n"
    )
    report = hwcat.campaigns.fuzz(
        f"{claim}:small", examples=150, seed=2, client=cluster, out=tmp_path / "out"
    )
    assert report.found and report.counts["crashed"] == 0
    A = hwcat.load_spec(report.files["spec"])
    assert A.dim > 12  # the shrunk counterexample fails the claim
    assert A.dim <= report.counterexample["original_dimension"]
