"""Layer 1: exact fields, matrices and subspaces (the only code touching python-flint)."""

from hwcat.exact.blockmat import restrict_scalars, rows_over_extension
from hwcat.exact.extension import ExtensionField, splitting_field_hint
from hwcat.exact.fields import (
    GF,
    QQ,
    Field,
    PrimeField,
    RationalField,
    coefficient_prefix,
    int_from_text,
    long_int_text,
    parse_field,
    split_factors,
    split_signed_terms,
)
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
    "split_signed_terms",
    "split_factors",
    "coefficient_prefix",
    "int_from_text",
    "long_int_text",
    "ExtensionField",
    "splitting_field_hint",
    "restrict_scalars",
    "rows_over_extension",
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
