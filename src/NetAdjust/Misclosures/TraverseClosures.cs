using System.Runtime.InteropServices;
using NetAdjust.Network;

namespace NetAdjust.Misclosures;

/// <summary>
/// Finds the traverses of a network and computes their angular and linear misclosures (docs/methods.md,
/// "Misclosures before the adjustment"). A traverse is a chain of stations where each station has an angle (an
/// observed angle, or two directions of one set) from the previous station to the next one and a horizontal distance
/// to the next one, with exactly one way on at each intermediate station (a station with more ways on is a junction
/// of a network, where the walk stops). A link traverse starts at a point with given coordinates and an angle from
/// another given point (its reference azimuth) and ends at a point with given coordinates, with an angle from the
/// last station to a given point when one was observed; a closed traverse returns to its first station, closing
/// with the angle there. Repeated angles and distances are averaged, weighted by their variances.
/// </summary>
internal static class TraverseClosures
{
    /// <summary>A weighted mean of repeated measurements; <c>First</c> heads its chain of contributions (the
    /// observations it comes from, listed only for a traverse found: <see cref="Data.ObservationsOf"/>).</summary>
    private readonly record struct Measured(double Value, double Var, int First);

    /// <summary>
    /// What the walks need, with the points as their indices in the network (strings are hashed only once per
    /// observation): the mean angle at a station from one point to another, the mean distance of a pair, and the
    /// ways on from each station in the order they were first met.
    /// </summary>
    private sealed class Data(int points)
    {
        /// <summary>Index into <see cref="Means"/> of the mean angle at a station from one point to another.
        /// </summary>
        public readonly Dictionary<(int At, int From, int To), int> Angles = [];

        /// <summary>Index into <see cref="Means"/> of the mean distance of a pair (lower index first).</summary>
        public readonly Dictionary<(int, int), int> Distances = [];

        public readonly List<Measured> Means = [];
        public readonly List<int>?[] Ways = new List<int>?[points];

        /// <summary>Contributions: one or two observation indices and the next contribution of the same mean.
        /// </summary>
        public readonly List<(int Obs1, int Obs2, int Next)> Contributions = [];

        public List<int> Ways0(int at) => Ways[at] ?? [];

        public Measured Angle(int at, int from, int to) => Means[Angles[(at, from, to)]];

        public Measured Distance(int a, int b) => Means[Distances[Pair(a, b)]];

        /// <summary>Memo of <see cref="OneWayOn"/> by (station, previous station).</summary>
        public readonly Dictionary<(int, int), int> WayOn = [];

        public IEnumerable<int> ObservationsOf(Measured m)
        {
            for (int c = m.First; c >= 0; c = Contributions[c].Next)
            {
                yield return Contributions[c].Obs1;
                if (Contributions[c].Obs2 >= 0) yield return Contributions[c].Obs2;
            }
        }
    }

    public static List<TraverseClosure> Find(SurveyNetwork network, IReadOnlyList<double> sd, MisclosureOptions o,
        double z, double chi2)
    {
        var known = network.Points.Select(IsKnown).ToArray();
        var data = Collect(network, sd);
        var found = new List<TraverseClosure>();
        var keys = new HashSet<string>(StringComparer.Ordinal);
        void Add(TraverseClosure? t)
        {
            if (t is null) return;
            var legs = Enumerable.Range(0, t.Points.Count - 1)
                .Select(i => Key(t.Points[i], t.Points[i + 1])).Order(StringComparer.Ordinal);
            if (keys.Add(string.Join("|", legs))) found.Add(t);
        }
        var visited = new HashSet<int>();
        // Link traverses, from each given point with a given reference.
        for (int start = 0; start < network.Points.Count; start++)
        {
            if (!known[start]) continue;
            foreach (var reference in data.Ways0(start))
            {
                if (!known[reference]) continue;
                foreach (var next in data.Ways0(start))
                    if (next != reference && data.Angles.ContainsKey((start, reference, next)) &&
                        data.Distances.ContainsKey(Pair(start, next)))
                        Add(Walk(network, known, data, visited, start, reference, next, o, z, chi2));
            }
        }
        // Closed traverses with no given reference, from each station (its angles in the order found).
        var byStation = new List<(int Back, int Next)>?[network.Points.Count];
        foreach (var (at, back, next) in data.Angles.Keys) (byStation[at] ??= []).Add((back, next));
        var covered = new bool[network.Points.Count];
        foreach (var t in found) foreach (var id in t.Points) covered[network.IndexOf(id)] = true;
        for (int start = 0; start < network.Points.Count; start++)
            foreach (var (back, next) in byStation[start] ?? [])
            {
                // a station of a traverse already found starts no other walk: each loop is walked once
                if (covered[start]) break;
                // the walk's second station needs one way on (the walk would stop there: saves most walks)
                if (next != start && OneWayOn(data, next, start) < 0) continue;
                if (data.Distances.ContainsKey(Pair(start, back)) && data.Distances.ContainsKey(Pair(start, next)) &&
                    Walk(network, known, data, visited, start, back, next, o, z, chi2, closed: true)
                        is TraverseClosure t)
                {
                    Add(t);
                    foreach (var id in t.Points) covered[network.IndexOf(id)] = true;
                }
            }
        return found;
    }

