using MathNet.Numerics.LinearAlgebra;
using NetAdjust.LinearAlgebra;
using NetAdjust.LinearAlgebra.Sparse;

namespace NetAdjust.Tests.LinearAlgebra.Sparse;

/// <summary>
/// The wide supernodes at the top of the tree (the separators of a large network) share their own loops among the
/// cores: the pivot block of the factorisation by panels of rows, and in the selected inverse the rows of L_JJ⁻¹, of
/// Z_JJ, of Yᵀ and of the update of Z_JJ. The factor and the inverse are checked bit for bit against the same
/// computation with every supernode on one thread (the hard constraint of deterministic reports), and against
/// MathNet's dense Cholesky solve and dense inverse (an independent reference library) to rounding.
/// </summary>
public class WideFrontTests
{
    private static SymbolicCholesky Analyse(int u, SparseRow[] rows, WeightMatrix w)
    {
        var graph = AdjacencyGraph.FromNormalEquations(u, rows, w);
        return SymbolicCholesky.Analyze(graph, ApproximateMinimumDegree.Order(graph));
    }

    private static int Width(SymbolicCholesky sym, int s) => sym.SnStart[s + 1] - sym.SnStart[s];

    private static int Below(SymbolicCholesky sym, int s) =>
        sym.SnRowStart[s + 1] - sym.SnRowStart[s] - Width(sym, s);

    /// <summary>Fails on the first entry whose bits differ, naming it.</summary>
    internal static void AssertSameBits(double[] expected, double[] actual, string what)
    {
        Assert.Equal(expected.Length, actual.Length);
        for (int i = 0; i < expected.Length; i++)
            if (BitConverter.DoubleToInt64Bits(expected[i]) != BitConverter.DoubleToInt64Bits(actual[i]))
                Assert.Fail($"{what}: entry {i} differs: {expected[i]:R} vs {actual[i]:R}");
    }

    [Fact]
    public void WideFrontsOnAllCoresGiveTheBitsOfOneThread()
    {
        // a 140 × 140 grid with two unknowns a point, ordered by nested dissection: its top separators are wide
        var (sym, values, _, _, _) = SubtreeParallelFactorisationTests.GridProblem(140, 6);
        int widest = Enumerable.Range(0, sym.SupernodeCount).Max(s => Width(sym, s));
        Assert.True(widest >= MultifrontalCholesky.ParallelPivotColumns, $"widest supernode {widest}");
        // a wide supernode with rows below it: the selected inverse's Yᵀ and Z_JJ update go in parallel too
        Assert.Contains(Enumerable.Range(0, sym.SupernodeCount), s => Width(sym, s) >= SelectedInversion.WideColumns
            && (double)Width(sym, s) * Width(sym, s) * Below(sym, s) >= SelectedInversion.ParallelBlockWork);

        var (lOne, sOne) = MultifrontalCholesky.Factorize(sym, values, workers: 1, minimumWork: 0,
            rowsInParallel: false);
        var (lAll, sAll) = MultifrontalCholesky.Factorize(sym, values, workers: 2, minimumWork: 0,
            rowsInParallel: true);
        Assert.Equal(sOne, sAll);
        AssertSameBits(lOne, lAll, "factor");

        var zOne = SelectedInversion.Compute(sym, lOne, inPlace: false, threads: 1, innerLoops: false);
        var zAll = SelectedInversion.Compute(sym, lOne, inPlace: false, threads: 2, parallelWork: 0,
            innerLoops: true);
        AssertSameBits(zOne, zAll, "selected inverse");
        var zInPlace = SelectedInversion.Compute(sym, (double[])lOne.Clone(), inPlace: true, threads: 1,
            innerLoops: true);
        AssertSameBits(zOne, zInPlace, "selected inverse in place");
    }

    [Theory]
    [InlineData(300, 1)] // one supernode of 300 columns: six panels of the pivot block
    [InlineData(203, 2)] // a last panel and a last group of rows of L_JJ⁻¹ shorter than the others
    public void AWideDenseBlockFactorsAndInvertsAsMathNet(int u, int seed)
    {
        var (rows, w) = Dense(u, seed);
        var sym = Analyse(u, rows, w);
        Assert.Equal(1, sym.SupernodeCount);
        var values = new NormalMatrixAssembly(sym, rows).Assemble(rows, w);
        var (l, scale) = MultifrontalCholesky.Factorize(sym, values, workers: 2, minimumWork: 0,
            rowsInParallel: true);
        var (lOne, _) = MultifrontalCholesky.Factorize(sym, values, workers: 1, minimumWork: 0,
            rowsInParallel: false);
        AssertSameBits(lOne, l, "factor");

        var factor = new SparseCholeskyFactor(sym, l, scale) { InPlaceCovariance = false, InversionThreads = 2 };
        var n = SparseEngineTests.DenseNormal(u, rows, w);
        // independent oracles: MathNet's dense Cholesky solve and dense inverse of N = AᵀPA
        var b = Enumerable.Range(0, u).Select(i => Math.Cos(i + 0.5)).ToArray();
        var x = factor.Solve(b);
        var xRef = n.Cholesky().Solve(Vector<double>.Build.DenseOfArray(b));
        for (int i = 0; i < u; i++) Assert.Equal(xRef[i], x[i], 1e-9 * xRef.InfinityNorm());
        var inv = n.Inverse();
        for (int i = 0; i < u; i++)
            for (int j = 0; j <= i; j++)
                Assert.Equal(inv[i, j], factor.InverseEntry(i, j), 1e-9 * Math.Max(1, Math.Abs(inv[i, i])));
    }

    [Fact]
    public void FourRowsOfTheInverseAtOnceGiveTheBitsOfOneRowAtATime()
    {
        // a lower-triangular block with a positive diagonal, as a Cholesky factor has
        const int k = 37;
        var rng = new Random(8);
        var l = new double[k * k];
        for (int i = 0; i < k; i++)
            for (int j = 0; j <= i; j++) l[(i * k) + j] = i == j ? 1 + rng.NextDouble() : rng.NextDouble() - 0.5;
        var one = new double[k * k];
        for (int c = 0; c < k; c++) SelectedInversion.InverseRows(l, 0, k, one, c, c + 1);
        var four = new double[k * k];
        for (int c = 0; c < k; c += 4) SelectedInversion.InverseRows(l, 0, k, four, c, Math.Min(c + 4, k));
        AssertSameBits(one, four, "rows of the inverse");
        // and they are the inverse: row c of T is column c of L⁻¹ (MathNet's triangular inverse as the reference)
        var inv = Matrix<double>.Build.Dense(k, k, (i, j) => l[(i * k) + j]).Inverse();
        for (int c = 0; c < k; c++)
            for (int d = 0; d < k; d++) Assert.Equal(inv[d, c], four[(c * k) + d], 1e-12 * inv.InfinityNorm());
    }

    /// <summary>Rows making N dense of order u (each unknown observed alone, then u / 2 rows on every unknown), with
    /// their weights: one supernode of u columns.</summary>
    private static (SparseRow[] Rows, WeightMatrix W) Dense(int u, int seed)
    {
        var random = new Random(seed);
        var all = Enumerable.Range(0, u).ToArray();
        var rows = Enumerable.Range(0, u).Select(j => new SparseRow([j], [1 + random.NextDouble()]))
            .Concat(Enumerable.Range(0, u / 2).Select(_ =>
                new SparseRow(all, all.Select(_ => random.NextDouble() - 0.5).ToArray())))
            .ToArray();
        return (rows, WeightMatrix.Diagonal(rows.Select(_ => 0.5 + random.NextDouble()).ToArray()));
    }
}
