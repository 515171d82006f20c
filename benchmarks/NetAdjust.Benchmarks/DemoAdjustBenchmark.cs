using BenchmarkDotNet.Attributes;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;

namespace NetAdjust.Benchmarks;

/// <summary>Reads and adjusts the demo project end to end (small-network baseline).</summary>
[MemoryDiagnoser]
public class DemoAdjustBenchmark
{
    private string _path = "";
    private SurveyProject? _project;

    /// <summary>Locates the demo project.</summary>
    [GlobalSetup]
    public void Setup()
    {
        _path = DemoData.File("brackenmoor.yaml");
        _project = ProjectReader.Read(_path);
    }

    /// <summary>Parsing the project file and its CSV.</summary>
    [Benchmark]
    public SurveyProject Read() => ProjectReader.Read(_path);

    /// <summary>The adjustment alone.</summary>
    [Benchmark]
    public AdjustmentResult Adjust() => Adjuster.Adjust(_project!.Network, _project.Options);
}
