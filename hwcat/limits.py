"""Resource limits: how large an algebra, a vertex set or a multiplication table
hwcat agrees to build.

hwcat refuses work that would not end in reasonable time or memory, before it
starts when the size can be predicted (the built-in families, quivers without
relations up to ``vanish_from_length``) and while it builds otherwise (a bound
quiver algebra is built degree by degree and its dimension is checked after
every degree).  Hitting a limit raises :class:`~hwcat.errors.ResourceLimitError`
whose one-line message names the limit and how to raise it.

========================  ============  ==============================================
limit                     default       what it bounds
========================  ============  ==============================================
``max_dim``               100 000       dimension of an algebra and of every space built
                                        on the way (a degree of a bound quiver algebra,
                                        the span of generating matrices)
``max_vertices``          2 000         vertices of a quiver (the hub stores a block per
                                        pair of vertices)
``max_products``          50 000 000    products ``b_i * b_j`` of a multiplication table
                                        (dimension squared), and entries of a dense
                                        matrix (a generator of a ``[matrices]`` spec,
                                        the action on a module read from a file)
========================  ============  ==============================================

The defaults suit a machine with a few cores and about 24 GiB of memory: the
group algebra of ``S_7`` (dimension 5040, 25 million products) passes and takes
about 3 GiB; ``S_8`` (1.6 billion products) is refused at once.

From the command line: ``hwcat --max-dim N --max-quiver-vertices N --max-products N
COMMAND ...`` (the options may also follow the command).  From Python: the
loaders take ``max_dim=``, ``max_vertices=``, ``max_products=``, or wrap any code
in :func:`resource_limits`.

Examples
--------
>>> from hwcat.limits import resource_limits, current_limits
>>> current_limits().max_dim
100000
>>> with resource_limits(max_dim=10):
...     current_limits().max_dim
10
>>> with resource_limits(max_dim=10):
...     check_dimension(11, "the algebra")
Traceback (most recent call last):
    ...
hwcat.errors.ResourceLimitError: the algebra has dimension 11, above the limit max_dim = 10; raise it with --max-dim N (Python: max_dim=N)
"""

from __future__ import annotations

from collections.abc import Iterator
from contextlib import contextmanager
from contextvars import ContextVar
from dataclasses import asdict, dataclass, replace

from hwcat.errors import ResourceLimitError

__all__ = [
    "Limits",
    "DEFAULT_LIMITS",
    "current_limits",
    "resource_limits",
    "check_dimension",
    "check_vertices",
    "check_products",
    "check_matrix",
    "check_power_of_two",
    "limit_error",
    "size_text",
]


@dataclass(frozen=True)
class Limits:
    """The resource limits in force (see the module docstring for their meaning)."""

    max_dim: int = 100_000
    max_vertices: int = 2_000
    max_products: int = 50_000_000

    def to_dict(self) -> dict[str, int]:
        """The limits as plain data (keyword arguments of :func:`resource_limits`)."""
        return asdict(self)


DEFAULT_LIMITS = Limits()

_OPTION = {
    "max_dim": "--max-dim",
    "max_vertices": "--max-quiver-vertices",
    "max_products": "--max-products",
}

_current: ContextVar[Limits] = ContextVar("hwcat_limits", default=DEFAULT_LIMITS)


def current_limits() -> Limits:
    """The limits in force in this context."""
    return _current.get()


@contextmanager
def resource_limits(
    *,
    max_dim: int | None = None,
    max_vertices: int | None = None,
    max_products: int | None = None,
) -> Iterator[Limits]:
    """Run a block with some limits changed (``None`` keeps the limit in force)."""
    changes = {}
    for key, value in (
        ("max_dim", max_dim),
        ("max_vertices", max_vertices),
        ("max_products", max_products),
    ):
        if value is None:
            continue
        if isinstance(value, bool) or not isinstance(value, int) or value < 1:
            raise ResourceLimitError(f"{key} = {value!r}: a limit must be a positive integer")
        changes[key] = value
    new = replace(_current.get(), **changes)
    token = _current.set(new)
    try:
        yield new
    finally:
        _current.reset(token)


def size_text(x: int) -> str:
    """``123456`` in full, or ``about 10^k`` for numbers of more than 12 digits
    (of any length: the digits are not written out).

    >>> size_text(123456), size_text(10**5000 + 1)
    ('123456', 'about 10^5000')
    """
    if x < 10**12:
        return str(x)
    k = (x.bit_length() - 1) * 301029 // 1000000  # 0.301029 < log10(2): k <= log10(x)
    while 10 ** (k + 1) <= x:
        k += 1
    return f"about 10^{k}"


def limit_error(key: str, text: str) -> ResourceLimitError:
    """The one-line error: ``text`` (what was too large), the limit ``key`` and how to raise it."""
    limit = getattr(current_limits(), key)
    return ResourceLimitError(
        f"{text}, above the limit {key} = {limit}; raise it with {_OPTION[key]} N (Python: {key}=N)"
    )


def check_dimension(dim: int, what: str = "the algebra") -> None:
    """Refuse a space of dimension ``dim`` above ``max_dim`` (``what`` names it)."""
    if dim > current_limits().max_dim:
        raise limit_error("max_dim", f"{what} has dimension {size_text(dim)}")


def check_vertices(n: int, what: str = "the quiver") -> None:
    """Refuse a quiver with more than ``max_vertices`` vertices."""
    if n > current_limits().max_vertices:
        raise limit_error("max_vertices", f"{what} has {size_text(n)} vertices")


def check_products(dim: int, what: str = "the algebra") -> None:
    """Refuse a multiplication table of dimension ``dim``: above ``max_dim``, or with more
    than ``max_products`` products of basis elements."""
    check_dimension(dim, what)
    if dim * dim > current_limits().max_products:
        raise limit_error(
            "max_products",
            f"the multiplication table of {what} has {size_text(dim * dim)} products "
            f"(dimension {size_text(dim)} squared)",
        )


def check_power_of_two(n: int, text: str) -> None:
    """Refuse, with ``text``, something of dimension at least ``2^n`` when ``2^n > max_dim``;
    compared as ``n >= max_dim.bit_length()``, without computing ``2^n`` (``n`` may have
    many digits).

    >>> check_power_of_two(16, "fine")
    >>> check_power_of_two(10**30, "the chain of length 10^30 has dimension 2^(10^30)")
    Traceback (most recent call last):
        ...
    hwcat.errors.ResourceLimitError: the chain of length 10^30 has dimension 2^(10^30), above the limit max_dim = 100000; raise it with --max-dim N (Python: max_dim=N)
    """
    if n >= current_limits().max_dim.bit_length():
        raise limit_error("max_dim", text)


def check_matrix(rows: int, cols: int, what: str = "a matrix") -> None:
    """Refuse a dense ``rows x cols`` matrix before it is allocated: a side above
    ``max_dim``, or more than ``max_products`` entries (``what`` names it).

    >>> with resource_limits(max_products=99):
    ...     check_matrix(10, 10, "generator E")
    Traceback (most recent call last):
        ...
    hwcat.errors.ResourceLimitError: generator E has 10 rows and 10 columns, 100 entries, above the limit max_products = 99; raise it with --max-products N (Python: max_products=N)
    """
    shape = f"{what} has {size_text(rows)} rows and {size_text(cols)} columns"
    if max(rows, cols) > current_limits().max_dim:
        raise limit_error("max_dim", shape)
    if rows * cols > current_limits().max_products:
        raise limit_error("max_products", f"{shape}, {size_text(rows * cols)} entries")
