namespace NetAdjust.Cli.Tests.Commands;

/// <summary>
/// Runs every case of the bad-input corpus (tests/NetAdjust.Cli.Tests/BadInput, listed in cases.txt with its
/// expected exit code and the file and line its message must name) through <c>netadjust check</c>, in process.
/// </summary>
public sealed class BadInputCorpusTests
{
    private static string Folder => Path.Combine(CliHarness.RepoRoot, "tests", "NetAdjust.Cli.Tests", "BadInput");

    public static TheoryData<string, int, string> Cases()
    {
        var data = new TheoryData<string, int, string>();
        foreach (var line in File.ReadAllLines(Path.Combine(Folder, "cases.txt")))
        {
            if (line.Length == 0 || line.StartsWith('#')) continue;
            var f = line.Split(' ', StringSplitOptions.RemoveEmptyEntries);
            data.Add(f[0], int.Parse(f[1], System.Globalization.CultureInfo.InvariantCulture), f[2]);
        }
        return data;
    }

    [Fact]
    public void EveryCorpusFileIsListedOnce()
    {
        var listed = Cases().Select(c => (string)c[0]).ToList();
        Assert.Equal(listed.Count, listed.Distinct().Count());
        var files = Directory.GetFiles(Folder, "*.yaml").Select(Path.GetFileName).ToList();
        Assert.Equal(files.Order(StringComparer.Ordinal), listed.Order(StringComparer.Ordinal));
        Assert.True(listed.Count >= 30);
    }

    [Theory]
    [MemberData(nameof(Cases))]
    public void CorpusCaseGivesItsExitCodeAndLine(string file, int exitCode, string where)
    {
        string path = Path.Combine(Folder, file);
        var before = FuzzTests.Snapshot(Folder);
        var (code, _, err) = CliHarness.Run("check", path);
        Assert.True(code == exitCode, $"{file}: exit {code}, expected {exitCode}: {err}");
        if (where != "-") Assert.Contains(where, err);
        Assert.DoesNotContain("   at ", err);
        Assert.DoesNotContain("internal error", err);
        Assert.Equal(before, FuzzTests.Snapshot(Folder));
    }
}
