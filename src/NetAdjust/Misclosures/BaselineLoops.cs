using MathNet.Numerics.Distributions;
using NetAdjust.Geodesy;
using NetAdjust.Network;

namespace NetAdjust.Misclosures;

/// <summary>
/// Finds independent closed loops of GNSS baselines and computes their misclosures (docs/methods.md, "Misclosures
/// before the adjustment", baseline loops). The baselines form a graph of points (a baseline measured twice is a
/// loop of two). The loops are a shortest basis of its cycle space: candidates are Horton's cycles (for every point
/// v and baseline x–y, the shortest paths v–x and y–v closed by the baseline, when they meet only at v) and, for
/// every baseline, the shortest path back through baselines of other groups; they are taken shortest first,
/// loops that mix groups before loops of one group, each one only when it is independent of those taken (Gaussian
/// elimination over GF(2)), until the cycle rank m − n + c is reached. A loop whose baselines all come from one
/// group (one session) closes by construction of the processing and is only a trivial check: it is kept (a wrong
/// label or a copying error still shows in it) but marked <see cref="BaselineLoop.Trivial"/>.
/// </summary>
internal static class BaselineLoops
{
    /// <summary>Above this many Horton candidates (points × baselines) the candidates are the shortest loop through
    /// each baseline, the cross-group loops and the fundamental cycles of one breadth-first tree per connected part:
    /// still a basis of short loops, not always the shortest one (a check stays well under a second).</summary>
    private const long MaxHortonCandidates = 250_000;

    private sealed record Candidate(int[] Edges, bool Trivial, double Length, int Order);

    /// <summary>Baselines read by the shortest-path searches on this thread (for the tests of their cost).</summary>
    [ThreadStatic] internal static long BaselinesRead;

    /// <summary>Positions of points found for the loops' local frames on this thread (for the tests of their cost).
    /// </summary>
    [ThreadStatic] internal static long PositionsFound;

    /// <summary>
    /// The loops of a network's GNSS baselines: every baseline whose three components are present, none set aside,
    /// with a 3×3 covariance (the group scale applied). The mean position of a loop comes from its points' given or
    /// approximate grid coordinates through the baselines' projection (none without one: no east, north, up).
    /// </summary>
    /// <param name="network">The network.</param>
    /// <param name="confidence">The confidence of the tests, in (0, 1).</param>
    /// <returns>The loops, each with the indices of its baselines' component observations.</returns>
    public static List<BaselineLoop> Check(SurveyNetwork network, double confidence)
    {
        var vectors = new List<BaselineVector>();
        var components = new List<int[]>();
        IMapProjection? projection = null;
        var byId = new Dictionary<string, int[]>(StringComparer.Ordinal);
        var order = new List<string>();
        for (int i = 0; i < network.Observations.Count; i++)
        {
            if (network.Observations[i] is not BaselineObservation { BaselineId: string id } b) continue;
            if (!byId.TryGetValue(id, out var slots))
            {
                byId[id] = slots = [-1, -1, -1];
                order.Add(id);
            }
            slots[(int)b.Component] = i;
        }
        foreach (string id in order)
        {
            int[] slots = byId[id];
            if (slots.Any(i => i < 0)) continue;
            var parts = slots.Select(i => (BaselineObservation)network.Observations[i]).ToArray();
            if (parts.Any(p => p.Excluded || p.Covariance is null)) continue;
            var b = parts[0];
            projection ??= b.Grid?.Projection;
            var (dx, dy, dz) = b.Vector;
            vectors.Add(new BaselineVector(b.From, b.To, dx, dy, dz, [.. b.Covariance!], b.Group, b.Source ?? id));
            components.Add(slots);
        }
        if (vectors.Count == 0) return [];
        (double Lat, double Lon)? Position(string point)
        {
            if (projection is null || !network.Contains(point)) return null;
            var p = network.Points[network.IndexOf(point)];
            return p.E is double e && p.N is double n ? projection.Inverse(e, n) : null;
        }
        var loops = Find(vectors, projection?.Ellipsoid ?? Ellipsoid.Grs80, Position, confidence);
        return [.. loops.Select(l => l with { Observations = [.. l.Baselines.SelectMany(k => components[k])] })];
    }

