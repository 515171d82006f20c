using NetAdjust.Cli;

namespace NetAdjust.Cli.Tests;

/// <summary>The report and exchange outputs of <c>adjust</c>, end to end through <see cref="Program.Run"/>.</summary>
public sealed class ReportOutputTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("netadjust-cli-").FullName;

    public ReportOutputTests()
    {
        File.Copy(CliHarness.DataFile("brackenmoor.yaml"), Path.Combine(_dir, "brackenmoor.yaml"));
        File.Copy(CliHarness.DataFile("brackenmoor-levels.csv"), Path.Combine(_dir, "brackenmoor-levels.csv"));
    }

    public void Dispose()
    {
        try { Directory.Delete(_dir, recursive: true); } catch (IOException) { }
    }

    private string P(string name) => Path.Combine(_dir, name);

    private static readonly string[] Kinds = ["report", "json", "html", "svg", "csv", "landxml", "geojson"];

    private CliRun RunAll(string sub, string date)
    {
        Directory.CreateDirectory(P(sub));
        var args = new List<string> { "adjust", P("brackenmoor.yaml"), "--date", date };
        foreach (var k in Kinds) { args.Add("--" + k); args.Add(P(Path.Combine(sub, "out." + k))); }
        return CliHarness.Run([.. args]);
    }

    [Fact]
    public void WritesEveryOutputAndLeavesNoTemporaryFile()
    {
        // Byte-for-byte determinism is checked against committed golden files from a separate process
        // (GoldenOutputTests); here: every output is written and nothing else is left behind.
        Assert.Equal(ExitCodes.Success, RunAll("a", "2026-12-01").Code);
        foreach (var k in Kinds) Assert.True(new FileInfo(P($"a/out.{k}")).Length > 200, $"{k} output is too short");
        Assert.Equal(Kinds.Select(k => "out." + k).Order(StringComparer.Ordinal),
            Directory.GetFiles(P("a"), "*", SearchOption.AllDirectories).Select(Path.GetFileName)
                .Order(StringComparer.Ordinal));
    }

    [Fact]
    public void TheRunDateIsTheOnlyDifferenceBetweenTwoDates()
    {
        Assert.Equal(ExitCodes.Success, RunAll("a", "2026-12-01").Code);
        Assert.Equal(ExitCodes.Success, RunAll("b", "2027-03-09").Code);
        foreach (var k in Kinds)
        {
            string x = File.ReadAllText(P($"a/out.{k}")), y = File.ReadAllText(P($"b/out.{k}"));
            if (k == "svg" || k == "csv") { Assert.Equal(x, y); continue; } // no date in the plot or the CSV
            Assert.NotEqual(x, y);
            Assert.Equal(x.Replace("2026-12-01", "2027-03-09"), y);
        }
    }

    [Fact]
    public void UnwritableOutputPathGivesExitCode4AClearMessageAndNoFile()
    {
        string target = P("no-such-folder/sub/report.html");
        var r = CliHarness.Run("adjust", P("brackenmoor.yaml"), "--date", "2026-12-01", "--html", target);
        Assert.Equal(ExitCodes.OutputFailed, r.Code);
        Assert.Contains("no-such-folder/sub/report.html", r.Err);
        Assert.Contains("cannot write", r.Err);
        Assert.False(File.Exists(target));
        Assert.False(Directory.Exists(P("no-such-folder")));
    }

    [Fact]
    public void OutputPathThatIsAFolderFailsWithoutLeavingATemporaryFile()
    {
        Directory.CreateDirectory(P("taken"));
        var before = Directory.GetFileSystemEntries(_dir).Order().ToArray();
        var r = CliHarness.Run("adjust", P("brackenmoor.yaml"), "--date", "2026-12-01", "--csv", P("taken"));
        Assert.Equal(ExitCodes.OutputFailed, r.Code);
        Assert.Contains("taken", r.Err);
        Assert.Equal(before, Directory.GetFileSystemEntries(_dir).Order().ToArray()); // no partial or temporary file
        Assert.Empty(Directory.GetFileSystemEntries(P("taken")));
    }

    [Theory]
    [InlineData("--html", "brackenmoor.yaml")]
    [InlineData("--landxml", "brackenmoor-levels.csv")]
    [InlineData("--geojson", "brackenmoor.yaml")]
    public void OutputEqualToAnInputIsRefusedAndNothingIsWritten(string option, string input)
    {
        File.WriteAllText(P("old.csv"), "OLD");
        string yaml = File.ReadAllText(P("brackenmoor.yaml")), levels = File.ReadAllText(P("brackenmoor-levels.csv"));
        var r = CliHarness.Run("adjust", P("brackenmoor.yaml"), "--date", "2026-12-01", "--csv", P("old.csv"), option,
            P(input));
        Assert.Equal(ExitCodes.OutputFailed, r.Code);
        Assert.Contains("refusing to overwrite an input file", r.Err);
        Assert.Equal(yaml, File.ReadAllText(P("brackenmoor.yaml")));
        Assert.Equal(levels, File.ReadAllText(P("brackenmoor-levels.csv")));
        Assert.Equal("OLD", File.ReadAllText(P("old.csv"))); // the plan is checked before anything is written
    }
}
