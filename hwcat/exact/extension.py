"""Finite extensions of the prime fields: ``GF(p^k)`` and number fields over ``QQ``.

An :class:`ExtensionField` is ``K = F[t] / (f)`` for a base field ``F`` (a
prime field ``GF(p)`` or ``QQ``) and a monic irreducible ``f`` of degree
``d``; its generator ``t`` has a name (``z`` by default for finite fields,
``zetaN`` for the cyclotomic field ``QQ(zetaN)``, the user's variable for
``QQ[r]/(r^2 - 2)``).  Elements are :class:`ExtElement` objects: a polynomial
in ``t`` of degree below ``d``, printed and parsed in the same notation
(``"z^2 + 1"``, ``"-1/2*r + 3"``).

Linear algebra over ``K`` is linear algebra over ``F``: an element ``a`` acts
on ``K = F^d`` (basis ``1, t, ..., t^(d-1)``, row vectors) by the ``d x d``
matrix ``[a]`` of ``v -> v a``, and an ``r x c`` matrix ``M`` over ``K``
becomes the ``rd x cd`` block matrix ``[M]`` over ``F``.  This is a ring map,
so products, inverses and ranks (``rank [M] = d rank M``) carry over; the
reduced echelon form of ``M`` is read off the one of ``[M]``: its rows whose
pivot is the first coordinate of a block are exactly the coefficient vectors of
the rows of the echelon form of ``M`` (the row space of ``[M]`` is the row
space of ``M`` seen over ``F``, and echelon forms are unique).

Default defining polynomial of ``GF(p^k)``: the first monic polynomial of
degree ``k`` over ``GF(p)`` that is *primitive* (irreducible, and ``t`` has
multiplicative order ``p^k - 1``), in the order of the coefficient list
``(c_(k-1), ..., c_0)`` read as a number in base ``p``.  So ``GF(4)`` is
``GF(2)[z]/(z^2 + z + 1)``, ``GF(8)`` is ``GF(2)[z]/(z^3 + z + 1)`` and
``GF(9)`` is ``GF(3)[z]/(z^2 + z + 2)``; the generator ``z`` is always a
primitive ``(q - 1)``-th root of unity.

Examples
--------
>>> from hwcat.exact import parse_field
>>> K = parse_field("GF(4)")
>>> K.modulus_text()
'z^2 + z + 1'
>>> z = K.gen
>>> str(z * z), str(z**3)
('z + 1', '1')
>>> L = parse_field("QQ[r]/(r^2 - 2)")
>>> str(L.parse("(r + 1)^2")), str(L.parse("1/(r + 1)"))
('2*r + 3', 'r - 1')
"""

from __future__ import annotations

import re
from functools import cache
from typing import Any

import flint

from hwcat.errors import CoefficientError, FieldError
from hwcat.exact.fields import MAX_EXTENSION_DEGREE, Field, int_from_text

__all__ = ["ExtensionField", "ExtElement", "finite_field", "number_field", "cyclotomic_field"]

_NAME_RE = re.compile(r"^[A-Za-z_][A-Za-z0-9_]*$")
_RESERVED = {"QQ", "Q", "GF", "F"}
_FIELDS: dict[str, Any] = {}


