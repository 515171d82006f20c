namespace NetAdjust.LinearAlgebra.Sparse;

/// <summary>
/// The symbolic Cholesky analysis of C = P N Pᵀ: the fill-reducing permutation (made a postorder of the
/// elimination tree), the elimination tree, column counts, the supernodes and each supernode's row pattern.
/// Computed once per sparsity pattern and reused by every numeric factorisation on that pattern (Gauss-Newton
/// iterations, blunder-hunt rounds, re-weighting). Immutable and thread-safe.
/// </summary>
/// <remarks>
/// Davis 2006, <i>Direct Methods for Sparse Linear Systems</i>, ch. 4 (symbolic analysis: cs_schol); Liu 1990 for
/// the elimination tree and postorder; Liu, Ng &amp; Peyton 1993 for supernodes. Time O(nnz(L)), memory
/// O(nnz(N) + Σ supernode rows).
/// </remarks>
internal sealed class SymbolicCholesky
{
    /// <summary>Graph size (adjacency entries) from which the lower pattern is built on a second core.</summary>
    private const int ConcurrentPatternEntries = 200_000;

    private SymbolicCholesky() { }

    /// <summary>The order n of the matrix.</summary>
    public int Size { get; private init; }

    /// <summary>The permutation p: p[k] = original unknown eliminated k-th.</summary>
    public IReadOnlyList<int> Permutation => Perm;

    internal int[] Perm { get; private init; } = [];
    internal int[] InversePerm { get; private init; } = [];

    /// <summary>The elimination tree of C (parent of each column, −1 at a root), in permuted numbering.</summary>
    public IReadOnlyList<int> Parent => ParentArray;

    internal int[] ParentArray { get; private init; } = [];

    /// <summary>The number of nonzeros in each column of L (diagonal included), permuted numbering.</summary>
    public IReadOnlyList<int> ColumnCounts => Counts;

    internal int[] Counts { get; private init; } = [];

    /// <summary>nnz(L): the exact number of nonzeros of the factor, diagonal included (explicit zeros of amalgamated
    /// supernodes not counted).</summary>
    public long FactorNonZeros { get; private init; }

    /// <summary>The number of values stored for L, explicit zeros of amalgamated supernodes included.</summary>
    public long StoredEntries { get; private init; }

    /// <summary>The storage of a factor on this pattern that its owner no longer uses (<see
    /// cref="SparseCholeskyFactor.Recycle"/>), taken by the next numeric factorisation instead of fresh memory: a fresh
    /// array of this size is paged in on first touch, which cost about as much as the factorisation's arithmetic.
    /// </summary>
    private double[]? _spare;

    /// <summary>Offers the storage of a released factor for the next factorisation.</summary>
    internal void OfferSpare(double[] storage)
    {
        if (storage.LongLength == StoredEntries) Volatile.Write(ref _spare, storage);
    }

    /// <summary>Takes the spare storage, if any (each array is handed out once).</summary>
    internal double[]? TakeSpare() => Interlocked.Exchange(ref _spare, null);

    private SubtreeSchedule? _schedule;

    /// <summary>The split of the supernodal tree for a tree-level parallel factorisation on <paramref
    /// name="workers"/> cores, made once per pattern (and again only for another number of workers).</summary>
    internal SubtreeSchedule ScheduleFor(int workers)
    {
        var schedule = Volatile.Read(ref _schedule);
        if (schedule is null || schedule.Workers != workers)
        {
            schedule = SubtreeSchedule.Compute(this, workers);
            Volatile.Write(ref _schedule, schedule);
        }
        return schedule;
    }

    /// <summary>Floating-point operations of one numeric factorisation, Σ_j c_j² with c_j the column counts (Davis
    /// 2006, §4.6).</summary>
    public double FactorFlops { get; private init; }

    /// <summary>The number of supernodes.</summary>
    public int SupernodeCount => SnStart.Length - 1;

    /// <summary>The largest supernode row count (order of the largest frontal matrix).</summary>
    public int LargestFront { get; private init; }

    /// <summary>The name of the ordering that produced <see cref="Permutation"/>.</summary>
    public string OrderingName { get; private init; } = "";

