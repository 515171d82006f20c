namespace NetAdjust.LinearAlgebra.Sparse;

/// <summary>
/// Selected inversion: the entries of Z = C_s⁻¹ on the pattern of its Cholesky factor L, without forming the
/// inverse. Supernodes are visited from the root down; for supernode J with off-diagonal rows R
/// (Y = L_RJ L_JJ⁻¹):
/// Z_RJ = −Z_RR Y and Z_JJ = L_JJ⁻ᵀ L_JJ⁻¹ − Yᵀ Z_RJ, where Z_RR lies on the pattern already computed, because
/// R is a clique of the filled graph.
/// </summary>
/// <remarks>
/// Takahashi, Fagan &amp; Chin 1973, "Formation of a sparse bus impedance matrix and its application to short
/// circuit study", Proc. 8th PICA Conf.; Erisman &amp; Tinney 1975, "On computing certain elements of the inverse
/// of a sparse matrix", Comm. ACM 18(3):177–179; the supernodal block form of Lin, Yang, Meza, Lu, Ying &amp; E 2011,
/// "SelInv — an algorithm for selected inversion of a sparse symmetric matrix", ACM TOMS 37(4):40. Work of the same
/// order as the factorisation; memory one more copy of L, or none when Z overwrites L (scratch of one block).
/// </remarks>
internal static class SelectedInversion
{
    /// <summary>Below this much estimated work (<see cref="SubtreeSchedule.TotalWork"/>) the supernodes are visited
    /// on one thread.</summary>
    internal const double TreeParallelWork = 2e7;

    /// <summary>Z on the supernodal layout of L (rows 0..k−1 of each block: Z_JJ, full; rows k..m−1: Z_RJ), in a
    /// new array; L is left as it is.</summary>
    public static double[] Compute(SymbolicCholesky sym, double[] L) => Compute(sym, L, inPlace: false, threads: 0);

    /// <summary>
    /// Z on the supernodal layout of L. With <paramref name="inPlace"/>, Z overwrites L block by block (each
    /// supernode's block of L is copied to scratch before its Z is written: the supernodes still to come read only
    /// the Z of their ancestors) and the returned array is L itself. With two or more threads, the subtrees below
    /// the top of the supernodal tree go down concurrently, each supernode computed by the same code as on one
    /// thread: every entry is bit for bit the same whatever the schedule.
    /// </summary>
    /// <param name="sym">The analysis.</param>
    /// <param name="L">The factor's values.</param>
    /// <param name="inPlace">Overwrite L with Z.</param>
    /// <param name="threads">Threads for the tree level (0: the processor count; 1: one thread).</param>
    /// <param name="parallelWork">Estimated flops below which one thread does it all.</param>
    /// <param name="innerLoops">Let the large supernodes at the top of the tree share their own loops among the
    /// cores (false: each supernode on one thread; the entries are the same either way).</param>
    internal static double[] Compute(SymbolicCholesky sym, double[] L, bool inPlace, int threads,
        double parallelWork = TreeParallelWork, bool innerLoops = true)
    {
        // every entry is written below
        var Z = inPlace ? L : GC.AllocateUninitializedArray<double>(L.Length);
        if (threads <= 0) threads = Environment.ProcessorCount;
        // the split of the factorisation (SubtreeSchedule): the top part first, parents before children, then the
        // subtrees, taken heaviest first by the workers as they come free, each from its root down (in postorder a
        // subtree is first..root, so descending order visits parents before children; any such order gives the
        // same entries)
        var schedule = threads >= 2 && sym.SupernodeCount > 1 ? sym.ScheduleFor(threads) : null;
        if (schedule is null || !schedule.Worthwhile(parallelWork))
        {
            for (int s = sym.SupernodeCount - 1; s >= 0; s--) Supernode(sym, L, Z, s, inPlace, innerLoops);
            return Z;
        }
        for (int t = schedule.Top.Length - 1; t >= 0; t--)
            Supernode(sym, L, Z, schedule.Top[t], inPlace, innerLoops);
        schedule.ForEachSubtree(() => (first, root) =>
        {
            for (int s = root; s >= first; s--) Supernode(sym, L, Z, s, inPlace, innerParallel: false);
        });
        return Z;
    }

