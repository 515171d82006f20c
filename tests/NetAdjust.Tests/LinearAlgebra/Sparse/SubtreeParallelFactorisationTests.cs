using MathNet.Numerics.LinearAlgebra;
using NetAdjust.LinearAlgebra;
using NetAdjust.LinearAlgebra.Sparse;

namespace NetAdjust.Tests.LinearAlgebra.Sparse;

/// <summary>
/// The tree-level parallel factorisation (independent subtrees of the supernodal elimination tree on separate
/// threads, <see cref="SubtreeSchedule"/>) against the sequential factorisation (same bits: the hard constraint of
/// deterministic reports) and against MathNet's dense Cholesky (an independent reference library) to rounding.
/// </summary>
public class SubtreeParallelFactorisationTests
{
    /// <summary>A g×g grid of points with two unknowns each, observed to their neighbours (rows like distances
    /// and directions: random coefficients on both points' unknowns), ordered by geometric nested dissection, so
    /// the tree has the two halves below each separator that the schedule splits.</summary>
    internal static (SymbolicCholesky Sym, double[] Values, int U, SparseRow[] Rows, WeightMatrix W) GridProblem(
        int g, int seed)
    {
        var rng = new Random(seed);
        int points = g * g, u = 2 * points;
        var rows = new List<SparseRow>();
        for (int j = 0; j < u; j++) rows.Add(new SparseRow([j], [0.2 + (0.1 * (j % 3))])); // every unknown observed
        for (int y = 0; y < g; y++)
            for (int x = 0; x < g; x++)
            {
                int p = (y * g) + x;
                int right = x + 1 < g ? p + 1 : -1, up = y + 1 < g ? p + g : -1;
                int diagonal = right >= 0 && up >= 0 ? p + g + 1 : -1;
                foreach (int q in new[] { right, up, diagonal })
                {
                    if (q < 0) continue;
                    for (int r = 0; r < 2; r++)
                    {
                        double a = rng.NextDouble() - 0.5, b = rng.NextDouble() - 0.5;
                        rows.Add(new SparseRow([2 * p, (2 * p) + 1, 2 * q, (2 * q) + 1], [a, b, -a, -b]));
                    }
                }
            }
        var w = WeightMatrix.FromBlocks(rows.Count,
            Enumerable.Range(0, rows.Count).Select(i => new WeightBlock([i], [0.5 + rng.NextDouble()])));
        var groups = Enumerable.Range(0, u).Select(i => i / 2).ToArray();
        var gx = Enumerable.Range(0, points).Select(p => (double)(p % g)).ToArray();
        var gy = Enumerable.Range(0, points).Select(p => (double)(p / g)).ToArray();
        var graph = AdjacencyGraph.FromNormalEquations(u, rows, w);
        var order = GeometricNestedDissection.Order(graph, new UnknownGeometry(groups, gx, gy));
        var sym = SymbolicCholesky.Analyze(graph, order);
        var rowArray = rows.ToArray();
        return (sym, new NormalMatrixAssembly(sym, rowArray).Assemble(rowArray, w), u, rowArray, w);
    }

    [Fact]
    public void TheScheduleCoversEverySupernodeOnceWithChildrenBeforeParents()
    {
        var (sym, _, _, _, _) = GridProblem(40, 1);
        var schedule = SubtreeSchedule.Compute(sym, 2);
        var owner = new int[sym.SupernodeCount];
        Array.Fill(owner, -1);
        for (int b = 0; b < schedule.Sets.Length; b++)
            for (int i = 0; i < schedule.Sets[b].Length; i += 2)
                for (int s = schedule.Sets[b][i]; s <= schedule.Sets[b][i + 1]; s++)
                {
                    Assert.Equal(-1, owner[s]);
                    owner[s] = b;
                }
        foreach (int s in schedule.Top) { Assert.Equal(-1, owner[s]); owner[s] = schedule.Sets.Length; }
        Assert.DoesNotContain(-1, owner);
        // a front in a set has its parent in the same set or in the top part (never in the other set)
        for (int s = 0; s < sym.SupernodeCount; s++)
        {
            int p = sym.SnParent[s];
            if (p >= 0 && owner[s] < schedule.Sets.Length)
                Assert.True(owner[p] == owner[s] || owner[p] == schedule.Sets.Length);
            if (p >= 0 && owner[s] == schedule.Sets.Length) Assert.Equal(schedule.Sets.Length, owner[p]);
        }
        // on a grid ordered by nested dissection the two halves balance: the concurrent part is most of the work
        Assert.True(schedule.CriticalPath < 0.7 * schedule.TotalWork,
            $"critical path {schedule.CriticalPath:E3} of {schedule.TotalWork:E3}");
    }

    [Theory]
    [InlineData(2)]
    [InlineData(3)]
    public void TheWorkersTakeTheSetsSubtreesHeaviestFirst(int workers)
    {
        var (sym, _, _, _, _) = GridProblem(40, 1);
        var schedule = SubtreeSchedule.Compute(sym, workers);
        var pairs = Pairs(schedule.Subtrees);
        Assert.True(pairs.Count >= workers, $"{pairs.Count} subtrees");
        // the same subtrees as the sets' packing
        Assert.Equal(schedule.Sets.SelectMany(Pairs).Order(), pairs.Order());
        // heaviest first (ties: the lower root), the work of a subtree summed here front by front as k·m²
        double Work((int First, int Root) t) => Enumerable.Range(t.First, t.Root - t.First + 1).Sum(s =>
            (double)(sym.SnStart[s + 1] - sym.SnStart[s]) * Math.Pow(sym.SnRowStart[s + 1] - sym.SnRowStart[s], 2));
        for (int i = 1; i < pairs.Count; i++)
        {
            double before = Work(pairs[i - 1]), after = Work(pairs[i]);
            Assert.True(before > after || (before == after && pairs[i - 1].Root < pairs[i].Root),
                $"subtree {i - 1} ({before:E3}) before subtree {i} ({after:E3})");
        }
    }

