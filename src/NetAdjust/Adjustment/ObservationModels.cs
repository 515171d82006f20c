using NetAdjust.Geometry;
using NetAdjust.Network;

namespace NetAdjust.Adjustment;

/// <summary>
/// The registry that joins each observation type to its observation equation in <see cref="PlaneGeometry"/>.
/// Adding a kind means adding its equation and one line here; the solver is not touched.
/// </summary>
public static class ObservationModels
{
    private static readonly Dictionary<Type, Func<Observation, ParameterState, EquationValue>> Models = new()
    {
        [typeof(DistanceObservation)] = (o, s) => PlaneGeometry.Distance(o.From, s.Plane(o.From), o.To, s.Plane(o.To)),
        [typeof(AzimuthObservation)] = (o, s) => PlaneGeometry.Azimuth(o.From, s.Plane(o.From), o.To, s.Plane(o.To)),
        [typeof(DirectionObservation)] = (o, s) =>
        {
            var d = (DirectionObservation)o;
            return PlaneGeometry.Direction(d.Station, s.Plane(d.Station), d.Target, s.Plane(d.Target), d.SetId, s.Orientation(d.SetId));
        },
        [typeof(AngleObservation)] = (o, s) =>
            PlaneGeometry.Angle(o.At!, s.Plane(o.At!), o.From, s.Plane(o.From), o.To, s.Plane(o.To)),
        [typeof(HeightDifferenceObservation)] = (o, s) => PlaneGeometry.HeightDifference(o.From, s.Height(o.From), o.To, s.Height(o.To)),
    };

    /// <summary>Evaluates the observation equation of <paramref name="observation"/> at the current parameters.</summary>
    /// <param name="observation">The observation.</param>
    /// <param name="state">Current parameter values.</param>
    /// <returns>The computed value and partial derivatives.</returns>
    public static EquationValue Evaluate(Observation observation, ParameterState state) =>
        Models.TryGetValue(observation.GetType(), out var f)
            ? f(observation, state)
            : throw new NotSupportedException($"No observation equation is registered for {observation.GetType().Name}.");

    /// <summary>True when the kind uses plane coordinates (E, N) of its points.</summary>
    /// <param name="kind">The kind.</param>
    public static bool IsHorizontal(ObservationKind kind) => kind != ObservationKind.HeightDifference;

    /// <summary>
    /// The misclosure-style difference computed − observed, reduced to (−π, π] for angular kinds.
    /// </summary>
    /// <param name="kind">The kind.</param>
    /// <param name="computed">The computed value (SI).</param>
    /// <param name="observed">The observed value (SI).</param>
    public static double Difference(ObservationKind kind, double computed, double observed) =>
        kind.IsAngular() ? Units.Angle.ReduceSigned(computed - observed) : computed - observed;
}
