using System.Globalization;
using NetAdjust.Geometry;
using NetAdjust.Network;

namespace NetAdjust.Adjustment.Approximation;

/// <summary>
/// Locates the plane points of one network from the located ones, in breadth-first rounds of constructions,
/// strongest first (<see cref="ConstructionStrength"/>). One locator works on one observation index; it keeps no
/// state between calls of <see cref="Locate(IReadOnlyCollection{string}, Dictionary{string, double},
/// Dictionary{string, double}, bool, bool)"/>.
/// </summary>
internal sealed class PlaneLocator(ObservationIndex index)
{
    private IReadOnlyDictionary<string, List<DirectionObservation>> Sets => index.Sets;

    /// <summary>Two-solution candidates weighed against a point's measurements on this thread (for the tests of the
    /// constructions' cost).</summary>
    [ThreadStatic] internal static int CandidatesWeighed;

    /// <summary>
    /// Fills in plane coordinates of every point in <paramref name="plane"/> that lacks them.
    /// </summary>
    /// <param name="plane">Points taking part in horizontal observations.</param>
    /// <param name="e">Eastings known so far, completed in place.</param>
    /// <param name="n">Northings, completed in place.</param>
    /// <param name="seedWhenNothingKnown">When no point has coordinates, start a local frame at the first
    /// point.</param>
    /// <param name="throwWhenMissing">Whether a point that cannot be reached is an error.</param>
    /// <exception cref="InvalidInputException">Naming each point that cannot be reached and what it lacks.</exception>
    public void Locate(IReadOnlyCollection<string> plane, Dictionary<string, double> e, Dictionary<string, double> n,
        bool seedWhenNothingKnown, bool throwWhenMissing)
    {
        var network = index.Network;
        var known = new Dictionary<string, PlanePoint>(StringComparer.Ordinal);
        foreach (var id in plane)
            if (e.TryGetValue(id, out double x) && n.TryGetValue(id, out double y)) known[id] = new PlanePoint(x, y);
        var order = network.Points.Select(p => p.Id).Where(plane.Contains).ToList();
        if (known.Count == 0 && order.Count > 0)
        {
            if (!seedWhenNothingKnown) return; // the datum diagnosis reports this case
            Seed(order[0], known);
        }

        // Unambiguous constructions first; two-solution cases that nothing decides only as a last resort.
        foreach (bool ties in new[] { false, true })
        {
            Propagate(order, known, ties);
            LocalFrames(order, known, ties);
        }

        var missing = order.Where(id => !known.ContainsKey(id)).ToList();
        if (missing.Count > 0 && throwWhenMissing)
        {
            var orientation = new Dictionary<string, double>(StringComparer.Ordinal);
            OrientSets(known, orientation);
            var lines = missing.Select(id => Explain(id, known, orientation));
            throw new InvalidInputException(
                "Approximate coordinates cannot be computed for these points from the observations and the points " +
                "with coordinates:" + Environment.NewLine + "  " + string.Join(Environment.NewLine + "  ", lines) +
                Environment.NewLine + "A point is reached by a direction and a distance from one located station, by " +
                "directions from two located stations, by directions to three located points, or by two distances. " +
                "Give approximate coordinates (e, n) for it, or add observations.");
        }
        foreach (var (id, p) in known)
        {
            e[id] = p.E;
            n[id] = p.N;
        }
    }

    /// <summary>
    /// Points the control cannot reach directly (e.g. no direction set sees a located point): the part is built in
    /// a local frame from one of them, then carried onto the located points by a plane similarity transformation
    /// fitted to the (at least two) points common to both; rigid when distances are observed.
    /// </summary>
    private void LocalFrames(List<string> order, Dictionary<string, PlanePoint> known, bool ties)
    {
        bool distances = index.Network.Observations.Any(ApproximationOffers.FixesScale);
        var tried = new HashSet<string>(StringComparer.Ordinal);
        while (order.FirstOrDefault(id => !known.ContainsKey(id) && !tried.Contains(id)) is string start)
        {
            tried.Add(start);
            var local = new Dictionary<string, PlanePoint>(StringComparer.Ordinal);
            Seed(start, local);
            Propagate(order, local, ties);
            var common = local.Keys.Where(known.ContainsKey).ToList();
            if (common.Count < 2 || local.Keys.All(known.ContainsKey)) continue;
            var map = Constructions.Similarity(common.Select(id => local[id]).ToList(),
                common.Select(id => known[id]).ToList(), rigid: distances);
            foreach (var (id, p) in local)
                if (!known.ContainsKey(id)) known[id] = map(p);
            Propagate(order, known, ties);
        }
    }

