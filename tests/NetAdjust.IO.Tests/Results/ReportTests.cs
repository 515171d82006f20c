using System.Text.RegularExpressions;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.Statistics;

namespace NetAdjust.IO.Tests.Results;

public class HtmlReportTests
{
    [Fact]
    public void IsSelfContainedWithoutScriptsOrOutsideResources()
    {
        var (r, c) = TestProjects.Demo();
        string html = HtmlReportWriter.Write(r, c);
        Assert.StartsWith("<!DOCTYPE html>", html);
        foreach (var banned in new[] { "<script", "<link", "@import", "url(", " src=", "<iframe", "<object", "<embed", "@font-face" })
            Assert.DoesNotContain(banned, html, StringComparison.OrdinalIgnoreCase);
        // The only absolute URIs are the SVG namespace names (names, never fetched).
        var uris = Regex.Matches(html, "(https?|ftp)://[^\"' <]+").Select(m => m.Value).Distinct().ToList();
        Assert.Equal(["http://www.w3.org/2000/svg"], uris);
        Assert.Contains("Content-Security-Policy", html);
        Assert.Contains("default-src 'none'", html);
    }

    [Fact]
    public void HasAPrintStylesheetWithPageBreaksBetweenSections()
    {
        var (r, c) = TestProjects.Demo();
        string html = HtmlReportWriter.Write(r, c);
        Assert.Contains("@media print", html);
        Assert.Matches(@"@media print \{[^@]*section \{ break-before: page; \}", html);
        foreach (var id in new[] { "summary", "plot", "residuals", "coordinates", "observations", "orientations", "caution" })
            Assert.Contains($"<section id=\"{id}\">", html);
    }

    [Fact]
    public void PlotHasOneEllipsePerUnfixedPlanPointTheMagnificationAndBothScaleBars()
    {
        var (r, c) = TestProjects.AshgroveFeet();
        string svg = NetworkPlotWriter.WriteDocument(r, c);
        Assert.Equal(["B", "C"], Regex.Matches(svg, "<ellipse class=\"ellipse\" data-point=\"([^\"]+)\"").Select(m => m.Groups[1].Value));
        Assert.Matches("Ellipses magnified ×[0-9,]+", svg);
        Assert.Contains("class=\"scale-bar-map\"", svg);
        Assert.Contains("class=\"scale-bar-ellipses\"", svg);
        Assert.Contains("class=\"north-arrow\"", svg);
        Assert.Single(Regex.Matches(svg, "class=\"point point-fixed\" data-point"));
        Assert.Single(Regex.Matches(svg, "class=\"point point-weighted\" data-point"));
        Assert.Single(Regex.Matches(svg, "class=\"point point-new\" data-point"));
        Assert.Contains(" ft</text>", svg); // scale bars in the project's unit
        System.Xml.Linq.XDocument.Parse(svg); // well-formed XML as a standalone file
    }

    [Fact]
    public void EllipseIsDrawnAtItsAzimuthAndMagnifiedSize()
    {
        var (r, c) = TestProjects.AshgroveFeet();
        string svg = NetworkPlotWriter.WriteDocument(r, c);
        var doc = System.Xml.Linq.XDocument.Parse(svg);
        System.Xml.Linq.XNamespace ns = "http://www.w3.org/2000/svg";
        var e = doc.Descendants(ns + "ellipse").Single(x => (string?)x.Attribute("data-point") == "C");
        var el = ReportFigures.Ellipse(r, r.Points.Single(p => p.Id == "C"))!.Value;
        // SVG rotates clockwise on screen; the x axis (east) turned by θ − 90° points along azimuth θ.
        var rot = Regex.Match((string)e.Attribute("transform")!, @"rotate\(([-0-9.]+) ").Groups[1].Value;
        Assert.Equal((el.Azimuth * 180 / Math.PI) - 90, double.Parse(rot, System.Globalization.CultureInfo.InvariantCulture), 0.01);
        double rx = double.Parse((string)e.Attribute("rx")!, System.Globalization.CultureInfo.InvariantCulture);
        double ry = double.Parse((string)e.Attribute("ry")!, System.Globalization.CultureInfo.InvariantCulture);
        Assert.Equal(el.A / el.B, rx / ry, 0.01 * (el.A / el.B));
    }

    [Fact]
    public void HistogramCountsEveryResidualOnce()
    {
        var w = new[] { -5.1, -1.2, -0.3, 0.0, 0.2, 0.49, 0.5, 1.7, 3.3, 4.9 };
        string svg = HtmlReportWriter.Histogram(w, 3.29);
        int total = Regex.Matches(svg, @"<title>(\d+) in \[").Sum(m => int.Parse(m.Groups[1].Value, System.Globalization.CultureInfo.InvariantCulture));
        Assert.Equal(w.Length, total);
        Assert.Contains("class=\"normal-curve\"", svg);
        Assert.Equal(2, Regex.Matches(svg, "class=\"critical\"").Count);
    }

    [Fact]
    public void NiceMagnificationsAreOneTwoOrFiveTimesAPowerOfTen()
    {
        Assert.Equal(5000, NetworkPlotWriter.NiceDown(7300), 9);
        Assert.Equal(2000, NetworkPlotWriter.NiceDown(2000), 9);
        Assert.Equal(1000, NetworkPlotWriter.NiceDown(1999), 9);
        Assert.Equal(0.02, NetworkPlotWriter.NiceDown(0.0312), 12);
    }

