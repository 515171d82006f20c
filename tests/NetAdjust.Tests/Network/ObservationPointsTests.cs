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

    [Fact]
    public void ASetIdSharedByTwoStationsIsRefusedWhenItsDirectionsFollowOneAnother()
    {
        // the directions of a set usually share one set id string: the network skips the set look-up for the same
        // string and station as the direction before, and still names a second station of that string
        string set = "S/1";
        var points = new[] { "S", "T", "U" }.Select(id => new Point(id) { E = 0, N = 0 }).ToArray();
        Observation Dir(string at, string to, string setId) =>
            new DirectionObservation(at, to, Angle.FromDegrees(10), setId) { Sd = Angle.FromArcseconds(2) };
        var e = Assert.Throws<InvalidInputException>(() => new SurveyNetwork("n", points,
            [Dir("S", "T", set), Dir("S", "U", set), Dir("T", "U", set), Dir("T", "S", set), Dir("S", "T", "S/2")]));
        Assert.Equal(2, e.Message.Split("direction set S/1 already belongs to station S").Length - 1);
        // the same id as another string: the same answer
        var f = Assert.Throws<InvalidInputException>(() => new SurveyNetwork("n", points,
            [Dir("S", "T", set), Dir("T", "U", new string(set.AsSpan())), Dir("S", "U", set)]));
        Assert.Contains("direction set S/1 already belongs to station S", f.Message);
        // one station's directions of one set: no problem
        Assert.Equal(3, new SurveyNetwork("n", points,
            [Dir("S", "T", set), Dir("S", "U", new string(set.AsSpan())), Dir("S", "T", set)]).Observations.Count);
    }
}
