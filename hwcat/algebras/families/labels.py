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

Families without a labelling keep the numbering by dimension.

References
----------
J. A. Green, *Polynomial Representations of GL_n*, Lecture Notes in Math. 830
(1980).  S. Koenig, C. C. Xi, *When is a cellular algebra quasi-hereditary?*,
Math. Ann. 315 (1999) 281-293.
"""

from __future__ import annotations

import re
from collections.abc import Callable, Mapping
from typing import Any

from hwcat.algebras.reduction.reduction import Reduction
from hwcat.errors import InternalInconsistency

__all__ = ["LABELLERS", "label_simples", "through_strands"]

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


LABELLERS: dict[str, Callable[..., tuple[list[str], str | None]]] = {
    "temperley-lieb": lambda red, params: _temperley_lieb(red),
    "schur": lambda red, params: _schur_2(red),
    "small-quantum-sl2": _small_quantum,
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
