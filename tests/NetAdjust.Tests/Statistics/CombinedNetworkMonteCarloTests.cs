using MathNet.Numerics.Distributions;
using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Adjustment;
using NetAdjust.Geodesy;
using NetAdjust.Geometry;
using NetAdjust.Network;
using NetAdjust.Procedures;
using NetAdjust.Simulation;
using NetAdjust.Statistics;
using NetAdjust.Tests.Geodesy;
using NetAdjust.Units;

namespace NetAdjust.Tests.Statistics;

/// <summary>
/// Monte Carlo of a combined network (issue #19): the Skelmoor demo's GNSS baselines, traverse and level line drawn
/// from their truth with 300 seeds through an independent projection (Krüger's series for ETRS89 / UTM zone 32N),
/// reduced to the grid and adjusted. Under a true stochastic model the estimates must behave as the theory says:
/// variance factor 1 on average, 95% confidence regions that hold the truth 95% of the time, and the baselines'
/// vector test rejecting at its α. Each bound is stated beside its check.
/// </summary>
public sealed class CombinedNetworkMonteCarloTests
{
    private const int Runs = 300;

    private static readonly KruegerTransverseMercator Utm32 = KruegerTransverseMercator.Utm(Ellipsoid.Grs80, 32);

    private static readonly GridSystem Grid = new()
    {
        Projection = Utm32, Distances = DistanceBasis.Ground, GeoidSeparation = SkelmoorGnss.GeoidSeparation,
    };

    /// <summary>The vector test and the w-test at α = 5% here, so that a rate can be measured in 300 runs.</summary>
    private static readonly AdjustmentOptions Options = AdjustmentOptions.Default with
    {
        Analysis = AnalysisOptions.Default with { WTestAlpha = 0.05 },
    };

    private static readonly Lazy<List<Run>> Draws = new(() => [.. Enumerable.Range(1, Runs).Select(Simulate)]);

    private sealed record Run(double VarianceFactor, int DegreesOfFreedom, bool GlobalPassed, List<double> Horizontal,
        List<double> Heights, List<double> Spatial, List<bool> VectorRejected);

    /// <summary>The network of one draw, as a project file would give it.</summary>
    internal static SurveyNetwork Network(DemoSurvey s)
    {
        var obs = new List<Observation>();
        foreach (var (_, o) in s.Setups) obs.AddRange(o);
        obs.AddRange(s.Levelling);
        for (int k = 0; k < s.Baselines.Count; k++)
        {
            var b = s.Baselines[k];
            obs.AddRange(BaselineObservation.Components($"B{k + 1}", b.From, b.To,
                    (Length.FromMetres(b.Dx), Length.FromMetres(b.Dy), Length.FromMetres(b.Dz)), b.Covariance, Grid)
                .Select(c => c with { Group = b.Session }));
        }
        return new SurveyNetwork("Skelmoor Monte Carlo", s.Points, obs);
    }

    private static Run Simulate(int seed)
    {
        var s = DemoScenarios.Draw(DemoScenario.Skelmoor, seed, Utm32);
        var reduced = GridReduction.Reduce(Network(s), Grid, Options).Network;
        var result = Adjuster.Adjust(reduced, Options);
        var st = result.Statistics;
        var horizontal = new List<double>();
        var heights = new List<double>();
        var spatial = new List<double>();
        foreach (var p in result.Points.Where(p => p.Input.Fixed == Fixity.None))
        {
            var t = s.Truth[p.Id];
            double[] d = [p.E!.Value - t.E, p.N!.Value - t.N, p.H!.Value - t.H];
            // the covariance of (E, N, H) from the cofactors (a-priori variance factor 1)
            int[] u = [.. new[] { Parameter.E, Parameter.N, Parameter.H }
                .Select(c => result.Unknowns.IndexOf(p.Id, c))];
            var q = Matrix<double>.Build.Dense(3, 3, (i, j) => result.Cofactor(u[i], u[j]));
            var dv = Vector<double>.Build.Dense(d);
            spatial.Add(dv * q.Solve(dv));
            var qh = q.SubMatrix(0, 2, 0, 2);
            var dh = dv.SubVector(0, 2);
            horizontal.Add(dh * qh.Solve(dh));
            heights.Add(d[2] * d[2] / q[2, 2]);
        }
        var rejected = BaselineAnalysis.Analyse(result, result.Analysis).Select(b => b.Passed == false).ToList();
        return new Run(st.VarianceFactor!.Value, st.DegreesOfFreedom, st.GlobalTest.Passed == true, horizontal,
            heights, spatial, rejected);
    }

