"""hwcat: exact highest-weight-category checks for finite-dimensional algebras.

>>> import hwcat
>>> A = hwcat.load_spec_text('''
... field = "QQ"
... [quiver]
... vertices = ["1", "2", "3"]
... arrows = ["a: 1 -> 2", "b: 2 -> 3"]
... ''')
>>> hwcat.quasi_hereditary_orders(A).structures      # Catalan(3)
5
>>> v = hwcat.check(A, "3 > 2 > 1")
>>> v.quasi_hereditary, len(v.axioms)
(True, 8)
>>> hwcat.standard_module(A, "2", hwcat.parse_order("1 > 2 > 3", A.vertices)).dims
(0, 1, 1)
>>> hwcat.load(family="temperley-lieb", n=4, delta=0, field="QQ").n
2
"""

from hwcat.algebras import BasicAlgebra, Quiver, bound_quiver_algebra
from hwcat.algebras.families.registry import family_algebra
from hwcat.errors import HwcatError, InternalInconsistency, ResourceLimitError
from hwcat.exact import GF, QQ, Mat, parse_field
from hwcat.io.spec import load, load_spec, load_spec_text
from hwcat.modules import Module, hom, hom_dimension, injective, projective, simple
from hwcat.theory.check import check
from hwcat.theory.highest_weight import (
    costandard_filtration,
    costandard_module,
    heredity_chain,
    standard_filtration,
    standard_module,
)
from hwcat.theory.homological import (
    ext_dimension,
    ext_dimensions,
    global_dimension,
    injective_dimension,
    projective_dimension,
)
from hwcat.theory.orders import PartialOrder, parse_order, total_order
from hwcat.theory.search import is_quasi_hereditary, quasi_hereditary_orders
from hwcat.theory.structure import describe
from hwcat.theory.tilting import ringel_dual, tilting_module, tilting_modules
from hwcat.theory.verdict import check_order

__version__ = "0.1.0"

__all__ = [
    "QQ",
    "GF",
    "Mat",
    "parse_field",
    "Quiver",
    "BasicAlgebra",
    "bound_quiver_algebra",
    "load",
    "load_spec",
    "load_spec_text",
    "family_algebra",
    "Module",
    "projective",
    "injective",
    "simple",
    "hom",
    "hom_dimension",
    "describe",
    "PartialOrder",
    "parse_order",
    "total_order",
    "standard_module",
    "costandard_module",
    "standard_filtration",
    "costandard_filtration",
    "heredity_chain",
    "check",
    "check_order",
    "quasi_hereditary_orders",
    "is_quasi_hereditary",
    "projective_dimension",
    "injective_dimension",
    "global_dimension",
    "ext_dimension",
    "ext_dimensions",
    "tilting_module",
    "tilting_modules",
    "ringel_dual",
    "HwcatError",
    "ResourceLimitError",
    "InternalInconsistency",
]
