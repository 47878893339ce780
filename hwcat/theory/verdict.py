"""The verdict for one order: each highest-weight axiom with holds/fails and its witness."""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from hwcat.algebras.hub.basic import BasicAlgebra
from hwcat.errors import InternalInconsistency
from hwcat.modules import injective, projective
from hwcat.progress import task
from hwcat.theory.highest_weight import (
    FiltrationResult,
    costandard_filtration,
    costandard_module,
    heredity_chain,
    proper_standard_module,
    standard_filtration,
    standard_module,
    trace_cache,
)
from hwcat.theory.orders import PartialOrder
from hwcat.theory.structure import ModuleSummary, summarise_module
from hwcat.theory.traces import mask

__all__ = [
    "Axiom",
    "OrderVerdict",
    "SearchSummary",
    "check_order",
    "AXIOM_NAMES",
    "HOMOLOGICAL_AXIOM_NAMES",
]

AXIOM_NAMES = (
    "standard-schurian",
    "projectives-standardly-filtered",
    "injectives-costandardly-filtered",
    "heredity-chain",
    "bgg-reciprocity",
    "cartan-factorisation",
)
"""The axioms every verdict reports, in this order."""

HOMOLOGICAL_AXIOM_NAMES = ("ext-standard-costandard", "ext-quiver-standard")
"""The Ext conditions, reported after :data:`AXIOM_NAMES` when the homological part runs."""


@dataclass(frozen=True)
class SearchSummary:
    """What the search over all orders found, when no order was given to check."""

    quasi_hereditary_for_some_order: bool
    quasi_hereditary_total_orders: int
    structures: int
    longest_heredity_chain: tuple[str, ...]

    def to_dict(self) -> dict[str, Any]:
        return {
            "quasi_hereditary_for_some_order": self.quasi_hereditary_for_some_order,
            "quasi_hereditary_total_orders": self.quasi_hereditary_total_orders,
            "adapted_total_orders": self.quasi_hereditary_total_orders,  # deprecated alias
            "structures": self.structures,
            "longest_heredity_chain": list(self.longest_heredity_chain),
        }


@dataclass(frozen=True)
class Axiom:
    """One axiom: its name, whether it holds, a one-line summary and the witness data.

    ``holds`` is ``None`` when the work budget of a homological computation
    was reached before the axiom was decided (the summary says where).
    """

    name: str
    holds: bool | None
    summary: str
    witness: Any = None

    def to_dict(self) -> dict[str, Any]:
        return {
            "name": self.name,
            "holds": self.holds,
            "summary": self.summary,
            "witness": self.witness,
        }


