using MathNet.Numerics.Distributions;
using NetAdjust.Adjustment;
using NetAdjust.Statistics;

namespace NetAdjust.Tests.Statistics;

public class CriticalValuesTests
{
    [Fact]
    public void WTestCriticalValueIs329ForAlpha0001()
    {
        // Baarda (1968), A Testing Procedure for Use in Geodetic Networks, NGC Publ. on Geodesy NS 2(5), uses
        // α0 = 0.001; its two-sided normal critical value 3.2905 is computed (scipy), not read in Baarda
        // (docs/references.md §3).
        Assert.Equal(3.2905, CriticalValues.WTest(0.001), 4);
    }

    [Fact]
    public void NonCentralityIs413ForPower080()
    {
        // Baarda (1968): α0 = 0.001, β0 (power) = 0.80 → δ0 = 4.1321, λ0 = 17.0746, both computed (scipy; the exact
        // noncentral χ² agrees to 1e-9), not read in Baarda (docs/references.md §3).
        double d0 = CriticalValues.NonCentrality(0.001, 0.20);
        Assert.Equal(4.1321, d0, 4);
        Assert.Equal(17.0746, d0 * d0, 3);
    }

    [Fact]
    public void MdbOfTheExampleIs584Millimetres()
    {
        // MDB = σ δ0 / √rᵢ (Baarda 1968); σ = 1 mm, rᵢ = 0.5 → 5.84 mm, computed (docs/references.md §3).
        Assert.Equal(5.84, 1.0 * CriticalValues.NonCentrality(0.001, 0.20) / Math.Sqrt(0.5), 2);
    }

    [Theory]
    // Pope (1976), NOAA Technical Report NOS 65 NGS 1: τ = √r t / √(r − 1 + t²). Pope's report was not seen: the
    // expected values are computed with scipy from this formula (docs/references.md §4), not table values of Pope.
    [InlineData(5, 10, 0.05, 2.1057, 2.1042)]
    [InlineData(10, 20, 0.05, 2.5619, 2.5584)]
    [InlineData(20, 40, 0.05, 2.9325, 2.9276)]
    [InlineData(30, 60, 0.05, 3.1174, 3.1121)]
    [InlineData(10, 20, 0.01, 2.7508, 2.7504)]
    public void TauCriticalValuesMatchTheComputedValues(int r, int n, double alpha, double bonferroni, double sidak)
    {
        Assert.Equal(bonferroni, CriticalValues.Tau(r, n, alpha, MultipleTestAdjustment.Bonferroni)!.Value, 4);
        Assert.Equal(sidak, CriticalValues.Tau(r, n, alpha, MultipleTestAdjustment.Sidak)!.Value, 4);
    }

    [Fact]
    public void TheDefaultTauConventionIsSidak()
    {
        // The program's documented choice (docs/methods.md): α′ = 1 − (1 − α)^(1/n); r = 10, n = 20 → 2.5584, computed
        // (docs/references.md §4).
        Assert.Equal(MultipleTestAdjustment.Sidak, AnalysisOptions.Default.TauAdjustment);
        Assert.Equal(2.5584, CriticalValues.Tau(10, 20, 0.05, AnalysisOptions.Default.TauAdjustment)!.Value, 4);
    }

    [Theory]
    [InlineData(5, 10)]
    [InlineData(12, 40)]
    [InlineData(300, 700)]
    public void TauEqualsTheFFormOfKoch(int r, int n)
    {
        // Koch (1999), Parameter Estimation and Hypothesis Testing in Linear Models, eq. 4.117 (equation number seen
        // only in code that cites it; docs/references.md §4):
        // τ = √(r F / (r − 1 + F)), F = F(1 − α′; 1, r − 1); MathNet's Fisher-Snedecor as the independent route.
        double a = CriticalValues.PerTestAlpha(0.05, n, MultipleTestAdjustment.Bonferroni);
        double f = FisherSnedecor.InvCDF(1, r - 1, 1 - a);
        double expected = Math.Sqrt(r * f / (r - 1 + f));
        Assert.Equal(expected, CriticalValues.Tau(r, n, 0.05, MultipleTestAdjustment.Bonferroni)!.Value, 9);
    }

    [Fact]
    public void TauNeedsTwoDegreesOfFreedom() => Assert.Null(CriticalValues.Tau(1, 10, 0.05, MultipleTestAdjustment.Sidak));

    [Fact]
    public void EllipseScalesMatchTheComputedValues()
    {
        // Formulas of Mikhail & Ackermann 1976 and Hoover 1984, NOAA TR NOS 107 C&GS 3 (partly seen): √χ²₂(0.95) =
        // 2.447747; estimated σ0: √(2 F(0.95; 2, r)) = 3.401804 (r 5), 2.864549 (10), 2.575201 (30), 2.478620 (120).
        // All values computed with scipy, not read in those sources (docs/references.md §5).
        Assert.Equal(2.447747, CriticalValues.Ellipse(0.95, VarianceFactorBasis.Known, 1), 6);
        Assert.Equal(Math.Sqrt(-2 * Math.Log(0.05)), CriticalValues.Ellipse(0.95, VarianceFactorBasis.Known, 1), 12);
        Assert.Equal(3.401804, CriticalValues.Ellipse(0.95, VarianceFactorBasis.Estimated, 5), 5);
        Assert.Equal(2.864549, CriticalValues.Ellipse(0.95, VarianceFactorBasis.Estimated, 10), 5);
        Assert.Equal(2.575201, CriticalValues.Ellipse(0.95, VarianceFactorBasis.Estimated, 30), 5);
        Assert.Equal(2.478620, CriticalValues.Ellipse(0.95, VarianceFactorBasis.Estimated, 120), 5);
        Assert.Equal(2.145966, CriticalValues.Ellipse(0.90, VarianceFactorBasis.Known, 1), 5);
        Assert.Equal(3.034854, CriticalValues.Ellipse(0.99, VarianceFactorBasis.Known, 1), 5);
    }

    [Fact]
    public void IntervalScalesMatchTheComputedValues()
    {
        // 1D 95%: normal 1.959964; Student t, dof 5 / 10 / 30: 2.570582 / 2.228139 / 2.042272 (computed with scipy;
        // docs/references.md §5).
        Assert.Equal(1.959964, CriticalValues.Interval(0.95, VarianceFactorBasis.Known, 1), 6);
        Assert.Equal(2.570582, CriticalValues.Interval(0.95, VarianceFactorBasis.Estimated, 5), 6);
        Assert.Equal(2.228139, CriticalValues.Interval(0.95, VarianceFactorBasis.Estimated, 10), 6);
        Assert.Equal(2.042272, CriticalValues.Interval(0.95, VarianceFactorBasis.Estimated, 30), 6);
    }
}
