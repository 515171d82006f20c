namespace NetAdjust.Network;

/// <summary>
/// How an observation is weighted from specifications, as data: the instrument, target and observing procedure of
/// its setup, or the level and procedure of a levelling section. The stochastic model (NetAdjust.Stochastic) turns
/// it into an error budget at the adjustment's coordinates; nothing here is computed.
/// </summary>
public sealed record ObservationWeighting
{
    /// <summary>The total station of the setup; null for a levelled height difference.</summary>
    public TotalStationSpecification? Instrument { get; init; }

    /// <summary>The target sighted (both targets of an angle); null for none (centering not counted).</summary>
    public TargetSpecification? Target { get; init; }

    /// <summary>Sets and faces of the setup.</summary>
    public ObservingProcedure Procedure { get; init; } = ObservingProcedure.Default;

    /// <summary>The level of a levelling section; null for total-station observations.</summary>
    public LevelSpecification? Level { get; init; }

    /// <summary>Setups and runs of a levelling section.</summary>
    public LevellingProcedure? Levelling { get; init; }

    /// <summary>
    /// Distances observed in the same setup, by target point (metres): the sight lengths of that setup. Sights to
    /// other points are taken from the adjustment's coordinates.
    /// </summary>
    public IReadOnlyDictionary<string, double> ObservedSights
    {
        get;
        init => field = ReadOnlyCopies.Dictionary(value);
    } = ReadOnlyCopies.Dictionary(new Dictionary<string, double>(StringComparer.Ordinal));
}
