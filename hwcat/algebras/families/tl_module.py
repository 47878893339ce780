"""Temperley--Lieb ``TL_n(delta)`` reduced through the spin chain, without a multiplication table.

The table route (:func:`~hwcat.algebras.families.tables.temperley_lieb` and
:func:`~hwcat.algebras.reduction.reduction.reduce_algebra`) holds ``Catalan(n)^2``
products at best and dense ``dim A x dim A`` matrices; at ``n = 10`` (dimension
16796) that does not fit.  Here every element of ``A = TL_n(delta)`` is the
matrix by which it acts on the half spin chain

    ``M = M_0 + M_1 + ... + M_(floor(n/2))``,

``M_k`` the span of the states with ``k`` down spins (dimension
``binomial(n, k)``), on which the generators act as in
:mod:`~hwcat.algebras.families.spin_chain` (block diagonal: the number of down
spins is preserved; the other half is the mirror image).  Over every prime field
``GF(p)``, ``p < 2^24``: when ``GF(p)`` contains ``q`` with ``q + 1/q = delta`` the
chain is the one over ``GF(p)``; otherwise ``q^2 - delta q + 1`` is irreducible, ``q``
is the generator of ``GF(p^2) = GF(p)[q]/(q^2 - delta q + 1)``, and ``M`` is the chain
over ``GF(p^2)`` *restricted to* ``GF(p)``: each ``M_k`` becomes a ``GF(p)``-space of
dimension ``2 binomial(n, k)``, an entry ``c`` of a generator the ``2 x 2`` block of
``v -> v c`` on ``GF(p^2) = GF(p)^2`` (a ring map, so the relations hold).  It is a
``TL_n``-module over ``GF(p)``, still graded by the number of down spins, and faithful
(certified below like the other); everything after the chain is over ``GF(p)``.

Method
------
*Primitive idempotents*: the splitting tree of :mod:`~hwcat.algebras.reduction.reduction`
(Fitting's lemma), on ``M``.  A node is an idempotent ``f`` given by a basis ``B``
of ``M f`` and ``P`` with ``f = P B`` on ``M`` (``B P = 1``), sector by sector;
an element ``f y f`` of the corner acts on ``M f`` by the small matrix
``B y P``, whose minimal polynomial is that of ``f y f`` in ``f A f`` (``x`` in
``f A f`` is determined by its action on ``M f``).  The random elements ``y``
are sums of products of ``L = floor(n^2/4) + 1`` (long enough to reach every
diagram), ``L/2 + 1``, 3 and 1 random affine combinations of ``1, e_1, ..., e_(n-1)``
(short products too, since a long one is killed by a one-dimensional simple as
soon as one factor is, and then separates nothing); after the first ``BASE`` the
two long products are replaced by ``w_a w_b`` for earlier elements ``w_a, w_b``
(one product per sector).  The children are the generalised eigenspaces of
``B y P`` (kernels of ``g(B y P)^m`` for the factors ``g^m`` of the minimal
polynomial).  Nothing depends on the draw: every
leaf is certified and the totals are checked exactly.

*Classes*: the rank of an idempotent on each sector.  Conjugate idempotents
have equal ranks; a primitive ``e`` of the simple ``L`` has rank
``[M_k : L]`` on ``M_k`` (``2 [M_k : L]`` on the restricted chain, ``[M_k : L]``
counted over ``GF(p^2)``: the simples of ``TL_n`` are absolutely simple, being heads
of cell modules, so ``L`` over ``GF(p^2)`` restricts to ``L + L``; from memory).
The simple with ``t`` through strands first appears in sector ``k = (n - t)/2``, once (``M_k`` is filtered by the cell modules with
``n - 2j`` through strands, ``j <= k``; from memory): so the label of a class is
read off its first nonzero sector (where the rank is 1, or 2 on the restricted chain),
and a node whose ranks are explained by the classes found so far (triangularly, sector
by sector) is skipped.  A wrong
skip can only make the final count below fail.

*Certificates* for each class ``e``: ``e A`` is computed as the closure of
``e`` under right multiplication by the generators (``x`` in ``e A`` is the
matrix ``B x`` of shape ``rank e x dim M``), ``A e`` likewise on the left;
``e A e`` (``B x P``) is certified local with residue field ``GF(p)`` (its
radical by :func:`~hwcat.algebras.reduction.kernels.small_radical` has
codimension 1); ``dim L`` is the rank of ``(x, y) -> chi(x y)`` on
``e A x A e`` (``chi`` the residue map of ``e A e``).  Completeness *and*
faithfulness: ``sum dim L dim e A = sum dim L dim A e = Catalan(n)``.  The
image of ``TL_n`` in ``End(M)`` has exactly that dimension (the simples found
are pairwise non-isomorphic, as their sector ranks differ), and ``TL_n`` has
dimension ``Catalan(n)`` (from memory), so ``M`` is faithful and the reduction is
the one of ``TL_n`` itself; otherwise :class:`~hwcat.errors.InternalInconsistency`.

*Basic algebra*: ``e_s A e_t`` as the matrices ``B_s x P_t``; a product is a
matrix product.  Radical, arrows and projectives as in the table route.

No dense matrix larger than a sector (``binomial(n, n/2)``, 252 at ``n = 10``, twice
that on the restricted chain)
and no table: the work is dominated by the closures ``e A``, ``A e``.

Examples
--------
>>> red = reduce_temperley_lieb(6, 0, "GF(5)")
>>> red.basic.vertices, red.simple_dimensions, red.basic.cartan()
(('6', '4', '2'), (1, 4, 5), ((2, 1, 0), (1, 2, 1), (0, 1, 2)))
"""