    /// <summary>Locates every point it can from <paramref name="known"/>, in rounds, until nothing more is
    /// reached.</summary>
    private void Propagate(List<string> order, Dictionary<string, PlanePoint> known, bool ties)
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
            OrientSets(known, orientation, fresh);
            var found = new List<(string Id, PlanePoint P)>();
            var pending = candidates.Where(c => !known.ContainsKey(c))
                .OrderBy(c => rank.GetValueOrDefault(c, int.MaxValue)).ToList();
            // The strongest constructions first: every pending point is tried at one strength before any is tried
            // at the next, and the round ends at the first strength that locates a point.
            for (var strength = ConstructionStrength.SeenBack;
                 strength <= ConstructionStrength.DecidedIntersection && found.Count == 0; strength++)
                foreach (var id in pending)
                    if (Construct(id, known, orientation, strength, out var parent, Gen) is PlanePoint p)
                    {
                        found.Add((id, p));
                        parents[id] = parent;
                    }
            if (found.Count == 0 && ties)
            {
                // Nothing unambiguous left: accept the first ambiguous two-solution case (deterministic choice).
                foreach (var id in order)
                {
                    if (known.ContainsKey(id)) continue;
                    if (Construct(id, known, orientation, ConstructionStrength.UndecidedIntersection, out _)
                        is PlanePoint p) { found.Add((id, p)); break; }
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
                foreach (var setId in index.SetsOf(id).Where(k => Sets[k][0].Station == id))
                {
                    var dirs = Sets[setId];
                    string? parent = parents.GetValueOrDefault(id);
                    if (parent is not null && dirs.Any(d => d.Target == parent))
                        OrientOne(setId, p, known, orientation, t => t == parent);
                    else
                    {
                        int oldest = dirs.Where(d => known.ContainsKey(d.Target)).Select(d => generation[d.Target])
                            .DefaultIfEmpty(-1).Min();
                        OrientOne(setId, p, known, orientation,
                            t => generation.TryGetValue(t, out int g) && g == oldest);
                    }
                }
            foreach (var (id, _) in found) generation[id] = round;
            foreach (var (id, p) in found)
            {
                known[id] = p;
                foreach (var o in index.ObservationsOf(id))
                {
                    candidates.UnionWith(o.Points);
                    if (ApproximationOffers.SetMember(o) is DirectionObservation d)
                        candidates.UnionWith(Sets[d.SetId].Select(x => x.Target).Append(d.Station));
                }
            }
            // Ambiguous cases may unlock anything.
            if (ties) candidates.UnionWith(order.Where(id => !known.ContainsKey(id)));
        }
    }

    /// <summary>A local frame: the first point at (0, 0), a neighbour at its observed distance and azimuth.</summary>
    private void Seed(string first, Dictionary<string, PlanePoint> known)
    {
        known[first] = new PlanePoint(0, 0);
        if (ApproximationOffers.SeedNeighbour(index, first) is var (other, at)) known[other] = at;
    }

    /// <summary>Orients the not yet oriented sets at located stations that see a newly located point (or are new
    /// themselves); all sets when <paramref name="fresh"/> is null.</summary>
    private void OrientSets(Dictionary<string, PlanePoint> known, Dictionary<string, double> orientation,
        IEnumerable<string>? fresh = null)
    {
        var touched = fresh is null
            ? Sets.Keys.ToHashSet(StringComparer.Ordinal)
            : new HashSet<string>(StringComparer.Ordinal);
        if (fresh is not null)
            foreach (var id in fresh)
                foreach (var k in index.SetsOf(id)) touched.Add(k);
        foreach (var setId in touched.OrderBy(k => k, StringComparer.Ordinal))
        {
            // Oriented once, from the targets located first (the shortest chains): later targets carry the larger
            // errors of longer chains and would feed them back into the orientation.
            if (orientation.ContainsKey(setId) || !known.TryGetValue(Sets[setId][0].Station, out var st)) continue;
            OrientOne(setId, st, known, orientation);
        }
    }

