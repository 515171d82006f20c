using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Tests.Network;

/// <summary><see cref="Observation.Points"/>: the points an observation involves, station first, each once.</summary>
public class ObservationPointsTests
{
    [Fact]
    public void PointsAreTheStationThenFromThenToWithoutRepeats()
    {
        var angle = new AngleObservation("S", "B", "F", Angle.FromDegrees(90));
        Assert.Equal(["S", "B", "F"], angle.Points);
        // a direction's from point is its station: named once
        var direction = new DirectionObservation("S", "T", Angle.FromDegrees(10), "S/1");
        Assert.Equal(["S", "T"], direction.Points);
        var distance = new DistanceObservation("A", "B", Length.FromMetres(10));
        Assert.Equal(["A", "B"], distance.Points);
        // the same id twice (refused later by the network, which names it) is listed once
        var loop = new HeightDifferenceObservation("A", "A", Length.FromMetres(0.5));
        Assert.Equal(["A"], loop.Points);
    }

    [Fact]
    public void TheNetworkNamesEveryUndefinedPointOfAnObservationOnce()
    {
        var points = new[] { new Point("S") { E = 0, N = 0, Fixed = Fixity.EN } };
        var angle = new AngleObservation("S", "X", "Y", Angle.FromDegrees(90)) { Sd = Angle.FromArcseconds(2) };
        var e = Assert.Throws<InvalidInputException>(() => new SurveyNetwork("n", points, [angle]));
        Assert.Contains("point X is not defined", e.Message);
        Assert.Contains("point Y is not defined", e.Message);
        Assert.DoesNotContain("point S is not defined", e.Message);
    }
}
