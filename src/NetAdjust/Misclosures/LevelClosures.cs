using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Misclosures;

/// <summary>
/// Finds the independent level loops and lines between benchmarks of a network's height differences and computes
/// their misclosures. The benchmarks (points with a held or weighted height) are joined to one extra "datum" node
/// whose edges carry their given heights, so a line between two benchmarks is a loop through it. A spanning tree
/// is grown breadth-first from that node (points and observations in input order); each observation not in the tree
/// closes one loop with the shortest path (fewest sections) through the tree and the loops found before it, so the
/// loops are independent, as many as the cycle rank, and short, which localises a blunder to the loops that hold
/// it (docs/methods.md, "Misclosures before the adjustment").
/// </summary>
internal static class LevelClosures
{
    private sealed record Edge(int A, int B, double Dh, double Var, double Length, int Obs);

    /// <summary>Sections read by the shortest-path searches on this thread (for the tests of their cost).</summary>
    [ThreadStatic] internal static long SectionsRead;

    public static List<LevelClosure> Find(SurveyNetwork network, IReadOnlyList<double> sd, MisclosureOptions o,
        double z)
    {
        int n = network.Points.Count, datum = n;
        var edges = new List<Edge>();
        for (int i = 0; i < n; i++)
        {
            var p = network.Points[i];
            if (p.H is double h && (p.IsFixed(Fixity.H) || p.SdH.HasValue))
                edges.Add(new Edge(datum, i, h, p.SdH is double s ? s * s : 0, 0, -1));
        }
        for (int i = 0; i < network.Observations.Count; i++)
        {
            if (network.Observations[i] is not HeightDifferenceObservation d || d.Excluded) continue;
            int a = network.IndexOf(d.From), b = network.IndexOf(d.To);
            double len = d.LineLength is Length l ? l.Metres : PlaneDistance(network.Points[a], network.Points[b]);
            edges.Add(new Edge(a, b, d.Value, sd[i] * sd[i], len, i));
        }
        var adjacency = new List<int>[n + 1];
        for (int i = 0; i <= n; i++) adjacency[i] = [];
        for (int e = 0; e < edges.Count; e++) { adjacency[edges[e].A].Add(e); adjacency[edges[e].B].Add(e); }

        // Spanning forest, breadth-first from the datum node, then from each point not yet reached.
        var inTree = new bool[edges.Count];
        var seen = new bool[n + 1];
        foreach (int root in new[] { datum }.Concat(Enumerable.Range(0, n)))
        {
            if (seen[root]) continue;
            seen[root] = true;
            var queue = new Queue<int>([root]);
            while (queue.Count > 0)
            {
                int v = queue.Dequeue();
                foreach (int e in adjacency[v])
                {
                    int w = Other(edges[e], v);
                    if (seen[w]) continue;
                    seen[w] = true;
                    inTree[e] = true;
                    queue.Enqueue(w);
                }
            }
        }

        var usable = (bool[])inTree.Clone();
        var via = new int[n + 1];
        Array.Fill(via, -2);
        var closures = new List<LevelClosure>();
        for (int e = 0; e < edges.Count; e++)
        {
            if (inTree[e]) continue;
            var edge = edges[e];
            // Run the loop from A along e to B, then back from B to A by the shortest usable path.
            var path = ShortestPath(edge.B, edge.A, adjacency, edges, usable, via);
            usable[e] = true;
            if (path is null) continue; // cannot happen in a connected part; kept for safety
            var run = new List<(Edge Edge, bool Forward)> { (edge, true) };
            int at = edge.B;
            foreach (int pe in path)
            {
                bool forward = edges[pe].A == at;
                run.Add((edges[pe], forward));
                at = Other(edges[pe], at);
            }
            closures.Add(Closure(network, run, edge.A, datum, o, z));
        }
        return closures;
    }

    private static LevelClosure Closure(SurveyNetwork network, List<(Edge Edge, bool Forward)> run, int start,
        int datum, MisclosureOptions o, double z)
    {
        // Rotate a run through the datum node so that it starts and ends there: a line from benchmark to benchmark.
        int k = run.FindIndex(r => (r.Forward ? r.Edge.A : r.Edge.B) == datum);
        if (k > 0) { run = [.. run.Skip(k), .. run.Take(k)]; start = datum; }
        double w = 0, var = 0, length = 0;
        var points = new List<string>();
        var obs = new List<int>();
        int at = start;
        foreach (var (edge, forward) in run)
        {
            w += forward ? edge.Dh : -edge.Dh;
            var += edge.Var;
            if (edge.Obs >= 0) { obs.Add(edge.Obs); length += edge.Length; }
            if (at != datum) points.Add(network.Points[at].Id);
            at = forward ? edge.B : edge.A;
        }
        if (at != datum) points.Add(network.Points[at].Id);
        var kind = start == datum ? LevelClosureKind.Line : LevelClosureKind.Loop;
        double? constant = o.LevelLoopConstant;
        if (kind == LevelClosureKind.Loop && run.Count == 2)
        {
            kind = LevelClosureKind.Section;
            length = Math.Min(run[0].Edge.Length, run[1].Edge.Length);
            constant = o.LevelSectionConstant ?? o.LevelLoopConstant;
        }
        double sd = Math.Sqrt(var);
        double? allowance = constant is double c && double.IsFinite(length) ? c * Math.Sqrt(length / 1000) : null;
        return new LevelClosure(kind, points, obs, w, length, sd, z * sd, allowance);
    }

    /// <summary>Breadth-first shortest path (fewest edges; ties by edge order) from one node to another over the
    /// usable edges; the edge indices in running order, or null when there is none. <paramref name="via"/> is all
    /// −2 on entry and on return (only the nodes reached are touched, so a short loop costs little in a large
    /// network).</summary>
    private static List<int>? ShortestPath(int from, int to, List<int>[] adjacency, List<Edge> edges, bool[] usable,
        int[] via)
    {
        var reached = new List<int> { from };
        via[from] = -1;
        var queue = new Queue<int>([from]);
        while (queue.Count > 0 && via[to] == -2)
        {
            int v = queue.Dequeue();
            foreach (int e in adjacency[v])
            {
                SectionsRead++;
                if (!usable[e]) continue;
                int w = Other(edges[e], v);
                if (via[w] != -2) continue;
                via[w] = e;
                reached.Add(w);
                if (w == to) break; // found: the rest of a node's sections (a section levelled many times) unread
                queue.Enqueue(w);
            }
        }
        List<int>? path = null;
        if (via[to] != -2)
        {
            path = [];
            for (int v = to; v != from; v = Other(edges[via[v]], v)) path.Add(via[v]);
            path.Reverse();
        }
        foreach (int v in reached) via[v] = -2;
        return path;
    }

    private static int Other(Edge e, int v) => e.A == v ? e.B : e.A;

    private static double PlaneDistance(Point a, Point b) =>
        a.E is double ea && a.N is double na && b.E is double eb && b.N is double nb
            ? Math.Sqrt(((eb - ea) * (eb - ea)) + ((nb - na) * (nb - na))) : double.NaN;
}
