using BenchmarkDotNet.Attributes;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.Statistics;

namespace NetAdjust.Benchmarks;

/// <summary>The report and exchange writers on the demo project (statistics computed once beforehand).</summary>
[MemoryDiagnoser]
public class ReportWritersBenchmark
{
    private AdjustmentResult? _result;
    private ReportContext? _context;

    /// <summary>Reads and adjusts the demo once, and computes its statistics.</summary>
    [GlobalSetup]
    public void Setup()
    {
        var demo = ProjectReader.Read(DemoData.File("brackenmoor.yaml"));
        _result = Adjuster.Adjust(demo.Network, demo.Options);
        _ = _result.Analysis;
        _context = new ReportContext("data/brackenmoor.yaml", new DateOnly(2026, 12, 1), demo.Units);
    }

    /// <summary>The self-contained HTML report (plot, histogram, tables).</summary>
    [Benchmark]
    public string Html() => HtmlReportWriter.Write(_result!, _context!);

    /// <summary>The network plot alone.</summary>
    [Benchmark]
    public string Svg() => NetworkPlotWriter.WriteDocument(_result!, _context!);

    /// <summary>The coordinates CSV.</summary>
    [Benchmark]
    public string Csv() => CoordinateCsvWriter.Write(_result!, _context!);

    /// <summary>LandXML 1.2.</summary>
    [Benchmark]
    public string LandXml() => LandXmlWriter.Write(_result!, _context!);

    /// <summary>GeoJSON.</summary>
    [Benchmark]
    public string GeoJson() => GeoJsonWriter.Write(_result!, _context!);
}
