using System.Text.RegularExpressions;
using NetAdjust.IO.Results;
using NetAdjust.Statistics;

namespace NetAdjust.IO.Tests.Results;

/// <summary>The HTML report and the SVG plot opened in real headless Chromium.</summary>
public sealed class HtmlReportBrowserTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("netadjust-browser-").FullName;

    public void Dispose()
    {
        // For looking at the pages and screenshots by eye: NETADJUST_KEEP_BROWSER_OUTPUT=/some/folder.
        if (Environment.GetEnvironmentVariable("NETADJUST_KEEP_BROWSER_OUTPUT") is { Length: > 0 } keep)
        {
            Directory.CreateDirectory(keep);
            foreach (var f in Directory.GetFiles(_dir)) File.Copy(f, Path.Combine(keep, Path.GetFileName(f)), overwrite: true);
        }
        try { Directory.Delete(_dir, recursive: true); } catch (IOException) { }
    }

    private string WriteDemoReport(IReadOnlyList<double?>? w = null)
    {
        var (r, c) = TestProjects.Demo();
        string path = Path.Combine(_dir, "report.html");
        File.WriteAllText(path, HtmlReportWriter.Write(ResultReport.Build(r, c).WithStandardisedResiduals(w)));
        return path;
    }

    [ChromiumFact]
    public void ConsoleCheckDetectsAnErrorInAControlPage()
    {
        // Control for the check below: a page that loads an outside image under the report's own policy must
        // produce a console message, or the "no console errors" check could not fail.
        string path = Path.Combine(_dir, "control.html");
        File.WriteAllText(path, "<!DOCTYPE html><html><head><meta charset=\"utf-8\"><meta http-equiv=\"Content-Security-Policy\" content=\"default-src 'none'\">" +
                                "</head><body><img src=\"https://example.invalid/x.png\" alt=\"\"></body></html>");
        var run = Chromium.Open(path, "--dump-dom");
        Assert.NotEmpty(run.ConsoleMessages);
    }

    [ChromiumFact]
    public void ReportRendersWithoutConsoleMessagesAndHoldsEveryEllipseAndPointId()
    {
        var (r, _) = TestProjects.Demo();
        var run = Chromium.Open(WriteDemoReport(), "--dump-dom");
        Assert.Equal(0, run.ExitCode);
        Assert.Empty(run.ConsoleMessages);
        string dom = run.Stdout;
        Assert.Contains("<svg", dom);

        // One ellipse element per point not held in plan (the 8 plan points less the 2 held).
        var unfixed = r.Points.Where(p => ReportFigures.HasPlan(p) && !ReportFigures.IsPlanFixed(p)).Select(p => p.Id).ToList();
        var drawn = Regex.Matches(dom, "<ellipse class=\"ellipse\" data-point=\"([^\"]+)\"").Select(m => m.Groups[1].Value).ToList();
        Assert.Equal(unfixed, drawn);
        Assert.Equal(6, drawn.Count);

        // The coordinate table holds every point id, the observation table every observation.
        foreach (var p in r.Points) Assert.Contains($"<td class=\"id\">{p.Id}</td>", dom);
        var coordinates = Regex.Match(dom, "<section id=\"coordinates\">.*?</section>", RegexOptions.Singleline).Value;
        Assert.Equal(r.Points.Count, Regex.Matches(coordinates, "<tr>").Count - 1);
        var observations = Regex.Match(dom, "<section id=\"observations\">.*?</section>", RegexOptions.Singleline).Value;
        Assert.Equal(r.Observations.Count, Regex.Matches(observations, "<tr[ >]").Count - 1);
    }

    [ChromiumFact]
    public void ReportWithStandardisedResidualsRendersHistogramAndHighlights()
    {
        var (r, _) = TestProjects.Demo();
        // Invented w-values (the statistics are tested elsewhere): observation 11 fails the w-test.
        var w = r.Observations.Select(o => (double?)(o.Index == 10 ? 4.2 : ((o.Index % 7) - 3) * 0.4)).ToList();
        string page = WriteDemoReport(w);
        var run = Chromium.Open(page, "--dump-dom");
        Chromium.Open(page, "--screenshot=" + Path.Combine(_dir, "report-with-w.png"), "--window-size=1100,2600");
        Assert.Empty(run.ConsoleMessages);
        Assert.Contains("class=\"histogram\"", run.Stdout);
        Assert.Contains("class=\"normal-curve\"", run.Stdout);
        var observations = Regex.Match(run.Stdout, "<section id=\"observations\">.*?</section>", RegexOptions.Singleline).Value;
        Assert.Equal(["11"], Regex.Matches(observations, "<tr class=\"fail\"><td class=\"num\">(\\d+)</td>").Select(m => m.Groups[1].Value));
        var summary = Regex.Match(run.Stdout, "<section id=\"summary\">.*?</section>", RegexOptions.Singleline).Value;
        Assert.Contains("<td class=\"num\">4.20</td><td>fails</td>", summary);
        Assert.Contains("obs-fail", run.Stdout);
    }

    [ChromiumFact]
    public void PlotScreenshotIsNotBlankAndShowsPointsAndEllipses()
    {
        var (r, c) = TestProjects.Demo();
        string svg = Path.Combine(_dir, "plot.svg");
        File.WriteAllText(svg, NetworkPlotWriter.WriteDocument(r, c));
        string png = Path.Combine(_dir, "plot.png");
        var run = Chromium.Open(svg, "--screenshot=" + png, "--window-size=960,640");
        Assert.True(File.Exists(png), "no screenshot written: " + run.Stderr);
        Assert.Empty(run.ConsoleMessages);
        var img = PngImage.Read(File.ReadAllBytes(png));
        Assert.Equal(960, img.Width);
        Assert.True(img.LuminanceVariance() > 50, $"screenshot looks blank (luminance variance {img.LuminanceVariance():F1})");
        // The six new points and their ellipses are drawn in their own colours (anti-aliasing: tolerance 12).
        Assert.True(img.CountNear(NetworkPlotWriter.NewColour, 12) > 6 * 30, "too few pixels of the new-point colour");
        Assert.True(img.CountNear(NetworkPlotWriter.EllipseColour, 12) > 6 * 20, "too few pixels of the ellipse colour");
        Assert.True(img.CountNear(NetworkPlotWriter.FixedColour, 12) > 2 * 30, "too few pixels of the fixed-control colour");
    }

    [ChromiumFact]
    public void ReportScreenshotShowsThePlot()
    {
        string png = Path.Combine(_dir, "report.png");
        var run = Chromium.Open(WriteDemoReport(), "--screenshot=" + png, "--window-size=1100,1800");
        Assert.True(File.Exists(png), "no screenshot written: " + run.Stderr);
        var img = PngImage.Read(File.ReadAllBytes(png));
        Assert.True(img.LuminanceVariance() > 50);
        Assert.True(img.CountNear(NetworkPlotWriter.EllipseColour, 12) > 6 * 20, "the plot's ellipses are not visible in the report");
    }

    [ChromiumFact]
    public void PrintingStartsEachSectionOnANewPage()
    {
        string page = WriteDemoReport();
        string pdf = Path.Combine(_dir, "report.pdf");
        Chromium.Open(page, "--no-pdf-header-footer", "--print-to-pdf=" + pdf);
        Assert.True(File.Exists(pdf), "no PDF written");
        string raw = System.Text.Encoding.Latin1.GetString(File.ReadAllBytes(pdf));
        int pages = Regex.Matches(raw, @"/Type\s*/Page(?![a-zA-Z])").Count;
        int sections = Regex.Matches(File.ReadAllText(page), "<section id=").Count;
        Assert.True(sections >= 7, $"{sections} sections");
        // Without the print stylesheet's page breaks the demo report prints on about three A4 pages.
        Assert.True(pages >= sections, $"{pages} printed pages for {sections} sections");
    }

    [ChromiumFact]
    public void BlunderDemoHighlightsTheObservationsFailingTheWTest()
    {
        // data/harrowfield-blunder.yaml (invented demo) carries a simulated blunder: the statistics reject it.
        var project = NetAdjust.IO.Project.ProjectReader.Read(Path.Combine(TestProjects.RepoRoot, "data", "harrowfield-blunder.yaml"));
        var r = NetAdjust.Adjustment.Adjuster.Adjust(project.Network, project.Options);
        var c = new ReportContext("data/harrowfield-blunder.yaml", TestProjects.RunDate, project.Units);
        var failing = r.Analysis.Observations.Where(t => t.WPassed == false && t.Flag != NetAdjust.Statistics.ObservationFlag.Excluded)
            .Select(t => (t.Index + 1).ToString(System.Globalization.CultureInfo.InvariantCulture)).ToList();
        Assert.NotEmpty(failing);
        string path = Path.Combine(_dir, "blunder.html");
        File.WriteAllText(path, HtmlReportWriter.Write(r, c));
        var run = Chromium.Open(path, "--dump-dom");
        Assert.Empty(run.ConsoleMessages);
        string dom = run.Stdout;
        var observations = Regex.Match(dom, "<section id=\"observations\">.*?</section>", RegexOptions.Singleline).Value;
        Assert.Equal(failing, Regex.Matches(observations, "<tr class=\"fail\"><td class=\"num\">(\\d+)</td>").Select(m => m.Groups[1].Value));
        var highlighted = Regex.Matches(dom, "<line class=\"obs obs-fail\"[^>]*><title>#(\\d+) ").Select(m => m.Groups[1].Value).Distinct().ToList();
        Assert.Equal(failing, highlighted);
        Assert.Contains("class=\"histogram\"", dom);
    }
}