    [Fact]
    public void VarianceFactorIsOneOnAverage()
    {
        var runs = Draws.Value;
        int r = runs[0].DegreesOfFreedom;
        // σ̂0² = vᵀPv / r with vᵀPv ~ χ²(r): mean 1, variance 2/r (Koch 1999); the mean of 300 has sd √(2 / (r·300));
        // allowed 4 sd
        double mean = runs.Average(x => x.VarianceFactor), sd = Math.Sqrt(2.0 / r / Runs);
        Assert.InRange(mean, 1 - 4 * sd, 1 + 4 * sd);
        // the global test (two-tailed, α = 5%) rejects about 5% of the draws: binomial(300, 0.05) has sd 3.8;
        // allowed 4 sd either side
        int rejected = runs.Count(x => !x.GlobalPassed);
        double expected = 0.05 * Runs, bsd = Math.Sqrt(Runs * 0.05 * 0.95);
        Assert.InRange(rejected, expected - 4 * bsd, expected + 4 * bsd);
    }

    /// <summary>
    /// The 95% confidence ellipse of each new point (χ²(0.95; 2) = 5.9915, docs/references.md §2), its height
    /// interval (1.96 σ) and its 3D ellipsoid (χ²(0.95; 3) = 7.8147, computed) hold the truth in about 95% of the
    /// draws. Pooled over the 6 new points: a point's coverage over 300 draws is binomial with sd √(0.95 · 0.05 /
    /// 300) = 0.0126, and the mean over points has at most that sd (the points of one draw are correlated);
    /// allowed 3.5 of it, [0.906, 0.994].
    /// </summary>
    [Fact]
    public void ConfidenceRegionsOfThePointsHoldTheTruthNinetyFivePercentOfTheTime()
    {
        var runs = Draws.Value;
        double bound = 3.5 * Math.Sqrt(0.95 * 0.05 / Runs);
        double Coverage(Func<Run, List<double>> of, double critical) =>
            runs.SelectMany(of).Average(q => q <= critical ? 1.0 : 0.0);
        Assert.InRange(Coverage(x => x.Horizontal, ChiSquared.InvCDF(2, 0.95)), 0.95 - bound, 0.95 + bound);
        Assert.InRange(Coverage(x => x.Heights, ChiSquared.InvCDF(1, 0.95)), 0.95 - bound, 0.95 + bound);
        Assert.InRange(Coverage(x => x.Spatial, ChiSquared.InvCDF(3, 0.95)), 0.95 - bound, 0.95 + bound);
        Assert.Equal(5.9915, ChiSquared.InvCDF(2, 0.95), 4); // docs/references.md §2
        Assert.Equal(6 * Runs, runs.Sum(x => x.Horizontal.Count));
    }

    /// <summary>
    /// The baselines' vector test at α = 5% rejects about 5% of the baselines when nothing is wrong: over 300 draws
    /// and 6 baselines, pooled as above, sd at most √(0.05 · 0.95 / 300) = 0.0126 (binomial); allowed 3.5 of it,
    /// [0.006, 0.094]. The statistic of a good baseline is χ²(3) (Teunissen, Testing Theory 2000).
    /// </summary>
    [Fact]
    public void VectorTestRejectsGoodBaselinesAtItsAlpha()
    {
        var runs = Draws.Value;
        double rate = runs.SelectMany(x => x.VectorRejected).Average(r => r ? 1.0 : 0.0);
        double bound = 3.5 * Math.Sqrt(0.05 * 0.95 / Runs);
        Assert.InRange(rate, 0.05 - bound, 0.05 + bound);
        Assert.Equal(6 * Runs, runs.Sum(x => x.VectorRejected.Count));
    }
}
