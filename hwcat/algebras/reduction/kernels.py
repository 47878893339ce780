"""Small kernels shared by the radical and the reduction of a structure-constant algebra.

Coordinates of elements are "raw" lists (Python ints mod ``p`` over a prime
field, flint rationals over QQ); these helpers convert between raw lists,
restricted index sets and :class:`~hwcat.exact.Mat`, and provide the Krylov
sequence, minimal polynomials and the radical of a small algebra given by its
right multiplication matrices.
"""

from __future__ import annotations

from array import array
from collections.abc import Sequence
from typing import Any

from hwcat.algebras.inputs.structure import StructureAlgebra
from hwcat.errors import InternalInconsistency
from hwcat.exact import Mat, PrimeField, echelon, restrict_scalars, rows_over_extension
from hwcat.exact.nmod_bulk import nmod_mat_from_residues, power_trace, read_residues
from hwcat.exact.polys import (
    Poly,
    lifted_power_trace,
    matrix_from_residues,
    select_columns,
    sparse_matrix,
)

try:  # optional: the small radical by int64 arrays
    import numpy as _np
except ImportError:  # pragma: no cover - numpy is an optional extra
    _np = None


def residue_matrix(F: Any, nrows: int, ncols: int, buf: Any) -> Mat:
    """:func:`~hwcat.exact.polys.matrix_from_residues` copied in one piece at every size
    (the small matrices of the Krylov sequences and of the blocks are many)."""
    if nrows and ncols:
        M = nmod_mat_from_residues(nrows, ncols, buf, F.p)
        if M is not None:
            return Mat(F, M)
    return matrix_from_residues(F, nrows, ncols, buf)


ARRAY_CORNER_LIMIT = 256
"""Largest corner whose multiplication matrices are copied into one array (three copies of
``c^3`` int64 entries: 400 MB at 256)."""

FROBENIUS_WORK = 1 << 26
"""Largest ``(p - 1) c^3`` for which a commutative corner's radical is found through the
Frobenius map (the powers ``c_l^p`` of its basis elements take that many products)."""

FAST_SMALL_RADICAL = True
"""Switch for :func:`_small_radical_arrays` (tests compare both paths)."""

__all__ = [
    "as_row",
    "raw_rows",
    "embed",
    "restrict",
    "transfer",
    "apply_transfer",
    "coords_solver",
    "krylov",
    "minpoly",
    "small_radical",
    "small_radical_by_restriction",
    "FAST_SMALL_RADICAL",
    "residue_matrix",
]


def as_row(A: StructureAlgebra, raw: Sequence[Any]) -> Mat:
    return Mat.from_flat(A.field, 1, len(raw), list(raw))


def raw_rows(A: StructureAlgebra, M: Mat) -> list[list[Any]]:
    p = A._p
    if p:
        return [[int(x) for x in r] for r in M.raw_rows()]
    return [list(r) for r in M.raw_rows()]


def embed(A: StructureAlgebra, vals: Sequence[Any], index: Sequence[int] | None) -> list[Any]:
    if index is None:
        return A.raw(list(vals)) if not A._p else [int(x) for x in vals]
    out = [A._zero_raw()] * A.dim
    for i, v in zip(index, vals, strict=True):
        out[i] = int(v) if A._p else v
    return out


def restrict(raw: Sequence[Any], index: Sequence[int] | None) -> list[Any]:
    return list(raw) if index is None else [raw[i] for i in index]


def transfer(
    A: StructureAlgebra, src: Sequence[int] | None, dst: Sequence[int] | None
) -> Mat | None:
    """0/1 matrix taking coordinates on ``src`` to coordinates on ``dst`` (None: identity)."""
    if src is None and dst is None:
        return None
    n = A.dim
    s = list(range(n)) if src is None else list(src)
    d = list(range(n)) if dst is None else list(dst)
    if s == d:
        return None
    dpos = {i: k for k, i in enumerate(d)}

    return sparse_matrix(
        A.field, len(s), len(d), {(a, dpos[i]): 1 for a, i in enumerate(s) if i in dpos}
    )


def apply_transfer(M: Mat, T: Mat | None) -> Mat:
    return M if T is None else M @ T


def coords_solver(B: Mat) -> tuple[tuple[int, ...], Mat]:
    """For a basis ``B`` (rows): pivots and ``T`` with ``coords(x) = x[piv] @ T``."""
    _, piv = B.rref()
    return piv, select_columns(B, piv).inverse()


