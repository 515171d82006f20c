using System.Globalization;
using System.Text.Json;
using NetAdjust.Adjustment;
using NetAdjust.Geodesy;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.IO.Tests.Schemas;
using NetAdjust.Units;

namespace NetAdjust.IO.Tests.Results;

/// <summary>The GNSS baselines in the text and HTML reports and the JSON result (docs/output-format.md, "GNSS
/// baselines").</summary>
public sealed class GnssOutputTests
{
    private const string Head = """
        project: Harrowdene GNSS control (invented)
        crs: EPSG:25833
        grid: {distances: grid, geoid_separation: 45.2}
        points:
          - {id: GA1, e: 512300.000, n: 5262100.000, h: 412.300, fix: enh}
          - {id: GA2, e: 516850.5, n: 5263402.0, h: 455.5}
          - {id: GA3, e: 515204.5, n: 5258311.7, h: 390.4}
          - {id: GA4, e: 511093.0, n: 5257619.1, h: 501.5}

        """;

    private static readonly (string Id, double E, double N, double H)[] Truth =
    [
        ("GA1", 512_300.000, 5_262_100.000, 412.300), ("GA2", 516_850.412, 5_263_402.187, 455.812),
        ("GA3", 515_204.733, 5_258_311.504, 390.127), ("GA4", 511_093.250, 5_257_618.926, 501.744),
    ];

    /// <summary>An invented project: six baselines from the truth plus small invented errors (mm), one of them with
    /// 5 cm added in up when <paramref name="blunder"/>; optional frame parameters.</summary>
    internal static string Project(bool blunder, string frameLines = "")
    {
        var projection = ProjectReader.Parse(Head, "g.yaml", "/x", _ => "").Grid!.Projection!;
        (double X, double Y, double Z) Xyz(int i)
        {
            var (lat, lon) = projection.Inverse(Truth[i].E, Truth[i].N);
            var g = Geocentric.ToGeocentric(projection.Ellipsoid, new GeodeticPosition(Angle.FromRadians(lat),
                Angle.FromRadians(lon), Length.FromMetres(Truth[i].H + 45.2)));
            return (g.X.Metres, g.Y.Metres, g.Z.Metres);
        }
        (int A, int B)[] pairs = [(0, 1), (0, 2), (0, 3), (1, 2), (1, 3), (2, 3)];
        double[][] errors = [[1.2, -0.8, 2.1], [-1.9, 0.4, -1.1], [0.7, 1.5, -2.6], [-0.3, -1.2, 1.8],
            [1.1, 0.9, 0.5], [-0.6, -0.2, -1.4]];
        var sb = new System.Text.StringBuilder(Head);
        sb.Append("gnss:\n  frame: \"ETRF2000 @ 2026.9\"\n  groups:\n    - {id: S1, scale: 1.2}\n").Append(frameLines)
          .Append("  baselines:\n");
        for (int k = 0; k < pairs.Length; k++)
        {
            var (a, b) = (Xyz(pairs[k].A), Xyz(pairs[k].B));
            double[] d = [b.X - a.X + (errors[k][0] / 1000), b.Y - a.Y + (errors[k][1] / 1000),
                b.Z - a.Z + (errors[k][2] / 1000)];
            if (blunder && k == 4)
            {
                var (lat, lon) = projection.Inverse(Truth[1].E, Truth[1].N);
                double[] up = [Math.Cos(lat) * Math.Cos(lon), Math.Cos(lat) * Math.Sin(lon), Math.Sin(lat)];
                for (int c = 0; c < 3; c++) d[c] += 0.05 * up[c];
            }
            string F(double v) => v.ToString("F4", CultureInfo.InvariantCulture);
            sb.Append($"    - {{from: {Truth[pairs[k].A].Id}, to: {Truth[pairs[k].B].Id}, ")
              .Append($"dx: {F(d[0])}, dy: {F(d[1])}, ")
              .Append($"dz: {F(d[2])}, sd: [0.002, 0.0018, 0.0035], corr: [0.3, -0.4, -0.2]")
              .Append(k < 3 ? ", group: S1}\n" : "}\n");
        }
        return sb.ToString();
    }

    private static (AdjustmentResult, ReportContext) Adjusted(string yaml)
    {
        var p = ProjectReader.Parse(yaml, "g.yaml", "/x", _ => "");
        var r = Adjuster.Adjust(p.Network, p.Options);
        return (r, new ReportContext("g.yaml", new DateOnly(2026, 12, 1), p.Units) { GnssFrame = p.GnssFrame });
    }

    [Fact]
    public void TheJsonResultCarriesTheBaselinesAndIsValidAgainstTheSchema()
    {
        var (r, c) = Adjusted(Project(blunder: true, "  frame_parameters: rotations\n  frame_rotation_sd: 1\n"));
        using var doc = JsonDocument.Parse(JsonResultWriter.Write(r, c));
        Assert.Empty(SchemaValidation.ResultErrors(doc.RootElement));
        var g = doc.RootElement.GetProperty("gnss");
        Assert.Equal("ETRF2000 @ 2026.9", g.GetProperty("frame").GetString());
        var baselines = g.GetProperty("baselines").EnumerateArray().ToList();
        Assert.Equal(6, baselines.Count);
        Assert.Equal("S1", baselines[0].GetProperty("group").GetString());
        Assert.Equal(1.2, baselines[0].GetProperty("scale").GetDouble());
        Assert.Equal(3, baselines[0].GetProperty("components").GetArrayLength());
        // the blundered baseline GA2→GA4 fails its vector test
        Assert.False(baselines[4].GetProperty("vector_test").GetProperty("passed").GetBoolean());
        Assert.Equal(3, g.GetProperty("frame_parameters").GetArrayLength());
        Assert.Equal("rx", g.GetProperty("frame_parameters")[0].GetProperty("parameter").GetString());
    }

    [Fact]
    public void TheTextAndHtmlReportsShowTheBaselineSection()
    {
        var (r, c) = Adjusted(Project(blunder: true));
        string text = TextReportWriter.Write(r, c);
        Assert.Contains("GNSS BASELINES (frame ETRF2000 @ 2026.9;", text);
        Assert.Contains("GNSS BASELINE COMPONENTS", text);
        string row = text.Split('\n').First(l => l.StartsWith("  GA2      GA4", StringComparison.Ordinal));
        Assert.EndsWith("FAIL", row);
        Assert.All(text.Split('\n'), l => Assert.True(l.Length <= 100, l)); // the report is at most 100 wide
        Assert.DoesNotContain("FRAME PARAMETERS", text);
        string html = HtmlReportWriter.Write(r, c);
        Assert.Contains("<section id=\"gnss\">", html);
        Assert.Contains("✗ rejected", html);
    }

    [Fact]
    public void AProjectWithoutBaselinesHasNoGnssSection()
    {
        var (r, c) = Adjusted(Head + "levelling:\n  - {from: GA1, to: GA2, dh: 43.512, sd: 0.002}\n");
        Assert.DoesNotContain("GNSS BASELINES", TextReportWriter.Write(r, c));
        using var doc = JsonDocument.Parse(JsonResultWriter.Write(r, c));
        Assert.False(doc.RootElement.TryGetProperty("gnss", out _));
    }
}
