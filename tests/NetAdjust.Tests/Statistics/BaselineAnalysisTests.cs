using NetAdjust.Adjustment;
using NetAdjust.Geodesy;
using NetAdjust.Statistics;
using NetAdjust.Tests.Network;

namespace NetAdjust.Tests.Statistics;

/// <summary>The three-dimensional test of GNSS baselines and their residuals in north, east, up
/// (docs/methods.md, "Tests of baselines").</summary>
public sealed class BaselineAnalysisTests
{
    /// <summary>The up direction (in ΔX, ΔY, ΔZ) at the mid point of baseline k of the test network.</summary>
    private static double[] Up(int k)
    {
        var (a, b) = BaselineTestNetworks.Pairs[k];
        var t = BaselineTestNetworks.Truth;
        var (lat, lon) = BaselineTestNetworks.Utm33.Inverse((t[a].E + t[b].E) / 2, (t[a].N + t[b].N) / 2);
        return [Math.Cos(lat) * Math.Cos(lon), Math.Cos(lat) * Math.Sin(lon), Math.Sin(lat)];
    }

    [Fact]
    public void A5CentimetreBlunderInUpIsFlaggedByTheVectorTestAndTheUpComponentsW()
    {
        const int k = 4; // GA2 → GA4
        var up = Up(k);
        var blundered = BaselineTestNetworks.Network(seed: 7, bias: (k, 0.05 * up[0], 0.05 * up[1], 0.05 * up[2]));
        var clean = BaselineTestNetworks.Network(seed: 7);

        var tests = BaselineAnalysis.Analyse(Adjuster.Adjust(blundered));
        var bad = tests[k];
        // χ²(0.999; 3) = 16.266 (NIST/SEMATECH e-Handbook §1.3.6.7.4 table, from memory; MathNet computes it): the
        // critical value of the vector test at the w-test's α0 = 0.001 (Baarda 1968; Teunissen, Testing Theory 2000)
        Assert.Equal(16.266, bad.CriticalValue!.Value, 3);
        Assert.Equal(3, bad.Dimension);
        Assert.False(bad.Passed);
        // the bias along up is the most likely alternative: its w exceeds 3.29 (docs/references.md §3) and is the
        // largest of the local directions; the up residual carries (most of) the blunder, with the opposite sign
        var w = bad.LocalW!.Value;
        Assert.True(Math.Abs(w.Up) > 3.29, $"w(up) = {w.Up}");
        Assert.True(Math.Abs(w.Up) > Math.Abs(w.North) && Math.Abs(w.Up) > Math.Abs(w.East));
        Assert.True(bad.LocalResidual.Up < -0.02, $"v(up) = {bad.LocalResidual.Up}");
        // T is the largest of the baselines' statistics
        Assert.Equal(k, Enumerable.Range(0, tests.Count).MaxBy(i => tests[i].Statistic!.Value));

        // Without the blunder every baseline passes (the same noise).
        Assert.All(BaselineAnalysis.Analyse(Adjuster.Adjust(clean)), t => Assert.True(t.Passed, t.BaselineId));
    }

    [Fact]
    public void TheVectorTestOfOneDimensionIsTheSquareOfTheWTest()
    {
        // With two components of a baseline set aside the vector test tests one component: T = w² (Teunissen,
        // Testing Theory 2000, the one-dimensional case of the test).
        var net = BaselineTestNetworks.Network(seed: 3);
        var obs = net.Observations.Select((o, i) => i is 0 or 1 ? o with { Excluded = true } : o);
        var result = Adjuster.Adjust(new NetAdjust.Network.SurveyNetwork(net.Name, net.Points, obs));
        var t = BaselineAnalysis.Analyse(result)[0];
        Assert.Equal(1, t.Dimension);
        double w = result.Analysis.Observations[2].W!.Value;
        Assert.Equal(w * w, t.Statistic!.Value, 1e-9 * Math.Max(1, w * w));
    }

    [Fact]
    public void LocalResidualsAreTheResidualVectorRotatedAtTheMidPoint()
    {
        // R rows east, north, up (docs/glossary.md): |R v| = |v| and R v along up equals v · up.
        var result = Adjuster.Adjust(BaselineTestNetworks.Network(seed: 11));
        var t = BaselineAnalysis.Analyse(result)[2];
        var (x, y, z) = t.Residual;
        var (n, e, u) = t.LocalResidual;
        Assert.Equal(Math.Sqrt((x * x) + (y * y) + (z * z)), Math.Sqrt((n * n) + (e * e) + (u * u)), 1e-12);
        var up = Up(2);
        Assert.Equal((x * up[0]) + (y * up[1]) + (z * up[2]), u, 1e-6);
        Assert.Equal(result.Observations[6].Residual, x, 15);
    }

    [Fact]
    public void ManyBaselinesAreTestedInInputOrderAndRepeatsAlike()
    {
        // The six baselines observed 400 times over with the same values (2,400 baselines: the second half is tested
        // on another core). Repeats of one baseline have the same residuals, so the same test (common practice: equal
        // observations of equal weight share their residuals); the tests come in input order, each with its rows.
        var net = BaselineTestNetworks.Network(seed: 5);
        var obs = Enumerable.Range(0, 400).SelectMany(r => net.Observations.Select(o =>
            o is NetAdjust.Network.BaselineObservation b ? b with { BaselineId = $"{b.BaselineId}#{r}" } : o));
        var result = Adjuster.Adjust(new NetAdjust.Network.SurveyNetwork(net.Name, net.Points, obs));
        var tests = BaselineAnalysis.Analyse(result);
        Assert.Equal(2400, tests.Count);
        for (int i = 0; i < tests.Count; i++)
        {
            Assert.Equal([3 * i, (3 * i) + 1, (3 * i) + 2], tests[i].Rows);
            var first = tests[i % 6];
            Assert.Equal(first.Statistic!.Value, tests[i].Statistic!.Value, 1e-9 * first.Statistic.Value);
            Assert.Equal(first.LocalResidual.Up, tests[i].LocalResidual.Up, 1e-12);
            Assert.Equal(first.LocalMdb!.Value.Up, tests[i].LocalMdb!.Value.Up, 1e-12);
        }
    }
}
