namespace NetAdjust.LinearAlgebra.Sparse;

/// <summary>
/// Geometric nested dissection: the groups of unknowns (one per point, with its sets' orientations) are split
/// recursively at the median of their longer extent; the groups of the smaller side that touch the other side
/// form a vertex separator, numbered after both halves. The unknowns of one group stay together.
/// </summary>
/// <remarks>
/// George 1973, "Nested dissection of a regular finite element mesh", SIAM J. Numer. Anal. 10(2):345–363, for
/// planar grids gives O(n log n) fill and O(n^1.5) work; the coordinate split follows the geometric variant
/// described in Davis 2006, <i>Direct Methods for Sparse Linear Systems</i>, §7.6. O(g log² g) time for g groups.
/// </remarks>
internal static class GeometricNestedDissection
{
    /// <summary>Groups at or below this count are numbered as they come.</summary>
    public const int LeafGroups = 12;

    /// <summary>Groups from which the two halves of the first split are ordered on two threads.</summary>
    internal const int ConcurrentGroups = 20_000;

    /// <summary>A fill-reducing permutation p (p[k] = unknown placed k-th).</summary>
    /// <param name="graph">G(N).</param>
    /// <param name="geometry">The unknowns' groups and positions; every group must have a position.</param>
    /// <exception cref="ArgumentException">When the geometry does not match the graph or lacks positions.</exception>
    public static int[] Order(AdjacencyGraph graph, UnknownGeometry geometry) => Order(graph, geometry, null);

    /// <summary>The same permutation, the two halves of the first split ordered concurrently or not (null: when
    /// there are two cores and at least <see cref="ConcurrentGroups"/> groups).</summary>
    internal static int[] Order(AdjacencyGraph graph, UnknownGeometry geometry, bool? concurrent)
    {
        int n = graph.VertexCount;
        if (geometry.UnknownCount != n)
            throw new ArgumentException("the geometry describes another number of unknowns");
        if (!geometry.HasAllPositions)
            throw new ArgumentException("every group needs a position for geometric nested dissection");
        int g = geometry.GroupCount;

        // Members of each group, and the group graph.
        var memberStart = new int[g + 1];
        for (int v = 0; v < n; v++) memberStart[geometry.GroupOf(v) + 1]++;
        for (int k = 0; k < g; k++) memberStart[k + 1] += memberStart[k];
        var members = new int[n];
        var put = (int[])memberStart.Clone();
        for (int v = 0; v < n; v++) members[put[geometry.GroupOf(v)]++] = v;

        var gStart = new int[g + 1];
        var gAdj = new List<int>(graph.Adjacent.Length / 2);
        var mark = new int[g];
        Array.Fill(mark, -1);
        for (int k = 0; k < g; k++)
        {
            mark[k] = k;
            for (int t = memberStart[k]; t < memberStart[k + 1]; t++)
                foreach (int w in graph.Neighbours(members[t]))
                {
                    int h = geometry.GroupOf(w);
                    if (mark[h] != k) { mark[h] = k; gAdj.Add(h); }
                }
            gStart[k + 1] = gAdj.Count;
        }
        var adj = gAdj.ToArray();

        var x = new double[g];
        var y = new double[g];
        for (int k = 0; k < g; k++) (x[k], y[k]) = geometry.PositionOf(k);
        var weight = new int[g];
        for (int k = 0; k < g; k++) weight[k] = memberStart[k + 1] - memberStart[k];

        var groupOrder = new List<int>(g);
        var side = new int[g];      // 0 = not in the current part; 1 = first half; 2 = second half
        var all = Enumerable.Range(0, g).Where(k => weight[k] > 0).ToArray();
        Dissect(all, x, y, gStart, adj, weight, side, groupOrder,
            concurrent ?? (Environment.ProcessorCount > 1 && all.Length >= ConcurrentGroups));

        var perm = new int[n];
        int at = 0;
        foreach (int k in groupOrder)
            for (int t = memberStart[k]; t < memberStart[k + 1]; t++) perm[at++] = members[t];
        return perm;
    }

