using MathNet.Numerics;
using MathNet.Numerics.Distributions;
using MathNet.Numerics.RootFinding;
using NetAdjust.Standards;

namespace NetAdjust.Tests.Standards;

public class AccuracyStandardTests
{
    [Theory]
    // ALTA/NSPS Minimum Standard Detail Requirements 2021: "2 cm (0.07 feet) plus 50 parts per million" at 95%
    // (docs/references.md §6): 100 m → 0.025 m, 500 m → 0.045 m, 1000 m → 0.070 m.
    [InlineData(100, 0.025)]
    [InlineData(500, 0.045)]
    [InlineData(1000, 0.070)]
    public void AltaAllowanceIsTwoCentimetresPlusFiftyPpm(double distance, double allowance)
    {
        var alta = AccuracyStandards.Find("alta-nsps-2021")!;
        Assert.Equal(StandardKind.RelativePrecision, alta.Kind);
        Assert.Equal(allowance, alta.Allowance(distance), 12);
    }

    [Fact]
    public void NinetyFivePercentEllipseScaleIsTheChiSquareQuantileOfTwoDegrees()
    {
        // √χ²(0.95; 2) = √(−2 ln 0.05) = 2.447747 (Hoover 1984, NOAA TR NOS 107 C&GS 3; closed form)
        Assert.Equal(Math.Sqrt(-2 * Math.Log(0.05)), StandardsCheck.Ellipse95, 12);
        Assert.Equal(2.447747, StandardsCheck.Ellipse95, 6);
        Assert.Equal(Math.Sqrt(ChiSquared.InvCDF(2, 0.95)), StandardsCheck.Ellipse95, 12); // MathNet
        Assert.Equal(1.959964, StandardsCheck.Interval95, 6); // normal quantile, MathNet
    }

    [Theory]
    // FGDC-STD-007.2-1998 circular 95% radius: a·(1.960790 + 0.004071 C + 0.114276 C² + 0.371625 C³), C = b/a;
    // b/a = 0 gives 1.9608 a and b/a = 1 gives 2.4508 a; b/a = 0.5 gives 2.03785 a (docs/references.md §7, table
    // of the cubic, computed to five decimals).
    [InlineData(0.0, 1.96079)]
    [InlineData(1.0, 2.45076)]
    [InlineData(0.5, 2.03785)]
    public void FgdcRadiusFollowsTheStandardsFormula(double c, double factor)
    {
        Assert.Equal(factor, AccuracyStandards.CircularRadius95(1, c), 5);
        Assert.Equal(3 * AccuracyStandards.CircularRadius95(1, c), AccuracyStandards.CircularRadius95(3, 3 * c), 12);
    }

    /// <summary>
    /// The exact radius r with P(X² + Y² ≤ r²) = 0.95 for X ~ N(0, a²), Y ~ N(0, b²), by numerical integration of
    /// the bivariate normal: P(r) = ∫ φ(x/a)/a · (2Φ(√(r² − x²)/b) − 1) dx over [−r, r] (MathNet integration and root
    /// finding; independent of the standard's formula).
    /// </summary>
    private static double ExactRadius95(double a, double b)
    {
        double P(double r) => Integrate.DoubleExponential(x =>
        {
            double y = Math.Sqrt(Math.Max(0, (r * r) - (x * x)));
            return Normal.PDF(0, a, x) * ((2 * Normal.CDF(0, b, y)) - 1);
        }, -r, r, 1e-12);
        return Brent.FindRoot(r => P(r) - 0.95, 0.5 * a, 4 * a, 1e-10);
    }

    [Theory]
    [InlineData(1.0)]
    [InlineData(0.5)]
    [InlineData(0.2)]
    [InlineData(0.05)]
    public void FgdcRadiusIsWithinTwoTenthsOfAPercentOfTheExactRadius(double c)
    {
        // The cubic is an approximation, good to about 0.15% (docs/references.md §7, computed)
        double exact = ExactRadius95(1, c);
        Assert.InRange(AccuracyStandards.CircularRadius95(1, c) / exact, 0.998, 1.002);
    }

    [Fact]
    public void ExactRadiusOfACircleIsTheChiSquareScale()
    {
        // For a circle (b = a) the exact 95% radius is √χ²(0.95; 2) a = 2.4477 a (MathNet), close to the formula's
        // 2.4508 a; for a line (b → 0) it is the normal quantile 1.95996 a.
        Assert.Equal(StandardsCheck.Ellipse95, ExactRadius95(1, 1), 6);
        Assert.Equal(1.959964, ExactRadius95(1, 1e-6), 4);
    }

    [Theory]
    // FGDC-STD-007.2-1998 accuracy classes 1, 2, 5 mm, 1, 2, 5 cm, 1, 2, 5 dm, 1, 2, 5, 10 m (from memory)
    [InlineData(0.0009, 0.001)]
    [InlineData(0.0149, 0.02)]
    [InlineData(0.02, 0.02)]
    [InlineData(0.021, 0.05)]
    [InlineData(7.5, 10.0)]
    public void ClassReachedIsTheSmallestClassAtOrAboveTheValue(double value, double cls)
    {
        Assert.Equal(cls, AccuracyStandards.ClassReached(value)!.Value, 12);
    }

    [Fact]
    public void ValueBeyondTheLargestClassReachesNone() => Assert.Null(AccuracyStandards.ClassReached(11));
}
