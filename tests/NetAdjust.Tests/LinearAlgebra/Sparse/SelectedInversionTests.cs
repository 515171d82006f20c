using NetAdjust.LinearAlgebra;
using NetAdjust.LinearAlgebra.Sparse;

namespace NetAdjust.Tests.LinearAlgebra.Sparse;

/// <summary>
/// The selected inverse computed in place (Z overwriting L) and with the subtrees of the supernodal tree on two
/// threads gives the same bits as the one-thread computation into a separate array, and the entries of the inverse
/// (MathNet's dense inverse as the independent oracle).
/// </summary>
public class SelectedInversionTests
{
    /// <summary>A grid of side × side unknowns, each observed, joined to its right and lower neighbours by difference
    /// rows (a levelling-like network): its elimination tree branches, so the tree-level split applies.</summary>
    private static (int U, SparseRow[] Rows, WeightMatrix W) Grid(int side, int seed)
    {
        var rng = new Random(seed);
        var rows = new List<SparseRow>();
        int u = side * side;
        for (int j = 0; j < u; j++) rows.Add(new SparseRow([j], [0.2 + rng.NextDouble()]));
        for (int r = 0; r < side; r++)
            for (int c = 0; c < side; c++)
            {
                int j = (r * side) + c;
                if (c + 1 < side) rows.Add(new SparseRow([j, j + 1], [1 + rng.NextDouble(), -1 - rng.NextDouble()]));
                if (r + 1 < side)
                    rows.Add(new SparseRow([j, j + side], [1 + rng.NextDouble(), -1 - rng.NextDouble()]));
            }
        var p = Enumerable.Range(0, rows.Count).Select(_ => 0.5 + rng.NextDouble()).ToArray();
        return (u, rows.ToArray(), WeightMatrix.Diagonal(p));
    }

    private static (SymbolicCholesky Sym, double[] L) Factor(int u, SparseRow[] rows, WeightMatrix w)
    {
        var graph = AdjacencyGraph.FromNormalEquations(u, rows, w);
        var sym = SymbolicCholesky.Analyze(graph, ApproximateMinimumDegree.Order(graph));
        var values = new NormalMatrixAssembly(sym, rows).Assemble(rows, w);
        return (sym, MultifrontalCholesky.Factorize(sym, values).L);
    }

    [Fact]
    public void InPlaceAndTwoThreadSelectedInversesEqualTheOneThreadOneBitForBit()
    {
        var (u, rows, w) = Grid(24, 5);
        var (sym, l) = Factor(u, rows, w);
        Assert.True(sym.ScheduleFor(2).Worthwhile(0)); // the two-thread path is taken below
        var reference = SelectedInversion.Compute(sym, l, inPlace: false, threads: 1);
        var twoThreads = SelectedInversion.Compute(sym, l, inPlace: false, threads: 2, parallelWork: 0);
        Assert.Equal(reference, twoThreads);
        var copy = (double[])l.Clone();
        var inPlace = SelectedInversion.Compute(sym, copy, inPlace: true, threads: 1);
        Assert.Same(copy, inPlace);
        Assert.Equal(reference, inPlace);
        var copy2 = (double[])l.Clone();
        Assert.Equal(reference, SelectedInversion.Compute(sym, copy2, inPlace: true, threads: 2, parallelWork: 0));
    }

    [Fact]
    public void TwoThreadInPlaceSelectedInverseEqualsTheDenseInverse()
    {
        var (u, rows, w) = Grid(18, 9);
        var graph = AdjacencyGraph.FromNormalEquations(u, rows, w);
        var sym = SymbolicCholesky.Analyze(graph, ApproximateMinimumDegree.Order(graph));
        Assert.True(sym.ScheduleFor(2).Worthwhile(0)); // the two-thread path is taken below
        var factor = SparseCholeskyFactor.Factorize(sym, new NormalMatrixAssembly(sym, rows), rows, w);
        factor.InPlaceCovariance = true;
        factor.InversionThreads = 2;
        factor.InversionParallelWork = 0;
        // MathNet's dense inverse of N = AᵀPA as the independent oracle
        var inv = SparseEngineTests.DenseNormal(u, rows, w).Inverse();
        int checkedEntries = 0;
        for (int i = 0; i < u; i++)
            for (int j = 0; j <= i; j++)
                if (factor.IsOnPattern(i, j))
                {
                    Assert.Equal(inv[i, j], factor.InverseEntry(i, j), 1e-9 * Math.Max(1, Math.Abs(inv[i, i])));
                    checkedEntries++;
                }
        Assert.True(checkedEntries > 3 * u);
    }

    [Fact]
    public void ASolveAfterTheInPlaceInverseFactorisesAgainWithTheSameBits()
    {
        var (u, rows, w) = Grid(16, 3);
        var graph = AdjacencyGraph.FromNormalEquations(u, rows, w);
        var sym = SymbolicCholesky.Analyze(graph, ApproximateMinimumDegree.Order(graph));
        var assembly = new NormalMatrixAssembly(sym, rows);
        var kept = SparseCholeskyFactor.Factorize(sym, assembly, rows, w);
        kept.InPlaceCovariance = false;
        var overwritten = SparseCholeskyFactor.Factorize(sym, assembly, rows, w);
        overwritten.InPlaceCovariance = true;
        var b = Enumerable.Range(0, u).Select(i => 1.0 + (i % 5)).ToArray();
        Assert.Equal(kept.InverseEntry(7, 7), overwritten.InverseEntry(7, 7));
        Assert.Equal(0, overwritten.Refactorizations);
        Assert.Equal(kept.Solve(b), overwritten.Solve(b));
        Assert.Equal(1, overwritten.Refactorizations);
        // entries off the pattern come from solves: the same numbers either way
        for (int i = 0; i < u; i += 7)
            for (int j = 0; j < u; j += 11) Assert.Equal(kept.InverseEntry(i, j), overwritten.InverseEntry(i, j));
        Assert.Equal(1, overwritten.Refactorizations);
    }
}
