using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Geometry;
using NetAdjust.Network;
using NetAdjust.Stochastic;
using NetAdjust.Units;

namespace NetAdjust.Tests.Stochastic;

public class BudgetBuilderTests
{
    private static double Arcsec(double rad) => rad * Angle.ArcsecondsPerRadian;

    private static TotalStationSpecification Station(double isoArcsec, double centering = 0, EdmSpecification? edm = null) =>
        new("T", Angle.FromArcseconds(isoArcsec).Radians, 0, edm, centering, 0);

    // Rules of thumb of the trade (common practice), for a 5" instrument in the sense of ISO 17123-3
    // (σ of one direction observed once in both faces). An angle is the difference of two directions:
    // σ_angle = √2·σ/√n for n sets in both faces, and one face alone is √2 worse.
    [Theory]
    [InlineData(1, "both", 7.1)]
    [InlineData(2, "both", 5.0)]
    [InlineData(3, "both", 4.1)]
    [InlineData(4, "both", 3.5)]
    [InlineData(1, "one", 10.0)]
    public void FiveSecondInstrumentAngleRulesOfThumb(int sets, string faces, double expectedArcsec)
    {
        var proc = new ObservingProcedure(sets, faces == "both" ? Faces.Both : Faces.One);
        var b = AngleBudgetBuilder.Build(Station(5.0), null, null, proc, 150, 150, 1.0);
        // The expected values are the rule √2·5″/√n (one face: ×√2) computed and rounded to 0.1″: compare within
        // half of that.
        Assert.Equal(expectedArcsec, Arcsec(b.Total), 0.05);
        Assert.Equal(expectedArcsec, Arcsec(b.ValueOf(ContributionNames.PointingReading)), 0.05);
    }

    [Fact]
    public void DirectionSetsAndFaces()
    {
        // ISO 17123-3 σ is for one direction in both faces: n sets → σ/√n; one face → σ√2/√n (common practice).
        Assert.Equal(5.0, Arcsec(DirectionBudgetBuilder.PointingReading(Angle.FromArcseconds(5).Radians, ObservingProcedure.Default)), 12);
        Assert.Equal(5.0 / 2, Arcsec(DirectionBudgetBuilder.PointingReading(Angle.FromArcseconds(5).Radians, new ObservingProcedure(4, Faces.Both))), 12);
        Assert.Equal(5.0, Arcsec(DirectionBudgetBuilder.PointingReading(Angle.FromArcseconds(5).Radians, new ObservingProcedure(2, Faces.One))), 12);
    }

    [Fact]
    public void HandComputedDistanceBudget()
    {
        // Own scenario: D = 412.5 m, EDM 3 mm + 2 ppm, instrument centering 0.8 mm, target centering 1.5 mm.
        //   edm_constant          a   = 3 mm                       a²   = 9            mm²
        //   edm_proportional      b·D = 2e-6 × 412 500 mm = 0.825  (b·D)² = 0.680625  mm²
        //   instrument_centering  0.8 mm                           0.64             mm²
        //   target_centering      1.5 mm                           2.25             mm²
        //   sum of squares = 9 + 0.680625 + 0.64 + 2.25 = 12.570625 mm²;  σ_D = √12.570625 mm ≈ 3.545508 mm
        var ts = new TotalStationSpecification("T", 1e-5, 0, new EdmSpecification(0.003, 2), 0.0008, 0);
        var b = DistanceBudgetBuilder.Build(ts, new TargetSpecification("P", 0.0015, 0), 412.5);
        Assert.Equal(0.003, b.ValueOf(ContributionNames.EdmConstant), 12);
        Assert.Equal(0.000825, b.ValueOf(ContributionNames.EdmProportional), 12);
        Assert.Equal(0.0008, b.ValueOf(ContributionNames.InstrumentCentering), 12);
        Assert.Equal(0.0015, b.ValueOf(ContributionNames.TargetCentering), 12);
        Assert.Equal(Math.Sqrt(12.570625) / 1000, b.Total, 12);
        Assert.Equal(0.003545508, b.Total, 9);
    }