def chain_step(mats: Sequence[Mat], transposed: Sequence[Mat] | None = None):
    """``v -> v @ mats[0] @ mats[1] ...`` for single rows ``v``, as column products.

    flint multiplies a single row by a square matrix several times slower than
    the square matrix by a single column; the Krylov sequences of the splitting
    search are long chains of such products, so the transposes are taken once
    and ``v M N = (N^T (M^T v^T))^T``.  ``transposed``: the transposes, if known.
    """
    # (v M N)^T = N^T (M^T v^T): M^T acts first
    Ts = list(transposed) if transposed is not None else [M.transpose() for M in mats]

    def step(v: Mat) -> Mat:
        x = v.transpose()
        for T in Ts:
            x = T @ x
        return x.transpose()

    step.transposed = Ts  # type: ignore[attr-defined]  # krylov runs on columns with them
    return step


def krylov(v0: Mat, Z: Mat | None, step=None, limit: int | None = None) -> tuple[Mat, list[Any]]:
    """Vectors ``v0 Z^a`` up to the first dependency; returns ``(K, c)`` with
    ``v0 Z^d = c @ K`` and ``K`` the ``d`` independent vectors."""
    F = v0.field
    if isinstance(F, PrimeField):
        Ts = getattr(step, "transposed", None)
        if Ts is not None:  # columns: x -> T_k ... T_1 x
            out = _krylov_columns(v0, v0.transpose(), lambda x: _chain(Ts, x), limit)
        else:
            out = _krylov_columns(v0, v0, step if step is not None else (lambda x: x @ Z), limit)
        if out is not None:
            return out
    vecs = [v0]
    size = 4
    while True:
        while len(vecs) < size:
            vecs.append(step(vecs[-1]) if step is not None else vecs[-1] @ Z)
        K = Mat.vstack(F, vecs, v0.ncols)
        r = K.rank()
        if r < len(vecs):
            d = r
            break
        if limit is not None and len(vecs) > limit + 1:
            raise InternalInconsistency("Krylov sequence longer than the dimension")
        size *= 2
    Kd = Mat.vstack(F, vecs[:d], v0.ncols)
    c = Kd.solve_left(vecs[d])
    if c is None:  # pragma: no cover - rank argument guarantees a solution
        raise InternalInconsistency("Krylov dependency not found")
    return Kd, c.entries()


def _chain(Ts: Sequence[Mat], x: Mat) -> Mat:
    for T in Ts:
        x = T @ x
    return x


