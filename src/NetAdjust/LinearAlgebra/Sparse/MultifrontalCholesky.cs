using System.Buffers;

namespace NetAdjust.LinearAlgebra.Sparse;

/// <summary>
/// Numeric supernodal Cholesky factorisation C_s = L Lᵀ of the Jacobi-scaled matrix C_s = S C S
/// (S = diag(1/√C_kk)), by the multifrontal method: supernodes in postorder; each assembles its columns of C and
/// the update matrices of its children (extend-add), factorises its k pivot columns densely (L₁₁ L₁₁ᵀ = F₁₁,
/// L₂₁ = F₂₁ L₁₁⁻ᵀ) and passes U = F₂₂ − L₂₁ L₂₁ᵀ to its parent. Independent subtrees run on separate cores
/// (<see cref="SubtreeSchedule"/>); the large fronts above them run their row loops on all cores.
/// </summary>
/// <remarks>
/// Duff &amp; Reid 1983, "The multifrontal solution of indefinite sparse symmetric linear equations", ACM TOMS
/// 9(3):302–325; Liu 1992, "The multifrontal method for sparse matrix solution: theory and practice", SIAM Review
/// 34(1):82–109; Davis 2006, §4.6 and §9.3. Failure contract as the dense path: a scaled pivot at or below
/// <see cref="DenseNormalEquationsSolver.PivotTolerance"/> throws <see cref="SingularNormalMatrixException"/>
/// naming the original column. Work Σ_j c_j² flops, memory nnz(L) plus the live update matrices.
/// </remarks>
internal static class MultifrontalCholesky
{
    private const double ParallelWork = 4e5; // flops above which a front's loops run in parallel

    /// <summary>Estimated work (Σ k·m² over the fronts) above which independent subtrees are factorised
    /// concurrently (<see cref="SubtreeSchedule"/>); below it the thread hand-over costs more than it saves.</summary>
    internal const double TreeParallelWork = 2e6;

    /// <summary>Factorises; returns the supernodal values of L and the scale S.</summary>
    public static (double[] L, double[] Scale) Factorize(SymbolicCholesky sym, double[] lowerValues) =>
        Factorize(sym, lowerValues, Environment.ProcessorCount, TreeParallelWork);

    /// <summary>Factorises with independent subtrees on up to <paramref name="workers"/> threads when the
    /// estimated work reaches <paramref name="minimumWork"/> and the split shortens the critical path; the result
    /// is bit-identical to the sequential factorisation (each front computed with the same arithmetic, its
    /// children extend-added in the same order).</summary>
    /// <param name="sym">The analysis.</param>
    /// <param name="lowerValues">The lower triangle of C on the analysis's pattern.</param>
    /// <param name="workers">Threads for the independent subtrees.</param>
    /// <param name="minimumWork">Estimated work below which the subtrees go on one thread.</param>
    /// <param name="rowsInParallel">Let the large fronts above the subtrees share their row loops among the cores
    /// (null: when there is more than one; the factor is the same either way).</param>
    internal static (double[] L, double[] Scale) Factorize(SymbolicCholesky sym, double[] lowerValues, int workers,
        double minimumWork, bool? rowsInParallel = null)
    {
        int n = sym.Size;
        var lower = sym.LowerC;
        var scale = new double[n];
        for (int k = 0; k < n; k++)
        {
            double d = lower.Index.Length > 0 ? lowerValues[lower.Start[k]] : 0; // diagonal first
            if (!(d > 0) || !double.IsFinite(d)) throw new SingularNormalMatrixException(sym.Perm[k]);
            scale[k] = 1.0 / Math.Sqrt(d);
        }

        // Each front's block is cleared just before its assembly (cache-warm), not the whole array up front.
        // (a released factor's storage is reused: every entry is written below, so nothing of it survives)
        var L = sym.TakeSpare() ?? GC.AllocateUninitializedArray<double>(checked((int)sym.StoredEntries));
        int ns = sym.SupernodeCount;
        var updates = new double[]?[ns];
        bool rowsParallel = rowsInParallel ?? Environment.ProcessorCount > 1;

        var schedule = workers > 1 && ns > 1 ? sym.ScheduleFor(workers) : null;
        if (schedule is null || !schedule.Worthwhile(minimumWork))
        {
            var scratch = new FrontScratch(n, sym.LargestFront);
            for (int s = 0; s < ns; s++) FactorFront(sym, s, lowerValues, scale, L, updates, scratch, rowsParallel);
            return (L, scale);
        }

        try
        {
            // the subtrees concurrently, each worker taking the heaviest left, each front's own loops sequential
            schedule.ForEachSubtree(() =>
            {
                var scratch = new FrontScratch(n, sym.LargestFront);
                return (first, root) =>
                {
                    for (int s = first; s <= root; s++)
                        FactorFront(sym, s, lowerValues, scale, L, updates, scratch, rowsInParallel: false);
                };
            });
        }
        catch (AggregateException e)
        {
            foreach (var inner in e.InnerExceptions)
                if (inner is not SingularNormalMatrixException)
                    System.Runtime.ExceptionServices.ExceptionDispatchInfo.Capture(inner).Throw();
            // A singular pivot: the sequential order decides which column is named, so factorise again in it
            // (every front is cleared before its assembly; the update matrices left behind are garbage).
            Array.Clear(updates);
            var again = new FrontScratch(n, sym.LargestFront);
            for (int s = 0; s < ns; s++) FactorFront(sym, s, lowerValues, scale, L, updates, again, rowsParallel);
            return (L, scale);
        }
        var topScratch = new FrontScratch(n, sym.LargestFront);
        foreach (int s in schedule.Top) FactorFront(sym, s, lowerValues, scale, L, updates, topScratch, rowsParallel);
        return (L, scale);
    }

