using NetAdjust.Network;

namespace NetAdjust.Stochastic;

/// <summary>
/// The error budget of a horizontal distance measured by EDM:
/// σ_D = √(a² + (b·D)² + σ_i² + σ_t²), with a the EDM constant part, b the proportional part (ppm × 10⁻⁶),
/// D the distance, σ_i and σ_t the instrument and target centering errors (per axis: the component along the line).
/// Each term is an independent error and they combine as an error of a sum. Source: the usual distance budget,
/// e.g. Ghilani (2017), <i>Adjustment Computations</i>, 6th ed., ch. 6 "errors in distance measurement" (from memory).
/// </summary>
public static class DistanceBudgetBuilder
{
    /// <summary>Builds the budget.</summary>
    /// <param name="instrument">The total station (must have an EDM specification).</param>
    /// <param name="target">The target; null for none (e.g. reflectorless, centering not counted).</param>
    /// <param name="distance">The distance D, metres (&gt; 0): the observed distance.</param>
    /// <returns>Contributions <c>edm_constant</c>, <c>edm_proportional</c>, <c>instrument_centering</c>,
    /// <c>target_centering</c> (metres).</returns>
    /// <exception cref="InvalidInputException">When the instrument has no EDM specification or D is not
    /// positive.</exception>
    public static ErrorBudget Build(TotalStationSpecification instrument, TargetSpecification? target, double distance)
    {
        ArgumentNullException.ThrowIfNull(instrument);
        var edm = instrument.Edm ?? throw new InvalidInputException(
            $"instrument {instrument.Id} has no EDM specification, so it cannot weight a distance");
        Checks.Positive(distance, "the distance");
        return new ErrorBudget(
        [
            new(ContributionNames.EdmConstant, edm.Constant),
            new(ContributionNames.EdmProportional, edm.Ppm * 1e-6 * distance),
            new(ContributionNames.InstrumentCentering, instrument.CenteringSd),
            new(ContributionNames.TargetCentering, target?.CenteringSd ?? 0.0),
        ], isAngle: false);
    }
}
