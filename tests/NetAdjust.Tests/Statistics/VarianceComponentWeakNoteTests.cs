using NetAdjust.Simulation;
using System.Globalization;
using System.Text.RegularExpressions;
using NetAdjust.Network;
using NetAdjust.Procedures;
using NetAdjust.Statistics;
using NetAdjust.Units;

namespace NetAdjust.Tests.Statistics;

/// <summary>
/// Review regression: a group variance factor estimated from little redundancy was reported without caution when the
/// group redundancy was at least 1 (e.g. "given sd x 0.119" from 1.04 degrees of freedom). Such groups now carry a
/// note with the 95% interval of the factor.
/// </summary>
public class VarianceComponentWeakNoteTests
{
    [Fact]
    public void ASingleLevelLoopGivesTheChiSquareIntervalWithOneDegreeOfFreedom()
    {
        // Test data only: one closed loop of five sections, one held benchmark: the height group has r = 1 exactly.
        var points = new[]
        {
            new Point("B1") { H = 50.0, Fixed = Fixity.H }, new Point("B2"), new Point("B3"), new Point("B4"), new Point("B5"),
        };
        double[] dh = [1.2031, -0.4406, 2.0109, -1.5502, -1.2210]; // misclosure +2.2 mm
        string[] ids = ["B1", "B2", "B3", "B4", "B5"];
        var obs = Enumerable.Range(0, 5).Select(k => (Observation)new HeightDifferenceObservation(ids[k], ids[(k + 1) % 5], Length.FromMetres(dh[k]))
        { StandardDeviation = 0.001 }).ToArray();
        var vc = VarianceComponents.Estimate(new SurveyNetwork("loop", points, obs));
        var g = vc.Groups.Single();
        Assert.Equal(1.0, g.Redundancy, 9);
        // Equal weights: each residual is −m/5, so Σv²/σ² = m²/(5σ²) with m = 2.2 mm.
        Assert.Equal(0.0022 * 0.0022 / 5 / 1e-6, g.VarianceFactor, 9);
        Assert.NotNull(g.Note);
        Assert.Contains("weak", g.Note);
        var m = Regex.Match(g.Note!, @"roughly ([0-9.E+\-]+) to ([0-9.E+\-]+)\)");
        Assert.True(m.Success, g.Note);
        double lo = double.Parse(m.Groups[1].Value, CultureInfo.InvariantCulture), hi = double.Parse(m.Groups[2].Value, CultureInfo.InvariantCulture);
        // χ²(0.975; 1) = 5.0239 (NIST/SEMATECH e-Handbook, table of χ² critical values, seen in a reproduction) and
        // χ²(0.025; 1) = 0.000982 (computed); docs/references.md §2. The note prints three significant digits.
        Assert.InRange(lo / (g.VarianceFactor / 5.0239), 0.995, 1.005);
        Assert.InRange(hi / (g.VarianceFactor / 0.000982), 0.995, 1.005);
    }

    [Fact]
    public void AGroupWithAmpleRedundancyHasNoWeakNote()
    {
        var (net, _) = BracedNetworks.Horizontal(41, 4);
        var vc = VarianceComponents.Estimate(net, fitDistanceSpec: false);
        Assert.Contains(vc.Groups, g => g.Redundancy >= VarianceComponents.WeakGroupRedundancy);
        foreach (var g in vc.Groups)
            Assert.Equal(g.Redundancy < VarianceComponents.WeakGroupRedundancy, g.Note?.Contains("weak", StringComparison.Ordinal) == true);
    }
}
