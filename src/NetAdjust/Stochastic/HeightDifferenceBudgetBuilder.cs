using NetAdjust.Network;

namespace NetAdjust.Stochastic;

/// <summary>
/// The error budget of a levelled height difference, by one of two models:
/// <list type="bullet">
/// <item>per km: σ = s_ISO·√K·√(2/runs). s_ISO (ISO 17123-2) is the σ of 1 km of double-run levelling; K is the
/// section length in km (the error of a series of km-long pieces grows with √K); a single run is √2 worse
/// than the mean of two runs (error of redundant measurement);</item>
/// <item>per reading: each setup gives a backsight and a foresight reading, so one run of s setups is a series of
/// 2s readings: σ_run = σ_r·√(2s) (error of a series), with the rounding of each reading to the resolution d as a
/// second series (d/√12 uniform, GUM JCGM 100:2008 §4.3.7, or d/2 conservative); the mean of m runs divides
/// by √m.</item>
/// </list>
/// </summary>
public static class HeightDifferenceBudgetBuilder
{
    /// <summary>Builds the budget.</summary>
    /// <param name="level">The level.</param>
    /// <param name="length">The section length, metres (&gt; 0); required by the per-km model.</param>
    /// <param name="procedure">Setups and runs; the setups are required by the per-reading model. Null: the per-km
    /// model assumes a double run.</param>
    /// <returns>Contributions <c>levelling_per_km</c>, or <c>rod_readings</c> and <c>rod_rounding</c>
    /// (metres).</returns>
    /// <exception cref="InvalidInputException">When the model's required data are missing or out of range.</exception>
    public static ErrorBudget Build(LevelSpecification level, double? length, LevellingProcedure? procedure)
    {
        ArgumentNullException.ThrowIfNull(level);
        if (level.SdPerKm is double perKm)
        {
            if (length is not double l)
                throw new InvalidInputException(
                    $"level {level.Id} is specified per km, so the section needs its length");
            Checks.Positive(l, "the section length");
            int runs = procedure?.Runs ?? 2;
            double sd = perKm * Math.Sqrt(l / 1000.0) * Math.Sqrt(2.0 / runs);
            return new ErrorBudget([new(ContributionNames.LevellingPerKm, sd)], isAngle: false);
        }
        if (procedure is null)
            throw new InvalidInputException(
                $"level {level.Id} is specified per reading, so the section needs its number of setups");
        double readings = ErrorPropagation.Mean(ErrorPropagation.Series(level.ReadingSd!.Value, procedure.Readings),
            procedure.Runs);
        double rounding = ErrorPropagation.Mean(ErrorPropagation.Series(level.RoundingSd, procedure.Readings),
            procedure.Runs);
        return new ErrorBudget(
        [
            new(ContributionNames.RodReadings, readings),
            new(ContributionNames.RodRounding, rounding),
        ], isAngle: false);
    }
}
