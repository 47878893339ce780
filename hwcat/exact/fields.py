"""Exact fields: the rationals ``QQ`` and prime fields ``GF(p)``.

A field is a singleton object that knows its characteristic, parses and prints
its elements, and picks the python-flint matrix type used for it.  This module
and :mod:`hwcat.exact.matrices` are the only code in hwcat that touches
python-flint; a later field (a finite field of prime-power order, a number
field) is added here without changing the layers above.

Examples
--------
>>> from hwcat.exact import QQ, GF, parse_field
>>> QQ.parse("3/4") + QQ.parse(-2)
-5/4
>>> F = GF(7)
>>> F.parse("3/4")          # 3 * 4^(-1) = 3 * 2 in GF(7)
6
>>> parse_field("GF(101)") is GF(101)
True
"""

from __future__ import annotations

import re
import sys
from array import array
from collections.abc import Iterator
from contextlib import contextmanager
from fractions import Fraction
from functools import cache
from typing import Any

import flint

from hwcat.errors import CoefficientError, FieldError

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
    "MAX_EXTENSION_DEGREE",
]

_NUMBER = re.compile(r"^\s*([+-]?\d+)\s*(?:/\s*(\d+)\s*)?$")
_MAX_PRIME = 1 << 63
MAX_EXTENSION_DEGREE = 1000
"""The largest degree of an extension field over ``QQ`` (``QQ(zetaN)``, ``QQ[r]/(f)``):
an element is a polynomial of that degree, and the field keeps ``2 * degree`` reduced
powers of its generator."""


@contextmanager
def long_int_text() -> Iterator[None]:
    """Lift Python's limit on converting long integers to and from text (4300 digits)
    inside a block: for writing results and reading certificates, whose exact
    numbers may be long.  The previous limit is restored afterwards.

    >>> with long_int_text():
    ...     len(str(10**5000))
    5001
    """
    old = sys.get_int_max_str_digits()
    sys.set_int_max_str_digits(0)
    try:
        yield
    finally:
        sys.set_int_max_str_digits(old)


def int_from_text(text: str) -> int:
    """The integer written in decimal in ``text`` (digits with an optional ``-``), of any length.

    Python's ``int(text)`` refuses more than 4300 digits (its limit on conversion
    from text) and takes time quadratic in the length; python-flint reads any
    length quickly.

    >>> int_from_text("-" + "9" * 5000) == -(10**5000 - 1)
    True
    """
    text = text.strip()
    if len(text) <= 4000:  # within Python's own limit, where int() is the faster reader
        return int(text)
    return int(flint.fmpz(text.removeprefix("+")))


class Field:
    """Base class of the exact fields.  Use :data:`QQ` or :func:`GF`."""

    name: str
    characteristic: int

    def __repr__(self) -> str:
        return self.name

    __str__ = __repr__

    # -- elements ---------------------------------------------------------
    def __call__(self, x: Any) -> Any:
        """Convert an int, Fraction, string such as ``"3/4"`` or field element."""
        if isinstance(x, str):
            return self.parse(x)
        if isinstance(x, bool) or isinstance(x, float):
            raise CoefficientError(f"{x!r} is not an exact coefficient of {self.name}")
        if isinstance(x, int):
            return self._from_int(x)
        if isinstance(x, Fraction):
            return self._from_fraction(x.numerator, x.denominator, str(x))
        return self._coerce(x)

    def parse(self, text: str | int) -> Any:
        """Parse ``"3"``, ``"-2"`` or ``"3/4"`` (also a plain int) into the field.

        Raises :class:`~hwcat.errors.CoefficientError` for text that is not a
        number or, in ``GF(p)``, for a denominator divisible by ``p``.
        """
        if isinstance(text, int) and not isinstance(text, bool):
            return self._from_int(text)
        m = _NUMBER.match(str(text))
        if not m:
            raise CoefficientError(f"{text!r} is not a coefficient (expected e.g. 3, -2, 3/4)")
        num = int_from_text(m.group(1))
        den = int_from_text(m.group(2)) if m.group(2) is not None else 1
        if den == 0:
            raise CoefficientError(f"{text!r} has denominator 0")
        return self._from_fraction(num, den, str(text).strip())

    @property
    def zero(self) -> Any:
        return self._from_int(0)

    @property
    def one(self) -> Any:
        return self._from_int(1)

    def denominator(self, x: Any) -> int:
        """The denominator of ``x`` (1 outside ``QQ``)."""
        return 1

    def to_str(self, x: Any) -> str:
        """The text form of an element, parseable again by :meth:`parse`."""
        return str(x)

    def to_int_or_str(self, x: Any) -> int | str:
        """JSON form of an element: an int when integral, else ``"p/q"``."""
        s = str(x)
        return int_from_text(s) if "/" not in s else s

    # -- implementation hooks ----------------------------------------------
    def _from_int(self, n: int) -> Any:  # pragma: no cover - abstract
        raise NotImplementedError

    def _from_fraction(self, num: int, den: int, text: str) -> Any:  # pragma: no cover
        raise NotImplementedError

    def _coerce(self, x: Any) -> Any:  # pragma: no cover
        raise NotImplementedError

    def _raw_matrix(self, nrows: int, ncols: int, entries: list) -> Any:  # pragma: no cover
        raise NotImplementedError


