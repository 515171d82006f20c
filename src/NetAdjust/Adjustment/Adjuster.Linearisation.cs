using NetAdjust.LinearAlgebra;
using NetAdjust.LinearAlgebra.Sparse;
using NetAdjust.Network;

namespace NetAdjust.Adjustment;

public static partial class Adjuster
{
    /// <summary>The first linearisation of a network (A, P with σ0² = 1, unknowns' geometry), for benchmarks of the
    /// linear algebra alone.</summary>
    internal static (int Unknowns, SparseRow[] Rows, WeightMatrix Weights,
        UnknownGeometry Geometry) LineariseForBenchmark(SurveyNetwork network)
    {
        var (index, state) = Setup(network);
        var control = ControlRows(network, index);
        var (rows, _) = Linearise(network, index, state, control);
        var diagonal = new double[rows.Length];
        for (int i = 0; i < network.Observations.Count; i++)
            diagonal[i] = 1 / Sq(network.Observations[i].StandardDeviation);
        for (int k = 0; k < control.Count; k++) diagonal[network.Observations.Count + k] = 1 / Sq(control[k].Sd);
        return (index.Count, rows, WeightMatrix.Diagonal(diagonal), SolverChoice.GeometryOf(network, index));
    }
}