    [Fact]
    public void EverySubtreeRunsOnceWhateverTheWorkerThatTakesIt()
    {
        var (sym, _, _, _, _) = GridProblem(40, 1);
        var schedule = SubtreeSchedule.Compute(sym, 3);
        var runs = new int[sym.SupernodeCount];
        int workers = 0;
        for (int round = 0; round < 20; round++)
            schedule.ForEachSubtree(() =>
            {
                Interlocked.Increment(ref workers);
                return (first, root) =>
                {
                    Interlocked.Increment(ref runs[root]);
                    Thread.SpinWait(1000 * (root % 7)); // subtrees of unequal length
                };
            });
        foreach (var (_, root) in Pairs(schedule.Subtrees)) Assert.Equal(20, runs[root]);
        Assert.Equal(Pairs(schedule.Subtrees).Count * 20, runs.Sum());
        Assert.Equal(3 * 20, workers); // worker() called once for each of the three workers of each round
    }

    [Fact]
    public void ASubtreeThatThrowsComesBackAsTheException()
    {
        var (sym, _, _, _, _) = GridProblem(40, 1);
        var schedule = SubtreeSchedule.Compute(sym, 2);
        int thrower = Pairs(schedule.Subtrees)[^1].Root;
        var e = Assert.Throws<AggregateException>(() => schedule.ForEachSubtree(() => (first, root) =>
        {
            if (root == thrower) throw new InvalidOperationException($"subtree {root}");
        }));
        Assert.Equal($"subtree {thrower}", Assert.Single(e.InnerExceptions).Message);
    }

    private static List<(int First, int Root)> Pairs(int[] flat) =>
        Enumerable.Range(0, flat.Length / 2).Select(i => (flat[2 * i], flat[(2 * i) + 1])).ToList();

    [Theory]
    [InlineData(2)]
    [InlineData(3)]
    [InlineData(4)]
    public void ParallelFactorIsBitIdenticalToTheSequentialFactor(int workers)
    {
        var (sym, values, _, _, _) = GridProblem(40, 2);
        var (lSeq, sSeq) = MultifrontalCholesky.Factorize(sym, values, workers: 1, minimumWork: 0);
        var schedule = sym.ScheduleFor(workers);
        Assert.True(schedule.CriticalPath < 0.9 * schedule.TotalWork); // the parallel path is taken
        for (int run = 0; run < 3; run++)
        {
            var (lPar, sPar) = MultifrontalCholesky.Factorize(sym, values, workers, minimumWork: 0);
            Assert.Equal(sSeq, sPar);
            WideFrontTests.AssertSameBits(lSeq, lPar, $"factor, run {run}");
        }
    }

    [Fact]
    public void ParallelFactorSolvesAsMathNetDenseCholesky()
    {
        var (sym, values, u, rows, w) = GridProblem(16, 3);
        var (l, scale) = MultifrontalCholesky.Factorize(sym, values, workers: 2, minimumWork: 0);
        Assert.True(sym.ScheduleFor(2).CriticalPath < 0.9 * sym.ScheduleFor(2).TotalWork);
        var factor = new SparseCholeskyFactor(sym, l, scale);
        var b = Enumerable.Range(0, u).Select(i => Math.Sin(i + 1.0)).ToArray();
        var x = factor.Solve(b);
        // independent oracle: MathNet's dense Cholesky of N = AᵀPA formed densely
        var xRef = SparseEngineTests.DenseNormal(u, rows, w).Cholesky().Solve(Vector<double>.Build.DenseOfArray(b));
        double norm = xRef.InfinityNorm();
        for (int i = 0; i < u; i++) Assert.True(Math.Abs(x[i] - xRef[i]) <= 1e-9 * norm, $"x[{i}]");
    }

    [Fact]
    public void ASingularPivotNamesTheSameColumnAsTheSequentialFactorisation()
    {
        var (sym, values, _, _, _) = GridProblem(30, 4);
        // Spoil positive definiteness in two places (one column a quarter into the order, one three fifths in):
        // off-diagonal entries of those columns of C blown up, so a later pivot of the elimination goes negative.
        var lower = sym.LowerC;
        var broken = (double[])values.Clone();
        foreach (int j in new[] { sym.Size / 4, (3 * sym.Size) / 5 })
            for (int p = lower.Start[j] + 1; p < lower.Start[j + 1]; p++) broken[p] *= 1e4;
        var seq = Assert.Throws<SingularNormalMatrixException>(
            () => MultifrontalCholesky.Factorize(sym, broken, workers: 1, minimumWork: 0));
        var par = Assert.Throws<SingularNormalMatrixException>(
            () => MultifrontalCholesky.Factorize(sym, broken, workers: 2, minimumWork: 0));
        Assert.Equal(seq.Column, par.Column);
        // the failure lies in a concurrently factorised subtree (not the top part), so the test exercises the
        // hand-back to the sequential order
        Assert.DoesNotContain(sym.SnOf[sym.InversePerm[seq.Column]], sym.ScheduleFor(2).Top);
    }
}
