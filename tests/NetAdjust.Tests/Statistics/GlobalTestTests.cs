using MathNet.Numerics.Distributions;
using NetAdjust.Adjustment;
using NetAdjust.Statistics;

namespace NetAdjust.Tests.Statistics;

public class GlobalTestTests
{
    [Theory]
    // NIST/SEMATECH e-Handbook of Statistical Methods, §1.3.6.7.4 "Critical Values of the Chi-Square
    // Distribution" (section number from memory). Seen in reproductions of that table: the lower values for r = 10,
    // 20, 30 and the upper values for r = 1, 2, 5, 10; the other entries are computed (scipy), which agrees with every
    // seen one (docs/references.md §2).
    [InlineData(1, 0.000982, 5.0239)]
    [InlineData(2, 0.0506, 7.3778)]
    [InlineData(5, 0.8312, 12.8325)]
    [InlineData(10, 3.2470, 20.4832)]
    [InlineData(20, 9.5908, 34.1696)]
    [InlineData(30, 16.7908, 46.9792)]
    public void TwoTailedBoundsAtFivePercentMatchTheNistTable(int dof, double lower, double upper)
    {
        var t = GlobalTest.Compute(vtpv: dof, aprioriVarianceFactor: 1, degreesOfFreedom: dof, alpha: 0.05);
        Assert.Equal(lower, t.Lower!.Value, lower * 1e-3);
        Assert.Equal(upper, t.Upper!.Value, upper * 1e-4);
    }

    [Theory]
    [InlineData(7, 0.05)]
    [InlineData(4, 0.01)]
    [InlineData(120, 0.10)]
    public void BoundsAreTheChiSquareQuantilesOfMathNet(int dof, double alpha)
    {
        // Independent check: the bounds have lower-tail probabilities α/2 and 1 − α/2 under χ²(r) (MathNet CDF).
        var t = GlobalTest.Compute(dof, 1, dof, alpha);
        Assert.Equal(alpha / 2, ChiSquared.CDF(dof, t.Lower!.Value), 9);
        Assert.Equal(1 - (alpha / 2), ChiSquared.CDF(dof, t.Upper!.Value), 9);
    }

    [Fact]
    public void VarianceFactorBoundsForTenDegreesOfFreedom()
    {
        // r = 10: 0.3247 ≤ s0²/σ0² ≤ 2.0483 at α = 0.05, the NIST table entries 3.247 and 20.48318 (seen) divided by 10
        // (docs/references.md §2).
        Assert.True(GlobalTest.Compute(0.3250 * 10, 1, 10, 0.05).Passed);
        Assert.False(GlobalTest.Compute(0.3240 * 10, 1, 10, 0.05).Passed);
        Assert.True(GlobalTest.Compute(2.0480 * 10, 1, 10, 0.05).Passed);
        Assert.False(GlobalTest.Compute(2.0490 * 10, 1, 10, 0.05).Passed);
    }

    [Fact]
    public void StatisticIsScaledByTheAprioriVarianceFactor()
    {
        var t = GlobalTest.Compute(vtpv: 8, aprioriVarianceFactor: 4, degreesOfFreedom: 3, alpha: 0.05);
        Assert.Equal(2, t.Statistic);
    }

    [Fact]
    public void NoRedundancyMeansNoTest()
    {
        var t = GlobalTest.Compute(0, 1, 0, 0.05);
        Assert.Null(t.Passed);
        Assert.Null(t.Lower);
    }
}
