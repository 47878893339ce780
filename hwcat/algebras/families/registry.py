"""Built-in families of algebras, as hub algebras ready for every analysis.

Two kinds:

* **multiplication-table families** (:mod:`hwcat.algebras.families.tables`):
  Temperley--Lieb ``TL_n(delta)`` (diagram basis), Schur algebras ``S(2, r)``
  (Green's basis), group algebras of ``S_n`` and of cyclic groups, the small
  quantum group ``u_q(sl_2)``.  They are reduced to their basic algebra with
  :func:`hwcat.algebras.reduction.reduction.reduce_algebra`; Temperley--Lieb
  over ``GF(p)`` also through its spin chain (restricted from ``GF(p^2)`` when ``q`` is
  not in ``GF(p)``), without a table
  (:mod:`hwcat.algebras.families.tl_module`, parameter ``route``).
* **quiver families** (:mod:`hwcat.algebras.families.quivers`): linearly
  oriented and alternating ``A_n`` (with any ``vanish_from_length``), the
  Auslander algebra of ``k[x]/(x^n)``, zigzag algebras of type ``A_n``.  They
  are format-1 quiver specs, built with
  :func:`hwcat.algebras.inputs.bound.bound_quiver_algebra`.

:data:`FAMILIES` describes each family (parameters, defaults, presentation and
source); :func:`family_algebra` builds one from text parameters, which is what
``hwcat family`` uses.

Examples
--------
>>> A = family_algebra("temperley-lieb", n=4, delta="0", field="QQ")
>>> A.n, A.morita, A.dim
(2, (1, 2), 6)
>>> family_algebra("zigzag-a", n=3).dim
10
"""

from __future__ import annotations

from collections.abc import Callable, Mapping
from dataclasses import dataclass
from typing import Any

from hwcat.algebras.families import quivers as quiver_families
from hwcat.algebras.families import tables as family_tables
from hwcat.algebras.families.tl_module import (
    ModuleReduction,
    module_route_available,
    reduce_temperley_lieb,
)
from hwcat.algebras.hub.basic import BasicAlgebra
from hwcat.algebras.hub.quiver import Quiver, parse_relation
from hwcat.algebras.inputs.bound import bound_quiver_algebra
from hwcat.algebras.inputs.structure import StructureAlgebra, from_table
from hwcat.algebras.reduction.reduction import Reduction, reduce_algebra
from hwcat.errors import HwcatError, SpecError
from hwcat.exact import parse_field
from hwcat.limits import resource_limits

__all__ = [
    "Family",
    "FAMILIES",
    "family_structure",
    "family_reduction",
    "family_reduction_record",
    "family_algebra",
    "family_spec",
    "parse_parameters",
    "temperley_lieb",
    "schur_algebra_2",
    "symmetric_group_algebra",
    "cyclic_group_algebra",
    "small_quantum_sl2",
]


@dataclass(frozen=True)
class Family:
    """A built-in family: its parameters (name -> (type, default)) and where it comes from."""

    name: str
    kind: str  # "table" or "quiver"
    parameters: Mapping[str, tuple[type, Any]]
    summary: str
    source: str
    build: Callable[..., Any]

    def usage(self) -> str:
        ps = " ".join(f"{k}={'' if d is None else d}" for k, (_, d) in self.parameters.items())
        return f"{self.name} {ps}".strip()


TL_SPIN_CHAIN_FROM = 8
"""``route=auto`` reduces ``TL_n`` through the spin chain from this ``n`` on (when the field
allows it).  Measured (benchmarks/bench_reduction.py, one dense rank of a 1430 x 1430
matrix as the unit): at ``n = 8`` the table route takes 23 to 27 units, the spin chain
1.1 to 1.7 (1.3 to 4.9 on the chain restricted from ``GF(p^2)``); at ``n = 7`` both take
well under a second.  ``hwcat module`` asks for
``route=table`` (it reads modules in the diagram basis, which only that route has)."""

