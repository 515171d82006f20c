using System.Runtime.CompilerServices;
using NetAdjust.Geometry;
using NetAdjust.Network;
using NetAdjust.Observations;
using NetAdjust.Units;

namespace NetAdjust.Adjustment.Approximation;

/// <summary>
/// Computes approximate coordinates for points given none, from the observations and the points that have
/// coordinates (given control or approximate values), in the order a surveyor would:
/// <list type="number">
/// <item>orient direction sets whose station and at least one target are located (mean of azimuth − reading);</item>
/// <item>polar point: a ray (azimuth, oriented direction, or angle from a located backsight) and a distance from the same located station;</item>
/// <item>intersection: rays from two located stations (cut angle at least 5°);</item>
/// <item>resection: directions or angles at the point to three or more located points;</item>
/// <item>ray–distance and distance–distance intersection: two solutions, the one that fits the other observations
/// better is taken; when nothing tells them apart, the choice is deferred until no other step makes progress.</item>
/// </list>
/// Heights follow a breadth-first spanning tree of height differences from points with heights.
/// These are classical textbook constructions (e.g. Wolf &amp; Ghilani, <i>Adjustment Computations</i>, chapters on
/// traverse and intersection/resection; the resection is solved in closed form, see <see cref="Resect"/>).
/// </summary>
internal static class ApproximateCoordinates
{
    private const double MinCut = 5 * Math.PI / 180; // smallest accepted cut angle of two rays (common practice)

    /// <summary>A line of sight from a located station with a known azimuth.</summary>
    private readonly record struct Ray(string Origin, PlanePoint At, double Azimuth, double Sd);

    /// <summary>A distance from a located point.</summary>
    private readonly record struct Span(string Origin, PlanePoint At, double Distance, double Sd);

    /// <summary>A measured clockwise angle at the point from located X to located Y.</summary>
    private readonly record struct Cut(string X, PlanePoint AtX, string Y, PlanePoint AtY, double Angle, double Sd);

    /// <summary>
    /// Fills in plane coordinates of every point in <paramref name="plane"/> that lacks them.
    /// </summary>
    /// <param name="network">The network.</param>
    /// <param name="plane">Points taking part in horizontal observations.</param>
    /// <param name="e">Eastings known so far (given or approximate), completed in place.</param>
    /// <param name="n">Northings, completed in place.</param>
    /// <param name="seedWhenNothingKnown">When no point has coordinates, start a local frame at the first point (free networks).</param>
    /// <exception cref="InvalidInputException">Naming each point that cannot be reached and what it lacks.</exception>
    public static void Plane(SurveyNetwork network, IReadOnlyCollection<string> plane, Dictionary<string, double> e, Dictionary<string, double> n, bool seedWhenNothingKnown)
    {
        // Observations set aside (e.g. by the blunder hunt) are used only for points nothing else reaches.
        if (network.Observations.Any(o => o.Excluded))
        {
            var kept = new SurveyNetwork(network.Name, network.Points, network.Observations.Where(o => !o.Excluded));
            var keptPlane = plane.Where(id => ObservationsOf(kept, id).Count > 0).ToHashSet(StringComparer.Ordinal);
            Plane(kept, keptPlane, e, n, seedWhenNothingKnown, throwWhenMissing: false);
        }
        Plane(network, plane, e, n, seedWhenNothingKnown, throwWhenMissing: true);
    }

