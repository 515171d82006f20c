using NetAdjust.Simulation;
using NetAdjust.Adjustment;
using NetAdjust.Network;

namespace NetAdjust.Tests.Adjustment;

/// <summary>
/// Observations set aside create no unknowns or parts, and coordinates the adjustment cannot use are named as such
/// (not reported as an undefined datum). The oracle for setting aside is the same network with those observations
/// removed: least squares gives them no weight, so the solutions must agree (Gauss-Markov model, common practice).
/// </summary>
public sealed class SetAsideAndCoordinateTests
{
    private static SurveyNetwork With(SurveyNetwork n, Func<Observation, Observation> map) =>
        new(n.Name, n.Points, n.Observations.Select(map));

    private static SurveyNetwork Without(SurveyNetwork n, Func<Observation, bool> drop) =>
        new(n.Name, n.Points, n.Observations.Where(o => !drop(o)));

    private static void AssertSameCoordinates(AdjustmentResult a, AdjustmentResult b, string? skip = null)
    {
        foreach (var p in a.Points.Where(p => p.Id != skip))
        {
            var q = b.Points.Single(x => x.Id == p.Id);
            Assert.Equal(q.E!.Value, p.E!.Value, 1e-7);
            Assert.Equal(q.N!.Value, p.N!.Value, 1e-7);
        }
    }

    [Fact]
    public void AWhollySetAsideDirectionSetIsLikeNoSetAtAll()
    {
        var net = GridNetworks.Horizontal(seed: 11);
        bool InSet(Observation o) => o is DirectionObservation d && d.SetId == "P11/1";
        var setAside = Adjuster.Adjust(With(net, o => InSet(o) ? o with { Excluded = true } : o));
        var removed = Adjuster.Adjust(Without(net, InSet));
        Assert.Equal(removed.Statistics.Unknowns, setAside.Statistics.Unknowns);
        Assert.Equal(removed.Statistics.DegreesOfFreedom, setAside.Statistics.DegreesOfFreedom);
        AssertSameCoordinates(setAside, removed);
        Assert.DoesNotContain(setAside.Orientations, o => o.SetId == "P11/1");
    }

    [Fact]
    public void APointReachedOnlyBySetAsideObservationsIsNoUnknown()
    {
        var net = GridNetworks.Horizontal(seed: 12);
        bool Touches(Observation o) => o.Points.Contains("P22");
        var setAside = Adjuster.Adjust(With(net, o => Touches(o) ? o with { Excluded = true } : o));
        var removed = Adjuster.Adjust(Without(net, Touches));
        Assert.Equal(removed.Statistics.Unknowns, setAside.Statistics.Unknowns);
        AssertSameCoordinates(setAside, removed, skip: "P22");
        var p22 = setAside.Points.Single(p => p.Id == "P22");
        Assert.Null(p22.SdE); // no unknown, no control: no standard deviation
    }

    [Fact]
    public void TwoJoinedPointsOnOneSpotAreNamed()
    {
        var net = GridNetworks.Horizontal(seed: 13);
        var p21 = net["P21"];
        var points = net.Points.Select(p => p.Id == "P22" ? p with { E = p21.E, N = p21.N } : p).ToList();
        var e = Assert.Throws<InvalidInputException>(() => Adjuster.Adjust(new SurveyNetwork(net.Name, points,
            net.Observations)));
        Assert.Contains("have the same coordinates", e.Message);
        Assert.Contains("P21", e.Message);
        Assert.Contains("P22", e.Message);
    }

    [Fact]
    public void AnAbsurdCoordinateIsNamed()
    {
        var net = GridNetworks.Horizontal(seed: 14);
        var points = net.Points.Select(p => p.Id == "P22" ? p with { E = 1e308 } : p).ToList();
        var e = Assert.Throws<InvalidInputException>(() => Adjuster.Adjust(new SurveyNetwork(net.Name, points,
            net.Observations)));
        Assert.Contains("point P22", e.Message);
    }

    [Fact]
    public void AToleranceBelowTheSpacingOfDoublesIsRefused()
    {
        // At northings of 5,500 km doubles are 2^-30 m ≈ 9.3e-10 m apart (IEEE 754 binary64, common practice).
        var net = GridNetworks.Horizontal(seed: 15);
        var far = new SurveyNetwork(net.Name, net.Points.Select(p => p with { N = p.N + 5_500_000 }), net.Observations);
        var e = Assert.Throws<InvalidInputException>(() => Adjuster.Adjust(far,
            AdjustmentOptions.Default with { LengthTolerance = 1e-10 }));
        Assert.Contains("can never be met", e.Message);
        Assert.Throws<InvalidInputException>(() => AdjustmentPreflight.Check(far,
            AdjustmentOptions.Default with { LengthTolerance = 1e-10 }));
        Assert.Equal(0, Adjuster.Adjust(far).Statistics.Unknowns - Adjuster.Adjust(net).Statistics.Unknowns);
    }
}
