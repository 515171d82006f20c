using NetAdjust.Network;
using NetAdjust.Procedures;
using NetAdjust.Tests.Network;

namespace NetAdjust.Tests.Procedures;

/// <summary>Variance component estimation on groups of GNSS baselines (docs/methods.md, "GNSS baselines").</summary>
public sealed class BaselineVarianceComponentTests
{
    [Fact]
    public void AGroupOfBaselinesRecoversASimulatedScale()
    {
        // Baselines simulated with noise 1.5 × the stated standard deviations (variance factor 2.25), observed in six
        // sessions (36 baselines, r = 99): Förstner's estimator (Förstner 1979; Koch 1999 §3.6) on the group's
        // 3×3 blocks must find about 2.25. Its standard deviation is about 2.25·√(2/r) = 0.32 (common practice for
        // a variance estimated from r degrees of freedom); 3.5 of them bound the check.
        var net = BaselineTestNetworks.Network(seed: 23, noiseScale: 1.5, group: "S1", copies: 6);
        var estimate = VarianceComponents.Estimate(net);
        var g = Assert.Single(estimate.Groups);
        Assert.Equal(ObservationKind.Baseline, g.Kind);
        Assert.Equal("S1", g.Group);
        Assert.Equal(108, g.Count);
        Assert.Equal(99, g.Redundancy, 6);
        Assert.InRange(g.VarianceFactor, 2.25 - (3.5 * 0.32), 2.25 + (3.5 * 0.32));
        Assert.True(estimate.Converged);
        // the re-weighted adjustment fits: its variance factor is 1 (the estimate makes vᵀPv = r)
        Assert.Equal(1.0, estimate.Final.Statistics.VarianceFactor!.Value, 3);
    }

    [Fact]
    public void TwoGroupsAreEstimatedApart()
    {
        // Session A with noise as stated, session B with noise 2 × stated: the estimates tell them apart.
        var a = BaselineTestNetworks.Network(seed: 31, group: "A", copies: 4);
        var b = BaselineTestNetworks.Network(seed: 32, noiseScale: 2, group: "B", copies: 4);
        var obs = a.Observations.Concat(b.Observations.Select(o => o is BaselineObservation bo
            ? bo with { BaselineId = "b" + bo.BaselineId } : o));
        var estimate = VarianceComponents.Estimate(new SurveyNetwork("two", a.Points, obs));
        var ga = estimate.Groups.Single(g => g.Group == "A");
        var gb = estimate.Groups.Single(g => g.Group == "B");
        Assert.InRange(ga.VarianceFactor, 0.4, 1.8);
        Assert.InRange(gb.VarianceFactor, 2.0, 7.0);
    }
}