@dataclass(frozen=True)
class OrderVerdict:
    """Everything ``hwcat check`` reports for one order."""

    name: str
    vertices: tuple[str, ...]
    order: PartialOrder | None
    order_source: str
    quasi_hereditary: bool
    axioms: tuple[Axiom, ...]
    cartan: tuple[tuple[int, ...], ...]
    decomposition_standard: tuple[tuple[int, ...], ...]
    decomposition_costandard: tuple[tuple[int, ...], ...]
    standard_equals_costandard: bool
    standardly_stratified: bool
    properly_stratified: bool
    standards: tuple[ModuleSummary, ...]
    costandards: tuple[ModuleSummary, ...]
    projective_standard_multiplicities: tuple[tuple[int, ...] | None, ...]
    linear_extensions: int | None = None
    quasi_hereditary_linear_extensions: int | None = None
    note: str = ""
    global_dimension: Any = None  # GlobalDimension, when computed
    tilting: tuple[Any, ...] | None = None  # TiltingModule per simple, when quasi-hereditary
    ringel_dual_cartan: tuple[tuple[int, ...], ...] | None = None
    search: SearchSummary | None = None  # when the order was chosen by the search
    tilting_summaries: tuple[ModuleSummary, ...] | None = None  # T(L): layers, Loewy diagram

    def axiom(self, name: str) -> Axiom:
        for a in self.axioms:
            if a.name == name:
                return a
        raise KeyError(name)

    def to_dict(self) -> dict[str, Any]:
        return {
            "name": self.name,
            "simples": list(self.vertices),
            "quasi_hereditary": self.quasi_hereditary,
            "order": self.order.covers_named() if self.order is not None else None,
            "order_source": self.order_source,
            "axioms": [a.to_dict() for a in self.axioms],
            "cartan": [list(r) for r in self.cartan],
            "decomposition_standard": [list(r) for r in self.decomposition_standard],
            "decomposition_costandard": [list(r) for r in self.decomposition_costandard],
            "decomposition_convention": "D[i][j] = [Delta(j) : L(i)], E[i][j] = [nabla(j) : L(i)]",
            "standard_equals_costandard": self.standard_equals_costandard,
            "standardly_stratified": self.standardly_stratified,
            "properly_stratified": self.properly_stratified,
            "standard_modules": [m.to_dict() for m in self.standards],
            "costandard_modules": [m.to_dict() for m in self.costandards],
            "projective_standard_multiplicities": [
                list(m) if m is not None else None for m in self.projective_standard_multiplicities
            ],
            "linear_extensions": self.linear_extensions,
            "quasi_hereditary_linear_extensions": self.quasi_hereditary_linear_extensions,
            # deprecated alias of the key above, kept for one release
            "adapted_linear_extensions": self.quasi_hereditary_linear_extensions,
            "note": self.note,
            "global_dimension": None
            if self.global_dimension is None
            else self.global_dimension.json_value(),
            "global_dimension_detail": None
            if self.global_dimension is None
            else self.global_dimension.to_dict(),
            "tilting": None if self.tilting is None else self._tilting_dicts(),
            "ringel_dual_cartan": None
            if self.ringel_dual_cartan is None
            else [list(r) for r in self.ringel_dual_cartan],
            **({} if self.search is None else {"search": self.search.to_dict()}),
        }

    def _tilting_dicts(self) -> list[dict[str, Any]]:
        out = []
        for k, t in enumerate(self.tilting or ()):
            d = t.to_dict(self.vertices)
            if self.tilting_summaries is not None:
                m = self.tilting_summaries[k]
                d["label"] = m.label
                d["socle_layers"] = [list(x) for x in m.socle_layers]
                d["loewy_diagram"] = None if m.loewy_diagram is None else m.loewy_diagram.to_dict()
                d["projective_injective"] = m.projective_injective
            out.append(d)
        return out


def _schurian(A: BasicAlgebra, order: PartialOrder) -> Axiom:
    bad = []
    tc = trace_cache(A)
    for L in range(A.n):
        D = standard_module(A, L, order)
        m = D.dims[L]
        if m != 1:
            below = order.below(L)
            T = mask(v for v in range(A.n) if v not in below)
            words = [w for w in tc.kept_words(T, L, L) if w]
            p = A.path_text(words[0], L) if words else None
            bad.append(
                {
                    "vertex": A.vertices[L],
                    "multiplicity": m,
                    "element_below_top": p,
                    "text": f"[Delta({A.vertices[L]}) : L({A.vertices[L]})] = {m}; the path {p} "
                    f"survives in Delta({A.vertices[L]}) below the top",
                }
            )
    if not bad:
        return Axiom(AXIOM_NAMES[0], True, "[Delta(L) : L(L)] = 1 for every L")
    return Axiom(AXIOM_NAMES[0], False, bad[0]["text"], bad)


def _filtered_by_proper(A: BasicAlgebra, L: int, order: PartialOrder) -> bool:
    """Whether ``Delta(L)`` has a filtration by copies of the proper standard module.

    With ``R = End(Delta(L))^op = e C e`` (``C`` the quotient by the vertices not
    ``<= L``), ``Delta(L) = e C`` is filtered by ``k (x)_R e C`` = proper
    ``Delta(L)`` iff ``e C`` is free over the local algebra ``R``, iff
    ``dim Delta(L) = [Delta(L) : L(L)] * dim(proper Delta(L))`` (derived; the
    radical filtration of ``R`` gives the filtration when ``e C`` is free).
    """
    D = standard_module(A, L, order)
    return D.dim == D.dims[L] * proper_standard_module(A, L, order).dim


def _obstruction_text(A: BasicAlgebra, r: FiltrationResult, label: str, sym: str) -> str:
    ob = r.obstruction or {}
    lam = A.vertices[ob["vertex"]] if isinstance(ob.get("vertex"), int) else ob.get("vertex")
    where = (
        " (computed on the dual module over the opposite algebra)" if r.kind == "costandard" else ""
    )
    return (
        f"{label}: at step {ob.get('step')} (vertex {lam}) the trace of P({lam}) in what is left has "
        f"dimension vector {tuple(ob.get('trace_dimension_vector', ()))}, but {ob.get('multiplicity')} "
        f"cop{'y' if ob.get('multiplicity') == 1 else 'ies'} of {sym}({lam}) would have "
        f"{tuple(ob.get('expected_dimension_vector', ()))}{where}"
    )


