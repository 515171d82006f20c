using System.Diagnostics;
using NetAdjust.Adjustment;
using NetAdjust.Simulation;
using NetAdjust.LinearAlgebra;
using NetAdjust.LinearAlgebra.Sparse;

namespace NetAdjust.Benchmarks;

/// <summary>
/// One-shot wall-clock timing of the sparse engine's phases on a synthetic network (a quick companion of the
/// BenchmarkDotNet suites, for large networks where repeated runs take too long):
/// <c>dotnet run -c Release --project benchmarks/NetAdjust.Benchmarks -- phases plane 100000</c>.
/// </summary>
public static class PhaseTimer
{
    /// <summary>Runs and prints the timings.</summary>
    /// <param name="args">kind (plane|levels), point count, optional ordering (auto|nd|md) or <c>adjust-only</c>.</param>
    public static void Run(string[] args)
    {
        var kind = args.Length > 1 && args[1] == "levels" ? SyntheticNetworkKind.Levels : SyntheticNetworkKind.Plane;
        int points = args.Length > 2 ? int.Parse(args[2], System.Globalization.CultureInfo.InvariantCulture) : 10_000;
        var ordering = args.Length > 3 ? args[3] switch { "nd" => SparseOrdering.NestedDissection, "md" => SparseOrdering.MinimumDegree, _ => SparseOrdering.Automatic } : SparseOrdering.Automatic;
        var sw = Stopwatch.StartNew();
        var network = SyntheticNetworks.Create(new SyntheticNetworkSpec(kind, points, Seed: 1));
        Console.WriteLine($"generate: {sw.Elapsed.TotalSeconds:F2} s; {network.Points.Count} points, {network.Observations.Count} observations");
        if (args.Length > 3 && args[3] == "adjust-only")
        {
            GC.Collect();
            long before = Process.GetCurrentProcess().PeakWorkingSet64;
            sw.Restart();
            var r = Adjuster.Adjust(network, AdjustmentOptions.Default);
            double tAdjust = sw.Elapsed.TotalSeconds;
            var analysis = NetAdjust.Statistics.ResultAnalysis.Analyse(r);
            Console.WriteLine($"adjustment {tAdjust:F2} s; with statistics ({analysis.Observations.Count} tests, {analysis.Points.Count} ellipses, {analysis.Relative.Count} relative) " +
                              $"{sw.Elapsed.TotalSeconds:F2} s, {r.Statistics.Iterations} iterations, solver: {r.SolverName}; " +
                              $"peak working set {Process.GetCurrentProcess().PeakWorkingSet64 / 1048576} MiB (after generating: {before / 1048576} MiB)");
            return;
        }

        var prepared = SyntheticProblem.Linearise(network);
        int u = prepared.Unknowns;
        Console.WriteLine($"unknowns {u}, rows {prepared.Rows.Length}");
        sw.Restart();
        var graph = AdjacencyGraph.FromNormalEquations(u, prepared.Rows, prepared.Weights);
        Console.WriteLine($"graph of N: {sw.Elapsed.TotalSeconds:F2} s, {graph.EdgeCount} off-diagonal pairs");
        foreach (var o in ordering == SparseOrdering.Automatic ? new[] { SparseOrdering.NestedDissection, SparseOrdering.MinimumDegree } : new[] { ordering })
        {
            if (o == SparseOrdering.MinimumDegree && u > 400_000) continue;
            sw.Restart();
            var perm = o == SparseOrdering.MinimumDegree || prepared.Geometry is null || !prepared.Geometry.HasAllPositions
                ? ApproximateMinimumDegree.Order(graph) : GeometricNestedDissection.Order(graph, prepared.Geometry);
            double tOrder = sw.Elapsed.TotalSeconds;
            sw.Restart();
            var sym = SymbolicCholesky.Analyze(graph, perm, o.ToString());
            double tSym = sw.Elapsed.TotalSeconds;
            Console.WriteLine($"{o}: ordering {tOrder:F2} s, symbolic {tSym:F2} s, nnz(L) {sym.FactorNonZeros:E3}, flops {sym.FactorFlops:E3}, supernodes {sym.SupernodeCount}, largest front {sym.LargestFront}");
            sw.Restart();
            var asm = new NormalMatrixAssembly(sym, prepared.Rows);
            var values = asm.Assemble(prepared.Rows, prepared.Weights);
            Console.WriteLine($"  assembly of N: {sw.Elapsed.TotalSeconds:F2} s");
            for (int rep = 0; rep < 2; rep++)
            {
                sw.Restart();
                var f = SparseCholeskyFactor.Factorize(sym, asm, prepared.Rows, prepared.Weights);
                double tNum = sw.Elapsed.TotalSeconds;
                sw.Restart();
                var x = f.Solve(new double[u].Select((_, i) => Math.Sin(i)).ToArray());
                double tSolve = sw.Elapsed.TotalSeconds;
                sw.Restart();
                f.ComputeSelectedInverse();
                double tInv = sw.Elapsed.TotalSeconds;
                Console.WriteLine($"  numeric (assembly + factor) {tNum:F2} s, solve {tSolve:F3} s, selected inverse {tInv:F2} s");
            }
        }
        GC.Collect();
        sw.Restart();
        var result = Adjuster.Adjust(network, AdjustmentOptions.Default);
        Console.WriteLine($"full adjustment: {sw.Elapsed.TotalSeconds:F2} s, {result.Statistics.Iterations} iterations, solver: {result.SolverName}, peak working set {Process.GetCurrentProcess().PeakWorkingSet64 / 1048576} MiB");
    }
}