    /// <summary>Scratch of one thread: the position of each row in the current front, and a child's row map.
    /// </summary>
    private sealed class FrontScratch(int n, int largestFront)
    {
        public readonly int[] RelPos = new int[n];
        public readonly int[] RowMap = new int[largestFront];
    }

    /// <summary>Assembles front s (its columns of C_s and its children's update matrices), factorises its pivot
    /// columns and leaves its own update matrix in <paramref name="updates"/>.</summary>
    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    private static void FactorFront(SymbolicCholesky sym, int s, double[] lowerValues, double[] scale, double[] L,
        double[]?[] updates, FrontScratch scratch, bool rowsInParallel)
    {
        var lower = sym.LowerC;
        var relpos = scratch.RelPos;
        var pool = ArrayPool<double>.Shared;
        int f = sym.SnStart[s], k = sym.SnStart[s + 1] - f;
        int r0 = sym.SnRowStart[s], m = sym.SnRowStart[s + 1] - r0, mu = m - k;
        long off = sym.SnValueStart[s];
        for (int t = 0; t < m; t++) relpos[sym.SnRows[r0 + t]] = t;
        L.AsSpan((int)off, m * k).Clear();

        // Update matrix of this front (lower, row-major mu×mu), zeroed.
        double[]? U = null;
        if (mu > 0) { U = pool.Rent(mu * mu); Array.Clear(U, 0, mu * mu); }

        // Assemble the columns of C_s.
        for (int c = 0; c < k; c++)
        {
            int j = f + c;
            double sj = scale[j];
            for (int p = lower.Start[j]; p < lower.Start[j + 1]; p++)
            {
                int i = lower.Index[p];
                L[off + ((long)relpos[i] * k) + c] += lowerValues[p] * sj * scale[i];
            }
        }

        // Extend-add the children's update matrices.
        ExtendAddChildren(sym, s, updates, relpos, L, off, k, U, mu, scratch.RowMap, pool);

        // Dense partial factorisation of the front.
        FactorPivotBlock(sym, L, off, k, f, rowsInParallel);
        SolveOffDiagonal(L, off, k, m, rowsInParallel);
        if (mu > 0) DenseUpdate(L, off, k, U!, mu, rowsInParallel);
        updates[s] = U;
    }

    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    private static void ExtendAddChildren(SymbolicCholesky sym, int s, double[]?[] updates, int[] relpos, double[] L,
        long off, int k,
        double[]? U, int mu, int[] rowMap, ArrayPool<double> pool)
    {
        for (int c = sym.SnChildHead[s]; c >= 0; c = sym.SnChildNext[c])
        {
            {
                var Uc = updates[c]!;
                int kc = sym.SnStart[c + 1] - sym.SnStart[c];
                int rc = sym.SnRowStart[c], mc = sym.SnRowStart[c + 1] - rc, muc = mc - kc;
                for (int a = 0; a < muc; a++) rowMap[a] = relpos[sym.SnRows[rc + kc + a]];
                // rowMap ascends (both row lists are sorted): rows [0, split) of Uc fall in the pivot block, the rest
                // in the update matrix; each entry still receives one addition, in the same order as before.
                int split = 0;
                while (split < muc && rowMap[split] < k) split++;
                var ls = L.AsSpan();
                for (int a = 0; a < split; a++)
                {
                    // row inside the pivot block: every column b ≤ a also maps below k
                    var lrow = ls.Slice((int)(off + ((long)rowMap[a] * k)), k);
                    var urow = Uc.AsSpan(a * muc, a + 1);
                    for (int b = 0; b < urow.Length; b++) lrow[rowMap[b]] += urow[b];
                }
                for (int a = split; a < muc; a++)
                {
                    int pa = rowMap[a];
                    var lrow = ls.Slice((int)(off + ((long)pa * k)), k);
                    var uc = Uc.AsSpan(a * muc, a + 1);
                    for (int b = 0; b < split; b++) lrow[rowMap[b]] += uc[b];
                    var urow = U.AsSpan((pa - k) * mu, mu);
                    for (int b = split; b < uc.Length; b++) urow[rowMap[b] - k] += uc[b];
                }
                pool.Return(Uc);
                updates[c] = null;
            }
        }
    }