class ExtElement:
    """An element of an :class:`ExtensionField` (a reduced polynomial in its generator)."""

    __slots__ = ("K", "f")

    def __init__(self, K: ExtensionField, poly: Any) -> None:
        self.K = K
        self.f = poly

    # -- coercion of the other operand ------------------------------------
    def _other(self, y: Any) -> Any:
        if isinstance(y, ExtElement):
            if y.K is not self.K:
                raise CoefficientError(f"elements of {self.K} and {y.K} mixed")
            return y.f
        return self.K._poly([self.K.base(y) if not isinstance(y, int) else y])

    def __add__(self, y: Any) -> ExtElement:
        if y.__class__ is ExtElement and y.K is self.K:  # the common case, kept short
            return ExtElement(self.K, self.f + y.f)
        return ExtElement(self.K, self.f + self._other(y))

    __radd__ = __add__

    def __sub__(self, y: Any) -> ExtElement:
        return ExtElement(self.K, self.f - self._other(y))

    def __rsub__(self, y: Any) -> ExtElement:
        return ExtElement(self.K, self._other(y) - self.f)

    def __neg__(self) -> ExtElement:
        return ExtElement(self.K, -self.f)

    def __pos__(self) -> ExtElement:
        return self

    def __mul__(self, y: Any) -> ExtElement:
        if y.__class__ is ExtElement and y.K is self.K:  # the common case, kept short
            return ExtElement(self.K, (self.f * y.f) % self.K.modulus)
        if isinstance(y, ExtElement):
            return ExtElement(self.K, (self.f * self._other(y)) % self.K.modulus)
        return ExtElement(self.K, self.f * self._other(y))

    __rmul__ = __mul__

    def inverse(self) -> ExtElement:
        if self.f.is_zero():
            raise ZeroDivisionError(f"division by zero in {self.K}")
        g, s, _ = self.f.xgcd(self.K.modulus)
        # g is a nonzero constant (the modulus is irreducible)
        return ExtElement(self.K, (s * (1 / g.coeffs()[0])) % self.K.modulus)

    def __truediv__(self, y: Any) -> ExtElement:
        if not isinstance(y, ExtElement):
            y = self.K(y)
        return self * y.inverse()

    def __rtruediv__(self, y: Any) -> ExtElement:
        return self.K(y) * self.inverse()

    def __pow__(self, n: int) -> ExtElement:
        if not isinstance(n, int):
            return NotImplemented
        base = self if n >= 0 else self.inverse()
        n = abs(n)
        out = self.K.one
        while n:
            if n & 1:
                out = out * base
            base = base * base
            n >>= 1
        return out

    def __eq__(self, y: object) -> bool:
        if isinstance(y, ExtElement):
            return y.K is self.K and self.f == y.f
        try:
            return self.f == self._other(y)
        except (CoefficientError, TypeError, ValueError):
            return False

    def __ne__(self, y: object) -> bool:
        return not self.__eq__(y)

    def __hash__(self) -> int:
        return hash((self.K.name, tuple(str(c) for c in self.f.coeffs())))

    def __bool__(self) -> bool:
        return not self.f.is_zero()

    def __int__(self) -> int:
        if self.f.degree() > 0:
            raise ValueError(f"{self} is not an integer")
        c = self.f.coeffs()[0] if self.f.degree() == 0 else 0
        if self.K.is_finite:
            return int(c)
        if c.q != 1:
            raise ValueError(f"{self} is not an integer")
        return int(c.p)

    def coeffs(self) -> list:
        """The ``d`` coefficients over the base field (of ``1, t, ..., t^(d-1)``)."""
        c = list(self.f.coeffs())
        return c + [0] * (self.K.degree - len(c))

    def is_rational(self) -> bool:
        """Whether the element lies in the prime field (a constant polynomial)."""
        return self.f.degree() <= 0

    def __str__(self) -> str:
        return self.K.to_str(self)

    def __reduce__(self) -> tuple:
        return (_parse_in, (self.K, str(self)))

    def __repr__(self) -> str:
        return str(self)


def _parse_in(K: Any, text: str) -> ExtElement:
    return K.parse(text)


