"""The report of ``hwcat module``: summands, what each one is, layers, Jordan types, centre.

Decomposition, ``dim End`` and Jordan types come from
:mod:`hwcat.theory.decompose` (generators only).  Identification needs the
simples: the module is moved to the basic algebra ``B`` of the spec (the
vertex spaces ``M e_s`` for the primitive idempotents ``e_s`` and the arrows
as elements of the input algebra; see :func:`as_representation`), and then

* ``[X : L(s)]`` is the dimension vector, layers are radical and socle layers;
* ``X = P(s)`` when the top of ``X`` is ``L(s)`` and ``X`` has the dimension
  vector of ``P(s)`` (``X`` is then a quotient of ``P(s)`` of the same
  dimension); ``I(s)`` dually with the socle;
* ``X = Delta(s)`` when the top is ``L(s)`` and the dimension vector is that
  of ``Delta(s)`` (all factors are then ``<= s``, so ``X`` is a quotient of
  ``Delta(s)``, the largest such quotient of ``P(s)``); ``nabla(s)`` dually;
* ``X = T(s)`` when a (checked) isomorphism with ``T(s)`` is found.
"""

from __future__ import annotations

from collections.abc import Sequence
from dataclasses import dataclass, field
from typing import Any

from hwcat.algebras.hub.basic import BasicAlgebra
from hwcat.errors import HwcatError, InternalInconsistency, ModuleFileError
from hwcat.exact import Mat, echelon
from hwcat.exact.polys import minpoly, select_columns
from hwcat.modules import Module, injective, projective
from hwcat.modules.action import ActionModule
from hwcat.theory.centre import PATH_TERMS, Centre, algebra_centre, hub_centre
from hwcat.theory.decompose import DEFAULT_SEED, JordanBlock, decompose, jordan_type
from hwcat.theory.orders import PartialOrder

__all__ = [
    "Layers",
    "SummandReport",
    "ModuleReport",
    "analyse_module",
    "as_representation",
    "restrict",
]


# -- moving a module to the basic algebra -----------------------------------------------------------


def extend_to_basis(M: ActionModule, B: BasicAlgebra) -> None:
    """Give ``M`` the action of the whole basis of the algebra ``B`` was reduced from, when
    its generators are basis elements of that algebra (a table: a module file's
    generating set, a tensor product of modules of a Hopf family), checked exactly."""
    from hwcat.algebras.reduction.reduction import reduction_of
    from hwcat.modules.basis_action import BasisAction

    if M.representation is not None or M.basis_action is not None:
        return
    if M.combination_action is not None:
        return
    red = reduction_of(B)
    if red is None:
        return
    A = red.algebra
    gens = {g: X for g, X in M.generators.items() if g in A.basis}
    if not gens or len(gens) < len(M.generators):
        return
    ext = BasisAction(A, M.dim, gens)
    bad = ext.failure()
    if bad is not None:
        raise ModuleFileError(
            f"{M.name or 'the module'} is not a module of {A.name or 'the algebra'}: {bad}"
        )
    M.basis_action = ext.matrix
    M.combination_action = ext.act


def _arrow_elements(B: BasicAlgebra) -> list[tuple[int, int, list[Any]]]:
    """Per arrow ``u -> t`` of ``B``: the element ``e_u x e_t`` of the input algebra."""
    from hwcat.algebras.reduction.reduction import ARROW_TERMS, reduction_of

    red = reduction_of(B)
    A = red.algebra
    out = []
    for u, t, terms in B.cached(ARROW_TERMS, list):
        eu, et = list(red.idempotents[u]), list(red.idempotents[t])
        x = [A.field.zero] * A.dim
        for l, c in terms:
            y = A.product(A.product(eu, A.basis_vector(l)), et)
            x = [a + c * b for a, b in zip(x, y, strict=True)]
        out.append((u, t, x))
    return out


