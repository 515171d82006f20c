using System.Text.Json;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;

namespace NetAdjust.IO.Tests;

public class JsonResultWriterTests
{
    private static (AdjustmentResult, string) Run()
    {
        const string yaml = """
            project: json check
            units: {length: m, angle: dms}
            default_sd: {direction: 2, distance: 0.003, angle: 3}
            points:
              - {id: A, e: 0, n: 0, fix: en}
              - {id: B, e: 0, n: 300, fix: en}
              - {id: C, e: 200.1, n: 150}
            setups:
              - at: A
                directions:
                  - {to: B, value: 0-00-00}
                  - {to: C, value: 53-07-48.4}
                distances:
                  - {to: C, value: 250.003}
              - at: C
                angles:
                  - {from: A, to: B, value: 106-15-37.0}
            """;
        var p = ProjectReader.Parse(yaml, "j.yaml", "/x", _ => "");
        var r = Adjuster.Adjust(p.Network, p.Options);
        return (r, JsonResultWriter.Write(r, new ReportContext("j.yaml", new DateOnly(2026, 12, 1), p.Units)));
    }

    [Fact]
    public void WritesTheContractKeys()
    {
        var (r, json) = Run();
        using var doc = JsonDocument.Parse(json);
        var root = doc.RootElement;
        Assert.Equal("netadjust-result/1", root.GetProperty("format").GetString());
        var s = root.GetProperty("statistics");
        foreach (var key in new[] { "observations", "unknowns", "degrees_of_freedom", "vtpv", "variance_factor",
            "sigma0", "iterations" })
            Assert.True(s.TryGetProperty(key, out _), key);
        var g = s.GetProperty("global_test");
        foreach (var key in new[] { "alpha", "lower", "upper", "passed" })
            Assert.True(g.TryGetProperty(key, out _), key);
        Assert.Equal(s.GetProperty("observations").GetInt32() - s.GetProperty("unknowns").GetInt32(),
            s.GetProperty("degrees_of_freedom").GetInt32());

        var p = root.GetProperty("points")[0];
        foreach (var key in new[] { "id", "e", "n", "h", "fixed", "sd_e", "sd_n", "sd_h" })
            Assert.True(p.TryGetProperty(key, out _), key);
        Assert.Equal("en", p.GetProperty("fixed").GetString());
        Assert.Equal(JsonValueKind.Null, p.GetProperty("h").ValueKind);

        var obs = root.GetProperty("observations");
        Assert.Equal(r.Observations.Count, obs.GetArrayLength());
        foreach (var o in obs.EnumerateArray())
            foreach (var key in new[] { "index", "kind", "at", "from", "to", "observed", "adjusted", "residual", "sd" })
                Assert.True(o.TryGetProperty(key, out _), key);
        var angle = obs.EnumerateArray().Single(o => o.GetProperty("kind").GetString() == "angle");
        Assert.Equal("C", angle.GetProperty("at").GetString());
        Assert.Equal("A", angle.GetProperty("from").GetString());
        Assert.Equal("B", angle.GetProperty("to").GetString());
        // Angles in decimal degrees, angular sd and residuals in arcseconds.
        Assert.Equal(106 + (15 / 60.0) + (37.0 / 3600), angle.GetProperty("observed").GetDouble(), 9);
        Assert.Equal(3.0, angle.GetProperty("sd").GetDouble(), 9);
        var ar = r.Observations.Single(o => o.Input.Kind == NetAdjust.Network.ObservationKind.Angle).Residual;
        Assert.Equal(ar * NetAdjust.Units.Angle.ArcsecondsPerRadian, angle.GetProperty("residual").GetDouble(), 9);
        var dist = obs.EnumerateArray().Single(o => o.GetProperty("kind").GetString() == "distance");
        // every distance names the station it was measured from (docs/output-format.md)
        Assert.Equal(dist.GetProperty("from").GetString(), dist.GetProperty("at").GetString());
        Assert.Equal(0.003, dist.GetProperty("sd").GetDouble(), 12);
    }

    [Fact]
    public void SameResultGivesTheSameBytes()
    {
        Assert.Equal(Run().Item2, Run().Item2);
    }
}
