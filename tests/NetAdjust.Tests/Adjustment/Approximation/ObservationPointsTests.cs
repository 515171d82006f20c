using NetAdjust.Adjustment.Approximation;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Tests.Adjustment.Approximation;

/// <summary>The points of each observation, looked up once as indices into the network's points.</summary>
public class ObservationPointsTests
{
    [Fact]
    public void EachObservationListsItsPointsAsObservationPointsNamesThem()
    {
        var pts = new[]
        {
            new Point("A") { E = 0, N = 0, Fixed = Fixity.EN }, new Point("B"), new Point("C"), new Point("D"),
        };
        var obs = new Observation[]
        {
            new DirectionObservation("C", "A", Angle.FromDegrees(10), "C/1") { StandardDeviation = 1e-5 },
            new DistanceObservation("D", "B", Length.FromMetres(50)) { StandardDeviation = 0.002 },
            new AngleObservation("B", "D", "A", Angle.FromDegrees(40)) { StandardDeviation = 1e-5 },
            new HeightDifferenceObservation("A", "C", Length.FromMetres(1.5)) { StandardDeviation = 0.001 },
        };
        var network = new SurveyNetwork("points", pts, obs);
        var ids = new ObservationPoints(network);
        Assert.Equal(obs.Length, ids.Count);
        Assert.Equal([2, 0], ids.Of(0).ToArray()); // station, target (the station once)
        Assert.Equal([3, 1], ids.Of(1).ToArray());
        Assert.Equal([1, 3, 0], ids.Of(2).ToArray()); // station, backsight, foresight
        Assert.Equal([0, 2], ids.Of(3).ToArray());
        for (int i = 0; i < obs.Length; i++)
            Assert.Equal(obs[i].Points.Select(network.IndexOf), ids.Of(i).ToArray());
    }
}
