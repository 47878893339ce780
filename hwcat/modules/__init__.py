"""Layer 3: modules as quiver representations, and homomorphisms."""

from hwcat.modules.hom import hom, hom_dimension, hom_dimension_naive
from hwcat.modules.loewy import LoewyDiagram, loewy_diagram
from hwcat.modules.module import (
    Module,
    direct_sum,
    injective,
    projective,
    regular_module,
    simple,
)

__all__ = [
    "Module",
    "projective",
    "injective",
    "simple",
    "direct_sum",
    "regular_module",
    "hom",
    "hom_dimension",
    "hom_dimension_naive",
    "LoewyDiagram",
    "loewy_diagram",
]