    private static void Plane(SurveyNetwork network, IReadOnlyCollection<string> plane, Dictionary<string, double> e, Dictionary<string, double> n,
        bool seedWhenNothingKnown, bool throwWhenMissing)
    {
        var known = new Dictionary<string, PlanePoint>(StringComparer.Ordinal);
        foreach (var id in plane)
            if (e.TryGetValue(id, out double x) && n.TryGetValue(id, out double y)) known[id] = new PlanePoint(x, y);
        var order = network.Points.Select(p => p.Id).Where(plane.Contains).ToList();
        if (known.Count == 0 && order.Count > 0)
        {
            if (!seedWhenNothingKnown) return; // the datum diagnosis reports this case
            Seed(network, order, known);
        }

        var sets = network.Observations.OfType<DirectionObservation>().GroupBy(d => d.SetId, StringComparer.Ordinal)
            .ToDictionary(g => g.Key, g => g.ToList(), StringComparer.Ordinal);
        // Unambiguous constructions first; two-solution cases that nothing decides only as a last resort.
        foreach (bool ties in new[] { false, true })
        {
            Propagate(network, order, known, sets, ties);
            LocalFrames(network, order, known, sets, ties);
        }

        var missing = order.Where(id => !known.ContainsKey(id)).ToList();
        if (missing.Count > 0 && throwWhenMissing)
        {
            var orientation = new Dictionary<string, double>(StringComparer.Ordinal);
            OrientSets(sets, known, orientation);
            var lines = missing.Select(id => Explain(network, id, known, orientation, sets));
            throw new InvalidInputException(
                "Approximate coordinates cannot be computed for these points from the observations and the points with coordinates:" +
                Environment.NewLine + "  " + string.Join(Environment.NewLine + "  ", lines) + Environment.NewLine +
                "A point is reached by a direction and a distance from one located station, by directions from two located stations, " +
                "by directions to three located points, or by two distances. Give approximate coordinates (e, n) for it, or add observations.");
        }
        foreach (var (id, p) in known)
        {
            e[id] = p.E;
            n[id] = p.N;
        }
    }

    /// <summary>
    /// Fills in heights of points in <paramref name="height"/> that lack them by a breadth-first spanning tree of
    /// height differences from the points with heights. A part of the level network with no height at all starts
    /// from 0 at its first point (the datum diagnosis decides whether that is allowed).
    /// </summary>
    /// <param name="network">The network.</param>
    /// <param name="height">Points taking part in height differences.</param>
    /// <param name="h">Heights known so far, completed in place.</param>
    public static void Heights(SurveyNetwork network, IReadOnlyCollection<string> height, Dictionary<string, double> h)
    {
        var edges = new Dictionary<string, List<(string To, double Dh)>>(StringComparer.Ordinal);
        // Set-aside observations last, so that they are used only where nothing else reaches.
        foreach (var o in network.Observations.OfType<HeightDifferenceObservation>().OrderBy(x => x.Excluded))
        {
            Edge(edges, o.From).Add((o.To, o.Value));
            Edge(edges, o.To).Add((o.From, -o.Value));
        }
        var queue = new Queue<string>(network.Points.Select(p => p.Id).Where(id => height.Contains(id) && h.ContainsKey(id)));
        void Spread()
        {
            while (queue.Count > 0)
            {
                string a = queue.Dequeue();
                foreach (var (b, dh) in edges.GetValueOrDefault(a) ?? [])
                    if (!h.ContainsKey(b)) { h[b] = h[a] + dh; queue.Enqueue(b); }
            }
        }
        Spread();
        foreach (var id in network.Points.Select(p => p.Id).Where(height.Contains))
            if (!h.ContainsKey(id)) { h[id] = 0; queue.Enqueue(id); Spread(); }
    }

    /// <summary>
    /// Points the control cannot reach directly (e.g. no direction set sees a located point): the part is built in
    /// a local frame from one of them, then carried onto the located points by a plane similarity transformation
    /// fitted to the (at least two) points common to both; rigid when distances are observed.
    /// </summary>
    private static void LocalFrames(SurveyNetwork network, List<string> order, Dictionary<string, PlanePoint> known,
        Dictionary<string, List<DirectionObservation>> sets, bool ties)
    {
        bool distances = network.Observations.Any(o => o.Kind == ObservationKind.Distance && !o.Excluded);
        var tried = new HashSet<string>(StringComparer.Ordinal);
        while (order.FirstOrDefault(id => !known.ContainsKey(id) && !tried.Contains(id)) is string start)
        {
            tried.Add(start);
            var local = new Dictionary<string, PlanePoint>(StringComparer.Ordinal);
            Seed(network, [start], local);
            Propagate(network, order, local, sets, ties);
            var common = local.Keys.Where(known.ContainsKey).ToList();
            if (common.Count < 2 || local.Keys.All(known.ContainsKey)) continue;
            var map = Similarity(common.Select(id => local[id]).ToList(), common.Select(id => known[id]).ToList(), rigid: distances);
            foreach (var (id, p) in local)
                if (!known.ContainsKey(id)) known[id] = map(p);
            Propagate(network, order, known, sets, ties);
        }
    }