def as_representation(M: ActionModule, B: BasicAlgebra) -> tuple[Module, list[tuple[Mat, Mat]]]:
    """``M`` as a quiver representation of ``B``, with per vertex ``s`` the pair
    ``(W_s, P_s)``: ``W_s`` a basis of ``M e_s`` (rows) and ``P_s`` (``dim M x dim M e_s``)
    giving the coordinates of ``v e_s`` as ``v @ P_s``.

    The primitive idempotents and the arrows (elements of the input algebra) act
    on ``M`` through ``M.act``, all in one call."""
    from hwcat.algebras.reduction.reduction import ARROW_TERMS, reduction_of

    F = M.field
    if M.representation is not None:
        data, o = [], 0
        for d in M.representation.dims:
            W = Mat.unit_rows(F, M.dim, list(range(o, o + d)))
            data.append((W, W.transpose()))
            o += d
        return M.representation, data
    red = reduction_of(B)
    if red is None or (M.basis_action is None and M.combination_action is None):
        raise InternalInconsistency("no way to move this module to the basic algebra")
    if not B.is_cached(ARROW_TERMS):
        raise InternalInconsistency("the reduction kept no arrow terms")
    arrows = _arrow_elements(B)
    acts = M.act([list(e) for e in red.idempotents] + [x for _, _, x in arrows])
    data = []
    for E in acts[: B.n]:
        if not (E @ E == E):
            raise InternalInconsistency("a primitive idempotent does not act idempotently")
        W = echelon(E)
        piv = list(W.echelon_pivots()) if W.nrows else []
        data.append((W, select_columns(E, piv) if piv else Mat.zeros(F, M.dim, 0)))
    dims = [W.nrows for W, _ in data]
    if sum(d * m for d, m in zip(dims, B.morita, strict=True)) != M.dim:
        raise InternalInconsistency("the vertex spaces M e_s do not account for dim M")
    maps = []
    for (u, t, _), X in zip(arrows, acts[B.n :], strict=True):
        if dims[u] and dims[t]:
            maps.append(data[u][0] @ X @ data[t][1])
        else:
            maps.append(Mat.zeros(F, dims[u], dims[t]))
    return Module(B, dims, maps, M.name), data


def _sub_representation(R: Module, data: list[tuple[Mat, Mat]], basis: Mat) -> Module:
    """The summand with ``basis`` (rows in the module's coordinates) as a subrepresentation."""
    spaces = []
    for _, P in data:
        if P.ncols == 0:
            spaces.append(Mat.zeros(R.field, 0, 0))
        else:
            spaces.append(echelon(basis @ P))
    return R.submodule(spaces)


# -- results -------------------------------------------------------------------------------------------


def _blocks_dict(F, blocks: Sequence[JordanBlock]) -> list[dict[str, Any]]:
    return [b.to_dict(F) for b in blocks]


@dataclass(frozen=True)
class Layers:
    """Composition factors and radical/socle layers of a representation of ``B``
    (the part of the report shared by the whole module and each summand)."""

    composition_factors: dict[str, int]
    radical_layers: tuple[tuple[int, ...], ...]
    socle_layers: tuple[tuple[int, ...], ...]

    @classmethod
    def of(cls, X: Module) -> Layers:
        B = X.algebra
        return cls(
            {B.vertices[s]: X.dims[s] for s in range(B.n) if X.dims[s]},
            tuple(X.radical_layers()),
            tuple(X.socle_layers()),
        )

    @property
    def loewy_length(self) -> int:
        return len(self.radical_layers)

    def to_dict(self) -> dict[str, Any]:
        return {
            "composition_factors": dict(self.composition_factors),
            "radical_layers": [list(x) for x in self.radical_layers],
            "socle_layers": [list(x) for x in self.socle_layers],
            "loewy_length": self.loewy_length,
        }


@dataclass(frozen=True)
class SummandReport:
    """One indecomposable summand (``layers`` is ``None`` without the simples)."""

    index: int
    dimension: int
    isomorphism_class: int
    endomorphism_dimension: int
    layers: Layers | None
    identified_as: tuple[tuple[str, str], ...]  # (name, test)
    jordan_types: dict[str, tuple[JordanBlock, ...]]
    _field: Any = field(default=None, repr=False, compare=False)

    def to_dict(self) -> dict[str, Any]:
        d: dict[str, Any] = {
            "index": self.index,
            "dimension": self.dimension,
            "isomorphism_class": self.isomorphism_class,
            "endomorphism_dimension": self.endomorphism_dimension,
        }
        if self.layers is not None:
            d.update(self.layers.to_dict())
        d["identified_as"] = [{"name": n, "test": t} for n, t in self.identified_as]
        d["jordan_types"] = {k: _blocks_dict(self._field, v) for k, v in self.jordan_types.items()}
        return d


