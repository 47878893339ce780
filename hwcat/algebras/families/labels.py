"""The labels of the trade for the simple modules of the multiplication-table families.

A reduction numbers the simples by dimension.  Here each simple is identified
by how the family's distinguished elements act on it — ranks of their action
on the simple module (:meth:`~hwcat.algebras.reduction.reduction.Reduction.simple_action_rank`),
nothing assumed — and renamed:

* **Temperley--Lieb** ``TL_n(delta)``: by the number ``t`` of through strands.
  The span ``J_t`` of the diagrams with at most ``t`` through strands is a
  two-sided ideal (composing diagrams never increases the number of through
  strands), and the simple ``L(t)`` is the one killed by ``J_(t-2)`` but not by
  ``J_t`` (the cellular labelling: the head of the cell module with ``t``
  through strands).  The label of a simple is therefore the smallest number of
  through strands of a diagram acting on it nonzero.  Natural order: fewer
  through strands is higher (``J_0`` is the bottom of the cell chain, so its
  vertex is peeled first in a heredity chain), e.g. ``0 > 2 > 4``.
* **Schur algebra** ``S(2, r)``: by highest weight.  The weight idempotents
  ``xi_mu = xi(i;i)`` (``mu`` the content of ``i``) act on ``L(lambda)`` as the
  projection onto its ``mu``-weight space, which is nonzero for ``mu = lambda``
  and only for ``mu`` dominated by ``lambda`` (Green 1980).  The label is the
  dominant-most weight ``(a, b)`` with ``L xi_mu != 0``, written ``w<a>_<b>``;
  natural order: dominance, e.g. ``w3_0 > w2_1``.
* **small quantum group** ``u_q(sl_2)`` at odd ``ell``: one simple of each
  dimension ``1..ell`` (from memory), labelled by its highest weight
  ``lambda = dim - 1``.  At even ``ell = 2p`` (the restricted form) two simples
  ``X^+_s``, ``X^-_s`` of each dimension ``s = 1..p`` (Feigin, Gainutdinov,
  Semikhatov, Tipunin 2006, from memory), on whose highest-weight vector ``K``
  acts by ``+q^(s-1)`` and ``-q^(s-1)``; named ``plus_<s>`` and ``minus_<s>``.
  A simple is a right module here, and the anti-automorphism ``E <-> F``,
  ``K -> K`` turns it into a left module, so its highest-weight line is the
  image of ``v -> v F^(s-1)``: the sign is the ``e`` in ``{+1, -1}`` for which
  ``F^(s-1) (K - e q^(s-1))`` acts as zero.  The algebra is self-injective
  and not quasi-hereditary, so there is no natural order.

* **symmetric group** ``k S_n`` in characteristic ``p``: by ``p``-regular
  partitions ``lam`` (every partition for ``p = 0``), James's ``D^lam``, the
  head of the Specht module ``S^lam`` (from memory), written
  ``D<lam_1>_<lam_2>_...`` (``D3_2_1``; ``D0`` for ``n = 0``).  The heads are
  built exactly over the prime field (:mod:`.specht`); each simple of the
  reduction is matched to the head with the same dimension and the same ranks
  of ``f(g)``, for ``g`` a representative of a ``p``-regular class and ``f``
  an irreducible factor of ``x^ord(g) - 1``.  These ranks are the
  characteristic polynomials of the ``p``-regular elements, so they determine
  the Brauer character, which separates the simples (from memory); only the
  invariants needed to tell the heads apart are computed, and if even all of
  them cannot, or a simple matches no head or two, the labeller raises.  No
  natural order: a group algebra is self-injective, quasi-hereditary only when
  semisimple (and then for every order).
* **cyclic group** ``k C_m``: the reduction accepts only fields over which
  every simple is one-dimensional, so the generator ``g`` acts on a simple by
  a root ``c`` of ``x^m' - 1`` (``m'`` the part of ``m`` prime to the
  characteristic); the simple is ``chi<c>`` with ``c`` written as an
  identifier (``chi1``, ``chi4``, ``chim1`` for ``-1``, ``chizp1`` for
  ``z + 1``, see :func:`eigenvalue_label`).  Found by bisection: ``prod (g -
  c)`` over half of the remaining roots acts as zero on the simple or not.
  No natural order.

Families without a labelling keep the numbering by dimension.

References
----------
J. A. Green, *Polynomial Representations of GL_n*, Lecture Notes in Math. 830
(1980).  S. Koenig, C. C. Xi, *When is a cellular algebra quasi-hereditary?*,
Math. Ann. 315 (1999) 281-293.
"""