    /// <summary>Locates every point it can from <paramref name="known"/>, in rounds, until nothing more can be reached.</summary>
    private static void Propagate(SurveyNetwork network, List<string> order, Dictionary<string, PlanePoint> known,
        Dictionary<string, List<DirectionObservation>> sets, bool ties)
    {
        // Breadth-first rounds: each round locates every point it can from the points located before it, so a point
        // is reached by the shortest chain of constructions and errors do not pile up along one long chain.
        // Only points next to those located in the last round (or seen in the same direction set) are re-examined.
        var orientation = new Dictionary<string, double>(StringComparer.Ordinal);
        var rank = new Dictionary<string, int>(order.Count, StringComparer.Ordinal);
        for (int k = 0; k < order.Count; k++) rank[order[k]] = k;
        var candidates = new HashSet<string>(order.Where(id => !known.ContainsKey(id)), StringComparer.Ordinal);
        var fresh = known.Keys.ToList();
        var parents = new Dictionary<string, string?>(StringComparer.Ordinal);
        var generation = known.Keys.ToDictionary(k => k, _ => 0, StringComparer.Ordinal);
        int round = 0;
        int Gen(string id) => generation.GetValueOrDefault(id, int.MaxValue);
        while (true)
        {
            round++;
            OrientSets(sets, known, orientation, fresh);
            var found = new List<(string Id, PlanePoint P)>();
            var pending = candidates.Where(c => !known.ContainsKey(c)).OrderBy(c => rank.GetValueOrDefault(c, int.MaxValue)).ToList();
            // The strongest constructions first: a round uses resection only when no polar point or intersection is
            // possible anywhere, and two-solution constructions only when no resection is.
            // Level −1: polar points only from a station their own sets see back (a point whose sets see none of its
            // polar stations waits a round, when a better one may be located).
            for (int level = -1; level < 3 && found.Count == 0; level++)
                foreach (var id in pending)
                    if (Locate(network, id, known, orientation, sets, allowTie: false, out var parent, level, Gen) is PlanePoint p) { found.Add((id, p)); parents[id] = parent; }
            if (found.Count == 0 && ties)
            {
                // Nothing unambiguous left: accept the first ambiguous two-solution case (deterministic choice).
                foreach (var id in order)
                {
                    if (known.ContainsKey(id)) continue;
                    if (Locate(network, id, known, orientation, sets, allowTie: true, out _, 2) is PlanePoint p) { found.Add((id, p)); break; }
                }
            }
            if (found.Count == 0) return;
            candidates.Clear();
            fresh = found.Select(f => f.Id).ToList();
            // Sets at the new stations are oriented from the points located before this round (the chain that
            // located the station), not from points of the same round: those carry independent errors of the same
            // size, and orienting on them would double the error at every round.
            // A polar point's sets are oriented on the station that located it, when they see it: the new set then
            // inherits that station's orientation error instead of adding an independent one.
            foreach (var (id, p) in found)
                foreach (var setId in SetsOf(sets, id).Where(k => sets[k][0].Station == id))
                {
                    var dirs = sets[setId];
                    string? parent = parents.GetValueOrDefault(id);
                    if (parent is not null && dirs.Any(d => d.Target == parent))
                        OrientOne(setId, dirs, p, known, orientation, t => t == parent);
                    else
                    {
                        int oldest = dirs.Where(d => known.ContainsKey(d.Target)).Select(d => generation[d.Target]).DefaultIfEmpty(-1).Min();
                        OrientOne(setId, dirs, p, known, orientation, t => generation.TryGetValue(t, out int g) && g == oldest);
                    }
                }
            foreach (var (id, _) in found) generation[id] = round;
            foreach (var (id, p) in found)
            {
                known[id] = p;
                foreach (var o in ObservationsOf(network, id))
                {
                    candidates.UnionWith(o.Points);
                    if (o is DirectionObservation d) candidates.UnionWith(sets[d.SetId].Select(x => x.Target).Append(d.Station));
                }
            }
            if (ties) candidates.UnionWith(order.Where(id => !known.ContainsKey(id))); // ambiguous cases may unlock anything
        }
    }