    internal int[] SnStart { get; private init; } = [];      // first column of each supernode, n at the end
    internal int[] SnOf { get; private init; } = [];          // supernode of each column
    internal int[] SnParent { get; private init; } = [];      // supernodal elimination tree
    // rows of supernode s: SnRows[SnRowStart[s]..SnRowStart[s+1]]
    internal int[] SnRowStart { get; private init; } = [];
    internal int[] SnRows { get; private init; } = [];        // sorted; first the supernode's own columns
    internal long[] SnValueStart { get; private init; } = []; // offset of the m×k row-major block of s
    internal int[] SnChildHead { get; private init; } = [];   // first child of each supernode, −1 if none
    internal int[] SnChildNext { get; private init; } = [];   // next sibling

    /// <summary>Lower pattern of C (diagonal first, then sorted rows below it) by columns.</summary>
    internal ColumnPattern LowerC { get; private init; }

    /// <summary>Analyses the pattern of C = P N Pᵀ.</summary>
    /// <param name="graph">G(N).</param>
    /// <param name="ordering">A fill-reducing permutation p of the unknowns (p[k] = unknown placed k-th).</param>
    /// <param name="orderingName">A name for reports.</param>
    /// <exception cref="ArgumentException">When the ordering is not a permutation of the graph's vertices.</exception>
    public static SymbolicCholesky Analyze(AdjacencyGraph graph, IReadOnlyList<int> ordering,
        string orderingName = "given")
    {
        int n = graph.VertexCount;
        if (ordering.Count != n)
            throw new ArgumentException($"the ordering has {ordering.Count} entries for {n} unknowns");
        var perm0 = ordering.ToArray();
        var iperm0 = LinearAlgebra.Sparse.Permutation.Invert(perm0);

        // Elimination tree of the given order, then renumber in its postorder (same fill, contiguous subtrees).
        var upper0 = ColumnPattern.FromGraph(graph, perm0, iperm0, lower: false);
        var parent0 = EliminationTree.Compute(upper0);
        var post = TreePostorder.Compute(parent0);
        var perm = LinearAlgebra.Sparse.Permutation.Compose(perm0, post);
        var iperm = LinearAlgebra.Sparse.Permutation.Invert(perm);
        // The lower pattern (needed from the row patterns on) is made on another core meanwhile for large graphs.
        var lowerTask = graph.Adjacent.Length >= ConcurrentPatternEntries && Environment.ProcessorCount > 1
            ? Task.Run(() => ColumnPattern.FromGraph(graph, perm, iperm, lower: true))
            : null;
        var upper = ColumnPattern.FromGraph(graph, perm, iperm, lower: false);
        // A postorder is an equivalent reordering: the tree of the renumbered matrix is the same tree, renumbered
        // (Liu 1990), so it is relabelled instead of computed again (checked against a fresh computation in the
        // tests).
        var post1 = LinearAlgebra.Sparse.Permutation.Invert(post);
        var parent = new int[n];
        for (int k = 0; k < n; k++)
        {
            int p0 = parent0[post[k]];
            parent[k] = p0 < 0 ? -1 : post1[p0];
        }
        var counts = LinearAlgebra.Sparse.ColumnCounts.Compute(upper, parent);
        var lower = lowerTask?.GetAwaiter().GetResult() ?? ColumnPattern.FromGraph(graph, perm, iperm, lower: true);

        long nnz = 0;
        double flops = 0;
        foreach (int c in counts) { nnz += c; flops += (double)c * c; }

        var snStart = SupernodePartition.Compute(parent, counts);
        int ns = snStart.Length - 1;
        var snOf = new int[n];
        for (int s = 0; s < ns; s++) for (int j = snStart[s]; j < snStart[s + 1]; j++) snOf[j] = s;
        var snParent = new int[ns];
        for (int s = 0; s < ns; s++)
        {
            int p = parent[snStart[s + 1] - 1];
            snParent[s] = p < 0 ? -1 : snOf[p];
        }

        // Row patterns: own columns ∪ rows of C below them ∪ rows of the children beyond their columns.
        var childHead = new int[ns];
        var childNext = new int[ns];
        Array.Fill(childHead, -1);
        for (int s = ns - 1; s >= 0; s--)
            if (snParent[s] >= 0) { childNext[s] = childHead[snParent[s]]; childHead[snParent[s]] = s; }
        var rowStart = new int[ns + 1];
        var rows = new List<int>(n * 4);
        var mark = new int[n];
        Array.Fill(mark, -1);
        var buffer = new List<int>();
        long stored = 0;
        int largest = 0;
        var valueStart = new long[ns + 1];
        for (int s = 0; s < ns; s++)
        {
            int f = snStart[s], l = snStart[s + 1] - 1;
            buffer.Clear();
            for (int j = f; j <= l; j++) { mark[j] = s; }
            for (int j = f; j <= l; j++)
                foreach (int i in lower.Rows(j))
                    if (i > l && mark[i] != s) { mark[i] = s; buffer.Add(i); }
            for (int c = childHead[s]; c >= 0; c = childNext[c])
                for (int t = rowStart[c]; t < rowStart[c + 1]; t++)
                {
                    int i = rows[t];
                    if (i > l && mark[i] != s) { mark[i] = s; buffer.Add(i); }
                }
            buffer.Sort();
            rowStart[s] = rows.Count;
            for (int j = f; j <= l; j++) rows.Add(j);
            rows.AddRange(buffer);
            rowStart[s + 1] = rows.Count;
            int m = rowStart[s + 1] - rowStart[s], k = l - f + 1;
            largest = Math.Max(largest, m);
            valueStart[s] = stored;
            stored += (long)m * k;
        }
        valueStart[ns] = stored;
        if (stored > Array.MaxLength)
            throw new InvalidOperationException(
                $"The factor would need {stored} stored values, more than one array can hold; the network is too " +
                $"large for this engine.");

        return new SymbolicCholesky
        {
            Size = n, Perm = perm, InversePerm = iperm, ParentArray = parent, Counts = counts,
            FactorNonZeros = nnz, FactorFlops = flops, StoredEntries = stored, LargestFront = largest,
            OrderingName = orderingName, SnStart = snStart, SnOf = snOf, SnParent = snParent,
            SnRowStart = rowStart, SnRows = rows.ToArray(), SnValueStart = valueStart, LowerC = lower,
            SnChildHead = childHead, SnChildNext = childNext,
        };
    }