@dataclass(frozen=True)
class ModuleReport:
    """What ``hwcat module`` prints (``simples`` and ``layers`` are ``None`` without the
    simples)."""

    name: str
    field: str
    dimension: int
    simples: tuple[str, ...] | None
    layers: Layers | None
    summands: tuple[SummandReport, ...]
    endomorphism_dimension: int
    jordan_types: dict[str, tuple[JordanBlock, ...]]
    order: str | None
    centre: Centre | None
    central_non_semisimple: tuple[tuple[str, tuple[int, ...]], ...]
    notes: tuple[str, ...] = ()
    _field: Any = field(default=None, repr=False, compare=False)

    def to_dict(self) -> dict[str, Any]:
        d: dict[str, Any] = {
            "name": self.name,
            "field": self.field,
            "dimension": self.dimension,
            "endomorphism_dimension": self.endomorphism_dimension,
            "summands": [s.to_dict() for s in self.summands],
            "jordan_types": {k: _blocks_dict(self._field, v) for k, v in self.jordan_types.items()},
        }
        if self.simples is not None and self.layers is not None:
            d["simples"] = list(self.simples)
            d.update(self.layers.to_dict())
            d["order"] = self.order
        if self.centre is not None:
            d["centre"] = {
                "dimension": self.centre.dimension,
                "basis": list(self.centre.texts),
                "terms": self.centre.terms,
                "non_semisimple_on_summands": [
                    {"element": e, "summands": list(ix)} for e, ix in self.central_non_semisimple
                ],
            }
        d["notes"] = list(self.notes)
        return d


# -- identification ------------------------------------------------------------------------------------


def _unit(n: int, s: int) -> tuple[int, ...]:
    return tuple(1 if v == s else 0 for v in range(n))


def _identify(X: Module, order: PartialOrder | None, qh: bool) -> list[tuple[str, str]]:
    from hwcat.theory.highest_weight import costandard_module, standard_module
    from hwcat.theory.homological_dimension import find_isomorphism

    B = X.algebra
    names = B.vertices
    out: list[tuple[str, str]] = []
    top, soc = X.top(), X.socle()
    if X.dim == 1:
        s = X.dims.index(1)
        out.append((f"L({names[s]})", "dimension vector of a simple"))
    tops = [s for s in range(B.n) if top == _unit(B.n, s)]
    socs = [s for s in range(B.n) if soc == _unit(B.n, s)]
    proj = inj = None
    for s in tops:
        if projective(B, s).dims == X.dims:
            proj = s
            out.append(
                (f"P({names[s]})", f"top L({names[s]}) and the dimension vector of P({names[s]})")
            )
    for s in socs:
        if injective(B, s).dims == X.dims:
            inj = s
            out.append(
                (f"I({names[s]})", f"socle L({names[s]}) and the dimension vector of I({names[s]})")
            )
    if proj is not None and inj is not None:
        out.append(("projective-injective", f"both P({names[proj]}) and I({names[inj]})"))
    if order is not None:
        for s in tops:
            if standard_module(B, s, order).dims == X.dims:
                out.append(
                    (
                        f"Delta({names[s]})",
                        f"top L({names[s]}) and the dimension vector of Delta({names[s]})",
                    )
                )
        for s in socs:
            if costandard_module(B, s, order).dims == X.dims:
                out.append(
                    (
                        f"nabla({names[s]})",
                        f"socle L({names[s]}) and the dimension vector of nabla({names[s]})",
                    )
                )
        if qh:
            from hwcat.theory.tilting import tilting_module

            for s in range(B.n):
                T = tilting_module(B, s, order).module
                if T.dims == X.dims and find_isomorphism(X, T) is not None:
                    out.append((f"T({names[s]})", f"an isomorphism with T({names[s]}) (checked)"))
    return out


def _non_semisimple(Z: Mat) -> bool:
    return any(e > 1 for _, e in minpoly(Z).factor())