    /// <summary>Pivot blocks of at least this many columns are factorised with their rows on all cores
    /// (<see cref="FactorPivotBlock"/>).</summary>
    internal const int ParallelPivotColumns = 192;

    /// <summary>Rows of a pivot block computed by one thread before the rows below them go on all cores.</summary>
    private const int PivotPanel = 48;

    /// <summary>
    /// L₁₁ L₁₁ᵀ = F₁₁ in place (rows 0..k−1 of the block, row length k): row-oriented Cholesky, each entry
    /// L(i, c) = (F(i, c) − Σ_{t&lt;c} L(i, t) L(c, t)) / L(c, c) with one dot product over t &lt; c.
    /// </summary>
    /// <remarks>
    /// A wide block (the top separators of a large network: thousands of columns, alone at the root of the tree)
    /// goes by panels of columns when its rows may run in parallel: the rows of a panel are finished on one thread
    /// (their entries right of the panel's start and their pivots, in order), then every row below them takes the
    /// panel's columns on all cores; each row needs only the finished rows above it and its own entries to the left.
    /// Every entry is the same dot product as in the one-thread order: the factor is bit for bit the same.
    /// </remarks>
    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    private static void FactorPivotBlock(SymbolicCholesky sym, double[] L, long off, int k, int f, bool rowsInParallel)
    {
        if (!rowsInParallel || k < ParallelPivotColumns)
        {
            for (int i = 0; i < k; i++) PivotRow(sym, L, off, k, f, i, 0);
            return;
        }
        int parts = Environment.ProcessorCount * 4;
        for (int b = 0; b < k; b += PivotPanel)
        {
            int e = Math.Min(b + PivotPanel, k);
            for (int i = b; i < e; i++) PivotRow(sym, L, off, k, f, i, b);
            int below = k - e;
            if (below == 0) break;
            if ((double)below * (e - b) * e < ParallelWork) { PanelColumns(L, off, k, b, e, e, k); continue; }
            int p = Math.Min(parts, below);
            Parallel.For(0, p, q =>
                PanelColumns(L, off, k, b, e, e + (int)((long)below * q / p), e + (int)((long)below * (q + 1) / p)));
        }
    }

