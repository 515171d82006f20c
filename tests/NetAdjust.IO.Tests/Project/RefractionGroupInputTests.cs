using System.Text.Json;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;
using NetAdjust.IO.Tests.Schemas;
using NetAdjust.Network;
using NetAdjust.Stochastic;

namespace NetAdjust.IO.Tests.Project;

/// <summary>The project's σ_k, groups of zenith angles with their own k, and k as an unknown
/// (docs/input-format.md, "Refraction groups"), and the estimated k in the outputs (docs/output-format.md).</summary>
public class RefractionGroupInputTests
{
    // Invented: A held, B held in plan, reciprocal zenith angles between them (values near the truth H_B = 110.5).
    private const string Head = """
        units: {length: m, angle: dms}
        adjustment: {refraction: 0.12, refraction_sd: 0.03}
        instruments:
          - {id: TS, direction_sd: 1, zenith_sd: 2, edm: 1 mm + 1.5 ppm, centering: 0.5 mm, height: 1 mm}
        points:
          - {id: A, e: 1000, n: 1000, h: 100, fix: enh}
          - {id: B, e: 1600, n: 1800, h: 110, fix: en}
          - {id: C, e: 400, n: 1800, h: 95, fix: en}

        """;

    private static SurveyProject Parse(string yaml) =>
        ProjectReader.Parse(yaml, "t.yaml", Path.GetTempPath(), File.ReadAllText);

    private static string Project(string groups, string groupOfA = "", string groupOfB = "") =>
        Head + groups + "setups:\n" +
        "  - {at: A, instrument: TS, instrument_height: 1.5" + groupOfA +
        ", zeniths: [{to: B, value: 89-27-28, target_height: 1.5}, {to: C, value: 90-16-42, target_height: 1.5}]}\n" +
        "  - {at: B, instrument: TS, instrument_height: 1.5" + groupOfB +
        ", zeniths: [{to: A, value: 90-33-02, target_height: 1.5}]}\n" +
        "  - {at: C, instrument: TS, instrument_height: 1.5" + groupOfB +
        ", zeniths: [{to: A, value: 89-43-43, target_height: 1.5}]}\n";

    [Fact]
    public void ZenithsTakeTheProjectsKAndSdUnlessTheirSetupNamesAGroup()
    {
        var net = Parse(Project("refraction_groups:\n  - {id: MON, k: 0.15, sd: 0.02}\n",
            groupOfB: ", refraction_group: MON")).Network;
        var z = net.Observations.Cast<ZenithObservation>().ToArray();
        Assert.Equal((0.12, 0.03, (string?)null, false), (z[0].Refraction, z[0].RefractionSd, z[0].RefractionGroup,
            z[0].RefractionEstimated));
        Assert.Equal((0.15, 0.02, "MON", false), (z[2].Refraction, z[2].RefractionSd, z[2].RefractionGroup,
            z[2].RefractionEstimated));
        // A group without k and sd takes the project's.
        var plain = Parse(Project("refraction_groups:\n  - {id: MON}\n", groupOfB: ", refraction_group: MON"));
        Assert.Equal((0.12, 0.03), (((ZenithObservation)plain.Network.Observations[2]).Refraction,
            ((ZenithObservation)plain.Network.Observations[2]).RefractionSd));
    }

    [Fact]
    public void TheRefractionKeysAreInTheProjectSchema()
    {
        // docs/project.schema.json knows adjustment.refraction and refraction_sd, refraction_groups and a setup's
        // refraction_group (a project without zenith angles, whose keys are not in the schema yet).
        const string yaml = """
            adjustment: {refraction: 0.12, refraction_sd: 0.03}
            refraction_groups:
              - {id: MON, k: 0.15, sd: 0.02}
              - {id: TUE, estimate: yes}
            points:
              - {id: A, e: 1000.0, n: 1000.0, fix: en}
              - {id: B, e: 1600.0, n: 1800.0}
            setups:
              - at: A
                refraction_group: MON
                distances: [{to: B, value: 1000.0, sd: 0.002}]
            """;
        Assert.Empty(SchemaValidation.ProjectErrors(yaml));
        Assert.NotEmpty(SchemaValidation.ProjectErrors(yaml.Replace("sd: 0.02", "sd: -1")));
        Assert.NotEmpty(SchemaValidation.ProjectErrors(yaml.Replace("estimate: yes", "estimate: maybe")));
        Assert.NotEmpty(SchemaValidation.ProjectErrors(yaml.Replace("refraction_sd: 0.03", "refraction_sd: 3")));
    }

