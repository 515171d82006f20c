using NetAdjust.Network;
using NetAdjust.Simulation;

namespace NetAdjust.Tests.Simulation;

/// <summary>The demo scenarios draw noise of the standard deviation they state, around their truth.</summary>
public class DemoScenariosTests
{
    /// <summary>
    /// Distances and height differences, normalised by their σ, over 300 seeds: mean near 0 and variance near 1.
    /// Bounds: the sample mean has sd 1/√n and the sample variance sd √(2/n) for normal data (common practice);
    /// both are allowed 5 of those sds.
    /// </summary>
    [Theory]
    [InlineData(DemoScenario.Brackenmoor)]
    [InlineData(DemoScenario.Harrowfield)]
    [InlineData(DemoScenario.Harrowgate)]
    public void Noise_has_the_stated_standard_deviation(DemoScenario scenario)
    {
        var z = new List<double>();
        for (int seed = 1; seed <= 300; seed++)
        {
            var s = DemoScenarios.Draw(scenario, seed);
            var t = s.Truth;
            foreach (var o in s.Setups.SelectMany(x => x.Observations).Concat(s.Levelling))
            {
                double truth = o switch
                {
                    DistanceObservation d =>
                        Math.Sqrt(Math.Pow(t[d.To].E - t[d.From].E, 2) + Math.Pow(t[d.To].N - t[d.From].N, 2))
                        + s.Blunders.Where(b => (b.At, b.To) == (d.From, d.To)).Sum(b => b.Size),
                    HeightDifferenceObservation h => t[h.To].H - t[h.From].H,
                    _ => double.NaN,
                };
                double value = o switch
                {
                    DistanceObservation d => d.Distance.Metres,
                    HeightDifferenceObservation h => h.Difference.Metres,
                    _ => double.NaN,
                };
                if (!double.IsNaN(truth)) z.Add((value - truth) / o.StandardDeviation);
            }
        }
        int n = z.Count;
        double mean = z.Average();
        double variance = z.Sum(v => (v - mean) * (v - mean)) / (n - 1);
        Assert.InRange(mean, -5 / Math.Sqrt(n), 5 / Math.Sqrt(n));
        Assert.InRange(variance, 1 - (5 * Math.Sqrt(2.0 / n)), 1 + (5 * Math.Sqrt(2.0 / n)));
    }

    [Fact]
    public void The_same_seed_gives_the_same_draw()
    {
        var a = DemoScenarios.Draw(DemoScenario.Brackenmoor, 11);
        var b = DemoScenarios.Draw(DemoScenario.Brackenmoor, 11);
        Assert.Equal(a.Setups.SelectMany(s => s.Observations), b.Setups.SelectMany(s => s.Observations));
        Assert.Equal(a.Levelling, b.Levelling);
        Assert.Equal(a.Points, b.Points);
    }
}
