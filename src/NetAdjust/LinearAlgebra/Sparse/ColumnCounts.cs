namespace NetAdjust.LinearAlgebra.Sparse;

/// <summary>
/// The number of nonzeros in each column of the Cholesky factor L (diagonal included), from the row subtrees:
/// the pattern of row k of L is the set of nodes reached walking up the elimination tree from each i with
/// C(i, k) ≠ 0, i &lt; k, stopping at k or a node already reached.
/// </summary>
/// <remarks>
/// Row-subtree characterisation: Liu 1990, §3.2; Davis 2006, §4.2 (cs_ereach). O(nnz(L)) time, O(n) extra
/// memory. (Gilbert, Ng &amp; Peyton 1994 count in O(nnz(C) α) without visiting L; here the visit is cheap beside
/// the numeric work.)
/// </remarks>
internal static class ColumnCounts
{
    /// <summary>Counts per column of L.</summary>
    /// <param name="upper">Strictly upper pattern of C by columns.</param>
    /// <param name="parent">The elimination tree.</param>
    [System.Runtime.CompilerServices.MethodImpl(
        System.Runtime.CompilerServices.MethodImplOptions.AggressiveOptimization)]
    public static int[] Compute(ColumnPattern upper, int[] parent)
    {
        int n = parent.Length;
        var count = new int[n];
        var mark = new int[n];
        Array.Fill(mark, -1);
        for (int k = 0; k < n; k++)
        {
            mark[k] = k;
            count[k]++; // L(k, k)
            foreach (int i0 in upper.Rows(k))
                for (int i = i0; mark[i] != k; i = parent[i])
                {
                    mark[i] = k;
                    count[i]++; // L(k, i) ≠ 0
                }
        }
        return count;
    }
}