    /// <summary>
    /// The plane similarity (Helmert) transformation y = c·x + t in complex form (z = E + iN), fitted by least
    /// squares to point pairs; with <paramref name="rigid"/> the scale is set to 1. One pair gives a translation.
    /// </summary>
    private static Func<PlanePoint, PlanePoint> Similarity(List<PlanePoint> from, List<PlanePoint> to, bool rigid)
    {
        double fe = from.Average(p => p.E), fn = from.Average(p => p.N), te = to.Average(p => p.E), tn = to.Average(p => p.N);
        double cr = 1, ci = 0;
        if (from.Count >= 2)
        {
            // c = Σ conj(x')·y' / Σ |x'|²
            double sr = 0, si = 0, ss = 0;
            for (int k = 0; k < from.Count; k++)
            {
                double xe = from[k].E - fe, xn = from[k].N - fn, ye = to[k].E - te, yn = to[k].N - tn;
                sr += (xe * ye) + (xn * yn);
                si += (xe * yn) - (xn * ye);
                ss += (xe * xe) + (xn * xn);
            }
            if (ss > 0) { cr = sr / ss; ci = si / ss; }
            double m = Math.Sqrt((cr * cr) + (ci * ci));
            if (rigid && m > 0) { cr /= m; ci /= m; }
        }
        return p =>
        {
            double xe = p.E - fe, xn = p.N - fn;
            return new PlanePoint(te + (cr * xe) - (ci * xn), tn + (ci * xe) + (cr * xn));
        };
    }

    private static List<(string To, double Dh)> Edge(Dictionary<string, List<(string, double)>> edges, string id)
    {
        if (!edges.TryGetValue(id, out var list)) edges[id] = list = [];
        return list;
    }

    /// <summary>A local frame for a network without any coordinates: the first point at (0, 0), a neighbour north of it.</summary>
    private static void Seed(SurveyNetwork network, IReadOnlyList<string> order, Dictionary<string, PlanePoint> known)
    {
        string first = order[0];
        known[first] = new PlanePoint(0, 0);
        // A neighbour at its observed distance (100 m if none), on the observed azimuth (north if none).
        var mine = ObservationsOf(network, first);
        var dist = mine.OfType<DistanceObservation>().FirstOrDefault();
        string? other = dist is null ? null : dist.From == first ? dist.To : dist.From;
        other ??= mine.Where(o => ObservationKindRegistry.IsHorizontal(o.Kind))
            .SelectMany(o => o.Points).FirstOrDefault(p => p != first);
        if (other is null) return;
        double d = dist?.Value ?? 100.0;
        var az = mine.OfType<AzimuthObservation>().FirstOrDefault(a => (a.From == first && a.To == other) || (a.To == first && a.From == other));
        double t = az is null ? 0 : az.From == first ? az.Value : az.Value + Math.PI;
        known[other] = new PlanePoint(d * Math.Sin(t), d * Math.Cos(t));
    }

    /// <summary>Orients the not yet oriented sets at located stations that see a newly located point (or are new themselves).</summary>
    private static void OrientSets(Dictionary<string, List<DirectionObservation>> sets, Dictionary<string, PlanePoint> known,
        Dictionary<string, double> orientation, IEnumerable<string>? fresh = null)
    {
        var touched = fresh is null ? sets.Keys.ToHashSet(StringComparer.Ordinal) : new HashSet<string>(StringComparer.Ordinal);
        if (fresh is not null)
            foreach (var id in fresh)
                foreach (var k in SetsOf(sets, id)) touched.Add(k);
        foreach (var setId in touched.OrderBy(k => k, StringComparer.Ordinal))
        {
            var dirs = sets[setId];
            // Oriented once, from the targets located first (the shortest chains): later targets carry the larger
            // errors of longer chains and would feed them back into the orientation.
            if (orientation.ContainsKey(setId) || !known.TryGetValue(dirs[0].Station, out var st)) continue;
            if (!orientation.ContainsKey(setId))            OrientOne(setId, dirs, st, known, orientation);
        }
    }

