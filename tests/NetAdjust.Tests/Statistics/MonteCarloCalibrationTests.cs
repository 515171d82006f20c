using NetAdjust.Simulation;
using MathNet.Numerics.Distributions;
using NetAdjust.Adjustment;
using NetAdjust.Geometry;
using NetAdjust.Statistics;

namespace NetAdjust.Tests.Statistics;

/// <summary>
/// Monte Carlo calibration: observations simulated from a known truth with N(0, σ²) noise (fixed seeds). When the
/// model is right, σ̂0² has mean 1 (variance 2/r), each wᵢ is N(0, 1), the global test rejects with probability α,
/// and the adjusted coordinates scatter with the reported covariance σ0² Qxx (Koch 1999 §3.2, §4, sections from
/// memory; Baarda 1968).
/// Tolerances are 4.5 standard errors of each sampling statistic, derived beside each check.
/// </summary>
public class MonteCarloCalibrationTests(Xunit.Abstractions.ITestOutputHelper output)
{
    private const int Realisations = 1500;

    [Fact]
    public void StatisticsAreCalibratedOnASimulatedNetwork()
    {
        var options = AdjustmentOptions.Default with
        {
            Analysis = AnalysisOptions.Default with { ExternalReliability = ExternalReliabilityMode.Never,
                RelativeForObservedPairs = false },
        };
        var (exact, truth) = BracedNetworks.Horizontal(2026, 3, noise: 0.0);
        var reference = Adjuster.Adjust(exact, options);
        int r = reference.Statistics.DegreesOfFreedom;
        var free = reference.Points.Where(p => p.SdE > 0).Select(p => p.Id).ToArray();
        var cols = free.SelectMany(id => new[] { reference.Unknowns.IndexOf(id, Parameter.E),
            reference.Unknowns.IndexOf(id, Parameter.N) }).ToArray();
        int q = cols.Length, nObs = reference.Observations.Count;
        var cov = new double[q, q];
        // σ0² = 1
        for (int j = 0; j < q; j++) for (int k = 0; k < q; k++) cov[j, k] = reference.Cofactor(cols[j], cols[k]);

        double sumVf = 0; int rejected = 0;
        var wSum = new double[nObs]; var wSq = new double[nObs];
        var xSum = new double[q]; var xx = new double[q, q];
        var truthVec = free.SelectMany(id => new[] { truth.Plane[id].E, truth.Plane[id].N }).ToArray();
        var insideKnown = new int[free.Length]; var insideEstimated = new int[free.Length];
        var estimatedOptions = options.Analysis with { VarianceFactor = VarianceFactorBasis.Estimated };
        static bool Inside(ErrorEllipse e, double de, double dn)
        {
            // coordinates of the error along the major axis (unit vector (sin θ, cos θ) in E, N) and across it
            double along = (de * Math.Sin(e.Azimuth)) + (dn * Math.Cos(e.Azimuth));
            double across = (de * Math.Cos(e.Azimuth)) - (dn * Math.Sin(e.Azimuth));
            return Math.Pow(along / e.A, 2) + Math.Pow(across / e.B, 2) <= 1;
        }
        for (int k = 0; k < Realisations; k++)
        {
            var (net, _) = BracedNetworks.Horizontal(2026, 3, noise: 1.0, noiseSeed: 10_000 + k);
            var res = Adjuster.Adjust(net, options);
            sumVf += res.Statistics.VarianceFactor!.Value;
            if (res.Statistics.GlobalTest.Passed == false) rejected++;
            var a = res.Analysis;
            for (int i = 0; i < nObs; i++) { double w = a.Observations[i].W!.Value; wSum[i] += w; wSq[i] += w * w; }
            var x = free.SelectMany(id => { var p = res.Points.Single(pp => pp.Id == id); return new[] { p.E!.Value,
                p.N!.Value }; }).ToArray();
            var est = ResultAnalysis.Analyse(res, estimatedOptions);
            for (int f = 0; f < free.Length; f++)
            {
                int pi = res.Network.IndexOf(free[f]);
                double de = x[2 * f] - truthVec[2 * f], dn = x[(2 * f) + 1] - truthVec[(2 * f) + 1];
                if (Inside(a.Points[pi].Confidence!.Value, de, dn)) insideKnown[f]++;
                if (Inside(est.Points[pi].Confidence!.Value, de, dn)) insideEstimated[f]++;
            }
            for (int j = 0; j < q; j++)
            {
                double dj = x[j] - truthVec[j];
                xSum[j] += dj;
                for (int l = 0; l < q; l++) xx[j, l] += dj * (x[l] - truthVec[l]);
            }
        }
        double n = Realisations;
        output.WriteLine($"r = {r}, mean variance factor {sumVf / n:F4}, global test rejection rate {rejected / n:F4}");

        // Mean variance factor: sd of the mean = √(2 / (r N)).
        Assert.InRange(sumVf / n - 1, -4.5 * Math.Sqrt(2 / (r * n)), 4.5 * Math.Sqrt(2 / (r * n)));

        // Global test (two-tailed, α = 0.05): rejection rate ≈ α, binomial sd √(α(1−α)/N).
        double alpha = options.GlobalTestAlpha;
        Assert.InRange(rejected / n - alpha, -4.5 * Math.Sqrt(alpha * (1 - alpha) / n),
            4.5 * Math.Sqrt(alpha * (1 - alpha) / n));

        // Each observation's w: mean 0 (sd of the mean 1/√N) and standard deviation 1 (sd of a sample sd ≈ 1/√(2N)).
        for (int i = 0; i < nObs; i++)
        {
            double mean = wSum[i] / n;
            double sd = Math.Sqrt((wSq[i] - (n * mean * mean)) / (n - 1));
            Assert.InRange(mean, -4.5 / Math.Sqrt(n), 4.5 / Math.Sqrt(n));
            Assert.InRange(sd - 1, -4.5 / Math.Sqrt(2 * n), 4.5 / Math.Sqrt(2 * n));
        }

        // 95% confidence ellipses contain the true point in 95% of realisations, both with the χ² scale 2.4477 and
        // σ0² (variance factor known) and with the F scale √(2F(0.95; 2, r)) and σ̂0² (estimated; exact for a linear
        // model): Hoover 1984; docs/references.md §5. Binomial sd √(0.95·0.05/N).
        double cover = 4.5 * Math.Sqrt(0.95 * 0.05 / n);
        for (int f = 0; f < free.Length; f++)
        {
            output.WriteLine(
                $"{free[f]}: 95% ellipse coverage known {insideKnown[f] / n:F4}, estimated " +
                $"{insideEstimated[f] / n:F4}");
            Assert.InRange(insideKnown[f] / n - 0.95, -cover, cover);
            Assert.InRange(insideEstimated[f] / n - 0.95, -cover, cover);
        }

        // Coordinates: unbiased (sd of the mean √(c_jj/N)), and the empirical covariance about the truth matches
        // σ0² Qxx: for normal data Var(ĉ_jl) = (c_jj c_ll + c_jl²)/N.
        for (int j = 0; j < q; j++)
        {
            Assert.InRange(xSum[j] / n, -4.5 * Math.Sqrt(cov[j, j] / n), 4.5 * Math.Sqrt(cov[j, j] / n));
            for (int l = 0; l < q; l++)
            {
                double emp = xx[j, l] / n;
                double se = Math.Sqrt(((cov[j, j] * cov[l, l]) + (cov[j, l] * cov[j, l])) / n);
                Assert.InRange(emp - cov[j, l], -4.5 * se, 4.5 * se);
            }
        }
    }