class ExtensionField(Field):
    """``base[t] / (modulus)``; build with :func:`finite_field`, :func:`number_field`
    or :func:`cyclotomic_field` (or :func:`hwcat.exact.parse_field`)."""

    def __new__(cls, base: Any, modulus: Any, gen_name: str, name: str) -> ExtensionField:
        # one object per field name, so that pickling and re-parsing give the same field
        known = _FIELDS.get(name)
        if known is not None:
            return known
        obj = super().__new__(cls)
        _FIELDS[name] = obj
        return obj

    def __init__(self, base: Any, modulus: Any, gen_name: str, name: str) -> None:
        from hwcat.exact.fields import PrimeField

        if getattr(self, "name", None) == name:
            return
        self.base = base
        self.modulus = modulus
        self.degree = modulus.degree()
        self.gen_name = gen_name
        self.name = name
        self.characteristic = base.characteristic
        self.is_finite = isinstance(base, PrimeField)
        self.order = base.characteristic**self.degree if self.is_finite else 0
        self.p = None  # not a prime field: code keyed on ``field.p`` must not use raw ints
        d = self.degree
        # powers t^d .. t^(2d-2) reduced, for building the d x d multiplication matrices
        self._xpow = [self._poly([0] * k + [1]) % modulus for k in range(2 * d)]

    # -- polynomials over the base ------------------------------------------
    def _poly(self, coeffs: list) -> Any:
        if self.is_finite:
            return flint.nmod_poly([int(c) for c in coeffs], self.characteristic)
        return flint.fmpq_poly([flint.fmpq(c) if not isinstance(c, int) else c for c in coeffs])

    def __repr__(self) -> str:
        return self.name

    __str__ = __repr__

    def __reduce__(self) -> tuple:
        from hwcat.exact.fields import parse_field

        return (parse_field, (self.name,))

    # -- elements -------------------------------------------------------------
    @property
    def gen(self) -> ExtElement:
        return ExtElement(self, self._xpow[1])

    @property
    def zero(self) -> ExtElement:
        return ExtElement(self, self._poly([]))

    @property
    def one(self) -> ExtElement:
        return ExtElement(self, self._poly([1]))

    def from_coeffs(self, coeffs: list) -> ExtElement:
        return ExtElement(self, self._poly(list(coeffs)))

    def __call__(self, x: Any) -> ExtElement:
        if isinstance(x, ExtElement):
            if x.K is not self:
                raise CoefficientError(f"{x} is an element of {x.K}, not of {self.name}")
            return x
        if isinstance(x, str):
            return self.parse(x)
        if isinstance(x, (bool, float)):
            raise CoefficientError(f"{x!r} is not an exact coefficient of {self.name}")
        try:
            b = self.base(x)
        except CoefficientError:
            raise CoefficientError(f"{x!r} is not an element of {self.name}") from None
        return ExtElement(self, self._poly([b]))

    def _from_int(self, n: int) -> ExtElement:
        return ExtElement(self, self._poly([n % self.characteristic if self.is_finite else n]))

    def _from_fraction(self, num: int, den: int, text: str) -> ExtElement:
        return ExtElement(self, self._poly([self.base._from_fraction(num, den, text)]))

    def _coerce(self, x: Any) -> ExtElement:
        return self(x)

    def parse(self, text: str | int) -> ExtElement:
        """Parse an expression in integers, the generator, ``+ - * / ^`` and parentheses.

        >>> K = finite_field(3, 2)
        >>> str(K.parse("z^4")), str(K.parse("1/2"))
        ('2', '2')
        """
        if isinstance(text, int) and not isinstance(text, bool):
            return self(text)
        if not isinstance(text, str):
            return self(text)
        return _Parser(self, text).run()

    def to_str(self, x: ExtElement) -> str:
        """Text form, highest power first: ``"z^2 + 2*z + 1"``, ``"-1/2*r + 3"``."""
        coeffs = x.coeffs()
        terms: list[tuple[bool, str]] = []
        for k in range(len(coeffs) - 1, -1, -1):
            c = coeffs[k]
            if c == 0:
                continue
            s = str(self.base(c))
            neg = s.startswith("-")
            mag = s[1:] if neg else s
            mono = "" if k == 0 else (self.gen_name if k == 1 else f"{self.gen_name}^{k}")
            if not mono:
                term = mag
            elif mag == "1":
                term = mono
            else:
                term = f"{mag}*{mono}"
            terms.append((neg, term))
        if not terms:
            return "0"
        out = ("-" if terms[0][0] else "") + terms[0][1]
        for neg, t in terms[1:]:
            out += (" - " if neg else " + ") + t
        return out

    def to_int_or_str(self, x: ExtElement) -> int | str:
        s = self.to_str(x)
        try:
            return int(s)
        except ValueError:
            return s

    def modulus_text(self) -> str:
        """The defining polynomial, written in the generator."""
        return _poly_text(self, list(self.modulus.coeffs()))

    def multiplication_matrix(self, x: ExtElement) -> list[list]:
        """The ``d x d`` matrix over the base of ``v -> v x`` (row ``k``: ``t^k x``)."""
        d = self.degree
        rows = []
        for k in range(d):
            c = list(((self._xpow[k] * x.f) % self.modulus).coeffs())
            rows.append(c + [0] * (d - len(c)))
        return rows

    def _xpow_coeffs(self, m: int) -> list:
        """Coefficients of ``t^m`` reduced modulo the defining polynomial (``m < 2d``)."""
        c = list(self._xpow[m].coeffs())
        return c + [0] * (self.degree - len(c))

    def _diag_power(self, n: int, k: int) -> Any:
        """``I_n (x) [t^k]``: the ``nd x nd`` block diagonal matrix over the base (cached)."""
        cache = self.__dict__.setdefault("_diag_cache", {})
        key = (n, k)
        M = cache.get(key)
        if M is None:
            d = self.degree
            blk = self.multiplication_matrix(ExtElement(self, self._xpow[k]))
            M = self.base._raw_matrix(n * d, n * d, [])
            for i in range(n):
                for a in range(d):
                    for b in range(d):
                        if blk[a][b] != 0:
                            M[i * d + a, i * d + b] = blk[a][b]
            if len(cache) > 256:
                cache.clear()
            cache[key] = M
        return M

    def _power_blocks(self) -> Any:
        """The ``d x d^2`` base matrix whose row ``k`` is ``[t^k]`` flattened (cached)."""
        pb = getattr(self, "_pb", None)
        if pb is None:
            d = self.degree
            flat = []
            for k in range(d):
                for row in self.multiplication_matrix(ExtElement(self, self._xpow[k])):
                    flat.extend(row)
            pb = self._pb = self.base._raw_matrix(d, d * d, flat)
        return pb

    def _raw_matrix(self, nrows: int, ncols: int, entries: list) -> Any:
        from hwcat.exact.blockmat import BlockMatrix

        return BlockMatrix(self, nrows, ncols, [self(e) for e in entries] if entries else None)