    /// <summary>Orients one set at a station at <paramref name="st"/> from its located targets (those
    /// <paramref name="use"/> accepts), unless it is oriented already.</summary>
    private void OrientOne(string setId, PlanePoint st, Dictionary<string, PlanePoint> known,
        Dictionary<string, double> orientation, Func<string, bool>? use = null)
    {
        if (orientation.ContainsKey(setId)) return;
        var sightings = Sets[setId].Where(d => known.ContainsKey(d.Target) && (use is null || use(d.Target)))
            .Select(d => (known[d.Target], d.Reading.Radians));
        if (SetOrientation.Mean(st, sightings) is double w) orientation[setId] = w;
    }

    /// <summary>
    /// Largest root-mean-square standardised misfit of the angles of a resection, in σ, above which it is rejected:
    /// 100σ. Noise and the blunders the w-test is there to find stay well below; beyond it an angle, a reading or
    /// a located point's coordinates is wrong and the resection would hide it (a choice of this project,
    /// docs/methods.md). An exactly determined resection (three targets) always fits.
    /// </summary>
    internal const double ResectionMisfitLimit = 100;

    private static bool IsRejected(PlanePoint resected, List<AngleAtPoint> cuts) =>
        Math.Sqrt(Constructions.Misfit(resected, [], [], cuts) / cuts.Count) > ResectionMisfitLimit;

    /// <summary>
    /// Locates point <paramref name="id"/> by the constructions of <paramref name="strength"/> and the stronger
    /// ones (a point tried at a strength was tried, without success, at the stronger ones in the same round);
    /// null when none applies.
    /// </summary>
    private PlanePoint? Construct(string id, Dictionary<string, PlanePoint> known,
        Dictionary<string, double> orientation, ConstructionStrength strength, out string? parent,
        Func<string, int>? generation = null)
    {
        parent = null;
        var (rays, circles, cuts) = ApproximationOffers.Gather(index, id, known, orientation);

        // Polar: a ray and a distance from the same station; from the station reached by the shortest chain.
        // Prefer a station that the point's own direction sets see back, so that they can be oriented on it.
        if (generation is not null)
        {
            var seen = index.SeenFrom(id);
            rays = rays.OrderBy(r => seen.Contains(r.Origin) ? 0 : 1).ThenBy(r => generation(r.Origin)).ToList();
            if (strength == ConstructionStrength.SeenBack && seen.Count > 0)
                rays = rays.Where(r => seen.Contains(r.Origin)).ToList();
        }
        // The constructions take each station's first ray and first distance: the rays (distances) from one station
        // to the point are repeats of one quantity (rounds, faces, monitoring epochs), so a point measured n times
        // from k stations costs O(n + k²) here instead of O(n²); all of its measurements decide between two
        // solutions below.
        var stationRays = FirstOfEachStation(rays, r => r.Origin);
        var stationCircles = FirstOfEachStation(circles, c => c.Origin);
        var firstCircle = new Dictionary<string, Circle>(StringComparer.Ordinal);
        foreach (var c in stationCircles) firstCircle.Add(c.Origin, c);
        foreach (var r in stationRays)
            if (firstCircle.TryGetValue(r.Origin, out var c))
            {
                parent = r.Origin;
                return Constructions.Polar(r.At, r.Azimuth, c.Distance);
            }

        // Intersection: the best-conditioned pair of rays from different stations.
        PlanePoint? best = null;
        double bestSin = Math.Sin(Constructions.MinCut);
        for (int a = 0; a < stationRays.Count; a++)
            for (int b = a + 1; b < stationRays.Count; b++)
                if (Constructions.Intersect(stationRays[a], stationRays[b]) is (PlanePoint p, double sin)
                    && sin > bestSin)
                {
                    best = p;
                    bestSin = sin;
                }
        if (best is not null || strength <= ConstructionStrength.PolarOrIntersection) return best;

        // Resection from angles at the point, unless its angles misfit (a redundant resection shows a blunder).
        if (Constructions.Resect(cuts) is PlanePoint res && !IsRejected(res, cuts)) return res;

        if (strength == ConstructionStrength.Resection) return null;

        // Two-solution constructions: ray–distance, distance–distance, made one at a time in this order and only
        // until one decides (each is weighed against every measurement at the point).
        foreach (var (p1, p2) in TwoSolutionCandidates(stationRays, stationCircles))
        {
            if (p2 is null) return p1; // a unique solution (the ray starts inside the circle) needs no deciding
            CandidatesWeighed++;
            double m1 = Constructions.Misfit(p1, rays, circles, cuts);
            double m2 = Constructions.Misfit(p2.Value, rays, circles, cuts);
            // The two solutions fit the observations that made them equally; the others decide (3σ margin).
            if (Math.Abs(m1 - m2) > 9) return m1 < m2 ? p1 : p2.Value;
            if (strength == ConstructionStrength.UndecidedIntersection) return p1;
        }
        return null;
    }

