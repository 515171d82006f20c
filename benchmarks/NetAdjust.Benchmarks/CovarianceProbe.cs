using System.Diagnostics;
using System.Globalization;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.LinearAlgebra.Sparse;
using NetAdjust.Statistics;

namespace NetAdjust.Benchmarks;

/// <summary>
/// The sparse engine's share of <c>netadjust adjust</c> on a project file, timed in process:
/// <c>-- covariance FILE [RUNS]</c> adjusts once, then on the final design rows and weights times the symbolic
/// analysis, the assembly of N (4 times), the numeric factorisation (4 times), the selected inverse (once with the
/// supernodal tree on one thread, once as the command does it), the Qxx look-ups of the adjusted points (σE, σN, σEN,
/// σH) and of a Qxx aᵀ per observation, and the statistics analysis (twice); wall and CPU (user + system, of the
/// whole process, so that the parallel fronts count) per repetition, for each run, and the least of each over the
/// warm runs (on a shared machine the least is the figure least disturbed by the load; <c>DOTNET_PROCESSOR_COUNT=1</c>
/// keeps the fronts serial); then the factorisation without the concurrent subtrees (twice, checked bit-identical)
/// and the subtree schedule's work split.
/// </summary>
internal static class CovarianceProbe
{
    public static void Run(string[] args)
    {
        var inv = CultureInfo.InvariantCulture;
        string path = args.Length > 1 ? args[1] : throw new ArgumentException("usage: covariance FILE [RUNS]");
        int runs = args.Length > 2 ? int.Parse(args[2], inv) : 1;
        var project = ProjectReader.Read(path);
        var best = new List<List<(string Phase, double Wall, double Cpu)>>();
        for (int run = 0; run < runs; run++)
        {
            var clock = new PhaseClock();
            var result = Adjuster.Adjust(project.Network, project.Options);
            clock.Lap("adjustment (whole)");
            var rows = result.DesignRows;
            var weights = result.Weights;
            int u = result.Unknowns.Count;
            var geometry = SolverChoice.GeometryOf(result.Network, result.Unknowns);
            var solver = new SparseNormalEquationsSolver();
            _ = solver.Factorize(u, rows, weights, geometry);
            clock.Lap("analysis + 1st factorisation");
            var sym = solver.Symbolic!;
            var assembly = new NormalMatrixAssembly(sym, rows);
            double[] values = [];
            for (int k = 0; k < 4; k++) { values = assembly.Assemble(rows, weights); clock.Lap("assembly of N"); }
            double[] l = [], scale = [];
            for (int k = 0; k < 4; k++)
            {
                (l, scale) = MultifrontalCholesky.Factorize(sym, values);
                clock.Lap("multifrontal");
            }
            for (int k = 0; k < 2; k++)
            {
                var (l1, _) = MultifrontalCholesky.Factorize(sym, values, workers: 1, minimumWork: 0);
                clock.Lap("multifrontal, no subtrees");
                if (!System.Runtime.InteropServices.MemoryMarshal.AsBytes(l1.AsSpan())
                    .SequenceEqual(System.Runtime.InteropServices.MemoryMarshal.AsBytes(l.AsSpan())))
                    throw new InvalidOperationException("the parallel factor differs from the sequential one");
            }
            var schedule = sym.ScheduleFor(Environment.ProcessorCount);
            Console.WriteLine(string.Create(inv, $"subtree schedule for {schedule.Workers} cores (k m^2 per front): " +
                $"{schedule.Subtrees.Length / 2} subtrees, sets " +
                $"{string.Join(" + ", schedule.SetWork.Select(w => w.ToString("E3", inv)))}, top " +
                $"{schedule.TopWork:E3} ({schedule.Top.Length} fronts) of {schedule.TotalWork:E3}; critical path " +
                $"{schedule.CriticalPath / schedule.TotalWork:P1} of the work"));
            var factor = new SparseCholeskyFactor(sym, l, scale);
            for (int k = 0; k < 2; k++)
            {
                // first with the supernodal tree on one thread (the inner loops of large fronts still parallel)
                factor = new SparseCholeskyFactor(sym, l, scale) { InversionThreads = k == 0 ? 1 : 0 };
                factor.ComputeSelectedInverse();
                clock.Lap(k == 0 ? "selected inverse, tree on 1 thread" : "selected inverse");
            }
            double sum = 0;
            foreach (var p in result.Points)
            {
                int ie = result.Unknowns.IndexOf(p.Id, Geometry.Parameter.E);
                int inn = result.Unknowns.IndexOf(p.Id, Geometry.Parameter.N);
                int ih = result.Unknowns.IndexOf(p.Id, Geometry.Parameter.H);
                if (ie >= 0) sum += factor.InverseEntry(ie, ie);
                if (inn >= 0) sum += factor.InverseEntry(inn, inn);
                if (ie >= 0 && inn >= 0) sum += factor.InverseEntry(ie, inn);
                if (ih >= 0) sum += factor.InverseEntry(ih, ih);
            }
            clock.Lap("points' Qxx look-ups");
            for (int i = 0; i < rows.Count; i++)
                if (!result.Network.Observations.ElementAtOrDefault(i)?.Excluded ?? true)
                    sum += Adjuster.Quadratic(rows[i], factor);
            clock.Lap("a Qxx aT per row");
            var analysis = ResultAnalysis.Analyse(result);
            clock.Lap("statistics analysis");
            _ = ResultAnalysis.Analyse(result);
            clock.Lap("statistics analysis");
            Console.WriteLine(string.Create(inv, $"run {run + 1}: {u} unknowns, {rows.Count} rows, " +
                $"{sym.SupernodeCount} supernodes, nnz(L) {sym.FactorNonZeros}, stored {sym.StoredEntries}; " +
                $"check {sum:R} {analysis.RedundancySum:R}; load average {ReadingProbe.LoadAverage()}"));
            clock.Print(30, total: false);
            if (run > 0) best.Add(clock.Laps);
        }
        if (best.Count == 0) return;
        Console.WriteLine("least CPU of one repetition, over the warm runs:");
        foreach (var phase in best[0].Select(l => l.Phase).Distinct())
        {
            var laps = best.SelectMany(b => b).Where(l => l.Phase == phase).ToList();
            Console.WriteLine(string.Create(inv, $"  {phase,-30} CPU {laps.Min(l => l.Cpu),7:F3} s   " +
                $"wall {laps.Min(l => l.Wall),7:F3} s   ({laps.Count} repetitions)"));
        }
    }
}