    /// <summary>Z_J of supernode <paramref name="s"/> from its block of L and the Z of its ancestors.</summary>
    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    private static void Supernode(SymbolicCholesky sym, double[] Lall, double[] Z, int s, bool inPlace,
        bool innerParallel)
    {
        var pool = System.Buffers.ArrayPool<double>.Shared;
        int f = sym.SnStart[s], k = sym.SnStart[s + 1] - f;
        int r0 = sym.SnRowStart[s], m = sym.SnRowStart[s + 1] - r0, mu = m - k;
        long off = sym.SnValueStart[s];
        // The block's L: read where it lies, or from a scratch copy when Z is to overwrite it.
        double[] L = Lall;
        long lo0 = off;
        double[]? copy = null;
        if (inPlace)
        {
            copy = pool.Rent(m * k);
            Array.Copy(Lall, off, copy, 0, (long)m * k);
            L = copy;
            lo0 = 0;
        }

        // T = L_JJ⁻ᵀ stored row-major: T(c, d) = (L_JJ⁻¹)(d, c), nonzero for d ≥ c. Rows of T are independent, as are
        // the rows of Z_JJ below; a wide block (the separators at the top of the tree) shares them among the cores.
        var T = pool.Rent(k * k);
        bool wide = innerParallel && k >= WideColumns;
        ForChunks((k + 3) / 4, wide, q => InverseRows(L, lo0, k, T, 4 * q, Math.Min(4 * q + 4, k)));

        // Z_JJ ← (L_JJ Lᵀ_JJ)⁻¹ = L_JJ⁻ᵀ L_JJ⁻¹: entry (c, d) = Σ_e T(c, e) T(d, e).
        ForChunks(k, wide, c =>
        {
            for (int d = 0; d <= c; d++)
            {
                double v = DenseKernels.Dot(T.AsSpan((c * k) + c, k - c), T.AsSpan((d * k) + c, k - c), k - c);
                Z[off + ((long)c * k) + d] = v;
                Z[off + ((long)d * k) + c] = v;
            }
        });
        if (mu == 0)
        {
            pool.Return(T);
            if (copy is not null) pool.Return(copy);
            return;
        }

        // Yᵀ (k×mu, row-major) with Y = L_RJ L_JJ⁻¹: Y(a, c) = Σ_{d ≥ c} L(k+a, d) T(c, d).
        var Yt = pool.Rent(k * mu);
        bool large = innerParallel && (double)k * k * mu >= ParallelBlockWork;
        ForChunks(mu, large, a =>
        {
            var la = new ReadOnlySpan<double>(L, checked((int)(lo0 + ((long)(k + a) * k))), k);
            for (int c = 0; c < k; c++)
                Yt[(c * mu) + a] = DenseKernels.Dot(la[c..], T.AsSpan((c * k) + c, k - c), k - c);
        });
        if (copy is not null) { pool.Return(copy); copy = null; }

        // Z_RR gathered from the ancestors' blocks (symmetric, full).
        var zrr = GatherZrr(sym, Z, r0 + k, mu);

        // Z_RJ = −Z_RR Y, kept transposed: Zt(c, a) = −Σ_b Y(b, c) Z_RR(a, b).
        var Zt = pool.Rent(k * mu);
        void Rows(int lo, int hi)
        {
            // two rows of Z_RR by two columns of Y at a time, each product as DenseKernels.Dot computes it
            int a = lo;
            for (; a + 1 < hi; a += 2)
            {
                var za0 = zrr.AsSpan(a * mu, mu);
                var za1 = zrr.AsSpan((a + 1) * mu, mu);
                int c = 0;
                for (; c + 1 < k; c += 2)
                {
                    DenseKernels.Dot2x2Exact(Yt.AsSpan(c * mu, mu), Yt.AsSpan((c + 1) * mu, mu), za0, za1, mu,
                        out double s00, out double s01, out double s10, out double s11);
                    Zt[(c * mu) + a] = -s00; Zt[(c * mu) + a + 1] = -s01;
                    Zt[((c + 1) * mu) + a] = -s10; Zt[((c + 1) * mu) + a + 1] = -s11;
                }
                for (; c < k; c++)
                {
                    Zt[(c * mu) + a] = -DenseKernels.Dot(Yt.AsSpan(c * mu, mu), za0, mu);
                    Zt[(c * mu) + a + 1] = -DenseKernels.Dot(Yt.AsSpan(c * mu, mu), za1, mu);
                }
            }
            for (; a < hi; a++)
            {
                var za = zrr.AsSpan(a * mu, mu);
                for (int c = 0; c < k; c++) Zt[(c * mu) + a] = -DenseKernels.Dot(Yt.AsSpan(c * mu, mu), za, mu);
            }
        }
        if (!innerParallel || (double)mu * mu * k < 4e5 || Environment.ProcessorCount == 1) Rows(0, mu);
        else
        {
            int parts = Math.Min(Environment.ProcessorCount * 4, mu);
            Parallel.For(0, parts, p => Rows((int)((long)mu * p / parts), (int)((long)mu * (p + 1) / parts)));
        }
        for (int a = 0; a < mu; a++)
            for (int c = 0; c < k; c++) Z[off + ((long)(k + a) * k) + c] = Zt[(c * mu) + a];

        // Z_JJ −= Yᵀ Z_RJ: (c, d) −= Σ_a Y(a, c) Z_RJ(a, d), on the lower triangle (the only one read: by the
        // gathers of Z_RR and by look-ups of (row ≥ column)); the upper triangle is its mirror.
        ForChunks(k, large, c =>
        {
            for (int d = 0; d <= c; d++)
                Z[off + ((long)c * k) + d] -= DenseKernels.Dot(Yt.AsSpan(c * mu, mu), Zt.AsSpan(d * mu, mu), mu);
        });
        for (int c = 0; c < k; c++)
            for (int d = c + 1; d < k; d++) Z[off + ((long)c * k) + d] = Z[off + ((long)d * k) + c];
        pool.Return(T);
        pool.Return(Yt);
        pool.Return(Zt);
        pool.Return(zrr);
    }