def _filtered(
    A: BasicAlgebra, order: PartialOrder, results: list[FiltrationResult], kind: str, name: str
) -> Axiom:
    bad = []
    sym = "Delta" if kind == "standard" else "nabla"
    mod = "P" if kind == "standard" else "I"
    for L, r in enumerate(results):
        vL = A.vertices[L]
        label = f"{mod}({vL})"
        if not r.exists:
            bad.append(
                {
                    "vertex": vL,
                    "text": _obstruction_text(A, r, f"{label} has no {kind} filtration", sym),
                    "filtration": r.to_dict(A.vertices),
                }
            )
            continue
        m = r.multiplicities
        wrong = [mu for mu in range(A.n) if mu != L and m[mu] and not order.lt(L, mu)]
        if m[L] != 1 or wrong:
            text = (
                f"({label} : {sym}({vL})) = {m[L]}, not 1"
                if m[L] != 1
                else f"{label} has {sym}({A.vertices[wrong[0]]}) in its filtration but "
                f"{A.vertices[wrong[0]]} is not above {vL}"
            )
            bad.append(
                {
                    "vertex": vL,
                    "text": text,
                    "multiplicities": {A.vertices[v]: m[v] for v in range(A.n) if m[v]},
                }
            )
    if not bad:
        return Axiom(
            name,
            True,
            f"every {mod}(L) has a {kind} filtration with {sym}(L) once and otherwise {sym}(mu), mu > L",
        )
    return Axiom(
        name, False, f"{len(bad)} of {A.n} fail; first: {bad[0]['text'].split(':')[0]}", bad
    )


def _ext_axioms(
    A: BasicAlgebra, order: PartialOrder, Ds, Ns, max_syzygy_dimension: int | None
) -> tuple[Axiom, Axiom]:
    """The Ext conditions: Ext^1,2(Delta, nabla) = 0, and Ext^1(Delta(L), Delta(mu)) != 0 only if L < mu.

    A standard module whose resolution reaches the work budget leaves its
    pairs undecided (``holds`` is ``None`` unless another pair already fails).
    """
    from hwcat.errors import WorkBudgetExceeded
    from hwcat.theory.homological import ext_dimensions

    n = A.n
    bad, undecided = [], []

    def ext(M, N, degree: int, L: int):
        try:
            return ext_dimensions(M, N, degree, max_syzygy_dimension=max_syzygy_dimension)
        except WorkBudgetExceeded as exc:
            undecided.append({"standard": A.vertices[L], "degree": exc.degree, "text": str(exc)})
            return None

    with task("Ext(Delta, nabla)", total=n) as step:
        for L in range(n):
            step(1)
            for mu in range(n):
                e = ext(Ds[L], Ns[mu], 2, L)
                if e is None:
                    break
                for i in (1, 2):
                    if e[i]:
                        bad.append(
                            {
                                "standard": A.vertices[L],
                                "costandard": A.vertices[mu],
                                "degree": i,
                                "dimension": e[i],
                                "text": f"dim Ext^{i}(Delta({A.vertices[L]}), nabla({A.vertices[mu]})) = {e[i]}",
                            }
                        )
    a1 = _ext_axiom(
        "ext-standard-costandard", "Ext^i(Delta(L), nabla(mu)) = 0 for i = 1, 2", bad, undecided
    )
    bad2, undecided = [], []
    for L in range(n):
        for mu in range(n):
            e = ext(Ds[L], Ds[mu], 1, L)
            if e is None:
                break
            d = e[1]
            if d and not order.lt(L, mu):
                bad2.append(
                    {
                        "first": A.vertices[L],
                        "second": A.vertices[mu],
                        "dimension": d,
                        "text": f"dim Ext^1(Delta({A.vertices[L]}), Delta({A.vertices[mu]})) = {d} but "
                        f"{A.vertices[L]} is not below {A.vertices[mu]}",
                    }
                )
    a2 = _ext_axiom(
        "ext-quiver-standard", "Ext^1(Delta(L), Delta(mu)) != 0 only if L < mu", bad2, undecided
    )
    return a1, a2


