using System.Runtime.InteropServices;

namespace NetAdjust.LinearAlgebra.Sparse;

/// <summary>
/// The adjacency graph G(N) of the normal matrix N = AᵀPA without forming N: unknowns i and j are adjacent
/// when they appear together in one design row or in two rows joined by one weight block. Compressed
/// (CSR-like) adjacency lists, sorted, without self loops.
/// </summary>
/// <remarks>
/// The graph model of symmetric Gaussian elimination: Davis 2006, <i>Direct Methods for Sparse Linear
/// Systems</i>, §4.1; George &amp; Liu 1981, <i>Computer Solution of Large Sparse Positive Definite Systems</i>, ch. 3.
/// Memory O(nnz(N)).
/// </remarks>
internal sealed class AdjacencyGraph
{
    /// <summary>Adjacency entries (duplicates included) from which the lists are cleaned on all cores.</summary>
    private const int ConcurrentEntries = 200_000;

    private AdjacencyGraph(int vertexCount, int[] start, int[] adjacent)
    {
        VertexCount = vertexCount; Start = start; Adjacent = adjacent;
    }

    /// <summary>The number of vertices (unknowns).</summary>
    public int VertexCount { get; }

    /// <summary>Start[v]..Start[v+1] delimit the neighbours of v in <see cref="Adjacent"/>.</summary>
    internal int[] Start { get; }

    /// <summary>The neighbours of all vertices, sorted per vertex.</summary>
    internal int[] Adjacent { get; }

    /// <summary>The number of edges (each counted once).</summary>
    public long EdgeCount => Adjacent.LongLength / 2;

    /// <summary>The neighbours of one vertex.</summary>
    /// <param name="v">The vertex.</param>
    public ReadOnlySpan<int> Neighbours(int v) => Adjacent.AsSpan(Start[v], Start[v + 1] - Start[v]);

    /// <summary>Builds G(AᵀPA).</summary>
    /// <param name="unknownCount">Number of unknowns (columns of A).</param>
    /// <param name="rows">The rows of A.</param>
    /// <param name="weights">The block-diagonal P.</param>
    public static AdjacencyGraph FromNormalEquations(int unknownCount, IReadOnlyList<SparseRow> rows,
        WeightMatrix weights)
    {
        // Cliques: one per weight block, its vertices the union of the block's rows' columns.
        var cliqueStart = new List<int>(weights.Blocks.Count + 1) { 0 };
        var cliqueVertices = new List<int>(rows.Count * 4);
        var mark = new int[unknownCount];
        Array.Fill(mark, -1);
        if (weights.BlockIsRow)
        {
            // a diagonal P kept as one array: block b is row b (the same cliques, without making each block)
            for (int b = 0; b < rows.Count; b++)
            {
                foreach (int c in rows[b].Columns)
                    if (mark[c] != b) { mark[c] = b; cliqueVertices.Add(c); }
                cliqueStart.Add(cliqueVertices.Count);
            }
            return FromCliques(unknownCount, cliqueStart, cliqueVertices);
        }
        for (int b = 0; b < weights.Blocks.Count; b++)
        {
            foreach (int r in weights.Blocks[b].Rows)
                foreach (int c in rows[r].Columns)
                    if (mark[c] != b) { mark[c] = b; cliqueVertices.Add(c); }
            cliqueStart.Add(cliqueVertices.Count);
        }
        return FromCliques(unknownCount, cliqueStart, cliqueVertices);
    }