from __future__ import annotations

import itertools
import math
import re
from collections.abc import Callable, Mapping, Sequence
from typing import Any

from hwcat.algebras.families import specht
from hwcat.algebras.families.specht import Perm
from hwcat.algebras.inputs.structure import StructureAlgebra
from hwcat.algebras.reduction.reduction import Reduction
from hwcat.errors import InternalInconsistency
from hwcat.exact import GF, QQ
from hwcat.exact.polys import Poly

__all__ = ["LABELLERS", "eigenvalue_label", "label_simples", "through_strands"]

_PAIR = re.compile(r"\((\d+'?),(\d+'?)\)")


def through_strands(diagram: str) -> int:
    """Number of through strands of a Temperley--Lieb basis diagram named like
    ``"(1,2)(1',2')(3,3')"``.

    >>> through_strands("(1,2)(1',2')(3,3')"), through_strands("(1,1')(2,2')")
    (1, 2)
    """
    return sum((x.endswith("'")) != (y.endswith("'")) for x, y in _PAIR.findall(diagram))


def _temperley_lieb(red: Reduction) -> tuple[list[str], str | None]:
    A = red.algebra
    by_strands = sorted(range(A.dim), key=lambda j: through_strands(A.basis[j]))
    labels = []
    for i in range(red.basic.n):
        for j in by_strands:
            if red.simple_action_rank(i, A.basis_vector(j)):
                labels.append(through_strands(A.basis[j]))
                break
        else:
            raise InternalInconsistency("a simple module on which every diagram acts as zero")
    order = " > ".join(str(t) for t in sorted(set(labels)))
    return [str(t) for t in labels], order


def _schur_2(red: Reduction) -> tuple[list[str], str | None]:
    A = red.algebra
    weights = []  # (a, b, index of xi_mu)
    for j, name in enumerate(A.basis):
        m = re.fullmatch(r"xi\(([12]*);([12]*)\)", name)
        if m and m.group(1) == m.group(2):
            i = m.group(1)
            weights.append((i.count("1"), i.count("2"), j))
    weights.sort(reverse=True)  # dominance on two-part weights: larger first part first
    labels = []
    for i in range(red.basic.n):
        for a, b, j in weights:
            if red.simple_action_rank(i, A.basis_vector(j)):
                if a < b:
                    raise InternalInconsistency(f"highest weight ({a}, {b}) is not dominant")
                labels.append((a, b))
                break
        else:
            raise InternalInconsistency("a simple module killed by every weight idempotent")
    names = [f"w{a}_{b}" for a, b in labels]
    order = " > ".join(f"w{a}_{b}" for a, b in sorted(set(labels), reverse=True))
    return names, order


def _small_quantum(red: Reduction, params: Mapping[str, Any]) -> tuple[list[str], str | None]:
    dims = red.simple_dimensions
    ell = int(params["ell"])
    if ell % 2:
        if sorted(dims) != list(range(1, ell + 1)):
            raise InternalInconsistency(f"simple dimensions {dims} are not 1, ..., {ell}")
        return [str(d - 1) for d in dims], None
    A = red.algebra
    F = A.field
    q = F(params["q"])
    K = A.basis_vector(A.basis.index("K"))
    unit = A.unit
    names = []
    for i, s in enumerate(dims):
        Fs = A.basis_vector(A.basis.index("1" if s == 1 else "F" if s == 2 else f"F^{s - 1}"))
        signs = []
        for sign, word in ((F.one, "plus"), (-F.one, "minus")):
            c = sign * q ** (s - 1)
            x = A.product(Fs, [k - c * u for k, u in zip(K, unit, strict=True)])
            if red.simple_action_rank(i, x) == 0:
                signs.append(word)
        if len(signs) != 1:
            raise InternalInconsistency(f"the simple {i} of dimension {s} has signs {signs}")
        names.append(f"{signs[0]}_{s}")
    return names, None


def _element(A: StructureAlgebra, terms: Sequence[tuple[int, int]]) -> list[Any]:
    """The element ``sum c * basis[j]`` over the pairs ``(c, j)`` (integer coefficients)."""
    F = A.field
    v = [F.zero] * A.dim
    for c, j in terms:
        v[j] = v[j] + F(c)
    return v


