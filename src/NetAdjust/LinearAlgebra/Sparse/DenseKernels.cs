using System.Numerics;
using System.Runtime.InteropServices;

namespace NetAdjust.LinearAlgebra.Sparse;

/// <summary>
/// Dense building blocks of the supernodal factorisation, on row-major blocks: dot products, the symmetric
/// rank-k update U −= L Lᵀ (lower triangle), and row-wise triangular solves. SIMD through
/// <see cref="Vector{T}"/>; 2×2 register blocking in the update (Golub &amp; Van Loan, <i>Matrix Computations</i>,
/// 4th ed., §1.5 and §3.1.4).
/// </summary>
internal static class DenseKernels
{
    /// <summary>Σ_t a[t] b[t] over n entries.</summary>
    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    public static double Dot(ReadOnlySpan<double> a, ReadOnlySpan<double> b, int n)
    {
        int w = Vector<double>.Count, t = 0;
        double s = 0;
        if (n >= 2 * w)
        {
            var va = MemoryMarshal.Cast<double, Vector<double>>(a[..n]);
            var vb = MemoryMarshal.Cast<double, Vector<double>>(b[..n]);
            var acc0 = Vector<double>.Zero;
            var acc1 = Vector<double>.Zero;
            int v = 0;
            for (; v + 1 < va.Length; v += 2) { acc0 += va[v] * vb[v]; acc1 += va[v + 1] * vb[v + 1]; }
            for (; v < va.Length; v++) acc0 += va[v] * vb[v];
            s = Vector.Sum(acc0 + acc1);
            t = va.Length * w;
        }
        for (; t < n; t++) s += a[t] * b[t];
        return s;
    }

    /// <summary>
    /// The four dot products of <see cref="Dot"/> for the pairs (a0, b0), (a0, b1), (a1, b0), (a1, b1) over n entries,
    /// each with exactly the arithmetic of <see cref="Dot"/> (same accumulators, same order: bit-identical results),
    /// loading each vector once for two products.
    /// </summary>
    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    public static void Dot2x2Exact(ReadOnlySpan<double> a0, ReadOnlySpan<double> a1, ReadOnlySpan<double> b0,
        ReadOnlySpan<double> b1, int n, out double s00, out double s01, out double s10, out double s11)
    {
        int w = Vector<double>.Count, t = 0;
        s00 = s01 = s10 = s11 = 0;
        if (n >= 2 * w)
        {
            var va0 = MemoryMarshal.Cast<double, Vector<double>>(a0[..n]);
            var va1 = MemoryMarshal.Cast<double, Vector<double>>(a1[..n]);
            var vb0 = MemoryMarshal.Cast<double, Vector<double>>(b0[..n]);
            var vb1 = MemoryMarshal.Cast<double, Vector<double>>(b1[..n]);
            Vector<double> p00 = default, p01 = default, p10 = default, p11 = default; // acc0 of Dot
            Vector<double> q00 = default, q01 = default, q10 = default, q11 = default; // acc1 of Dot
            int v = 0, len = va0.Length;
            for (; v + 1 < len; v += 2)
            {
                var x0 = va0[v]; var x1 = va1[v]; var y0 = vb0[v]; var y1 = vb1[v];
                p00 += x0 * y0; p01 += x0 * y1; p10 += x1 * y0; p11 += x1 * y1;
                x0 = va0[v + 1]; x1 = va1[v + 1]; y0 = vb0[v + 1]; y1 = vb1[v + 1];
                q00 += x0 * y0; q01 += x0 * y1; q10 += x1 * y0; q11 += x1 * y1;
            }
            if (v < len)
            {
                var x0 = va0[v]; var x1 = va1[v]; var y0 = vb0[v]; var y1 = vb1[v];
                p00 += x0 * y0; p01 += x0 * y1; p10 += x1 * y0; p11 += x1 * y1;
            }
            s00 = Vector.Sum(p00 + q00); s01 = Vector.Sum(p01 + q01);
            s10 = Vector.Sum(p10 + q10); s11 = Vector.Sum(p11 + q11);
            t = len * w;
        }
        for (; t < n; t++)
        {
            s00 += a0[t] * b0[t]; s01 += a0[t] * b1[t]; s10 += a1[t] * b0[t]; s11 += a1[t] * b1[t];
        }
    }

    /// <summary>y[0..n) −= α x[0..n).</summary>
    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    public static void SubtractScaled(Span<double> y, ReadOnlySpan<double> x, double alpha, int n)
    {
        int w = Vector<double>.Count, t = 0;
        if (n >= w)
        {
            var vy = MemoryMarshal.Cast<double, Vector<double>>(y[..n]);
            var vx = MemoryMarshal.Cast<double, Vector<double>>(x[..n]);
            var va = new Vector<double>(alpha);
            for (int v = 0; v < vy.Length; v++) vy[v] -= va * vx[v];
            t = vy.Length * w;
        }
        for (; t < n; t++) y[t] -= alpha * x[t];
    }

