"""The Temperley-Lieb generators on the spin chain ``(k^2)^(x)n``.

On two neighbouring sites, with basis ``up up, up down, down up, down down``,
``e_i`` acts by the matrix that is zero except for the middle block
``[[q, -1], [-1, 1/q]]``; so ``e_i^2 = (q + 1/q) e_i`` and
``e_i e_(i+-1) e_i = e_i``: the Temperley-Lieb algebra with loop weight
``delta = q + 1/q``.  These generators commute with the quantum group
``U_q(sl_2)`` acting on the chain (the quantum-group-symmetric boundary
terms of the open XXZ chain; quantum Schur-Weyl duality, Jimbo 1986,
Martin 1991).  The total spin ``S^z`` is preserved: the matrices are block
diagonal in the number of down spins.

Coordinates: the basis vector ``k`` (``0 <= k < 2^n``) has site ``i`` (from
1, left to right) down when bit ``n - i`` of ``k`` is set.

>>> from hwcat.exact import QQ
>>> gens = spin_chain_generators(3, 2, QQ)
>>> sorted(gens), gens["e1"].shape
(['e1', 'e2'], (8, 8))
>>> E = gens["e1"]
>>> (E @ E == E.scale(QQ.parse("5/2")))
True
"""

from __future__ import annotations

from typing import Any

from hwcat.errors import SpecError
from hwcat.exact import Field, Mat
from hwcat.exact.polys import Poly, sparse_matrix

__all__ = [
    "spin_chain_generators",
    "spin_chain_entries",
    "loop_weight_root",
    "generator_diagrams",
]


def spin_chain_generators(n: int, q: Any, field: Field) -> dict[str, Mat]:
    """``{"e1": ..., "e(n-1)": ...}``: ``2^n x 2^n`` matrices (see the module notes)."""
    N = 1 << n
    return {
        g: sparse_matrix(field, N, N, ents) for g, ents in spin_chain_entries(n, q, field).items()
    }


def spin_chain_entries(n: int, q: Any, field: Field) -> dict[str, dict[tuple[int, int], Any]]:
    """The nonzero entries ``{(row, column): value}`` of each generator."""
    if isinstance(n, bool) or not isinstance(n, int) or n < 2:
        raise SpecError(f"spin chain: n = {n!r} must be an integer >= 2")
    F = field
    qq = F(q)
    if qq == 0:
        raise SpecError("spin chain: q must be nonzero")
    qi = F.one / qq
    N = 1 << n
    out = {}
    for i in range(1, n):
        hi = 1 << (n - i)  # bit of site i
        lo = 1 << (n - i - 1)  # bit of site i + 1
        ents: dict[tuple[int, int], Any] = {}
        for k in range(N):
            a, b = bool(k & hi), bool(k & lo)
            if a == b:
                continue
            if not a:  # up down
                other = k ^ hi ^ lo
                ents[(k, k)] = qq
                ents[(k, other)] = -F.one
            else:  # down up
                other = k ^ hi ^ lo
                ents[(k, k)] = qi
                ents[(k, other)] = -F.one
        out[f"e{i}"] = ents
    return out


def generator_diagrams(n: int) -> dict[str, str]:
    """The names, in the diagram basis of the ``temperley-lieb`` family, of the
    generators ``e_i`` (pairs ``(i,i+1)`` and ``(i',(i+1)')``, vertical strands elsewhere).

    >>> generator_diagrams(3)["e2"]
    "(1,1')(2,3)(2',3')"
    """

    def label(p: int) -> str:
        return str(p + 1) if p < n else f"{p - n + 1}'"

    out = {}
    for i in range(1, n):
        pairs = [(x, n + x) for x in range(n) if x not in (i - 1, i)]
        pairs += [(i - 1, i), (n + i - 1, n + i)]
        out[f"e{i}"] = "".join(f"({label(x)},{label(y)})" for x, y in sorted(pairs))
    return out


def loop_weight_root(delta: Any, field: Field) -> Any:
    """A ``q`` in the field with ``q + 1/q = delta``, or an error when there is none.

    >>> from hwcat.exact import GF
    >>> q = loop_weight_root(0, GF(5)); q * q
    4
    """
    F = field
    d = F(delta)
    f = Poly.from_coeffs(F, [F.one, -d, F.one])  # q^2 - delta q + 1
    for g, _ in f.factor():
        if g.degree == 1:
            return -g.coeffs()[0]
    raise SpecError(
        f"spin chain: no q in {F} with q + 1/q = {delta} (q^2 - {delta} q + 1 is irreducible); "
        "the spin chain as a module needs one: choose another field or loop weight (the "
        "family's algebra and its projective and simple modules need no q)"
    )