    /// <summary>Finds and checks the loops.</summary>
    /// <param name="vectors">The baselines (those set aside already left out).</param>
    /// <param name="ellipsoid">The ellipsoid of the positions (for the mean position of a loop).</param>
    /// <param name="position">Geodetic latitude and longitude (radians) of a point by id, or null when not known;
    /// a loop with no known point has no north, east, up (NaN).</param>
    /// <param name="confidence">The confidence of the tests, in (0, 1).</param>
    /// <returns>The loops, in the order taken (shortest first).</returns>
    public static List<BaselineLoop> Find(IReadOnlyList<BaselineVector> vectors, Ellipsoid ellipsoid,
        Func<string, (double Lat, double Lon)?> position, double confidence)
    {
        ArgumentNullException.ThrowIfNull(vectors);
        // Points in order of first appearance; a baseline from a point to itself closes nothing and is left out.
        var index = new Dictionary<string, int>(StringComparer.Ordinal);
        var names = new List<string>();
        var edges = new List<(int A, int B, int Vector)>();
        for (int i = 0; i < vectors.Count; i++)
        {
            var v = vectors[i];
            if (v.From == v.To) continue;
            edges.Add((Node(v.From), Node(v.To), i));
        }
        int n = names.Count, m = edges.Count;
        if (m == 0) return [];
        var adjacency = new List<int>[n];
        for (int i = 0; i < n; i++) adjacency[i] = [];
        for (int e = 0; e < m; e++) { adjacency[edges[e].A].Add(e); adjacency[edges[e].B].Add(e); }
        int rank = m - n + Components(n, adjacency, edges);
        if (rank == 0) return [];

        var lengths = edges.Select(e => Norm(vectors[e.Vector])).ToArray();
        var candidates = new List<Candidate>();
        // a loop found twice (as its sorted baselines) is a candidate once
        var seen = new HashSet<int[]>(SameBaselines.Instance);
        void Add(List<int> cycle)
        {
            if (cycle.Count < 2) return;
            cycle.Sort();
            int[] sorted = [.. cycle];
            if (!seen.Add(sorted)) return;
            // trivial: every baseline of one and the same group (one session)
            string? group = vectors[edges[sorted[0]].Vector].Group;
            bool trivial = group is not null;
            double length = 0;
            foreach (int e in sorted)
            {
                trivial &= vectors[edges[e].Vector].Group == group;
                length += lengths[e];
            }
            candidates.Add(new Candidate(sorted, trivial, length, candidates.Count));
        }
        var search = new Search(n);

        // For every baseline, the shortest way back through baselines of other groups (mixes groups by design). For
        // a baseline of a group the way depends only on its ends and its group, so the repeats of a baseline share
        // one search (a search that finds no way reads every baseline of the points it reaches).
        var wayBack = new Dictionary<(int From, int To, string Group), List<int>?>();
        for (int e = 0; e < m; e++)
        {
            string? g = vectors[edges[e].Vector].Group;
            var (from, to) = (edges[e].B, edges[e].A);
            List<int>? path;
            if (g is null)
                path = ShortestPath(from, to, adjacency, edges, f => f != e, search);
            else if (!wayBack.TryGetValue((from, to, g), out path))
                wayBack[(from, to, g)] = path = ShortestPath(from, to, adjacency, edges,
                    f => vectors[edges[f].Vector].Group != g, search);
            if (path is not null) Add([e, .. path]);
        }
        // Horton's candidates; for a large network the shortest loop through each baseline and the fundamental
        // cycles of one tree per connected part instead (these always complete a basis).
        if ((long)n * m <= MaxHortonCandidates)
            for (int v = 0; v < n; v++) AddHorton(v, n, adjacency, edges, Add, fundamental: false);
        else
        {
            for (int e = 0; e < m; e++)
            {
                var path = ShortestPath(edges[e].B, edges[e].A, adjacency, edges, f => f != e, search);
                if (path is not null) Add([e, .. path]);
            }
            foreach (int v in ComponentRoots(n, adjacency, edges))
                AddHorton(v, n, adjacency, edges, Add, fundamental: true);
        }

        // Shortest basis: mixed loops before trivial ones, then fewest baselines, then shortest, then order found
        // (the order found is unique, so the order is total)
        candidates.Sort(static (a, b) =>
        {
            int c = a.Trivial.CompareTo(b.Trivial);
            if (c == 0) c = a.Edges.Length.CompareTo(b.Edges.Length);
            if (c == 0) c = a.Length.CompareTo(b.Length);
            return c != 0 ? c : a.Order.CompareTo(b.Order);
        });
        var basis = new CycleBasis(n, adjacency, edges);
        var loops = new List<BaselineLoop>();
        double z = Normal.InvCDF(0, 1, 1 - ((1 - confidence) / 2));
        double chi2 = ChiSquared.InvCDF(3, confidence);
        // each point's earth-centred position on the ellipsoid found once, when a loop first needs it (a point is in
        // many loops)
        var positions = new (double X, double Y, double Z)?[n];
        var found = new bool[n];
        (double X, double Y, double Z)? PositionOf(int node)
        {
            if (!found[node])
            {
                PositionsFound++;
                positions[node] = position(names[node]) is var (lat, lon)
                    ? Geocentric.ToGeocentric(ellipsoid, lat, lon, 0) : null;
                found[node] = true;
            }
            return positions[node];
        }
        foreach (var c in candidates)
        {
            if (loops.Count == rank) break;
            if (!basis.TryAdd(c.Edges)) continue;
            loops.Add(Loop(c, vectors, edges, names, ellipsoid, PositionOf, z, chi2));
        }
        return loops;

        int Node(string id)
        {
            if (index.TryGetValue(id, out int k)) return k;
            index[id] = names.Count;
            names.Add(id);
            return names.Count - 1;
        }
    }

