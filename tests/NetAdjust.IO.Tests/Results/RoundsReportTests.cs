using System.Text.Json;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.IO.Tests.Schemas;

namespace NetAdjust.IO.Tests.Results;

/// <summary>The reduction of rounds in the text, HTML and JSON outputs (docs/output-format.md, "Rounds").</summary>
public class RoundsReportTests
{
    // Own invented setup: two sets in both faces to three targets; face left of B reads 4″ less than face right
    // − 180° in set 1 (c = −2″·sin z) and the zenith faces add up to 360° + 4″ (i = +2″).
    private const string Yaml = """
        units: {length: m, angle: dms}
        instruments:
          - {id: TS2, direction_sd: 2, zenith_sd: 2, edm: 2 mm + 2 ppm}
        points:
          - {id: A, e: 1000, n: 2000, h: 50, fix: enh}
          - {id: B, e: 1300, n: 2400, h: 60, fix: enh}
          - {id: C, e: 1420, n: 1900, h: 55, fix: enh}
          - {id: D, e: 1100, n: 1700, h: 50}
        setups:
          - at: A
            instrument: TS2
            instrument_height: 1.5
            rounds:
              - readings:
                  - {to: B, hz_left: 0-00-00, hz_right: 180-00-04, zenith_left: 88-51-15, zenith_right: 271-08-49,
                     target_height: 1.7}
                  - {to: C, hz_left: 66-12-30, hz_right: 246-12-33, zenith_left: 90-40-10, zenith_right: 269-19-54,
                     target_height: 1.7}
                  - {to: D, hz_left: 124-52-10, hz_right: 304-52-14, zenith_left: 90-10-10, zenith_right: 269-49-54,
                     slope_left: 316.22, slope_right: 316.222, target_height: 1.7}
              - readings:
                  - {to: B, hz_left: 90-00-02, hz_right: 270-00-03, zenith_left: 88-51-13, zenith_right: 271-08-50}
                  - {to: C, hz_left: 156-12-31, hz_right: 336-12-34, zenith_left: 90-40-12, zenith_right: 269-19-52}
                  - {to: D, hz_left: 214-52-12, hz_right: 34-52-14, zenith_left: 90-10-11, zenith_right: 269-49-53,
                     slope_left: 316.221, slope_right: 316.222}
        """;

    private static ResultReport Report()
    {
        var project = ProjectReader.Parse(Yaml, "r.yaml", Path.GetTempPath(), File.ReadAllText);
        var result = Adjuster.Adjust(project.Network, project.Options);
        return ResultReport.Build(result, new ReportContext("r.yaml", TestProjects.RunDate, project.Units)
        {
            Rounds = project.Rounds, Warnings = project.Warnings,
        });
    }

    [Fact]
    public void TheTextReportShowsTheInstrumentErrorsPerSetAndTheSpreadPerTarget()
    {
        string text = TextReportWriter.Write(Report());
        Assert.Contains("ROUNDS: INSTRUMENT ERRORS PER SET", text);
        // Set 1: c = mean of (L − R + 180°)/2·sin z over B, C, D; B's −2″·sin(88.85°) = −1.9996″, C −1.5·sin z,
        // D −2·sin z: mean −1.83″ (hand computed); i = (4 + 4 + 4)/3/2 = +2.00″.
        Assert.Matches(@"A\s+1 both\s+-1\.83\s+2\.00 r\.yaml:14", text);
        Assert.Contains("ROUNDS: REDUCED OBSERVATIONS AND SPREAD OVER THE SETS", text);
        // D: the mean of the face means reduced to B, (124-52-12 − 0-00-02 + 214-52-13 − 90-00-02.5)/2 = 124-52-10.25.
        Assert.Matches(@"A\s+D\s+124-52-10\.3\s+90-10-08\.5\s+316\.2212", text);
        Assert.Contains("directions reduced to B", text);
        Assert.True(text.Split('\n').All(l => l.Length <= 100), "a line of the text report is over 100 columns");
    }

    [Fact]
    public void TheHtmlReportHasTheRoundsTables()
    {
        string html = HtmlReportWriter.Write(Report());
        Assert.Contains("<section id=\"rounds-sets\"", html);
        Assert.Contains("<section id=\"rounds-targets\"", html);
        Assert.Contains("124-52-10.3", html);
    }

    [Fact]
    public void TheJsonResultHasTheRoundsAndFollowsTheSchema()
    {
        using var doc = JsonDocument.Parse(JsonResultWriter.Write(Report()));
        var errors = SchemaValidation.ResultErrors(doc.RootElement);
        Assert.True(errors.Count == 0, string.Join("\n", errors));
        var rounds = doc.RootElement.GetProperty("rounds")[0];
        Assert.Equal("A/1", rounds.GetProperty("set_id").GetString());
        Assert.Equal(2.0, rounds.GetProperty("sets")[0].GetProperty("index_error").GetDouble(), 6);
        var d = rounds.GetProperty("targets")[2];
        Assert.Equal(316.22125, d.GetProperty("slope_distance").GetDouble(), 9);
        Assert.True(d.GetProperty("direction_test").GetProperty("passes").GetBoolean());
        Assert.Equal(JsonValueKind.Null, rounds.GetProperty("targets")[0].GetProperty("slope_distance").ValueKind);
    }

    [Fact]
    public void AProjectWithoutRoundsHasNoRoundsSectionOrKey()
    {
        var (result, context) = TestProjects.Demo();
        Assert.DoesNotContain("ROUNDS", TextReportWriter.Write(result, context));
        using var doc = JsonDocument.Parse(JsonResultWriter.Write(result, context));
        Assert.False(doc.RootElement.TryGetProperty("rounds", out _));
    }
}