def _poly_text(K: ExtensionField, coeffs: list) -> str:
    """A polynomial (possibly of degree >= d) in the generator's name."""
    terms = []
    for k in range(len(coeffs) - 1, -1, -1):
        c = coeffs[k]
        if c == 0:
            continue
        s = str(K.base(c))
        neg = s.startswith("-")
        mag = s[1:] if neg else s
        mono = "" if k == 0 else (K.gen_name if k == 1 else f"{K.gen_name}^{k}")
        term = mag if not mono else (mono if mag == "1" else f"{mag}*{mono}")
        terms.append((neg, term))
    out = ("-" if terms[0][0] else "") + terms[0][1]
    for neg, t in terms[1:]:
        out += (" - " if neg else " + ") + t
    return out


# -- parsing expressions ----------------------------------------------------------------

_TOKEN = re.compile(r"\s*(?:(\d+)|([A-Za-z_][A-Za-z0-9_]*)|(\*\*|[-+*/^()]))")


class _Parser:
    """Recursive descent over ``expr := term (+|- term)*``, ``term := unary (*|/ unary)*``,
    ``unary := (+|-) unary | power``, ``power := atom (^ [-]int)?``, ``atom := int | gen | (expr)``.
    """

    def __init__(self, K: Any, text: str, gen_name: str | None = None) -> None:
        self.K, self.text = K, text
        self.gen_name = gen_name if gen_name is not None else K.gen_name
        self.toks: list[tuple[str, str]] = []
        pos, s = 0, text
        while pos < len(s):
            if s[pos:].strip() == "":
                break
            m = _TOKEN.match(s, pos)
            if not m:
                raise CoefficientError(
                    f"{text!r} is not an element of {K} (cannot read {s[pos:].strip()!r})"
                )
            if m.group(1):
                self.toks.append(("int", m.group(1)))
            elif m.group(2):
                self.toks.append(("name", m.group(2)))
            else:
                self.toks.append(("op", "^" if m.group(3) == "**" else m.group(3)))
            pos = m.end()
        self.i = 0

    def fail(self, why: str) -> CoefficientError:
        return CoefficientError(f"{self.text!r} is not an element of {self.K}: {why}")

    def peek(self) -> tuple[str, str] | None:
        return self.toks[self.i] if self.i < len(self.toks) else None

    def take(self) -> tuple[str, str]:
        t = self.peek()
        if t is None:
            raise self.fail("unexpected end")
        self.i += 1
        return t

    def run(self) -> Any:
        if not self.toks:
            raise self.fail("empty")
        v = self.expr()
        if self.peek() is not None:
            raise self.fail(f"unexpected {self.peek()[1]!r}")
        return v

    def expr(self) -> Any:
        v = self.term()
        while (t := self.peek()) is not None and t[1] in ("+", "-"):
            self.take()
            w = self.term()
            v = v + w if t[1] == "+" else v - w
        return v

    def term(self) -> Any:
        v = self.unary()
        while (t := self.peek()) is not None and t[1] in ("*", "/"):
            self.take()
            w = self.unary()
            v = v * w if t[1] == "*" else self.divide(v, w)
        return v

    def divide(self, v: Any, w: Any) -> Any:
        if w == 0:
            raise self.fail("division by zero")
        return v / w

    def unary(self) -> Any:
        t = self.peek()
        if t is not None and t[1] in ("+", "-"):
            self.take()
            v = self.unary()
            return -v if t[1] == "-" else v
        return self.power()

    def power(self) -> Any:
        v = self.atom()
        t = self.peek()
        if t is not None and t[1] == "^":
            self.take()
            v = self.raise_to(v)
        return v

    def raise_to(self, v: Any) -> Any:
        """``v`` to the exponent that follows ``^``: an integer, maybe negative."""
        neg = False
        if self.peek() is not None and self.peek()[1] == "-":
            self.take()
            neg = True
        kind, val = self.take()
        if kind != "int":
            raise self.fail("exponents must be integers")
        n = -int_from_text(val) if neg else int_from_text(val)
        if n < 0 and v == 0:
            raise self.fail("division by zero")
        return v**n

    def atom(self) -> Any:
        kind, val = self.take()
        if kind == "int":
            return self.K(int_from_text(val))
        if kind == "name":
            if val != self.gen_name:
                raise self.fail(
                    f"unknown name {val!r} (the generator of {self.K} is {self.gen_name!r})"
                )
            return self.K.gen
        if val == "(":
            v = self.expr()
            if self.take()[1] != ")":
                raise self.fail("unbalanced parentheses")
            return v
        raise self.fail(f"unexpected {val!r}")


