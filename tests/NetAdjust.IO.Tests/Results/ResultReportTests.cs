using System.Text;
using System.Text.Json;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.Simulation;

namespace NetAdjust.IO.Tests.Results;

/// <summary>The report model and the JSON written from it (docs/output-format.md).</summary>
public class ResultReportTests
{
    [Fact]
    public void JsonWrittenToAStreamIsTheSameAsTheTextAndLeavesTheStreamOpen()
    {
        var (r, c) = TestProjects.Demo();
        var report = ResultReport.Build(r, c);
        using var ms = new MemoryStream();
        ms.Write("x"u8);
        JsonResultWriter.Write(ms, report);
        Assert.True(ms.CanWrite);
        string text = Encoding.UTF8.GetString(ms.ToArray());
        Assert.Equal("x" + JsonResultWriter.Write(r, c), text);
        Assert.EndsWith("}\n", text);
    }

    // docs/output-format.md: "Their root-sum-square equals sd" (the components of an error budget are independent,
    // so their variances add; common practice in error propagation).
    [Fact]
    public void SdComponentsOfEveryObservationAddUpToItsSd()
    {
        var (r, c) = TestProjects.Demo();
        using var doc = JsonDocument.Parse(JsonResultWriter.Write(r, c));
        int budgets = 0;
        foreach (var o in doc.RootElement.GetProperty("observations").EnumerateArray())
        {
            var parts = o.GetProperty("sd_components").EnumerateObject().ToList();
            if (parts.Count > 1) budgets++;
            double rss = Math.Sqrt(parts.Sum(p => p.Value.GetDouble() * p.Value.GetDouble()));
            Assert.Equal(o.GetProperty("sd").GetDouble(), rss, 1e-9 * Math.Max(1, rss));
        }
        Assert.True(budgets > 0); // the demo weights its total-station observations from specifications
    }

    [Fact]
    public void JsonAndGeoJsonShowTheSameStandardisedResidualsAndVerdicts()
    {
        var (r, c) = TestProjects.Demo();
        var report = ResultReport.Build(r, c);
        using var json = JsonDocument.Parse(JsonResultWriter.Write(report));
        using var geo = JsonDocument.Parse(GeoJsonWriter.Write(report));
        double critical = json.RootElement.GetProperty("testing").GetProperty("w_critical").GetDouble();
        var observations = json.RootElement.GetProperty("observations").EnumerateArray().ToList();
        int lines = 0;
        foreach (var f in geo.RootElement.GetProperty("features").EnumerateArray())
        {
            var p = f.GetProperty("properties");
            if (p.GetProperty("feature").GetString() != "observation") continue;
            var o = observations[p.GetProperty("number").GetInt32() - 1];
            Assert.Equal(o.GetProperty("kind").GetString(), p.GetProperty("kind").GetString());
            if (p.GetProperty("w").ValueKind == JsonValueKind.Null) continue;
            double w = o.GetProperty("w").GetDouble();
            Assert.Equal(Math.Round(w, 3), p.GetProperty("w").GetDouble(), 12);
            Assert.Equal(Math.Abs(w) > critical, p.GetProperty("w_test_failed").GetBoolean());
            lines++;
        }
        Assert.True(lines > 10);
    }

    [Fact]
    public void CsvHeaderIsTheModelsColumnsWithTheirUnits()
    {
        var (r, c) = TestProjects.AshgroveFeet();
        string header = CoordinateCsvWriter.Write(r, c).Split('\n')[0];
        Assert.Equal("id,easting_ft,northing_ft,height_ft,sd_e_ft,sd_n_ft,sd_h_ft,ellipse_a_ft,ellipse_b_ft," +
                     "ellipse_azimuth_deg,held,weighted,variance_factor_basis", header);
    }
}

/// <summary>The JSON result reaches its stream in pieces while it is written, not as one finished buffer.</summary>
public class JsonStreamingTests
{
    private sealed class CountingStream : MemoryStream
    {
        public int Writes { get; private set; }

        public override void Write(byte[] buffer, int offset, int count)
        {
            Writes++;
            base.Write(buffer, offset, count);
        }

        public override void Write(ReadOnlySpan<byte> buffer)
        {
            Writes++;
            base.Write(buffer);
        }
    }

    [Fact]
    public void ALargeResultIsWrittenInPiecesOfAboutTheThreshold()
    {
        var network = SyntheticNetworks.Create(new SyntheticNetworkSpec(SyntheticNetworkKind.Plane, 200, Seed: 5));
        var report = ResultReport.Build(Adjuster.Adjust(network),
            new ReportContext("net200.yaml", TestProjects.RunDate, ProjectUnits.Default));
        using var stream = new CountingStream();
        JsonResultWriter.Write(stream, report);
        Assert.True(stream.Length > 6 * JsonSink.Threshold, $"only {stream.Length} bytes; test too small");
        // passed on whenever a piece reaches the threshold: never the whole document in one buffer
        Assert.True(stream.Writes >= stream.Length / (2 * JsonSink.Threshold), $"{stream.Writes} writes");
    }
}
