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
            foreach (var f in Directory.GetFiles(_dir))
                File.Copy(f, Path.Combine(keep, Path.GetFileName(f)), overwrite: true);
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
        File.WriteAllText(path,
            "<!DOCTYPE html><html><head><meta charset=\"utf-8\"><meta http-equiv=\"Content-Security-Policy\" " +
            "content=\"default-src 'none'\">" +
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
        var unfixed = r.Points.Where(p => ReportFigures.HasPlan(p) && !ReportFigures.IsPlanFixed(p)).Select(p =>
            p.Id).ToList();
        var drawn = Regex.Matches(dom, "<ellipse class=\"ellipse\" data-point=\"([^\"]+)\"").Select(m =>
            m.Groups[1].Value).ToList();
        Assert.Equal(unfixed, drawn);
        Assert.Equal(6, drawn.Count);

        // The coordinate table holds every point id, the observation table every observation.
        foreach (var p in r.Points) Assert.Contains($"<td class=\"id\">{p.Id}</td>", dom);
        var coordinates = Regex.Match(dom, "<section id=\"coordinates\">.*?</section>", RegexOptions.Singleline).Value;
        Assert.Equal(r.Points.Count, Regex.Matches(coordinates, "<tr>").Count - 1);
        var observations = Regex.Match(dom, "<section id=\"observations\">.*?</section>",
            RegexOptions.Singleline).Value;
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
        var observations = Regex.Match(run.Stdout, "<section id=\"observations\">.*?</section>",
            RegexOptions.Singleline).Value;
        Assert.Equal(["11"],
            Regex.Matches(observations, "<tr class=\"fail\"><td class=\"num\">(\\d+)</td>").Select(m =>
            m.Groups[1].Value));
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
        Assert.True(img.LuminanceVariance() > 50,
            $"screenshot looks blank (luminance variance {img.LuminanceVariance():F1})");
        // The six new points and their ellipses are drawn in their own colours (anti-aliasing: tolerance 12).
        Assert.True(img.CountNear(NetworkPlotWriter.NewColour, 12) > 6 * 30, "too few pixels of the new-point colour");
        Assert.True(img.CountNear(NetworkPlotWriter.EllipseColour, 12) > 6 * 20,
            "too few pixels of the ellipse colour");
        Assert.True(img.CountNear(NetworkPlotWriter.FixedColour, 12) > 2 * 30,
            "too few pixels of the fixed-control colour");
    }

    [ChromiumFact]
    public void ReportScreenshotShowsThePlot()
    {
        string png = Path.Combine(_dir, "report.png");
        var run = Chromium.Open(WriteDemoReport(), "--screenshot=" + png, "--window-size=1100,1800");
        Assert.True(File.Exists(png), "no screenshot written: " + run.Stderr);
        var img = PngImage.Read(File.ReadAllBytes(png));
        Assert.True(img.LuminanceVariance() > 50);
        Assert.True(img.CountNear(NetworkPlotWriter.EllipseColour, 12) > 6 * 20,
            "the plot's ellipses are not visible in the report");
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
        var project = NetAdjust.IO.Project.ProjectReader.Read(Path.Combine(TestProjects.RepoRoot, "data",
            "harrowfield-blunder.yaml"));
        var r = NetAdjust.Adjustment.Adjuster.Adjust(project.Network, project.Options);
        var c = new ReportContext("data/harrowfield-blunder.yaml", TestProjects.RunDate, project.Units);
        var failing = r.Analysis.Observations.Where(t => t.WPassed == false &&
            t.Flag != NetAdjust.Statistics.ObservationFlag.Excluded)
            .Select(t => (t.Index + 1).ToString(System.Globalization.CultureInfo.InvariantCulture)).ToList();
        Assert.NotEmpty(failing);
        string path = Path.Combine(_dir, "blunder.html");
        File.WriteAllText(path, HtmlReportWriter.Write(r, c));
        var run = Chromium.Open(path, "--dump-dom");
        Assert.Empty(run.ConsoleMessages);
        string dom = run.Stdout;
        var observations = Regex.Match(dom, "<section id=\"observations\">.*?</section>",
            RegexOptions.Singleline).Value;
        Assert.Equal(failing,
            Regex.Matches(observations, "<tr class=\"fail\"><td class=\"num\">(\\d+)</td>").Select(m =>
            m.Groups[1].Value));
        var highlighted = Regex.Matches(dom, "<line class=\"obs obs-fail\"[^>]*><title>#(\\d+) ").Select(m =>
            m.Groups[1].Value).Distinct().ToList();
        Assert.Equal(failing, highlighted);
        Assert.Contains("class=\"histogram\"", dom);
    }

    [ChromiumFact]
    public void StatisticsSectionsAreTablesWithUnitsCountedAgainstTheJson()
    {
        // data/harrowfield-blunder.yaml (invented demo) with the blunder hunt: its simulated blunder is set aside.
        var project = NetAdjust.IO.Project.ProjectReader.Read(
            Path.Combine(TestProjects.RepoRoot, "data", "harrowfield-blunder.yaml"));
        var hunt = NetAdjust.Procedures.DataSnooping.Run(project.Network, project.Options);
        var c = new ReportContext("data/harrowfield-blunder.yaml", TestProjects.RunDate, project.Units) { Hunt = hunt };
        var model = ResultReport.Build(hunt.Final, c);
        string path = Path.Combine(_dir, "tables.html");
        File.WriteAllText(path, HtmlReportWriter.Write(model));
        var run = Chromium.Open(path, "--dump-dom");
        Chromium.Open(path, "--screenshot=" + Path.Combine(_dir, "tables.png"), "--window-size=1100,4000");
        Assert.Empty(run.ConsoleMessages);
        string dom = run.Stdout;
        Assert.DoesNotContain("<pre", dom);

        using var json = System.Text.Json.JsonDocument.Parse(JsonResultWriter.Write(model));
        var root = json.RootElement;
        int Rows(string id)
        {
            var section = Regex.Match(dom, $"<section id=\"{id}\"[^>]*>.*?</section>", RegexOptions.Singleline).Value;
            Assert.True(section.Length > 0, "no section " + id);
            Assert.Contains("<table", section);
            var body = Regex.Match(section, "<tbody>.*?</tbody>", RegexOptions.Singleline).Value;
            return Regex.Matches(body, "<tr[ >]").Count;
        }
        Assert.Equal(root.GetProperty("observations").GetArrayLength(), Rows("observation-tests"));
        Assert.Equal(root.GetProperty("relative").GetArrayLength(), Rows("relative"));
        Assert.Equal(root.GetProperty("blunder_hunt").GetProperty("rounds").GetArrayLength(), Rows("blunder-hunt"));
        Assert.True(Rows("ellipses") > 0);

        // Units sit in the column headers; numbers are right-aligned.
        var tests = Regex.Match(dom, "<section id=\"observation-tests\".*?</section>", RegexOptions.Singleline).Value;
        Assert.Contains("<th class=\"num\">Residual (m or arcsec)</th>", tests);
        Assert.Contains("<th class=\"num\">Ext.rel. (m)</th>", tests);
        var ellipses = Regex.Match(dom, "<section id=\"ellipses\".*?</section>", RegexOptions.Singleline).Value;
        // azimuths in the project's angle unit, as in the coordinate table and the plot
        Assert.Contains("<th class=\"num\">Azimuth (d-mm-ss)</th>", ellipses);

        // The round that set the blunder aside is marked by a symbol, not by colour alone.
        var rounds = Regex.Match(dom, "<section id=\"blunder-hunt\".*?</section>", RegexOptions.Singleline).Value;
        int setAside = hunt.Rounds.Count(x => x.SetAside);
        Assert.True(setAside > 0);
        const string failMark = "<tr class=\"fail\"><td class=\"mark\"><span title=\"fails\">✗</span>";
        Assert.Equal(setAside, Regex.Matches(rounds, failMark).Count);
        Assert.Equal(hunt.Rounds.Count - setAside, Regex.Matches(rounds, "<tr><td class=\"mark\"></td>").Count);
    }

    [ChromiumFact]
    public void SequenceReportShowsTheComparisonAsTables()
    {
        // data/harrowgate-control.yaml (invented demo): one mark was moved in the simulation, so the control fails.
        var project = NetAdjust.IO.Project.ProjectReader.Read(
            Path.Combine(TestProjects.RepoRoot, "data", "harrowgate-control.yaml"));
        var seq = NetAdjust.Procedures.AdjustmentSequence.Run(project.Network, project.Options);
        var c = new ReportContext("data/harrowgate-control.yaml", TestProjects.RunDate, project.Units);
        string path = Path.Combine(_dir, "sequence.html");
        File.WriteAllText(path, HtmlReportWriter.Write(ResultReport.Build(seq, c, minimal: false)));
        var run = Chromium.Open(path, "--dump-dom");
        Assert.Empty(run.ConsoleMessages);
        string dom = run.Stdout;
        int Rows(string id) => Regex.Matches(Regex.Match(dom, $"<section id=\"{id}\"[^>]*>.*?</section>",
            RegexOptions.Singleline).Value, "<tr[ >]").Count - 1;
        Assert.Equal(2, Rows("sequence-solutions"));
        Assert.Equal(seq.Discrepancies.Count, Rows("sequence-discrepancies"));
        Assert.Equal(seq.Shifts.Count, Rows("sequence-shifts"));
        Assert.Equal(seq.Testability.Count, Rows("sequence-testability"));
        Assert.Equal(seq.Minimal.Points.Count, Rows("sequence-other-solution"));
        Assert.False(seq.Test.Passed);
        Assert.Contains("<p class=\"verdict fail\"><strong>✗ Decision: the control does not fit", dom);
        // every discrepancy row above the w-test's critical value carries the symbol as well as the class
        int failing = seq.Discrepancies.Count(d => d.MaxAbsW > seq.Minimal.Analysis.WCritical);
        var discrepancies = Regex.Match(dom, "<section id=\"sequence-discrepancies\".*?</section>",
            RegexOptions.Singleline).Value;
        Assert.True(failing > 0);
        const string failMark = "<tr class=\"fail\"><td class=\"mark\"><span title=\"fails\">✗</span>";
        Assert.Equal(failing, Regex.Matches(discrepancies, failMark).Count);
    }

    [ChromiumFact]
    public void HistogramAxisLabelsNeverOverlap()
    {
        // The browser measures every axis label of histograms whose |w| reach from 3 to 2,000 (and one whose values
        // all fall in one bar, for a tall density axis) and counts the pairs of labels on one axis whose boxes
        // meet. A control figure with two labels drawn on top of each other must count one, or the check could not
        // fail.
        var figures = new List<string>
        {
            "<svg xmlns=\"http://www.w3.org/2000/svg\" class=\"histogram\" width=\"200\" height=\"50\">" +
            "<text class=\"tick-w\" x=\"50\" y=\"30\">-10</text>" +
            "<text class=\"tick-w\" x=\"58\" y=\"30\">-9</text></svg>",
        };
        foreach (double top in new[] { 3.0, 25.0, 140.0, 2000.0 })
            figures.Add(HtmlReportWriter.Histogram([-top, -1.2, -0.3, 0.1, 0.4, 0.9, 1.7, top], 3.29));
        figures.Add(HtmlReportWriter.Histogram(Enumerable.Repeat(0.1, 40).Append(37.0).ToList(), 3.29));
        const string script = """
            <script>
            const out = [];
            for (const svg of document.querySelectorAll('svg.histogram')) {
              let overlaps = 0;
              for (const cls of ['tick-w', 'tick-density']) {
                const boxes = [...svg.querySelectorAll('text.' + cls)].map(t => t.getBBox());
                for (let i = 0; i < boxes.length; i++)
                  for (let j = i + 1; j < boxes.length; j++) {
                    const a = boxes[i], b = boxes[j];
                    if (a.x < b.x + b.width && b.x < a.x + a.width && a.y < b.y + b.height && b.y < a.y + a.height)
                      overlaps++;
                  }
              }
              out.push(overlaps + '/' + svg.querySelectorAll('text.tick-w').length + '/' +
                svg.querySelectorAll('text.tick-density').length);
            }
            document.getElementById('result').textContent = out.join(' ');
            </script>
            """;
        string path = Path.Combine(_dir, "histograms.html");
        File.WriteAllText(path, "<!DOCTYPE html><html><head><meta charset=\"utf-8\"></head><body>" +
            string.Join("\n", figures) + "<p id=\"result\"></p>" + script + "</body></html>");
        var run = Chromium.Open(path, "--dump-dom");
        Assert.Empty(run.ConsoleMessages);
        var result = Regex.Match(run.Stdout, "<p id=\"result\">([^<]*)</p>").Groups[1].Value.Split(' ');
        Assert.Equal(figures.Count, result.Length);
        Assert.StartsWith("1/", result[0]);
        foreach (var figure in result.Skip(1))
        {
            var parts = figure.Split('/').Select(int.Parse).ToArray();
            Assert.Equal(0, parts[0]);
            Assert.True(parts[1] >= 3, figure); // the w axis keeps labels
            Assert.True(parts[2] >= 2, figure);
        }
    }

    [ChromiumFact]
    public void ErrorBudgetsAreATableWithARowPerLineOfTheTextReport()
    {
        // The demo (data/brackenmoor.yaml, invented) is weighted from specifications: its budget summary is a
        // table, one row per contribution line (and total) of the text report's ERROR BUDGETS, and no section of
        // the report is preformatted text.
        var (r, c) = TestProjects.Demo();
        var model = ResultReport.Build(r, c);
        string text = TextReportWriter.Write(model);
        var budget = text[text.IndexOf("ERROR BUDGETS", StringComparison.Ordinal)..];
        budget = budget[..budget.IndexOf("\n\n", StringComparison.Ordinal)];
        int lines = budget.Split('\n').Count(l => l.StartsWith("    ", StringComparison.Ordinal));
        string path = Path.Combine(_dir, "budgets.html");
        File.WriteAllText(path, HtmlReportWriter.Write(model));
        var run = Chromium.Open(path, "--dump-dom");
        Assert.Empty(run.ConsoleMessages);
        string dom = run.Stdout;
        Assert.DoesNotContain("<pre", dom);
        var section = Regex.Match(dom, "<section id=\"budgets\".*?</section>", RegexOptions.Singleline).Value;
        Assert.Contains("<th class=\"num\">Root-mean-square (m or arcsec)</th>", section);
        var body = Regex.Match(section, "<tbody>.*?</tbody>", RegexOptions.Singleline).Value;
        Assert.Equal(lines, Regex.Matches(body, "<tr[ >]").Count);
        Assert.Contains("<tr class=\"total\"><td>distance</td><td class=\"num\">7 of 7</td><td>total</td>", body);
    }
}
