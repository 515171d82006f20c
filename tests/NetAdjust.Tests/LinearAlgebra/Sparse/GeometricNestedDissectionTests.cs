using NetAdjust.LinearAlgebra;
using NetAdjust.LinearAlgebra.Sparse;

namespace NetAdjust.Tests.LinearAlgebra.Sparse;

/// <summary>The nested dissection with its first two halves on two threads against the same ordering on one.</summary>
public class GeometricNestedDissectionTests
{
    [Fact]
    public void HalvesOrderedConcurrentlyGiveTheSameOrderingAsOneAfterTheOther()
    {
        // a 150 x 150 grid of points (two unknowns each) joined to their right, upper and diagonal neighbours
        const int g = 150;
        var rows = new List<SparseRow>();
        for (int y = 0; y < g; y++)
            for (int x = 0; x < g; x++)
            {
                int p = (y * g) + x;
                if (x + 1 < g) rows.Add(new SparseRow([2 * p, (2 * p) + 1, 2 * (p + 1)], [1, 1, 1]));
                if (y + 1 < g) rows.Add(new SparseRow([2 * p, (2 * p) + 1, (2 * (p + g)) + 1], [1, 1, 1]));
                if (x + 1 < g && y + 1 < g) rows.Add(new SparseRow([2 * p, 2 * (p + g + 1)], [1, 1]));
            }
        var w = WeightMatrix.FromBlocks(rows.Count,
            Enumerable.Range(0, rows.Count).Select(i => new WeightBlock([i], [1.0])));
        var graph = AdjacencyGraph.FromNormalEquations(2 * g * g, rows, w);
        // positions jittered so that the median splits are not all ties
        var rng = new Random(10);
        var geometry = new UnknownGeometry(Enumerable.Range(0, 2 * g * g).Select(i => i / 2).ToArray(),
            Enumerable.Range(0, g * g).Select(p => (p % g) + (0.3 * rng.NextDouble())).ToArray(),
            Enumerable.Range(0, g * g).Select(p => (p / g) + (0.3 * rng.NextDouble())).ToArray());
        Assert.True(g * g >= GeometricNestedDissection.ConcurrentGroups);
        var one = GeometricNestedDissection.Order(graph, geometry, concurrent: false);
        var two = GeometricNestedDissection.Order(graph, geometry, concurrent: true);
        Assert.True(Permutation.IsPermutation(one));
        Assert.Equal(one, two);
    }
}
