"""The spin-chain route for Temperley--Lieb (:mod:`hwcat.algebras.families.tl_module`)
checked against the table route (the old path) and against outside facts.

Sources: ``dim TL_n = Catalan(n)`` (from memory); the spin chain's generators satisfy
the Temperley--Lieb relations and the chain is faithful (quantum Schur-Weyl
duality, Jimbo 1986, Martin 1991; faithfulness from memory, and certified by
every run through the count ``sum dim L dim P = Catalan(n)``).  The cell module
with ``t`` through strands has dimension ``binomial(n, k) - binomial(n, k - 1)``,
``k = (n - t)/2`` (from memory): at a ``delta`` where ``TL_n`` is semisimple the
simples are the cell modules.
"""

from __future__ import annotations

import json
import random
from math import comb

import numpy as np
import pytest

from hwcat.algebras.families import registry
from hwcat.algebras.families import tl_module as tlm
from hwcat.algebras.families.registry import family_algebra, family_reduction
from hwcat.algebras.families.spin_chain import loop_weight_root, spin_chain_generators
from hwcat.algebras.families.tl_module import (
    ModuleReduction,
    module_reduction_of,
    module_route_available,
    reduce_temperley_lieb,
)
from hwcat.cli import main
from hwcat.errors import InternalInconsistency, SpecError
from hwcat.exact import GF, restrict_scalars
from hwcat.theory.structure import describe

# (delta, p) with q + 1/q = delta in GF(p): delta = 0 needs q^2 = -1, delta = 1 needs
# q^2 - q + 1 = 0 (derived)
VALID = [(0, 2), (0, 5), (0, 13), (1, 3), (1, 7), (1, 13)]
# (delta, p) with q only in GF(p^2): q^2 - delta q + 1 irreducible mod p (derived: x^2 + 1
# has no root mod 3, 7, 11; x^2 - x + 1 none mod 2, 5, 11; x^2 - 3x + 1 none mod 7, its
# discriminant 5 not being a square mod 7; x^2 - 4x + 1 none mod 5, discriminant 12 = 2)
RESTRICTED = [(0, 3), (0, 7), (0, 11), (1, 2), (1, 5), (1, 11), (3, 7), (4, 5)]


def _structure(B) -> dict:
    """The structure report of ``B`` with every vertex-indexed item keyed by the labels
    (two reductions may number simples of equal dimensions differently)."""
    d = describe(B).to_dict()
    v = d["simples"]
    # the table route writes the centre in the diagram basis, this route in paths
    d.pop("centre_basis", None)
    d.pop("centre_terms", None)

    def by_vertex(vec):
        return dict(zip(v, vec, strict=True))

    def module(m):
        return {
            "dimension": m["dimension"],
            "dimension_vector": by_vertex(m["dimension_vector"]),
            "radical_layers": [by_vertex(x) for x in m["radical_layers"]],
            "socle_layers": [by_vertex(x) for x in m["socle_layers"]],
            "loewy_length": m["loewy_length"],
            "projective_injective": m["projective_injective"],
            "layers_of_diagram": sorted(
                (n["layer"], n["simple"]) for n in m["loewy_diagram"]["nodes"]
            ),
            "edges": len(m["loewy_diagram"]["edges"]),
        }

    d["simples"] = sorted(v)
    d["arrows"] = sorted((a["source"], a["target"]) for a in d["arrows"])
    d["cartan"] = {(a, b): d["cartan"][i][j] for i, a in enumerate(v) for j, b in enumerate(v)}
    d["projectives"] = {m["label"]: module(m) for m in d["projectives"]}
    d["injectives"] = {m["label"]: module(m) for m in d["injectives"]}
    d["blocks"] = sorted(sorted(b) for b in d["blocks"])
    d["simple_dimensions"] = by_vertex(d["simple_dimensions"])
    return d


