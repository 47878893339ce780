"""Which order to check, and the check itself: the decisions the command line used to make.

:func:`check` is what ``hwcat check`` runs.  Given an order (a
:class:`~hwcat.theory.orders.PartialOrder`, its text such as ``"3 > 2 > 1"``, or
a sequence of vertex names, highest first) it checks that order.  Given none,
it searches all orders: when some order makes the algebra quasi-hereditary it
checks the essential order of the first structure found; otherwise it checks
the search's best attempt (its longest heredity chain, completed by the
remaining vertices in spec order), and the verdict carries a
:class:`~hwcat.theory.verdict.SearchSummary` saying so.

>>> from hwcat.io.spec import load_spec_text
>>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["1"]\\narrows = ["x: 1 -> 1"]\\n'
...                    'relations = ["x*x"]')
>>> v = check(A)                   # k[x]/(x^2): no order works
>>> v.quasi_hereditary, v.search.quasi_hereditary_for_some_order, v.order_source
(False, False, 'best attempt of the search')
"""

from __future__ import annotations

import dataclasses
from collections.abc import Sequence

from hwcat.algebras.hub.basic import BasicAlgebra
from hwcat.errors import InternalInconsistency, OrderError
from hwcat.theory.orders import PartialOrder, parse_order, total_order
from hwcat.theory.search import quasi_hereditary_orders
from hwcat.theory.verdict import OrderVerdict, SearchSummary, check_order

__all__ = ["as_order", "order_or_search", "chosen_by_search", "check"]


def as_order(A: BasicAlgebra, order: PartialOrder | str | Sequence[str]) -> PartialOrder:
    """An order given as a :class:`PartialOrder`, as text, or as vertex names highest first."""
    if isinstance(order, PartialOrder):
        if order.vertices != A.vertices:
            raise OrderError(
                f"the order is on the vertices {list(order.vertices)}, "
                f"not on this algebra's {list(A.vertices)}"
            )
        return order
    if isinstance(order, str):
        return parse_order(order, A.vertices)
    names = list(order)
    idx = [A.vertex_index(v) for v in names]
    if sorted(idx) != list(range(A.n)):
        raise OrderError(
            f"a total order must list every vertex once: got {names}, vertices {list(A.vertices)}"
        )
    return total_order(A.vertices, idx)


def order_or_search(
    A: BasicAlgebra, order: PartialOrder | str | Sequence[str] | None = None
) -> PartialOrder | None:
    """The given order, else the essential order of the first structure found, else None."""
    if order is not None:
        return as_order(A, order)
    r = quasi_hereditary_orders(A, list_limit=1)
    return r.structure_list[0].essential_order if r.quasi_hereditary else None


def chosen_by_search(A: BasicAlgebra) -> tuple[PartialOrder, str, SearchSummary]:
    """The order the search proposes, where it came from, and what the search found.

    The essential order of the first structure found; when no order makes the
    algebra quasi-hereditary, the search's best attempt (its longest heredity
    chain, then the remaining vertices in spec order).
    """
    r = quasi_hereditary_orders(A, list_limit=1)
    summary = SearchSummary(
        quasi_hereditary_for_some_order=r.quasi_hereditary,
        quasi_hereditary_total_orders=r.quasi_hereditary_total_orders,
        structures=r.structures,
        longest_heredity_chain=tuple(A.vertices[i] for i in r.best_attempt),
    )
    if r.quasi_hereditary:
        return (
            r.structure_list[0].essential_order,
            "found by search: essential order of a structure",
            summary,
        )
    chain = list(r.best_attempt)
    rest = [v for v in range(A.n) if v not in chain]
    return total_order(A.vertices, chain + rest), "best attempt of the search", summary


def check(
    A: BasicAlgebra,
    order: PartialOrder | str | Sequence[str] | None = None,
    *,
    order_source: str = "given",
    homological: bool = True,
    bound: int | None = None,
    max_syzygy_dimension: int | None = None,
) -> OrderVerdict:
    """The verdict for ``order``; with no order, for the family's natural order if the
    algebra has one, else for the order the search chooses.  ``bound`` and
    ``max_syzygy_dimension`` are the homological work budget (see
    :func:`~hwcat.theory.verdict.check_order`)."""
    budget = {"bound": bound, "max_syzygy_dimension": max_syzygy_dimension}
    if order is None and A.natural_order:
        order, order_source = A.natural_order, "the family's natural order"
    if order is not None:
        return check_order(
            A, as_order(A, order), order_source=order_source, homological=homological, **budget
        )
    chosen, source, summary = chosen_by_search(A)
    verdict = check_order(A, chosen, order_source=source, homological=homological, **budget)
    if verdict.quasi_hereditary != summary.quasi_hereditary_for_some_order:
        raise InternalInconsistency(
            "the search says quasi-hereditary for some order: "
            f"{summary.quasi_hereditary_for_some_order}, "
            f"but the verdict for its chosen order {chosen.chain_text()} says "
            f"{verdict.quasi_hereditary}"
        )
    return dataclasses.replace(verdict, search=summary)
