using MathNet.Numerics.Distributions;

namespace NetAdjust.Adjustment;

/// <summary>
/// The two-tailed χ² test of the variance factor ("global test"): the statistic T = vᵀPv / σ0² follows χ²(r)
/// when the model is right. Accept when χ²(α/2; r) ≤ T ≤ χ²(1 − α/2; r).
/// See docs/methods.md (Pope 1976; Koch 1999, §4.2; quantiles: NIST/SEMATECH e-Handbook §1.3.6.7.4).
/// Made by the adjustment only (the constructor is internal).
/// </summary>
public sealed record GlobalTest
{
    /// <summary>Made by the adjustment.</summary>
    internal GlobalTest(double Alpha, double Statistic, int DegreesOfFreedom, double? Lower, double? Upper)
    {
        this.Alpha = Alpha; this.Statistic = Statistic; this.DegreesOfFreedom = DegreesOfFreedom; this.Lower = Lower;
        this.Upper = Upper;
    }

    /// <summary>Significance level α.</summary>
    public double Alpha { get; internal init; }

    /// <summary>T = vᵀPv / σ0².</summary>
    public double Statistic { get; internal init; }

    /// <summary>r.</summary>
    public int DegreesOfFreedom { get; internal init; }

    /// <summary>χ²(α/2; r), or null when r = 0.</summary>
    public double? Lower { get; internal init; }

    /// <summary>χ²(1 − α/2; r), or null when r = 0.</summary>
    public double? Upper { get; internal init; }

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
