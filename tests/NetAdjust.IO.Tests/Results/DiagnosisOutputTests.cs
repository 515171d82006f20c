using System.Text.Json;
using NetAdjust.Adjustment;
using NetAdjust.Diagnosis;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.IO.Tests.Schemas;
using NetAdjust.Units;
using DiagnosisResult = NetAdjust.Diagnosis.Diagnosis;

namespace NetAdjust.IO.Tests.Results;

/// <summary>
/// The blunder diagnosis in the text, HTML and JSON outputs (docs/report.md, docs/output-format.md), written from a
/// hand-built diagnosis of the demo with a planted blunder (data/harrowfield-blunder.yaml: the distance H3→H4, line
/// 59, observation #26): the writers show what they are given, in the report's units, and the edit line names the
/// file and line of the observation with its booked text.
/// </summary>
public sealed class DiagnosisOutputTests
{
    private const int Distance = 25;  // #26 distance H3→H4, data/harrowfield-blunder.yaml:59
    private const int Direction = 24; // #25 direction H3→H4, data/harrowfield-blunder.yaml:57

    private static (AdjustmentResult Result, ProjectUnits Units) Demo()
    {
        var project = ProjectReader.Read(Path.Combine(TestProjects.RepoRoot, "data", "harrowfield-blunder.yaml"));
        return (Adjuster.Adjust(project.Network, project.Options), project.Units);
    }

    /// <summary>An invented diagnosis: the distance explained by a prism constant (indistinguishable from a free
    /// bias), the direction unexplained.</summary>
    private static DiagnosisResult HandBuilt() => new(
    [
        new SuspectDiagnosis(Distance, -7.23,
        [
            new BlunderHypothesis(BlunderKind.PrismConstant, "distance H3→H4 with a prism constant 34.4 mm too long",
                [Distance], 1, -7.23, 3.29, -0.0344, 0.0055, "-34.4 mm", 1.10, true,
                new SuggestedEdit("data/harrowfield-blunder.yaml:59", "value", "419.3795", "419.3451")),
            new BlunderHypothesis(BlunderKind.UnexplainedBias, "distance H3→H4 biased by a free amount",
                [Distance], 1, -7.23, 3.29, -0.0400, 0.0055, null, 0.95, true, null),
        ], [(BlunderKind.PrismConstant, BlunderKind.UnexplainedBias)], true),
        new SuspectDiagnosis(Direction, 3.32,
        [
            new BlunderHypothesis(BlunderKind.UnexplainedBias, "direction H3→H4 biased by a free amount",
                [Direction], 1, 3.32, 3.29, Angle.FromArcseconds(10).Radians, Angle.FromArcseconds(3).Radians, null,
                2.10, false, null) { SizeIsAngle = true },
            new BlunderHypothesis(BlunderKind.SetBacksight, "the set at H3 rotated", [22, 23, Direction], 3, 4.0,
                16.27, Angle.FromArcseconds(-6).Radians, Angle.FromArcseconds(2).Radians, null, 3.10, false, null)
                { SizeIsAngle = true },
        ], [], false),
    ], DiagnosisOptions.Default);

    /// <summary>Where the reader found an observation of the demo (the file as the test names it, and the line).
    /// </summary>
    private static string Source(int index) => Demo().Result.Network.Observations[index].Source!;

    private static ResultReport Report()
    {
        var (result, units) = Demo();
        return ResultReport.Build(result, new ReportContext("data/harrowfield-blunder.yaml", TestProjects.RunDate,
            units) { Diagnosis = HandBuilt() });
    }