    private static bool IsKnown(Point p) => p.E.HasValue && p.N.HasValue &&
        (p.IsFixed(Fixity.EN) || (p.SdE.HasValue && p.SdN.HasValue));

    /// <summary>The one way on from <paramref name="cur"/> coming from <paramref name="prev"/> (an angle and a
    /// distance), or -1 when there is none or more than one.</summary>
    private static int OneWayOn(Data data, int cur, int prev)
    {
        ref int memo = ref CollectionsMarshal.GetValueRefOrAddDefault(data.WayOn,
            (cur, prev), out bool exists);
        if (!exists) memo = FindOneWayOn(data, cur, prev);
        return memo;
    }

    private static int FindOneWayOn(Data data, int cur, int prev)
    {
        int way = -1, count = 0;
        foreach (var w in data.Ways0(cur))
            if (w != prev && data.Angles.ContainsKey((cur, prev, w)) && data.Distances.ContainsKey(Pair(cur, w)))
            {
                way = w;
                count++;
            }
        return count == 1 ? way : -1;
    }

    private static TraverseClosure? Walk(SurveyNetwork network, bool[] known, Data data, HashSet<int> visited,
        int start, int reference, int first, MisclosureOptions o, double z, double chi2, bool closed = false)
    {
        var stations = new List<int> { start };
        visited.Clear();
        visited.Add(start);
        var angles = new List<Measured>();
        var legs = new List<(Measured D, int Before)>();
        int prev = reference, cur = start, next = first;
        double? endAzimuth = null;
        bool knownEnd = false;
        Point P(int i) => network.Points[i];
        while (true)
        {
            // a closed traverse's angle at its first station is its closing angle, taken at the end
            if (!closed || cur != start) angles.Add(data.Angle(cur, prev, next));
            legs.Add((data.Distance(cur, next), angles.Count));
            prev = cur;
            cur = next;
            if (closed && cur == start)
            {
                // the closing angle at the first station, from the last station to the first leg
                if (!data.Angles.TryGetValue((start, prev, first), out int closing)) return null;
                angles.Add(data.Means[closing]);
                break;
            }
            if (visited.Contains(cur) && !(cur == start && !closed)) return null;
            stations.Add(cur);
            visited.Add(cur);
            if (!closed && known[cur])
            {
                knownEnd = true;
                int foresight = data.Ways0(cur).FirstOrDefault(f => f != prev && known[f] &&
                    data.Angles.ContainsKey((cur, prev, f)), -1);
                if (foresight >= 0)
                {
                    angles.Add(data.Angle(cur, prev, foresight));
                    endAzimuth = Azimuth(P(cur), P(foresight));
                }
                break;
            }
            next = OneWayOn(data, cur, prev);
            if (next < 0 || stations.Count > network.Points.Count) return null;
        }
        if (!closed && !knownEnd) return null;
        if (closed && stations.Count < 3) return null;

        // Carry the azimuths: az(cur→next) = az(cur→prev) + angle = az(prev→cur) + π + angle.
        double az0 = closed ? 0 : Azimuth(P(start), P(reference));
        double sum = angles.Sum(a => a.Value);
        int nAngles = angles.Count;
        double w = double.NaN, angularSd = double.NaN;
        if (closed || endAzimuth.HasValue)
        {
            // closed: the angles must bring the first leg back to itself; link: to the known end azimuth
            double carried = closed ? sum + ((nAngles - 2) * Math.PI)
                : az0 + sum + ((nAngles - 1) * Math.PI) - endAzimuth!.Value;
            w = Wrap(carried);
            angularSd = Math.Sqrt(angles.Sum(a => a.Var));
        }
        double share = double.IsNaN(w) ? 0 : w / nAngles; // balancing: each angle takes an equal share

        // Carry the coordinates with the balanced angles; leg i has angles 0..Before-1 before it.
        double e = closed ? 0 : P(start).E!.Value, nn = closed ? 0 : P(start).N!.Value;
        var az = new double[legs.Count];
        double running = az0 - (closed ? 0 : Math.PI);
        for (int i = 0; i < legs.Count; i++)
        {
            running = i == 0 && closed ? az0 : running + Math.PI + angles[legs[i].Before - 1].Value - share;
            az[i] = running;
            e += legs[i].D.Value * Math.Sin(running);
            nn += legs[i].D.Value * Math.Cos(running);
        }
        double fE = closed ? e : e - P(cur).E!.Value, fN = closed ? nn : nn - P(cur).N!.Value;

        // Covariance of the closing vector: angles through the balanced azimuths, distances directly.
        double cEE = 0, cNN = 0, cEN = 0;
        for (int j = 0; j < nAngles; j++)
        {
            double gE = 0, gN = 0;
            for (int i = 0; i < legs.Count; i++)
            {
                double d = (j < legs[i].Before ? 1 : 0) - (double.IsNaN(w) ? 0 : (double)legs[i].Before / nAngles);
                if (double.IsNaN(w) && j >= legs[i].Before) d = 0;
                gE += legs[i].D.Value * Math.Cos(az[i]) * d;
                gN -= legs[i].D.Value * Math.Sin(az[i]) * d;
            }
            cEE += gE * gE * angles[j].Var; cNN += gN * gN * angles[j].Var; cEN += gE * gN * angles[j].Var;
        }
        for (int i = 0; i < legs.Count; i++)
        {
            double s = Math.Sin(az[i]), c = Math.Cos(az[i]), v = legs[i].D.Var;
            cEE += s * s * v; cNN += c * c * v; cEN += s * c * v;
        }
        double det = (cEE * cNN) - (cEN * cEN);
        double stat = det > 1e-30 * Math.Max(1e-300, cEE * cNN)
            ? ((cNN * fE * fE) - (2 * cEN * fE * fN) + (cEE * fN * fN)) / det : double.NaN;
        var obs = angles.SelectMany(data.ObservationsOf).Concat(legs.SelectMany(l => data.ObservationsOf(l.D)))
            .Distinct().Order().ToList();
        var names = stations.Select(i => P(i).Id).ToList();
        var points = closed ? [.. names, P(start).Id] : names;
        return new TraverseClosure(closed ? TraverseKind.Closed : TraverseKind.Link, points, obs, w, angularSd,
            z * angularSd, Math.Sqrt((fE * fE) + (fN * fN)), legs.Sum(l => l.D.Value), stat, chi2,
            o.MinimumTraverseRatio);
    }

