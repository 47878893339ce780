"""Homomorphisms between modules.

Method
------
``Hom(M, N)`` is computed from a presentation of ``M``: choose minimal
generators ``g`` of ``M`` (a complement of ``rad M``) and a basis of ``M`` of
elements ``g * w`` (:meth:`Module.word_basis`).  A homomorphism is fixed by
the images ``u_g`` in ``N``, and ``g * w`` goes to ``u_g * w``.  Each arrow
``a`` applied to a basis element gives either another basis element (nothing
to check) or a relation ``(g * w) * a = sum_j c_j (g_j * w_j)``, which
becomes the linear condition ``u_g * w * a = sum_j c_j u_{g_j} * w_j`` on the
``u``.  The unknowns number ``sum_g dim N_{vertex(g)}``, far fewer than the
``sum_v dim M_v dim N_v`` of the naive linear system; the naive system is
kept as :func:`hom_dimension_naive` as an independent check.
"""

from __future__ import annotations

from hwcat.algebras.hub.quiver import Path
from hwcat.errors import InternalInconsistency
from hwcat.exact import Mat
from hwcat.exact.sparse import to_mat
from hwcat.modules.module import Module

__all__ = [
    "hom",
    "hom_images",
    "hom_dimension",
    "hom_dimension_naive",
    "homomorphism_from_images",
    "homomorphisms_from_images",
]


def _presentation(M: Module) -> tuple[list, list[tuple[int, int, int, list[tuple[int, list]]]]]:
    """What ``Hom(M, -)`` needs of ``M`` alone, kept with ``M``.

    The generators, and for each arrow ``a : v -> t`` the word-basis elements
    ``k = g * w`` at ``v`` with ``g * w * a`` not a basis element, each with the
    nonzero coordinates ``(j, C[k, j])`` of ``(g * w) * a`` in the basis at ``t``.
    """
    key = "hom:presentation"
    if key in M._memo:
        return M._memo[key]
    A = M.algebra
    elems, rows = M.word_basis()
    index = [{e: k for k, e in enumerate(elems[v])} for v in range(A.n)]
    inv: dict[int, Mat] = {}
    edges = []
    for i, a in enumerate(A.arrows):
        v, t = a.source, a.target
        if not elems[v]:
            continue
        free = [k for k, (g, w) in enumerate(elems[v]) if (g, w + (i,)) not in index[t]]
        if not free:
            continue
        if M.dims[t]:
            if t not in inv:
                inv[t] = rows[t].inverse()
            Crows = (rows[v] @ M.maps[i] @ inv[t]).raw_rows()
        else:
            Crows = [[] for _ in elems[v]]
        terms = [(k, [(jj, c) for jj, c in enumerate(Crows[k]) if c != 0]) for k in free]
        edges.append((i, v, t, terms))
    M._memo[key] = (elems, edges)
    return M._memo[key]


def _hom_system(M: Module, N: Module) -> tuple[Mat, list[int], list[tuple[int, Mat]]]:
    """The constraint matrix ``Z`` (unknowns as rows), generator offsets and generators."""
    if M.algebra is not N.algebra:
        raise InternalInconsistency("Hom between modules over different algebras")
    F = M.field
    gens = M.generators()
    elems, edges = _presentation(M)
    offsets, total = [], 0
    for v, _ in gens:
        offsets.append(total)
        total += N.dims[v]
    # Z by sparse rows (one per unknown); constraint (i, k) owns nt columns from ``col``
    Zrows: list[dict] = [{} for _ in range(total)]

    def entries_of(gj: int, wj: Path) -> list[tuple[int, int, object]]:
        """Nonzero ``(row, column, value)`` of the action of ``wj`` on ``N_{v_gj}``."""
        rows = N.path_matrix(wj, gens[gj][0]).raw_rows()
        return [(r, c, x) for r, row in enumerate(rows) for c, x in enumerate(row) if x != 0]

    col = 0
    for i, v, t, terms in edges:
        nt = N.dims[t]
        if nt == 0:
            continue
        for k, coeffs in terms:
            g, w = elems[v][k]
            off = offsets[g]
            le = (N.path_matrix(w, gens[g][0]) @ N.maps[i]).raw_rows()  # dims N_{v_g} x nt
            for r, row in enumerate(le):
                zr = Zrows[off + r]
                for c, x in enumerate(row):
                    if x != 0:
                        y = zr.get(col + c)
                        zr[col + c] = -x if y is None else y - x
            for jj, cval in coeffs:
                gj, wj = elems[t][jj]
                offj = offsets[gj]
                for r, c, x in entries_of(gj, wj):
                    zr = Zrows[offj + r]
                    y = zr.get(col + c)
                    zr[col + c] = cval * x if y is None else y + cval * x
            col += nt
    Z = to_mat(F, Zrows, col) if col else Mat.zeros(F, total, 0)
    return Z, offsets, gens


def homomorphism_from_images(M: Module, N: Module, u: Mat) -> tuple[Mat, ...]:
    """The homomorphism ``M -> N`` sending generator ``g`` to the slice of ``u`` for ``g``."""
    return homomorphisms_from_images(M, N, u)[0]