def _compare(n: int, delta: int, p: int, seed: int = 0) -> None:
    field = f"GF({p})"
    mod = reduce_temperley_lieb(n, delta, field, seed=seed)
    tab = family_reduction("temperley-lieb", n=n, delta=str(delta), field=field, route="table")

    # vertices are numbered by (dim L, dim P) in both routes; ties in either order
    def numbered(r):
        return sorted(
            zip(r.simple_dimensions, r.projective_dimensions, r.basic.vertices, strict=True)
        )

    assert numbered(mod) == numbered(tab)
    assert mod.radical_dimension == tab.radical_dimension
    assert mod.basic.natural_order == tab.basic.natural_order
    assert _structure(mod.basic) == _structure(tab.basic)


@pytest.mark.parametrize(
    "n, delta, p",
    [(2, 0, 5), (3, 1, 3), (4, 0, 2), (5, 0, 5), (6, 0, 2), (6, 1, 3), (6, 1, 7), (7, 0, 13)]
    # q only in GF(p^2): the chain over GF(p^2) restricted to GF(p)
    + [(2, 0, 3), (3, 1, 2), (4, 0, 7), (5, 1, 5), (6, 0, 3), (6, 1, 2), (7, 0, 7), (7, 1, 5)],
)
def test_agrees_with_the_table_route(n: int, delta: int, p: int) -> None:
    # labels, dimensions, Cartan matrix, quiver, Loewy layers, heredity: everything the
    # structure report says, from the old path and the new one
    _compare(n, delta, p)


@pytest.mark.parametrize("restricted, seed", [(False, 20261202), (True, 20261203)])
def test_agrees_with_the_table_route_on_random_cases(restricted: bool, seed: int) -> None:
    rng = random.Random(seed)
    for _ in range(4):
        n = rng.randint(2, 7)
        delta, p = rng.choice(RESTRICTED if restricted else VALID)
        _compare(n, delta, p, seed=rng.randrange(1000))


def test_semisimple_case_gives_the_cell_modules() -> None:
    # q = 2 in GF(101): delta = 2 + 1/2 = 53, and q^2 has order 50 > 7, so TL_7 is
    # semisimple (from memory: semisimple unless q^2 is a root of unity of order <= n; derived)
    red = reduce_temperley_lieb(7, 53, "GF(101)")
    cells = {str(7 - 2 * k): comb(7, k) - (comb(7, k - 1) if k else 0) for k in range(4)}
    assert dict(zip(red.basic.vertices, red.simple_dimensions, strict=True)) == cells
    assert red.radical_dimension == 0
    assert red.simple_dimensions == red.projective_dimensions


