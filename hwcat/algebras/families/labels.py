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
  ``lambda = dim - 1``; it is self-injective and not quasi-hereditary, so no
  natural order.

Families without a labelling keep the numbering by dimension.

References
----------
J. A. Green, *Polynomial Representations of GL_n*, Lecture Notes in Math. 830
(1980).  S. Koenig, C. C. Xi, *When is a cellular algebra quasi-hereditary?*,
Math. Ann. 315 (1999) 281-293.
"""

from __future__ import annotations

import re
from collections.abc import Callable

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


def _small_quantum(red: Reduction) -> tuple[list[str], str | None]:
    dims = red.simple_dimensions
    if sorted(dims) != list(range(1, len(dims) + 1)):
        raise InternalInconsistency(f"simple dimensions {dims} are not 1, ..., ell")
    return [str(d - 1) for d in dims], None


LABELLERS: dict[str, Callable[[Reduction], tuple[list[str], str | None]]] = {
    "temperley-lieb": _temperley_lieb,
    "schur": _schur_2,
    "small-quantum-sl2": _small_quantum,
}
"""Family name -> function giving (labels in vertex order, natural order text or None)."""


def label_simples(family: str, red: Reduction) -> Reduction:
    """``red`` with its simples renamed by the family's labels (unchanged without a labeller)."""
    fn = LABELLERS.get(family)
    if fn is None:
        return red
    names, order = fn(red)
    if len(set(names)) != len(names):
        raise InternalInconsistency(f"two simples of {family} got the same label: {names}")
    return red.relabelled(names, natural_order=order)