TL_ROUTES = ("auto", "table", "spin-chain")


def _table_family(fn: Callable[..., Any]) -> Callable[..., StructureAlgebra]:
    def build(**kw: Any) -> StructureAlgebra:
        return from_table(fn(**kw))

    return build


FAMILIES: dict[str, Family] = {
    f.name: f
    for f in [
        Family(
            "temperley-lieb",
            "table",
            {"n": (int, None), "delta": (str, "0"), "field": (str, "QQ"), "route": (str, "auto")},
            "TL_n(delta) in the diagram basis (dimension Catalan(n)); generators e_i with "
            "e_i^2 = delta e_i, e_i e_(i+-1) e_i = e_i, e_i e_j = e_j e_i for |i - j| > 1; "
            "route=table|spin-chain|auto: reduced from the multiplication table, or through "
            "the spin chain without a table (GF(p), p < 2^24; q + 1/q = delta in GF(p) or "
            "GF(p^2), the chain over GF(p^2) then restricted to GF(p); "
            f"auto: the spin chain from n = {TL_SPIN_CHAIN_FROM} on when it applies)",
            "standard (diagram calculus; cellular, Koenig-Xi criterion); spin chain: quantum "
            "Schur-Weyl duality (Jimbo 1986, Martin 1991)",
            _table_family(
                lambda n, delta, field, route="auto": family_tables.temperley_lieb(n, delta, field)
            ),
        ),
        Family(
            "schur",
            "table",
            {"r": (int, None), "field": (str, "GF(2)")},
            "the Schur algebra S(2, r) in Green's basis xi_(i,j) (dimension binomial(r+3, 3))",
            "J. A. Green, Polynomial Representations of GL_n, Lecture Notes in Math. 830 (1980)",
            _table_family(lambda r, field: family_tables.schur_algebra_2(r, field)),
        ),
        Family(
            "symmetric-group",
            "table",
            {"n": (int, None), "field": (str, "GF(2)")},
            "the group algebra of S_n in the basis of permutations; simples labelled "
            "D<lambda_1>_<lambda_2>_... by p-regular partitions (D^lambda, the head of the "
            "Specht module S^lambda; every partition when p = 0 or p > n)",
            "standard (Maschke's theorem; group algebras are self-injective); labels: "
            "James's D^lambda, from memory",
            _table_family(lambda n, field: family_tables.symmetric_group_algebra(n, field)),
        ),
        Family(
            "cyclic-group",
            "table",
            {"m": (int, None), "field": (str, "GF(2)")},
            "the group algebra of the cyclic group of order m, basis 1, g, ..., g^(m-1); "
            "simples labelled chi<c> by the root of unity c by which g acts (the field must "
            "contain them)",
            "standard",
            _table_family(lambda m, field: family_tables.cyclic_group_algebra(m, field)),
        ),
        Family(
            "small-quantum-sl2",
            "table",
            {"ell": (int, 3), "q": (str, "2"), "field": (str, "GF(7)")},
            "u_q(sl_2) at a primitive ell-th root of unity q: E^N = F^N = 0, K^ell = 1 with "
            "N = ell for odd ell and N = p for even ell = 2p (the restricted form), "
            "K E = q^2 E K, K F = q^-2 F K, EF - FE = (K - K^-1)/(q - q^-1); "
            "PBW basis F^a K^b E^c (dimension N^2 ell); q may be any field element, e.g. "
            "q=zeta4 over QQ(zeta4)",
            "standard, from memory (Lusztig's small quantum group; even roots: Feigin, "
            "Gainutdinov, Semikhatov, Tipunin, Comm. Math. Phys. 265 (2006))",
            _table_family(lambda ell, q, field: family_tables.small_quantum_sl2(ell, q, field)),
        ),
        Family(
            "linear-a",
            "quiver",
            {"n": (int, None), "vanish_from_length": (int, None), "field": (str, "QQ")},
            "1 -> 2 -> ... -> n, optionally with every path of length vanish_from_length zero",
            "Assem, Simson, Skowronski, Elements of the Representation Theory of Associative "
            "Algebras 1, LMS Student Texts 65 (2006)",
            lambda n, vanish_from_length, field: quiver_families.linear_A(
                n, vanish_from_length, field
            ),
        ),
        Family(
            "alternating-a",
            "quiver",
            {"n": (int, None), "vanish_from_length": (int, None), "field": (str, "QQ")},
            "A_n with alternating orientation 1 -> 2 <- 3 -> ...",
            "Assem, Simson, Skowronski (2006)",
            lambda n, vanish_from_length, field: quiver_families.alternating_A(
                n, vanish_from_length, field
            ),
        ),
        Family(
            "auslander",
            "quiver",
            {"n": (int, None), "field": (str, "QQ")},
            "the Auslander algebra of k[x]/(x^n): double quiver of A_n with mesh relations",
            "Bruestle, Hille, Ringel, Roehrle, Algebr. Represent. Theory 2 (1999) 295-312",
            lambda n, field: quiver_families.auslander_truncated_polynomial(n, field),
        ),
        Family(
            "zigzag-a",
            "quiver",
            {"n": (int, None), "field": (str, "QQ")},
            "the zigzag algebra of type A_n (symmetric, Loewy length 3 for n >= 2)",
            "standard, from memory",
            lambda n, field: quiver_families.zigzag_A(n, field),
        ),
    ]
}


