"""Univariate polynomials over an :class:`~hwcat.exact.extension.ExtensionField`.

:class:`ExtPoly` offers the operations :class:`hwcat.exact.polys.Poly` asks of
its backend (the shape of flint's ``nmod_poly``/``fmpq_poly``): arithmetic,
division with remainder, extended gcd and factorisation.

Factorisation: over ``GF(p^k)`` by flint's finite-field polynomials; over a
number field ``QQ[t]/(f)`` by Trager's norm method -- make the polynomial
squarefree (Yun), shift ``x -> x - s t`` until the norm
``N(x) = Res_t(f(t), h(x - s t))`` is squarefree, factor ``N`` over ``QQ``
and take ``gcd(h(x - s t), N_j(x))`` for each factor ``N_j``, shifted back.

References
----------
B. M. Trager, "Algebraic factoring and rational function integration",
SYMSAC 1976 (from memory).
"""

from __future__ import annotations

from functools import cache
from typing import Any

import flint

from hwcat.errors import InternalInconsistency

__all__ = ["ExtPoly"]


class ExtPoly:
    """A polynomial with coefficients in an extension field, degree 0 first."""

    __slots__ = ("K", "c")

    def __init__(self, K: Any, coeffs: list) -> None:
        c = [K(x) for x in coeffs]
        while c and not c[-1]:
            c.pop()
        self.K, self.c = K, c

    # -- flint-like interface -------------------------------------------------
    def degree(self) -> int:
        return len(self.c) - 1

    def coeffs(self) -> list:
        return list(self.c)

    def is_zero(self) -> bool:
        return not self.c

    def __eq__(self, o: object) -> bool:
        return isinstance(o, ExtPoly) and o.K is self.K and self.c == o.c

    def __hash__(self) -> int:
        return hash((self.K.name, tuple(str(x) for x in self.c)))

    def __str__(self) -> str:
        parts = []
        for k in range(len(self.c) - 1, -1, -1):
            x = self.c[k]
            if not x:
                continue
            mono = "" if k == 0 else ("x" if k == 1 else f"x^{k}")
            s = str(x)
            coef = s if not mono else ("" if s == "1" else f"({s})*")
            parts.append(f"{coef}{mono}" or s)
        return " + ".join(parts) or "0"

    __repr__ = __str__

    def __add__(self, o: Any) -> ExtPoly:
        o = self._lift(o)
        n = max(len(self.c), len(o.c))
        z = self.K.zero
        a = self.c + [z] * (n - len(self.c))
        b = o.c + [z] * (n - len(o.c))
        return ExtPoly(self.K, [x + y for x, y in zip(a, b, strict=True)])

    def __neg__(self) -> ExtPoly:
        return ExtPoly(self.K, [-x for x in self.c])

    def __sub__(self, o: Any) -> ExtPoly:
        return self + (-self._lift(o))

    def __mul__(self, o: Any) -> ExtPoly:
        if not isinstance(o, ExtPoly):
            s = self.K(o)
            return ExtPoly(self.K, [x * s for x in self.c])
        if not self.c or not o.c:
            return ExtPoly(self.K, [])
        out = [self.K.zero] * (len(self.c) + len(o.c) - 1)
        for i, x in enumerate(self.c):
            if not x:
                continue
            for j, y in enumerate(o.c):
                out[i + j] = out[i + j] + x * y
        return ExtPoly(self.K, out)

    __rmul__ = __mul__

    def __pow__(self, e: int) -> ExtPoly:
        out = ExtPoly(self.K, [1])
        b = self
        while e:
            if e & 1:
                out = out * b
            b = b * b
            e >>= 1
        return out

    def divmod(self, o: ExtPoly) -> tuple[ExtPoly, ExtPoly]:
        if o.is_zero():
            raise ZeroDivisionError("polynomial division by zero")
        r = list(self.c)
        dq = len(r) - len(o.c)
        if dq < 0:
            return ExtPoly(self.K, []), self
        inv = o.c[-1].inverse()
        q = [self.K.zero] * (dq + 1)
        for k in range(dq, -1, -1):
            coef = r[k + len(o.c) - 1] * inv
            q[k] = coef
            if coef:
                for j, y in enumerate(o.c):
                    r[k + j] = r[k + j] - coef * y
        return ExtPoly(self.K, q), ExtPoly(self.K, r[: len(o.c) - 1])

    def __mod__(self, o: ExtPoly) -> ExtPoly:
        return self.divmod(o)[1]

    def __floordiv__(self, o: ExtPoly) -> ExtPoly:
        return self.divmod(o)[0]

    def monic(self) -> ExtPoly:
        if not self.c:
            return self
        return self * self.c[-1].inverse()

    def xgcd(self, o: ExtPoly) -> tuple[ExtPoly, ExtPoly, ExtPoly]:
        """``(g, s, t)``: ``g`` monic gcd, ``g = s self + t o``."""
        K = self.K
        r0, r1 = self, o
        s0, s1 = ExtPoly(K, [1]), ExtPoly(K, [])
        t0, t1 = ExtPoly(K, []), ExtPoly(K, [1])
        while not r1.is_zero():
            q, r = r0.divmod(r1)
            r0, r1 = r1, r
            s0, s1 = s1, s0 - q * s1
            t0, t1 = t1, t0 - q * t1
        if r0.is_zero():
            return r0, s0, t0
        inv = r0.c[-1].inverse()
        return r0 * inv, s0 * inv, t0 * inv

    def gcd(self, o: ExtPoly) -> ExtPoly:
        return self.xgcd(o)[0]

    def derivative(self) -> ExtPoly:
        return ExtPoly(self.K, [x * k for k, x in enumerate(self.c)][1:])

    def factor(self) -> tuple[Any, list[tuple[ExtPoly, int]]]:
        """``(leading coefficient, [(monic irreducible, multiplicity), ...])``."""
        if self.degree() < 1:
            return (self.c[0] if self.c else self.K.zero), []
        lead = self.c[-1]
        g = self.monic()
        if self.K.is_finite:
            return lead, _factor_finite(g)
        out = []
        for h, e in _squarefree(g):
            out.extend((f, e) for f in _factor_squarefree_nf(h))
        return lead, out

    def _lift(self, o: Any) -> ExtPoly:
        return o if isinstance(o, ExtPoly) else ExtPoly(self.K, [o])


