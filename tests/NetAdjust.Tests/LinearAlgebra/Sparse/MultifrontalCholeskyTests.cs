using NetAdjust.LinearAlgebra;
using NetAdjust.LinearAlgebra.Sparse;

namespace NetAdjust.Tests.LinearAlgebra.Sparse;

/// <summary>
/// The numeric factorisation and the selected inverse reuse storage (update matrices from a pool, factor and inverse
/// arrays not zeroed up front): the same matrix must give the same bits whatever ran before. The values themselves
/// are checked against MathNet in <see cref="NetAdjust.Tests.LinearAlgebra.SparseEngineTests"/>.
/// </summary>
public class MultifrontalCholeskyTests
{
    private static (SparseCholeskyFactor Factor, double[] L) Factorise(int u, SparseRow[] rows, WeightMatrix w)
    {
        var graph = AdjacencyGraph.FromNormalEquations(u, rows, w);
        var sym = SymbolicCholesky.Analyze(graph, ApproximateMinimumDegree.Order(graph));
        var values = new NormalMatrixAssembly(sym, rows).Assemble(rows, w);
        var (l, scale) = MultifrontalCholesky.Factorize(sym, values);
        return (new SparseCholeskyFactor(sym, l, scale), l);
    }

    [Fact]
    public void RepeatedFactorisationIsBitIdenticalWhateverRanBefore()
    {
        var (u, rows, w) = SparseEngineTests.RandomProblem(11, 300, blocks: true);
        var (first, l1) = Factorise(u, rows, w);
        first.ComputeSelectedInverse();
        // dirty the pooled and freshly allocated storage with another, larger problem
        var (u2, rows2, w2) = SparseEngineTests.RandomProblem(12, 500, blocks: true);
        Factorise(u2, rows2, w2).Factor.ComputeSelectedInverse();
        var (second, l2) = Factorise(u, rows, w);
        Assert.Equal(l1, l2);
        for (int i = 0; i < u; i++)
            for (int j = Math.Max(0, i - 8); j <= i; j++)
                if (first.IsOnPattern(i, j)) Assert.Equal(first.InverseEntry(i, j), second.InverseEntry(i, j));
    }

    [Fact]
    public void ARecycledFactorsStorageServesTheNextFactorisationWithTheSameBits()
    {
        var (u, rows, w) = SparseEngineTests.RandomProblem(13, 300, blocks: true);
        var graph = AdjacencyGraph.FromNormalEquations(u, rows, w);
        var sym = SymbolicCholesky.Analyze(graph, ApproximateMinimumDegree.Order(graph));
        var assembly = new NormalMatrixAssembly(sym, rows);
        var fresh = SparseCholeskyFactor.Factorize(sym, assembly, rows, w);
        var expected = fresh.Solve(Enumerable.Range(0, u).Select(i => 1.0 + (i % 7)).ToArray());
        double qxx = fresh.InverseEntry(3, 3);

        // a factor of another matrix on the same pattern (other weights), recycled: its storage is reused ...
        var w2 = WeightMatrix.FromBlocks(w.RowCount,
            w.Blocks.Select(b => new WeightBlock(b.Rows, b.Matrix.Select(x => 2.5 * x).ToArray())));
        var other = SparseCholeskyFactor.Factorize(sym, assembly, rows, w2);
        other.Recycle();
        Assert.Throws<InvalidOperationException>(() => other.Solve(new double[u])); // ... and it is unusable
        var spare = sym.TakeSpare();
        Assert.NotNull(spare);
        sym.OfferSpare(spare!); // put back for the next factorisation, which must take it
        var reused = SparseCholeskyFactor.Factorize(sym, assembly, rows, w);
        Assert.Equal(expected, reused.Solve(Enumerable.Range(0, u).Select(i => 1.0 + (i % 7)).ToArray()));
        Assert.Equal(qxx, reused.InverseEntry(3, 3));
        Assert.Null(sym.TakeSpare()); // handed out once
    }
}
