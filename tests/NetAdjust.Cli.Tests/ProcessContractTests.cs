namespace NetAdjust.Cli.Tests;

/// <summary>
/// The command's contract for bad input and unwritable outputs, checked on a separate process of the built command
/// (and, in .ci/check-packages, on the installed native tool through NETADJUST_COMMAND): the exit code, a message that
/// names the file, line and item, and no output file left behind. The same cases run in process in CliTests.
/// </summary>
public sealed class ProcessContractTests : IDisposable
{
    private readonly string _tmp = Directory.CreateTempSubdirectory("netadjust-process-").FullName;

    public void Dispose() => Directory.Delete(_tmp, recursive: true);

    [Fact]
    public void ABrokenProjectFileGivesExitCode2NamingFileLineAndItemAndWritesNothing()
    {
        File.WriteAllText(Path.Combine(_tmp, "broken.yaml"),
            "default_sd: {direction: 2}\npoints:\n  - {id: A, e: 0, n: 0, fix: en}\n  - {id: B, e: 9, n: " +
            "9}\nsetups:\n  - at: A\n    directions:\n      - {to: B, value: 12-75-00}\n");
        var run = CliHarness.RunProcess(_tmp, "adjust", "broken.yaml", "--json", "r.json", "--report", "r.txt");
        Assert.Equal(ExitCodes.InvalidInput, run.Code);
        Assert.Contains("broken.yaml:8: direction A→B: minutes must be below 60 in '12-75-00'", run.Err);
        Assert.Equal(["broken.yaml"], Directory.GetFiles(_tmp).Select(Path.GetFileName));
    }

    [Fact]
    public void AnUnwritableOutputGivesExitCode4NamingThePathAndLeavesNoFile()
    {
        string demo = CliHarness.DataFile("brackenmoor.yaml");
        var run = CliHarness.RunProcess(_tmp, "adjust", demo, "--date", "2026-12-01", "--quiet",
            "--json", "ok.json", "--html", "no-such-folder/report.html");
        Assert.Equal(ExitCodes.OutputFailed, run.Code);
        Assert.Contains("no-such-folder/report.html", run.Err);
        Assert.Empty(Directory.GetFileSystemEntries(_tmp));
    }
}
