using NetAdjust.Network;

namespace NetAdjust.Stochastic;

/// <summary>
/// The error budget of a zenith angle (the mean of n sets):
/// <list type="bullet">
/// <item>pointing and reading of the vertical circle: σ_ISO,z/√n in both faces, σ_ISO,z·√2/√n in one face, with
/// σ_ISO,z the instrument's ISO 17123-3 zenith-angle standard deviation (one zenith angle in both faces), taken as
/// for directions (<see cref="DirectionBudgetBuilder.PointingReading(Units.Angle, ObservingProcedure)"/>);</item>
/// <item>instrument height and target height: an error σ_h in the height of either end moves the zenith angle by
/// σ_h·s/D² (the equation's partial derivative by that height, s the horizontal and D the slope distance), which is
/// σ_h/s for a horizontal sight and less for an inclined one; the budget takes σ_h/s (common practice, the safe
/// side), the heights' standard deviations from the instrument and target specifications;</item>
/// <item>refraction: an error σ_k in the assumed refraction coefficient moves the zenith angle by σ_k·s/(2R)
/// (∂z/∂k = −s/(2R), <see cref="Geometry.SpatialGeometry.ZenithByRefraction(double)"/>), and a height difference
/// reduced from it by σ_k·s²/(2R), the error of the curvature-and-refraction correction (1 − k)s²/(2R).</item>
/// </list>
/// Centering moves a zenith angle only through the change of the horizontal distance, second order for a
/// near-horizontal sight; it is not counted here (the correlated centering model, which uses the equation's partial
/// derivatives, does carry it).
/// </summary>
public static class ZenithBudgetBuilder
{
    /// <summary>Builds the budget.</summary>
    /// <param name="instrument">The total station (its <see cref="TotalStationSpecification.ZenithSd"/> and
    /// <see cref="TotalStationSpecification.HeightSd"/>).</param>
    /// <param name="target">The target (its <see cref="TargetSpecification.HeightSd"/>); null for none.</param>
    /// <param name="procedure">Sets and faces.</param>
    /// <param name="horizontalDistance">The horizontal sight length s, metres (&gt; 0).</param>
    /// <param name="refractionSd">σ_k of the assumed refraction coefficient (≥ 0; 0 when k is estimated or its
    /// uncertainty not counted).</param>
    /// <returns>Contributions <c>zenith_pointing_reading</c>, <c>instrument_height</c>, <c>target_height</c>,
    /// <c>refraction</c>, angles.</returns>
    /// <exception cref="InvalidInputException">When s is not positive, σ_k is negative or the instrument has no
    /// zenith standard deviation.</exception>
    public static ErrorBudget Build(TotalStationSpecification instrument, TargetSpecification? target,
        ObservingProcedure procedure, double horizontalDistance, double refractionSd = 0)
    {
        ArgumentNullException.ThrowIfNull(instrument);
        ArgumentNullException.ThrowIfNull(procedure);
        Checks.Positive(horizontalDistance, "the horizontal sight length");
        if (!(refractionSd >= 0) || !double.IsFinite(refractionSd))
            throw new InvalidInputException(
                $"the standard deviation of the refraction coefficient must be 0 or more, not {refractionSd}");
        if (!(instrument.ZenithSd > 0))
            throw new InvalidInputException(
                $"instrument {instrument.Id} has no zenith_sd, so it cannot weight a zenith angle");
        return new ErrorBudget(
        [
            new(ContributionNames.ZenithPointingReading,
                DirectionBudgetBuilder.PointingReading(instrument.ZenithSd, procedure)),
            new(ContributionNames.InstrumentHeight, instrument.HeightSd / horizontalDistance),
            new(ContributionNames.TargetHeight, (target?.HeightSd ?? 0.0) / horizontalDistance),
            new(ContributionNames.Refraction,
                refractionSd * Math.Abs(Geometry.SpatialGeometry.ZenithByRefraction(horizontalDistance))),
        ], isAngle: true);
    }
}
