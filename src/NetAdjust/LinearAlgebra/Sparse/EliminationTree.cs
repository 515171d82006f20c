namespace NetAdjust.LinearAlgebra.Sparse;

/// <summary>
/// The elimination tree of a symmetric matrix C: parent(j) = min{ i &gt; j : L(i, j) ≠ 0 }, or −1 at a root.
/// </summary>
/// <remarks>
/// Liu 1990, "The role of elimination trees in sparse factorization", SIAM J. Matrix Anal. Appl. 11(1):134–172,
/// algorithm with path compression through virtual ancestors; Davis 2006, <i>Direct Methods for Sparse Linear
/// Systems</i>, §4.1 (cs_etree). O(nnz(C) α(n)) time.
/// </remarks>
internal static class EliminationTree
{
    /// <summary>The parent of each column.</summary>
    /// <param name="upper">The strictly upper pattern by columns: upper.Rows(k) = { i &lt; k : C(i, k) ≠ 0 }.</param>
    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    public static int[] Compute(ColumnPattern upper)
    {
        int n = upper.Count;
        var parent = new int[n];
        var ancestor = new int[n];
        for (int k = 0; k < n; k++)
        {
            parent[k] = -1;
            ancestor[k] = -1;
            foreach (int i0 in upper.Rows(k))
            {
                // Walk from i to the root of its current subtree, compressing the path onto k.
                for (int i = i0; i != -1 && i < k;)
                {
                    int next = ancestor[i];
                    ancestor[i] = k;
                    if (next == -1) { parent[i] = k; break; }
                    i = next;
                }
            }
        }
        return parent;
    }
}

/// <summary>A compressed column pattern: for each column, a list of row indices.</summary>
/// <param name="Start">Start[k]..Start[k+1] delimit column k in <paramref name="Index"/>.</param>
/// <param name="Index">Row indices.</param>
internal readonly record struct ColumnPattern(int[] Start, int[] Index)
{
    /// <summary>The number of columns.</summary>
    public int Count => Start.Length - 1;

    /// <summary>The rows of column k.</summary>
    public ReadOnlySpan<int> Rows(int k) => Index.AsSpan(Start[k], Start[k + 1] - Start[k]);

    /// <summary>
    /// The strictly upper (or, with <paramref name="lower"/>, lower including the diagonal, sorted) pattern of
    /// C = P N Pᵀ from the graph of N and the inverse permutation q.
    /// </summary>
    public static ColumnPattern FromGraph(AdjacencyGraph g, int[] perm, int[] inverse, bool lower)
    {
        int n = g.VertexCount;
        var start = new int[n + 1];
        for (int k = 0; k < n; k++)
        {
            int c = lower ? 1 : 0;
            foreach (int w in g.Neighbours(perm[k]))
                if (lower ? inverse[w] > k : inverse[w] < k) c++;
            start[k + 1] = start[k] + c;
        }
        var index = new int[start[n]];
        for (int k = 0; k < n; k++)
        {
            int at = start[k];
            if (lower) index[at++] = k;
            foreach (int w in g.Neighbours(perm[k]))
            {
                int i = inverse[w];
                if (lower ? i > k : i < k) index[at++] = i;
            }
            if (lower) Array.Sort(index, start[k] + 1, start[k + 1] - start[k] - 1);
        }
        return new ColumnPattern(start, index);
    }
}