    /// <summary>Builds a graph as the union of cliques (each clique given by its vertices).</summary>
    internal static AdjacencyGraph FromCliques(int n, List<int> cliqueStartList, List<int> cliqueVerticesList)
    {
        // Each clique of size s gives each of its vertices s − 1 entries (duplicates included), in the cliques'
        // order. A large graph runs ranges of the vertices on all cores: each part reads every clique and counts and
        // writes only its own vertices' entries, in the same order (the same lists whatever the split).
        bool concurrent = (long)cliqueVerticesList.Count * 4 >= ConcurrentEntries && Environment.ProcessorCount > 1 &&
            n >= 2;
        int ranges = concurrent ? Environment.ProcessorCount : 1;
        void InRanges(Func<int, int> bound, Action<int, int> run)
        {
            if (ranges == 1) run(0, n);
            else Parallel.For(0, ranges, r => run(bound(r), bound(r + 1)));
        }
        var degree = new int[n + 1];
        InRanges(r => (int)((long)n * r / ranges), (lo, hi) =>
        {
            var cliqueStart = CollectionsMarshal.AsSpan(cliqueStartList);
            var cliqueVertices = CollectionsMarshal.AsSpan(cliqueVerticesList);
            for (int q = 0; q + 1 < cliqueStart.Length; q++)
            {
                int size = cliqueStart[q + 1] - cliqueStart[q];
                for (int t = cliqueStart[q]; t < cliqueStart[q + 1]; t++)
                    if (cliqueVertices[t] >= lo && cliqueVertices[t] < hi) degree[cliqueVertices[t]] += size - 1;
            }
        });
        var start = new int[n + 1];
        for (int v = 0; v < n; v++) start[v + 1] = start[v] + degree[v];
        var fill = new int[n];
        Array.Copy(start, fill, n);
        var adj = new int[start[n]];
        // the ranges split at the vertices where the entries are evenly shared
        InRanges(r => r == 0 ? 0 : r == ranges ? n : LowerBound(start, (long)start[n] * r / ranges), (lo, hi) =>
        {
            var cliqueStart = CollectionsMarshal.AsSpan(cliqueStartList);
            var cliqueVertices = CollectionsMarshal.AsSpan(cliqueVerticesList);
            for (int q = 0; q + 1 < cliqueStart.Length; q++)
                for (int t = cliqueStart[q]; t < cliqueStart[q + 1]; t++)
                {
                    int v = cliqueVertices[t];
                    if (v < lo || v >= hi) continue;
                    for (int s = cliqueStart[q]; s < cliqueStart[q + 1]; s++)
                        if (s != t) adj[fill[v]++] = cliqueVertices[s];
                }
        });
        // Remove duplicates per vertex (a neighbour seen twice in one list) within the vertex's own segment, sort
        // the distinct neighbours, then close the gaps. The vertices are independent: large graphs run ranges of
        // them on all cores, each with its own marks (the same lists whatever the split).
        var kept = fill; // reused: the number of distinct neighbours of each vertex
        void Distinct(int lo, int hi, int[] seen)
        {
            for (int v = lo; v < hi; v++)
            {
                int a = start[v], e = start[v + 1], w = a;
                for (int p = a; p < e; p++)
                {
                    int u = adj[p];
                    if (seen[u] != v + 1) { seen[u] = v + 1; adj[w++] = u; }
                }
                Array.Sort(adj, a, w - a);
                kept[v] = w - a;
            }
        }
        if (start[n] < ConcurrentEntries || Environment.ProcessorCount == 1 || n < 2) Distinct(0, n, new int[n]);
        else
        {
            int parts = Math.Min(Environment.ProcessorCount * 4, n);
            Parallel.For(0, parts, () => new int[n],
                (part, _, seen) =>
                {
                    Distinct((int)((long)n * part / parts), (int)((long)n * (part + 1) / parts), seen);
                    return seen;
                }, _ => { });
        }
        var newStart = new int[n + 1];
        for (int v = 0; v < n; v++)
        {
            newStart[v + 1] = newStart[v] + kept[v];
            if (newStart[v] != start[v]) Array.Copy(adj, start[v], adj, newStart[v], kept[v]);
        }
        int total = newStart[n];
        Array.Resize(ref adj, total);
        return new AdjacencyGraph(n, newStart, adj);
    }

    /// <summary>The first vertex whose start is at least <paramref name="entry"/> (starts ascend).</summary>
    private static int LowerBound(int[] start, long entry)
    {
        int lo = 0, hi = start.Length - 1;
        while (lo < hi)
        {
            int mid = (lo + hi) >>> 1;
            if (start[mid] < entry) lo = mid + 1;
            else hi = mid;
        }
        return lo;
    }
}
