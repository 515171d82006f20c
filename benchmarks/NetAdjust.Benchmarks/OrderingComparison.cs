using System.Diagnostics;
using System.Globalization;
using System.Runtime.InteropServices;
using NetAdjust.Simulation;
using NetAdjust.LinearAlgebra.Sparse;

namespace NetAdjust.Benchmarks;

/// <summary>
/// The ordering without coordinates against the reference AMD: our <c>ApproximateMinimumDegree</c> and SuiteSparse's
/// <c>amd_order</c> (Debian package libamd2, the reference implementation of Amestoy, Davis &amp; Duff 1996, called
/// with its default controls) order the same G(N) of the benchmark suite's synthetic networks; both permutations go
/// through the same symbolic analysis, so nnz(L) and flops (Σ c_j²) compare like with like. Geometric nested
/// dissection is shown beside them where positions exist.
/// <c>dotnet run -c Release --project benchmarks/NetAdjust.Benchmarks -- orderings [plane|levels POINTS]...</c>
/// (no arguments: the suite's plane 1,000 / 10,000 / 100,000 points and levels 10,000 / 100,000).
/// </summary>
public static class OrderingComparison
{
    /// <summary>Runs the comparison and prints one block per network.</summary>
    /// <param name="args"><c>orderings</c> followed by pairs of kind and point count.</param>
    public static void Run(string[] args)
    {
        var cases = new List<(SyntheticNetworkKind, int)>();
        for (int a = 1; a + 1 < args.Length; a += 2)
            cases.Add((args[a] == "levels" ? SyntheticNetworkKind.Levels : SyntheticNetworkKind.Plane,
                int.Parse(args[a + 1], CultureInfo.InvariantCulture)));
        if (cases.Count == 0)
            cases.AddRange([(SyntheticNetworkKind.Plane, 1_000), (SyntheticNetworkKind.Plane, 10_000),
                (SyntheticNetworkKind.Plane, 100_000), (SyntheticNetworkKind.Levels, 10_000),
                (SyntheticNetworkKind.Levels, 100_000)]);
        Console.WriteLine($"load average: {File.ReadAllText("/proc/loadavg").Trim()}");
        foreach (var (kind, points) in cases) Compare(kind, points);
    }

    private static void Compare(SyntheticNetworkKind kind, int points)
    {
        var network = SyntheticNetworks.Create(new SyntheticNetworkSpec(kind, points, Seed: 1));
        var problem = SyntheticProblem.Linearise(network);
        var graph = AdjacencyGraph.FromNormalEquations(problem.Unknowns, problem.Rows, problem.Weights);
        Console.WriteLine(
            $"{kind} {points} points: {graph.VertexCount} unknowns, {graph.EdgeCount} off-diagonal pairs");

        var (ours, tOurs) = Timed(() => ApproximateMinimumDegree.Order(graph));
        var symOurs = SymbolicCholesky.Analyze(graph, ours, "amd");
        Report("ours (AMD)", symOurs, tOurs);

        var (reference, tRef) = Timed(() => ReferenceAmd(graph));
        if (reference is null) Console.WriteLine("  reference AMD: libamd.so.2 not found (apt-get install libamd2)");
        else
        {
            var symRef = SymbolicCholesky.Analyze(graph, reference, "reference amd");
            Report("reference amd_order", symRef, tRef);
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"  ratio ours/reference: nnz(L) {(double)symOurs.FactorNonZeros / symRef.FactorNonZeros:F3}, " +
                $"flops {symOurs.FactorFlops / symRef.FactorFlops:F3}, ordering time {tOurs / tRef:F2}; " +
                $"same permutation: {ours.AsSpan().SequenceEqual(reference)}"));
        }
        if (problem.Geometry is { HasAllPositions: true } geometry)
        {
            var (nd, tNd) = Timed(() => GeometricNestedDissection.Order(graph, geometry));
            Report("geometric nested dissection", SymbolicCholesky.Analyze(graph, nd, "nd"), tNd);
        }
    }

    private static void Report(string name, SymbolicCholesky sym, double seconds) =>
        Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"  {name}: nnz(L) {sym.FactorNonZeros} ({sym.FactorNonZeros:E3}), flops {sym.FactorFlops:E3}, " +
            $"ordering {seconds * 1000:F0} ms"));

    /// <summary>Best of three wall-clock runs (the first includes JIT).</summary>
    private static (T Result, double Seconds) Timed<T>(Func<T> f)
    {
        T result = f();
        double best = double.MaxValue;
        for (int rep = 0; rep < 3; rep++)
        {
            var sw = Stopwatch.StartNew();
            result = f();
            best = Math.Min(best, sw.Elapsed.TotalSeconds);
        }
        return (result, best);
    }

    /// <summary>SuiteSparse's amd_order on the full pattern of N (CSC, no diagonal), default controls.</summary>
    private static int[]? ReferenceAmd(AdjacencyGraph graph)
    {
        if (!NativeLibrary.TryLoad("libamd.so.2", out var handle)) return null;
        try
        {
            var amdOrder = Marshal.GetDelegateForFunctionPointer<AmdOrder>(
                NativeLibrary.GetExport(handle, "amd_order"));
            var perm = new int[graph.VertexCount];
            int status = amdOrder(
                graph.VertexCount, graph.Start, graph.Adjacent, perm, IntPtr.Zero, IntPtr.Zero);
            if (status < 0) throw new InvalidOperationException($"amd_order returned {status}");
            return perm;
        }
        finally { NativeLibrary.Free(handle); }
    }

    [UnmanagedFunctionPointer(CallingConvention.Cdecl)]
    private delegate int AmdOrder(int n, int[] ap, int[] ai, int[] p, IntPtr control, IntPtr info);
}
