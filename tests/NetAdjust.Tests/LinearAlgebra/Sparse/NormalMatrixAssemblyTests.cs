using NetAdjust.LinearAlgebra;
using NetAdjust.LinearAlgebra.Sparse;

namespace NetAdjust.Tests.LinearAlgebra.Sparse;

/// <summary>
/// The assembly of the normal matrix C = AᵀPA on the analysed pattern (<see cref="NormalMatrixAssembly"/>): on a large
/// system its columns are summed on two cores. Checked against AᵀPA summed from its definition row by row (the
/// assembly sums column by column), and the two-core assembly against the one-thread assembly bit for bit (each column
/// is summed in the same order whoever sums it), with a diagonal P and with full weight blocks.
/// </summary>
public class NormalMatrixAssemblyTests
{
    [Theory]
    [InlineData(21, false)]
    [InlineData(22, true)]
    public void TheTwoCoreAssemblyIsTheOneThreadAssemblyAndAgreesWithMathNet(int seed, bool blocks)
    {
        // 1,500 unknowns and 6,000 rows: above the size from which the columns are split
        var (u, rows, w) = SparseEngineTests.RandomProblem(seed, 1500, blocks);
        Assert.True(rows.Length >= NormalMatrixAssembly.SideBySideRows);
        var graph = AdjacencyGraph.FromNormalEquations(u, rows, w);
        var sym = SymbolicCholesky.Analyze(graph, ApproximateMinimumDegree.Order(graph));
        var assembly = new NormalMatrixAssembly(sym, rows);

        var one = assembly.Assemble(rows, w, sideBySide: false);
        var two = assembly.Assemble(rows, w, sideBySide: true);
        Assert.Equal(one, two);

        // N = AᵀPA, the normal matrix of the Gauss-Markov model (Mikhail and Ackermann 1976, Observations and Least
        // Squares; docs/references.md), summed entry by entry block by block: row-oriented, unlike the assembly
        var c = new double[u, u];
        foreach (var block in w.Blocks)
            for (int i = 0; i < block.Size; i++)
                for (int j = 0; j < block.Size; j++)
                {
                    var ri = rows[block.Rows[i]];
                    var rj = rows[block.Rows[j]];
                    for (int x = 0; x < ri.Columns.Length; x++)
                        for (int y = 0; y < rj.Columns.Length; y++)
                            c[ri.Columns[x], rj.Columns[y]] += ri.Values[x] * block[i, j] * rj.Values[y];
                }
        var lower = sym.LowerC;
        int checkedEntries = 0;
        for (int k = 0; k < u; k++)
            for (int e = lower.Start[k]; e < lower.Start[k + 1]; e++)
            {
                double expected = c[sym.Perm[lower.Index[e]], sym.Perm[k]];
                Assert.True(Math.Abs(two[e] - expected) <= 1e-12 * Math.Max(1, Math.Abs(expected)),
                    $"C[{lower.Index[e]},{k}] (permuted): {two[e]} against {expected}");
                checkedEntries++;
            }
        Assert.Equal(lower.Index.Length, checkedEntries);
    }
}
