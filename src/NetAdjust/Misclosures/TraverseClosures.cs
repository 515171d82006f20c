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
    /// <summary>A weighted mean of repeated measurements and the observations it comes from.</summary>
    private readonly record struct Measured(double Value, double Var, List<int> Observations);

    /// <summary>
    /// What the walks need, with the points as their indices in the network (strings are hashed only once per
    /// observation): for each station the angles it has (from one point to another, in the order they were first
    /// met), the ways on from it (in the same order), and the mean distance of each pair. The mean of an angle is
    /// computed when a walk takes it (<see cref="Angle"/>), from the station's angles and direction sets.
    /// </summary>
    private sealed class Data(SurveyNetwork network, IReadOnlyList<double> sd, int points)
    {
        /// <summary>The angles of station s are <see cref="From"/>[k] → <see cref="To"/>[k] for k in
        /// [<see cref="Start"/>[s], <see cref="Start"/>[s + 1]).</summary>
        public readonly int[] Start = new int[points + 1];

        public readonly List<int> From = [], To = [];

        /// <summary>The ways on from each station, in <see cref="WayStart"/> ranges like the angles.</summary>
        public readonly int[] WayStart = new int[points + 1];

        public readonly List<int> Ways = [];

        /// <summary>Index into <see cref="DistanceSums"/> of the distances of a pair (lower index first).</summary>
        public readonly Dictionary<(int, int), int> Distances = [];

        /// <summary>Per pair: the sums of the weights and of the weighted distances (in the order of the
        /// observations), and the first and last of its observations, chained by <see cref="NextDistance"/>.</summary>
        public readonly List<(double Sw, double Swx, int First, int Last)> DistanceSums = [];

        /// <summary>The next observation of the same pair after each distance observation (−1 at the end).</summary>
        public readonly int[] NextDistance = new int[network.Observations.Count];

        /// <summary>The one way on from each station by the point it is entered from (<see cref="OneWayOn"/>): for
        /// station s, <see cref="EnteredFrom"/>[k] → <see cref="WayOn"/>[k] for k in [<see cref="WayOnStart"/>[s],
        /// <see cref="WayOnStart"/>[s + 1]), sorted by the point entered from; −1 when there is none or more than
        /// one.</summary>
        public readonly int[] WayOnStart = new int[points + 1];

        public readonly List<int> EnteredFrom = [], WayOn = [];

        /// <summary>The angle observations at each station, in input order; those set aside left out.</summary>
        public readonly List<int>?[] AngleObservations = new List<int>?[points];

        /// <summary>The direction sets at each station in order of first appearance, each its directions in input
        /// order; those set aside left out.</summary>
        public readonly List<List<int>>?[] Sets = new List<List<int>>?[points];

        public ReadOnlySpan<int> WaysOf(int at) =>
            CollectionsMarshal.AsSpan(Ways)[WayStart[at]..WayStart[at + 1]];

        public bool HasAngle(int at, int from, int to)
        {
            for (int k = Start[at]; k < Start[at + 1]; k++)
                if (From[k] == from && To[k] == to) return true;
            return false;
        }

        public bool HasDistance(int a, int b) => Distances.ContainsKey(Pair(a, b));

        /// <summary>The weighted mean of the distances of a pair.</summary>
        public Measured Distance(int a, int b)
        {
            var (sw, swx, first, _) = DistanceSums[Distances[Pair(a, b)]];
            var obs = new List<int>();
            for (int i = first; i >= 0; i = NextDistance[i]) obs.Add(i);
            return new Measured(swx / sw, 1 / sw, obs);
        }

        /// <summary>The target of each direction observation by its index in the network (by the observation's
        /// index; 0 for other observations).</summary>
        public readonly int[] Targets = new int[network.Observations.Count];

        /// <summary>The target of direction observation <paramref name="i"/>, by its index in the network.</summary>
        public int Target(int i) => Targets[i];

        /// <summary>
        /// The weighted mean of the angle at <paramref name="at"/> from <paramref name="from"/> to
        /// <paramref name="to"/> (angles aligned to the first within half a turn): each angle observation and each
        /// pair of directions of one set gives the angle one way and its complement the other way, summed in the
        /// order of the observations (the angle observations first, then the sets).
        /// </summary>
        public Measured Angle(int at, int from, int to)
        {
            double first = 0, sw = 0, swx = 0;
            bool any = false;
            var obs = new List<int>();
            void Push(double value, double var, int obs1, int obs2)
            {
                if (!any) { first = value; any = true; }
                obs.Add(obs1);
                if (obs2 >= 0) obs.Add(obs2);
                double x = first + Wrap(value - first);
                double wt = var > 0 ? 1 / var : 1e300;
                sw += wt;
                swx += wt * x;
            }
            void Both(int a, int b, double value, double var, int obs1, int obs2)
            {
                value = Normalise(value);
                if (a == from && b == to) Push(value, var, obs1, obs2);
                if (b == from && a == to) Push(Normalise((2 * Math.PI) - value), var, obs1, obs2);
            }
            foreach (int i in AngleObservations[at] ?? [])
            {
                var a = (AngleObservation)network.Observations[i];
                Both(network.IndexOf(a.Backsight), network.IndexOf(a.Foresight), a.Value, sd[i] * sd[i], i, -1);
            }
            foreach (var set in Sets[at] ?? [])
            {
                var targets = set.Select(Target).ToArray();
                for (int x = 0; x < set.Count; x++)
                    for (int y = x + 1; y < set.Count; y++)
                    {
                        if (targets[x] == targets[y]) continue;
                        if (!(targets[x] == from && targets[y] == to) && !(targets[y] == from && targets[x] == to))
                            continue;
                        Both(targets[x], targets[y],
                            network.Observations[set[y]].Value - network.Observations[set[x]].Value,
                            (sd[set[x]] * sd[set[x]]) + (sd[set[y]] * sd[set[y]]), set[x], set[y]);
                    }
            }
            return new Measured(Normalise(swx / sw), 1 / sw, obs);
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
            foreach (var reference in data.WaysOf(start))
            {
                if (!known[reference]) continue;
                foreach (var next in data.WaysOf(start))
                    if (next != reference && data.HasAngle(start, reference, next) && data.HasDistance(start, next))
                        Add(Walk(network, known, data, visited, start, reference, next, o, z, chi2));
            }
        }
        // Closed traverses with no given reference, from each station (its angles in the order found).
        var covered = new bool[network.Points.Count];
        foreach (var t in found) foreach (var id in t.Points) covered[network.IndexOf(id)] = true;
        for (int start = 0; start < network.Points.Count; start++)
            for (int k = data.Start[start]; k < data.Start[start + 1]; k++)
            {
                int back = data.From[k], next = data.To[k];
                // a station of a traverse already found starts no other walk: each loop is walked once
                if (covered[start]) break;
                // the walk's second station needs one way on (the walk would stop there: saves most walks)
                if (next != start && OneWayOn(data, next, start) < 0) continue;
                if (data.HasDistance(start, back) && data.HasDistance(start, next) &&
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
        int k = data.EnteredFrom.BinarySearch(data.WayOnStart[cur], data.WayOnStart[cur + 1] - data.WayOnStart[cur],
            prev, null);
        return k >= 0 ? data.WayOn[k] : -1;
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
                if (!data.HasAngle(start, prev, first)) return null;
                angles.Add(data.Angle(start, prev, first));
                break;
            }
            if (visited.Contains(cur) && !(cur == start && !closed)) return null;
            stations.Add(cur);
            visited.Add(cur);
            if (!closed && known[cur])
            {
                knownEnd = true;
                int foresight = -1;
                foreach (int f in data.WaysOf(cur))
                    if (f != prev && known[f] && data.HasAngle(cur, prev, f)) { foresight = f; break; }
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
        var obs = angles.SelectMany(a => a.Observations).Concat(legs.SelectMany(l => l.D.Observations))
            .Distinct().Order().ToList();
        var names = stations.Select(i => P(i).Id).ToList();
        var points = closed ? [.. names, P(start).Id] : names;
        return new TraverseClosure(closed ? TraverseKind.Closed : TraverseKind.Link, points, obs, w, angularSd,
            z * angularSd, Math.Sqrt((fE * fE) + (fN * fN)), legs.Sum(l => l.D.Value), stat, chi2,
            o.MinimumTraverseRatio);
    }

    private static Data Collect(SurveyNetwork network, IReadOnlyList<double> sd)
    {
        int points = network.Points.Count;
        var data = new Data(network, sd, points);
        // Distances: a weighted mean per pair, summed in the order of the observations.
        var distances = data.DistanceSums;
        // room for a pair per distance observation (a large network's table is then never rehashed as it fills)
        int distanceCount = 0;
        foreach (var ob in network.Observations) if (ob is DistanceObservation) distanceCount++;
        data.Distances.EnsureCapacity(distanceCount);
        distances.Capacity = distanceCount;
        var sets = new Dictionary<string, List<int>>(StringComparer.Ordinal);
        (string? Id, List<int>? Directions) last = (null, null); // a set's directions mostly follow each other
        long angles = 0; // at most this many angles (two per angle observation or pair of directions of a set)
        for (int i = 0; i < network.Observations.Count; i++)
        {
            var ob = network.Observations[i];
            if (ob.Excluded) continue;
            switch (ob)
            {
                case AngleObservation a:
                    (data.AngleObservations[network.IndexOf(a.Station)] ??= []).Add(i);
                    angles += 2;
                    break;
                case DirectionObservation d:
                    if (last.Id != d.SetId && !sets.TryGetValue(d.SetId, out last.Directions))
                    {
                        sets[d.SetId] = last.Directions = [];
                        (data.Sets[network.IndexOf(d.Station)] ??= []).Add(last.Directions);
                    }
                    last.Id = d.SetId;
                    angles += 2 * last.Directions!.Count;
                    last.Directions.Add(i);
                    data.Targets[i] = network.IndexOf(d.Target);
                    break;
                case DistanceObservation s:
                    ref int k = ref CollectionsMarshal.GetValueRefOrAddDefault(data.Distances,
                        Pair(network.IndexOf(s.From), network.IndexOf(s.To)), out bool exists);
                    if (!exists)
                    {
                        k = distances.Count;
                        distances.Add((0, 0, i, i));
                    }
                    var (sw, swx, first, previous) = distances[k];
                    double var = sd[i] * sd[i];
                    double wt = var > 0 ? 1 / var : 1e300;
                    data.NextDistance[previous] = i;
                    data.NextDistance[i] = -1;
                    distances[k] = (sw + wt, swx + (wt * s.Value), first, i);
                    break;
            }
        }

        // The angles at each station in the order first met (angle observations, then pairs of directions of a
        // set; each both ways), and the ways on in the order their angles first name them. The points of one
        // station are numbered locally, so that a small table tells which angles it has so far.
        data.From.Capacity = data.To.Capacity = (int)Math.Min(angles, Array.MaxLength);
        var local = new int[points];
        Array.Fill(local, -1);
        var locals = new List<int>();
        bool[] table = [];
        bool[] isWay = [], legs = [];
        int[] count = [], way = [];
        int m = 0;
        void Local(int p)
        {
            if (local[p] >= 0) return;
            local[p] = locals.Count;
            locals.Add(p);
        }
        void Push(int a, int b)
        {
            int la = local[a], lb = local[b];
            if (table[(la * m) + lb]) return;
            table[(la * m) + lb] = true;
            data.From.Add(a);
            data.To.Add(b);
            if (!isWay[la]) { isWay[la] = true; data.Ways.Add(a); }
            if (!isWay[lb]) { isWay[lb] = true; data.Ways.Add(b); }
        }
        for (int at = 0; at < points; at++)
        {
            data.Start[at] = data.From.Count;
            data.WayStart[at] = data.Ways.Count;
            data.WayOnStart[at] = data.EnteredFrom.Count;
            var angleObs = data.AngleObservations[at];
            var atSets = data.Sets[at];
            if (angleObs is null && atSets is null) continue;
            foreach (int i in angleObs ?? [])
            {
                var a = (AngleObservation)network.Observations[i];
                Local(network.IndexOf(a.Backsight));
                Local(network.IndexOf(a.Foresight));
            }
            foreach (var set in atSets ?? [])
                foreach (int i in set) Local(data.Target(i));
            m = locals.Count;
            if (table.Length < m * m) table = new bool[Math.Max(m * m, 2 * table.Length)];
            if (isWay.Length < m) isWay = new bool[Math.Max(m, 2 * isWay.Length)];
            Array.Clear(table, 0, m * m);
            Array.Clear(isWay, 0, m);
            foreach (int i in angleObs ?? [])
            {
                var a = (AngleObservation)network.Observations[i];
                int b = network.IndexOf(a.Backsight), f = network.IndexOf(a.Foresight);
                Push(b, f);
                Push(f, b);
            }
            foreach (var set in atSets ?? [])
            {
                var targets = set.Select(data.Target).ToArray();
                for (int x = 0; x < set.Count; x++)
                    for (int y = x + 1; y < set.Count; y++)
                    {
                        if (targets[x] == targets[y]) continue;
                        Push(targets[x], targets[y]);
                        Push(targets[y], targets[x]);
                    }
            }
            // The one way on by the point entered from: an angle from it to a point with a distance from here.
            if (count.Length < m) (count, way, legs) = (new int[2 * m], new int[2 * m], new bool[2 * m]);
            for (int l = 0; l < m; l++) (count[l], legs[l]) = (0, data.HasDistance(at, locals[l]));
            for (int k = data.Start[at]; k < data.From.Count; k++)
                if (legs[local[data.To[k]]])
                {
                    count[local[data.From[k]]]++;
                    way[local[data.From[k]]] = data.To[k];
                }
            data.WayOnStart[at] = data.EnteredFrom.Count;
            locals.Sort();
            foreach (int p in locals)
            {
                data.EnteredFrom.Add(p);
                data.WayOn.Add(count[local[p]] == 1 ? way[local[p]] : -1);
            }
            foreach (int p in locals) local[p] = -1;
            locals.Clear();
        }
        data.Start[points] = data.From.Count;
        data.WayStart[points] = data.Ways.Count;
        data.WayOnStart[points] = data.EnteredFrom.Count;
        return data;
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
