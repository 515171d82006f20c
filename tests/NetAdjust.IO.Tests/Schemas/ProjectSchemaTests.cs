using NetAdjust;
using NetAdjust.IO.Project;
using NetAdjust.IO.Tests.Results;

namespace NetAdjust.IO.Tests.Schemas;

/// <summary>
/// The JSON Schema of the project file (docs/project.schema.json, next to docs/input-format.md): every demo project
/// of data/ is valid and names the schema for editors; on a set of broken files the reader and the schema give the
/// same verdict (each file fails in both), so an editor's red line and the reader's error agree.
/// </summary>
public sealed class ProjectSchemaTests
{
    /// <summary>The editor's schema comment of the YAML language server, as the demo files carry it.</summary>
    private const string SchemaComment = "# yaml-language-server: $schema=../docs/project.schema.json";

    public static TheoryData<string> DemoProjects()
    {
        var data = new TheoryData<string>();
        foreach (var f in Directory.GetFiles(Path.Combine(TestProjects.RepoRoot, "data"),
            "*.yaml").Order(StringComparer.Ordinal))
            data.Add(Path.GetFileName(f));
        return data;
    }

    [Theory]
    [MemberData(nameof(DemoProjects))]
    public void EveryDemoProjectIsValidAgainstTheSchemaAndNamesIt(string name)
    {
        string path = Path.Combine(TestProjects.RepoRoot, "data", name);
        string text = File.ReadAllText(path);
        Assert.Empty(SchemaValidation.ProjectErrors(text));
        Assert.Contains(text.Split('\n'), l => l == SchemaComment);
        ProjectReader.Read(path); // and the reader takes it (it throws otherwise)
    }

    [Fact]
    public void TheDemoFolderHoldsProjects()
    {
        // The theory above must not pass by finding nothing.
        Assert.True(DemoProjects().Count >= 4);
    }

    [Fact]
    public void TheSchemaCommentPointsAtTheSchemaFile()
    {
        string relative = SchemaComment[(SchemaComment.IndexOf('=') + 1)..];
        Assert.True(File.Exists(Path.GetFullPath(Path.Combine(TestProjects.RepoRoot, "data", relative))));
    }

    /// <summary>A small valid project (invented): a level loop and one traverse leg; the broken files change one
    /// thing.</summary>
    private const string Valid = """
        project: Schema check (invented)
        units: {length: m, angle: dms, angle_sd: arcsec}
        adjustment: {alpha: 0.05, max_iterations: 20}
        default_sd: {height_difference: 1 mm, distance: 3 mm, direction: 2}
        instruments:
          - {id: TS, direction_sd: 3, edm: 2 mm + 2 ppm, centering: 1 mm}
        levels:
          - {id: DL, sd_per_km: 1.0 mm}
        points:
          - {id: A, e: 100.0, n: 200.0, h: 10.0, fix: enh}
          - {id: B, e: 300.0, n: 200.0, fix: en}
          - {id: C, e: 200.0, n: 300.0}
        setups:
          - at: A
            instrument: TS
            directions:
              - {to: B, value: 0-00-00}
              - {to: C, value: 315-00-00}
            distances:
              - {to: C, value: 141.4214}
          - at: B
            directions:
              - {to: A, value: 0-00-00}
              - {to: C, value: 45-00-01}
        levelling:
          - {from: A, to: B, dh: 1.2040, length: 200, level: DL}
          - {from: B, to: A, dh: -1.2052, sd: 2 mm}
        statistics: {w_alpha: 0.001, tau_adjustment: sidak}
        """;