def parse_parameters(family: str, params: Mapping[str, Any]) -> dict[str, Any]:
    """Check and convert parameters (text or values) against the family's signature."""
    fam = _family(family)
    out: dict[str, Any] = {}
    for key in params:
        if key not in fam.parameters:
            allowed = ", ".join(fam.parameters)
            raise SpecError(f"family {fam.name}: unknown parameter {key!r} (allowed: {allowed})")
    for key, (typ, default) in fam.parameters.items():
        if key not in params:
            if default is None and key != "vanish_from_length":
                raise SpecError(f"family {fam.name}: parameter {key} is required")
            out[key] = default
            continue
        v = params[key]
        if typ is int and not isinstance(v, int):
            try:
                v = int(str(v))
            except ValueError:
                raise SpecError(f"family {fam.name}: {key} = {v!r} is not an integer") from None
        if typ is str:
            v = str(v)
        out[key] = v
    if "field" in out:
        parse_field(out["field"])  # a clear FieldError before any work
    return out


def _family(name: str) -> Family:
    if name not in FAMILIES:
        raise SpecError(f"unknown family {name!r} (known: {', '.join(FAMILIES)})")
    return FAMILIES[name]


def family_structure(family: str, **params: Any) -> StructureAlgebra:
    """The structure-constant algebra of a multiplication-table family."""
    fam = _family(family)
    if fam.kind != "table":
        raise SpecError(f"family {fam.name} is given by a quiver, not a multiplication table")
    return fam.build(**parse_parameters(family, params))


def family_reduction(family: str, *, seed: int = 0, **params: Any) -> Reduction | ModuleReduction:
    """The reduction (basic algebra, idempotents, Morita data) of a table family,
    its simples labelled as the trade labels them (see :mod:`.labels`).

    ``temperley-lieb`` with ``route=spin-chain`` (or ``auto`` for large ``n``) gives a
    :class:`~hwcat.algebras.families.tl_module.ModuleReduction` instead: no table, no
    idempotents in the diagram basis."""
    from hwcat.algebras.families.labels import label_simples

    p = parse_parameters(family, params)
    if family == "temperley-lieb" and _tl_spin_chain(p):
        return reduce_temperley_lieb(p["n"], p["delta"], p["field"], seed=seed)
    red = reduce_algebra(family_structure(family, **params), seed=seed)
    return label_simples(family, red, p)


