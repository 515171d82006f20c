using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using MathNet.Numerics.LinearAlgebra;
using NetAdjust.Adjustment;
using NetAdjust.Simulation;
using NetAdjust.LinearAlgebra;
using NetAdjust.LinearAlgebra.Sparse;

namespace NetAdjust.Tests.LinearAlgebra;

/// <summary>
/// The sparse engine against independent oracles: MathNet.Numerics dense Cholesky, solve and inverse
/// (a general-purpose reference library), and the project's dense path. Problems are small random
/// least-squares systems and random networks (invented data exercising invariants only).
/// </summary>
public class SparseEngineTests
{
    /// <summary>A random sparse least-squares problem: rows touching 1–5 unknowns near each other, some correlated weight blocks.</summary>
    internal static (int U, SparseRow[] Rows, WeightMatrix W) RandomProblem(int seed, int u, bool blocks)
    {
        var rng = new Random(seed);
        var rows = new List<SparseRow>();
        for (int j = 0; j < u; j++) rows.Add(new SparseRow([j], [0.5 + rng.NextDouble()])); // every unknown observed
        int m = 3 * u;
        for (int r = 0; r < m; r++)
        {
            int len = Math.Min(u, 1 + rng.Next(5));
            int centre = rng.Next(u);
            var cols = new HashSet<int>();
            while (cols.Count < len) cols.Add(Math.Clamp(centre + rng.Next(-6, 7), 0, u - 1));
            var colArray = cols.ToArray();
            rows.Add(new SparseRow(colArray, colArray.Select(_ => rng.NextDouble() * 2 - 1).ToArray()));
        }
        var list = new List<WeightBlock>();
        int at = 0;
        while (at < rows.Count)
        {
            int size = blocks && rng.NextDouble() < 0.2 ? Math.Min(3, rows.Count - at) : 1;
            var idx = Enumerable.Range(at, size).ToArray();
            // P = B Bᵀ + I: symmetric positive definite
            var b = new double[size * size];
            for (int t = 0; t < b.Length; t++) b[t] = rng.NextDouble() - 0.5;
            var p = new double[size * size];
            for (int i = 0; i < size; i++)
                for (int k = 0; k < size; k++)
                {
                    double s = i == k ? 1 : 0;
                    for (int t = 0; t < size; t++) s += b[(i * size) + t] * b[(k * size) + t];
                    p[(i * size) + k] = s * (0.5 + rng.NextDouble());
                }
            for (int i = 0; i < size; i++) for (int k = 0; k < i; k++) p[(i * size) + k] = p[(k * size) + i];
            list.Add(new WeightBlock(idx, p));
            at += size;
        }
        return (u, rows.ToArray(), WeightMatrix.FromBlocks(rows.Count, list));
    }

    /// <summary>N = AᵀPA formed densely by MathNet (independent of both solvers).</summary>
    internal static Matrix<double> DenseNormal(int u, SparseRow[] rows, WeightMatrix w)
    {
        var a = Matrix<double>.Build.Dense(rows.Length, u);
        for (int i = 0; i < rows.Length; i++)
            for (int k = 0; k < rows[i].Columns.Length; k++) a[i, rows[i].Columns[k]] += rows[i].Values[k];
        var p = Matrix<double>.Build.Dense(rows.Length, rows.Length);
        foreach (var blk in w.Blocks)
            for (int s = 0; s < blk.Size; s++) for (int t = 0; t < blk.Size; t++) p[blk.Rows[s], blk.Rows[t]] = blk[s, t];
        return a.TransposeThisAndMultiply(p * a);
    }

    private static Arbitrary<int> Seeds => ArbMap.Default.ArbFor<int>().Filter(s => s >= 0);

