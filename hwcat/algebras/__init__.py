"""Layer 2: algebras.  Four rooms, each with one job:

``hub``
    the split basic algebra every analysis works on (:class:`BasicAlgebra`), its
    quiver and paths, and the raw representation kernels it is built with;
``inputs``
    the ways a user gives an algebra: quivers with relations (built degree by
    degree into the hub), structure-constant tables and matrix algebras;
``reduction``
    a general finite-dimensional algebra reduced to its basic algebra (radical,
    primitive idempotents, Gabriel quiver), and the presentation of a basic
    algebra as a quiver with relations;
``families``
    built-in families (group algebras, Schur, Temperley--Lieb, quantum groups,
    quiver families) by name and parameters.

Imports go downward in that list (``families`` may use ``reduction``, which may
use ``inputs``, which may use ``hub``), never back up.
"""

from hwcat.algebras.hub.basic import BasicAlgebra
from hwcat.algebras.hub.quiver import Arrow, Quiver, parse_relation
from hwcat.algebras.inputs.bound import bound_quiver_algebra

__all__ = ["BasicAlgebra", "bound_quiver_algebra", "Arrow", "Quiver", "parse_relation"]