def analyse_module(
    M: ActionModule,
    B: BasicAlgebra | None = None,
    *,
    elements: Sequence[str] = (),
    order: PartialOrder | None = None,
    identify: bool = True,
    seed: int = DEFAULT_SEED,
) -> ModuleReport:
    """Decompose ``M``, compute Jordan types of ``elements`` and, with ``B`` and
    ``identify``, the layers, what each summand is and the centre's action."""
    from hwcat.theory.highest_weight import heredity_chain

    F = M.field
    if identify and B is not None:
        extend_to_basis(M, B)
    D = decompose(M, seed=seed)
    notes: list[str] = []
    R = data = None
    qh = False
    order_text = None
    if identify and B is not None:
        R, data = as_representation(M, B)
        if order is None and B.natural_order:
            from hwcat.theory.check import as_order

            order = as_order(B, B.natural_order)
            notes.append("order: the family's natural order")
        if order is None:
            from hwcat.theory.search import quasi_hereditary_orders

            r = quasi_hereditary_orders(B, list_limit=1)
            if r.quasi_hereditary:
                order = r.structure_list[0].essential_order
                notes.append("order: the essential order of the first quasi-hereditary structure")
            else:
                notes.append("the algebra is quasi-hereditary for no order: no Delta, nabla, T")
        if order is not None:
            qh = heredity_chain(B, order).holds
            order_text = order.chain_text()
            if not qh:
                notes.append(f"not quasi-hereditary for {order_text}: no T(i)")
    summ: list[SummandReport] = []
    pieces: list[Module | None] = []
    restricted: dict[str, list[Mat]] = {}
    for i, S in enumerate(D.summands):
        jt = {}
        for text in elements:  # evaluated on the summand itself (its own letters)
            Y = S.module.element(text)
            restricted.setdefault(text, []).append(Y)
            jt[text] = tuple(jordan_type(Y))
        X = layers = None
        ident: list[tuple[str, str]] = []
        if R is not None:
            X = _sub_representation(R, data, S.basis)
            # a representation of the basic algebra counts each vertex once; a module of
            # the original algebra counts M e_s with the multiplicity dim L(s)
            weights = (1,) * B.n if M.representation is not None else B.morita
            if S.dimension != sum(d * m for d, m in zip(X.dims, weights, strict=True)):
                raise InternalInconsistency("a summand's vertex spaces do not account for it")
            layers = Layers.of(X)
            ident = _identify(X, order, qh)
        pieces.append(X)
        summ.append(
            SummandReport(
                i,
                S.dimension,
                S.isomorphism_class,
                S.endomorphism_dimension,
                layers,
                tuple(ident),
                jt,
                F,
            )
        )
    whole = {}
    for text in elements:
        blocks = [b for Y in restricted.get(text, []) for b in jordan_type(Y)]
        whole[text] = tuple(sorted(blocks, key=lambda b: (b.factor, -b.size)))
    cent = None
    nss: list[tuple[str, tuple[int, ...]]] = []
    if R is not None:
        cent, nss = _central_action(M, B, D, pieces, notes)
    return ModuleReport(
        name=M.name,
        field=F.name,
        dimension=M.dim,
        simples=tuple(B.vertices) if R is not None else None,
        layers=Layers.of(R) if R is not None else None,
        summands=tuple(summ),
        endomorphism_dimension=D.endomorphism_dimension,
        jordan_types=whole,
        order=order_text,
        centre=cent,
        central_non_semisimple=tuple(nss),
        notes=tuple(notes),
        _field=F,
    )


def _central_action(M: ActionModule, B: BasicAlgebra, D, pieces, notes: list[str]):
    """The centre and, per central basis element, the summands it acts on non-semisimply.

    A centre in the input algebra's basis acts on ``M`` itself; a centre written in
    the paths of ``B`` (quiver algebras, and reduced algebras above
    :data:`~hwcat.theory.centre.USER_TERMS_LIMIT` dimensions) acts on each summand
    moved to ``B``: under the Morita equivalence ``X -> X e`` a central ``z`` acts on
    ``X e`` by ``e z e``, and ``X e`` generates ``X``, so ``z`` is semisimple on ``X``
    iff on ``X e`` (derived)."""
    from hwcat.algebras.reduction.reduction import reduction_of
    from hwcat.modules.action import from_representation

    try:
        if M.representation is not None:
            cent = hub_centre(B)
            cent = Centre(cent.algebra, cent.basis, cent.texts, PATH_TERMS)
        else:
            cent = algebra_centre(B)
    except HwcatError as exc:  # pragma: no cover - defensive
        notes.append(f"centre not computed: {exc}")
        return None, []
    red = reduction_of(B)
    own_basis = M.representation is None and red is not None and cent.algebra is red.algebra
    if own_basis:
        actions = M.act([list(b) for b in cent.basis])
    nss = []
    for k, text in enumerate(cent.texts):
        bad = []
        for i, (S, X) in enumerate(zip(D.summands, pieces, strict=True)):
            if own_basis:
                Z = restrict(S.basis, actions[k])
            else:
                Z = from_representation(X).element(text) if X.dim else None
            if Z is not None and _non_semisimple(Z):
                bad.append(i)
        if bad:
            nss.append((text, tuple(bad)))
    return cent, nss


def restrict(basis: Mat, X: Mat) -> Mat:
    """``X`` on the invariant subspace spanned by the rows of ``basis`` (any basis)."""
    Y = basis @ X
    W = echelon(basis)
    piv = list(W.echelon_pivots())
    # coordinates in the basis ``basis``: solve c @ basis = y via the pivot columns
    T = select_columns(basis, piv).inverse()
    return select_columns(Y, piv) @ T