    /// <summary>Reductions of a loop by a row of the independence test on this thread, and the coordinates they
    /// read (for the tests of its cost).</summary>
    [ThreadStatic] internal static long Reductions, CoordinatesRead;

    /// <summary>
    /// The loops taken so far, for the test of a candidate's independence (Gaussian elimination over GF(2)). A loop is
    /// an element of the graph's cycle space, and a spanning forest gives that space a basis, its fundamental
    /// cycles, one for each baseline outside the forest: the coordinates of a loop in it are the baselines of the loop
    /// that are outside the forest (the sum of their fundamental cycles is the loop, since the forest has no cycle).
    /// So a loop is reduced as the sorted list of its outside baselines' numbers (m − n + c of them in all, however
    /// long the loop), against rows kept by their lowest number; a short loop has a short list, and so does a row,
    /// where the dense bit rows of all m baselines cost m/64 words a reduction and a candidate (quadratic time and
    /// memory in a network of tens of thousands of baselines). The test is the same: a candidate is independent of
    /// the loops taken exactly when its coordinates are.
    /// </summary>
    private sealed class CycleBasis
    {
        // Per baseline: its number among the baselines outside the spanning forest, or −1 for a forest baseline.
        private readonly int[] _coordinate;

        // The rows by their lowest coordinate (null where none), each sorted ascending.
        private readonly int[]?[] _rows;

        public CycleBasis(int n, List<int>[] adjacency, List<(int A, int B, int Vector)> edges)
        {
            // a breadth-first spanning forest, from the first point of each connected part
            var inForest = new bool[edges.Count];
            var seen = new bool[n];
            var queue = new Queue<int>();
            for (int s = 0; s < n; s++)
            {
                if (seen[s]) continue;
                seen[s] = true;
                queue.Enqueue(s);
                while (queue.Count > 0)
                {
                    int u = queue.Dequeue();
                    foreach (int e in adjacency[u])
                    {
                        int w = Other(edges[e], u);
                        if (seen[w]) continue;
                        seen[w] = true;
                        inForest[e] = true;
                        queue.Enqueue(w);
                    }
                }
            }
            _coordinate = new int[edges.Count];
            int outside = 0;
            for (int e = 0; e < edges.Count; e++) _coordinate[e] = inForest[e] ? -1 : outside++;
            _rows = new int[]?[outside];
        }

