namespace NetAdjust.LinearAlgebra.Sparse;

/// <summary>
/// Forward and back substitution with the supernodal factor: x = L \ b then x = Lᵀ \ x, in place, permuted and
/// scaled numbering.
/// </summary>
/// <remarks>Davis 2006, <i>Direct Methods for Sparse Linear Systems</i>, §3.1 (cs_lsolve, cs_ltsolve), by supernodal
/// blocks. O(nnz(L)).</remarks>
internal static class SupernodalTriangularSolve
{
    /// <summary>x = L \ x.</summary>
    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    public static void Forward(SymbolicCholesky sym, double[] L, Span<double> x)
    {
        for (int s = 0; s < sym.SupernodeCount; s++)
        {
            int f = sym.SnStart[s], k = sym.SnStart[s + 1] - f;
            int r0 = sym.SnRowStart[s], m = sym.SnRowStart[s + 1] - r0;
            long off = sym.SnValueStart[s];
            var xs = x.Slice(f, k);
            for (int c = 0; c < k; c++)
            {
                var row = L.AsSpan((int)(off + ((long)c * k)), k);
                xs[c] = (xs[c] - DenseKernels.Dot(row, xs, c)) / row[c];
            }
            for (int t = k; t < m; t++)
                x[sym.SnRows[r0 + t]] -= DenseKernels.Dot(L.AsSpan((int)(off + ((long)t * k)), k), xs, k);
        }
    }

    /// <summary>x = Lᵀ \ x.</summary>
    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    public static void Backward(SymbolicCholesky sym, double[] L, Span<double> x)
    {
        for (int s = sym.SupernodeCount - 1; s >= 0; s--)
        {
            int f = sym.SnStart[s], k = sym.SnStart[s + 1] - f;
            int r0 = sym.SnRowStart[s], m = sym.SnRowStart[s + 1] - r0;
            long off = sym.SnValueStart[s];
            var xs = x.Slice(f, k);
            for (int t = k; t < m; t++)
                DenseKernels.SubtractScaled(xs, L.AsSpan((int)(off + ((long)t * k)), k), x[sym.SnRows[r0 + t]], k);
            for (int c = k - 1; c >= 0; c--)
            {
                double v = xs[c];
                for (int d = c + 1; d < k; d++) v -= L[off + ((long)d * k) + c] * xs[d];
                xs[c] = v / L[off + ((long)c * k) + c];
            }
        }
    }
}
