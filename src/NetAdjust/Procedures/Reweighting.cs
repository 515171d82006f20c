using NetAdjust.Adjustment;
using NetAdjust.Network;

namespace NetAdjust.Procedures;

/// <summary>Changes an observation's standard deviation for re-weighting.</summary>
internal static class Reweighting
{
    /// <summary>
    /// A copy with standard deviation <paramref name="sd"/>. An observation weighted from specifications keeps its
    /// weighting, whose error budget the stochastic model scales to the new σ (so a correlated weight model built
    /// from it stays positive definite).
    /// </summary>
    public static Observation WithSd(Observation o, double sd) =>
        sd == o.StandardDeviation ? o : o with { StandardDeviation = sd };

    /// <summary>
    /// The network with the standard deviations derived from specifications filled in (at the adjusted coordinates
    /// of one adjustment), so that a procedure can start from every observation's σ; the same network when every σ
    /// is given.
    /// </summary>
    public static SurveyNetwork WithStandardDeviations(SurveyNetwork network, AdjustmentOptions options) =>
        network.Observations.Any(o => double.IsNaN(o.StandardDeviation))
            ? Adjuster.Adjust(network, options).Network : network;
}
