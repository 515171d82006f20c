using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.Statistics;

namespace NetAdjust.IO.Tests.Results;

/// <summary>Regression tests for the text report found in review.</summary>
public class ReportFormatTests
{
    private static string Report(string yaml)
    {
        var p = ProjectReader.Parse(yaml, "r.yaml", Path.GetTempPath(), File.ReadAllText);
        var r = Adjuster.Adjust(p.Network, p.Options);
        return TextReportWriter.Write(r, new ReportContext("r.yaml", new DateOnly(2026, 12, 1), p.Units));
    }

    [Theory]
    [InlineData("dms", "3", "359-59-59.6", "180-00-00", " 0-00-00 ")]
    [InlineData("gon", "1", "399.9970", "200.00", " 0.00 ")]
    public void AnEllipseAzimuthJustBelowAHalfTurnPrintsAsZero(string angle, string azimuthSd, string azimuth,
        string forbidden, string zero)
    {
        // Convention (docs/methods.md, docs/glossary.md): the azimuth of the semi-major axis is in [0°, 180°)
        // ([0, 200) gon).
        // A point fixed by a distance (3 mm) and an azimuth (3", or 1 mgon) 0.4" (3 mgon) west of north, 100 m away,
        // has its major axis along the line, at 179-59-59.6 (199.997 gon): rounded in the project's angle unit (whole
        // seconds, or two decimals of a gon) it must print 0-00-00 (0.00), not the out-of-range 180-00-00 (200.00).
        string yaml = $$"""
            units: {length: m, angle: {{angle}}}
            default_sd: {distance: 3 mm, azimuth: {{azimuthSd}}}
            points:
              - {id: A, e: 1000, n: 1000, fix: en}
              - {id: B, e: 999.9, n: 1100}
            setups:
              - at: A
                distances:
                  - {to: B, value: 100.001}
                azimuths:
                  - {to: B, value: {{azimuth}}}
            """;
        var lines = Report(yaml).Split('\n');
        string ellipse = lines.SkipWhile(l => !l.StartsWith("ERROR ELLIPSES", StringComparison.Ordinal)).First(l =>
            l.StartsWith("  B ", StringComparison.Ordinal));
        string relative = lines.SkipWhile(l => !l.StartsWith("RELATIVE ERROR ELLIPSES",
            StringComparison.Ordinal)).First(l => l.StartsWith("  A ", StringComparison.Ordinal));
        foreach (var line in new[] { ellipse, relative })
        {
            Assert.DoesNotContain(forbidden, line);
            Assert.Contains(zero, line);
        }
    }

    [Fact]
    public void ADirectionJustBelowAFullTurnIsNotPrintedAs360()
    {
        // docs/glossary.md (common practice): directions and orientations are in [0°, 360°). 359-59-59.98 rounds to the
        // report's 0.1" as 0-00-00.0, which is how it must be written (it was "360-00-00.0").
        const string yaml = """
            units: {length: m, angle: dms}
            default_sd: {direction: 2, distance: 3 mm}
            points:
              - {id: A, e: 1000, n: 1000, fix: en}
              - {id: B, e: 1000, n: 1100, fix: en}
              - {id: C, e: 1100, n: 1000}
            setups:
              - at: A
                directions:
                  - {to: B, value: 359-59-59.98}
                  - {to: C, value: 90-00-00.02}
                distances:
                  - {to: C, value: 100.000}
            """;
        string report = Report(yaml);
        Assert.DoesNotContain("360-00-00", report);
        var row = report.Split('\n').First(l => l.StartsWith("     1 direction", StringComparison.Ordinal));
        Assert.Contains("   0-00-00.0 ", row);
    }

    private static (Adjustment.AdjustmentResult, ReportContext) Adjusted(string yaml)
    {
        var p = ProjectReader.Parse(yaml, "r.yaml", Path.GetTempPath(), File.ReadAllText);
        return (Adjuster.Adjust(p.Network, p.Options), new ReportContext("r.yaml", new DateOnly(2026, 12, 1), p.Units));
    }

    [Fact]
    public void ExchangeFilesAndTheHtmlReportKeepAzimuthsInTheirRangeAfterRounding()
    {
        // docs/glossary.md: ellipse azimuths in [0°, 180°), directions in [0°, 360°). A point 100 m north of A, fixed
        // by a distance (3 mm) and an azimuth (3") 0.1" west of north: its major axis is at 179.99997°, which
        // rounds to 180.0000 at four decimals and must be written 0.0000; the direction 359-59-59.98 must be
        // written 0-00-00.0.
        const string yaml = """
            units: {length: m, angle: dms}
            default_sd: {distance: 3 mm, azimuth: 3, direction: 2}
            points:
              - {id: A, e: 1000, n: 1000, fix: en}
              - {id: B, e: 1000, n: 1100}
              - {id: C, e: 1100, n: 1000, fix: en}
            setups:
              - at: A
                distances:
                  - {to: B, value: 100.001}
                azimuths:
                  - {to: B, value: 359-59-59.9}
                directions:
                  - {to: B, value: 359-59-59.98}
                  - {to: C, value: 90-00-00.02}
            """;
        var (r, c) = Adjusted(yaml);
        var b = r.Analysis.Points.Single(p => p.Id == "B").Ellipse!.Value;
        Assert.InRange(b.AzimuthDegrees, 179.99995, 180.0); // the case this test is about
        string csv = CoordinateCsvWriter.Write(r, c);
        var row = csv.Split('\n').Single(l => l.StartsWith("B,", StringComparison.Ordinal)).Split(',');
        Assert.Equal("0.0000", row[9]);
        string geo = GeoJsonWriter.Write(r, c);
        Assert.DoesNotContain("180.0", geo);
        string html = HtmlReportWriter.Write(r, c);
        Assert.DoesNotContain("360-00-00", html);
        Assert.DoesNotContain("180-00-00", html);
    }

    [Fact]
    public void TheRedundancySumOfANetworkWithoutRedundancyIsNotPrintedNegative()
    {
        // r = 0: Σ rᵢ is zero up to rounding and must not print as "-0.000" (common practice).
        const string yaml = """
            units: {length: m, angle: dms}
            default_sd: {distance: 3 mm, azimuth: 3}
            points:
              - {id: A, e: 1000, n: 1000, fix: en}
              - {id: B, e: 1000.5, n: 1100}
            setups:
              - at: A
                distances:
                  - {to: B, value: 100.001}
                azimuths:
                  - {to: B, value: 359-59-50}
            """;
        Assert.Contains("Sum of redundancy numbers 0.000 (degrees of freedom 0)", Report(yaml));
    }
}
