namespace NetAdjust.LinearAlgebra.Sparse;

/// <summary>
/// Approximate minimum degree ordering on the quotient graph: indistinguishable unknowns are merged into
/// supervariables first (same closed neighbourhood, e.g. the easting and northing of one point); then the
/// supervariable of least approximate external degree is eliminated, its adjacent elements absorbed into a new
/// element, and the degrees of its neighbours re-estimated by the bound
/// d̄(i) = |A_i| + Σ_{e ∋ i} |L_e \ i| (capped by the number of unknowns left).
/// </summary>
/// <remarks>
/// A simplified form of Amestoy, Davis &amp; Duff 1996, "An approximate minimum degree ordering algorithm",
/// SIAM J. Matrix Anal. Appl. 17(4):886–905: the quotient graph, element absorption, supervariables and the
/// upper-bound degree are theirs; their sharper |L_e \ L_p| bound, mass elimination and dense-row handling are not
/// implemented. George &amp; Liu 1989, "The evolution of the minimum degree ordering algorithm", SIAM Review 31(1),
/// surveys the method; Davis 2006, §7.1. Deterministic: ties go to the lowest index.
/// </remarks>
internal static class MinimumDegreeOrdering
{
    /// <summary>A fill-reducing permutation p (p[k] = unknown placed k-th).</summary>
    /// <param name="graph">G(N).</param>
    public static int[] Order(AdjacencyGraph graph)
    {
        int n = graph.VertexCount;
        if (n == 0) return [];

        // Supervariables: vertices with identical closed neighbourhoods.
        var super = new int[n];
        var hash = new long[n];
        for (int v = 0; v < n; v++)
        {
            long h = v; // closed neighbourhood includes v
            foreach (int w in graph.Neighbours(v)) h += w;
            hash[v] = (h * 1000003L) ^ (graph.Start[v + 1] - graph.Start[v]);
        }
        var byHash = new Dictionary<long, List<int>>();
        Array.Fill(super, -1);
        for (int v = 0; v < n; v++)
        {
            if (!byHash.TryGetValue(hash[v], out var list)) byHash[hash[v]] = list = new List<int>();
            int found = -1;
            foreach (int r in list)
                if (SameClosedNeighbourhood(graph, r, v)) { found = r; break; }
            if (found >= 0) super[v] = found;
            else { super[v] = v; list.Add(v); }
        }
        var weight = new int[n];
        for (int v = 0; v < n; v++) weight[super[v]]++;

        // Quotient graph on representatives.
        var varAdj = new HashSet<int>?[n];
        var elemAdj = new HashSet<int>?[n];
        var elemVars = new List<int>?[n];
        var elemWeight = new int[n];
        for (int v = 0; v < n; v++)
        {
            if (super[v] != v) continue;
            var set = new HashSet<int>();
            foreach (int w in graph.Neighbours(v))
                if (super[w] != v) set.Add(super[w]);
            varAdj[v] = set;
            elemAdj[v] = new HashSet<int>();
        }
        int remaining = n;
        var degree = new int[n];
        var queue = new PriorityQueue<int, (int, int)>();
        for (int v = 0; v < n; v++)
        {
            if (super[v] != v) continue;
            int d = 0;
            foreach (int w in varAdj[v]!) d += weight[w];
            degree[v] = d;
            queue.Enqueue(v, (d, v));
        }

        var eliminated = new bool[n];
        var order = new List<int>(n);
        var mark = new int[n];
        Array.Fill(mark, -1);
        while (queue.TryDequeue(out int p, out var key))
        {
            if (eliminated[p] || key.Item1 != degree[p]) continue;
            eliminated[p] = true;
            order.Add(p);
            remaining -= weight[p];

            // L_p = A_p ∪ (∪_{e ∋ p} L_e) \ {p}
            var lp = new List<int>();
            mark[p] = p;
            foreach (int w in varAdj[p]!)
                if (!eliminated[w] && mark[w] != p) { mark[w] = p; lp.Add(w); }
            foreach (int e in elemAdj[p]!)
            {
                foreach (int w in elemVars[e]!)
                    if (!eliminated[w] && mark[w] != p) { mark[w] = p; lp.Add(w); }
                // absorb e into p
                foreach (int w in elemVars[e]!)
                    if (!eliminated[w]) elemAdj[w]!.Remove(e);
                elemVars[e] = null;
            }
            elemVars[p] = lp;
            int lpWeight = 0;
            foreach (int w in lp) lpWeight += weight[w];
            elemWeight[p] = lpWeight;
            varAdj[p] = null;
            elemAdj[p] = null;

            foreach (int i in lp)
            {
                var ai = varAdj[i]!;
                ai.RemoveWhere(j => j == p || mark[j] == p); // edges now covered by element p
                elemAdj[i]!.Add(p);
                int d = 0;
                foreach (int j in ai) d += weight[j];
                foreach (int e in elemAdj[i]!) d += elemWeight[e] - weight[i];
                d = Math.Min(d, remaining - weight[i]);
                if (d != degree[i]) { degree[i] = d; queue.Enqueue(i, (d, i)); }
                else queue.Enqueue(i, (d, i));
            }
        }

        // Expand supervariables.
        var membersOf = new List<int>[n];
        for (int v = 0; v < n; v++)
            (membersOf[super[v]] ??= new List<int>()).Add(v);
        var perm = new int[n];
        int at = 0;
        foreach (int r in order)
            foreach (int v in membersOf[r]) perm[at++] = v;
        return perm;
    }

    private static bool SameClosedNeighbourhood(AdjacencyGraph g, int a, int b)
    {
        // closed(a) = adj(a) ∪ {a}; equal iff b ∈ adj(a) and adj(a) \ {b} = adj(b) \ {a}.
        var na = g.Neighbours(a);
        var nb = g.Neighbours(b);
        if (na.Length != nb.Length || na.BinarySearch(b) < 0) return false;
        int i = 0, j = 0;
        while (i < na.Length || j < nb.Length)
        {
            if (i < na.Length && na[i] == b) { i++; continue; }
            if (j < nb.Length && nb[j] == a) { j++; continue; }
            if (i >= na.Length || j >= nb.Length || na[i] != nb[j]) return false;
            i++; j++;
        }
        return true;
    }
}