    [Property(MaxTest = 25)]
    public Property SolveAndSelectedInverseEqualMathNetDenseOracle() =>
        Prop.ForAll(Seeds, Gen.Choose(2, 60).ToArbitrary(), Gen.Elements(SparseOrdering.MinimumDegree, SparseOrdering.Automatic).ToArbitrary(), (seed, u, ordering) =>
        {
            var (n, rows, w) = RandomProblem(seed, u, blocks: seed % 2 == 0);
            var nDense = DenseNormal(n, rows, w);
            var inv = nDense.Inverse();
            var rng = new Random(seed + 1);
            var b = Vector<double>.Build.Dense(n, _ => rng.NextDouble() - 0.5);
            var xRef = nDense.Cholesky().Solve(b);

            var factor = (SparseCholeskyFactor)new SparseNormalEquationsSolver(ordering).Factorize(n, rows, w);
            var x = factor.Solve(b.ToArray());
            double scale = xRef.AbsoluteMaximum();
            for (int i = 0; i < n; i++) Assert.True(Math.Abs(x[i] - xRef[i]) <= 1e-9 * scale, $"x[{i}] {x[i]} vs {xRef[i]}");

            // Every entry on the pattern of L equals the dense inverse (MathNet Inverse as the oracle).
            int onPattern = 0;
            double invScale = inv.Diagonal().AbsoluteMaximum();
            for (int i = 0; i < n; i++)
                for (int j = 0; j < n; j++)
                    if (factor.IsOnPattern(i, j))
                    {
                        onPattern++;
                        Assert.True(Math.Abs(factor.InverseEntry(i, j) - inv[i, j]) <= 1e-9 * invScale, $"Z[{i},{j}] {factor.InverseEntry(i, j)} vs {inv[i, j]}");
                    }
            Assert.True(onPattern >= n);
            // An entry off the pattern falls back to a solve and still equals the oracle.
            for (int i = 0; i < n; i++)
                if (!factor.IsOnPattern(i, 0))
                    Assert.True(Math.Abs(factor.InverseEntry(i, 0) - inv[i, 0]) <= 1e-9 * invScale);
        });

    [Property(MaxTest = 30)]
    public Property OrderingsArePermutations() =>
        Prop.ForAll(Seeds, Gen.Choose(1, 80).ToArbitrary(), (seed, u) =>
        {
            var (n, rows, w) = RandomProblem(seed, u, blocks: false);
            var graph = AdjacencyGraph.FromNormalEquations(n, rows, w);
            Assert.True(Permutation.IsPermutation(ApproximateMinimumDegree.Order(graph)));
            var rng = new Random(seed);
            int groups = (n + 1) / 2;
            var geometry = new UnknownGeometry(Enumerable.Range(0, n).Select(j => j / 2).ToArray(),
                Enumerable.Range(0, groups).Select(_ => rng.NextDouble() * 1000).ToArray(),
                Enumerable.Range(0, groups).Select(_ => rng.NextDouble() * 1000).ToArray());
            var nd = GeometricNestedDissection.Order(graph, geometry);
            Assert.True(Permutation.IsPermutation(nd));
            // the unknowns of one group stay adjacent
            var pos = Permutation.Invert(nd);
            for (int j = 0; j + 1 < n; j += 2) Assert.Equal(1, Math.Abs(pos[j] - pos[j + 1]));
        });

    [Property(MaxTest = 25)]
    public Property SymbolicPatternContainsNumericFactor() =>
        Prop.ForAll(Seeds, Gen.Choose(2, 50).ToArbitrary(), (seed, u) =>
        {
            var (n, rows, w) = RandomProblem(seed, u, blocks: true);
            var graph = AdjacencyGraph.FromNormalEquations(n, rows, w);
            var sym = SymbolicCholesky.Analyze(graph, ApproximateMinimumDegree.Order(graph));
            var p = sym.Permutation;
            var nDense = DenseNormal(n, rows, w);
            var c = Matrix<double>.Build.Dense(n, n, (i, j) => nDense[p[i], p[j]]);
            var l = c.Cholesky().Factor; // MathNet dense factor of P N Pᵀ
            long nonzeros = 0;
            for (int j = 0; j < n; j++)
            {
                int count = 0;
                for (int i = j; i < n; i++)
                    if (Math.Abs(l[i, j]) > 1e-13 * Math.Sqrt(c[i, i] * c[j, j]))
                    {
                        count++;
                        Assert.True(sym.TryLocate(i, j, out _), $"L({i},{j}) = {l[i, j]} is outside the symbolic pattern");
                    }
                Assert.True(count <= sym.ColumnCounts[j]);
                nonzeros += count;
            }
            Assert.True(nonzeros <= sym.FactorNonZeros);
            Assert.True(sym.StoredEntries >= sym.FactorNonZeros);
        });

