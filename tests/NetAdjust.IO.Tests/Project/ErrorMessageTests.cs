using NetAdjust.IO.Project;
using NetAdjust.Procedures;

namespace NetAdjust.IO.Tests.Project;

/// <summary>Regression tests for error messages of the project reader found in review.</summary>
public class ErrorMessageTests
{
    [Fact]
    public void ASightLengthToAPointWithoutCoordinatesIsLeftToTheAdjustment()
    {
        // The reader does no mathematics: an angle weighted from the instrument keeps its weighting, and the sight
        // length to C (no coordinates, no distance observed) is taken from the adjustment's coordinates.
        const string yaml = """
            units: {length: m, angle: dms}
            instruments:
              - {id: TS, direction_sd: 3, edm: 2 mm + 2 ppm, centering: 1 mm}
            points:
              - {id: A, e: 0, n: 0, fix: en}
              - {id: B, e: 100, n: 0, fix: en}
              - {id: C}
            setups:
              - at: A
                instrument: TS
                angles:
                  - {from: B, to: C, value: 90-00-00}
            """;
        var p = ProjectReader.Parse(yaml, "p.yaml", Path.GetTempPath(), File.ReadAllText);
        var angle = Assert.Single(p.Network.Observations);
        Assert.NotNull(angle.Weighting);
        Assert.True(double.IsNaN(angle.StandardDeviation));
        Assert.Equal("p.yaml:12", angle.Source);
    }

    [Theory]
    [InlineData("sd_factor: 0", "sd_factor must be positive")]
    [InlineData("exclude: maybe", "exclude: 'maybe' is not true or false: use true or false")]
    public void ABadBlunderHuntMarkNamesFileAndLineOnce(string mark, string problem)
    {
        // Regression: "p.yaml:9: distance A→B (p.yaml:9): sd_factor must be positive" named the place twice.
        string yaml = $$"""
            units: {length: m, angle: dms}
            default_sd: {distance: 3 mm}
            points:
              - {id: A, e: 1, n: 2, fix: en}
              - {id: B, e: 100, n: 2}
            setups:
              - at: A
                distances:
                  - {to: B, value: 99, {{mark}}}
            """;
        var e = Assert.Throws<ProjectFileException>(() => ProjectReader.Parse(yaml, "p.yaml", Path.GetTempPath(), File.ReadAllText));
        Assert.StartsWith("p.yaml:9: distance A→B: ", e.Message);
        Assert.Contains(problem, e.Message);
        Assert.Equal(1, CountOf(e.Message, "p.yaml"));
    }

    [Theory]
    [InlineData("units: {length: m, angle: dms}\npoints:\n  - {id: A, e: 1, n: 2\n  - {id: B, e: 3, n: 4}\n", 3)]
    [InlineData("units: {length: m, angle: dms\npoints:\n  - {id: A, e: 1, n: 2}\n", 1)]
    [InlineData("project: 'a {b' # [c\nunits: {length: m, angle: dms}\npoints:\n  - {id: A, e: 1, n: 2\n  - {id: B, e: 3, n: 4}\n", 4)]
    public void AnUnclosedBraceIsInvalidInputNamingTheLineNotAnInternalError(string yaml, int line)
    {
        // Regression: YamlDotNet throws InvalidOperationException (not YamlException) for an unclosed flow mapping,
        // which reached the user as "internal error" (exit 70). A missing '}' is the commonest typo in this format.
        var e = Assert.Throws<ProjectFileException>(() => ProjectReader.Parse(yaml, "p.yaml", Path.GetTempPath(), File.ReadAllText));
        Assert.Equal(line, e.Line);
        Assert.StartsWith($"p.yaml:{line}: this is not valid YAML", e.Message);
    }

    private static int CountOf(string text, string part)
    {
        int n = 0;
        for (int i = text.IndexOf(part, StringComparison.Ordinal); i >= 0; i = text.IndexOf(part, i + part.Length, StringComparison.Ordinal)) n++;
        return n;
    }
}
