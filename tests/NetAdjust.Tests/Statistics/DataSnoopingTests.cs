using NetAdjust.Simulation;
using NetAdjust.Adjustment;
using NetAdjust.Network;
using NetAdjust.Procedures;
using NetAdjust.Statistics;

namespace NetAdjust.Tests.Statistics;

public class DataSnoopingTests
{
    private static readonly AdjustmentOptions Quick = AdjustmentOptions.Default with
    {
        Analysis = AnalysisOptions.Default with { ExternalReliability = ExternalReliabilityMode.Never },
    };

    [Fact]
    public void ACleanNetworkIsLeftUntouched()
    {
        // Simulated with N(0, σ²) noise only: no observation should be set aside at α0 = 0.001 (Baarda 1968).
        var (net, _) = BracedNetworks.Horizontal(41, 4);
        var hunt = DataSnooping.Run(net, Quick);
        Assert.Empty(hunt.SetAside);
        Assert.Single(hunt.Rounds);
        Assert.False(hunt.Rounds[0].SetAside);
        Assert.All(hunt.Final.Network.Observations, o => Assert.False(o.Excluded));
        Assert.Equal(Adjuster.Adjust(net, Quick).Statistics.Vtpv, hunt.Final.Statistics.Vtpv, 12);
    }

    [Fact]
    public void A20SigmaBlunderIsFoundFirstAndSetAside()
    {
        // Baarda (1968) data snooping: a single 20σ blunder in an observation with rᵢ > 0.3 has E|wᵢ| = 20√rᵢ > 11,
        // far above 3.29 and above every other w. Checked for every such observation of the network.
        var (net, _) = BracedNetworks.Horizontal(41, 4);
        var clean = Adjuster.Adjust(net, Quick);
        var candidates = clean.Analysis.Observations.Where(t => t.Redundancy > 0.3).Select(t => t.Index).ToList();
        Assert.True(candidates.Count > 10);
        foreach (int i in candidates)
        {
            double sd = net.Observations[i].StandardDeviation;
            var hunt = DataSnooping.Run(BracedNetworks.WithBias(net, i, 20 * sd), Quick);
            Assert.Equal(i, hunt.Rounds[0].WorstIndex);
            Assert.True(hunt.Rounds[0].SetAside);
            Assert.Equal(new[] { i }, hunt.SetAside);
            Assert.True(hunt.Final.Network.Observations[i].Excluded);
            Assert.Equal(ObservationFlag.Excluded, hunt.Final.Analysis.Observations[i].Flag);
            // the set-aside observation is still reported, with a misclosure of about the blunder
            Assert.InRange(Math.Abs(hunt.Final.Observations[i].Residual), 15 * sd, 25 * sd);
        }
    }

    [Fact]
    public void TheRoundLimitStopsTheHunt()
    {
        var (net, _) = BracedNetworks.Horizontal(41, 4);
        var biased = BracedNetworks.WithBias(BracedNetworks.WithBias(net, 5, 0.1), 20, 0.1);
        var hunt = DataSnooping.Run(biased, Quick, maxRounds: 1);
        Assert.Single(hunt.SetAside);
        Assert.Contains("round limit", hunt.StopReason);
        Assert.Throws<InvalidInputException>(() => DataSnooping.Run(biased, Quick, maxRounds: 0));
    }

    [Theory]
    [InlineData(RobustMethod.Huber)]
    [InlineData(RobustMethod.Danish)]
    public void RobustEstimationLocatesTwoBlundersAtOnce(RobustMethod method)
    {
        // Huber (1964) / Danish method (Krarup & Kubik): two 25σ blunders in well-controlled observations of a
        // strong network end up as the two suspects, and the clean observations keep (nearly) full weight.
        var (net, _) = BracedNetworks.Horizontal(41, 4);
        var clean = Adjuster.Adjust(net, Quick);
        var strong = clean.Analysis.Observations.Where(t => t.Redundancy > 0.5).Select(t => t.Index).ToList();
        int i = strong[1], j = strong[^2];
        var biased = BracedNetworks.WithBias(BracedNetworks.WithBias(net, i, 25 * net.Observations[i].StandardDeviation), j, -25 * net.Observations[j].StandardDeviation);
        var rb = RobustEstimation.Run(biased, method, Quick);
        Assert.True(rb.Converged);
        Assert.Equal(new[] { i, j }.Order(), rb.Suspected.Take(2).Order());
        Assert.True(rb.WeightFactors[i] < 0.2 && rb.WeightFactors[j] < 0.2);
        int others = Enumerable.Range(0, net.Observations.Count).Count(k => k != i && k != j && rb.WeightFactors[k] < 0.5);
        Assert.True(others <= 1, $"{others} clean observations were strongly down-weighted");
    }

    [Theory]
    [InlineData(RobustMethod.Huber, 1.5, 3.0, 0.5)]
    [InlineData(RobustMethod.Huber, 1.5, 1.0, 1.0)]
    [InlineData(RobustMethod.Danish, 2.0, 4.0, 0.049787068367863944)] // exp(1 − 4)
    [InlineData(RobustMethod.Danish, 2.0, 2.0, 1.0)]
    public void WeightFunctions(RobustMethod m, double c, double u, double expected)
    {
        // Huber (1964): min(1, c/|u|); Danish (as documented in docs/methods.md): exp(1 − (u/c)²) above c.
        Assert.Equal(expected, RobustEstimation.Weight(m, c, u), 12);
    }
}
