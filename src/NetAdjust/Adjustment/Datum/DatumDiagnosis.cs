using NetAdjust.Adjustment.Approximation;
using NetAdjust.Adjustment;
using NetAdjust.Network;
using NetAdjust.Observations;

namespace NetAdjust.Adjustment.Datum;

/// <summary>
/// Finds, before any solving, what the observations and the datum definition leave undetermined, and says so in
/// the surveyor's terms. A plane network of distances, directions and angles has a datum defect of up to four:
/// translation in easting and northing, rotation (no azimuth observed) and scale (no distance observed); a level
/// network has one, its height. Each part of the network not joined to the rest by observations has its own.
/// References: Koch (1999), <i>Parameter Estimation and Hypothesis Testing in Linear Models</i>, §3.4 (models
/// not of full rank); Caspary (1987), <i>Concepts of Network and Deformation Analysis</i>, ch. 2.
/// The diagnosis is structural (counts per connected part); weak geometry inside a part (e.g. a point fixed by a
/// single distance) is caught later by the factorisation and reported by unknown.
/// </summary>
internal static class DatumDiagnosis
{
    /// <summary>A connected part of the plane or level network.</summary>
    /// <param name="Points">Its points, in input order.</param>
    /// <param name="HasAzimuth">An azimuth is observed in it.</param>
    /// <param name="HasDistance">A distance is observed in it.</param>
    internal sealed record Part(List<string> Points, bool HasAzimuth, bool HasDistance);

    /// <summary>The connected parts over the observations of one kind (plane or height), in input order of their first
    /// point.</summary>
    internal static List<Part> Parts(SurveyNetwork network, bool plane) =>
        Parts(network, new ObservationPoints(network), plane);

    /// <summary>The connected parts, with the points of the observations looked up already.</summary>
    internal static List<Part> Parts(SurveyNetwork network, ObservationPoints ids, bool plane)
    {
        // Union-find over the points' indices in the network; −1 for a point no observation of the kind reaches.
        var points = network.Points;
        var parent = new int[points.Count];
        Array.Fill(parent, -1);
        int Find(int x)
        {
            while (parent[x] != x) x = parent[x] = parent[parent[x]];
            return x;
        }
        // Set-aside observations carry no weight: they neither join parts nor fix scale or orientation.
        var axes = plane ? CoordinateAxes.Plane : CoordinateAxes.Height;
        var obs = new List<int>();
        for (int i = 0; i < network.Observations.Count; i++)
        {
            var o = network.Observations[i];
            if (!o.Excluded && (ObservationKindRegistry.Of(o.Kind).Axes & axes) != 0) obs.Add(i);
        }
        foreach (int i in obs)
            foreach (int p in ids.Of(i))
                if (parent[p] < 0) parent[p] = p;
        foreach (int i in obs)
        {
            var of = ids.Of(i);
            for (int k = 1; k < of.Length; k++)
            {
                int a = Find(of[0]), b = Find(of[k]);
                if (a != b) parent[b] = a;
            }
        }
        // The parts in input order of their first point; each with the observations from its points.
        var partOf = new int[points.Count];
        Array.Fill(partOf, -1);
        var parts = new List<List<string>>();
        for (int i = 0; i < points.Count; i++)
        {
            if (parent[i] < 0) continue;
            int r = Find(i);
            if (partOf[r] < 0) { partOf[r] = parts.Count; parts.Add([]); }
            parts[partOf[r]].Add(points[i].Id);
        }
        var fixes = new DatumElements[parts.Count];
        foreach (int i in obs) // (ObservationKindRegistry.FixedBy, per part)
        {
            var o = network.Observations[i];
            int f = ids.Of(i)[o.At is null || o.At == o.From ? 0 : 1]; // From, as Observation.Points lists it
            if (parent[f] >= 0) fixes[partOf[Find(f)]] |= ObservationKindRegistry.Of(o.Kind).Fixes;
        }
        return parts.Select((list, k) => new Part(list, fixes[k].HasFlag(DatumElements.Orientation),
            fixes[k].HasFlag(DatumElements.Scale))).ToList();
    }

    /// <summary>Throws <see cref="DatumDefectException"/> when the datum is not defined.</summary>
    internal static void Check(SurveyNetwork network, DatumDefinition datum) =>
        Check(network, new ObservationPoints(network), datum);

    /// <summary>Throws <see cref="DatumDefectException"/> when the datum is not defined (the points of the
    /// observations looked up already).</summary>
    internal static void Check(SurveyNetwork network, ObservationPoints ids, DatumDefinition datum)
    {
        var plane = Parts(network, ids, plane: true);
        var height = Parts(network, ids, plane: false);
        if (datum.Mode == DatumMode.Control) CheckControl(network, plane, height);
        else CheckConnected(plane, height, datum);
    }

    private const string Prefix = "The datum is not defined: ";

    private static string List(IEnumerable<string> ids, int max = 12)
    {
        var l = ids.ToList();
        return l.Count <= max ? string.Join(", ", l) : string.Join(", ", l.Take(max)) + $" and {l.Count - max} more";
    }

