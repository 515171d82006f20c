using BenchmarkDotNet.Running;

namespace NetAdjust.Benchmarks;

/// <summary>
/// Runs the benchmarks: <c>dotnet run -c Release --project benchmarks/NetAdjust.Benchmarks -- --filter '*'</c>;
/// or a one-shot phase timing: <c>... -- phases plane|levels POINTS [auto|nd|md]</c>;
/// or the orderings against the reference AMD: <c>... -- orderings [plane|levels POINTS]...</c>;
/// or the project reader's speed: <c>... -- reading [POINTS] [RUNS]</c> or <c>... -- reading FILE.yaml [RUNS]</c>;
/// or the phases of the adjust command in process: <c>... -- command FILE [RUNS]</c>;
/// or its writers one at a time: <c>... -- writers FILE [RUNS]</c>;
/// or the work before the first iteration: <c>... -- setup FILE [RUNS] [DUMP]</c>;
/// or the GNSS baseline loops found and their sizes: <c>... -- loops FILE [RUNS]</c>;
/// or where the adjustment's CPU time goes: <c>... -- iteration FILE [RUNS]</c>;
/// or the sparse engine's share of it (factorisation, selected inverse, statistics): <c>... -- covariance FILE
/// [RUNS]</c>.
/// </summary>
public static class Program
{
    /// <summary>Entry point.</summary>
    /// <param name="args">BenchmarkDotNet arguments, or <c>phases ...</c>.</param>
    public static void Main(string[] args)
    {
        if (args.Length > 0 && args[0] == "phases") { PhaseTimer.Run(args); return; }
        if (args.Length > 0 && args[0] == "orderings") { OrderingComparison.Run(args); return; }
        if (args.Length > 0 && args[0] == "reading") { ReadingProbe.Run(args); return; }
        if (args.Length > 0 && args[0] == "command") { CommandPhases.Run(args); return; }
        if (args.Length > 0 && args[0] == "writers") { CommandPhases.Writers(args); return; }
        if (args.Length > 0 && args[0] == "setup") { SetupPhases.Run(args); return; }
        if (args.Length > 0 && args[0] == "loops") { LoopsProbe.Run(args); return; }
        if (args.Length > 0 && args[0] == "iteration") { IterationProbe.Run(args); return; }
        if (args.Length > 0 && args[0] == "covariance") { CovarianceProbe.Run(args); return; }
        if (args.Length > 0 && args[0] == "provider") { ProviderProbe.Run(); return; }
        if (args.Length > 0 && args[0] == "crossover") { Crossover.Run(); return; }
        if (args.Length > 1 && args[0] == "dense")
        {
            Crossover.DenseOnce(int.Parse(args[1], System.Globalization.CultureInfo.InvariantCulture)); return;
        }
        BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
    }
}