    [Fact]
    public void AngleInstrumentCenteringMatchesTheGeneralLawOnTheGeometry()
    {
        // Independent check of σ_i·D3/(Db·Df): move the station by e (Σe = σ_i² I) and propagate through the
        // angle's partial derivatives with respect to the station's coordinates (PlaneGeometry) and J Σe Jᵀ.
        var at = new PlanePoint(1000, 1000);
        var back = new PlanePoint(1000 + 120 * Math.Sin(0.3), 1000 + 120 * Math.Cos(0.3));
        var fore = new PlanePoint(1000 + 85 * Math.Sin(1.9), 1000 + 85 * Math.Cos(1.9));
        var eq = PlaneGeometry.Angle("A", at, "B", back, "F", fore);
        double dE = eq.Partials.Where(p => p.Owner == "A" && p.Parameter == Parameter.E).Sum(p => p.Derivative);
        double dN = eq.Partials.Where(p => p.Owner == "A" && p.Parameter == Parameter.N).Sum(p => p.Derivative);
        double sigmaI = 0.0012;
        var j = Matrix<double>.Build.DenseOfArray(new[,] { { dE, dN } });
        double expected = Math.Sqrt(ErrorPropagation.Propagate(j, Matrix<double>.Build.DiagonalIdentity(2) * (sigmaI * sigmaI))[0, 0]);

        var b = AngleBudgetBuilder.Build(Station(1, sigmaI), null, null, ObservingProcedure.Default, 120, 85, 1.9 - 0.3);
        Assert.Equal(expected, b.ValueOf(ContributionNames.InstrumentCentering), 12);
        // And the law of cosines form: D3 = distance between the targets.
        double d3 = Math.Sqrt(Math.Pow(fore.E - back.E, 2) + Math.Pow(fore.N - back.N, 2));
        Assert.Equal(sigmaI * d3 / (120 * 85), b.ValueOf(ContributionNames.InstrumentCentering), 12);
    }

    [Fact]
    public void DirectionCenteringIsSigmaOverDistance()
    {
        var b = DirectionBudgetBuilder.Build(Station(1, 0.001), new TargetSpecification("P", 0.002, 0), ObservingProcedure.Default, 200);
        Assert.Equal(0.001 / 200, b.ValueOf(ContributionNames.InstrumentCentering), 15);
        Assert.Equal(0.002 / 200, b.ValueOf(ContributionNames.TargetCentering), 15);
    }

    [Fact]
    public void LevelLineSeriesGrowsWithTheSquareRootOfTheReadings()
    {
        // Own level line: σ of one reading 0.4 mm, no rounding. 4 setups = 8 readings, 16 setups = 32 readings.
        // Error of a series: σ = 0.4 mm·√8 and 0.4 mm·√32, so four times the setups doubles σ; it does not quadruple.
        var level = LevelSpecification.PerReading("L", 0.0004, 0, RoundingTreatment.Uniform);
        double s4 = HeightDifferenceBudgetBuilder.Build(level, null, new LevellingProcedure(4, 1)).Total;
        double s16 = HeightDifferenceBudgetBuilder.Build(level, null, new LevellingProcedure(16, 1)).Total;
        Assert.Equal(0.0004 * Math.Sqrt(8), s4, 15);
        Assert.Equal(0.0004 * Math.Sqrt(32), s16, 15);
        Assert.Equal(2.0, s16 / s4, 12);
        // The mean of a double run divides by √2 (error of redundant measurement).
        Assert.Equal(s16 / Math.Sqrt(2), HeightDifferenceBudgetBuilder.Build(level, null, new LevellingProcedure(16, 2)).Total, 15);
    }

