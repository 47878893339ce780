"""Resource limits, the infinite-dimension certificate and the work budget.

* Limits: sizes predicted before the work (families, path algebras) and
  measured during the build (bound quiver algebras degree by degree) are refused
  with :class:`~hwcat.errors.ResourceLimitError`, one line naming the limit and
  the option that raises it; raising the limit lets the same input through.
  Dimensions used: Catalan numbers for Temperley-Lieb, n! for symmetric groups,
  binomial(r + 3, 3) for S(2, r) (J. A. Green, Polynomial Representations of
  GL_n, 1980), paths of a quiver without relations (common practice).
* The Golod-Shafarevich certificate (from memory: E. S. Golod, I. R. Shafarevich,
  1964; the graded inequality H(t)(1 - m t + R(t)) >= 1): whenever it claims an
  algebra is infinite dimensional, the algebra truncated at length L has nonzero
  paths of length L - 1 for growing L (checked by building the truncations, an
  independent computation).
* The work budget: a finite algebra whose build outlasts a tiny budget is refused
  with a message that says the budget, not a proof, stopped it.
"""

from __future__ import annotations

import random

import pytest

from hwcat.algebras.families.registry import family_algebra
from hwcat.algebras.hub.quiver import Quiver, parse_relation
from hwcat.algebras.inputs import bound
from hwcat.algebras.inputs.bound import bound_quiver_algebra, golod_shafarevich_witness
from hwcat.errors import NotFiniteDimensional, ResourceLimitError
from hwcat.exact import GF, QQ
from hwcat.io.spec import load_spec_text
from hwcat.limits import DEFAULT_LIMITS, current_limits, resource_limits


def test_defaults_and_context() -> None:
    assert current_limits() == DEFAULT_LIMITS
    with resource_limits(max_dim=7, max_products=9):
        assert (current_limits().max_dim, current_limits().max_products) == (7, 9)
        assert current_limits().max_vertices == DEFAULT_LIMITS.max_vertices
    assert current_limits() == DEFAULT_LIMITS
    for bad in (0, -1, 2.5, "3", True):
        with pytest.raises(ResourceLimitError, match="positive integer"):
            with resource_limits(max_dim=bad):
                pass


def test_family_sizes_are_predicted() -> None:
    # TL_6 has dimension Catalan(6) = 132; S(2, 3) has binomial(6, 3) = 20
    with pytest.raises(ResourceLimitError, match="TL_6 has dimension 132.*--max-dim"):
        family_algebra("temperley-lieb", n=6, max_dim=131)
    assert family_algebra("temperley-lieb", n=4, max_dim=14).dim == 6  # Catalan(4) = 14
    with pytest.raises(ResourceLimitError, match=r"S\(2, 3\) has dimension 20"):
        family_algebra("schur", r=3, max_dim=19)
    # S_4: 24 elements, 576 products
    with pytest.raises(ResourceLimitError, match="576 products.*--max-products"):
        family_algebra("symmetric-group", n=4, max_products=575)
    with pytest.raises(ResourceLimitError, match="--max-quiver-vertices"):
        family_algebra("linear-a", n=5, max_vertices=4)


def test_path_algebra_size_is_predicted() -> None:
    # linear A_4 without relations: 4 + 3 + 2 + 1 = 10 paths (common practice)
    text = (
        'field = "QQ"\n[quiver]\nvertices = ["1", "2", "3", "4"]\n'
        'arrows = ["a: 1 -> 2", "b: 2 -> 3", "c: 3 -> 4"]\n'
    )
    assert load_spec_text(text, max_dim=10).dim == 10
    with pytest.raises(ResourceLimitError, match="at least 10 .*max_dim = 9"):
        load_spec_text(text, max_dim=9)


def test_bound_algebra_is_measured_while_built() -> None:
    # commuting loops truncated at length 30: dimension 1 + 2 + ... + 30 = 465 (derived:
    # the monomials x^a y^b with a + b < 30); with relations nothing is predicted, the
    # build stops when the dimension passes the limit
    text = (
        'field = "GF(101)"\n[quiver]\nvertices = ["1"]\narrows = ["x: 1 -> 1", "y: 1 -> 1"]\n'
        'relations = ["x*y - y*x"]\nvanish_from_length = 30\n'
    )
    assert load_spec_text(text).dim == 465
    with pytest.raises(ResourceLimitError, match="dimension at least .*max_dim = 100"):
        load_spec_text(text, max_dim=100)


