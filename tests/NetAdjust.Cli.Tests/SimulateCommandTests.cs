namespace NetAdjust.Cli.Tests;

/// <summary><c>netadjust simulate</c>: the written project reads back, adjusts (on the sparse path) and is
/// reproducible.</summary>
public sealed class SimulateCommandTests : IDisposable
{
    private readonly string _tmp = Directory.CreateTempSubdirectory("netadjust-sim-").FullName;

    public void Dispose() => Directory.Delete(_tmp, recursive: true);

    [Theory]
    [InlineData("plane")]
    [InlineData("levels")]
    public void WritesAProjectThatReadsBackAndAdjusts(string kind)
    {
        string yaml = Path.Combine(_tmp, $"net-{kind}.yaml");
        var (code, stdout, stderr) =
            CliHarness.Run("simulate", "--kind", kind, "--points", "400", "--seed", "5", "--out", yaml);
        Assert.True(code == ExitCodes.Success, stderr);
        Assert.True(File.Exists(Path.Combine(_tmp, $"net-{kind}-observations.csv")));
        string counts = stdout.Split(": ", 2)[1].Split(" (", 2)[0]; // "400 points, N observations"
        var check = CliHarness.Run("check", yaml);
        Assert.True(check.Code == ExitCodes.Success, check.Err);
        Assert.Contains(counts, check.Out);

        var adjust = CliHarness.Run("adjust", yaml, "--date", "2026-12-01", "--quiet");
        Assert.True(adjust.Code == ExitCodes.Success, adjust.Err);
        Assert.Equal("", adjust.Err);
        // 400 points exceed the dense limit of 200 unknowns: the sparse engine ran and the report says so.
        Assert.Contains("sparse supernodal Cholesky", adjust.Out);

        // Same seed, same files.
        string again = Path.Combine(_tmp, $"again-{kind}.yaml");
        Assert.Equal(ExitCodes.Success,
            CliHarness.Run("simulate", "--kind", kind, "--points", "400", "--seed", "5", "--out", again).Code);
        Assert.Equal(File.ReadAllText(Path.Combine(_tmp, $"net-{kind}-observations.csv")).Split('\n', 2)[1],
                     File.ReadAllText(Path.Combine(_tmp, $"again-{kind}-observations.csv")).Split('\n', 2)[1]);
    }

    [Fact]
    public void RejectsAnUnknownKindWithInvalidInputCode()
    {
        var (code, _, stderr) =
            CliHarness.Run("simulate", "--kind", "spiral", "--points", "10", "--out", Path.Combine(_tmp, "x.yaml"));
        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Contains("--kind", stderr);
        Assert.False(File.Exists(Path.Combine(_tmp, "x.yaml")));
    }

    [Theory]
    [InlineData("brackenmoor", 3)]
    [InlineData("harrowfield", 1)]
    [InlineData("harrowgate", 1)]
    [InlineData("tarnholm", 1)]
    public void DrawsADemoScenarioThatAdjustsAndRepeatsForTheSameSeed(string scenario, int files)
    {
        string yaml = Path.Combine(_tmp, scenario + ".yaml");
        var (code, stdout, stderr) = CliHarness.Run("simulate", "--scenario", scenario, "--out", yaml);
        Assert.True(code == ExitCodes.Success, stderr);
        Assert.Contains($"({files} file(s))", stdout);
        Assert.Equal(files, Directory.GetFiles(_tmp).Length);
        string first = File.ReadAllText(yaml);
        Assert.Equal(ExitCodes.Success, CliHarness.Run("adjust", yaml, "--quiet", "--date", "2026-12-01").Code);
        string again = Path.Combine(_tmp, "again", scenario + ".yaml");
        Directory.CreateDirectory(Path.GetDirectoryName(again)!);
        Assert.Equal(ExitCodes.Success, CliHarness.Run("simulate", "--scenario", scenario, "--out", again).Code);
        Assert.Equal(first, File.ReadAllText(again));
        var (other, _, _) = CliHarness.Run("simulate", "--scenario", scenario, "--seed", "9", "--out", again);
        Assert.Equal(ExitCodes.Success, other);
        Assert.NotEqual(first, File.ReadAllText(again));
    }

    [Fact]
    public void TheTarnholmScenarioRewritesTheCommittedGridDemo()
    {
        string yaml = Path.Combine(_tmp, "tarnholm-grid.yaml");
        var (code, _, stderr) = CliHarness.Run("simulate", "--scenario", "tarnholm", "--out", yaml);
        Assert.True(code == ExitCodes.Success, stderr);
        Assert.Equal(File.ReadAllText(CliHarness.DataFile("tarnholm-grid.yaml")), File.ReadAllText(yaml));
    }

    [Fact]
    public void RejectsAnUnknownScenarioAndAScenarioWithPoints()
    {
        string x = Path.Combine(_tmp, "x.yaml");
        var (code, _, stderr) = CliHarness.Run("simulate", "--scenario", "moorside", "--out", x);
        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Contains("--scenario: 'moorside' is not a demo scenario: use brackenmoor", stderr);
        (code, _, stderr) = CliHarness.Run("simulate", "--scenario", "harrowgate", "--points", "9", "--out", x);
        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Contains("--scenario cannot be combined with --points", stderr);
        (code, _, stderr) = CliHarness.Run("simulate", "--out", x);
        Assert.Equal(ExitCodes.InvalidInput, code);
        Assert.Contains("--points is required (or give --scenario)", stderr);
        Assert.Empty(Directory.GetFiles(_tmp));
    }
}
