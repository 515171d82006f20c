using NetAdjust.Adjustment;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Tests.Adjustment;

/// <summary>Cases whose least-squares answer is known in closed form (common practice; any adjustment textbook,
/// e.g. Mikhail &amp; Ackermann 1976, ch. 4 — from memory for the chapter).</summary>
public class AnalyticCaseTests
{
    private static double Arcsec(double v) => v / Angle.ArcsecondsPerRadian;

    [Fact]
    public void RepeatedDistancesGiveTheWeightedMeanAndItsStandardDeviation()
    {
        // Point B due east of fixed A with its northing held: the easting of B is A_E + the weighted mean of the
        // distances, with σ = 1/√Σw (common practice: weighted mean).
        double[] d = [100.0021, 99.9987, 100.0003, 100.0011, 99.9994];
        double[] s = [0.002, 0.003, 0.002, 0.004, 0.003];
        var points = new[]
        {
            new Point("A") { E = 1000, N = 2000, Fixed = Fixity.EN },
            new Point("B") { E = 1100.5, N = 2000, Fixed = Fixity.N },
        };
        var obs = d.Select((x, i) => (Observation)new DistanceObservation("A", "B",
            Length.FromMetres(x)) { StandardDeviation = s[i] });
        var r = Adjuster.Adjust(new SurveyNetwork("mean", points, obs));

        double sw = s.Sum(x => 1 / (x * x));
        double mean = d.Select((x, i) => x / (s[i] * s[i])).Sum() / sw;
        var b = r.Points[1];
        Assert.Equal(1000 + mean, b.E!.Value, 9);
        Assert.Equal(1 / Math.Sqrt(sw), b.SdE!.Value, 12);
        Assert.Equal(d.Length - 1, r.Statistics.DegreesOfFreedom);
    }

    [Fact]
    public void EqualWeightRepeatedDistancesGiveSigmaOverRootN()
    {
        // Error of redundant measurement: the mean of n equal-weight measurements has σ/√n (common practice).
        const double sigma = 0.003;
        var points = new[] { new Point("A") { E = 0, N = 0, Fixed = Fixity.EN }, new Point("B") { E = 50, N = 0, Fixed =
            Fixity.N } };
        var obs = Enumerable.Range(0, 9).Select(i => (Observation)new DistanceObservation("A", "B",
            Length.FromMetres(50 + ((i - 4) * 0.001))) { StandardDeviation = sigma });
        var r = Adjuster.Adjust(new SurveyNetwork("n", points, obs));
        Assert.Equal(50.0, r.Points[1].E!.Value, 10);
        Assert.Equal(sigma / 3.0, r.Points[1].SdE!.Value, 12);
    }

    [Fact]
    public void ClosedLevelLoopWithEqualWeightsSharesTheMisclosureEqually()
    {
        // Loop BM → P1 → P2 → P3 → BM with misclosure w = Σ Δh: each of the 4 equal-weight sections gets −w/4
        // (common practice: distribution of a loop misclosure).
        double[] dh = [1.2340, -0.5120, 2.0010, -2.7190];
        double w = dh.Sum();
        Assert.NotEqual(0, w, 6);
        string[] ids = ["BM", "P1", "P2", "P3"];
        var points = new[] { new Point("BM") { H = 50, Fixed = Fixity.H }, new Point("P1"), new Point("P2"),
            new Point("P3") };
        var obs = dh.Select((x, i) => (Observation)new HeightDifferenceObservation(ids[i], ids[(i + 1) % 4],
            Length.FromMetres(x)) { StandardDeviation = 0.001 });
        var r = Adjuster.Adjust(new SurveyNetwork("loop", points, obs));
        foreach (var o in r.Observations) Assert.Equal(-w / 4, o.Residual, 12);
        Assert.Equal(1, r.Statistics.DegreesOfFreedom);
        Assert.Equal(50 + dh[0] - (w / 4), r.Points[1].H!.Value, 12);
        // vᵀPv = 4 (w/4)² / σ² = w² / (4 σ²)
        Assert.Equal(w * w / (4 * 1e-6), r.Statistics.Vtpv, 6);
    }

