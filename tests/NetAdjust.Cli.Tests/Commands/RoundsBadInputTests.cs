namespace NetAdjust.Cli.Tests.Commands;

/// <summary>Rounds in both faces refused before any adjustment runs: exit code 2 (docs/cli.md) with the file,
/// the line and the reading in the message, and no output written.</summary>
public sealed class RoundsBadInputTests : IDisposable
{
    private readonly string _tmp = Directory.CreateTempSubdirectory("netadjust-rounds-").FullName;

    public void Dispose() => Directory.Delete(_tmp, recursive: true);

    private static string Corpus(string name) =>
        Path.Combine(CliHarness.RepoRoot, "tests", "NetAdjust.Cli.Tests", "BadInput", name);

    [Theory]
    // Face right of C reads 180° + 1′32″ from face left: beyond the default tolerance of 60″.
    [InlineData("rounds-face-disagreement.yaml", 15, "reading of C in set 1 of the setup at A", "92.0″")]
    // A raw face-left zenith angle of 190° (face left lies between 0 and 180°).
    [InlineData("rounds-zenith-outside.yaml", 18, "reading of C in set 2 of the setup at A", "between 0 and 180°")]
    public void ARefusedReadingIsNamedWithFileLineAndItemAndNothingIsAdjusted(string file, int line, string item,
        string problem)
    {
        string json = Path.Combine(_tmp, "out.json");
        var (code, _, err) = CliHarness.Run("adjust", Corpus(file), "--json", json);
        Assert.Equal(2, code);
        Assert.Contains($"{file}:{line}", err);
        Assert.Contains(item, err);
        Assert.Contains(problem, err);
        Assert.False(File.Exists(json));
    }
}
