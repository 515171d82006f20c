using System.Text.Json;
using NetAdjust.Adjustment;
using NetAdjust.IO.Project;
using NetAdjust.IO.Results;

namespace NetAdjust.IO.Tests.Results;

/// <summary>The survey's particulars (docs/input-format.md, "Survey particulars") from the project file into the
/// text, HTML and JSON reports.</summary>
public sealed class ParticularsTests
{
    // Invented particulars for the invented Ashgrove network of TestProjects.
    private const string Survey = """
        survey:
          client: Fernleigh Parish Council
          site: Ashgrove yard & gate
          reference: FPC-2026-014
          surveyor: A. N. Example
          firm: Example Survey Partnership
          observed: [2026-11-03, 2026-11-04]
          equipment:
            - {item: total station, serial: TS-40417, calibrated: 2026-09-14}
            - {item: prism pole}
          weather: overcast, light wind
          note: S3 re-occupied on the second day.

        """;

    private static ResultReport Model(string text)
    {
        var project = ProjectReader.Parse(text, "ashgrove.yaml", "/nonexistent",
            _ => throw new IOException("no files"));
        var r = Adjuster.Adjust(project.Network, project.Options);
        var c = new ReportContext("ashgrove.yaml", TestProjects.RunDate, project.Units)
        {
            Crs = project.Crs, Particulars = project.Particulars,
        };
        return ResultReport.Build(r, c);
    }

    [Fact]
    public void ParticularsReachTextHtmlAndJson()
    {
        var model = Model(Survey + TestProjects.Ashgrove);
        string text = TextReportWriter.Write(model);
        Assert.Contains("\nClient    : Fernleigh Parish Council\n", text);
        Assert.Contains("\nJob ref.  : FPC-2026-014\n", text);
        Assert.Contains("\nSurveyor  : A. N. Example\n", text);
        Assert.Contains("\nObserved  : 2026-11-03, 2026-11-04\n", text);
        Assert.Contains("\nEquipment : total station, serial TS-40417, calibrated 2026-09-14\n", text);
        Assert.Contains("\nEquipment : prism pole\n", text);
        Assert.Contains("\nNote      : S3 re-occupied on the second day.\n", text);
        // at the top: before the summary
        Assert.True(text.IndexOf("Client    :", StringComparison.Ordinal)
            < text.IndexOf("SUMMARY", StringComparison.Ordinal));

        string html = HtmlReportWriter.Write(model);
        Assert.Contains("<dt>Site</dt><dd>Ashgrove yard &amp; gate</dd>", html);
        Assert.Contains("<dt>Weather</dt><dd>overcast, light wind</dd>", html);
        Assert.Contains("<div id=\"signature\">", html);
        Assert.Contains("<th scope=\"row\">Name</th><td>A. N. Example</td>", html);

        using var json = JsonDocument.Parse(JsonResultWriter.Write(model));
        var survey = json.RootElement.GetProperty("survey");
        Assert.Equal("Fernleigh Parish Council", survey.GetProperty("client").GetString());
        Assert.Equal("Example Survey Partnership", survey.GetProperty("firm").GetString());
        Assert.Equal(["2026-11-03", "2026-11-04"],
            survey.GetProperty("observed").EnumerateArray().Select(e => e.GetString()));
        var equipment = survey.GetProperty("equipment");
        Assert.Equal("TS-40417", equipment[0].GetProperty("serial").GetString());
        Assert.Equal("2026-09-14", equipment[0].GetProperty("calibrated").GetString());
        Assert.Equal(JsonValueKind.Null, equipment[1].GetProperty("serial").ValueKind);
    }

    [Fact]
    public void WithoutParticularsNothingIsAdded()
    {
        var model = Model(TestProjects.Ashgrove);
        Assert.DoesNotContain("Client    :", TextReportWriter.Write(model));
        using var json = JsonDocument.Parse(JsonResultWriter.Write(model));
        Assert.False(json.RootElement.TryGetProperty("survey", out _));
    }

    [Theory]
    [InlineData("survey:\n  observed: 3.11.2026\n", 2, "survey.observed")]
    [InlineData("survey:\n  equipment:\n    - {serial: X1}\n", 3, "survey.equipment")]
    [InlineData("survey:\n  surveyour: A. N. Example\n", 2, "surveyour")]
    public void BadParticularsNameLineAndItem(string survey, int line, string item)
    {
        var e = Assert.Throws<ProjectFileException>(() =>
            ProjectReader.Parse(survey + TestProjects.Ashgrove, "ashgrove.yaml", "/nonexistent",
                _ => throw new IOException()));
        Assert.Equal(line, e.Line);
        Assert.Contains(item, e.Message);
    }
}
