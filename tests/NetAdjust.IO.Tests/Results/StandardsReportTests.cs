using System.Text.Json;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.IO.Tests.Schemas;
using NetAdjust.Misclosures;
using NetAdjust.Standards;
using NetAdjust.Statistics;

namespace NetAdjust.IO.Tests.Results;

public class StandardsReportTests
{
    private static (AdjustmentResult Result, ReportContext Context) Brackenmoor()
    {
        var project = ProjectReader.Read(Path.Combine(TestProjects.RepoRoot, "data", "brackenmoor.yaml"));
        var r = Adjuster.Adjust(project.Network, project.Options);
        var checks = MisclosureCheck.Run(project.Network, project.Checks);
        AccuracyStandard[] standards =
        [
            AccuracyStandards.Find("alta-nsps-2021")!, AccuracyStandards.Find("fgdc-1998")!,
            AccuracyStandards.Find("fgcc-1984-third")!,
            new("tight", StandardKind.RelativePrecision, "invented") { Constant = 0.001, Ppm = 1 },
        ];
        var c = new ReportContext("data/brackenmoor.yaml", TestProjects.RunDate, project.Units)
        {
            Misclosures = checks, Standards = StandardsCheck.Apply(r, standards, checks),
        };
        return (r, c);
    }

    [Fact]
    public void JsonOfStandardsAndMisclosuresFollowsTheSchema()
    {
        var (r, c) = Brackenmoor();
        using var doc = JsonDocument.Parse(JsonResultWriter.Write(r, c));
        Assert.Empty(SchemaValidation.ResultErrors(doc.RootElement));
        var items = doc.RootElement.GetProperty("standards").GetProperty("items");
        Assert.Contains(items.EnumerateArray(), i => i.GetProperty("standard").GetString() == "fgcc-1984-third");
        Assert.Contains("not a certification", doc.RootElement.GetProperty("standards").GetProperty("caution")
            .GetString());
    }

    [Fact]
    public void TextAndHtmlShowTheStandardsWorstFirstWithTheCaution()
    {
        var (r, c) = Brackenmoor();
        string text = TextReportWriter.Write(r, c);
        Assert.Contains("ACCURACY STANDARDS", text);
        Assert.Contains(StandardsReport.Caution[..40], text);
        // the invented 1 mm + 1 ppm standard fails its worst pair, shown first among its rows
        var tight = text.Split('\n').Where(l => l.StartsWith("  tight ", StringComparison.Ordinal) &&
            (l.EndsWith("FAIL", StringComparison.Ordinal) || l.EndsWith("pass", StringComparison.Ordinal))).ToList();
        Assert.NotEmpty(tight);
        Assert.EndsWith("FAIL", tight[0]);
        var ratios = tight.Select(l => double.Parse(l.Split(' ', StringSplitOptions.RemoveEmptyEntries)[^3],
            System.Globalization.CultureInfo.InvariantCulture)).ToList();
        Assert.Equal(ratios.OrderByDescending(x => x), ratios);
        string html = HtmlReportWriter.Write(r, c);
        Assert.Contains("id=\"accuracy-standards\"", html);
        Assert.Contains("id=\"traverse-misclosures\"", html);
    }

    [Fact]
    public void RelativePrecisionValueIsTheNinetyFivePercentSemiMajorAxis()
    {
        // value = a × √χ²(0.95; 2) (Hoover 1984), allowance = 2 cm + 50 ppm × d (ALTA/NSPS 2021; docs/references.md
        // §6), for every observed pair of the analysis
        var (r, c) = Brackenmoor();
        var alta = c.Standards!.Items.Where(i => i.Standard == "alta-nsps-2021").ToList();
        Assert.Equal(r.Analysis.Relative.Count(p => p.Observed), alta.Count);
        foreach (var p in r.Analysis.Relative.Where(p => p.Observed))
        {
            var item = alta.Single(i => i.Item == $"{p.From}–{p.To}");
            Assert.Equal(p.Ellipse.A * Math.Sqrt(-2 * Math.Log(0.05)), item.Value, 12);
            Assert.Equal(0.02 + (50e-6 * p.Distance), item.Allowance!.Value, 12);
        }
    }

    [Fact]
    public void ProjectSchemaAcceptsChecksAndStandards()
    {
        const string yaml = """
            points: [{id: A, e: 0, n: 0, fix: en}]
            checks: {confidence: 0.95, level_standard: fgcc-1984-third, traverse_ratio: 20000}
            standards:
              - alta-nsps-2021
              - {name: site, kind: relative_precision, constant_mm: 10, ppm: 20, pairs: all, points: [A, B]}
              - {name: geo, kind: geodetic_accuracy, class_mm: 20}
            """;
        Assert.Empty(SchemaValidation.ProjectErrors(yaml));
    }
}
