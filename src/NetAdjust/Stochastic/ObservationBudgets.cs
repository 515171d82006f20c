using NetAdjust.Network;
using NetAdjust.Observations;

namespace NetAdjust.Stochastic;

/// <summary>
/// The error budget of an observation weighted from specifications (<see cref="Observation.Weighting"/>), chosen by
/// how its kind is measured (<see cref="IObservationKind.Measurement"/>). Sight lengths are the distances observed in
/// the same setup, else computed from the given coordinates (the adjustment's current ones).
/// </summary>
public static class ObservationBudgets
{
    /// <summary>The budget before any re-weighting factor; null when the observation is not weighted from
    /// specifications.</summary>
    /// <param name="observation">The observation.</param>
    /// <param name="at">The coordinates for sight lengths.</param>
    /// <exception cref="InvalidInputException">When the specifications cannot weight the observation.</exception>
    public static ErrorBudget? Of(Observation observation, ICoordinates at)
    {
        ArgumentNullException.ThrowIfNull(at);
        return Build(observation, at);
    }

    /// <summary>
    /// A sight length so long that the centering terms vanish (their size is σ_centering / length): taken for a
    /// provisional budget where a sight length is neither observed nor computable yet.
    /// </summary>
    internal const double UnknownSight = 1e9;

    /// <summary>
    /// The budget before any coordinates exist (for judging constructions of approximate coordinates): sight lengths
    /// observed in the same setup where there are some, else <see cref="UnknownSight"/> (no centering terms).
    /// </summary>
    /// <param name="observation">The observation.</param>
    internal static ErrorBudget? Provisional(Observation observation) => Build(observation, null);

    private static ErrorBudget? Build(Observation observation, ICoordinates? at)
    {
        ArgumentNullException.ThrowIfNull(observation);
        if (observation.Weighting is not ObservationWeighting w) return null;
        var kind = ObservationKindRegistry.Of(observation);
        try
        {
            if (kind.Measurement == Measurement.Levelling)
            {
                var level = w.Level
                    ?? throw new InvalidInputException("a levelled height difference is weighted from a level");
                double? length = (observation as HeightDifferenceObservation)?.LineLength?.Metres;
                return HeightDifferenceBudgetBuilder.Build(level, length, w.Levelling);
            }
            var ts = w.Instrument
                ?? throw new InvalidInputException("the observation is weighted from an instrument that is not named");
            string station = kind.Instrument(observation) ?? observation.From;
            double Sight(string target)
            {
                if (w.ObservedSights.TryGetValue(target, out double d)) return d;
                if (at is null) return UnknownSight;
                var a = at.Plane(station);
                var b = at.Plane(target);
                return Math.Sqrt(((b.E - a.E) * (b.E - a.E)) + ((b.N - a.N) * (b.N - a.N)));
            }
            return kind.Measurement switch
            {
                Measurement.ElectronicDistance => DistanceBudgetBuilder.Build(ts, w.Target, observation.Value),
                Measurement.CircleReading =>
                    DirectionBudgetBuilder.Build(ts, w.Target, w.Procedure, Sight(observation.To)),
                Measurement.CircleReadingDifference => AngleBudgetBuilder.Build(ts, w.Target, w.Target, w.Procedure,
                    Sight(observation.From), Sight(observation.To), observation.Value),
                Measurement.ZenithReading =>
                    ZenithBudgetBuilder.Build(ts, w.Target, w.Procedure, Sight(observation.To),
                        observation is ZenithObservation { RefractionEstimated: false } z ? z.RefractionSd : 0),
                _ => throw new InvalidInputException(
                    $"a {kind.Name.Replace('_', ' ')} is not weighted from an instrument"),
            };
        }
        catch (InvalidInputException e)
        {
            throw new InvalidInputException($"{observation.Describe()}: {e.Message}");
        }
    }
}