    /// <summary>Supernodes of at least this many columns compute T and Z_JJ on all cores when their inner loops may
    /// run in parallel.</summary>
    internal const int WideColumns = 128;

    /// <summary>Work k²·mu of a supernode above which its Yᵀ and the update of its Z_JJ go on all cores when its inner
    /// loops may run in parallel.</summary>
    internal const double ParallelBlockWork = 4e6;

    /// <summary>body(0) .. body(count − 1), on all cores when <paramref name="parallel"/> (each index computes what
    /// it would on one thread: the order does not change any entry).</summary>
    private static void ForChunks(int count, bool parallel, Action<int> body)
    {
        if (!parallel) { for (int q = 0; q < count; q++) body(q); return; }
        Parallel.For(0, count, body);
    }

    /// <summary>
    /// Rows c0..c1−1 (at most four) of T = L_JJ⁻ᵀ: T(c, d) = 0 for d &lt; c, T(c, c) = 1 / L(c, c), and for d &gt; c
    /// T(c, d) = (−Σ_{e=c}^{d−1} L(d, e) T(c, e)) / L(d, d), each sum taken in ascending e. The four rows' sums run
    /// side by side (four independent chains of additions instead of one waiting on the last), each in its own order:
    /// the bits of the one-row loop.
    /// </summary>
    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    internal static void InverseRows(double[] L, long lo0, int k, double[] T, int c0, int c1)
    {
        for (int c = c0; c < c1; c++)
        {
            Array.Clear(T, c * k, c);
            T[(c * k) + c] = 1.0 / L[lo0 + ((long)c * k) + c];
        }
        if (c1 - c0 < 4)
        {
            for (int c = c0; c < c1; c++)
                for (int d = c + 1; d < k; d++)
                {
                    double v = 0;
                    for (int e = c; e < d; e++) v -= L[lo0 + ((long)d * k) + e] * T[(c * k) + e];
                    T[(c * k) + d] = v / L[lo0 + ((long)d * k) + d];
                }
            return;
        }
        var t0 = T.AsSpan(c0 * k, k);
        var t1 = T.AsSpan((c0 + 1) * k, k);
        var t2 = T.AsSpan((c0 + 2) * k, k);
        var t3 = T.AsSpan((c0 + 3) * k, k);
        for (int d = c0 + 1; d < k; d++)
        {
            var ld = new ReadOnlySpan<double>(L, checked((int)(lo0 + ((long)d * k))), k);
            double v0 = 0, v1 = 0, v2 = 0, v3 = 0;
            int e = c0;
            // row c0 + j sums from e = c0 + j
            for (; e < d && e < c0 + 3; e++)
            {
                double l = ld[e];
                v0 -= l * t0[e];
                if (e >= c0 + 1) v1 -= l * t1[e];
                if (e >= c0 + 2) v2 -= l * t2[e];
            }
            for (; e < d; e++)
            {
                double l = ld[e];
                v0 -= l * t0[e];
                v1 -= l * t1[e];
                v2 -= l * t2[e];
                v3 -= l * t3[e];
            }
            double ldd = ld[d];
            t0[d] = v0 / ldd;
            if (d > c0 + 1) t1[d] = v1 / ldd;
            if (d > c0 + 2) t2[d] = v2 / ldd;
            if (d > c0 + 3) t3[d] = v3 / ldd;
        }
    }