    [Fact]
    public void TauTestRejectsACleanNetworkAtAboutTheChosenLevel()
    {
        // Pope (1976): with α′ from Šidák, the chance that any |τᵢ| exceeds τ_crit in a clean network is at most about
        // α
        // (the τᵢ are correlated, so the family-wise rate is ≤ α). Binomial sd √(α(1−α)/N).
        var options = AdjustmentOptions.Default with
        {
            Analysis = AnalysisOptions.Default with
            {
                VarianceFactor = VarianceFactorBasis.Estimated, ExternalReliability = ExternalReliabilityMode.Never,
                    RelativeForObservedPairs = false,
            },
        };
        int any = 0; const int runs = 600;
        for (int k = 0; k < runs; k++)
        {
            var noisy = BracedNetworks.Levelling(77, 8, 10).Network; // geometry fixed by seed 77
            var res = Adjuster.Adjust(Resimulate(noisy, k), options);
            if (res.Analysis.Observations.Any(t => t.TauPassed == false)) any++;
        }
        double rate = any / (double)runs, a = 0.05;
        output.WriteLine($"family-wise tau rejection rate {rate:F4}");
        Assert.True(rate <= a + (4.5 * Math.Sqrt(a * (1 - a) / runs)), $"family-wise rejection rate {rate}");
        Assert.True(rate > 0.005, $"family-wise rejection rate {rate} is implausibly small"); // the test is not inert
    }

    /// <summary>Re-draws the noise of a level network from the held height and the exact differences.</summary>
    private static NetAdjust.Network.SurveyNetwork Resimulate(NetAdjust.Network.SurveyNetwork net, int seed)
    {
        var exact = Adjuster.Adjust(net); // any consistent set of heights serves as the truth
        var h = exact.Points.ToDictionary(p => p.Id, p => p.H!.Value);
        var rnd = new Random(seed);
        var obs = net.Observations.Select(o =>
            (NetAdjust.Network.Observation)((NetAdjust.Network.HeightDifferenceObservation)o with
        {
            Difference = NetAdjust.Units.Length.FromMetres(h[o.To] - h[o.From] + (o.StandardDeviation *
                Normal.Sample(rnd, 0, 1))),
        }));
        return new NetAdjust.Network.SurveyNetwork(net.Name, net.Points, obs);
    }
}