from __future__ import annotations

import math
import random
import time
from dataclasses import dataclass, field
from typing import Any

try:  # the optional extra `fast`; without it the table route runs
    import numpy as np
except ImportError:  # pragma: no cover - exercised by monkeypatching in the tests
    np = None

from hwcat.algebras.families.spin_chain import loop_weight_root, spin_chain_entries
from hwcat.algebras.hub.basic import BasicAlgebra
from hwcat.algebras.reduction.kernels import coords_solver, small_radical
from hwcat.algebras.reduction.reduction import CORNER_LIMIT, assemble_from_blocks
from hwcat.errors import InternalInconsistency, NotSplitError, SpecError
from hwcat.exact import Mat, parse_field, select_independent_rows
from hwcat.exact.extension import finite_field
from hwcat.exact.fields import PrimeField
from hwcat.exact.nmod_bulk import read_residues
from hwcat.exact.polys import (
    Poly,
    evaluate,
    fast_left_kernel,
    matrix_from_residues,
    minpoly,
    select_columns,
)
from hwcat.limits import check_dimension, check_power_of_two
from hwcat.progress import task

__all__ = ["ModuleReduction", "reduce_temperley_lieb", "module_route_available"]


PRIME_LIMIT = 1 << 24
"""The spin-chain route works with int64 residues: products of two residues and sums of
up to ``2^14`` of them (:data:`SECTOR_LIMIT`: the longest sums run over a sector, whose
dimension over ``GF(p)`` is ``2 binomial(n, k)`` when the chain is restricted from
``GF(p^2)``) stay below ``2^63`` for primes below this bound."""


def module_route_available(delta: Any, field: Any) -> bool:
    """Whether the spin-chain route applies: a prime field ``GF(p)``, ``p < 2^24``, and
    numpy installed (the extra ``fast``).  Every ``delta`` qualifies: ``q`` with
    ``q + 1/q = delta`` lies in ``GF(p)`` or in ``GF(p^2)``, and in the second case the
    chain over ``GF(p^2)`` restricted to ``GF(p)`` is used."""
    F = parse_field(field) if isinstance(field, str) else field
    if np is None or not isinstance(F, PrimeField) or F.p >= PRIME_LIMIT:
        return False
    F(delta)  # a delta that is not an element of the field is the caller's error
    return True


# ----------------------------------------------------------------------------------
# residues as int64 arrays <-> flint matrices


def _mat(F: PrimeField, a: Any) -> Mat:
    a = np.ascontiguousarray(a, dtype=np.int64)
    return matrix_from_residues(F, a.shape[0], a.shape[1], a.ravel())


def _arr(M: Mat) -> Any:
    if M.nrows == 0 or M.ncols == 0:
        return np.zeros((M.nrows, M.ncols), dtype=np.int64)
    buf = read_residues(M._m)
    if buf is None:
        vals = [int(x) for x in M.entries()]
        return np.asarray(vals, dtype=np.int64).reshape(M.nrows, M.ncols)
    return np.frombuffer(buf, dtype=np.int64).reshape(M.nrows, M.ncols).copy()


# ----------------------------------------------------------------------------------
# the half spin chain