def test_chain_action_is_the_spin_chain() -> None:
    # the sector-by-sector action used here is the spin chain's generator, restricted
    n, F = 5, GF(5)
    q = loop_weight_root(0, F)
    ch = tlm._chain(n, 0, F)
    assert ch.degree == 1 and ch.scalars == "GF(5)"
    gens = spin_chain_generators(n, q, F)
    states = [[s for s in range(1 << n) if bin(s).count("1") == k] for k in range(n // 2 + 1)]
    for i in range(n - 1):
        G = gens[f"e{i + 1}"]
        for k, st in enumerate(states):
            d = len(st)
            full = np.array([[int(G[a, b]) for b in st] for a in st], dtype=np.int64)
            eye = np.eye(d, dtype=np.int64)
            assert (ch.right(eye, i, k) == full).all()
            assert (ch.left_t(eye, i, k) == full.T).all()


@pytest.mark.parametrize("n, delta, p", [(5, 0, 3), (4, 1, 2), (5, 3, 7)])
def test_restricted_chain_action_is_the_spin_chain_over_the_extension(n, delta, p) -> None:
    # q not in GF(p): the action is the spin chain over GF(p^2) = GF(p)[q]/(q^2 - delta q + 1),
    # its matrices restricted to GF(p) by the exact layer's own restriction of scalars
    F = GF(p)
    K, q = tlm.chain_scalars(delta, F)
    assert K.degree == 2 and q * q - K(delta) * q + 1 == 0
    ch = tlm._chain(n, delta, F)
    assert ch.degree == 2 and ch.scalars == f"{K.name} restricted to GF({p})"
    gens = spin_chain_generators(n, q, K)
    states = [[s for s in range(1 << n) if bin(s).count("1") == k] for k in range(n // 2 + 1)]
    for i in range(n - 1):
        G = restrict_scalars(gens[f"e{i + 1}"])
        for k, st in enumerate(states):
            idx = [2 * s + a for s in st for a in (0, 1)]
            full = np.array([[int(G[a, b]) for b in idx] for a in idx], dtype=np.int64)
            eye = np.eye(len(idx), dtype=np.int64)
            assert (ch.right(eye, i, k) == full).all()
            assert (ch.left_t(eye, i, k) == full.T).all()
            # e_i^2 = delta e_i on the restricted sector (the TL relation over GF(p), derived)
            assert (ch.right(full, i, k) == (delta * full) % p).all()


def test_counts_are_certified(monkeypatch: pytest.MonkeyPatch) -> None:
    # a wrong dimension of the algebra (as if the module were not faithful) is caught
    orig = tlm._Search.__init__

    def wrong(self, chain, seed):
        orig(self, chain, seed)
        self.total += 1

    monkeypatch.setattr(tlm._Search, "__init__", wrong)
    with pytest.raises(InternalInconsistency):
        reduce_temperley_lieb(5, 0, "GF(5)")


def test_route_parameter() -> None:
    assert module_route_available(0, "GF(5)")
    assert module_route_available(0, "GF(3)")  # x^2 + 1 is irreducible mod 3: GF(9) restricted
    assert not module_route_available(2, "QQ")  # not a prime field
    assert not module_route_available(2, "GF(16777259)")  # above the int64-safe bound
    with pytest.raises(SpecError, match="2\\^24"):
        reduce_temperley_lieb(3, 2, "GF(16777259)")
    with pytest.raises(SpecError, match="route"):
        family_reduction("temperley-lieb", n=4, delta="0", field="GF(5)", route="fast")
    red = family_reduction("temperley-lieb", n=4, delta="0", field="GF(3)", route="spin-chain")
    assert isinstance(red, ModuleReduction) and red.chain_field.endswith("restricted to GF(3)")
    with pytest.raises(SpecError, match="prime field"):
        family_reduction("temperley-lieb", n=4, delta="2", field="QQ", route="spin-chain")
    red = family_reduction("temperley-lieb", n=4, delta="0", field="GF(5)", route="spin-chain")
    assert isinstance(red, ModuleReduction)
    assert module_reduction_of(red.basic) is red


def test_auto_route_threshold(monkeypatch: pytest.MonkeyPatch) -> None:
    monkeypatch.setattr(registry, "TL_SPIN_CHAIN_FROM", 5)
    B = family_algebra("temperley-lieb", n=5, delta="0", field="GF(5)")
    assert module_reduction_of(B) is not None
    B = family_algebra("temperley-lieb", n=4, delta="0", field="GF(5)")
    assert module_reduction_of(B) is None  # below the threshold: the table
    B = family_algebra("temperley-lieb", n=5, delta="0", field="GF(3)")
    assert module_reduction_of(B) is not None  # no q in GF(3): the chain over GF(9)
    B = family_algebra("temperley-lieb", n=5, delta="0", field="QQ")
    assert module_reduction_of(B) is None  # not a prime field: the table


def test_to_dict_says_idempotents_are_missing() -> None:
    red = reduce_temperley_lieb(5, 1, "GF(7)")
    d = json.loads(json.dumps(red.to_dict()))
    assert d["idempotents"] is None and "spin chain" in d["idempotents_note"]
    assert d["dimension"] == 42 and d["method"] == "spin chain"
    pairs = zip(d["simple_dimensions"], d["projective_dimensions"], strict=True)
    assert sum(a * b for a, b in pairs) == 42
    assert len(d["sector_ranks"]) == len(d["simples"])
    assert d["spin_chain_field"] == "GF(7)"
    d = reduce_temperley_lieb(5, 1, "GF(5)").to_dict()
    assert d["spin_chain_field"] == "GF(5)[q]/(q^2 + 4*q + 1) restricted to GF(5)"
    # each simple first occurs once in M_k over GF(25): rank 2 over GF(5) (derived)
    assert all(next(r for r in ranks if r) == 2 for ranks in d["sector_ranks"])


def test_command_line(capsys: pytest.CaptureFixture) -> None:
    code = main(["family", "temperley-lieb", "n=6", "delta=0", "field=GF(5)", "route=spin-chain"])
    out = capsys.readouterr().out
    assert code == 0 and "spin chain over GF(5) " in out
    code = main(["family", "temperley-lieb", "n=5", "delta=0", "field=GF(3)", "route=spin-chain"])
    out = capsys.readouterr().out
    assert code == 0 and "spin chain over GF(3)[q]/(q^2 + 1) restricted to GF(3)" in out
    code = main(
        ["check", "--family", "temperley-lieb", "n=5", "delta=1", "field=GF(7)", "route=spin-chain"]
    )
    # delta != 0: every cell form is nonzero, so TL_5(1) is quasi-hereditary (S. Konig,
    # C. C. Xi, When is a cellular algebra quasi-hereditary?, Math. Ann. 315, 1999)
    assert code == 0


@pytest.mark.slow
def test_restricted_chain_agrees_with_the_table_route_everywhere_small() -> None:
    # every n <= 7 with every (delta, p) where q lies only in GF(p^2), three seeds
    for n in range(2, 8):
        for delta, p in RESTRICTED:
            for seed in (0, 7, 31):
                _compare(n, delta, p, seed)


@pytest.mark.slow
def test_agrees_with_the_table_route_everywhere_small() -> None:
    # every n <= 7 with every (delta, p) above, two seeds
    for n in range(2, 8):
        for delta, p in VALID:
            for seed in (0, 7):
                _compare(n, delta, p, seed)


def test_module_command_keeps_the_table_route(monkeypatch, capsys) -> None:
    # hwcat module reads and identifies modules through the diagram basis: even where
    # route=auto would take the spin chain, it reduces the table
    monkeypatch.setattr(registry, "TL_SPIN_CHAIN_FROM", 2)
    code = main(["module", "--family", "temperley-lieb", "n=4", "delta=0", "field=GF(5)", "--json"])
    d = json.loads(capsys.readouterr().out)
    assert code == 0
    assert sorted(d["simples"]) == ["2", "4"]
    assert d["centre"]["terms"].startswith("the input algebra's own terms")


def test_module_command_names_the_route_it_needs(capsys: pytest.CaptureFixture) -> None:
    # the spin chain as a module is read in the diagram basis, which only the table
    # route has: one line, exit code 2 (common practice for bad input)
    args = ["module", "--family", "temperley-lieb", "n=4", "delta=0", "field=GF(5)"]
    assert main([*args, "route=spin-chain"]) == 2
    err = capsys.readouterr().err
    assert "route=table" in err and len(err.strip().splitlines()) == 1


def test_without_numpy_auto_takes_the_table_and_a_forced_route_says_why(monkeypatch):
    # numpy is the optional extra `fast`: without it `auto` falls back to the table
    # route (same answer, derived from the table) and `route=spin-chain` is a one-line error
    monkeypatch.setattr(tlm, "np", None)
    assert not module_route_available(0, "GF(5)")
    assert not registry._tl_spin_chain({"n": 8, "delta": 0, "field": "GF(5)", "route": "auto"})
    with pytest.raises(SpecError, match="needs numpy"):
        tlm.reduce_temperley_lieb(4, 0, "GF(5)")
