"""Layer 2: quivers, bound quiver algebras and the BasicAlgebra hub."""

from hwcat.algebras.basic import BasicAlgebra
from hwcat.algebras.bound import bound_quiver_algebra
from hwcat.algebras.quiver import Arrow, Quiver, parse_relation

__all__ = ["BasicAlgebra", "bound_quiver_algebra", "Arrow", "Quiver", "parse_relation"]
