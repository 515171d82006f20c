using NetAdjust.Adjustment;
using NetAdjust.Simulation;
using NetAdjust.LinearAlgebra.Sparse;

namespace NetAdjust.Tests.Adjustment;

/// <summary>The automatic solver choice and the progress reports (behaviour of the library itself; common
/// practice).</summary>
public class SolverChoiceTests
{
    [Fact]
    public void SmallNetworksRunDenseAndLargerOnesSparseAndTheResultSaysWhich()
    {
        var small = Adjuster.Adjust(GridNetworks.Horizontal(1, 3));
        Assert.True(small.Unknowns.Count <= SolverChoice.DenseUnknownLimit);
        Assert.StartsWith("dense", small.SolverName);

        var network = SyntheticNetworks.Create(new SyntheticNetworkSpec(SyntheticNetworkKind.Plane, 120,
            Seed: 2) { ControlEvery = 50 });
        var large = Adjuster.Adjust(network);
        Assert.True(large.Unknowns.Count > SolverChoice.DenseUnknownLimit);
        Assert.StartsWith("sparse supernodal Cholesky", large.SolverName);
        Assert.Contains("ordering", large.SolverName);
    }

    [Fact]
    public void ProgressReportsEachIterationAndTheFinalPhases()
    {
        var seen = new List<AdjustmentProgress>();
        var result = Adjuster.Adjust(GridNetworks.Horizontal(3, 3), AdjustmentOptions.Default with { Progress =
            new Recorder(seen) });
        var iterations = seen.Where(p => p.Phase.StartsWith("Gauss-Newton iteration",
            StringComparison.Ordinal)).ToList();
        Assert.Equal(result.Statistics.Iterations, iterations.Count);
        Assert.Contains(seen, p => p.Phase.StartsWith("final factorisation", StringComparison.Ordinal));
        Assert.All(seen.Where(p => p.Percent is not null), p => Assert.InRange(p.Percent!.Value, 0, 100));
    }

    [Fact]
    public void OneSolverInstanceAnalysesOncePerPattern()
    {
        var network = SyntheticNetworks.Create(new SyntheticNetworkSpec(SyntheticNetworkKind.Plane, 80,
            Seed: 4) { ControlEvery = 40 });
        var solver = new SparseNormalEquationsSolver();
        var first = Adjuster.Adjust(network, AdjustmentOptions.Default with { Solver = solver });
        // every Gauss-Newton iteration and the final factorisation share one symbolic analysis
        Assert.Equal(1, solver.AnalysisCount);
        Adjuster.Adjust(network, AdjustmentOptions.Default with { Solver = solver });
        Assert.Equal(1, solver.AnalysisCount);
        Assert.True(first.Statistics.Iterations >= 2);
    }

    private sealed class Recorder(List<AdjustmentProgress> seen) : IProgress<AdjustmentProgress>
    {
        public void Report(AdjustmentProgress value) => seen.Add(value);
    }
}