    [Fact]
    public void ThreeAnglesOfATriangleWithEqualWeightsEachGetAThirdOfTheMisclosure()
    {
        // Plane triangle: adjusted angles sum to 180°, each equal-weight angle takes −ε/3 (common practice).
        var pts = new[]
        {
            new Point("A") { E = 0, N = 0, Fixed = Fixity.EN },
            new Point("B") { E = 400, N = 0, Fixed = Fixity.EN },
            new Point("C") { E = 150, N = 300 },
        };
        // True angles of the triangle A(0,0) B(400,0) C(150,300), then errors added: +4″, −1″, +3″ → ε = +6″.
        double AzDeg(double de, double dn) => (Math.Atan2(de, dn) * 180 / Math.PI + 360) % 360;
        double atA = AzDeg(400, 0) - AzDeg(150, 300);            // clockwise from C to B
        double atB = AzDeg(-250, 300) - AzDeg(-400, 0);          // clockwise from A to C
        double atC = (AzDeg(-150, -300) - AzDeg(250, -300) + 360) % 360; // clockwise from B to A
        Assert.Equal(180.0, atA + atB + atC, 9);
        var obs = new Observation[]
        {
            new AngleObservation("A", "C", "B",
                Angle.FromDegrees(atA) + Angle.FromArcseconds(4)) { StandardDeviation = Arcsec(3) },
            new AngleObservation("B", "A", "C",
                Angle.FromDegrees(atB) + Angle.FromArcseconds(-1)) { StandardDeviation = Arcsec(3) },
            new AngleObservation("C", "B", "A",
                Angle.FromDegrees(atC) + Angle.FromArcseconds(3)) { StandardDeviation = Arcsec(3) },
        };
        var r = Adjuster.Adjust(new SurveyNetwork("triangle", pts, obs));
        foreach (var o in r.Observations) Assert.Equal(-2.0, o.Residual * Angle.ArcsecondsPerRadian, 6);
        Assert.Equal(180.0, r.Observations.Sum(o => o.Adjusted) * 180 / Math.PI, 9);
    }

    [Fact]
    public void ZeroRedundancyGivesZeroResiduals()
    {
        // A polar point from a held station oriented on a held backsight: n = u = 3, so r = 0 and v = 0.
        var pts = new[]
        {
            new Point("S") { E = 500, N = 500, Fixed = Fixity.EN },
            new Point("R") { E = 500, N = 900, Fixed = Fixity.EN },
            new Point("X") { E = 640, N = 610 },
        };
        var obs = new Observation[]
        {
            new DirectionObservation("S", "R", Angle.FromDms(12, 0, 0), "S/1") { StandardDeviation = Arcsec(2) },
            new DirectionObservation("S", "X", Angle.FromDms(64, 17, 33.2), "S/1") { StandardDeviation = Arcsec(2) },
            new DistanceObservation("S", "X", Length.FromMetres(178.432)) { StandardDeviation = 0.003 },
        };
        var r = Adjuster.Adjust(new SurveyNetwork("polar", pts, obs));
        Assert.Equal(0, r.Statistics.DegreesOfFreedom);
        Assert.Null(r.Statistics.GlobalTest.Passed);
        foreach (var o in r.Observations) Assert.True(Math.Abs(o.Residual) < 1e-9, $"residual {o.Residual}");
        // The polar point: azimuth = 64°17′33.2″ − 12° + azimuth of S→R (0°).
        double az = Angle.FromDms(52, 17, 33.2).Radians;
        Assert.Equal(500 + (178.432 * Math.Sin(az)), r.Points[2].E!.Value, 8);
        Assert.Equal(500 + (178.432 * Math.Cos(az)), r.Points[2].N!.Value, 8);
    }

    [Fact]
    public void GridAzimuthObservationOrientsANetwork()
    {
        // One held point, one azimuth and one distance fix a second point exactly (r = 0).
        var pts = new[] { new Point("A") { E = 0, N = 0, Fixed = Fixity.EN }, new Point("B") { E = 70, N = 70 } };
        var obs = new Observation[]
        {
            new AzimuthObservation("A", "B", Angle.FromDegrees(45)) { StandardDeviation = Arcsec(5) },
            new DistanceObservation("A", "B", Length.FromMetres(100)) { StandardDeviation = 0.002 },
        };
        var r = Adjuster.Adjust(new SurveyNetwork("az", pts, obs));
        Assert.Equal(100 / Math.Sqrt(2), r.Points[1].E!.Value, 9);
        Assert.Equal(100 / Math.Sqrt(2), r.Points[1].N!.Value, 9);
    }

    [Fact]
    public void WeightedControlActsAsAnObservationOfTheCoordinate()
    {
        // A height held by weight σ_c and one levelled difference: with two weighted benchmarks the free point's
        // height is the weighted mean of the two routes (common practice).
        var pts = new[]
        {
            new Point("B1") { H = 10.000, SdH = 0.002 },
            new Point("B2") { H = 12.010, SdH = 0.002 },
            new Point("P"),
        };
        var obs = new Observation[]
        {
            new HeightDifferenceObservation("B1", "P", Length.FromMetres(1.000)) { StandardDeviation = 0.001 },
            new HeightDifferenceObservation("P", "B2", Length.FromMetres(1.000)) { StandardDeviation = 0.001 },
        };
        var r = Adjuster.Adjust(new SurveyNetwork("weighted", pts, obs));
        // Route 1 gives 11.000, route 2 gives 11.010, each with σ² = 4e-6 + 1e-6: equal weights → 11.005.
        Assert.Equal(11.005, r.Points[2].H!.Value, 10);
        Assert.Equal(4, r.Statistics.Observations);
        Assert.Equal(1, r.Statistics.DegreesOfFreedom);
    }
}