    /// <summary>Orients one set at a station at <paramref name="st"/> from its located targets (circular mean of azimuth − reading).</summary>
    private static void OrientOne(string setId, List<DirectionObservation> dirs, PlanePoint st, Dictionary<string, PlanePoint> known,
        Dictionary<string, double> orientation, Func<string, bool>? use = null)
    {
        if (orientation.ContainsKey(setId)) return;
        double first = double.NaN, sum = 0;
        int count = 0;
        foreach (var d in dirs)
        {
            if (!known.TryGetValue(d.Target, out var tp) || (use is not null && !use(d.Target))) continue;
            double w = Az(st, tp) - d.Reading.Radians;
            if (count == 0) first = w;
            sum += Angle.ReduceSigned(w - first);
            count++;
        }
        if (count > 0) orientation[setId] = first + (sum / count);
    }

    private static readonly ConditionalWeakTable<Dictionary<string, List<DirectionObservation>>, Dictionary<string, List<string>>> SetsByPoint = new();

    /// <summary>The ids of the direction sets a point is the station or a target of.</summary>
    private static List<string> SetsOf(Dictionary<string, List<DirectionObservation>> sets, string id) =>
        SetsByPoint.GetValue(sets, static all =>
        {
            var map = new Dictionary<string, List<string>>(StringComparer.Ordinal);
            foreach (var (k, dirs) in all)
                foreach (var p in dirs.Select(d => d.Target).Append(dirs[0].Station).Distinct(StringComparer.Ordinal))
                {
                    if (!map.TryGetValue(p, out var list)) map[p] = list = [];
                    list.Add(k);
                }
            return map;
        }).GetValueOrDefault(id) ?? [];

    private static double Az(PlanePoint a, PlanePoint b) => Angle.Reduce0To2Pi(Math.Atan2(b.E - a.E, b.N - a.N));

    private static double Dist(PlanePoint a, PlanePoint b) => Math.Sqrt(((b.E - a.E) * (b.E - a.E)) + ((b.N - a.N) * (b.N - a.N)));

    /// <summary>Everything that ties point <paramref name="id"/> to located points.</summary>
    private static (List<Ray> Rays, List<Span> Spans, List<Cut> Cuts) Gather(SurveyNetwork network, string id,
        Dictionary<string, PlanePoint> known, Dictionary<string, double> orientation, Dictionary<string, List<DirectionObservation>> sets)
    {
        var rays = new List<Ray>();
        var spans = new List<Span>();
        var cuts = new List<Cut>();
        foreach (var o in ObservationsOf(network, id))
        {
            switch (o)
            {
                case DistanceObservation d when d.From == id && known.TryGetValue(d.To, out var q):
                    spans.Add(new Span(d.To, q, d.Value, d.StandardDeviation)); break;
                case DistanceObservation d when d.To == id && known.TryGetValue(d.From, out var q):
                    spans.Add(new Span(d.From, q, d.Value, d.StandardDeviation)); break;
                case AzimuthObservation a when a.To == id && known.TryGetValue(a.From, out var q):
                    rays.Add(new Ray(a.From, q, a.Value, a.StandardDeviation)); break;
                case AzimuthObservation a when a.From == id && known.TryGetValue(a.To, out var q):
                    rays.Add(new Ray(a.To, q, Angle.Reduce0To2Pi(a.Value + Math.PI), a.StandardDeviation)); break;
                case DirectionObservation d when d.Target == id && orientation.TryGetValue(d.SetId, out double w) && known.TryGetValue(d.Station, out var q):
                    rays.Add(new Ray(d.Station, q, Angle.Reduce0To2Pi(d.Reading.Radians + w), d.StandardDeviation)); break;
                case AngleObservation g when g.Station != id && known.TryGetValue(g.Station, out var s):
                    if (g.Foresight == id && known.TryGetValue(g.Backsight, out var b))
                        rays.Add(new Ray(g.Station, s, Angle.Reduce0To2Pi(Az(s, b) + g.Value), g.StandardDeviation));
                    else if (g.Backsight == id && known.TryGetValue(g.Foresight, out var f))
                        rays.Add(new Ray(g.Station, s, Angle.Reduce0To2Pi(Az(s, f) - g.Value), g.StandardDeviation));
                    break;
                case AngleObservation g when g.Station == id && known.TryGetValue(g.Backsight, out var bb) && known.TryGetValue(g.Foresight, out var ff):
                    cuts.Add(new Cut(g.Backsight, bb, g.Foresight, ff, g.Value, g.StandardDeviation)); break;
            }
        }
        // Direction sets at the point: every located target against the set's first located target.
        foreach (var dirs in ObservationsOf(network, id).OfType<DirectionObservation>().Where(d => d.Station == id)
                     .Select(d => d.SetId).Distinct(StringComparer.Ordinal).Select(k => sets[k]))
        {
            var located = dirs.Where(d => known.ContainsKey(d.Target)).ToList();
            for (int k = 1; k < located.Count; k++)
                cuts.Add(new Cut(located[0].Target, known[located[0].Target], located[k].Target, known[located[k].Target],
                    Angle.Reduce0To2Pi(located[k].Reading.Radians - located[0].Reading.Radians), Math.Sqrt(2) * located[k].StandardDeviation));
        }
        return (rays, spans, cuts);
    }

