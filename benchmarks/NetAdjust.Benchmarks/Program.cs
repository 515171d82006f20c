using BenchmarkDotNet.Running;

namespace NetAdjust.Benchmarks;

/// <summary>Runs the benchmarks: <c>dotnet run -c Release --project benchmarks/NetAdjust.Benchmarks -- --filter '*'</c>.</summary>
public static class Program
{
    /// <summary>Entry point.</summary>
    /// <param name="args">BenchmarkDotNet arguments.</param>
    public static void Main(string[] args) => BenchmarkSwitcher.FromAssembly(typeof(Program).Assembly).Run(args);
}
