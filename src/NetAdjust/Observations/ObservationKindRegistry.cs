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

    /// <summary>The most slots an observation's equation reads (<see cref="Slots"/>).</summary>
    internal const int MostSlots = 3;

    /// <summary>
    /// The slots of the points (and direction set) whose coordinates an observation's equation reads, for
    /// <see cref="EvaluateInto"/>: station or from point, then target, then the direction set or the foresight. The
    /// plane kinds are evaluated by slots, and GNSS baselines without frame rotations whose ends have plane
    /// coordinates and heights; for the others no slot is written.
    /// </summary>
    /// <param name="observation">The observation.</param>
    /// <param name="at">The coordinates.</param>
    /// <param name="slots">Room for <see cref="MostSlots"/> slots.</param>
    /// <returns>The number of slots written; 0 when the kind is evaluated by names.</returns>
    internal static int Slots(Observation observation, IIndexedCoordinates at, Span<int> slots)
    {
        switch (observation)
        {
            case DistanceObservation or AzimuthObservation:
                slots[0] = at.PlaneSlot(observation.From);
                slots[1] = at.PlaneSlot(observation.To);
                return 2;
            case DirectionObservation r:
                slots[0] = at.PlaneSlot(r.Station);
                slots[1] = at.PlaneSlot(r.Target);
                slots[2] = at.SetSlot(r.SetId);
                return 3;
            case AngleObservation a:
                slots[0] = at.PlaneSlot(a.Station);
                slots[1] = at.PlaneSlot(a.Backsight);
                slots[2] = at.PlaneSlot(a.Foresight);
                return 3;
            case BaselineObservation b when BaselineKind.BySlots(b):
                slots[0] = at.SpatialSlotOrNone(b.From);
                slots[1] = at.SpatialSlotOrNone(b.To);
                return slots[0] >= 0 && slots[1] >= 0 ? 2 : 0;
            default:
                return 0;
        }
    }

    private static readonly (int Slot, Parameter Parameter)[] TwoPoints =
        [(0, Parameter.E), (0, Parameter.N), (1, Parameter.E), (1, Parameter.N)];

    private static readonly (int Slot, Parameter Parameter)[] DirectionPartials =
        [.. TwoPoints, (2, Parameter.Orientation)];

    private static readonly (int Slot, Parameter Parameter)[] ThreePoints =
        [.. TwoPoints, (2, Parameter.E), (2, Parameter.N)];

    private static readonly (int Slot, Parameter Parameter)[] BaselineEnds =
        [(0, Parameter.E), (1, Parameter.E), (0, Parameter.N), (1, Parameter.N), (0, Parameter.H), (1, Parameter.H)];

    /// <summary>
    /// What each derivative <see cref="EvaluateInto"/> writes for a kind evaluated by slots is taken by: the
    /// position in <see cref="Slots"/> of its point (or set) and the parameter, in the order of the derivatives
    /// (the order of <see cref="Evaluate"/>'s partials); empty for a kind evaluated by names. Read only for an
    /// observation that <see cref="Slots"/> gave slots (a baseline with frame rotations has none).
    /// </summary>
    /// <param name="kind">The kind.</param>
    internal static ReadOnlySpan<(int Slot, Parameter Parameter)> PartialsBySlot(ObservationKind kind) => kind switch
    {
        ObservationKind.Distance or ObservationKind.Azimuth => TwoPoints,
        ObservationKind.Direction => DirectionPartials,
        ObservationKind.Angle => ThreePoints,
        ObservationKind.Baseline => BaselineEnds,
        _ => [],
    };

    /// <summary>
    /// Evaluates the observation equation without allocating: the computed value, and the derivatives in the order of
    /// <see cref="Evaluate"/>'s partials (whose owners and parameters do not depend on the coordinates) written to
    /// <paramref name="partials"/>. The plane kinds are computed from the slots <see cref="Slots"/> gave (the same
    /// arithmetic as <see cref="Evaluate"/>); the others through <see cref="IObservationKind.Evaluate"/>.
    /// </summary>
    /// <param name="observation">The observation.</param>
    /// <param name="at">The coordinates.</param>
    /// <param name="slots">The observation's slots from <see cref="Slots"/> (empty for a kind evaluated by
    /// names).</param>
    /// <param name="partials">Room for the derivatives (at least as many as the equation has).</param>
    /// <param name="count">The number of derivatives written.</param>
    internal static double EvaluateInto(Observation observation, IIndexedCoordinates at, ReadOnlySpan<int> slots,
        Span<double> partials, out int count)
    {
        if (slots.Length > 0)
            switch (observation.Kind)
            {
                case ObservationKind.Distance:
                    count = 4;
                    return PlaneGeometry.Distance(at.Plane(slots[0]), at.Plane(slots[1]), partials);
                case ObservationKind.Direction:
                    count = 5;
                    return PlaneGeometry.Direction(at.Plane(slots[0]), at.Plane(slots[1]), at.Orientation(slots[2]),
                        partials);
                case ObservationKind.Azimuth:
                    count = 4;
                    return PlaneGeometry.Azimuth(at.Plane(slots[0]), at.Plane(slots[1]), partials);
                case ObservationKind.Angle:
                    count = 6;
                    return PlaneGeometry.Angle(at.Plane(slots[0]), at.Plane(slots[1]), at.Plane(slots[2]), partials);
                case ObservationKind.Baseline:
                    return BaselineKind.EvaluateInto((BaselineObservation)observation, at, slots, partials, out count);
            }
        var eq = Evaluate(observation, at);
        count = eq.Partials.Length;
        for (int k = 0; k < count; k++) partials[k] = eq.Partials[k].Derivative;
        return eq.Value;
    }

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