    [Fact]
    public void RefactorisationWithNewWeightsEqualsAFreshFactorisation()
    {
        var (n, rows, w1) = RandomProblem(7, 120, blocks: true);
        var rng = new Random(8);
        var w2 = WeightMatrix.FromBlocks(rows.Length, w1.Blocks.Select(b => b with { Matrix = b.Matrix.Select(v => v * (1 + rng.NextDouble())).ToArray() })
            .Select(b => Symmetrised(b)));
        var reused = new SparseNormalEquationsSolver();
        reused.Factorize(n, rows, w1);
        var again = reused.Factorize(n, rows, w2);
        Assert.Equal(1, reused.AnalysisCount);
        var fresh = new SparseNormalEquationsSolver().Factorize(n, rows, w2);
        var b0 = Enumerable.Range(0, n).Select(i => Math.Sin(i)).ToArray();
        var x1 = again.Solve(b0);
        var x2 = fresh.Solve(b0);
        for (int i = 0; i < n; i++)
        {
            Assert.Equal(x2[i], x1[i], 14);
            Assert.Equal(fresh.InverseEntry(i, i), again.InverseEntry(i, i), 14);
        }
        // and the oracle confirms the new weights were used
        var xRef = DenseNormal(n, rows, w2).Cholesky().Solve(Vector<double>.Build.DenseOfArray(b0));
        for (int i = 0; i < n; i++) Assert.True(Math.Abs(x1[i] - xRef[i]) <= 1e-9 * xRef.AbsoluteMaximum());
    }

    private static WeightBlock Symmetrised(WeightBlock b)
    {
        int k = b.Size;
        var m = (double[])b.Matrix.Clone();
        for (int i = 0; i < k; i++) for (int j = 0; j < i; j++) m[(i * k) + j] = m[(j * k) + i];
        // keep positive definite: add the diagonal dominance back
        for (int i = 0; i < k; i++) m[(i * k) + i] += k;
        return b with { Matrix = m };
    }

    [Fact]
    public void NetworkWithoutPositionsIsOrderedByApproximateMinimumDegree()
    {
        // Without positions (no geometry, or a point whose position is unknown) geometric nested dissection cannot
        // run: the solver uses AMD (Amestoy, Davis & Duff 1996), and its analysis has AMD's fill.
        var (n, rows, w) = RandomProblem(seed: 3, u: 120, blocks: true);
        var graph = AdjacencyGraph.FromNormalEquations(n, rows, w);
        long amdFill = SymbolicCholesky.CountFill(graph, ApproximateMinimumDegree.Order(graph));
        var groups = Enumerable.Range(0, n).ToArray();
        var x = Enumerable.Range(0, n).Select(j => j == 7 ? double.NaN : j * 10.0).ToArray();
        foreach (var geometry in new[] { null, new UnknownGeometry(groups, x, x) })
        {
            var solver = new SparseNormalEquationsSolver();
            solver.Factorize(n, rows, w, geometry);
            Assert.Equal("approximate minimum degree", solver.Symbolic!.OrderingName);
            Assert.Contains("approximate minimum degree", solver.Name, StringComparison.Ordinal);
            Assert.Equal(amdFill, solver.Symbolic.FactorNonZeros);
        }
    }

    [Fact]
    public void SingularMatrixNamesAnUnknownWithoutPivot()
    {
        // unknown 2 appears in no row: no pivot for it
        var rows = new[] { new SparseRow([0, 1], [1.0, -1.0]), new SparseRow([0], [1.0]), new SparseRow([1, 3], [1.0, 1.0]), new SparseRow([3], [2.0]) };
        var w = WeightMatrix.Diagonal([1.0, 1.0, 1.0, 1.0]);
        var e = Assert.Throws<SingularNormalMatrixException>(() => new SparseNormalEquationsSolver().Factorize(4, rows, w));
        Assert.Equal(2, e.Column);
    }

    [Property(MaxTest = 12)]
    public Property SparseAndDenseAdjustmentsAgree() =>
        Prop.ForAll(Seeds, Gen.Choose(3, 5).ToArbitrary(), Gen.Elements(true, false).ToArbitrary(), (seed, side, levels) =>
        {
            var network = GridNetworks.Horizontal(seed, side, levelling: levels);
            var dense = Adjuster.Adjust(network, AdjustmentOptions.Default with { Solver = new DenseNormalEquationsSolver() });
            var sparse = Adjuster.Adjust(network, AdjustmentOptions.Default with { Solver = new SparseNormalEquationsSolver() });
            AssertAgree(dense, sparse);
        });

    [Fact]
    public void SyntheticPlaneAndLevelNetworksAgreeWithDensePath()
    {
        foreach (var kind in new[] { SyntheticNetworkKind.Plane, SyntheticNetworkKind.Levels })
        {
            var network = SyntheticNetworks.Create(new SyntheticNetworkSpec(kind, 150, Seed: 3) { ControlEvery = 40 });
            var dense = Adjuster.Adjust(network, AdjustmentOptions.Default with { Solver = new DenseNormalEquationsSolver() });
            var sparse = Adjuster.Adjust(network, AdjustmentOptions.Default with { Solver = new SparseNormalEquationsSolver() });
            AssertAgree(dense, sparse);
        }
    }

