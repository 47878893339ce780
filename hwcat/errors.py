"""The exceptions hwcat raises.

There is one root, :class:`HwcatError`.  Every error caused by bad input is a
subclass that also derives from the matching built-in exception, so callers may
catch either.  The command line turns any :class:`HwcatError` into one line on
standard error and exit code 2.  :class:`InternalInconsistency` is different:
it means two independent computations of the same fact disagreed, which is a
bug in hwcat, and it is never turned into a quiet exit.
"""

from __future__ import annotations

__all__ = [
    "HwcatError",
    "FieldError",
    "CoefficientError",
    "SpecSyntaxError",
    "SpecError",
    "QuiverError",
    "RelationError",
    "NotFiniteDimensional",
    "NotAdmissible",
    "OrderError",
    "VertexError",
    "StructureConstantsError",
    "NotSplitError",
    "ResourceLimitError",
    "WorkBudgetExceeded",
    "ModuleFileError",
    "InternalInconsistency",
    "CampaignError",
    "MissingExtra",
]


class HwcatError(Exception):
    """Root of all errors raised by hwcat."""


class FieldError(HwcatError, ValueError):
    """A field name that is malformed or names no field hwcat supports."""


class CoefficientError(HwcatError, ValueError):
    """A coefficient that is not an element of the field (e.g. 1/7 in GF(7))."""


class SpecSyntaxError(HwcatError, ValueError):
    """A spec file that is not valid TOML."""


class SpecError(HwcatError, ValueError):
    """A spec file whose content is wrong: missing or unknown keys, bad types."""


class QuiverError(SpecError):
    """A quiver that is malformed: duplicate names, unknown endpoints, empty.

    ``arrow`` is the position of the offending arrow in the list given, if one is.
    """

    def __init__(self, message: str, *, arrow: int | None = None) -> None:
        super().__init__(message)
        self.arrow = arrow


class RelationError(SpecError):
    """A relation that cannot be read or does not lie in the square of the arrow ideal."""


class NotFiniteDimensional(HwcatError, ValueError):
    """The ideal leaves paths of every length alive."""


class NotAdmissible(HwcatError, ValueError):
    """The ideal is not admissible (the arrows do not generate a nilpotent ideal)."""


class VertexError(HwcatError, ValueError):
    """A vertex (simple module) named or numbered that the algebra does not have."""


class OrderError(HwcatError, ValueError):
    """A partial order on the simples that is malformed, cyclic or names unknown vertices."""


class StructureConstantsError(SpecError):
    """A multiplication table or set of matrices that does not define a unital associative algebra."""


class NotSplitError(HwcatError, ValueError):
    """A simple component of the semisimple quotient does not split over the given field."""


class ResourceLimitError(HwcatError, ValueError):
    """The work asked for exceeds a resource limit of :mod:`hwcat.limits` (raise it to go on)."""


class WorkBudgetExceeded(HwcatError, RuntimeError):
    """A computation reached its work budget (e.g. a syzygy larger than allowed).

    Not a mathematical answer: the message names the budget and how to raise
    it.  ``degree`` is the step that was not computed, ``size`` the dimension
    that exceeded ``limit``.
    """

    def __init__(self, message: str, *, degree: int = 0, size: int = 0, limit: int = 0) -> None:
        super().__init__(message)
        self.degree, self.size, self.limit = degree, size, limit


class ModuleFileError(SpecError):
    """A module file, a module name or an element expression is malformed, or the
    matrices do not define a module (a relation or product fails)."""


class InternalInconsistency(HwcatError, AssertionError):
    """Two independent computations of the same fact disagree: a bug in hwcat."""


class CertificateError(HwcatError, ValueError):
    """A certificate file that cannot be read or is not a certificate (wrong shape or version)."""


# -- campaigns (fuzzing and surveys) -------------------------------------------------


class CampaignError(HwcatError, ValueError):
    """Bad input to a fuzz campaign or survey: claim file, function, options, grid."""


class MissingExtra(HwcatError, ImportError):
    """An optional dependency is not installed; the message says which extra brings it."""