    /// <summary>Sum of squared standardised misfits of a candidate position against everything that ties it to located points.</summary>
    private static double Misfit(PlanePoint x, List<Ray> rays, List<Span> spans, List<Cut> cuts)
    {
        double s = 0;
        foreach (var r in rays) s += Sq(Angle.ReduceSigned(Az(r.At, x) - r.Azimuth) / r.Sd);
        foreach (var d in spans) s += Sq((Dist(d.At, x) - d.Distance) / d.Sd);
        foreach (var c in cuts) s += Sq(Angle.ReduceSigned(Az(x, c.AtY) - Az(x, c.AtX) - c.Angle) / c.Sd);
        return s;
    }

    private static double Sq(double v) => v * v;

    private static readonly ConditionalWeakTable<SurveyNetwork, Dictionary<string, List<Observation>>> ByPoint = new();

    /// <summary>The observations that involve a point, in input order (indexed once per network).</summary>
    internal static List<Observation> ObservationsOf(SurveyNetwork network, string id) =>
        ByPoint.GetValue(network, static n =>
        {
            var map = new Dictionary<string, List<Observation>>(StringComparer.Ordinal);
            foreach (var o in n.Observations)
                foreach (var p in o.Points)
                {
                    if (!map.TryGetValue(p, out var list)) map[p] = list = [];
                    list.Add(o);
                }
            return map;
        }).GetValueOrDefault(id) ?? [];

    private static PlanePoint? Locate(SurveyNetwork network, string id, Dictionary<string, PlanePoint> known,
        Dictionary<string, double> orientation, Dictionary<string, List<DirectionObservation>> sets, bool allowTie, out string? parent, int level = 2,
        Func<string, int>? generation = null)
    {
        parent = null;
        var (rays, spans, cuts) = Gather(network, id, known, orientation, sets);

        // Polar: a ray and a distance from the same station; from the station reached by the shortest chain.
        // Prefer a station that the point's own direction sets see back, so that they can be oriented on it.
        if (generation is not null)
        {
            var seen = ObservationsOf(network, id).OfType<DirectionObservation>().Where(d => d.Station == id).Select(d => d.Target).ToHashSet(StringComparer.Ordinal);
            rays = rays.OrderBy(r => seen.Contains(r.Origin) ? 0 : 1).ThenBy(r => generation(r.Origin)).ToList();
            if (level < 0 && seen.Count > 0) rays = rays.Where(r => seen.Contains(r.Origin)).ToList();
        }
        foreach (var r in rays)
            foreach (var d in spans.Where(d => d.Origin == r.Origin))
            {
                parent = r.Origin;
                return new PlanePoint(r.At.E + (d.Distance * Math.Sin(r.Azimuth)), r.At.N + (d.Distance * Math.Cos(r.Azimuth))); }

        // Intersection: the best-conditioned pair of rays from different stations.
        PlanePoint? best = null;
        double bestSin = Math.Sin(MinCut);
        for (int a = 0; a < rays.Count; a++)
            for (int b = a + 1; b < rays.Count; b++)
            {
                if (rays[a].Origin == rays[b].Origin) continue;
                if (Intersect(rays[a], rays[b]) is (PlanePoint p, double sin) && sin > bestSin) { best = p; bestSin = sin; }
            }
        if (best is not null)        if (best is not null || level <= 0) return best;

        // Resection from angles at the point.
        if (Resect(cuts) is PlanePoint res && Misfit(res, [], [], cuts) < 1e6 * Math.Max(1, cuts.Count)) return res;

        if (level == 1) return null;

        // Two-solution constructions: ray–distance, distance–distance.
        var candidates = new List<(PlanePoint, PlanePoint)>();
        foreach (var r in rays)
            foreach (var d in spans.Where(d => d.Origin != r.Origin))
                if (RayCircle(r, d) is var (p1, p2)) candidates.Add((p1, p2));
        for (int a = 0; a < spans.Count; a++)
            for (int b = a + 1; b < spans.Count; b++)
                if (spans[a].Origin != spans[b].Origin && CircleCircle(spans[a], spans[b]) is var (p1, p2)) candidates.Add((p1, p2));
        foreach (var (p1, p2) in candidates)
        {
            double m1 = Misfit(p1, rays, spans, cuts), m2 = Misfit(p2, rays, spans, cuts);
            // The two solutions fit the observations that made them equally; the others decide (3σ margin).
            if (Math.Abs(m1 - m2) > 9) return m1 < m2 ? p1 : p2;
            if (allowTie) return p1;
        }
        return null;
    }

