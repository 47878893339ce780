"""Homological algebra: projective covers, minimal resolutions, Ext and dimensions.

This module is the public face of two implementation modules:

* :mod:`hwcat.theory.resolutions` -- projective covers and minimal
  presentations, syzygies, minimal projective resolutions with the
  multiplicities of their terms, minimal injective coresolutions (by duality
  with the opposite algebra), and ``dim Ext^i(M, N)`` for any modules from the
  Hom complex of the minimal resolution;
* :mod:`hwcat.theory.homological_dimension` -- isomorphisms and direct
  summands of modules (exhibited maps, checked exactly), projective and
  injective dimensions, and the global dimension as a number, as infinite
  (with a witness) or as "at least k" when a limit is reached first.

Their docstrings describe the methods.

Examples
--------
>>> from hwcat.io.spec import load_spec_text
>>> from hwcat.modules import simple
>>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["1", "2", "3"]\\n'
...                    'arrows = ["a: 1 -> 2", "b: 2 -> 3"]\\nrelations = ["a*b"]')
>>> projective_resolution(simple(A, 0), 5).multiplicities()
((1, 0, 0), (0, 1, 0), (0, 0, 1))
>>> ext_dimensions(simple(A, 0), simple(A, 2), 3)
(0, 0, 1, 0)
>>> g = global_dimension(A)
>>> g.case, g.json_value()
('finite', 2)
"""

from __future__ import annotations

from hwcat.theory.homological_dimension import (
    DEFAULT_MAX_SYZYGY_DIMENSION,
    DEFAULT_TRIES,
    SPLIT_CHECK_LIMIT,
    GlobalDimension,
    HomologicalDimension,
    InfiniteDimensionWitness,
    SimpleSummand,
    SyzygyRepeat,
    default_bound,
    find_isomorphism,
    find_split_embedding,
    global_dimension,
    injective_dimension,
    projective_dimension,
    simple_summands,
)
from hwcat.theory.resolutions import (
    InjectiveCoresolution,
    ProjectiveCover,
    ProjectiveResolution,
    ext_dimension,
    ext_dimensions,
    injective_coresolution,
    projective_cover,
    projective_presentation,
    projective_resolution,
    syzygy,
)

__all__ = [
    "ProjectiveCover",
    "ProjectiveResolution",
    "InjectiveCoresolution",
    "SyzygyRepeat",
    "SimpleSummand",
    "InfiniteDimensionWitness",
    "HomologicalDimension",
    "GlobalDimension",
    "projective_cover",
    "projective_presentation",
    "projective_resolution",
    "syzygy",
    "injective_coresolution",
    "ext_dimension",
    "ext_dimensions",
    "find_isomorphism",
    "find_split_embedding",
    "simple_summands",
    "projective_dimension",
    "injective_dimension",
    "global_dimension",
    "default_bound",
    "DEFAULT_TRIES",
    "DEFAULT_MAX_SYZYGY_DIMENSION",
    "SPLIT_CHECK_LIMIT",
]