    /// <summary>Coordinates, point sd and covariance, orientation sd, adjusted-observation sd, redundancy numbers, w-values, MDB, relative precision and Qxx on the pattern agree.</summary>
    internal static void AssertAgree(AdjustmentResult dense, AdjustmentResult sparse)
    {
        const double rel = 1e-9;
        static void Close(double? a, double? b, double scale, string what)
        {
            Assert.Equal(a is null, b is null);
            if (a is null) return;
            Assert.True(Math.Abs(a.Value - b!.Value) <= rel * Math.Max(scale, Math.Abs(a.Value)), $"{what}: dense {a} sparse {b}");
        }
        Assert.Equal(dense.Statistics.Iterations, sparse.Statistics.Iterations);
        Close(dense.Statistics.Vtpv, sparse.Statistics.Vtpv, 1e-6, "vᵀPv");
        for (int i = 0; i < dense.Points.Count; i++)
        {
            var a = dense.Points[i]; var b = sparse.Points[i];
            // coordinates: relative to the 1 km extent of the network (a correction of 1e-6 m shows)
            Close(a.E, b.E, 1, $"E {a.Id}"); Close(a.N, b.N, 1, $"N {a.Id}"); Close(a.H, b.H, 1, $"H {a.Id}");
            Close(a.SdE, b.SdE, 1e-4, $"sdE {a.Id}"); Close(a.SdN, b.SdN, 1e-4, $"sdN {a.Id}"); Close(a.SdH, b.SdH, 1e-4, $"sdH {a.Id}");
            Close(a.CovEN, b.CovEN, 1e-8, $"covEN {a.Id}");
        }
        for (int i = 0; i < dense.Observations.Count; i++)
            Close(dense.Observations[i].SdAdjusted, sparse.Observations[i].SdAdjusted, 1e-6, $"sd of adjusted observation {i}");
        for (int i = 0; i < dense.Orientations.Count; i++)
            Close(dense.Orientations[i].Sd, sparse.Orientations[i].Sd, 1e-9, $"orientation sd {i}");
        // Statistics from Qxx on the pattern: redundancy numbers, w-values, MDB, absolute and relative ellipses.
        var da = NetAdjust.Statistics.ResultAnalysis.Analyse(dense);
        var sa = NetAdjust.Statistics.ResultAnalysis.Analyse(sparse);
        Assert.Equal(da.Observations.Count, sa.Observations.Count);
        for (int i = 0; i < da.Observations.Count; i++)
        {
            Close(da.Observations[i].Redundancy, sa.Observations[i].Redundancy, 1e-3, $"redundancy number {i}");
            // w = (Pv)ᵢ / (σ0 √(PQvvP)ᵢᵢ) inherits the cancellation in v = computed − observed: with coordinates of
            // 1e3 m (ulp 1e-13 m), residuals of 1e-3 m and σ of 1e-3 m, two exact solvers differ by ~1e-10 in w
            // (more where rᵢ is small). w is a unit-variance statistic; 1e-7 still exposes any wrong Qxx entry.
            Assert.Equal(da.Observations[i].W is null, sa.Observations[i].W is null);
            if (da.Observations[i].W is double wd)
                Assert.True(Math.Abs(wd - sa.Observations[i].W!.Value) <= 1e-7, $"w-value {i}: dense {wd} sparse {sa.Observations[i].W}");
            Close(da.Observations[i].Mdb, sa.Observations[i].Mdb, 1e-6, $"MDB {i}");
        }
        Assert.Equal(da.Relative.Count, sa.Relative.Count);
        for (int i = 0; i < da.Relative.Count; i++)
            Close(da.Relative[i].SdDistance, sa.Relative[i].SdDistance, 1e-6, $"relative sd {da.Relative[i].From}-{da.Relative[i].To}");
        // every Qxx entry between unknowns of one design row
        foreach (var row in sparse.DesignRows)
            foreach (int i in row.Columns)
                foreach (int j in row.Columns)
                    Close(dense.Cofactor(i, j), sparse.Cofactor(i, j), Math.Sqrt(Math.Abs(dense.Cofactor(i, i) * dense.Cofactor(j, j))), $"Qxx({i},{j})");
    }
}
