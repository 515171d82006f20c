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

    /// <summary>
    /// The two dot products of <see cref="Dot"/> for the pairs (x, y0) and (x, y1) over n entries, each with exactly
    /// the arithmetic of <see cref="Dot"/> (bit-identical results; the products x·y and y·x are the same number),
    /// loading x once for both.
    /// </summary>
    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    public static void Dot1x2Exact(ReadOnlySpan<double> x, ReadOnlySpan<double> y0, ReadOnlySpan<double> y1, int n,
        out double s0, out double s1)
    {
        int w = Vector<double>.Count, t = 0;
        s0 = s1 = 0;
        if (n >= 2 * w)
        {
            var vx = MemoryMarshal.Cast<double, Vector<double>>(x[..n]);
            var vy0 = MemoryMarshal.Cast<double, Vector<double>>(y0[..n]);
            var vy1 = MemoryMarshal.Cast<double, Vector<double>>(y1[..n]);
            Vector<double> p0 = default, p1 = default, q0 = default, q1 = default;
            int v = 0, len = vx.Length;
            for (; v + 1 < len; v += 2)
            {
                var a = vx[v]; var b = vx[v + 1];
                p0 += vy0[v] * a; q0 += vy0[v + 1] * b;
                p1 += vy1[v] * a; q1 += vy1[v + 1] * b;
            }
            if (v < len) { p0 += vy0[v] * vx[v]; p1 += vy1[v] * vx[v]; }
            s0 = Vector.Sum(p0 + q0); s1 = Vector.Sum(p1 + q1);
            t = len * w;
        }
        for (; t < n; t++) { s0 += y0[t] * x[t]; s1 += y1[t] * x[t]; }
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
            for (; b + 3 <= a; b += 4)
            {
                // two 2×2 blocks of the loop below at once, each entry with Dot2x2's arithmetic
                var rb0 = ls.Slice((int)(lOffset + ((long)(r0 + b) * k)), k);
                var rb1 = ls.Slice((int)(lOffset + ((long)(r0 + b + 1) * k)), k);
                var rb2 = ls.Slice((int)(lOffset + ((long)(r0 + b + 2) * k)), k);
                var rb3 = ls.Slice((int)(lOffset + ((long)(r0 + b + 3) * k)), k);
                Dot2x4(ra0, ra1, rb0, rb1, rb2, rb3, k, out var s0, out var s1);
                var u0 = u.AsSpan((a * mu) + b, 4);
                var u1 = u.AsSpan(((a + 1) * mu) + b, 4);
                u0[0] -= s0.X; u0[1] -= s0.Y; u0[2] -= s0.Z; u0[3] -= s0.W;
                u1[0] -= s1.X; u1[1] -= s1.Y; u1[2] -= s1.Z; u1[3] -= s1.W;
            }
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

    /// <summary>Eight products of <see cref="Dot2x2"/> at once: a0 and a1 against b0..b3, each entry with one
    /// accumulator exactly as <see cref="Dot2x2"/> (bit-identical).</summary>
    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    private static void Dot2x4(ReadOnlySpan<double> a0, ReadOnlySpan<double> a1, ReadOnlySpan<double> b0,
        ReadOnlySpan<double> b1, ReadOnlySpan<double> b2, ReadOnlySpan<double> b3, int n,
        out Quad s0, out Quad s1)
    {
        int w = Vector<double>.Count, t = 0;
        s0 = default; s1 = default;
        if (n >= w)
        {
            var va0 = MemoryMarshal.Cast<double, Vector<double>>(a0[..n]);
            var va1 = MemoryMarshal.Cast<double, Vector<double>>(a1[..n]);
            var vb0 = MemoryMarshal.Cast<double, Vector<double>>(b0[..n]);
            var vb1 = MemoryMarshal.Cast<double, Vector<double>>(b1[..n]);
            var vb2 = MemoryMarshal.Cast<double, Vector<double>>(b2[..n]);
            var vb3 = MemoryMarshal.Cast<double, Vector<double>>(b3[..n]);
            Vector<double> c00 = default, c01 = default, c02 = default, c03 = default;
            Vector<double> c10 = default, c11 = default, c12 = default, c13 = default;
            for (int v = 0; v < va0.Length; v++)
            {
                var x0 = va0[v]; var x1 = va1[v];
                var y = vb0[v]; c00 += x0 * y; c10 += x1 * y;
                y = vb1[v]; c01 += x0 * y; c11 += x1 * y;
                y = vb2[v]; c02 += x0 * y; c12 += x1 * y;
                y = vb3[v]; c03 += x0 * y; c13 += x1 * y;
            }
            s0 = new Quad(Vector.Sum(c00), Vector.Sum(c01), Vector.Sum(c02), Vector.Sum(c03));
            s1 = new Quad(Vector.Sum(c10), Vector.Sum(c11), Vector.Sum(c12), Vector.Sum(c13));
            t = va0.Length * w;
        }
        for (; t < n; t++)
        {
            s0.X += a0[t] * b0[t]; s0.Y += a0[t] * b1[t]; s0.Z += a0[t] * b2[t]; s0.W += a0[t] * b3[t];
            s1.X += a1[t] * b0[t]; s1.Y += a1[t] * b1[t]; s1.Z += a1[t] * b2[t]; s1.W += a1[t] * b3[t];
        }
    }

    /// <summary>Four sums.</summary>
    private struct Quad(double x, double y, double z, double w)
    {
        public double X = x, Y = y, Z = z, W = w;
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
