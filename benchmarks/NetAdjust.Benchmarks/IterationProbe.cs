using System.Diagnostics;
using System.Globalization;
using NetAdjust.Adjustment;
using NetAdjust.Adjustment.Datum;
using NetAdjust.IO.Project;
using NetAdjust.LinearAlgebra.Sparse;

namespace NetAdjust.Benchmarks;

/// <summary>
/// Where the CPU time of <c>Adjuster.Adjust</c> goes, in process, warm: <c>-- iteration FILE [RUNS]</c> reads the
/// project once, then per run adjusts it with a progress listener that notes the process CPU time (user + system,
/// all threads) at each phase the adjuster reports (setup up to the first iteration, each Gauss-Newton iteration,
/// the final factorisation with the points' covariance, the observations' statistics), and times on their own the
/// parts of those phases that are not the iterations' own work: the datum plan (<c>DatumPlan.Create</c>), the sparse
/// factorisation of the first linearisation (first call: ordering, symbolic analysis, assembly and numeric
/// factorisation; second call: assembly and numeric factorisation on the reused analysis) and the assembly of N
/// alone. The iterations' own work (linearisations, weights, AᵀPl, step control, stochastic model) is then
/// <c>setup + iterations − plan − factorisations</c>, printed as "iteration work". CPU time, not wall, so that
/// other processes on the machine inflate it less; the first run includes the JIT.
/// </summary>
internal static class IterationProbe
{
    public static void Run(string[] args)
    {
        var inv = CultureInfo.InvariantCulture;
        string path = args.Length > 1 ? args[1] : throw new ArgumentException("usage: iteration FILE [RUNS]");
        int runs = args.Length > 2 ? int.Parse(args[2], inv) : 3;
        var project = ProjectReader.Read(path);
        var network = project.Network;
        for (int run = 0; run < runs; run++)
        {
            GC.Collect();
            var marks = new List<(string Phase, double Cpu)>();
            var progress = new Listener(marks);
            double start = Cpu();
            var result = Adjuster.Adjust(network, project.Options with { Progress = progress });
            double total = Cpu() - start;
            double plan = Timed(() => DatumPlan.Create(network, project.Options.Datum));
            var problem = SyntheticProblem.Linearise(network);
            var solver = new SparseNormalEquationsSolver();
            double first = Timed(() => solver.Factorize(problem.Unknowns, problem.Rows, problem.Weights,
                problem.Geometry));
            double again = Timed(() => solver.Factorize(problem.Unknowns, problem.Rows, problem.Weights,
                problem.Geometry));
            // the first factorisation's own steps (ordering by nested dissection when the points have positions)
            AdjacencyGraph graph = null!;
            double tGraph = Timed(() => graph = AdjacencyGraph.FromNormalEquations(problem.Unknowns, problem.Rows,
                problem.Weights));
            int[] order = [];
            bool geometric = problem.Geometry is { HasAllPositions: true };
            double tOrder = Timed(() => order = geometric ? GeometricNestedDissection.Order(graph, problem.Geometry!)
                : ApproximateMinimumDegree.Order(graph));
            SymbolicCholesky symbolic = null!;
            double tAnalyse = Timed(() => symbolic = SymbolicCholesky.Analyze(graph, order, "probe"));
            NormalMatrixAssembly assembly = null!;
            double tPlan = Timed(() => assembly = new NormalMatrixAssembly(symbolic, problem.Rows));
            double assemble = Timed(() => assembly.Assemble(problem.Rows, problem.Weights));
            double tSchedule = Timed(() => SubtreeSchedule.Compute(symbolic, 2));

            int iterations = result.Statistics.Iterations;
            double Mark(string prefix) => marks.First(m => m.Phase.StartsWith(prefix, StringComparison.Ordinal)).Cpu;
            double toFinal = Mark("final") - start;
            double setup = Mark("Gauss-Newton iteration 1") - start;
            double work = toFinal - plan - first - ((iterations - 1) * again);
            Console.WriteLine(string.Create(inv,
                $"run {run + 1} ({(run == 0 ? "cold" : "warm")}): {network.Observations.Count} observations, " +
                $"{iterations} iterations; load average {ReadingProbe.LoadAverage()}"));
            Console.WriteLine(string.Create(inv,
                $"  Adjust {total:F3} s CPU: setup to iteration 1 {setup:F3}, iterations {toFinal - setup:F3}, " +
                $"final factorisation and covariance {Mark("statistics") - Mark("final"):F3}, " +
                $"observations' statistics {start + total - Mark("statistics"):F3}"));
            Console.WriteLine(string.Create(inv,
                $"  on their own: datum plan {plan:F3}, factorisation first {first:F3} / again {again:F3}, " +
                $"assembly of N {assemble:F3}"));
            Console.WriteLine(string.Create(inv,
                $"  first factorisation's steps: graph of N {tGraph:F3}, ordering ({(geometric ? "nested dissection" :
                "minimum degree")}) {tOrder:F3}, symbolic analysis {tAnalyse:F3}, assembly plan {tPlan:F3}, " +
                $"subtree schedule {tSchedule:F3}"));
            Console.WriteLine(string.Create(inv,
                $"  iteration work (setup + iterations - plan - {iterations} factorisations) {work:F3} s CPU"));
        }
    }

    private static double Cpu() => Process.GetCurrentProcess().TotalProcessorTime.TotalSeconds;

    private static double Timed(Action action)
    {
        double t = Cpu();
        action();
        return Cpu() - t;
    }

    /// <summary>Notes the CPU time at each phase (synchronously, on the adjusting thread).</summary>
    private sealed class Listener(List<(string Phase, double Cpu)> marks) : IProgress<AdjustmentProgress>
    {
        public void Report(AdjustmentProgress value)
        {
            if (marks.Count == 0 || marks[^1].Phase != value.Phase) marks.Add((value.Phase, Cpu()));
        }
    }
}