class RationalField(Field):
    """The field of rational numbers, backed by flint's ``fmpq``."""

    def __init__(self) -> None:
        self.name = "QQ"
        self.characteristic = 0

    def _from_int(self, n: int) -> Any:
        return flint.fmpq(n)

    def _from_fraction(self, num: int, den: int, text: str) -> Any:
        return flint.fmpq(num, den)

    def _coerce(self, x: Any) -> Any:
        if isinstance(x, flint.fmpq):
            return x
        if isinstance(x, flint.fmpz):
            return flint.fmpq(x)
        raise CoefficientError(f"{x!r} is not an element of QQ")

    def _raw_matrix(self, nrows: int, ncols: int, entries: list) -> Any:
        if not entries:
            return flint.fmpq_mat(nrows, ncols)
        return flint.fmpq_mat(nrows, ncols, entries)

    def denominator(self, x: Any) -> int:
        """The denominator of ``x`` in lowest terms."""
        return int(x.q)

    def to_int_or_str(self, x: Any) -> int | str:
        if x.q == 1:
            return int(x.p)
        return f"{x.p}/{x.q}"


class PrimeField(Field):
    """The field with ``p`` elements, backed by flint's ``nmod`` (p < 2^63)."""

    def __init__(self, p: int) -> None:
        self.name = f"GF({p})"
        self.characteristic = p
        self.p = p

    def _from_int(self, n: int) -> Any:
        return flint.nmod(n % self.p, self.p)

    def _from_fraction(self, num: int, den: int, text: str) -> Any:
        if den % self.p == 0:
            raise CoefficientError(
                f"coefficient {text!r}: its denominator {den} is divisible by p = {self.p}, "
                f"so it is not an element of {self.name}"
            )
        return flint.nmod(num % self.p, self.p) / flint.nmod(den % self.p, self.p)

    def _coerce(self, x: Any) -> Any:
        if isinstance(x, flint.nmod) and x.modulus() == self.p:
            return x
        if isinstance(x, flint.fmpz):
            return self._from_int(int(x))
        if isinstance(x, flint.fmpq):
            return self._from_fraction(int(x.p), int(x.q), str(x))
        raise CoefficientError(f"{x!r} is not an element of {self.name}")

    def _raw_matrix(self, nrows: int, ncols: int, entries: list) -> Any:
        if not entries:
            return flint.nmod_mat(nrows, ncols, self.p)
        if len(entries) >= 1024:
            from hwcat.exact.nmod_bulk import nmod_mat_from_residues

            p = self.p
            M = nmod_mat_from_residues(nrows, ncols, array("q", [int(e) % p for e in entries]), p)
            if M is not None:
                return M
        try:  # nmod entries of this modulus (or Python ints) are taken as they are
            return flint.nmod_mat(nrows, ncols, entries, self.p)
        except (TypeError, ValueError):
            return flint.nmod_mat(nrows, ncols, [int(e) for e in entries], self.p)

    def to_int_or_str(self, x: Any) -> int | str:
        return int(x)


QQ = RationalField()
"""The rational numbers."""


@cache
def _prime_field(p: int) -> PrimeField:
    return PrimeField(p)