    [Fact]
    public void TheTextReportHasTheSectionWithTheEditLineToApplyByHand()
    {
        string text = TextReportWriter.Write(Report());
        Assert.Contains("BLUNDER DIAGNOSIS", text, StringComparison.Ordinal);
        // the free bias fits as well here, and the verdict says so (a usual amount is not proof of the cause)
        Assert.Contains("#26 distance H3→H4 (" + Source(Distance) + "): w = -7.23\n    explained as prism constant "
            + "(an unexplained bias fits as well: confirm the cause in the field\n    book before applying the edit)\n",
            text, StringComparison.Ordinal);
        // The edit: where the observation was read, the key, the booked text and the suggested one.
        Assert.Contains("\n      data/harrowfield-blunder.yaml:59  value  419.3795 -> 419.3451\n", text,
            StringComparison.Ordinal);
        Assert.Contains("NetAdjust never changes the input", text, StringComparison.Ordinal);
        Assert.Contains("prism_constant and unexplained_bias", text, StringComparison.Ordinal);
        // The unexplained suspect gets no edit, and its group hypothesis lists its observations.
        Assert.Contains("#25 direction H3→H4 (" + Source(Direction) + "): w = 3.32\n    not explained", text,
            StringComparison.Ordinal);
        Assert.Single(text.Split('\n'), l => l.Contains(" -> ", StringComparison.Ordinal));
        Assert.Contains("(observations #23, #24, #25)", text, StringComparison.Ordinal);
        // The section comes before the caution, which still ends the report.
        Assert.True(text.IndexOf("BLUNDER DIAGNOSIS", StringComparison.Ordinal) <
            text.IndexOf("CAUTION:", StringComparison.Ordinal));
        Assert.All(text.Split('\n'), l => Assert.True(l.Length <= 100, l));
    }

    [Fact]
    public void SizesAreInTheReportsUnits()
    {
        string text = TextReportWriter.Write(Report());
        var rows = text.Split('\n');
        // A length in the project's unit (m, 4 decimals), an angle in its angular sd unit (arcsec, 2 decimals);
        // 10" = 10 π/648000 rad (common practice).
        string prism = Assert.Single(rows, l => l.StartsWith("   1 prism_constant", StringComparison.Ordinal));
        Assert.Contains(" -0.0344   0.0055 m ", prism, StringComparison.Ordinal);
        string bias = Assert.Single(rows, l => l.StartsWith("   1 unexplained_bias", StringComparison.Ordinal));
        Assert.Contains(" 10.00     3.00 arcsec ", bias, StringComparison.Ordinal);
        Assert.EndsWith(" 2.10 no", bias, StringComparison.Ordinal);
    }

    [Fact]
    public void TheHtmlReportHasTheSection()
    {
        string html = HtmlReportWriter.Write(Report());
        Assert.Contains("<section id=\"diagnosis\"", html, StringComparison.Ordinal);
        Assert.Contains("<pre>data/harrowfield-blunder.yaml:59  value  419.3795 -&gt; 419.3451</pre>", html,
            StringComparison.Ordinal);
        Assert.True(html.IndexOf("id=\"diagnosis\"", StringComparison.Ordinal) <
            html.IndexOf("id=\"caution\"", StringComparison.Ordinal));
    }

    [Fact]
    public void TheJsonResultHoldsTheDiagnosisAndIsValidAgainstTheSchema()
    {
        string json = JsonResultWriter.Write(Report());
        using var doc = JsonDocument.Parse(json);
        Assert.Empty(SchemaValidation.ResultErrors(doc.RootElement));
        var d = doc.RootElement.GetProperty("diagnosis");
        Assert.Equal("adjustment", d.GetProperty("diagnosed").GetString());
        var first = d.GetProperty("suspects")[0];
        Assert.Equal(Distance, first.GetProperty("observation").GetProperty("index").GetInt32());
        Assert.Equal("419.3795", first.GetProperty("observation").GetProperty("booked").GetString());
        Assert.Equal("data/harrowfield-blunder.yaml:59  value  419.3795 -> 419.3451",
            first.GetProperty("suggested_edit").GetString());
        var best = first.GetProperty("ranked")[0];
        Assert.Equal("prism_constant", best.GetProperty("kind").GetString());
        Assert.Equal("m", best.GetProperty("size_unit").GetString());
        Assert.Equal(-0.0344, best.GetProperty("size").GetDouble(), 12);
        Assert.Equal("419.3451", best.GetProperty("edit").GetProperty("suggested").GetString());
        Assert.Equal("unexplained_bias", first.GetProperty("indistinguishable")[0][1].GetString());
        // An angular size in arcseconds, as the JSON's angular residuals (docs/output-format.md).
        var angular = d.GetProperty("suspects")[1].GetProperty("ranked")[0];
        Assert.Equal("arcsec", angular.GetProperty("size_unit").GetString());
        Assert.Equal(10.0, angular.GetProperty("size").GetDouble(), 9);
        Assert.Equal(JsonValueKind.Null, d.GetProperty("suspects")[1].GetProperty("suggested_edit").ValueKind);
    }