    [Fact]
    public void WithoutStandardisedResidualsTheHistogramIsLeftOutWithANote()
    {
        var (r, c) = TestProjects.Demo();
        string html = HtmlReportWriter.Write(ResultReport.Build(r, c).WithStandardisedResiduals(null));
        Assert.DoesNotContain("class=\"histogram\"", html);
        Assert.Contains("No standardised residuals are available", html);
        Assert.DoesNotContain("obs-fail", html);
    }

    [Fact]
    public void SameInputGivesTheSameBytesAndTheRunDateIsTheOnlyDate()
    {
        var (r, c) = TestProjects.Demo();
        string a = HtmlReportWriter.Write(r, c), b = HtmlReportWriter.Write(r, c);
        Assert.Equal(a, b);
        string other = HtmlReportWriter.Write(r, c with { RunDate = new DateOnly(2031, 7, 15) });
        var diff = a.Split('\n').Zip(other.Split('\n')).Where(t => t.First != t.Second).ToList();
        Assert.NotEmpty(diff);
        Assert.All(diff, t => Assert.Equal(t.First.Replace("2026-12-01", "2031-07-15"), t.Second));
        Assert.DoesNotMatch(@"20\d\d-\d\d-\d\d", a.Replace("2026-12-01", ""));
    }
}

public class TextReportTests
{
    public static TheoryData<string> Projects => new() { "demo", "ashgrove" };

    [Theory]
    [MemberData(nameof(Projects))]
    public void EveryLineFitsIn100Columns(string name)
    {
        var (r, c) = name == "demo" ? TestProjects.Demo() : TestProjects.AshgroveFeet();
        foreach (var line in TextReportWriter.Write(r, c).Split('\n'))
            Assert.True(line.Length <= 100, $"{line.Length} columns: {line}");
    }

    [Fact]
    public void SummaryComesFirstThenCoordinatesObservationsAndTheCaution()
    {
        var (r, c) = TestProjects.Demo();
        string t = TextReportWriter.Write(r, c);
        int[] at = [t.IndexOf("SUMMARY\n"), t.IndexOf("Largest standardised residuals"), t.IndexOf("ADJUSTED COORDINATES"),
                    t.IndexOf("OBSERVATIONS ("), t.IndexOf("ERROR ELLIPSES"), t.IndexOf("CAUTION:")];
        Assert.All(at, i => Assert.True(i >= 0));
        Assert.Equal(at.Order(), at);
        Assert.Contains("Datum     : held BK01 (en), BK02 (en), BMK1 (h); weighted none", t);
    }

    [Fact]
    public void SummaryListsTheLargestStandardisedResidualsOfTheAnalysis()
    {
        var (r, c) = TestProjects.Demo();
        string t = TextReportWriter.Write(r, c);
        var listed = System.Text.RegularExpressions.Regex.Matches(t, @"\n    #(\d+) +w = +(-?\d+\.\d\d)  (passes|FAILS)  ").ToList();
        Assert.Equal(5, listed.Count);
        var expected = r.Analysis.Observations.Where(o => o.W is not null).OrderByDescending(o => Math.Abs(o.W!.Value)).ThenBy(o => o.Index).Take(5).ToList();
        for (int k = 0; k < 5; k++)
        {
            Assert.Equal(expected[k].Index + 1, int.Parse(listed[k].Groups[1].Value, System.Globalization.CultureInfo.InvariantCulture));
            Assert.Equal(expected[k].W!.Value, double.Parse(listed[k].Groups[2].Value, System.Globalization.CultureInfo.InvariantCulture), 0.005);
            Assert.Equal(expected[k].WPassed == false ? "FAILS" : "passes", listed[k].Groups[3].Value);
        }
    }

    [Fact]
    public void UsesTheProjectsUnits()
    {
        var (r, c) = TestProjects.AshgroveFeet();
        string t = TextReportWriter.Write(r, c);
        Assert.Contains("lengths international foot (ft), angles gons, angular sd and residuals mgon", t);
        Assert.Contains("Grid      : EPSG:27700", t);
        // The held point A,1 at 1000 ft (304.8 m) is printed in feet.
        Assert.Matches(@"\n  A,1 +1000\.0000 +1000\.0000 ", t);
    }
}

public class CrsKeyTests
{
    private static SurveyProject Parse(string crsLine) => ProjectReader.Parse(
        "project: t\n" + crsLine + "\npoints:\n  - {id: A, e: 0, n: 0, fix: en}\n", "t.yaml", "/nonexistent", _ => throw new IOException());

    [Fact]
    public void ReadsAnEpsgCode() => Assert.Equal("EPSG:27700", Parse("crs: epsg:27700").Crs);

    [Fact]
    public void AbsentMeansLocal() => Assert.Null(Parse("").Crs);

    [Theory]
    [InlineData("crs: 27700")]
    [InlineData("crs: EPSG:27a00")]
    [InlineData("crs: EPSG:12")]
    [InlineData("crs: OSGB36")]
    public void RejectsOtherTextNamingFileLineAndItem(string line)
    {
        var e = Assert.Throws<ProjectFileException>(() => Parse(line));
        Assert.Contains("t.yaml", e.Message);
        Assert.Contains(":2", e.Message);
        Assert.Contains("crs", e.Message);
    }
}
