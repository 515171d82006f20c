using NetAdjust.Adjustment;
using NetAdjust.LinearAlgebra;
using NetAdjust.LinearAlgebra.Sparse;
using NetAdjust.Network;

namespace NetAdjust.Benchmarks;

/// <summary>The linearised least-squares problem of a network at its approximate coordinates (for benchmarks of the
/// linear algebra alone).</summary>
/// <param name="Unknowns">The number of unknowns.</param>
/// <param name="Rows">The rows of A.</param>
/// <param name="Weights">P.</param>
/// <param name="Geometry">Positions and grouping of the unknowns.</param>
internal sealed record SyntheticProblem(int Unknowns, SparseRow[] Rows, WeightMatrix Weights, UnknownGeometry Geometry)
{
    /// <summary>Linearises a network at its approximate coordinates exactly as the adjuster's first iteration
    /// does.</summary>
    /// <param name="network">The network.</param>
    public static SyntheticProblem Linearise(SurveyNetwork network)
    {
        var (u, rows, weights, geometry) = Adjuster.LineariseForBenchmark(network);
        return new SyntheticProblem(u, rows, weights, geometry);
    }
}
