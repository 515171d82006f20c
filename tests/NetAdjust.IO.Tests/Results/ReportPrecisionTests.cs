using System.Text.Json;
using System.Text.RegularExpressions;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;

namespace NetAdjust.IO.Tests.Results;

/// <summary>
/// Printed numbers follow the data: values are printed to the resolution they were booked to (common practice: a
/// report does not drop digits the surveyor booked, nor invent ones), azimuths have one written form in every
/// human-readable output (the project's angle unit), and every distance row names the station it was measured from.
/// </summary>
public sealed class ReportPrecisionTests
{
    // A small invented 3D site: three plan stations with heights and a benchmark with a height only, levelled to
    // 0.01 mm; distances booked to 0.1 mm.
    internal const string Site = """
        project: Larkbeck yard (invented)
        units: {length: m, angle: dms, angle_sd: arcsec}
        default_sd: {direction: 2.0, distance: 2 mm, height_difference: 0.5 mm}
        points:
          - {id: K1, e: 1000.000, n: 1000.000, h: 50.000, fix: enh}
          - {id: K2, e: 1300.000, n: 1000.000, h: 51.000, fix: en}
          - {id: K3, e: 1150.000, n: 1250.000, h: 52.000}
          - {id: BM9, h: 49.000}
        setups:
          - at: K1
            directions:
              - {to: K2, value: 90-00-00.0}
              - {to: K3, value: 30-57-50.0}
            distances:
              - {to: K2, value: 300.0012}
              - {to: K3, value: 291.5484}
          - at: K3
            directions:
              - {to: K1, value: 210-57-50.0}
              - {to: K2, value: 149-02-10.0}
            distances:
              - {to: K2, value: 291.5463}
        levelling:
          - {from: K1, to: K2, dh: 1.00123}
          - {from: K2, to: K3, dh: 0.99871}
          - {from: K3, to: K1, dh: -1.99998}
          - {from: K1, to: BM9, dh: -1.00042}
        """;

    internal static ResultReport Model()
    {
        var p = ProjectReader.Parse(Site, "larkbeck.yaml", Path.GetTempPath(), _ => throw new IOException("none"));
        var r = Adjuster.Adjust(p.Network, p.Options);
        return ResultReport.Build(r, new ReportContext("larkbeck.yaml", TestProjects.RunDate, p.Units));
    }

    [Fact]
    public void HeightDifferencesBookedToAHundredthOfAMillimetreArePrintedSo()
    {
        var model = Model();
        string text = TextReportWriter.Write(model);
        string html = HtmlReportWriter.Write(model);
        // observed, adjusted, residual and sd of a height difference with five decimals of a metre
        var row = text.Split('\n').First(l => Regex.IsMatch(l, @"^\s+\d+ height\s+K1\s+K2 "));
        Assert.Matches(@"K2\s+1\.00123\s+-?\d\.\d{5}\s+-?\d\.\d{5}\s+\d\.\d{5}$", row);
        Assert.Contains("<td class=\"num\">1.00123</td>", html);
        Assert.Contains("<td class=\"num\">-1.99998</td>", html);
        // the relative height precision follows the levelling too
        var relative = text[text.IndexOf("RELATIVE HEIGHT PRECISION", StringComparison.Ordinal)..];
        Assert.Matches(@"\n  K1\s+K2\s+-?\d\.\d{5}\s+\d\.\d{5}\s+\d\.\d{5}", relative);
        // control: distances booked to 0.1 mm keep four decimals
        var distance = text.Split('\n').First(l => Regex.IsMatch(l, @"^\s+\d+ distance "));
        Assert.Matches(@" 300\.0012\s+\d{3}\.\d{4}\s+-?\d\.\d{4}\s+\d\.\d{4}$", distance);
    }

    [Fact]
    public void BookedDecimalsAreTheFewestThatWriteTheValue()
    {
        // common practice: trailing zeros of one value do not count; the group takes its finest value
        Assert.Equal(3, ReportUnits.BookedDecimals(-0.899));
        Assert.Equal(5, ReportUnits.BookedDecimals(1.82378));
        Assert.Equal(4, ReportUnits.BookedDecimals(189.939 + 0.0001));
        Assert.Equal(0, ReportUnits.BookedDecimals(120));
        Assert.Equal(ReportUnits.MaxDecimals, ReportUnits.BookedDecimals(1.0 / 3));
    }

    [Fact]
    public void EveryDistanceRowShowsTheStationItWasMeasuredFrom()
    {
        var model = Model();
        string text = TextReportWriter.Write(model);
        foreach (var line in text.Split('\n').Where(l => Regex.IsMatch(l, @"^\s+\d+ distance ")))
            Assert.Matches(@"^\s+\d+ distance  K[13]\s", line);
        string html = HtmlReportWriter.Write(model);
        Assert.Matches("<td>distance</td><td class=\"id\">K1</td><td class=\"id\"></td><td class=\"id\">K2</td>",
            html);
        using var json = JsonDocument.Parse(JsonResultWriter.Write(model));
        foreach (var o in json.RootElement.GetProperty("observations").EnumerateArray()
                     .Where(o => o.GetProperty("kind").GetString() == "distance"))
            Assert.Equal(o.GetProperty("from").GetString(), o.GetProperty("at").GetString());
        // a levelled height difference has no station
        var dh = json.RootElement.GetProperty("observations").EnumerateArray()
            .First(o => o.GetProperty("kind").GetString() == "height_difference");
        Assert.Equal(JsonValueKind.Null, dh.GetProperty("at").ValueKind);
    }

    [Fact]
    public void AzimuthsHaveOneFormInEveryReport()
    {
        // The demo (data/brackenmoor.yaml, invented, angles in DMS): each ellipse azimuth is written the same way in
        // the text report, the HTML coordinate table, the HTML ellipse table and the plot.
        var (r, c) = TestProjects.Demo();
        var model = ResultReport.Build(r, c);
        string text = TextReportWriter.Write(model);
        string html = HtmlReportWriter.Write(model);
        string svg = NetworkPlotWriter.WriteDocument(model);
        var ellipses = text[text.IndexOf("ERROR ELLIPSES", StringComparison.Ordinal)..];
        int checkedPoints = 0;
        foreach (Match m in Regex.Matches(ellipses, @"\n  (S\d)\s+\d\.\d{4}\s+\d\.\d{4}\s+(\d{1,3}-\d\d-\d\d) "))
        {
            string id = m.Groups[1].Value, az = m.Groups[2].Value;
            Assert.Contains($"{id}: a = ", svg);
            Assert.Contains($"azimuth of a {az}</title>", svg);
            Assert.Matches($"<td class=\"id\">{id}</td>.*<td class=\"num\">{az}</td>", html);
            checkedPoints++;
        }
        Assert.Equal(6, checkedPoints);
        Assert.DoesNotContain("Azimuth (deg)", html);
    }
}
