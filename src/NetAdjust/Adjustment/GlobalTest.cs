using MathNet.Numerics.Distributions;

namespace NetAdjust.Adjustment;

/// <summary>
/// The two-tailed χ² test of the variance factor ("global test"): the statistic T = vᵀPv / σ0² follows χ²(r)
/// when the model is right. Accept when χ²(α/2; r) ≤ T ≤ χ²(1 − α/2; r).
/// See docs/methods.md (Pope 1976; Koch 1999, §4.2; quantiles: NIST/SEMATECH e-Handbook §1.3.6.7.4).
/// </summary>
/// <param name="Alpha">Significance level α.</param>
/// <param name="Statistic">T = vᵀPv / σ0².</param>
/// <param name="DegreesOfFreedom">r.</param>
/// <param name="Lower">χ²(α/2; r), or null when r = 0.</param>
/// <param name="Upper">χ²(1 − α/2; r), or null when r = 0.</param>
public sealed record GlobalTest(double Alpha, double Statistic, int DegreesOfFreedom, double? Lower, double? Upper)
{
    /// <summary>True when the test passed, false when it failed, null when it cannot be made (r = 0).</summary>
    public bool? Passed => Lower is null || Upper is null ? null : Statistic >= Lower && Statistic <= Upper;

    /// <summary>Performs the test.</summary>
    /// <param name="vtpv">vᵀPv.</param>
    /// <param name="aprioriVarianceFactor">σ0², positive.</param>
    /// <param name="degreesOfFreedom">r ≥ 0.</param>
    /// <param name="alpha">α in (0, 1).</param>
    public static GlobalTest Compute(double vtpv, double aprioriVarianceFactor, int degreesOfFreedom, double alpha)
    {
        double t = vtpv / aprioriVarianceFactor;
        if (degreesOfFreedom <= 0) return new GlobalTest(alpha, t, degreesOfFreedom, null, null);
        return new GlobalTest(alpha, t, degreesOfFreedom,
            ChiSquared.InvCDF(degreesOfFreedom, alpha / 2),
            ChiSquared.InvCDF(degreesOfFreedom, 1 - (alpha / 2)));
    }
}