    /// <summary>Intersection of two rays; null when they do not meet ahead of both stations. Also returns |sin| of the cut angle.</summary>
    private static (PlanePoint, double)? Intersect(Ray a, Ray b)
    {
        double ua = Math.Sin(a.Azimuth), va = Math.Cos(a.Azimuth), ub = Math.Sin(b.Azimuth), vb = Math.Cos(b.Azimuth);
        // a.At + s (ua, va) = b.At + t (ub, vb)
        double det = (ua * -vb) - (va * -ub);
        if (Math.Abs(det) < 1e-12) return null;
        double de = b.At.E - a.At.E, dn = b.At.N - a.At.N;
        double s = ((de * -vb) - (dn * -ub)) / det;
        double t = ((ua * dn) - (va * de)) / det;
        if (!(s > 0) || !(t > 0)) return null;
        return (new PlanePoint(a.At.E + (s * ua), a.At.N + (s * va)), Math.Abs(det));
    }

    private static (PlanePoint, PlanePoint)? RayCircle(Ray r, Span c)
    {
        double ue = Math.Sin(r.Azimuth), un = Math.Cos(r.Azimuth);
        double fe = r.At.E - c.At.E, fn = r.At.N - c.At.N;
        // s² + 2 s (u·f) + |f|² − d² = 0
        double bh = (ue * fe) + (un * fn), cc = (fe * fe) + (fn * fn) - (c.Distance * c.Distance);
        double disc = (bh * bh) - cc;
        if (disc < 0) return null;
        double s1 = -bh + Math.Sqrt(disc), s2 = -bh - Math.Sqrt(disc);
        if (!(s1 > 0)) return null;
        var p1 = new PlanePoint(r.At.E + (s1 * ue), r.At.N + (s1 * un));
        var p2 = s2 > 0 ? new PlanePoint(r.At.E + (s2 * ue), r.At.N + (s2 * un)) : p1;
        return (p1, p2);
    }

    private static (PlanePoint, PlanePoint)? CircleCircle(Span a, Span b)
    {
        double de = b.At.E - a.At.E, dn = b.At.N - a.At.N;
        double d = Math.Sqrt((de * de) + (dn * dn));
        if (d < 1e-9 || d > a.Distance + b.Distance || d < Math.Abs(a.Distance - b.Distance))
        {
            // Slightly inconsistent distances (tangent circles): accept the touching point.
            if (d < 1e-9 || Math.Abs(d - (a.Distance + b.Distance)) > 1e-3 * d && Math.Abs(d - Math.Abs(a.Distance - b.Distance)) > 1e-3 * d) return null;
        }
        double x = ((a.Distance * a.Distance) - (b.Distance * b.Distance) + (d * d)) / (2 * d);
        double y = Math.Sqrt(Math.Max(0, (a.Distance * a.Distance) - (x * x)));
        double ee = de / d, en = dn / d;
        var m = new PlanePoint(a.At.E + (x * ee), a.At.N + (x * en));
        // Two solutions on either side of the line a→b; the one on its right (clockwise) first.
        return (new PlanePoint(m.E + (y * en), m.N - (y * ee)), new PlanePoint(m.E - (y * en), m.N + (y * ee)));
    }