    /// <summary>The ray–distance candidates (each station's ray with each other station's distance), then the
    /// distance–distance ones (each pair of stations' distances), in that order, made as they are asked.</summary>
    private static IEnumerable<(PlanePoint, PlanePoint?)> TwoSolutionCandidates(List<Ray> stationRays,
        List<Circle> stationCircles)
    {
        foreach (var r in stationRays)
            foreach (var d in stationCircles)
                if (d.Origin != r.Origin && Constructions.RayCircle(r, d) is var (p1, p2)) yield return (p1, p2);
        for (int a = 0; a < stationCircles.Count; a++)
            for (int b = a + 1; b < stationCircles.Count; b++)
                if (Constructions.CircleCircle(stationCircles[a], stationCircles[b]) is var (p1, p2))
                    yield return (p1, p2);
    }

    /// <summary>The first item of each station, in the order of the items.</summary>
    private static List<T> FirstOfEachStation<T>(List<T> items, Func<T, string> origin)
    {
        var seen = new HashSet<string>(StringComparer.Ordinal);
        var first = new List<T>();
        foreach (var item in items)
            if (seen.Add(origin(item))) first.Add(item);
        return first;
    }

    /// <summary>What ties an unreached point to located points, for the error message.</summary>
    private string Explain(string id, Dictionary<string, PlanePoint> known, Dictionary<string, double> orientation)
    {
        var (rays, circles, cuts) = ApproximationOffers.Gather(index, id, known, orientation);
        var p = index.Network[id];
        string name = p.Source is null ? id : $"{id} ({p.Source})";
        int all = index.ObservationsOf(id).Count;
        static string Count(int k, string one, string many) => k == 1 ? $"1 {one}" : $"{k} {many}";
        string has = $"{name}: from located points it has {Count(circles.Count, "distance", "distances")}, " +
                     $"{Count(rays.Count, "oriented direction or azimuth", "oriented directions or azimuths")} " +
                     $"and {Count(cuts.Count, "angle at the point", "angles at the point")} " +
                     $"({Count(all, "observation", "observations")} in all); ";
        if (Constructions.Resect(cuts) is PlanePoint res && IsRejected(res, cuts))
        {
            var worst = cuts.MaxBy(c => Math.Abs(Constructions.AngleMisfit(res, c) / c.Sd));
            var targets = string.Join(", ", cuts.SelectMany(c => new[] { c.X, c.Y }).Distinct(StringComparer.Ordinal));
            var ic = CultureInfo.InvariantCulture;
            string rms = Math.Sqrt(Constructions.Misfit(res, [], [], cuts) / cuts.Count).ToString("F0", ic);
            string largest = Math.Abs(Constructions.AngleMisfit(res, worst) / worst.Sd).ToString("F0", ic);
            string limit = ResectionMisfitLimit.ToString("F0", ic);
            return has + $"its resection from {targets} was rejected: the angles at the point misfit by {rms}σ " +
                   $"(root mean square; limit {limit}σ; largest: the angle from {worst.X} to {worst.Y}, {largest}σ), " +
                   "so a direction, an angle or a located point's coordinates is wrong";
        }
        return has + (all == 0 ? "no observation reaches it" : "that does not fix its position");
    }
}
