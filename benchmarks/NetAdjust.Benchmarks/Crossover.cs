using System.Diagnostics;
using NetAdjust.Adjustment;
using NetAdjust.Simulation;
using NetAdjust.LinearAlgebra;
using NetAdjust.LinearAlgebra.Sparse;

namespace NetAdjust.Benchmarks;

/// <summary>
/// Dense against sparse on small plane networks, best of several runs each, to place the automatic choice's
/// crossover: <c>... -- crossover</c>.
/// </summary>
public static class Crossover
{
    /// <summary>One cold dense adjustment of a plane network of the given size, timed (for sizes past BenchmarkDotNet's
    /// in-process limit).</summary>
    /// <param name="points">The number of points.</param>
    public static void DenseOnce(int points)
    {
        var network = SyntheticNetworks.Create(new SyntheticNetworkSpec(SyntheticNetworkKind.Plane, points, Seed: 1));
        var sw = Stopwatch.StartNew();
        Adjuster.Adjust(network, AdjustmentOptions.Default with { Solver = new DenseNormalEquationsSolver() });
        Console.WriteLine($"dense adjustment of {points} points: {sw.Elapsed.TotalSeconds:F1} s");
    }

    /// <summary>Prints one line per network size.</summary>
    public static void Run()
    {
        foreach (int points in new[] { 20, 40, 70, 100, 150, 200, 300 })
        {
            var network = SyntheticNetworks.Create(new SyntheticNetworkSpec(SyntheticNetworkKind.Plane, points,
                Seed: 1));
            double Best(Func<INormalEquationsSolver> solver)
            {
                double best = double.MaxValue;
                for (int rep = 0; rep < 7; rep++)
                {
                    var sw = Stopwatch.StartNew();
                    Adjuster.Adjust(network, AdjustmentOptions.Default with { Solver = solver() });
                    best = Math.Min(best, sw.Elapsed.TotalMilliseconds);
                }
                return best;
            }
            double dense = Best(() => new DenseNormalEquationsSolver());
            double sparse = Best(() => new SparseNormalEquationsSolver());
            int u = SyntheticProblem.Linearise(network).Unknowns;
            Console.WriteLine($"{points,5} points, {u,5} unknowns: dense {dense,8:F2} ms, sparse {sparse,8:F2} ms");
        }
    }
}
