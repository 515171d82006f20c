namespace NetAdjust.Network;

/// <summary>
/// An immutable survey network: points and observations, checked for consistency on construction
/// (unique ids, known points, positive standard deviations, fixed components with values).
/// </summary>
public sealed class SurveyNetwork
{
    private readonly Dictionary<string, int> _index;

    /// <summary>Creates and validates a network.</summary>
    /// <param name="name">A title for reports (e.g. the project name).</param>
    /// <param name="points">The points, in input order (the order of every listing).</param>
    /// <param name="observations">The observations, in input order.</param>
    /// <exception cref="InvalidInputException">Listing every problem found, each with its source.</exception>
    public SurveyNetwork(string name, IEnumerable<Point> points, IEnumerable<Observation> observations)
    {
        Name = name;
        Points = ReadOnlyCopies.List(points);
        Observations = ReadOnlyCopies.List(observations);
        _index = new Dictionary<string, int>(Points.Count, StringComparer.Ordinal);
        var problems = new List<string>();
        for (int i = 0; i < Points.Count; i++)
        {
            var p = Points[i];
            // the place in messages ("file:line: "), made only for a point with a problem
            string At() => p.Source is null ? "" : $"{p.Source}: ";
            if (string.IsNullOrWhiteSpace(p.Id)) { problems.Add($"{At()}a point has an empty id"); continue; }
            if (!_index.TryAdd(p.Id, i)) problems.Add($"{At()}point {p.Id} is defined twice");
            if (p.IsFixed(Fixity.E) && p.E is null)
                problems.Add($"{At()}point {p.Id} holds its easting fixed but gives no easting");
            if (p.IsFixed(Fixity.N) && p.N is null)
                problems.Add($"{At()}point {p.Id} holds its northing fixed but gives no northing");
            if (p.IsFixed(Fixity.H) && p.H is null)
                problems.Add($"{At()}point {p.Id} holds its height fixed but gives no height");
            if (p.SdE is not null || p.SdN is not null || p.SdH is not null)
            {
                string at = At();
                CheckWeighted(p, p.SdE, p.E, Fixity.E, "easting", at, problems);
                CheckWeighted(p, p.SdN, p.N, Fixity.N, "northing", at, problems);
                CheckWeighted(p, p.SdH, p.H, Fixity.H, "height", at, problems);
            }
        }
        _use = new byte[Points.Count];
        // A large network is checked in two halves on two cores first, each half marking the points it reaches in
        // its own array; only when that finds a problem (or for a small network) does the one-core pass below run,
        // which words every problem in the order of the observations.
        if (problems.Count == 0 && Observations is { Count: >= ConcurrentCheckObservations } &&
            Environment.ProcessorCount > 1 && ChecksInHalves()) return;
        var sets = new Dictionary<string, string>(StringComparer.Ordinal);
        // the set of the direction before (the directions of a set follow one another, often sharing one id string)
        string? lastSetId = null, lastStation = null;
        foreach (var o in Observations)
        {
            Check(o, _use, problems);
            if (!SameSetAsBefore(o, sets, ref lastSetId, ref lastStation))
                problems.Add($"{o.Describe()}: direction set {((DirectionObservation)o).SetId} already belongs to " +
                    $"station {sets[((DirectionObservation)o).SetId]}");
        }
        if (problems.Count > 0)
            throw new InvalidInputException("The network is not valid:" + Environment.NewLine + "  " +
                string.Join(Environment.NewLine + "  ", problems));
    }

    /// <summary>Observations from which the checks run in two halves on two cores.</summary>
    private const int ConcurrentCheckObservations = 200_000;

    /// <summary>The checks of <see cref="Check"/> and of the direction sets, the observations in two halves and the
    /// sets on their own, concurrently; true when nothing is wrong (then <see cref="_use"/> is what the one-core pass
    /// gives).</summary>
    private bool ChecksInHalves()
    {
        var all = Observations;
        int n = all.Count, mid = n / 2;
        var second = new byte[_use.Length];
        bool firstOk = true, secondOk = true, setsOk = true;
        Parallel.Invoke(
            () => firstOk = CheckRange(0, mid, _use),
            () => secondOk = CheckRange(mid, n, second),
            () =>
            {
                var sets = new Dictionary<string, string>(StringComparer.Ordinal);
                string? lastSetId = null, lastStation = null;
                foreach (var o in all)
                    if (!SameSetAsBefore(o, sets, ref lastSetId, ref lastStation)) { setsOk = false; return; }
            });
        for (int i = 0; i < _use.Length; i++) _use[i] |= second[i];
        if (firstOk && secondOk && setsOk) return true;
        Array.Clear(_use);
        return false;
    }

    private bool CheckRange(int from, int to, byte[] use)
    {
        for (int k = from; k < to; k++)
            if (!Check(Observations[k], use, null)) return false;
        return true;
    }

