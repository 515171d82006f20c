using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Stochastic;

/// <summary>
/// The error budget of a horizontal direction (one circle reading, the mean of n sets):
/// <list type="bullet">
/// <item>pointing and reading: σ_ISO/√n in both faces, σ_ISO·√2/√n in one face only. σ_ISO (ISO 17123-3) is the
/// standard deviation of a direction observed once in both faces, i.e. the mean of two face readings; one face
/// alone is therefore √2 worse, and n sets are a redundant measurement (E/√n);</item>
/// <item>instrument centering σ_i/D and target centering σ_t/D (radians): a centering offset across the line of sight
/// of σ (per axis) turns the direction by σ/D. Ghilani (2017), <i>Adjustment Computations</i>, 6th ed., ch. 6 (from
/// memory).</item>
/// </list>
/// </summary>
public static class DirectionBudgetBuilder
{
    /// <summary>Builds the budget.</summary>
    /// <param name="instrument">The total station.</param>
    /// <param name="target">The target; null for none (centering not counted).</param>
    /// <param name="procedure">Sets and faces.</param>
    /// <param name="distance">The sight length D, metres (&gt; 0): the observed distance, or one computed from
    /// approximate coordinates.</param>
    /// <returns>Contributions <c>pointing_reading</c>, <c>instrument_centering</c>, <c>target_centering</c>
    /// (radians).</returns>
    /// <exception cref="InvalidInputException">When D is not positive.</exception>
    public static ErrorBudget Build(TotalStationSpecification instrument, TargetSpecification? target,
        ObservingProcedure procedure, double distance)
    {
        ArgumentNullException.ThrowIfNull(instrument);
        ArgumentNullException.ThrowIfNull(procedure);
        Checks.Positive(distance, "the sight length");
        return new ErrorBudget(
        [
            new(ContributionNames.PointingReading, PointingReading(instrument.DirectionSd, procedure)),
            new(ContributionNames.InstrumentCentering, instrument.CenteringSd / distance),
            new(ContributionNames.TargetCentering, (target?.CenteringSd ?? 0.0) / distance),
        ], isAngle: true);
    }

    /// <summary>σ of the mean direction of n sets: σ_ISO/√n in both faces, σ_ISO·√2/√n in one face.</summary>
    /// <param name="isoSd">ISO 17123-3 σ of one direction in both faces.</param>
    /// <param name="procedure">Sets and faces.</param>
    /// <returns>The standard deviation of the mean direction.</returns>
    public static Angle PointingReading(Angle isoSd, ObservingProcedure procedure) =>
        Angle.FromRadians(PointingReading(isoSd.Radians, procedure));

    /// <summary>σ of the mean direction of n sets, for the library: see
    /// <see cref="PointingReading(Angle, ObservingProcedure)"/>.</summary>
    /// <param name="isoSd">ISO 17123-3 σ of one direction in both faces (radians or any angular unit).</param>
    /// <param name="procedure">Sets and faces.</param>
    /// <returns>In the unit of <paramref name="isoSd"/>.</returns>
    internal static double PointingReading(double isoSd, ObservingProcedure procedure)
    {
        ArgumentNullException.ThrowIfNull(procedure);
        double oneSet = procedure.Faces == Faces.Both ? isoSd : isoSd * Math.Sqrt(2.0);
        return ErrorPropagation.Mean(oneSet, procedure.Sets);
    }
}