def _prime_factors(p: int, m: int) -> list[tuple[int, ...]]:
    """The irreducible factors of ``x^m - 1`` over the prime field of characteristic ``p``,
    as integer coefficient tuples (degree 0 first), in the order flint lists them."""
    F = GF(p) if p else QQ
    facs = Poly.from_coeffs(F, [-1] + [0] * (m - 1) + [1]).factor()
    out = []
    for f, mult in facs:
        if mult != 1:
            raise InternalInconsistency(f"x^{m} - 1 is not squarefree in characteristic {p}")
        out.append(tuple(int(F.to_int_or_str(c)) for c in f.coeffs()))
    return out


def _symmetric_group(red: Reduction, params: Mapping[str, Any]) -> tuple[list[str], str | None]:
    """Simples of ``k S_n`` named by the heads ``D^lam`` of the Specht modules: matched by
    dimension, then by the ranks of ``f(g)`` (``g`` a ``p``-regular class representative,
    ``f`` an irreducible factor of ``x^ord(g) - 1``) that the heads need to be told apart."""
    A = red.algebra
    n = int(params["n"])
    p = A.field.characteristic
    regular = [lam for lam in specht.partitions(n) if specht.is_regular(lam, p)]
    dims = red.simple_dimensions
    if len(dims) != len(regular):
        raise InternalInconsistency(
            f"{len(dims)} simple modules of S_{n} in characteristic {p}, "
            f"but {len(regular)} {p}-regular partitions"
        )
    perms = list(itertools.permutations(range(n)))  # the basis order of the group algebra
    index = {g: j for j, g in enumerate(perms)}
    for g in perms[: min(len(perms), 50)]:
        if A.basis[index[g]] != specht.cycle_notation(g):
            raise InternalInconsistency(f"basis element {index[g]} of S_{n} is not {g}")
    modules = {lam: specht.specht_module(lam, p) for lam in regular}
    # invariants: (class representative g, irreducible factor f of x^ord(g) - 1) -> rank of
    # f(g); the p-regular classes other than the identity, whose ranks only repeat dimensions
    keys: list[tuple[Perm, tuple[int, ...]]] = []
    for mu in specht.partitions(n):
        if (p and any(part % p == 0 for part in mu)) or all(part == 1 for part in mu):
            continue
        g = specht.cycle_type_representative(mu)
        keys.extend((g, f) for f in _prime_factors(p, math.lcm(*mu)))

    def terms(g: Perm, f: tuple[int, ...]) -> list[tuple[int, Perm]]:
        return [(c, specht.permutation_power(g, k)) for k, c in enumerate(f) if c]

    # the keys that tell the heads D^lam apart, with their ranks (only where still needed)
    heads = sorted(modules[lam].head_dimension for lam in regular)
    if heads != sorted(dims):
        raise InternalInconsistency(
            f"the simples of S_{n} have dimensions {sorted(dims)}, the heads of the Specht "
            f"modules {heads}"
        )
    groups = [[lam for lam in regular if modules[lam].head_dimension == d] for d in set(dims)]
    chosen: list[tuple[Perm, tuple[int, ...]]] = []
    ranks: dict[tuple[tuple[int, ...], int], int] = {}
    for key in keys:
        if all(len(grp) <= 1 for grp in groups):
            break
        split = []
        for grp in groups:
            if len(grp) <= 1:
                split.append(grp)
                continue
            parts: dict[int, list[tuple[int, ...]]] = {}
            for lam in grp:
                r = modules[lam].head_rank(terms(*key))
                ranks[(lam, len(chosen))] = r
                parts.setdefault(r, []).append(lam)
            split.extend(parts.values())
        if len(split) > len(groups):
            groups = split
            chosen.append(key)
        else:
            for lam in regular:
                ranks.pop((lam, len(chosen)), None)
    if any(len(grp) > 1 for grp in groups):
        raise InternalInconsistency(
            f"the characteristic polynomials of the {p}-regular classes do not tell apart "
            f"the heads of the Specht modules {groups}"
        )
    labels = []
    for i, d in enumerate(dims):
        candidates = [lam for lam in regular if modules[lam].head_dimension == d]
        for k, (g, f) in enumerate(chosen):
            if len(candidates) <= 1:
                break
            x = _element(A, [(c, index[h]) for c, h in terms(g, f)])
            r = red.simple_action_rank(i, x)
            candidates = [lam for lam in candidates if ranks.get((lam, k)) == r]
        if len(candidates) != 1:
            raise InternalInconsistency(
                f"the simple {i + 1} of S_{n} (dimension {d}) matches the heads {candidates}"
            )
        labels.append(specht.partition_label(candidates[0]))
    if len(set(labels)) != len(labels):
        raise InternalInconsistency(f"two simples of S_{n} matched the same head: {labels}")
    return labels, None