        /// <summary>True, and the loop kept, when the loop of baselines <paramref name="loop"/> (a baseline named
        /// twice counts twice, so not at all) is independent of the loops kept.</summary>
        public bool TryAdd(int[] loop)
        {
            var coordinates = new List<int>(loop.Length);
            foreach (int e in loop)
                if (_coordinate[e] >= 0) coordinates.Add(_coordinate[e]);
            coordinates.Sort();
            // a coordinate named twice cancels (sum over GF(2))
            var x = new List<int>(coordinates.Count);
            for (int i = 0; i < coordinates.Count; i++)
                if (i + 1 < coordinates.Count && coordinates[i] == coordinates[i + 1]) i++;
                else x.Add(coordinates[i]);
            int[] row = [.. x];
            while (true)
            {
                if (row.Length == 0) return false;
                if (_rows[row[0]] is not int[] pivot)
                {
                    _rows[row[0]] = row;
                    return true;
                }
                row = SymmetricDifference(row, pivot);
            }
        }

        /// <summary>The sorted symmetric difference of two sorted lists (their sum over GF(2)).</summary>
        private static int[] SymmetricDifference(int[] a, int[] b)
        {
            Reductions++;
            CoordinatesRead += a.Length + b.Length;
            var sum = new int[a.Length + b.Length];
            int i = 0, j = 0, k = 0;
            while (i < a.Length && j < b.Length)
            {
                if (a[i] == b[j]) { i++; j++; }
                else sum[k++] = a[i] < b[j] ? a[i++] : b[j++];
            }
            while (i < a.Length) sum[k++] = a[i++];
            while (j < b.Length) sum[k++] = b[j++];
            return sum[..k];
        }
    }

    /// <summary>Horton's candidates of one root: the breadth-first tree of shortest paths from v (fewest baselines,
    /// ties by input order) and, for every baseline outside it, the two tree paths closed by it when they meet only
    /// at v; with <paramref name="fundamental"/>, for every baseline outside the tree its fundamental cycle (the two
    /// tree paths up to where they meet), which together span the cycles of v's connected part.</summary>
    private static void AddHorton(int v, int n, List<int>[] adjacency, List<(int A, int B, int Vector)> edges,
        Action<List<int>> add, bool fundamental)
    {
        var parent = new int[n];
        var depth = new int[n];
        Array.Fill(parent, -2);
        parent[v] = -1;
        var queue = new Queue<int>([v]);
        while (queue.Count > 0)
        {
            int u = queue.Dequeue();
            foreach (int e in adjacency[u])
            {
                int w = Other(edges[e], u);
                if (parent[w] != -2) continue;
                parent[w] = e;
                depth[w] = depth[u] + 1;
                queue.Enqueue(w);
            }
        }
        for (int e = 0; e < edges.Count; e++)
        {
            var (a, b, _) = edges[e];
            if (parent[a] == -2 || parent[b] == -2 || parent[a] == e || parent[b] == e) continue;
            int meet = Meet(a, b, parent, depth, edges);
            if (meet != v && !fundamental) continue;
            add([e, .. PathTo(a, meet, parent, edges), .. PathTo(b, meet, parent, edges)]);
        }
    }

    /// <summary>The tree edges from a node up to one of its ancestors.</summary>
    private static List<int> PathTo(int node, int ancestor, int[] parent, List<(int A, int B, int Vector)> edges)
    {
        var path = new List<int>();
        for (int u = node; u != ancestor; u = Other(edges[parent[u]], u)) path.Add(parent[u]);
        return path;
    }

    /// <summary>The first common node of the two tree paths to the root (both nodes in the tree): the deeper one
    /// climbs to the other's depth, then both climb together until they meet.</summary>
    private static int Meet(int a, int b, int[] parent, int[] depth, List<(int A, int B, int Vector)> edges)
    {
        while (depth[a] > depth[b]) a = Other(edges[parent[a]], a);
        while (depth[b] > depth[a]) b = Other(edges[parent[b]], b);
        while (a != b)
        {
            a = Other(edges[parent[a]], a);
            b = Other(edges[parent[b]], b);
        }
        return a;
    }

