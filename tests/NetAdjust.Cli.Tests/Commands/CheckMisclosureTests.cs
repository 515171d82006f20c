namespace NetAdjust.Cli.Tests.Commands;

public class CheckMisclosureTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("netadjust-check-").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    // An invented level network: BM1 held, a loop of four sections and a spur; values from a chosen truth
    // (heights 50.000, 51.200, 52.700, 51.900) with one 25 mm blunder on the section BM3→BM4 (line 11).
    private const string Levels = """
        project: Level loop (invented)
        default_sd: {height_difference: 1 mm}
        points:
          - {id: BM1, h: 50.000, fix: h}
          - {id: BM2}
          - {id: BM3}
          - {id: BM4}
        levelling:
          - {from: BM1, to: BM2, dh: 1.2003, length: 400}
          - {from: BM2, to: BM3, dh: 1.4998, length: 500}
          - {from: BM3, to: BM4, dh: -0.7752, length: 450}
          - {from: BM4, to: BM1, dh: -1.9001, length: 300}
          - {from: BM2, to: BM4, dh: 0.7002, length: 350}
        checks: {level_loop_mm: 12}
        """;

    [Fact]
    public void CheckNamesTheFailingLoopsAndTheirObservations()
    {
        string path = Path.Combine(_dir, "levels.yaml");
        File.WriteAllText(path, Levels);
        var run = CliHarness.Run("check", path);
        Assert.True(run.Code == 0, run.Err); // a failing loop is a result, not an error
        Assert.Contains("LEVEL LOOPS AND LINES BEFORE THE ADJUSTMENT", run.Out);
        var rows = run.Out.Split('\n').Where(l => l.StartsWith("  loop", StringComparison.Ordinal)).ToList();
        Assert.Equal(2, rows.Count); // cycle rank 5 − 4 + 1
        // both loops through BM3→BM4 fail, and each names that section's line
        Assert.All(rows, r => Assert.EndsWith("FAIL", r));
        Assert.Equal(2, System.Text.RegularExpressions.Regex.Count(run.Out, @"levels\.yaml:11(,|\n)"));
    }

    [Fact]
    public void AdjustReportCarriesTheMisclosuresAndTheirJson()
    {
        string path = Path.Combine(_dir, "levels.yaml"), json = Path.Combine(_dir, "r.json");
        File.WriteAllText(path, Levels.Replace("dh: -0.7752", "dh: -0.8002"));
        var run = CliHarness.Run("adjust", path, "--date", "2026-12-01", "--quiet", "--json", json);
        Assert.True(run.Code == 0, run.Err);
        Assert.Contains("LEVEL LOOPS AND LINES BEFORE THE ADJUSTMENT", run.Out);
        Assert.DoesNotContain("FAIL", run.Out.Split("LEVEL LOOPS")[1].Split("CAUTION")[0]);
        string text = File.ReadAllText(json);
        Assert.Contains("\"misclosures\"", text);
        Assert.Contains("\"level_loop_constant_mm\": 12", text);
    }
}
