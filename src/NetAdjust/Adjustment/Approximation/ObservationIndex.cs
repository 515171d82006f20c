using NetAdjust.Network;

namespace NetAdjust.Adjustment.Approximation;

/// <summary>
/// Which observations link which points, built once from a network's observations: the observations of each point
/// and the direction sets (in input order), and the sets each point is the station or a target of. Immutable after
/// construction; one index belongs to one network and is passed explicitly (no cache behind the caller's back).
/// </summary>
internal sealed class ObservationIndex
{
    private readonly Dictionary<string, List<Observation>> _byPoint = new(StringComparer.Ordinal);
    private readonly Dictionary<string, List<DirectionObservation>> _sets = new(StringComparer.Ordinal);
    private readonly Dictionary<string, List<string>> _setsByPoint = new(StringComparer.Ordinal);

    /// <summary>Indexes the observations of <paramref name="network"/> (those set aside included).</summary>
    public ObservationIndex(SurveyNetwork network)
    {
        Network = network;
        foreach (var o in network.Observations)
        {
            foreach (var p in o.Points)
            {
                if (!_byPoint.TryGetValue(p, out var list)) _byPoint[p] = list = [];
                list.Add(o);
            }
            if (ApproximationOffers.SetMember(o) is DirectionObservation d)
            {
                if (!_sets.TryGetValue(d.SetId, out var dirs)) _sets[d.SetId] = dirs = [];
                dirs.Add(d);
            }
        }
        foreach (var (k, dirs) in _sets)
            foreach (var p in dirs.Select(d => d.Target).Append(dirs[0].Station).Distinct(StringComparer.Ordinal))
            {
                if (!_setsByPoint.TryGetValue(p, out var list)) _setsByPoint[p] = list = [];
                list.Add(k);
            }
    }

    /// <summary>
    /// The indices in <paramref name="network"/>'s points of the points observation <paramref name="o"/> involves, as
    /// <see cref="Observation.Points"/> lists them (station, from, to; without repeats), written to
    /// <paramref name="indices"/> (at least three long).
    /// </summary>
    /// <returns>How many were written.</returns>
    public static int PointsOf(SurveyNetwork network, Observation o, Span<int> indices)
    {
        int count = 0;
        // (a repeated id is not looked up again)
        string? at = o.At, from = o.From, to = o.To;
        from = from == at ? null : from;
        to = to == at || to == o.From ? null : to;
        foreach (string? id in (ReadOnlySpan<string?>)[at, from, to])
        {
            if (id is null) continue;
            int k = network.IndexOf(id);
            if (indices[..count].Contains(k)) continue;
            indices[count++] = k;
        }
        return count;
    }

    /// <summary>The network indexed.</summary>
    public SurveyNetwork Network { get; }

    /// <summary>Direction sets by id, each with its directions in input order; sets in order of first
    /// appearance.</summary>
    public IReadOnlyDictionary<string, List<DirectionObservation>> Sets => _sets;

    /// <summary>The observations that involve point <paramref name="id"/>, in input order.</summary>
    public IReadOnlyList<Observation> ObservationsOf(string id) =>
        _byPoint.TryGetValue(id, out var list) ? list : [];

    /// <summary>The ids of the direction sets point <paramref name="id"/> is the station or a target of.</summary>
    public IReadOnlyList<string> SetsOf(string id) => _setsByPoint.TryGetValue(id, out var list) ? list : [];

    /// <summary>The targets of the direction sets observed at point <paramref name="id"/>.</summary>
    public HashSet<string> SeenFrom(string id) =>
        ObservationsOf(id).Select(ApproximationOffers.SetMember).OfType<DirectionObservation>()
            .Where(d => d.Station == id).Select(d => d.Target).ToHashSet(StringComparer.Ordinal);

    /// <summary>The ids of the direction sets observed at point <paramref name="id"/>, in order of first use.</summary>
    public IEnumerable<string> SetsAt(string id) =>
        ObservationsOf(id).Select(ApproximationOffers.SetMember).OfType<DirectionObservation>()
            .Where(d => d.Station == id).Select(d => d.SetId).Distinct(StringComparer.Ordinal);
}