_EIGENVALUE_TEXT = str.maketrans({"-": "m", "+": "p", "^": "e", "/": "o", " ": None, "*": None})


def eigenvalue_label(c: Any) -> str:
    """``chi<c>``: the label of the one-dimensional module on which the generator acts by
    ``c``, with ``c`` written as an identifier (``-`` as ``m``, ``+`` as ``p``, ``^`` as
    ``e``, ``/`` as ``o``, spaces and ``*`` dropped).

    >>> from hwcat.exact import GF, parse_field
    >>> eigenvalue_label(GF(5)(4)), eigenvalue_label(-1)
    ('chi4', 'chim1')
    >>> K = parse_field("QQ(zeta3)")
    >>> eigenvalue_label(-K.gen - 1)
    'chimzeta3m1'
    """
    return "chi" + str(c).translate(_EIGENVALUE_TEXT)


def _cyclic_group(red: Reduction, params: Mapping[str, Any]) -> tuple[list[str], str | None]:
    """Simples of ``k C_m``: ``k C_m = k[x]/(x^m - 1)`` and the reduction only accepts
    fields over which every simple is one-dimensional, so the generator acts on each by
    a root ``c`` of ``x^m' - 1`` in the field (``m'`` the part of ``m`` prime to the
    characteristic); the simple is labelled by ``c`` (:func:`eigenvalue_label`)."""
    A = red.algebra
    F = A.field
    m = int(params["m"])
    p = F.characteristic
    m_prime = m
    while p and m_prime % p == 0:
        m_prime //= p
    facs = [
        f for f, _ in Poly.from_coeffs(F, [-F.one] + [F.zero] * (m_prime - 1) + [F.one]).factor()
    ]
    roots = [-f.coeffs()[0] for f in facs if f.degree == 1]
    dims = red.simple_dimensions
    if len(roots) != len(facs) or len(dims) != len(roots) or set(dims) != {1}:
        raise InternalInconsistency(
            f"C_{m} over {F.name}: simples of dimensions {dims}, {len(roots)} roots of unity"
        )
    power = [A.basis.index("1" if k == 0 else "g" if k == 1 else f"g^{k}") for k in range(m)]

    def killed(i: int, cs: Sequence[Any]) -> bool:
        # prod (g - c) over cs acts as zero on the one-dimensional L(i) iff g acts by some c
        f = Poly.from_coeffs(F, [F.one])
        for c in cs:
            f = f * Poly.from_coeffs(F, [-c, F.one])
        x = [F.zero] * A.dim
        for k, coef in enumerate(f.coeffs()):
            x[power[k % m]] += coef  # g^m = 1
        return red.simple_action_rank(i, x) == 0

    labels = []
    for i in range(len(dims)):
        cs = list(roots)  # bisection: log2(m) ranks per simple
        while len(cs) > 1:
            half = cs[: len(cs) // 2]
            cs = half if killed(i, half) else cs[len(cs) // 2 :]
        if not killed(i, cs):
            raise InternalInconsistency(f"the generator of C_{m} acts on no simple by a root")
        labels.append(eigenvalue_label(cs[0]))
    return labels, None


LABELLERS: dict[str, Callable[..., tuple[list[str], str | None]]] = {
    "temperley-lieb": lambda red, params: _temperley_lieb(red),
    "schur": lambda red, params: _schur_2(red),
    "small-quantum-sl2": _small_quantum,
    "symmetric-group": _symmetric_group,
    "cyclic-group": _cyclic_group,
}
"""Family name -> function of (reduction, parameters) giving (labels in vertex order,
natural order text or None)."""


def label_simples(family: str, red: Reduction, params: Mapping[str, Any]) -> Reduction:
    """``red`` with its simples renamed by the family's labels (unchanged without a labeller)."""
    fn = LABELLERS.get(family)
    if fn is None:
        return red
    names, order = fn(red, params)
    if len(set(names)) != len(names):
        raise InternalInconsistency(f"two simples of {family} got the same label: {names}")
    return red.relabelled(names, natural_order=order)