    /// <summary>The dense symmetric Z_RR for the sorted rows R = SnRows[rStart .. rStart + mu).</summary>
    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    private static double[] GatherZrr(SymbolicCholesky sym, double[] Z, int rStart, int mu)
    {
        var zrr = System.Buffers.ArrayPool<double>.Shared.Rent(mu * mu);
        var rows = sym.SnRows;
        int b0 = 0;
        while (b0 < mu)
        {
            // A run of columns R[b0..b1) in one supernode t.
            int t = sym.SnOf[rows[rStart + b0]];
            int ft = sym.SnStart[t], lt = sym.SnStart[t + 1] - 1, kt = lt - ft + 1;
            int b1 = b0;
            while (b1 < mu && rows[rStart + b1] <= lt) b1++;
            int tr0 = sym.SnRowStart[t], tm = sym.SnRowStart[t + 1] - tr0;
            long toff = sym.SnValueStart[t];
            int lo = 0;
            for (int a = b0; a < mu; a++)
            {
                int ra = rows[rStart + a];
                int pa;
                if (ra <= lt) pa = ra - ft;
                else
                {
                    int at = Array.BinarySearch(rows, tr0 + Math.Max(lo, kt), tm - Math.Max(lo, kt), ra);
                    if (at < 0)
                        throw new InvalidOperationException(
                            "selected inversion: a row of the clique is missing from an ancestor's pattern");
                    pa = at - tr0;
                    lo = pa + 1;
                }
                long zrow = toff + ((long)pa * kt);
                int bEnd = Math.Min(a + 1, b1);
                for (int b = b0; b < bEnd; b++)
                {
                    double v = Z[zrow + (rows[rStart + b] - ft)];
                    zrr[(a * mu) + b] = v;
                    zrr[(b * mu) + a] = v;
                }
            }
            b0 = b1;
        }
        return zrr;
    }
}