    /// <summary>Broken files: a change of the valid project, and a word the reader's message must contain.</summary>
    public static TheoryData<string, string, string, string> Broken() => new()
    {
        { "unknown top-level key", "statistics:", "statistcs:", "unknown key 'statistcs'" },
        { "unknown point key", "fix: en}", "fixed: en}", "unknown key 'fixed'" },
        { "point without id", "{id: C, e: 200.0", "{e: 200.0", "'id' is missing" },
        { "unknown length unit", "length: m,", "length: yd,", "units.length" },
        { "unknown angle format", "angle: dms,", "angle: grad,", "units.angle" },
        { "alpha above one", "alpha: 0.05", "alpha: 1.5", "adjustment.alpha" },
        { "no iterations", "max_iterations: 20", "max_iterations: 0", "adjustment.max_iterations" },
        { "negative default sd", "distance: 3 mm", "distance: -3 mm", "positive" },
        { "zero levelling sd", "sd: 2 mm}", "sd: 0}", "positive" },
        { "negative angular sd", "direction: 2}", "direction: -2}", "positive" },
        { "setup without station", "  - at: B\n", "  - instrument: TS\n", "'at' is missing" },
        { "direction without value", "{to: C, value: 45-00-01}", "{to: C}", "'value' is missing" },
        { "unknown sighting key", "{to: B, value: 0-00-00}", "{to: B, value: 0-00-00, face: 1}", "unknown key 'face'" },
        { "levelling without dh", "{from: B, to: A, dh: -1.2052, sd: 2 mm}", "{from: B, to: A, sd: 2 mm}",
            "'dh' is missing" },
        { "held components not e, n, h", "fix: enh}", "fix: xyz}", "held components" },
        { "instrument without direction sd", "{id: TS, direction_sd: 3,", "{id: TS,", "direction_sd" },
        { "level with two kinds of specification", "{id: DL, sd_per_km: 1.0 mm}",
            "{id: DL, sd_per_km: 1.0 mm, resolution: 1 mm}", "resolution" },
        { "unknown tau adjustment", "tau_adjustment: sidak", "tau_adjustment: holm", "statistics.tau_adjustment" },
        { "crs without EPSG", "project: Schema check (invented)\n", "project: Schema check (invented)\ncrs: 27700\n",
            "crs" },
        { "datum keys of another mode", "statistics:", "datum: {mode: free, hold: A}\nstatistics:", "belongs to mode" },
        { "levels not a list", "levels:\n  - {id: DL,", "levels: {id: DL,", "list" },
        { "unknown key in a reading of rounds",
            "    directions:\n      - {to: B, value: 0-00-00}\n      - {to: C, value: 315-00-00}\n",
            "    rounds:\n      - readings:\n          - {to: B, hz_left: 0-00-00, hz_rigth: 180-00-00}\n",
            "unknown key 'hz_rigth'" },
        { "unknown kind of blunder", "statistics:", "diagnosis: {skip: [prism]}\nstatistics:", "diagnosis.skip" },
        { "the reference kind skipped", "statistics:", "diagnosis: {skip: [unexplained_bias]}\nstatistics:",
            "cannot be skipped" },
        { "negative round height", "statistics:", "diagnosis: {round_heights: [-0.5]}\nstatistics:", "positive" },
    };

    [Fact]
    public void TheValidProjectPassesTheReaderAndTheSchema()
    {
        // The broken files below differ from this one in a single place, so their failures come from that place.
        Assert.Empty(SchemaValidation.ProjectErrors(Valid));
        Read(Valid);
    }

    [Theory]
    [MemberData(nameof(Broken))]
    public void ReaderAndSchemaBothRefuseEachBrokenFile(string what, string find, string replace, string message)
    {
        Assert.True(Valid.Contains(find, StringComparison.Ordinal), $"{what}: '{find}' is not in the valid project");
        string broken = Valid.Replace(find, replace, StringComparison.Ordinal);
        var e = Assert.ThrowsAny<Exception>(() => Read(broken));
        Assert.True(e is ProjectFileException or InvalidInputException, $"{what}: {e.GetType().Name}: {e.Message}");
        Assert.Contains(message, e.Message, StringComparison.Ordinal);
        Assert.True(SchemaValidation.ProjectErrors(broken).Count > 0,
            $"{what}: the schema accepts what the reader refuses");
    }

    private static SurveyProject Read(string text) =>
        ProjectReader.Parse(text, "check.yaml", Path.GetTempPath(), f => throw new FileNotFoundException(f));
}