    [Fact]
    public void TheProjectsRefractionSdEntersTheZenithBudget()
    {
        var p = Parse(Project(""));
        var r = Adjuster.Adjust(p.Network, p.Options);
        double s = 1000; // A→B: 600 by 800 m
        // σ_k·s/(2R) (docs/methods.md, "Error budgets"; R the mean earth radius 6 371 008.8 m)
        Assert.Equal(0.03 * s / (2 * 6_371_008.8), r.Observations[0].Budget!.ValueOf(ContributionNames.Refraction),
            1e-12);
    }

    [Fact]
    public void AnEstimatedGroupIsReportedInTextHtmlAndJson()
    {
        var p = Parse(Project("refraction_groups:\n  - {id: DAY1, estimate: yes}\n", ", refraction_group: DAY1",
            ", refraction_group: DAY1"));
        var r = Adjuster.Adjust(p.Network, p.Options);
        var k = Assert.Single(r.Refractions);
        Assert.Equal("DAY1", k.Group);
        Assert.True(k.Sd > 0);
        Assert.Equal(0.0, r.Observations[0].Budget!.ValueOf(ContributionNames.Refraction));
        var c = new ReportContext("t.yaml", new DateOnly(2026, 12, 1), p.Units);
        string text = TextReportWriter.Write(r, c);
        Assert.Contains("REFRACTION COEFFICIENTS", text);
        string shown = k.Coefficient.ToString("F4", System.Globalization.CultureInfo.InvariantCulture);
        Assert.Contains($"  DAY1                 {shown,10}", text);
        Assert.Contains("<section id=\"refraction\">", HtmlReportWriter.Write(r, c));
        using var doc = JsonDocument.Parse(JsonResultWriter.Write(r, c));
        var json = doc.RootElement.GetProperty("refraction")[0];
        Assert.Equal("DAY1", json.GetProperty("group").GetString());
        Assert.Equal(k.Coefficient, json.GetProperty("k").GetDouble(), 1e-12);
        Assert.Equal(k.Sd, json.GetProperty("sd").GetDouble(), 1e-12);
        // The key and its items are in docs/result.schema.json (the schema does not know the 3D kinds yet, so only
        // the errors about this key are looked at).
        Assert.DoesNotContain(SchemaValidation.ResultErrors(doc.RootElement), m => m.Contains("refraction"));
    }

    [Fact]
    public void WithoutAnEstimatedKTheOutputsHaveNoRefractionSection()
    {
        var p = Parse(Project(""));
        var r = Adjuster.Adjust(p.Network, p.Options);
        var c = new ReportContext("t.yaml", new DateOnly(2026, 12, 1), p.Units);
        Assert.DoesNotContain("REFRACTION COEFFICIENTS", TextReportWriter.Write(r, c));
        using var doc = JsonDocument.Parse(JsonResultWriter.Write(r, c));
        Assert.False(doc.RootElement.TryGetProperty("refraction", out _));
    }

    [Theory]
    [InlineData("refraction_groups:\n  - {id: X}\n", ", refraction_group: Y", "t.yaml:12: setup at A refraction_group",
        "'Y' is not defined")]
    [InlineData("refraction_groups:\n  - {id: X}\n  - {id: X}\n", "", "t.yaml:11: refraction group X",
        "defined twice")]
    [InlineData("refraction_groups:\n  - {id: X, k: 3}\n", "", "t.yaml:10: refraction group X k", "outside −2 … 2")]
    [InlineData("refraction_groups:\n  - {id: X, sd: -0.1}\n", "", "t.yaml:10: refraction group X sd",
        "between 0 and 2")]
    [InlineData("refraction_groups:\n  - {id: X, estimate: yes, sd: 0.1}\n", "", "t.yaml:10: refraction group X sd",
        "takes no 'sd'")]
    [InlineData("refraction_groups:\n  - {id: X, estimate: maybe}\n", "", "t.yaml:10: refraction group X estimate",
        "estimate")]
    [InlineData("refraction_groups:\n  - {id: X, day: 2}\n", "", "t.yaml:10: refraction group X", "unknown key 'day'")]
    public void BadRefractionGroupsAreErrorsWithFileLineAndItem(string groups, string groupOfA, string where,
        string what)
    {
        var e = Assert.Throws<ProjectFileException>(() => Parse(Project(groups, groupOfA)));
        Assert.StartsWith(where, e.Message);
        Assert.Contains(what, e.Message);
    }

    [Fact]
    public void ANegativeProjectRefractionSdIsAnError()
    {
        var e = Assert.Throws<ProjectFileException>(() => Parse(Project("").Replace("refraction_sd: 0.03",
            "refraction_sd: -1")));
        Assert.StartsWith("t.yaml:2: adjustment.refraction_sd", e.Message);
    }
}
