using NetAdjust.Adjustment;
using NetAdjust.Network;
using NetAdjust.Statistics;

namespace NetAdjust.Procedures;

/// <summary>Changes an observation's standard deviation for re-weighting, scaling its error budget with it.</summary>
internal static class Reweighting
{
    /// <summary>
    /// A copy with standard deviation <paramref name="sd"/>; an error budget is scaled by the same factor, so its total
    /// stays equal to the standard deviation and a correlated weight model built from it stays positive definite.
    /// </summary>
    public static Observation WithSd(Observation o, double sd)
    {
        if (sd == o.StandardDeviation) return o;
        double k = sd / o.StandardDeviation;
        return o with { StandardDeviation = sd, Budget = o.Budget?.Scaled(k) };
    }
}