def _ext_axiom(name: str, statement: str, bad: list, undecided: list) -> Axiom:
    if bad:
        return Axiom(name, False, bad[0]["text"], bad)
    if undecided:
        u = undecided[0]
        return Axiom(
            name,
            None,
            f"undecided: the resolution of Delta({u['standard']}) reached the work budget at "
            f"degree {u['degree']}",
            {"undecided": undecided},
        )
    return Axiom(name, True, statement, None)


def check_order(
    A: BasicAlgebra,
    order: PartialOrder,
    *,
    order_source: str = "given",
    extensions: bool = True,
    homological: bool = True,
    bound: int | None = None,
    max_syzygy_dimension: int | None = None,
) -> OrderVerdict:
    """Check every highest-weight axiom for ``order``; the verdict with witnesses.

    ``bound`` and ``max_syzygy_dimension`` are the work budget of the
    homological part (see :mod:`hwcat.theory.homological_dimension`; defaults
    there): the global dimension may come back as "at least k" and an Ext
    axiom as undecided, but the check always ends.

    ``quasi_hereditary`` is the module-theoretic verdict (standard modules
    schurian and projectives standardly filtered); the heredity chain is
    computed independently and must agree, as must the dual statement for the
    injectives: a disagreement raises :class:`InternalInconsistency`.

    >>> from hwcat.io.spec import load_spec_text
    >>> from hwcat.theory.orders import parse_order
    >>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["1", "2"]\\narrows = ["a: 1 -> 2"]')
    >>> v = check_order(A, parse_order("1 < 2", A.vertices))
    >>> v.quasi_hereditary, [a.holds for a in v.axioms]
    (True, [True, True, True, True, True, True, True, True])
    >>> [a.name for a in v.axioms][-2:]
    ['ext-standard-costandard', 'ext-quiver-standard']
    """
    n = A.n
    Ps = [projective(A, L) for L in range(n)]
    Is = [injective(A, L) for L in range(n)]
    Ds = [standard_module(A, L, order) for L in range(n)]
    Ns = [costandard_module(A, L, order) for L in range(n)]
    pf = [standard_filtration(P, order) for P in Ps]
    inf = [costandard_filtration(I, order) for I in Is]
    ax1 = _schurian(A, order)
    ax2 = _filtered(A, order, pf, "standard", AXIOM_NAMES[1])
    ax3 = _filtered(A, order, inf, "costandard", AXIOM_NAMES[2])
    costd_schurian = all(N.dims[L] == 1 for L, N in enumerate(Ns))
    h = heredity_chain(A, order)
    ax4 = Axiom(
        AXIOM_NAMES[3],
        h.holds,
        "the idempotent ideals of the upper sets form heredity chains"
        if h.holds
        else (h.failure or {}).get("reason", "heredity chain fails"),
        h.failure,
    )
    C = tuple(tuple(r) for r in A.cartan())
    D = tuple(tuple(Ds[j].dims[i] for j in range(n)) for i in range(n))
    E = tuple(tuple(Ns[j].dims[i] for j in range(n)) for i in range(n))
    # BGG reciprocity
    if all(r.exists for r in pf):
        mism = [
            {
                "projective": A.vertices[L],
                "standard": A.vertices[mu],
                "filtration_multiplicity": pf[L].multiplicities[mu],
                "costandard_composition_multiplicity": E[L][mu],
                "text": f"(P({A.vertices[L]}) : Delta({A.vertices[mu]})) = {pf[L].multiplicities[mu]} but "
                f"[nabla({A.vertices[mu]}) : L({A.vertices[L]})] = {E[L][mu]}",
            }
            for L in range(n)
            for mu in range(n)
            if pf[L].multiplicities[mu] != E[L][mu]
        ]
        ax5 = Axiom(
            AXIOM_NAMES[4],
            not mism,
            "(P(L) : Delta(mu)) = [nabla(mu) : L(L)] for all L, mu"
            if not mism
            else mism[0]["text"],
            mism or None,
        )
    else:
        missing = [A.vertices[L] for L in range(n) if not pf[L].exists]
        ax5 = Axiom(
            AXIOM_NAMES[4],
            False,
            f"not applicable: P({missing[0]}) has no standard filtration",
            {
                "projectives_without_standard_filtration": missing,
                "text": "needs standard filtrations of the projectives: "
                + ", ".join(f"P({x})" for x in missing)
                + (" has none" if len(missing) == 1 else " have none"),
            },
        )
    DEt = tuple(tuple(sum(D[i][k] * E[j][k] for k in range(n)) for j in range(n)) for i in range(n))
    diff = [[C[i][j] - DEt[i][j] for j in range(n)] for i in range(n)]
    ok6 = all(x == 0 for r in diff for x in r)
    ax6 = Axiom(
        AXIOM_NAMES[5],
        ok6,
        "C = D * E^T" if ok6 else "C differs from D * E^T",
        None
        if ok6
        else {
            "cartan": [list(r) for r in C],
            "d_times_e_transpose": [list(r) for r in DEt],
            "difference": diff,
            "text": "C - D*E^T = " + str(diff),
        },
    )
    qh = ax1.holds and ax2.holds
    if h.holds != qh:
        raise InternalInconsistency(
            f"heredity chain says {h.holds} but the module-theoretic axioms say {qh} for order {order.chain_text()}"
        )
    if qh and not (ax3.holds and costd_schurian and ax5.holds and ax6.holds):
        raise InternalInconsistency(
            "quasi-hereditary by the standard modules, yet the costandard side, BGG reciprocity or C = D E^T fails"
        )
    extra: tuple[Axiom, ...] = ()
    gd = tilt = rcart = None
    if homological:
        from hwcat.theory.homological import global_dimension
        from hwcat.theory.tilting import ringel_dual, tilting_modules

        extra = _ext_axioms(A, order, Ds, Ns, max_syzygy_dimension)
        if qh and any(a.holds is False for a in extra):
            raise InternalInconsistency("quasi-hereditary, yet an Ext condition fails")
        if bound is None and qh:
            bound = max(2 * n - 1, 1)
        gd = global_dimension(A, bound=bound, max_syzygy_dimension=max_syzygy_dimension)
        if qh:
            # "at least k" is a proven lower bound too
            if gd.case == "infinite" or gd.value > max(2 * n - 2, 0):
                raise InternalInconsistency(
                    f"quasi-hereditary with {n} simples but global dimension {gd} (Ringel 2010: at most 2n - 2)"
                )
            tilt = tuple(tilting_modules(A, order))
            R, _ = ringel_dual(A, order)
            rcart = tuple(tuple(r) for r in R.cartan())
    n_ext = n_qh = None
    note = ""
    if not order.is_total and extensions:
        from hwcat.theory.search import count_quasi_hereditary_extensions

        n_ext = order.count_linear_extensions()
        n_qh = count_quasi_hereditary_extensions(A, order)
        if qh and n_qh != n_ext:
            raise InternalInconsistency(
                "a quasi-hereditary partial order has a linear extension for which it is not quasi-hereditary"
            )
        note = (
            f"the order is partial: {n_qh} of its {n_ext} linear extensions make it quasi-hereditary"
            + (" (all, with the same standard modules)" if qh else "")
        )
    return OrderVerdict(
        name=A.name,
        vertices=A.vertices,
        order=order,
        order_source=order_source,
        quasi_hereditary=qh,
        axioms=(ax1, ax2, ax3, ax4, ax5, ax6) + extra,
        cartan=C,
        decomposition_standard=D,
        decomposition_costandard=E,
        standard_equals_costandard=D == E,
        standardly_stratified=ax2.holds,
        properly_stratified=ax2.holds and all(_filtered_by_proper(A, L, order) for L in range(n)),
        standards=tuple(summarise_module(M, f"Delta({A.vertices[L]})") for L, M in enumerate(Ds)),
        costandards=tuple(summarise_module(M, f"nabla({A.vertices[L]})") for L, M in enumerate(Ns)),
        projective_standard_multiplicities=tuple(r.multiplicities for r in pf),
        linear_extensions=n_ext,
        quasi_hereditary_linear_extensions=n_qh,
        note=note,
        global_dimension=gd,
        tilting=tilt,
        ringel_dual_cartan=rcart,
        tilting_summaries=None
        if tilt is None
        else tuple(summarise_module(t.module, f"T({A.vertices[t.vertex]})") for t in tilt),
    )
