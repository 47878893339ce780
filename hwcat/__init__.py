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

from __future__ import annotations

import importlib
from typing import Any

# Public names and the module each lives in.  They are imported on first use
# (PEP 562), so ``import hwcat`` and the command line start quickly; the
# command line imports only what a command needs.
_WHERE = {
    "BasicAlgebra": "hwcat.algebras",
    "Quiver": "hwcat.algebras",
    "bound_quiver_algebra": "hwcat.algebras",
    "family_algebra": "hwcat.algebras.families.registry",
    "HwcatError": "hwcat.errors",
    "InternalInconsistency": "hwcat.errors",
    "ResourceLimitError": "hwcat.errors",
    "WorkBudgetExceeded": "hwcat.errors",
    "GF": "hwcat.exact",
    "QQ": "hwcat.exact",
    "Mat": "hwcat.exact",
    "parse_field": "hwcat.exact",
    "load": "hwcat.io.spec",
    "load_spec": "hwcat.io.spec",
    "load_spec_text": "hwcat.io.spec",
    "Module": "hwcat.modules",
    "hom": "hwcat.modules",
    "hom_dimension": "hwcat.modules",
    "injective": "hwcat.modules",
    "projective": "hwcat.modules",
    "simple": "hwcat.modules",
    "ActionModule": "hwcat.modules.action",
    "tensor_product": "hwcat.modules.action",
    "analyse_module": "hwcat.theory.module_report",
    "check": "hwcat.theory.check",
    "costandard_filtration": "hwcat.theory.highest_weight",
    "costandard_module": "hwcat.theory.highest_weight",
    "heredity_chain": "hwcat.theory.highest_weight",
    "standard_filtration": "hwcat.theory.highest_weight",
    "standard_module": "hwcat.theory.highest_weight",
    "ext_dimension": "hwcat.theory.homological",
    "ext_dimensions": "hwcat.theory.homological",
    "global_dimension": "hwcat.theory.homological",
    "injective_dimension": "hwcat.theory.homological",
    "projective_dimension": "hwcat.theory.homological",
    "PartialOrder": "hwcat.theory.orders",
    "parse_order": "hwcat.theory.orders",
    "total_order": "hwcat.theory.orders",
    "is_quasi_hereditary": "hwcat.theory.search",
    "quasi_hereditary_orders": "hwcat.theory.search",
    "describe": "hwcat.theory.structure",
    "ringel_dual": "hwcat.theory.tilting",
    "tilting_module": "hwcat.theory.tilting",
    "tilting_modules": "hwcat.theory.tilting",
    "check_order": "hwcat.theory.verdict",
}


def __getattr__(name: str) -> Any:
    where = _WHERE.get(name)
    if where is None:
        raise AttributeError(f"module 'hwcat' has no attribute {name!r}")
    value = getattr(importlib.import_module(where), name)
    globals()[name] = value
    return value


def __dir__() -> list[str]:
    return sorted(set(globals()) | set(_WHERE))


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
    "ActionModule",
    "tensor_product",
    "analyse_module",
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
    "WorkBudgetExceeded",
    "InternalInconsistency",
]
