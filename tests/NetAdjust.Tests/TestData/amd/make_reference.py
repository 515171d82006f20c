#!/usr/bin/env python3
"""Reference orderings for ApproximateMinimumDegreeTests.

Builds two fixed sparsity patterns of normal matrices (invented test structures, not survey data), orders each
with SuiteSparse's amd_order (the reference implementation of Amestoy, Davis & Duff 1996, "An approximate minimum
degree ordering algorithm", SIAM J. Matrix Anal. Appl. 17(4):886-905; Debian package libamd2, default controls,
called through ctypes) and writes the pattern, the reference permutation, nnz(L) of that permutation counted here by
symbolic elimination on sets (the graph model of Gaussian elimination, George & Liu 1981, ch. 3; diagonal included)
and amd_order's own estimate Info[AMD_LNZ] + n, to amd-reference.txt.

Run once:  apt-get install -y libamd2 && python3 make_reference.py > amd-reference.txt
"""
import ctypes
import math
import random

AMD_INFO = 20
AMD_LNZ = 9  # index of nnz(L) below the diagonal in Info (amd.h)


def grid_pattern(side, per_point):
    """A side x side grid of points, each joined to its 8 neighbours (king's moves); per_point unknowns a point.
    Unknowns of joined points are all coupled, as the easting, northing and orientation of surveyed points are."""
    n = side * side * per_point
    adj = [set() for _ in range(n)]
    for r in range(side):
        for c in range(side):
            for dr in (-1, 0, 1):
                for dc in (-1, 0, 1):
                    rr, cc = r + dr, c + dc
                    if 0 <= rr < side and 0 <= cc < side:
                        for a in range(per_point):
                            for b in range(per_point):
                                i = (r * side + c) * per_point + a
                                j = (rr * side + cc) * per_point + b
                                if i != j:
                                    adj[i].add(j)
    return adj


def nearest_neighbour_pattern(points, k, seed):
    """points random positions in a square (seeded), each joined to its k nearest: a height network's graph."""
    rng = random.Random(seed)
    xy = [(rng.random(), rng.random()) for _ in range(points)]
    adj = [set() for _ in range(points)]
    for i in range(points):
        near = sorted(range(points), key=lambda j: math.dist(xy[i], xy[j]))[1:k + 1]
        for j in near:
            adj[i].add(j)
            adj[j].add(i)
    return adj


def amd(adj):
    lib = ctypes.CDLL("libamd.so.2")
    n = len(adj)
    ap, ai = [0], []
    for v in range(n):
        ai.extend(sorted(adj[v]))
        ap.append(len(ai))
    IntN = ctypes.c_int * n
    perm = IntN()
    info = (ctypes.c_double * AMD_INFO)()
    status = lib.amd_order(n, (ctypes.c_int * (n + 1))(*ap), (ctypes.c_int * len(ai))(*ai), perm, None, info)
    assert status >= 0, status
    return ap, ai, list(perm), int(info[AMD_LNZ]) + n


def symbolic_fill(adj, perm):
    """nnz(L) of P A P^T, diagonal included: eliminating a vertex joins its remaining neighbours into a clique."""
    pos = {v: k for k, v in enumerate(perm)}
    nbrs = [set(pos[w] for w in adj[v]) for v in perm]
    count = len(perm)
    for k in range(len(perm)):
        later = [i for i in nbrs[k] if i > k]
        count += len(later)
        for i in later:
            nbrs[i].update(j for j in later if j != i)
    return count


def emit(name, adj):
    ap, ai, perm, lnz = amd(adj)
    print(f"matrix {name}")
    print("n", len(adj))
    print("colptr", *ap)
    print("rowind", *ai)
    print("perm", *perm)
    print("amdInfoNnzL", lnz)
    print("nnzL", symbolic_fill(adj, perm))


print("# Produced by make_reference.py (this folder) with SuiteSparse AMD 2.4.6 (Debian libamd2 1:5.12.0+dfsg-2).")
print("# Per matrix: n, the full pattern without diagonal as CSC (colptr, rowind), amd_order's permutation")
print("# (perm[k] = unknown placed k-th), amd_order's estimate of nnz(L) (Info[AMD_LNZ] + n) and nnz(L) of that")
print("# permutation counted by symbolic elimination in make_reference.py, diagonal included (nnzL, last per matrix).")
emit("grid-12x12-3", grid_pattern(12, 3))
emit("nearest6-300", nearest_neighbour_pattern(300, 6, seed=17))
