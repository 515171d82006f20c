using NetAdjust.Adjustment;
using NetAdjust.LinearAlgebra.Sparse;
using NetAdjust.Network;
using NetAdjust.Simulation;
using NetAdjust.Statistics;

namespace NetAdjust.Tests.Statistics;

/// <summary>
/// The statistics reuse the a Qxx aᵀ that the adjuster computed for each observation's standard deviation instead of
/// asking the factor again: the kept number must be exactly the quadratic form of the design row with the result's
/// Qxx entries (the definition, docs/methods.md), and the redundancy numbers built on it exactly rᵢ = (1/pᵢ −
/// aᵢ Qxx aᵢᵀ) pᵢ. A simulated plane network (invented data exercising invariants only) with one set-aside
/// observation, on the sparse engine.
/// </summary>
public class RowCofactorReuseTests
{
    [Fact]
    public void KeptQuadraticFormsAreThoseOfTheDesignRowsAndGiveTheRedundancyNumbers()
    {
        var net = SetAsideNetworks.Plane(120, seed: 3, setAside: 5);
        var obs = net.Observations;
        var result = Adjuster.Adjust(net, AdjustmentOptions.Default with
        {
            Solver = new SparseNormalEquationsSolver(),
        });
        var kept = result.RowCofactors;
        Assert.NotNull(kept);
        Assert.Equal(obs.Count, kept.Length);
        var analysis = result.Analysis;
        for (int i = 0; i < obs.Count; i++)
        {
            if (obs[i].Excluded) { Assert.True(double.IsNaN(kept[i])); continue; }
            var a = result.DesignRows[i];
            double s = 0;
            for (int p = 0; p < a.Columns.Length; p++)
                for (int q = 0; q < a.Columns.Length; q++)
                    s += a.Values[p] * a.Values[q] * result.Cofactor(a.Columns[p], a.Columns[q]);
            Assert.Equal(s, kept[i]);
            var (block, at) = result.Weights.BlockOf(i);
            Assert.Equal(1, block.Size); // uncorrelated observations in this network
            double weight = block[at, at];
            Assert.Equal(Math.Clamp(((1 / weight) - s) * weight, 0, 1), analysis.Observations[i].Redundancy);
        }
    }
}