# -- the base-field polynomial of a user's modulus -------------------------------------


class _PolyRing:
    """Polynomials over a prime field or QQ in a named variable (for parsing moduli)."""

    def __init__(self, base: Any, var: str) -> None:
        self.base, self.gen_name, self.name = base, var, f"{base}[{var}]"
        fin = base.characteristic != 0
        self._mk = (
            (lambda c: flint.nmod_poly([int(x) for x in c], base.characteristic))
            if fin
            else (lambda c: flint.fmpq_poly(c))
        )

    def __repr__(self) -> str:
        return self.name

    def __call__(self, n: int) -> Any:
        return self._mk([n]) if not self.base.characteristic else self._mk([flint.fmpq(n)])

    @property
    def gen(self) -> Any:
        return self._mk([0, 1])


def _parse_poly(base: Any, var: str, text: str) -> Any:
    R = _PolyRing(base, var)

    class _P(_Parser):
        def raise_to(self, v: Any) -> Any:
            kind, val = self.take()
            if kind != "int":
                raise self.fail("exponents must be non-negative integers")
            n = int_from_text(val)
            if n > MAX_EXTENSION_DEGREE:
                raise self.fail(
                    f"an exponent above {MAX_EXTENSION_DEGREE}, the largest degree of an "
                    "extension field"
                )
            return v**n

        def divide(self, v: Any, w: Any) -> Any:
            if w.degree() != 0:
                raise self.fail("only division by nonzero numbers")
            return v * (1 / w.coeffs()[0])

    return _P(R, text, var).run()