    /// <summary>Breadth-first shortest path (fewest baselines, ties by input order) over the allowed edges; the
    /// edge indices, or null when there is none.</summary>
    private static List<int>? ShortestPath(int from, int to, List<int>[] adjacency,
        List<(int A, int B, int Vector)> edges, Func<int, bool> allowed, Search search)
    {
        search.Start(from);
        var queue = search.Queue;
        while (queue.Count > 0 && !search.Reached(to))
        {
            int u = queue.Dequeue();
            foreach (int e in adjacency[u])
            {
                BaselinesRead++;
                if (!allowed(e)) continue;
                int w = Other(edges[e], u);
                if (search.Reached(w)) continue;
                search.Reach(w, e);
                if (w == to) break; // found: the rest of a point's baselines (one measured many times) unread
                queue.Enqueue(w);
            }
        }
        if (!search.Reached(to)) return null;
        var path = new List<int>();
        for (int u = to; u != from; u = Other(edges[search.Via(u)], u)) path.Add(search.Via(u));
        return path;
    }

    /// <summary>The marks of one breadth-first search, kept for the next: a point counts as reached when its stamp
    /// is the current search's (no clearing of arrays over all points, and no table made, per search).</summary>
    private sealed class Search(int n)
    {
        private readonly int[] _via = new int[n], _stamp = new int[n];
        private int _current;

        public Queue<int> Queue { get; } = new();

        public void Start(int from)
        {
            _current++;
            Queue.Clear();
            Queue.Enqueue(from);
            Reach(from, -1);
        }

        public bool Reached(int node) => _stamp[node] == _current;

        public void Reach(int node, int edge)
        {
            _stamp[node] = _current;
            _via[node] = edge;
        }

        public int Via(int node) => _via[node];
    }

    /// <summary>Two loops as their sorted baselines: equal when they hold the same baselines.</summary>
    private sealed class SameBaselines : IEqualityComparer<int[]>
    {
        public static readonly SameBaselines Instance = new();

        public bool Equals(int[]? x, int[]? y) => x.AsSpan().SequenceEqual(y);

        public int GetHashCode(int[] loop)
        {
            var hash = new HashCode();
            hash.AddBytes(System.Runtime.InteropServices.MemoryMarshal.AsBytes(loop.AsSpan()));
            return hash.ToHashCode();
        }
    }

    private static int Components(int n, List<int>[] adjacency, List<(int A, int B, int Vector)> edges) =>
        ComponentRoots(n, adjacency, edges).Count;

    /// <summary>The first point of each connected part.</summary>
    private static List<int> ComponentRoots(int n, List<int>[] adjacency, List<(int A, int B, int Vector)> edges)
    {
        var seen = new bool[n];
        var roots = new List<int>();
        for (int s = 0; s < n; s++)
        {
            if (seen[s]) continue;
            roots.Add(s);
            seen[s] = true;
            var stack = new Stack<int>([s]);
            while (stack.Count > 0)
            {
                int u = stack.Pop();
                foreach (int e in adjacency[u])
                {
                    int w = Other(edges[e], u);
                    if (!seen[w]) { seen[w] = true; stack.Push(w); }
                }
            }
        }
        return roots;
    }