    /// <summary>
    /// U(a, b) −= L(r0 + a, :) · L(r0 + b, :) for 0 ≤ b ≤ a &lt; mu, rows a in [a0, a1): the lower triangle of
    /// U −= L₂ L₂ᵀ, with L₂ the rows r0.. of a row-major block of row length k and U row-major of order mu.
    /// </summary>
    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    public static void SyrkLowerRows(double[] l, long lOffset, int k, int r0, double[] u, int mu, int a0, int a1)
    {
        var ls = l.AsSpan();
        int a = a0;
        for (; a + 1 < a1; a += 2)
        {
            var ra0 = ls.Slice((int)(lOffset + ((long)(r0 + a) * k)), k);
            var ra1 = ls.Slice((int)(lOffset + ((long)(r0 + a + 1) * k)), k);
            int b = 0;
            for (; b + 1 <= a; b += 2)
            {
                var rb0 = ls.Slice((int)(lOffset + ((long)(r0 + b) * k)), k);
                var rb1 = ls.Slice((int)(lOffset + ((long)(r0 + b + 1) * k)), k);
                Dot2x2(ra0, ra1, rb0, rb1, k, out double s00, out double s01, out double s10, out double s11);
                u[(a * mu) + b] -= s00;
                u[(a * mu) + b + 1] -= s01;
                u[((a + 1) * mu) + b] -= s10;
                u[((a + 1) * mu) + b + 1] -= s11;
            }
            for (; b <= a + 1; b++)
            {
                var rb = ls.Slice((int)(lOffset + ((long)(r0 + b) * k)), k);
                if (b <= a) u[(a * mu) + b] -= Dot(ra0, rb, k);
                u[((a + 1) * mu) + b] -= Dot(ra1, rb, k);
            }
        }
        for (; a < a1; a++)
        {
            var ra = ls.Slice((int)(lOffset + ((long)(r0 + a) * k)), k);
            for (int b = 0; b <= a; b++)
                u[(a * mu) + b] -= Dot(ra, ls.Slice((int)(lOffset + ((long)(r0 + b) * k)), k), k);
        }
    }

    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    private static void Dot2x2(ReadOnlySpan<double> a0, ReadOnlySpan<double> a1, ReadOnlySpan<double> b0,
        ReadOnlySpan<double> b1, int n,
        out double s00, out double s01, out double s10, out double s11)
    {
        int w = Vector<double>.Count, t = 0;
        s00 = s01 = s10 = s11 = 0;
        if (n >= w)
        {
            var va0 = MemoryMarshal.Cast<double, Vector<double>>(a0[..n]);
            var va1 = MemoryMarshal.Cast<double, Vector<double>>(a1[..n]);
            var vb0 = MemoryMarshal.Cast<double, Vector<double>>(b0[..n]);
            var vb1 = MemoryMarshal.Cast<double, Vector<double>>(b1[..n]);
            Vector<double> c00 = default, c01 = default, c10 = default, c11 = default;
            for (int v = 0; v < va0.Length; v++)
            {
                var x0 = va0[v]; var x1 = va1[v]; var y0 = vb0[v]; var y1 = vb1[v];
                c00 += x0 * y0; c01 += x0 * y1; c10 += x1 * y0; c11 += x1 * y1;
            }
            s00 = Vector.Sum(c00); s01 = Vector.Sum(c01); s10 = Vector.Sum(c10); s11 = Vector.Sum(c11);
            t = va0.Length * w;
        }
        for (; t < n; t++)
        {
            s00 += a0[t] * b0[t]; s01 += a0[t] * b1[t]; s10 += a1[t] * b0[t]; s11 += a1[t] * b1[t];
        }
    }

    /// <summary>
    /// Splits the rows [0, mu) of a lower-triangular update into about <paramref name="parts"/> ranges of equal
    /// work (row a costs a + 1). Inner cuts are even, so that every range pairs its rows exactly as one serial pass
    /// does and the result is bit-for-bit independent of the number of cores.
    /// </summary>
    public static int[] BalancedTriangleSplit(int mu, int parts)
    {
        var cuts = new int[parts + 1];
        double total = (double)mu * (mu + 1) / 2;
        for (int p = 1; p < parts; p++)
            // even: rows pair as in the serial loop
            cuts[p] = Math.Clamp((int)Math.Sqrt(2 * total * p / parts) & ~1, cuts[p - 1], mu);
        cuts[parts] = mu;
        return cuts;
    }
}