    /// <summary>A running weighted mean (angles aligned to the first within half a turn), its contributions
    /// chained from <c>First</c> to <c>Last</c>.</summary>
    private record struct Running(double FirstValue, double Sw, double Swx, int First, int Last);

    private static Data Collect(SurveyNetwork network, IReadOnlyList<double> sd)
    {
        var data = new Data(network.Points.Count);
        var angleMeans = new List<Running>();
        var distances = new Dictionary<(int, int), Running>();
        void Accumulate(ref Running r, bool exists, double value, double var, int obs1, int obs2, bool angular)
        {
            int c = data.Contributions.Count;
            data.Contributions.Add((obs1, obs2, -1));
            if (!exists) r = new Running(value, 0, 0, c, c);
            else
            {
                data.Contributions[r.Last] = data.Contributions[r.Last] with { Next = c };
                r.Last = c;
            }
            // the weighted mean as a sum in the order of the observations
            double x = angular ? r.FirstValue + Wrap(value - r.FirstValue) : value;
            double wt = var > 0 ? 1 / var : 1e300;
            r.Sw += wt;
            r.Swx += wt * x;
        }
        void PushAngle((int, int, int) key, double value, double var, int obs1, int obs2)
        {
            ref int index = ref CollectionsMarshal.GetValueRefOrAddDefault(data.Angles,
                key, out bool exists);
            if (!exists)
            {
                index = angleMeans.Count;
                angleMeans.Add(default);
            }
            var span = CollectionsMarshal.AsSpan(angleMeans);
            Accumulate(ref span[index], exists, value, var, obs1, obs2, angular: true);
        }
        void AddAngle(int at, int from, int to, double value, double var, int obs1, int obs2)
        {
            value = Normalise(value);
            PushAngle((at, from, to), value, var, obs1, obs2);
            PushAngle((at, to, from), Normalise((2 * Math.PI) - value), var, obs1, obs2);
        }
        void PushDistance((int, int) key, double value, double var, int obs)
        {
            ref var r = ref CollectionsMarshal.GetValueRefOrAddDefault(distances, key,
                out bool exists);
            Accumulate(ref r, exists, value, var, obs, -1, angular: false);
        }
        int Ix(string id) => network.IndexOf(id);
        var sets = new Dictionary<string, List<int>>(StringComparer.Ordinal);
        for (int i = 0; i < network.Observations.Count; i++)
        {
            var ob = network.Observations[i];
            if (ob.Excluded) continue;
            switch (ob)
            {
                case AngleObservation a:
                    AddAngle(Ix(a.Station), Ix(a.Backsight), Ix(a.Foresight), a.Value, sd[i] * sd[i], i, -1);
                    break;
                case DirectionObservation d:
                    if (!sets.TryGetValue(d.SetId, out var list)) sets[d.SetId] = list = [];
                    list.Add(i);
                    break;
                case DistanceObservation s:
                    PushDistance(Pair(Ix(s.From), Ix(s.To)), s.Value, sd[i] * sd[i], i);
                    break;
            }
        }
        foreach (var set in sets.Values)
        {
            var targets = set.Select(i => Ix(((DirectionObservation)network.Observations[i]).Target)).ToArray();
            var stations = set.Select(i => Ix(((DirectionObservation)network.Observations[i]).Station)).ToArray();
            for (int x = 0; x < set.Count; x++)
                for (int y = x + 1; y < set.Count; y++)
                {
                    if (targets[x] == targets[y]) continue;
                    var a = (DirectionObservation)network.Observations[set[x]];
                    var b = (DirectionObservation)network.Observations[set[y]];
                    AddAngle(stations[x], targets[x], targets[y], b.Value - a.Value,
                        (sd[set[x]] * sd[set[x]]) + (sd[set[y]] * sd[set[y]]), set[x], set[y]);
                }
        }
        foreach (var r in angleMeans) data.Means.Add(Mean(r, angular: true));
        foreach (var key in data.Angles.Keys)
        {
            Way(data, key.Item1, key.Item2);
            Way(data, key.Item1, key.Item3);
        }
        foreach (var (key, r) in distances)
        {
            data.Distances[key] = data.Means.Count;
            data.Means.Add(Mean(r, angular: false));
        }
        return data;
    }

    private static void Way(Data data, int at, int to)
    {
        var list = data.Ways[at] ??= [];
        if (!list.Contains(to)) list.Add(to);
    }

    /// <summary>The weighted mean of repeated measurements (angles aligned to the first within half a turn).</summary>
    private static Measured Mean(Running r, bool angular)
    {
        double mean = r.Swx / r.Sw;
        return new Measured(angular ? Normalise(mean) : mean, 1 / r.Sw, r.First);
    }

    private static (int, int) Pair(int a, int b) => a <= b ? (a, b) : (b, a);

    private static string Key(string a, string b) =>
        string.CompareOrdinal(a, b) <= 0 ? a + "\u0001" + b : b + "\u0001" + a;

    private static double Azimuth(Point from, Point to) =>
        Normalise(Math.Atan2(to.E!.Value - from.E!.Value, to.N!.Value - from.N!.Value));

    private static double Normalise(double a)
    {
        double r = a % (2 * Math.PI);
        return r < 0 ? r + (2 * Math.PI) : r;
    }

    /// <summary>Reduces an angle to (−π, π].</summary>
    private static double Wrap(double a)
    {
        double r = Normalise(a);
        return r > Math.PI ? r - (2 * Math.PI) : r;
    }
}