def GF(p: int) -> PrimeField:
    """The prime field with ``p`` elements; ``p`` must be a prime below 2^63.

    >>> GF(5).characteristic
    5
    >>> GF(6)
    Traceback (most recent call last):
    ...
    hwcat.errors.FieldError: GF(6): 6 is not a prime
    """
    if isinstance(p, bool) or not isinstance(p, int):
        raise FieldError(f"GF({p!r}): the characteristic must be an integer")
    if p < 2 or not flint.fmpz(p).is_prime():
        raise FieldError(f"GF({p}): {p} is not a prime")
    if p >= _MAX_PRIME:
        raise FieldError(f"GF({p}): primes must be below 2^63")
    return _prime_field(p)


_FIELD_NAME = re.compile(
    r"^\s*(?:GF|F)\s*\(\s*(\d+)\s*(?:\^\s*(\d+)\s*)?(?:,\s*([A-Za-z_][A-Za-z0-9_]*)\s*)?\)\s*$"
)
_CYCLO = re.compile(r"^\s*QQ\s*\(\s*zeta\s*(\d+)\s*\)\s*$")
_QUOTIENT = re.compile(
    r"^\s*(QQ|GF\s*\(\s*\d+\s*\))\s*\[\s*([A-Za-z_][A-Za-z0-9_]*)\s*\]\s*/\s*\((.*)\)\s*$"
)
_FIELD_HELP = (
    'expected "QQ", "GF(p)", "GF(q)" or "GF(p^k)" (q = p^k a prime power, optionally '
    '"GF(q, w)" to name the generator w), "QQ(zetaN)", or "QQ[r]/(r^2 - 2)"'
)


def _prime_power(q: int) -> tuple[int, int] | None:
    if q < 2:
        return None
    for p, k in flint.fmpz(q).factor():
        return (int(p), int(k)) if int(p) ** int(k) == q else None
    return None  # pragma: no cover


def parse_field(text: str) -> Field:
    """Parse a field name: ``QQ``, ``GF(p)``, ``GF(q)``, ``GF(p^k)``, ``QQ(zetaN)``,
    ``QQ[r]/(r^2 - 2)`` or ``GF(p)[w]/(w^2 + 1)`` (see :mod:`hwcat.exact.extension`).

    >>> parse_field("QQ")
    QQ
    >>> parse_field("GF(2)")
    GF(2)
    >>> parse_field("GF(2^3)"), parse_field("GF(9, w)").gen_name
    (GF(8), 'w')
    >>> parse_field("QQ(zeta8)").modulus_text()
    'zeta8^4 + 1'
    >>> parse_field("QQ[r]/(r^2 - 4)")
    Traceback (most recent call last):
    ...
    hwcat.errors.FieldError: 'QQ[r]/(r^2 - 4)': the polynomial is reducible; it has the factor r - 2
    """
    from hwcat.exact.extension import cyclotomic_field, finite_field, number_field

    if not isinstance(text, str):
        raise FieldError(f"field {text!r}: {_FIELD_HELP}")
    if text.strip() in ("QQ", "Q"):
        return QQ
    m = _FIELD_NAME.match(text)
    if m:
        # sizes first: the order must be below 2^63 (19 digits) before anything is
        # computed from it (p^k, a factorisation, a primality test)
        if len(m.group(1).lstrip("0")) > 19:
            raise FieldError(f"field {text!r}: orders must be below 2^63")
        q = int(m.group(1))
        if m.group(2) is not None:
            p = q
            if p < 2 or not flint.fmpz(p).is_prime():
                raise FieldError(f"field {text!r}: {p} is not a prime")
            if len(m.group(2).lstrip("0")) > 2 or int(m.group(2)) >= 63:  # p^k >= 2^k
                raise FieldError(f"field {text!r}: orders must be below 2^63")
            k = int(m.group(2))
            if k < 1:
                raise FieldError(f"field {text!r}: the exponent must be at least 1")
        else:
            if q >= _MAX_PRIME:
                raise FieldError(f"field {text!r}: orders must be below 2^63")
            pk = _prime_power(q)
            if pk is None:
                raise FieldError(f"field {text!r}: {q} is not a prime power")
            p, k = pk
        if k == 1:
            if m.group(3) is not None:
                raise FieldError(f"field {text!r}: GF({p}) is a prime field; it has no generator")
            return GF(p)
        if p**k >= _MAX_PRIME:
            raise FieldError(f"field {text!r}: orders must be below 2^63")
        return finite_field(p, k, m.group(3) or "z")
    m = _CYCLO.match(text)
    if m:
        digits = m.group(1).lstrip("0") or "0"
        if len(digits) > 7:  # phi(N) >= sqrt(N / 2) > MAX_EXTENSION_DEGREE (from memory)
            raise FieldError(
                f"field {text!r}: QQ(zetaN) has degree phi(N) > {MAX_EXTENSION_DEGREE}, "
                f"above the largest degree {MAX_EXTENSION_DEGREE} of an extension field"
            )
        return cyclotomic_field(int(digits))
    m = _QUOTIENT.match(text)
    if m:
        base = re.sub(r"\s+", "", m.group(1))
        return number_field(m.group(2), m.group(3).strip(), base)
    raise FieldError(f"field {text!r}: unknown field ({_FIELD_HELP})")


