using System.Text.Json;
using NetAdjust.Procedures;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;

namespace NetAdjust.IO.Tests.Results;

/// <summary>
/// A control mark that only one sight line reaches cannot be checked by the observations (one direction fixes one
/// coordinate of a point, not two: common practice), so the sequence reports it as not testable, with the marks it
/// is joined to, instead of leaving its error to be blamed on another mark.
/// </summary>
public sealed class ControlTestabilityTests
{
    private static SequenceResult Run(string extraPoint, string extraSetup)
    {
        // data/harrowgate-control.yaml (invented demo, four published marks, HV03 disturbed) with a reference mark
        // RM5 added, 350 m from T1 at azimuth 300 degrees and given 5.7 cm off its true place across the line,
        // sighted only by one direction from T1 in a set of its own (with T2 to orient the set).
        string text = File.ReadAllText(Path.Combine(TestProjects.RepoRoot, "data", "harrowgate-control.yaml"))
            .Replace("  - {id: T1}", extraPoint + "\n  - {id: T1}", StringComparison.Ordinal)
            .Replace("setups:\n", "setups:\n" + extraSetup, StringComparison.Ordinal);
        var project = ProjectReader.Parse(text, "harrowgate-rm.yaml", TestProjects.RepoRoot,
            _ => throw new IOException("no files"));
        return AdjustmentSequence.Run(project.Network, project.Options);
    }

    private const string ReferenceMark = "  - {id: RM5, e: 4907.2525, n: 8315.3057, fix: en}";

    private const string OneLine = """
          - at: T1
            directions:
              - {to: T2, value: 95-05-19.9}
              - {to: RM5, value: 300-00-00.0}

        """;

    [Fact]
    public void AMarkOnlyOneLineReachesIsNotTestable()
    {
        var s = Run(ReferenceMark, OneLine);
        var items = s.Testability;
        var rm = Assert.Single(items, x => x.Id == "RM5");
        Assert.False(rm.Testable!.Value);
        Assert.Equal(["T1"], rm.Neighbours);
        // The four published marks stay testable: the observations fix each of them without its given coordinates.
        Assert.All(items.Where(x => x.Id.StartsWith("HV", StringComparison.Ordinal)),
            x => Assert.True(x.Testable!.Value));

        var c = new ReportContext("harrowgate-rm.yaml", TestProjects.RunDate, ProjectUnits.Default);
        string text = SequenceReportWriter.Write(s, c);
        Assert.Contains("\n  RM5          plan   NO       T1\n", text);
        Assert.Contains("\n  HV01         plan   yes\n", text);
        using var json = JsonDocument.Parse(SequenceJsonWriter.Write(s, c));
        var entry = json.RootElement.GetProperty("control_testability").EnumerateArray()
            .Single(e => e.GetProperty("id").GetString() == "RM5");
        Assert.False(entry.GetProperty("testable").GetBoolean());
        Assert.Equal(["T1"],
            entry.GetProperty("cannot_be_told_apart_from").EnumerateArray().Select(e => e.GetString()));
        string html = HtmlReportWriter.Write(ResultReport.Build(s, c, minimal: false));
        Assert.Contains(
            "<tr class=\"warn\"><td class=\"mark\"><span title=\"weak\">!</span></td><td class=\"id\">RM5</td>", html);
    }

    [Fact]
    public void TheSameMarkWithADistanceAsWellIsTestable()
    {
        // Control for the test above: a direction and a distance from T1 fix RM5, so it can be checked.
        string both = OneLine + "    distances:\n      - {to: RM5, value: 350.0000, sd: 0.0015}\n";
        var rm = Assert.Single(Run(ReferenceMark, both).Testability, x => x.Id == "RM5");
        Assert.True(rm.Testable!.Value);
    }
}