# -- finite fields -----------------------------------------------------------------------


@cache
def _fq_ctx(K: Any) -> tuple[Any, Any]:
    p = K.characteristic
    mod = flint.fmpz_mod_poly_ctx(p)([int(c) for c in K.modulus.coeffs()])
    C = flint.fq_default_ctx(modulus=mod, var=K.gen_name)
    return C, flint.fq_default_poly_ctx(C)


def _factor_finite(g: ExtPoly) -> list[tuple[ExtPoly, int]]:
    K = g.K
    C, R = _fq_ctx(K)
    d = K.degree

    def to_fq(x: Any) -> Any:
        return C([int(c) for c in x.coeffs()])

    def from_fq(y: Any) -> Any:
        cs = [int(c) for c in y.to_list()]
        return K.from_coeffs(cs + [0] * (d - len(cs)))

    _, facs = R([to_fq(x) for x in g.c]).factor()
    return [(ExtPoly(K, [from_fq(y) for y in f.coeffs()]).monic(), int(e)) for f, e in facs]


# -- number fields -------------------------------------------------------------------------


def _squarefree(g: ExtPoly) -> list[tuple[ExtPoly, int]]:
    """Yun's squarefree decomposition of a monic ``g`` in characteristic 0."""
    out = []
    dg = g.derivative()
    a = g.gcd(dg)
    b = g // a
    d = dg // a - b.derivative()
    i = 1
    while b.degree() > 0:
        ai = b.gcd(d)
        if ai.degree() > 0:
            out.append((ai.monic(), i))
        b = b // ai
        d = (d // ai) - b.derivative()
        i += 1
        if i > g.degree() + 1:  # pragma: no cover - defensive
            raise InternalInconsistency("squarefree decomposition did not terminate")
    return out


def _norm(h: ExtPoly, s: int) -> Any:
    """``Res_t(f(t), h(x - s t))`` as an ``fmpq_poly`` in ``x``."""
    K = h.K
    ctx = flint.fmpq_mpoly_ctx.get(("x", "t"))
    x, t = ctx.gens()

    def in_t(poly_coeffs: list) -> Any:
        acc = ctx.from_dict({}) if hasattr(ctx, "from_dict") else 0 * x
        for k, c in enumerate(poly_coeffs):
            if c != 0:
                acc = acc + flint.fmpq(c) * t**k
        return acc

    shifted = x - s * t
    H = 0 * x
    for k, a in enumerate(h.c):
        if a:
            H = H + in_t([flint.fmpq(c) for c in a.coeffs()]) * shifted**k
    F = in_t(list(K.modulus.coeffs()))
    N = F.resultant(H, "t")
    deg = max((e[0] for e in N.to_dict()), default=0)
    coeffs = [flint.fmpq(0)] * (deg + 1)
    for (ex, et), v in N.to_dict().items():
        if et:
            raise InternalInconsistency("norm still depends on the generator")
        coeffs[ex] = flint.fmpq(v)
    return flint.fmpq_poly(coeffs)


def _factor_squarefree_nf(h: ExtPoly) -> list[ExtPoly]:
    K = h.K
    if h.degree() == 1:
        return [h.monic()]
    t = K.gen
    for s in [0, 1, -1, 2, -2, 3, -3, 4, -4, 5, 6, 7]:
        N = _norm(h, s)
        if N.gcd(N.derivative()).degree() > 0:
            continue
        _, facs = N.factor()
        # h_s(x) = h(x - s t)
        lin = ExtPoly(K, [-s * t, 1])
        hs = _compose(h, lin)
        back = ExtPoly(K, [s * t, 1])  # x -> x + s t undoes the shift
        out = []
        for Nj, _ in facs:
            Nk = ExtPoly(K, [K(flint.fmpq(c)) for c in Nj.coeffs()])
            g = hs.gcd(Nk)
            if g.degree() > 0:
                out.append(_compose(g, back).monic())
        if sum(f.degree() for f in out) != h.degree():
            raise InternalInconsistency("norm factorisation lost a factor")
        return out
    raise InternalInconsistency("no shift gives a squarefree norm")  # pragma: no cover


def _compose(h: ExtPoly, lin: ExtPoly) -> ExtPoly:
    """``h(lin(x))`` by Horner's rule."""
    out = ExtPoly(h.K, [])
    for a in reversed(h.c):
        out = out * lin + ExtPoly(h.K, [a])
    return out
