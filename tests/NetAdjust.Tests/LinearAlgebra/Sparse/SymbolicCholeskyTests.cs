using NetAdjust.LinearAlgebra.Sparse;

namespace NetAdjust.Tests.LinearAlgebra.Sparse;

/// <summary>The symbolic analysis' shortcuts against the step they replace.</summary>
public class SymbolicCholeskyTests
{
    [Fact]
    public void TheAnalysisTreeIsTheEliminationTreeOfThePostorderedMatrix()
    {
        // the analysis relabels the tree of the given order in its postorder instead of computing it again; here it
        // is computed again from the postordered pattern (Liu 1990's algorithm, EliminationTree) and compared
        foreach (var (g, seed) in new[] { (40, 5), (23, 6) })
        {
            var (sym, _, u, rows, w) = SubtreeParallelFactorisationTests.GridProblem(g, seed);
            var graph = AdjacencyGraph.FromNormalEquations(u, rows, w);
            var upper = ColumnPattern.FromGraph(graph, sym.Perm, sym.InversePerm, lower: false);
            Assert.Equal(EliminationTree.Compute(upper), sym.ParentArray);
        }
        var (n, rows2, w2) = SparseEngineTests.RandomProblem(8, 400, blocks: true);
        var graph2 = AdjacencyGraph.FromNormalEquations(n, rows2, w2);
        var sym2 = SymbolicCholesky.Analyze(graph2, ApproximateMinimumDegree.Order(graph2));
        Assert.Equal(EliminationTree.Compute(ColumnPattern.FromGraph(graph2, sym2.Perm, sym2.InversePerm, false)),
            sym2.ParentArray);
    }
}
