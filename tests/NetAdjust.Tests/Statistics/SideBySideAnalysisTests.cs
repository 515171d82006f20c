using NetAdjust.Adjustment;
using NetAdjust.LinearAlgebra.Sparse;
using NetAdjust.Network;
using NetAdjust.Simulation;
using NetAdjust.Statistics;

namespace NetAdjust.Tests.Statistics;

/// <summary>
/// On a large network the relative precisions are computed on a second core beside the tests of the observations
/// and the points. The analysis must be the same, number for number, as the one computed on one thread, whatever
/// the schedule: checked on a simulated plane network (invented data exercising invariants only) with a set-aside
/// observation, external reliability (solves on the first thread) and a listed pair far apart (solves on the second),
/// on the sparse engine, several times over.
/// </summary>
public class SideBySideAnalysisTests
{
    [Fact]
    public void TheRelativePrecisionsOnASecondCoreGiveTheSameAnalysis()
    {
        var net = SetAsideNetworks.Plane(200, seed: 7, setAside: 11);
        var free = net.Points.Where(p => !p.IsFixed(Fixity.E)).Select(p => p.Id).ToList();
        var options = AnalysisOptions.Default with
        {
            ExternalReliability = ExternalReliabilityMode.Always,
            RelativePairs = [(free[0], free[^1])],
        };
        var result = Adjuster.Adjust(net, AdjustmentOptions.Default with
        {
            Solver = new SparseNormalEquationsSolver(), Analysis = options,
        });
        var alone = ResultAnalysis.Run(result, options, beside: false);
        Assert.Contains(alone.Relative, r => !r.Observed);
        Assert.Contains(alone.Observations, t => t.Flag == ObservationFlag.Excluded);
        Assert.Contains(alone.Observations, t => t.ExternalReliability is not null);
        for (int run = 0; run < 4; run++)
        {
            var both = ResultAnalysis.Run(result, options, beside: true);
            Assert.Equal(alone.Observations, both.Observations);
            Assert.Equal(alone.Control, both.Control);
            Assert.Equal(alone.Points, both.Points);
            Assert.Equal(alone.Relative, both.Relative);
            Assert.Equal(alone.RelativeHeights, both.RelativeHeights);
            Assert.Equal(alone.RedundancySum, both.RedundancySum);
        }
    }

    [Fact]
    public void AnErrorOfTheRelativePairsSurfacesFromTheSecondCore()
    {
        var net = SyntheticNetworks.Create(new SyntheticNetworkSpec(SyntheticNetworkKind.Plane, 30, Seed: 2));
        var result = Adjuster.Adjust(net);
        var options = AnalysisOptions.Default with { RelativePairs = [(net.Points[0].Id, "NO-SUCH-POINT")] };
        var e = Assert.Throws<InvalidInputException>(() => ResultAnalysis.Run(result, options, beside: true));
        Assert.Contains("NO-SUCH-POINT", e.Message);
    }
}