def family_reduction_record(B: BasicAlgebra) -> Reduction | ModuleReduction | None:
    """How the hub ``B`` was reduced (table or spin chain), if it came from a reduction."""
    from hwcat.algebras.families.tl_module import module_reduction_of
    from hwcat.algebras.reduction.reduction import reduction_of

    return reduction_of(B) or module_reduction_of(B)


def _tl_spin_chain(p: Mapping[str, Any]) -> bool:
    """Whether ``TL_n`` with parameters ``p`` goes through the spin chain."""
    route = p["route"]
    if route not in TL_ROUTES:
        raise SpecError(
            f"family temperley-lieb: route = {route!r} (allowed: {', '.join(TL_ROUTES)})"
        )
    if route == "table":
        return False
    if route == "spin-chain":
        return True  # reduce_temperley_lieb names what is missing
    return p["n"] >= TL_SPIN_CHAIN_FROM and module_route_available(p["delta"], p["field"])


def family_spec(family: str, **params: Any) -> dict[str, Any]:
    """The format-1 quiver spec dictionary of a quiver family."""
    fam = _family(family)
    if fam.kind != "quiver":
        raise SpecError(f"family {fam.name} is a multiplication table, not a quiver spec")
    return fam.build(**parse_parameters(family, params))


def _spec_algebra(spec: Mapping[str, Any]) -> BasicAlgebra:
    F = parse_field(spec["field"])
    q = spec["quiver"]
    Q = Quiver.from_text(q["vertices"], q["arrows"])
    texts = q.get("relations", [])
    rels = [parse_relation(r, Q, F) for r in texts]
    return bound_quiver_algebra(
        F, Q, rels, q.get("vanish_from_length"), name=spec.get("name", ""), relation_texts=texts
    )


def family_algebra(
    family: str,
    *,
    seed: int = 0,
    max_dim: int | None = None,
    max_vertices: int | None = None,
    max_products: int | None = None,
    **params: Any,
) -> BasicAlgebra:
    """The hub algebra of any built-in family (reduced to its basic algebra for tables).

    ``max_dim``, ``max_vertices``, ``max_products`` change the resource limits
    of :mod:`hwcat.limits` for this build; the family's size is checked before
    it is built.
    """
    with resource_limits(max_dim=max_dim, max_vertices=max_vertices, max_products=max_products):
        return _family_algebra(family, seed, params)


def _family_algebra(family: str, seed: int, params: dict[str, Any]) -> BasicAlgebra:
    fam = _family(family)
    try:
        if fam.kind == "table":
            return family_reduction(family, seed=seed, **params).basic
        return _spec_algebra(family_spec(family, **params))
    except HwcatError as exc:
        if str(exc).startswith(f"family {fam.name}"):
            raise
        raise type(exc)(f"family {fam.name}: {exc}") from None


# -- direct constructors (Python API) ------------------------------------------------


def temperley_lieb(n: int, delta: Any = 0, field: Any = "QQ") -> StructureAlgebra:
    """``TL_n(delta)`` as a structure-constant algebra (diagram basis)."""
    return from_table(family_tables.temperley_lieb(n, delta, field))


def schur_algebra_2(r: int, field: Any = "GF(2)") -> StructureAlgebra:
    """``S(2, r)`` as a structure-constant algebra (Green's basis)."""
    return from_table(family_tables.schur_algebra_2(r, field))


def symmetric_group_algebra(n: int, field: Any = "GF(2)") -> StructureAlgebra:
    """The group algebra of ``S_n``."""
    return from_table(family_tables.symmetric_group_algebra(n, field))


def cyclic_group_algebra(m: int, field: Any = "GF(2)") -> StructureAlgebra:
    """The group algebra of the cyclic group of order ``m``."""
    return from_table(family_tables.cyclic_group_algebra(m, field))


def small_quantum_sl2(ell: int, q: Any, field: Any) -> StructureAlgebra:
    """The small quantum group ``u_q(sl_2)`` (see :data:`FAMILIES` for the presentation)."""
    return from_table(family_tables.small_quantum_sl2(ell, q, field))