# -- constructors ------------------------------------------------------------------------


def _check_name(var: str, where: str) -> None:
    if not _NAME_RE.match(var) or var in _RESERVED:
        raise FieldError(f"{where}: {var!r} cannot name a generator (use a name such as z or r)")


def _is_primitive(g: Any, p: int, k: int) -> bool:
    order = p**k - 1
    x = flint.nmod_poly([0, 1], p)
    for r, _ in flint.fmpz(order).factor():
        if x.pow_mod(order // int(r), g) == 1:
            return False
    return True


@cache
def default_modulus(p: int, k: int) -> tuple[int, ...]:
    """Coefficients (constant first) of the default defining polynomial of ``GF(p^k)``."""
    for n in range(p**k):
        digits = [(n // p**i) % p for i in range(k)]  # c_0 .. c_(k-1): c_(k-1) most significant
        if digits[0] == 0:
            continue
        g = flint.nmod_poly(digits + [1], p)
        fac = g.factor()[1]
        if len(fac) == 1 and fac[0][1] == 1 and _is_primitive(g, p, k):
            return tuple(digits + [1])
    raise FieldError(f"GF({p}^{k}): no primitive polynomial found")  # pragma: no cover


@cache
def finite_field(p: int, k: int, gen_name: str = "z", modulus: tuple[int, ...] | None = None):
    """``GF(p^k)`` (``k >= 2``) with the default or a given monic irreducible modulus."""
    from hwcat.exact.fields import GF

    base = GF(p)
    _check_name(gen_name, f"GF({p}^{k})")
    coeffs = list(modulus) if modulus is not None else list(default_modulus(p, k))
    f = flint.nmod_poly(coeffs, p)
    q = p**k
    name = None
    if modulus is None:
        name = f"GF({q})" if gen_name == "z" else f"GF({q}, {gen_name})"
    else:
        name = f"GF({p})[{gen_name}]/({_poly_text_raw(base, gen_name, coeffs)})"
    return ExtensionField(base, f, gen_name, name)


def _poly_text_raw(base: Any, var: str, coeffs: list) -> str:
    class _Tmp:
        pass

    t = _Tmp()
    t.base, t.gen_name = base, var  # type: ignore[attr-defined]
    return _poly_text(t, coeffs)  # type: ignore[arg-type]


def _irreducibility(base: Any, f: Any, text: str, var: str) -> None:
    if f.degree() < 1:
        raise FieldError(f"{text!r}: the polynomial must have degree at least 1")
    lead = f.coeffs()[-1]
    if lead != 1:
        raise FieldError(f"{text!r}: the polynomial is not monic (leading coefficient {lead})")
    _, fac = f.factor()
    if len(fac) > 1 or fac[0][1] > 1:
        g = fac[0][0]
        cs = list(g.coeffs())
        if base.characteristic == 0:  # make the factor monic for the message
            cs = [c / cs[-1] for c in cs]
        raise FieldError(
            f"{text!r}: the polynomial is reducible; it has the factor "
            f"{_poly_text_raw(base, var, cs)}"
        )


@cache
def number_field(var: str, poly_text: str, base_name: str = "QQ") -> ExtensionField:
    """``base[var] / (poly)`` for a monic irreducible ``poly`` (base ``QQ`` or ``GF(p)``)."""
    from hwcat.exact.fields import parse_field

    base = parse_field(base_name)
    text = f"{base_name}[{var}]/({poly_text})"
    if getattr(base, "degree", 1) != 1:
        raise FieldError(f"{text!r}: the base of a quotient field must be QQ or a prime field")
    _check_name(var, text)
    try:
        f = _parse_poly(base, var, poly_text)
    except CoefficientError as exc:
        raise FieldError(f"{text!r}: cannot read the polynomial ({exc})") from None
    if not base.characteristic and f.degree() > MAX_EXTENSION_DEGREE:
        raise FieldError(
            f"{text!r}: degree {f.degree()}, above the largest degree {MAX_EXTENSION_DEGREE} "
            "of an extension field"
        )
    _irreducibility(base, f, text, var)
    coeffs = list(f.coeffs())
    if f.degree() == 1:
        raise FieldError(f"{text!r}: a polynomial of degree 1 gives {base_name} itself")
    canon = f"{base_name}[{var}]/({_poly_text_raw(base, var, coeffs)})"
    if base.characteristic:
        return finite_field(base.characteristic, f.degree(), var, tuple(int(c) for c in coeffs))
    return ExtensionField(base, f, var, canon)


@cache
def cyclotomic_field(n: int, gen_name: str | None = None) -> ExtensionField:
    """``QQ(zetaN)``: the ``n``-th cyclotomic field, generator ``zetaN`` (a primitive root)."""
    from hwcat.exact.fields import QQ

    if n < 3:
        raise FieldError(f"QQ(zeta{n}): zeta{n} = {1 if n == 1 else -1} is rational; use QQ")
    degree = int(flint.fmpz(n).euler_phi())
    if degree > MAX_EXTENSION_DEGREE:
        raise FieldError(
            f"QQ(zeta{n}): degree phi({n}) = {degree}, above the largest degree "
            f"{MAX_EXTENSION_DEGREE} of an extension field"
        )
    f = flint.fmpq_poly(flint.fmpz_poly.cyclotomic(n))
    var = gen_name or f"zeta{n}"
    return ExtensionField(QQ, f, var, f"QQ(zeta{n})")


def splitting_field_hint(F: Any, degree: int, minpoly: list | None = None) -> str:
    """A short clause naming a field over which a simple with ``End = F[t]/(g)`` splits.

    ``degree`` is ``deg g``; ``minpoly`` the coefficients of ``g`` (constant
    first) when known.  A finite field ``GF(q)`` has the unique extension
    ``GF(q^degree)`` of that degree (common practice), over which such a simple
    splits; over ``QQ`` the field ``QQ[t]/(g)`` is named.

    >>> from hwcat.exact import GF, QQ
    >>> splitting_field_hint(GF(2), 2)
    '; over GF(4) it splits'
    >>> splitting_field_hint(QQ, 2, [1, 1, 1])
    '; over QQ(zeta3) it splits'
    >>> splitting_field_hint(QQ, 2, [-2, 0, 1])
    '; over QQ[t]/(t^2 - 2) it splits'
    """
    if degree < 2:
        return ""
    if F.characteristic:
        q = getattr(F, "order", 0) or F.characteristic
        if q**degree < 1 << 63:
            return f"; over GF({q**degree}) it splits"
        return ""
    if getattr(F, "degree", 1) == 1 and minpoly is not None:
        from hwcat.exact.fields import QQ

        cs = [QQ(c) for c in minpoly]
        cs = [c / cs[-1] for c in cs]
        for n in range(3, 2 * degree * degree + 3):  # phi(n) >= sqrt(n / 2)
            phi = list(flint.fmpz_poly.cyclotomic(n).coeffs())
            if len(phi) == len(cs) and all(QQ(int(a)) == b for a, b in zip(phi, cs, strict=True)):
                return f"; over QQ(zeta{n}) it splits"
        return f"; over QQ[t]/({_poly_text_raw(QQ, 't', cs)}) it splits"
    return ""