def _random_homogeneous(rng: random.Random, field):
    n = rng.randint(1, 2)
    vs = [str(i) for i in range(n)]
    arrows = []
    for k in range(rng.randint(1, 3)):
        arrows.append(f"a{k}: {rng.choice(vs)} -> {rng.choice(vs)}")
    Q = Quiver.from_text(vs, arrows)
    rels = []
    paths = [
        (i, j)
        for i, a in enumerate(Q.arrows)
        for j, b in enumerate(Q.arrows)
        if a.target == b.source
    ]
    for _ in range(rng.randint(0, 3)):
        if not paths:
            break
        p = rng.choice(paths)
        same = [
            q
            for q in paths
            if Q.arrows[q[0]].source == Q.arrows[p[0]].source
            and Q.arrows[q[1]].target == Q.arrows[p[1]].target
        ]
        terms = rng.sample(same, rng.randint(1, len(same)))
        text = " + ".join(
            f"{rng.randint(1, 2)}*{Q.arrows[i].name}*{Q.arrows[j].name}" for i, j in terms
        )
        rels.append(parse_relation(text, Q, field))
    return Q, rels


@pytest.mark.parametrize("seed", range(60))
def test_certificate_is_sound(seed: int) -> None:
    rng = random.Random(seed)
    field = rng.choice([GF(3), GF(101)])
    Q, rels = _random_homogeneous(rng, field)
    if golod_shafarevich_witness(Q, rels) is None:
        return
    # claimed infinite: truncations at L keep nonzero paths of length L - 1 (derived check)
    for L in (3, 4, 6):
        A = bound_quiver_algebra(field, Q, rels, L)
        assert max(len(w) for s in range(A.n) for t in range(A.n) for w in A.words[s][t]) == L - 1


def test_certificate_stays_silent_on_finite_algebras() -> None:
    # two loops with x^2 = y^2 = xy = yx = 0 (dimension 3) and k[x,y]/(x^2, y^2, xy - yx)
    Q = Quiver.from_text(["1"], ["x: 1 -> 1", "y: 1 -> 1"])
    for texts in (["x*x", "y*y", "x*y", "y*x"], ["x*x", "y*y", "x*y - y*x"]):
        rels = [parse_relation(t, Q, QQ) for t in texts]
        assert golod_shafarevich_witness(Q, rels) is None


def test_work_budget_ends_in_a_clear_refusal(monkeypatch) -> None:
    # k[x]/(x^40) is finite (dimension 40, common practice); a tiny budget stops the
    # build first, and the message says that a budget, not a proof, stopped it
    text = 'field = "QQ"\n[quiver]\nvertices = ["1"]\narrows = ["x: 1 -> 1"]\n'
    text += 'relations = ["' + "*".join(["x"] * 40) + '"]\n'
    assert load_spec_text(text).dim == 40
    monkeypatch.setattr(bound, "SEARCH_BUDGET", 5)
    with pytest.raises(NotFiniteDimensional) as info:
        load_spec_text(text)
    msg = str(info.value)
    assert "not shown to be finite dimensional within the work budget" in msg
    assert "give vanish_from_length" in msg and "survive (for example 'x*" in msg


def test_command_line_options_before_or_after_the_command(tmp_path, capsys) -> None:
    from hwcat.cli import main

    path = tmp_path / "comm.toml"
    path.write_text(
        'field = "GF(101)"\n[quiver]\nvertices = ["1"]\narrows = ["x: 1 -> 1", "y: 1 -> 1"]\n'
        'relations = ["x*y - y*x"]\nvanish_from_length = 30\n',
        encoding="utf-8",
    )
    for argv in (
        ["--max-dim", "100", "describe", str(path)],
        ["describe", str(path), "--max-dim", "100"],
    ):
        assert main(argv) == 2
        err = capsys.readouterr().err
        assert "max_dim = 100; raise it with --max-dim N" in err and len(err.splitlines()) == 1
    # the dimension is 465 (derived above): a limit of 465 lets it through
    assert main(["describe", str(path), "--max-dim", "465", "--json"]) == 0
    assert '"dimension": 465' in capsys.readouterr().out