    [Fact]
    public void TheSchemaRefusesAnUnknownKindOfBlunder()
    {
        string json = JsonResultWriter.Write(Report()).Replace("\"prism_constant\"", "\"prism\"",
            StringComparison.Ordinal);
        using var doc = JsonDocument.Parse(json);
        Assert.NotEmpty(SchemaValidation.ResultErrors(doc.RootElement));
    }

    [Fact]
    public void NoDiagnosisWritesNoSection()
    {
        var (result, units) = Demo();
        var report = ResultReport.Build(result, new ReportContext("x.yaml", TestProjects.RunDate, units));
        Assert.DoesNotContain("BLUNDER DIAGNOSIS", TextReportWriter.Write(report), StringComparison.Ordinal);
        Assert.DoesNotContain("id=\"diagnosis\"", HtmlReportWriter.Write(report), StringComparison.Ordinal);
        Assert.DoesNotContain("\"diagnosis\"", JsonResultWriter.Write(report), StringComparison.Ordinal);
    }

    [Fact]
    public void TheReaderKeepsTheBookedTextOfEachValue()
    {
        var (result, _) = Demo();
        // As written in data/harrowfield-blunder.yaml: a distance and a DMS direction.
        Assert.Equal("419.3795", result.Network.Observations[Distance].BookedText);
        Assert.Equal("211-12-24.1", result.Network.Observations[Direction].BookedText);
    }

    [Fact]
    public void TheCsvReaderAndTheLevellingListKeepTheBookedTextToo()
    {
        var project = ProjectReader.Read(Path.Combine(TestProjects.RepoRoot, "data", "brackenmoor.yaml"));
        // data/brackenmoor-levels.csv, line 3: height_difference,BMK1,BMK2,1.82378,420,DL10 (trailing zeros kept
        // as booked).
        var dh = Assert.Single(project.Network.Observations, o => o.Source == "brackenmoor-levels.csv:3");
        Assert.Equal("1.82378", dh.BookedText);
        var levelled = ProjectReader.Parse("""
            points:
              - {id: A, h: 10.000, fix: h}
              - {id: B}
            levelling:
              - {from: A, to: B, dh: 1.2500, sd: 1 mm}
            """, "p.yaml", ".", _ => "");
        Assert.Equal("1.2500", Assert.Single(levelled.Network.Observations).BookedText);
    }

    [Fact]
    public void OneBlunderFoundThroughTwoSuspectsPrintsItsEditOnce()
    {
        // One edit explains both suspects (as a target height explains a zenith angle and a slope distance).
        var edit = new SuggestedEdit("site.yaml:48", "target_height", "2.654", "1.654");
        SuspectDiagnosis Suspect(int index) => new(index, 5.0,
            [new BlunderHypothesis(BlunderKind.TargetHeight, "target height booked 1.000 m too high", [24, 25], 1,
                5.0, 3.29, 1.0, 0.003, "+1.0 m", 1.0, true, edit)], [], true);
        var (result, units) = Demo();
        var report = ResultReport.Build(result, new ReportContext("x.yaml", TestProjects.RunDate, units)
            { Diagnosis = new DiagnosisResult([Suspect(Distance), Suspect(Direction)], DiagnosisOptions.Default) });
        string text = TextReportWriter.Write(report);
        Assert.Single(text.Split('\n'), l => l.Contains(" -> ", StringComparison.Ordinal));
        Assert.Contains("    Suggested edit: the same as for #26.\n", text, StringComparison.Ordinal);
        string html = HtmlReportWriter.Write(report);
        Assert.Single(html.Split('\n'), l => l.Contains("-&gt;", StringComparison.Ordinal));
        // The JSON states the edit of each suspect.
        using var doc = JsonDocument.Parse(JsonResultWriter.Write(report));
        Assert.All(doc.RootElement.GetProperty("diagnosis").GetProperty("suspects").EnumerateArray(), x =>
            Assert.Equal("site.yaml:48  target_height  2.654 -> 1.654", x.GetProperty("suggested_edit").GetString()));
    }
}
