using MathNet.Numerics.Distributions;
using NetAdjust.Adjustment;

namespace NetAdjust.Statistics;

/// <summary>
/// Critical values of the tests used after an adjustment, from MathNet's distributions. Formulas and sources in
/// docs/methods.md.
/// </summary>
public static class CriticalValues
{
    /// <summary>
    /// Critical value of the two-sided w-test: the standard normal quantile z(1 − α0/2). 3.2905 for α0 = 0.001
    /// (Baarda 1968).
    /// </summary>
    /// <param name="alpha0">Significance level in (0, 1).</param>
    public static double WTest(double alpha0) => Normal.InvCDF(0, 1, 1 - (alpha0 / 2));

    /// <summary>
    /// Baarda's non-centrality δ0 = z(1 − α0/2) + z(1 − β): the shift of the w-statistic a bias must cause to be found
    /// with probability 1 − β. 4.13 for α0 = 0.001, β = 0.20 (Baarda 1968; power 0.80).
    /// </summary>
    /// <param name="alpha0">Significance level of the w-test, in (0, 1).</param>
    /// <param name="typeIIError">β, the probability of missing the bias, in (0, 1).</param>
    public static double NonCentrality(double alpha0, double typeIIError) =>
        WTest(alpha0) + Normal.InvCDF(0, 1, 1 - typeIIError);

    /// <summary>The per-observation significance level α′ for n tests at overall level α.</summary>
    /// <param name="alpha">Overall level in (0, 1).</param>
    /// <param name="n">Number of tests, ≥ 1.</param>
    /// <param name="adjustment">Šidák or Bonferroni.</param>
    public static double PerTestAlpha(double alpha, int n, MultipleTestAdjustment adjustment) => adjustment switch
    {
        MultipleTestAdjustment.Bonferroni => alpha / n,
        _ => 1 - Math.Pow(1 - alpha, 1.0 / n), // 1 − (1 − α)^(1/n)
    };

    /// <summary>
    /// Critical value of Pope's tau test (Pope 1976): τ = √r · t / √(r − 1 + t²), with t the Student quantile
    /// t(1 − α′/2; r − 1) and α′ the per-observation level (see <see cref="PerTestAlpha"/>). Equivalently
    /// √(r F / (r − 1 + F)) with F = F(1 − α′; 1, r − 1) (Koch 1999, eq. 4.117).
    /// </summary>
    /// <param name="degreesOfFreedom">r ≥ 2.</param>
    /// <param name="observations">n ≥ 1, the number of observations tested.</param>
    /// <param name="alpha">Overall level α in (0, 1).</param>
    /// <param name="adjustment">How α is split over the n tests.</param>
    /// <returns>τ_crit, or null when r &lt; 2.</returns>
    public static double? Tau(int degreesOfFreedom, int observations, double alpha, MultipleTestAdjustment adjustment)
    {
        if (degreesOfFreedom < 2 || observations < 1) return null;
        double a = PerTestAlpha(alpha, observations, adjustment);
        double t = StudentT.InvCDF(0, 1, degreesOfFreedom - 1, 1 - (a / 2));
        double r = degreesOfFreedom;
        return Math.Sqrt(r) * t / Math.Sqrt(r - 1 + (t * t));
    }

    /// <summary>
    /// Scale k of a two-dimensional confidence region from the standard ellipse: √χ²₂(p) when the variance factor is
    /// known (2.4477 for p = 0.95); √(2 F(p; 2, r)) when it is estimated with r degrees of freedom.
    /// </summary>
    /// <param name="confidence">p in (0, 1).</param>
    /// <param name="basis">Known or estimated variance factor.</param>
    /// <param name="degreesOfFreedom">r (used when estimated; ≥ 1).</param>
    public static double Ellipse(double confidence, VarianceFactorBasis basis, int degreesOfFreedom) =>
        basis == VarianceFactorBasis.Known
            ? Math.Sqrt(ChiSquared.InvCDF(2, confidence))
            : Math.Sqrt(2 * FisherSnedecor.InvCDF(2, degreesOfFreedom, confidence));

    /// <summary>
    /// Scale of a one-dimensional two-sided confidence interval from the standard deviation: z(1 − (1−p)/2)
    /// (1.96 for p = 0.95) when known; the Student quantile t(1 − (1−p)/2; r) when estimated.
    /// </summary>
    /// <param name="confidence">p in (0, 1).</param>
    /// <param name="basis">Known or estimated variance factor.</param>
    /// <param name="degreesOfFreedom">r (used when estimated; ≥ 1).</param>
    public static double Interval(double confidence, VarianceFactorBasis basis, int degreesOfFreedom) =>
        basis == VarianceFactorBasis.Known
            ? Normal.InvCDF(0, 1, 1 - ((1 - confidence) / 2))
            : StudentT.InvCDF(0, 1, degreesOfFreedom, 1 - ((1 - confidence) / 2));
}