def homomorphisms_from_images(M: Module, N: Module, U: Mat) -> list[tuple[Mat, ...]]:
    """One homomorphism ``M -> N`` per row of ``U`` (images of the generators, see :func:`hom_images`).

    All rows at once: at each vertex ``v`` the images of the word-basis
    elements ``g * w`` of every row form one ``dim M_v x (rows * dim N_v)``
    matrix ``Q`` (row ``k``: the images of element ``k`` side by side), and
    one product with the inverse of the word-basis matrix gives the matrices
    at ``v`` of all the homomorphisms.
    """
    F = M.field
    A = M.algebra
    gens = M.generators()
    elems, rows = M.word_basis()
    offsets, total = [], 0
    for v, _ in gens:
        offsets.append(total)
        total += N.dims[v]
    h = U.nrows
    if h == 0:
        return []
    if U.ncols != total:
        raise InternalInconsistency("images of generators of the wrong length")
    slices: dict[int, Mat] = {}  # the columns of U for generator g (h x dim N_vg)
    out: list[list[Mat]] = [[] for _ in range(h)]
    for v in range(A.n):
        dm, dn = M.dims[v], N.dims[v]
        if dm == 0 or dn == 0:
            z = Mat.zeros(F, dm, dn)
            for f in out:
                f.append(z)
            continue
        flat: list = []
        for g, w in elems[v]:
            ug = slices.get(g)
            if ug is None:
                vg = gens[g][0]
                ug = slices[g] = U.take_cols(range(offsets[g], offsets[g] + N.dims[vg]))
            flat.extend((ug @ N.path_matrix(w, gens[g][0])).entries())
        Q = Mat.from_flat(F, dm, h * dn, flat)
        R = (rows[v].inverse() @ Q).entries()
        width = h * dn
        for j, f in enumerate(out):
            lo = j * dn
            f.append(
                Mat.from_flat(
                    F,
                    dm,
                    dn,
                    [x for r in range(dm) for x in R[r * width + lo : r * width + lo + dn]],
                )
            )
    return [tuple(f) for f in out]


def hom_images(M: Module, N: Module) -> Mat:
    """A basis of ``Hom_A(M, N)`` as rows of images of the generators of ``M``.

    Row ``r`` lists, generator by generator (:meth:`Module.generators`), the
    image of the generator in ``N``; this coordinate vector determines the
    homomorphism (:func:`homomorphisms_from_images` gives its matrices) and is
    much shorter than the matrices.
    """
    if M.algebra is not N.algebra:
        raise InternalInconsistency("Hom between modules over different algebras")
    if not any(N.dims[v] for v, _ in M.generators()):  # every generator goes to zero
        return Mat.zeros(M.field, 0, 0)
    Z, _, _ = _hom_system(M, N)
    return Z.left_kernel() if Z.ncols else Mat.identity(M.field, Z.nrows)


def hom(M: Module, N: Module) -> list[tuple[Mat, ...]]:
    """A basis of ``Hom_A(M, N)``; each homomorphism is a tuple of matrices, one per vertex."""
    return homomorphisms_from_images(M, N, hom_images(M, N))


def hom_dimension(M: Module, N: Module) -> int:
    """``dim Hom_A(M, N)``.

    >>> from hwcat.io.spec import load_spec_text
    >>> from hwcat.modules import projective, simple
    >>> A = load_spec_text('field = "QQ"\\n[quiver]\\nvertices = ["1", "2"]\\narrows = ["a: 1 -> 2"]')
    >>> hom_dimension(projective(A, 0), simple(A, 1)), hom_dimension(projective(A, 1), projective(A, 0))
    (0, 1)
    """
    Z, _, _ = _hom_system(M, N)
    return Z.nrows - Z.rank()


def hom_dimension_naive(M: Module, N: Module) -> int:
    """``dim Hom(M, N)`` from the full intertwiner system (for tests; quadratic size)."""
    F = M.field
    A = M.algebra
    offs, total = [], 0
    for v in range(A.n):
        offs.append(total)
        total += M.dims[v] * N.dims[v]
    eqs = []
    for i, a in enumerate(A.arrows):
        s, t = a.source, a.target
        Ma, Na = M.maps[i].raw_rows(), N.maps[i].raw_rows()
        ms, mt, ns, nt = M.dims[s], M.dims[t], N.dims[s], N.dims[t]
        # (M_a X_t - X_s N_a)[p, q] = sum_r Ma[p][r] X_t[r, q] - sum_r X_s[p, r] Na[r][q]
        for p in range(ms):
            for q in range(nt):
                row = [F.zero] * total
                for r in range(mt):
                    if Ma[p][r] != 0:
                        row[offs[t] + r * nt + q] += Ma[p][r]
                for r in range(ns):
                    if Na[r][q] != 0:
                        row[offs[s] + p * ns + r] -= Na[r][q]
                eqs.append(row)
    if not eqs:
        return total
    return total - Mat.from_flat(F, len(eqs), total, [x for r in eqs for x in r]).rank()
