using NetAdjust.LinearAlgebra;
using NetAdjust.LinearAlgebra.Sparse;

namespace NetAdjust.Tests.LinearAlgebra.Sparse;

/// <summary>The graph of N against its definition.</summary>
public class AdjacencyGraphTests
{
    [Fact]
    public void ALargeGraphHasTheNeighboursOfANaiveConstruction()
    {
        // large enough (over 200,000 adjacency entries) for the lists to be cleaned on all cores; the oracle is the
        // definition: i and j adjacent when they share a design row or two rows of one weight block
        var (u, rows, w) = SparseEngineTests.RandomProblem(9, 20_000, blocks: true);
        var graph = AdjacencyGraph.FromNormalEquations(u, rows, w);
        var naive = Enumerable.Range(0, u).Select(_ => new SortedSet<int>()).ToArray();
        foreach (var block in w.Blocks)
        {
            var vertices = block.Rows.SelectMany(r => rows[r].Columns.ToArray()).Distinct().ToArray();
            foreach (int a in vertices) foreach (int b in vertices) if (a != b) naive[a].Add(b);
        }
        Assert.True(graph.Adjacent.Length > 200_000, $"{graph.Adjacent.Length} entries");
        for (int v = 0; v < u; v++) Assert.Equal(naive[v].ToArray(), graph.Neighbours(v).ToArray());
    }

    [Fact]
    public void ADiagonalWeightMatrixKeptAsOneArrayGivesTheGraphOfItsOneRowBlocks()
    {
        // the one-array path makes the cliques from the rows directly: the same lists as the same weights given as
        // one-row blocks, and the definition's neighbours (rows sharing an unknown; George & Liu 1981, ch. 3)
        var (u, rows, blocked) = SparseEngineTests.RandomProblem(11, 20_000, blocks: false);
        var weights = Enumerable.Range(0, rows.Length).Select(i => blocked.DiagonalEntry(i)).ToArray();
        var diagonal = WeightMatrix.Diagonal(weights);
        Assert.True(diagonal.BlockIsRow);
        Assert.False(blocked.BlockIsRow);
        var graph = AdjacencyGraph.FromNormalEquations(u, rows, diagonal);
        var reference = AdjacencyGraph.FromNormalEquations(u, rows, blocked);
        Assert.True(graph.Adjacent.Length > 200_000, $"{graph.Adjacent.Length} entries");
        Assert.Equal(reference.Start, graph.Start);
        Assert.Equal(reference.Adjacent, graph.Adjacent);
        var naive = Enumerable.Range(0, u).Select(_ => new SortedSet<int>()).ToArray();
        foreach (var row in rows)
            foreach (int a in row.Columns) foreach (int b in row.Columns) if (a != b) naive[a].Add(b);
        for (int v = 0; v < u; v++) Assert.Equal(naive[v].ToArray(), graph.Neighbours(v).ToArray());
    }
}
