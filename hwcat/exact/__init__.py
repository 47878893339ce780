"""Layer 1: exact fields, matrices and subspaces (the only code touching python-flint)."""

from hwcat.exact.fields import GF, QQ, Field, PrimeField, RationalField, parse_field
from hwcat.exact.matrices import (
    Mat,
    assemble,
    complement,
    contains,
    echelon,
    intersection,
    quotient_map,
    select_independent_rows,
    subspace_sum,
)

__all__ = [
    "Field",
    "RationalField",
    "PrimeField",
    "QQ",
    "GF",
    "parse_field",
    "Mat",
    "assemble",
    "echelon",
    "subspace_sum",
    "intersection",
    "complement",
    "contains",
    "quotient_map",
    "select_independent_rows",
]