    /// <summary>One observation's own checks (its points defined, distinct; its standard deviation, factor and value
    /// sound); each point found is marked in <paramref name="use"/> as reached by a counting or a set-aside
    /// observation. Adds each problem to <paramref name="problems"/> (when given); false when there is one.</summary>
    private bool Check(Observation o, byte[] use, List<string>? problems)
    {
        bool ok = true;
        void Problem(string text)
        {
            ok = false;
            problems?.Add(text);
        }
        // the observation's points (Observation.Points) without a list per observation
        string? oAt = o.At;
        string oFrom = o.From, oTo = o.To;
        byte bit = o.Excluded ? SetAsideUse : CountingUse;
        if (oAt is not null) Reach(oAt);
        if (oFrom is not null && oFrom != oAt) Reach(oFrom);
        if (oTo is not null && oTo != oAt && oTo != oFrom) Reach(oTo);
        void Reach(string id)
        {
            if (_index.TryGetValue(id, out int i)) use[i] |= bit;
            else Problem($"{o.Describe()}: point {id} is not defined in the points list");
        }
        if (oFrom == oTo || (oAt is not null && (oAt == oTo || oAt == oFrom) && o.Kind != ObservationKind.Direction))
            Problem($"{o.Describe()}: an observation needs distinct points");
        bool derived = o.Weighting is not null && double.IsNaN(o.StandardDeviation);
        if (!derived && (!(o.StandardDeviation > 0) || !double.IsFinite(o.StandardDeviation)))
            Problem($"{o.Describe()}: the standard deviation must be positive");
        if (!(o.SdFactor > 0) || !double.IsFinite(o.SdFactor))
            Problem($"{o.Describe()}: the standard deviation factor must be positive");
        if (!double.IsFinite(o.Value)) Problem($"{o.Describe()}: the value is not a finite number");
        if (o.Kind == ObservationKind.Distance && !(o.Value > 0))
            Problem($"{o.Describe()}: a distance must be positive");
        return ok;
    }

    /// <summary>False when <paramref name="o"/> is a direction of a set that already belongs to another station
    /// (then the set's station stays as it was); records a new set. A direction of the same set id string and
    /// station as the direction before (<paramref name="lastSetId"/>, <paramref name="lastStation"/>) is already
    /// its station's.</summary>
    private static bool SameSetAsBefore(Observation o, Dictionary<string, string> sets, ref string? lastSetId,
        ref string? lastStation)
    {
        if (o is not DirectionObservation d || (ReferenceEquals(d.SetId, lastSetId) && d.Station == lastStation))
            return true;
        if (sets.TryGetValue(d.SetId, out var st) && st != d.Station)
        {
            lastSetId = lastStation = null;
            return false;
        }
        (sets[d.SetId], lastSetId, lastStation) = (d.Station, d.SetId, d.Station);
        return true;
    }

    private const byte CountingUse = 1, SetAsideUse = 2;

    /// <summary>Per point: <see cref="CountingUse"/> when an observation that is not set aside involves it,
    /// <see cref="SetAsideUse"/> when a set-aside one does (both bits when both).</summary>
    private readonly byte[] _use;

    /// <summary>True when an observation that is not set aside involves the point at <paramref name="index"/> in
    /// <see cref="Points"/> (the project's warnings: a point no observation reaches).</summary>
    internal bool IsReached(int index) => (_use[index] & CountingUse) != 0;

    /// <summary>True when a set-aside observation involves the point at <paramref name="index"/>.</summary>
    internal bool IsReachedBySetAside(int index) => (_use[index] & SetAsideUse) != 0;

    private static void CheckWeighted(Point p, double? sd, double? value, Fixity c, string name, string at,
        List<string> problems)
    {
        if (sd is null) return;
        if (!(sd > 0) || !double.IsFinite(sd.Value))
            problems.Add($"{at}point {p.Id}: the standard deviation of its {name} must be positive");
        if (value is null) problems.Add($"{at}point {p.Id} weights its {name} but gives no {name}");
        if (p.IsFixed(c)) problems.Add($"{at}point {p.Id} both fixes and weights its {name}: choose one");
    }

    /// <summary>A title for reports.</summary>
    public string Name { get; }

    /// <summary>The points, in input order.</summary>
    public IReadOnlyList<Point> Points { get; }

    /// <summary>The observations, in input order.</summary>
    public IReadOnlyList<Observation> Observations { get; }

    /// <summary>The position of a point in <see cref="Points"/>.</summary>
    /// <param name="id">The point id.</param>
    /// <exception cref="KeyNotFoundException">When no point has that id.</exception>
    public int IndexOf(string id) => _index[id];

    /// <summary>The point with the given id.</summary>
    /// <param name="id">The point id.</param>
    public Point this[string id] => Points[_index[id]];

    /// <summary>True when a point with the given id exists.</summary>
    /// <param name="id">The point id.</param>
    public bool Contains(string id) => _index.ContainsKey(id);
}
