using NetAdjust.Adjustment.Approximation;
using NetAdjust.Network;
using NetAdjust.Units;

namespace NetAdjust.Tests.Adjustment.Approximation;

/// <summary>The observation index: which observations and direction sets link which points, in input order.</summary>
public class ObservationIndexTests
{
    [Fact]
    public void PointsKnowTheirObservationsAndSetsInInputOrder()
    {
        var pts = new[] { new Point("A") { E = 0, N = 0, Fixed = Fixity.EN }, new Point("B"), new Point("C") };
        var obs = new Observation[]
        {
            new DirectionObservation("A", "B", Angle.FromDegrees(10), "A/1") { StandardDeviation = 1e-5 },
            new DistanceObservation("B", "C", Length.FromMetres(50)) { StandardDeviation = 0.002 },
            new DirectionObservation("A", "C", Angle.FromDegrees(40), "A/1") { StandardDeviation = 1e-5 },
            new DirectionObservation("C", "A", Angle.FromDegrees(0), "C/1") { StandardDeviation = 1e-5 },
        };
        var index = new ObservationIndex(new SurveyNetwork("index", pts, obs));
        Assert.Equal([obs[0], obs[2], obs[3]], index.ObservationsOf("A"));
        Assert.Equal([obs[1], obs[2], obs[3]], index.ObservationsOf("C"));
        Assert.Equal(["A/1", "C/1"], index.Sets.Keys);
        Assert.Equal([obs[0], obs[2]], index.Sets["A/1"]);
        Assert.Equal(["A/1", "C/1"], index.SetsOf("C"));
        Assert.Equal(["A/1"], index.SetsOf("B"));
        Assert.Equal(["A/1"], index.SetsAt("A"));
        Assert.Equal(["B", "C"], index.SeenFrom("A").Order(StringComparer.Ordinal));
        Assert.Empty(index.ObservationsOf("nowhere"));
    }
}