    private static void CheckControl(SurveyNetwork network, List<Part> plane, List<Part> height)
    {
        bool HasE(Point p) => p.IsFixed(Fixity.E) || p.SdE.HasValue;
        bool HasN(Point p) => p.IsFixed(Fixity.N) || p.SdN.HasValue;
        bool HasH(Point p) => p.IsFixed(Fixity.H) || p.SdH.HasValue;

        var planeProblems = new List<(Part Part, MissingElement Missing)>();
        foreach (var part in plane)
        {
            var pts = part.Points.Select(id => network[id]).ToList();
            int components = pts.Sum(p => (HasE(p) ? 1 : 0) + (HasN(p) ? 1 : 0));
            int controlPoints = pts.Count(p => HasE(p) || HasN(p));
            int needed = 2 + (part.HasAzimuth ? 0 : 1) + (part.HasDistance ? 0 : 1);
            if (components == 0 || !pts.Any(HasE) || !pts.Any(HasN)) planeProblems.Add((part, MissingElement.Position));
            else if (components < needed || (needed > 2 && controlPoints < 2))
                planeProblems.Add((part,
                    !part.HasDistance && (part.HasAzimuth || components >= 3)
                        ? MissingElement.Scale : MissingElement.Orientation));
        }
        var heightProblems = height.Where(part => !part.Points.Any(id => HasH(network[id]))).ToList();

        if (plane.Count > 1 && planeProblems.Count > 0)
            throw Disconnected("plane", plane, planeProblems.Select(p => p.Part).ToList(),
                "a held point (fix: en) and, without an observed azimuth or distance, a second held point");
        if (height.Count > 1 && heightProblems.Count > 0)
            throw Disconnected("level", height, heightProblems, "a benchmark with a held height (fix: h)");

        if (planeProblems.Count > 0)
        {
            var (part, missing) = planeProblems[0];
            var control = part.Points.Where(id => HasE(network[id]) || HasN(network[id])).ToList();
            string all = List(part.Points);
            switch (missing)
            {
                case MissingElement.Position:
                    throw new DatumDefectException(Prefix +
                        $"no fixed point. No point of the network ({all}) has a held or weighted easting and " +
                        "northing, so its position (the translation in easting and northing) is undetermined" +
                        (part.HasAzimuth ? "" : ", and so is its rotation") + ". " +
                        "Hold one point (fix: en) or weight its coordinates (sd_e, sd_n); without an observed " +
                        "azimuth hold a second point too. " +
                        "To test the observations alone, adjust it as a free network (datum: {mode: free}).",
                        ["translation in easting", "translation in northing",
                            .. part.HasAzimuth ? Array.Empty<string>() : ["rotation"]]);
                case MissingElement.Scale:
                    throw new DatumDefectException(Prefix +
                        $"no distance. No distance is observed between the points {all}, and the control " +
                        $"({List(control)}) does not fix the size of the network, so its scale is undetermined. " +
                        "Observe at least one distance, or hold a second point.",
                        ["scale"]);
                case MissingElement.Orientation:
                default:
                    throw new DatumDefectException(Prefix +
                        $"no orientation. The network ({all}) has no observed azimuth and only one control point " +
                        $"({List(control)}), so it may turn freely about it: its rotation is undetermined. " +
                        "Hold a second point (fix: en), or observe an azimuth (azimuths: in a setup), " +
                        "or hold an azimuth as a minimal constraint (datum: {mode: minimal, azimuth_to: ...}).",
                        ["rotation"]);
            }
        }
        if (heightProblems.Count > 0)
        {
            var part = heightProblems[0];
            throw new DatumDefectException(Prefix +
                $"no height datum. No point of the level network has a held or weighted height, so the height of " +
                $"every point ({List(part.Points)}) is undetermined. Hold the height of one benchmark (fix: h) or " +
                "weight it (sd_h).",
                ["height datum"]);
        }
    }

    private static DatumDefectException Disconnected(string what, List<Part> parts, List<Part> bad, string needs)
    {
        var lines = parts.Select((p, k) =>
            $"  part {k + 1}: {List(p.Points)}" +
                (bad.Contains(p) ? " — has no datum of its own" : " — has its datum"));
        return new DatumDefectException(Prefix +
            $"the {what} network falls apart into {parts.Count} parts that no observation joins:" +
            Environment.NewLine +
            string.Join(Environment.NewLine, lines) + Environment.NewLine +
            "Join the parts by observations (a distance and a direction between them), or give each part its own " +
            $"datum: {needs}.",
            bad.Select((p, k) => $"{what} network part with {p.Points[0]}").ToList());
    }

    private static void CheckConnected(List<Part> plane, List<Part> height, DatumDefinition datum)
    {
        string mode = datum.Mode == DatumMode.InnerConstraints ? "a free network" : "minimal constraints";
        if (plane.Count > 1)
            throw DisconnectedFree("plane", plane, mode);
        if (height.Count > 1)
            throw DisconnectedFree("level", height, mode);
    }

    private static DatumDefectException DisconnectedFree(string what, List<Part> parts, string mode) =>
        new(Prefix + $"the {what} network falls apart into {parts.Count} parts that no observation joins:" +
            Environment.NewLine +
            string.Join(Environment.NewLine, parts.Select((p, k) => $"  part {k + 1}: {List(p.Points)}")) +
            Environment.NewLine +
            $"Their relative position is undetermined, and {mode} can define the datum of one connected network " +
            "only. Join the parts by observations, or adjust each part on its own.",
            parts.Select(p => $"{what} network part with {p.Points[0]}").ToList());

    /// <summary>The datum element a plane network part lacks.</summary>
    private enum MissingElement
    {
        Position,
        Scale,
        Orientation,
    }
}