# -- terms "coefficient * name * name" in relations and combinations -----------------------

_PLAIN_NUMBER = re.compile(r"^\d+(?:\s*/\s*\d+)?$")
_IDENT = re.compile(r"[A-Za-z_][A-Za-z0-9_']*")


def split_signed_terms(text: str) -> tuple[list[tuple[int, str]], bool]:
    """Split ``"a*b - (z + 1)*c*d"`` at the signs outside parentheses.

    Returns the ``(sign, term)`` pairs and whether the text ends with a dangling sign.

    >>> split_signed_terms("a*b - (z + 1)*c*d")
    ([(1, 'a*b'), (-1, '(z + 1)*c*d')], False)
    """
    terms: list[tuple[int, str]] = []
    sign, buf, depth = 1, "", 0
    for ch in text:
        if ch == "(":
            depth += 1
        elif ch == ")":
            depth -= 1
        if ch in "+-" and depth == 0 and not buf.rstrip().endswith(("^", "/", "*")):
            if buf.strip():
                terms.append((sign, buf.strip()))
                buf = ""
                sign = 1
            sign *= 1 if ch == "+" else -1
        else:
            buf += ch
    dangling = False
    if buf.strip():
        terms.append((sign, buf.strip()))
    elif text.strip() and text.strip()[-1] in "+-":
        dangling = True
    return terms, dangling


def split_factors(term: str) -> list[str]:
    """Split a term at the ``*`` outside parentheses (``**`` is read as ``^``)."""
    term = term.replace("**", "^")
    out, buf, depth = [], "", 0
    for ch in term:
        if ch == "(":
            depth += 1
        elif ch == ")":
            depth -= 1
        if ch == "*" and depth == 0:
            out.append(buf.strip())
            buf = ""
        else:
            buf += ch
    out.append(buf.strip())
    return out


def coefficient_prefix(field: Field, factors: list[str], names: Any) -> tuple[Any, list[str]]:
    """Read the leading factors that are field elements: ``(coefficient, other factors)``.

    A factor counts as a coefficient when it is not one of ``names`` and is a
    number, a parenthesised expression, or (over an extension field) an
    expression in the field's generator.  Raises
    :class:`~hwcat.errors.CoefficientError` when such a factor is not an element.

    >>> F = parse_field("GF(4)")
    >>> c, rest = coefficient_prefix(F, ["(z + 1)", "a", "b"], {"a", "b"})
    >>> str(c), rest
    ('z + 1', ['a', 'b'])
    """
    gen = getattr(field, "gen_name", None)
    k = 0
    while k < len(factors):
        f = factors[k]
        if f in names:
            break
        idents = set(_IDENT.findall(f))
        if (
            _PLAIN_NUMBER.match(f)
            or f.startswith("(")
            or (gen is not None and idents and idents <= {gen} and not set(f) & set("'"))
        ):
            k += 1
            continue
        break
    if k == 0:
        return field.one, factors
    text = "*".join(
        f"({f})" if not _PLAIN_NUMBER.match(f) else f.replace(" ", "") for f in factors[:k]
    )
    if k == 1:
        text = factors[0].replace(" ", "") if _PLAIN_NUMBER.match(factors[0]) else factors[0]
    return field.parse(text), factors[k:]