    /// <summary>
    /// A minimum vertex cover of the edges cut between the two halves (König's theorem: from a maximum matching of
    /// the bipartite cut graph, cover = (A \ Z) ∪ (B ∩ Z) with Z reached from unmatched A vertices by alternating
    /// paths). Any cover of the cut edges separates the halves. Kuhn's augmenting paths; the boundaries are small.
    /// </summary>
    private static List<int> MinimumCutCover(List<int> a, List<int> b, int[] gStart, int[] adj, int[] side)
    {
        var matchOfB = new Dictionary<int, int>();
        var matchOfA = new Dictionary<int, int>();
        var visited = new HashSet<int>();
        bool Augment(int u)
        {
            for (int p = gStart[u]; p < gStart[u + 1]; p++)
            {
                int v = adj[p];
                if (side[v] != 2 || !visited.Add(v)) continue;
                if (!matchOfB.TryGetValue(v, out int w) || Augment(w))
                {
                    matchOfB[v] = u; matchOfA[u] = v; return true;
                }
            }
            return false;
        }
        foreach (int u in a) { visited.Clear(); Augment(u); }

        // Z: alternating reachability from unmatched vertices of A.
        var zA = new HashSet<int>();
        var zB = new HashSet<int>();
        var queue = new Queue<int>();
        foreach (int u in a) if (!matchOfA.ContainsKey(u)) { zA.Add(u); queue.Enqueue(u); }
        while (queue.Count > 0)
        {
            int u = queue.Dequeue();
            for (int p = gStart[u]; p < gStart[u + 1]; p++)
            {
                int v = adj[p];
                if (side[v] != 2 || !zB.Add(v)) continue;
                if (matchOfB.TryGetValue(v, out int w) && zA.Add(w)) queue.Enqueue(w);
            }
        }
        var cover = new List<int>();
        foreach (int u in a) if (!zA.Contains(u)) cover.Add(u);
        foreach (int v in b) if (zB.Contains(v)) cover.Add(v);
        return cover;
    }

    // concurrent: order the two halves of this part on two threads (their lists joined in the same order as when
    // ordered one after the other). No group of one half touches the other once the separator is out, so the
    // halves read and write disjoint entries of side (the separator's and outer groups' entries stay 0).
    private static void Dissect(int[] part, double[] x, double[] y, int[] gStart, int[] adj, int[] weight, int[] side,
        List<int> order, bool concurrent = false)
    {
        if (part.Length <= LeafGroups) { order.AddRange(part); return; }
        double minX = double.MaxValue, maxX = double.MinValue, minY = double.MaxValue, maxY = double.MinValue;
        foreach (int k in part)
        {
            minX = Math.Min(minX, x[k]); maxX = Math.Max(maxX, x[k]);
            minY = Math.Min(minY, y[k]); maxY = Math.Max(maxY, y[k]);
        }
        var coord = maxX - minX >= maxY - minY ? x : y;
        var keys = new double[part.Length];
        for (int t = 0; t < part.Length; t++) keys[t] = coord[part[t]];
        var sorted = (int[])part.Clone();
        Array.Sort(keys, sorted); // stable enough: ties keep no meaning, result deterministic for given input
        int half = sorted.Length / 2;
        for (int t = 0; t < sorted.Length; t++) side[sorted[t]] = t < half ? 1 : 2;

        // Boundary of each half towards the other: both are vertex separators; take the lighter.
        var sep1 = new List<int>();
        var sep2 = new List<int>();
        int w1 = 0, w2 = 0;
        foreach (int k in sorted)
        {
            int s = side[k];
            for (int p = gStart[k]; p < gStart[k + 1]; p++)
            {
                int h = adj[p];
                if (side[h] != 0 && side[h] != s)
                {
                    if (s == 1) { sep1.Add(k); w1 += weight[k]; } else { sep2.Add(k); w2 += weight[k]; }
                    break;
                }
            }
        }
        var sep = w1 <= w2 ? sep1 : sep2;
        var cover = MinimumCutCover(sep1, sep2, gStart, adj, side);
        int wc = 0;
        foreach (int k in cover) wc += weight[k];
        if (wc < Math.Min(w1, w2)) sep = cover;
        foreach (int k in sep) side[k] = 3;
        var a = sorted.Where(k => side[k] == 1).ToArray();
        var b = sorted.Where(k => side[k] == 2).ToArray();
        foreach (int k in sorted) side[k] = 0;
        if (concurrent)
        {
            var orderB = new List<int>(b.Length);
            var second = Task.Run(() => Dissect(b, x, y, gStart, adj, weight, side, orderB));
            Dissect(a, x, y, gStart, adj, weight, side, order);
            second.GetAwaiter().GetResult();
            order.AddRange(orderB);
        }
        else
        {
            Dissect(a, x, y, gStart, adj, weight, side, order);
            Dissect(b, x, y, gStart, adj, weight, side, order);
        }
        order.AddRange(sep);
    }
}
