using NetAdjust.Adjustment;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Tests.Adjustment;

public class DatumAndFailureTests
{
    [Fact]
    public void NetworkWithoutControlReportsAnUndefinedDatumNotASingularMatrix()
    {
        var pts = new[] { new Point("A") { E = 0, N = 0 }, new Point("B") { E = 100, N = 0 } };
        var obs = new Observation[] { new DistanceObservation("A", "B", Length.FromMetres(100)) { StandardDeviation =
            0.002 } };
        var e = Assert.Throws<DatumDefectException>(() => Adjuster.Adjust(new SurveyNetwork("free", pts, obs)));
        Assert.Contains("datum is not defined", e.Message);
        Assert.DoesNotContain("singular", e.Message, StringComparison.OrdinalIgnoreCase);
        Assert.NotEmpty(e.Undetermined);
    }

    [Fact]
    public void LevelNetworkWithoutAHeldHeightReportsTheDatum()
    {
        var pts = new[] { new Point("A"), new Point("B") };
        var obs = new Observation[] { new HeightDifferenceObservation("A", "B",
            Length.FromMetres(1)) { StandardDeviation = 0.001 } };
        var e = Assert.Throws<DatumDefectException>(() => Adjuster.Adjust(new SurveyNetwork("lev", pts, obs)));
        Assert.Contains("height of", e.Message);
    }

    [Fact]
    public void MissingApproximateCoordinatesAreNamed()
    {
        // Two held points define the datum; Q17 is reached by one distance only, so no approximation can be computed.
        var pts = new[]
        {
            new Point("A") { E = 0, N = 0, Fixed = Fixity.EN }, new Point("B") { E = 50, N = 0, Fixed = Fixity.EN },
            new Point("Q17") { Source = "x.yaml:9" },
        };
        var obs = new Observation[]
        {
            new DistanceObservation("A", "B", Length.FromMetres(50)) { StandardDeviation = 0.002 },
            new DistanceObservation("A", "Q17", Length.FromMetres(10)) { StandardDeviation = 0.002 },
        };
        var e = Assert.ThrowsAny<InvalidInputException>(() => Adjuster.Adjust(new SurveyNetwork("x", pts, obs)));
        Assert.Contains("Q17 (x.yaml:9): from located points it has 1 distance", e.Message);
    }

    [Fact]
    public void IterationLimitGivesNoConvergenceNamingPoints()
    {
        // Approximate coordinates far off, with a limit of one iteration, cannot converge.
        var pts = new[]
        {
            new Point("A") { E = 0, N = 0, Fixed = Fixity.EN }, new Point("B") { E = 0, N = 100, Fixed = Fixity.EN },
            new Point("C") { E = 80, N = 30 },
        };
        var obs = new Observation[]
        {
            new DistanceObservation("A", "C", Length.FromMetres(60)) { StandardDeviation = 0.002 },
            new DistanceObservation("B", "C", Length.FromMetres(70)) { StandardDeviation = 0.002 },
        };
        var e = Assert.Throws<NoConvergenceException>(() =>
            Adjuster.Adjust(new SurveyNetwork("nc", pts, obs), AdjustmentOptions.Default with { MaxIterations = 1 }));
        Assert.Contains("of C", e.Message);
    }

    [Fact]
    public void InvalidNetworksListEveryProblemWithItsSource()
    {
        var pts = new[] { new Point("A") { Fixed = Fixity.E, Source = "f.yaml:3" }, new Point("A") { Source =
            "f.yaml:4" } };
        var obs = new Observation[] { new DistanceObservation("A", "Z", Length.FromMetres(1)) { StandardDeviation = 0,
            Source = "f.yaml:7" } };
        var e = Assert.Throws<InvalidInputException>(() => new SurveyNetwork("bad", pts, obs));
        Assert.Contains("f.yaml:3: point A holds its easting fixed but gives no easting", e.Message);
        Assert.Contains("f.yaml:4: point A is defined twice", e.Message);
        Assert.Contains("point Z is not defined", e.Message);
        Assert.Contains("standard deviation must be positive", e.Message);
        // A negative distance no longer reaches the network: its constructor refuses it, naming the parameter.
        Assert.Equal("Distance", Assert.Throws<ArgumentOutOfRangeException>(() =>
            new DistanceObservation("A", "Z", Length.FromMetres(-1))).ParamName);
    }
}
