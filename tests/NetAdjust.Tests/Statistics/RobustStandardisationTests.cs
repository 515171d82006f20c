using NetAdjust.Simulation;
using NetAdjust.Adjustment;
using NetAdjust.Network;
using NetAdjust.Procedures;
using NetAdjust.Statistics;

namespace NetAdjust.Tests.Statistics;

/// <summary>
/// The robust standardised residual |u| (review regression): it is the w-test statistic an observation would get at
/// full weight against the others as re-weighted, and so it does not grow as the observation's own weight falls.
/// </summary>
public class RobustStandardisationTests
{
    private static readonly AdjustmentOptions Quick = AdjustmentOptions.Default with
    {
        Analysis = AnalysisOptions.Default with { ExternalReliability = ExternalReliabilityMode.Never },
    };

    [Fact]
    public void AtFullWeightUIsBaardasW()
    {
        // Baarda (1968): w = v / (σ √r) for a diagonal weight.
        Assert.Equal(0.002 / (0.003 * Math.Sqrt(0.4)), RobustEstimation.Standardised(0.002, 0.003, 0.4, 1.0), 12);
        Assert.Equal(0.002 / (0.003 * Math.Sqrt(0.4)), RobustEstimation.Standardised(-0.002, 0.003, 0.4, 1.0), 12);
    }

    [Theory]
    [InlineData(RobustMethod.Huber)]
    [InlineData(RobustMethod.Danish)]
    public void EachUEqualsTheStandardisedMisclosureOfAnIndependentLeaveOneOutAdjustment(RobustMethod method)
    {
        // Independent check: for every down-weighted observation i, adjust again with the final robust weights of the
        // others and i set aside (weight 0); its misclosure eᵢ there, standardised by √(σᵢ² + σ0² aᵢ Q′ aᵢᵀ)
        // (Baarda 1968: the predicted residual and its variance), must equal the reported |u|. The former
        // |v|/(σ √r) with r of the re-weighted adjustment tended to |eᵢ|/σᵢ instead: 1/√r₀ times too large.
        var (net, _) = BracedNetworks.Horizontal(41, 4);
        var clean = Adjuster.Adjust(net, Quick);
        int i0 = clean.Analysis.Observations.Where(t => t.Redundancy > 0.3).Select(t => t.Index).ToList()[3];
        var biased = BracedNetworks.WithBias(net, i0, 20 * net.Observations[i0].StandardDeviation);
        var rb = RobustEstimation.Run(biased, method, Quick);
        Assert.True(rb.Converged);
        var reweighted = biased.Observations.Select((o, k) => Reweighting.WithSd(o, o.StandardDeviation / Math.Sqrt(rb.WeightFactors[k]))).ToArray();
        int checkedCount = 0;
        for (int i = 0; i < reweighted.Length; i++)
        {
            if (rb.WeightFactors[i] >= 1 || double.IsNaN(rb.Standardised[i])) continue;
            var obs = reweighted.ToArray();
            obs[i] = biased.Observations[i] with { Excluded = true }; // given σ, no weight
            var loo = Adjuster.Adjust(new SurveyNetwork(biased.Name, biased.Points, obs), Quick);
            double sd = biased.Observations[i].StandardDeviation, sdOthers = loo.Observations[i].SdAdjusted;
            if (sd * sd / ((sd * sd) + (sdOthers * sdOthers)) < 0.01) continue; // uncontrolled by the others: not tested by u
            double expected = Math.Abs(loo.Analysis.Observations[i].W!.Value);
            // both adjustments iterate until corrections are below 1e-6 m: they agree to about 1e-7 relative
            Assert.True(Math.Abs(rb.Standardised[i] - expected) <= 1e-6 * expected, $"#{i}: u {rb.Standardised[i]} against {expected}");
            checkedCount++;
        }
        Assert.True(checkedCount >= 1);
        Assert.Contains(i0, rb.Suspected);
    }

    [Theory]
    [InlineData(RobustMethod.Huber, 41, 0.5)]
    [InlineData(RobustMethod.Danish, 13, 0.6)]
    public void ASingleBlunderMakesNoGoodObservationASuspect(RobustMethod method, int seed, double pairProbability)
    {
        // One 20σ blunder in each well-controlled observation in turn (rᵢ > 0.3, as in the data snooping test after
        // Baarda 1968): the robust run must suspect that observation and no other. On these thinner networks the
        // former |v|/(σ √r) flagged good observations beside the blunder in 2 of 50 runs (Huber) and in 26 of 46 runs
        // (Danish), because a down-weighted observation's r tends to 1 and its |v|/σ is then 1/√r₀ times too large.
        var (net, _) = BracedNetworks.Horizontal(seed, 5, allPairs: false, pairProbability: pairProbability);
        var clean = Adjuster.Adjust(net, Quick);
        var candidates = clean.Analysis.Observations.Where(t => t.Redundancy > 0.3).Select(t => t.Index).ToList();
        Assert.True(candidates.Count > 10);
        foreach (int i in candidates)
        {
            var rb = RobustEstimation.Run(BracedNetworks.WithBias(net, i, 20 * net.Observations[i].StandardDeviation), method, Quick);
            Assert.Equal(new[] { i }, rb.Suspected);
        }
    }
}