    /// <summary>Row i of the pivot block from column <paramref name="from"/> on: its entries left of the
    /// diagonal, then its pivot.</summary>
    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    private static void PivotRow(SymbolicCholesky sym, double[] L, long off, int k, int f, int i, int from)
    {
        var ls = L.AsSpan();
        var ri = ls.Slice((int)(off + ((long)i * k)), k);
        for (int c = from; c < i; c++)
        {
            var rc = ls.Slice((int)(off + ((long)c * k)), k);
            ri[c] = (ri[c] - DenseKernels.Dot(ri, rc, c)) / rc[c];
        }
        double d = ri[i] - DenseKernels.Dot(ri, ri, i);
        if (!(d > DenseNormalEquationsSolver.PivotTolerance))
            throw new SingularNormalMatrixException(sym.Perm[f + i]);
        ri[i] = Math.Sqrt(d);
    }

    /// <summary>Columns [c0, c1) of the front's rows [i0, i1), all below the finished rows c0..c1−1 (a panel of the
    /// pivot block, or the whole of L₁₁ for the rows of L₂₁), two rows at once with the arithmetic of
    /// <see cref="PivotRow"/>.</summary>
    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    private static void PanelColumns(double[] L, long off, int k, int c0, int c1, int i0, int i1)
    {
        var ls = L.AsSpan();
        int i = i0;
        for (; i + 1 < i1; i += 2)
        {
            var ri0 = ls.Slice((int)(off + ((long)i * k)), k);
            var ri1 = ls.Slice((int)(off + ((long)(i + 1) * k)), k);
            for (int c = c0; c < c1; c++)
            {
                var rc = ls.Slice((int)(off + ((long)c * k)), k);
                DenseKernels.Dot1x2Exact(rc, ri0, ri1, c, out double d0, out double d1);
                ri0[c] = (ri0[c] - d0) / rc[c];
                ri1[c] = (ri1[c] - d1) / rc[c];
            }
        }
        for (; i < i1; i++)
        {
            var ri = ls.Slice((int)(off + ((long)i * k)), k);
            for (int c = c0; c < c1; c++)
            {
                var rc = ls.Slice((int)(off + ((long)c * k)), k);
                ri[c] = (ri[c] - DenseKernels.Dot(ri, rc, c)) / rc[c];
            }
        }
    }

    /// <summary>L₂₁ = F₂₁ L₁₁⁻ᵀ, row by row (each row solves x L₁₁ᵀ = f by forward substitution).</summary>
    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    private static void SolveOffDiagonal(double[] L, long off, int k, int m, bool rowsInParallel)
    {
        int rows = m - k;
        if (rows == 0) return;
        double work = (double)rows * k * k;
        if (work < ParallelWork || !rowsInParallel) { PanelColumns(L, off, k, 0, k, k, m); return; }
        int parts = Math.Min(Environment.ProcessorCount * 4, rows);
        Parallel.For(0, parts, p => PanelColumns(L, off, k, 0, k,
            k + (int)((long)rows * p / parts), k + (int)((long)rows * (p + 1) / parts)));
    }

    /// <summary>U −= L₂₁ L₂₁ᵀ (lower triangle).</summary>
    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    private static void DenseUpdate(double[] L, long off, int k, double[] U, int mu, bool rowsInParallel)
    {
        double work = (double)mu * mu * k;
        if (work < ParallelWork || !rowsInParallel)
        {
            DenseKernels.SyrkLowerRows(L, off, k, k, U, mu, 0, mu); return;
        }
        int parts = Math.Min(Environment.ProcessorCount * 4, mu);
        var cuts = DenseKernels.BalancedTriangleSplit(mu, parts);
        Parallel.For(0, parts, p =>
        {
            DenseKernels.SyrkLowerRows(L, off, k, k, U, mu, cuts[p], cuts[p + 1]);
        });
    }
}
