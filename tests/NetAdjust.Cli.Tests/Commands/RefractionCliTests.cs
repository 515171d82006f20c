namespace NetAdjust.Cli.Tests.Commands;

/// <summary>
/// A refraction coefficient the observations cannot determine (docs/methods.md, "Refraction coefficient as an
/// unknown") ends `adjust` with the adjustment-failed exit code (docs/cli.md), the group named, and no output file.
/// </summary>
public sealed class RefractionCliTests : IDisposable
{
    private readonly string _tmp = Directory.CreateTempSubdirectory("netadjust-refraction-").FullName;

    public void Dispose() => Directory.Delete(_tmp, recursive: true);

    // Invented: zenith angles one way only from A, heights of B and C free, k of group DAY1 estimated.
    private const string OneWay = """
        instruments:
          - {id: TS, direction_sd: 1, zenith_sd: 2, edm: 1 mm + 1.5 ppm, height: 1 mm}
        refraction_groups:
          - {id: DAY1, estimate: yes}
        points:
          - {id: A, e: 1000, n: 1000, h: 100, fix: enh}
          - {id: B, e: 1600, n: 1800, fix: en}
          - {id: C, e: 400, n: 1800, fix: en}
        setups:
          - at: A
            instrument: TS
            refraction_group: DAY1
            instrument_height: 1.5
            zeniths:
              - {to: B, value: 89-27-28, target_height: 1.5}
              - {to: C, value: 90-16-42, target_height: 1.5}

        """;

    [Fact]
    public void AnUndeterminedRefractionCoefficientIsAnAdjustmentFailureNamingTheGroup()
    {
        string path = Path.Combine(_tmp, "oneway.yaml");
        File.WriteAllText(path, OneWay);
        string json = Path.Combine(_tmp, "out.json");
        var run = CliHarness.Run("adjust", path, "--json", json);
        Assert.Equal(3, run.Code);
        Assert.Contains("refraction coefficient of group DAY1", run.Err);
        Assert.False(File.Exists(json));
        // With the reciprocal zenith angles from B and C it is determined.
        File.WriteAllText(path, OneWay + """
              - at: B
                instrument: TS
                refraction_group: DAY1
                instrument_height: 1.5
                zeniths: [{to: A, value: 90-33-02, target_height: 1.5}]
              - at: C
                instrument: TS
                refraction_group: DAY1
                instrument_height: 1.5
                zeniths: [{to: A, value: 89-43-43, target_height: 1.5}]

            """);
        var ok = CliHarness.Run("adjust", path, "--json", json);
        Assert.Equal(0, ok.Code);
        Assert.Contains("\"refraction\"", File.ReadAllText(json));
    }
}
