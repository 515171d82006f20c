using BenchmarkDotNet.Attributes;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.Procedures;
using NetAdjust.Statistics;

namespace NetAdjust.Benchmarks;

/// <summary>The post-adjustment statistics and the blunder-hunt tools on the demo projects (small-network baseline).</summary>
[MemoryDiagnoser]
public class StatisticsBenchmark
{
    private AdjustmentResult? _result;
    private SurveyProject? _blunder;

    /// <summary>Reads and adjusts the demos once.</summary>
    [GlobalSetup]
    public void Setup()
    {
        var demo = ProjectReader.Read(DemoData.File("brackenmoor.yaml"));
        _result = Adjuster.Adjust(demo.Network, demo.Options);
        _blunder = ProjectReader.Read(DemoData.File("harrowfield-blunder.yaml"));
    }

    /// <summary>Full analysis (tests, reliability with one solve per observation, ellipses, relative ellipses).</summary>
    [Benchmark]
    public NetworkAnalysis Analyse() => ResultAnalysis.Analyse(_result!, AnalysisOptions.Default with { ExternalReliability = ExternalReliabilityMode.Always });

    /// <summary>Data snooping on the demo with a planted blunder (two rounds).</summary>
    [Benchmark]
    public BlunderHunt Snoop() => DataSnooping.Run(_blunder!.Network, _blunder.Options);

    /// <summary>Danish robust estimation on the same demo.</summary>
    [Benchmark]
    public RobustEstimate Robust() => RobustEstimation.Run(_blunder!.Network, RobustMethod.Danish, _blunder.Options);
}
