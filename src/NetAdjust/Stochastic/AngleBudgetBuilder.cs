using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Stochastic;

/// <summary>
/// The error budget of a horizontal angle β = (foresight direction) − (backsight direction) at one setup:
/// <list type="bullet">
/// <item>pointing and reading: the difference of two independent directions, √2·σ_dir with σ_dir from
/// <see cref="DirectionBudgetBuilder.PointingReading(Units.Angle, ObservingProcedure)"/> (so a 5″ ISO instrument
/// gives 7.1″ for one set);</item>
/// <item>instrument centering: an offset e of the instrument (σ_i per axis) changes β by e·(n_b/D_b − n_f/D_f),
/// n the unit normals of the sights; by the law of propagation of variances
/// σ = σ_i·√(D_b² + D_f² − 2 D_b D_f cos β)/(D_b D_f) = σ_i·D₃/(D_b D_f), D₃ the distance between the targets.
/// The same geometry is given by Ghilani (2017), <i>Adjustment Computations</i>, 6th ed., ch. 6 "instrument centering
/// errors" (from memory), who writes σ_i/√2 because his σ_i is the radial (two-dimensional) centering error;</item>
/// <item>target centering: σ_tb/D_b and σ_tf/D_f, independent.</item>
/// </list>
/// </summary>
public static class AngleBudgetBuilder
{
    /// <summary>Builds the budget.</summary>
    /// <param name="instrument">The total station.</param>
    /// <param name="backsightTarget">Target on the backsight; null for none.</param>
    /// <param name="foresightTarget">Target on the foresight; null for none.</param>
    /// <param name="procedure">Sets and faces.</param>
    /// <param name="backsightDistance">D_b, metres (&gt; 0).</param>
    /// <param name="foresightDistance">D_f, metres (&gt; 0).</param>
    /// <param name="angle">The angle β.</param>
    /// <returns>Contributions <c>pointing_reading</c>, <c>instrument_centering</c>, <c>backsight_centering</c>,
    /// <c>foresight_centering</c>, angles.</returns>
    /// <exception cref="InvalidInputException">When a distance is not positive or the angle is not finite.</exception>
    public static ErrorBudget Build(TotalStationSpecification instrument, TargetSpecification? backsightTarget,
        TargetSpecification? foresightTarget, ObservingProcedure procedure, double backsightDistance,
        double foresightDistance, Angle angle) =>
        Build(instrument, backsightTarget, foresightTarget, procedure, backsightDistance, foresightDistance,
            angle.Radians);

    /// <summary>Builds the budget (the angle in radians, for the library).</summary>
    /// <param name="instrument">The total station.</param>
    /// <param name="backsightTarget">Target on the backsight; null for none.</param>
    /// <param name="foresightTarget">Target on the foresight; null for none.</param>
    /// <param name="procedure">Sets and faces.</param>
    /// <param name="backsightDistance">D_b, metres (&gt; 0).</param>
    /// <param name="foresightDistance">D_f, metres (&gt; 0).</param>
    /// <param name="angle">β, radians.</param>
    /// <returns>Contributions <c>pointing_reading</c>, <c>instrument_centering</c>, <c>backsight_centering</c>,
    /// <c>foresight_centering</c> (radians).</returns>
    /// <exception cref="InvalidInputException">When a distance is not positive or the angle is not finite.</exception>
    internal static ErrorBudget Build(TotalStationSpecification instrument, TargetSpecification? backsightTarget,
        TargetSpecification? foresightTarget, ObservingProcedure procedure, double backsightDistance,
        double foresightDistance, double angle)
    {
        ArgumentNullException.ThrowIfNull(instrument);
        ArgumentNullException.ThrowIfNull(procedure);
        Checks.Positive(backsightDistance, "the backsight distance");
        Checks.Positive(foresightDistance, "the foresight distance");
        if (!double.IsFinite(angle)) throw new InvalidInputException("the angle must be a finite number");
        double pointing = Math.Sqrt(2.0) * DirectionBudgetBuilder.PointingReading(instrument.DirectionSd, procedure);
        return new ErrorBudget(
        [
            new(ContributionNames.PointingReading, pointing),
            new(ContributionNames.InstrumentCentering,
                instrument.CenteringSd * CenteringFactor(backsightDistance, foresightDistance, angle)),
            new(ContributionNames.BacksightCentering, (backsightTarget?.CenteringSd ?? 0.0) / backsightDistance),
            new(ContributionNames.ForesightCentering, (foresightTarget?.CenteringSd ?? 0.0) / foresightDistance),
        ], isAngle: true);
    }

    /// <summary>D₃/(D_b D_f) = √(D_b² + D_f² − 2 D_b D_f cos β)/(D_b D_f), 1/m: the angle error per metre of instrument
    /// offset.</summary>
    /// <param name="backsightDistance">D_b, metres.</param>
    /// <param name="foresightDistance">D_f, metres.</param>
    /// <param name="angle">β, radians.</param>
    internal static double CenteringFactor(double backsightDistance, double foresightDistance, double angle)
    {
        double b = backsightDistance, f = foresightDistance;
        // 1/b² + 1/f² − 2cosβ/(b f), written to stay non-negative under rounding.
        double q = (1 / (b * b)) + (1 / (f * f)) - (2 * Math.Cos(angle) / (b * f));
        return Math.Sqrt(Math.Max(0.0, q));
    }
}