@dataclass
class _Chain:
    """The sectors ``M_0 .. M_K`` and each generator's action on them, in column form:
    ``(X g)[:, c] = X[:, c] diag[c] + sum_t X[:, src_t[c]] coef_t[c]`` (one or three
    further terms, see :func:`_terms`), and the same for ``g^T`` (``X g^T``).

    ``degree`` is 1 when ``q`` lies in ``GF(p)`` and 2 when the chain is the one over
    ``GF(p^2) = GF(p)[q]/(q^2 - delta q + 1)`` restricted to ``GF(p)`` (every
    coordinate a pair); ``scalars`` names the chain's field."""

    n: int
    F: PrimeField
    dims: list[int]
    gens: list[list[tuple[Any, Any]]]  # gens[i][k] = (terms of g, terms of g^T)
    degree: int = 1
    scalars: str = ""

    def right(self, X: Any, i: int, k: int) -> Any:
        """``X g_i`` on sector ``k`` for the rows ``X`` (shape ``(m, d_k)``)."""
        return _apply(X, self.gens[i][k][0], self.F.p)

    def left_t(self, X: Any, i: int, k: int) -> Any:
        """``(g_i X^T)^T = X g_i^T`` on sector ``k``."""
        return _apply(X, self.gens[i][k][1], self.F.p)


def _apply(X: Any, terms: tuple[Any, list[tuple[Any, Any]]], p: int) -> Any:
    diag, rest = terms
    acc = X * diag
    for src, coef in rest:
        acc += X[:, src] * coef
    return acc % p


def _terms(d: int, entries: list[tuple[int, int, int]]) -> tuple[Any, list[tuple[Any, Any]]]:
    """The column form of a ``d x d`` matrix given by its entries ``(row, column, value)``:
    the diagonal, and gathers ``(src, coef)`` such that column ``c`` receives
    ``X[:, src[c]] coef[c]`` (as many gathers as the fullest column has entries off the
    diagonal; short columns are padded with coefficient 0)."""
    diag = np.zeros(d, dtype=np.int64)
    cols: list[list[tuple[int, int]]] = [[] for _ in range(d)]
    for r, c, v in entries:
        if r == c:
            diag[c] = v
        elif v:
            cols[c].append((r, v))
    width = max((len(x) for x in cols), default=0)
    rest = []
    for t in range(width):
        src = np.arange(d, dtype=np.int64)
        coef = np.zeros(d, dtype=np.int64)
        for c, x in enumerate(cols):
            if t < len(x):
                src[c], coef[c] = x[t]
        rest.append((src, coef))
    return diag, rest


SECTOR_LIMIT = 1 << 14
"""Largest sector dimension (over ``GF(p)``, pairs counted twice): a sum over a sector
of products of two residues then stays below ``2^14 * 2^48 < 2^63``."""


def chain_scalars(delta: Any, F: PrimeField) -> tuple[Any, Any]:
    """The chain's field and ``q`` in it with ``q + 1/q = delta``: ``GF(p)`` itself when it
    holds such a ``q``, else ``GF(p^2) = GF(p)[q]/(q^2 - delta q + 1)`` (that polynomial is
    then irreducible) with ``q`` its generator."""
    try:
        return F, loop_weight_root(delta, F)
    except SpecError:
        d = int(F(delta))
        K = finite_field(F.p, 2, "q", (1, (-d) % F.p, 1))
        return K, K.gen


def _chain(n: int, delta: Any, F: PrimeField) -> _Chain:
    """The half spin chain for ``q + 1/q = delta``, over ``GF(p)`` (restricted to it from
    ``GF(p^2)`` when ``q`` is not in ``GF(p)``: an entry ``c`` becomes the ``2 x 2`` block
    of ``v -> v c`` on ``GF(p^2) = GF(p)^2``, a ring map, so the restricted matrices
    satisfy the same relations)."""
    K, q = chain_scalars(delta, F)
    deg = 1 if K is F else 2
    Kn = n // 2
    states: list[list[int]] = [[] for _ in range(Kn + 1)]
    where: dict[int, tuple[int, int]] = {}
    for s in range(1 << n):
        k = bin(s).count("1")
        if k <= Kn:
            where[s] = (k, len(states[k]))
            states[k].append(s)
    dims = [deg * len(st) for st in states]
    if max(dims) > SECTOR_LIMIT:
        raise SpecError(
            f"family temperley-lieb: the spin-chain route handles sectors up to dimension "
            f"{SECTOR_LIMIT}, not {max(dims)} (n = {n}; use route=table)"
        )
    blocks: dict[Any, list[list[int]]] = {}

    def block(v: Any) -> list[list[int]]:
        if deg == 1:
            return [[int(v)]]
        if v not in blocks:
            blocks[v] = [[int(x) for x in row] for row in K.multiplication_matrix(v)]
        return blocks[v]

    gens = []
    for _name, ents in sorted(spin_chain_entries(n, q, K).items(), key=lambda kv: int(kv[0][1:])):
        per: list[list[tuple[int, int, int]]] = [[] for _ in dims]
        for (r, c), v in ents.items():
            if r not in where:
                continue
            k, a = where[r]
            kc, b = where[c]
            if kc != k:
                raise InternalInconsistency(
                    "a spin chain generator changes the number of down spins"
                )
            blk = block(v)
            for i in range(deg):
                for j in range(deg):
                    per[k].append((deg * a + i, deg * b + j, blk[i][j]))
        gens.append(
            [
                (_terms(d, e), _terms(d, [(c, r, v) for r, c, v in e]))
                for d, e in zip(dims, per, strict=True)
            ]
        )
    scalars = F.name if deg == 1 else f"{K.name} restricted to {F.name}"
    return _Chain(n, F, dims, gens, deg, scalars)