    /// <summary>Walks the cycle from the first point of its first baseline (in input order), sums the vectors
    /// with the sign of the direction of travel and their covariances, and tests the misclosure.</summary>
    private static BaselineLoop Loop(Candidate c, IReadOnlyList<BaselineVector> vectors,
        List<(int A, int B, int Vector)> edges, List<string> names, Ellipsoid ellipsoid,
        Func<int, (double X, double Y, double Z)?> position, double z, double chi2)
    {
        // From the first point of the first baseline, each step takes the first baseline of the loop (in its order)
        // not walked yet that touches the point reached. The loop's baseline ends sorted by point, then by place in
        // the loop, give each point's baselines at once (a long loop is not searched from its start at each step).
        int count = c.Edges.Length;
        var ends = new (int Point, int Place)[2 * count];
        for (int i = 0; i < count; i++)
        {
            ends[2 * i] = (edges[c.Edges[i]].A, i);
            ends[2 * i + 1] = (edges[c.Edges[i]].B, i);
        }
        Array.Sort(ends);
        var walked = new bool[count];
        int start = edges[c.Edges[0]].A, at = start;
        var points = new List<string> { names[start] };
        var nodes = new List<int> { start };
        var used = new List<int>();
        var reversed = new List<bool>();
        double wx = 0, wy = 0, wz = 0;
        var cov = new double[9];
        for (int step = 0; step < count; step++)
        {
            int place = step == 0 ? 0 : NextAt(at);
            walked[place] = true;
            int e = c.Edges[place];
            bool forward = edges[e].A == at;
            var v = vectors[edges[e].Vector];
            double s = forward ? 1 : -1;
            wx += s * v.Dx;
            wy += s * v.Dy;
            wz += s * v.Dz;
            for (int i = 0; i < 9; i++) cov[i] += v.Covariance[i];
            used.Add(edges[e].Vector);
            reversed.Add(!forward);
            at = forward ? edges[e].B : edges[e].A;
            points.Add(names[at]);
            nodes.Add(at);
        }
        var groups = used.Select(i => vectors[i].Group).Distinct().ToList();

        double statistic = QuadraticForm(cov, wx, wy, wz);
        // Local frame at the mean position of the loop's known points (mean of their earth-centred unit positions).
        double east = double.NaN, north = double.NaN, up = double.NaN;
        double sdE = double.NaN, sdN = double.NaN, sdU = double.NaN;
        int known = 0;
        double sx = 0, sy = 0, sz = 0;
        for (int i = 1; i < nodes.Count; i++)
            if (position(nodes[i]) is var (x, y, zz))
            {
                known++;
                sx += x; sy += y; sz += zz;
            }
        if (known > 0)
        {
            var (mLat, mLon, _) = Geocentric.ToGeodetic(ellipsoid, sx / known, sy / known, sz / known);
            double[] r = Geocentric.LocalRotation(mLat, mLon);
            east = r[0] * wx + r[1] * wy + r[2] * wz;
            north = r[3] * wx + r[4] * wy + r[5] * wz;
            up = r[6] * wx + r[7] * wy + r[8] * wz;
            sdE = Math.Sqrt(RowVariance(r, 0, cov));
            sdN = Math.Sqrt(RowVariance(r, 1, cov));
            sdU = Math.Sqrt(RowVariance(r, 2, cov));
        }
        return new BaselineLoop(points, used, reversed, groups, c.Trivial, wx, wy, wz, c.Length, east, north, up,
            sdE, sdN, sdU, statistic, chi2, z);

        // the first baseline not walked at the point (its ends are a run of the sorted ends, found by bisection)
        int NextAt(int point)
        {
            int lo = 0, hi = ends.Length;
            while (lo < hi)
            {
                int mid = (lo + hi) >>> 1;
                if (ends[mid].Point < point) lo = mid + 1;
                else hi = mid;
            }
            for (int i = lo; i < ends.Length && ends[i].Point == point; i++)
                if (!walked[ends[i].Place]) return ends[i].Place;
            throw new InvalidOperationException("the baselines of a loop do not close");
        }
    }

    /// <summary>rᵢ C rᵢᵀ for row i of R.</summary>
    private static double RowVariance(double[] r, int i, double[] c)
    {
        double v = 0;
        for (int a = 0; a < 3; a++)
            for (int b = 0; b < 3; b++) v += r[3 * i + a] * c[3 * a + b] * r[3 * i + b];
        return v;
    }

    /// <summary>wᵀ C⁻¹ w by Cholesky; NaN when C is not positive definite.</summary>
    private static double QuadraticForm(double[] c, double x, double y, double z)
    {
        double l00 = c[0];
        if (!(l00 > 0)) return double.NaN;
        l00 = Math.Sqrt(l00);
        double l10 = c[3] / l00, l20 = c[6] / l00;
        double d1 = c[4] - l10 * l10;
        if (!(d1 > 0)) return double.NaN;
        double l11 = Math.Sqrt(d1);
        double l21 = (c[7] - l20 * l10) / l11;
        double d2 = c[8] - l20 * l20 - l21 * l21;
        if (!(d2 > 0)) return double.NaN;
        double l22 = Math.Sqrt(d2);
        double y0 = x / l00, y1 = (y - l10 * y0) / l11, y2 = (z - l20 * y0 - l21 * y1) / l22;
        return y0 * y0 + y1 * y1 + y2 * y2;
    }

    private static double Norm(BaselineVector v) => Math.Sqrt(v.Dx * v.Dx + v.Dy * v.Dy + v.Dz * v.Dz);

    private static int Other((int A, int B, int Vector) e, int v) => e.A == v ? e.B : e.A;
}