    /// <summary>
    /// Closed-form resection. With w = N + iE, azimuths are arguments, and the clockwise angle θ from located A to
    /// located T seen from the unknown P satisfies Im(e^(−iθ) (w_T − z) conj(w_A − z)) = 0 with z = w_P. Taking A
    /// as origin and dividing by |z|² makes this linear in q = 1/z: Im(e^(−iθ) w_T q) = −sin θ. Two or more targets
    /// besides A give q by least squares, and P = A + 1/q. (Each equation is the circle through A and T on which
    /// the angle is seen; inverting at A turns the circles into lines — the classical geometric solution.)
    /// Fails (null) when P lies near the circle through the targets ("danger circle").
    /// </summary>
    private static PlanePoint? Resect(List<Cut> cuts)
    {
        if (cuts.Count < 2) return null;
        // Choose as reference the located point that appears in most cuts.
        var refs = cuts.SelectMany(c => new[] { c.X, c.Y }).GroupBy(s => s).OrderByDescending(g => g.Count()).ThenBy(g => g.Key, StringComparer.Ordinal);
        foreach (var g in refs)
        {
            string a = g.Key;
            var eqs = new List<(double Bx, double Ay, double Rhs, string Other)>();
            PlanePoint pa = default;
            foreach (var c in cuts)
            {
                PlanePoint t;
                double theta;
                if (c.X == a) { pa = c.AtX; t = c.AtY; theta = c.Angle; }
                else if (c.Y == a) { pa = c.AtY; t = c.AtX; theta = -c.Angle; }
                else continue;
                // c = e^(−iθ) w'_T = (cosθ − i sinθ)(dN + i dE)
                double dN = t.N - pa.N, dE = t.E - pa.E;
                double re = (Math.Cos(theta) * dN) + (Math.Sin(theta) * dE);
                double im = (Math.Cos(theta) * dE) - (Math.Sin(theta) * dN);
                // Im(c q) = re·y + im·x = −sin θ, q = x + i y
                eqs.Add((im, re, -Math.Sin(theta), c.X == a ? c.Y : c.X));
            }
            if (eqs.Select(q => q.Other).Distinct().Count() < 2) continue;
            double sxx = 0, sxy = 0, syy = 0, bx = 0, by = 0;
            foreach (var (cx, cy, r, _) in eqs)
            {
                double norm = 1 / ((cx * cx) + (cy * cy)); // equations scaled to unit coefficient norm
                sxx += cx * cx * norm; sxy += cx * cy * norm; syy += cy * cy * norm;
                bx += cx * r * norm; by += cy * r * norm;
            }
            double det = (sxx * syy) - (sxy * sxy);
            if (det < 1e-6 * Math.Max(sxx * syy, 1e-300)) continue; // danger circle or repeated target
            double qx = ((syy * bx) - (sxy * by)) / det, qy = ((sxx * by) - (sxy * bx)) / det;
            double q2 = (qx * qx) + (qy * qy);
            if (!(q2 > 0) || !double.IsFinite(q2)) continue;
            // z = 1/q = conj(q)/|q|²: Re z = N offset, Im z = E offset
            return new PlanePoint(pa.E + (-qy / q2), pa.N + (qx / q2));
        }
        return null;
    }

    private static string Explain(SurveyNetwork network, string id, Dictionary<string, PlanePoint> known,
        Dictionary<string, double> orientation, Dictionary<string, List<DirectionObservation>> sets)
    {
        var (rays, spans, cuts) = Gather(network, id, known, orientation, sets);
        var p = network[id];
        string name = p.Source is null ? id : $"{id} ({p.Source})";
        int all = ObservationsOf(network, id).Count;
        string Count(int k, string what) => k == 1 ? $"1 {what}" : $"{k} {what}s";
        return $"{name}: from located points it has {Count(spans.Count, "distance")}, {Count(rays.Count, "oriented direction or azimuth")} " +
               $"and {Count(cuts.Count, "angle at the point")} ({Count(all, "observation")} in all); " +
               (all == 0 ? "no observation reaches it" : "that does not fix its position");
    }
}