def _krylov_columns(
    v0: Mat, x: Mat, advance, limit: int | None, fine: bool = False
) -> tuple[Mat, list[Any]] | None:
    """:func:`krylov` over GF(p) with each vector read out of flint once (``x``: ``v0`` as
    a row or a column -- both hold the same residues -- and ``advance`` the next vector in
    the same shape); the matrices of the sequence are assembled from those buffers.
    The dependency is looked for at 4, 8, 16, ... vectors, or with ``fine`` (for a costly
    ``advance``) at 2, 3, 4, 6, 9, ... (same result, fewer vectors past it).
    ``None`` if the one-piece copies are unavailable."""
    F = v0.field
    n = v0.ncols
    first = read_residues(v0._m)
    if first is None:
        return None
    bufs = [first]
    size = 2 if fine else 4

    def stacked(k: int) -> Mat:
        out = array("q")
        for b in bufs[:k]:
            out.extend(b)
        return residue_matrix(F, k, n, out)

    while True:
        while len(bufs) < size:
            x = advance(x)
            b = read_residues(x._m)
            if b is None:
                return None
            bufs.append(b)
        K = stacked(len(bufs))
        r = K.rank()
        if r < len(bufs):
            d = r
            ech = K._m.rref()[0]  # its pivots serve the dependency below
            break
        if limit is not None and len(bufs) > limit + 1:
            raise InternalInconsistency("Krylov sequence longer than the dimension")
        size = max(size + 1, size * 3 // 2) if fine else 2 * size
    Kd = stacked(d)
    c = _dependency(Kd, bufs, ech) if _np is not None else None
    if c is None:
        c = Kd.solve_left(residue_matrix(F, 1, n, array("q", bufs[d])))
    if c is None:  # pragma: no cover - rank argument guarantees a solution
        raise InternalInconsistency("Krylov dependency not found")
    return Kd, c.entries()


def _dependency(Kd: Mat, bufs: list[Any], ech: Any) -> Mat | None:
    """``c`` with ``c Kd = bufs[d]`` for ``Kd`` of full row rank ``d`` (rows ``bufs[:d]``)
    and ``bufs[d]`` in its row space; ``ech``: a flint echelon form of ``bufs`` (of rank
    ``d``: the same row space).  The ``d x d`` system on the ``d`` pivot columns (those of
    the row space, so invertible on ``Kd``: ``c`` is unique), checked on all columns by
    one product.  Far cheaper than the general solver, which eliminates ``[Kd^T |
    last^T]`` (``n x (d + 1)``)."""
    F = Kd.field
    d, n = Kd.nrows, Kd.ncols
    E = read_residues(ech)
    if E is None:
        return None
    # the pivot of each nonzero row of the echelon form: its first nonzero entry
    rows = _np.frombuffer(E, dtype=_np.int64).reshape(ech.nrows(), n)[:d]
    cols = _np.argmax(rows != 0, axis=1)
    if not rows[_np.arange(d), cols].all():
        raise InternalInconsistency("Krylov vectors taken as independent are not")
    K = _np.frombuffer(b"".join(bytes(b) for b in bufs[:d]), dtype=_np.int64).reshape(d, n)
    sub = residue_matrix(F, d, d, _np.ascontiguousarray(K[:, cols]).ravel())
    rhs = residue_matrix(F, 1, d, _np.frombuffer(bytes(bufs[d]), dtype=_np.int64)[cols].copy())
    c = sub.solve_left(rhs)
    if c is None or read_residues((c @ Kd)._m) != bufs[d]:
        raise InternalInconsistency("Krylov dependency not found")
    return c


def minpoly(F, d: int, c: Sequence[Any]) -> Poly:
    return Poly.from_coeffs(F, [-x for x in c] + [F.one])


def small_radical_by_restriction(K, mult: list[Mat]) -> Mat:
    """Radical of a small algebra over ``GF(p^k)`` through the same algebra over ``GF(p)``.

    The algebra of dimension ``c`` over ``K`` is one of dimension ``c k`` over the
    prime field (basis ``t^a c_l``); both have the same radical, since ``K`` is
    central: the ``K``-span of a nilpotent ideal is a nilpotent ideal (common
    practice).  The prime-field radical is read back as vectors over ``K``.
    """
    d = K.degree
    t = K.gen
    big = [restrict_scalars(mult[l].scale(t**a)) for l in range(len(mult)) for a in range(d)]
    J = small_radical(K.base, big)
    return echelon(rows_over_extension(K, J))


def small_radical(F, mult: list[Mat]) -> Mat:
    """Radical of a small algebra given by its right multiplication matrices.

    ``mult[l]`` is the matrix of ``x -> x c_l`` in the basis ``c``.  The trace
    form of the regular representation, then (in characteristic ``p <= dim``)
    the lifted-trace chain on the regular representation.
    """
    c = len(mult)
    if getattr(F, "degree", 1) > 1 and F.characteristic and F.characteristic <= c:
        return small_radical_by_restriction(F, mult)
    if FAST_SMALL_RADICAL and _np is not None and isinstance(F, PrimeField) and c:
        rad = _small_radical_arrays(F, mult)
        if rad is not None:
            return rad
    tau = [sum((mult[l][a, a] for a in range(c)), F.zero) for l in range(c)]

    def gram(psi: Sequence[Any]) -> Mat:
        return Mat.from_flat(
            F,
            c,
            c,
            [
                sum((mult[l][a, k] * psi[k] for k in range(c)), F.zero)
                for a in range(c)
                for l in range(c)
            ],
        )

    I = echelon(gram(tau).left_kernel())
    p = F.characteristic
    i = 1
    while p and p**i <= c and I.nrows:
        piv, T = coords_solver(I)
        g = []
        for row in I.raw_rows():
            X = Mat.zeros(F, c, c)
            for l, x in enumerate(row):
                if x != 0:
                    X = X + mult[l].scale(x)
            t = lifted_power_trace(X, i)
            if t % p**i:
                raise InternalInconsistency("lifted trace not divisible on a small corner")
            g.append(F(t // p**i))
        I = _next_in_chain(F, I, piv, T, g, gram)
        i += 1
    return I


def _next_in_chain(F: Any, I: Mat, piv, T: Mat, g: list[Any], gram) -> Mat:
    """One step of the lifted-trace chain: ``g`` holds the lifted traces of the rows of
    ``I`` (``piv``, ``T`` its coordinates solver); the linear form they define on the span
    of ``I``, extended by zero, and the part of ``I`` in the kernel of its Gram matrix."""
    c = I.ncols
    psi = (select_columns(Mat.identity(F, c), piv) @ (T @ Mat.from_flat(F, len(g), 1, g))).entries()
    K = (I @ gram(psi)).left_kernel()
    return echelon(K @ I) if K.nrows else Mat.zeros(F, 0, c)


def _small_radical_arrays(F: Any, mult: list[Mat]) -> Mat | None:
    """:func:`small_radical` over GF(p) with the multiplication matrices as one int64 array
    ``R[l, a, k]`` (the same steps and the same matrices, exactly): Gram matrices by one
    array product, each lifted trace by one copy into flint modulo ``p^(i+1)``.  ``None``
    when the sizes do not allow exact int64 sums or the one-piece copies are unavailable."""
    np = _np
    p = F.p
    c = len(mult)
    if c * (p - 1) ** 2 >= 2**62 or c > ARRAY_CORNER_LIMIT:
        return None
    R = np.empty((c, c, c), dtype=np.int64)
    for l, m in enumerate(mult):
        b = read_residues(m._m)
        if b is None or len(b) != c * c:
            return None
        R[l] = np.frombuffer(b, dtype=np.int64).reshape(c, c)
    flat = R.reshape(c * c * c)
    tau = np.trace(R, axis1=1, axis2=2) % p

    def gram(psi: Any) -> Mat:
        col = matrix_from_residues(F, c, 1, np.ascontiguousarray(psi % p, dtype=np.int64))
        G = np.frombuffer(read_residues((byrow @ col)._m), dtype=np.int64).reshape(c, c)
        return matrix_from_residues(F, c, c, np.ascontiguousarray(G.T).ravel())  # G[a, l]

    if p <= c and (R == R.transpose(1, 0, 2)).all() and (p - 1) * c**3 <= FROBENIUS_WORK:
        return _commutative_radical(F, R)
    byrow = matrix_from_residues(F, c * c, c, flat)  # row (l, a): row a of mult[l]
    bymat = matrix_from_residues(F, c, c * c, flat)  # row l: mult[l] flattened
    I = echelon(gram(tau).left_kernel())
    i = 1
    while p**i <= c and I.nrows:
        mod = p ** (i + 1)
        if mod >= 1 << 62:
            return None
        piv, T = coords_solver(I)
        buf = read_residues((I @ bymat)._m)  # row r: sum_l I[r, l] mult[l]
        if buf is None:
            return None
        Xs = np.frombuffer(buf, dtype=np.int64).reshape(I.nrows, c * c)
        g = []
        for X in Xs:
            t = power_trace(c, np.ascontiguousarray(X), mod, p**i)
            if t is None:
                return None
            if t % p**i:
                raise InternalInconsistency("lifted trace not divisible on a small corner")
            g.append(F(t // p**i))
        I = _next_in_chain(
            F, I, piv, T, g, lambda psi: gram(np.asarray([int(x) for x in psi], dtype=np.int64))
        )
        i += 1
    return I


def _commutative_radical(F: Any, R: Any) -> Mat:
    """The radical of a commutative algebra over GF(p) (``R[l, a, k]``: ``c_a c_l``), as
    the kernel of a power of the Frobenius map.

    In a commutative algebra of characteristic ``p`` the map ``x -> x^p`` is additive and
    fixes GF(p), so it is linear, with the rows ``c_l^p`` as its matrix; the radical is the
    set of nilpotent elements, i.e. the kernel of ``x -> x^(p^k)`` once ``p^k >= c``
    (common practice).  One small matrix power and one kernel: about one rank.
    """
    np = _np
    p = F.p
    c = R.shape[0]
    V = np.ascontiguousarray(R[np.arange(c), np.arange(c), :])  # row l: c_l * c_l
    for _ in range(p - 2):
        V = np.einsum("lk,lkm->lm", V, R) % p  # row l: c_l^j * c_l
    Fr = residue_matrix(F, c, c, np.ascontiguousarray(V, dtype=np.int64).ravel())
    k, q = 1, p
    while q < c:
        k, q = k + 1, q * p
    P = Fr
    for _ in range(k - 1):
        P = P @ Fr
    K = P.left_kernel()
    return echelon(K) if K.nrows else Mat.zeros(F, 0, c)
