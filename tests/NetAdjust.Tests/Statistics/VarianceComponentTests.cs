using NetAdjust.Simulation;
using NetAdjust.Adjustment;
using NetAdjust.Network;
using NetAdjust.Procedures;
using NetAdjust.Statistics;

namespace NetAdjust.Tests.Statistics;

public class VarianceComponentTests(Xunit.Abstractions.ITestOutputHelper output)
{
    [Fact]
    public void GroupFactorsRecoverTheSimulatedNoiseLevels()
    {
        // Distances simulated with twice their stated σ (true factor 4), directions with their stated σ (factor 1).
        // Förstner (1979) iterative estimator; averaged over independent realisations; tolerance 4.5 standard errors
        // of the mean, from the spread of the estimates themselves.
        const int runs = 60;
        var dist = new List<double>(); var dir = new List<double>();
        for (int k = 0; k < runs; k++)
        {
            var (net, _) = BracedNetworks.Horizontal(9, 5, noise: 1.0, noiseSeed: 500 + k, distanceNoise: 2.0);
            var vc = VarianceComponents.Estimate(net, fitDistanceSpec: false);
            Assert.True(vc.Converged);
            dist.Add(vc.Groups.Single(g => g.Kind == ObservationKind.Distance).VarianceFactor);
            dir.Add(vc.Groups.Single(g => g.Kind == ObservationKind.Direction).VarianceFactor);
        }
        void Check(List<double> xs, double truth, string what)
        {
            double mean = xs.Average();
            double se = Math.Sqrt(xs.Sum(x => (x - mean) * (x - mean)) / (xs.Count - 1) / xs.Count);
            output.WriteLine($"{what}: mean {mean:F3} (truth {truth}), standard error {se:F3}");
            Assert.InRange(mean - truth, -4.5 * se, 4.5 * se);
        }
        Check(dist, 4.0, "distances");
        Check(dir, 1.0, "directions");
    }

    [Fact]
    public void AtConvergenceEachGroupFitsItsOwnRedundancy()
    {
        // The estimator's fixed point: with the re-scaled σ, Σ vᵢ²/σᵢ² over a group equals its redundancy Σ rᵢ
        // (Förstner 1979), so every group's variance factor against the new σ is 1.
        var (net, _) = BracedNetworks.Horizontal(19, 4, noise: 1.0, distanceNoise: 3.0);
        var vc = VarianceComponents.Estimate(net, fitDistanceSpec: false);
        var fin = vc.Final;
        foreach (var kind in new[] { ObservationKind.Distance, ObservationKind.Direction })
        {
            var idx = Enumerable.Range(0, fin.Observations.Count).Where(i => fin.Network.Observations[i].Kind == kind).ToList();
            double q = idx.Sum(i => Math.Pow(fin.Observations[i].Residual / fin.Network.Observations[i].StandardDeviation, 2));
            double r = idx.Sum(i => fin.Analysis.Observations[i].Redundancy);
            Assert.Equal(1.0, q / r, 3);
        }
        var d = vc.Groups.Single(g => g.Kind == ObservationKind.Distance);
        Assert.Equal(Math.Sqrt(d.VarianceFactor) * BracedNetworks.DistanceSd, d.ScaledSd!.Value, 12);
    }

    [Fact]
    public void TheDistanceSpecFitIsRefusedWithoutASpreadOfLengths()
    {
        var (net, _) = BracedNetworks.Horizontal(19, 2);
        var vc = VarianceComponents.Estimate(net);
        var d = vc.Groups.Single(g => g.Kind == ObservationKind.Distance);
        Assert.Null(d.PpmPart);
        Assert.Contains("no a + b ppm fit", d.Note);
    }
}

public class VarianceComponentSpecFitTests(Xunit.Abstractions.ITestOutputHelper output)
{
    [Fact]
    public void TheDistanceSpecFitTellsThreeMillimetresAndThreePpmFromTheirNeighbours()
    {
        // Distances simulated with σ² = (3 mm)² + (3 ppm · d)² (EDM specification a + b ppm, docs/glossary.md), given
        // as a flat 3 mm, in a network of 18 points with 152 distances of 150 m to 1.4 km. The two-component
        // Förstner (1979) estimate, averaged over 30 realisations, must recover a² and b² within 4.5 standard errors
        // of the mean (the standard deviation of the single estimates over √30). That band must also be narrow
        // enough to exclude the neighbouring specifications, a = 2 or 4 mm and b = 2 or 4 ppm, so the test shows
        // that the fit tells the two parts apart rather than accepting anything from zero upwards.
        const int runs = 30;
        const double aMm = 3.0, bPpm = 3.0;
        var a2 = new List<double>(); var b2 = new List<double>();
        int notConverged = 0;
        for (int k = 0; k < runs; k++)
        {
            var (net, _) = BracedNetworks.Horizontal(31, 16, noise: 1.0, noiseSeed: 900 + k,
                distanceTrueSd: d => Math.Sqrt(Math.Pow(aMm * 1e-3, 2) + Math.Pow(bPpm * 1e-6 * d, 2)));
            var vc = VarianceComponents.Estimate(net);
            if (!vc.Converged) notConverged++;
            var g = vc.Groups.Single(x => x.Kind == NetAdjust.Network.ObservationKind.Distance);
            Assert.NotNull(g.PpmPart);
            a2.Add(g.ConstantPart!.Value * g.ConstantPart.Value * 1e6); // mm²
            b2.Add(g.PpmPart!.Value * g.PpmPart.Value);                 // ppm²
        }
        void Check(List<double> xs, double truth, string what)
        {
            double mean = xs.Average();
            double sd = Math.Sqrt(xs.Sum(x => (x - mean) * (x - mean)) / (xs.Count - 1));
            double band = 4.5 * sd / Math.Sqrt(xs.Count);
            double t = Math.Sqrt(truth);
            double gap = Math.Min(truth - ((t - 1) * (t - 1)), ((t + 1) * (t + 1)) - truth);
            output.WriteLine($"{what}: mean {mean:F3} (truth {truth}), sd of one estimate {sd:F3}, band ±{band:F3}");
            Assert.InRange(mean - truth, -band, band);
            Assert.True(band < gap, $"{what}: the band ±{band:F2} does not exclude the neighbouring specifications");
        }
        output.WriteLine($"not converged: {notConverged} of {runs}");
        Assert.Equal(0, notConverged);
        Check(a2, aMm * aMm, "a² (mm²)");
        Check(b2, bPpm * bPpm, "b² (ppm²)");
    }
}