# ----------------------------------------------------------------------------------
# idempotents as (B, P) per sector


@dataclass(eq=False)
class _Node:
    B: list[Mat]  # basis of M_k f (rows), r_k x d_k
    P: list[Mat]  # d_k x r_k with f = P B on M_k, B P = 1
    depth: int = 0
    attempts: int = 0

    @property
    def ranks(self) -> list[int]:
        return [b.nrows for b in self.B]


@dataclass
class _Class:
    node: _Node
    ranks: list[int]
    sector: int  # first sector with nonzero rank
    X: Any  # basis of e A: rows, blocks r_k x d_k flattened (int64)
    corner_pos: list[int]  # rows of X whose B x P form a basis of e A e
    corner_rad: Mat
    n: int  # dim L
    dim_P: int  # dim e A
    dim_Ae: int


BASE = 3
"""Random elements built from the generators; the later ones are products of these."""


class _Search:
    def __init__(self, chain: _Chain, seed: int) -> None:
        self.chain = chain
        self.F = chain.F
        self.rng = random.Random(seed)
        self.pool: list[list[Mat]] = []
        self.classes: list[_Class] = []
        self.stats: dict[str, float] = {}
        self.total = math.comb(2 * chain.n, chain.n) // (chain.n + 1)

    def tick(self, key: str, t0: float) -> None:
        self.stats[key] = self.stats.get(key, 0.0) + time.perf_counter() - t0

    # -- random elements ----------------------------------------------------------
    def element(self, j: int) -> list[Mat]:
        """The ``j``-th random element, sector by sector: a sum of products of random
        affine combinations of the generators (see the notes), the long products only in
        the first ``BASE`` elements; each later one has ``w_a w_b`` for random earlier
        ``a, b`` instead (one product per sector instead of a hundred generator steps),
        and fresh short products, so that its values on the one-dimensional simples are
        fresh too."""
        ch, p = self.chain, self.F.p
        while len(self.pool) <= j:
            t0 = time.perf_counter()
            length = ch.n * ch.n // 4 + 1
            base = len(self.pool) < BASE
            sizes = (length, length // 2 + 1, 3, 1) if base else (3, 1)
            total = [np.zeros((d, d), dtype=np.int64) for d in ch.dims]
            # products of every length class: a long product alone is killed by a character
            # (e.g. the one with every e_i -> 0) as soon as one factor is
            for size in sizes:
                coefs = [[self.rng.randrange(p) for _ in range(ch.n)] for _ in range(size)]
                for k, d in enumerate(ch.dims):
                    total[k] = (total[k] + self._product(coefs, k, d)) % p
            out = [_mat(self.F, Y) for Y in total]
            if not base:
                a, b = (self.rng.randrange(len(self.pool)) for _ in range(2))
                out = [
                    y + wa @ wb for y, wa, wb in zip(out, self.pool[a], self.pool[b], strict=True)
                ]
            self.pool.append(out)
            self.tick("random_elements", t0)
        return self.pool[j]

    def _product(self, coefs: list[list[int]], k: int, d: int) -> Any:
        """``prod_j (c_j0 + sum_i c_ji e_i)`` on sector ``k`` (int64 residues)."""
        ch, p = self.chain, self.F.p
        Y = np.eye(d, dtype=np.int64)
        for c in coefs:
            acc = Y * c[0]
            for i in range(ch.n - 1):
                if c[i + 1]:
                    acc += ch.right(Y, i, k) * c[i + 1]
            Y = acc % p
        return Y

    # -- splitting ------------------------------------------------------------------
    def split_attempt(self, node: _Node) -> list[_Node] | tuple[Poly, int]:
        F = self.F
        node.attempts += 1
        Y = self.element(node.depth + node.attempts - 1)
        t0 = time.perf_counter()
        C = [(b @ y @ pm) if b.nrows else None for b, y, pm in zip(node.B, Y, node.P, strict=True)]
        mus = [minpoly(c) if c is not None else None for c in C]
        mu = Poly.constant(F, 1)
        for m in mus:
            if m is not None:
                g, _, _ = mu.xgcd(m)
                mu = (mu * m) // g
        facs = mu.factor()
        self.tick("minimal_polynomials", t0)
        if len(facs) == 1:
            return facs[0]
        t0 = time.perf_counter()
        kids_B: list[list[Mat]] = [[] for _ in facs]
        kids_P: list[list[Mat]] = [[] for _ in facs]
        for k, c in enumerate(C):
            d = node.B[k].ncols
            if c is None:
                for j in range(len(facs)):
                    kids_B[j].append(Mat.zeros(F, 0, d))
                    kids_P[j].append(Mat.zeros(F, d, 0))
                continue
            spaces = []
            for g, e in facs:
                if (mus[k] % g).is_zero():
                    spaces.append(fast_left_kernel(evaluate(g**e, c)))
                else:
                    spaces.append(Mat.zeros(F, 0, c.nrows))
            T = Mat.vstack(F, spaces, c.nrows)
            if T.nrows != c.nrows:
                raise InternalInconsistency("generalised eigenspaces do not fill a sector")
            Ti = T.inverse()
            off = 0
            for j, V in enumerate(spaces):
                kids_B[j].append(V @ node.B[k])
                cols = list(range(off, off + V.nrows))
                kids_P[j].append(
                    node.P[k] @ select_columns(Ti, cols) if cols else Mat.zeros(F, d, 0)
                )
                off += V.nrows
        self.tick("eigenspaces", t0)
        depth = node.depth + node.attempts
        return [_Node(b, pm, depth=depth) for b, pm in zip(kids_B, kids_P, strict=True)]

    # -- screening --------------------------------------------------------------------
    def unexplained(self, ranks: list[int]) -> bool:
        """Whether ``ranks`` (of an idempotent) need a simple not found yet (see the notes)."""
        res = list(ranks)
        by_sector = {c.sector: c for c in self.classes}
        for k in range(len(res)):
            c = by_sector.get(k)
            if c is not None:
                m, rest = divmod(res[k], c.ranks[k])
                res = [a - m * b for a, b in zip(res, c.ranks, strict=True)]
                if rest or min(res) < 0:
                    raise InternalInconsistency(
                        "sector ranks of an idempotent not explained by the simples found"
                    )
            elif res[k] > 0:
                return True
        return False

    def covered(self) -> int:
        return sum(c.n * c.dim_P for c in self.classes)

    def explore(self) -> None:
        ch = self.chain
        root = _Node(
            [Mat.identity(self.F, d) for d in ch.dims], [Mat.identity(self.F, d) for d in ch.dims]
        )
        stack = [root]
        with task("simple modules (dim A explained)", total=self.total) as step:
            while stack and self.covered() < self.total:
                node = stack.pop()
                if not self.unexplained(node.ranks):
                    continue
                kids = self.process(node)
                if kids is None:
                    step(self.classes[-1].n * self.classes[-1].dim_P)
                    continue
                stack.extend(sorted(kids, key=lambda k: -sum(k.ranks)))

    def process(self, node: _Node) -> list[_Node] | None:
        hits, tries = 0, 0
        limit = 64
        while True:
            if node.attempts >= limit:
                # TL_n is split over every field (a cellular algebra; from memory): a
                # corner that is not local has elements whose minimal polynomial has
                # several factors (over GF(2) at least 6 of the 16 elements of M_2 do),
                # so this many misses means the chain is not what it should be
                raise InternalInconsistency(
                    f"no splitting element found: {node.attempts} random elements of a corner "
                    f"f A f (ranks {node.ranks} on the spin chain's sectors) had minimal "
                    "polynomials with a single irreducible factor, though TL_n is split"
                )
            res = self.split_attempt(node)
            if isinstance(res, list):
                return res
            g, _ = res
            tries += 1
            if g.degree == 1 and g.coeffs()[0] != 0:
                hits += 1
            if hits >= 2 or tries >= 8:
                t0 = time.perf_counter()
                cl = self.certify(node)
                self.tick("certify", t0)
                if cl is not None:
                    if any(c.sector == cl.sector for c in self.classes):
                        raise InternalInconsistency("two simples first appear in the same sector")
                    self.classes.append(cl)
                    return None
                hits, tries = 0, 0

    # -- closures and certificates -----------------------------------------------------
    def closure(self, start: list[Any], ranks: list[int], left: bool) -> Any:
        """A basis (rows) of ``e A`` (``left=False``: closure of ``start`` under right
        multiplication) or of ``A e`` transposed (``left=True``).

        The basis is kept in reduced echelon form: new candidates are reduced by one
        product with it, and only their echelon form is computed."""
        ch, F = self.chain, self.F
        segs = _segments(ranks, ch.dims)
        width = segs[-1][1] if segs else 0
        v = np.zeros((1, width), dtype=np.int64)
        for (a, b), blk in zip(segs, start, strict=True):
            v[0, a:b] = blk.ravel()
        E, piv = _mat(F, v).rref()
        piv = list(piv)
        frontier = _arr(E)
        while frontier.shape[0]:
            m = frontier.shape[0]
            cands = np.zeros(((ch.n - 1) * m, width), dtype=np.int64)
            for i in range(ch.n - 1):
                for k, (a, b) in enumerate(segs):
                    r = ranks[k]
                    if not r:
                        continue
                    X = frontier[:, a:b].reshape(m * r, ch.dims[k])
                    out = ch.left_t(X, i, k) if left else ch.right(X, i, k)
                    cands[i * m : (i + 1) * m, a:b] = out.reshape(m, b - a)
            C = _mat(F, cands)
            C = C - select_columns(C, piv) @ E
            R, piv2 = C.rref()
            if not piv2:
                break
            E = Mat.vstack(F, [E - select_columns(E, list(piv2)) @ R, R], width)
            piv += list(piv2)
            frontier = _arr(R)
            if E.nrows > self.total:
                raise InternalInconsistency("a one-sided ideal larger than the algebra")
        return _arr(E)

    def certify(self, node: _Node) -> _Class | None:
        """The class of the leaf ``node``, or ``None`` when its corner is not local."""
        ch, F, p = self.chain, self.F, self.F.p
        ranks = node.ranks
        t0 = time.perf_counter()
        X = self.closure([_arr(b) for b in node.B], ranks, left=False)
        self.tick("closures", t0)
        H = _times(F, X, ranks, ch.dims, node.P)  # B x P: coordinates in e A e
        cpos = select_independent_rows(_mat(F, H))
        if len(cpos) > CORNER_LIMIT:
            raise NotSplitError(
                f"could not certify a primitive idempotent: its corner e A e has dimension "
                f"{len(cpos)} > {CORNER_LIMIT}"
            )
        sq = [r * r for r in ranks]
        Cb = H[cpos]
        solver = coords_solver(_mat(F, Cb))
        mult = [
            _coords(F, solver, _bd_products(Cb, Cb[l], ranks, ranks, ranks, p))
            for l in range(len(cpos))
        ]
        rad = small_radical(F, mult)
        c = len(cpos)
        if rad.nrows != c - 1:
            return None
        unit = np.concatenate([np.eye(r, dtype=np.int64).ravel() for r in ranks])[None, :]
        ecoords = _coords(F, solver, unit)
        Mq = Mat.vstack(F, [rad, ecoords], c)
        rhs = Mat.from_flat(F, 1, c, [F.zero] * (c - 1) + [F.one])
        chi = Mq.inverse() @ rhs.transpose()  # column: chi on corner coordinates
        piv, T = solver
        w = np.zeros(sum(sq), dtype=np.int64)
        w[list(piv)] = _arr(T @ chi).ravel()
        t0 = time.perf_counter()
        Yt = self.closure([_arr(pm.transpose()) for pm in node.P], ranks, left=True)
        self.tick("closures", t0)
        # chi(x y) = sum_k <W_k^T X_k, Y_k^T>
        segs = _segments(ranks, ch.dims)
        Z = np.zeros_like(X)
        off = 0
        for k, (a, b) in enumerate(segs):
            r = ranks[k]
            if not r:
                continue
            Wk = w[off : off + r * r].reshape(r, r)
            off += r * r
            Xk = X[:, a:b].reshape(X.shape[0], r, ch.dims[k])
            Z[:, a:b] = (np.einsum("ji,mjd->mid", Wk, Xk) % p).reshape(X.shape[0], b - a)
        gram = _mat(F, Z) @ _mat(F, Yt).transpose()
        n_simple = gram.rank()
        if n_simple == 0:
            raise InternalInconsistency("a primitive idempotent with a zero simple module")
        sector = next(k for k, r in enumerate(ranks) if r)
        if ranks[sector] != ch.degree:  # [M_k : L] = 1, each coordinate a pair when degree 2
            raise InternalInconsistency(
                f"a primitive idempotent has rank {ranks[sector]} on the first sector it "
                f"acts on (expected {ch.degree})"
            )
        return _Class(node, ranks, sector, X, cpos, rad, n_simple, X.shape[0], Yt.shape[0])


def _segments(ranks: list[int], dims: list[int]) -> list[tuple[int, int]]:
    out, a = [], 0
    for r, d in zip(ranks, dims, strict=True):
        out.append((a, a + r * d))
        a += r * d
    return out


def _times(F: PrimeField, X: Any, ranks: list[int], dims: list[int], P: list[Mat]) -> Any:
    """Rows ``x P`` (blocks ``r_k x d_k`` times ``d_k x s_k``), flattened."""
    m = X.shape[0]
    parts = []
    for k, (a, b) in enumerate(_segments(ranks, dims)):
        r, s = ranks[k], P[k].ncols
        if not r or not s:
            parts.append(np.zeros((m, r * s), dtype=np.int64))
            continue
        Xk = X[:, a:b].reshape(m * r, dims[k])
        parts.append(_arr(_mat(F, Xk) @ P[k]).reshape(m, r * s))
    return np.concatenate(parts, axis=1) if parts else np.zeros((m, 0), dtype=np.int64)


def _bd_products(H: Any, h: Any, rs: list[int], ru: list[int], rt: list[int], p: int) -> Any:
    """Rows ``x h`` for block-diagonal ``x`` (rows of ``H``, blocks ``rs_k x ru_k``) and
    ``h`` (blocks ``ru_k x rt_k``), flattened (small blocks: int64 products)."""
    m = H.shape[0]
    parts = []
    a = b = 0
    for k in range(len(rs)):
        s, u, t = rs[k], ru[k], rt[k]
        Hk = H[:, a : a + s * u].reshape(m, s, u)
        hk = h[b : b + u * t].reshape(u, t)
        parts.append((np.einsum("msu,ut->mst", Hk, hk) % p).reshape(m, s * t))
        a += s * u
        b += u * t
    return np.concatenate(parts, axis=1)


def _coords(F: PrimeField, solver: tuple, rows: Any) -> Mat:
    piv, T = solver
    if not len(piv):
        return Mat.zeros(F, rows.shape[0], 0)
    return _mat(F, rows[:, list(piv)]) @ T


# ----------------------------------------------------------------------------------
# the result


@dataclass(frozen=True)
class ModuleReduction:
    """The result of :func:`reduce_temperley_lieb` (a sibling of
    :class:`~hwcat.algebras.reduction.reduction.Reduction` without an input table:
    the primitive idempotents exist only as matrices on the spin chain)."""

    name: str
    field_name: str
    dimension: int
    basic: BasicAlgebra
    simple_dimensions: tuple[int, ...]
    projective_dimensions: tuple[int, ...]
    radical_dimension: int
    sector_ranks: tuple[tuple[int, ...], ...]
    chain_field: str
    method: str
    seed: int
    timings: dict[str, float] = field(default_factory=dict, repr=False, compare=False)

    def to_dict(self) -> dict[str, Any]:
        return {
            "name": self.name,
            "field": self.field_name,
            "dimension": self.dimension,
            "basic_dimension": self.basic.dim,
            "simples": list(self.basic.vertices),
            "simple_dimensions": list(self.simple_dimensions),
            "projective_dimensions": list(self.projective_dimensions),
            "radical_dimension": self.radical_dimension,
            "idempotents": None,
            "idempotents_note": (
                "not available in the diagram basis on this route: the primitive idempotents "
                "were found as matrices on the spin chain"
            ),
            "sector_ranks": [list(r) for r in self.sector_ranks],
            "spin_chain_field": self.chain_field,
            "cartan": [list(r) for r in self.basic.cartan()],
            "method": self.method,
            "seed": self.seed,
        }


MODULE_REDUCTION = ("reduction", "spin chain")
"""Cache key under which a hub made here holds its :class:`ModuleReduction` (the two
refer to each other and are freed together)."""


def module_reduction_of(B: BasicAlgebra) -> ModuleReduction | None:
    """The :class:`ModuleReduction` that produced the hub ``B``, if it came from one."""
    return B.cached(MODULE_REDUCTION, lambda: None) if B.is_cached(MODULE_REDUCTION) else None


def reduce_temperley_lieb(
    n: int, delta: Any = 0, field: Any = "GF(5)", *, seed: int = 0
) -> ModuleReduction:
    """Reduce ``TL_n(delta)`` over a prime field through the spin chain (see the notes).

    Raises
    ------
    SpecError
        When the field is not a prime field below ``2^24`` (when ``GF(p)`` holds no ``q``
        with ``q + 1/q = delta``, the chain over ``GF(p^2)`` restricted to ``GF(p)`` is used).
    """
    if np is None:
        raise SpecError(
            "family temperley-lieb: the spin-chain route needs numpy "
            "(pip install 'hwcat[fast]'), or use route=table"
        )
    F = parse_field(field) if isinstance(field, str) else field
    if not isinstance(F, PrimeField):
        raise SpecError(
            f"family temperley-lieb: the spin-chain route needs a prime field GF(p), not {F}"
        )
    if F.p >= PRIME_LIMIT:
        raise SpecError(
            f"family temperley-lieb: the spin-chain route needs a prime below 2^24, not {F.p} "
            "(use route=table)"
        )
    if isinstance(n, bool) or not isinstance(n, int) or n < 2:
        raise SpecError(f"family temperley-lieb: the spin-chain route needs n >= 2, not {n!r}")
    if n > 200:  # Catalan(n) > 2^n
        check_power_of_two(n, f"TL_{n} has dimension Catalan({n}), more than 2^{n}")
    check_dimension(math.comb(2 * n, n) // (n + 1), f"TL_{n}")
    timings: dict[str, float] = {}
    t0 = time.perf_counter()
    S = _Search(_chain(n, delta, F), seed)
    S.explore()
    timings.update(S.stats)
    timings["search"] = time.perf_counter() - t0
    total = S.total
    if sum(c.n * c.dim_P for c in S.classes) != total:
        raise InternalInconsistency(
            f"the spin chain gave sum dim L * dim P = {S.covered()} != Catalan({n}) = {total}"
        )
    if sum(c.n * c.dim_Ae for c in S.classes) != total:
        raise InternalInconsistency("Morita count with left projectives failed on the spin chain")
    classes = sorted(S.classes, key=lambda c: (c.n, c.dim_P, c.sector))
    t0 = time.perf_counter()
    name = f"TL_{n}({F.to_str(F(delta))}) over {F.name}"
    B = _assemble(F, S.chain, classes, name)
    labels = [str(n - 2 * c.sector) for c in classes]
    for c in classes:  # L(t) is the head of the cell module W(t) (from memory)
        k = c.sector
        cell = math.comb(n, k) - (math.comb(n, k - 1) if k else 0)
        if c.n > cell:
            raise InternalInconsistency(
                f"a simple of dimension {c.n} labelled {n - 2 * k} exceeds its cell module "
                f"(dimension {cell})"
            )
    order = " > ".join(str(t) for t in sorted(int(x) for x in labels))
    B = B.with_vertex_names(labels, natural_order=order)
    timings["basic_algebra"] = time.perf_counter() - t0
    red = ModuleReduction(
        name=name,
        field_name=F.name,
        dimension=total,
        basic=B,
        simple_dimensions=tuple(c.n for c in classes),
        projective_dimensions=tuple(c.dim_P for c in classes),
        radical_dimension=total - sum(c.n**2 for c in classes),
        sector_ranks=tuple(tuple(c.ranks) for c in classes),
        chain_field=S.chain.scalars,
        method="spin chain",
        seed=seed,
        timings=timings,
    )
    B.cached(MODULE_REDUCTION, lambda: red)
    return red


def _assemble(F: PrimeField, chain: _Chain, classes: list[_Class], name: str) -> BasicAlgebra:
    """The basic algebra from the blocks ``e_s A e_t = {B_s x P_t}`` (see the notes)."""
    p = F.p
    m = len(classes)
    basis: dict[tuple[int, int], Any] = {}
    solver: dict[tuple[int, int], tuple] = {}
    for s, cs in enumerate(classes):
        for t, ct in enumerate(classes):
            H = _times(F, cs.X, cs.ranks, chain.dims, ct.node.P)
            pos = cs.corner_pos if s == t else select_independent_rows(_mat(F, H))
            basis[(s, t)] = H[pos]
            solver[(s, t)] = coords_solver(_mat(F, H[pos])) if len(pos) else ((), None)
        if sum(ct.n * basis[(s, t)].shape[0] for t, ct in enumerate(classes)) != cs.dim_P:
            raise InternalInconsistency(
                f"the blocks e_s A e_t of vertex {s + 1} do not add up to dim e_s A = {cs.dim_P}"
            )
    dims = {k: v.shape[0] for k, v in basis.items()}
    rk = [c.ranks for c in classes]
    mult: dict[tuple[int, int, int], list[Mat]] = {}
    for s in range(m):
        for u in range(m):
            for t in range(m):
                out = []
                for j in range(dims[(u, t)]):
                    if not dims[(s, u)] or not dims[(s, t)]:
                        out.append(Mat.zeros(F, dims[(s, u)], dims[(s, t)]))
                        continue
                    prod = _bd_products(basis[(s, u)], basis[(u, t)][j], rk[s], rk[u], rk[t], p)
                    out.append(_coords(F, solver[(s, t)], prod))
                mult[(s, u, t)] = out
    starts = []
    for s in range(m):
        unit = np.concatenate([np.eye(r, dtype=np.int64).ravel() for r in rk[s]])[None, :]
        starts.append(_coords(F, solver[(s, s)], unit))
    B, _, _ = assemble_from_blocks(
        F, dims, mult, [c.corner_rad for c in classes], starts, name, [c.n for c in classes]
    )
    return B
