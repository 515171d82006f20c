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
    private sealed record Measured(double Value, double Var, IReadOnlyList<int> Obs);

    private sealed class Data
    {
        public readonly Dictionary<(string At, string From, string To), Measured> Angles = [];
        public readonly Dictionary<(string, string), Measured> Distances = [];
        public readonly Dictionary<string, List<string>> Ways = new(StringComparer.Ordinal);
    }

    public static List<TraverseClosure> Find(SurveyNetwork network, IReadOnlyList<double> sd, MisclosureOptions o,
        double z, double chi2)
    {
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
        bool Known(string id) => IsKnown(network[id]);
        // Link traverses, from each given point with a given reference.
        foreach (var start in network.Points.Where(IsKnown))
            foreach (var reference in data.Ways.GetValueOrDefault(start.Id) ?? [])
            {
                if (!Known(reference)) continue;
                foreach (var next in data.Ways[start.Id])
                    if (next != reference && data.Angles.ContainsKey((start.Id, reference, next)) &&
                        data.Distances.ContainsKey(Pair(start.Id, next)))
                        Add(Walk(network, data, start.Id, reference, next, o, z, chi2));
            }
        // Closed traverses with no given reference, from each station (its angles in the order found).
        var byStation = data.Angles.Keys.GroupBy(k => k.At, StringComparer.Ordinal)
            .ToDictionary(g => g.Key, g => g.ToList(), StringComparer.Ordinal);
        var covered = new HashSet<string>(found.SelectMany(t => t.Points), StringComparer.Ordinal);
        foreach (var start in network.Points)
            foreach (var (at, back, next) in byStation.GetValueOrDefault(start.Id) ?? [])
            {
                // a station of a traverse already found starts no other walk: each loop is walked once
                if (covered.Contains(at)) break;
                if (data.Distances.ContainsKey(Pair(at, back)) && data.Distances.ContainsKey(Pair(at, next)) &&
                    Walk(network, data, at, back, next, o, z, chi2, closed: true) is TraverseClosure t)
                {
                    Add(t);
                    covered.UnionWith(t.Points);
                }
            }
        return found;
    }

    private static bool IsKnown(Point p) => p.E.HasValue && p.N.HasValue &&
        (p.IsFixed(Fixity.EN) || (p.SdE.HasValue && p.SdN.HasValue));

    private static TraverseClosure? Walk(SurveyNetwork network, Data data, string start, string reference,
        string first, MisclosureOptions o, double z, double chi2, bool closed = false)
    {
        var stations = new List<string> { start };
        var visited = new HashSet<string>(StringComparer.Ordinal) { start };
        var angles = new List<Measured>();
        var legs = new List<(Measured D, int Before)>();
        string prev = reference, cur = start, next = first;
        double? endAzimuth = null;
        bool knownEnd = false;
        while (true)
        {
            // a closed traverse's angle at its first station is its closing angle, taken at the end
            if (!closed || cur != start) angles.Add(data.Angles[(cur, prev, next)]);
            legs.Add((data.Distances[Pair(cur, next)], angles.Count));
            prev = cur;
            cur = next;
            if (closed && cur == start)
            {
                // the closing angle at the first station, from the last station to the first leg
                if (!data.Angles.TryGetValue((start, prev, first), out var closing)) return null;
                angles.Add(closing);
                break;
            }
            if (visited.Contains(cur) && !(cur == start && !closed)) return null;
            stations.Add(cur);
            visited.Add(cur);
            if (!closed && IsKnown(network[cur]))
            {
                knownEnd = true;
                var foresight = (data.Ways.GetValueOrDefault(cur) ?? []).FirstOrDefault(f => f != prev &&
                    IsKnown(network[f]) && data.Angles.ContainsKey((cur, prev, f)));
                if (foresight is not null)
                {
                    angles.Add(data.Angles[(cur, prev, foresight)]);
                    endAzimuth = Azimuth(network[cur], network[foresight]);
                }
                break;
            }
            var ways = (data.Ways.GetValueOrDefault(cur) ?? []).Where(w => w != prev &&
                data.Angles.ContainsKey((cur, prev, w)) && data.Distances.ContainsKey(Pair(cur, w))).ToList();
            if (ways.Count != 1 || stations.Count > network.Points.Count) return null;
            next = ways[0];
        }
        if (!closed && !knownEnd) return null;
        if (closed && stations.Count < 3) return null;

        // Carry the azimuths: az(cur→next) = az(cur→prev) + angle = az(prev→cur) + π + angle.
        double az0 = closed ? 0 : Azimuth(network[start], network[reference]);
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
        double e = closed ? 0 : network[start].E!.Value, nn = closed ? 0 : network[start].N!.Value;
        var az = new double[legs.Count];
        double running = az0 - (closed ? 0 : Math.PI);
        for (int i = 0; i < legs.Count; i++)
        {
            running = i == 0 && closed ? az0 : running + Math.PI + angles[legs[i].Before - 1].Value - share;
            az[i] = running;
            e += legs[i].D.Value * Math.Sin(running);
            nn += legs[i].D.Value * Math.Cos(running);
        }
        double fE = closed ? e : e - network[cur].E!.Value, fN = closed ? nn : nn - network[cur].N!.Value;

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
        var obs = angles.SelectMany(a => a.Obs).Concat(legs.SelectMany(l => l.D.Obs)).Distinct().Order().ToList();
        var points = closed ? [.. stations, start] : stations;
        return new TraverseClosure(closed ? TraverseKind.Closed : TraverseKind.Link, points, obs, w, angularSd,
            z * angularSd, Math.Sqrt((fE * fE) + (fN * fN)), legs.Sum(l => l.D.Value), stat, chi2,
            o.MinimumTraverseRatio);
    }

    private static Data Collect(SurveyNetwork network, IReadOnlyList<double> sd)
    {
        var angles = new Dictionary<(string, string, string), List<(double, double, int[])>>();
        var distances = new Dictionary<(string, string), List<(double, double, int[])>>();
        void AddAngle(string at, string from, string to, double value, double var, int[] obs)
        {
            value = Normalise(value);
            Push(angles, (at, from, to), (value, var, obs));
            Push(angles, (at, to, from), (Normalise((2 * Math.PI) - value), var, obs));
        }
        var sets = new Dictionary<string, List<int>>(StringComparer.Ordinal);
        for (int i = 0; i < network.Observations.Count; i++)
        {
            var ob = network.Observations[i];
            if (ob.Excluded) continue;
            switch (ob)
            {
                case AngleObservation a:
                    AddAngle(a.Station, a.Backsight, a.Foresight, a.Value, sd[i] * sd[i], [i]);
                    break;
                case DirectionObservation d:
                    if (!sets.TryGetValue(d.SetId, out var list)) sets[d.SetId] = list = [];
                    list.Add(i);
                    break;
                case DistanceObservation s:
                    Push(distances, Pair(s.From, s.To), (s.Value, sd[i] * sd[i], [i]));
                    break;
            }
        }
        foreach (var set in sets.Values)
            for (int x = 0; x < set.Count; x++)
                for (int y = x + 1; y < set.Count; y++)
                {
                    var a = (DirectionObservation)network.Observations[set[x]];
                    var b = (DirectionObservation)network.Observations[set[y]];
                    if (a.Target == b.Target) continue;
                    AddAngle(a.Station, a.Target, b.Target, b.Value - a.Value,
                        (sd[set[x]] * sd[set[x]]) + (sd[set[y]] * sd[set[y]]), [set[x], set[y]]);
                }
        var data = new Data();
        foreach (var (key, list) in angles)
        {
            data.Angles[key] = Mean(list, angular: true);
            Way(data, key.Item1, key.Item2);
            Way(data, key.Item1, key.Item3);
        }
        foreach (var (key, list) in distances) data.Distances[key] = Mean(list, angular: false);
        return data;
    }

    private static void Way(Data data, string at, string to)
    {
        if (!data.Ways.TryGetValue(at, out var list)) data.Ways[at] = list = [];
        if (!list.Contains(to)) list.Add(to);
    }

    private static void Push<TKey>(Dictionary<TKey, List<(double, double, int[])>> d, TKey key,
        (double, double, int[]) item) where TKey : notnull
    {
        if (!d.TryGetValue(key, out var list)) d[key] = list = [];
        list.Add(item);
    }

    /// <summary>The weighted mean of repeated measurements (angles aligned to the first within half a turn).</summary>
    private static Measured Mean(List<(double Value, double Var, int[] Obs)> list, bool angular)
    {
        double first = list[0].Value, sw = 0, swx = 0;
        foreach (var (v, var, _) in list)
        {
            double x = angular ? first + Wrap(v - first) : v;
            double wt = var > 0 ? 1 / var : 1e300;
            sw += wt; swx += wt * x;
        }
        double mean = swx / sw;
        return new Measured(angular ? Normalise(mean) : mean, 1 / sw, list.SelectMany(l => l.Obs).ToList());
    }

    private static (string, string) Pair(string a, string b) => string.CompareOrdinal(a, b) <= 0 ? (a, b) : (b, a);

    private static string Key(string a, string b) { var (x, y) = Pair(a, b); return x + "\u0001" + y; }

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