    [Fact]
    public void LevelPerKmModel()
    {
        // ISO 17123-2: σ of 1 km double-run levelling; a section of K km has σ√K (common practice;
        // docs/references.md §9).
        var level = LevelSpecification.PerKm("L", 0.001);
        Assert.Equal(0.001 * Math.Sqrt(0.42), HeightDifferenceBudgetBuilder.Build(level, 420, null).Total, 15);
        Assert.Equal(0.001 * Math.Sqrt(0.42) * Math.Sqrt(2), HeightDifferenceBudgetBuilder.Build(level, 420, new LevellingProcedure(1, 1)).Total, 15);
        Assert.Throws<InvalidInputException>(() => HeightDifferenceBudgetBuilder.Build(level, null, null));
    }

    [Fact]
    public void RodRoundingUniformIsResolutionOverRootTwelve()
    {
        // GUM, JCGM 100:2008 §F.2.2.1 (u = δx/√12) and §4.3.7 (section number from memory): reading to 0.01 →
        // σ = 0.01/√12 = 0.0028868 (computed; certainty in docs/references.md §12).
        Assert.Equal(0.0028868, LevelSpecification.PerReading("L", 0, 0.01, RoundingTreatment.Uniform).RoundingSd, 7);
        Assert.Equal(0.005, LevelSpecification.PerReading("L", 0, 0.01, RoundingTreatment.HalfResolution).RoundingSd, 15);
        var b = HeightDifferenceBudgetBuilder.Build(LevelSpecification.PerReading("L", 0, 0.001, RoundingTreatment.Uniform), null, new LevellingProcedure(3, 1));
        Assert.Equal(0.001 / Math.Sqrt(12) * Math.Sqrt(6), b.ValueOf(ContributionNames.RodRounding), 15);
    }

    [Theory]
    [InlineData("3 mm + 2 ppm", 0.003, 2)]
    [InlineData("3mm+2ppm", 0.003, 2)]
    [InlineData("0.002 + 1.5 ppm", 0.002, 1.5)]
    [InlineData("2 mm", 0.002, 0)]
    [InlineData("5 ppm", 0, 5)]
    [InlineData("0.01 ft + 5 ppm", 0.003048, 5)]
    public void EdmSpecificationLegal(string text, double a, double b)
    {
        var r = EdmSpecification.Parse(text, LengthUnit.Metre);
        Assert.True(r.Success, r.Error);
        Assert.Equal(a, r.Value.Constant, 12);
        Assert.Equal(b, r.Value.Ppm, 12);
    }

    [Theory]
    [InlineData("3 mm + x ppm", "'x'")]
    [InlineData("3 mm + 2", "constant part twice")]
    [InlineData("-3 mm + 2 ppm", "negative")]
    [InlineData("3 mm + -2 ppm", "negative")]
    [InlineData("", "empty")]
    [InlineData("3 mm +", "a mm + b ppm")]
    [InlineData("3 yd + 2 ppm", "'yd'")]
    public void EdmSpecificationIllegal(string text, string messagePart)
    {
        var r = EdmSpecification.Parse(text, LengthUnit.Metre);
        Assert.False(r.Success);
        Assert.Contains(messagePart, r.Error);
    }

    [Fact]
    public void NegativeOrMissingSpecificationsAreRejectedWithClearMessages()
    {
        var e = Assert.Throws<InvalidInputException>(() => new TotalStationSpecification("TS1", -1e-5, 0, null, 0, 0));
        Assert.Contains("TS1", e.Message);
        Assert.Throws<InvalidInputException>(() => new TargetSpecification("P", -0.001, 0));
        Assert.Throws<InvalidInputException>(() => new ObservingProcedure(0, Faces.Both));
        Assert.Throws<InvalidInputException>(() => LevelSpecification.PerKm("L", 0));
        Assert.Throws<InvalidInputException>(() => DistanceBudgetBuilder.Build(Station(1), null, 100)); // no EDM
    }
}
