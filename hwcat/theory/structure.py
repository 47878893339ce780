"""The structure report: Cartan matrix, projectives, injectives, Loewy data, quiver."""

from __future__ import annotations

from dataclasses import dataclass
from typing import Any

from hwcat.algebras.hub.basic import BasicAlgebra
from hwcat.modules import Module, injective, projective
from hwcat.modules.loewy import LoewyDiagram, is_indecomposable_projective_injective, loewy_diagram
from hwcat.progress import task

__all__ = ["ModuleSummary", "StructureReport", "describe", "summarise_module"]


@dataclass(frozen=True)
class ModuleSummary:
    """Dimension data of one module: dimension vector, radical/socle layers, Loewy diagram.

    ``projective_injective`` says whether the module is an indecomposable
    projective-injective module (``None`` when not computed).
    """

    label: str
    dimension: int
    dimension_vector: tuple[int, ...]
    radical_layers: tuple[tuple[int, ...], ...]
    socle_layers: tuple[tuple[int, ...], ...]
    loewy_diagram: LoewyDiagram | None = None
    projective_injective: bool | None = None

    @property
    def loewy_length(self) -> int:
        return len(self.radical_layers)

    def to_dict(self) -> dict[str, Any]:
        return {
            "label": self.label,
            "dimension": self.dimension,
            "dimension_vector": list(self.dimension_vector),
            "radical_layers": [list(x) for x in self.radical_layers],
            "socle_layers": [list(x) for x in self.socle_layers],
            "loewy_length": self.loewy_length,
            "loewy_diagram": None if self.loewy_diagram is None else self.loewy_diagram.to_dict(),
            "projective_injective": self.projective_injective,
        }


def summarise_module(
    M: Module, label: str = "", socle: bool = True, diagram: bool = True
) -> ModuleSummary:
    """The :class:`ModuleSummary` of an indecomposable module ``M``."""
    return ModuleSummary(
        label or M.name,
        M.dim,
        M.dims,
        tuple(M.radical_layers()),
        tuple(M.socle_layers()) if socle else (),
        loewy_diagram(M) if diagram else None,
        is_indecomposable_projective_injective(M) if diagram else None,
    )


@dataclass(frozen=True)
class StructureReport:
    """What ``hwcat describe`` prints: the basic structure of an algebra."""

    name: str
    field: str
    dimension: int
    simples: tuple[str, ...]
    arrows: tuple[tuple[str, str, str], ...]
    cartan: tuple[tuple[int, ...], ...]
    projectives: tuple[ModuleSummary, ...]
    injectives: tuple[ModuleSummary, ...]
    loewy_length: int
    blocks: tuple[tuple[str, ...], ...]
    morita: tuple[int, ...]
    natural_order: str | None = None
    centre_dimension: int | None = None
    centre_basis: tuple[str, ...] = ()
    centre_terms: str = ""

    def to_dict(self) -> dict[str, Any]:
        return {
            "name": self.name,
            "field": self.field,
            "dimension": self.dimension,
            "simples": list(self.simples),
            "arrows": [{"name": n, "source": s, "target": t} for n, s, t in self.arrows],
            "cartan": [list(r) for r in self.cartan],
            "cartan_convention": "cartan[i][j] = [P(j) : L(i)]",
            "projectives": [p.to_dict() for p in self.projectives],
            "injectives": [p.to_dict() for p in self.injectives],
            "loewy_length": self.loewy_length,
            "blocks": [list(b) for b in self.blocks],
            "simple_dimensions": list(self.morita),
            "natural_order": self.natural_order,
            "centre_dimension": self.centre_dimension,
            "centre_basis": list(self.centre_basis),
            "centre_terms": self.centre_terms,
        }


def _summary(M: Module, step) -> ModuleSummary:
    out = summarise_module(M)
    step(1)
    return out


def describe(A: BasicAlgebra) -> StructureReport:
    """The structure report of an algebra.

    >>> from hwcat.io.spec import load_spec_text
    >>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["1", "2"]\\narrows = ["a: 1 -> 2"]')
    >>> r = describe(A)
    >>> r.dimension, r.cartan, r.loewy_length, r.centre_dimension
    (3, ((1, 0), (1, 1)), 2, 1)
    """
    from hwcat.theory.centre import algebra_centre

    with task("projective and injective modules", total=2 * A.n) as step:
        Ps = tuple(_summary(projective(A, s), step) for s in range(A.n))
        Is = tuple(_summary(injective(A, s), step) for s in range(A.n))
    Z = algebra_centre(A)
    return StructureReport(
        name=A.name,
        field=A.field.name,
        dimension=A.dim,
        simples=A.vertices,
        arrows=tuple((a.name, A.vertices[a.source], A.vertices[a.target]) for a in A.arrows),
        cartan=tuple(tuple(r) for r in A.cartan()),
        projectives=Ps,
        injectives=Is,
        loewy_length=max((p.loewy_length for p in Ps), default=0),
        blocks=tuple(tuple(A.vertices[v] for v in c) for c in A.components()),
        morita=A.morita,
        natural_order=A.natural_order,
        centre_dimension=Z.dimension,
        centre_basis=Z.texts,
        centre_terms=Z.terms,
    )
