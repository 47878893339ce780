"""Assertions for collaborators' test suites (pytest or plain ``assert``).

Each helper takes an algebra (a :class:`~hwcat.algebras.BasicAlgebra`), the
path of a spec file, or the text of a spec, and raises :class:`AssertionError`
with hwcat's witness in the message when the claim is false.

>>> from hwcat.testing import assert_quasi_hereditary, assert_not_quasi_hereditary
>>> spec = 'field = "QQ"\\n[quiver]\\nvertices = ["1", "2"]\\narrows = ["a: 1 -> 2"]'
>>> assert_quasi_hereditary(spec, "2 > 1")
>>> assert_not_quasi_hereditary(spec, "2 > 1")
Traceback (most recent call last):
...
AssertionError: quasi-hereditary for 2 > 1 (standard modules: Delta(1) = (1, 0), Delta(2) = (0, 1))
"""

from __future__ import annotations

import os
from collections.abc import Sequence
from typing import Any

from hwcat.algebras.hub.basic import BasicAlgebra
from hwcat.theory.orders import PartialOrder

__all__ = ["assert_quasi_hereditary", "assert_not_quasi_hereditary", "assert_cartan", "as_algebra"]


def as_algebra(spec_or_algebra: Any) -> tuple[BasicAlgebra, str | None]:
    """The algebra and the spec's order text (``None`` for an algebra object)."""
    from hwcat.io.spec import build_algebra, read_spec, read_spec_text

    if isinstance(spec_or_algebra, BasicAlgebra):
        return spec_or_algebra, None
    if isinstance(spec_or_algebra, str) and "\n" in spec_or_algebra:
        spec = read_spec_text(spec_or_algebra)
    elif isinstance(spec_or_algebra, (str, os.PathLike)):
        spec = read_spec(os.fspath(spec_or_algebra))
    else:
        raise TypeError(f"expected an algebra, a spec file or spec text, not {spec_or_algebra!r}")
    return build_algebra(spec), spec.order


def _order(A: BasicAlgebra, order: Any, spec_order: str | None) -> PartialOrder | None:
    from hwcat.theory.orders import parse_order

    if isinstance(order, PartialOrder):
        return order
    text = order if order is not None else spec_order
    return parse_order(text, A.vertices) if text else None


def _failure_text(A: BasicAlgebra, order: PartialOrder) -> str:
    from hwcat.theory.verdict import check_order

    v = check_order(A, order, homological=False, extensions=False)
    bad = [f"{a.name}: {a.summary}" for a in v.axioms if not a.holds]
    h = v.axiom("heredity-chain").witness or {}
    if isinstance(h, dict) and h.get("text"):
        bad.append(f"witness: {h['text']}")
    return "; ".join(bad)


def _standard_text(A: BasicAlgebra, order: PartialOrder) -> str:
    from hwcat.theory.highest_weight import standard_module

    return ", ".join(
        f"Delta({A.vertices[L]}) = {standard_module(A, L, order).dims}" for L in range(A.n)
    )


def assert_quasi_hereditary(spec_or_algebra: Any, order: Any = None) -> None:
    """Fail unless quasi-hereditary for ``order`` (text or :class:`PartialOrder`).

    Without ``order``: the spec's order, else some order (the search).  The
    message gives the failing axioms with their witness.
    """
    from hwcat.theory.highest_weight import heredity_chain

    A, spec_order = as_algebra(spec_or_algebra)
    po = _order(A, order, spec_order)
    if po is None:
        from hwcat.theory.certificate import proposed_order

        po, note = proposed_order(A)
        if not heredity_chain(A, po).holds:
            raise AssertionError(
                f"not quasi-hereditary for any order; {note}: {po.chain_text()}: "
                + _failure_text(A, po)
            )
        return
    if not heredity_chain(A, po).holds:
        raise AssertionError(f"not quasi-hereditary for {po.chain_text()}: " + _failure_text(A, po))


def assert_not_quasi_hereditary(spec_or_algebra: Any, order: Any = None) -> None:
    """Fail if quasi-hereditary for ``order`` (without one: for some order).

    The message gives the order for which it is quasi-hereditary and its standard
    modules' dimension vectors.
    """
    from hwcat.theory.highest_weight import heredity_chain

    A, spec_order = as_algebra(spec_or_algebra)
    po = _order(A, order, spec_order)
    if po is None:
        from hwcat.theory.certificate import proposed_order

        po, note = proposed_order(A)
        if heredity_chain(A, po).holds:
            raise AssertionError(
                f"quasi-hereditary for {po.chain_text()} ({note}; standard modules: "
                f"{_standard_text(A, po)})"
            )
        return
    if heredity_chain(A, po).holds:
        raise AssertionError(
            f"quasi-hereditary for {po.chain_text()} (standard modules: {_standard_text(A, po)})"
        )


def assert_cartan(spec_or_algebra: Any, expected: Sequence[Sequence[int]]) -> None:
    """Fail unless the Cartan matrix ``C[i][j] = [P(j) : L(i)]`` (spec vertex order) is ``expected``.

    >>> assert_cartan('field = "QQ"\\n[quiver]\\nvertices = ["1", "2"]\\narrows = ["a: 1 -> 2"]', [[1, 0], [0, 1]])
    Traceback (most recent call last):
    ...
    AssertionError: Cartan matrix C[i][j] = [P(j) : L(i)] is [[1, 0], [1, 1]], expected [[1, 0], [0, 1]]; first difference: [P(1) : L(2)] = 1, expected 0
    """
    A, _ = as_algebra(spec_or_algebra)
    C = [list(r) for r in A.cartan()]
    want = [list(r) for r in expected]
    if C == want:
        return
    diff = ""
    if len(want) == A.n and all(len(r) == A.n for r in want):
        i, j = next((i, j) for i in range(A.n) for j in range(A.n) if C[i][j] != want[i][j])
        diff = (
            f"; first difference: [P({A.vertices[j]}) : L({A.vertices[i]})] = {C[i][j]}, "
            f"expected {want[i][j]}"
        )
    raise AssertionError(f"Cartan matrix C[i][j] = [P(j) : L(i)] is {C}, expected {want}{diff}")
