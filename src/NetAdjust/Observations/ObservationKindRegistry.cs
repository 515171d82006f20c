using NetAdjust.Geometry;
using NetAdjust.Network;

namespace NetAdjust.Observations;

/// <summary>
/// The one registry of observation kinds: <see cref="ObservationKind"/> → its <see cref="IObservationKind"/>.
/// Adding a kind adds one line here (and its record in Network/Observation.cs and its kind file).
/// </summary>
public static class ObservationKindRegistry
{
    private static readonly IObservationKind[] Kinds =
    [
        new DistanceKind(),
        new DirectionKind(),
        new AngleKind(),
        new AzimuthKind(),
        new HeightDifferenceKind(),
        new SlopeDistanceKind(),
        new ZenithKind(),
        new BaselineKind(),
    ];

    private static readonly IObservationKind[] ByEnum = Build();

    /// <summary>All kinds in documentation order.</summary>
    public static IReadOnlyList<IObservationKind> All => Kinds;

    /// <summary>The description of a kind.</summary>
    /// <param name="kind">The kind.</param>
    /// <exception cref="ArgumentOutOfRangeException">When the kind is not registered.</exception>
    public static IObservationKind Of(ObservationKind kind) =>
        (int)kind >= 0 && (int)kind < ByEnum.Length && ByEnum[(int)kind] is { } k
            ? k : throw new ArgumentOutOfRangeException(nameof(kind), kind, "no observation kind is registered");

    /// <summary>The description of an observation's kind.</summary>
    /// <param name="observation">The observation.</param>
    public static IObservationKind Of(Observation observation)
    {
        ArgumentNullException.ThrowIfNull(observation);
        return Of(observation.Kind);
    }

    /// <summary>Evaluates the observation equation of <paramref name="observation"/> at the given
    /// coordinates.</summary>
    /// <param name="observation">The observation.</param>
    /// <param name="at">The coordinates.</param>
    public static EquationValue Evaluate(Observation observation, ICoordinates at) =>
        Of(observation).Evaluate(observation, at);

    /// <summary>True when the kind's values are angles (radians internally).</summary>
    /// <param name="kind">The kind.</param>
    public static bool IsAngular(this ObservationKind kind) => Of(kind).Unit == UnitClass.Angle;

    /// <summary>True when the kind uses the plane coordinates (E, N) of its points.</summary>
    /// <param name="kind">The kind.</param>
    public static bool IsHorizontal(ObservationKind kind) => (Of(kind).Axes & CoordinateAxes.Plane) != 0;

    /// <summary>The misclosure-style difference computed − observed, reduced to (−π, π] for angular kinds.</summary>
    /// <param name="kind">The kind.</param>
    /// <param name="computed">The computed value (SI).</param>
    /// <param name="observed">The observed value (SI).</param>
    public static double Difference(ObservationKind kind, double computed, double observed) =>
        IsAngular(kind) ? Units.Angle.ReduceSigned(computed - observed) : computed - observed;

    /// <summary>
    /// The datum elements fixed by the observations that carry weight (set-aside observations fix nothing):
    /// the union of their kinds' <see cref="IObservationKind.Fixes"/>. This is the one datum-defect test.
    /// </summary>
    /// <param name="observations">The observations.</param>
    public static DatumElements FixedBy(IEnumerable<Observation> observations)
    {
        ArgumentNullException.ThrowIfNull(observations);
        var fixes = DatumElements.None;
        foreach (var o in observations)
            if (!o.Excluded) fixes |= Of(o.Kind).Fixes;
        return fixes;
    }

    private static IObservationKind[] Build()
    {
        var values = Enum.GetValues<ObservationKind>();
        var byEnum = new IObservationKind[values.Max(v => (int)v) + 1];
        foreach (var k in Kinds)
        {
            if (byEnum[(int)k.Kind] is not null)
                throw new InvalidOperationException($"kind {k.Name} is registered twice");
            byEnum[(int)k.Kind] = k;
        }
        return byEnum;
    }
}
