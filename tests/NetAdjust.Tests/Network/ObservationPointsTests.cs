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

    /// <summary>A network of 240,000 observations or more is checked in two halves on two cores: the points it marks
    /// as reached (by a counting or a set-aside observation) are those the observations name, and its problems (in
    /// either half, and a set that two stations share) are worded and ordered as the one-core pass of a small network
    /// of the same problem observations words them.</summary>
    [Fact]
    public void ALargeNetworkGetsTheAnswersOfTheOneCorePass()
    {
        var points = new[] { "S", "T", "U", "V", "W", "Z" }.Select(id => new Point(id) { E = 0, N = 0 }).ToArray();
        Observation Dir(string at, string to, string setId) =>
            new DirectionObservation(at, to, Angle.FromDegrees(10), setId) { Sd = Angle.FromArcseconds(2) };
        Observation Dist(string from, string to, bool excluded = false) =>
            new DistanceObservation(from, to, Length.FromMetres(10))
            { Sd = Length.FromMetres(0.002), Excluded = excluded };
        var good = new List<Observation>();
        for (int k = 0; k < 120_000; k++) good.AddRange(Dir("S", "T", "S/1"), Dist("T", "U"));
        good.AddRange(Dist("U", "V"), Dist("U", "W", excluded: true)); // V and W named in the second half only
        var network = new SurveyNetwork("n", points, good);
        for (int i = 0; i < points.Length; i++)
        {
            string id = points[i].Id;
            Assert.Equal(good.Any(o => !o.Excluded && o.Points.Contains(id)), network.IsReached(i));
            Assert.Equal(good.Any(o => o.Excluded && o.Points.Contains(id)), network.IsReachedBySetAside(i));
        }
        Assert.Equal([true, true, true, true, false, false], points.Select((_, i) => network.IsReached(i)));

        // each problem alone (in the first half, the second half, or only in the sets) and all three together
        (int At, Observation O)[] wrong =
            [(10, Dist("T", "X")), (200_000, Dist("U", "U")), (230_000, Dir("T", "U", "S/1"))];
        InvalidInputException? small = null;
        foreach (int[] chosen in new[] { [0], [1], [2], new[] { 0, 1, 2 } })
        {
            var bad = new List<Observation>(good);
            foreach (int w in chosen.Reverse()) bad.Insert(wrong[w].At, wrong[w].O);
            var e = Assert.Throws<InvalidInputException>(() => new SurveyNetwork("n", points, bad));
            small = Assert.Throws<InvalidInputException>(() =>
                new SurveyNetwork("n", points, [Dir("S", "T", "S/1"), .. chosen.Select(w => wrong[w].O)]));
            Assert.Equal(small.Message, e.Message);
        }
        Assert.Equal(4, small!.Message.Split('\n').Length); // the heading, X undefined, U to U, the shared set

        // a set that two stations share within one half (the first, then the second), and across the halves (one
        // station's direction in each): the checks of a large network find each as the one-core pass words it
        foreach (var (first, second) in new[] { (10, 100_000), (200_000, 235_000), (10, 235_000) })
        {
            var bad = new List<Observation>(good);
            bad.Insert(second, Dir("W", "V", "W/1"));
            bad.Insert(first, Dir("V", "W", "W/1"));
            var e = Assert.Throws<InvalidInputException>(() => new SurveyNetwork("n", points, bad));
            var one = Assert.Throws<InvalidInputException>(() => new SurveyNetwork("n", points,
                [Dir("S", "T", "S/1"), Dir("V", "W", "W/1"), Dir("W", "V", "W/1")]));
            Assert.Equal(one.Message, e.Message);
            Assert.Contains("direction set W/1 already belongs to station V", e.Message);
        }
    }
}
