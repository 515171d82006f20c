using NetAdjust.LinearAlgebra;

namespace NetAdjust.Tests.LinearAlgebra;

/// <summary>
/// The products of a diagonal weight matrix (taken through its array of weights) against their definitions
/// written out, y_i = p_i v_i and vᵀPv = Σ v_i (p_i v_i) summed in row order, to the bit; set-aside rows get weight
/// zero. Weights invented.
/// </summary>
public class WeightMatrixTests
{
    private static readonly double[] W = [4.0, 0.25, 1e6, 3.5, 0.0123];

    private static readonly double[] V = [0.5, -2.0, 1e-3, 7.0, -0.125];

    [Fact]
    public void TheProductsOfADiagonalMatrixAreTheirDefinitions()
    {
        foreach (var p in new[]
                 {
                     WeightMatrix.Diagonal(W),
                     WeightMatrix.FromBlocks(W.Length, W.Select((x, i) => new WeightBlock([i], [x]))),
                 })
        {
            Assert.True(p.IsDiagonal);
            var y = p.Multiply(V);
            double q = 0;
            for (int i = 0; i < W.Length; i++)
            {
                Assert.Equal(BitConverter.DoubleToInt64Bits(W[i] * V[i]), BitConverter.DoubleToInt64Bits(y[i]));
                q += V[i] * (W[i] * V[i]);
            }
            Assert.Equal(BitConverter.DoubleToInt64Bits(q), BitConverter.DoubleToInt64Bits(p.Quadratic(V)));
        }
    }

    [Fact]
    public void SettingRowsAsideZeroesTheirWeightsOnly()
    {
        var p = WeightMatrix.Diagonal(W).Excluding([1, 3, 1]);
        Assert.Equal([W[0], 0, W[2], 0, W[4]], Enumerable.Range(0, W.Length).Select(p.DiagonalEntry));
        Assert.Equal([W[0] * V[0], 0, W[2] * V[2], 0, W[4] * V[4]], p.Multiply(V));
    }

    [Fact]
    public void ADiagonalMatrixKeptAsOneArrayShowsTheBlocksOfItsBlockForm()
    {
        // the same matrix built from explicit one-row blocks is the reference
        var compact = WeightMatrix.Diagonal(W).Excluding([2]);
        var blocks = WeightMatrix.FromBlocks(W.Length, W.Select((x, i) => new WeightBlock([i], [x]))).Excluding([2]);
        Assert.Equal(blocks.Blocks.Count, compact.Blocks.Count);
        for (int i = 0; i < W.Length; i++)
        {
            Assert.Equal(blocks.Blocks[i].Rows, compact.Blocks[i].Rows);
            Assert.Equal(blocks.Blocks[i].Matrix, compact.Blocks[i].Matrix);
            var (b, k) = compact.BlockOf(i);
            Assert.Equal([i], b.Rows);
            Assert.Equal(0, k);
            Assert.Equal(blocks.DiagonalEntry(i), compact.DiagonalEntry(i));
        }
        Assert.Equal(blocks.Blocks.Select(b => b.Matrix[0]), compact.Blocks.Select(b => b.Matrix[0]));
        Assert.Equal(0, compact.DiagonalEntry(2));
        Assert.Equal(blocks.Multiply(V), compact.Multiply(V));
    }
}