    /// <summary>Counts nnz(L) for an ordering without building supernodes (to compare orderings by fill).</summary>
    /// <param name="graph">G(N).</param>
    /// <param name="ordering">The permutation.</param>
    /// <returns>nnz(L), diagonal included.</returns>
    public static long CountFill(AdjacencyGraph graph, IReadOnlyList<int> ordering)
    {
        var perm = ordering.ToArray();
        var iperm = LinearAlgebra.Sparse.Permutation.Invert(perm);
        var upper = ColumnPattern.FromGraph(graph, perm, iperm, lower: false);
        var parent = EliminationTree.Compute(upper);
        long nnz = 0;
        foreach (int c in LinearAlgebra.Sparse.ColumnCounts.Compute(upper, parent)) nnz += c;
        return nnz;
    }

    /// <summary>True when L(i, j) of the permuted factor is stored (i ≥ j, permuted numbering).</summary>
    internal bool TryLocate(int i, int j, out long offset)
    {
        int s = SnOf[j];
        int f = SnStart[s], k = SnStart[s + 1] - f;
        int pos;
        if (i < SnStart[s + 1]) pos = i - f;
        else
        {
            // binary search of i among the sorted rows below the supernode's own columns
            var rows = SnRows;
            int r0 = SnRowStart[s], lo = r0 + k, hi = SnRowStart[s + 1] - 1;
            pos = -1;
            while (lo <= hi)
            {
                int mid = (int)((uint)(lo + hi) >> 1);
                int v = rows[mid];
                if (v == i) { pos = mid - r0; break; }
                if (v < i) lo = mid + 1;
                else hi = mid - 1;
            }
            if (pos < 0) { offset = -1; return false; }
        }
        offset = SnValueStart[s] + ((long)pos * k) + (j - f);
        return true;
    }
}
